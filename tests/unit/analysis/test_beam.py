"""Beam solver behaviour: sides of discontinuities, extremes, springs, EI segments, axial force,
superposition API. Checks are closed forms from statics (common practice) unless noted."""

from __future__ import annotations

import math

import numpy as np
import pytest

from calcpack.analysis.beam import (
    Beam,
    EISegment,
    Fixed,
    Hinge,
    Pin,
    Roller,
    Spring,
    combine,
    solve_beam,
    solve_cases,
)
from calcpack.errors import InputError
from calcpack.loads import FunctionLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN
EI = Q_(30e3, "kN*m**2")


def simple(loads, L=6.0, **kw):
    return solve_beam(
        Beam(length=L * m, supports=[Pin(0 * m), Roller(L * m)], loads=loads, EI=EI, **kw)
    )


def test_values_left_and_right_of_a_point_load():
    r = simple([PointLoad(x=2 * m, P=9 * kN)])
    assert r.shear(2 * m, side="left").to("kN").magnitude == pytest.approx(6.0, rel=1e-12)
    assert r.shear(2 * m, side="right").to("kN").magnitude == pytest.approx(-3.0, rel=1e-12)
    assert r.extremes.zero_shear[0].to("m").magnitude == pytest.approx(2.0)
    assert r.extremes.M_max.side in ("left", "right")


def test_couple_gives_a_moment_jump_and_contraflexure():
    r = simple([PointMoment(x=3 * m, C=12 * kN * m)])
    assert r.moment(3 * m, side="left").to("kN*m").magnitude == pytest.approx(-6.0, rel=1e-12)
    assert r.moment(3 * m, side="right").to("kN*m").magnitude == pytest.approx(6.0, rel=1e-12)
    assert r.reaction("A").Fy.to("kN").magnitude == pytest.approx(-2.0, rel=1e-12)


def test_overhang_contraflexure_and_upward_tip():
    # w on 0..10 m, supports at 0 and 8 m: contraflexure where M = 0 inside the back span
    L, a = 10.0, 8.0
    r = solve_beam(
        Beam(
            length=L * m,
            supports=[Pin(0 * m), Roller(a * m)],
            loads=[UniformLoad(w=10 * kN / m)],
            EI=EI,
        )
    )
    RA = 10 * L * (a - L / 2) / a  # ΣM about B
    assert r.reaction("A").Fy.to("kN").magnitude == pytest.approx(RA, rel=1e-12)
    (xc,) = r.extremes.contraflexure
    assert xc.to("m").magnitude == pytest.approx(2 * RA / 10, rel=1e-10)  # R_A x − w x²/2 = 0
    assert r.extremes.M_min.x.to("m").magnitude == pytest.approx(a)


def test_sine_load_by_function_to_closed_form():
    # w0 sin(πx/L) on a simple span: M(L/2) = w0 L²/π², δ(L/2) = w0 L⁴/(π⁴ EI) (direct
    # integration of the differential equation, common practice)
    L, w0 = 6.0, 5.0
    load = FunctionLoad(
        func=lambda x: Q_(w0 * np.sin(np.pi * x.to("m").magnitude / L), "kN/m"),
        description="w0 sin(πx/L)",
        rtol=1e-11,
    )
    r = simple([load], L=L)
    assert r.moment(L / 2 * m).to("kN*m").magnitude == pytest.approx(
        w0 * L**2 / math.pi**2, rel=1e-9
    )
    d = w0 * L**4 / (math.pi**4 * EI.to("kN*m**2").magnitude) * 1e3
    assert r.extremes.deflection_down.value.to("mm").magnitude == pytest.approx(d, rel=1e-9)


def test_spring_support_reaction_shares_by_stiffness():
    # very stiff spring -> the two-span result; soft spring -> the single span
    w = UniformLoad(w=10 * kN / m)
    for k, expect in ((Q_(1e12, "kN/m"), 1.25 * 10 * 6), (Q_(1e-9, "kN/m"), 0.0)):
        r = solve_beam(
            Beam(
                length=12 * m,
                supports=[Pin(0 * m), Spring(6 * m, k=k), Roller(12 * m)],
                loads=[w],
                EI=EI,
            )
        )
        assert r.reaction("B").Fy.to("kN").magnitude == pytest.approx(expect, abs=1e-4)


def test_rotational_spring_between_pin_and_fixed():
    w = UniformLoad(w=10 * kN / m)
    stiff = solve_beam(
        Beam(
            length=8 * m,
            supports=[Spring(0 * m, k=Q_(1e15, "kN/m"), k_theta=Q_(1e15, "kN*m")), Roller(8 * m)],
            loads=[w],
            EI=EI,
        )
    )
    assert stiff.moment(0 * m).to("kN*m").magnitude == pytest.approx(-80.0, rel=1e-6)  # wL²/8


def test_stepped_EI_changes_deflection_not_determinate_moments():
    segs = [EISegment(0 * m, 3 * m, EI), EISegment(3 * m, 6 * m, 2 * EI)]
    a = simple([UniformLoad(w=10 * kN / m)])
    b = solve_beam(
        Beam(
            length=6 * m,
            supports=[Pin(0 * m), Roller(6 * m)],
            loads=[UniformLoad(w=10 * kN / m)],
            EI=segs,
        )
    )
    assert b.moment(2 * m).magnitude == pytest.approx(a.moment(2 * m).magnitude, rel=1e-12)
    assert b.deflection(3 * m).magnitude < a.deflection(3 * m).magnitude
    # stiffer right half: the slope at the right end is smaller in magnitude than at the left
    assert abs(b.extremes.slope_right.magnitude) < abs(b.extremes.slope_left.magnitude)


def test_axial_load_shared_between_two_pins():
    # uniform EA: a +x force at a from the left pin is shared (L − a)/L and a/L (common practice)
    beam = Beam(
        length=10 * m,
        supports=[Pin(0 * m), Pin(10 * m)],
        loads=[PointLoad(x=4 * m, P=0 * kN, H=10 * kN)],
    )
    r = solve_beam(beam)
    assert r.reaction("A").Fx.to("kN").magnitude == pytest.approx(-6.0, rel=1e-12)
    assert r.reaction("B").Fx.to("kN").magnitude == pytest.approx(-4.0, rel=1e-12)
    assert r.axial(2 * m).to("kN").magnitude == pytest.approx(6.0, rel=1e-12)  # tension
    assert r.axial(6 * m).to("kN").magnitude == pytest.approx(-4.0, rel=1e-12)
    assert beam.classify().degree_axial == 1


def test_classification_degrees():
    three = Beam(length=12 * m, supports=[Pin(0 * m), Roller(4 * m), Roller(8 * m), Roller(12 * m)])
    assert three.classify().degree == 2
    assert "degree 2" in three.classify().describe()
    gerber = Beam(length=12 * m, supports=[Fixed(0 * m), Roller(12 * m)], hinges=[Hinge(4 * m)])
    assert gerber.classify().kind == "determinate"


def _rank_of_restraints(beam: Beam) -> int:
    """Rank of the restraint rows (vertical: [1, x/L], rotation: [0, 1]) of a beam without
    hinges: the kinematic rule that the restraint count shortcut must equal."""
    L = beam.L_m
    rows = []
    for s in beam.supports:
        if s.restrains_v:
            rows.append([1.0, s.x_m / L])
        if s.restrains_rotation:
            rows.append([0.0, 1.0])
    return int(np.linalg.matrix_rank(np.array(rows))) if rows else 0


@pytest.mark.parametrize(
    "supports",
    [
        [Pin(0 * m)],
        [Roller(2 * m)],
        [Fixed(6 * m)],
        [Roller(0 * m), Roller(6 * m)],
        [Pin(1 * m), Roller(1.000001 * m)],
        [Spring(0 * m, k_theta=Q_(1e3, "kN*m"))],
        [Spring(0 * m, k_theta=Q_(1e3, "kN*m")), Spring(6 * m, k_theta=Q_(1e3, "kN*m"))],
        [Spring(3 * m, k=Q_(1e3, "kN/m"), k_theta=Q_(1e3, "kN*m"))],
        [Roller(3 * m), Spring(5 * m, k_theta=Q_(1e3, "kN*m"))],
        [Spring(0 * m, k=Q_(1e3, "kN/m"))],
        [Pin(0 * m), Roller(3 * m), Roller(6 * m)],
    ],
)
def test_stability_without_hinges_follows_the_rank_of_the_restraints(supports):
    beam = Beam(length=6 * m, supports=supports)
    stable = beam.classify().kind != "unstable"
    assert stable == (_rank_of_restraints(beam) == 2)


def test_cases_and_combination():
    beam = Beam(
        length=6 * m,
        supports=[Pin(0 * m), Roller(6 * m)],
        EI=EI,
        loads=[
            UniformLoad(w=4 * kN / m, case="D"),
            UniformLoad(w=3 * kN / m, case="L"),
            PointLoad(x=2 * m, P=5 * kN, case="L"),
        ],
    )
    by_case = solve_cases(beam)
    assert set(by_case) == {"D", "L"}
    c = combine(by_case, {"D": 1.2, "L": 1.6})
    d = 1.2 * by_case["D"] + 1.6 * by_case["L"]
    direct = 1.2 * 4 * 6 / 2 + 1.6 * (3 * 6 / 2 + 5 * 4 / 6)  # wL/2 and Pb/L
    assert c.reaction("A").Fy.to("kN").magnitude == pytest.approx(direct, rel=1e-12)
    assert d.reaction("A").Fy.to("kN").magnitude == pytest.approx(direct, rel=1e-12)
    assert c.label == "1.2D + 1.6L"
    xs = Q_(np.linspace(0, 6, 13), "m")
    assert np.allclose(c.moment(xs).magnitude, d.moment(xs).magnitude, rtol=1e-13, atol=1e-12)
    total = solve_beam(beam)
    both = by_case["D"] + by_case["L"]
    assert np.allclose(
        total.deflection(xs).magnitude, both.deflection(xs).magnitude, rtol=1e-12, atol=1e-12
    )
    with pytest.raises(InputError, match="'W' in the factors has no result"):
        combine(by_case, {"W": 1.0})


def test_adding_results_of_different_beams_is_refused():
    a = simple([UniformLoad(w=1 * kN / m)], L=6.0)
    b = simple([UniformLoad(w=1 * kN / m)], L=7.0)
    with pytest.raises(InputError, match="same beam structure"):
        a + b
