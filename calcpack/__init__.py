"""calcpack: structural calculation packages written as Jupyter notebooks."""

from __future__ import annotations

from importlib.metadata import PackageNotFoundError, version

from calcpack.errors import (
    BuildError,
    CalcpackError,
    DimensionError,
    InputError,
    NotebookExecutionError,
    OutOfScopeError,
    SigningError,
    UndefinedSymbolError,
    UnstableStructureError,
    VerificationError,
)
from calcpack.units import Q_, get_display, set_display, ureg
from calcpack.working import (
    Check,
    Derived,
    Equation,
    Given,
    Sheet,
    Unknown,
    sqrt,
)

try:
    __version__ = version("calcpack")
except PackageNotFoundError:  # running from a source tree that is not installed
    __version__ = "0.0.0+unknown"

__all__ = [
    "Q_",
    "BuildError",
    "CalcpackError",
    "Check",
    "Derived",
    "DimensionError",
    "Equation",
    "Given",
    "InputError",
    "NotebookExecutionError",
    "OutOfScopeError",
    "Sheet",
    "SigningError",
    "UndefinedSymbolError",
    "Unknown",
    "UnstableStructureError",
    "VerificationError",
    "__version__",
    "get_display",
    "set_display",
    "sqrt",
    "ureg",
]
