"""TeX to SVG: the formula forms sympy, pint and calcpack.working emit typeset as vector paths."""

from __future__ import annotations

import base64
import re
import xml.etree.ElementTree as ET

import pytest

from calcpack.errors import BuildError
from calcpack.package.mathcache import MathCache
from calcpack.package.mathsvg import (
    fix_tex,
    markdown_math_to_spans,
    math_spans_to_images,
    tex_to_svg,
)

# What the working module, sympy's latex() and pint's LaTeX formatter emit (checked by hand
# against their output: sympy.latex(Integral(x, (x, 0, L))) gives \int\limits_{0}^{L} x\, dx;
# pint's "~L" format gives \mathrm{kN} \cdot \mathrm{m}).
FORMULAS = [
    r"\frac{w L^{2}}{8}",
    r"\sqrt{\frac{E I}{m}}",
    r"x_{i}^{2} + \alpha \beta \gamma \Delta \sigma_{b}",
    r"\left(\frac{a}{b}\right)^{2}",
    r"\begin{aligned} M &= \frac{w L^{2}}{8} \\ &= 4.36\ \mathrm{kN} \cdot \mathrm{m}\end{aligned}",
    r"\sum_{i=1}^{n} F_{i} = 0",
    r"\int\limits_{0}^{L} w(x)\, dx",
    r"\frac{1}{\sqrt{2 g h}}",
    r"\bar{x}^{2}",
    r"\sigma_{b} = 5.05\ \mathrm{MPa} \leq f_{b} = 11.0\ \mathrm{MPa}",
]


@pytest.mark.parametrize("tex", FORMULAS)
def test_formula_is_vector_svg_with_size(tex: str) -> None:
    image = tex_to_svg(tex, display=True, cache=MathCache())
    root = ET.fromstring(image.svg)
    assert root.tag.endswith("svg")
    tags = {el.tag.rsplit("}", 1)[-1] for el in root.iter()}
    assert "path" in tags  # glyphs are outlines
    assert "image" not in tags  # never a raster
    assert "text" not in tags  # no font needed to show it
    assert image.width_px > 5
    assert image.height_px > 5
    assert 0 <= image.baseline_px < image.height_px


def test_cache_returns_the_same_image() -> None:
    math = MathCache()
    assert tex_to_svg(r"M_{max}", cache=math) is tex_to_svg(r"M_{max}", cache=math)
    assert tex_to_svg(r"M_{max}", display=True, cache=math) is not tex_to_svg(
        r"M_{max}", cache=math
    )


def test_a_cache_passed_in_keeps_its_own_formulas_and_the_keys_used() -> None:
    """A build's formula cache is its own object: it starts empty, counts what it typesets as
    used, and another run's cache is left alone."""
    other = MathCache()
    math = MathCache()
    tex = r"M_{own} = \frac{w L^{2}}{8}"
    image = tex_to_svg(tex, display=True, cache=math)
    assert math.images == {(tex, True, 13.5): image}
    assert math.used == {(tex, True, 13.5)}
    assert (tex, True, 13.5) not in other.images
    assert tex_to_svg(tex, display=True, cache=math) is image
    again = MathCache()
    again.add_images(math.image_entries())
    assert again.images == math.images  # the saved form carries the whole image


def test_root_in_denominator_clears_the_fraction_bar() -> None:
    # The root's box must include its rule, so the fraction grows by the clearance; compared
    # with the same formula typeset by ziamath as it ships (the defect).
    import ziamath
    from ziamath.tex import tex2mml

    tex = r"\frac{1}{\sqrt{2 g h}}"
    fixed = tex_to_svg(tex, display=True, size_px=28.0, cache=MathCache())
    import ziamath.nodes.mroot as mroot

    patched = mroot.Mroot._setup
    try:
        mroot.Mroot._setup = patched.__wrapped__  # the method as shipped
        as_shipped = ziamath.Math(tex2mml(tex), size=28.0).getsize()[1]
    finally:
        mroot.Mroot._setup = patched
    assert fixed.height_px > as_shipped + 1.0


def test_fix_tex_moves_script_off_accent() -> None:
    assert fix_tex(r"\bar{x}^{2}") == r"\bar{x}{}^{2}"
    assert fix_tex(r"\hat{M}_{c}^{2}") == r"\hat{M}{}_{c}^{2}"
    assert fix_tex(r"\bar{x} + y^{2}") == r"\bar{x} + y^{2}"


def test_fix_tex_groups_a_sign_minus_and_leaves_binary_minus() -> None:
    assert (
        fix_tex(r"\left( - 0.08\ \mathrm{kip} \right)") == r"\left( {-} 0.08\ \mathrm{kip} \right)"
    )
    assert fix_tex(r"R = -1.45 + a - b") == r"R = {-}1.45 + a - b"
    assert fix_tex(r"-x - y") == r"{-}x - y"
    assert fix_tex(r"a - b") == r"a - b"


def test_sign_minus_after_a_stretchy_bracket_is_set_tight() -> None:
    # TeX sets a minus after an opening bracket as a sign: "(−0.08 kip)" has the width of
    # "(0.08 kip)" plus the sign, with no operator spaces (TeXbook, Appendix G, rule 5).
    math = MathCache()
    tight = tex_to_svg(r"\left( {-}0.08 \right)", track=False, cache=math).width_px
    sign = tex_to_svg(r"\left( -0.08 \right)", track=False, cache=math)
    assert sign.width_px == pytest.approx(tight)


def test_script_on_accent_sits_at_normal_height() -> None:
    # TeX attaches the script to the nucleus, so x̄² is no taller than x² plus the accent.
    plain = tex_to_svg(r"x^{2}", cache=MathCache())
    accented = tex_to_svg(r"\bar{x}^{2}", cache=MathCache())
    assert accented.height_px <= plain.height_px * 1.25


def test_unknown_command_names_the_formula() -> None:
    with pytest.raises(BuildError, match=r"\\notacommand"):
        tex_to_svg(r"\notacommand{x}", cache=MathCache())


def test_spans_become_images_with_plain_text_alt_text() -> None:
    html = (
        '<div class="cp-step"><span class="cp-math cp-math-display">\\[a &lt; \\frac{b}{c}\\]'
        '</span> and <span class="cp-math cp-math-inline">\\(x_{1}\\)</span></div>'
    )
    out = math_spans_to_images(html, MathCache())
    assert "\\frac" not in re.sub(r'alt="[^"]*"', "", out)
    alts = re.findall(r'alt="([^"]*)"', out)
    assert alts == ["a &lt; b/c", "x1"]  # the formula's words (package/mathtext.py)
    uris = re.findall(r'src="data:image/svg\+xml;base64,([^"]+)"', out)
    assert len(uris) == 2
    assert base64.b64decode(uris[0]).startswith(b"<svg")
    assert 'class="cp-math-img cp-math-display"' in out
    assert 'class="cp-math-img cp-math-inline"' in out


def test_markdown_dollars_become_spans_but_prices_and_code_do_not() -> None:
    html = "<p>Load $w = 5$ kN and $$M = \\frac{wL^2}{8}$$ cost $5 and $6 <code>$x$</code></p>"
    out = markdown_math_to_spans(html)
    assert '<span class="cp-math cp-math-inline">\\(w = 5\\)</span>' in out
    assert '<span class="cp-math cp-math-display">\\[M = \\frac{wL^2}{8}\\]</span>' in out
    assert "cost $5 and $6" in out
    assert "<code>$x$</code>" in out


def test_no_formula_cache_outlives_its_run() -> None:
    """Every typesetting path takes the run's own cache (a build's, or a single sheet's
    export's): no module of the build keeps one of its own between runs."""
    import importlib

    for name in ("mathsvg", "mathcache", "document", "sheetdoc", "bodies", "pipeline", "convert"):
        module = importlib.import_module(f"calcpack.package.{name}")
        kept = [k for k, v in vars(module).items() if isinstance(v, MathCache)]
        assert kept == [], f"calcpack.package.{name} keeps a formula cache: {kept}"
