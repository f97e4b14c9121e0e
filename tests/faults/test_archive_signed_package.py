"""Fault injection: a signed package is never lost or rewritten by a build (issue 15, point 1).

Each test starts from a built package signed by the preparer (and the checker), changes one
thing a user would change, runs the build again and asserts the safe outcome: the signed PDF
byte-identical where it was, or moved whole into ``superseded/``; refusals name the file and
its signers. The rule itself is common practice for issued documents (a signed record is
superseded by a new revision, never edited).
"""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import main
from calcpack.errors import SignedPackageError
from calcpack.package.pipeline import build
from tests.faults.archivekit import built_project, copy_project, sign

pytestmark = pytest.mark.build

PEOPLE = {"preparer": "P. Reparer", "checker": "C. Hecker", "approver": "A. Pprover"}


@pytest.fixture(scope="module")
def demo(tmp_path_factory: pytest.TempPathFactory) -> Any:
    from calcpack.signing.keys import make_demo_credentials

    return make_demo_credentials(tmp_path_factory.mktemp("keys"), people=PEOPLE)


@pytest.fixture(scope="module")
def signed_source(tmp_path_factory: pytest.TempPathFactory, demo: Any) -> Path:
    """A built project whose package is signed by the preparer."""
    project, pdf = built_project(tmp_path_factory.mktemp("signed"))
    sign(pdf, "preparer", demo)
    return project


@pytest.fixture
def signed(signed_source: Path, tmp_path: Path) -> tuple[Path, Path, bytes]:
    project = copy_project(signed_source, tmp_path / "project")
    (pdf,) = (project / "build").glob("*.pdf")
    return project, pdf, pdf.read_bytes()


def _mark_issued(project: Path) -> None:
    toml = project / "calcpack.toml"
    text = toml.read_text("utf-8")
    toml.write_text(
        text.replace('description = "Test issue"\n', 'description = "Test issue"\nissued = true\n')
    )


def _change_span(project: Path) -> None:
    nb = project / "sheets" / "01.ipynb"
    nb.write_text(nb.read_text("utf-8").replace("3.2 * ureg.m", "3.6 * ureg.m"), "utf-8")


def test_marking_the_revision_issued_keeps_the_signed_pdf_and_writes_the_kept_manifest(
    signed: tuple[Path, Path, bytes],
) -> None:
    project, pdf, before = signed
    _mark_issued(project)
    result = build(project, workers=1)
    assert pdf.read_bytes() == before  # byte-identical: the signatures stay valid
    assert result.up_to_date
    kept = project / "issued" / "A.manifest.json"
    assert json.loads(kept.read_text("utf-8"))["project"]["revision"] == "A"


def test_a_changed_sheet_is_refused_naming_the_file_and_its_signers(
    signed: tuple[Path, Path, bytes], capsys: pytest.CaptureFixture[str]
) -> None:
    project, pdf, before = signed
    _change_span(project)
    with pytest.raises(SignedPackageError) as info:
        build(project, workers=1)
    assert info.value.path == str(pdf)
    assert info.value.signers == (("preparer", "P. Reparer"),)
    message = str(info.value)
    assert pdf.name in message
    assert "P. Reparer (preparer)" in message
    assert "--supersede-signed" in message
    assert "new revision" in message
    assert pdf.read_bytes() == before
    # the command line: one line, exit 1, the PDF untouched
    assert main(["build", str(project), "--quiet", "--workers", "1"]) == 1
    err = capsys.readouterr().err.strip().splitlines()
    assert len(err) == 1
    assert "P. Reparer (preparer)" in err[0]
    assert pdf.read_bytes() == before


def test_force_on_an_unchanged_signed_package_leaves_it_alone(
    signed: tuple[Path, Path, bytes],
) -> None:
    project, pdf, before = signed
    result = build(project, workers=1, force=True)
    assert result.up_to_date
    assert pdf.read_bytes() == before


def test_supersede_moves_the_signed_package_aside_and_never_overwrites(
    signed: tuple[Path, Path, bytes], demo: Any, capsys: pytest.CaptureFixture[str]
) -> None:
    project, pdf, before = signed
    manifest_before = pdf.with_name(pdf.name.replace(".pdf", ".manifest.json")).read_bytes()
    _change_span(project)
    assert main(["build", str(project), "--quiet", "--workers", "1", "--supersede-signed"]) == 0
    assert "superseded" in capsys.readouterr().out
    moved = project / "build" / "superseded" / pdf.name
    assert moved.read_bytes() == before
    assert moved.with_name(moved.name.replace(".pdf", ".manifest.json")).read_bytes() == (
        manifest_before
    )
    new = pdf.read_bytes()
    assert new != before
    assert b"/ByteRange" not in new
    # sign the new one, change again, supersede again: the first one is still there, intact
    sign(pdf, "preparer", demo)
    second = pdf.read_bytes()
    nb = project / "sheets" / "01.ipynb"
    nb.write_text(nb.read_text("utf-8").replace("3.6 * ureg.m", "3.9 * ureg.m"), "utf-8")
    build(project, workers=1, supersede_signed=True)
    assert moved.read_bytes() == before
    assert (moved.parent / pdf.name.replace(".pdf", "-2.pdf")).read_bytes() == second


def test_a_package_signed_while_the_build_ran_is_not_replaced(
    signed_source: Path, tmp_path: Path, demo: Any, monkeypatch: pytest.MonkeyPatch
) -> None:
    """The check is made again just before writing (the PDF may be signed meanwhile)."""
    from calcpack.package import publish

    project = copy_project(signed_source, tmp_path / "project")
    (pdf,) = (project / "build").glob("*.pdf")
    calls: list[bool] = []
    real = publish.make_way

    def unsigned_at_first(pdf_path: Path, manifest_path: Path, *, supersede: bool) -> Any:
        calls.append(supersede)
        if len(calls) == 1:
            return None  # the package looked unsigned at the door
        return real(pdf_path, manifest_path, supersede=supersede)

    monkeypatch.setattr(publish, "make_way", unsigned_at_first)
    before = pdf.read_bytes()
    _change_span(project)
    with pytest.raises(SignedPackageError):
        build(project, workers=1)
    assert len(calls) == 2
    assert pdf.read_bytes() == before
    assert not list(pdf.parent.glob(".*.tmp"))  # no temporary output left behind
