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
  a section in another chunk are added after the join, as named destinations.

Those values are known only after a layout, and "sheet page n of N" needs the page count of each
sheet, so :func:`paginate` lays out with assumed page counts per section (the previous build's
when known), compares, and lays out again with the measured counts until they hold. Since every
chunk starts on the page the assumed counts give it, chunks are independent: with a pool of
worker processes the chunks after the first are laid out there, in parallel. A chunk is written
to PDF right after its layout if its own counts are the assumed ones (in this process, only while
every count so far was); the others are only counted.

The sign-off boxes of the cover are measured from the final layout, in PDF points with the origin
at the bottom left, for the signing step to place its signature fields.

The pieces live beside this module: cutting and recomposing the HTML (:mod:`.html_chunks`),
reading WeasyPrint's boxes (:mod:`.layout_boxes`), the kept chunks (:mod:`.chunk_store`) and
the PDF (:mod:`.pdf_write`).
"""

from __future__ import annotations

import collections
import concurrent.futures
import hashlib
import itertools
import json
import re
from collections.abc import Callable, Sequence
from dataclasses import replace

from calcpack.errors import BuildError
from calcpack.package.chunk_store import ChunkStore
from calcpack.package.html_chunks import (
    Split,
    compose_chunk,
    number_links,
    section_starts,
    split_document,
    split_sections,
)
from calcpack.package.layout_boxes import (
    INNER_ANCHOR,
    Chunk,
    Layout,
    Link,
    as_assumed,
    cross_chunk_links_expected,
    foreign_links,
    inner_anchors,
    section_pages,
    signature_fields,
)
from calcpack.package.pdf_write import PDF_VARIANT, PdfAttachment, write_pdf

__all__ = [
    "ChunkStore",
    "Layout",
    "PdfAttachment",
    "count_pages",
    "number_links",
    "paginate",
    "split_sections",
    "write_pdf",
]

CHUNK_HTML_CHARS = 2_500_000
"""Sheets are grouped into chunks of about this much HTML (math images included). Layout memory
grows with the chunk: a chunk this size peaks at roughly 150 MB, where a 200-sheet package laid
out whole needed over 2 GB."""

IN_FLIGHT = 4
"""Chunks handed to the worker processes at a time (their HTML waits in this process)."""


def _chunks(
    split: Split, sheet_sections: set[str], fill: Callable[[str], str] | None = None
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


def _lay_out_chunk(
    html: str, ids: Sequence[str], assumed: dict[str, int] | None, base_url: str | None
) -> Chunk:
    """Lay out one chunk (not the first) and write it if its sections have the assumed page
    counts (``assumed`` None: only count). Runs in a worker process when the build has them."""
    from weasyprint import HTML

    with cross_chunk_links_expected():
        document = HTML(string=html, base_url=base_url).render()
        sections = section_pages(document, ids)
        holds = assumed is not None and as_assumed(sections, assumed)
        pdf = document.write_pdf(pdf_variant=PDF_VARIANT, pdf_tags=True) if holds else None
        return Chunk(
            sections,
            len(document.pages),
            tuple(foreign_links(document)),
            pdf,
            holds,
            inner_anchors(document),
        )


def count_pages(html: str, ids: Sequence[str], base_url: str | None = None) -> dict[str, int]:
    """Lay a document out (nothing is written) and count the pages of the sections ``ids``.

    Raises:
        BuildError: a section is missing from the layout.
    """
    from weasyprint import HTML

    with cross_chunk_links_expected():
        document = HTML(string=html, base_url=base_url).render()
        return {ident: b - a + 1 for ident, (a, b) in section_pages(document, ids).items()}


def _count_front_and_back(
    split: Split,
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
    html = compose_chunk(
        split, indices, offset=0, total=sum(assumed.values()), starts=section_starts(split, assumed)
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
    split = split_document(
        make_html({path: assumed[ident] for path, ident in sheet_ids.items()}), section_ids
    )
    if sheet_sections and any(
        ident not in given for ident in section_ids if ident not in sheet_sections
    ):
        assumed.update(_count_front_and_back(split, assumed, sheet_sections, base_url, pool))
    inner: dict[str, tuple[str, int]] = {}
    memo: dict[str, Chunk] = {}
    for attempt in range(5):
        if attempt:
            counts = {path: assumed[ident] for path, ident in sheet_ids.items()}
            split = split_document(make_html(counts), section_ids)
        layout, measured, found = _one_pass(
            split, assumed, sheet_sections, roles, base_url, pool, fill, store, inner, memo
        )
        linked = _linked_inner(split)
        # Where each linked anchor was assumed (the section its link names, else its page
        # measured by an earlier pass), against where it fell.
        assumed_at = {a: inner.get(a, (section, 0)) for a, section in linked.items()}
        if layout is not None and all(found.get(a, at) == at for a, at in assumed_at.items()):
            return layout
        # Counts or the pages of linked anchors changed: lay out again (chunks whose HTML is
        # unchanged are taken from this build's earlier pass).
        assumed, inner = measured, found
    raise BuildError("Page counts of the sections did not settle after five layout passes")


_INNER_LINK_RE = re.compile(
    rf'<a\b[^>]*?\bdata-cp-in="([^"]+)"[^>]*?\bhref="#({re.escape(INNER_ANCHOR)}[^"]+)"'
)


def _linked_inner(split: Split) -> dict[str, str]:
    """The anchors inside sections that the front and back matter link to (the summary's
    page of each check), each with the section its link names (``data-cp-in``)."""
    return {
        m.group(2): m.group(1) for _, text in split.sections for m in _INNER_LINK_RE.finditer(text)
    }


def _one_pass(
    split: Split,
    assumed: dict[str, int],
    sheet_sections: set[str],
    roles: Sequence[str],
    base_url: str | None,
    pool: concurrent.futures.Executor | None,
    fill: Callable[[str], str] | None,
    store: ChunkStore | None = None,
    inner: dict[str, tuple[str, int]] | None = None,
    memo: dict[str, Chunk] | None = None,
) -> tuple[Layout | None, dict[str, int], dict[str, tuple[str, int]]]:
    """Lay out every chunk with the assumed page counts written in; the layout if they held,
    the measured page count of every section, and where each anchor inside a section fell
    (section id, pages after its first).

    ``inner``: where the anchors inside sections are assumed to be (from an earlier pass),
    for the links to them; ``memo``: chunks written by an earlier pass of this build, by
    their HTML and counts."""
    from weasyprint import HTML

    total = sum(assumed.values())
    starts = section_starts(split, assumed)
    for anchor, (section, after) in (inner or {}).items():
        if section in starts:
            starts[anchor] = starts[section] + after
    groups = _chunks(split, sheet_sections, fill)
    ids = [[split.sections[i][0] for i in group] for group in groups]

    def chunk_html(n: int) -> str:
        # Each chunk starts where the assumed counts put it, so chunks are independent.
        offset = starts[ids[n][0]] - 1
        html = compose_chunk(split, groups[n], offset=offset, total=total, starts=starts)
        # Sheet bodies (filled in here) link to other sheets, e.g. an imported value's source.
        return number_links(fill(html), starts) if fill else html

    to_keep: dict[concurrent.futures.Future[Chunk], str] = {}

    def lay_out(n: int, counts: dict[str, int] | None) -> concurrent.futures.Future[Chunk]:
        """Chunk ``n``: from the store, else laid out (in a worker when there are some)."""
        html = chunk_html(n)
        own = {ident: assumed[ident] for ident in ids[n]}
        mark = _memo_key(html, own) if memo is not None and counts else ""
        key = store.key(html, own, base_url) if store is not None and counts else None
        kept = memo.get(mark) if memo is not None and mark else None
        if kept is None:
            kept = store.get(key) if store is not None and key else None
        future: concurrent.futures.Future[Chunk]
        if kept is None and pool is not None:
            future = pool.submit(_lay_out_chunk, html, ids[n], counts, base_url)
        else:
            future = concurrent.futures.Future()
            future.set_result(kept or _lay_out_chunk(html, ids[n], counts, base_url))
        if key and kept is None:
            to_keep[future] = key
        if mark:
            marks[future] = mark
        return future

    marks: dict[concurrent.futures.Future[Chunk], str] = {}

    def result(future: concurrent.futures.Future[Chunk]) -> Chunk:
        chunk = future.result()
        key = to_keep.pop(future, None)
        if store is not None and key:
            store.put(key, chunk)
        mark = marks.pop(future, "")
        if memo is not None and mark and chunk.pdf is not None:
            memo[mark] = chunk
        return chunk

    # Chunks after the first go to the workers a few at a time (each carries its HTML).
    queued: collections.deque[concurrent.futures.Future[Chunk]] = collections.deque()
    later = iter(range(1, len(groups)))

    def submit(count: int) -> None:
        for n in itertools.islice(later, count):
            queued.append(lay_out(n, assumed))

    if pool is not None:
        submit(IN_FLIGHT)
    with cross_chunk_links_expected():
        first = HTML(string=chunk_html(0), base_url=base_url).render()
        first_sections = section_pages(first, ids[0])
        fields = signature_fields(first, roles) if roles else []
        first_links = foreign_links(first)
    first_chunk = Chunk(
        first_sections, len(first.pages), tuple(first_links), None, True, inner_anchors(first)
    )
    chunks = [first_chunk]
    holds = as_assumed(first_sections, assumed)
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
    links: list[Link] = []
    found: dict[str, tuple[str, int]] = {}
    offset = 0
    for chunk in chunks:
        for ident, (a, b) in chunk.sections.items():
            measured[ident] = b - a + 1
            pages[ident] = (offset + a, offset + b)
        for anchor, page in chunk.anchors.items():
            within = [i for i, (a, b) in chunk.sections.items() if a <= page <= b]
            if within:
                found[anchor] = (within[0], page - chunk.sections[within[0]][0])
        links += [replace(link, page=offset + link.page) for link in chunk.links]
        offset += chunk.page_count
    if measured != assumed or offset != total:
        return None, measured, found
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
    return layout, measured, found


def _memo_key(html: str, counts: dict[str, int]) -> str:
    digest = hashlib.sha256(json.dumps(counts, sort_keys=True).encode() + b"\0")
    digest.update(html.encode())
    return digest.hexdigest()
