"""Small ipywidgets building blocks shared by the panels: a quantity field that keeps the unit
the inputs file uses, and the interactive-session test."""

from __future__ import annotations

import os
import threading
from collections.abc import Callable, Iterable, Mapping
from html import escape
from pathlib import Path
from typing import Any

import ipywidgets as ipw

from calcpack.units import Q_, Quantity

__all__ = [
    "PANEL_CSS",
    "MarkedField",
    "QuantityField",
    "field_for_error",
    "interactive_session",
    "label",
    "wait_for_output_sent",
]

LABEL_WIDTH = "150px"

#: Style shared by every panel: a field in error is outlined and its message shown in red
#: beside it; drawings scale down to the width of the notebook area (never clipped) and the
#: drawings column wraps under the form when the area is narrow.
PANEL_CSS = (
    "<style>"
    ".cp-invalid input{outline:2px solid #a31515;outline-offset:-1px;background:#fff4f4}"
    ".cp-error{color:#a31515;font-size:12px}"
    ".cp-panel-diagrams svg,.cp-panel-diagrams-box svg{max-width:100%;height:auto}"
    ".cp-panel-body{flex-flow:row wrap;align-items:flex-start}"
    ".cp-panel-side{flex:1 1 320px;min-width:0;overflow:hidden}"
    "</style>"
)


def interactive_session() -> bool:
    """True when the kernel serves a person at a notebook front end.

    A notebook server sets JPY_SESSION_NAME for the kernels it starts; a build (nbclient) does
    not, and then panels display nothing, so the issued package holds only the calc cells'
    output. CALCPACK_PANELS=1 forces panels on (other front ends), CALCPACK_BUILDING=1 off.
    """
    if os.environ.get("CALCPACK_BUILDING") == "1":
        return False
    return bool(os.environ.get("JPY_SESSION_NAME")) or os.environ.get("CALCPACK_PANELS") == "1"


class PanelDisplay:
    """What every input panel shares: shown only in an interactive session, named by its file.

    Subclasses set ``path`` (the inputs file) and ``widget`` (the ipywidgets box).
    """

    path: Path
    widget: Any

    def _ipython_display_(self) -> None:
        if interactive_session():
            from IPython.display import display

            display(self.widget)

    def __repr__(self) -> str:
        return f"{type(self).__name__}({str(self.path)!r})"


def wait_for_output_sent(timeout_s: float = 0.25) -> bool:
    """Wait until the kernel's output thread has sent every message queued so far.

    Widget updates leave the kernel through ipykernel's output (IOPub) thread. Work started
    right after an update (writing the inputs file) holds the interpreter lock and would delay
    that thread -- and the display in the browser -- by as long as the work takes, so the panels
    wait here first: a marker is queued behind the updates and its turn means they are sent.
    Returns True once sent, False outside a kernel (nothing to wait for) or on time-out.
    """
    try:
        from ipykernel.kernelbase import Kernel
    except ImportError:
        return False
    if not Kernel.initialized():
        return False
    thread = getattr(Kernel.instance(), "iopub_thread", None)
    if thread is None or not hasattr(thread, "schedule"):
        return False
    sent = threading.Event()
    thread.schedule(sent.set)  # runs after the messages queued before it
    return sent.wait(timeout_s)


def label(text: str, width: str = LABEL_WIDTH) -> ipw.Label:
    return ipw.Label(text, layout=ipw.Layout(width=width))


class MarkedField:
    """What every panel field shares: its key, its input box and the error shown beside it."""

    key: str
    box: Any
    message: Any
    error: str

    def show_error(self, message: str) -> None:
        """Mark the field invalid and show ``message`` beside it (the value stays as typed)."""
        self.error = message
        self.box.add_class("cp-invalid")
        self.message.value = f'<span class="cp-error">{escape(message)}</span>'

    def clear_error(self) -> None:
        self.error = ""
        self.box.remove_class("cp-invalid")
        self.message.value = ""


class QuantityField(MarkedField):
    """A number box for one quantity in the inputs file, shown in the unit the file uses.

    Args:
        key: the dotted key in the inputs file (``"beam.spans[2]"``), also set as the box's
            ``data-key`` style class ``cp-key-...`` so tests and users can find it.
        text: the label. value: the current quantity. on_change: called with (key, quantity).
    """

    def __init__(
        self,
        key: str,
        text: str,
        value: Quantity,
        on_change: Callable[[str, Quantity], None],
        *,
        width: str = LABEL_WIDTH,
    ) -> None:
        self.key = key
        self.unit = value.units
        self.box = ipw.FloatText(
            value=float(value.magnitude),
            layout=ipw.Layout(width="110px"),
            continuous_update=False,
        )
        self.box.add_class("cp-field")
        self.box.add_class(css_key(key))
        self.error = ""  # the message shown at the field, "" while its value is valid
        self.message = ipw.HTML(layout=ipw.Layout(margin="0 0 0 6px"))
        self.message.add_class("cp-field-message")
        self.widget = ipw.HBox(
            [label(text, width), self.box, ipw.Label(f"{value.units:~P}"), self.message],
            layout=ipw.Layout(margin="0 0 2px 0", flex_flow="row wrap"),
        )
        self._on_change = on_change
        self.box.observe(self._changed, names="value")

    @property
    def quantity(self) -> Quantity:
        return Q_(float(self.box.value), self.unit)

    def _changed(self, change: dict[str, Any]) -> None:
        self._on_change(self.key, Q_(float(change["new"]), self.unit))


def field_for_error(
    exc: Exception, fields: Mapping[str, Any], changed: Iterable[str]
) -> str | None:
    """The key of the field an error belongs to: the input the error names (an inputs-file key
    such as ``beam.spans[2]``), else the one field just edited, else None."""
    name = getattr(exc, "name", None)
    if isinstance(name, str):
        for key in fields:
            if name == key or name.startswith(key + ".") or name.startswith(key + "["):
                return key
    edited = [k for k in changed if k in fields]
    return edited[0] if len(edited) == 1 else None


def css_key(key: str) -> str:
    """A CSS class naming an inputs-file key: ``beam.spans[2]`` -> ``cp-key-beam-spans-2``."""
    out = "".join(ch if ch.isalnum() else "-" for ch in key).strip("-")
    while "--" in out:
        out = out.replace("--", "-")
    return f"cp-key-{out}"
