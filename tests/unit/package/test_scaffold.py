"""`calcpack new` scaffolds a valid project; the demo project is found."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import nbformat
import pytest

from calcpack.cli import main
from calcpack.errors import InputError
from calcpack.package.project import load_project
from calcpack.package.scaffold import demo_project_source, new_project


def test_new_project_loads(tmp_path: Path) -> None:
    project_file = new_project(
        tmp_path / "job", number="3100", title="Deck at 2 Elm Row", today=dt.date(2026, 3, 1)
    )
    project = load_project(project_file)
    assert project.job_number == "3100"
    assert project.revision.date == dt.date(2026, 3, 1)
    nb = nbformat.read(project.sheet_path(project.sheets[0]), as_version=4)
    assert all(not c.get("outputs") for c in nb.cells if c.cell_type == "code")
    assert "calcpack.working" in nb.cells[1].source


def test_new_command(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["new", str(tmp_path / "j"), "--units", "US", "--paper", "Letter"]) == 0
    assert "Created" in capsys.readouterr().out
    project = load_project(tmp_path / "j")
    assert (project.units, project.paper) == ("US", "Letter")


def test_new_refuses_a_folder_in_use(tmp_path: Path) -> None:
    (tmp_path / "notes.txt").write_text("keep me", "utf-8")
    with pytest.raises(InputError, match="not empty") as info:
        new_project(tmp_path)
    assert info.value.name == "PROJECT"
    assert main(["new", str(tmp_path)]) == 1
    assert (tmp_path / "notes.txt").read_text("utf-8") == "keep me"


def test_bad_job_number_is_named(tmp_path: Path) -> None:
    with pytest.raises(InputError, match="number") as info:
        new_project(tmp_path / "x", number='12"3')
    assert info.value.name == "number"


def test_demo_project_is_found_and_valid() -> None:
    project = load_project(demo_project_source())
    # every notebook in the demo's sheets folder is a sheet of the project, none is missing
    on_disk = {p.resolve() for p in (project.root / "sheets").glob("*.ipynb")}
    assert {project.sheet_path(s).resolve() for s in project.sheets} == on_disk
    assert len(project.sheets) >= 5  # loads, beam, posts, connections, checker's verification
    for sheet in project.sheets:
        nb = nbformat.read(project.sheet_path(sheet), as_version=4)
        assert nb.metadata["kernelspec"]["name"] == "python3"
        assert all(not c.get("outputs") for c in nb.cells if c.cell_type == "code")
