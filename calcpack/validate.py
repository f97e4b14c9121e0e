"""Shared input validators: one place for the checks every calc cell makes at its boundary.

Each validator returns the value it was given (so it can be used inline) or raises an
:class:`~calcpack.errors.InputError` (or :class:`~calcpack.errors.DimensionError`) whose message
names the input, the value given and what would be valid. Use these instead of writing
``raise InputError(...)`` by hand.

Example::

    L = dimension("L", L, "[length]")
    positive("L", L)
    method = one_of("method", method, ("LRFD", "ASD"))
    shape = lookup("designation", "W18X50", table)   # "did you mean ..." on a typo
    Lb = required("Lb", Lb, expected="a length", when="with Mu")
    source = non_empty("source", source, expected="'NDS Supplement 2018 Table 4A'")
"""

from __future__ import annotations

import difflib
import math
from collections.abc import Iterable, Mapping
from typing import Any, TypeVar

import pint

from calcpack.errors import InputError, show_value
from calcpack.units import require

__all__ = [
    "dimension",
    "finite",
    "lookup",
    "one_of",
    "positive",
    "positive_fields",
    "suggest",
    "unknown_key",
    "within",
]

T = TypeVar("T")
K = TypeVar("K")


_show = show_value


def _magnitude(name: str, value: Any) -> float:
    raw = value.magnitude if isinstance(value, pint.Quantity) else value
    try:
        return float(raw)
    except (TypeError, ValueError):
        raise InputError(
            name=name, value=value, rule="must be a number", expected="a number"
        ) from None


def dimension(name: str, value: Any, dim: str) -> pint.Quantity:
    """Require a finite quantity of dimension ``dim`` (``"[length]"`` or a unit like ``"kN/m"``)."""
    return require(value, dim, name)


def finite(name: str, value: T) -> T:
    """Require a finite number or quantity (not NaN, not infinite)."""
    if not math.isfinite(_magnitude(name, value)):
        raise InputError(
            name=name, value=value, rule="must be a finite number", expected="a finite value"
        )
    return value


def positive(name: str, value: T, *, allow_zero: bool = False, note: str | None = None) -> T:
    """Require a finite value > 0 (or >= 0 with ``allow_zero``); ``note`` (what the value
    belongs to, or the clause) is added to the message."""
    finite(name, value)
    x = _magnitude(name, value)
    ok = x >= 0 if allow_zero else x > 0
    if not ok:
        rule = "must not be negative" if allow_zero else "must be positive"
        raise InputError(
            name=name,
            value=value,
            rule=rule,
            expected="a value >= 0" if allow_zero else "a value > 0",
            note=note,
        )
    return value


def within(
    name: str,
    value: T,
    lo: Any = None,
    hi: Any = None,
    *,
    rule: str | None = None,
    inclusive: bool = True,
) -> T:
    """Require ``lo <= value <= hi`` (either bound may be None; quantities compare with units).

    Args:
        rule: the source of the limits, e.g. ``"AISC 360-16 §E3 covers Fy <= 70 ksi"``; it is
            added to the message.
        inclusive: bounds allowed (default) or excluded.
    """
    finite(name, value)
    low_ok = lo is None or (value >= lo if inclusive else value > lo)
    high_ok = hi is None or (value <= hi if inclusive else value < hi)
    if low_ok and high_ok:
        return value
    lo_s = "" if lo is None else _show(lo)
    hi_s = "" if hi is None else _show(hi)
    if lo is not None and hi is not None:
        span = f"from {lo_s} to {hi_s}" if inclusive else f"strictly between {lo_s} and {hi_s}"
    elif lo is not None:
        span = f"at least {lo_s}" if inclusive else f"more than {lo_s}"
    else:
        span = f"at most {hi_s}" if inclusive else f"less than {hi_s}"
    raise InputError(name=name, value=value, rule=f"must be {span}", expected=span, note=rule)


def required(name: str, value: T | None, *, expected: str, when: str | None = None) -> T:
    """Require an input that may be left out elsewhere but is needed here (not None).

    Args:
        expected: what to give, in words (``"a length"``, ``"the bolt spacing"``).
        when: what needs it, as it follows "is required" (``"with Mu"``, ``"for a roof
            step"``).
    """
    if value is None:
        raise InputError(
            name=name,
            value=None,
            rule="is required" + (f" {when}" if when else ""),
            expected=expected,
            note=f"give {expected}",
        )
    return value


def non_empty(name: str, value: Any, *, expected: str) -> str:
    """Require a text that says something (a source, a case name, a reason): a string that is
    not blank. Returns it stripped.

    Args:
        expected: an example or description of a good value (``"e.g. 'ASCE 7-16 Figure
            7.2-1'"``).
    """
    if not isinstance(value, str) or not value.strip():
        raise InputError(
            name=name,
            value=value,
            rule="must be stated (a text that is not blank)",
            expected=expected,
            note=expected,
        )
    return value.strip()


def instance(name: str, value: Any, kinds: type | tuple[type, ...], *, expected: str) -> Any:
    """Require ``value`` to be of one of the types ``kinds``; ``expected`` names them for the
    user (``"a FootingLoad"``, ``"aisc_shape('W8X18') or similar"``). True and False are not
    numbers here unless ``bool`` is among the kinds."""
    allowed = kinds if isinstance(kinds, tuple) else (kinds,)
    if not isinstance(value, allowed) or (isinstance(value, bool) and bool not in allowed):
        raise InputError(
            name=name,
            value=value,
            rule=f"must be {expected}",
            expected=expected,
            note=f"got a {type(value).__name__}",
        )
    return value


def whole(name: str, value: Any, lo: int | None = None, hi: int | None = None) -> int:
    """Require a whole number (an int, not a bool), optionally lo <= value <= hi."""
    if isinstance(value, bool) or not isinstance(value, int):
        span = "" if lo is None else f" of at least {lo}"
        raise InputError(
            name=name,
            value=value,
            rule=f"must be a whole number{span}",
            expected=f"a whole number{span}",
        )
    within(name, value, lo, hi)
    return value


def suggest(key: str, options: Iterable[str]) -> list[str]:
    """Close matches of ``key`` among ``options`` (case- and space-insensitive), best first."""
    opts = list(options)
    norm = {o.upper().replace(" ", ""): o for o in opts}
    hits = difflib.get_close_matches(key.upper().replace(" ", ""), list(norm), n=3, cutoff=0.5)
    return [norm[h] for h in hits]


def unknown_key(table: Mapping[Any, Any], keys: Iterable[str]) -> tuple[str, str | None] | None:
    """The first key of ``table`` that is not in ``keys``, with the closest valid key (or None),
    or None when every key is known.

    The one rule behind every strict file reader (the project file, the inputs files): a
    misspelt key would otherwise be ignored and its default used without a word.
    """
    valid = list(keys)
    for key in table:
        if key not in valid:
            close = suggest(str(key), valid)
            return str(key), (close[0] if close else None)
    return None


def one_of(name: str, value: T, options: Iterable[T]) -> T:
    """Require ``value`` to be one of ``options`` (the message lists them, with a suggestion)."""
    opts = list(options)
    if value in opts:
        return value
    hint = None
    if isinstance(value, str):
        close = suggest(value, [str(o) for o in opts])
        if close:
            hint = f"did you mean {close[0]!r}?"
    listed = ", ".join(repr(o) for o in opts)
    raise InputError(
        name=name,
        value=value,
        rule=f"must be one of {listed}",
        expected=f"one of {listed}",
        note=hint,
    )


def lookup(name: str, key: str, table: Mapping[str, T], *, what: str = "entry") -> T:
    """Find ``key`` in ``table`` (exact, then case- and space-insensitive), or raise with
    "did you mean ..." naming the closest keys.

    Args:
        name: the input's name (``"designation"``, ``"grade"``).
        what: what the table holds, for the message (``"AISC W-shape"``).
    """
    if key in table:
        return table[key]
    norm = {k.upper().replace(" ", ""): k for k in table}
    k = norm.get(str(key).upper().replace(" ", ""))
    if k is not None:
        return table[k]
    close = suggest(str(key), table)
    hint = f"; did you mean {', '.join(repr(c) for c in close)}?" if close else ""
    raise InputError(
        f"Unknown {what} {key!r} for input {name} ({len(table)} known){hint}",
        name=name,
        value=key,
        expected=f"a known {what}",
    )


def positive_fields(owner: Any, dim: str, names: Iterable[str], *, optional: bool = False) -> None:
    """Require each field ``names`` of ``owner`` (a dataclass at construction) to be a positive
    quantity of dimension ``dim``; ``optional``: a field left as None is skipped. The error
    names the field."""
    for name in names:
        value = getattr(owner, name)
        if value is None and optional:
            continue
        require(value, dim, name, positive=True)


# -- Names, collections and distinct values (the models of analysis, combinations, loads) -----


def _listed(keys: Iterable[Any]) -> str:
    return ", ".join(str(k) for k in keys) or "none"


def find(name: str, key: K, table: Mapping[K, T], *, what: str, where: str = "") -> T:
    """The entry of ``table`` called exactly ``key`` (a node, a member, a support, a load case,
    a combination), or an :class:`InputError` listing the names there are.

    Unlike :func:`lookup` (designations in a reference table, read case- and space-blind),
    names given by the engineer are matched exactly: node "a" is not node "A".

    Args:
        name: the input's name (``"member"``, ``"support"``, ``"factors"``).
        what: what the table holds, singular (``"member"``, ``"load case with results"``).
        where: where the names live, as it follows the noun (``"in truss T1"``, ``"on beam B1"``).
    """
    try:
        return table[key]
    except KeyError:
        pass
    place = f" {where}" if where else ""
    known = _listed(table)
    close = suggest(key, [str(k) for k in table]) if isinstance(key, str) else []
    hint = f"; did you mean {close[0]!r}?" if close else ""
    raise InputError(
        name=name,
        value=key,
        rule=f"must name a {what}{place} ({what}s: {known})",
        expected=f"one of {known}",
        note=f"there is no {what} {key!r}{place}{hint}",
    ) from None


def at_least(name: str, items: Any, count: int = 1, *, what: str) -> Any:
    """Require a collection holding ``count`` or more items (``what``: what one item is, e.g.
    ``"load factor"``, ``"node"``). Returns the collection."""
    if len(items) < count:
        many = "one" if count == 1 else str(count)
        plural = "" if count == 1 else "s"
        raise InputError(
            name=name,
            value=items,
            rule=f"needs at least {many} {what}{plural}",
            expected=f"{many} or more {what}{plural}",
        )
    return items


def each_instance(
    name: str, items: Iterable[Any], kinds: type | tuple[type, ...], *, expected: str
) -> None:
    """:func:`instance` for every item of a collection; the error names the item by its index
    (``"supports[2]"``)."""
    for i, item in enumerate(items):
        instance(f"{name}[{i}]", item, kinds, expected=expected)


def distinct(name: str, values: Iterable[Any], *, what: str) -> None:
    """Require no value to stand twice (``what``: what the values are, e.g. ``"support
    name"``); the error names the first repeated one."""
    seen: set[Any] = set()
    for value in values:
        if value in seen:
            raise InputError(
                name=name,
                value=value,
                rule=f"must not repeat a {what}",
                expected=f"a different {what} for each",
                note=f"{what} {show_value(value)} is used twice",
            )
        seen.add(value)
