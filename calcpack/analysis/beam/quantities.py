"""Beam results as quantities in their display units, made from SI floats or arrays."""

from __future__ import annotations

from typing import Any

from calcpack.loads._si import make_quantity
from calcpack.units import Quantity, ureg

__all__ = ["out_q"]

# Display units of results, with the factor from SI (made once: building a quantity from a unit
# string parses it every time, which dominated a live solve).
_OUT = {
    "force": (1e-3, ureg.Unit("kN")),
    "moment": (1e-3, ureg.Unit("kN*m")),
    "line": (1e-3, ureg.Unit("kN/m")),
    "angle": (1.0, ureg.Unit("rad")),
    "deflection": (1e3, ureg.Unit("mm")),
    "length": (1.0, ureg.Unit("m")),
}


def out_q(value_si: Any, kind: str) -> Quantity:
    """A result quantity in its display unit from an SI value (float or array)."""
    f, unit = _OUT[kind]
    return make_quantity(value_si * f, unit)
