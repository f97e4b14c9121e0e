"""Keys: self-signed credentials, demo credentials, loading and the refusals of point 6."""

from __future__ import annotations

import datetime as dt
import stat
from pathlib import Path
from typing import Any

import pytest

from calcpack.errors import InputError, SigningError
from calcpack.signing.keys import (
    PASSWORD_ENV,
    load_credentials,
    make_demo_credentials,
    new_self_signed,
    read_password,
)
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package

PASSWORD = "correct-horse-2417"


@pytest.fixture(scope="module")
def own_key(tmp_path_factory: pytest.TempPathFactory) -> Any:
    return new_self_signed(
        tmp_path_factory.mktemp("own"),
        name="Ines Calloway",
        role="preparer",
        firm="Harrowgate & Vell",
        password=PASSWORD,
    )


def test_new_self_signed_writes_a_private_key_file_and_a_certificate(own_key: Any) -> None:
    assert own_key.key.name == "ines-calloway.p12"
    assert own_key.certificate.read_bytes().startswith(b"-----BEGIN CERTIFICATE-----")
    assert stat.S_IMODE(own_key.key.stat().st_mode) == 0o600  # the key is for its owner only
    creds = load_credentials(own_key.key, PASSWORD)
    assert creds.name == "Ines Calloway"
    assert creds.firm == "Harrowgate & Vell"
    subject = creds.certificate.subject.native
    assert subject["title"] == "preparer"
    assert set(creds.certificate.key_usage_value.native) >= {"digital_signature"}


def test_self_signed_key_signs_and_verifies_against_its_own_certificate(
    own_key: Any, package: Path
) -> None:
    sign_package(package, "preparer", own_key.key, PASSWORD)
    report = verify_package(package, [own_key.certificate])
    assert report.ok, report.text()
    assert report.signatures[0].signer == "Ines Calloway"


def test_existing_key_files_are_not_overwritten(own_key: Any) -> None:
    before = own_key.key.read_bytes()
    with pytest.raises(SigningError, match="exists already"):
        new_self_signed(
            own_key.key.parent, name="Ines Calloway", role="preparer", password="another-one-pw"
        )
    assert own_key.key.read_bytes() == before


def test_wrong_password_is_a_clear_error_that_does_not_echo_it(own_key: Any) -> None:
    wrong = "guess-guess-9999"
    with pytest.raises(SigningError, match="wrong password") as info:
        load_credentials(own_key.key, wrong)
    assert wrong not in str(info.value)
    assert str(own_key.key) in str(info.value)


def test_missing_key_file(tmp_path: Path) -> None:
    with pytest.raises(SigningError, match=r"Key file '.*absent\.p12' does not exist"):
        load_credentials(tmp_path / "absent.p12", PASSWORD)


def test_expired_and_not_yet_valid_certificates_are_refused(tmp_path: Path) -> None:
    now = dt.datetime.now(dt.UTC)
    expired = new_self_signed(
        tmp_path / "a",
        name="Old Key",
        role="checker",
        password=PASSWORD,
        days=3,
        not_before=now - dt.timedelta(days=30),
    )
    with pytest.raises(SigningError, match="Certificate of 'Old Key' expired on"):
        load_credentials(expired.key, PASSWORD)
    future = new_self_signed(
        tmp_path / "b",
        name="Future Key",
        role="checker",
        password=PASSWORD,
        not_before=now + dt.timedelta(days=2),
    )
    with pytest.raises(SigningError, match="Certificate of 'Future Key' is not valid yet"):
        load_credentials(future.key, PASSWORD)


def _encipher_only_p12(tmp_path: Path) -> Path:
    """A certificate allowed key encipherment only -- not signing."""
    from cryptography import x509
    from cryptography.hazmat.primitives import hashes
    from cryptography.hazmat.primitives.asymmetric import rsa
    from cryptography.hazmat.primitives.serialization import BestAvailableEncryption, pkcs12
    from cryptography.x509.oid import NameOID

    key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    name = x509.Name([x509.NameAttribute(NameOID.COMMON_NAME, "Wrong Usage")])
    now = dt.datetime.now(dt.UTC)
    cert = (
        x509.CertificateBuilder()
        .subject_name(name)
        .issuer_name(name)
        .public_key(key.public_key())
        .serial_number(x509.random_serial_number())
        .not_valid_before(now - dt.timedelta(minutes=5))
        .not_valid_after(now + dt.timedelta(days=5))
        .add_extension(
            x509.KeyUsage(False, False, True, False, False, False, False, False, False),
            critical=True,
        )
        .sign(key, hashes.SHA256())
    )
    path = tmp_path / "wrong-usage.p12"
    path.write_bytes(
        pkcs12.serialize_key_and_certificates(
            b"w", key, cert, None, BestAvailableEncryption(PASSWORD.encode())
        )
    )
    return path


def test_certificate_without_signing_key_usage_is_refused(tmp_path: Path, package: Path) -> None:
    path = _encipher_only_p12(tmp_path)
    original = package.read_bytes()
    with pytest.raises(SigningError, match="does not allow signing: its key usage is key_enc"):
        sign_package(package, "preparer", path, PASSWORD)
    assert package.read_bytes() == original


def test_pem_key_with_certificate_from_an_authority(tmp_path: Path, package: Path) -> None:
    from cryptography.hazmat.primitives.serialization import (
        BestAvailableEncryption,
        Encoding,
        PrivateFormat,
        pkcs12,
    )

    demo = make_demo_credentials(tmp_path / "ca", password=PASSWORD)
    key, cert, _ = pkcs12.load_key_and_certificates(
        demo.keys["preparer"].read_bytes(), PASSWORD.encode()
    )
    assert key is not None
    assert cert is not None
    key_pem = tmp_path / "preparer.key"
    key_pem.write_bytes(
        key.private_bytes(
            Encoding.PEM, PrivateFormat.PKCS8, BestAvailableEncryption(PASSWORD.encode())
        )
    )
    cert_pem = tmp_path / "preparer.crt"
    cert_pem.write_bytes(cert.public_bytes(Encoding.PEM))
    with pytest.raises(SigningError, match="its certificate must be given too"):
        load_credentials(key_pem, PASSWORD)
    with pytest.raises(SigningError, match="wrong password"):
        load_credentials(key_pem, "nope-nope-nope", certificate=cert_pem)
    creds = load_credentials(key_pem, PASSWORD, certificate=cert_pem)
    with pytest.raises(SigningError, match="--chain FILE"):  # B-LT needs the whole chain
        sign_package(package, "preparer", creds)
    creds = load_credentials(key_pem, PASSWORD, certificate=cert_pem, chain=[demo.root])
    sign_package(package, "preparer", creds)
    assert verify_package(package, [demo.root]).ok


def test_unknown_role_and_bad_validity_name_the_input(tmp_path: Path) -> None:
    with pytest.raises(InputError, match="role = 'boss'"):
        new_self_signed(tmp_path, name="A B", role="boss", password=PASSWORD)
    with pytest.raises(InputError, match="days = 0"):
        new_self_signed(tmp_path, name="A B", role="checker", password=PASSWORD, days=0)
    with pytest.raises(InputError, match="name = ''"):
        new_self_signed(tmp_path, name=" ", role="checker", password=PASSWORD)


def test_demo_credentials_hide_their_password(tmp_path: Path) -> None:
    demo = make_demo_credentials(tmp_path)
    assert demo.password not in repr(demo)
    assert set(demo.keys) == {"preparer", "checker", "approver"}
    for path in [demo.root, *demo.keys.values()]:
        assert demo.password.encode() not in path.read_bytes()


def test_password_from_the_environment(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setenv(PASSWORD_ENV, "from-env-123")
    assert read_password() == "from-env-123"
    monkeypatch.setenv(PASSWORD_ENV, "")
    with pytest.raises(SigningError, match="CALCPACK_KEY_PASSWORD is empty"):
        read_password()


def test_password_prompt_needs_a_terminal(monkeypatch: pytest.MonkeyPatch) -> None:
    import io
    import sys

    monkeypatch.delenv(PASSWORD_ENV, raising=False)
    monkeypatch.setattr(sys, "stdin", io.StringIO(""))
    with pytest.raises(SigningError, match="set the environment variable CALCPACK_KEY_PASSWORD"):
        read_password()


def test_password_prompt_confirms_new_passwords(monkeypatch: pytest.MonkeyPatch) -> None:
    import getpass
    import sys

    class Tty:
        def isatty(self) -> bool:
            return True

    monkeypatch.delenv(PASSWORD_ENV, raising=False)
    monkeypatch.setattr(sys, "stdin", Tty())
    answers = iter(["first-entry-1", "second-entry-2"])
    monkeypatch.setattr(getpass, "getpass", lambda prompt="": next(answers))
    with pytest.raises(SigningError, match="differ"):
        read_password(confirm=True)
    answers = iter(["same-entry-3", "same-entry-3"])
    assert read_password(confirm=True) == "same-entry-3"
