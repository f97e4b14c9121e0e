"""Property tests for sections: translation and rotation invariance, splitting, units, Q."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from section_strategies import fractions, i_sections, lengths, offsets, open_shapes

from calcpack.sections import Polygon, Rectangle, composite
from calcpack.units import ureg

mm = ureg.mm
SETTINGS = settings(max_examples=40, deadline=None)
CENTROIDAL = ("A", "Ix", "Iy", "I1", "I2", "Sx_top", "Sx_bottom", "Sy_left", "Sy_right")


def _mag(q, unit):
    return q.to(unit).magnitude


@SETTINGS
@given(open_shapes(), offsets, offsets)
def test_translation_leaves_centroidal_properties_unchanged(shape, dx, dy):
    base = shape.properties()
    moved = composite(shape.at(x=dx * mm, y=dy * mm)).properties()
    for key in CENTROIDAL:
        a, b = getattr(base, key), getattr(moved, key)
        assert b.magnitude == pytest.approx(a.to(b.units).magnitude, rel=1e-9), key
    assert _mag(moved.Ixy, "mm**4") == pytest.approx(
        _mag(base.Ixy, "mm**4"), abs=1e-9 * _mag(base.I1, "mm**4")
    )
    assert _mag(moved.Zx, "mm**3") == pytest.approx(_mag(base.Zx, "mm**3"), rel=1e-7)
    assert _mag(moved.x_bar - base.x_bar, "mm") == pytest.approx(dx, abs=1e-6 * (1 + abs(dx)))


@SETTINGS
@given(open_shapes())
def test_rotating_by_90_degrees_swaps_ix_and_iy(shape):
    base = shape.properties()
    turned = composite(shape.at(x=0 * mm, y=0 * mm, rotation=90 * ureg.degree)).properties()
    scale = _mag(base.I1, "mm**4")
    assert _mag(turned.Ix, "mm**4") == pytest.approx(_mag(base.Iy, "mm**4"), abs=1e-9 * scale)
    assert _mag(turned.Iy, "mm**4") == pytest.approx(_mag(base.Ix, "mm**4"), abs=1e-9 * scale)
    assert _mag(turned.Ixy, "mm**4") == pytest.approx(-_mag(base.Ixy, "mm**4"), abs=1e-9 * scale)
    assert _mag(turned.Zx, "mm**3") == pytest.approx(_mag(base.Zy, "mm**3"), rel=1e-7)
    # principal values do not depend on orientation
    assert _mag(turned.I1, "mm**4") == pytest.approx(scale, rel=1e-9)


@SETTINGS
@given(lengths, lengths, fractions, fractions)
def test_splitting_a_rectangle_into_parts_gives_the_same_result(b, d, fx, fy):
    whole = Rectangle(b=b * mm, d=d * mm).properties()
    bx, dy = b * fx, d * fy
    pieces = composite(
        Rectangle(b=bx * mm, d=dy * mm).at(x=0 * mm, y=0 * mm),
        Rectangle(b=(b - bx) * mm, d=dy * mm).at(x=bx * mm, y=0 * mm),
        Rectangle(b=b * mm, d=(d - dy) * mm).at(x=0 * mm, y=dy * mm),
    ).properties()
    for key in (*CENTROIDAL, "x_bar", "y_bar", "Zx", "Zy", "J"):
        if key == "J":
            continue  # J of pieces is not J of the whole (torsion is not additive)
        assert getattr(pieces, key).magnitude == pytest.approx(
            getattr(whole, key).to(getattr(pieces, key).units).magnitude, rel=1e-9
        ), key


@SETTINGS
@given(i_sections())
def test_si_and_us_inputs_agree(shape):
    inch = ureg.inch
    us = type(shape)(
        d=shape.d.to(inch), bf=shape.bf.to(inch), tf=shape.tf.to(inch), tw=shape.tw.to(inch),
        r=shape.r.to(inch),
    )  # fmt: skip
    a, b = shape.properties(), us.properties()
    for key in ("A", "Ix", "Iy", "Zx", "J", "Cw"):
        assert getattr(b, key).magnitude == pytest.approx(getattr(a, key).magnitude, rel=1e-9)


@SETTINGS
@given(open_shapes(), fractions)
def test_q_is_the_first_moment_of_either_side_and_peaks_at_the_centroid(shape, f):
    p = shape.properties()
    depth = _mag(p.c_top + p.c_bottom, "mm")
    y = depth * f
    q = _mag(shape.Q(y=y * mm), "mm**3")
    q_max = _mag(shape.Q(y=p.y_bar), "mm**3")
    assert 0 <= q <= q_max * (1 + 1e-9)
    # half the plastic modulus is the Q at the plastic neutral axis when it is the centroid
    if abs(_mag(p.y_pna - p.y_bar, "mm")) < 1e-9 * depth:
        assert 2 * q_max == pytest.approx(_mag(p.Zx, "mm**3"), rel=1e-7)


@SETTINGS
@given(st.lists(st.tuples(st.floats(0.1, 1.0), st.floats(0, 1)), min_size=3, max_size=12))
def test_star_polygon_properties_are_orientation_free(radii):
    import math

    n = len(radii)
    pts = [
        (r * 100 * math.cos(2 * math.pi * (k + 0.8 * a) / n),
         r * 100 * math.sin(2 * math.pi * (k + 0.8 * a) / n))
        for k, (r, a) in enumerate(radii)
    ]  # fmt: skip
    poly = Polygon(vertices=pts * mm)
    p = poly.properties()
    flipped = Polygon(vertices=list(reversed(pts)) * mm).properties()
    assert flipped.A.magnitude == pytest.approx(p.A.magnitude, rel=1e-12)
    assert p.I1 >= p.I2
    # I1 + I2 = Ix + Iy (invariant of the rotation of axes)
    assert _mag(p.I1 + p.I2, "mm**4") == pytest.approx(_mag(p.Ix + p.Iy, "mm**4"), rel=1e-9)
