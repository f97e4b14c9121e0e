"""Publishing a build's output without ever losing a signed package.

A package that carries signatures is what its signers answer for: a build never replaces it.

- If nothing that shapes the package changed (the build key recorded in the package's
  manifest still holds), the build leaves the signed file as it is. Marking the revision
  ``issued = true`` is such a non-change: :func:`project_basis` leaves the flag of the revision
  being built out of every key, and the document does not print it for that revision, so the
  build only keeps the manifest in ``issued/``.
- Otherwise the build refuses before anything executes, naming the file and its signers
  (:class:`~calcpack.errors.SignedPackageError`), unless it was asked to supersede: then, just
  before the new package is moved into place, the signed one (with the manifest beside it) is
  moved into ``superseded/`` beside it under a name not used there yet. Nothing is deleted.

The order of work this protects: build -> review -> sign -> issue. A later change is a new
revision, whose package gets a new file name.
"""

from __future__ import annotations

import json
import os
import tomllib
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError, SignedPackageError
from calcpack.package.project import Project

__all__ = [
    "SUPERSEDED_DIR_NAME",
    "check_output_folder",
    "check_timeout",
    "make_way",
    "project_basis",
    "signatures_in",
]

SUPERSEDED_DIR_NAME = "superseded"


def project_basis(project: Project) -> bytes:
    """The project file as it shapes the package: its parsed content as canonical JSON, without
    the ``issued`` flag of the revision being built (marking a revision issued changes no
    page of its package)."""
    data: dict[str, Any] = tomllib.loads(project.path.read_text("utf-8"))
    revisions = data.get("revisions")
    if isinstance(revisions, list) and revisions and isinstance(revisions[-1], dict):
        revisions[-1] = {k: v for k, v in revisions[-1].items() if k != "issued"}
    return json.dumps(data, sort_keys=True, default=str, ensure_ascii=False).encode("utf-8")


def signatures_in(pdf: Path) -> tuple[tuple[str, str], ...]:
    """``(role, signer name)`` of every signature in ``pdf``, in signing order (empty if none).

    A file that cannot be read as a PDF is treated as signed by an unknown signer only when it
    holds a signature dictionary; otherwise it carries no signature.
    """
    try:
        data = pdf.read_bytes()
    except FileNotFoundError:
        return ()
    except OSError as exc:
        raise BuildError(f"Cannot read the existing package {str(pdf)!r} ({exc})") from exc
    if b"/ByteRange" not in data:  # every PDF signature dictionary has one
        return ()
    import io

    from pyhanko.pdf_utils.reader import PdfFileReader

    from calcpack.signing.keys import certificate_name
    from calcpack.signing.manifest import role_of_field

    found: list[tuple[str, str]] = []
    try:
        reader = PdfFileReader(io.BytesIO(data), strict=False)
        for sig in reader.embedded_signatures:
            role = role_of_field(sig.field_name) or str(sig.field_name)
            try:
                name = certificate_name(sig.signer_cert)
            except Exception:  # a damaged signature still counts as one
                name = "unknown signer"
            found.append((role, name))
    except Exception:
        return (("unknown role", "unknown signer"),)
    return tuple(found)


def placeholder_warnings(project: Project) -> tuple[str, ...]:
    """A warning per template placeholder left in the project file (signing refuses them)."""
    from calcpack.contract.placeholders import placeholders_in_summary

    summary = {**project.summary(), "basis": project.design.basis}
    return tuple(
        f'{project.path.name}: {field} is still the template\'s "{text}"; fill it in before '
        "signing (a package printing it cannot be signed)"
        for field, text in placeholders_in_summary(summary)
    )


def check_timeout(timeout: float) -> float:
    """The per-cell time limit, if it is a positive, finite number of seconds.

    Raises:
        InputError: zero, negative, NaN or infinite (a limit that would never stop a cell).
    """
    import math

    from calcpack.errors import InputError

    if (
        isinstance(timeout, bool)
        or not isinstance(timeout, int | float)
        or not (math.isfinite(timeout) and timeout > 0)
    ):
        raise InputError(
            f"The cell time limit --timeout must be a positive number of seconds "
            f"(got timeout = {timeout!r})",
            name="timeout",
            value=timeout,
            expected="seconds > 0",
        )
    return float(timeout)


def check_output_folder(out: Path) -> None:
    """Make sure the package can be written to ``out`` before anything executes.

    The folder is made if its parent exists (``PROJECT/build`` on a first build); a folder
    whose parent is missing is refused rather than made, as it is more likely a typing slip.

    Raises:
        BuildError: the folder's parent is missing, it is a file, or it is not writable.
    """
    import tempfile

    if not out.exists():
        if not out.parent.is_dir():
            raise BuildError(
                f"Output folder {str(out)!r} does not exist and neither does its parent "
                f"{str(out.parent)!r}; create it first or give another --out"
            )
        try:
            out.mkdir()
        except OSError as exc:
            raise BuildError(
                f"Output folder {str(out)!r} cannot be made ({exc.strerror}); give another --out"
            ) from exc
    if not out.is_dir():
        raise BuildError(f"Output folder {str(out)!r} is a file, not a folder; give another --out")
    try:
        with tempfile.NamedTemporaryFile(dir=out, prefix=".calcpack-probe-"):
            pass
    except OSError as exc:
        raise BuildError(
            f"Output folder {str(out)!r} is not writable ({exc.strerror}); nothing was executed. "
            "Make it writable or give another --out"
        ) from exc


def _free_name(folder: Path, name: str) -> Path:
    stem, suffix = os.path.splitext(name)
    candidate = folder / name
    n = 2
    while candidate.exists():
        candidate = folder / f"{stem}-{n}{suffix}"
        n += 1
    return candidate


def _move_aside(path: Path, folder: Path) -> Path:
    """Move ``path`` into ``folder`` under a name not used there; never overwrite."""
    folder.mkdir(exist_ok=True)
    while True:
        target = _free_name(folder, path.name)
        try:
            os.link(path, target)  # fails if target exists: no file is ever overwritten
        except FileExistsError:
            continue
        except OSError:
            if target.exists():
                continue
            os.rename(path, target)
            return target
        path.unlink()
        return target


def make_way(pdf_path: Path, manifest_path: Path, *, supersede: bool) -> Path | None:
    """Clear the way for a new package at ``pdf_path`` without losing a signed one.

    Returns the path the signed package was moved to (``None`` if it carried no signature or
    did not exist).

    Raises:
        SignedPackageError: the package there is signed and ``supersede`` is false.
    """
    signers = signatures_in(pdf_path)
    if not signers:
        return None
    if not supersede:
        raise SignedPackageError(str(pdf_path), signers)
    folder = pdf_path.parent / SUPERSEDED_DIR_NAME
    moved = _move_aside(pdf_path, folder)
    if manifest_path.is_file():
        # the manifest beside keeps the superseded package's name
        beside = moved.with_name(moved.name[: -len(".pdf")] + ".manifest.json")
        if not beside.exists():
            os.rename(manifest_path, beside)
    return moved
