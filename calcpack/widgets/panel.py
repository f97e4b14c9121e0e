"""The panel machinery every catalogue panel is built on: one edit loop, one form vocabulary.

A panel edits one sheet's inputs file. Each edit is applied to a copy of the file's values,
evaluated by the sheet's own computation (the same function its calc cells call), and only when
that succeeds is it displayed and written to the file (comments kept). A refused edit is shown at
its field with the message, the last valid display stays, and the file is untouched. After a
saved edit the re-run control offers to bring the working below up to date.

A panel subclass declares three things:

* :meth:`InputsPanel.form` -- the fields, from :meth:`quantity`, :meth:`number`,
  :meth:`choice` and :meth:`text` (each bound to a dotted inputs-file key);
* :meth:`InputsPanel.evaluate` -- validate and compute from the values (raises a
  :class:`calcpack.errors.CalcpackError` naming the key on bad input);
* :meth:`InputsPanel.render` -- the outputs (HTML or SVG strings) by name.
"""

from __future__ import annotations

import copy
import time
from collections import deque
from collections.abc import Sequence
from html import escape
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.checks.base import MemberChecks
from calcpack.errors import CalcpackError
from calcpack.inputs import load_inputs, update_inputs
from calcpack.inputs.file import get_path, split_key
from calcpack.inputs.sized import governing_check
from calcpack.units import Quantity
from calcpack.widgets.fields import (
    PANEL_CSS,
    MarkedField,
    PanelDisplay,
    QuantityField,
    css_key,
    field_for_error,
    label,
    wait_for_output_sent,
)
from calcpack.widgets.rerun import RerunControl, sheets_reading

__all__ = [
    "InputsPanel",
    "checks_outputs",
    "checks_table_html",
    "governing",
    "set_key",
    "utilisation_bars_svg",
]


def set_key(data: dict[str, Any], key: str, value: Any) -> None:
    """Set dotted ``key`` (1-based list indices) in ``data``; None removes it; one past the end
    of a list appends."""
    node: Any = data
    parts = split_key(key)
    for p in parts[:-1]:
        node = node[p]
    last = parts[-1]
    if value is None:
        if isinstance(node, list) and isinstance(last, int):
            del node[last]
        else:
            node.pop(last, None)
    elif isinstance(node, list) and last == len(node):
        node.append(value)
    else:
        node[last] = value


BAR_W = 420
ROW_H = 22


def utilisation_bars_svg(rows: list[tuple[str, float, str]]) -> str:
    """Horizontal bars, one per check: (label, utilisation, verdict), the 1.00 line drawn.

    The bar's length is the utilisation (to 1.5, longer bars end in an arrow); the verdict is
    written in words beside the number, so the drawing reads the same in black and white.
    """
    left, right = 150, 110
    span = BAR_W - left - right
    h = ROW_H * len(rows) + 24
    x1 = left + span / 1.5
    parts = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagram cp-bars" width="{BAR_W}" '
        f'height="{h}" viewBox="0 0 {BAR_W} {h}" font-family="DejaVu Sans, sans-serif" '
        'font-size="11">',
        f'<line x1="{x1:.1f}" y1="4" x2="{x1:.1f}" y2="{h - 14}" stroke="#222" '
        'stroke-dasharray="3 2"/>',
        f'<text x="{x1:.1f}" y="{h - 3}" text-anchor="middle">1.00</text>',
    ]
    for i, (name, u, verdict) in enumerate(rows):
        y = 6 + i * ROW_H
        w = span * min(u, 1.5) / 1.5
        fill = "#9aa7b5" if u <= 1.0 else "#3b3b3b"
        parts.append(
            f'<text x="{left - 6}" y="{y + 12}" text-anchor="end">{escape(name)}</text>'
            f'<rect class="cp-bar" data-u="{u!r}" x="{left}" y="{y}" width="{w:.1f}" height="14" '
            f'fill="{fill}"/>'
            f'<text x="{left + span + 6}" y="{y + 12}">{u:.2f} {escape(verdict)}</text>'
        )
    parts.append("</svg>")
    return "".join(parts)


def checks_table_html(checks: Sequence[MemberChecks]) -> str:
    """Every check of ``checks`` as a table (utilisations carry ``data-value``), headed by the
    governing one."""
    rows = []
    for mc in checks:
        for r in mc.results:
            shown = "—" if r.utilisation is None else f"{r.utilisation:.3f}"
            rows.append(
                f"<tr><td>{escape(r.combination or '')}</td><td>{escape(r.name)}</td>"
                f'<td class="cp-out" data-out="{escape(r.name)}|{escape(r.combination or "")}" '
                f'data-value="{r.utilisation!r}">{shown}</td><td>{escape(r.verdict)}</td>'
                f"<td>{escape(r.clause)}</td></tr>"
            )
    u, name, clause, combo = governing(checks)
    head = (
        f'<p class="cp-governing" data-value="{u!r}">Governing: {escape(name)}, {u:.3f} '
        f"({escape(clause)}; {escape(combo)})</p>"
    )
    return (
        head + '<table class="cp-panel-results" style="border-collapse:collapse;font-size:12px">'
        "<tr><th>Combination</th><th>Check</th><th>Utilisation</th><th>Verdict</th>"
        "<th>Clause</th></tr>" + "".join(rows) + "</table>"
    )


def governing(checks: Sequence[MemberChecks]) -> tuple[float, str, str, str]:
    """(utilisation, check, clause, combination) of the largest utilisation of ``checks``."""
    return governing_check(checks)


def checks_outputs(checks: Sequence[MemberChecks]) -> dict[str, str]:
    """The "bars" (largest utilisation of each check) and "results" (every check) outputs."""
    worst: dict[str, tuple[float, str]] = {}
    for mc in checks:
        for r in mc.results:
            if r.utilisation is not None and r.utilisation > worst.get(r.name, (-1.0, ""))[0]:
                worst[r.name] = (float(r.utilisation), r.verdict)
    bars = [(name, u, v) for name, (u, v) in worst.items()]
    return {"bars": utilisation_bars_svg(bars), "results": checks_table_html(checks)}


class _Field(MarkedField):
    """A non-quantity field (number, text, choice) with the same error marking."""

    def __init__(self, key: str, box: Any, text: str) -> None:
        self.key = key
        self.box = box
        self.error = ""
        self.message = ipw.HTML(layout=ipw.Layout(margin="0 0 0 6px"))
        self.message.add_class("cp-field-message")
        box.add_class("cp-field")
        box.add_class(css_key(key))
        self.widget = ipw.HBox(
            [label(text), box, self.message], layout=ipw.Layout(flex_flow="row wrap")
        )


class InputsPanel(PanelDisplay):
    """Base of the catalogue panels (see the module docstring).

    Args:
        path: the inputs file, relative to the notebook's folder or absolute.
        tables: edit only these top-level tables of the file (one several sheets share);
            None: the whole file.

    Attributes:
        widget: the ipywidgets box. data: the file's values as last saved. outcome: the last
        successful evaluation (None if the file's values do not evaluate). outputs: one HTML
        widget per rendered output. fields: key -> field. status: the status line. rerun: the
        re-run control. last_update_s: seconds of the last edit's evaluate and render.
    """

    kind: ClassVar[str] = "Panel"
    css_class: ClassVar[str] = "cp-inputs-panel"
    output_names: ClassVar[tuple[str, ...]] = ("results",)
    hint: ClassVar[str] = "the sheet's cells below read that file."

    def __init__(self, path: str | Path, *, tables: Sequence[str] | None = None) -> None:
        self.path = Path(path)
        self.tables = tuple(tables) if tables is not None else None
        self.data = load_inputs(self.path, tables=self.tables)
        self.outcome: Any = None
        self.last_update_s = 0.0
        self.edit_times: deque[tuple[float, float, float]] = deque(maxlen=100)
        self.fields: dict[str, Any] = {}
        self.status = ipw.HTML(layout=ipw.Layout(min_height="20px"))
        self.status.add_class("cp-panel-status")
        self.outputs = {name: ipw.HTML() for name in self.output_names}
        for name, w in self.outputs.items():
            w.add_class(f"cp-panel-output-{name}")
        self.form_box = ipw.VBox()
        self.rerun = RerunControl(others=sheets_reading(self.path))
        reload = ipw.Button(description="Reload file", tooltip=f"Read {self.path.name} again")
        reload.on_click(lambda _b: self.reload())
        title = ipw.HTML(
            PANEL_CSS
            + f"<b>{escape(self.kind)}</b> — edits <code>{escape(self.path.name)}</code>; "
            + escape(self.hint)
        )
        side = ipw.VBox(self.layout_outputs())
        side.add_class("cp-panel-side")
        side.add_class("cp-panel-diagrams-box")
        body = ipw.HBox([self.form_box, side])
        body.add_class("cp-panel-body")
        self.widget = ipw.VBox(
            [ipw.HBox([title, reload]), self.rerun.widget, body, *self.extra(), self.status]
        )
        self.widget.add_class(self.css_class)
        self.widget.add_class("cp-inputs-panel")
        self._build_form()
        self._refresh()

    # -- what a panel declares --------------------------------------------------------------
    def form(self) -> list[ipw.Widget]:
        """The form's widgets, top to bottom."""
        raise NotImplementedError

    def evaluate(self, data: dict[str, Any]) -> Any:
        """Validate and compute from ``data`` (the inputs file's values)."""
        raise NotImplementedError

    def render(self, outcome: Any) -> dict[str, str]:
        """The outputs' HTML by name (names of :attr:`output_names`)."""
        raise NotImplementedError

    def layout_outputs(self) -> list[ipw.Widget]:
        """The outputs' column beside the form: the outputs in order by default (a panel may
        group them, e.g. the beam panel's drawings in one box)."""
        return list(self.outputs.values())

    def extra(self) -> Sequence[ipw.Widget]:
        """Widgets shown under the form and outputs (e.g. a search), none by default."""
        return ()

    # -- form vocabulary ---------------------------------------------------------------------
    def quantity(self, key: str, text: str) -> ipw.Widget:
        value: Quantity = get_path(self.data, key)
        f = QuantityField(key, text, value, self._edit_one)
        self.fields[key] = f
        return f.widget

    def number(self, key: str, text: str) -> ipw.Widget:
        box = ipw.FloatText(
            value=float(get_path(self.data, key)),
            layout=ipw.Layout(width="110px"),
            continuous_update=False,
        )
        box.observe(lambda ch: self.edit({key: float(ch["new"])}), names="value")
        f = _Field(key, box, text)
        self.fields[key] = f
        return f.widget

    def choice(self, key: str, text: str, options: Sequence[str]) -> ipw.Widget:
        box = ipw.Dropdown(
            options=list(options), value=get_path(self.data, key), layout=ipw.Layout(width="170px")
        )
        box.observe(lambda ch: self.edit({key: ch["new"]}), names="value")
        f = _Field(key, box, text)
        self.fields[key] = f
        return f.widget

    def text(self, key: str, text: str, *, width: str = "170px") -> ipw.Widget:
        box = ipw.Text(
            value=str(get_path(self.data, key)),
            layout=ipw.Layout(width=width),
            continuous_update=False,
        )
        box.observe(lambda ch: self.edit({key: str(ch["new"]).strip()}), names="value")
        f = _Field(key, box, text)
        self.fields[key] = f
        return f.widget

    # -- the edit loop -----------------------------------------------------------------------
    def _edit_one(self, key: str, value: Any) -> None:
        self.edit({key: value})

    def set(self, key: str, value: Any) -> None:
        """Edit one value as if typed in the panel."""
        f = self.fields.get(key)
        if isinstance(f, QuantityField) and isinstance(value, Quantity):
            f.box.value = float(value.to(f.unit).magnitude)
        elif isinstance(f, _Field) and f.box.value != value:
            f.box.value = value
        else:
            self.edit({key: value})

    def edit(self, changes: dict[str, Any]) -> bool:
        """Apply ``changes`` (key -> value); True if evaluated, shown and written.

        The inputs file is written *after* the kernel's output thread has sent the new display
        (:func:`calcpack.widgets.fields.wait_for_output_sent`), so the browser redraws while the
        file is written. The write still happens inside the edit: the kernel reports idle, and
        runs any other cell (the sheet's calc cells, a build), only once the file holds the
        values on screen. The status line says "Saved" after the write.
        """
        started = time.time()
        t0 = time.perf_counter()
        candidate = copy.deepcopy(self.data)
        try:
            for k, v in changes.items():
                set_key(candidate, k, v)
            outcome = self.evaluate(candidate)
        except CalcpackError as exc:
            self._error(f"Not saved: {exc}")
            key = field_for_error(exc, self.fields, changes)
            if key is not None:
                self.fields[key].show_error(str(exc))
            return False
        except (KeyError, IndexError, TypeError) as exc:
            self._error(f"Not saved: no value {exc} in {self.path.name}")
            return False
        for f in self.fields.values():
            if f.error:
                f.clear_error()
        self._show(outcome)
        self.last_update_s = time.perf_counter() - t0
        wait_for_output_sent()  # the display is on its way: let it go, then write the file
        try:
            self.data = update_inputs(self.path, changes, tables=self.tables)
        except CalcpackError as exc:  # e.g. the file was edited by hand into an invalid state
            self._error(f"Not saved: {exc}; the display shows unsaved values, press 'Reload file'")
            return False
        self.edit_times.append((started, self.last_update_s, time.perf_counter() - t0))
        self._saved()
        self.rerun.edited(changes)
        return True

    def reload(self) -> None:
        """Read the inputs file again (after editing it by hand) and redraw."""
        self.data = load_inputs(self.path, tables=self.tables)
        self._build_form()
        self._refresh()

    # -- output ------------------------------------------------------------------------------
    def _build_form(self) -> None:
        self.fields = {}
        self.form_box.children = self.form()

    def _show(self, outcome: Any) -> None:
        self.outcome = outcome
        for name, html in self.render(outcome).items():
            self.outputs[name].value = html  # an unchanged string sends nothing

    def _refresh(self) -> None:
        try:
            outcome = self.evaluate(self.data)
        except CalcpackError as exc:
            self.outcome = None
            for w in self.outputs.values():
                w.value = ""
            self._error(str(exc))
            key = field_for_error(exc, self.fields, ())
            if key is not None:  # a file edited by hand into an invalid state: mark its field
                self.fields[key].show_error(str(exc))
            return
        self._show(outcome)
        self.status.value = ""

    def _error(self, message: str) -> None:
        self.status.value = f'<span class="cp-error">{escape(message)}</span>'

    def _saved(self) -> None:
        self.status.value = (
            f'<span style="color:#555">Saved to {escape(self.path.name)} at '
            f"{time.strftime('%H:%M:%S')}</span>"
        )
