"""Wind: basic velocity and peak velocity pressure to EN 1991-1-4:2005+A1:2010, with the UK
National Annex or the recommended values; internal pressure coefficients (§7.2.9).

Units: pressures in kN/m², speeds in m/s, heights in m. Pressures positive toward the surface.

Clauses followed (from memory; confirm against the printed standard and annex):

* basic wind velocity v_b = c_dir·c_season·v_b,0 (Eq. 4.1), times c_prob where a return period
  other than 50 years is asked for (Eq. 4.2, given as an input). With the UK annex
  v_b,0 = v_b,map·c_alt (Eq. NA.1), c_alt = 1 + 0.001·A for z ≤ 10 m and
  1 + 0.001·A·(10/z)^0.2 above (Eq. NA.2a, NA.2b), A the site altitude in m;
* basic velocity pressure q_b = ½·ρ·v_b² (Eq. 4.10), ρ = 1.226 kg/m³ (UK annex) or 1.25 kg/m³
  (recommended);
* peak velocity pressure, recommended route: q_p(z) = [1 + 7·I_v(z)]·½·ρ·v_m(z)² (Eq. 4.8),
  v_m = c_r·c_o·v_b (Eq. 4.3), c_r = k_r·ln(z/z_0) with z at least z_min (Eq. 4.4),
  k_r = 0.19·(z_0/0.05)^0.07 (Eq. 4.5), I_v = 1/(c_o·ln(z/z_0)) (Eq. 4.7, k_I = 1), terrain
  categories of Table 4.1;
* peak velocity pressure, UK route: q_p(z) = c_e(z)·c_e,T·q_b, times ((c_o + 0.6)/1.6)² where
  orography is significant (NA.2.17, Figures NA.7 and NA.8). The exposure charts are not
  reproduced: the engineer reads c_e (and c_e,T in town) from them and gives them as inputs
  with their source; without them the UK route refuses.

Orography c_o (Annex A.3) is an input (1.0 on flat ground). The structural factor c_s·c_d is
1.0 for buildings under 15 m (§6.2(1)a); taller buildings are refused here.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import InputError
from calcpack.loads.derive import Derivation, LoadStandard, run_derivation
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, required, within

__all__ = [
    "EN1991_WIND",
    "EN1991_WIND_UK",
    "PeakPressureEN",
    "WindSiteEN",
    "internal_pressure_en",
    "peak_pressure_en",
]

EN1991_WIND = LoadStandard("EN 1991-1-4:2005+A1:2010", "Wind actions")
EN1991_WIND_UK = LoadStandard(
    "EN 1991-1-4:2005+A1:2010",
    "Wind actions",
    "the UK National Annex (NA to BS EN 1991-1-4:2005+A1:2010)",
)
Annex = Literal["UK", "recommended"]
Terrain = Literal["0", "I", "II", "III", "IV"]
TERRAINS: tuple[Terrain, ...] = ("0", "I", "II", "III", "IV")
RHO = {"UK": Q_(1.226, "kg/m^3"), "recommended": Q_(1.25, "kg/m^3")}  # §4.5(1) note 2
HEIGHT_MAX = Q_(15.0, "m")  # c_s c_d = 1 for buildings under 15 m, §6.2(1)a
KN_M2 = "kN/m^2"


def standard_for(annex: str) -> LoadStandard:
    """The LoadStandard of a wind derivation to ``annex``."""
    return EN1991_WIND_UK if annex == "UK" else EN1991_WIND


@dataclass(frozen=True)
class WindSiteEN:
    """The site's wind data.

    Attributes:
        vb_map: the map value [speed]: v_b,map of the UK annex map (Figure NA.1), or the
            fundamental basic wind velocity v_b,0 of the national annex with
            ``annex="recommended"``; ``vb_source`` names the map.
        annex: ``"UK"`` or ``"recommended"``.
        altitude: site altitude above sea level A [length] (UK annex c_alt).
        c_dir: directional factor (1.0, conservative, or the UK annex Table NA.1 value for the
            direction considered, with ``c_dir_source``). c_season: seasonal factor (1.0 for
            permanent works). c_prob: probability factor (1.0 for a 50-year return period).
        terrain: terrain category of Table 4.1 (recommended route).
        c_o: orography factor (1.0 on flat ground; Annex A.3 otherwise, ``c_o_source``).
        c_e, c_eT: exposure factor and its town correction read from the UK annex Figures NA.7
            and NA.8 (UK route; ``c_e_source`` names the figure and the distances used).
    """

    vb_map: Quantity
    vb_source: str
    annex: Annex = "UK"
    altitude: Quantity | None = None
    c_dir: float = 1.0
    c_dir_source: str = "taken as 1.0 (conservative)"
    c_season: float = 1.0
    c_prob: float = 1.0
    terrain: Terrain = "II"
    c_o: float = 1.0
    c_o_source: str = "flat ground"
    c_e: float | None = None
    c_eT: float = 1.0
    c_e_source: str = ""

    def __post_init__(self) -> None:
        dimension("vb_map", self.vb_map, "[speed]")
        positive("vb_map", self.vb_map)
        within("vb_map", self.vb_map.to("m/s"), hi=Q_(60.0, "m/s"), rule="beyond mapped values")
        non_empty("vb_source", self.vb_source, expected="the wind map used ('UK NA Figure NA.1')")
        one_of("annex", self.annex, ("UK", "recommended"))
        one_of("terrain", self.terrain, TERRAINS)
        within("c_dir", self.c_dir, 0.7, 1.0, rule="directional factor, at most 1.0 (§4.2(2))")
        within("c_season", self.c_season, 0.5, 1.0, rule="seasonal factor (§4.2(2))")
        within("c_prob", self.c_prob, 0.5, 1.2, rule="probability factor (Eq. 4.2)")
        within("c_o", self.c_o, 1.0, 2.0, rule="orography factor of Annex A.3 (1.0 on flat ground)")
        within("c_eT", self.c_eT, 0.5, 1.0, rule="UK NA Figure NA.8 town correction")
        if self.annex == "UK":
            required(
                "altitude",
                self.altitude,
                expected="the site altitude above sea level, e.g. Q_(85, 'm')",
                when="with the UK annex (c_alt = 1 + 0.001·A, UK NA Eq. NA.2)",
            )
            if self.c_e is None or not self.c_e_source.strip():
                raise InputError(
                    "Input c_e (with c_e_source) is required with the UK annex "
                    f"(got c_e = {self.c_e!r}): read it from UK NA Figure NA.7 for z − h_dis "
                    "and the distance upwind to the shoreline",
                    name="c_e",
                    value=self.c_e,
                    expected="the exposure factor of UK NA Figure NA.7, about 1.5 to 4",
                )
            within("c_e", self.c_e, 1.0, 5.0, rule="UK NA Figure NA.7 exposure factor")
        if self.altitude is not None:
            dimension("altitude", self.altitude, "[length]")
            within("altitude", self.altitude.to("m"), Q_(0.0, "m"), Q_(1000.0, "m"))


@dataclass(frozen=True)
class PeakPressureEN:
    """Peak velocity pressure at the reference height z_e (kN/m²) with the derivation."""

    z: Quantity
    vb: Quantity
    qb: Quantity
    qp: Quantity
    annex: str
    derivation: Derivation

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def record_peak_pressure(r: Recorder, site: WindSiteEN, z: Quantity) -> Any:
    """Record v_b, q_b and q_p at height z; returns q_p (kN/m²)."""
    uk = site.annex == "UK"
    zz = r.given("z_e", z.to("m"), "reference height")
    if uk:
        assert site.altitude is not None
        vmap = r.given(
            "v_b_map", site.vb_map.to("m/s"), "basic wind velocity, map", source=site.vb_source
        )
        A = r.given("A", site.altitude.to("m"), "site altitude above sea level")
        if z <= Q_(10.0, "m"):
            calt = r.derive(
                "c_alt",
                1 + 0.001 * A / Q_(1.0, "m"),
                "altitude factor (z ≤ 10 m)",
                unit="",
                ref="UK NA Eq. NA.2a",
            )
        else:
            calt = r.derive(
                "c_alt",
                1 + 0.001 * A / Q_(1.0, "m") * (Q_(10.0, "m") / zz) ** 0.2,
                "altitude factor (z > 10 m)",
                unit="",
                ref="UK NA Eq. NA.2b",
            )
        vb0 = r.derive(
            "v_b_0",
            vmap * calt,
            "fundamental basic wind velocity",
            unit="m/s",
            ref="UK NA Eq. NA.1",
        )
    else:
        vb0 = r.given(
            "v_b_0", site.vb_map.to("m/s"), "fundamental basic wind velocity", source=site.vb_source
        )
    cdir = r.given("c_dir", site.c_dir, "directional factor", source=site.c_dir_source)
    cs = r.given("c_season", site.c_season, "seasonal factor", source="EN 1991-1-4 §4.2(2)")
    cp = r.given("c_prob", site.c_prob, "probability factor", source="EN 1991-1-4 Eq. 4.2")
    vb = r.derive(
        "v_b", cdir * cs * cp * vb0, "basic wind velocity", unit="m/s", ref="EN 1991-1-4 Eq. 4.1"
    )
    rho = r.given(
        "rho",
        RHO[site.annex],
        "air density",
        source="UK NA §4.5(1)" if uk else "EN 1991-1-4 §4.5(1)",
    )
    qb = r.derive(
        "q_b", 0.5 * rho * vb**2, "basic velocity pressure", unit=KN_M2, ref="EN 1991-1-4 Eq. 4.10"
    )
    co = r.given("c_o", site.c_o, "orography factor", source=site.c_o_source)
    if uk:
        assert site.c_e is not None
        ce = r.given("c_e", site.c_e, "exposure factor", source=site.c_e_source)
        ceT = r.given(
            "c_eT", site.c_eT, "town correction (1.0 in country terrain)", source=site.c_e_source
        )
        if site.c_o > 1.0:
            return r.derive(
                "q_p",
                ce * ceT * qb * ((co + 0.6) / 1.6) ** 2,
                "peak velocity pressure, orography significant",
                unit=KN_M2,
                ref="UK NA to BS EN 1991-1-4 NA.2.17 (from memory)",
            )
        return r.derive(
            "q_p",
            ce * ceT * qb,
            "peak velocity pressure",
            unit=KN_M2,
            ref="UK NA Eq. NA.3 (from memory)",
        )
    row = read_table("en1991_1_4_terrain.csv", key="category").row(site.terrain)
    src = f"EN 1991-1-4 Table 4.1, terrain category {site.terrain}"
    z0 = r.given("z_0", Q_(float(row["z0_m"]), "m"), "roughness length", source=src)
    zmin = r.given("z_min", Q_(float(row["zmin_m"]), "m"), "minimum height", source=src)
    kr = r.derive(
        "k_r",
        0.19 * (z0 / Q_(0.05, "m")) ** 0.07,
        "terrain factor",
        unit="",
        ref="EN 1991-1-4 Eq. 4.5",
    )
    z_eff = max(z.to("m"), r.q(zmin))
    ln = r.given(
        "ln_z",
        math.log(float((z_eff / r.q(z0)).to("").magnitude)),
        f"ln(z/z_0) with z = max(z_e, z_min) = {z_eff.magnitude:.4g} m",
        source="EN 1991-1-4 Eq. 4.4",
    )
    cr = r.derive("c_r", kr * ln, "roughness factor", unit="", ref="EN 1991-1-4 Eq. 4.4")
    vm = r.derive("v_m", cr * co * vb, "mean wind velocity", unit="m/s", ref="EN 1991-1-4 Eq. 4.3")
    Iv = r.derive(
        "I_v", 1 / (co * ln), "turbulence intensity (k_I = 1)", unit="", ref="EN 1991-1-4 Eq. 4.7"
    )
    return r.derive(
        "q_p",
        (1 + 7 * Iv) * 0.5 * rho * vm**2,
        "peak velocity pressure",
        unit=KN_M2,
        ref="EN 1991-1-4 Eq. 4.8",
    )


def peak_pressure_en(site: WindSiteEN, z: Quantity) -> PeakPressureEN:
    """Peak velocity pressure q_p at the reference height z (EN 1991-1-4 §4.5), with working."""
    dimension("z", z, "[length]")
    positive("z", z)
    within(
        "z",
        z.to("m"),
        hi=HEIGHT_MAX,
        rule="this module covers buildings under 15 m (c_s c_d = 1, §6.2(1)a)",
    )
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        q = record_peak_pressure(r, site, z)
        out.update(qp=r.q(q), vb=r.q(r.values["v_b"]), qb=r.q(r.values["q_b"]))

    d = run_derivation("Peak velocity pressure", standard_for(site.annex), logic)
    return PeakPressureEN(z.to("m"), out["vb"], out["qb"], out["qp"], site.annex, d)


def internal_pressure_en(
    dominant_ratio: float | None = None, cpe_dominant: float | None = None
) -> tuple[float, ...]:
    """Internal pressure coefficients c_pi (EN 1991-1-4 §7.2.9).

    Without a dominant face: the more onerous of +0.2 and −0.3 (§7.2.9(6) note 2), returned as
    ``(0.2, -0.3)``. With a dominant face (its openings at least twice those of the other
    faces): c_pi = 0.75·c_pe (ratio 2) or 0.90·c_pe (ratio 3 or more), linear between
    (§7.2.9(5)), returned as a one-element tuple.
    """
    if dominant_ratio is None:
        return (0.2, -0.3)
    within(
        "dominant_ratio",
        dominant_ratio,
        lo=2.0,
        rule="a dominant face has at least twice the openings (§7.2.9(3))",
    )
    if cpe_dominant is None or not math.isfinite(cpe_dominant):
        raise InputError(
            "Input cpe_dominant is required with a dominant face "
            f"(got cpe_dominant = {cpe_dominant!r})",
            name="cpe_dominant",
            value=cpe_dominant,
            expected="c_pe at the openings of the dominant face",
        )
    k = 0.75 + 0.15 * min(dominant_ratio - 2.0, 1.0)
    return (k * cpe_dominant,)
