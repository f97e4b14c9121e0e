"""Pad footings and piers as data: footing, column footprint, site conditions, loads by case.

Axes: origin at the centre of the footing's base, x along the width B, y along the length L
(the diameter D for a round footing or pier), z up. Loads act at the top of the footing
concrete, at the centre of the column:

* ``P`` axial force, **downward positive** (a negative P is uplift);
* ``Vx``, ``Vy`` horizontal shears in +x and +y;
* ``My`` moment about the y axis, positive when it presses the +x edge down;
  ``Mx`` moment about the x axis, positive when it presses the +y edge down.

At the base the moments grow by the shears times the footing thickness h
(``My + Vx·h`` and ``Mx + Vy·h``). Loads are given per load case and combined with calcpack's
combination sets (:func:`combine_footing_loads`).

Out of scope, refused with the reason (:class:`~calcpack.errors.OutOfScopeError`): footings on
sloping ground, combined footings, pile caps and piles, mats, expansive or frost-susceptible soil
without a stated founding depth, seismic design categories D to F. Soil values always come from
the geotechnical engineer; every footing sheet says so.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Literal

from calcpack.combinations.model import AppliedCombination, CombinationSet
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity
from calcpack.validate import at_least, dimension, instance, one_of, positive, required

__all__ = [
    "GEOTECHNICAL_CAUTION",
    "Column",
    "Footing",
    "FootingLoad",
    "SiteConditions",
    "combine_footing_loads",
]

GEOTECHNICAL_CAUTION = (
    "Soil values (allowable or presumed bearing pressure, strength parameters, unit weights, "
    "friction and passive resistance) are inputs that must come from the geotechnical engineer's "
    "report for this site or from the presumptive values of the code adopted locally, cited. "
    "Results depend on these stated inputs and assumptions; the package must be reviewed and "
    "sealed under licensed practice."
)

ColumnSupport = Literal["concrete", "masonry", "base plate"]
_SUPPORTS = ("concrete", "masonry", "base plate")
_REFUSED_KINDS = {
    "combined": "combined footings (two or more columns on one footing) are not covered; "
    "design each column's pad or use a combined-footing analysis",
    "strip": "strip (wall) footings are not covered by the pad and pier checks",
    "mat": "mats and rafts are not covered",
    "raft": "mats and rafts are not covered",
    "pile": "piles and pile caps are not covered: their capacity is a geotechnical design",
    "pile cap": "piles and pile caps are not covered: their capacity is a geotechnical design",
}


def _len(name: str, value: object) -> Quantity:
    q = dimension(name, value, "[length]")
    positive(name, q)
    return q


@dataclass(frozen=True)
class Column:
    """The column, post or base plate on the footing (centred on it).

    Args:
        c1: size along x [length] (the diameter for a round column). c2: size along y (default
            c1). shape: ``"rectangular"`` or ``"round"``.
        support: ``"concrete"`` column or pedestal, ``"masonry"`` wall or pier, or a steel
            column or timber post on a ``"base plate"`` (then give the plate size). The
            critical section for flexure follows from it (ACI 318-19 §13.2.7.1).
        plate1, plate2: base plate size along x and y [length] (support ``"base plate"``);
            the plate is the loaded area for bearing and punching.
        f_c: the column concrete strength for bearing on the column (optional, not checked).
    """

    c1: Quantity
    c2: Quantity | None = None
    shape: Literal["rectangular", "round"] = "rectangular"
    support: ColumnSupport = "concrete"
    plate1: Quantity | None = None
    plate2: Quantity | None = None

    def __post_init__(self) -> None:
        one_of("shape", self.shape, ("rectangular", "round"))
        one_of("support", self.support, _SUPPORTS)
        _len("c1", self.c1)
        if self.c2 is None or self.shape == "round":
            object.__setattr__(self, "c2", self.c1)
        _len("c2", self.c2)
        if self.support == "base plate":
            required(
                "plate1",
                self.plate1,
                expected="the base plate size along x",
                when="when support = 'base plate'",
            )
            _len("plate1", self.plate1)
            if self.plate2 is None:
                object.__setattr__(self, "plate2", self.plate1)
            _len("plate2", self.plate2)
            pairs = ((self.plate1, self.c1, "plate1"), (self.plate2, self.c2, "plate2"))
            for p, c, n in pairs:
                if p is not None and c is not None and p < c:
                    raise InputError(
                        name=n,
                        value=p,
                        rule="must be at least the column size",
                        expected="a plate at least as large as the column",
                        note=f"column {c:~P}",
                    )

    @property
    def loaded1(self) -> Quantity:
        """Size along x of the loaded area (the plate when there is one)."""
        return self.plate1 if self.support == "base plate" and self.plate1 is not None else self.c1

    @property
    def loaded2(self) -> Quantity:
        """Size along y of the loaded area."""
        c2 = self.c2 if self.c2 is not None else self.c1
        return self.plate2 if self.support == "base plate" and self.plate2 is not None else c2


def _default_gamma_c() -> Quantity:
    # 150 lb/ft3 normal-weight reinforced concrete (common practice; 23.6 kN/m3)
    return Q_(150.0, "lbf/ft**3")


@dataclass(frozen=True)
class Footing:
    """A pad footing (square, rectangular or round) or a round pier, centred under a column.

    Args:
        shape: ``"square"``, ``"rectangular"`` or ``"round"``.
        B: width along x [length] (the diameter when round). L: length along y (rectangular
            only; square and round take B).
        h: thickness of the footing concrete [length] (for a pier, its length from top to
            base).
        column: the :class:`Column` on it.
        soil_cover: depth of soil over the top of the footing [length] (0 for a pier whose top
            is at grade).
        gamma_concrete: concrete unit weight [force/volume] (default 150 lbf/ft³, common
            practice). gamma_soil: backfill unit weight over the footing (required when
            soil_cover > 0; from the geotechnical report).
        kind: ``"pad"`` or ``"pier"``; other kinds (combined, strip, mat, pile) are refused.
        mark: the footing mark (``"F1"``).

    Raises:
        InputError: zero or negative sizes; a column or plate larger than the footing; a bad
            shape. OutOfScopeError: a kind that is not a pad or pier.
    """

    shape: Literal["square", "rectangular", "round"]
    B: Quantity
    h: Quantity
    column: Column
    L: Quantity | None = None
    soil_cover: Quantity = field(default_factory=lambda: Q_(0.0, "m"))
    gamma_concrete: Quantity = field(default_factory=_default_gamma_c)
    gamma_soil: Quantity | None = None
    kind: str = "pad"
    mark: str = "F1"

    def __post_init__(self) -> None:
        if self.kind in _REFUSED_KINDS:
            raise OutOfScopeError(
                f"Footing kind {self.kind!r} is out of scope: {_REFUSED_KINDS[self.kind]}"
            )
        one_of("kind", self.kind, ("pad", "pier"))
        one_of("shape", self.shape, ("square", "rectangular", "round"))
        _len("B", self.B)
        _len("h", self.h)
        if self.shape == "rectangular":
            required(
                "L", self.L, expected="the footing length along y", when="for a rectangular footing"
            )
            _len("L", self.L)
        else:
            object.__setattr__(self, "L", self.B)
        if self.kind == "pier":
            one_of("shape", self.shape, ("round",))
        cover = dimension("soil_cover", self.soil_cover, "[length]")
        positive("soil_cover", cover, allow_zero=True)
        g = dimension("gamma_concrete", self.gamma_concrete, "[force]/[length]**3")
        positive("gamma_concrete", g)
        if self.gamma_soil is not None:
            positive("gamma_soil", dimension("gamma_soil", self.gamma_soil, "[force]/[length]**3"))
        elif cover.magnitude > 0:
            required(
                "gamma_soil",
                self.gamma_soil,
                expected="a soil unit weight from the geotechnical report, such as 18 kN/m**3",
                when=f"with soil_cover = {cover:~P}",
            )
        col = self.column
        if self.shape == "round":
            # the loaded area must fit inside the circle
            diag = (
                col.loaded1
                if col.shape == "round" and col.support != "base plate"
                else (col.loaded1**2 + col.loaded2**2) ** 0.5
            )
            if diag > self.B:
                raise InputError(
                    f"Input column must fit within the footing (got column {col.loaded1:~P} x "
                    f"{col.loaded2:~P}, footing diameter B = {self.B:~P})",
                    name="column",
                    value=col,
                    expected="a column smaller than the footing",
                )
        else:
            for c, n, size in ((col.loaded1, "B", self.B), (col.loaded2, "L", self.length)):
                if c > size:
                    raise InputError(
                        f"Input column must be smaller than the footing (got column {c:~P} "
                        f"along {n}, footing {n} = {size:~P})",
                        name="column",
                        value=col,
                        expected=f"a column smaller than {n}",
                    )

    @property
    def length(self) -> Quantity:
        """L (B for square and round footings)."""
        return self.L if self.L is not None else self.B

    @property
    def area(self) -> Quantity:
        """Plan area of the base [area]."""
        if self.shape == "round":
            return (math.pi * self.B**2 / 4).to("m**2")
        return (self.B * self.length).to("m**2")

    @property
    def column_area(self) -> Quantity:
        c = self.column
        if c.shape == "round":
            return (math.pi * c.c1**2 / 4).to("m**2")
        c2 = c.c2 if c.c2 is not None else c.c1
        return (c.c1 * c2).to("m**2")

    @property
    def concrete_weight(self) -> Quantity:
        """Weight of the footing concrete [force]."""
        return (self.gamma_concrete * self.area * self.h).to("kN")

    @property
    def soil_weight(self) -> Quantity:
        """Weight of the soil over the footing, less the column's footprint [force]."""
        if self.gamma_soil is None or self.soil_cover.magnitude == 0:
            return Q_(0.0, "kN")
        return (self.gamma_soil * (self.area - self.column_area) * self.soil_cover).to("kN")

    @property
    def depth(self) -> Quantity:
        """Depth of the base below the top of the soil cover, h + soil_cover [length]."""
        return (self.h + self.soil_cover).to("m")

    def polygon_m(self, sides: int = 720) -> list[tuple[float, float]]:
        """The base outline in metres, counter-clockwise (a round base as a polygon of
        ``sides`` sides with the circle's area)."""
        if self.shape == "round":
            r = self.B.to("m").magnitude / 2
            # same area as the circle: n/2 R^2 sin(2 pi / n) = pi r^2
            R = r * math.sqrt(2 * math.pi / (sides * math.sin(2 * math.pi / sides)))
            return [
                (R * math.cos(2 * math.pi * i / sides), R * math.sin(2 * math.pi * i / sides))
                for i in range(sides)
            ]
        b = self.B.to("m").magnitude / 2
        l_ = self.length.to("m").magnitude / 2
        return [(-b, -l_), (b, -l_), (b, l_), (-b, l_)]


@dataclass(frozen=True)
class SiteConditions:
    """What the site imposes on the footing, stated by the engineer (from the geotechnical
    report).

    Args:
        ground_slope: slope of the ground surface at the footing [angle] (only level ground is
            covered).
        frost_depth: frost penetration depth required by the local code [length], or None.
        frost_susceptible: the founding soil is frost-susceptible.
        expansive: the soil is expansive (shrink-swell).
        active_zone_depth: depth below which moisture changes do not affect an expansive soil
            [length] (required when expansive).
        seismic_design_category: ASCE/SEI 7 SDC ``"A"`` to ``"F"`` (D to F are refused: ACI
            318-19 Chapter 18 foundation provisions are not covered).
    """

    ground_slope: Quantity = field(default_factory=lambda: Q_(0.0, "degree"))
    frost_depth: Quantity | None = None
    frost_susceptible: bool = False
    expansive: bool = False
    active_zone_depth: Quantity | None = None
    seismic_design_category: str = "A"

    def __post_init__(self) -> None:
        slope = dimension("ground_slope", self.ground_slope, "degree")
        if abs(slope.to("degree").magnitude) > 1e-9:
            raise OutOfScopeError(
                f"Footings on sloping ground are out of scope (got ground_slope = {slope:~P}): "
                "bearing resistance and stability on a slope need a slope-specific analysis"
            )
        sdc = one_of("seismic_design_category", self.seismic_design_category, tuple("ABCDEF"))
        if sdc in "DEF":
            raise OutOfScopeError(
                f"Seismic design category {sdc} is out of scope (got seismic_design_category = "
                f"{sdc!r}): ACI 318-19 §18.13 foundation provisions are not covered (A to C are)"
            )
        if self.frost_depth is not None:
            positive("frost_depth", dimension("frost_depth", self.frost_depth, "[length]"))
        elif self.frost_susceptible:
            raise OutOfScopeError(
                "Frost-susceptible soil needs a stated frost depth (got frost_susceptible = True, "
                "frost_depth = None): give the local code's frost penetration depth"
            )
        if self.expansive:
            if self.active_zone_depth is None:
                raise OutOfScopeError(
                    "Expansive soil needs a stated active zone depth (got expansive = True, "
                    "active_zone_depth = None): take it from the geotechnical report"
                )
            positive(
                "active_zone_depth",
                dimension("active_zone_depth", self.active_zone_depth, "[length]"),
            )

    @property
    def minimum_depth(self) -> Quantity | None:
        """The depth the base must reach (the larger of frost and active-zone depth), if any."""
        ds = [d for d in (self.frost_depth, self.active_zone_depth) if d is not None]
        return max(ds, key=lambda q: q.to("m").magnitude) if ds else None


def _zero_force() -> Quantity:
    return Q_(0.0, "kN")


def _zero_moment() -> Quantity:
    return Q_(0.0, "kN*m")


@dataclass(frozen=True)
class FootingLoad:
    """Loads at the top of the footing, at the column centre (signs in the module notes).

    Args:
        P: axial force, downward positive [force]. Vx, Vy: horizontal shears [force].
        My: moment about y, positive pressing +x down [force·length]. Mx: moment about x,
            positive pressing +y down.
    """

    P: Quantity = field(default_factory=_zero_force)
    Vx: Quantity = field(default_factory=_zero_force)
    Vy: Quantity = field(default_factory=_zero_force)
    Mx: Quantity = field(default_factory=_zero_moment)
    My: Quantity = field(default_factory=_zero_moment)

    def __post_init__(self) -> None:
        for n in ("P", "Vx", "Vy"):
            dimension(n, getattr(self, n), "[force]")
        for n in ("Mx", "My"):
            dimension(n, getattr(self, n), "[force]*[length]")

    def scaled(self, f: float) -> FootingLoad:
        return FootingLoad(self.P * f, self.Vx * f, self.Vy * f, self.Mx * f, self.My * f)

    def __add__(self, other: FootingLoad) -> FootingLoad:
        return FootingLoad(
            self.P + other.P,
            self.Vx + other.Vx,
            self.Vy + other.Vy,
            self.Mx + other.Mx,
            self.My + other.My,
        )


def combine_footing_loads(
    loads: Mapping[str, FootingLoad], combinations: CombinationSet
) -> dict[str, tuple[AppliedCombination, FootingLoad]]:
    """The footing loads of every combination of ``combinations`` acting on the cases given.

    Args:
        loads: load case name (``"D"``, ``"L"``, ``"W"``...) -> :class:`FootingLoad`.
        combinations: a combination set (e.g. ``asce7_allowable_stress()``,
            ``en1990_combinations(...)``).

    Returns:
        combination name -> (the applied combination, its factored :class:`FootingLoad`).

    Raises:
        InputError: no loads, a value that is not a FootingLoad, a case no combination uses.
    """
    at_least("loads", loads, what="load case")
    for k, v in loads.items():
        instance(f"loads[{k!r}]", v, FootingLoad, expected="a FootingLoad")
    out: dict[str, tuple[AppliedCombination, FootingLoad]] = {}
    for combo in combinations.apply(loads.keys()):
        total = FootingLoad()
        for case, f in combo.factors.items():
            total = total + loads[case].scaled(f)
        out[combo.name] = (combo, total)
    return out
