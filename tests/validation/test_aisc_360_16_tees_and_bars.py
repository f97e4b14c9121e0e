"""ANSI/AISC 360-16 §F9 (tees) and §F11 (rectangular and round bars) through check_aisc_member.

No published worked example of these clauses is in the project's published-values reference;
the reference is the Specification's equations, recalled ("from memory") and evaluated by hand
below, on the tabulated properties of the AISC Shapes Database v16.0 (WT9X25: d 9.00, b_f 7.50,
t_f 0.570, t_w 0.355 in, y 2.12 in, I_x 53.5, Z_x 13.8, S_x 7.79, I_y 20.0, J 0.619, r_y 1.65;
WT12X31: d 11.9, t_w 0.430, I_x 131, Z_x 28.4, S_x 15.6, I_y 17.2, J 0.850, r_y 1.38):

* (F9-2) M_p = F_y Z_x ≤ 1.6 M_y, (F9-3) M_y = F_y S_x (stem in tension); (F9-4) M_p = M_y
  (stem in compression); (F9-8) L_p = 1.76 r_y √(E/F_y); (F9-9) L_r = 1.95 (E/F_y)(√(I_y J)/S_x)
  √(2.36 (F_y/E) d S_x/J + 1); (F9-6) inelastic LTB; (F9-10) M_cr = 1.95E/L_b √(I_y J)
  (B + √(1 + B²)) with B = ±2.3 (d/L_b)√(I_y/J); (F9-16)-(F9-19) stem local buckling;
* (F11-1) M_n = F_y Z ≤ 1.6 F_y S; (F11-2) M_n = C_b [1.52 − 0.274 (L_b d/t²)(F_y/E)] M_y ≤ M_p;
  (F11-3), (F11-4) F_cr = 1.9 E C_b/(L_b d/t²).

Tolerance: 1e-6 relative (the same arithmetic on the same tabulated values).
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aisc360.member import check_aisc_member
from calcpack.checks.aisc360.member_data import MemberForces, SteelMember
from calcpack.sections.aisc_database import aisc_shape
from calcpack.sections.steel_bars import rectangular_bar, round_bar
from calcpack.units import Q_

E, FY = 29000.0, 50.0


def _mn(member, axis="x"):
    f = MemberForces(Mx=Q_(1, "kip*ft")) if axis == "x" else MemberForces(My=Q_(1, "kip*ft"))
    cap = check_aisc_member(member, f)[f"Flexure {axis}"].capacity
    return cap.to("kip*inch").magnitude / 0.90


def test_f9_wt9x25_stem_in_tension_braced_is_yielding_capped_at_1_6_my():
    Mp = min(FY * 13.8, 1.6 * FY * 7.79)  # Eq. (F9-2), (F9-3): 690 kip·in
    # flange b_f/2t_f = 6.58 ≤ 0.38√(E/F_y) = 9.15: compact (Table B4.1b case 10)
    got = _mn(SteelMember(aisc_shape("WT9X25"), Fy=Q_(FY, "ksi")))
    assert got == pytest.approx(Mp, rel=1e-6)


def test_f9_wt12x31_stem_in_tension_inelastic_ltb():
    d, Sx, Zx, Iy, J, ry, Lb = 11.9, 15.6, 28.4, 17.2, 0.85, 1.38, 20 * 12.0
    My = FY * Sx
    Mp = min(FY * Zx, 1.6 * My)
    Lp = 1.76 * ry * math.sqrt(E / FY)
    Lr = 1.95 * (E / FY) * math.sqrt(Iy * J) / Sx * math.sqrt(2.36 * (FY / E) * d * Sx / J + 1)
    assert Lp < Lb <= Lr  # the inelastic range, Eq. (F9-6)
    expected = Mp - (Mp - My) * (Lb - Lp) / (Lr - Lp)
    m = SteelMember(aisc_shape("WT12X31"), Fy=Q_(FY, "ksi"), Lb=Q_(20, "ft"))
    assert _mn(m) == pytest.approx(expected, rel=1e-6)


def test_f9_wt12x31_stem_in_compression():
    d, tw, Sx, Iy, J, Lb = 11.9, 0.43, 15.6, 17.2, 0.85, 20 * 12.0
    My = FY * Sx  # Eq. (F9-4): M_p = M_y
    B = -2.3 * (d / Lb) * math.sqrt(Iy / J)
    Mcr = 1.95 * E / Lb * math.sqrt(Iy * J) * (B + math.sqrt(1 + B**2))  # Eq. (F9-10)
    lam, root = d / tw, math.sqrt(E / FY)  # d/t_w = 27.7, between 0.84 and 1.52 √(E/F_y)
    assert 0.84 * root < lam <= 1.52 * root
    Fcr = (1.43 - 0.515 * lam * math.sqrt(FY / E)) * FY  # Eq. (F9-18)
    expected = min(My, min(Mcr, My), Fcr * Sx)
    m = SteelMember(
        aisc_shape("WT12X31"), Fy=Q_(FY, "ksi"), Lb=Q_(20, "ft"), tee_stem="compression"
    )
    assert _mn(m) == pytest.approx(expected, rel=1e-6)


@pytest.mark.parametrize("Lb_ft", [1.0, 10.0, 40.0])
def test_f11_rectangular_bar_about_its_major_axis(Lb_ft):
    d, t, Fy = 6.0, 0.75, 36.0
    Sx, Zx, Lb = t * d**2 / 6, t * d**2 / 4, Lb_ft * 12
    My, Mp = Fy * Sx, min(Fy * Zx, 1.6 * Fy * Sx)
    lam = Lb * d / t**2
    if lam <= 0.08 * E / Fy:
        expected = Mp
    elif lam <= 1.9 * E / Fy:
        expected = min((1.52 - 0.274 * lam * Fy / E) * My, Mp)  # Eq. (F11-2), C_b = 1
    else:
        expected = min(1.9 * E / lam * Sx, Mp)  # Eq. (F11-3), (F11-4)
    bar = rectangular_bar(d=Q_(d, "inch"), t=Q_(t, "inch"))
    got = _mn(SteelMember(bar, Fy=Q_(Fy, "ksi"), Lb=Q_(Lb_ft, "ft")))
    assert got == pytest.approx(expected, rel=1e-6)


def test_f11_round_bar_is_capped_at_1_6_my():
    D, Fy = 2.0, 36.0
    expected = min(Fy * D**3 / 6, 1.6 * Fy * math.pi * D**3 / 32)  # Eq. (F11-1)
    got = _mn(SteelMember(round_bar(D=Q_(D, "inch")), Fy=Q_(Fy, "ksi"), Lb=Q_(30, "ft")))
    assert got == pytest.approx(expected, rel=1e-6)


def test_f11_rectangular_bar_about_its_minor_axis_has_no_ltb():
    d, t, Fy = 6.0, 0.75, 36.0
    expected = min(Fy * d * t**2 / 4, 1.6 * Fy * d * t**2 / 6)
    bar = rectangular_bar(d=Q_(d, "inch"), t=Q_(t, "inch"))
    got = _mn(SteelMember(bar, Fy=Q_(Fy, "ksi"), Lb=Q_(30, "ft")), axis="y")
    assert got == pytest.approx(expected, rel=1e-6)


def test_f9_double_angle_web_legs_in_tension_and_in_compression():
    # 2L4X4X1/4 with a 3/8 in. gap, A36; single angle (AISC Shapes Database v16.0):
    # Z_x 1.82, S_x 1.03 in³, I_x 3.00 in⁴, ȳ 1.08 in, b = d = 4 in, t = 1/4 in.
    # Equations from memory: (F9-2) M_p = F_y Z_x ≤ 1.6 M_y (web legs in tension); (F9-5)
    # M_p = 1.5 M_y (web legs in compression); §F9.3(b)/§F9.4(b) leg local buckling by §F10.3:
    # (F10-6) M_n = F_y S_c (2.43 − 1.72 (b/t)√(F_y/E)) for 0.54 < (b/t)/√(E/F_y) ≤ 0.91.
    from calcpack.sections.double_angle import double_angle

    Fy, E_ = 36.0, 29000.0
    Sx, Zx, Ix, y, bt = 2 * 1.03, 2 * 1.82, 2 * 3.00, 1.08, 4 / 0.25
    two = double_angle(aisc_shape("L4X4X1/4"), gap=Q_(0.375, "inch"))
    llb = 2.43 - 1.72 * bt * math.sqrt(Fy / E_)
    tension = min(Fy * Zx, 1.6 * Fy * Sx, Fy * (Ix / y) * llb)
    compression = min(1.5 * Fy * Sx, Fy * Sx * llb)
    for stem, expected in (("tension", tension), ("compression", compression)):
        m = SteelMember(two, Fy=Q_(Fy, "ksi"), tee_stem=stem)
        assert _mn(m) == pytest.approx(expected, rel=1e-6)


def test_double_angle_section_by_parallel_axes():
    from calcpack.sections.double_angle import double_angle

    L = aisc_shape("L4X3X3/8")
    two = double_angle(L, gap=Q_(0.5, "inch"))
    A, Iy, x = (L[k].to_base_units().magnitude for k in ("A", "Iy", "x"))
    g = Q_(0.5, "inch").to_base_units().magnitude
    assert two["Iy"].to_base_units().magnitude == pytest.approx(2 * (Iy + A * (x + g / 2) ** 2))
    assert two["A"].to_base_units().magnitude == pytest.approx(2 * A)


def test_double_angle_refusals_and_bad_input():
    from calcpack.errors import DimensionError, InputError, OutOfScopeError
    from calcpack.sections.double_angle import double_angle

    two = double_angle(aisc_shape("L4X4X1/4"), gap=Q_(0.375, "inch"))
    m = SteelMember(two, Fy=Q_(36, "ksi"), Lcx=Q_(6, "ft"), Lcy=Q_(6, "ft"))
    with pytest.raises(OutOfScopeError, match="§E6"):
        check_aisc_member(m, MemberForces(P=Q_(1, "kip")))
    with pytest.raises(OutOfScopeError, match="double angles about"):
        check_aisc_member(m, MemberForces(My=Q_(1, "kip*ft")))
    with pytest.raises(InputError, match="angle"):
        double_angle(aisc_shape("W8X31"), gap=Q_(0.375, "inch"))
    with pytest.raises(DimensionError, match="gap"):
        double_angle(aisc_shape("L4X4X1/4"), gap=Q_(0.375, "kip"))
