"""Sawn timber: nominal sizes to dressed (actual) sizes.

Source of the table: the American Softwood Lumber Standard, US Department of Commerce Voluntary
Product Standard PS 20 (as reproduced in the NDS Supplement, Table 1B "Section Properties of
Standard Dressed (S4S) Sawn Lumber"), dry dressed sizes of boards and dimension lumber and the
green dressed sizes of timbers 5 in and thicker. Values are the standard's sizes, from memory:

* nominal 1 → 3/4 in; 2 → 1-1/2 in; 3 → 2-1/2 in; 4 → 3-1/2 in; 5 → 4-1/2 in; 6 → 5-1/2 in;
  8 → 7-1/4 in; 10 → 9-1/4 in; 12 → 11-1/4 in; 14 → 13-1/4 in; 16 → 15-1/4 in
  for boards and dimension lumber (nominal thickness up to 4 in);
* for timbers (both nominal sizes 5 in or more), each dressed size is nominal less 1/2 in.
"""

from __future__ import annotations

import re
from dataclasses import dataclass

from calcpack.errors import InputError
from calcpack.sections.shapes import Rectangle
from calcpack.units import Q_, Quantity

__all__ = ["DRESSED_SIZE_TABLE", "DressedSize", "dressed_size", "sawn_timber"]

DRESSED_SIZE_TABLE = (
    "US DOC PS 20, American Softwood Lumber Standard (dressed sizes, as in NDS Supplement Table 1B)"
)
"""The published table the dressed sizes follow."""

# nominal (in) -> dry dressed size (in), boards and dimension lumber
_DIMENSION_LUMBER: dict[int, float] = {
    1: 0.75,
    2: 1.5,
    3: 2.5,
    4: 3.5,
    5: 4.5,
    6: 5.5,
    8: 7.25,
    10: 9.25,
    12: 11.25,
    14: 13.25,
    16: 15.25,
}


@dataclass(frozen=True)
class DressedSize:
    """A nominal size and its dressed size: thickness b and depth d (on edge), and the table."""

    nominal: str
    b: Quantity
    d: Quantity
    source: str = DRESSED_SIZE_TABLE


def dressed_size(nominal: str) -> DressedSize:
    """The dressed size of a nominal sawn-timber size such as ``"2x10"`` or ``"6x8"``.

    Args:
        nominal: "thickness x depth" in nominal inches ("2x10", "4 x 12", "6×8").

    Raises:
        InputError: a size not in the table (names the size and the valid ones).
    """
    match = re.fullmatch(r"\s*(\d+)\s*[xX×]\s*(\d+)\s*", nominal)
    valid = ", ".join(str(k) for k in _DIMENSION_LUMBER)
    if not match:
        raise InputError(
            f"Nominal size must read 'thickness x depth' in inches, such as '2x10' (got "
            f"{nominal!r})",
            name="nominal",
            value=nominal,
            expected="'2x10'",
        )
    t, w = int(match.group(1)), int(match.group(2))
    for value in (t, w):
        if value not in _DIMENSION_LUMBER:
            raise InputError(
                f"Nominal size {nominal!r} is not in {DRESSED_SIZE_TABLE}: each nominal "
                f"dimension must be one of {valid} in (got {value})",
                name="nominal",
                value=nominal,
                expected=f"nominal inches among {valid}",
            )
    if min(t, w) >= 5:
        # timbers: dressed green, 1/2 in under nominal each way
        b_in, d_in = t - 0.5, w - 0.5
    else:
        b_in, d_in = _DIMENSION_LUMBER[t], _DIMENSION_LUMBER[w]
    return DressedSize(f"{t}x{w}", Q_(b_in, "inch"), Q_(d_in, "inch"))


def sawn_timber(nominal: str, *, name: str | None = None) -> Rectangle:
    """A rectangle with the dressed size of nominal sawn timber, on edge (thickness b along x,
    depth d along y), e.g. ``sawn_timber("2x10")`` is 1-1/2 in × 9-1/4 in."""
    size = dressed_size(nominal)
    label = name or (f"{size.nominal} (dressed {size.b.magnitude:g} in × {size.d.magnitude:g} in)")
    return Rectangle(b=size.b, d=size.d, name=label)
