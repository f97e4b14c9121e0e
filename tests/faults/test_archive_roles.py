"""Fault injection: roles kept apart in a signed package (issue 15, point 2).

The rule that the checker is not the preparer is common practice for independent checking of
calculations (a check by the author is no check); one person signing under two roles is the
fault injected. Each refusal names the signer, the role and the key or person concerned.
"""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import main
from calcpack.errors import SigningError
from calcpack.signing.keys import load_credentials, new_self_signed
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package
from tests.unit.signing.signing_helpers import attach_manifest, cover_pdf, make_manifest

PASSWORD = "correct horse battery"


@pytest.fixture(scope="module")
def demo(tmp_path_factory: pytest.TempPathFactory) -> Any:
    from calcpack.signing.keys import make_demo_credentials

    return make_demo_credentials(tmp_path_factory.mktemp("keys"))


@pytest.fixture(scope="module")
def blank(tmp_path_factory: pytest.TempPathFactory) -> Path:
    path = tmp_path_factory.mktemp("blank") / "package.pdf"
    path.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    return path


@pytest.fixture(scope="module")
def named_blank(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """A package whose project names its preparer and checker (as calcpack.toml would)."""
    manifest = make_manifest()
    manifest["project"].update(preparer="Ines Calloway", checker="Tomas Redfern")
    path = tmp_path_factory.mktemp("named") / "package.pdf"
    path.write_bytes(attach_manifest(cover_pdf(), manifest))
    return path


@pytest.fixture
def package(blank: Path, tmp_path: Path) -> Path:
    target = tmp_path / "package.pdf"
    shutil.copy(blank, target)
    return target


def test_one_key_is_refused_for_a_second_role(package: Path, demo: Any) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    before = package.read_bytes()
    with pytest.raises(SigningError) as info:
        sign_package(
            package,
            "checker",
            demo.keys["preparer"],
            demo.password,
            override_identity="the checker is away",  # never allows two roles
        )
    message = str(info.value)
    assert "already signed as preparer by Ines Calloway" in message
    assert "same certificate" in message
    assert "checker must be someone else" in message
    assert package.read_bytes() == before


def test_another_key_of_the_same_person_is_refused_for_a_second_role(
    package: Path, demo: Any, tmp_path: Path
) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    second = new_self_signed(tmp_path, name="Ines Calloway", role="checker", password=PASSWORD)
    with pytest.raises(SigningError, match="same name"):
        sign_package(package, "checker", second.key, PASSWORD)


def test_a_key_made_for_another_role_is_refused_unless_overridden_and_recorded(
    demo: Any, tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    import hashlib

    from calcpack.signing.review import add_comment, close_comment, load_review, review_path

    job = tmp_path / "job"
    (job / "sheets").mkdir(parents=True)
    (job / "sheets" / "01.ipynb").write_text("{}", "utf-8")
    add_comment(job, sheet="sheets/01.ipynb", text="Span?", who="Tomas Redfern")
    close_comment(job, "C1", who="Tomas Redfern", text="Agreed")
    review = review_path(job)
    digest = hashlib.sha256(review.read_bytes()).hexdigest()
    files = [{"path": "review.toml", "sha256": digest, "role": "review"}]
    package = tmp_path / "elsewhere" / "package.pdf"  # no project beside it
    package.parent.mkdir()
    package.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=files)))
    with pytest.raises(SigningError) as info:
        sign_package(package, "preparer", demo.keys["approver"], demo.password)
    assert "made for the role 'approver', not 'preparer'" in str(info.value)
    assert "--override-identity" in str(info.value)
    before = package.read_bytes()
    with pytest.raises(SigningError, match=r"must be recorded in the project's review\.toml"):
        sign_package(package, "preparer", demo.keys["approver"], demo.password,
                     override_identity="certificate reissue pending")  # fmt: skip
    assert package.read_bytes() == before  # nowhere to record it: nothing signed
    sign_package(package, "preparer", demo.keys["approver"], demo.password, project=job,
                 override_identity="certificate reissue pending")  # fmt: skip
    (override,) = load_review(job).overrides
    assert (override.kind, override.role, override.who) == ("identity", "preparer", "Marta Quell")
    assert override.reason == "certificate reissue pending"
    assert "made for the role 'approver'" in override.contradictions[0]
    assert dt.datetime.fromisoformat(override.when).tzinfo is not None
    # the override shows in the review log, in verify, and in the signature's reason
    assert main(["review", "list", "--project", str(job)]) == 0
    listed = capsys.readouterr().out
    assert "Marta Quell signed as preparer although the key" in listed
    assert "certificate reissue pending" in listed
    report = verify_package(package, [demo.root], project=job)
    assert "Recorded in review.toml: OVERRIDE" in report.text()
    (sig,) = report.signatures
    assert sig.reason is not None
    assert "certificate reissue pending" in sig.reason
    # a comment added since the build makes the printed review log out of date...
    recorded = review.read_bytes()
    add_comment(job, sheet="sheets/01.ipynb", text="And the bearing?", who="Tomas Redfern")
    close_comment(job, "C2", who="Tomas Redfern", text="Fine")
    with pytest.raises(SigningError, match="older than"):
        sign_package(package, "checker", demo.keys["checker"], demo.password, project=job)
    # ...but the override appended to review.toml by a signature does not
    review.write_bytes(recorded)
    sign_package(package, "checker", demo.keys["checker"], demo.password, project=job)


def test_a_key_naming_another_person_than_the_project_is_refused(
    named_blank: Path, tmp_path: Path
) -> None:
    package = tmp_path / "package.pdf"
    shutil.copy(named_blank, package)
    other = new_self_signed(tmp_path, name="Olga Marsh", role="preparer", password=PASSWORD)
    with pytest.raises(SigningError) as info:
        sign_package(package, "preparer", other.key, PASSWORD)
    assert "'Olga Marsh' is not the preparer named in calcpack.toml ('Ines Calloway')" in str(
        info.value
    )
    same = new_self_signed(
        tmp_path / "ok", name="ines  calloway", role="preparer", password=PASSWORD
    )
    assert sign_package(package, "preparer", same.key, PASSWORD).role == "preparer"


def test_verify_fails_on_a_doctored_package_with_one_signer_in_two_roles(
    package: Path, demo: Any, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    from calcpack.signing import sign as sign_module

    monkeypatch.setattr(sign_module, "_check_signer", lambda *a, **k: ())  # the doctoring
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    sign_package(package, "checker", demo.keys["preparer"], demo.password)
    report = verify_package(package, [demo.root])
    assert all(s.intact for s in report.signatures)  # the cryptography alone would pass
    assert not report.ok
    assert any("one signer holds two roles: Ines Calloway" in p for p in report.problems)
    assert main(["verify", str(package), "--trust", str(demo.root)]) == 1
    assert "Verification FAILED" in capsys.readouterr().out


def test_require_makes_a_missing_role_a_failure(
    package: Path, demo: Any, capsys: pytest.CaptureFixture[str]
) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    report = verify_package(package, [demo.root])
    assert report.ok
    assert report.unsigned_roles == ("checker", "approver")
    assert "Not signed yet: checker, approver" in report.text()
    strict = verify_package(package, [demo.root], require=("preparer", "checker"))
    assert not strict.ok
    assert "required role(s) not signed: checker" in strict.problems
    code = main(
        ["verify", str(package), "--trust", str(demo.root), "--require", "preparer,checker"]
    )
    assert code == 1
    assert "PROBLEM: required role(s) not signed: checker" in capsys.readouterr().out
    sign_package(package, "checker", demo.keys["checker"], demo.password)
    assert verify_package(package, [demo.root], require=("preparer", "checker")).ok


def test_require_names_an_unknown_role(package: Path, demo: Any) -> None:
    from calcpack.errors import InputError

    with pytest.raises(InputError, match="got role = 'cheker'"):
        verify_package(package, [demo.root], require=("cheker",))


def test_keys_new_records_role_and_firm_in_the_certificate(tmp_path: Path) -> None:
    files = new_self_signed(
        tmp_path, name="Ada Brill", role="checker", firm="Corvane Consulting", password=PASSWORD
    )
    creds = load_credentials(files.key, PASSWORD)
    assert creds.role == "checker"
    assert creds.firm == "Corvane Consulting"
