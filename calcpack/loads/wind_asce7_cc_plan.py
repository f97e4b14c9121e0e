"""Roof zone plan for components and cladding on sloped roofs, ASCE/SEI 7-16 Chapter 30 Part 1:
each zone of the roof's figure set out on plan in multiples of the zone dimension a, with its
GCp and net pressures at one effective wind area.

Plan: the ridge runs along L (x from 0 to L), B across it (y from 0 to B, ridge at B/2); for a
monoslope roof the low eave is at y = 0 and the high eave at y = B. Zones as set out here
(strips of width a along the edges, the ridge and the hips; a × a squares at the corners):

* gable, 7° < θ <= 45° (Figures 30.3-2B to 2D): 3e eave corners, 3r ridge ends, 2e along the
  eaves, 2n along the rakes, 2r either side of the ridge, 1 the rest;
* hip, 7° < θ <= 45° (Figures 30.3-2E to 2I): 3 at the corners, 2e along the eaves, 2r either
  side of the ridge and the hips, 1 the rest;
* monoslope, 3° < θ <= 10° (Figure 30.3-5A): 3' high-eave corners, 3 low-eave corners, 2'
  along the high eave, 2 along the other edges, 1 the rest; 10° < θ <= 30° (Figure 30.3-5B):
  3 corners, 2 edges, 1 the rest.

The extents are a reading of the figures' sketches (from memory): confirm them against the
printed figures. A drawing reads the result (``"wind-cc-plan"``, plots/wind_cc_plan.py).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.loads.derive import Derivation, is_us_customary, run_derivation, steps_bundle
from calcpack.loads.wind_asce7 import ASCE7_WIND, WindSiteASCE7, internal_pressure_coefficient
from calcpack.loads.wind_asce7_cc import cc_roof_zones
from calcpack.loads.wind_asce7_lowrise import (
    CCWindASCE7,
    LowRiseBuildingASCE7,
    components_wind_asce7,
)
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive

__all__ = ["CCRoofPlanASCE7", "cc_roof_plan_asce7"]

Point = tuple[Quantity, Quantity]
Poly = tuple[tuple[float, float], ...]
Region = tuple[str, Poly]


@dataclass(frozen=True)
class CCRoofPlanASCE7:
    """C&C zones of a sloped roof on plan with their pressures at one effective wind area.

    Attributes:
        building: the building. area: effective wind area. a: zone dimension.
        regions: (zone, polygon on plan) pairs; a zone may have several regions.
        zones: per zone, its :class:`CCWindASCE7` (GCp, p_pos, p_neg).
    """

    building: LowRiseBuildingASCE7
    area: Quantity
    a: Quantity
    regions: tuple[tuple[str, tuple[Point, ...]], ...]
    zones: dict[str, CCWindASCE7]
    derivation: Derivation

    def working(self, *, settings: Any = None) -> list[Any]:
        """The zone table's working, then the zone plan."""
        from calcpack.working.figure import Figure

        b = self.building
        plan = Figure(
            "wind-cc-plan",
            self,
            caption=f"Components and cladding zones of the {b.roof} roof (θ = "
            f"{b.theta_deg:.3g}°) with the net suction at A = {self.area:~.4gP}, "
            f"a = {self.a:~.3gP}",
            alt="Roof plan divided into corner, edge, ridge and interior zones, each labelled "
            "with its zone name and net suction",
            settings=settings,
        )
        return [*self.derivation.working(settings=settings), plan]

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return steps_bundle(self.working(), self.derivation.title)


def _rect(x0: float, y0: float, x1: float, y1: float) -> Poly:
    return ((x0, y0), (x1, y0), (x1, y1), (x0, y1))


def _gable(L: float, B: float, a: float) -> list[Region]:
    m = B / 2
    out: list[Region] = []
    for x0, x1 in ((0.0, a), (L - a, L)):
        out += [("3e", _rect(x0, 0.0, x1, a)), ("3e", _rect(x0, B - a, x1, B))]
        out += [("3r", _rect(x0, m - a, x1, m + a))]
        out += [("2n", _rect(x0, a, x1, m - a)), ("2n", _rect(x0, m + a, x1, B - a))]
    out += [("2e", _rect(a, 0.0, L - a, a)), ("2e", _rect(a, B - a, L - a, B))]
    out += [("2r", _rect(a, m - a, L - a, m + a))]
    out += [("1", _rect(a, a, L - a, m - a)), ("1", _rect(a, m + a, L - a, B - a))]
    return out


def _hip(L: float, B: float, a: float) -> list[Region]:
    m = B / 2
    r0, r1 = m, L - m  # the ridge's ends (hips at 45° on plan)
    out: list[Region] = [  # the four roof planes inside the edge strips
        ("1", ((a, a), (L - a, a), (r1, m), (r0, m))),
        ("1", ((a, B - a), (L - a, B - a), (r1, m), (r0, m))),
        ("1", ((a, a), (r0, m), (a, B - a))),
        ("1", ((L - a, a), (r1, m), (L - a, B - a))),
    ]
    for x0, x1 in ((0.0, a), (L - a, L)):
        out += [("3", _rect(x0, 0.0, x1, a)), ("3", _rect(x0, B - a, x1, B))]
        out += [("2e", _rect(x0, a, x1, B - a))]
    out += [("2e", _rect(a, 0.0, L - a, a)), ("2e", _rect(a, B - a, L - a, B))]
    if r1 > r0:
        out += [("2r", _rect(r0, m - a, r1, m + a))]
    d = a / 2**0.5  # a either side of a hip, which runs at 45° on plan
    for cx, cy, ex, ey in (
        (a, a, r0, m),
        (a, B - a, r0, m),
        (L - a, a, r1, m),
        (L - a, B - a, r1, m),
    ):
        nx, ny = (d, -d) if (ex - cx) * (ey - cy) > 0 else (d, d)
        out += [
            ("2r", ((cx - nx, cy - ny), (cx + nx, cy + ny), (ex + nx, ey + ny), (ex - nx, ey - ny)))
        ]
    return out


def _mono(L: float, B: float, a: float, steep: bool) -> list[Region]:
    hi3, hi2 = ("3", "2") if steep else ("3'", "2'")
    out: list[Region] = []
    for x0, x1 in ((0.0, a), (L - a, L)):
        out += [("3", _rect(x0, 0.0, x1, a)), (hi3, _rect(x0, B - a, x1, B))]
        out += [("2", _rect(x0, a, x1, B - a))]
    out += [("2", _rect(a, 0.0, L - a, a)), (hi2, _rect(a, B - a, L - a, B))]
    out += [("1", _rect(a, a, L - a, B - a))]
    return out


def cc_roof_plan_asce7(
    site: WindSiteASCE7, building: LowRiseBuildingASCE7, *, area: Quantity
) -> CCRoofPlanASCE7:
    """Every C&C roof zone of a sloped roof at effective area ``area``, set out on plan.

    Raises:
        OutOfScopeError: a roof the plan is not set out for (θ <= 7° gable or hip, θ <= 3°
            monoslope, flat roofs: Figure 30.3-2A's zones are set out in terms of h).
    """
    dimension("area", area, "[area]")
    positive("area", area)
    b = building
    th = b.theta_deg
    if b.roof == "flat" or (b.roof in ("gable", "hip") and th <= 7.0) or th <= 3.0:
        raise OutOfScopeError(
            f"Input roof = {b.roof!r}, roof_slope = {th:.3g}°: the zone plan is set out for "
            "sloped roofs (gable and hip above 7°, monoslope above 3°); lower slopes use "
            "Figure 30.3-2A, whose zones are not drawn here"
        )
    names = cc_roof_zones(b.roof, b.roof_slope)
    zones = {z: components_wind_asce7(site, b, surface="roof", zone=z, area=area) for z in names}
    first = zones[names[0]]
    if first.a is None:  # components_wind_asce7 records a for every element
        raise OutOfScopeError("the zone dimension a was not recorded")
    lu = "ft" if is_us_customary(site.V) else "m"
    unit = "psf" if is_us_customary(site.V) else "kN/m^2"
    a = first.a.to(lu)
    L, B, av = (float(v.to(lu).magnitude) for v in (b.L, b.B, a))
    if b.roof == "gable":
        raw = _gable(L, B, av)
    elif b.roof == "hip":
        raw = _hip(L, B, av)
    else:
        raw = _mono(L, B, av, steep=th > 10.0)
    regions = tuple((z, tuple((Q_(x, lu), Q_(y, lu)) for x, y in poly)) for z, poly in raw)
    gcpi = internal_pressure_coefficient(b.enclosure)

    def logic(r: Recorder) -> None:
        r.given("q_h", first.qh, "velocity pressure at h", source="ASCE 7-16 Eq. 26.10-1")
        r.given("a", a, "zone dimension", source="ASCE 7-16 Figure 30.3-2 notes")
        r.given("A", area, "effective wind area")
        r.given("GCpi", gcpi, f"{b.enclosure}, applied ±", source="ASCE 7-16 Table 26.13-1")
        r.table(
            ["Zone", "GCp +", "GCp −", f"p + ({unit})", f"p − ({unit})"],
            [
                [
                    z,
                    f"{c.GCp_pos:+.3f}",
                    f"{c.GCp_neg:+.3f}",
                    f"{c.p_pos.to(unit).magnitude:+.3g}",
                    f"{c.p_neg.to(unit).magnitude:+.3g}",
                ]
                for z, c in zones.items()
            ],
            f"Roof components and cladding, {first.figure}, p = q_h (GCp − (±GCpi)) "
            "(Eq. 30.3-1), at least 16 psf either way (§30.2.2)",
        )

    d = run_derivation(f"Roof components and cladding by zone ({b.roof} roof)", ASCE7_WIND, logic)
    return CCRoofPlanASCE7(b, area, a, regions, zones, d)
