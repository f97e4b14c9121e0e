"""External pressure coefficients and wind pressures on walls and roofs of small rectangular
buildings to EN 1991-1-4:2005+A1:2010 §7.2 (recommended values; from memory).

* c_pe at the loaded area A by the rule of Figure 7.2: c_pe,1 for A ≤ 1 m²,
  c_pe,1 − (c_pe,1 − c_pe,10)·log10(A) between 1 and 10 m², c_pe,10 for A ≥ 10 m² (§7.2.1);
* vertical walls Table 7.1, zones A to E, interpolated in h/d; e = min(b, 2h) (Figure 7.5);
  lack of correlation factor 0.85 (h/d ≤ 1) to 1.0 (h/d ≥ 5) on the net D/E force (§7.2.2(3));
* flat roofs with sharp eaves Table 7.2, monopitch roofs Tables 7.3a/b, duopitch roofs Tables
  7.4a/b (zones F to J), interpolated linearly in pitch between values of the same sign; where
  a zone has a positive and a negative value, each face takes one sign (no mixing on a face),
  giving the cases of the tables' notes;
* net pressure w = q_p(z_e)·(c_pe − c_pi), c_pi of §7.2.9 (+0.2 and −0.3 unless a face dominates).

Sign convention: c_pe and pressures positive toward the surface (inward), suction negative.
Covered: h ≤ 15 m, h ≤ b for each direction (z_e = h, Figure 7.4); pitches 5° to 75° (flat
below 5°, sharp eaves). Refused: troughed roofs, parapets, curved and domed roofs, h > b.
"""

from __future__ import annotations

import itertools
import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import InputError
from calcpack.loads.derive import Derivation, run_derivation
from calcpack.loads.wind_en1991 import (
    HEIGHT_MAX,
    WindSiteEN,
    internal_pressure_en,
    record_peak_pressure,
    standard_for,
)
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = [
    "BuildingEN",
    "WindPressuresEN",
    "cpe_at_area",
    "roof_cpe_en",
    "wall_cpe_en",
    "wind_pressures_en",
]

RoofEN = Literal["flat", "monopitch", "duopitch"]
Direction = Literal[0, 90, 180]
PITCHES = (5, 15, 30, 45, 60, 75)
AREA_10 = Q_(10.0, "m^2")  # the loaded area of c_pe,10 (overall structure), §7.2.1
ROOF_ZONES: dict[tuple[str, int], tuple[tuple[str, ...], ...]] = {
    # faces of the roof: each tuple of zones takes one sign together (the tables' notes)
    ("duopitch", 0): (("F", "G", "H"), ("I", "J")),
    ("duopitch", 90): (("F", "G", "H", "I"),),
    ("monopitch", 0): (("F", "G", "H"),),
    ("monopitch", 180): (("F", "G", "H"),),
    ("monopitch", 90): (("Fup", "Flow", "G", "H", "I"),),
    ("flat", 0): (("F", "G", "H", "I"),),
    ("flat", 90): (("F", "G", "H", "I"),),
}


def cpe_at_area(c1: float, c10: float, area: Quantity) -> float:
    """c_pe at the loaded area by the rule of EN 1991-1-4 Figure 7.2 (log10 between 1 and 10 m²)."""
    a = float(positive("area", dimension("area", area, "[area]")).to("m^2").magnitude)
    if a <= 1.0:
        return c1
    if a >= 10.0:
        return c10
    return c1 - (c1 - c10) * math.log10(a)


def wall_cpe_en(h_over_d: float, zone: str, area: Quantity) -> float:
    """c_pe of a vertical wall zone (A to E) for h/d (≤ 5) at the loaded area (Table 7.1)."""
    within("h_over_d", h_over_d, 0.0, 5.0, inclusive=True, rule="EN 1991-1-4 Table 7.1 (h/d ≤ 5)")
    one_of("zone", zone, ("A", "B", "C", "D", "E"))
    t = read_table("en1991_1_4_walls.csv", key="h_d")
    rows = sorted(((float(k), v) for k, v in t.rows.items()), key=lambda kv: kv[0])
    x = max(h_over_d, rows[0][0])
    for (x0, r0), (x1, r1) in itertools.pairwise(rows):
        if x <= x1:
            f = (x - x0) / (x1 - x0)
            c10 = float(r0[f"{zone}_10"]) + f * (float(r1[f"{zone}_10"]) - float(r0[f"{zone}_10"]))
            c1 = float(r0[f"{zone}_1"]) + f * (float(r1[f"{zone}_1"]) - float(r0[f"{zone}_1"]))
            return cpe_at_area(c1, c10, area)
    raise AssertionError("unreachable: h/d is within the table")  # pragma: no cover


def _roof_row(roof: str, theta: int, pitch: int, zone: str) -> Any:
    return read_table("en1991_1_4_roofs.csv", key="key").row(f"{roof} {theta} {pitch} {zone}")


def _sign_value(row: Any, sign: str, area: Quantity) -> float | None:
    c10, c1 = row[f"{sign}_10"], row[f"{sign}_1"]
    if c10 is None:
        return None
    return cpe_at_area(float(c1), float(c10), area)


def roof_cpe_en(
    roof: str, theta: int, pitch: Quantity, zone: str, area: Quantity
) -> dict[str, float]:
    """The c_pe values of a roof zone at the loaded area: ``{"neg": .., "pos": ..}`` (one or both).

    Args:
        roof: ``"flat"``, ``"monopitch"`` or ``"duopitch"``. theta: wind direction 0, 90 (or 180
            for a monopitch roof; 0 is wind onto the low eave). pitch: 5° to 75° (0 for flat).
        zone: F, G, H, I, J (Fup, Flow for a monopitch roof at 90°).
    """
    one_of("roof", roof, ("flat", "monopitch", "duopitch"))
    key = (roof, theta)
    if key not in ROOF_ZONES:
        raise InputError(
            f"Input theta must be one of 0, 90{', 180' if roof == 'monopitch' else ''} for a "
            f"{roof} roof (got theta = {theta!r})",
            name="theta",
            value=theta,
            expected="a wind direction of EN 1991-1-4 Tables 7.2 to 7.4",
        )
    zones = [z for face in ROOF_ZONES[key] for z in face]
    one_of("zone", zone, zones)
    if roof == "flat":
        row = _roof_row(roof, theta, 0, zone)
        return {s: v for s in ("neg", "pos") if (v := _sign_value(row, s, area)) is not None}
    a = float(pitch.to("deg").magnitude)
    within(
        "pitch",
        pitch.to("deg"),
        Q_(5.0, "deg"),
        Q_(75.0, "deg"),
        rule=f"EN 1991-1-4 Tables 7.3 and 7.4 cover {roof} roofs of 5° to 75° "
        "(use roof='flat' below 5°; troughed roofs are not covered)",
    )
    lo = max(p for p in PITCHES if p <= a)
    hi = min(p for p in PITCHES if p >= a)
    out: dict[str, float] = {}
    for s in ("neg", "pos"):
        v0 = _sign_value(_roof_row(roof, theta, lo, zone), s, area)
        v1 = _sign_value(_roof_row(roof, theta, hi, zone), s, area)
        if lo == hi and v0 is not None:
            out[s] = v0
        elif v0 is not None and v1 is not None:
            out[s] = v0 + (a - lo) / (hi - lo) * (v1 - v0)
    return out


@dataclass(frozen=True)
class BuildingEN:
    """A small rectangular building for EN 1991-1-4 §7.2.

    Attributes:
        roof: ``"flat"``, ``"monopitch"`` or ``"duopitch"``. pitch: roof pitch α [angle].
        h: height to the top of the roof (ridge, or high eave) [length], at most 15 m.
        length: plan dimension along the ridge (along the eaves of a monopitch roof) [length].
        width: plan dimension across the ridge (low eave to high eave of a monopitch) [length].
    """

    roof: RoofEN
    pitch: Quantity
    h: Quantity
    length: Quantity
    width: Quantity

    def __post_init__(self) -> None:
        one_of("roof", self.roof, ("flat", "monopitch", "duopitch"))
        dimension("pitch", self.pitch, "[]")
        for name in ("h", "length", "width"):
            dimension(name, getattr(self, name), "[length]")
            positive(name, getattr(self, name))
        within("h", self.h.to("m"), hi=HEIGHT_MAX, rule="this module covers buildings up to 15 m")
        if self.roof == "flat":
            within("pitch", self.pitch.to("deg"), Q_(0, "deg"), Q_(5, "deg"), rule="flat: < 5°")
        else:
            within(
                "pitch", self.pitch.to("deg"), Q_(5, "deg"), Q_(75, "deg"), rule="Tables 7.3, 7.4"
            )

    def plan(self, theta: int) -> tuple[Quantity, Quantity]:
        """(b, d): the crosswind and the along-wind plan dimensions for direction ``theta``."""
        return (self.length, self.width) if theta in (0, 180) else (self.width, self.length)


@dataclass(frozen=True)
class WindPressuresEN:
    """External and net wind pressures of one direction at one loaded area.

    Attributes:
        theta: wind direction (0: normal to the ridge or onto the low eave; 90: along it).
        area: the loaded area. qp: peak velocity pressure at z_e = h. e: scaling length.
        h_over_d: h/d. walls: c_pe by wall zone. roof_cases: case name -> c_pe by roof zone.
        cpi: internal coefficients (each applied with every case). f_corr: lack of
        correlation factor for the overall D/E force. derivation: the working.
    """

    theta: int
    area: Quantity
    qp: Quantity
    e: Quantity
    h_over_d: float
    walls: dict[str, float]
    roof_cases: dict[str, dict[str, float]]
    cpi: tuple[float, ...]
    f_corr: float
    derivation: Derivation

    def net(self, zone: str, cpi: float, case: str | None = None) -> Quantity:
        """Net pressure q_p·(c_pe − c_pi) on a wall zone (A..E) or a roof zone of ``case``."""
        if zone in self.walls and case is None:
            cpe = self.walls[zone]
        else:
            case = case or next(iter(self.roof_cases))
            one_of("case", case, list(self.roof_cases))
            one_of("zone", zone, list(self.roof_cases[case]))
            cpe = self.roof_cases[case][zone]
        return self.qp * (cpe - cpi)

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def _roof_cases(b: BuildingEN, theta: int, area: Quantity) -> dict[str, dict[str, float]]:
    faces = ROOF_ZONES[(b.roof, theta)]
    values = {z: roof_cpe_en(b.roof, theta, b.pitch, z, area) for f in faces for z in f}
    choices = []
    for face in faces:
        signs = [s for s in ("neg", "pos") if any(s in values[z] for z in face)]
        two = len(signs) == 2 and any(len(values[z]) == 2 for z in face)
        choices.append(signs if two else [signs[0]])
    cases: dict[str, dict[str, float]] = {}
    for combo in itertools.product(*choices):
        name = " ".join(
            "".join(face) + ("−" if s == "neg" else "+")
            for s, face in zip(combo, faces, strict=True)
        )
        cases[name] = {
            z: values[z].get(s, next(iter(values[z].values())))
            for s, face in zip(combo, faces, strict=True)
            for z in face
        }
    return cases


def wind_pressures_en(
    site: WindSiteEN,
    building: BuildingEN,
    *,
    theta: Direction = 0,
    area: Quantity = AREA_10,
    dominant_ratio: float | None = None,
    cpe_dominant: float | None = None,
) -> WindPressuresEN:
    """Wall and roof pressure coefficients and q_p for one wind direction (EN 1991-1-4 §7.2).

    Args:
        site: :class:`~calcpack.loads.wind_en1991.WindSiteEN`. building: :class:`BuildingEN`.
        theta: 0 (normal to the ridge; onto the low eave of a monopitch), 90, or 180 (monopitch,
            onto the high eave). area: loaded area of the member or cladding (10 m² or more for
            the overall structure). dominant_ratio, cpe_dominant: a dominant face (§7.2.9).

    Raises:
        InputError: a direction not in the tables, h > b (strips of Figure 7.4 not covered).
    """
    if (building.roof, theta) not in ROOF_ZONES:
        raise InputError(
            f"Input theta = {theta!r} is not a direction of the {building.roof} roof tables "
            "(0, 90; 180 for monopitch roofs)",
            name="theta",
            value=theta,
            expected="0, 90 or (monopitch) 180",
        )
    dimension("area", area, "[area]")
    positive("area", area)
    bb, dd = building.plan(theta)
    if building.h > bb:
        raise InputError(
            f"Input h must not exceed the crosswind width b for this direction (got h = "
            f"{building.h:~P}, b = {bb:~P}); the strips of EN 1991-1-4 Figure 7.4 are not covered",
            name="h",
            value=building.h,
            expected=f"h ≤ {bb:~P}",
        )
    cpi = internal_pressure_en(dominant_ratio, cpe_dominant)
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        r.heading("Peak velocity pressure at z_e = h", 3)
        qp = record_peak_pressure(r, site, building.h)
        r.heading(f"Pressure coefficients, wind direction θ = {theta}°", 3)
        b = r.given("b", bb.to("m"), "crosswind dimension")
        d = r.given("d", dd.to("m"), "along-wind dimension")
        h = r.given("h_b", building.h.to("m"), "height of the building")
        e = r.derive(
            "e",
            r.min(b, 2 * h),
            "scaling length for the zones",
            unit="m",
            ref="EN 1991-1-4 Figure 7.5",
        )
        hd = r.derive("h_d", h / d, "height over depth", unit="")
        A = r.given(
            "A_load", area.to("m^2"), "loaded area", source="EN 1991-1-4 §7.2.1, Figure 7.2"
        )
        hd_f = min(r.f(hd), 5.0)
        walls = {z: wall_cpe_en(hd_f, z, r.q(A)) for z in "ABCDE"}
        for z, v in walls.items():
            r.given(f"c_pe_{z}", v, f"wall zone {z}", source="EN 1991-1-4 Table 7.1, Figure 7.2")
        f_corr = 0.85 + 0.15 * min(max((hd_f - 1.0) / 4.0, 0.0), 1.0)
        r.given(
            "f_corr",
            f_corr,
            "lack of correlation factor on the net D/E force (0.85 at h/d ≤ 1, 1.0 at h/d ≥ 5)",
            source="EN 1991-1-4 §7.2.2(3)",
        )
        cases = _roof_cases(building, theta, r.q(A))
        tables = {"flat": "Table 7.2", "monopitch": "Table 7.3", "duopitch": "Table 7.4"}
        zones = list(next(iter(cases.values())))
        r.table(
            ["Case", *zones],
            [[name, *(f"{c[z]:+.2f}" for z in zones)] for name, c in cases.items()],
            caption=f"Roof c_pe at A = {r.q(A).magnitude:.3g} m² "
            f"(EN 1991-1-4 {tables[building.roof]})",
        )
        for i, c in enumerate(cpi):
            r.given(
                f"c_pi_{i + 1}", c, "internal pressure coefficient", source="EN 1991-1-4 §7.2.9"
            )
        r.text("Net pressure on each zone: w = q_p·(c_pe − c_pi), positive toward the surface.")
        out.update(qp=r.q(qp), e=r.q(e), hd=r.f(hd), walls=walls, cases=cases, f=f_corr)

    d = run_derivation(f"Wind pressures, θ = {theta}°", standard_for(site.annex), logic)
    return WindPressuresEN(
        theta, area, out["qp"], out["e"], out["hd"], out["walls"], out["cases"], cpi, out["f"], d
    )
