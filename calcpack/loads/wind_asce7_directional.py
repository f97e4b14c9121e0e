"""Wind on the main frame of a rigid building by the directional procedure, ASCE/SEI 7-16
Chapter 27 Part 1 (enclosed and partially enclosed buildings of all heights): walls and gable
or flat roofs, one wind direction at a time.

    p = q G C_p − q_i (GC_pi)        (Eq. 27.3-1)

q = q_h for every surface here (the windward wall too: q_z ≤ q_h below the mean roof height, so
this is conservative), q_i = q_h (§27.3.1, enclosed buildings); G = 0.85 for a rigid building
(§26.11.1) unless given; C_p from Figure 27.3-1: walls (windward 0.8, leeward by L/B, side
walls −0.7) and roofs (wind normal to the ridge with θ ≥ 10°: windward and leeward by θ and h/L;
wind parallel to the ridge, or θ < 10°: by distance from the windward edge and h/L), with the
figure's linear interpolation between values of the same sign. Where the figure gives two roof
values, both are reported (C_p1, C_p2) and the roof is to be designed for each.

Refused (OutOfScopeError naming the limit): flexible buildings (natural frequency below 1 Hz:
G_f of §26.11.5); hip, monoslope and mansard roofs (the figure's notes for them are not
implemented); open or partially open buildings.

Sign convention: pressure positive toward the surface, suction negative.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.loads.derive import Derivation, is_us_customary, run_derivation
from calcpack.loads.wind_asce7 import (
    ASCE7_WIND,
    ENCLOSURES,
    WindSiteASCE7,
    internal_pressure_coefficient,
    record_velocity_pressure,
)
from calcpack.refdata import read_table
from calcpack.units import Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = [
    "DirectionalBuildingASCE7",
    "DirectionalWindASCE7",
    "SurfaceWind",
    "directional_cp_roof",
    "directional_wind_asce7",
]

Direction = Literal["normal to ridge", "parallel to ridge"]
RoofForm = Literal["gable", "flat"]
_FIG = "ASCE 7-16 Figure 27.3-1"
_TABLE = "asce7_16_wind_cp_ch27.csv"


@dataclass(frozen=True)
class DirectionalBuildingASCE7:
    """A rigid, enclosed or partially enclosed building and the wind direction considered.

    Attributes:
        h: mean roof height (eave height for θ ≤ 10°). B: horizontal dimension normal to the
            wind. L: horizontal dimension parallel to the wind. roof_slope: roof angle θ.
        direction: "normal to ridge" or "parallel to ridge". roof: "gable" or "flat".
        enclosure: §26.12 classification. G: gust-effect factor (0.85, rigid, §26.11.1).
        rigid: the engineer confirms the building is rigid (natural frequency ≥ 1 Hz, §26.11.2).
    """

    h: Quantity
    B: Quantity
    L: Quantity
    roof_slope: Quantity
    direction: Direction = "normal to ridge"
    roof: RoofForm = "gable"
    enclosure: str = "enclosed"
    G: float = 0.85
    rigid: bool = True

    def __post_init__(self) -> None:
        for name in ("h", "B", "L"):
            positive(name, dimension(name, getattr(self, name), "[length]"))
        dimension("roof_slope", self.roof_slope, "[]")
        within(
            "roof_slope",
            float(self.roof_slope.to("deg").magnitude),
            0.0,
            80.0,
            rule="roof angle in degrees",
        )
        one_of("direction", self.direction, ("normal to ridge", "parallel to ridge"))
        if self.roof in ("hip", "monoslope", "mansard"):
            raise OutOfScopeError(
                f"Input roof = {self.roof!r}: the directional procedure is implemented here for "
                "gable and flat roofs only (ASCE 7-16 Figure 27.3-1 notes for other roof forms "
                "are not implemented)"
            )
        one_of("roof", self.roof, ("gable", "flat"))
        if self.roof == "flat":
            within(
                "roof_slope",
                float(self.roof_slope.to("deg").magnitude),
                hi=10.0,
                inclusive=False,
                rule="a flat roof has θ < 10° (Figure 27.3-1)",
            )
        one_of("enclosure", self.enclosure, ENCLOSURES)
        if self.enclosure not in ("enclosed", "partially enclosed"):
            raise OutOfScopeError(
                f"Enclosure {self.enclosure!r}: ASCE 7-16 Chapter 27 Part 1 with Figure 27.3-1 "
                "is implemented here for enclosed and partially enclosed buildings only "
                "(input enclosure)"
            )
        if not self.rigid:
            raise OutOfScopeError(
                "Input rigid = False: a flexible building needs the gust-effect factor G_f of "
                "ASCE 7-16 §26.11.5, which is not implemented (limit: natural frequency ≥ 1 Hz)"
            )
        within(
            "G",
            float(self.G),
            0.0,
            1.0,
            inclusive=False,
            rule="G = 0.85 for rigid buildings (§26.11.1), or as calculated by §26.11.4",
        )

    @property
    def theta_deg(self) -> float:
        return float(self.roof_slope.to("deg").magnitude)

    @property
    def h_over_L(self) -> float:
        return float((self.h / self.L).to("").magnitude)


def _lerp(x0: float, y0: float, x1: float, y1: float, x: float) -> float:
    if x1 == x0:
        return y0
    t = min(max((x - x0) / (x1 - x0), 0.0), 1.0)
    return y0 + (y1 - y0) * t


def _by(xs: list[float], ys: list[float], x: float) -> float:
    """Piecewise-linear in x over (xs, ys), constant beyond the ends."""
    if x <= xs[0]:
        return ys[0]
    for i in range(1, len(xs)):
        if x <= xs[i]:
            return _lerp(xs[i - 1], ys[i - 1], xs[i], ys[i], x)
    return ys[-1]


def _rows(surface: str) -> list[Any]:
    t = read_table(_TABLE, key="key")
    return [r for r in t.rows.values() if r["surface"] == surface]


def _roof_normal(surface: str, hl: float, theta: float) -> tuple[float, float]:
    rows = _rows(surface)
    ratios = sorted({float(r["ratio"]) for r in rows})
    out = []
    for col in ("cp1", "cp2"):
        per_ratio = []
        for ratio in ratios:
            pts = sorted((float(r["at"]), float(r[col])) for r in rows if r["ratio"] == ratio)
            if surface == "windward roof" and theta >= 60.0:
                per_ratio.append(0.01 * theta)  # Figure 27.3-1: 0.01θ for θ ≥ 60°
                continue
            per_ratio.append(_by([p[0] for p in pts], [p[1] for p in pts], theta))
        out.append(_by(ratios, per_ratio, hl))
    return out[0], out[1]


def directional_cp_roof(
    b: DirectionalBuildingASCE7,
) -> list[tuple[str, float, float, float, float]]:
    """The roof's C_p by Figure 27.3-1: (surface, from, to (multiples of h from the windward
    edge, or 0, 0 for whole slopes), C_p1, C_p2)."""
    theta, hl = b.theta_deg, b.h_over_L
    if b.direction == "normal to ridge" and theta >= 10.0:
        w1, w2 = _roof_normal("windward roof", hl, theta)
        l1, _ = _roof_normal("leeward roof", hl, theta)
        return [("windward roof", 0.0, 0.0, w1, w2), ("leeward roof", 0.0, 0.0, l1, l1)]
    rows = _rows("parallel")
    tables = {}
    for ratio in (0.5, 1.0):
        tables[ratio] = sorted(
            (float(r["at"]), float(r["cp1"]), float(r["cp2"])) for r in rows if r["ratio"] == ratio
        )
    L_h = float((b.L / b.h).to("").magnitude)
    cuts = [x for x in (0.0, 0.5, 1.0, 2.0) if x < L_h] + [L_h]
    out = []
    for a, e in itertools.pairwise(cuts):
        mid = (a + e) / 2
        vals = []
        for ratio in (0.5, 1.0):
            cp = next(v for v in tables[ratio] if mid <= v[0])
            vals.append(cp)
        c1 = _by([0.5, 1.0], [vals[0][1], vals[1][1]], hl)
        c2 = _by([0.5, 1.0], [vals[0][2], vals[1][2]], hl)
        out.append((f"roof {a:g}h to {e:.3g}h", a, e, c1, c2))
    return out


def _leeward_wall(b: DirectionalBuildingASCE7) -> float:
    rows = sorted((float(r["ratio"]), float(r["cp1"])) for r in _rows("leeward wall"))
    lb = float((b.L / b.B).to("").magnitude)
    return _by([r[0] for r in rows], [r[1] for r in rows], lb)


@dataclass(frozen=True)
class SurfaceWind:
    """Design pressures on one surface (or roof zone) for one wind direction.

    Attributes:
        surface: its name. start, end: extent from the windward edge (roof zones), else None.
        Cp: external pressure coefficient (the roof's second value in Cp2, else equal).
        p: the pressures q G C_p − q_h (±GC_pi): with +GC_pi and −GC_pi, for C_p and C_p2.
    """

    surface: str
    start: Quantity | None
    end: Quantity | None
    Cp: float
    Cp2: float
    p: tuple[Quantity, ...]

    @property
    def most_negative(self) -> Quantity:
        return min(self.p)

    @property
    def most_positive(self) -> Quantity:
        return max(self.p)


@dataclass(frozen=True)
class DirectionalWindASCE7:
    """The result of :func:`directional_wind_asce7`: q_h, G, GC_pi and each surface's
    pressures, with the derivation (``working()``)."""

    building: DirectionalBuildingASCE7
    qh: Quantity
    G: float
    GCpi: float
    surfaces: tuple[SurfaceWind, ...]
    derivation: Derivation

    def surface(self, name: str) -> SurfaceWind:
        names = [s.surface for s in self.surfaces]
        found = one_of("surface", name, names)
        return self.surfaces[names.index(found)]

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def directional_wind_asce7(
    site: WindSiteASCE7, building: DirectionalBuildingASCE7
) -> DirectionalWindASCE7:
    """Wall and roof pressures by the directional procedure (ASCE 7-16 Chapter 27 Part 1)."""
    b = building
    gcpi = internal_pressure_coefficient(b.enclosure)
    us = is_us_customary(site.V)
    unit, lu = ("psf", "ft") if us else ("kN/m^2", "m")
    walls = [("windward wall", 0.8), ("leeward wall", _leeward_wall(b)), ("side walls", -0.7)]
    roof = directional_cp_roof(b)
    out: list[SurfaceWind] = []
    keep: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        r.assume(
            "Rigid building (natural frequency ≥ 1 Hz, §26.11.2); q_h is used on every surface, "
            "the windward wall included (conservative below the mean roof height)."
        )
        qh = record_velocity_pressure(r, site, b.h, "q_h")
        G = r.given(
            "G", float(b.G), "gust-effect factor, rigid building", source="ASCE 7-16 §26.11.1"
        )
        gi = r.given("GCpi", gcpi, f"{b.enclosure}, applied ±", source="ASCE 7-16 Table 26.13-1")
        r.given("h_L", b.h_over_L, "h/L (L parallel to the wind)", source="geometry")
        r.given("L_B", float((b.L / b.B).to("").magnitude), "L/B", source="geometry")
        r.text(
            f"Wind {b.direction}, roof angle θ = {b.theta_deg:.3g}°: C_p from {_FIG}, "
            "interpolated linearly between values of the same sign."
        )
        rows: list[tuple[str, float, float, float | None, float | None]]
        rows = [(n, cp, cp, None, None) for n, cp in walls]
        rows += [(n, c1, c2, a, e) for n, a, e, c1, c2 in roof]
        short = {"windward wall": "ww", "leeward wall": "lw", "side walls": "sw",
                 "windward roof": "wr", "leeward roof": "lr"}  # fmt: skip
        for idx, (n, c1, c2, a, e) in enumerate(rows):
            tag = short.get(n, f"r{idx - len(walls) + 1}")
            cps = [c1] if c1 == c2 else [c1, c2]
            ps = []
            for k, cp in enumerate(cps, start=1):
                sub = f"{tag}{k}" if len(cps) > 1 else tag
                C = r.given(f"C_p_{sub}", cp, n, source=_FIG)
                p1 = r.derive(
                    f"p_{sub}_ip",
                    qh * G * C - qh * gi,
                    f"{n}, with +GCpi",
                    unit=unit,
                    ref="ASCE 7-16 Eq. 27.3-1",
                )
                p2 = r.derive(
                    f"p_{sub}_in",
                    qh * G * C + qh * gi,
                    f"{n}, with −GCpi",
                    unit=unit,
                    ref="ASCE 7-16 Eq. 27.3-1",
                )
                ps += [r.q(p1), r.q(p2)]
            start = None if a is None or a == e == 0.0 else (a * b.h).to(lu)
            end = None if e is None or a == e == 0.0 else min(e * b.h, b.L).to(lu)
            if not r.shows:
                out.append(SurfaceWind(n, start, end, c1, c2, tuple(ps)))
        keep["qh"] = r.q(qh)

    d = run_derivation(
        f"Wind on the main frame, directional procedure ({b.direction})", ASCE7_WIND, logic
    )
    return DirectionalWindASCE7(b, keep["qh"], float(b.G), gcpi, tuple(out), d)
