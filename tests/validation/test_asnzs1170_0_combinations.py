"""AS/NZS 1170.0:2002, Structural design actions Part 0: General principles, Standards
Australia / Standards New Zealand: §4.2.2 combinations of actions for strength (a)-(g), §4.3
serviceability, and the factors ψs, ψl, ψc, ψE of Table 4.1 (from memory).

Factors are exact decimals; tolerance 1e-12 for float products such as 1.5 × 0.4.
"""

from __future__ import annotations

import pytest

from calcpack.combinations import PSI_TABLE_4_1, asnzs1170_serviceability, asnzs1170_strength

TOL = 1e-12

TABLE_4_1 = {  # (ψs, ψl, ψc, ψE)
    "residential": (0.7, 0.4, 0.4, 0.3),
    "office": (0.7, 0.4, 0.4, 0.3),
    "parking": (0.7, 0.4, 0.4, 0.3),
    "retail": (0.7, 0.4, 0.4, 0.3),
    "storage": (1.0, 0.6, 0.6, 0.6),
    "other": (1.0, 0.6, 0.6, 0.6),
    "roof_floor_use": (0.7, 0.4, 0.4, 0.3),
    "roof": (0.7, 0.0, 0.0, 0.0),
}


@pytest.mark.parametrize(("cat", "psi"), TABLE_4_1.items())
def test_table_4_1(cat, psi):
    p = PSI_TABLE_4_1[cat]
    assert (p.psi_s, p.psi_l, p.psi_c, p.psi_E) == psi


def test_strength_4_2_2_office():
    s = asnzs1170_strength("office")
    f = {c.name: dict(c.factors) for c in s}
    assert f["a"] == {"G": 1.35}
    assert f["b"] == {"G": 1.2, "Q": 1.5}
    assert f["c"] == pytest.approx({"G": 1.2, "Q": 1.5 * 0.4}, abs=TOL)
    assert f["d"] == {"G": 1.2, "Wu": 1.0, "Q": 0.4}
    assert f["e"] == {"G": 0.9, "Wu": 1.0}
    assert f["f"] == {"G": 1.0, "Eu": 1.0, "Q": 0.3}
    assert f["g"] == {"G": 1.2, "Su": 1.0, "Q": 0.4}
    assert s["b"].clause == "AS/NZS 1170.0:2002 §4.2.2(b)"


def test_strength_roof_has_no_long_term_line():
    names = [c.name for c in asnzs1170_strength("roof")]
    assert "c" not in names  # ψl = 0: 1.2G + 1.5ψlQ would be 1.2G only


def test_serviceability_4_3_storage():
    s = asnzs1170_serviceability("storage")
    assert dict(s["short-term"].factors) == {"G": 1.0, "Q": 1.0}
    assert dict(s["long-term"].factors) == {"G": 1.0, "Q": 0.6}
    assert dict(s["wind"].factors) == {"G": 1.0, "Ws": 1.0}
