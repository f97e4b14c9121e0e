"""Replace an arbitrary line load by a piecewise polynomial to a stated accuracy.

Method: on each interval the function is interpolated at Chebyshev points of the second kind
(degree :data:`DEGREE`), and the interpolant is compared with the function at check points
placed between the nodes (Chebyshev points of the first kind of twice the degree). If the
largest deviation exceeds ``rtol × max|w|`` (max over all samples), the interval is halved.
More than :data:`MAX_PIECES` intervals, or one narrower than :data:`MIN_WIDTH` of the load,
is refused: such a load (a step, a spike, a singularity) cannot be represented to the
accuracy asked and is reported, not approximated. Chebyshev interpolation of a smooth
function converges geometrically (Trefethen, Approximation Theory and Approximation Practice,
SIAM 2013, ch. 8 -- from memory), so few pieces suffice.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from calcpack.errors import OutOfScopeError

if TYPE_CHECKING:
    from calcpack.loads.types import FunctionLoad, SIPiece

__all__ = ["DEGREE", "MAX_PIECES", "fit_function_load"]

DEGREE = 8
MAX_PIECES = 64
MIN_WIDTH = 1e-6  # smallest interval, as a fraction of the load's length

_NODES = np.cos(np.pi * np.arange(DEGREE + 1) / DEGREE)[::-1]  # on [-1, 1], ascending
_CHECK = np.cos(np.pi * (np.arange(2 * DEGREE) + 0.5) / (2 * DEGREE))[::-1]


def _monomial_on(a: float, b: float, values: np.ndarray) -> np.ndarray:
    """Ascending monomial coefficients in ξ = x − a of the interpolant through the nodes."""
    h = b - a
    xi = (_NODES + 1.0) * 0.5 * h
    # Solve in the scaled variable t = ξ/h (well conditioned), then rescale: c_k = d_k / h^k.
    t = xi / h
    vander = np.vander(t, DEGREE + 1, increasing=True)
    d = np.linalg.solve(vander, values)
    return np.asarray(d / h ** np.arange(DEGREE + 1), dtype=float)


def fit_function_load(load: FunctionLoad, a_m: float, b_m: float) -> tuple[SIPiece, ...]:
    """Piecewise-polynomial pieces for ``load`` on [a_m, b_m] meeting its ``rtol``.

    Raises:
        OutOfScopeError: the accuracy cannot be met within :data:`MAX_PIECES` intervals.
    """
    from calcpack.loads.types import SIPiece

    rtol = float(load.rtol)
    probe = np.linspace(a_m, b_m, 65)
    scale = float(np.max(np.abs(load.evaluate_si(probe))))
    if scale == 0.0:
        return (SIPiece(a_m, b_m, (0.0,)),)
    pending = [(a_m, b_m)]
    accepted: list[tuple[float, float, np.ndarray]] = []
    worst = 0.0
    while pending:
        a, b = pending.pop()
        mid, half = 0.5 * (a + b), 0.5 * (b - a)
        nodes = mid + half * _NODES
        checks = mid + half * _CHECK
        fn = load.evaluate_si(nodes)
        fc = load.evaluate_si(checks)
        scale = max(scale, float(np.max(np.abs(fn))), float(np.max(np.abs(fc))))
        coeffs = _monomial_on(a, b, fn)
        err = float(np.max(np.abs(np.polynomial.polynomial.polyval(checks - a, coeffs) - fc)))
        if err <= rtol * scale:
            accepted.append((a, b, coeffs))
            continue
        if len(accepted) + len(pending) + 2 > MAX_PIECES or half < MIN_WIDTH * (b_m - a_m):
            worst = max(worst, err / scale)
            raise OutOfScopeError(
                f"Function load {load.description!r} on x = {a_m:.6g} m to {b_m:.6g} m cannot be "
                f"integrated to the accuracy asked (rtol = {rtol:.1e}): near x = {mid:.6g} m the "
                f"fit is still off by {worst:.1e} × max|w| after halving to {2 * half:.2g} m. "
                "A step, spike or singularity in w does this; split the load at the "
                "discontinuity into separate loads, or loosen rtol"
            )
        pending.extend([(mid, b), (a, mid)])
    accepted.sort(key=lambda item: item[0])
    return tuple(SIPiece(a, b, tuple(float(c) for c in co)) for a, b, co in accepted)
