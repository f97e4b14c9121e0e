"""Exact extremes of the piecewise polynomials: candidates are segment ends (both sides of each
breakpoint) and the real roots of the derivative inside each segment (V for M, w for V, θ for v),
found as eigenvalues of the companion matrix of the segment polynomial scaled to [0, 1] and
polished by Newton steps. Round-off is the only error."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import TYPE_CHECKING

import numpy as np

from calcpack.analysis.beam.core import SIResult, evaluate
from calcpack.units import Quantity


def out_q(value: float, kind: str) -> Quantity:
    from calcpack.analysis.beam.result import out_q as _out

    return _out(value, kind)


if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["BeamExtremes", "Extreme", "batch_roots", "find_extremes", "roots_in_segments"]


@dataclass(frozen=True)
class Extreme:
    """A value and where it occurs; ``side`` is "left"/"right" at a discontinuity, else "".

    Stored in SI (``value_si``, ``x_m``); :attr:`value` and :attr:`x` are quantities in the
    display units (kN, kN·m, mm, m), made when read.
    """

    value_si: float
    x_m: float
    side: str = ""
    kind: str = "force"

    @property
    def value(self) -> Quantity:
        return out_q(self.value_si, self.kind)

    @property
    def x(self) -> Quantity:
        return out_q(self.x_m, "length")


class BeamExtremes:
    """Extremes of one result (sign convention as in :mod:`calcpack.analysis.beam.result`).

    Attributes:
        V_max, V_min: largest and smallest shear. M_max, M_min: largest sagging and most
        hogging moment (M_min < 0 is hogging). zero_shear: positions where V is zero or changes
        sign across a point load. contraflexure: positions inside the beam where M changes sign
        (found when first read). deflection_down: largest downward deflection (δ > 0) or None.
        deflection_up: largest upward movement (as a positive magnitude) or None. slope_left,
        slope_right: θ at x = 0 and x = L (ccw +), or None without EI.
    """

    def __init__(
        self,
        core: SIResult,
        V: tuple[Extreme, Extreme],
        M: tuple[Extreme, Extreme],
        V_roots: np.ndarray,
        deflection: tuple[Extreme | None, Extreme | None],
        slopes: tuple[float | None, float | None],
    ) -> None:
        self._core = core
        self.V_max, self.V_min = V
        self.M_max, self.M_min = M
        self._V_roots = V_roots
        self.deflection_down, self.deflection_up = deflection
        self.slope_left_rad, self.slope_right_rad = slopes

    def __repr__(self) -> str:
        return (
            f"BeamExtremes(V_max={self.V_max}, V_min={self.V_min}, M_max={self.M_max}, "
            f"M_min={self.M_min}, deflection_down={self.deflection_down}, "
            f"deflection_up={self.deflection_up})"
        )

    @cached_property
    def zero_shear_m(self) -> tuple[float, ...]:
        core = self._core
        X = core.X
        n = len(X) - 1
        L = X[-1]
        tol = 1e-9 * L
        Vleft = np.concatenate([[0.0], _value(core.V, X, X[1:], np.arange(n))])
        Vright = np.concatenate([core.V[:, 0], [0.0]])
        scale = max(float(np.max(np.abs(np.concatenate([Vleft, Vright])))), 1e-300)
        cross = (
            (Vleft * Vright < 0)
            & (np.abs(Vleft) > 1e-12 * scale)
            & (np.abs(Vright) > 1e-12 * scale)
        )
        zs = _dedupe(np.concatenate([self._V_roots, X[cross]]), tol)
        return tuple(float(x) for x in zs[(zs > tol) & (zs < L - tol)])

    @cached_property
    def contraflexure_m(self) -> tuple[float, ...]:
        core = self._core
        X = core.X
        L = X[-1]
        tol = 1e-9 * L
        scale = max(
            float(np.max(np.abs(core.M[:, 0]))),
            abs(self.M_max.value_si),
            abs(self.M_min.value_si),
            1e-300,
        )
        cand = _dedupe(roots_in_segments(X, core.M), tol)
        cand = cand[(cand > tol) & (cand < L - tol)]
        eps = 1e-6 * L
        ml = evaluate(X, core.M, cand - eps)
        mr = evaluate(X, core.M, cand + eps)
        keep = (ml * mr < 0) & (np.minimum(np.abs(ml), np.abs(mr)) > 1e-12 * scale)
        return tuple(float(x) for x in cand[keep])

    @property
    def zero_shear(self) -> tuple[Quantity, ...]:
        return tuple(out_q(x, "length") for x in self.zero_shear_m)

    @property
    def contraflexure(self) -> tuple[Quantity, ...]:
        return tuple(out_q(x, "length") for x in self.contraflexure_m)

    @property
    def slope_left(self) -> Quantity | None:
        return None if self.slope_left_rad is None else out_q(self.slope_left_rad, "angle")

    @property
    def slope_right(self) -> Quantity | None:
        return None if self.slope_right_rad is None else out_q(self.slope_right_rad, "angle")


def _closed_roots(d: np.ndarray, rows: np.ndarray, degree: int) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of linear or quadratic rows (ascending coefficients in t) in closed form;
    the quadratic by the cancellation-free form q = −(b + sign(b)·√disc)/2, t = q/a and c/q."""
    if degree == 1:
        return rows, -d[rows, 0] / d[rows, 1]
    c0, b, a = d[rows, 0], d[rows, 1], d[rows, 2]
    disc = b * b - 4.0 * a * c0
    # a discriminant lost in round-off is a double root
    disc = np.where(np.abs(disc) <= 1e-12 * (b * b + np.abs(4.0 * a * c0)), 0.0, disc)
    ok = disc >= 0
    rows, c0, b, a, disc = rows[ok], c0[ok], b[ok], a[ok], disc[ok]
    q = -0.5 * (b + np.where(b >= 0, 1.0, -1.0) * np.sqrt(disc))
    t1 = q / a
    with np.errstate(divide="ignore", invalid="ignore"):
        t2 = np.where(q != 0, c0 / np.where(q != 0, q, 1.0), t1)
    return np.concatenate([rows, rows]), np.concatenate([t1, t2])


def _companion_roots(d: np.ndarray, rows: np.ndarray, D: int) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of rows of degree D >= 3: eigenvalues of the stacked companion matrices,
    polished by Newton steps."""
    c = d[rows, :D] / d[rows, D : D + 1]  # monic
    comp = np.zeros((rows.size, D, D))
    idx = np.arange(D - 1)
    comp[:, idx + 1, idx] = 1.0
    comp[:, :, -1] = -c
    ev = np.linalg.eigvals(comp)
    t = ev.real
    ok = (np.abs(ev.imag) < 1e-6) & (t > -1e-6) & (t < 1 + 1e-6)
    r_idx, col = np.nonzero(ok)
    seg = rows[r_idx]
    cc = d[seg, : D + 1]
    tt = t[r_idx, col]
    size = np.max(np.abs(cc), axis=1)
    for _ in range(1):  # a Newton step (Horner for p and p'), guarded against flat spots
        f = np.zeros_like(tt)
        fp = np.zeros_like(tt)
        for k in range(D, -1, -1):
            fp = fp * tt + f
            f = f * tt + cc[:, k]
        good = np.abs(fp) > 1e-12 * size
        step = np.where(good, f / np.where(good, fp, 1.0), 0.0)
        tt = tt - np.clip(step, -1e-3, 1e-3)
    return seg, tt


def batch_roots(g: np.ndarray, h: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of every segment polynomial inside its segment, all segments at once.

    Each row of ``g`` (n, K) is scaled to t = ξ/h ∈ [0, 1]; terms below 1e-13 of the row's
    largest are dropped (round-off). Rows are grouped by degree: linear and quadratic rows
    are solved in closed form, higher degrees as eigenvalues of their companion matrices (one
    stacked call per degree) polished by Newton steps. Identically zero and constant rows
    have no roots.

    Returns:
        (segment index, ξ) arrays of the roots in [0, h].
    """
    K = g.shape[1]
    d = g * h[:, None] ** np.arange(K)[None, :]
    size = np.max(np.abs(d), axis=1)
    d = np.where(np.abs(d) > 1e-13 * size[:, None], d, 0.0)
    nz = d != 0
    deg = np.where(nz.any(axis=1), K - 1 - np.argmax(nz[:, ::-1], axis=1), 0)
    segs: list[np.ndarray] = []
    ts: list[np.ndarray] = []
    for D in (1, 2):
        rows = np.nonzero(deg == D)[0]
        if rows.size:
            seg, t = _closed_roots(d, rows, D)
            segs.append(seg)
            ts.append(t)
    rows = np.nonzero(deg >= 3)[0]
    if rows.size:
        # one eigenvalue call: lower degrees are multiplied by (t − 2), whose root lies
        # outside [0, 1], up to the top degree
        D = int(deg[rows].max())
        c = d[rows, : D + 1].copy()
        pad = D - deg[rows]
        while pad.max() > 0:
            more = pad > 0
            shifted = np.zeros_like(c)
            shifted[:, 1:] = c[:, :-1]
            c = np.where(more[:, None], shifted - 2.0 * c, c)
            pad = pad - more.astype(int)
        padded = np.zeros_like(d)
        padded[rows, : D + 1] = c
        seg, t = _companion_roots(padded, rows, D)
        segs.append(seg)
        ts.append(t)
    if not segs:
        return np.zeros(0, dtype=int), np.zeros(0)
    seg_all = np.concatenate(segs)
    t_all = np.concatenate(ts)
    keep = (t_all > -1e-9) & (t_all < 1 + 1e-9)
    seg_all = seg_all[keep]
    return seg_all, np.clip(t_all[keep], 0.0, 1.0) * h[seg_all]


def roots_in_segments(X: np.ndarray, g: np.ndarray) -> np.ndarray:
    """Sorted x (m) of all real roots of piecewise polynomial ``g`` inside its segments."""
    seg, xi = batch_roots(g, np.diff(X))
    return np.sort(X[seg] + xi)


def _dedupe(x: np.ndarray, tol: float) -> np.ndarray:
    if x.size == 0:
        return x
    x = np.sort(x)
    keep = np.concatenate([[True], np.diff(x) > tol])
    return np.asarray(x[keep], dtype=float)


def _value(g: np.ndarray, X: np.ndarray, x: np.ndarray, seg: np.ndarray) -> np.ndarray:
    xi = x - X[seg]
    out = np.zeros_like(xi)
    for k in range(g.shape[1] - 1, -1, -1):
        out = out * xi + g[seg, k]
    return np.asarray(out, dtype=float)


def _candidates(
    X: np.ndarray, g: np.ndarray, roots: tuple[np.ndarray, np.ndarray]
) -> tuple[np.ndarray, ...]:
    """Positions, side and value of every candidate for the extremes of g, given the roots
    (segment, ξ) of its derivative."""
    n = len(X) - 1
    h = np.diff(X)
    rseg, rxi = roots
    inside = (rxi > 0) & (rxi < h[rseg])
    rseg, rxi = rseg[inside], rxi[inside]
    ar = np.arange(n)
    x = np.concatenate([X[:-1], X[1:], X[rseg] + rxi])
    seg = np.concatenate([ar, ar, rseg])
    side = np.concatenate([np.ones(n, int), np.full(n, 2), np.zeros(rseg.size, int)])
    return x, seg, side, _value(g, X, x, seg)


_SIDES = ("", "right", "left")


def _pick(
    x: np.ndarray, side: np.ndarray, val: np.ndarray, which: str, X: np.ndarray, kind: str
) -> Extreme:
    i = int(np.argmax(val) if which == "max" else np.argmin(val))
    s = _SIDES[int(side[i])]
    L = X[-1]
    at_end = abs(x[i]) <= 1e-12 * L or abs(x[i] - L) <= 1e-12 * L
    return Extreme(float(val[i]), float(x[i]), "" if at_end else s, kind)


def find_extremes(result: BeamResult) -> BeamExtremes:
    """All extremes of ``result`` (see :class:`BeamExtremes`)."""
    core = result.core
    X = core.X
    L = X[-1]
    n = len(X) - 1
    # One batch of root finding: w (turning points of V), V (of M), θ (of v).
    h = np.diff(X)
    stack = [core.w, core.V] + ([core.T] if core.T is not None else [])
    K = max(g.shape[1] for g in stack)
    G = np.zeros((len(stack) * n, K))
    for i, g in enumerate(stack):
        G[i * n : (i + 1) * n, : g.shape[1]] = g
    seg_all, xi_all = batch_roots(G, np.tile(h, len(stack)))
    found = []
    for i in range(len(stack)):
        sel = (seg_all >= i * n) & (seg_all < (i + 1) * n)
        found.append((seg_all[sel] - i * n, xi_all[sel]))
    xV, _, sV, vV = _candidates(X, core.V, found[0])  # V' = −w
    xM, _, sM, vM = _candidates(X, core.M, found[1])  # M' = V

    down = up = None
    sl = sr = None
    if core.v is not None and core.T is not None:
        xv, _, sv, vv = _candidates(X, core.v, found[2])
        sv = np.zeros(sv.shape, int)  # v is continuous: no sides to tell apart
        size = max(float(np.max(np.abs(vv))), 1e-300)
        down = _pick(xv, sv, -vv, "max", X, "deflection")
        up = _pick(xv, sv, vv, "max", X, "deflection")
        if not down.value_si > 1e-12 * size:
            down = None
        if not up.value_si > 1e-12 * size:
            up = None
        sl = float(core.T[0, 0])
        sr = float(_value(core.T, X, np.array([L]), np.array([n - 1]))[0])
    return BeamExtremes(
        core,
        (_pick(xV, sV, vV, "max", X, "force"), _pick(xV, sV, vV, "min", X, "force")),
        (_pick(xM, sM, vM, "max", X, "moment"), _pick(xM, sM, vM, "min", X, "moment")),
        X[found[1][0]] + found[1][1],
        (down, up),
        (sl, sr),
    )
