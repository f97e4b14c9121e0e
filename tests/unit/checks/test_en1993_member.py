"""EN 1993-1-1 member checks: refusals, clause logic and working (hand-checkable numbers)."""

from __future__ import annotations

import math

import pytest

from calcpack.checks.en1993 import (
    DesignForces,
    SteelMemberEC,
    check_en1993_beam,
    check_en1993_member,
    check_en1993_web_bearing,
    cm_linear,
    steel_grade_ec,
)
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sections.eurocode_tables import euro_section
from calcpack.units import Q_


def test_class_4_web_in_compression_is_refused_naming_en_1993_1_5():
    # 610x229x101 UB S355 in pure compression: c/t_w = 547.6/10.5 = 52 > 42ε = 34.2
    m = SteelMemberEC(euro_section("610x229x101 UB"), "S355", Lcr_y=Q_(3, "m"), Lcr_z=Q_(3, "m"))
    with pytest.raises(OutOfScopeError, match=r"class 4.*EN 1993-1-5 §4.4"):
        check_en1993_member(m, DesignForces(N_Ed=Q_(500, "kN")))


def test_unknown_grade_names_the_input():
    with pytest.raises(InputError, match=r"'S450'.*grade"):
        steel_grade_ec("S450", Q_(10, "mm"))


def test_thick_steel_is_refused():
    with pytest.raises(OutOfScopeError, match="63 mm"):
        steel_grade_ec("S355", Q_(80, "mm"))


def test_grade_drops_with_thickness():
    # BS EN 10025-2 Table 7 (from memory): S355 345 MPa for 16 < t <= 40 mm
    assert steel_grade_ec("S355", Q_(17.3, "mm")).fy.to("MPa").magnitude == 345


def test_shear_and_bending_interaction_reduces_the_moment():
    # V_Ed > 0.5 V_pl,Rd: ρ = (2V/V_pl − 1)², M_y,V,Rd = (W_pl − ρ A_w²/(4 t_w)) f_y (Eq. 6.30)
    s = euro_section("305x165x40 UB")
    r = check_en1993_member(SteelMemberEC(s, "S275"),
                            DesignForces(My_Ed=Q_(100, "kN*m"), V_Ed=Q_(250, "kN")))  # fmt: skip
    Vpl = r.values["V_pl_Rd"].to("kN").magnitude
    rho = (2 * 250 / Vpl - 1) ** 2
    hw, tw = (s.h - 2 * s.tf).to("mm").magnitude, s.tw.to("mm").magnitude
    Wpl = s.Wpl_y.to("mm**3").magnitude
    expect = (Wpl - rho * (hw * tw) ** 2 / (4 * tw)) * 275 / 1e6
    assert r["Bending y-y (6.2.5)"].capacity.to("kN*m").magnitude == pytest.approx(expect, rel=1e-9)


def test_flexural_buckling_by_hand():
    # 254x254x73 UC S275 (t_f = 14.2 mm ≤ 16: f_y = 275), L = 4 m: curve c about z-z (h/b ≤ 1.2)
    s = euro_section("254x254x73 UC")
    m = SteelMemberEC(s, "S275", Lcr_y=Q_(4, "m"), Lcr_z=Q_(4, "m"))
    r = check_en1993_member(m, DesignForces(N_Ed=Q_(1000, "kN")))
    A, Iz = s.A.to("m**2").magnitude, s.Iz.to("m**4").magnitude
    Ncr = math.pi**2 * 210e9 * Iz / 16
    lam = math.sqrt(A * 275e6 / Ncr)
    phi = 0.5 * (1 + 0.49 * (lam - 0.2) + lam**2)
    chi = 1 / (phi + math.sqrt(phi**2 - lam**2))
    got = r["Flexural buckling z-z (6.3.1)"].capacity.to("N").magnitude
    assert got == pytest.approx(chi * A * 275e6, rel=1e-9)


def test_ltb_of_a_beam_from_combined_results_uses_the_segment_diagram():
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.combinations import analyse_combinations, annex_combinations, en1990_annex
    from calcpack.loads.types import UniformLoad

    s = euro_section("203x133x25 UB")
    b = Beam(
        length=Q_(4, "m"),
        supports=[Pin(Q_(0, "m"), name="A"), Roller(Q_(4, "m"), name="B")],
        loads=[UniformLoad(w=Q_(10, "kN/m"), case="G"), UniformLoad(w=Q_(8, "kN/m"), case="Q")],
        EI=Q_(210000, "MPa") * s.Iy,
    )
    cr = analyse_combinations(
        solve_cases(b), annex_combinations(en1990_annex("UK"), variable={"Q": "A"})
    )
    sc = check_en1993_beam(s, "S275", demand=cr, mark="B1")
    top = check_en1993_beam(s, "S275", demand=cr, load_level="top flange", mark="B1")
    # uniform load at the shear centre: C1 ≈ 1.13; destabilising top flange load lowers M_cr
    assert sc.values["C_1"].magnitude == pytest.approx(1.13, abs=0.01)
    assert top.values["M_cr"] < sc.values["M_cr"]
    assert (
        top["Lateral-torsional buckling (6.3.2)"].utilisation
        > sc["Lateral-torsional buckling (6.3.2)"].utilisation
    )
    # UK 6.10b governs: 1.25G + 1.5Q, M = wL²/8
    w = 0.925 * 1.35 * 10 + 1.5 * 8
    assert sc["Bending y-y (6.2.5)"].demand.to("kN*m").magnitude == pytest.approx(w * 2, rel=1e-6)
    restrained = check_en1993_beam(s, "S275", demand=cr, restraints=[Q_(2, "m")], mark="B1")
    assert restrained.values["M_cr"] > sc.values["M_cr"]


def test_web_bearing_at_an_end_by_hand():
    # EN 1993-1-5 §6, type (c), 203x133x25 UB S275, s_s = 100 mm, c = 0
    s = euro_section("203x133x25 UB")
    r = check_en1993_web_bearing(s, "S275", F_Ed=Q_(60, "kN"), ss=Q_(100, "mm"), mark="B1")
    tw, tf, b, hw = 5.7, 7.8, 133.2, 203.2 - 2 * 7.8
    kF = min(2 + 6 * 100 / hw, 6)
    Fcr = 0.9 * kF * 210000 * tw**3 / hw
    m1 = b / tw
    le = min(kF * 210000 * tw**2 / (2 * 275 * hw), 100)
    for m2 in (0.02 * (hw / tf) ** 2, 0.0):
        ly = min(le + tf * math.sqrt(m1 / 2 + (le / tf) ** 2 + m2), le + tf * math.sqrt(m1 + m2))
        lam = math.sqrt(ly * tw * 275 / Fcr)
        if lam > 0.5:
            break
    FRd = 275 * min(0.5 / lam, 1) * ly * tw / 1e3
    assert r.results[0].capacity.to("kN").magnitude == pytest.approx(FRd, rel=1e-9)
    r.working()


def test_web_bearing_refuses_hollow_sections():
    with pytest.raises(InputError, match="section"):
        check_en1993_web_bearing(euro_section("SHS 100x100x5.0"), "S355", F_Ed=Q_(10, "kN"),
                                 ss=Q_(50, "mm"))  # fmt: skip


def test_cm_linear_and_bounds():
    assert cm_linear(1.0) == 1.0
    assert cm_linear(-1.0) == 0.4
    with pytest.raises(InputError, match="Cmy"):
        SteelMemberEC(euro_section("IPE 300"), Cmy=0.2)


@pytest.mark.parametrize("designation", ["254x254x73 UC", "SHS 150x150x8.0", "CHS 168.3x6.3",
                                         "RHS 200x100x8.0", "IPE 300"])  # fmt: skip
def test_working_of_a_beam_column_builds(designation):
    m = SteelMemberEC(euro_section(designation), "S355", Lcr_y=Q_(4, "m"), Lcr_z=Q_(4, "m"))
    f = DesignForces("ULS", N_Ed=Q_(300, "kN"), My_Ed=Q_(20, "kN*m"), Mz_Ed=Q_(5, "kN*m"),
                     V_Ed=Q_(20, "kN"), L_LT=Q_(4, "m"))  # fmt: skip
    r = check_en1993_member(m, f, mark="C1")
    steps = r.working()
    assert len(steps) > 10
    names = [x.name for x in r.results]
    assert "Bending and compression (6.61)" in names
    # the working shows the same numbers as the data
    assert any(getattr(s, "name", "") == "N_pl_Rd" for s in steps)
