"""Breaking wide display formulas: where the breaks fall, and that no symbol is lost.

Common practice for breaking displayed equations by hand: break before a relation or a binary
operator (never after a unary minus), continue indented, keep brackets paired on each line.
"""

from __future__ import annotations

import re

import pytest

from calcpack.package.mathbreak import break_display, flatten_delimiters, top_level_atoms
from calcpack.package.mathcache import MathCache
from calcpack.package.mathsvg import MATH_MAX_WIDTH_PX, fitted_image, tex_to_svg


def _chars(tex: str) -> float:
    """A stand-in typesetter: 7 px per visible character."""
    visible = re.sub(r"\\(left|right|mathrm|Bigl|Bigr|quad)|[\s{}&.]", "", tex)
    return 7.0 * len(visible)


def _content(tex: str) -> str:
    """The symbols of a formula without layout (alignment, line breaks, bracket sizing)."""
    tex = re.sub(r"\\(begin|end)\{aligned\}|\\\\|&|\\quad|\\Bigl|\\Bigr", " ", tex)
    tex = re.sub(r"\\left\s*\.|\\right\s*\.|\\left|\\right", " ", tex)
    return re.sub(r"\s+", "", tex)


def test_atoms_keep_groups_commands_and_scripts_whole() -> None:
    tex = r"P_{\mathrm{L1}} \left(4.00\ \mathrm{ft}\right) + \frac{a}{b}^{2} - \sqrt[3]{x}"
    assert top_level_atoms(tex) == [
        r"P_{\mathrm{L1}}",
        r"\left(4.00\ \mathrm{ft}\right)",
        "+",
        r"\frac{a}{b}^{2}",
        "-",
        r"\sqrt[3]{x}",
    ]


def test_flat_brackets_become_plain_and_tall_ones_stay_sized() -> None:
    assert flatten_delimiters(r"\left(0.3\ \mathrm{kN}\right)") == r"( 0.3\ \mathrm{kN} )"
    kept = flatten_delimiters(r"\left(\frac{1}{2}\right)^{2}")
    assert kept.startswith(r"\left( \frac{1}{2} \right)")
    assert flatten_delimiters(r"a \leftarrow b") == r"a \leftarrow b"


def test_a_long_sum_breaks_before_operators_and_keeps_every_symbol() -> None:
    tex = "M = " + " + ".join(f"P_{{{i}}} a_{{{i}}}" for i in range(1, 25)) + " - Q"
    broken = break_display(tex, 200, _chars)
    rows = broken.removeprefix(r"\begin{aligned}").removesuffix(r"\end{aligned}").split(r" \\ ")
    assert len(rows) > 3
    assert rows[0].startswith("M & =")
    for row in rows[1:]:
        assert re.match(r"& \\quad [+-] ", row), row  # continuation starts with its operator
    assert all(_chars(row) <= 200 for row in rows)
    assert _content(broken) == _content(tex)


def test_a_unary_minus_is_never_a_break() -> None:
    tex = "R = - a " + " ".join(f"+ b_{{{i}}}" for i in range(30))
    broken = break_display(tex, 120, _chars)
    assert "& \\quad - a" not in broken
    assert broken.split(r" \\ ")[0].endswith("- a + b_{0}") or "= - a" in broken


def test_brackets_and_numerators_are_broken_inside() -> None:
    terms = " + ".join(f"P_{{{i}}} x_{{{i}}}" for i in range(1, 20))
    bracket = break_display(rf"R = -\left({terms}\right)", 200, _chars)
    assert bracket.count("(") == bracket.count(")") == 1  # one pair over the lines
    assert _content(bracket) == _content(rf"R = -\left({terms}\right)")
    fraction = break_display(rf"R = \frac{{{terms}}}{{L}}", 200, _chars)
    assert r"\frac{\begin{aligned}" in fraction
    assert _content(fraction) == _content(rf"R = \frac{{{terms}}}{{L}}")


def test_a_formula_that_fits_is_left_alone() -> None:
    assert break_display("M = w L^{2} / 8", 400, _chars) == "M = w L^{2} / 8"


@pytest.mark.parametrize("count", [12, 40])
def test_typeset_result_fits_the_column(count: int) -> None:
    """With the real typesetter: broken over lines, within the column, at full size."""
    tex = r"\Sigma M_{A} = " + " + ".join(
        rf"\left({i}.00\ \mathrm{{kN}}\right) \left({i}.50\ \mathrm{{m}}\right)"
        for i in range(1, count)
    )
    math = MathCache()
    whole = tex_to_svg(tex, display=True, cache=math)
    assert whole.width_px > MATH_MAX_WIDTH_PX
    image = fitted_image(tex, True, cache=math)
    assert 0.6 * MATH_MAX_WIDTH_PX < image.width_px <= MATH_MAX_WIDTH_PX
    assert image.height_px > 2 * whole.height_px


def test_numbers_stay_whole_in_broken_rows() -> None:
    tex = (
        r"\begin{aligned} R &= "
        + " + ".join(rf"P_{{{i}}} \left(4.00\ \mathrm{{ft}}\right)" for i in range(20))
        + r" \\ &= 1.45\ \mathrm{kip}\end{aligned}"
    )
    broken = break_display(tex, 200, _chars)
    assert re.search(r"= 1\.45\s*\\ \s*\\mathrm\{kip\}", broken)
    assert "4.00" in broken
    assert "1 . 4 5" not in broken
