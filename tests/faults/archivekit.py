"""Helpers for the archive fault-injection tests: a small project built and signed once."""

from __future__ import annotations

import shutil
from pathlib import Path
from typing import Any

from tests.build.projectkit import make_project

SHEETS = {
    "Joist J1": [
        'L = s.given("L", 3.2 * ureg.m, "span")\n'
        'w = s.given("w", 2.5 * ureg.kN / ureg.m, "line load")\n'
        's.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")'
    ],
}


def built_project(root: Path) -> tuple[Path, Path]:
    """A one-sheet project built with ``calcpack build``; returns (project folder, PDF)."""
    from calcpack.cli import main

    project = make_project(root / "project", SHEETS)
    assert main(["build", str(project), "--quiet", "--workers", "1"]) == 0
    (pdf,) = (project / "build").glob("*.pdf")
    return project, pdf


def copy_project(source: Path, target: Path) -> Path:
    """A copy of a project folder with its build output and cache."""
    shutil.copytree(source, target)
    return target


def sign(pdf: Path, role: str, demo: Any, **kwargs: Any) -> None:
    """Sign ``pdf`` in place as ``role`` with the demo key of that role."""
    from calcpack.signing.sign import sign_package

    sign_package(pdf, role, demo.keys[role], demo.password, **kwargs)
