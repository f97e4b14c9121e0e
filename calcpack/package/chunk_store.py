"""Chunks of the package laid out by earlier builds, kept on disk (see :class:`ChunkStore`)."""

from __future__ import annotations

import hashlib
import json
from pathlib import Path

from calcpack.package.layout_boxes import Chunk, Link
from calcpack.package.pdf_write import PDF_VARIANT

__all__ = ["ChunkStore"]


class ChunkStore:
    """Chunks laid out by earlier builds, kept in a folder by what determines them.

    A chunk's layout and PDF depend only on its HTML (sections, page numbers and counts written
    in, stylesheet), the page counts assumed for its sections, the base URL and the layout
    code and libraries; the SHA-256 of those names its files (``KEY.pdf`` and ``KEY.json``).
    When one sheet of a package changes, a rebuild lays out only the chunks whose HTML changed
    (the cover is always laid out, in the build process). Only chunks that were written (their
    counts held) are kept; :meth:`prune` drops those the last build did not use.
    """

    def __init__(self, folder: Path, code_hash: str) -> None:
        """``code_hash``: a hash of the layout code and templates (the build's)."""
        from importlib.metadata import version

        self.folder = folder
        libraries = "|".join(f"{name} {version(name)}" for name in ("weasyprint", "pydyf"))
        self.salt = f"{code_hash}|{libraries}|{PDF_VARIANT}|{_LAYOUT_FORMAT}"
        self.used: set[str] = set()

    def key(self, html: str, counts: dict[str, int], base_url: str | None) -> str:
        digest = hashlib.sha256()
        for part in (self.salt, base_url or "", json.dumps(counts, sort_keys=True), html):
            digest.update(part.encode() + b"\0")
        return digest.hexdigest()

    def get(self, key: str) -> Chunk | None:
        """The chunk kept under ``key``, if both its files pass their checks (see
        :mod:`calcpack.package.cache`); a failing one is discarded with a warning."""
        from calcpack.package.cache import discard, read_entry

        what = "layout chunk"
        meta_file, pdf_file = self.folder / f"{key}.json", self.folder / f"{key}.pdf"
        if not (meta_file.exists() or pdf_file.exists()):
            return None
        raw = read_entry(meta_file, f"{key}.json", what=what)
        pdf = read_entry(pdf_file, f"{key}.pdf", what=what)
        if raw is None or pdf is None:
            for path in (meta_file, pdf_file):
                if path.exists():
                    discard(path, what, "the other file of its chunk is missing or failed")
            return None
        try:
            meta = json.loads(raw)
            sections = {k: (int(a), int(b)) for k, (a, b) in meta["sections"].items()}
            links = tuple(
                Link(
                    int(page),
                    (float(x1), float(y1), float(x2), float(y2)),
                    str(target),
                    int(element[0]) if element else -1,
                )
                for page, (x1, y1, x2, y2), target, *element in meta["links"]
            )
            anchors = {str(k): int(v) for k, v in meta["anchors"].items()}
            chunk = Chunk(sections, int(meta["page_count"]), links, pdf, True, anchors)
        except (ValueError, KeyError, TypeError) as exc:
            for path in (meta_file, pdf_file):
                discard(path, what, f"its description cannot be read ({exc})")
            return None
        self.used.add(key)
        return chunk

    def put(self, key: str, chunk: Chunk) -> None:
        if chunk.pdf is None:
            return
        from calcpack.package.cache import write_entry

        meta = {
            "sections": {k: list(v) for k, v in chunk.sections.items()},
            "page_count": chunk.page_count,
            "links": [
                [link.page, list(link.rect), link.target, link.element] for link in chunk.links
            ],
            "anchors": chunk.anchors,
        }
        write_entry(self.folder / f"{key}.pdf", f"{key}.pdf", chunk.pdf)
        write_entry(self.folder / f"{key}.json", f"{key}.json", json.dumps(meta).encode())
        self.used.add(key)

    def prune(self) -> None:
        """Delete the kept chunks this store's build did not use."""
        for path in self.folder.glob("*.*"):
            if path.suffix in (".pdf", ".json") and path.stem not in self.used:
                path.unlink(missing_ok=True)


# 2: sealed entries (calcpack.package.cache); 3: tagged; 4: anchors inside sections
_LAYOUT_FORMAT = "calcpack-chunk/4"
