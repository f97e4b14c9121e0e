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
    w = MasonryWall(t=Q_(102.5, "mm"), f_k=Q_(fk, "MPa"), h_c=Q_(2.4, "m"), a_1=Q_(150, "mm"))
    pad = Padstone(Q_(440, "mm"), Q_(100, "mm"), Q_(150, "mm"))
    r = check_en1996_bearing(w, N_Ed=Q_(40, "kN"), bearing_length=Q_(100, "mm"),
                             bearing_width=Q_(100, "mm"), padstone=pad, mark="PS1")  # fmt: skip
    # loaded area: 45° through 150 mm: min(440, 100 + 300) x min(100, 400, 102.5)
    lb, wb = 400.0, 100.0
    spread = 1200 * math.tan(math.radians(30))
    lefm = lb + min(150, spread) + spread
    ratio = min(lb * wb / (lefm * 102.5), 0.45)
    beta = max(min((1 + 0.3 * 150 / 2400) * (1.5 - 1.1 * ratio), 1.25 + 150 / 4800, 1.5), 1.0)
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
