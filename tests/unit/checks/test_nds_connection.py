"""NDS 2018 connection checks: adjustment factors, layout, group action, withdrawal, combined
loading and tear-out -- values, refusals and the messages naming the input."""

from __future__ import annotations

import pytest

from calcpack.checks.nds.connection import (
    ConnectionService,
    FastenerLayout,
    GroupStiffness,
    check_nds_connection,
    group_action_factor,
)
from calcpack.checks.nds.dowel import DowelJoint, SteelPlate, WoodMember, nds_fastener
from calcpack.checks.nds.values import nds_sawn_values
from calcpack.checks.nds.withdrawal import (
    check_nds_combined,
    check_nds_tearout,
    check_nds_withdrawal,
    withdrawal_value,
)
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

DF = "Douglas Fir-Larch"
STIFF = GroupStiffness(
    Am=Q_(3.5 * 7.25, "inch**2"),
    As=Q_(1.5 * 7.25, "inch**2"),
    Em=Q_(1.6e6, "psi"),
    Es=Q_(1.6e6, "psi"),
)


def _bolted(angle=0.0):
    return DowelJoint(
        nds_fastener("1/2 in. bolt", length=Q_(5.5, "inch")),
        WoodMember(Q_(1.5, "inch"), DF, angle=Q_(angle, "degree")),
        WoodMember(Q_(3.5, "inch"), DF, angle=Q_(angle, "degree")),
    )


def test_full_layout_gives_c_delta_one_and_n_times_z():
    lay = FastenerLayout(rows=1, per_row=2, spacing=Q_(2.0, "inch"), end=Q_(3.5, "inch"),
                         edge=Q_(1.5, "inch"))  # fmt: skip
    r = check_nds_connection(_bolted(), P=Q_(500, "lbf"), layout=lay, stiffness=STIFF)
    v = r.values
    # full distances: end 7D = 3.5 in. (softwood, tension), spacing 4D = 2 in. (Table 12.5.1A/B)
    assert v["C_Delta"].m == pytest.approx(1.0)
    expect = 2 * v["Z"].m_as("lbf") * v["C_g"].m
    assert v["Z_group"].m_as("lbf") == pytest.approx(expect)
    assert r.passed


def test_reduced_end_distance_reduces_by_the_ratio_and_below_minimum_fails():
    lay = FastenerLayout(end=Q_(2.0, "inch"), edge=Q_(1.5, "inch"))
    r = check_nds_connection(_bolted(), P=Q_(100, "lbf"), layout=lay)
    assert r.values["C_Delta"].m == pytest.approx(2.0 / 3.5)
    short = FastenerLayout(end=Q_(1.5, "inch"), edge=Q_(1.5, "inch"))  # < 3.5D = 1.75 in.
    r2 = check_nds_connection(_bolted(), P=Q_(100, "lbf"), layout=short)
    end = r2["End distance (main and side members)"]
    assert end.verdict == "NOT OK"
    assert end.demand.m_as("inch") == pytest.approx(1.75)


def test_perpendicular_loading_checks_the_loaded_edge():
    lay = FastenerLayout(end=Q_(2.0, "inch"), edge=Q_(1.0, "inch"))
    r = check_nds_connection(_bolted(90.0), P=Q_(100, "lbf"), layout=lay)
    loaded = r["Loaded edge distance (main and side members)"]
    assert loaded.demand.m_as("inch") == pytest.approx(2.0)  # 4D, Table 12.5.1C
    assert loaded.verdict == "NOT OK"


def test_group_action_factor_properties():
    s, d = Q_(4.0, "inch"), Q_(0.75, "inch")
    assert group_action_factor(n=1, s=s, D=d, stiffness=STIFF) == 1.0
    cg = [group_action_factor(n=k, s=s, D=d, stiffness=STIFF) for k in range(2, 8)]
    assert all(0.0 < x <= 1.0 for x in cg)
    assert cg == sorted(cg, reverse=True)  # more fasteners in a row share less evenly


def test_group_of_bolts_needs_member_stiffness():
    lay = FastenerLayout(per_row=3, spacing=Q_(2, "inch"), end=Q_(3.5, "inch"), edge=Q_(1, "inch"))
    with pytest.raises(InputError, match="stiffness") as e:
        check_nds_connection(_bolted(), P=Q_(100, "lbf"), layout=lay)
    assert e.value.name == "stiffness"


def test_wet_service_and_temperature_factors():
    sv = ConnectionService(service="wet", temperature=Q_(120, "degF"))
    r = check_nds_connection(_bolted(), P=Q_(100, "lbf"), service=sv)
    assert r.values["C_M"].m == pytest.approx(0.7)  # Table 11.3.3 (from memory)
    assert r.values["C_t"].m == pytest.approx(0.7)  # Table 11.3.4, wet, 100-125 °F
    with pytest.raises(InputError, match="duration"):
        ConnectionService(duration="impact")
    with pytest.raises(OutOfScopeError, match="150"):
        ConnectionService(temperature=Q_(160, "degF"))


def test_no_layout_is_reported_not_covered_for_bolts():
    r = check_nds_connection(_bolted(), P=Q_(100, "lbf"))
    assert any(x.verdict == "NOT COVERED" for x in r.results)
    assert not r.passed


def test_nails_diaphragm_and_toenail_factors():
    j = DowelJoint(nds_fastener("10d common nail"), WoodMember(Q_(1.5, "inch"), DF),
                   WoodMember(Q_(3.5, "inch"), DF))  # fmt: skip
    r = check_nds_connection(j, P=Q_(50, "lbf"), service=ConnectionService(diaphragm=True))
    assert r.values["C_di"].m == pytest.approx(1.1)
    assert r.passed
    with pytest.raises(InputError, match="C_di"):
        check_nds_connection(_bolted(), P=Q_(50, "lbf"), service=ConnectionService(toenail=True))


def test_steel_side_plate_connection_runs_and_shows_working():
    j = DowelJoint(nds_fastener("5/8 in. bolt"), SteelPlate(Q_(0.25, "inch")),
                   WoodMember(Q_(3.5, "inch"), DF))  # fmt: skip
    lay = FastenerLayout(end=Q_(4.375, "inch"), edge=Q_(1.5, "inch"))
    r = check_nds_connection(j, P=Q_(800, "lbf"), layout=lay)
    assert r.passed
    html = r._repr_mimebundle_()["text/html"]
    assert "Table 11.3.1" in html


# -- withdrawal ---------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("species", "printed"),
    [
        # NDS 2018 Table 12.2A, 1/2 in. lag screw, lb per inch of thread penetration
        # (from memory; the table rounds to 1 lb/in.)
        (DF, 378),
        ("Southern Pine", 437),
    ],
)
def test_lag_screw_withdrawal_table_12_2a(species, printed):
    w = withdrawal_value(nds_fastener("1/2 in. lag screw"), WoodMember(Q_(3, "inch"), species))
    assert w.m_as("lbf/inch") == pytest.approx(printed, abs=0.5)


def test_withdrawal_check_and_refusals():
    lag = nds_fastener("1/2 in. lag screw")
    rim = WoodMember(Q_(1.5, "inch"), DF)
    r = check_nds_withdrawal(lag, rim, P=Q_(600, "lbf"), penetration=Q_(2.0, "inch"), n=2)
    assert r.values["W_group"].m_as("lbf") == pytest.approx(2 * 2.0 * 378.0, rel=2e-3)
    with pytest.raises(OutOfScopeError, match="bolt"):
        check_nds_withdrawal(nds_fastener("1/2 in. bolt"), rim, P=Q_(1, "lbf"),
                             penetration=Q_(1, "inch"))  # fmt: skip
    end = WoodMember(Q_(1.5, "inch"), DF, end_grain=True)
    with pytest.raises(OutOfScopeError, match="end grain"):
        check_nds_withdrawal(nds_fastener("16d common nail"), end, P=Q_(1, "lbf"),
                             penetration=Q_(1, "inch"))  # fmt: skip
    eg = check_nds_withdrawal(lag, end, P=Q_(100, "lbf"), penetration=Q_(2.0, "inch"))
    assert eg.values["C_eg"].m == pytest.approx(0.75)


def test_nail_withdrawal_wet_service_factor():
    sv = ConnectionService(fabrication="wet", service="dry")
    r = check_nds_withdrawal(nds_fastener("16d common nail"), WoodMember(Q_(3, "inch"), DF),
                             P=Q_(10, "lbf"), penetration=Q_(2, "inch"), service=sv)  # fmt: skip
    assert r.values["C_M"].m == pytest.approx(0.25)  # Table 11.3.3 (from memory)


@pytest.mark.parametrize("kind", ["1/2 in. lag screw", "16d common nail"])
def test_combined_reduces_to_lateral_and_withdrawal_at_the_ends(kind):
    f = nds_fastener(kind)
    m = WoodMember(Q_(3.5, "inch"), DF)
    Z = Q_(300.0, "lbf")
    kw = {"Z_adj": Z, "penetration": Q_(2, "inch"), "P": Q_(10, "lbf")}
    lateral = check_nds_combined(f, m, alpha=Q_(0, "degree"), **kw)
    pull = check_nds_combined(f, m, alpha=Q_(90, "degree"), **kw)
    assert lateral.values["Z_alpha"].m_as("lbf") == pytest.approx(300.0)
    assert pull.values["Z_alpha"].m_as("lbf") == pytest.approx(pull.values["W_adj_p"].m_as("lbf"))
    mid = check_nds_combined(f, m, alpha=Q_(45, "degree"), **kw).values["Z_alpha"].m_as("lbf")
    lo, hi = sorted([300.0, pull.values["W_adj_p"].m_as("lbf")])
    assert lo <= mid <= hi


def test_tearout_by_hand():
    v = nds_sawn_values("Douglas Fir-Larch", "No.2")
    lay = FastenerLayout(rows=2, per_row=2, spacing=Q_(3, "inch"), row_spacing=Q_(2.5, "inch"),
                         end=Q_(3.5, "inch"), edge=Q_(1.5, "inch"))  # fmt: skip
    r = check_nds_tearout(v, t=Q_(3.5, "inch"), D=Q_(0.5, "inch"), layout=lay, P=Q_(4000, "lbf"))
    # by hand: F'v = 180 psi; Z_RTi = 2 × 180 × 3.5 × 3 = 3 780 lb; Z_RT = 7 560 lb
    assert r.values["Z_RT"].m_as("lbf") == pytest.approx(7560.0)
    # A_net = 1 × (2.5 − 0.5625) × 3.5 = 6.78 in.²; Z_GT = 3 780 + 575 × 6.78 = 7 679 lb
    assert r.values["Z_GT"].m_as("lbf") == pytest.approx(3780.0 + 575.0 * 1.9375 * 3.5)
    assert r.passed


def test_wet_service_bolt_in_withdrawal_is_refused_naming_the_fastener():
    wet = ConnectionService(service="wet")
    with pytest.raises(OutOfScopeError, match="bolt has no withdrawal design value"):
        check_nds_withdrawal(nds_fastener("5/8 in. bolt"), WoodMember(Q_(3.5, "inch"), DF),
                             P=Q_(100, "lbf"), penetration=Q_(3, "inch"), service=wet)  # fmt: skip


def test_fabricated_wet_bolts_in_several_rows_take_c_m_0_4():
    sv = ConnectionService(fabrication="wet", service="dry")
    lay = FastenerLayout(rows=2, row_spacing=Q_(2.5, "inch"), end=Q_(3.5, "inch"),
                         edge=Q_(1.5, "inch"))  # fmt: skip
    r = check_nds_connection(_bolted(), P=Q_(100, "lbf"), layout=lay, service=sv)
    assert r.values["C_M"].m == pytest.approx(0.4)  # Table 11.3.3 footnote (from memory)
