"""Keep a package's PDF/A identification through the incremental update of a signature.

The build writes the package as PDF/A-3b: its XMP metadata identifies the part and
conformance (``pdfaid:part="3"``, ``pdfaid:conformance="B"``) and repeats the document
information (title, author, dates, producer). When pyHanko signs, it rewrites the XMP in the
update to set the modification date and producer, reading the previous XMP only if the
metadata stream had not been read as a plain stream before (the signing step reads the
package first, for the manifest and the signatures): then it writes an XMP of two fields, and
the signed package is no longer identified as PDF/A. pyHanko also appends its name to the
document information's producer while it writes its name alone into the XMP, and PDF/A
requires the two to agree (ISO 19005-3 §6.6.2.3.1 / 19005-2 §6.6.2.3: equivalent entries).

:func:`keep_archival_metadata` gives the update a metadata stream parsed from the previous
revision's XMP, which pyHanko then updates in place (date and producer), and sets the
document information's producer to the same name pyHanko writes into the XMP.
"""

from __future__ import annotations

import io
from typing import Any

__all__ = ["keep_archival_metadata"]


def keep_archival_metadata(writer: Any) -> None:
    """Carry the previous revision's XMP (PDF/A identification included) into the update that
    ``writer`` (a pyHanko ``IncrementalPdfFileWriter``) will write; nothing when the package
    has no XMP."""
    from pyhanko.pdf_utils import generic
    from pyhanko.pdf_utils.metadata import model, xmp_xml

    previous = writer.prev.root
    if "/Metadata" not in previous:
        return
    data = previous["/Metadata"].data
    try:
        roots = xmp_xml.parse_xmp(io.BytesIO(data))
    except (xmp_xml.XmpXmlProcessingError, ValueError):
        return  # not ours to repair: pyHanko writes its own, as it would have
    writer.root["/Metadata"] = writer.add_object(xmp_xml.MetadataStream.from_xmp(roots))
    writer.update_root()
    info = getattr(writer, "_info", None)
    if info is not None:
        info.get_object()["/Producer"] = generic.TextStringObject(model.VENDOR)
        writer.mark_update(info)
