"""What a joint sketch shows, as data: members, fasteners, welds, dimensions and the load.

The sketch is built from the same inputs the connection checks read (no drawing code here);
:mod:`calcpack.plots.joint` draws it as SVG, and a sheet shows it with
``Figure("joint", sketch, caption=..., alt=...)``. Coordinates are in the sketch's ``unit``
(inches for the builders here), x to the right and y up, in the plane of the view.

Builders: :func:`ledger_sketch` (elevation of a deck ledger on its rim board),
:func:`bolt_pattern_sketch` (a steel ply with its bolt pattern, AISC 360-16),
:func:`dowel_layout_sketch` (a wood member with its rows of dowel fasteners, NDS 2018) and
:func:`weld_sketch` (a lapped plate with its fillet welds).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.units import Quantity

__all__ = [
    "JointSketch",
    "SketchDimension",
    "SketchFastener",
    "SketchLoad",
    "SketchPart",
    "SketchWeld",
    "bolt_pattern_sketch",
    "dowel_layout_sketch",
    "ledger_sketch",
    "weld_sketch",
]

Material = Literal["wood", "steel", "concrete"]


@dataclass(frozen=True)
class SketchPart:
    """A member seen in the view: a rectangle, its material and the direction of its grain."""

    name: str
    x: float
    y: float
    width: float
    height: float
    material: Material = "wood"
    grain: Literal["horizontal", "vertical", ""] = ""


@dataclass(frozen=True)
class SketchFastener:
    """A fastener seen end-on at (x, y), diameter d."""

    x: float
    y: float
    d: float


@dataclass(frozen=True)
class SketchWeld:
    """A fillet weld seen along its length from (x1, y1) to (x2, y2)."""

    x1: float
    y1: float
    x2: float
    y2: float
    label: str = ""


@dataclass(frozen=True)
class SketchDimension:
    """A dimension line from (x1, y1) to (x2, y2) with its text, drawn ``offset`` aside."""

    x1: float
    y1: float
    x2: float
    y2: float
    label: str
    offset: float = 0.0


@dataclass(frozen=True)
class SketchLoad:
    """The load: an arrow at (x, y) pointing along (dx, dy), with its text."""

    x: float
    y: float
    dx: float
    dy: float
    label: str


@dataclass(frozen=True)
class JointSketch:
    """A plan or elevation sketch of a joint."""

    title: str
    view: Literal["elevation", "plan"]
    parts: tuple[SketchPart, ...]
    fasteners: tuple[SketchFastener, ...] = ()
    welds: tuple[SketchWeld, ...] = ()
    dimensions: tuple[SketchDimension, ...] = ()
    load: SketchLoad | None = None
    unit: str = "inch"
    notes: tuple[str, ...] = ()


def _in(q: Quantity) -> float:
    return float(q.to("inch").magnitude)


def _frac(v: float) -> str:
    """Inches as the trade writes them: 3/16, 1-1/2 (to 1/16 in.), else 3 significant figures."""
    n16 = round(v * 16)
    if n16 == 0 or abs(v * 16 - n16) > 1e-6:
        return f"{v:.3g}"
    whole, rest = divmod(n16, 16)
    if rest == 0:
        return f"{whole}"
    g = math.gcd(rest, 16)
    f = f"{rest // g}/{16 // g}"
    return f"{whole}-{f}" if whole else f


def _txt(q: Quantity) -> str:
    return f"{_frac(_in(q))} in."


def ledger_sketch(ledger: Any, *, shown: int = 4) -> JointSketch:
    """Elevation of a :class:`~calcpack.checks.nds.ledger.DeckLedger` on its support."""
    lg = ledger
    s = _in(lg.spacing)
    d = _in(lg.fastener.D)
    n = max(2, shown)
    length = 2 * _in(lg.end) + (n - 1) * s
    hl = _in(lg.ledger_depth)
    drop = _in(lg.drop)
    parts = []
    sup_depth = _in(lg.support_depth) if lg.support_depth is not None else hl + drop + 6.0
    top = sup_depth
    mat: Material = "wood" if lg.support_depth is not None else "concrete"
    parts.append(SketchPart(lg.support.label, 0.0, 0.0, length, sup_depth, mat, "horizontal"))
    ledger_top = top - drop
    parts.append(SketchPart("ledger", 0.0, ledger_top - hl, length, hl, "wood", "horizontal"))
    y1 = ledger_top - _in(lg.top)
    y2 = ledger_top - hl + _in(lg.bottom)
    pts = [
        SketchFastener(_in(lg.end) + i * s, y2 if (lg.rows == 2 and i % 2) else y1, d)
        for i in range(n)
    ]
    x0 = _in(lg.end)
    dims = [
        SketchDimension(0.0, y1, x0, y1, f"end {_txt(lg.end)}", offset=-1.0),
        SketchDimension(x0, ledger_top, x0 + s, ledger_top, f"s = {_txt(lg.spacing)}", offset=1.2),
        SketchDimension(length, ledger_top, length, y1, f"{_txt(lg.top)}", offset=1.0),
    ]
    if lg.rows == 2:
        dims.append(
            SketchDimension(length, ledger_top - hl, length, y2, f"{_txt(lg.bottom)}", offset=1.0)
        )
    load = SketchLoad(length / 2, ledger_top + 3.0, 0.0, -2.5, "joist reactions w")
    return JointSketch(
        title=f"Ledger: {lg.fastener.designation} at {_txt(lg.spacing)}"
        + (" staggered" if lg.rows == 2 else ""),
        view="elevation",
        parts=tuple(parts),
        fasteners=tuple(pts),
        dimensions=tuple(dims),
        load=load,
        notes=(f"ledger {_txt(lg.ledger.thickness)} thick on {lg.support.label}",),
    )


def bolt_pattern_sketch(bolts: Any, ply: Any, *, width: Quantity | None = None) -> JointSketch:
    """Elevation of an AISC :class:`~calcpack.checks.aisc360.bolts.Ply` and its bolts, the force
    along x toward the loaded edge at the right."""
    d = _in(bolts.d)
    s = _in(ply.s) if ply.s is not None else 0.0
    g = _in(ply.gauge) if ply.gauge is not None else 0.0
    le = _in(ply.le) if ply.le is not None else 1.5 * d * 2
    edge = _in(ply.edge) if ply.edge is not None else 1.5 * d * 2
    span = (ply.along - 1) * s
    length = le + span + le + 1.0
    height = _in(width) if width is not None else 2 * edge + (ply.lines - 1) * g
    x_last = length - le
    y0 = (height - (ply.lines - 1) * g) / 2
    pts = tuple(
        SketchFastener(x_last - i * s, y0 + k * g, d)
        for i in range(ply.along)
        for k in range(ply.lines)
    )
    y_top = y0 + (ply.lines - 1) * g
    dims = [
        SketchDimension(x_last, y_top, length, y_top, f"l_e = {_frac(le)} in.",
                        offset=height - y_top + 0.6)
    ]  # fmt: skip
    if ply.along > 1:
        dims.append(
            SketchDimension(x_last - s, y0, x_last, y0, f"s = {_frac(s)} in.", offset=-y0 - 0.6)
        )
    xr = length + 0.6
    if ply.lines > 1:
        dims.append(SketchDimension(xr, y0, xr, y0 + g, f"g = {_frac(g)} in.", offset=0.0))
    dims.append(SketchDimension(xr, 0.0, xr, y0, f"{_frac(y0)} in.", offset=0.0))
    return JointSketch(
        title=f"{ply.name}: {bolts.label}",
        view="elevation",
        parts=(SketchPart(ply.name, 0.0, 0.0, length, height, "steel"),),
        fasteners=pts,
        dimensions=tuple(dims),
        load=SketchLoad(length + 3.5, height / 2, 2.5, 0.0, "force on the ply"),
        notes=(f"t = {_txt(ply.t)}, holes {_txt(bolts.hole)}",),
    )


def dowel_layout_sketch(joint: Any, layout: Any, *, depth: Quantity) -> JointSketch:
    """Elevation of the main wood member of an NDS joint with its fastener rows (rows along
    the load); ``depth`` is the member depth across the grain."""
    f = joint.fastener
    d = _in(f.D)
    h = _in(depth)
    s = _in(layout.spacing) if layout.spacing is not None else 0.0
    sr = _in(layout.row_spacing) if layout.row_spacing is not None else 0.0
    end = _in(layout.end) if layout.end is not None else 7 * d
    edge = _in(layout.edge) if layout.edge is not None else (h - (layout.rows - 1) * sr) / 2
    length = end + (layout.per_row - 1) * s + 4.0 * d + 6.0
    pts = tuple(
        SketchFastener(end + i * s, edge + k * sr, d)
        for i in range(layout.per_row)
        for k in range(layout.rows)
    )
    dims = [SketchDimension(0.0, 0.0, end, 0.0, f"end {_frac(end)} in.", offset=-1.0)]
    if layout.per_row > 1:
        dims.append(SketchDimension(end, 0.0, end + s, 0.0, f"s = {_frac(s)} in.", offset=-2.4))
    xr = end + (layout.per_row - 1) * s + 2.0
    dims.append(SketchDimension(xr, 0.0, xr, edge, f"edge {_frac(edge)} in.", offset=0.0))
    if layout.rows > 1:
        dims.append(SketchDimension(xr, edge, xr, edge + sr, f"{_frac(sr)} in.", offset=0.0))
    th = float(joint.main.angle.to("radian").magnitude) if hasattr(joint.main, "angle") else 0.0
    load = SketchLoad(
        end / 2 - 0.5,
        h / 2,
        -2.5 * math.cos(th),
        -2.5 * math.sin(th),
        f"load at {math.degrees(th):.0f}° to grain",
    )
    return JointSketch(
        title=f"{layout.count} × {f.designation} in {joint.main.label}",
        view="elevation",
        parts=(SketchPart(joint.main.label, 0.0, 0.0, length, h, "wood", "horizontal"),),
        fasteners=pts,
        dimensions=tuple(dims),
        load=load,
        notes=(f"side member: {joint.side.label}, {joint.shear} shear",),
    )


def weld_sketch(weld: Any, *, plate_width: Quantity, lap: Quantity | None = None) -> JointSketch:
    """Plan of a plate lapped on another and fillet welded along both sides (longitudinal,
    θ = 0°) or across its end (transverse)."""
    L = _in(weld.L)
    b = _in(plate_width)
    lp = _in(lap) if lap is not None else L
    base_len = lp + 8.0
    parts = (
        SketchPart("base plate", 0.0, -2.0, base_len, b + 4.0, "steel"),
        SketchPart("lapped plate", base_len - lp, 0.0, lp + 6.0, b, "steel"),
    )
    x0 = base_len - lp
    welds: tuple[SketchWeld, ...]
    if float(weld.theta.to("degree").magnitude) >= 45.0:
        welds = (SketchWeld(x0, 0.0, x0, b, f"{_txt(weld.w)} fillet"),)
    else:
        welds = (
            SketchWeld(x0, 0.0, x0 + L, 0.0, f"{_txt(weld.w)} fillet"),
            SketchWeld(x0, b, x0 + L, b, ""),
        )[: max(1, weld.n)]
    dims = (SketchDimension(x0, b, x0 + L, b, f"L = {_txt(weld.L)}", offset=2.6),)
    return JointSketch(
        title=f"{weld.n} × {_txt(weld.w)} fillet weld",
        view="plan",
        parts=parts,
        welds=welds,
        dimensions=dims,
        load=SketchLoad(base_len + 6.5, b / 2, 2.5, 0.0, "force"),
    )
