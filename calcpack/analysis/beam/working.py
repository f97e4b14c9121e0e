"""The beam's working for a sheet, built from calcpack.working steps only when displayed.

Reactions of a determinate beam are found as the engineer writes them: ΣFx = 0, then
equations each giving one unknown -- ΣM about a support (so the reaction there drops out), ΣFy,
and ΣM about a hinge for the part on one side of it -- with each distributed load entering
through its resultant W = ∫w dx at x̄ = ∫x·w dx / W. Moments in these equations are taken
counter-clockwise positive; applied couples and moment reactions are clockwise positive (as
everywhere in calcpack), so they enter with a minus sign.

An indeterminate beam is solved by the flexibility method (the plan of
:mod:`calcpack.analysis.beam.flexibility`): its redundants, Δ_i0 and f_ij are written out and
the compatibility conditions fix the redundants; the other reactions then follow from
equilibrium. The cut-section working is in :mod:`calcpack.analysis.beam.working_cut`.

Every value shown is recomputed from its formula by the working module, and agrees with the
numeric solution to round-off (the tests check this).
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.analysis.beam.flexibility import Key, flexibility_plan, reaction_symbol
from calcpack.analysis.beam.statics import StaticsEquation, statics_plan
from calcpack.analysis.beam.working_cut import cut_working
from calcpack.analysis.beam.working_terms import (
    LoadTerms,
    Writer,
    accumulate,
    load_terms,
    pick_settings,
)
from calcpack.units import Q_
from calcpack.working import Block, Heading, Text, Unknown

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["SIGN_CONVENTION", "beam_working", "cut_working", "extremes_steps"]

SIGN_CONVENTION = (
    "Sign convention: x from the left end; loads positive downward; reactions positive upward "
    "(forces) and clockwise (moments, as applied couples); in equilibrium equations moments "
    "are taken counter-clockwise positive. Shear V is positive when the left face of an "
    "element is pushed up (dV/dx = −w); bending moment M is positive sagging (dM/dx = V); "
    "deflection δ is positive downward."
)


def _statics(
    w: Writer,
    result: BeamResult,
    loads: LoadTerms,
    solved: dict[str, Any],
    known: dict[Key, float],
    steps: list[Any],
) -> bool:
    """Writes the statics plan: equations each giving one unknown reaction, as the engineer
    orders them. Returns False if the unknowns stay coupled (then the caller tabulates the
    solver's values)."""
    plan = statics_plan(result.beam, dict(result.cases), known)
    for eq in plan.equations:
        _emit(w, eq, load_terms(loads, result.beam, eq.region), solved, steps)
    return plan.complete


def _emit(
    w: Writer,
    eq: StaticsEquation,
    terms: list[tuple[float, Any]],
    solved: dict[str, Any],
    steps: list[Any],
) -> None:
    symbol = reaction_symbol(eq.solves)
    unit = w.u("moment") if eq.solves[1] == "C" else w.u("force")
    U = Unknown(symbol, unit=unit)
    lhs: Any = None
    rest: Any = None
    target: Any = 1
    for r in eq.reactions:  # reactions first, as written by hand
        coef: Any = w.lit(r.arm_m) if r.arm_m is not None else int(r.coefficient)
        sign = -1.0 if coef == -1 else 1.0
        if r.key == eq.solves:
            target = coef
            lhs = accumulate(lhs, sign, U if coef in (1, -1) else U * coef)
            continue
        known = solved.get(r.symbol)
        if known is None:
            continue
        piece = known if coef in (1, -1) else known * coef
        lhs = accumulate(lhs, sign, piece)
        rest = accumulate(rest, -sign, piece)
    for sign, t in terms:
        lhs = accumulate(lhs, sign, t)
        rest = accumulate(rest, -sign, t)
    if rest is None:
        rest = Q_(0.0, unit)
    steps.append(w.equation(lhs, 0, label=eq.label, description=eq.description))
    formula = rest if target == 1 else (-rest if target == -1 else rest / target)
    what = {"Fy": "vertical reaction at", "C": "moment reaction (clockwise +) at"}[eq.solves[1]]
    value = w.derived(symbol, formula, f"{what} support {eq.solves[0]}", unit=unit)
    steps.append(value)
    solved[symbol] = value


# -- flexibility method -------------------------------------------------------------------------
def _flexibility(
    w: Writer,
    result: BeamResult,
    solved: dict[str, Any],
    known: dict[Key, float],
    steps: list[Any],
) -> bool:
    plan = flexibility_plan(result)
    if plan is None:
        return False
    # the redundants in SI (the plan's are in kN and kN·m)
    known.update({k: 1e3 * x for k, x in zip(plan.redundants, plan.X, strict=True)})
    beam = result.beam
    n = len(plan.redundants)
    redundants, names = plan.redundants, plan.names
    F, D0, flex, X = plan.F, plan.D0, plan.spring_flexibility, plan.X
    steps.append(Heading("Flexibility method", level=3))
    what = ", ".join(names)
    steps.append(
        Text(
            f"The beam is statically indeterminate to degree {n} in bending. Redundants: {what}. "
            "Removing them leaves a stable, statically determinate released beam. Its "
            "deflections (exact, by integrating M/EI over the piecewise-polynomial moment) under "
            "the loads, Δ_i0, and under a unit value of each redundant, f_ij, give one "
            "compatibility condition per redundant: Δ_i0 + Σ f_ij·X_j = 0 (the support does "
            "not move; on a spring the support moves by −X_i/k_i, so X_i/k_i is added)."
        )
    )

    # (internal unit of the movement, its display unit, internal unit of the redundant,
    # its display unit); unit redundants were applied as 1 kN and 1 kN·m.
    du = {
        "Fy": ("m", w.u("deflection"), "kN", w.u("force")),
        "C": ("rad", "rad", "kN*m", w.u("moment")),
    }
    d_terms = []
    f_terms: list[list[Any]] = []
    for i, ki in enumerate(redundants):
        base_u, show_u, _, _ = du[ki[1]]
        move = "upward movement" if ki[1] == "Fy" else "clockwise rotation"
        d = w.derived(
            f"Delta_{ki[0]}0",
            Q_(D0[i], base_u).to(show_u),
            f"{move} of the released beam at {ki[0]} under the loads",
            unit=show_u,
        )
        steps.append(d)
        d_terms.append(d)
        row = []
        for j, kj in enumerate(redundants):
            unit_of_x = du[kj[1]][2]
            show = f"{show_u}/({du[kj[1]][3]})"
            val = (Q_(F[i][j], base_u) / Q_(1.0, unit_of_x)).to(show)
            fij = w.derived(
                f"f_{ki[0]}{kj[0]}",
                val,
                f"{move} at {ki[0]} due to a unit {names[j]} on the released beam",
                unit=show,
            )
            steps.append(fij)
            row.append(fij)
        f_terms.append(row)
    unknowns = [Unknown(nm, unit=du[k[1]][3]) for nm, k in zip(names, redundants, strict=True)]
    for i, ki in enumerate(redundants):
        lhs: Any = d_terms[i]
        for j in range(n):
            lhs = lhs + f_terms[i][j] * unknowns[j]
        if flex[i]:
            s = beam.support(ki[0])
            k = s.k if ki[1] == "Fy" else s.k_theta  # type: ignore[attr-defined]
            kk = w.given(f"k_{ki[0]}", k, f"spring stiffness at {ki[0]}")
            steps.append(kk)
            lhs = lhs + unknowns[i] / kk
        steps.append(
            w.equation(
                lhs,
                0,
                label=rf"\Delta_{{{ki[0]}}} = 0",
                description=f"compatibility at support {ki[0]}",
            )
        )
    for i, ki in enumerate(redundants):
        unit = du[ki[1]][3]
        if n == 1 and not flex[0]:
            value = w.derived(
                names[0], -d_terms[0] / f_terms[0][0], "redundant from compatibility", unit=unit
            )
        else:
            value = w.derived(
                names[i],
                Q_(X[i], du[ki[1]][2]),
                f"redundant, from the compatibility equations solved together ({n} equations)",
                unit=unit,
            )
        steps.append(value)
        solved[names[i]] = value
    return True


# -- public --------------------------------------------------------------------------------------
def beam_working(
    result: BeamResult, *, title: str | None = None, sheet: Any = None, system: str | None = None
) -> Any:
    """The working of ``result`` as a titled Block of steps (add it to a Sheet with ``add``).

    Args:
        title: the block's title. sheet: the Sheet it is for (its unit system and significant
            figures are used). system: "SI" or "US" when no sheet is given.
    """
    return _beam_working(Writer(pick_settings(sheet, system)), result, title)


def _beam_working(w: Writer, result: BeamResult, title: str | None) -> Any:
    beam = result.beam
    steps: list[Any] = [
        Heading(title or f"Beam {beam.name}: reactions ({result.label})", 2),
        Text(SIGN_CONVENTION),
    ]
    steps.append(
        w.table(
            columns=["support", "type", "x"],
            rows=[[s.label, s.kind, s.x] for s in beam.supports]
            + [[h.name or "", "internal hinge", h.x] for h in beam.hinges],
            caption=f"Beam {beam.name}: span L = {beam.length:~.4g}, supports and hinges",
        )
    )
    steps.append(Text(f"Classification: {result.classification.describe()}."))
    steps.append(Heading("Loads and resultants", 3))
    from calcpack.analysis.beam.load_table import load_table

    acting = {case for case, _ in result.cases}
    steps.append(
        load_table(
            [ld for ld in beam.loads if ld.case in acting],
            member=beam.name,
            length=beam.length,
            settings=w.settings,
        )
    )
    steps.append(
        Text(
            "Each distributed load acts in the equilibrium equations through its "
            "resultant W = ∫w dx, placed at x̄ = ∫x·w dx / W."
        )
    )
    loads = LoadTerms(w, result, steps)
    for dl, f, k in loads.dist:
        loads.resultant(dl, f, k, dl.a_m, dl.b_m)
    solved: dict[str, Any] = {}
    steps.append(Heading("Equilibrium", 3))
    hx = [s for s in beam.supports if s.restrains_h]
    if loads.axial:
        if len(hx) == 1:
            H = Unknown(f"H_{hx[0].label}", unit=w.u("force"))
            total: Any = H
            for _, h in loads.axial:
                total = total + h
            steps.append(w.equation(total, 0, label=r"\Sigma F_x = 0", description="+ toward +x"))
            rest: Any = 0
            for _, h in loads.axial:
                rest = rest - h
            steps.append(
                w.derived(
                    f"H_{hx[0].label}",
                    rest,
                    f"horizontal reaction at {hx[0].label}",
                    unit=w.u("force"),
                )
            )
        else:
            steps.append(
                Text(
                    f"ΣFx = 0 with {len(hx)} horizontal restraints: the axial load is shared so "
                    "the beam's length between restraints is unchanged (uniform axial stiffness "
                    "assumed): "
                    + ", ".join(
                        f"H_{r.support} = {r.Fx:~.3g}" for r in result.reactions if r.Fx.magnitude
                    )
                )
            )
    elif hx:
        steps.append(
            Text(
                "No load acts along the beam: ΣFx = 0 gives "
                + ", ".join(f"H_{s.label} = 0" for s in hx)
                + "."
            )
        )
    ok = True
    known: dict[Key, float] = {}
    if result.classification.degree_bending > 0:
        ok = _flexibility(w, result, solved, known, steps)
        if ok:
            steps.append(Heading("Remaining reactions by equilibrium", 3))
    if ok:
        ok = _statics(w, result, loads, solved, known, steps)
    if not ok:
        steps.append(
            Text(
                "The reactions are coupled; they are solved together with the "
                "compatibility conditions by the exact solver (see the table)."
            )
        )
    steps.append(_reaction_table(w, result))
    steps += extremes_steps(w, result)
    return Block(steps=steps[1:], title=title or f"Beam {beam.name}: reactions ({result.label})")


def _reaction_table(w: Writer, result: BeamResult) -> Any:
    rows = []
    for r in result.reactions:
        rows.append(
            [
                r.support,
                r.kind,
                r.x.to(w.u("length")),
                r.Fy.to(w.u("force")),
                r.Fx.to(w.u("force")),
                r.C.to(w.u("moment")),
            ]
        )
    return w.table(
        columns=["support", "type", "x", "R (up +)", "H (+x)", "M (clockwise +)"],
        rows=rows,
        caption=f"Reactions, {result.label}",
    )


def extremes_steps(w: Writer, result: BeamResult) -> list[Any]:
    """Heading, a table of the extremes and the key values as Derived records."""
    e = result.extremes
    steps: list[Any] = [Heading("Shear, moment and deflection", 3)]
    F, Mu, D, Lu = w.u("force"), w.u("moment"), w.u("deflection"), w.u("length")
    rows: list[list[Any]] = [
        ["V max", e.V_max.value.to(F), e.V_max.x.to(Lu), e.V_max.side],
        ["V min", e.V_min.value.to(F), e.V_min.x.to(Lu), e.V_min.side],
        ["M max (sagging)", e.M_max.value.to(Mu), e.M_max.x.to(Lu), e.M_max.side],
        ["M min (hogging if < 0)", e.M_min.value.to(Mu), e.M_min.x.to(Lu), e.M_min.side],
    ]
    if e.has_deflection and e.deflection_down is not None:
        rows.append(["δ max, down", e.deflection_down.value.to(D), e.deflection_down.x.to(Lu), ""])
    if e.has_deflection and e.deflection_up is not None:
        rows.append(
            ["upward movement max", e.deflection_up.value.to(D), e.deflection_up.x.to(Lu), ""]
        )
    if e.has_deflection:
        rows.append(["slope at x = 0 (ccw +)", e.slope_left, Q_(0.0, Lu), ""])
        rows.append(["slope at x = L (ccw +)", e.slope_right, result.beam.length.to(Lu), ""])
    steps.append(
        w.table(
            columns=["quantity", "value", "at x", "side"],
            rows=rows,
            caption=f"Extremes, {result.label} (exact)",
        )
    )
    zs = ", ".join(f"{x.to(Lu):~.3g}" for x in e.zero_shear) or "none inside the beam"
    cf = ", ".join(f"{x.to(Lu):~.3g}" for x in e.contraflexure) or "none"
    steps.append(Text(f"Zero shear at x = {zs}. Points of contraflexure at x = {cf}."))
    steps.append(
        w.derived(
            "M_max",
            e.M_max.value,
            f"largest sagging moment, {result.beam.name}",
            unit=w.u("moment"),
        )
    )
    steps.append(
        w.derived(
            "M_min", e.M_min.value, f"most hogging moment, {result.beam.name}", unit=w.u("moment")
        )
    )
    vabs = e.V_max if abs(e.V_max.value_si) >= abs(e.V_min.value_si) else e.V_min
    steps.append(
        w.derived(
            "V_max",
            Q_(abs(vabs.value_si), "N"),
            f"largest shear magnitude, {result.beam.name}",
            unit=w.u("force"),
        )
    )
    if e.has_deflection and e.deflection_down is not None:
        steps.append(
            w.derived(
                "delta_max",
                e.deflection_down.value,
                f"largest downward deflection, {result.beam.name}",
                unit=w.u("deflection"),
            )
        )
    return steps
