"""Sketch of a lintel under masonry: the opening, the wall, the 45° triangle (or the full
height), and point loads with their 60° spread (SVG). Reads a
:class:`calcpack.loads.lintel_masonry.LintelLoads` only; matplotlib's object interface with the
Agg canvas (no pyplot state)."""

from __future__ import annotations

import io
import math
from typing import Any

from calcpack.plots.labels import quantity_label

__all__ = ["lintel_drawing", "lintel_figure", "lintel_svg"]


def lintel_figure(loads: Any, unit: str = "ft") -> Any:
    """A matplotlib Figure of ``loads`` (lengths in ``unit``: "ft" or "m")."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.patches import Polygon, Rectangle

    u = unit
    k = 1.0 if u == "ft" else 0.3048  # the sketch's fixed offsets are in feet

    def q(x: Any) -> float:
        return float(x.to(u).magnitude)

    L = q(loads.span)
    H_wall = q(loads.wall_height)
    # the sketch is to scale (45° must look like 45°); a tall wall is drawn cut above what the
    # lintel carries, so the figure stays wide and is not magnified on the page
    top = max([q(p.height) for p in (*loads.ignored, *(x[4] for x in loads.patches))] or [0.0])
    H = min(H_wall, max(0.75 * L, top + 0.25 * L))
    cut = H_wall > H
    x_range = 1.7 * L
    y_range = 1.25 * H + 2.0 * k
    width = 6.0
    height = width * y_range / x_range
    if height > 3.6:
        width, height = width * 3.6 / height, 3.6
    fig = Figure(figsize=(max(width, 3.0), height + 0.6))
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    ax.add_patch(Rectangle((-0.3 * L, 0), 1.6 * L, H, facecolor="#f2e6d9", edgecolor="#8c6d4f"))
    if cut:
        ax.plot([-0.3 * L, 1.3 * L], [H, H], color="white", linewidth=2)
        ax.plot([-0.3 * L, 1.3 * L], [H, H], color="#8c6d4f", linewidth=0.8, linestyle=":")
        ax.text(
            1.28 * L,
            H - 0.08 * L,
            f"wall continues to {quantity_label(H_wall, u)}",
            ha="right",
            va="top",
            fontsize=7,
            color="#5a4632",
        )
    ax.add_patch(Rectangle((0, -0.6 * k), L, 0.6 * k, facecolor="white", edgecolor="#8c6d4f"))
    ax.plot([-0.05 * L, 1.05 * L], [0, 0], color="black", linewidth=3)
    if loads.arching:
        ax.add_patch(
            Polygon(
                [(0, 0), (L / 2, L / 2), (L, 0)],
                closed=True,
                facecolor="#fdd0a2",
                edgecolor="#d94801",
                hatch="//",
            )
        )
        ax.text(0.8 * L, L / 8, "45° triangle", ha="center", fontsize=7)
    else:
        ax.add_patch(Rectangle((0, 0), L, H, facecolor="#fdd0a2", edgecolor="#d94801", hatch="//"))
        ax.text(L / 2, H / 2, f"full height, {quantity_label(H_wall, u)}", ha="center", fontsize=8)
    cot = 1 / math.tan(math.radians(60))
    for a, b, _w, _case, p in loads.patches:
        x, h = q(p.x), q(p.height)
        hb = q(p.bearing) / 2
        ax.annotate(
            "",
            xy=(x, h),
            xytext=(x, h + 0.15 * H + 0.5 * k),
            arrowprops={"arrowstyle": "->", "color": "#08519c"},
        )
        ax.plot([x - hb, x - hb - h * cot], [h, 0], color="#08519c", linestyle="--", linewidth=0.8)
        ax.plot([x + hb, x + hb + h * cot], [h, 0], color="#08519c", linestyle="--", linewidth=0.8)
        ax.plot(
            [q(a), q(b)],
            [0.05 * k, 0.05 * k],
            color="#08519c",
            linewidth=2,
        )
    for p in loads.ignored:
        x, h = q(p.x), q(p.height)
        ax.annotate(
            "",
            xy=(x, h),
            xytext=(x, h + 0.15 * H + 0.5 * k),
            arrowprops={"arrowstyle": "->", "color": "#969696"},
        )
        ax.text(x, h - 0.3 * k, "carried by the arch", ha="center", fontsize=7, color="#636363")
    ax.set_xlim(-0.35 * L, 1.35 * L)
    ax.set_ylim(-1.0 * k, H + 0.25 * H + 1.0 * k)
    ax.set_aspect("equal")
    ax.set_xlabel(u)
    ax.set_title(loads.reason, fontsize=8)
    return fig


def lintel_svg(loads: Any, unit: str = "ft") -> str:
    """The sketch as SVG text."""
    buf = io.StringIO()
    lintel_figure(loads, unit).savefig(buf, format="svg", bbox_inches="tight")
    return buf.getvalue()


def lintel_drawing(data: Any, settings: Any = None, **options: Any) -> str:
    """The drawing ``"lintel"`` of :class:`calcpack.working.Figure` (SVG text), in m on an SI
    sheet and ft on a US one."""
    system = getattr(settings, "system", "US")
    return lintel_svg(data, "m" if system == "SI" else "ft")
