"""Elastic critical moment M_cr of a doubly symmetric beam segment between fork supports
(lateral and torsional restraint, free to rotate on plan and to warp: k = k_w = 1), for any
major-axis moment diagram and load height, by the Rayleigh-Ritz method; and the reduction
factors χ of EN 1993-1-1 §6.3.1.2 and §6.3.2.2/§6.3.2.3 (with the f modification, §6.3.2.3(2)).

M_cr: lateral deflection u and twist φ are sine series of n terms (they meet the fork
conditions u = φ = u'' = φ'' = 0 at the ends). The second variation of the total potential is
½∫(E I_z u''² + E I_w φ''² + G I_t φ'²)dx − λ[∫ M u'' φ dx + ½ Σ ΔP z_g φ²], whose smallest
positive λ scales the moments to the critical state. ΔP is the transverse load (downward +),
read as the drop in shear force along the segment; z_g is the height of the load above the
shear centre (top flange loading z_g = h/2 is destabilising). Converged to 4 figures with 24
terms for the diagrams of a beam; checked in the tests against the closed form for uniform
moment and the published C1 and C2 factors (uniform load, point load at midspan).

C1 = M_cr / M_cr,uniform for the same segment with loads at the shear centre.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import Any

import numpy as np

from calcpack.errors import InputError

__all__ = ["chi_flexural", "chi_lt", "critical_moment", "f_modification", "mcr_uniform"]

N_TERMS = 24


def mcr_uniform(E: float, G: float, Iz: float, It: float, Iw: float, L: float) -> float:
    """M_cr under uniform moment, fork supports (SI units): π/L √(E I_z (G I_t + π² E I_w/L²))."""
    return math.pi / L * math.sqrt(E * Iz * (G * It + math.pi**2 * E * Iw / L**2))


def critical_moment(
    *,
    E: float,
    G: float,
    Iz: float,
    It: float,
    Iw: float,
    L: float,
    x: Sequence[float] | Any,
    M: Sequence[float] | Any,
    dP: Sequence[float] | Any = (),
    x_dP: Sequence[float] | Any = (),
    zg: float = 0.0,
    n_terms: int = N_TERMS,
) -> float:
    """The elastic critical moment of the segment: max |M| at the critical state (SI units).

    Args:
        E, G, Iz, It, Iw, L: moduli (Pa), section constants (m⁴, m⁶), segment length (m).
        x, M: the moment diagram sampled along the segment, 0 ≤ x ≤ L (sagging +, N·m).
        dP, x_dP: transverse loads (N, downward +) and where they act, for the load height.
        zg: height of the loads above the shear centre (m).

    Returns:
        M_cr (N·m): the largest |M| on the segment at the critical state.

    Raises:
        InputError: no moment, or the segment does not buckle under these moments.
    """
    xs = np.asarray(x, dtype=float)
    ms = np.asarray(M, dtype=float)
    mmax = float(np.max(np.abs(ms))) if ms.size else 0.0
    if mmax <= 0.0:
        raise InputError(
            "The moment diagram on the segment is zero: there is no M_cr to find",
            name="M",
            value=0.0,
            expected="a non-zero moment diagram",
        )
    n = np.arange(1, n_terms + 1)
    k = n * math.pi / L
    # stiffness (diagonal): ∫ sin² = L/2
    Ku = E * Iz * k**4 * L / 2
    Kp = (E * Iw * k**4 + G * It * k**2) * L / 2
    # Gauss-Legendre on each sampling interval (the diagram is piecewise smooth between them)
    gx, gw = np.polynomial.legendre.leggauss(6)
    a, b = xs[:-1], xs[1:]
    pts = (0.5 * (b - a)[:, None] * gx[None, :] + 0.5 * (a + b)[:, None]).ravel()
    wts = (0.5 * (b - a)[:, None] * gw[None, :]).ravel()
    mpts = np.interp(pts, xs, ms) / mmax
    S = np.sin(np.outer(n, pts) * math.pi / L)  # (n, pts)
    # ∫ M u'' φ dx with u'' = -k_i² a_i sin, φ = b_j sin  ->  C_ij = k_i² ∫ M s_i s_j
    C = (k**2)[:, None] * ((S * (mpts * wts)) @ S.T)
    H = np.zeros((n_terms, n_terms))
    if zg != 0.0 and len(dP):
        xp = np.asarray(x_dP, dtype=float)
        Sp = np.sin(np.outer(n, xp) * math.pi / L)
        H = zg * (Sp * (np.asarray(dP, dtype=float) / mmax)) @ Sp.T
    Gm = np.block([[np.zeros((n_terms, n_terms)), C], [C.T, H]])
    d = 1 / np.sqrt(np.concatenate([Ku, Kp]))
    A = d[:, None] * Gm * d[None, :]
    mu = np.linalg.eigvalsh(0.5 * (A + A.T))
    top = float(mu[-1])
    if top <= 0:
        raise InputError(  # pragma: no cover - a non-zero diagram always buckles one way
            "The segment does not buckle laterally under this moment diagram",
            name="M",
            value=mmax,
            expected="a diagram that compresses a flange",
        )
    return 1.0 / top


def _phi_chi(alpha: float, lam: float, lam0: float, beta: float) -> float:
    phi = 0.5 * (1 + alpha * (lam - lam0) + beta * lam**2)
    return 1 / (phi + math.sqrt(phi**2 - beta * lam**2))


def chi_flexural(alpha: float, lam: float) -> float:
    """χ of EN 1993-1-1 Eq. (6.49): 1 for λ̄ ≤ 0.2."""
    if lam <= 0.2:
        return 1.0
    return min(1.0, _phi_chi(alpha, lam, 0.2, 1.0))


def chi_lt(alpha: float, lam: float, method: str) -> float:
    """χ_LT: §6.3.2.2 Eq. (6.56) (λ̄_LT,0 = 0.2, β = 1) or §6.3.2.3 Eq. (6.57) with the UK NA
    values λ̄_LT,0 = 0.4, β = 0.75 (χ_LT ≤ 1 and ≤ 1/λ̄_LT²)."""
    lam0, beta = (0.2, 1.0) if method == "6.3.2.2" else (0.4, 0.75)
    if lam <= lam0:
        return 1.0
    chi = _phi_chi(alpha, lam, lam0, beta)
    if method == "6.3.2.3":
        chi = min(chi, 1 / lam**2)
    return min(1.0, chi)


def f_modification(kc: float, lam: float) -> float:
    """f of §6.3.2.3(2): 1 − 0.5 (1 − k_c)[1 − 2 (λ̄_LT − 0.8)²], at most 1."""
    return min(1.0, 1 - 0.5 * (1 - kc) * (1 - 2 * (lam - 0.8) ** 2))
