"""``calcpack add-sheet``: a sheet from a template, its inputs file, and its project entry."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from calcpack.cli import main
from calcpack.errors import InputError
from calcpack.package.project import load_project
from calcpack.package.scaffold import new_project
from calcpack.package.sheet_templates import add_sheet, sheet_template_names


@pytest.fixture
def project(tmp_path: Path) -> Path:
    folder = tmp_path / "job"
    new_project(folder, number="2440", title="Test job")
    return folder


def test_templates_are_the_starting_points() -> None:
    assert sheet_template_names() == [
        "beam",
        "deck_ledger",
        "footing",
        "free_body",
        "section",
        "site_loads",
        "steel_column",
        "timber_beam",
        "timber_post",
        "truss",
    ]


@pytest.mark.parametrize(
    ("template", "check"),
    [
        ("steel_column", "Compression"),
        ("footing", "Bearing pressure"),
        ("deck_ledger", "Fastener lateral capacity"),
        ("timber_post", "Compression"),
        ("timber_beam", "Bending"),
    ],
)
def test_catalogue_sheets_run_as_made(
    project: Path, monkeypatch: pytest.MonkeyPatch, template: str, check: str
) -> None:
    """The template's code cells run as written in the new sheet's folder (as a build runs
    them: the panel shows nothing there) and record the member checks."""
    added = add_sheet(project, template, title="Post P1")
    nb = json.loads((project / added.notebook).read_text(encoding="utf-8"))
    monkeypatch.chdir((project / added.notebook).parent)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    scope: dict[str, object] = {}
    for cell in nb["cells"]:
        if cell["cell_type"] == "code":
            exec("".join(cell["source"]), scope)
    sheet = scope["s"]
    names = {r.name for r in sheet.checks()}  # type: ignore[attr-defined]
    assert check in names


def test_timber_beam_sheet_runs_for_glulam_and_its_search_picks_a_passing_section(
    project: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    """The timber beam template with its member made glulam: the cells run as written, every
    check of the member is recorded, and the search the sheet's panel runs picks a section
    that passes when written into the file and checked as the sheet checks it."""
    from calcpack.inputs import load_inputs, update_inputs
    from calcpack.inputs.beam_member import (
        beam_member_inputs,
        beam_pick_changes,
        evaluate_beam_member,
        lightest_beam_member,
    )

    added = add_sheet(project, "timber_beam", title="Girder G1")
    inputs = project / str(added.inputs)
    text = inputs.read_text(encoding="utf-8")
    for old, new in (
        ('spans = ["14 ft"]', 'spans = ["18 ft"]'),
        ('material = "sawn"', 'material = "glulam"'),
        ('species = "Douglas Fir-Larch"\n', 'stress_class = "24F-1.8E"\n'),
        ('grade = "No.2"', 'width = "5.125 in"'),
        ('size = "3x12"', 'depth = "12 in"'),
        ('L = "120 lbf/ft"', 'L = "400 lbf/ft"'),
    ):
        assert old in text
        text = text.replace(old, new, 1)
    inputs.write_text(text, encoding="utf-8")
    nb = json.loads((project / added.notebook).read_text(encoding="utf-8"))
    monkeypatch.chdir((project / added.notebook).parent)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    scope: dict[str, object] = {}
    for cell in nb["cells"]:
        if cell["cell_type"] == "code":
            exec("".join(cell["source"]), scope)
    names = {r.name for r in scope["s"].checks()}  # type: ignore[attr-defined]
    assert {"Shear", "Deflection (live)", "Deflection (total)"} <= names
    assert any(n.startswith("Bending") for n in names)
    member = scope["member"]
    best = lightest_beam_member(member, count=1).best  # type: ignore[arg-type]
    assert "24F-1.8E" in best.name
    update_inputs(inputs, beam_pick_changes(member, best.name), tables=("member",))  # type: ignore[arg-type]
    table = load_inputs(inputs, tables=("member",))
    picked = beam_member_inputs(table, scope["demand"], table="member")  # type: ignore[arg-type]
    assert picked.section == best.name
    assert evaluate_beam_member(picked).passed


def test_add_beam_sheet_with_inputs(project: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["add-sheet", "beam", "--title", "Floor beam B2", "--project", str(project)]) == 0
    assert "Added sheet 2: sheets/02_floor_beam_b2.ipynb" in capsys.readouterr().out
    nb_path = project / "sheets" / "02_floor_beam_b2.ipynb"
    nb = json.loads(nb_path.read_text(encoding="utf-8"))
    source = "".join("".join(c["source"]) for c in nb["cells"])
    assert '"02_floor_beam_b2.inputs.toml"' in source
    assert "Floor beam B2" in source
    assert "__TITLE__" not in source
    assert "__INPUTS__" not in source
    assert nb["metadata"]["kernelspec"]["name"] == "python3"  # no kernel-selection dialog
    assert (project / "sheets" / "02_floor_beam_b2.inputs.toml").is_file()
    loaded = load_project(project)
    entry = loaded.sheets[-1]
    assert entry.path == "sheets/02_floor_beam_b2.ipynb"
    assert entry.inputs == ("sheets/02_floor_beam_b2.inputs.toml",)
    # The project file's own comments survive the edit.
    assert "# calcpack project file." in (project / "calcpack.toml").read_text(encoding="utf-8")


def test_add_sheet_numbers_follow_on(project: Path) -> None:
    first = add_sheet(project, "section")
    second = add_sheet(project, "truss", title="Roof truss T1")
    assert (first.number, second.number) == (2, 3)
    assert second.inputs is None  # the truss template writes its values in the sheet
    assert [s.path for s in load_project(project).sheets][1:] == [
        "sheets/02_section.ipynb",
        "sheets/03_roof_truss_t1.ipynb",
    ]


def test_unknown_template_names_the_choices(project: Path) -> None:
    with pytest.raises(InputError, match=r"Unknown sheet template 'girder'.*beam") as info:
        add_sheet(project, "girder")
    assert info.value.name == "template"


def test_existing_sheet_file_is_not_overwritten(project: Path) -> None:
    (project / "sheets" / "02_beam.ipynb").write_text("{}", encoding="utf-8")
    with pytest.raises(InputError, match=r"02_beam\.ipynb' already exists") as info:
        add_sheet(project, "beam")
    assert info.value.name == "name"
    assert (project / "sheets" / "02_beam.ipynb").read_text(encoding="utf-8") == "{}"


def test_no_project_file_is_refused(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["add-sheet", "beam", "--project", str(tmp_path)]) == 1
    assert "No calcpack.toml in" in capsys.readouterr().err


def test_list_templates(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["add-sheet", "--list"]) == 0
    assert capsys.readouterr().out.split() == sheet_template_names()
    assert "steel_column" in sheet_template_names()


def test_new_with_a_sheet_template(tmp_path: Path) -> None:
    folder = tmp_path / "job2"
    assert main(["new", str(folder), "--sheet", "beam"]) == 0
    assert (folder / "sheets" / "02_beam.inputs.toml").is_file()
    assert load_project(folder).sheets[-1].inputs == ("sheets/02_beam.inputs.toml",)


def test_section_sheet_runs_as_made(project: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    """The section template reads its inputs file through the strict reader (an unknown key in
    it is refused) and computes the shape the file describes."""
    added = add_sheet(project, "section", title="Lintel section")
    nb = json.loads((project / added.notebook).read_text(encoding="utf-8"))
    monkeypatch.chdir((project / added.notebook).parent)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    scope: dict[str, object] = {}
    for cell in nb["cells"]:
        if cell["cell_type"] == "code":
            exec("".join(cell["source"]), scope)
    assert type(scope["shape"]).__name__ == "ISection"
