"""Shared fixtures for the build tests: the lintel demo job built once, small projects."""

from __future__ import annotations

import io
import json
import shutil
from collections.abc import Sequence
from pathlib import Path
from typing import Any

import nbformat
import pytest
from pypdf import PdfReader

from calcpack.cli import main

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


@pytest.fixture
def new_project() -> Any:
    """``make_project`` as a fixture: ``new_project(root, {title: [code cells]})``."""
    return make_project


LINTEL_DEMO = Path(__file__).resolve().parents[2] / "example_projects" / "lintel_demo"


@pytest.fixture(scope="session")
def demo_dir(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """The lintel demo job (example_projects/lintel_demo) built once with `calcpack build`.

    Returns the output folder; the copied project is its ``project`` subfolder.
    """
    folder = tmp_path_factory.mktemp("demo") / "lintel"
    shutil.copytree(
        LINTEL_DEMO, folder / "project", ignore=shutil.ignore_patterns(".calcpack-cache", "build")
    )
    assert main(["build", str(folder / "project"), "--out", str(folder), "--quiet"]) == 0
    return folder


@pytest.fixture(scope="session")
def demo_pdf(demo_dir: Path) -> Path:
    (pdf,) = demo_dir.glob("*.pdf")
    return pdf


@pytest.fixture(scope="session")
def demo_manifest(demo_dir: Path) -> dict[str, Any]:
    (path,) = demo_dir.glob("*.manifest.json")
    result: dict[str, Any] = json.loads(path.read_text("utf-8"))
    return result


@pytest.fixture(scope="session")
def demo_reader(demo_pdf: Path) -> PdfReader:
    return PdfReader(io.BytesIO(demo_pdf.read_bytes()))


@pytest.fixture(scope="session")
def demo_texts(demo_reader: PdfReader) -> list[str]:
    """The text layer of every page, whitespace collapsed."""
    return [" ".join(page.extract_text().split()) for page in demo_reader.pages]
