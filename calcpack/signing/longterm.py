"""Long-term validation: what a signature needs to be verified years after its certificates expire.

At signing, every signature embeds the certificate chain and whatever revocation data is at hand
in the document security store (PAdES baseline B-LT); when a timestamp server is configured, the
signature carries a signature timestamp and a document timestamp follows it (B-LTA).
:func:`renew_timestamp` adds a fresh document timestamp to an issued package, to be run before
the newest timestamp's certificate expires.

At verification, time is established from the newest document timestamp backwards: the newest
is checked at the validation time (now, or the date asked for); each earlier timestamp at the
time the next one proves; a signature's certificates at the time its own timestamp proves, else
at the time of the first document timestamp after it. Without any timestamp, the only time is
the signer's own claim, used only when asked for (``at="signing-time"``) and reported as such.
"""

from __future__ import annotations

import datetime as dt
import io
import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import SigningError, VerificationError
from calcpack.signing._util import quiet_library_logs, write_atomically

__all__ = [
    "SIGNING_TIME",
    "DocumentTimestamp",
    "Moment",
    "RenewResult",
    "StoredData",
    "document_timestamps",
    "embedding_context",
    "publishes_revocation",
    "renew_timestamp",
    "revocation_note",
    "self_signed",
]


def self_signed(certs: Any) -> list[Any]:
    """The self-signed certificates (roots) among asn1crypto ``certs``."""
    return [c for c in certs if c.subject == c.issuer]


def _token_certs(token: Any) -> list[Any]:
    """The certificates a timestamp token (CMS ContentInfo) carries."""
    try:
        certs = token["content"]["certificates"]
    except (KeyError, TypeError):
        return []
    return [c.chosen for c in certs or () if c.name == "certificate"]


def publishes_revocation(cert: Any) -> bool:
    """Whether an asn1crypto certificate names where its revocation status is published
    (a CRL distribution point or an OCSP responder)."""
    return bool(cert.crl_distribution_points or cert.ocsp_urls)


def embedding_context(creds: Any, stamper: Any, crls: list[Any] | None = None) -> Any:
    """The validation context used to collect what the signature embeds (chain, revocation data).

    It trusts the roots the key file and the timestamp server present: it decides nothing about
    trust (``verify`` does, with the roots its user gives), it only gathers the chain and the
    revocation data: the lists given (``sign --crl``), and what is fetched from the services a
    certificate of the chain names (its CRL distribution point or OCSP responder). Nothing is
    fetched when no certificate names one.

    Raises:
        SigningError: the chain lacks its root; the timestamp server fails; a list given or
            fetched says the signer's key is revoked.
    """
    import asyncio

    from pyhanko_certvalidator import ValidationContext

    roots = self_signed([creds.certificate, *creds.chain])
    if not roots:
        raise SigningError(
            f"The certificate chain of {creds.name!r} is not complete: {str(creds.path)!r} does "
            "not include the root certificate that issued it. Give the issuer certificates with "
            "--chain FILE, so that the signature carries what a validator needs years later"
        )
    if stamper is not None:
        from pyhanko.sign.general import SigningError as LibrarySigningError

        try:
            token = asyncio.run(stamper.async_dummy_response("sha256"))
        except (OSError, ValueError, LibrarySigningError) as exc:
            raise SigningError(f"The timestamp server did not answer ({exc})") from exc
        roots += self_signed(_token_certs(token))
    fetch = any(publishes_revocation(c) for c in (creds.certificate, *creds.chain))

    def context(required: bool) -> Any:
        return ValidationContext(
            trust_roots=roots,
            other_certs=list(creds.chain),
            allow_fetching=fetch,
            crls=crls or [],
            revinfo_policy=revocation_policy(required),
        )

    if crls or fetch:  # the lists given must speak for the signer's key
        _refuse_revoked(creds, context(bool(crls) and not fetch))
    return context(False)  # what is embedded: the timestamp authority's chain too


def _refuse_revoked(creds: Any, context: Any) -> None:
    """Refuse to sign with a key its authority has revoked (by the lists at hand)."""
    import asyncio

    from pyhanko_certvalidator import CertificateValidator
    from pyhanko_certvalidator.errors import (
        InsufficientRevinfoError,
        PathValidationError,
        RevokedError,
    )

    validator = CertificateValidator(
        creds.certificate, intermediate_certs=list(creds.chain), validation_context=context
    )
    try:
        asyncio.run(validator.async_validate_usage(set()))
    except RevokedError as exc:
        raise SigningError(
            f"The certificate of {creds.name!r} ({str(creds.path)!r}) is revoked by its "
            f"authority ({exc}); it may not sign. Ask the firm's authority for a new key"
        ) from None
    except InsufficientRevinfoError as exc:
        raise SigningError(
            f"The revocation list(s) given do not speak for the key of {creds.name!r} "
            f"({exc}); give the list of the authority that issued it (calcpack keys crl)"
        ) from None
    except PathValidationError:
        pass  # trust is decided by verify, with the roots its user gives


def revocation_note(creds: Any, data: bytes) -> str:
    """What revocation data the signed package carries for its newest signature, in words."""
    from pyhanko.pdf_utils.reader import PdfFileReader
    from pyhanko.sign.validation.dss import DocumentSecurityStore, NoDSSFoundError

    if creds.certificate.self_signed != "no" and not creds.chain:
        return (
            "revocation: none (a self-signed key cannot be revoked; a key issued by the firm's "
            "authority can, see calcpack keys authority)"
        )
    try:
        dss = DocumentSecurityStore.read_dss(PdfFileReader(io.BytesIO(data), strict=False))
        crls, ocsps = len(dss.crls), len(dss.ocsps)
    except NoDSSFoundError:
        crls = ocsps = 0
    if crls or ocsps:
        return f"revocation data embedded: {crls} revocation list(s), {ocsps} OCSP response(s)"
    return (
        "revocation: NO revocation data embedded (signed offline: the certificates name no "
        "revocation service and no --crl FILE was given), so a validator cannot show later "
        "that the key was not revoked"
    )


@dataclass(frozen=True)
class StoredData:
    """What the package stores for validating it later (its document security store), plus any
    newer revocation lists the verifier holds.

    Attributes:
        certs: certificates stored (chains of the signers and timestamp authorities).
        crls: revocation lists (asn1crypto ``CertificateList``), stored then given.
        ocsps: OCSP responses stored.
        stored_crls: how many of ``crls`` came from the package (the rest were given).
    """

    certs: tuple[Any, ...] = ()
    crls: tuple[Any, ...] = ()
    ocsps: tuple[Any, ...] = ()
    stored_crls: int = 0

    @classmethod
    def read(cls, reader: Any, given: list[Any] | None = None) -> StoredData:
        """The package's stored data (none if it has no store) and the lists ``given``."""
        from pyhanko.sign.validation.dss import DocumentSecurityStore, NoDSSFoundError

        try:
            dss = DocumentSecurityStore.read_dss(reader)
        except NoDSSFoundError:
            return cls(crls=tuple(given or ()))
        stored = tuple(_stored(dss.crls, "crl"))
        return cls(
            certs=tuple(dss.load_certs()),
            crls=stored + tuple(given or ()),
            ocsps=tuple(_stored(dss.ocsps, "ocsp")),
            stored_crls=len(stored),
        )

    def context(self, roots: list[Any], moment: dt.datetime, signer: Any = None) -> Any:
        """A validation context at ``moment`` trusting only ``roots``, with the stored chain
        and revocation data; nothing fetched.

        When revocation data for ``signer`` (a certificate) is at hand it must be checked, even
        if the certificate names no service. A revocation list issued after ``moment`` still
        speaks for it (it lists every key revoked before, with the date).
        """
        from pyhanko_certvalidator import ValidationContext

        return ValidationContext(
            trust_roots=list(roots),
            other_certs=list(self.certs),
            crls=list(self.crls),
            ocsps=list(self.ocsps),
            allow_fetching=False,
            moment=moment,
            revinfo_policy=revocation_policy(signer is not None and self.covers(signer)),
        )

    def covers(self, cert: Any) -> bool:
        """Whether a list or response at hand speaks for ``cert``."""
        return self.revocation(cert).startswith("revocation: checked")

    def revocation(self, cert: Any) -> str:
        """What the signer's revocation status rests on, in words."""
        if cert.self_signed != "no":
            return "revocation: none (a self-signed certificate cannot be revoked)"
        lists = [(i, c) for i, c in enumerate(self.crls) if c.issuer == cert.issuer]
        if lists:
            i, newest = max(lists, key=lambda ic: ic[1]["tbs_cert_list"]["this_update"].native)
            issued = newest["tbs_cert_list"]["this_update"].native
            where = "stored in the package" if i < self.stored_crls else "given to verify"
            return (
                f"revocation: checked against the revocation list of its issuer issued "
                f"{issued:%Y-%m-%d %H:%M} UTC ({where})"
            )
        serial = cert.serial_number
        for response in self.ocsps:
            try:
                basic = response["response_bytes"]["response"].parsed["tbs_response_data"]
                if any(r["cert_id"]["serial_number"].native == serial for r in basic["responses"]):
                    return "revocation: checked against an OCSP response stored in the package"
            except (KeyError, TypeError, ValueError):
                continue
        return (
            "revocation: NOT checked: the package stores no revocation data for this "
            "certificate (signed offline); give the issuer's list with --crl FILE"
        )


def revocation_policy(required: bool) -> Any:
    """Check a signer's revocation data; ``required``: it must be there and say "not revoked".

    A list from the firm's own authority is used although the certificate names no
    distribution point (the signer or verifier gave it); intermediate authorities are checked
    where their certificates say where. Lists count for times before they were issued.
    """
    from pyhanko_certvalidator.policy_decl import (
        CertRevTrustPolicy,
        RevocationCheckingPolicy,
        RevocationCheckingRule,
    )

    soft = RevocationCheckingRule.CHECK_IF_DECLARED_SOFT
    ee = RevocationCheckingRule.CRL_OR_OCSP_REQUIRED if required else soft
    return CertRevTrustPolicy(
        RevocationCheckingPolicy(ee_certificate_rule=ee, intermediate_ca_cert_rule=soft),
        retroactive_revinfo=True,
    )


def _stored(refs: list[Any], kind: str) -> list[Any]:
    from asn1crypto import crl, ocsp
    from pyhanko.pdf_utils.decode_limits import DecodePurpose

    purpose = DecodePurpose.CRL if kind == "crl" else DecodePurpose.OCSP_RESPONSE
    parse = crl.CertificateList.load if kind == "crl" else ocsp.OCSPResponse.load
    return [parse(ref.get_object().read_data(purpose)) for ref in refs]


@dataclass(frozen=True)
class DocumentTimestamp:
    """A document timestamp of the package and what it proves.

    Attributes:
        field: its form field.
        revision: the document revision it covers (0-based).
        time: the time it certifies.
        valid: intact and its TSA trusted at ``checked_at``.
        checked_at: when its certificate was checked (now, the date asked, or the next
            timestamp's time).
    """

    field: str
    revision: int
    time: dt.datetime | None
    valid: bool
    checked_at: dt.datetime

    def text(self) -> str:
        """One line for the terminal."""
        when = f"{self.time:%Y-%m-%d %H:%M:%S} UTC" if self.time else "unknown time"
        state = "VALID" if self.valid else "FAILED"
        return (
            f"{state}  document timestamp {when} (its certificate checked at "
            f"{self.checked_at:%Y-%m-%d %H:%M} UTC)"
        )


def document_timestamps(
    reader: Any, roots: list[Any], moment: dt.datetime, stored: StoredData | None = None
) -> tuple[DocumentTimestamp, ...]:
    """Check the package's document timestamps, newest first, each at the time the next proves.

    Returned oldest first.
    """
    from pyhanko.sign.validation import validate_pdf_timestamp

    data = stored or StoredData()
    found: list[DocumentTimestamp] = []
    proof = moment
    for ts in sorted(reader.embedded_timestamp_signatures, key=lambda s: -s.signed_revision):
        context = data.context(list(roots), proof)
        try:
            status = validate_pdf_timestamp(ts, validation_context=context)
            valid = bool(status.intact and status.valid and status.trusted)
            time = status.timestamp
        except Exception:
            valid, time = False, None
        found.append(DocumentTimestamp(str(ts.field_name), ts.signed_revision, time, valid, proof))
        if valid and time is not None:
            proof = time
    return tuple(reversed(found))


def proof_after(stamps: tuple[DocumentTimestamp, ...], revision: int) -> dt.datetime | None:
    """The time of the first valid document timestamp covering ``revision`` (None if none)."""
    for ts in stamps:
        if ts.valid and ts.revision > revision and ts.time is not None:
            return ts.time
    return None


SIGNING_TIME = "signing-time"
"""``at`` value: check certificates at the signing time each signer claims."""


@dataclass(frozen=True)
class Moment:
    """The validation clock for one signature.

    Attributes:
        start: the validation time: now, or the date asked for.
        proof: when the timestamps on the signature are checked: the time the first valid
            document timestamp after it proves, else ``start``.
        asked: the date asked for (``at=DATE``), if any.
        claim: check at the signer's claimed time when nothing proves one
            (``at="signing-time"``).
        document: the time the first valid document timestamp after the signature proves.
    """

    start: dt.datetime
    proof: dt.datetime
    asked: dt.datetime | None = None
    claim: bool = False
    document: dt.datetime | None = None

    @classmethod
    def make(cls, at: dt.datetime | str | None, now: dt.datetime | None) -> Moment:
        """The clock for ``verify --at`` (None, ``"signing-time"`` or a datetime).

        Raises:
            InputError: ``at`` is another string, or a datetime without a time zone.
        """
        from calcpack.errors import InputError

        asked: dt.datetime | None = None
        if isinstance(at, str):
            if at != SIGNING_TIME:
                raise InputError(
                    f"--at must be {SIGNING_TIME!r} or a date such as 2031-05-01 (got at = {at!r})",
                    name="at",
                    value=at,
                    expected=f"{SIGNING_TIME!r} or a date",
                )
        elif at is not None:
            if at.tzinfo is None:
                raise InputError(
                    f"--at needs a time zone (got at = {at.isoformat()!r}); dates are read as UTC",
                    name="at",
                    value=at,
                    expected="an aware datetime",
                )
            asked = at
        start = asked or now or dt.datetime.now(dt.UTC)
        return cls(start=start, proof=start, asked=asked, claim=at == SIGNING_TIME)

    def for_revision(self, stamps: tuple[DocumentTimestamp, ...], revision: int) -> Moment:
        """The clock for a signature that signed ``revision``."""
        from dataclasses import replace

        document = proof_after(stamps, revision)
        return replace(self, proof=document or self.start, document=document)

    def signing_moment(
        self, timestamp: dt.datetime | None, claimed: dt.datetime | None
    ) -> tuple[dt.datetime, str]:
        """The moment to check a signer's certificates at, and what it rests on."""
        if timestamp is not None:
            return timestamp, "the time its signature timestamp proves"
        if self.document is not None:
            return self.document, "the time a later document timestamp proves"
        if self.claim and claimed is not None:
            return claimed, "the signing time the signer claims (no timestamp proves it)"
        if self.asked is not None:
            return self.asked, "the date asked for (--at)"
        return self.start, "now (no timestamp proves the signing time)"

    @staticmethod
    def unproved(basis: str) -> bool:
        """Whether the moment was simply now, for want of any proof."""
        return basis.startswith("now")


@dataclass(frozen=True)
class RenewResult:
    """What :func:`renew_timestamp` did."""

    output: Path
    time: dt.datetime | None
    previous: int
    """Document timestamps the package carried before."""


@quiet_library_logs()
def renew_timestamp(
    pdf: str | os.PathLike[str],
    *,
    timestamp_url: str | None = None,
    timestamper: Any = None,
    trust: tuple[str | os.PathLike[str], ...] = (),
    out: str | os.PathLike[str] | None = None,
) -> RenewResult:
    """Add a fresh document timestamp to a signed package (an incremental update).

    The validation data of the newest timestamp is added first, so the chain of timestamps
    stays verifiable after that timestamp's certificate expires.

    Raises:
        SigningError: no timestamp server, the server fails, or the package is not signed.
        VerificationError: the file is missing or not a PDF.
    """
    from pyhanko.pdf_utils.reader import PdfFileReader
    from pyhanko.sign.signers import PdfTimeStamper
    from pyhanko_certvalidator import ValidationContext

    from calcpack.signing.keys import load_certificates
    from calcpack.signing.sign import resolve_timestamper

    path = Path(pdf)
    source = repr(str(path))
    if not path.is_file():
        raise VerificationError(f"Package {source} does not exist")
    stamper = resolve_timestamper(timestamp_url, timestamper)
    if stamper is None:
        raise SigningError(
            "Renewing the timestamp needs a timestamp server: give --timestamp-url URL or set "
            "CALCPACK_TIMESTAMP_URL"
        )
    data = path.read_bytes()
    if not data.startswith(b"%PDF-"):
        raise VerificationError(f"{source} is not a calcpack package: it is not a PDF")
    reader = PdfFileReader(io.BytesIO(data), strict=False)
    if not list(reader.embedded_regular_signatures):
        raise SigningError(f"{source} carries no signature: there is nothing to keep verifiable")
    previous = list(reader.embedded_timestamp_signatures)
    import asyncio

    roots = list(load_certificates(trust))
    try:
        token = asyncio.run(stamper.async_dummy_response("sha256"))
    except Exception as exc:
        raise SigningError(f"The timestamp server did not answer ({exc})") from exc
    roots += self_signed(_token_certs(token))
    for ts in previous:
        roots += self_signed([ts.signer_cert, *ts.other_embedded_certs])
    context = ValidationContext(trust_roots=roots, allow_fetching=False)
    buffer = io.BytesIO()
    try:
        PdfTimeStamper(stamper).update_archival_timestamp_chain(
            reader, context, in_place=False, output=buffer
        )
    except Exception as exc:
        raise SigningError(f"Adding a document timestamp to {source} failed: {exc}") from exc
    new = buffer.getvalue()
    if not new.startswith(data):
        raise SigningError(f"Timestamping {source} did not produce an incremental update")
    target = Path(out) if out is not None else path
    write_atomically(target, new)
    stamps = PdfFileReader(io.BytesIO(new), strict=False).embedded_timestamp_signatures
    newest = max(stamps, key=lambda s: s.signed_revision)
    return RenewResult(output=target, time=token_time(newest), previous=len(previous))


def token_time(ts: Any) -> dt.datetime | None:
    """The time a document timestamp states (its TSTInfo genTime), without judging it."""
    try:
        info = ts.signed_data["encap_content_info"]["content"].parsed
        value: dt.datetime = info["gen_time"].native
    except (KeyError, AttributeError, ValueError):
        return None
    return value
