"""The checker's quick estimates against published beam-table formulas and closed forms.

Sources:
* AISC Steel Construction Manual, 15th ed. (2017), Part 3, Table 3-23 "Shears, Moments and
  Deflections": simple beam -- uniformly distributed load; simple beam -- concentrated load at
  center; cantilever beam -- uniformly distributed load; cantilever beam -- concentrated load at
  free end; beam fixed at one end, supported at other -- uniformly distributed load; beam fixed
  at both ends -- uniformly distributed load; continuous beam -- two equal spans and three
  equal spans -- uniform load on all spans (coefficients 0.125/0.0703 and 0.100/0.080, reactions
  0.375/1.25 and 0.400/1.10 w·L). Formulas and coefficients from memory (the standard cases every
  edition carries), as in tests/validation/test_beam_tables.py; case numbers not quoted.
* Four equal spans: the three-moment equation solved by hand in fractions (M_B = 3/28 w·L²,
  M_C = 2/28 w·L², reactions 11/28, 32/28, 26/28 w·L) -- closed form, no table.
* Method of sections and tributary lengths: statics worked by hand beside each assertion.

The closed forms are exact; the estimates agree to round-off, so 1e-9 relative is asked (the
table's rounded coefficients to their printed digits).
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.analysis.estimates import (
    beam_table,
    continuous_equal_spans,
    section_cut,
    statical_moment,
    tributary_reactions,
)
from calcpack.errors import DimensionError, InputError
from calcpack.units import Q_

RTOL = 1e-9
L = Q_(7.5, "m")
w = Q_(14.0, "kN/m")
P = Q_(36.0, "kN")
EI = Q_(200e3, "MPa") * Q_(250e6, "mm**4")


def near(q, value: float, unit: str, rel: float = RTOL) -> bool:
    return q.to(unit).magnitude == pytest.approx(value, rel=rel)


def test_simple_beam_uniform_load():  # AISC Table 3-23: M = wL²/8, V = wL/2, Δ = 5wL⁴/384EI
    e = beam_table("simple uniform", L=L, w=w, EI=EI)
    assert near(e["M_max"], 14.0 * 7.5**2 / 8, "kN*m")
    assert near(e["V_max"], 14.0 * 7.5 / 2, "kN")
    assert near(e["delta_max"], 5 * 14.0e3 * 7.5**4 / (384 * 200e9 * 250e-6), "m")


def test_simple_beam_central_point_load():  # AISC Table 3-23: M = PL/4, Δ = PL³/48EI
    e = beam_table("simple central point", L=L, P=P, EI=EI)
    assert near(e["M_max"], 36.0 * 7.5 / 4, "kN*m")
    assert near(e["delta_max"], 36.0e3 * 7.5**3 / (48 * 200e9 * 250e-6), "m")


def test_cantilevers():  # AISC Table 3-23: wL²/2, wL⁴/8EI; PL, PL³/3EI
    u = beam_table("cantilever uniform", L=L, w=w, EI=EI)
    assert near(u["M_max"], 14.0 * 7.5**2 / 2, "kN*m")
    assert near(u["delta_max"], 14.0e3 * 7.5**4 / (8 * 200e9 * 250e-6), "m")
    p = beam_table("cantilever end point", L=L, P=P, EI=EI)
    assert near(p["M_max"], 36.0 * 7.5, "kN*m")
    assert near(p["delta_max"], 36.0e3 * 7.5**3 / (3 * 200e9 * 250e-6), "m")


def test_propped_and_fixed_uniform():  # AISC Table 3-23: wL²/8, 9wL²/128, 5wL/8; wL²/12, wL²/24
    pr = beam_table("propped uniform", L=L, w=w)
    assert near(pr["M_support"], 14.0 * 7.5**2 / 8, "kN*m")
    assert near(pr["M_max"], 9 * 14.0 * 7.5**2 / 128, "kN*m")
    assert near(pr["R_A"], 5 * 14.0 * 7.5 / 8, "kN")
    assert near(pr["R_B"], 3 * 14.0 * 7.5 / 8, "kN")
    fx = beam_table("fixed uniform", L=L, w=w, EI=EI)
    assert near(fx["M_support"], 14.0 * 7.5**2 / 12, "kN*m")
    assert near(fx["M_max"], 14.0 * 7.5**2 / 24, "kN*m")
    assert near(fx["delta_max"], 14.0e3 * 7.5**4 / (384 * 200e9 * 250e-6), "m")


@pytest.mark.parametrize(
    ("n", "m_support", "m_span", "r_end", "r_interior", "rel"),
    [
        (2, 0.125, 0.0703, 0.375, 1.25, 5e-3),  # AISC Table 3-23, two equal spans (printed 0.0703)
        (3, 0.100, 0.080, 0.400, 1.10, 1e-9),  # AISC Table 3-23, three equal spans
        (4, 3 / 28, None, 11 / 28, 32 / 28, 1e-9),  # three-moment equation by hand
    ],
)
def test_continuous_equal_spans(n, m_support, m_span, r_end, r_interior, rel):
    e = continuous_equal_spans(n=n, L=L, w=w)
    wl, wl2 = 14.0 * 7.5, 14.0 * 7.5**2
    assert near(e["M_support"], m_support * wl2, "kN*m")
    if m_span is not None:
        assert near(e["M_max"], m_span * wl2, "kN*m", rel=rel)
    assert near(e["R_end"], r_end * wl, "kN")
    assert near(e["R_interior"], r_interior * wl, "kN")


def test_two_span_positive_moment_is_nine_over_128():  # 0.0703 printed; 9/128 exactly
    assert near(continuous_equal_spans(n=2, L=L, w=w)["M_max"], 9 / 128 * 14.0 * 7.5**2, "kN*m")


@given(n=st.integers(1, 12), span=st.floats(0.5, 30.0), load=st.floats(0.1, 100.0))
def test_the_end_span_obeys_its_own_statics(n: int, span: float, load: float) -> None:
    # end span as a free body: R_end = wL/2 - M_B/L, and the sagging peak where V = 0 is
    # R_end²/(2w); M_B is the largest support moment for equal spans (first interior support)
    e = continuous_equal_spans(n=n, L=Q_(span, "m"), w=Q_(load, "kN/m"))
    r_end = e["R_end"].to("kN").magnitude
    m_b = e["M_support"].to("kN*m").magnitude
    assert r_end == pytest.approx(load * span / 2 - m_b / span, rel=1e-9)
    assert e["M_max"].to("kN*m").magnitude == pytest.approx(r_end**2 / (2 * load), rel=1e-9)


def test_tributary_reactions_share_each_span_between_its_supports():
    e = tributary_reactions(w=w, spans=[Q_(4.0, "m"), Q_(6.0, "m")])
    assert near(e["R_1"], 14.0 * 2.0, "kN")  # half of 4 m
    assert near(e["R_2"], 14.0 * 5.0, "kN")  # 2 m + 3 m
    assert near(e["R_3"], 14.0 * 3.0, "kN")
    assert "25 %" in e.known_error


def test_statical_moment_of_a_fixed_span_leaves_the_table_midspan_moment():
    # fixed both ends: end moments wL²/12 leave wL²/8 - wL²/12 = wL²/24 at midspan (Table 3-23)
    ends = w * L**2 / 12
    e = statical_moment(w=w, L=L, M_left=ends, M_right=ends)
    assert near(e["M_0"], 14.0 * 7.5**2 / 8, "kN*m")
    assert near(e["M_mid"], 14.0 * 7.5**2 / 24, "kN*m")


def test_method_of_sections_at_a_cut():
    # Parallel-chord truss, span 12 m in 4 panels of 3 m, depth 2 m, 10 kN at each of the three
    # interior joints: reactions 15 kN; cut in panel 2 at x = 6 m: M = 15·6 - 10·3 = 60 kN·m,
    # V = 15 - 10 = 5 kN; chord force 60/2 = 30 kN; diagonal at atan(2/3): 5/sin θ = 9.014 kN.
    theta = Q_(33.690067525979785, "degree")  # atan(2/3)
    e = section_cut(M=Q_(60, "kN*m"), V=Q_(5, "kN"), depth=Q_(2, "m"), diagonal_angle=theta)
    assert near(e["F_chord"], 30.0, "kN")
    assert near(e["F_diagonal"], 5 * 13**0.5 / 2, "kN")  # sin θ = 2/√13


def test_every_estimate_says_it_is_an_estimate_with_its_known_error():
    from calcpack.working import Sheet

    s = Sheet("check", auto_display=False)
    s.add(continuous_equal_spans(n=2, L=L, w=w).working())
    text = s.text_report()
    assert "Estimate, not an analysis" in text
    assert "pattern loading" in text


@pytest.mark.parametrize(
    ("call", "words"),
    [
        (lambda: beam_table("simple uniform", L=L, P=P), "takes a uniform load w"),
        (lambda: beam_table("simple uniform", L=-L, w=w), "L"),
        (lambda: beam_table("pinned", L=L, w=w), "case"),
        (lambda: continuous_equal_spans(n=0, L=L, w=w), "n = 0"),
        (lambda: tributary_reactions(w=w, spans=[]), "at least one span"),
        (lambda: statical_moment(w=w, L=L, M_left=w * L**2), "M_right"),
    ],
)
def test_bad_input_is_refused_naming_it(call, words):
    with pytest.raises(InputError, match=words):
        call()


def test_a_load_of_the_wrong_dimension_is_refused():
    with pytest.raises(DimensionError, match="w"):
        beam_table("simple uniform", L=L, w=P)
