"""Sheets read their inputs with calcpack.inputs in every build: reading and evaluating must not
pull in widgets, plotting, Jupyter or the build."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

HEAVY = [
    "matplotlib", "nbconvert", "weasyprint", "IPython", "ipywidgets", "tomlkit",
    "calcpack.plots", "calcpack.package", "calcpack.widgets.beam", "calcpack.widgets.fields",
]  # fmt: skip

TEMPLATE = Path(__file__).resolve().parents[3] / "templates" / "sheets" / "beam.inputs.toml"


def test_reading_and_evaluating_inputs_stays_light() -> None:
    code = (
        "import json, sys\n"
        "import calcpack.widgets\n"  # the package itself loads its panels lazily
        "from calcpack.inputs import load_inputs, beam_inputs, evaluate_beam\n"
        f"out = evaluate_beam(beam_inputs(load_inputs({str(TEMPLATE)!r})))\n"
        "assert out.bending_utilisation > 0\n"
        f"print(json.dumps([h for h in {HEAVY!r} if h in sys.modules]))\n"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout
    assert json.loads(out.strip().splitlines()[-1]) == []
