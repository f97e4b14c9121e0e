"""Signing by role: order, placement, stamps, certification, timestamps and refusals."""

from __future__ import annotations

import io
import shutil
import subprocess
from pathlib import Path
from typing import Any

import pytest
from signing_helpers import attach_manifest, cover_pdf, make_manifest

from calcpack.errors import InputError, SigningError, VerificationError
from calcpack.signing.manifest import field_name
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package


def _library_statuses(pdf: Path, trust: list[Path]) -> list[Any]:
    """Validate every signature with pyHanko's own validator, without calcpack's verify."""
    from pyhanko.keys import load_cert_from_pemder
    from pyhanko.pdf_utils.reader import PdfFileReader
    from pyhanko.sign.validation import validate_pdf_signature
    from pyhanko.sign.validation.settings import KeyUsageConstraints
    from pyhanko_certvalidator import ValidationContext

    roots = [load_cert_from_pemder(str(p)) for p in trust]
    with pdf.open("rb") as fh:
        reader = PdfFileReader(fh)
        statuses = []
        for sig in reader.embedded_signatures:
            vc = ValidationContext(trust_roots=roots, allow_fetching=False)
            statuses.append(
                (
                    sig.field_name,
                    validate_pdf_signature(
                        sig,
                        vc,
                        key_usage_settings=KeyUsageConstraints(key_usage={"digital_signature"}),
                    ),
                )
            )
    return statuses


def test_preparer_checker_approver_each_valid_by_the_library_and_by_verify(
    package: Path, demo: Any
) -> None:
    from pyhanko.sign.diff_analysis import ModificationLevel
    from pyhanko.sign.validation import SignatureCoverageLevel

    sizes = []
    for role in ("preparer", "checker", "approver"):
        before = package.read_bytes()
        result = sign_package(package, role, demo.keys[role], demo.password)
        after = package.read_bytes()
        assert after.startswith(before)  # incremental update: earlier bytes untouched
        assert result.role == role
        assert result.certified is (role == "preparer")
        sizes.append(len(after) - len(before))

    statuses = _library_statuses(package, [demo.root])
    assert [name for name, _ in statuses] == [
        field_name("preparer"),
        field_name("checker"),
        field_name("approver"),
    ]
    for name, status in statuses:
        assert status.bottom_line, (name, status.pretty_print_details())
        assert status.intact
        assert status.valid
        assert status.trusted
    # earlier signatures see only signing/form filling after them; the last covers all
    assert statuses[0][1].modification_level == ModificationLevel.FORM_FILLING
    assert statuses[1][1].modification_level == ModificationLevel.FORM_FILLING
    # the last is followed only by its validation data (PAdES B-LT: the DSS update)
    assert statuses[2][1].coverage == SignatureCoverageLevel.ENTIRE_REVISION
    assert statuses[2][1].modification_level == ModificationLevel.LTA_UPDATES

    report = verify_package(package, [demo.root])
    assert report.ok, report.text()
    assert [s.role for s in report.signatures] == ["preparer", "checker", "approver"]
    assert [s.signer for s in report.signatures] == [
        "Ines Calloway",
        "Tomas Redfern",
        "Marta Quell",
    ]
    assert report.signatures[0].certification
    # after the last signature only its validation data was added (PAdES B-LT)
    assert report.signatures[2].changes_after == "validation data added"
    assert report.signatures[2].changes_allowed
    assert all(s.intact and s.trusted for s in report.signatures)
    assert all(size < 60_000 for size in sizes)  # one signature is tens of kB, not more


def test_signature_fields_sit_in_the_manifest_boxes(package: Path, demo: Any) -> None:
    from pypdf import PdfReader

    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    boxes = {f["role"]: f["box"] for f in make_manifest()["signature_fields"]}
    reader = PdfReader(package)
    widgets = {
        str(a.get_object()["/T"]): [float(v) for v in a.get_object()["/Rect"]]
        for a in reader.pages[0]["/Annots"]
    }
    for role, box in boxes.items():
        assert widgets[field_name(role)] == pytest.approx(box, abs=0.01)


@pytest.mark.skipif(shutil.which("pdftotext") is None, reason="needs poppler's pdftotext")
def test_visible_stamp_shows_name_role_date_and_reason(package: Path, demo: Any) -> None:
    result = sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    text = subprocess.run(
        ["pdftotext", "-f", "1", "-l", "1", str(package), "-"],
        capture_output=True,
        text=True,
        check=True,
    ).stdout
    # readable text proves the glyphs are right (a 2048-unit font came out garbled)
    assert "Prepared by: Ines Calloway" in text
    assert "Role: preparer" in text
    assert f"Date: {result.signed_at:%Y-%m-%d}" in text
    assert "Reason: Prepared" in text


def test_out_writes_a_new_file_and_leaves_the_input_alone(
    package: Path, demo: Any, tmp_path: Path
) -> None:
    original = package.read_bytes()
    out = tmp_path / "signed" / "issued.pdf"
    result = sign_package(package, "preparer", demo.keys["preparer"], demo.password, out=out)
    assert result.output == out
    assert package.read_bytes() == original
    assert out.read_bytes().startswith(original)


def _assert_refused_and_untouched(
    package: Path, exc: type[Exception], match: str, **kwargs: Any
) -> None:
    original = package.read_bytes()
    before = sorted(p.name for p in package.parent.iterdir())
    with pytest.raises(exc, match=match):
        sign_package(package, **kwargs)
    assert package.read_bytes() == original
    assert sorted(p.name for p in package.parent.iterdir()) == before  # no partial files


def test_order_is_enforced(package: Path, demo: Any) -> None:
    _assert_refused_and_untouched(
        package,
        SigningError,
        "cannot be signed as checker before it is signed as preparer",
        role="checker",
        key=demo.keys["checker"],
        password=demo.password,
    )
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    _assert_refused_and_untouched(
        package,
        SigningError,
        "cannot be signed as approver before it is signed as checker",
        role="approver",
        key=demo.keys["approver"],
        password=demo.password,
    )


def test_a_role_signs_once(package: Path, demo: Any) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    _assert_refused_and_untouched(
        package,
        SigningError,
        "already signed as preparer",
        role="preparer",
        key=demo.keys["preparer"],
        password=demo.password,
    )


def test_unknown_role_is_named(package: Path, demo: Any) -> None:
    with pytest.raises(InputError, match="role = 'reviewer'"):
        sign_package(package, "reviewer", demo.keys["checker"], demo.password)


def test_pdf_not_made_by_calcpack_is_refused(tmp_path: Path, demo: Any) -> None:
    plain = tmp_path / "plain.pdf"
    plain.write_bytes(attach_manifest(cover_pdf(), None))
    _assert_refused_and_untouched(
        plain,
        VerificationError,
        "not a calcpack package: it has no embedded calcpack-manifest.json",
        role="preparer",
        key=demo.keys["preparer"],
        password=demo.password,
    )
    text = tmp_path / "notes.pdf"
    text.write_text("hello")
    with pytest.raises(VerificationError, match="not a PDF"):
        sign_package(text, "preparer", demo.keys["preparer"], demo.password)


def test_package_without_a_box_for_the_role(tmp_path: Path, demo: Any) -> None:
    two = tmp_path / "two-boxes.pdf"
    roles = ("preparer", "checker")
    two.write_bytes(attach_manifest(cover_pdf(roles), make_manifest(roles)))
    sign_package(two, "preparer", demo.keys["preparer"], demo.password)
    sign_package(two, "checker", demo.keys["checker"], demo.password)
    with pytest.raises(VerificationError, match="no approver box"):
        sign_package(two, "approver", demo.keys["approver"], demo.password)
    assert verify_package(two, [demo.root]).ok


def test_missing_key_file_and_wrong_password(package: Path, demo: Any, tmp_path: Path) -> None:
    _assert_refused_and_untouched(
        package,
        SigningError,
        "Key file .*nowhere.p12.* does not exist",
        role="preparer",
        key=tmp_path / "nowhere.p12",
        password=demo.password,
    )
    _assert_refused_and_untouched(
        package,
        SigningError,
        "wrong password",
        role="preparer",
        key=demo.keys["preparer"],
        password="not-the-password",
    )


def test_package_modified_after_the_last_signature_is_refused(package: Path, demo: Any) -> None:
    from pyhanko.pdf_utils import generic
    from pyhanko.pdf_utils.incremental_writer import IncrementalPdfFileWriter

    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    writer = IncrementalPdfFileWriter(io.BytesIO(package.read_bytes()))
    writer.root["/Lang"] = generic.TextStringObject("fr")  # a harmless-looking edit
    writer.update_root()
    out = io.BytesIO()
    writer.write(out)
    package.write_bytes(out.getvalue())
    _assert_refused_and_untouched(
        package,
        SigningError,
        "changed after its last signature",
        role="checker",
        key=demo.keys["checker"],
        password=demo.password,
    )


def test_flipped_byte_after_signing_refuses_the_next_signature(package: Path, demo: Any) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    data = bytearray(package.read_bytes())
    position = data.index(b"Job 2417") if b"Job 2417" in data else 2000
    data[position] ^= 0x01
    package.write_bytes(bytes(data))
    with pytest.raises((SigningError, VerificationError)):
        sign_package(package, "checker", demo.keys["checker"], demo.password)


def test_timestamp_from_a_local_server(package: Path, demo: Any, tsa_server: Any) -> None:
    url, tsa_root = tsa_server
    result = sign_package(
        package, "preparer", demo.keys["preparer"], demo.password, timestamp_url=url
    )
    assert result.timestamped
    report = verify_package(package, [demo.root, tsa_root])
    assert report.ok, report.text()
    stamp = report.signatures[0].timestamp
    assert stamp is not None
    assert abs((stamp - result.signed_at).total_seconds()) < 120
    assert "RFC 3161 timestamp" in report.text()
    # without the TSA root the timestamp is not trusted, and verify says so
    untrusted = verify_package(package, [demo.root])
    assert not untrusted.ok
    assert "timestamp NOT trusted" in untrusted.signatures[0].trust


def test_timestamp_server_from_environment(
    package: Path, demo: Any, tsa_server: Any, monkeypatch: pytest.MonkeyPatch
) -> None:
    url, tsa_root = tsa_server
    monkeypatch.setenv("CALCPACK_TIMESTAMP_URL", url)
    assert sign_package(package, "preparer", demo.keys["preparer"], demo.password).timestamped
    assert verify_package(package, [demo.root, tsa_root]).signatures[0].timestamp is not None


def test_unreachable_timestamp_server_fails_cleanly(package: Path, demo: Any) -> None:
    import socket

    with socket.socket() as s:  # a port nobody listens on
        s.bind(("127.0.0.1", 0))
        port = s.getsockname()[1]
    _assert_refused_and_untouched(
        package,
        SigningError,
        "timestamp server",
        role="preparer",
        key=demo.keys["preparer"],
        password=demo.password,
        timestamp_url=f"http://127.0.0.1:{port}/tsa",
    )
