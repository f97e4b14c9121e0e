"""A calculation sheet: steps in order, its display settings, and its values as data.

Inside a Jupyter kernel each step a sheet method creates is displayed at once, so a cell like
``M = s.derive("M", w * L**2 / 8)`` shows its working; assign the result to keep the cell's
last line from displaying it a second time. Outside a kernel nothing is displayed.
"""

from __future__ import annotations

import sys
from typing import Any

import pint

from calcpack.units import DisplaySettings, get_display, validate_display
from calcpack.working.expr import Term
from calcpack.working.linked import Imported
from calcpack.working.prose import Citation, cite
from calcpack.working.sheet_links import SheetLinks
from calcpack.working.steps import (
    Assume,
    Caution,
    Check,
    CheckRecord,
    Derived,
    Equation,
    Given,
    Heading,
    NotCovered,
    Record,
    Step,
    Table,
    Text,
    Value,
)

__all__ = ["Sheet"]


def _unit(text: str) -> pint.Unit:
    from calcpack.errors import InputError
    from calcpack.units import quantity_kind, ureg

    try:
        unit = ureg.Unit(text)
    except (pint.UndefinedUnitError, ValueError, AttributeError) as exc:
        raise InputError(
            f"Sheet unit {text!r} is not a known unit",
            name="units",
            value=text,
            expected="a unit such as 'kip', 'lbf*ft', 'plf', 'psi', 'ft', 'in'",
        ) from exc
    if not quantity_kind(unit):
        raise InputError(
            f"Sheet units set the unit of a kind of quantity; numbers and temperatures keep "
            f"their own (got {text!r})",
            name="units",
            value=text,
            expected="a unit of force, length, stress, moment...",
        )
    return unit


def _in_kernel() -> bool:
    ipython = sys.modules.get("IPython")
    if ipython is None:
        return False
    shell = ipython.get_ipython()
    return shell is not None and getattr(shell, "kernel", None) is not None


class Sheet(SheetLinks):
    """An ordered calculation sheet.

    Args:
        title: the sheet title (the package's project file may also give one).
        system: display unit system, ``"SI"`` or ``"US"`` (default: the global setting).
        sig_figs: significant figures shown (default: the global setting, 3).
        standards: design standards the sheet applies (collected into the design basis).
        auto_display: show each new step when running in a Jupyter kernel.
        units: the sheet's unit for each kind of quantity it names (``["lbf", "lbf*ft",
            "plf", "psi", "in"]``; kinds: :func:`calcpack.units.quantity_kind`, so "in" sets
            dimensions and deflections and "ft" spans). Without them, the first value of each
            kind the sheet shows settles its unit (a value that names none takes the preset's);
            later values of that kind are shown in it unless their step asks for a unit.
    """

    def __init__(
        self,
        title: str = "",
        *,
        system: str | None = None,
        sig_figs: int | None = None,
        standards: list[str] | None = None,
        auto_display: bool = True,
        units: list[str] | None = None,
    ) -> None:
        validate_display(system, sig_figs)
        base = get_display()
        self.title = title
        self.settings = DisplaySettings(
            system=system or base.system, sig_figs=sig_figs or base.sig_figs
        )
        for unit in units or ():
            self.settings.keep_unit(_unit(unit))
        self.steps: list[Step] = []
        self.standards = list(standards or [])
        self.auto_display = auto_display
        self._names: dict[str, Value] = {}
        self._cautions: set[str] = set()
        self._exports: dict[str, dict[str, Any]] = {}
        self._results_changed = False

    # -- adding steps --------------------------------------------------------------------
    def add(self, step: Step) -> Step:
        """Append any step (or a block of steps from an analysis) and show it in a kernel."""
        if not isinstance(step, Step):
            from calcpack.errors import InputError

            raise InputError(
                f"Sheet.add takes a working step (got {type(step).__name__})",
                name="step",
                value=step,
                expected="a calcpack.working Step",
            )
        if isinstance(step, Caution) and step.body in self._cautions:
            return step  # each caution once on a sheet (a second member of one standard)
        self._adopt(step)
        self.steps.append(step)
        if isinstance(step, Value):
            self._names[step.name] = step
            self.settings.settle(step.quantity, step.display_unit, asked=step.unit_asked)
        self._results_changed = True
        if _in_kernel():
            # JupyterLab: the checker's sheets compare with this sheet's latest results
            from calcpack.working.recorded import follow

            follow(self)
            if self.auto_display:
                step._ipython_display_()
        return step

    def _adopt(self, step: Step) -> None:
        """Give ``step`` (and the steps of a block) the sheet's settings where it has none."""
        if getattr(step, "settings", None) is None and hasattr(step, "settings"):
            step.settings = self.settings
        if isinstance(step, Value) and not step.unit_asked and not isinstance(step, Imported):
            # one unit per kind on a sheet: a value that did not ask for its unit follows the
            # unit the sheet settled on (the first force, moment or line load it showed), and
            # one in the other unit system's units is shown in this system's
            unit = self.settings.default_unit(step.display_unit)
            if unit is not None:
                step.display_unit = unit
        if isinstance(step, Check):
            unit = self.settings.default_unit(step.unit)
            if unit is not None and unit != step.unit:
                step.unit = unit
                step.demand_q = step.demand_q.to(unit)
                step.capacity_q = step.capacity_q.to(unit)
        if isinstance(step, Caution):
            self._cautions.add(step.body)
        inner_steps = getattr(step, "steps", None)
        if isinstance(inner_steps, list) and not isinstance(step, Sheet):
            # a block repeats no caution the sheet (or the block) already carries
            kept = []
            for inner in inner_steps:
                if isinstance(inner, Caution) and inner.body in self._cautions:
                    continue
                if isinstance(inner, Caution):
                    self._cautions.add(inner.body)
                kept.append(inner)
            inner_steps[:] = kept
        for inner in getattr(step, "steps", ()):
            self._adopt(inner)
            if isinstance(inner, Value):
                self.settings.settle(inner.quantity, inner.display_unit, asked=inner.unit_asked)

    def given(
        self,
        name: str,
        value: pint.Quantity | float | int,
        description: str = "",
        *,
        source: str | None = None,
        unit: str | None = None,
        latex: str | None = None,
    ) -> Given:
        """Add an input value; see :class:`~calcpack.working.steps.Given`.

        Raises:
            InputError: ``name`` is a value this sheet imports (change it where it comes from).
        """
        earlier = self._names.get(name)
        if isinstance(earlier, Imported):
            from calcpack.errors import InputError

            raise InputError(
                f"{name} is imported from {earlier.source}: change it on that sheet, not here",
                name=name,
                value=value,
                expected="a name this sheet does not import",
            )
        step = Given(
            name, value, description, source=source, unit=unit, latex=latex, settings=self.settings
        )
        self.add(step)
        return step

    def derive(
        self,
        name: str,
        formula: Term | pint.Quantity,
        description: str = "",
        *,
        unit: str | None = None,
        ref: str | None = None,
        note: str | None = None,
        latex: str | None = None,
    ) -> Derived:
        """Add a derived value; see :class:`~calcpack.working.steps.Derived`."""
        step = Derived(
            name,
            formula,
            description,
            unit=unit,
            ref=ref,
            note=note,
            latex=latex,
            settings=self.settings,
        )
        self.add(step)
        return step

    def check(
        self,
        name: str,
        demand: Value | pint.Quantity,
        capacity: Value | pint.Quantity,
        *,
        ref: str | None = None,
        member: str | None = None,
        combination: str | None = None,
        description: str = "",
    ) -> Check:
        """Add a check of demand against capacity; see :class:`~calcpack.working.steps.Check`."""
        step = Check(
            name,
            demand,
            capacity,
            ref=ref,
            member=member,
            combination=combination,
            description=description,
            settings=self.settings,
        )
        self.add(step)
        return step

    def not_covered(
        self, name: str, reason: str, *, ref: str | None = None, member: str | None = None
    ) -> NotCovered:
        """Record a check this method cannot make (verdict NOT COVERED, with the reason)."""
        step = NotCovered(name, reason, ref=ref, member=member, settings=self.settings)
        self.add(step)
        return step

    def equation(
        self,
        lhs: Term | pint.Quantity | float,
        rhs: Term | pint.Quantity | float = 0,
        *,
        label: str | None = None,
        description: str = "",
    ) -> Equation:
        """Add an equation with knowns substituted; see :class:`~calcpack.working.Equation`."""
        step = Equation(lhs, rhs, label=label, description=description, settings=self.settings)
        self.add(step)
        return step

    def heading(self, text: str, level: int = 2) -> Heading:
        """Add a heading."""
        step = Heading(text, level)
        self.add(step)
        return step

    def text(self, body: str, **values: Any) -> Text:
        """Add a paragraph that may cite recorded values.

        ``{R_A}`` in the prose is replaced by the typeset symbol and its value, ``{R_A:value}``
        by the value alone, ``{R_A:symbol}`` by the symbol alone (see
        :mod:`calcpack.working.prose`). A name is looked up among the sheet's values, or given
        as a keyword: a calcpack value, a pint quantity (shown in the sheet's unit for its kind
        and to its significant figures) or a number. ``$...$`` is inline TeX.

        Example: ``s.text("The analysis gives {R_A} at the wall.", R_A=result.reaction("A").Fy)``

        Raises:
            InputError: a placeholder names no value, or a keyword value is not cited.
        """
        step = Text(*self._cite(body, values))
        self.add(step)
        return step

    def assume(self, body: str, **values: Any) -> Assume:
        """Declare an assumption (also listed in the package's assumptions block); it may cite
        values as :meth:`text` does."""
        step = Assume(*self._cite(body, values))
        self.add(step)
        return step

    def caution(self, body: str, **values: Any) -> Caution:
        """Declare a caution (also listed in the package's caution block); it may cite values
        as :meth:`text` does."""
        step = Caution(*self._cite(body, values))
        self.add(step)
        return step

    def _cite(self, body: str, values: dict[str, Any]) -> tuple[str, tuple[Citation, ...]]:
        if not isinstance(body, str):
            from calcpack.errors import InputError

            raise InputError(
                f"Prose must be a string (got {type(body).__name__})",
                name="body",
                value=body,
                expected="a sentence, e.g. 'The reaction {R_A} is carried by the post.'",
            )
        return cite(body, values, self._names, self.settings, self.settings.unit_for)

    def table(
        self, columns: list[str], rows: list[list[Any]], *, caption: str | None = None
    ) -> Table:
        """Add a table."""
        step = Table(columns, rows, caption=caption, settings=self.settings)
        self.add(step)
        return step

    # -- data ---------------------------------------------------------------------------
    def __getitem__(self, name: str) -> Value:
        return self._names[name]

    def values(self) -> list[Record]:
        """Every given and derived value as data (name, value, unit, description, kind)."""
        return [s.record() for s in self.steps if isinstance(s, Value)]

    def checks(self) -> list[CheckRecord]:
        """Every check as data, in sheet order."""
        return [s.record() for s in self.steps if isinstance(s, Check | NotCovered)]

    def records(self) -> dict[str, list[Any]]:
        """All records of the sheet, as the package manifest stores them."""
        out: dict[str, list[Any]] = {"standards": list(self.standards)}
        for s in self.steps:
            for k, v in s.records().items():
                out.setdefault(k, []).extend(v)
        return out

    # -- display ------------------------------------------------------------------------
    def text_report(self) -> str:
        """The whole sheet as plain text."""
        head = [self.title, "=" * len(self.title)] if self.title else []
        return "\n".join(head + [s.text() for s in self.steps])

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        from calcpack.working import render

        return {
            "text/html": render.steps_html(self.steps),
            "text/plain": self.text_report(),
        }

    def __repr__(self) -> str:
        return f"Sheet({self.title!r}, {len(self.steps)} steps)"
