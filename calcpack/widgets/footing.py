"""The footing panel: a pad footing under a post in its inputs file, its soil pressure and
concrete checks live (see :mod:`calcpack.inputs.footing`), on the shared panel machinery."""

from __future__ import annotations

from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.inputs.footing import (
    SHAPES,
    SUPPORTS,
    FootingOutcome,
    evaluate_footing,
    footing_inputs,
)
from calcpack.widgets.panel import InputsPanel, checks_outputs

__all__ = ["FootingPanel", "footing_panel"]


class FootingPanel(InputsPanel):
    """Edit a pad footing's inputs file: size, post, soil, concrete and loads by case."""

    kind: ClassVar[str] = "Footing panel"
    css_class: ClassVar[str] = "cp-footing-panel"
    output_names: ClassVar[tuple[str, ...]] = ("bars", "results")

    def form(self) -> list[ipw.Widget]:
        f, c = self.data["footing"], self.data["column"]
        parts: list[ipw.Widget] = [
            ipw.HTML("<b>Footing</b>"),
            self.choice("footing.shape", "Shape", SHAPES),
        ]
        for k, what in (("B", "B (width)"), ("L", "L (length)"), ("h", "h (thickness)"),
                        ("soil_cover", "soil cover")):  # fmt: skip
            if k in f:
                parts.append(self.quantity(f"footing.{k}", what))
        parts += [ipw.HTML("<b>Post or column</b>"), self.choice("column.support", "On", SUPPORTS)]
        for k in ("c1", "c2", "plate1", "plate2"):
            if k in c:
                parts.append(self.quantity(f"column.{k}", k))
        parts += [
            ipw.HTML("<b>Soil</b> (from the geotechnical report)"),
            self.quantity("soil.q_allow", "q_allow"),
            self.text("soil.source", "source", width="260px"),
            ipw.HTML("<b>Concrete</b>"),
            self.quantity("concrete.f_c", "f'c"),
            self.text("concrete.bar", "bar size"),
            ipw.HTML("<b>Loads</b> (by case, unfactored)"),
        ]
        for i, row in enumerate(self.data.get("loads", []), start=1):
            for k in ("P", "Vx", "Vy", "Mx", "My"):
                if k in row:
                    parts.append(self.quantity(f"loads[{i}].{k}", f"{row.get('case', i)}: {k}"))
        return parts

    def evaluate(self, data: dict[str, Any]) -> FootingOutcome:
        return evaluate_footing(footing_inputs(data, path=self.path))

    def render(self, outcome: FootingOutcome) -> dict[str, str]:
        return checks_outputs(outcome.checks)


def footing_panel(path: str | Path) -> FootingPanel:
    """Show the footing panel for the inputs file ``path`` (nothing is shown during a build)."""
    return FootingPanel(path)
