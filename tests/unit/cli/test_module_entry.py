"""``python -m calcpack`` runs the command line; lazily loading packages list their names."""

from __future__ import annotations

import importlib.util
import pkgutil
import subprocess
import sys
from pathlib import Path

import calcpack


def test_python_dash_m_calcpack_runs_the_command_line() -> None:
    out = subprocess.run(
        [sys.executable, "-m", "calcpack", "--help"], capture_output=True, text=True, check=False
    )
    assert out.returncode == 0, out.stderr
    assert "usage: calcpack" in out.stdout
    for command in ("build", "sign", "verify"):
        assert command in out.stdout


def _lazily_loading_packages() -> list[str]:
    """Every calcpack package whose ``__init__`` defines a module ``__getattr__`` (PEP 562)."""
    found = []
    for info in pkgutil.walk_packages(calcpack.__path__, "calcpack."):
        if not info.ispkg:
            continue
        init = Path(importlib.util.find_spec(info.name).origin or "")
        if "__getattr__" in init.read_text("utf-8"):
            found.append(info.name)
    return ["calcpack", *found]


def test_every_lazily_loading_package_lists_its_names_before_they_load() -> None:
    packages = _lazily_loading_packages()
    assert {"calcpack", "calcpack.widgets"} <= set(packages)
    for name in packages:
        code = (
            f"import sys, {name} as p; names = set(p.__all__); "
            "unloaded = sorted(n for n in names if n not in vars(p)); "
            "listed = set(dir(p)); "
            "print(len(unloaded), sorted(names - listed))"
        )
        out = subprocess.run(
            [sys.executable, "-c", code], capture_output=True, text=True, check=True
        )
        count, missing = out.stdout.split(" ", 1)
        assert int(count) > 0, f"{name} loads nothing lazily: no need for __getattr__"
        assert missing.strip() == "[]", f"dir({name}) leaves out {missing.strip()}"
