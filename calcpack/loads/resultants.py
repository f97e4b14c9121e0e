"""Resultants of distributed loads: P = ∫w dx and its line of action x̄ = ∫x·w dx / P.

Both integrals are exact for polynomial loads (term by term); a :class:`FunctionLoad` is first
replaced by its piecewise-polynomial fit, so its resultant carries the fit's stated accuracy.
"""

from __future__ import annotations

from dataclasses import dataclass

from calcpack.loads.types import DistributedLoad, SIPiece
from calcpack.units import Q_, Quantity

__all__ = ["Resultant", "resultant", "resultant_si"]


@dataclass(frozen=True)
class Resultant:
    """The statically equivalent point force of a distributed load.

    Attributes:
        P: total force ∫w dx, downward + [force].
        x_bar: its position from the beam's left end, ∫x·w dx / P [length]; None if P = 0.
        first_moment: ∫x·w dx about x = 0 [force·length] (defined even when P = 0, when the
            load is equivalent to a couple).
    """

    P: Quantity
    x_bar: Quantity | None
    first_moment: Quantity


def resultant_si(pieces: tuple[SIPiece, ...]) -> tuple[float, float]:
    """(∫w dx in N, ∫x·w dx in N·m) for SI pieces."""
    total = 0.0
    first = 0.0
    for p in pieces:
        h = p.b_m - p.a_m
        for k, c in enumerate(p.coeffs):
            area = c * h ** (k + 1) / (k + 1)
            total += area
            first += p.a_m * area + c * h ** (k + 2) / (k + 2)
    return total, first


def resultant(load: DistributedLoad) -> Resultant:
    """The resultant force of ``load`` and its position (P downward +, x̄ from the left end).

    The load must have both ends set (a load with ``end=None`` is resolved when it is added to
    a beam; use the beam's ``loads``).
    """
    pieces = load.si_pieces()
    total, first = resultant_si(pieces)
    # The size of the load regardless of sign, to tell a true zero resultant from round-off.
    gross = sum(
        abs(c) * (p.b_m - p.a_m) ** (k + 1) / (k + 1)
        for p in pieces
        for k, c in enumerate(p.coeffs)
    )
    x_bar = None
    if abs(total) > 1e-12 * gross:
        x_bar = Q_(first / total, "m").to(load.start.units)
    return Resultant(
        P=Q_(total, "N").to("kN"),
        x_bar=x_bar,
        first_moment=Q_(first, "N*m").to("kN*m"),
    )
