"""One sheet laid out as the package prints it, as fast as the build's caches allow.

:func:`render_sheet` is what ``preview()`` shows: the saved notebook executed in a fresh kernel
as the build executes it, converted with the package's templates and laid out with the package's
page layout. Each stage takes what an earlier build or preview left in the cache folder
(``PROJECT/.calcpack-cache``, else ``.calcpack-cache`` beside the notebook):

- the executed notebook: a sheet listed in the project file and importing from no other sheet
  has the build's own key (:func:`calcpack.package.sheetkey.sheet_cache_key`), so a preview after
  a build (or a build after a preview) does not execute it again; any other notebook is keyed
  by calcpack's code, the notebook, the TOML files beside it and the exports files it may read,
  and kept in ``preview/``;
- the formulas: the build's formula images (``formulas.entry``); a formula typeset by the
  preview is added to that file;
- the layout: the sheet's PDF is kept in ``preview/`` by the SHA-256 of its HTML (as the
  build's layout chunks are), with the page count it was laid out with, so an unchanged sheet
  is not laid out again and a changed one is laid out once, at its last page count;
- the page images, kept beside the PDF they were drawn from, by resolution.

Page images come from poppler's ``pdftoppm`` (Debian package poppler-utils).
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import io
import json
import re
import shutil
import subprocess
import tempfile
import time
from collections.abc import Callable, Iterator
from contextlib import contextmanager
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any, Literal

from calcpack.errors import BuildError, InputError
from calcpack.package.project import SheetEntry

__all__ = ["SheetPages", "page_images", "render_sheet", "sheet_html", "sheet_page_images"]

Progress = Callable[[str], None]
"""Told what the preview is doing ("executing the notebook", "laying out", "drawing page 2 of
5"), for a long preview to show."""

_PREVIEW_DIR = "preview"
_PAGES_FORMAT = "calcpack-preview-pages/1"


@dataclass(frozen=True)
class SheetPages:
    """A sheet laid out: its PDF and where each stage came from.

    Attributes:
        notebook: the notebook file rendered (its saved state).
        sheet: its path in the project (else its file name).
        pdf: the single-sheet PDF (the package layout, not an issued package).
        page_count: pages of the sheet.
        executed: "cached" when the executed notebook came from the cache.
        laid_out: "cached" when the PDF came from the cache.
        seconds: wall time of each stage, in order.
        cache_dir: the cache folder used (None: caches not used).
    """

    notebook: Path
    sheet: str
    pdf: bytes
    page_count: int
    executed: Literal["cached", "executed"]
    laid_out: Literal["cached", "laid out"]
    seconds: tuple[tuple[str, float], ...]
    cache_dir: Path | None


@dataclass(frozen=True)
class _Target:
    """What a notebook is rendered as: its project (or a stand-in), entry, key and caches."""

    project: Any
    entry: SheetEntry
    key: str
    executed_dir: Path
    cache_dir: Path


def _slug(path: str) -> str:
    return re.sub(r"[^A-Za-z0-9]+", "_", path).strip("_")


def _digest(*parts: tuple[str, bytes]) -> str:
    digest = hashlib.sha256()
    for label, data in parts:
        digest.update(label.encode() + b"\0" + str(len(data)).encode() + b"\0" + data)
    return digest.hexdigest()


def _beside(notebook: Path) -> list[tuple[str, bytes]]:
    """The TOML files beside a notebook (its inputs files), which a notebook outside the
    project's list may read."""
    return [(f"toml:{p.name}", p.read_bytes()) for p in sorted(notebook.parent.glob("*.toml"))]


def _exports(cache_dir: Path) -> list[tuple[str, bytes]]:
    """The exports files imports read in JupyterLab (see :mod:`calcpack.working.links`)."""
    folder = cache_dir / "exports"
    return [(f"exports:{p.name}", p.read_bytes()) for p in sorted(folder.glob("*.json"))]


def _target(notebook: Path) -> _Target:
    from calcpack.package import links
    from calcpack.package.project import find_project_above, load_project
    from calcpack.package.sheetdoc import project_from_metadata
    from calcpack.package.sheetkey import calcpack_code_hash, sheet_basis, sheet_cache_key

    code = ("calcpack", calcpack_code_hash().encode())
    project_file = find_project_above(notebook.parent)
    if project_file is None:
        cache_dir = notebook.parent / ".calcpack-cache"
        meta = json.loads(notebook.read_bytes()).get("metadata", {}).get("calcpack", {})
        project = project_from_metadata(dict(meta or {}), notebook.stem, _dt.date.today())
        key = _digest(code, ("notebook", notebook.read_bytes()), *_beside(notebook))
        return _Target(project, project.sheets[0], key, cache_dir / _PREVIEW_DIR, cache_dir)
    project = load_project(project_file)
    cache_dir = project.root / ".calcpack-cache"
    rel = notebook.relative_to(project.root).as_posix()
    listed = [s for s in project.sheets if s.path == rel]
    if listed and not links.sheet_dependencies(project, listed)[rel]:
        # The build's own key and cache: neither executes what the other just did.
        return _Target(
            project, listed[0], sheet_cache_key(project, listed[0]), cache_dir, cache_dir
        )
    entry = listed[0] if listed else SheetEntry("—", rel, None)
    key = _digest(
        code,
        ("project", sheet_basis(project)),
        ("notebook", notebook.read_bytes()),
        *_beside(notebook),
        *_exports(cache_dir),
    )
    return _Target(project, entry, key, cache_dir / _PREVIEW_DIR, cache_dir)


@contextmanager
def _stage(
    seconds: list[tuple[str, float]], name: str, progress: Progress | None
) -> Iterator[None]:
    if progress is not None:
        progress(name)
    start = time.perf_counter()
    yield
    seconds.append((name, time.perf_counter() - start))


def render_sheet(
    notebook: str | Path, *, use_cache: bool = True, progress: Progress | None = None
) -> SheetPages:
    """Execute the saved ``notebook`` and lay it out as one sheet of the package.

    Args:
        notebook: the sheet notebook; its saved state is what is rendered.
        use_cache: take and keep each stage in the cache folder (see the module notes).
        progress: told each stage as it starts.

    Raises:
        InputError: the notebook does not exist.
        NotebookExecutionError: a cell failed (names the sheet and the cell).
        BuildError: a formula cannot be typeset, or the layout failed.
    """
    path = _existing(notebook)
    seconds: list[tuple[str, float]] = []
    target = _target(path)
    nb, executed = _executed(path, target, use_cache, seconds, progress)
    make_html = _html_maker(target, nb, use_cache, seconds, progress)
    pdf, pages, laid_out = _lay_out(target, make_html, use_cache, seconds, progress)
    cache = target.cache_dir if use_cache else None
    return SheetPages(
        path, target.entry.path, pdf, pages, executed, laid_out, tuple(seconds), cache
    )


def sheet_html(notebook: str | Path) -> str:
    """The HTML of the sheet as :func:`render_sheet` lays it out (at its last page count),
    from the cache where it can, for measuring and checking the layout."""
    path = _existing(notebook)
    seconds: list[tuple[str, float]] = []
    target = _target(path)
    nb, _ = _executed(path, target, True, seconds, None)
    count = _PdfStore(target.cache_dir / _PREVIEW_DIR).last_count(target.entry)
    return _html_maker(target, nb, True, seconds, None)({target.entry.path: count})


def _existing(notebook: str | Path) -> Path:
    path = Path(notebook).expanduser()
    if not path.is_file():
        raise InputError(
            name="notebook",
            value=str(path),
            expected="a saved notebook file (.ipynb)",
            note="save the notebook first; give its path from the folder JupyterLab runs in",
        )
    return path.resolve()


def _executed(
    path: Path,
    target: _Target,
    use_cache: bool,
    seconds: list[tuple[str, float]],
    progress: Progress | None,
) -> tuple[Any, Literal["cached", "executed"]]:
    """The executed notebook: kept, else executed in a fresh kernel (and kept)."""
    import nbformat

    from calcpack.package.execute import _cached, _store, execute_notebook

    text = _cached(target.executed_dir, target.entry, target.key) if use_cache else None
    if text is not None:
        return nbformat.reads(text, as_version=4), "cached"
    with _stage(seconds, "executing the notebook", progress):
        nb = execute_notebook(path, sheet=target.entry.path)
    if use_cache:
        _store(target.executed_dir, target.entry, target.key, nbformat.writes(nb))
    return nb, "executed"


def _html_maker(
    target: _Target,
    nb: Any,
    use_cache: bool,
    seconds: list[tuple[str, float]],
    progress: Progress | None,
) -> Callable[[dict[str, int]], str]:
    """The sheet converted (formulas from the build's cache, new ones added to it), as the
    document's HTML for given page counts."""
    from calcpack import __version__
    from calcpack.package.document import DocumentOptions, document_html
    from calcpack.package.mathcache import MathCache
    from calcpack.package.sheetdoc import prepare_sheet, unlink_absent

    math = MathCache()
    math_file = target.cache_dir / "formulas.entry"
    if use_cache:
        math.load(math_file)
    known = len(math.images)
    with _stage(seconds, "converting", progress):
        doc = prepare_sheet(target.entry, nb, math=math)
    if use_cache and len(math.images) > known:
        math.used = set(math.images)  # keep the build's formulas with the new ones
        math.save(math_file)

    project = replace(target.project, sheets=(target.entry,))
    today = _dt.date.today()
    created = _dt.datetime(today.year, today.month, today.day, tzinfo=_dt.UTC)
    options = DocumentOptions(paper=project.paper, calcpack_version=__version__, sheets_only=True)

    def make_html(counts: dict[str, int]) -> str:
        return unlink_absent(
            document_html(
                project, [doc], replace(options, sheet_pages=counts), created=created, math=math
            )
        )

    return make_html


def _lay_out(
    target: _Target,
    make_html: Callable[[dict[str, int]], str],
    use_cache: bool,
    seconds: list[tuple[str, float]],
    progress: Progress | None,
) -> tuple[bytes, int, Literal["cached", "laid out"]]:
    """The sheet's PDF and page count: kept, else laid out (once, at the last count)."""
    from calcpack.package.paginate import paginate, write_pdf

    today = _dt.date.today()
    created = _dt.datetime(today.year, today.month, today.day, tzinfo=_dt.UTC)
    path = target.entry.path
    store = _PdfStore(target.cache_dir / _PREVIEW_DIR) if use_cache else None
    guess = store.last_count(target.entry) if store is not None else 1
    if store is not None:
        kept = store.get(make_html({path: guess}), guess)
        if kept is not None:
            return kept, guess, "cached"
    with _stage(seconds, "laying out", progress):
        layout = paginate(
            make_html,
            sheet_ids={path: "sheet-1"},
            section_ids=["sheet-1"],
            roles=(),
            guess={"sheet-1": guess},
        )
        pdf = write_pdf(layout, created=created, identifier_seed=Path(path).stem.encode())
    if store is not None:
        count = layout.page_count
        store.put(target.entry, make_html({path: count}), count, pdf)
    return pdf, layout.page_count, "laid out"


class _PdfStore:
    """Single-sheet PDFs kept by their HTML and page count (sealed entries), with each sheet's
    last page count; one PDF per sheet is kept."""

    def __init__(self, folder: Path) -> None:
        from calcpack.package.freshness import package_code_hash

        self.folder = folder
        self.salt = package_code_hash()

    def _key(self, html: str, count: int) -> str:
        return _digest(
            ("layout", self.salt.encode()), ("count", str(count).encode()), ("html", html.encode())
        )

    def _record(self, entry: SheetEntry) -> Path:
        return self.folder / f"{_slug(entry.path)}.layout"

    def _read_record(self, entry: SheetEntry) -> dict[str, Any]:
        from calcpack.package.cache import read_entry

        raw = read_entry(self._record(entry), "layout", what="preview layout record")
        try:
            data = json.loads(raw) if raw is not None else {}
        except ValueError:
            data = {}
        return data if isinstance(data, dict) else {}

    def last_count(self, entry: SheetEntry) -> int:
        count = self._read_record(entry).get("pages", 1)
        return count if isinstance(count, int) and count >= 1 else 1

    def get(self, html: str, count: int) -> bytes | None:
        from calcpack.package.cache import read_entry

        key = self._key(html, count)
        return read_entry(self.folder / f"{key}.pdf", key, what="preview layout")

    def put(self, entry: SheetEntry, html: str, count: int, pdf: bytes) -> None:
        from calcpack.package.cache import write_entry

        key = self._key(html, count)
        old = self._read_record(entry).get("pdf")
        write_entry(self.folder / f"{key}.pdf", key, pdf)
        record = json.dumps({"pages": count, "pdf": key}).encode()
        write_entry(self._record(entry), "layout", record)
        if isinstance(old, str) and old != key and re.fullmatch(r"[0-9a-f]{64}", old):
            for stale in self.folder.glob(f"{old}.*"):
                stale.unlink(missing_ok=True)


def page_images(
    pdf: bytes,
    *,
    resolution: int = 100,
    pages: tuple[int, int] | None = None,
    progress: Progress | None = None,
) -> tuple[bytes, ...]:
    """PNG images of the pages of ``pdf`` at ``resolution`` dots per inch.

    poppler's pdftoppm draws the pages as bitmaps; Pillow writes them as PNG at a low
    compression level (pdftoppm's own PNG writer took four times as long as its drawing).

    Args:
        pdf: the document.
        resolution: dots per inch, 30 to 600.
        pages: (first, last) page, 1-based, inclusive; default every page.
        progress: told what is being drawn.

    Raises:
        InputError: ``resolution`` outside 30 to 600, or a page outside the document.
        BuildError: pdftoppm is not installed or failed.
    """
    from PIL import Image
    from pypdf import PdfReader

    from calcpack.validate import within

    within("resolution", resolution, 30, 600, rule="dots per inch")
    exe = shutil.which("pdftoppm")
    if exe is None:
        raise BuildError(
            "The preview needs pdftoppm to draw the pages (Debian package poppler-utils); "
            "install it, or build the package with `calcpack build`"
        )
    total = len(PdfReader(io.BytesIO(pdf)).pages)
    first, last = pages or (1, total)
    within("pages", first, 1, last, rule="first page, from 1 to the last page asked for")
    within("pages", last, first, total, rule=f"last page, up to the {total} of the document")
    if progress is not None:
        what = f"page {first}" if first == last else f"pages {first} to {last} of {total}"
        progress(f"drawing {what} at {resolution} dpi")
    with tempfile.TemporaryDirectory(prefix="calcpack-preview-") as tmp:
        src = Path(tmp) / "sheet.pdf"
        src.write_bytes(pdf)
        command = [exe, "-r", str(resolution), "-f", str(first), "-l", str(last)]
        done = subprocess.run(
            [*command, str(src), str(Path(tmp) / "page")],
            capture_output=True,
            check=False,
            timeout=300,
        )
        if done.returncode != 0:
            raise BuildError(f"pdftoppm failed: {done.stderr.decode(errors='replace')[-500:]}")
        drawn = sorted(Path(tmp).glob("page-*.ppm"), key=lambda p: int(p.stem.rsplit("-", 1)[1]))
        out = []
        for bitmap in drawn:
            png = io.BytesIO()
            with Image.open(bitmap) as image:
                image.save(png, "PNG", compress_level=1)
            out.append(png.getvalue())
    if len(out) != last - first + 1:
        raise BuildError(f"pdftoppm drew {len(out)} pages of the {last - first + 1} asked for")
    return tuple(out)


def sheet_page_images(
    sheet: SheetPages, *, resolution: int = 100, progress: Progress | None = None
) -> tuple[bytes, ...]:
    """Every page of a rendered sheet as PNG, kept beside its PDF in the cache by resolution."""
    from calcpack.package.cache import read_entry, write_entry

    slug = _slug(sheet.sheet)
    key = f"{hashlib.sha256(sheet.pdf).hexdigest()[:32]}-r{resolution}"
    file = sheet.cache_dir / _PREVIEW_DIR / f"{slug}-{key}.pages" if sheet.cache_dir else None
    if file is not None:
        raw = read_entry(file, key, what="preview page images")
        kept = _unpack(raw) if raw is not None else None
        if kept is not None and len(kept) == sheet.page_count:
            return kept
    images = page_images(sheet.pdf, resolution=resolution, progress=progress)
    if file is not None:
        for old in file.parent.glob(f"{slug}-*-r{resolution}.pages"):
            old.unlink(missing_ok=True)  # one set of images per sheet and resolution
        write_entry(file, key, _pack(images))
    return images


def _pack(images: tuple[bytes, ...]) -> bytes:
    head = json.dumps({"format": _PAGES_FORMAT, "sizes": [len(i) for i in images]}).encode()
    return len(head).to_bytes(8, "big") + head + b"".join(images)


def _unpack(raw: bytes) -> tuple[bytes, ...] | None:
    try:
        size = int.from_bytes(raw[:8], "big")
        head = json.loads(raw[8 : 8 + size])
        if head.get("format") != _PAGES_FORMAT:
            return None
        out, at = [], 8 + size
        for n in head["sizes"]:
            out.append(raw[at : at + int(n)])
            at += int(n)
        return tuple(out) if at == len(raw) else None
    except (ValueError, KeyError, TypeError):
        return None
