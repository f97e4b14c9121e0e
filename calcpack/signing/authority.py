"""A firm's own certificate authority: it issues its signers' keys and publishes which are revoked.

A self-signed key (``calcpack keys new``) can never be revoked: nobody can say later that it
was stolen. A firm that runs its own authority (``calcpack keys authority``) issues each signer's
key from it (``calcpack keys new --authority``), and issues a certificate revocation list
(``calcpack keys crl``, RFC 5280 §5) that names the keys withdrawn and since when. A signature
embeds the list current at signing (``calcpack sign --crl``), and ``verify`` reads it back from
the package, so years later the package shows that the signer's key was not revoked when it
signed; a newer list given to ``verify --crl`` reports a key revoked before the signing time
the package proves.

Files: ``<firm>-authority.p12`` (the authority's key, password protected: keep it offline),
``<firm>-authority.crt`` (hand it to whoever verifies: it is their trust root) and
``<firm>-authority.crl`` (the current revocation list, replaced by each ``keys crl``).
"""

from __future__ import annotations

import datetime as dt
import os
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import InputError, SigningError
from calcpack.signing.keys import (
    DEFAULT_VALIDITY_DAYS,
    KeyFiles,
    _name,
    _new_certificate,
    _pem,
    _refuse_existing,
    _slug,
    _validity,
    _write_new,
    _write_p12,
    check_new_password,
    check_role,
)

__all__ = [
    "AUTHORITY_DAYS",
    "CRL_DAYS",
    "AuthorityFiles",
    "RevocationList",
    "issue_crl",
    "issue_key",
    "load_crls",
    "new_authority",
]

#: Validity of a firm's authority unless stated: long enough to outlive the keys it issues.
AUTHORITY_DAYS = 3650

#: Days until a revocation list should be replaced by a fresh one (its nextUpdate).
CRL_DAYS = 30


@dataclass(frozen=True)
class AuthorityFiles:
    """Files written for a new authority: its key file, its certificate and its first list."""

    key: Path
    certificate: Path
    crl: Path


@dataclass(frozen=True)
class RevocationList:
    """What :func:`issue_crl` wrote.

    Attributes:
        path: the revocation list file (DER).
        revoked: (holder, serial number, revocation time) of every key it lists.
        next_update: when a fresh list is due.
    """

    path: Path
    revoked: tuple[tuple[str, int, dt.datetime], ...]
    next_update: dt.datetime


def crl_path(authority: Path) -> Path:
    """The revocation list kept beside the authority's key file."""
    return authority.with_suffix(".crl")


def new_authority(
    directory: str | os.PathLike[str],
    *,
    firm: str,
    password: str,
    days: int = AUTHORITY_DAYS,
    overwrite: bool = False,
) -> AuthorityFiles:
    """Make a firm's certificate authority and its first (empty) revocation list.

    Args:
        directory: where to write the three files.
        firm: the firm's name (the authority is named "<firm> Signing Authority").
        password: protects the authority's key file (at least 12 characters); never stored.
        days: validity of the authority's certificate.
        overwrite: replace existing files of the same name.

    Raises:
        InputError: empty firm, bad validity. SigningError: files exist, short password.
    """
    if not firm or not firm.strip():
        raise InputError("Firm must not be empty (got firm = '')", name="firm", value=firm)
    check_new_password(password)
    start, end = _validity(days, None)
    out = Path(directory)
    key_path = out / f"{_slug(firm)}-authority.p12"
    paths = AuthorityFiles(key_path, key_path.with_suffix(".crt"), crl_path(key_path))
    _refuse_existing(
        (paths.key, paths.certificate, paths.crl),
        "Authority file",
        "choose another folder, or give --force to replace it (every key it issued then "
        "stops verifying)",
        overwrite=overwrite,
    )
    subject = _name(f"{firm.strip()} Signing Authority", firm=firm.strip(), role=None, email=None)
    key, cert = _new_certificate(subject, not_before=start, not_after=end, ca=True)
    _write_p12(paths.key, name=f"{firm} authority", key=key, cert=cert, cas=(), password=password)
    _write_new(paths.certificate, _pem(cert))
    _write_crl(paths.crl, key, cert, [], start, start + dt.timedelta(days=CRL_DAYS))
    return paths


def _load_authority(path: str | os.PathLike[str], password: str) -> tuple[Any, Any]:
    from cryptography.hazmat.primitives.serialization import pkcs12

    p = Path(path)
    if not p.is_file():
        raise SigningError(f"Authority key file {str(p)!r} does not exist")
    try:
        key, cert, _ = pkcs12.load_key_and_certificates(p.read_bytes(), password.encode())
    except ValueError:
        raise SigningError(
            f"Could not open authority key file {str(p)!r}: wrong password, or not PKCS#12"
        ) from None
    constraints = cert.extensions.get_extension_for_class(_basic()).value if cert else None
    if key is None or cert is None or constraints is None or not constraints.ca:
        raise SigningError(
            f"{str(p)!r} is not a certificate authority's key file (make one with "
            "calcpack keys authority)"
        )
    return key, cert


def _basic() -> Any:
    from cryptography import x509

    return x509.BasicConstraints


def issue_key(
    authority: str | os.PathLike[str],
    authority_password: str,
    directory: str | os.PathLike[str],
    *,
    name: str,
    role: str,
    password: str,
    firm: str | None = None,
    email: str | None = None,
    days: int = DEFAULT_VALIDITY_DAYS,
    crl_url: str | None = None,
    not_before: dt.datetime | None = None,
    overwrite: bool = False,
) -> KeyFiles:
    """Issue a signer's key from the firm's authority (a PKCS#12 file carrying the chain).

    Args:
        authority: the authority's key file; authority_password: its password.
        directory: where to write ``<name>.p12`` and ``<name>.crt``.
        name, role, firm, email: recorded in the certificate (firm defaults to the authority's).
        password: protects the new key file (at least 12 characters).
        days: validity; the key may not outlive the authority.
        crl_url: where the authority publishes its revocation list, written into the
            certificate so that signing fetches the list (None: give ``sign --crl FILE``).
        not_before: start of validity (default now; tests of expired keys).

    Raises:
        InputError: unknown role, empty name, bad validity. SigningError: authority file
            unreadable, key would outlive it, files exist, short password.
    """
    from cryptography.x509.oid import NameOID

    check_role(role)
    if not name or not name.strip():
        raise InputError("Signer name must not be empty (got name = '')", name="name", value=name)
    check_new_password(password)
    ca_key, ca_cert = _load_authority(authority, authority_password)
    start, end = _validity(days, not_before)
    if end > ca_cert.not_valid_after_utc:
        raise SigningError(
            f"A key valid {days} days would outlive its authority (valid until "
            f"{ca_cert.not_valid_after_utc:%Y-%m-%d}); give fewer --days"
        )
    orgs = ca_cert.subject.get_attributes_for_oid(NameOID.ORGANIZATION_NAME)
    firm = firm or (str(orgs[0].value) if orgs else None)
    out = Path(directory)
    key_path, cert_path = out / f"{_slug(name)}.p12", out / f"{_slug(name)}.crt"
    _refuse_existing(
        (key_path, cert_path),
        "Key file",
        "choose another name or folder, or give --force to replace it",
        overwrite=overwrite,
    )
    key, cert = _new_certificate(
        _name(name.strip(), firm=firm, role=role, email=email),
        issuer=ca_cert.subject,
        issuer_key=ca_key,
        not_before=start,
        not_after=end,
        ca=False,
        crl_url=crl_url,
    )
    _write_p12(key_path, name=name, key=key, cert=cert, cas=[ca_cert], password=password)
    _write_new(cert_path, _pem(cert))
    return KeyFiles(key=key_path, certificate=cert_path)


def issue_crl(
    authority: str | os.PathLike[str],
    authority_password: str,
    *,
    revoke: Iterable[str | os.PathLike[str]] = (),
    days: int = CRL_DAYS,
    revoked_at: dt.datetime | None = None,
) -> RevocationList:
    """Issue a fresh revocation list: every key listed before, plus the certificates ``revoke``.

    Args:
        authority: the authority's key file (its list is kept beside it, same name ``.crl``).
        revoke: certificate files of keys to withdraw from now on.
        days: until the next list is due (at least 1).
        revoked_at: when the keys stopped being trusted (default now; a key known stolen
            earlier may be dated back to then).

    Raises:
        SigningError: the authority file is unreadable, or a certificate was not issued by it.
        InputError: a certificate file is missing or unreadable; bad ``days``.
    """
    from cryptography import x509

    key, cert = _load_authority(authority, authority_password)
    now, next_update = _validity(days, None)
    when = revoked_at or now
    path = crl_path(Path(authority))
    entries: dict[int, tuple[dt.datetime, str]] = {}
    if path.is_file():
        old = x509.load_der_x509_crl(path.read_bytes())
        for entry in old:  # a list names serial numbers only, not holders
            serial = entry.serial_number
            entries[serial] = (entry.revocation_date_utc, f"serial {serial:x}")
    for raw in revoke:
        target = _certificate(raw)
        if target.issuer != cert.subject:
            raise SigningError(
                f"Certificate {str(raw)!r} was not issued by {str(authority)!r} (its issuer is "
                f"{target.issuer.rfc4514_string()}); only its own authority can revoke a key"
            )
        holder = target.subject.rfc4514_string()
        entries.setdefault(target.serial_number, (when, holder))
    _write_crl(path, key, cert, [(s, d) for s, (d, _) in entries.items()], now, next_update)
    revoked = tuple((h, s, d) for s, (d, h) in sorted(entries.items()))
    return RevocationList(path=path, revoked=revoked, next_update=next_update)


def _certificate(raw: str | os.PathLike[str]) -> Any:
    from cryptography import x509

    p = Path(raw)
    if not p.is_file():
        raise InputError(
            f"Certificate file {str(p)!r} does not exist",
            name="revoke",
            value=str(p),
            expected="the certificate (.crt) of a key the authority issued",
        )
    data = p.read_bytes()
    try:
        return (
            x509.load_pem_x509_certificate(data)
            if b"-----BEGIN" in data
            else x509.load_der_x509_certificate(data)
        )
    except ValueError as exc:
        raise InputError(
            f"Certificate file {str(p)!r} holds no readable certificate ({exc})",
            name="revoke",
            value=str(p),
            expected="a PEM or DER certificate",
        ) from None


def _write_crl(
    path: Path,
    key: Any,
    cert: Any,
    revoked: list[tuple[int, dt.datetime]],
    this_update: dt.datetime,
    next_update: dt.datetime,
) -> None:
    from cryptography import x509
    from cryptography.hazmat.primitives import hashes
    from cryptography.hazmat.primitives.serialization import Encoding

    number = int(this_update.timestamp() * 1000)  # increases with every list (RFC 5280 §5.2.3)
    builder = (
        x509.CertificateRevocationListBuilder()
        .issuer_name(cert.subject)
        .last_update(this_update)
        .next_update(next_update)
        .add_extension(x509.CRLNumber(number), critical=False)
        .add_extension(
            x509.AuthorityKeyIdentifier.from_issuer_public_key(key.public_key()), critical=False
        )
    )
    for serial, when in revoked:
        builder = builder.add_revoked_certificate(
            x509.RevokedCertificateBuilder().serial_number(serial).revocation_date(when).build()
        )
    crl = builder.sign(key, hashes.SHA256())
    _write_new(path, crl.public_bytes(Encoding.DER))


def load_crls(paths: Iterable[str | os.PathLike[str]]) -> list[Any]:
    """Load revocation lists (DER or PEM) as asn1crypto ``CertificateList`` objects.

    Raises:
        InputError: a file is missing or holds no revocation list, naming the file.
    """
    import base64

    from asn1crypto import crl

    lists = []
    for raw in paths:
        p = Path(raw)
        if not p.is_file():
            raise InputError(
                f"Revocation list {str(p)!r} does not exist",
                name="crl",
                value=str(p),
                expected="a certificate revocation list file (.crl)",
            )
        data = p.read_bytes()
        if data.lstrip().startswith(b"-----BEGIN"):
            body = b"".join(ln for ln in data.splitlines() if not ln.startswith(b"-----"))
            data = base64.b64decode(body)
        try:
            item = crl.CertificateList.load(data)
            item.native  # noqa: B018 - parse it all now, so a bad file fails here, named
        except (ValueError, TypeError) as exc:
            raise InputError(
                f"Revocation list {str(p)!r} is not readable ({exc})",
                name="crl",
                value=str(p),
                expected="a certificate revocation list file (.crl)",
            ) from None
        lists.append(item)
    return lists
