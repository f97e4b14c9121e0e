"""Fault injection: revocation data stored at signing still speaks years later (issue 15).

A firm's own authority issues the signers' keys and a certificate revocation list (RFC 5280
§5); the signature stores the chain and the list in the document security store (PAdES
baseline B-LT, ETSI EN 319 142-1, from memory). What must hold, by the rule of RFC 5280 §6.3
and the PAdES long-term model (from memory): a key is judged at the time a timestamp proves,
so a package whose certificates have all expired still verifies from what it stores; a key
revoked before that time is reported as revoked; a key revoked after it is not. The
validation itself is pyhanko-certvalidator's (a general-purpose reference library); the
timestamps come from pyHanko's test timestamp authority run locally.
"""

from __future__ import annotations

import datetime as dt
import io
import shutil
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import main
from calcpack.errors import SigningError
from calcpack.signing.authority import issue_crl, issue_key, new_authority
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package
from tests.unit.signing.signing_helpers import (
    attach_manifest,
    cover_pdf,
    make_manifest,
    make_timestamp_authority,
)

NOW = dt.datetime.now(dt.UTC)
TEN_YEARS = NOW + dt.timedelta(days=3653)
PASSWORD = "correct horse battery"
FIRM = "Pellworth & Amsel Structural"


@pytest.fixture(scope="module")
def firm(tmp_path_factory: pytest.TempPathFactory) -> Any:
    """An authority valid 2 years, keys valid 30 days (all long expired ten years on)."""
    folder = tmp_path_factory.mktemp("authority")
    authority = new_authority(folder, firm=FIRM, password=PASSWORD, days=730)
    people = {"preparer": "Odile Farrant", "checker": "Kasimir Venn"}
    keys = {
        role: issue_key(
            authority.key, PASSWORD, folder, name=name, role=role, password=PASSWORD, days=30
        )
        for role, name in people.items()
    }
    return authority, keys


@pytest.fixture
def package(tmp_path: Path) -> Path:
    path = tmp_path / "package.pdf"
    path.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    return path


def _crl_copy(authority: Any, tmp_path: Path, name: str) -> Path:
    """The authority's current list, kept as it was at this moment."""
    target = tmp_path / name
    shutil.copy(authority.crl, target)
    return target


def _stored_lists(path: Path) -> int:
    from pyhanko.pdf_utils.reader import PdfFileReader
    from pyhanko.sign.validation.dss import DocumentSecurityStore

    dss = DocumentSecurityStore.read_dss(PdfFileReader(io.BytesIO(path.read_bytes())))
    return len(dss.crls)


def test_ten_years_on_with_every_certificate_expired_the_stored_data_verifies(
    firm: Any, package: Path, tmp_path: Path
) -> None:
    authority, keys = firm
    crl = _crl_copy(authority, tmp_path, "current.crl")
    stamper, tsa_root = make_timestamp_authority(tmp_path, days=20 * 365)
    results = [
        sign_package(package, role, keys[role].key, PASSWORD, timestamper=stamper, crls=[crl])
        for role in ("preparer", "checker")
    ]
    for result in results:
        assert result.revocation.startswith("revocation data embedded: 1 revocation list")
    assert _stored_lists(package) >= 1
    # ten years on: the keys (30 days), the authority (2 years) and the list (30 days) have all
    # expired; the verifier holds only the authority's certificate and the TSA root
    report = verify_package(package, [authority.certificate, tsa_root], now=TEN_YEARS)
    assert report.ok, report.text()
    for sig in report.signatures:
        assert sig.time_basis == "the time its signature timestamp proves"
        assert "revocation list of its issuer" in sig.revocation
        assert "stored in the package" in sig.revocation
    assert "revocation: checked against" in report.text()


def test_a_key_revoked_before_it_signed_is_reported_and_one_revoked_after_is_not(
    tmp_path: Path, package: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    authority = new_authority(tmp_path, firm=FIRM, password=PASSWORD)
    key = issue_key(authority.key, PASSWORD, tmp_path, name="Lorcan Abt", role="preparer",
                    password=PASSWORD, days=30)  # fmt: skip
    stamper, tsa_root = make_timestamp_authority(tmp_path / "tsa", days=20 * 365)
    trust = [authority.certificate, tsa_root]
    # signed with no list at hand (offline), then the firm learns the key was stolen an hour
    # before that signature and revokes it from then
    result = sign_package(package, "preparer", key.key, PASSWORD, timestamper=stamper)
    assert "NO revocation data embedded" in result.revocation
    offline = verify_package(package, trust)
    assert offline.ok, offline.text()  # nothing says otherwise...
    assert "revocation: NOT checked" in offline.signatures[0].revocation  # ...and it says so
    issue_crl(authority.key, PASSWORD, revoke=[key.certificate],
              revoked_at=NOW - dt.timedelta(hours=1))  # fmt: skip
    revoked = verify_package(package, trust, crls=[authority.crl], now=TEN_YEARS)
    assert not revoked.ok
    assert revoked.signatures[0].trust.startswith("revoked certificate")
    assert "given to verify" in revoked.signatures[0].revocation
    assert main(["verify", str(package), *_trust(trust), "--crl", str(authority.crl)]) == 1
    assert "signer: revoked certificate (revoked " in capsys.readouterr().out
    # the same key revoked only after the signature's timestamp: the signature stands
    other = tmp_path / "later"
    other.mkdir()
    later_authority = new_authority(other, firm=FIRM, password=PASSWORD)
    later_key = issue_key(later_authority.key, PASSWORD, other, name="Lorcan Abt",
                          role="preparer", password=PASSWORD, days=30)  # fmt: skip
    second = tmp_path / "second.pdf"
    second.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    sign_package(second, "preparer", later_key.key, PASSWORD, timestamper=stamper)
    issue_crl(later_authority.key, PASSWORD, revoke=[later_key.certificate],
              revoked_at=NOW + dt.timedelta(days=2))  # fmt: skip
    stands = verify_package(
        second, [later_authority.certificate, tsa_root], crls=[later_authority.crl], now=TEN_YEARS
    )
    assert stands.ok, stands.text()


def test_signing_with_a_revoked_key_is_refused_and_nothing_written(
    tmp_path: Path, package: Path
) -> None:
    authority = new_authority(tmp_path, firm=FIRM, password=PASSWORD)
    key = issue_key(authority.key, PASSWORD, tmp_path, name="Wenna Stroud", role="preparer",
                    password=PASSWORD)  # fmt: skip
    listing = issue_crl(authority.key, PASSWORD, revoke=[key.certificate])
    assert [serial for _, serial, _ in listing.revoked] != []
    before = package.read_bytes()
    with pytest.raises(SigningError, match=r"Wenna Stroud.*is revoked by its authority"):
        sign_package(package, "preparer", key.key, PASSWORD, crls=[authority.crl])
    assert package.read_bytes() == before


def test_a_self_signed_key_says_it_cannot_be_revoked(tmp_path: Path, package: Path) -> None:
    from calcpack.signing.keys import new_self_signed

    files = new_self_signed(tmp_path, name="Ysolde Marr", role="preparer", password=PASSWORD)
    result = sign_package(package, "preparer", files.key, PASSWORD)
    assert "self-signed key cannot be revoked" in result.revocation
    report = verify_package(package, [files.certificate])
    assert report.ok, report.text()
    assert "cannot be revoked" in report.signatures[0].revocation


def test_a_list_from_another_authority_cannot_revoke_a_key(tmp_path: Path) -> None:
    ours = new_authority(tmp_path / "a", firm=FIRM, password=PASSWORD)
    theirs = new_authority(tmp_path / "b", firm="Quillon Bros", password=PASSWORD)
    key = issue_key(ours.key, PASSWORD, tmp_path, name="Hale Orrin", role="checker",
                    password=PASSWORD)  # fmt: skip
    with pytest.raises(SigningError, match="was not issued by"):
        issue_crl(theirs.key, PASSWORD, revoke=[key.certificate])


def test_keys_from_the_command_line(
    tmp_path: Path, package: Path, monkeypatch: pytest.MonkeyPatch,
    capsys: pytest.CaptureFixture[str],
) -> None:  # fmt: skip
    monkeypatch.setenv("CALCPACK_KEY_PASSWORD", PASSWORD)
    monkeypatch.setenv("CALCPACK_AUTHORITY_PASSWORD", PASSWORD)
    out = str(tmp_path)
    assert main(["keys", "authority", "--firm", FIRM, "--out", out]) == 0
    ca = tmp_path / "pellworth-amsel-structural-authority.p12"
    assert ca.is_file()
    args = ["keys", "new", "--name", "Ivo Brandt", "--role", "preparer", "--out", out]
    assert main([*args, "--authority", str(ca)]) == 0
    assert "Issued by:" in capsys.readouterr().out
    crl = ca.with_suffix(".crl")
    assert main(["sign", str(package), "--role", "preparer", "--key",
                 str(tmp_path / "ivo-brandt.p12"), "--crl", str(crl)]) == 0  # fmt: skip
    assert "revocation data embedded" in capsys.readouterr().out
    assert main(["keys", "crl", "--authority", str(ca), "--revoke",
                 str(tmp_path / "ivo-brandt.crt")]) == 0  # fmt: skip
    assert "1 key(s) revoked" in capsys.readouterr().out
    trust = ["--trust", str(ca.with_suffix(".crt"))]
    assert main(["verify", str(package), *trust]) == 0  # signed before the revocation
    assert main(["keys", "crl", "--authority", str(tmp_path / "missing.p12")]) == 1
    assert "does not exist" in capsys.readouterr().err


def _trust(paths: list[Path]) -> list[str]:
    return [arg for p in paths for arg in ("--trust", str(p))]


def test_a_key_naming_where_its_list_is_published_gets_it_fetched_and_stored(
    tmp_path: Path, package: Path
) -> None:
    import functools
    import http.server
    import threading

    authority = new_authority(tmp_path, firm=FIRM, password=PASSWORD)
    handler = functools.partial(http.server.SimpleHTTPRequestHandler, directory=str(tmp_path))

    class Quiet(http.server.ThreadingHTTPServer):
        def handle_error(self, request: Any, client_address: Any) -> None:
            pass

    server = Quiet(("127.0.0.1", 0), handler)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    try:
        url = f"http://127.0.0.1:{server.server_address[1]}/{authority.crl.name}"
        key = issue_key(authority.key, PASSWORD, tmp_path, name="Ferd Oakes", role="preparer",
                        password=PASSWORD, crl_url=url)  # fmt: skip
        result = sign_package(package, "preparer", key.key, PASSWORD)  # no --crl: fetched
    finally:
        server.shutdown()
        server.server_close()
    assert result.revocation.startswith("revocation data embedded: 1 revocation list")
    report = verify_package(package, [authority.certificate])
    assert report.ok, report.text()
    assert "stored in the package" in report.signatures[0].revocation
