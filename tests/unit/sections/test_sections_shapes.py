"""Shapes: construction, validation messages naming the dimension, simple properties."""

from __future__ import annotations

import math

import pytest

from calcpack.errors import DimensionError, InputError, OutOfScopeError
from calcpack.sections import (
    Angle,
    Channel,
    Circle,
    HollowCircle,
    ISection,
    Polygon,
    Rectangle,
    RectangularHollow,
    Tee,
    Triangle,
)
from calcpack.units import ureg

mm = ureg.mm


@pytest.mark.parametrize(
    ("make", "name"),
    [
        (lambda: Rectangle(b=0 * mm, d=10 * mm), "b"),
        (lambda: Rectangle(b=10 * mm, d=-5 * mm), "d"),
        (lambda: Circle(d=0 * mm), "d"),
        (lambda: HollowCircle(D=100 * mm, t=-1 * mm), "t"),
        (lambda: Triangle(b=10 * mm, h=0 * mm), "h"),
        (lambda: ISection(d=300 * mm, bf=150 * mm, tf=0 * mm, tw=7 * mm), "tf"),
        (lambda: Tee(d=100 * mm, bf=-100 * mm, tf=10 * mm, tw=7 * mm), "bf"),
        (lambda: Angle(d=100 * mm, b=75 * mm, t=0 * mm), "t"),
        (lambda: Channel(d=200 * mm, bf=75 * mm, tf=10 * mm, tw=-6 * mm), "tw"),
    ],
)
def test_zero_or_negative_dimension_is_refused_by_name(make, name):
    with pytest.raises(InputError, match=rf"\b{name} must be positive") as info:
        make()
    assert info.value.name == name


def test_bare_number_dimension_is_refused():
    with pytest.raises(DimensionError, match="b"):
        Rectangle(b=100, d=10 * mm)


def test_web_thicker_than_flange_is_wide():
    with pytest.raises(InputError) as info:
        ISection(d=300 * mm, bf=10 * mm, tf=10 * mm, tw=12 * mm)
    msg = str(info.value)
    assert "Web thickness tw must be less than flange width bf" in msg
    assert "tw = 12 mm" in msg
    assert "bf = 10 mm" in msg
    assert info.value.name == "tw"


@pytest.mark.parametrize(
    ("make", "name", "words"),
    [
        (lambda: ISection(d=20 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm), "tf", "depth d"),
        (lambda: ISection(d=300 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm, r=80 * mm), "r", "fit"),
        (lambda: Tee(d=100 * mm, bf=100 * mm, tf=10 * mm, tw=120 * mm), "tw", "flange width"),
        (lambda: Tee(d=10 * mm, bf=100 * mm, tf=10 * mm, tw=10 * mm), "tf", "depth d"),
        (lambda: Channel(d=20 * mm, bf=75 * mm, tf=10 * mm, tw=6 * mm), "tf", "half the depth"),
        (lambda: Angle(d=100 * mm, b=8 * mm, t=8 * mm), "t", "leg length b"),
        (lambda: HollowCircle(D=100 * mm, t=50 * mm), "t", "half the outside diameter"),
        (lambda: RectangularHollow(b=100 * mm, d=200 * mm, t=50 * mm), "t", "half the width"),
        (
            lambda: RectangularHollow(b=100 * mm, d=200 * mm, t=5 * mm, r=60 * mm),
            "r",
            "half the smaller",
        ),
    ],
)
def test_inconsistent_dimensions_are_refused_by_name(make, name, words):
    with pytest.raises(InputError, match=words) as info:
        make()
    assert info.value.name == name
    assert name in str(info.value)


def test_rectangle_closed_forms():
    p = Rectangle(b=100 * mm, d=300 * mm).properties()
    assert p.A.to("mm**2").magnitude == pytest.approx(30000, rel=1e-12)
    assert p.y_bar.to("mm").magnitude == pytest.approx(150, rel=1e-12)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(100 * 300**3 / 12, rel=1e-12)
    assert p.Sx.to("mm**3").magnitude == pytest.approx(100 * 300**2 / 6, rel=1e-12)
    assert p.Zx.to("mm**3").magnitude == pytest.approx(100 * 300**2 / 4, rel=1e-9)
    assert p.Ixy.to("mm**4").magnitude == pytest.approx(0, abs=1e-3)
    assert p.theta_p.to("degree").magnitude == pytest.approx(0)


def test_shape_names_describe_the_size():
    assert Rectangle(b=100 * mm, d=300 * mm).name == "rectangle 100 × 300 mm"
    assert Rectangle(b=100 * mm, d=300 * mm, name="joist").name == "joist"


def test_i_section_exposes_plate_dimensions_for_compactness():
    s = ISection(d=300 * mm, bf=150 * mm, tf=10.7 * mm, tw=7.1 * mm, r=15 * mm)
    assert s.h.to("mm").magnitude == pytest.approx(300 - 2 * 10.7 - 2 * 15)
    assert s.h0.to("mm").magnitude == pytest.approx(300 - 10.7)
    assert s.doubly_symmetric
    assert s.bf_bottom == s.bf
    assert s.tf_bottom == s.tf
    p = s.properties()
    # Cw = Iy h0² / 4 (AISC Design Guide 9, common practice)
    assert p.Cw.to("mm**6").magnitude == pytest.approx(
        p.Iy.to("mm**4").magnitude * (300 - 10.7) ** 2 / 4, rel=1e-12
    )


def test_singly_symmetric_i_centroid_moves_towards_the_larger_flange():
    s = ISection(d=400 * mm, bf=200 * mm, tf=20 * mm, tw=10 * mm, bf_bot=100 * mm, tf_bot=10 * mm)
    assert not s.doubly_symmetric
    p = s.properties()
    assert p.y_bar > 200 * mm
    assert p.Sx_top > p.Sx_bottom
    assert p.Sx == p.Sx_bottom
    # Cw = h0² I_top I_bot / (I_top + I_bot) with the flanges' own Iy (AISC Design Guide 9)
    h0 = 400 - 15
    it, ib = 20 * 200**3 / 12, 10 * 100**3 / 12
    assert p.Cw.to("mm**6").magnitude == pytest.approx(h0**2 * it * ib / (it + ib))


def test_polygon_vertices_in_either_order_agree():
    pts = [(0, 0), (120, 0), (120, 20), (40, 20), (40, 90), (0, 90)]
    ccw = Polygon(vertices=pts * mm).properties()
    cw = Polygon(vertices=list(reversed(pts)) * mm).properties()
    assert ccw.A.magnitude == pytest.approx(cw.A.magnitude)
    assert ccw.Ix.magnitude == pytest.approx(cw.Ix.magnitude)
    assert ccw.Ixy.magnitude == pytest.approx(cw.Ixy.magnitude)


def test_polygon_accepts_pairs_of_quantities():
    p = Polygon(vertices=[(0 * mm, 0 * mm), (1 * ureg.cm, 0 * mm), (10 * mm, 1 * ureg.cm)])
    assert p.properties().A.to("mm**2").magnitude == pytest.approx(50)


def test_self_intersecting_polygon_is_refused():
    bow_tie = [(0, 0), (100, 100), (100, 0), (0, 100)] * mm
    with pytest.raises(InputError, match="simple") as info:
        Polygon(vertices=bow_tie)
    assert info.value.name == "vertices"
    assert "edge 0" in str(info.value)


@pytest.mark.parametrize(
    ("pts", "words"),
    [
        ([(0, 0), (100, 0)], "at least 3"),
        ([(0, 0), (100, 0), (100, 0), (0, 50)], "same point"),
        ([(0, 0), (50, 0), (100, 0)], "simple|zero area"),
    ],
)
def test_degenerate_polygons_are_refused(pts, words):
    with pytest.raises(InputError, match=words) as info:
        Polygon(vertices=pts * mm)
    assert "vertices" in (info.value.name or "")


def test_polygon_has_no_torsion_constant():
    p = Polygon(vertices=[(0, 0), (100, 0), (0, 100)] * mm).properties()
    with pytest.raises(OutOfScopeError, match="Torsion constant J"):
        p.J


def test_circle_and_tube_torsion_constants():
    assert Circle(d=40 * mm).properties().J.to("mm**4").magnitude == pytest.approx(
        math.pi * 40**4 / 32
    )
    tube = HollowCircle(D=100 * mm, t=5 * mm).properties()
    assert tube.J.to("mm**4").magnitude == pytest.approx(math.pi * (100**4 - 90**4) / 32)


def test_rectangular_hollow_bredt_torsion_constant():
    # sharp corners: J = 4 A_m² t / p_m on the centre line (Bredt-Batho, common practice)
    p = RectangularHollow(b=100 * mm, d=200 * mm, t=5 * mm).properties()
    am = 95 * 195
    pm = 2 * (95 + 195)
    assert p.J.to("mm**4").magnitude == pytest.approx(4 * am**2 * 5 / pm)
    assert p.A.to("mm**2").magnitude == pytest.approx(100 * 200 - 90 * 190)


def test_q_and_width_at_levels_of_a_rectangle():
    s = Rectangle(b=100 * mm, d=300 * mm)
    # Q at the centroid = b (d/2)² / 2; zero at the extreme fibres
    assert s.Q(y=150 * mm).to("mm**3").magnitude == pytest.approx(100 * 150**2 / 2)
    assert s.Q(y=300 * mm).to("mm**3").magnitude == pytest.approx(0, abs=1e-6)
    assert s.Q(y=0 * mm).to("mm**3").magnitude == pytest.approx(0, abs=1e-3)
    assert s.width_at(y=10 * mm).to("mm").magnitude == pytest.approx(100)


def test_q_level_outside_the_section_is_refused():
    with pytest.raises(InputError, match="Level y must lie within") as info:
        Rectangle(b=100 * mm, d=300 * mm).Q(y=400 * mm)
    assert info.value.name == "y"


def test_thick_plates_have_no_thin_walled_torsion_constant():
    stubby = Tee(d=40 * mm, bf=60 * mm, tf=25 * mm, tw=20 * mm)
    with pytest.raises(OutOfScopeError, match="not thin"):
        stubby.properties().J


def test_tee_and_angle_warping_constant_is_refused():
    with pytest.raises(OutOfScopeError, match="Warping constant"):
        Angle(d=100 * mm, b=100 * mm, t=10 * mm).properties().Cw
