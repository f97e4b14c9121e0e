"""Fault injection: refusals at the door (issue 15, point 5).

Each test feeds one bad input a new user could give and asserts the safe outcome: nothing
executed or written, and a one-line message naming the input, its value and what is valid.
The rules are common practice for a tool whose output is signed (fail before work, not after).
"""

from __future__ import annotations

import hashlib
import json
import os
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import main
from calcpack.errors import BuildError, InputError, SigningError
from calcpack.package.pipeline import build
from calcpack.package.project import ProjectFileError, load_project
from tests.build.projectkit import make_project
from tests.unit.signing.signing_helpers import attach_manifest, cover_pdf, make_manifest

SHEETS = {"Joist J1": ['s.given("L", 3.2 * ureg.m, "span")']}


@pytest.fixture
def project(tmp_path: Path) -> Path:
    return make_project(tmp_path / "job", SHEETS)


@pytest.fixture
def no_execution(monkeypatch: pytest.MonkeyPatch) -> None:
    """Fail the test if the build gets as far as executing a sheet."""
    from calcpack.package import pipeline

    def refuse(*args: Any, **kwargs: Any) -> Any:
        raise AssertionError("a sheet was executed")

    monkeypatch.setattr(pipeline, "execute_sheets", refuse)


def _toml(project: Path, old: str, new: str) -> None:
    path = project / "calcpack.toml"
    text = path.read_text("utf-8")
    assert old in text
    path.write_text(text.replace(old, new, 1), "utf-8")


# --- the cell time limit ---------------------------------------------------------------


@pytest.mark.parametrize("value", [0.0, -5.0, float("nan"), float("inf")])
def test_a_timeout_that_would_never_stop_a_cell_is_refused(
    project: Path, value: float, no_execution: None
) -> None:
    with pytest.raises(InputError) as info:
        build(project, timeout=value, workers=1)
    assert info.value.name == "timeout"
    assert f"got timeout = {value!r}" in str(info.value)


@pytest.mark.parametrize("text", ["0", "-1", "nan", "soon"])
def test_the_command_line_refuses_a_timeout_that_is_not_positive(
    project: Path, text: str, capsys: pytest.CaptureFixture[str]
) -> None:
    with pytest.raises(SystemExit) as info:
        main(["build", str(project), "--timeout", text])
    assert info.value.code == 2
    assert f"must be a positive number of seconds (got --timeout {text})" in capsys.readouterr().err


# --- the project file ------------------------------------------------------------------


@pytest.mark.parametrize(
    ("old", "new", "field"),
    [
        ('path = "sheets/01.ipynb"', 'path = "../outside.ipynb"', "sheets[1].path"),
        (
            'title = "Joist J1"',
            'title = "Joist J1"\ninputs = ["../secret.toml"]',
            "sheets[1].inputs[1]",
        ),
        ("[job]", 'inputs = ["/etc/hostname"]\n\n[job]', "inputs[1]"),
    ],
)
def test_paths_outside_the_project_folder_are_refused(
    project: Path, old: str, new: str, field: str
) -> None:
    (project.parent / "outside.ipynb").write_text((project / "sheets" / "01.ipynb").read_text())
    (project.parent / "secret.toml").write_text("x = 1\n")
    _toml(project, old, new)
    with pytest.raises(ProjectFileError) as info:
        load_project(project)
    assert info.value.name == field
    assert "leads outside the project folder" in str(info.value)


@pytest.mark.parametrize(
    ("old", "new", "field", "hint"),
    [
        (
            'description = "Test issue"',
            'description = "Test issue"\nissue = true',
            "revisions[1].issue",
            "'issued'",
        ),
        (
            'site = "1 Test Street"',
            'site = "1 Test Street"\nfirm_adress = "x"',
            "job.firm_adress",
            "'firm_address'",
        ),
        (
            'checker = "C. Hecker"',
            'checker = "C. Hecker"\ncheker = "x"',
            "people.cheker",
            "'checker'",
        ),
        ('title = "Joist J1"', 'title = "Joist J1"\ninput = ["x"]', "sheets[1].input", "'inputs'"),
        (
            'standards = ["Test standard"]',
            'standards = ["Test standard"]\nstandard = "x"',
            "design.standard",
            "'standards'",
        ),
        ("[design]", "[desing]", "desing", "'design'"),
    ],
)
def test_unknown_keys_in_the_project_file_are_refused_with_a_suggestion(
    project: Path, old: str, new: str, field: str, hint: str
) -> None:
    _toml(project, old, new)
    with pytest.raises(ProjectFileError) as info:
        load_project(project)
    assert info.value.name == field
    assert f"did you mean {hint}?" in str(info.value)


# --- template placeholders -------------------------------------------------------------


def test_template_placeholders_refuse_signing_naming_the_fields(tmp_path: Path) -> None:
    from calcpack.signing.keys import make_demo_credentials
    from calcpack.signing.sign import sign_package

    demo = make_demo_credentials(tmp_path / "keys")
    manifest = make_manifest()
    manifest["project"].update(preparer="Preparer's name", client="Client name")
    pdf = tmp_path / "package.pdf"
    pdf.write_bytes(attach_manifest(cover_pdf(), manifest))
    before = pdf.read_bytes()
    with pytest.raises(SigningError) as info:
        sign_package(pdf, "preparer", demo.keys["preparer"], demo.password)
    message = str(info.value)
    assert 'job.client = "Client name"' in message
    assert 'people.preparer = "Preparer\'s name"' in message
    assert pdf.read_bytes() == before


def test_every_placeholder_is_one_the_new_project_template_writes() -> None:
    from calcpack.contract.placeholders import TEMPLATE_PLACEHOLDERS
    from calcpack.package import scaffold

    template = scaffold._PROJECT_TEMPLATE
    for text in TEMPLATE_PLACEHOLDERS.values():
        assert text in template


def test_the_build_warns_of_placeholders(project: Path) -> None:
    from calcpack.package.publish import placeholder_warnings

    _toml(project, 'preparer = "P. Reparer"', 'preparer = "Preparer\'s name"')
    (warning,) = placeholder_warnings(load_project(project))
    assert "people.preparer" in warning
    assert "Preparer's name" in warning


# --- the checker and the review log ----------------------------------------------------


def test_the_checker_is_refused_when_the_review_log_changed_after_the_build(
    tmp_path: Path,
) -> None:
    from calcpack.signing.keys import make_demo_credentials
    from calcpack.signing.review import REVIEW_FILE, add_comment, close_comment
    from calcpack.signing.sign import sign_package

    demo = make_demo_credentials(tmp_path / "keys")
    job = tmp_path / "job"
    (job / "sheets").mkdir(parents=True)
    (job / "sheets" / "01-lintel.ipynb").write_text("{}")
    add_comment(job, sheet="sheets/01-lintel.ipynb", text="Check L.", who="Tomas Redfern")
    close_comment(job, "C1", who="Tomas Redfern")
    recorded = hashlib.sha256((job / REVIEW_FILE).read_bytes()).hexdigest()
    files = [{"path": REVIEW_FILE, "sha256": recorded, "role": "review"}]
    pdf = job / "package.pdf"
    pdf.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=files)))
    sign_package(pdf, "preparer", demo.keys["preparer"], demo.password)
    add_comment(job, sheet="sheets/01-lintel.ipynb", text="And w.", who="Tomas Redfern")
    close_comment(job, "C2", who="Tomas Redfern")  # all closed, but the package shows only C1
    before = pdf.read_bytes()
    with pytest.raises(SigningError) as info:
        sign_package(pdf, "checker", demo.keys["checker"], demo.password)
    assert "review log it prints is older than" in str(info.value)
    assert REVIEW_FILE in str(info.value)
    assert pdf.read_bytes() == before


# --- the output folder -----------------------------------------------------------------


def test_an_output_folder_whose_parent_is_missing_is_refused_before_executing(
    project: Path, tmp_path: Path, no_execution: None
) -> None:
    out = tmp_path / "no" / "such" / "folder"
    with pytest.raises(BuildError, match="does not exist and neither does its parent"):
        build(project, out_dir=out, workers=1)
    assert not out.parent.exists()


def test_an_output_path_that_is_a_file_is_refused_before_executing(
    project: Path, tmp_path: Path, no_execution: None
) -> None:
    out = tmp_path / "a-file"
    out.write_text("x")
    with pytest.raises(BuildError, match="is a file, not a folder"):
        build(project, out_dir=out, workers=1)


def test_a_read_only_output_folder_is_refused_before_executing(
    project: Path, tmp_path: Path, no_execution: None, monkeypatch: pytest.MonkeyPatch
) -> None:
    import tempfile

    out = tmp_path / "out"
    out.mkdir()
    if os.geteuid() != 0:  # the real fault; root writes anyway, so inject the refusal too
        out.chmod(0o555)
    else:

        def denied(*args: Any, **kwargs: Any) -> Any:
            raise PermissionError(13, "Permission denied")

        monkeypatch.setattr(tempfile, "NamedTemporaryFile", denied)
    try:
        with pytest.raises(BuildError) as info:
            build(project, out_dir=out, workers=1)
    finally:
        out.chmod(0o755)
    assert str(out) in str(info.value)
    assert "is not writable (Permission denied); nothing was executed" in str(info.value)


# --- review comments -------------------------------------------------------------------


def test_review_add_refuses_a_quantity_the_sheet_does_not_record(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    from calcpack.signing.review import add_comment

    job = tmp_path / "job"
    (job / "sheets").mkdir(parents=True)
    (job / "sheets" / "01-lintel.ipynb").write_text("{}")
    with pytest.raises(InputError, match="build the package first"):
        add_comment(job, sheet="sheets/01-lintel.ipynb", text="?", who="T", quantity="w")
    (job / "build").mkdir()
    (job / "build" / "p.manifest.json").write_text(json.dumps(make_manifest()))
    with pytest.raises(InputError) as info:
        add_comment(job, sheet="sheets/01-lintel.ipynb", text="?", who="T", quantity="M_mx")
    assert info.value.name == "quantity"
    assert "got quantity = 'M_mx'" in str(info.value)
    assert "did you mean 'M_max'" in str(info.value)
    code = main(
        [
            "review",
            "add",
            "sheets/01-lintel.ipynb",
            "?",
            "--quantity",
            "NOPE",
            "--project",
            str(job),
            "--by",
            "T",
        ]
    )
    assert code == 1
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1
    assert "records no quantity 'NOPE'" in err[0]
    assert not (job / "review.toml").exists()  # nothing written
    assert add_comment(job, sheet="sheets/01-lintel.ipynb", text="?", who="T", quantity="w")
