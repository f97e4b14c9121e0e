"""The number style of sheets and records: significant figures and engineering notation.

Numbers are rounded to a number of significant figures for display only; stored values keep
full precision. Values from 0.001 up to 10⁶ are written out in full (``12 300``, ``0.00425``);
outside that range engineering notation is used, with an exponent that is a multiple of three
(``235 × 10⁶``), never ``2.35e+08``. The working (:mod:`calcpack.working.format`) and the
manifest comparison show recorded numbers the same way. Standard library only.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = ["NumberText", "format_number", "split_number"]

_SUPERSCRIPTS = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")


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
    # from the digits, not rounded / 10**eng: that power underflows to 0 below 1e-308
    mant = float(f"{digits}e{exp - eng}")
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
