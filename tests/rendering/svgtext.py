"""Text boxes read back from an SVG figure whose text is kept as text (``<text>`` elements).

Widths are measured with the glyph outlines of the font the SVG names (DejaVu Sans, through
matplotlib's TextPath, which reads the font file, not the figure); the height is the font's em
box from 0.8 em above the baseline to 0.25 em below it.
"""

from __future__ import annotations

import re
import xml.etree.ElementTree as ET
from dataclasses import dataclass

from matplotlib.font_manager import FontProperties
from matplotlib.textpath import TextPath

_NS = "{http://www.w3.org/2000/svg}"


@dataclass(frozen=True)
class TextBox:
    text: str
    group: str  # id of the enclosing group
    ancestors: tuple[str, ...]  # ids of every enclosing group, innermost first
    x0: float
    y0: float
    x1: float
    y1: float

    def overlaps(self, other: TextBox, pad: float = 0.3) -> bool:
        return not (
            self.x1 - pad <= other.x0
            or other.x1 - pad <= self.x0
            or self.y1 - pad <= other.y0
            or other.y1 - pad <= self.y0
        )


def text_boxes(svg: str) -> list[TextBox]:
    """Every horizontal ``<text>`` of ``svg`` with its box (SVG user units, y down) and the id
    of its enclosing group."""
    root = ET.fromstring(svg)
    parent: dict[ET.Element, ET.Element] = {c: p for p in root.iter() for c in p}
    boxes = []
    prop = FontProperties(family="DejaVu Sans")
    for el in root.iter(f"{_NS}text"):
        style = el.get("style", "")
        transform = el.get("transform", "")
        angle = re.search(r"rotate\((-?[\d.]+)", transform)
        if angle and abs(float(angle.group(1))) > 1e-6:
            continue  # rotated axis titles sit outside the panels
        size = float(re.search(r"font-size:\s*([\d.]+)px", style).group(1))  # type: ignore[union-attr]
        anchor = re.search(r"text-anchor:\s*(\w+)", style)
        text = "".join(el.itertext())
        x, y = float(el.get("x", "0")), float(el.get("y", "0"))
        shift = re.search(r"translate\((-?[\d.]+)[ ,]+(-?[\d.]+)\)", transform)
        if shift:  # lines of a multi-line text are placed by a translation
            x, y = x + float(shift.group(1)), y + float(shift.group(2))
        width = TextPath((0, 0), text, size=size, prop=prop).get_extents().width
        start = {"start": x, "middle": x - width / 2, "end": x - width}[
            anchor.group(1) if anchor else "start"
        ]
        ids = []
        node = parent.get(el)
        while node is not None:
            ids.append(node.get("id", ""))
            node = parent.get(node)
        boxes.append(
            TextBox(text, ids[0], tuple(ids), start, y - 0.8 * size, start + width, y + 0.25 * size)
        )
    return boxes
