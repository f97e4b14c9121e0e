"""Numeric core of the beam solver: exact piecewise polynomials in SI floats.

Method (exact for polynomial loads). The beam is cut at every breakpoint (ends, supports,
hinges, point actions, ends of distributed loads, changes of EI). On each segment the line load
w is a polynomial in the local coordinate ξ = x − x_j, and

    dV/dx = −w,   dM/dx = V,   dθ/dx = M/EI,   dv/dx = θ        (v upward, θ counter-clockwise)

are integrated term by term, with jumps at breakpoints: V jumps by the upward point force, M by
the clockwise couple, θ by the hinge rotation. The unknowns -- the reaction components, the hinge
rotations, and θ and v at x = 0 -- enter all four functions linearly, so each is integrated once
for the loads and once per unknown (vectorised over that batch), and the unknowns follow from
one square linear system:

* equilibrium of the whole beam: V(L⁺) = 0 and M(L⁺) = 0;
* each hinge: M = 0;
* each support: v = 0 (or v = −R/k on a spring) and, where rotation is restrained, θ = 0 (or
  θ = C/k_θ) -- the compatibility conditions.

This is the compatibility (integration) form of the flexibility method. Without EI, a
determinate beam is solved from the equilibrium and hinge equations alone.
"""

from __future__ import annotations

import bisect
from collections.abc import Sequence
from dataclasses import dataclass
from typing import NamedTuple

import numpy as np

from calcpack.validate import one_of

__all__ = [
    "SIBeam",
    "SIResult",
    "Unknown",
    "evaluate",
    "integrate",
    "refine",
    "shift_polynomial",
    "shift_rows",
    "solve_si",
]


class Unknown(NamedTuple):
    """One unknown of the linear system: ``kind`` in {"R", "C", "hinge", "theta0", "v0"}."""

    kind: str
    node: int  # breakpoint index
    owner: str  # support or hinge name ("" for theta0, v0)
    flexibility: float = 0.0  # 1/k or 1/k_theta for springs (m/N or 1/(N·m))


@dataclass(frozen=True)
class SIBeam:
    """The beam in SI, as the core reads it.

    Attributes:
        L_m: length. supports: (name, x_m, restrains_v, restrains_rotation, 1/k or 0,
            1/k_theta or 0, restrains_h). hinges: (name, x_m). pieces: (a, b, coeffs) line
            loads N/m downward. points: (x, P down N, H N, C cw N·m). EI: (a, b, EI N·m²) or
            None. EA_uniform: True (only the distribution of EA matters).
    """

    L_m: float
    supports: tuple[tuple[str, float, bool, bool, float, float, bool], ...]
    hinges: tuple[tuple[str, float], ...]
    pieces: tuple[tuple[float, float, tuple[float, ...]], ...]
    points: tuple[tuple[float, float, float, float], ...]
    EI: tuple[tuple[float, float, float], ...] | None


@dataclass(frozen=True, eq=False)
class SIResult:
    """Piecewise polynomials on the breakpoints ``X`` (n+1 values, n segments).

    ``w, V, M, T, v`` have shape (n, K): ascending coefficients in ξ = x − X[j] on segment j
    (w in N/m down +, V in N, M in N·m sagging +, T = θ in rad ccw +, v in m upward +;
    T and v are None without EI). ``N`` (n,) is the axial force on each segment (tension +).
    ``reactions`` maps (support name, component) -> value, component in {"Fy", "Fx", "C"}.
    ``hinge_rotation`` maps a hinge name to its rotation jump θ⁺ − θ⁻ (rad).
    """

    X: np.ndarray
    w: np.ndarray
    V: np.ndarray
    M: np.ndarray
    T: np.ndarray | None
    v: np.ndarray | None
    N: np.ndarray
    reactions: dict[tuple[str, str], float]
    hinge_rotation: dict[str, float]


def _powers(h: np.ndarray, K: int) -> np.ndarray:
    return np.asarray(h[:, None] ** np.arange(K)[None, :], dtype=float)


_INV_K: dict[int, np.ndarray] = {}


def _inverse_orders(K: int) -> np.ndarray:
    """1/k for k = 1..K−1 (the factors of term-by-term integration)."""
    inv = _INV_K.get(K)
    if inv is None:
        inv = 1.0 / np.arange(1, K)
        _INV_K[K] = inv
    return inv


def _integrate(
    f: np.ndarray, start: np.ndarray | None, jumps: np.ndarray | None, sign: float, hq: np.ndarray
) -> tuple[np.ndarray, np.ndarray]:
    """Integrate piecewise polynomials batch-wise; also return each segment's end value.

    Args:
        f: (B, n, K) coefficients of the derivative; the top coefficient must be zero.
        start: (B,) value before x = 0, or None for zero. jumps: (B, n+1) jump of g at each
            breakpoint (the last is not included in the segments), or None for none.
        sign: g' = sign·f. hq: (n, K−1) h^k / k for k = 1..K−1.
    Returns:
        ((B, n, K) coefficients of g, (B, n) values of g at the segment ends).
    """
    n = f.shape[1]
    head = f[..., :-1]
    tail = (head * hq).sum(axis=-1)  # ∫ f over each segment
    if sign != 1.0:
        tail = sign * tail
    increments = np.zeros(tail.shape) if jumps is None else jumps[:, :n].copy()
    increments[:, 1:] += tail[:, :-1]
    g0 = np.add.accumulate(increments, axis=1)
    if start is not None:
        g0 += start[:, None]
    g = np.empty(f.shape)
    g[..., 0] = g0
    g[..., 1:] = head * (sign * _inverse_orders(f.shape[2]))
    return g, g0 + tail


def integrate(
    f: np.ndarray,
    h: np.ndarray,
    start: np.ndarray,
    jumps: np.ndarray,
    sign: float = 1.0,
    powers: np.ndarray | None = None,
) -> np.ndarray:
    """Integrate piecewise polynomials batch-wise: g' = sign·f, g(0⁻) = start, jumps at nodes.

    Args:
        f: (B, n, K) coefficients of the derivative; the top coefficient must be zero.
        h: (n,) segment lengths. start: (B,) value before x = 0. jumps: (B, n+1) jump of g at
            each breakpoint (the jump at the last node is not included in the segments).
        powers: h^k (n, K), if already made.
    Returns:
        (B, n, K) coefficients of g.
    """
    K = f.shape[2]
    hp = _powers(h, K) if powers is None else powers
    return _integrate(f, start, jumps, sign, hp[:, 1:] * _inverse_orders(K))[0]


def evaluate(X: np.ndarray, g: np.ndarray, x: np.ndarray, side: str = "right") -> np.ndarray:
    """Evaluate piecewise polynomial ``g`` (n, K) at positions ``x`` (m).

    At a breakpoint, ``side="right"`` gives the value just to the right, ``"left"`` just to the
    left. At the beam ends both give the value inside the beam.
    """
    n = g.shape[0]
    one_of("side", side, ("left", "right"))
    seg = np.searchsorted(X, x, side="right" if side == "right" else "left") - 1
    seg = np.clip(seg, 0, n - 1)
    xi = x - X[seg]
    coeffs = g[seg]
    out = np.zeros_like(xi, dtype=float)
    for k in range(g.shape[1] - 1, -1, -1):
        out = out * xi + coeffs[..., k]
    return out


_BINOM: dict[int, tuple[np.ndarray, np.ndarray]] = {}


def _binomials(K: int) -> tuple[np.ndarray, np.ndarray]:
    if K not in _BINOM:
        from math import comb

        i = np.arange(K)[:, None]
        k = np.arange(K)[None, :]
        C = np.array([[comb(a, b) if a >= b else 0 for b in range(K)] for a in range(K)], float)
        _BINOM[K] = (C, np.clip(i - k, 0, None))
    return _BINOM[K]


def shift_rows(c: np.ndarray, s: np.ndarray) -> np.ndarray:
    """Coefficients of p(ξ + s) for each row of c (ascending), s per row (binomial expansion)."""
    C, e = _binomials(c.shape[-1])
    s_pow = np.asarray(s, dtype=float)[:, None] ** np.arange(c.shape[-1])[None, :]
    spow = s_pow[:, e]  # s^(i-k), gathered rather than recomputed
    return np.asarray(np.einsum("mi,ik,mik->mk", c, C, spow), dtype=float)


def shift_polynomial(coeffs: Sequence[float], s: float) -> tuple[float, ...]:
    """Coefficients (ascending) of p(ξ + s) for one polynomial p: the Taylor shift used by the
    solver (:func:`shift_rows`), for callers that move a single load piece's origin."""
    if not len(coeffs):
        return ()
    row = shift_rows(np.asarray([coeffs], dtype=float), np.asarray([s], dtype=float))[0]
    return tuple(float(v) for v in row)


def refine(X: np.ndarray, g: np.ndarray, Xnew: np.ndarray, K: int) -> np.ndarray:
    """Re-express piecewise polynomial ``g`` on breakpoints X on the finer breakpoints Xnew."""
    seg = np.clip(np.searchsorted(X, Xnew[:-1], side="right") - 1, 0, g.shape[0] - 1)
    c = np.zeros((len(Xnew) - 1, K))
    c[:, : g.shape[1]] = g[seg]
    return shift_rows(c, Xnew[:-1] - X[seg])


def _breakpoints(beam: SIBeam) -> list[float]:
    xs = [0.0, beam.L_m]
    xs += [s[1] for s in beam.supports]
    xs += [h[1] for h in beam.hinges]
    xs += [p[0] for p in beam.points]
    for a, b, _ in beam.pieces:
        xs += [a, b]
    if beam.EI is not None:
        for a, b, _ in beam.EI:
            xs += [a, b]
    L = beam.L_m
    tol = 1e-9 * L
    merged: list[float] = []
    last = -np.inf
    for x in sorted(set(xs)):  # plain Python: a few dozen values
        x = 0.0 if x < 0.0 else (L if x > L else x)
        if x - last > tol:
            merged.append(x)
            last = x
    merged[-1] = L  # an end within the tolerance of L is L
    return merged


def _node(X: list[float], x: float) -> int:
    """Index of the breakpoint nearest x (positions were merged to the breakpoints)."""
    i = bisect.bisect_left(X, x)
    if i == 0:
        return 0
    if i >= len(X):
        return len(X) - 1
    return i if X[i] - x < x - X[i - 1] else i - 1


def _line_load(beam: SIBeam, X: np.ndarray, Xl: list[float], K: int) -> np.ndarray:
    """(n, K) line load on each segment, N/m down +: each piece's polynomial shifted to the
    start of every segment it covers, summed."""
    n = len(Xl) - 1
    w = np.zeros((n, K))
    general: list[tuple[int, int, float, tuple[float, ...]]] = []
    for a, b, coeffs in beam.pieces:
        i, j = _node(Xl, a), _node(Xl, b)
        if j <= i:
            continue
        if len(coeffs) == 1:  # uniform: the same on every segment
            w[i:j, 0] += coeffs[0]
        elif len(coeffs) == 2:  # linear: w(ξ + s) = (c0 + c1·s) + c1·ξ
            c0, c1 = coeffs
            w[i:j, 0] += c0 + c1 * (X[i:j] - a)
            w[i:j, 1] += c1
        else:
            general.append((i, j, a, coeffs))
    if general:
        seg = np.concatenate([np.arange(i, j) for i, j, _, _ in general])
        a_of = np.concatenate([np.full(j - i, a) for i, j, a, _ in general])
        coef = np.zeros((seg.size, K))
        row = 0
        for i, j, _, c in general:
            coef[row : row + j - i, : len(c)] = c
            row += j - i
        np.add.at(w, seg, shift_rows(coef, X[seg] - a_of))
    return w


def solve_si(beam: SIBeam) -> SIResult:
    """Solve the beam exactly; see the module docstring for the method.

    The caller has checked stability (:func:`calcpack.analysis.beam.model.classify`) and that
    EI is given where it is needed.
    """
    Xl = _breakpoints(beam)
    X = np.array(Xl)
    n = len(Xl) - 1
    h = X[1:] - X[:-1]
    deg = max((len(c) - 1 for _, _, c in beam.pieces), default=0)
    K = deg + 5
    hq = _powers(h, K)[:, 1:] * _inverse_orders(K)  # h^k / k

    # -- the loads ----------------------------------------------------------------------------
    w = _line_load(beam, X, Xl, K)
    jP = [0.0] * (n + 1)  # downward point forces
    jC = [0.0] * (n + 1)  # clockwise couples
    jH = [0.0] * (n + 1)  # axial, +x
    for x, P, H, C in beam.points:
        i = _node(Xl, x)
        jP[i] += P
        jC[i] += C
        jH[i] += H

    # -- the unknowns --------------------------------------------------------------------------
    with_ei = beam.EI is not None
    unknowns: list[Unknown] = []
    support_nodes = [_node(Xl, sup[1]) for sup in beam.supports]
    hinge_nodes = [_node(Xl, x) for _, x in beam.hinges]
    for (name, _, rv, rr, fv, fr, _), i in zip(beam.supports, support_nodes, strict=True):
        if rv:
            unknowns.append(Unknown("R", i, name, fv))
        if rr:
            unknowns.append(Unknown("C", i, name, fr))
    if with_ei:
        for (name, _), i in zip(beam.hinges, hinge_nodes, strict=True):
            unknowns.append(Unknown("hinge", i, name))
        unknowns.append(Unknown("theta0", 0, ""))
        unknowns.append(Unknown("v0", 0, ""))
    nu = len(unknowns)
    Bn = nu + 1

    # batch 0 carries the loads, batch b the unit value of unknown b
    W = np.zeros((Bn, n, K))
    W[0] = w
    JV = np.zeros((Bn, n + 1))
    JM = np.zeros((Bn, n + 1))
    JV[0] = jP
    JV[0] *= -1.0
    JM[0] = jC
    jt: list[int] = []
    T0 = np.zeros(Bn)
    V0 = np.zeros(Bn)
    for b, u in enumerate(unknowns, start=1):
        if u.kind == "R":
            JV[b, u.node] = 1.0
        elif u.kind == "C":
            JM[b, u.node] = 1.0
        elif u.kind == "hinge":
            jt.append(b)
        elif u.kind == "theta0":
            T0[b] = 1.0
        else:
            V0[b] = 1.0
    Vb, Vend = _integrate(W, None, JV, -1.0, hq)
    Mb, Mend = _integrate(Vb, None, JM, 1.0, hq)

    # the conditions, one row each: ΣFy = 0 and ΣM = 0 (V and M just right of x = L), M = 0 at
    # each hinge, then v and θ at the supports (compatibility)
    rows = [Vend[:, -1] + JV[:, n], Mend[:, -1] + JM[:, n]]
    Mnode = np.concatenate([Mb[:, :, 0], Mend[:, -1:]], axis=1)  # M at every node (right)
    rows += [Mnode[:, i] for i in hinge_nodes]
    Tb = vb = None
    if with_ei:
        assert beam.EI is not None
        mids = 0.5 * (X[:-1] + X[1:])
        EI = np.zeros(n)
        for a, b_, value in beam.EI:
            EI[(mids > a) & (mids < b_)] = value
        JT = None
        if jt:
            JT = np.zeros((Bn, n + 1))
            JT[jt, [unknowns[b - 1].node for b in jt]] = 1.0
        Tb, Tend = _integrate(Mb / EI[:, None], T0, JT, 1.0, hq)
        vb, vend = _integrate(Tb, V0, None, 1.0, hq)
        Tnode = np.concatenate([Tb[:, :, 0], Tend[:, -1:]], axis=1)
        vnode = np.concatenate([vb[:, :, 0], vend[:, -1:]], axis=1)
        b = 1
        for sup, i in zip(beam.supports, support_nodes, strict=True):
            if sup[2]:
                row = vnode[:, i].copy()
                row[b] += sup[4]  # spring: v = −R/k
                rows.append(row)
                b += 1
            if sup[3]:
                row = Tnode[:, i].copy()
                row[b] -= sup[5]  # rotational spring: θ = C/k_θ
                rows.append(row)
                b += 1
    A = np.array(rows)
    rhs = -A[:, 0]
    A = A[:, 1:]
    if nu:
        # Equilibrate rows and columns: unknowns mix newtons, radians and metres.
        cs = np.abs(A).max(axis=0)
        cs[cs == 0] = 1.0
        As = A / cs
        rs = np.abs(As).max(axis=1)
        rs[rs == 0] = 1.0
        u_vals = np.linalg.solve(As / rs[:, None], rhs / rs) / cs
    else:
        u_vals = np.zeros(0)
    coef = np.concatenate([[1.0], u_vals])

    def mix(g: np.ndarray) -> np.ndarray:
        return np.asarray((coef @ g.reshape(Bn, -1)).reshape(n, K), dtype=float)

    V = mix(Vb)
    M = mix(Mb)
    T = mix(Tb) if Tb is not None else None
    v = mix(vb) if vb is not None else None

    reactions: dict[tuple[str, str], float] = {}
    hinge_rotation: dict[str, float] = {}
    for u, val in zip(unknowns, u_vals.tolist(), strict=True):
        if u.kind == "R":
            reactions[(u.owner, "Fy")] = val
        elif u.kind == "C":
            reactions[(u.owner, "C")] = val
        elif u.kind == "hinge":
            hinge_rotation[u.owner] = val

    N, Hreact = _axial(beam, X, Xl, jH)
    reactions.update(Hreact)
    return SIResult(X, w, V, M, T, v, N, reactions, hinge_rotation)


def _axial(
    beam: SIBeam, X: np.ndarray, Xl: list[float], jH: list[float]
) -> tuple[np.ndarray, dict[tuple[str, str], float]]:
    """Axial force per segment (tension +) and horizontal reactions.

    With several horizontal restraints, the axial load is shared so that the axial
    displacement is zero at each restraint, taking EA uniform (only its distribution matters).
    """
    n = len(Xl) - 1
    if not any(jH):
        return np.zeros(n), {(s[0], "Fx"): 0.0 for s in beam.supports if s[6]}
    h = X[1:] - X[:-1]
    restraints = [(name, _node(Xl, x)) for name, x, *_, rh in beam.supports if rh]
    reactions: dict[tuple[str, str], float] = {}
    base = -np.cumsum(jH)[:n]  # N on each segment from the applied axial loads alone
    if not restraints:
        return base, reactions
    m = len(restraints)
    units = np.zeros((m, n))
    for r, (_, i) in enumerate(restraints):
        units[r, i:] = -1.0  # a unit +x reaction at node i
    rows = [np.append(np.ones(m), -sum(jH))]  # ΣFx = 0: Σ H_r = −Σ applied
    for r in range(m - 1):
        i0, i1 = restraints[r][1], restraints[r + 1][1]
        sl = slice(i0, i1)
        rows.append(np.append(units[:, sl] @ h[sl], -(base[sl] @ h[sl])))
    A = np.array(rows)
    H = np.linalg.solve(A[:, :-1], A[:, -1])
    for (name, _), value in zip(restraints, H, strict=True):
        reactions[(name, "Fx")] = float(value)
    return base + H @ units, reactions
