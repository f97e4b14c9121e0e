"""The keys, sign, verify, review and diff commands, and where the password may never go."""

from __future__ import annotations

import hashlib
import json
import shutil
from pathlib import Path
from typing import Any

import pytest
from signing_helpers import attach_manifest, cover_pdf, make_manifest

from calcpack.cli import main

PASSWORD = "Unguessable-Pw-7d2f9q"


def _run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def _password_forms(password: str) -> list[bytes]:
    return [
        password.encode("utf-8"),
        password.encode("utf-16-le"),
        password.encode("utf-16-be"),
        password.encode("utf-8").hex().encode(),
    ]


def test_whole_flow_on_the_command_line_never_leaks_the_password(
    tmp_path: Path,
    base_package: Path,
    capsys: pytest.CaptureFixture[str],
    monkeypatch: pytest.MonkeyPatch,
) -> None:
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", PASSWORD)
    monkeypatch.setenv("CALCPACK_USER", "Tomas Redfern")
    project = tmp_path / "job"
    (project / "sheets").mkdir(parents=True)
    (project / "sheets" / "01-lintel.ipynb").write_text("{}")
    (project / "build").mkdir()
    (project / "build" / "package.manifest.json").write_text(json.dumps(make_manifest()))
    pdf = project / "package.pdf"
    shutil.copy(base_package, pdf)
    keys = tmp_path / "keys"
    outputs: list[str] = []

    def run(*argv: str) -> int:
        code, out, err = _run(capsys, *argv)
        outputs.extend([out, err])
        return code

    common = ["--firm", "Harrowgate & Vell", "--out", str(keys)]
    assert run("keys", "new", "--name", "Ines Calloway", "--role", "preparer", *common) == 0
    assert run("keys", "new", "--name", "Tomas Redfern", "--role", "checker", *common) == 0
    prep_key, check_key = keys / "ines-calloway.p12", keys / "tomas-redfern.p12"
    assert run("sign", str(pdf), "--role", "preparer", "--key", str(prep_key)) == 0
    assert "Signed as preparer by Ines Calloway" in outputs[-2]

    p = ["--project", str(project)]
    assert run("review", "add", "sheets/01-lintel.ipynb", "Check w.", "--quantity", "w", *p) == 0
    assert outputs[-2].strip() == "C1 opened on sheets/01-lintel.ipynb, w"
    assert run("sign", str(pdf), "--role", "checker", "--key", str(check_key)) == 1
    assert outputs[-1].startswith("calcpack: error: The checker cannot sign while review")
    assert len(outputs[-1].strip().splitlines()) == 1  # one line, no traceback
    assert run("review", "answer", "C1", "Now 1.5 m wide.", "--by", "Ines Calloway", *p) == 0
    assert run("review", "close", "C1", *p) == 0
    assert run("review", "list", *p) == 0
    assert "C1 [closed]" in outputs[-2]
    assert "Ines Calloway (answered): Now 1.5 m wide." in outputs[-2]
    # the package prints the review log as it was when built: rebuild, sign again, then check
    assert run("sign", str(pdf), "--role", "checker", "--key", str(check_key)) == 1
    assert "was built before the review log" in outputs[-1]
    review = (project / "review.toml").read_bytes()
    files = [
        {"path": "review.toml", "sha256": hashlib.sha256(review).hexdigest(), "role": "review"}
    ]
    pdf.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=files)))
    assert run("sign", str(pdf), "--role", "preparer", "--key", str(prep_key)) == 0
    assert run("sign", str(pdf), "--role", "checker", "--key", str(check_key)) == 0

    trust = ["--trust", str(keys / "ines-calloway.crt"), "--trust", str(keys / "tomas-redfern.crt")]
    assert run("verify", str(pdf), *trust) == 0
    assert "VALID  preparer (certification): Ines Calloway" in outputs[-2]
    assert "VALID  checker: Tomas Redfern" in outputs[-2]
    assert outputs[-2].rstrip().endswith("Verification PASSED")
    assert run("verify", str(pdf), "--trust", str(keys / "ines-calloway.crt")) == 1
    assert "FAILED  checker" in outputs[-2]

    # the password never appears in any output or any file written
    written = [f for f in tmp_path.rglob("*") if f.is_file()]
    assert len(written) >= 5
    for form in _password_forms(PASSWORD):
        for text in outputs:
            assert form.decode("latin-1") not in text
        for f in written:
            assert form not in f.read_bytes(), f


def test_wrong_password_from_the_environment(
    tmp_path: Path,
    package: Path,
    demo: Any,
    capsys: pytest.CaptureFixture[str],
    monkeypatch: pytest.MonkeyPatch,
) -> None:
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", "Not-The-Password-1")
    original = package.read_bytes()
    code, out, err = _run(
        capsys, "sign", str(package), "--role", "preparer", "--key", str(demo.keys["preparer"])
    )
    assert code == 1
    assert "wrong password" in err
    assert "Not-The-Password-1" not in out + err
    assert package.read_bytes() == original


def test_no_password_option_exists(capsys: pytest.CaptureFixture[str], package: Path) -> None:
    with pytest.raises(SystemExit) as info:
        main(["sign", str(package), "--role", "preparer", "--key", "k.p12", "--password", "x"])
    assert info.value.code == 2
    assert "unrecognized arguments: --password" in capsys.readouterr().err


def test_diff_command_prints_the_table(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    old = make_manifest()
    new = make_manifest()
    new["sheets"][1]["values"][0]["value"] = 30.0
    new["project"]["revision"] = "B"
    pdf = cover_pdf()
    (tmp_path / "a.pdf").write_bytes(attach_manifest(pdf, old))
    (tmp_path / "b.pdf").write_bytes(attach_manifest(pdf, new))
    code, out, _ = _run(capsys, "diff", str(tmp_path / "a.pdf"), str(tmp_path / "b.pdf"))
    assert code == 0
    lines = out.splitlines()
    assert lines[0] == "Revision A -> B"
    assert lines[1].split() == ["Sheet", "What", "Name", "Old", "New"]
    assert lines[3].split() == ["2", "Post", "P1", "input", "N", "27.2", "kN", "30", "kN"]
    assert len(lines) == 4


def test_verify_of_a_file_that_is_not_a_package(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    (tmp_path / "x.pdf").write_bytes(attach_manifest(cover_pdf(), None))
    code, _, err = _run(capsys, "verify", str(tmp_path / "x.pdf"))
    assert code == 1
    assert "is not a calcpack package" in err
