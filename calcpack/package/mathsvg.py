"""TeX to vector SVG for the PDF, with the formula images cached by their TeX source.

WeasyPrint runs no JavaScript and does not lay out MathML, so every formula is typeset before
layout. calcpack uses ziamath (pure Python, glyph outlines from the STIX Two Math font, so every
glyph stays a vector path and no font has to be embedded for math). Two layout defects of
ziamath 0.13 are worked around (see DEVELOPERS.md, "Math
in the PDF"):

- a root in a denominator is drawn with its overbar touching the fraction bar, because the
  root's bounding box leaves out the rule's thickness: the box is enlarged by two rule
  thicknesses (:func:`_clear_radical_rule`, applied once when ziamath is first used);
- a superscript on an accented symbol (``\\bar{x}^{2}``) is raised above the accent, unlike TeX
  which attaches it to the nucleus: the script is attached to an empty group after the accent
  (``\\bar{x}{}^{2}``), which puts it at the normal height.

A display formula wider than a step's working column is broken over lines at its relations and
operators (:mod:`calcpack.package.mathbreak`, breaks cached with the formulas), and an image that
still does not fit is scaled to the column, so no formula is drawn past the margin.

Each image is embedded as a ``data:`` URI ``<img>`` (WeasyPrint lays these out several times
faster than inline ``<svg>``), and identical formulas reuse one cached image. The formula's
plain text (:mod:`calcpack.package.mathtext`) is its alternative text and, as invisible text
laid over the image, its part of the PDF's text layer (searchable, copyable).
"""

from __future__ import annotations

import html
import re
import warnings
from collections.abc import Callable
from typing import Any

from calcpack.errors import BuildError
from calcpack.package.mathbreak import break_display, flatten_delimiters
from calcpack.package.mathcache import MATH_PX_PER_EM, MathCache, MathImage
from calcpack.package.mathtext import tex_to_text, text_layer_html

__all__ = [
    "MATH_MAX_WIDTH_PX",
    "MATH_PX_PER_EM",
    "MATH_SPAN_RE",
    "MathCache",
    "MathImage",
    "fitted_image",
    "fix_tex",
    "markdown_math_to_spans",
    "math_spans_to_images",
    "tex_to_svg",
]

MATH_SPAN_RE = re.compile(
    r'<span class="cp-math (?P<kind>cp-math-display|cp-math-inline)(?P<extra>[^"]*)">'
    r"(?P<body>.*?)</span>",
    re.DOTALL,
)
"""A math span as emitted by calcpack.working (TeX HTML-escaped, inside \\[..\\] or \\(..\\))."""

MATH_MAX_WIDTH_PX = 372.0
"""Widest a formula may be, in CSS px: the working column of a step on A4, the narrower paper
(210 mm less 33 mm of page margins, the calc pad's 19 mm reference margin, 25 mm description
and 26 mm output margin, and three 2.2 mm gaps: 100.4 mm = 379 px; assets/calcpack.css), less
a little for rounding. Wider display math is broken over lines, and what still does not fit
is scaled down."""


_ACCENT_SCRIPT_RE = re.compile(
    r"(\\(?:bar|hat|tilde|dot|ddot|vec|check|breve|acute|grave|widehat|widetilde|overline)"
    r"\s*(?:\{(?:[^{}]|\{[^{}]*\})*\}|\\[A-Za-z]+|[A-Za-z0-9]))(\s*)(?=[\^_])"
)


# A minus sign that opens a term: at the start, after an opening bracket, a relation or a
# comma. TeX sets it as a sign (no space after it); ziamath sets it as a binary operator, which
# prints "( − 0.08 kip)". Grouping it as {-} makes it an ordinary symbol, as TeX would.
_SIGN_MINUS_RE = re.compile(
    r"(^|\\left\\?[(\[{|]|(?<!\\)[(\[{]|=|<|>|,|\\[lg]eq?|\\approx)(\s*)-(?!-)"
)


def fix_tex(tex: str) -> str:
    """Rewrite TeX around ziamath's defects: scripts on accents and signs set as operators
    (see the module docstring and ``_SIGN_MINUS_RE``)."""
    tex = _ACCENT_SCRIPT_RE.sub(lambda m: m.group(1) + "{}", tex)
    tex = _SIGN_MINUS_RE.sub(lambda m: m.group(1) + m.group(2) + "{-}", tex)
    return tex


_UNKNOWN_COMMAND_RE = re.compile(r"<m[ion]>(\\[A-Za-z]+)</m[ion]>")
_patched = False


def _clear_radical_rule() -> None:
    """Make ziamath count the radical's rule in the root's height (ziamath 0.13 defect).

    Without it a fraction places its bar on the overbar of a root in the denominator. The
    root's box is grown by two rule thicknesses, which gives the clearance TeX leaves.
    """
    global _patched
    if _patched:
        return
    from ziafont.fonttypes import BBox
    from ziamath.nodes.mroot import Mroot

    original = Mroot._setup

    def setup(self: Any, **kwargs: Any) -> None:
        original(self, **kwargs)
        rule = self.units_to_points(self.font.math.consts.radicalRuleThickness)
        box = self.bbox
        self.bbox = BBox(box.xmin, box.xmax, box.ymin, box.ymax + 2 * rule)

    setup.__wrapped__ = original  # type: ignore[attr-defined]
    Mroot._setup = setup
    _patched = True


def tex_to_svg(
    tex: str,
    *,
    display: bool = False,
    size_px: float = MATH_PX_PER_EM,
    track: bool = True,
    cache: MathCache,
) -> MathImage:
    """Typeset one TeX formula as SVG (cached by TeX source, style and size).

    Args:
        tex: the formula, without delimiters.
        display: display style (limits above/below, full-size fractions) rather than inline.
        size_px: math font size in CSS px.
        track: count the formula as used, so the build keeps it in the disk cache.
        cache: where typeset formulas are kept: the run's own cache (a build's, or one made
            for a single sheet's export); no cache outlives its run.

    Raises:
        BuildError: ziamath cannot typeset the formula (the message quotes the TeX).
    """
    key = (tex, display, float(size_px))
    if track:
        cache.used.add(key)
    hit = cache.images.get(key)
    if hit is None and cache.shared is not None:
        hit = cache.shared.get(key)
    if hit is not None:
        return hit
    with warnings.catch_warnings():
        # ziamath 0.13 loads its font at import with a deprecated importlib.resources call.
        warnings.simplefilter("ignore", DeprecationWarning)
        import ziamath
        from ziamath.tex import tex2mml
    _clear_radical_rule()

    try:
        mathml = tex2mml(fix_tex(tex), inline=not display)
    except Exception as exc:
        raise BuildError(
            f"Formula could not be typeset: {tex!r} ({type(exc).__name__}: {exc})"
        ) from exc
    unknown = _UNKNOWN_COMMAND_RE.search(mathml)
    if unknown:
        # The TeX converter passes unknown commands through as text: refuse rather than print
        # a misspelt command into an issued document.
        raise BuildError(
            f"Formula could not be typeset: {tex!r} (unknown command {unknown.group(1)})"
        )
    try:
        math = ziamath.Math(mathml, size=size_px)
        svg = math.svg()
        width, height = math.getsize()
        offset = float(math.getyofst())
    except Exception as exc:
        raise BuildError(
            f"Formula could not be typeset: {tex!r} ({type(exc).__name__}: {exc})"
        ) from exc
    image = MathImage(tex, svg, float(width), float(height), -offset)
    cache.images[key] = image
    if cache.shared is not None and track:
        cache.shared.put_formula(key, image)
    return image


def _strip_delimiters(body: str) -> tuple[str, bool | None]:
    """TeX without its delimiters (\\[..\\], \\(..\\), $$..$$, $..$); whether they said display."""
    text = body.strip()
    for left, right, display in (
        ("\\[", "\\]", True),
        ("\\(", "\\)", False),
        ("$$", "$$", True),
        ("$", "$", False),
    ):
        if text.startswith(left) and text.endswith(right) and len(text) >= len(left + right):
            return text[len(left) : len(text) - len(right)].strip(), display
    return text, None


def _measurer(cache: MathCache) -> Callable[[str], float]:
    """Width in CSS px of a TeX fragment in display style (for line breaking).

    Fragments are kept in memory only: the disk cache keeps the chosen breaks instead.
    """

    def measure(tex: str) -> float:
        return tex_to_svg(flatten_delimiters(tex), display=True, track=False, cache=cache).width_px

    return measure


_BREAK_MARGIN = 0.94
"""Lines are filled to this share of the width: the sum of the parts' widths that chooses the
breaks comes out a few per cent under the width of the broken formula typeset whole."""


_SURELY_WIDE_TEX = 1000
"""Display TeX longer than this (characters) is always wider than the column: it is broken
straight away, without first typesetting it whole (for long formulas that costs as much as the
broken one)."""


def _line_breaks(key: tuple[str, float], cache: MathCache, *, known_wide: bool) -> str:
    """A wide display formula broken over lines: from the cache, from another worker, or
    worked out now (and shared)."""
    if cache.shared is not None:
        cache.shared.take()
    broken = cache.breaks.get(key)
    if broken is None:
        tex, width_px = key
        measure = _measurer(cache)
        margin = width_px * _BREAK_MARGIN
        broken = break_display(tex, margin, measure, known_wide=known_wide)
        for _ in range(3):  # the parts' widths under-estimate the whole: fill less and try again
            if broken == tex or tex_to_svg(broken, display=True, cache=cache).width_px <= width_px:
                break
            margin *= _BREAK_MARGIN
            broken = break_display(tex, margin, measure, known_wide=True)
        cache.breaks[key] = broken
        if cache.shared is not None:
            cache.shared.put_break(key, broken)
    return broken


def fitted_image(
    tex: str,
    display: bool,
    width_px: float = MATH_MAX_WIDTH_PX,
    *,
    cache: MathCache,
) -> MathImage:
    """The formula's image, broken over lines if display math is wider than ``width_px``.

    What still does not fit (one very long term, wide inline math) is left to :func:`_img`,
    which scales the image down to the column. ``cache`` as :func:`tex_to_svg`.
    """
    key = (tex, float(width_px))
    broken = cache.breaks.get(key) if display else None
    if broken is None and display and len(tex) > _SURELY_WIDE_TEX:
        broken = _line_breaks(key, cache, known_wide=True)
    if broken is not None and broken != tex:
        return tex_to_svg(broken, display=True, cache=cache)
    image = tex_to_svg(tex, display=display, cache=cache)
    if display and broken is None and image.width_px > width_px:
        broken = _line_breaks(key, cache, known_wide=False)
        if broken != tex:
            image = tex_to_svg(broken, display=True, cache=cache)
    return image


def _img(tex: str, display: bool, cache: MathCache) -> str:
    image = fitted_image(tex, display, cache=cache)
    # Never past the margin: an image still too wide is scaled, baseline and all.
    scale = min(1.0, MATH_MAX_WIDTH_PX / image.width_px) if image.width_px else 1.0
    style = (
        f"width:{image.width_px * scale:.2f}px;height:{image.height_px * scale:.2f}px;"
        f"vertical-align:{-image.baseline_px * scale:.2f}px"
    )
    kind = "cp-math-display" if display else "cp-math-inline"
    words = tex_to_text(tex)
    return text_layer_html(words, image.width_px * scale) + (
        f'<img class="cp-math-img {kind}" alt="{html.escape(words, quote=True)}" '
        f'style="{style}" src="{image.data_uri()}">'
    )


def math_spans_to_images(markup: str, cache: MathCache) -> str:
    """Replace every calcpack math span in HTML by its SVG image and invisible plain text.

    ``cache`` keeps the typeset formulas (the run's own, as :func:`tex_to_svg`).

    Raises:
        BuildError: a formula cannot be typeset.
    """

    def replace(m: re.Match[str]) -> str:
        tex, said_display = _strip_delimiters(html.unescape(m.group("body")))
        display = m.group("kind") == "cp-math-display" if said_display is None else said_display
        if not tex:
            return ""
        image = _img(tex, display, cache)
        return f'<span class="cp-math {m.group("kind")}{m.group("extra")}">{image}</span>'

    return MATH_SPAN_RE.sub(replace, markup)


_SKIP_RE = re.compile(r"(<pre\b.*?</pre>|<code\b.*?</code>|<[^>]+>)", re.DOTALL)
_DISPLAY_DOLLAR_RE = re.compile(r"\$\$(.+?)\$\$", re.DOTALL)
# Inline $..$ as in common Markdown math: no space just inside the dollars, no digit just after
# the closing one (so "costs $5 and $6" stays text).
_INLINE_DOLLAR_RE = re.compile(r"(?<![\\$])\$(?=\S)((?:[^$\\]|\\.)+?)(?<=\S)\$(?![$\d])")


def markdown_math_to_spans(markup: str) -> str:
    """Wrap ``$$..$$`` and ``$..$`` math in HTML rendered from markdown into calcpack math spans.

    Text inside ``<pre>`` and ``<code>`` is left alone; the TeX stays HTML-escaped as the
    contract for math spans requires.
    """

    def spans(text: str) -> str:
        text = _DISPLAY_DOLLAR_RE.sub(
            lambda m: f'<span class="cp-math cp-math-display">\\[{m.group(1).strip()}\\]</span>',
            text,
        )
        return _INLINE_DOLLAR_RE.sub(
            lambda m: f'<span class="cp-math cp-math-inline">\\({m.group(1)}\\)</span>', text
        )

    # Join text runs between tags so that math spanning inline markup boundaries is rare; math
    # inside tags' attributes is never touched.
    parts = _SKIP_RE.split(markup)
    out = []
    buffer = ""
    for part in parts:
        if _SKIP_RE.fullmatch(part or " ") and part:
            out.append(spans(buffer))
            buffer = ""
            out.append(part)
        else:
            buffer += part
    out.append(spans(buffer))
    return "".join(out)
