"""Lay the package HTML out with WeasyPrint and write the PDF.

A per-sheet "page n of N" cannot be expressed in CSS alone (the page counter counts the whole
document), so the build lays the document out once, counts the pages of every sheet, writes the
counts into the title blocks and lays it out again (:func:`paginate`). The sign-off boxes of the
cover are measured from the final layout, in PDF points with the origin at the bottom left, for
the signing step to place its signature fields.

The PDF is reproducible: its dates come from the caller (the revision date or
SOURCE_DATE_EPOCH), the identifier is a hash of the content, and the attached files carry the
same fixed dates.
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import io
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import Any

from calcpack.errors import BuildError

__all__ = ["Layout", "PdfAttachment", "layout_html", "paginate", "write_pdf"]

PX_TO_PT = 0.75
"""CSS px to PDF points (96 px = 72 pt = 1 in)."""


@dataclass(frozen=True)
class PdfAttachment:
    """A file embedded in the PDF."""

    name: str
    data: bytes
    description: str


@dataclass(frozen=True)
class Layout:
    """A laid-out document and what the build reads back from it."""

    document: Any
    """The weasyprint Document."""
    page_count: int
    section_pages: dict[str, tuple[int, int]]
    """Section id -> (first, last) page, 1-based."""
    signature_fields: tuple[dict[str, Any], ...]
    """[{"role", "page" (0-based), "box": [x1, y1, x2, y2] in pt, origin bottom-left}]."""


def _walk(box: Any) -> Any:
    yield box
    for child in getattr(box, "children", ()) or ():
        yield from _walk(child)


def _find_boxes(document: Any, ids: Sequence[str]) -> dict[str, tuple[int, Any, Any]]:
    found: dict[str, tuple[int, Any, Any]] = {}
    for index, page in enumerate(document.pages):
        for box in _walk(page._page_box):
            element = getattr(box, "element", None)
            if element is None or getattr(box, "element_tag", None) is None:
                continue
            ident = element.get("id") if hasattr(element, "get") else None
            if isinstance(ident, str) and ident in ids and ident not in found:
                found[ident] = (index, page, box)
    return found


def layout_html(
    html: str,
    *,
    base_url: str | None = None,
    section_ids: Sequence[str] = (),
    roles: Sequence[str] = (),
) -> Layout:
    """Lay out the HTML; find each section's pages and each role's signature box.

    Raises:
        BuildError: a section or signature box is missing from the layout.
    """
    from weasyprint import HTML

    document = HTML(string=html, base_url=base_url).render()
    first: dict[str, int] = {}
    for number, page in enumerate(document.pages, start=1):
        for anchor in page.anchors:
            if anchor in section_ids and anchor not in first:
                first[anchor] = number
    missing = [s for s in section_ids if s not in first]
    if missing:
        raise BuildError(f"Layout lost the section(s) {', '.join(missing)}")
    ordered = sorted(first.items(), key=lambda item: item[1])
    sections: dict[str, tuple[int, int]] = {}
    for i, (ident, start) in enumerate(ordered):
        end = ordered[i + 1][1] - 1 if i + 1 < len(ordered) else len(document.pages)
        sections[ident] = (start, max(start, end))

    box_ids = [f"cp-sign-{role}" for role in roles]
    boxes = _find_boxes(document, box_ids)
    fields = []
    for role in roles:
        if f"cp-sign-{role}" not in boxes:
            raise BuildError(f"Layout lost the sign-off box of role {role!r}")
        index, page, box = boxes[f"cp-sign-{role}"]
        x1 = box.border_box_x() * PX_TO_PT
        top = box.border_box_y() * PX_TO_PT
        x2 = x1 + box.border_width() * PX_TO_PT
        bottom = top + box.border_height() * PX_TO_PT
        height = page.height * PX_TO_PT
        fields.append(
            {
                "role": role,
                "page": index,
                "box": [
                    round(x1, 2),
                    round(height - bottom, 2),
                    round(x2, 2),
                    round(height - top, 2),
                ],
            }
        )
    return Layout(document, len(document.pages), sections, tuple(fields))


def paginate(
    make_html: Callable[[dict[str, int]], str],
    *,
    sheet_ids: dict[str, str],
    section_ids: Sequence[str],
    roles: Sequence[str],
    base_url: str | None = None,
    guess: dict[str, int] | None = None,
) -> tuple[Layout, str]:
    """Lay out until the per-sheet page counts written into the title blocks are stable.

    Args:
        make_html: builds the document given {sheet path: page count} ({} on the first pass).
        sheet_ids: sheet path -> its section id.
        section_ids: every section id in the document.
        roles: the sign-off roles whose boxes to measure.
        guess: page counts expected (from an earlier build of the same sheets); when right,
            one layout pass is enough.
        guess: page counts expected (from an earlier build of the same sheets); when right,
            one layout pass is enough.

    Returns:
        The final layout and the HTML it was made from.
    """
    counts: dict[str, int] = dict(guess or {})
    if set(counts) != set(sheet_ids):
        counts = {}
    for _ in range(4):
        html = make_html(counts)
        result = layout_html(html, base_url=base_url, section_ids=section_ids, roles=roles)
        new_counts = {
            path: result.section_pages[ident][1] - result.section_pages[ident][0] + 1
            for path, ident in sheet_ids.items()
        }
        if new_counts == counts:
            return result, html
        counts = new_counts
        # Free this layout before the next: a large package holds one document, not two.
        del result
        html = ""
    raise BuildError("Page counts of the sheets did not settle after four layout passes")


def write_pdf(
    layout: Layout,
    *,
    created: _dt.datetime,
    attachments: Sequence[PdfAttachment] = (),
    identifier_seed: bytes = b"",
) -> bytes:
    """The PDF bytes of a layout, with attachments; reproducible for the same inputs."""
    from weasyprint import Attachment

    items = [
        Attachment(
            file_obj=io.BytesIO(a.data),
            name=a.name,
            description=a.description,
            created=created,
            modified=created,
            relationship="Data",
        )
        for a in attachments
    ]
    identifier = (
        hashlib.sha256(identifier_seed + b"".join(a.data for a in attachments))
        .hexdigest()[:32]
        .encode()
    )
    pdf: bytes = layout.document.write_pdf(
        attachments=items,
        pdf_identifier=identifier,
        pdf_variant="pdf/a-3b",
    )
    return pdf
