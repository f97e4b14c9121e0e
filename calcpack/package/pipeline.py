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
from calcpack.package import freshness, links, publish, verification
from calcpack.package.bodies import (
    ConvertedSheet,
    convert_sheet,
    fill_bodies,
    prepare_in_worker,
)
from calcpack.package.document import (
    ROLES,
    DocumentOptions,
    ReviewRow,
    SheetDoc,
    document_html,
)
from calcpack.package.execute import (
    CACHE_DIR_NAME,
    DEFAULT_CELL_TIMEOUT_S,
    ExecutedSheet,
    execute_sheets,
    sheet_cache_key,
    worker_pool,
)
from calcpack.package.interrupt import clean_stale_temp, temp_prefix
from calcpack.package.manifest import dependency_versions, project_files, sheet_record
from calcpack.package.mathcache import MathCache
from calcpack.package.paginate import ChunkStore, Layout, PdfAttachment, paginate, write_pdf
from calcpack.package.project import Project, load_project
from calcpack.package.sheetdoc import prepare_sheet, sheet_title, single_sheet_pdf

__all__ = [
    "BuildContext",
    "BuildResult",
    "ConvertedSheets",
    "SheetTime",
    "build",
    "build_created",
    "prepare_sheet",
    "sheet_title",
    "single_sheet_pdf",
]

Reporter = Callable[[str, str], None]
"""Progress hook: (stage, detail), stage in executing/cached/executed/rendering/layout/writing."""


@dataclass(frozen=True)
class SheetTime:
    """When one sheet's execution started and finished (seconds since the epoch, comparable
    between the build's workers; a sheet read from the cache has both at the moment it was
    read)."""

    path: str
    started_at: float
    finished_at: float
    from_cache: bool


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
    timeline: tuple[SheetTime, ...] = ()
    """Each sheet's execution, in the order the build ran them (empty when up to date)."""


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
                text=o.describe(),
            )
        )
    return tuple(rows), path


def _safe_name(text: str) -> str:
    return re.sub(r"[^A-Za-z0-9._-]+", "-", text).strip("-") or "package"


def _atomic_write(path: Path, data: bytes) -> Path:
    """Write to a temporary file in the same folder; the caller moves it into place."""
    prefix = publish.output_temp_prefix(path)
    handle, tmp = tempfile.mkstemp(dir=path.parent, prefix=prefix, suffix=".tmp")
    with os.fdopen(handle, "wb") as out:
        out.write(data)
        out.flush()
        os.fsync(out.fileno())
    return Path(tmp)


def _sheet_ids(docs: list[SheetDoc]) -> dict[str, str]:
    """Sheet path -> the id of its section in the document."""
    return {doc.entry.path: f"sheet-{i}" for i, doc in enumerate(docs, start=1)}


@dataclass(frozen=True)
class BuildContext:
    """Everything a build decided before any sheet runs: what every stage reads."""

    project: Project
    options: DocumentOptions
    created: _dt.datetime
    out: Path
    pdf_path: Path
    manifest_path: Path
    build_key: str
    """Hash of everything the package depends on (:func:`freshness.build_key`)."""
    code_hash: str
    previous: dict[str, Any]
    """The manifest of the package already in ``out`` ({} if none)."""
    review_file: Path | None
    workers: int
    timeout: float
    use_cache: bool
    supersede_signed: bool
    warnings: tuple[str, ...]
    report: Reporter | None = None

    @property
    def cache_dir(self) -> Path:
        return self.project.root / CACHE_DIR_NAME

    def say(self, stage: str, detail: str) -> None:
        if self.report:
            self.report(stage, detail)


def plan_build(
    location: str | Path,
    *,
    out_dir: str | Path | None,
    workers: int,
    timeout: float,
    use_cache: bool,
    paper: str | None,
    reviewer_copy: bool,
    report: Reporter | None,
    supersede_signed: bool,
) -> BuildContext:
    """Read the project and settle the build: options, date, output paths, build key."""
    timeout = publish.check_timeout(timeout)
    project = load_project(location)
    if paper is not None and paper not in ("A4", "Letter"):
        raise BuildError(f"Paper size must be 'A4' or 'Letter' (got paper = {paper!r})")
    from calcpack import __version__

    review, review_file = _load_review(project)
    options = DocumentOptions(
        paper=paper or project.paper,
        reviewer_copy=reviewer_copy,
        calcpack_version=__version__,
        review=review,
    )
    created = build_created(project)
    out = Path(out_dir) if out_dir is not None else project.root / "build"
    stem = _safe_name(f"{project.job_number}-calcs-rev{project.revision.rev}")
    if options.paper != project.paper:
        stem += f"-{options.paper.lower()}"
    manifest_path = out / f"{stem}.manifest.json"
    keys = [sheet_cache_key(project, s) for s in project.sheets]
    code_hash = freshness.package_code_hash()
    # temporaries of a build stopped between writing and moving its output (said as warnings)
    stale = publish.clean_stale_outputs(out)
    return BuildContext(
        project=project,
        options=options,
        created=created,
        out=out,
        pdf_path=out / f"{stem}.pdf",
        manifest_path=manifest_path,
        build_key=freshness.build_key(project, keys, options, review_file, created, code_hash),
        code_hash=code_hash,
        previous=freshness.previous_manifest(manifest_path),
        review_file=review_file,
        workers=workers,
        timeout=timeout,
        use_cache=use_cache,
        supersede_signed=supersede_signed,
        warnings=publish.placeholder_warnings(project) + stale,
        report=report,
    )


def is_current(ctx: BuildContext) -> bool:
    """Whether the package in the output folder was built from these very inputs."""
    built = ctx.previous.get("build", {}).get("build_key")
    return built == ctx.build_key and freshness.pair_intact(ctx.pdf_path, ctx.manifest_path)


@dataclass(frozen=True)
class ConvertedSheets:
    """The executed sheets and their documents, in project order."""

    executed: tuple[ExecutedSheet, ...]
    docs: tuple[SheetDoc, ...]
    sheet_pages: dict[str, int]
    """Sheet path -> its page count (counted on its own, or the previous build's)."""


def execute_and_convert(
    ctx: BuildContext,
    pool: concurrent.futures.Executor | None,
    bodies: Path,
    math: MathCache,
) -> ConvertedSheets:
    """Execute the sheets (unchanged ones from the cache) and convert each as soon as it is
    ready, in the pool when there is one; bodies go to files in ``bodies``."""
    project, options = ctx.project, ctx.options
    index = {sheet.path: i for i, sheet in enumerate(project.sheets)}
    converting: dict[str, concurrent.futures.Future[ConvertedSheet]] = {}
    converted: dict[str, ConvertedSheet] = {}
    # Page counts: a sheet the previous build had keeps its count as the guess; a new one
    # is counted on its own as it is converted, so a first build lays out once, not twice.
    known_pages = freshness.known_sheet_pages(ctx.previous, options)
    math_file = str(ctx.cache_dir / "formulas.entry") if ctx.use_cache else None

    def convert(item: ExecutedSheet) -> None:
        ctx.say("rendering", item.entry.path)
        n = index[item.entry.path]
        count = None if item.entry.path in known_pages else (project, options, ctx.created)
        source = options.reviewer_copy
        if pool is None:
            converted[item.entry.path] = convert_sheet(item, source, n, bodies, count, math)
        else:
            converting[item.entry.path] = pool.submit(
                prepare_in_worker, item, source, math_file, n, str(bodies), count
            )

    exports_dir = bodies / "exports"
    executed = execute_sheets(
        project,
        workers=ctx.workers,
        timeout=ctx.timeout,
        use_cache=ctx.use_cache,
        progress=lambda stage, sheet: ctx.say(stage, sheet.path),
        pool=pool,
        on_ready=convert,
        exports_dir=exports_dir,
    )
    # JupyterLab's imports read the values of the latest build (calcpack.working.links).
    links.publish_exports(exports_dir, ctx.cache_dir / "exports")
    sheet_pages = dict(known_pages)
    docs = []
    for item in executed:
        path = item.entry.path
        done = converting.pop(path).result() if path in converting else converted.pop(path)
        if done.pages is not None:
            sheet_pages[path] = done.pages
        docs.append(done.into(math))
    return ConvertedSheets(tuple(executed), tuple(docs), sheet_pages)


def lay_out(
    ctx: BuildContext,
    sheets: ConvertedSheets,
    options: DocumentOptions,
    pool: concurrent.futures.Executor | None,
    bodies: Path,
    store: ChunkStore | None,
    math: MathCache,
) -> Layout:
    """Paginate the package (see :func:`calcpack.package.paginate.paginate`).

    The sheets carry placeholders for their bodies, which wait in files in ``bodies`` (see
    :mod:`calcpack.package.bodies`) and are filled in chunk by chunk. Formulas of the
    front matter are typeset into the build's ``math``.
    """
    docs = list(sheets.docs)
    sheet_ids = _sheet_ids(docs)
    section_ids = [
        "cover",
        "contents",
        "design-basis",
        "assumptions",
        *sheet_ids.values(),
        "summary",
        "verification",
        "revisions",
        "review-log",
    ]
    if options.reviewer_copy:
        section_ids.append("appendix-source")
    ctx.say("layout", f"{len(docs)} sheets")
    project, created = ctx.project, ctx.created
    return paginate(
        lambda counts: document_html(
            project, docs, replace(options, sheet_pages=counts), created=created, math=math
        ),
        sheet_ids=sheet_ids,
        section_ids=section_ids,
        roles=ROLES,
        base_url=str(project.root),
        guess=freshness.page_guess(ctx.previous, sheets.sheet_pages, sheet_ids, options),
        pool=pool,
        fill=functools.partial(fill_bodies, bodies),
        store=store,
    )


def make_manifest(
    ctx: BuildContext,
    sheets: ConvertedSheets,
    layout: Layout,
    compared: tuple[Any, ...],
    review_file: Path | None,
) -> Manifest:
    """The build's manifest: versions, project, files, each sheet's records and pages, the
    links between sheets, the checker's comparisons, the signature boxes and the sections."""
    from calcpack import __version__

    sheet_ids = _sheet_ids(list(sheets.docs))
    project = ctx.project
    return Manifest(
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
            for doc, item in zip(sheets.docs, sheets.executed, strict=True)
        ),
        links=tuple(
            link
            for doc in sheets.docs
            for link in links.link_records(doc.entry.path, doc.records.imports)
        ),
        verifications=tuple(c.to_json() for c in compared),
        signature_fields=tuple(layout.signature_fields),
        sections={k: list(v) for k, v in layout.section_pages.items()},
        build={
            "created": ctx.created.isoformat(),
            "paper": ctx.options.paper,
            "reviewer_copy": ctx.options.reviewer_copy,
            "pages": layout.page_count,
            "build_key": ctx.build_key,
        },
    )


def write_package(ctx: BuildContext, pdf: bytes, manifest: bytes) -> Path | None:
    """Put the PDF and its manifest in place, both or neither (a signed package they replace
    is moved aside only with ``supersede_signed``); where a replaced signed package went."""
    ctx.out.mkdir(parents=True, exist_ok=True)
    tmp_manifest = _atomic_write(ctx.manifest_path, manifest)
    try:
        tmp_pdf = _atomic_write(ctx.pdf_path, pdf)
    except BaseException:
        tmp_manifest.unlink(missing_ok=True)
        raise
    try:
        moved = publish.make_way(ctx.pdf_path, ctx.manifest_path, supersede=ctx.supersede_signed)
    except BaseException:
        tmp_manifest.unlink(missing_ok=True)
        tmp_pdf.unlink(missing_ok=True)
        raise
    os.replace(tmp_manifest, ctx.manifest_path)
    os.replace(tmp_pdf, ctx.pdf_path)
    return moved


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
    ctx = plan_build(
        location,
        out_dir=out_dir,
        workers=workers,
        timeout=timeout,
        use_cache=use_cache,
        paper=paper,
        reviewer_copy=reviewer_copy,
        report=report,
        supersede_signed=supersede_signed,
    )
    project = ctx.project
    # Revision comparison (calcpack.package.revisions): the marks depend on the kept manifests.
    from calcpack.package import revisions

    if is_current(ctx) and (not force or publish.signatures_in(ctx.pdf_path)):
        revisions.keep_issued(project, ctx.manifest_path)
        return BuildResult(
            ctx.pdf_path,
            ctx.manifest_path,
            ctx.previous,
            int(ctx.previous.get("build", {}).get("pages", 0)),
            (),
            (),
            True,
            time.perf_counter() - start,
            warnings=ctx.warnings,
        )
    publish.check_output_folder(ctx.out)  # refuse at the door, before anything executes
    publish.check_notebooks(project)
    clean_stale_temp()  # folders a killed build left behind
    if not supersede_signed:
        publish.make_way(ctx.pdf_path, ctx.manifest_path, supersede=False)

    math = MathCache()
    math_file = ctx.cache_dir / "formulas.entry"
    # Chunks of the layout kept between builds: a rebuild lays out only the changed ones.
    store = ChunkStore(ctx.cache_dir / "layout", ctx.code_hash) if use_cache else None
    if use_cache:
        math.load(math_file)
    math.start()
    with contextlib.ExitStack() as stack:
        # One pool of workers for the whole build: executing, converting and laying out.
        # (The bodies' folder goes after the pool has stopped: no worker is still writing.)
        bodies = Path(
            stack.enter_context(tempfile.TemporaryDirectory(prefix=temp_prefix("bodies")))
        )
        pool = stack.enter_context(worker_pool(workers))
        sheets = execute_and_convert(ctx, pool, bodies, math)
        docs = list(sheets.docs)
        compared, opened = verification.check_stage(project, docs)  # the checker's checks
        review, review_file = ctx.options.review, ctx.review_file
        if opened:  # disagreements became open review comments
            review, review_file = _load_review(project)
        options = replace(
            ctx.options,
            revisions=revisions.compare_with_issued(project, docs),
            review=review,
            verifications=compared,
        )
        layout = lay_out(ctx, sheets, options, pool, bodies, store, math)
    if use_cache:
        math.save(math_file)
    manifest = make_manifest(ctx, sheets, layout, compared, review_file).to_json()
    data = manifest_bytes(manifest)
    ctx.say("writing", ctx.pdf_path.name)
    pdf = write_pdf(
        layout,
        created=ctx.created,
        attachments=[
            PdfAttachment(MANIFEST_NAME, data, "calcpack build manifest: inputs, versions, results")
        ],
        identifier_seed=ctx.build_key.encode(),
    )
    page_count = layout.page_count
    del layout  # the laid-out document is the largest thing a build holds
    moved = write_package(ctx, pdf, data)
    if store is not None:
        store.prune()
    revisions.keep_issued(project, ctx.manifest_path)
    return BuildResult(
        ctx.pdf_path,
        ctx.manifest_path,
        manifest,
        page_count,
        tuple(i.entry.path for i in sheets.executed if not i.from_cache),
        tuple(i.entry.path for i in sheets.executed if i.from_cache),
        False,
        time.perf_counter() - start,
        moved,
        ctx.warnings,
        tuple(
            SheetTime(i.entry.path, i.started_at, i.finished_at, i.from_cache)
            for i in sorted(sheets.executed, key=lambda i: i.started_at)
        ),
    )
