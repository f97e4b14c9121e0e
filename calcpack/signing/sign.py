"""Signing a calc package by role, into the sign-off block of its cover.

Each signature is a PAdES baseline signature carrying its validation data (B-LT; with a
signature timestamp and a document timestamp when a timestamp server is configured, B-LTA)
in the form field of its role, placed in the box the manifest's ``signature_fields`` gives,
with a visible stamp (name, role, date, reason). The preparer's signature certifies the
document and allows further signatures and form filling; the checker and approver add approval
signatures as incremental updates, so earlier signatures stay valid.

Rules enforced: roles sign in order (preparer, checker, approver); a role signs once; one signer
(same certificate or same name) holds one role; a key made for another role, or held by someone
other than the person the project names for the role, is refused unless an identity override
reason is given (recorded in the signature's reason); a package
changed since its last signature is refused; the checker cannot sign while review comments are
not closed, unless an override reason is given (recorded in the review file and the signature's
reason). The signed package is written to a new file atomically; the input is never modified
(signing in place replaces the file only after the new one is complete).
"""

from __future__ import annotations

import datetime as dt
import io
import os
from collections.abc import Iterable
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any, cast

from calcpack.contract.placeholders import placeholders_in_summary, placeholders_text
from calcpack.errors import SigningError, VerificationError
from calcpack.signing._util import quiet_library_logs, write_atomically
from calcpack.signing.authority import load_crls
from calcpack.signing.keys import (
    ROLES,
    Credentials,
    certificate_sha256,
    check_role,
    load_credentials,
    same_person,
)
from calcpack.signing.longterm import embedding_context, revocation_note
from calcpack.signing.manifest import (
    field_name,
    read_embedded_manifest,
    role_of_field,
    signature_boxes,
)
from calcpack.signing.review import (
    REVIEW_FILE,
    load_review,
    record_identity_override,
    record_override,
    require_closed,
    review_path,
    review_text,
)

__all__ = ["TIMESTAMP_URL_ENV", "SignResult", "sign_package"]

#: Environment variable giving the RFC 3161 timestamp server URL, when not passed explicitly.
TIMESTAMP_URL_ENV = "CALCPACK_TIMESTAMP_URL"

_ROLE_TITLES = {"preparer": "Prepared by", "checker": "Checked by", "approver": "Approved by"}
_DEFAULT_REASONS = {
    "preparer": "Prepared",
    "checker": "Checked",
    "approver": "Approved for issue",
}


@dataclass(frozen=True)
class SignResult:
    """What a signing did.

    Attributes:
        output: the signed package written.
        role: the role signed as.
        signer: the signer's name from the certificate.
        signed_at: the signing time (UTC) recorded in the stamp and signature.
        certified: the signature is the document's certification signature.
        timestamped: an RFC 3161 timestamp token was added.
        overridden: ids of review comments the checker signed over (empty otherwise).
        revocation: what revocation data was embedded, or that none was (signed offline).
    """

    output: Path
    role: str
    signer: str
    signed_at: dt.datetime
    certified: bool
    timestamped: bool
    overridden: tuple[str, ...] = ()
    revocation: str = ""
    """The revocation data the signature embeds, in words (or why there is none)."""
    identity_override: Path | None = None
    """The review file where an identity override was recorded (None: none was needed)."""


@dataclass(frozen=True)
class _Existing:
    role: str | None
    field: str
    signer: str
    certificate: str = ""
    """SHA-256 of the signer's certificate (DER)."""


def _find_project(pdf: Path, *also: str) -> Path | None:
    """The nearest directory at or above the package holding a review file (or ``also``)."""
    for directory in [pdf.resolve().parent, *pdf.resolve().parents][:4]:
        if any((directory / name).is_file() for name in (REVIEW_FILE, *also)):
            return directory
    return None


def _existing_signatures(reader: Any, source: str) -> list[_Existing]:
    """Check every signature already in the package; refuse if anything changed since."""
    from pyhanko.sign.diff_analysis import ModificationLevel
    from pyhanko.sign.validation import SignatureCoverageLevel, validate_pdf_signature
    from pyhanko_certvalidator import ValidationContext

    from calcpack.signing.keys import certificate_name

    found: list[_Existing] = []
    signatures = list(reader.embedded_regular_signatures)
    context = ValidationContext(trust_roots=[], allow_fetching=False)
    for i, sig in enumerate(signatures):
        status = validate_pdf_signature(sig, context)
        who = certificate_name(sig.signer_cert)
        if not (status.intact and status.valid):
            raise SigningError(
                f"{source} was modified after {who} signed it (field {sig.field_name}): "
                "the signed bytes no longer match; it cannot be signed again"
            )
        last = i == len(signatures) - 1
        level = status.modification_level
        only_validation_data = level is not None and level <= ModificationLevel.LTA_UPDATES
        if (
            last
            and status.coverage != SignatureCoverageLevel.ENTIRE_FILE
            and not only_validation_data
        ):
            raise SigningError(
                f"{source} was changed after its last signature (by {who}); "
                "rebuild and sign the package again instead of signing a modified file"
            )
        if level is not None and level > ModificationLevel.FORM_FILLING:
            raise SigningError(
                f"{source} holds changes after {who}'s signature that are not signatures or "
                f"form filling ({level.name.lower()}); it cannot be signed again"
            )
        found.append(
            _Existing(
                role=role_of_field(sig.field_name),
                field=sig.field_name,
                signer=who,
                certificate=certificate_sha256(sig.signer_cert),
            )
        )
    return found


def _check_order(
    role: str, existing: list[_Existing], roles_in_block: list[str], source: str
) -> None:
    signed = {e.role: e for e in existing if e.role}
    if role in signed:
        raise SigningError(
            f"{source} is already signed as {role} (by {signed[role].signer}); a role signs once"
        )
    for earlier in ROLES[: ROLES.index(role)]:
        if earlier in roles_in_block and earlier not in signed:
            raise SigningError(
                f"{source} cannot be signed as {role} before it is signed as {earlier} "
                f"(order: {' -> '.join(r for r in ROLES if r in roles_in_block)})"
            )
    if role == "preparer" and existing:
        raise SigningError(f"{source} already carries signatures; the preparer signs first")


def _require_current_review_log(manifest: dict[str, Any], project: Path, source: str) -> None:
    """Refuse the checker's signature on a package whose review log is older than the review
    file: the signature would vouch for a log that does not show the review as it stands."""
    import hashlib

    current = project / REVIEW_FILE
    if not current.is_file():
        return
    recorded = [f for f in manifest.get("files", []) if f.get("role") == "review"]
    # Overrides recorded by signatures since the build (appended last) do not make the printed
    # log out of date: the comments are as printed. Anything else does.
    log = load_review(project)
    digests = {hashlib.sha256(current.read_bytes()).hexdigest()} | {
        hashlib.sha256(review_text(replace(log, overrides=log.overrides[:k])).encode()).hexdigest()
        for k in range(len(log.overrides))
    }
    if not recorded or str(recorded[0].get("sha256", "")).lower() not in digests:
        state = (
            f"it was built before the review log {str(current)!r} existed"
            if not recorded
            else f"the review log it prints is older than {str(current)!r}"
        )
        raise SigningError(
            f"The checker cannot sign {source}: {state} (the review changed after the package "
            "was built). Rebuild the package (calcpack build) so that it prints the current "
            "review log, then sign"
        )


def _check_signer(
    role: str,
    creds: Credentials,
    existing: list[_Existing],
    manifest: dict[str, Any],
    source: str,
    override: str | None,
) -> tuple[str, ...]:
    """Refuse a signer who already holds another role in the package; refuse (unless overridden)
    a key whose recorded role or name contradicts the role asked for or the project's person.

    Returns the contradictions overridden (to be recorded), empty if none.
    """
    fingerprint = certificate_sha256(creds.certificate)
    for e in existing:
        if e.certificate == fingerprint or same_person(e.signer, creds.name):
            how = "the same certificate" if e.certificate == fingerprint else "the same name"
            raise SigningError(
                f"{source} is already signed as {e.role or e.field} by {e.signer} ({how} as "
                f"the key given, {str(creds.path)!r}); one signer holds one role: the {role} "
                "must be someone else"
            )
    problems = []
    recorded = creds.role
    if recorded is not None and recorded != role:
        problems.append(
            f"the key {str(creds.path)!r} was made for the role {recorded!r}, not {role!r}"
        )
    person = str((manifest.get("project") or {}).get(role) or "")
    if person and not same_person(person, creds.name):
        problems.append(
            f"the key's holder {creds.name!r} is not the {role} named in calcpack.toml ({person!r})"
        )
    if problems and not (override and override.strip()):
        raise SigningError(
            f"Refusing to sign {source} as {role}: {'; '.join(problems)}. Use the right key, "
            "or give --override-identity REASON to sign anyway (the reason is recorded in the "
            "signature)"
        )
    return tuple(problems)


def _stamp_style(font: Path | None) -> Any:
    from pyhanko.pdf_utils.layout import AxisAlignment, InnerScaling, Margins, SimpleBoxLayoutRule
    from pyhanko.pdf_utils.text import TextBoxStyle
    from pyhanko.stamp import TextStampStyle

    if font is not None:
        from pyhanko.pdf_utils.font.opentype import GlyphAccumulatorFactory

        box_style = TextBoxStyle(font=GlyphAccumulatorFactory(str(font)), font_size=9, leading=12)
    else:
        box_style = TextBoxStyle(font_size=9, leading=12)
    return TextStampStyle(
        stamp_text=(
            "%(title)s: %(signer)s\n%(firm)sRole: %(role)s\nDate: %(date)s\nReason: %(reason)s"
        ),
        text_box_style=box_style,
        border_width=1,
        background=None,
        # same type size in every box; shrink only a stamp that would not fit
        inner_content_layout=SimpleBoxLayoutRule(
            x_align=AxisAlignment.ALIGN_MIN,
            y_align=AxisAlignment.ALIGN_MID,
            margins=Margins.uniform(6),
            inner_content_scaling=InnerScaling.SHRINK_TO_FIT,
        ),
    )


def _stamp_lines(text: str, width: int = 40, lines: int = 3) -> str:
    """The reason wrapped for the stamp: a few short lines, shortened with an ellipsis."""
    import textwrap

    wrapped = textwrap.wrap(text, width=width, max_lines=lines, placeholder=" ...")
    return "\n        ".join(wrapped)


def resolve_timestamper(url: str | None, timestamper: Any) -> Any:
    """The timestamper given, else one for ``url`` or ``$CALCPACK_TIMESTAMP_URL`` (None if none)."""
    if timestamper is not None:
        return timestamper
    url = url or os.environ.get(TIMESTAMP_URL_ENV) or None
    if not url:
        return None
    if not url.startswith(("http://", "https://")):
        raise SigningError(
            f"Timestamp server URL must start with http:// or https:// (got {url!r})"
        )
    from pyhanko.sign.timestamps.requests_client import RequestsHTTPTimeStamper

    return RequestsHTTPTimeStamper(url, timeout=10)


@quiet_library_logs()
def sign_package(
    pdf: str | os.PathLike[str],
    role: str,
    key: str | os.PathLike[str] | Credentials,
    password: str | None = None,
    *,
    out: str | os.PathLike[str] | None = None,
    certificate: str | os.PathLike[str] | None = None,
    reason: str | None = None,
    location: str | None = None,
    timestamp_url: str | None = None,
    timestamper: Any = None,
    project: str | os.PathLike[str] | None = None,
    override_open_comments: str | None = None,
    certify: bool = True,
    override_identity: str | None = None,
    crls: Iterable[str | os.PathLike[str]] = (),
) -> SignResult:
    """Sign a calc package as ``role`` into its sign-off block.

    Args:
        pdf: the package PDF built by calcpack (it carries ``calcpack-manifest.json``).
        role: ``"preparer"``, ``"checker"`` or ``"approver"``.
        key: a PKCS#12 or PEM key file, or already loaded :class:`Credentials`.
        password: the key's password (read it with :func:`read_password`; never log it).
        out: where to write the signed package (default: replace ``pdf`` atomically).
        certificate: the certificate file when ``key`` is a PEM key.
        reason: the reason shown in the stamp and signature (a default per role).
        location: optional signing location.
        timestamp_url: RFC 3161 timestamp server (default ``$CALCPACK_TIMESTAMP_URL``; none).
        timestamper: a pyHanko ``TimeStamper`` to use instead of a URL (tests, custom clients).
        project: the project directory holding the review file (checker only; found beside
            the package when omitted).
        override_open_comments: the checker's reason for signing with comments not closed.
        certify: the preparer's signature is a certification signature (allowing further
            signatures and form filling).
        override_identity: the reason for signing with a key whose recorded role or holder
            contradicts ``role`` or the person named for it in the project; recorded in the
            signature's reason and in the project's review.toml (who, when, why; ``project``
            or the folder holding calcpack.toml at or above the package). It never allows one
            signer to hold two roles.
        crls: revocation list files of the key's authority (``calcpack keys crl``) to embed
            (PAdES B-LT); a key they list as revoked is refused.

    Returns:
        A :class:`SignResult`.

    Raises:
        InputError: unknown role.
        SigningError: missing package or key, wrong password, unusable certificate, role
            already signed, out of order, package modified since its last signature, open
            review comments without override, timestamp server failure.
        VerificationError: the PDF is not a calcpack package or has no box for the role.
    """
    from pyhanko.pdf_utils.incremental_writer import IncrementalPdfFileWriter
    from pyhanko.pdf_utils.misc import PdfError
    from pyhanko.sign import fields, signers
    from pyhanko.sign.general import SigningError as LibrarySigningError

    from calcpack.signing.archival import keep_archival_metadata
    from calcpack.signing.fonts import stamp_font

    check_role(role)
    source_path = Path(pdf)
    source = repr(str(source_path))
    if not source_path.is_file():
        raise SigningError(f"Package {source} does not exist")
    original = source_path.read_bytes()
    if not original.startswith(b"%PDF-"):
        raise VerificationError(f"{source} is not a calcpack package: it is not a PDF")
    try:
        writer = IncrementalPdfFileWriter(io.BytesIO(original), strict=False)
    except (PdfError, ValueError) as exc:
        raise VerificationError(f"{source} is not a readable PDF ({exc})") from exc
    manifest = read_embedded_manifest(writer.prev, source)
    boxes = signature_boxes(manifest, source)
    if role not in boxes:
        raise VerificationError(
            f"{source} has no {role} box in its sign-off block "
            f"(boxes: {', '.join(boxes) or 'none'})"
        )
    left = placeholders_in_summary(manifest.get("project") or {})
    if left:
        raise SigningError(
            f"{source} still prints template placeholders from calcpack.toml: "
            f"{placeholders_text(left)}. Fill them in, rebuild, then sign"
        )
    existing = _existing_signatures(writer.prev, source)
    _check_order(role, existing, [r for r in ROLES if r in boxes], source)

    overridden: tuple[str, ...] = ()
    project_dir = Path(project) if project is not None else None
    if role == "checker":
        if project_dir is None:
            project_dir = _find_project(source_path)
        if project_dir is None:
            if any(f.get("role") == "review" for f in manifest.get("files", [])):
                raise SigningError(
                    f"The manifest of {source} lists a review file, but no {REVIEW_FILE} was "
                    "found beside the package; give the project directory (--project DIR)"
                )
        else:
            overridden = require_closed(project_dir, override_open_comments)
            _require_current_review_log(manifest, project_dir, source)

    creds = (
        key
        if isinstance(key, Credentials)
        else load_credentials(key, password, certificate=certificate)
    )
    contradictions = _check_signer(role, creds, existing, manifest, source, override_identity)
    record_in = project_dir or _find_project(source_path, "calcpack.toml")
    if contradictions and record_in is None:
        raise SigningError(
            f"The identity override for {source} must be recorded in the project's "
            f"{REVIEW_FILE}, but no project (calcpack.toml) was found beside the package; give "
            "the project directory (--project DIR)"
        )
    # after every reading of the package: the update's root differs from here on
    keep_archival_metadata(writer)

    for r in ROLES:
        if r in boxes and not _has_field(writer, field_name(r)):
            b = boxes[r]
            try:
                fields.append_signature_field(
                    writer,
                    fields.SigFieldSpec(
                        sig_field_name=field_name(r), on_page=b.page, box=cast(Any, b.box)
                    ),
                )
            except (PdfError, IndexError, ValueError) as exc:
                raise VerificationError(
                    f"Cannot place the {r} signature field on page {b.page + 1} of {source} ({exc})"
                ) from exc

    signed_at = dt.datetime.now(dt.UTC).replace(microsecond=0)
    why = (reason or _DEFAULT_REASONS[role]).strip()
    if overridden:
        why += (
            f" (signed with review comments {', '.join(overridden)} not closed: "
            f"{override_open_comments})"
        )
    if contradictions:
        why += f" (identity override: {'; '.join(contradictions)}; reason: {override_identity})"
    certified = role == "preparer" and certify
    stamper = resolve_timestamper(timestamp_url, timestamper)
    meta = signers.PdfSignatureMetadata(
        field_name=field_name(role),
        reason=why,
        location=location,
        name=creds.name,
        md_algorithm="sha256",
        subfilter=fields.SigSeedSubFilter.PADES,
        certify=certified,
        docmdp_permissions=fields.MDPPerm.FILL_FORMS,
        # PAdES B-LT: chain and revocation data in the document security store; B-LTA with a
        # document timestamp when a timestamp server is configured (calcpack.signing.longterm)
        embed_validation_info=True,
        validation_context=embedding_context(creds, stamper, load_crls(crls)),
        use_pades_lta=stamper is not None,
    )
    firm = creds.firm
    text_params = {
        "title": _ROLE_TITLES[role],
        "signer": creds.name,
        "firm": f"{firm}\n" if firm else "",
        "role": role,
        "date": f"{signed_at:%Y-%m-%d %H:%M} UTC",
        "reason": _stamp_lines(why),
    }
    pdf_signer = signers.PdfSigner(
        meta, signer=creds.signer, timestamper=stamper, stamp_style=_stamp_style(stamp_font())
    )
    try:
        output = pdf_signer.sign_pdf(
            writer, existing_fields_only=True, appearance_text_params=text_params
        )
    except LibrarySigningError as exc:
        raise SigningError(f"Signing {source} as {role} failed: {exc}") from exc
    except (OSError, ValueError, PdfError) as exc:
        what = "the timestamp server" if stamper is not None else "the signing library"
        raise SigningError(f"Signing {source} as {role} failed in {what}: {exc}") from exc
    data = output.getvalue()
    if not data.startswith(original):  # an incremental update keeps every earlier byte
        raise SigningError(f"Signing {source} did not produce an incremental update; not written")
    target = Path(out) if out is not None else source_path
    write_atomically(target, data)
    if contradictions and record_in is not None:
        record_identity_override(
            record_in,
            who=creds.name,
            role=role,
            reason=str(override_identity),
            contradictions=contradictions,
        )
    if overridden and project_dir is not None:
        record_override(
            project_dir,
            who=creds.name,
            reason=str(override_open_comments),
            comments=overridden,
        )
    return SignResult(
        output=target,
        role=role,
        signer=creds.name,
        signed_at=signed_at,
        certified=certified,
        timestamped=stamper is not None,
        overridden=overridden,
        revocation=revocation_note(creds, data),
        identity_override=review_path(record_in) if contradictions and record_in else None,
    )


def _has_field(writer: Any, name: str) -> bool:
    from pyhanko.sign.fields import enumerate_sig_fields

    return any(True for _ in enumerate_sig_fields(writer, with_name=name))
