"""Load takedown invariants: what is carried down equals what was applied, case by case.

Equilibrium of a simply supported beam (vertical forces): the reactions at both supports sum
to the total applied load of each case; carried onto one footing, they give that total.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack import ureg
from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.loads import PointLoad, UniformLoad
from calcpack.loads.takedown import reactions_by_case, takedown

_case = st.sampled_from(["D", "L", "S"])
_point = st.tuples(st.floats(0.0, 1.0), st.floats(0.1, 50.0), _case)
_udl = st.tuples(st.floats(0.1, 20.0), _case)


@given(
    span=st.floats(1.0, 12.0),
    points=st.lists(_point, max_size=3),
    udls=st.lists(_udl, min_size=1, max_size=2),
)
def test_carried_loads_sum_to_the_applied_loads_per_case(span, points, udls):
    loads = [PointLoad(x=f * span * ureg.m, P=P * ureg.kN, case=c) for f, P, c in points]
    loads += [UniformLoad(w=w * ureg.kN / ureg.m, case=c) for w, c in udls]
    beam = Beam(
        length=span * ureg.m,
        supports=[Pin(0 * ureg.m, name="A"), Roller(span * ureg.m, name="B")],
        loads=loads,
    )
    results = solve_cases(beam)
    td = takedown(reactions_by_case(results, "A"), reactions_by_case(results, "B"), onto="footing")
    applied: dict[str, float] = {}
    for _f, P, c in points:
        applied[c] = applied.get(c, 0.0) + P
    for w, c in udls:
        applied[c] = applied.get(c, 0.0) + w * span
    carried = {c: q.to("kN").magnitude for c, q in td.axial().items()}
    assert set(carried) == set(applied)
    for c, total in applied.items():
        assert carried[c] == pytest.approx(total, rel=1e-9, abs=1e-9)
