"""AISC 360-16 Chapter J connection checks: combined loading, block shear, plates, anchor rods,
weld sizes -- values by hand, refusals and messages naming the input."""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.bolts import BoltGroup, Ply, SlipCritical, check_aisc_bolts
from calcpack.checks.aisc360.elements import (
    BlockShear,
    ConnectingPlate,
    check_aisc_anchor_rods,
    check_aisc_block_shear,
    check_aisc_plate,
)
from calcpack.checks.aisc360.welds import (
    BaseMetal,
    FilletWeld,
    check_aisc_fillet_weld,
    minimum_fillet_size,
)
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

K = "kip"
IN = "inch"


def test_combined_tension_and_shear_by_hand():
    b = BoltGroup("Group A", Q_(0.75, IN), 4)
    r = check_aisc_bolts(b, V=Q_(40, K), T=Q_(60, K))
    # by hand: f_rv = 40/(4 × 0.4418) = 22.64 ksi; F'nt = 1.3·90 − 90/(0.75·54)·22.64 = 66.70 ksi
    Ab = 3.141592653589793 * 0.75**2 / 4
    frv = 40 / (4 * Ab)
    fnt = min(1.3 * 90 - 90 / (0.75 * 54) * frv, 90)
    assert r.values["F_nt_p"].m_as("ksi") == pytest.approx(fnt)
    assert r.values["R_c_t"].m_as(K) == pytest.approx(0.75 * fnt * Ab * 4)


def test_bearing_with_end_and_inner_bolts_and_layout_checks():
    b = BoltGroup("Group A", Q_(0.75, IN), 3)
    p = Ply("gusset", Q_(0.375, IN), Q_(58, "ksi"), along=3, s=Q_(2, IN), le=Q_(0.875, IN),
            edge=Q_(1.5, IN))  # fmt: skip
    r = check_aisc_bolts(b, [p], V=Q_(30, K))
    # by hand: end l_c = 0.875 − 0.40625; inner l_c = 2 − 0.8125; each min(1.2 l_c t Fu, 2.4 d t Fu)
    rb = 2.4 * 0.75 * 0.375 * 58
    re_ = min(1.2 * (0.875 - 0.40625) * 0.375 * 58, rb)
    ri = min(1.2 * (2 - 0.8125) * 0.375 * 58, rb)
    assert r.values["R_n_brg_gusset"].m_as(K) == pytest.approx(re_ + 2 * ri)
    assert r["Edge distance (le), gusset"].verdict == "NOT OK"  # < 1 in., Table J3.4
    assert r["Bolt spacing (s), gusset"].verdict == "OK"  # 2 in. ≥ 2-2/3 × 3/4 in.


def test_bolt_refusals_and_bad_input():
    with pytest.raises(OutOfScopeError, match="pretensioned"):
        check_aisc_bolts(BoltGroup("A307", Q_(0.75, IN), 2), V=Q_(1, K), slip=SlipCritical())
    with pytest.raises(InputError, match="Group A") as e:
        BoltGroup("Grup A", Q_(0.75, IN), 2)
    assert e.value.name == "grade"
    with pytest.raises(InputError, match="d = "):
        BoltGroup("Group A", Q_(0.8, IN), 2)
    with pytest.raises(InputError, match="plies"):
        check_aisc_bolts(BoltGroup("Group A", Q_(0.75, IN), 2),
                         [Ply("p", Q_(0.5, IN), Q_(58, "ksi"))], V=Q_(1, K))  # fmt: skip
    with pytest.raises(InputError, match="method"):
        check_aisc_bolts(BoltGroup("Group A", Q_(0.75, IN), 2), V=Q_(1, K), method="WSD")


def test_slip_with_tension_is_reduced_by_ksc():
    b = BoltGroup("Group A", Q_(0.75, IN), 4)
    r = check_aisc_bolts(b, V=Q_(10, K), T=Q_(20, K), slip=SlipCritical("B"))
    ksc = 1 - 20 / (1.13 * 28 * 4)
    assert r.values["k_sc"].m == pytest.approx(ksc)
    assert r.values["R_c_slip"].m_as(K) == pytest.approx(0.5 * 1.13 * 28 * 4 * ksc)


def test_block_shear_u_shaped_block_by_hand():
    k = BlockShear(
        t=Q_(0.5, IN),
        Fy=Q_(50, "ksi"),
        Fu=Q_(65, "ksi"),
        d_hole=Q_(13 / 16, IN),
        along=2,
        s=Q_(3, IN),
        le=Q_(1.5, IN),
        lines=2,
        gauge=Q_(3, IN),
        planes=2,
    )
    r = check_aisc_block_shear(k, R=Q_(100, K), method="ASD")
    agv = 2 * 4.5 * 0.5
    anv = 2 * (4.5 - 1.5 * 0.875) * 0.5
    ant = (3 - 0.875) * 0.5
    rn = min(0.6 * 65 * anv + 65 * ant, 0.6 * 50 * agv + 65 * ant)
    assert r.values["R_n_bs"].m_as(K) == pytest.approx(rn)
    assert r.values["R_c_bs"].m_as(K) == pytest.approx(rn / 2.0)
    with pytest.raises(OutOfScopeError, match="two or more lines"):
        BlockShear(t=Q_(0.5, IN), Fy=Q_(50, "ksi"), Fu=Q_(65, "ksi"), d_hole=Q_(13 / 16, IN),
                   along=2, s=Q_(3, IN), le=Q_(1.5, IN), planes=2)  # fmt: skip


def test_splice_plate_net_area_limited_to_085_gross():
    pl = ConnectingPlate("PL1", Q_(0.5, IN), Q_(6, IN), Q_(36, "ksi"), Q_(58, "ksi"), holes=1,
                         d_hole=Q_(13 / 16, IN))  # fmt: skip
    r = check_aisc_plate(pl, P=Q_(50, K))
    # A_n = (6 − 0.875) × 0.5 = 2.5625 in.² < 0.85 A_g = 2.55? no: 0.85 × 3 = 2.55 governs
    assert r.values["A_e"].m_as("inch**2") == pytest.approx(2.55)
    with pytest.raises(InputError, match="P or the shear V"):
        check_aisc_plate(pl)


def test_anchor_rods_report_concrete_breakout_not_covered():
    rods = BoltGroup("F1554 Gr. 36", Q_(0.75, IN), 4)
    r = check_aisc_anchor_rods(rods, T=Q_(8, K), V=Q_(4, K))
    nc = r["Concrete anchorage"]
    assert nc.verdict == "NOT COVERED"
    assert "ACI 318-19 Chapter 17" in nc.description
    assert not r.passed
    # F1554 Gr. 36 rods: F_nt = 0.75 F_u = 43.5 ksi (Table J3.2 threaded parts)
    assert r.values["F_nt"].m_as("ksi") == pytest.approx(43.5)
    with pytest.raises(InputError, match="F1554"):
        check_aisc_anchor_rods(BoltGroup("Group A", Q_(0.75, IN), 4), T=Q_(1, K))


def test_weld_sizes_and_base_metal():
    assert minimum_fillet_size(Q_(0.5, IN)).m_as(IN) == pytest.approx(3 / 16)
    assert minimum_fillet_size(Q_(0.625, IN)).m_as(IN) == pytest.approx(1 / 4)
    assert minimum_fillet_size(Q_(1.0, IN)).m_as(IN) == pytest.approx(5 / 16)
    w = FilletWeld(
        Q_(0.125, IN),
        Q_(4, IN),
        n=2,
        t_thin=Q_(0.5, IN),
        t_edge=Q_(0.375, IN),
        base=(BaseMetal(Q_(0.25, IN), Q_(36, "ksi"), Q_(58, "ksi"), "tab"),),
    )
    r = check_aisc_fillet_weld(w, R=Q_(10, K))
    assert r["Minimum weld size"].verdict == "NOT OK"  # 1/8 < 3/16 for a 1/2 in. part
    assert r["Maximum weld size"].verdict == "OK"
    assert r.values["R_c_r_tab"].m_as(K) == pytest.approx(0.75 * 0.6 * 58 * 0.25 * 4 * 2)
    with pytest.raises(InputError, match="theta"):
        FilletWeld(Q_(0.25, IN), Q_(30, IN), end_loaded=True, theta=Q_(30, "degree"))
