"""Converted sheets on their way to the layout: converted in worker processes, bodies in files.

A sheet's converted body (its math images make it most of the package) is written to a file in
the build's temporary folder and the sheet keeps a placeholder, ``<!--cp-body-N-->``; the layout
fills the placeholders in chunk by chunk (:func:`fill_bodies`), so a large package's bodies are
never all in the build's memory, nor the whole package in one string.

A worker process that converts sheets keeps its own formula cache (read from the build's cache
file once) and sends back only the formulas it typeset that the build does not have yet, with the
keys of all those a sheet used, so the build can save the cache file. The workers also share
what they typeset while the build runs (:func:`calcpack.package.mathsvg.share_formulas`), so a
formula that several sheets use is typeset once, not once per worker.
"""

from __future__ import annotations

import re
from dataclasses import replace
from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    import datetime

    from calcpack.package.document import DocumentOptions, SheetDoc
    from calcpack.package.execute import ExecutedSheet
    from calcpack.package.project import Project

__all__ = ["convert_sheet", "fill_bodies", "prepare_in_worker", "spill_body"]

_BODY_STUB_RE = re.compile(r"<!--cp-body-(\d+)-->")


def body_file(bodies: Path, index: int | str) -> Path:
    """The file holding the body of the ``index``-th sheet (0-based, project order)."""
    return bodies / f"sheet-{index}.html"


def spill_body(doc: SheetDoc, index: int, bodies: Path) -> SheetDoc:
    """Write a sheet's body (its math images make it most of the package) to a file and keep
    a placeholder: a large package's bodies never sit in the build's memory all at once."""
    body_file(bodies, index).write_text(doc.body_html, "utf-8")
    return replace(doc, body_html=f"<!--cp-body-{index}-->")


def fill_bodies(bodies: Path, html: str) -> str:
    """Put the bodies back in place of their placeholders."""
    return _BODY_STUB_RE.sub(lambda m: body_file(bodies, m.group(1)).read_text("utf-8"), html)


PageCounting = tuple["Project", "DocumentOptions", "datetime.datetime"]
"""What counting a sheet's pages on its own needs: the project, document options and date."""


def convert_sheet(
    item: ExecutedSheet, source: bool, index: int, bodies: Path, count: PageCounting | None
) -> tuple[SheetDoc, int | None]:
    """Convert a sheet (:func:`calcpack.package.sheetdoc.prepare_sheet`), count its pages on
    its own when ``count`` is given (:func:`calcpack.package.sheetdoc.count_sheet_pages`),
    and spill its body to ``bodies``; the sheet and its page count (None if not counted)."""
    from calcpack.package.sheetdoc import count_sheet_pages, prepare_sheet

    doc = prepare_sheet(item.entry, item, source=source)
    pages = count_sheet_pages(doc, *count) if count else None
    return spill_body(doc, index, bodies), pages


_worker_math_cache: str | None = None
"""In a worker process: the formula cache file already read."""
_worker_sent: set[tuple[str, bool, float]] = set()
"""In a worker process: formulas the build already has (read from the file, or sent)."""


def prepare_in_worker(
    item: ExecutedSheet,
    source: bool,
    math_cache: str | None,
    index: int,
    bodies: str,
    count: PageCounting | None = None,
) -> tuple[SheetDoc, list[Any], list[Any], list[tuple[str, bool, float]], int | None]:
    """:func:`convert_sheet` in a worker process.

    Returns the sheet, the formulas this worker typeset that the build does not have yet and
    the line breaks of the wide ones among them (both in the cache file's form), the keys
    of every formula the sheet used, for the build to save the formula cache, and the sheet's
    page count when ``count`` (project, document options, date) is given
    (:func:`calcpack.package.sheetdoc.count_sheet_pages`). Formulas the build already has are
    not sent back again.
    """
    global _worker_math_cache
    from calcpack.package.mathsvg import (
        break_entries,
        cache_entries,
        forget_shared_images,
        known_keys,
        load_math_cache,
        share_formulas,
        used_keys,
    )

    if math_cache is not None and math_cache != _worker_math_cache:
        load_math_cache(Path(math_cache))
        _worker_math_cache = math_cache
        _worker_sent.update(known_keys())
    taken = share_formulas(Path(bodies) / "formulas")
    used_keys.clear()
    doc, pages = convert_sheet(item, source, index, Path(bodies), count)
    # Formulas taken from the other workers are sent by them.
    new = used_keys - _worker_sent - taken
    _worker_sent.update(new)
    formulas, breaks = cache_entries(new), break_entries(new)
    forget_shared_images()  # in the shared files: read back if a later sheet wants them
    return doc, formulas, breaks, sorted(used_keys), pages
