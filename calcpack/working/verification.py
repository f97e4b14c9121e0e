"""The checker's independent check of a preparer's result, as a sheet step.

A checker's sheet computes a result by its own means (a beam table, the method of sections,
another program, a hand estimate) and declares it a check of a named result of a preparer's
sheet, with a tolerance and the method. The step shows the checker's value, the tolerance and
the method; the package build compares it with the preparer's record (value, difference,
agreed or not) -- see :mod:`calcpack.package.verification`. Records key ``"verifications"``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

import pint

from calcpack.errors import DimensionError, InputError
from calcpack.units import DisplaySettings, ureg
from calcpack.working.agreement import Agreement, agreement, recorded_result, to_quantity
from calcpack.working.format import format_unit_text
from calcpack.working.links import SheetRef
from calcpack.working.steps import Table, Text, Value

__all__ = [
    "KeyResults",
    "RecordComparison",
    "Verification",
    "compare_with_record",
    "tolerance_fraction",
    "verification_entry",
]


def tolerance_fraction(tolerance: Any) -> float:
    """The tolerance as a fraction: ``0.05`` or ``5 * ureg.percent`` both give 0.05.

    Raises:
        InputError: not a number, not finite, negative, or a quantity with a unit other than
            a fraction (percent, dimensionless).
    """
    value: Any = tolerance
    if isinstance(tolerance, pint.Quantity):
        if not tolerance.dimensionless:
            raise InputError(
                f"Tolerance must be a fraction or a percentage (got tolerance = {tolerance:~P})",
                name="tolerance",
                value=tolerance,
                expected="e.g. 0.05 or 5 * ureg.percent",
            )
        value = tolerance.to("dimensionless").magnitude
    if isinstance(value, bool) or not isinstance(value, int | float):
        raise InputError(
            f"Tolerance must be a number (got tolerance = {tolerance!r})",
            name="tolerance",
            value=tolerance,
            expected="a fraction such as 0.05 (5 %)",
        )
    if not math.isfinite(value) or value < 0:
        raise InputError(
            f"Tolerance must be a finite number not below 0 (got tolerance = {value!r})",
            name="tolerance",
            value=tolerance,
            expected="a fraction such as 0.05 (5 %)",
        )
    return float(value)


def verification_entry(
    sheet: SheetRef,
    name: str,
    value: Value | pint.Quantity | float,
    *,
    tolerance: Any,
    method: str,
    member: str | None = None,
    case: str | None = None,
) -> dict[str, Any]:
    """The record of one independent check (see the module docstring).

    ``member`` given: ``name`` is a check of the preparer's sheet on that member, and ``value``
    the checker's utilisation of it.

    Raises:
        InputError: bad tolerance, no method, or a value that is not a finite number.
    """
    fraction = tolerance_fraction(tolerance)
    if not isinstance(method, str) or not method.strip():
        raise InputError(
            f"An independent check of {name} must name its method (got method = {method!r})",
            name="method",
            value=method,
            expected='words such as "beam table, AISC Manual Table 3-23, simple beam"',
        )
    if isinstance(value, Value):
        q = value.display_quantity
    elif isinstance(value, pint.Quantity):
        q = value
    elif isinstance(value, int | float) and not isinstance(value, bool):
        q = ureg.Quantity(float(value), "dimensionless")
    else:
        raise InputError(
            f"The checker's value of {name} must be a value or quantity (got {value!r})",
            name=name,
            value=value,
            expected="a Derived value, a quantity, or a number for a utilisation",
        )
    if not math.isfinite(float(q.magnitude)):
        raise InputError(
            f"The checker's value of {name} must be finite (got {q})",
            name=name,
            value=q,
            expected="a finite number",
        )
    return {
        "of_sheet": sheet.path,
        "of_number": sheet.number,
        "of_name": name,
        "member": member,
        "case": case,
        "kind": "utilisation" if member is not None else "value",
        "value": float(q.magnitude),
        "unit": format_unit_text(q.units),
        "pint_unit": format(q.units, "D"),
        "tolerance": fraction,
        "method": method.strip(),
    }


def _what(entry: dict[str, Any]) -> str:
    what = str(entry["of_name"]) + (f" ({entry['member']})" if entry.get("member") else "")
    return what + (f", case {entry['case']}" if entry.get("case") else "")


@dataclass(frozen=True)
class RecordComparison:
    """An independent check compared, in JupyterLab, with the preparer's latest record.

    Attributes:
        agreement: the comparison (None when there is nothing to compare with).
        stale: why the record may be older than the preparer's sheet (None when current).
        missing: why there is nothing to compare with (None when compared).
    """

    agreement: Agreement | None
    stale: str | None = None
    missing: str | None = None

    @property
    def note(self) -> str | None:
        """Words for the checker when the comparison is not a current one."""
        if self.missing is not None:
            return f"Not compared: {self.missing}."
        if self.stale is not None:
            return f"The preparer's record may be out of date: {self.stale}."
        return None


def compare_with_record(ref: SheetRef, entry: dict[str, Any]) -> RecordComparison:
    """Compare an independent check (:func:`verification_entry`) with the latest results the
    preparer's sheet ``ref`` recorded in JupyterLab or in the latest build.

    Raises:
        DimensionError: the record is current and the checker's unit does not convert to the
            preparer's (the build would refuse the check too).
    """
    from calcpack.working.links import staleness
    from calcpack.working.recorded import read_results

    run = f"run {ref.name} (sheet {ref.number}) first, or build the project"
    results = read_results(ref)
    if results is None:
        return RecordComparison(
            None, missing=f"sheet {ref.number} ({ref.name}) has no recorded results yet; {run}"
        )
    why = staleness(ref, results)
    stale = f"{why}; {run}" if why is not None else None
    found = recorded_result(
        values=results.values,
        checks=results.checks,
        exports=results.exports,
        name=entry["of_name"],
        member=entry.get("member"),
        case=entry.get("case"),
    )
    if found is None:
        kind = "check" if entry.get("member") is not None else "value"
        return RecordComparison(
            None,
            stale=stale,
            missing=(
                f"the latest record of sheet {ref.number} ({ref.name}) has no {kind} "
                f"{_what(entry)}"
                + (f" ({stale})" if stale else "; the build will refuse this check")
            ),
        )
    preparer, unit = found
    try:
        compared = agreement(preparer, unit, entry["value"], entry["unit"], entry["tolerance"])
    except (pint.errors.PintError, ValueError, TypeError) as exc:
        if stale is None:
            raise DimensionError(
                f"The checker's {_what(entry)} is in {entry['unit']!r}, which does not convert "
                f"to the unit of sheet {ref.number}'s {entry['of_name']} ({unit!r})",
                name=str(entry["of_name"]),
                value=to_quantity(entry["value"], entry["unit"]),
                expected=f"a value in {unit or 'a pure number'} or a unit of its dimension",
            ) from exc
        return RecordComparison(
            None, stale=stale, missing=f"the units do not convert ({entry['unit']!r} to {unit!r})"
        )
    return RecordComparison(compared, stale=stale)


class Verification(Table):
    """The checker's value of a preparer's result, shown with its tolerance and method; with a
    ``comparison`` (JupyterLab only), also the preparer's value, the difference and whether they
    agree."""

    def __init__(
        self,
        entry: dict[str, Any],
        *,
        settings: DisplaySettings | None = None,
        comparison: RecordComparison | None = None,
    ) -> None:
        q = ureg.Quantity(entry["value"], entry["pint_unit"])
        label = f"sheet {entry['of_number']}, {_what(entry)}"
        tolerance = f"{entry['tolerance'] * 100:g} %"
        found = comparison.agreement if comparison is not None else None
        if comparison is None:
            columns = ["Result checked", "Checker's value", "Tolerance", "Method"]
            row: list[Any] = [label, q, tolerance, entry["method"]]
            caption = "Independent check (compared with the preparer's record in the package)"
        elif found is None:
            columns = ["Result checked", "Checker's value", "Tolerance", "Method"]
            row = [label, q, tolerance, entry["method"]]
            caption = f"Independent check. {comparison.note}"
        else:
            columns = [
                "Result checked",
                "Preparer's value",
                "Checker's value",
                "Difference",
                "Tolerance",
                "Agreement",
                "Method",
            ]
            row = [
                label,
                to_quantity(found.preparer_value, found.unit),
                to_quantity(found.checker_value, found.unit),
                f"{found.difference * 100:.2f} %",
                tolerance,
                "agreed" if found.agreed else "DISAGREES",
                entry["method"],
            ]
            caption = (
                "Independent check compared with the preparer's latest record (shown in "
                "JupyterLab; the package compares with the build's own record)"
            )
            if comparison.note:
                caption += f". {comparison.note}"
        super().__init__(columns, [row], caption=caption, settings=settings)
        self.entry = dict(entry)
        self.comparison = comparison

    def records(self) -> dict[str, list[Any]]:
        return {"verifications": [dict(self.entry)]}


class KeyResults(Text):
    """The results a sheet declares key, for the checker's coverage in the package."""

    def __init__(self, items: list[tuple[str, str | None]]) -> None:
        words = ", ".join(f"{n} ({m})" if m else n for n, m in items)
        super().__init__(
            f"**Key results of this sheet** (for the checker's verification): {words}."
        )
        self.items = list(items)

    def records(self) -> dict[str, list[Any]]:
        return {"key_results": [{"name": n, "member": m} for n, m in self.items]}
