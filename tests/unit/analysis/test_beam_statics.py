"""The beam's statics plan: equilibrium equations taken one unknown at a time, as data.

References: the reactions of a beam with an internal hinge by the statics of the suspended part
(common practice: the part beyond the hinge is a simple span on the hinge and the far support);
the order of equations is the one the beam working writes (moments about a support first, so
that equation gives one unknown).
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Fixed, Hinge, Pin, Roller, solve_beam
from calcpack.analysis.beam.statics import Region, load_sum_si, statics_plan
from calcpack.loads import PointLoad, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN


def test_a_simple_span_takes_moments_about_a_support_then_sums_forces() -> None:
    beam = Beam(
        length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], loads=[PointLoad(2 * m, 9 * kN)]
    )
    plan = statics_plan(beam, {"D": 1.0})
    assert plan.complete
    assert [eq.label for eq in plan.equations] == [r"\Sigma M_{A} = 0", r"\Sigma F_y = 0"]
    first, second = plan.equations
    assert first.solves == ("B", "Fy")
    # R_B = P·a/L = 9 × 2/6 = 3 kN; R_A = P·b/L = 6 kN (common practice: simple span)
    assert first.value_si == pytest.approx(3e3, rel=1e-12)
    assert second.solves == ("A", "Fy")
    assert second.value_si == pytest.approx(6e3, rel=1e-12)
    # each equation holds the reaction it solves and only reactions found before it
    found: set[tuple[str, str]] = set()
    for eq in plan.equations:
        assert {r.key for r in eq.reactions} - found == {eq.solves}
        found.add(eq.solves)


def test_a_hinged_beam_is_solved_part_by_part() -> None:
    # fixed at A, hinge at 4 m, roller at B (12 m), 6 kN/m throughout: the suspended part
    # 4..12 m gives R_B = w·8/2 = 24 kN; then R_A = w·12 − R_B = 48 kN and
    # M_A (clockwise +) = −(w·12²/2 − R_B·12) = −144 kN·m (common practice: statics)
    beam = Beam(
        length=12 * m,
        supports=[Fixed(0 * m), Roller(12 * m)],
        hinges=[Hinge(4 * m)],
        loads=[UniformLoad(w=6 * kN / m)],
    )
    plan = statics_plan(beam, {"D": 1.0})
    assert plan.complete
    assert plan.equations[0].description.startswith("part right of hinge")
    got = {eq.solves: eq.value_si for eq in plan.equations}
    assert got[("B", "Fy")] == pytest.approx(24e3, rel=1e-12)
    assert got[("A", "Fy")] == pytest.approx(48e3, rel=1e-12)
    assert got[("A", "C")] == pytest.approx(-144e3, rel=1e-12)


def test_an_indeterminate_beam_needs_its_redundants() -> None:
    beam = Beam(
        length=8 * m,
        supports=[Fixed(0 * m), Roller(8 * m)],
        EI=Q_(25e3, "kN*m**2"),
        loads=[UniformLoad(w=10 * kN / m)],
    )
    assert not statics_plan(beam, {"D": 1.0}).complete
    # given the prop's reaction 3wL/8 = 30 kN (common practice: propped cantilever), the rest
    # follows: R_A = 5wL/8 = 50 kN, M_A = −wL²/8 = −80 kN·m (clockwise +)
    plan = statics_plan(beam, {"D": 1.0}, known={("B", "Fy"): 30e3})
    assert plan.complete
    got = {eq.solves: eq.value_si for eq in plan.equations}
    assert got[("A", "Fy")] == pytest.approx(50e3, rel=1e-12)
    assert got[("A", "C")] == pytest.approx(-80e3, rel=1e-12)
    r = solve_beam(beam)
    assert r.reaction("A").C.to("N*m").magnitude == pytest.approx(got[("A", "C")], rel=1e-9)


def test_load_terms_follow_the_factors_and_the_part() -> None:
    beam = Beam(
        length=10 * m,
        supports=[Pin(0 * m), Roller(10 * m)],
        loads=[UniformLoad(w=2 * kN / m, case="D"), PointLoad(6 * m, 5 * kN, case="L")],
    )
    # ΣFy of 0..5 m under 1.2D + 1.6L: −1.2 × 2 × 5 = −12 kN (the point load is outside)
    assert load_sum_si(beam, {"D": 1.2, "L": 1.6}, Region(0.0, 5.0, None)) == pytest.approx(-12e3)
    # ΣM about 0 of the whole beam under L alone: −5 × 6 = −30 kN·m (ccw +)
    assert load_sum_si(beam, {"L": 1.0}, Region(0.0, 10.0, 0.0)) == pytest.approx(-30e3)
