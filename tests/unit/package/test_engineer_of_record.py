"""The engineer-of-record block on the cover, read from the project file."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from calcpack.package.document import _cover, _engineer_row, _seal_box
from calcpack.package.project import ProjectFileError, load_project

LINTEL_DEMO = Path(__file__).resolve().parents[3] / "example_projects" / "lintel_demo"

SEAL = (
    '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100">'
    '<circle cx="50" cy="50" r="45" fill="none" stroke="black"/></svg>'
)


def _project_with(tmp_path: Path, table: str) -> Path:
    folder = tmp_path / "job"
    shutil.copytree(LINTEL_DEMO, folder, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
    text = (folder / "calcpack.toml").read_text(encoding="utf-8")
    (folder / "calcpack.toml").write_text(text + "\n" + table, encoding="utf-8")
    return folder


def test_block_carries_name_licence_jurisdiction_and_the_seal(tmp_path: Path) -> None:
    folder = _project_with(
        tmp_path,
        '[engineer_of_record]\nname = "R. Mbeki"\nlicence = "PE 48213"\n'
        'jurisdiction = "Eastmoor County (fictional)"\nseal = "seal.svg"\n',
    )
    (folder / "seal.svg").write_text(SEAL, encoding="utf-8")
    project = load_project(folder)
    assert project.engineer is not None
    assert project.engineer.seal == folder / "seal.svg"
    row = _engineer_row(project)
    for text in ("Engineer of record", "R. Mbeki", "PE 48213", "Eastmoor County (fictional)"):
        assert text in row
    # the firm's seal is embedded (the package is one file) with words for a screen reader,
    # in a box beside the sign-off signatures
    box = _seal_box(project)
    assert 'src="data:image/svg+xml;base64,' in box
    assert 'alt="Seal of R. Mbeki, licence number PE 48213, Eastmoor County (fictional)"' in box
    cover = _cover(project, [])
    assert (
        cover.index("Approved by") < cover.index(box) < cover.index('</table>\n<div class="note">')
    )


def test_without_an_engineer_the_block_leaves_room_to_fill_in() -> None:
    project = load_project(LINTEL_DEMO)
    assert "name, licence number, jurisdiction" in _engineer_row(project)
    assert '<div class="hint">Seal</div>' in _seal_box(project)


@pytest.mark.parametrize(
    ("table", "field", "message"),
    [
        ('name = "A"\nlicence = "PE 1"\n', "engineer_of_record.jurisdiction", "is missing"),
        (
            'name = "A"\nlicence = "PE 1"\njurisdiction = "X"\nseal = "none.png"\n',
            "engineer_of_record.seal",
            "does not exist",
        ),
        (
            'name = "A"\nlicence = "PE 1"\njurisdiction = "X"\nseal = "calcpack.toml"\n',
            "engineer_of_record.seal",
            "PNG, JPEG or SVG",
        ),
    ],
)
def test_a_bad_table_names_its_field(tmp_path: Path, table: str, field: str, message: str) -> None:
    folder = _project_with(tmp_path, "[engineer_of_record]\n" + table)
    with pytest.raises(ProjectFileError, match=message) as err:
        load_project(folder)
    assert err.value.name == field
