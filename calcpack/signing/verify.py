"""Verifying a signed calc package: signatures, the project's files, and reproduction.

For each signature: who signed, in which role, when; whether the signed bytes are intact;
whether it covers the whole document or what was changed after it; and whether the signer's
certificate leads to a trusted root. Optionally: the embedded manifest's file hashes against
the project directory, and a fresh execution of the notebooks against the recorded results.
"""

from __future__ import annotations

import datetime as dt
import hashlib
import io
import os
from collections.abc import Callable, Iterable
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from calcpack.contract.compare import diff_manifests
from calcpack.errors import InputError, VerificationError
from calcpack.signing._util import quiet_library_logs
from calcpack.signing.authority import load_crls
from calcpack.signing.keys import (
    ROLES,
    certificate_name,
    certificate_sha256,
    check_role,
    load_certificates,
    same_person,
)
from calcpack.signing.longterm import DocumentTimestamp, Moment, StoredData, document_timestamps
from calcpack.signing.manifest import read_embedded_manifest, role_of_field, signature_boxes
from calcpack.signing.trust_words import outside_validity, trust_words

__all__ = [
    "FileCheck",
    "SignatureReport",
    "VerifyReport",
    "check_project_files",
    "verify_package",
]

#: A function that re-executes a project's notebooks and returns a fresh manifest (dict).
Reproducer = Callable[[Path], dict[str, Any]]


@dataclass(frozen=True)
class SignatureReport:
    """The verdict on one signature.

    Attributes:
        field: the PDF form field holding the signature.
        role: the calcpack role (``None`` for a field calcpack did not make).
        signer: the signer's name from the certificate.
        signed_at: the time the signer's software recorded (UTC), if any.
        timestamp: the time certified by an RFC 3161 timestamp, if present.
        intact: the signed bytes are unchanged and the signature itself is valid.
        whole_document: the signature covers the whole file as it is now.
        changes_after: what was changed after signing, in words (``"none"`` if nothing).
        changes_allowed: the later changes are only further signatures or form filling.
        trusted: the certificate chains to a given trust root (and timestamps too).
        trust: the trust verdict in words.
        certification: this is the document's certification (author) signature.
        reason: the reason given at signing.
    """

    field: str
    role: str | None
    signer: str
    signed_at: dt.datetime | None
    timestamp: dt.datetime | None
    intact: bool
    whole_document: bool
    changes_after: str
    changes_allowed: bool
    trusted: bool
    trust: str
    certification: bool = False
    reason: str | None = None
    certificate: str = ""
    """SHA-256 of the signer's certificate (DER), to tell signers apart."""
    checked_at: dt.datetime | None = None
    """The moment the signer's certificates were checked at."""
    time_basis: str = "now"
    """What that moment rests on (a timestamp, the date asked for, the signer's claim, now)."""
    revocation: str = ""
    """What the signer's revocation status rests on (a stored or given list), or that nothing
    could be checked."""

    @property
    def ok(self) -> bool:
        """Intact, only allowed changes after it, and trusted."""
        return self.intact and self.changes_allowed and self.trusted

    def text(self) -> str:
        """A few lines describing the signature for the terminal."""
        when = self.timestamp or self.signed_at
        when_text = f"{when:%Y-%m-%d %H:%M:%S %Z}" if when else "unknown time"
        if self.timestamp:
            when_text += " (RFC 3161 timestamp)"
        coverage = (
            "covers the whole document"
            if self.whole_document
            else f"updated after signing: {self.changes_after}"
        )
        kind = " (certification)" if self.certification else ""
        return "\n".join(
            [
                f"{'VALID' if self.ok else 'FAILED'}  {self.role or self.field}{kind}: "
                f"{self.signer}, {when_text}",
                f"    signed bytes: {'intact' if self.intact else 'NOT INTACT (modified)'}",
                f"    coverage: {coverage}" + ("" if self.changes_allowed else " -- NOT ALLOWED"),
                f"    signer: {self.trust}",
            ]
            + (
                [
                    f"    certificates checked at {self.checked_at:%Y-%m-%d %H:%M} UTC: "
                    f"{self.time_basis}"
                ]
                if self.checked_at
                else []
            )
            + ([f"    {self.revocation}"] if self.revocation else [])
            + ([f"    reason: {self.reason}"] if self.reason else [])
        )


@dataclass(frozen=True)
class FileCheck:
    """A project file listed in the manifest, against the file on disk now."""

    path: str
    status: str  # "ok" | "changed" | "missing" | "outside"
    recorded: str | None
    actual: str | None = None

    @property
    def ok(self) -> bool:
        """The file is there with the recorded hash."""
        return self.status == "ok"


@dataclass(frozen=True)
class VerifyReport:
    """Everything ``calcpack verify`` found.

    Attributes:
        path: the package verified.
        manifest: its embedded manifest.
        signatures: one report per signature, in signing order.
        unsigned_roles: roles of the sign-off block not signed yet.
        problems: failures not tied to one signature (no signatures, order, files...).
        files: hash checks of the project's files (``None`` unless asked for).
        reproduction: differences found re-executing the notebooks (``None`` unless asked).
    """

    path: Path
    manifest: dict[str, Any]
    signatures: tuple[SignatureReport, ...]
    unsigned_roles: tuple[str, ...]
    problems: tuple[str, ...] = ()
    files: tuple[FileCheck, ...] | None = None
    reproduction: tuple[str, ...] | None = field(default=None)
    timestamps: tuple[DocumentTimestamp, ...] = ()
    """The package's document timestamps (PAdES B-LTA), oldest first."""
    overrides: tuple[str, ...] = ()
    """Overrides recorded in the project's review.toml (with ``project``), one line each."""

    @property
    def ok(self) -> bool:
        """Every check passed: the command exits 0 exactly when this is true."""
        return (
            bool(self.signatures)
            and not self.problems
            and all(s.ok for s in self.signatures)
            and all(f.ok for f in self.files or ())
            and not self.reproduction
        )

    def text(self) -> str:
        """The report for the terminal."""
        project = self.manifest.get("project") or {}
        head = f"Package {self.path}"
        if project:
            job = " ".join(str(project[k]) for k in ("job_number", "job_title") if project.get(k))
            rev = project.get("revision")
            head += f" -- {job}" + (f", revision {rev}" if rev is not None else "")
        lines = [head]
        lines += [s.text() for s in self.signatures]
        lines += [t.text() for t in self.timestamps]
        if self.unsigned_roles:
            lines.append(f"Not signed yet: {', '.join(self.unsigned_roles)}")
        if self.files is not None:
            bad = [f for f in self.files if not f.ok]
            lines.append(
                f"Project files: {len(self.files) - len(bad)} of {len(self.files)} match the "
                "manifest"
            )
            lines += [f"    {f.status.upper()}: {f.path}" for f in bad]
        if self.reproduction is not None:
            if self.reproduction:
                lines.append("Reproduction: results differ from the package:")
                lines += [f"    {d}" for d in self.reproduction]
            else:
                lines.append("Reproduction: every recorded result follows from the inputs")
        lines += [f"Recorded in review.toml: {o}" for o in self.overrides]
        lines += [f"PROBLEM: {p}" for p in self.problems]
        lines.append("Verification " + ("PASSED" if self.ok else "FAILED"))
        return "\n".join(lines)


def _sha256(path: Path) -> str:
    digest = hashlib.sha256()
    with path.open("rb") as fh:
        for block in iter(lambda: fh.read(1 << 16), b""):
            digest.update(block)
    return digest.hexdigest()


def check_project_files(
    manifest: dict[str, Any], project: str | os.PathLike[str]
) -> tuple[FileCheck, ...]:
    """Compare the manifest's ``files`` (path, sha256) with the project directory.

    Raises:
        InputError: the project directory does not exist.
    """
    root = Path(project)
    if not root.is_dir():
        raise InputError(
            f"Project directory {str(root)!r} does not exist", name="project", value=str(root)
        )
    base = root.resolve()
    checks: list[FileCheck] = []
    for entry in manifest.get("files", []):
        rel = str(entry.get("path", ""))
        recorded = entry.get("sha256")
        target = (base / rel).resolve()
        if not rel or Path(rel).is_absolute() or not target.is_relative_to(base):
            checks.append(FileCheck(rel, "outside", recorded))
        elif not target.is_file():
            checks.append(FileCheck(rel, "missing", recorded))
        else:
            actual = _sha256(target)
            status = "ok" if actual == str(recorded).lower() else "changed"
            checks.append(FileCheck(rel, status, recorded, actual))
    return tuple(checks)


def _reproduce(manifest: dict[str, Any], project: Path, reproducer: Reproducer) -> tuple[str, ...]:
    fresh = reproducer(project)
    titles = {s.get("path"): s.get("title") for s in manifest.get("sheets", [])}
    for sheet in fresh.get("sheets", []):
        if not sheet.get("title"):
            sheet["title"] = titles.get(sheet.get("path"))
    diff = diff_manifests(manifest, fresh)
    return tuple(
        f"{c.sheet}: {c.kind} {c.name}: package {c.old or '-'}, now {c.new or '-'}"
        for c in diff.changes
    )


def _describe_changes(status: Any, later_roles: list[str]) -> tuple[bool, str, bool]:
    """(whole document, what changed after, whether allowed) from a library status."""
    from pyhanko.sign.diff_analysis import ModificationLevel, SuspiciousModification
    from pyhanko.sign.validation import SignatureCoverageLevel

    if status.coverage == SignatureCoverageLevel.ENTIRE_FILE:
        return True, "none", True
    if status.coverage != SignatureCoverageLevel.ENTIRE_REVISION:
        return False, "the signature does not cover a whole revision (suspicious layout)", False
    level = status.modification_level
    later = f" ({', '.join(later_roles)})" if later_roles else ""
    if isinstance(status.diff_result, SuspiciousModification):
        return False, f"other modifications: {status.diff_result}", False
    if level is None:
        return False, "later changes not analysed", False
    if level <= ModificationLevel.LTA_UPDATES:
        words = "validation data added"
    elif level == ModificationLevel.FORM_FILLING:
        words = f"further signatures or form filling only{later}"
    elif level == ModificationLevel.ANNOTATIONS:
        words = "annotations added"
    else:
        words = "other modifications (e.g. page content) after signing"
    allowed = bool(status.docmdp_ok) and level <= ModificationLevel.FORM_FILLING
    return False, words, allowed


def _signature_report(
    sig: Any,
    roots: list[Any],
    later_roles: list[str],
    *,
    certification: bool,
    clock: Moment,
    stored: StoredData,
) -> SignatureReport:
    from pyhanko.sign.validation import validate_pdf_signature
    from pyhanko.sign.validation.settings import KeyUsageConstraints

    role = role_of_field(sig.field_name)
    try:
        signer = certificate_name(sig.signer_cert)
        fingerprint = certificate_sha256(sig.signer_cert)
    except Exception:
        signer, fingerprint = "unknown signer", ""
    reason_obj = sig.sig_object.get("/Reason") if sig.sig_object is not None else None
    reason = str(reason_obj) if reason_obj is not None else None
    try:
        signed_at = sig.self_reported_timestamp
    except Exception:
        signed_at = None
    usage = KeyUsageConstraints(
        key_usage={"digital_signature", "non_repudiation"}, match_all_key_usages=False
    )

    def validate(signer_moment: dt.datetime, *, skip_diff: bool = False) -> Any:
        return validate_pdf_signature(
            sig,
            signer_validation_context=stored.context(roots, signer_moment, sig.signer_cert),
            ts_validation_context=stored.context(roots, clock.proof),
            key_usage_settings=usage,
            skip_diff=skip_diff,
        )

    try:
        status = validate(clock.proof)
        ts = status.timestamp_validity
        ts_proof = ts.timestamp if ts and ts.valid and ts.intact and ts.trusted else None
        moment, basis = clock.signing_moment(ts_proof, signed_at)
        if moment != clock.proof:
            # Only the certificate checks depend on the moment. pyHanko keeps the first call's
            # difference analysis on ``sig`` (compute_integrity_info leaves diff_result as it
            # was when skip_diff is set), and that analysis walks the whole object graph.
            status = validate(moment, skip_diff=True)
    except Exception as exc:
        return SignatureReport(
            field=str(sig.field_name),
            role=role,
            signer=signer,
            signed_at=signed_at,
            timestamp=None,
            intact=False,
            whole_document=False,
            changes_after=f"the signature could not be checked ({type(exc).__name__}: {exc})",
            changes_allowed=False,
            trusted=False,
            trust="not checked",
            reason=reason,
            certificate=fingerprint,
        )
    intact = bool(status.intact and status.valid)
    whole, changes, allowed = _describe_changes(status, later_roles)
    ts = status.timestamp_validity
    timestamp = ts.timestamp if ts is not None else None
    ts_ok = ts is None or bool(ts.valid and ts.intact and ts.trusted)
    trusted = bool(status.trusted) and ts_ok
    trust = trust_words(status, bool(status.trusted))
    # A self-signed certificate given as its own trust root is a path of one trust anchor,
    # which the path validator does not date-check; so check the signer's validity here.
    outside = outside_validity(sig.signer_cert, moment)
    if outside and trusted:
        trusted, trust = False, outside
    if not trusted and clock.unproved(basis) and "expired" in trust:
        trust += (
            "; no timestamp proves when it was signed (verify --at signing-time checks it at "
            "the signer's claimed time)"
        )
    if not ts_ok:
        trust += "; timestamp NOT trusted"
    return SignatureReport(
        field=str(sig.field_name),
        role=role,
        signer=signer,
        signed_at=signed_at,
        timestamp=timestamp,
        intact=intact,
        whole_document=whole,
        changes_after=changes,
        changes_allowed=allowed and intact,
        trusted=trusted and intact,
        trust=trust,
        certification=certification,
        reason=reason,
        certificate=fingerprint,
        checked_at=moment,
        time_basis=basis,
        revocation=stored.revocation(sig.signer_cert),
    )


def _role_problems(
    reports: list[SignatureReport], boxes: dict[str, Any], require: tuple[str, ...]
) -> list[str]:
    """One signer per role; the required roles signed."""
    problems = []
    for i, a in enumerate(reports):
        for b in reports[i + 1 :]:
            if a.role == b.role:
                continue  # reported as a role signed twice
            if (a.certificate and a.certificate == b.certificate) or same_person(
                a.signer, b.signer
            ):
                problems.append(
                    f"one signer holds two roles: {b.signer} signed as {b.role or b.field} "
                    f"after signing as {a.role or a.field}"
                )
    signed = {r.role for r in reports}
    missing = [r for r in require if r not in signed]
    if missing:
        problems.append(f"required role(s) not signed: {', '.join(missing)}")
    absent = [r for r in require if boxes and r not in boxes]
    if absent:
        problems.append(f"required role(s) with no box in the sign-off block: {', '.join(absent)}")
    return problems


@quiet_library_logs()
def verify_package(
    pdf: str | os.PathLike[str],
    trust: Iterable[str | os.PathLike[str]] = (),
    *,
    project: str | os.PathLike[str] | None = None,
    reproduce: bool = False,
    reproducer: Reproducer | None = None,
    at: dt.datetime | str | None = None,
    require: Iterable[str] = (),
    now: dt.datetime | None = None,
    crls: Iterable[str | os.PathLike[str]] = (),
) -> VerifyReport:
    """Verify a signed calc package.

    Args:
        pdf: the package.
        trust: certificate files of the trust roots (e.g. the firm's or the demo root). No
            other root is trusted and nothing is fetched from the network.
        project: the project directory: check the manifest's file hashes against it.
        reproduce: re-execute the notebooks in ``project`` and compare every recorded result.
        reproducer: the function doing the re-execution, needed with ``reproduce``: the
            build's is :func:`calcpack.package.reproduce.reproduce_manifest`, which
            :func:`calcpack.package.verify_package` (``calcpack.verify_package``) passes in
            (signing never imports the build).
        at: when there is no timestamp to prove the signing time: ``"signing-time"`` checks
            each signer's certificates at the time the signer claims (reported as a claim), a
            datetime checks everything as at that moment. A timestamp's proof comes first.
        now: the validation clock (default: the current time; tests move it).
        crls: revocation lists newer than those the package stores (``keys crl``): a key
            revoked before the time its signature is checked at fails.
        require: roles that must have signed (e.g. ``("preparer", "checker")``); a missing one
            is a failure. Roles not required and not signed are reported, not failed.

    Returns:
        A :class:`VerifyReport`; ``report.ok`` says whether everything passed.

    Raises:
        VerificationError: the file is missing, unreadable, or not a calcpack package.
        InputError: a trust file or the project directory is missing; ``reproduce`` without
            ``project`` or ``reproducer``.
    """
    from pyhanko.pdf_utils.reader import PdfFileReader
    from pyhanko.sign.validation import read_certification_data

    path = Path(pdf)
    source = repr(str(path))
    required = tuple(check_role(r) for r in require)
    if not path.is_file():
        raise VerificationError(f"Package {source} does not exist")
    if reproduce and project is None:
        raise InputError(
            "Reproducing the results needs the project directory (--project DIR)",
            name="project",
            value=None,
        )
    if reproduce and reproducer is None:
        raise InputError(
            name="reproducer",
            value=None,
            rule="is needed to reproduce the results",
            note="calcpack.verify_package passes the build's (calcpack.package.reproduce)",
        )
    roots = load_certificates(trust)
    given = load_crls(crls)
    data = path.read_bytes()
    if not data.startswith(b"%PDF-"):
        raise VerificationError(f"{source} is not a calcpack package: it is not a PDF")
    try:
        reader = PdfFileReader(io.BytesIO(data), strict=False)
        manifest = read_embedded_manifest(reader, source)
        embedded = list(reader.embedded_regular_signatures)
        certified = read_certification_data(reader) is not None
        stored = StoredData.read(reader, given)
    except VerificationError:
        raise
    except Exception as exc:
        raise VerificationError(
            f"{source} is not a readable PDF ({type(exc).__name__}: {exc})"
        ) from exc

    base = Moment.make(at, now)
    stamps = document_timestamps(reader, list(roots), base.proof, stored)
    reports: list[SignatureReport] = []
    for i, sig in enumerate(embedded):
        later = [role_of_field(s.field_name) or str(s.field_name) for s in embedded[i + 1 :]]
        clock = base.for_revision(stamps, sig.signed_revision)
        reports.append(
            _signature_report(
                sig,
                list(roots),
                later,
                certification=i == 0 and certified,
                clock=clock,
                stored=stored,
            )
        )

    problems: list[str] = [
        f"{ts.field}: document timestamp not valid at {ts.checked_at:%Y-%m-%d} UTC (renew the "
        "timestamp before its certificate expires: calcpack renew-timestamp)"
        for ts in stamps
        if not ts.valid
    ]
    if not embedded:
        problems.append("the package carries no signature")
    try:
        boxes = signature_boxes(manifest, source)
    except VerificationError as exc:
        boxes = {}
        problems.append(str(exc))
    signed = [r.role for r in reports if r.role]
    expected_order = [r for r in ROLES if r in signed]
    if signed != expected_order:
        problems.append(f"roles signed out of order: {' -> '.join(signed)}")
    for role in ROLES:
        if signed.count(role) > 1:
            problems.append(f"role {role} signed {signed.count(role)} times")
    for r in reports:
        if r.role and r.role not in boxes and boxes:
            problems.append(f"signature for role {r.role!r} not in the package's sign-off block")
    prefix = [r for r in ROLES if r in boxes]
    if signed and signed != prefix[: len(signed)]:
        missing = [r for r in prefix[: len(signed)] if r not in signed]
        problems.append(f"signed without the earlier role(s): {', '.join(missing)}")
    unsigned = tuple(r for r in ROLES if r in boxes and r not in signed)
    problems += _role_problems(reports, boxes, required)

    files = check_project_files(manifest, project) if project is not None else None
    reproduction = (
        _reproduce(manifest, Path(project), reproducer)
        if reproduce and project is not None and reproducer is not None
        else None
    )
    return VerifyReport(
        path=path,
        manifest=manifest,
        signatures=tuple(reports),
        unsigned_roles=unsigned,
        problems=tuple(problems),
        files=files,
        reproduction=reproduction,
        timestamps=stamps,
        overrides=_recorded_overrides(project),
    )


def _recorded_overrides(project: str | os.PathLike[str] | None) -> tuple[str, ...]:
    from calcpack.signing.review import load_review, review_path

    if project is None or not review_path(project).is_file():
        return ()
    return tuple(o.text() for o in load_review(project).overrides)
