"""Composite and built-up sections: placement, holes, modular ratios, parts table."""

from __future__ import annotations

import pytest

from calcpack.errors import DimensionError, InputError, OutOfScopeError
from calcpack.sections import (
    Circle,
    HollowCircle,
    ISection,
    Rectangle,
    RectangularHollow,
    Tee,
    composite,
)
from calcpack.units import ureg

mm = ureg.mm


def test_tee_from_two_plates_by_hand():
    # Flange 150 x 12 on a 188 x 8 stem: the parts table done by hand (common practice)
    sec = composite(
        Rectangle(b=8 * mm, d=188 * mm).at(x=71 * mm, y=0 * mm, name="stem"),
        Rectangle(b=150 * mm, d=12 * mm).at(x=0 * mm, y=188 * mm, name="flange"),
    )
    p = sec.properties()
    a1, y1 = 8 * 188, 94.0
    a2, y2 = 150 * 12, 194.0
    yb = (a1 * y1 + a2 * y2) / (a1 + a2)
    I = 8 * 188**3 / 12 + a1 * (y1 - yb) ** 2 + 150 * 12**3 / 12 + a2 * (y2 - yb) ** 2
    assert p.y_bar.to("mm").magnitude == pytest.approx(yb)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(I)
    assert [r.name for r in p.rows] == ["stem", "flange"]
    assert p.rows[0].dy * 1000 == pytest.approx(y1 - yb)
    # the same tee as a Tee shape
    t = Tee(d=200 * mm, bf=150 * mm, tf=12 * mm, tw=8 * mm).properties()
    assert t.Ix.magnitude == pytest.approx(p.Ix.magnitude)
    assert t.Zx.magnitude == pytest.approx(p.Zx.magnitude)


def test_plastic_neutral_axis_of_a_tee_lies_where_areas_balance():
    p = Tee(d=200 * mm, bf=150 * mm, tf=12 * mm, tw=8 * mm).properties()
    # A = 3304 mm²; half = 1652 > flange 1800? no: the PNA lies in the flange
    # area above y_p: 150 (200 - y_p) = 1652 -> y_p = 200 - 11.0133
    assert p.y_pna.to("mm").magnitude == pytest.approx(200 - 1652 / 150)


def test_anchor_centroid_places_the_centroid():
    sec = composite(Circle(d=50 * mm).at(x=100 * mm, y=40 * mm, anchor="centroid"))
    p = sec.properties()
    assert p.x_bar.to("mm").magnitude == pytest.approx(100)
    assert p.y_bar.to("mm").magnitude == pytest.approx(40)


def test_hole_reduces_area_and_shifts_centroid():
    plate = Rectangle(b=200 * mm, d=100 * mm)
    sec = composite(
        plate.at(x=0 * mm, y=0 * mm, name="plate"),
        Circle(d=20 * mm).hole_at(x=50 * mm, y=50 * mm, name="hole"),
    )
    p = sec.properties()
    import math

    ah = math.pi * 100
    assert p.A.to("mm**2").magnitude == pytest.approx(20000 - ah)
    assert p.x_bar.to("mm").magnitude == pytest.approx((20000 * 100 - ah * 50) / (20000 - ah))
    assert p.rows[-1].A < 0


def test_hole_outside_its_parent_is_refused_by_name():
    with pytest.raises(InputError, match="Hole 'bolt hole' must lie wholly inside") as info:
        composite(
            Rectangle(b=100 * mm, d=10 * mm).at(x=0 * mm, y=0 * mm),
            Circle(d=22 * mm).hole_at(x=50 * mm, y=5 * mm, name="bolt hole"),
        )
    assert info.value.name == "bolt hole"


def test_hole_larger_than_its_parent_is_refused():
    with pytest.raises(InputError, match="larger than its parent"):
        composite(
            Rectangle(b=100 * mm, d=100 * mm).at(x=0 * mm, y=0 * mm),
            Rectangle(b=120 * mm, d=120 * mm).hole_at(x=50 * mm, y=50 * mm, name="big hole"),
        )


def test_hole_in_the_void_of_a_tube_is_refused():
    with pytest.raises(InputError, match="Hole 'h'"):
        composite(
            RectangularHollow(b=100 * mm, d=100 * mm, t=5 * mm).at(x=0 * mm, y=0 * mm),
            Circle(d=10 * mm).hole_at(x=50 * mm, y=50 * mm, name="h"),
        )


def test_section_of_zero_net_area_is_refused():
    with pytest.raises(InputError, match="positive net area"):
        composite(
            Rectangle(b=100 * mm, d=100 * mm).at(x=0 * mm, y=0 * mm),
            Rectangle(b=100 * mm, d=100 * mm).hole_at(x=0 * mm, y=0 * mm, anchor="corner"),
        ).properties()


def test_only_holes_is_refused():
    with pytest.raises(InputError, match="solid part"):
        composite(Circle(d=10 * mm).hole_at(x=0 * mm, y=0 * mm))


def test_bad_part_inputs_are_refused_by_name():
    r = Rectangle(b=10 * mm, d=10 * mm)
    with pytest.raises(InputError, match="Modular ratio n") as info:
        r.at(x=0 * mm, y=0 * mm, n=-2)
    assert info.value.name == "n"
    with pytest.raises(DimensionError, match="x of part"):
        r.at(x=3, y=0 * mm)
    with pytest.raises(InputError, match="anchor"):
        r.at(x=0 * mm, y=0 * mm, anchor="middle")
    with pytest.raises(DimensionError, match="rotation"):
        r.at(x=0 * mm, y=0 * mm, rotation=90)


def test_flitch_beam_transformed_section():
    # Two 50 x 200 timbers either side of a 10 x 200 steel plate, n = 200000/10000 = 20:
    # transformed width 100 + 20 x 10 = 300 mm (transformed-section method, common practice)
    timber = Rectangle(b=50 * mm, d=200 * mm)
    plate = Rectangle(b=10 * mm, d=200 * mm)
    sec = composite(
        timber.at(x=0 * mm, y=0 * mm, name="timber"),
        plate.at(x=50 * mm, y=0 * mm, name="steel plate", n=20),
        timber.at(x=60 * mm, y=0 * mm, name="timber"),
    )
    p = sec.properties()
    assert [r.name for r in p.rows] == ["timber (1)", "steel plate", "timber (2)"]
    assert p.A.to("mm**2").magnitude == pytest.approx(300 * 200)
    assert p.Ix.to("mm**4").magnitude == pytest.approx(300 * 200**3 / 12)
    assert sec.width_at(y=100 * mm).to("mm").magnitude == pytest.approx(300)
    with pytest.raises(OutOfScopeError, match="different modular ratios"):
        p.Zx


def test_hole_in_a_transformed_part_takes_its_modular_ratio():
    sec = composite(
        Rectangle(b=100 * mm, d=100 * mm).at(x=0 * mm, y=0 * mm, name="timber"),
        Rectangle(b=10 * mm, d=100 * mm).at(x=100 * mm, y=0 * mm, name="plate", n=20),
        Rectangle(b=10 * mm, d=20 * mm).hole_at(x=105 * mm, y=50 * mm, name="slot"),
    )
    assert sec.properties().A.to("mm**2").magnitude == pytest.approx(10000 + 20 * (1000 - 200))


def test_tube_as_a_part_gives_one_net_row():
    sec = composite(HollowCircle(D=100 * mm, t=10 * mm).at(x=0 * mm, y=0 * mm, name="tube"))
    p = sec.properties()
    assert len(p.rows) == 1
    assert pytest.approx(3.141592653589793 * (50**2 - 40**2)) == p.rows[0].A * 1e6


def test_composite_torsion_constant_sums_open_parts():
    sec = composite(
        ISection(d=300 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm).at(x=0 * mm, y=0 * mm),
        Rectangle(b=200 * mm, d=10 * mm).at(x=-25 * mm, y=300 * mm),
    )
    j_i = ISection(d=300 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm).properties().J
    j_p = Rectangle(b=200 * mm, d=10 * mm).properties().J
    assert sec.properties().J.magnitude == pytest.approx((j_i + j_p).to("mm**4").magnitude)
    with pytest.raises(OutOfScopeError, match="Warping constant"):
        sec.properties().Cw


def test_rotated_part_swaps_axes_and_mirror_flips_product():
    from calcpack.sections import Angle

    angle = Angle(d=100 * mm, b=60 * mm, t=8 * mm)
    base = angle.properties()
    mirrored = composite(angle.at(x=0 * mm, y=0 * mm, mirrored=True)).properties()
    assert mirrored.Ixy.magnitude == pytest.approx(-base.Ixy.magnitude)
    assert mirrored.Ix.magnitude == pytest.approx(base.Ix.magnitude)


def test_overlapping_solid_parts_are_refused_by_name():
    with pytest.raises(InputError, match=r"'plate' and 'web' .* overlap") as info:
        composite(
            Rectangle(b=200 * mm, d=20 * mm).at(x=0 * mm, y=0 * mm, name="plate"),
            Rectangle(b=10 * mm, d=200 * mm).at(x=95 * mm, y=10 * mm, name="web"),
        )
    assert info.value.name == "web"
    assert "common area 100 mm²" in str(info.value)


def test_parts_that_only_touch_are_accepted():
    sec = composite(
        ISection(d=300 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm, r=12 * mm).at(
            x=0 * mm, y=0 * mm, name="beam"
        ),
        Rectangle(b=150 * mm, d=10 * mm).at(x=0 * mm, y=300 * mm, name="top plate"),
        Rectangle(b=150 * mm, d=10 * mm).at(x=0 * mm, y=-10 * mm, name="bottom plate"),
    )
    assert sec.properties().y_bar.to("mm").magnitude == pytest.approx(150)


def test_infill_inside_a_tube_is_not_an_overlap():
    # a concrete-filled tube: the infill occupies the tube's void (transformed, n = 1/7)
    tube = HollowCircle(D=200 * mm, t=10 * mm)
    sec = composite(
        tube.at(x=0 * mm, y=0 * mm, anchor="centroid", name="steel tube"),
        Circle(d=180 * mm).at(x=0 * mm, y=0 * mm, anchor="centroid", name="infill", n=1 / 7),
    )
    import math

    want = math.pi * (100**2 - 90**2) + math.pi * 90**2 / 7
    assert sec.properties().A.to("mm**2").magnitude == pytest.approx(want)


def test_hole_through_two_touching_parts_of_one_material():
    # a bolt hole through a cover plate and the flange beneath it, seen in section
    sec = composite(
        Rectangle(b=150 * mm, d=12 * mm).at(x=0 * mm, y=0 * mm, name="flange"),
        Rectangle(b=150 * mm, d=10 * mm).at(x=0 * mm, y=12 * mm, name="cover plate"),
        Rectangle(b=22 * mm, d=22 * mm).hole_at(
            x=20 * mm, y=0 * mm, anchor="corner", name="bolt hole"
        ),
    )
    assert sec.properties().A.to("mm**2").magnitude == pytest.approx(150 * 22 - 22 * 22)


def test_hole_through_parts_of_two_materials_is_refused():
    with pytest.raises(InputError, match="different modular ratios"):
        composite(
            Rectangle(b=100 * mm, d=50 * mm).at(x=0 * mm, y=0 * mm, name="timber"),
            Rectangle(b=100 * mm, d=10 * mm).at(x=0 * mm, y=50 * mm, name="steel", n=20),
            Rectangle(b=10 * mm, d=30 * mm).hole_at(x=40 * mm, y=30 * mm, anchor="corner"),
        )
