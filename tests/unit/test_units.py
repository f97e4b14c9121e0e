"""The shared registry, the boundary validator and display presets."""

from __future__ import annotations

import math

import pint
import pytest

from calcpack import DimensionError, InputError
from calcpack.units import PRESETS, Q_, get_display, require, set_display, si, ureg


def test_registry_is_pints_application_registry():
    assert pint.get_application_registry().get() is ureg or (
        pint.get_application_registry().Quantity(1, "kN").to("N").magnitude == 1000
    )
    assert (Q_(1, "kN") + pint.Quantity(1, "N")).to("N").magnitude == pytest.approx(1001)


def test_require_accepts_and_returns_the_quantity():
    q = 3.2 * ureg.m
    assert require(q, "[length]", "L", positive=True) is q
    assert require(Q_(5, "kN/m"), "kN/m", "w") == Q_(5, "kN/m")


def test_require_names_a_bare_float():
    with pytest.raises(DimensionError, match=r"Input L .*bare float"):
        require(3.2, "[length]", "L")


def test_require_names_wrong_dimension():
    with pytest.raises(DimensionError, match=r"Input w must have units of \[force\] / \[length\]"):
        require(Q_(3, "kN"), "[force] / [length]", "w")


@pytest.mark.parametrize("bad", [math.nan, math.inf, -math.inf])
def test_require_refuses_non_finite(bad):
    with pytest.raises(InputError, match="Input L must be a finite number"):
        require(Q_(bad, "m"), "[length]", "L")


def test_require_positive_names_value():
    with pytest.raises(InputError, match=r"Input L must be positive \(got L = -3 m\)"):
        require(Q_(-3, "m"), "[length]", "L", positive=True)


def test_si_magnitude():
    assert si(Q_(10.9, "kN*m")) == pytest.approx(10900.0)
    assert si(Q_(1, "ft")) == pytest.approx(0.3048)


def test_presets_choose_trade_units():
    assert PRESETS["SI"].unit_for(Q_(1, "kip*ft")) == ureg.Unit("kN*m")
    assert PRESETS["US"].unit_for(Q_(1, "kN*m")) == ureg.Unit("kip*ft")
    assert PRESETS["SI"].unit_for(Q_(1, "psi")) == ureg.Unit("MPa")
    assert PRESETS["US"].unit_for(Q_(1, "mm**4")) == ureg.Unit("inch**4")
    assert PRESETS["SI"].unit_for(Q_(1, "dimensionless")) is None


def test_set_display_validates_and_restores():
    before = get_display().sig_figs
    try:
        assert set_display(sig_figs=4).sig_figs == 4
        with pytest.raises(InputError, match="sig_figs must be an integer"):
            set_display(sig_figs=0)
        with pytest.raises(InputError, match="Unit system must be one of"):
            set_display(system="metric")
    finally:
        set_display(sig_figs=before)


def test_a_fractional_power_unit_settled_by_a_sheet_reads_back() -> None:
    """pint prints in**0.5 as in⁰⋅⁵, which it cannot parse: the settled unit must still be
    readable (an empirical constant such as ACI 318's k_c carries such a unit)."""
    from calcpack.units import DisplaySettings, ureg

    settings = DisplaySettings(system="US")
    settings.keep_unit(ureg.Unit("inch**0.5"))
    assert settings.kind_unit(ureg.Unit("inch**0.5")) == ureg.Unit("inch**0.5")
