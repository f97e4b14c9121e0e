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
from calcpack.contract.verdict import Verdict, check_sort_key, is_classification, verdict_words

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
    entries = [
        (s.entry.number, _with_anchor(c, s.check_anchors, k))
        for s in sheets
        for k, c in enumerate(s.records.checks)
    ]
    entries += [
        (st.sheet, _uncovered_row(st))
        for st in checklist_status(sheets)
        if st.status == "NOT COVERED"
    ]
    entries.sort(key=lambda item: check_sort_key(item[1]))
    return entries


def _with_anchor(check: dict[str, Any], anchors: Sequence[str], k: int) -> dict[str, Any]:
    """The check with the anchor of its place on its sheet (``_anchor``), when known."""
    return {**check, "_anchor": anchors[k]} if k < len(anchors) else check


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
    """The verdict in words (the clause is in its own column): "satisfied", "NOT SATISFIED",
    "NOT COVERED" -- written, not coloured."""
    cls = {"OK": "ok", "NOT OK": "notok"}.get(str(Verdict.parse(verdict)), "nc")
    return f'<span class="cpd-verdict {cls}">{_e(verdict_words(verdict))}</span>'


def _checklists_html(statuses: Sequence[ItemStatus]) -> str:
    if not statuses:
        return (
            '<p class="cp-empty">No sheet declares a member checklist, so the NOT COVERED '
            "count above holds only the checks the sheets themselves record.</p>"
        )

    from calcpack.working.render import symbols_html

    def status(st: ItemStatus) -> str:
        return _verdict(st.status) if st.status == "NOT COVERED" else _e(st.status)

    # item words and reasons may name symbols ("lateral stability (C_L)"): set them as symbols
    rows = "".join(
        f"<tr><td>{_e(st.sheet)}</td><td>{_e(st.member)}</td><td>{_e(st.member_type)}</td>"
        f"<td>{symbols_html(_e(st.item))}</td><td>{status(st)}</td>"
        f"<td>{symbols_html(_e(st.detail))}</td></tr>"
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


def _pageref(index: int | None, anchor: str | None = None) -> str:
    """A link showing the page number of the check (``anchor``), else of its sheet's first
    page (written in at layout)."""
    if index is None:
        return ""
    if anchor:
        return f'<a class="cp-pageref" data-cp-in="sheet-{index}" href="#{_e(anchor)}"></a>'
    return f'<a class="cp-pageref" href="#sheet-{index}"></a>'


def _check_row(
    number: str, index: int | None, c: dict[str, Any], *, ratio_words: bool, anchor: str = ""
) -> str:
    from calcpack.package.document import format_sig
    from calcpack.working.render import symbols_html

    u = c.get("utilisation")
    unit = f" {_e(c['unit'])}" if c.get("unit") else ""
    if c["verdict"] == Verdict.NOT_COVERED:
        # what is missing, in place of numbers that could not be given
        missing = symbols_html(_e(c.get("description") or "not covered by this method"))
        middle = f'<td colspan="3" class="cpd-missing">{missing}</td>'
    else:
        if u is None:
            ratio = "—"
        elif ratio_words:
            rel = "≤" if c["verdict"] == Verdict.OK else "&gt;"
            ratio = f"{format_sig(u)} {rel} 1.00"
        else:
            ratio = format_sig(u)
        middle = (
            f'<td class="num">{format_sig(c.get("demand"))}{unit}</td>'
            f'<td class="num">{format_sig(c.get("capacity"))}{unit}</td>'
            f'<td class="num">{ratio}</td>'
        )
    return (
        f"<tr><td>{_e(number)}</td><td>{_e(c.get('member') or '')}</td>"
        f"<td>{symbols_html(_e(c['name']))}</td><td>{_e(c.get('combination') or '')}</td>"
        f"{middle}<td>{_verdict(c['verdict'])}</td><td>{_e(c.get('ref') or '')}</td>"
        f'<td class="num">{_pageref(index, anchor)}</td></tr>'
    )


def _table(rows: list[str], ratio: str) -> str:
    return (
        '<table class="cpd-table cpd-summary"><thead><tr><th>Sheet</th><th>Member</th>'
        f"<th>Check</th><th>Combination</th><th>Demand</th><th>Capacity</th><th>{ratio}</th>"
        "<th>Verdict</th><th>Clause</th><th>Page</th></tr></thead><tbody>"
        + "".join(rows)
        + "</tbody></table>"
    )


def summary_html(sheets: Sequence[SheetDoc]) -> str:
    """The summary's body (after its title block and heading): the demand/capacity checks
    worst first, each with its ratio in words and its sheet's page; then the classification
    and limit checks apart (their ratio is not a share of a strength used); then the
    checklists."""
    index = {s.entry.number: i for i, s in enumerate(sheets, start=1)}
    entries = summary_entries(sheets)
    strength = [(n, c) for n, c in entries if not is_classification(c)]
    limits = [(n, c) for n, c in entries if is_classification(c)]
    line = f"<p>{_e(counts_line(check_counts(sheets)))}. Worst first.</p>"
    if not entries:
        table = '<p class="cp-empty">The sheets record no design checks.</p>'
        return line + table + _checklists_html(checklist_status(sheets))
    parts = [
        line,
        '<h2 class="cp-h">Strength and serviceability</h2>'
        f"<p>{len(strength)} demand/capacity checks; utilisation = |demand| / capacity.</p>",
    ]
    if strength:
        rows = [
            _check_row(n, index.get(n), c, ratio_words=True, anchor=c.get("_anchor", ""))
            for n, c in strength
        ]
        parts.append(_table(rows, "Utilisation"))
    if limits:
        rows = [
            _check_row(n, index.get(n), c, ratio_words=False, anchor=c.get("_anchor", ""))
            for n, c in limits
        ]
        parts.append(
            '<h2 class="cp-h">Classification and limits</h2>'
            f"<p>{len(limits)} checks of a section's class or of a limit of a method: the ratio "
            "is the value against its limit, not a share of a strength used.</p>"
            + _table(rows, "Ratio")
        )
    return "".join(parts) + _checklists_html(checklist_status(sheets))
