"""Stopping a build cleanly: Ctrl-C, terminated workers, and folders left by a killed build.

- Ctrl-C reaches the whole foreground process group. The build's worker processes ignore it
  (:func:`worker_signals`), so only the build process sees it: it prints one line and stops
  the workers (:func:`stop_workers`), each of which kills the kernel it is running on the way
  out (kernels run in sessions of their own, so the terminal's Ctrl-C does not reach them).
- Every temporary folder of a build is named ``calcpack-build-<pid>-...`` after the build
  process (:func:`temp_prefix`); one left behind by a build that was killed outright (whose
  process no longer exists) is removed at the start of the next build
  (:func:`clean_stale_temp`).
"""

from __future__ import annotations

import contextlib
import os
import re
import shutil
import signal
import tempfile
from collections.abc import Iterator
from pathlib import Path
from typing import Any

__all__ = [
    "TEMP_PREFIX",
    "clean_stale_temp",
    "running_kernel",
    "stop_workers",
    "temp_prefix",
    "worker_signals",
]

TEMP_PREFIX = "calcpack-build-"
_TEMP_RE = re.compile(rf"^{re.escape(TEMP_PREFIX)}(\d+)-")

_build_pid: int | None = None
"""In a worker: the build process that started it."""
_kernel: Any = None
"""In a worker (or a one-process build): the kernel manager of the sheet being executed."""


def temp_prefix(kind: str) -> str:
    """The prefix of a temporary folder of this build (made in the build or one of its workers).

    >>> temp_prefix("bodies").startswith("calcpack-build-")
    True
    """
    return f"{TEMP_PREFIX}{_build_pid or os.getpid()}-{kind}-"


def _alive(pid: int) -> bool:
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except PermissionError:  # someone else's process: alive
        return True
    return True


def clean_stale_temp(folder: str | os.PathLike[str] | None = None) -> list[Path]:
    """Remove temporary folders of builds whose process no longer exists; returns them."""
    root = Path(folder or tempfile.gettempdir())
    removed = []
    for path in root.glob(f"{TEMP_PREFIX}*"):
        m = _TEMP_RE.match(path.name)
        if m and path.is_dir() and not _alive(int(m.group(1))):
            shutil.rmtree(path, ignore_errors=True)
            removed.append(path)
    return removed


def _kill_kernel() -> None:
    """Kill the kernel this process is running, if any (its whole session)."""
    km = _kernel
    if km is None:
        return
    with contextlib.suppress(Exception):
        pid = km.provisioner.pid if km.provisioner is not None else None
        if pid:
            os.killpg(pid, signal.SIGKILL)
    with contextlib.suppress(Exception):
        km.cleanup_resources()


_folders: list[str] = []
"""In a worker: the temporary folders of the sheet being executed."""


def _on_terminate(signum: int, frame: Any) -> None:
    # Kill the kernel first, then leave at once: unwinding through the kernel client would
    # talk to a kernel that is going away (and print its complaints).
    _kill_kernel()
    for folder in _folders:
        shutil.rmtree(folder, ignore_errors=True)
    os._exit(128 + signum)


def worker_signals() -> None:
    """In a build worker: ignore Ctrl-C (the build process handles it) and, when the build
    terminates the worker, kill the kernel it runs and unwind (temporary folders removed)."""
    global _build_pid
    _build_pid = os.getppid()
    signal.signal(signal.SIGINT, signal.SIG_IGN)
    signal.signal(signal.SIGTERM, _on_terminate)


@contextlib.contextmanager
def running_kernel(km: Any, folder: str) -> Iterator[None]:
    """Mark ``km`` as the kernel to kill, and ``folder`` as the folder to remove, if this
    process is stopped while the kernel runs."""
    global _kernel
    _kernel = km
    _folders.append(folder)
    try:
        yield
    finally:
        _kernel = None
        _folders.remove(folder)


def stop_workers(pool: Any, grace_s: float = 5.0) -> None:
    """Stop every worker process of ``pool`` now (after Ctrl-C): kill their kernels, terminate
    the workers (each removes its sheet's folders), wait a little, kill the ones still there."""
    import psutil  # what ipykernel uses to find its processes; kernels are workers' children

    previous = signal.signal(signal.SIGINT, signal.SIG_IGN)  # a second Ctrl-C waits for this
    try:
        processes = list((getattr(pool, "_processes", None) or {}).values())
        kernels = []
        for p in processes:
            with contextlib.suppress(psutil.Error, ValueError):
                kernels += psutil.Process(p.pid).children(recursive=True)
        for p in processes:
            with contextlib.suppress(Exception):
                p.terminate()
        # Each worker kills its kernel; one busy in a cell may take its time to answer, so
        # after a moment the kernels still there are killed from here.
        with contextlib.suppress(Exception):
            psutil.wait_procs(kernels, timeout=grace_s)
        for child in kernels:
            with contextlib.suppress(psutil.Error):
                child.kill()
        for p in processes:
            with contextlib.suppress(Exception):
                p.join(grace_s)
                if p.is_alive():
                    p.kill()
                    p.join(1.0)
        with contextlib.suppress(Exception):
            pool.shutdown(wait=False, cancel_futures=True)
    finally:
        signal.signal(signal.SIGINT, previous)
