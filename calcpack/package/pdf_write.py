"""The package PDF: the first chunk written with the attachments, the other chunks joined on.

The PDF is reproducible: its dates come from the caller (the revision date or
SOURCE_DATE_EPOCH), the identifier is a hash of the content, and the attached files carry the
same fixed dates. It is written as tagged PDF/A-3b (archival, with attachments); every chunk
is tagged, and the join (:mod:`calcpack.package.pdfjoin`) grafts each chunk's structure tree
onto the first's.
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import io
from collections.abc import Sequence
from dataclasses import dataclass

from calcpack.package.layout_boxes import Layout, cross_chunk_links_expected

__all__ = ["PDF_VARIANT", "PdfAttachment", "write_pdf"]

PDF_VARIANT = "pdf/a-3b"


@dataclass(frozen=True)
class PdfAttachment:
    """A file embedded in the PDF."""

    name: str
    data: bytes
    description: str


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
            attachments=items, pdf_identifier=identifier, pdf_variant=PDF_VARIANT, pdf_tags=True
        )
    from calcpack.package.pdfjoin import join_chunks

    # Even one chunk goes through the join: its structure tree is flattened there.

    return join_chunks(first, layout.rest, layout.links)
