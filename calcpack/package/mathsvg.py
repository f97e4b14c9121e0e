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

import base64
import html
import json
import os
import re
import warnings
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError
from calcpack.package.mathbreak import break_display, flatten_delimiters
from calcpack.package.mathtext import tex_to_text, text_layer_html

__all__ = [
    "MATH_SPAN_RE",
    "MathImage",
    "add_break_entries",
    "add_cache_entries",
    "break_entries",
    "cache_entries",
    "fitted_image",
    "fix_tex",
    "forget_shared_images",
    "known_keys",
    "load_math_cache",
    "markdown_math_to_spans",
    "math_spans_to_images",
    "save_math_cache",
    "share_formulas",
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

MATH_MAX_WIDTH_PX = 412.0
"""Widest a formula may be, in CSS px: the working column of a step on A4, the narrower paper
(210 mm less 33 mm of margins, the 31 mm description and 29 mm reference columns and two 3 mm
gaps: 111 mm = 419.5 px), less a little for rounding. Wider display math is broken over lines,
and what still does not fit is scaled down."""


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


_cache: dict[tuple[str, bool, float], MathImage] = {}
_breaks: dict[tuple[str, float], str] = {}
"""Display formulas too wide for the column: (TeX, width px) -> the TeX broken over lines."""


_CACHE_FORMAT = "calcpack-math-cache/3"  # 2: signs after brackets set tight; 3: sealed


def load_math_cache(path: Path) -> int:
    """Read typeset formulas saved by an earlier build into the in-memory cache; returns count.

    The file is a sealed cache entry (:mod:`calcpack.package.cache`): a missing one is a miss;
    one that fails its check (an edited or swapped image, a truncated file) is discarded with
    a warning and every formula is typeset again.
    """
    from calcpack.package.cache import discard, read_entry

    content = read_entry(path, _CACHE_FORMAT, what="formula images")
    if content is None:
        return 0
    try:
        data = json.loads(content)
    except ValueError as exc:
        discard(path, "formula images", f"not readable ({exc})")
        return 0
    if not isinstance(data, dict) or data.get("format") != _CACHE_FORMAT:
        return 0
    add_break_entries(data.get("breaks", []))
    return add_cache_entries(data.get("formulas", []), mark_used=False)


def add_cache_entries(items: list[Any], *, mark_used: bool = True) -> int:
    """Add formulas in the saved form (see :func:`cache_entries`) to the in-memory cache.

    Used to read the cache file and to take the formulas a worker process typeset; with
    ``mark_used`` they count as used by this build (and are saved). Returns the count added.
    """
    added = 0
    for item in items:
        try:
            tex, display, size, svg, width, height, baseline = item
            key = (str(tex), bool(display), float(size))
            _cache.setdefault(
                key, MathImage(key[0], str(svg), float(width), float(height), float(baseline))
            )
        except (TypeError, ValueError):
            continue
        if mark_used:
            used_keys.add(key)
        added += 1
    return added


def add_break_entries(items: list[Any]) -> int:
    """Add line breaks of wide formulas in the saved form (see :func:`break_entries`)."""
    added = 0
    for item in items:
        try:
            tex, width, broken = item
            _breaks.setdefault((str(tex), float(width)), str(broken))
        except (TypeError, ValueError):
            continue
        added += 1
    return added


def known_keys() -> set[tuple[str, bool, float]]:
    """The keys of every formula in the in-memory cache."""
    return set(_cache)


def cache_entries(used: set[tuple[str, bool, float]] | None = None) -> list[list[Any]]:
    """The in-memory formulas (only ``used`` keys when given) in the saved form, sorted."""
    return [
        [k[0], k[1], k[2], v.svg, v.width_px, v.height_px, v.baseline_px]
        for k, v in sorted(_cache.items())
        if used is None or k in used
    ]


def break_entries(used: set[tuple[str, bool, float]] | None = None) -> list[list[Any]]:
    """The line breaks of wide formulas in the saved form, sorted.

    A break is kept while the formula it produced is used (its fragments are not kept at all).
    """
    return [
        [tex, width, broken]
        for (tex, width), broken in sorted(_breaks.items())
        if used is None or (broken, True, MATH_PX_PER_EM) in used
    ]


def save_math_cache(path: Path, used: set[tuple[str, bool, float]] | None = None) -> None:
    """Write the in-memory formula cache (only ``used`` keys when given) to ``path``."""
    items = cache_entries(used)
    breaks = break_entries(used)
    data = {"format": _CACHE_FORMAT, "formulas": items, "breaks": breaks}
    from calcpack.package.cache import write_entry

    write_entry(path, _CACHE_FORMAT, json.dumps(data).encode("utf-8"))


used_keys: set[tuple[str, bool, float]] = set()
"""Keys looked up since the process started (the build saves only these)."""


class _SharedFormulas:
    """Formulas typeset by the build's other worker processes, while the build runs.

    Sheets of one package share many formulas (the same check on several members), and each
    worker would otherwise typeset every one of them again. Each worker appends what it
    typesets to its own file in a shared folder, one JSON line per formula or line break, and
    reads the other workers' files (from where it stopped last time) before typesetting one.
    A line still being written is left for the next read. Of a formula only where its line is
    is kept until it is wanted, so a worker does not hold every other worker's images; and
    once a sheet is done a worker lets go of the images in the files, its own included
    (:func:`forget_shared_images`).
    """

    def __init__(self, folder: Path) -> None:
        self.folder = folder
        folder.mkdir(parents=True, exist_ok=True)
        self.own = folder / f"{os.getpid()}.jsonl"
        self._out = self.own.open("ab")
        self._size = self._out.tell()
        self._read: dict[Path, int] = {}
        self._where: dict[tuple[str, bool, float], tuple[Path, int, int]] = {}
        self.taken: set[tuple[str, bool, float]] = set()
        """Formulas taken from the other workers (they report them to the build)."""

    def put_formula(self, key: tuple[str, bool, float], image: MathImage) -> None:
        line = ["f", *key, image.svg, image.width_px, image.height_px, image.baseline_px]
        start, length = self._write(line)
        self._where.setdefault(key, (self.own, start, length))

    def put_break(self, key: tuple[str, float], broken: str) -> None:
        self._write(["b", *key, broken])

    def _write(self, line: list[Any]) -> tuple[int, int]:
        data = (json.dumps(line) + "\n").encode()
        start = self._size
        self._out.write(data)
        self._out.flush()
        self._size += len(data)
        return start, len(data)

    def holds(self, key: tuple[str, bool, float]) -> bool:
        """Whether the shared files hold this formula (so its image can be read again)."""
        return key in self._where

    def get(self, key: tuple[str, bool, float]) -> MathImage | None:
        """The formula if another worker typeset it (its image is read now)."""
        self.take()
        where = self._where.get(key)
        if where is None:
            return None
        path, start, length = where
        try:
            with path.open("rb") as handle:
                handle.seek(start)
                _, *item = json.loads(handle.read(length))
        except (OSError, ValueError):
            return None
        if not add_cache_entries([item], mark_used=False):
            return None
        if path != self.own:
            self.taken.add(key)
        return _cache.get(key)

    def take(self) -> None:
        """Index what the other workers added since the last call (line breaks are taken)."""
        for path in self.folder.glob("*.jsonl"):
            if path == self.own:
                continue
            start = self._read.get(path, 0)
            try:
                if path.stat().st_size <= start:
                    continue
                with path.open("rb") as handle:
                    handle.seek(start)
                    data = handle.read()
            except OSError:
                continue
            end = data.rfind(b"\n") + 1
            self._read[path] = start + end
            position = start
            for raw in data[:end].splitlines(keepends=True):
                try:
                    kind, *item = json.loads(raw)
                    if kind == "f":
                        key = (str(item[0]), bool(item[1]), float(item[2]))
                        self._where.setdefault(key, (path, position, len(raw)))
                    elif kind == "b":
                        add_break_entries([item])
                except (ValueError, TypeError, IndexError):
                    pass
                position += len(raw)


_shared: _SharedFormulas | None = None


def forget_shared_images() -> int:
    """In a worker sharing formulas: drop the images the shared files hold from memory (they
    are read back if a later sheet wants them). Returns how many were dropped."""
    if _shared is None:
        return 0
    held = [key for key in _cache if _shared.holds(key)]
    for key in held:
        del _cache[key]
    return len(held)


def share_formulas(folder: Path) -> set[tuple[str, bool, float]]:
    """In a worker process: share typeset formulas with the build's other workers through
    ``folder`` (see :class:`_SharedFormulas`). Returns the set, kept up to date, of formulas
    taken from the others. Calling it again with the same folder changes nothing."""
    global _shared
    if _shared is None or _shared.folder != folder:
        _shared = _SharedFormulas(folder)
    return _shared.taken


def tex_to_svg(
    tex: str, *, display: bool = False, size_px: float = MATH_PX_PER_EM, track: bool = True
) -> MathImage:
    """Typeset one TeX formula as SVG (cached by TeX source, style and size).

    Args:
        tex: the formula, without delimiters.
        display: display style (limits above/below, full-size fractions) rather than inline.
        size_px: math font size in CSS px.
        track: count the formula as used, so the build keeps it in the disk cache.

    Raises:
        BuildError: ziamath cannot typeset the formula (the message quotes the TeX).
    """
    key = (tex, display, float(size_px))
    if track:
        used_keys.add(key)
    hit = _cache.get(key)
    if hit is None and _shared is not None:
        hit = _shared.get(key)
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
    _cache[key] = image
    if _shared is not None and track:
        _shared.put_formula(key, image)
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


def _measure(tex: str) -> float:
    """Width in CSS px of a TeX fragment in display style (for line breaking).

    Fragments are kept in memory only: the disk cache keeps the chosen breaks instead.
    """
    return tex_to_svg(flatten_delimiters(tex), display=True, track=False).width_px


_BREAK_MARGIN = 0.94
"""Lines are filled to this share of the width: the sum of the parts' widths that chooses the
breaks comes out a few per cent under the width of the broken formula typeset whole."""


_SURELY_WIDE_TEX = 1000
"""Display TeX longer than this (characters) is always wider than the column: it is broken
straight away, without first typesetting it whole (for long formulas that costs as much as the
broken one)."""


def _line_breaks(key: tuple[str, float], *, known_wide: bool) -> str:
    """A wide display formula broken over lines: from the cache, from another worker, or
    worked out now (and shared)."""
    if _shared is not None:
        _shared.take()
    broken = _breaks.get(key)
    if broken is None:
        tex, width_px = key
        broken = break_display(tex, width_px * _BREAK_MARGIN, _measure, known_wide=known_wide)
        _breaks[key] = broken
        if _shared is not None:
            _shared.put_break(key, broken)
    return broken


def fitted_image(tex: str, display: bool, width_px: float = MATH_MAX_WIDTH_PX) -> MathImage:
    """The formula's image, broken over lines if display math is wider than ``width_px``.

    What still does not fit (one very long term, wide inline math) is left to :func:`_img`,
    which scales the image down to the column.
    """
    key = (tex, float(width_px))
    broken = _breaks.get(key) if display else None
    if broken is None and display and len(tex) > _SURELY_WIDE_TEX:
        broken = _line_breaks(key, known_wide=True)
    if broken is not None and broken != tex:
        return tex_to_svg(broken, display=True)
    image = tex_to_svg(tex, display=display)
    if display and broken is None and image.width_px > width_px:
        broken = _line_breaks(key, known_wide=False)
        if broken != tex:
            image = tex_to_svg(broken, display=True)
    return image


def _img(tex: str, display: bool) -> str:
    image = fitted_image(tex, display)
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


def math_spans_to_images(markup: str) -> str:
    """Replace every calcpack math span in HTML by its SVG image and invisible plain text.

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
