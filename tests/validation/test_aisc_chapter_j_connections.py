"""AISC 360-16 Chapter J bolts and welds against published values.

Sources:
* AISC, Companion to the Steel Construction Manual, Vol. 1: Design Examples, v15.1, Example
  J.1 (two 3/16 in. fillet welds, 27 in. long, end-loaded): φR_n = 206 kips, R_n/Ω = 137 kips,
  β = 0.912 -- confirmed in the project's published-values reference.
* AISC Steel Construction Manual, 16th ed. (values identical in the 15th), Part 7 Tables 7-1
  (available shear strength of bolts), 7-2 (available tensile strength), 7-3 (slip-critical,
  Class A, standard holes), 7-5 (bearing/tear-out at the end distance, per inch of thickness)
  and Part 8 Eq. 8-2a/8-2b (fillet weld strength per sixteenth of an inch per inch, E70):
  FROM MEMORY (recalled, not read). The Manual prints three significant figures.
"""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.bolts import BoltGroup, Ply, SlipCritical, check_aisc_bolts
from calcpack.checks.aisc360.welds import FilletWeld, check_aisc_fillet_weld
from calcpack.units import Q_

K = "kip"


@pytest.mark.parametrize(("method", "printed"), [("LRFD", 206.0), ("ASD", 137.0)])
def test_design_example_j1_longitudinal_fillet_welds(method, printed):
    weld = FilletWeld(Q_(3 / 16, "inch"), Q_(27, "inch"), n=2, end_loaded=True)
    r = check_aisc_fillet_weld(weld, R=Q_(100, K), method=method)
    # Design Examples v15.1, J.1: printed to 3 significant figures
    assert r.values["R_c_w"].m_as(K) == pytest.approx(printed, abs=0.5)
    assert r.values["beta"].m == pytest.approx(0.912, abs=5e-4)


@pytest.mark.parametrize(("method", "printed"), [("LRFD", 1.392), ("ASD", 0.928)])
def test_manual_part_8_fillet_weld_per_sixteenth_per_inch(method, printed):
    # Manual Part 8, Eq. 8-2a/8-2b (from memory): 1.392 D l and 0.928 D l kips, D in sixteenths
    weld = FilletWeld(Q_(1 / 16, "inch"), Q_(1, "inch"))
    r = check_aisc_fillet_weld(weld, R=Q_(0.5, K), method=method)
    assert r.values["R_c_w"].m_as(K) == pytest.approx(printed, abs=5e-4)


def test_transverse_weld_is_one_and_a_half_times_longitudinal():
    # AISC 360-16 Eq. J2-5: (1.0 + 0.50 sin^1.5 90°) = 1.5
    lon = check_aisc_fillet_weld(FilletWeld(Q_(0.25, "inch"), Q_(6, "inch")), R=Q_(1, K))
    tra = check_aisc_fillet_weld(
        FilletWeld(Q_(0.25, "inch"), Q_(6, "inch"), theta=Q_(90, "degree")), R=Q_(1, K)
    )
    assert tra.values["R_c_w"].m_as(K) == pytest.approx(1.5 * lon.values["R_c_w"].m_as(K))


@pytest.mark.parametrize(
    ("grade", "d", "threads", "lrfd", "asd"),
    [
        # Manual Table 7-1, single shear, per bolt (from memory)
        ("Group A", 0.75, "included", 17.9, 11.9),
        ("Group A", 0.75, "excluded", 22.5, 15.0),
        ("Group B", 0.75, "included", 22.5, 15.0),
        ("Group A", 0.875, "included", 24.3, 16.2),
        ("A307", 0.75, "included", 8.95, 5.96),
    ],
)
def test_manual_table_7_1_bolt_shear(grade, d, threads, lrfd, asd):
    b = BoltGroup(grade, Q_(d, "inch"), 1, threads=threads)
    for method, printed in (("LRFD", lrfd), ("ASD", asd)):
        r = check_aisc_bolts(b, V=Q_(1, K), method=method)
        assert r.values["R_c_v"].m_as(K) == pytest.approx(printed, rel=4e-3)


@pytest.mark.parametrize(
    ("grade", "lrfd", "asd"),
    [("Group A", 29.8, 19.9), ("Group B", 37.4, 24.9), ("A307", 14.9, 9.94)],
)
def test_manual_table_7_2_bolt_tension_three_quarter(grade, lrfd, asd):
    # Manual Table 7-2, 3/4 in. bolts, per bolt (from memory); no shear: F'nt = Fnt
    b = BoltGroup(grade, Q_(0.75, "inch"), 1)
    for method, printed in (("LRFD", lrfd), ("ASD", asd)):
        r = check_aisc_bolts(b, V=Q_(0, K), T=Q_(1, K), method=method)
        assert r.values["R_c_t"].m_as(K) == pytest.approx(printed, rel=4e-3)


def test_manual_table_7_3_slip_critical_class_a():
    # Manual Table 7-3, 3/4 in. Group A, Class A, standard holes, one slip plane (from memory)
    b = BoltGroup("Group A", Q_(0.75, "inch"), 1)
    lrfd = check_aisc_bolts(b, V=Q_(1, K), slip=SlipCritical("A"))
    asd = check_aisc_bolts(b, V=Q_(1, K), slip=SlipCritical("A"), method="ASD")
    assert lrfd.values["R_c_slip"].m_as(K) == pytest.approx(9.49, abs=0.005)
    assert asd.values["R_c_slip"].m_as(K) == pytest.approx(6.33, abs=0.005)


def test_manual_table_7_5_end_distance_and_7_4_spacing():
    b = BoltGroup("Group A", Q_(0.75, "inch"), 1)
    # Table 7-5: 3/4 in. bolt, l_e = 1-1/4 in., F_u = 58 ksi, per inch of thickness (from memory)
    end = Ply("plate", Q_(1, "inch"), Q_(58, "ksi"), le=Q_(1.25, "inch"))
    r = check_aisc_bolts(b, [end], V=Q_(1, K))
    assert r.values["R_c_brg_plate"].m_as(K) == pytest.approx(44.0, abs=0.05)
    # Table 7-4: 3/4 in. bolt, s = 3 in., F_u = 65 ksi: bearing governs, 87.8 kips/in.
    two = BoltGroup("Group A", Q_(0.75, "inch"), 2)
    inner = Ply("plate", Q_(1, "inch"), Q_(65, "ksi"), along=2, s=Q_(3, "inch"))
    r2 = check_aisc_bolts(two, [inner], V=Q_(1, K))
    # 87.75 printed as 87.8 (three significant figures, half up)
    assert r2.values["R_c_brg_plate"].m_as(K) / 2 == pytest.approx(87.8, abs=0.0501)
