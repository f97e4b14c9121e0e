"""Invariants of the lightest-that-passes search on a timber post (NDS 2018 §3.7 through
calcpack's column check), for any load in range:

* the best candidate passes every check, and every lighter candidate tried fails one;
* candidates are tried lightest first;
* a larger load never gives a lighter best (the column check's utilisation grows with P);
* the table's own section checked as a panel checks it has the utilisation the search gave it.

And of the steel beam search (AISC 360-16 §F2/§G2 with a live deflection limit): what it ranks
after reading the demand once, screening by φ_b·M_p and stopping at ``count`` is what checking
every shape in full with :func:`calcpack.check_aisc_beam` on the combined results ranks.
"""

from __future__ import annotations

from hypothesis import Phase, given, settings
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


# -- the steel beam search (read the demand once, screen by φ_b·M_p, stop at count) against the
# full evaluation: every candidate checked with check_aisc_beam on the combined results ----------

_FY, _E = Q_(50, "ksi"), Q_(29000, "ksi")


def _steel_job(span_ft: float, spans: int, wd: float, wl: float, braces_per_span: int):  # type: ignore[no-untyped-def]
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.combinations import analyse_combinations, asce7_strength
    from calcpack.loads.types import UniformLoad

    L = Q_(span_ft, "ft")
    beam = Beam(
        length=spans * L,
        supports=[Pin(Q_(0, "ft"), name="S0")]
        + [Roller(i * L, name=f"S{i}") for i in range(1, spans + 1)],
        loads=[
            UniformLoad(w=Q_(wd, "kip/ft"), case="D"),
            UniformLoad(w=Q_(wl, "kip/ft"), case="L"),
        ],
        EI=_E * Q_(400, "in**4"),
        name="B5",
    )
    cases = solve_cases(beam)
    step = L / (braces_per_span + 1)
    braces = [k * step for k in range(1, spans * (braces_per_span + 1))]
    return L, cases, analyse_combinations(cases, asce7_strength()), braces


def _full(strength, cases, span, braces, names):  # type: ignore[no-untyped-def]
    """(name, verdict, governing utilisation) of every shape, lightest first, checked in full."""
    from calcpack.checks import check_aisc_beam, check_deflection
    from calcpack.errors import OutOfScopeError
    from calcpack.sections.aisc_database import aisc_shape
    from calcpack.sizing.search import _outcome

    shapes = sorted(
        (aisc_shape(n) for n in names),
        key=lambda s: (s["W"].to("lbf/ft").magnitude, s["d"].to("in").magnitude, s.designation),
    )
    out = []
    for s in shapes:
        try:
            strength_checks = check_aisc_beam(s.ishape(), Fy=_FY, demand=strength, braces=braces)
        except OutOfScopeError:
            out.append((s.designation, "out of scope", None))
            continue
        f = float((cases["L"].beam.EI / (_E * s["Ix"])).to("").magnitude)
        defl = check_deflection(member="B5", demand=cases["L"].scaled(f), span=span, limit=360)
        # the governing check by the search's one rule (a failing check, else a combination's)
        verdict, u, _ = _outcome([strength_checks, defl])
        assert verdict == ("passes" if strength_checks.passed and defl.passed else "fails")
        out.append((s.designation, verdict, u))
    return out


# each example checks a dozen shapes in full; shrinking a failure would take minutes, and the
# failing draw is printed as it is
@settings(max_examples=3, deadline=None, phases=(Phase.explicit, Phase.reuse, Phase.generate))
@given(
    span=st.floats(min_value=8.0, max_value=26.0),
    spans=st.integers(min_value=1, max_value=2),
    wd=st.floats(min_value=0.1, max_value=1.2),
    wl=st.floats(min_value=0.1, max_value=1.6),
    braces_per_span=st.integers(min_value=0, max_value=2),
)
def test_steel_search_ranks_as_the_full_evaluation(span, spans, wd, wl, braces_per_span) -> None:  # type: ignore[no-untyped-def]
    from calcpack.sections.aisc_database import aisc_shape_names
    from calcpack.sizing import DeflectionLimit, lightest_aisc_beam

    L, cases, strength, braces = _steel_job(span, spans, wd, wl, braces_per_span)
    depths = (8, 10)
    found = lightest_aisc_beam(
        strength, Fy=_FY, braces=braces, deflections=[DeflectionLimit(cases["L"], L, 360)],
        nominal_depth=depths, count=3, member="B5",
    )  # fmt: skip
    names = [n for n in aisc_shape_names("W") if int(n[1:].split("X")[0]) in depths]
    full = _full(strength, cases, L, braces, names)
    passing = [(n, u) for n, v, u in full if v == "passes"]
    # the same passing shapes, in the same order, with the same governing utilisation
    assert [(t.name, t.utilisation) for t in found.passing] == passing[:3]
    if passing:
        first = [n for n, _, _ in full].index(passing[0][0])
        lighter = full[first - 1][0] if first else None
        assert (found.next_lighter.name if found.next_lighter else None) == lighter
    # every shape the search rejected (by the screen or in full) fails the full evaluation
    verdict = {n: v for n, v, _ in full}
    for t in found.tried:
        assert (t.verdict == "passes") == (verdict[t.name] == "passes"), t.name
