"""The checker's independent check of a preparer's result, as a sheet step.

A checker's sheet computes a result by its own means (a beam table, the method of sections,
another program, a hand estimate) and declares it a check of a named result of a preparer's
sheet, with a tolerance and the method. The step shows the checker's value, the tolerance and
the method; the package build compares it with the preparer's record (value, difference,
agreed or not) -- see :mod:`calcpack.package.verification`. Records key ``"verifications"``.
"""

from __future__ import annotations

import math
from typing import Any

import pint

from calcpack.errors import InputError
from calcpack.units import DisplaySettings, ureg
from calcpack.working.format import format_unit_text
from calcpack.working.links import SheetRef
from calcpack.working.steps import Table, Value

__all__ = ["Verification", "tolerance_fraction", "verification_entry"]


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


class Verification(Table):
    """The checker's value of a preparer's result, shown with its tolerance and method."""

    def __init__(self, entry: dict[str, Any], *, settings: DisplaySettings | None = None) -> None:
        q = ureg.Quantity(entry["value"], entry["pint_unit"])
        what = entry["of_name"] + (f" ({entry['member']})" if entry.get("member") else "")
        if entry.get("case"):
            what += f", case {entry['case']}"
        super().__init__(
            ["Result checked", "Checker's value", "Tolerance", "Method"],
            [
                [
                    f"sheet {entry['of_number']}, {what}",
                    q,
                    f"{entry['tolerance'] * 100:g} %",
                    entry["method"],
                ]
            ],
            caption="Independent check (compared with the preparer's record in the package)",
            settings=settings,
        )
        self.entry = dict(entry)

    def records(self) -> dict[str, list[Any]]:
        return {"verifications": [dict(self.entry)]}
