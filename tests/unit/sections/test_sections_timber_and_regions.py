"""Sawn-timber dressed sizes, bounded regions integrated with sympy, I = k²A."""

from __future__ import annotations

import pytest
import sympy

from calcpack.errors import DimensionError, InputError
from calcpack.sections import (
    DRESSED_SIZE_TABLE,
    BoundedRegion,
    dressed_size,
    sawn_timber,
    second_moment_from_radius,
)
from calcpack.units import ureg

mm = ureg.mm


def test_dressed_size_names_its_table():
    size = dressed_size("2x10")
    assert size.source == DRESSED_SIZE_TABLE
    assert "PS 20" in DRESSED_SIZE_TABLE


def test_timbers_are_half_an_inch_under_nominal():
    size = dressed_size("6 x 10")
    assert size.b == 5.5 * ureg.inch
    assert size.d == 9.5 * ureg.inch


@pytest.mark.parametrize("bad", ["2x7", "2 by 4", "20x20"])
def test_unknown_nominal_size_is_refused(bad):
    with pytest.raises(InputError, match="Nominal size") as info:
        dressed_size(bad)
    assert info.value.name == "nominal"


def test_sawn_timber_is_a_rectangle_on_edge():
    r = sawn_timber("2x12")
    assert r.b == 1.5 * ureg.inch
    assert r.d == 11.25 * ureg.inch
    assert "2x12" in r.name


def test_parabolic_spandrel_exact():
    # y from 0 up to h(1 - x²/a²), 0 <= x <= a: A = 2ah/3, x̄ = 3a/8, ȳ = 2h/5 (common practice)
    r = BoundedRegion(upper="100*(1 - (x/200)**2)", x_from=0 * mm, x_to=200 * mm).properties()
    assert r.exact["A"] == sympy.Rational(40000, 3)
    assert r.exact["x_bar"] == 75
    assert r.exact["y_bar"] == 40
    # Ix about the base = ∫ y³/3 dx = 16 a h³ / 105
    assert r.exact["Ix_origin"] == sympy.Rational(16 * 200 * 100**3, 105)
    assert r.Ix.to("mm**4").magnitude == pytest.approx(16 * 200 * 1e6 / 105 - 40000 / 3 * 1600)


def test_region_between_two_curves():
    x = sympy.Symbol("x")
    r = BoundedRegion(upper=x, lower=x**2 / 100, x_from=0 * mm, x_to=100 * mm).properties()
    # ∫ (x - x²/100) dx over 0..100 = 5000 - 10000/3 = 5000/3
    assert r.exact["A"] == sympy.Rational(5000, 3)


def test_region_errors_name_the_input():
    with pytest.raises(InputError, match="upper must not lie below lower") as info:
        BoundedRegion(upper="x - 50", x_from=0 * mm, x_to=100 * mm)
    assert info.value.name == "upper"
    with pytest.raises(InputError, match="x_to must be greater") as info:
        BoundedRegion(upper="10", x_from=10 * mm, x_to=0 * mm)
    assert info.value.name == "x_to"
    with pytest.raises(InputError, match="depend on x only") as info:
        BoundedRegion(upper="x + z", x_from=0 * mm, x_to=1 * mm)
    assert info.value.name == "upper"


def test_second_moment_from_radius_of_gyration():
    r = second_moment_from_radius(k=50 * mm, A=1000 * mm**2)
    assert r.I.to("mm**4").magnitude == pytest.approx(2.5e6)
    with pytest.raises(DimensionError, match="A"):
        second_moment_from_radius(k=50 * mm, A=1000 * mm)
