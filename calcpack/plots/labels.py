"""Figure helpers shared by the drawings: round tick values in the display unit, and a label
placer that keeps value labels clear of each other, of the titles and of the axis labels.

Labels are placed after the layout is fixed: each label tries a short list of offsets around its
anchor (above, below, right, left, then further out) and takes the first whose box, measured by
matplotlib's renderer, overlaps no label already placed and no fixed text, and stays inside its
axes. Label text is kept as SVG text (``svg.fonttype = none``) so it is searchable in the PDF.
"""

from __future__ import annotations

import io
import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

import numpy as np
from matplotlib.ticker import MaxNLocator

__all__ = [
    "Label",
    "number_label",
    "place_labels",
    "quantity_label",
    "round_ticks",
    "svg_text",
    "unit_label",
]

# Offsets (points) tried around an anchor, in order: (dx, dy, ha, va).
_CANDIDATES: tuple[tuple[float, float, str, str], ...] = (
    (0, 5, "center", "bottom"),
    (0, -5, "center", "top"),
    (6, 0, "left", "center"),
    (-6, 0, "right", "center"),
    (8, 8, "left", "bottom"),
    (-8, 8, "right", "bottom"),
    (8, -8, "left", "top"),
    (-8, -8, "right", "top"),
    (0, 18, "center", "bottom"),
    (0, -18, "center", "top"),
    (30, 14, "left", "bottom"),
    (-30, 14, "right", "bottom"),
    (30, -14, "left", "top"),
    (-30, -14, "right", "top"),
)


def round_ticks(lo: float, hi: float, *, n: int = 8) -> np.ndarray:
    """At most about ``n`` tick values between ``lo`` and ``hi`` (display units), each a whole
    multiple of 1, 2, 2.5 or 5 times a power of ten, the ends included when they are round."""
    locator = MaxNLocator(nbins=n, steps=[1, 2, 2.5, 5, 10])
    ticks = np.asarray(locator.tick_values(lo, hi), dtype=float)
    span = hi - lo
    eps = 1e-9 * (abs(span) or 1.0)
    ticks = ticks[(ticks >= lo - eps) & (ticks <= hi + eps)]
    return np.round(ticks, 12)


def number_label(value: float, sig: int | None = None, *, signed: bool = False) -> str:
    """A value on a figure, written by the one number formatter of the tables, prose and working
    (:func:`calcpack.working.format.format_number`) to ``sig`` significant figures (default:
    the display setting); ``signed`` writes "+" before a positive value (pressures toward a
    surface)."""
    from calcpack.units import get_display
    from calcpack.working.format import format_number

    text = format_number(float(value), sig or get_display().sig_figs)
    return "+" + text if signed and float(value) > 0 else text


def unit_label(unit: Any) -> str:
    """A unit on a figure as the working writes units (``kN·m``, ``kN/m²``, ``psf``): the one
    unit formatter of the tables, prose and working; ``unit`` a pint unit or its text."""
    from calcpack.units import ureg
    from calcpack.working.format import format_unit_text

    return format_unit_text(ureg.Unit(unit) if isinstance(unit, str) else unit)


def quantity_label(value: float, unit: Any, sig: int | None = None, *, signed: bool = False) -> str:
    """A value and its unit on a figure: the number as :func:`number_label` writes it, the unit
    as :func:`unit_label` writes it; ``unit`` a pint unit or its text."""
    text = unit_label(unit)
    number = number_label(value, sig, signed=signed)
    return f"{number} {text}" if text else number


def tick_text(value: float) -> str:
    """A round tick value as text: no trailing zeros, a true minus sign."""
    if abs(value) < 1e-12:
        return "0"
    text = f"{value:.6g}"
    if "e" in text:
        text = f"{value:.6f}".rstrip("0").rstrip(".")
    return text.replace("-", "−")


@dataclass
class Label:
    """A value label to place: anchor in data coordinates of ``ax``, text and colour."""

    ax: Any
    x: float
    y: float
    text: str
    color: str
    fontsize: float = 7.0
    prefer: tuple[float, float] | None = None  # unit direction to try first (e.g. a free gap)


def _preferred(direction: tuple[float, float] | None) -> list[tuple[float, float, str, str]]:
    """Offsets along ``direction``, the text set to grow away from the anchor."""
    if direction is None:
        return []
    ux, uy = direction
    ha = "left" if ux > 0.38 else "right" if ux < -0.38 else "center"
    va = "bottom" if uy > 0.38 else "top" if uy < -0.38 else "center"
    return [(ux * r, uy * r, ha, va) for r in (4.0, 8.0, 13.0)]


def _boxes_overlap(a: Any, b: Any, pad: float = 1.0) -> bool:
    return not (
        a.x1 + pad <= b.x0 or b.x1 + pad <= a.x0 or a.y1 + pad <= b.y0 or b.y1 + pad <= a.y0
    )


def place_labels(fig: Any, labels: Sequence[Label], *, gid: str = "cp-label") -> list[Any]:
    """Place ``labels`` on ``fig`` so that no two overlap and none overlaps fixed text.

    The figure's layout engine is run once and then switched off, so the measured positions
    are the ones written to the SVG. Returns the matplotlib annotations made (each with an SVG
    id ``{gid}-{i}``).
    """
    from matplotlib.backends.backend_agg import FigureCanvasAgg

    FigureCanvasAgg(fig)
    fig.canvas.draw()
    fig.set_layout_engine("none")
    renderer = fig.canvas.get_renderer()
    fixed = []
    for ax in fig.axes:
        for t in (ax.title, ax._left_title, ax.xaxis.label, ax.yaxis.label, *ax.texts):
            # A slanted text's upright box is far larger than its ink: such texts (member
            # labels along a truss diagonal) are not counted.
            if t.get_text() and abs(t.get_rotation()) % 180 in (0.0, 90.0):
                fixed.append(t.get_window_extent(renderer))
        for tick in (*ax.get_xticklabels(), *ax.get_yticklabels()):
            if tick.get_text() and tick.get_visible():
                fixed.append(tick.get_window_extent(renderer))
    placed: list[Any] = []
    made = []
    for i, lab in enumerate(labels):
        ann = lab.ax.annotate(
            lab.text,
            (lab.x, lab.y),
            textcoords="offset points",
            xytext=(0, 5),
            ha="center",
            va="bottom",
            fontsize=lab.fontsize,
            color=lab.color,
            annotation_clip=False,
        )
        ann.set_gid(f"{gid}-{i}")
        axbox = lab.ax.get_window_extent(renderer)
        best, best_cost = None, math.inf
        for dx, dy, ha, va in (*_preferred(lab.prefer), *_CANDIDATES):
            ann.set_position((dx, dy))
            ann.set_ha(ha)
            ann.set_va(va)
            box = ann.get_window_extent(renderer)
            cost = sum(1 for other in (*placed, *fixed) if _boxes_overlap(box, other))
            outside = max(0.0, axbox.x0 - box.x0, box.x1 - axbox.x1)
            outside += max(0.0, axbox.y0 - box.y0, box.y1 - axbox.y1)
            cost += outside / 10.0
            if cost < best_cost:
                best, best_cost = (dx, dy, ha, va), cost
            if cost == 0:
                break
        assert best is not None
        ann.set_position(best[:2])
        ann.set_ha(best[2])
        ann.set_va(best[3])
        placed.append(ann.get_window_extent(renderer))
        made.append(ann)
    return made


def svg_text(fig: Any) -> str:
    """The figure as SVG with its text kept as text (searchable, measurable)."""
    import matplotlib

    buf = io.StringIO()
    with matplotlib.rc_context({"svg.fonttype": "none", "font.family": "DejaVu Sans"}):
        fig.savefig(buf, format="svg")
    return buf.getvalue()
