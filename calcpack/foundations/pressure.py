"""Contact pressure under a rigid footing with a no-tension base (pure mechanics).

The footing is rigid and the soil takes compression only, so the pressure is a plane cut off at
zero: q(x, y) = max(0, a + b·x + c·y). The plane is the one whose resultant equals the net
vertical load N and acts at its eccentricity (ex, ey):

    ∫ q dA = N,   ∫ q x dA = N·ex,   ∫ q y dA = N·ey      (over the contact area)

* **Full contact** (the resultant within the kern): the closed forms
  q = N/A · (1 ± 6ex/B ± 6ey/L) for a rectangle (kern |ex|/B + |ey|/L ≤ 1/6, a rhombus),
  q = N/A · (1 ± 8e/D) for a circle (kern e ≤ D/8); common practice.
* **Partial contact** (outside the kern): solved exactly on the base polygon. The integrals of
  1, x, y, x², xy, y² over the contact polygon are closed forms (Green's theorem), and the
  equations are linear in (a, b, c) for a given contact area, so the iteration
  (a, b, c) ← M(contact)⁻¹ · (N, N·ex, N·ey) is Newton's method; it is damped until the residual
  falls. For one-way eccentricity on a rectangle it gives the triangle
  q_max = 2N / (3 L (B/2 − e)) (common practice). A round base is a polygon of 720 sides with the
  circle's area.

A resultant on or outside the base has no equilibrium (the footing overturns): refused with
:class:`~calcpack.errors.OutOfScopeError`; the overturning check reports it as NOT OK.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

import numpy as np

from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity

__all__ = ["SoilPressure", "clip_polygon", "polygon_moments", "soil_pressure"]

Point = tuple[float, float]


def polygon_moments(poly: Sequence[Point]) -> np.ndarray:
    """[A, ∫x, ∫y, ∫x², ∫xy, ∫y²] of a simple polygon (counter-clockwise positive)."""
    A = Sx = Sy = Ixx = Ixy = Iyy = 0.0
    n = len(poly)
    for i in range(n):
        x0, y0 = poly[i]
        x1, y1 = poly[(i + 1) % n]
        cr = x0 * y1 - x1 * y0
        A += cr
        Sx += (x0 + x1) * cr
        Sy += (y0 + y1) * cr
        Ixx += (x0 * x0 + x0 * x1 + x1 * x1) * cr
        Iyy += (y0 * y0 + y0 * y1 + y1 * y1) * cr
        Ixy += (x0 * y1 + 2 * x0 * y0 + 2 * x1 * y1 + x1 * y0) * cr
    return np.array([A / 2, Sx / 6, Sy / 6, Ixx / 12, Ixy / 24, Iyy / 12])


def clip_polygon(poly: Sequence[Point], a: float, b: float, c: float) -> list[Point]:
    """The part of ``poly`` where a + b·x + c·y ≥ 0 (one Sutherland-Hodgman pass)."""
    out: list[Point] = []
    n = len(poly)
    for i in range(n):
        p, q = poly[i], poly[(i + 1) % n]
        fp = a + b * p[0] + c * p[1]
        fq = a + b * q[0] + c * q[1]
        if fp >= 0:
            out.append(p)
        if (fp >= 0) != (fq >= 0):
            t = fp / (fp - fq)
            out.append((p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])))
    return out


def _matrix(m: np.ndarray) -> np.ndarray:
    A, Sx, Sy, Ixx, Ixy, Iyy = m
    return np.array([[A, Sx, Sy], [Sx, Ixx, Ixy], [Sy, Ixy, Iyy]])


def _inside(poly: Sequence[Point], x: float, y: float, margin: float) -> bool:
    """True if (x, y) is inside the convex polygon by more than ``margin``."""
    n = len(poly)
    for i in range(n):
        (x0, y0), (x1, y1) = poly[i], poly[(i + 1) % n]
        ex, ey = x1 - x0, y1 - y0
        dist = (ex * (y - y0) - ey * (x - x0)) / math.hypot(ex, ey)
        if dist <= margin:
            return False
    return True


def solve_plane(
    poly: Sequence[Point], N: float, ex: float, ey: float
) -> tuple[float, float, float]:
    """(a, b, c) of the no-tension pressure plane on ``poly`` (SI floats: N, m).

    Raises:
        OutOfScopeError: the resultant is on or outside the base; no convergence.
    """
    size = max(max(abs(p[0]), abs(p[1])) for p in poly)
    if not _inside(poly, ex, ey, 1e-9 * size):
        raise OutOfScopeError(
            f"The resultant of the loads lies on or outside the footing base (eccentricity "
            f"ex = {ex:.4g} m, ey = {ey:.4g} m): the footing overturns; no contact pressure "
            "exists"
        )
    # scale to a unit footing for conditioning
    pts = [(x / size, y / size) for x, y in poly]
    r = np.array([1.0, ex / size, ey / size])
    p = np.linalg.solve(_matrix(polygon_moments(pts)), r)

    def residual(v: np.ndarray) -> float:
        cp = clip_polygon(pts, *v)
        if len(cp) < 3:
            return math.inf
        return float(np.linalg.norm(_matrix(polygon_moments(cp)) @ v - r))

    res = residual(p)
    for _ in range(200):
        if res < 1e-13:
            break
        cp = clip_polygon(pts, *p)
        step = np.linalg.solve(_matrix(polygon_moments(cp)), r) - p
        t = 1.0
        while t > 1e-6:
            trial = p + t * step
            rt = residual(trial)
            if rt < res:
                p, res = trial, rt
                break
            t /= 2
        else:
            break
    if res > 1e-9:
        raise OutOfScopeError(  # pragma: no cover - converges for any resultant inside the base
            f"The contact pressure did not converge (ex = {ex:.4g} m, ey = {ey:.4g} m)"
        )
    a, b, c = p
    return float(a * N / size**2), float(b * N / size**3), float(c * N / size**3)


@dataclass(frozen=True)
class SoilPressure:
    """The contact pressure under a footing for one load.

    Attributes:
        N: net vertical load on the soil (down +). ex, ey: its eccentricity from the centre.
        q_max, q_min: largest and smallest pressure on the base (q_min = 0 in partial
            contact). full_contact: the whole base is in compression (resultant in the kern).
        contact_area: area in compression. kern: the kern limit stated for the shape.
        plane: (a [Pa], b [Pa/m], c [Pa/m]) with q = max(0, a + b·x + c·y) (SI floats).
        outline: the base polygon in metres. method: words for the working.
    """

    N: Quantity
    ex: Quantity
    ey: Quantity
    q_max: Quantity
    q_min: Quantity
    full_contact: bool
    contact_area: Quantity
    area: Quantity
    kern: str
    plane: tuple[float, float, float]
    outline: tuple[Point, ...]
    method: str

    def at(self, x: Quantity, y: Quantity) -> Quantity:
        """The pressure at (x, y) (zero outside the contact area)."""
        a, b, c = self.plane
        q = a + b * x.to("m").magnitude + c * y.to("m").magnitude
        return Q_(max(q, 0.0), "Pa").to("kPa")

    def beyond(
        self, axis: Literal["x", "y"], x0: Quantity, sign: int = 1
    ) -> tuple[Quantity, Quantity]:
        """Resultant force and its moment about the line axis = x0 of the pressure on the part
        of the base beyond it (axis "x": x·sign > x0·sign), as (force, moment); the moment
        about the line is positive, pressure times lever arm."""
        a, b, c = self.plane
        s = x0.to("m").magnitude
        # region: sign*(coord - s) >= 0, and q >= 0
        half = (-sign * s, float(sign), 0.0) if axis == "x" else (-sign * s, 0.0, float(sign))
        part = clip_polygon(clip_polygon(list(self.outline), a, b, c), *half)
        if len(part) < 3:
            return Q_(0.0, "kN"), Q_(0.0, "kN*m")
        m = polygon_moments(part)
        A, Sx, Sy, Ixx, Ixy, Iyy = m
        F = a * A + b * Sx + c * Sy
        first = a * Sx + b * Ixx + c * Ixy if axis == "x" else a * Sy + b * Ixy + c * Iyy
        M = sign * (first - s * F)
        return Q_(F, "N").to("kN"), Q_(M, "N*m").to("kN*m")


def soil_pressure(
    outline: Sequence[Point],
    N: Quantity,
    ex: Quantity,
    ey: Quantity,
    *,
    shape: str,
    B: Quantity,
    L: Quantity,
) -> SoilPressure:
    """The no-tension contact pressure under a rigid base (see the module notes).

    Args:
        outline: base polygon in metres, counter-clockwise, centred at the origin.
        N: net vertical load, down positive [force] (must be > 0). ex, ey: eccentricity
            [length]. shape: ``"round"`` or a rectangle's shape name. B, L: base sizes.

    Raises:
        InputError: N not positive (net uplift: see the uplift check). OutOfScopeError: the
            resultant on or outside the base.
    """
    N_N = N.to("N").magnitude
    if not N_N > 0:
        raise InputError(
            f"Input N (net vertical load on the soil) must be positive for a contact pressure "
            f"(got N = {N.to('kN'):~P}): the footing is lifted off; see the uplift check",
            name="N",
            value=N,
            expected="a downward net load",
        )
    ex_m, ey_m = ex.to("m").magnitude, ey.to("m").magnitude
    B_m, L_m = B.to("m").magnitude, L.to("m").magnitude
    poly = tuple((float(x), float(y)) for x, y in outline)
    if shape == "round":
        A = math.pi * B_m**2 / 4
        e = math.hypot(ex_m, ey_m)
        full = e <= B_m / 8 * (1 + 1e-12)
        kern = "circle of radius D/8 (e ≤ D/8)"
        if full:
            S = math.pi * B_m**3 / 32
            qmax, qmin = N_N / A + N_N * e / S, N_N / A - N_N * e / S
            b = N_N * ex_m / (math.pi * B_m**4 / 64)
            c = N_N * ey_m / (math.pi * B_m**4 / 64)
            plane = (N_N / A, b, c)
    else:
        A = B_m * L_m
        full = 6 * abs(ex_m) / B_m + 6 * abs(ey_m) / L_m <= 1 + 1e-12
        kern = "rhombus |ex|/B + |ey|/L ≤ 1/6"
        if full:
            qmax = N_N / A * (1 + 6 * abs(ex_m) / B_m + 6 * abs(ey_m) / L_m)
            qmin = N_N / A * (1 - 6 * abs(ex_m) / B_m - 6 * abs(ey_m) / L_m)
            plane = (N_N / A, 12 * N_N * ex_m / (A * B_m**2), 12 * N_N * ey_m / (A * L_m**2))
    if full:
        return SoilPressure(
            N.to("kN"),
            ex.to("m"),
            ey.to("m"),
            Q_(qmax, "Pa").to("kPa"),
            Q_(max(qmin, 0.0), "Pa").to("kPa"),
            True,
            Q_(A, "m**2"),
            Q_(A, "m**2"),
            kern,
            plane,
            poly,
            "full contact (resultant within the kern): q = N/A ± M/S",
        )
    a, b, c = solve_plane(poly, N_N, ex_m, ey_m)
    contact = clip_polygon(poly, a, b, c)
    qmax = max(a + b * x + c * y for x, y in poly)
    return SoilPressure(
        N.to("kN"),
        ex.to("m"),
        ey.to("m"),
        Q_(qmax, "Pa").to("kPa"),
        Q_(0.0, "kPa"),
        False,
        Q_(float(polygon_moments(contact)[0]), "m**2"),
        Q_(A, "m**2"),
        kern,
        (a, b, c),
        poly,
        "partial contact (resultant outside the kern): no-tension plane solved on the base",
    )
