"""Closed-form section properties and the parallel-axis theorem.

Source: W. C. Young and R. G. Budynas, *Roark's Formulas for Stress and Strain*, 7th ed.,
McGraw-Hill, 2002, Table A.1 "Properties of sections" (formulas from memory); the same closed
forms are common practice in every strength-of-materials text. The formulas are evaluated
here independently of calcpack's Green's-theorem and circle code.
"""

from __future__ import annotations

import math

import pytest

from calcpack.sections import Circle, HollowCircle, Polygon, Rectangle, Triangle, composite
from calcpack.units import ureg

mm = ureg.mm

EXACT = 1e-12  # closed forms and the polygon sums are both exact: only rounding differs


def test_rectangle_bh3_over_12():
    b, h = 140.0, 360.0
    p = Rectangle(b=b * mm, d=h * mm).properties()
    assert p.Ix.to("mm**4").magnitude == pytest.approx(b * h**3 / 12, rel=EXACT)
    assert p.Iy.to("mm**4").magnitude == pytest.approx(h * b**3 / 12, rel=EXACT)
    assert p.rx.to("mm").magnitude == pytest.approx(h / math.sqrt(12), rel=EXACT)


@pytest.mark.parametrize("apex", [0.0, 35.0, 100.0, 160.0])
def test_triangle_bh3_over_36_about_its_centroid(apex):
    b, h = 100.0, 240.0
    p = Triangle(b=b * mm, h=h * mm, apex=apex * mm).properties()
    assert p.A.to("mm**2").magnitude == pytest.approx(b * h / 2, rel=EXACT)
    assert p.y_bar.to("mm").magnitude == pytest.approx(h / 3, rel=EXACT)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(b * h**3 / 36, rel=EXACT)
    # Roark Table A.1 case 4 (from memory): c_top = 2h/3, so S_top = bh²/24
    assert p.Sx_top.to("mm**3").magnitude == pytest.approx(b * h**2 / 24, rel=EXACT)


def test_circle_pi_d4_over_64():
    d = 75.0
    p = Circle(d=d * mm).properties()
    assert p.A.to("mm**2").magnitude == pytest.approx(math.pi * d**2 / 4, rel=EXACT)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(math.pi * d**4 / 64, rel=EXACT)
    assert p.Sx.to("mm**3").magnitude == pytest.approx(math.pi * d**3 / 32, rel=EXACT)
    # plastic modulus of a solid circle Z = d³/6 (common practice); bisection to 1e-12
    assert p.Zx.to("mm**3").magnitude == pytest.approx(d**3 / 6, rel=1e-9)


def test_hollow_circle():
    D, t = 168.3, 7.1
    d = D - 2 * t
    p = HollowCircle(D=D * mm, t=t * mm).properties()
    assert p.A.to("mm**2").magnitude == pytest.approx(math.pi * (D**2 - d**2) / 4, rel=EXACT)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(math.pi * (D**4 - d**4) / 64, rel=EXACT)
    # Z = (D³ - d³)/6 (common practice)
    assert p.Zx.to("mm**3").magnitude == pytest.approx((D**3 - d**3) / 6, rel=1e-9)


def test_parallel_axis_theorem_common_practice():
    # I about an axis at distance e from the centroid = Ī + A e² (common practice)
    b, h, e = 80.0, 20.0, 150.0
    plate = Rectangle(b=b * mm, d=h * mm)
    pair = composite(
        plate.at(x=0 * mm, y=e * mm, anchor="corner"),
        plate.at(x=0 * mm, y=-(e + h) * mm, anchor="corner"),
    ).properties()
    d = e + h / 2
    assert pair.Ix.to("mm**4").magnitude == pytest.approx(
        2 * (b * h**3 / 12 + b * h * d**2), rel=EXACT
    )


def test_rectangle_plastic_modulus_bh2_over_4():
    p = Rectangle(b=50 * mm, d=200 * mm).properties()
    assert p.Zx.to("mm**3").magnitude == pytest.approx(50 * 200**2 / 4, rel=1e-9)
    assert p.Zy.to("mm**3").magnitude == pytest.approx(200 * 50**2 / 4, rel=1e-9)


def test_rectangle_shear_first_moment():
    # Q at the neutral axis of a rectangle = b h² / 8, so τ_max = 1.5 V / A (common practice)
    p = Rectangle(b=60 * mm, d=240 * mm).properties()
    assert p.Q(y=120 * mm).to("mm**3").magnitude == pytest.approx(60 * 240**2 / 8, rel=EXACT)


def test_polygon_agrees_with_composite_of_rectangles():
    # the same channel-like outline as one polygon and as three rectangles
    poly = Polygon(
        vertices=[(0, 0), (90, 0), (90, 12), (8, 12), (8, 188), (90, 188), (90, 200), (0, 200)] * mm
    ).properties()
    parts = composite(
        Rectangle(b=8 * mm, d=200 * mm).at(x=0 * mm, y=0 * mm),
        Rectangle(b=82 * mm, d=12 * mm).at(x=8 * mm, y=0 * mm),
        Rectangle(b=82 * mm, d=12 * mm).at(x=8 * mm, y=188 * mm),
    ).properties()
    for key in ("A", "x_bar", "y_bar", "Ix", "Iy", "Zx", "Zy", "Sy_left", "Sy_right"):
        assert getattr(poly, key).magnitude == pytest.approx(
            getattr(parts, key).magnitude, rel=1e-9
        ), key
    assert poly.Ixy.magnitude == pytest.approx(parts.Ixy.magnitude, abs=1e-3)


def test_i_section_first_moment_at_the_neutral_axis():
    # Q_NA = bf tf (d - tf)/2 + tw (d/2 - tf)²/2 for a plate I (common practice); b = tw there
    from calcpack.sections import ISection

    d, bf, tf, tw = 400.0, 180.0, 14.0, 9.0
    s = ISection(d=d * mm, bf=bf * mm, tf=tf * mm, tw=tw * mm)
    want = bf * tf * (d - tf) / 2 + tw * (d / 2 - tf) ** 2 / 2
    assert s.Q(y=d / 2 * mm).to("mm**3").magnitude == pytest.approx(want, rel=EXACT)
    assert s.width_at(y=d / 2 * mm).to("mm").magnitude == pytest.approx(tw, rel=EXACT)
    # Z = 2 Q_NA for a doubly symmetric section (common practice)
    assert s.properties().Zx.to("mm**3").magnitude == pytest.approx(2 * want, rel=1e-9)
