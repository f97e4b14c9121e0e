"""Lay the package HTML out with WeasyPrint, in chunks, and write one PDF.

A laid-out WeasyPrint document holds every page's boxes: a 200-sheet package laid out in one
piece needs gigabytes. The package is therefore laid out in *chunks* of whole sections (the
cover; the rest of the front matter; groups of sheets; the back matter), each written to PDF and
freed before the next, and the chunk PDFs are joined with pypdf. What CSS would compute across
the whole document is written into each chunk instead:

- the package page number: each chunk's page counter starts at its offset (``counter-set`` on
  its first page) and ``counter(pages)`` is replaced by the package's page count;
- the contents page numbers: ``target-counter(attr(href), page)`` is replaced by an attribute
  holding the target section's page, written on every link to a section;
- the running footer strings (``.cp-strings``) are repeated at the start of every chunk;
- links and outline: each chunk's bookmarks and links within it are kept by the join; links to
  a section in another chunk are added after the join, as named destinations;
- tags: every chunk is written tagged, and the join grafts each chunk's structure tree onto the
  first's (:mod:`calcpack.package.pdfjoin`).

Those values are known only after a layout, and "sheet page n of N" needs the page count of each
sheet, so :func:`paginate` lays out with assumed page counts per section (the previous build's
when known), compares, and lays out again with the measured counts until they hold. Since every
chunk starts on the page the assumed counts give it, chunks are independent: with a pool of
worker processes the chunks after the first are laid out there, in parallel. A chunk is written
to PDF right after its layout if its own counts are the assumed ones (in this process, only while
every count so far was); the others are only counted.

The sign-off boxes of the cover are measured from the final layout, in PDF points with the origin
at the bottom left, for the signing step to place its signature fields.

The PDF is reproducible: its dates come from the caller (the revision date or
SOURCE_DATE_EPOCH), the identifier is a hash of the content, and the attached files carry the
same fixed dates. It is written as tagged PDF/A-3b (archival, with attachments).
"""

from __future__ import annotations

import collections
import concurrent.futures
import contextlib
import datetime as _dt
import hashlib
import io
import itertools
import json
import logging
import re
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError

__all__ = [
    "ChunkStore",
    "Layout",
    "PdfAttachment",
    "count_pages",
    "paginate",
    "split_sections",
    "write_pdf",
]

PX_TO_PT = 0.75
"""CSS px to PDF points (96 px = 72 pt = 1 in)."""

CHUNK_HTML_CHARS = 2_500_000
"""Sheets are grouped into chunks of about this much HTML (math images included). Layout memory
grows with the chunk: a chunk this size peaks at roughly 150 MB, where a 200-sheet package laid
out whole needed over 2 GB."""

IN_FLIGHT = 4
"""Chunks handed to the worker processes at a time (their HTML waits in this process)."""

PDF_VARIANT = "pdf/a-3b"


@dataclass(frozen=True)
class PdfAttachment:
    """A file embedded in the PDF."""

    name: str
    data: bytes
    description: str


@dataclass(frozen=True)
class _Link:
    """A link to a section laid out in another chunk."""

    page: int
    """0-based page of the package."""
    rect: tuple[float, float, float, float]
    """x1, y1, x2, y2 in PDF points, origin bottom left."""
    target: str


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
    links: tuple[_Link, ...] = field(repr=False)


# --------------------------------------------------------------------------- the HTML in chunks

_SECTION_RE = '<section\\b[^>]*\\bid="{ident}"[^>]*>'
_STRINGS_RE = re.compile(r'<div class="cp-strings"[^>]*></div>')
_LINK_RE = re.compile(r'<a\b([^>]*?)\bhref="#([^"]+)"')
_TARGET_PAGE_RE = re.compile(r"target-counter\(\s*attr\(\s*href\s*\)\s*,\s*page\s*\)")


@dataclass(frozen=True)
class _Split:
    head: str
    """Everything up to and including ``<body>``."""
    sections: tuple[tuple[str, str], ...]
    """(section id, its HTML), in document order."""
    tail: str
    strings: str
    """The running footer strings element (empty if the document has none)."""


def split_sections(html: str, section_ids: Sequence[str]) -> tuple[str, list[tuple[str, str]], str]:
    """Cut the package HTML into its head, its top-level sections and its tail.

    Args:
        html: the whole document (``document_html``).
        section_ids: the ids of its top-level ``<section>`` elements, in document order.

    Raises:
        BuildError: a section is missing or out of order.
    """
    body = html.find("<body>")
    if body < 0:
        raise BuildError("Package HTML has no <body>")
    head_end = body + len("<body>")
    starts = []
    position = head_end
    for ident in section_ids:
        m = re.compile(_SECTION_RE.format(ident=re.escape(ident))).search(html, position)
        if m is None:
            raise BuildError(f"Package HTML has no section {ident!r} after the ones before it")
        starts.append(m.start())
        position = m.end()
    end = html.rfind("</body>")
    if end < position:
        raise BuildError("Package HTML has no </body> after its last section")
    bounds = [*starts, end]
    sections = [(ident, html[bounds[i] : bounds[i + 1]]) for i, ident in enumerate(section_ids)]
    return html[:head_end], sections, html[end:]


def _split(html: str, section_ids: Sequence[str]) -> _Split:
    head, sections, tail = split_sections(html, section_ids)
    m = _STRINGS_RE.search(html)
    return _Split(head, tuple(sections), tail, m.group(0) if m else "")


def _chunks(
    split: _Split, sheet_sections: set[str], fill: Callable[[str], str] | None = None
) -> list[list[int]]:
    """Indices of the sections in each chunk: the cover, the rest of the front matter, groups
    of sheets, back matter.

    Sheets are grouped by the size of their HTML once filled in (see :func:`paginate`). The
    first chunk, laid out in the build process and kept until the PDF is written (it carries
    the sign-off boxes and the attachments), holds the cover alone when other front matter
    follows: the contents and assumptions of a large package run to many pages.
    """
    chunks: list[list[int]] = []
    size = 0
    kind = ""
    seen_sheet = False
    for i, (ident, text) in enumerate(split.sections):
        is_sheet = ident in sheet_sections
        length = len(fill(text)) if fill and is_sheet else len(text)
        this = "sheet" if is_sheet else ("back" if seen_sheet else "front")
        seen_sheet = seen_sheet or is_sheet
        if (
            not chunks
            or this != kind
            or (is_sheet and size + length > CHUNK_HTML_CHARS)
            or (this == "front" and i == 1)
        ):
            chunks.append([])
            size = 0
        kind = this
        chunks[-1].append(i)
        size += length
    return chunks


def number_links(html: str, starts: dict[str, int]) -> str:
    """Write the first page of each linked section into its links (``data-cp-page``), where
    CSS would compute ``target-counter``: the target may be in another chunk."""

    def number_link(m: re.Match[str]) -> str:
        target = m.group(2)
        if target not in starts or "data-cp-page=" in m.group(1):
            return m.group(0)
        return f'<a{m.group(1)} data-cp-page="{starts[target]}" href="#{target}"'

    return _LINK_RE.sub(number_link, html)


def _chunk_html(
    split: _Split,
    indices: Sequence[int],
    *,
    offset: int,
    total: int,
    starts: dict[str, int],
) -> str:
    """One chunk as a document of its own, with the package-wide numbers written in."""
    head = _TARGET_PAGE_RE.sub(
        "attr(data-cp-page)", split.head.replace("counter(pages)", f'"{total}"')
    )
    if offset:
        rule = f"@page :first {{ counter-set: page {offset + 1}; }}"
        head = head.replace("</head>", f"<style>{rule}</style></head>", 1)

    parts = [head]
    for n, i in enumerate(indices):
        text = number_links(split.sections[i][1], starts)
        if n == 0 and split.strings and split.strings not in text:
            cut = text.index(">") + 1
            text = text[:cut] + split.strings + text[cut:]
        parts.append(text)
    parts.append(split.tail)
    return "".join(parts)


# --------------------------------------------------------------------------- one chunk's layout


def _walk(box: Any) -> Iterator[Any]:
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


def _section_pages(document: Any, ids: Sequence[str]) -> dict[str, tuple[int, int]]:
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


def _signature_fields(document: Any, roles: Sequence[str]) -> list[dict[str, Any]]:
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


def _foreign_links(document: Any) -> list[_Link]:
    """Links whose target is not in this document (the join adds them); pages 0-based here."""
    here = {name for page in document.pages for name in page.anchors}
    links = []
    for index, page in enumerate(document.pages):
        for kind, target, rect, _box in page.links:
            if kind == "internal" and target not in here:
                x1, y1, x2, y2 = rect
                links.append(_Link(index, _pt_box(page, x1, y1, x2, y2), target))
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
def _cross_chunk_links_expected() -> Iterator[None]:
    from weasyprint.logger import LOGGER

    quiet = _MissingAnchorFilter()
    LOGGER.addFilter(quiet)
    try:
        yield
    finally:
        LOGGER.removeFilter(quiet)


@dataclass(frozen=True)
class _Chunk:
    """One chunk laid out (and written when its page counts were the ones assumed)."""

    sections: dict[str, tuple[int, int]]
    """Section id -> (first, last) page within the chunk, 1-based."""
    page_count: int
    links: tuple[_Link, ...]
    """Links out of the chunk, pages 0-based within the chunk."""
    pdf: bytes | None
    """The chunk's PDF; None when a page count differed from the assumed one."""
    holds: bool


def _as_assumed(sections: dict[str, tuple[int, int]], assumed: dict[str, int]) -> bool:
    """Whether every section laid out has the page count assumed for it."""
    return all(b - a + 1 == assumed[ident] for ident, (a, b) in sections.items())


def _lay_out_chunk(
    html: str, ids: Sequence[str], assumed: dict[str, int] | None, base_url: str | None
) -> _Chunk:
    """Lay out one chunk (not the first) and write it if its sections have the assumed page
    counts (``assumed`` None: only count). Runs in a worker process when the build has them."""
    from weasyprint import HTML

    with _cross_chunk_links_expected():
        document = HTML(string=html, base_url=base_url).render()
        sections = _section_pages(document, ids)
        holds = assumed is not None and _as_assumed(sections, assumed)
        pdf = document.write_pdf(pdf_variant=PDF_VARIANT, pdf_tags=True) if holds else None
        return _Chunk(sections, len(document.pages), tuple(_foreign_links(document)), pdf, holds)


def count_pages(html: str, ids: Sequence[str], base_url: str | None = None) -> dict[str, int]:
    """Lay a document out (nothing is written) and count the pages of the sections ``ids``.

    Raises:
        BuildError: a section is missing from the layout.
    """
    from weasyprint import HTML

    with _cross_chunk_links_expected():
        document = HTML(string=html, base_url=base_url).render()
        return {ident: b - a + 1 for ident, (a, b) in _section_pages(document, ids).items()}


# --------------------------------------------------------------------------- kept chunks


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

    def get(self, key: str) -> _Chunk | None:
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
                _Link(int(page), (float(x1), float(y1), float(x2), float(y2)), str(target))
                for page, (x1, y1, x2, y2), target in meta["links"]
            )
            chunk = _Chunk(sections, int(meta["page_count"]), links, pdf, True)
        except (ValueError, KeyError, TypeError) as exc:
            for path in (meta_file, pdf_file):
                discard(path, what, f"its description cannot be read ({exc})")
            return None
        self.used.add(key)
        return chunk

    def put(self, key: str, chunk: _Chunk) -> None:
        if chunk.pdf is None:
            return
        from calcpack.package.cache import write_entry

        meta = {
            "sections": {k: list(v) for k, v in chunk.sections.items()},
            "page_count": chunk.page_count,
            "links": [[link.page, list(link.rect), link.target] for link in chunk.links],
        }
        write_entry(self.folder / f"{key}.pdf", f"{key}.pdf", chunk.pdf)
        write_entry(self.folder / f"{key}.json", f"{key}.json", json.dumps(meta).encode())
        self.used.add(key)

    def prune(self) -> None:
        """Delete the kept chunks this store's build did not use."""
        for path in self.folder.glob("*.*"):
            if path.suffix in (".pdf", ".json") and path.stem not in self.used:
                path.unlink(missing_ok=True)


_LAYOUT_FORMAT = "calcpack-chunk/3"  # 2: sealed entries (calcpack.package.cache); 3: tagged


# --------------------------------------------------------------------------- the passes


def _starts(split: _Split, assumed: dict[str, int]) -> dict[str, int]:
    """The first page of every section, given the assumed page counts."""
    starts: dict[str, int] = {}
    page = 1
    for ident, _ in split.sections:
        starts[ident] = page
        page += assumed[ident]
    return starts


def _count_front_and_back(
    split: _Split,
    assumed: dict[str, int],
    sheet_sections: set[str],
    base_url: str | None,
    pool: concurrent.futures.Executor | None = None,
) -> dict[str, int]:
    """Page counts of the sections that are not sheets (cover, contents... summary...), laid
    out together without the sheets: each starts on a new page, and none depends on the
    sheets' layout, only on what the sheets list (titles, checks), which is in the HTML.
    Laid out in a worker when there are some (a large package's front and back matter run to
    dozens of pages, and the build process should not grow by their layout)."""
    indices = [i for i, (ident, _) in enumerate(split.sections) if ident not in sheet_sections]
    html = _chunk_html(
        split, indices, offset=0, total=sum(assumed.values()), starts=_starts(split, assumed)
    )
    ids = [split.sections[i][0] for i in indices]
    if pool is not None:
        return pool.submit(count_pages, html, ids, base_url).result()
    return count_pages(html, ids, base_url)


def paginate(
    make_html: Callable[[dict[str, int]], str],
    *,
    sheet_ids: dict[str, str],
    section_ids: Sequence[str],
    roles: Sequence[str],
    base_url: str | None = None,
    guess: dict[str, int] | None = None,
    pool: concurrent.futures.Executor | None = None,
    fill: Callable[[str], str] | None = None,
    store: ChunkStore | None = None,
) -> Layout:
    """Lay out, chunk by chunk, until every section's page count is the one assumed.

    Args:
        make_html: builds the document given {sheet path: page count} ({} on the first pass).
        sheet_ids: sheet path -> its section id.
        section_ids: every section id in the document, in document order.
        roles: the sign-off roles whose boxes to measure (on the first chunk).
        guess: page counts expected per section id (from an earlier build, or each sheet
            counted on its own); when right, one layout pass is enough. Sheets not given are
            assumed to take one page; the other sections, when one of them is not given, are
            first counted on their own (a short document without the sheets).
        pool: worker processes to lay out the chunks after the first in parallel (the first,
            with the cover, is laid out here); None lays out every chunk in this process.
        fill: applied to each chunk's HTML before it is laid out. The build passes the sheets
            to ``make_html`` with placeholders for their bodies and fills them in per chunk,
            so that the whole package never exists as one string.
        store: chunks kept from earlier builds (see :class:`ChunkStore`): a chunk found there
            is not laid out again, and the chunks laid out are added to it.

    Returns:
        The final layout, ready for :func:`write_pdf`.

    Raises:
        BuildError: a section or sign-off box is missing, or the counts never settle.
    """
    given = guess or {}
    assumed = {ident: max(1, int(given.get(ident, 1))) for ident in section_ids}
    sheet_sections = set(sheet_ids.values())
    split = _split(
        make_html({path: assumed[ident] for path, ident in sheet_ids.items()}), section_ids
    )
    if sheet_sections and any(
        ident not in given for ident in section_ids if ident not in sheet_sections
    ):
        assumed.update(_count_front_and_back(split, assumed, sheet_sections, base_url, pool))
    for attempt in range(4):
        if attempt:
            counts = {path: assumed[ident] for path, ident in sheet_ids.items()}
            split = _split(make_html(counts), section_ids)
        layout, measured = _one_pass(
            split, assumed, sheet_sections, roles, base_url, pool, fill, store
        )
        if layout is not None:
            return layout
        assumed = measured
    raise BuildError("Page counts of the sections did not settle after four layout passes")


def _one_pass(
    split: _Split,
    assumed: dict[str, int],
    sheet_sections: set[str],
    roles: Sequence[str],
    base_url: str | None,
    pool: concurrent.futures.Executor | None,
    fill: Callable[[str], str] | None,
    store: ChunkStore | None = None,
) -> tuple[Layout | None, dict[str, int]]:
    """Lay out every chunk with the assumed page counts written in; the layout if they held,
    and the measured page count of every section."""
    from weasyprint import HTML

    total = sum(assumed.values())
    starts = _starts(split, assumed)
    groups = _chunks(split, sheet_sections, fill)
    ids = [[split.sections[i][0] for i in group] for group in groups]

    def chunk_html(n: int) -> str:
        # Each chunk starts where the assumed counts put it, so chunks are independent.
        offset = starts[ids[n][0]] - 1
        html = _chunk_html(split, groups[n], offset=offset, total=total, starts=starts)
        # Sheet bodies (filled in here) link to other sheets, e.g. an imported value's source.
        return number_links(fill(html), starts) if fill else html

    to_keep: dict[concurrent.futures.Future[_Chunk], str] = {}

    def lay_out(n: int, counts: dict[str, int] | None) -> concurrent.futures.Future[_Chunk]:
        """Chunk ``n``: from the store, else laid out (in a worker when there are some)."""
        html = chunk_html(n)
        own = {ident: assumed[ident] for ident in ids[n]}
        key = store.key(html, own, base_url) if store is not None and counts else None
        kept = store.get(key) if store is not None and key else None
        future: concurrent.futures.Future[_Chunk]
        if kept is None and pool is not None:
            future = pool.submit(_lay_out_chunk, html, ids[n], counts, base_url)
        else:
            future = concurrent.futures.Future()
            future.set_result(kept or _lay_out_chunk(html, ids[n], counts, base_url))
        if key and kept is None:
            to_keep[future] = key
        return future

    def result(future: concurrent.futures.Future[_Chunk]) -> _Chunk:
        chunk = future.result()
        key = to_keep.pop(future, None)
        if store is not None and key:
            store.put(key, chunk)
        return chunk

    # Chunks after the first go to the workers a few at a time (each carries its HTML).
    queued: collections.deque[concurrent.futures.Future[_Chunk]] = collections.deque()
    later = iter(range(1, len(groups)))

    def submit(count: int) -> None:
        for n in itertools.islice(later, count):
            queued.append(lay_out(n, assumed))

    if pool is not None:
        submit(IN_FLIGHT)
    with _cross_chunk_links_expected():
        first = HTML(string=chunk_html(0), base_url=base_url).render()
        first_sections = _section_pages(first, ids[0])
        fields = _signature_fields(first, roles) if roles else []
        first_links = _foreign_links(first)
    chunks = [_Chunk(first_sections, len(first.pages), tuple(first_links), None, True)]
    holds = _as_assumed(first_sections, assumed)
    if pool is not None:
        while queued:
            chunks.append(result(queued.popleft()))
            submit(1)
    else:
        for n in range(1, len(groups)):
            # Once a count differs this pass is only counting: no chunk is written.
            chunk = result(lay_out(n, assumed if holds else None))
            holds = holds and chunk.holds
            chunks.append(chunk)

    measured: dict[str, int] = {}
    pages: dict[str, tuple[int, int]] = {}
    links: list[_Link] = []
    offset = 0
    for chunk in chunks:
        for ident, (a, b) in chunk.sections.items():
            measured[ident] = b - a + 1
            pages[ident] = (offset + a, offset + b)
        links += [replace(link, page=offset + link.page) for link in chunk.links]
        offset += chunk.page_count
    if measured != assumed or offset != total:
        return None, measured
    if any(chunk.pdf is None for chunk in chunks[1:]):
        raise BuildError("A chunk of the package was laid out but not written")
    layout = Layout(
        page_count=total,
        section_pages=pages,
        signature_fields=tuple(fields),
        first=first,
        rest=tuple(chunk.pdf or b"" for chunk in chunks[1:]),
        links=tuple(links),
    )
    return layout, measured


# --------------------------------------------------------------------------- the PDF


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
    with _cross_chunk_links_expected():
        first: bytes = layout.first.write_pdf(
            attachments=items, pdf_identifier=identifier, pdf_variant=PDF_VARIANT, pdf_tags=True
        )
    if not layout.rest and not layout.links:
        return first
    from calcpack.package.pdfjoin import join_chunks

    return join_chunks(first, layout.rest, layout.links)
