"""Execute sheet notebooks: a fresh kernel per sheet, parallel spawn workers, a content cache.

Each sheet runs in its own kernel started from the *same* Python as the build
(``sys.executable -m ipykernel_launcher``), so whatever environment runs ``calcpack build`` (a CI
virtual environment, an editable checkout) is the environment the sheets see. Kernels talk over
IPC sockets in a private temporary folder rather than TCP ports, so parallel builds never race for
ports.

Workers are processes started with the *spawn* method: forking a process that already holds
running kernels can deadlock on the inherited ZMQ state; spawning cannot.

The cache key of a sheet covers only what can change its results (see
:mod:`calcpack.package.sheetkey`, plus the values it imports): an unchanged sheet is read back
from ``.calcpack-cache/`` in the project folder instead of being executed, after the entry's
checks (:mod:`calcpack.package.cache`).
"""

from __future__ import annotations

import concurrent.futures
import concurrent.futures.process
import contextlib
import hashlib
import json
import logging
import multiprocessing
import os
import re
import subprocess
import sys
import tempfile
import time
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError, NotebookExecutionError
from calcpack.package.project import Project, SheetEntry
from calcpack.package.sheetkey import sheet_cache_key

__all__ = [
    "CACHE_DIR_NAME",
    "DEFAULT_CELL_TIMEOUT_S",
    "ExecutedSheet",
    "FailedSheet",
    "execute_notebook",
    "execute_sheets",
    "process_pool",
    "sheet_cache_key",
    "skip_unused_slow_imports",
    "worker_pool",
]

CACHE_DIR_NAME = ".calcpack-cache"
DEFAULT_CELL_TIMEOUT_S = 120.0

ProgressCallback = Callable[[str, SheetEntry], None]
"""Called with ("executing" | "cached" | "executed", sheet) as execution proceeds."""


@dataclass(frozen=True)
class ExecutedSheet:
    """A sheet notebook after execution (or read from the cache)."""

    entry: SheetEntry
    notebook_json: str
    """The executed notebook, nbformat JSON."""
    cache_key: str
    from_cache: bool
    seconds: float
    """Wall time spent executing (0 when read from the cache)."""
    started_at: float = 0.0
    finished_at: float = 0.0
    """When its execution started and finished (seconds since the epoch, comparable between the
    build's worker processes on one machine): the build's timeline. A cached sheet has both at
    the moment it was read."""


@dataclass(frozen=True)
class FailedSheet:
    """A sheet whose execution failed, with the error its kernel raised."""

    entry: SheetEntry
    error: NotebookExecutionError


def _kernel_env(exports: str | None = None, sheet: str | None = None) -> dict[str, str]:
    """Environment for kernels: calcpack importable even from an uninstalled source tree; the
    build's exports folder and the sheet's path, for imports between sheets."""
    import calcpack
    from calcpack.working.links import EXPORTS_DIR_ENV, SHEET_ENV

    # CALCPACK_BUILDING: input panels and the preview show nothing in a build's kernel, even
    # when the build is started from a notebook (whose kernel environment is inherited).
    env = {"MPLBACKEND": "Agg", "PYDEVD_DISABLE_FILE_VALIDATION": "1", "CALCPACK_BUILDING": "1"}
    if exports is not None:
        env[EXPORTS_DIR_ENV] = exports
    if sheet is not None:
        env[SHEET_ENV] = sheet
    source_root = str(Path(calcpack.__file__).resolve().parent.parent)
    if not re.search(r"[\\/](site|dist)-packages$", source_root):
        current = os.environ.get("PYTHONPATH", "")
        parts = [source_root, *[p for p in current.split(os.pathsep) if p]]
        env["PYTHONPATH"] = os.pathsep.join(dict.fromkeys(parts))
    return env


def _first_line(source: str) -> str:
    for line in source.splitlines():
        if line.strip():
            return line.strip()[:120]
    return ""


def _failure(nb: Any, sheet: str, exc: BaseException, timeout: float) -> NotebookExecutionError:
    """The error for a failed execution: the sheet, the 1-based cell number, the cell's first
    source line and what the kernel said."""
    from nbclient.exceptions import CellTimeoutError, DeadKernelError

    index, excerpt = 0, ""
    for i, cell in enumerate(nb.cells, start=1):
        if cell.get("cell_type") != "code":
            continue
        if any(out.get("output_type") == "error" for out in cell.get("outputs", [])):
            index, excerpt = i, _first_line(cell.source)
            break
    ename = getattr(exc, "ename", None)
    evalue = getattr(exc, "evalue", None)
    if ename:
        error = f"{ename}: {evalue}"
    elif isinstance(exc, CellTimeoutError):
        error = f"the cell timed out after {timeout:g} s (raise --timeout if it needs longer)"
    elif isinstance(exc, DeadKernelError):
        error = "the kernel died"
    else:
        error = f"{type(exc).__name__}: {exc}"
    if index == 0:
        # A timeout or dead kernel leaves no error output: take the last cell that started.
        started = [
            i
            for i, cell in enumerate(nb.cells, start=1)
            if cell.get("cell_type") == "code" and cell.get("execution_count")
        ]
        running = [
            i
            for i, cell in enumerate(nb.cells, start=1)
            if cell.get("cell_type") == "code"
            and cell.get("metadata", {}).get("execution", {}).get("iopub.execute_input")
        ]
        candidates = running or started
        if candidates:
            index = candidates[-1]
            excerpt = _first_line(nb.cells[index - 1].source)
    return NotebookExecutionError(sheet, index, excerpt, error)


def execute_notebook(
    path: Path,
    *,
    sheet: str,
    timeout: float = DEFAULT_CELL_TIMEOUT_S,
) -> Any:
    """Execute one notebook in a fresh kernel (cwd = the notebook's folder); returns it.

    Args:
        path: the notebook file.
        sheet: the sheet's name for messages (its path as listed in the project file).
        timeout: per-cell limit in seconds.

    Raises:
        NotebookExecutionError: a cell raised, timed out or the kernel died; names the sheet,
            the 1-based cell number, the first line of its source and the error.
    """
    import nbformat

    return nbformat.reads(_execute(str(path), sheet, timeout), as_version=4)


def execute_sheet(
    project: Project, sheet: SheetEntry, key: str, timeout: float, exports: str | None = None
) -> ExecutedSheet:
    """Execute one sheet of a project (in a worker process or in this one).

    ``key`` is its cache key; ``exports`` the build's folder of exports files, read by the
    sheet's imports.

    Raises:
        NotebookExecutionError: a cell raised, timed out or the kernel died (it unpickles as
            raised, so a worker's failure reaches the build as it is).
    """
    start, started_at = time.perf_counter(), time.time()
    text = _execute(str(project.sheet_path(sheet)), sheet.path, timeout, exports)
    return ExecutedSheet(
        sheet, text, key, False, time.perf_counter() - start, started_at, time.time()
    )


def _execute(path: str, sheet: str, timeout: float, exports: str | None = None) -> str:
    """Run one notebook; the executed notebook as nbformat JSON.

    ``exports`` is the build's folder of exports files, read by the sheet's imports.

    Raises:
        NotebookExecutionError: see :func:`execute_notebook`.
    """
    import nbformat
    from jupyter_client.kernelspec import KernelSpec, KernelSpecManager
    from jupyter_client.manager import AsyncKernelManager
    from jupyter_core.utils import run_sync
    from nbclient import NotebookClient
    from nbclient.exceptions import CellControlSignal, CellExecutionError, DeadKernelError

    class SamePython(KernelSpecManager):  # type: ignore[misc]
        def get_kernel_spec(self, kernel_name: str) -> Any:
            return KernelSpec(
                argv=[sys.executable, "-m", "ipykernel_launcher", "-f", "{connection_file}"],
                display_name="Python 3 (calcpack build)",
                language="python",
                env=_kernel_env(exports, sheet),
            )

    nb = nbformat.read(path, as_version=4)
    from calcpack.package.interrupt import running_kernel, temp_prefix

    with tempfile.TemporaryDirectory(prefix=temp_prefix("kernel")) as sockets:
        # An asynchronous manager, as nbclient makes for itself: with a blocking one nbclient
        # does not enforce the per-cell timeout.
        km = AsyncKernelManager(
            log=_QUIET_LOG,
            kernel_name="python3",
            kernel_spec_manager=SamePython(),
            connection_file=os.path.join(sockets, "kernel.json"),
            **_kernel_transport(sockets),
        )
        client = NotebookClient(
            nb,
            log=_QUIET_LOG,
            km=km,
            timeout=timeout,
            allow_errors=False,
            record_timing=True,
            resources={"metadata": {"path": str(Path(path).parent)}},
        )
        try:
            with running_kernel(km, sockets):
                # The kernel process's own stderr (start-up and shut-down noise) is not the
                # build's output: cell errors come back as messages and are reported.
                client.execute(stderr=subprocess.DEVNULL)
        except (CellExecutionError, CellControlSignal, DeadKernelError, RuntimeError) as exc:
            raise _failure(nb, sheet, exc, timeout) from None
        finally:
            # nbclient leaves a kernel manager it was given running: shut it down here.
            try:
                if km.has_kernel:
                    run_sync(km.shutdown_kernel)(now=True)
            except Exception:
                pass
    return str(nbformat.writes(nb))


_SOCKET_PATH_MAX = 100
"""Longest socket path used for a kernel's channels: a Unix socket address holds 107 bytes on
Linux (104 on BSD and macOS); the channel names add ``-`` and a number."""


def _kernel_transport(sockets: str) -> dict[str, str]:
    """The kernel's channels: Unix sockets in the build's own folder (nothing listens on a
    network port), or the loopback interface when that folder's path is too long for a socket
    address (a deep TMPDIR), which would otherwise fail with "File name too long"."""
    ip = os.path.join(sockets, "k")
    if len(os.fsencode(ip)) + 8 <= _SOCKET_PATH_MAX:
        return {"transport": "ipc", "ip": ip}
    return {"transport": "tcp", "ip": "127.0.0.1"}


_QUIET_LOG = logging.getLogger("calcpack.kernel")
"""Kernel plumbing messages (a zmq context left to the garbage collector...) stay out of the
build's output; a failing cell is reported by the build itself."""
_QUIET_LOG.setLevel(logging.ERROR)
_QUIET_LOG.propagate = False
_QUIET_LOG.addHandler(logging.NullHandler())  # else Python's last-resort handler prints them


_CACHE_SUFFIX = ".executed"
"""Executed notebooks in the cache: sealed entries (:mod:`calcpack.package.cache`), not bare
``.ipynb`` files, so that an edited or damaged one is discarded rather than used."""


def _cache_file(cache_dir: Path, sheet: SheetEntry, key: str) -> Path:
    slug = re.sub(r"[^A-Za-z0-9]+", "_", sheet.path).strip("_")
    return cache_dir / f"{slug}-{key[:32]}{_CACHE_SUFFIX}"


def _store(cache_dir: Path, sheet: SheetEntry, key: str, notebook_json: str) -> None:
    from calcpack.package.cache import write_entry

    target = _cache_file(cache_dir, sheet, key)
    write_entry(target, key, notebook_json.encode("utf-8"))
    prefix = target.name.rsplit("-", 1)[0] + "-"
    for old in cache_dir.glob(prefix + "*"):
        if old != target and len(old.name) == len(target.name):
            old.unlink(missing_ok=True)
    for older in cache_dir.glob(prefix + "*.ipynb"):  # bare notebooks of earlier versions
        older.unlink(missing_ok=True)


def _cached(cache_dir: Path, sheet: SheetEntry, key: str) -> str | None:
    """The executed notebook stored for ``key``, if there is one and it passes its checks (a
    sealed entry that is valid JSON); a failing one is discarded with a warning."""
    from calcpack.package.cache import discard, read_entry

    path = _cache_file(cache_dir, sheet, key)
    content = read_entry(path, key, what=f"executed notebook of sheet {sheet.path!r}")
    if content is None:
        return None
    try:
        text = content.decode("utf-8")
        json.loads(text)
    except ValueError as exc:
        discard(path, f"executed notebook of sheet {sheet.path!r}", f"not a notebook ({exc})")
        return None
    return text


_UNUSED_SLOW_IMPORTS = ("rfc3987_syntax",)
"""Optional imports a build never uses that cost much. jsonschema (imported by nbformat)
imports ``rfc3987_syntax`` when it is installed (JupyterLab's dependencies install it) to check
the "iri" string format, and that package compiles a parsing grammar on import: about 0.85 s of
CPU in every process. Notebook validation never checks that format."""


def skip_unused_slow_imports() -> None:
    """In a process the build owns (a worker, the command line), skip the optional imports in
    ``_UNUSED_SLOW_IMPORTS``: jsonschema then leaves its "iri" check out, as it does when the
    package is not installed. A module already imported is left alone."""
    for name in _UNUSED_SLOW_IMPORTS:
        sys.modules.setdefault(name, None)  # type: ignore[arg-type]


def process_pool(workers: int) -> concurrent.futures.ProcessPoolExecutor:
    """Worker processes for a build, started with *spawn* (see the module docstring)."""
    return concurrent.futures.ProcessPoolExecutor(
        max_workers=workers,
        mp_context=multiprocessing.get_context("spawn"),
        initializer=_worker_setup,
    )


def _worker_setup() -> None:
    """A worker process: skip slow unused imports; cache warnings on one line."""
    from calcpack.package.cache import one_line_warnings

    skip_unused_slow_imports()
    one_line_warnings()
    from calcpack.package.interrupt import worker_signals

    worker_signals()


@contextlib.contextmanager
def worker_pool(workers: int) -> Iterator[concurrent.futures.ProcessPoolExecutor | None]:
    """A pool of ``workers`` processes for a build (None for one worker: all in this process).

    On the way out, work not yet started is cancelled, so a failure is reported without
    waiting for the rest of the build's queue.
    """
    if workers <= 1:
        yield None
        return
    pool = process_pool(workers)
    try:
        yield pool
    except KeyboardInterrupt:
        from calcpack.package.interrupt import stop_workers

        stop_workers(pool)  # now, not after the cells running finish
        raise
    finally:
        pool.shutdown(wait=True, cancel_futures=True)


def execute_sheets(
    project: Project,
    *,
    workers: int = 2,
    timeout: float = DEFAULT_CELL_TIMEOUT_S,
    use_cache: bool = True,
    cache_dir: Path | None = None,
    progress: ProgressCallback | None = None,
    sheets: Sequence[SheetEntry] | None = None,
    pool: concurrent.futures.Executor | None = None,
    on_ready: Callable[[ExecutedSheet], None] | None = None,
    exports_dir: Path | None = None,
) -> list[ExecutedSheet]:
    """Execute every sheet of a project (unchanged sheets come from the cache), in dependency
    order: a sheet starts once the sheets it imports from are done (see
    :mod:`calcpack.package.links`), so independent sheets run side by side.

    Args:
        project: the validated project.
        workers: number of worker processes (1 runs in this process).
        timeout: per-cell limit in seconds.
        use_cache: read and write the execution cache.
        cache_dir: cache folder (default ``PROJECT/.calcpack-cache``).
        progress: optional callback for progress display.
        sheets: a subset of the project's sheets (default all).
        pool: worker processes to use (the build shares one pool between execution,
            conversion and layout); by default a pool of ``workers`` is started when more
            than one sheet is to be executed.
        on_ready: called with each sheet as soon as it is available (cached sheets first,
            then executed ones as they finish), so that later stages can start on it.
        exports_dir: the folder for the sheets' exports files in this build (default: a
            temporary folder).

    Raises:
        BuildError: a sheet imports from a sheet not in the project, or the imports form a
            cycle (naming the sheets).
        NotebookExecutionError: the first sheet that failed (in project order), naming the
            cell and the sheets not built because they import from it; the remaining
            executions are cancelled.
    """
    from calcpack.package import links
    from calcpack.package.interrupt import temp_prefix

    if workers < 1:
        raise BuildError(f"Number of workers must be at least 1 (got workers = {workers})")
    cache = cache_dir or project.root / CACHE_DIR_NAME
    todo = list(sheets if sheets is not None else project.sheets)
    deps = links.sheet_dependencies(project, todo)
    by_path = {s.path: s for s in todo}
    waiting = [by_path[p] for p in links.execution_order(list(by_path), deps)]
    results: dict[str, ExecutedSheet] = {}
    exported: dict[str, tuple[dict[str, Any], ...]] = {}
    with contextlib.ExitStack() as stack:
        if exports_dir is None:
            exports_dir = Path(
                stack.enter_context(tempfile.TemporaryDirectory(prefix=temp_prefix("exports")))
            )

        def available(item: ExecutedSheet) -> None:
            from calcpack.package.records import collect_records

            results[item.entry.path] = item
            records = collect_records(json.loads(item.notebook_json))
            exported[item.entry.path] = records.exports
            if records.exports:
                assert exports_dir is not None
                links.write_exports_file(exports_dir, project, item.entry, records.exports)
            if progress:
                progress("cached" if item.from_cache else "executed", item.entry)
            if on_ready:
                on_ready(item)

        def key_of(sheet: SheetEntry) -> str:
            upstream = {d: exported.get(d, ()) for d in deps.get(sheet.path, ()) if d in by_path}
            base = sheet_cache_key(project, sheet)
            extra = links.imports_key(upstream)
            return hashlib.sha256(f"{base}:{extra}".encode()).hexdigest() if extra else base

        def finish(item: ExecutedSheet) -> None:
            if use_cache:
                _store(cache, item.entry, item.cache_key, item.notebook_json)
            available(item)

        def ready() -> list[tuple[SheetEntry, str]]:
            """Start what can start: cached sheets at once, the rest returned with their key."""
            out = []
            changed = True
            while changed:
                changed = False
                for sheet in list(waiting):
                    if not all(d in results for d in deps.get(sheet.path, ()) if d in by_path):
                        continue
                    waiting.remove(sheet)
                    key = key_of(sheet)
                    text = _cached(cache, sheet, key) if use_cache else None
                    if text is not None:
                        now = time.time()
                        available(ExecutedSheet(sheet, text, key, True, 0.0, now, now))
                        changed = True
                    else:
                        out.append((sheet, key))
            return out

        exports = str(exports_dir)
        if pool is None and workers > 1 and len(todo) > 1:
            pool = stack.enter_context(worker_pool(min(workers, len(todo))))
        if pool is None:
            queue = ready()
            while queue:
                sheet, key = queue.pop(0)
                if progress:
                    progress("executing", sheet)
                try:
                    item = execute_sheet(project, sheet, key, timeout, exports)
                except NotebookExecutionError as exc:
                    raise _failed(FailedSheet(sheet, exc), deps) from None
                finish(item)
                queue += ready()
        else:
            _execute_in(
                pool, ready, project, timeout, workers, progress, finish, todo, exports, deps
            )
    return [results[s.path] for s in todo]


def _downstream(sheet: str, deps: dict[str, tuple[str, ...]]) -> list[str]:
    """The sheets that import from ``sheet``, directly or through other sheets."""
    out: list[str] = []
    grew = True
    while grew:
        grew = False
        for path, ups in deps.items():
            if path not in out and any(u == sheet or u in out for u in ups):
                out.append(path)
                grew = True
    return [p for p in deps if p in out]


def _failed(failed: FailedSheet, deps: dict[str, tuple[str, ...]]) -> NotebookExecutionError:
    """The error for a failed sheet, naming the sheets not built because they import from it."""
    error = failed.error
    not_built = _downstream(failed.entry.path, deps)
    if not not_built:
        return error
    return NotebookExecutionError(
        error.sheet,
        error.cell_index,
        error.source_excerpt,
        f"{error.error}. Not built, as they import from it directly or through other sheets: "
        + ", ".join(not_built),
    )


def _execute_in(
    pool: concurrent.futures.Executor,
    ready: Callable[[], list[tuple[SheetEntry, str]]],
    project: Project,
    timeout: float,
    workers: int,
    progress: ProgressCallback | None,
    finish: Callable[[ExecutedSheet], None],
    todo: list[SheetEntry],
    exports: str,
    deps: dict[str, tuple[str, ...]],
) -> None:
    """Execute sheets in the pool as they become ready; ``finish`` each in completion order.

    Only as many sheets as there are workers are handed to the pool at a time, so that what
    ``finish`` hands to the same pool for a sheet that is done (its conversion) runs before the
    next execution rather than after all of them: the build's last minutes then convert only
    the last sheets, on both workers, instead of every sheet.
    """
    queue: list[tuple[SheetEntry, str]] = ready()
    futures: dict[concurrent.futures.Future[ExecutedSheet], tuple[SheetEntry, str]] = {}

    def submit() -> None:
        while queue and len(futures) < workers:
            sheet, key = queue.pop(0)
            future = pool.submit(execute_sheet, project, sheet, key, timeout, exports)
            futures[future] = (sheet, key)
            if progress:
                progress("executing", sheet)

    submit()
    failures: list[tuple[int, FailedSheet]] = []
    order = {s.path: i for i, s in enumerate(todo)}
    while futures:
        done, _ = concurrent.futures.wait(futures, return_when=concurrent.futures.FIRST_COMPLETED)
        for future in done:
            sheet, _ = futures.pop(future)
            try:
                item = future.result()
            except NotebookExecutionError as exc:  # raised in the worker, unpickled as raised
                failures.append((order[sheet.path], FailedSheet(sheet, exc)))
                continue
            except concurrent.futures.process.BrokenProcessPool as exc:
                raise BuildError(
                    f"A worker process executing sheet {sheet.path!r} stopped abruptly "
                    "(out of memory, or a script that starts the build without an "
                    "`if __name__ == '__main__':` guard); try --workers 1"
                ) from exc
            if failures:
                continue
            finish(item)
            queue.extend(ready())
        if not failures:
            submit()
    if failures:
        failures.sort(key=lambda item: item[0])
        raise _failed(failures[0][1], deps)
