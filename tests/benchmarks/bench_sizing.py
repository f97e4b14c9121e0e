"""Benchmark: rank the US W-shapes for a three-span continuous steel beam.

Run: ``PYTHONPATH=. python tests/benchmarks/bench_sizing.py [--rounds R]``.
Target: the search returns the five lightest passing W-shapes in under a second, so that it
feels live in a notebook panel.

What is timed:

* search: :func:`calcpack.lightest_aisc_beam` on a three-span beam (20 ft spans, dead and live
  load, ASCE 7-16 strength combinations, bracing at the third points of each span, a live-load
  deflection limit of span/360), five passing shapes asked for.
* reference, measured in the same run: the exhaustive way, every W-shape of the database checked
  in full (the same AISC 360-16 §F2/§G2 check and deflection check, no screen, no early stop).

Printed: the median over the rounds of each, the search's time per candidate tried, and the ratio
reference / search (how much the ordering, screen and early stop save). The exit status is 1 if
the search's best shape is not the lightest passing shape of the exhaustive run.
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import check_aisc_beam, check_deflection
from calcpack.combinations import analyse_combinations, asce7_strength
from calcpack.errors import OutOfScopeError
from calcpack.loads.types import UniformLoad
from calcpack.sections.aisc_database import aisc_shape, aisc_shape_names
from calcpack.sizing import DeflectionLimit, lightest_aisc_beam
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
    return 0 if best == lightest else 1


if __name__ == "__main__":
    sys.exit(main())
