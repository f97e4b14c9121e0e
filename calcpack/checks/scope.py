"""Material values a design standard covers: a value outside the range is refused as out of scope.

The ranges are reference data (``calcpack/refdata/material_scope.csv``, with their source per
row). A steel check given timber-like F_y or E, or a timber check given a steel E, is a mistake in
the inputs that would otherwise give a confident wrong verdict; calcpack refuses it instead.
"""

from __future__ import annotations

from functools import cache

from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require

__all__ = ["MaterialOutOfScopeError", "material_in_scope"]


class MaterialOutOfScopeError(OutOfScopeError, InputError):
    """A material value outside the range a design standard covers (a refusal, and an input
    error naming the input).

    Args:
        name: the input's name (``"Fy"``, ``"E"``). value: the value given.
        lo, hi: the range the standard covers. standard: the standard's short name.
        source: where the range comes from.
    """

    def __init__(
        self, name: str, value: Quantity, lo: Quantity, hi: Quantity, standard: str, source: str
    ) -> None:
        shown = value.to(lo.units)
        InputError.__init__(
            self,
            f"Input {name} = {shown:~P} is outside the range {standard} covers "
            f"({lo:~P} to {hi:~P}); check the value and its units ({source})",
            name=name,
            value=value,
            expected=f"{lo:~P} to {hi:~P}",
        )
        self.args = (name, value, lo, hi, standard, source)  # so that it unpickles as raised
        self.lo = lo
        self.hi = hi
        self.standard = standard


@cache
def _range(key: str) -> tuple[Quantity, Quantity, str, str]:
    row = read_table("material_scope.csv", key="key").row(key, what="standard|material|property")
    unit = str(row["unit"])
    return (
        Q_(float(row["lo"]), unit),
        Q_(float(row["hi"]), unit),
        str(row["standard"]),
        str(row["source"]),
    )


def material_in_scope(key: str, name: str, value: Quantity) -> Quantity:
    """Return ``value`` if it lies in the range the standard covers (``key`` as in the table,
    e.g. ``"AISC 360-16|steel|Fy"``).

    Raises:
        DimensionError: not a stress. MaterialOutOfScopeError: outside the range.
    """
    require(value, "[pressure]", name, positive=True)
    lo, hi, standard, source = _range(key)
    if not lo <= value <= hi:
        raise MaterialOutOfScopeError(name, value, lo, hi, standard, source)
    return value
