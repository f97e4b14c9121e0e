"""Exact extremes of the piecewise polynomials: candidates are segment ends (both sides of each
breakpoint) and the real roots of the derivative inside each segment (V for M, w for V, θ for v),
found as eigenvalues of the companion matrix of the segment polynomial scaled to [0, 1] and
polished by Newton steps. Round-off is the only error."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from calcpack.units import Q_, Quantity

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["BeamExtremes", "Extreme", "find_extremes", "roots_in_segments"]


@dataclass(frozen=True)
class Extreme:
    """A value and where it occurs; ``side`` is "left"/"right" at a discontinuity, else ""."""

    value: Quantity
    x: Quantity
    side: str = ""


@dataclass(frozen=True)
class BeamExtremes:
    """Extremes of one result (sign convention as in :mod:`calcpack.analysis.beam.result`).

    Attributes:
        V_max, V_min: largest and smallest shear. M_max, M_min: largest sagging and most
        hogging moment (M_min < 0 is hogging). zero_shear: positions where V is zero or changes
        sign across a point load. contraflexure: positions inside the beam where M changes sign.
        deflection_down: largest downward deflection (δ > 0) or None. deflection_up: largest
        upward movement (as a positive magnitude) or None. slope_left, slope_right: θ at x = 0
        and x = L (ccw +), or None without EI.
    """

    V_max: Extreme
    V_min: Extreme
    M_max: Extreme
    M_min: Extreme
    zero_shear: tuple[Quantity, ...]
    contraflexure: tuple[Quantity, ...]
    deflection_down: Extreme | None
    deflection_up: Extreme | None
    slope_left: Quantity | None
    slope_right: Quantity | None


def _poly_roots(c: np.ndarray, h: float) -> np.ndarray:
    """Real roots ξ in [0, h] of the ascending polynomial c (empty if c is identically 0)."""
    d = c * h ** np.arange(len(c))  # in t = ξ/h
    size = np.max(np.abs(d))
    if size == 0.0:
        return np.zeros(0)
    nz = np.nonzero(np.abs(d) > 1e-13 * size)[0]
    top = nz[-1]
    if top == 0:
        return np.zeros(0)
    d = d[: top + 1]
    r = np.polynomial.polynomial.polyroots(d)
    r = r[np.abs(r.imag) < 1e-6].real
    r = r[(r > -1e-9) & (r < 1 + 1e-9)]
    if r.size:
        dd = np.polynomial.polynomial.polyder(d)
        for _ in range(3):  # Newton polish in t, guarded against flat spots
            f = np.polynomial.polynomial.polyval(r, d)
            fp = np.polynomial.polynomial.polyval(r, dd)
            step = np.where(np.abs(fp) > 1e-14 * size, f / np.where(fp == 0, 1, fp), 0.0)
            r = r - np.clip(step, -1e-3, 1e-3)
        r = np.clip(r, 0.0, 1.0)
    return np.asarray(r * h, dtype=float)


def roots_in_segments(X: np.ndarray, g: np.ndarray) -> np.ndarray:
    """Sorted x (m) of all real roots of piecewise polynomial ``g`` inside its segments."""
    h = np.diff(X)
    out = [X[j] + _poly_roots(g[j], h[j]) for j in range(len(h))]
    return np.sort(np.concatenate(out)) if out else np.zeros(0)


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


def _candidates(X: np.ndarray, g: np.ndarray, dg: np.ndarray | None) -> tuple[np.ndarray, ...]:
    """Positions, segment index and value of every candidate for the extremes of g."""
    n = len(X) - 1
    h = np.diff(X)
    xs = [X[:-1], X[1:]]
    segs = [np.arange(n), np.arange(n)]
    sides = [np.full(n, "right"), np.full(n, "left")]
    if dg is not None:
        for j in range(n):
            r = _poly_roots(dg[j], h[j])
            r = r[(r > 0) & (r < h[j])]
            xs.append(X[j] + r)
            segs.append(np.full(r.size, j))
            sides.append(np.full(r.size, ""))
    x = np.concatenate(xs)
    seg = np.concatenate(segs)
    side = np.concatenate(sides)
    return x, seg, side, _value(g, X, x, seg)


def _pick(
    x: np.ndarray,
    side: np.ndarray,
    val: np.ndarray,
    which: str,
    X: np.ndarray,
    unit: str,
    show: str,
) -> Extreme:
    i = int(np.argmax(val) if which == "max" else np.argmin(val))
    s = str(side[i])
    at_node = np.any(np.isclose(x[i], X, rtol=0, atol=1e-12 * X[-1]))
    at_end = np.isclose(x[i], X[0]) or np.isclose(x[i], X[-1])
    return Extreme(
        Q_(float(val[i]), unit).to(show), Q_(float(x[i]), "m"), s if at_node and not at_end else ""
    )


def find_extremes(result: BeamResult) -> BeamExtremes:
    """All extremes of ``result`` (see :class:`BeamExtremes`)."""
    core = result.core
    X = core.X
    L = X[-1]
    tol = 1e-9 * L
    n = len(X) - 1
    dV = -core.w  # V' = −w
    xV, _, sV, vV = _candidates(X, core.V, dV)
    xM, _, sM, vM = _candidates(X, core.M, core.V)

    # points of zero shear: roots of V in segments, and sign changes across point loads
    zs = [roots_in_segments(X, core.V)]
    Vleft = np.concatenate([[0.0], _value(core.V, X, X[1:], np.arange(n))])
    Vright = np.concatenate([core.V[:, 0], [0.0]])
    scaleV = max(float(np.max(np.abs(vV))), 1e-300)
    cross = (
        (Vleft * Vright < 0) & (np.abs(Vleft) > 1e-12 * scaleV) & (np.abs(Vright) > 1e-12 * scaleV)
    )
    zs.append(X[cross])
    zero_shear = _dedupe(np.concatenate(zs), tol)
    zero_shear = zero_shear[(zero_shear > tol) & (zero_shear < L - tol)]

    # contraflexure: M changes sign inside the beam
    scaleM = max(float(np.max(np.abs(vM))), 1e-300)
    cand = _dedupe(roots_in_segments(X, core.M), tol)
    cand = cand[(cand > tol) & (cand < L - tol)]
    eps = 1e-6 * L
    contra = []
    for x0 in cand:
        lo = result.core.M
        ml = float(
            _value(
                lo, X, np.array([x0 - eps]), np.clip(np.searchsorted(X, [x0 - eps]) - 1, 0, n - 1)
            )[0]
        )
        mr = float(
            _value(
                lo, X, np.array([x0 + eps]), np.clip(np.searchsorted(X, [x0 + eps]) - 1, 0, n - 1)
            )[0]
        )
        if ml * mr < 0 and min(abs(ml), abs(mr)) > 1e-12 * scaleM:
            contra.append(x0)

    down = up = None
    sl = sr = None
    if core.v is not None and core.T is not None:
        xv, _, sv, vv = _candidates(X, core.v, core.T)
        delta = -vv
        sv = np.full(sv.shape, "")  # v is continuous: no sides to tell apart
        down = _pick(xv, sv, delta, "max", X, "m", "mm")
        if not float(down.value.magnitude) > 0:
            down = None
        up_e = _pick(xv, sv, vv, "max", X, "m", "mm")
        up = up_e if float(up_e.value.magnitude) > 1e-12 * max(abs(delta).max(), 1e-300) else None
        if down is not None and not float(down.value.magnitude) > 1e-12 * abs(delta).max():
            down = None
        sl = Q_(float(core.T[0, 0]), "rad")
        sr = Q_(float(_value(core.T, X, np.array([L]), np.array([n - 1]))[0]), "rad")
    return BeamExtremes(
        V_max=_pick(xV, sV, vV, "max", X, "N", "kN"),
        V_min=_pick(xV, sV, vV, "min", X, "N", "kN"),
        M_max=_pick(xM, sM, vM, "max", X, "N*m", "kN*m"),
        M_min=_pick(xM, sM, vM, "min", X, "N*m", "kN*m"),
        zero_shear=tuple(Q_(float(x), "m") for x in zero_shear),
        contraflexure=tuple(Q_(float(x), "m") for x in contra),
        deflection_down=down,
        deflection_up=up,
        slope_left=sl,
        slope_right=sr,
    )
