"""Template placeholders: the texts ``calcpack new`` puts in a project file for the engineer to
replace. A build with any left warns; signing a package that prints one is refused.
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

__all__ = ["TEMPLATE_PLACEHOLDERS", "placeholders_in_summary", "placeholders_text"]

#: Project-file field -> the placeholder text ``calcpack new`` writes there.
TEMPLATE_PLACEHOLDERS: dict[str, str] = {
    "job.client": "Client name",
    "job.site": "Site address",
    "job.firm": "Your practice",
    "people.preparer": "Preparer's name",
    "people.checker": "Checker's name",
    "people.approver": "Approver's name",
    "design.standards": "Name the design standards and their editions here",
    "design.basis": "Describe the structure, the load path and the method of design.",
}

#: The manifest's project block key -> the project-file field it comes from.
_SUMMARY_FIELDS = {
    "client": "job.client",
    "site": "job.site",
    "firm": "job.firm",
    "preparer": "people.preparer",
    "checker": "people.checker",
    "approver": "people.approver",
    "standards": "design.standards",
    "basis": "design.basis",
}


def _is_placeholder(field: str, value: Any) -> bool:
    text = TEMPLATE_PLACEHOLDERS[field]
    values = value if isinstance(value, list | tuple) else [value]
    return any(isinstance(v, str) and v.strip() == text for v in values)


def placeholders_in_summary(summary: Mapping[str, Any]) -> list[tuple[str, str]]:
    """``(field, placeholder)`` for every template placeholder left in a project summary (the
    manifest's ``project`` block, or the same keys from a loaded project)."""
    found = []
    for key, field in _SUMMARY_FIELDS.items():
        if key in summary and _is_placeholder(field, summary[key]):
            found.append((field, TEMPLATE_PLACEHOLDERS[field]))
    return found


def placeholders_text(found: list[tuple[str, str]]) -> str:
    """``people.preparer = "Preparer's name", ...`` for a message."""
    return ", ".join(f'{field} = "{text}"' for field, text in found)
