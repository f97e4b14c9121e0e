"""`jupyter nbconvert --to calcpack-pdf` on one sheet: the job fields come from the project
file in a folder above, and a sheet saved without outputs is run first (never an empty sheet)."""

from __future__ import annotations

import io
import shutil
from pathlib import Path

import nbformat
import pytest
from pypdf import PdfReader

from calcpack.errors import BuildError
from calcpack.package.convert import CalcpackPDFExporter, not_executed
from calcpack.package.project import find_project_above

LINTEL_DEMO = Path(__file__).resolve().parents[2] / "example_projects" / "lintel_demo"


def test_project_file_is_found_in_a_parent_folder(tmp_path: Path) -> None:
    shutil.copytree(LINTEL_DEMO, tmp_path / "job")
    assert find_project_above(tmp_path / "job" / "sheets") == tmp_path / "job" / "calcpack.toml"
    assert find_project_above(tmp_path / "job" / "sheets" / "01_loads.ipynb") == (
        tmp_path / "job" / "calcpack.toml"
    )
    assert find_project_above(tmp_path) is None


def test_unexecuted_notebook_is_recognised() -> None:
    nb = nbformat.read(LINTEL_DEMO / "sheets" / "01_loads.ipynb", as_version=4)
    assert not_executed(nb)  # example notebooks are stored without outputs
    nb.cells[-1].execution_count = 3
    assert not not_executed(nb)
    assert not not_executed(nbformat.v4.new_notebook())  # nothing to run: not refused


def test_an_unexecuted_sheet_without_its_file_is_refused() -> None:
    nb = nbformat.read(LINTEL_DEMO / "sheets" / "01_loads.ipynb", as_version=4)
    exporter = CalcpackPDFExporter()
    with pytest.raises(BuildError, match="has no outputs and its file was not found"):
        exporter.from_notebook_node(nb, resources={"metadata": {"name": "gone", "path": "/"}})


@pytest.mark.build
def test_one_sheet_takes_the_job_from_the_project_above_and_is_run(tmp_path: Path) -> None:
    shutil.copytree(LINTEL_DEMO, tmp_path / "job", ignore=shutil.ignore_patterns(".calcpack-*"))
    sheet = tmp_path / "job" / "sheets" / "01_loads.ipynb"
    pdf, _ = CalcpackPDFExporter().from_filename(str(sheet))
    text = " ".join(p.extract_text() for p in PdfReader(io.BytesIO(pdf)).pages)
    text = " ".join(text.split())
    assert "2417" in text  # job number from calcpack.toml one folder up
    assert "14 Quarry Row" in text
    assert "Loads on lintel L1" in text  # the sheet's title as listed there
    assert "kN/m" in text  # the working is there: the notebook was run
