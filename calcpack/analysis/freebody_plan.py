"""Which equilibrium equations to take, in which order, for a free body (numeric core).

With three unknowns left, moments about the point where two unknown lines of action meet (a
pin, or the crossing of two reactions' lines), so one equation gives one unknown; then force
sums along a direction that holds one unknown (ΣFx, ΣFy, or perpendicular to an unknown).
For a truss section, moments are preferred throughout (about where two cut members meet; ΣF
only where cut members are parallel).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from calcpack.analysis.freebody import (
    _GEOM_REL,
    FreeBody,
    UnknownAction,
    _dir,
    line_intersection,
)
from calcpack.units import si

__all__ = ["EquationTerm", "EquilibriumEquation", "plan_equations"]


@dataclass(frozen=True)
class EquationTerm:
    """One term of an equilibrium equation, for the working.

    Attributes:
        name: the unknown's name, or the load's label.
        unknown: True for an unknown (value None), False for a known load.
        factor: the multiplier: a direction cosine (force equations) or a signed lever arm in
            metres (moment equations; 1 for a couple or an unknown moment).
        value: the known force (N) or couple (N·m); None for an unknown.
        lever: True when ``factor`` is a lever arm in metres.
    """

    name: str
    unknown: bool
    factor: float
    value: float | None
    lever: bool


@dataclass(frozen=True)
class EquilibriumEquation:
    """One equilibrium equation as taken, with the unknown it gives.

    Attributes:
        kind: ``"Fx"``, ``"Fy"``, ``"F"`` (along ``direction``) or ``"M"`` (about ``point``).
        point: the moment point (x, y) in metres, for ``"M"``.
        point_name: the moment point's name, or a description of where it is.
        direction: the unit direction of a ``"F"`` equation.
        terms: the terms, unknowns and known loads.
        solves: the unknown(s) this equation (or group of equations) gives.
    """

    kind: str
    point: tuple[float, float] | None
    point_name: str
    direction: tuple[float, float] | None
    terms: tuple[EquationTerm, ...]
    solves: tuple[str, ...]


def _terms(
    body: FreeBody,
    unknowns: Sequence[UnknownAction],
    solved: dict[str, float],
    kind: str,
    point: tuple[float, float] = (0.0, 0.0),
    direction: tuple[float, float] = (1.0, 0.0),
) -> tuple[EquationTerm, ...]:
    """The non-zero terms of one equation: reactions first (those already found carry their
    value), then the known loads."""
    tiny = _GEOM_REL * body.scale_m()
    dx, dy = direction
    axis = "x" if abs(dx) == 1.0 else ("y" if abs(dy) == 1.0 else "")
    out: list[EquationTerm] = []
    for u in unknowns:
        if kind == "M":
            coef = u.row(point)[2]
            if abs(coef) <= tiny:
                continue
        else:
            if u.direction is None:
                continue
            coef = u.direction[0] * dx + u.direction[1] * dy
            if abs(coef) <= _GEOM_REL:
                continue
        lever = kind == "M" and u.direction is not None
        out.append(EquationTerm(u.name, u.name not in solved, coef, solved.get(u.name), lever))
    for f in body.point_loads():
        rx, ry, Fx, Fy = si(f.x) - point[0], si(f.y) - point[1], si(f.Fx), si(f.Fy)
        both = Fx != 0 and Fy != 0
        if kind == "M":
            if Fy != 0 and abs(rx) > tiny:
                out.append(EquationTerm(f"{f.label}_y" if both else f.label, False, rx, Fy, True))
            if Fx != 0 and abs(ry) > tiny:
                out.append(EquationTerm(f"{f.label}_x" if both else f.label, False, -ry, Fx, True))
            continue
        if axis:
            comp = Fx if axis == "x" else Fy
            if comp != 0:
                label = f"{f.label}_{axis}" if both else f.label
                out.append(EquationTerm(label, False, 1.0, comp, False))
            continue
        # An inclined direction: each component times its direction cosine.
        for comp, cos, sub in ((Fx, dx, "x"), (Fy, dy, "y")):
            if comp != 0 and abs(cos) > _GEOM_REL:
                out.append(
                    EquationTerm(f"{f.label}_{sub}" if both else f.label, False, cos, comp, False)
                )
    if kind == "M":
        for c in body.couples():
            out.append(EquationTerm(c.label, False, 1.0, si(c.M), False))
    return tuple(out)


def _moment_points(
    forces: Sequence[UnknownAction], named: Sequence[tuple[str, tuple[float, float]]], tiny: float
) -> list[tuple[tuple[float, float], str]]:
    """Points where two unknown lines of action meet; named points (supports) first."""
    found: list[tuple[int, tuple[float, float], str]] = []
    for i in range(len(forces)):
        for j in range(i + 1, len(forces)):
            a, b = forces[i], forces[j]
            p = line_intersection(a.point, _dir(a), b.point, _dir(b))
            if p is None:
                continue
            pname = next(
                (n for n, q in named if math.hypot(p[0] - q[0], p[1] - q[1]) <= tiny), None
            )
            if pname is None:
                found.append((1, p, f"O (where the lines of {a.name} and {b.name} meet)"))
            else:
                found.append((0, p, pname))
    found.sort(key=lambda c: c[0])
    return [(p, n) for _, p, n in found]


def plan_equations(
    body: FreeBody,
    unknowns: list[UnknownAction],
    values: dict[str, float],
    *,
    moments_first: bool = False,
) -> list[EquilibriumEquation]:
    """Choose the equations in the order an engineer would take them: with three unknowns
    left, moments about where two unknown lines meet; then force sums that hold one unknown.
    With ``moments_first`` (a truss section) moments are preferred throughout: about where two
    cut members meet, ΣF only for parallel ones."""
    tiny = _GEOM_REL * body.scale_m()
    named = body.named_points()
    remaining = list(unknowns)
    plan: list[EquilibriumEquation] = []
    solved: dict[str, float] = {}

    def moment_eq(rest: list[UnknownAction]) -> EquilibriumEquation | None:
        # Crossings of any two unknown lines (found ones too: moments about where a found
        # member meets an unknown one leave the other unknown alone).
        points = _moment_points([u for u in unknowns if u.direction is not None], named, tiny)
        if len(rest) == 1 and rest[0].direction is None:
            points = [(named[0][1], named[0][0])] if named else [((0.0, 0.0), "origin")]
        for p, pname in points:
            live = [u for u in rest if abs(u.row(p)[2]) > tiny]
            if len(live) == 1:
                terms = _terms(body, unknowns, solved, "M", point=p)
                return EquilibriumEquation("M", p, pname, None, terms, (live[0].name,))
        return None

    def force_eq(rest: list[UnknownAction]) -> EquilibriumEquation | None:
        forces = [u for u in rest if u.direction is not None]
        perp = [("F", (-_dir(u)[1], _dir(u)[0]), u.name) for u in forces]
        best: EquilibriumEquation | None = None
        for kind, d, across in [("Fx", (1.0, 0.0), ""), ("Fy", (0.0, 1.0), ""), *perp]:
            live = [u for u in forces if abs(_dir(u)[0] * d[0] + _dir(u)[1] * d[1]) > _GEOM_REL]
            if len(live) == 1:
                terms = _terms(body, unknowns, solved, kind, direction=d)
                where = f"perpendicular to {across}" if kind == "F" else ""
                eq = EquilibriumEquation(kind, None, where, d, terms, (live[0].name,))
                # Of the sums that isolate one unknown, take the one with the fewest forces
                # found earlier in it (ΣFy for the diagonal between parallel chords).
                if best is None or sum(t.name in solved for t in eq.terms) < sum(
                    t.name in solved for t in best.terms
                ):
                    best = eq
        return best

    while remaining:
        if len(remaining) >= 3 or moments_first:
            choice = moment_eq(remaining) or force_eq(remaining)
        else:
            choice = force_eq(remaining) or moment_eq(remaining)
        if choice is None:
            # No equation isolates one unknown: the remaining ones are solved together.
            names = tuple(u.name for u in remaining)
            for k, d in (("Fx", (1.0, 0.0)), ("Fy", (0.0, 1.0))):
                terms = _terms(body, unknowns, solved, k, direction=d)
                plan.append(EquilibriumEquation(k, None, "", d, terms, names))
            p, pname = (named[0][1], named[0][0]) if named else ((0.0, 0.0), "origin")
            terms = _terms(body, unknowns, solved, "M", point=p)
            plan.append(EquilibriumEquation("M", p, pname, None, terms, names))
            break
        plan.append(choice)
        solved.update({n: values[n] for n in choice.solves})
        remaining = [u for u in remaining if u.name not in choice.solves]
    return plan
