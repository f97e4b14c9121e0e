"""Engineering number and unit formatting for the working (LaTeX and plain text).

Numbers are rounded to a number of significant figures for display only; stored values keep full
precision. Values from 0.001 up to 10⁶ are written out in full (``12 300``, ``0.00425``); outside
that range engineering notation is used, with an exponent that is a multiple of three
(``235 × 10⁶``), never ``2.35e+08``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import pint

__all__ = [
    "NumberText",
    "format_number",
    "format_quantity_latex",
    "format_quantity_text",
    "format_unit_latex",
    "format_unit_text",
    "split_number",
]

_SUPERSCRIPTS = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")

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


@dataclass(frozen=True)
class NumberText:
    """A number split for display: mantissa text (digits already rounded) and power of ten."""

    mantissa: str
    exponent: int  # 0 when written out in full

    @property
    def negative(self) -> bool:
        return self.mantissa.startswith("-")


def _round_sig(value: float, sig: int) -> tuple[str, int]:
    """Round ``value`` to ``sig`` significant figures: (digits with point, decimal exponent)."""
    if value == 0:
        return "0", 0
    text = f"{value:.{sig - 1}e}"
    digits, exp = text.split("e")
    return digits, int(exp)


def split_number(value: float, sig: int = 3) -> NumberText:
    """Round ``value`` to ``sig`` significant figures and choose full or engineering notation."""
    if not math.isfinite(value):
        return NumberText(str(value), 0)
    if value == 0:
        return NumberText("0", 0)
    digits, exp = _round_sig(value, sig)
    rounded = float(f"{digits}e{exp}")
    if 1e-3 <= abs(rounded) < 1e6:
        decimals = max(sig - 1 - exp, 0)
        text = f"{rounded:.{decimals}f}"
        return NumberText(text, 0)
    eng = 3 * math.floor(exp / 3)
    mant = rounded / 10.0**eng
    decimals = max(sig - 1 - (exp - eng), 0)
    text = f"{mant:.{decimals}f}"
    if float(text) >= 1000:  # rounding carried into the next group
        eng += 3
        mant /= 1000
        decimals = max(sig - 1, 0)
        text = f"{mant:.{decimals}f}"
    return NumberText(text, eng)


def _group(text: str, sep: str) -> str:
    """Group the integer digits in threes for numbers of five or more integer digits."""
    sign = "-" if text.startswith("-") else ""
    body = text.lstrip("-")
    whole, _, frac = body.partition(".")
    if len(whole) >= 5:
        groups = []
        while whole:
            groups.append(whole[-3:])
            whole = whole[:-3]
        whole = sep.join(reversed(groups))
    return sign + whole + ("." + frac if frac else "")


def format_number(value: float, sig: int = 3, *, latex: bool = False) -> str:
    """Format ``value`` to ``sig`` significant figures as LaTeX or plain text."""
    parts = split_number(float(value), sig)
    if latex:
        mant = _group(parts.mantissa, r"\,")
        if parts.negative:
            mant = "-" + mant[1:]
        if parts.exponent:
            return rf"{mant} \times 10^{{{parts.exponent}}}"
        return mant
    mant = _group(parts.mantissa, "\u2009").replace("-", "−")
    if parts.exponent:
        return f"{mant}×10{str(parts.exponent).translate(_SUPERSCRIPTS)}"
    return mant


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
