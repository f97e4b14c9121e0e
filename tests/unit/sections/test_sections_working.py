"""The section working: parts table, sums and the substituted formulas agree with the numbers."""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.sections import (
    Angle,
    BoundedRegion,
    Circle,
    HollowCircle,
    Rectangle,
    Tee,
    Triangle,
    composite,
    second_moment_from_radius,
)
from calcpack.units import ureg
from calcpack.working import Block, Derived, Sheet, Table

mm = ureg.mm


def _chord():
    return composite(
        Tee(d=200 * mm, bf=150 * mm, tf=12 * mm, tw=8 * mm).at(x=15 * mm, y=0 * mm, name="tee"),
        Rectangle(b=180 * mm, d=10 * mm).at(x=0 * mm, y=200 * mm, name="cover plate"),
        Rectangle(b=22 * mm, d=10 * mm).hole_at(
            x=25 * mm, y=200 * mm, anchor="corner", name="bolt hole"
        ),
    )


def _values(block: Block) -> dict[str, Derived]:
    return {s.name: s for s in block.steps if isinstance(s, Derived)}


def test_working_is_a_block_whose_results_equal_the_properties():
    sec = _chord()
    p = sec.properties()
    block = sec.working(show="all")
    assert isinstance(block, Block)
    v = _values(block)
    # the formulas evaluated by the working equal the numeric core (same sums, another path)
    assert v["y_bar"].quantity.to("mm").magnitude == pytest.approx(p.y_bar.to("mm").magnitude)
    assert v["I_x"].quantity.to("mm**4").magnitude == pytest.approx(p.Ix.to("mm**4").magnitude)
    assert v["I_y"].quantity.to("mm**4").magnitude == pytest.approx(p.Iy.to("mm**4").magnitude)
    assert v["r_x"].quantity.to("mm").magnitude == pytest.approx(p.rx.to("mm").magnitude)
    assert v["S_x_bot"].quantity.to("mm**3").magnitude == pytest.approx(
        p.Sx_bottom.to("mm**3").magnitude
    )
    assert v["Z_x"].quantity == p.Zx


def test_parts_table_lists_every_part_and_the_sums():
    block = _chord().working(show="all")
    tables = [s for s in block.steps if isinstance(s, Table)]
    assert len(tables) == 2
    names = [row[0] for row in tables[0].rows]
    assert names == ["tee", "cover plate", "bolt hole", "**Σ**"]
    hole_area = tables[0].rows[2][1]
    assert hole_area == pytest.approx(-220)
    assert tables[0].rows[-1][1] == pytest.approx(sum(r[1] for r in tables[0].rows[:-1]))
    text = block.text()
    assert "parallel-axis theorem" in text
    assert "Σ_Ay/A" in text


def test_working_shows_principal_axes_when_the_product_is_not_zero():
    v = _values(Angle(d=100 * mm, b=75 * mm, t=8 * mm).working(show=["principal"]))
    p = Angle(d=100 * mm, b=75 * mm, t=8 * mm).properties()
    assert v["I_1"].quantity.to("mm**4").magnitude == pytest.approx(p.I1.to("mm**4").magnitude)
    assert v["I_2"].quantity.to("mm**4").magnitude == pytest.approx(p.I2.to("mm**4").magnitude)


def test_transformed_section_working_has_modular_ratio_column():
    sec = composite(
        Rectangle(b=50 * mm, d=200 * mm).at(x=0 * mm, y=0 * mm, name="timber"),
        Rectangle(b=10 * mm, d=200 * mm).at(x=50 * mm, y=0 * mm, name="plate", n=20),
    )
    block = sec.working(axes="x", show="all")
    table = next(s for s in block.steps if isinstance(s, Table))
    assert "$n_i$" in table.columns
    assert "different materials" in block.text()


def test_working_in_us_units_and_on_a_sheet():
    sheet = Sheet("S1", system="US", auto_display=False)
    sheet.add(Rectangle(b=4 * ureg.inch, d=10 * ureg.inch).working(system="US"))
    records = {r["name"]: r for r in sheet.steps[0].records()["values"]}
    assert records["I_x"]["unit"] == "in⁴"
    assert records["I_x"]["value"] == pytest.approx(4 * 1000 / 12)


def test_bad_working_option_is_refused():
    with pytest.raises(InputError, match="axes"):
        Rectangle(b=4 * mm, d=10 * mm).working(axes="z")


def test_region_and_radius_working():
    r = BoundedRegion(upper="100*(1 - (x/200)**2)", x_from=0 * mm, x_to=200 * mm).properties()
    text = r.working().text()
    assert r"\int_{0}^{200}" in text
    assert r"\frac{40000}{3}" in text
    block = second_moment_from_radius(k=50 * mm, A=1000 * mm**2).working()
    v = _values(block)
    assert v["I"].quantity.to("mm**4").magnitude == pytest.approx(2.5e6)
    assert "k²" in block.text() or "k^2" in block.text() or "k²·A" in block.text()


def test_working_renders_html_and_latex():
    block = _chord().working()
    assert "cp-table" in block._repr_html_()
    assert r"\bar{y}" in block._repr_latex_()


def test_working_with_a_sheet_uses_its_units_and_adds_the_block():
    sheet = Sheet("S2", system="US", auto_display=False)
    block = Rectangle(b=4 * ureg.inch, d=10 * ureg.inch).working(sheet=sheet)
    assert sheet.steps[-1] is block
    records = {r["name"]: r for r in block.records()["values"]}
    assert records["I_x"]["unit"] == "in⁴"
    assert all(step.settings is sheet.settings for step in block.steps)


# --- working in proportion: one line per property for a plain shape, only what is asked ---


def _sympy_reference(polygon_mm):
    """Area, centroidal I_x, I_y and the smaller S_x of a polygon by sympy.geometry (a
    general-purpose reference library, independent of calcpack's section code)."""
    import sympy
    from sympy.geometry import Point, Polygon

    poly = Polygon(*[Point(sympy.Rational(x), sympy.Rational(y)) for x, y in polygon_mm])
    I_xx, I_yy, _ = poly.second_moment_of_area()
    c = max(abs(v.y - poly.centroid.y) for v in poly.vertices)  # to the farther fibre
    return float(abs(poly.area)), float(I_xx), float(I_yy), float(I_xx / c)


def test_rectangle_properties_are_one_line_each_from_their_closed_forms():
    # 90 x 360 mm timber lintel. Reference: sympy.geometry.Polygon (second_moment_of_area,
    # section_modulus), relative tolerance 1e-9 (both exact arithmetic up to float rounding).
    A_ref, Ix_ref, Iy_ref, Sx_ref = _sympy_reference([(0, 0), (90, 0), (90, 360), (0, 360)])
    block = Rectangle(b=90 * mm, d=360 * mm).working()
    assert not any(isinstance(s, Table) for s in block.steps)
    v = _values(block)
    assert set(v) == {"A", "I_x", "S_x"}  # the bending set, nothing more unless asked
    assert v["A"].quantity.to("mm**2").magnitude == pytest.approx(A_ref, rel=1e-9)
    assert v["I_x"].quantity.to("mm**4").magnitude == pytest.approx(Ix_ref, rel=1e-9)
    assert v["S_x"].quantity.to("mm**3").magnitude == pytest.approx(Sx_ref, rel=1e-9)
    lines = block.text().splitlines()
    assert any(line.startswith("A = b·d = ") for line in lines)
    assert any(line.startswith("I_x = b·d³/12 = ") for line in lines)
    assert any(line.startswith("S_x = b·d²/6 = ") for line in lines)
    every = _values(Rectangle(b=90 * mm, d=360 * mm).working(show="all"))
    assert every["I_y"].quantity.to("mm**4").magnitude == pytest.approx(Iy_ref, rel=1e-9)


def test_dressed_2x10_matches_the_nds_supplement_table():
    # NDS Supplement (2018) Table 1B, 2x10 (1-1/2 x 9-1/4 in.): A = 13.88 in², S_xx = 21.39 in³,
    # I_xx = 98.93 in⁴, S_yy = 3.469 in³, I_yy = 2.602 in⁴ -- from memory. Tolerance: half a
    # unit of the last printed figure, and a little more (13.875 prints as 13.88).
    inch = ureg.inch
    v = _values(Rectangle(b=1.5 * inch, d=9.25 * inch).working(show="all", system="US"))
    assert v["A"].quantity.to("in**2").magnitude == pytest.approx(13.88, abs=0.0051)
    assert v["S_x"].quantity.to("in**3").magnitude == pytest.approx(21.39, abs=0.005)
    assert v["I_x"].quantity.to("in**4").magnitude == pytest.approx(98.93, abs=0.005)
    assert v["S_y"].quantity.to("in**3").magnitude == pytest.approx(3.469, abs=0.0005)
    assert v["I_y"].quantity.to("in**4").magnitude == pytest.approx(2.602, abs=0.0005)


@pytest.mark.parametrize(
    "shape",
    [
        Rectangle(b=90 * mm, d=360 * mm),
        Circle(d=60 * mm),
        HollowCircle(D=114.3 * mm, t=6.3 * mm),
    ],
    ids=["rectangle", "circle", "tube"],
)
def test_closed_forms_equal_the_numeric_core(shape):
    p = shape.properties()
    v = _values(shape.working(show="all"))
    assert not any(isinstance(s, Table) for s in shape.working(show="all").steps)
    pairs = {"A": p.A, "I_x": p.Ix, "S_x": p.Sx, "Z_x": p.Zx, "r_x": p.rx, "J": p.J}
    for key, expected in pairs.items():
        got = v[key].quantity.to(expected.units).magnitude
        assert got == pytest.approx(expected.magnitude, rel=1e-6), key


def test_circle_closed_forms_against_sympy_geometry():
    # Reference: sympy.geometry.Circle.second_moment_of_area (general-purpose library).
    import sympy
    from sympy.geometry import Circle as SympyCircle
    from sympy.geometry import Point

    c = SympyCircle(Point(0, 0), sympy.Rational(30))
    I_ref = float(c.second_moment_of_area()[0])
    v = _values(Circle(d=60 * mm).working())
    assert v["I_x"].quantity.to("mm**4").magnitude == pytest.approx(I_ref, rel=1e-9)
    assert v["A"].quantity.to("mm**2").magnitude == pytest.approx(float(c.area), rel=1e-9)


def test_parts_table_only_for_more_than_one_part():
    one = composite(Triangle(b=120 * mm, h=90 * mm).at(x=0 * mm, y=0 * mm, name="gusset"))
    block = one.working(show="all")
    assert not any(isinstance(s, Table) for s in block.steps)
    v = _values(block)
    p = one.properties()
    assert v["I_x"].quantity.to("mm**4").magnitude == pytest.approx(p.Ix.to("mm**4").magnitude)
    # sympy.geometry: a triangle's centroidal I_x = b h³/36 (reference library)
    _, Ix_ref, _, _ = _sympy_reference([(0, 0), (120, 0), (60, 90)])
    assert v["I_x"].quantity.to("mm**4").magnitude == pytest.approx(Ix_ref, rel=1e-9)
    two = _chord().working()
    assert sum(isinstance(s, Table) for s in two.steps) == 1  # x axis only by default


def test_only_the_properties_asked_for_are_shown():
    chord = _chord()
    default = _values(chord.working())
    assert {"A", "I_x", "S_x_top", "S_x_bot"} <= set(default)
    assert not {"Z_x", "J", "r_x", "I_y", "C_w", "I_1"} & set(default)
    v = _values(chord.working(show=["r_y"]))
    assert "I_y" in v
    assert "r_y" in v
    assert "I_x" not in v
    with pytest.raises(InputError, match="show") as info:
        chord.working(show=["A", "plastic"])
    assert "plastic" in str(info.value)
    assert "Z_x" in str(info.value)


def test_symmetric_section_says_its_axes_are_principal():
    block = Rectangle(b=90 * mm, d=360 * mm).working(show=["principal"])
    text = block.text()
    assert "I_x = " in text
    assert "I_y = " in text
    assert "principal axes" in text
