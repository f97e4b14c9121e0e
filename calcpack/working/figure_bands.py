"""A figure of panels stacked one above another (the beam's loading, shear, moment and deflection
diagrams) cut into one image per panel, so that a page may break between panels rather than
leave a blank the height of the whole figure.

The figures are SVG as matplotlib writes it: one ``<g id="axes_N">`` group per panel, its frame
the group's first path, its words either ``<text>`` elements or glyphs placed by
``translate(x y) scale(s -s)`` (``s`` × 100 is the font size in points). Two panels are cut
apart only where nothing of either is drawn in the gap between their frames (tick marks, tick
labels, titles measured from the SVG); each band keeps the whole drawing's definitions and its
own panel's group, and is shown at the figure's width, so the bands laid end to end are the
figure. Anything else (one panel, side-by-side panels, a gap with words in it) stays one image.
Standard library only: the working layer never imports a plotting library.
"""

from __future__ import annotations

import itertools
import re
from dataclasses import dataclass

__all__ = ["Band", "panel_bands"]

TICK = 4.0
"""Room (pt) for tick marks outside a panel's frame (matplotlib's 3.5 pt major ticks)."""
ASCENT, DESCENT = 0.8, 0.25
"""Share of the font size a glyph reaches above and below its baseline (DejaVu Sans)."""

_AXES_RE = re.compile(r'<g id="axes_\d+">')
_ROOT_RE = re.compile(
    r'<svg\b[^>]*?\bwidth="(?P<w>[\d.]+)pt"\s+height="(?P<h>[\d.]+)pt"\s+'
    r'viewBox="0 0 (?P<vw>[\d.]+) (?P<vh>[\d.]+)"'
)
_FRAME_RE = re.compile(r'<path d="M ([\d.]+) ([\d.]+)\s*L ([\d.]+) ([\d.]+)\s*L ([\d.]+) ([\d.]+)')
_GLYPHS_RE = re.compile(
    r'transform="translate\(([-\d.]+) ([-\d.]+)\)(?P<rot> rotate\([^)]*\))? scale\(([\d.]+) -'
)
_TEXT_RE = re.compile(r'<text\b[^>]*?\by="([-\d.]+)"[^>]*?font:\s*(?:[a-z]+\s+)*([\d.]+)px')
_PATH_Y_RE = re.compile(r"[ML] [-\d.]+ ([-\d.]+)")


@dataclass(frozen=True)
class Band:
    """One panel's band of the figure: its SVG and its height as a share of the figure's."""

    svg: str
    share: float


def _group_end(svg: str, start: int) -> int:
    """The end of the ``<g>`` element opened at ``start`` (nested groups counted)."""
    depth = 0
    for m in re.finditer(r"<g\b[^>]*?(/?)>|</g>", svg[start:]):
        if m.group(0) == "</g>":
            depth -= 1
            if depth == 0:
                return start + m.end()
        elif not m.group(1):
            depth += 1
    return len(svg)


def _extent(group: str) -> tuple[float, float] | None:
    """Top and bottom (pt, y down) of what a panel's group draws outside its clipped data:
    its frame with room for ticks, and its words."""
    frame = _FRAME_RE.search(group)
    if frame is None:
        return None
    ys = [float(frame.group(2)), float(frame.group(4)), float(frame.group(6))]
    top, bottom = min(ys) - TICK, max(ys) + TICK
    for m in _GLYPHS_RE.finditer(group):
        if m.group("rot"):  # an axis label set upright runs along the frame, not across a gap
            continue
        y, size = float(m.group(2)), float(m.group(4)) * 100
        top, bottom = min(top, y - ASCENT * size), max(bottom, y + DESCENT * size)
    for m in _TEXT_RE.finditer(group):
        y, size = float(m.group(1)), float(m.group(2)) * 0.75  # px to pt
        top, bottom = min(top, y - ASCENT * size), max(bottom, y + DESCENT * size)
    return top, bottom


def panel_bands(svg: str) -> list[Band]:
    """The figure cut between its stacked panels; ``[]`` when it is not to be cut (one panel,
    panels side by side or overlapping, or words in a gap)."""
    root = _ROOT_RE.search(svg)
    starts = [m.start() for m in _AXES_RE.finditer(svg)]
    if root is None or len(starts) < 2 or root.group("h") != root.group("vh"):
        return []
    width, height = float(root.group("vw")), float(root.group("vh"))
    groups = [(s, _group_end(svg, s)) for s in starts]
    extents = [_extent(svg[s:e]) for s, e in groups]
    if any(x is None for x in extents):
        return []
    spans = [x for x in extents if x is not None]
    cuts = [0.0]
    for (_, above), (below, _) in itertools.pairwise(spans):
        if above >= below:  # side by side, or touching: no clean cut
            return []
        cuts.append((above + below) / 2)
    cuts.append(height)
    bands = []
    for i, (top, bottom) in enumerate(itertools.pairwise(cuts)):
        others = [g for j, g in enumerate(groups) if j != i]
        body = svg
        for s, e in sorted(others, reverse=True):
            # a panel's words may define glyphs the others use: its definitions stay
            defs = "".join(re.findall(r"<defs>.*?</defs>", body[s:e], re.DOTALL))
            body = body[:s] + defs + body[e:]
        h = bottom - top
        found = _ROOT_RE.search(body)  # the root precedes every panel group
        if found is None:
            return []
        sized = f'width="{width:g}pt" height="{h:.3f}pt" viewBox="0 {top:.3f} {width:g} {h:.3f}"'
        body = body[: found.start("w") - len('width="')] + sized + body[found.end("vh") + 1 :]
        bands.append(Band(body, h / height))
    return bands
