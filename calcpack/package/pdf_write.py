"""The package PDF: the first chunk written with the attachments, the other chunks joined on.

The PDF is reproducible: its dates come from the caller (the revision date or
SOURCE_DATE_EPOCH), the identifier is a hash of the content, and the attached files carry the
same fixed dates. It is written as PDF/A-3b (archival, with attachments).
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import io
from collections.abc import Sequence
from dataclasses import dataclass

from calcpack.package.layout_boxes import Layout, Link, cross_chunk_links_expected

__all__ = ["PDF_VARIANT", "PdfAttachment", "write_pdf"]

PDF_VARIANT = "pdf/a-3b"


@dataclass(frozen=True)
class PdfAttachment:
    """A file embedded in the PDF."""

    name: str
    data: bytes
    description: str


def _join(first: bytes, rest: Sequence[bytes], links: Sequence[Link]) -> bytes:
    """Append the other chunks' pages to the first chunk's PDF (its catalog, metadata and
    attachments are the package's), with their outline, links and named destinations."""
    from pypdf import PdfReader, PdfWriter
    from pypdf.generic import (
        ArrayObject,
        DictionaryObject,
        FloatObject,
        NameObject,
        NumberObject,
        TextStringObject,
    )

    base = PdfReader(io.BytesIO(first))
    writer = PdfWriter(clone_from=base)
    writer.pdf_header = base.pdf_header
    for data in rest:
        writer.append(PdfReader(io.BytesIO(data)), import_outline=True)
    for link in links:
        annotation = DictionaryObject(
            {
                NameObject("/Type"): NameObject("/Annot"),
                NameObject("/Subtype"): NameObject("/Link"),
                NameObject("/Rect"): ArrayObject(FloatObject(v) for v in link.rect),
                NameObject("/BS"): DictionaryObject({NameObject("/W"): NumberObject(0)}),
                # PDF/A: annotations must be printable (flag 4).
                NameObject("/F"): NumberObject(4),
                NameObject("/Dest"): TextStringObject(link.target),
            }
        )
        page = writer.pages[link.page]
        if "/Annots" not in page:
            page[NameObject("/Annots")] = ArrayObject()
        page["/Annots"].get_object().append(writer._add_object(annotation))
    out = io.BytesIO()
    writer.write(out)
    return out.getvalue()


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
    with cross_chunk_links_expected():
        first: bytes = layout.first.write_pdf(
            attachments=items, pdf_identifier=identifier, pdf_variant=PDF_VARIANT
        )
    if not layout.rest and not layout.links:
        return first
    return _join(first, layout.rest, layout.links)
