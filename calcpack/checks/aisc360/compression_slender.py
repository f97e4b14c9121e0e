"""ANSI/AISC 360-16 §E3 critical stress and §E7 members with slender elements in compression.

* :func:`critical_stress`: F_cr from F_y and F_e (Eq. E3-2 / E3-3), shared by every
  compression clause;
* :func:`plate_elements`: the plate elements of a tabulated shape in axial compression with
  their width b, thickness t, number, λ_r of Table B4.1a and the effective width imperfection
  adjustment factors c_1, c_2 of Table E7.1;
* :func:`effective_area`: A_e of §E7.1 (elements: b_e = b when λ ≤ λ_r √(F_y/F_cr), else
  b_e = b (1 − c_1 √(F_el/F_cr)) √(F_el/F_cr), Eq. E7-3, with F_el = (c_2 λ_r/λ)² F_y, Eq. E7-5)
  and §E7.2(b) (round HSS, Eq. E7-7); P_n = F_cr A_e (Eq. E7-1).

Round HSS with D/t ≥ 0.45E/F_y are outside §E7 and refused.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.units import Quantity

__all__ = ["PlateElement", "critical_stress", "effective_area", "plate_elements"]

_I = ("W", "M", "S", "HP")
_CHANNEL = ("C", "MC")
_TEE = ("WT", "MT", "ST")
_ROUND = ("HSS round", "PIPE")

# Table E7.1, effective width imperfection adjustment factors (c_1, c_2)
_STIFFENED = (0.18, 1.31)  # (a) stiffened elements except walls of square and rectangular HSS
_HSS_WALL = (0.20, 1.38)  # (b) walls of square and rectangular HSS
_OTHER = (0.22, 1.49)  # (c) all other elements


@dataclass(frozen=True)
class PlateElement:
    """A plate element of a shape in compression.

    Attributes:
        name: e.g. "flange outstand", "web". b, t: width and thickness (Table B4.1a
        definitions). count: how many such elements the section has. lam_r: λ_r/√(E/F_y).
        case: the Table B4.1a case. c1, c2: Table E7.1 factors.
    """

    name: str
    b: Quantity
    t: Quantity
    count: int
    lam_r: float
    case: str
    c1: float
    c2: float

    def ratio(self) -> float:
        return float((self.b / self.t).to("").magnitude)


def plate_elements(m: SteelMember) -> list[PlateElement]:
    """The plate elements of ``m``'s shape in axial compression (empty for solid bars).

    Raises:
        OutOfScopeError: round HSS and Pipe (no plate elements: §E7.2(b)) are not listed here;
            other shapes not covered.
    """
    s = m.shape
    if s.type in _I:
        return [
            PlateElement("flange outstand", s["bf"] / 2, s["tf"], 4, 0.56, "case 1", *_OTHER),
            PlateElement("web", s["d"] - 2 * s["kdes"], s["tw"], 1, 1.49, "case 5", *_STIFFENED),
        ]
    if s.type in _CHANNEL:
        return [
            PlateElement("flange", s["bf"], s["tf"], 2, 0.56, "case 1", *_OTHER),
            PlateElement("web", s["d"] - 2 * s["kdes"], s["tw"], 1, 1.49, "case 5", *_STIFFENED),
        ]
    if s.type in _TEE:
        return [
            PlateElement("flange outstand", s["bf"] / 2, s["tf"], 2, 0.56, "case 1", *_OTHER),
            PlateElement("stem", s["d"], s["tw"], 1, 0.75, "case 4", *_OTHER),
        ]
    if s.type == "HSS":
        return [
            PlateElement("wall b", s["b"], s["tdes"], 2, 1.40, "case 6", *_HSS_WALL),
            PlateElement("wall h", s["h"], s["tdes"], 2, 1.40, "case 6", *_HSS_WALL),
        ]
    if s.type == "L":
        return [
            PlateElement("leg d", s["d"], s["t"], 1, 0.45, "case 3", *_OTHER),
            PlateElement("leg b", s["b"], s["t"], 1, 0.45, "case 3", *_OTHER),
        ]
    if s.type in ("BAR", "ROUND BAR"):
        return []
    raise OutOfScopeError(
        f"Shape {s.designation} ({s.type}): plate elements in compression are not listed for "
        "this shape family"
    )


def critical_stress(c: Recorder, Fy: Any, Fe: Any) -> Any:
    """F_cr by Eq. (E3-2) or (E3-3) (a handle)."""
    if float((c.q(Fy) / c.q(Fe)).to("").magnitude) <= 2.25:
        return c.derive(
            "F_cr",
            0.658 ** (Fy / Fe) * Fy,
            "critical stress, F_y/F_e ≤ 2.25",
            unit="ksi",
            ref="AISC 360-16 Eq. (E3-2)",
        )
    return c.derive(
        "F_cr",
        0.877 * Fe,
        "critical stress, F_y/F_e > 2.25",
        unit="ksi",
        ref="AISC 360-16 Eq. (E3-3)",
    )


def effective_area(c: Recorder, m: SteelMember, Fy: Any, E: Any, Fcr: Any, Ag: Any) -> Any:
    """A_e of a section with slender elements, §E7 (a handle)."""
    s = m.shape
    e_fy = float((m.E / m.Fy).to("").magnitude)
    c.heading("Slender elements, effective area (§E7)", 4)
    if s.type in _ROUND:
        dt = float((s["OD"] / s["tdes"]).to("").magnitude)
        if dt >= 0.45 * e_fy:
            raise OutOfScopeError(
                f"Shape {s.designation}: D/t = {dt:.3g} ≥ 0.45E/F_y = {0.45 * e_fy:.3g}: AISC "
                "360-16 §E7.2(b) covers round HSS with D/t < 0.45E/F_y only"
            )
        Dt = c.derive("D_t", s["OD"] / s["tdes"], "wall slenderness D/t", ref="AISC 360-16 §E7.2")
        return c.derive(
            "A_e",
            (0.038 * E / (Fy * Dt) + 2 / 3) * Ag,
            "effective area, round HSS",
            unit="inch**2",
            ref="AISC 360-16 Eq. (E7-7)",
        )
    fcr_fy = float((c.q(Fcr) / c.q(Fy)).to("").magnitude)
    loss: Any = None
    for el in plate_elements(m):
        lam = el.ratio()
        lam_r = el.lam_r * math.sqrt(e_fy)
        if lam <= lam_r * math.sqrt(1 / fcr_fy):
            continue
        tag = el.name.replace(" ", "_")
        b = c.given(f"b_{tag}", el.b, f"width of the {el.name} ({el.case})", source=s.source)
        t = c.given(f"t_{tag}", el.t, f"thickness of the {el.name}", source=s.source)
        lr = c.derive(
            f"lambda_r_{tag}",
            el.lam_r * c.sqrt(E / Fy),
            f"limit, Table B4.1a {el.case}",
            ref="AISC 360-16 Table B4.1a",
        )
        c1 = c.given(f"c_1_{tag}", el.c1, "imperfection adjustment factor", source="Table E7.1")
        c2 = c.given(f"c_2_{tag}", el.c2, "imperfection adjustment factor", source="Table E7.1")
        Fel = c.derive(
            f"F_el_{tag}",
            (c2 * lr / (b / t)) ** 2 * Fy,
            "elastic local buckling stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (E7-5)",
        )
        be = c.derive(
            f"b_e_{tag}",
            c.min(b * (1 - c1 * c.sqrt(Fel / Fcr)) * c.sqrt(Fel / Fcr), b),
            f"effective width of the {el.name}, not more than b",
            unit="inch",
            ref="AISC 360-16 Eq. (E7-3)",
        )
        term = el.count * (b - be) * t
        loss = term if loss is None else loss + term
    if loss is None:
        c.text("At F_cr every element has λ ≤ λ_r √(F_y/F_cr): fully effective (§E7.1(a)).")
        return c.derive("A_e", Ag, "effective area", unit="inch**2", ref="AISC 360-16 §E7.1")
    return c.derive(
        "A_e",
        Ag - loss,
        "effective area, A_g less the ineffective widths",
        unit="inch**2",
        ref="AISC 360-16 §E7",
    )
