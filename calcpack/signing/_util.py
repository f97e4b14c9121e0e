"""Small helpers shared by the signing modules."""

from __future__ import annotations

import contextlib
import logging
from collections.abc import Iterator

from calcpack.fileio import write_atomically

__all__ = ["quiet_library_logs", "write_atomically"]


@contextlib.contextmanager
def quiet_library_logs() -> Iterator[None]:
    """Silence the signing library's logged tracebacks; calcpack reports the outcome itself.

    Usable as a decorator (``@quiet_library_logs()``).
    """
    loggers = [logging.getLogger(n) for n in ("pyhanko", "pyhanko_certvalidator", "fontTools")]
    levels = [lg.level for lg in loggers]
    for lg in loggers:
        lg.setLevel(logging.CRITICAL)
    try:
        yield
    finally:
        for lg, level in zip(loggers, levels, strict=True):
            lg.setLevel(level)
