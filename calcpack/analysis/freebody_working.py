"""The working of a free body, built only when it is displayed (imports calcpack.working).

Loads and the resultants of distributed loads, then each equilibrium equation written with
symbols, substituted, and solved for the unknown it isolates.
"""

from __future__ import annotations

import math
from typing import Any

from calcpack.analysis.freebody import DistributedLoad, FreeBodyResult
from calcpack.analysis.freebody_plan import EquationTerm
from calcpack.analysis.truss_model import Qty
from calcpack.units import si, ureg

__all__ = ["free_body_working"]


def _display(q: Qty) -> Qty:
    from calcpack.units import get_display

    unit = get_display().preset.unit_for(q)
    return q.to(unit) if unit is not None else q


def free_body_working(
    result: FreeBodyResult,
    *,
    member_names: dict[str, str] | None = None,
    tension_tol_N: float | None = None,
) -> Any:
    """The working of a free body as a :class:`calcpack.working.Block`: the loads (with the
    resultants of distributed loads), then each equation symbolically and substituted, and the
    unknown it gives.

    Args:
        result: the solved free body.
        member_names: unknown name -> truss member name, for a section (the unknowns are then
            described as member forces, tension positive, marked T or C).
        tension_tol_N: forces below this (N) are called zero-force members.
    """
    from calcpack.working import Block, Derived, Equation, Given, Table, Term, Text, Unknown

    body = result.body
    members = member_names or {}
    steps: list[Any] = [
        Text(
            "Sign convention: forces positive along +x (right) and +y (up), moments "
            "counter-clockwise positive; each unknown is drawn in its positive sense."
        )
    ]
    rows = []
    for ld in body.loads:
        if isinstance(ld, DistributedLoad):
            L = math.hypot(si(ld.x2) - si(ld.x1), si(ld.y2) - si(ld.y1)) * ureg.m
            Lg = Given(f"L_{ld.label}", _display(L), f"length of {ld.label}")
            w1 = Given(
                f"{ld.label}_1" if ld.w2 is not None else ld.label,
                ld.w1,
                f"intensity of {ld.label}" + (" at its start" if ld.w2 is not None else ""),
            )
            if ld.w2 is None:
                W = Derived(f"W_{ld.label}", w1 * Lg, f"resultant of {ld.label}")
                a = Derived(f"a_{ld.label}", Lg / 2, "resultant's distance from the start")
                steps += [Lg, w1, W, a]
            else:
                w2 = Given(f"{ld.label}_2", ld.w2, f"intensity of {ld.label} at its end")
                W = Derived(f"W_{ld.label}", (w1 + w2) / 2 * Lg, f"resultant of {ld.label}")
                a = Derived(
                    f"a_{ld.label}",
                    Lg * (w1 + 2 * w2) / ((w1 + w2) * 3),
                    "resultant's distance from the start (centroid of the trapezoid)",
                )
                steps += [Lg, w1, w2, W, a]
    for f in body.point_loads():
        rows.append([f.label, _display(f.x), _display(f.y), _display(f.Fx), _display(f.Fy)])
    for c in body.couples():
        rows.append([c.label, "", "", f"couple {_display(c.M):~P}", ""])
    if rows:
        steps.append(
            Table(["Load", "x", "y", "Fx", "Fy"], rows, caption=f"Known loads on {body.name}")
        )
    known_values: dict[str, Any] = {}
    for f in body.point_loads():
        fx, fy = f.Fx, f.Fy
        both = fx.magnitude != 0 and fy.magnitude != 0
        if both:
            known_values[f"{f.label}_x"] = Given(f"{f.label}_x", _display(fx), f"{f.label}, x")
            known_values[f"{f.label}_y"] = Given(f"{f.label}_y", _display(fy), f"{f.label}, y")
        known_values[f.label] = Given(f.label, _display(fy if fy.magnitude != 0 else fx), f.label)
    for c in body.couples():
        known_values[c.label] = Given(c.label, _display(c.M), c.label)
    unknown_terms = {u.name: Unknown(u.name) for u in result.unknowns}
    solved: dict[str, Any] = {}

    def term_of(t: EquationTerm, kind: str) -> Term:
        if t.unknown:
            base: Term = unknown_terms[t.name]
        elif t.name in solved:
            base = solved[t.name]
        elif t.name in known_values:
            base = known_values[t.name]
        else:
            base = Given(t.name, _display((t.value or 0.0) * ureg.N), t.name)
        if kind == "M" and t.lever:
            out: Term = base * _display(t.factor * ureg.m)
            return out
        if t.factor == 1.0:
            return base
        if t.factor == -1.0:
            return -base
        return base * t.factor

    def describe(name: str, value: Qty) -> str:
        if name in members:
            f = float(value.to("N").magnitude)
            tol = tension_tol_N if tension_tol_N is not None else 0.0
            nat = (
                "zero-force member"
                if abs(f) <= tol
                else "tension (T)"
                if f > 0
                else "compression (C)"
            )
            return f"force in member {members[name]}: {nat}"
        return f"{'moment' if name.startswith('M_') else 'reaction'} {name}"

    for eq in result.equations:
        parts = [term_of(t, eq.kind) for t in eq.terms]
        if not parts:
            continue
        lhs = parts[0]
        for p in parts[1:]:
            lhs = lhs + p
        if eq.kind == "M":
            label = (
                rf"\Sigma M_{{{eq.point_name if not eq.point_name.startswith('O ') else 'O'}}} = 0"
            )
            where = ""
            if eq.point_name.startswith("O ") and eq.point is not None:
                where = (
                    f"O = ({_display(eq.point[0] * ureg.m):.3g~P}, "
                    f"{_display(eq.point[1] * ureg.m):.3g~P}), " + eq.point_name[2:].strip("()")
                )
            desc = "moments about " + (where or f"{eq.point_name}")
        elif eq.kind == "F" and eq.direction is not None:
            label = r"\Sigma F_{\perp} = 0"
            desc = f"forces resolved {eq.point_name}" if eq.point_name else "forces resolved"
        else:
            label = rf"\Sigma F_{eq.kind[1]} = 0"
            desc = ""
        steps.append(Equation(lhs, 0, label=label, description=desc))
        if len(eq.solves) == 1:
            target = eq.solves[0]
            own = next(t for t in eq.terms if t.unknown and t.name == target)
            rest_terms = [term_of(t, eq.kind) for t in eq.terms if t is not own]
            value = result.reactions[target]
            if rest_terms:
                rest = rest_terms[0]
                for p in rest_terms[1:]:
                    rest = rest + p
                coef: Any = (
                    _display(own.factor * ureg.m) if (eq.kind == "M" and own.lever) else own.factor
                )
                formula: Any = -rest if coef == 1.0 else rest if coef == -1.0 else -rest / coef
            else:
                formula = 0.0 * value
            d = Derived(target, formula, describe(target, value), note=f"from ${label}$")
            steps.append(d)
            solved[target] = d
    group = [n for eq in result.equations if len(eq.solves) > 1 for n in eq.solves]
    for name in dict.fromkeys(group):
        value = result.reactions[name]
        d = Derived(
            name,
            _display(value),
            describe(name, value),
            note="from the equations above, solved together",
        )
        steps.append(d)
        solved[name] = d
    return Block(steps=steps, title=f"Free body: {body.name}")
