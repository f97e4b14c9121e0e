"""A square spread footing checked against the equations of ACI CODE-318-19, evaluated by hand
in this file (each clause named beside its assertion).

Source: ACI CODE-318-19, Building Code Requirements for Structural Concrete (American Concrete
Institute, 2019): §13.2.7.1 (section for moment at the column face), §13.2.7.2 (one-way shear at
d from it), §22.2 (flexure, stress block), §22.6 and Table 22.6.5.2 (two-way shear, 4·λ·√f'c
governs a square column), §22.8.3.2 (bearing, √(A2/A1) ≤ 2), §25.4.2.4 (development length),
Table 21.2.1 (φ). Clause numbers and equations are recalled (from memory) and must be confirmed
against the printed standard. The ACI MNL-17 footing examples could not be recalled to the
digit and are not used here.

Footing: 8 ft x 8 ft x 20 in., 16 in. square concrete column, #6 bars (ASTM A615: d_b =
0.750 in., A_b = 0.44 in², from memory), 3 in. cover, f'c = 4000 psi, Grade 60;
D = 150 kip, L = 100 kip, so P_u = 1.2·150 + 1.6·100 = 340 kip (ASCE/SEI 7-16 §2.3.1 (2)).
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.combinations.asce7 import asce7_strength
from calcpack.errors import InputError
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_

FOOTING = Footing("square", Q_(8, "ft"), Q_(20, "inch"), Column(Q_(16, "inch")))
LOADS = {"D": FootingLoad(P=Q_(150, "kip")), "L": FootingLoad(P=Q_(100, "kip"))}
DESIGN = ACIFootingDesign(f_c=Q_(4000, "psi"), bar="#6")
PU = 340.0  # kip
QU = PU / 64.0  # ksf, net factored pressure
D_X = 20 - 3 - 0.375  # in., bottom layer
D_Y = 20 - 3 - 0.75 - 0.375  # in., second layer
SQRT_FC = math.sqrt(4000)


@pytest.fixture(scope="module")
def checks():
    return check_aci_footing(FOOTING, LOADS, asce7_strength(), DESIGN)


def test_factored_moment_at_the_column_face(checks):
    # §13.2.7.1: Mu = qu·B·(B/2 - c/2)^2/2 = 5.3125 ksf · 8 ft · (3.333 ft)^2 / 2
    Mu = QU * 8 * (4 - 8 / 12) ** 2 / 2
    assert checks["Flexure x"].demand.to("kip*ft").magnitude == pytest.approx(Mu, rel=1e-9)


def test_flexural_strength_of_the_bars_provided(checks):
    r = checks["Flexure x"]
    # 0.0018·b·h = 3.456 in² governs over A_s,req: 8 #6 = 3.52 in² (§8.6.1.1, §8.7.2.2)
    As = 8 * 0.44
    a = As * 60000 / (0.85 * 4000 * 96)  # §22.2.2.4.1
    phiMn = 0.9 * As * 60 * (D_X - a / 2) / 12  # kip·ft, §22.2, φ = 0.90
    assert r.capacity.to("kip*ft").magnitude == pytest.approx(phiMn, rel=1e-9)


def test_one_way_shear_at_d(checks):
    r = checks["One-way shear x"]
    Vu = QU * 8 * (4 - 8 / 12 - D_X / 12)  # §13.2.7.2
    assert r.demand.to("kip").magnitude == pytest.approx(Vu, rel=1e-9)
    rho = 3.52 / (96 * D_X)
    Vc = min(8 * rho ** (1 / 3) * SQRT_FC * 96 * D_X, 5 * SQRT_FC * 96 * D_X) / 1000
    # Table 22.5.5.1(c) with λs neglected (§13.2.6.2), φ = 0.75
    assert r.capacity.to("kip").magnitude == pytest.approx(0.75 * Vc, rel=1e-9)


def test_two_way_shear(checks):
    r = checks["Two-way shear"]
    d = (D_X + D_Y) / 2
    b1 = 16 + d
    Vu = PU * (1 - (b1 / 96) ** 2)  # load less the pressure inside the perimeter
    vu = Vu * 1000 / (4 * b1 * d)
    assert r.demand.to("psi").magnitude == pytest.approx(vu, rel=1e-9)
    # Table 22.6.5.2: β = 1 and αs·d/b0 large, so 4·λ·√f'c governs; φ = 0.75
    assert r.capacity.to("psi").magnitude == pytest.approx(0.75 * 4 * SQRT_FC, rel=1e-9)


def test_bearing_on_the_footing(checks):
    # §22.8.3.2: φ·0.85·f'c·A1·2 with A1 = 256 in², φ = 0.65
    assert checks["Bearing"].capacity.to("kip").magnitude == pytest.approx(
        0.65 * 0.85 * 4 * 256 * 2, rel=1e-9
    )
    assert checks["Bearing"].demand.to("kip").magnitude == pytest.approx(PU)


def test_development_length(checks):
    # §25.4.2.4: ld = 3/40 · fy/(λ√f'c) · ψtψeψsψg/((cb+Ktr)/db) · db, ψs = 0.8 (#6),
    # (cb + Ktr)/db = 4.5 -> 2.5
    ld = 3 / 40 * 60000 / SQRT_FC * 0.8 / 2.5 * 0.75
    r = checks["Development x"]
    assert r.demand.to("inch").magnitude == pytest.approx(ld, rel=1e-9)
    assert r.capacity.to("inch").magnitude == pytest.approx(48 - 8 - 3)


def test_size_effect_when_applied():
    d = ACIFootingDesign(f_c=Q_(4000, "psi"), bar="#6", size_effect=True)
    r = check_aci_footing(FOOTING, LOADS, asce7_strength(), d)["Two-way shear"]
    dd = (D_X + D_Y) / 2
    ls = math.sqrt(2 / (1 + dd / 10))  # §22.5.5.1.3
    assert r.capacity.to("psi").magnitude == pytest.approx(0.75 * 4 * ls * SQRT_FC, rel=1e-9)


def test_unknown_bar_size_is_refused_naming_the_input():
    with pytest.raises(InputError, match="Unknown ASTM bar size '#12' for input bar") as e:
        ACIFootingDesign(f_c=Q_(4000, "psi"), bar="#12")
    assert e.value.name == "bar"


def test_concrete_strength_range():
    with pytest.raises(InputError, match="Input f_c must be from"):
        ACIFootingDesign(f_c=Q_(2000, "psi"))
