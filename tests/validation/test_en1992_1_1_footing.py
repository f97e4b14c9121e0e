"""A square pad footing against the equations of EN 1992-1-1:2004, evaluated by hand here.

Source: EN 1992-1-1:2004 Eurocode 2, §3.1.7(3) (stress block), §6.2.2(1) Eq. (6.2a/b), (6.3N)
(shear without shear reinforcement, C_Rd,c = 0.18/γ_c, k = 1 + √(200/d) ≤ 2), §6.4.4(2)
Eq. (6.48)-(6.50) (punching of a footing, v_Rd = C_Rd,c k (100 ρ f_ck)^(1/3) 2d/a), §9.2.1.1(1)
(minimum steel), Table 2.1N (γ_c = 1.5, γ_s = 1.15), recommended α_cc = 1.0; all from memory.
Bars: BS 4449 H16 = 201 mm² (from memory). Loads: G = 600 kN, Q = 300 kN on a 300 mm square
column; EN 1990 Eq. (6.10): N_Ed = 1.35·600 + 1.5·300 = 1260 kN.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.en1992 import ECFootingDesign, check_en1992_footing
from calcpack.errors import InputError
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_

F = Footing("square", Q_(2.2, "m"), Q_(0.5, "m"), Column(Q_(0.3, "m")))
LOADS = {"G": FootingLoad(P=Q_(600, "kN")), "Q": FootingLoad(P=Q_(300, "kN"))}
N = 1260.0
Q = N / 2.2**2  # kPa
DX = 500 - 75 - 8  # mm, bottom layer of H16
DY = 500 - 75 - 16 - 8


@pytest.fixture(scope="module")
def checks():
    return check_en1992_footing(
        F, LOADS, {"Q": "A"}, ECFootingDesign(f_ck=Q_(30, "MPa"), bar="H16")
    )


def test_moment_at_the_column_face(checks):
    M = Q * 2.2 * (1.1 - 0.15) ** 2 / 2
    assert checks["Flexure x"].demand.to("kN*m").magnitude == pytest.approx(M, rel=1e-9)


def test_moment_resistance_of_the_bars_provided(checks):
    r = checks["Flexure x"]
    fcd, fyd = 30 / 1.5, 500 / 1.15
    n = 8  # A_s,min = 0.0013·b·d > 0.26·2.9/500·b·d governs over A_s,req; 8 H16 (1608 mm²)
    As = n * 201
    x = As * fyd / (0.8 * fcd * 2200)
    MRd = As * fyd * min(DX - 0.4 * x, 0.95 * DX) / 1e6
    assert r.capacity.to("kN*m").magnitude == pytest.approx(MRd, rel=1e-9)
    fctm = 0.30 * 30 ** (2 / 3)
    assert checks["Minimum steel x"].demand.to("mm**2").magnitude == pytest.approx(
        max(0.26 * fctm / 500, 0.0013) * 2200 * DX, rel=1e-9
    )


def test_shear_resistance(checks):
    r = checks["Shear x"]
    k = min(1 + math.sqrt(200 / DX), 2)
    rho = 8 * 201 / (2200 * DX)
    v = max(0.12 * k * (100 * rho * 30) ** (1 / 3), 0.035 * k**1.5 * 30**0.5)
    assert r.capacity.to("kN").magnitude == pytest.approx(v * 2200 * DX / 1000, rel=1e-9)
    V = Q * 2.2 * (1.1 - 0.15 - DX / 1000)
    assert r.demand.to("kN").magnitude == pytest.approx(V, rel=1e-9)


def test_punching_governing_perimeter(checks):
    d = (DX + DY) / 2
    rho = math.sqrt(8 * 201 / (2200 * DX) * 8 * 201 / (2200 * DY))
    k = min(1 + math.sqrt(200 / d), 2)
    vr0 = max(0.12 * k * (100 * rho * 30) ** (1 / 3), 0.035 * k**1.5 * 30**0.5)
    c = 300.0
    worst = 0.0
    for i in range(1, 2001):  # a fine search of a in (0, 2d], Eq. (6.48)-(6.50)
        a = 2 * d * i / 2000
        Ain = (c * c + 4 * c * a + math.pi * a * a) / 1e6
        V = N * (1 - Ain / 2.2**2)
        u = 4 * c + 2 * math.pi * a
        worst = max(worst, (V * 1000 / (u * d)) / (vr0 * 2 * d / a))
    # calcpack searches 20 perimeters (within 1 % below the fine maximum) and draws the corner
    # arcs as 16-segment polygons (slightly less area inside, within 0.1 % above)
    assert worst * 0.99 <= checks["Punching"].utilisation <= worst * 1.001


def test_strength_out_of_range_is_refused():
    with pytest.raises(InputError, match="Input f_ck"):
        ECFootingDesign(f_ck=Q_(70, "MPa"))
    with pytest.raises(InputError, match="BS 4449 bar size"):
        ECFootingDesign(f_ck=Q_(30, "MPa"), bar="H14")
