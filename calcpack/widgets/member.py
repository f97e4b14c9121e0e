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

from calcpack.inputs.member import (
    METHODS,
    MemberOutcome,
    evaluate_member,
    lightest_member,
    member_inputs,
)
from calcpack.sizing import SizingResult
from calcpack.sizing.search import Order
from calcpack.units import Quantity
from calcpack.widgets.panel import InputsPanel, checks_outputs, utilisation_bars_svg
from calcpack.widgets.search import SearchControl, sizing_table_html

__all__ = ["MemberPanel", "member_panel", "sizing_table_html", "utilisation_bars_svg"]


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
        self.searcher = SearchControl(self._search, self.use, what="shape")
        return [self.searcher.widget]

    def _search(self, count: int, order: Order, max_depth: Quantity | None) -> SizingResult:
        case = member_inputs(self.data, path=self.path)
        return lightest_member(case, count=count, order=order, max_depth=max_depth)

    def search(self, count: int = 5) -> SizingResult | None:
        """Rank the lightest shapes of the member's family that pass every combination."""
        return self.searcher.run(count)

    @property
    def pick(self) -> ipw.Dropdown:
        return self.searcher.pick

    @property
    def ranking(self) -> ipw.HTML:
        return self.searcher.ranking

    def use(self, shape: str | None) -> None:
        """Put ``shape`` in the inputs file (as if typed in the shape field)."""
        if shape:
            self.set("member.shape", shape)


def member_panel(path: str | Path) -> MemberPanel:
    """Show the member panel for the inputs file ``path`` (nothing is shown during a build)."""
    return MemberPanel(path)
