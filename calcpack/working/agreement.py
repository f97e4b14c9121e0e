"""How a checker's independent value is compared with the preparer's record: one definition,
read by the package build and by the checker's sheet in JupyterLab.

The preparer's result is found in the preparer sheet's records -- a recorded value of that
name, an exported value (per load case), or, with a member, the highest utilisation of the
checks of that name on that member. The checker's value is converted to the preparer's unit;
the relative difference |checker - preparer| / |preparer| (absolute when the preparer's value
is 0) agrees when it does not exceed the checker's tolerance.
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Mapping
from dataclasses import dataclass
from typing import Any

__all__ = ["Agreement", "agreement", "recorded_result", "to_quantity"]

_SUPERSCRIPTS = str.maketrans({"²": "**2", "³": "**3", "⁴": "**4", "·": "*", "⁻": "-", "¹": "1"})


def to_quantity(value: float, unit: str) -> Any:
    """A quantity from a recorded magnitude and its unit as the records show it (``"kN·m"``,
    ``"N/mm²"``; "" for a pure number)."""
    from calcpack.units import ureg

    return ureg.Quantity(value, (unit or "dimensionless").translate(_SUPERSCRIPTS))


def recorded_result(
    *,
    values: Iterable[Mapping[str, Any]],
    checks: Iterable[Mapping[str, Any]],
    exports: Iterable[Mapping[str, Any]],
    name: str,
    member: str | None = None,
    case: str | None = None,
) -> tuple[float, str] | None:
    """The preparer's recorded result ``name`` and its unit ("" for a utilisation), or None
    when the records hold no such result (see the module docstring for the search order)."""
    if member is not None:
        from calcpack.checks.checklists import member_matches

        found = [
            float(c["utilisation"])
            for c in checks
            if c.get("name") == name
            and member_matches(str(member), c.get("member"))
            and c.get("utilisation") is not None
        ]
        return (max(found), "") if found else None
    if case is None:
        for value in values:
            if value.get("name") == name and value.get("value") is not None:
                return float(value["value"]), str(value.get("unit", ""))
    for e in exports:
        if e.get("name") == name and e.get("case") == case and e.get("value") is not None:
            return float(e["value"]), str(e.get("unit", ""))
    return None


@dataclass(frozen=True)
class Agreement:
    """A checker's value compared with the preparer's, both in ``unit`` (the preparer's).

    Attributes:
        preparer_value, checker_value: magnitudes in ``unit``.
        difference: relative difference (absolute when the preparer's value is 0).
        tolerance: the checker's tolerance, a fraction.
        agreed: difference <= tolerance.
    """

    preparer_value: float
    checker_value: float
    unit: str
    difference: float
    tolerance: float
    agreed: bool


def agreement(
    preparer: float, unit: str, checker: float, checker_unit: str, tolerance: float
) -> Agreement:
    """Compare the checker's ``checker`` (in ``checker_unit``) with the preparer's ``preparer``
    (in ``unit``) at ``tolerance`` (a fraction).

    Raises:
        pint.DimensionalityError (and pint's other errors): the checker's unit does not
            convert to the preparer's; the caller names the check in its own error.
    """
    mine = float(to_quantity(checker, checker_unit).to(to_quantity(1.0, unit).units).magnitude)
    scale = abs(preparer)
    difference = abs(mine - preparer) / scale if scale > 0 else abs(mine)
    return Agreement(
        preparer_value=float(preparer),
        checker_value=mine,
        unit=unit,
        difference=difference,
        tolerance=float(tolerance),
        agreed=math.isfinite(difference) and difference <= tolerance * (1 + 1e-12),
    )
