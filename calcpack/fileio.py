"""Writing files so that a reader never sees half of one.

Used wherever calcpack writes a file another process may read at the same moment: inputs files
(read by a running kernel), the review file, kept manifests, caches and signed packages.
"""

from __future__ import annotations

import os
import secrets
from pathlib import Path

__all__ = ["write_atomically"]


def write_atomically(target: Path, data: bytes | str, *, mode: int = 0o666) -> None:
    """Write ``data`` to ``target`` via a temporary file in the same directory and a rename.

    A reader sees the old file or the complete new one, never a part; on failure the old file
    is untouched and the temporary file removed. Text is written as UTF-8 unchanged (no newline
    translation). ``mode`` is the permission of a new file before the umask (``0o600`` for a
    private key).
    """
    target = Path(target)
    target.parent.mkdir(parents=True, exist_ok=True)
    tmp = target.with_name(f".{target.name}.{secrets.token_hex(4)}.partial")
    raw = data.encode("utf-8") if isinstance(data, str) else data
    try:
        fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL, mode)
        with os.fdopen(fd, "wb") as fh:
            fh.write(raw)
            fh.flush()
            os.fsync(fh.fileno())
        os.replace(tmp, target)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise
