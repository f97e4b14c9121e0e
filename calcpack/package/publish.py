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
import re
import time
import tomllib
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError, SignedPackageError
from calcpack.package.project import Project

__all__ = [
    "SUPERSEDED_DIR_NAME",
    "check_notebooks",
    "check_output_folder",
    "check_timeout",
    "clean_stale_outputs",
    "make_way",
    "output_temp_prefix",
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


def check_notebooks(project: Project) -> None:
    """Refuse, before anything executes, a sheet file that is not a notebook the build can run.

    Raises:
        ProjectFileError: naming the sheet's field in the project file and what is wrong.
    """
    from calcpack.package.project import ProjectFileError

    for i, sheet in enumerate(project.sheets, start=1):
        problem = _notebook_problem(project.sheet_path(sheet))
        if problem:
            where = f"sheets[{i}].path"
            raise ProjectFileError(
                f"{project.path.name}: field {where!r} {problem} (expected a Jupyter notebook, "
                "nbformat 4)",
                name=where,
                value=sheet.path,
                expected="a Jupyter notebook (nbformat 4)",
            )


def _notebook_problem(path: Path) -> str | None:
    try:
        data = json.loads(path.read_bytes())
    except (OSError, ValueError) as exc:
        return f"names a file that is not a notebook (not valid JSON: {exc})"
    if not isinstance(data, dict) or not isinstance(data.get("cells"), list):
        return "names a JSON file that is not a notebook (it has no list of cells)"
    if data.get("nbformat") != 4:
        version = data.get("nbformat")
        return f"names a notebook of format {version!r}, not 4 (save it again in JupyterLab)"
    return None


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

    made = False
    if not out.exists():
        if not out.parent.is_dir():
            raise BuildError(
                f"Output folder {str(out)!r} does not exist and neither does its parent "
                f"{str(out.parent)!r}; create it first or give another --out"
            )
        try:
            out.mkdir()
            made = True
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
    finally:
        if made:  # made only to prove it can be: a failed build leaves nothing behind
            out.rmdir()


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


_OUTPUT_TEMP = re.compile(
    r"^\.(?P<name>.+\.(?:pdf|manifest\.json))\.(?:build-(?P<pid>\d+)-)?[0-9a-z_]{8}\.tmp$"
)
#: A temporary output written before build temporaries carried the build's process id is
#: taken as stale only when untouched this long (no build spends an hour between its moves).
_UNOWNED_AGE_S = 3600.0


def output_temp_prefix(target: Path) -> str:
    """Prefix of the temporary file a build writes ``target`` through (it names the build's
    process, so that a later build can tell a stray from a file being written now)."""
    return f".{target.name}.build-{os.getpid()}-"


def clean_stale_outputs(folder: Path) -> tuple[str, ...]:
    """Remove the temporary output files a stopped build left in ``folder``; say what was done.

    A build writes the manifest and the PDF to temporary files beside them and then moves both
    into place; a build killed between those steps leaves them behind. Only files named as a
    build names them are considered, only when the build that wrote them no longer runs, and a
    temporary PDF that carries signatures is never removed (it is reported instead).

    Returns:
        One message per file removed or kept.
    """
    from calcpack.package.interrupt import _alive

    messages = []
    for path in sorted(folder.glob(".*.tmp")) if folder.is_dir() else ():
        m = _OUTPUT_TEMP.match(path.name)
        if m is None or not path.is_file():
            continue
        pid = m.group("pid")
        if pid is not None and _alive(int(pid)):
            continue  # a build writing now
        if pid is None and time.time() - path.stat().st_mtime < _UNOWNED_AGE_S:
            continue
        if m.group("name").endswith(".pdf") and signatures_in(path):
            messages.append(
                f"kept {str(path)!r}, left by a stopped build: it carries signatures, so it is "
                "never removed; look at it and move it aside yourself"
            )
            continue
        path.unlink(missing_ok=True)
        messages.append(
            f"removed {str(path)!r}, a temporary file left by a build that stopped while "
            "publishing its output"
        )
    return tuple(messages)
