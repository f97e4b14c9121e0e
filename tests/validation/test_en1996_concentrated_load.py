"""Concentrated loads on masonry, BS EN 1996-1-1:2005+A1:2012 §6.1.3 (Eq. (6.9), (6.10),
Figure 6.2) and Eq. (3.1), with the UK NA values γ_M = 2.7 (category I units, execution class
2) and K = 0.50 (Group 1, general purpose mortar) -- from memory. The padstone check is
EN 1992-1-1 §6.7 Eq. (6.63) with α_cc = 0.85, γ_c = 1.5 (UK NA). Expected values are worked
out by hand from the printed equations below; tolerance 1e-9 (same arithmetic, other order).
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.en1996 import MasonryWall, Padstone, check_en1996_bearing, masonry_fk
from calcpack.units import Q_


def test_fk_from_unit_and_mortar_strength():
    # f_k = K f_b^0.7 f_m^0.3 = 0.50 x 10^0.7 x 4^0.3 (Eq. 3.1)
    assert masonry_fk(1, Q_(10, "MPa"), Q_(4, "MPa")).to("MPa").magnitude == pytest.approx(
        0.5 * 10**0.7 * 4**0.3, rel=1e-12
    )


def test_padstone_near_the_end_of_a_wall():
    fk = 0.5 * 10**0.7 * 4**0.3
    # a_1 = 150 mm: wall end to the padstone's end
    w = MasonryWall(t=Q_(102.5, "mm"), f_k=Q_(fk, "MPa"), h_c=Q_(2.4, "m"), a_1=Q_(150, "mm"))
    pad = Padstone(Q_(440, "mm"), Q_(100, "mm"), Q_(150, "mm"))
    r = check_en1996_bearing(w, N_Ed=Q_(40, "kN"), bearing_length=Q_(100, "mm"),
                             bearing_width=Q_(100, "mm"), padstone=pad, mark="PS1")  # fmt: skip
    # loaded area: 45° through 150 mm: min(440, 100 + 300) x min(100, 400, 102.5), centred
    # on the centred bearing, so it starts (440 - 400)/2 = 20 mm in from the padstone's end:
    # a_1 = 150 + 20 = 170 mm to the loaded area (§6.1.3(3), Figure 6.2)
    lb, wb, a1 = 400.0, 100.0, 170.0
    spread = 1200 * math.tan(math.radians(30))
    lefm = lb + min(a1, spread) + spread
    ratio = min(lb * wb / (lefm * 102.5), 0.45)
    beta = max(min((1 + 0.3 * a1 / 2400) * (1.5 - 1.1 * ratio), 1.25 + a1 / 4800, 1.5), 1.0)
    NR = beta * lb * wb * fk / 2.7 / 1e3
    assert r.beta == pytest.approx(beta, rel=1e-9)
    assert r.checks["Masonry bearing (6.1.3)"].capacity.to("kN").magnitude == pytest.approx(
        NR, rel=1e-9
    )
    # padstone: A_c0 = 100 x 100; A_c1 is similar in shape to A_c0 (EN 1992-1-1 §6.7(2)) and
    # lies within the padstone, which is no wider than the bearing (100 mm): A_c1 = A_c0, so
    # √(A_c1/A_c0) = 1 (a 300 x 100 area would not be similar to the square A_c0)
    FR = 100 * 100 * 0.85 * 30 / 1.5 * 1.0 / 1e3
    assert r.checks["Padstone bearing (EN 1992-1-1 6.7)"].capacity.to("kN").magnitude == (
        pytest.approx(FR, rel=1e-9)
    )


def test_direct_bearing_far_from_an_end_reaches_the_cap():
    # a small bearing far from an end: β = min(1.25 + a1/(2h_c), 1.5) = 1.5 governs
    w = MasonryWall(t=Q_(215, "mm"), f_k=Q_(5.0, "MPa"), h_c=Q_(2.5, "m"))
    r = check_en1996_bearing(w, N_Ed=Q_(20, "kN"), bearing_length=Q_(100, "mm"),
                             bearing_width=Q_(100, "mm"))  # fmt: skip
    assert r.beta == pytest.approx(1.5, rel=1e-12)


def test_group_2_units_get_no_enhancement():
    w = MasonryWall(t=Q_(100, "mm"), f_k=Q_(4.0, "MPa"), h_c=Q_(2.5, "m"), group=2)
    r = check_en1996_bearing(w, N_Ed=Q_(20, "kN"), bearing_length=Q_(200, "mm"),
                             bearing_width=Q_(100, "mm"))  # fmt: skip
    assert r.beta == 1.0
    cap = r.checks["Masonry bearing (6.1.3)"].capacity.to("kN").magnitude
    assert cap == pytest.approx(200 * 100 * 4.0 / 2.7 / 1e3, rel=1e-9)


def test_beam_end_at_the_padstone_end_flush_with_a_jamb():
    # The beam end sits at the padstone's end and the padstone is flush with the wall end
    # (a_p = 0). The load's line is 50 mm from the padstone's end, so a uniform stress concentric
    # with it can spread only 50 mm each way: l_b = 2 x 50 = 100 mm, not 100 + 2 x 150 (common
    # practice: the loaded area is kept concentric with the load, as for the effective area of an
    # eccentrically loaded base); a_1 = 0 to the loaded area (§6.1.3(3)).
    fk = 0.5 * 20**0.7 * 4**0.3  # Eq. (3.1), f_b = 20, f_m = 4 MPa
    w = MasonryWall(t=Q_(215, "mm"), f_k=Q_(fk, "MPa"), h_c=Q_(2.3, "m"), a_1=Q_(0, "mm"))
    pad = Padstone(Q_(440, "mm"), Q_(215, "mm"), Q_(150, "mm"), end_to_bearing=Q_(0, "mm"))
    r = check_en1996_bearing(w, N_Ed=Q_(60, "kN"), bearing_length=Q_(100, "mm"),
                             bearing_width=Q_(130, "mm"), padstone=pad, mark="P1")  # fmt: skip
    lb, wb = 100.0, 215.0  # w_b = min(215, 130 + 300, 215)
    spread = 1150 * math.tan(math.radians(30))  # 60° to mid-height, Figure 6.2
    lefm = lb + 0.0 + spread  # stopped by the wall end on the left
    ratio = min(lb * wb / (lefm * 215), 0.45)  # §6.1.3(3)
    # Eq. (6.10) with a_1 = 0: (1 + 0)(1.5 - 1.1 x 0.131) = 1.356 > cap 1.25 + 0 = 1.25
    beta = max(min(1.5 - 1.1 * ratio, 1.25, 1.5), 1.0)
    assert beta == pytest.approx(1.25, rel=1e-12)
    assert r.beta == pytest.approx(beta, rel=1e-9)
    NR = beta * lb * wb * fk / 2.7 / 1e3  # Eq. (6.9), γ_M = 2.7
    assert r.checks["Masonry bearing (6.1.3)"].capacity.to("kN").magnitude == pytest.approx(
        NR, rel=1e-9
    )
    # padstone, EN 1992-1-1 §6.7(3): A_c1 concentric with A_c0 = 100 x 130 cannot reach past the
    # padstone's end 0 mm behind the bearing, so A_c1 = A_c0 and F_Rdu = A_c0 f_cd (Eq. 6.63)
    FR = 100 * 130 * 0.85 * 30 / 1.5 / 1e3
    assert r.checks["Padstone bearing (EN 1992-1-1 6.7)"].capacity.to("kN").magnitude == (
        pytest.approx(FR, rel=1e-9)
    )
    # centred on the same padstone both capacities are higher (the case this replaces)
    centred = check_en1996_bearing(
        w, N_Ed=Q_(60, "kN"), bearing_length=Q_(100, "mm"), bearing_width=Q_(130, "mm"),
        padstone=Padstone(Q_(440, "mm"), Q_(215, "mm"), Q_(150, "mm")),
    )  # fmt: skip
    assert centred.checks.governing.utilisation < r.checks.governing.utilisation


def test_bearing_part_way_along_a_padstone_near_a_wall_end():
    # bearing 100 x 100 with its near edge 60 mm from the end of a 440 x 300 x 150 padstone that
    # is 300 mm from the wall end; load line x_c = 60 + 50 = 110 mm from the padstone's end
    fk = 6.0
    w = MasonryWall(t=Q_(300, "mm"), f_k=Q_(fk, "MPa"), h_c=Q_(2.4, "m"), a_1=Q_(300, "mm"))
    pad = Padstone(Q_(440, "mm"), Q_(300, "mm"), Q_(150, "mm"), end_to_bearing=Q_(60, "mm"))
    r = check_en1996_bearing(w, N_Ed=Q_(60, "kN"), bearing_length=Q_(100, "mm"),
                             bearing_width=Q_(100, "mm"), padstone=pad, mark="P3")  # fmt: skip
    l_c = 2 * min(110, 440 - 110)  # 220 mm of padstone centred on the load
    lb = min(l_c, 100 + 2 * 150)  # 220 mm, from 0 to 220 mm along the padstone
    wb = min(300, 100 + 300, 300)
    a1 = 300 + 110 - lb / 2  # 300 mm to the loaded area
    spread = 1200 * math.tan(math.radians(30))
    lefm = lb + min(a1, spread) + spread
    ratio = min(lb * wb / (lefm * 300), 0.45)
    beta = max(min((1 + 0.3 * a1 / 2400) * (1.5 - 1.1 * ratio), 1.25 + a1 / 4800, 1.5), 1.0)
    assert r.beta == pytest.approx(beta, rel=1e-9)
    NR = beta * lb * wb * fk / 2.7 / 1e3
    assert r.checks["Masonry bearing (6.1.3)"].capacity.to("kN").magnitude == pytest.approx(
        NR, rel=1e-9
    )
    # EN 1992-1-1 §6.7(2), (3), Figure 6.29 (conditions from memory): A_c1 similar to and
    # concentric with the square A_c0: side ≤ l_c = 220 (padstone end), ≤ 300 (width),
    # ≤ 100 + 150 (depth), ≤ 3 x 100, so k = 2.2 and √(A_c1/A_c0) = 2.2
    FR = 100 * 100 * 0.85 * 30 / 1.5 * 2.2 / 1e3
    assert r.checks["Padstone bearing (EN 1992-1-1 6.7)"].capacity.to("kN").magnitude == (
        pytest.approx(FR, rel=1e-9)
    )
