"""Footing capacities never fall as the footing gets thicker or the concrete stronger
(ACI 318-19 §22.2 flexure, Chapter 14 plain concrete, §22.6 two-way shear, §22.8 bearing)."""

from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.combinations.asce7 import asce7_strength
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_


def _run(B_ft, h_in, fc, reinforced, P):
    f = Footing("square", Q_(B_ft, "ft"), Q_(h_in, "inch"), Column(Q_(12, "inch")))
    d = ACIFootingDesign(f_c=Q_(fc, "psi"), bar="#5", reinforced=reinforced)
    return check_aci_footing(f, {"D": FootingLoad(P=Q_(P, "kip"))}, asce7_strength(), d)


@settings(max_examples=15, deadline=None)
@given(B=st.floats(4, 10), h=st.floats(12, 30), dh=st.floats(1, 10), P=st.floats(20, 300))
def test_reinforced_flexure_capacity_grows_with_depth(B, h, dh, P):
    a, b = _run(B, h, 4000, True, P), _run(B, h + dh, 4000, True, P)
    assert b["Flexure x"].capacity >= a["Flexure x"].capacity
    assert b["Bearing"].capacity >= a["Bearing"].capacity


@settings(max_examples=15, deadline=None)
@given(B=st.floats(3, 8), h=st.floats(10, 24), fc=st.floats(2500, 6000), dfc=st.floats(100, 4000))
def test_plain_capacity_grows_with_depth_and_strength(B, h, fc, dfc):
    a = _run(B, h, fc, False, 10)
    for b in (_run(B, h + 2, fc, False, 10), _run(B, h, min(fc + dfc, 10000), False, 10)):
        assert b["Flexure x"].capacity >= a["Flexure x"].capacity
        assert b["Bearing"].capacity >= a["Bearing"].capacity
