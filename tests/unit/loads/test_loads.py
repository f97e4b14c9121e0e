"""Load types and resultants."""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError
from calcpack.loads import (
    AreaLoad,
    FunctionLoad,
    LinearLoad,
    PointLoad,
    PolynomialLoad,
    UniformLoad,
    resultant,
)
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN


def test_uniform_resultant_at_the_middle():
    r = resultant(UniformLoad(w=4 * kN / m, start=1 * m, end=4 * m))
    assert r.P.to("kN").magnitude == pytest.approx(12.0, rel=1e-15)
    assert r.x_bar.to("m").magnitude == pytest.approx(2.5, rel=1e-15)


def test_triangle_resultant_at_two_thirds():  # P = wL/2 at 2L/3 from the zero end (statics)
    r = resultant(LinearLoad(w_start=0 * kN / m, w_end=6 * kN / m, start=0 * m, end=3 * m))
    assert r.P.to("kN").magnitude == pytest.approx(9.0, rel=1e-15)
    assert r.x_bar.to("m").magnitude == pytest.approx(2.0, rel=1e-15)


def test_trapezoid_resultant():  # x̄ = a + L(w1 + 2 w2) / (3 (w1 + w2)) (statics)
    r = resultant(LinearLoad(w_start=2 * kN / m, w_end=5 * kN / m, start=1 * m, end=5 * m))
    assert r.P.to("kN").magnitude == pytest.approx(14.0, rel=1e-15)
    assert r.x_bar.to("m").magnitude == pytest.approx(1 + 4 * 12 / 21, rel=1e-14)


def test_antisymmetric_linear_load_has_no_line_of_action():
    r = resultant(LinearLoad(w_start=3 * kN / m, w_end=-3 * kN / m, start=0 * m, end=2 * m))
    assert r.P.to("kN").magnitude == pytest.approx(0.0, abs=1e-12)
    assert r.x_bar is None
    assert r.first_moment.to("kN*m").magnitude == pytest.approx(-2.0, rel=1e-12)


def test_polynomial_resultant():
    load = PolynomialLoad(
        coefficients=(Q_(1, "kN/m"), Q_(0, "kN/m**2"), Q_(3, "kN/m**3")), start=2 * m, end=4 * m
    )
    r = resultant(load)  # ∫(1 + 3ξ²) dξ over 0..2 = 2 + 8 = 10
    assert r.P.to("kN").magnitude == pytest.approx(10.0, rel=1e-14)


def test_polynomial_coefficient_units_are_checked():
    with pytest.raises(InputError, match=r"coefficients\[1\]"):
        PolynomialLoad(coefficients=(Q_(1, "kN/m"), Q_(1, "kN/m")), start=0 * m, end=1 * m)


def test_area_load_times_tributary_width():
    load = AreaLoad(q=Q_(2.4, "kPa"), width=Q_(3.0, "m"), case="L")
    assert load.w.to("kN/m").magnitude == pytest.approx(7.2, rel=1e-15)
    assert "tributary width" in load.describe()
    with pytest.raises(InputError, match="width must be positive"):
        AreaLoad(q=Q_(2.4, "kPa"), width=Q_(0.0, "m"))


def test_inclined_point_load_components():
    p = PointLoad.inclined(1 * m, 10 * kN, 30 * ureg.deg)
    assert p.P.to("kN").magnitude == pytest.approx(5.0, rel=1e-14)
    assert p.H.to("kN").magnitude == pytest.approx(10 * math.cos(math.pi / 6), rel=1e-14)


def test_function_load_resultant_meets_its_stated_accuracy():
    # w = w0 sin(πx/L): P = 2 w0 L / π (direct integration)
    L, w0 = 5.0, 3.0
    load = FunctionLoad(
        func=lambda x: Q_(w0 * __import__("numpy").sin(math.pi * x.to("m").magnitude / L), "kN/m"),
        start=0 * m,
        end=L * m,
        rtol=1e-10,
    )
    r = resultant(load)
    assert r.P.to("kN").magnitude == pytest.approx(2 * w0 * L / math.pi, rel=1e-9)
    assert r.x_bar.to("m").magnitude == pytest.approx(L / 2, rel=1e-9)


def test_function_load_accepts_a_scalar_only_function():
    load = FunctionLoad(
        func=lambda x: Q_(math.exp(-x.to("m").magnitude), "kN/m"), start=0 * m, end=2 * m
    )
    assert resultant(load).P.to("kN").magnitude == pytest.approx(1 - math.exp(-2), rel=1e-9)


def test_si_parts_are_made_once_and_follow_a_changed_copy():
    from dataclasses import replace

    from calcpack.loads.types import si_parts

    load = LinearLoad(w_start=2 * kN / m, w_end=5 * kN / m, start=1 * m, end=5 * m)
    parts = si_parts(load)
    assert parts == (load.si_pieces(), load.si_points())
    assert parts[0][0].coeffs == pytest.approx((2e3, 750.0), rel=1e-15)  # 2 kN/m + 3/4 kN/m²·ξ
    assert si_parts(load) is parts
    moved = replace(load, start=2 * m)
    assert si_parts(moved)[0][0].a_m == pytest.approx(2.0, rel=1e-15)
    assert si_parts(moved)[0][0].coeffs[1] == pytest.approx(1e3, rel=1e-15)
    assert load == LinearLoad(w_start=2 * kN / m, w_end=5 * kN / m, start=1 * m, end=5 * m)
