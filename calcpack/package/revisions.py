"""Sheets changed since the last issued revision.

A revision marked ``issued = true`` in the project file has gone out. When it is built, the
build keeps a copy of its manifest in the project, ``PROJECT/issued/<rev>.manifest.json`` (a
small folder meant to be committed with the notebooks). A later build compares its own records
with the newest *earlier* issued revision's manifest (:func:`calcpack.signing.diff
.diff_manifests`): the sheets whose inputs, results or checks changed are marked in their
title block and in the contents, and the revision history lists, under each revision, what
changed since the issued revision before it.
"""

from __future__ import annotations

import hashlib
import itertools
import json
import re
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from calcpack.contract.compare import diff_manifests
from calcpack.fileio import write_atomically
from calcpack.package.document import RevisionMarks, SheetDoc
from calcpack.package.manifest import sheet_record
from calcpack.package.project import Project, Revision

__all__ = [
    "ISSUED_DIR_NAME",
    "compare_with_issued",
    "issued_basis_key",
    "issued_manifest_path",
    "keep_issued",
]

ISSUED_DIR_NAME = "issued"


def issued_manifest_path(project: Project, rev: str) -> Path:
    """Where the manifest of issued revision ``rev`` is kept in the project folder."""
    safe = re.sub(r"[^A-Za-z0-9._-]+", "-", rev).strip("-") or "rev"
    return project.root / ISSUED_DIR_NAME / f"{safe}.manifest.json"


def _read(path: Path) -> dict[str, Any] | None:
    try:
        data = json.loads(path.read_text("utf-8"))
    except (OSError, ValueError):
        return None
    return data if isinstance(data, dict) and isinstance(data.get("sheets"), list) else None


def _issued_before(project: Project) -> list[tuple[Revision, dict[str, Any]]]:
    """Earlier revisions (not the one being built) whose issued manifest is kept, oldest first."""
    found = []
    for rev in project.revisions[:-1]:
        data = _read(issued_manifest_path(project, rev.rev))
        if data is not None:
            found.append((rev, data))
    return found


def issued_basis_key(project: Project) -> str:
    """A hash of the kept manifests of earlier revisions: the marks depend on them."""
    digest = hashlib.sha256()
    for rev in project.revisions[:-1]:
        path = issued_manifest_path(project, rev.rev)
        if path.is_file():
            digest.update(rev.rev.encode() + b"\0" + path.read_bytes() + b"\0")
    return digest.hexdigest()


def _records(project: Project, docs: Sequence[SheetDoc]) -> dict[str, Any]:
    """This build's sheets in the manifest's shape, as far as the comparison reads it."""
    from calcpack.package.links import link_records

    return {
        "project": {"revision": project.revision.rev},
        "sheets": [sheet_record(doc.entry, doc.title, doc.records) for doc in docs],
        "links": [
            link for doc in docs for link in link_records(doc.entry.path, doc.records.imports)
        ],
    }


def compare_with_issued(project: Project, docs: Sequence[SheetDoc]) -> RevisionMarks:
    """The sheets changed since the newest earlier issued revision, and each revision's changes.

    With no earlier issued revision nothing is marked.
    """
    issued = _issued_before(project)
    if not issued:
        return RevisionMarks()
    history = {}
    for (old_rev, old), (rev, new) in itertools.pairwise(issued):
        history[rev.rev] = (old_rev.rev, diff_manifests(old, new).changes)
    since, last = issued[-1]
    current = diff_manifests(last, _records(project, docs))
    history[project.revision.rev] = (since.rev, current.changes)
    known = {doc.entry.path for doc in docs}
    changed = frozenset(p for p in current.changed_paths() if p in known)
    return RevisionMarks(since=since.rev, changed=changed, history=history)


def keep_issued(project: Project, manifest_path: Path) -> Path | None:
    """Keep the package manifest of an issued revision in ``PROJECT/issued/``; returns its path.

    Nothing is kept for a revision not marked ``issued``. The copy is written atomically and
    only when it differs, so an unchanged rebuild leaves the folder untouched.
    """
    if not project.revision.issued or not manifest_path.is_file():
        return None
    target = issued_manifest_path(project, project.revision.rev)
    data = manifest_path.read_bytes()
    if target.is_file() and target.read_bytes() == data:
        return target
    write_atomically(target, data)
    return target
