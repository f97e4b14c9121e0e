"""Design actions in a footing from the net factored soil pressure (pure mechanics).

The footing's own weight and the soil over it press down as much as the soil pushes them up,
so they bend and shear nothing; the footing is designed for the *net* pressure from the column
loads alone (common practice). For each combination the net pressure is the no-tension plane
of :mod:`calcpack.foundations.pressure` under the column load P and base moments.

* :func:`cantilever_actions`: shear force and moment at a section x = ±a (or y = ±a) from the
  pressure on the part of the base beyond it, the larger side;
* :func:`force_within`: the pressure resultant inside a convex outline (a punching perimeter),
  to be subtracted from the column load.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass

from calcpack.combinations.model import CombinationSet
from calcpack.foundations.geometry import Footing, FootingLoad
from calcpack.foundations.pressure import SoilPressure, clip_polygon, polygon_moments
from calcpack.foundations.stability import FootingCombination, footing_combinations
from calcpack.units import Q_, Quantity

__all__ = [
    "CantileverActions",
    "cantilever_actions",
    "force_within",
    "net_combinations",
    "rounded_rectangle",
]


@dataclass(frozen=True)
class CantileverActions:
    """Shear V and moment M at a section, per unit of the whole footing width, the larger of
    the two sides, with the side (+1 or -1) that governs."""

    V: Quantity
    M: Quantity
    side: int


def net_combinations(
    footing: Footing, loads: Mapping[str, FootingLoad], combinations: CombinationSet
) -> list[FootingCombination]:
    """Each factored combination with the net pressure (self weight excluded); combinations
    with net uplift or a resultant off the base carry ``pressure = None``."""
    return footing_combinations(footing, loads, combinations, include_self_weight=False)


def cantilever_actions(p: SoilPressure, axis: str, a: Quantity) -> CantileverActions:
    """V and M at x = ±a (axis ``"x"``) or y = ±a (axis ``"y"``) from the pressure beyond.

    Returns zero actions when the section lies outside the base.
    """
    best = None
    for side in (1, -1):
        V, M = p.beyond("x" if axis == "x" else "y", a * side, side)
        if best is None or M > best.M:
            best = CantileverActions(V, M, side)
    assert best is not None
    return best


def rounded_rectangle(
    a1: float, a2: float, r: float, segments: int = 16
) -> list[tuple[float, float]]:
    """Outline (metres, counter-clockwise) of a rectangle 2·a1 x 2·a2 grown by r with quarter
    circles at the corners (a Eurocode control perimeter); r = 0 gives the rectangle."""
    if r <= 0:
        return [(-a1, -a2), (a1, -a2), (a1, a2), (-a1, a2)]
    pts: list[tuple[float, float]] = []
    for cx, cy, start in ((a1, -a2, -90.0), (a1, a2, 0.0), (-a1, a2, 90.0), (-a1, -a2, 180.0)):
        for i in range(segments + 1):
            t = math.radians(start + 90.0 * i / segments)
            pts.append((cx + r * math.cos(t), cy + r * math.sin(t)))
    return pts


def force_within(p: SoilPressure, outline: Sequence[tuple[float, float]]) -> Quantity:
    """The resultant of the pressure inside the convex ``outline`` (metres, counter-clockwise)."""
    a, b, c = p.plane
    part = clip_polygon(list(p.outline), a, b, c)
    n = len(outline)
    for i in range(n):
        (x0, y0), (x1, y1) = outline[i], outline[(i + 1) % n]
        # inside is to the left of each edge: (x1-x0)(y-y0) - (y1-y0)(x-x0) >= 0
        part = clip_polygon(part, (y1 - y0) * x0 - (x1 - x0) * y0, -(y1 - y0), (x1 - x0))
        if len(part) < 3:
            return Q_(0.0, "kN")
    m = polygon_moments(part)
    return Q_(float(a * m[0] + b * m[1] + c * m[2]), "N").to("kN")
