"""The exact extreme finder on a range is never exceeded by a sample of the curve there, and
its value is attained (common practice: an extreme of a piecewise polynomial is at a range end,
a breakpoint or a root of the derivative; the samples are an independent search)."""

from __future__ import annotations

import numpy as np
from beam_strategies import beams
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from calcpack.analysis.beam import solve_beam
from calcpack.analysis.beam.core import evaluate
from calcpack.units import Q_

PROFILE = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
ATTRS = {"shear": ("V", 1.0), "moment": ("M", 1.0), "deflection": ("v", -1.0)}


@PROFILE
@given(
    beams(),
    st.floats(min_value=0.0, max_value=1.0),
    st.floats(min_value=0.0, max_value=1.0),
    st.sampled_from(sorted(ATTRS)),
)
def test_range_extremes_bound_every_sample(beam, f1, f2, what):
    r = solve_beam(beam)
    L = beam.L_m
    a, b = sorted((f1 * L, f2 * L))
    ext = r.range_extremes(what, Q_(a, "m"), Q_(b, "m"))
    attr, sign = ATTRS[what]
    g = getattr(r.core, attr)
    x = np.linspace(a, b, 301)
    # inside the range both sides of a breakpoint belong to it; at its ends only its own side
    inner = (x > a + 1e-9 * L) & (x < b - 1e-9 * L)
    left = sign * evaluate(r.core.X, g, x, "left")
    right = sign * evaluate(r.core.X, g, x, "right")
    samples = np.concatenate([right[x < b - 1e-9 * L], left[x > a + 1e-9 * L], left[inner]])
    if b - a <= 1e-9 * L:
        samples = np.concatenate([left, right])
    whole = evaluate(r.core.X, g, np.linspace(0.0, L, 201))
    tol = 1e-9 * max(float(np.abs(whole).max()), float(np.abs(samples).max()), 1e-30)
    # a curve that is zero but for round-off (a load straight over a support) is compared with
    # a floor set by the beam's own scale: the largest reaction R, R·L, R·L³/EI
    R = max([abs(float(v)) for v in r.core.reactions.values()] + [1e-30])
    if what == "deflection":
        scale = R * L**3 / float(beam.EI.to("N*m**2").magnitude)
    else:
        scale = R * (L if what == "moment" else 1.0)
    tol = max(tol, 1e-12 * scale)
    assert ext.largest.value_si >= samples.max() - tol
    assert ext.smallest.value_si <= samples.min() + tol
    # attained: the curve takes the value where the finder says (on one side or the other)
    for e in (ext.largest, ext.smallest):
        xe = np.array([e.x_m])
        at = sign * np.concatenate([evaluate(r.core.X, g, xe, "left"), evaluate(r.core.X, g, xe)])
        assert np.min(np.abs(at - e.value_si)) <= tol
