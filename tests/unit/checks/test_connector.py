"""Proprietary connectors against their listed loads: demand from reactions by case under the
ASCE/SEI 7-16 §2.4.1 allowable stress combinations (the combinations as printed: 0.6D + 0.6W
is combination 7, D + L combination 2), worked by hand below; the listed loads are invented
inputs (a generic connector), as a job takes them from its evaluation report."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.connector import ConnectorListing, check_connector
from calcpack.combinations import asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.units import Q_

TIE = ConnectorListing("tie T1 (generic)", Q_(400, "lbf"), "evaluation report ER-0000, Table 2",
                       download=Q_(800, "lbf"))  # fmt: skip


def test_uplift_under_06d_06w_by_hand():
    # 0.6·80 − 0.6·200 = −72 lb (uplift); D + L = 480 lb (download)
    R = {"D": Q_(80, "lbf"), "L": Q_(400, "lbf"), "W": Q_(-200, "lbf")}
    r = check_connector(TIE, R, asce7_allowable_stress(), mark="J1 to BR1")
    up = r["Uplift"]
    assert up.demand.to("lbf").magnitude == pytest.approx(72.0, rel=1e-12)
    assert up.capacity.to("lbf").magnitude == 400.0
    assert up.combination.startswith("7")
    down = r["Download"]
    assert down.demand.to("lbf").magnitude == pytest.approx(480.0, rel=1e-12)
    assert down.combination.startswith("2")
    assert r.passed


def test_no_net_uplift_gives_zero_demand_and_no_download_check_when_not_listed():
    tie = ConnectorListing("tie T2 (generic)", Q_(300, "lbf"), "ER-0000, Table 2")
    r = check_connector(tie, {"D": Q_(200, "lbf"), "W": Q_(-100, "lbf")},
                        asce7_allowable_stress(), mark="x")  # fmt: skip
    assert r["Uplift"].demand.magnitude == 0.0
    assert r["Uplift"].combination is None
    assert [c.name for c in r.results] == ["Uplift"]


def test_too_much_uplift_is_not_ok():
    r = check_connector(TIE, {"D": Q_(100, "lbf"), "W": Q_(-1000, "lbf")},
                        asce7_allowable_stress(), mark="x")  # fmt: skip
    assert r["Uplift"].verdict == "NOT OK"
    assert r["Uplift"].utilisation == pytest.approx((0.6 * 1000 - 0.6 * 100) / 400, rel=1e-12)


def test_bad_inputs_name_themselves():
    with pytest.raises(InputError) as e:
        ConnectorListing("tie", Q_(400, "lbf"), "")
    assert e.value.name == "source"
    with pytest.raises(InputError) as e:
        ConnectorListing("tie", Q_(400, "psi"), "ER")
    assert e.value.name == "uplift"
    with pytest.raises(InputError) as e:
        check_connector(TIE, {}, asce7_allowable_stress(), mark="x")
    assert e.value.name == "reactions"
    with pytest.raises(InputError) as e:
        check_connector(TIE, {"D": Q_(1, "ft")}, asce7_allowable_stress(), mark="x")
    assert "reactions" in e.value.name


def test_working_shows_the_listing_and_matches_the_numbers():
    r = check_connector(TIE, {"D": Q_(80, "lbf"), "W": Q_(-200, "lbf")},
                        asce7_allowable_stress(), mark="x")  # fmt: skip
    sources = [str(getattr(s, "source", "")) for s in r.working()]
    assert "evaluation report ER-0000, Table 2" in sources


@settings(max_examples=50, deadline=None)
@given(st.floats(min_value=0.0, max_value=5000.0), st.floats(min_value=0.0, max_value=5000.0))
def test_uplift_is_the_worst_net_pull_of_06d_06w(D, W):
    # with only D and W (uplift) the least net reaction is 0.6D − 0.6W (combination 7)
    r = check_connector(TIE, {"D": Q_(D, "lbf"), "W": Q_(-W, "lbf")}, asce7_allowable_stress(),
                        mark="x")  # fmt: skip
    expect = max(0.6 * W - 0.6 * D, 0.0)
    assert r["Uplift"].demand.to("lbf").magnitude == pytest.approx(expect, abs=1e-9)


def test_moment_resisting_base_by_hand():
    # moments by case: D 0, W 150 lbf·ft; the largest |net| is D + 0.6W or 0.6D + 0.6W = 90
    base = ConnectorListing("base B1 (generic)", Q_(1000, "lbf"), "ER-0001, Table 1",
                            moment=Q_(200, "lbf*ft"))  # fmt: skip
    r = check_connector(base, {"D": Q_(500, "lbf"), "W": Q_(-100, "lbf")},
                        asce7_allowable_stress(), mark="post A",
                        moments={"W": Q_(150, "lbf*ft")})  # fmt: skip
    assert r["Moment"].demand.to("lbf*ft").magnitude == pytest.approx(90.0, rel=1e-12)
    assert r["Moment"].capacity.to("lbf*ft").magnitude == 200.0
    with pytest.raises(InputError) as e:
        check_connector(TIE, {"D": Q_(1, "lbf")}, asce7_allowable_stress(), mark="x",
                        moments={"W": Q_(1, "lbf*ft")})  # fmt: skip
    assert e.value.name == "moments"
