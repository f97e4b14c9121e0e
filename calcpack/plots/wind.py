"""Zone plan of the ASCE 7-16 envelope procedure (matplotlib -> SVG), reading the result only.

The plan shows the building (B across the wind for load case A, L along the ridge), the end
zones of width 2a at the windward corner, the zone numbers of Figure 28.3-1 and each zone's
pressure with +GCpi.
"""

from __future__ import annotations

from typing import Any

from calcpack.plots.drawing import Drawing, frame, sketch_axes
from calcpack.plots.labels import number_label, quantity_label, unit_label

__all__ = ["WindZonePlan"]


class WindZonePlan(Drawing):
    """Plan of the envelope zones for one load case (``"A"`` or ``"B"``)."""

    def __init__(
        self, result: Any, B: Any, L: Any, *, case: str = "A", width_in: float = 6.0
    ) -> None:
        self.result = result
        self.case = case
        unit = result.a.units
        self.B = float(B.to(unit).magnitude)
        self.L = float(L.to(unit).magnitude)
        self.a = float(result.a.magnitude)
        self.unit = unit
        self.width_in = width_in

    def _label(self, zone: str) -> str:
        p = self.result.pressures.get((self.case, zone, "+GCpi"))
        return zone if p is None else f"{zone}\n{number_label(p.magnitude, signed=True)}"

    def figure(self) -> Any:
        """The plan as a matplotlib Figure (Agg canvas)."""
        from matplotlib.patches import Rectangle

        B, L, a2 = self.B, self.L, 2 * self.a
        fig, ax = sketch_axes(self.width_in, self.width_in * max(B / L, 0.35) + 0.8)
        ax.add_patch(Rectangle((0, 0), L, B, fill=False, linewidth=1.5))
        ax.add_patch(Rectangle((0, 0), a2, B, color="#fdd0a2", alpha=0.8))
        ax.plot([0, L], [B / 2, B / 2], color="grey", linewidth=0.8, linestyle="-")
        # the roof zones are the same cells in both load cases; the wall zones differ
        cells = [
            ("2E", a2 / 2, 0.75 * B),
            ("3E", a2 / 2, 0.25 * B),
            ("2", (a2 + L) / 2, 0.75 * B),
            ("3", (a2 + L) / 2, 0.25 * B),
        ]
        if self.case == "A":
            ax.annotate(
                "", xy=(L / 2, B), xytext=(L / 2, B + 0.25 * B), arrowprops={"arrowstyle": "->"}
            )
            ax.text(L / 2, B + 0.28 * B, "wind (load case A)", ha="center", fontsize=8)
            walls = [
                ("1E", a2 / 2, B + 0.05 * B),
                ("1", (a2 + L) / 2, B + 0.05 * B),
                ("4E", a2 / 2, -0.12 * B),
                ("4", (a2 + L) / 2, -0.12 * B),
            ]
        else:
            ax.annotate(
                "", xy=(0, B / 2), xytext=(-0.2 * L, B / 2), arrowprops={"arrowstyle": "->"}
            )
            ax.text(-0.2 * L, B / 2 + 0.05 * B, "wind (case B)", fontsize=8)
            walls = [("5E", -0.06 * L, 0.2 * B), ("6E", L + 0.06 * L, 0.2 * B)]
        for zone, x, y in cells + walls:
            ax.text(x, y, self._label(zone), ha="center", va="center", fontsize=7)
        ax.text(a2 / 2, -0.3 * B, f"2a = {quantity_label(a2, self.unit)}", ha="center", fontsize=7)
        title = (
            f"Envelope zones, load case {self.case} (pressures with +GCpi, "
            f"{unit_label(self.result.qh.units)})"
        )
        frame(ax, title, x=(-0.3 * L, 1.15 * L), y=(-0.4 * B, 1.4 * B), fontsize=9)
        return fig
