"""Invariants of the bearing-area enhancement (calcpack.checks.bearing_area).

√(A_2/A_1) is the scale k of an area similar to and concentric with the loaded one: it is at
least 1 and at most the standard's cap, the scaled area lies on the support (a rectangle within
a rectangle; a rectangle's corners or a circle within a round support), it grows by no more
than the spread through the depth, a larger support never lowers it, and the units the sizes
are given in do not change it. Geometry only: common practice for similar figures.
"""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from calcpack.checks.bearing_area import SPREAD, Rule, similar_area_ratio
from calcpack.units import Q_

sizes = st.floats(min_value=50.0, max_value=3000.0, allow_nan=False)  # mm
depths = st.floats(min_value=0.0, max_value=2000.0, allow_nan=False)
rules = st.sampled_from(sorted(SPREAD))
TOL = 1e-9


def _mm(x: float) -> Q_:
    return Q_(x, "mm")


@given(sizes, sizes, sizes, sizes, depths, rules, st.booleans(), st.booleans())
def test_scale_is_bounded_and_the_area_fits(
    l1: float, l2: float, B: float, L: float, h: float, rule: Rule, lr: bool, sr: bool
) -> None:
    if lr:
        l2 = l1
    if sr:
        L = B
    k = similar_area_ratio(
        (_mm(l1), _mm(l2)), (_mm(B), _mm(L)), _mm(h), rule, loaded_round=lr, support_round=sr
    )
    spread, cap = SPREAD[rule]
    assert 1.0 <= k <= cap + TOL
    if k > 1.0:  # not held at the floor: the scaled area lies on the support, within the spread
        if sr:
            reach = l1 if lr else math.hypot(l1, l2)
            assert k * reach <= B * (1 + TOL)
        else:
            assert k * l1 <= B * (1 + TOL)
            assert k * l2 <= L * (1 + TOL)
        assert (k - 1) * max(l1, l2) <= spread * h * (1 + TOL) + TOL


@given(sizes, sizes, sizes, sizes, depths, rules, st.floats(min_value=1.0, max_value=3.0))
def test_a_larger_support_never_lowers_the_scale(
    l1: float, l2: float, B: float, L: float, h: float, rule: Rule, grow: float
) -> None:
    small = similar_area_ratio((_mm(l1), _mm(l2)), (_mm(B), _mm(L)), _mm(h), rule)
    large = similar_area_ratio(
        (_mm(l1), _mm(l2)), (_mm(B * grow), _mm(L * grow)), _mm(h * grow), rule
    )
    assert large >= small - TOL


@given(sizes, sizes, sizes, sizes, depths, rules)
def test_units_do_not_change_the_scale(
    l1: float, l2: float, B: float, L: float, h: float, rule: Rule
) -> None:
    def inch(x: float) -> Q_:
        return Q_(x / 25.4, "inch")

    si = similar_area_ratio((_mm(l1), _mm(l2)), (_mm(B), _mm(L)), _mm(h), rule)
    us = similar_area_ratio((inch(l1), inch(l2)), (inch(B), inch(L)), inch(h), rule)
    assert math.isclose(si, us, rel_tol=1e-12)
