"""Checks: the common interface, working content (every clause shown, cautions, governing
combination), the summary table, and the bad inputs of the issue (missing material values, a
section outside scope, an unbraced length longer than the member, a case without duration)."""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import (
    NOT_COVERED,
    IShape,
    ReferenceDesignValues,
    SawnMember,
    ServiceConditions,
    check_aisc_beam,
    check_deflection,
    check_elastic_beam,
    check_nds_beam,
    summary_table,
)
from calcpack.combinations import analyse_combinations, asce7_allowable_stress, asce7_strength
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads import UniformLoad
from calcpack.units import ureg

inch, ft, ksi, psi = ureg.inch, ureg.ft, ureg.ksi, ureg.psi

W18X50 = IShape(
    "W18x50",
    "AISC Manual Table 1-1",
    d=18.0 * inch,
    bf=7.50 * inch,
    tf=0.570 * inch,
    tw=0.355 * inch,
    h_tw=45.2,
    Ix=800 * inch**4,
    Sx=88.9 * inch**3,
    Zx=101 * inch**3,
    Iy=40.1 * inch**4,
    ry=1.65 * inch,
    J=1.24 * inch**4,
    Cw=3040 * inch**6,
    h0=17.4 * inch,
)
# W21x48: b_f/2t_f = 9.47 > 9.15 for F_y = 50 ksi -- a noncompact flange (Manual Table 1-1)
W21X48 = IShape(
    "W21x48",
    "AISC Manual Table 1-1",
    d=20.6 * inch,
    bf=8.14 * inch,
    tf=0.430 * inch,
    tw=0.350 * inch,
    h_tw=53.6,
    Ix=959 * inch**4,
    Sx=93.0 * inch**3,
    Zx=107 * inch**3,
    Iy=38.7 * inch**4,
    ry=1.66 * inch,
    J=0.803 * inch**4,
    Cw=3950 * inch**6,
)
DFL2 = ReferenceDesignValues(
    "DF-L No.2",
    "No.2",
    "NDS Supplement Table 4A",
    Fb=900 * psi,
    Fv=180 * psi,
    E=1.6e6 * psi,
    Emin=580e3 * psi,
)


@pytest.fixture(scope="module")
def steel_cases():
    b = Beam(
        length=35 * ft,
        supports=[Pin(0 * ft), Roller(35 * ft)],
        loads=[UniformLoad(w=0.45 * ureg.klf, case="D"), UniformLoad(w=0.75 * ureg.klf, case="L")],
        EI=29000 * ksi * 800 * inch**4,
    )
    return solve_cases(b)


def test_noncompact_flange_is_refused_naming_the_limit():
    with pytest.raises(OutOfScopeError, match=r"flange.*9\.47 > λ_p = 9\.15.*Table B4\.1b case 10"):
        check_aisc_beam(W21X48, Fy=50 * ksi, Mu=100 * ureg.kip * ft, Lb=5 * ft, Cb=1.0)


def test_noncompact_flange_can_be_reported_not_covered():
    mc = check_aisc_beam(
        W21X48,
        Fy=50 * ksi,
        Mu=100 * ureg.kip * ft,
        Lb=5 * ft,
        Cb=1.0,
        Vu=10 * ureg.kip,
        on_out_of_scope="not covered",
    )
    assert mc["Flexure"].verdict == NOT_COVERED
    assert mc["Flexure"].capacity is None
    assert mc["Shear"].passed
    assert not mc.passed
    assert mc.governing.verdict == NOT_COVERED
    rec = mc.records()
    assert any(r.verdict == "NOT COVERED" and "§F3" in r.description for r in rec)


def test_unbraced_length_longer_than_member():
    with pytest.raises(InputError, match="Lb must not exceed the member length") as e:
        check_aisc_beam(
            W18X50, Fy=50 * ksi, Mu=100 * ureg.kip * ft, Lb=40 * ft, Cb=1.0, length=35 * ft
        )
    assert e.value.name == "Lb"


def test_brace_off_the_member(steel_cases):
    cr = analyse_combinations(steel_cases, asce7_strength())
    with pytest.raises(InputError, match=r"braces\[0\]"):
        check_aisc_beam(W18X50, Fy=50 * ksi, demand=cr, braces=[40 * ft])


def test_bad_steel_inputs_name_the_input():
    with pytest.raises(InputError, match="method"):
        check_aisc_beam(W18X50, Fy=50 * ksi, method="LSD", Vu=1 * ureg.kip)
    with pytest.raises(InputError, match="Cb"):
        check_aisc_beam(W18X50, Fy=50 * ksi, Mu=1 * ureg.kip * ft, Lb=5 * ft)
    with pytest.raises(InputError, match="No demand"):
        check_aisc_beam(W18X50, Fy=50 * ksi)
    with pytest.raises(InputError, match="source"):
        IShape(
            "W",
            "",
            d=1 * inch,
            bf=1 * inch,
            tf=0.1 * inch,
            tw=0.1 * inch,
            h_tw=5,
            Ix=1 * inch**4,
            Sx=1 * inch**3,
            Zx=1.1 * inch**3,
            Iy=1 * inch**4,
            ry=1 * inch,
            J=1 * inch**4,
            Cw=1 * inch**6,
        )
    with pytest.raises(InputError, match="Zx"):
        IShape(
            "W",
            "x",
            d=1 * inch,
            bf=1 * inch,
            tf=0.1 * inch,
            tw=0.1 * inch,
            h_tw=5,
            Ix=1 * inch**4,
            Sx=1 * inch**3,
            Zx=0.9 * inch**3,
            Iy=1 * inch**4,
            ry=1 * inch,
            J=1 * inch**4,
            Cw=1 * inch**6,
        )


def test_steel_working_shows_every_clause_and_caution(steel_cases):
    from calcpack.working import Caution, Check, Derived, Given

    cr = analyse_combinations(steel_cases, asce7_strength())
    mc = check_aisc_beam(W18X50, Fy=50 * ksi, demand=cr, braces=[17.5 * ft])
    steps = mc.working()
    assert isinstance(steps[1], Caution)
    assert "ANSI/AISC 360-16" in steps[1].body
    assert "confirmed against the edition adopted locally" in steps[1].body
    derived = [s for s in steps if isinstance(s, Derived)]
    assert derived
    assert all(s.ref for s in derived)
    refs = " ".join(s.ref for s in derived)
    for eq in ("F2-1", "F2-5", "F2-6", "F2-7", "F1-1", "F2-4", "F2-3", "G2-1"):
        assert eq in refs
    assert all(s.source for s in steps if isinstance(s, Given))
    checks = [s for s in steps if isinstance(s, Check)]
    assert {c.name for c in checks} >= {"Flexure", "Shear", "Flange compactness"}
    flex = next(c for c in checks if c.name == "Flexure")
    assert flex.combination == mc["Flexure"].combination
    # the shown working computes the same number as the data result
    assert flex.utilisation == pytest.approx(mc["Flexure"].utilisation, rel=1e-12)


def test_missing_material_value_names_it():
    with pytest.raises(InputError, match="Fv") as e:
        ReferenceDesignValues(
            "DF-L No.2", "No.2", "Table 4A", Fb=900 * psi, Fv=None, E=1.6e6 * psi, Emin=580e3 * psi
        )
    assert e.value.name == "Fv"
    with pytest.raises(InputError, match="source"):
        ReferenceDesignValues(
            "DF-L No.2", "No.2", " ", Fb=900 * psi, Fv=180 * psi, E=1.6e6 * psi, Emin=580e3 * psi
        )


def _joist_results(case_names=("D", "L"), length=12):
    b = Beam(
        length=length * ft,
        supports=[Pin(0 * ft), Roller(length * ft)],
        loads=[UniformLoad(w=(20 + 40 * i) * ureg.plf, case=c) for i, c in enumerate(case_names)],
    )
    return solve_cases(b)


def test_load_case_without_duration_names_it():
    r = _joist_results(("D", "Crane"))
    with pytest.raises(InputError, match="'Crane' has no load duration"):
        check_nds_beam(SawnMember.dimension("2x10"), DFL2, demand=r["Crane"])
    mc = check_nds_beam(
        SawnMember.dimension("2x10"), DFL2, demand=r["Crane"], durations={"Crane": "impact"}
    )
    assert mc.values["C_D"].magnitude == 2.0


def test_snow_combination_gets_two_month_duration():
    r = _joist_results(("D", "S"))
    cr = analyse_combinations(r, asce7_allowable_stress())
    mc = check_nds_beam(SawnMember.dimension("2x10"), DFL2, demand=cr)
    assert mc["Bending"].combination.startswith("3b")
    assert mc.values["C_D"].magnitude == 1.15


def test_slender_unbraced_joist_is_refused():
    r = _joist_results(length=30)
    cond = ServiceConditions(compression_edge_braced=False, lu=30 * ft, loading="uniform")
    with pytest.raises(OutOfScopeError, match=r"R_B = .* exceeds 50"):
        check_nds_beam(SawnMember.dimension("2x12"), DFL2, demand=r["L"], conditions=cond)


def test_conditions_need_lu_when_not_braced():
    with pytest.raises(InputError, match="lu"):
        ServiceConditions(compression_edge_braced=False)
    with pytest.raises(InputError, match="CF_source"):
        ServiceConditions(CF=1.1)


def test_size_factor_outside_table_needs_CF():
    r = _joist_results()
    with pytest.raises(OutOfScopeError, match="Table 4D"):
        check_nds_beam(SawnMember(6, 10, 5.5 * inch, 9.5 * inch), DFL2, demand=r["L"])
    mc = check_nds_beam(
        SawnMember(6, 10, 5.5 * inch, 9.5 * inch),
        DFL2,
        demand=r["L"],
        conditions=ServiceConditions(CF=1.0, CF_source="Table 4D"),
    )
    assert mc["Bending"].passed


def test_timber_working_shows_every_factor():
    from calcpack.working import Given

    mc = check_nds_beam(
        SawnMember.dimension("2x10"),
        DFL2,
        demand=analyse_combinations(_joist_results(), asce7_allowable_stress()),
    )
    names = {s.name for s in mc.working() if isinstance(s, Given)}
    assert {"C_D", "C_Mb", "C_tb", "C_L", "C_F", "C_fu", "C_ib", "C_r"} <= names


def test_elastic_checks_and_bad_inputs():
    r = _joist_results()
    mc = check_elastic_beam(
        member="L1",
        allowable_source="client spec §3",
        demand=r["L"],
        S=20 * inch**3,
        sigma_allow=1000 * psi,
    )
    # M = 60 plf × (12 ft)²/8 = 1080 lbf·ft; σ = M/S = 12 960 lbf·in / 20 in³ (closed form)
    assert mc["Bending stress"].demand.to("psi").magnitude == pytest.approx(648.0)
    with pytest.raises(InputError, match="allowable_source"):
        check_elastic_beam(member="L1", allowable_source="", M=1 * ureg.kN * ureg.m)
    with pytest.raises(InputError, match="S, or I and c"):
        check_elastic_beam(
            member="L1", allowable_source="x", M=1 * ureg.kN * ureg.m, sigma_allow=10 * ureg.MPa
        )
    with pytest.raises(InputError, match="No check"):
        check_elastic_beam(member="L1", allowable_source="x", M=1 * ureg.kN * ureg.m)


def test_shear_by_VQ_over_It_equals_1_5_V_over_A_for_a_rectangle():
    b, d = 2 * inch, 10 * inch
    I, Q = b * d**3 / 12, b * (d / 2) * (d / 4)
    a = check_elastic_beam(
        member="x", allowable_source="x", V=1 * ureg.kip, A_rect=b * d, tau_allow=200 * psi
    )
    q = check_elastic_beam(
        member="x", allowable_source="x", V=1 * ureg.kip, Q=Q, I=I, t=b, tau_allow=200 * psi
    )
    assert a["Shear stress"].demand.to("psi").magnitude == pytest.approx(
        q["Shear stress"].demand.to("psi").magnitude, rel=1e-12
    )


def test_deflection_needs_EI_and_a_positive_limit():
    r = _joist_results()
    with pytest.raises(InputError, match="EI"):
        check_deflection(member="J", demand=r["L"], span=12 * ft)
    with pytest.raises(InputError, match="limit"):
        check_deflection(member="J", demand=r["L"], span=12 * ft, limit=0)


def test_summary_table_of_sheets_and_member_checks(steel_cases):
    from calcpack.checks.summary import SUMMARY_COLUMNS
    from calcpack.working import Sheet

    cr = analyse_combinations(steel_cases, asce7_strength())
    mc = check_aisc_beam(W18X50, Fy=50 * ksi, demand=cr, continuous_bracing=True, member="B1")
    d = check_deflection(member="B1", demand=steel_cases["L"], span=35 * ft, limit=360)
    s = Sheet("B1", system="US")
    for step in d.working():
        s.add(step)
    t = summary_table([mc, s])
    assert t.columns == SUMMARY_COLUMNS
    assert [r[1] for r in t.rows] == [
        "Flange compactness",
        "Web compactness",
        "Flexure",
        "Shear",
        "Deflection (live)",
    ]
    flex = t.rows[2]
    assert flex[0] == "B1"
    assert flex[5] == "OK"
    assert flex[6] == "AISC 360-16 §F2"
    assert flex[7].startswith("2a")
    with pytest.raises(InputError, match="summary"):
        summary_table([42])


def test_design_method_and_combination_kind_must_match(steel_cases):
    asd = analyse_combinations(steel_cases, asce7_allowable_stress())
    with pytest.raises(InputError, match="LRFD checks need strength") as e:
        check_aisc_beam(W18X50, Fy=50 * ksi, demand=asd, continuous_bracing=True)
    assert e.value.name == "demand"
    strength = analyse_combinations(_joist_results(), asce7_strength())
    with pytest.raises(InputError, match="allowable stress"):
        check_nds_beam(SawnMember.dimension("2x10"), DFL2, demand=strength)


def test_every_step_renders_in_html_latex_and_text(steel_cases):
    cr = analyse_combinations(steel_cases, asce7_strength())
    steps = [
        *cr.working(),
        *check_aisc_beam(W18X50, Fy=50 * ksi, demand=cr, braces=[17.5 * ft]).working(),
        *check_nds_beam(
            SawnMember.dimension("2x12"), DFL2,
            demand=analyse_combinations(_joist_results(), asce7_allowable_stress()),
            conditions=ServiceConditions(compression_edge_braced=False, lu=6 * ft),
        ).working(),
        summary_table([]),
    ]  # fmt: skip
    for step in steps:
        assert step.html()
        assert step.latex()
        assert step.text()
    html = "".join(s.html() for s in steps)
    assert "Eq. (F2-4)" in html
    assert "Eq. (3.3-6)" in html


def test_results_alone_record_the_same_checks_as_the_working(steel_cases):
    """add_results_to puts one line per check on the sheet (no working) and records each
    check as add_to does."""
    from calcpack.working import Check, Sheet

    cr = analyse_combinations(steel_cases, asce7_strength())
    mc = check_aisc_beam(W18X50, Fy=50 * ksi, demand=cr, continuous_bracing=True, member="B1")
    full, brief = Sheet("full", system="US"), Sheet("brief", system="US")
    mc.add_to(full)
    mc.add_results_to(brief)
    assert all(isinstance(step, Check) for step in brief.steps)
    assert len(brief.steps) == len(mc.results) < len(full.steps)
    assert [r.to_json() for r in brief.checks()] == [r.to_json() for r in full.checks()]
