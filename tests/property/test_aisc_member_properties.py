"""Invariants of the AISC 360-16 member strengths: capacities never grow with unbraced or
effective length; LRFD and ASD strengths are related by φ·Ω (AISC 360-16 §B3: φ = 1.5/Ω
nominally, here the declared pairs); the §H1.1 interaction equals 1.0 on its curve."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.aisc360.member import check_aisc_member
from calcpack.checks.aisc360.member_data import FACTORS, MemberForces, SteelMember
from calcpack.sections.aisc_database import aisc_shape
from calcpack.sections.double_angle import double_angle
from calcpack.sections.steel_bars import rectangular_bar
from calcpack.units import Q_

SHAPES = ["W8X31", "W10X49", "W14X132", "HSS6X6X1/4", "HSS4X4X1/4", "Pipe4STD", "C10X15.3"]
# with slender elements in compression (AISC 360-16 §E7)
SLENDER = ["WT6X13", "W14X22", "HSS8X8X1/8", "HSS20.000X0.250"]
lengths = st.floats(min_value=1.0, max_value=40.0)


@settings(max_examples=30, deadline=None)
@given(st.sampled_from(SHAPES + SLENDER), lengths, lengths)
def test_compression_strength_never_grows_with_effective_length(name, a, b):
    lo, hi = sorted((a, b))
    caps = []
    for L in (lo, hi):
        m = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi"), Lcx=Q_(L, "ft"), Lcy=Q_(L, "ft"))
        caps.append(check_aisc_member(m, MemberForces(P=Q_(1, "kip")))["Compression"].capacity)
    assert caps[1] <= caps[0] * (1 + 1e-12)


@settings(max_examples=25, deadline=None)
@given(st.sampled_from(["W8X31", "W18X50", "W6X15", "C10X15.3", "HSS8X4X1/4"]), lengths, lengths)
def test_flexural_strength_never_grows_with_unbraced_length(name, a, b):
    lo, hi = sorted((a, b))
    caps = []
    for L in (lo, hi):
        m = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi"), Lb=Q_(L, "ft"))
        caps.append(check_aisc_member(m, MemberForces(Mx=Q_(1, "kip*ft")))["Flexure x"].capacity)
    assert caps[1] <= caps[0] * (1 + 1e-12)


def _flexure_member(name, L, stem):
    if name == "bar":
        shape = rectangular_bar(d=Q_(6, "inch"), t=Q_(0.5, "inch"))
    elif name.startswith("2"):
        shape = double_angle(aisc_shape(name[1:]), gap=Q_(0.375, "inch"))
    else:
        shape = aisc_shape(name)
    return SteelMember(shape, Fy=Q_(50, "ksi"), Lb=Q_(L, "ft"), tee_stem=stem)


@settings(max_examples=25, deadline=None)
@given(
    st.sampled_from(["WT12X31", "WT6X13", "WT9X25", "bar", "2L4X4X1/4", "2L6X4X3/8"]),
    st.sampled_from(["tension", "compression"]),
    lengths,
    lengths,
)
def test_tee_and_bar_flexure_never_grows_with_unbraced_length(name, stem, a, b):
    # AISC 360-16 §F9.2 and §F11.2: a longer unbraced length never raises M_n
    lo, hi = sorted((a, b))
    caps = [
        check_aisc_member(_flexure_member(name, L, stem), MemberForces(Mx=Q_(1, "kip*ft")))[
            "Flexure x"
        ].capacity
        for L in (lo, hi)
    ]
    assert caps[1] <= caps[0] * (1 + 1e-12)


@settings(max_examples=10, deadline=None)
@given(st.sampled_from(["WT12X31", "bar"]), lengths)
def test_tee_and_bar_flexure_lrfd_over_asd_is_phi_omega(name, L):
    m, f = _flexure_member(name, L, "tension"), MemberForces(Mx=Q_(1, "kip*ft"))
    lrfd = check_aisc_member(m, f, method="LRFD")["Flexure x"].capacity
    asd = check_aisc_member(m, f, method="ASD")["Flexure x"].capacity
    k = FACTORS["flexure"]
    assert float((lrfd / asd).to("").magnitude) == pytest.approx(k.phi * k.omega)


@settings(max_examples=15, deadline=None)
@given(st.sampled_from(SHAPES), lengths)
def test_lrfd_and_asd_differ_by_phi_times_omega(name, L):
    m = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi"), Lcx=Q_(L, "ft"), Lcy=Q_(L, "ft"))
    f = MemberForces(P=Q_(1, "kip"))
    lrfd = check_aisc_member(m, f, method="LRFD")["Compression"].capacity
    asd = check_aisc_member(m, f, method="ASD")["Compression"].capacity
    k = FACTORS["compression"]
    assert float((lrfd / asd).to("").magnitude) == pytest.approx(k.phi * k.omega)


@settings(max_examples=20, deadline=None)
@given(st.floats(min_value=0.01, max_value=0.99))
def test_h1_interaction_is_one_on_its_curve(share):
    m = SteelMember(aisc_shape("W10X49"), Fy=Q_(50, "ksi"), Lcx=Q_(12, "ft"), Lcy=Q_(12, "ft"))
    probe = check_aisc_member(m, MemberForces(P=Q_(1, "kip"), Mx=Q_(1, "kip*ft")))
    Pc, Mc = probe["Compression"].capacity, probe["Flexure x"].capacity
    # a point on the curve: P/Pc = share; M/Mc from Eq. (H1-1a) or (H1-1b)
    p = max(share, 1e-3)
    mm = (1 - p) * 9 / 8 if p >= 0.2 else 1 - p / 2
    mm = max(mm, 1e-3)
    r = check_aisc_member(m, MemberForces(P=p * Pc, Mx=mm * Mc))
    assert r["Axial and flexure"].utilisation == pytest.approx(1.0, rel=1e-9)


@settings(max_examples=20, deadline=None)
@given(st.sampled_from(SLENDER), lengths)
def test_effective_area_never_exceeds_the_gross_area(name, L):
    # AISC 360-16 §E7: A_e ≤ A_g
    m = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi"), Lcx=Q_(L, "ft"), Lcy=Q_(L, "ft"))
    r = check_aisc_member(m, MemberForces(P=Q_(1, "kip")))
    assert r.values["A_e"] <= r.values["A_g"] * (1 + 1e-12)


@settings(max_examples=15, deadline=None)
@given(st.sampled_from(["L4X3X3/8", "L3X3X3/8", "L4X4X1/4"]), st.floats(2.0, 8.0))
def test_angle_strut_strength_never_grows_with_length_and_lrfd_over_asd_is_phi_omega(name, L):
    from calcpack.checks.aisc360.compression_angle import AngleStrut, check_aisc_angle_strut

    def cap(length, method="LRFD"):
        strut = AngleStrut(aisc_shape(name), Fy=Q_(36, "ksi"), L=Q_(length, "ft"), P=Q_(1, "kip"))
        return check_aisc_angle_strut(strut, method=method)["Compression"].capacity

    # AISC 360-16 §E5: a longer strut is never stronger
    assert cap(L + 0.5) <= cap(L) * (1 + 1e-12)
    k = FACTORS["compression"]
    assert float((cap(L) / cap(L, "ASD")).to("").magnitude) == pytest.approx(k.phi * k.omega)


@settings(max_examples=15, deadline=None)
@given(st.sampled_from(["WT12X31", "WT6X13", "W14X22"]), lengths)
def test_new_clauses_give_the_same_strength_in_si_and_us_units(name, L):
    us = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi"), Lb=Q_(L, "ft"), Lcx=Q_(L, "ft"),
                     Lcy=Q_(L, "ft"))  # fmt: skip
    si = SteelMember(aisc_shape(name), Fy=Q_(50, "ksi").to("MPa"), Lb=Q_(L, "ft").to("m"),
                     Lcx=Q_(L, "ft").to("m"), Lcy=Q_(L, "ft").to("m"))  # fmt: skip
    f = MemberForces(P=Q_(1, "kip"), Mx=Q_(1, "kip*ft"))
    a, b = check_aisc_member(us, f), check_aisc_member(si, f)
    for check in ("Compression", "Flexure x"):
        x = a[check].capacity.to_base_units().magnitude
        y = b[check].capacity.to_base_units().magnitude
        assert x == pytest.approx(y, rel=1e-9)
