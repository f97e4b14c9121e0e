"""Records: the values and checks a sheet declares, as data, and how the build reads them back.

Every calc step's rich display carries a JSON payload under :data:`RECORDS_MIMETYPE` (values,
checks, assumptions, cautions, standards, exported and imported links). The build reads them,
in output order, from the executed notebook for the manifest, the summary of checks and the
assumptions and cautions; revision comparison and the archive check read them from manifests.
This module is the one definition of that contract: the writer (``calcpack.working``) and every
reader import it from here.
"""

from __future__ import annotations

import json
import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any

from calcpack.contract.verdict import Verdict

__all__ = ["RECORDS_MIMETYPE", "CheckRecord", "Record", "SheetRecords", "collect_records"]

RECORDS_MIMETYPE = "application/vnd.calcpack.records+json"


def _float(value: Any) -> float | None:
    if isinstance(value, bool):
        return None
    if isinstance(value, int | float) and math.isfinite(float(value)):
        return float(value)
    return None


def _opt_str(value: Any) -> str | None:
    return None if value is None else str(value)


def _sig(value: Any) -> int | None:
    """Significant figures as recorded (None when absent or not a sensible count)."""
    if isinstance(value, int) and not isinstance(value, bool) and 1 <= value <= 15:
        return value
    return None


@dataclass(frozen=True)
class Record:
    """A named value as data, for manifests and revision comparisons.

    ``value`` is the full-precision magnitude in ``unit`` (the unit the sheet displays); it is
    ``None`` only when read back from a payload whose value was not a finite number. ``kind`` is
    ``"given"`` for an input (a stated value, a load) and ``"derived"`` for a result (computed
    on the sheet or carried from an analysis). ``sig`` is the significant figures the sheet
    shows it with (comparisons are made at full precision and shown at ``sig``).
    """

    name: str
    symbol: str
    value: float | None
    unit: str
    description: str
    kind: str
    sig: int | None = None

    def to_json(self) -> dict[str, Any]:
        out: dict[str, Any] = {
            "name": self.name,
            "symbol": self.symbol,
            "value": self.value,
            "unit": self.unit,
            "description": self.description,
            "kind": self.kind,
        }
        if self.sig is not None:
            out["sig"] = self.sig
        return out

    @classmethod
    def from_json(cls, item: Mapping[str, Any]) -> Record:
        """A record from its JSON form; missing fields read as empty, a bad value as ``None``."""
        return cls(
            name=str(item.get("name", "")),
            symbol=str(item.get("symbol", item.get("name", ""))),
            value=_float(item.get("value")),
            unit=str(item.get("unit", "")),
            description=str(item.get("description", "")),
            kind=str(item.get("kind", "")),
            sig=_sig(item.get("sig")),
        )


@dataclass(frozen=True)
class CheckRecord:
    """A check as data: demand and capacity in ``unit``, utilisation = |demand| / capacity;
    ``sig``: the significant figures the sheet shows them with."""

    name: str
    member: str | None
    demand: float | None
    capacity: float | None
    unit: str
    utilisation: float | None
    verdict: str
    ref: str | None
    combination: str | None
    description: str
    sig: int | None = None

    def to_json(self) -> dict[str, Any]:
        out: dict[str, Any] = {
            "name": self.name,
            "member": self.member,
            "demand": self.demand,
            "capacity": self.capacity,
            "unit": self.unit,
            "utilisation": self.utilisation,
            "verdict": str(self.verdict),
            "ref": self.ref,
            "combination": self.combination,
            "description": self.description,
        }
        if self.sig is not None:
            out["sig"] = self.sig
        return out

    @classmethod
    def from_json(cls, item: Mapping[str, Any]) -> CheckRecord:
        """A check from its JSON form.

        A missing utilisation is recomputed from demand and capacity; a missing or unknown
        verdict is decided by :meth:`Verdict.of` (the one pass rule).
        """
        demand = _float(item.get("demand"))
        capacity = _float(item.get("capacity"))
        utilisation = _float(item.get("utilisation"))
        if utilisation is None and demand is not None and capacity:
            utilisation = abs(demand) / abs(capacity)
        verdict = Verdict.parse(item.get("verdict")) or Verdict.of(utilisation)
        return cls(
            name=str(item.get("name", "")),
            member=_opt_str(item.get("member")),
            demand=demand,
            capacity=capacity,
            unit=str(item.get("unit", "")),
            utilisation=utilisation,
            verdict=verdict,
            ref=_opt_str(item.get("ref")),
            combination=_opt_str(item.get("combination")),
            description=str(item.get("description", "")),
            sig=_sig(item.get("sig")),
        )


@dataclass(frozen=True)
class SheetRecords:
    """Everything one sheet declared, in the order its outputs appeared (JSON-ready dicts)."""

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
    verifications: tuple[dict[str, Any], ...] = ()
    """The checker's independent checks of other sheets' results (see
    :mod:`calcpack.working.verification`)."""
    key_results: tuple[dict[str, Any], ...] = ()
    """The results the sheet declares key (for the checker's coverage)."""


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
    verifications: list[dict[str, Any]] = []
    key_results: list[dict[str, Any]] = []
    for payload in _payloads(nb):
        exports += [dict(e) for e in payload.get("exports", []) if isinstance(e, dict)]
        imports += [dict(i) for i in payload.get("imports", []) if isinstance(i, dict)]
        checklists += [dict(c) for c in payload.get("checklists", []) if isinstance(c, dict)]
        verifications += [dict(v) for v in payload.get("verifications", []) if isinstance(v, dict)]
        key_results += [dict(k) for k in payload.get("key_results", []) if isinstance(k, dict)]
        values += [
            Record.from_json(v).to_json() for v in payload.get("values", []) if isinstance(v, dict)
        ]
        checks += [
            CheckRecord.from_json(c).to_json()
            for c in payload.get("checks", [])
            if isinstance(c, dict)
        ]
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
        tuple(verifications),
        tuple(key_results),
    )
