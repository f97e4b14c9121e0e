"""Superposition of per-case results and envelopes naming the governing combination.

Each load case is analysed once; a combination's result is Σ factor × case result (linear
analysis), summed by :func:`calcpack.analysis.superposition.superpose` (re-exported here).
Results may be anything that can be scaled and added: beam results
(:class:`calcpack.analysis.beam.BeamResult`, which offers ``scaled`` and ``+``), truss results
(member forces, tension +, and reactions), quantities, or mappings of named quantities
(``{"N_AB": -12 kN, ...}``).

The envelope of beam results gives the largest and smallest moment and shear (with their
position), each support reaction's extremes and the largest deflection, each with the
combination that governs it. Sign conventions are those of the results (beam: M sagging +,
V left face up +, reactions up +, deflection down +).
"""

from __future__ import annotations

from collections.abc import Callable, Iterator, Mapping
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from calcpack.analysis.superposition import superpose
from calcpack.combinations.model import AppliedCombination, CombinationSet
from calcpack.errors import InputError
from calcpack.units import Quantity, is_quantity
from calcpack.validate import at_least, find, instance, one_of

__all__ = [
    "CombinedResults",
    "Envelope",
    "Governing",
    "analyse_combinations",
    "superpose",
]


@dataclass(frozen=True)
class Governing:
    """One extreme of the envelope and the combination that governs it.

    Attributes:
        quantity: what it is (``"M_max"``, ``"R_A,max"``, ``"δ_max"``, or a result key).
        value: the extreme value. combination: the governing combination's name.
        x: where along the member (None for reactions and scalar results). where: words.
    """

    quantity: str
    value: Quantity
    combination: str
    x: Quantity | None = None
    where: str = ""


def _is_beam(r: Any) -> bool:
    return hasattr(r, "extremes") and hasattr(r, "reactions") and hasattr(r, "moment")


def _beam_candidates(r: Any) -> list[tuple[str, Quantity, Quantity | None, str, int]]:
    """(quantity, value, x, where, sign): sign +1 keeps the largest, -1 the smallest."""
    ex = r.extremes
    out: list[tuple[str, Quantity, Quantity | None, str, int]] = [
        ("M_max", ex.M_max.value, ex.M_max.x, "", 1),
        ("M_min", ex.M_min.value, ex.M_min.x, "", -1),
        ("V_max", ex.V_max.value, ex.V_max.x, "", 1),
        ("V_min", ex.V_min.value, ex.V_min.x, "", -1),
    ]
    for rea in r.reactions:
        where = f"support {rea.support}"
        out.append((f"R_{rea.support},max", rea.Fy, rea.x, where, 1))
        out.append((f"R_{rea.support},min", rea.Fy, rea.x, where, -1))
        if rea.kind == "fixed":
            out.append((f"C_{rea.support},max", rea.C, rea.x, where, 1))
            out.append((f"C_{rea.support},min", rea.C, rea.x, where, -1))
    if r.has_deflection:
        if ex.deflection_down is not None:
            out.append(("δ_down", ex.deflection_down.value, ex.deflection_down.x, "", 1))
        if ex.deflection_up is not None:
            out.append(("δ_up", ex.deflection_up.value, ex.deflection_up.x, "", 1))
    return out


def _is_truss(r: Any) -> bool:
    return hasattr(r, "truss") and isinstance(getattr(r, "forces", None), Mapping)


def _truss_candidates(r: Any) -> list[tuple[str, Quantity, Quantity | None, str, int]]:
    """Member forces (tension +) and reactions of a truss result, largest and smallest."""
    out: list[tuple[str, Quantity, Quantity | None, str, int]] = []
    for name, N in r.forces.items():
        out.append((f"N_{name},max", N, None, f"member {name}", 1))
        out.append((f"N_{name},min", N, None, f"member {name}", -1))
    for name, rea in r.reactions.items():
        v = rea.value
        out.append((f"R_{name},max", v, None, f"reaction {name}", 1))
        out.append((f"R_{name},min", v, None, f"reaction {name}", -1))
    return out


def _scalar_candidates(r: Any) -> list[tuple[str, Quantity, Quantity | None, str, int]]:
    if isinstance(r, Mapping):
        out: list[tuple[str, Quantity, Quantity | None, str, int]] = []
        for k, v in r.items():
            out.append((f"{k},max", v, None, "", 1))
            out.append((f"{k},min", v, None, "", -1))
        return out
    return [("max", r, None, "", 1), ("min", r, None, "", -1)]


@dataclass(frozen=True)
class Envelope:
    """Extremes over all combinations, each naming its governing combination.

    Attributes:
        entries: one :class:`Governing` per quantity, in a stable order.
        results: combination name -> combined result (for :meth:`curve`).
    """

    entries: tuple[Governing, ...]
    results: Mapping[str, Any] = field(repr=False)

    def __getitem__(self, quantity: str) -> Governing:
        by_quantity = {e.quantity: e for e in self.entries}
        return find("quantity", quantity, by_quantity, what="quantity", where="in the envelope")

    def table(self, caption: str = "Envelope over all combinations", settings: Any = None) -> Any:
        """The envelope as a working table (quantity, extreme, where, governing combination)."""
        from calcpack.combinations.display import envelope_table

        return envelope_table(self, caption, settings)

    @property
    def quantities(self) -> tuple[str, ...]:
        return tuple(e.quantity for e in self.entries)

    def curve(self, what: str, x: Quantity) -> tuple[Quantity, Quantity, list[str], list[str]]:
        """The envelope of ``what`` ("moment", "shear" or "deflection") at positions ``x``.

        Returns:
            (upper, lower, governing combination of upper at each x, ... of lower).
        """
        fns: dict[str, Callable[[Any], Callable[[Quantity], Quantity]]] = {
            "moment": lambda r: r.moment,
            "shear": lambda r: r.shear,
            "deflection": lambda r: r.deflection,
        }
        one_of("what", what, tuple(fns))
        names = list(self.results)
        vals = [fns[what](self.results[n])(x) for n in names]
        unit = vals[0].units
        arr = np.array([np.atleast_1d(v.to(unit).magnitude) for v in vals])
        imax = np.argmax(arr, axis=0)
        imin = np.argmin(arr, axis=0)
        upper = arr[imax, np.arange(arr.shape[1])]
        lower = arr[imin, np.arange(arr.shape[1])]
        return (
            upper * unit,
            lower * unit,
            [names[i] for i in imax],
            [names[i] for i in imin],
        )


def _envelope(results: Mapping[str, Any]) -> Envelope:
    best: dict[str, Governing] = {}
    signs: dict[str, int] = {}
    for name, r in results.items():
        if _is_beam(r):
            cands = _beam_candidates(r)
        elif _is_truss(r):
            cands = _truss_candidates(r)
        else:
            cands = _scalar_candidates(r)
        for quantity, value, x, where, sign in cands:
            if not is_quantity(value):
                raise InputError(
                    f"Result {quantity!r} of combination {name!r} is not a quantity (got "
                    f"{value!r})",
                    name=quantity,
                    value=value,
                    expected="a pint Quantity",
                )
            cur = best.get(quantity)
            if cur is None or sign * float((value - cur.value).to(cur.value.units).magnitude) > 0:
                best[quantity] = Governing(quantity, value, name, x, where)
                signs[quantity] = sign
    return Envelope(tuple(best.values()), dict(results))


@dataclass(frozen=True)
class CombinedResults:
    """The results of every combination of a set, by superposition of the case results.

    Attributes:
        combination_set: the set applied. combinations: the combinations acting on the job.
        case_results: load case -> result of that case alone.
        results: combination name -> combined result.
    """

    combination_set: CombinationSet
    combinations: tuple[AppliedCombination, ...]
    case_results: Mapping[str, Any] = field(repr=False)
    results: Mapping[str, Any] = field(repr=False)

    def __getitem__(self, name: str) -> Any:
        where = f"in {self.combination_set.name!r}"
        return find("combination", name, self.results, what="combination", where=where)

    def __iter__(self) -> Iterator[str]:
        return iter(self.results)

    def __len__(self) -> int:
        return len(self.results)

    def combination(self, name: str) -> AppliedCombination:
        for c in self.combinations:
            if c.name == name:
                return c
        self[name]  # raises with the list of names
        raise AssertionError  # pragma: no cover

    def envelope(self) -> Envelope:
        """Extremes over all combinations with the governing combination of each."""
        return _envelope(self.results)

    def working(
        self, *, values: bool = True, figures: bool = True, settings: Any = None
    ) -> list[Any]:
        """The combinations used (clause, factors) and, if ``values``, the extremes of each
        combination and their envelope, as working steps for a sheet (``settings``: the
        sheet's display settings, for the units shown). A beam's loads, shear, moment and
        (for service and allowable-stress sets) displacement diagrams come with the values
        unless ``figures=False``."""
        from calcpack.combinations.display import combinations_working

        return combinations_working(self, values=values, figures=figures, settings=settings)

    def add_to(self, sheet: Any, *, values: bool = True, figures: bool = True) -> CombinedResults:
        """Add the combinations working (and a beam's diagrams, unless ``figures=False``) to
        ``sheet`` step by step."""
        settings = getattr(sheet, "settings", None)
        _add_steps(self.working(values=values, figures=figures, settings=settings), sheet)
        return self


def _add_steps(steps: list[Any], sheet: Any) -> None:
    for step in steps:
        sheet.add(step)


def analyse_combinations(
    case_results: Mapping[str, Any],
    combination_set: CombinationSet,
    *,
    groups: Mapping[str, Any] | None = None,
) -> CombinedResults:
    """Combine per-case results by every combination of ``combination_set`` that acts.

    Args:
        case_results: load-case name -> the result of that case alone (e.g.
            ``solve_cases(beam)``).
        combination_set: the set to apply (built-in, EN 1990 builder, or user-defined).
        groups: symbol -> job cases it stands for (see :meth:`CombinationSet.apply`); pattern
            live loading passes its per-span cases here.

    Raises:
        InputError: no results; a case used by no combination; unknown cases in a strict set.
    """
    instance(
        "combination_set",
        combination_set,
        CombinationSet,
        expected="a CombinationSet (get_combination_set(name) gives a built-in set)",
    )
    at_least("case_results", case_results, what="load case's result")
    applied = combination_set.apply(case_results.keys(), groups=groups)
    results = {c.name: superpose(case_results, c.factors) for c in applied}
    return CombinedResults(combination_set, applied, dict(case_results), results)
