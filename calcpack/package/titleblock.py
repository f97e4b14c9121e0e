"""The running title block of every page after the cover, and the small HTML helpers the
package's pages share (escaping, dates).

Each section and sheet of the package starts with its own ``.cp-titleblock`` element, which
WeasyPrint repeats on the section's following pages; its look is the stylesheet's
(``assets/calcpack.css``).
"""

from __future__ import annotations

import datetime as _dt
from html import escape
from typing import Any

from calcpack.package.project import Person, Project

__all__ = [
    "LONG_NAME",
    "date_text",
    "esc",
    "name_cell",
    "person_date",
    "revision_flag",
    "titleblock",
]


def esc(text: Any) -> str:
    """``text`` as HTML text or attribute value (quotes escaped too)."""
    return escape(str(text), quote=True)


def date_text(value: _dt.date | None) -> str:
    """An ISO date (YYYY-MM-DD), or nothing when there is none."""
    return value.isoformat() if value else ""


def person_date(person: Person, fallback: _dt.date | None) -> str:
    """The date a person signed, else ``fallback`` (the revision's date for the preparer)."""
    return date_text(person.date or fallback)


LONG_NAME = 16
"""Names longer than this (characters) are set smaller in the title block's narrow cells."""


def name_cell(name: str) -> str:
    """A person's name for a narrow title block cell: wraps, and long names are set smaller."""
    size = " long" if len(name) > LONG_NAME else ""
    return f'<span class="val name{size}">{esc(name)}</span>'


def revision_flag(rev: str) -> str:
    """The mark of a sheet changed in revision ``rev``: a triangle and the words (searchable)."""
    return f'<span class="cp-revflag">changed at {esc(rev)}</span>'


def titleblock(
    project: Project, *, sheet_no: str, title: str, pages: int | None, changed: bool = False
) -> str:
    """The title block heading a section or sheet: firm, job, revision, sheet number and title,
    preparer and checker, and page numbers (``pages`` None: a dash; 0: not yet known, from the
    first layout pass; ``changed``: the sheet is marked as changed in this revision)."""
    rev = project.revision
    flag = revision_flag(rev.rev) if changed else ""
    rev_date = esc(date_text(rev.date))
    firm = project.firm or "Structural calculations"
    sheet_page = (
        f'sheet <span class="cp-sheetpage" data-pages="{pages}"></span>' if pages else "&#8212;"
    )
    if pages == 0:
        sheet_page = 'sheet <span class="cp-sheetpage" data-pages="00"></span>'
    return f"""
<div class="cp-titleblock"><table>
<colgroup><col style="width:21%"><col style="width:9%"><col style="width:34%">
<col style="width:12%"><col style="width:12%"><col style="width:12%"></colgroup>
<tr>
<td class="firm" rowspan="2"><div class="firmname">{esc(firm)}</div>
<div class="firmsub">{esc(project.firm_address)}</div></td>
<td><span class="lbl">Job no.</span><span class="val">{esc(project.job_number)}</span></td>
<td colspan="3"><span class="lbl">Job title</span>
<span class="val wrap">{esc(project.job_title)}</span></td>
<td><span class="lbl">Revision</span>
<span class="val">{esc(rev.rev)}</span><span class="sub">{rev_date}</span>{flag}</td>
</tr>
<tr>
<td><span class="lbl">Sheet no.</span><span class="val">{esc(sheet_no)}</span></td>
<td><span class="lbl">Sheet title</span><span class="val wrap">{esc(title)}</span></td>
<td><span class="lbl">By &#183; date</span>{name_cell(project.preparer.name)}
<span class="lbl">{esc(person_date(project.preparer, rev.date))}</span></td>
<td><span class="lbl">Checked &#183; date</span>{name_cell(project.checker.name)}
<span class="lbl">{esc(person_date(project.checker, None))}</span></td>
<td class="pg"><span class="lbl">Page</span><span class="val">{sheet_page}</span>
<span class="sub">package <span class="cp-pkgpage"></span></span></td>
</tr>
</table></div>"""
