"""The calc package build: project file, execution, conversion, pagination, manifest.

Heavy libraries (nbclient, nbconvert, WeasyPrint, ziamath) are imported only when a build runs,
so importing this package is cheap.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from calcpack.package.execute import ExecutedSheet, execute_notebook, execute_sheets
from calcpack.package.manifest import MANIFEST_ATTACHMENT_NAME, read_manifest
from calcpack.package.pipeline import BuildResult, build, single_sheet_pdf
from calcpack.package.project import Project, ProjectFileError, load_project
from calcpack.package.records import SheetRecords, collect_records
from calcpack.package.scaffold import copy_demo_project, demo_project_source, new_project

__all__ = [
    "MANIFEST_ATTACHMENT_NAME",
    "BuildResult",
    "ExecutedSheet",
    "Project",
    "ProjectFileError",
    "SheetRecords",
    "build",
    "collect_records",
    "copy_demo_project",
    "demo_project_source",
    "execute_notebook",
    "execute_sheets",
    "load_project",
    "new_project",
    "read_manifest",
    "reproduce_manifest",
    "single_sheet_pdf",
]


def reproduce_manifest(project: str | Path, *, workers: int = 2) -> dict[str, Any]:
    """Re-execute every sheet (no cache) and return the manifest's ``sheets`` records afresh.

    The archive check: the result is comparable with a package's manifest (same keys for each
    sheet: number, title, path, values, checks, assumptions, cautions; the links between
    sheets, each with the value it carried; the checker's independent checks, compared again).
    """
    import nbformat

    from calcpack.contract.manifest import Manifest
    from calcpack.package.document import SheetDoc
    from calcpack.package.links import link_records
    from calcpack.package.manifest import sheet_record
    from calcpack.package.sheetdoc import sheet_title
    from calcpack.package.verification import compare_verifications

    loaded = load_project(project)
    found = []
    links: list[dict[str, Any]] = []
    for item in execute_sheets(loaded, workers=workers, use_cache=False):
        nb = nbformat.reads(item.notebook_json, as_version=4)
        records = collect_records(nb)
        title = sheet_title(item.entry, nb)
        found.append(
            (sheet_record(item.entry, title, records), SheetDoc(item.entry, title, "", records))
        )
        links += link_records(item.entry.path, records.imports)
    compared = compare_verifications(loaded, [doc for _, doc in found])
    return Manifest(
        sheets=tuple(s for s, _ in found),
        links=tuple(links),
        verifications=tuple(c.to_json() for c in compared),
    ).to_json()
