"""check_aisc_member: refusals, bad input and the working (numbers are validated in
tests/validation/test_aisc_design_examples_members.py)."""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.member import check_aisc_member
from calcpack.checks.aisc360.member_data import MemberForces, SteelMember
from calcpack.errors import DimensionError, InputError, OutOfScopeError
from calcpack.sections.aisc_database import aisc_shape
from calcpack.sections.steel_bars import rectangular_bar, round_bar
from calcpack.units import Q_

KSI = Q_(50, "ksi")


def test_slender_compression_element_uses_the_effective_area():
    m = SteelMember(aisc_shape("WT6X13"), Fy=KSI, Lcx=Q_(5, "ft"), Lcy=Q_(5, "ft"))
    r = check_aisc_member(m, MemberForces(P=Q_(10, "kip")))
    assert r.values["A_e"] < r.values["A_g"]
    refs = [getattr(step, "ref", None) for step in r.working()]
    assert "AISC 360-16 Eq. (E7-1)" in refs
    assert "AISC 360-16 Eq. (E7-3)" in refs


def test_single_angle_with_axial_force_and_flexure_is_refused():
    m = SteelMember(aisc_shape("L4X4X1/4"), Fy=Q_(36, "ksi"), Lcx=Q_(4, "ft"), Lcy=Q_(4, "ft"))
    with pytest.raises(OutOfScopeError, match="§H2"):
        check_aisc_member(m, MemberForces(P=Q_(1, "kip"), Mx=Q_(1, "kip*ft")))


def test_unequal_angle_without_restraint_is_refused():
    m = SteelMember(aisc_shape("L6X4X3/8"), Fy=Q_(36, "ksi"), Lb=Q_(6, "ft"))
    with pytest.raises(OutOfScopeError, match="principal axes"):
        check_aisc_member(m, MemberForces(Mx=Q_(1, "kip*ft")))


def test_tee_flexure_about_its_axis_of_symmetry_is_refused():
    m = SteelMember(aisc_shape("WT4X20"), Fy=KSI)
    with pytest.raises(OutOfScopeError, match="tees and double angles about"):
        check_aisc_member(m, MemberForces(My=Q_(1, "kip*ft")))


def test_tee_stem_mode_is_checked_and_bar_shear_is_refused():
    with pytest.raises(InputError, match="tee_stem"):
        SteelMember(aisc_shape("WT4X20"), Fy=KSI, tee_stem="up")
    bar = SteelMember(rectangular_bar(d=Q_(4, "inch"), t=Q_(1, "inch")), Fy=KSI)
    with pytest.raises(OutOfScopeError, match="solid bars"):
        check_aisc_member(bar, MemberForces(Vy=Q_(1, "kip")))


def test_bar_dimensions_are_checked():
    with pytest.raises(InputError, match="t"):
        rectangular_bar(d=Q_(1, "inch"), t=Q_(4, "inch"))
    with pytest.raises(DimensionError, match="D"):
        round_bar(D=Q_(1, "kip"))
    with pytest.raises(InputError, match="d"):
        rectangular_bar(d=Q_(-1, "inch"), t=Q_(1, "inch"))


def test_missing_effective_length_is_refused():
    m = SteelMember(aisc_shape("W8X31"), Fy=KSI, Lcx=Q_(8, "ft"))
    with pytest.raises(OutOfScopeError, match="Lcy"):
        check_aisc_member(m, MemberForces(P=Q_(10, "kip")))


def test_bad_inputs_name_the_input():
    with pytest.raises(InputError) as e:
        SteelMember(aisc_shape("W8X31"), Fy=Q_(80, "ksi"))
    assert e.value.name == "Fy"
    with pytest.raises(DimensionError) as e:
        SteelMember(aisc_shape("W8X31"), Fy=Q_(50, "ft"))
    assert e.value.name == "Fy"
    with pytest.raises(InputError) as e:
        SteelMember(aisc_shape("W8X31"), Fy=KSI, Cb=3.5)
    assert e.value.name == "Cb"
    with pytest.raises(DimensionError) as e:
        MemberForces(Mx=Q_(3, "kip"))
    assert e.value.name == "Mx"
    with pytest.raises(InputError) as e:
        check_aisc_member(SteelMember(aisc_shape("W8X31"), Fy=KSI), MemberForces(), method="LSD")
    assert e.value.name == "method"
    with pytest.raises(InputError) as e:
        check_aisc_member(SteelMember(aisc_shape("W8X31"), Fy=KSI), MemberForces())
    assert e.value.name == "forces"


def test_tension_rupture_without_net_area_is_not_covered():
    r = check_aisc_member(SteelMember(aisc_shape("W8X18"), Fy=KSI), MemberForces(P=Q_(-10, "kip")))
    assert r["Tension rupture"].verdict == "NOT COVERED"
    assert not r.passed


def test_working_shows_the_clauses_and_the_combination():
    m = SteelMember(
        aisc_shape("HSS6X6X1/4"), Fy=KSI, Lcx=Q_(12, "ft"), Lcy=Q_(12, "ft"), Lb=Q_(12, "ft")
    )
    r = check_aisc_member(
        m, MemberForces(P=Q_(60, "kip"), Mx=Q_(20, "kip*ft"), combination="1.2D+1.6L")
    )
    text = " ".join(str(getattr(s, "ref", "") or "") for s in r.working())
    assert "Eq. (E3-2)" in text
    assert "Eq. (H1-1a)" in text
    assert r["Axial and flexure"].combination == "1.2D+1.6L"


def _strut(name="L4X4X1/4", **kw):
    from calcpack.checks.aisc360.compression_angle import AngleStrut

    args = {"Fy": Q_(36, "ksi"), "L": Q_(4, "ft"), "P": Q_(5, "kip")} | kw
    return AngleStrut(aisc_shape(name), **args)


def test_single_angle_strut_refusals_name_the_limit():
    from calcpack.checks.aisc360.compression_angle import check_aisc_angle_strut

    with pytest.raises(OutOfScopeError, match=r"≥ 1\.7"):
        check_aisc_angle_strut(_strut("L8X4X1/2"))
    with pytest.raises(OutOfScopeError, match="flexural-torsional"):
        check_aisc_angle_strut(_strut("L6X6X5/16", Fy=Q_(50, "ksi")))
    with pytest.raises(OutOfScopeError, match="200"):
        check_aisc_angle_strut(_strut(L=Q_(16, "ft")))
    with pytest.raises(OutOfScopeError, match="single angles"):
        _strut("W8X31")
    with pytest.raises(InputError, match="arrangement"):
        _strut(arrangement="space")
    with pytest.raises(InputError, match="P"):
        _strut(P=Q_(-5, "kip"))
    with pytest.raises(DimensionError, match="L"):
        _strut(L=Q_(4, "kip"))
    m = SteelMember(aisc_shape("L4X4X1/4"), Fy=Q_(36, "ksi"), Lcx=Q_(4, "ft"), Lcy=Q_(4, "ft"))
    with pytest.raises(OutOfScopeError, match="check_aisc_angle_strut"):
        check_aisc_member(m, MemberForces(P=Q_(1, "kip")))


def test_single_angle_strut_with_a_slender_leg_goes_through_e7():
    from calcpack.checks.aisc360.compression_angle import check_aisc_angle_strut

    r = check_aisc_angle_strut(_strut(L=Q_(3, "ft")), method="ASD")
    assert "A_e" in r.values  # b/t = 16 > 0.45√(E/F_y) = 12.8
    assert r["Compression"].clause == "AISC 360-16 §E5"
