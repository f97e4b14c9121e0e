"""Golden plain-text forms of formulas: the words a reader searches for and copies from the
PDF, and a screen reader reads as the formula's alternative text.

The expected strings follow how the package's typeset prose copies out of a PDF (a subscript
runs on after its symbol, as ``M<sub>max</sub>`` copies as "Mmax") and how an engineer types a
formula on one line (common practice): "/" for a fraction with a compound part in
parentheses, "·" for an explicit product, superscript digits for integer powers, relations
spaced.
"""

from __future__ import annotations

import re

import pytest

from calcpack.package.mathcache import MathCache
from calcpack.package.mathsvg import math_spans_to_images
from calcpack.package.mathtext import MONO_ADVANCE_EM, tex_to_text
from calcpack.units import ureg
from calcpack.working import Sheet

CASES = [
    (
        r"M_{\mathrm{max}} = \frac{w L^{2}}{8} = \frac{\left(8.50\ \mathrm{kN/m}\right) "
        r"\left(3.20\ \mathrm{m}\right)^{2}}{8} = 10.9\ \mathrm{kN{\cdot}m}",
        "Mmax = wL²/8 = ((8.50 kN/m)(3.20 m)²)/8 = 10.9 kN·m",
    ),
    (r"\tau = \frac{3 \cdot V_{\mathrm{max}}}{2 \cdot b d}", "τ = (3·Vmax)/(2·bd)"),
    (r"\sigma_{b} \le f_{b}", "σb ≤ fb"),
    (r"I_{x,\mathrm{net}} = 104 \times 10^{6}\ \mathrm{mm}^{4}", "Ix,net = 104 × 10⁶ mm⁴"),
    (r"\frac{1}{\sqrt{2 g h}}", "1/√(2gh)"),
    (r"\bar{x}{}^{2}", "x̄²"),
    (r"F_{c}^{*} = -3.20\ \mathrm{kN}", "Fc* = −3.20 kN"),
    (r"10^{-3}", "10⁻³"),
    # words for marks in a subscript are written as the marks (as the prose writes them)
    (r"F_{c,\mathrm{star},\mathrm{TC}}", "Fc,TC*"),
    (r"F_{c,\mathrm{prime}} \le F_{\mathrm{cperp}}", "Fc′ ≤ Fc⊥"),
    (r"F_{\mathrm{cperp}}^{\prime} = 419\ \mathrm{psi}", "Fc⊥′ = 419 psi"),
    (r"x^{a+b}", "x^(a + b)"),
    (r"\sum_{i=1}^{n} F_{i} = 0", "∑[i = 1…n] Fi = 0"),
    (r"\frac{\pi^{2} E I}{L^{2}}", "π²EI/L²"),
    (r"\Delta = \frac{L}{360}", "Δ = L/360"),
    (r"\begin{aligned} a &= b + c \\ &= 3\ \mathrm{m} \end{aligned}", "a = b + c; = 3 m"),
]


@pytest.mark.parametrize(("tex", "text"), CASES)
def test_formula_plain_text(tex: str, text: str) -> None:
    assert tex_to_text(tex) == text


def test_a_derived_value_reads_as_its_working() -> None:
    sheet = Sheet("golden", auto_display=False)
    sheet.w = sheet.given("w", 8.5 * ureg.kN / ureg.m)
    sheet.L = sheet.given("L", 3.2 * ureg.m)
    moment = sheet.derive("M_max", sheet.w * sheet.L**2 / 8, "moment", unit="kN*m")
    tex = moment.latex().strip("$")
    assert tex_to_text(tex) == CASES[0][1]


def test_each_formula_image_carries_its_words() -> None:
    """The image's alternative text is the plain text, and the same text comes first as
    invisible text sized to span the image."""
    tex = CASES[0][0]
    markup = math_spans_to_images(
        f'<span class="cp-math cp-math-display">\\[{tex}\\]</span> and '
        '<span class="cp-math cp-math-inline">\\(\\sigma_{b} \\le f_{b}\\)</span>',
        MathCache(),
    )
    found = re.findall(
        r'<span class="cp-math-text" style="font-size:([\d.]+)px">([^<]*)</span>'
        r'<img [^>]*alt="([^"]*)" style="width:([\d.]+)px',
        markup,
    )
    assert [text for _, text, _, _ in found] == [CASES[0][1], "σb ≤ fb"]
    for size_px, text, alt, width_px in found:
        size, width = float(size_px), float(width_px)
        assert alt == text
        # monospaced: the text is exactly as wide as the image, or body-sized if shorter
        assert MONO_ADVANCE_EM * len(text) * size == pytest.approx(width, abs=0.01) or (
            size == 12.7 and MONO_ADVANCE_EM * len(text) * size < width
        )


def test_pi_stays_a_symbol_in_the_working_and_its_text() -> None:
    """π written with ``calcpack.working.pi`` prints as π, never as 9.8696 (π² evaluated)."""
    from calcpack.working import pi

    sheet = Sheet("golden", auto_display=False)
    E = sheet.given("E", 9.0 * ureg.GPa, "modulus")
    lam = sheet.given("lambda_c", 80, "slenderness")
    F = sheet.derive("F_cr", pi**2 * E / lam**2, "buckling stress", unit="MPa")
    # π² E / λ² with E = 9000 MPa, λ = 80: 13.88 MPa (hand arithmetic, common practice)
    assert F.quantity.to("MPa").magnitude == pytest.approx(13.879, rel=1e-4)
    text = tex_to_text(F.latex().strip("$"))
    assert text == "Fcr = π²E/λc² = (π²(9.00 GPa))/80.0² = 13.9 MPa"
    assert "9.869" not in text
