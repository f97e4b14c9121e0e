"""The build pipeline: project file -> executed sheets -> HTML -> paginated PDF + manifest.

Stages are plain functions passing typed values::

    load_project -> execute_sheets -> prepare_sheet (nbconvert + math to SVG)
        -> document_html / paginate (WeasyPrint, in chunks) -> manifest -> write_pdf

Outputs are written to temporary files in the output folder and moved into place only when the
whole build succeeded, so a failing or interrupted build leaves the previous package untouched.
A build whose inputs (every sheet's cache key, the options, the review file and the package
code) match the existing package's manifest is skipped outright.
"""

from __future__ import annotations

import concurrent.futures
import contextlib
import datetime as _dt
import functools
import hashlib
import os
import re
import tempfile
import time
from collections.abc import Callable
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any

from calcpack.contract.manifest import MANIFEST_NAME, Manifest, manifest_bytes
from calcpack.errors import BuildError
from calcpack.package import links, publish, verification
from calcpack.package.bodies import convert_sheet, fill_bodies, prepare_in_worker
from calcpack.package.document import (
    ROLES,
    DocumentOptions,
    ReviewRow,
    SheetDoc,
    document_html,
)
from calcpack.package.execute import (
    DEFAULT_CELL_TIMEOUT_S,
    ExecutedSheet,
    execute_sheets,
    worker_pool,
)
from calcpack.package.interrupt import clean_stale_temp, temp_prefix
from calcpack.package.manifest import dependency_versions, project_files, sheet_record
from calcpack.package.mathsvg import add_break_entries, add_cache_entries
from calcpack.package.paginate import ChunkStore, Layout, PdfAttachment, paginate, write_pdf
from calcpack.package.project import Person, Project, Revision, SheetEntry, load_project
from calcpack.package.records import collect_records

__all__ = [
    "BuildResult",
    "build",
    "build_created",
    "prepare_sheet",
    "sheet_title",
    "single_sheet_pdf",
]

Reporter = Callable[[str, str], None]
"""Progress hook: (stage, detail), stage in executing/cached/executed/rendering/layout/writing."""


@dataclass(frozen=True)
class BuildResult:
    """What a build produced."""

    pdf_path: Path
    manifest_path: Path
    manifest: dict[str, Any]
    page_count: int
    executed: tuple[str, ...]
    """Sheets executed in this build (paths)."""
    cached: tuple[str, ...]
    """Sheets read from the execution cache."""
    up_to_date: bool
    """True when nothing changed and the existing package was kept."""
    seconds: float
    superseded: Path | None = None
    """Where the signed package this build replaced was moved (``superseded/``), if any."""
    warnings: tuple[str, ...] = ()
    """What the engineer should fix before signing (template placeholders left)."""


def build_created(project: Project) -> _dt.datetime:
    """The document date: SOURCE_DATE_EPOCH if set, else the issued revision's date (UTC)."""
    epoch = os.environ.get("SOURCE_DATE_EPOCH")
    if epoch:
        try:
            return _dt.datetime.fromtimestamp(int(epoch), tz=_dt.UTC)
        except ValueError as exc:
            raise BuildError(
                f"SOURCE_DATE_EPOCH must be whole seconds since 1970 (got {epoch!r})"
            ) from exc
    d = project.revision.date
    return _dt.datetime(d.year, d.month, d.day, tzinfo=_dt.UTC)


def _package_code_hash() -> str:
    """Hash of the build code and templates, so a changed layout is never skipped as current."""
    import calcpack
    from calcpack.package.locations import template_dirs

    here = Path(__file__).resolve().parent
    digest = hashlib.sha256(calcpack.__version__.encode())
    files = sorted([*here.glob("*.py"), *here.glob("assets/*")])
    for folder in template_dirs():
        files += sorted(Path(folder, "calcpack").glob("*"))
    for f in files:
        if f.is_file():
            digest.update(f.name.encode() + f.read_bytes())
    return digest.hexdigest()


def _load_review(project: Project) -> tuple[tuple[ReviewRow, ...] | None, Path | None]:
    """The review log (``review.toml`` beside the project file, read by calcpack.signing.review).

    Returns None when the project has no review file.
    """
    from calcpack.signing.review import load_review, review_path

    path = review_path(project.root)
    if not path.is_file():
        return None, None
    log = load_review(project.root)
    rows = []
    for c in log.comments:
        opening, later = (c.history[0], c.history[1:]) if c.history else (None, ())
        text = opening.text if opening else ""
        for e in later:
            text += f" — {e.action} by {e.who} ({e.when[:10]}): {e.text}"
        rows.append(
            ReviewRow(
                ident=c.id,
                sheet=c.sheet,
                quantity=c.quantity or "",
                status=c.status,
                by=opening.who if opening else "",
                date=opening.when[:10] if opening else "",
                text=text,
            )
        )
    for o in log.overrides:
        rows.append(
            ReviewRow(
                ident="override",
                sheet="",
                quantity="",
                status="OVERRIDE",
                by=o.who,
                date=o.when[:10],
                text=f"Signed with {', '.join(o.comments)} not closed: {o.reason}",
            )
        )
    return tuple(rows), path


def sheet_title(entry: SheetEntry, nb: Any) -> str:
    """The sheet's title: the project file's, else the notebook's first heading, else its name."""
    if entry.title:
        return entry.title
    for cell in nb.cells:
        if cell.cell_type == "markdown":
            m = re.search(r"^#\s+(.+)$", cell.source, re.MULTILINE)
            if m:
                return m.group(1).strip()
    return Path(entry.path).stem.replace("_", " ")


_JUPYTER_STYLE_RE = re.compile(r'<style class="cp-style">.*?</style>', re.DOTALL)
"""The working module's style block for JupyterLab; the PDF uses the package stylesheet."""
_FIRST_H1_RE = re.compile(r"<h1[^>]*>(.*?)</h1>", re.DOTALL)


def _drop_title_heading(body: str, title: str) -> str:
    """Drop the first level-1 heading if it repeats the sheet title (the sheet head shows it)."""
    m = _FIRST_H1_RE.search(body)
    if m is None:
        return body

    def norm(text: str) -> str:
        return " ".join(re.sub(r"<[^>]+>", "", text).split()).casefold()

    if norm(m.group(1)) == norm(title):
        return body[: m.start()] + body[m.end() :]
    return body


def prepare_sheet(
    entry: SheetEntry, executed: ExecutedSheet | Any, *, source: bool = False
) -> SheetDoc:
    """Convert one executed sheet to HTML with its math as SVG images, and read its records.

    Raises:
        BuildError: a formula cannot be typeset (the message names the sheet).
    """
    import nbformat

    from calcpack.package.convert import sheet_fragment
    from calcpack.package.mathsvg import math_spans_to_images

    nb = (
        nbformat.reads(executed.notebook_json, as_version=4)
        if isinstance(executed, ExecutedSheet)
        else executed
    )
    title = sheet_title(entry, nb)
    try:
        body = _drop_title_heading(_JUPYTER_STYLE_RE.sub("", sheet_fragment(nb)), title)
        body = math_spans_to_images(body)
    except BuildError as exc:
        raise BuildError(f"Sheet {entry.path!r}: {exc}") from exc
    cells = (
        tuple(
            (i, cell.source)
            for i, cell in enumerate(nb.cells, start=1)
            if cell.cell_type == "code" and cell.source.strip()
        )
        if source
        else ()
    )
    return SheetDoc(entry, title, body, collect_records(nb), cells)


def _build_key(
    project: Project,
    executed_keys: list[str],
    options: DocumentOptions,
    review_file: Path | None,
    created: _dt.datetime,
    code_hash: str,
) -> str:
    from calcpack.package import revisions

    digest = hashlib.sha256()
    for part in (
        code_hash,
        publish.project_basis(project).decode("utf-8"),
        *executed_keys,
        options.paper,
        str(options.reviewer_copy),
        created.isoformat(),
        review_file.read_text("utf-8") if review_file else "",
        revisions.issued_basis_key(project),
    ):
        digest.update(part.encode() + b"\0")
    return digest.hexdigest()


def _previous_manifest(path: Path) -> dict[str, Any]:
    """The manifest of the package already in the output folder ({} if none or unreadable)."""
    import json

    try:
        data = json.loads(path.read_text("utf-8"))
    except (OSError, ValueError):
        return {}
    return data if isinstance(data, dict) else {}


def _pair_intact(pdf_path: Path, manifest_path: Path) -> bool:
    """Whether the PDF carries, as its attachment, the very manifest beside it.

    The two files are replaced one after the other; a build stopped between the two (or a file
    replaced by hand) leaves a pair that disagrees. Such a package is not up to date: it is
    built again (with a warning), never reported as current.
    """
    from calcpack.package.manifest import embedded_manifest_bytes

    if not pdf_path.is_file():
        return False
    try:
        beside = manifest_path.read_bytes()
    except OSError:
        return False
    if embedded_manifest_bytes(pdf_path) == beside:
        return True
    import warnings

    from calcpack.package.cache import CacheWarning

    warnings.warn(
        CacheWarning(
            f"Package {pdf_path.name} does not carry the manifest beside it "
            f"({manifest_path.name}): an earlier build was interrupted or a file was replaced; "
            "building it again"
        ),
        stacklevel=3,
    )
    return False


def _same_paper(previous: dict[str, Any], options: DocumentOptions) -> dict[str, Any]:
    """The previous build's manifest if it was on the same paper ({} otherwise): page counts
    carry over only then."""
    return previous if previous.get("build", {}).get("paper") == options.paper else {}


def _known_sheet_pages(previous: dict[str, Any], options: DocumentOptions) -> dict[str, int]:
    """Sheet path -> its page count in the previous build (same paper), if there was one."""
    known: dict[str, int] = {}
    for sheet in _same_paper(previous, options).get("sheets", []):
        if isinstance(sheet, dict) and isinstance(sheet.get("path"), str):
            with contextlib.suppress(TypeError, ValueError):
                first, last = sheet.get("pages", [1, 1])
                known[sheet["path"]] = int(last) - int(first) + 1
    return known


def _page_guess(
    previous: dict[str, Any],
    sheet_pages: dict[str, int],
    sheet_ids: dict[str, str],
    options: DocumentOptions,
) -> dict[str, int]:
    """Expected page count per section id, so that the layout needs one pass, not two.

    A sheet's page count depends only on its own content and the paper: a sheet the previous
    build had keeps its count there (an edit rarely changes it); a new one was counted on its
    own when it was converted (``sheet_pages``, by path). The other sections take the previous
    build's counts, by id; without one, :func:`~calcpack.package.paginate.paginate` counts them.
    """
    guess: dict[str, int] = {}
    for ident, span in (_same_paper(previous, options).get("sections") or {}).items():
        if ident not in sheet_ids.values() and isinstance(span, list) and len(span) == 2:
            guess[ident] = int(span[1]) - int(span[0]) + 1
    for path, ident in sheet_ids.items():
        if path in sheet_pages:
            guess[ident] = sheet_pages[path]
    return guess


def count_sheet_pages(
    doc: SheetDoc, project: Project, options: DocumentOptions, created: _dt.datetime
) -> int:
    """The pages a sheet takes, laid out on its own.

    A sheet starts on a new page and its title block does not depend on the other sheets, so
    this is its page count in the package (the layout checks it all the same).
    """
    from calcpack.package.paginate import count_pages

    html = document_html(
        project, [doc], replace(options, sheets_only=True, sheet_pages={}), created=created
    )
    return count_pages(html, ["sheet-1"], base_url=str(project.root))["sheet-1"]


def _safe_name(text: str) -> str:
    return re.sub(r"[^A-Za-z0-9._-]+", "-", text).strip("-") or "package"


def _atomic_write(path: Path, data: bytes) -> Path:
    """Write to a temporary file in the same folder; the caller moves it into place."""
    handle, tmp = tempfile.mkstemp(dir=path.parent, prefix=f".{path.name}.", suffix=".tmp")
    with os.fdopen(handle, "wb") as out:
        out.write(data)
        out.flush()
        os.fsync(out.fileno())
    return Path(tmp)


def _sheet_ids(docs: list[SheetDoc]) -> dict[str, str]:
    """Sheet path -> the id of its section in the document."""
    return {doc.entry.path: f"sheet-{i}" for i, doc in enumerate(docs, start=1)}


def _lay_out(
    project: Project,
    docs: list[SheetDoc],
    sheet_pages: dict[str, int],
    options: DocumentOptions,
    created: _dt.datetime,
    previous: dict[str, Any],
    reviewer_copy: bool,
    report: Reporter | None,
    pool: concurrent.futures.Executor | None,
    bodies: Path,
    store: ChunkStore | None,
) -> Layout:
    """Paginate the package (see :func:`calcpack.package.paginate.paginate`).

    ``docs`` carry placeholders for their bodies, which wait in files in ``bodies`` (see
    :mod:`calcpack.package.bodies`) and are filled in chunk by chunk.
    """
    sheet_ids = _sheet_ids(docs)
    section_ids = [
        "cover",
        "contents",
        "design-basis",
        "assumptions",
        *sheet_ids.values(),
        "summary",
        "revisions",
        "review-log",
    ]
    if reviewer_copy:
        section_ids.append("appendix-source")
    if report:
        report("layout", f"{len(docs)} sheets")

    return paginate(
        lambda counts: document_html(
            project, docs, replace(options, sheet_pages=counts), created=created
        ),
        sheet_ids=sheet_ids,
        section_ids=section_ids,
        roles=ROLES,
        base_url=str(project.root),
        guess=_page_guess(previous, sheet_pages, sheet_ids, options),
        pool=pool,
        fill=functools.partial(fill_bodies, bodies),
        store=store,
    )


def build(
    location: str | Path,
    *,
    out_dir: str | Path | None = None,
    workers: int = 2,
    timeout: float = DEFAULT_CELL_TIMEOUT_S,
    use_cache: bool = True,
    paper: str | None = None,
    reviewer_copy: bool = False,
    force: bool = False,
    report: Reporter | None = None,
    supersede_signed: bool = False,
) -> BuildResult:
    """Build the calc package of a project folder (or project file).

    Args:
        location: the project folder or its ``calcpack.toml``.
        out_dir: where to write the PDF and manifest (default ``PROJECT/build``).
        workers: worker processes executing sheets in parallel.
        timeout: per-cell execution limit, seconds.
        use_cache: reuse executed sheets whose inputs did not change.
        paper: "A4" or "Letter" (default: the project file's).
        reviewer_copy: append every sheet's source code as an appendix.
        force: rebuild even when the existing package is up to date (a signed one is kept).
        report: optional progress hook.
        supersede_signed: move a signed package that the build would replace into
            ``superseded/`` beside it (see :mod:`calcpack.package.publish`).

    Returns:
        The paths written and the manifest.

    Raises:
        ProjectFileError: the project file is missing or invalid.
        NotebookExecutionError: a cell failed; nothing is written.
        BuildError: conversion, typesetting or layout failed; nothing is written.
        SignedPackageError: the build would replace a signed package (checked before anything
            executes and again before writing); nothing is written.
    """
    start = time.perf_counter()
    timeout = publish.check_timeout(timeout)
    project = load_project(location)
    warnings = publish.placeholder_warnings(project)
    if paper is not None and paper not in ("A4", "Letter"):
        raise BuildError(f"Paper size must be 'A4' or 'Letter' (got paper = {paper!r})")
    from calcpack import __version__

    options = DocumentOptions(
        paper=paper or project.paper, reviewer_copy=reviewer_copy, calcpack_version=__version__
    )
    review, review_file = _load_review(project)
    options = replace(options, review=review)
    created = build_created(project)
    out = Path(out_dir) if out_dir is not None else project.root / "build"
    stem = _safe_name(f"{project.job_number}-calcs-rev{project.revision.rev}")
    if options.paper != project.paper:
        stem += f"-{options.paper.lower()}"
    pdf_path = out / f"{stem}.pdf"
    manifest_path = out / f"{stem}.manifest.json"

    from calcpack.package.execute import sheet_cache_key

    keys = [sheet_cache_key(project, s) for s in project.sheets]
    # Revision comparison (calcpack.package.revisions): the marks depend on the kept manifests.
    from calcpack.package import revisions

    code_hash = _package_code_hash()
    build_key = _build_key(project, keys, options, review_file, created, code_hash)
    previous = _previous_manifest(manifest_path)
    current = previous.get("build", {}).get("build_key") == build_key and _pair_intact(
        pdf_path, manifest_path
    )
    if current and (not force or publish.signatures_in(pdf_path)):
        revisions.keep_issued(project, manifest_path)
        return BuildResult(
            pdf_path,
            manifest_path,
            previous,
            int(previous.get("build", {}).get("pages", 0)),
            (),
            (),
            True,
            time.perf_counter() - start,
            warnings=warnings,
        )
    publish.check_output_folder(out)  # refuse at the door, before anything executes
    clean_stale_temp()  # folders a killed build left behind
    if not supersede_signed:
        publish.make_way(pdf_path, manifest_path, supersede=False)

    def on_sheet(stage: str, sheet: SheetEntry) -> None:
        if report:
            report(stage, sheet.path)

    from calcpack.package.execute import CACHE_DIR_NAME
    from calcpack.package.mathsvg import load_math_cache, save_math_cache, used_keys

    math_cache = project.root / CACHE_DIR_NAME / "formulas.entry"
    # Chunks of the layout kept between builds: a rebuild lays out only the changed ones.
    store = ChunkStore(project.root / CACHE_DIR_NAME / "layout", code_hash) if use_cache else None
    if use_cache:
        load_math_cache(math_cache)
    used_keys.clear()
    with contextlib.ExitStack() as stack:
        # One pool of workers for the whole build: executing, converting and laying out.
        # (The bodies' folder goes after the pool has stopped: no worker is still writing.)
        bodies = Path(
            stack.enter_context(tempfile.TemporaryDirectory(prefix=temp_prefix("bodies")))
        )
        pool = stack.enter_context(worker_pool(workers))
        index = {sheet.path: i for i, sheet in enumerate(project.sheets)}
        converting: dict[str, concurrent.futures.Future[Any]] = {}
        docs_here: dict[str, SheetDoc] = {}
        # Page counts: a sheet the previous build had keeps its count as the guess; a new one
        # is counted on its own as it is converted, so a first build lays out once, not twice.
        known_pages = _known_sheet_pages(previous, options)
        sheet_pages = dict(known_pages)

        def convert(item: ExecutedSheet) -> None:
            """Convert a sheet as soon as it is executed (or read from the cache)."""
            if report:
                report("rendering", item.entry.path)
            n = index[item.entry.path]
            count = None if item.entry.path in known_pages else (project, options, created)
            if pool is None:
                doc, pages = convert_sheet(item, reviewer_copy, n, bodies, count)
                docs_here[item.entry.path] = doc
                if pages is not None:
                    sheet_pages[item.entry.path] = pages
            else:
                cache_file = str(math_cache) if use_cache else None
                converting[item.entry.path] = pool.submit(
                    prepare_in_worker, item, reviewer_copy, cache_file, n, str(bodies), count
                )

        exports_dir = bodies / "exports"
        executed = execute_sheets(
            project,
            workers=workers,
            timeout=timeout,
            use_cache=use_cache,
            progress=on_sheet,
            pool=pool,
            on_ready=convert,
            exports_dir=exports_dir,
        )
        # JupyterLab's imports read the values of the latest build (calcpack.working.links).
        links.publish_exports(exports_dir, project.root / CACHE_DIR_NAME / "exports")
        docs = []
        for item in executed:
            if item.entry.path in converting:
                doc, formulas, breaks, used, pages = converting.pop(item.entry.path).result()
                if pages is not None:
                    sheet_pages[item.entry.path] = pages
                add_cache_entries(formulas)
                add_break_entries(breaks)
                used_keys.update(used)
            else:
                doc = docs_here.pop(item.entry.path)
            docs.append(doc)
        compared, opened = verification.check_stage(project, docs)  # the checker's checks
        if opened:  # disagreements became open review comments
            review, review_file = _load_review(project)
        options = replace(
            options,
            revisions=revisions.compare_with_issued(project, docs),
            review=review,
            verifications=compared,
        )
        layout = _lay_out(
            project,
            docs,
            sheet_pages,
            options,
            created,
            previous,
            reviewer_copy,
            report,
            pool,
            bodies,
            store,
        )
    if use_cache:
        save_math_cache(math_cache, set(used_keys))
    sheet_ids = _sheet_ids(docs)
    manifest = Manifest(
        calcpack_version=__version__,
        dependencies=dependency_versions(),
        project=project.summary(),
        files=tuple(project_files(project, review_file)),
        sheets=tuple(
            sheet_record(
                doc.entry,
                doc.title,
                doc.records,
                cache_key=item.cache_key,
                pages=list(layout.section_pages[sheet_ids[doc.entry.path]]),
            )
            for doc, item in zip(docs, executed, strict=True)
        ),
        links=tuple(
            link for doc in docs for link in links.link_records(doc.entry.path, doc.records.imports)
        ),
        verifications=tuple(c.to_json() for c in compared),
        signature_fields=tuple(layout.signature_fields),
        sections={k: list(v) for k, v in layout.section_pages.items()},
        build={
            "created": created.isoformat(),
            "paper": options.paper,
            "reviewer_copy": reviewer_copy,
            "pages": layout.page_count,
            "build_key": build_key,
        },
    ).to_json()
    data = manifest_bytes(manifest)
    if report:
        report("writing", pdf_path.name)
    pdf = write_pdf(
        layout,
        created=created,
        attachments=[
            PdfAttachment(MANIFEST_NAME, data, "calcpack build manifest: inputs, versions, results")
        ],
        identifier_seed=build_key.encode(),
    )
    page_count = layout.page_count
    del layout  # the laid-out document is the largest thing a build holds
    out.mkdir(parents=True, exist_ok=True)
    tmp_manifest = _atomic_write(manifest_path, data)
    try:
        tmp_pdf = _atomic_write(pdf_path, pdf)
    except BaseException:
        tmp_manifest.unlink(missing_ok=True)
        raise
    try:
        moved = publish.make_way(pdf_path, manifest_path, supersede=supersede_signed)
    except BaseException:
        tmp_manifest.unlink(missing_ok=True)
        tmp_pdf.unlink(missing_ok=True)
        raise
    os.replace(tmp_manifest, manifest_path)
    os.replace(tmp_pdf, pdf_path)
    if store is not None:
        store.prune()
    revisions.keep_issued(project, manifest_path)
    return BuildResult(
        pdf_path,
        manifest_path,
        manifest,
        page_count,
        tuple(i.entry.path for i in executed if not i.from_cache),
        tuple(i.entry.path for i in executed if i.from_cache),
        False,
        time.perf_counter() - start,
        moved,
        warnings,
    )


def single_sheet_pdf(nb: Any, *, name: str = "sheet") -> bytes:
    """One executed notebook as a paginated PDF with the package layout (no project folder).

    Job fields come from the notebook's ``metadata.calcpack`` when present.
    """
    meta = dict(nb.metadata.get("calcpack", {}) or {})
    today = _dt.date.today()
    project = Project(
        path=Path(name).resolve(),
        job_number=str(meta.get("job_number", "—")),
        job_title=str(meta.get("job_title", name)),
        client=str(meta.get("client", "")),
        site=str(meta.get("site", "")),
        units=str(meta.get("units", "SI")),
        paper=str(meta.get("paper", "A4")),
        firm=str(meta.get("firm", "")),
        firm_address="",
        preparer=Person(str(meta.get("preparer", "—"))),
        checker=Person(str(meta.get("checker", "—"))),
        approver=Person(str(meta.get("approver", "—"))),
        revisions=(Revision(str(meta.get("revision", "—")), today, "Single sheet"),),
        sheets=(SheetEntry(str(meta.get("sheet_number", "1")), f"{name}.ipynb", None),),
        design=_single_design(),
    )
    from calcpack import __version__

    doc = prepare_sheet(project.sheets[0], nb)
    created = _dt.datetime(today.year, today.month, today.day, tzinfo=_dt.UTC)
    options = DocumentOptions(paper=project.paper, calcpack_version=__version__, sheets_only=True)
    layout = paginate(
        lambda counts: document_html(
            project, [doc], replace(options, sheet_pages=counts), created=created
        ),
        sheet_ids={doc.entry.path: "sheet-1"},
        section_ids=["sheet-1"],
        roles=(),
    )
    return write_pdf(layout, created=created, identifier_seed=name.encode())


def _single_design() -> Any:
    from calcpack.package.project import Design

    return Design(standards=())
