"""Benchmark the package build against the bare pipeline on the same notebooks.

Run from a checkout (not collected by pytest)::

    python tests/benchmarks/bench_build.py            # 20 sheets
    python tests/benchmarks/bench_build.py --sheets 200 --memory   # peak memory only
    python tests/benchmarks/bench_build.py --sheets 200 --memory --project /tmp/p200
        # keeps the project (and its execution cache) to re-measure the layout alone

It prints, for an N-sheet project made from the demo sheets:

- cold build with 2 workers, and with 1 worker, and their ratio: each build is the command line
  (``python -m calcpack.cli build``) in a process of its own, as a user runs it, on a fresh
  copy of the project; ``--rounds R`` repeats the pair, alternating which goes first, and the
  medians are compared;
- execution alone with 1 and 2 workers (in this process);
- each speed-up against how much faster two processes run than one on the machine at that
  moment (measured just after; other load on the machine lowers it);
- the bare pipeline in the same run: stock nbclient execution + stock nbconvert HTML + WeasyPrint,
  math left as TeX, one PDF per notebook -- and the ratio of the build to it;
- a no-change rebuild as a fraction of the cold build;
- peak resident memory of the build process and of its worker/kernel processes (``--memory``
  builds once and also samples the whole process tree).

Targets (issue 4): <= 1.3x the bare pipeline cold; <= 5 % of cold for a no-change rebuild;
>= 1.7x from 2 workers; peak memory < 1 GB for 200 sheets.
"""

from __future__ import annotations

import argparse
import contextlib
import os
import re
import resource
import shutil
import statistics
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT))
os.environ["PYTHONPATH"] = os.pathsep.join(
    p for p in (str(ROOT), os.environ.get("PYTHONPATH", "")) if p
)

from calcpack.package.execute import execute_sheets  # noqa: E402
from calcpack.package.pipeline import build  # noqa: E402
from calcpack.package.project import load_project  # noqa: E402
from calcpack.package.scaffold import demo_project_source  # noqa: E402


def make_project(root: Path, sheets: int) -> Path:
    """An N-sheet project cycling through the demo sheets (each copy its own notebook).

    Every copy reads its own inputs file, with the floor dead load varied, so that the sheets
    differ (different substituted values and results, hence different formula images).
    """
    import tomllib

    source = demo_project_source()
    (root / "sheets").mkdir(parents=True)
    (root / "inputs").mkdir()
    toml = (source / "calcpack.toml").read_text("utf-8")
    listed = tomllib.loads(toml)["sheets"]
    head = toml[: toml.index("[[sheets]]")]
    tail = toml[toml.index("[design]") :]
    entries = []
    for i in range(sheets):
        entry = listed[i % len(listed)]
        nb = source / entry["path"]
        name = f"sheets/{i + 1:03d}_{nb.stem}.ipynb"
        text = nb.read_text("utf-8")
        inputs = []
        for inp in entry.get("inputs", []):
            data = (source / inp).read_text("utf-8")
            data = re.sub(
                r'(floor_dead = ")(\d+)( psf")',
                lambda m, i=i: f"{m[1]}{int(m[2]) + i / 10:g}{m[3]}",
                data,
            )
            own = f"inputs/{i + 1:03d}_{Path(inp).name}"
            (root / own).write_text(data, "utf-8")
            text = text.replace(Path(inp).name, Path(own).name)
            inputs.append(own)
        (root / name).write_text(text, "utf-8")
        entries.append(
            f'[[sheets]]\npath = "{name}"\ntitle = "Sheet {i + 1}: {entry["title"]}"\n'
            f"inputs = {inputs!r}\n".replace("'", '"')
        )
    (root / "calcpack.toml").write_text(head + "\n".join(entries) + "\n" + tail, "utf-8")
    return root


def cli_build(project: Path, workers: int) -> tuple[float, int]:
    """A cold build from the command line in a process of its own: (seconds, pages)."""
    import json
    import subprocess

    command = [sys.executable, "-m", "calcpack.cli", "build", str(project), "--quiet"]
    start = time.perf_counter()
    subprocess.run([*command, "--workers", str(workers)], check=True, stdout=subprocess.DEVNULL)
    seconds = time.perf_counter() - start
    manifest = next((project / "build").glob("*.manifest.json"))
    return seconds, int(json.loads(manifest.read_text("utf-8"))["build"]["pages"])


def bare_pipeline(project: Path, out: Path) -> float:
    """Stock nbclient + stock nbconvert HTML + WeasyPrint, serially; returns seconds."""
    import nbformat
    from nbclient import NotebookClient
    from nbconvert import HTMLExporter
    from weasyprint import HTML

    start = time.perf_counter()
    out.mkdir(parents=True, exist_ok=True)
    exporter = HTMLExporter()
    for path in sorted((project / "sheets").glob("*.ipynb")):
        nb = nbformat.read(path, as_version=4)
        NotebookClient(
            nb, timeout=120, resources={"metadata": {"path": str(path.parent)}}
        ).execute()
        body, _ = exporter.from_notebook_node(nb)
        HTML(string=body, base_url=str(path.parent)).write_pdf(out / f"{path.stem}.pdf")
    return time.perf_counter() - start


def _spin(_: int) -> int:
    total = 0
    for i in range(30_000_000):
        total += i
    return total


def machine_parallelism() -> float:
    """Speed-up of two CPU-bound processes over one on this machine (2.0 = two free cores)."""
    import multiprocessing

    t = time.perf_counter()
    _spin(0)
    one = time.perf_counter() - t
    with multiprocessing.get_context("spawn").Pool(2) as pool:
        pool.map(abs, [0, 1])  # let both workers finish starting before timing
        t = time.perf_counter()
        pool.map(_spin, [0, 1])
        two = time.perf_counter() - t
    return 2 * one / two


class TreeSampler:
    """Samples the resident memory of this process and all its descendants (psutil).

    ru_maxrss gives each process's own peak; the sum over the process tree (build process,
    workers, kernels) at one instant is what the machine must hold, so it is sampled.
    """

    def __init__(self, interval_s: float = 0.1) -> None:
        import threading

        self.interval_s = interval_s
        self.peak_total_mb = 0.0
        self._stop = threading.Event()
        self._thread = threading.Thread(target=self._run, daemon=True)

    def _run(self) -> None:
        import psutil

        me = psutil.Process()
        while not self._stop.is_set():
            total = 0
            for proc in [me, *me.children(recursive=True)]:
                with contextlib.suppress(psutil.Error):  # a process that just ended
                    total += proc.memory_info().rss
            self.peak_total_mb = max(self.peak_total_mb, total / 2**20)
            self._stop.wait(self.interval_s)

    def __enter__(self) -> TreeSampler:
        self._thread.start()
        return self

    def __exit__(self, *exc: object) -> None:
        self._stop.set()
        self._thread.join()


def memory_run(project: Path, sheets: int, workers: int) -> None:
    """Build once and print peak memory (the process-wide peaks of this run)."""
    reuse = (project / "calcpack.toml").is_file()
    if not reuse:
        make_project(project, sheets)
    t = time.perf_counter()
    with TreeSampler() as sampler:
        result = build(project, workers=workers, force=True)
    seconds = time.perf_counter() - t
    me, children = peak_mb()
    print(
        f"build of {sheets} sheets ({result.page_count} pages, {len(result.executed)} executed, "
        f"{len(result.cached)} from the cache): {seconds:.1f} s"
    )
    print(f"peak RSS, build process:            {me:7.0f} MB  (target < 1024 MB)")
    print(f"peak RSS, largest worker or kernel: {children:7.0f} MB")
    print(f"peak RSS, whole process tree (sampled every 0.1 s): {sampler.peak_total_mb:7.0f} MB")


def speed_up(what: str, serial: float, parallel: float) -> None:
    """Print the 2-worker speed-up against what the machine allows right now."""
    bound = machine_parallelism()
    achieved = serial / parallel
    print(
        f"  {what}: 2 workers are {achieved:.2f}x faster; two processes run {bound:.2f}x as "
        f"fast as one on this machine now, so {achieved / bound:.0%} of the possible speed-up "
        "(target 1.7x on 2 free cores = 85 %)"
    )


def peak_mb() -> tuple[float, float]:
    """Peak RSS (MB) of this process and of the largest finished child process."""
    self_kb = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    child_kb = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss
    return self_kb / 1024, child_kb / 1024


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--sheets", type=int, default=20)
    parser.add_argument("--skip-bare", action="store_true")
    parser.add_argument("--skip-serial", action="store_true")
    parser.add_argument(
        "--memory", action="store_true", help="only build once and print peak memory"
    )
    parser.add_argument(
        "--project", type=Path, help="with --memory: project folder to make or reuse (kept)"
    )
    parser.add_argument("--workers", type=int, default=2)
    parser.add_argument(
        "--rounds", type=int, default=1, help="cold builds with 1 and 2 workers, R times each"
    )
    args = parser.parse_args()
    if args.memory:
        if args.project:
            memory_run(args.project, args.sheets, args.workers)
            return 0
        work = Path(tempfile.mkdtemp(prefix="calcpack-bench-"))
        try:
            memory_run(work / "project", args.sheets, args.workers)
        finally:
            shutil.rmtree(work, ignore_errors=True)
        return 0

    work = Path(tempfile.mkdtemp(prefix="calcpack-bench-"))
    try:
        print(f"{args.sheets}-sheet project in {work}")
        print(
            f"machine: two CPU-bound processes run {machine_parallelism():.2f}x as fast as one"
            " (the ceiling for the 2-worker speed-up)"
        )
        times: dict[int, list[float]] = {1: [], 2: []}
        for r in range(args.rounds):
            order = (2, 1) if r % 2 == 0 or args.skip_serial else (1, 2)
            for workers in order:
                if workers == 1 and args.skip_serial:
                    continue
                project = make_project(work / f"round{r}-workers{workers}", args.sheets)
                seconds, pages = cli_build(project, workers)
                times[workers].append(seconds)
                print(
                    f"build, cold, {workers} worker{'s' if workers > 1 else ''}"
                    f"{'' if workers > 1 else ' '} (round {r + 1}): {seconds:7.1f} s"
                    f"  ({pages} pages)"
                )
        cold2 = statistics.median(times[2])
        two = work / "round0-workers2"

        t = time.perf_counter()
        again = build(two, workers=2)
        nochange = time.perf_counter() - t
        assert again.up_to_date
        print(
            f"build, no change:           {nochange:7.2f} s  = {nochange / cold2:.1%} of cold"
            "  (target <= 5 %)"
        )

        path = two / "sheets" / sorted(p.name for p in (two / "sheets").iterdir())[0]
        path.write_text(
            path.read_text("utf-8").replace("floor dead load", "floor dead load "), "utf-8"
        )
        t = time.perf_counter()
        one_changed = build(two, workers=2)
        print(
            f"build, one sheet changed:   {time.perf_counter() - t:7.1f} s  "
            f"({len(one_changed.executed)} executed)"
        )

        if not args.skip_serial:
            cold1 = statistics.median(times[1])
            speed_up(f"whole build (median of {args.rounds})", cold1, cold2)
            one = work / "round0-workers1"

            # Execution alone (no cache), the same notebooks, 1 then 2 workers.
            project = load_project(one)
            t = time.perf_counter()
            execute_sheets(project, workers=1, use_cache=False)
            exec1 = time.perf_counter() - t
            t = time.perf_counter()
            execute_sheets(project, workers=2, use_cache=False)
            exec2 = time.perf_counter() - t
            print(f"execution only: 1 worker {exec1:7.1f} s, 2 workers {exec2:7.1f} s")
            speed_up("execution", exec1, exec2)

        me, children = peak_mb()
        print(
            f"peak memory: this process {me:.0f} MB, largest child (a build, worker or kernel)"
            f" {children:.0f} MB"
            "  (target < 1 GB for 200 sheets)"
        )

        if not args.skip_bare:
            bare_project = make_project(work / "bare", args.sheets)
            bare = bare_pipeline(bare_project, work / "bare-out")
            print(f"bare pipeline, serial:      {bare:7.1f} s")
            print(f"ratio build(2 workers)/bare: {cold2 / bare:.2f}  (target <= 1.3)")
            if not args.skip_serial:
                print(f"ratio build(1 worker)/bare:  {cold1 / bare:.2f}")
    finally:
        shutil.rmtree(work, ignore_errors=True)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
