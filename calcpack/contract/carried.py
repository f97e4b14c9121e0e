"""Changes carried between sheets: a changed upstream value shown once, with what it changed.

A value one sheet exports and others import appears in a comparison of two manifests several
times: as the exporting sheet's result, as a given on each importing sheet, and in the
manifest's ``links``. This module compares the links themselves (so the archive check sees a
link whose value differs, and a link added or removed) and annotates the changes so a reader
sees the upstream value once -- "carried to sheet 2 as w" -- and each downstream change with
the upstream values it follows from. The copies on the importing sheets are marked, and the
displays leave them out.
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Mapping, Sequence
from dataclasses import replace
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from calcpack.contract.compare import Change

__all__ = ["annotate_carried", "link_changes"]

LinkKey = tuple[str, str, str, str, str]


def _key(link: Mapping[str, Any]) -> LinkKey:
    return (
        str(link.get("from_sheet", "")),
        str(link.get("from_name", "")),
        str(link.get("case") or ""),
        str(link.get("to_sheet", "")),
        str(link.get("to_name", "")),
    )


def _same(a: Any, b: Any, rel_tol: float) -> bool:
    if isinstance(a, int | float) and isinstance(b, int | float):
        return math.isclose(float(a), float(b), rel_tol=rel_tol, abs_tol=1e-300)
    return bool(a == b)


def _text(link: Mapping[str, Any] | None) -> str | None:
    if link is None:
        return None
    value = link.get("value")
    shown = f"{value:.6g}" if isinstance(value, int | float) else str(value)
    return f"{shown} {link.get('unit') or ''}".rstrip()


def _numbers(sheets: Iterable[Mapping[str, Any]]) -> dict[str, str]:
    return {str(s.get("path")): str(s.get("number", "?")) for s in sheets}


def _source(key: LinkKey, numbers: Mapping[str, str]) -> str:
    case = f"[{key[2]}]" if key[2] else ""
    return f"sheet {numbers.get(key[0], key[0])} {key[1]}{case}"


def _target(key: LinkKey, numbers: Mapping[str, str]) -> str:
    return f"sheet {numbers.get(key[3], key[3])} as {key[4]}"


def _changed_links(
    old: Mapping[str, Any], new: Mapping[str, Any], rel_tol: float
) -> dict[LinkKey, tuple[Mapping[str, Any] | None, Mapping[str, Any] | None]]:
    a = {_key(x): x for x in old.get("links") or [] if isinstance(x, Mapping)}
    b = {_key(x): x for x in new.get("links") or [] if isinstance(x, Mapping)}
    out = {}
    for key in [*b, *(k for k in a if k not in b)]:
        la, lb = a.get(key), b.get(key)
        if (
            la is None
            or lb is None
            or not (
                _same(la.get("value"), lb.get("value"), rel_tol)
                and la.get("unit") == lb.get("unit")
            )
        ):
            out[key] = (la, lb)
    return out


def link_changes(old: Mapping[str, Any], new: Mapping[str, Any], rel_tol: float) -> list[Change]:
    """A change (kind ``"link"``) for each link added, removed or carrying another value, when
    both manifests record links (a manifest without ``links`` is compared on its sheets only)."""
    from calcpack.contract.compare import Change

    if "links" not in old or "links" not in new:
        return []
    numbers = {**_numbers(old.get("sheets", [])), **_numbers(new.get("sheets", []))}
    out = []
    for key, (la, lb) in _changed_links(old, new, rel_tol).items():
        name = f"{key[4]} from {_source(key, numbers)}"
        out.append(
            Change(
                f"sheet {numbers.get(key[3], key[3])}",
                "link",
                name,
                _text(la),
                _text(lb),
                path=key[3],
            )
        )
    return out


def annotate_carried(
    changes: Sequence[Change], old: Mapping[str, Any], new: Mapping[str, Any], rel_tol: float
) -> list[Change]:
    """``changes`` with the carried values marked (see the module docstring).

    The upstream change (the exporting sheet's value of that name, or else the link itself)
    gets ``carried_to``; the importing sheets' copies get ``copy_of``; every other change on a
    sheet the changed values reach (directly or through further links) gets ``due_to``.
    """
    from calcpack.contract.compare import Change

    if "links" not in old or "links" not in new:
        return list(changes)
    changed = _changed_links(old, new, rel_tol)
    if not changed:
        return list(changes)
    numbers = {**_numbers(old.get("sheets", [])), **_numbers(new.get("sheets", []))}
    by_source: dict[tuple[str, str, str], list[LinkKey]] = {}
    for key in changed:
        by_source.setdefault(key[:3], []).append(key)
    copies = {(k[3], k[4]): k for k in changed}
    reach: dict[str, set[str]] = {}  # sheet -> the sheets its changed exports reach
    for k in changed:
        reach.setdefault(k[0], set()).add(k[3])
    due: dict[str, list[str]] = {}
    for keys in by_source.values():
        seen: set[str] = set()
        todo = [k[3] for k in keys]
        while todo:
            sheet = todo.pop()
            if sheet not in seen:
                seen.add(sheet)
                todo.extend(reach.get(sheet, ()))
        for sheet in sorted(seen):
            due.setdefault(sheet, []).append(_source(keys[0], numbers))
    out = list(changes)
    for i, c in enumerate(out):
        if c.kind == "input" and (c.path, c.name) in copies:
            out[i] = replace(c, copy_of=_source(copies[(c.path or "", c.name)], numbers))
        elif c.kind not in ("sheet", "link") and c.path in due:
            out[i] = replace(c, due_to=tuple(dict.fromkeys(due[c.path or ""])))
    recorded = {
        (str(sh.get("path")), str(v.get("name")))
        for sh in new.get("sheets", [])
        for v in sh.get("values", [])
    }
    for source, keys in by_source.items():
        targets = tuple(_target(k, numbers) for k in keys)
        for i, c in enumerate(out):
            if (c.path, c.name) == source[:2] and c.kind in ("input", "result") and not c.copy_of:
                out[i] = replace(c, carried_to=targets)
                break
        else:
            if source[:2] in recorded:
                continue  # the value is unchanged at its sheet: the link itself differs, shown
            # the exporting sheet records no value of that name (an exported quantity)
            la, lb = changed[keys[0]]
            out.append(
                Change(
                    f"sheet {numbers.get(source[0], source[0])}",
                    "result",
                    source[1] + (f"[{source[2]}]" if source[2] else ""),
                    _text(la),
                    _text(lb),
                    path=source[0],
                    carried_to=targets,
                )
            )
        for i, c in enumerate(out):  # the links' own changes are shown at the origin
            if c.kind == "link" and any(
                c.path == k[3] and c.name == f"{k[4]} from {_source(k, numbers)}" for k in keys
            ):
                out[i] = replace(c, copy_of=_source(keys[0], numbers))
    return out
