"""Builds made once per test run, however many test workers share them.

The suite runs on several workers (pytest-xdist). A session fixture runs once per worker, so a
package built in one would be built again in every other worker that needs it. ``built_once``
builds into a folder shared by all workers of the run: the first worker to ask builds under a
file lock, the others wait for it and read the result. A build that failed is reported again to
every later asker with the first failure's message, without building again.

Where file locks are not available (no ``fcntl``), each worker builds its own copy.
"""

from __future__ import annotations

import os
import shutil
import traceback
from collections.abc import Callable
from pathlib import Path

import pytest

try:
    import fcntl
except ImportError:  # pragma: no cover - not on the platforms CI runs
    fcntl = None  # type: ignore[assignment]


def shared_base(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """The folder every worker of this run can see: the run's base temporary folder (a worker's
    own base is a subfolder of it)."""
    base = tmp_path_factory.getbasetemp()
    if os.environ.get("PYTEST_XDIST_WORKER") and fcntl is not None:
        base = base.parent
    folder = base / "shared-builds"
    folder.mkdir(parents=True, exist_ok=True)
    return folder


def built_once(folder: Path, make: Callable[[Path], None]) -> Path:
    """``folder``, made by ``make(folder)`` unless a worker of this run already made it.

    Raises:
        RuntimeError: ``make`` failed here or in another worker (with the first message).
    """
    _build_under_lock(folder, make, wait=True)
    return folder


def build_if_free(folder: Path, make: Callable[[Path], None]) -> None:
    """Make ``folder`` now unless it is made or another worker is making it (then return at
    once): lets a worker waiting for one build do another meanwhile."""
    _build_under_lock(folder, make, wait=False)


def _build_under_lock(folder: Path, make: Callable[[Path], None], *, wait: bool) -> None:
    folder.parent.mkdir(parents=True, exist_ok=True)
    done = folder.with_name(folder.name + ".done")
    failed = folder.with_name(folder.name + ".failed")
    with open(folder.with_name(folder.name + ".lock"), "w") as lock:
        if fcntl is not None:
            try:
                fcntl.flock(lock, fcntl.LOCK_EX if wait else fcntl.LOCK_EX | fcntl.LOCK_NB)
            except BlockingIOError:
                return
        if failed.exists():
            if not wait:
                return
            message = failed.read_text(encoding="utf-8")
            raise RuntimeError(f"building {folder.name} failed earlier in this run:\n{message}")
        if done.exists():
            return
        if folder.exists():
            shutil.rmtree(folder)
        try:
            make(folder)
        except Exception:
            failed.write_text(traceback.format_exc(), encoding="utf-8")
            if wait:
                raise
            return
        done.touch()


def is_busy(folder: Path) -> bool:
    """Whether another worker holds ``folder``'s build lock right now."""
    if fcntl is None:
        return False
    folder.parent.mkdir(parents=True, exist_ok=True)
    with open(folder.with_name(folder.name + ".lock"), "w") as lock:
        try:
            fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except BlockingIOError:
            return True
        return False
