"""Benchmark: a three-span continuous beam with eight mixed loads, calcpack against SymPy.

Run: ``PYTHONPATH=. python tests/benchmarks/bench_beam.py [--rounds R] [--batch B]``.
Target: calcpack at least 300 times faster than the reference, with reactions and extremes
equal to it within 1e-9 relative (the exit status is 1 if they are not).

What is timed:

* calcpack, "model built from quantities" (the figure that counts): make every quantity, the
  loads, supports and the Beam (as a live front end rebuilds it on every change), solve it
  (classification, reactions, V, M, slope and deflection as exact piecewise polynomials), find
  the exact extremes of V, M and deflection, and read the reactions as quantities in N.
* calcpack, "solve and extremes only": the same on a Beam built once.
* reference: SymPy 1.14 ``sympy.physics.continuum_mechanics.beam.Beam`` -- solve for the
  reactions, form the shear and moment expressions, and find their extremes by solving for
  turning points segment by segment (sympy's own maximum search is not used: it does not
  finish in reasonable time on such a beam). SymPy's cache is cleared before each reference
  run so every run does the full work.

How: R rounds, each one reference run followed by B calcpack runs of each kind, so both sides
see the same machine load on a shared machine. Printed per side: the median over the rounds
(calcpack: of each round's median) and the best round (the same statistic on both sides; on a
busy machine the best round is the quieter-machine figure). The ratios divide reference by
calcpack times for each statistic.
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time
from itertools import pairwise

import sympy
from sympy.core.cache import clear_cache
from sympy.physics.continuum_mechanics.beam import Beam as SymBeam

from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam
from calcpack.loads import LinearLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_, ureg

# Unit objects made once, as live code would: parsing a unit string costs more than the solve.
N, m, N_m, N_per_m, N_m2 = (ureg.Unit(u) for u in ("N", "m", "N*m", "N/m", "N*m**2"))

Rt = sympy.Rational
EI_NM2 = 2.4e7  # N·m²
SPANS = (0, 6, 14, 20)  # supports (m)
# (kind, data): loads downward +, couples clockwise +; N, m
LOADS = [
    ("w", 0, 20, 1500),  # full uniform
    ("w", 2, 5, 4000),  # partial uniform
    ("w", 9, 13, 2500),  # partial uniform
    ("lin", 14, 20, 0, 6000),  # triangular
    ("P", 3, 10000),
    ("P", 10, 18000),
    ("P", 17, 7000),
    ("C", 12, 9000),  # couple
]


def build_beam() -> Beam:
    """The model, from quantities (as a live front end rebuilds it on every change)."""
    loads = []
    for kind, *d in LOADS:
        if kind == "w":
            loads.append(UniformLoad(w=Q_(d[2], N_per_m), start=Q_(d[0], m), end=Q_(d[1], m)))
        elif kind == "lin":
            loads.append(
                LinearLoad(
                    w_start=Q_(d[2], N_per_m),
                    w_end=Q_(d[3], N_per_m),
                    start=Q_(d[0], m),
                    end=Q_(d[1], m),
                )
            )
        elif kind == "P":
            loads.append(PointLoad(x=Q_(d[0], m), P=Q_(d[1], N)))
        else:
            loads.append(PointMoment(x=Q_(d[0], m), C=Q_(d[1], N_m)))
    return Beam(
        length=Q_(SPANS[-1], m),
        supports=[Pin(Q_(SPANS[0], m))] + [Roller(Q_(x, m)) for x in SPANS[1:]],
        loads=loads,
        EI=Q_(EI_NM2, N_m2),
    )


def calcpack_solve(beam: Beam) -> dict[str, float]:
    """Solve and read reactions and the exact extremes of V, M and deflection."""
    r = solve_beam(beam)
    e = r.extremes
    out = {f"R{i}": q.Fy.m_as(N) for i, q in enumerate(r.reactions)}
    out.update(
        # extremes are stored in SI; .value gives the quantity in kN, kN·m or mm
        Vmax=e.V_max.value_si,
        Vmin=e.V_min.value_si,
        Mmax=e.M_max.value_si,
        Mmin=e.M_min.value_si,
    )
    assert e.deflection_down is not None
    out["dmax"] = e.deflection_down.value_si
    return out


def calcpack_run() -> dict[str, float]:
    return calcpack_solve(build_beam())


def sympy_run() -> dict[str, float]:
    clear_cache()
    b = SymBeam(SPANS[-1], Rt(EI_NM2), 1)
    reactions = [
        b.apply_support(x, type="pin" if i == 0 else "roller") for i, x in enumerate(SPANS)
    ]
    for kind, *d in LOADS:
        if kind == "w":
            b.apply_load(-d[2], d[0], 0, end=d[1])
        elif kind == "lin":
            b.apply_load(-Rt(d[3] - d[2], d[1] - d[0]), d[0], 1, end=d[1])
        elif kind == "P":
            b.apply_load(-d[1], d[0], -1)
        else:
            b.apply_load(d[1], d[0], -2)
    b.solve_for_reaction_loads(*reactions)
    V = -b.shear_force()  # sympy's shear and moment are the negatives of calcpack's
    M = -b.bending_moment()
    out = {f"R{i}": float(b.reaction_loads[s]) for i, s in enumerate(reactions)}
    x = b.variable
    breaks = sorted(
        {0, *SPANS, *(d[0] for _, *d in LOADS), *(d[1] for k, *d in LOADS if k in ("w", "lin"))}
    )
    for name, expr in (("V", V), ("M", M)):
        vals = []
        for a, c in pairwise(breaks):
            mid = Rt(a + c, 2)
            poly = sympy.expand(
                expr.replace(
                    lambda e: isinstance(e, sympy.SingularityFunction),
                    lambda e, mid=mid: (
                        (x - e.args[1]) ** e.args[2] if (e.args[2] >= 0 and mid > e.args[1]) else 0
                    ),
                )
            )
            vals += [poly.subs(x, a), poly.subs(x, c)]
            if poly.has(x):
                for root in sympy.solve(sympy.diff(poly, x), x):
                    if root.is_real and a < root < c:
                        vals.append(poly.subs(x, root))
        out[f"{name}max"] = float(max(vals))
        out[f"{name}min"] = float(min(vals))
    return out


def _median_of(fn, runs: int) -> tuple[float, dict[str, float]]:
    times = []
    result: dict[str, float] = {}
    for _ in range(runs):
        t0 = time.perf_counter()
        result = fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times), result


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--rounds", type=int, default=7, help="reference runs (default 7)")
    parser.add_argument("--batch", type=int, default=60, help="calcpack runs per round")
    args = parser.parse_args()
    calcpack_run()  # warm imports
    beam = build_beam()
    t_cp: list[float] = []
    t_solve: list[float] = []
    t_sy: list[float] = []
    cp: dict[str, float] = {}
    sy: dict[str, float] = {}
    for _ in range(args.rounds):
        t, sy = _median_of(sympy_run, 1)
        t_sy.append(t)
        t, cp = _median_of(calcpack_run, args.batch)
        t_cp.append(t)
        t, _ = _median_of(lambda: calcpack_solve(beam), args.batch)
        t_solve.append(t)
    worst = 0.0
    for key, ref in sy.items():
        rel = abs(cp[key] - ref) / max(abs(ref), 1e-300)
        worst = max(worst, rel)
        print(f"  {key:5s} calcpack {cp[key]: .12e}  sympy {ref: .12e}  rel {rel:.1e}")
    print(f"  calcpack max deflection {cp['dmax'] * 1e3:.6f} mm (down)")
    R, B = args.rounds, args.batch
    med = statistics.median
    print(f"{R} rounds: one sympy run, then {B} calcpack runs of each kind (median per round)")
    print("                                          median of rounds   best round")
    rows = [
        ("calcpack, model built from quantities", t_cp),
        ("calcpack, solve and extremes only", t_solve),
        ("sympy (cache cleared)", t_sy),
    ]
    for label, ts in rows:
        print(f"{label:40s} {med(ts) * 1e3:9.3f} ms   {min(ts) * 1e3:9.3f} ms")
    for label, ts in rows[:2]:
        print(
            f"ratio, {label[10:]:30s} {med(t_sy) / med(ts):9.0f}x   {min(t_sy) / min(ts):9.0f}x"
            "   (target 300x)"
        )
    print(f"largest relative difference: {worst:.1e} (target 1e-9)")
    return 0 if worst <= 1e-9 else 1


if __name__ == "__main__":
    sys.exit(main())
