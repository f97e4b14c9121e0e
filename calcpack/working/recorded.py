"""A sheet's latest recorded results in JupyterLab, for the checker's independent checks.

A checker's sheet in JupyterLab shows each independent check compared with the preparer's
latest recorded result, read the way an import reads an exporting sheet's latest values
(:mod:`calcpack.working.links`): from a *results file*, JSON, one per sheet, in
``PROJECT/.calcpack-cache/results/``, holding the sheet's recorded values, checks and exports
with a hash of its notebook's code and of its inputs files (so the checker is told when the
record is older than the sheet: run it first).

- In JupyterLab the sheet's kernel writes it at the end of each cell run that added steps (the
  latest :class:`~calcpack.working.Sheet` of the kernel is the one recorded);
- a package build writes it for every sheet it built, from the executed notebooks' records.

Nothing a build depends on is read from here: the build compares with its own records
(:mod:`calcpack.package.verification`); a kernel of a build writes no results file.
"""

from __future__ import annotations

import json
import os
import sys
import weakref
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import CalcpackError
from calcpack.working.links import SheetRef, code_sha256, inputs_sha256

__all__ = [
    "RESULTS_FORMAT",
    "ResultsFile",
    "follow",
    "read_results",
    "results_document",
    "results_path",
    "write_results",
]

RESULTS_FORMAT = "calcpack-results/1"
RESULTS_SUBDIR = (".calcpack-cache", "results")
_KINDS = ("values", "checks", "exports")


def results_path(ref: SheetRef) -> Path:
    """Where the sheet's results file is read and written."""
    from calcpack.working.links import _slug

    return ref.root.joinpath(*RESULTS_SUBDIR) / f"{_slug(ref.path)}.json"


def results_document(ref: SheetRef, records: Mapping[str, Sequence[Any]]) -> dict[str, Any]:
    """The JSON document of a results file from a sheet's records (``values``, ``checks``,
    ``exports`` as :meth:`calcpack.working.Sheet.records` gives them)."""
    return {
        "format": RESULTS_FORMAT,
        "sheet": ref.path,
        "code_sha256": code_sha256(ref.notebook),
        "inputs_sha256": inputs_sha256(ref),
        **{kind: [dict(r) for r in records.get(kind, ()) or ()] for kind in _KINDS},
    }


def write_results(ref: SheetRef, records: Mapping[str, Sequence[Any]]) -> Path:
    """Write the sheet's results file (replaced whole, never half-written); returns its path."""
    from calcpack.fileio import write_atomically

    target = results_path(ref)
    text = json.dumps(results_document(ref, records), indent=1, sort_keys=True, default=str)
    write_atomically(target, text + "\n")
    return target


@dataclass(frozen=True)
class ResultsFile:
    """A sheet's recorded results as read back.

    Attributes:
        sheet: the sheet's path.
        values, checks, exports: its records (JSON dicts, values at full precision).
        code_sha256, inputs_sha256: what the sheet was when it recorded them.
    """

    sheet: str
    values: tuple[dict[str, Any], ...]
    checks: tuple[dict[str, Any], ...]
    exports: tuple[dict[str, Any], ...]
    code_sha256: str
    inputs_sha256: dict[str, str]


def read_results(ref: SheetRef) -> ResultsFile | None:
    """The sheet's results file, or None when there is none yet or it cannot be read (the
    caller says so: run the sheet, or build the project, first)."""
    try:
        data = json.loads(results_path(ref).read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return None
    if not isinstance(data, dict) or data.get("format") != RESULTS_FORMAT:
        return None

    def rows(kind: str) -> tuple[dict[str, Any], ...]:
        items = data.get(kind)
        return tuple(r for r in items if isinstance(r, dict)) if isinstance(items, list) else ()

    return ResultsFile(
        sheet=str(data.get("sheet", ref.path)),
        values=rows("values"),
        checks=rows("checks"),
        exports=rows("exports"),
        code_sha256=str(data.get("code_sha256", "")),
        inputs_sha256=dict(data.get("inputs_sha256") or {}),
    )


# -- the kernel's sheet, recorded at the end of each cell run ------------------------------
_latest: weakref.ReferenceType[Any] | None = None
_hooked: list[Any] = []


def follow(sheet: Any) -> None:
    """Record ``sheet`` (an object with ``records()``) in its results file at the end of the
    current and every later cell run of this kernel, in JupyterLab only (not in a build, not
    outside a kernel, not when the kernel's notebook is not a sheet of a project)."""
    global _latest
    if os.environ.get("CALCPACK_BUILDING") == "1":
        return
    ipython = sys.modules.get("IPython")
    shell = ipython.get_ipython() if ipython is not None else None
    if shell is None or getattr(shell, "kernel", None) is None:
        return
    _latest = weakref.ref(sheet)
    if shell not in _hooked:
        shell.events.register("post_run_cell", _record_latest)
        _hooked.append(shell)


def _record_latest(*_: Any) -> None:
    """At the end of a cell run: write the followed sheet's results file when it changed."""
    sheet = _latest() if _latest is not None else None
    if sheet is None or not getattr(sheet, "_results_changed", False):
        return
    from calcpack.working.links import this_sheet

    sheet._results_changed = False
    try:
        ref = this_sheet()
        if ref is not None:
            write_results(ref, sheet.records())
    except (OSError, CalcpackError) as exc:  # the checker is told the record is missing;
        import warnings  # the sheet goes on (an error here would follow every cell run)

        warnings.warn(f"calcpack could not record this sheet's results ({exc})", stacklevel=1)
