"""Benchmark: rank the US W-shapes for a three-span continuous steel beam, and the timber sizes.

Run: ``PYTHONPATH=. python tests/benchmarks/bench_sizing.py [--rounds R]``.
Target: the search returns the five lightest passing W-shapes in under a second, so that it
feels live in a notebook panel; the timber searches likewise.

What is timed:

* search: :func:`calcpack.lightest_aisc_beam` on a three-span beam (20 ft spans, dead and live
  load, ASCE 7-16 strength combinations, bracing at the third points of each span, a live-load
  deflection limit of span/360), five passing shapes asked for.
* reference, measured in the same run: the exhaustive way, every W-shape of the database checked
  in full (the same AISC 360-16 §F2/§G2 check and deflection check, no screen, no early stop).

Then the timber searches, each against its own exhaustive reference in the same run (every
candidate checked in full with the same trial, :meth:`calcpack.sizing.SearchSpace.check`):

* sawn joist: :func:`calcpack.lightest_nds_beam`, Douglas Fir-Larch No.2, 14 ft simple span,
  ASCE 7-16 allowable-stress combinations, live deflection span/360 (15 sizes 2x4 to 4x12);
* sawn joist across grades: the same joist, every size in No.2, No.1 and Select Structural
  (:func:`calcpack.sizing.nds_graded_beam_space`, 45 candidates);
* glulam: :func:`calcpack.lightest_glulam_beam`, 24F-1.8E, 24 ft simple span (the stock widths
  and depths);
* post: :func:`calcpack.lightest_nds_post`, Table 4D P&T No.1 timbers, two force sets.

Printed: the median over the rounds of each, the search's time per candidate tried, and the ratio
reference / search (how much the ordering, screen and early stop save). The exit status is 1 if
a search's best is not the lightest passing candidate of its exhaustive run.
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import check_aisc_beam, check_deflection
from calcpack.checks.nds.members import TimberForces
from calcpack.combinations import analyse_combinations, asce7_allowable_stress, asce7_strength
from calcpack.errors import OutOfScopeError
from calcpack.loads.types import UniformLoad
from calcpack.sections.aisc_database import aisc_shape, aisc_shape_names
from calcpack.sizing import (
    DeflectionLimit,
    glulam_beam_space,
    lightest_aisc_beam,
    lightest_glulam_beam,
    lightest_nds_beam,
    lightest_nds_post,
    nds_beam_space,
    nds_graded_beam_space,
    nds_post_space,
)
from calcpack.units import Q_

FY = Q_(50, "ksi")
E = Q_(29000, "ksi")


def _job():  # type: ignore[no-untyped-def]
    span = Q_(20, "ft")
    beam = Beam(
        length=3 * span,
        supports=[
            Pin(Q_(0, "ft"), name="A"),
            Roller(span, name="B"),
            Roller(2 * span, name="C"),
            Roller(3 * span, name="D"),
        ],
        loads=[
            UniformLoad(w=Q_(0.8, "kip/ft"), case="D"),
            UniformLoad(w=Q_(1.2, "kip/ft"), case="L"),
        ],
        EI=E * Q_(500, "in**4"),
        name="B2",
    )
    cases = solve_cases(beam)
    braces = [Q_(x, "ft") for x in range(10, 60, 10)]
    return span, cases, analyse_combinations(cases, asce7_strength()), braces


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--rounds", type=int, default=3)
    args = ap.parse_args()
    span, cases, strength, braces = _job()
    limit = [DeflectionLimit(cases["L"], span, 360)]

    search_t, ref_t, tried = [], [], 0
    best = ""
    lightest = ""
    for _ in range(args.rounds):
        t0 = time.perf_counter()
        found = lightest_aisc_beam(strength, Fy=FY, braces=braces, deflections=limit)
        search_t.append(time.perf_counter() - t0)
        best, tried = found.best.name, len(found.tried)

        t0 = time.perf_counter()
        passing = []
        for name in aisc_shape_names("W"):
            s = aisc_shape(name)
            try:
                ok = check_aisc_beam(s.ishape(), Fy=FY, demand=strength, braces=braces).passed
            except OutOfScopeError:  # refusals count as not passing, as in the search
                continue
            f = float((cases["L"].beam.EI / (E * s["Ix"])).to("").magnitude)
            d = check_deflection(member="B2", demand=cases["L"].scaled(f), span=span, limit=360)
            if ok and d.passed:
                passing.append((s["W"].to("lbf/ft").magnitude, s["d"].to("in").magnitude, name))
        ref_t.append(time.perf_counter() - t0)
        lightest = min(passing)[2]

    ms, mr = statistics.median(search_t), statistics.median(ref_t)
    print(
        f"search:    {ms * 1e3:8.1f} ms median, {tried} candidates tried, "
        f"{ms / tried * 1e3:.2f} ms per candidate; best {best}"
    )
    print(
        f"reference: {mr * 1e3:8.1f} ms median (every W-shape checked in full); "
        f"lightest passing {lightest}"
    )
    print(
        f"ratio reference/search: {mr / ms:.1f}x; target: search under 1000 ms "
        f"({'met' if ms < 1.0 else 'NOT met'})"
    )
    ok = best == lightest
    for label, search, space in _timber_jobs():
        ok = _timber(label, search, space, args.rounds) and ok
    return 0 if ok else 1


def _simple_asd(span_ft: float, wd: str, wl: str, EI):  # type: ignore[no-untyped-def]
    L = Q_(span_ft, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[UniformLoad(w=Q_(wd), case="D"), UniformLoad(w=Q_(wl), case="L")],
        EI=EI,
        name="J1",
    )
    cases = solve_cases(beam)
    asd = analyse_combinations(cases, asce7_allowable_stress())
    return asd, [DeflectionLimit(cases["L"], L, 360)]


def _timber_jobs():  # type: ignore[no-untyped-def]
    """(label, search(), search space) of each timber search."""
    joist, j_defl = _simple_asd(14, "40 lbf/ft", "120 lbf/ft", Q_(1.6e6, "psi") * Q_(100, "in**4"))
    sawn = {"species": "Douglas Fir-Larch", "grade": "No.2", "deflections": j_defl}
    girder, g_defl = _simple_asd(
        24, "200 lbf/ft", "500 lbf/ft", Q_(1.8e6, "psi") * Q_(1e3, "in**4")
    )
    forces = [
        TimberForces(P=Q_(14, "kip"), combination="D + L"),
        TimberForces(P=Q_(16, "kip"), combination="D + 0.75L + 0.75S"),
    ]
    post = {
        "species": "Douglas Fir-Larch", "grade": "P&T No.1", "table": "4D", "le": Q_(10, "ft"),
        "durations": {"D + L": "ten years", "D + 0.75L + 0.75S": "two months"},
    }  # fmt: skip
    graded = {**sawn, "grade": ["No.2", "No.1", "Select Structural"]}
    graded_space = {k: v for k, v in graded.items() if k != "grade"}
    return [
        ("sawn joist", lambda: lightest_nds_beam(joist, **sawn), nds_beam_space(joist, **sawn)),
        (
            "sawn, grades",
            lambda: lightest_nds_beam(joist, **graded),
            nds_graded_beam_space(joist, grades=graded["grade"], **graded_space),
        ),
        (
            "glulam beam",
            lambda: lightest_glulam_beam(girder, deflections=g_defl),
            glulam_beam_space(girder, deflections=g_defl),
        ),
        ("timber post", lambda: lightest_nds_post(forces, **post), nds_post_space(forces, **post)),
    ]


def _timber(label: str, search, space, rounds: int) -> bool:  # type: ignore[no-untyped-def]
    search_t, ref_t = [], []
    best, tried, lightest = "", 0, ""
    for _ in range(rounds):
        t0 = time.perf_counter()
        found = search()
        search_t.append(time.perf_counter() - t0)
        best, tried = found.best.name, len(found.tried)
        t0 = time.perf_counter()
        passing = []
        for c in space.candidates:
            if all(mc.passed for mc in space.check(c.item)):
                w = c.weight.to("lbf/ft").magnitude
                passing.append((w, c.depth.to("inch").magnitude, c.name))
        ref_t.append(time.perf_counter() - t0)
        lightest = min(passing)[2]
    ms, mr = statistics.median(search_t), statistics.median(ref_t)
    n = len(space.candidates)
    print(
        f"{label:12s} search {ms * 1e3:7.1f} ms median, {tried} of {n} tried, "
        f"{ms / tried * 1e3:.2f} ms per candidate, best {best}; reference (all {n} checked) "
        f"{mr * 1e3:7.1f} ms, {mr / n * 1e3:.2f} ms per candidate, lightest {lightest}; "
        f"ratio reference/search {mr / ms:.1f}x"
    )
    return best == lightest


if __name__ == "__main__":
    sys.exit(main())
