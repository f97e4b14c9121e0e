"""The site-loads panel: ground snow, wind speed, exposure and the roof in the site-loads sheet's
inputs file, with the roof load cases redrawn live (see :mod:`calcpack.inputs.site_loads`), on
the shared panel machinery."""

from __future__ import annotations

from html import escape
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.inputs.site_loads import SiteLoads, site_loads_inputs
from calcpack.widgets.panel import InputsPanel

__all__ = ["SiteLoadsPanel", "roof_cases_svg", "site_loads_panel"]


def roof_cases_svg(loads: SiteLoads, width: int = 460) -> str:
    """A compact drawing for the panel (the sheet draws the full figure): one strip per load
    case across the frame, each piece's height proportional to its area load, labelled with its
    value: loads toward the roof (snow, wind pressure) above the line, suction below."""
    profiles = loads.profiles
    if not profiles:
        return ""
    peak = max(abs(float(v.to("kN/m^2").magnitude)) for p in profiles for v in p.values) or 1.0
    left, right, row = 150, 10, 46
    span = width - left - right
    h = row * len(profiles) + 8
    total = float((profiles[0].breaks[-1] - profiles[0].breaks[0]).to("m").magnitude) or 1.0
    out = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagram" data-diagram="roof cases" '
        f'width="{width}" height="{h}" viewBox="0 0 {width} {h}" '
        'font-family="DejaVu Sans, sans-serif" font-size="10">'
    ]
    for i, p in enumerate(profiles):
        base = 4 + i * row + row / 2
        out.append(
            f'<text x="{left - 6}" y="{base + 3:.1f}" text-anchor="end">{escape(p.case)}</text>'
            f'<line x1="{left}" y1="{base:.1f}" x2="{left + span}" y2="{base:.1f}" '
            'stroke="#222"/>'
        )
        x0 = p.breaks[0]
        for a, b, v in zip(p.breaks[:-1], p.breaks[1:], p.values, strict=True):
            xa = left + span * float((a - x0).to("m").magnitude) / total
            xb = left + span * float((b - x0).to("m").magnitude) / total
            q = float(v.to("kN/m^2").magnitude)
            hh = (row / 2 - 8) * abs(q) / peak
            y = base - hh if q >= 0 else base
            out.append(
                f'<rect x="{xa:.1f}" y="{y:.1f}" width="{max(xb - xa, 0.5):.1f}" '
                f'height="{hh:.1f}" fill="#c9d3dd" stroke="#234" stroke-width="0.6"/>'
                f'<text x="{(xa + xb) / 2:.1f}" y="{base + (10 if q >= 0 else -3):.1f}" '
                f'text-anchor="middle">{v:.3g~P}</text>'
            )
    out.append("</svg>")
    return "".join(out)


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
        return {"sketch": roof_cases_svg(outcome), "results": _cases_html(outcome)}


def site_loads_panel(path: str | Path) -> SiteLoadsPanel:
    """Show the site-loads panel for ``path`` (nothing is shown during a build)."""
    return SiteLoadsPanel(path)
