"""Demands for member checks, read from combined beam results
(:class:`calcpack.analysis.beam.BeamResult`, whose exact extremes on a range they take).

Moments and shears are taken as magnitudes (a check compares |demand| with capacity); their
signs follow the beam results (M sagging +, V left face up +).
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError
from calcpack.units import Q_, Quantity
from calcpack.validate import at_least, one_of

__all__ = ["SegmentMoments", "as_combinations", "max_abs", "segment_moments"]


def as_combinations(
    demand: Any, name: str = "demand", *, kinds: tuple[str, ...] | None = None, method: str = ""
) -> dict[str, Any]:
    """Combination name -> result, from a CombinedResults, a mapping, or one result.

    Args:
        kinds: the combination-set kinds the check accepts (e.g. strength for LRFD); a
            CombinedResults of another kind is refused, naming both.
    """
    if hasattr(demand, "results") and hasattr(demand, "combination_set"):
        kind = demand.combination_set.kind
        if kinds is not None and kind not in kinds:
            raise InputError(
                f"{method} checks need {' or '.join(kinds)} combinations, but {name} comes from "
                f"{demand.combination_set.name!r} ({kind})",
                name=name,
                value=demand.combination_set.name,
                expected=" or ".join(kinds) + " combinations",
            )
        return dict(demand.results)
    if isinstance(demand, Mapping):
        return dict(at_least(name, demand, what="combination (name -> result)"))
    if hasattr(demand, "moment") and hasattr(demand, "shear"):
        return {getattr(demand, "label", "result"): demand}
    if hasattr(demand, "truss") and hasattr(demand, "displacements"):
        return {getattr(demand, "label", None) or "result": demand}
    raise InputError(
        f"{name} must be combined results (analyse_combinations), a mapping of combination "
        f"name to beam result, or one beam result (got {type(demand).__name__})",
        name=name,
        value=demand,
        expected="CombinedResults or beam results",
    )


def max_abs(
    result: Any, what: str, a_m: float = 0.0, b_m: float | None = None
) -> tuple[Quantity, Quantity]:
    """(max |value|, position) of ``what`` ("moment" or "shear") on a <= x <= b (m), exact
    (the result's extreme finder: range ends, breakpoints on both sides, turning points)."""
    L_m = float(result.beam.length.to("m").magnitude)
    b = L_m if b_m is None else b_m
    kind = one_of("what", what, ("moment", "shear"))
    e = result.range_extremes(kind, Q_(a_m, "m"), Q_(b, "m")).magnitude
    return abs(e.value), e.x


@dataclass(frozen=True)
class SegmentMoments:
    """Moments on one unbraced segment (magnitudes): M_max, and at the quarter, centre and
    three-quarter points M_A, M_B, M_C (AISC 360 Eq. F1-1), with the segment ends."""

    start: Quantity
    end: Quantity
    M_max: Quantity
    M_A: Quantity
    M_B: Quantity
    M_C: Quantity


def segment_moments(result: Any, a_m: float, b_m: float) -> SegmentMoments:
    """The moments of ``result`` on the segment a..b (m) for C_b."""
    M_max, _ = max_abs(result, "moment", a_m, b_m)
    h = b_m - a_m

    def at(x: float) -> Quantity:
        m = result.moment(Q_(x, "m"))
        return abs(m.to("kN*m"))

    return SegmentMoments(
        Q_(a_m, "m"),
        Q_(b_m, "m"),
        M_max,
        at(a_m + 0.25 * h),
        at(a_m + 0.5 * h),
        at(a_m + 0.75 * h),
    )
