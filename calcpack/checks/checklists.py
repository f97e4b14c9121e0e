"""Member checklists: what a competent checker expects to see checked for each member type.

A sheet declares that a member is of a type (``Sheet.checklist("steel beam", member="B1")``);
the package then lists each item of that type's checklist as met by a check in the package (a
check on the same member whose name, clause or description matches the item), declared not
applicable with a reason, declared met by a check of another member (named, and looked for in
the package), or NOT COVERED. The lists are data: ``calcpack/refdata/member_checklists.csv``,
whose source is common practice; a project folder may hold its own ``member_checklists.csv`` in
the same format, which then replaces the shipped one for that project.

Pure data and functions: no rendering, no Jupyter.
"""

from __future__ import annotations

import re
from collections.abc import Iterable, Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Literal

from calcpack.errors import InputError
from calcpack.validate import non_empty

__all__ = [
    "CHECKLIST_FILE",
    "MEMBER_ALIASES",
    "ChecklistItem",
    "ItemStatus",
    "MemberChecklist",
    "checklist_items",
    "load_checklists",
    "member_checklist",
    "member_matches",
    "resolve_checklists",
]

CHECKLIST_FILE = "member_checklists.csv"
"""Name of the shipped table, and of a project's own copy (in the project folder)."""

MEMBER_ALIASES = {
    "joist": "timber beam",
    "timber joist": "timber beam",
    "rafter": "timber beam",
    "column": "post",
    "steel column": "post",
    "timber post": "post",
    "pad footing": "footing",
    "foundation": "footing",
}
"""Words of the trade for a member type, mapped to the type whose checklist applies."""

Status = Literal["met", "not applicable", "NOT COVERED"]


@dataclass(frozen=True)
class ChecklistItem:
    """One item of a member type's checklist.

    Attributes:
        item: the words shown in the package.
        matches: regular expression (case-insensitive) searched in a check's name, clause and
            description; a check on the same member that matches meets the item.
    """

    item: str
    matches: str


@dataclass(frozen=True)
class Checklists:
    """Every member type's checklist, and where the table came from."""

    types: Mapping[str, tuple[ChecklistItem, ...]]
    source: str
    file: str


def _parse(text: str, file: str) -> Checklists:
    from calcpack.refdata import parse_table

    table = parse_table(text, file, "key")
    types: dict[str, list[ChecklistItem]] = {}
    for key, row in table.rows.items():
        member_type = str(row.get("member_type") or "").strip().lower()
        item = str(row.get("item") or "").strip()
        matches = str(row.get("matches") or "").strip()
        if not member_type or not item or not matches:
            raise InputError(
                f"Checklist table {file}, row {key!r}: member_type, item and matches must all "
                f"be given (got {member_type!r}, {item!r}, {matches!r})",
                name=key,
                value=dict(row),
                expected="member_type, item and a regular expression in matches",
            )
        try:
            re.compile(matches, re.IGNORECASE)
        except re.error as exc:
            raise InputError(
                f"Checklist table {file}, row {key!r}: matches {matches!r} is not a valid "
                f"regular expression ({exc})",
                name=key,
                value=matches,
                expected="a regular expression",
            ) from exc
        types.setdefault(member_type, []).append(ChecklistItem(item, matches))
    source = table.citation
    return Checklists({k: tuple(v) for k, v in types.items()}, source, file)


def load_checklists(project_root: Path | None = None) -> Checklists:
    """The checklists that apply: the project's own ``member_checklists.csv`` when its folder
    holds one, else the shipped table.

    Raises:
        InputError: the table is malformed (the message names the file and the row).
    """
    if project_root is not None:
        own = project_root / CHECKLIST_FILE
        if own.is_file():
            return _parse(own.read_text(encoding="utf-8"), str(own))
    from importlib import resources

    text = resources.files("calcpack.refdata").joinpath(CHECKLIST_FILE).read_text("utf-8")
    return _parse(text, CHECKLIST_FILE)


def checklist_items(
    member_type: str, project_root: Path | None = None
) -> tuple[str, tuple[ChecklistItem, ...], str]:
    """(the member type as the table names it, its items, the table's source).

    Raises:
        InputError: no checklist for ``member_type`` (the message lists the types).
    """
    lists = load_checklists(project_root)
    wanted = " ".join(str(member_type).split()).lower()
    wanted = MEMBER_ALIASES.get(wanted, wanted)
    if wanted not in lists.types:
        from calcpack.validate import suggest

        known = sorted(lists.types)
        hint = suggest(wanted, [*known, *MEMBER_ALIASES])
        extra = f"; did you mean {hint[0]!r}?" if hint else ""
        raise InputError(
            f"No checklist for member type {member_type!r} in {lists.file} (its types: "
            f"{', '.join(known)}){extra}",
            name="member_type",
            value=member_type,
            expected="one of " + ", ".join(known),
        )
    return wanted, lists.types[wanted], lists.source


def _reasons(
    what: str, given: Mapping[str, str] | None, items: Sequence[ChecklistItem]
) -> dict[str, str]:
    """``given`` keyed by the table's own item words (matched ignoring case)."""
    by_lower = {i.item.lower(): i.item for i in items}
    out: dict[str, str] = {}
    for key, reason in (given or {}).items():
        found = by_lower.get(" ".join(str(key).split()).lower())
        if found is None:
            from calcpack.validate import suggest

            hint = suggest(str(key), list(by_lower.values()))
            extra = f"; did you mean {hint[0]!r}?" if hint else ""
            raise InputError(
                f"{what}: {key!r} is not an item of this checklist (its items: "
                f"{'; '.join(by_lower.values())}){extra}",
                name=what,
                value=key,
                expected="an item of the checklist, as the table words it",
            )
        if not isinstance(reason, str) or not reason.strip():
            raise InputError(
                f"{what}: item {found!r} needs a reason in words (got {reason!r})",
                name=what,
                value=reason,
                expected="a non-empty reason",
            )
        out[found] = reason.strip()
    return out


@dataclass(frozen=True)
class MemberChecklist:
    """A member's checklist as a sheet declares it (the record the package resolves).

    Attributes:
        member: the member's mark (``"B1"``), as the checks on it name it.
        member_type: the checklist's member type.
        items: the checklist's items.
        not_applicable: item -> the reason it does not apply.
        met_by: item -> the member (or check name) whose check meets it (``"P1"``).
        source: the table's source (common practice, or the firm's own).
        not_covered: item -> why the package leaves it unchecked (it stays NOT COVERED, with
            the reason shown beside it).
    """

    member: str
    member_type: str
    items: tuple[ChecklistItem, ...]
    not_applicable: Mapping[str, str]
    met_by: Mapping[str, str]
    source: str
    not_covered: Mapping[str, str] = field(default_factory=dict)

    def to_json(self) -> dict[str, Any]:
        return {
            "member": self.member,
            "member_type": self.member_type,
            "source": self.source,
            "items": [
                {
                    "item": i.item,
                    "matches": i.matches,
                    "not_applicable": self.not_applicable.get(i.item),
                    "met_by": self.met_by.get(i.item),
                    "not_covered": self.not_covered.get(i.item),
                }
                for i in self.items
            ],
        }


def member_checklist(
    member_type: str,
    *,
    member: str,
    not_applicable: Mapping[str, str] | None = None,
    met_by: Mapping[str, str] | None = None,
    not_covered: Mapping[str, str] | None = None,
    project_root: Path | None = None,
) -> MemberChecklist:
    """A member's checklist, validated.

    Args:
        member_type: ``"steel beam"``, ``"timber beam"`` (or ``"joist"``), ``"post"`` (or
            ``"column"``), ``"truss"``, ``"bearing"``, ``"footing"``, ``"connection"``, or a
            type of the project's own table.
        member: the member's mark, as its checks name it (``"B1"``).
        not_applicable: item -> reason it does not apply (words, required).
        met_by: item -> the member or check that meets it elsewhere (``"P1"``).
        not_covered: item -> why the package does not check it (words, required): it stays
            NOT COVERED in the summary and on the cover, with the reason beside it.
        project_root: the project folder (for its own table).

    Raises:
        InputError: unknown member type or item, an empty reason, an item declared in more
            than one of not_applicable, met_by and not_covered, or no member mark.
    """
    non_empty("member", member, expected='the member\'s mark as its checks name it, e.g. "B1"')
    kind, items, source = checklist_items(member_type, project_root)
    na = _reasons("not_applicable", not_applicable, items)
    met = _reasons("met_by", met_by, items)
    nc = _reasons("not_covered", not_covered, items)
    declared = (("not_applicable", na), ("met_by", met), ("not_covered", nc))
    for i, (first, a) in enumerate(declared):
        for second, b in declared[i + 1 :]:
            both = sorted(set(a) & set(b))
            if both:
                raise InputError(
                    f"Checklist of {member}: {both[0]!r} is declared both {first} "
                    f"({a[both[0]]!r}) and {second} ({b[both[0]]!r}); choose one",
                    name=first,
                    value=both[0],
                    expected=f"an item in only one of {first} and {second}",
                )
    return MemberChecklist(member.strip(), kind, items, na, met, source, nc)


def member_matches(mark: str, check_member: str | None) -> bool:
    """Whether a check on ``check_member`` (``"B1 at posts"``, ``"P1, P2"``) is on ``mark``."""
    if not check_member:
        return False
    pattern = r"(?<![A-Za-z0-9])" + re.escape(mark.strip()) + r"(?![A-Za-z0-9])"
    return re.search(pattern, check_member, re.IGNORECASE) is not None


@dataclass(frozen=True)
class ItemStatus:
    """Where one checklist item stands in the package.

    Attributes:
        sheet: the sheet that declared the checklist (its number).
        member, member_type, item: what the item is.
        status: met, not applicable, or NOT COVERED.
        detail: the checks that meet it ("sheet 2: Flexure"), the reason it does not apply, or
            why it counts as not covered.
    """

    sheet: str
    member: str
    member_type: str
    item: str
    status: Status
    detail: str


def _text(check: Mapping[str, Any]) -> str:
    return " ".join(str(check.get(k) or "") for k in ("name", "ref", "description"))


def resolve_checklists(
    checklists: Iterable[tuple[str, Mapping[str, Any]]],
    checks: Sequence[tuple[str, Mapping[str, Any]]],
) -> list[ItemStatus]:
    """Each checklist item's status against the package's checks.

    Args:
        checklists: (sheet number, checklist record as :meth:`MemberChecklist.to_json`).
        checks: (sheet number, check record) for every check of the package; a NOT COVERED
            check meets nothing.

    An item is met when a check on the same member (:func:`member_matches`) matches the
    item's expression, or -- declared ``met_by`` another member or check -- when the package
    holds a check of that name or on that member (e.g. the posts a beam bears on).
    """
    done = [(n, c) for n, c in checks if c.get("verdict") in ("OK", "NOT OK")]
    out: list[ItemStatus] = []
    for sheet, record in checklists:
        mark = str(record.get("member", ""))
        kind = str(record.get("member_type", ""))
        for it in record.get("items", []):
            item = str(it.get("item", ""))
            rx = re.compile(str(it.get("matches") or "(?!)"), re.IGNORECASE)
            reason = it.get("not_applicable")
            if reason:
                out.append(ItemStatus(sheet, mark, kind, item, "not applicable", str(reason)))
                continue
            left = it.get("not_covered")
            if left:
                out.append(ItemStatus(sheet, mark, kind, item, "NOT COVERED", str(left)))
                continue
            other = it.get("met_by")
            if other:
                other = str(other)
                found = [
                    (n, c)
                    for n, c in done
                    if str(c.get("name", "")).lower() == other.lower()
                    or member_matches(other, c.get("member"))
                ]
                if not found:
                    why = f"declared met by {other}, but the package has no such check"
                    out.append(ItemStatus(sheet, mark, kind, item, "NOT COVERED", why))
                    continue
            else:
                found = [
                    (n, c)
                    for n, c in done
                    if member_matches(mark, c.get("member")) and rx.search(_text(c))
                ]
            if found:
                where = "; ".join(dict.fromkeys(f"sheet {n}: {c.get('name')}" for n, c in found))
                out.append(ItemStatus(sheet, mark, kind, item, "met", where))
            else:
                why = "no check in the package meets it, and it is not declared not applicable"
                out.append(ItemStatus(sheet, mark, kind, item, "NOT COVERED", why))
    return out
