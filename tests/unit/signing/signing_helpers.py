"""Helpers for the signing tests: calc-package-like PDFs, demo keys, a local timestamp server.

Until the package build lands, the tests make their own package: a WeasyPrint cover page with
a sign-off block of three boxes at known positions, and the manifest attached as
``calcpack-manifest.json`` with ``signature_fields`` measured from that layout (the contract).
"""

from __future__ import annotations

import copy
import datetime as dt
import io
import json
from pathlib import Path
from typing import Any

MM = 72 / 25.4  # PDF points per millimetre
A4_HEIGHT_MM = 297.0
BOX_W_MM, BOX_H_MM, BOX_BOTTOM_MM = 56.0, 26.0, 28.0
BOX_LEFT_MM = {"preparer": 15.0, "checker": 77.0, "approver": 139.0}

BASE_MANIFEST: dict[str, Any] = {
    "format": "calcpack-manifest/1",
    "calcpack_version": "0.1.0",
    "dependencies": {"pint": "0.25"},
    "project": {
        "job_number": "2417",
        "job_title": "Fernhill Library lintels",
        "client": "Corvane Estates",
        "site": "12 Mallow Row",
        "revision": "A",
        "revision_date": "2026-03-02",
    },
    "files": [],
    "sheets": [
        {
            "number": 1,
            "title": "Lintel L1",
            "path": "sheets/01-lintel.ipynb",
            "pages": [2, 3],
            "values": [
                {
                    "name": "L",
                    "symbol": "L",
                    "value": 3.2,
                    "unit": "m",
                    "description": "span",
                    "kind": "given",
                },
                {
                    "name": "w",
                    "symbol": "w",
                    "value": 8.5,
                    "unit": "kN/m",
                    "description": "load",
                    "kind": "given",
                },
                {
                    "name": "M_max",
                    "symbol": "M_{max}",
                    "value": 10.88,
                    "unit": "kN*m",
                    "description": "maximum moment",
                    "kind": "derived",
                },
                {
                    "name": "V_max",
                    "symbol": "V_{max}",
                    "value": 13.6,
                    "unit": "kN",
                    "description": "maximum shear",
                    "kind": "derived",
                },
            ],
            "checks": [
                {
                    "name": "Bending",
                    "member": "L1",
                    "demand": 10.88,
                    "capacity": 14.2,
                    "unit": "kN*m",
                    "utilisation": 0.766,
                    "verdict": "OK",
                    "ref": None,
                    "combination": None,
                    "description": "",
                },
            ],
        },
        {
            "number": 2,
            "title": "Post P1",
            "path": "sheets/02-post.ipynb",
            "pages": [4, 4],
            "values": [
                {
                    "name": "N",
                    "symbol": "N",
                    "value": 27.2,
                    "unit": "kN",
                    "description": "axial",
                    "kind": "given",
                },
            ],
            "checks": [
                {
                    "name": "Compression",
                    "member": "P1",
                    "demand": 27.2,
                    "capacity": 60.0,
                    "unit": "kN",
                    "utilisation": 0.453,
                    "verdict": "OK",
                    "ref": None,
                    "combination": None,
                    "description": "",
                },
            ],
        },
    ],
}


def signature_fields(roles: tuple[str, ...]) -> list[dict[str, Any]]:
    """Boxes of the test cover's sign-off block in PDF points (origin bottom-left)."""
    return [
        {
            "role": role,
            "page": 0,
            "box": [
                BOX_LEFT_MM[role] * MM,
                BOX_BOTTOM_MM * MM,
                (BOX_LEFT_MM[role] + BOX_W_MM) * MM,
                (BOX_BOTTOM_MM + BOX_H_MM) * MM,
            ],
        }
        for role in roles
    ]


def cover_pdf(roles: tuple[str, ...] = ("preparer", "checker", "approver")) -> bytes:
    """A two-page PDF: a cover with a title block and the sign-off boxes, and one sheet page."""
    from weasyprint import HTML

    boxes = "".join(
        f'<div class="label" style="left:{BOX_LEFT_MM[r]}mm">{r.title()}</div>'
        f'<div class="box" style="left:{BOX_LEFT_MM[r]}mm"></div>'
        for r in roles
    )
    html = f"""<html><head><style>
    @page {{ size: A4; margin: 0 }}
    body {{ margin: 0; font-family: 'DejaVu Sans', sans-serif; font-size: 10pt }}
    h1 {{ margin: 30mm 15mm 0 15mm; font-size: 18pt }}
    .box {{ position: absolute; bottom: {BOX_BOTTOM_MM}mm; width: {BOX_W_MM}mm;
            height: {BOX_H_MM}mm; box-sizing: border-box; border: 0.5pt solid #555 }}
    .label {{ position: absolute; bottom: {BOX_BOTTOM_MM + BOX_H_MM + 1}mm; font-size: 8pt }}
    </style></head><body>
    <h1>Job 2417 &ndash; Fernhill Library lintels</h1><p style="margin:4mm 15mm">Revision A</p>
    {boxes}
    <p style="page-break-before: always; margin: 20mm">Sheet 1: Lintel L1</p>
    </body></html>"""
    return bytes(HTML(string=html).write_pdf())


def attach_manifest(pdf: bytes, manifest: dict[str, Any] | None) -> bytes:
    """The PDF with ``manifest`` attached as calcpack-manifest.json (pypdf)."""
    from pypdf import PdfReader, PdfWriter

    writer = PdfWriter(clone_from=PdfReader(io.BytesIO(pdf)))
    if manifest is not None:
        writer.add_attachment("calcpack-manifest.json", json.dumps(manifest).encode("utf-8"))
    out = io.BytesIO()
    writer.write(out)
    return out.getvalue()


def make_manifest(
    roles: tuple[str, ...] = ("preparer", "checker", "approver"), **changes: Any
) -> dict[str, Any]:
    """A copy of the base manifest with the sign-off boxes and top-level keys replaced."""
    manifest = copy.deepcopy(BASE_MANIFEST)
    manifest["signature_fields"] = signature_fields(roles)
    manifest.update(changes)
    return manifest


# --- a local RFC 3161 timestamp authority -------------------------------------------------


def _asn1(cert: Any, key: Any) -> tuple[Any, Any]:
    from asn1crypto import keys as a_keys
    from asn1crypto import x509 as a_x509
    from cryptography.hazmat.primitives import serialization as s

    return (
        a_x509.Certificate.load(cert.public_bytes(s.Encoding.DER)),
        a_keys.PrivateKeyInfo.load(
            key.private_bytes(s.Encoding.DER, s.PrivateFormat.PKCS8, s.NoEncryption())
        ),
    )


def make_timestamp_authority(
    directory: Path, *, days: int, name: str = "Test TSA", fixed_dt: Any = None
) -> tuple[Any, Path]:
    """A local RFC 3161 timestamp authority: pyHanko's DummyTimeStamper with a certificate valid
    for ``days`` from now, issued by a root (valid a day longer) written to ``directory``;
    returns (timestamper, root certificate file).

    RSA keys: the dummy timestamper signs with RSA only. The TSA certificate carries the
    critical timeStamping extended key usage (RFC 3161 §2.3). ``fixed_dt`` makes it state that
    time in its tokens (a renewal in the future).
    """
    from cryptography import x509
    from cryptography.hazmat.primitives import hashes
    from cryptography.hazmat.primitives.asymmetric import rsa
    from cryptography.hazmat.primitives.serialization import Encoding
    from cryptography.x509.oid import ExtendedKeyUsageOID, NameOID
    from pyhanko.sign.timestamps.dummy_client import DummyTimeStamper

    start = dt.datetime.now(dt.UTC) - dt.timedelta(minutes=5)
    root_key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    root_name = x509.Name([x509.NameAttribute(NameOID.COMMON_NAME, f"{name} Root")])
    root = (
        x509.CertificateBuilder()
        .subject_name(root_name)
        .issuer_name(root_name)
        .public_key(root_key.public_key())
        .serial_number(x509.random_serial_number())
        .not_valid_before(start)
        .not_valid_after(start + dt.timedelta(days=days + 1))
        .add_extension(x509.BasicConstraints(ca=True, path_length=None), critical=True)
        .add_extension(
            x509.KeyUsage(False, False, False, False, False, True, True, False, False),
            critical=True,
        )
        .sign(root_key, hashes.SHA256())
    )
    tsa_key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    tsa = (
        x509.CertificateBuilder()
        .subject_name(x509.Name([x509.NameAttribute(NameOID.COMMON_NAME, name)]))
        .issuer_name(root_name)
        .public_key(tsa_key.public_key())
        .serial_number(x509.random_serial_number())
        .not_valid_before(start)
        .not_valid_after(start + dt.timedelta(days=days))
        .add_extension(x509.BasicConstraints(ca=False, path_length=None), critical=True)
        .add_extension(x509.ExtendedKeyUsage([ExtendedKeyUsageOID.TIME_STAMPING]), critical=True)
        .add_extension(
            x509.KeyUsage(True, True, False, False, False, False, False, False, False),
            critical=True,
        )
        .sign(root_key, hashes.SHA256())
    )
    directory.mkdir(parents=True, exist_ok=True)
    root_path = directory / f"{name.lower().replace(' ', '-')}-root.crt"
    root_path.write_bytes(root.public_bytes(Encoding.PEM))
    tsa_cert, tsa_priv = _asn1(tsa, tsa_key)
    root_cert, _ = _asn1(root, root_key)
    stamper = DummyTimeStamper(
        tsa_cert=tsa_cert, tsa_key=tsa_priv, certs_to_embed=[root_cert], fixed_dt=fixed_dt
    )
    return stamper, root_path


def make_tsa(directory: Path) -> tuple[Any, Path]:
    """A test timestamp authority valid for a day (see :func:`make_timestamp_authority`)."""
    return make_timestamp_authority(directory, days=1)
