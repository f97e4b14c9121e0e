"""The package manifest: what the PDF was built from and what it records.

Written beside the PDF and attached inside it as ``calcpack-manifest.json``. Its keys follow
the contract (:class:`calcpack.contract.Manifest`, format "calcpack-manifest/1"): the calcpack
and key dependency versions, the project block, SHA-256 of every project file, notebook,
inputs file and review file, every sheet's recorded values and checks with its pages, and the
sign-off boxes for the signing step.
"""

from __future__ import annotations

import platform
from collections.abc import Sequence
from importlib import metadata
from pathlib import Path
from typing import Any

from calcpack.contract.manifest import MANIFEST_FORMAT, MANIFEST_NAME, Manifest, manifest_bytes
from calcpack.contract.records import SheetRecords
from calcpack.package.project import Project, SheetEntry, file_sha256

__all__ = [
    "KEY_DEPENDENCIES",
    "MANIFEST_ATTACHMENT_NAME",
    "MANIFEST_FORMAT",
    "Manifest",
    "dependency_versions",
    "embedded_manifest_bytes",
    "manifest_bytes",
    "project_files",
    "read_manifest",
    "sheet_record",
]

MANIFEST_ATTACHMENT_NAME = MANIFEST_NAME
KEY_DEPENDENCIES = (
    "numpy",
    "sympy",
    "pint",
    "ipykernel",
    "nbformat",
    "nbclient",
    "nbconvert",
    "weasyprint",
    "pydyf",
    "ziamath",
    "ziafont",
    "matplotlib",
)


def dependency_versions() -> dict[str, str]:
    """Versions of Python and the libraries that shape the results and the document."""
    versions = {"python": platform.python_version()}
    for name in KEY_DEPENDENCIES:
        try:
            versions[name] = metadata.version(name)
        except metadata.PackageNotFoundError:
            versions[name] = "not installed"
    return versions


def project_files(project: Project, review_file: Path | None) -> list[dict[str, str]]:
    """Hash of every file the package depends on, with its role (paths relative, '/')."""
    entries: list[dict[str, str]] = [
        {"path": project.path.name, "sha256": file_sha256(project.path), "role": "project"}
    ]
    seen = {project.path.name}
    for sheet in project.sheets:
        entries.append(
            {"path": sheet.path, "sha256": file_sha256(project.sheet_path(sheet)), "role": "sheet"}
        )
        seen.add(sheet.path)
    for name in [*project.inputs, *(i for s in project.sheets for i in s.inputs)]:
        if name in seen:
            continue
        seen.add(name)
        entries.append({"path": name, "sha256": file_sha256(project.root / name), "role": "inputs"})
    if review_file is not None and review_file.is_file():
        entries.append(
            {
                "path": review_file.relative_to(project.root).as_posix(),
                "sha256": file_sha256(review_file),
                "role": "review",
            }
        )
    return entries


def sheet_record(
    entry: SheetEntry, title: str, records: SheetRecords, **build: Any
) -> dict[str, Any]:
    """A sheet's entry in the manifest's ``sheets`` list: what it is and what it recorded.

    The build passes its cache key and pages in ``build`` (placed after the path); the archive
    check and the revision comparison use the record without them, so all three compare like
    with like.
    """
    return {
        "number": entry.number,
        "title": title,
        "path": entry.path,
        **build,
        "values": list(records.values),
        "checks": list(records.checks),
        "assumptions": list(records.assumptions),
        "cautions": list(records.cautions),
    }


def embedded_manifest_bytes(pdf: Path) -> bytes | None:
    """The manifest attached to the PDF at ``pdf``, as stored (None if the file is missing, not
    a PDF or has no calcpack manifest)."""
    import io

    from pypdf import PdfReader

    try:
        reader = PdfReader(io.BytesIO(pdf.read_bytes()))
        raw = reader.attachments.get(MANIFEST_ATTACHMENT_NAME)
    except Exception:  # pypdf raises many kinds on a damaged file: it is simply not current
        return None
    return bytes(raw[0]) if raw else None


def read_manifest(pdf: bytes | Path) -> dict[str, Any]:
    """The manifest attached to a calcpack PDF.

    Raises:
        calcpack.errors.VerificationError: the PDF has no calcpack manifest.
    """
    import io

    from pypdf import PdfReader

    from calcpack.errors import VerificationError

    data = pdf.read_bytes() if isinstance(pdf, Path) else pdf
    reader = PdfReader(io.BytesIO(data))
    attachments = reader.attachments
    if MANIFEST_ATTACHMENT_NAME not in attachments:
        raise VerificationError(
            f"PDF has no attached {MANIFEST_ATTACHMENT_NAME} (not a calcpack package?)"
        )
    raw: Sequence[bytes] = attachments[MANIFEST_ATTACHMENT_NAME]
    return Manifest.from_bytes(raw[0], "The manifest attached to the PDF").to_json()
