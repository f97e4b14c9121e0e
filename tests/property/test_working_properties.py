"""Property tests of the working: the symbolic formula evaluated equals the numeric result, and
results do not depend on the units the inputs were given in (SI or US customary)."""

from __future__ import annotations

import sympy
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.units import ureg
from calcpack.working import Sheet, sqrt

positive = st.floats(min_value=0.01, max_value=1e4, allow_nan=False, allow_infinity=False)


@settings(max_examples=60, deadline=None)
@given(w=positive, L=positive, P=st.floats(-1e3, 1e3), a=positive)
def test_symbolic_formula_evaluates_to_numeric_result(w, L, P, a):
    s = Sheet("p", auto_display=False)
    wv = s.given("w", w * ureg.kN / ureg.m)
    Lv = s.given("L", L * ureg.m)
    Pv = s.given("P", P * ureg.kN)
    av = s.given("a", a * ureg.m)
    M = s.derive("M", wv * Lv**2 / 8 + Pv * av - Pv * av / 2, unit="kN*m")
    expr = M.formula.sympy()
    numeric = float(
        expr.subs(
            {
                sympy.Symbol("w"): w * 1e3,
                sympy.Symbol("L"): L,
                sympy.Symbol("P"): P * 1e3,
                sympy.Symbol("a"): a,
            }
        )
    )
    assert abs(numeric - M.quantity.to("N*m").magnitude) <= 1e-9 * max(1.0, abs(numeric))


@settings(max_examples=40, deadline=None)
@given(w=positive, L=positive, E=st.floats(1e3, 3e5), I=st.floats(1e4, 1e10))
def test_unit_invariance_si_and_us_inputs_agree(w, L, E, I):
    si = Sheet("SI", auto_display=False)
    us = Sheet("US", system="US", auto_display=False)
    args_si = (w * ureg.kN / ureg.m, L * ureg.m, E * ureg.MPa, I * ureg.mm**4)
    args_us = tuple(q.to(u) for q, u in zip(args_si, ("klf", "ft", "ksi", "inch**4"), strict=True))
    out = []
    for sheet, args in ((si, args_si), (us, args_us)):
        names = ("w", "L", "E", "I")
        wv, Lv, Ev, Iv = (sheet.given(n, q) for n, q in zip(names, args, strict=True))
        d = sheet.derive("delta", 5 * wv * Lv**4 / (384 * Ev * Iv))
        r = sheet.derive("r", sqrt(Iv / (Lv * Lv)))
        out.append((d.quantity.to("m").magnitude, r.quantity.to("m").magnitude))
    for a, b in zip(out[0], out[1], strict=True):
        assert abs(a - b) <= 1e-9 * abs(a)
