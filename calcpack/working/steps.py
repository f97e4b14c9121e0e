"""The steps of a calculation sheet: inputs, derived values, equations, checks and text.

Each step is data; renderers in :mod:`calcpack.working.render` read it. Every step shows itself
in Jupyter (``_repr_mimebundle_``: HTML with TeX math, LaTeX, plain text and the step's records
for the package manifest) and as ``text()``.
"""

from __future__ import annotations

import math
from typing import Any

import pint
import sympy

from calcpack.contract.records import RECORDS_MIMETYPE, CheckRecord, Record
from calcpack.contract.verdict import Verdict
from calcpack.errors import DimensionError, InputError
from calcpack.units import DisplaySettings, ureg, utilisation
from calcpack.working.bindings import Literal
from calcpack.working.expr import (
    Term,
    as_term,
    evaluate,
    symbol_latex,
    symbol_text,
)
from calcpack.working.format import format_quantity_text, format_unit_text
from calcpack.working.step_base import Step, _check_name, _settings_or_global
from calcpack.working.text_steps import Assume, Block, Caution, Heading, Table, Text

__all__ = [
    "RECORDS_MIMETYPE",
    "Assume",
    "Block",
    "Caution",
    "Check",
    "CheckRecord",
    "Derived",
    "Equation",
    "Given",
    "Heading",
    "Record",
    "Step",
    "Table",
    "Text",
    "Unknown",
    "Value",
    "Verdict",
]


class Value(Step, Term):
    """A named quantity that can appear in formulas (base of :class:`Given` and :class:`Derived`).

    Attributes:
        name: the symbol name (``"M_max"``); ``latex_symbol`` and ``text_symbol`` its forms.
        quantity: the value at full precision, in the units it was computed in.
        display_unit: the unit the sheet shows it in.
        unit_asked: the step asked for its display unit (a sheet then keeps it; otherwise the
            sheet shows the value in its unit for the kind).
    """

    unit_asked = False

    @property
    def record_kind(self) -> str:
        """How the manifest records it: ``"given"`` (an input) or ``"derived"`` (a result)."""
        return self.kind

    def __init__(
        self,
        name: str,
        quantity: pint.Quantity,
        description: str = "",
        *,
        unit: str | pint.Unit | None = None,
        latex: str | None = None,
        settings: DisplaySettings | None = None,
    ) -> None:
        self.name = _check_name(name)
        self.description = description
        self.settings = settings
        self._latex = latex
        sym = sympy.Dummy(name)
        Term.__init__(self, sym, {sym: self})
        self.quantity = quantity
        self.display_unit = _display_unit(quantity, unit, name, settings)

    @property
    def value(self) -> pint.Quantity:
        """The full-precision quantity (same as ``quantity``)."""
        return self.quantity

    @property
    def display_quantity(self) -> pint.Quantity:
        return self.quantity.to(self.display_unit)

    @property
    def latex_symbol(self) -> str:
        return self._latex or symbol_latex(self.name)

    @property
    def text_symbol(self) -> str:
        return symbol_text(self.name)

    def to(self, unit: str | pint.Unit) -> pint.Quantity:
        """The value converted to ``unit``."""
        return self.quantity.to(unit)

    @property
    def magnitude(self) -> float:
        """The magnitude in the display unit."""
        return float(self.display_quantity.magnitude)

    def record(self) -> Record:
        return Record(
            name=self.name,
            symbol=self.latex_symbol,
            value=self.magnitude,
            unit=format_unit_text(self.display_unit),
            description=self.description,
            kind=self.record_kind,
            sig=self.sig,
        )

    def records(self) -> dict[str, list[Any]]:
        return {"values": [self.record().to_json()]}

    def __repr__(self) -> str:
        return f"{type(self).__name__}({self.text_symbol} = {self.result_text()})"

    def result_text(self) -> str:
        return format_quantity_text(self.display_quantity, self.sig)

    __hash__ = object.__hash__

    def __format__(self, spec: str) -> str:
        return format(self.display_quantity, spec) if spec else self.result_text()


def _asks_for(unit: str | pint.Unit | None, settings: DisplaySettings | None) -> bool:
    """Whether a step's ``unit`` is its own choice for the sheet to keep: a unit of the sheet's
    system (one of the other system is shown in this system's, as a value naming none is)."""
    if unit is None:
        return False
    if settings is None:
        return True
    from calcpack.units import unit_system

    try:
        own = unit_system(ureg.Unit(unit) if isinstance(unit, str) else unit)
    except (pint.UndefinedUnitError, ValueError, AttributeError):
        return True  # refused with its message when the display unit is made
    return own is None or own == settings.system


def _display_unit(
    quantity: pint.Quantity,
    unit: str | pint.Unit | None,
    name: str,
    settings: DisplaySettings | None,
) -> pint.Unit:
    if unit is not None:
        try:
            target = ureg.Unit(unit) if isinstance(unit, str) else unit
        except (pint.UndefinedUnitError, ValueError, AttributeError) as exc:
            raise InputError(
                f"Display unit for {name} is not a known unit (got {unit!r})",
                name=name,
                value=unit,
                expected="a unit such as 'kN*m', 'MPa', 'mm**4'",
            ) from exc
        if target.dimensionality != quantity.dimensionality:
            raise DimensionError(
                f"{name} cannot be shown in {target:~P}: its value {quantity:~P} has dimension "
                f"{quantity.dimensionality}, {target:~P} has {target.dimensionality}",
                name=name,
                value=quantity,
                expected=f"a unit of {quantity.dimensionality}",
            )
        # a unit of the other system (an analysis written in kN·m, on a US sheet) is shown
        # in this sheet's system: one system per sheet
        return settings.in_system(target) if settings is not None else target
    return quantity.units


def _check_finite(name: str, quantity: pint.Quantity) -> None:
    try:
        ok = math.isfinite(float(quantity.magnitude))
    except TypeError as exc:
        raise InputError(
            f"{name} must be a single number with units (got {quantity!r})",
            name=name,
            value=quantity,
            expected="a scalar quantity",
        ) from exc
    if not ok:
        raise InputError(
            f"{name} must be finite (got {name} = {quantity:~P})",
            name=name,
            value=quantity,
            expected="a finite value",
        )


class Given(Value):
    """An input value: symbol, value with unit, description and optional source.

    Args:
        name: symbol name (``"L"``, ``"f_y"``, ``"sigma_allow"``).
        value: a pint quantity; a bare number is a dimensionless input.
        description: words for the checker (``"clear span"``).
        source: where the value comes from (drawing, code table, manufacturer's data).
        unit: optional display unit (default: the unit as entered).
        result: the value is a result carried into this working (a reaction or a member force
            from the analysis, a demand from a load combination): shown as given here, but
            recorded in the manifest as a result (``kind = "derived"``), not as an input.
    """

    kind = "given"

    def __init__(
        self,
        name: str,
        value: pint.Quantity | float | int,
        description: str = "",
        *,
        source: str | None = None,
        unit: str | pint.Unit | None = None,
        latex: str | None = None,
        settings: DisplaySettings | None = None,
        result: bool = False,
    ) -> None:
        self.result = bool(result)
        if isinstance(value, bool) or not isinstance(value, pint.Quantity | int | float):
            raise InputError(
                f"Given {name} must be a quantity such as 3.2 * ureg.m (got {value!r})",
                name=name,
                value=value,
                expected="a pint Quantity or a number",
            )
        q = value if isinstance(value, pint.Quantity) else ureg.Quantity(value, "dimensionless")
        _check_finite(f"Given {name}", q)
        self.unit_asked = _asks_for(unit, settings)
        if unit is None and settings is not None:
            unit = settings.default_unit(q)
        super().__init__(name, q, description, unit=unit, latex=latex, settings=settings)
        self.source = source

    @property
    def record_kind(self) -> str:
        return "derived" if self.result else "given"


class Derived(Value):
    """A value computed from a formula over earlier values, evaluated with pint.

    Args:
        name: symbol name of the result.
        formula: a :class:`~calcpack.working.expr.Term` built from earlier values (or a pint
            quantity computed elsewhere, e.g. by an analysis, which then shows no formula).
        description: what the value is.
        unit: display unit (default: the sheet's preset for the dimension, else as computed).
        ref: code clause, handbook or sheet reference shown beside the step.
        note: a short remark shown under the step.

    Raises:
        DimensionError: a unit error inside the formula (naming the formula and both units), or a
            display unit of another dimension.
        InputError: the formula evaluates to NaN or infinity.
    """

    kind = "derived"

    def __init__(
        self,
        name: str,
        formula: Term | pint.Quantity,
        description: str = "",
        *,
        unit: str | pint.Unit | None = None,
        ref: str | None = None,
        note: str | None = None,
        latex: str | None = None,
        settings: DisplaySettings | None = None,
    ) -> None:
        _check_name(name)
        if isinstance(formula, pint.Quantity):
            self.formula: Term | None = None
            q = formula
        elif isinstance(formula, Term):
            self.formula = formula
            q = evaluate(formula, name=name)
        else:
            raise InputError(
                f"Formula for {name} must be built from calcpack values or be a quantity "
                f"(got {formula!r})",
                name=name,
                value=formula,
                expected="a Term (e.g. w * L**2 / 8) or a pint Quantity",
            )
        if unit is None:
            q = q.to_reduced_units()
        _check_finite(f"{name} = {self._formula_text() if self.formula else 'value'}", q)
        self.unit_asked = _asks_for(unit, settings)
        if unit is None:
            unit = _settings_or_global(settings).unit_for(q)
        super().__init__(name, q, description, unit=unit, latex=latex, settings=settings)
        self.ref = ref
        self.note = note

    def _formula_text(self) -> str:
        from calcpack.working.expr import to_text

        return to_text(self.formula) if self.formula is not None else ""


class Unknown(Term):
    """A symbol with no value yet, used in equilibrium and compatibility equations.

    Args:
        name: symbol name (``"R_A"``).
        unit: the unit its solution will be shown in (informative).
    """

    def __init__(self, name: str, *, unit: str | None = None, latex: str | None = None) -> None:
        self.name = _check_name(name)
        self.unit = unit
        self._latex = latex
        sym = sympy.Dummy(name)
        super().__init__(sym, {sym: self})

    @property
    def latex_symbol(self) -> str:
        return self._latex or symbol_latex(self.name)

    @property
    def text_symbol(self) -> str:
        return symbol_text(self.name)

    __hash__ = object.__hash__


class Equation(Step):
    """An equation written symbolically, then with known values substituted (unknowns kept).

    Args:
        lhs, rhs: the two sides (terms, quantities or numbers; ``rhs`` defaults to 0).
        label: a heading for the equation, e.g. ``r"\\Sigma M_A = 0"`` (TeX).
        description: words for the checker.
    """

    kind = "equation"

    def __init__(
        self,
        lhs: Term | pint.Quantity | float,
        rhs: Term | pint.Quantity | float = 0,
        *,
        label: str | None = None,
        description: str = "",
        settings: DisplaySettings | None = None,
    ) -> None:
        self.lhs = as_term(lhs)
        self.rhs = as_term(rhs)
        self.label = label
        self.description = description
        self.settings = settings


class Check(Step):
    """A check of demand against capacity: utilisation |demand| / capacity and a verdict.

    Args:
        name: what is checked (``"Bending"``).
        demand, capacity: values or quantities of one dimension; capacity must be positive.
        ref: the clause that sets the capacity or the limit.
        member: the member checked.
        combination: the governing load combination.
        description: words for the checker.

    Raises:
        DimensionError: demand and capacity of different dimensions.
        InputError: capacity not positive, or either value not finite.
    """

    kind = "check"

    def __init__(
        self,
        name: str,
        demand: Value | pint.Quantity,
        capacity: Value | pint.Quantity,
        *,
        ref: str | None = None,
        member: str | None = None,
        combination: str | None = None,
        description: str = "",
        settings: DisplaySettings | None = None,
    ) -> None:
        self.name = name
        self.ref = ref
        self.member = member
        self.combination = combination
        self.description = description
        self.settings = settings
        self.demand = demand
        self.capacity = capacity
        dq = demand.quantity if isinstance(demand, Value) else demand
        cq = capacity.quantity if isinstance(capacity, Value) else capacity
        for label, q in (("demand", dq), ("capacity", cq)):
            if not isinstance(q, pint.Quantity):
                raise InputError(
                    f"Check {name!r}: {label} must be a quantity or a calcpack value (got {q!r})",
                    name=label,
                    value=q,
                    expected="a pint Quantity or Value",
                )
            _check_finite(f"Check {name!r} {label}", q)
        unit = capacity.display_unit if isinstance(capacity, Value) else cq.units
        self.unit: pint.Unit = unit
        d, c, self.utilisation = utilisation(dq, cq.to(unit), name=name)
        self.demand_q: pint.Quantity = d
        self.capacity_q: pint.Quantity = c
        self.verdict = Verdict.of(self.utilisation)

    @property
    def passed(self) -> bool:
        return self.verdict == Verdict.OK

    def record(self) -> CheckRecord:
        return CheckRecord(
            name=self.name,
            member=self.member,
            demand=float(self.demand_q.magnitude),
            capacity=float(self.capacity_q.magnitude),
            unit=format_unit_text(self.unit),
            utilisation=self.utilisation,
            verdict=self.verdict,
            ref=self.ref,
            combination=self.combination,
            description=self.description,
            sig=self.sig,
        )

    def records(self) -> dict[str, list[Any]]:
        return {"checks": [self.record().to_json()]}


class NotCovered(Step):
    """A check the method cannot make here: shown as NOT COVERED with the reason, never a number."""

    kind = "check"

    def __init__(
        self,
        name: str,
        reason: str,
        *,
        ref: str | None = None,
        member: str | None = None,
        settings: DisplaySettings | None = None,
    ) -> None:
        self.name = name
        self.reason = reason
        self.ref = ref
        self.member = member
        self.settings = settings
        self.verdict = Verdict.NOT_COVERED

    def record(self) -> CheckRecord:
        return CheckRecord(
            name=self.name,
            member=self.member,
            demand=None,
            capacity=None,
            unit="",
            utilisation=None,
            verdict=self.verdict,
            ref=self.ref,
            combination=None,
            description=self.reason,
        )

    def records(self) -> dict[str, list[Any]]:
        return {"checks": [self.record().to_json()]}


__all__ += ["Literal", "NotCovered"]
