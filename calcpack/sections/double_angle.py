"""Double angles (2L), long or short legs back to back, from the single angle's tabulated
properties in the AISC Shapes Database v16.0 and the gap between the backs.

Axes: x horizontal, y the axis of symmetry between the angles. The vertical legs d (the first
leg of the single angle's designation as tabulated: the "web legs") are back to back with the
gap g; the horizontal legs b are the "flange legs". Properties: A = 2A_L, I_x = 2I_x,L,
S_x = 2S_x,L (to the toes of the web legs), Z_x = 2Z_x,L, ȳ = ȳ_L, J = 2J_L,
I_y = 2[I_y,L + A_L (x̄_L + g/2)²] (parallel axes), r = √(I/A). The angles are taken to act
together (connected along their length as §E6 requires in compression; for flexure, common
practice): the engineer confirms it.
"""

from __future__ import annotations

import math
from types import MappingProxyType

from calcpack.errors import InputError
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive

__all__ = ["double_angle"]


def double_angle(angle: SteelShape, *, gap: Quantity) -> SteelShape:
    """Two ``angle``s back to back with the gap ``gap`` between their vertical legs.

    Raises:
        InputError: not a single angle; gap not a length ≥ 0.
    """
    if not isinstance(angle, SteelShape) or angle.type != "L":
        raise InputError(
            name="angle",
            value=getattr(angle, "designation", angle),
            rule="must be a single angle from aisc_shape (e.g. aisc_shape('L4X4X1/4'))",
            expected="a single angle",
        )
    positive("gap", dimension("gap", gap, "[length]"), allow_zero=True)
    s = angle
    A = 2 * s["A"]
    Ix = 2 * s["Ix"]
    Iy = 2 * (s["Iy"] + s["A"] * (s["x"] + gap / 2) ** 2)
    props = {
        "A": A.to("inch**2"),
        "d": s["d"],
        "b": s["b"],
        "t": s["t"],
        "y": s["y"],
        "Ix": Ix.to("inch**4"),
        "Sx": (2 * s["Sx"]).to("inch**3"),
        "Zx": (2 * s["Zx"]).to("inch**3"),
        "rx": Q_(math.sqrt(float((Ix / A).to("inch**2").magnitude)), "inch"),
        "Iy": Iy.to("inch**4"),
        "ry": Q_(math.sqrt(float((Iy / A).to("inch**2").magnitude)), "inch"),
        "J": (2 * s["J"]).to("inch**4"),
    }
    name = f"2{s.designation} (gap {gap.to('inch'):~P})"
    src = f"2 × {s.source}, gap {gap.to('inch'):~P} (parallel axes)"
    return SteelShape(name, "2L", src, MappingProxyType(props))
