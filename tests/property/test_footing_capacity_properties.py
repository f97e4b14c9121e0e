"""Invariants of the ACI 318-19 footing checks as the footing gets thicker or the concrete
stronger (§22.2 flexure, Chapter 14 plain concrete, §22.6 two-way shear, §22.8 bearing).

The reinforced design re-chooses its bars for every depth (fewer bars are needed in a thicker
footing, though the minimum steel 0.0018·b·h grows), so the flexural strength *provided* is not
monotonic in depth and is not asserted to be. What does hold, and is asserted:

* the moment from the net soil pressure does not depend on the thickness;
* the steel required, A_s = 0.85·f'c·b/f_y·(d − √(d² − 2·M_u/(φ·0.85·f'c·b))), falls as d or
  f'c grows (it equals 2·M_u/(φ·f_y·(d + √(d² − 2·M_u/(φ·0.85·f'c·b)))), common practice);
* the bars chosen provide at least the steel required and the minimum steel, and resist the
  moment wherever the section is tension-controlled (φ = 0.90);
* the punching resistance as a force, φ·v_c·b_0·d, and the bearing strength grow with depth
  and with f'c (every term of Table 22.6.5.2 times b_0·d grows with d; √f'c is capped at 100 psi);
* plain concrete capacities grow with depth and strength (Chapter 14 section moduli and √f'c).
"""

from __future__ import annotations

from hypothesis import assume, given, settings
from hypothesis import strategies as st

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.checks.base import NOT_OK
from calcpack.combinations.asce7 import asce7_strength
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_

REL = 1e-9  # float round-off allowance on equal quantities


def _run(B_ft, h_in, fc, reinforced, P, size_effect=False):
    f = Footing("square", Q_(B_ft, "ft"), Q_(h_in, "inch"), Column(Q_(12, "inch")))
    d = ACIFootingDesign(
        f_c=Q_(fc, "psi"), bar="#5", reinforced=reinforced, size_effect=size_effect
    )
    return check_aci_footing(f, {"D": FootingLoad(P=Q_(P, "kip"))}, asce7_strength(), d)


def _punching_force(r):
    v = r.values
    return (v["phi_v_c"] * v["b_0"] * v["d_avg"]).to("kip").magnitude


def _flexure_steel_required(r):
    """A_s,req (in²), or None where the section is too thin for any singly reinforced steel."""
    if "A_s_req_x" not in r.values:
        # the too-thin branch must report the flexure check NOT OK, never a number that passes
        assert r["Flexure x"].verdict == NOT_OK
        return None
    return r.values["A_s_req_x"].to("inch**2").magnitude


@settings(max_examples=15, deadline=None)
@given(
    B=st.floats(4, 10),
    h=st.floats(12, 30),
    dh=st.floats(1, 10),
    P=st.floats(20, 300),
    size_effect=st.booleans(),
)
def test_reinforced_demand_steel_and_resistances_with_depth(B, h, dh, P, size_effect):
    a = _run(B, h, 4000, True, P, size_effect)
    b = _run(B, h + dh, 4000, True, P, size_effect)
    Ma, Mb = a.values["M_u_x"], b.values["M_u_x"]
    assert abs((Mb - Ma).to("kip*ft").magnitude) <= REL * Ma.to("kip*ft").magnitude
    req_a, req_b = _flexure_steel_required(a), _flexure_steel_required(b)
    if req_a is not None:
        assert req_b is not None
        assert req_b < req_a
    assert b["Bearing"].capacity >= a["Bearing"].capacity
    # two-way shear exists while the perimeter at d/2 lies inside the footing
    if "phi_v_c" in b.values:
        assert _punching_force(b) >= _punching_force(a) * (1 - REL)


@settings(max_examples=15, deadline=None)
@given(
    B=st.floats(4, 10),
    h=st.floats(12, 30),
    fc=st.floats(2500, 6000),
    dfc=st.floats(100, 4000),
    P=st.floats(20, 300),
)
def test_reinforced_steel_and_resistances_with_strength(B, h, fc, dfc, P):
    a = _run(B, h, fc, True, P)
    b = _run(B, h, min(fc + dfc, 10000), True, P)
    req_a, req_b = _flexure_steel_required(a), _flexure_steel_required(b)
    if req_a is not None:
        assert req_b is not None
        assert req_b < req_a
    assert b["Bearing"].capacity > a["Bearing"].capacity
    if "phi_v_c" in a.values:
        assert _punching_force(b) >= _punching_force(a) * (1 - REL)


@settings(max_examples=25, deadline=None)
@given(
    B=st.floats(3, 12),
    h=st.floats(12, 36),
    fc=st.floats(2500, 8000),
    P=st.floats(5, 400),
)
def test_chosen_bars_resist_the_moment_when_tension_controlled(B, h, fc, P):
    r = _run(B, h, fc, True, P)
    req = _flexure_steel_required(r)
    assume(req is not None)
    v = r.values
    As = v["A_s_x"].to("inch**2").magnitude
    assert As >= req * (1 - REL)
    assert As >= v["A_s_min_x"].to("inch**2").magnitude * (1 - REL)
    if v["phi_f_x"].magnitude == 0.90:
        assert r["Flexure x"].capacity >= r["Flexure x"].demand * (1 - REL)


@settings(max_examples=15, deadline=None)
@given(B=st.floats(3, 8), h=st.floats(10, 24), fc=st.floats(2500, 6000), dfc=st.floats(100, 4000))
def test_plain_capacity_grows_with_depth_and_strength(B, h, fc, dfc):
    a = _run(B, h, fc, False, 10)
    for b in (_run(B, h + 2, fc, False, 10), _run(B, h, min(fc + dfc, 10000), False, 10)):
        assert b["Flexure x"].capacity >= a["Flexure x"].capacity
        assert b["Bearing"].capacity >= a["Bearing"].capacity
