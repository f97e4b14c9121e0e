"""Footing geometry, site conditions and loads: bad input is refused naming the input."""

from __future__ import annotations

import pytest

from calcpack.errors import InputError, OutOfScopeError
from calcpack.foundations import Column, Footing, FootingLoad, SiteConditions
from calcpack.units import Q_


def _col() -> Column:
    return Column(Q_(300, "mm"))


@pytest.mark.parametrize("name", ["B", "h"])
@pytest.mark.parametrize("value", [0.0, -1.0])
def test_zero_or_negative_sizes_are_refused(name, value):
    kw = {"B": Q_(2, "m"), "h": Q_(0.5, "m")}
    kw[name] = Q_(value, "m")
    with pytest.raises(InputError, match=f"Input {name} must be positive") as e:
        Footing("square", column=_col(), **kw)
    assert e.value.name == name


def test_rectangular_needs_length():
    with pytest.raises(InputError, match="Input L is required"):
        Footing("rectangular", Q_(2, "m"), Q_(0.5, "m"), _col())


def test_column_larger_than_footing_is_refused():
    with pytest.raises(InputError, match="Input column must be smaller than the footing"):
        Footing("square", Q_(0.25, "m"), Q_(0.5, "m"), _col())
    with pytest.raises(InputError, match="Input column must fit within the footing"):
        Footing("round", Q_(0.35, "m"), Q_(0.5, "m"), _col())


def test_base_plate_needs_its_size_and_must_cover_the_column():
    with pytest.raises(InputError, match="plate1"):
        Column(Q_(150, "mm"), support="base plate")
    with pytest.raises(InputError, match="plate1 must be at least the column size"):
        Column(Q_(150, "mm"), support="base plate", plate1=Q_(100, "mm"))


def test_soil_cover_needs_a_unit_weight():
    with pytest.raises(InputError, match="gamma_soil is required"):
        Footing("square", Q_(2, "m"), Q_(0.5, "m"), _col(), soil_cover=Q_(0.3, "m"))


def test_bare_number_is_refused_naming_the_input():
    with pytest.raises(InputError, match="Input B must be a quantity"):
        Footing("square", 2.0, Q_(0.5, "m"), _col())  # type: ignore[arg-type]


@pytest.mark.parametrize("kind", ["combined", "pile", "pile cap", "mat", "strip"])
def test_out_of_scope_kinds_are_refused_with_the_reason(kind):
    with pytest.raises(OutOfScopeError, match="out of scope"):
        Footing("square", Q_(2, "m"), Q_(0.5, "m"), _col(), kind=kind)


def test_unknown_kind_suggests():
    with pytest.raises(InputError, match="did you mean 'pad'"):
        Footing("square", Q_(2, "m"), Q_(0.5, "m"), _col(), kind="padd")


def test_site_refusals():
    with pytest.raises(OutOfScopeError, match="sloping ground"):
        SiteConditions(ground_slope=Q_(5, "degree"))
    with pytest.raises(OutOfScopeError, match="frost depth"):
        SiteConditions(frost_susceptible=True)
    with pytest.raises(OutOfScopeError, match="active zone depth"):
        SiteConditions(expansive=True)
    with pytest.raises(OutOfScopeError, match="Seismic design category D"):
        SiteConditions(seismic_design_category="D")
    s = SiteConditions(
        frost_susceptible=True,
        frost_depth=Q_(0.9, "m"),
        expansive=True,
        active_zone_depth=Q_(1.2, "m"),
    )
    assert s.minimum_depth == Q_(1.2, "m")


def test_loads_need_units_of_force_and_moment():
    with pytest.raises(InputError, match="Input My must have units"):
        FootingLoad(P=Q_(10, "kN"), My=Q_(3, "kN"))


def test_weights():
    f = Footing(
        "rectangular",
        Q_(2, "m"),
        Q_(0.5, "m"),
        _col(),
        L=Q_(3, "m"),
        gamma_concrete=Q_(24, "kN/m**3"),
        soil_cover=Q_(0.4, "m"),
        gamma_soil=Q_(18, "kN/m**3"),
    )
    # closed forms, common practice: W = γ·A·h
    assert f.concrete_weight.to("kN").magnitude == pytest.approx(24 * 6 * 0.5)
    assert f.soil_weight.to("kN").magnitude == pytest.approx(18 * (6 - 0.09) * 0.4)
    assert f.depth == Q_(0.9, "m")
