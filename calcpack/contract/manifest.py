"""The package manifest: its format version, its fields, and its JSON form.

The build writes one manifest beside the PDF and attaches the same bytes inside it as
:data:`MANIFEST_NAME`. Signing reads its ``signature_fields``; verification compares its
``files`` with a project and its ``sheets`` with a fresh execution; revision comparison diffs
two manifests' ``sheets``. All of them read the manifest through :class:`Manifest` (or the
format check :func:`check_manifest`) so there is one definition of what a manifest is.
"""

from __future__ import annotations

import json
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from typing import Any

from calcpack.errors import VerificationError

__all__ = [
    "MANIFEST_FORMAT",
    "MANIFEST_FORMAT_PREFIX",
    "MANIFEST_NAME",
    "Manifest",
    "check_manifest",
    "is_manifest",
    "manifest_bytes",
]

#: Prefix every manifest format shares; the number after it is the version.
MANIFEST_FORMAT_PREFIX = "calcpack-manifest/"
#: The format this version of calcpack writes.
MANIFEST_FORMAT = f"{MANIFEST_FORMAT_PREFIX}1"
#: The name of the manifest file attached to a package PDF.
MANIFEST_NAME = "calcpack-manifest.json"

# The order the fields are written in (and then any fields a later format adds).
_FIELDS = (
    "format",
    "calcpack_version",
    "dependencies",
    "project",
    "files",
    "sheets",
    "links",
    "verifications",
    "signature_fields",
    "sections",
    "build",
)


_LISTS = ("sheets", "files", "links", "verifications", "signature_fields")


def is_manifest(data: Any) -> bool:
    """True when ``data`` is a JSON object whose ``format`` names a calcpack manifest."""
    fmt = data.get("format") if isinstance(data, dict) else None
    return isinstance(fmt, str) and fmt.startswith(MANIFEST_FORMAT_PREFIX)


def check_manifest(data: Any, source: str) -> dict[str, Any]:
    """``data`` if it is a calcpack manifest; else a :class:`VerificationError` naming it."""
    if not isinstance(data, dict):
        raise VerificationError(f"{source} is not a calcpack manifest: it is not a JSON object")
    if not is_manifest(data):
        raise VerificationError(
            f"{source} is not a calcpack manifest "
            f"(format = {data.get('format')!r}, expected {MANIFEST_FORMAT!r})"
        )
    return data


def manifest_bytes(manifest: Mapping[str, Any]) -> bytes:
    """Canonical JSON bytes of a manifest (stable key order, UTF-8, trailing newline)."""
    return (json.dumps(manifest, indent=2, ensure_ascii=False) + "\n").encode("utf-8")


@dataclass(frozen=True)
class Manifest:
    """What a package was built from and what it records.

    Attributes:
        sheets: per sheet, its number, title, path, (build only: cache key and pages), and the
            recorded values, checks, assumptions and cautions (see ``sheet_record``).
        format: the manifest format and version (:data:`MANIFEST_FORMAT`).
        calcpack_version: the calcpack that built it.
        dependencies: versions of Python and the libraries that shape results and document.
        project: the project block (job, client, revision, people).
        files: ``{path, sha256, role}`` for every file the package depends on.
        links: values one sheet took from another.
        verifications: the checker's independent checks, each compared with the preparer's
            record (value, checker's value, difference, tolerance, agreed, method).
        signature_fields: ``{role, page, box}`` of each sign-off box on the cover.
        sections: section id -> page numbers.
        build: when, on which paper, how many pages, the build key.
        extra: fields this version does not know (kept, and written back, unchanged).

    A field left ``None`` is not written: the archive check's fresh manifest has only the
    format and the sheets.
    """

    sheets: tuple[Mapping[str, Any], ...] = ()
    format: str = MANIFEST_FORMAT
    calcpack_version: str | None = None
    dependencies: Mapping[str, str] | None = None
    project: Mapping[str, Any] | None = None
    files: tuple[Mapping[str, Any], ...] | None = None
    links: tuple[Mapping[str, Any], ...] | None = None
    verifications: tuple[Mapping[str, Any], ...] | None = None
    signature_fields: tuple[Mapping[str, Any], ...] | None = None
    sections: Mapping[str, Sequence[int]] | None = None
    build: Mapping[str, Any] | None = None
    extra: Mapping[str, Any] = field(default_factory=dict)

    @property
    def version(self) -> int | None:
        """The format's version number (``1`` for ``calcpack-manifest/1``)."""
        tail = self.format[len(MANIFEST_FORMAT_PREFIX) :]
        return int(tail) if tail.isdigit() else None

    def to_json(self) -> dict[str, Any]:
        """The manifest as a JSON-ready dict, fields in their written order."""
        out: dict[str, Any] = {}
        for name in _FIELDS:
            value = getattr(self, name)
            if value is None:
                continue
            if isinstance(value, tuple):
                value = [dict(v) if isinstance(v, Mapping) else v for v in value]
            elif isinstance(value, Mapping):
                value = {k: list(v) if isinstance(v, tuple) else v for k, v in value.items()}
            out[name] = value
        out.update(self.extra)
        return out

    def to_bytes(self) -> bytes:
        """The canonical bytes written beside and inside the PDF."""
        return manifest_bytes(self.to_json())

    @classmethod
    def from_json(cls, data: Any, source: str = "The manifest") -> Manifest:
        """A manifest from its JSON form.

        Raises:
            VerificationError: ``data`` is not a calcpack manifest (not an object, or its
                ``format`` is not a calcpack manifest format).
        """
        data = check_manifest(data, source)
        known: dict[str, Any] = {}
        for name in _FIELDS:
            if name not in data:
                continue
            value = data[name]
            if name in (
                "sheets",
                "files",
                "links",
                "verifications",
                "signature_fields",
            ) and isinstance(value, list):
                value = tuple(value)
            known[name] = value
        extra = {k: v for k, v in data.items() if k not in _FIELDS}
        return cls(**known, extra=extra)

    @classmethod
    def from_bytes(cls, raw: bytes, source: str = "The manifest") -> Manifest:
        """A manifest from JSON bytes.

        Raises:
            VerificationError: not JSON, or not a calcpack manifest.
        """
        try:
            data = json.loads(raw.decode("utf-8"))
        except (ValueError, UnicodeDecodeError) as exc:
            raise VerificationError(f"{source} is unreadable ({exc})") from exc
        return cls.from_json(data, source)
