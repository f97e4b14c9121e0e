"""Invariants of the lightest-that-passes search on a timber post (NDS 2018 §3.7 through
calcpack's column check), for any load in range:

* the best candidate passes every check, and every lighter candidate tried fails one;
* candidates are tried lightest first;
* a larger load never gives a lighter best (the column check's utilisation grows with P);
* the table's own section checked as a panel checks it has the utilisation the search gave it.
"""

from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.nds.members import TimberForces
from calcpack.inputs.timber_post import (
    PostLoad,
    evaluate_timber_post,
    lightest_timber_post,
    timber_post_inputs,
)
from calcpack.units import Q_

TABLE = {"post": {"size": "4x4", "species": "Douglas Fir-Larch", "grade": "No.2",
                  "le": Q_(8, "ft")}}  # fmt: skip


def _case(P_kip: float, size: str = "4x4"):  # type: ignore[no-untyped-def]
    load = PostLoad("P1", TimberForces(P=Q_(P_kip, "kip"), combination="D + L"), "ten years")
    return timber_post_inputs({"post": {**TABLE["post"], "size": size}}, loads=[load])


@settings(max_examples=12, deadline=None)
@given(P=st.floats(min_value=0.5, max_value=12.0), more=st.floats(min_value=0.0, max_value=6.0))
def test_post_search_invariants(P: float, more: float) -> None:
    found = lightest_timber_post(_case(P), count=1)
    weights = [t.weight.to("lbf/ft").magnitude for t in found.tried]
    assert weights == sorted(weights)
    if not found.passing:
        assert all(t.verdict != "passes" for t in found.tried)
        return
    best = found.passing[0]
    assert evaluate_timber_post(_case(P, best.name)).passed
    assert evaluate_timber_post(_case(P, best.name)).governing[0] == best.utilisation
    for t in found.tried:
        if t.weight < best.weight:
            assert not evaluate_timber_post(_case(P, t.name)).passed
    heavier = lightest_timber_post(_case(P + more), count=1)
    if heavier.passing:
        assert heavier.passing[0].weight >= best.weight
