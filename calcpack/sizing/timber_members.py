"""Timber sizing by search beyond sawn joists: glulam beams and wood posts.

* :func:`lightest_glulam_beam`: the lightest glulam width × depth of a Table 5A stress class that
  passes :func:`calcpack.checks.nds.glulam.check_nds_glulam_beam` (bending with the lesser of
  C_L and C_V, shear) for every allowable-stress combination and every deflection limit (scaled
  by E_x·I of each size, as for steel: a prismatic beam on rigid supports).
* :func:`lightest_nds_post`: the lightest sawn post (Table 4A 4x sizes or Table 4D timbers) of a
  species and grade that passes :func:`calcpack.check_nds_member` (compression with C_P, and
  bending and the interaction when moments are given) for every combination's forces.

Sizes offered by default (common practice, from memory): western-species glulam in the stock
widths 3-1/8, 5-1/8 and 6-3/4 in, depths in 1-1/2 in laminations from 6 in to 36 in; posts
4x4, 4x6, 4x8 (dimension lumber, Table 4A) or 6x6 to 10x10 (timbers, Table 4D, dressed 1/2 in
under nominal).
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import replace
from typing import Any, Literal

from calcpack.checks.base import MemberChecks
from calcpack.checks.demand import as_combinations
from calcpack.checks.nds.beam import prepare_timber_demand
from calcpack.checks.nds.factors import DURATION_FACTORS, size_factor
from calcpack.checks.nds.glulam import check_nds_glulam_beam
from calcpack.checks.nds.members import TimberForces, TimberMember, check_nds_member
from calcpack.checks.nds.values import nds_glulam_values, nds_sawn_values
from calcpack.errors import InputError
from calcpack.sizing.search import Candidate, Order, SearchSpace, SizingResult
from calcpack.sizing.steel import (
    DeflectionLimit,
    check_service_results,
    prismatic_stiffness,
    scaled_deflection_checks,
)
from calcpack.sizing.timber import DEFAULT_DENSITY
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of

__all__ = [
    "GLULAM_DEPTHS",
    "GLULAM_WIDTHS",
    "POST_SIZES_4A",
    "POST_SIZES_4D",
    "compression_size_factor",
    "glulam_beam_space",
    "lightest_glulam_beam",
    "lightest_nds_post",
    "nds_post_member",
    "nds_post_space",
    "nominal_size",
]

#: stock western-species glulam widths [in] (common practice, from memory)
GLULAM_WIDTHS: tuple[float, ...] = (3.125, 5.125, 6.75)
#: depths in 1-1/2 in laminations [in], 6 in to 36 in (common practice, from memory)
GLULAM_DEPTHS: tuple[float, ...] = tuple(1.5 * n for n in range(4, 25))
POST_SIZES_4A: tuple[str, ...] = ("4x4", "4x6", "4x8")
POST_SIZES_4D: tuple[str, ...] = ("6x6", "6x8", "8x8", "8x10", "10x10")

# NDS Supplement 2018 Table 4A size factors C_F for F_c of Select Structural, No.1 & Btr, No.1,
# No.2 and No.3 (from memory): nominal width -> C_F (2 to 4 in thick alike)
_CF_FC = {2: 1.15, 3: 1.15, 4: 1.15, 5: 1.1, 6: 1.1, 8: 1.05, 10: 1.0, 12: 1.0}
_CF_FC_WIDE = 0.9  # 14 in and wider


def compression_size_factor(grade: str, nominal_width: int) -> float:
    """C_F for F_c of visually graded dimension lumber (NDS Supplement 2018 Table 4A size
    factors, Select Structural to No.3; from memory). The grade is checked by the F_b rule."""
    size_factor(grade, 2, nominal_width)  # same grades and widths as the F_b rule, or refuse
    return _CF_FC.get(nominal_width, _CF_FC_WIDE)


def nominal_size(name: str) -> tuple[int, int]:
    """(thickness, width) in nominal inches of a size like "6x6"."""
    try:
        t_s, w_s = name.lower().replace("×", "x").split("x")
        return int(t_s), int(w_s)
    except ValueError as exc:
        raise InputError(
            f"Post size must read like '6x6' (got {name!r})",
            name="sizes",
            value=name,
            expected="'<thickness>x<width>' in inches",
        ) from exc


def glulam_beam_space(
    demand: Any,
    *,
    stress_class: str = "24F-1.8E",
    widths: Sequence[float] = GLULAM_WIDTHS,
    depths: Sequence[float] = GLULAM_DEPTHS,
    lu: Quantity | None = None,
    loading: Literal["uniform", "center point", "cantilever uniform", "any"] = "uniform",
    L_beam: Quantity | None = None,
    durations: Mapping[str, str] | None = None,
    deflections: Sequence[DeflectionLimit] = (),
    density: Quantity = DEFAULT_DENSITY,
    member: str = "GL1",
) -> SearchSpace[TimberMember]:
    """The search space of :func:`lightest_glulam_beam` (same arguments): every width × depth
    (depth ≥ width) and the trial. ``glulam_beam_space(..., widths=[5.125], depths=[12])``
    checks one size exactly as the search does."""
    require(density, "[force] / [length]**3", "density", positive=True)
    values = nds_glulam_values(stress_class)
    for nm, seq in (("widths", widths), ("depths", depths)):
        if not seq or any(not float(x) > 0 for x in seq):
            raise InputError(
                f"Glulam {nm} must be positive sizes in inches (got {nm} = {list(seq)!r})",
                name=nm,
                value=list(seq),
                expected="e.g. (3.125, 5.125, 6.75)",
            )
    combos = as_combinations(demand)
    EI_ref = prismatic_stiffness(combos)
    check_service_results(deflections, EI_ref)
    cands = []
    for b_in in widths:
        for d_in in depths:
            if d_in < b_in:
                continue
            b, d = Q_(float(b_in), "inch"), Q_(float(d_in), "inch")
            m = TimberMember(values, b, d, lu=lu, loading=loading, L_beam=L_beam)
            name = f"{b_in:g} x {d_in:g} in {stress_class}"
            cands.append(Candidate(name, (b * d * density).to("lbf/ft"), m, d))
    if not cands:
        raise InputError(
            f"No glulam size has its depth at least its width (got widths = {list(widths)!r}, "
            f"depths = {list(depths)!r})",
            name="depths",
            value=list(depths),
            expected="depths >= widths",
        )

    prepared = prepare_timber_demand(demand, durations)  # read once for every section

    def trial(m: TimberMember) -> list[MemberChecks]:
        out = [check_nds_glulam_beam(m, demand=prepared, durations=durations, mark=member)]
        factor = float((EI_ref / (values.E * m.b * m.d**3 / 12)).to("").magnitude)
        out += scaled_deflection_checks(deflections, factor, member)
        return out

    return SearchSpace(tuple(cands), trial)


def lightest_glulam_beam(
    demand: Any,
    *,
    stress_class: str = "24F-1.8E",
    widths: Sequence[float] = GLULAM_WIDTHS,
    depths: Sequence[float] = GLULAM_DEPTHS,
    lu: Quantity | None = None,
    loading: Literal["uniform", "center point", "cantilever uniform", "any"] = "uniform",
    L_beam: Quantity | None = None,
    durations: Mapping[str, str] | None = None,
    deflections: Sequence[DeflectionLimit] = (),
    max_depth: Quantity | None = None,
    density: Quantity = DEFAULT_DENSITY,
    member: str = "GL1",
    count: int = 5,
    order: Order = "weight",
) -> SizingResult:
    """The lightest glulam sections of ``stress_class`` (NDS Supplement 2018 Table 5A) passing
    :func:`check_nds_glulam_beam` for every ASD combination of ``demand`` and every deflection
    limit (deflections scaled by the apparent E_x·I of each size).

    Args:
        widths, depths: sizes to try [in]; every width × depth with depth ≥ width is a candidate.
        lu, loading: unsupported length of the compression edge and Table 3.3.3 load case for C_L
            (None: braced). L_beam: length between zero moments for C_V (None: beam length).
        durations: as for check_nds_glulam_beam. max_depth, count, order: as for
            :func:`calcpack.sizing.lightest_sections`. density: for ranking by weight only.
    """
    space = glulam_beam_space(
        demand, stress_class=stress_class, widths=widths, depths=depths, lu=lu, loading=loading,
        L_beam=L_beam, durations=durations, deflections=deflections, density=density,
        member=member,
    )  # fmt: skip
    return space.search(count=count, order=order, max_depth=max_depth)


def nds_post_member(
    values: Any, name: str, *, grade: str, table: Literal["4A", "4D"], le: Quantity,
    le_b: Quantity | None = None,
) -> TimberMember:  # fmt: skip
    """A sawn post of nominal size ``name`` ("4x6", "6x6") with its dressed sizes and size
    factors: Table 4A dimension lumber (dressed 1/2 in under nominal up to 6 in, 3/4 in above;
    C_F of Table 4A) or Table 4D timbers (dressed 1/2 in under nominal; C_F = (12/d)^(1/9) for
    F_b when d > 12 in, §4.3.6.2), buckling lengths ``le`` (and ``le_b`` across the narrow
    side, default ``le``).

    Raises:
        InputError: a size that does not read like "6x6", or not a timber with table "4D".
    """
    t, w = nominal_size(name)
    if table == "4A":
        b, d = Q_(t - 0.5, "inch"), Q_(w - (0.5 if w <= 6 else 0.75), "inch")
        CF_b, CF_c, CF_t = size_factor(grade, t, w), compression_size_factor(grade, w), 1.0
        cf_src = "NDS Supplement 2018 Table 4A size factors (from memory)"
    else:
        if t < 5:
            raise InputError(
                f"Size {name!r} is not a timber (5 in and thicker) of Table 4D",
                name="sizes",
                value=name,
                expected="e.g. '6x6', '8x8'",
            )
        b, d = Q_(t - 0.5, "inch"), Q_(w - 0.5, "inch")
        d_in = float(d.to("inch").magnitude)
        CF_b = (12 / d_in) ** (1 / 9) if d_in > 12 else 1.0
        CF_c = CF_t = 1.0
        cf_src = "NDS 2018 §4.3.6.2: C_F = (12/d)^(1/9) for F_b when d > 12 in"
    return TimberMember(values, b, d, le_d=le, le_b=le_b or le, CF_b=CF_b, CF_c=CF_c,
                        CF_t=CF_t, CF_source=cf_src)  # fmt: skip


def nds_post_space(
    forces: Sequence[TimberForces],
    *,
    species: str,
    grade: str,
    le: Quantity,
    le_b: Quantity | None = None,
    table: Literal["4A", "4D"] = "4A",
    sizes: Sequence[str] | None = None,
    durations: Mapping[str, str] | str = "ten years",
    density: Quantity = DEFAULT_DENSITY,
    member: str = "P1",
    marks: Sequence[str] | None = None,
) -> SearchSpace[TimberMember]:
    """The search space of :func:`lightest_nds_post` (same arguments): the posts and the trial
    (check_nds_member for every force set, with C_D of its duration). ``marks`` names the post
    each force set is on (default ``member`` for all), for posts of one size under different
    loads."""
    one_of("table", table, ("4A", "4D"))
    require(le, "[length]", "le", positive=True)
    if le_b is not None:
        require(le_b, "[length]", "le_b", positive=True)
    if not forces:
        raise InputError(
            "forces is empty: give one TimberForces per ASD combination",
            name="forces",
            value=list(forces),
            expected="a non-empty sequence of TimberForces",
        )
    if marks is not None and len(marks) != len(forces):
        raise InputError(
            f"marks must name one post per force set ({len(forces)}; got {len(marks)})",
            name="marks",
            value=list(marks),
            expected=f"{len(forces)} marks",
        )
    durs: dict[str, str] = {}
    for i, f in enumerate(forces):
        key = f.combination or f"forces[{i}]"
        if isinstance(durations, str):
            durs[key] = durations
        elif key in durations:
            durs[key] = durations[key]
        else:
            raise InputError(
                f"Combination {key!r} has no load duration: give durations[{key!r}] = one of "
                f"{list(DURATION_FACTORS)} (NDS 2018 Table 2.3.2)",
                name="durations",
                value=dict(durations),
                expected=f"a duration for {key!r}",
            )
        one_of(f"durations[{key!r}]", durs[key], list(DURATION_FACTORS))
    values = nds_sawn_values(species, grade, table=table)
    cands = []
    for name in sizes or (POST_SIZES_4A if table == "4A" else POST_SIZES_4D):
        m = nds_post_member(values, name, grade=grade, table=table, le=le, le_b=le_b)
        cands.append(Candidate(name, (m.b * m.d * density).to("lbf/ft"), m, m.d))
    on = list(marks) if marks is not None else [member] * len(forces)

    def trial(m: TimberMember) -> list[MemberChecks]:
        out = []
        for i, f in enumerate(forces):
            key = f.combination or f"forces[{i}]"
            out.append(check_nds_member(replace(m, duration=durs[key]), f, mark=on[i]))
        return out

    return SearchSpace(tuple(cands), trial)


def lightest_nds_post(
    forces: Sequence[TimberForces],
    *,
    species: str,
    grade: str,
    le: Quantity,
    le_b: Quantity | None = None,
    table: Literal["4A", "4D"] = "4A",
    sizes: Sequence[str] | None = None,
    durations: Mapping[str, str] | str = "ten years",
    density: Quantity = DEFAULT_DENSITY,
    member: str = "P1",
    count: int = 5,
) -> SizingResult:
    """The lightest sawn posts passing :func:`calcpack.check_nds_member` (NDS 2018 ASD: F'_c
    with C_P, §3.7; bending and §3.9 interaction where moments are given) for every force set.

    Args:
        forces: one :class:`TimberForces` per ASD combination (P positive in compression; M_d
            about the strong axis), each named by its ``combination``.
        species, grade: NDS Supplement 2018 Table 4A (e.g. "No.2") or, with ``table="4D"``,
            Table 4D timbers (e.g. "P&T No.1").
        le: effective length K_e·ℓ for buckling across both sides; ``le_b`` a shorter one across
            the narrow side where it is braced (None: ``le``).
        sizes: nominal sizes (default POST_SIZES_4A or POST_SIZES_4D by table).
        durations: the Table 2.3.2 duration of every combination, or a mapping of combination
            name -> duration (C_D of the shortest-duration load in it, §2.3.2).
    """
    space = nds_post_space(
        forces, species=species, grade=grade, le=le, le_b=le_b, table=table, sizes=sizes,
        durations=durations, density=density, member=member,
    )  # fmt: skip
    return space.search(count=count)
