"""ASCE/SEI 7-16, Minimum Design Loads and Associated Criteria for Buildings and Other
Structures, American Society of Civil Engineers, 2017: §2.3.1 basic combinations for strength
design (1)-(5), §2.3.6 (6)-(7) with seismic load effects, §2.4.1 basic combinations for
allowable stress design (1)-(7) and §2.4.5 (8)-(10).

Factors recalled from the published equations (from memory), checked line by line. Load factors
are exact decimal numbers, so the comparisons are exact (tolerance 1e-12 for float products
such as 0.75 × 0.6).
"""

from __future__ import annotations

import pytest

from calcpack.combinations import asce7_allowable_stress, asce7_strength

TOL = 1e-12  # exact decimal factors; only float round-off

STRENGTH = {
    "1": {"D": 1.4},
    "2a": {"D": 1.2, "L": 1.6, "Lr": 0.5},
    "2b": {"D": 1.2, "L": 1.6, "S": 0.5},
    "2c": {"D": 1.2, "L": 1.6, "R": 0.5},
    "3a": {"D": 1.2, "Lr": 1.6, "L": 1.0},
    "3a-W": {"D": 1.2, "Lr": 1.6, "W": 0.5},
    "3b": {"D": 1.2, "S": 1.6, "L": 1.0},
    "3b-W": {"D": 1.2, "S": 1.6, "W": 0.5},
    "3c": {"D": 1.2, "R": 1.6, "L": 1.0},
    "3c-W": {"D": 1.2, "R": 1.6, "W": 0.5},
    "4a": {"D": 1.2, "W": 1.0, "L": 1.0, "Lr": 0.5},
    "4b": {"D": 1.2, "W": 1.0, "L": 1.0, "S": 0.5},
    "4c": {"D": 1.2, "W": 1.0, "L": 1.0, "R": 0.5},
    "5": {"D": 0.9, "W": 1.0},
    "6": {"D": 1.2, "Ev": 1.0, "Eh": 1.0, "L": 1.0, "S": 0.2},
    "7": {"D": 0.9, "Ev": -1.0, "Eh": 1.0},
}

ASD = {
    "1": {"D": 1.0},
    "2": {"D": 1.0, "L": 1.0},
    "3a": {"D": 1.0, "Lr": 1.0},
    "3b": {"D": 1.0, "S": 1.0},
    "3c": {"D": 1.0, "R": 1.0},
    "4a": {"D": 1.0, "L": 0.75, "Lr": 0.75},
    "4b": {"D": 1.0, "L": 0.75, "S": 0.75},
    "4c": {"D": 1.0, "L": 0.75, "R": 0.75},
    "5": {"D": 1.0, "W": 0.6},
    "6a": {"D": 1.0, "L": 0.75, "W": 0.45, "Lr": 0.75},
    "6b": {"D": 1.0, "L": 0.75, "W": 0.45, "S": 0.75},
    "6c": {"D": 1.0, "L": 0.75, "W": 0.45, "R": 0.75},
    "7": {"D": 0.6, "W": 0.6},
    "8": {"D": 1.0, "Ev": 0.7, "Eh": 0.7},
    "9": {"D": 1.0, "Ev": 0.525, "Eh": 0.525, "L": 0.75, "S": 0.75},
    "10": {"D": 0.6, "Ev": -0.7, "Eh": 0.7},
}


def _same(actual: dict[str, float], expected: dict[str, float]) -> None:
    assert set(actual) == set(expected)
    for k, v in expected.items():
        assert actual[k] == pytest.approx(v, abs=TOL), k


@pytest.mark.parametrize(("name", "factors"), STRENGTH.items())
def test_strength_combination_2_3(name, factors):
    _same(dict(asce7_strength()[name].factors), factors)


def test_strength_set_has_exactly_these_lines():
    assert [c.name for c in asce7_strength()] == list(STRENGTH)


def test_strength_exception_live_factor_half():
    # §2.3.1 exception: 0.5 on L in (3), (4) and (6) for L_o <= 100 psf (not garages/assembly)
    s = asce7_strength(reduced_live_factor=True)
    assert s["3a"].factors["L"] == 0.5
    assert s["4b"].factors["L"] == 0.5
    assert s["6"].factors["L"] == 0.5
    assert s["2a"].factors["L"] == 1.6  # (2) is unchanged


@pytest.mark.parametrize(("name", "factors"), ASD.items())
def test_allowable_stress_combination_2_4(name, factors):
    _same(dict(asce7_allowable_stress()[name].factors), factors)


def test_allowable_stress_set_has_exactly_these_lines():
    assert [c.name for c in asce7_allowable_stress()] == list(ASD)


def test_clauses_are_named():
    assert asce7_strength()["2b"].clause == "ASCE/SEI 7-16 §2.3.1 (2)"
    assert asce7_strength()["7"].clause == "ASCE/SEI 7-16 §2.3.6 (7)"
    assert asce7_allowable_stress()["6b"].clause == "ASCE/SEI 7-16 §2.4.1 (6)"
    assert asce7_allowable_stress()["9"].clause == "ASCE/SEI 7-16 §2.4.5 (9)"
