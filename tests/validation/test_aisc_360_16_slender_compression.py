"""ANSI/AISC 360-16 §E7: members with slender elements in compression, through
check_aisc_member.

No published worked example of §E7 is in the project's published-values reference; the
reference is the Specification's equations, recalled ("from memory") and evaluated by hand here
on the tabulated properties of the AISC Shapes Database v16.0:

* (E3-2)/(E3-3) F_cr from F_e = π²E/(L_c/r)² (E3-4), and (E4-2) for I-shapes;
* (E7-1) P_n = F_cr A_e; b_e = b when λ ≤ λ_r √(F_y/F_cr), else (E7-3)
  b_e = b (1 − c_1 √(F_el/F_cr)) √(F_el/F_cr) with (E7-5) F_el = (c_2 λ_r/λ)² F_y;
  Table E7.1: c_1, c_2 = 0.18, 1.31 (stiffened elements but HSS walls), 0.20, 1.38 (HSS
  walls), 0.22, 1.49 (all other elements);
* (E7-7) round HSS: A_e = [0.038E/(F_y D/t) + 2/3] A_g.

Tolerance 1e-6 relative: the same equations on the same tabulated values.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aisc360.member import check_aisc_member
from calcpack.checks.aisc360.member_data import MemberForces, SteelMember
from calcpack.sections.aisc_database import aisc_shape
from calcpack.units import Q_

E, FY, G = 29000.0, 50.0, 11200.0


def _fcr(fe):
    return 0.658 ** (FY / fe) * FY if FY / fe <= 2.25 else 0.877 * fe


def _be(b, t, lam_r, c1, c2, fcr):
    lam = b / t
    if lam <= lam_r * math.sqrt(FY / fcr):
        return b
    fel = (c2 * lam_r / lam) ** 2 * FY
    return b * (1 - c1 * math.sqrt(fel / fcr)) * math.sqrt(fel / fcr)


def _pn(name, L_ft):
    m = SteelMember(aisc_shape(name), Fy=Q_(FY, "ksi"), Lcx=Q_(L_ft, "ft"), Lcy=Q_(L_ft, "ft"))
    cap = check_aisc_member(m, MemberForces(P=Q_(1, "kip")))["Compression"].capacity
    return cap.to("kip").magnitude / 0.90


def test_e7_w14x22_slender_web_at_5_ft():
    # W14X22: A 6.49, d 13.7, t_w 0.230, k_des 0.735, r_y 1.04, I_x 199, I_y 7.00, J 0.208,
    # C_w 314; h = d − 2k_des
    L = 60.0
    fe = min(
        math.pi**2 * E / (L / 1.04) ** 2,
        (math.pi**2 * E * 314 / L**2 + G * 0.208) / (199 + 7.0),  # (E4-2)
    )
    fcr = _fcr(fe)
    h, tw = 13.7 - 2 * 0.735, 0.23
    be = _be(h, tw, 1.49 * math.sqrt(E / FY), 0.18, 1.31, fcr)
    assert be < h  # the web is partly ineffective at this F_cr
    expected = fcr * (6.49 - (h - be) * tw)
    assert _pn("W14X22", 5) == pytest.approx(expected, rel=1e-6)


def test_e7_hss8x8x1_8_slender_walls():
    # HSS8X8X1/8: A 3.62, flat width b = h = 7.65, t_des 0.116, r 3.21
    fcr = _fcr(math.pi**2 * E / (120 / 3.21) ** 2)
    be = _be(7.65, 0.116, 1.40 * math.sqrt(E / FY), 0.20, 1.38, fcr)
    expected = fcr * (3.62 - 4 * (7.65 - be) * 0.116)
    assert _pn("HSS8X8X1/8", 10) == pytest.approx(expected, rel=1e-6)


def test_e7_round_hss20x0_250_effective_area():
    # HSS20.000X0.250: A 14.4, D 20.0, t_des 0.233, r 6.99; D/t = 85.8 > 0.11E/F_y = 63.8
    Dt = 20.0 / 0.233
    fcr = _fcr(math.pi**2 * E / (240 / 6.99) ** 2)
    Ae = (0.038 * E / (FY * Dt) + 2 / 3) * 14.4
    assert _pn("HSS20.000X0.250", 20) == pytest.approx(fcr * Ae, rel=1e-6)


def test_e7_long_member_is_fully_effective():
    # at low F_cr no element exceeds λ_r √(F_y/F_cr): A_e = A_g (§E7.1(a))
    L = 240.0
    fe = min(
        math.pi**2 * E / (L / 1.04) ** 2,
        (math.pi**2 * E * 314 / L**2 + G * 0.208) / (199 + 7.0),
    )
    assert _pn("W14X22", 20) == pytest.approx(_fcr(fe) * 6.49, rel=1e-6)
