"""Wind on the main frame of a building by the directional procedure, ASCE/SEI 7-16 Chapter 27
Part 1 (enclosed and partially enclosed buildings of all heights): walls and gable, hip,
monoslope or flat roofs, one wind direction at a time.

    p = q G C_p − q_i (GC_pi)        (Eq. 27.3-1)

q = q_z on the windward wall, evaluated at the top of each band of height (the heights of Table
26.10-1 below h, or the levels given; K_z with z at least 15 ft), so each band carries the
largest q_z within it; q = q_h on the leeward and side walls and the roof; q_i = q_h (§27.3.1,
enclosed buildings). G = 0.85 for a rigid building (§26.11.1) unless given; for a flexible
building (n_1 < 1 Hz) G_f of §26.11.5 (:mod:`calcpack.loads.wind_asce7_gust`). C_p from Figure
27.3-1: walls (windward 0.8, leeward by L/B, side walls −0.7) and roofs (wind normal to the
ridge with θ ≥ 10°: windward and leeward by θ and h/L; wind parallel to the ridge, or θ < 10°: by
distance from the windward edge and h/L), with the figure's linear interpolation between values
of the same sign. Where the figure gives two roof values, both are reported (C_p1, C_p2) and the
roof is to be designed for each.

Monoslope roofs: the whole roof is either a windward or a leeward surface (Figure 27.3-1 note),
as the wind meets the low or the high eave. Hip roofs: each slope takes the figure's value by
its orientation to the wind -- the slopes the wind meets or leaves by θ and h/L as windward and
leeward roofs, the slopes parallel to the wind by distance from the windward edge (common
practice; the figure's table is written for gable and hip roofs alike).

Mansard roofs (wind normal to the ridge): the windward inclined surface by θ and h/L as a
windward roof; the top surface and the leeward inclined surface as leeward surfaces of the
table (Figure 27.3-1 note, from memory), at θ; wind parallel: zones by distance.

Refused (OutOfScopeError naming the limit): open or partially open buildings;
``rigid=False`` without the natural frequency and damping of the building.

Sign convention: pressure positive toward the surface, suction negative.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.derive import Derivation, is_us_customary, run_derivation, steps_bundle
from calcpack.loads.wind_asce7 import (
    ASCE7_WIND,
    ENCLOSURES,
    WindSiteASCE7,
    internal_pressure_coefficient,
    profile_heights,
    record_velocity_pressure,
    velocity_pressure_at,
)
from calcpack.loads.wind_asce7_gust import BuildingVibration, record_gust_effect
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = [
    "DirectionalBuildingASCE7",
    "DirectionalWindASCE7",
    "SurfaceWind",
    "WindwardBand",
    "directional_cp_roof",
    "directional_wind_asce7",
]

Direction = Literal["normal to ridge", "parallel to ridge"]
RoofForm = Literal["gable", "hip", "monoslope", "mansard", "flat"]
Eave = Literal["low", "high"]
ROOF_FORMS: tuple[RoofForm, ...] = ("gable", "hip", "monoslope", "mansard", "flat")
_FIG = "ASCE 7-16 Figure 27.3-1"
_TABLE = "asce7_16_wind_cp_ch27.csv"


@dataclass(frozen=True)
class DirectionalBuildingASCE7:
    """A rigid, enclosed or partially enclosed building and the wind direction considered.

    Attributes:
        h: mean roof height (eave height for θ ≤ 10°). B: horizontal dimension normal to the
            wind. L: horizontal dimension parallel to the wind. roof_slope: roof angle θ.
        direction: "normal to ridge" or "parallel to ridge" (for a monoslope roof: normal to
            or along its eaves). roof: "gable", "hip", "monoslope" or "flat".
        enclosure: §26.12 classification. G: gust-effect factor of a rigid building (0.85,
            §26.11.1, or as calculated by §26.11.4).
        rigid: the engineer confirms the building is rigid (natural frequency ≥ 1 Hz, §26.11.2).
        vibration: natural frequency n_1 and damping β; with n_1 < 1 Hz the building is
            flexible and G_f of §26.11.5 replaces G.
        windward_eave: monoslope roofs with wind normal to the eaves: the wind meets the
            ``"low"`` eave (the roof is a windward surface) or the ``"high"`` one (leeward).
        hip_slope: slope of a hip roof's end slopes (default: roof_slope).
        mansard_top: a mansard roof's top surface, its plan width along the wind (the
            inclined surfaces at roof_slope take the rest of L equally).
        wall_levels: heights at which the windward wall's q_z steps (default: those of Table
            26.10-1 below h).
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
    vibration: BuildingVibration | None = None
    windward_eave: Eave = "low"
    hip_slope: Quantity | None = None
    mansard_top: Quantity | None = None
    wall_levels: tuple[Quantity, ...] | None = None

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
        one_of("roof", self.roof, ROOF_FORMS)
        if self.roof == "mansard":
            if self.mansard_top is None:
                raise InputError(
                    name="mansard_top",
                    value=None,
                    rule="is needed for a mansard roof",
                    expected="the plan width of the top surface along the wind, less than L",
                )
            dimension("mansard_top", self.mansard_top, "[length]")
            within("mansard_top", self.mansard_top, lo=Q_(0.0, "m"), hi=self.L,
                   inclusive=False, rule="the top lies inside the plan (0 < top < L)")  # fmt: skip
            within("roof_slope", float(self.roof_slope.to("deg").magnitude), lo=10.0,
                   rule="a mansard's inclined surfaces are steeper than 10°")  # fmt: skip
        one_of("windward_eave", self.windward_eave, ("low", "high"))
        if self.hip_slope is not None:
            dimension("hip_slope", self.hip_slope, "[]")
            within("hip_slope", float(self.hip_slope.to("deg").magnitude), 0.0, 80.0,
                   rule="roof angle in degrees")  # fmt: skip
        if self.wall_levels is not None:
            profile_heights(self.h, self.wall_levels)  # validates each level
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
        if not self.rigid and (self.vibration is None or not self.vibration.flexible):
            raise OutOfScopeError(
                "Input rigid = False: a flexible building needs its natural frequency n1 < 1 Hz "
                "and damping ratio (input vibration) for the gust-effect factor G_f of ASCE 7-16 "
                "§26.11.5; with n1 >= 1 Hz the building is rigid"
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

    @property
    def flexible(self) -> bool:
        return self.vibration is not None and self.vibration.flexible


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


Zone = tuple[str, float, float, float, float]


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


def _distance_zones(b: DirectionalBuildingASCE7, prefix: str) -> list[Zone]:
    """Roof zones by distance from the windward edge (wind parallel to the ridge, or θ < 10°)."""
    rows = _rows("parallel")
    tables = {}
    for ratio in (0.5, 1.0):
        tables[ratio] = sorted(
            (float(r["at"]), float(r["cp1"]), float(r["cp2"])) for r in rows if r["ratio"] == ratio
        )
    hl = b.h_over_L
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
        out.append((f"{prefix} {a:g}h to {e:.3g}h", a, e, c1, c2))
    return out


def _facing(b: DirectionalBuildingASCE7, theta: float, windward: str, leeward: str) -> list[Zone]:
    hl = b.h_over_L
    w1, w2 = _roof_normal("windward roof", hl, theta)
    l1, _ = _roof_normal("leeward roof", hl, theta)
    return [(windward, 0.0, 0.0, w1, w2), (leeward, 0.0, 0.0, l1, l1)]


def directional_cp_roof(b: DirectionalBuildingASCE7) -> list[Zone]:
    """The roof's C_p by Figure 27.3-1: (surface, from, to (multiples of h from the windward
    edge, or 0, 0 for whole slopes), C_p1, C_p2).

    Gable and flat roofs: windward and leeward slopes, or zones by distance. Monoslope roofs
    normal to the eaves with θ >= 10°: the whole roof windward or leeward. Hip roofs: the main
    slopes as a gable roof's, and the hip ends ("windward hip end", "leeward hip end" by the
    hip slope, or "hip ends ..." zones by distance when parallel to the wind).
    """
    theta = b.theta_deg
    normal = b.direction == "normal to ridge"
    if b.roof == "mansard" and normal and b.mansard_top is not None:
        w, lee = _facing(b, theta, "windward roof", "leeward roof")
        L_h = float((b.L / b.h).to("").magnitude)
        t_h = float((b.mansard_top / b.h).to("").magnitude)
        x1, x2 = (L_h - t_h) / 2, (L_h + t_h) / 2
        return [
            ("windward roof", 0.0, x1, w[3], w[4]),
            ("roof top", x1, x2, lee[3], lee[4]),
            ("leeward roof", x2, L_h, lee[3], lee[4]),
        ]
    if b.roof == "monoslope" and normal and theta >= 10.0:
        both = _facing(b, theta, "windward roof", "leeward roof")
        return [both[0] if b.windward_eave == "low" else both[1]]
    main = (
        _facing(b, theta, "windward roof", "leeward roof")
        if normal and theta >= 10.0
        else _distance_zones(b, "roof")
    )
    if b.roof != "hip":
        return main
    end = theta if b.hip_slope is None else float(b.hip_slope.to("deg").magnitude)
    if normal:  # below 10° the zones by distance already cover the whole roof
        return main + _distance_zones(b, "hip ends") if theta >= 10.0 else main
    if end >= 10.0:
        return main + _facing(b, end, "windward hip end", "leeward hip end")
    return main


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
class WindwardBand:
    """The windward wall from ``bottom`` to ``top`` (heights above ground), at the q_z of its top.

    Attributes:
        Kz, Kzt: the factors at ``top``. qz: velocity pressure at ``top``.
        p_pos_gcpi, p_neg_gcpi: q_z G C_p − q_h (GC_pi) with +GC_pi and with −GC_pi
            (toward the wall +).
    """

    bottom: Quantity
    top: Quantity
    Kz: float
    Kzt: float
    qz: Quantity
    p_pos_gcpi: Quantity
    p_neg_gcpi: Quantity


@dataclass(frozen=True)
class DirectionalWindASCE7:
    """The result of :func:`directional_wind_asce7`: q_h, G (or G_f), GC_pi, each surface's
    pressures and the windward wall's profile by height, with the derivation (``working()``,
    which ends with the elevation sketch)."""

    building: DirectionalBuildingASCE7
    qh: Quantity
    G: float
    GCpi: float
    surfaces: tuple[SurfaceWind, ...]
    derivation: Derivation
    windward_profile: tuple[WindwardBand, ...] = ()

    def surface(self, name: str) -> SurfaceWind:
        names = [s.surface for s in self.surfaces]
        found = one_of("surface", name, names)
        return self.surfaces[names.index(found)]

    def working(self, *, settings: Any = None) -> list[Any]:
        """The derivation's steps, then the elevation sketch of the pressures."""
        from calcpack.working.figure import Figure

        unit = f"{self.qh.units:~P}"
        sketch = Figure(
            "wind-elevation",
            self,
            caption=f"Wind {self.building.direction}: windward wall q_z profile by height, "
            f"leeward wall, side walls and roof at q_h, pressures with +GCpi in {unit} "
            "(+ toward the surface)",
            alt="Elevation of the building with the windward wall pressure stepping up with "
            "height to its value at the mean roof height, and the leeward wall suction",
            settings=settings,
        )
        return [*self.derivation.working(settings=settings), sketch]

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return steps_bundle(self.working(), self.derivation.title)


def directional_wind_asce7(
    site: WindSiteASCE7, building: DirectionalBuildingASCE7
) -> DirectionalWindASCE7:
    """Wall and roof pressures by the directional procedure (ASCE 7-16 Chapter 27 Part 1).

    Returns the surfaces' pressures (the windward wall's at z = h) and the windward wall's
    profile by bands of height (``windward_profile``), with the working and its sketch.
    """
    b = building
    gcpi = internal_pressure_coefficient(b.enclosure)
    us = is_us_customary(site.V)
    unit, lu = ("psf", "ft") if us else ("kN/m^2", "m")
    walls = [("windward wall", 0.8), ("leeward wall", _leeward_wall(b)), ("side walls", -0.7)]
    roof = directional_cp_roof(b)
    tops = profile_heights(b.h.to(lu), b.wall_levels)
    levels = [velocity_pressure_at(site, z) for z in tops]
    out: list[SurfaceWind] = []
    keep: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        if b.flexible:
            r.assume("Flexible building (n_1 < 1 Hz, §26.11.2): G_f of §26.11.5.")
        else:
            r.assume("Rigid building (natural frequency ≥ 1 Hz, §26.11.2).")
        qh = record_velocity_pressure(r, site, b.h, "q_h")
        if b.flexible:
            G = record_gust_effect(r, site, h=b.h, B=b.B, L=b.L, vibration=b.vibration)
        else:
            G = r.given(
                "G", float(b.G), "gust-effect factor, rigid building", source="ASCE 7-16 §26.11.1"
            )
        gi = r.given("GCpi", gcpi, f"{b.enclosure}, applied ±", source="ASCE 7-16 Table 26.13-1")
        r.given("h_L", b.h_over_L, "h/L (L parallel to the wind)", source="geometry")
        r.given("L_B", float((b.L / b.B).to("").magnitude), "L/B", source="geometry")
        r.text(
            f"Wind {b.direction}, {b.roof} roof, roof angle θ = {b.theta_deg:.3g}°: C_p from "
            f"{_FIG}, interpolated linearly between values of the same sign. Leeward and side "
            "walls and the roof take q_h; the windward wall takes q_z (below)."
        )
        if b.roof == "mansard" and b.direction == "normal to ridge":
            r.text(
                "Mansard roof: the top surface and the leeward inclined surface are leeward "
                "surfaces of the table (Figure 27.3-1 note), at the roof angle θ."
            )
        if b.roof == "hip":
            r.assume(
                "Hip roof: each slope takes the figure's value by its orientation to the wind "
                "(slopes facing or leaving the wind by their angle and h/L, slopes parallel to "
                "the wind by distance from the windward edge) -- common practice."
            )
        if b.roof == "monoslope" and b.direction == "normal to ridge" and b.theta_deg >= 10.0:
            r.text(
                f"Monoslope roof, wind meeting the {b.windward_eave} eave: the whole roof is a "
                + ("windward" if b.windward_eave == "low" else "leeward")
                + " surface (Figure 27.3-1 note)."
            )
        rows: list[tuple[str, float, float, float | None, float | None]]
        rows = [(n, cp, cp, None, None) for n, cp in walls]
        rows += [(n, c1, c2, a, e) for n, a, e, c1, c2 in roof]
        short = {"windward wall": "ww", "leeward wall": "lw", "side walls": "sw",
                 "windward roof": "wr", "leeward roof": "lr", "windward hip end": "wh",
                 "leeward hip end": "lh", "roof top": "rt"}  # fmt: skip
        for idx, (n, c1, c2, a, e) in enumerate(rows):
            tag = short.get(n, f"r{idx - len(walls) + 1}")
            cps = [c1] if c1 == c2 else [c1, c2]
            what = "windward wall at z = h" if n == "windward wall" else n
            ps = []
            for k, cp in enumerate(cps, start=1):
                sub = f"{tag}{k}" if len(cps) > 1 else tag
                C = r.given(f"C_p_{sub}", cp, n, source=_FIG)
                p1 = r.derive(
                    f"p_{sub}_ip",
                    qh * G * C - qh * gi,
                    f"{what}, with +GCpi",
                    unit=unit,
                    ref="ASCE 7-16 Eq. 27.3-1",
                )
                p2 = r.derive(
                    f"p_{sub}_in",
                    qh * G * C + qh * gi,
                    f"{what}, with −GCpi",
                    unit=unit,
                    ref="ASCE 7-16 Eq. 27.3-1",
                )
                ps += [r.q(p1), r.q(p2)]
            start = None if a is None or a == e == 0.0 else (a * b.h).to(lu)
            end = None if e is None or a == e == 0.0 else min(e * b.h, b.L).to(lu)
            if not r.shows:
                out.append(SurfaceWind(n, start, end, c1, c2, tuple(ps)))
        keep["qh"] = r.q(qh)
        keep["G"] = r.f(G)
        keep["bands"] = _windward_bands(r, tops, levels, r.q(qh), r.f(G), gcpi, unit)

    d = run_derivation(
        f"Wind on the main frame, directional procedure ({b.direction})", ASCE7_WIND, logic
    )
    return DirectionalWindASCE7(b, keep["qh"], keep["G"], gcpi, tuple(out), d, tuple(keep["bands"]))


def _windward_bands(
    r: Recorder,
    tops: tuple[Quantity, ...],
    levels: list[tuple[float, float, Quantity]],
    qh: Quantity,
    G: float,
    gcpi: float,
    unit: str,
) -> list[WindwardBand]:
    """The windward wall's pressure by bands of height, each at the q_z of its top."""
    r.heading("Windward wall: q_z with height", 4)
    r.text(
        "q_z = 0.00256 K_z K_zt K_d K_e V² (Eq. 26.10-1) with K_z = 2.01 (z/z_g)^(2/α), z at "
        "least 15 ft (Table 26.10-1 note 1), at the top of each band, so each band carries the "
        "largest q_z within it; p = q_z G C_p − q_h (±GC_pi) with C_p = 0.8 (Eq. 27.3-1)."
    )
    bands = []
    rows = []
    bottom = tops[0] * 0
    for z, (kz, kzt, qz) in zip(tops, levels, strict=True):
        q = qz.to(unit)
        p_in = q * G * 0.8 - qh * gcpi
        p_out = q * G * 0.8 + qh * gcpi
        bands.append(WindwardBand(bottom, z, kz, kzt, q, p_in, p_out))
        rows.append(
            [
                f"{bottom.magnitude:.4g} to {z.magnitude:.4g}",
                f"{kz:.3f}",
                f"{kzt:.3f}",
                f"{q.magnitude:.3g}",
                f"{p_in.magnitude:+.3g}",
                f"{p_out.magnitude:+.3g}",
            ]
        )
        bottom = z
    lu = f"{tops[0].units:~P}"
    r.table(
        [f"z ({lu})", "K_z", "K_zt", f"q_z ({unit})", f"p, +GCpi ({unit})", f"p, −GCpi ({unit})"],
        rows,
        "Windward wall pressure by height, ASCE 7-16 Eqs. 26.10-1 and 27.3-1 (+ toward the wall)",
    )
    return bands
