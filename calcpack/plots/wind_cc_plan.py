"""Zone plan of components and cladding on a sloped roof (matplotlib -> SVG), reading the
result only: each zone's regions shaded by zone family (corner, edge, interior) and labelled
with the zone and its net suction at the effective wind area.
"""

from __future__ import annotations

from typing import Any

from calcpack.plots.drawing import frame, sketch_axes
from calcpack.plots.labels import number_label, quantity_label, svg_text, unit_label

__all__ = ["cc_plan_figure", "cc_plan_svg"]

# shading by the zone's number: interior light, edges middle, corners dark (plan reading aid)
_SHADE = {"1": "#f7f7f7", "2": "#fdd0a2", "3": "#f16913"}


def cc_plan_figure(result: Any, width_in: float = 6.0) -> Any:
    """The zone plan as a matplotlib Figure (Agg canvas)."""
    from matplotlib.patches import Polygon

    b = result.building
    lu = result.a.units
    L = float(b.L.to(lu).magnitude)
    B = float(b.B.to(lu).magnitude)
    unit = (
        "psf" if unit_label(result.zones[next(iter(result.zones))].p_neg.units) == "psf" else None
    )
    fig, ax = sketch_axes(width_in, width_in * B / L + 1.0)
    for zone, poly in result.regions:
        pts = [(float(x.to(lu).magnitude), float(y.to(lu).magnitude)) for x, y in poly]
        ax.add_patch(
            Polygon(pts, closed=True, facecolor=_SHADE.get(zone[0], "#ffffff"),
                    edgecolor="#636363", linewidth=0.6)
        )  # fmt: skip
        xs, ys = zip(*pts, strict=True)
        cx, cy = sum(xs) / len(xs), sum(ys) / len(ys)
        p = result.zones[zone].p_neg
        p = p if unit is None else p.to(unit)
        ax.text(
            cx,
            cy,
            f"{zone}\n{number_label(p.magnitude, signed=True)}",
            ha="center",
            va="center",
            fontsize=5.5,
        )
    ax.plot([0, L, L, 0, 0], [0, 0, B, B, 0], color="black", linewidth=1.2)
    if b.roof != "monoslope":
        ax.plot([0, L], [B / 2, B / 2], color="grey", linewidth=0.6, linestyle="--")
    else:
        ax.text(L + 0.02 * L, B, "high eave", fontsize=6, va="center")
        ax.text(L + 0.02 * L, 0.0, "low eave", fontsize=6, va="center")
    a = float(result.a.magnitude)
    sizes = f"L = {quantity_label(L, lu)}, a = {quantity_label(a, lu)}"
    ax.text(L / 2, -0.08 * B, sizes, ha="center", va="top", fontsize=7)
    ax.text(-0.03 * L, B / 2, f"B = {quantity_label(B, lu)}", ha="right", va="center", fontsize=7,
            rotation=90)  # fmt: skip
    pu = unit_label(unit or result.zones[next(iter(result.zones))].p_neg.units)
    title = (
        f"C&C roof zones, {b.roof} roof θ = {number_label(b.theta_deg)}°: net suction at "
        f"A = {quantity_label(result.area.magnitude, result.area.units)} ({pu})"
    )
    frame(ax, title, x=(-0.1 * L, 1.15 * L), y=(-0.2 * B, 1.05 * B))
    return fig


def cc_plan_svg(result: Any, settings: Any = None, **options: Any) -> str:
    """Drawing ``"wind-cc-plan"``: the C&C zone plan of a sloped roof, as SVG."""
    del settings
    return svg_text(cc_plan_figure(result, **options))
