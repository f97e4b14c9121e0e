"""Beams checked against an independent reference library.

Source: SymPy 1.14, ``sympy.physics.continuum_mechanics.beam.Beam`` (singularity-function beam
solver, https://docs.sympy.org/latest/modules/physics/continuum_mechanics/beam.html).

Its conventions differ from calcpack's and are mapped here: sympy loads are positive upward
(calcpack's are positive downward), sympy couples are clockwise positive (as calcpack's), and
sympy's ``shear_force()`` and ``bending_moment()`` are the negatives of calcpack's V (left face
up +) and sagging-positive M. sympy's deflection is positive upward; calcpack's δ is positive
downward. The beams are given in exact rationals so sympy's answers are exact; calcpack works in
floats, so agreement is asked to 1e-9 relative (round-off of a small linear solve, far below
any engineering significance) with an absolute floor of 1e-9 × the largest value of the kind.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, field
from fractions import Fraction

import numpy as np
import pytest
import sympy
from sympy.physics.continuum_mechanics.beam import Beam as SymBeam

from calcpack.analysis.beam import Beam, Fixed, Hinge, Pin, Roller, solve_beam
from calcpack.loads import LinearLoad, PointLoad, PointMoment, PolynomialLoad, UniformLoad
from calcpack.units import Q_

RTOL = 1e-9  # float round-off against exact rationals (see module docstring)


@dataclass
class Spec:
    """A beam in plain numbers: N, m, N·m, N/m; loads downward +, couples clockwise +."""

    name: str
    L: float
    supports: list[tuple[str, float]]
    loads: list[tuple]
    hinges: list[float] = field(default_factory=list)
    EI: float = 2.0e7  # N·m²


def to_calcpack(spec: Spec) -> Beam:
    kinds = {"pin": Pin, "roller": Roller, "fixed": Fixed}
    loads = []
    for ld in spec.loads:
        kind = ld[0]
        if kind == "P":
            loads.append(PointLoad(x=Q_(ld[1], "m"), P=Q_(ld[2], "N")))
        elif kind == "C":
            loads.append(PointMoment(x=Q_(ld[1], "m"), C=Q_(ld[2], "N*m")))
        elif kind == "w":
            loads.append(UniformLoad(w=Q_(ld[3], "N/m"), start=Q_(ld[1], "m"), end=Q_(ld[2], "m")))
        elif kind == "lin":
            loads.append(
                LinearLoad(
                    w_start=Q_(ld[3], "N/m"),
                    w_end=Q_(ld[4], "N/m"),
                    start=Q_(ld[1], "m"),
                    end=Q_(ld[2], "m"),
                )
            )
        elif kind == "poly":
            coeffs = tuple(Q_(c, f"N/m**{k + 1}") for k, c in enumerate(ld[3]))
            loads.append(
                PolynomialLoad(coefficients=coeffs, start=Q_(ld[1], "m"), end=Q_(ld[2], "m"))
            )
    return Beam(
        length=Q_(spec.L, "m"),
        supports=[kinds[k](Q_(x, "m")) for k, x in spec.supports],
        hinges=[Hinge(Q_(x, "m")) for x in spec.hinges],
        loads=loads,
        EI=Q_(spec.EI, "N*m**2"),
    )


def R(v: float) -> sympy.Rational:
    return sympy.Rational(Fraction(v).limit_denominator(10**6))


def to_sympy(spec: Spec) -> tuple[SymBeam, dict]:
    b = SymBeam(R(spec.L), R(spec.EI), 1)
    reactions = {}
    for kind, x in spec.supports:
        out = b.apply_support(R(x), type=kind)
        if kind == "fixed":
            reactions[(x, "Fy")], reactions[(x, "C")] = out
        else:
            reactions[(x, "Fy")] = out
    for x in spec.hinges:
        b.apply_rotation_hinge(R(x))
    for ld in spec.loads:
        kind = ld[0]
        if kind == "P":
            b.apply_load(-R(ld[2]), R(ld[1]), -1)
        elif kind == "C":
            b.apply_load(R(ld[2]), R(ld[1]), -2)
        elif kind == "w":
            b.apply_load(-R(ld[3]), R(ld[1]), 0, end=R(ld[2]))
        elif kind in ("lin", "poly"):
            a, e = R(ld[1]), R(ld[2])
            if kind == "lin":
                coeffs = [R(ld[3]), (R(ld[4]) - R(ld[3])) / (e - a)]
            else:
                coeffs = [R(c) for c in ld[3]]
            for k, c in enumerate(coeffs):
                if c != 0:
                    b.apply_load(-c, a, k, end=e)
    b.solve_for_reaction_loads(*reactions.values())
    return b, reactions


SPECS = [
    Spec("simple span, full uniform", 8, [("pin", 0), ("roller", 8)], [("w", 0, 8, 5000)]),
    Spec("simple span, off-centre point", 6, [("pin", 0), ("roller", 6)], [("P", 2, 12000)]),
    Spec("simple span, partial uniform", 10, [("pin", 0), ("roller", 10)], [("w", 3, 7, 4000)]),
    Spec("simple span, triangular", 9, [("pin", 0), ("roller", 9)], [("lin", 0, 9, 0, 6000)]),
    Spec(
        "simple span, trapezoidal partial",
        9,
        [("pin", 0), ("roller", 9)],
        [("lin", 2, 8, 3000, 7000)],
    ),
    Spec("simple span, couple", 7, [("pin", 0), ("roller", 7)], [("C", 3, 15000)]),
    Spec(
        "overhang both ends",
        12,
        [("pin", 2), ("roller", 9)],
        [("w", 0, 12, 3000), ("P", 0, 5000), ("P", 12, 4000)],
    ),
    Spec(
        "overhang right with couple",
        10,
        [("pin", 0), ("roller", 7)],
        [("w", 0, 7, 6000), ("P", 10, 8000), ("C", 5, -9000)],
    ),
    Spec("cantilever, uniform", 4, [("fixed", 0)], [("w", 0, 4, 5000)]),
    Spec("cantilever, tip point and couple", 3, [("fixed", 0)], [("P", 3, 7000), ("C", 3, 2000)]),
    Spec("cantilever fixed at right, triangular", 5, [("fixed", 5)], [("lin", 0, 5, 4000, 0)]),
    Spec("propped cantilever, uniform", 8, [("fixed", 0), ("roller", 8)], [("w", 0, 8, 10000)]),
    Spec(
        "propped cantilever, point and partial",
        7,
        [("fixed", 0), ("roller", 7)],
        [("P", 2, 9000), ("w", 4, 7, 3000)],
    ),
    Spec("fixed-fixed, uniform", 6, [("fixed", 0), ("fixed", 6)], [("w", 0, 6, 12000)]),
    Spec(
        "fixed-fixed, point and couple",
        8,
        [("fixed", 0), ("fixed", 8)],
        [("P", 3, 20000), ("C", 6, 5000)],
    ),
    Spec(
        "two equal spans, uniform",
        12,
        [("pin", 0), ("roller", 6), ("roller", 12)],
        [("w", 0, 12, 10000)],
    ),
    Spec(
        "three spans, mixed",
        18,
        [("pin", 0), ("roller", 5), ("roller", 12), ("roller", 18)],
        [("w", 0, 18, 2000), ("P", 8, 15000), ("lin", 12, 18, 0, 6000), ("C", 2, 4000)],
    ),
    Spec(
        "continuous with overhang",
        14,
        [("pin", 0), ("roller", 6), ("roller", 12)],
        [("w", 0, 14, 4000), ("P", 14, 6000)],
    ),
    Spec(
        "fixed and two rollers",
        13,
        [("fixed", 0), ("roller", 6), ("roller", 13)],
        [("w", 2, 11, 5000), ("P", 9, 10000)],
    ),
    Spec(
        "cantilever with hinge and prop",
        12,
        [("fixed", 0), ("roller", 12)],
        [("w", 0, 12, 3000), ("P", 6, 8000)],
        hinges=[4],
    ),
    Spec(
        "Gerber beam, two hinges",
        20,
        [("pin", 0), ("roller", 6), ("roller", 14), ("roller", 20)],
        [("w", 0, 20, 2500), ("P", 10, 12000)],
        hinges=[8, 12],
    ),
    Spec(
        "indeterminate with hinge",
        15,
        [("fixed", 0), ("roller", 8), ("fixed", 15)],
        [("w", 0, 15, 3000), ("C", 11, 6000)],
        hinges=[5],
    ),
    Spec(
        "polynomial load, simple span",
        6,
        [("pin", 0), ("roller", 6)],
        [("poly", 0, 6, [1000, 500, -60])],
    ),
    Spec(
        "polynomial partial on propped cantilever",
        9,
        [("fixed", 0), ("roller", 9)],
        [("poly", 1, 7, [2000, 0, 100])],
    ),
    Spec(
        "point load at a support and overhang",
        10,
        [("roller", 0), ("pin", 8)],
        [("P", 8, 7000), ("P", 4, 3000), ("w", 8, 10, 2000)],
    ),
]


@pytest.fixture(scope="module", params=SPECS, ids=[s.name for s in SPECS])
def pair(request):
    spec = request.param
    sym, reactions = to_sympy(spec)
    return spec, solve_beam(to_calcpack(spec)), sym, reactions


def _close(a: float, b: float, scale: float) -> bool:
    return abs(a - b) <= RTOL * max(abs(b), scale)


def _sympy_at(expr, x: float) -> float:
    xs = sympy.Symbol("x")
    return float(expr.subs(xs, R(x)).evalf(30))


def test_reactions(pair):
    spec, res, sym, reactions = pair
    scale = max(abs(float(v)) for v in sym.reaction_loads.values())
    for (x, comp), symbol in reactions.items():
        ref = float(sym.reaction_loads[symbol])
        name = next(s.name for s in res.beam.supports if abs(s.x_m - x) < 1e-12)
        got = res.reaction(name)
        mine = got.Fy.to("N").magnitude if comp == "Fy" else got.C.to("N*m").magnitude
        # sympy's reaction moment: clockwise positive, as calcpack's
        assert _close(mine, ref, scale), (spec.name, name, comp, mine, ref)


def _points(spec: Spec) -> np.ndarray:
    return np.array([0.37 * spec.L, 0.5 * spec.L + 0.013, 0.81 * spec.L, 0.05 * spec.L])


def test_shear_and_moment_at_points(pair):
    spec, res, sym, _ = pair
    xs = _points(spec)
    V = res.shear(Q_(xs, "m")).to("N").magnitude
    M = res.moment(Q_(xs, "m")).to("N*m").magnitude
    Vref = np.array([-_sympy_at(sym.shear_force(), x) for x in xs])  # sympy: −V
    Mref = np.array([-_sympy_at(sym.bending_moment(), x) for x in xs])  # sympy: −M
    sV = max(np.max(np.abs(Vref)), 1.0)
    sM = max(np.max(np.abs(Mref)), 1.0)
    for i in range(len(xs)):
        assert _close(V[i], Vref[i], sV), (spec.name, xs[i], V[i], Vref[i])
        assert _close(M[i], Mref[i], sM), (spec.name, xs[i], M[i], Mref[i])


def test_deflection_and_slope_at_points(pair):
    spec, res, sym, _ = pair
    xs = _points(spec)
    d = res.deflection(Q_(xs, "m")).to("m").magnitude
    ref = np.array([-_sympy_at(sym.deflection(), x) for x in xs])  # sympy: upward +
    scale = max(np.max(np.abs(ref)), 1e-12)
    th = res.slope(Q_(xs, "m")).to("rad").magnitude
    th_ref = np.array([_sympy_at(sym.slope(), x) for x in xs])
    tscale = max(np.max(np.abs(th_ref)), 1e-12)
    for i in range(len(xs)):
        assert _close(d[i], ref[i], scale), (spec.name, xs[i], d[i], ref[i])
        assert _close(th[i], th_ref[i], tscale), (spec.name, xs[i], th[i], th_ref[i])


def _segment_extremes(spec: Spec, expr, res) -> tuple[float, float]:
    """Max and min of a sympy piecewise expression: turning points solved segment by segment,
    plus both sides of every breakpoint (the reference method of the benchmark)."""
    xs = sympy.Symbol("x")
    X = res.core.X
    vals = []
    for a, b in itertools.pairwise(X):
        mid = R((a + b) / 2)
        # On (a, b) every singularity function is a plain polynomial: evaluate them there.
        poly = expr.replace(
            lambda e: isinstance(e, sympy.SingularityFunction),
            lambda e, mid=mid: (
                (xs - e.args[1]) ** e.args[2] if (e.args[2] >= 0 and mid > e.args[1]) else 0
            ),
        )
        poly = sympy.expand(poly)
        for x0 in (a, b):
            vals.append(float(poly.subs(xs, R(x0))))
        for root in sympy.Poly(sympy.diff(poly, xs), xs).real_roots() if poly.has(xs) else []:
            r = float(root)
            if a < r < b:
                vals.append(float(poly.subs(xs, root).evalf(30)))
    return max(vals), min(vals)


def test_moment_and_shear_extremes(pair):
    spec, res, sym, _ = pair
    e = res.extremes
    Mmax, Mmin = _segment_extremes(spec, -sym.bending_moment(), res)
    Vmax, Vmin = _segment_extremes(spec, -sym.shear_force(), res)
    sM = max(abs(Mmax), abs(Mmin))
    sV = max(abs(Vmax), abs(Vmin))
    assert _close(e.M_max.value.to("N*m").magnitude, Mmax, sM), spec.name
    assert _close(e.M_min.value.to("N*m").magnitude, Mmin, sM), spec.name
    assert _close(e.V_max.value.to("N").magnitude, Vmax, sV), spec.name
    assert _close(e.V_min.value.to("N").magnitude, Vmin, sV), spec.name


def test_deflection_extremes(pair):
    spec, res, sym, _ = pair
    e = res.extremes
    vmax, vmin = _segment_extremes(spec, sym.deflection(), res)  # upward +
    scale = max(abs(vmax), abs(vmin))
    down = e.deflection_down.value.to("m").magnitude if e.deflection_down else 0.0
    up = e.deflection_up.value.to("m").magnitude if e.deflection_up else 0.0
    assert _close(down, max(-vmin, 0.0), scale), spec.name
    assert _close(up, max(vmax, 0.0), scale), spec.name


def test_at_least_twenty_beams():
    assert len(SPECS) >= 20
