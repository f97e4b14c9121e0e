"""Cache entries that cannot lie (the sealed entries of :mod:`calcpack.fileio`), and how their
warnings are shown on the command line."""

from __future__ import annotations

import warnings

from calcpack.fileio import (
    ENTRY_FORMAT,
    CacheWarning,
    discard,
    read_entry,
    seal,
    unseal,
    write_entry,
)

__all__ = [
    "ENTRY_FORMAT",
    "CacheWarning",
    "discard",
    "one_line_warnings",
    "read_entry",
    "seal",
    "unseal",
    "write_entry",
]


def one_line_warnings() -> None:
    """Show :class:`CacheWarning` as one line, ``Warning: ...`` (the command line and the build's
    worker processes call this; other warnings keep Python's format)."""
    original = warnings.formatwarning
    if getattr(original, "_calcpack", False):
        return

    def formatwarning(
        message: Warning | str,
        category: type[Warning],
        filename: str,
        lineno: int,
        line: str | None = None,
    ) -> str:
        if issubclass(category, CacheWarning):
            return f"Warning: {message}\n"
        return original(message, category, filename, lineno, line)

    formatwarning._calcpack = True  # type: ignore[attr-defined]
    warnings.formatwarning = formatwarning
