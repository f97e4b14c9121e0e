"""Small helpers shared by the signing modules."""

from __future__ import annotations

import contextlib
import logging
import os
import secrets
from collections.abc import Iterator
from pathlib import Path

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


def write_atomically(target: Path, data: bytes) -> None:
    """Write ``data`` to ``target`` via a temporary file in the same directory and a rename.

    A reader sees the old file or the complete new one, never a part; on failure the old file
    is untouched and the temporary file removed.
    """
    target.parent.mkdir(parents=True, exist_ok=True)
    tmp = target.with_name(f".{target.name}.{secrets.token_hex(4)}.partial")
    try:
        with tmp.open("xb") as fh:
            fh.write(data)
            fh.flush()
            os.fsync(fh.fileno())
        os.replace(tmp, target)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise
