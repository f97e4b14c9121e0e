"""calcpack: structural calculation packages written as Jupyter notebooks.

The public API is re-exported here. Only the error hierarchy is imported eagerly; every other
name is loaded on first use, so ``import calcpack`` stays light in each sheet notebook (a sheet
that only needs the working never loads the PDF, signing or plotting code).
"""

from __future__ import annotations

from importlib.metadata import PackageNotFoundError, version
from typing import TYPE_CHECKING

from calcpack import notebook as _notebook  # noqa: F401  (registers the standard renderers)
from calcpack._lazy import PUBLIC as _PUBLIC
from calcpack._lazy import lazy_attributes as _lazy_attributes
from calcpack.errors import (
    BuildError,
    CalcpackError,
    DimensionError,
    InputError,
    NotebookExecutionError,
    NoViewError,
    OutOfScopeError,
    SigningError,
    UndefinedSymbolError,
    UnstableStructureError,
    VerificationError,
    ZeroDivisorError,
)

try:
    __version__ = version("calcpack")
except PackageNotFoundError:  # running from a source tree that is not installed
    __version__ = "0.0.0+unknown"

__all__ = [
    "BuildError",
    "CalcpackError",
    "DimensionError",
    "InputError",
    "NoViewError",
    "NotebookExecutionError",
    "OutOfScopeError",
    "SigningError",
    "UndefinedSymbolError",
    "UnstableStructureError",
    "VerificationError",
    "ZeroDivisorError",
    "__version__",
    *_PUBLIC,
]

__getattr__, __dir__ = _lazy_attributes("calcpack", _PUBLIC, globals(), __all__)

if TYPE_CHECKING:
    from calcpack._api import *  # noqa: F403
