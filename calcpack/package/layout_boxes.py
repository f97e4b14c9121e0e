"""What the paginator reads from a WeasyPrint layout, and the records of a laid-out chunk.

A chunk of the package (see :mod:`calcpack.package.paginate`) is laid out on its own; from its
layout the build reads each section's pages, the cover's sign-off boxes (in PDF points, origin
bottom left, for the signing step) and the links that point into other chunks (added after the
chunks are joined). WeasyPrint's boxes are read here and nowhere else.
"""

from __future__ import annotations

import contextlib
import logging
from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from typing import Any

from calcpack.errors import BuildError

__all__ = [
    "INNER_ANCHOR",
    "PX_TO_PT",
    "Chunk",
    "Layout",
    "Link",
    "as_assumed",
    "cross_chunk_links_expected",
    "foreign_links",
    "inner_anchors",
    "section_pages",
    "signature_fields",
    "walk",
]

PX_TO_PT = 0.75
"""CSS px to PDF points (96 px = 72 pt = 1 in)."""


@dataclass(frozen=True)
class Link:
    """A link to a section laid out in another chunk."""

    page: int
    """0-based page of the package."""
    rect: tuple[float, float, float, float]
    """x1, y1, x2, y2 in PDF points, origin bottom left."""
    target: str
    element: int = -1
    """The link's HTML element among this page's links to other chunks, in order (the boxes
    of one ``<a>`` -- its words, a leader, a page number -- are one element); -1 unknown."""


@dataclass(frozen=True)
class Layout:
    """The laid-out package, ready to write, and what the build reads back from it."""

    page_count: int
    section_pages: dict[str, tuple[int, int]]
    """Section id -> (first, last) page, 1-based."""
    signature_fields: tuple[dict[str, Any], ...]
    """[{"role", "page" (0-based), "box": [x1, y1, x2, y2] in pt, origin bottom-left}]."""
    first: Any = field(repr=False)
    """The weasyprint Document of the first chunk, written last with the attachments."""
    rest: tuple[bytes, ...] = field(repr=False)
    """The PDFs of the other chunks, in order."""
    links: tuple[Link, ...] = field(repr=False)


def walk(box: Any) -> Iterator[Any]:
    yield box
    for child in getattr(box, "children", ()) or ():
        yield from walk(child)


def _find_boxes(document: Any, ids: Sequence[str]) -> dict[str, tuple[int, Any, Any]]:
    found: dict[str, tuple[int, Any, Any]] = {}
    for index, page in enumerate(document.pages):
        for box in walk(page._page_box):
            element = getattr(box, "element", None)
            if element is None or getattr(box, "element_tag", None) is None:
                continue
            ident = element.get("id") if hasattr(element, "get") else None
            if isinstance(ident, str) and ident in ids and ident not in found:
                found[ident] = (index, page, box)
    return found


def _pt_box(
    page: Any, x1: float, top: float, x2: float, bottom: float
) -> tuple[float, float, float, float]:
    """A rectangle in CSS px (origin top left) as PDF points (origin bottom left)."""
    height = page.height * PX_TO_PT
    return (
        round(x1 * PX_TO_PT, 2),
        round(height - bottom * PX_TO_PT, 2),
        round(x2 * PX_TO_PT, 2),
        round(height - top * PX_TO_PT, 2),
    )


INNER_ANCHOR = "chk-"
"""Prefix of the anchors inside a section whose page a link shows (a check on its sheet)."""


def inner_anchors(document: Any) -> dict[str, int]:
    """Anchor id -> page (1-based) of every :data:`INNER_ANCHOR` anchor in the document."""
    found: dict[str, int] = {}
    for number, page in enumerate(document.pages, start=1):
        for anchor in page.anchors:
            if anchor.startswith(INNER_ANCHOR):
                found.setdefault(anchor, number)
    return found


def section_pages(document: Any, ids: Sequence[str]) -> dict[str, tuple[int, int]]:
    """Section id -> (first, last) page within this document, 1-based."""
    first: dict[str, int] = {}
    for number, page in enumerate(document.pages, start=1):
        for anchor in page.anchors:
            if anchor in ids and anchor not in first:
                first[anchor] = number
    missing = [s for s in ids if s not in first]
    if missing:
        raise BuildError(f"Layout lost the section(s) {', '.join(missing)}")
    ordered = sorted(first.items(), key=lambda item: item[1])
    sections: dict[str, tuple[int, int]] = {}
    for i, (ident, start) in enumerate(ordered):
        end = ordered[i + 1][1] - 1 if i + 1 < len(ordered) else len(document.pages)
        sections[ident] = (start, max(start, end))
    return sections


def signature_fields(document: Any, roles: Sequence[str]) -> list[dict[str, Any]]:
    boxes = _find_boxes(document, [f"cp-sign-{role}" for role in roles])
    fields = []
    for role in roles:
        if f"cp-sign-{role}" not in boxes:
            raise BuildError(f"Layout lost the sign-off box of role {role!r}")
        index, page, box = boxes[f"cp-sign-{role}"]
        x1, top = box.border_box_x(), box.border_box_y()
        rect = _pt_box(page, x1, top, x1 + box.border_width(), top + box.border_height())
        fields.append({"role": role, "page": index, "box": list(rect)})
    return fields


def foreign_links(document: Any) -> list[Link]:
    """Links whose target is not in this document (the join adds them); pages 0-based here."""
    here = {name for page in document.pages for name in page.anchors}
    links = []
    for index, page in enumerate(document.pages):
        elements: dict[int, int] = {}
        for kind, target, rect, box in page.links:
            if kind == "internal" and target not in here:
                x1, y1, x2, y2 = rect
                element = elements.setdefault(id(box.element), len(elements))
                links.append(Link(index, _pt_box(page, x1, y1, x2, y2), target, element))
    return links


class _MissingAnchorFilter(logging.Filter):
    """WeasyPrint warns of links to sections in other chunks; the join adds those links."""

    def filter(self, record: logging.LogRecord) -> bool:
        message = record.getMessage()
        return not (
            message.startswith("No anchor #")
            or message.startswith("Content discarded: target points to undefined anchor")
        )


@contextlib.contextmanager
def cross_chunk_links_expected() -> Iterator[None]:
    from weasyprint.logger import LOGGER

    quiet = _MissingAnchorFilter()
    LOGGER.addFilter(quiet)
    try:
        yield
    finally:
        LOGGER.removeFilter(quiet)


@dataclass(frozen=True)
class Chunk:
    """One chunk laid out (and written when its page counts were the ones assumed)."""

    sections: dict[str, tuple[int, int]]
    """Section id -> (first, last) page within the chunk, 1-based."""
    page_count: int
    links: tuple[Link, ...]
    """Links out of the chunk, pages 0-based within the chunk."""
    pdf: bytes | None
    """The chunk's PDF; None when a page count differed from the assumed one."""
    holds: bool
    anchors: dict[str, int] = field(default_factory=dict)
    """Anchors inside sections that links point to (:data:`INNER_ANCHOR`) -> page within the
    chunk, 1-based."""


def as_assumed(sections: dict[str, tuple[int, int]], assumed: dict[str, int]) -> bool:
    """Whether every section laid out has the page count assumed for it."""
    return all(b - a + 1 == assumed[ident] for ident, (a, b) in sections.items())
