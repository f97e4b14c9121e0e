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
from dataclasses import dataclass

import numpy as np

from calcpack.errors import InputError

__all__ = [
    "SIBeam",
    "SIResult",
    "Unknown",
    "evaluate",
    "integrate",
    "refine",
    "solve_si",
]


@dataclass(frozen=True)
class Unknown:
    """One unknown of the linear system: ``kind`` in {"R", "C", "hinge", "theta0", "v0"}."""

    kind: str
    index: int  # breakpoint index
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
    Returns:
        (B, n, K) coefficients of g.
    """
    _B, n, K = f.shape
    k = np.arange(1, K)
    g = np.zeros_like(f)
    g[:, :, 1:] = sign * f[:, :, :-1] / k
    ends = (g * (_powers(h, K) if powers is None else powers)).sum(axis=-1)
    increments = jumps[:, :n].copy()
    increments[:, 1:] += ends[:, :-1]
    g[:, :, 0] = start[:, None] + np.cumsum(increments, axis=1)
    return g


def end_values(g: np.ndarray, h: np.ndarray) -> np.ndarray:
    """(…, n) value of each segment polynomial at its right end."""
    return np.asarray((g * _powers(h, g.shape[-1])).sum(axis=-1), dtype=float)


def evaluate(X: np.ndarray, g: np.ndarray, x: np.ndarray, side: str = "right") -> np.ndarray:
    """Evaluate piecewise polynomial ``g`` (n, K) at positions ``x`` (m).

    At a breakpoint, ``side="right"`` gives the value just to the right, ``"left"`` just to the
    left. At the beam ends both give the value inside the beam.
    """
    n = g.shape[0]
    if side == "right":
        seg = np.searchsorted(X, x, side="right") - 1
    elif side == "left":
        seg = np.searchsorted(X, x, side="left") - 1
    else:
        raise InputError(
            f"side must be 'left' or 'right' (got side = {side!r})",
            name="side",
            value=side,
            expected="'left' or 'right'",
        )
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


def _shift(c: np.ndarray, s: np.ndarray) -> np.ndarray:
    """Coefficients of p(ξ + s) for each row of c (ascending), s per row (binomial expansion)."""
    C, e = _binomials(c.shape[-1])
    s_pow = np.asarray(s, dtype=float)[:, None] ** np.arange(c.shape[-1])[None, :]
    spow = s_pow[:, e]  # s^(i-k), gathered rather than recomputed
    return np.asarray(np.einsum("mi,ik,mik->mk", c, C, spow), dtype=float)


def refine(X: np.ndarray, g: np.ndarray, Xnew: np.ndarray, K: int) -> np.ndarray:
    """Re-express piecewise polynomial ``g`` on breakpoints X on the finer breakpoints Xnew."""
    seg = np.clip(np.searchsorted(X, Xnew[:-1], side="right") - 1, 0, g.shape[0] - 1)
    c = np.zeros((len(Xnew) - 1, K))
    c[:, : g.shape[1]] = g[seg]
    return _shift(c, Xnew[:-1] - X[seg])


def _breakpoints(beam: SIBeam) -> np.ndarray:
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
    for x in sorted({min(max(x, 0.0), L) for x in xs}):  # plain Python: a few dozen values
        if not merged or x - merged[-1] > tol:
            merged.append(x)
    merged[-1] = L  # an end within the tolerance of L is L
    return np.array(merged)


def _node(X: np.ndarray, x: float) -> int:
    """Index of the breakpoint nearest x (positions were merged to the breakpoints)."""
    i = bisect.bisect_left(_as_list(X), x)
    if i == 0:
        return 0
    if i >= len(X):
        return len(X) - 1
    return i if X[i] - x < x - X[i - 1] else i - 1


_LIST_CACHE: list[tuple[np.ndarray, list[float]]] = []


def _as_list(X: np.ndarray) -> list[float]:
    if _LIST_CACHE and _LIST_CACHE[0][0] is X:
        return _LIST_CACHE[0][1]
    values: list[float] = X.tolist()
    _LIST_CACHE[:] = [(X, values)]
    return values


def solve_si(beam: SIBeam) -> SIResult:
    """Solve the beam exactly; see the module docstring for the method.

    The caller has checked stability (:func:`calcpack.analysis.beam.model.classify`) and that
    EI is given where it is needed.
    """
    X = _breakpoints(beam)
    n = len(X) - 1
    h = np.diff(X)
    deg = max((len(c) - 1 for _, _, c in beam.pieces), default=0)
    K = deg + 5

    # -- the loads ----------------------------------------------------------------------------
    w = np.zeros((n, K))
    mids = 0.5 * (X[:-1] + X[1:])
    if beam.pieces:
        # every (piece, segment) pair at once: shift each piece's polynomial to the segment
        # start, then sum the pieces on each segment
        n_pieces = len(beam.pieces)
        A = np.array([p[0] for p in beam.pieces])
        B = np.array([p[1] for p in beam.pieces])
        coef = np.zeros((n_pieces, K))
        for i, p in enumerate(beam.pieces):
            coef[i, : len(p[2])] = p[2]
        pi, seg = np.nonzero((mids[None, :] > A[:, None]) & (mids[None, :] < B[:, None]))
        shifted = _shift(coef[pi], X[seg] - A[pi])
        gather = np.zeros((n, seg.size))
        gather[seg, np.arange(seg.size)] = 1.0
        w += gather @ shifted
    jP = np.zeros(n + 1)  # downward point forces
    jC = np.zeros(n + 1)  # clockwise couples
    jH = np.zeros(n + 1)  # axial, +x
    for x, P, H, C in beam.points:
        i = _node(X, x)
        jP[i] += P
        jC[i] += C
        jH[i] += H

    # -- the unknowns --------------------------------------------------------------------------
    unknowns: list[Unknown] = []
    for name, x, rv, rr, fv, fr, _ in beam.supports:
        i = _node(X, x)
        if rv:
            unknowns.append(Unknown("R", i, name, fv))
        if rr:
            unknowns.append(Unknown("C", i, name, fr))
    with_ei = beam.EI is not None
    if with_ei:
        for name, x in beam.hinges:
            unknowns.append(Unknown("hinge", _node(X, x), name))
        unknowns.append(Unknown("theta0", 0, ""))
        unknowns.append(Unknown("v0", 0, ""))
    nu = len(unknowns)
    Bn = nu + 1

    W = np.zeros((Bn, n, K))
    W[0] = w
    JV = np.zeros((Bn, n + 1))
    JM = np.zeros((Bn, n + 1))
    JT = np.zeros((Bn, n + 1))
    T0 = np.zeros(Bn)
    V0 = np.zeros(Bn)
    JV[0] = -jP
    JM[0] = jC
    for b, u in enumerate(unknowns, start=1):
        if u.kind == "R":
            JV[b, u.index] = 1.0
        elif u.kind == "C":
            JM[b, u.index] = 1.0
        elif u.kind == "hinge":
            JT[b, u.index] = 1.0
        elif u.kind == "theta0":
            T0[b] = 1.0
        else:
            V0[b] = 1.0
    zero = np.zeros(Bn)
    hp = _powers(h, K)
    Vb = integrate(W, h, zero, JV, sign=-1.0, powers=hp)
    Mb = integrate(Vb, h, zero, JM, powers=hp)
    Vend = end_values(Vb, h)
    Mend = end_values(Mb, h)

    def at_node(g: np.ndarray, gend: np.ndarray, i: int) -> np.ndarray:
        return g[:, i, 0] if i < n else gend[:, n - 1]

    rows = [Vend[:, -1] + JV[:, n], Mend[:, -1] + JM[:, n]]  # ΣFy = 0, ΣM = 0
    Tb = vb = None
    if with_ei:
        assert beam.EI is not None
        EI = np.zeros(n)
        for a, b_, value in beam.EI:
            EI[(mids > a) & (mids < b_)] = value
        Tb = integrate(Mb / EI[None, :, None], h, T0, JT, powers=hp)
        vb = integrate(Tb, h, V0, np.zeros((Bn, n + 1)), powers=hp)
        Tend = end_values(Tb, h)
        vend = end_values(vb, h)
        for _name, x in beam.hinges:
            rows.append(at_node(Mb, Mend, _node(X, x)))
        col = {(u.kind, u.owner): b for b, u in enumerate(unknowns, start=1)}
        for name, x, rv, rr, fv, fr, _ in beam.supports:
            i = _node(X, x)
            if rv:
                row = at_node(vb, vend, i).copy()
                row[col[("R", name)]] += fv
                rows.append(row)
            if rr:
                row = at_node(Tb, Tend, i).copy()
                row[col[("C", name)]] -= fr
                rows.append(row)
    else:
        for _name, x in beam.hinges:
            rows.append(at_node(Mb, Mend, _node(X, x)))
    A = np.array(rows)
    rhs = -A[:, 0]
    A = A[:, 1:]
    if nu:
        # Equilibrate rows and columns: unknowns mix newtons, radians and metres.
        cs = np.max(np.abs(A), axis=0)
        cs[cs == 0] = 1.0
        As = A / cs
        rs = np.max(np.abs(As), axis=1)
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
    for u, val in zip(unknowns, u_vals, strict=True):
        if u.kind == "R":
            reactions[(u.owner, "Fy")] = float(val)
        elif u.kind == "C":
            reactions[(u.owner, "C")] = float(val)
        elif u.kind == "hinge":
            hinge_rotation[u.owner] = float(val)

    N, Hreact = _axial(beam, X, jH)
    reactions.update(Hreact)
    return SIResult(X, w, V, M, T, v, N, reactions, hinge_rotation)


def _axial(
    beam: SIBeam, X: np.ndarray, jH: np.ndarray
) -> tuple[np.ndarray, dict[tuple[str, str], float]]:
    """Axial force per segment (tension +) and horizontal reactions.

    With several horizontal restraints, the axial load is shared so that the axial
    displacement is zero at each restraint, taking EA uniform (only its distribution matters).
    """
    n = len(X) - 1
    h = np.diff(X)
    restraints = [(name, _node(X, x)) for name, x, *_, rh in beam.supports if rh]
    reactions: dict[tuple[str, str], float] = {}
    base = -np.cumsum(jH)[:n]  # N on each segment from the applied axial loads alone
    if not restraints:
        return base, reactions
    if not jH.any():
        return base, {(name, "Fx"): 0.0 for name, _ in restraints}
    m = len(restraints)
    units = np.zeros((m, n))
    for r, (_, i) in enumerate(restraints):
        units[r, i:] = -1.0  # a unit +x reaction at node i
    rows = [np.append(np.ones(m), -jH.sum())]  # ΣFx = 0: Σ H_r = −Σ applied
    for r in range(m - 1):
        i0, i1 = restraints[r][1], restraints[r + 1][1]
        sl = slice(i0, i1)
        rows.append(np.append(units[:, sl] @ h[sl], -(base[sl] @ h[sl])))
    A = np.array(rows)
    H = np.linalg.solve(A[:, :-1], A[:, -1])
    for (name, _), value in zip(restraints, H, strict=True):
        reactions[(name, "Fx")] = float(value)
    return base + H @ units, reactions
