"""A sheet's inputs file: a small TOML file beside the notebook holding the values it starts from.

Quantities are written as strings with their unit, e.g. ``span = "3.2 m"`` or
``w = "8.5 kN/m"``; bare numbers are dimensionless (load factors, ratios); other strings
(``"pin"``, ``"B1"``) stay text, and so do nominal lumber sizes (``"2x10"``, ``"6x6"``) and
glulam stress classes (``"24F-1.8E"``). Any other string that starts with a number must carry
a unit that pint knows, so ``"3.2"`` (a number written as text, unit forgotten) is refused
rather than guessed.

:func:`load_inputs` reads a file and returns plain dicts and lists with quantities in place of the
unit strings; :func:`update_inputs` changes some values in place, keeping the file's comments and
layout (through tomlkit), so a file edited by hand and then by a panel still reads as written.

Pure: no Jupyter, no widgets. Both the input panels and the sheets' calc cells use this module,
so a build executes exactly the values the panel last showed.
"""

from __future__ import annotations

import contextlib
import math
import re
import tomllib
from collections.abc import Iterator, Mapping, Sequence
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path
from typing import Any

import pint

from calcpack.errors import DimensionError, InputError
from calcpack.fileio import write_atomically
from calcpack.units import Q_, Quantity, is_quantity, ureg

__all__ = [
    "InputsFileError",
    "Spec",
    "cached_unit",
    "format_quantity",
    "get_path",
    "load_inputs",
    "parse_quantity",
    "read_inputs_text",
    "require_input",
    "split_key",
    "update_inputs",
    "write_inputs",
]

_NUMBER_START = re.compile(r"^\s*[-+]?(\d|\.\d)")
# the trade's designations that start with a number, never quantities: a nominal lumber size
# ("2x10", "6x6", "4 x 12") and a glulam stress class ("24F-1.8E", "20F-1.5E", "24F-V4")
_DESIGNATION = re.compile(r"^\s*(\d+\s*[x×]\s*\d+|\d+F-[0-9.]+E|\d+F-V\d+)\s*$")


class InputsFileError(InputError):
    """The inputs file is missing, is not valid TOML, or a value in it is malformed.

    ``name`` is the dotted key (``"beam.spans[2]"``), ``value`` what was found, ``expected``
    what would be valid; the message also names the file.
    """


def _where(path: Path | str | None) -> str:
    return f"{Path(path).name}: " if path is not None else ""


@lru_cache(maxsize=256)
def cached_unit(text: str) -> pint.Unit:
    """The unit ``text`` (``"kN*m"``), parsed once.

    pint caches the parse of a single unit name but not of a compound one, and parsing costs
    more than the conversion it serves; the panels convert on every edit.
    """
    return ureg.Unit(text)


@lru_cache(maxsize=1024)
def _parse_once(text: str) -> tuple[Any, pint.Unit] | None:
    """Magnitude and unit of ``"3.2 m"``, or None when it is not a quantity with a unit.

    Inputs files hold few distinct strings and are read on every edit and every run of a sheet:
    each string goes through pint's parser once. (Parse errors are not cached: they raise.)
    """
    q = Q_(text)
    if not is_quantity(q) or (q.dimensionless and not str(q.units)):
        return None
    return q.magnitude, q.units


def parse_quantity(text: str, key: str, *, path: Path | str | None = None) -> Quantity:
    """Parse ``"3.2 m"`` into a quantity; ``key`` names the value in messages.

    Raises:
        InputsFileError: no unit given, or a unit pint does not know.
    """
    try:
        parsed = _parse_once(text)
    except Exception as exc:  # pint raises several unrelated types for bad units
        raise InputsFileError(
            f"{_where(path)}value {key} = {text!r} is not a number with a known unit "
            f'({type(exc).__name__}: {exc}); write e.g. "3.2 m" or "8.5 kN/m"',
            name=key,
            value=text,
            expected='a number and a unit, e.g. "3.2 m"',
        ) from None
    if parsed is None:
        raise InputsFileError(
            f"{_where(path)}value {key} = {text!r} has no unit; write the unit (e.g. "
            f'"{text.strip()} m"), or a bare number without quotes for a dimensionless value',
            name=key,
            value=text,
            expected='a number and a unit, e.g. "3.2 m"',
        )
    magnitude, unit = parsed
    if not math.isfinite(float(magnitude)):
        raise InputsFileError(
            f"{_where(path)}value {key} = {text!r} must be finite",
            name=key,
            value=text,
            expected="a finite value",
        )
    return Q_(magnitude, unit)  # a new quantity each time: callers may keep or change it


def _convert(value: Any, key: str, path: Path | str | None) -> Any:
    if isinstance(value, str):
        if _NUMBER_START.match(value) and not _DESIGNATION.match(value):
            return parse_quantity(value, key, path=path)
        return value
    if isinstance(value, Mapping):
        return {
            str(k): _convert(v, f"{key}.{k}" if key else str(k), path) for k, v in value.items()
        }
    if isinstance(value, list):
        return [_convert(v, f"{key}[{i}]", path) for i, v in enumerate(value, start=1)]
    if isinstance(value, float) and not math.isfinite(value):
        raise InputsFileError(
            f"{_where(path)}value {key} = {value} must be finite",
            name=key,
            value=value,
            expected="a finite number",
        )
    return value


def read_inputs_text(
    text: str, *, path: Path | str | None = None, tables: Sequence[str] | None = None
) -> dict[str, Any]:
    """Parse the TOML ``text`` of an inputs file (see :func:`load_inputs`)."""
    raw = _toml(text, path)
    if tables is not None:
        missing = [t for t in tables if t not in raw]
        if missing:
            raise InputsFileError(
                f"{_where(path)}table [{missing[0]}] is missing (tables: {sorted(raw)})",
                name=missing[0],
                value=None,
                expected=f"a [{missing[0]}] table",
            )
        raw = {t: raw[t] for t in tables}
    out: dict[str, Any] = _convert(raw, "", path)
    return out


def _toml(text: str, path: Path | str | None) -> dict[str, Any]:
    try:
        return tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise InputsFileError(
            f"{_where(path)}not valid TOML ({exc})",
            name=str(path) if path is not None else "inputs",
            value=None,
            expected="a TOML file of key = value lines",
        ) from None


def load_inputs(path: Path | str, *, tables: Sequence[str] | None = None) -> dict[str, Any]:
    """Read an inputs file.

    Args:
        path: the TOML file (usually ``<sheet>.inputs.toml`` beside the notebook).
        tables: read only these top-level tables (a file several sheets share, of which a
            panel edits one or two tables); None reads everything.

    Returns:
        Tables as dicts, arrays as lists, unit strings as pint quantities, other values as
        given.

    Raises:
        InputsFileError: the file is missing or not TOML, or a value starting with a number has
            no unit or an unknown one; the message names the file and the key.
    """
    p = Path(path)
    return read_inputs_text(_read_text(p), path=p, tables=tables)


def _read_text(p: Path) -> str:
    try:
        return p.read_text(encoding="utf-8")
    except FileNotFoundError:
        raise InputsFileError(
            f"Inputs file {str(p)!r} does not exist (looked in {str(p.resolve().parent)!r}); "
            "create it with `calcpack add-sheet` or copy a template",
            name=str(p),
            value=None,
            expected="an existing TOML file",
        ) from None


_KEY_PART = re.compile(r"([^.\[\]]+)|\[(\d+)\]")


def split_key(key: str) -> list[str | int]:
    """``"beam.spans[2]"`` -> ``["beam", "spans", 1]`` (list indices are 1-based in keys)."""
    parts: list[str | int] = []
    for m in _KEY_PART.finditer(key):
        if m.group(1) is not None:
            parts.append(m.group(1))
        else:
            parts.append(int(m.group(2)) - 1)
    return parts


def get_path(data: Mapping[str, Any], key: str) -> Any:
    """The value at dotted ``key`` (``"beam.spans[2]"``, 1-based) or raise naming the key."""
    node: Any = data
    for part in split_key(key):
        try:
            node = node[part]
        except (KeyError, IndexError, TypeError):
            raise InputsFileError(
                f"Inputs have no value {key} (looked for {part!r})",
                name=key,
                value=None,
                expected="a key present in the inputs file",
            ) from None
    return node


@dataclass(frozen=True)
class Spec:
    """What a value in the inputs file must be.

    Args:
        dimension: a pint dimension (``"[length]"``) or unit (``"kN/m"``) for a quantity;
            ``"number"`` for a bare number; ``"text"`` for a string.
        positive, nonnegative: sign rules for numbers and quantities.
        choices: allowed strings for ``"text"``.
    """

    dimension: str
    positive: bool = False
    nonnegative: bool = False
    choices: tuple[str, ...] = ()


def require_input(value: Any, spec: Spec | str, key: str, *, path: Path | str | None = None) -> Any:
    """Check one value read from an inputs file against ``spec``; returns it.

    Raises:
        InputsFileError / DimensionError: the message names ``key`` and, when given, the file.
    """
    s = Spec(spec) if isinstance(spec, str) else spec
    where = _where(path)
    if s.dimension == "text":
        if not isinstance(value, str):
            raise InputsFileError(
                f"{where}value {key} must be text (got {value!r})",
                name=key,
                value=value,
                expected="a quoted string",
            )
        if s.choices and value not in s.choices:
            raise InputsFileError(
                f"{where}value {key} must be one of {', '.join(s.choices)} (got {value!r})",
                name=key,
                value=value,
                expected=" or ".join(s.choices),
            )
        return value
    if s.dimension == "number":
        if isinstance(value, bool) or not isinstance(value, int | float):
            raise InputsFileError(
                f"{where}value {key} must be a bare number (got {value!r})",
                name=key,
                value=value,
                expected="a number without quotes",
            )
        mag = float(value)
    else:
        from calcpack.units import require

        try:
            require(value, s.dimension, key)
        except DimensionError as exc:
            if is_quantity(value):
                got = f"{value:~P}"
                hint = ""
            else:
                got = repr(value)
                hint = ' (write the value with its unit in quotes, e.g. "3.2 m")'
            raise DimensionError(
                f"{where}value {key} must have units of {s.dimension} (got {got}){hint}",
                name=key,
                value=value,
                expected=exc.expected,
            ) from None
        mag = float(value.magnitude)
    if s.positive and not mag > 0:
        raise InputsFileError(
            f"{where}value {key} must be positive (got {key} = {_show(value)})",
            name=key,
            value=value,
            expected="a value > 0",
        )
    if s.nonnegative and not mag >= 0:
        raise InputsFileError(
            f"{where}value {key} must not be negative (got {key} = {_show(value)})",
            name=key,
            value=value,
            expected="a value >= 0",
        )
    return value


def _show(value: Any) -> str:
    return f"{value:~P}" if is_quantity(value) else repr(value)


# -- writing -------------------------------------------------------------------------------
def format_quantity(q: Quantity) -> str:
    """A quantity as the inputs file writes it: shortest exact magnitude, compact unit
    (``"3.2 m"``, ``"8.5 kN/m"``, ``"11 GPa"``)."""
    mag = float(q.magnitude)
    text = repr(mag)
    if text.endswith(".0"):
        text = text[:-2]
    unit = f"{q.units:~C}"
    return f"{text} {unit}" if unit else text


def _to_toml(value: Any) -> Any:
    if is_quantity(value):
        return format_quantity(value)
    if isinstance(value, Mapping):
        return {str(k): _to_toml(v) for k, v in value.items()}
    if isinstance(value, list | tuple):
        return [_to_toml(v) for v in value]
    return value


def _atomic_write(path: Path, text: str) -> None:
    # A reader (a kernel running the sheet) never sees a half-written file.
    write_atomically(path, text)


def write_inputs(path: Path | str, data: Mapping[str, Any], *, header: str = "") -> None:
    """Write a whole inputs file from ``data`` (quantities become unit strings).

    Args:
        path: the file to create or replace.
        data: tables (dicts), arrays (lists), quantities, numbers and text.
        header: comment lines put at the top (without the ``#``).
    """
    import tomlkit

    doc = tomlkit.document()
    for line in header.splitlines():
        doc.add(tomlkit.comment(line) if line.strip() else tomlkit.nl())
    if header:
        doc.add(tomlkit.nl())
    for k, v in _to_toml(data).items():
        doc[k] = v
    _atomic_write(Path(path), tomlkit.dumps(doc))


def _walk_set(doc: Any, parts: Sequence[str | int], value: Any, key: str) -> None:
    node = doc
    for part in parts[:-1]:
        try:
            node = node[part]
        except (KeyError, IndexError, TypeError):
            raise InputsFileError(
                f"Cannot set {key}: the inputs file has no {part!r} there",
                name=key,
                value=value,
                expected="a key that exists in the file",
            ) from None
    last = parts[-1]
    if isinstance(last, int) and last == len(node) and value is not None:
        node.append(value)  # one past the end appends (e.g. a new [[loads]] table)
        return
    if isinstance(last, int) and not 0 <= last < len(node):
        raise InputsFileError(
            f"Cannot set {key}: index {last + 1} is past the end (the list has {len(node)})",
            name=key,
            value=value,
            expected=f"an index from 1 to {len(node)}",
        )
    if value is None:  # TOML has no null: None removes the key
        with contextlib.suppress(KeyError, IndexError):
            del node[last]
        return
    node[last] = value


def update_inputs(
    path: Path | str, changes: Mapping[str, Any], *, tables: Sequence[str] | None = None
) -> dict[str, Any]:
    """Change values in an inputs file, keeping its comments, order and layout.

    Args:
        path: an existing inputs file.
        changes: dotted key (``"beam.spans[2]"``, list indices 1-based) to new value; a value
            may be a whole table or list (``"loads"`` -> list of dicts) to replace it, or None
            to remove the key; a list index one past the end appends.
        tables: as for :func:`load_inputs` (the changes must lie in these tables).

    Returns:
        The file as :func:`load_inputs` reads it after the change.

    Raises:
        InputsFileError: the file is missing or malformed, or a key's parent does not exist.
    """
    import tomlkit

    p = Path(path)
    text = _read_text(p)
    _toml(text, p)  # refuse a file that is not TOML (with the message load_inputs gives)
    doc = tomlkit.parse(text)
    for key, value in changes.items():
        if tables is not None and split_key(key)[0] not in tables:
            raise InputsFileError(
                f"Cannot set {key}: only the tables {list(tables)} are edited here",
                name=key,
                value=value,
                expected=f"a key in {list(tables)}",
            )
        _walk_set(doc, split_key(key), _to_toml(value), key)
    text = tomlkit.dumps(doc)
    result = read_inputs_text(text, path=p, tables=tables)  # never write what we cannot read
    _atomic_write(p, text)
    return result


def iter_quantities(data: Any, key: str = "") -> Iterator[tuple[str, Quantity]]:
    """Every quantity in loaded inputs with its dotted key, in file order."""
    if is_quantity(data):
        yield key, data
    elif isinstance(data, Mapping):
        for k, v in data.items():
            yield from iter_quantities(v, f"{key}.{k}" if key else str(k))
    elif isinstance(data, list):
        for i, v in enumerate(data, start=1):
            yield from iter_quantities(v, f"{key}[{i}]")
