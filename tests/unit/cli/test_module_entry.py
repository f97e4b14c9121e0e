"""``python -m calcpack`` runs the command line; lazily loading packages list their names."""

from __future__ import annotations

import subprocess
import sys

import calcpack
import calcpack.widgets


def test_python_dash_m_calcpack_runs_the_command_line() -> None:
    out = subprocess.run(
        [sys.executable, "-m", "calcpack", "--help"], capture_output=True, text=True, check=False
    )
    assert out.returncode == 0, out.stderr
    assert "usage: calcpack" in out.stdout
    for command in ("build", "sign", "verify"):
        assert command in out.stdout


def test_lazy_packages_list_their_lazy_names() -> None:
    assert {"Beam", "Manifest", "build", "Verdict"} <= set(dir(calcpack))
    assert {"beam_panel", "section_panel", "preview"} <= set(dir(calcpack.widgets))
