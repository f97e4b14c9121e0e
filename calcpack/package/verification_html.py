"""The package's "Verification by the checker" section and the cover's count of key results
independently verified. Reads the sheets' records and the build's comparisons only."""

from __future__ import annotations

from collections.abc import Sequence
from html import escape
from typing import TYPE_CHECKING, Any

from calcpack.working.render import symbols_html

if TYPE_CHECKING:
    from calcpack.package.document import SheetDoc
    from calcpack.package.verification import Compared

__all__ = ["coverage", "verification_html", "verified_line"]


def _e(text: Any) -> str:
    return escape(str(text), quote=True)


def coverage(
    sheets: Sequence[SheetDoc], compared: Sequence[Compared]
) -> list[tuple[SheetDoc, str, str | None, list[Compared]]]:
    """Every key result of every sheet with the independent checks of it (maybe none)."""
    from calcpack.package.verification import key_results

    out = []
    for doc in sheets:
        for name, member in key_results(doc):
            found = [
                c
                for c in compared
                if c.of_sheet == doc.entry.path
                and c.of_name == name
                and (member is None or c.member == member)
            ]
            out.append((doc, name, member, found))
    return out


def verified_line(sheets: Sequence[SheetDoc], compared: Sequence[Compared]) -> str:
    """The cover's words: how many key results the checker verified independently."""
    rows = coverage(sheets, compared)
    done = sum(1 for *_, found in rows if found)
    disagree = sum(1 for c in compared if not c.agreed)
    text = f"{done} of {len(rows)} key results independently verified by the checker"
    if len(compared) != done:
        text += f" ({len(compared)} independent checks in all)"
    if disagree:
        text += f"; {disagree} disagree (open review comments)"
    return text


def _n(x: float) -> str:
    return f"{x:.4g}"


def verification_html(sheets: Sequence[SheetDoc], compared: Sequence[Compared]) -> str:
    """The section's body: every independent check, then the key results' coverage."""
    head = '<h1 class="cp-h cp-bm1">Verification by the checker</h1>'
    intro = (
        "<p>The checker's own values of the preparer's results, computed independently (another "
        "method, simplified assumptions, a table or other software), each compared with the "
        "preparer's record: the difference is |checker &#8722; preparer| / |preparer|. A "
        "disagreement is an open review comment until resolved. "
        f"{_e(verified_line(sheets, compared))}.</p>"
    )
    if compared:
        rows = "".join(
            f"<tr><td>{symbols_html(_e(c.label))}</td><td>{_e(c.method)}</td>"
            f'<td class="num">{_n(c.preparer_value)} {_e(c.unit)}</td>'
            f'<td class="num">{_n(c.checker_value)} {_e(c.unit)}</td>'
            f'<td class="num">{c.difference * 100:.2f} %</td>'
            f'<td class="num">{c.tolerance * 100:g} %</td>'
            f'<td><span class="cpd-verdict {"ok" if c.agreed else "notok"}">'
            f"{'agreed' if c.agreed else 'DISAGREES'}</span></td>"
            f"<td>{_e(c.checker_number)}</td></tr>"
            for c in compared
        )
        table = (
            '<table class="cpd-table"><thead><tr><th>Result</th><th>Method</th>'
            "<th>Preparer</th><th>Checker</th><th>Difference</th><th>Tolerance</th>"
            "<th>Agreement</th><th>Check sheet</th></tr></thead><tbody>" + rows + "</tbody></table>"
        )
    else:
        table = '<p class="cp-empty">The package records no independent check by the checker.</p>'
    rows_cov = coverage(sheets, compared)
    if not rows_cov:
        return head + intro + table
    cov = "".join(
        f"<tr><td>{_e(doc.entry.number)}</td><td>{symbols_html(_e(name))}"
        f"{f' ({_e(member)})' if member else ''}</td><td>"
        + (
            "; ".join(f"{'agreed' if c.agreed else 'DISAGREES'} ({_e(c.method)})" for c in found)
            if found
            else '<span class="cpd-verdict nc">not independently checked</span>'
        )
        + "</td></tr>"
        for doc, name, member, found in rows_cov
    )
    return (
        head + intro + table + '<h2 class="cp-h">Key results</h2>'
        "<p>Each sheet's key results (those it declares, else its exported values, its "
        "governing check per member and its maximum moments, shears and deflections), and "
        "whether the checker verified each independently.</p>"
        '<table class="cpd-table"><thead><tr><th>Sheet</th><th>Key result</th>'
        "<th>Independent check</th></tr></thead><tbody>" + cov + "</tbody></table>"
    )
