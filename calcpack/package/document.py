"""Assemble the package HTML: cover, contents, design basis, cautions, sheets, back matter.

Pure string assembly from typed inputs; the layout itself is the stylesheet in
``assets/calcpack.css``. Every page after the cover carries a running title block: each section
and sheet starts with its own ``.cp-titleblock`` element, which WeasyPrint repeats on the
section's following pages.
"""

from __future__ import annotations

import datetime as _dt
from collections.abc import Sequence
from dataclasses import dataclass, field
from math import isfinite
from typing import Any

from calcpack.contract.compare import Change
from calcpack.contract.records import SheetRecords
from calcpack.package.mathcache import MathCache
from calcpack.package.project import Person, Project, SheetEntry
from calcpack.package.titleblock import date_text, esc, person_date, revision_flag, titleblock
from calcpack.working.format import format_number
from calcpack.working.render import symbols_html

__all__ = [
    "ROLES",
    "STANDARD_CAUTIONS",
    "DocumentOptions",
    "ReviewRow",
    "RevisionMarks",
    "SheetDoc",
    "document_html",
    "format_sig",
]

ROLES = ("preparer", "checker", "approver")
ROLE_TITLES = {"preparer": "Prepared by", "checker": "Checked by", "approver": "Approved by"}

STANDARD_CAUTIONS = (
    "The results in this package follow from the inputs and assumptions stated in it and hold "
    "only while those inputs and assumptions hold.",
    "Every design provision cited must be confirmed against the edition of the code or standard "
    "adopted by the authority having jurisdiction where the work is built.",
    "This package must be reviewed, and sealed or signed, by an engineer licensed for the work "
    "under the rules of practice that apply before anyone relies on it.",
)


@dataclass(frozen=True)
class SheetDoc:
    """One sheet ready for layout."""

    entry: SheetEntry
    title: str
    body_html: str
    """The sheet's converted HTML, math already as images."""
    records: SheetRecords
    source_cells: tuple[tuple[int, str], ...] = ()
    """(1-based cell number, source) of every code cell, for the reviewer's appendix."""
    check_anchors: tuple[str, ...] = ()
    """The anchor of each of ``records.checks`` in ``body_html`` (the summary links to the
    check's own page); empty when the body's checks could not be matched to the records."""


@dataclass(frozen=True)
class ReviewRow:
    """One comment of the review log (the review file's format belongs to the review feature)."""

    ident: str
    sheet: str
    quantity: str
    status: str
    by: str
    date: str
    text: str


@dataclass(frozen=True)
class RevisionMarks:
    """What changed since the last issued revision: marks on sheets, lines in the history."""

    since: str | None = None
    """The issued revision the build compared with (None: no earlier revision was issued)."""
    changed: frozenset[str] = frozenset()
    """Paths of the sheets whose inputs, results or checks changed since then."""
    history: dict[str, tuple[str, tuple[Change, ...]]] = field(default_factory=dict)
    """Per revision: (the issued revision before it, what changed), for the revision history."""


@dataclass(frozen=True)
class DocumentOptions:
    """How to lay out the package."""

    paper: str = "A4"
    reviewer_copy: bool = False
    """Append the source of every sheet as an appendix."""
    sheet_pages: dict[str, int] = field(default_factory=dict)
    """Page count per sheet path, from a first layout pass (blank until known)."""
    calcpack_version: str = ""
    review: tuple[ReviewRow, ...] | None = None
    """The review log; None when the project has no review file."""
    sheets_only: bool = False
    """Only the sheets, no cover, front or back matter (one notebook through nbconvert)."""
    revisions: RevisionMarks = field(default_factory=RevisionMarks)
    """Sheets changed since the last issued revision, and the changes of each revision."""
    verifications: tuple[Any, ...] = ()
    """The checker's independent checks, compared (:class:`calcpack.package.verification
    .Compared`)."""


def format_sig(value: float | None, sig_figs: int = 3) -> str:
    """A number to ``sig_figs`` significant figures by the working's formatter (the one number
    formatter of a package), or a dash when there is none."""
    if value is None or not isfinite(value):
        return "—"
    return format_number(value, sig_figs)


def _css_string(text: str) -> str:
    """A CSS string literal, HTML-escaped for use inside a style attribute."""
    quoted = '"' + text.replace("\\", "\\\\").replace('"', '\\"').replace("\n", " ") + '"'
    return esc(quoted)


def _markdown(text: str, math: MathCache) -> str:
    from calcpack.package.convert import _cp_markdown
    from calcpack.package.mathsvg import math_spans_to_images

    return math_spans_to_images(_cp_markdown(text), math)


def _inline_markdown(text: str, math: MathCache) -> str:
    html = _markdown(text, math).strip()
    if html.startswith("<p>") and html.endswith("</p>") and html.count("<p>") == 1:
        html = html[3:-4]
    return html


def _engineer_row(project: Project) -> str:
    """The engineer of record in the cover's facts: name, licence number and jurisdiction from
    the project file, or room to write them in."""
    eor = project.engineer
    if eor is None:
        blank = '<span class="hint">name, licence number, jurisdiction</span>'
        return f"<tr><th>Engineer of record</th><td>{blank}</td></tr>"
    return (
        f"<tr><th>Engineer of record</th><td>{esc(eor.name)} &#183; licence number "
        f"{esc(eor.licence)} &#183; {esc(eor.jurisdiction)}</td></tr>"
    )


def _seal_box(project: Project) -> str:
    """The seal's box beside the signatures: the firm's image when the project file names one,
    else a blank square for the seal."""
    import base64

    from calcpack.package.project import SEAL_TYPES

    eor = project.engineer
    seal = '<div class="hint">Seal</div>'
    if eor is not None and eor.seal is not None:
        data = base64.b64encode(eor.seal.read_bytes()).decode("ascii")
        kind = SEAL_TYPES[eor.seal.suffix.lower()]
        alt = esc(f"Seal of {eor.name}, licence number {eor.licence}, {eor.jurisdiction}")
        seal = f'<img alt="{alt}" src="data:{kind};base64,{data}"/>'
    return (
        '<td class="cp-seal"><div class="role">Engineer of record</div>'
        f'<div class="sealbox">{seal}</div></td>'
    )


def _cover(project: Project, sheets: Sequence[SheetDoc], compared: Sequence[Any] = ()) -> str:
    from calcpack.package.summary import check_counts, counts_line
    from calcpack.package.verification_html import verified_line

    rev = project.revision
    standards = "<br>".join(esc(s) for s in project.design.standards)
    boxes = []
    for role in ROLES:
        person: Person = getattr(project, role)
        # The preparer's date defaults to the revision's; the others only show a date given.
        when = person_date(person, rev.date if role == "preparer" else None)
        boxes.append(f"""
<td><div class="role">{ROLE_TITLES[role]}</div>
<div class="who"><span class="lbl">Name</span>{esc(person.name)}</div>
<div class="who"><span class="lbl">Date</span>{esc(when) or "&#160;"}</div>
<div class="sig" id="cp-sign-{role}"><div class="hint">Signature</div></div></td>""")
    status = f" &#183; {esc(rev.status)}" if rev.status else ""
    return f"""
<section class="cp-cover" id="cover"><!--strings-->
<div class="band"><div><div class="firmname">{esc(project.firm or "")}</div>
<div class="firmaddr">{esc(project.firm_address)}</div></div>
<div class="doctype">Structural calculations<br>Job {esc(project.job_number)}</div></div>
<div class="kind cp-bm1" style="bookmark-label: 'Cover'">Calculation package</div>
<h1 class="title">{esc(project.job_title)}</h1>
<div class="jobno">Job {esc(project.job_number)} &#183; Revision {esc(rev.rev)}{status}</div>
<table class="facts">
<tr><th>Client</th><td>{esc(project.client)}</td></tr>
<tr><th>Site</th><td>{esc(project.site)}</td></tr>
<tr><th>Revision</th>
<td>{esc(rev.rev)} &#8212; {esc(date_text(rev.date))} &#8212; {esc(rev.description)}</td></tr>
<tr><th>Design standards</th><td>{standards}</td></tr>
{_engineer_row(project)}
<tr><th>Unit system</th><td>{esc(project.units)}</td></tr>
<tr><th>Extent</th><td>{len(sheets)} sheets, <span class="totalpages"></span> pages</td></tr>
<tr><th>Checks</th><td>{esc(counts_line(check_counts(sheets)))}</td></tr>
<tr><th>Independent checks</th><td>{esc(verified_line(sheets, compared))}</td></tr>
</table>
<div class="cp-signoff"><div class="heading">Sign-off</div>
<table><tr>{"".join(boxes)}{_seal_box(project)}</tr></table>
<div class="note">The package is issued when it carries the signatures of all three roles. Digital
signatures embedded in this file take precedence over any printed or scanned copy.</div>
</div>
</section>"""


def _toc(
    project: Project,
    sheets: Sequence[SheetDoc],
    back: Sequence[tuple[str, str]],
    front: Sequence[tuple[str, str]],
    changed: frozenset[str] = frozenset(),
) -> str:
    items = ['<li class="group">Front matter</li>']
    items += [
        f'<li><span class="no"></span><a href="#{ident}">{esc(t)}</a></li>' for ident, t in front
    ]
    items.append('<li class="group">Calculation sheets</li>')
    for i, sheet in enumerate(sheets, start=1):
        flag = " " + revision_flag(project.revision.rev) if sheet.entry.path in changed else ""
        items.append(
            f'<li><span class="no">{esc(sheet.entry.number)}</span>'
            f'<a href="#sheet-{i}">{esc(sheet.title)}{flag}</a></li>'
        )
    items.append('<li class="group">Back matter</li>')
    items += [
        f'<li><span class="no"></span><a href="#{ident}">{esc(t)}</a></li>' for ident, t in back
    ]
    return (
        titleblock(project, sheet_no="—", title="Contents", pages=None)
        + '<h1 class="cp-h cp-bm1">Contents</h1><ol class="cp-toc">'
        + "".join(items)
        + "</ol>"
    )


def _list(items: Sequence[str], ordered: bool = False) -> str:
    tag = "ol" if ordered else "ul"
    return f'<{tag} class="cp-list">' + "".join(f"<li>{i}</li>" for i in items) + f"</{tag}>"


def _design_basis(project: Project, sheets: Sequence[SheetDoc], math: MathCache) -> str:
    d = project.design
    parts = [
        titleblock(project, sheet_no="—", title="Design basis", pages=None),
        '<h1 class="cp-h cp-bm1">Design basis</h1>',
    ]
    sheet_standards = [
        (s, sheet) for sheet in sheets for s in sheet.records.standards if s not in d.standards
    ]
    parts.append('<h2 class="cp-h">Design standards</h2>')
    parts.append(
        _list(
            [esc(s) for s in d.standards]
            + [
                f'{esc(s)} <span class="cpd-src">(sheet {esc(sheet.entry.number)})</span>'
                for s, sheet in sheet_standards
            ]
        )
    )
    if d.materials:
        parts.append(
            '<h2 class="cp-h">Materials</h2>'
            + _list([_inline_markdown(m, math) for m in d.materials])
        )
    if d.loads:
        parts.append(
            '<h2 class="cp-h">Loads</h2>' + _list([_inline_markdown(m, math) for m in d.loads])
        )
    if d.basis:
        parts.append('<h2 class="cp-h">Basis of design</h2>' + _markdown(d.basis, math))
    return "".join(parts)


def _gathered(
    general: Sequence[str], sheets: Sequence[SheetDoc], field_name: str, math: MathCache
) -> list[str]:
    """Each text once, in first-seen order, with the sheets that declare it: a caution every
    sheet of one standard carries is said once, "(sheets 1, 2, 4)"."""
    seen: dict[str, list[str]] = {}
    for text in general:
        seen.setdefault(text, [])
    for sheet in sheets:
        for text in getattr(sheet.records, field_name):
            where = seen.setdefault(text, [])
            if sheet.entry.number not in where and (where or text not in general):
                where.append(sheet.entry.number)
    out = []
    for text, where in seen.items():
        tag = ""
        if where:
            label = "sheet" if len(where) == 1 else "sheets"
            tag = f' <span class="cpd-src">({label} {esc(", ".join(where))})</span>'
        out.append(_inline_markdown(text, math) + tag)
    return out


def _assumptions(project: Project, sheets: Sequence[SheetDoc], math: MathCache) -> str:
    assumptions = _gathered(project.design.assumptions, sheets, "assumptions", math)
    standard = [esc(c) for c in STANDARD_CAUTIONS]
    cautions = standard + _gathered(project.design.cautions, sheets, "cautions", math)
    body = (
        _list(assumptions, ordered=True)
        if assumptions
        else ('<p class="cp-empty">No assumptions were declared.</p>')
    )
    return (
        titleblock(project, sheet_no="—", title="Assumptions and cautions", pages=None)
        + '<h1 class="cp-h cp-bm1">Assumptions and cautions</h1>'
        + '<h2 class="cp-h">Assumptions</h2>'
        + body
        + '<div class="cp-cautions" id="cautions"><div class="cp-cautions-title">Cautions</div>'
        + _list(cautions, ordered=True)
        + '<div class="cp-boxend"></div></div>'
    )


def _summary(project: Project, sheets: Sequence[SheetDoc]) -> str:
    from calcpack.package.summary import summary_html

    return (
        titleblock(project, sheet_no="—", title="Summary of checks", pages=None)
        + '<h1 class="cp-h cp-bm1">Summary of checks</h1>'
        + summary_html(sheets)
    )


MAX_CHANGES_PER_SHEET = 8
"""The revision history lists this many changes of a sheet, then counts the rest."""


def _change_text(change: Change) -> str:
    if change.kind == "sheet":
        return esc(change.name)
    what = {"input": "input", "result": "result", "check": "check"}.get(change.kind, change.kind)
    old = esc(change.old) if change.old is not None else "(none)"
    new = esc(change.new) if change.new is not None else "(removed)"
    verdict = " <b>verdict changed</b>" if change.verdict_changed else ""
    note = f" <i>({esc(change.note())})</i>" if change.note() else ""
    return f"{what} {esc(change.name)}: {old} &#8594; {new}{verdict}{note}"


def _revision_changes(since: str, changes: Sequence[Change]) -> str:
    """Under a revision: the sheets changed since the issued revision before it, and how."""
    if not changes:
        nothing = f"No input, result or check changed since revision {esc(since)}."
        return f'<p class="cp-empty">{nothing}</p>'
    by_sheet: dict[str, list[Change]] = {}
    for change in changes:
        if change.shown:  # an imported copy is listed at the value it copies
            by_sheet.setdefault(change.sheet, []).append(change)
    items = []
    for sheet, found in by_sheet.items():
        shown = "; ".join(_change_text(c) for c in found[:MAX_CHANGES_PER_SHEET])
        more = len(found) - MAX_CHANGES_PER_SHEET
        if more > 0:
            shown += f"; and {more} more"
        items.append(f"<li><b>Sheet {esc(sheet)}</b> &#8212; {shown}</li>")
    return (
        f'<div class="cp-revsince">Sheets changed since revision {esc(since)}:</div>'
        f'<ul class="cp-revchanges">{"".join(items)}</ul>'
    )


def _revisions(project: Project, marks: RevisionMarks) -> str:
    rows = []
    for rev in project.revisions:
        cls = ' class="current"' if rev is project.revision else ""
        # The revision being built is issued by its signatures; its flag changes no page.
        issued = " (issued)" if rev.issued and rev is not project.revision else ""
        rows.append(
            f"<tr{cls}><td>{esc(rev.rev)}</td><td>{esc(date_text(rev.date))}</td>"
            f"<td>{esc(rev.description)}</td><td>{esc(rev.status)}{issued}</td></tr>"
        )
        if rev.rev in marks.history:
            since, changes = marks.history[rev.rev]
            rows.append(
                f'<tr class="cp-revdetail"><td></td><td colspan="3">'
                f"{_revision_changes(since, changes)}</td></tr>"
            )
    return (
        titleblock(project, sheet_no="—", title="Revision history", pages=None)
        + '<h1 class="cp-h cp-bm1">Revision history</h1>'
        + '<table class="cpd-table"><thead><tr><th>Rev</th><th>Date</th><th>Description</th>'
        + "<th>Status</th></tr></thead><tbody>"
        + "".join(rows)
        + "</tbody></table>"
    )


def _review(project: Project, review: tuple[ReviewRow, ...] | None) -> str:
    head = (
        titleblock(project, sheet_no="—", title="Review log", pages=None)
        + '<h1 class="cp-h cp-bm1">Review log</h1>'
    )
    if review is None:
        return head + '<p class="cp-empty">No review record is held with this project.</p>'
    if not review:
        return head + '<p class="cp-empty">The review record holds no comments.</p>'
    rows = "".join(
        f"<tr><td>{esc(r.ident)}</td><td>{esc(r.sheet)}</td><td>{symbols_html(esc(r.quantity))}</td>"
        f"<td>{symbols_html(esc(r.text))}</td><td>{esc(r.by)}</td><td>{esc(r.date)}</td><td>{esc(r.status)}</td></tr>"
        for r in review
    )
    return (
        head + '<table class="cpd-table"><thead><tr><th>No.</th><th>Sheet</th>'
        "<th>Quantity</th><th>Comment</th><th>By</th><th>Date</th><th>Status</th></tr>"
        "</thead><tbody>" + rows + "</tbody></table>"
    )


def _appendix(project: Project, sheets: Sequence[SheetDoc]) -> str:
    parts = [
        titleblock(project, sheet_no="—", title="Appendix: sheet source", pages=None),
        '<h1 class="cp-h cp-bm1">Appendix: sheet source</h1>',
    ]
    for sheet in sheets:
        parts.append(
            f'<h2 class="cp-h">Sheet {esc(sheet.entry.number)}: {esc(sheet.title)} '
            f'<span class="cpd-src">({esc(sheet.entry.path)})</span></h2>'
            '<div class="cp-source">'
        )
        for number, source in sheet.source_cells:
            parts.append(f'<div class="cell-no">Cell {number}</div><pre>{esc(source)}</pre>')
        parts.append("</div>")
    return "".join(parts)


def page_name(index: int) -> str:
    """The CSS named page of the ``index``-th sheet (1-based)."""
    return f"sheet{index}"


def document_html(
    project: Project,
    sheets: Sequence[SheetDoc],
    options: DocumentOptions,
    *,
    created: _dt.datetime,
    math: MathCache,
) -> str:
    """The whole package as one HTML document for WeasyPrint; formulas of the front matter
    (materials, loads, basis, assumptions) are typeset into ``math``, the run's own cache."""
    from calcpack.package.convert import package_css
    from calcpack.package.verification_html import verification_html

    front = [("design-basis", "Design basis"), ("assumptions", "Assumptions and cautions")]
    back = [
        ("summary", "Summary of checks"),
        ("verification", "Verification by the checker"),
        ("revisions", "Revision history"),
        ("review-log", "Review log"),
    ]
    if options.reviewer_copy:
        back.append(("appendix-source", "Appendix: sheet source"))
    size = "A4" if options.paper == "A4" else "letter"
    rules = [f"@page {{ size: {size}; }}"]
    for i in range(1, len(sheets) + 1):
        rules.append(f"@page :nth(1 of {page_name(i)}) {{ counter-reset: sheetpage 0; }}")
    stamp = created.isoformat()
    rev = project.revision
    issue = f"Job {project.job_number} · Rev {rev.rev}" + (f" · {rev.status}" if rev.status else "")
    firmline = " · ".join(p for p in (project.firm, project.firm_address) if p)
    out = [
        '<!DOCTYPE html><html lang="en"><head><meta charset="utf-8">',
        f"<title>{esc(project.job_number)} {esc(project.job_title)} — calculations, revision "
        f"{esc(rev.rev)}</title>",
        f'<meta name="author" content="{esc(project.firm or project.preparer.name)}">',
        f'<meta name="description" content="Structural calculations, job {esc(project.job_number)}'
        f', revision {esc(rev.rev)}">',
        f'<meta name="keywords" content="calculation package, {esc(project.job_number)}">',
        f'<meta name="generator" content="calcpack {esc(options.calcpack_version)}">',
        f'<meta name="dcterms.created" content="{stamp}">',
        f'<meta name="dcterms.modified" content="{stamp}">',
        "<style>",
        package_css(),
        "\n".join(rules),
        "</style></head><body>",
    ]
    strings = (
        f'<div class="cp-strings" data-firm="{esc(firmline)}" data-issue="{esc(issue)}"></div>'
    )

    if not options.sheets_only:
        out += [
            _cover(project, sheets, options.verifications).replace("<!--strings-->", strings),
            '<section class="cp-section cp-front" id="contents">',
            _toc(project, sheets, back, front, options.revisions.changed),
            "</section>",
            '<section class="cp-section cp-front" id="design-basis">',
            _design_basis(project, sheets, math),
            "</section>",
            '<section class="cp-section cp-front" id="assumptions">',
            _assumptions(project, sheets, math),
            "</section>",
        ]
    for i, sheet in enumerate(sheets, start=1):
        pages = options.sheet_pages.get(sheet.entry.path, 0)
        out.append(
            f'<section class="cp-sheet" id="sheet-{i}" style="page: {page_name(i)}">'
            + (strings if options.sheets_only and i == 1 else "")
            + titleblock(
                project,
                sheet_no=sheet.entry.number,
                title=sheet.title,
                pages=pages,
                changed=sheet.entry.path in options.revisions.changed,
            )
            + f'<div class="cp-sheet-head"><span class="no">Sheet {esc(sheet.entry.number)}</span>'
            f'<h1 class="cp-bm1" style="bookmark-label: '
            f'{_css_string(f"Sheet {sheet.entry.number} — {sheet.title}")}">'
            f"{esc(sheet.title)}</h1></div>"
            f'<div class="cp-sheet-body">{sheet.body_html}</div></section>'
        )
    if options.sheets_only:
        out.append("</body></html>")
        return "\n".join(out)
    out += [
        '<section class="cp-section cp-back" id="summary">',
        _summary(project, sheets),
        "</section>",
        '<section class="cp-section cp-back" id="verification">',
        titleblock(project, sheet_no="—", title="Verification by the checker", pages=None),
        verification_html(sheets, options.verifications),
        "</section>",
        '<section class="cp-section cp-back" id="revisions">',
        _revisions(project, options.revisions),
        "</section>",
        '<section class="cp-section cp-back" id="review-log">',
        _review(project, options.review),
        "</section>",
    ]
    if options.reviewer_copy:
        out += [
            '<section class="cp-section cp-back" id="appendix-source">',
            _appendix(project, sheets),
            "</section>",
        ]
    out.append("</body></html>")
    return "\n".join(out)
