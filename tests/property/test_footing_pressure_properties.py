"""Properties of the no-tension contact pressure: its resultant is the load, acting at the
load's eccentricity; the pressure is never negative; a larger footing never has a larger
peak pressure. The resultant is checked by an independent midpoint-rule integration of the
returned plane on a fine grid (numpy), not by the solver's own polygon integrals."""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.foundations import Column, Footing, soil_pressure
from calcpack.units import Q_


def _grid_resultant(p, B, L, n=600):
    x = (np.arange(n) + 0.5) / n * B - B / 2
    y = (np.arange(n) + 0.5) / n * L - L / 2
    X, Y = np.meshgrid(x, y)
    a, b, c = p.plane
    q = np.maximum(a + b * X + c * Y, 0.0)
    dA = (B / n) * (L / n)
    F = q.sum() * dA
    return F, (q * X).sum() * dA / F, (q * Y).sum() * dA / F


@settings(max_examples=40, deadline=None)
@given(
    B=st.floats(0.5, 4.0),
    L=st.floats(0.5, 4.0),
    N=st.floats(1.0, 5000.0),
    fx=st.floats(-0.45, 0.45),
    fy=st.floats(-0.45, 0.45),
)
def test_resultant_equals_load_and_eccentricity(B, L, N, fx, fy):
    f = Footing("rectangular", Q_(B, "m"), Q_(0.4, "m"), Column(Q_(0.1, "m")), L=Q_(L, "m"))
    # keep the resultant inside the base with a margin (the diamond |fx| + |fy| < 0.45)
    if abs(fx) + abs(fy) > 0.45:
        fx, fy = fx / 2, fy / 2
    ex, ey = fx * B, fy * L
    p = soil_pressure(
        f.polygon_m(), Q_(N, "kN"), Q_(ex, "m"), Q_(ey, "m"), shape="rectangular", B=f.B, L=f.length
    )
    F, xr, yr = _grid_resultant(p, B, L)
    # midpoint rule on 600 x 600 cells: 0.5 % on the force, 0.3 % of the size on the position
    assert abs(F - N * 1000) <= 5e-3 * N * 1000
    assert abs(xr - ex) <= 3e-3 * max(B, L)
    assert abs(yr - ey) <= 3e-3 * max(B, L)
    assert p.q_min.magnitude >= 0
    assert p.q_max >= Q_(N / (B * L), "kPa") * (1 - 1e-9)


@settings(max_examples=30, deadline=None)
@given(B=st.floats(0.6, 3.0), grow=st.floats(1.01, 2.0), e=st.floats(0.0, 0.25))
def test_peak_pressure_falls_as_the_footing_grows(B, grow, e):
    def qmax(size):
        f = Footing("square", Q_(size, "m"), Q_(0.4, "m"), Column(Q_(0.1, "m")))
        return soil_pressure(
            f.polygon_m(), Q_(300, "kN"), Q_(e, "m"), Q_(0, "m"), shape="square", B=f.B, L=f.length
        ).q_max

    if e >= 0.45 * B:
        e = 0.2 * B
    assert qmax(B * grow) <= qmax(B) * (1 + 1e-9)
