"""Steel sizing by search over the AISC Shapes Database: the lightest W (or other I-family) beam
that passes AISC 360-16 §F2/§G2 for every combination, with deflection limits.

The beam's moments and shears are those of the analysis given (``demand``); they do not depend on
the section when the beam is prismatic on rigid supports (the analysis is then statically the
same for any EI). Deflections do: for each candidate they are the analysed ones scaled by
EI_analysis / (E·I_x,candidate), which holds for the same beams. A beam with stiffness segments
or spring supports is refused (its forces would change with the section: re-analyse per
candidate with :func:`calcpack.sizing.lightest_sections` and a trial of your own).

The self-weight in the analysis is the one you assumed; a candidate heavier than
``self_weight_assumed`` is flagged (its governing text says so) so that the chosen section can be
re-analysed with its own weight.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, replace
from typing import Any, Literal

from calcpack.checks.aisc360.beam import (
    BeamCase,
    CombinedDemand,
    check_beam_case,
    prepare_demand,
)
from calcpack.checks.aisc360.shape import E_STEEL
from calcpack.checks.base import MemberChecks
from calcpack.checks.demand import as_combinations, max_abs
from calcpack.checks.elastic import check_deflection
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sections.aisc_database import (
    SHAPE_TYPES,
    SteelShape,
    aisc_shape,
    aisc_shape_names,
)
from calcpack.sizing.search import Candidate, Order, SearchSpace, SizingResult
from calcpack.units import Quantity, require
from calcpack.validate import one_of

__all__ = [
    "DeflectionLimit",
    "aisc_beam_space",
    "aisc_candidates",
    "flag_heavier",
    "lightest_aisc_beam",
]

#: resistance factor and safety factor of AISC 360-16 §F1 used by the plastic-moment screen
PHI_B = 0.90
OMEGA_B = 1.67

IFamily = Literal["W", "M", "S", "HP"]
I_FAMILIES: tuple[str, ...] = ("W", "M", "S", "HP")


@dataclass(frozen=True)
class DeflectionLimit:
    """A deflection limit to meet: the service results (one result, a mapping or combined
    results, analysed with some EI), the span the limit refers to, the ratio (360 for span/360)
    and a label ("live", "total"). ``ref`` names the limit's source."""

    demand: Any
    span: Quantity
    limit: float = 360.0
    label: str = "live"
    ref: str = "span/limit (usual building-code limit, e.g. IBC Table 1604.3)"


def check_service_results(deflections: Sequence[DeflectionLimit], EI_ref: Quantity) -> None:
    """Refuse deflection limits whose service results are not of the beam the strength results
    come from (analysed with the same E·I): the search scales deflections by E·I alone.

    Raises:
        InputError: a span that is not a positive length, or results analysed with another EI.
    """
    for d in deflections:
        require(d.span, "[length]", "span", positive=True)
        if prismatic_stiffness(as_combinations(d.demand)) != EI_ref:
            raise InputError(
                f"The {d.label} deflection results were analysed with a different EI from the "
                "strength results; analyse both with the same beam",
                name="deflections",
                value=d.label,
                expected="results of the same beam",
            )


def scaled_deflection_checks(
    deflections: Sequence[DeflectionLimit], factor: float, member: str
) -> list[MemberChecks]:
    """The deflection checks of a candidate whose stiffness is ``1/factor`` times that of the
    analysis (deflections of a prismatic beam on rigid supports scale with 1/(E·I))."""
    out = []
    for d in deflections:
        res = as_combinations(d.demand)
        out.append(
            check_deflection(
                member=member,
                demand={name: r.scaled(factor) for name, r in res.items()},
                span=d.span,
                limit=d.limit,
                label=d.label,
                ref=d.ref,
            )
        )
    return out


def _nominal_depth(designation: str) -> int:
    body = designation.lstrip("WMSHP")
    return int(body.split("X")[0].split(".")[0])


def _depth(shape: SteelShape) -> Quantity | None:
    for name in ("d", "Ht", "OD"):
        if shape.has(name):
            return shape[name]
    return None


def aisc_candidates(
    family: str = "W", *, nominal_depth: int | Sequence[int] | None = None
) -> list[Candidate[SteelShape]]:
    """The shapes of one type of the AISC Shapes Database as search candidates, weighed by
    their tabulated weight per foot, with their depth (d, or Ht for rectangular HSS, OD for
    round HSS and pipe).

    Args:
        family: a shape type of the database: "W", "M", "S", "HP" (I-shapes, the families
            :func:`lightest_aisc_beam` accepts), or "HSS", "HSS round", "PIPE", "C", "MC",
            "L", "WT"...
        nominal_depth: for I-shapes only, keep these nominal depths (e.g. 12 or [10, 12]; the
            number after the family letters in the designation, in inches).
    """
    one_of("family", family, SHAPE_TYPES)
    wanted: set[int] | None = None
    if nominal_depth is not None:
        one_of("family (with nominal_depth)", family, I_FAMILIES)
        wanted = {nominal_depth} if isinstance(nominal_depth, int) else set(nominal_depth)
    out: list[Candidate[SteelShape]] = []
    for name in aisc_shape_names(family):
        if wanted is not None and _nominal_depth(name) not in wanted:
            continue
        s = aisc_shape(name)
        out.append(Candidate(name, s["W"], s, _depth(s)))
    if not out:
        raise InputError(
            f"No {family}-shape of nominal depth {nominal_depth} in the AISC Shapes Database",
            name="nominal_depth",
            value=nominal_depth,
            expected=f"a nominal depth of the {family} family",
        )
    return out


def prismatic_stiffness(results: Mapping[str, Any]) -> Quantity:
    """The single EI of an analysed beam (results by combination); refuses stiffness segments
    and spring supports, whose forces would change with the section."""
    first = next(iter(results.values()))
    beam = first.beam
    if any(getattr(s, "kind", "") == "spring" for s in beam.supports):
        raise OutOfScopeError(
            f"Beam {beam.name} has spring supports: its forces depend on the section, so the "
            "search cannot reuse one analysis (use lightest_sections with your own trial)"
        )
    if not isinstance(beam.EI, Quantity):
        raise OutOfScopeError(
            f"Beam {beam.name} is not prismatic (EI given by segments or not given): the search "
            "scales deflections by EI and needs one EI (use lightest_sections with your own trial)"
        )
    return beam.EI


def aisc_beam_space(
    demand: Any,
    *,
    Fy: Quantity,
    method: Literal["LRFD", "ASD"] = "LRFD",
    braces: Sequence[Quantity] | None = None,
    continuous_bracing: bool = False,
    deflections: Sequence[DeflectionLimit] = (),
    family: IFamily = "W",
    nominal_depth: int | Sequence[int] | None = None,
    E: Quantity = E_STEEL,
    member: str = "B1",
    material: str = "",
    shapes: Sequence[str] | None = None,
) -> SearchSpace[SteelShape]:
    """The search space of :func:`lightest_aisc_beam` (same arguments): the shapes of
    ``family``, the plastic-moment screen and the trial (check_aisc_beam and the deflection
    limits scaled to the shape's I_x), which checks every shape against the demand read once
    (:func:`calcpack.checks.aisc360.prepare_demand`: the same results as
    :func:`calcpack.check_aisc_beam` with ``demand=``). ``space.check(aisc_shape("W10X12"))``
    checks one shape exactly as the search does. ``material`` names the steel on the sheet
    ("ASTM A992"); ``shapes`` limits the candidates to these designations (e.g. the one on a
    sheet)."""
    one_of("method", method, ("LRFD", "ASD"))
    one_of("family", family, I_FAMILIES)
    require(Fy, "[pressure]", "Fy", positive=True)
    require(E, "[pressure]", "E", positive=True)
    combos = as_combinations(demand)
    EI_ref = prismatic_stiffness(combos)
    check_service_results(deflections, EI_ref)
    M_max = max(max_abs(r, "moment")[0] for r in combos.values())

    def screen(shape: SteelShape) -> str | None:
        Mp = (Fy * shape["Zx"]).to("kip*ft")
        cap = PHI_B * Mp if method == "LRFD" else Mp / OMEGA_B
        if cap < M_max:
            what = "φ_b·M_p" if method == "LRFD" else "M_p/Ω_b"
            return (
                f"{what} = {cap:.4g~P} < {M_max.to('kip*ft'):.4g~P} (plastic-moment bound, "
                "AISC 360-16 §F2.1)"
            )
        return None

    # the moments on every unbraced segment and the largest shear are the section's whatever
    # the section (prismatic beam on rigid supports): read them once, not once per candidate
    prepared = prepare_demand(
        CombinedDemand(demand, tuple(braces or ())),
        method=method,
        continuous_bracing=continuous_bracing,
    )

    def trial(shape: SteelShape) -> list[MemberChecks]:
        case = BeamCase(
            shape.ishape(),
            Fy,
            prepared,
            E,
            method,
            member,
            continuous_bracing,
            material,
        )
        out = [check_beam_case(case)]
        factor = float((EI_ref / (E * shape["Ix"])).to("").magnitude)
        out += scaled_deflection_checks(deflections, factor, member)
        return out

    if shapes is not None:
        picked = [aisc_shape(n) for n in shapes]
        cands = tuple(Candidate(s.designation, s["W"], s, _depth(s)) for s in picked)
    else:
        cands = tuple(aisc_candidates(family, nominal_depth=nominal_depth))
    return SearchSpace(cands, trial, screen)


def lightest_aisc_beam(
    demand: Any,
    *,
    Fy: Quantity,
    method: Literal["LRFD", "ASD"] = "LRFD",
    braces: Sequence[Quantity] | None = None,
    continuous_bracing: bool = False,
    deflections: Sequence[DeflectionLimit] = (),
    family: IFamily = "W",
    nominal_depth: int | Sequence[int] | None = None,
    max_depth: Quantity | None = None,
    self_weight_assumed: Quantity | None = None,
    E: Quantity = E_STEEL,
    member: str = "B1",
    count: int = 5,
    order: Order = "weight",
) -> SizingResult:
    """The lightest shapes of ``family`` that pass :func:`calcpack.check_aisc_beam` (AISC 360-16
    §F2 flexure with the bracing given, §G2 shear) for every combination of ``demand``, and
    every deflection limit.

    Args:
        demand: combined strength results (LRFD) or allowable-stress results (ASD) of a
            prismatic beam on rigid supports.
        Fy: specified minimum yield stress. method: "LRFD" or "ASD".
        braces, continuous_bracing: the compression-flange bracing, as for check_aisc_beam.
        deflections: limits to meet (deflections scaled to each candidate's I_x).
        family, nominal_depth: the candidates (see :func:`aisc_candidates`); max_depth: the
            deepest section allowed. order: "weight" (lightest first) or "depth".
        self_weight_assumed: the self-weight per length in the analysis; heavier candidates are
            flagged for re-analysis.
        count: how many passing shapes to return.

    Returns:
        SizingResult: passing shapes (lightest first) with their governing check and
        utilisation, the next lighter shape with the check it fails, or the closest if none.

    Raises:
        OutOfScopeError: a beam with springs or stiffness segments.
        InputError: bad method, family, depth limit or units.
    """
    if self_weight_assumed is not None:
        require(self_weight_assumed, "[force] / [length]", "self_weight_assumed")
    space = aisc_beam_space(
        demand, Fy=Fy, method=method, braces=braces, continuous_bracing=continuous_bracing,
        deflections=deflections, family=family, nominal_depth=nominal_depth, E=E, member=member,
    )  # fmt: skip
    result = space.search(count=count, order=order, max_depth=max_depth)
    if self_weight_assumed is None:
        return result
    return flag_heavier(result, self_weight_assumed)


def flag_heavier(result: SizingResult, assumed: Quantity) -> SizingResult:
    """Flag the candidates heavier than the self-weight the analysis assumed (re-analyse)."""

    def flag(t: Any) -> Any:
        if t is None or t.weight <= assumed:
            return t
        note = f"; heavier than the {assumed.to('lbf/ft'):.3g~P} self-weight analysed: re-analyse"
        return replace(t, governing=t.governing + note)

    return replace(
        result,
        passing=tuple(flag(t) for t in result.passing),
        next_lighter=flag(result.next_lighter),
        closest=flag(result.closest),
        tried=tuple(flag(t) for t in result.tried),
    )
