"""Sketch of a cross-section: its parts, holes, centroid, axes and main dimensions (SVG).

Reads a section and its properties only. Uses matplotlib's object interface with the Agg
canvas (no pyplot state), so it is safe in a kernel, a build and a test alike.
"""

from __future__ import annotations

import io
import math
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure

    from calcpack.sections.base import Section as SectionLike
    from calcpack.sections.properties import SectionProperties

__all__ = ["section_figure", "section_svg"]

_FILLS = ["#d9d9d9", "#9ecae1", "#fdd0a2", "#c7e9c0", "#dadaeb", "#fcbba1"]
_SCALE = {"SI": (1000.0, "mm"), "US": (1000.0 / 25.4, "in")}


def _fmt(value: float) -> str:
    if value == 0:
        return "0"
    digits = max(0, 2 - math.floor(math.log10(abs(value))))
    return f"{value:.{digits}f}"


def _dimension(
    ax: Axes, p0: tuple[float, float], p1: tuple[float, float], text: str, *, offset: float
) -> None:
    """A dimension line between p0 and p1, drawn ``offset`` to the left of p0→p1."""
    dx, dy = p1[0] - p0[0], p1[1] - p0[1]
    length = math.hypot(dx, dy) or 1.0
    nx, ny = -dy / length * offset, dx / length * offset
    a = (p0[0] + nx, p0[1] + ny)
    b = (p1[0] + nx, p1[1] + ny)
    for p, q in ((p0, a), (p1, b)):
        ax.plot([p[0], q[0] + nx * 0.15], [p[1], q[1] + ny * 0.15], color="0.35", lw=0.5)
    ax.annotate(
        "",
        xy=b,
        xytext=a,
        arrowprops={"arrowstyle": "<|-|>", "color": "0.2", "lw": 0.7, "shrinkA": 0, "shrinkB": 0},
    )
    angle = math.degrees(math.atan2(dy, dx))
    if angle > 90 or angle <= -90:
        angle -= 180 * (1 if angle > 0 else -1)
    mid = ((a[0] + b[0]) / 2 + nx * 0.25, (a[1] + b[1]) / 2 + ny * 0.25)
    ax.text(
        *mid, text, rotation=angle, ha="center", va="center", fontsize=8,
        bbox={"fc": "white", "ec": "none", "pad": 0.6},
    )  # fmt: skip


def section_figure(
    section: SectionLike,
    props: SectionProperties | None = None,
    *,
    system: str | None = None,
    width: float = 5.5,
    label_parts: bool = True,
    dimensions: bool = True,
    title: str | None = None,
) -> Figure:
    """Draw the section to scale with its parts, holes (white, dashed), centroid C, centroidal
    axes x-x and y-y, the principal axes when they differ, overall dimensions and x̄, ȳ.

    Args:
        section: a shape or composite section.
        props: its properties (computed when not given).
        system: "SI" (dimensions in mm) or "US" (in); default the global display setting.
        width: figure width in inches.
        label_parts: write each part's name at its centroid.
        dimensions: draw the overall width, depth and the centroid's position.
        title: figure title (default: the section's name).

    Returns:
        a matplotlib Figure on an Agg canvas; see :func:`section_svg` for SVG text.
    """
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.patches import Circle as CirclePatch
    from matplotlib.patches import Polygon as PolygonPatch

    from calcpack.sections.geometry import CircleRegion, PolygonRegion
    from calcpack.units import get_display

    props = props or section.properties()
    sysname = system or get_display().system
    k, unit = _SCALE[sysname]
    regions = section.weighted_regions()
    x0, y0, x1, y1 = (v * k for v in section.extent_m())
    span = max(x1 - x0, y1 - y0)
    aspect = (y1 - y0 + 0.6 * span) / (x1 - x0 + 0.7 * span)
    fig = Figure(figsize=(width, max(2.5, min(width * aspect, 9.0))))
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    ax.set_aspect("equal")
    ax.axis("off")

    from calcpack.sections.shapes import Shape

    single = isinstance(section, Shape)  # one shape: one colour, no part labels
    colours: dict[str, str] = {}
    for wr in regions:
        if wr.weight > 0 and wr.part not in colours:
            colours[wr.part] = _FILLS[0 if single else len(colours) % len(_FILLS)]
    order = sorted(regions, key=lambda r: r.weight < 0)  # holes drawn over solids
    for wr in order:
        hole = wr.weight < 0
        style: dict[str, Any] = {
            "facecolor": "white" if hole else colours[wr.part],
            "edgecolor": "0.15",
            "linewidth": 0.8,
            "linestyle": "--" if hole else "-",
            "zorder": 3 if hole else 2,
        }
        region = wr.region
        if isinstance(region, CircleRegion):
            ax.add_patch(CirclePatch((region.cx * k, region.cy * k), region.r * k, **style))
        elif isinstance(region, PolygonRegion):
            pts = [(x * k, y * k) for x, y in region.points]
            ax.add_patch(PolygonPatch(pts, closed=True, **style))

    xb, yb = props.x_bar.to(unit).magnitude, props.y_bar.to(unit).magnitude
    ext = 0.12 * span
    axis_style: dict[str, Any] = {
        "color": "#b2182b",
        "lw": 0.8,
        "ls": (0, (8, 3, 1, 3)),
        "zorder": 4,
    }
    ax.plot([x0 - ext, x1 + ext], [yb, yb], **axis_style)
    ax.plot([xb, xb], [y0 - ext, y1 + ext], **axis_style)
    ax.text(x1 + ext, yb, " x", va="center", fontsize=9, color="#b2182b")
    ax.text(xb, y1 + ext, "y", ha="center", va="bottom", fontsize=9, color="#b2182b")
    theta = props.theta_p.to("radian").magnitude
    if abs(props.Ixy.magnitude) > 1e-9 * abs(props.I1.magnitude) and abs(theta) > 1e-6:
        reach = 0.55 * span
        for label, ang in (("1", theta), ("2", theta + math.pi / 2)):
            c, s = math.cos(ang), math.sin(ang)
            ax.plot(
                [xb - reach * c, xb + reach * c], [yb - reach * s, yb + reach * s],
                color="#2166ac", lw=0.8, ls=":", zorder=4,
            )  # fmt: skip
            ax.text(xb + reach * c, yb + reach * s, f" {label}", fontsize=9, color="#2166ac")
    ax.plot([xb], [yb], marker="o", ms=7, mfc="white", mec="#b2182b", mew=1.2, zorder=5)
    ax.plot([xb], [yb], marker="+", ms=7, color="#b2182b", mew=1.2, zorder=6)
    ax.text(xb + 0.03 * span, yb + 0.03 * span, "C", fontsize=9, color="#b2182b", zorder=6)

    if label_parts and not single:
        sizes: dict[str, list[float]] = {}
        for wr in regions:
            bx0, by0, bx1, by1 = (v * k for v in wr.region.bbox())
            box = sizes.setdefault(wr.part, [bx0, by0, bx1, by1])
            box[:] = [min(box[0], bx0), min(box[1], by0), max(box[2], bx1), max(box[3], by1)]
        label_box = {"fc": "white", "ec": "0.6", "lw": 0.4, "pad": 1.2, "alpha": 0.9}
        outside = 0
        for row in props.rows:
            bx0, by0, bx1, by1 = sizes[row.name]
            at = (row.x * k, row.y * k)
            if min(bx1 - bx0, by1 - by0) > 0.12 * span:
                ax.text(*at, row.name, ha="center", va="center", fontsize=7, zorder=6,
                        bbox=label_box)  # fmt: skip
                continue
            # a thin part: label it outside the section with a leader, staggered upwards
            outside += 1
            side = 1 if at[0] >= (x0 + x1) / 2 else -1
            spot = (
                (x1 + 0.18 * span) if side > 0 else (x0 - 0.18 * span),
                y1 + 0.06 * span * outside,
            )
            ax.annotate(
                row.name, xy=at, xytext=spot, fontsize=7, zorder=6,
                ha="left" if side > 0 else "right", va="center", bbox=label_box,
                arrowprops={"arrowstyle": "-", "color": "0.4", "lw": 0.5},
            )  # fmt: skip

    if dimensions:
        gap = 0.09 * span
        _dimension(ax, (x1, y0), (x0, y0), f"{_fmt(x1 - x0)}", offset=gap)
        _dimension(ax, (x0, y0), (x0, y1), f"{_fmt(y1 - y0)}", offset=gap)
        _dimension(ax, (x1, yb), (x1, y0), f"ȳ = {_fmt(yb - y0)}", offset=gap)
        if abs(xb - (x0 + x1) / 2) > 1e-6 * span:
            _dimension(ax, (x0, y1), (xb, y1), f"x̄ = {_fmt(xb - x0)}", offset=gap)

    pad = 0.35 * span
    ax.set_xlim(x0 - pad, x1 + pad)
    ax.set_ylim(y0 - pad, y1 + pad)
    ax.set_title(
        (title if title is not None else section.name) + f"  (dimensions in {unit})", fontsize=9
    )
    fig.tight_layout()
    # Shown as SVG by Jupyter and by the package build without pyplot's display hooks.
    setattr(fig, "_repr_svg_", lambda: _figure_svg(fig))  # noqa: B010 - instance hook
    return fig


def _figure_svg(fig: Any) -> str:
    """The figure as SVG, titled for its alternative text in the PDF (the SVG's ``dc:title``)
    and without a creation date (the same sketch gives the same bytes)."""
    buffer = io.StringIO()
    heading = fig.axes[0].get_title() if fig.axes else ""
    title = f"Sketch of the cross-section {heading}".replace("  (", " (").strip()
    fig.savefig(buffer, format="svg", metadata={"Title": title, "Date": None})
    return buffer.getvalue()


def section_svg(section: SectionLike, **options: Any) -> str:
    """The sketch of :func:`section_figure` as SVG text."""
    return _figure_svg(section_figure(section, **options))
