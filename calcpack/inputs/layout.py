"""The keys each kind of inputs file may hold, and the one strict reading that refuses the rest.

A key an inputs file does not know (``deflection_ration``, ``[materials]``, ``terrian``) would
otherwise be ignored and its default used without a word, so a sheet would compute something
other than what its engineer wrote. Every reader in :mod:`calcpack.inputs` describes its file
as a :class:`Table` of keys (a nested :class:`Table` for a table, :class:`Tables` for an array
of tables ``[[loads]]``, None for a plain value) and calls :func:`refuse_unknown_keys` before it
reads a value.

Example::

    LAYOUT = Table(
        {"member": Table({"mark": None, "Fy": None}), "forces": Tables(Table({"P": None}))}
    )
    refuse_unknown_keys(data, LAYOUT, path="03_post.inputs.toml")
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from calcpack.inputs.file import InputsFileError
from calcpack.validate import unknown_key

__all__ = ["Layout", "Table", "Tables", "refuse_unknown_keys"]


@dataclass(frozen=True)
class Table:
    """A table of an inputs file: its keys, each a plain value (None) or a nested layout.

    Args:
        keys: key -> None for a value, a :class:`Table` or :class:`Tables` for what it holds.
        free: any key is allowed (names the engineer chooses, such as load cases in
            ``strength = { D = 1.2, L = 1.6 }``); their values are read by the file's reader.
        note: why these keys (``"for standard ASCE 7-16"``), added to the message.
    """

    keys: Mapping[str, Layout | None] = field(default_factory=dict)
    free: bool = False
    note: str = ""


@dataclass(frozen=True)
class Tables:
    """An array of tables (``[[loads]]``), each laid out as ``item``."""

    item: Table


Layout = Table | Tables


def refuse_unknown_keys(
    data: Any, layout: Table, *, path: Path | str | None = None, where: str = ""
) -> None:
    """Refuse the first key anywhere in ``data`` that ``layout`` does not list.

    Values of the wrong kind (a value where a table belongs) are left to the file's reader,
    which names what it expected; only the keys are checked here.

    Args:
        data: the loaded file (or one of its tables), as :func:`calcpack.inputs.load_inputs`
            returns it.
        layout: the keys it may hold.
        path: the inputs file, named in the message.
        where: the dotted key of ``data`` within the file (``""`` for the whole file).

    Raises:
        InputsFileError: naming the file, the key path (``"snow.terrian"``, ``"loads[2].pos"``),
            the keys valid there and, when one is close, "did you mean ...".
    """
    if not isinstance(data, Mapping) or layout.free:
        return
    found = unknown_key(data, layout.keys)
    if found is not None:
        key, close = found
        name = f"{where}.{key}" if where else key
        valid = ", ".join(layout.keys)
        place = f" in [{where}]" if where else " at the top of the file"
        note = f" {layout.note}" if layout.note else ""
        hint = f"; did you mean {close!r}?" if close else ""
        file = f"{Path(path).name}: " if path is not None else ""
        raise InputsFileError(
            f"{file}{name} is not a known key{place} (valid{note}: {valid}){hint}",
            name=name,
            value=data[key],
            expected="one of " + valid,
        )
    for key, inner in layout.keys.items():
        if inner is None or key not in data:
            continue
        at = f"{where}.{key}" if where else key
        if isinstance(inner, Table):
            refuse_unknown_keys(data[key], inner, path=path, where=at)
        elif isinstance(data[key], list):
            for i, item in enumerate(data[key], start=1):
                refuse_unknown_keys(item, inner.item, path=path, where=f"{at}[{i}]")
