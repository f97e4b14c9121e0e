"""Timber sizing by search: the lightest sawn size of a species and grade (or of several
grades: :func:`nds_graded_beam_space`) that passes NDS 2018 bending, shear and deflection for
every combination.

Sizes are dimension lumber by name ("2x8", "4x10", with the dressed sizes of
:meth:`calcpack.checks.SawnMember.dimension`); the reference design values come from NDS
Supplement 2018 Table 4A through :func:`calcpack.nds_sawn_values`, and the size factor C_F from
the check itself. As for steel, the analysis must be of a prismatic beam on rigid supports (forces
independent of the section); deflections are scaled to each size's E·I.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import Any

from calcpack.checks.base import MemberChecks
from calcpack.checks.demand import as_combinations
from calcpack.checks.nds.beam import check_nds_beam, prepare_timber_demand
from calcpack.checks.nds.factors import ReferenceDesignValues, SawnMember, ServiceConditions
from calcpack.checks.nds.values import nds_sawn_values
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sizing.search import Candidate, Order, SearchSpace, SizingResult
from calcpack.sizing.steel import (
    DeflectionLimit,
    check_service_results,
    prismatic_stiffness,
    scaled_deflection_checks,
)
from calcpack.units import Q_, Quantity, require

__all__ = [
    "DIMENSION_SIZES",
    "GradedSize",
    "lightest_nds_beam",
    "nds_beam_space",
    "nds_graded_beam_space",
    "sawn_candidates",
    "split_graded_name",
]

#: the dimension-lumber sizes offered by default (nominal thickness 2 to 4 in, width 4 to 12 in)
DIMENSION_SIZES: tuple[str, ...] = tuple(f"{t}x{w}" for t in (2, 3, 4) for w in (4, 6, 8, 10, 12))

#: a density for self-weight ranking only (about that of the common softwoods at 19 % moisture
#: content; common practice, from memory); ranking by weight equals ranking by area.
DEFAULT_DENSITY = Q_(35.0, "lbf/ft**3")


def sawn_candidates(
    sizes: Sequence[str] = DIMENSION_SIZES, *, density: Quantity = DEFAULT_DENSITY
) -> list[Candidate[SawnMember]]:
    """Sawn sizes as search candidates, weighed by b·d·density (weight per length)."""
    require(density, "[force] / [length]**3", "density", positive=True)
    out = []
    for name in sizes:
        m = SawnMember.dimension(name)
        out.append(Candidate(m.name, (m.b * m.d * density).to("lbf/ft"), m, m.d))
    return out


def nds_beam_space(
    demand: Any,
    *,
    species: str,
    grade: str,
    sizes: Sequence[str] = DIMENSION_SIZES,
    conditions: ServiceConditions | None = None,
    durations: Mapping[str, str] | None = None,
    deflections: Sequence[DeflectionLimit] = (),
    plies: int = 1,
    member: str = "J1",
) -> SearchSpace[SawnMember]:
    """The search space of :func:`lightest_nds_beam` (same arguments): the sawn sizes and the
    trial (check_nds_beam on each ply's share, deflection limits scaled by E'·I of the plies).
    ``space.check(SawnMember.dimension("2x10"))`` checks one size exactly as the search does."""
    if isinstance(plies, bool) or not isinstance(plies, int) or plies < 1:
        raise InputError(
            f"Input plies must be a whole number of members, 1 or more (got plies = {plies!r})",
            name="plies",
            value=plies,
            expected="an integer >= 1",
        )
    cond = conditions or ServiceConditions()
    if cond.temperature is not None and cond.temperature > Q_(100, "degF"):
        raise OutOfScopeError(
            f"Sustained temperature {cond.temperature:~P} above 100 °F: the search's E' uses "
            "C_t = 1.0 (NDS 2018 Table 2.3.3); check such a member with check_nds_beam directly"
        )
    values = nds_sawn_values(species, grade)
    # E' = E·C_M·C_i for deflection (C_t = 1.0 up to 100 °F): C_M = 0.90 for E when wet (NDS
    # Supplement 2018 Table 4A adjustment factors), C_i = 0.95 for E when incised (NDS 2018
    # Table 4.3.8); from memory.
    E_adj = values.E * (0.90 if cond.wet else 1.0) * (0.95 if cond.incised else 1.0)
    ref = ReferenceDesignValues(
        values.name, grade, values.source, Fb=values.Fb, Fv=values.Fv, E=values.E,
        Emin=values.Emin,
    )  # fmt: skip
    combos = as_combinations(demand)
    EI_ref = prismatic_stiffness(combos)
    share = {name: r.scaled(1.0 / plies) for name, r in combos.items()} if plies > 1 else demand
    check_service_results(deflections, EI_ref)

    # the combinations' C_D, |M| and |V| do not depend on the size: read them once
    prepared = prepare_timber_demand(share, durations)

    def trial(size: SawnMember) -> list[MemberChecks]:
        out = [
            check_nds_beam(
                size, ref, demand=prepared, conditions=cond, durations=durations, member=member
            )
        ]
        I_size = size.b * size.d**3 / 12 * plies
        factor = float((EI_ref / (E_adj * I_size)).to("").magnitude)
        out += scaled_deflection_checks(deflections, factor, member)
        return out

    return SearchSpace(tuple(sawn_candidates(sizes)), trial)


@dataclass(frozen=True)
class GradedSize:
    """A sawn size in one grade: what a search across grades tries. Its candidate name is
    ``"<size> <grade>"`` ("2x10 No.2"; see :func:`split_graded_name`)."""

    size: SawnMember
    grade: str

    @property
    def name(self) -> str:
        """The candidate's name, size then grade."""
        return f"{self.size.name} {self.grade}"


def split_graded_name(name: str) -> tuple[str, str | None]:
    """(size, grade) of a candidate name of a search across grades ("2x10 No.1 & Btr" ->
    ("2x10", "No.1 & Btr")); (name, None) for a size alone."""
    size, _, grade = name.strip().partition(" ")
    return size, (grade.strip() or None)


def nds_graded_beam_space(
    demand: Any,
    *,
    species: str,
    grades: Sequence[str],
    sizes: Sequence[str] = DIMENSION_SIZES,
    conditions: ServiceConditions | None = None,
    durations: Mapping[str, str] | None = None,
    deflections: Sequence[DeflectionLimit] = (),
    plies: int = 1,
    member: str = "J1",
) -> SearchSpace[GradedSize]:
    """The search space of every (size, grade) pair: each size in each of ``grades`` of
    ``species`` (NDS Supplement 2018 Table 4A; :func:`calcpack.checks.nds.values.nds_sawn_grades`
    lists them), each checked by the trial of :func:`nds_beam_space` for its grade. Sizes of
    equal weight rank in the order of ``grades`` (list the grade you would rather use first,
    usually the commoner, lower one). Other arguments as for :func:`nds_beam_space`.

    Raises:
        InputError: no grade, a grade twice, or a grade the species does not have (naming it).
    """
    if isinstance(grades, str) or not grades:
        raise InputError(
            f"Input grades must be a list of one or more grades (got grades = {grades!r})",
            name="grades",
            value=grades,
            expected='a list such as ["No.2", "No.1"]',
        )
    seen = [g for i, g in enumerate(grades) if g in grades[:i]]
    if seen:
        raise InputError(
            f"Input grades lists {seen[0]!r} twice (got grades = {list(grades)!r})",
            name="grades",
            value=list(grades),
            expected="each grade once",
        )
    kw: dict[str, Any] = {
        "species": species, "sizes": sizes, "conditions": conditions, "durations": durations,
        "deflections": deflections, "plies": plies, "member": member,
    }  # fmt: skip
    spaces = {g: nds_beam_space(demand, grade=g, **kw) for g in grades}
    cands = tuple(
        Candidate(f"{c.name} {g}", c.weight, GradedSize(c.item, g), c.depth, preference=i)
        for i, g in enumerate(grades)
        for c in spaces[g].candidates
    )

    def trial(item: GradedSize) -> list[MemberChecks]:
        return spaces[item.grade].check(item.size)

    return SearchSpace(cands, trial)


def lightest_nds_beam(
    demand: Any,
    *,
    species: str,
    grade: str | Sequence[str],
    sizes: Sequence[str] = DIMENSION_SIZES,
    conditions: ServiceConditions | None = None,
    durations: Mapping[str, str] | None = None,
    deflections: Sequence[DeflectionLimit] = (),
    plies: int = 1,
    max_depth: Quantity | None = None,
    member: str = "J1",
    count: int = 5,
    order: Order = "weight",
) -> SizingResult:
    """The lightest sawn sizes of ``species``/``grade`` passing :func:`calcpack.check_nds_beam`
    (NDS 2018 ASD bending with C_D, C_F, C_L..., and shear) for every allowable-stress
    combination of ``demand``, and every deflection limit (scaled by E·I of each size).

    Args:
        demand: ASD combined results of a prismatic beam on rigid supports.
        species, grade: as in NDS Supplement 2018 Table 4A (e.g. "Douglas Fir-Larch", "No.2");
            a list of grades searches every size in each (:func:`nds_graded_beam_space`; the
            names are then "2x10 No.2").
        sizes: nominal sizes to try. plies: members side by side sharing the load equally (the
            demand is divided by ``plies``; 1 for a single member).
        conditions, durations: as for check_nds_beam. max_depth, count, order: as for
            :func:`calcpack.sizing.lightest_sections`.
    """
    kw: dict[str, Any] = {
        "species": species, "sizes": sizes, "conditions": conditions, "durations": durations,
        "deflections": deflections, "plies": plies, "member": member,
    }  # fmt: skip
    if isinstance(grade, str):
        return nds_beam_space(demand, grade=grade, **kw).search(
            count=count, order=order, max_depth=max_depth
        )
    graded = nds_graded_beam_space(demand, grades=grade, **kw)
    return graded.search(count=count, order=order, max_depth=max_depth)
