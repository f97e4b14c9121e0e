"""The section working: parts table, sums and the substituted formulas agree with the numbers."""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.sections import (
    Angle,
    BoundedRegion,
    Rectangle,
    Tee,
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
    block = sec.working()
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
    block = _chord().working()
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
    v = _values(Angle(d=100 * mm, b=75 * mm, t=8 * mm).working())
    p = Angle(d=100 * mm, b=75 * mm, t=8 * mm).properties()
    assert v["I_1"].quantity.to("mm**4").magnitude == pytest.approx(p.I1.to("mm**4").magnitude)
    assert v["I_2"].quantity.to("mm**4").magnitude == pytest.approx(p.I2.to("mm**4").magnitude)


def test_transformed_section_working_has_modular_ratio_column():
    sec = composite(
        Rectangle(b=50 * mm, d=200 * mm).at(x=0 * mm, y=0 * mm, name="timber"),
        Rectangle(b=10 * mm, d=200 * mm).at(x=50 * mm, y=0 * mm, name="plate", n=20),
    )
    block = sec.working(axes="x")
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
