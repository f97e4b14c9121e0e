"""The package HTML cut into top-level sections and put together again as chunks.

Each chunk is a document of its own, so what CSS would compute across the whole package is
written into it: the package page number starts at the chunk's offset (``counter-set`` on its
first page), ``counter(pages)`` becomes the package's page count, the contents' page numbers
(``target-counter(attr(href), page)``) read an attribute written on every link to a section,
and the running footer strings (``.cp-strings``) are repeated at the start of every chunk.
"""

from __future__ import annotations

import re
from collections.abc import Sequence
from dataclasses import dataclass

from calcpack.errors import BuildError

__all__ = [
    "Split",
    "compose_chunk",
    "number_links",
    "section_starts",
    "split_document",
    "split_sections",
]

_SECTION_RE = '<section\\b[^>]*\\bid="{ident}"[^>]*>'
_STRINGS_RE = re.compile(r'<div class="cp-strings"[^>]*></div>')
_LINK_RE = re.compile(r'<a\b([^>]*?)\bhref="#([^"]+)"')
_TARGET_PAGE_RE = re.compile(r"target-counter\(\s*attr\(\s*href\s*\)\s*,\s*page\s*\)")


@dataclass(frozen=True)
class Split:
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


def split_document(html: str, section_ids: Sequence[str]) -> Split:
    head, sections, tail = split_sections(html, section_ids)
    m = _STRINGS_RE.search(html)
    return Split(head, tuple(sections), tail, m.group(0) if m else "")


_IN_RE = re.compile(r'\bdata-cp-in="([^"]+)"')


def number_links(html: str, starts: dict[str, int]) -> str:
    """Write the page of each link's target into the link (``data-cp-page``), where CSS would
    compute ``target-counter``: the target may be in another chunk.

    ``starts``: the first page of every section, and the page of every anchor inside one
    whose page is known. A link to an anchor not yet laid out shows the first page of the
    section it names in ``data-cp-in`` (the next layout pass corrects it).
    """

    def number_link(m: re.Match[str]) -> str:
        target = m.group(2)
        if "data-cp-page=" in m.group(1):
            return m.group(0)
        page = starts.get(target)
        if page is None:
            inside = _IN_RE.search(m.group(1))
            page = starts.get(inside.group(1)) if inside else None
        if page is None:
            return m.group(0)
        return f'<a{m.group(1)} data-cp-page="{page}" href="#{target}"'

    return _LINK_RE.sub(number_link, html)


def compose_chunk(
    split: Split,
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


def section_starts(split: Split, assumed: dict[str, int]) -> dict[str, int]:
    """The first page of every section, given the assumed page counts."""
    starts: dict[str, int] = {}
    page = 1
    for ident, _ in split.sections:
        starts[ident] = page
        page += assumed[ident]
    return starts
