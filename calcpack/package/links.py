"""Links between sheets in a build: who imports from whom, in what order to run them, and what
of the upstream values goes into a sheet's cache key and the manifest.

The build knows a sheet's imports before it runs the notebook: it reads the code cells and
finds every ``.import_value("02_lintel", ...)``, ``.import_cases(...)`` and
``.import_by_case(...)`` call whose sheet is written as a string (a sheet named by an
expression is refused, so the order is never a guess). It then executes in dependency
order -- a sheet starts when every sheet it imports from is done, so independent chains run
side by side -- and refuses a cycle, naming its sheets.

A sheet's cache key includes the values its upstream sheets export (:func:`imports_key`): a
change upstream re-executes exactly the sheets that import the changed values, directly or
through others.
"""

from __future__ import annotations

import ast
import graphlib
import hashlib
import json
import re
from collections.abc import Iterable, Mapping, Sequence
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError
from calcpack.package.project import Project, SheetEntry
from calcpack.working.links import EXPORTS_FORMAT, entry_key, match_sheet

__all__ = [
    "IMPORT_CALLS",
    "execution_order",
    "imports_key",
    "link_records",
    "publish_exports",
    "scan_imports",
    "sheet_dependencies",
    "write_exports_file",
]

IMPORT_CALLS = ("import_value", "import_cases", "import_by_case")
"""Sheet methods whose first argument names the sheet imported from."""

_MAGIC_RE = re.compile(r"^\s*[%!].*$", re.MULTILINE)


def _code_cells(notebook: Path) -> list[str]:
    try:
        nb = json.loads(notebook.read_text(encoding="utf-8"))
    except (OSError, ValueError) as exc:
        raise BuildError(f"Sheet {notebook.name!r} cannot be read as a notebook ({exc})") from exc
    out = []
    for cell in nb.get("cells", []):
        if cell.get("cell_type") == "code":
            source = cell.get("source", "")
            out.append("".join(source) if isinstance(source, list) else str(source))
    return out


def scan_imports(notebook: Path, *, sheet: str) -> tuple[str, ...]:
    """The sheets a notebook imports from, as written in its import calls (in order, once each).

    Args:
        notebook: the notebook file.
        sheet: its name for messages.

    Raises:
        BuildError: an import call names its sheet by an expression rather than a string.
    """
    found: list[str] = []
    for n, source in enumerate(_code_cells(notebook), start=1):
        try:
            tree = ast.parse(_MAGIC_RE.sub("", source))
        except SyntaxError:
            continue  # the kernel reports it when the cell runs
        for node in ast.walk(tree):
            if not (
                isinstance(node, ast.Call)
                and isinstance(node.func, ast.Attribute)
                and node.func.attr in IMPORT_CALLS
            ):
                continue
            first = node.args[0] if node.args else None
            for kw in node.keywords:
                if kw.arg == "sheet":
                    first = kw.value
            if isinstance(first, ast.Constant) and isinstance(first.value, str):
                if first.value not in found:
                    found.append(first.value)
            else:
                raise BuildError(
                    f"Sheet {sheet!r}, cell {n}: {node.func.attr} names the sheet by an "
                    "expression; write the sheet's name as a string, e.g. "
                    f'{node.func.attr}("02_lintel", ...), so the build can order the sheets'
                )
    return tuple(found)


def sheet_dependencies(
    project: Project, sheets: Sequence[SheetEntry] | None = None
) -> dict[str, tuple[str, ...]]:
    """Sheet path -> the paths of the sheets it imports from.

    Raises:
        BuildError: a sheet imports from a sheet that is not in the project (removed, or a
            typo), or from itself; the message names both.
    """
    paths = [s.path for s in project.sheets]
    out: dict[str, tuple[str, ...]] = {}
    for entry in sheets if sheets is not None else project.sheets:
        deps: list[str] = []
        for reference in scan_imports(project.sheet_path(entry), sheet=entry.path):
            found = match_sheet(reference, paths)
            if found is None:
                raise BuildError(
                    f"Sheet {entry.path!r} imports from sheet {reference!r}, which is not in "
                    f"the project (its sheets: {', '.join(paths)}); add it back to "
                    "calcpack.toml or change the import"
                )
            if found == entry.path:
                raise BuildError(f"Sheet {entry.path!r} imports from itself ({reference!r})")
            if found not in deps:
                deps.append(found)
        out[entry.path] = tuple(deps)
    return out


def execution_order(order: Sequence[str], dependencies: Mapping[str, Iterable[str]]) -> list[str]:
    """The sheets in an order where each comes after the sheets it imports from (project
    order among the rest).

    Raises:
        BuildError: the imports form a cycle; the message names the sheets in it.
    """
    sorter: graphlib.TopologicalSorter[str] = graphlib.TopologicalSorter()
    for path in order:
        sorter.add(path, *[d for d in dependencies.get(path, ()) if d in order])
    try:
        sorter.prepare()
    except graphlib.CycleError as exc:
        cycle = list(exc.args[1]) if len(exc.args) > 1 else []
        raise BuildError(
            "The sheets import from each other in a cycle: "
            + " -> ".join(cycle)
            + "; a value must be computed on one sheet before another can import it"
        ) from exc
    rank = {p: i for i, p in enumerate(order)}
    out: list[str] = []
    while sorter.is_active():
        ready = sorted(sorter.get_ready(), key=rank.__getitem__)
        out.extend(ready)
        sorter.done(*ready)
    return out


def imports_key(upstream: Mapping[str, Sequence[Mapping[str, Any]]]) -> str:
    """Hex SHA-256 of the values the upstream sheets export (sheet path -> export records),
    for a sheet's cache key; "" when the sheet imports nothing."""
    if not upstream:
        return ""
    data = {
        path: sorted(
            ([entry_key(e["name"], e.get("case")), e["value"], e["pint_unit"]] for e in entries),
            key=lambda item: str(item[0]),
        )
        for path, entries in sorted(upstream.items())
    }
    return hashlib.sha256(json.dumps(data, sort_keys=True).encode()).hexdigest()


def write_exports_file(
    folder: Path, project: Project, entry: SheetEntry, exports: Sequence[Mapping[str, Any]]
) -> None:
    """Write a sheet's exports file into ``folder`` (the build's, or the project's cache for
    JupyterLab), from the export records of its executed notebook."""
    from calcpack.fileio import write_atomically
    from calcpack.working.links import exports_document, project_sheets, sealed_exports

    for ref in project_sheets(project.root):
        if ref.path == entry.path:
            document = exports_document(ref, [dict(e) for e in exports])
            break
    else:  # pragma: no cover - every entry comes from the same project file
        document = {"format": EXPORTS_FORMAT, "sheet": entry.path, "values": {}}
    slug = re.sub(r"[^A-Za-z0-9]+", "_", entry.path).strip("_")
    write_atomically(folder / f"{slug}.json", sealed_exports(document))


def link_records(sheet_path: str, imports: Iterable[Mapping[str, Any]]) -> list[dict[str, Any]]:
    """The manifest's links for one importing sheet: from sheet/name (and case) to
    sheet/name, with the value and unit carried."""
    return [
        {
            "from_sheet": i.get("from_sheet"),
            "from_name": i.get("from_name"),
            "case": i.get("case"),
            "to_sheet": sheet_path,
            "to_name": i.get("to_name"),
            "value": i.get("value"),
            "unit": i.get("unit"),
        }
        for i in imports
    ]


def publish_exports(build_folder: Path, project_folder: Path) -> None:
    """Copy a build's exports files to the project's cache, where JupyterLab's imports read
    them (each replaced whole, never half-written)."""
    from calcpack.fileio import write_atomically

    if not build_folder.is_dir():
        return
    for file in sorted(build_folder.glob("*.json")):
        write_atomically(project_folder / file.name, file.read_bytes())
