"""Helpers for the archive fault-injection tests: a small project built and signed once."""

from __future__ import annotations

import shutil
from pathlib import Path
from typing import Any

from tests.build.projectkit import make_project

SHEETS = {
    "Joist J1": [
        'L = s.given("L", 3.2 * ureg.m, "span")\n'
        'w = s.given("w", 2.5 * ureg.kN / ureg.m, "line load")\n'
        's.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")'
    ],
}


def built_project(root: Path) -> tuple[Path, Path]:
    """A one-sheet project built with ``calcpack build``; returns (project folder, PDF)."""
    from calcpack.cli import main

    project = make_project(root / "project", SHEETS)
    assert main(["build", str(project), "--quiet", "--workers", "1"]) == 0
    (pdf,) = (project / "build").glob("*.pdf")
    return project, pdf


def copy_project(source: Path, target: Path) -> Path:
    """A copy of a project folder with its build output and cache."""
    shutil.copytree(source, target)
    return target


def sign(pdf: Path, role: str, demo: Any, **kwargs: Any) -> None:
    """Sign ``pdf`` in place as ``role`` with the demo key of that role."""
    from calcpack.signing.sign import sign_package

    sign_package(pdf, role, demo.keys[role], demo.password, **kwargs)


def make_timestamp_authority(
    directory: Path, *, days: int, name: str = "Test TSA", fixed_dt: Any = None
) -> tuple[Any, Path]:
    """A local RFC 3161 timestamp authority (pyHanko's test timestamper) whose certificate is
    valid for ``days`` from now; returns (timestamper, root certificate file).

    ``fixed_dt`` makes it state that time in its tokens (a renewal in the future)."""
    import datetime as dt

    from asn1crypto import keys as a_keys
    from asn1crypto import x509 as a_x509
    from cryptography import x509
    from cryptography.hazmat.primitives import hashes
    from cryptography.hazmat.primitives import serialization as ser
    from cryptography.hazmat.primitives.asymmetric import rsa
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
    key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    cert = (
        x509.CertificateBuilder()
        .subject_name(x509.Name([x509.NameAttribute(NameOID.COMMON_NAME, name)]))
        .issuer_name(root_name)
        .public_key(key.public_key())
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
    root_path.write_bytes(root.public_bytes(ser.Encoding.PEM))

    def asn1(c: Any) -> Any:
        return a_x509.Certificate.load(c.public_bytes(ser.Encoding.DER))

    private = a_keys.PrivateKeyInfo.load(
        key.private_bytes(ser.Encoding.DER, ser.PrivateFormat.PKCS8, ser.NoEncryption())
    )
    stamper = DummyTimeStamper(
        tsa_cert=asn1(cert), tsa_key=private, certs_to_embed=[asn1(root)], fixed_dt=fixed_dt
    )
    return stamper, root_path
