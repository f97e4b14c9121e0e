"""Small test projects for the build tests (a module of its own, so test files can import it
by a name that no other folder's conftest shares)."""

from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path

import nbformat

PROJECT_TOML = """
[job]
number = "9001"
title = "Test job"
client = "Invented Client"
site = "1 Test Street"
units = "SI"

[people]
preparer = "P. Reparer"
checker = "C. Hecker"
approver = "A. Pprover"

[[revisions]]
rev = "A"
date = 2026-01-15
description = "Test issue"

{sheets}

[design]
standards = ["Test standard"]
"""

SHEET_HEAD = (
    "from calcpack import ureg\nfrom calcpack.working import Sheet\n"
    's = Sheet("{title}", system="SI")'
)


def write_notebook(path: Path, title: str, cells: Sequence[str]) -> None:
    """A sheet notebook: a title heading, the calcpack imports, then ``cells`` as code."""
    nb = nbformat.v4.new_notebook()
    nb.metadata = {
        "kernelspec": {"name": "python3", "display_name": "Python 3", "language": "python"}
    }
    nb.cells = [
        nbformat.v4.new_markdown_cell(f"# {title}"),
        nbformat.v4.new_code_cell(SHEET_HEAD.format(title=title)),
        *[nbformat.v4.new_code_cell(c) for c in cells],
    ]
    path.parent.mkdir(parents=True, exist_ok=True)
    nbformat.write(nb, path)


def make_project(root: Path, sheets: dict[str, Sequence[str]]) -> Path:
    """A project folder with one notebook per entry {title: code cells}; returns the folder."""
    entries = []
    for i, (title, cells) in enumerate(sheets.items(), start=1):
        name = f"sheets/{i:02d}.ipynb"
        write_notebook(root / name, title, cells)
        entries.append(f'[[sheets]]\npath = "{name}"\ntitle = "{title}"\n')
    (root / "calcpack.toml").write_text(PROJECT_TOML.format(sheets="\n".join(entries)), "utf-8")
    return root
