"""Where things are drawn on a PDF page, read back from the PDF (for the layout tests).

``painted_extent`` follows a page's content stream with pypdf: the current transformation
matrix through ``q``/``Q``/``cm``, the points of every path that is painted (filled or stroked;
a path used only as a clip is not), and the box of every XObject drawn with ``Do`` (a form's
``/BBox`` through its ``/Matrix``, an image's unit square), each cut by the clipping path in
force (``W``/``W*``, kept with the graphics state; its bounding box), so a fill clipped to a box —
a repeated background painted over the whole page and shown only inside its element — counts
for what shows. Typeset math is drawn as filled glyph outlines, so a formula past the margin
shows as ink past the margin.
"""

from __future__ import annotations

import shutil
import subprocess
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from pypdf import PdfReader
from pypdf.generic import ContentStream

Matrix = tuple[float, float, float, float, float, float]
IDENTITY: Matrix = (1.0, 0.0, 0.0, 1.0, 0.0, 0.0)

_PAINT = {b"S", b"s", b"f", b"F", b"f*", b"B", b"B*", b"b", b"b*"}


def _multiply(m: Matrix, n: Matrix) -> Matrix:
    """m then n (PDF row-vector convention: point * m * n)."""
    a, b, c, d, e, f = m
    a2, b2, c2, d2, e2, f2 = n
    return (
        a * a2 + b * c2,
        a * b2 + b * d2,
        c * a2 + d * c2,
        c * b2 + d * d2,
        e * a2 + f * c2 + e2,
        e * b2 + f * d2 + f2,
    )


def _apply(m: Matrix, x: float, y: float) -> tuple[float, float]:
    a, b, c, d, e, f = m
    return a * x + c * y + e, b * x + d * y + f


@dataclass
class Extent:
    """Bounding box of the ink on a page, PDF points, origin bottom left."""

    x0: float = float("inf")
    y0: float = float("inf")
    x1: float = float("-inf")
    y1: float = float("-inf")

    def add(self, x: float, y: float) -> None:
        self.x0, self.x1 = min(self.x0, x), max(self.x1, x)
        self.y0, self.y1 = min(self.y0, y), max(self.y1, y)


def painted_extent(reader: PdfReader, index: int) -> Extent:
    """The box around every painted path and drawn XObject on page ``index`` (0-based)."""
    extent = Extent()
    for box in painted_boxes(reader, index):
        extent.add(box.x0, box.y0)
        extent.add(box.x1, box.y1)
    return extent


def painted_boxes(reader: PdfReader, index: int) -> list[Extent]:
    """The box of each painted path and of each drawn XObject on page ``index`` (0-based)."""
    page = reader.pages[index]
    xobjects: Any = (page.get("/Resources") or {}).get("/XObject") or {}
    boxes: list[Extent] = []
    ctm = IDENTITY
    clip: Extent | None = None  # None: nothing clips yet
    stack: list[tuple[Matrix, Extent | None]] = []
    path: list[tuple[float, float]] = []
    clipping = False

    def shown(box: Extent) -> None:
        cut = box if clip is None else _intersect(box, clip)
        if cut is not None:
            boxes.append(cut)

    for operands, op in ContentStream(page.get_contents(), reader).operations:
        if op == b"q":
            stack.append((ctm, clip))
        elif op == b"Q":
            ctm, clip = stack.pop() if stack else (IDENTITY, None)
        elif op in (b"W", b"W*"):
            clipping = True  # the path, once ended, clips what follows
        elif op == b"cm":
            ctm = _multiply(tuple(float(v) for v in operands), ctm)  # type: ignore[arg-type]
        elif op in (b"m", b"l"):
            path.append(_apply(ctm, float(operands[0]), float(operands[1])))
        elif op in (b"c", b"v", b"y"):
            nums = [float(v) for v in operands]
            path += [_apply(ctm, nums[i], nums[i + 1]) for i in range(0, len(nums), 2)]
        elif op == b"re":
            x, y, w, h = (float(v) for v in operands)
            path += [_apply(ctm, x, y), _apply(ctm, x + w, y + h)]
            path += [_apply(ctm, x + w, y), _apply(ctm, x, y + h)]
        elif op in _PAINT or op == b"n":
            if path:
                box = Extent()
                for point in path:
                    box.add(*point)
                if op in _PAINT:
                    shown(box)
                if clipping:
                    clip = box if clip is None else (_intersect(box, clip) or _EMPTY)
            path = []
            clipping = False
        elif op == b"Do":
            xobject = xobjects[operands[0]].get_object()
            if xobject.get("/Subtype") == "/Form":
                x0, y0, x1, y1 = (float(v) for v in xobject["/BBox"])
                form = tuple(float(v) for v in xobject.get("/Matrix", IDENTITY))
                m = _multiply(form, ctm)  # type: ignore[arg-type]
            else:
                x0, y0, x1, y1 = 0.0, 0.0, 1.0, 1.0
                m = ctm
            box = Extent()
            for x, y in ((x0, y0), (x1, y0), (x0, y1), (x1, y1)):
                box.add(*_apply(m, x, y))
            shown(box)
    return boxes


_EMPTY = Extent(0.0, 0.0, -1.0, -1.0)
"""A clip that shows nothing (two clips that do not meet)."""


def _intersect(a: Extent, b: Extent) -> Extent | None:
    """The overlap of two boxes, or None when they do not meet."""
    x0, y0, x1, y1 = max(a.x0, b.x0), max(a.y0, b.y0), min(a.x1, b.x1), min(a.y1, b.y1)
    if x0 > x1 or y0 > y1:
        return None
    return Extent(x0, y0, x1, y1)


@dataclass(frozen=True)
class Word:
    """A word of the text layer with its box (PDF points, origin top left, as pdftotext)."""

    text: str
    x0: float
    y0: float
    x1: float
    y1: float


def page_words(pdf: Path, page: int) -> list[Word]:
    """The words of one page (1-based) with their boxes, by poppler's ``pdftotext -bbox``."""
    import html
    import re

    if shutil.which("pdftotext") is None:
        import pytest

        pytest.skip("pdftotext (poppler-utils) is not installed")
    out = subprocess.run(
        ["pdftotext", "-bbox", "-f", str(page), "-l", str(page), str(pdf), "-"],
        check=True,
        capture_output=True,
        text=True,
    ).stdout
    pattern = re.compile(
        r'<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">(.*?)</word>'
    )
    return [
        Word(html.unescape(m.group(5)), *(float(m.group(i)) for i in (1, 2, 3, 4)))
        for m in pattern.finditer(out)
    ]
