"""Reference data shipped with calcpack: shape tables, grade tables, coefficients.

Each table is a CSV file in this folder whose first lines are ``#`` comments naming the source
(publisher, document, table, edition) -- every row is traceable to it. Tables are read lazily,
once, on first use::

    table = read_table("aisc_shapes_v15.csv", key="designation")
    table.source          # the header comment lines
    row = table.row("W18X50")     # {"designation": "W18X50", "A": 14.7, ...}; did-you-mean on typo

Cells that parse as numbers become floats; empty cells become None; others stay strings. Units
are stated in the header (``# units: A in^2, Ix in^4``) and applied by the module that reads the
table, which returns pint quantities: a table row never leaves its module as bare floats.
"""

from __future__ import annotations

import csv
import io
from dataclasses import dataclass
from functools import cache
from importlib import resources
from types import MappingProxyType
from typing import Any

from calcpack.errors import InputError
from calcpack.validate import lookup

__all__ = ["Table", "parse_table", "read_table"]


@dataclass(frozen=True)
class Table:
    """A reference table: its rows by key and the source lines from its header."""

    name: str
    key: str
    source: tuple[str, ...]
    rows: MappingProxyType[str, MappingProxyType[str, Any]]

    def row(self, key: str, *, what: str | None = None) -> MappingProxyType[str, Any]:
        """The row for ``key``; an InputError with "did you mean ..." when it is not there."""
        return lookup(self.key, key, self.rows, what=what or f"entry of {self.name}")

    def keys(self) -> list[str]:
        return list(self.rows)

    @property
    def citation(self) -> str:
        """The header's ``source:`` line (or the first header line)."""
        for line in self.source:
            if line.lower().startswith("source:"):
                return line.split(":", 1)[1].strip()
        return self.source[0] if self.source else self.name


def _cell(text: str) -> Any:
    t = text.strip()
    if t == "":
        return None
    try:
        return float(t)
    except ValueError:
        return t


@cache
def read_table(filename: str, key: str, package: str = "calcpack.refdata") -> Table:
    """Read ``filename`` (CSV with ``#`` header lines) from ``package``, keyed by column ``key``.

    Raises:
        InputError: the key column is missing or a key is repeated.
    """
    text = resources.files(package).joinpath(filename).read_text(encoding="utf-8")
    return parse_table(text, filename, key)


def parse_table(text: str, filename: str, key: str) -> Table:
    """A table from CSV text in the same format (``#`` header lines, then the CSV), e.g. a
    project's own copy of a shipped table.

    Raises:
        InputError: the key column is missing or a key is repeated.
    """
    header: list[str] = []
    body: list[str] = []
    for line in text.splitlines():
        if not body and line.startswith("#"):
            header.append(line[1:].strip())
        elif line.strip():
            body.append(line)
    reader = csv.DictReader(io.StringIO("\n".join(body)))
    if reader.fieldnames is None or key not in reader.fieldnames:
        raise InputError(
            f"Reference table {filename} has no column {key!r} (columns: {reader.fieldnames})",
            name="key",
            value=key,
            expected="a column of the table",
        )
    rows: dict[str, MappingProxyType[str, Any]] = {}
    for raw in reader:
        k = raw[key].strip()
        if k in rows:
            raise InputError(
                f"Reference table {filename} repeats the key {k!r}",
                name=key,
                value=k,
                expected="unique keys",
            )
        rows[k] = MappingProxyType(
            {c: (raw[c].strip() if c == key else _cell(raw[c] or "")) for c in reader.fieldnames}
        )
    return Table(filename, key, tuple(header), MappingProxyType(rows))
