"""ASCE/SEI 7-16 basic load combinations: strength design (§2.3.1, seismic §2.3.6) and allowable
stress design (§2.4.1, seismic §2.4.5).

Symbols: D dead, L live, Lr roof live, S snow, R rain, W wind, Eh horizontal and Ev vertical
seismic load effect (§12.4.2). "(Lr or S or R)" expands to one combination per action, numbered
2a/2b/2c and so on. The exception of §2.3.1 (load factor on L of 0.5 in combinations 3, 4 and
6 for occupancies with L_o <= 100 psf, other than garages and places of public assembly) is an
option, off by default.

Provisions should be confirmed against the edition adopted by the local building code.
"""

from __future__ import annotations

from calcpack.combinations.model import CombinationSet, LoadCombination, register_combination_set

__all__ = ["ASCE7_EDITION", "SYMBOLS", "asce7_allowable_stress", "asce7_strength"]

ASCE7_EDITION = "ASCE/SEI 7-16"

SYMBOLS = {
    "D": "dead load",
    "L": "live load",
    "Lr": "roof live load",
    "S": "snow load",
    "R": "rain load",
    "W": "wind load",
    "Eh": "horizontal seismic load effect",
    "Ev": "vertical seismic load effect",
}

_ROOF = ("Lr", "S", "R")
_SUFFIX = "abc"


def asce7_strength(*, reduced_live_factor: bool = False) -> CombinationSet:
    """ASCE/SEI 7-16 §2.3.1 combinations 1-5 and §2.3.6 seismic combinations 6-7 (strength).

    Args:
        reduced_live_factor: apply the §2.3.1 exception (factor 0.5 on L in 3, 4 and 6).
    """
    cl = f"{ASCE7_EDITION} §2.3.1"
    fL = 0.5 if reduced_live_factor else 1.0
    combos = [LoadCombination("1", {"D": 1.4}, f"{cl} (1)")]
    for i, r in enumerate(_ROOF):
        combos.append(
            LoadCombination(f"2{_SUFFIX[i]}", {"D": 1.2, "L": 1.6, r: 0.5}, f"{cl} (2)", ("L",))
        )
    for i, r in enumerate(_ROOF):
        combos.append(
            LoadCombination(f"3{_SUFFIX[i]}", {"D": 1.2, r: 1.6, "L": fL}, f"{cl} (3)", (r,))
        )
        combos.append(
            LoadCombination(f"3{_SUFFIX[i]}-W", {"D": 1.2, r: 1.6, "W": 0.5}, f"{cl} (3)", (r,))
        )
    for i, r in enumerate(_ROOF):
        combos.append(
            LoadCombination(
                f"4{_SUFFIX[i]}", {"D": 1.2, "W": 1.0, "L": fL, r: 0.5}, f"{cl} (4)", ("W",)
            )
        )
    combos.append(LoadCombination("5", {"D": 0.9, "W": 1.0}, f"{cl} (5)", ("W",)))
    cl6 = f"{ASCE7_EDITION} §2.3.6"
    combos.append(
        LoadCombination(
            "6", {"D": 1.2, "Ev": 1.0, "Eh": 1.0, "L": fL, "S": 0.2}, f"{cl6} (6)", ("Eh", "Ev")
        )
    )
    combos.append(
        LoadCombination("7", {"D": 0.9, "Ev": -1.0, "Eh": 1.0}, f"{cl6} (7)", ("Eh", "Ev"))
    )
    return CombinationSet(
        f"{ASCE7_EDITION} §2.3 strength",
        "strength",
        tuple(combos),
        standard=ASCE7_EDITION,
        symbols=SYMBOLS,
    )


def asce7_allowable_stress() -> CombinationSet:
    """ASCE/SEI 7-16 §2.4.1 combinations 1-7 and §2.4.5 seismic combinations 8-10 (ASD)."""
    cl = f"{ASCE7_EDITION} §2.4.1"
    combos = [
        LoadCombination("1", {"D": 1.0}, f"{cl} (1)"),
        LoadCombination("2", {"D": 1.0, "L": 1.0}, f"{cl} (2)", ("L",)),
    ]
    for i, r in enumerate(_ROOF):
        combos.append(LoadCombination(f"3{_SUFFIX[i]}", {"D": 1.0, r: 1.0}, f"{cl} (3)", (r,)))
    for i, r in enumerate(_ROOF):
        combos.append(
            LoadCombination(f"4{_SUFFIX[i]}", {"D": 1.0, "L": 0.75, r: 0.75}, f"{cl} (4)", (r,))
        )
    combos.append(LoadCombination("5", {"D": 1.0, "W": 0.6}, f"{cl} (5)", ("W",)))
    for i, r in enumerate(_ROOF):
        combos.append(
            LoadCombination(
                f"6{_SUFFIX[i]}",
                {"D": 1.0, "L": 0.75, "W": 0.75 * 0.6, r: 0.75},
                f"{cl} (6)",
                ("W",),
            )
        )
    combos.append(LoadCombination("7", {"D": 0.6, "W": 0.6}, f"{cl} (7)", ("W",)))
    cl5 = f"{ASCE7_EDITION} §2.4.5"
    combos.append(
        LoadCombination("8", {"D": 1.0, "Ev": 0.7, "Eh": 0.7}, f"{cl5} (8)", ("Eh", "Ev"))
    )
    combos.append(
        LoadCombination(
            "9",
            {"D": 1.0, "Ev": 0.525, "Eh": 0.525, "L": 0.75, "S": 0.75},
            f"{cl5} (9)",
            ("Eh", "Ev"),
        )
    )
    combos.append(
        LoadCombination("10", {"D": 0.6, "Ev": -0.7, "Eh": 0.7}, f"{cl5} (10)", ("Eh", "Ev"))
    )
    return CombinationSet(
        f"{ASCE7_EDITION} §2.4 allowable stress",
        "allowable stress",
        tuple(combos),
        standard=ASCE7_EDITION,
        symbols=SYMBOLS,
    )


register_combination_set("ASCE7-16 strength", asce7_strength())
register_combination_set("ASCE7-16 ASD", asce7_allowable_stress())
