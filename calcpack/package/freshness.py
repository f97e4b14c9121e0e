"""Whether a package is up to date, and what the previous build tells the next one.

A build's key hashes everything its package depends on (the package code and templates, the
project file, every sheet's cache key, the options, the review file, the issued revisions); a
build whose key matches the manifest beside an intact package is skipped. The previous
manifest also gives each sheet's and section's page count, so the layout needs one pass.
"""

from __future__ import annotations

import contextlib
import datetime as _dt
import hashlib
from pathlib import Path
from typing import Any

from calcpack.package import publish
from calcpack.package.document import DocumentOptions
from calcpack.package.project import Project

__all__ = [
    "build_key",
    "known_sheet_pages",
    "package_code_hash",
    "page_guess",
    "pair_intact",
    "previous_manifest",
]


def package_code_hash() -> str:
    """Hash of the build code and templates, so a changed layout is never skipped as current."""
    import calcpack
    from calcpack.package.locations import template_dirs

    here = Path(__file__).resolve().parent
    digest = hashlib.sha256(calcpack.__version__.encode())
    files = sorted([*here.glob("*.py"), *here.glob("assets/*")])
    for folder in template_dirs():
        files += sorted(Path(folder, "calcpack").glob("*"))
    for f in files:
        if f.is_file():
            digest.update(f.name.encode() + f.read_bytes())
    return digest.hexdigest()


def build_key(
    project: Project,
    executed_keys: list[str],
    options: DocumentOptions,
    review_file: Path | None,
    created: _dt.datetime,
    code_hash: str,
) -> str:
    from calcpack.package import revisions

    digest = hashlib.sha256()
    for part in (
        code_hash,
        publish.project_basis(project).decode("utf-8"),
        *executed_keys,
        options.paper,
        str(options.reviewer_copy),
        created.isoformat(),
        review_file.read_text("utf-8") if review_file else "",
        revisions.issued_basis_key(project),
    ):
        digest.update(part.encode() + b"\0")
    return digest.hexdigest()


def previous_manifest(path: Path) -> dict[str, Any]:
    """The manifest of the package already in the output folder ({} if none or unreadable)."""
    import json

    try:
        data = json.loads(path.read_text("utf-8"))
    except (OSError, ValueError):
        return {}
    return data if isinstance(data, dict) else {}


def pair_intact(pdf_path: Path, manifest_path: Path) -> bool:
    """Whether the PDF carries, as its attachment, the very manifest beside it.

    The two files are replaced one after the other; a build stopped between the two (or a file
    replaced by hand) leaves a pair that disagrees. Such a package is not up to date: it is
    built again (with a warning), never reported as current.
    """
    from calcpack.package.manifest import embedded_manifest_bytes

    if not pdf_path.is_file():
        return False
    try:
        beside = manifest_path.read_bytes()
    except OSError:
        return False
    if embedded_manifest_bytes(pdf_path) == beside:
        return True
    import warnings

    from calcpack.package.cache import CacheWarning

    warnings.warn(
        CacheWarning(
            f"Package {pdf_path.name} does not carry the manifest beside it "
            f"({manifest_path.name}): an earlier build was interrupted or a file was replaced; "
            "building it again"
        ),
        stacklevel=3,
    )
    return False


def _same_paper(previous: dict[str, Any], options: DocumentOptions) -> dict[str, Any]:
    """The previous build's manifest if it was on the same paper ({} otherwise): page counts
    carry over only then."""
    return previous if previous.get("build", {}).get("paper") == options.paper else {}


def known_sheet_pages(previous: dict[str, Any], options: DocumentOptions) -> dict[str, int]:
    """Sheet path -> its page count in the previous build (same paper), if there was one."""
    known: dict[str, int] = {}
    for sheet in _same_paper(previous, options).get("sheets", []):
        if isinstance(sheet, dict) and isinstance(sheet.get("path"), str):
            with contextlib.suppress(TypeError, ValueError):
                first, last = sheet.get("pages", [1, 1])
                known[sheet["path"]] = int(last) - int(first) + 1
    return known


def page_guess(
    previous: dict[str, Any],
    sheet_pages: dict[str, int],
    sheet_ids: dict[str, str],
    options: DocumentOptions,
) -> dict[str, int]:
    """Expected page count per section id, so that the layout needs one pass, not two.

    A sheet's page count depends only on its own content and the paper: a sheet the previous
    build had keeps its count there (an edit rarely changes it); a new one was counted on its
    own when it was converted (``sheet_pages``, by path). The other sections take the previous
    build's counts, by id; without one, :func:`~calcpack.package.paginate.paginate` counts them.
    """
    guess: dict[str, int] = {}
    for ident, span in (_same_paper(previous, options).get("sections") or {}).items():
        if ident not in sheet_ids.values() and isinstance(span, list) and len(span) == 2:
            guess[ident] = int(span[1]) - int(span[0]) + 1
    for path, ident in sheet_ids.items():
        if path in sheet_pages:
            guess[ident] = sheet_pages[path]
    return guess
