"""The words of a formula, for the PDF's text layer and the formula's alternative text.

Formulas are drawn as vector outlines (:mod:`calcpack.package.mathsvg`), which a reader can
neither search nor copy and a screen reader cannot read. Each formula therefore also carries
its plain-text form:

- as the image's alternative text (``/Alt`` of its ``Figure`` in the tagged PDF);
- as invisible text laid over the image (:func:`text_layer_html`): transparent glyphs of a
  monospaced font, sized so that the line spans the image's width, so that a search finds the
  formula's symbols and values and a selection over the image copies them.

The plain text follows what the PDF's typeset prose gives a reader who copies it: a subscript
runs on after its symbol (``M_{\\mathrm{max}}`` is "Mmax", as ``M<sub>max</sub>`` copies),
small integer powers are superscript digits ("L²"), a fraction is "a/b" with parentheses
around a compound part, a root "√(…)", a product "·", relations spaced (" = ", " ≤ "). It is
read from the MathML that ziamath's TeX converter makes, so it covers the TeX the formulas are
typeset from.
"""

from __future__ import annotations

import functools
import html
import re
import xml.etree.ElementTree as ET

__all__ = ["MONO_ADVANCE_EM", "tex_to_text", "text_layer_html"]

MONO_ADVANCE_EM = 0.602
"""Advance of every glyph of DejaVu Sans Mono, in em (1233 of 2048 font units): the invisible
text is set in it, so its width is known before layout."""

_NS = "{http://www.w3.org/1998/Math/MathML}"
_RELATIONS = set("=<>≤≥≈≠≡∝→⇒∼≃≅⩽⩾")
_SPACED = _RELATIONS | set("+−±∓×")
_SUPERSCRIPTS = str.maketrans("0123456789-−+()", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁻⁺⁽⁾")
_COMPOUND = re.compile(r"[\s+−±/·×=<>≤≥-]")


def _tag(element: ET.Element) -> str:
    return element.tag.replace(_NS, "")


def _group(text: str) -> str:
    """A fraction's part or a root's radicand, in parentheses when it is compound."""
    text = text.strip()
    if _COMPOUND.search(text) and not (text.startswith("(") and text.endswith(")")):
        return f"({text})"
    return text


def _superscript(base: str, script: str) -> str:
    tight = re.sub(r"\s+", "", script)
    if re.fullmatch(r"[-−]?\d+", tight):
        return base + tight.translate(_SUPERSCRIPTS)
    if script in ("*", "′", "″", "'", "∗"):
        return base + script
    return f"{base}^{_group(script)}"


_MARK_WORDS = {"star": "*", "prime": "′"}
"""Words a symbol's subscript may carry for a mark (``F_{c,\\mathrm{star}}``), written as the
mark after the symbol, as the typeset prose writes them (working/render.py)."""


def _subscripted(base: str, subscript: str) -> str:
    """A symbol with its subscript run on; mark words become marks, "perp" becomes ⊥."""
    parts, marks = [], ""
    for part in subscript.split(","):
        word = part.strip()
        if word in _MARK_WORDS:
            marks += _MARK_WORDS[word]
        elif word.endswith("perp"):
            parts.append(word[:-4] + "⊥")
        else:
            parts.append(part)
    return base + ",".join(parts) + marks


def _words(element: ET.Element) -> str:
    tag = _tag(element)
    kids = list(element)
    if tag in ("mi", "mn", "mtext", "ms"):
        return (element.text or "").replace("\u00a0", " ")
    if tag == "mo":
        symbol = (element.text or "").strip()
        symbol = {"-": "−", "⋅": "·", "\u2061": ""}.get(symbol, symbol)
        return f" {symbol} " if symbol in _SPACED else symbol
    if tag == "mspace":
        return " "
    if tag in ("mphantom", "annotation", "annotation-xml"):
        return ""
    if tag == "mfrac" and len(kids) == 2:
        return f"{_group(_words(kids[0]))}/{_group(_words(kids[1]))}"
    if tag == "msqrt":
        radicand = "".join(_words(k) for k in kids).strip()
        whole = len(radicand) == 1 or (radicand.startswith("(") and radicand.endswith(")"))
        return "√" + (radicand if whole else f"({radicand})")
    if tag == "mroot" and len(kids) == 2:
        return f"{_words(kids[1])}√{_group(_words(kids[0]))}"
    if tag == "msub" and len(kids) == 2:
        return _subscripted(_words(kids[0]), _words(kids[1]).strip())
    if tag in ("munder", "munderover") and len(kids) >= 2:  # a sum or integral with limits
        limits = "…".join(_words(k).strip() for k in kids[1:])
        return f"{_words(kids[0]).strip()}[{limits}] "
    if tag == "msup" and len(kids) == 2:
        return _superscript(_words(kids[0]), _words(kids[1]).strip())
    if tag == "msubsup" and len(kids) == 3:
        symbol = _subscripted(_words(kids[0]), _words(kids[1]).strip())
        return _superscript(symbol, _words(kids[2]).strip())
    if tag == "mover" and len(kids) == 2:
        accent = _words(kids[1]).strip()
        marks = {"¯": "\u0304", "‾": "\u0305", "^": "\u0302", "~": "\u0303", "˙": "\u0307"}
        return _words(kids[0]) + marks.get(accent, accent)
    if tag == "mtable":
        return "; ".join(_words(row).strip() for row in kids)
    if tag in ("mtr", "mlabeledtr"):
        return "".join(_words(cell) for cell in kids)
    return "".join(_words(k) for k in kids)


@functools.lru_cache(maxsize=4096)
def tex_to_text(tex: str) -> str:
    """The plain-text form of a TeX formula (see the module docstring).

    Args:
        tex: the formula's TeX, without delimiters (as typeset).

    Returns:
        One line of text, spaces collapsed; the TeX itself if it cannot be read (the typesetter
        refuses such TeX with its own message).
    """
    from ziamath.tex import tex2mml

    try:
        root = ET.fromstring(tex2mml(tex))
    except Exception:  # the typesetter refuses bad TeX with its own message; this stays readable
        return " ".join(tex.split())
    text = _words(root)
    text = re.sub(r"\s+", " ", text).strip()
    # a sign after an opening bracket or a relation is not a binary operator
    text = re.sub(r"([(\[=≤≥<>]) ([−+]) ", r"\1 \2", text).replace("( −", "(−")
    return text.replace("( ", "(").replace(" )", ")")


def text_layer_html(text: str, width_px: float, *, body_px: float = 12.7) -> str:
    """Invisible text over a formula image ``width_px`` wide: put it just before the image.

    The element takes no width in the line (so the image stays where it was) and its text,
    set on the line's baseline, runs over the image. Its font size makes the text as wide as
    the image, but never larger than the body text (``body_px``).
    """
    if not text:
        return ""
    size = min(body_px, width_px / (MONO_ADVANCE_EM * len(text)))
    return f'<span class="cp-math-text" style="font-size:{size:.3f}px">{html.escape(text)}</span>'
