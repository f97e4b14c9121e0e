"""ANSI/AWC NDS-2018, National Design Specification for Wood Construction, American Wood
Council, 2018: §2.3.2 and Table 2.3.2 (C_D), Table 2.3.3 (C_t), §3.3 bending (C_L, Eq. 3.3-5,
3.3-6, Table 3.3.3), §3.4 shear (Eq. 3.4-2), Table 4.3.1, Table 4.3.8 (C_i), §4.3.9 (C_r); and
the NDS Supplement (2018), Table 4A: reference design values for Douglas Fir-Larch No.2 and
the flat-use factors C_fu for 2 in. to 3 in. thick lumber (as published); Select Structural,
C_F, C_M and C_fu for 4 in. thick lumber from memory.

No published joist example is recalled with its numbers, so the joist below is worked in full
by hand in this file, step by step from the provisions above (plain arithmetic, independent of
calcpack), and each adjustment factor is checked in closed form. Tolerance 1e-9 relative
(only float round-off: the same arithmetic by two routes).
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import ReferenceDesignValues, SawnMember, ServiceConditions, check_nds_beam
from calcpack.checks.nds import (
    DURATION_FACTORS,
    beam_stability_factor,
    flat_use_factor,
    size_factor,
    temperature_factor,
    wet_service_factor,
)
from calcpack.combinations import analyse_combinations, asce7_allowable_stress
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_, ureg

RT = 1e-9  # same arithmetic, float round-off only

DFL2 = ReferenceDesignValues(
    "Douglas Fir-Larch No.2", "No.2", "NDS Supplement 2018 Table 4A",
    Fb=900 * ureg.psi, Fv=180 * ureg.psi, E=1.6e6 * ureg.psi, Emin=580_000 * ureg.psi,
)  # fmt: skip


def _joist(span_ft=14.0, spacing_in=16.0, D_psf=15.0, L_psf=40.0, **cond):
    ft = ureg.ft
    trib = spacing_in * ureg.inch
    beam = Beam(
        length=span_ft * ft,
        supports=[Pin(0 * ft), Roller(span_ft * ft)],
        loads=[
            UniformLoad_(D_psf, trib, "D"),
            UniformLoad_(L_psf, trib, "L"),
        ],
    )
    cr = analyse_combinations(solve_cases(beam), asce7_allowable_stress())
    return check_nds_beam(
        SawnMember.dimension("2x10"), DFL2, demand=cr, conditions=ServiceConditions(**cond)
    )


def UniformLoad_(q_psf, trib, case):
    from calcpack.loads import UniformLoad

    return UniformLoad(w=(q_psf * ureg.psf * trib).to("plf"), case=case)


def test_floor_joist_2x10_at_16_in_worked_by_hand():
    mc = _joist(repetitive=True)
    # hand: w = (15 + 40) psf × 16/12 ft = 73.33 plf; M = w L²/8; S = 1.5 × 9.25²/6
    w = (15 + 40) * 16 / 12
    M_lbin = w * 14**2 / 8 * 12
    S = 1.5 * 9.25**2 / 6
    fb = M_lbin / S
    Fb_prime = 900 * 1.0 * 1.1 * 1.15  # C_D (ten years), C_F (2x10 No.2), C_r; others 1.0
    V = w * 14 / 2
    fv = 1.5 * V / (1.5 * 9.25)
    b = mc["Bending"]
    assert b.demand.to("psi").magnitude == pytest.approx(fb, rel=RT)
    assert b.capacity.to("psi").magnitude == pytest.approx(Fb_prime, rel=RT)
    assert b.combination.startswith("2")  # D + L governs bending
    assert mc["Shear"].demand.to("psi").magnitude == pytest.approx(fv, rel=RT)
    assert mc["Shear"].capacity.to("psi").magnitude == pytest.approx(180.0, rel=RT)
    assert b.utilisation == pytest.approx(fb / Fb_prime, rel=RT)


def test_dead_load_alone_governs_when_it_dominates():
    # C_D = 0.9 for D alone, 1.0 for D + L: with D = 60 psf and L = 5 psf,
    # D alone: f_b/(0.9 F) vs D+L: 1.0833 f_b/(1.0 F) -> 1/0.9 = 1.111 > 1.083, so D governs
    mc = _joist(D_psf=60.0, L_psf=5.0)
    assert mc["Bending"].combination.startswith("1")
    assert mc.values["C_D"].magnitude == pytest.approx(0.9)


def test_beam_stability_factor_unbraced_2x12_closed_form():
    # 2x12 DF-L No.2, ℓu = 8 ft, uniform load: ℓu/d = 8.53 >= 7 -> ℓe = 1.63ℓu + 3d (Table 3.3.3)
    d, b, lu = 11.25, 1.5, 96.0
    le = 1.63 * lu + 3 * d
    RB = math.sqrt(le * d / b**2)  # Eq. (3.3-5)
    FbE = 1.20 * 580_000 / RB**2  # §3.3.3.8
    Fb_star = 900 * 1.0 * 1.0  # C_D = 1.0, C_F = 1.0 for a 2x12 No.2
    a = FbE / Fb_star
    CL = (1 + a) / 1.9 - math.sqrt(((1 + a) / 1.9) ** 2 - a / 0.95)  # Eq. (3.3-6)
    assert beam_stability_factor(Q_(Fb_star, "psi"), Q_(580_000, "psi"), RB) == pytest.approx(
        CL, rel=RT
    )
    ft = ureg.ft
    beam = Beam(length=8 * ft, supports=[Pin(0 * ft), Roller(8 * ft)],
                loads=[UniformLoad_(40.0, 16 * ureg.inch, "L")])  # fmt: skip
    mc = check_nds_beam(
        SawnMember.dimension("2x12"), DFL2, demand=solve_cases(beam)["L"],
        conditions=ServiceConditions(compression_edge_braced=False, lu=8 * ft, loading="uniform"),
    )  # fmt: skip
    assert mc.values["C_L"].magnitude == pytest.approx(CL, rel=RT)
    assert mc["Bending"].capacity.to("psi").magnitude == pytest.approx(900 * CL, rel=RT)


def _report(checks):
    from calcpack.working import Sheet

    s = Sheet("check", auto_display=False)
    checks.add_to(s)
    return s.text_report()


def test_depth_to_breadth_rule_gives_C_L_of_one_only_within_its_limits():
    """NDS 2018 §4.4.1.2 (from memory): (b) d/b up to 4 needs only the ends held in position
    for C_L = 1.0; beyond 4 the compression edge must be held (or C_L found from ℓ_u). A 4x10
    (3.5 x 9.25 in, d/b = 2.64) over a post, ends held by post caps: C_L = 1.0 even where the
    bottom edge is in compression; a 2x10 (d/b = 6.2) with only its ends held is refused."""
    ft = ureg.ft
    beam = Beam(length=8 * ft, supports=[Pin(0 * ft), Roller(8 * ft)],
                loads=[UniformLoad_(40.0, 16 * ureg.inch, "L")])  # fmt: skip
    held = ServiceConditions(compression_edge_braced=False, ends_held=True)
    mc = check_nds_beam(SawnMember.dimension("4x10"), DFL2, demand=solve_cases(beam)["L"],
                        conditions=held)  # fmt: skip
    assert mc.values["C_L"].magnitude == 1.0
    assert "4.4.1.2(b)" in _report(mc)
    with pytest.raises(OutOfScopeError, match=r"d/b = 6\.17 exceeds 4"):
        check_nds_beam(SawnMember.dimension("2x10"), DFL2, demand=solve_cases(beam)["L"],
                       conditions=held)  # fmt: skip


def test_wet_service_C_M_on_F_b_states_why_it_is_one():
    """NDS Supplement Table 4A footnote: wet C_M = 0.85 on F_b, 1.0 where F_b·C_F ≤ 1150 psi
    (as published). A 2x8 DF-L No.2: 900 x 1.2 = 1080 psi -> 1.0, and the working says why."""
    ft = ureg.ft
    beam = Beam(length=8 * ft, supports=[Pin(0 * ft), Roller(8 * ft)],
                loads=[UniformLoad_(40.0, 16 * ureg.inch, "L")])  # fmt: skip
    mc = check_nds_beam(SawnMember.dimension("2x8"), DFL2, demand=solve_cases(beam)["L"],
                        conditions=ServiceConditions(wet=True))  # fmt: skip
    assert mc.values["C_Mb"].magnitude == 1.0
    assert "F_b·C_F = 1080 psi ≤ 1150 psi, so C_M = 1.0" in _report(mc)


@pytest.mark.parametrize(
    ("duration", "CD"),
    [("permanent", 0.9), ("ten years", 1.0), ("two months", 1.15), ("seven days", 1.25),
     ("ten minutes", 1.6), ("impact", 2.0)],
)  # fmt: skip
def test_table_2_3_2_load_duration(duration, CD):
    assert DURATION_FACTORS[duration] == CD


@pytest.mark.parametrize(
    ("t", "w", "CF"),
    [(2, 4, 1.5), (2, 6, 1.3), (2, 8, 1.2), (2, 10, 1.1), (2, 12, 1.0), (2, 14, 0.9),
     (4, 8, 1.3), (4, 10, 1.2), (4, 12, 1.1), (4, 14, 1.0), (3, 5, 1.4)],
)  # fmt: skip
def test_table_4A_size_factor_Fb(t, w, CF):
    assert size_factor("No.2", t, w) == CF


@pytest.mark.parametrize(
    ("t", "w", "Cfu"),
    [(2, 4, 1.1), (2, 6, 1.15), (2, 8, 1.15), (2, 10, 1.2), (2, 12, 1.2), (4, 4, 1.0),
     (4, 6, 1.05), (4, 10, 1.1)],
)  # fmt: skip
def test_table_4A_flat_use(t, w, Cfu):
    assert flat_use_factor(t, w) == Cfu


def test_table_4A_wet_service():
    assert wet_service_factor("Fb", wet=False, Fb_CF=Q_(2000, "psi")) == 1.0
    # No.2 DF-L 2x10: F_b C_F = 990 psi <= 1150 psi -> C_M = 1.0
    assert wet_service_factor("Fb", wet=True, Fb_CF=Q_(990, "psi")) == 1.0
    # Select Structural DF-L (F_b = 1500 psi) 2x10: 1650 psi > 1150 psi -> 0.85
    assert wet_service_factor("Fb", wet=True, Fb_CF=Q_(1650, "psi")) == 0.85
    assert wet_service_factor("Fv", wet=True) == 0.97
    assert wet_service_factor("E", wet=True) == 0.9


def test_table_2_3_3_temperature():
    F = ureg.degF
    assert temperature_factor("Fb", Q_(90, F), wet=False) == 1.0
    assert temperature_factor("Fb", Q_(110, F), wet=False) == 0.8
    assert temperature_factor("Fb", Q_(110, F), wet=True) == 0.7
    assert temperature_factor("Fv", Q_(140, F), wet=False) == 0.7
    assert temperature_factor("Fv", Q_(140, F), wet=True) == 0.5
    assert temperature_factor("E", Q_(140, F), wet=True) == 0.9
    with pytest.raises(OutOfScopeError, match="150"):
        temperature_factor("Fb", Q_(160, F), wet=False)


def test_incising_wet_and_every_factor_multiply_into_Fb_and_Fv():
    # Table 4.3.1: F'_b = F_b C_D C_M C_t C_L C_F C_fu C_i C_r; F'_v = F_v C_D C_M C_t C_i
    mc = _joist(incised=True, wet=True, repetitive=True, temperature=Q_(110, ureg.degF))
    Fb = 900 * 1.0 * 1.0 * 0.7 * 1.0 * 1.1 * 1.0 * 0.80 * 1.15  # C_M = 1.0 (990 <= 1150)
    Fv = 180 * 1.0 * 0.97 * 0.7 * 0.80
    assert mc["Bending"].capacity.to("psi").magnitude == pytest.approx(Fb, rel=RT)
    assert mc["Shear"].capacity.to("psi").magnitude == pytest.approx(Fv, rel=RT)
    # E' = E C_M C_t C_i = 1.6e6 × 0.9 × 0.9 × 0.95
    assert mc.values["E_prime"].to("psi").magnitude == pytest.approx(1.6e6 * 0.9 * 0.9 * 0.95)


def test_flat_use_2x10_plank():
    ft = ureg.ft
    beam = Beam(length=4 * ft, supports=[Pin(0 * ft), Roller(4 * ft)],
                loads=[UniformLoad_(40.0, 9.25 * ureg.inch, "L")])  # fmt: skip
    mc = check_nds_beam(
        SawnMember.dimension("2x10", flat=True), DFL2, demand=solve_cases(beam)["L"],
        conditions=ServiceConditions(flat_use=True),
    )  # fmt: skip
    assert mc["Bending"].capacity.to("psi").magnitude == pytest.approx(900 * 1.1 * 1.2, rel=RT)
    S = 9.25 * 1.5**2 / 6  # flatwise
    M = 40 * 9.25 / 12 * 4**2 / 8 * 12
    assert mc["Bending"].demand.to("psi").magnitude == pytest.approx(M / S, rel=RT)
