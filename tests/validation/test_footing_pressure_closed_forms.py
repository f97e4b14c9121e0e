"""Contact pressure under a rigid footing against the closed forms of the trade.

Source: common practice (every foundation text): uniform pressure q = P/A; full contact
q = P/A·(1 ± 6e/B) with the kern e ≤ B/6 (rectangle) and e ≤ D/8 (circle, q = P/A·(1 ± 8e/D));
partial contact on a rectangle, the pressure triangle q_max = 2P / (3 L (B/2 − e)) over the
contact length 3 (B/2 − e).
"""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError, OutOfScopeError
from calcpack.foundations import Column, Footing, soil_pressure
from calcpack.units import Q_


def _rect(B=2.0, L=3.0):
    return Footing("rectangular", Q_(B, "m"), Q_(0.5, "m"), Column(Q_(0.3, "m")), L=Q_(L, "m"))


def _q(f, N, ex, ey=0.0):
    return soil_pressure(
        f.polygon_m(), Q_(N, "kN"), Q_(ex, "m"), Q_(ey, "m"), shape=f.shape, B=f.B, L=f.length
    )


def test_uniform_pressure_is_P_over_A():
    p = _q(_rect(), 600, 0.0)
    assert p.q_max.to("kPa").magnitude == pytest.approx(100.0)  # 600/6, common practice
    assert p.q_min.to("kPa").magnitude == pytest.approx(100.0)
    assert p.full_contact


def test_trapezoid_inside_the_kern():
    p = _q(_rect(), 600, 0.2)
    assert p.q_max.to("kPa").magnitude == pytest.approx(100 * (1 + 6 * 0.2 / 2))
    assert p.q_min.to("kPa").magnitude == pytest.approx(100 * (1 - 6 * 0.2 / 2))


def test_kern_limit_gives_a_triangle_with_zero_at_the_far_edge():
    p = _q(_rect(), 600, 2.0 / 6)
    assert p.full_contact
    assert p.q_max.to("kPa").magnitude == pytest.approx(200.0)  # 2P/A at e = B/6
    assert p.q_min.to("kPa").magnitude == pytest.approx(0.0, abs=1e-9)


@pytest.mark.parametrize("e", [0.4, 0.5, 0.7, 0.9])
def test_partial_contact_triangle(e):
    p = _q(_rect(), 600, e)
    assert not p.full_contact
    # q_max = 2P / (3 L (B/2 - e)), common practice; solver tolerance 1e-9 relative
    assert p.q_max.to("kPa").magnitude == pytest.approx(2 * 600 / (3 * 3 * (1 - e)), rel=1e-8)
    assert p.contact_area.to("m**2").magnitude == pytest.approx(3 * (1 - e) * 3, rel=1e-8)


def test_partial_contact_along_y_matches_the_triangle_too():
    p = _q(_rect(), 600, 0.0, 0.9)
    # strip of width B = 2 along x, length L = 3 along y: 2P / (3 B (L/2 - e))
    assert p.q_max.to("kPa").magnitude == pytest.approx(2 * 600 / (3 * 2 * (1.5 - 0.9)), rel=1e-8)


def test_circle_kern_is_D_over_8():
    f = Footing("round", Q_(2, "m"), Q_(0.5, "m"), Column(Q_(0.3, "m")))
    A = math.pi
    p = _q(f, 600, 0.25)
    assert p.full_contact
    assert p.q_max.to("kPa").magnitude == pytest.approx(600 / A * (1 + 8 * 0.25 / 2))
    assert p.q_min.to("kPa").magnitude == pytest.approx(0.0, abs=1e-9)
    assert not _q(f, 600, 0.26).full_contact


def test_resultant_off_the_base_is_refused():
    with pytest.raises(OutOfScopeError, match="overturns"):
        _q(_rect(), 600, 1.0)


def test_net_uplift_has_no_contact_pressure():
    with pytest.raises(InputError, match="Input N"):
        _q(_rect(), -10, 0.0)
