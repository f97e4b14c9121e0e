"""Exact extremes of the piecewise polynomials: candidates are segment ends (both sides of each
breakpoint) and the real roots of the derivative inside each segment (V for M, w for V, θ for v),
found as eigenvalues of the companion matrix of the segment polynomial scaled to [0, 1] and
polished by Newton steps. Round-off is the only error."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import TYPE_CHECKING, Literal

import numpy as np

from calcpack.analysis.beam.core import SIResult, evaluate, shift_rows
from calcpack.analysis.beam.quantities import out_q
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Quantity
from calcpack.validate import one_of, within

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = [
    "BeamExtremes",
    "Extreme",
    "RangeExtremes",
    "RangeWhat",
    "batch_roots",
    "find_extremes",
    "range_extremes",
    "roots_in_segments",
]


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
        (found when first read). deflection_down: largest downward deflection (δ > 0), or None
        when the beam nowhere moves down. deflection_up: largest upward movement (as a positive
        magnitude), or None when it nowhere moves up. slope_left, slope_right: θ at x = 0 and
        x = L (ccw +). has_deflection: whether EI was given; without it, reading a deflection
        or a slope raises :class:`~calcpack.errors.InputError` naming the missing EI.
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
        self.has_deflection = core.v is not None and core.T is not None
        self._deflection = deflection
        self._slopes = slopes

    def _needs_ei(self, what: str) -> None:
        if not self.has_deflection:
            raise InputError(
                f"{what} needs the beam's flexural stiffness EI, which was not given (got "
                "EI = None); give EI=... to Beam(...) to get deflections and slopes",
                name="EI",
                value=None,
                expected="a flexural stiffness EI (e.g. 200 GPa × 50e6 mm⁴)",
            )

    @property
    def deflection_down(self) -> Extreme | None:
        """Largest downward deflection (δ > 0), None if the beam nowhere moves down.

        Raises:
            InputError: no EI was given (names EI).
        """
        self._needs_ei("deflection_down")
        return self._deflection[0]

    @property
    def deflection_up(self) -> Extreme | None:
        """Largest upward movement (positive magnitude), None if the beam nowhere moves up.

        Raises:
            InputError: no EI was given (names EI).
        """
        self._needs_ei("deflection_up")
        return self._deflection[1]

    @property
    def slope_left_rad(self) -> float:
        """θ at x = 0 in rad (ccw +). Raises InputError without EI."""
        self._needs_ei("slope_left")
        value = self._slopes[0]
        assert value is not None
        return value

    @property
    def slope_right_rad(self) -> float:
        """θ at x = L in rad (ccw +). Raises InputError without EI."""
        self._needs_ei("slope_right")
        value = self._slopes[1]
        assert value is not None
        return value

    def __repr__(self) -> str:
        down, up = self._deflection if self.has_deflection else ("no EI", "no EI")
        return (
            f"BeamExtremes(V_max={self.V_max}, V_min={self.V_min}, M_max={self.M_max}, "
            f"M_min={self.M_min}, deflection_down={down}, deflection_up={up})"
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
    def slope_left(self) -> Quantity:
        """θ at x = 0 (ccw +). Raises InputError without EI."""
        return out_q(self.slope_left_rad, "angle")

    @property
    def slope_right(self) -> Quantity:
        """θ at x = L (ccw +). Raises InputError without EI."""
        return out_q(self.slope_right_rad, "angle")


def _closed_roots(d: np.ndarray, rows: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of linear or quadratic rows (ascending coefficients in t) in closed form, both
    degrees in one pass: q = −(b + sign(b)·√disc)/2 (free of cancellation), t = q/a and c/q.

    A linear row (a = 0) has disc = b², q = −b and its root c/q = −c/b; its "root" q/a is
    made NaN (division by NaN, not by zero) and dropped by the caller's range test.
    """
    c0, b, a = d[rows, 0], d[rows, 1], d[rows, 2]
    disc = b * b - 4.0 * a * c0
    # a discriminant lost in round-off is a double root
    disc = np.where(np.abs(disc) <= 1e-12 * (b * b + np.abs(4.0 * a * c0)), 0.0, disc)
    ok = disc >= 0
    rows, c0, b, a, disc = rows[ok], c0[ok], b[ok], a[ok], disc[ok]
    q = -0.5 * (b + np.where(b >= 0, 1.0, -1.0) * np.sqrt(disc))
    t1 = q / np.where(a != 0, a, np.nan)
    t2 = np.where(q != 0, c0 / np.where(q != 0, q, np.nan), t1)
    return np.concatenate([rows, rows]), np.concatenate([t1, t2])


_COMPANION: dict[int, tuple[np.ndarray, np.ndarray, np.ndarray]] = {}


def _companion_roots(d: np.ndarray, rows: np.ndarray, D: int) -> tuple[np.ndarray, np.ndarray]:
    """Real roots in [0, 1] of rows of degree D >= 3: eigenvalues of the stacked companion
    matrices, polished by a Newton step."""
    consts = _COMPANION.get(D)
    if consts is None:
        k = np.arange(D + 1.0)
        consts = (np.eye(D, k=-1), k, k[1:])
        _COMPANION[D] = consts
    base, k, k1 = consts
    cc = d[rows, : D + 1]
    comp = np.repeat(base[None], rows.size, axis=0)
    comp[:, :, -1] = cc[:, :D] / -cc[:, D : D + 1]  # monic
    ev = np.linalg.eigvals(comp)
    t = ev.real
    ok = (np.abs(ev.imag) < 1e-6) & (np.abs(t - 0.5) < 0.5 + 1e-6)
    r_idx, col = np.nonzero(ok)
    cc = cc[r_idx]
    tt = t[r_idx, col]
    # a Newton step (p and p' as power sums: t is in [0, 1]), guarded against flat spots
    tp = tt[:, None] ** k
    f = (cc * tp).sum(axis=1)
    fp = (cc[:, 1:] * tp[:, :-1]) @ k1
    good = np.abs(fp) > 1e-12 * np.abs(cc).max(axis=1)
    step = np.where(good, f / np.where(good, fp, 1.0), 0.0)
    return rows[r_idx], tt - np.minimum(np.maximum(step, -1e-3), 1e-3)


def batch_roots(
    g: np.ndarray, h: np.ndarray, powers: np.ndarray | None = None
) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of every segment polynomial inside its segment, all segments at once.

    Each row of ``g`` (n, K) is scaled to t = ξ/h ∈ [0, 1] (``powers``, if given, is h^k
    (n, K)); terms below 1e-13 of the row's largest are dropped (round-off). Linear and
    quadratic rows are solved in closed form, higher degrees as eigenvalues of their companion
    matrices (one stacked call) polished by a Newton step. Identically zero and constant rows
    have no roots.

    Returns:
        (segment index, ξ) arrays of the roots in [0, h].
    """
    if g.shape[1] < 3:  # the closed form reads three coefficients
        g = np.concatenate([g, np.zeros((g.shape[0], 3 - g.shape[1]))], axis=1)
        powers = None
    K = g.shape[1]
    k = np.arange(K)
    d = g * (h[:, None] ** k if powers is None else powers)
    a = np.abs(d)
    nz = a > 1e-13 * a.max(axis=1, keepdims=True)
    d = d * nz
    deg = (nz * k).max(axis=1)
    segs: list[np.ndarray] = []
    ts: list[np.ndarray] = []
    rows = ((deg == 1) | (deg == 2)).nonzero()[0]
    if rows.size:
        seg, t = _closed_roots(d, rows)
        segs.append(seg)
        ts.append(t)
    rows = (deg >= 3).nonzero()[0]
    if rows.size:
        # one eigenvalue call: lower degrees are multiplied by (t − 2), whose root lies
        # outside [0, 1], up to the top degree
        D = int(deg[rows].max())
        c = d[rows, : D + 1]
        pad = D - deg[rows]
        while pad.max() > 0:
            more = pad > 0
            shifted = np.zeros_like(c)
            shifted[:, 1:] = c[:, :-1]
            c = np.where(more[:, None], shifted - 2.0 * c, c)
            pad = pad - more
        seg, t = _companion_roots(c, np.arange(rows.size), D)
        segs.append(rows[seg])
        ts.append(t)
    if not segs:
        return np.zeros(0, dtype=int), np.zeros(0)
    seg_all = np.concatenate(segs) if len(segs) > 1 else segs[0]
    t_all = np.concatenate(ts) if len(ts) > 1 else ts[0]
    keep = np.abs(t_all - 0.5) < 0.5 + 1e-9  # NaN (no root) fails too
    seg_all = seg_all[keep]
    return seg_all, np.minimum(np.maximum(t_all[keep], 0.0), 1.0) * h[seg_all]


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


def _stack(parts: list[np.ndarray], K: int) -> np.ndarray:
    """Piecewise polynomials (n, K_i) stacked into one (Σn, K) array, padded with zero terms."""
    if all(g.shape[1] == K for g in parts):
        return np.concatenate(parts)
    out = np.zeros((sum(g.shape[0] for g in parts), K))
    row = 0
    for g in parts:
        out[row : row + g.shape[0], : g.shape[1]] = g
        row += g.shape[0]
    return out


_SIDES = ("right", "left", "")  # segment start, segment end, turning point inside


def _pick(
    values: np.ndarray, x: np.ndarray, n: int, which: str, L: float, kind: str, sides: bool
) -> Extreme:
    """The largest (``which="max"``) or smallest candidate; candidates are the n segment
    starts, the n segment ends, then the turning points."""
    i = int(values.argmax() if which == "max" else values.argmin())
    xi = float(x[i])
    at_end = abs(xi) <= 1e-12 * L or abs(xi - L) <= 1e-12 * L
    side = _SIDES[min(i // n, 2)] if sides and not at_end else ""
    return Extreme(float(values[i]), xi, side, kind)


def _snap_noise(values: np.ndarray) -> np.ndarray:
    """Round-off left where the exact value is zero (e.g. M at a pinned end) is reported as 0,
    not as a 10⁻¹⁵ "hogging moment": values below 1e-12 of the largest are set to zero."""
    size = float(np.abs(values).max()) if values.size else 0.0
    return np.where(np.abs(values) <= 1e-12 * size, 0.0, values)


def _stack_candidates(
    X: np.ndarray, funcs: list[np.ndarray], derivs: list[np.ndarray]
) -> tuple[list[tuple[np.ndarray, np.ndarray]], np.ndarray, np.ndarray, np.ndarray]:
    """The candidates for the extremes of piecewise polynomials on breakpoints ``X``: each
    segment's start and end, and the real roots of the derivative strictly inside it.

    Args:
        funcs: (n, K_i) piecewise polynomials. derivs: their derivatives, in the same order.

    Returns:
        Per function, (values, x): the n segment starts, the n segment ends, then the turning
        points; and the batch roots (segment index in the stack, ξ) and the powers h^k of the
        stacked segments.
    """
    n = len(X) - 1
    h = X[1:] - X[:-1]
    nf = len(funcs)
    K = max(g.shape[1] for g in funcs + derivs)
    F = _stack(funcs, K)
    hh = np.concatenate([h] * nf)
    hp = hh[:, None] ** np.arange(K)
    seg, xi = batch_roots(_stack(derivs, K), hh, hp)
    inside = np.abs(xi - 0.5 * hh[seg]) < 0.5 * hh[seg]
    rseg, rxi = seg[inside], xi[inside]
    m = rseg.size
    at = np.concatenate([rxi, hh])
    values = (F[np.concatenate([rseg, np.arange(nf * n)])] * at[:, None] ** np.arange(K)).sum(1)
    turning, ends = values[:m], values[m:]
    starts = F[:, 0]
    x_turn = X[rseg % n] + rxi
    owner = rseg // n
    x_ends = np.concatenate([X[:-1], X[1:]])
    out = []
    for f in range(nf):
        mine = owner == f
        rows = slice(f * n, (f + 1) * n)
        out.append(
            (
                np.concatenate([starts[rows], ends[rows], turning[mine]]),
                np.concatenate([x_ends, x_turn[mine]]),
            )
        )
    return out, seg, xi, hp


def find_extremes(result: BeamResult) -> BeamExtremes:
    """All extremes of ``result`` (see :class:`BeamExtremes`).

    V, M and v (when EI is given) are handled as one stack of segment polynomials: one batch of
    root finding for their derivatives (−w, V and θ), one evaluation of every candidate.
    """
    core = result.core
    X = core.X
    n = len(X) - 1
    L = float(X[-1])
    with_v = core.v is not None and core.T is not None
    funcs = [core.V, core.M]
    derivs = [core.w, core.V]
    if with_v:
        assert core.v is not None
        assert core.T is not None
        funcs.append(core.v)
        derivs.append(core.T)
    cands, seg, xi, hp = _stack_candidates(X, funcs, derivs)
    vV, xV = cands[0]  # V' = −w
    vM, xM = cands[1]  # M' = V
    vV, vM = _snap_noise(vV), _snap_noise(vM)

    down = up = None
    sl = sr = None
    if with_v:
        assert core.T is not None
        vv, xv = cands[2]  # v' = θ; v is continuous: no sides to tell apart
        size = max(float(np.abs(vv).max()), 1e-300)
        down = _pick(-vv, xv, n, "max", L, "deflection", False)
        up = _pick(vv, xv, n, "max", L, "deflection", False)
        if not down.value_si > 1e-12 * size:
            down = None
        if not up.value_si > 1e-12 * size:
            up = None
        sl = float(core.T[0, 0])
        sr = float(core.T[n - 1] @ hp[n - 1, : core.T.shape[1]])  # θ at x = L
    V_roots = seg >= n
    if with_v:
        V_roots &= seg < 2 * n
    return BeamExtremes(
        core,
        (
            _pick(vV, xV, n, "max", L, "force", True),
            _pick(vV, xV, n, "min", L, "force", True),
        ),
        (
            _pick(vM, xM, n, "max", L, "moment", True),
            _pick(vM, xM, n, "min", L, "moment", True),
        ),
        X[seg[V_roots] - n] + xi[V_roots],
        (down, up),
        (sl, sr),
    )


RangeWhat = Literal["shear", "moment", "deflection"]


@dataclass(frozen=True)
class RangeExtremes:
    """The largest and smallest value of V, M or δ on a <= x <= b, exact to round-off.

    Attributes:
        what: "shear", "moment" or "deflection" (sign conventions of the result: V left face
            up +, M sagging +, δ down +).
        largest, smallest: the extremes with where they occur (``side`` "left"/"right" at a
            discontinuity inside the range).
    """

    what: RangeWhat
    largest: Extreme
    smallest: Extreme

    @property
    def magnitude(self) -> Extreme:
        """The extreme of larger magnitude (the largest on a tie)."""
        if abs(self.smallest.value_si) > abs(self.largest.value_si):
            return self.smallest
        return self.largest


_RANGE: dict[str, tuple[str, str, str, float]] = {
    # function, its derivative, quantity kind, sign from the core's convention
    "shear": ("V", "w", "force", 1.0),
    "moment": ("M", "V", "moment", 1.0),
    "deflection": ("v", "T", "deflection", -1.0),  # δ = −v, down +
}


def range_extremes(core: SIResult, what: RangeWhat, a_m: float, b_m: float) -> RangeExtremes:
    """Exact extremes of V, M or δ on a <= x <= b (m): the same candidates as the whole
    beam's (:func:`find_extremes`) -- range ends, breakpoints inside on both sides, real roots
    of the derivative -- on the polynomials re-expressed on the range.

    At ``a`` the value just right of it counts, at ``b`` the value just left of it (the
    range's own side of a discontinuity at its ends).

    Raises:
        InputError: ``what`` unknown, or a, b not with 0 <= a <= b <= L (names the input).
        OutOfScopeError: a deflection asked of a beam without EI.
    """
    one_of("what", what, tuple(_RANGE))
    attr, dattr, kind, sign = _RANGE[what]
    X = core.X
    L = float(X[-1])
    tol = 1e-12 * L
    within("a", a_m, -tol, L + tol, rule="a range on the beam, in m from its left end")
    within("b", b_m, a_m, L + tol, rule=f"a range on the beam, a = {a_m:.6g} m to L = {L:.6g} m")
    g, dg = getattr(core, attr), getattr(core, dattr)
    if g is None or dg is None:
        raise OutOfScopeError(
            "Deflection extremes need the beam's stiffness: give EI when building the Beam"
        )
    a, b = min(max(a_m, 0.0), L), min(max(b_m, 0.0), L)
    n = g.shape[0]
    if b - a <= tol:  # a point: its value on both sides
        x = np.array([a, a])
        v = sign * np.concatenate([evaluate(X, g, x[:1], "left"), evaluate(X, g, x[:1])])
        hi = Extreme(float(v.max()), a, "", kind)
        return RangeExtremes(what, hi, Extreme(float(v.min()), a, "", kind))
    Xs = np.concatenate([[a], X[(a + tol < X) & (b - tol > X)], [b]])
    seg = np.clip(np.searchsorted(X, Xs[:-1] + tol, side="right") - 1, 0, n - 1)
    s = Xs[:-1] - X[seg]
    K = max(g.shape[1], dg.shape[1])
    gs = shift_rows(np.pad(g[seg], ((0, 0), (0, K - g.shape[1]))), s)
    dgs = shift_rows(np.pad(dg[seg], ((0, 0), (0, K - dg.shape[1]))), s)
    cands = _stack_candidates(Xs, [gs], [dgs])[0]
    values, xs = cands[0]
    values = sign * values
    if kind != "deflection":
        values = _snap_noise(values)
    values = values + 0.0  # no −0.0 where the value is zero
    ns = len(Xs) - 1
    sides = kind != "deflection"

    def pick(which: str) -> Extreme:
        e = _pick(values, xs, ns, which, L, kind, sides)
        if e.side and (abs(e.x_m - a) <= tol or abs(e.x_m - b) <= tol):
            return Extreme(e.value_si, e.x_m, "", kind)  # a range end: its own side counts
        return e

    return RangeExtremes(what, pick("max"), pick("min"))
