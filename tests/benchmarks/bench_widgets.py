"""Benchmark: beam panel edit -> updated display, for a three-span beam (target < 100 ms).

Run with ``python tests/benchmarks/bench_widgets.py``. Not a timed test: the machine's load
varies, so the result is also reported as ratios against references measured in the same run --
the beam solve itself (all load cases and both combinations) and one plain numpy operation
(a 200 × 200 matrix product) -- and the absolute times are printed beside them.

An "edit" is what happens when the engineer changes a value in the panel: the new value is
validated, written to the inputs file (comments kept), the beam is solved per load case and
combined, the checks made, and the diagrams and results table redrawn.
"""

from __future__ import annotations

import shutil
import statistics
import sys
import tempfile
import time
from collections.abc import Callable
from pathlib import Path

import numpy as np

REPO = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(REPO))

TARGET_S = 0.100


def _median_time(fn: Callable[[], object], repeat: int) -> float:
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def main(repeat: int = 15) -> int:
    from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs
    from calcpack.units import Q_
    from calcpack.widgets.beam import BeamPanel

    src = REPO / "example_projects" / "garden_studio" / "sheets" / "01_ridge_beam.inputs.toml"
    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / src.name
        shutil.copy(src, path)
        panel = BeamPanel(path)
        spans = [3.8, 4.2, 4.6, 5.0]
        k = [0]

        def edit() -> None:
            k[0] += 1
            panel.set("beam.spans[2]", Q_(spans[k[0] % len(spans)], "m"))

        edit()  # warm caches (pint unit parsing, imports)
        t_edit = _median_time(edit, repeat)
        recorded = panel.last_update_s
        inputs = beam_inputs(load_inputs(path))
        t_solve = _median_time(lambda: evaluate_beam(inputs), repeat)
        a = np.random.default_rng(1).random((200, 200))
        t_numpy = _median_time(lambda: a @ a, repeat * 4)

    print("Beam panel edit -> updated display (three-span beam, 3 loads, 2 cases)")
    print(f"  edit, median of {repeat}:           {t_edit * 1e3:8.2f} ms  (target < 100 ms)")
    print(f"  last edit as timed by the panel:   {recorded * 1e3:8.2f} ms")
    print(f"  reference: beam solve + checks:    {t_solve * 1e3:8.2f} ms")
    print(f"  reference: numpy 200x200 matmul:   {t_numpy * 1e3:8.3f} ms")
    print(f"  ratio edit / beam solve:           {t_edit / t_solve:8.2f}")
    print(f"  ratio edit / numpy matmul:         {t_edit / t_numpy:8.1f}")
    verdict = "within" if t_edit < TARGET_S else "OVER"
    print(f"  {verdict} the 100 ms target")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
