"""Elevation sketch of a concentrated load on a masonry wall (EN 1996-1-1 §6.1.3): the wall to
mid-height, the padstone, the beam bearing, the 60° spread to mid-height giving l_efm, and the
wall end when it is near (SVG). Reads a :class:`calcpack.checks.en1996.MasonryBearing` only;
matplotlib's object interface with the Agg canvas (no pyplot state)."""

from __future__ import annotations

import io
from typing import Any

from calcpack.plots.labels import number_label, quantity_label

__all__ = ["masonry_bearing_drawing", "masonry_bearing_figure", "masonry_bearing_svg"]


def masonry_bearing_figure(b: Any) -> Any:
    """A matplotlib Figure of bearing ``b`` (lengths in mm)."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.patches import Polygon, Rectangle

    def mm(q: Any) -> float:
        return float(q.to("mm").magnitude)

    hc = mm(b.wall.h_c)
    lb = mm(b.loaded_length)
    left, lef = mm(b.left_spread), mm(b.l_efm)
    right = lef - lb - left
    a_1 = getattr(b, "a_1", None)
    near_end = a_1 is not None and mm(a_1) <= left + 1e-9
    x0 = -left - (0 if near_end else 0.25 * lef)
    x1 = lb + right + 0.25 * lef
    fig = Figure(figsize=(6, 3.6))
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    ax.add_patch(Rectangle((x0, -hc), x1 - x0, hc, facecolor="#f2e6d9", edgecolor="#8c6d4f"))
    pad_h = 0.0
    if b.padstone is not None:
        pl, pad_h = mm(b.padstone.length), mm(b.padstone.depth)
        px = lb / 2 - pl / 2 if b.padstone_start is None else mm(b.padstone_start)
        ax.add_patch(
            Rectangle((px, 0), pl, pad_h, facecolor="#d9d9d9", edgecolor="#525252", hatch="..")
        )
        ax.text(px + pl / 2, pad_h / 2, "padstone", ha="center", va="center", fontsize=7)
    bl = mm(b.bearing_length)
    bx = lb / 2 - bl / 2 if b.bearing_start is None else mm(b.bearing_start)
    load_x = bx + bl / 2
    ax.add_patch(
        Rectangle(
            (bx, pad_h), bl, 0.35 * max(pad_h, 100.0), facecolor="#6baed6", edgecolor="#08519c"
        )
    )
    ax.annotate(
        "",
        xy=(load_x, pad_h),
        xytext=(load_x, pad_h + 0.6 * max(pad_h, 150.0)),
        arrowprops={"arrowstyle": "->", "color": "#08519c", "linewidth": 1.5},
    )
    ax.text(load_x, pad_h + 0.65 * max(pad_h, 150.0), "N_Edc", ha="center", fontsize=8)
    mid = -hc / 2
    ax.add_patch(
        Polygon(
            [(0, 0), (lb, 0), (lb + right, mid), (-left, mid)],
            closed=True,
            facecolor="#fdd0a2",
            edgecolor="#d94801",
            alpha=0.7,
        )
    )
    ax.plot([x0, x1], [mid, mid], color="#8c6d4f", linestyle="--", linewidth=0.8)
    ax.text(x1, mid, " mid-height", va="center", fontsize=7)
    ax.annotate(
        "",
        xy=(-left, mid - 0.06 * hc),
        xytext=(lb + right, mid - 0.06 * hc),
        arrowprops={"arrowstyle": "<->", "linewidth": 0.8},
    )
    ax.text(
        lb / 2, mid - 0.12 * hc, f"l_efm = {quantity_label(lef, 'mm')}", ha="center", fontsize=8
    )
    ax.text(lb + 0.45 * right, -0.1 * hc, "60°", fontsize=8)
    ax.text(
        lb / 2, -0.05 * hc, f"loaded length {quantity_label(lb, 'mm')}", ha="center", fontsize=7
    )
    ax.annotate(
        "",
        xy=(x1 - 0.05 * lef, 0),
        xytext=(x1 - 0.05 * lef, -hc),
        arrowprops={"arrowstyle": "<->", "linewidth": 0.8},
    )
    ax.text(x1 - 0.04 * lef, -0.75 * hc, "h_c", fontsize=8)
    if near_end:
        ax.plot([x0, x0], [-hc, 0], color="black", linewidth=2)
        ax.text(x0 - 0.03 * lef, -0.3 * hc, "wall end", fontsize=7, rotation=90, ha="right")
    ax.set_title(
        f"Concentrated load on masonry: β = {number_label(b.beta)} (EN 1996-1-1 §6.1.3)", fontsize=9
    )
    ax.set_aspect("equal")
    ax.axis("off")
    ax.set_xlim(x0 - 0.05 * lef, x1 + 0.3 * lef)
    ax.set_ylim(-1.05 * hc, pad_h + 0.8 * max(pad_h, 150.0))
    return fig


def masonry_bearing_svg(b: Any) -> str:
    """The sketch as SVG text."""
    fig = masonry_bearing_figure(b)
    buf = io.StringIO()
    fig.savefig(buf, format="svg", bbox_inches="tight")
    return buf.getvalue()


def masonry_bearing_drawing(data: Any, settings: Any = None, **options: Any) -> str:
    """The drawing ``"masonry-bearing"`` of :class:`calcpack.working.Figure` (SVG text)."""
    return masonry_bearing_svg(data)
