"""Self-weight of a member as a line load, and area loads as line loads by tributary width.

``self_weight(area=..., density=...)`` gives the uniform line load w = A·γ (downward +) of a
prismatic member: ``density`` may be a weight density (kN/m³, pcf) or a mass density (kg/m³,
lb/ft³ of mass), which is multiplied by standard gravity g_n = 9.806 65 m/s² (the exact
conventional value, CGPM 1901). ``area`` may be a quantity or any section-properties object
with an ``A`` attribute (e.g. ``shape.properties()``).
"""

from __future__ import annotations

from typing import Any

from calcpack.errors import DimensionError
from calcpack.loads.types import AreaLoad, UniformLoad
from calcpack.units import Q_, Quantity, is_quantity, require

__all__ = ["G_N", "self_weight", "tributary_line_load"]

G_N = Q_(9.80665, "m/s**2")  # standard gravity, exact by definition


def _weight_density(density: Quantity) -> Quantity:
    if not is_quantity(density):
        require(density, "[force]/[length]**3", "density")
    if density.check("[mass]/[length]**3"):
        return (require(density, "[mass]/[length]**3", "density", positive=True) * G_N).to(
            "kN/m**3"
        )
    if density.check("[force]/[length]**3"):
        return require(density, "[force]/[length]**3", "density", positive=True)
    raise DimensionError(
        f"Input density must be a weight density (kN/m³, pcf) or a mass density (kg/m³) (got "
        f"{density:~P}, which is {density.dimensionality})",
        name="density",
        value=density,
        expected="[force]/[length]³ or [mass]/[length]³",
    )


def self_weight(
    *,
    area: Quantity | Any,
    density: Quantity,
    case: str = "D",
    label: str | None = "self-weight",
    start: Quantity | None = None,
    end: Quantity | None = None,
) -> UniformLoad:
    """The self-weight line load w = A·γ of a prismatic member (downward +), in kN/m.

    Args:
        area: cross-section area [length²], or an object with ``.A`` (section properties).
        density: weight density [force/length³] or mass density [mass/length³] (× g_n).
        case: load case (default ``"D"``). start, end: extent (default the whole beam).
    """
    A = area.A if hasattr(area, "A") and not is_quantity(area) else area
    A = require(A, "[length]**2", "area", positive=True)
    w = (A * _weight_density(density)).to("kN/m")
    kw: dict[str, Any] = {"case": case, "label": label}
    if start is not None:
        kw["start"] = start
    if end is not None:
        kw["end"] = end
    return UniformLoad(w=w, **kw)


def tributary_line_load(
    *, q: Quantity, width: Quantity, case: str, label: str | None = None, **extent: Any
) -> AreaLoad:
    """An area load q [force/area] on a tributary ``width``: a line load w = q·width (the
    :class:`~calcpack.loads.AreaLoad`, which keeps q and the width for the working)."""
    return AreaLoad(q=q, width=width, case=case, label=label, **extent)
