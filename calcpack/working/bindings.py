"""What a symbol in a formula stands for: a named value, an unknown, or a literal quantity."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Protocol

import pint

from calcpack.working.format import (
    format_quantity_latex,
    format_quantity_text,
)

__all__ = ["Bound", "Literal"]


class Bound(Protocol):
    """What a symbol in a formula may stand for: a named value, an unknown, or a literal."""

    @property
    def latex_symbol(self) -> str: ...

    @property
    def text_symbol(self) -> str: ...


@dataclass(frozen=True)
class Literal:
    """A pint quantity written straight into a formula (shown with its unit in every line)."""

    quantity: pint.Quantity

    @property
    def latex_symbol(self) -> str:
        return format_quantity_latex(self.quantity, 6)

    @property
    def text_symbol(self) -> str:
        return format_quantity_text(self.quantity, 6)
