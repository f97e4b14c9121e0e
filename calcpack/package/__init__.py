"""The calc package build: project file, execution, conversion, pagination, manifest.

Heavy libraries (nbclient, nbconvert, WeasyPrint, ziamath) are imported only when a build runs,
so importing this package is cheap.
"""

from __future__ import annotations

from calcpack.package.execute import ExecutedSheet, execute_notebook, execute_sheets
from calcpack.package.manifest import MANIFEST_ATTACHMENT_NAME, read_manifest
from calcpack.package.pipeline import BuildResult, build, single_sheet_pdf
from calcpack.package.project import Project, ProjectFileError, load_project
from calcpack.package.records import SheetRecords, collect_records
from calcpack.package.reproduce import reproduce_manifest, verify_package
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
    "verify_package",
]
