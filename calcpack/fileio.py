"""Writing files so that a reader never sees half of one, and sealed entries that cannot lie.

:func:`write_atomically` is used wherever calcpack writes a file another process may read at
the same moment: inputs files (read by a running kernel), the review file, kept manifests,
caches and signed packages.

Sealed entries: every artifact kept between runs (executed notebooks, typeset formulas,
laid-out chunks, the values sheets export to each other) is written as one *entry*: a header
line naming the format, the key the entry was stored under, the length and the SHA-256 of the
content, then the content::

    calcpack-cache-entry/1 key=<key> length=<bytes> sha256=<hex>\\n<content>

:func:`read_entry` checks all of it. An entry edited by hand, truncated, copied over another
entry's file or written by a different format is discarded (the file is deleted) with a
:class:`CacheWarning`, and the caller rebuilds it; it is never used. A missing entry is simply
a miss. Writes go through a temporary file and a rename, so a crash leaves the old entry or the
new one, never half of one (and half of one would fail the check anyway).
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import secrets
import warnings
from pathlib import Path

__all__ = [
    "ENTRY_FORMAT",
    "CacheWarning",
    "discard",
    "read_entry",
    "seal",
    "unseal",
    "write_atomically",
    "write_entry",
]


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


ENTRY_FORMAT = "calcpack-cache-entry/1"
_MAX_HEADER = 512


class CacheWarning(UserWarning):
    """A cache entry failed its check and was discarded (it is rebuilt, never used)."""


def seal(key: str, content: bytes) -> bytes:
    """``content`` with the header that :func:`unseal` checks (``key``: no spaces or newlines)."""
    if not key or any(c.isspace() for c in key):
        raise ValueError(f"cache key must be non-empty without spaces (got {key!r})")
    digest = hashlib.sha256(content).hexdigest()
    header = f"{ENTRY_FORMAT} key={key} length={len(content)} sha256={digest}\n"
    return header.encode("ascii") + content


def unseal(key: str, data: bytes) -> tuple[bytes | None, str]:
    """The content of a sealed entry, or ``(None, why)`` when it fails a check."""
    end = data.find(b"\n", 0, _MAX_HEADER)
    if end < 0:
        return None, "it has no entry header (damaged, truncated or an older format)"
    try:
        fields = data[:end].decode("ascii").split(" ")
    except UnicodeDecodeError:
        return None, "its header is not readable"
    if len(fields) != 4 or fields[0] != ENTRY_FORMAT:
        return None, f"its header is not {ENTRY_FORMAT}"
    values = dict(f.split("=", 1) for f in fields[1:] if "=" in f)
    if values.get("key") != key:
        return None, f"it was stored for another key ({values.get('key', '?')[:16]}...)"
    content = data[end + 1 :]
    if values.get("length") != str(len(content)):
        return None, (
            f"its length is {len(content)} bytes, not the {values.get('length')} written "
            "(truncated or edited)"
        )
    if values.get("sha256") != hashlib.sha256(content).hexdigest():
        return None, "its content does not match its hash (edited or damaged)"
    return content, ""


def write_entry(path: Path, key: str, content: bytes) -> None:
    """Store ``content`` under ``key`` in ``path`` (atomically; folders made as needed)."""
    path.parent.mkdir(parents=True, exist_ok=True)
    write_atomically(path, seal(key, content))


def read_entry(path: Path, key: str, *, what: str) -> bytes | None:
    """The content stored under ``key`` in ``path``; None if there is none or it fails a check.

    A failing entry is deleted and reported with a :class:`CacheWarning` naming ``what`` it
    held, the file and the reason.
    """
    try:
        data = path.read_bytes()
    except FileNotFoundError:
        return None
    except OSError as exc:
        discard(path, what, f"it cannot be read ({exc.strerror or exc})")
        return None
    content, why = unseal(key, data)
    if content is None:
        discard(path, what, why)
    return content


def discard(path: Path, what: str, why: str) -> None:
    """Delete a cache file that failed a check, with a :class:`CacheWarning`."""
    with contextlib.suppress(OSError):  # a file that cannot be deleted is still never used
        path.unlink(missing_ok=True)
    warnings.warn(
        CacheWarning(f"Cached {what} {path.name} discarded and rebuilt: {why}"), stacklevel=3
    )
