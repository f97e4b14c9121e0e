"""What the member tables of an inputs file share when a panel sizes them: the outcome of one
section's checks, and errors of the checks turned into errors at an inputs-file key."""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from contextlib import contextmanager
from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError, OutOfScopeError
from calcpack.inputs.file import InputsFileError
from calcpack.units import Quantity

__all__ = ["SizedOutcome", "as_inputs_error", "governing_check"]


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
