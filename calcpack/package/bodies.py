"""Converted sheets on their way to the layout: converted in worker processes, bodies in files.

A sheet's converted body (its math images make it most of the package) is written to a file in
the build's temporary folder and the sheet keeps a placeholder, ``<!--cp-body-N-->``; the layout
fills the placeholders in chunk by chunk (:func:`fill_bodies`), so a large package's bodies are
never all in the build's memory, nor the whole package in one string.

A worker process that converts sheets keeps its own formula cache (read from the build's cache
file once) and sends back only the formulas it typeset that the build does not have yet, with the
keys of all those a sheet used, so the build can save the cache file. The workers also share
what they typeset while the build runs (:meth:`calcpack.package.mathcache.MathCache.share`), so a
formula that several sheets use is typeset once, not once per worker.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import TYPE_CHECKING, Any

from calcpack.package.mathcache import FormulaKey, MathCache

if TYPE_CHECKING:
    import datetime

    from calcpack.package.document import DocumentOptions, SheetDoc
    from calcpack.package.execute import ExecutedSheet
    from calcpack.package.project import Project

__all__ = ["ConvertedSheet", "convert_sheet", "fill_bodies", "prepare_in_worker", "spill_body"]

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


@dataclass(frozen=True)
class ConvertedSheet:
    """A sheet converted for the layout (in a worker process or in the build's own).

    ``doc`` carries a placeholder for its body, which waits in the build's bodies folder.
    A worker also sends the formulas it typeset that the build does not have yet and the line
    breaks of the wide ones among them (both in the cache file's form, see
    :class:`~calcpack.package.mathcache.MathCache`), and the keys of every formula the sheet
    used, for the build to save its formula cache.
    """

    doc: SheetDoc
    pages: int | None
    """Its page count laid out on its own, when it was counted."""
    formulas: tuple[list[Any], ...] = ()
    breaks: tuple[list[Any], ...] = ()
    used: tuple[FormulaKey, ...] = ()

    def into(self, math: MathCache) -> SheetDoc:
        """Take what the worker typeset into the build's formula cache; the sheet."""
        math.add_breaks(list(self.breaks))
        math.add_images(list(self.formulas))
        math.used.update(self.used)
        return self.doc


def convert_sheet(
    item: ExecutedSheet,
    source: bool,
    index: int,
    bodies: Path,
    count: PageCounting | None,
    math: MathCache,
) -> ConvertedSheet:
    """Convert a sheet (:func:`calcpack.package.sheetdoc.prepare_sheet`, formulas in
    ``math``), count its pages on its own when ``count`` is given
    (:func:`calcpack.package.sheetdoc.count_sheet_pages`), and spill its body to ``bodies``."""
    from calcpack.package.sheetdoc import count_sheet_pages, prepare_sheet

    doc = prepare_sheet(item.entry, item, source=source, math=math)
    pages = count_sheet_pages(doc, *count, math) if count else None
    return ConvertedSheet(spill_body(doc, index, bodies), pages)


@dataclass
class _Worker:
    """What a worker process keeps between the sheets it converts."""

    math: MathCache = field(default_factory=MathCache)
    cache_file: str | None = None
    """The build's formula cache file, once read."""
    sent: set[FormulaKey] = field(default_factory=set)
    """Formulas the build already has (read from its file, or sent)."""


_worker: _Worker | None = None
"""This worker process's state (a worker converts many sheets of one build)."""


def prepare_in_worker(
    item: ExecutedSheet,
    source: bool,
    math_cache: str | None,
    index: int,
    bodies: str,
    count: PageCounting | None = None,
) -> ConvertedSheet:
    """:func:`convert_sheet` in a worker process, with the worker's own formula cache (read
    from the build's file ``math_cache`` once) and the formulas the other workers typeset.

    Formulas the build already has are not sent back again.
    """
    global _worker
    if _worker is None:
        _worker = _Worker()
    worker = _worker
    if math_cache is not None and math_cache != worker.cache_file:
        worker.math.load(Path(math_cache))
        worker.cache_file = math_cache
        worker.sent.update(worker.math.images)
    taken = worker.math.share(Path(bodies) / "formulas")
    worker.math.start()
    converted = convert_sheet(item, source, index, Path(bodies), count, worker.math)
    used = set(worker.math.used)
    # Formulas taken from the other workers are sent by them.
    new = used - worker.sent - taken
    worker.sent.update(new)
    formulas = worker.math.image_entries(new)
    breaks = worker.math.break_entries(new)
    worker.math.forget_shared_images()  # in the shared files: read back if a later sheet wants them
    return replace(
        converted,
        formulas=tuple(formulas),
        breaks=tuple(breaks),
        used=tuple(sorted(used)),
    )
