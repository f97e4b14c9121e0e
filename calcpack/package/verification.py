"""The checker's independent checks in the build: compared with the preparer's records, their
disagreements opened as review comments, listed in the package, and the key results' coverage.

Each independent check (:mod:`calcpack.working.verification`) names a result of a preparer's
sheet. The build finds that result in the sheet's records and compares by the one rule of
:mod:`calcpack.working.agreement` (the checker's sheet shows the same comparison in JupyterLab
from the preparer's latest record, for the checker only). A disagreement becomes an
open review comment (once; the checker closes it as any other), so the checker's signature is
refused by the same rule and override as for open comments.

The checker's sheets are the checker's: a project whose checker is its preparer is refused
unless the project file records why (``[verification] same_person = "reason"``).
"""

from __future__ import annotations

import re
import tomllib
from collections.abc import Sequence
from dataclasses import asdict, dataclass
from typing import TYPE_CHECKING, Any

from calcpack.errors import BuildError
from calcpack.working.agreement import agreement, recorded_result

if TYPE_CHECKING:
    from calcpack.package.document import SheetDoc
    from calcpack.package.project import Project

__all__ = [
    "COMMENT_MARK",
    "Compared",
    "compare_verifications",
    "key_results",
    "open_disagreements",
    "same_person_reason",
]

COMMENT_MARK = "Independent check disagrees"
"""The opening words of a comment the build opens for a disagreement (to open it only once)."""


@dataclass(frozen=True)
class Compared:
    """One independent check compared with the preparer's record.

    Attributes:
        checker_sheet: the checker's sheet (path) and ``checker_number``.
        of_sheet, of_number, of_name, member, case: the result checked.
        preparer_value, checker_value: both in ``unit`` (the preparer's).
        difference: relative difference |checker - preparer| / |preparer| (absolute when the
            preparer's value is 0).
        tolerance: the checker's tolerance (fraction).
        agreed: difference <= tolerance.
        method: how the checker got the value.
        same_person: see below.
    """

    checker_sheet: str
    checker_number: str
    of_sheet: str
    of_number: str
    of_name: str
    member: str | None
    case: str | None
    preparer_value: float
    checker_value: float
    unit: str
    difference: float
    tolerance: float
    agreed: bool
    method: str
    same_person: str | None = None
    """The recorded reason the checker is the preparer, when the project gives one."""

    @property
    def label(self) -> str:
        """ "sheet 2, M_max" (with member and case when given)."""
        what = self.of_name + (f" ({self.member})" if self.member else "")
        return f"sheet {self.of_number}, {what}" + (f", case {self.case}" if self.case else "")

    def to_json(self) -> dict[str, Any]:
        return asdict(self)


def _preparer_value(doc: SheetDoc, v: dict[str, Any]) -> tuple[float, str] | None:
    return recorded_result(
        values=doc.records.values,
        checks=doc.records.checks,
        exports=doc.records.exports,
        name=v["of_name"],
        member=v.get("member"),
        case=v.get("case"),
    )


def same_person_reason(project: Project) -> str | None:
    """The recorded reason the checker may be the preparer (``[verification] same_person``)."""
    data = tomllib.loads(project.path.read_text(encoding="utf-8"))
    table = data.get("verification")
    reason = table.get("same_person") if isinstance(table, dict) else None
    return reason.strip() if isinstance(reason, str) and reason.strip() else None


def _norm(name: str) -> str:
    return " ".join(name.split()).casefold()


def compare_verifications(project: Project, docs: Sequence[SheetDoc]) -> tuple[Compared, ...]:
    """Every independent check of the package, compared with the preparer's record.

    Raises:
        BuildError: a check names a sheet not in the package or a result its sheet does not
            record (both named); a checker's sheet imports the value it checks; a unit that
            does not convert; or the checker is the preparer without a recorded reason.
    """
    by_path = {d.entry.path: d for d in docs}
    out: list[Compared] = []
    for doc in docs:
        for v in doc.records.verifications:
            same = _norm(project.checker.name) == _norm(project.preparer.name)
            if not out and same and same_person_reason(project) is None:
                raise BuildError(
                    f"Sheet {doc.entry.path!r} is an independent check, but the project's "
                    f"checker is its preparer ({project.preparer.name}); name another "
                    "checker, or record why in calcpack.toml: "
                    '[verification] same_person = "reason"'
                )
            target = by_path.get(v.get("of_sheet", ""))
            if target is None:
                raise BuildError(
                    f"Sheet {doc.entry.path!r} checks {v.get('of_name')!r} of sheet "
                    f"{v.get('of_sheet')!r}, which is not in the package"
                )
            for link in doc.records.imports:
                if (link.get("from_sheet"), link.get("from_name"), link.get("case")) == (
                    v["of_sheet"],
                    v["of_name"],
                    v.get("case"),
                ):
                    raise BuildError(
                        f"Sheet {doc.entry.path!r} imports {v['of_name']} from sheet "
                        f"{target.entry.number} and checks it: an independent check may not "
                        "read the value it checks"
                    )
            found = _preparer_value(target, v)
            if found is None:
                what = (
                    f"check {v['of_name']!r} on {v['member']}"
                    if v.get("member")
                    else (
                        f"value {v['of_name']!r}"
                        + (f" for case {v['case']}" if v.get("case") else "")
                    )
                )
                raise BuildError(
                    f"Sheet {doc.entry.path!r} checks the {what} of sheet "
                    f"{target.entry.number} ({target.entry.path}), which records no such result"
                )
            preparer, unit = found
            try:
                agreed = agreement(
                    preparer, unit, v["value"], v.get("unit", ""), float(v["tolerance"])
                )
            except Exception as exc:  # pint raises several kinds for a bad or foreign unit
                raise BuildError(
                    f"Sheet {doc.entry.path!r}: the checker's {v['of_name']} is in "
                    f"{v.get('unit')!r}, which does not convert to the preparer's {unit!r} "
                    f"({exc})"
                ) from exc
            out.append(
                Compared(
                    checker_sheet=doc.entry.path,
                    checker_number=doc.entry.number,
                    of_sheet=target.entry.path,
                    of_number=target.entry.number,
                    of_name=v["of_name"],
                    member=v.get("member"),
                    case=v.get("case"),
                    preparer_value=agreed.preparer_value,
                    checker_value=agreed.checker_value,
                    unit=unit,
                    difference=agreed.difference,
                    tolerance=agreed.tolerance,
                    agreed=agreed.agreed,
                    method=str(v.get("method", "")),
                    same_person=same_person_reason(project) if same else None,
                )
            )
    return tuple(out)


def _number(x: float) -> str:
    return f"{x:.4g}"


def comment_text(c: Compared) -> str:
    """The words of the review comment a disagreement opens."""
    unit = f" {c.unit}" if c.unit else ""
    return (
        f"{COMMENT_MARK}: {c.label} is {_number(c.preparer_value)}{unit} on the preparer's "
        f"sheet and {_number(c.checker_value)}{unit} by the checker ({c.method}, sheet "
        f"{c.checker_number}); difference {c.difference * 100:.2f} % exceeds the tolerance "
        f"{c.tolerance * 100:g} %."
    )


def open_disagreements(project: Project, compared: Sequence[Compared]) -> tuple[str, ...]:
    """Open a review comment for each disagreement not already commented (with the same
    values); returns the ids of the comments opened."""
    from calcpack.signing.review import add_comment, load_review

    existing = {(c.sheet, c.quantity, c.text) for c in load_review(project.root).comments}
    opened = []
    for c in compared:
        if c.agreed:
            continue
        text = comment_text(c)
        quantity = c.of_name + (f" ({c.member})" if c.member else "")
        if (c.of_sheet, quantity, text) in existing:
            continue
        who = project.checker.name
        comment = add_comment(
            project.root, sheet=c.of_sheet, text=text, who=who, quantity=quantity, recorded=True
        )
        opened.append(comment.id)
    return tuple(opened)


_PEAK = re.compile(r"^(M|V|delta|Delta|δ|Δ)_?max", re.IGNORECASE)


def key_results(doc: SheetDoc) -> list[tuple[str, str | None]]:
    """(name, member) of a sheet's key results: those it declares, else by default its
    exported values, its governing check per member (highest utilisation) and its maximum
    moments, shears and deflections (values named M_max, V_max, delta_max...)."""
    if doc.records.key_results:
        return [(str(k["name"]), k.get("member")) for k in doc.records.key_results]
    out: list[tuple[str, str | None]] = []
    for e in doc.records.exports:
        if e.get("kind") != "check" and (e["name"], None) not in out:
            out.append((str(e["name"]), None))
    governing: dict[str, dict[str, Any]] = {}
    for c in doc.records.checks:
        u, member = c.get("utilisation"), c.get("member")
        if u is None or not member:
            continue
        if member not in governing or u > governing[member]["utilisation"]:
            governing[member] = c
    out += [(str(c["name"]), str(m)) for m, c in governing.items()]
    for v in doc.records.values:
        name = str(v.get("name", ""))
        if v.get("kind") == "derived" and _PEAK.match(name) and (name, None) not in out:
            out.append((str(v["name"]), None))
    return out


def check_stage(project: Project, docs: Sequence[SheetDoc]) -> tuple[tuple[Compared, ...], bool]:
    """The build's step after execution: compare every independent check and open a review
    comment for each new disagreement. Returns (the comparisons, whether comments were opened
    -- the build then reads the review file again)."""
    compared = compare_verifications(project, docs)
    publish_results(project, docs)
    return compared, bool(open_disagreements(project, compared))


def publish_results(project: Project, docs: Sequence[SheetDoc]) -> None:
    """Write each built sheet's results file into the project's cache, where a checker's sheet
    in JupyterLab reads the preparer's latest record (:mod:`calcpack.working.recorded`). The
    build reads none of it; a project folder that cannot be written to only leaves JupyterLab
    without the comparison."""
    from calcpack.working.links import project_sheets
    from calcpack.working.recorded import write_results

    refs = {ref.path: ref for ref in project_sheets(project.root)}
    for doc in docs:
        ref = refs.get(doc.entry.path)
        if ref is None:
            continue
        records = {
            "values": doc.records.values,
            "checks": doc.records.checks,
            "exports": doc.records.exports,
        }
        try:
            write_results(ref, records)
        except OSError:
            return
