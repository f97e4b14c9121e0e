"""Section properties from weighted regions: the numeric core and the result dataclass.

A section is a list of regions, each with a weight: +n for a solid part of modular ratio n
(n = E_part / E_reference, 1 for the reference material), -n for a hole. Properties are those of
the transformed section, in the reference material, about axes through its centroid:

* x̄ = Σ wᵢAᵢx̄ᵢ / Σ wᵢAᵢ, ȳ likewise;
* Ix = Σ wᵢ(Īxᵢ + Aᵢdᵧᵢ²), Iy and Ixy likewise (parallel-axis theorem);
* principal axes from Mohr's circle: I₁,₂ = (Ix+Iy)/2 ± √(((Ix-Iy)/2)² + Ixy²),
  tan 2θ = -2Ixy / (Ix - Iy), θ measured counter-clockwise from the x axis to the axis of I₁;
* elastic moduli S = I / c to each extreme fibre;
* plastic neutral axis (equal area above and below) and Z = ∫|y - y_p| dA, single material only;
* Q(y) = ∫ above y of (y' - ȳ) dA, the first moment used in τ = VQ / (I b).

Sign conventions: x to the right, y up; Ixy = ∫(x - x̄)(y - ȳ) dA, so an L-shaped angle with its
legs along +x and +y from the heel has Ixy < 0 about its centroid.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from calcpack import views
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sections.geometry import Region
from calcpack.units import Q_, Quantity

if TYPE_CHECKING:
    from calcpack.sections.base import Section as SectionLike
    from calcpack.working import Block

__all__ = ["PartRow", "SectionProperties", "WeightedRegion", "compute_properties"]


@dataclass(frozen=True)
class WeightedRegion:
    """A region with its weight (+n solid, -n hole) and the name of the part it belongs to."""

    region: Region
    weight: float
    part: str


@dataclass(frozen=True)
class PartRow:
    """One line of the parts table, SI floats: transformed area wA (m²), part centroid (m),
    own centroidal second moments wĪ (m⁴), distances from the section centroid d (m)."""

    name: str
    weight: float
    A: float
    x: float
    y: float
    Ix: float
    Iy: float
    Ixy: float
    dx: float
    dy: float


@dataclass(frozen=True)
class SectionProperties:
    """Properties of a (transformed) section about its centroidal axes, as pint quantities.

    Coordinates are those the section was built in (for a single shape: origin at the lower
    left corner of its bounding box; x right, y up). Second moments are of the transformed
    section in the reference material (modular ratio 1).

    Attributes:
        A: area. x_bar, y_bar: centroid.
        Ix, Iy: second moments about the centroidal x and y axes. Ixy: product of area.
        I1, I2: principal second moments (I1 >= I2). theta_p: angle from the x axis to the
            axis of I1, counter-clockwise positive, in degrees (-90°, 90°].
        rx, ry: radii of gyration √(I/A). r2: the least radius √(I2/A).
        c_top, c_bottom, c_left, c_right: distances from the centroid to the extreme fibres.
        Sx_top, Sx_bottom, Sy_left, Sy_right: elastic section moduli I / c to each extreme
            fibre; Sx and Sy are the smaller of each pair.
        y_pna, x_pna: plastic neutral axes (measured like y_bar and x_bar); Zx, Zy: plastic
            section moduli. None for a section of several materials (no single yield stress).
        section: the section these belong to (for Q and width at a level).
    """

    A: Quantity
    x_bar: Quantity
    y_bar: Quantity
    Ix: Quantity
    Iy: Quantity
    Ixy: Quantity
    I1: Quantity
    I2: Quantity
    theta_p: Quantity
    rx: Quantity
    ry: Quantity
    r2: Quantity
    c_top: Quantity
    c_bottom: Quantity
    c_left: Quantity
    c_right: Quantity
    Sx_top: Quantity
    Sx_bottom: Quantity
    Sy_left: Quantity
    Sy_right: Quantity
    y_pna_value: Quantity | None
    x_pna_value: Quantity | None
    Zx_value: Quantity | None
    Zy_value: Quantity | None
    J_value: Quantity | None
    Cw_value: Quantity | None
    J_reason: str
    Cw_reason: str
    section: SectionLike
    rows: tuple[PartRow, ...]

    @property
    def Sx(self) -> Quantity:
        """The smaller elastic modulus about x (to the farther fibre)."""
        return min(self.Sx_top, self.Sx_bottom)

    @property
    def Sy(self) -> Quantity:
        """The smaller elastic modulus about y."""
        return min(self.Sy_left, self.Sy_right)

    def _plastic(self, value: Quantity | None, what: str) -> Quantity:
        if value is None:
            raise OutOfScopeError(
                f"{what} is not defined for section {self.section.name!r}: its parts have "
                "different modular ratios, and plastic properties need one yield stress; "
                "compute the plastic capacity from each material's yield force instead"
            )
        return value

    @property
    def Zx(self) -> Quantity:
        """Plastic section modulus about the horizontal plastic neutral axis."""
        return self._plastic(self.Zx_value, "Plastic modulus Zx")

    @property
    def Zy(self) -> Quantity:
        """Plastic section modulus about the vertical plastic neutral axis."""
        return self._plastic(self.Zy_value, "Plastic modulus Zy")

    @property
    def y_pna(self) -> Quantity:
        """Level of the horizontal plastic neutral axis (equal area above and below)."""
        return self._plastic(self.y_pna_value, "Plastic neutral axis y_pna")

    @property
    def x_pna(self) -> Quantity:
        """Position of the vertical plastic neutral axis."""
        return self._plastic(self.x_pna_value, "Plastic neutral axis x_pna")

    @property
    def J(self) -> Quantity:
        """Torsion constant (Saint-Venant). Raises OutOfScopeError where no formula applies."""
        if self.J_value is None:
            raise OutOfScopeError(
                f"Torsion constant J is not available for section {self.section.name!r}: "
                f"{self.J_reason}"
            )
        return self.J_value

    @property
    def Cw(self) -> Quantity:
        """Warping constant. Raises OutOfScopeError where no formula applies."""
        if self.Cw_value is None:
            raise OutOfScopeError(
                f"Warping constant Cw is not available for section {self.section.name!r}: "
                f"{self.Cw_reason}"
            )
        return self.Cw_value

    def Q(self, *, y: Any) -> Quantity:
        """First moment about the centroidal x axis of the area above level ``y`` (a length,
        measured like y_bar), for τ = VQ / (I b). Same as ``section.Q(y=...)``."""
        return self.section.Q(y=y)

    def width_at(self, *, y: Any) -> Quantity:
        """Width b of the (transformed) section cut along level ``y``."""
        return self.section.width_at(y=y)

    def working(self, **options: Any) -> Block:
        """The working for display: parts table, sums, centroid and parallel-axis steps."""
        from calcpack.sections.working import section_working

        return section_working(self, **options)

    def figure(self, **options: Any) -> Any:
        """A matplotlib figure sketching the section with its centroid and axes."""
        return views.render("figure", self, **options)


def _find_level(regions: Sequence[WeightedRegion], axis: str, target: float) -> float:
    """The level at which the weighted area on the low side equals ``target`` (bisection to
    machine precision; the area below a level is continuous and non-decreasing)."""
    k_lo, k_hi = (1, 3) if axis == "x" else (0, 2)
    lo = min(r.region.bbox()[k_lo] for r in regions)
    hi = max(r.region.bbox()[k_hi] for r in regions)
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if mid in (lo, hi):
            break
        below = sum(r.weight * r.region.cut(mid, axis).A for r in regions)
        if below < target:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def first_moment_below(
    regions: Sequence[WeightedRegion], level: float, axis: str
) -> tuple[float, float]:
    """Weighted area on the low side of ``level`` and its first moment about ``level``."""
    area = 0.0
    moment = 0.0
    for r in regions:
        cut = r.region.cut(level, axis)
        area += r.weight * cut.A
        moment += r.weight * cut.A * (cut.c - level)
    return area, moment


def compute_properties(
    section: SectionLike,
    regions: Sequence[WeightedRegion],
    rows: Sequence[PartRow] | None = None,
    *,
    J: float | None = None,
    J_reason: str = "",
    Cw: float | None = None,
    Cw_reason: str = "",
) -> SectionProperties:
    """Combine weighted regions into :class:`SectionProperties` (SI floats in, quantities out).

    Args:
        section: the shape or composite the regions come from.
        regions: the weighted regions, already placed.
        rows: the parts table lines, if already grouped by part; else one line per region.
        J, Cw: torsion and warping constants in m⁴ and m⁶, or None with the reason.

    Raises:
        InputError: zero or negative net area.
    """
    if rows is None:
        rows = part_rows([(r.part, r.weight, [r.region]) for r in regions])
    A = sum(r.A for r in rows)
    name = section.name
    if not A > 1e-300:
        raise InputError(
            f"Section {name!r} must have a positive net area (got A = {A * 1e6:.6g} mm²): "
            "the holes take away all of the solid parts",
            name="A",
            value=Q_(A * 1e6, "mm**2"),
            expected="net area > 0",
        )
    xb = sum(r.A * r.x for r in rows) / A
    yb = sum(r.A * r.y for r in rows) / A
    size = max(max(abs(r.x), abs(r.y)) for r in rows) or 1.0

    def snap(d: float) -> float:
        # distances that are zero but for rounding (a part on the axis of symmetry)
        return 0.0 if abs(d) < 1e-12 * size else d

    rows = tuple(
        PartRow(r.name, r.weight, r.A, r.x, r.y, r.Ix, r.Iy, r.Ixy, snap(r.x - xb), snap(r.y - yb))
        for r in rows
    )
    Ix = sum(r.Ix + r.A * r.dy**2 for r in rows)
    Iy = sum(r.Iy + r.A * r.dx**2 for r in rows)
    Ixy = sum(r.Ixy + r.A * r.dx * r.dy for r in rows)
    mean = (Ix + Iy) / 2
    radius = math.hypot((Ix - Iy) / 2, Ixy)
    I1 = mean + radius
    I2 = mean - radius
    theta = 0.0 if radius <= 1e-12 * mean else 0.5 * math.atan2(-2 * Ixy, Ix - Iy)
    theta_deg = math.degrees(theta)
    if theta_deg <= -90:
        theta_deg += 180

    solids = [r for r in regions if r.weight > 0]
    x_min = min(r.region.bbox()[0] for r in solids)
    y_min = min(r.region.bbox()[1] for r in solids)
    x_max = max(r.region.bbox()[2] for r in solids)
    y_max = max(r.region.bbox()[3] for r in solids)
    c_top, c_bottom = y_max - yb, yb - y_min
    c_left, c_right = xb - x_min, x_max - xb

    weights = {abs(r.weight) for r in regions}
    single = max(weights) - min(weights) <= 1e-12 * max(weights)
    y_pna = x_pna = Zx = Zy = None
    if single:
        y_p = _find_level(regions, "x", A / 2)
        _, m_lo = first_moment_below(regions, y_p, "x")
        # ∫|y - y_p| dA = (moment of the area above) - (moment of the area below), both about y_p
        m_total = A * (yb - y_p)
        Zx = (m_total - m_lo) - m_lo
        x_p = _find_level(regions, "y", A / 2)
        _, m_lo2 = first_moment_below(regions, x_p, "y")
        Zy = (A * (xb - x_p) - m_lo2) - m_lo2
        y_pna, x_pna = Q_(y_p, "m").to("mm"), Q_(x_p, "m").to("mm")

    mm = "mm"
    return SectionProperties(
        A=Q_(A, "m**2").to("mm**2"),
        x_bar=Q_(xb, "m").to(mm),
        y_bar=Q_(yb, "m").to(mm),
        Ix=Q_(Ix, "m**4").to("mm**4"),
        Iy=Q_(Iy, "m**4").to("mm**4"),
        Ixy=Q_(Ixy, "m**4").to("mm**4"),
        I1=Q_(I1, "m**4").to("mm**4"),
        I2=Q_(I2, "m**4").to("mm**4"),
        theta_p=Q_(theta_deg, "degree"),
        rx=Q_(math.sqrt(Ix / A), "m").to(mm),
        ry=Q_(math.sqrt(Iy / A), "m").to(mm),
        r2=Q_(math.sqrt(max(I2, 0.0) / A), "m").to(mm),
        c_top=Q_(c_top, "m").to(mm),
        c_bottom=Q_(c_bottom, "m").to(mm),
        c_left=Q_(c_left, "m").to(mm),
        c_right=Q_(c_right, "m").to(mm),
        Sx_top=Q_(Ix / c_top, "m**3").to("mm**3"),
        Sx_bottom=Q_(Ix / c_bottom, "m**3").to("mm**3"),
        Sy_left=Q_(Iy / c_left, "m**3").to("mm**3"),
        Sy_right=Q_(Iy / c_right, "m**3").to("mm**3"),
        y_pna_value=y_pna,
        x_pna_value=x_pna,
        Zx_value=None if Zx is None else Q_(Zx, "m**3").to("mm**3"),
        Zy_value=None if Zy is None else Q_(Zy, "m**3").to("mm**3"),
        J_value=None if J is None else Q_(J, "m**4").to("mm**4"),
        Cw_value=None if Cw is None else Q_(Cw, "m**6").to("mm**6"),
        J_reason=J_reason,
        Cw_reason=Cw_reason,
        section=section,
        rows=rows,
    )


def part_rows(groups: Sequence[tuple[str, float, Sequence[Region]]]) -> list[PartRow]:
    """One parts-table line per (name, weight, regions) group: the group's weighted area,
    centroid and second moments about its own centroid (distances filled in later)."""
    out: list[PartRow] = []
    for name, w, regs in groups:
        ms = [r.moments() for r in regs]
        a = sum(m.A for m in ms)
        if not a > 0:
            continue  # e.g. a fillet of vanishing radius: nothing to tabulate
        cx = sum(m.A * m.cx for m in ms) / a
        cy = sum(m.A * m.cy for m in ms) / a
        ix = sum(m.Ix + m.A * (m.cy - cy) ** 2 for m in ms)
        iy = sum(m.Iy + m.A * (m.cx - cx) ** 2 for m in ms)
        ixy = sum(m.Ixy + m.A * (m.cx - cx) * (m.cy - cy) for m in ms)
        out.append(PartRow(name, w, w * a, cx, cy, w * ix, w * iy, w * ixy, 0.0, 0.0))
    return out
