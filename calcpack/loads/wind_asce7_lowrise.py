"""Wind on low-rise buildings to ASCE/SEI 7-16: main wind force resisting system by the envelope
procedure (Chapter 28 Part 1) and components and cladding for h <= 60 ft (Chapter 30 Part 1).

Envelope: p = q_h [(GCpf) − (GCpi)] (Eq. 28.3-1) for zones 1–4, 1E–4E (load case A, GCpf by
roof angle, Figure 28.3-1, straight-line interpolation) and 1–6, 1E–6E (load case B), each with
+GCpi and −GCpi; end-zone width 2a, a = min(0.1 least horizontal dimension, 0.4 h) but not less
than 4 % of the least horizontal dimension nor 3 ft; minimum loads of §28.3.4.

Components and cladding: p = q_h [(GCp) − (GCpi)] (Eq. 30.3-1), GCp from Figure 30.3-1 (walls,
reduced 10 % when θ <= 10°) and Figures 30.3-2A to 30.3-2I and 30.3-5A/B (gable, hip and
monoslope roofs, see :mod:`calcpack.loads.wind_asce7_cc`) as a function of the effective wind
area A, log-linear between the figure's points and constant outside them; net pressure at least
16 psf (0.77 kN/m²) either way (§30.2.2). The zone dimension a = max(min(0.1 B, 0.4 h), 0.04 B,
3 ft), B the least horizontal dimension. The effective area of a member is its span times the
larger of its tributary width and a third of its span (§26.2).

Sign convention: pressure positive toward the surface (on a roof: downward), suction negative.
Provisions must be confirmed against the edition adopted locally; the derivation must be
reviewed and sealed under licensed practice.
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
from calcpack.loads.wind_asce7_cc import cc_coefficient_asce7, cc_figures
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = [
    "CCWindASCE7",
    "EnvelopeWindASCE7",
    "LowRiseBuildingASCE7",
    "cc_coefficient_asce7",
    "components_wind_asce7",
    "effective_wind_area",
    "envelope_wind_asce7",
]

RoofKind = Literal["gable", "hip", "flat", "monoslope"]
CASE_A_ZONES = ("1", "2", "3", "4", "1E", "2E", "3E", "4E")
CASE_B_ZONES = ("1", "2", "3", "4", "5", "6", "1E", "2E", "3E", "4E", "5E", "6E")
ROOF_ZONES = {"2", "3", "2E", "3E"}  # roof zones of Figure 28.3-1 (1, 4, 5, 6 are walls)
_H_MAX = Q_(60.0, "ft")


@dataclass(frozen=True)
class LowRiseBuildingASCE7:
    """An enclosed or partially enclosed low-rise building.

    Attributes:
        h: mean roof height [length] (eave height for θ <= 10°), at most 60 ft.
        B, L: plan dimensions [length]. roof: roof form. roof_slope: roof angle θ.
        enclosure: classification of §26.12 (enclosed or partially enclosed are covered).
    """

    h: Quantity
    B: Quantity
    L: Quantity
    roof_slope: Quantity
    roof: RoofKind = "gable"
    enclosure: str = "enclosed"

    def __post_init__(self) -> None:
        for name in ("h", "B", "L"):
            dimension(name, getattr(self, name), "[length]")
            positive(name, getattr(self, name))
        within(
            "h",
            self.h,
            hi=_H_MAX,
            rule="ASCE 7-16 Chapter 28 Part 1 and Chapter 30 Part 1 cover h <= 60 ft",
        )
        dimension("roof_slope", self.roof_slope, "[]")
        within(
            "roof_slope",
            self.roof_slope.to("deg"),
            Q_(0.0, "deg"),
            Q_(45.0, "deg"),
            rule="Figure 28.3-1 and Figure 30.3-2 cover roof angles up to 45°",
        )
        one_of("roof", self.roof, ("gable", "hip", "flat", "monoslope"))
        one_of("enclosure", self.enclosure, ENCLOSURES)
        if self.enclosure not in ("enclosed", "partially enclosed"):
            raise OutOfScopeError(
                f"Enclosure {self.enclosure!r} is not covered by the low-rise procedures "
                "(input enclosure; ASCE 7-16 Chapter 28 Part 1 and Chapter 30 Part 1 cover "
                "enclosed and partially enclosed buildings)"
            )

    @property
    def least_dimension(self) -> Quantity:
        return min(self.B, self.L)

    @property
    def theta_deg(self) -> float:
        return float(self.roof_slope.to("deg").magnitude)


def _record_a(r: Recorder, b: LowRiseBuildingASCE7, lu: str) -> Any:
    least = r.given("B_min", b.least_dimension.to(lu), "least horizontal dimension")
    h = r.given("h", b.h.to(lu), "mean roof height")
    a0 = r.min(0.1 * least, 0.4 * h)
    return r.derive(
        "a",
        r.max(a0, 0.04 * least, Q_(3.0, "ft").to(lu)),
        "end zone dimension",
        unit=lu,
        ref="ASCE 7-16 Figure 28.3-1 note 9",
    )


def _gcpf_case_a(theta: float) -> dict[str, float]:
    table = read_table("asce7_16_wind_gcpf_case_a.csv", key="theta")
    rows = sorted(((float(k), v) for k, v in table.rows.items()), key=lambda kv: kv[0])
    for (t0, r0), (t1, r1) in itertools.pairwise(rows):
        if t0 <= theta <= t1:
            f = 0.0 if t1 == t0 else (theta - t0) / (t1 - t0)
            return {z: float(r0[z]) + f * (float(r1[z]) - float(r0[z])) for z in CASE_A_ZONES}
    raise OutOfScopeError(f"Roof angle {theta}° is outside Figure 28.3-1 (input roof_slope)")


@dataclass(frozen=True)
class EnvelopeWindASCE7:
    """MWFRS pressures by the envelope procedure.

    Attributes:
        qh: velocity pressure at h. GCpi: internal pressure coefficient (±). a: end-zone size.
        gcpf: GCpf by (load case, zone). pressures: p by (load case, zone, "+GCpi" / "-GCpi").
        min_wall, min_roof: the §28.3.4 minimum pressures (roof on the vertical projection).
    """

    qh: Quantity
    GCpi: float
    a: Quantity
    gcpf: dict[tuple[str, str], float]
    pressures: dict[tuple[str, str, str], Quantity]
    min_wall: Quantity
    min_roof: Quantity
    derivation: Derivation

    def pressure(self, case: str, zone: str, internal: str) -> Quantity:
        """p for load case ``"A"``/``"B"``, a zone (``"2E"``) and ``"+GCpi"``/``"-GCpi"``."""
        key = (case, zone, internal)
        if key not in self.pressures:
            from calcpack.validate import lookup

            return lookup(
                "zone",
                f"{case} {zone} {internal}",
                {f"{c} {z} {i}": p for (c, z, i), p in self.pressures.items()},
                what="envelope zone (case zone internal)",
            )
        return self.pressures[key]

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def envelope_wind_asce7(site: WindSiteASCE7, b: LowRiseBuildingASCE7) -> EnvelopeWindASCE7:
    """MWFRS design pressures of a low-rise building, envelope procedure (ASCE 7-16 §28.3)."""
    if b.h > b.least_dimension:
        raise OutOfScopeError(
            f"Input h = {b.h:~P} exceeds the least horizontal dimension "
            f"{b.least_dimension:~P}: not a low-rise building (ASCE 7-16 §26.2), so the "
            "envelope procedure of Chapter 28 does not apply"
        )
    us = is_us_customary(site.V)
    unit, lu = ("psf", "ft") if us else ("kN/m^2", "m")
    out: dict[str, Any] = {}
    theta = b.theta_deg
    gA = _gcpf_case_a(theta)
    tB = read_table("asce7_16_wind_gcpf_case_b.csv", key="zone")
    gB = {z: float(tB.row(z)["GCpf"]) for z in CASE_B_ZONES}
    gcpi = internal_pressure_coefficient(b.enclosure)

    def logic(r: Recorder) -> None:
        r.heading("Velocity pressure at mean roof height", 3)
        qh = record_velocity_pressure(r, site, b.h, "q_h")
        a = _record_a(r, b, lu)
        r.heading("Envelope procedure (Chapter 28 Part 1)", 3)
        r.given(
            "GCpi",
            gcpi,
            f"internal pressure coefficient, {b.enclosure}, applied ±",
            source="ASCE 7-16 Table 26.13-1",
        )
        r.text(
            f"Roof angle θ = {theta:.3g}°: GCpf for load case A interpolated in Figure "
            "28.3-1; load case B as printed. p = q_h [(GCpf) − (GCpi)] (Eq. 28.3-1)."
        )
        qh_q = r.q(qh).to(unit)
        pressures: dict[tuple[str, str, str], Quantity] = {}
        rows: list[list[Any]] = []
        gcpf: dict[tuple[str, str], float] = {}
        for case, g in (("A", gA), ("B", gB)):
            for zone, c in g.items():
                gcpf[(case, zone)] = c
                pp = qh_q * (c - gcpi)
                pn = qh_q * (c + gcpi)
                pressures[(case, zone, "+GCpi")] = pp
                pressures[(case, zone, "-GCpi")] = pn
                rows.append(
                    [case, zone, f"{c:+.3f}", f"{pp.magnitude:+.3g}", f"{pn.magnitude:+.3g}"]
                )
        r.table(
            ["Load case", "Zone", "GCpf", f"p, +GCpi ({unit})", f"p, −GCpi ({unit})"],
            rows,
            "MWFRS pressures, ASCE 7-16 Figure 28.3-1 and Eq. 28.3-1 (+ toward the surface)",
        )
        r.text(
            "Where GCpf is negative in zone 2 or 2E it applies from the roof edge for the "
            "lesser of half the building dimension parallel to the wind and 2.5 h; the rest "
            "of zone 2/2E to the ridge takes the zone 3/3E value (Figure 28.3-1 note)."
        )
        r.text(
            "Apply each load case with the building rotated so each corner in turn is the "
            "windward corner (Figure 28.3-1)."
        )
        mw = Q_(16.0, "psf").to(unit) if us else Q_(0.77, "kN/m^2")
        mr = Q_(8.0, "psf").to(unit) if us else Q_(0.38, "kN/m^2")
        r.given("p_min_wall", mw, "minimum MWFRS load on walls", source="ASCE 7-16 §28.3.4")
        r.given(
            "p_min_roof",
            mr,
            "minimum MWFRS load on the roof's vertical projection",
            source="ASCE 7-16 §28.3.4",
        )
        out.update(qh=qh_q, a=r.q(a), p=pressures, g=gcpf, mw=mw, mr=mr)

    d = run_derivation("Wind on the main frame (envelope procedure)", ASCE7_WIND, logic)
    return EnvelopeWindASCE7(out["qh"], gcpi, out["a"], out["g"], out["p"], out["mw"], out["mr"], d)


def effective_wind_area(span: Quantity, spacing: Quantity) -> Quantity:
    """Effective wind area of a member: span × max(spacing, span/3) (ASCE 7-16 §26.2)."""
    dimension("span", span, "[length]")
    dimension("spacing", spacing, "[length]")
    positive("span", span)
    positive("spacing", spacing)
    return (span * max(spacing, span / 3)).to("ft^2" if is_us_customary(span) else "m^2")


@dataclass(frozen=True)
class CCWindASCE7:
    """Components and cladding pressures on one element (toward the surface +).

    Attributes:
        area: effective wind area. GCp_pos, GCp_neg: external coefficients. GCpi: internal (±).
        p_pos: the largest inward (downward on a roof) pressure, q_h (GCp+ + GCpi).
        p_neg: the largest outward (uplift) pressure, q_h (GCp− − GCpi), negative.
        a: the zone dimension of the figure (edge and corner zones are set out in multiples of
            a). figure: the figure(s) the coefficients come from.
    """

    surface: str
    zone: str
    area: Quantity
    qh: Quantity
    GCp_pos: float
    GCp_neg: float
    GCpi: float
    p_pos: Quantity
    p_neg: Quantity
    derivation: Derivation
    a: Quantity | None = None
    figure: str = ""

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def components_wind_asce7(
    site: WindSiteASCE7, b: LowRiseBuildingASCE7, *, surface: str, zone: str, area: Quantity
) -> CCWindASCE7:
    """Net C&C pressures on an element of effective wind area ``area`` (ASCE 7-16 §30.3).

    Args:
        site: the wind site. b: the building (its roof form and angle choose the figure).
        surface: ``"wall"`` or ``"roof"``. zone: a zone of the figure
            (:func:`~calcpack.loads.wind_asce7_cc.cc_roof_zones`). area: effective wind area.

    Raises:
        OutOfScopeError: a roof form or angle outside Chapter 30 Part 1 as covered here.
    """
    hB = float((b.h / b.least_dimension).to("").magnitude)
    gp, gn = cc_coefficient_asce7(surface, zone, area, b.roof_slope, roof=b.roof, h_over_B=hB)
    fig = cc_figures(surface, b.roof, b.roof_slope, zone, hB)
    gcpi = internal_pressure_coefficient(b.enclosure)
    us = is_us_customary(site.V)
    unit, lu = ("psf", "ft") if us else ("kN/m^2", "m")
    out: dict[str, Any] = {}
    hip_between = (
        surface == "roof" and b.roof == "hip" and 7.0 < b.theta_deg <= 27.0 and 0.5 < hB < 0.8
    )

    def logic(r: Recorder) -> None:
        qh = record_velocity_pressure(r, site, b.h, "q_h")
        a = _record_a(r, b, lu)
        A = r.given("A", area, "effective wind area")
        r.text(
            f"GCp for {surface} zone {zone} ({b.roof} roof, θ = {b.theta_deg:.3g}°) at "
            f"A = {r.q(A):.4g~P}: constant up to the figure's first area, straight on log10 A "
            "between its points, constant beyond the last"
            + (" (walls reduced 10 % for θ <= 10°)." if surface == "wall" else ".")
        )
        if hip_between:
            r.text(
                f"h/B = {hB:.3g} lies between the hip figures' 0.5 and 0.8: the more severe of "
                "the two is taken (conservative, not interpolated)."
            )
        gpos = r.given("GC_p_pos", gp, f"{surface} zone {zone}, positive", source=fig)
        gneg = r.given("GC_p_neg", gn, f"{surface} zone {zone}, negative", source=fig)
        gi = r.given("GCpi", gcpi, f"{b.enclosure}, applied ±", source="ASCE 7-16 Table 26.13-1")
        pmin = Q_(16.0, "psf").to(unit) if us else Q_(0.77, "kN/m^2")
        pp = r.derive(
            "p_pos",
            r.max(qh * (gpos + gi), pmin),
            "net inward pressure",
            unit=unit,
            ref="ASCE 7-16 Eq. 30.3-1, §30.2.2",
        )
        pn = r.derive(
            "p_neg",
            r.min(qh * (gneg - gi), -pmin),
            "net outward pressure (suction)",
            unit=unit,
            ref="ASCE 7-16 Eq. 30.3-1, §30.2.2",
        )
        out.update(qh=r.q(qh), pp=r.q(pp), pn=r.q(pn), a=r.q(a))

    d = run_derivation(
        f"Wind on components and cladding ({surface} zone {zone})", ASCE7_WIND, logic
    )
    return CCWindASCE7(
        surface, zone, area, out["qh"], gp, gn, gcpi, out["pp"], out["pn"], d, out["a"], fig
    )
