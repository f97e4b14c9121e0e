"""Working for combinations: the set, each combination with its clause and factors, the
factored results of each, and the envelope with the governing combinations. Imported lazily
by :meth:`CombinedResults.working`; it builds :mod:`calcpack.working` steps."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.combinations.superpose import _is_beam

if TYPE_CHECKING:
    from calcpack.combinations.superpose import CombinedResults, Envelope

__all__ = ["combinations_working", "envelope_table"]


def _disp(q: Any, settings: Any) -> Any:
    """``q`` in the sheet's unit for its kind, else the display preset's unit for its
    dimension (sheet settings or global)."""
    from calcpack.units import get_display

    unit = (settings or get_display()).unit_for(q)
    return q.to(unit) if unit is not None else q


def envelope_table(
    envelope: Envelope,
    caption: str = "Envelope over all combinations",
    settings: Any = None,
    *,
    deflections: bool = True,
) -> Any:
    """A table of the envelope: quantity, extreme value, where, governing combination
    (``deflections=False`` leaves out the deflection rows, e.g. under factored loads)."""
    from calcpack.units import get_display
    from calcpack.working import Table, format_quantity_text

    rows = []
    for e in envelope.entries:
        if not deflections and e.quantity.startswith("δ"):
            continue
        x = "" if e.x is None else f"x = {format_quantity_text(_disp(e.x, settings), 3)}"
        value = _disp(e.value, settings)
        if e.quantity.startswith("δ"):  # deflections in in or mm, not in the length unit
            us = (settings.system if settings is not None else get_display().system) == "US"
            value = e.value.to("inch" if us else "mm")
        rows.append([e.quantity, value, e.where or x, e.combination])
    return Table(
        ["Quantity", "Extreme", "Where", "Governing combination"],
        rows,
        caption=caption,
        settings=settings,
    )


def _factored_uniform_loads(cr: CombinedResults, settings: Any) -> list[list[Any]]:
    """Rows "1.2(0.530 klf) + 1.6(1.50 klf) = 2.84 klf" when every case is uniform loads over
    the whole beam; empty otherwise (other loads are shown by the beam's own working)."""
    from calcpack.loads import AreaLoad, UniformLoad
    from calcpack.working import format_quantity_text

    w_case: dict[str, Any] = {}
    for case, r in cr.case_results.items():
        beam = getattr(r, "beam", None)
        if beam is None:
            return []
        L_m = float(beam.length.to("m").magnitude)
        total = None
        for ld in beam.loads:
            if ld.case != case:
                continue
            full = (
                isinstance(ld, UniformLoad | AreaLoad)
                and ld.a_m == 0.0
                and (ld.end is None or abs(ld.b_m - L_m) <= 1e-9 * L_m)
            )
            if not full:
                return []
            total = ld.w if total is None else total + ld.w
        if total is None:
            return []
        w_case[case] = _disp(total, settings)
    rows = []
    for c in cr.combinations:
        terms = " + ".join(
            f"{f:g}({format_quantity_text(w_case[k], 3)})" for k, f in c.factors.items()
        )
        w = sum((f * w_case[k] for k, f in c.factors.items()), 0 * next(iter(w_case.values())))
        rows.append([c.name, f"{terms} = {format_quantity_text(w, 3)}"])
    return rows


# What the results of a set are called in table titles: only strength sets are "factored".
_LEVEL = {
    "strength": ("Factored", "factored"),
    "allowable stress": ("Allowable-stress", "allowable-stress level (ASD)"),
    "serviceability": ("Service", "service level"),
    "stability": ("Stability", "stability"),
    "user": ("Combined", "combined"),
}


def _figure(cr: CombinedResults, settings: Any) -> Any:
    """The beam diagrams of the combinations, as a figure step (drawn only when shown)."""
    from calcpack.working.figure import Figure

    first = next(iter(cr.results.values()))
    beam = first.beam
    kind = cr.combination_set.kind
    service = kind != "strength" and first.has_deflection
    panels = "shear, bending moment and displacement" if service else "shear and bending moment"
    over = (
        f"the {kind} combination {next(iter(cr.results))}"
        if len(cr.results) == 1
        else f"envelopes over the {len(cr.results)} {kind} combinations"
    )
    env = cr.envelope()
    parts = []
    for q in ("V_max", "V_min", "M_max", "M_min", "δ_down"):
        if q in env.quantities and (service or not q.startswith("δ")):
            g = env[q]
            parts.append(f"{q} = {_text(_disp(g.value, settings), settings)} ({g.combination})")
    supports = ", ".join(s.label for s in beam.supports)
    alt = (
        f"Diagrams of beam {beam.name}, {_text(_disp(beam.length, settings), settings)} long on "
        f"supports {supports}: loads of each case, then {panels} ({over}). "
        + "; ".join(parts)
        + "."
    )
    caption = f"{beam.name}: loads of each case (unfactored) and {panels}, {over}"
    return Figure("beam-combinations", cr, caption=caption, alt=alt, settings=settings)


def _case_loads(cr: CombinedResults, settings: Any) -> Any:
    """The loads of every case, as a table recording each as an input of the sheet."""
    from calcpack.analysis.beam.load_table import load_table

    loads: list[Any] = []
    seen: set[int] = set()
    beam = next(iter(cr.case_results.values())).beam
    for result in cr.case_results.values():
        for ld in result.beam.loads:
            if id(ld) not in seen:
                seen.add(id(ld))
                loads.append(ld)
    return load_table(loads, member=beam.name, length=beam.length, settings=settings)


def _text(q: Any, settings: Any) -> str:
    from calcpack.units import get_display
    from calcpack.working import format_quantity_text

    return format_quantity_text(q, (settings or get_display()).sig_figs)


def combinations_working(
    cr: CombinedResults, *, values: bool = True, figures: bool = True, settings: Any = None
) -> list[Any]:
    """The working steps of ``cr`` (see :meth:`CombinedResults.working`)."""
    from calcpack.working import Caution, Heading, Table, Text

    cs = cr.combination_set
    steps: list[Any] = [Heading(f"Load combinations: {cs.name}", 3)]
    syms = ", ".join(f"{k} = {v}" for k, v in cs.symbols.items() if k in cr.case_results)
    if syms:
        steps.append(Text(f"Load cases: {syms}."))
    extra = [k for k in cr.case_results if k not in cs.symbols]
    if extra:
        steps.append(Text(f"Cases standing for a symbol (groups, patterns): {', '.join(extra)}."))
    rows = [
        [c.name, c.expression, c.clause + (f" ({c.source.note})" if c.source.note else "")]
        for c in cr.combinations
    ]
    steps.append(
        Table(["Combination", "Factors", "Clause"], rows, caption=f"{cs.kind} combinations")
    )
    if values and cr.results:
        first = next(iter(cr.results.values()))
        title, level = _LEVEL.get(cs.kind, ("Combined", "combined"))
        loads_row = _factored_uniform_loads(cr, settings)
        if loads_row:
            steps.append(
                Table(
                    ["Combination", f"{title} line load"],
                    loads_row,
                    caption=f"{title} uniform line loads (each case's full-length uniform loads)",
                    settings=settings,
                )
            )
        if _is_beam(first):
            steps.append(_case_loads(cr, settings))
            cols = ["Combination", "M_max", "M_min", "V_max", "V_min"]
            sup = [r.support for r in first.reactions]
            cols += [f"R_{s}" for s in sup]
            vrows = []
            for name, r in cr.results.items():
                ex = r.extremes
                row: list[Any] = [name] + [
                    _disp(v, settings)
                    for v in (ex.M_max.value, ex.M_min.value, ex.V_max.value, ex.V_min.value)
                ]
                row += [_disp(rea.Fy, settings) for rea in r.reactions]
                vrows.append(row)
            steps.append(Table(cols, vrows, caption=f"Results of each combination, {level}"))
            if figures:
                steps.append(_figure(cr, settings))
        strength = cs.kind == "strength"
        steps.append(
            envelope_table(
                cr.envelope(),
                caption=f"Envelope over all combinations, {level}",
                settings=settings,
                deflections=not strength,
            )
        )
    if cs.standard:
        annex = "national annex or " if cs.standard.startswith("EN") else ""
        steps.append(
            Caution(
                f"Load combinations follow {cs.standard}; confirm them against the edition "
                f"(and {annex}amendments) adopted locally."
            )
        )
    return steps
