"""The member panel: a steel post or column in its inputs file, its checks by combination as bars
and a table, and a search for the lightest shape of its family that passes.

Built on :class:`calcpack.widgets.panel.InputsPanel`; computation in
:mod:`calcpack.inputs.member` (the sheet's calc cells call the same functions).
"""

from __future__ import annotations

from html import escape
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.errors import CalcpackError
from calcpack.inputs.member import (
    METHODS,
    MemberOutcome,
    evaluate_member,
    lightest_member,
    member_inputs,
)
from calcpack.sizing import SizingResult
from calcpack.widgets.panel import InputsPanel

__all__ = ["MemberPanel", "member_panel", "sizing_table_html", "utilisation_bars_svg"]

BAR_W = 420
ROW_H = 22


def utilisation_bars_svg(rows: list[tuple[str, float, str]]) -> str:
    """Horizontal bars, one per check: (label, utilisation, verdict), the 1.00 line drawn.

    The bar's length is the utilisation (to 1.5, longer bars end in an arrow); the verdict is
    written in words beside the number, so the drawing reads the same in black and white.
    """
    left, right = 150, 110
    span = BAR_W - left - right
    h = ROW_H * len(rows) + 24
    x1 = left + span / 1.5
    parts = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagram cp-bars" width="{BAR_W}" '
        f'height="{h}" viewBox="0 0 {BAR_W} {h}" font-family="DejaVu Sans, sans-serif" '
        'font-size="11">',
        f'<line x1="{x1:.1f}" y1="4" x2="{x1:.1f}" y2="{h - 14}" stroke="#222" '
        'stroke-dasharray="3 2"/>',
        f'<text x="{x1:.1f}" y="{h - 3}" text-anchor="middle">1.00</text>',
    ]
    for i, (name, u, verdict) in enumerate(rows):
        y = 6 + i * ROW_H
        w = span * min(u, 1.5) / 1.5
        fill = "#9aa7b5" if u <= 1.0 else "#3b3b3b"
        parts.append(
            f'<text x="{left - 6}" y="{y + 12}" text-anchor="end">{escape(name)}</text>'
            f'<rect class="cp-bar" data-u="{u!r}" x="{left}" y="{y}" width="{w:.1f}" height="14" '
            f'fill="{fill}"/>'
            f'<text x="{left + span + 6}" y="{y + 12}">{u:.2f} {escape(verdict)}</text>'
        )
    parts.append("</svg>")
    return "".join(parts)


def _results_html(outcome: MemberOutcome) -> str:
    rows = []
    for mc in outcome.checks:
        for r in mc.results:
            shown = "—" if r.utilisation is None else f"{r.utilisation:.3f}"
            rows.append(
                f"<tr><td>{escape(r.combination or '')}</td><td>{escape(r.name)}</td>"
                f'<td class="cp-out" data-out="{escape(r.name)}|{escape(r.combination or "")}" '
                f'data-value="{r.utilisation!r}">{shown}</td><td>{escape(r.verdict)}</td>'
                f"<td>{escape(r.clause)}</td></tr>"
            )
    u, name, clause, combo = outcome.governing
    head = (
        f'<p class="cp-governing" data-value="{u!r}">Governing: {escape(name)}, {u:.3f} '
        f"({escape(clause)}; {escape(combo)})</p>"
    )
    return (
        head + '<table class="cp-panel-results" style="border-collapse:collapse;font-size:12px">'
        "<tr><th>Combination</th><th>Check</th><th>Utilisation</th><th>Verdict</th>"
        "<th>Clause</th></tr>" + "".join(rows) + "</table>"
    )


def sizing_table_html(found: SizingResult) -> str:
    """The search's ranking: passing shapes, the next lighter one and why it fails."""
    rows = []
    for t in found.passing:
        rows.append(
            f'<tr class="cp-candidate" data-name="{escape(t.name)}"><td>{escape(t.name)}</td>'
            f"<td>{t.weight:.3g~P}</td><td>{t.utilisation:.3f}</td>"
            f"<td>{escape(t.governing)}</td></tr>"
        )
    out = (
        '<table class="cp-panel-results" style="font-size:12px"><tr><th>Shape</th>'
        "<th>Weight</th><th>Governing utilisation</th><th>Governing check</th></tr>"
        + "".join(rows)
        + "</table>"
    )
    if found.next_lighter is not None:
        t = found.next_lighter
        out += f"<p>Next lighter: {escape(t.name)} {escape(t.verdict)} ({escape(t.governing)}).</p>"
    if not found.passing:
        near = found.closest
        out += (
            "<p class='cp-error'>No shape of the family passes every check"
            + (f"; the closest is {escape(near.name)} ({escape(near.governing)})." if near else ".")
            + "</p>"
        )
    return out


class MemberPanel(InputsPanel):
    """Edit a steel post or column's inputs file (see :mod:`calcpack.inputs.member`)."""

    kind: ClassVar[str] = "Member panel"
    css_class: ClassVar[str] = "cp-member-panel"
    output_names: ClassVar[tuple[str, ...]] = ("bars", "results")

    def form(self) -> list[ipw.Widget]:
        parts: list[ipw.Widget] = [
            ipw.HTML("<b>Member</b>"),
            self.text("member.shape", "Shape (AISC designation)"),
            self.text("member.grade", "Grade"),
            self.quantity("member.Fy", "F_y (yield stress)"),
            self.choice("member.method", "Method", METHODS),
        ]
        m = self.data["member"]
        for k, what in (("Lcx", "L_cx (K·L about x)"), ("Lcy", "L_cy (K·L about y)"),
                        ("Lb", "L_b (unbraced, flexure)")):  # fmt: skip
            if k in m:
                parts.append(self.quantity(f"member.{k}", what))
        if "Cb" in m:
            parts.append(self.number("member.Cb", "C_b"))
        parts.append(ipw.HTML("<b>Required strengths</b> (by combination)"))
        for i, row in enumerate(self.data.get("forces", []), start=1):
            parts.append(ipw.HTML(f"<i>{escape(str(row.get('combination', i)))}</i>"))
            for k in ("P", "Mx", "My", "Vx", "Vy"):
                if k in row:
                    parts.append(self.quantity(f"forces[{i}].{k}", f"    {k}"))
        return parts

    def evaluate(self, data: dict[str, Any]) -> MemberOutcome:
        return evaluate_member(member_inputs(data, path=self.path))

    def render(self, outcome: MemberOutcome) -> dict[str, str]:
        worst: dict[str, tuple[float, str]] = {}
        for mc in outcome.checks:
            for r in mc.results:
                if r.utilisation is not None and r.utilisation > worst.get(r.name, (-1.0, ""))[0]:
                    worst[r.name] = (float(r.utilisation), r.verdict)
        bars = [(name, u, v) for name, (u, v) in worst.items()]
        return {"bars": utilisation_bars_svg(bars), "results": _results_html(outcome)}

    # -- the search --------------------------------------------------------------------------
    def extra(self) -> list[ipw.Widget]:
        self.search_button = ipw.Button(
            description="Lightest that passes", layout=ipw.Layout(width="170px")
        )
        self.search_button.add_class("cp-search")
        self.search_button.on_click(lambda _b: self.search())
        self.pick = ipw.Dropdown(options=[], layout=ipw.Layout(width="170px"))
        self.pick.add_class("cp-search-pick")
        self.use_button = ipw.Button(description="Use this shape", disabled=True)
        self.use_button.add_class("cp-search-use")
        self.use_button.on_click(lambda _b: self.use(self.pick.value))
        self.ranking = ipw.HTML()
        self.ranking.add_class("cp-search-results")
        self.found: SizingResult | None = None
        return [
            ipw.HBox([self.search_button, self.pick, self.use_button]),
            self.ranking,
        ]

    def search(self, count: int = 5) -> SizingResult | None:
        """Rank the lightest shapes of the member's family that pass every combination."""
        try:
            case = member_inputs(self.data, path=self.path)
            found = lightest_member(case, count=count)
        except CalcpackError as exc:
            self.ranking.value = f'<span class="cp-error">{escape(str(exc))}</span>'
            return None
        self.found = found
        self.ranking.value = sizing_table_html(found)
        self.pick.options = [t.name for t in found.passing]
        self.use_button.disabled = not found.passing
        return found

    def use(self, shape: str | None) -> None:
        """Put ``shape`` in the inputs file (as if typed in the shape field)."""
        if shape:
            self.set("member.shape", shape)


def member_panel(path: str | Path) -> MemberPanel:
    """Show the member panel for the inputs file ``path`` (nothing is shown during a build)."""
    return MemberPanel(path)
