"""UK National Annex to BS EN 1990:2002+A1:2005 (NA to BS EN 1990:2002+A1:2005, BSI): Table
NA.A1.1 (ψ factors for buildings), Table NA.A1.2(A) (EQU, Set A), Table NA.A1.2(B) (STR/GEO,
Set B, ξ = 0.925) -- from memory; the shared published-values reference confirms ξ = 0.925 and
ψ0 = 0.5 for wind as the UK's differences from the recommended values. The recommended values
(EN 1990 Table A1.1) are confirmed in the shared published-values reference.

Factors are products of exact decimals; tolerance 1e-12 for float round-off.
"""

from __future__ import annotations

import pytest

from calcpack.combinations import (
    annex_combinations,
    annex_equ_combinations,
    annex_serviceability,
    en1990_annex,
)
from calcpack.errors import InputError

TOL = 1e-12

TABLE_NA_A1_1 = {  # category: (ψ0, ψ1, ψ2), from memory
    "A": (0.7, 0.5, 0.3),
    "B": (0.7, 0.5, 0.3),
    "C": (0.7, 0.7, 0.6),
    "D": (0.7, 0.7, 0.6),
    "E": (1.0, 0.9, 0.8),
    "F": (0.7, 0.7, 0.6),
    "G": (0.7, 0.5, 0.3),
    "H": (0.7, 0.0, 0.0),  # the UK gives roofs ψ0 = 0.7 (recommended 0)
    "snow_up_to_1000m": (0.5, 0.2, 0.0),
    "snow_above_1000m": (0.7, 0.5, 0.2),
    "wind": (0.5, 0.2, 0.0),  # confirmed: the UK's ψ0 for wind is 0.5
    "temperature": (0.6, 0.5, 0.0),
}


@pytest.mark.parametrize(("cat", "psi"), TABLE_NA_A1_1.items())
def test_table_NA_A1_1(cat, psi):
    p = en1990_annex("UK").psi[cat]
    assert (p.psi0, p.psi1, p.psi2) == psi


def test_uk_xi_and_set_b():
    uk = en1990_annex("UK")
    # ξ = 0.925: published-values reference (UK NA differs from the recommended 0.85)
    assert uk.xi == 0.925
    b = uk.sets["STR/GEO"]
    assert (b.gamma_G_sup, b.gamma_G_inf, b.gamma_Q) == (1.35, 1.00, 1.5)
    assert en1990_annex("recommended").xi == 0.85


def test_uk_6_10b_gives_1_25_G_plus_1_5_Q():
    # NA.A1.2(B): 6.10b = ξ γ_G G + γ_Q Q = 0.925 x 1.35 = 1.249 G + 1.5 Q;
    # 6.10a = 1.35 G + 1.5 ψ0 Q
    s = annex_combinations(en1990_annex("UK"), variable={"Q": "A", "W": "wind"})
    assert dict(s["6.10b (Q leading)"].factors) == pytest.approx(
        {"G": 1.24875, "Q": 1.5, "W": 0.75}, abs=TOL
    )
    assert dict(s["6.10a"].factors) == pytest.approx({"G": 1.35, "Q": 1.05, "W": 0.75}, abs=TOL)
    # wind uplift with G favourable (γ_G,inf = 1.0)
    assert dict(s["6.10b (W leading, G favourable)"].factors) == {"G": 1.0, "W": 1.5}
    assert "NA.A1.2(B)" in s["6.10b (Q leading)"].clause
    assert "UK National Annex" in s.standard


def test_uk_roof_imposed_accompanies_with_0_7():
    s = annex_combinations(en1990_annex("UK"), variable={"Q": "A", "R": "H"}, equation="6.10")
    assert s["6.10 (Q leading)"].factors["R"] == pytest.approx(1.05, abs=TOL)


def test_uk_serviceability_quasi_permanent_uses_psi2():
    s = annex_serviceability(en1990_annex("UK"), variable={"Q": "A", "S": "snow_up_to_1000m"})
    assert dict(s["6.16b"].factors) == pytest.approx({"G": 1.0, "Q": 0.3}, abs=TOL)
    assert dict(s["6.14b (Q leading)"].factors) == pytest.approx(
        {"G": 1.0, "Q": 1.0, "S": 0.5}, abs=TOL
    )


def test_equ_set_a():
    # Table NA.A1.2(A): γ_G,sup = 1.10, γ_G,inf = 0.90, γ_Q = 1.5 (from memory)
    s = annex_equ_combinations(
        en1990_annex("UK"), variable={"Q": "A", "W": "wind"},
        destabilising=("G_dst",), stabilising=("G_stb",),
    )  # fmt: skip
    assert s.kind == "stability"
    assert dict(s["EQU (W leading)"].factors) == pytest.approx(
        {"G_dst": 1.10, "G_stb": 0.90, "W": 1.5, "Q": 1.05}, abs=TOL
    )


def test_unknown_category_names_the_case():
    with pytest.raises(InputError, match=r"'Z'.*variable\['Q'\]"):
        annex_combinations(en1990_annex("UK"), variable={"Q": "Z"})


def test_unknown_annex_is_refused():
    with pytest.raises(InputError, match=r"annex.*'IE'"):
        en1990_annex("IE")  # type: ignore[arg-type]


def test_equ_case_on_both_sides_is_refused():
    with pytest.raises(InputError, match="stabilising"):
        annex_equ_combinations(
            en1990_annex("UK"), variable={"Q": "A"}, destabilising=("G",), stabilising=("G",)
        )


def test_every_uk_row_cites_its_table_and_basis():
    uk = en1990_annex("UK")
    assert "NA.A1.1" in uk.source("wind")
    assert "from memory" in uk.source("wind")
    assert {s.table for s in uk.sets.values()} == {
        "Table NA.A1.2(A)", "Table NA.A1.2(B)", "Table NA.A1.2(C)"
    }  # fmt: skip
