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
from calcpack.widgets.panel import InputsPanel, checks_outputs, utilisation_bars_svg

__all__ = ["MemberPanel", "member_panel", "sizing_table_html", "utilisation_bars_svg"]


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
        return checks_outputs(outcome.checks)

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
        names = [t.name for t in found.passing]
        self.pick.options = names
        self.pick.value = names[0] if names else None  # the lightest, ready to use
        self.use_button.disabled = not names
        return found

    def use(self, shape: str | None) -> None:
        """Put ``shape`` in the inputs file (as if typed in the shape field)."""
        if shape:
            self.set("member.shape", shape)


def member_panel(path: str | Path) -> MemberPanel:
    """Show the member panel for the inputs file ``path`` (nothing is shown during a build)."""
    return MemberPanel(path)
