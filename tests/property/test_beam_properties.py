"""Properties every beam solution must have (common practice of statics): equilibrium, jumps
at point actions, M as the integral of V, linearity and superposition, unit invariance."""

from __future__ import annotations

import itertools

import numpy as np
from beam_strategies import beams
from hypothesis import HealthCheck, given, settings

from calcpack.analysis.beam import Beam, Pin, Roller, combine, solve_beam, solve_cases
from calcpack.loads import PointLoad, PointMoment, UniformLoad
from calcpack.loads.resultants import resultant_si
from calcpack.units import Q_

PROFILE = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
RTOL = 1e-9  # round-off of the exact solution


def _load_totals(beam: Beam) -> tuple[float, float, float]:
    """ΣF (down), Σ moment about x=0 (ccw +) of the loads, and a size for tolerances."""
    F = Mo = size = 0.0
    for load in beam.loads:
        for p in load.si_points():
            F += p.P_N
            Mo += -p.P_N * p.x_m - p.C_Nm
            size += abs(p.P_N) * beam.L_m + abs(p.C_Nm)
        pieces = load.si_pieces()
        if pieces:
            P, first = resultant_si(pieces)
            F += P
            Mo += -first
            size += sum(abs(c) for pc in pieces for c in pc.coeffs) * beam.L_m**2
    return F, Mo, size


@PROFILE
@given(beams())
def test_reactions_and_loads_are_in_equilibrium(beam):
    r = solve_beam(beam)
    F, Mo, size = _load_totals(beam)
    Ry = sum(x.Fy.to("N").magnitude for x in r.reactions)
    Mr = sum(
        x.Fy.to("N").magnitude * x.x.to("m").magnitude - x.C.to("N*m").magnitude
        for x in r.reactions
    )
    assert abs(Ry - F) <= RTOL * size  # ΣFy = 0
    assert abs(Mr + Mo) <= RTOL * size * beam.L_m  # ΣM about x = 0 is 0


@PROFILE
@given(beams())
def test_shear_jumps_by_the_point_load_and_moment_by_the_couple(beam):
    r = solve_beam(beam)
    _, _, size = _load_totals(beam)
    tol = 1e-6 * beam.L_m
    for load in beam.loads:
        if isinstance(load, PointLoad | PointMoment):
            x = load.x.to("m").magnitude
            # Other actions at (or snapped to) the same point would add to the jump.
            near = [0.0, beam.L_m, *(s.x_m for s in beam.supports)]
            near += [
                p.to("m").magnitude for o in beam.loads if o is not load for p in o.positions()
            ]
            if any(abs(x - y) < tol for y in near):
                continue
            xq = Q_(x, "m")
            if isinstance(load, PointLoad):
                jump = (r.shear(xq, side="left") - r.shear(xq, side="right")).to("kN")
                assert abs(jump.magnitude - load.P.to("kN").magnitude) <= RTOL * size / 1e3
            else:
                jump = (r.moment(xq, side="right") - r.moment(xq, side="left")).to("kN*m")
                assert abs(jump.magnitude - load.C.to("kN*m").magnitude) <= RTOL * size / 1e3


@PROFILE
@given(beams())
def test_moment_is_the_integral_of_shear(beam):
    r = solve_beam(beam)
    X = r.core.X
    nodes, weights = np.polynomial.legendre.leggauss(12)  # exact for the polynomial degrees here
    scale = max(np.max(np.abs(r.core.M)), 1.0)
    for a, b in itertools.pairwise(X):
        xs = 0.5 * (a + b) + 0.5 * (b - a) * nodes
        integral = 0.5 * (b - a) * np.sum(weights * r.shear(Q_(xs, "m")).to("N").magnitude)
        dM = (r.moment(Q_(b, "m"), side="left") - r.moment(Q_(a, "m"), side="right")).to("N*m")
        assert abs(dM.magnitude - integral) <= 1e-8 * scale


@PROFILE
@given(beams())
def test_results_are_linear_in_the_loads(beam):
    r = solve_beam(beam)
    by_case = solve_cases(beam)
    combo = combine(by_case, dict.fromkeys(by_case, 2.5))
    xs = Q_(np.linspace(0.0, beam.L_m, 23), "m")
    scaleM = max(np.max(np.abs(r.core.M)), 1.0) / 1e3
    scaleV = max(np.max(np.abs(r.core.V)), 1.0) / 1e3
    scaled = Beam(
        length=beam.length,
        supports=beam.supports,
        hinges=beam.hinges,
        EI=beam.EI,
        loads=[_scale(ld, 2.5) for ld in beam.loads],
    )
    r2 = solve_beam(scaled)
    for res in (combo, r2):
        assert np.allclose(
            res.moment(xs).magnitude, 2.5 * r.moment(xs).magnitude, rtol=0, atol=1e-9 * 2.5 * scaleM
        )
        assert np.allclose(
            res.shear(xs).magnitude, 2.5 * r.shear(xs).magnitude, rtol=0, atol=1e-9 * 2.5 * scaleV
        )
        for a, b in zip(res.reactions, r.reactions, strict=True):
            assert abs(a.Fy.magnitude - 2.5 * b.Fy.magnitude) <= 1e-9 * 2.5 * scaleV
    d = r.deflection(xs).magnitude
    assert np.allclose(
        combo.deflection(xs).magnitude,
        2.5 * d,
        rtol=0,
        atol=1e-9 * max(np.max(np.abs(d)), 1e-9) * 2.5,
    )


def _scale(load, f):
    from dataclasses import fields, replace

    changes = {}
    for fld in fields(load):
        if fld.name in ("P", "H", "C", "w", "w_start", "w_end"):
            changes[fld.name] = getattr(load, fld.name) * f
    return replace(load, **changes)


def test_si_and_us_inputs_agree():  # unit invariance (common practice)
    si_beam = Beam(
        length=Q_(6.096, "m"),
        supports=[Pin(Q_(0, "m")), Roller(Q_(6.096, "m"))],
        loads=[
            UniformLoad(w=Q_(1.2, "kip/ft").to("kN/m")),
            PointLoad(x=Q_(2.4384, "m"), P=Q_(10, "kip").to("kN")),
        ],
        EI=Q_(29000 * 500, "kip*inch**2").to("kN*m**2"),
    )
    us_beam = Beam(
        length=Q_(20, "ft"),
        supports=[Pin(Q_(0, "ft")), Roller(Q_(20, "ft"))],
        loads=[UniformLoad(w=Q_(1.2, "kip/ft")), PointLoad(x=Q_(8, "ft"), P=Q_(10, "kip"))],
        EI=Q_(29000 * 500, "kip*inch**2"),
    )
    a, b = solve_beam(si_beam), solve_beam(us_beam)
    assert a.extremes.M_max.value.to("kip*ft").magnitude == __import__("pytest").approx(
        b.extremes.M_max.value.to("kip*ft").magnitude, rel=1e-12
    )
    assert a.extremes.deflection_down.value.to("inch").magnitude == __import__("pytest").approx(
        b.extremes.deflection_down.value.to("inch").magnitude, rel=1e-12
    )
