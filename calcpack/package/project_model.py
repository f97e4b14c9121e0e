"""The project as data: the validated project file's job, people, revisions, sheets and design
basis, and where a project file is found. Read by :func:`calcpack.package.project.load_project`.
"""

from __future__ import annotations

import datetime as _dt
import hashlib
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError, InputError

__all__ = [
    "PROJECT_FILE_NAME",
    "SEAL_TYPES",
    "Design",
    "EngineerOfRecord",
    "Person",
    "Project",
    "ProjectFileError",
    "Revision",
    "SheetEntry",
    "file_sha256",
    "find_project_above",
    "find_project_file",
]

PROJECT_FILE_NAME = "calcpack.toml"
TOP_LEVEL_KEYS = (
    "job",
    "people",
    "revisions",
    "sheets",
    "design",
    "inputs",
    "review",
    "engineer_of_record",
    "verification",  # the checker's independent checks (calcpack.package.verification)
)
JOB_KEYS = ("number", "title", "client", "site", "units", "paper", "firm", "firm_address")
PAPER_SIZES = ("A4", "Letter")
UNIT_SYSTEMS = ("SI", "US")


class ProjectFileError(InputError, BuildError):
    """The project file is missing, unreadable, or a field in it is missing or malformed.

    ``name`` is the dotted field path (``"sheets[2].path"``), ``value`` what was found and
    ``expected`` what would be valid.
    """


@dataclass(frozen=True)
class Person:
    """A named person in a role (preparer, checker, approver) with the date of their part."""

    name: str
    date: _dt.date | None = None


@dataclass(frozen=True)
class EngineerOfRecord:
    """The engineer of record named on the cover, with room for the seal."""

    name: str
    licence: str
    """Licence or registration number."""
    jurisdiction: str
    """Where the licence is held (state, province, country)."""
    seal: Path | None = None
    """The firm's seal image (absolute path), placed in the seal box; None leaves it blank."""


SEAL_TYPES = {
    ".png": "image/png",
    ".jpg": "image/jpeg",
    ".jpeg": "image/jpeg",
    ".svg": "image/svg+xml",
}


@dataclass(frozen=True)
class Revision:
    """One entry of the revision history; the last one is the revision being issued."""

    rev: str
    date: _dt.date
    description: str
    status: str = ""
    issued: bool = False
    """The revision has gone out: its build keeps its manifest in ``issued/`` for comparison."""


@dataclass(frozen=True)
class SheetEntry:
    """A sheet as listed in the project file: its notebook and the files it reads."""

    number: str
    path: str
    """Notebook path relative to the project folder, with forward slashes."""
    title: str | None
    inputs: tuple[str, ...] = ()


@dataclass(frozen=True)
class Design:
    """The project-wide design basis, printed before the sheets."""

    standards: tuple[str, ...]
    materials: tuple[str, ...] = ()
    loads: tuple[str, ...] = ()
    basis: str = ""
    assumptions: tuple[str, ...] = ()
    cautions: tuple[str, ...] = ()
    preset: str = ""
    """The preset declared (calcpack.presets), or "" for none."""


@dataclass(frozen=True)
class Project:
    """A validated project file."""

    path: Path
    """Absolute path of the project file."""
    job_number: str
    job_title: str
    client: str
    site: str
    units: str
    paper: str
    firm: str
    firm_address: str
    preparer: Person
    checker: Person
    approver: Person
    revisions: tuple[Revision, ...]
    sheets: tuple[SheetEntry, ...]
    design: Design
    inputs: tuple[str, ...] = field(default=())
    """Project-wide inputs files (relative paths), hashed into every sheet's cache key."""
    engineer: EngineerOfRecord | None = None
    """The engineer of record for the cover's seal block (None: the project names none)."""

    @property
    def root(self) -> Path:
        """The project folder."""
        return self.path.parent

    @property
    def revision(self) -> Revision:
        """The revision being issued (the last in the history)."""
        return self.revisions[-1]

    def sheet_path(self, sheet: SheetEntry) -> Path:
        """Absolute path of a sheet's notebook."""
        return self.root / sheet.path

    def summary(self) -> dict[str, Any]:
        """The project block of the manifest (JSON-ready)."""
        return {
            "job_number": self.job_number,
            "job_title": self.job_title,
            "client": self.client,
            "site": self.site,
            "firm": self.firm,
            "units": self.units,
            "paper": self.paper,
            "revision": self.revision.rev,
            "revision_date": self.revision.date.isoformat(),
            "revision_status": self.revision.status,
            "preparer": self.preparer.name,
            "checker": self.checker.name,
            "approver": self.approver.name,
            "standards": list(self.design.standards),
        }


def file_sha256(path: Path) -> str:
    """Hex SHA-256 of a file's bytes."""
    return hashlib.sha256(path.read_bytes()).hexdigest()


def find_project_file(location: str | Path) -> Path:
    """The project file for a folder or file path.

    Raises:
        ProjectFileError: there is no such file or folder, or the folder has no project file.
    """
    path = Path(location).expanduser()
    if path.is_dir():
        path = path / PROJECT_FILE_NAME
    if not path.is_file():
        raise ProjectFileError(
            f"Project file {str(path)!r} not found (expected a folder holding "
            f"{PROJECT_FILE_NAME} or the path of a project file)",
            name="project",
            value=str(location),
            expected=f"a folder with {PROJECT_FILE_NAME}",
        )
    return path.resolve()


def find_project_above(start: str | Path) -> Path | None:
    """The nearest project file in ``start`` (a folder or a file's folder) or a folder above
    it, or None: a sheet opened on its own still belongs to its job."""
    here = Path(start).expanduser().resolve()
    if here.is_file():
        here = here.parent
    for folder in (here, *here.parents):
        candidate = folder / PROJECT_FILE_NAME
        if candidate.is_file():
            return candidate
    return None
