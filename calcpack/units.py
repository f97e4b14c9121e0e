"""The one unit registry calcpack uses everywhere, with the trade's units and display presets.

``ureg`` is also set as pint's application registry, so quantities made with ``pint.Quantity``
elsewhere interoperate. Inputs are pint quantities; use :func:`require` at an API boundary to
check the dimension and finiteness of an input and :func:`si` to take its SI magnitude for a
numeric core.

Display presets map a physical dimension to the unit a sheet shows it in (``"SI"``: kN, kN·m,
MPa, mm⁴...; ``"US"``: kip, kip·ft, ksi, in⁴...). The significant figures shown default to three
and are configurable globally with :func:`set_display` or per sheet.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any

import pint

from calcpack.contract.verdict import passes  # noqa: F401  (re-exported: the one pass rule)
from calcpack.errors import DimensionError, InputError

__all__ = [
    "PRESETS",
    "Q_",
    "DisplayPreset",
    "DisplaySettings",
    "Quantity",
    "get_display",
    "is_quantity",
    "quantity_kind",
    "require",
    "set_display",
    "si",
    "ureg",
]

ureg: pint.UnitRegistry = pint.UnitRegistry(
    autoconvert_offset_to_baseunit=True,
    on_redefinition="raise",
)
# The trade's US customary units that pint does not define by these names.
for _definition in (
    "psf = force_pound / foot ** 2",
    "ksf = kip / foot ** 2",
    "plf = force_pound / foot",
    "klf = kip / foot",
    "pcf = force_pound / foot ** 3",
    "kcf = kip / foot ** 3",
    "kipf = kip",
):
    ureg.define(_definition)
ureg.formatter.default_format = "~P"
pint.set_application_registry(ureg)

Q_ = ureg.Quantity
Quantity = pint.Quantity
"""The quantity type, for annotations."""


def is_quantity(value: object) -> bool:
    """True if ``value`` is a pint quantity."""
    return isinstance(value, pint.Quantity)


def _dimensionality(reference: str | pint.Unit | pint.Quantity) -> Any:
    if isinstance(reference, str) and reference.startswith("["):
        return ureg.get_dimensionality(reference)
    if isinstance(reference, str):
        return ureg.Unit(reference).dimensionality
    return reference.dimensionality


def require(
    value: object,
    dimension: str,
    name: str,
    *,
    positive: bool = False,
    nonnegative: bool = False,
) -> pint.Quantity:
    """Check an input quantity at an API boundary and return it.

    Args:
        value: the input as given.
        dimension: a pint dimension such as ``"[length]"`` or ``"[force] / [length]"``, or a
            unit of the wanted dimension such as ``"kN/m"``.
        name: the input's name as the user knows it, used in messages.
        positive: also require value > 0.
        nonnegative: also require value >= 0.

    Raises:
        DimensionError: not a quantity, or a quantity of another dimension.
        InputError: not finite, or not positive / non-negative when required.
    """
    want = _dimensionality(dimension)
    if not isinstance(value, pint.Quantity):
        raise DimensionError(
            f"Input {name} must be a quantity with units of {dimension} (got {value!r}, a bare "
            f"{type(value).__name__}); write e.g. {name} = 3.2 * ureg.m",
            name=name,
            value=value,
            expected=f"a quantity of {dimension}",
        )
    if value.dimensionality != want:
        raise DimensionError(
            f"Input {name} must have units of {dimension} (got {value:~P}, which is "
            f"{value.dimensionality})",
            name=name,
            value=value,
            expected=f"a quantity of {dimension}",
        )
    mag = value.magnitude
    try:
        finite = bool(math.isfinite(float(mag)))
    except TypeError:
        import numpy as np

        finite = bool(np.all(np.isfinite(np.asarray(mag, dtype=float))))
    if not finite:
        raise InputError(
            f"Input {name} must be a finite number (got {value:~P})",
            name=name,
            value=value,
            expected="a finite value",
        )
    if positive and not float(mag) > 0:
        raise InputError(
            f"Input {name} must be positive (got {name} = {value:~P})",
            name=name,
            value=value,
            expected="a value > 0",
        )
    if nonnegative and not float(mag) >= 0:
        raise InputError(
            f"Input {name} must not be negative (got {name} = {value:~P})",
            name=name,
            value=value,
            expected="a value >= 0",
        )
    return value


def si(value: pint.Quantity) -> float:
    """The magnitude of ``value`` in coherent SI base units (m, N, Pa, N·m...), as a float."""
    return float(value.to_base_units().magnitude)


@dataclass(frozen=True)
class DisplayPreset:
    """Which unit each physical dimension is shown in.

    Args:
        name: the preset's name (``"SI"``, ``"US"``).
        units: dimension string (pint form, e.g. ``"[length] ** 4"``) to unit string.
    """

    name: str
    units: Mapping[str, str]

    def unit_for(self, quantity: pint.Quantity) -> pint.Unit | None:
        """The preset unit for ``quantity``'s dimension, or None if the preset has none."""
        want = quantity.dimensionality
        for reference, unit in self.units.items():
            if _dimensionality(reference) == want:
                return ureg.Unit(unit)
        return None


PRESETS: dict[str, DisplayPreset] = {
    "SI": DisplayPreset(
        "SI",
        {
            "N": "kN",
            "N*m": "kN*m",
            "N/m": "kN/m",
            "Pa": "MPa",
            "m": "m",
            "m**2": "mm**2",
            "m**3": "mm**3",
            "m**4": "mm**4",
            "m**6": "mm**6",
            "N/m**3": "kN/m**3",
            "kg/m**3": "kg/m**3",
            "N*m**2": "kN*m**2",
        },
    ),
    "US": DisplayPreset(
        "US",
        {
            "N": "kip",
            "N*m": "kip*ft",
            "N/m": "klf",
            "Pa": "ksi",
            "m": "ft",
            "m**2": "inch**2",
            "m**3": "inch**3",
            "m**4": "inch**4",
            "m**6": "inch**6",
            "N/m**3": "pcf",
            "kg/m**3": "lb/ft**3",
            "N*m**2": "kip*inch**2",
        },
    ),
}


@dataclass
class DisplaySettings:
    """Global display defaults: unit system and significant figures (stored values keep full
    precision; only the display is rounded)."""

    system: str = "SI"
    sig_figs: int = 3
    extra: dict[str, str] = field(default_factory=dict)
    kinds: dict[str, str] = field(default_factory=dict)
    """The unit a sheet has settled on per kind of quantity (see :func:`quantity_kind`):
    kind to unit. Empty for the global settings."""

    @property
    def preset(self) -> DisplayPreset:
        return PRESETS[self.system]

    def kind_unit(self, quantity: pint.Quantity | pint.Unit) -> pint.Unit | None:
        """The unit this sheet shows every quantity of this kind in, once it has settled one."""
        kind = quantity_kind(quantity)
        unit = self.kinds.get(kind) if kind else None
        return ureg.Unit(unit) if unit else None

    def unit_for(self, quantity: pint.Quantity, *, family: str | None = None) -> pint.Unit | None:
        """The unit for a value that names none: the preset's unit for its dimension, or the
        unit the sheet settled for that unit's kind.

        A pressure is shown in the unit of its family (area load, stress, modulus: psf beside
        ksi, kPa beside MPa), not the preset's one unit for the dimension: the family the
        caller declares (``family="area load"`` for a load per area), else the one its own
        unit names (12 psf is an area load); a value in the coherent SI unit (Pa, as an
        analysis writes it) names none and takes the preset's.

        Raises:
            InputError: ``family`` is not a family of the quantity's dimension."""
        family = family or _named_family(quantity.units)
        if family is not None:
            return self.family_unit(quantity, family)
        preset = self.preset.unit_for(quantity)
        if preset is None:
            return self.kind_unit(quantity)
        return self.kind_unit(preset) or preset

    def family_unit(self, quantity: pint.Quantity | pint.Unit, family: str) -> pint.Unit:
        """The unit this sheet shows ``family`` of ``quantity``'s dimension in: the unit it
        settled for that kind, else the system's (:data:`_SYSTEM_UNITS`).

        Raises:
            InputError: ``family`` is not a family of the quantity's dimension."""
        dim = _kind_key(quantity)
        families = [name for _, name in _FAMILIES.get(dim, ())]
        if family not in families:
            raise InputError(
                name="family",
                value=family,
                rule=(
                    f"must be one of {', '.join(map(repr, families))} for a quantity of {dim}"
                    if families
                    else f"must be left out: a quantity of {dim or 'no dimension'} has no families"
                ),
                expected=" or ".join(families) if families else "None",
            )
        settled = self.kinds.get(f"{dim} ({family})")
        return ureg.Unit(settled or _SYSTEM_UNITS[self.system][family])

    def keep_unit(self, unit: pint.Unit) -> None:
        """Settle ``unit`` as the sheet's unit for its kind, unless one is settled already."""
        kind = quantity_kind(unit)
        if kind and kind not in self.kinds:
            # pint's pretty form of a fractional power (in⁰⋅⁵) does not parse back: keep the
            # long form then, so kind_unit can read it
            text = str(unit)
            self.kinds[kind] = text if "⋅" not in text else f"{unit:D}"

    def default_unit(self, quantity: pint.Quantity | pint.Unit) -> pint.Unit | None:
        """The unit a value that asks for none is shown in: the sheet's unit for its kind,
        else, when its own unit belongs to the other unit system (kN·m on a US sheet), this
        system's unit for the kind (:func:`system_unit`); None keeps its own unit."""
        settled = self.kind_unit(quantity)
        if settled is not None:
            return settled
        own = unit_system(quantity.units if isinstance(quantity, pint.Quantity) else quantity)
        if own is not None and own != self.system:
            return system_unit(quantity, self.system)
        return None

    def in_system(self, unit: pint.Unit) -> pint.Unit:
        """``unit``, or when it belongs to the other unit system, this system's unit for its
        kind (the sheet's unit for that kind once settled)."""
        own = unit_system(unit)
        if own is None or own == self.system:
            return unit
        return (
            self.kind_unit(system_unit(unit, self.system) or unit)
            or system_unit(unit, self.system)
            or unit
        )

    def settle(self, quantity: pint.Quantity, unit: pint.Unit, *, asked: bool = False) -> None:
        """Let a value shown in ``unit`` settle the sheet's unit for its kind -- unless it
        cannot speak for the kind: a zero (a moment of 0 kN·m an analysis wrote in its own
        units), a number, or a value in the other unit system's units (which would turn every
        later value of the kind away from the sheet's preset), unless its step ``asked`` for
        a unit of this system."""
        magnitude = quantity.magnitude
        values = magnitude.ravel() if hasattr(magnitude, "ravel") else (magnitude,)
        if not any(float(v) != 0.0 for v in values):
            return
        for own in (unit_system(unit), None if asked else unit_system(quantity.units)):
            if own is not None and own != self.system:
                return
        self.keep_unit(unit)


_PRESSURE = "[length]**-1 * [mass]**1 * [time]**-2"
"""The dimension of pressure: area loads, stresses and moduli (see :data:`_FAMILIES`)."""


_FAMILIES: dict[str, tuple[tuple[float, str], ...]] = {
    # SI factor of the unit from which the family starts, and its name, largest first
    "[length]**1": ((0.25, "span"), (0.0, "dimension")),
    "[length]**2": ((1e-2, "plan area"), (0.0, "section area")),
    "[length]**3": ((1e-3, "volume"), (0.0, "section modulus")),
    _PRESSURE: (
        (1e8, "modulus"),
        (5e3, "stress"),
        (0.0, "area load"),
    ),
}
"""Dimensions whose values the trade shows in two or three families of unit, kept apart: spans
and positions in m or ft beside dimensions and deflections in mm or in; plan areas (m², ft²)
beside section areas (mm², in²); volumes beside section moduli; area loads and soil pressures
(kPa, psf) beside stresses (MPa, psi, ksi) beside moduli of elasticity (GPa). The family is read
from the size of the unit (common practice: the units each family is written in)."""

_AREA_LOAD_UNITS = frozenset(str(ureg.Unit(u)) for u in ("ksf", "kip/ft**2"))
"""Bearing pressures in ksf are larger units than psi, yet area loads."""

_NO_KIND = ("", "[temperature]**1")  # numbers and temperatures (offset units) keep their unit


def quantity_kind(reference: pint.Quantity | pint.Unit) -> str:
    """The kind of a quantity or unit: its dimension, and for lengths, areas, volumes and
    pressures its family (see :data:`_FAMILIES`); "" for numbers and temperatures.

    A sheet shows every value of one kind in one unit."""
    unit = reference.units if isinstance(reference, pint.Quantity) else reference
    dim = _kind_key(unit)
    if dim in _NO_KIND:
        return ""
    families = _FAMILIES.get(dim)
    if not families:
        return dim
    if str(unit) in _AREA_LOAD_UNITS:
        return f"{dim} (area load)"
    factor = abs(float(ureg.Quantity(1.0, unit).to_base_units().magnitude))
    family = next(name for start, name in families if factor >= start)
    return f"{dim} ({family})"


_SYSTEM_UNITS: dict[str, dict[str, str]] = {
    "SI": {
        "span": "m",
        "dimension": "mm",
        "plan area": "m**2",
        "section area": "mm**2",
        "volume": "m**3",
        "section modulus": "mm**3",
        "area load": "kPa",
        "stress": "MPa",
        "modulus": "GPa",
    },
    "US": {
        "span": "ft",
        "dimension": "inch",
        "plan area": "ft**2",
        "section area": "inch**2",
        "volume": "ft**3",
        "section modulus": "inch**3",
        "area load": "psf",
        "stress": "ksi",
        "modulus": "ksi",
    },
}
"""Each system's unit for the families of :data:`_FAMILIES` (common practice); the other
dimensions take the system's preset (:data:`PRESETS`)."""

_US_UNITS = frozenset(
    {
        "foot",
        "inch",
        "yard",
        "mile",
        "pound",
        "force_pound",
        "kip",
        "psi",
        "ksi",
        "pound_force_per_square_inch",
        "kip_per_square_inch",
        "ksf",
        "psf",
        "plf",
        "klf",
        "pcf",
        "force_ounce",
        "ounce",
        "ton",
        "short_ton",
        "force_ton",
        "gallon",
        "acre",
        "degree_Fahrenheit",
        "kilopound_force",
    }
)
_SI_UNITS = frozenset(
    {"meter", "newton", "pascal", "gram", "liter", "metric_ton", "bar", "degree_Celsius", "kelvin"}
)


def unit_system(unit: pint.Unit) -> str | None:
    """ "US" for US customary units (ft, lbf, kip, psf...), "SI" for metric ones (m, kN,
    MPa...), None for a unit of neither or of both (s, rad, a number, lbf/m²)."""
    found: set[str] = set()
    for name in unit._units:  # the unit's named parts, prefixes included (kilonewton...)
        for _, base, _ in ureg.parse_unit_name(name):
            if base in _US_UNITS:
                found.add("US")
            elif base in _SI_UNITS:
                found.add("SI")
    return found.pop() if len(found) == 1 else None


def system_unit(quantity: pint.Quantity | pint.Unit, system: str) -> pint.Unit | None:
    """The unit ``system`` shows values of ``quantity``'s kind in, or None if it has none."""
    kind = quantity_kind(quantity)
    family = kind.rsplit(" (", 1)[1].rstrip(")") if kind.endswith(")") else ""
    if family:
        return ureg.Unit(_SYSTEM_UNITS[system][family])
    return PRESETS[system].unit_for(quantity)


def _named_family(unit: pint.Unit) -> str | None:
    """The family a pressure's own unit names (psf and kPa: area load; psi, ksi and MPa:
    stress; GPa: modulus), or None: not a pressure, or in the coherent SI unit (Pa, N/m²),
    which a computation writes whatever the quantity is."""
    if _kind_key(unit) != _PRESSURE or ureg.Quantity(1.0, unit).to_base_units().magnitude == 1.0:
        return None
    return quantity_kind(unit).rsplit(" (", 1)[1].rstrip(")")


def _kind_key(reference: pint.Quantity | pint.Unit) -> str:
    """The dimension as text in a fixed order (pint's own text follows insertion order)."""
    dim = _dimensionality(reference)
    return " * ".join(f"{k}**{v:g}" for k, v in sorted(dict(dim).items()))


_SETTINGS = DisplaySettings()


def _check_settings(system: str | None, sig_figs: int | None) -> None:
    if system is not None and system not in PRESETS:
        raise InputError(
            f"Unit system must be one of {sorted(PRESETS)} (got {system!r})",
            name="system",
            value=system,
            expected=" or ".join(sorted(PRESETS)),
        )
    if sig_figs is not None and (not isinstance(sig_figs, int) or not 1 <= sig_figs <= 12):
        raise InputError(
            f"sig_figs must be an integer from 1 to 12 (got {sig_figs!r})",
            name="sig_figs",
            value=sig_figs,
            expected="an integer 1..12",
        )


def set_display(*, system: str | None = None, sig_figs: int | None = None) -> DisplaySettings:
    """Set the global display defaults and return them. Sheets may override both."""
    _check_settings(system, sig_figs)
    if system is not None:
        _SETTINGS.system = system
    if sig_figs is not None:
        _SETTINGS.sig_figs = sig_figs
    return _SETTINGS


def get_display() -> DisplaySettings:
    """The global display defaults."""
    return _SETTINGS


def validate_display(system: str | None, sig_figs: int | None) -> None:
    """Raise InputError if ``system`` or ``sig_figs`` is not a valid display setting."""
    _check_settings(system, sig_figs)


def utilisation(
    demand: pint.Quantity, capacity: pint.Quantity, *, name: str
) -> tuple[pint.Quantity, pint.Quantity, float]:
    """The utilisation ratio |demand| / capacity of a check, with the rule every check follows.

    Args:
        demand: the action effect (any sign; its magnitude is compared).
        capacity: the resistance or limit, of the same dimension, positive.
        name: the check's name, used in messages.

    Returns:
        (demand in the capacity's unit, capacity, utilisation as a float).

    Raises:
        DimensionError: demand and capacity of different dimensions.
        InputError: capacity not positive.
    """
    if demand.dimensionality != capacity.dimensionality:
        raise DimensionError(
            f"Check {name!r} compares quantities of different dimensions: demand {demand:~P} "
            f"({demand.dimensionality}) against capacity {capacity:~P} "
            f"({capacity.dimensionality})",
            name=name,
            value=(demand, capacity),
            expected="demand and capacity of one dimension",
        )
    if not float(capacity.magnitude) > 0:
        raise InputError(
            f"Check {name!r}: capacity must be positive (got {capacity:~P})",
            name="capacity",
            value=capacity,
            expected="a capacity > 0",
        )
    d = demand.to(capacity.units)
    return d, capacity, float(abs(d.magnitude) / capacity.magnitude)
