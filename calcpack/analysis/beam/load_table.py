"""The loads on a beam or a truss as a table that records each one as an input of the sheet.

Every load's magnitude and position, by load case, is shown in the sheet's units and
significant figures and recorded in the manifest (``kind = "given"``), so a revision comparison
lists a changed load as a changed input -- not only the results it moved. Imported lazily by the
beam and combination working (it builds :mod:`calcpack.working` steps).
"""

from __future__ import annotations

import dataclasses
from collections.abc import Iterable
from typing import Any

from calcpack.units import DisplaySettings, Quantity, get_display, is_quantity, ureg

__all__ = ["load_records", "load_table"]

_PRESSURE = ureg.Unit("Pa").dimensionality
_POSITIONS = ("x", "start", "end")
"""Fields of a load that say where it acts; the others say how much."""
_NOT_RECORDED = ("case", "label", "rtol", "description", "func", "node")


def _fields(load: Any) -> list[tuple[str, Quantity]]:
    """(field name, quantity) of every quantity of ``load``, a tuple of them numbered."""
    out: list[tuple[str, Quantity]] = []
    for f in dataclasses.fields(load):
        if f.name in _NOT_RECORDED:
            continue
        value = getattr(load, f.name)
        if is_quantity(value):
            out.append((f.name, value))
        elif isinstance(value, tuple) and value and all(is_quantity(v) for v in value):
            out += [(f"{f.name}[{k}]", v) for k, v in enumerate(value)]
    return out


def _shown(q: Quantity, settings: DisplaySettings) -> Quantity:
    """``q`` in the sheet's unit; a pressure on a beam or truss is a load per area, shown as an
    area load (psf, kPa), never in the stress unit of its dimension."""
    family = "area load" if q.dimensionality == _PRESSURE else None
    unit = settings.unit_for(q, family=family)
    return q.to(unit) if unit is not None else q


def _resolved(load: Any, length: Quantity | None) -> Any:
    if length is None:
        return load
    try:
        return load.resolved(length)
    except Exception:  # a load already checked against the beam; keep it as given
        return load


def _numbered(loads: Iterable[Any]) -> list[tuple[int, Any]]:
    return list(enumerate(loads, start=1))


def load_records(
    loads: Iterable[Any], *, member: str, length: Quantity | None, settings: DisplaySettings
) -> tuple[list[list[Any]], list[Any]]:
    """(table rows, records) of ``loads``: one row per load (number, case, kind, how much,
    where), one record per quantity, named ``"<member> load <n> (<case>): <field>"`` (with
    ``" at <node>"`` after the case for a joint load)."""
    from calcpack.contract.records import Record
    from calcpack.working.format import format_quantity_text, format_unit_text

    rows: list[list[Any]] = []
    records: list[Any] = []
    for n, raw in _numbered(loads):
        load = _resolved(raw, length)
        how: list[str] = []
        node = getattr(load, "node", None)
        where: list[str] = [f"joint {node}"] if node is not None else []
        at = f" at {node}" if node is not None else ""
        for name, q in _fields(load):
            shown = _shown(q, settings)
            text = f"{name} = {format_quantity_text(shown, settings.sig_figs)}"
            (where if name in _POSITIONS else how).append(text)
            records.append(
                Record(
                    name=f"{member} load {n} ({load.case}){at}: {name}",
                    symbol=name,
                    value=float(shown.magnitude),
                    unit=format_unit_text(shown.units),
                    description=f"{type(load).__name__} on {member}, case {load.case}",
                    kind="given",
                    sig=settings.sig_figs,
                )
            )
        if getattr(load, "description", None) and not how:
            how.append(str(load.description))
        label = getattr(load, "label", None)
        kind = type(load).__name__ + (f" ({label})" if label else "")
        rows.append([str(n), load.case, kind, ", ".join(how), ", ".join(where)])
    return rows, records


def load_table(
    loads: Iterable[Any],
    *,
    member: str,
    length: Quantity | None = None,
    settings: DisplaySettings | None = None,
    caption: str | None = None,
) -> Any:
    """A :class:`~calcpack.working.Table` of ``loads`` (unfactored, by case) that records each
    magnitude and position as an input of the sheet."""
    from calcpack.working import Table

    settings = settings or get_display()
    rows, records = load_records(loads, member=member, length=length, settings=settings)
    return Table(
        ["load", "case", "type", "magnitude", "position"],
        rows,
        caption=caption or f"{member}: loads by case (unfactored)",
        settings=settings,
        values=records,
    )
