"""Governing tension and compression of each truss member over combinations, for members that
reverse under uplift.

Reference: the king post truss by the method of joints (common practice, any statics text):
with a total vertical load P at the apex (the apex load plus the ceiling load at L1 carried up
the king post), each rafter carries -P / (2 sin θ), the tie P / (2 tan θ) and the king post the
ceiling load (tension).
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.truss_envelope import member_envelopes
from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import combine_results, solve_truss_cases
from calcpack.errors import InputError
from calcpack.units import ureg

m, kN = ureg.m, ureg.kN
A, H = 4.0, 2.0  # half span and rise, m


def _combos() -> dict[str, object]:
    truss = Truss.build(
        nodes={
            "L0": (0 * m, 0 * m),
            "L1": (A * m, 0 * m),
            "L2": (2 * A * m, 0 * m),
            "U1": (A * m, H * m),
        },
        members=[("L0", "L1"), ("L1", "L2"), ("L0", "U1"), ("U1", "L2"), ("L1", "U1")],
        supports={"L0": "pin", "L2": "roller"},
        loads=[
            JointLoad("U1", Fy=-6 * kN, case="D"),
            JointLoad("L1", Fy=-2 * kN, case="D"),
            JointLoad("U1", Fy=12 * kN, case="W"),  # net suction on the roof
        ],
    )
    cases = solve_truss_cases(truss)
    return {
        "D": combine_results(cases, {"D": 1.0}, label="D"),
        "0.6D + 0.6W": combine_results(cases, {"D": 0.6, "W": 0.6}, label="0.6D + 0.6W"),
    }


def _closed_form(P_apex: float, P_ceiling: float) -> dict[str, float]:
    theta = math.atan2(H, A)
    P = P_apex + P_ceiling
    return {
        "L0U1": -P / (2 * math.sin(theta)),
        "L0L1": P / (2 * math.tan(theta)),
        "L1U1": P_ceiling,
    }


def test_members_that_reverse_under_uplift_get_both_signs_with_their_combinations() -> None:
    env = member_envelopes(_combos(), factors={"D": 0.9, "0.6D + 0.6W": 1.6})
    gravity = _closed_form(6.0, 2.0)
    uplift = _closed_form(0.6 * 6.0 - 0.6 * 12.0, 0.6 * 2.0)
    rafter, tie, king = env["L0U1"], env["L0L1"], env["L1U1"]
    assert rafter.reverses
    assert tie.reverses
    assert not king.reverses  # the ceiling load keeps it in tension
    assert rafter.compression is not None
    assert rafter.tension is not None
    assert rafter.compression.force.to("kN").magnitude == pytest.approx(gravity["L0U1"])
    assert rafter.compression.combination == "D"
    assert rafter.tension.force.to("kN").magnitude == pytest.approx(uplift["L0U1"])
    assert rafter.tension.combination == "0.6D + 0.6W"
    assert rafter.tension.factor == 1.6
    assert tie.compression is not None
    assert tie.compression.force.to("kN").magnitude == pytest.approx(uplift["L0L1"])
    assert king.tension is not None
    assert king.compression is None
    # weighed by C_D: 2 / 0.9 > 1.2 / 1.6, so the gravity combination governs the king post
    assert king.tension.combination == "D"
    assert king.tension.force.to("kN").magnitude == pytest.approx(gravity["L1U1"])


def test_the_factor_decides_which_combination_governs() -> None:
    combos = _combos()
    # with a much larger factor on D, the smaller uplift tension of the king post would not
    # govern anyway; with the factors reversed the governing tension can move
    env = member_envelopes(combos, factors={"D": 5.0, "0.6D + 0.6W": 1.0})
    king = env["L1U1"].tension
    assert king is not None
    assert king.combination == "0.6D + 0.6W"  # 1.2 / 1.0 > 2 / 5


@pytest.mark.parametrize(
    ("kwargs", "words"),
    [
        ({"factors": {"D": 0.9}}, r"0.6D \+ 0.6W"),
        ({"factors": {"D": 0.0, "0.6D + 0.6W": 1.6}}, "positive"),
        ({"members": ["L9U9"]}, "L9U9"),
    ],
)
def test_bad_input_is_refused_naming_it(kwargs: dict[str, object], words: str) -> None:
    with pytest.raises(InputError, match=words):
        member_envelopes(_combos(), **kwargs)  # type: ignore[arg-type]
    with pytest.raises(InputError, match="at least one combination"):
        member_envelopes({})
