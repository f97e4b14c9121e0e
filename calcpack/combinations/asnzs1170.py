"""AS/NZS 1170.0:2002 combinations of actions: strength (§4.2.2 (a)-(g)) and serviceability
(§4.3), with the short-term, long-term, combination and earthquake factors ψs, ψl, ψc, ψE of
Table 4.1.

Symbols: G permanent, Q imposed, Wu ultimate wind, Ws serviceability wind, Eu ultimate
earthquake, Su ultimate snow. The imposed action's category sets ψ. Provisions should be
confirmed against the edition (and amendments) adopted locally.
"""

from __future__ import annotations

from dataclasses import dataclass

from calcpack.combinations.model import CombinationSet, LoadCombination, register_combination_set
from calcpack.errors import InputError

__all__ = [
    "ASNZS1170_EDITION",
    "PSI_TABLE_4_1",
    "ImposedPsi",
    "asnzs1170_serviceability",
    "asnzs1170_strength",
]

ASNZS1170_EDITION = "AS/NZS 1170.0:2002"


@dataclass(frozen=True)
class ImposedPsi:
    """Short-term ψs, long-term ψl, combination ψc and earthquake ψE factors (Table 4.1)."""

    psi_s: float
    psi_l: float
    psi_c: float
    psi_E: float
    description: str


PSI_TABLE_4_1: dict[str, ImposedPsi] = {
    "residential": ImposedPsi(0.7, 0.4, 0.4, 0.3, "Floors: residential and domestic"),
    "office": ImposedPsi(0.7, 0.4, 0.4, 0.3, "Floors: offices"),
    "parking": ImposedPsi(0.7, 0.4, 0.4, 0.3, "Floors: parking"),
    "retail": ImposedPsi(0.7, 0.4, 0.4, 0.3, "Floors: retail"),
    "storage": ImposedPsi(1.0, 0.6, 0.6, 0.6, "Floors: storage"),
    "other": ImposedPsi(1.0, 0.6, 0.6, 0.6, "Floors: other"),
    "roof_floor_use": ImposedPsi(0.7, 0.4, 0.4, 0.3, "Roofs used for floor-type activities"),
    "roof": ImposedPsi(0.7, 0.0, 0.0, 0.0, "All other roofs"),
}

SYMBOLS = {
    "G": "permanent action",
    "Q": "imposed action",
    "Wu": "ultimate wind action",
    "Ws": "serviceability wind action",
    "Eu": "ultimate earthquake action",
    "Su": "ultimate snow action",
}


def _imposed(category: str) -> ImposedPsi:
    if category not in PSI_TABLE_4_1:
        raise InputError(
            f"Unknown imposed action category {category!r} for Table 4.1 (known: "
            f"{list(PSI_TABLE_4_1)})",
            name="category",
            value=category,
            expected=" / ".join(PSI_TABLE_4_1),
        )
    return PSI_TABLE_4_1[category]


def asnzs1170_strength(category: str = "office") -> CombinationSet:
    """AS/NZS 1170.0:2002 §4.2.2 strength combinations (a)-(g) for imposed action ``category``."""
    p = _imposed(category)
    cl = f"{ASNZS1170_EDITION} §4.2.2"
    combos = [
        LoadCombination("a", {"G": 1.35}, f"{cl}(a)"),
        LoadCombination("b", {"G": 1.2, "Q": 1.5}, f"{cl}(b)", ("Q",)),
    ]
    if p.psi_l > 0:
        combos.append(
            LoadCombination(
                "c", {"G": 1.2, "Q": 1.5 * p.psi_l}, f"{cl}(c)", ("Q",), note=f"ψl = {p.psi_l}"
            )
        )
    combos += [
        LoadCombination(
            "d", {"G": 1.2, "Wu": 1.0, "Q": p.psi_c}, f"{cl}(d)", ("Wu",), note=f"ψc = {p.psi_c}"
        ),
        LoadCombination("e", {"G": 0.9, "Wu": 1.0}, f"{cl}(e)", ("Wu",)),
        LoadCombination(
            "f", {"G": 1.0, "Eu": 1.0, "Q": p.psi_E}, f"{cl}(f)", ("Eu",), note=f"ψE = {p.psi_E}"
        ),
        LoadCombination(
            "g", {"G": 1.2, "Su": 1.0, "Q": p.psi_c}, f"{cl}(g)", ("Su",), note=f"ψc = {p.psi_c}"
        ),
    ]
    return CombinationSet(
        f"{ASNZS1170_EDITION} §4.2.2 strength ({p.description})",
        "strength",
        tuple(combos),
        standard=ASNZS1170_EDITION,
        symbols=SYMBOLS,
    )


def asnzs1170_serviceability(category: str = "office") -> CombinationSet:
    """AS/NZS 1170.0:2002 §4.3 serviceability combinations: G + ψs·Q (short-term),
    G + ψl·Q (long-term) and G + Ws (serviceability wind), ψ from Table 4.1."""
    p = _imposed(category)
    cl = f"{ASNZS1170_EDITION} §4.3"
    combos = [
        LoadCombination("short-term", {"G": 1.0, "Q": p.psi_s}, cl, ("Q",), note=f"ψs = {p.psi_s}"),
        LoadCombination("long-term", {"G": 1.0, "Q": p.psi_l}, cl, note=f"ψl = {p.psi_l}"),
        LoadCombination("wind", {"G": 1.0, "Ws": 1.0}, cl, ("Ws",)),
    ]
    return CombinationSet(
        f"{ASNZS1170_EDITION} §4.3 serviceability ({p.description})",
        "serviceability",
        tuple(combos),
        standard=ASNZS1170_EDITION,
        symbols=SYMBOLS,
    )


register_combination_set("AS/NZS1170 strength", asnzs1170_strength())
register_combination_set("AS/NZS1170 serviceability", asnzs1170_serviceability())
