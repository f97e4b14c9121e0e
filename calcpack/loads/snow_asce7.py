"""Roof snow loads to ASCE/SEI 7-16 Chapter 7: flat, sloped, minimum, partial, unbalanced,
rain-on-snow.

Units: loads are pressures on the horizontal projection of the roof (psf or kN/m², in the unit
system of the ground snow load given), downward positive. The empirical equations of the
standard are in ft and psf; SI inputs are converted, the result is reported in kN/m².

Clauses: §7.3 (p_f = 0.7 C_e C_t I_s p_g, Eq. 7.3-1), §7.3.4 minimum p_m, §7.4 sloped roof factor
C_s (Figure 7.4-1), §7.5 partial loading, §7.6.1 unbalanced loads on hip and gable roofs,
§7.10 rain-on-snow surcharge; tables 7.3-1 (C_e), 7.3-2 (C_t), 1.5-2 (I_s) as data files.

Outside the provisions covered (roof slope of 70° or more is still covered, C_s = 0; curved,
sawtooth and dome roofs are not) the functions refuse with an error naming the input.
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
    "ASCE7_SNOW",
    "RoofSnowASCE7",
    "SnowRoofASCE7",
    "SnowSiteASCE7",
    "drift_height_asce7",
    "roof_snow_asce7",
    "snow_density_asce7",
]

ASCE7_SNOW = LoadStandard("ASCE/SEI 7-16", "Chapter 7, Snow Loads")

Terrain = Literal["B", "C", "D", "above treeline", "Alaska"]
Exposure = Literal["fully exposed", "partially exposed", "sheltered"]
Thermal = Literal["heated", "cold ventilated", "unheated", "freezer", "greenhouse"]
Risk = Literal["I", "II", "III", "IV"]
Surface = Literal["slippery", "non-slippery"]
RoofShape = Literal["gable", "hip", "monoslope", "flat"]

TERRAINS: tuple[Terrain, ...] = ("B", "C", "D", "above treeline", "Alaska")
EXPOSURES: tuple[Exposure, ...] = ("fully exposed", "partially exposed", "sheltered")
THERMALS: tuple[Thermal, ...] = ("heated", "cold ventilated", "unheated", "freezer", "greenhouse")
RISKS: tuple[Risk, ...] = ("I", "II", "III", "IV")


@dataclass(frozen=True)
class SnowSiteASCE7:
    """The site and building data that set the flat-roof snow load.

    Attributes:
        pg: ground snow load [force/area] (§7.2), ``>= 0``, with ``pg_source`` saying where it
            comes from (the Figure 7.2-1 map, a site-specific case study, the building code).
        terrain: surface roughness category of §26.7 (``"B"``, ``"C"``, ``"D"``) or the two
            special rows of Table 7.3-1. exposure: roof exposure of Table 7.3-1.
        thermal: thermal condition of Table 7.3-2. risk_category: Table 1.5-1 (sets I_s).
    """

    pg: Quantity
    pg_source: str
    terrain: Terrain = "C"
    exposure: Exposure = "partially exposed"
    thermal: Thermal = "heated"
    risk_category: Risk = "II"

    def __post_init__(self) -> None:
        dimension("pg", self.pg, "[force] / [length] ** 2")
        positive("pg", self.pg, allow_zero=True)
        within(
            "pg",
            self.pg,
            hi=Q_(300.0, "psf"),
            rule="ASCE 7-16 §7.2: above this a "
            "site-specific case study governs (calcpack covers mapped values only)",
        )
        non_empty(
            "pg_source",
            self.pg_source,
            expected="where the ground snow load comes from, e.g. 'ASCE 7-16 Figure 7.2-1' or "
            "the local building code",
        )
        one_of("terrain", self.terrain, TERRAINS)
        one_of("exposure", self.exposure, EXPOSURES)
        one_of("thermal", self.thermal, THERMALS)
        one_of("risk_category", self.risk_category, RISKS)
        if self.exposure == "sheltered" and self.terrain in ("above treeline", "Alaska"):
            from calcpack.errors import InputError

            raise InputError(
                f"Input exposure = 'sheltered' is not applicable for terrain = "
                f"{self.terrain!r} (ASCE 7-16 Table 7.3-1)",
                name="exposure",
                value=self.exposure,
                expected="'fully exposed' or 'partially exposed'",
            )


@dataclass(frozen=True)
class SnowRoofASCE7:
    """The roof: shape, slope, eave-to-ridge distance and surface.

    Attributes:
        shape: ``"gable"``, ``"hip"``, ``"monoslope"`` or ``"flat"``.
        slope: roof angle θ from horizontal [angle], 0° to 90°.
        W: horizontal distance from eave to ridge [length] (§7.6.1; for a monoslope, the
            horizontal width of the roof).
        surface: ``"slippery"`` (metal, slate, glass, membranes...) is used with the dashed
            lines of Figure 7.4-1 only if the roof is unobstructed and, for warm roofs, has the
            insulation §7.4.1 asks for. prismatic_ridge_to_eave: the members are simply supported
            prismatic members spanning ridge to eave (the W <= 20 ft case of §7.6.1).
    """

    shape: RoofShape
    slope: Quantity
    W: Quantity
    surface: Surface = "non-slippery"
    prismatic_ridge_to_eave: bool = False

    def __post_init__(self) -> None:
        one_of("shape", self.shape, ("gable", "hip", "monoslope", "flat"))
        dimension("slope", self.slope, "[]")
        within("slope", self.slope.to("deg"), Q_(0.0, "deg"), Q_(90.0, "deg"))
        dimension("W", self.W, "[length]")
        positive("W", self.W)
        one_of("surface", self.surface, ("slippery", "non-slippery"))


# Eq. 7.7-1 in US and SI units as printed (from memory): gamma = a pg + b <= cap. Figure 7.7-1's
# h_d = 0.43 lu^(1/3) (pg + 10)^(1/4) - 1.5 (ft, psf) is used in its US form for SI inputs too,
# the quantities converted exactly (its SI form has rounded constants).
_US = {"a": Q_(0.13, "1/ft"), "b": Q_(14.0, "pcf"), "cap": Q_(30.0, "pcf")}
_SI = {"a": Q_(0.426, "1/m"), "b": Q_(2.2, "kN/m^3"), "cap": Q_(4.7, "kN/m^3")}
_HD = {
    "k": 0.43,
    "c": 10.0,
    "e": 1.5,
    "L": Q_(1.0, "ft"),
    "P": Q_(1.0, "psf"),
    "lu_min": Q_(20.0, "ft"),
}


def _consts(us: bool) -> dict[str, Any]:
    return _US if us else _SI


def record_density(r: Recorder, pg: Any, us: bool) -> Any:
    """Record the snow density γ = 0.13 p_g + 14 <= 30 pcf (SI 0.426 p_g + 2.2 <= 4.7 kN/m³)."""
    c = _consts(us)
    return r.derive(
        "gamma",
        r.min(pg * c["a"] + c["b"], c["cap"]),
        "snow density",
        unit="pcf" if us else "kN/m^3",
        ref="ASCE 7-16 Eq. 7.7-1",
    )


def record_drift_height(
    r: Recorder, name: str, lu: Any, pg: Any, us: bool, description: str, ref: str
) -> Any:
    """Record h_d = 0.43 ∛l_u ∜(p_g + 10) − 1.5 (l_u, h_d in ft, p_g in psf)
    with l_u taken as at least 20 ft (ASCE 7-16 Figure 7.7-1), shown in ft or m."""
    c = _HD
    lu_eff = r.max(lu, c["lu_min"] if us else c["lu_min"].to("m"))
    return r.derive(
        name,
        (c["k"] * (lu_eff / c["L"]) ** (1 / 3) * (pg / c["P"] + c["c"]) ** (1 / 4) - c["e"])
        * c["L"],
        description,
        unit="ft" if us else "m",
        ref=ref,
    )


def snow_density_asce7(pg: Quantity) -> Quantity:
    """Snow density γ (ASCE 7-16 Eq. 7.7-1) for a ground snow load p_g, in its unit system."""
    dimension("pg", pg, "[force] / [length] ** 2")
    return Recorder("").q(record_density(Recorder(""), pg, is_us_customary(pg)))


def drift_height_asce7(lu: Quantity, pg: Quantity) -> Quantity:
    """Drift height h_d for an upwind fetch l_u and ground snow load p_g (ASCE 7-16 Figure 7.7-1).

    In ft for US inputs, m for SI; l_u is taken as at least 20 ft (6.1 m).
    """
    dimension("lu", lu, "[length]")
    dimension("pg", pg, "[force] / [length] ** 2")
    positive("lu", lu)
    positive("pg", pg, allow_zero=True)
    return Recorder("").q(
        record_drift_height(Recorder(""), "h_d", lu, pg, is_us_customary(pg), "", "")
    )


@dataclass(frozen=True)
class RoofSnowASCE7:
    """Roof snow loads (pressures on plan, downward +) with the derivation's working.

    Attributes:
        pf: flat roof snow load. pm: minimum snow load (None where §7.3.4 does not apply).
        Cs: slope factor. ps: sloped roof (balanced) snow load C_s p_f.
        rain_on_snow: the §7.10 surcharge (zero where it does not apply).
        balanced: the uniform design load, the larger of p_s + rain-on-snow and p_m.
        partial: the half-balanced load 0.5 p_s of §7.5 (None where not required).
        unbalanced_windward, unbalanced_leeward: §7.6.1 uniform loads (None if not required).
        surcharge, surcharge_width: the leeward rectangular surcharge h_d γ / √S and its
            width from the ridge 8 √S h_d / 3 (None if not part of the case).
        notes: what was not required and why.
        derivation: values and working.
    """

    pf: Quantity
    pm: Quantity | None
    Cs: float
    ps: Quantity
    rain_on_snow: Quantity
    balanced: Quantity
    partial: Quantity | None
    unbalanced_windward: Quantity | None
    unbalanced_leeward: Quantity | None
    surcharge: Quantity | None
    surcharge_width: Quantity | None
    notes: tuple[str, ...]
    derivation: Derivation

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def _cs_curve(thermal: Thermal, surface: Surface) -> str:
    ct = float(read_table("asce7_16_snow_ct.csv", key="thermal").row(thermal)["Ct"])
    kind = "slippery" if surface == "slippery" else "other"
    if ct <= 1.0:
        return f"warm {kind}"
    if ct < 1.2:
        return f"Ct 1.1 {kind}"
    return f"Ct 1.2 {kind}"


def roof_snow_asce7(site: SnowSiteASCE7, roof: SnowRoofASCE7) -> RoofSnowASCE7:
    """Balanced, minimum, partial, unbalanced and rain-on-snow loads on one roof (ASCE 7-16 Ch. 7).

    Returns pressures on plan in the unit system of ``site.pg`` (psf or kN/m²), downward +.
    """
    us = is_us_customary(site.pg)
    unit = "psf" if us else "kN/m^2"
    len_unit = "ft" if us else "m"
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        ce_row = read_table("asce7_16_snow_ce.csv", key="terrain").row(site.terrain)
        ct = float(read_table("asce7_16_snow_ct.csv", key="thermal").row(site.thermal)["Ct"])
        i_s = float(
            read_table("asce7_16_snow_is.csv", key="risk_category").row(site.risk_category)["Is"]
        )
        r.heading("Flat roof snow load", 3)
        pg = r.given("p_g", site.pg.to(unit), "ground snow load", source=site.pg_source)
        Ce = r.given(
            "C_e",
            float(ce_row[site.exposure]),
            f"exposure factor, terrain {site.terrain}, {site.exposure}",
            source="ASCE 7-16 Table 7.3-1",
        )
        Ct = r.given("C_t", ct, f"thermal factor, {site.thermal}", source="ASCE 7-16 Table 7.3-2")
        Is = r.given(
            "I_s",
            i_s,
            f"importance factor, risk category {site.risk_category}",
            source="ASCE 7-16 Table 1.5-2",
        )
        pf = r.derive(
            "p_f",
            0.7 * Ce * Ct * Is * pg,
            "flat roof snow load",
            unit=unit,
            ref="ASCE 7-16 Eq. 7.3-1",
        )
        theta_deg = float(roof.slope.to("deg").magnitude)
        pg_psf = float(site.pg.to("psf").magnitude)
        pm: Any = None
        if roof.shape != "flat" and theta_deg >= 15.0:
            r.text("Minimum snow load p_m does not apply: roof slope 15° or more (§7.3.4).")
        elif pg_psf <= 20.0:
            pm = r.derive(
                "p_m",
                Is * pg,
                "minimum snow load (p_g <= 20 psf)",
                unit=unit,
                ref="ASCE 7-16 §7.3.4",
            )
        else:
            pm = r.derive(
                "p_m",
                Is * Q_(20.0, "psf").to(unit),
                "minimum snow load (p_g > 20 psf)",
                unit=unit,
                ref="ASCE 7-16 §7.3.4",
            )
        out["pm"] = None if pm is None else r.q(pm)

        r.heading("Sloped roof snow load", 3)
        theta = r.given("theta", roof.slope.to("deg"), "roof slope")
        curve = _cs_curve(site.thermal, roof.surface)
        row = read_table("asce7_16_snow_cs.csv", key="curve").row(curve)
        t1 = Q_(float(row["theta_1"]), "deg")
        fig = f"ASCE 7-16 Figure {row['figure']}"
        if roof.surface == "slippery":
            r.assume(
                "The roof surface is slippery and unobstructed (nothing stops snow sliding off "
                "the eaves), and a warm roof has the insulation §7.4.1 asks for."
            )
        if theta_deg <= t1.magnitude:
            Cs = r.given("C_s", 1.0, f"slope factor (θ <= {t1.magnitude:g}°)", source=fig)
        elif theta_deg >= 70.0:
            Cs = r.given("C_s", 0.0, "slope factor (θ >= 70°)", source=fig)
        else:
            Cs = r.derive(
                "C_s", 1 - (theta - t1) / (Q_(70.0, "deg") - t1), "slope factor", unit="", ref=fig
            )
        ps = r.derive(
            "p_s", Cs * pf, "sloped roof (balanced) snow load", unit=unit, ref="ASCE 7-16 Eq. 7.4-1"
        )
        notes: list[str] = []

        # Rain-on-snow surcharge, §7.10: 0 < pg <= 20 psf and slope (deg) < W/50 (W in ft).
        w_ft = float(roof.W.to("ft").magnitude)
        ros = Q_(0.0, unit)
        if 0.0 < pg_psf <= 20.0 and theta_deg < w_ft / 50.0:
            ros_q = r.given(
                "p_ros",
                Q_(5.0, "psf").to(unit),
                "rain-on-snow surcharge "
                f"(0 < p_g <= 20 psf and θ = {theta_deg:.3g}° < W/50 = "
                f"{w_ft / 50.0:.3g}°)",
                source="ASCE 7-16 §7.10",
            )
            ros = r.q(ros_q)
            bal_ros = r.derive(
                "p_s_ros",
                ps + ros_q,
                "balanced load with rain-on-snow",
                unit=unit,
                ref="ASCE 7-16 §7.10",
            )
        else:
            bal_ros = ps
            notes.append("Rain-on-snow surcharge not required (ASCE 7-16 §7.10).")
            r.text(notes[-1])
        balanced = bal_ros if pm is None else r.max(bal_ros, pm)
        bal = r.derive("p_bal", balanced, "uniform design snow load", unit=unit)
        out["balanced"] = r.q(bal)

        # Partial loading, §7.5.
        partial: Any = None
        if roof.shape in ("gable", "hip") and theta_deg >= 2.38:
            notes.append(
                "Partial loading not required for members spanning perpendicular to the ridge "
                "(slope >= 2.38°, ASCE 7-16 §7.5); other continuous members take 0.5 p_s."
            )
            r.text(notes[-1])
        partial = r.derive(
            "p_partial",
            0.5 * ps,
            "half balanced load on alternate spans",
            unit=unit,
            ref="ASCE 7-16 §7.5",
        )
        out["partial"] = r.q(partial)

        # Unbalanced loads, §7.6.1 (hip and gable roofs).
        out["ww"] = out["lw"] = out["sur"] = out["surw"] = None
        if roof.shape not in ("gable", "hip"):
            notes.append(f"Unbalanced loads of §7.6.1 are for hip and gable roofs ({roof.shape}).")
            r.text(notes[-1])
        elif theta_deg > 30.2 or theta_deg < 2.38:
            notes.append(
                "Unbalanced snow loads not required: slope outside 2.38° (1/2 on 12) to 30.2° "
                "(7 on 12), ASCE 7-16 §7.6.1."
            )
            r.text(notes[-1])
        else:
            r.heading("Unbalanced snow load (hip and gable roofs)", 3)
            W = r.given("W", roof.W.to(len_unit), "horizontal eave-to-ridge distance")
            if w_ft <= 20.0 and roof.prismatic_ridge_to_eave:
                r.text(
                    "W <= 20 ft with simply supported prismatic members from ridge to eave: "
                    "windward side unloaded, leeward side I_s p_g (§7.6.1)."
                )
                out["ww"] = Q_(0.0, unit)
                lw = r.derive(
                    "p_leeward",
                    Is * pg,
                    "leeward unbalanced load",
                    unit=unit,
                    ref="ASCE 7-16 §7.6.1",
                )
                out["lw"] = r.q(lw)
            else:
                ww = r.derive(
                    "p_windward",
                    0.3 * ps,
                    "windward unbalanced load",
                    unit=unit,
                    ref="ASCE 7-16 §7.6.1",
                )
                out["ww"] = r.q(ww)
                out["lw"] = r.q(ps)
                r.text("Leeward side: p_s plus a rectangular surcharge from the ridge.")
                gam = record_density(r, pg, us)
                hd = record_drift_height(
                    r,
                    "h_d",
                    W,
                    pg,
                    us,
                    "drift height with W for l_u",
                    "ASCE 7-16 Figure 7.7-1 (via §7.6.1)",
                )
                S = r.given(
                    "S",
                    1.0 / math.tan(math.radians(theta_deg)),
                    "roof slope as run for a rise of 1 (1/tan θ)",
                )
                sur = r.derive(
                    "p_sur",
                    hd * gam / r.sqrt(S),
                    "leeward surcharge intensity",
                    unit=unit,
                    ref="ASCE 7-16 §7.6.1",
                )
                surw = r.derive(
                    "w_sur",
                    8 * r.sqrt(S) * hd / 3,
                    "surcharge width from ridge",
                    unit=len_unit,
                    ref="ASCE 7-16 §7.6.1",
                )
                out["sur"], out["surw"] = r.q(sur), r.q(surw)
        out["pf"], out["Cs"], out["ps"] = r.q(pf), r.f(Cs), r.q(ps)
        out["ros"], out["notes"] = ros, tuple(notes)

    d = run_derivation(f"Roof snow load ({roof.shape} roof)", ASCE7_SNOW, logic)
    return RoofSnowASCE7(
        pf=out["pf"],
        pm=out["pm"],
        Cs=out["Cs"],
        ps=out["ps"],
        rain_on_snow=out["ros"],
        balanced=out["balanced"],
        partial=out["partial"],
        unbalanced_windward=out["ww"],
        unbalanced_leeward=out["lw"],
        surcharge=out["sur"],
        surcharge_width=out["surw"],
        notes=out["notes"],
        derivation=d,
    )
