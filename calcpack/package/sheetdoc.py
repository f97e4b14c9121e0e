"""One sheet as a document: an executed notebook converted to HTML with its math as SVG and its
records read (:func:`prepare_sheet`), its page count laid out on its own
(:func:`count_sheet_pages`), and a single sheet as a PDF with the package layout
(:func:`single_sheet_pdf`).
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import re
from dataclasses import replace
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError
from calcpack.package.document import DocumentOptions, SheetDoc, document_html
from calcpack.package.execute import ExecutedSheet
from calcpack.package.layout_boxes import INNER_ANCHOR
from calcpack.package.mathcache import MathCache
from calcpack.package.paginate import paginate, write_pdf
from calcpack.package.project import Person, Project, Revision, SheetEntry
from calcpack.package.records import collect_records

__all__ = [
    "anchor_checks",
    "count_sheet_pages",
    "nest_headings",
    "prepare_sheet",
    "project_from_metadata",
    "sheet_title",
    "single_sheet_pdf",
    "unlink_absent",
]


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


_HEADING_TAG_RE = re.compile(r"<(/?)h([1-6])\b")


def nest_headings(body: str) -> str:
    """Number a sheet body's headings so that they nest under the sheet's own H1 without
    skipping a level: the first is an H2, and each is at most one level below the one before
    (a markdown ``#`` in a sheet, a ``Heading`` step, a block's title all take their place in
    one outline). The tag tree and the bookmarks read the same levels."""
    out: list[str] = []
    last = 1
    pos = 0
    open_level = 0
    for m in _HEADING_TAG_RE.finditer(body):
        out.append(body[pos : m.start()])
        pos = m.end()
        if m.group(1):  # a closing tag closes the heading last opened
            out.append(f"</h{open_level or m.group(2)}")
            continue
        open_level = max(2, min(int(m.group(2)), last + 1))
        last = open_level
        out.append(f"<h{open_level}")
    out.append(body[pos:])
    return "".join(out)


def prepare_sheet(
    entry: SheetEntry,
    executed: ExecutedSheet | Any,
    *,
    source: bool = False,
    math: MathCache,
) -> SheetDoc:
    """Convert one executed sheet to HTML with its math as SVG images, and read its records.

    ``source`` keeps the code cells (for the reviewer's copy); ``math`` is the run's formula
    cache (the build's, or the one a single sheet's export makes for itself).

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
        body = nest_headings(body)
        body = math_spans_to_images(body, math)
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
    records = collect_records(nb)
    body, anchors = anchor_checks(body, entry.path, len(records.checks))
    return SheetDoc(entry, title, body, records, cells, anchors)


_CHECK_DIV_RE = re.compile(r'<div class="cp-step cp-check(?: [^"]*)?"')


def anchor_checks(body: str, path: str, count: int) -> tuple[str, tuple[str, ...]]:
    """Give each check of a sheet's body an anchor, so the summary of checks can link to the
    check's own page.

    The body shows the checks in the order the records list them (both come from the same
    outputs, one record per check step); when the numbers differ, no anchor is added and the
    summary links to the sheet.

    Returns:
        the body and the anchors, one per check record.
    """
    found = len(_CHECK_DIV_RE.findall(body))
    if found != count or not count:
        return body, ()
    stem = hashlib.sha256(path.encode()).hexdigest()[:10]
    anchors = tuple(f"{INNER_ANCHOR}{stem}-{k}" for k in range(1, count + 1))
    names = iter(anchors)
    body = _CHECK_DIV_RE.sub(lambda m: f'{m.group(0)} id="{next(names)}"', body)
    return body, anchors


def count_sheet_pages(
    doc: SheetDoc,
    project: Project,
    options: DocumentOptions,
    created: _dt.datetime,
    math: MathCache,
) -> int:
    """The pages a sheet takes, laid out on its own.

    A sheet starts on a new page and its title block does not depend on the other sheets, so
    this is its page count in the package (the layout checks it all the same).
    """
    from calcpack.package.paginate import count_pages

    html = document_html(
        project,
        [doc],
        replace(options, sheets_only=True, sheet_pages={}),
        created=created,
        math=math,
    )
    return count_pages(html, ["sheet-1"], base_url=str(project.root))["sheet-1"]


def single_sheet_pdf(
    nb: Any, *, name: str = "sheet", project: Project | None = None, path: str | None = None
) -> bytes:
    """One executed notebook as a paginated PDF with the package layout.

    Job fields come from ``project`` (the project file found above the notebook) when given,
    the sheet's number and title from its entry there (``path``: the notebook's path relative
    to the project); otherwise from the notebook's ``metadata.calcpack`` when present.
    The formulas are typeset into a cache of this export's own (as a build has its own), so
    nothing typeset here is kept in the process after it.
    """
    meta = dict(nb.metadata.get("calcpack", {}) or {})
    today = _dt.date.today()
    if project is not None:
        listed = [s for s in project.sheets if s.path == path]
        entry = listed[0] if listed else SheetEntry("—", path or f"{name}.ipynb", None)
        project = replace(project, sheets=(entry,))
    else:
        project = project_from_metadata(meta, name, today)
    return _sheet_pdf(project, nb, name, today)


def project_from_metadata(meta: dict[str, Any], name: str, today: _dt.date) -> Project:
    """A stand-in project for a sheet outside any project: job fields from the notebook's
    ``metadata.calcpack`` ("—" where absent), one sheet named ``name``."""
    return Project(
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


def _sheet_pdf(project: Project, nb: Any, name: str, today: _dt.date) -> bytes:
    from calcpack import __version__

    math = MathCache()
    doc = prepare_sheet(project.sheets[0], nb, math=math)
    created = _dt.datetime(today.year, today.month, today.day, tzinfo=_dt.UTC)
    options = DocumentOptions(paper=project.paper, calcpack_version=__version__, sheets_only=True)
    layout = paginate(
        lambda counts: unlink_absent(
            document_html(
                project, [doc], replace(options, sheet_pages=counts), created=created, math=math
            )
        ),
        sheet_ids={doc.entry.path: "sheet-1"},
        section_ids=["sheet-1"],
        roles=(),
    )
    return write_pdf(layout, created=created, identifier_seed=name.encode())


_LINK_RE = re.compile(r'<a class="cp-link" href="#([^"]+)">(.*?)</a>', re.DOTALL)


def unlink_absent(html: str) -> str:
    """A sheet laid out on its own: links to another sheet (an imported value's source) become
    plain text, since the page they would name is not in this document (it would print
    "(page )")."""
    ids = set(re.findall(r'\bid="([^"]+)"', html))
    return _LINK_RE.sub(lambda m: m.group(0) if m.group(1) in ids else m.group(2), html)


def _single_design() -> Any:
    from calcpack.package.project import Design

    return Design(standards=())
