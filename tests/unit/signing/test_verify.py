"""Verification: intact and trusted signatures pass; tampering, distrust and expiry fail."""

from __future__ import annotations

import datetime as dt
import hashlib
import io
import json
import random
import re
from pathlib import Path
from typing import Any

import pytest

from calcpack.errors import InputError, VerificationError
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package


def _signed_ranges(data: bytes) -> list[tuple[int, int]]:
    """The byte ranges covered by the last signature's /ByteRange (both parts)."""
    ranges = re.findall(rb"/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]", data)
    a, b, c, d = (int(x) for x in ranges[-1])
    return [(a, a + b), (c, c + d)]


def _fails(path: Path, trust: list[Path]) -> bool:
    try:
        report = verify_package(path, trust)
    except VerificationError:
        return True  # the damage made the package unreadable: also a failure
    return not report.ok


def test_flipped_bytes_anywhere_in_the_signed_range_always_fail(
    signed_package: Path, demo: Any, tmp_path: Path
) -> None:
    original = signed_package.read_bytes()
    ranges = _signed_ranges(original)
    assert ranges[0][0] == 0
    # the last signature covers all but its validation data, appended after it (PAdES B-LT)
    assert len(original) - 20_000 < ranges[1][1] < len(original)
    rng = random.Random(20260302)  # fixed seed: the same positions on every run
    positions = [rng.randrange(*rng.choice(ranges)) for _ in range(40)]
    target = tmp_path / "tampered.pdf"
    failures = []
    for position in positions:
        data = bytearray(original)
        data[position] ^= 1 << rng.randrange(8)
        target.write_bytes(bytes(data))
        failures.append(_fails(target, [demo.root]))
    assert all(failures), [p for p, f in zip(positions, failures, strict=True) if not f]


def test_flipped_byte_in_the_first_revision_breaks_every_signature(
    signed_package: Path, demo: Any, tmp_path: Path
) -> None:
    data = bytearray(signed_package.read_bytes())
    position = data.index(b"/ByteRange")  # inside the preparer's signature dictionary
    data[position - 20] ^= 0x20
    target = tmp_path / "tampered.pdf"
    target.write_bytes(bytes(data))
    try:
        report = verify_package(target, [demo.root])
    except VerificationError:
        return
    assert not report.ok
    assert not any(s.ok for s in report.signatures)
    assert "NOT INTACT" in report.text() or "could not be checked" in report.text()


def test_appended_page_content_is_reported_as_a_modification(
    signed_package: Path, demo: Any, tmp_path: Path
) -> None:
    from pyhanko.pdf_utils import generic
    from pyhanko.pdf_utils.incremental_writer import IncrementalPdfFileWriter

    writer = IncrementalPdfFileWriter(io.BytesIO(signed_package.read_bytes()))
    stream = generic.StreamObject(stream_data=b"q 1 0 0 rg 100 400 200 60 re f Q")
    writer.add_stream_to_page(0, writer.add_object(stream))
    out = io.BytesIO()
    writer.write(out)
    target = tmp_path / "amended.pdf"
    target.write_bytes(out.getvalue())

    report = verify_package(target, [demo.root])
    assert not report.ok
    for sig in report.signatures:
        assert sig.intact  # the signed bytes are untouched ...
        assert not sig.whole_document
        assert not sig.changes_allowed  # ... but what came after them is not allowed
        assert "other modifications" in sig.changes_after
    assert "NOT ALLOWED" in report.text()
    assert report.text().endswith("Verification FAILED")


def test_untrusted_signer_is_reported(signed_package: Path, demo: Any, tmp_path: Path) -> None:
    from calcpack.signing.keys import make_demo_credentials

    other = make_demo_credentials(tmp_path, firm="Pellucid Structures")
    for trust in ([], [other.root]):
        report = verify_package(signed_package, trust)
        assert not report.ok
        for sig in report.signatures:
            assert sig.intact
            assert not sig.trusted
            assert sig.trust == "untrusted: no chain to a trusted root"


def test_expired_certificate_is_reported(signed_package: Path, demo: Any) -> None:
    later = dt.datetime.now(dt.UTC) + dt.timedelta(days=45)  # demo certificates last 30 days
    report = verify_package(signed_package, [demo.root], at=later)
    assert not report.ok
    assert all("expired" in s.trust for s in report.signatures)
    assert all(s.intact for s in report.signatures)


def test_signature_made_with_an_expired_certificate_is_reported(
    package: Path, tmp_path: Path
) -> None:
    """Sign with the library directly (calcpack refuses expired keys) and verify."""
    from pyhanko.pdf_utils.incremental_writer import IncrementalPdfFileWriter
    from pyhanko.sign import signers

    from calcpack.signing.keys import new_self_signed

    files = new_self_signed(
        tmp_path,
        name="Old Key",
        role="preparer",
        password="pw-old-key-77",
        days=1,
        not_before=dt.datetime.now(dt.UTC) - dt.timedelta(days=10),
    )
    signer = signers.SimpleSigner.load_pkcs12(str(files.key), passphrase=b"pw-old-key-77")
    writer = IncrementalPdfFileWriter(io.BytesIO(package.read_bytes()))
    out = signers.sign_pdf(
        writer, signers.PdfSignatureMetadata(field_name="calcpack_signoff_preparer"), signer
    )
    package.write_bytes(out.getvalue())
    report = verify_package(package, [files.certificate])
    assert not report.ok
    assert "expired" in report.signatures[0].trust


def test_unsigned_package_fails(package: Path, demo: Any) -> None:
    report = verify_package(package, [demo.root])
    assert not report.ok
    assert "the package carries no signature" in report.problems
    assert report.unsigned_roles == ("preparer", "checker", "approver")


def test_partly_signed_package_lists_the_roles_still_to_sign(package: Path, demo: Any) -> None:
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    report = verify_package(package, [demo.root])
    assert report.ok, report.text()
    assert report.unsigned_roles == ("checker", "approver")
    assert "Not signed yet: checker, approver" in report.text()


def test_not_a_package_and_missing_files(tmp_path: Path, demo: Any) -> None:
    from signing_helpers import attach_manifest, cover_pdf

    plain = tmp_path / "plain.pdf"
    plain.write_bytes(attach_manifest(cover_pdf(), None))
    with pytest.raises(VerificationError, match=r"has no embedded calcpack-manifest\.json"):
        verify_package(plain, [demo.root])
    with pytest.raises(VerificationError, match=r"missing\.pdf' does not exist"):
        verify_package(tmp_path / "missing.pdf")
    with pytest.raises(InputError, match=r"nope\.crt' does not exist"):
        verify_package(plain, [tmp_path / "nope.crt"])


def _project_with_files(tmp_path: Path, demo: Any, base_package: Path) -> tuple[Path, Path]:
    from signing_helpers import attach_manifest, cover_pdf, make_manifest

    project = tmp_path / "project"
    (project / "sheets").mkdir(parents=True)
    files = {
        "calcpack.toml": b"[job]\nnumber = '2417'\n",
        "sheets/01-lintel.ipynb": b'{"cells": []}',
        "sheets/02-post.ipynb": b'{"cells": [1]}',
    }
    for rel, content in files.items():
        (project / rel).write_bytes(content)
    listing = [
        {"path": rel, "sha256": hashlib.sha256(content).hexdigest(), "role": "sheet"}
        for rel, content in files.items()
    ]
    pdf = tmp_path / "package.pdf"
    pdf.write_bytes(attach_manifest(cover_pdf(), make_manifest(files=listing)))
    sign_package(pdf, "preparer", demo.keys["preparer"], demo.password)
    return project, pdf


def test_project_file_hashes(tmp_path: Path, demo: Any, base_package: Path) -> None:
    project, pdf = _project_with_files(tmp_path, demo, base_package)
    report = verify_package(pdf, [demo.root], project=project)
    assert report.ok, report.text()
    assert {f.status for f in report.files or ()} == {"ok"}

    (project / "sheets/02-post.ipynb").write_bytes(b'{"cells": [2]}')
    (project / "calcpack.toml").unlink()
    report = verify_package(pdf, [demo.root], project=project)
    assert not report.ok
    status = {f.path: f.status for f in report.files or ()}
    assert status == {
        "calcpack.toml": "missing",
        "sheets/01-lintel.ipynb": "ok",
        "sheets/02-post.ipynb": "changed",
    }
    assert "CHANGED: sheets/02-post.ipynb" in report.text()
    assert "MISSING: calcpack.toml" in report.text()


def test_reproduce_compares_every_recorded_result(
    tmp_path: Path, demo: Any, base_package: Path
) -> None:
    project, pdf = _project_with_files(tmp_path, demo, base_package)
    recorded = verify_package(pdf, [demo.root]).manifest

    same = verify_package(
        pdf, [demo.root], project=project, reproduce=True, reproducer=lambda _: recorded
    )
    assert same.ok, same.text()
    assert same.reproduction == ()

    drifted = json.loads(json.dumps(recorded))
    drifted["sheets"][0]["values"][2]["value"] = 10.95  # M_max now comes out differently
    report = verify_package(
        pdf, [demo.root], project=project, reproduce=True, reproducer=lambda _: drifted
    )
    assert not report.ok
    assert report.reproduction == ("1 Lintel L1: result M_max: package 10.88 kN*m, now 10.95 kN*m",)


def test_reproduce_needs_the_project(signed_package: Path, demo: Any) -> None:
    with pytest.raises(InputError, match="--project DIR"):
        verify_package(signed_package, [demo.root], reproduce=True)


def test_signing_reproduces_only_with_a_reproducer_passed_in(tmp_path: Path, demo: Any) -> None:
    """Signing never imports the build: reproducing needs the reproducer as an argument."""
    pdf = tmp_path / "p.pdf"
    pdf.write_bytes(b"%PDF-1.7\n")
    with pytest.raises(InputError) as info:
        verify_package(pdf, [demo.root], project=tmp_path, reproduce=True)
    assert info.value.name == "reproducer"
    assert "calcpack.verify_package" in str(info.value)


def test_the_public_verify_passes_the_builds_reproducer(
    tmp_path: Path, demo: Any, base_package: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    import calcpack
    from calcpack.package import reproduce

    project, pdf = _project_with_files(tmp_path, demo, base_package)
    recorded = verify_package(pdf, [demo.root]).manifest
    asked: list[Path] = []

    def build_reproducer(folder: Path) -> dict[str, Any]:
        asked.append(Path(folder))
        return recorded

    monkeypatch.setattr(reproduce, "reproduce_manifest", build_reproducer)
    assert calcpack.verify_package is reproduce.verify_package
    report = calcpack.verify_package(pdf, [demo.root], project=project, reproduce=True)
    assert report.ok, report.text()
    assert report.reproduction == ()
    assert asked == [project]
