"""The step declaring a member's checklist: a table of its items and where each stands.

On the sheet, an item shows as met by a check already on this sheet, not applicable (with the
reason), met elsewhere (declared), or "to be met elsewhere in the package" -- the package's
summary of checks resolves it against every sheet and lists what stays NOT COVERED. The records
(key ``"checklists"``) carry the whole list, so the build needs no table of its own.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

from calcpack.units import DisplaySettings
from calcpack.working.steps import Table

__all__ = ["Checklist"]


class Checklist(Table):
    """A member's checklist (see :mod:`calcpack.checks.checklists`).

    Args:
        record: the checklist as :meth:`calcpack.checks.checklists.MemberChecklist.to_json`.
        checks: the check records already on the sheet (dicts), to show what they meet.
    """

    def __init__(
        self,
        record: dict[str, Any],
        checks: Sequence[dict[str, Any]],
        *,
        settings: DisplaySettings | None = None,
    ) -> None:
        from calcpack.checks.checklists import resolve_checklists

        self.record = dict(record)
        here = {
            s.item: s for s in resolve_checklists([("", self.record)], [("", c) for c in checks])
        }
        rows = []
        for it in self.record["items"]:
            status = here[it["item"]]
            if status.status == "not applicable":
                text = f"not applicable: {it['not_applicable']}"
            elif it.get("not_covered"):
                text = f"NOT COVERED: {it['not_covered']}"
            elif status.status == "met":
                text = "met by " + status.detail.replace("sheet : ", "")
            elif it.get("met_by"):
                text = f"to be met by {it['met_by']} (checked in the package)"
            else:
                text = "to be met elsewhere in the package, else NOT COVERED"
            rows.append([it["item"], text])
        super().__init__(
            ["Item", "On this sheet"],
            rows,
            caption=(
                f"Checklist, {self.record['member_type']} {self.record['member']} "
                f"(source: {self.record['source']})"
            ),
            settings=settings,
        )

    def records(self) -> dict[str, list[Any]]:
        return {"checklists": [dict(self.record)]}
