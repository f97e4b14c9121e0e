"""The whole calcpack exception hierarchy.

Every error calcpack raises on purpose is a :class:`CalcpackError`. Messages follow one shape:
what is wrong, the name of the input, the rule, what was given -- and the fix when it is obvious,
e.g. ``"Span L must be positive (got L = -3 m)"``.
"""

from __future__ import annotations

from typing import Any

__all__ = [
    "BuildError",
    "CalcpackError",
    "DimensionError",
    "InputError",
    "NoViewError",
    "NotebookExecutionError",
    "OutOfScopeError",
    "SignedPackageError",
    "SigningError",
    "UndefinedSymbolError",
    "UnstableStructureError",
    "VerificationError",
    "ZeroDivisorError",
]


class CalcpackError(Exception):
    """Root of every error raised by calcpack on purpose.

    Errors with fields keep them as attributes, pass them to ``Exception`` as ``args`` (so an
    error raised in a worker process is unpickled as it was raised) and write their message
    from them in ``__str__``.
    """


def show_value(value: Any) -> str:
    """A value as a message shows it: a quantity with its unit symbol, a string quoted."""
    if hasattr(value, "units") and hasattr(value, "magnitude"):
        return f"{value:~P}"
    return repr(value) if isinstance(value, str) else str(value)


class InputError(CalcpackError, ValueError):
    """A bad input value: names the input, the value given and what would be valid.

    The message is written from the fields -- ``"Input L must be positive (got L = -3 m)"``
    -- unless a whole ``message`` is given (for inputs whose rule reads better in its own
    words).

    Args:
        message: the full, human-readable message (optional: made from the fields if omitted).
        name: the name of the offending input (``"L"``, ``"t_w"``, ``"sheets[2]"``).
        value: the offending value as given (a quantity, number or string).
        expected: what would have been valid, in words.
        rule: the rule broken, as it follows the input's name (``"must be positive"``).
        note: a clause, source or hint added after the value (``"did you mean 'W18X50'?"``).
    """

    def __init__(
        self,
        message: str | None = None,
        *,
        name: str | None = None,
        value: Any = None,
        expected: str | None = None,
        rule: str | None = None,
        note: str | None = None,
    ) -> None:
        super().__init__(*(() if message is None else (message,)))
        self.message = message
        self.name = name
        self.value = value
        self.expected = expected
        self.rule = rule
        self.note = note

    def __str__(self) -> str:
        if self.message is not None:
            return self.message
        name = self.name or "value"
        rule = self.rule or (f"must be {self.expected}" if self.expected else "is not valid")
        note = f"; {self.note}" if self.note else ""
        return f"Input {name} {rule} (got {name} = {show_value(self.value)}){note}"


class DimensionError(InputError):
    """A quantity of the wrong physical dimension, or a formula whose units do not agree."""


class UndefinedSymbolError(InputError):
    """A formula refers to a symbol that has no value on the sheet."""


class ZeroDivisorError(InputError, ZeroDivisionError):
    """A formula divides by a value that is zero (or raises zero to a negative power).

    Args:
        name: the name of the value being derived.
        formula: the formula as text, symbols written as on the sheet.
        divisor: the part of the formula that is zero, as text.
    """

    def __init__(self, name: str, formula: str, divisor: str) -> None:
        super().__init__(
            name=divisor, value=0, expected=f"a non-zero divisor in {name} = {formula}"
        )
        self.args = (name, formula, divisor)
        self.derived = name
        self.formula = formula
        self.divisor = divisor

    def __str__(self) -> str:
        return (
            f"{self.derived} = {self.formula} divides by zero: {self.divisor} = 0; "
            "check the values it is made of"
        )


class UnstableStructureError(CalcpackError):
    """The structure cannot carry the load: a mechanism, too few or ill-placed supports.

    Args:
        message: what is unstable, why, and what would fix it.
        part: the support, hinge, joint or mode at fault, when one can be named.
    """

    def __init__(self, message: str, *, part: str | None = None) -> None:
        super().__init__(message)
        self.part = part


class OutOfScopeError(CalcpackError):
    """The method asked for does not cover this case (slender section, unsupported load type...).

    calcpack refuses rather than return a number it cannot stand behind.
    """


class NoViewError(CalcpackError, LookupError):
    """No renderer is registered to show a result in the way asked (see :mod:`calcpack.views`).

    Args:
        type_name: the result's class, qualified (``"calcpack.analysis.beam.BeamResult"``).
        kind: the view asked for (``"figure"``, ``"mimebundle"``...).
        known: the views registered for that class and its bases.
    """

    def __init__(self, type_name: str, kind: str, known: tuple[str, ...] = ()) -> None:
        super().__init__(type_name, kind, known)
        self.type_name = type_name
        self.kind = kind
        self.known = known

    def __str__(self) -> str:
        have = ", ".join(self.known) if self.known else "none"
        return (
            f"No {self.kind!r} view is registered for {self.type_name} "
            f"(views registered for it: {have}); calcpack.notebook registers the standard ones"
        )


class BuildError(CalcpackError):
    """The calc package could not be built (project file, templates, layout, output)."""


class NotebookExecutionError(BuildError):
    """A sheet notebook failed while executing.

    Args:
        sheet: the notebook path as named in the project file.
        cell_index: the 1-based number of the failing code cell as shown in JupyterLab's order.
        source_excerpt: the first line of the failing cell's source.
        error: the error name and message raised in the kernel.
    """

    def __init__(self, sheet: str, cell_index: int, source_excerpt: str, error: str) -> None:
        super().__init__(sheet, cell_index, source_excerpt, error)
        self.sheet = sheet
        self.cell_index = cell_index
        self.source_excerpt = source_excerpt
        self.error = error

    def __str__(self) -> str:
        return (
            f"Sheet {self.sheet!r} failed in cell {self.cell_index} "
            f"({self.source_excerpt!r}): {self.error}"
        )


class SignedPackageError(BuildError):
    """A build would replace a package that carries signatures; nothing was written.

    Args:
        path: the signed package.
        signers: ``(role, name)`` per signature already in it, in signing order.
        option: the command-line option that moves the signed package aside instead.
    """

    def __init__(
        self, path: str, signers: tuple[tuple[str, str], ...], option: str = "--supersede-signed"
    ) -> None:
        super().__init__(path, signers, option)
        self.path = path
        self.signers = signers
        self.option = option

    def __str__(self) -> str:
        who = ", ".join(f"{name} ({role})" for role, name in self.signers) or "unknown signers"
        return (
            f"{self.path!r} is signed by {who}; a build never replaces a signed package. "
            "Add a new revision to calcpack.toml for the changes, or build with "
            f"{self.option} to move the signed package into the superseded/ folder beside it"
        )


class SigningError(CalcpackError):
    """A package could not be signed (key, password, certificate, order of roles, tampering)."""


class VerificationError(CalcpackError):
    """A package could not be verified (not a calcpack package, unreadable manifest...)."""
