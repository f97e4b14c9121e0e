"""Review comments: the file, the open -> answered -> closed cycle, and the checker's gate."""

from __future__ import annotations

import shutil
import tomllib
from pathlib import Path
from typing import Any

import pytest

from calcpack.errors import InputError, SigningError
from calcpack.signing.review import (
    REVIEW_FILE,
    add_comment,
    answer_comment,
    close_comment,
    load_review,
    reopen_comment,
)
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package


@pytest.fixture
def project(tmp_path: Path) -> Path:
    root = tmp_path / "job-2417"
    (root / "sheets").mkdir(parents=True)
    (root / "sheets" / "01-lintel.ipynb").write_text('{"cells": []}')
    (root / "sheets" / "02-post.ipynb").write_text('{"cells": []}')
    # the latest build's manifest: what each sheet recorded (review add --quantity reads it)
    import json

    from signing_helpers import make_manifest

    (root / "build").mkdir()
    (root / "build" / "2417-calcs-revA.manifest.json").write_text(json.dumps(make_manifest()))
    return root


def test_comment_cycle_and_history(project: Path) -> None:
    c1 = add_comment(
        project,
        sheet="sheets/01-lintel.ipynb",
        quantity="w",
        text="Load width for w looks like 1.2 m; drawing shows 1.5 m.",
        who="Tomas Redfern",
    )
    c2 = add_comment(
        project, sheet="sheets/02-post.ipynb", text="State the effective length.", who="T R"
    )
    assert (c1.id, c2.id) == ("C1", "C2")
    assert c1.status == "open"

    answered = answer_comment(project, "C1", text="Revised to 1.5 m, see rev B.", who="Ines")
    assert answered.status == "answered"
    closed = close_comment(project, "C1", who="Tomas Redfern", text="Agreed.")
    assert closed.status == "closed"
    reopened = reopen_comment(project, "C1", text="Sorry, w is still 1.2 m.", who="Tomas")
    assert reopened.status == "open"

    log = load_review(project)
    assert [c.id for c in log.comments] == ["C1", "C2"]
    history = log.get("C1").history
    assert [(e.who, e.action) for e in history] == [
        ("Tomas Redfern", "opened"),
        ("Ines", "answered"),
        ("Tomas Redfern", "closed"),
        ("Tomas", "reopened"),
    ]
    assert all(e.when.endswith("+00:00") for e in history)
    assert log.get("C1").quantity == "w"
    assert [c.id for c in log.unresolved()] == ["C1", "C2"]

    text = log.text()
    assert "C1 [open] sheets/01-lintel.ipynb, w" in text
    assert "Tomas Redfern (opened): Load width for w" in text


def test_review_file_is_plain_toml(project: Path) -> None:
    add_comment(project, sheet="sheets/01-lintel.ipynb", text="Line one.\nLine two.", who="TR")
    raw = (project / REVIEW_FILE).read_text(encoding="utf-8")
    assert raw.startswith("# Review comments")
    data = tomllib.loads(raw)
    assert data["comments"][0]["sheet"] == "sheets/01-lintel.ipynb"
    assert data["comments"][0]["text"] == "Line one.\nLine two."
    assert data["comments"][0]["by"] == "TR"
    assert "history" not in data["comments"][0]  # nothing has happened since it was opened
    answer_comment(project, "C1", text="Done.", who="IC")
    data = tomllib.loads((project / REVIEW_FILE).read_text(encoding="utf-8"))
    assert data["comments"][0]["history"] == [
        {
            "when": data["comments"][0]["history"][0]["when"],
            "who": "IC",
            "action": "answered",
            "text": "Done.",
        }
    ]
    assert '"""' in raw  # multi-line text stays readable in a diff
    assert not [p for p in project.iterdir() if p.name.endswith(".tmp")]


def test_bad_inputs_name_what_is_wrong(project: Path) -> None:
    with pytest.raises(InputError, match=r"Sheet 'sheets/09-roof\.ipynb' is not a file"):
        add_comment(project, sheet="sheets/09-roof.ipynb", text="?", who="TR")
    with pytest.raises(InputError, match="text must not be empty"):
        add_comment(project, sheet="sheets/01-lintel.ipynb", text="  ", who="TR")
    with pytest.raises(InputError, match="No review comment with id 'C7'"):
        answer_comment(project, "C7", text="x", who="IC")
    add_comment(project, sheet="sheets/01-lintel.ipynb", text="Check.", who="TR")
    close_comment(project, "C1", who="TR")
    with pytest.raises(InputError, match="Comment C1 is closed; it can be answered only when"):
        answer_comment(project, "C1", text="late", who="IC")
    with pytest.raises(InputError, match=r"Project directory .*nowhere.* does not exist"):
        load_review(project / "nowhere")


def test_malformed_review_file(project: Path) -> None:
    (project / REVIEW_FILE).write_text(
        '[[comments]]\nid = "C1"\nsheet = "s"\nstatus = "done"\nby = "TR"\ndate = "x"\ntext = "?"\n'
    )
    with pytest.raises(InputError, match="status = 'done'"):
        load_review(project)
    (project / REVIEW_FILE).write_text("[[comment]\n")
    with pytest.raises(InputError, match="not valid TOML"):
        load_review(project)


def _prepared(project: Path, base_package: Path, demo: Any) -> Path:
    """The package as a build would make it now (its manifest lists the review file as it
    stands), signed by the preparer."""
    import hashlib

    from signing_helpers import attach_manifest, cover_pdf, make_manifest

    pdf = project / "issue" / "package.pdf"
    pdf.parent.mkdir(exist_ok=True)
    review = project / REVIEW_FILE
    files = (
        [
            {
                "path": REVIEW_FILE,
                "sha256": hashlib.sha256(review.read_bytes()).hexdigest(),
                "role": "review",
            }
        ]
        if review.is_file()
        else []
    )
    if files:
        pdf.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=files)))
    else:
        shutil.copy(base_package, pdf)
    sign_package(pdf, "preparer", demo.keys["preparer"], demo.password)
    return pdf


def test_open_comments_block_the_checker(project: Path, base_package: Path, demo: Any) -> None:
    add_comment(project, sheet="sheets/01-lintel.ipynb", text="Check w.", who="Tomas Redfern")
    add_comment(project, sheet="sheets/02-post.ipynb", text="Check N.", who="Tomas Redfern")
    answer_comment(project, "C2", text="Done.", who="Ines Calloway")
    pdf = _prepared(project, base_package, demo)
    before = pdf.read_bytes()
    # the review file is found beside the package (one level up) without --project
    with pytest.raises(SigningError, match=r"not closed: C1 \(open, .*C2 \(answered"):
        sign_package(pdf, "checker", demo.keys["checker"], demo.password)
    assert pdf.read_bytes() == before
    close_comment(project, "C1", who="Tomas Redfern")
    close_comment(project, "C2", who="Tomas Redfern")
    # the package still prints the review log from before the comments were closed
    with pytest.raises(SigningError, match="review log it prints is older"):
        sign_package(pdf, "checker", demo.keys["checker"], demo.password)
    assert pdf.read_bytes() == before
    pdf = _prepared(project, base_package, demo)  # rebuilt and signed again by the preparer
    result = sign_package(pdf, "checker", demo.keys["checker"], demo.password)
    assert result.overridden == ()
    assert load_review(project).overrides == ()


def test_override_is_recorded_in_the_review_log_and_the_signature(
    project: Path, base_package: Path, demo: Any
) -> None:
    add_comment(project, sheet="sheets/01-lintel.ipynb", text="Typo in title.", who="TR")
    pdf = _prepared(project, base_package, demo)
    reason = "Cosmetic only; to be fixed in revision B"
    result = sign_package(
        pdf,
        "checker",
        demo.keys["checker"],
        demo.password,
        project=project,
        override_open_comments=reason,
    )
    assert result.overridden == ("C1",)
    log = load_review(project)
    assert len(log.overrides) == 1
    override = log.overrides[0]
    assert (override.who, override.reason, override.comments) == ("Tomas Redfern", reason, ("C1",))
    assert "OVERRIDE" in log.text()
    assert reason in log.text()
    report = verify_package(pdf, [demo.root])
    assert report.ok, report.text()
    checker = report.signatures[1]
    assert checker.reason is not None
    assert "C1 not closed" in checker.reason
    assert reason in checker.reason


def test_review_file_listed_but_not_found_needs_the_project(tmp_path: Path, demo: Any) -> None:
    from signing_helpers import attach_manifest, cover_pdf, make_manifest

    pdf = tmp_path / "lonely" / "package.pdf"
    pdf.parent.mkdir()
    listing = [{"path": REVIEW_FILE, "sha256": "0" * 64, "role": "review"}]
    pdf.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=listing)))
    sign_package(pdf, "preparer", demo.keys["preparer"], demo.password)
    with pytest.raises(SigningError, match=r"--project DIR"):
        sign_package(pdf, "checker", demo.keys["checker"], demo.password)
