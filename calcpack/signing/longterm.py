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
    "document_timestamps",
    "embedding_context",
    "renew_timestamp",
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


def embedding_context(creds: Any, stamper: Any) -> Any:
    """The validation context used to collect what the signature embeds (chain, revocation data).

    It trusts the roots the key file and the timestamp server present: it decides nothing about
    trust (``verify`` does, with the roots its user gives), it only gathers the chain. Nothing is
    fetched from the network.
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
    return ValidationContext(trust_roots=roots, other_certs=list(creds.chain), allow_fetching=False)


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
    reader: Any, roots: list[Any], moment: dt.datetime
) -> tuple[DocumentTimestamp, ...]:
    """Check the package's document timestamps, newest first, each at the time the next proves.

    Returned oldest first.
    """
    from pyhanko.sign.validation import validate_pdf_timestamp
    from pyhanko_certvalidator import ValidationContext

    found: list[DocumentTimestamp] = []
    proof = moment
    for ts in sorted(reader.embedded_timestamp_signatures, key=lambda s: -s.signed_revision):
        context = ValidationContext(trust_roots=list(roots), allow_fetching=False, moment=proof)
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

    @staticmethod
    def context(roots: list[Any], moment: dt.datetime) -> Any:
        """A validation context at ``moment`` trusting only ``roots``; nothing fetched."""
        from pyhanko_certvalidator import ValidationContext

        return ValidationContext(trust_roots=list(roots), allow_fetching=False, moment=moment)

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
