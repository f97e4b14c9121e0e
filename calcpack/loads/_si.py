"""A fast SI magnitude for the numeric cores: the factor to base units is cached per unit.

Same result as :func:`calcpack.units.si` for multiplicative units (all the units of forces,
lengths and moments); conversion through pint for every number made the live solve slow.
"""

from __future__ import annotations

from typing import Any

from calcpack.units import si

__all__ = ["fast_si"]

_FACTORS: dict[Any, float] = {}


def fast_si(q: Any) -> float:
    """SI base magnitude of a (scalar) quantity of a multiplicative unit, as a float."""
    units = q._units
    f = _FACTORS.get(units)
    if f is None:
        f = si(q.__class__(1.0, units))
        _FACTORS[units] = f
    return float(q._magnitude) * f


_CHECKED: set[tuple[Any, str]] = set()


def check(value: Any, dimension: str, name: str, *, positive: bool = False) -> Any:
    """:func:`calcpack.units.require` with the dimension check cached per unit.

    A unit already seen for ``dimension`` skips pint's dimensional analysis; anything unusual
    (not a quantity, array magnitude, non-finite, wrong sign, new unit) goes through
    ``require``, which raises with its usual message.
    """
    import math

    from calcpack.units import Quantity, require

    if isinstance(value, Quantity):
        mag = value._magnitude
        if (
            isinstance(mag, float | int)
            and (value._units, dimension) in _CHECKED
            and math.isfinite(mag)
            and (not positive or mag > 0)
        ):
            return value
    out = require(value, dimension, name, positive=positive)
    if isinstance(out._magnitude, float | int):
        _CHECKED.add((out._units, dimension))
    return out
