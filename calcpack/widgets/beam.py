"""The beam panel: edit a beam sheet's inputs file and watch the diagrams and checks move.

Built on the shared panel machinery (:class:`calcpack.widgets.panel.InputsPanel`): every edit
is validated (:func:`calcpack.inputs.beam_inputs`) and evaluated with
:func:`calcpack.inputs.evaluate_beam` -- the same functions the sheet's calc cells call -- and
only then shown and written to the inputs file (comments kept), so re-running the sheet, or
building the package, reproduces what the panel shows. An edit that does not validate, or a
beam that cannot be solved (a mechanism), is shown with its error at its field and not
written; the last valid display stays and the file keeps the last valid values.

Edit to display is kept short (target under 100 ms for a three-span beam, see
``tests/benchmarks/bench_widgets.py``):

* the drawings and the results are separate outputs (loading, V, M, δ, results table), and an
  output is sent to the browser only when its content changed (traitlets sends nothing for an
  unchanged value): a change of f_b re-sends the table alone, one of E the deflection too;
* the drawings are compact SVG (see :mod:`calcpack.widgets.svg`), never matplotlib;
* an unchanged section keeps its object, whose properties are already worked out;
* the inputs file is written after the display is sent (see :meth:`InputsPanel.edit`).
"""

from __future__ import annotations

import copy
import dataclasses
from html import escape
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.contract.verdict import Verdict, passes, verdict_words
from calcpack.inputs import SHAPES, SUPPORT_KINDS, BeamOutcome, beam_inputs, evaluate_beam
from calcpack.inputs.file import cached_unit
from calcpack.units import Q_, Quantity
from calcpack.widgets.fields import css_key, label
from calcpack.widgets.panel import InputsPanel
from calcpack.widgets.svg import beam_diagram_parts

__all__ = ["BeamPanel", "beam_panel", "outcome_table_html"]

DRAWINGS = ("loading", "shear", "moment", "deflection")  # as beam_diagram_parts returns them


def _fmt(q: Quantity, unit: str, sig: int = 3) -> str:
    u = cached_unit(unit)
    return f"{q.to(u).magnitude:.{sig}g} {u:~P}"


def _mag(q: Quantity, unit: str) -> float:
    return float(q.to(cached_unit(unit)).magnitude)


def _verdict(u: float) -> str:
    """The verdict in words, as the sheet writes it (a failure in capitals and bold)."""
    ok = passes(u)
    weight = "normal" if ok else "bold"
    return (
        f'<span class="cp-verdict {"cp-ok" if ok else "cp-notok"}" style="font-weight:{weight}">'
        f"{escape(verdict_words(Verdict.of(u)))}</span>"
    )


def outcome_table_html(outcome: BeamOutcome) -> str:
    """Reactions and checks as an HTML table (values carry ``data-value`` for tests)."""
    inp = outcome.inputs
    rows = []
    for r in outcome.strength.reactions:
        rows.append(
            f"<tr><td>Reaction R<sub>{escape(r.support)}</sub> ({escape(outcome.strength.label)})"
            f'</td><td class="cp-out" data-out="R_{escape(r.support)}" '
            f'data-value="{_mag(r.Fy, "kN")!r}">{_fmt(r.Fy, "kN")}</td><td></td></tr>'
        )
    u_b = outcome.bending_utilisation
    rows.append(
        f"<tr><td>Design moment |M| at x = {_fmt(outcome.x_M, 'm')}</td>"
        f'<td class="cp-out" data-out="M_design" '
        f'data-value="{_mag(outcome.M_design, "kN*m")!r}">'
        f"{_fmt(outcome.M_design, 'kN*m')}</td><td></td></tr>"
        f'<tr><td>Bending stress σ = M / S<sub>x</sub></td><td class="cp-out" data-out="sigma" '
        f'data-value="{_mag(outcome.sigma, "MPa")!r}">{_fmt(outcome.sigma, "MPa")}</td>'
        f"<td>f<sub>b</sub> = {_fmt(inp.f_b, 'MPa')}</td></tr>"
        f'<tr><td><b>Bending utilisation</b></td><td class="cp-out" data-out="bending_utilisation"'
        f' data-value="{u_b!r}">{u_b:.3f}</td><td>{_verdict(u_b)}</td></tr>'
    )
    for d in outcome.deflections:
        rows.append(
            f"<tr><td>Span {d.span}: deflection δ ({escape(outcome.service.label)})</td>"
            f'<td class="cp-out" data-out="delta_{d.span}" '
            f'data-value="{_mag(d.delta, "mm")!r}">{_fmt(d.delta, "mm")}</td>'
            f"<td>limit L/{inp.deflection_ratio:g} = {_fmt(d.limit, 'mm')}, "
            f'utilisation <span class="cp-out" data-out="deflection_utilisation_{d.span}" '
            f'data-value="{d.utilisation!r}">{d.utilisation:.3f}</span> '
            f"{_verdict(d.utilisation)}</td></tr>"
        )
    return (
        "<style>.cp-panel-results td{padding:1px 8px 1px 0}</style>"
        '<table class="cp-panel-results" style="border-collapse:collapse;font-size:13px">'
        + "".join(rows)
        + "</table>"
    )


class BeamPanel(InputsPanel):
    """An interactive editor for a beam sheet's inputs file, on the shared panel machinery
    (:class:`calcpack.widgets.panel.InputsPanel`).

    Args:
        path: the inputs file (``<sheet>.inputs.toml``), relative to the kernel's folder (the
            notebook's) or absolute.

    Attributes:
        widget: the ipywidgets box displayed in the notebook.
        outcome: the last successful evaluation, or None.
        last_update_s, edit_times: as for every panel (see :class:`InputsPanel`).
        drawings: one HTML output per drawing (loading, shear, moment, deflection).
        results: the reactions and checks table.
    """

    kind: ClassVar[str] = "Beam panel"
    css_class: ClassVar[str] = "cp-beam-panel"
    output_names: ClassVar[tuple[str, ...]] = (*DRAWINGS, "results")

    def __init__(self, path: str | Path) -> None:
        self._section: tuple[Any, Any] | None = None  # (the [section] table, its shape) shown
        super().__init__(path)

    @property
    def drawings(self) -> tuple[ipw.HTML, ...]:
        return tuple(self.outputs[name] for name in DRAWINGS)

    @property
    def results(self) -> ipw.HTML:
        return self.outputs["results"]

    def layout_outputs(self) -> list[ipw.Widget]:
        for name in DRAWINGS:
            self.outputs[name].add_class(f"cp-panel-drawing-{name}")
        self.outputs["results"].add_class("cp-panel-results-box")
        self.diagrams = ipw.VBox(self.drawings)
        self.diagrams.add_class("cp-panel-diagrams")
        return [self.diagrams, self.results]

    # -- evaluation and display -------------------------------------------------------------
    def evaluate(self, data: dict[str, Any]) -> BeamOutcome:
        validated = beam_inputs(data, path=self.path)
        if self._section is not None and self._section[0] == data.get("section"):
            # Same section as on screen: keep its object, whose properties (a polygon
            # integration costing about as much as the whole beam solve) are worked out.
            validated = dataclasses.replace(validated, section=self._section[1])
        outcome = evaluate_beam(validated)
        self._section = (copy.deepcopy(data.get("section")), validated.section)
        return outcome

    def render(self, outcome: BeamOutcome) -> dict[str, str]:
        out = dict(zip(DRAWINGS, beam_diagram_parts(outcome), strict=True))
        out["results"] = outcome_table_html(outcome)
        return out

    # -- form -------------------------------------------------------------------------------
    def form(self) -> list[ipw.Widget]:
        d = self.data
        beam, section = d["beam"], d["section"]
        parts: list[ipw.Widget] = [ipw.HTML("<b>Spans</b>")]
        for i in range(1, len(beam["spans"]) + 1):
            parts.append(self.quantity(f"beam.spans[{i}]", f"Span {i}"))
        add = ipw.Button(description="+ span", layout=ipw.Layout(width="80px"))
        drop = ipw.Button(
            description="− span", layout=ipw.Layout(width="80px"), disabled=len(beam["spans"]) < 2
        )
        add.on_click(lambda _b: self._spans(+1))
        drop.on_click(lambda _b: self._spans(-1))
        parts.append(ipw.HBox([add, drop]))
        parts.append(ipw.HTML("<b>Supports</b> (left to right)"))
        for i, kind in enumerate(beam["supports"], start=1):
            dd = ipw.Dropdown(
                options=list(SUPPORT_KINDS), value=kind, layout=ipw.Layout(width="110px")
            )
            dd.add_class(css_key(f"beam.supports[{i}]"))
            dd.observe(lambda ch, k=f"beam.supports[{i}]": self.edit({k: ch["new"]}), names="value")
            parts.append(ipw.HBox([label(f"Support line {i}"), dd]))
        parts.append(ipw.HTML("<b>Section</b>"))
        shape = ipw.Dropdown(
            options=[(f.label, k) for k, f in SHAPES.items()],
            value=section["shape"],
            layout=ipw.Layout(width="170px"),
        )
        shape.add_class(css_key("section.shape"))
        shape.observe(lambda ch: self._shape(ch["new"]), names="value")
        parts.append(ipw.HBox([label("Shape"), shape]))
        form = SHAPES[section["shape"]]
        for dim in form.dims:
            if dim in section:
                parts.append(
                    self.quantity(f"section.{dim}", f"{dim} ({form.descriptions.get(dim, '')})")
                )
        parts.append(ipw.HTML("<b>Material</b>"))
        parts.append(self.quantity("material.E", "E (modulus)"))
        parts.append(self.quantity("material.f_b", "f_b (bending strength)"))
        parts.append(ipw.HTML("<b>Loads</b> (by case)"))
        for i, ld in enumerate(d.get("loads", []), start=1):
            head = f"{i}: {ld.get('type', '?')}"
            case = ipw.Text(
                value=str(ld.get("case", "D")),
                layout=ipw.Layout(width="60px"),
                continuous_update=False,
            )
            case.add_class(css_key(f"loads[{i}].case"))
            case.observe(lambda ch, k=i: self._case(k, ch["new"]), names="value")
            remove = ipw.Button(description="remove", layout=ipw.Layout(width="70px"))
            remove.on_click(lambda _b, k=i: self._remove_load(k))
            parts.append(ipw.HBox([label(f"Load {i}, case"), case, remove]))
            if ld.get("type") == "uniform":
                parts.append(self.quantity(f"loads[{i}].w", f"{head} w"))
                if "span" in ld:
                    n_spans = len(beam["spans"])
                    dd = ipw.Dropdown(
                        options=list(range(1, n_spans + 1)),
                        value=int(ld["span"]) if 1 <= ld["span"] <= n_spans else 1,
                        layout=ipw.Layout(width="70px"),
                    )
                    key = f"loads[{i}].span"
                    dd.add_class(css_key(key))
                    dd.observe(lambda ch, k=key: self.edit({k: int(ch["new"])}), names="value")
                    parts.append(ipw.HBox([label("    on span"), dd]))
                for k in ("start", "end"):
                    if k in ld:
                        parts.append(self.quantity(f"loads[{i}].{k}", f"    {k}"))
            elif ld.get("type") == "point":
                parts.append(self.quantity(f"loads[{i}].P", f"{head} P"))
                parts.append(self.quantity(f"loads[{i}].x", "    at x"))
        add_case = ipw.Text(value="L", layout=ipw.Layout(width="60px"))
        add_u = ipw.Button(description="+ uniform", layout=ipw.Layout(width="90px"))
        add_p = ipw.Button(description="+ point", layout=ipw.Layout(width="80px"))
        add_u.on_click(lambda _b: self._add_load("uniform", add_case.value))
        add_p.on_click(lambda _b: self._add_load("point", add_case.value))
        parts.append(ipw.HBox([label("New load, case"), add_case, add_u, add_p]))
        parts.append(ipw.HTML("<b>Load factors</b>"))
        for combo in ("strength", "service"):
            for case, factor in d.get("combinations", {}).get(combo, {}).items():
                box = ipw.FloatText(
                    value=float(factor), layout=ipw.Layout(width="80px"), continuous_update=False
                )
                key = f"combinations.{combo}.{case}"
                box.add_class(css_key(key))
                box.observe(lambda ch, k=key: self.edit({k: float(ch["new"])}), names="value")
                parts.append(ipw.HBox([label(f"{combo}: {case}"), box]))
        ratio = ipw.FloatText(
            value=float(d.get("limits", {}).get("deflection_ratio", 360)),
            layout=ipw.Layout(width="80px"),
            continuous_update=False,
        )
        ratio.add_class(css_key("limits.deflection_ratio"))
        ratio.observe(
            lambda ch: self.edit({"limits.deflection_ratio": float(ch["new"])}), names="value"
        )
        parts.append(ipw.HBox([label("Deflection limit L /"), ratio]))
        return parts

    # -- edits ----------------------------------------------------------------------------------
    def set(self, key: str, value: Any) -> None:
        """Edit one value as if typed in the panel (e.g. ``set("beam.spans[2]", 5 * ureg.m)``)."""
        if key == "section.shape":
            self._shape(value)
        else:
            super().set(key, value)

    def _spans(self, step: int) -> None:
        spans = list(self.data["beam"]["spans"])
        supports = list(self.data["beam"]["supports"])
        if step > 0:
            spans.append(spans[-1])
            supports.append("roller")
        elif len(spans) > 1:
            spans.pop()
            supports.pop()
        self.edit({"beam.spans": spans, "beam.supports": supports})
        self._build_form()

    def _factor_changes(self, loads: list[dict[str, Any]]) -> dict[str, Any]:
        """Key changes that make both combinations cover exactly the cases of ``loads``: a new
        case starts with factor 1.0 (shown in the panel, to be set), a case no load has any more
        is removed."""
        cases = {str(ld.get("case", "D")) for ld in loads}
        changes: dict[str, Any] = {}
        for combo in ("strength", "service"):
            old = self.data.get("combinations", {}).get(combo, {})
            for c in sorted(cases - set(old)):
                changes[f"combinations.{combo}.{c}"] = 1.0
            for c in sorted(set(old) - cases):
                changes[f"combinations.{combo}.{c}"] = None
        return changes

    def _case(self, index: int, case: str) -> None:
        loads = copy.deepcopy(self.data.get("loads", []))
        loads[index - 1]["case"] = case.strip() or "D"
        self.edit({f"loads[{index}].case": loads[index - 1]["case"], **self._factor_changes(loads)})
        self._build_form()

    def _add_load(self, kind: str, case: str) -> None:
        loads = copy.deepcopy(self.data.get("loads", []))
        total = sum((s.to("m") for s in self.data["beam"]["spans"]), Q_(0.0, "m"))
        case = case.strip() or "L"
        new: dict[str, Any]
        if kind == "uniform":
            new = {"case": case, "type": "uniform", "w": Q_(1.0, "kN/m")}
        else:
            new = {"case": case, "type": "point", "P": Q_(1.0, "kN"), "x": (total / 2).to("m")}
        loads.append(new)
        self.edit({f"loads[{len(loads)}]": new, **self._factor_changes(loads)})
        self._build_form()

    def _remove_load(self, index: int) -> None:
        loads = copy.deepcopy(self.data.get("loads", []))
        del loads[index - 1]
        self.edit({f"loads[{index}]": None, **self._factor_changes(loads)})
        self._build_form()

    def _shape(self, shape: str) -> None:
        from calcpack.inputs import parse_quantity

        form = SHAPES[shape]
        table: dict[str, Any] = {"shape": shape}
        for dim in form.dims:
            table[dim] = parse_quantity(form.defaults[dim], f"section.{dim}")
        self.edit({"section": table})
        self._build_form()


def beam_panel(path: str | Path) -> BeamPanel:
    """Show the beam panel for the inputs file ``path`` (nothing is shown during a build)."""
    return BeamPanel(path)
