"""Linked-sheet test projects, and a stand-in for the kernel that runs a sheet in this process.

``run_in_process`` has the signature of ``calcpack.package.execute._execute``: it runs the
notebook's code cells with ``exec`` in the notebook's folder, with the environment a build
gives its kernels, and returns the notebook with one output carrying the sheets' records. So
the build's ordering, cache keys and value passing run for real, in milliseconds per sheet.
"""

from __future__ import annotations

import contextlib
import json
import os
from collections.abc import Iterator, Mapping, Sequence
from pathlib import Path
from typing import Any

import nbformat

from calcpack.errors import NotebookExecutionError
from calcpack.working import RECORDS_MIMETYPE, Sheet
from calcpack.working.links import EXPORTS_DIR_ENV, SHEET_ENV

HEAD = (
    "from calcpack import ureg\nfrom calcpack.working import Sheet\n"
    's = Sheet("linked", auto_display=False)\n'
)

PROJECT = """
[job]
number = "9002"
title = "Linked sheets"
client = "Invented Client"
site = "2 Test Street"
units = "SI"

[people]
preparer = "P. Reparer"
checker = "C. Hecker"
approver = "A. Pprover"

[[revisions]]
rev = "A"
date = 2026-01-15
description = "Test issue"

{sheets}

[design]
standards = ["Test standard"]
"""


def write_linked_project(root: Path, sheets: Mapping[str, str], order: Sequence[str]) -> Path:
    """A project of notebooks ``sheets/<name>.ipynb`` (one code cell each after the imports),
    listed in the project file in ``order``."""
    for name, code in sheets.items():
        nb = nbformat.v4.new_notebook()
        nb.metadata = {"kernelspec": {"name": "python3", "display_name": "Python 3"}}
        nb.cells = [nbformat.v4.new_code_cell(HEAD), nbformat.v4.new_code_cell(code)]
        (root / "sheets").mkdir(parents=True, exist_ok=True)
        nbformat.write(nb, root / "sheets" / f"{name}.ipynb")
    entries = "\n".join(f'[[sheets]]\npath = "sheets/{n}.ipynb"\ntitle = "{n}"\n' for n in order)
    (root / "calcpack.toml").write_text(PROJECT.format(sheets=entries), "utf-8")
    return root


PLACEHOLDER_SHEET = {
    "cells": [{"cell_type": "code", "source": "x = 1", "metadata": {}, "outputs": []}],
    "metadata": {},
    "nbformat": 4,
    "nbformat_minor": 5,
}


def sheets_folder_project(
    root: Path,
    names: Sequence[str],
    monkeypatch: Any,
    *,
    inputs: Mapping[str, str] | None = None,
) -> Path:
    """A bare project of placeholder sheets ``sheets/<name>.ipynb`` (with an inputs file
    ``sheets/<name>.inputs.toml`` for each of ``inputs``: name -> its TOML text), entered as a
    kernel enters it: the working folder is the sheets folder, and no build, exports folder,
    session or sheet is set in the environment (``monkeypatch`` undoes it all)."""
    (root / "sheets").mkdir()
    entries = []
    for name in names:
        (root / "sheets" / f"{name}.ipynb").write_text(json.dumps(PLACEHOLDER_SHEET))
        entry = f'[[sheets]]\npath = "sheets/{name}.ipynb"\n'
        if inputs and name in inputs:
            (root / "sheets" / f"{name}.inputs.toml").write_text(inputs[name])
            entry += f'inputs = ["sheets/{name}.inputs.toml"]\n'
        entries.append(entry)
    (root / "calcpack.toml").write_text("\n".join(entries))
    monkeypatch.chdir(root / "sheets")
    for name in ("CALCPACK_BUILDING", EXPORTS_DIR_ENV, "JPY_SESSION_NAME", SHEET_ENV):
        monkeypatch.delenv(name, raising=False)
    return root


@contextlib.contextmanager
def _kernel_like(folder: Path, env: dict[str, str]) -> Iterator[None]:
    old_env = {k: os.environ.get(k) for k in env}
    old_dir = Path.cwd()
    os.environ.update(env)
    os.chdir(folder)
    try:
        yield
    finally:
        os.chdir(old_dir)
        for k, v in old_env.items():
            if v is None:
                os.environ.pop(k, None)
            else:
                os.environ[k] = v


def run_in_process(path: str, sheet: str, timeout: float, exports: str | None = None) -> str:
    """Run a notebook as a build's kernel would; the executed notebook's JSON.

    Raises:
        NotebookExecutionError: a cell raised (naming the sheet, the cell and its first line).
    """
    nb = nbformat.read(path, as_version=4)
    env = {"CALCPACK_BUILDING": "1", SHEET_ENV: sheet}
    if exports is not None:
        env[EXPORTS_DIR_ENV] = exports
    namespace: dict[str, Any] = {}
    with _kernel_like(Path(path).parent, env):
        for index, cell in enumerate(nb.cells, start=1):
            if cell.cell_type != "code":
                continue
            try:
                exec(cell.source, namespace)
            except Exception as exc:
                first = cell.source.strip().splitlines()[0]
                raise NotebookExecutionError(
                    sheet, index, first, f"{type(exc).__name__}: {exc}"
                ) from None
    records: dict[str, list[Any]] = {}
    for value in namespace.values():
        if isinstance(value, Sheet):
            for key, items in value.records().items():
                records.setdefault(key, []).extend(items)
    output = nbformat.v4.new_output("display_data", data={RECORDS_MIMETYPE: records})
    nb.cells[-1].outputs = [output]
    return str(nbformat.writes(nb))


def exported(notebook_json: str) -> dict[str, float]:
    """Name -> value of what an executed notebook exports."""
    nb = json.loads(notebook_json)
    out = {}
    for cell in nb["cells"]:
        for o in cell.get("outputs", []):
            for e in o.get("data", {}).get(RECORDS_MIMETYPE, {}).get("exports", []):
                out[e["name"]] = e["value"]
    return out
