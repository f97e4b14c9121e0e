"""The site-loads panel: ground snow, wind speed, exposure and the roof in the site-loads sheet's
inputs file, with the roof load cases redrawn live (see :mod:`calcpack.inputs.site_loads`), on
the shared panel machinery."""

from __future__ import annotations

from html import escape
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.inputs.site_loads import SiteLoads, site_loads_inputs
from calcpack.plots.roof_loads import roof_loads_svg
from calcpack.widgets.panel import InputsPanel

__all__ = ["SiteLoadsPanel", "site_loads_panel"]


def _cases_html(loads: SiteLoads) -> str:
    rows = []
    for case, a, b, area, line in loads.line_load_rows():
        rows.append(
            f"<tr><td>{escape(str(case))}</td><td>{a:.3g~P} to {b:.3g~P}</td>"
            f'<td class="cp-out" data-out="{escape(str(case))}" '
            f'data-value="{float(area.magnitude)!r}">{area:.3g~P}</td><td>{line:.3g~P}</td></tr>'
        )
    return (
        '<table class="cp-panel-results" style="font-size:12px"><tr><th>Case</th>'
        "<th>Across the frame</th><th>Area load</th><th>On a member</th></tr>"
        + "".join(rows)
        + "</table>"
    )


class SiteLoadsPanel(InputsPanel):
    """Edit the site values of a site-loads sheet and watch the roof load cases move."""

    kind: ClassVar[str] = "Site loads panel"
    css_class: ClassVar[str] = "cp-site-loads-panel"
    output_names: ClassVar[tuple[str, ...]] = ("sketch", "results")

    def form(self) -> list[ipw.Widget]:
        parts: list[ipw.Widget] = [ipw.HTML("<b>Roof</b>")]
        roof = self.data.get("roof", {})
        for k in ("slope", "width", "length", "height", "spacing"):
            if k in roof:
                parts.append(self.quantity(f"roof.{k}", k))
        for table, title in (("snow", "Snow"), ("wind", "Wind")):
            values = self.data.get(table, {})
            if not values:
                continue
            parts.append(ipw.HTML(f"<b>{title}</b>"))
            for k, v in values.items():
                key = f"{table}.{k}"
                if hasattr(v, "units"):
                    parts.append(self.quantity(key, k))
                elif isinstance(v, str):
                    parts.append(self.text(key, k, width="260px" if "source" in k else "170px"))
                elif isinstance(v, int | float) and not isinstance(v, bool):
                    parts.append(self.number(key, k))
        return parts

    def evaluate(self, data: dict[str, Any]) -> SiteLoads:
        return site_loads_inputs(data, path=self.path)

    def render(self, outcome: SiteLoads) -> dict[str, str]:
        return {"sketch": roof_loads_svg(outcome.profiles), "results": _cases_html(outcome)}


def site_loads_panel(path: str | Path) -> SiteLoadsPanel:
    """Show the site-loads panel for ``path`` (nothing is shown during a build)."""
    return SiteLoadsPanel(path)
