"""Load takedown: the unfactored reactions of a supported member, load case by load case, become
loads on the member that supports it (a post's axial load, a beam's point load, a footing's
column load). Combinations are then formed once, at the member that uses the loads.

Sign convention: a reaction is the vertical force the support exerts *on the supported member*,
upward positive [force]. The supported member pushes down on its support with the same
magnitude, so the load carried down is positive downward (gravity), as every load in
:mod:`calcpack.loads` is, and a post's axial load is positive in compression. Equilibrium of the
support point (Newton's third law) is the whole of the method: common practice, and any statics
text.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.types import PointLoad
from calcpack.units import Quantity, require

__all__ = ["CarriedLoad", "Takedown", "reactions_by_case", "takedown"]


def _unfactored_case(result: Any, case: str) -> None:
    """Refuse a factored result or a combination: takedown carries load cases, unfactored."""
    cases = getattr(result, "cases", None)
    if cases is not None:
        if len(cases) != 1 or cases[0][1] != 1.0 or cases[0][0] != case:
            raise OutOfScopeError(
                f"Load takedown carries each load case unfactored, but the result given for "
                f"case {case!r} is {result.label!r}: solve the beam per case (solve_cases) and "
                "form combinations at the member that uses the loads"
            )
        return
    label = getattr(result, "label", None)
    if label is not None and label != case:
        raise OutOfScopeError(
            f"Load takedown carries each load case unfactored, but the result given for case "
            f"{case!r} is {label!r}: solve the truss per case (solve_truss_cases)"
        )


def _reaction(result: Any, support: str, case: str) -> Quantity:
    if isinstance(result, Quantity):
        return require(result, "[force]", f"{support} ({case})")
    if hasattr(result, "beam") and hasattr(result, "reaction"):
        _unfactored_case(result, case)
        return result.reaction(support).Fy
    if hasattr(result, "truss") and hasattr(result, "reaction_at"):
        _unfactored_case(result, case)
        return result.reaction_at(support)[1]
    if hasattr(result, "body") and hasattr(result, "reaction"):
        return require(result.reaction(support), "[force]", support)
    raise InputError(
        f"Load takedown reads reactions of a beam, truss or free body result, or forces "
        f"(got {type(result).__name__} for case {case!r})",
        name=case,
        value=result,
        expected="BeamResult, TrussResult, FreeBodyResult or a force",
    )


def reactions_by_case(results: Mapping[str, Any], support: str) -> dict[str, Quantity]:
    """The vertical reaction at ``support``, upward on the supported member, per load case.

    Args:
        results: load case name -> the unfactored result of that case alone (beam: support
            name; truss: the supported joint; free body: the reaction's name) or a force.
        support: the support, joint or reaction name.

    Raises:
        OutOfScopeError: a result is factored or a combination of cases.
        InputError: no such support, or not a result this function reads.
    """
    if not results:
        raise InputError(
            "Load takedown needs at least one load case (got no results)",
            name="results",
            value=results,
            expected="case name -> result",
        )
    return {case: _reaction(r, support, case) for case, r in results.items()}


@dataclass(frozen=True)
class CarriedLoad:
    """One load case's load on the supporting member.

    Attributes:
        case: the load case. P: the load, downward positive [force].
        parts: (source, force) for each reaction summed into it, in order.
    """

    case: str
    P: Quantity
    parts: tuple[tuple[str, Quantity], ...]


def _force_of(item: Any, where: str) -> tuple[str, Quantity]:
    q = getattr(item, "quantity", item)
    source = getattr(item, "source", None) or getattr(item, "name", None) or where
    return str(source), require(q, "[force]", where)


@dataclass(frozen=True)
class Takedown:
    """Reactions from supported members carried onto one supporting member, per load case.

    Attributes:
        onto: what receives the loads ("post P1", "beam B2 at x = 1.2 m").
        loads: one :class:`CarriedLoad` per case, in the order the cases first appear.
    """

    onto: str
    loads: tuple[CarriedLoad, ...]

    def by_case(self) -> dict[str, Quantity]:
        """Case -> load on the supporting member, downward (compression) positive [force]."""
        return {c.case: c.P for c in self.loads}

    def axial(self) -> dict[str, Quantity]:
        """A post's or footing's axial load per case, compression positive [force]."""
        return self.by_case()

    def point_loads(self, x: Quantity, *, label: str | None = None) -> tuple[PointLoad, ...]:
        """Point loads at ``x`` on a supporting beam, one per case (P downward +)."""
        require(x, "[length]", "x")
        return tuple(
            PointLoad(x=x, P=c.P, case=c.case, label=label or f"from {self.onto}")
            for c in self.loads
        )

    def working(self, *, settings: Any = None) -> Any:
        """A table of where each case's load comes from (a :class:`calcpack.working.Table`)."""
        from calcpack.working import Table

        rows: list[list[Any]] = []
        for c in self.loads:
            for i, (source, q) in enumerate(c.parts):
                rows.append([c.case if i == 0 else "", source, q, c.P if i == 0 else ""])
        return Table(
            ["Case", "Reaction from", "Reaction", "Load on member"],
            rows,
            caption=f"Load takedown onto {self.onto}: unfactored, by load case",
            settings=settings,
        )


def takedown(*reactions: Mapping[str, Any], onto: str) -> Takedown:
    """Carry reactions onto a supporting member, summing cases of the same name.

    Args:
        reactions: one mapping per supported member, load case -> its reaction upward on
            that member [force] (a quantity or a calcpack value, e.g. from
            ``Sheet.import_cases``, whose source is kept for the working).
        onto: what receives the loads, for the working.

    Returns:
        The load on the supporting member per case, downward positive: the sum of the
        reactions (equal and opposite to what the supports exert).

    Raises:
        InputError: no reactions, or a reaction that is not a force.
    """
    if not reactions or not any(reactions):
        raise InputError(
            f"Load takedown onto {onto} needs the reactions of at least one member by load "
            "case (got none)",
            name="reactions",
            value=reactions,
            expected="case -> reaction mappings",
        )
    parts: dict[str, list[tuple[str, Quantity]]] = {}
    for mapping in reactions:
        for case, item in mapping.items():
            parts.setdefault(case, []).append(_force_of(item, f"reaction ({case})"))
    loads = []
    for case, items in parts.items():
        total = items[0][1]
        for _, q in items[1:]:
            total = total + q.to(total.units)
        loads.append(CarriedLoad(case, total, tuple(items)))
    return Takedown(onto, tuple(loads))
