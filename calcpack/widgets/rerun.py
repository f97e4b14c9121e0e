"""Working that follows the panel: after an edit, re-run the sheet's cells below the panel in
one action, or after every edit when the user turns that on.

The panel's inputs file is the only thing the calc cells read (no result ever depends on widget
state, and the build reads the same file), so re-running the cells below the panel brings the
typed working up to date with what the panel shows. The cells are run by JupyterLab itself
through its command "run the selected cell and all below" (the panel's cell is the selected one
once it has been clicked), reached from the kernel with ipylab, a small widget library that
exposes JupyterLab's commands to Python. Without it (another front end) the control says how to
do the same by hand.

Until the cells are re-run, the control names what is stale: the inputs edited since the working
below was computed, with their new values -- and the other sheets of the job that read the same
inputs file (from the project file's ``inputs`` lists), those before this one first: a sheet
whose results this one imports (the loads sheet that takes a beam's self-weight from its
section, say) must be re-run before the cells below show the edit's whole effect.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from html import escape
from pathlib import Path
from typing import Any

import ipywidgets as ipw

from calcpack.errors import CalcpackError
from calcpack.working.links import PROJECT_FILE, project_sheets, this_sheet

__all__ = ["RUN_BELOW", "OtherSheets", "RerunControl", "sheets_reading"]


#: JupyterLab's command: run the selected (the panel's) cell and every cell below it
RUN_BELOW = "notebook:run-all-below"


def _front_end() -> Any:
    """JupyterLab's command registry through ipylab, or None when it is not available."""
    try:
        from ipylab import JupyterFrontEnd  # type: ignore[import-untyped]
    except ImportError:
        return None
    return JupyterFrontEnd()


def _text(value: Any) -> str:
    if isinstance(value, list):
        return "[" + ", ".join(_text(v) for v in value) + "]"
    if isinstance(value, dict):
        return "{…}"
    if value is None:
        return "(removed)"
    try:
        return f"{value:.4g~P}"
    except (TypeError, ValueError):
        return str(value)


@dataclass(frozen=True)
class OtherSheets:
    """The other sheets of the job that read an inputs file, as listed in the project file.

    Attributes:
        file: the inputs file's name. before: the sheets listed before the panel's notebook
            (their results may feed it: re-run them first). after: those listed after it (or
            every other sheet, when the panel's notebook is not known).
    """

    file: str
    before: tuple[str, ...] = ()
    after: tuple[str, ...] = ()

    def notice(self) -> str:
        """The sentence naming them, or "" when no other sheet reads the file."""
        if not (self.before or self.after):
            return ""
        f = escape(self.file)
        out = ""
        if self.before:
            out += (
                f" Sheets before this one read {f} too: re-run "
                f"{_names(self.before)} first, then the cells below (this sheet may import "
                "their results)."
            )
        if self.after:
            word = "after this one" if self.before else "of this job"
            out += f" Other sheets {word} read {f} as well: re-run {_names(self.after)}."
        return out


def _names(sheets: tuple[str, ...]) -> str:
    return ", ".join(escape(p) for p in sheets)


def sheets_reading(inputs: str | Path, notebook: str | Path | None = None) -> OtherSheets | None:
    """The sheets of the job (the nearest project file above ``inputs``) whose ``inputs`` list
    names the file ``inputs``, split around ``notebook`` (default: the sheet this kernel runs,
    :func:`calcpack.working.links.this_sheet`). None when there is no readable project file (a
    sheet on its own): the notice then names no other sheet."""
    path = Path(inputs).expanduser().resolve()
    root = next((f for f in path.parents if (f / PROJECT_FILE).is_file()), None)
    if root is None:
        return None
    try:
        sheets = project_sheets(root)
    except CalcpackError:
        return None
    if notebook is None:
        ref = this_sheet()
        current = ref.notebook.resolve() if ref is not None else None
    else:
        current = Path(notebook).expanduser().resolve()
    listed = [r for r in sheets if any((root / i).resolve() == path for i in r.inputs)]
    names = [f"sheet {r.number} ({r.path})" for r in listed]
    mine = [i for i, r in enumerate(listed) if r.notebook.resolve() == current]
    if not mine:
        return OtherSheets(path.name, (), tuple(names))
    i = mine[0]
    return OtherSheets(path.name, tuple(names[:i]), tuple(names[i + 1 :]))


class RerunControl:
    """A "Re-run the cells below" button, an "after each edit" switch and the stale notice.

    Args:
        execute: runs a JupyterLab command by id (default: through ipylab, created on first
            use); tests pass a recorder.

    Attributes:
        widget: the box shown in the panel. stale: inputs-file key -> the new value shown,
            for every edit since the working below was last run. runs: how many re-runs were
            asked for.
    """

    def __init__(
        self, execute: Callable[[str], None] | None = None, *, others: OtherSheets | None = None
    ) -> None:
        self._execute = execute
        self.others = others
        self.stale: dict[str, str] = {}
        self.runs = 0
        self.button = ipw.Button(
            description="Re-run the cells below",
            tooltip="Run this cell and every cell below it (the working then shows these values)",
            layout=ipw.Layout(width="190px"),
        )
        self.button.add_class("cp-rerun")
        self.button.on_click(lambda _b: self.rerun())
        self.auto = ipw.Checkbox(value=False, description="after each edit", indent=False)
        self.auto.add_class("cp-rerun-auto")
        self.notice = ipw.HTML()
        self.notice.add_class("cp-stale")
        self.widget = ipw.HBox(
            [self.button, self.auto, self.notice], layout=ipw.Layout(flex_flow="row wrap")
        )

    def edited(self, changes: dict[str, Any]) -> None:
        """Record a saved edit (inputs-file key -> new value); re-run at once if turned on."""
        self.stale.update({k: _text(v) for k, v in changes.items()})
        if self.auto.value:
            self.rerun()
        else:
            self._show()

    def rerun(self) -> None:
        """Ask JupyterLab to run the panel's cell and all below."""
        execute = self._execute
        if execute is None:
            front = _front_end()
            if front is None:
                self.notice.value = (
                    '<span class="cp-error">Re-run the cells below by hand (Run menu: '
                    "run selected cell and all below): JupyterLab's commands are not reachable "
                    "from this kernel (ipylab is not installed)</span>"
                )
                return
            self._execute = execute = front.commands.execute
        execute(RUN_BELOW)
        self.runs += 1
        self.stale.clear()
        self._show()

    def _show(self) -> None:
        if not self.stale:
            self.notice.value = ""
            return
        listed = ", ".join(f"{escape(k)} = {escape(v)}" for k, v in self.stale.items())
        more = self.others.notice() if self.others is not None else ""
        self.notice.value = (
            '<span style="color:#8a5a00">The working below was computed before these edits '
            f"and is stale: {listed}.{more}</span>"
        )
