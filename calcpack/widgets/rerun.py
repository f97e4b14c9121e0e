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
below was computed, with their new values.
"""

from __future__ import annotations

from collections.abc import Callable
from html import escape
from typing import Any

import ipywidgets as ipw

__all__ = ["RUN_BELOW", "RerunControl"]

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

    def __init__(self, execute: Callable[[str], None] | None = None) -> None:
        self._execute = execute
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
        self.notice.value = (
            '<span style="color:#8a5a00">The working below was computed before these edits '
            f"and is stale: {listed}</span>"
        )
