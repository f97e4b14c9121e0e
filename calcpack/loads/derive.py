"""Load derivations as calc cells: one logic function, run on numbers and as working.

A load derivation (snow or wind to a standard) is written once as a function of a
:class:`~calcpack.checks.base.Recorder`, like a design check: run with a plain ``Recorder`` it
gives the values (pint quantities, no display code imported); run with a ``SheetRecorder`` (only
when the working is asked for) the same calls build Given / Derived steps with their clauses.

:func:`run_derivation` runs the logic on numbers and returns a frozen :class:`Derivation`
(values by symbol, the standard and the logic) whose :meth:`Derivation.working` shows it.
Every derivation carries the cautions of :data:`LOAD_CAUTIONS`.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass, field
from typing import Any

from calcpack.checks.base import Recorder, SheetRecorder
from calcpack.units import Quantity
from calcpack.validate import find

__all__ = [
    "LOAD_CAUTIONS",
    "Derivation",
    "LoadStandard",
    "is_us_customary",
    "run_derivation",
    "steps_bundle",
]

LOAD_CAUTIONS = (
    "The loads derived here depend on the site data, dimensions and assumptions stated as "
    "inputs; a change to any of them changes the loads.",
    "The provisions must be confirmed against the edition (and national annex or local "
    "amendments) adopted where the structure is built.",
    "This derivation is part of a calculation package that must be reviewed and sealed by an "
    "engineer licensed where the structure is built.",
)


_US_NAMES = (
    "foot",
    "inch",
    "mile",
    "pound",
    "psf",
    "ksf",
    "kip",
    "plf",
    "klf",
    "pcf",
    "knot",
    "yard",
    "psi",
)


def is_us_customary(q: Quantity) -> bool:
    """True when ``q`` is given in US customary units (ft, psf, mph, lbf...): the derivation then
    reports in US units, otherwise in SI."""
    return any(u in name for name, _ in q.unit_items() for u in _US_NAMES)


@dataclass(frozen=True)
class LoadStandard:
    """The loading standard a derivation follows.

    Attributes:
        code: designation with edition, e.g. ``"ASCE/SEI 7-16"``.
        title: the chapter or part followed, e.g. ``"Chapter 7, Snow Loads"``.
        annex: the national annex applied, if any.
    """

    code: str
    title: str
    annex: str = ""

    @property
    def caution(self) -> str:
        ann = f" with {self.annex}" if self.annex else ""
        text = " ".join(LOAD_CAUTIONS)
        if not self.code.startswith("EN"):  # national annexes are a Eurocode matter
            text = text.replace(
                "(and national annex or local amendments)", "(and local amendments)"
            )
        return f"Derived to {self.code}{ann}, {self.title}. " + text


Logic = Callable[[Recorder], None]


@dataclass(frozen=True)
class Derivation:
    """The values of a load derivation, by symbol, with the logic that shows its working.

    Attributes:
        title: what was derived (the heading of the working).
        standard: the standard followed. values: every named value, full precision.
    """

    title: str
    standard: LoadStandard
    values: Mapping[str, Quantity]
    logic: Logic = field(repr=False, compare=False)

    def __getitem__(self, name: str) -> Quantity:
        return find("name", name, self.values, what="value", where=f"of {self.title!r}")

    def working(self, *, settings: Any = None) -> list[Any]:
        """The derivation as working steps: heading, caution, then each step with its clause."""
        rec = SheetRecorder(self.title, settings)
        rec.heading(self.title, 2)
        rec.caution(self.standard.caution)
        self.logic(rec)
        return rec.steps

    def add_to(self, sheet: Any) -> Derivation:
        """Add the working to ``sheet`` step by step."""
        for step in self.working(settings=getattr(sheet, "settings", None)):
            sheet.add(step)
        return self

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        from calcpack.working import Block

        return Block(self.working(), title=self.title)._repr_mimebundle_()


def run_derivation(title: str, standard: LoadStandard, logic: Logic) -> Derivation:
    """Run ``logic`` on numbers and return its :class:`Derivation` (working on demand)."""
    rec = Recorder(title)
    logic(rec)
    return Derivation(title, standard, dict(rec.values), logic)


def steps_bundle(steps: list[Any], title: str) -> dict[str, Any]:
    """The display bundle of a result's working steps (a derivation and its figures)."""
    from calcpack.working import Block

    return Block(steps, title=title)._repr_mimebundle_()
