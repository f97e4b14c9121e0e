"""A calculation sheet: steps in order, its display settings, and its values as data.

Inside a Jupyter kernel each step a sheet method creates is displayed at once, so a cell like
``M = s.derive("M", w * L**2 / 8)`` shows its working; assign the result to keep the cell's
last line from displaying it a second time. Outside a kernel nothing is displayed.
"""

from __future__ import annotations

import os
import sys
import warnings
from pathlib import Path
from typing import Any

import pint

from calcpack.units import DisplaySettings, get_display, validate_display
from calcpack.working.expr import Term
from calcpack.working.linked import Exports, Imported, export_entry
from calcpack.working.prose import Citation, cite
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
    from calcpack.units import ONE_UNIT_KINDS, ureg

    try:
        unit = ureg.Unit(text)
    except (pint.UndefinedUnitError, ValueError, AttributeError) as exc:
        raise InputError(
            f"Sheet unit {text!r} is not a known unit",
            name="units",
            value=text,
            expected="a unit such as 'kip', 'lbf*ft', 'plf', 'kN'",
        ) from exc
    if not any(unit.dimensionality == ureg.get_dimensionality(k) for k in ONE_UNIT_KINDS):
        raise InputError(
            f"Sheet units set forces, moments and line loads only (got {text!r}, of "
            f"{unit.dimensionality})",
            name="units",
            value=text,
            expected="a unit of force, force·length or force/length",
        )
    return unit


def _in_kernel() -> bool:
    ipython = sys.modules.get("IPython")
    if ipython is None:
        return False
    shell = ipython.get_ipython()
    return shell is not None and getattr(shell, "kernel", None) is not None


class Sheet:
    """An ordered calculation sheet.

    Args:
        title: the sheet title (the package's project file may also give one).
        system: display unit system, ``"SI"`` or ``"US"`` (default: the global setting).
        sig_figs: significant figures shown (default: the global setting, 3).
        standards: design standards the sheet applies (collected into the design basis).
        auto_display: show each new step when running in a Jupyter kernel.
        units: the sheet's units for forces, moments and line loads (``["lbf", "lbf*ft",
            "plf"]``). Without them, the first value of each kind the sheet shows settles its
            unit; later values of that kind are shown in it unless their step asks for a unit.
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
            self.settings.keep_unit(step.display_unit)
        if self.auto_display and _in_kernel():
            step._ipython_display_()
        return step

    def _adopt(self, step: Step) -> None:
        """Give ``step`` (and the steps of a block) the sheet's settings where it has none."""
        if getattr(step, "settings", None) is None and hasattr(step, "settings"):
            step.settings = self.settings
        if isinstance(step, Value) and not step.unit_asked and not isinstance(step, Imported):
            # one unit per kind on a sheet: a value that did not ask for its unit follows the
            # unit the sheet settled on (the first force, moment or line load it showed)
            unit = self.settings.kind_unit(step.display_unit)
            if unit is not None:
                step.display_unit = unit
        if isinstance(step, Check):
            unit = self.settings.kind_unit(step.unit)
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
                self.settings.keep_unit(inner.display_unit)

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

    # -- values carried between sheets --------------------------------------------------
    def export(
        self,
        *items: Value | Check | pint.Quantity,
        name: str | None = None,
        case: str | None = None,
        description: str | None = None,
    ) -> Exports:
        """Offer values to the other sheets of the project (shown as a table).

        Args:
            items: givens or derived values (exported under their names, in the unit shown),
                checks (their utilisation) or quantities (e.g. an analysis result).
            name: the exported name, for one check or quantity (or to rename one value).
            case: the load case of an unfactored result (e.g. ``"D"``), for load takedown.
            description: words for the importing sheet (default: the value's own).

        In JupyterLab the sheet also writes its exports file (see
        :mod:`calcpack.working.links`), which the importing sheets read; in a build the build
        passes the recorded values on.

        Raises:
            InputError: no item, ``name`` with several items, or a check or quantity unnamed.
        """
        from calcpack.errors import InputError

        if not items or (name is not None and len(items) > 1):
            raise InputError(
                f"export takes one or more values, and a name only with one "
                f"(got {len(items)} items, name = {name!r})",
                name="items",
                value=items,
                expected="export(w, M) or export(result_quantity, name='R_A')",
            )
        entries = [export_entry(it, name=name, case=case, description=description) for it in items]
        from calcpack.working.links import entry_key

        for e in entries:
            self._exports[entry_key(e["name"], e["case"])] = e
        step = Exports(entries, settings=self.settings)
        self.add(step)
        self._write_exports()
        return step

    def _write_exports(self) -> None:
        """In JupyterLab (never in a build), write this sheet's exports file."""
        if os.environ.get("CALCPACK_BUILDING") == "1":
            return
        from calcpack.working.links import this_sheet, write_exports

        ref = this_sheet()
        if ref is not None:
            write_exports(ref, list(self._exports.values()))

    def import_value(
        self,
        sheet: str,
        name: str,
        *,
        dimension: str | None = None,
        case: str | None = None,
        as_name: str | None = None,
        unit: str | None = None,
        description: str | None = None,
        latex: str | None = None,
    ) -> Imported:
        """Take a value another sheet of the project exports, as a given of this sheet.

        Args:
            sheet: the exporting sheet's notebook name (``"02_lintel"``) or project path.
            name: the exported name (``"V_max"``).
            dimension: the dimension this sheet expects (``"[force]"``) or a unit of it
                (``"kN"``); a value of another dimension is refused.
            case: the load case, for a value exported per case.
            as_name: its symbol on this sheet (default ``name``).
            unit: display unit on this sheet (default: the exporting sheet's).
            description: words for the checker (default: the exporting sheet's).

        The source shown reads "sheet 2, V_max" and links to that sheet in the package. In
        JupyterLab the value is the exporting sheet's latest recorded one, with a warning when
        that sheet's notebook or inputs file changed since (run it first).

        Raises:
            InputError: no such sheet in the project, or the sheet exports no such name (both
                named), or its values have not been recorded yet.
            DimensionError: the value is not of ``dimension``.
        """
        from calcpack.errors import DimensionError, InputError
        from calcpack.working.links import entry_key, read_exports, resolve_sheet, staleness

        ref = resolve_sheet(sheet)
        exports = read_exports(ref)
        key = entry_key(name, case)
        entry = exports.values.get(key)
        if entry is None:
            from calcpack.validate import suggest

            known = sorted(exports.values)
            hint = suggest(key, known)
            extra = f"; did you mean {hint[0]!r}?" if hint else ""
            raise InputError(
                f"Sheet {ref.name!r} exports no value {key!r} (it exports: "
                f"{', '.join(known) or 'nothing'}){extra}",
                name=key,
                value=f"{ref.name}: {key}",
                expected="one of " + ", ".join(known),
            )
        local = as_name or name
        step = Imported(
            local,
            entry,
            ref,
            description=description,
            unit=unit,
            latex=latex,
            settings=self.settings,
        )
        if dimension is not None:
            from calcpack.units import require

            try:
                require(step.quantity, dimension, local)
            except DimensionError as exc:
                raise DimensionError(
                    f"Import of {key} from sheet {ref.name!r}: {exc}",
                    name=local,
                    value=step.quantity,
                    expected=f"a value of {dimension}",
                ) from exc
        if os.environ.get("CALCPACK_BUILDING") != "1":
            why = staleness(ref, exports)
            if why is not None:
                message = (
                    f"{local} from sheet {ref.name!r} may be out of date: {why}. "
                    f"Run {ref.name} first."
                )
                warnings.warn(message, stacklevel=2)
                self.add(Text(f"**Out of date?** {message}"))
        self.add(step)
        return step

    def import_cases(
        self, sheet: str, name: str, *, dimension: str | None = None, as_name: str | None = None
    ) -> dict[str, Imported]:
        """Every load case of a value another sheet exports per case (see :meth:`export`),
        each as a given named ``<as_name>_<case>``; returns case -> value, in export order.

        Raises:
            InputError: as :meth:`import_value`; or the sheet exports ``name`` for no case.
        """
        from calcpack.errors import InputError
        from calcpack.working.links import read_exports, resolve_sheet

        ref = resolve_sheet(sheet)
        cases = [
            e["case"]
            for e in read_exports(ref).values.values()
            if e.get("name") == name and e.get("case")
        ]
        if not cases:
            raise InputError(
                f"Sheet {ref.name!r} exports no load cases of {name!r} "
                f"(export it with export(..., name={name!r}, case=...))",
                name=name,
                value=f"{ref.name}: {name}",
                expected="a value exported per load case",
            )
        base = as_name or name
        return {
            c: self.import_value(sheet, name, dimension=dimension, case=c, as_name=f"{base}_{c}")
            for c in cases
        }

    def export_reactions(
        self, results: Any, support: str, *, name: str, member: str = ""
    ) -> Exports:
        """Export a support's vertical reaction for each load case, unfactored, for load
        takedown on the sheet of the supporting member (:meth:`takedown`).

        Args:
            results: load case -> unfactored result of that case (beam, truss or free body;
                see :func:`calcpack.loads.takedown.reactions_by_case`).
            support: the support (beam), joint (truss) or reaction (free body).
            name: the exported name (``"R_A"``). member: the supported member, for the words.

        Raises:
            OutOfScopeError: a result is factored or a combination.
        """
        from calcpack.loads.takedown import reactions_by_case

        by_case = reactions_by_case(results, support)
        on = f" on {member}" if member else ""
        entries = [
            export_entry(
                q,
                name=name,
                case=case,
                description=f"reaction at {support}{on}, upward, case {case} unfactored",
            )
            for case, q in by_case.items()
        ]
        from calcpack.working.links import entry_key

        for e in entries:
            self._exports[entry_key(e["name"], e["case"])] = e
        step = Exports(entries, settings=self.settings)
        self.add(step)
        self._write_exports()
        return step

    def takedown(self, *reactions: Any, onto: str) -> Any:
        """Carry reactions by load case onto the member this sheet designs, with the working.

        Args:
            reactions: case -> reaction mappings (e.g. from :meth:`import_cases`), one per
                supported member; the same case from several members is summed.
            onto: the member receiving the loads (``"post P1"``).

        Returns:
            A :class:`calcpack.loads.takedown.Takedown`: ``axial()`` for a post or footing,
            ``point_loads(x)`` for a beam.
        """
        from calcpack.loads.takedown import takedown

        result = takedown(*reactions, onto=onto)
        self.add(result.working(settings=self.settings))
        return result

    # -- what a checker expects to see checked -------------------------------------------
    def checklist(
        self,
        member_type: str,
        *,
        member: str,
        not_applicable: dict[str, str] | None = None,
        met_by: dict[str, str] | None = None,
    ) -> Any:
        """Declare a member's type, so the package lists every item of its checklist as met
        by a check, not applicable, or NOT COVERED (see :mod:`calcpack.checks.checklists`).

        Args:
            member_type: ``"steel beam"``, ``"timber beam"``/``"joist"``, ``"post"``/
                ``"column"``, ``"truss"``, ``"bearing"``, ``"footing"``, ``"connection"``.
            member: the member's mark, as its checks name it (``"B1"``).
            not_applicable: item -> why it does not apply (words, shown in the package).
            met_by: item -> the member or check elsewhere that meets it (``"P1"``).

        The checklist is the project's own ``member_checklists.csv`` when the project folder
        holds one, else calcpack's (common practice). Call it after the sheet's checks to see
        on the sheet which of them meet which item.

        Raises:
            InputError: unknown member type or item, or a declaration without a reason.
        """
        from calcpack.checks.checklists import member_checklist
        from calcpack.working.checklist import Checklist
        from calcpack.working.links import _find_root

        declared = member_checklist(
            member_type,
            member=member,
            not_applicable=not_applicable,
            met_by=met_by,
            project_root=_find_root(Path.cwd().resolve()),
        )
        checks = [c for c in self.records().get("checks", []) if isinstance(c, dict)]
        step = Checklist(declared.to_json(), checks, settings=self.settings)
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
