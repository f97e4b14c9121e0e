"""The manifest comparison: what changed between two revisions of a calc package.

Compares, sheet by sheet, the recorded inputs (``kind = "given"``: stated values and every
load, by case), results (``"derived"``: computed on the sheet or carried from an analysis) and
design checks (demand, capacity, utilisation, verdict), and lists each difference with old and
new values. Numbers are compared at full precision (``REL_TOL``) and shown at the significant
figures of the sheet that recorded them. The same comparison serves
``calcpack verify --reproduce`` (recorded manifest against a fresh execution) and the build
(sheets changed since the last issued revision).
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass, field, replace
from typing import Any

from calcpack.contract.carried import annotate_carried, link_changes
from calcpack.contract.manifest import Manifest
from calcpack.contract.rechecks import verification_changes

__all__ = ["REL_TOL", "Change", "ManifestDiff", "diff_manifests"]

#: Relative tolerance below which two recorded numbers count as equal: the manifest stores
#: full precision, so only floating-point noise between platforms is forgiven.
REL_TOL = 1e-9


@dataclass(frozen=True)
class Change:
    """One difference between two manifests.

    Attributes:
        sheet: the sheet's title (or path) in the new revision (old one if removed).
        kind: ``"input"``, ``"result"``, ``"check"``, ``"link"`` (a value carried between
            sheets, when both manifests record links) or ``"sheet"`` (sheet added/removed).
        name: the quantity or check name (``"Bending (B1)"`` for a check on a member).
        old: old value as displayed (``None`` when added).
        new: new value as displayed (``None`` when removed).
        verdict_changed: for checks, the verdict (OK / NOT OK / NOT COVERED) changed.
        path: the sheet's notebook path (or other key) in the manifests, for the build to mark
            changed sheets; not part of equality.
    """

    sheet: str
    kind: str
    name: str
    old: str | None
    new: str | None
    verdict_changed: bool = False
    path: str | None = field(default=None, compare=False)
    carried_to: tuple[str, ...] = field(default=(), compare=False)
    """For a value other sheets import: where it was carried ("sheet 2 as w")."""
    copy_of: str | None = field(default=None, compare=False)
    """For an imported value (or a link): the upstream value it copies ("sheet 1 w"); the
    displays show the upstream change once instead."""
    due_to: tuple[str, ...] = field(default=(), compare=False)
    """For a change on a sheet that imports changed values: those upstream values."""

    @property
    def shown(self) -> bool:
        """Whether a display lists it (a copy of an upstream change is shown at its origin)."""
        return self.copy_of is None

    def note(self) -> str:
        """Where a value went or came from, for the displays ("" when it stayed on its sheet)."""
        if self.carried_to:
            return "carried to " + ", ".join(self.carried_to)
        if self.due_to:
            return "follows from " + ", ".join(self.due_to)
        return ""


@dataclass(frozen=True)
class ManifestDiff:
    """All differences between an old and a new manifest, in sheet order."""

    changes: tuple[Change, ...]
    old_revision: str | None = None
    new_revision: str | None = None

    @property
    def empty(self) -> bool:
        """No input, result or verdict differs."""
        return not self.changes

    def changed_sheets(self) -> tuple[str, ...]:
        """Sheets (as named in :attr:`Change.sheet`) with at least one change, in order."""
        return tuple(dict.fromkeys(c.sheet for c in self.changes))

    def changed_paths(self) -> tuple[str, ...]:
        """Notebook paths (manifest keys) of the sheets with a change, in order.

        For the build: the sheets to mark as changed since the last issued revision.
        """
        return tuple(dict.fromkeys(c.path for c in self.changes if c.path is not None))

    def of_kind(self, kind: str) -> tuple[Change, ...]:
        """The changes of one kind (``"input"``, ``"result"``, ``"check"``, ``"sheet"``)."""
        return tuple(c for c in self.changes if c.kind == kind)

    def table(self) -> str:
        """A plain-text table: sheet, what, name, old, new."""
        head = f"Revision {self.old_revision or '?'} -> {self.new_revision or '?'}"
        if not self.changes:
            return f"{head}: no changes to inputs, results or check verdicts."
        rows: list[tuple[str, ...]] = [("Sheet", "What", "Name", "Old", "New", "Between sheets")]
        for c in self.changes:
            if not c.shown:
                continue
            what = c.kind + (" (verdict)" if c.verdict_changed else "")
            rows.append((c.sheet, what, c.name, c.old or "-", c.new or "-", c.note()))
        if not any(r[5] for r in rows[1:]):  # nothing carried between sheets: five columns
            rows = [r[:5] for r in rows]
        widths = [max(len(r[i]) for r in rows) for i in range(len(rows[0]))]
        lines = [head]
        for i, row in enumerate(rows):
            lines.append("  ".join(cell.ljust(widths[j]) for j, cell in enumerate(row)).rstrip())
            if i == 0:
                lines.append("  ".join("-" * w for w in widths))
        return "\n".join(lines)


def _sheet_key(sheet: dict[str, Any], index: int) -> str:
    for key in ("path", "title", "number"):
        if sheet.get(key) not in (None, ""):
            return str(sheet[key])
    return f"sheet {index + 1}"


def _sheet_label(sheet: dict[str, Any], index: int) -> str:
    number = sheet.get("number")
    title = sheet.get("title")
    if title and number is not None:
        return f"{number} {title}"
    return str(title or sheet.get("path") or f"sheet {index + 1}")


LEGACY_SIG = 6
"""Significant figures shown for a value recorded without its sheet's (older manifests)."""


def _num(value: Any, sig: Any = None) -> str:
    """A recorded number as its sheet shows it: ``sig`` significant figures (the record's), in
    the sheet's number style (``12 300``, ``4.25×10⁻⁶``)."""
    if isinstance(value, bool) or value is None:
        return str(value)
    if isinstance(value, int | float):
        if not isinstance(sig, int) or isinstance(sig, bool):
            return f"{value:.{LEGACY_SIG}g}"
        from calcpack.working.format import format_number

        return format_number(float(value), sig)
    return str(value)


def _same(a: Any, b: Any, rel_tol: float) -> bool:
    if isinstance(a, int | float) and isinstance(b, int | float) and not isinstance(a, bool):
        if math.isnan(a) and math.isnan(b):
            return True
        return math.isclose(a, b, rel_tol=rel_tol, abs_tol=1e-300)
    return bool(a == b)


def _keyed(items: Iterable[dict[str, Any]], key: Any) -> dict[Any, dict[str, Any]]:
    """Items by key; repeated keys get an occurrence number so none is lost."""
    out: dict[Any, dict[str, Any]] = {}
    for item in items:
        k = key(item)
        n = 1
        while (k, n) in out:
            n += 1
        out[(k, n)] = item
    return out


def _value_text(v: dict[str, Any]) -> str:
    unit = str(v.get("unit") or "").strip()
    return f"{_num(v.get('value'), v.get('sig'))} {unit}".rstrip()


def _check_name(c: dict[str, Any]) -> str:
    name = str(c.get("name", "?"))
    if c.get("member"):
        name += f" ({c['member']})"
    if c.get("combination"):
        name += f" [{c['combination']}]"
    return name


def _check_text(c: dict[str, Any]) -> str:
    unit = str(c.get("unit") or "")
    util = c.get("utilisation")
    util_text = f"u = {util:.3g}, " if isinstance(util, int | float) else ""
    sig = c.get("sig")
    return (
        f"{util_text}{_num(c.get('demand'), sig)} / {_num(c.get('capacity'), sig)} {unit}".rstrip()
        + f" {c.get('verdict', '?')}"
    )


def _diff_values(
    label: str, old: list[dict[str, Any]], new: list[dict[str, Any]], rel_tol: float
) -> list[Change]:
    changes: list[Change] = []
    for kind, label_kind in (("given", "input"), ("derived", "result")):
        a = _keyed((v for v in old if v.get("kind") == kind), lambda v: v.get("name"))
        b = _keyed((v for v in new if v.get("kind") == kind), lambda v: v.get("name"))
        for key in [*a, *(k for k in b if k not in a)]:
            name = str(key[0]) + (f" #{key[1]}" if key[1] > 1 else "")
            va, vb = a.get(key), b.get(key)
            if va is None or vb is None:
                changes.append(
                    Change(
                        label,
                        label_kind,
                        name,
                        _value_text(va) if va else None,
                        _value_text(vb) if vb else None,
                    )
                )
            elif not (
                _same(va.get("value"), vb.get("value"), rel_tol)
                and va.get("unit") == vb.get("unit")
            ):
                changes.append(Change(label, label_kind, name, _value_text(va), _value_text(vb)))
    return changes


def _diff_checks(
    label: str, old: list[dict[str, Any]], new: list[dict[str, Any]], rel_tol: float
) -> list[Change]:
    changes: list[Change] = []
    a = _keyed(old, _check_name)
    b = _keyed(new, _check_name)
    for key in [*a, *(k for k in b if k not in a)]:
        name = str(key[0]) + (f" #{key[1]}" if key[1] > 1 else "")
        ca, cb = a.get(key), b.get(key)
        if ca is None or cb is None:
            changes.append(
                Change(
                    label,
                    "check",
                    name,
                    _check_text(ca) if ca else None,
                    _check_text(cb) if cb else None,
                    verdict_changed=True,
                )
            )
            continue
        fields = ("demand", "capacity", "utilisation", "unit", "verdict")
        if not all(_same(ca.get(f), cb.get(f), rel_tol) for f in fields):
            changes.append(
                Change(
                    label,
                    "check",
                    name,
                    _check_text(ca),
                    _check_text(cb),
                    verdict_changed=ca.get("verdict") != cb.get("verdict"),
                )
            )
    return changes


def diff_manifests(
    old: Manifest | dict[str, Any], new: Manifest | dict[str, Any], *, rel_tol: float = REL_TOL
) -> ManifestDiff:
    """Compare two manifests sheet by sheet.

    Args:
        old: the earlier manifest (a :class:`Manifest` or its JSON form, as loaded by
            :func:`calcpack.signing.manifest.load_manifest`).
        new: the later manifest.
        rel_tol: relative tolerance for numbers to count as unchanged.

    Returns:
        A :class:`ManifestDiff` listing changed, added and removed inputs, results and checks,
        and added or removed sheets.
    """
    old = old.to_json() if isinstance(old, Manifest) else old
    new = new.to_json() if isinstance(new, Manifest) else new
    old_sheets = {_sheet_key(s, i): (i, s) for i, s in enumerate(old.get("sheets", []))}
    new_sheets = {_sheet_key(s, i): (i, s) for i, s in enumerate(new.get("sheets", []))}
    changes: list[Change] = []
    for key in [*new_sheets, *(k for k in old_sheets if k not in new_sheets)]:
        if key not in old_sheets:
            i, s = new_sheets[key]
            changes.append(Change(_sheet_label(s, i), "sheet", "sheet added", None, key, path=key))
            continue
        if key not in new_sheets:
            i, s = old_sheets[key]
            changes.append(
                Change(_sheet_label(s, i), "sheet", "sheet removed", key, None, path=key)
            )
            continue
        i, sa = old_sheets[key]
        j, sb = new_sheets[key]
        label = _sheet_label(sb, j)
        found = _diff_values(label, sa.get("values", []), sb.get("values", []), rel_tol)
        found += _diff_checks(label, sa.get("checks", []), sb.get("checks", []), rel_tol)
        changes += [replace(c, path=key) for c in found]
    changes += link_changes(old, new, rel_tol)
    changes += verification_changes(old, new, rel_tol)
    changes = annotate_carried(changes, old, new, rel_tol)

    def revision(m: dict[str, Any]) -> str | None:
        rev = (m.get("project") or {}).get("revision")
        return None if rev is None else str(rev)

    return ManifestDiff(tuple(changes), revision(old), revision(new))
