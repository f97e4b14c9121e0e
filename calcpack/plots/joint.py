"""Sketch of a joint (SVG) from a :class:`calcpack.checks.joint_sketch.JointSketch`: members
(wood with grain lines, steel hatched, concrete stippled), fasteners end-on, fillet welds,
dimension lines and the load arrow. Reads the sketch only; matplotlib's object interface with
the Agg canvas (no pyplot state)."""

from __future__ import annotations

import io
from typing import Any

__all__ = ["joint_figure", "joint_svg"]

_FILL = {"wood": "#f3e3c3", "steel": "#d9d9d9", "concrete": "#eeeeee"}
_EDGE = {"wood": "#8c6d4f", "steel": "#4d4d4d", "concrete": "#737373"}
_HATCH = {"wood": "", "steel": "///", "concrete": ".."}


def joint_figure(sketch: Any) -> Any:
    """A matplotlib Figure of ``sketch``."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.patches import Circle, Rectangle

    xs: list[float] = []
    ys: list[float] = []
    for p in sketch.parts:
        xs += [p.x, p.x + p.width]
        ys += [p.y, p.y + p.height]
    w = max(xs) - min(xs) if xs else 1.0
    h = max(ys) - min(ys) if ys else 1.0
    fig = Figure(figsize=(6.0, max(2.2, min(4.5, 6.0 * (h + 4) / (w + 6)))))
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    for p in sketch.parts:
        ax.add_patch(
            Rectangle(
                (p.x, p.y),
                p.width,
                p.height,
                facecolor=_FILL[p.material],
                edgecolor=_EDGE[p.material],
                hatch=_HATCH[p.material],
                linewidth=1.2,
                alpha=0.9,
            )
        )
        if p.material == "wood" and p.grain:
            for k in range(1, 4):
                if p.grain == "horizontal":
                    yy = p.y + p.height * k / 4
                    ax.plot(
                        [p.x + 0.05 * p.width, p.x + 0.95 * p.width],
                        [yy, yy],
                        color="#c9a878",
                        linewidth=0.5,
                    )
                else:
                    xx = p.x + p.width * k / 4
                    ax.plot(
                        [xx, xx],
                        [p.y + 0.05 * p.height, p.y + 0.95 * p.height],
                        color="#c9a878",
                        linewidth=0.5,
                    )
        ax.text(
            p.x + 0.3, p.y + p.height - 0.3, p.name, fontsize=7, va="top", color=_EDGE[p.material]
        )
    for f in sketch.fasteners:
        ax.add_patch(
            Circle(
                (f.x, f.y),
                max(f.d, 0.12) / 2 * 1.6,
                facecolor="white",
                edgecolor="black",
                linewidth=1.0,
            )
        )
        ax.add_patch(Circle((f.x, f.y), max(f.d, 0.12) / 2, facecolor="#252525"))
    for wl in sketch.welds:
        ax.plot([wl.x1, wl.x2], [wl.y1, wl.y2], color="#cb181d", linewidth=3.5)
        if wl.label:
            ax.text(
                (wl.x1 + wl.x2) / 2,
                (wl.y1 + wl.y2) / 2 - 0.5,
                wl.label,
                fontsize=7,
                ha="center",
                va="top",
                color="#cb181d",
            )
    for dm in sketch.dimensions:
        vertical = abs(dm.x2 - dm.x1) < 1e-9
        ox, oy = (dm.offset, 0.0) if vertical else (0.0, dm.offset)
        a = (dm.x1 + ox, dm.y1 + oy)
        b = (dm.x2 + ox, dm.y2 + oy)
        ax.annotate(
            "",
            xy=b,
            xytext=a,
            arrowprops={"arrowstyle": "<->", "color": "#08519c", "linewidth": 0.8},
        )
        xs += [a[0], b[0]]
        ys += [a[1], b[1]]
        mx, my = (a[0] + b[0]) / 2, (a[1] + b[1]) / 2
        ax.text(
            mx + (0.2 if vertical else 0.0),
            my + (0.0 if vertical else 0.2),
            dm.label,
            fontsize=7,
            color="#08519c",
            ha="left" if vertical else "center",
            va="center" if vertical else "bottom",
        )
    if sketch.load is not None:
        ld = sketch.load
        ax.annotate(
            "",
            xy=(ld.x + ld.dx, ld.y + ld.dy),
            xytext=(ld.x, ld.y),
            arrowprops={"arrowstyle": "-|>", "color": "#d94801", "linewidth": 2.0},
        )
        ax.text(ld.x + 0.2, ld.y + 0.2, ld.label, fontsize=7, color="#d94801")
        xs += [ld.x, ld.x + ld.dx + 3.0]
        ys += [ld.y, ld.y + ld.dy]
    ax.set_xlim(min(xs) - 2.0, max(xs) + 3.0)
    ax.set_ylim(min(ys) - 1.5, max(ys) + 1.5)
    ax.set_aspect("equal")
    ax.set_xticks([])
    ax.set_yticks([])
    for side in ax.spines.values():
        side.set_visible(False)
    title = f"{sketch.title} ({sketch.view}, {sketch.unit})"
    if sketch.notes:
        title += "\n" + "; ".join(sketch.notes)
    ax.set_title(title, fontsize=8)
    return fig


def joint_svg(sketch: Any, settings: Any = None, **options: Any) -> str:
    """The sketch as SVG text (the drawing named "joint" for :class:`calcpack.working.Figure`)."""
    import matplotlib

    buf = io.StringIO()
    # text kept as text: searchable in the PDF
    with matplotlib.rc_context({"svg.fonttype": "none", "font.family": "DejaVu Sans"}):
        joint_figure(sketch).savefig(buf, format="svg", bbox_inches="tight")
    return buf.getvalue()
