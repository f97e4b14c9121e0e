"""The demo's signing step: preparer and checker sign with demo keys; verify passes."""

from __future__ import annotations

import shutil
from pathlib import Path
from types import SimpleNamespace
from typing import Any

import pytest
from signing_helpers import attach_manifest, cover_pdf, make_manifest

from calcpack.errors import SigningError
from calcpack.signing.demo import after_build_sign, sign_demo_package
from calcpack.signing.verify import verify_package


def test_demo_package_is_signed_by_the_people_on_its_cover(tmp_path: Path) -> None:
    manifest = make_manifest()
    manifest["project"].update(preparer="A. Okafor", checker="J. Lindqvist", firm="Fernbrook")
    pdf = tmp_path / "demo.pdf"
    pdf.write_bytes(attach_manifest(cover_pdf(), manifest))
    signoff = sign_demo_package(pdf, tmp_path)
    assert not signoff.reused
    report = verify_package(pdf, [signoff.root])
    assert report.ok, report.text()
    assert [(s.role, s.signer) for s in report.signatures] == [
        ("preparer", "A. Okafor"),
        ("checker", "J. Lindqvist"),
    ]
    assert report.unsigned_roles == ("approver",)
    assert signoff.verify_command == f"calcpack verify {pdf} --trust {signoff.root}"
    again = sign_demo_package(pdf, tmp_path)  # a second demo run on the same package
    assert again.reused
    assert verify_package(pdf, [again.root]).ok


def test_after_build_step_prints_the_verify_command(
    base_package: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    pdf = tmp_path / "package.pdf"
    shutil.copy(base_package, pdf)
    after_build_sign(SimpleNamespace(pdf_path=pdf), tmp_path, None)
    out = capsys.readouterr().out
    assert "signed as preparer and checker" in out
    assert f"calcpack verify {pdf} --trust {tmp_path / 'keys' / 'demo-root.crt'}" in out


def test_foreign_signatures_are_not_signed_over(
    base_package: Path, tmp_path: Path, demo: Any
) -> None:
    pdf = tmp_path / "package.pdf"
    shutil.copy(base_package, pdf)
    sign_demo_package(pdf, tmp_path / "first")
    (tmp_path / "second" / "keys").mkdir(parents=True)
    shutil.copy(demo.root, tmp_path / "second" / "keys" / "demo-root.crt")
    with pytest.raises(SigningError, match="does not verify"):
        sign_demo_package(pdf, tmp_path / "second")
