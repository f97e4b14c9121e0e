"""Values carried between the sheets of a project: the exports file and how a sheet is found.

A sheet exports named values (:meth:`calcpack.working.Sheet.export`); another sheet of the same
project imports them by the exporting sheet's notebook name and the value's name
(:meth:`calcpack.working.Sheet.import_value`). The exported values travel in an *exports file*,
JSON, one per sheet:

- in a package build, the build writes it from the exporting sheet's recorded outputs into a
  folder of its own (environment variable ``CALCPACK_EXPORTS_DIR``) before it starts the sheets
  that import from it, so a sheet always reads the values of the build it is part of;
- in JupyterLab, the exporting sheet's kernel writes it into ``PROJECT/.calcpack-cache/exports/``
  each time it exports, and a build copies its own there when it is done. The file records a
  hash of the exporting notebook's code and of its inputs files, so an import can say when the
  values are older than the sheet they came from (run that sheet first).

Values are stored at full precision, in the unit the exporting sheet displays them in. This
module reads the project file itself (the sheet list only), so the working layer needs nothing
from the package build.
"""

from __future__ import annotations

import hashlib
import json
import os
import re
import tomllib
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Protocol

from calcpack.errors import InputError

__all__ = [
    "EXPORTS_DIR_ENV",
    "EXPORTS_FORMAT",
    "SHEET_ENV",
    "ExportsFile",
    "SheetRef",
    "code_sha256",
    "entry_key",
    "exports_document",
    "exports_key",
    "exports_path",
    "inputs_sha256",
    "match_sheet",
    "project_sheets",
    "read_exports",
    "resolve_sheet",
    "sealed_exports",
    "staleness",
    "this_sheet",
    "write_exports",
]

EXPORTS_FORMAT = "calcpack-exports/1"
EXPORTS_DIR_ENV = "CALCPACK_EXPORTS_DIR"
"""Set by the build for its kernels: the folder holding this build's exports files."""
SHEET_ENV = "CALCPACK_SHEET"
"""Set by the build for each kernel: the project-relative path of the sheet it runs."""
PROJECT_FILE = "calcpack.toml"
EXPORTS_SUBDIR = (".calcpack-cache", "exports")


@dataclass(frozen=True)
class SheetRef:
    """A sheet of the project, as an importing sheet names it.

    Attributes:
        root: the project folder.
        path: notebook path relative to the project folder, with forward slashes.
        number: the sheet number shown in the package ("2", "L1").
        position: 1-based place of the sheet in the project file (its section is
            ``sheet-<position>`` in the package).
        inputs: the inputs files the project file lists for it (relative paths).
    """

    root: Path
    path: str
    number: str
    position: int
    inputs: tuple[str, ...] = ()

    @property
    def name(self) -> str:
        """The notebook's name without folder and extension (``"01_loads"``)."""
        return Path(self.path).stem

    @property
    def notebook(self) -> Path:
        return self.root / self.path

    @property
    def anchor(self) -> str:
        """The link target of the sheet in the package."""
        return f"#sheet-{self.position}"


def entry_key(name: str, case: str | None) -> str:
    """Key of an exported value in the exports file: ``"R_A"`` or, per load case, ``"R_A[D]"``."""
    return name if case is None else f"{name}[{case}]"


def _find_root(start: Path) -> Path | None:
    for folder in (start, *start.parents):
        if (folder / PROJECT_FILE).is_file():
            return folder
    return None


def project_sheets(root: Path) -> tuple[SheetRef, ...]:
    """The sheets listed in ``root/calcpack.toml``, in project order.

    Raises:
        InputError: the project file cannot be read as TOML.
    """
    file = root / PROJECT_FILE
    try:
        data = tomllib.loads(file.read_text(encoding="utf-8"))
    except (OSError, tomllib.TOMLDecodeError, UnicodeDecodeError) as exc:
        raise InputError(
            f"Project file {file} cannot be read ({exc})",
            name="project",
            value=str(file),
            expected="a readable calcpack.toml",
        ) from exc
    project_inputs = tuple(str(i) for i in data.get("inputs", []) if isinstance(i, str))
    out = []
    for i, item in enumerate(data.get("sheets", []) or [], start=1):
        if not isinstance(item, dict) or not isinstance(item.get("path"), str):
            continue
        inputs = tuple(str(x) for x in item.get("inputs", []) if isinstance(x, str))
        out.append(
            SheetRef(
                root=root,
                path=item["path"].replace("\\", "/"),
                number=str(item.get("number", i)).strip(),
                position=i,
                inputs=inputs + project_inputs,
            )
        )
    return tuple(out)


def resolve_sheet(reference: str, *, start: Path | None = None) -> SheetRef:
    """The project's sheet called ``reference`` (notebook name, or path in the project file).

    Args:
        reference: ``"02_lintel"``, ``"02_lintel.ipynb"`` or ``"sheets/02_lintel.ipynb"``.
        start: the folder to look for the project file from (default: the working folder,
            which is the notebook's folder in JupyterLab and in a build).

    Raises:
        InputError: no project file above ``start``, or no such sheet in it (the message
            lists the sheets and suggests the nearest name).
    """
    if not isinstance(reference, str) or not reference.strip():
        raise InputError(
            f"The sheet to import from must be named by its notebook (got {reference!r})",
            name="sheet",
            value=reference,
            expected='a notebook name such as "02_lintel"',
        )
    here = (start or Path.cwd()).resolve()
    root = _find_root(here)
    if root is None:
        raise InputError(
            f"Cannot import from sheet {reference!r}: no {PROJECT_FILE} in {here} or above it "
            "(imports work between the sheets of a project)",
            name="sheet",
            value=reference,
            expected=f"a notebook in a folder with a {PROJECT_FILE}",
        )
    sheets = project_sheets(root)
    found = match_sheet(reference, [ref.path for ref in sheets])
    for ref in sheets:
        if ref.path == found:
            return ref
    wanted = reference.strip().replace("\\", "/")
    from calcpack.validate import suggest

    names = [ref.name for ref in sheets]
    hint = suggest(Path(wanted).stem, names)
    extra = f"; did you mean {hint[0]!r}?" if hint else ""
    raise InputError(
        f"Sheet {reference!r} is not in the project {root / PROJECT_FILE} (its sheets: "
        f"{', '.join(names) or 'none'}){extra}",
        name="sheet",
        value=reference,
        expected="one of " + ", ".join(names),
    )


def match_sheet(reference: str, paths: list[str]) -> str | None:
    """The project path among ``paths`` that ``reference`` names (path, file name or notebook
    name without extension), or None."""
    wanted = reference.strip().replace("\\", "/")
    for path in paths:
        if wanted in (path, Path(path).name, Path(path).stem):
            return path
    return None


def this_sheet(start: Path | None = None) -> SheetRef | None:
    """The sheet this kernel runs, when it can be told: the build names it (``CALCPACK_SHEET``);
    JupyterLab names the notebook (``JPY_SESSION_NAME``), found in the working folder."""
    here = (start or Path.cwd()).resolve()
    root = _find_root(here)
    if root is None:
        return None
    named = os.environ.get(SHEET_ENV)
    candidates: list[Path] = []
    if named:
        candidates.append(root / named)
    session = os.environ.get("JPY_SESSION_NAME")
    if session:
        candidates.append(here / Path(session).name)
    for ref in project_sheets(root):
        for candidate in candidates:
            if candidate.resolve() == ref.notebook.resolve():
                return ref
    return None


def code_sha256(notebook: Path) -> str:
    """Hex SHA-256 of a notebook's code cells (their source only: outputs and metadata aside)."""
    digest = hashlib.sha256()
    try:
        nb = json.loads(notebook.read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return ""
    for cell in nb.get("cells", []):
        if cell.get("cell_type") == "code":
            source = cell.get("source", "")
            text = "".join(source) if isinstance(source, list) else str(source)
            digest.update(text.encode("utf-8") + b"\0")
    return digest.hexdigest()


def inputs_sha256(ref: SheetRef) -> dict[str, str]:
    """Hex SHA-256 of each inputs file the sheet reads ("" for a missing one)."""
    out = {}
    for name in ref.inputs:
        try:
            out[name] = hashlib.sha256((ref.root / name).read_bytes()).hexdigest()
        except OSError:
            out[name] = ""
    return out


def _slug(path: str) -> str:
    return re.sub(r"[^A-Za-z0-9]+", "_", path).strip("_")


def exports_path(ref: SheetRef) -> Path:
    """Where the sheet's exports file is read and written (see the module docstring)."""
    folder = os.environ.get(EXPORTS_DIR_ENV)
    base = Path(folder) if folder else ref.root.joinpath(*EXPORTS_SUBDIR)
    return base / f"{_slug(ref.path)}.json"


@dataclass(frozen=True)
class ExportsFile:
    """A sheet's exported values as read back.

    Attributes:
        sheet: the exporting sheet's path.
        values: key (:func:`entry_key`) -> entry (``name``, ``case``, ``value`` at full precision
            in ``unit``, ``pint_unit``, ``kind``, ``description``, ``symbol``).
        code_sha256, inputs_sha256: what the sheet was when it wrote them.
    """

    sheet: str
    values: dict[str, dict[str, Any]]
    code_sha256: str
    inputs_sha256: dict[str, str]


def exports_document(ref: SheetRef, entries: list[dict[str, Any]]) -> dict[str, Any]:
    """The JSON document of an exports file for ``entries`` (the sheet's export records)."""
    return {
        "format": EXPORTS_FORMAT,
        "sheet": ref.path,
        "code_sha256": code_sha256(ref.notebook),
        "inputs_sha256": inputs_sha256(ref),
        "values": {entry_key(e["name"], e.get("case")): e for e in entries},
    }


def exports_key(sheet_path: str) -> str:
    """The key an exports file is sealed under (:mod:`calcpack.fileio`): a file copied over
    another sheet's is refused, not read."""
    return f"exports-{_slug(sheet_path)}"


def sealed_exports(document: dict[str, Any]) -> bytes:
    """An exports document as the sealed entry written to disk."""
    from calcpack.fileio import seal

    text = json.dumps(document, indent=1, sort_keys=True) + "\n"
    return seal(exports_key(str(document["sheet"])), text.encode("utf-8"))


def write_exports(ref: SheetRef, entries: list[dict[str, Any]]) -> Path:
    """Write the sheet's exports file (a sealed entry); returns its path."""
    from calcpack.fileio import write_atomically

    target = exports_path(ref)
    write_atomically(target, sealed_exports(exports_document(ref, entries)))
    return target


def read_exports(ref: SheetRef) -> ExportsFile:
    """The sheet's exports file.

    Raises:
        InputError: there is none yet (the sheet has not been run or built) or it is unreadable.
    """
    from calcpack.fileio import read_entry

    target = exports_path(ref)
    try:
        # A file edited by hand, truncated or copied over another sheet's is discarded with a
        # warning and is then as if the sheet had not run: its values are never used.
        content = read_entry(target, exports_key(ref.path), what="exports of sheet " + ref.path)
        if content is None:
            raise FileNotFoundError(target)
        data = json.loads(content.decode("utf-8"))
    except FileNotFoundError:
        raise InputError(
            f"Sheet {ref.name!r} has no recorded exports yet: run it (or build the project) "
            "first, and check that it exports the values other sheets import",
            name="sheet",
            value=ref.name,
            expected="a sheet that has been run and calls export()",
        ) from None
    except (OSError, ValueError) as exc:
        raise InputError(
            f"The exports file of sheet {ref.name!r} ({target}) cannot be read ({exc}); run "
            "that sheet again",
            name="sheet",
            value=ref.name,
            expected="a readable exports file",
        ) from exc
    if not isinstance(data, dict) or data.get("format") != EXPORTS_FORMAT:
        raise InputError(
            f"The exports file of sheet {ref.name!r} ({target}) is not a {EXPORTS_FORMAT} file; "
            "run that sheet again",
            name="sheet",
            value=ref.name,
            expected=EXPORTS_FORMAT,
        )
    values = data.get("values")
    return ExportsFile(
        sheet=str(data.get("sheet", ref.path)),
        values=dict(values) if isinstance(values, dict) else {},
        code_sha256=str(data.get("code_sha256", "")),
        inputs_sha256=dict(data.get("inputs_sha256") or {}),
    )


class _Recorded(Protocol):
    @property
    def code_sha256(self) -> str: ...
    @property
    def inputs_sha256(self) -> dict[str, str]: ...


def staleness(ref: SheetRef, exports: _Recorded) -> str | None:
    """Why the recorded values may be older than the sheet (None when they are current).

    ``exports``: what the sheet recorded -- its exports file, or its results file
    (:mod:`calcpack.working.recorded`), each holding the hashes of the sheet it came from."""
    if exports.code_sha256 and exports.code_sha256 != code_sha256(ref.notebook):
        return f"the notebook {ref.path} has changed since its values were recorded"
    current = inputs_sha256(ref)
    for name, digest in exports.inputs_sha256.items():
        if current.get(name, "") != digest:
            return f"its inputs file {name} has changed since its values were recorded"
    return None
