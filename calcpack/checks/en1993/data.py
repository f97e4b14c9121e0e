"""Inputs and factors shared by the EN 1993-1-1 member checks: partial factors γ_M (UK National
Annex values, which equal the recommended ones), steel grades by thickness (BS EN 10025-2 /
BS EN 10210-1, ``calcpack/refdata/en10025_steel_grades.csv``), the imperfection factors of the
buckling curves (Table 6.1) and the curve each section takes (Table 6.2 flexural; Table 6.4
§6.3.2.2 and UK NA Table NA.1 for §6.3.2.3 lateral-torsional).

Units: stresses MPa, lengths mm; E = 210 000 MPa, G = 81 000 MPa (§3.2.6).
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from types import MappingProxyType
from typing import Literal

from calcpack.checks.base import Standard
from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_, Quantity
from calcpack.validate import lookup

__all__ = [
    "ALPHA",
    "EN1993",
    "E_STEEL",
    "GAMMA_M",
    "G_STEEL",
    "Curve",
    "GammaM",
    "SteelGradeEC",
    "flexural_curves",
    "ltb_curve",
    "steel_grade_ec",
]

EN1993_EDITION = "BS EN 1993-1-1:2005+A1:2014 with the UK National Annex"
EN1993 = Standard(EN1993_EDITION, "Eurocode 3: Design of steel structures, Part 1-1")
E_STEEL = Q_(210000.0, "MPa")  # EN 1993-1-1 §3.2.6
G_STEEL = Q_(81000.0, "MPa")  # EN 1993-1-1 §3.2.6

Curve = Literal["a0", "a", "b", "c", "d"]
ALPHA: Mapping[str, float] = MappingProxyType(
    # EN 1993-1-1 Table 6.1 (flexural) = Table 6.3 (lateral-torsional): imperfection factors
    {"a0": 0.13, "a": 0.21, "b": 0.34, "c": 0.49, "d": 0.76}
)


@dataclass(frozen=True)
class GammaM:
    """A partial factor for resistance with the clause and annex that set it."""

    value: float
    clause: str


GAMMA_M: Mapping[str, GammaM] = MappingProxyType(
    {
        # UK NA to BS EN 1993-1-1, NA.2.15 (from memory): γ_M0 = 1.00, γ_M1 = 1.00, γ_M2 = 1.10
        "M0": GammaM(1.00, "EN 1993-1-1 §6.1(1), UK NA NA.2.15"),
        "M1": GammaM(1.00, "EN 1993-1-1 §6.1(1), UK NA NA.2.15"),
        "M2": GammaM(1.10, "EN 1993-1-1 §6.1(1), UK NA NA.2.15"),
    }
)


@dataclass(frozen=True)
class SteelGradeEC:
    """A steel grade at one thickness: f_y, f_u from the product standard (UK NA NA.2.4)."""

    grade: str
    fy: Quantity
    fu: Quantity
    t_max: Quantity
    source: str


def steel_grade_ec(grade: str, thickness: Quantity) -> SteelGradeEC:
    """f_y and f_u of ``grade`` (``"S275"``, ``"S355"``, ``"S235"``) for the thickest element.

    Raises:
        InputError: unknown grade. OutOfScopeError: thicker than the table (63 mm).
    """
    table = read_table("en10025_steel_grades.csv", key="key")
    grades = {str(r["grade"]): str(r["grade"]) for r in table.rows.values()}
    lookup("grade", grade, grades, what="steel grade")
    t = float(thickness.to("mm").magnitude)
    rows = sorted(
        (r for r in table.rows.values() if r["grade"] == grade), key=lambda r: float(r["t_max"])
    )
    for r in rows:
        if t <= float(r["t_max"]) + 1e-9:
            return SteelGradeEC(
                grade,
                Q_(float(r["fy"]), "MPa"),
                Q_(float(r["fu"]), "MPa"),
                Q_(float(r["t_max"]), "mm"),
                f"{r['standard']} (t ≤ {r['t_max']:g} mm; from memory, confirm against the "
                "product standard)",
            )
    raise OutOfScopeError(
        f"Steel grade {grade}: thickness t = {t:g} mm is beyond the tabulated {rows[-1]['t_max']:g}"
        " mm (BS EN 10025-2 Table 7 rows held here)"
    )


def flexural_curves(sec: EuroSection) -> dict[str, Curve]:
    """Buckling curves about y-y and z-z, EN 1993-1-1 Table 6.2 (S235 to S420).

    Rolled I: h/b > 1.2, t_f ≤ 40 mm: a (y), b (z); h/b ≤ 1.2, t_f ≤ 100 mm: b (y), c (z).
    Hot-finished hollow sections: a. Channels (PFC): c (as "U, T and solid sections").
    """
    if sec.is_hollow:
        return {"y": "a", "z": "a"}
    if sec.family == "PFC":
        return {"y": "c", "z": "c"}
    assert sec.tf is not None
    hb = float((sec.h / sec.b).to("").magnitude)
    tf = float(sec.tf.to("mm").magnitude)
    if tf > 100:
        return {"y": "d", "z": "d"}
    if hb > 1.2 and tf <= 40:
        return {"y": "a", "z": "b"}
    return {"y": "b", "z": "c"}


LTBMethod = Literal["6.3.2.2", "6.3.2.3"]


def ltb_curve(sec: EuroSection, method: LTBMethod) -> tuple[Curve, str]:
    """The lateral-torsional buckling curve and its source.

    §6.3.2.2 (Table 6.4): rolled I h/b ≤ 2: a, h/b > 2: b; other sections: d.
    §6.3.2.3, UK NA Table NA.1 (from memory): rolled doubly symmetric I and H, h/b ≤ 2: b;
    2 < h/b ≤ 3.1: c; h/b > 3.1: d.
    """
    hb = float((sec.h / sec.b).to("").magnitude)
    if method == "6.3.2.2":
        if sec.is_i_section:
            return ("a" if hb <= 2 else "b"), "EN 1993-1-1 Table 6.4"
        return "d", "EN 1993-1-1 Table 6.4 (other cross-sections)"
    if not sec.is_i_section:
        raise InputError(
            f"§6.3.2.3 applies to rolled I and H sections; {sec.designation} is a {sec.family} "
            "(use ltb_method='6.3.2.2')",
            name="ltb_method",
            value=method,
            expected="'6.3.2.2' for this section",
        )
    if hb <= 2:
        return "b", "UK NA to BS EN 1993-1-1, Table NA.1 (h/b ≤ 2)"
    if hb <= 3.1:
        return "c", "UK NA to BS EN 1993-1-1, Table NA.1 (2 < h/b ≤ 3.1)"
    return "d", "UK NA to BS EN 1993-1-1, Table NA.1 (h/b > 3.1)"
