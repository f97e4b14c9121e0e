"""Every sheet imports calcpack, so its import must stay light: computation and working never
pull in plotting, conversion, PDF, Jupyter or signing code."""

from __future__ import annotations

import json
import subprocess
import sys

HEAVY = [
    "matplotlib", "nbconvert", "nbclient", "weasyprint", "IPython", "ipywidgets", "jupyter_client",
    "pyhanko", "pypdf", "ziamath", "rich", "calcpack.plots", "calcpack.package",
    "calcpack.signing", "calcpack.cli", "calcpack.widgets",
]  # fmt: skip

MODULES = [
    "calcpack", "calcpack.units", "calcpack.working", "calcpack.analysis", "calcpack.sections",
    "calcpack.loads", "calcpack.checks", "calcpack.combinations", "calcpack.foundations",
    "calcpack.checks.aci318", "calcpack.checks.en1992", "calcpack.checks.en1997",
    "calcpack.sections.rebar",
]  # fmt: skip


def test_computation_and_working_import_no_heavy_modules():
    code = (
        "import importlib, json, sys\n"
        f"for m in {MODULES!r}: importlib.import_module(m)\n"
        "from calcpack.units import ureg\n"
        "from calcpack.working import Sheet\n"
        "s = Sheet('x'); L = s.given('L', 2 * ureg.m); s.derive('A', L * L)\n"
        f"print(json.dumps([h for h in {HEAVY!r} if h in sys.modules]))\n"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout
    assert json.loads(out.strip().splitlines()[-1]) == []
