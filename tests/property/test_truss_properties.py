"""Property tests of the truss solver: equilibrium at every joint, overall balance, linearity,
agreement of the two solution methods, unit invariance."""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st
from strategies_truss import parallel_chord_truss

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import equilibrium_matrix, solve_truss
from calcpack.units import ureg

FAST = settings(max_examples=40, deadline=None)


def scale_of(truss: Truss) -> float:
    return max(float(np.max(np.abs(truss.load_vector()))), 1.0)


@FAST
@given(parallel_chord_truss())
def test_every_joint_is_in_equilibrium(truss: Truss) -> None:
    r = solve_truss(truss)
    residual = equilibrium_matrix(truss) @ np.concatenate([r.forces_N(), r.reactions_N()])
    residual += r.loads_N()
    assert float(np.max(np.abs(residual))) <= 1e-9 * scale_of(truss)


@FAST
@given(parallel_chord_truss())
def test_reactions_balance_the_loads(truss: Truss) -> None:
    r = solve_truss(truss)
    xy = truss.xy_m
    fx = fy = mz = 0.0
    for i, n in enumerate(truss.nodes):
        px, py = r.loads_N()[2 * i : 2 * i + 2]
        rx, ry = (q.to("N").magnitude for q in r.reaction_at(n.name))
        fx, fy = fx + px + rx, fy + py + ry
        mz += xy[i, 0] * (py + ry) - xy[i, 1] * (px + rx)
    tol = 1e-9 * scale_of(truss)
    assert abs(fx) <= tol
    assert abs(fy) <= tol
    assert abs(mz) <= tol * truss.size_m


@FAST
@given(parallel_chord_truss(), st.floats(min_value=-5.0, max_value=5.0))
def test_scaling_the_loads_scales_the_forces(truss: Truss, k: float) -> None:
    base = solve_truss(truss)
    scaled_loads = [JointLoad(ld.node, k * ld.Fx, k * ld.Fy, ld.case) for ld in truss.loads]
    r = solve_truss(truss.with_loads(scaled_loads))
    tol = 1e-9 * scale_of(truss) * max(abs(k), 1.0)
    assert np.allclose(r.forces_N(), k * base.forces_N(), rtol=0, atol=tol)
    assert np.allclose((k * base).forces_N(), r.forces_N(), rtol=0, atol=tol)


@FAST
@given(parallel_chord_truss())
def test_stiffness_method_agrees_with_equilibrium(truss: Truss) -> None:
    a = solve_truss(truss, method="equilibrium")
    b = solve_truss(truss, method="stiffness")
    # Stiffness solve conditioning grows with the spread of EA/L; 1e-7 of the load is ample.
    assert np.allclose(a.forces_N(), b.forces_N(), rtol=0, atol=1e-7 * scale_of(truss))


@FAST
@given(parallel_chord_truss())
def test_case_results_add_up_to_all_loads(truss: Truss) -> None:
    whole = solve_truss(truss)
    parts = [solve_truss(truss, case=c) for c in truss.load_cases]
    total = parts[0]
    for p in parts[1:]:
        total = total + p
    assert np.allclose(total.forces_N(), whole.forces_N(), rtol=0, atol=1e-9 * scale_of(truss))


@settings(max_examples=20, deadline=None)
@given(parallel_chord_truss())
def test_us_units_give_the_same_forces(truss: Truss) -> None:
    ft, kip = ureg.ft, ureg.kip
    us = Truss.build(
        nodes={n.name: (n.x.to(ft), n.y.to(ft)) for n in truss.nodes},
        members={mb.name: (mb.start, mb.end) for mb in truss.members},
        supports={s.node: (s.kind, s.surface) for s in truss.supports},
        loads=[JointLoad(ld.node, ld.Fx.to(kip), ld.Fy.to(kip), ld.case) for ld in truss.loads],
    )
    a, b = solve_truss(truss), solve_truss(us)
    assert np.allclose(a.forces_N(), b.forces_N(), rtol=0, atol=1e-9 * scale_of(truss))


@settings(max_examples=8, deadline=None)
@given(parallel_chord_truss())
def test_joint_working_reproduces_the_solver(truss: Truss) -> None:
    from calcpack.working import Derived

    r = solve_truss(truss)
    scale = max(float(np.max(np.abs(r.forces_N()))), 1.0) / 1e3  # kN
    symbol = {f"F_{mb.name}": mb.name for mb in truss.members}
    seen = set()
    for node in r.joint_order():
        for step in r.joint_working(node).steps:
            if isinstance(step, Derived) and step.name in symbol:
                name = symbol[step.name]
                got = step.quantity.to("kN").magnitude
                assert abs(got - r.force(name).to("kN").magnitude) <= 1e-9 * scale
                seen.add(name)
    assert seen == set(symbol.values())
