"""Pad footing bearing resistance against EN 1997-1:2004 Annex D and Annex A, evaluated by hand
in this file.

Source: EN 1997-1:2004 Eurocode 7, Annex D (D.3 undrained, D.4 drained; N_q = e^(π tan φ')
tan²(45° + φ'/2), N_c = (N_q − 1) cot φ', N_γ = 2 (N_q − 1) tan φ'; shape and inclination
factors), Annex A Tables A.3 to A.5 (DA1: A1 γ_G = 1.35, γ_Q = 1.5; A2 γ_G = 1.0, γ_Q = 1.3;
M2 γ_φ' = 1.25, γ_cu = 1.4; R1 γ_R;v = 1.0), all from memory. Tabulated factors for φ' = 30°:
N_q = 18.40, N_c = 30.14, N_γ = 20.09 (as printed in common EC7 design aids, from memory). The
JRC report EUR 26227 EN worked examples could not be recalled to the digit and are not used.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.en1997 import PresumedBearing, SoilStrength, check_en1997_pad
from calcpack.errors import InputError
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_

F = Footing("square", Q_(2, "m"), Q_(0.5, "m"), Column(Q_(0.3, "m")),
            gamma_concrete=Q_(25, "kN/m**3"), soil_cover=Q_(0.5, "m"),
            gamma_soil=Q_(18, "kN/m**3"))  # fmt: skip
W = 25 * 4 * 0.5 + 18 * (4 - 0.09) * 0.5  # kN, footing + soil over it
LOADS = {"G": FootingLoad(P=Q_(500, "kN")), "Q": FootingLoad(P=Q_(200, "kN"))}


def test_bearing_factors_for_30_degrees():
    soil = SoilStrength("drained", Q_(18, "kN/m**3"), "x", phi_k=Q_(30, "degree"))
    r = check_en1997_pad(F, LOADS, {"Q": "A"}, soil)
    t = math.tan(math.radians(30))
    Nq = math.exp(math.pi * t) * math.tan(math.radians(60)) ** 2
    assert Nq == pytest.approx(18.40, abs=0.01)  # tabulated, from memory
    assert (Nq - 1) / t == pytest.approx(30.14, abs=0.01)
    assert 2 * (Nq - 1) * t == pytest.approx(20.09, abs=0.01)
    # DA1-1, concentric, drained, c' = 0: R/A' = q Nq sq + 0.5 γ B Nγ sγ, square: sq = 1 + sin φ
    sq, sg = 1 + math.sin(math.radians(30)), 0.7
    R = (18 * 1.0 * Nq * sq + 0.5 * 18 * 2 * 2 * (Nq - 1) * t * sg) * 4
    chk = r["Bearing DA1-1"]
    assert chk.capacity.to("kN").magnitude == pytest.approx(R, rel=1e-9)
    assert chk.demand.to("kN").magnitude == pytest.approx(1.35 * (500 + W) + 1.5 * 200)


def test_undrained_da1_2():
    soil = SoilStrength("undrained", Q_(18, "kN/m**3"), "x", cu_k=Q_(80, "kPa"))
    r = check_en1997_pad(F, LOADS, {"Q": "A"}, soil)
    # D.3: (π + 2) cu;d sc + q with cu;d = 80/1.4, sc = 1.2 (square), no H: ic = 1
    R = ((math.pi + 2) * 80 / 1.4 * 1.2 + 18) * 4
    assert r["Bearing DA1-2"].capacity.to("kN").magnitude == pytest.approx(R, rel=1e-9)
    assert r["Bearing DA1-2"].demand.to("kN").magnitude == pytest.approx(500 + W + 1.3 * 200)


def test_eccentric_load_uses_the_effective_width():
    loads = {
        "G": FootingLoad(P=Q_(500, "kN"), My=Q_(100, "kN*m")),
        "Q": FootingLoad(P=Q_(200, "kN")),
    }
    soil = SoilStrength("undrained", Q_(18, "kN/m**3"), "x", cu_k=Q_(80, "kPa"))
    r = check_en1997_pad(F, loads, {"Q": "A"}, soil)
    V = 500 + W + 1.3 * 200
    Bp = 2 - 2 * 100 / V  # D.1: B' = B - 2e
    R = ((math.pi + 2) * 80 / 1.4 * (1 + 0.2 * Bp / 2) + 18) * Bp * 2
    assert r["Bearing DA1-2"].capacity.to("kN").magnitude == pytest.approx(R, rel=1e-9)


def test_sliding_drained():
    loads = {"G": FootingLoad(P=Q_(500, "kN")), "Q": FootingLoad(P=Q_(200, "kN"), Vx=Q_(60, "kN"))}
    soil = SoilStrength("drained", Q_(18, "kN/m**3"), "x", phi_k=Q_(30, "degree"))
    r = check_en1997_pad(F, loads, {"Q": "A"}, soil)
    # §6.5.3: R = V' tan φ'_d with G favourable (1.0) and the downward Q ignored
    td = math.tan(math.radians(30)) / 1.25
    s = r["Sliding DA1-2"]
    assert s.capacity.to("kN").magnitude == pytest.approx((500 + W) * td, rel=1e-9)
    assert s.demand.to("kN").magnitude == pytest.approx(1.3 * 60)


def test_presumed_value_against_characteristic_pressure():
    r = check_en1997_pad(F, LOADS, {"Q": "A"}, PresumedBearing(Q_(250, "kPa"), "invented table"))
    assert r["Presumed bearing"].demand.to("kPa").magnitude == pytest.approx((700 + W) / 4)


def test_drained_needs_phi():
    with pytest.raises(InputError, match="Input phi_k"):
        SoilStrength("drained", Q_(18, "kN/m**3"), "x")
    with pytest.raises(InputError, match="Input phi_k must be"):
        SoilStrength("drained", Q_(18, "kN/m**3"), "x", phi_k=Q_(60, "degree"))
