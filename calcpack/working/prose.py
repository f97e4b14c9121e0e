"""Prose that cites recorded values: ``s.text("The reaction {R_A} is carried by the post.")``.

A placeholder ``{name}`` in a sentence (outside ``$...$`` math) is replaced by the typeset symbol
and its value, ``{name:value}`` by the value alone and ``{name:symbol}`` by the symbol alone.
The value comes from the sheet's record (a given or derived value of that name) or from a
keyword argument (a calcpack value, a pint quantity or a plain number); it is shown in the
sheet's unit for its kind and to the sheet's significant figures, by the same formatter as the
working, so prose and working never disagree. ``{{`` and ``}}`` are literal braces.

A citation is data (:class:`Citation`); the renderers in :mod:`calcpack.working.render` turn it
into HTML text (searchable in the PDF), TeX or plain text.
"""

from __future__ import annotations

import re
from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any, Literal

import pint

from calcpack.errors import InputError
from calcpack.units import DisplaySettings, get_display, ureg
from calcpack.working.expr import symbol_latex, symbol_text
from calcpack.working.format import format_quantity_latex, format_quantity_text

__all__ = ["Citation", "CiteForm", "cite"]

CiteForm = Literal["full", "value", "symbol"]
_FORMS: tuple[CiteForm, ...] = ("full", "value", "symbol")

# A placeholder: {name} or {name:form}; {{ and }} are literal braces.
_PLACEHOLDER = re.compile(r"\{\{|\}\}|\{([A-Za-z][A-Za-z0-9_]*)(?::([a-z]+))?\}")
_MATH = re.compile(r"((?<!\\)\$.+?(?<!\\)\$)", re.S)
MARK = "\x00"
"""Marks a citation's place in a template: ``MARK + index + MARK``."""


@dataclass(frozen=True)
class Citation:
    """A recorded value cited in prose.

    Attributes:
        name: the symbol name (``"R_A"``).
        latex: the symbol in TeX (``R_{A}``).
        quantity: the value in the unit shown.
        sig: significant figures shown.
        form: ``"full"`` (symbol = value), ``"value"`` or ``"symbol"``.
    """

    name: str
    latex: str
    quantity: pint.Quantity
    sig: int
    form: CiteForm = "full"

    @property
    def value_text(self) -> str:
        return format_quantity_text(self.quantity, self.sig)

    @property
    def value_latex(self) -> str:
        return format_quantity_latex(self.quantity, self.sig)

    def text(self) -> str:
        """Plain text: ``R_A = 2.61 kip`` (the symbol in its plain form)."""
        sym = symbol_text(self.name)
        return {"full": f"{sym} = {self.value_text}", "value": self.value_text, "symbol": sym}[
            self.form
        ]

    def tex(self) -> str:
        """TeX without dollars: ``R_{A} = 2.61\\ \\mathrm{kip}``."""
        return {
            "full": f"{self.latex} = {self.value_latex}",
            "value": self.value_latex,
            "symbol": self.latex,
        }[self.form]


def _known(names: Mapping[str, Any]) -> str:
    return ", ".join(sorted(names)) or "none yet"


def _resolve(
    key: str,
    form: str | None,
    values: Mapping[str, Any],
    recorded: Mapping[str, Any],
    unit_for: Callable[[pint.Quantity], pint.Unit | None],
    sig: int,
) -> Citation:
    if form is not None and form not in _FORMS:
        raise InputError(
            f"Placeholder {{{key}:{form}}} has an unknown form {form!r}",
            name=key,
            value=form,
            expected="{name}, {name:value} or {name:symbol}",
        )
    chosen: CiteForm = "full" if form is None else form
    from calcpack.working.steps import Value

    item = values.get(key, recorded.get(key))
    if item is None:
        raise InputError(
            f"Prose cites {{{key}}} but the sheet has no value {key!r} and none was passed "
            f"(recorded values: {_known(recorded)})",
            name=key,
            value=None,
            expected=f"a recorded value name or a keyword argument, e.g. text('...', {key}=result)",
        )
    if isinstance(item, Value):
        return Citation(item.name, item.latex_symbol, item.display_quantity, sig, chosen)
    if isinstance(item, bool) or not isinstance(item, pint.Quantity | int | float):
        raise InputError(
            f"Cited value {key} must be a calcpack value, a quantity or a number "
            f"(got {type(item).__name__})",
            name=key,
            value=item,
            expected="a Value, a pint Quantity or a number",
        )
    q = item if isinstance(item, pint.Quantity) else ureg.Quantity(item, "dimensionless")
    unit = unit_for(q)
    if unit is not None:
        q = q.to(unit)
    return Citation(key, symbol_latex(key), q, sig, chosen)


def cite(
    body: str,
    values: Mapping[str, Any],
    recorded: Mapping[str, Any],
    settings: DisplaySettings | None = None,
    unit_for: Callable[[pint.Quantity], pint.Unit | None] | None = None,
) -> tuple[str, tuple[Citation, ...]]:
    """Resolve the placeholders of ``body``: (template with marks, citations in order).

    Args:
        body: the prose, ``$...$`` for inline TeX (left untouched), ``{name}`` placeholders.
        values: keyword values given with the sentence.
        recorded: the sheet's recorded values by name.
        settings: the sheet's display settings (significant figures, preset units).
        unit_for: the unit the sheet shows a quantity of this kind in (default: the preset's).

    Raises:
        InputError: a placeholder names no recorded or given value, a form is unknown, or a
            keyword value is not a quantity; a keyword value is not cited.
    """
    s = settings or get_display()
    pick = unit_for or s.preset.unit_for
    citations: list[Citation] = []
    used: set[str] = set()

    def replace(m: re.Match[str]) -> str:
        if m.group(0) == "{{":
            return "{"
        if m.group(0) == "}}":
            return "}"
        used.add(m.group(1))
        citations.append(_resolve(m.group(1), m.group(2), values, recorded, pick, s.sig_figs))
        return f"{MARK}{len(citations) - 1}{MARK}"

    parts = _MATH.split(body)
    template = "".join(p if i % 2 else _PLACEHOLDER.sub(replace, p) for i, p in enumerate(parts))
    unused = sorted(set(values) - used)
    if unused:
        raise InputError(
            f"Prose was given {', '.join(unused)} but cites no {{{unused[0]}}}",
            name=unused[0],
            value=values[unused[0]],
            expected=f"a placeholder {{{unused[0]}}} in the sentence",
        )
    return template, tuple(citations)


def fill(template: str, citations: tuple[Citation, ...], each: Callable[[Citation], str]) -> str:
    """The template with each citation's mark replaced by ``each(citation)``."""
    return re.sub(f"{MARK}(\\d+){MARK}", lambda m: each(citations[int(m.group(1))]), template)
