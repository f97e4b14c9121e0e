"""The enhancement of concrete bearing by the area around the loaded one, written once for the
standards that use it: the largest area *similar to and concentric with* the loaded area that
fits the supporting member, and how far the load may spread through its depth.

* ACI CODE-318-19 §22.8.3.2 (and §14.5.6.1 for plain concrete): √(A_2/A_1) ≤ 2, A_2 the lower
  base of the frustum with side slopes of 1 vertical to 2 horizontal wholly within the support,
  taken geometrically similar to and concentric with A_1 (Commentary R22.8.3.2): each side
  grows by at most 4h through a depth h;
* EN 1992-1-1:2004 §6.7(2), Figure 6.29: √(A_c1/A_c0) ≤ 3, A_c1 similar in shape to A_c0 with
  its centre on the line of action of the load, b_2 − b_1 ≤ h and b_2 ≤ 3b_1 for each side
  (the conditions of the figure, from memory).

Similar areas scale both sides by one factor k, so √(A_2/A_1) = k: the least of the ratios the
support's plan, the depth and the standard's cap allow, and never less than 1 (the loaded area
itself lies on the support). The centred position is an assumption the callers state.
Provisions must be confirmed against the edition adopted locally.
"""

from __future__ import annotations

import math
from typing import Literal

from calcpack.units import Quantity, si
from calcpack.validate import one_of, positive

__all__ = ["SPREAD", "Rule", "loaded_area", "similar_area_ratio"]

Rule = Literal["ACI 318-19", "EN 1992-1-1"]

# how much a side of the loaded area may grow per unit depth, and the cap on √(A_2/A_1)
SPREAD: dict[str, tuple[float, float]] = {
    "ACI 318-19": (4.0, 2.0),  # 1V:2H on both sides; §22.8.3.2
    "EN 1992-1-1": (1.0, 3.0),  # b_2 - b_1 <= h, b_2 <= 3 b_1; Figure 6.29
}


def similar_area_ratio(
    loaded: tuple[Quantity, Quantity],
    support: tuple[Quantity, Quantity],
    depth: Quantity,
    rule: Rule,
    *,
    loaded_round: bool = False,
    support_round: bool = False,
) -> float:
    """√(A_2/A_1) for a loaded area l_1 × l_2 centred on a support B × L of depth h.

    Args:
        loaded: the sides of the loaded area (l_1 along B, l_2 along L), lengths; for a round
            loaded area (``loaded_round``) its diameter twice.
        support: the plan of the supporting member (B, L), lengths; for a round support
            (``support_round``) its diameter twice.
        depth: the depth through which the load spreads (the footing's or padstone's
            thickness), a length.
        rule: the standard whose spread and cap apply (``SPREAD``).

    Returns:
        k, the largest factor by which the loaded area may be scaled about its centre and
        still lie on the support (a rectangle's corners within a round support, a circle's
        diameter within a rectangle's shorter side), with each side grown by at most s·h
        through the depth and k at most the cap; at least 1 (dimensionless).
    """
    one_of("rule", rule, tuple(SPREAD))
    l1, l2 = (positive(n, si(q)) for n, q in (("l_1", loaded[0]), ("l_2", loaded[1])))
    B, L = (positive(n, si(q)) for n, q in (("B", support[0]), ("L", support[1])))
    h = positive("depth", si(depth), allow_zero=True)
    spread, cap = SPREAD[rule]
    if support_round:
        # a round support of diameter B: the scaled area's farthest point (a rectangle's
        # corner, a circle's edge) within radius B/2
        reach = l1 if loaded_round else math.hypot(l1, l2)
        plan = B / reach
    elif loaded_round:
        plan = min(B, L) / l1
    else:
        plan = min(B / l1, L / l2)
    k = min(plan, 1.0 + spread * h / max(l1, l2), cap)
    return max(1.0, k)


def loaded_area(l1: Quantity, l2: Quantity, *, round_: bool) -> Quantity:
    """The loaded area: l_1 × l_2, or π l_1²/4 for a round column bearing directly."""
    return math.pi * l1**2 / 4 if round_ else l1 * l2
