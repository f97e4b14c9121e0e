"""The envelope of combinations obtained by superposition equals the maximum (and minimum) over
the combinations analysed one by one with factored loads (linearity of the beam analysis:
common practice, checked here on random beams)."""

from __future__ import annotations

from dataclasses import replace

import numpy as np
from beam_strategies import beams
from hypothesis import HealthCheck, given, settings

from calcpack.analysis.beam import solve_beam, solve_cases
from calcpack.combinations import (
    analyse_combinations,
    asce7_allowable_stress,
    asce7_strength,
    pattern_cases,
)
from calcpack.loads import LinearLoad, PointLoad, PointMoment, UniformLoad

PROFILE = settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
RTOL = 1e-7  # two exact analyses agree to round-off of the larger values


def _factored(load, f):
    if isinstance(load, PointLoad):
        return replace(load, P=f * load.P, H=f * load.H)
    if isinstance(load, PointMoment):
        return replace(load, C=f * load.C)
    if isinstance(load, UniformLoad):
        return replace(load, w=f * load.w)
    if isinstance(load, LinearLoad):
        return replace(load, w_start=f * load.w_start, w_end=f * load.w_end)
    raise AssertionError(type(load))


def _alone(beam, factors):
    loads = [_factored(ld, factors[ld.case]) for ld in beam.loads if ld.case in factors]
    return solve_beam(replace(beam, loads=loads))


def _scale(values):
    return max(1.0, max(abs(v) for v in values))


@PROFILE
@given(beams())
def test_envelope_equals_extremes_of_individually_analysed_combinations(beam):
    cases = solve_cases(beam)
    for cset in (asce7_strength(), asce7_allowable_stress()):
        cr = analyse_combinations(cases, cset)
        env = cr.envelope()
        alone = {c.name: _alone(beam, c.factors) for c in cr.combinations}
        for q, pick, sign in (
            ("M_max", lambda r: r.extremes.M_max.value, 1),
            ("M_min", lambda r: r.extremes.M_min.value, -1),
            ("V_max", lambda r: r.extremes.V_max.value, 1),
            ("V_min", lambda r: r.extremes.V_min.value, -1),
        ):
            vals = {
                n: pick(r).to("kN*m" if q[0] == "M" else "kN").magnitude for n, r in alone.items()
            }
            best = max(vals.values()) if sign > 0 else min(vals.values())
            got = env[q].value.to("kN*m" if q[0] == "M" else "kN").magnitude
            tol = RTOL * _scale(vals.values())
            assert abs(got - best) <= tol
            # the named combination attains the extreme when analysed on its own
            assert abs(vals[env[q].combination] - best) <= tol
        for s in beam.supports:
            fy = {n: r.reaction(s.label).Fy.to("kN").magnitude for n, r in alone.items()}
            tol = RTOL * _scale(fy.values())
            assert abs(env[f"R_{s.label},max"].value.to("kN").magnitude - max(fy.values())) <= tol
            assert abs(env[f"R_{s.label},min"].value.to("kN").magnitude - min(fy.values())) <= tol


@settings(max_examples=10, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(beams(layouts=["two spans", "three spans overhang"]))
def test_pattern_envelope_bounds_the_fully_loaded_case(beam):
    # Pattern loading adds combinations; the full-load pattern is one of them, so the envelope
    # can only widen, and the curve envelope bounds every combination at every point.
    if "L" not in beam.cases:
        return
    full = analyse_combinations(solve_cases(beam), asce7_strength()).envelope()
    pbeam, groups = pattern_cases(beam, "L")
    cr = analyse_combinations(solve_cases(pbeam), asce7_strength(), groups=groups)
    env = cr.envelope()
    tol = RTOL * max(1.0, abs(full["M_max"].value.magnitude), abs(full["M_min"].value.magnitude))
    assert env["M_max"].value.to("kN*m").magnitude >= full["M_max"].value.to("kN*m").magnitude - tol
    assert env["M_min"].value.to("kN*m").magnitude <= full["M_min"].value.to("kN*m").magnitude + tol
    x = np.linspace(0, beam.length.to("m").magnitude, 41) * beam.length.to("m").units
    up, lo, _, _ = env.curve("moment", x)
    for r in cr.results.values():
        m = r.moment(x).to(up.units).magnitude
        assert np.all(m <= up.magnitude + tol)
        assert np.all(m >= lo.magnitude - tol)
