"""What the member tables of an inputs file share when a panel sizes them: the outcome of one
section's checks, and errors of the checks turned into errors at an inputs-file key."""

from __future__ import annotations

from collections.abc import Iterator, Mapping, Sequence
from contextlib import contextmanager
from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError, OutOfScopeError
from calcpack.inputs.file import InputsFileError
from calcpack.sizing.search import Candidate, SearchSpace
from calcpack.units import Quantity

__all__ = ["SizedOutcome", "as_inputs_error", "force_tables", "governing_check"]


def governing_check(checks: Sequence[Any]) -> tuple[float, str, str, str]:
    """(utilisation, check, clause, combination) of the largest utilisation of ``checks``
    (:class:`calcpack.checks.MemberChecks`); (-1.0, "", "", "") when none has one."""
    best = (-1.0, "", "", "")
    for mc in checks:
        for r in mc.results:
            if r.utilisation is not None and r.utilisation > best[0]:
                best = (float(r.utilisation), r.name, r.clause, r.combination or "")
    return best


@dataclass(frozen=True)
class SizedOutcome:
    """The checks of the section in the inputs file, made with the search's own trial.

    Attributes:
        section: the section's name. checks: every :class:`calcpack.checks.MemberChecks`.
        weight: the section's weight per length [force/length].
    """

    section: str
    checks: tuple[Any, ...]
    weight: Quantity

    @property
    def passed(self) -> bool:
        return all(mc.passed for mc in self.checks)

    @property
    def governing(self) -> tuple[float, str, str, str]:
        """(utilisation, check, clause, combination) of the largest utilisation."""
        return governing_check(self.checks)

    @classmethod
    def of(cls, space: SearchSpace[Any], candidate: Candidate[Any] | None = None) -> SizedOutcome:
        """The checks of ``candidate`` (default: the space's first, the section of a space of
        one) by the space's own trial, so the panel shows what the ranking gave it."""
        cand = candidate if candidate is not None else space.candidates[0]
        return cls(cand.name, tuple(space.check(cand.item)), cand.weight)


def force_tables(
    rows: Any, *, path: Any, missing: str, expected: str
) -> list[tuple[str, Mapping[str, Any]]]:
    """(key, table) of each ``[[forces]]`` table of an inputs file, keyed ``forces[i]`` from 1.

    Raises:
        InputsFileError: no tables (``missing`` says what else could have given the forces,
            ``expected`` how many), or an entry that is not a table."""
    if not isinstance(rows, list) or not rows:
        raise InputsFileError(
            f"{path or 'inputs'}: no [[forces]] tables{missing}",
            name="forces",
            value=rows,
            expected=expected,
        )
    out = []
    for i, row in enumerate(rows, start=1):
        key = f"forces[{i}]"
        if not isinstance(row, Mapping):
            raise InputsFileError(
                f"{key} must be a table", name=key, value=row, expected="a [[forces]] table"
            )
        out.append((key, row))
    return out


@contextmanager
def as_inputs_error(key: str, value: Any = None) -> Iterator[None]:
    """Re-raise an :class:`InputError` of a check or table look-up, or a refusal
    (:class:`OutOfScopeError`) of the section named by ``key``, as an error at ``key`` of the
    inputs file (a search error about the depth limit keeps its own name)."""
    try:
        yield
    except InputsFileError:
        raise
    except InputError as exc:
        if exc.name == "max_depth":
            raise
        raise InputsFileError(
            f"value {key}: {exc}", name=key, value=exc.value, expected=exc.expected
        ) from None
    except OutOfScopeError as exc:
        raise InputsFileError(
            f"value {key} = {value!r}: {exc}",
            name=key,
            value=value,
            expected="a section the method covers",
        ) from None
