"""Section shapes defined by their dimensions (pint lengths, keyword-only).

Every shape's own coordinates have their origin at the lower left corner of its bounding box,
x to the right and y up, so that ``y_bar`` of a single shape is the height of its centroid above
its underside. Dimensions are validated at construction; messages name the dimension at fault.

This module holds the base :class:`Shape`, the plain figures (rectangle, triangle, circle, tube,
rectangular hollow section), any simple polygon, and the helpers the rolled shapes in
:mod:`calcpack.sections.rolled` share (plates, root fillets, thin-walled J).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from functools import cached_property
from typing import TYPE_CHECKING, Any

from calcpack.errors import InputError
from calcpack.sections.base import Section, fmt_len, saint_venant_rectangle, validate_length
from calcpack.sections.geometry import (
    CircleRegion,
    PolygonRegion,
    Region,
    arc_points,
    self_intersection,
)
from calcpack.units import Q_, Quantity, require, si

if TYPE_CHECKING:
    from calcpack.sections.composite import Part
    from calcpack.sections.properties import PartRow, WeightedRegion

__all__ = [
    "Circle",
    "HollowCircle",
    "Polygon",
    "Rectangle",
    "RectangularHollow",
    "SectionLike",
    "Shape",
    "Triangle",
]

FILLET_SEGMENTS = 24
"""Chords per quarter circle for root fillets and rounded corners (see geometry.arc_points)."""


def _rect(x0: float, y0: float, x1: float, y1: float, label: str) -> PolygonRegion:
    return PolygonRegion([(x0, y0), (x1, y0), (x1, y1), (x0, y1)], label)


def _fillet(
    corner: tuple[float, float],
    a: tuple[float, float],
    b: tuple[float, float],
    r: float,
    label: str,
) -> PolygonRegion:
    """The fillet of radius r in the re-entrant corner where faces along unit vectors a and b
    meet: the square r x r at the corner less the quarter circle tangent to both faces."""
    cx = corner[0] + r * (a[0] + b[0])
    cy = corner[1] + r * (a[1] + b[1])
    start = math.atan2(-b[1], -b[0])
    end = math.atan2(-a[1], -a[0])
    if end - start > math.pi:
        end -= 2 * math.pi
    elif start - end > math.pi:
        end += 2 * math.pi
    return PolygonRegion([corner, *arc_points(cx, cy, r, start, end, FILLET_SEGMENTS)], label)


def _rounded_rect(b: float, d: float, r: float, dx: float, dy: float, label: str) -> PolygonRegion:
    if r <= 0:
        return _rect(dx, dy, dx + b, dy + d, label)
    pts: list[tuple[float, float]] = []
    corners = [
        (dx + b - r, dy + r, -math.pi / 2),
        (dx + b - r, dy + d - r, 0.0),
        (dx + r, dy + d - r, math.pi / 2),
        (dx + r, dy + r, math.pi),
    ]
    for cx, cy, start in corners:
        pts.extend(arc_points(cx, cy, r, start, start + math.pi / 2, FILLET_SEGMENTS))
    # drop coincident points where a straight side has zero length
    clean = [pts[0]]
    for p in pts[1:]:
        if math.dist(p, clean[-1]) > 1e-15:
            clean.append(p)
    if math.dist(clean[0], clean[-1]) <= 1e-15:
        clean.pop()
    return PolygonRegion(clean, label)


def _fail(message: str, name: str, value: object, expected: str) -> InputError:
    return InputError(message, name=name, value=value, expected=expected)


class Shape(Section):
    """A single shape in its own coordinates. Place it in a composite with :meth:`at`."""

    name: str

    def local_regions(self) -> list[tuple[Region, float]]:
        """The shape's regions with weight +1 (solid) or -1 (void), metres, own coordinates."""
        raise NotImplementedError

    @cached_property
    def _weighted(self) -> list[WeightedRegion]:
        from calcpack.sections.properties import WeightedRegion

        return [WeightedRegion(r, w, r.label) for r, w in self.local_regions()]

    def weighted_regions(self) -> list[WeightedRegion]:
        return self._weighted

    def part_rows(self) -> list[PartRow]:
        from calcpack.sections.properties import part_rows

        groups: dict[tuple[str, float], list[Region]] = {}
        for r, w in self.local_regions():
            groups.setdefault((r.label, w), []).append(r)
        return part_rows([(label, w, regs) for (label, w), regs in groups.items()])

    def at(
        self,
        *,
        x: Any,
        y: Any,
        name: str | None = None,
        anchor: str = "corner",
        rotation: Any = None,
        mirrored: bool = False,
        n: Any = 1.0,
        hole: bool = False,
    ) -> Part:
        """Place this shape in a composite section.

        Args:
            x, y: where the anchor goes, lengths in the composite's coordinates.
            name: the part's name in the parts table (defaults to the shape's name).
            anchor: ``"corner"`` puts the lower left corner of the (mirrored, rotated) shape's
                bounding box at (x, y); ``"centroid"`` puts its centroid there.
            rotation: an angle (e.g. ``90 * ureg.degree``), counter-clockwise positive.
            mirrored: mirror in a vertical line first (an angle with its leg to the left).
            n: modular ratio E_part / E_reference (a number > 0); 1 for the reference material.
            hole: the part is a hole cut from the solid part that contains it (its modular
                ratio is that part's).
        """
        from calcpack.sections.composite import Part

        return Part(
            shape=self,
            x=x,
            y=y,
            name=name if name is not None else self.name,
            anchor=anchor,
            rotation=rotation if rotation is not None else Q_(0.0, "degree"),
            mirrored=mirrored,
            n=n,
            hole=hole,
        )

    def hole_at(self, *, x: Any, y: Any, name: str | None = None, anchor: str = "centroid") -> Part:
        """Place this shape as a hole (see :meth:`at`); anchored at its centroid by default."""
        return self.at(x=x, y=y, name=name, anchor=anchor, hole=True)

    def is_open_thin_walled(self) -> bool:
        """True for shapes whose torsion constant is a sum of plate terms (open sections)."""
        return False


def _set_name(obj: Shape, default: str) -> None:
    if not obj.name:
        object.__setattr__(obj, "name", default)


def _mm(value_m: float) -> str:
    return f"{value_m * 1000:.4g}"


def _optional_radius(value: object, name: str, what: str) -> float:
    q = require(value, "[length]", name, nonnegative=True)
    if not float(q.magnitude) >= 0:
        raise _fail(f"{what} {name} must not be negative (got {q:~P})", name, q, "r >= 0")
    return si(q)


def _thin_plates_J(plates: Sequence[tuple[float, float, str]]) -> tuple[float | None, str]:
    """Σ b t³ / 3 over the plates of an open thin-walled section (centre-line lengths), the
    usual thin-walled approximation (common practice; AISC Design Guide 9, eq. 3.4). It
    ignores the extra stiffness of fillets, so it errs low (on the safe side for buckling)."""
    for b, t, label in plates:
        if b / t < 3:
            return None, (
                f"its {label} is not thin (b/t = {b / t:.3g} < 3), so Σ b t³/3 does not apply"
            )
    return sum(b * t**3 / 3 for b, t, _ in plates), ""


@dataclass(frozen=True, kw_only=True, eq=False)
class Rectangle(Shape):
    """A solid rectangle, width b (along x) by depth d (along y).

    Closed forms (common practice): A = bd, Ix = bd³/12, Iy = db³/12; J by the Saint-Venant
    series for a rectangle.
    """

    b: Quantity
    d: Quantity
    name: str = ""

    def __post_init__(self) -> None:
        b = validate_length(self.b, "b", "Width")
        d = validate_length(self.d, "d", "Depth")
        _set_name(self, f"rectangle {_mm(b)} × {_mm(d)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        return [(_rect(0, 0, si(self.b), si(self.d), self.name), 1.0)]

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        return saint_venant_rectangle(si(self.b), si(self.d)), ""

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Triangle(Shape):
    """A triangle with base b along x, height h, and apex at horizontal offset ``apex`` from the
    left end of the base (default b/2; 0 gives a right angle at the left; may lie beyond the
    base). About its centroid Ix = bh³/36 whatever the apex offset."""

    b: Quantity
    h: Quantity
    apex: Quantity | None = None
    name: str = ""

    def __post_init__(self) -> None:
        b = validate_length(self.b, "b", "Base")
        h = validate_length(self.h, "h", "Height")
        if self.apex is not None:
            require(self.apex, "[length]", "apex")
        _set_name(self, f"triangle b = {_mm(b)}, h = {_mm(h)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        b, h = si(self.b), si(self.h)
        a = b / 2 if self.apex is None else si(self.apex)
        shift = -min(0.0, a)
        pts = [(shift, 0.0), (shift + b, 0.0), (shift + a, h)]
        return [(PolygonRegion(pts, self.name), 1.0)]


@dataclass(frozen=True, kw_only=True, eq=False)
class Circle(Shape):
    """A solid circle of diameter d: A = πd²/4, I = πd⁴/64, J = πd⁴/32 (closed forms)."""

    d: Quantity
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Diameter")
        _set_name(self, f"circle ⌀{_mm(d)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        r = si(self.d) / 2
        return [(CircleRegion(r, r, r, self.name), 1.0)]

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        return math.pi * si(self.d) ** 4 / 32, ""


@dataclass(frozen=True, kw_only=True, eq=False)
class HollowCircle(Shape):
    """A circular hollow section (tube), outside diameter D, wall thickness t.

    Closed forms: A = π(D² - d²)/4, I = π(D⁴ - d⁴)/64, J = π(D⁴ - d⁴)/32 with d = D - 2t.
    """

    D: Quantity
    t: Quantity
    name: str = ""

    def __post_init__(self) -> None:
        D = validate_length(self.D, "D", "Outside diameter")
        t = validate_length(self.t, "t", "Wall thickness")
        _require_less(
            "Wall thickness",
            "t",
            t,
            self.t,
            "outside diameter",
            "D",
            D,
            half=True,
            hint="; for a solid bar use Circle",
        )
        _set_name(self, f"tube ⌀{_mm(D)} × {_mm(t)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        R = si(self.D) / 2
        r = R - si(self.t)
        return [(CircleRegion(R, R, R, "outer circle"), 1.0), (CircleRegion(R, R, r, "void"), -1.0)]

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        D = si(self.D)
        d = D - 2 * si(self.t)
        return math.pi * (D**4 - d**4) / 32, ""


@dataclass(frozen=True, kw_only=True, eq=False)
class RectangularHollow(Shape):
    """A rectangular hollow section: width b, depth d, wall t, outside corner radius r (the
    inside radius is r - t, or sharp when r <= t).

    J by the Bredt-Batho thin-walled closed-cell formula J = 4 A_m² t / p_m on the wall's
    centre line (common practice).
    """

    b: Quantity
    d: Quantity
    t: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""

    def __post_init__(self) -> None:
        b = validate_length(self.b, "b", "Width")
        d = validate_length(self.d, "d", "Depth")
        t = validate_length(self.t, "t", "Wall thickness")
        r = _optional_radius(self.r, "r", "Corner radius")
        for dim, name, what in ((b, "b", "width"), (d, "d", "depth")):
            _require_less("Wall thickness", "t", t, self.t, what, name, dim, half=True)
        if r > min(b, d) / 2:
            raise _fail(
                f"Corner radius r must not exceed half the smaller side (got r = {fmt_len(r)}, "
                f"b = {fmt_len(b)}, d = {fmt_len(d)})",
                "r",
                self.r,
                "r <= min(b, d)/2",
            )
        _set_name(self, f"RHS {_mm(d)} × {_mm(b)} × {_mm(t)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        b, d, t, r = si(self.b), si(self.d), si(self.t), si(self.r)
        outer = _rounded_rect(b, d, r, 0.0, 0.0, "outer outline")
        inner = _rounded_rect(b - 2 * t, d - 2 * t, max(r - t, 0.0), t, t, "void")
        return [(outer, 1.0), (inner, -1.0)]

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        b, d, t, r = si(self.b), si(self.d), si(self.t), si(self.r)
        rm = max(r - t / 2, 0.0)
        area_m = (b - t) * (d - t) - (4 - math.pi) * rm**2
        perimeter = 2 * ((b - t) + (d - t)) - (8 - 2 * math.pi) * rm
        return 4 * area_m**2 * t / perimeter, ""


def _check_fits(value: float, limit: float, message: str, name: str, q: object) -> None:
    if not value < limit:
        raise _fail(message, name, q, "a smaller value")


def _require_less(
    what: str,
    name: str,
    value_m: float,
    raw: object,
    limit_what: str,
    limit_name: str,
    limit_m: float,
    *,
    half: bool = False,
    hint: str = "",
) -> None:
    """Refuse a plate dimension that is not less than (half) another, naming both values.

    ``what name must be less than [half the] limit_what limit_name (got ...)``; lengths in metres.
    """
    if not (2 * value_m if half else value_m) < limit_m:
        rule = f"{name} < {limit_name}/2" if half else f"{name} < {limit_name}"
        raise _fail(
            f"{what} {name} must be less than {'half the ' if half else ''}{limit_what} "
            f"{limit_name} (got {name} = {fmt_len(value_m)}, {limit_name} = {fmt_len(limit_m)})"
            f"{hint}",
            name,
            raw,
            rule,
        )


def _vertex_list(vertices: Any) -> list[tuple[float, float]]:
    from calcpack.errors import DimensionError
    from calcpack.units import is_quantity

    if is_quantity(vertices):
        q = require(vertices, "[length]", "vertices")
        import numpy as np

        arr = np.asarray(q.to("m").magnitude, dtype=float)
        if arr.ndim != 2 or arr.shape[1] != 2:
            raise _fail(
                f"Polygon vertices must be a list of (x, y) pairs (got an array of shape "
                f"{arr.shape})",
                "vertices",
                vertices,
                "shape (n, 2)",
            )
        return [(float(x), float(y)) for x, y in arr]
    pts: list[tuple[float, float]] = []
    try:
        items = list(vertices)
    except TypeError:
        raise DimensionError(
            f"Polygon vertices must be a list of (x, y) pairs of lengths (got {vertices!r})",
            name="vertices",
            value=vertices,
            expected="[(x, y), ...] with units",
        ) from None
    for i, item in enumerate(items):
        try:
            x, y = item
        except (TypeError, ValueError):
            raise _fail(
                f"Polygon vertex vertices[{i}] must be an (x, y) pair (got {item!r})",
                f"vertices[{i}]",
                item,
                "(x, y)",
            ) from None
        pts.append(
            (
                si(require(x, "[length]", f"vertices[{i}].x")),
                si(require(y, "[length]", f"vertices[{i}].y")),
            )
        )
    return pts


@dataclass(frozen=True, kw_only=True, eq=False)
class Polygon(Shape):
    """Any simple polygon given by its vertices, in either order (exact area, centroid and
    second moments by Green's theorem). Unlike the other shapes it keeps the coordinates given.

    Args:
        vertices: a list of (x, y) pairs of lengths, or a length quantity of shape (n, 2).

    Raises:
        InputError: fewer than 3 vertices, a repeated vertex, a self-intersecting outline, or
            zero area.
    """

    vertices: Any
    name: str = ""

    def __post_init__(self) -> None:
        pts = _vertex_list(self.vertices)
        if len(pts) < 3:
            raise _fail(
                f"Polygon vertices must number at least 3 (got {len(pts)})",
                "vertices",
                self.vertices,
                ">= 3 vertices",
            )
        for i in range(len(pts)):
            j = (i + 1) % len(pts)
            if pts[i] == pts[j]:
                raise _fail(
                    f"Polygon vertices[{i}] and vertices[{j}] are the same point; remove one",
                    f"vertices[{j}]",
                    self.vertices,
                    "distinct consecutive vertices",
                )
        crossing = self_intersection(pts)
        if crossing is not None:
            i, j = crossing
            n = len(pts)
            raise _fail(
                f"Polygon vertices must trace a simple (non-self-intersecting) outline: edge "
                f"{i} (vertices[{i}] to vertices[{(i + 1) % n}]) meets edge {j} (vertices[{j}] "
                f"to vertices[{(j + 1) % n}])",
                "vertices",
                self.vertices,
                "a simple polygon",
            )
        region = PolygonRegion(pts, self.name or "polygon")
        if not 1e-18 * region.extent() ** 2 < region.moments().A:
            raise _fail(
                "Polygon vertices enclose zero area (all on one line?)",
                "vertices",
                self.vertices,
                "a polygon of positive area",
            )
        object.__setattr__(self, "_points", tuple(pts))
        _set_name(self, f"polygon ({len(pts)} vertices)")

    def local_regions(self) -> list[tuple[Region, float]]:
        pts: tuple[tuple[float, float], ...] = self.__dict__["_points"]
        return [(PolygonRegion(pts, self.name), 1.0)]

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        return None, (
            "a general polygon has no closed-form torsion constant; build the shape from plates "
            "or use a numerical (mesh) analysis"
        )


SectionLike = Section
"""Any section: a single shape or a composite."""
