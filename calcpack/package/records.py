"""Collect the recorded values, checks, assumptions and cautions a sheet's outputs carry.

calcpack.working steps put a JSON payload under the mimetype
``application/vnd.calcpack.records+json`` in every display output (see the build contract). The
build reads them, in output order, for the manifest, the summary of checks and the assumptions
and caution block.
"""

from __future__ import annotations

import json
import math
from dataclasses import dataclass, field
from typing import Any

__all__ = ["RECORDS_MIMETYPE", "SheetRecords", "check_sort_key", "collect_records"]

RECORDS_MIMETYPE = "application/vnd.calcpack.records+json"

_VERDICTS = ("OK", "NOT OK", "NOT COVERED")


@dataclass(frozen=True)
class SheetRecords:
    """Everything one sheet declared, in the order its outputs appeared."""

    values: tuple[dict[str, Any], ...] = ()
    checks: tuple[dict[str, Any], ...] = ()
    assumptions: tuple[str, ...] = ()
    cautions: tuple[str, ...] = ()
    standards: tuple[str, ...] = field(default=())
    exports: tuple[dict[str, Any], ...] = ()
    """Values the sheet exports to others (see :mod:`calcpack.working.links`)."""
    imports: tuple[dict[str, Any], ...] = ()
    """Values it imports: from sheet and name, case, to name, value and unit."""
    checklists: tuple[dict[str, Any], ...] = ()
    """Members' checklists it declares (see :mod:`calcpack.checks.checklists`)."""


def _float(value: Any) -> float | None:
    if isinstance(value, bool):
        return None
    if isinstance(value, int | float) and math.isfinite(float(value)):
        return float(value)
    return None


def _clean_value(item: dict[str, Any]) -> dict[str, Any]:
    return {
        "name": str(item.get("name", "")),
        "symbol": str(item.get("symbol", item.get("name", ""))),
        "value": _float(item.get("value")),
        "unit": str(item.get("unit", "")),
        "description": str(item.get("description", "")),
        "kind": str(item.get("kind", "")),
    }


def _clean_check(item: dict[str, Any]) -> dict[str, Any]:
    demand = _float(item.get("demand"))
    capacity = _float(item.get("capacity"))
    utilisation = _float(item.get("utilisation"))
    if utilisation is None and demand is not None and capacity:
        utilisation = abs(demand) / abs(capacity)
    verdict = str(item.get("verdict", ""))
    if verdict not in _VERDICTS:
        verdict = (
            "NOT COVERED" if utilisation is None else ("OK" if utilisation <= 1.0 else "NOT OK")
        )
    return {
        "name": str(item.get("name", "")),
        "member": item.get("member") if item.get("member") is not None else None,
        "demand": demand,
        "capacity": capacity,
        "unit": str(item.get("unit", "")),
        "utilisation": utilisation,
        "verdict": verdict,
        "ref": item.get("ref"),
        "combination": item.get("combination"),
        "description": str(item.get("description", "")),
    }


def _payloads(nb: Any) -> list[dict[str, Any]]:
    found = []
    for cell in nb.get("cells", []):
        if cell.get("cell_type") != "code":
            continue
        for output in cell.get("outputs", []):
            data = output.get("data") or {}
            payload = data.get(RECORDS_MIMETYPE)
            if payload is None:
                continue
            if isinstance(payload, str):
                try:
                    payload = json.loads(payload)
                except ValueError:
                    continue
            if isinstance(payload, dict):
                found.append(payload)
    return found


def collect_records(nb: Any) -> SheetRecords:
    """The sheet's records from an executed notebook (nbformat node or plain dict)."""
    values: list[dict[str, Any]] = []
    checks: list[dict[str, Any]] = []
    assumptions: list[str] = []
    cautions: list[str] = []
    standards: list[str] = []
    exports: list[dict[str, Any]] = []
    imports: list[dict[str, Any]] = []
    checklists: list[dict[str, Any]] = []
    for payload in _payloads(nb):
        exports += [dict(e) for e in payload.get("exports", []) if isinstance(e, dict)]
        imports += [dict(i) for i in payload.get("imports", []) if isinstance(i, dict)]
        checklists += [dict(c) for c in payload.get("checklists", []) if isinstance(c, dict)]
        values += [_clean_value(v) for v in payload.get("values", []) if isinstance(v, dict)]
        checks += [_clean_check(c) for c in payload.get("checks", []) if isinstance(c, dict)]
        for key, target in (
            ("assumptions", assumptions),
            ("cautions", cautions),
            ("standards", standards),
        ):
            for text in payload.get(key, []):
                if isinstance(text, str) and text.strip() and text.strip() not in target:
                    target.append(text.strip())
    return SheetRecords(
        tuple(values),
        tuple(checks),
        tuple(assumptions),
        tuple(cautions),
        tuple(standards),
        tuple(exports),
        tuple(imports),
        tuple(checklists),
    )


def check_sort_key(check: dict[str, Any]) -> tuple[int, float]:
    """Sort key putting the worst check first: NOT OK by utilisation, NOT COVERED, then OK."""
    u = check.get("utilisation")
    verdict = check.get("verdict")
    if verdict == "NOT OK":
        return (0, -(u if u is not None else math.inf))
    if verdict == "NOT COVERED":
        return (1, 0.0)
    return (2, -(u if u is not None else 0.0))
