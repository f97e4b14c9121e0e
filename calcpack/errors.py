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
    """Root of every error raised by calcpack on purpose."""


class InputError(CalcpackError, ValueError):
    """A bad input value: names the input, the value given and what would be valid.

    Args:
        message: the full, human-readable message.
        name: the name of the offending input (``"L"``, ``"t_w"``, ``"sheets[2]"``).
        value: the offending value as given (a quantity, number or string).
        expected: what would have been valid, in words.
    """

    def __init__(
        self,
        message: str,
        *,
        name: str | None = None,
        value: Any = None,
        expected: str | None = None,
    ) -> None:
        super().__init__(message)
        self.name = name
        self.value = value
        self.expected = expected


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
            f"{name} = {formula} divides by zero: {divisor} = 0; check the values it is made of",
            name=divisor,
            value=0,
            expected=f"a non-zero divisor in {name} = {formula}",
        )
        self.formula = formula
        self.divisor = divisor


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
        super().__init__(
            f"Sheet {sheet!r} failed in cell {cell_index} ({source_excerpt!r}): {error}"
        )
        self.sheet = sheet
        self.cell_index = cell_index
        self.source_excerpt = source_excerpt
        self.error = error


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
        who = ", ".join(f"{name} ({role})" for role, name in signers) or "unknown signers"
        super().__init__(
            f"{path!r} is signed by {who}; a build never replaces a signed package. "
            "Add a new revision to calcpack.toml for the changes, or build with "
            f"{option} to move the signed package into the superseded/ folder beside it"
        )
        self.path = path
        self.signers = signers
        self.option = option


class SigningError(CalcpackError):
    """A package could not be signed (key, password, certificate, order of roles, tampering)."""


class VerificationError(CalcpackError):
    """A package could not be verified (not a calcpack package, unreadable manifest...)."""
