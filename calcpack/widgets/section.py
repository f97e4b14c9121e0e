"""The section panel: edit the ``[section]`` table of an inputs file and see the sketch and
properties update. Edits are validated by :func:`calcpack.inputs.section_from_inputs` (the
sheet's calc cells call the same function) before they are written; an invalid edit is shown
with its error and not written.
"""

from __future__ import annotations

import copy
import time
from html import escape
from pathlib import Path
from typing import Any

import ipywidgets as ipw

from calcpack.errors import CalcpackError
from calcpack.inputs import SHAPES, load_inputs, parse_quantity, section_from_inputs, update_inputs
from calcpack.units import Quantity
from calcpack.widgets.fields import (
    PANEL_CSS,
    PanelDisplay,
    QuantityField,
    css_key,
    field_for_error,
    label,
)
from calcpack.widgets.rerun import RerunControl, sheets_reading
from calcpack.widgets.svg import section_sketch_svg

__all__ = ["SectionPanel", "properties_table_html", "section_panel"]

_ROWS = (
    ("A", "A", "mm**2", "area"),
    ("y_bar", "ȳ", "mm", "centroid height from the bottom"),
    ("Ix", "I<sub>x</sub>", "mm**4", "second moment of area, x axis"),
    ("Iy", "I<sub>y</sub>", "mm**4", "second moment of area, y axis"),
    ("Sx", "S<sub>x</sub>", "mm**3", "elastic modulus (smaller), x axis"),
    ("Sy", "S<sub>y</sub>", "mm**3", "elastic modulus (smaller), y axis"),
    ("rx", "r<sub>x</sub>", "mm", "radius of gyration, x axis"),
    ("ry", "r<sub>y</sub>", "mm", "radius of gyration, y axis"),
    ("Zx", "Z<sub>x</sub>", "mm**3", "plastic modulus, x axis"),
    ("J", "J", "mm**4", "torsion constant"),
)


def properties_table_html(props: Any) -> str:
    """The main properties as an HTML table (values carry ``data-value`` in the shown unit)."""
    from calcpack.working import format_number

    rows = []
    for attr, sym, unit, what in _ROWS:
        try:
            q: Quantity = getattr(props, attr)
        except CalcpackError as exc:
            rows.append(f"<tr><td>{sym}</td><td colspan=2>{escape(str(exc))}</td></tr>")
            continue
        mag = float(q.to(unit).magnitude)
        unit_text = f"{q.to(unit).units:~P}"
        rows.append(
            f'<tr><td>{sym}</td><td class="cp-out" data-out="{attr}" data-value="{mag!r}" '
            f'style="text-align:right;padding:0 8px">{format_number(mag, 4)}</td>'
            f"<td>{unit_text}</td>"
            f'<td style="color:#555">{what}</td></tr>'
        )
    return f'<table class="cp-panel-results">{"".join(rows)}</table>'


class SectionPanel(PanelDisplay):
    """An interactive editor for the ``[section]`` table of an inputs file.

    Args:
        path: the inputs file. key: the table's name in it (default ``"section"``).

    Attributes:
        widget: the ipywidgets box. properties: the last SectionProperties, or None.
    """

    def __init__(self, path: str | Path, *, key: str = "section") -> None:
        self.path = Path(path)
        self.key = key
        self.data = load_inputs(self.path)
        self.properties: Any = None
        self.last_update_s = 0.0
        self.fields: dict[str, QuantityField] = {}
        self.form = ipw.VBox()
        self.sketch = ipw.HTML()
        self.sketch.add_class("cp-panel-diagrams")
        self.table = ipw.HTML()
        self.status = ipw.HTML()
        self.status.add_class("cp-panel-status")
        body = ipw.HBox([self.form, self.sketch, self.table])
        body.add_class("cp-panel-body")
        self.rerun = RerunControl(others=sheets_reading(self.path))
        self.widget = ipw.VBox(
            [
                ipw.HTML(
                    PANEL_CSS + "<b>Section panel</b> — edits "
                    f"<code>{escape(self.path.name)}</code> [{escape(key)}]"
                ),
                self.rerun.widget,
                body,
                self.status,
            ]
        )
        self.widget.add_class("cp-section-panel")
        self._build_form()
        self._refresh()

    def _build_form(self) -> None:
        table = self.data[self.key]
        form = SHAPES[table["shape"]]
        shape = ipw.Dropdown(
            options=[(f.label, k) for k, f in SHAPES.items()],
            value=table["shape"],
            layout=ipw.Layout(width="170px"),
        )
        shape.add_class(css_key(f"{self.key}.shape"))
        shape.observe(lambda ch: self.set_shape(ch["new"]), names="value")
        parts: list[ipw.Widget] = [ipw.HBox([label("Shape"), shape])]
        self.fields = {}
        for dim in form.dims:
            if dim in table:
                key = f"{self.key}.{dim}"
                f = QuantityField(
                    key,
                    f"{dim} ({form.descriptions.get(dim, '')})",
                    table[dim],
                    lambda k, v: self._edit({k: v}),
                )
                self.fields[key] = f
                parts.append(f.widget)
        self.form.children = parts

    def set(self, key: str, value: Any) -> None:
        """Edit one dimension as if typed (``set("section.d", 350 * ureg.mm)``)."""
        if key == f"{self.key}.shape":
            self.set_shape(value)
        elif key in self.fields and isinstance(value, Quantity):
            self.fields[key].box.value = float(value.to(self.fields[key].unit).magnitude)
        else:
            self._edit({key: value})

    def set_shape(self, shape: str) -> None:
        """Change the shape, starting from its suggested dimensions."""
        form = SHAPES[shape]
        table: dict[str, Any] = {"shape": shape}
        for dim in form.dims:
            table[dim] = parse_quantity(form.defaults[dim], f"{self.key}.{dim}")
        self._edit({self.key: table})
        self._build_form()

    def _edit(self, changes: dict[str, Any]) -> None:
        t0 = time.perf_counter()
        candidate = copy.deepcopy(self.data)
        for k, v in changes.items():
            if k == self.key:
                candidate[self.key] = v
            else:
                candidate[self.key][k.split(".", 1)[1]] = v
        try:
            shape = section_from_inputs(candidate[self.key], key=self.key, path=self.path)
        except CalcpackError as exc:
            self.status.value = f'<span style="color:#a31515">Not saved: {escape(str(exc))}</span>'
            key = field_for_error(exc, self.fields, changes)
            if key is not None:
                self.fields[key].show_error(str(exc))
            return
        for f in self.fields.values():
            if f.error:
                f.clear_error()
        try:
            self.data = update_inputs(self.path, changes)
        except CalcpackError as exc:  # e.g. the file was edited by hand meanwhile
            self.status.value = f'<span style="color:#a31515">Not saved: {escape(str(exc))}</span>'
            return
        self._refresh(shape)
        self.last_update_s = time.perf_counter() - t0
        self.rerun.edited(changes)

    def _refresh(self, shape: Any = None) -> None:
        try:
            if shape is None:
                shape = section_from_inputs(self.data[self.key], key=self.key, path=self.path)
            self.properties = shape.properties()
        except CalcpackError as exc:
            self.properties = None
            self.status.value = f'<span style="color:#a31515">{escape(str(exc))}</span>'
            return
        self.sketch.value = section_sketch_svg(shape, self.properties)
        self.table.value = properties_table_html(self.properties)
        self.status.value = (
            f'<span style="color:#555">{escape(shape.name)} — saved to '
            f"{escape(self.path.name)} at {time.strftime('%H:%M:%S')}</span>"
        )


def section_panel(path: str | Path, *, key: str = "section") -> SectionPanel:
    """Show the section panel for the ``[key]`` table of ``path`` (nothing during a build)."""
    return SectionPanel(path, key=key)
