"""Engineering number and unit formatting for the working (LaTeX and plain text).

Numbers are rounded to a number of significant figures for display only; stored values keep full
precision. Values from 0.001 up to 10⁶ are written out in full (``12 300``, ``0.00425``); outside
that range engineering notation is used, with an exponent that is a multiple of three
(``235 × 10⁶``), never ``2.35e+08``.
"""

from __future__ import annotations

import pint

from calcpack.contract.numbers import (
    _SUPERSCRIPTS,
    NumberText,
    format_number,
    split_number,
)

__all__ = [
    "NumberText",
    "format_cell",
    "format_number",
    "format_quantity_latex",
    "format_quantity_text",
    "format_unit_latex",
    "format_unit_text",
    "split_number",
]

# pint's short symbols that the trade writes differently.
_UNIT_SYMBOLS = {
    "in": "in",
    "ft": "ft",
    "lbf": "lbf",
    "kip": "kip",
    "kipf": "kip",
    "Ω": "Ω",
    "deg": "°",
    "degree": "°",
    "rad": "rad",
}


def _unit_items(unit: pint.Unit) -> list[tuple[str, float]]:
    registry = unit._REGISTRY
    items = []
    for name, power in unit._units.items():
        symbol = registry.get_symbol(name)
        # The trade writes the force first: kN·m, kip·ft, not ft·kip.
        is_force = registry.Unit(name).dimensionality == _FORCE_DIM(registry)
        items.append((0 if is_force else 1, _UNIT_SYMBOLS.get(symbol, symbol), float(power)))
    items.sort(key=lambda item: item[0])
    return [(symbol, power) for _, symbol, power in items]


def _FORCE_DIM(registry: object) -> object:
    return registry.get_dimensionality("[force]")  # type: ignore[attr-defined]


def _power_text(power: float, latex: bool) -> str:
    p = int(power) if float(power).is_integer() else power
    if p == 1:
        return ""
    if latex:
        return f"^{{{p}}}"
    return str(p).translate(_SUPERSCRIPTS)


def _unit_string(unit: pint.Unit, latex: bool) -> str:
    items = _unit_items(unit)
    if not items:
        return ""
    joiner = r"{\cdot}" if latex else "·"
    num = [f"{s}{_power_text(p, latex)}" for s, p in items if p > 0]
    den = [f"{s}{_power_text(-p, latex)}" for s, p in items if p < 0]
    top = joiner.join(num) if num else "1"
    if not den:
        return top
    bottom = joiner.join(den)
    if len(den) > 1:
        bottom = f"({bottom})"
    return f"{top}/{bottom}"


def format_unit_latex(unit: pint.Unit) -> str:
    r"""The unit in upright LaTeX (``\mathrm{kN{\cdot}m}``, ``\mathrm{N/mm^{2}}``); '' if none."""
    body = _unit_string(unit, latex=True)
    if not body:
        return ""
    body = body.replace("°", r"^{\circ}").replace("µ", r"\mu ").replace("μ", r"\mu ")
    body = body.replace("Ω", r"\Omega ")
    return rf"\mathrm{{{body}}}"


def format_unit_text(unit: pint.Unit) -> str:
    """The unit in plain text with Unicode powers, e.g. ``kN·m``, ``N/mm²``; '' if none."""
    return _unit_string(unit, latex=False)


def format_quantity_latex(quantity: pint.Quantity, sig: int = 3) -> str:
    r"""A quantity as LaTeX, number then unit: ``10.9\ \mathrm{kN{\cdot}m}``."""
    number = format_number(float(quantity.magnitude), sig, latex=True)
    unit = format_unit_latex(quantity.units)
    if not unit:
        return number
    if unit == r"\mathrm{^{\circ}}":
        return number + r"^{\circ}"
    return rf"{number}\ {unit}"


def format_quantity_text(quantity: pint.Quantity, sig: int = 3) -> str:
    """A quantity as plain text: ``10.9 kN·m``."""
    number = format_number(float(quantity.magnitude), sig)
    unit = format_unit_text(quantity.units)
    if not unit:
        return number
    if unit == "°":
        return number + "°"
    return f"{number} {unit}"


def format_cell(value: object, sig: int = 3, settings: object = None) -> str:
    """Any value a table, a caption or a sentence shows, as plain text, the one way.

    A quantity in the sheet's unit for its kind, or its unit system's when the quantity is in
    the other system's units (``settings``: the sheet's
    :class:`~calcpack.units.DisplaySettings`, see its ``default_unit``) to ``sig`` significant
    figures; a whole number (a load's number, a count) as written; a float to ``sig`` figures;
    anything else as text.
    """
    if isinstance(value, pint.Quantity):
        default_unit = getattr(settings, "default_unit", None)
        unit = default_unit(value) if default_unit is not None else None
        return format_quantity_text(value.to(unit) if unit is not None else value, sig)
    if value is None:
        return ""
    if isinstance(value, bool):
        return str(value)
    if isinstance(value, int):
        return str(value).replace("-", "−")
    if isinstance(value, float):
        return format_number(value, sig)
    return str(value)
