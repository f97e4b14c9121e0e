"""Steel beams to BS EN 1993-1-1 from combined beam results: the envelope of moment and shear
over the combinations, and lateral-torsional buckling of each segment between restraints with
M_cr from that segment's own moment diagram (:func:`calcpack.checks.en1993.ltb.critical_moment`:
fork supports at the restraints, k = k_w = 1, loads at the stated level).

The cross-section checks take the largest |M| with the largest |V| of any combination (not
necessarily coincident: on the safe side). The segment and combination with the highest
M_Ed/M_b,Rd is shown in full.
"""

from __future__ import annotations

import itertools
from collections.abc import Sequence
from typing import Any

import numpy as np

from calcpack.checks.base import MemberChecks
from calcpack.checks.demand import as_combinations, max_abs
from calcpack.checks.en1993.data import E_STEEL, G_STEEL, LTBMethod
from calcpack.checks.en1993.inputs import DesignForces, LoadLevel, SteelMemberEC
from calcpack.checks.en1993.ltb import critical_moment
from calcpack.checks.en1993.member import check_en1993_member
from calcpack.errors import InputError
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import one_of, within

__all__ = ["check_en1993_beam", "segment_mcr"]


def _segments(L_m: float, restraints: Sequence[Quantity]) -> list[tuple[float, float]]:
    xs = [0.0]
    for i, r in enumerate(restraints):
        x = si(require(r, "[length]", f"restraints[{i}]"))
        within(
            f"restraints[{i}]",
            r,
            Q_(0.0, "m"),
            Q_(L_m, "m"),
            inclusive=False,
            rule="a restraint lies between the supports",
        )
        xs.append(x)
    xs.append(L_m)
    xs = sorted(set(xs))
    return list(itertools.pairwise(xs))


def segment_mcr(
    sec: EuroSection, result: Any, a_m: float, b_m: float, load_level: LoadLevel
) -> tuple[Quantity, Quantity]:
    """(M_cr, max |M|) of the segment a..b (m) of a beam result, loads at ``load_level``."""
    x = np.linspace(a_m, b_m, 241)
    M = np.atleast_1d(result.moment(Q_(x, "m")).to("N*m").magnitude).astype(float)
    mid = 0.5 * (x[:-1] + x[1:])
    V = np.atleast_1d(result.shear(Q_(mid, "m")).to("N").magnitude).astype(float)
    dP = V[:-1] - V[1:]  # the load between two midpoints (downward +), at the grid point
    zg = {"shear centre": 0.0, "top flange": 0.5, "bottom flange": -0.5}[load_level] * si(sec.h)
    Iw = sec.Iw if sec.Iw is not None else Q_(0.0, "m**6")
    mcr = critical_moment(
        E=si(E_STEEL),
        G=si(G_STEEL),
        Iz=si(sec.Iz),
        It=si(sec.It),
        Iw=si(Iw),
        L=b_m - a_m,
        x=x - a_m,
        M=M,
        dP=dP,
        x_dP=x[1:-1] - a_m,
        zg=zg,
    )
    # M_cr integrates over the grid; the segment's largest |M| is exact (range extremes)
    return Q_(mcr / 1e3, "kN*m"), max_abs(result, "moment", a_m, b_m)[0]


def check_en1993_beam(
    section: EuroSection,
    grade: str,
    *,
    demand: Any,
    restraints: Sequence[Quantity] = (),
    load_level: LoadLevel = "shear centre",
    continuously_restrained: bool = False,
    ltb_method: LTBMethod = "6.3.2.3",
    mark: str = "beam",
) -> MemberChecks:
    """Check a beam of ``section`` under combined results ``demand`` (ULS combinations).

    Args:
        restraints: positions of lateral-torsional restraints between the supports (the
            supports are taken as fork restraints).
        load_level: where the loads act: ``"top flange"`` (destabilising, e.g. joists bearing
            on the top flange), ``"shear centre"`` or ``"bottom flange"``.
        continuously_restrained: the compression flange is restrained throughout (no LTB).
    """
    one_of("load_level", load_level, ("shear centre", "top flange", "bottom flange"))
    combos = as_combinations(demand, kinds=("strength", "user"), method="EN 1993-1-1")
    L_m = si(next(iter(combos.values())).beam.length)
    segs = _segments(L_m, restraints)
    M_env, M_name = Q_(0.0, "kN*m"), ""
    V_env, V_name = Q_(0.0, "kN"), ""
    for name, r in combos.items():
        M, _ = max_abs(r, "moment")
        V, _ = max_abs(r, "shear")
        if M_env < M:
            M_env, M_name = M, name
        if V_env < V:
            V_env, V_name = V, name
    member = SteelMemberEC(section, grade, ltb_method=ltb_method)
    label = M_name if M_name == V_name else f"M_Ed: {M_name}; V_Ed: {V_name}"
    if continuously_restrained:
        forces = DesignForces(label, My_Ed=M_env, V_Ed=V_env, where="compression flange restrained")
        return check_en1993_member(member, forces, mark=mark)
    best: tuple[float, DesignForces] | None = None
    for name, r in combos.items():
        for a, b in segs:
            mcr, mseg = segment_mcr(section, r, a, b, load_level)
            if mseg.magnitude <= 0:
                continue
            f = DesignForces(
                label,
                My_Ed=M_env,
                V_Ed=V_env,
                L_LT=Q_(b - a, "m"),
                Mcr=mcr,
                M_LT_Ed=mseg,
                load_level=load_level,
                where=f"LTB: {name}, segment x = {a:.3g} m to {b:.3g} m",
            )
            u = check_en1993_member(member, f, mark=mark)["Lateral-torsional buckling (6.3.2)"]
            if best is None or (u.utilisation or 0.0) > best[0]:
                best = (u.utilisation or 0.0, f)
    if best is None:
        raise InputError(
            "The beam has no bending moment in any combination: nothing to check",
            name="demand",
            value=list(combos),
            expected="combinations with moments",
        )
    return check_en1993_member(member, best[1], mark=mark)
