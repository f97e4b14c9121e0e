"""Wind: site data, velocity pressure and internal pressure to ASCE/SEI 7-16 Chapter 26.

q_z = 0.00256 K_z K_zt K_d K_e V² (psf, V in mph; Eq. 26.10-1) or 0.613 K_z K_zt K_d K_e V² (N/m²,
V in m/s), with K_d of Table 26.6-1 (0.85 for buildings), K_zt of §26.8 (1.0 on flat ground or
(1 + K1 K2 K3)² of Figure 26.8-1), K_e of Table 26.9-1 (exp(−0.0000362 z_g), z_g the ground
elevation in ft, or 1.0), K_z of Table 26.10-1 (2.01 (z/z_g)^(2/α), z at least 15 ft, α and z_g
of Table 26.11-1). Internal pressure coefficients GCpi by enclosure, Table 26.13-1.

Sign convention: pressures positive toward the surface (inward), suction negative.
Provisions must be confirmed against the edition adopted locally; the derivation must be
reviewed and sealed under licensed practice.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.loads.derive import Derivation, LoadStandard, is_us_customary, run_derivation
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, within

__all__ = [
    "ASCE7_WIND",
    "Topography",
    "VelocityPressureASCE7",
    "WindSiteASCE7",
    "internal_pressure_coefficient",
    "profile_heights",
    "velocity_pressure_asce7",
    "velocity_pressure_at",
]

ASCE7_WIND = LoadStandard("ASCE/SEI 7-16", "Chapters 26 to 30, Wind Loads")

Exposure = Literal["B", "C", "D"]
Enclosure = Literal["enclosed", "partially enclosed", "partially open", "open"]
TopoShape = Literal["2D ridge", "2D escarpment", "3D hill"]
EXPOSURES: tuple[Exposure, ...] = ("B", "C", "D")
ENCLOSURES: tuple[Enclosure, ...] = ("enclosed", "partially enclosed", "partially open", "open")
K_D_BUILDING = 0.85  # ASCE 7-16 Table 26.6-1, MWFRS and C&C of buildings (from memory)


@dataclass(frozen=True)
class Topography:
    """A hill, ridge or escarpment that speeds up the wind (ASCE 7-16 §26.8, Figure 26.8-1).

    Attributes:
        shape: ``"2D ridge"``, ``"2D escarpment"`` or ``"3D hill"``.
        H: height of the hill or escarpment relative to the upwind terrain [length].
        Lh: distance upwind of the crest to where the ground is half of H [length].
        x: distance from the crest to the building [length], negative upwind, positive downwind.
    """

    shape: TopoShape
    H: Quantity
    Lh: Quantity
    x: Quantity

    def __post_init__(self) -> None:
        one_of("shape", self.shape, ("2D ridge", "2D escarpment", "3D hill"))
        for name in ("H", "Lh"):
            dimension(name, getattr(self, name), "[length]")
            positive(name, getattr(self, name))
        dimension("x", self.x, "[length]")


@dataclass(frozen=True)
class WindSiteASCE7:
    """The site's wind data.

    Attributes:
        V: basic wind speed [speed] (3-s gust at 33 ft, exposure C) from the map of the risk
            category (Figures 26.5-1 and 26.5-2), with ``V_source`` saying which.
        exposure: ``"B"``, ``"C"`` or ``"D"`` (§26.7).
        ground_elevation: the site's elevation above sea level for K_e; None takes K_e = 1.0
            (permitted in all cases, Table 26.9-1 note).
        topography: the hill or escarpment, or None for flat ground (K_zt = 1.0).
    """

    V: Quantity
    V_source: str
    exposure: Exposure = "C"
    ground_elevation: Quantity | None = None
    topography: Topography | None = None

    def __post_init__(self) -> None:
        dimension("V", self.V, "[speed]")
        positive("V", self.V)
        within("V", self.V, hi=Q_(300.0, "mph"), rule="beyond the mapped wind speeds")
        non_empty(
            "V_source",
            self.V_source,
            expected="the wind speed map or study used, e.g. 'ASCE 7-16 Figure 26.5-1B (risk "
            "category II)'",
        )
        one_of("exposure", self.exposure, EXPOSURES)
        if self.ground_elevation is not None:
            dimension("ground_elevation", self.ground_elevation, "[length]")
            within("ground_elevation", self.ground_elevation, Q_(-500.0, "ft"), Q_(20000.0, "ft"))


@dataclass(frozen=True)
class VelocityPressureASCE7:
    """Velocity pressure at height z (psf or kN/m² following V's unit system).

    Attributes:
        z: the height. Kz, Kzt, Kd, Ke: the factors. qz: the velocity pressure.
    """

    z: Quantity
    Kz: float
    Kzt: float
    Kd: float
    Ke: float
    qz: Quantity
    derivation: Derivation

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def record_velocity_pressure(r: Recorder, site: WindSiteASCE7, z: Quantity, name: str) -> Any:
    """Record K_d, K_zt, K_e, K_z and q_z at height z (named ``name``, e.g. ``"q_h"``)."""
    us = is_us_customary(site.V)
    unit = "psf" if us else "kN/m^2"
    lu = "ft" if us else "m"
    V = r.given("V", site.V.to("mph" if us else "m/s"), "basic wind speed", source=site.V_source)
    Kd = r.given(
        "K_d",
        K_D_BUILDING,
        "wind directionality factor, buildings",
        source="ASCE 7-16 Table 26.6-1",
    )
    Kzt = _record_kzt(r, site, z)
    if site.ground_elevation is None:
        Ke = r.given(
            "K_e",
            1.0,
            "ground elevation factor (taken as 1.0)",
            source="ASCE 7-16 Table 26.9-1 note",
        )
    else:
        zg_ft = float(site.ground_elevation.to("ft").magnitude)
        Ke = r.given(
            "K_e",
            math.exp(-0.0000362 * zg_ft),
            f"ground elevation factor e^(−0.0000362 z_g), z_g = {zg_ft:.0f} ft",
            source="ASCE 7-16 Table 26.9-1",
        )
    row = read_table("asce7_16_wind_exposure.csv", key="exposure").row(site.exposure)
    alpha = r.given(
        "alpha", float(row["alpha"]), f"exposure {site.exposure}", source="ASCE 7-16 Table 26.11-1"
    )
    zg = r.given(
        "z_g",
        Q_(float(row["zg_ft"]), "ft").to(lu),
        f"exposure {site.exposure}",
        source="ASCE 7-16 Table 26.11-1",
    )
    zz = r.given("z", z.to(lu), "height above ground")
    z_eff = r.max(zz, Q_(15.0, "ft").to(lu))
    Kz = r.derive(
        "K_" + name.removeprefix("q_"),
        2.01 * (z_eff / zg) ** (2 / alpha),
        "velocity pressure exposure coefficient (z at least 15 ft)",
        unit="",
        ref="ASCE 7-16 Table 26.10-1 note 1",
    )
    c = Q_(0.00256, "psf/mph^2") if us else Q_(0.613, "N/m^2/(m/s)^2")
    return r.derive(
        name,
        Kz * Kzt * Kd * Ke * V**2 * c,
        "velocity pressure",
        unit=unit,
        ref="ASCE 7-16 Eq. 26.10-1",
    )


def _record_kzt(r: Recorder, site: WindSiteASCE7, z: Quantity) -> Any:
    t = site.topography
    if t is None:
        return r.given("K_zt", 1.0, "topographic factor, flat ground", source="ASCE 7-16 §26.8.2")
    ratio = float((t.H / t.Lh).to("").magnitude)
    H_ft = float(t.H.to("ft").magnitude)
    min_H = 60.0 if site.exposure == "B" else 15.0
    if ratio < 0.2 or H_ft < min_H:
        return r.given(
            "K_zt",
            1.0,
            f"topographic factor: H/L_h = {ratio:.3g} < 0.2 or H < {min_H:g} ft, no speed-up",
            source="ASCE 7-16 §26.8.1",
        )
    Lh = t.Lh
    if ratio > 0.5:  # Figure 26.8-1 note: H/Lh > 0.5, use 0.5 and Lh = 2H
        ratio, Lh = 0.5, 2 * t.H
    row = read_table("asce7_16_wind_topo.csv", key="shape").row(t.shape)
    x_ft = float(t.x.to("ft").magnitude)
    mu = float(row["mu_upwind"] if x_ft < 0 else row["mu_downwind"])
    Lh_ft = float(Lh.to("ft").magnitude)
    z_ft = float(z.to("ft").magnitude)
    K1 = float(row[f"K1_{site.exposure}"]) * ratio
    K2 = max(0.0, 1.0 - abs(x_ft) / (mu * Lh_ft))
    K3 = math.exp(-float(row["gamma"]) * z_ft / Lh_ft)
    src = f"ASCE 7-16 Figure 26.8-1, {t.shape}, exposure {site.exposure}"
    k1 = r.given("K_1", K1, f"K1 = (K1/(H/L_h))·H/L_h, H/L_h = {ratio:.3g}", source=src)
    k2 = r.given("K_2", K2, f"K2 = 1 − |x|/(μ L_h), μ = {mu:g}, x = {x_ft:.4g} ft", source=src)
    k3 = r.given("K_3", K3, f"K3 = e^(−γ z/L_h), z = {z_ft:.4g} ft", source=src)
    return r.derive(
        "K_zt", (1 + k1 * k2 * k3) ** 2, "topographic factor", unit="", ref="ASCE 7-16 Eq. 26.8-1"
    )


def velocity_pressure_asce7(site: WindSiteASCE7, z: Quantity) -> VelocityPressureASCE7:
    """Velocity pressure q_z at height z above ground (ASCE 7-16 §26.10), with its working."""
    dimension("z", z, "[length]")
    positive("z", z)
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        q = record_velocity_pressure(r, site, z, "q_z")
        out.update(
            q=r.q(q), Kz=r.f(r.values["K_z"]), Kzt=r.f(r.values["K_zt"]), Ke=r.f(r.values["K_e"])
        )

    d = run_derivation("Velocity pressure", ASCE7_WIND, logic)
    return VelocityPressureASCE7(z, out["Kz"], out["Kzt"], K_D_BUILDING, out["Ke"], out["q"], d)


def internal_pressure_coefficient(enclosure: str) -> float:
    """GCpi magnitude for an enclosure classification (ASCE 7-16 Table 26.13-1), applied ±."""
    one_of("enclosure", enclosure, ENCLOSURES)
    return float(read_table("asce7_16_wind_gcpi.csv", key="enclosure").row(enclosure)["GCpi"])


# Heights of Table 26.10-1 (ft): the stations of a windward wall's q_z profile
_TABLE_HEIGHTS_FT = (15, 20, 25, 30, 40, 50, 60, 70, 80, 90, 100, 120, 140, 160, 180, 200, 250,
                     300, 350, 400, 450, 500)  # fmt: skip
# metric stations near those heights (m); the first (5 m) lies above 15 ft, so the bottom band
# takes a q_z at least that of Table 26.10-1's first row (conservative)
_METRIC_HEIGHTS_M = (5, 6, 7.5, 9, 12, 15, 18, 21, 24, 27, 30, 36, 42, 48, 54, 60, 75, 90, 105,
                     120, 135, 150)  # fmt: skip


def profile_heights(
    h: Quantity, levels: tuple[Quantity, ...] | None = None
) -> tuple[Quantity, ...]:
    """The tops of the bands of a windward wall's q_z profile, increasing, ending at ``h``.

    Args:
        h: mean roof height [length]. levels: heights to use instead of the heights of
            Table 26.10-1 (15, 20, 25, 30, 40 ... ft) below h (in metres for an SI h: 5, 6,
            7.5, 9, 12 ... m).
    """
    dimension("h", h, "[length]")
    positive("h", h)
    if levels is None:
        us = is_us_customary(h)
        table, unit = (_TABLE_HEIGHTS_FT, "ft") if us else (_METRIC_HEIGHTS_M, "m")
        tops = [Q_(float(z), unit).to(h.units) for z in table if Q_(z, unit) < h]
    else:
        tops = []
        for i, z in enumerate(levels):
            dimension(f"levels[{i}]", z, "[length]")
            within(f"levels[{i}]", z, lo=Q_(0.0, "ft"), hi=h, inclusive=False,
                   rule="a level between the ground and the mean roof height h")  # fmt: skip
            tops.append(z.to(h.units))
        tops = sorted(set(tops), key=lambda q: float(q.magnitude))
    return (*tops, h)


def velocity_pressure_at(site: WindSiteASCE7, z: Quantity) -> tuple[float, float, Quantity]:
    """(K_z, K_zt, q_z) at height z by the same formulas as the working, without the working."""
    r = Recorder("q_z")
    q = record_velocity_pressure(r, site, z, "q_z")
    return r.f(r.values["K_z"]), r.f(r.values["K_zt"]), r.q(q)
