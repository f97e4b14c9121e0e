"""The fast quantity helpers of the numeric cores give the same results as pint's own calls."""

from __future__ import annotations

import math

import numpy as np
import pytest

from calcpack.errors import DimensionError, InputError
from calcpack.loads._si import check, fast_si, make_quantity
from calcpack.units import Q_, si, ureg

kN, kN_m, mm = ureg.Unit("kN"), ureg.Unit("kN*m"), ureg.Unit("mm")


@pytest.mark.parametrize("value", [2.5, -0.0, 1e-300, np.float64(7.25)])
def test_make_quantity_equals_the_constructor_for_floats(value):
    fast = make_quantity(value, kN_m)
    ref = Q_(value, kN_m)
    assert type(fast) is type(ref)
    assert fast.units == ref.units
    assert fast.magnitude == ref.magnitude
    assert fast.to("N*m").magnitude == pytest.approx(1e3 * value, rel=1e-15)
    assert f"{fast:~P}" == f"{ref:~P}"
    assert fast == ref


def test_make_quantity_keeps_arrays_and_converts_like_pint():
    values = np.array([0.5, -1.25, 3.0])
    fast = make_quantity(values, mm)
    assert fast.magnitude is values
    np.testing.assert_array_equal(fast.to("m").magnitude, Q_(values, mm).to("m").magnitude)


@pytest.mark.parametrize(("value", "unit"), [(3, kN), ([1.0, 2.0], kN), (2.0, "kN")])
def test_make_quantity_hands_anything_else_to_pint(value, unit):
    fast, ref = make_quantity(value, unit), Q_(value, unit)
    assert fast.units == ref.units
    np.testing.assert_array_equal(fast.magnitude, ref.magnitude)


def test_fast_si_equals_si():
    for q in (Q_(3.5, "kN/m"), Q_(12.0, "kip*ft"), Q_(250.0, "mm"), Q_(2.0, "psf")):
        assert fast_si(q) == pytest.approx(si(q), rel=1e-15)


def test_check_passes_the_input_through_and_still_refuses_after_caching():
    ok = Q_(4.0, "kN/m")
    assert check(ok, "[force] / [length]", "w") is ok
    assert check(ok, "[force] / [length]", "w") is ok  # the cached path
    with pytest.raises(DimensionError, match="Input w"):
        check(Q_(4.0, "kN"), "[force] / [length]", "w")
    with pytest.raises(InputError, match="Input L must be positive"):
        check(Q_(-2.0, "m"), "[length]", "L", positive=True)
    check(Q_(2.0, "m"), "[length]", "L", positive=True)
    with pytest.raises(InputError, match="Input L must be positive"):
        check(Q_(0.0, "m"), "[length]", "L", positive=True)  # the unit is cached by now
    with pytest.raises(InputError, match="finite"):
        check(Q_(math.inf, "m"), "[length]", "L")
    with pytest.raises(DimensionError, match="bare float"):
        check(2.0, "[length]", "L")
