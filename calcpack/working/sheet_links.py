"""The sheet methods that link sheets and serve the checker: exports and imports between the
sheets of a project, load takedown, member checklists and the checker's independent checks.

A mixin of :class:`calcpack.working.Sheet` (kept apart so each module stays small); it uses
the sheet's ``add``, ``settings``, ``_names`` and ``_exports``.
"""

from __future__ import annotations

import os
import re
import warnings
from pathlib import Path
from typing import TYPE_CHECKING, Any

import pint

from calcpack.units import DisplaySettings
from calcpack.working.linked import Exports, Imported, export_entry
from calcpack.working.steps import Check, Step, Text, Value

if TYPE_CHECKING:
    pass

__all__ = ["SheetLinks"]


def _case_tag(case: str) -> str:
    """A load case's name as part of a symbol: "S unbalanced from L" -> "S_unbalanced_from_L",
    "W case A +GCpi" -> "W_case_A_plus_GCpi" (signs spelt out, so "+GCpi" and "-GCpi" differ)."""
    words = case.replace("+", " plus ").replace("-", " minus ").replace("−", " minus ")
    return re.sub(r"[^A-Za-z0-9]+", "_", words).strip("_") or "case"


class SheetLinks:
    """Exports, imports, takedown, checklists and independent checks of a sheet."""

    settings: DisplaySettings
    _names: dict[str, Value]
    _exports: dict[str, dict[str, Any]]

    def add(self, step: Step) -> Step:  # pragma: no cover - provided by Sheet
        raise NotImplementedError

    def records(self) -> dict[str, list[Any]]:  # pragma: no cover - provided by Sheet
        raise NotImplementedError

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
            c: self.import_value(
                sheet, name, dimension=dimension, case=c, as_name=f"{base}_{_case_tag(c)}"
            )
            for c in cases
        }

    def export_by_case(
        self,
        values: Any,
        *,
        name: str,
        description: str = "",
    ) -> Any:
        """Export many values by row and load case in one table (e.g. every member force of
        a truss, unfactored, case by case), so another sheet takes them all with
        :meth:`import_by_case` instead of solving the model again.

        Args:
            values: load case -> (row -> quantity), e.g. ``{c: r.forces for c, r in
                cases.items()}``; every row a symbol-like name (``"L0U1"``).
            name: the name of the set (``"N"``); each value is exported as ``<name>_<row>``
                with its case.
            description: words for each value (default: "<name> of <row>").

        Raises:
            InputError: no values, a case without rows, or a row that is not a symbol name.
        """
        from calcpack.errors import InputError
        from calcpack.working.linked import ExportsTable
        from calcpack.working.links import entry_key

        cells = [(str(c), str(r), q) for c, rows in dict(values).items() for r, q in rows.items()]
        if not cells:
            raise InputError(
                f"export_by_case({name!r}) needs at least one value (got none)",
                name="values",
                value=values,
                expected="load case -> (row -> quantity)",
            )
        entries = [
            export_entry(q, name=f"{name}_{r}", case=c, description=description or f"{name} of {r}")
            for c, r, q in cells
        ]
        for e in entries:
            self._exports[entry_key(e["name"], e["case"])] = e
        step = ExportsTable(entries, [r for _, r, _ in cells], name=name, settings=self.settings)
        self.add(step)
        self._write_exports()
        return step

    def import_by_case(
        self, sheet: str, name: str, *, dimension: str | None = None
    ) -> dict[str, dict[str, pint.Quantity]]:
        """Every value another sheet exports with :meth:`export_by_case` under ``name``, as
        givens of this sheet (not editable, each a link), shown as one table.

        Returns:
            load case -> (row -> quantity), in the exporting sheet's order.

        Raises:
            InputError: no such sheet, or it exports nothing by case under ``name``.
            DimensionError: a value not of ``dimension``.
        """
        from calcpack.errors import DimensionError, InputError
        from calcpack.units import require
        from calcpack.working.linked import ImportedTable
        from calcpack.working.links import read_exports, resolve_sheet

        ref = resolve_sheet(sheet)
        prefix = f"{name}_"
        found = [
            e
            for e in read_exports(ref).values.values()
            if str(e.get("name", "")).startswith(prefix) and e.get("case")
        ]
        if not found:
            raise InputError(
                f"Sheet {ref.name!r} exports nothing by load case under {name!r} (export it "
                f"with export_by_case(..., name={name!r}))",
                name=name,
                value=f"{ref.name}: {name}",
                expected="values exported with export_by_case",
            )
        steps, rows = [], []
        taken: set[str] = set()
        out: dict[str, dict[str, pint.Quantity]] = {}
        for e in found:
            row, case = e["name"][len(prefix) :], str(e["case"])
            local = f"{e['name']}_{_case_tag(case)}"
            while local in taken:  # two case names that differ only in punctuation
                local += "_"
            taken.add(local)
            st = Imported(local, e, ref, settings=self.settings)
            if dimension is not None:
                try:
                    require(st.quantity, dimension, st.name)
                except DimensionError as exc:
                    raise DimensionError(
                        f"Import of {e['name']} ({case}) from sheet {ref.name!r}: {exc}",
                        name=st.name,
                        value=st.quantity,
                        expected=f"a value of {dimension}",
                    ) from exc
            steps.append(st)
            rows.append(row)
            out.setdefault(case, {})[row] = st.quantity
        self.add(ImportedTable(steps, rows, name=name, sheet=ref, settings=self.settings))
        return out

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
        # in the sheet's units (lbf or kip on a US sheet), not the solver's SI
        unit = self.settings.unit_for(next(iter(by_case.values()))) if by_case else None
        if unit is not None:
            by_case = {c: q.to(unit) for c, q in by_case.items()}
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
        not_covered: dict[str, str] | None = None,
    ) -> Any:
        """Declare a member's type, so the package lists every item of its checklist as met
        by a check, not applicable, or NOT COVERED (see :mod:`calcpack.checks.checklists`).

        Args:
            member_type: ``"steel beam"``, ``"timber beam"``/``"joist"``, ``"post"``/
                ``"column"``, ``"truss"``, ``"bearing"``, ``"footing"``, ``"connection"``.
            member: the member's mark, as its checks name it (``"B1"``).
            not_applicable: item -> why it does not apply (words, shown in the package).
            met_by: item -> the member or check elsewhere that meets it (``"P1"``).
            not_covered: item -> why the package leaves it unchecked (it stays NOT COVERED,
                counted on the cover, with this reason beside it).

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
            not_covered=not_covered,
            project_root=_find_root(Path.cwd().resolve()),
        )
        checks = [c for c in self.records().get("checks", []) if isinstance(c, dict)]
        step = Checklist(declared.to_json(), checks, settings=self.settings)
        self.add(step)
        return step

    # -- the checker's independent checks ----------------------------------------------
    def verify(
        self,
        sheet: str,
        name: str,
        value: Value | pint.Quantity | float,
        *,
        tolerance: Any,
        method: str,
        member: str | None = None,
        case: str | None = None,
    ) -> Any:
        """Declare the checker's own value of a preparer's result, to be compared in the build.

        In JupyterLab the sheet also shows it compared with the preparer's latest recorded
        result -- value, checker's value, difference, tolerance, agreed or not, method -- and
        says when that record is older than the preparer's notebook or inputs file (run that
        sheet first) or missing (:func:`calcpack.working.verification.compare_with_record`).

        Args:
            sheet: the preparer's sheet (notebook name, as for :meth:`import_value`).
            name: the result's name there (a recorded or exported value; with ``member``, a
                check's name, whose utilisation ``value`` then is).
            value: the checker's value, computed by other means on this sheet.
            tolerance: the agreement the checker asks for, as a fraction (``0.05``) or a
                percentage (``5 * ureg.percent``); the relative difference must not exceed it.
            method: how the checker got the value (``"beam table, AISC Manual Table 3-23"``).
            member: for a check, the member it is on (``"B1"``).
            case: for a value exported per load case.

        Raises:
            InputError: the sheet is not in the project; a bad tolerance or no method; or this
                sheet imports the very value it checks (an independent check may not read it).
            DimensionError: in JupyterLab, the preparer's current record is in a unit the
                checker's value does not convert to.
        """
        from calcpack.errors import InputError
        from calcpack.working.links import resolve_sheet
        from calcpack.working.verification import Verification, verification_entry

        ref = resolve_sheet(sheet)
        for step in self._names.values():
            if not isinstance(step, Imported) or step.link_record["from_sheet"] != ref.path:
                continue
            if step.link_record["from_name"] == name and step.link_record.get("case") == case:
                raise InputError(
                    f"An independent check may not read the value it checks: this sheet "
                    f"imports {name} from sheet {ref.number} (as {step.name}); compute it here "
                    "by other means",
                    name=name,
                    value=f"{ref.name}: {name}",
                    expected="a value computed on the checker's sheet",
                )
        if isinstance(value, Imported):
            raise InputError(
                f"An independent check may not read the value it checks: {value.name} is "
                f"imported from {value.source}",
                name=name,
                value=value.name,
                expected="a value computed on the checker's sheet",
            )
        entry = verification_entry(
            ref, name, value, tolerance=tolerance, method=method, member=member, case=case
        )
        comparison = None
        if os.environ.get("CALCPACK_BUILDING") != "1":
            # JupyterLab: compared with the preparer's latest record, for the checker's eyes
            # only (the build compares with its own records; nothing here is recorded)
            from calcpack.working.verification import compare_with_record

            comparison = compare_with_record(ref, entry)
            if comparison.note is not None:
                warnings.warn(f"Independent check of {name}: {comparison.note}", stacklevel=2)
        shown = Verification(entry, settings=self.settings, comparison=comparison)
        self.add(shown)
        return shown

    def key_results(self, *names: str, member: str | None = None) -> Any:
        """Declare this sheet's key results (value or export names; with ``member``, check
        names), which the package lists as independently verified by the checker or not.
        Without a declaration the package takes the sheet's exports, its governing check per
        member and its maximum moments, shears and deflections.

        Raises:
            InputError: no name given.
        """
        from calcpack.errors import InputError
        from calcpack.working.verification import KeyResults

        if not names or not all(isinstance(n, str) and n.strip() for n in names):
            raise InputError(
                f"key_results takes one or more result names (got {names!r})",
                name="names",
                value=names,
                expected='names such as "M_max", "R_A"',
            )
        step = KeyResults([(n.strip(), member) for n in names])
        self.add(step)
        return step
