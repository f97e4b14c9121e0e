"""Signing credentials: self-signed keys for in-house use, demo credentials, loading and checking.

A credential is a private key with its X.509 certificate, kept in a password-protected PKCS#12
file (``.p12``/``.pfx``) or in PEM files from a certificate authority. Passwords are only ever
taken from the environment variable :data:`PASSWORD_ENV` or an interactive prompt; calcpack never
accepts them on the command line and never writes them to a file, log or output.
"""

from __future__ import annotations

import datetime as dt
import getpass
import os
import secrets
import sys
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import InputError, SigningError
from calcpack.fileio import write_atomically

__all__ = [
    "PASSWORD_ENV",
    "ROLES",
    "Credentials",
    "DemoCredentials",
    "KeyFiles",
    "load_certificates",
    "load_credentials",
    "make_demo_credentials",
    "new_self_signed",
    "read_password",
]

#: Environment variable read for the key password before falling back to a prompt.
PASSWORD_ENV = "CALCPACK_KEY_PASSWORD"

#: The sign-off roles, in the order in which they sign.
ROLES: tuple[str, ...] = ("preparer", "checker", "approver")

_RSA_BITS = 2048  # broadest support among PDF readers; ~0.1 s to generate

#: Shortest key password accepted for a new key file (a PKCS#12 file can be attacked offline).
MIN_PASSWORD_LENGTH = 12

#: Validity of a certificate from ``keys new`` unless stated otherwise. Signatures outlive it:
#: a timestamp proves when they were made (calcpack.signing.longterm).
DEFAULT_VALIDITY_DAYS = 730


def check_new_password(password: str) -> str:
    """Return ``password`` if it is long enough for a new key file.

    Raises:
        SigningError: empty or shorter than :data:`MIN_PASSWORD_LENGTH` (the message gives the
            length, never the password).
    """
    if not password:
        raise SigningError("The key password must not be empty")
    if len(password) < MIN_PASSWORD_LENGTH:
        raise SigningError(
            f"The key password must have at least {MIN_PASSWORD_LENGTH} characters "
            f"(got {len(password)}); nothing was written"
        )
    return password


def check_role(role: str) -> str:
    """Return ``role`` if it is one of :data:`ROLES`, else raise InputError naming it."""
    if role not in ROLES:
        raise InputError(
            f"Role must be one of {', '.join(ROLES)} (got role = {role!r})",
            name="role",
            value=role,
            expected=" | ".join(ROLES),
        )
    return role


def read_password(prompt: str = "Key password: ", *, confirm: bool = False) -> str:
    """The key password from ``$CALCPACK_KEY_PASSWORD``, or else from an interactive prompt.

    Args:
        prompt: text shown by the prompt.
        confirm: ask twice and require both entries to agree (for new keys).

    Raises:
        SigningError: no environment variable and no terminal to prompt on, or the two
            entries differ, or the password is empty.
    """
    from_env = os.environ.get(PASSWORD_ENV)
    if from_env is not None:
        if not from_env:
            raise SigningError(f"The key password in ${PASSWORD_ENV} is empty")
        return from_env
    if not sys.stdin.isatty():
        raise SigningError(
            f"No key password: set the environment variable {PASSWORD_ENV} "
            "or run the command in a terminal to be prompted"
        )
    try:
        password = getpass.getpass(prompt)
        again = getpass.getpass("Repeat the password: ") if confirm else password
    except EOFError:  # Ctrl-D at the prompt
        raise SigningError("No key password entered (input ended); nothing was done") from None
    if again != password:
        raise SigningError("The two passwords entered differ; nothing was written")
    if not password:
        raise SigningError("The key password must not be empty")
    return password


@dataclass(frozen=True)
class KeyFiles:
    """Files written for one new credential.

    Attributes:
        key: the password-protected PKCS#12 file holding the private key and certificate.
        certificate: the certificate alone (PEM), to hand to whoever verifies signatures.
    """

    key: Path
    certificate: Path


@dataclass(frozen=True)
class DemoCredentials:
    """Demo credentials made on the fly: one root authority and one key per role.

    Attributes:
        root: the demo root certificate (PEM) -- the trust anchor to pass to ``verify``.
        keys: PKCS#12 file per role (``"preparer"``, ``"checker"``, ``"approver"``).
        password: the password of every PKCS#12 file; held in memory only, never written.
    """

    root: Path
    keys: dict[str, Path]
    password: str

    def __repr__(self) -> str:  # keep the password out of logs and tracebacks
        return f"DemoCredentials(root={self.root!r}, keys={self.keys!r}, password='***')"


def _name(common_name: str, *, firm: str | None, role: str | None, email: str | None) -> Any:
    from cryptography import x509
    from cryptography.x509.oid import NameOID

    attrs = [x509.NameAttribute(NameOID.COMMON_NAME, common_name)]
    if firm:
        attrs.append(x509.NameAttribute(NameOID.ORGANIZATION_NAME, firm))
    if role:
        attrs.append(x509.NameAttribute(NameOID.TITLE, role))
    if email:
        attrs.append(x509.NameAttribute(NameOID.EMAIL_ADDRESS, email))
    return x509.Name(attrs)


def _new_key() -> Any:
    from cryptography.hazmat.primitives.asymmetric import rsa

    return rsa.generate_private_key(public_exponent=65537, key_size=_RSA_BITS)


def _new_certificate(
    subject: Any,
    *,
    not_before: dt.datetime,
    not_after: dt.datetime,
    ca: bool,
    issuer: Any = None,
    issuer_key: Any = None,
    crl_url: str | None = None,
) -> tuple[Any, Any]:
    """A new key and its certificate for ``subject``, issued by ``issuer`` (a name) with
    ``issuer_key``, or self-signed when no issuer is given."""
    key = _new_key()
    signer = key if issuer_key is None else issuer_key
    cert = _build_certificate(
        subject=subject,
        issuer=subject if issuer is None else issuer,
        public_key=key.public_key(),
        issuer_key=signer,
        issuer_public_key=signer.public_key(),
        not_before=not_before,
        not_after=not_after,
        ca=ca,
        crl_url=crl_url,
    )
    return key, cert


def _refuse_existing(paths: Iterable[Path], what: str, advice: str, *, overwrite: bool) -> None:
    """Refuse to write over a key, certificate or list that exists, unless ``overwrite``."""
    for existing in paths:
        if existing.exists() and not overwrite:
            raise SigningError(f"{what} {str(existing)!r} exists already; {advice}")


def _build_certificate(
    *,
    subject: Any,
    issuer: Any,
    public_key: Any,
    issuer_key: Any,
    not_before: dt.datetime,
    not_after: dt.datetime,
    ca: bool,
    issuer_public_key: Any,
    crl_url: str | None = None,
) -> Any:
    from cryptography import x509
    from cryptography.hazmat.primitives import hashes

    builder = (
        x509.CertificateBuilder()
        .subject_name(subject)
        .issuer_name(issuer)
        .public_key(public_key)
        .serial_number(x509.random_serial_number())
        .not_valid_before(not_before)
        .not_valid_after(not_after)
        .add_extension(x509.BasicConstraints(ca=ca, path_length=None), critical=True)
        .add_extension(x509.SubjectKeyIdentifier.from_public_key(public_key), critical=False)
        .add_extension(
            x509.AuthorityKeyIdentifier.from_issuer_public_key(issuer_public_key), critical=False
        )
        .add_extension(
            x509.KeyUsage(
                digital_signature=True,
                content_commitment=not ca,  # "non-repudiation": the signer stands behind it
                key_encipherment=False,
                data_encipherment=False,
                key_agreement=False,
                key_cert_sign=ca,
                crl_sign=ca,
                encipher_only=False,
                decipher_only=False,
            ),
            critical=True,
        )
    )
    if crl_url:  # where a validator fetches the issuer's revocation list
        point = x509.DistributionPoint([x509.UniformResourceIdentifier(crl_url)], None, None, None)
        builder = builder.add_extension(x509.CRLDistributionPoints([point]), critical=False)
    return builder.sign(issuer_key, hashes.SHA256())


def _validity(days: int, not_before: dt.datetime | None) -> tuple[dt.datetime, dt.datetime]:
    if isinstance(days, bool) or not isinstance(days, int) or days < 1:
        raise InputError(
            f"Validity days must be a whole number of days, at least 1 (got days = {days!r})",
            name="days",
            value=days,
            expected="an integer >= 1",
        )
    start = not_before or dt.datetime.now(dt.UTC) - dt.timedelta(minutes=5)
    return start, start + dt.timedelta(days=days)


def _write_p12(
    path: Path, *, name: str, key: Any, cert: Any, cas: Iterable[Any], password: str
) -> None:
    from cryptography.hazmat.primitives.serialization import BestAvailableEncryption, pkcs12

    data = pkcs12.serialize_key_and_certificates(
        name.encode("utf-8"),
        key,
        cert,
        list(cas) or None,
        BestAvailableEncryption(password.encode()),
    )
    _write_new(path, data)


def _write_new(path: Path, data: bytes) -> None:
    """Write ``data`` to ``path`` atomically, readable by the owner only."""
    write_atomically(path, data, mode=0o600)


def _pem(cert: Any) -> bytes:
    from cryptography.hazmat.primitives.serialization import Encoding

    return bytes(cert.public_bytes(Encoding.PEM))


def _slug(name: str) -> str:
    slug = "".join(ch.lower() if ch.isalnum() else "-" for ch in name).strip("-")
    return "-".join(part for part in slug.split("-") if part) or "key"


def new_self_signed(
    directory: str | os.PathLike[str],
    *,
    name: str,
    role: str,
    password: str,
    firm: str | None = None,
    email: str | None = None,
    days: int = DEFAULT_VALIDITY_DAYS,
    not_before: dt.datetime | None = None,
    overwrite: bool = False,
) -> KeyFiles:
    """Make a self-signed certificate and a password-protected PKCS#12 file for in-house use.

    The certificate is its own trust anchor: hand ``KeyFiles.certificate`` to whoever verifies.

    Args:
        directory: where to write ``<name>.p12`` and ``<name>.crt``.
        name: the signer's full name (certificate common name).
        role: the sign-off role recorded in the certificate's title (one of :data:`ROLES`).
        password: protects the PKCS#12 file; it is not stored anywhere.
        firm: the signer's firm (certificate organisation).
        email: optional e-mail address.
        days: validity in days from now (default :data:`DEFAULT_VALIDITY_DAYS`).
        not_before: start of validity (default: now); for tests of not-yet-valid certificates.
        overwrite: replace existing files of the same name.

    Raises:
        InputError: empty name, unknown role, bad validity.
        SigningError: the files exist already and ``overwrite`` is false; a password shorter
            than :data:`MIN_PASSWORD_LENGTH`.
    """
    check_role(role)
    if not name or not name.strip():
        raise InputError("Signer name must not be empty (got name = '')", name="name", value=name)
    check_new_password(password)
    start, end = _validity(days, not_before)
    out = Path(directory)
    key_path = out / f"{_slug(name)}.p12"
    cert_path = out / f"{_slug(name)}.crt"
    _refuse_existing(
        (key_path, cert_path),
        "Key file",
        "choose another name or folder, or give --force to replace it (signatures made with "
        "the old key then cannot be matched to a key file)",
        overwrite=overwrite,
    )
    subject = _name(name.strip(), firm=firm, role=role, email=email)
    key, cert = _new_certificate(subject, not_before=start, not_after=end, ca=False)
    _write_p12(key_path, name=name, key=key, cert=cert, cas=(), password=password)
    _write_new(cert_path, _pem(cert))
    return KeyFiles(key=key_path, certificate=cert_path)


def make_demo_credentials(
    directory: str | os.PathLike[str],
    *,
    firm: str = "Harrowgate & Vell Consulting Engineers",
    people: dict[str, str] | None = None,
    password: str | None = None,
    days: int = 30,
) -> DemoCredentials:
    """Make a demo root authority and one signing key per role, for demonstrations and tests.

    Args:
        directory: where to write ``demo-root.crt`` and ``demo-<role>.p12``.
        firm: the invented firm named in every certificate.
        people: invented signer name per role (defaults provided).
        password: password of the PKCS#12 files; a random one is made when omitted.
        days: validity of the certificates in days.

    Returns:
        The paths and the (in-memory only) password.
    """
    from cryptography.hazmat.primitives.serialization import Encoding

    names = {"preparer": "Ines Calloway", "checker": "Tomas Redfern", "approver": "Marta Quell"}
    names.update(people or {})
    password = password or secrets.token_urlsafe(18)
    start, end = _validity(days, None)
    out = Path(directory)
    root_name = _name(f"{firm} Demo Root", firm=firm, role=None, email=None)
    root_key, root = _new_certificate(
        root_name, not_before=start, not_after=end + dt.timedelta(days=1), ca=True
    )
    root_path = out / "demo-root.crt"
    _write_new(root_path, root.public_bytes(Encoding.PEM))
    keys: dict[str, Path] = {}
    for role in ROLES:
        key, cert = _new_certificate(
            _name(names[role], firm=firm, role=role, email=None),
            issuer=root_name,
            issuer_key=root_key,
            not_before=start,
            not_after=end,
            ca=False,
        )
        keys[role] = out / f"demo-{role}.p12"
        _write_p12(keys[role], name=names[role], key=key, cert=cert, cas=[root], password=password)
    return DemoCredentials(root=root_path, keys=keys, password=password)


@dataclass(frozen=True)
class Credentials:
    """A loaded signing key with its certificate and the rest of its chain.

    Attributes:
        path: the key file it came from.
        signer: the signing library's signer object holding the key in memory.
        certificate: the signer's certificate (asn1crypto ``x509.Certificate``).
        chain: other certificates from the key file (issuer chain).
    """

    path: Path
    signer: Any
    certificate: Any
    chain: tuple[Any, ...]

    @property
    def name(self) -> str:
        """The signer's common name."""
        return certificate_name(self.certificate)

    @property
    def role(self) -> str | None:
        """The sign-off role recorded in the certificate (its title), if it is one of ROLES."""
        value = self.certificate.subject.native.get("title")
        return str(value) if value in ROLES else None

    @property
    def firm(self) -> str | None:
        """The signer's organisation, if the certificate names one."""
        value = self.certificate.subject.native.get("organization_name")
        return str(value) if value else None


def certificate_name(cert: Any) -> str:
    """The common name of an asn1crypto certificate, else its whole subject."""
    native = cert.subject.native
    common = native.get("common_name")
    return str(common) if common else str(cert.subject.human_friendly)


def certificate_sha256(cert: Any) -> str:
    """Hex SHA-256 of an asn1crypto certificate's DER encoding (its fingerprint)."""
    import hashlib

    return hashlib.sha256(cert.dump()).hexdigest()


def same_person(a: str, b: str) -> bool:
    """Whether two signer names are the same name (case, spacing and full stops ignored)."""

    def norm(name: str) -> str:
        return " ".join(name.replace(".", " ").split()).casefold()

    return bool(norm(a)) and norm(a) == norm(b)


def load_certificates(paths: Iterable[str | os.PathLike[str]]) -> list[Any]:
    """Load PEM or DER certificates (several per PEM file allowed) as asn1crypto objects.

    Raises:
        InputError: a file is missing or holds no certificate, naming the file.
    """
    from pyhanko.keys import load_certs_from_pemder

    certs: list[Any] = []
    for raw in paths:
        path = Path(raw)
        if not path.is_file():
            raise InputError(
                f"Certificate file {str(path)!r} does not exist",
                name="trust",
                value=str(path),
                expected="a PEM or DER certificate file",
            )
        try:
            loaded = list(load_certs_from_pemder([str(path)]))
        except (OSError, ValueError, TypeError) as exc:
            raise InputError(
                f"Certificate file {str(path)!r} holds no readable certificate ({exc})",
                name="trust",
                value=str(path),
                expected="a PEM or DER certificate file",
            ) from exc
        if not loaded:
            raise InputError(
                f"Certificate file {str(path)!r} holds no certificate",
                name="trust",
                value=str(path),
            )
        certs.extend(loaded)
    return certs


def load_credentials(
    key: str | os.PathLike[str],
    password: str | None,
    *,
    certificate: str | os.PathLike[str] | None = None,
    chain: Iterable[str | os.PathLike[str]] = (),
    at: dt.datetime | None = None,
) -> Credentials:
    """Load a signing key and check that its certificate may sign now.

    Args:
        key: a PKCS#12 file (``.p12``/``.pfx``), or a PEM/DER private key file.
        password: the key's password (``None`` for an unencrypted PEM key).
        certificate: the certificate file for a PEM/DER key (for PKCS#12 it is inside).
        chain: further issuer certificates to embed in signatures.
        at: the moment to check validity at (default: now).

    Raises:
        SigningError: missing key file, wrong password, unreadable file, certificate expired
            or not yet valid, or without a key usage that allows signing.
    """
    from pyhanko.sign.signers import SimpleSigner

    path = Path(key)
    if not path.is_file():
        raise SigningError(f"Key file {str(path)!r} does not exist")
    extra = load_certificates(chain)
    pw = password.encode("utf-8") if password else None
    data = path.read_bytes()
    signer: Any
    if path.suffix.lower() in {".p12", ".pfx"}:
        try:
            signer = SimpleSigner.load_pkcs12_data(data, other_certs=extra, passphrase=pw)
        except ValueError:
            raise SigningError(
                f"Could not open key file {str(path)!r}: wrong password, or not a PKCS#12 file"
            ) from None
    else:
        if certificate is None:
            raise SigningError(
                f"Key file {str(path)!r} is not PKCS#12, so its certificate must be given too "
                "(--cert FILE)"
            )
        signer = _load_pem_signer(path, Path(certificate), pw, extra)
    cert = signer.signing_cert
    chain_certs = tuple(c for c in signer.cert_registry if c.dump() != cert.dump())
    check_certificate(cert, at=at)
    return Credentials(path=path, signer=signer, certificate=cert, chain=chain_certs)


def _load_pem_signer(path: Path, cert_path: Path, pw: bytes | None, extra: list[Any]) -> Any:
    from pyhanko.keys import load_cert_from_pemder, load_private_key_from_pemder
    from pyhanko.sign.signers import SimpleSigner
    from pyhanko_certvalidator.registry import SimpleCertificateStore

    if not cert_path.is_file():
        raise SigningError(f"Certificate file {str(cert_path)!r} does not exist")
    try:
        private = load_private_key_from_pemder(str(path), passphrase=pw)
    except (ValueError, TypeError):
        raise SigningError(
            f"Could not open key file {str(path)!r}: wrong password, or not a private key"
        ) from None
    try:
        cert = load_cert_from_pemder(str(cert_path))
    except (ValueError, TypeError) as exc:
        raise SigningError(f"Certificate file {str(cert_path)!r} is unreadable ({exc})") from None
    store = SimpleCertificateStore()
    store.register_multiple(extra)
    return SimpleSigner(signing_cert=cert, signing_key=private, cert_registry=store)


def check_certificate(cert: Any, *, at: dt.datetime | None = None) -> None:
    """Refuse a certificate that may not sign at ``at`` (default now).

    Raises:
        SigningError: expired, not yet valid, or no key usage allowing signatures (naming the
            certificate's holder and the dates or usages found).
    """
    moment = at or dt.datetime.now(dt.UTC)
    who = certificate_name(cert)
    validity = cert["tbs_certificate"]["validity"]
    start = validity["not_before"].native
    end = validity["not_after"].native
    if moment < start:
        raise SigningError(
            f"Certificate of {who!r} is not valid yet: valid from {start:%Y-%m-%d %H:%M} UTC "
            f"(now {moment:%Y-%m-%d %H:%M} UTC)"
        )
    if moment > end:
        raise SigningError(
            f"Certificate of {who!r} expired on {end:%Y-%m-%d %H:%M} UTC; "
            "renew it or use another key"
        )
    usage = cert.key_usage_value
    allowed = {"digital_signature", "non_repudiation"}
    if usage is not None and not (set(usage.native) & allowed):
        raise SigningError(
            f"Certificate of {who!r} does not allow signing: its key usage is "
            f"{', '.join(sorted(usage.native))}, it needs digital_signature or non_repudiation"
        )
