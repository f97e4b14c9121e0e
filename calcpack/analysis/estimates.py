"""Quick estimates for the checker: beam-table formulas, tributary reactions, the method of
sections at a cut, and the statical moment of a span -- each labelled as an estimate with its
known error.

These are the checker's independent means (see ``Sheet.verify``): short closed forms that need
no model, to compare with the preparer's analysis. Every function returns a frozen
:class:`Estimate` (quantities, the formula in words, the source and the known error); its
``working()`` shows formula -> substitution -> result on a sheet.

Sources: the beam cases are those of AISC Steel Construction Manual, Part 3, Table 3-23
"Shears, Moments and Deflections" (simple, cantilever, fixed at one end and supported at the
other, fixed at both ends; uniform and central or end point load). Continuous equal spans
under a uniform load on every span are solved exactly by the three-moment equation (the
Table's two- and three-span coefficients are its results). Sign conventions: loads downward
positive; moments sagging positive, hogging (over supports) reported as positive magnitudes
named ``M_support``; deflections downward positive.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Literal

import numpy as np
import pint

from calcpack.errors import InputError, OutOfScopeError
from calcpack.validate import at_least, dimension, find, one_of, positive, whole

__all__ = [
    "BEAM_CASES",
    "Estimate",
    "beam_table",
    "continuous_equal_spans",
    "section_cut",
    "statical_moment",
    "tributary_reactions",
]

BeamCase = Literal[
    "simple uniform",
    "simple central point",
    "cantilever uniform",
    "cantilever end point",
    "propped uniform",
    "fixed uniform",
]
BEAM_CASES: tuple[str, ...] = BeamCase.__args__  # type: ignore[attr-defined]

TABLE = "AISC Steel Construction Manual, Table 3-23"
_CASE_WORDS = {
    "simple uniform": "simple beam, uniform load",
    "simple central point": "simple beam, point load at midspan",
    "cantilever uniform": "cantilever, uniform load",
    "cantilever end point": "cantilever, point load at the free end",
    "propped uniform": "beam fixed at one end, supported at the other, uniform load",
    "fixed uniform": "beam fixed at both ends, uniform load",
}
IDEAL = (
    "exact for the idealised beam (prismatic, linear elastic, supports and load as drawn); "
    "the estimate is as good as that idealisation"
)


@dataclass(frozen=True)
class Estimate:
    """A checker's estimate: named results, how they were found and how far to trust them.

    Attributes:
        method: the case or method in words (``"simple beam, uniform load"``).
        results: name -> quantity (``"M_max"``, ``"V_max"``, ``"delta_max"``, ``"R_A"`` ...).
        formulas: name -> the formula in words (``"w·L²/8"``).
        source: where the formula comes from.
        known_error: what the estimate leaves out and how large that can be.
        inputs: name -> quantity given.
    """

    method: str
    results: dict[str, pint.Quantity]
    formulas: dict[str, str]
    source: str
    known_error: str
    inputs: dict[str, pint.Quantity] = field(default_factory=dict)

    def __getitem__(self, name: str) -> pint.Quantity:
        return find("name", name, self.results, what="result", where=f"of {self.method!r}")

    def working(self, settings: Any = None) -> Any:
        """The estimate as sheet steps: a heading, the inputs, each result with its formula,
        and the known error as a caution."""
        from calcpack.working import Block, Caution, Given, Heading, Table

        steps: list[Any] = [Heading(f"Estimate: {self.method}", 3)]
        steps += [
            Given(k, v, "", source="input", settings=settings) for k, v in self.inputs.items()
        ]
        rows = [[_symbol(k), self.formulas.get(k, ""), v] for k, v in self.results.items()]
        steps.append(
            Table(["Result", "Formula", "Estimate"], rows, caption=self.source, settings=settings)
        )
        steps.append(Caution(f"Estimate, not an analysis: {self.known_error}."))
        return Block(steps=steps, title=None)


def _symbol(name: str) -> str:
    """``"delta_max"`` -> ``"$\\Delta_{max}$"``, ``"M_support"`` -> ``"$M_{support}$"``."""
    head, _, tail = name.partition("_")
    head = {"delta": "\\Delta", "theta": "\\theta"}.get(head, head)
    return f"${head}_{{{tail}}}$" if tail else f"${head}$"


def _w(w: Any) -> pint.Quantity:
    q = dimension("w", w, "[force]/[length]")
    return positive("w", q)


def _len(name: str, value: Any) -> pint.Quantity:
    return positive(name, dimension(name, value, "[length]"))


def beam_table(
    case: BeamCase,
    *,
    L: pint.Quantity,
    w: pint.Quantity | None = None,
    P: pint.Quantity | None = None,
    EI: pint.Quantity | None = None,
) -> Estimate:
    """Beam-table formulas for a single span (AISC Manual Table 3-23 cases).

    Args:
        case: one of :data:`BEAM_CASES`.
        L: span (length).
        w: uniform load (force/length) for the uniform cases; P: point load for the others.
        EI: flexural stiffness (force·length²), for the deflection; omit to skip it.

    Raises:
        InputError: unknown case, the wrong or a missing load, a non-positive input.
    """
    one_of("case", str(case), BEAM_CASES)
    L = _len("L", L)
    uniform = case.endswith("uniform")
    if uniform and (w is None or P is not None):
        raise InputError(
            f"Case {case!r} takes a uniform load w and no P (got w = {w}, P = {P})",
            name="w",
            value=w,
            expected="w as force per length",
        )
    if not uniform and (P is None or w is not None):
        raise InputError(
            f"Case {case!r} takes a point load P and no w (got w = {w}, P = {P})",
            name="P",
            value=P,
            expected="P as a force",
        )
    EIq = None if EI is None else positive("EI", dimension("EI", EI, "[force]*[length]**2"))
    inputs: dict[str, pint.Quantity] = {"L": L}
    if uniform:
        W = _w(w)
        inputs["w"] = W
        total = W * L
    else:
        F = positive("P", dimension("P", P, "[force]"))
        inputs["P"] = F
    r: dict[str, pint.Quantity] = {}
    f: dict[str, str] = {}

    def put(name: str, value: pint.Quantity, words: str) -> None:
        r[name] = value
        f[name] = words

    # deflection coefficient and power of L (None: no deflection for this case)
    if case == "simple uniform":
        put("M_max", total * L / 8, "w·L²/8 at midspan")
        put("V_max", total / 2, "w·L/2")
        put("R_A", total / 2, "w·L/2")
        defl = (5 * W * L**4 / 384, "5·w·L⁴/(384·EI)")
    elif case == "simple central point":
        put("M_max", F * L / 4, "P·L/4 at midspan")
        put("V_max", F / 2, "P/2")
        put("R_A", F / 2, "P/2")
        defl = (F * L**3 / 48, "P·L³/(48·EI)")
    elif case == "cantilever uniform":
        put("M_max", total * L / 2, "w·L²/2 at the fixed end")
        put("V_max", total, "w·L")
        put("R_A", total, "w·L")
        defl = (W * L**4 / 8, "w·L⁴/(8·EI) at the free end")
    elif case == "cantilever end point":
        put("M_max", F * L, "P·L at the fixed end")
        put("V_max", F, "P")
        put("R_A", F, "P")
        defl = (F * L**3 / 3, "P·L³/(3·EI) at the free end")
    elif case == "propped uniform":
        put("M_support", total * L / 8, "w·L²/8 at the fixed end")
        put("M_max", 9 * total * L / 128, "9·w·L²/128 at 3L/8 from the prop")
        put("V_max", 5 * total / 8, "5·w·L/8 at the fixed end")
        put("R_A", 5 * total / 8, "5·w·L/8 (fixed end)")
        put("R_B", 3 * total / 8, "3·w·L/8 (prop)")
        defl = (W * L**4 / 185, "w·L⁴/(185·EI) at 0.4215·L from the prop (coefficient rounded)")
    else:  # fixed uniform
        put("M_support", total * L / 12, "w·L²/12 at each end")
        put("M_max", total * L / 24, "w·L²/24 at midspan")
        put("V_max", total / 2, "w·L/2")
        put("R_A", total / 2, "w·L/2")
        defl = (W * L**4 / 384, "w·L⁴/(384·EI) at midspan")
    if EIq is not None:
        inputs["EI"] = EIq
        put("delta_max", (defl[0] / EIq).to_reduced_units(), defl[1])
    error = IDEAL
    if case == "propped uniform":
        error += "; the table's 185 is 1/0.005416 rounded (0.1 % on the deflection)"
    return Estimate(_CASE_WORDS[case], r, f, TABLE, error, inputs)


def _three_moment(n: int) -> np.ndarray:
    """Support moment coefficients (×wL², hogging positive) of n equal spans, all loaded."""
    if n == 1:
        return np.zeros(2)
    # M_{i-1} + 4 M_i + M_{i+1} = w L^2 / 2 at each interior support (equal spans, EI const)
    a = np.zeros((n - 1, n - 1))
    for i in range(n - 1):
        a[i, i] = 4.0
        if i > 0:
            a[i, i - 1] = 1.0
        if i < n - 2:
            a[i, i + 1] = 1.0
    inner = np.linalg.solve(a, np.full(n - 1, 0.5))
    return np.concatenate([[0.0], inner, [0.0]])


def continuous_equal_spans(*, n: int, L: pint.Quantity, w: pint.Quantity) -> Estimate:
    """Continuous beam of ``n`` equal spans, uniform load on every span, ends pinned.

    Solved exactly by the three-moment equation (prismatic, rigid supports). Results:
    ``M_support`` (largest hogging moment, at the first interior support), ``M_max`` (largest
    sagging moment, in an end span), ``R_end``, ``R_interior`` (the largest interior reaction),
    ``V_max``.

    Raises:
        InputError: n not an integer from 1 to 20, or a non-positive load or span.
    """
    whole("n", n, 1, 20)
    L = _len("L", L)
    W = _w(w)
    m = _three_moment(n)
    # span i: reactions at its ends from statics, moments sagging along it
    reactions = np.zeros(n + 1)
    sag = 0.0
    shear = 0.0
    for i in range(n):
        ml, mr = m[i], m[i + 1]
        left = 0.5 + (ml - mr)  # ×wL: end shear at the left of the span (hogging positive)
        right = 1.0 - left
        reactions[i] += left
        reactions[i + 1] += right
        shear = max(shear, left, right)
        x = left  # ×L: where the shear is zero
        sag = max(sag, left * x - x * x / 2 - ml)
    total = W * L
    r = {
        "M_support": float(m.max()) * total * L,
        "M_max": sag * total * L,
        "R_end": float(reactions[0]) * total,
        "R_interior": float(reactions[1:-1].max()) * total if n > 1 else 0 * total,
        "V_max": shear * total,
    }
    coeff = {
        k: (v / (total * (L if k.startswith("M") else 1))).to("").magnitude for k, v in r.items()
    }
    f = {
        "M_support": f"{coeff['M_support']:.4f}·w·L² (three-moment equation)",
        "M_max": f"{coeff['M_max']:.4f}·w·L²",
        "R_end": f"{coeff['R_end']:.4f}·w·L",
        "R_interior": f"{coeff['R_interior']:.4f}·w·L",
        "V_max": f"{coeff['V_max']:.4f}·w·L",
    }
    error = (
        "exact for equal prismatic spans on rigid supports with the load on every span; "
        "pattern loading (live load on alternate spans) raises the span moments and some "
        "reactions above these values, and unequal spans or stiffnesses change them"
    )
    return Estimate(
        f"continuous beam, {n} equal spans, uniform load on all spans",
        r,
        f,
        "three-moment equation; " + TABLE + " (two and three equal spans)",
        error,
        {"L": L, "w": W},
    )


def tributary_reactions(
    *, w: pint.Quantity, spans: list[pint.Quantity] | tuple[pint.Quantity, ...]
) -> Estimate:
    """Reactions by tributary length: each support carries half of each span beside it.

    Args:
        w: uniform load (force/length); spans: the span lengths, in order.

    The known error is continuity: exact for simple spans; for continuous equal spans under a
    uniform load the first interior reaction is 25 % (two spans: 1.25·w·L against w·L) above
    the tributary value and the end reactions 25 % below (0.375·w·L against 0.5·w·L).
    """
    W = _w(w)
    at_least("spans", spans, what="span length")
    lengths = [_len(f"spans[{i}]", s) for i, s in enumerate(spans)]
    r: dict[str, pint.Quantity] = {}
    f: dict[str, str] = {}
    for i in range(len(lengths) + 1):
        left = lengths[i - 1] / 2 if i > 0 else 0 * lengths[0]
        right = lengths[i] / 2 if i < len(lengths) else 0 * lengths[0]
        r[f"R_{i + 1}"] = W * (left + right)
        f[f"R_{i + 1}"] = "w·(L_left + L_right)/2"
    error = (
        "exact for simple spans; ignores continuity, which for continuous equal spans under "
        "uniform load puts up to 25 % more on the first interior support and 25 % less on the "
        "end supports (two spans: 1.25·w·L and 0.375·w·L against w·L and 0.5·w·L)"
    )
    inputs = {"w": W, **{f"L_{i + 1}": s for i, s in enumerate(lengths)}}
    return Estimate("reactions by tributary length", r, f, "statics of simple spans", error, inputs)


def statical_moment(
    *,
    w: pint.Quantity,
    L: pint.Quantity,
    M_left: pint.Quantity | None = None,
    M_right: pint.Quantity | None = None,
) -> Estimate:
    """The free (simple-span) moment M_0 = w·L²/8 of a uniformly loaded span, and with the end
    moments (hogging positive) the midspan moment they leave: M_mid = M_0 - (M_left+M_right)/2.

    Statics, exact for any end restraint: the midspan sagging moment plus the mean of the end
    hogging moments equals w·L²/8. So w·L²/8 bounds the sagging moment (ends restrained), and
    the larger of sagging and mean hogging moment is at least w·L²/16.
    """
    W = _w(w)
    L = _len("L", L)
    M0 = W * L**2 / 8
    r = {"M_0": M0}
    f = {"M_0": "w·L²/8 (free moment, upper bound of the sagging moment)"}
    inputs = {"w": W, "L": L}
    if (M_left is None) != (M_right is None):
        raise InputError(
            "Give both end moments M_left and M_right, or neither",
            name="M_left" if M_left is None else "M_right",
            value=None,
            expected="a moment (hogging positive)",
        )
    if M_left is not None and M_right is not None:
        ml = dimension("M_left", M_left, "[force]*[length]")
        mr = dimension("M_right", M_right, "[force]*[length]")
        if ml.magnitude < 0 or mr.magnitude < 0:
            raise OutOfScopeError(
                f"End moments are taken hogging positive; a sagging end moment (got M_left = "
                f"{ml:~P}, M_right = {mr:~P}) is outside this check"
            )
        inputs |= {"M_left": ml, "M_right": mr}
        r["M_mid"] = (M0 - (ml + mr) / 2).to(M0.units)
        f["M_mid"] = "w·L²/8 − (M_left + M_right)/2"
    return Estimate(
        "statical moment of a uniformly loaded span",
        r,
        f,
        "statics (equilibrium of the span as a free body)",
        "exact statics for a uniform load; the end moments are the preparer's (their error "
        "carries over)",
        inputs,
    )


def section_cut(
    *,
    M: pint.Quantity,
    V: pint.Quantity,
    depth: pint.Quantity,
    diagonal_angle: pint.Quantity | None = None,
) -> Estimate:
    """Truss member forces by the method of sections at a cut through a parallel-chord panel.

    Args:
        M: bending moment at the cut of the truss taken as a beam (statics of the whole
            truss: the reactions and the loads on one side), sagging positive.
        V: shear at the cut (the same beam analogy).
        depth: distance between the chord centre lines at the cut.
        diagonal_angle: angle of the diagonal cut with the chords (omit with no diagonal).

    Results: ``F_chord`` = M/depth (top chord in compression, bottom in tension for sagging M)
    and ``F_diagonal`` = V/sin θ.

    Known error: exact for a statically determinate truss with pinned joints, loads at the
    joints and the cut through three members with parallel chords; for sloping chords it
    ignores the chords' share of the shear (use the depth at the moment centre).
    """
    Mq = dimension("M", M, "[force]*[length]")
    Vq = dimension("V", V, "[force]")
    h = _len("depth", depth)
    r = {"F_chord": (Mq / h).to(Vq.units)}
    f = {"F_chord": "M/h (top chord compression, bottom chord tension for sagging M)"}
    inputs = {"M": Mq, "V": Vq, "h": h}
    if diagonal_angle is not None:
        theta = dimension("diagonal_angle", diagonal_angle, "[]").to("radian")
        s = float(np.sin(theta.magnitude))
        if not 0.05 < s <= 1.0:
            raise InputError(
                f"The diagonal's angle with the chords must be between about 3° and 90° "
                f"(got diagonal_angle = {diagonal_angle:~P})",
                name="diagonal_angle",
                value=diagonal_angle,
                expected="an angle between 3° and 90°",
            )
        inputs["theta"] = theta.to("degree")
        r["F_diagonal"] = Vq / s
        f["F_diagonal"] = "V/sin θ"
    return Estimate(
        "method of sections, parallel chords",
        r,
        f,
        "statics of the part of the truss on one side of the cut",
        "exact for a determinate pin-jointed truss with joint loads and parallel chords; "
        "sloping chords carry part of the shear, so V/sin θ is then only an estimate",
        inputs,
    )
