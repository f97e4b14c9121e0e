"""Free-body reactions of straight beams checked against sympy's beam solver.

Reference: SymPy 1.14, ``sympy.physics.continuum_mechanics.beam.Beam`` and its
``solve_for_reaction_loads`` (a general-purpose open-source library). In its convention a
positive load value and a positive reaction act in the same sense (so the reactions of a
positive load come out negative), and a positive moment load or reaction moment is
counter-clockwise in calcpack's x-right, y-up frame when loads are taken downward;
:func:`test_sympy_beam_sign_convention` pins this on a cantilever whose answer is known
(wall moment P·L, common practice).
"""

from __future__ import annotations

import pytest
from sympy import symbols
from sympy.physics.continuum_mechanics.beam import Beam

from calcpack.analysis.freebody import (
    BodySupport,
    Couple,
    DistributedLoad,
    FreeBody,
    PointForce,
    solve_free_body,
)
from calcpack.units import ureg

m, kN = ureg.m, ureg.kN
E, I = symbols("E I")
# sympy solves exactly in rationals; calcpack in floats: 1e-12 relative is round-off.
REL = 1e-12


def test_sympy_beam_sign_convention() -> None:
    b = Beam(3, E, I)
    b.apply_support(0, "fixed")
    b.apply_load(10, 3, -1)  # 10 (downward) at the tip
    R, M = symbols("R_0 M_0")
    b.solve_for_reaction_loads(R, M)
    assert float(b.reaction_loads[R]) == -10.0  # upward reaction is negative: exact
    assert float(b.reaction_loads[M]) == 30.0  # P·L counter-clockwise at the wall: exact


@pytest.mark.parametrize(
    ("L", "P", "a", "w", "C", "c"),
    [
        (6.0, 10.0, 2.0, 2.0, 5.0, 3.0),
        (9.0, 25.0, 7.5, 0.0, -12.0, 1.0),
        (4.0, 0.0, 1.0, 6.5, 0.0, 2.0),
    ],
)
def test_simply_supported_beam(L: float, P: float, a: float, w: float, C: float, c: float) -> None:
    b = Beam(L, E, I)
    r0 = b.apply_support(0, "pin")
    rL = b.apply_support(L, "roller")
    if P:
        b.apply_load(P, a, -1)
    if w:
        b.apply_load(w, 0, 0, end=L)
    if C:
        b.apply_load(C, c, -2)
    b.solve_for_reaction_loads(r0, rL)
    loads: list[PointForce | DistributedLoad | Couple] = []
    if P:
        loads.append(PointForce(a * m, 0 * m, Fy=-P * kN, label="P"))
    if w:
        loads.append(DistributedLoad(0 * m, 0 * m, L * m, 0 * m, w * kN / m))
    if C:
        loads.append(Couple(C * kN * m, "C_0"))
    fb = FreeBody(
        "beam",
        loads,
        [BodySupport("A", 0 * m, 0 * m, "pin"), BodySupport("B", L * m, 0 * m, "roller")],
    )
    r = solve_free_body(fb)
    assert r.reaction("R_Ay").to("kN").magnitude == pytest.approx(
        -float(b.reaction_loads[r0]), rel=REL
    )
    assert r.reaction("R_B").to("kN").magnitude == pytest.approx(
        -float(b.reaction_loads[rL]), rel=REL
    )
    assert abs(r.reaction("R_Ax").to("kN").magnitude) < 1e-12  # no horizontal load


def test_cantilever_with_triangular_load() -> None:
    L, w = 5.0, 8.0
    b = Beam(L, E, I)
    b.apply_support(0, "fixed")
    b.apply_load(w / L, 0, 1, end=L)  # ramp from 0 at the wall to w at the tip
    R, M = symbols("R_0 M_0")
    b.solve_for_reaction_loads(R, M)
    fb = FreeBody(
        "cantilever",
        [DistributedLoad(0 * m, 0 * m, L * m, 0 * m, 0 * kN / m, w * kN / m)],
        [BodySupport("A", 0 * m, 0 * m, "fixed")],
    )
    r = solve_free_body(fb)
    assert r.reaction("R_Ay").to("kN").magnitude == pytest.approx(
        -float(b.reaction_loads[R]), rel=REL
    )
    assert r.reaction("M_A").to("kN*m").magnitude == pytest.approx(
        float(b.reaction_loads[M]), rel=REL
    )


@pytest.mark.parametrize(
    ("L", "b_x", "P", "a", "w1", "w2", "s", "e", "C", "c"),
    [
        (10.0, 7.5, 12.0, 10.0, 0.0, 8.0, 2.0, 6.0, 10.0, 4.0),
        (6.0, 6.0, 5.0, 1.5, 3.0, 3.0, 0.0, 6.0, -4.0, 5.0),
        (8.0, 5.0, 0.0, 0.0, 6.0, 2.0, 4.0, 8.0, 0.0, 0.0),
    ],
)
def test_beam_statics_plan_reactions(
    L: float,
    b_x: float,
    P: float,
    a: float,
    w1: float,
    w2: float,
    s: float,
    e: float,
    C: float,
    c: float,
) -> None:
    """The beam working's plan of equilibrium equations (moments about A, then ΣFy) gives
    sympy's reactions for a pin at 0 and a roller at b_x (an overhang when b_x < L) under a
    point load, a linearly varying load and a couple (clockwise + in calcpack, so −C in
    sympy's counter-clockwise sense)."""
    from calcpack.analysis.beam import Beam as CBeam
    from calcpack.analysis.beam import Pin, Roller
    from calcpack.analysis.beam.statics import statics_plan
    from calcpack.loads import LinearLoad, PointLoad, PointMoment

    b = Beam(L, E, I)
    r0 = b.apply_support(0, "pin")
    r1 = b.apply_support(b_x, "roller")
    loads: list[PointLoad | LinearLoad | PointMoment] = []
    if P:
        b.apply_load(P, a, -1)
        loads.append(PointLoad(x=a * m, P=P * kN))
    slope = (w2 - w1) / (e - s)
    b.apply_load(w1, s, 0, end=e)
    if slope:
        b.apply_load(slope, s, 1, end=e)
    loads.append(LinearLoad(w_start=w1 * kN / m, w_end=w2 * kN / m, start=s * m, end=e * m))
    if C:
        b.apply_load(-C, c, -2)
        loads.append(PointMoment(x=c * m, C=C * kN * m))
    b.solve_for_reaction_loads(r0, r1)
    beam = CBeam(length=L * m, supports=[Pin(0 * m), Roller(b_x * m)], loads=loads)
    plan = statics_plan(beam, {"D": 1.0})
    assert plan.complete
    got = {eq.solves: eq.value_si / 1e3 for eq in plan.equations}
    assert got[("A", "Fy")] == pytest.approx(-float(b.reaction_loads[r0]), rel=REL, abs=1e-12)
    assert got[("B", "Fy")] == pytest.approx(-float(b.reaction_loads[r1]), rel=REL, abs=1e-12)
