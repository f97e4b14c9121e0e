"""The package's summary of checks: every check, worst first, with the members' checklist items
that no check meets listed as NOT COVERED, and the checklists themselves item by item.

Reads the sheets' records only. The cover's count of checks comes from :func:`check_counts`, so
the cover and the summary never disagree.
"""

from __future__ import annotations

from collections.abc import Sequence
from html import escape
from typing import TYPE_CHECKING, Any

from calcpack.checks.checklists import ItemStatus, resolve_checklists
from calcpack.contract.verdict import Verdict, check_sort_key

if TYPE_CHECKING:
    from calcpack.package.document import SheetDoc

__all__ = ["check_counts", "checklist_status", "summary_entries", "summary_html"]

VERDICTS = ("OK", "NOT OK", "NOT COVERED")


def _e(text: Any) -> str:
    return escape(str(text), quote=True)


def checklist_status(sheets: Sequence[SheetDoc]) -> list[ItemStatus]:
    """Every checklist item the sheets declare, resolved against every check of the package."""
    checks = [(s.entry.number, c) for s in sheets for c in s.records.checks]
    declared = [(s.entry.number, c) for s in sheets for c in s.records.checklists]
    return resolve_checklists(declared, checks)


def _uncovered_row(status: ItemStatus) -> dict[str, Any]:
    return {
        "name": status.item,
        "member": status.member,
        "demand": None,
        "capacity": None,
        "unit": "",
        "utilisation": None,
        "verdict": "NOT COVERED",
        "ref": f"checklist, {status.member_type}: {status.detail}",
        "combination": None,
        "description": status.detail,
        "checklist": True,
    }


def summary_entries(sheets: Sequence[SheetDoc]) -> list[tuple[str, dict[str, Any]]]:
    """(sheet number, check) for every check of the package and every checklist item NOT
    COVERED, worst first."""
    entries = [(s.entry.number, c) for s in sheets for c in s.records.checks]
    entries += [
        (st.sheet, _uncovered_row(st))
        for st in checklist_status(sheets)
        if st.status == "NOT COVERED"
    ]
    entries.sort(key=lambda item: check_sort_key(item[1]))
    return entries


def check_counts(sheets: Sequence[SheetDoc]) -> dict[str, int]:
    """Counts for the cover and the summary: ``checks`` (all rows), each verdict, and
    ``checklist`` (the NOT COVERED rows that are checklist items)."""
    entries = summary_entries(sheets)
    counts = {v: sum(1 for _, c in entries if c["verdict"] == v) for v in VERDICTS}
    counts["checks"] = len(entries)
    counts["checklist"] = sum(1 for _, c in entries if c.get("checklist"))
    return counts


def counts_line(counts: dict[str, int]) -> str:
    """ "12 checks: 9 OK, 0 NOT OK, 3 NOT COVERED (2 checklist items)"."""
    extra = ""
    if counts["checklist"]:
        n = counts["checklist"]
        extra = f" ({n} checklist item{'s' if n != 1 else ''} not met)"
    return (
        f"{counts['checks']} checks: {counts['OK']} OK, {counts['NOT OK']} NOT OK, "
        f"{counts['NOT COVERED']} NOT COVERED{extra}"
    )


def _verdict(verdict: str) -> str:
    cls = {"OK": "ok", "NOT OK": "notok"}.get(str(Verdict.parse(verdict)), "nc")
    return f'<span class="cpd-verdict {cls}">{_e(verdict)}</span>'


def _checklists_html(statuses: Sequence[ItemStatus]) -> str:
    if not statuses:
        return (
            '<p class="cp-empty">No sheet declares a member checklist, so the NOT COVERED '
            "count above holds only the checks the sheets themselves record.</p>"
        )

    def status(st: ItemStatus) -> str:
        return _verdict(st.status) if st.status == "NOT COVERED" else _e(st.status)

    rows = "".join(
        f"<tr><td>{_e(st.sheet)}</td><td>{_e(st.member)}</td><td>{_e(st.member_type)}</td>"
        f"<td>{_e(st.item)}</td><td>{status(st)}</td><td>{_e(st.detail)}</td></tr>"
        for st in statuses
    )
    return (
        '<h2 class="cp-h">Member checklists</h2>'
        "<p>What a checker expects to see checked for each member type (common practice, or the "
        "firm's own list): each item is met by a check in the package, declared not "
        "applicable with the reason, or NOT COVERED.</p>"
        '<table class="cpd-table"><thead><tr><th>Sheet</th><th>Member</th><th>Type</th>'
        "<th>Item</th><th>Status</th><th>Met by, or reason</th></tr></thead><tbody>"
        + rows
        + "</tbody></table>"
    )


def summary_html(sheets: Sequence[SheetDoc]) -> str:
    """The summary's body (after its title block and heading)."""
    from calcpack.package.document import format_sig

    entries = summary_entries(sheets)
    rows = []
    for number, c in entries:
        u = c.get("utilisation")
        bar = ""
        if u is not None:
            width = min(u, 1.5) / 1.5 * 14
            over = " over" if u > 1 else ""
            bar = f' <span class="cpd-ubar{over}" style="width:{width:.1f}mm"></span>'
        unit = f" {_e(c['unit'])}" if c.get("unit") else ""
        rows.append(
            f"<tr><td>{_e(number)}</td><td>{_e(c.get('member') or '')}</td>"
            f"<td>{_e(c['name'])}</td><td>{_e(c.get('combination') or '')}</td>"
            f'<td class="num">{format_sig(c.get("demand"))}{unit}</td>'
            f'<td class="num">{format_sig(c.get("capacity"))}{unit}</td>'
            f'<td class="num">{"—" if u is None else f"{u:.2f}"}{bar}</td>'
            f"<td>{_verdict(c['verdict'])}</td><td>{_e(c.get('ref') or '')}</td></tr>"
        )
    if rows:
        table = (
            '<table class="cpd-table"><thead><tr><th>Sheet</th><th>Member</th><th>Check</th>'
            "<th>Combination</th><th>Demand</th><th>Capacity</th><th>Utilisation</th>"
            "<th>Verdict</th><th>Reference</th></tr></thead><tbody>"
            + "".join(rows)
            + "</tbody></table>"
        )
    else:
        table = '<p class="cp-empty">The sheets record no design checks.</p>'
    line = f"<p>{_e(counts_line(check_counts(sheets)))}. Worst first.</p>"
    return line + table + _checklists_html(checklist_status(sheets))
