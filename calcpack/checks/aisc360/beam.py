"""ANSI/AISC 360-16 §F2 flexure and §G2.1 shear of I-shape beams, LRFD and ASD (see the package
docstring for scope and refusals).

The check's inputs are a :class:`BeamCase`: the section, the steel, the method and the demand
-- either :class:`CombinedDemand` (combined beam results with the brace positions; every
combination and unbraced segment is checked, C_b from the moment diagram),
:class:`PreparedDemand` (the same, read from the results once by :func:`prepare_demand` for
checking many sections against one beam, as a section search does) or :class:`DirectDemand`
(required strengths given, with L_b and C_b). The clauses are in
:mod:`calcpack.checks.aisc360.beam_clauses`.
"""

from __future__ import annotations

import itertools
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.aisc360.beam_clauses import BeamClauses, FlexureItem, cb_formula
from calcpack.checks.aisc360.member_data import Method, check_method
from calcpack.checks.aisc360.shape import _TITLE, AISC360_EDITION, E_STEEL, IShape
from calcpack.checks.base import MemberChecks, Standard, run_checks
from calcpack.checks.demand import as_combinations, max_abs, segment_moments
from calcpack.checks.scope import material_in_scope
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import instance, one_of, required, within

__all__ = [
    "BeamCase",
    "CombinedDemand",
    "DirectDemand",
    "OutOfScope",
    "PreparedDemand",
    "cb_formula",
    "check_aisc_beam",
    "check_beam_case",
    "prepare_demand",
]

OutOfScope = Literal["refuse", "not covered"]


@dataclass(frozen=True)
class DirectDemand:
    """Required strengths given directly (LRFD: M_u, V_u; ASD: M_a, V_a).

    Attributes:
        Mu: required flexural strength [force·length] (None: no flexure check).
        Vu: required shear strength [force] (None: no shear check).
        Lb: unbraced length [length], needed with Mu unless the flange is braced continuously.
        Cb: LTB modification factor, 1.0 to 3.0 (1.0 is conservative).
        length: the member length [length], to check L_b against.
        combination: the label of the combination the demands come from.
    """

    Mu: Quantity | None = None
    Vu: Quantity | None = None
    Lb: Quantity | None = None
    Cb: float | None = None
    length: Quantity | None = None
    combination: str | None = None


@dataclass(frozen=True)
class CombinedDemand:
    """Combined beam results (see :func:`calcpack.combinations.analyse_combinations`).

    Attributes:
        results: combined results, a mapping combination -> beam result, or one result.
        braces: positions of lateral bracing of the compression flange between the ends (the
            ends are taken as braced) [length].
    """

    results: Any
    braces: tuple[Quantity, ...] = ()


@dataclass(frozen=True)
class PreparedDemand:
    """The demand of combined results read once: what :func:`check_beam_case` reads from a
    :class:`CombinedDemand` for any section (every combination's moments on every unbraced
    segment with C_b, and the largest |V|), kept to check many sections against one beam.
    Made by :func:`prepare_demand`; a check with it gives the same results as with the
    :class:`CombinedDemand` it came from.

    Attributes:
        flexure: one item per (combination, unbraced segment), M in kip·ft, L_b in ft.
        shear: (largest |V| [force], its combination).
        method: the method the combinations were accepted for ("LRFD": strength, "ASD":
            allowable stress). continuous_bracing: whether the segments are the whole length.
    """

    flexure: tuple[FlexureItem, ...]
    shear: tuple[Quantity, str | None]
    method: Method
    continuous_bracing: bool


def prepare_demand(
    demand: CombinedDemand, *, method: Method = "LRFD", continuous_bracing: bool = False
) -> PreparedDemand:
    """Read the flexure and shear demands of ``demand`` once (see :class:`PreparedDemand`).

    Raises:
        InputError: bad method, combinations of the wrong kind for the method, a brace off
            the member.
    """
    m = check_method(method)
    flexure, shear = _combined_items(demand, m, continuous_bracing)
    return PreparedDemand(tuple(flexure), shear, method, continuous_bracing)


@dataclass(frozen=True)
class BeamCase:
    """The inputs of the AISC 360-16 §F2/§G2.1 beam check.

    Attributes:
        section: the :class:`IShape`. Fy: specified minimum yield stress. E: modulus of
            elasticity (29 000 ksi, §B2). method: "LRFD" or "ASD".
        demand: :class:`CombinedDemand`, :class:`PreparedDemand` or :class:`DirectDemand`.
        member: member mark. material: e.g. "ASTM A992" (shown with F_y).
        continuous_bracing: the compression flange is braced along its whole length.
        on_out_of_scope: "refuse" (raise) or "not covered" (a NOT COVERED result).
    """

    section: IShape
    Fy: Quantity
    demand: CombinedDemand | PreparedDemand | DirectDemand
    E: Quantity = E_STEEL
    method: Method = "LRFD"
    member: str = "B1"
    continuous_bracing: bool = False
    material: str = ""
    on_out_of_scope: OutOfScope = "refuse"


def check_aisc_beam(
    section: IShape,
    *,
    Fy: Quantity,
    E: Quantity = E_STEEL,
    method: Method = "LRFD",
    member: str = "B1",
    demand: Any = None,
    braces: Sequence[Quantity] | None = None,
    continuous_bracing: bool = False,
    Mu: Quantity | None = None,
    Vu: Quantity | None = None,
    Lb: Quantity | None = None,
    Cb: float | None = None,
    length: Quantity | None = None,
    combination: str | None = None,
    material: str = "",
    on_out_of_scope: OutOfScope = "refuse",
) -> MemberChecks:
    """Check an I-shape beam to AISC 360-16 §F2 (flexure) and §G2.1 (shear).

    The keyword form of :func:`check_beam_case`: ``demand=`` (with ``braces``) makes a
    :class:`CombinedDemand`; ``Mu``, ``Vu``, ``Lb``, ``Cb``, ``length``, ``combination`` make a
    :class:`DirectDemand`.

    Raises:
        OutOfScopeError: a noncompact or slender flange or web (names the limit), h/t_w > 260.
        InputError: bad method, unbraced length longer than the member, missing demand, Lb
            given with combined results.
    """
    chosen: CombinedDemand | DirectDemand
    if demand is not None:
        if Lb is not None:
            raise InputError(
                "Give either braces= (with combined results) or Lb= (with Mu, Vu), not Lb with "
                "results: the unbraced segments come from the brace positions",
                name="Lb",
                value=Lb,
                expected="braces=[...] positions",
            )
        chosen = CombinedDemand(demand, tuple(braces or ()))
    else:
        chosen = DirectDemand(Mu, Vu, Lb, Cb, length, combination)
    case = BeamCase(
        section, Fy, chosen, E, method, member, continuous_bracing, material, on_out_of_scope
    )
    return check_beam_case(case)


def check_beam_case(case: BeamCase) -> MemberChecks:
    """Check a :class:`BeamCase` to AISC 360-16 §F2 and §G2.1 (see :func:`check_aisc_beam`)."""
    method = check_method(case.method)
    material_in_scope("AISC 360-16|steel|Fy", "Fy", case.Fy)
    material_in_scope("AISC 360-16|steel|E", "E", case.E)
    one_of("on_out_of_scope", case.on_out_of_scope, ("refuse", "not covered"))
    demand = case.demand
    flexure: list[FlexureItem]
    shear: tuple[Quantity, str | None] | None
    if isinstance(demand, CombinedDemand):
        flexure, shear = _combined_items(demand, method, case.continuous_bracing)
    elif isinstance(demand, PreparedDemand):
        _prepared_matches(case, demand)
        flexure, shear = list(demand.flexure), demand.shear
    else:
        flexure, shear = _direct_items(case, demand)
    clauses = BeamClauses(
        case.section,
        case.Fy,
        case.E,
        method,
        case.material,
        flexure,
        shear,
        given_cb=isinstance(demand, DirectDemand) and not case.continuous_bracing,
        on_out_of_scope=case.on_out_of_scope,
        from_analysis=not isinstance(demand, DirectDemand),
    )
    title = f"{case.section.name} beam to {AISC360_EDITION} §F2 and §G2 ({method})"
    return run_checks(case.member, title, Standard(AISC360_EDITION, _TITLE, method), clauses)


def _segments(
    L_m: float, braces: Sequence[Quantity], continuous: bool
) -> list[tuple[float, float]]:
    if continuous:
        return [(0.0, L_m)]
    pts = [0.0, L_m]
    for i, b in enumerate(braces):
        x = si(require(b, "[length]", f"braces[{i}]"))
        if not 0.0 <= x <= L_m * (1 + 1e-12):
            raise InputError(
                f"Brace point braces[{i}] must lie on the member, 0 to {L_m:.6g} m (got {b:~P})",
                name=f"braces[{i}]",
                value=b,
                expected=f"0 <= x <= {L_m:.6g} m",
            )
        pts.append(x)
    pts = sorted(set(pts))
    return [(a, c) for a, c in itertools.pairwise(pts) if c - a > 1e-9 * L_m]


def _prepared_matches(case: BeamCase, demand: PreparedDemand) -> None:
    """Refuse a prepared demand read for another method or bracing than the case's."""
    for name, got, want in (
        ("method", case.method, demand.method),
        ("continuous_bracing", case.continuous_bracing, demand.continuous_bracing),
    ):
        if got != want:
            raise InputError(
                f"The prepared demand was read with {name} = {want!r} but the check has "
                f"{name} = {got!r}; prepare it with the check's {name}",
                name=name,
                value=got,
                expected=repr(want),
            )


def _combined_items(
    demand: CombinedDemand, method: str, continuous_bracing: bool
) -> tuple[list[FlexureItem], tuple[Quantity, str | None]]:
    """Every (combination, unbraced segment) for flexure; the largest |V| for shear."""
    kinds = ("strength", "user") if method == "LRFD" else ("allowable stress", "user")
    combos = as_combinations(demand.results, kinds=kinds, method=f"{AISC360_EDITION} {method}")
    L_m = si(next(iter(combos.values())).beam.length)
    segments = _segments(L_m, demand.braces, continuous_bracing)
    items: list[FlexureItem] = []
    for name, r in combos.items():
        for a, b in segments:
            if continuous_bracing:
                Mmax, _ = max_abs(r, "moment")
                items.append(
                    FlexureItem(name, "continuously braced", Mmax.to("kip*ft"), Q_(0.0, "ft"), 1.0)
                )
                continue
            sm = segment_moments(r, a, b)
            den = 2.5 * sm.M_max + 3 * sm.M_A + 4 * sm.M_B + 3 * sm.M_C
            Cb = (
                1.0
                if den.magnitude == 0
                else float(cb_formula(sm.M_max, sm.M_A, sm.M_B, sm.M_C).to("").magnitude)
            )
            where = f"segment x = {sm.start.to('ft'):~.4g} to {sm.end.to('ft'):~.4g}"
            items.append(
                FlexureItem(
                    name, where, sm.M_max.to("kip*ft"), (sm.end - sm.start).to("ft"), Cb, sm
                )
            )
    best: tuple[Quantity, str | None] | None = None
    for name, r in combos.items():
        v, _ = max_abs(r, "shear")
        if best is None or v > best[0]:
            best = (v, name)
    assert best is not None
    return items, best


def _direct_items(
    case: BeamCase, demand: DirectDemand
) -> tuple[list[FlexureItem], tuple[Quantity, str | None] | None]:
    """The one flexure item and the shear demand given directly, validated."""
    Mu, Vu, Lb, Cb, length = demand.Mu, demand.Vu, demand.Lb, demand.Cb, demand.length
    if Mu is None and Vu is None:
        raise InputError(
            "No demand given: pass demand= (combined results) or Mu= and/or Vu=",
            name="demand",
            value=None,
            expected="combined results or Mu/Vu quantities",
        )
    items: list[FlexureItem] = []
    if Mu is not None:
        require(Mu, "[force]*[length]", "Mu")
        if not case.continuous_bracing:
            required("Lb", Lb, expected="a length, or continuous_bracing=True", when="with Mu")
        if Lb is not None:
            require(Lb, "[length]", "Lb", nonnegative=True)
            if length is not None:
                require(length, "[length]", "length", positive=True)
                if si(Lb) > si(length) * (1 + 1e-12):
                    raise InputError(
                        name="Lb",
                        value=Lb,
                        rule="must not exceed the member length",
                        expected=f"Lb <= {length:~P}",
                        note=f"length = {length:~P}",
                    )
        if not case.continuous_bracing:
            required(
                "Cb",
                Cb,
                expected="a number from 1.0 to 3.0 (demand= computes it from the moment "
                "diagram; Cb = 1.0 is conservative)",
                when="with Mu",
            )
        if Cb is not None:
            instance("Cb", Cb, (int, float), expected="a number from 1.0 to 3.0")
            within("Cb", Cb, 1.0, 3.0, rule="AISC 360-16 §F1: 1.0 <= C_b <= 3.0")
        Lb_used = Q_(0.0, "ft") if case.continuous_bracing or Lb is None else Lb
        items.append(
            FlexureItem(demand.combination, "", Mu.to("kip*ft"), Lb_used, 1.0 if Cb is None else Cb)
        )
    shear = None
    if Vu is not None:
        shear = (require(Vu, "[force]", "Vu"), demand.combination)
    return items, shear
