"""Every sheet imports calcpack, so its import must stay light: importing every module of
computation and the working (the layers in ``tests/layering.py``) and writing a step loads no
plotting, conversion, PDF, Jupyter or signing code."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

from tests.layering import COMPUTATION, HEAVY

PACKAGE = Path(__file__).resolve().parents[2] / "calcpack"


def _computation_modules() -> list[str]:
    names = []
    for path in sorted(PACKAGE.rglob("*.py")):
        parts = path.relative_to(PACKAGE.parent).with_suffix("").parts
        name = ".".join(parts[:-1] if parts[-1] == "__init__" else parts)
        if any(name == layer or name.startswith(layer + ".") for layer in COMPUTATION):
            names.append(name)
    return names


def test_computation_and_working_import_no_heavy_modules() -> None:
    modules = ["calcpack", *_computation_modules()]
    assert len(modules) > 50
    code = (
        "import importlib, json, sys\n"
        f"for m in {modules!r}: importlib.import_module(m)\n"
        "from calcpack.units import ureg\n"
        "from calcpack.working import Sheet\n"
        "s = Sheet('x'); L = s.given('L', 2 * ureg.m); s.derive('A', L * L)\n"
        f"print(json.dumps([h for h in {list(HEAVY)!r} if h in sys.modules]))\n"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout
    assert json.loads(out.strip().splitlines()[-1]) == []
