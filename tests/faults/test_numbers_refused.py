"""Numbers that cannot be silent: non-finite factors and results, division by zero in a formula,
section ratios contradicted by the section's own dimensions, material values outside the range a
standard covers, and deflections asked of a beam without EI are refused with an error naming the
input -- never a NaN, a bare AssertionError or pint's ZeroDivisionError.

The ratio check uses AISC Manual Table 1-1 values for W18x50 (d = 18.0 in., t_f = 0.570 in.,
t_w = 0.355 in., k_des = 0.972 in., h/t_w = 45.2; from memory, as in
tests/validation/test_aisc_design_examples_v15_1.py).
"""

from __future__ import annotations

import math

import pytest

from calcpack import IShape, Sheet, ZeroDivisorError, check_aisc_beam, combine
from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam, solve_cases
from calcpack.analysis.truss_solve import combine_results
from calcpack.checks.elastic import check_deflection
from calcpack.checks.nds.values import TimberValues
from calcpack.checks.scope import MaterialOutOfScopeError
from calcpack.combinations.superpose import superpose
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads import UniformLoad
from calcpack.units import Q_, ureg

m, kN, inch, ksi, psi = ureg.m, ureg.kN, ureg.inch, ureg.ksi, ureg.psi
NON_FINITE = [math.nan, math.inf, -math.inf]


def _cases():
    beam = Beam(
        length=6 * m,
        supports=[Pin(0 * m), Roller(6 * m)],
        EI=Q_(20_000, "kN*m**2"),
        loads=[UniformLoad(w=4 * kN / m, case="D"), UniformLoad(w=3 * kN / m, case="L")],
    )
    return solve_cases(beam)


@pytest.mark.parametrize("bad", NON_FINITE)
def test_combine_refuses_a_non_finite_factor_naming_the_case(bad):
    with pytest.raises(InputError) as e:
        combine(_cases(), {"D": 1.2, "L": bad})
    assert e.value.name == "factors['L']"
    assert "finite" in str(e.value)


@pytest.mark.parametrize("bad", NON_FINITE)
def test_superpose_refuses_a_non_finite_factor(bad):
    with pytest.raises(InputError) as e:
        superpose(_cases(), {"D": bad})
    assert e.value.name == "factors['D']"


@pytest.mark.parametrize("bad", NON_FINITE)
def test_result_scaling_refuses_a_non_finite_factor(bad):
    r = _cases()["D"]
    for scale in (lambda: r.scaled(bad), lambda: r * bad, lambda: bad * r):
        with pytest.raises(InputError, match="factor") as e:
            scale()
        assert e.value.name == "factor"


def test_scaling_that_overflows_is_refused():
    r = _cases()["D"]
    with pytest.raises(InputError, match="overflows"):
        r.scaled(1e306)


def test_truss_combination_refuses_a_non_finite_factor():
    from calcpack.analysis.truss_model import Truss  # noqa: F401  (the model the results carry)

    class Stub:
        def scaled(self, f):  # pragma: no cover - never reached: the factor is refused first
            raise AssertionError("a non-finite factor reached the result")

    with pytest.raises(InputError) as e:
        combine_results({"D": Stub()}, {"D": math.nan})
    assert e.value.name == "factors['D']"


def test_deflection_check_on_a_scaled_result_names_the_factor_not_an_assertion():
    with pytest.raises(InputError, match="finite"):
        check_deflection(member="B1", demand=_cases()["D"].scaled(math.nan), span=6 * m)


def test_deflection_check_of_an_unloaded_beam_reports_zero():
    beam = Beam(length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], EI=Q_(1e4, "kN*m**2"))
    mc = check_deflection(member="B1", demand=solve_beam(beam), span=6 * m)
    assert mc.results[0].demand.to("mm").magnitude == 0.0


def test_deflection_without_ei_names_the_missing_ei():
    beam = Beam(
        length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], loads=[UniformLoad(w=1 * kN / m)]
    )
    ex = solve_beam(beam).extremes
    assert ex.has_deflection is False
    for attribute in ("deflection_down", "deflection_up", "slope_left", "slope_right"):
        with pytest.raises(InputError, match=f"{attribute} needs .*EI") as e:
            getattr(ex, attribute)
        assert e.value.name == "EI"
    assert ex.M_max.value.to("kN*m").magnitude == pytest.approx(4.5)  # wL²/8 still given


def test_deflection_with_ei_is_none_only_where_the_beam_does_not_move_that_way():
    ex = _cases()["D"].extremes
    assert ex.deflection_down is not None
    assert ex.deflection_up is None
    # 5wL⁴/384EI, simply supported beam under uniform load (any handbook's beam tables)
    expected = 5 * 4e3 * 6**4 / (384 * 20_000e3)
    assert ex.deflection_down.value.to("m").magnitude == pytest.approx(expected, rel=1e-12)


def test_division_by_zero_in_a_derived_formula_names_the_formula_and_the_zero_part():
    s = Sheet()
    a = s.given("a", Q_(3, "kN"), "load")
    b = s.given("b", Q_(2, "m"), "length")
    with pytest.raises(ZeroDivisorError) as e:
        s.derive("c", a / (b - b), "ratio")
    message = str(e.value)
    assert "c = a/(b − b)" in message
    assert "b − b = 0" in message
    assert e.value.name == "b − b"
    assert isinstance(e.value, InputError)
    assert isinstance(e.value, ZeroDivisionError)


def test_a_zero_to_a_negative_power_is_a_division_by_zero():
    s = Sheet()
    z = s.given("z", Q_(0.0, "m"), "zero")
    with pytest.raises(ZeroDivisorError, match="z = 0"):
        s.derive("y", z**-2, "inverse square")


def _w18x50(**change):
    values = {
        "d": 18.0 * inch, "bf": 7.50 * inch, "tf": 0.570 * inch, "tw": 0.355 * inch, "h_tw": 45.2,
        "Ix": 800 * inch**4, "Sx": 88.9 * inch**3, "Zx": 101 * inch**3, "Iy": 40.1 * inch**4,
        "ry": 1.65 * inch, "J": 1.24 * inch**4, "Cw": 3040 * inch**6, "h0": 17.4 * inch,
    }  # fmt: skip
    values.update(change)
    return IShape("W18x50", "AISC Shapes Database v15.0", **values)


def test_stated_web_slenderness_contradicted_by_the_web_thickness_is_refused():
    # t_w = 0.08 in.: (d − 2 t_f)/t_w is about 210, the stated 45.2 would call a slender web
    # compact
    with pytest.raises(InputError) as e:
        _w18x50(tw=0.08 * inch)
    assert e.value.name == "h_tw"
    assert "45.2" in str(e.value)
    assert "210.8" in str(e.value)


def test_stated_web_slenderness_is_checked_within_two_percent_with_kdes():
    assert _w18x50(kdes=0.972 * inch).h_tw == 45.2  # (18.0 − 1.944)/0.355 = 45.23
    with pytest.raises(InputError, match="within 2 %"):
        _w18x50(kdes=0.972 * inch, h_tw=44.0)  # 2.7 % low
    with pytest.raises(InputError, match="built-up"):
        _w18x50(rolled=False)  # built-up: h = d − 2 t_f gives 47.5, 5 % off


def test_tabulated_shapes_agree_with_their_own_ratios():
    from calcpack import aisc_shape

    for name in ("W18X50", "W8X18", "W24X62"):
        shape = aisc_shape(name).ishape()
        assert shape.kdes is not None


@pytest.mark.parametrize(
    ("name", "value"),
    [
        ("Fy", Q_(1.5, "ksi")),
        ("Fy", Q_(100, "ksi")),
        ("E", Q_(1600, "ksi")),
        ("E", Q_(40_000, "ksi")),
    ],
)
def test_steel_check_refuses_material_values_outside_aisc_360(name, value):
    inputs = {"Fy": 50 * ksi, "E": 29_000 * ksi, name: value}
    with pytest.raises(MaterialOutOfScopeError) as e:
        check_aisc_beam(_w18x50(), Fy=inputs["Fy"], E=inputs["E"], Mu=100 * ureg.kip * ureg.ft)
    assert isinstance(e.value, OutOfScopeError)
    assert e.value.name == name
    assert f"Input {name} = " in str(e.value)
    assert "AISC 360-16" in str(e.value)


def test_steel_check_accepts_si_values_inside_the_range():
    mc = check_aisc_beam(
        _w18x50(), Fy=Q_(345, "MPa"), E=Q_(200, "GPa"), Mu=100 * ureg.kip * ureg.ft,
        continuous_bracing=True,
    )  # fmt: skip
    assert mc["Flexure"].utilisation > 0


@pytest.mark.parametrize(("name", "value"), [("E", 29e6 * psi), ("Emin", 11e6 * psi)])
def test_timber_values_refuse_a_steel_modulus(name, value):
    given = {
        "Fb": 900 * psi, "Ft": 575 * psi, "Fv": 180 * psi, "Fc_perp": 625 * psi, "Fc": 1350 * psi,
        "E": 1.6e6 * psi, "Emin": 580_000 * psi,
    }  # fmt: skip
    given[name] = value
    with pytest.raises(MaterialOutOfScopeError) as e:
        TimberValues("DF-L No.2", "sawn", "NDS Supplement 2018 Table 4A", **given)
    assert e.value.name == name
    assert "NDS 2018" in str(e.value)
