"""What a sheet's execution depends on, and nothing else: the key of its cached result.

A sheet's executed notebook can change only with

- its notebook and the inputs files it reads (its own and the project's),
- the values it imports from other sheets (added by :func:`calcpack.package.execute`),
- what a kernel can read of the project file: the unit system, the design standards, the
  project inputs and the list of sheets (paths, numbers and inputs: imports between sheets
  name their source by them),
- the firm's own checklists file, when the project has one (read by ``Sheet.checklist``),
- calcpack's own code and reference data.

The job's title, client, site, firm, paper, people and revisions (including ``issued``), the
sheets' titles and the design basis texts are printed by the layout, not computed by a sheet:
editing them lays the package out again without executing anything.
"""

from __future__ import annotations

import functools
import hashlib
import json
from pathlib import Path

from calcpack.package.project import Project, SheetEntry

__all__ = ["calcpack_code_hash", "sheet_basis", "sheet_cache_key"]

_CODE_SUFFIXES = frozenset({".py", ".csv", ".json", ".toml", ".ttf", ".otf"})


@functools.cache
def calcpack_code_hash() -> str:
    """SHA-256 of calcpack's version, code and reference data (once per process).

    An editable install keeps its version while its code changes: the files themselves are
    hashed, so a sheet cached before a change of calcpack is executed again after it.
    """
    import calcpack

    root = Path(calcpack.__file__).resolve().parent
    digest = hashlib.sha256(calcpack.__version__.encode() + b"\0")
    for path in sorted(root.rglob("*")):
        if path.suffix in _CODE_SUFFIXES and "__pycache__" not in path.parts and path.is_file():
            rel = path.relative_to(root).as_posix().encode()
            data = path.read_bytes()
            digest.update(rel + b"\0" + str(len(data)).encode() + b"\0" + data)
    return digest.hexdigest()


def sheet_basis(project: Project) -> bytes:
    """The parts of the project file a sheet's kernel can read, as canonical JSON."""
    basis = {
        "units": project.units,
        "standards": list(project.design.standards),
        "inputs": list(project.inputs),
        "sheets": [[s.number, s.path, list(s.inputs)] for s in project.sheets],
    }
    return json.dumps(basis, sort_keys=True, ensure_ascii=False).encode("utf-8")


def sheet_cache_key(project: Project, sheet: SheetEntry) -> str:
    """Hex SHA-256 identifying one sheet's execution: what it runs and everything it reads
    (see the module notes; the values it imports are added by the build)."""
    digest = hashlib.sha256()

    def feed(label: str, data: bytes) -> None:
        digest.update(label.encode() + b"\0" + str(len(data)).encode() + b"\0" + data)

    feed("calcpack", calcpack_code_hash().encode())
    feed("project", sheet_basis(project))
    feed("notebook", project.sheet_path(sheet).read_bytes())
    for name in (*sheet.inputs, *project.inputs):
        feed("input:" + name, (project.root / name).read_bytes())
    from calcpack.checks.checklists import CHECKLIST_FILE

    own = project.root / CHECKLIST_FILE  # a firm's own checklists, read by Sheet.checklist
    if own.is_file():
        feed("checklists", own.read_bytes())
    return digest.hexdigest()
