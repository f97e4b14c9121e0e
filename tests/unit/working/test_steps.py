"""Working steps: values, errors named by input, checks, records and the rich display bundle."""

from __future__ import annotations

import math

import pytest
import sympy

from calcpack import DimensionError, InputError, UndefinedSymbolError
from calcpack.units import ureg
from calcpack.working import (
    RECORDS_MIMETYPE,
    Equation,
    Sheet,
    Unknown,
    Verdict,
    evaluate,
    sin,
    sqrt,
)


@pytest.fixture
def s():
    return Sheet("unit tests", auto_display=False)


def test_unit_mismatch_names_formula_and_both_units(s):
    P = s.given("P", 3 * ureg.kN)
    L = s.given("L", 2 * ureg.m)
    with pytest.raises(DimensionError) as info:
        s.derive("y", P + L)
    msg = str(info.value)
    assert "y = P + L" in msg
    assert "kN" in msg
    assert "m (" in msg
    assert info.value.name == "y"


def test_undefined_sympy_symbol_is_named(s):
    P = s.given("P", 3 * ureg.kN)
    with pytest.raises(UndefinedSymbolError, match="Symbol k"):
        s.derive("q", P * sympy.Symbol("k"))


def test_unknown_cannot_be_evaluated(s):
    R = Unknown("R_B", unit="kN")
    P = s.given("P", 3 * ureg.kN)
    with pytest.raises(UndefinedSymbolError, match="R_B"):
        s.derive("x", R + P)


@pytest.mark.parametrize("bad", [math.nan, math.inf])
def test_non_finite_given_is_refused(s, bad):
    with pytest.raises(InputError, match="Given L must be finite"):
        s.given("L", bad * ureg.m)


def test_bare_string_given_is_refused(s):
    with pytest.raises(InputError, match="Given L must be a quantity"):
        s.given("L", "3 m")


def test_non_finite_number_in_formula_is_refused(s):
    L = s.given("L", 2 * ureg.m)
    with pytest.raises(InputError, match="must be finite"):
        s.derive("x", L * math.inf)


def test_check_of_different_dimensions_is_refused(s):
    M = s.given("M", 10 * ureg.kN * ureg.m)
    f = s.given("f", 100 * ureg.MPa)
    with pytest.raises(DimensionError, match="Check 'Bending' compares quantities of different"):
        s.check("Bending", M, f)


def test_check_capacity_must_be_positive(s):
    with pytest.raises(InputError, match="capacity must be positive"):
        s.check("Shear", 3 * ureg.kN, 0 * ureg.kN)


def test_display_unit_of_wrong_dimension(s):
    L = s.given("L", 2 * ureg.m)
    with pytest.raises(DimensionError, match="M cannot be shown in kN"):
        s.derive("M", L * L, unit="kN")


def test_bad_symbol_name(s):
    with pytest.raises(InputError, match="name must be a symbol"):
        s.given("span length", 2 * ureg.m)


def test_fractional_power_of_negative(s):
    P = s.given("P", -3 * ureg.kN)
    with pytest.raises(InputError, match="fractional power of a negative value"):
        s.derive("r", sqrt(P * P / P))


def test_check_uses_magnitude_of_demand_and_names_verdict(s):
    c = s.check("Sagging", -8 * ureg.kN * ureg.m, 10 * ureg.kN * ureg.m)
    assert c.utilisation == pytest.approx(0.8)
    assert c.verdict == Verdict.OK
    c2 = s.check("Hogging", 12 * ureg.kN * ureg.m, 10000 * ureg.N * ureg.m)
    assert c2.utilisation == pytest.approx(1.2)
    assert c2.verdict == Verdict.NOT_OK


def test_values_and_records_are_full_precision(s):
    L = s.given("L", 3.2 * ureg.m, "span")
    w = s.given("w", 8.5 * ureg.kN / ureg.m)
    s.derive("M", w * L**2 / 8, "moment", unit="kN*m")
    s.check("Bending", s["M"], 20 * ureg.kN * ureg.m, ref="cl. 1")
    s.assume("Simply supported on masonry")
    s.caution("Confirm bearing length on site")
    values = {r.name: r for r in s.values()}
    assert values["M"].value == pytest.approx(10.88, rel=1e-12)
    assert values["M"].unit == "kN·m"
    assert values["L"].description == "span"
    recs = s.records()
    assert recs["checks"][0]["utilisation"] == pytest.approx(0.544)
    assert recs["assumptions"] == ["Simply supported on masonry"]
    assert recs["cautions"] == ["Confirm bearing length on site"]


def test_mimebundle_carries_records(s):
    L = s.given("L", 3.2 * ureg.m)
    bundle = L._repr_mimebundle_()
    assert set(bundle) >= {"text/html", "text/latex", "text/plain", RECORDS_MIMETYPE}
    assert bundle[RECORDS_MIMETYPE]["values"][0]["value"] == pytest.approx(3.2)


def test_preset_display_unit_for_us_sheet():
    s = Sheet("US", system="US", auto_display=False)
    w = s.given("w", 1.2 * ureg.klf)
    L = s.given("L", 20 * ureg.ft)
    M = s.derive("M", w * L**2 / 8)
    assert M.text() == "M = w·L²/8 = (1.20 klf)·(20.0 ft)²/8 = 60.0 kip·ft"
    assert M.magnitude == pytest.approx(60.0)


def test_sig_figs_per_sheet():
    s = Sheet("four", sig_figs=4, auto_display=False)
    L = s.given("L", 3.14159 * ureg.m)
    assert L.text() == "L = 3.142 m"


def test_equation_substitutes_knowns_and_keeps_unknowns(s):
    L = s.given("L", 6 * ureg.m)
    P = s.given("P", 10 * ureg.kN)
    R = Unknown("R_B", unit="kN")
    eq = Equation(R * L - P * L / 2, label=r"\Sigma M_A = 0", settings=s.settings)
    text = eq.text()
    assert text.startswith("ΣM_A = 0: R_B·L − P·L/2 = 0")
    assert "R_B·(6.00 m) − (10.0 kN)·(6.00 m)/2 = 0" in text


def test_trig_functions_take_angles(s):
    th = s.given("theta", 30 * ureg.deg)
    P = s.given("P", 10 * ureg.kN)
    Px = s.derive("P_x", P * sin(th))
    assert Px.quantity.to("kN").magnitude == pytest.approx(5.0)


def test_literal_quantity_in_formula(s):
    m = s.given("m", 100 * ureg.kg)
    W = s.derive("W", m * (9.81 * ureg.m / ureg.s**2), unit="kN")
    assert W.quantity.to("N").magnitude == pytest.approx(981.0)
    assert "9.81 m/s²" in W.text()


def test_evaluate_matches_sympy_form(s):
    w = s.given("w", 8.5 * ureg.kN / ureg.m)
    L = s.given("L", 3.2 * ureg.m)
    term = w * L**2 / 8
    expr = term.sympy()
    assert expr == sympy.Symbol("L") ** 2 * sympy.Symbol("w") / 8
    assert evaluate(term).to("N*m").magnitude == pytest.approx(8500 * 3.2**2 / 8)


def test_auto_display_is_off_outside_a_kernel():
    s = Sheet("x")  # must not import IPython nor fail outside a kernel
    s.given("L", 1 * ureg.m)
    assert len(s.steps) == 1


def test_sheet_text_report_and_table():
    s = Sheet("Report", auto_display=False)
    s.heading("Loads")
    s.table(["Case", "w"], [["D", 2.5 * ureg.kN / ureg.m], ["L", 1.5 * ureg.kN / ureg.m]])
    out = s.text_report()
    assert "LOADS" in out
    assert "2.50 kN/m" in out
    with pytest.raises(InputError, match="Table row 1 has 1 cells but there are 2 columns"):
        s.table(["a", "b"], [["x"]])
