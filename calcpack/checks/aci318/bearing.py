"""ACI CODE-318-19 §22.8 (and §14.5.6 for plain concrete): bearing of a column, post or base
plate on the footing, written once for reinforced and plain footings and piers.

Provisions must be confirmed against the edition adopted locally.
"""

from __future__ import annotations

import math
from typing import Any

from calcpack.checks.aci318.footing_data import FootingActions
from calcpack.checks.base import Recorder
from calcpack.checks.bearing_area import loaded_area, similar_area_ratio

__all__ = ["bearing_on_footing"]


def bearing_on_footing(
    c: Recorder,
    a: FootingActions,
    fc: Any,
    *,
    phi: float,
    rule: str,
    strength_ref: str,
    check_ref: str,
) -> None:
    """Bearing of the column, post or base plate on the footing: φ·0.85·f'c·A_1·√(A_2/A_1),
    √(A_2/A_1) ≤ 2 (ACI 318-19 §22.8.3.2; §14.5.6.1 for plain concrete with its φ).

    A_2 is the largest area similar to and concentric with A_1 on the footing within the
    1V:2H frustum through its thickness (:func:`calcpack.checks.bearing_area.
    similar_area_ratio`). Forces in kip, areas in in².
    """
    f = a.footing
    col = f.column
    Pu = c.given("P_u_b", a.Pu, f"factored column load, {a.Pu_combination}", unit="kip")
    round_col = col.shape == "round" and col.support != "base plate"
    A1 = c.given(
        "A_1",
        loaded_area(col.loaded1, col.loaded2, round_=round_col),
        "loaded area",
        unit="inch**2",
    )
    support = (f.B, f.length)
    if a.equivalent_square:
        # a round footing is designed as the square of equal area; the area A_2 must lie
        # on the circle itself, of diameter 2B/√π
        D = 2 * f.B / math.sqrt(math.pi)
        support = (D, D)
    ratio = similar_area_ratio(
        (col.loaded1, col.loaded2),
        support,
        f.h,
        "ACI 318-19",
        loaded_round=round_col,
        support_round=a.equivalent_square,
    )
    r = c.given(
        "r_A",
        ratio,
        "√(A2/A1): similar area concentric on the footing, within the 1:2 frustum, at most 2",
        source=rule,
    )
    pB = c.derive(
        "phi_B_n",
        phi * 0.85 * fc * A1 * r,
        f"design bearing strength, φ = {phi:.2f}",
        unit="kip",
        ref=strength_ref,
    )
    c.check("Bearing", Pu, pB, ref=check_ref, combination=a.Pu_combination)
