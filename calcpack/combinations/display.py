"""Working for combinations: the set, each combination with its clause and factors, the
factored results of each, and the envelope with the governing combinations. Imported lazily
by :meth:`CombinedResults.working`; it builds :mod:`calcpack.working` steps."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.combinations.superpose import _is_beam

if TYPE_CHECKING:
    from calcpack.combinations.superpose import CombinedResults, Envelope

__all__ = ["combinations_working", "envelope_table"]


def envelope_table(envelope: Envelope, caption: str = "Envelope over all combinations") -> Any:
    """A table of the envelope: quantity, extreme value, where, governing combination."""
    from calcpack.working import Table

    rows = []
    for e in envelope.entries:
        where = e.where or (f"x = {e.x:~.4g}" if e.x is not None else "")
        rows.append([e.quantity, e.value, where, e.combination])
    return Table(["Quantity", "Extreme", "Where", "Governing combination"], rows, caption=caption)


def combinations_working(cr: CombinedResults, *, values: bool = True) -> list[Any]:
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
        if _is_beam(first):
            cols = ["Combination", "M_max", "M_min", "V_max", "V_min"]
            sup = [r.support for r in first.reactions]
            cols += [f"R_{s}" for s in sup]
            vrows = []
            for name, r in cr.results.items():
                ex = r.extremes
                row: list[Any] = [
                    name,
                    ex.M_max.value,
                    ex.M_min.value,
                    ex.V_max.value,
                    ex.V_min.value,
                ]
                row += [rea.Fy for rea in r.reactions]
                vrows.append(row)
            steps.append(Table(cols, vrows, caption="Factored results of each combination"))
        steps.append(envelope_table(cr.envelope()))
    if cs.standard:
        steps.append(
            Caution(
                f"Load combinations follow {cs.standard}; confirm them against the edition "
                "(and national annex or amendments) adopted locally."
            )
        )
    return steps
