"""Timber members to EN 1995-1-1 with the UK NA, against worked examples in the manner of
Porteous and Kermani, *Structural Timber Design to Eurocode 5* (2nd ed., Wiley-Blackwell,
2013), chapters 4-6 -- the procedures and factors as recalled ("from memory"), with EN 338
C16/C24 and EN 14080 GL28h values (from memory; the book uses EN 338:2009, whose C24 f_t,0,k
differs but whose f_m,k, f_v,k, f_c,0,k, f_c,90,k, E_0,05 equal the 2016 values used here).

Each expected value is worked out below by hand from the printed equations, not taken from
calcpack. Tolerance 1e-9: the same arithmetic in another order.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.en1995 import (
    TimberForcesEC,
    TimberMemberEC,
    check_en1995_deflection,
    check_en1995_member,
)
from calcpack.units import Q_


def test_floor_joist_bending_shear_bearing_c24():
    # 47 x 200 C24 joists at 400 mm, service class 1, medium-term (domestic imposed load
    # leading): f_m,d = k_mod k_sys f_m,k / γ_M = 0.8 x 1.1 x 24 / 1.3 (k_h = 1, h >= 150 mm)
    m = TimberMemberEC("C24", Q_(47, "mm"), Q_(200, "mm"), 1, load_sharing=True)
    f = TimberForcesEC("6.10b", "medium", M_Ed=Q_(3.2, "kN*m"), V_Ed=Q_(3.4, "kN"),
                     F_c90_Ed=Q_(3.4, "kN"), bearing_length=Q_(75, "mm"),
                     end_distance=Q_(0, "mm"), support="discrete")  # fmt: skip
    r = check_en1995_member(m, f, mark="J1")
    W = 47 * 200**2 / 6
    assert r["Bending (6.1.6)"].demand.to("MPa").magnitude == pytest.approx(3.2e6 / W, rel=1e-9)
    assert r["Bending (6.1.6)"].capacity.to("MPa").magnitude == pytest.approx(
        0.8 * 1.1 * 24 / 1.3, rel=1e-9
    )
    # shear: τ = 1.5 V/(k_cr b h), k_cr = 0.67; f_v,d = 0.8 x 4.0 / 1.3 (no k_sys on shear)
    assert r["Shear (6.1.7)"].demand.to("MPa").magnitude == pytest.approx(
        1.5 * 3400 / (0.67 * 47 * 200), rel=1e-9
    )
    fvd = r["Shear (6.1.7)"].capacity.to("MPa").magnitude
    assert fvd == pytest.approx(0.8 * 4 / 1.3, rel=1e-9)
    # bearing at a flush end on a discrete support: A_ef = b (ℓ + 30 mm), k_c,90 = 1.5
    assert r["Bearing (6.1.5)"].demand.to("MPa").magnitude == pytest.approx(
        3400 / (47 * (75 + 30)), rel=1e-9
    )
    assert r["Bearing (6.1.5)"].capacity.to("MPa").magnitude == pytest.approx(
        1.5 * 0.8 * 2.5 / 1.3, rel=1e-9
    )


def test_shallow_member_gets_k_h():
    # 47 x 100 C16: k_h = min((150/100)^0.2, 1.3) = 1.0845 (Eq. 3.1)
    m = TimberMemberEC("C16", Q_(47, "mm"), Q_(100, "mm"), 2)
    r = check_en1995_member(m, TimberForcesEC("ULS", "permanent", M_Ed=Q_(0.5, "kN*m")))
    kh = (150 / 100) ** 0.2
    assert r.values["k_h"].magnitude == pytest.approx(kh, rel=1e-9)
    assert r["Bending (6.1.6)"].capacity.to("MPa").magnitude == pytest.approx(
        0.6 * kh * 16 / 1.3, rel=1e-9
    )


def test_post_with_buckling_c24():
    # 100 x 100 C24 post, ℓ_ef = 2.4 m, medium-term, service class 2: λ = ℓ√12/b,
    # λ_rel = λ/π √(f_c,0,k/E_0,05), k = 0.5(1 + 0.2(λ_rel − 0.3) + λ_rel²),
    # k_c = 1/(k + √(k² − λ_rel²))
    m = TimberMemberEC("C24", Q_(100, "mm"), Q_(100, "mm"), 2, L_ef_y=Q_(2.4, "m"),
                       L_ef_z=Q_(2.4, "m"))  # fmt: skip
    r = check_en1995_member(m, TimberForcesEC("ULS", "medium", N_Ed=Q_(40, "kN")), mark="P1")
    lam_rel = 2400 * math.sqrt(12) / 100 / math.pi * math.sqrt(21 / 7400)
    k = 0.5 * (1 + 0.2 * (lam_rel - 0.3) + lam_rel**2)
    kc = 1 / (k + math.sqrt(k**2 - lam_rel**2))
    got = r["Compression with buckling z-z (6.3.2)"].capacity.to("MPa").magnitude
    assert got == pytest.approx(kc * 0.8 * 21 / 1.3, rel=1e-9)


def test_glulam_beam_lateral_torsional_stability():
    # GL28h 90 x 400, ℓ_ef = 5 m: σ_m,crit = 0.78 b² E_0,05/(h ℓ_ef) (6.32), λ_rel,m = √(f_m,k/σ),
    # k_crit by (6.34); k_h = min((600/400)^0.1, 1.1); γ_M = 1.25 (UK NA Table NA.3)
    m = TimberMemberEC("GL28h", Q_(90, "mm"), Q_(400, "mm"), 1, L_ef_LT=Q_(5, "m"))
    r = check_en1995_member(m, TimberForcesEC("ULS", "medium", M_Ed=Q_(30, "kN*m")), mark="GB1")
    scrit = 0.78 * 90**2 * 10500 / (400 * 5000)
    lam = math.sqrt(28 / scrit)
    kcrit = 1.0 if lam <= 0.75 else (1.56 - 0.75 * lam if lam <= 1.4 else 1 / lam**2)
    kh = min((600 / 400) ** 0.1, 1.1)
    got = r["Lateral torsional stability (6.3.3)"].capacity.to("MPa").magnitude
    assert got == pytest.approx(kcrit * 0.8 * kh * 28 / 1.25, rel=1e-9)


def test_final_deflection_with_creep():
    # w_fin = w_G (1 + k_def) + w_Q (1 + ψ2 k_def), k_def = 0.6 (solid, SC1), ψ2 = 0.3
    # (UK NA Table NA.A1.1, category A); limit ℓ/250
    m = TimberMemberEC("C24", Q_(47, "mm"), Q_(200, "mm"), 1)
    r = check_en1995_deflection(m, span=Q_(3.8, "m"), w_G=Q_(3.0, "mm"),
                                w_Q={"Q": (Q_(6.0, "mm"), 0.7, 0.3)})  # fmt: skip
    c = r["Final deflection (2.2.3)"]
    assert c.demand.to("mm").magnitude == pytest.approx(3 * 1.6 + 6 * (1 + 0.3 * 0.6), rel=1e-9)
    assert c.capacity.to("mm").magnitude == pytest.approx(3800 / 250, rel=1e-9)
