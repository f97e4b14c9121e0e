"""Fast quantity handling for the numeric cores: SI magnitudes with the factor to base units
cached per unit, dimension checks cached per unit, and result quantities made without pint's
per-call checks.

Same results as :func:`calcpack.units.si`, :func:`calcpack.units.require` and ``Q_`` for
multiplicative units (all the units of forces, lengths and moments); going through pint for
every number made the live solve slow.
"""

from __future__ import annotations

import functools
from math import isfinite
from typing import Any

import numpy as np

from calcpack.units import Q_, require, si, ureg

__all__ = ["check", "fast_si", "make_quantity"]

_FACTORS: dict[Any, float] = {}


def fast_si(q: Any) -> float:
    """SI base magnitude of a (scalar) quantity of a multiplicative unit, as a float."""
    units = q._units
    f = _FACTORS.get(units)
    if f is None:
        f = si(q.__class__(1.0, units))
        _FACTORS[units] = f
    return float(q._magnitude) * f


def make_quantity(magnitude: Any, unit: Any) -> Any:
    """``Q_(magnitude, unit)`` for a float or float array and a ``pint.Unit`` of the registry,
    without pint's per-call checks (type dispatch, registry lookup): results are made in bulk.

    Anything else (int, list, string, a unit given as text) goes through ``Q_``.
    """
    if isinstance(magnitude, float | np.ndarray) and type(unit) is _unit_type() and _fast_ok():
        q = object.__new__(_QUANTITY)
        q._magnitude = magnitude
        q._units = unit._units
        return q
    return Q_(magnitude, unit)


@functools.cache
def _unit_type() -> type[Any]:
    return type(ureg.Unit("m"))


@functools.cache
def _fast_ok() -> bool:
    """True if the fast path builds the same quantity as pint's constructor (checked once, on
    first use, so a pint release that stores quantities differently falls back to ``Q_``)."""
    try:
        unit = ureg.Unit("kN*m")
        fast = object.__new__(_QUANTITY)
        fast._magnitude = 2.5
        fast._units = unit._units
        ref = Q_(2.5, unit)
        return bool(fast.__dict__ == ref.__dict__ and fast.to("N*m").magnitude == 2500.0)
    except Exception:  # any change in pint's internals: use the ordinary constructor
        return False


_QUANTITY = Q_


_CHECKED: set[tuple[Any, str]] = set()
_SCALARS = (float, int)  # exact types: bool and numpy scalars take the full check


def check(value: Any, dimension: str, name: str, *, positive: bool = False) -> Any:
    """:func:`calcpack.units.require` with the dimension check cached per unit.

    A quantity of calcpack's registry with a float or int magnitude in a unit already seen for
    ``dimension`` skips pint's dimensional analysis; anything else (another registry, not a
    quantity, array magnitude, non-finite, wrong sign, new unit) goes through
    ``require``, which raises with its usual message.
    """
    if type(value) is _QUANTITY:
        mag = value._magnitude
        if (
            type(mag) in _SCALARS
            and (value._units, dimension) in _CHECKED
            and isfinite(mag)
            and (not positive or mag > 0)
        ):
            return value
    out = require(value, dimension, name, positive=positive)
    if type(out) is _QUANTITY and isinstance(out._magnitude, float | int):
        _CHECKED.add((out._units, dimension))
    return out
