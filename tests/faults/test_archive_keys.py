"""Fault injection: key files a signer can rely on (issue 15, point 3: keys and the demo).

Short passwords, an existing key file, Ctrl-D at the prompt and the demo's unopenable key files
are the faults. The 12-character minimum is common practice for a file that can be attacked
offline; each refusal names what was wrong (the length, never the password).
"""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path

import pytest

from calcpack.cli import main
from calcpack.errors import SigningError
from calcpack.signing.keys import (
    DEFAULT_VALIDITY_DAYS,
    load_certificates,
    new_self_signed,
    read_password,
)
from tests.unit.signing.signing_helpers import attach_manifest, cover_pdf, make_manifest


def _run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_a_short_password_is_refused_naming_its_length_not_its_value(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", "abcde")
    code, _, err = _run(
        capsys, "keys", "new", "--name", "Ada Brill", "--role", "checker", "--out", str(tmp_path)
    )
    assert code == 1
    assert "at least 12 characters (got 5)" in err
    assert "abcde" not in err
    assert not list(tmp_path.iterdir())  # nothing written
    with pytest.raises(SigningError, match="got 11"):
        new_self_signed(tmp_path, name="Ada Brill", role="checker", password="x" * 11)


def test_keys_new_states_its_validity_and_takes_days(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", "twelve-chars-ok")
    code, out, _ = _run(
        capsys, "keys", "new", "--name", "Ada Brill", "--role", "checker", "--out", str(tmp_path)
    )
    assert code == 0
    end = dt.date.today() + dt.timedelta(days=DEFAULT_VALIDITY_DAYS)
    assert f"({DEFAULT_VALIDITY_DAYS} days)" in out
    (cert,) = load_certificates([tmp_path / "ada-brill.crt"])
    not_after = cert["tbs_certificate"]["validity"]["not_after"].native.date()
    assert abs((not_after - end).days) <= 1
    code, out, _ = _run(
        capsys,
        "keys",
        "new",
        "--name",
        "Bo Tarrant",
        "--role",
        "checker",
        "--out",
        str(tmp_path),
        "--days",
        "90",
    )
    assert code == 0
    assert "(90 days)" in out


def test_an_existing_key_file_names_force_and_is_kept(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: pytest.CaptureFixture[str]
) -> None:
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", "twelve-chars-ok")
    argv = ["keys", "new", "--name", "Ada Brill", "--role", "checker", "--out", str(tmp_path)]
    assert _run(capsys, *argv)[0] == 0
    before = (tmp_path / "ada-brill.p12").read_bytes()
    code, _, err = _run(capsys, *argv)
    assert code == 1
    assert "exists already" in err
    assert "--force" in err
    assert (tmp_path / "ada-brill.p12").read_bytes() == before
    assert _run(capsys, *argv, "--force")[0] == 0
    assert (tmp_path / "ada-brill.p12").read_bytes() != before


def test_ctrl_d_at_the_password_prompt_is_one_line(monkeypatch: pytest.MonkeyPatch) -> None:
    import getpass
    import sys

    def eof(prompt: str = "") -> str:
        raise EOFError

    monkeypatch.delenv("CALCPACK_KEY_PASSWORD", raising=False)
    monkeypatch.setattr(sys.stdin, "isatty", lambda: True, raising=False)
    monkeypatch.setattr(getpass, "getpass", eof)
    with pytest.raises(SigningError, match="No key password entered"):
        read_password()


def test_the_demo_removes_key_files_whose_password_it_never_shows(tmp_path: Path) -> None:
    from calcpack.signing.demo import sign_demo_package

    pdf = tmp_path / "package.pdf"
    manifest = make_manifest()
    manifest["project"].update(preparer="Ines Calloway", checker="Tomas Redfern")
    pdf.write_bytes(attach_manifest(cover_pdf(), manifest))
    signoff = sign_demo_package(pdf, tmp_path)
    assert sorted(p.name for p in (tmp_path / "keys").iterdir()) == ["demo-root.crt"]
    from calcpack.signing.verify import verify_package

    assert verify_package(signoff.pdf, [signoff.root], require=("preparer", "checker")).ok
    shutil.rmtree(tmp_path / "keys")
