"""The steps that carry values between sheets: a sheet's exports, and a value it imports.

:class:`Exports` is the table of values a sheet offers to the others; its records (key
``"exports"``) are what the build reads to pass them on. :class:`Imported` is a given whose
value and source come from another sheet: the source reads "sheet 2, R_A" and links to that
sheet in the package (the page is written in at layout); its records add a link record (key
``"imports"``) that the manifest keeps. See :mod:`calcpack.working.links` for the exports file.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import pint

from calcpack.errors import InputError
from calcpack.units import DisplaySettings, ureg
from calcpack.working.format import format_unit_text
from calcpack.working.links import SheetRef
from calcpack.working.steps import Check, Given, Table, Value

__all__ = ["Exports", "Imported", "export_entry"]

_MUTABLE = frozenset({"_shown_in", "settings", "display_unit"})
"""What a sheet may still set on an imported value: its display state, never its value."""


def export_entry(
    item: Value | Check | pint.Quantity,
    *,
    name: str | None = None,
    case: str | None = None,
    description: str | None = None,
) -> dict[str, Any]:
    """An export record: ``name``, ``case``, ``value`` (full precision, in ``unit``), ``unit``
    (as displayed), ``pint_unit`` (to rebuild the quantity), ``kind``, ``description``,
    ``symbol`` (TeX).

    A value keeps its name and display unit; a check exports its utilisation |demand|/capacity
    (dimensionless, ``name`` required); a bare quantity needs ``name``.

    Raises:
        InputError: a check or quantity without ``name``, or an item of another type.
    """
    from calcpack.working.step_base import _check_name

    if isinstance(item, Value):
        q = item.display_quantity
        key = _check_name(name or item.name)
        symbol = item.latex_symbol if name is None else key
        kind, text = item.kind, item.description
    elif isinstance(item, Check | pint.Quantity):
        if name is None:
            raise InputError(
                f"Exporting a {type(item).__name__.lower()} needs a name for it "
                '(e.g. export(check, name="u_b"))',
                name="name",
                value=None,
                expected="a symbol name such as 'R_A' or 'u_b'",
            )
        key = _check_name(name)
        symbol = key
        if isinstance(item, Check):
            q = ureg.Quantity(item.utilisation, "dimensionless")
            kind, text = "check", f"utilisation, {item.name}: {item.verdict}"
        else:
            q = item
            kind, text = "result", ""
    else:
        raise InputError(
            f"A sheet exports values, checks or quantities (got {type(item).__name__})",
            name="item",
            value=item,
            expected="a Given, Derived, Check or pint Quantity",
        )
    from calcpack.working.steps import _check_finite

    _check_finite(f"Export {key}", q)
    return {
        "name": key,
        "case": case,
        "value": float(q.magnitude),
        "unit": format_unit_text(q.units),
        "pint_unit": format(q.units, "D"),
        "kind": kind,
        "description": description if description is not None else text,
        "symbol": symbol,
    }


class Exports(Table):
    """The values a sheet exports, shown as a table; records them under ``"exports"``."""

    def __init__(
        self, entries: Sequence[dict[str, Any]], *, settings: DisplaySettings | None = None
    ) -> None:
        rows = []
        for e in entries:
            q = ureg.Quantity(e["value"], e["pint_unit"])
            label = f"${e['symbol']}$" + (f" ({e['case']})" if e.get("case") else "")
            rows.append([label, q, e.get("description", "")])
        super().__init__(
            ["Exported", "Value", "Description"],
            rows,
            caption="Values this sheet exports to other sheets",
            settings=settings,
        )
        self.entries = [dict(e) for e in entries]

    def records(self) -> dict[str, list[Any]]:
        return {"exports": [dict(e) for e in self.entries]}


class Imported(Given):
    """A given taken from another sheet of the project: not editable here.

    Args:
        name: its symbol on this sheet.
        entry: the exporting sheet's export record (see :func:`export_entry`).
        sheet: the exporting sheet.
        description: words for the checker (default: the exporting sheet's).
        unit: display unit here (default: this sheet's unit for the kind of quantity, else its
            preset's; the value itself is imported at full precision whatever the unit shown).

    Attributes:
        link: the package link target of the exporting sheet (``"#sheet-2"``).
        link_record: the link as the manifest keeps it (from sheet and name, case, value).
    """

    def __init__(
        self,
        name: str,
        entry: dict[str, Any],
        sheet: SheetRef,
        *,
        description: str | None = None,
        unit: str | None = None,
        latex: str | None = None,
        settings: DisplaySettings | None = None,
    ) -> None:
        quantity = ureg.Quantity(entry["value"], entry["pint_unit"])
        if unit is None and settings is not None:
            # shown in this sheet's unit for its kind (or its preset's), never in whatever unit
            # the exporting analysis computed it in: a kN reaction on a US sheet reads in kip
            unit = settings.kind_unit(quantity) or settings.preset.unit_for(quantity)
        case = entry.get("case")
        source = f"sheet {sheet.number}, {entry['name']}" + (f", case {case}" if case else "")
        super().__init__(
            name,
            quantity,
            entry.get("description", "") if description is None else description,
            source=source,
            unit=unit,
            latex=latex,
            settings=settings,
        )
        self.link = sheet.anchor
        self.link_record: dict[str, Any] = {
            "from_sheet": sheet.path,
            "from_name": entry["name"],
            "case": case,
            "to_name": name,
            "value": entry["value"],
            "unit": entry["unit"],
        }
        self._sealed = True

    def __setattr__(self, key: str, value: Any) -> None:
        if getattr(self, "_sealed", False) and key not in _MUTABLE:
            raise InputError(
                f"{self.name} is imported from {self.source}: change it on that sheet, "
                f"not here (tried to set {key})",
                name=self.name,
                value=value,
                expected="the exporting sheet's value",
            )
        object.__setattr__(self, key, value)

    def records(self) -> dict[str, list[Any]]:
        out = super().records()
        out["imports"] = [dict(self.link_record)]
        return out


def _matrix(
    cells: Sequence[tuple[str, str, Any]], corner: str
) -> tuple[list[str], list[list[Any]]]:
    """(row, column, value) triples as table columns and rows, in first-seen order."""
    rows = list(dict.fromkeys(r for r, _, _ in cells))
    cols = list(dict.fromkeys(c for _, c, _ in cells))
    at = {(r, c): v for r, c, v in cells}
    return [corner, *cols], [[r, *(at.get((r, c), "—") for c in cols)] for r in rows]


class ExportsTable(Exports):
    """Many values exported by row and load case (e.g. every member force of a truss, case by
    case), shown as one table: a row per item, a column per case."""

    def __init__(
        self,
        entries: Sequence[dict[str, Any]],
        rows: Sequence[str],
        *,
        name: str,
        settings: DisplaySettings | None = None,
    ) -> None:
        cells = [
            (row, str(e["case"]), ureg.Quantity(e["value"], e["pint_unit"]))
            for row, e in zip(rows, entries, strict=True)
        ]
        columns, body = _matrix(cells, "")
        Table.__init__(
            self,
            columns,
            body,
            caption=f"Values this sheet exports to other sheets: {name}_<row> by load case "
            "(unfactored)",
            settings=settings,
        )
        self.entries = [dict(e) for e in entries]


class ImportedTable(Table):
    """Values taken from another sheet by row and load case, shown as one table; each is an
    :class:`Imported` given (not editable) and each is recorded as a link."""

    def __init__(
        self,
        steps: Sequence[Imported],
        rows: Sequence[str],
        *,
        name: str,
        sheet: SheetRef,
        settings: DisplaySettings | None = None,
    ) -> None:
        cells = [
            (row, str(st.link_record["case"]), st.display_quantity)
            for row, st in zip(rows, steps, strict=True)
        ]
        columns, body = _matrix(cells, "")
        super().__init__(
            columns,
            body,
            caption=f"{name} by load case, imported from sheet {sheet.number} (unfactored)",
            settings=settings,
        )
        self.steps = list(steps)

    def records(self) -> dict[str, list[Any]]:
        out: dict[str, list[Any]] = {}
        for st in self.steps:
            for key, items in st.records().items():
                out.setdefault(key, []).extend(items)
        return out
