"""The sheet-level summary of checks: member, check, demand, capacity, utilisation, verdict,
clause and governing combination -- one row per check, for the package's summary of checks.
Builds a :class:`calcpack.working.Table` (imported when called)."""

from __future__ import annotations

from collections.abc import Iterable
from typing import Any

__all__ = ["SUMMARY_COLUMNS", "check_records", "summary_table"]

SUMMARY_COLUMNS = [
    "Member",
    "Check",
    "Demand",
    "Capacity",
    "Utilisation",
    "Verdict",
    "Clause",
    "Combination",
]


def check_records(items: Iterable[Any]) -> list[Any]:
    """CheckRecords from sheets, member checks, check results, steps or records, in order."""
    from calcpack.working import Check, CheckRecord, NotCovered, Sheet

    out: list[Any] = []
    for it in items:
        if isinstance(it, CheckRecord):
            out.append(it)
        elif isinstance(it, Sheet):
            out.extend(it.checks())
        elif isinstance(it, Check | NotCovered):
            out.append(it.record())
        elif hasattr(it, "records") and hasattr(it, "results"):
            out.extend(it.records())
        elif hasattr(it, "record") and hasattr(it, "verdict"):
            out.append(it.record())
        else:
            from calcpack.errors import InputError

            raise InputError(
                f"The summary of checks takes sheets, member checks, checks or check records "
                f"(got {type(it).__name__})",
                name="items",
                value=it,
                expected="Sheet, MemberChecks, CheckResult, Check or CheckRecord",
            )
    return out


def summary_table(items: Iterable[Any], *, caption: str | None = None, sig: int = 3) -> Any:
    """The summary table of every check in ``items`` (sheets, member checks, records...).

    No caption unless one is given: a sheet puts its own heading over it, and a table titled
    as its heading reads twice."""
    from calcpack.working import Table, format_number

    rows = []
    for r in check_records(items):

        def val(x: float | None, unit: str) -> str:
            return "—" if x is None else f"{format_number(x, sig)} {unit}".strip()

        util = "—" if r.utilisation is None else format_number(r.utilisation, sig)
        clause = r.ref or ""
        if r.utilisation is None and r.description:
            clause = f"{clause}: {r.description}" if clause else r.description
        rows.append(
            [
                r.member or "",
                r.name,
                val(r.demand, r.unit),
                val(r.capacity, r.unit),
                util,
                r.verdict,
                clause,
                r.combination or "",
            ]
        )
    return Table(SUMMARY_COLUMNS, rows, caption=caption)
