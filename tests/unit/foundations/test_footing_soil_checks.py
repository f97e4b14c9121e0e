"""Service soil checks: bearing, overturning, sliding, uplift and founding depth.

Reference values are closed forms of the trade (common practice): q = N/A; overturning
resisted by N·B/2 about the toe; sliding resisted by μ·N + P_p; uplift resisted by the
factored self weight plus any anchor.
"""

from __future__ import annotations

import pytest

from calcpack.combinations.asce7 import asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.foundations import Column, Footing, FootingLoad, SiteConditions
from calcpack.foundations.stability import AllowableBearing, SafetyFactors, check_footing_soil
from calcpack.units import Q_


def _footing(**kw):
    return Footing(
        "square",
        Q_(1.5, "m"),
        Q_(0.3, "m"),
        Column(Q_(0.15, "m")),
        gamma_concrete=Q_(24, "kN/m**3"),
        **kw,
    )


BEARING = AllowableBearing(Q_(150, "kPa"), "invented geotechnical report GR-1, §4", friction=0.4)


def test_concentric_bearing_is_N_over_A():
    f = _footing()
    r = check_footing_soil(
        f,
        {"D": FootingLoad(P=Q_(100, "kN")), "L": FootingLoad(P=Q_(80, "kN"))},
        asce7_allowable_stress(),
        BEARING,
    )
    W = 24 * 1.5 * 1.5 * 0.3
    chk = r["Bearing pressure"]
    assert chk.demand.to("kPa").magnitude == pytest.approx((180 + W) / 2.25)  # N/A
    assert chk.combination.startswith("2:")
    assert chk.verdict == "OK"


def test_overturning_resisted_by_N_B_over_2():
    f = _footing()
    loads = {"D": FootingLoad(P=Q_(50, "kN")), "W": FootingLoad(Vx=Q_(10, "kN"), My=Q_(20, "kN*m"))}
    r = check_footing_soil(
        f, loads, asce7_allowable_stress(), BEARING, safety=SafetyFactors(overturning=1.5)
    )
    W = 24 * 1.5 * 1.5 * 0.3
    chk = r["Overturning y"]
    # governing: 0.6D + 0.6W: M_ot = 0.6·(20 + 10·0.3), N = 0.6·(50 + W)
    assert chk.demand.to("kN*m").magnitude == pytest.approx(1.5 * 0.6 * 23)
    assert chk.capacity.to("kN*m").magnitude == pytest.approx(0.6 * (50 + W) * 0.75)
    s = r["Sliding"]
    assert s.capacity.to("kN").magnitude == pytest.approx(0.4 * 0.6 * (50 + W))


def test_uplift_beyond_resisting_weight_without_anchor_is_not_ok():
    f = _footing()
    loads = {"D": FootingLoad(P=Q_(5, "kN")), "W": FootingLoad(P=Q_(-40, "kN"))}
    r = check_footing_soil(f, loads, asce7_allowable_stress(), BEARING)
    up = r["Uplift"]
    assert up.verdict == "NOT OK"
    assert "no anchor" in up.description
    anchored = check_footing_soil(
        f, loads, asce7_allowable_stress(), BEARING, safety=SafetyFactors(anchor=Q_(60, "kN"))
    )
    assert anchored["Uplift"].verdict == "OK"


def test_sliding_without_friction_is_not_covered():
    f = _footing()
    loads = {"D": FootingLoad(P=Q_(50, "kN")), "W": FootingLoad(Vx=Q_(5, "kN"))}
    r = check_footing_soil(
        f, loads, asce7_allowable_stress(), AllowableBearing(Q_(150, "kPa"), "invented report")
    )
    assert r["Sliding"].verdict == "NOT COVERED"


def test_founding_depth_against_frost():
    f = _footing(soil_cover=Q_(0.5, "m"), gamma_soil=Q_(18, "kN/m**3"))
    r = check_footing_soil(
        f,
        {"D": FootingLoad(P=Q_(50, "kN"))},
        asce7_allowable_stress(),
        BEARING,
        site=SiteConditions(frost_depth=Q_(1.0, "m")),
    )
    assert r["Founding depth"].verdict == "NOT OK"


def test_net_basis_subtracts_overburden():
    f = _footing(soil_cover=Q_(0.5, "m"), gamma_soil=Q_(18, "kN/m**3"))
    b = AllowableBearing(Q_(150, "kPa"), "invented report", basis="net")
    r = check_footing_soil(f, {"D": FootingLoad(P=Q_(100, "kN"))}, asce7_allowable_stress(), b)
    gross = (100 + f.concrete_weight.to("kN").magnitude + f.soil_weight.to("kN").magnitude) / 2.25
    assert r["Bearing pressure"].demand.to("kPa").magnitude == pytest.approx(gross - 18 * 0.8)


def test_working_shows_every_check():
    f = _footing()
    loads = {
        "D": FootingLoad(P=Q_(50, "kN")),
        "W": FootingLoad(P=Q_(-60, "kN"), Vx=Q_(3, "kN"), My=Q_(4, "kN*m")),
    }
    r = check_footing_soil(f, loads, asce7_allowable_stress(), BEARING)
    text = "\n".join(str(s) for s in r.working())
    for word in ("Bearing pressure", "Overturning", "Sliding", "Uplift", "geotechnical"):
        assert word in text


def test_bearing_needs_a_source():
    with pytest.raises(InputError, match="Input source"):
        AllowableBearing(Q_(150, "kPa"), " ")
    with pytest.raises(InputError, match="Input q_allow"):
        AllowableBearing(Q_(-150, "kPa"), "x")
