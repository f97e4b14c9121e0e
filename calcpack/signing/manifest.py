"""Reading the manifest a calc package carries: embedded in the PDF, or beside it as JSON.

The manifest is attached to the package PDF as the embedded file :data:`MANIFEST_NAME`; its
``signature_fields`` give, per role, the page and box (PDF points, origin bottom-left) of the
cover's sign-off block.
"""

from __future__ import annotations

import json
import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.contract.manifest import MANIFEST_FORMAT, MANIFEST_NAME, check_manifest, is_manifest
from calcpack.errors import VerificationError

__all__ = [
    "FIELD_PREFIX",
    "MANIFEST_FORMAT",
    "MANIFEST_NAME",
    "SignatureBox",
    "field_name",
    "load_manifest",
    "read_embedded_manifest",
    "role_of_field",
    "signature_boxes",
]

#: Signature form fields are named ``<FIELD_PREFIX><role>``.
FIELD_PREFIX = "calcpack_signoff_"


def field_name(role: str) -> str:
    """The PDF form field name of a role's signature."""
    return f"{FIELD_PREFIX}{role}"


def role_of_field(name: str | None) -> str | None:
    """The role a signature field belongs to, or ``None`` for a field calcpack did not make."""
    if name and name.startswith(FIELD_PREFIX):
        return name[len(FIELD_PREFIX) :]
    return None


@dataclass(frozen=True)
class SignatureBox:
    """Where a role signs: 0-based page index and box ``(x1, y1, x2, y2)`` in PDF points."""

    role: str
    page: int
    box: tuple[float, float, float, float]


def _embedded_files(reader: Any) -> dict[str, Any]:
    """Name -> file specification of every embedded file in the document's name tree."""
    from pyhanko.pdf_utils import generic

    found: dict[str, Any] = {}
    try:
        tree = reader.root["/Names"]["/EmbeddedFiles"]
    except KeyError:
        return found

    def walk(node: Any) -> None:
        if isinstance(node, generic.IndirectObject):
            node = node.get_object()
        names = node.get("/Names")
        if names is not None:
            items = list(names)
            for i in range(0, len(items) - 1, 2):
                found[str(items[i].get_object())] = items[i + 1].get_object()
        for kid in node.get("/Kids", []):
            walk(kid)

    walk(tree)
    return found


def read_embedded_manifest(reader: Any, source: str) -> dict[str, Any]:
    """The manifest embedded in an open PDF (a pyHanko ``PdfFileReader``).

    Raises:
        VerificationError: the PDF carries no calcpack manifest, or it is unreadable.
    """
    spec = _embedded_files(reader).get(MANIFEST_NAME)
    if spec is None:
        raise VerificationError(
            f"{source} is not a calcpack package: it has no embedded {MANIFEST_NAME}"
        )
    try:
        stream = spec["/EF"]["/F"].get_object()
        data = json.loads(stream.data.decode("utf-8"))
    except (KeyError, ValueError, UnicodeDecodeError) as exc:
        raise VerificationError(f"The manifest embedded in {source} is unreadable ({exc})") from exc
    return check_manifest(data, f"The manifest embedded in {source}")


def load_manifest(source: str | os.PathLike[str]) -> dict[str, Any]:
    """A manifest from a package PDF, a manifest JSON file, or a directory holding one.

    A directory (a project state) is searched, two levels deep, for JSON files whose
    ``format`` is a calcpack manifest; exactly one must be found.

    Raises:
        VerificationError: missing file, not a calcpack package or manifest, several
            manifests in a directory.
    """
    path = Path(source)
    if path.is_dir():
        return _manifest_in_directory(path)
    if not path.is_file():
        raise VerificationError(f"File {str(path)!r} does not exist")
    head = path.read_bytes()[:5]
    if head == b"%PDF-":
        from pyhanko.pdf_utils.misc import PdfReadError
        from pyhanko.pdf_utils.reader import PdfFileReader

        with path.open("rb") as fh:
            try:
                reader = PdfFileReader(fh, strict=False)
                return read_embedded_manifest(reader, repr(str(path)))
            except PdfReadError as exc:
                raise VerificationError(f"{str(path)!r} is not a readable PDF ({exc})") from exc
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
    except (ValueError, UnicodeDecodeError) as exc:
        raise VerificationError(
            f"{str(path)!r} is neither a PDF nor a JSON manifest ({exc})"
        ) from exc
    return check_manifest(data, repr(str(path)))


def _manifest_in_directory(directory: Path) -> dict[str, Any]:
    candidates: list[tuple[Path, dict[str, Any]]] = []
    patterns = ("*.json", "*/*.json", "*/*/*.json")
    for pattern in patterns:
        for file in sorted(directory.glob(pattern)):
            if any(part.startswith(".") for part in file.relative_to(directory).parts):
                continue
            try:
                data = json.loads(file.read_text(encoding="utf-8"))
            except (ValueError, UnicodeDecodeError, OSError):
                continue
            if is_manifest(data):
                candidates.append((file, data))
    if not candidates:
        raise VerificationError(f"Directory {str(directory)!r} holds no calcpack manifest")
    if len(candidates) > 1:
        listed = ", ".join(str(p.relative_to(directory)) for p, _ in candidates)
        raise VerificationError(
            f"Directory {str(directory)!r} holds several calcpack manifests ({listed}); "
            "name the file"
        )
    return candidates[0][1]


def signature_boxes(manifest: dict[str, Any], source: str) -> dict[str, SignatureBox]:
    """Role -> sign-off box from a manifest's ``signature_fields``.

    Raises:
        VerificationError: missing or malformed ``signature_fields``.
    """
    fields = manifest.get("signature_fields")
    if not isinstance(fields, list) or not fields:
        raise VerificationError(
            f"The manifest of {source} has no signature_fields: the package has no sign-off block"
        )
    boxes: dict[str, SignatureBox] = {}
    for i, item in enumerate(fields):
        try:
            role = str(item["role"])
            page = int(item["page"])
            x1, y1, x2, y2 = (float(v) for v in item["box"])
        except (KeyError, TypeError, ValueError) as exc:
            raise VerificationError(
                f"signature_fields[{i}] in the manifest of {source} is malformed ({exc!r}); "
                "expected {role, page, box: [x1, y1, x2, y2]}"
            ) from exc
        if not (x2 > x1 and y2 > y1) or page < 0:
            raise VerificationError(
                f"signature_fields[{i}] ({role}) in the manifest of {source} has an empty box "
                f"or a negative page (got page = {page}, box = {[x1, y1, x2, y2]})"
            )
        boxes[role] = SignatureBox(role=role, page=page, box=(x1, y1, x2, y2))
    return boxes
