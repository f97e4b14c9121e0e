"""EN 1990:2002+A1:2005, Eurocode - Basis of structural design, CEN: Eq. (6.10), (6.10a),
(6.10b) for STR/GEO with the recommended partial factors of Table A1.2(B) (γ_G,sup = 1.35,
γ_G,inf = 1.00, γ_Q = 1.5, ξ = 0.85), serviceability Eq. (6.14b), (6.15b), (6.16b), and the
recommended ψ factors for buildings of Annex A1 Table A1.1 (as published).

Factors are products of exact decimals; tolerance 1e-12 for float round-off.
"""

from __future__ import annotations

import pytest

from calcpack.combinations import PSI_BUILDINGS, en1990_combinations, en1990_serviceability

TOL = 1e-12

TABLE_A1_1 = {  # category: (ψ0, ψ1, ψ2)
    "A": (0.7, 0.5, 0.3),
    "B": (0.7, 0.5, 0.3),
    "C": (0.7, 0.7, 0.6),
    "D": (0.7, 0.7, 0.6),
    "E": (1.0, 0.9, 0.8),
    "F": (0.7, 0.7, 0.6),
    "G": (0.7, 0.5, 0.3),
    "H": (0.0, 0.0, 0.0),
    "snow_nordic": (0.70, 0.50, 0.20),
    "snow_above_1000m": (0.70, 0.50, 0.20),
    "snow_up_to_1000m": (0.50, 0.20, 0.0),
    "wind": (0.6, 0.2, 0.0),
    "temperature": (0.6, 0.5, 0.0),
}


@pytest.mark.parametrize(("cat", "psi"), TABLE_A1_1.items())
def test_table_A1_1_psi(cat, psi):
    p = PSI_BUILDINGS[cat]
    assert (p.psi0, p.psi1, p.psi2) == psi


VARIABLE = {"Q": "B", "S": "snow_up_to_1000m", "W": "wind"}


def _f(cset, name):
    return dict(cset[name].factors)


def test_eq_6_10_each_variable_leading():
    s = en1990_combinations(variable=VARIABLE)
    assert _f(s, "6.10 (G)") == {"G": 1.35}
    q = _f(s, "6.10 (Q leading)")
    assert q["G"] == 1.35
    assert q["Q"] == 1.5
    assert q["S"] == pytest.approx(1.5 * 0.5, abs=TOL)
    assert q["W"] == pytest.approx(1.5 * 0.6, abs=TOL)
    w = _f(s, "6.10 (W leading)")
    assert w == pytest.approx({"G": 1.35, "W": 1.5, "Q": 1.05, "S": 0.75}, abs=TOL)
    # wind uplift: permanent action favourable, γ_G,inf = 1.00 (Table A1.2(B))
    assert _f(s, "6.10 (W leading, G favourable)") == {"G": 1.0, "W": 1.5}


def test_eq_6_10a_and_6_10b():
    s = en1990_combinations(variable=VARIABLE, equation="6.10a/b")
    assert _f(s, "6.10a") == pytest.approx({"G": 1.35, "Q": 1.05, "S": 0.75, "W": 0.9}, abs=TOL)
    b = _f(s, "6.10b (Q leading)")
    assert b == pytest.approx({"G": 0.85 * 1.35, "Q": 1.5, "S": 0.75, "W": 0.9}, abs=TOL)
    assert _f(s, "6.10b (S leading)") == pytest.approx(
        {"G": 1.1475, "S": 1.5, "Q": 1.05, "W": 0.9}, abs=TOL
    )


def test_roof_category_H_accompanying_drops_out():
    s = en1990_combinations(variable={"Q": "B", "Qr": "H"})
    assert "Qr" not in _f(s, "6.10 (Q leading)")  # ψ0 = 0


def test_serviceability_6_14b_6_15b_6_16b():
    s = en1990_serviceability(variable={"Q": "B", "W": "wind"})
    assert _f(s, "6.14b (Q leading)") == pytest.approx({"G": 1.0, "Q": 1.0, "W": 0.6}, abs=TOL)
    assert _f(s, "6.15b (Q leading)") == pytest.approx({"G": 1.0, "Q": 0.5}, abs=TOL)  # ψ2,W = 0
    assert _f(s, "6.15b (W leading)") == pytest.approx({"G": 1.0, "W": 0.2, "Q": 0.3}, abs=TOL)
    assert _f(s, "6.16b") == pytest.approx({"G": 1.0, "Q": 0.3}, abs=TOL)
