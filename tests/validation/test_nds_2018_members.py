"""NDS 2018 member checks: reference values, column stability, combined stresses, bearing.

Sources:

* AWC, NDS Supplement 2018, Table 4A: Douglas Fir-Larch No.1 and No.2 (the project's
  published-values reference, confirmed values);
* ANSI/AWC NDS-2018, Eq. (3.7-1), (3.9-1), (3.9-3), (3.10-1), (3.10-2), (3.4-3): the printed
  equations evaluated by hand here (inputs stated beside each assertion); C_P is also checked
  against the quadratic it solves, c·C_P² − (1 + α)·C_P + α = 0 (common practice: the
  Ylinen column formula the NDS equation is the smaller root of).
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.nds.bearing import (
    TimberBearing,
    check_nds_bearing,
    check_nds_notched_shear,
    long_term_deflection,
)
from calcpack.checks.nds.members import (
    TimberForces,
    TimberMember,
    check_nds_member,
    column_stability_factor,
)
from calcpack.checks.nds.values import TimberValues, nds_glulam_values, nds_sawn_values
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

DFL2 = nds_sawn_values("Douglas Fir-Larch", "No.2")


@pytest.mark.parametrize(
    ("grade", "printed"),
    [
        ("No.2", (900, 575, 180, 625, 1350, 1_600_000, 580_000)),
        ("No.1", (1000, 675, 180, 625, 1500, 1_700_000, 620_000)),
    ],
)
def test_table_4a_douglas_fir_larch(grade, printed):
    v = nds_sawn_values("Douglas Fir-Larch", grade)
    got = tuple(
        getattr(v, k).to("psi").magnitude for k in ("Fb", "Ft", "Fv", "Fc_perp", "Fc", "E", "Emin")
    )
    # NDS Supplement 2018 Table 4A (published-values reference), exact
    assert got == printed
    assert "confirmed" in v.source


def test_recalled_rows_say_so():
    assert "from memory" in nds_sawn_values("Hem-Fir", "No.2").source
    assert "from memory" in nds_glulam_values("24F-1.8E").source


def test_unknown_grade_suggests():
    with pytest.raises(InputError, match="did you mean") as e:
        nds_sawn_values("Douglas Fir-Larch", "No 2")
    assert e.value.name == "key"


def _post(**kw):
    return TimberMember(
        DFL2,
        b=Q_(3.5, "inch"),
        d=Q_(3.5, "inch"),
        le_d=Q_(8, "ft"),
        le_b=Q_(8, "ft"),
        CF_c=1.15,
        CF_b=1.5,
        CF_source="Table 4A",
        **kw,
    )


def test_4x4_post_column_stability_by_hand():
    # Eq. (3.7-1) by hand: le/d = 96/3.5, F_cE = 0.822·580 000/(le/d)², F*_c = 1350·1.15
    sd = 96 / 3.5
    FcE, Fcs = 0.822 * 580_000 / sd**2, 1350 * 1.15
    a = FcE / Fcs
    h = (1 + a) / 1.6
    CP = h - math.sqrt(h * h - a / 0.8)
    r = check_nds_member(_post(), TimberForces(P=Q_(4000, "lbf")))
    assert r.values["C_P"].magnitude == pytest.approx(CP, rel=1e-9)
    assert r["Compression"].capacity.to("psi").magnitude == pytest.approx(Fcs * CP, rel=1e-9)


@settings(max_examples=50, deadline=None)
@given(st.floats(min_value=0.01, max_value=20.0), st.sampled_from([0.8, 0.85, 0.9]))
def test_cp_is_the_smaller_root_of_its_quadratic(a, c):
    cp = column_stability_factor(a, c)
    assert c * cp**2 - (1 + a) * cp + a == pytest.approx(0.0, abs=1e-9)
    assert 0 < cp <= min(1.0, a) + 1e-12


def test_compression_with_biaxial_bending_by_hand():
    # Eq. (3.9-3) with e = 0, 4x4 DF-L No.2, P = 3000 lbf, M_d = 200, M_b = 100 lbf·ft, C_L = 1
    r = check_nds_member(
        _post(), TimberForces(P=Q_(3000, "lbf"), M_d=Q_(200, "lbf*ft"), M_b=Q_(100, "lbf*ft"))
    )
    A, S = 3.5**2, 3.5**3 / 6
    fc, fb1, fb2 = 3000 / A, 2400 / S, 1200 / S
    Fcp = r["Compression"].capacity.to("psi").magnitude
    FcE = 0.822 * 580_000 / (96 / 3.5) ** 2
    Fb = 900 * 1.5
    U = (fc / Fcp) ** 2 + fb1 / (Fb * (1 - fc / FcE)) + fb2 / (Fb * (1 - fc / FcE))
    assert r["Compression and bending"].utilisation == pytest.approx(U, rel=1e-9)


def test_tension_and_bending_by_hand():
    # Eq. (3.9-1): f_t/F'_t + f_b/F*_b
    r = check_nds_member(_post(), TimberForces(P=Q_(-3000, "lbf"), M_d=Q_(200, "lbf*ft")))
    U = (3000 / 3.5**2) / 575 + (2400 / (3.5**3 / 6)) / 1350
    assert r["Tension and bending"].utilisation == pytest.approx(U, rel=1e-9)


def test_glulam_takes_the_lesser_of_cl_and_cv():
    g = nds_glulam_values("24F-1.8E")
    m = TimberMember(g, b=Q_(5.125, "inch"), d=Q_(18, "inch"), L_beam=Q_(32, "ft"))
    r = check_nds_member(m, TimberForces(M_d=Q_(30000, "lbf*ft")))
    # Eq. (5.3-1) by hand, x = 10
    CV = ((21 / 32) * (12 / 18) * (5.125 / 5.125)) ** 0.1
    assert r["Bending 1"].capacity.to("psi").magnitude == pytest.approx(2400 * CV, rel=1e-9)


def test_bearing_perpendicular_parallel_and_hankinson():
    b = {"b": Q_(3.5, "inch"), "lb": Q_(3.5, "inch")}
    perp = check_nds_bearing(TimberBearing(DFL2, R=Q_(1000, "lbf"), from_end=Q_(6, "inch"), **b))
    # Eq. (3.10-2): C_b = (3.5 + 0.375)/3.5
    assert perp["Bearing perpendicular to grain"].capacity.to("psi").magnitude == pytest.approx(
        625 * 3.875 / 3.5
    )
    par = check_nds_bearing(TimberBearing(DFL2, R=Q_(1000, "lbf"), direction="parallel", **b))
    assert par["Bearing on end grain"].capacity.to("psi").magnitude == pytest.approx(1350)
    for deg, want in ((0, 1350), (90, 625), (30, 1350 * 625 / (1350 * 0.25 + 625 * 0.75))):
        r = check_nds_bearing(
            TimberBearing(DFL2, R=Q_(1000, "lbf"), direction="angle", angle=Q_(deg, "degree"), **b)
        )
        # Hankinson, Eq. (3.10-1), by hand
        assert r["Bearing at an angle to grain"].capacity.to("psi").magnitude == pytest.approx(want)


def test_notched_shear_by_hand_and_deep_notch_refused():
    r = check_nds_notched_shear(
        DFL2, b=Q_(1.5, "inch"), d=Q_(9.25, "inch"), dn=Q_(7.5, "inch"), V=Q_(500, "lbf")
    )
    # Eq. (3.4-3): (2/3)·180·1.5·7.5·(7.5/9.25)²
    assert r["Shear at notch"].capacity.to("lbf").magnitude == pytest.approx(
        2 / 3 * 180 * 1.5 * 7.5 * (7.5 / 9.25) ** 2
    )
    with pytest.raises(OutOfScopeError, match="d/4"):
        check_nds_notched_shear(
            DFL2, b=Q_(1.5, "inch"), d=Q_(9.25, "inch"), dn=Q_(6, "inch"), V=Q_(500, "lbf")
        )


def test_long_term_deflection_kcr():
    # NDS 2018 §3.5.2: K_cr = 1.5 dry, 2.0 wet
    total, k = long_term_deflection(Q_(0.2, "inch"), Q_(0.3, "inch"))
    assert (k, total.to("inch").magnitude) == (1.5, pytest.approx(0.6))
    assert long_term_deflection(Q_(0.2, "inch"), Q_(0.3, "inch"), wet=True)[1] == 2.0


def test_refusals_and_bad_input():
    with pytest.raises(OutOfScopeError, match="50"):
        check_nds_member(
            _post().__class__(
                DFL2, b=Q_(1.5, "inch"), d=Q_(3.5, "inch"), le_d=Q_(8, "ft"), le_b=Q_(8, "ft")
            ),
            TimberForces(P=Q_(100, "lbf")),
        )
    with pytest.raises(InputError) as e:
        TimberMember(DFL2, b=Q_(5, "inch"), d=Q_(3.5, "inch"))
    assert e.value.name == "b"
    with pytest.raises(InputError) as e:
        TimberValues("LVL", "scl", "", *(Q_(1000, "psi"),) * 7)
    assert e.value.name == "source"
    with pytest.raises(InputError) as e:
        check_nds_member(_post(), TimberForces())
    assert e.value.name == "forces"
    with pytest.raises(InputError) as e:
        TimberBearing(
            DFL2,
            R=Q_(1, "lbf"),
            b=Q_(1, "inch"),
            lb=Q_(1, "inch"),
            direction="angle",
            angle=Q_(120, "degree"),
        )
    assert e.value.name == "angle"
    with pytest.raises(OutOfScopeError, match="Wet service"):
        TimberMember(nds_glulam_values("24F-1.8E"), b=Q_(5, "inch"), d=Q_(12, "inch"), wet=True)


def _wet_6x6(**kw):
    return TimberMember(
        nds_sawn_values("Douglas Fir-Larch", "P&T No.1", table="4D"),
        b=Q_(5.5, "inch"),
        d=Q_(5.5, "inch"),
        le_d=Q_(8, "ft"),
        le_b=Q_(8, "ft"),
        wet=True,
        **kw,
    )


def test_wet_6x6_post_by_hand_with_table_4d_factors():
    # NDS Supplement 2018 Table 4D wet service factors (from memory): F_c 0.91, E_min 1.0.
    # DF-L P&T No.1 (Table 4D, from memory): F_c = 1000 psi, E_min = 580 000 psi.
    # Eq. (3.7-1) by hand: F*_c = 1000·0.91, F_cE = 0.822·580 000/(96/5.5)², c = 0.8.
    Fcs = 1000 * 0.91
    FcE = 0.822 * 580_000 / (96 / 5.5) ** 2
    a = FcE / Fcs
    h = (1 + a) / 1.6
    CP = h - math.sqrt(h * h - a / 0.8)
    r = check_nds_member(_wet_6x6(), TimberForces(P=Q_(3000, "lbf")))
    assert r.values["C_M_c"] == pytest.approx(0.91)
    assert r.values["C_M_E"] == pytest.approx(1.0)
    assert r["Compression"].capacity.to("psi").magnitude == pytest.approx(Fcs * CP, rel=1e-9)
    assert r["Compression"].demand.to("psi").magnitude == pytest.approx(3000 / 5.5**2, rel=1e-9)


def test_wet_timber_bending_keeps_fb_and_the_working_cites_table_4d():
    # Table 4D (from memory): C_M = 1.0 on F_b and E_min of timbers
    r = check_nds_member(_wet_6x6(), TimberForces(M_d=Q_(500, "lbf*ft")))
    assert r.values["C_M_b1"] == pytest.approx(1.0)
    sources = [getattr(step, "source", "") for step in r.working()]
    assert any("Table 4D" in str(src) and "C_M" not in str(src) for src in sources)
    assert "NDS Supplement 2018 Table 4D, wet service factors (from memory)" in sources


def test_wet_dimension_lumber_compression_keeps_the_750_psi_rule():
    # Table 4A footnote (from memory): C_M = 1.0 for F_c where F_c·C_F ≤ 750 psi, else 0.8
    low = TimberValues(
        "low F_c stud", "sawn", "invented for the threshold", Fb=Q_(700, "psi"),
        Ft=Q_(400, "psi"), Fv=Q_(135, "psi"), Fc_perp=Q_(425, "psi"), Fc=Q_(700, "psi"),
        E=Q_(1_200_000, "psi"), Emin=Q_(440_000, "psi"),
    )  # fmt: skip
    P = TimberForces(P=Q_(1000, "lbf"))
    kw = {"b": Q_(3.5, "inch"), "d": Q_(3.5, "inch"), "le_d": Q_(4, "ft"), "le_b": Q_(4, "ft")}
    assert check_nds_member(TimberMember(low, wet=True, **kw), P).values["C_M_c"] == 1.0
    assert check_nds_member(TimberMember(DFL2, wet=True, **kw), P).values["C_M_c"] == 0.8


def test_wet_timber_bearing_uses_table_4d():
    # F_c⊥ 0.67 in both tables; F_c on end grain 0.91 for timbers (Table 4D, from memory)
    v = nds_sawn_values("Douglas Fir-Larch", "P&T No.1", table="4D")
    kw = {"R": Q_(2000, "lbf"), "b": Q_(5.5, "inch"), "lb": Q_(5.5, "inch"), "wet": True}
    end = check_nds_bearing(TimberBearing(v, direction="parallel", **kw))
    assert end.values["C_M_c"] == pytest.approx(0.91)
    side = check_nds_bearing(TimberBearing(v, **kw))
    assert side.values["C_M_perp"] == pytest.approx(0.67)
    with pytest.raises(OutOfScopeError, match="Table 4D"):
        TimberBearing(nds_glulam_values("24F-1.8E"), **kw)
