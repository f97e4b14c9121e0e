"""Load cases that flow on from derived roof pressures keep equilibrium: the joint loads on a
truss top chord add up to the resultant of the pressure on the roof (vertical for plan loads;
normal to each panel for wind) and have its moment about the left eave (statics, common
practice); the line loads on a member carry the area load times the tributary width."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.loads.roof_cases import RoofProfile, line_loads, truss_joint_loads
from calcpack.units import Q_

pieces = st.lists(st.tuples(st.floats(0.2, 3.0), st.floats(-2.0, 2.0)), min_size=1, max_size=5)


def _profile(parts, kind):
    x, breaks, values = 0.0, [Q_(0.0, "m")], []
    for length, v in parts:
        x += length
        breaks.append(Q_(x, "m"))
        values.append(Q_(v, "kN/m^2"))
    return RoofProfile("W test", "W", kind, tuple(breaks), tuple(values))


def _chord(span, rise, n):
    pts = []
    for i in range(n + 1):
        x = span * i / n
        y = rise * (1 - abs(2 * x / span - 1))
        pts.append((f"J{i}", (Q_(x, "m"), Q_(y, "m"))))
    return pts


@settings(max_examples=40, deadline=None)
@given(pieces, st.integers(2, 8), st.floats(0.0, 4.0), st.floats(0.3, 3.0))
def test_plan_loads_resultant_and_moment(parts, n, rise, spacing):
    p = _profile(parts, "plan")
    span = p.breaks[-1].magnitude
    loads = truss_joint_loads(p, _chord(span, rise, n), Q_(spacing, "m"))
    total, xbar = p.integral(Q_(0, "m"), p.breaks[-1])
    fy = sum(j.Fy.to("kN").magnitude for j in loads)
    assert fy == pytest.approx(-total.magnitude * spacing, abs=1e-9)
    assert all(j.Fx.magnitude == 0 for j in loads)
    # moment about the left eave from the joint x positions (vertical loads only)
    xs = {name: xy[0].magnitude for name, xy in _chord(span, rise, n)}
    m = sum(j.Fy.to("kN").magnitude * xs[j.node] for j in loads)
    assert m == pytest.approx(-total.magnitude * spacing * xbar.to("m").magnitude, abs=1e-9)
    w = line_loads(p, Q_(spacing, "m"))
    carried = sum((u.w * (u.end - u.start)).to("kN").magnitude for u in w)
    assert carried == pytest.approx(total.magnitude * spacing, abs=1e-9)


@settings(max_examples=40, deadline=None)
@given(st.floats(-2.0, 2.0), st.integers(1, 4), st.floats(0.5, 4.0), st.floats(0.3, 3.0))
def test_uniform_normal_pressure_on_a_gable(p0, n_half, rise, spacing):
    """A uniform normal pressure p on both slopes of a symmetric gable: the horizontal
    components cancel and the vertical resultant is p × plan span × spacing (downward for
    pressure toward the roof)."""
    span = 8.0
    prof = _profile([(span, p0)], "normal")
    loads = truss_joint_loads(prof, _chord(span, rise, 2 * n_half), Q_(spacing, "m"))
    fx = sum(j.Fx.to("kN").magnitude for j in loads)
    fy = sum(j.Fy.to("kN").magnitude for j in loads)
    assert fx == pytest.approx(0.0, abs=1e-9)
    assert fy == pytest.approx(-p0 * span * spacing, abs=1e-9)
