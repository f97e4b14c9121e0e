"""Elevation of a building under wind by the directional procedure (matplotlib -> SVG), reading
the result only: the windward wall's q_z profile as stepped pressure bands up to the mean roof
height, the leeward wall's uniform suction, each labelled with its pressure (with +GCpi).
"""

from __future__ import annotations

import math
from typing import Any

from calcpack.plots.drawing import frame, sketch_axes
from calcpack.plots.labels import number_label, quantity_label, svg_text, unit_label

__all__ = ["elevation_figure", "elevation_svg"]


def elevation_figure(result: Any, width_in: float = 6.0) -> Any:
    """The elevation as a matplotlib Figure (Agg canvas)."""
    from matplotlib.patches import Polygon, Rectangle

    b = result.building
    bands = result.windward_profile
    lu = bands[-1].top.units
    unit = result.qh.units
    h = float(b.h.to(lu).magnitude)
    L = float(b.L.to(lu).magnitude)
    th = math.radians(float(b.roof_slope.to("deg").magnitude))
    if b.direction == "normal to ridge" and b.roof in ("gable", "hip"):
        rise = L / 2 * math.tan(th)
        roof = [(0.0, h - rise / 2), (L / 2, h + rise / 2), (L, h - rise / 2)]
    elif b.direction == "normal to ridge" and b.roof == "monoslope":
        rise = L * math.tan(th)
        low, high = (0.0, L) if b.windward_eave == "low" else (L, 0.0)
        roof = sorted([(low, h - rise / 2), (high, h + rise / 2)])
    else:
        roof = [(0.0, h), (L, h)]
    if min(y for _, y in roof) <= 0.0:
        roof = [(0.0, h), (L, h)]
    leeward = result.surface("leeward wall").p[0]
    scale_p = max(
        [abs(float(x.p_pos_gcpi.to(unit).magnitude)) for x in bands]
        + [abs(float(leeward.to(unit).magnitude)), 1e-9]
    )
    span = 0.35 * max(L, h)
    k = span / scale_p

    top = max(y for _, y in roof)
    fig, ax = sketch_axes(width_in, width_in * (top + 0.2 * top) / (L + 2.6 * span) + 0.9)
    outline = [(0.0, 0.0), *roof, (L, 0.0)]
    ax.add_patch(Polygon(outline, closed=True, fill=False, linewidth=1.5))
    ax.plot([-1.3 * span, L + 1.3 * span], [0, 0], color="grey", linewidth=0.8)
    for band in bands:
        z0 = float(band.bottom.to(lu).magnitude)
        z1 = float(band.top.to(lu).magnitude)
        p = float(band.p_pos_gcpi.to(unit).magnitude)
        w = abs(p) * k
        ax.add_patch(
            Rectangle((-w, z0), w, z1 - z0, facecolor="#fdae6b", edgecolor="#a63603", lw=0.6)
        )
        ax.text(
            -w - 0.02 * span,
            (z0 + z1) / 2,
            number_label(p, signed=True),
            ha="right",
            va="center",
            fontsize=6,
        )
    pl = float(leeward.to(unit).magnitude)
    wl = abs(pl) * k
    ax.add_patch(
        Rectangle((L, 0.0), wl, roof[-1][1], facecolor="#9ecae1", edgecolor="#08519c", lw=0.6)
    )
    ax.text(
        L + wl + 0.02 * span,
        roof[-1][1] / 2,
        number_label(pl, signed=True),
        va="center",
        fontsize=6,
    )
    ax.annotate(
        "", xy=(-0.1 * span, top * 1.12), xytext=(-1.0 * span, top * 1.12),
        arrowprops={"arrowstyle": "->"},
    )  # fmt: skip
    ax.text(-1.0 * span, top * 1.16, "wind", fontsize=8)
    ax.text(L / 2, -0.08 * top, f"L = {quantity_label(L, lu)}", ha="center", va="top", fontsize=7)
    ax.plot([-0.05 * span, -0.05 * span], [0, h], color="grey", lw=0.5, ls=":")
    ax.text(L / 2, h, f"h = {quantity_label(h, lu)}", ha="center", va="bottom", fontsize=7)
    title = (
        f"Windward wall q_z profile and leeward wall ({unit_label(unit)}, with +GCpi, "
        "+ toward the wall)"
    )
    frame(ax, title, x=(-1.4 * span, L + 1.4 * span), y=(-0.2 * top, 1.25 * top))
    return fig


def elevation_svg(result: Any, settings: Any = None, **options: Any) -> str:
    """Drawing ``"wind-elevation"``: the elevation of a directional wind result, as SVG."""
    del settings
    return svg_text(elevation_figure(result, **options))
