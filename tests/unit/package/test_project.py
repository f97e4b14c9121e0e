"""The project file: a valid file loads; each missing or malformed field names file and field."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import pytest

from calcpack.package.project import ProjectFileError, load_project

VALID = """
[job]
number = "2417"
title = "Lintel over new opening"
client = "Invented Client Ltd"
site = "1 Nowhere Lane"
units = "SI"

[people]
preparer = "A. Okafor"
checker = { name = "J. Lindqvist", date = 2026-11-19 }
approver = "R. Mbeki"

[[revisions]]
rev = "A"
date = 2026-11-20
description = "First issue"

[[sheets]]
path = "sheets/one.ipynb"

[design]
standards = ["Demo standard"]
"""


def write(tmp_path: Path, text: str) -> Path:
    (tmp_path / "sheets").mkdir(exist_ok=True)
    (tmp_path / "sheets" / "one.ipynb").write_text("{}", encoding="utf-8")
    (tmp_path / "calcpack.toml").write_text(text, encoding="utf-8")
    return tmp_path


def test_valid_project_loads(tmp_path: Path) -> None:
    project = load_project(write(tmp_path, VALID))
    assert project.job_number == "2417"
    assert project.paper == "A4"  # the default
    assert project.checker.date == dt.date(2026, 11, 19)
    assert project.preparer.date is None
    assert project.revision.rev == "A"
    assert project.sheets[0].number == "1"
    assert project.sheets[0].title is None
    assert project.design.standards == ("Demo standard",)


def test_a_revision_may_be_marked_issued(tmp_path: Path) -> None:
    text = VALID.replace(
        'description = "First issue"', 'description = "First issue"\nissued = true'
    )
    text += '\n[[revisions]]\nrev = "B"\ndate = 2026-12-01\ndescription = "Second"\n'
    project = load_project(write(tmp_path, text.replace("[[sheets]]", "\n[[sheets]]", 1)))
    assert [r.issued for r in project.revisions] == [True, False]  # default: not issued


def test_folder_without_project_file(tmp_path: Path) -> None:
    with pytest.raises(ProjectFileError, match=r"calcpack\.toml") as info:
        load_project(tmp_path)
    assert info.value.name == "project"


def test_invalid_toml_is_reported(tmp_path: Path) -> None:
    with pytest.raises(ProjectFileError, match="not valid TOML"):
        load_project(write(tmp_path, VALID + "\n[job\n"))


def _without(text: str, line: str) -> str:
    assert line in text
    return text.replace(line, "")


@pytest.mark.parametrize(
    ("edit", "field", "words"),
    [
        (lambda t: _without(t, 'number = "2417"\n'), "job.number", "is missing"),
        (lambda t: _without(t, 'title = "Lintel over new opening"\n'), "job.title", "missing"),
        (lambda t: _without(t, 'client = "Invented Client Ltd"\n'), "job.client", "missing"),
        (lambda t: _without(t, 'site = "1 Nowhere Lane"\n'), "job.site", "missing"),
        (lambda t: t.replace('units = "SI"', 'units = "metric"'), "job.units", "'SI' or 'US'"),
        (
            lambda t: t.replace('units = "SI"', 'units = "SI"\npaper = "A3"'),
            "job.paper",
            "'A4' or 'Letter'",
        ),
        (lambda t: t.replace('number = "2417"', "number = 2417"), "job.number", "is int"),
        (lambda t: t.replace('number = "2417"', 'number = " "'), "job.number", "is empty"),
        (lambda t: _without(t, 'preparer = "A. Okafor"\n'), "people.preparer", "is missing"),
        (lambda t: t.replace('approver = "R. Mbeki"', "approver = 3"), "people.approver", "is int"),
        (
            lambda t: t.replace(
                '{ name = "J. Lindqvist", date = 2026-11-19 }',
                '{ name = "J. Lindqvist", date = "yesterday" }',
            ),
            "people.checker.date",
            "TOML date",
        ),
        (lambda t: _without(t, "date = 2026-11-20\n"), "revisions[1].date", "is missing"),
        (
            lambda t: t.replace("date = 2026-11-20", 'date = "20/11/2026"'),
            "revisions[1].date",
            "TOML date",
        ),
        (
            lambda t: _without(t, 'description = "First issue"\n'),
            "revisions[1].description",
            "missing",
        ),
        (lambda t: t.replace("[[revisions]]", "[[revision]]"), "revision", "mean 'revisions'"),
        (
            lambda t: t + '\n[[revisions]]\nrev = "A"\ndate = 2026-11-21\ndescription = "x"\n',
            "revisions[2].rev",
            "repeats",
        ),
        (
            lambda t: t + '\n[[revisions]]\nrev = "B"\ndate = 2026-10-01\ndescription = "x"\n',
            "revisions[2].date",
            "earlier",
        ),
        (
            lambda t: t.replace('path = "sheets/one.ipynb"', 'path = "sheets/two.ipynb"'),
            "sheets[1].path",
            "does not exist",
        ),
        (
            lambda t: t.replace('path = "sheets/one.ipynb"', 'path = "sheets/one.txt"'),
            "sheets[1].path",
            ".ipynb",
        ),
        (
            lambda t: t.replace(
                'path = "sheets/one.ipynb"', 'path = "sheets/one.ipynb"\ntitle = 5'
            ),
            "sheets[1].title",
            "non-empty string",
        ),
        (
            lambda t: t.replace(
                'path = "sheets/one.ipynb"', 'path = "sheets/one.ipynb"\ninputs = ["missing.csv"]'
            ),
            "sheets[1].inputs[1]",
            "does not exist",
        ),
        (lambda t: t.replace("[[sheets]]", "[[sheet]]"), "sheet", "did you mean 'sheets'"),
        (
            lambda t: t.replace('standards = ["Demo standard"]', "standards = []"),
            "design.standards",
            "is empty",
        ),
        (
            lambda t: t.replace('standards = ["Demo standard"]', 'standards = [""]'),
            "design.standards[1]",
            "non-empty string",
        ),
        (
            lambda t: t.replace('standards = ["Demo standard"]', ""),
            "design.standards",
            "is missing",
        ),
        (lambda t: t.replace("[design]", "[designs]"), "designs", "did you mean 'design'"),
        (lambda t: t + "\n[extra]\nx = 1\n", "extra", "not a known table"),
        (
            lambda t: t.replace('description = "First issue"', 'description = "x"\nissued = "yes"'),
            "revisions[1].issued",
            "true or false",
        ),
    ],
)
def test_each_bad_field_names_file_and_field(
    tmp_path: Path, edit: object, field: str, words: str
) -> None:
    assert callable(edit)
    with pytest.raises(ProjectFileError) as info:
        load_project(write(tmp_path, edit(VALID)))
    message = str(info.value)
    assert message.startswith("calcpack.toml: "), message
    assert f"'{field}'" in message, message
    assert words in message, message
    assert info.value.name == field
    assert info.value.expected


def test_paths_use_forward_slashes_and_numbers_may_be_given(tmp_path: Path) -> None:
    text = VALID.replace(
        'path = "sheets/one.ipynb"', 'path = "sheets\\\\one.ipynb"\nnumber = 7\ntitle = "Loads"'
    )
    project = load_project(write(tmp_path, text))
    assert project.sheets[0].path == "sheets/one.ipynb"
    assert project.sheets[0].number == "7"
    assert project.sheets[0].title == "Loads"
