"""Cast-in anchors checked against the equations of ACI CODE-318-19 Chapter 17, evaluated by hand
in this file (each equation named beside its assertion), and against the SI edition's constants.

Source: ACI CODE-318-19, Building Code Requirements for Structural Concrete (American Concrete
Institute, 2019), Chapter 17: Eq. (17.6.1.2) steel in tension, (17.6.2.1a/b), (17.6.2.1.4),
(17.6.2.2.1), (17.6.2.4.1a/b) concrete breakout in tension, §17.6.2.1.2 (three or more edges),
(17.6.3.2.2a/b) pullout, (17.6.4.1) side-face blowout, (17.7.1.2b) steel in shear,
(17.7.2.1a), (17.7.2.1.3), (17.7.2.2.1a/b), (17.7.2.4.1b), (17.7.2.6.1) concrete breakout in
shear, (17.7.3.1a) pryout, §17.8 interaction, Table 17.5.3 (φ); Commentary R17.6.1.2 (effective
area of a threaded anchor, A_se = π/4 (d_a − 0.9743/n_t)²). ACI CODE-318M-19 (the SI edition):
k_c = 10, V_b constants 0.6 and 3.7, side-face 13, with f'c in MPa and lengths in mm. Clause
numbers, equations and constants are recalled (from memory) and must be confirmed against the
printed standard. The effective areas 0.226, 0.334 and 0.606 in.² of 5/8, 3/4 and 1 in. UNC
rods are the values tabulated in the AISC Manual (Table 7-17) and used throughout the trade
(from memory).

No published worked example of Chapter 17 could be recalled to the digit; the cases here are
worked by hand from the equations.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aci318 import AnchorGroup, AnchorLoads, check_aci_anchors
from calcpack.checks.aci318.anchor_data import threaded_area
from calcpack.units import Q_

REL = 1e-6  # the hand working and calcpack evaluate the same closed forms
IN = "inch"


def _lbf(q: object) -> float:
    return float(q.to("lbf").magnitude)  # type: ignore[attr-defined]


@pytest.mark.parametrize(("d", "A_se"), [(0.625, 0.226), (0.75, 0.334), (1.0, 0.606)])
def test_effective_area_of_unc_rods_aisc_manual_table_7_17(d: float, A_se: float) -> None:
    """R17.6.1.2 with ASME B1.1 threads per inch against the tabulated areas (from memory);
    the table prints three figures: tolerance half a unit in the last figure."""
    area, _ = threaded_area(Q_(d, IN))
    assert area.to("inch**2").magnitude == pytest.approx(A_se, abs=0.0006)


def test_single_headed_bolt_in_tension_far_from_edges() -> None:
    """3/4 in. F1554 Gr. 36 headed bolt, h_ef = 10 in., f'c = 4000 psi, cracked, no edge near,
    in an 18 in. slab; N_ua = 10 kip."""
    g = AnchorGroup("headed bolt", Q_(0.75, IN), Q_(10, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(18, IN), A_brg=Q_(0.654, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(10, "kip")))
    A_se = math.pi / 4 * (0.75 - 0.9743 / 10) ** 2
    # Eq. (17.6.1.2): N_sa = A_se f_uta, f_uta = 58 ksi (≤ 1.9·36 = 68.4 ksi)
    assert _lbf(r.values["N_sa"]) == pytest.approx(A_se * 58000, rel=REL)
    assert r["Steel strength in tension"].capacity.to("lbf").magnitude == pytest.approx(
        0.75 * A_se * 58000, rel=REL
    )  # Table 17.5.3(a): φ = 0.75, ductile
    # Eq. (17.6.2.2.1): N_b = 24·1.0·√4000·10^1.5; no edges: A_Nc = A_Nco, ψ's = 1.0
    Nb = 24 * math.sqrt(4000) * 10**1.5
    assert _lbf(r.values["N_b"]) == pytest.approx(Nb, rel=REL)
    assert _lbf(r.values["N_cb"]) == pytest.approx(Nb, rel=REL)
    assert r["Concrete breakout in tension"].capacity.to("lbf").magnitude == pytest.approx(
        0.70 * Nb, rel=REL
    )  # Table 17.5.3(c), Condition B
    # Eq. (17.6.3.2.2a): N_p = 8 A_brg f'c; cracked: ψ_c,P = 1.0
    assert _lbf(r.values["N_pn"]) == pytest.approx(8 * 0.654 * 4000, rel=REL)
    assert r["Pullout"].utilisation == pytest.approx(10000 / (0.70 * 8 * 0.654 * 4000), rel=REL)


def test_corner_anchor_in_tension_edge_factor_and_projected_area() -> None:
    """5/8 in. headed bolt, h_ef = 6 in., edges at 4 in. (-x) and 5 in. (-y), f'c = 3000 psi,
    uncracked: A_Nc = (4 + 9)(5 + 9) = 182 in.², A_Nco = 9·36 = 324 in.²,
    ψ_ed,N = 0.7 + 0.3·4/9, ψ_c,N = 1.25 (Eq. 17.6.2.1a, 17.6.2.4.1b, §17.6.2.5.1)."""
    g = AnchorGroup("headed bolt", Q_(0.625, IN), Q_(6, IN), "F1554 Gr. 36", Q_(3000, "psi"),
                    Q_(12, IN), edges={"-x": Q_(4, IN), "-y": Q_(5, IN)},
                    A_brg=Q_(0.5, "inch**2"), cracking="uncracked")  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(2, "kip")))
    assert r.values["A_Nc"].to("inch**2").magnitude == pytest.approx(182, rel=REL)
    assert r.values["A_Nco"].to("inch**2").magnitude == pytest.approx(324, rel=REL)
    Nb = 24 * math.sqrt(3000) * 6**1.5
    expected = 182 / 324 * (0.7 + 0.3 * 4 / 9) * 1.25 * Nb
    assert _lbf(r.values["N_cb"]) == pytest.approx(expected, rel=REL)
    # uncracked: ψ_c,P = 1.4 (§17.6.3.3.1)
    assert _lbf(r.values["N_pn"]) == pytest.approx(1.4 * 8 * 0.5 * 3000, rel=REL)


def test_three_edges_reduce_the_embedment_depth() -> None:
    """A single anchor 6 in. from three edges (and far from the fourth), h_ef = 12 in.:
    c_a,max = 6 in. < 1.5 h_ef, so h_ef' = 6/1.5 = 4 in. (§17.6.2.1.2); A_Nc = (6 + 6)(6 + 6)
    with 1.5 h_ef' = 6 in. on the free side, A_Nco = 9·16 = 144 in.², ψ_ed,N = 1.0 since
    c_a,min = 1.5 h_ef'."""
    g = AnchorGroup("headed bolt", Q_(0.75, IN), Q_(12, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(24, IN), edges={"-x": Q_(6, IN), "+x": Q_(6, IN), "-y": Q_(6, IN)},
                    A_brg=Q_(0.654, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(1, "kip")))
    assert r.values["h_ef_red"].to(IN).magnitude == pytest.approx(4.0, rel=REL)
    assert r.values["A_Nc"].to("inch**2").magnitude == pytest.approx(144, rel=REL)
    assert _lbf(r.values["N_cb"]) == pytest.approx(24 * math.sqrt(4000) * 4**1.5, rel=REL)


def test_group_breakout_with_spacing_overlap() -> None:
    """2 × 2 headed bolts at 6 in., h_ef = 8 in., no edges: A_Nc = (12 + 6 + 12)² = 900 in.²,
    A_Nco = 576 in.² (Eq. 17.6.2.1b); steel and pullout per anchor with N_ua/4."""
    g = AnchorGroup("headed bolt", Q_(0.75, IN), Q_(8, IN), "F1554 Gr. 55", Q_(5000, "psi"),
                    Q_(20, IN), nx=2, ny=2, s_x=Q_(6, IN), s_y=Q_(6, IN),
                    A_brg=Q_(0.654, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(40, "kip")))
    Nb = 24 * math.sqrt(5000) * 8**1.5
    assert _lbf(r.values["N_cbg"]) == pytest.approx(900 / 576 * Nb, rel=REL)
    assert r["Steel strength in tension"].demand.to("lbf").magnitude == pytest.approx(10000)
    # F1554 Gr. 55: f_uta = 75 ksi ≤ 1.9·55 ksi
    A_se = math.pi / 4 * (0.75 - 0.9743 / 10) ** 2
    assert _lbf(r.values["N_sa"]) == pytest.approx(A_se * 75000, rel=REL)


def test_hooked_bolt_pullout_caps_the_hook_at_4_5_da() -> None:
    """Eq. (17.6.3.2.2b): N_p = 0.9 f'c e_h d_a with e_h ≤ 4.5 d_a: a 6 in. hook on a 1 in. bolt
    counts 4.5 in."""
    g = AnchorGroup("hooked bolt", Q_(1, IN), Q_(12, IN), "F1554 Gr. 36", Q_(3000, "psi"),
                    Q_(18, IN), e_h=Q_(6, IN))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(5, "kip")))
    assert _lbf(r.values["N_p"]) == pytest.approx(0.9 * 3000 * 4.5 * 1.0, rel=REL)


def test_side_face_blowout_of_a_deep_anchor_near_an_edge() -> None:
    """h_ef = 12 in. > 2.5·3 in.: N_sb = 160·3·√1.0·√4000 (Eq. 17.6.4.1); the edge across is far
    so the corner factor does not apply."""
    g = AnchorGroup("headed bolt", Q_(1, IN), Q_(12, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(24, IN), edges={"+x": Q_(3, IN)}, A_brg=Q_(1.0, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(5, "kip")))
    assert _lbf(r.values["N_sb_x2"]) == pytest.approx(160 * 3 * 1.0 * math.sqrt(4000), rel=REL)
    assert r["Side-face blowout, edge +x"].capacity.to("lbf").magnitude == pytest.approx(
        0.70 * 160 * 3 * math.sqrt(4000), rel=REL
    )


def test_single_anchor_in_shear_towards_an_edge_in_a_thin_slab() -> None:
    """5/8 in. headed bolt, h_ef = 6 in., 6 in. from the +x edge, other edges far, slab 8 in.,
    f'c = 4000 psi, cracked, no edge bars; V_ua = 3 kip towards +x.
    A_Vc = 3·6·min(9, 8) = 144 in.², A_Vco = 4.5·36 = 162 in.² (§17.7.2.1.1, Eq. 17.7.2.1.3);
    l_e = min(6, 8·0.625) = 5 in.; V_b = min(7 (5/0.625)^0.2 √0.625 √4000 6^1.5,
    9 √4000 6^1.5) (Eq. 17.7.2.2.1a, b); ψ_h,V = √(9/8) (Eq. 17.7.2.6.1)."""
    g = AnchorGroup("headed bolt", Q_(0.625, IN), Q_(6, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(8, IN), edges={"+x": Q_(6, IN)}, A_brg=Q_(0.5, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(V=Q_(3, "kip"), toward="+x"))
    assert r.values["A_Vc_x2"].to("inch**2").magnitude == pytest.approx(144, rel=REL)
    assert r.values["A_Vco_x2"].to("inch**2").magnitude == pytest.approx(162, rel=REL)
    sfc = math.sqrt(4000)
    Vb = min(7 * (5 / 0.625) ** 0.2 * math.sqrt(0.625) * sfc * 6**1.5, 9 * sfc * 6**1.5)
    assert _lbf(r.values["V_b_x2"]) == pytest.approx(Vb, rel=REL)
    Vcb = 144 / 162 * math.sqrt(9 / 8) * Vb
    assert _lbf(r.values["V_cb_x2"]) == pytest.approx(Vcb, rel=REL)
    assert r["Concrete breakout in shear, edge +x"].capacity.to("lbf").magnitude == (
        pytest.approx(0.70 * Vcb, rel=REL)
    )
    # Eq. (17.7.1.2b): V_sa = 0.6 A_se f_uta; φ = 0.65 ductile (Table 17.5.3(b))
    A_se = math.pi / 4 * (0.625 - 0.9743 / 11) ** 2
    assert _lbf(r.values["V_sa"]) == pytest.approx(0.6 * A_se * 58000, rel=REL)
    # Eq. (17.7.3.1a): V_cp = 2.0 N_cb (h_ef ≥ 2.5 in.), N_cb with the +x edge at 6 in. < 9 in.:
    # A_Nc = (9 + 6)·18 = 270 in.², ψ_ed,N = 0.7 + 0.3·6/9 = 0.9 (Eq. 17.6.2.4.1b)
    Ncb = 270 / 324 * 0.9 * 24 * sfc * 6**1.5
    assert _lbf(r.values["V_cp"]) == pytest.approx(2 * Ncb, rel=REL)


def test_edge_factor_and_narrow_member_in_shear() -> None:
    """Shear towards +x (c_a1 = 10 in.) with edges across at 4 in. and 8 in. and h_a = 10 in.:
    both c_a2 < 15 in. and h_a < 15 in., so c_a1 = max(8/1.5, 10/1.5) = 6.67 in.
    (§17.7.2.1.2); ψ_ed,V = 0.7 + 0.3·4/(1.5·6.67) (Eq. 17.7.2.4.1b)."""
    g = AnchorGroup("headed bolt", Q_(0.75, IN), Q_(6, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(10, IN), edges={"+x": Q_(10, IN), "-y": Q_(4, IN), "+y": Q_(8, IN)},
                    A_brg=Q_(0.654, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(V=Q_(2, "kip"), toward="+x"))
    ca1 = 10 / 1.5
    assert r.values["c_a1_used_x2"].to(IN).magnitude == pytest.approx(ca1, rel=REL)
    assert r.values["psi_ed_V_x2"].magnitude == pytest.approx(0.7 + 0.3 * 4 / (1.5 * ca1))
    # A_Vc = (min(4, 10) + min(8, 10))·min(10, 10) = 120 in.²
    assert r.values["A_Vc_x2"].to("inch**2").magnitude == pytest.approx(120, rel=REL)


def test_interaction_when_both_ratios_exceed_one_fifth() -> None:
    """§17.8.3: N_ua/φN_n + V_ua/φV_n ≤ 1.2, each ratio the largest of its modes."""
    g = AnchorGroup("headed bolt", Q_(0.625, IN), Q_(6, IN), "F1554 Gr. 36", Q_(4000, "psi"),
                    Q_(12, IN), A_brg=Q_(0.5, "inch**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(6, "kip"), V=Q_(3, "kip"), toward="+x"))
    zN = max(res.utilisation for res in r.results if res.name in
             ("Steel strength in tension", "Concrete breakout in tension", "Pullout"))  # fmt: skip
    zV = max(res.utilisation for res in r.results if res.name in
             ("Steel strength in shear", "Pryout"))  # fmt: skip
    assert zN > 0.2
    assert zV > 0.2
    inter = r["Tension and shear interaction"]
    assert inter.demand.magnitude == pytest.approx(zN + zV, rel=REL)
    assert inter.capacity.magnitude == pytest.approx(1.2)


def test_si_inputs_agree_with_the_si_edition_constants() -> None:
    """ACI CODE-318M-19 writes N_b = 10 λ_a √f'c h_ef^1.5 and V_b = min(0.6 (l_e/d_a)^0.2 √d_a
    λ_a √f'c c_a1^1.5, 3.7 λ_a √f'c c_a1^1.5) (f'c in MPa, lengths in mm, N). calcpack evaluates
    the in.-lb forms with units; the SI constants are the in.-lb ones rounded (24 → 10.04,
    7 → 0.581, 9 → 3.76), so within 0.5 % for N_b and 4 % for V_b."""
    g = AnchorGroup("headed bolt", Q_(16, "mm"), Q_(200, "mm"), "F1554 Gr. 36", Q_(30, "MPa"),
                    Q_(400, "mm"), edges={"+x": Q_(150, "mm")},
                    A_brg=Q_(400, "mm**2"), A_se=Q_(157, "mm**2"))  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(10, "kN"), V=Q_(5, "kN"), toward="+x"))
    Nb_si = 10 * math.sqrt(30) * 200**1.5  # N
    assert r.values["N_b"].to("N").magnitude == pytest.approx(Nb_si, rel=0.005)
    le = min(200, 8 * 16)
    Vb_si = min(0.6 * (le / 16) ** 0.2 * math.sqrt(16), 3.7) * math.sqrt(30) * 150**1.5
    assert r.values["V_b_x2"].to("N").magnitude == pytest.approx(Vb_si, rel=0.04)
