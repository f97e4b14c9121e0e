"""Section shapes defined by their dimensions (pint lengths, keyword-only).

Every shape's own coordinates have their origin at the lower left corner of its bounding box,
x to the right and y up, so that ``y_bar`` of a single shape is the height of its centroid above
its underside. Dimensions are validated at construction; messages name the dimension at fault.

Rolled shapes take their published plate dimensions (d, bf, tf, tw) and the root fillet radius
r; no shape tables are stored. For a US wide-flange shape take r = k_des - t_f; flange toe
radii are not modelled.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from functools import cached_property
from typing import TYPE_CHECKING, Any, Union

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
    from calcpack.sections.composite import CompositeSection, Part
    from calcpack.sections.properties import PartRow, WeightedRegion

__all__ = [
    "Angle",
    "Channel",
    "Circle",
    "HollowCircle",
    "ISection",
    "Polygon",
    "Rectangle",
    "RectangularHollow",
    "SectionLike",
    "Shape",
    "Tee",
    "Triangle",
]

FILLET_SEGMENTS = 24
"""Chords per quarter circle for root fillets and rounded corners (see geometry.arc_points)."""


def _rect(x0: float, y0: float, x1: float, y1: float, label: str) -> PolygonRegion:
    return PolygonRegion([(x0, y0), (x1, y0), (x1, y1), (x0, y1)], label)


def _fillet(
    corner: tuple[float, float], a: tuple[float, float], b: tuple[float, float], r: float, label: str
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
        if not 2 * t < D:
            raise _fail(
                f"Wall thickness t must be less than half the outside diameter D (got t = "
                f"{fmt_len(t)}, D = {fmt_len(D)}); for a solid bar use Circle",
                "t",
                self.t,
                "t < D/2",
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
            if not 2 * t < dim:
                raise _fail(
                    f"Wall thickness t must be less than half the {what} {name} (got t = "
                    f"{fmt_len(t)}, {name} = {fmt_len(dim)})",
                    "t",
                    self.t,
                    f"t < {name}/2",
                )
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


@dataclass(frozen=True, kw_only=True, eq=False)
class ISection(Shape):
    """An I-section: depth d, flange width bf and thickness tf, web thickness tw, root fillet
    radius r (0 for a welded plate girder). A singly symmetric I has a different bottom flange
    ``bf_bot`` × ``tf_bot``; bf and tf are then the top flange.

    Attributes exposed for compactness checks: d, bf, tf, tw, r, bf_bot, tf_bot, h (clear web
    depth between the fillets, d - tf - tf_bot - 2r), h0 (distance between flange centroids).
    """

    d: Quantity
    bf: Quantity
    tf: Quantity
    tw: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    bf_bot: Quantity | None = None
    tf_bot: Quantity | None = None
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Depth")
        bf = validate_length(self.bf, "bf", "Flange width")
        tf = validate_length(self.tf, "tf", "Flange thickness")
        tw = validate_length(self.tw, "tw", "Web thickness")
        r = _optional_radius(self.r, "r", "Root fillet radius")
        bfb = bf if self.bf_bot is None else validate_length(self.bf_bot, "bf_bot", "Flange width")
        tfb = (
            tf if self.tf_bot is None else validate_length(self.tf_bot, "tf_bot", "Flange thickness")
        )
        for b, name in ((bf, "bf"), (bfb, "bf_bot")):
            if not tw < b:
                raise _fail(
                    f"Web thickness tw must be less than flange width {name} (got tw = "
                    f"{fmt_len(tw)}, {name} = {fmt_len(b)})",
                    "tw",
                    self.tw,
                    f"tw < {name}",
                )
            _check_fits(
                tw + 2 * r,
                b + 1e-15,
                f"Root fillet radius r does not fit: tw + 2r must not exceed flange width {name} "
                f"(got r = {fmt_len(r)}, tw = {fmt_len(tw)}, {name} = {fmt_len(b)})",
                "r",
                self.r,
            )
        if not tf + tfb < d:
            raise _fail(
                f"Flange thicknesses tf + tf_bot must be less than depth d (got tf = "
                f"{fmt_len(tf)}, tf_bot = {fmt_len(tfb)}, d = {fmt_len(d)})",
                "tf",
                self.tf,
                "tf + tf_bot < d",
            )
        _check_fits(
            tf + tfb + 2 * r,
            d,
            f"Root fillet radius r does not fit: the fillets leave no straight web (got r = "
            f"{fmt_len(r)}, d - tf - tf_bot = {fmt_len(d - tf - tfb)})",
            "r",
            self.r,
        )
        _set_name(self, f"I-section {_mm(d)} × {_mm(bf)} mm")

    def _dims(self) -> tuple[float, float, float, float, float, float, float]:
        bf, tf = si(self.bf), si(self.tf)
        bfb = bf if self.bf_bot is None else si(self.bf_bot)
        tfb = tf if self.tf_bot is None else si(self.tf_bot)
        return si(self.d), bf, tf, si(self.tw), si(self.r), bfb, tfb

    @property
    def doubly_symmetric(self) -> bool:
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        return math.isclose(bf, bfb) and math.isclose(tf, tfb)

    @property
    def h(self) -> Quantity:
        """Clear depth of the web between the fillets (or flanges), d - tf - tf_bot - 2r."""
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        return Q_(d - tf - tfb - 2 * r, "m").to("mm")

    @property
    def h0(self) -> Quantity:
        """Distance between the flange centroids, d - (tf + tf_bot)/2."""
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        return Q_(d - (tf + tfb) / 2, "m").to("mm")

    @property
    def bf_bottom(self) -> Quantity:
        """Bottom flange width (bf for a doubly symmetric I)."""
        return self.bf if self.bf_bot is None else self.bf_bot

    @property
    def tf_bottom(self) -> Quantity:
        """Bottom flange thickness (tf for a doubly symmetric I)."""
        return self.tf if self.tf_bot is None else self.tf_bot

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        B = max(bf, bfb)
        xc = B / 2
        xl, xr = xc - tw / 2, xc + tw / 2
        out: list[tuple[Region, float]] = [
            (_rect(xc - bf / 2, d - tf, xc + bf / 2, d, "top flange"), 1.0),
            (_rect(xl, tfb, xr, d - tf, "web"), 1.0),
            (_rect(xc - bfb / 2, 0.0, xc + bfb / 2, tfb, "bottom flange"), 1.0),
        ]
        if r > 0:
            label = "root fillets (4)"
            out += [
                (_fillet((xl, d - tf), (-1, 0), (0, -1), r, label), 1.0),
                (_fillet((xr, d - tf), (1, 0), (0, -1), r, label), 1.0),
                (_fillet((xl, tfb), (-1, 0), (0, 1), r, label), 1.0),
                (_fillet((xr, tfb), (1, 0), (0, 1), r, label), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        h0 = d - (tf + tfb) / 2
        return _thin_plates_J(
            [(bf, tf, "top flange"), (bfb, tfb, "bottom flange"), (h0, tw, "web")]
        )

    def warping_constant_m6(self) -> tuple[float | None, str]:
        """Cw = Iy h0² / 4 for a doubly symmetric I; h0² I_top I_bot / (I_top + I_bot) with the
        flanges' own second moments for a singly symmetric I (AISC Design Guide 9, common
        practice); web and fillets neglected in the latter."""
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        h0 = d - (tf + tfb) / 2
        if self.doubly_symmetric:
            B = max(bf, bfb)
            Iy = 0.0
            for region, _ in self.local_regions():
                m = region.moments()
                Iy += m.Iy + m.A * (m.cx - B / 2) ** 2
            return Iy * h0**2 / 4, ""
        i_top = tf * bf**3 / 12
        i_bot = tfb * bfb**3 / 12
        return h0**2 * i_top * i_bot / (i_top + i_bot), ""

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Tee(Shape):
    """A tee with its flange on top: overall depth d, flange bf × tf, stem (web) thickness tw,
    root fillet radius r."""

    d: Quantity
    bf: Quantity
    tf: Quantity
    tw: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Depth")
        bf = validate_length(self.bf, "bf", "Flange width")
        tf = validate_length(self.tf, "tf", "Flange thickness")
        tw = validate_length(self.tw, "tw", "Stem thickness")
        r = _optional_radius(self.r, "r", "Root fillet radius")
        if not tw < bf:
            raise _fail(
                f"Stem thickness tw must be less than flange width bf (got tw = {fmt_len(tw)}, "
                f"bf = {fmt_len(bf)})",
                "tw",
                self.tw,
                "tw < bf",
            )
        if not tf < d:
            raise _fail(
                f"Flange thickness tf must be less than depth d (got tf = {fmt_len(tf)}, "
                f"d = {fmt_len(d)})",
                "tf",
                self.tf,
                "tf < d",
            )
        _check_fits(
            max(tw + 2 * r - bf, tf + r - d),
            1e-15,
            f"Root fillet radius r does not fit the tee (got r = {fmt_len(r)})",
            "r",
            self.r,
        )
        _set_name(self, f"tee {_mm(d)} × {_mm(bf)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r = si(self.d), si(self.bf), si(self.tf), si(self.tw), si(self.r)
        xl, xr = (bf - tw) / 2, (bf + tw) / 2
        out: list[tuple[Region, float]] = [
            (_rect(0.0, d - tf, bf, d, "flange"), 1.0),
            (_rect(xl, 0.0, xr, d - tf, "stem"), 1.0),
        ]
        if r > 0:
            out += [
                (_fillet((xl, d - tf), (-1, 0), (0, -1), r, "root fillets (2)"), 1.0),
                (_fillet((xr, d - tf), (1, 0), (0, -1), r, "root fillets (2)"), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        return _thin_plates_J([(bf, tf, "flange"), (d - tf / 2, tw, "stem")])

    def warping_constant_m6(self) -> tuple[float | None, str]:
        return None, "warping of a tee is small and not coded; treat Cw as negligible explicitly"

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Channel(Shape):
    """A channel with parallel flanges, web on the left: depth d, flange width bf (including the
    web), flange thickness tf, web thickness tw, root fillet radius r."""

    d: Quantity
    bf: Quantity
    tf: Quantity
    tw: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Depth")
        bf = validate_length(self.bf, "bf", "Flange width")
        tf = validate_length(self.tf, "tf", "Flange thickness")
        tw = validate_length(self.tw, "tw", "Web thickness")
        r = _optional_radius(self.r, "r", "Root fillet radius")
        if not tw < bf:
            raise _fail(
                f"Web thickness tw must be less than flange width bf (got tw = {fmt_len(tw)}, "
                f"bf = {fmt_len(bf)})",
                "tw",
                self.tw,
                "tw < bf",
            )
        if not 2 * tf < d:
            raise _fail(
                f"Flange thickness tf must be less than half the depth d (got tf = "
                f"{fmt_len(tf)}, d = {fmt_len(d)})",
                "tf",
                self.tf,
                "tf < d/2",
            )
        _check_fits(
            max(tw + r - bf, 2 * tf + 2 * r - d),
            1e-15,
            f"Root fillet radius r does not fit the channel (got r = {fmt_len(r)})",
            "r",
            self.r,
        )
        _set_name(self, f"channel {_mm(d)} × {_mm(bf)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r = si(self.d), si(self.bf), si(self.tf), si(self.tw), si(self.r)
        out: list[tuple[Region, float]] = [
            (_rect(tw, d - tf, bf, d, "top flange"), 1.0),
            (_rect(0.0, 0.0, tw, d, "web"), 1.0),
            (_rect(tw, 0.0, bf, tf, "bottom flange"), 1.0),
        ]
        if r > 0:
            out += [
                (_fillet((tw, d - tf), (1, 0), (0, -1), r, "root fillets (2)"), 1.0),
                (_fillet((tw, tf), (1, 0), (0, 1), r, "root fillets (2)"), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        b = bf - tw / 2
        return _thin_plates_J([(b, tf, "top flange"), (b, tf, "bottom flange"), (d - tf, tw, "web")])

    def warping_constant_m6(self) -> tuple[float | None, str]:
        """Cw = tf b³ h0² / 12 · (3 b tf + 2 h0 tw) / (6 b tf + h0 tw) on centre-line dimensions
        b = bf - tw/2, h0 = d - tf (AISC Design Guide 9, common practice)."""
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        b = bf - tw / 2
        h0 = d - tf
        return tf * b**3 * h0**2 / 12 * (3 * b * tf + 2 * h0 * tw) / (6 * b * tf + h0 * tw), ""

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Angle(Shape):
    """An angle with its heel at the lower left: vertical leg d, horizontal leg b, thickness t,
    root fillet radius r (toe radii not modelled)."""

    d: Quantity
    b: Quantity
    t: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Leg length")
        b = validate_length(self.b, "b", "Leg length")
        t = validate_length(self.t, "t", "Leg thickness")
        r = _optional_radius(self.r, "r", "Root fillet radius")
        for leg, name in ((d, "d"), (b, "b")):
            if not t < leg:
                raise _fail(
                    f"Leg thickness t must be less than leg length {name} (got t = "
                    f"{fmt_len(t)}, {name} = {fmt_len(leg)})",
                    "t",
                    self.t,
                    f"t < {name}",
                )
        _check_fits(
            t + r,
            min(b, d) + 1e-15,
            f"Root fillet radius r does not fit the angle (got r = {fmt_len(r)}, t = "
            f"{fmt_len(t)}, shorter leg {fmt_len(min(b, d))})",
            "r",
            self.r,
        )
        _set_name(self, f"angle {_mm(d)} × {_mm(b)} × {_mm(t)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        d, b, t, r = si(self.d), si(self.b), si(self.t), si(self.r)
        out: list[tuple[Region, float]] = [
            (_rect(0.0, 0.0, t, d, "vertical leg"), 1.0),
            (_rect(t, 0.0, b, t, "horizontal leg"), 1.0),
        ]
        if r > 0:
            out.append((_fillet((t, t), (1, 0), (0, 1), r, "root fillet"), 1.0))
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, b, t = si(self.d), si(self.b), si(self.t)
        return _thin_plates_J([(d - t / 2, t, "vertical leg"), (b - t / 2, t, "horizontal leg")])

    def warping_constant_m6(self) -> tuple[float | None, str]:
        return None, "warping of an angle is small and not coded; treat Cw as negligible explicitly"

    def is_open_thin_walled(self) -> bool:
        return True


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
        if not region.moments().A > 1e-18 * region.extent() ** 2:
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


SectionLike = Union[Shape, "CompositeSection"]
