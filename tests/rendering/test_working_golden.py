"""Golden renderings of typical derived quantities (LaTeX for Jupyter, HTML for the PDF, text).

The expected strings are the way a checker writes a substitution by hand (common practice):
values with units in parentheses inside products and under powers, negative values bracketed,
powers on the parenthesised value, three significant figures.
"""

from __future__ import annotations

import pytest

from calcpack.units import ureg
from calcpack.working import Sheet, sqrt


@pytest.fixture
def sheet():
    s = Sheet("golden", auto_display=False)
    s.w = s.given("w", 8.5 * ureg.kN / ureg.m)
    s.L = s.given("L", 3.2 * ureg.m)
    return s


def test_simple_span_moment(sheet):
    M = sheet.derive("M_max", sheet.w * sheet.L**2 / 8, "moment", unit="kN*m")
    assert M.latex() == (
        r"$$M_{\mathrm{max}} = \frac{w L^{2}}{8} = "
        r"\frac{\left(8.50\ \mathrm{kN/m}\right) \left(3.20\ \mathrm{m}\right)^{2}}{8} = "
        r"10.9\ \mathrm{kN{\cdot}m}$$"
    )
    assert M.text() == "M_max = w·L²/8 = (8.50 kN/m)·(3.20 m)²/8 = 10.9 kN·m  (moment)"
    html = M.html()
    assert html.startswith('<style class="cp-style">')
    assert html.split("</style>", 1)[1] == (
        '<div class="cp-step cp-derived cp-row" data-name="M_max"><div class="cp-ref"></div>'
        '<div class="cp-desc">moment</div>'
        '<div class="cp-body"><span class="cp-math cp-math-display">'
        r"\[M_{\mathrm{max}} = \frac{w L^{2}}{8} = \frac{\left(8.50\ \mathrm{kN/m}\right) "
        r"\left(3.20\ \mathrm{m}\right)^{2}}{8} = 10.9\ \mathrm{kN{\cdot}m}\]"
        '</span></div><div class="cp-out"></div></div>'
    )


def test_bending_stress_converts_to_display_unit(sheet):
    M = sheet.derive("M_max", sheet.w * sheet.L**2 / 8, unit="kN*m")
    S = sheet.given("S_x", 120e3 * ureg.mm**3)
    sig = sheet.derive("sigma_b", M / S, "stress", unit="MPa")
    assert sig.latex() == (
        r"$$\sigma_{b} = \frac{M_{\mathrm{max}}}{S_{x}} = "
        r"\frac{10.9\ \mathrm{kN{\cdot}m}}{120\,000\ \mathrm{mm^{3}}} = 90.7\ \mathrm{MPa}$$"
    )
    assert sig.text() == "σ_b = M_max/S_x = 10.9 kN·m/(120\u2009000 mm³) = 90.7 MPa  (stress)"


def test_square_root_and_engineering_notation(sheet):
    A = sheet.given("A", 4500 * ureg.mm**2)
    I = sheet.given("I", 2.35e8 * ureg.mm**4)
    r = sheet.derive("r", sqrt(I / A), unit="mm")
    assert r.latex() == (
        r"$$r = \sqrt{\frac{I}{A}} = \sqrt{\frac{235 \times 10^{6}\ \mathrm{mm^{4}}}"
        r"{4500\ \mathrm{mm^{2}}}} = 229\ \mathrm{mm}$$"
    )
    assert r.text() == "r = √(I/A) = √(235×10⁶ mm⁴/(4500 mm²)) = 229 mm"


def test_negative_substituted_value_is_bracketed(sheet):
    P = sheet.given("P", -12 * ureg.kN)
    a = sheet.given("a", 1.5 * ureg.m)
    M = sheet.derive("M_A", P * a + sheet.w * sheet.L**2 / 2, unit="kN*m")
    assert M.latex() == (
        r"$$M_{A} = P a + \frac{w L^{2}}{2} = \left(-12.0\ \mathrm{kN}\right) "
        r"\left(1.50\ \mathrm{m}\right) + \frac{\left(8.50\ \mathrm{kN/m}\right) "
        r"\left(3.20\ \mathrm{m}\right)^{2}}{2} = 25.5\ \mathrm{kN{\cdot}m}$$"
    )
    d = sheet.derive("d", sheet.L - P / sheet.w, unit="m")
    assert d.text() == "d = L − P/w = 3.20 m − (−12.0 kN)/(8.50 kN/m) = 4.61 m"


def test_power_of_compound_unit(sheet):
    q = sheet.given("q", 2.5 * ureg.kN / ureg.m**2)
    Z = sheet.derive("Z", (q * sheet.L) ** 2, unit="kN**2/m**2")
    assert Z.latex() == (
        r"$$Z = \left(q L\right)^{2} = \left(\left(2.50\ \mathrm{kN/m^{2}}\right) "
        r"\left(3.20\ \mathrm{m}\right)\right)^{2} = 64.0\ \mathrm{kN^{2}/m^{2}}$$"
    )


def test_check_rendering(sheet):
    sig = sheet.given("sigma_b", 90.7 * ureg.MPa)
    f = sheet.given("f_b", 165 * ureg.MPa)
    c = sheet.check("Bending", sig, f, ref="cl. 5.1", member="L1")
    assert c.text() == "L1: Bending: 90.7 MPa ≤ 165 MPa, utilisation 0.550  OK  [cl. 5.1]"
    assert r"\eta = \frac{90.7}{165} = 0.550" in c.latex()
    # calc pad: the clause in the reference margin, the verdict in words in the output margin
    body = c.html().split("</style>", 1)[1]
    assert '<div class="cp-ref">cl. 5.1</div>' in body
    assert body.endswith(
        '<div class="cp-out"><span class="cp-verdict cp-ok"><span class="cp-ratio">'
        '0.550 ≤ 1.00</span>, <span class="cp-words">satisfies cl. 5.1</span></span></div></div>'
    )
    over = sheet.check("Shear", 200 * ureg.MPa, f, ref="cl. 5.2")
    assert over.verdict == "NOT OK"
    assert "NOT OK" in over.text()
    assert ">" in over.text()
    assert '1.21 &gt; 1.00</span>, <span class="cp-words">DOES NOT SATISFY cl. 5.2<' in over.html()


def test_long_derivation_breaks_into_aligned_lines(sheet):
    E = sheet.given("E", 200 * ureg.GPa)
    I = sheet.given("I_x", 2.35e8 * ureg.mm**4)
    d = sheet.derive("delta", 5 * sheet.w * sheet.L**4 / (384 * E * I), unit="mm")
    tex = d.latex()
    assert tex.startswith(r"$$\begin{aligned} \delta &= \frac{5 \cdot w L^{4}}{384 \cdot E I_{x}}")
    assert tex.endswith(r"\\ &= 0.247\ \mathrm{mm} \end{aligned}$$")


def test_negation_of_negative_value_is_bracketed(sheet):
    F = sheet.given("F", -45 * ureg.kN)
    G = sheet.given("G", 10 * ureg.kN)
    x = sheet.derive("x", -F + G, unit="kN")
    assert x.text() == "x = −F + G = −(−45.0 kN) + 10.0 kN = 55.0 kN"
    assert r"-\left(-45.0\ \mathrm{kN}\right)" in x.latex()


def test_prose_math_in_block_latex_is_not_wrapped_in_text():
    from calcpack.working import Block, Text

    tex = Block([Text("Take moments about $A$ first.")]).latex()
    assert r"\text{Take moments about }A\text{ first.}" in tex
