"""TeX to vector SVG for the PDF, with the formula images cached by their TeX source.

WeasyPrint runs no JavaScript and does not lay out MathML, so every formula is typeset before
layout. calcpack uses ziamath (pure Python, glyph outlines from the STIX Two Math font, so every
glyph stays a vector path and no font has to be embedded for math). Two layout defects of
ziamath 0.13 are worked around by rewriting the TeX before typesetting (see DEVELOPERS.md, "Math
in the PDF"):

- a root in a denominator is drawn with its overbar touching the fraction bar: an empty
  superscript group ``{}^{}`` is put in front of the root, which gives the denominator the
  clearance of a script and keeps the bar clear of the radical;
- a superscript on an accented symbol (``\\bar{x}^{2}``) is raised above the accent, unlike TeX
  which attaches it to the nucleus: the script is attached to an empty group after the accent
  (``\\bar{x}{}^{2}``), which puts it at the normal height.

Each image is embedded as a ``data:`` URI ``<img>`` (WeasyPrint lays these out several times
faster than inline ``<svg>``), its alternative text is the TeX source, and identical formulas
reuse one cached image.
"""

from __future__ import annotations

import base64
import html
import re
import warnings
from dataclasses import dataclass

from calcpack.errors import BuildError

__all__ = [
    "MATH_SPAN_RE",
    "MathImage",
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

MATH_PX_PER_EM = 13.5
"""Math font size in CSS px (body text is 9.5 pt = 12.7 px; math is set a little larger)."""


@dataclass(frozen=True)
class MathImage:
    """A typeset formula: SVG text, its size in CSS px and the baseline offset from its bottom."""

    tex: str
    svg: str
    width_px: float
    height_px: float
    baseline_px: float
    """Distance from the image bottom up to the math baseline (>= 0), for vertical-align."""

    def data_uri(self) -> str:
        """The SVG as a base64 ``data:`` URI."""
        return "data:image/svg+xml;base64," + base64.b64encode(self.svg.encode()).decode()


_ACCENT_SCRIPT_RE = re.compile(
    r"(\\(?:bar|hat|tilde|dot|ddot|vec|check|breve|acute|grave|widehat|widetilde|overline)"
    r"\s*(?:\{(?:[^{}]|\{[^{}]*\})*\}|\\[A-Za-z]+|[A-Za-z0-9]))(\s*)(?=[\^_])"
)
_FRAC_RE = re.compile(r"\\[dt]?frac\s*")


def _group_end(tex: str, start: int) -> int:
    """Index just after the brace group (or single token) starting at ``start``."""
    if start >= len(tex):
        return start
    if tex[start] != "{":
        if tex[start] == "\\":
            m = re.match(r"\\[A-Za-z]+|\\.", tex[start:])
            return start + (m.end() if m else 1)
        return start + 1
    depth = 0
    for i in range(start, len(tex)):
        ch = tex[i]
        if ch == "\\":
            continue
        if ch == "{" and (i == 0 or tex[i - 1] != "\\"):
            depth += 1
        elif ch == "}" and tex[i - 1] != "\\":
            depth -= 1
            if depth == 0:
                return i + 1
    return len(tex)


def fix_tex(tex: str) -> str:
    """Rewrite TeX around ziamath's known layout defects (see the module docstring)."""
    tex = _ACCENT_SCRIPT_RE.sub(lambda m: m.group(1) + "{}", tex)
    out: list[str] = []
    pos = 0
    for m in _FRAC_RE.finditer(tex):
        if m.start() < pos:
            continue
        num_start = m.end()
        num_end = _group_end(tex, num_start)
        den_start = num_end
        while den_start < len(tex) and tex[den_start].isspace():
            den_start += 1
        den_end = _group_end(tex, den_start)
        denominator = tex[den_start:den_end]
        if (
            "\\sqrt" in denominator
            and denominator.startswith("{")
            and not denominator.startswith("{{}^{}")
        ):
            out.append(tex[pos:den_start])
            out.append("{{}^{}" + denominator[1:])
            pos = den_end
    out.append(tex[pos:])
    return "".join(out)


_UNKNOWN_COMMAND_RE = re.compile(r"<m[ion]>(\\[A-Za-z]+)</m[ion]>")
_cache: dict[tuple[str, bool, float], MathImage] = {}


def tex_to_svg(tex: str, *, display: bool = False, size_px: float = MATH_PX_PER_EM) -> MathImage:
    """Typeset one TeX formula as SVG (cached by TeX source, style and size).

    Args:
        tex: the formula, without delimiters.
        display: display style (limits above/below, full-size fractions) rather than inline.
        size_px: math font size in CSS px.

    Raises:
        BuildError: ziamath cannot typeset the formula (the message quotes the TeX).
    """
    key = (tex, display, size_px)
    hit = _cache.get(key)
    if hit is not None:
        return hit
    with warnings.catch_warnings():
        # ziamath 0.13 loads its font at import with a deprecated importlib.resources call.
        warnings.simplefilter("ignore", DeprecationWarning)
        import ziamath
        from ziamath.tex import tex2mml

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
    _cache[key] = image
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


def _img(tex: str, display: bool) -> str:
    image = tex_to_svg(tex, display=display)
    style = (
        f"width:{image.width_px:.2f}px;height:{image.height_px:.2f}px;"
        f"vertical-align:{-image.baseline_px:.2f}px"
    )
    kind = "cp-math-display" if display else "cp-math-inline"
    return (
        f'<img class="cp-math-img {kind}" alt="{html.escape(tex, quote=True)}" '
        f'style="{style}" src="{image.data_uri()}">'
    )


def math_spans_to_images(markup: str) -> str:
    """Replace every calcpack math span in HTML by its SVG image (alt text = the TeX).

    Raises:
        BuildError: a formula cannot be typeset.
    """

    def replace(m: re.Match[str]) -> str:
        tex, said_display = _strip_delimiters(html.unescape(m.group("body")))
        display = m.group("kind") == "cp-math-display" if said_display is None else said_display
        if not tex:
            return ""
        return (
            f'<span class="cp-math {m.group("kind")}{m.group("extra")}">{_img(tex, display)}</span>'
        )

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
