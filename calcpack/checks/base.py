"""The small common interface of every design-check module.

A check module (one per design standard) writes each clause **once**, as a function of a
:class:`Recorder`. The function is run twice:

* with a plain :class:`Recorder`: values are pint quantities and the results are data
  (:class:`CheckResult`), with no display code imported;
* with a :class:`SheetRecorder` (only when the working is asked for): the same calls build
  :mod:`calcpack.working` steps -- Given with its source, Derived with the formula, the values
  substituted and ``ref=`` the clause, Check with the governing combination, NotCovered.

So the formula shown is the formula computed. A module returns :class:`MemberChecks` (results,
intermediate values, working, records for the summary table) and names its :class:`Standard`
(code, edition, method), whose caution is printed on every check sheet.

To add a standard (EN 1993, EN 1995, AS 4100...): write a module with a ``STANDARD`` and
functions that take a Recorder, call :func:`run_checks`, and return its MemberChecks.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, field
from numbers import Real
from typing import Any

from calcpack.contract.verdict import Verdict, passes
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, is_quantity, utilisation
from calcpack.validate import find

__all__ = [
    "NOT_COVERED",
    "NOT_OK",
    "OK",
    "CheckResult",
    "MemberChecks",
    "Recorder",
    "SheetRecorder",
    "Standard",
    "run_checks",
]

OK = Verdict.OK
NOT_OK = Verdict.NOT_OK
NOT_COVERED = Verdict.NOT_COVERED


@dataclass(frozen=True)
class Standard:
    """The design standard a check module implements.

    Attributes:
        code: designation with edition, e.g. ``"ANSI/AISC 360-16"``.
        title: its title. method: ``"LRFD"``, ``"ASD"`` or ``""``.
    """

    code: str
    title: str
    method: str = ""
    caution_text: str = ""
    """The caution in the standard's own words, when the general one does not fit (a
    serviceability limit is not a provision of a design standard)."""

    @property
    def caution(self) -> str:
        """The caution every check sheet of this standard carries."""
        if self.caution_text:
            return self.caution_text
        m = f" ({self.method})" if self.method else ""
        return (
            f"These checks implement {self.code}{m}, {self.title}. Their provisions must be "
            "confirmed against the edition adopted locally (and any amendments) before issue."
        )


@dataclass(frozen=True)
class CheckResult:
    """One check: demand against capacity with its clause and governing combination.

    Attributes:
        name: what is checked. member: the member mark. demand, capacity: quantities of one
        dimension (None when not covered). utilisation: |demand| / capacity. verdict: OK,
        NOT OK or NOT COVERED. clause: the clause that sets the capacity. combination: the
        governing load combination. description: words; for NOT COVERED, the reason.
    """

    name: str
    member: str
    demand: Quantity | None
    capacity: Quantity | None
    utilisation: float | None
    verdict: str
    clause: str
    combination: str | None = None
    description: str = ""

    @property
    def passed(self) -> bool:
        return self.verdict == OK

    def record(self) -> Any:
        """This check as a :class:`calcpack.working.CheckRecord` (for the summary table)."""
        from calcpack.working import CheckRecord
        from calcpack.working.format import format_unit_text

        unit = "" if self.capacity is None else format_unit_text(self.capacity.units)
        return CheckRecord(
            name=self.name,
            member=self.member,
            demand=None if self.demand is None else float(self.demand.magnitude),
            capacity=None if self.capacity is None else float(self.capacity.magnitude),
            unit=unit,
            utilisation=self.utilisation,
            verdict=self.verdict,
            ref=self.clause,
            combination=self.combination,
            description=self.description,
        )


def _q(x: Any) -> Quantity:
    if is_quantity(x):
        return x
    if hasattr(x, "quantity"):
        return x.quantity
    return Q_(float(x), "")


class Recorder:
    """Runs check logic on numbers. See the module notes; :class:`SheetRecorder` shows it.

    Every method is written once here: it computes on quantities and hands what a sheet would
    show to :meth:`_show`, which a plain Recorder ignores and a SheetRecorder turns into a step.

    Args:
        member: the member mark used in every result.
    """

    shows = False

    def __init__(self, member: str) -> None:
        self.member = member
        self.results: list[CheckResult] = []
        self.values: dict[str, Quantity] = {}

    def _show(self, kind: str, *args: Any, **kwargs: Any) -> Any:
        """The step ``kind`` of :mod:`calcpack.working` made from these arguments, added to the
        sheet (a SheetRecorder), or None: numbers only, nothing shown."""
        return None

    # -- values ----------------------------------------------------------------------------
    def given(
        self,
        name: str,
        value: Any,
        description: str = "",
        *,
        source: str | None = None,
        unit: str | None = None,
        result: bool = False,
    ) -> Any:
        """A value the check starts from; ``result``: it is a result of the analysis (a demand
        from a load combination), recorded as a result rather than an input."""
        q = value if is_quantity(value) else Q_(float(value), "")
        self.values[name] = q
        step = self._show(
            "Given", name, value, description, source=source, unit=unit, result=result
        )
        return q if step is None else step

    def derive(
        self,
        name: str,
        formula: Any,
        description: str = "",
        *,
        unit: str | None = None,
        ref: str | None = None,
        note: str | None = None,
        latex: str | None = None,
    ) -> Any:
        """A value worked out by ``formula`` (a quantity on numbers, a formula on a sheet),
        in ``unit`` (else reduced), with the clause ``ref``."""
        if isinstance(formula, Real):
            formula = Q_(float(formula), "")
        step = self._show(
            "Derived", name, formula, description, unit=unit, ref=ref, note=note, latex=latex
        )
        if step is not None:
            self.values[name] = step.quantity
            return step
        q = _q(formula)
        q = q.to(unit) if unit is not None else q.to_reduced_units()
        self.values[name] = q
        return q

    def q(self, x: Any) -> Quantity:
        """The quantity of a handle (for branch decisions)."""
        return _q(x)

    def f(self, x: Any) -> float:
        """A dimensionless handle as a float."""
        return float(_q(x).to("").magnitude)

    # -- functions usable in formulas -------------------------------------------------------
    @property
    def pi(self) -> Any:
        """π as a number (shown as π by SheetRecorder)."""
        return math.pi

    def sqrt(self, x: Any) -> Any:
        return x**0.5

    def min(self, *xs: Any) -> Any:
        return min(xs, key=lambda v: _q(v).to_base_units().magnitude)

    def max(self, *xs: Any) -> Any:
        return max(xs, key=lambda v: _q(v).to_base_units().magnitude)

    # -- checks ----------------------------------------------------------------------------
    def check(
        self,
        name: str,
        demand: Any,
        capacity: Any,
        *,
        ref: str,
        combination: str | None = None,
        description: str = "",
    ) -> CheckResult:
        """Demand against capacity (one dimension), the verdict by the contract's pass rule."""
        d, c, u = utilisation(_q(demand), _q(capacity), name=name)
        verdict = OK if passes(u) else NOT_OK
        res = CheckResult(name, self.member, d, c, u, verdict, ref, combination, description)
        self.results.append(res)
        self._show(
            "Check",
            name,
            demand,
            capacity,
            ref=ref,
            member=self.member,
            combination=combination,
            description=description,
        )
        return res

    def not_covered(self, name: str, reason: str, *, ref: str | None = None) -> CheckResult:
        """A check this method does not cover, with the reason (a verdict, never a number)."""
        res = CheckResult(name, self.member, None, None, None, NOT_COVERED, ref or "", None, reason)
        self.results.append(res)
        self._show("NotCovered", name, reason, ref=ref, member=self.member)
        return res

    # -- text (shown only by SheetRecorder) -------------------------------------------------
    def heading(self, text: str, level: int = 3) -> None:
        self._show("Heading", text, level)

    def text(self, body: str) -> None:
        self._show("Text", body)

    def assume(self, body: str) -> None:
        self._show("Assume", body)

    def caution(self, body: str) -> None:
        self._show("Caution", body)

    def table(self, columns: Sequence[str], rows: Sequence[Sequence[Any]], caption: str) -> None:
        self._show("Table", list(columns), [list(r) for r in rows], caption=caption)


class SheetRecorder(Recorder):
    """Runs the same check logic building :mod:`calcpack.working` steps (in ``steps``)."""

    shows = True
    # the steps that format values take the sheet's display settings
    _WITH_SETTINGS = frozenset({"Given", "Derived", "Check", "NotCovered", "Table"})

    def __init__(self, member: str, settings: Any = None) -> None:
        super().__init__(member)
        self.steps: list[Any] = []
        self.settings = settings

    def _show(self, kind: str, *args: Any, **kwargs: Any) -> Any:
        # imported here so that checks run on numbers never load sympy and the renderers
        from calcpack import working

        if kind in self._WITH_SETTINGS:
            kwargs["settings"] = self.settings
        step = getattr(working, kind)(*args, **kwargs)
        self.steps.append(step)
        return step

    @property
    def pi(self) -> Any:
        from calcpack.working import pi

        return pi

    def sqrt(self, x: Any) -> Any:
        from calcpack.working import Term, sqrt

        return sqrt(x) if isinstance(x, Term) else x**0.5

    def min(self, *xs: Any) -> Any:
        from calcpack.working import Min

        return Min(*xs)

    def max(self, *xs: Any) -> Any:
        from calcpack.working import Max

        return Max(*xs)


Logic = Callable[[Recorder], None]


@dataclass(frozen=True)
class MemberChecks:
    """The checks of one member to one standard.

    Attributes:
        member: the member mark. title: what was checked (shown as the heading).
        standard: the standard applied. results: every check, in order.
        values: intermediate values by name (M_p, L_p, C_b, F'_b...), full precision.
    """

    member: str
    title: str
    standard: Standard
    results: tuple[CheckResult, ...]
    values: Mapping[str, Quantity]
    logic: Logic = field(repr=False, compare=False)

    def __getitem__(self, name: str) -> CheckResult:
        checks = {r.name: r for r in self.results}
        return find("name", name, checks, what="check", where=f"of member {self.member}")

    @property
    def governing(self) -> CheckResult:
        """The check with the highest utilisation (a NOT COVERED check comes first)."""
        for r in self.results:
            if r.verdict == NOT_COVERED:
                return r
        return max(self.results, key=lambda r: r.utilisation or 0.0)

    @property
    def passed(self) -> bool:
        """True if every check is OK (NOT COVERED is not a pass)."""
        return all(r.passed for r in self.results)

    def working(self, *, settings: Any = None) -> list[Any]:
        """Every clause as working steps: heading, caution (edition), the check working."""
        rec = SheetRecorder(self.member, settings)
        # the title may name the member already ("B1: deflection"): never "B1: B1: ..."
        named = self.title.startswith(f"{self.member}:") or self.title.startswith(f"{self.member} ")
        rec.heading(self.title if named else f"{self.member}: {self.title}", 2)
        rec.caution(self.standard.caution)
        self.logic(rec)
        return rec.steps

    def add_to(self, sheet: Any) -> MemberChecks:
        """Add the working to ``sheet`` step by step (so the sheet's summary sees each check)."""
        for step in self.working(settings=getattr(sheet, "settings", None)):
            sheet.add(step)
        return self

    def add_results_to(self, sheet: Any) -> MemberChecks:
        """Add only the checks to ``sheet``, one line each (demand, capacity, verdict, clause,
        combination), without the working: for a member whose working of the same clauses is
        shown elsewhere on the sheet. The checks are recorded as with :meth:`add_to`."""
        from calcpack.working import Check, NotCovered

        settings = getattr(sheet, "settings", None)
        for r in self.results:
            if r.demand is None or r.capacity is None:
                step: Any = NotCovered(
                    r.name, r.description, ref=r.clause or None, member=r.member, settings=settings
                )
            else:
                step = Check(
                    r.name,
                    r.demand,
                    r.capacity,
                    ref=r.clause,
                    member=r.member,
                    combination=r.combination,
                    description=r.description,
                    settings=settings,
                )
            sheet.add(step)
        return self

    def records(self) -> list[Any]:
        """The checks as :class:`calcpack.working.CheckRecord` for the summary of checks."""
        return [r.record() for r in self.results]

    def summary(self) -> Any:
        """The summary table of this member's checks."""
        from calcpack.checks.summary import summary_table

        return summary_table(self.records(), caption=f"Summary of checks: {self.member}")

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        from calcpack.working import Block

        return Block(self.working(), title=self.title)._repr_mimebundle_()


def run_checks(member: str, title: str, standard: Standard, logic: Logic) -> MemberChecks:
    """Run ``logic`` on numbers and return its :class:`MemberChecks` (working on demand)."""
    rec = Recorder(member)
    logic(rec)
    if not rec.results:
        raise InputError(  # pragma: no cover - every module records at least one check
            f"No check was made for member {member}",
            name="member",
            value=member,
            expected="at least one check",
        )
    return MemberChecks(member, title, standard, tuple(rec.results), dict(rec.values), logic)
