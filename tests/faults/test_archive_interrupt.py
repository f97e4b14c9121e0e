"""Fault injection: Ctrl-C and a killed build (issue 15, point 5).

A build of two sheets that loop forever is interrupted the way a terminal does it (SIGINT to
the whole process group) or killed outright (SIGKILL). The safe outcome: one line, exit 130,
no worker or kernel left running, no temporary folder left; folders a killed build leaves are
removed by the next build. Signal semantics are POSIX (common practice).
"""

from __future__ import annotations

import os
import signal
import subprocess
import sys
import tempfile
import time
from pathlib import Path
from typing import Any

import pytest

from calcpack.package.interrupt import TEMP_PREFIX, clean_stale_temp
from tests.build.projectkit import make_project

LOOP_BODIES = {
    "A": "import time\nwhile True:\n    time.sleep(0.01)",
    "B": "while True:\n    pass",
}

# Wait limits: generous, because other builds may share the machine (the tests never sleep a
# fixed time in the hope that something has happened; they wait for it to be seen).
START_S = 600.0
STOP_S = 180.0


def _loops(marks: Path) -> dict[str, list[str]]:
    """Two sheets whose cell first says it is running (its kernel's process id, in a file
    written whole) and then loops for ever."""
    cells = {}
    for name, body in LOOP_BODIES.items():
        mark = marks / f"running-{name}"
        start = (
            "import os, pathlib\n"
            f"pathlib.Path({str(mark) + '.part'!r}).write_text(str(os.getpid()))\n"
            f"os.replace({str(mark) + '.part'!r}, {str(mark)!r})\n"
        )
        cells[f"Loop {name}"] = [start + body]
    return cells


def _tree(root: int) -> list[int]:
    """``root`` and every process descended from it (Linux /proc)."""
    parents: dict[int, int] = {}
    for entry in Path("/proc").iterdir():
        if entry.name.isdigit():
            try:
                stat = (entry / "stat").read_text()
            except OSError:
                continue
            parents[int(entry.name)] = int(stat.rsplit(")", 1)[1].split()[1])
    found = {root}
    grew = True
    while grew:
        grew = False
        for pid, parent in parents.items():
            if parent in found and pid not in found:
                found.add(pid)
                grew = True
    return sorted(found)


def _alive(pids: list[int]) -> list[int]:
    return [p for p in pids if Path(f"/proc/{p}").exists() and "Z" not in _state(p)]


def _state(pid: int) -> str:
    try:
        return Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()[0]
    except OSError:
        return "Z"


def _start_build(project: Path, tmp: Path) -> subprocess.Popen[str]:
    env = dict(os.environ, TMPDIR=str(tmp), PYTHONPATH=os.pathsep.join(sys.path))
    return subprocess.Popen(
        [
            sys.executable,
            "-m",
            "calcpack",
            "build",
            str(project),
            "--quiet",
            "--workers",
            "2",
            "--timeout",
            "600",
        ],
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        text=True,
        env=env,
        start_new_session=True,  # its own process group, as a terminal's foreground job
        preexec_fn=lambda: signal.signal(signal.SIGINT, signal.SIG_DFL),
    )


def _wait_for_cells(build: subprocess.Popen[str], marks: Path) -> list[int]:
    """Wait until both looping cells say they run; the build's processes and the kernels'."""
    deadline = time.monotonic() + START_S
    files = [marks / f"running-{name}" for name in LOOP_BODIES]
    while time.monotonic() < deadline:
        if all(f.exists() for f in files):
            kernels = [int(f.read_text()) for f in files]
            return sorted(set(_tree(build.pid)) | set(kernels))
        assert build.poll() is None, build.communicate()
        time.sleep(0.2)
    raise AssertionError(f"the looping cells did not start within {START_S:.0f} s")


def _wait_gone(processes: list[int], seconds: float) -> list[int]:
    deadline = time.monotonic() + seconds
    while _alive(processes) and time.monotonic() < deadline:
        time.sleep(0.2)
    return _alive(processes)


@pytest.fixture
def looping(tmp_path: Path) -> tuple[Path, Path, Path]:
    tmp = tmp_path / "tmp"
    tmp.mkdir()
    marks = tmp_path / "marks"
    marks.mkdir()
    return make_project(tmp_path / "job", _loops(marks)), tmp, marks


@pytest.mark.build
def test_ctrl_c_prints_one_line_and_stops_every_worker_and_kernel(
    looping: tuple[Path, Path, Path],
) -> None:
    project, tmp, marks = looping
    build = _start_build(project, tmp)
    processes = _wait_for_cells(build, marks)
    assert len(processes) >= 5  # the build, the resource tracker, two workers, kernels
    os.killpg(build.pid, signal.SIGINT)
    try:
        _, err = build.communicate(timeout=STOP_S)
        left = _wait_gone(processes, STOP_S)
    finally:
        for pid in _alive(processes):  # never leave a test's processes behind
            os.kill(pid, signal.SIGKILL)
    assert build.returncode == 130
    assert err.strip().splitlines() == ["calcpack: interrupted; nothing was written"], err
    assert left == []
    assert list(tmp.glob(f"{TEMP_PREFIX}*")) == []
    assert not list((project / "build").glob("*.pdf"))


@pytest.mark.build
def test_folders_of_a_killed_build_are_removed_by_the_next_build(
    looping: tuple[Path, Path, Path],
) -> None:
    project, tmp, marks = looping
    build = _start_build(project, tmp)
    processes = _wait_for_cells(build, marks)
    os.killpg(build.pid, signal.SIGKILL)  # the build and its workers; kernels are on their own
    build.communicate(timeout=STOP_S)
    left = list(tmp.glob(f"{TEMP_PREFIX}*"))
    assert left  # the fault: a killed process cannot clean up
    try:
        assert _wait_gone(processes, STOP_S) == []  # orphaned kernels notice the parent gone
    finally:
        for pid in _alive(processes):
            os.kill(pid, signal.SIGKILL)
    assert sorted(clean_stale_temp(tmp)) == sorted(left)
    assert list(tmp.glob(f"{TEMP_PREFIX}*")) == []


def test_a_live_builds_folders_are_kept_and_a_dead_ones_removed(tmp_path: Path) -> None:
    done = subprocess.run(
        [sys.executable, "-c", "import os; print(os.getpid())"],
        capture_output=True,
        text=True,
        check=True,
    )
    dead = int(done.stdout)
    stale = tmp_path / f"{TEMP_PREFIX}{dead}-bodies-abc"
    live = tmp_path / f"{TEMP_PREFIX}{os.getpid()}-bodies-def"
    other = tmp_path / "calcpack-preview-xyz"
    for folder in (stale, live, other):
        folder.mkdir()
        (folder / "f").write_text("x")
    assert clean_stale_temp(tmp_path) == [stale]
    assert not stale.exists()
    assert live.exists()
    assert other.exists()


def test_every_build_cleans_stale_folders_first(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    from calcpack.package import pipeline

    calls: list[Any] = []
    monkeypatch.setattr(pipeline, "clean_stale_temp", lambda: calls.append(1) or [])

    def stop(*args: Any, **kwargs: Any) -> Any:
        raise KeyboardInterrupt

    monkeypatch.setattr(pipeline, "execute_sheets", stop)
    project = make_project(tmp_path / "job", {"A": ["x = 1"]})
    with pytest.raises(KeyboardInterrupt):
        pipeline.build(project, workers=1)
    assert calls == [1]
    assert not list(Path(tempfile.gettempdir()).glob(f"{TEMP_PREFIX}{os.getpid()}-*"))
