"""The working of a truss analysis, built only when it is displayed.

* :func:`summary_working`: determinacy, reactions, the member force table (T/C), zero-force
  members, the stiffness cross-check.
* :func:`reactions_working`: the whole truss as a free body (ΣM about a support first).
* :func:`joint_working`: the method of joints at one joint: ΣFx = 0 and ΣFy = 0 with the
  members' direction cosines, members found at earlier joints substituted; where both
  equations hold both unknowns, resolving perpendicular to one member gives the other alone.
* :func:`section_working`: the method of sections: the free body on one side of a cut through
  at most three members, moments about where two cut members meet (ΣF for parallel ones).

Every member force is drawn pulling away from the joint (assumed tension): a positive result is
tension (T), a negative one compression (C). Importing this module imports calcpack.working;
the computation modules import it only inside the methods that display working.
"""

from __future__ import annotations

import re
from typing import TYPE_CHECKING, Any

import numpy as np

from calcpack.analysis.freebody import BodySupport, FreeBody, PointForce, solve_section
from calcpack.analysis.freebody_working import free_body_working
from calcpack.errors import InputError
from calcpack.units import get_display, ureg
from calcpack.working import Block, Derived, Equation, Given, Table, Term, Text, Unknown

if TYPE_CHECKING:
    from calcpack.analysis.truss_model import Qty
    from calcpack.analysis.truss_solve import TrussResult

__all__ = [
    "joint_order",
    "joint_working",
    "member_symbol",
    "reactions_working",
    "section_working",
    "summary_working",
]

# Coefficients (direction cosines) below this count as zero.
_TINY = 1e-12


def _clean(name: str) -> str:
    return re.sub(r"[^A-Za-z0-9]", "", name) or "X"


def member_symbol(member: str) -> str:
    """The symbol of a member's force in the working: ``F_<member>``."""
    return f"F_{_clean(member)}"


def _disp(q: Qty) -> Qty:
    """``q`` in the display preset's unit for its dimension."""
    unit = get_display().preset.unit_for(q)
    return q.to(unit) if unit is not None else q


def _tc(value: Qty, tol: float) -> str:
    f = float(value.to("N").magnitude)
    if abs(f) <= tol:
        return "zero-force member"
    return "tension (T)" if f > 0 else "compression (C)"


def _times(v: Term, c: float) -> Term:
    if c == 1.0:
        return v
    if c == -1.0:
        return -v
    return v * c


def _sum(terms: list[Term]) -> Term | None:
    if not terms:
        return None
    total = terms[0]
    for t in terms[1:]:
        total = total + t
    return total


def _fmt(x: float) -> str:
    return f"{x:.4g}" if abs(x) > 1e-12 else "0"


# -- summary -----------------------------------------------------------------------------


def summary_working(result: TrussResult, *, figures: bool = True) -> Block:
    """Determinacy, reactions, member forces with T/C (and their diagram unless
    ``figures=False``), zero-force members."""
    from calcpack.analysis.truss_zero import zero_force_by_inspection

    truss = result.truss
    steps: list[Any] = [Text(f"Determinacy: {result.determinacy.describe()}.")]
    steps.append(
        Table(
            ["Reaction", "Joint", "Acts along", "Value"],
            [
                [
                    f"${_latex_name(r.name)}$",
                    r.node,
                    f"({_fmt(r.direction[0])}, {_fmt(r.direction[1])})",
                    _disp(r.value),
                ]
                for r in result.reactions.values()
            ],
            caption=f"Reactions, {result.label} (positive along the direction shown)",
        )
    )
    tol = result._zero_tol_N
    rows = []
    for k, m in enumerate(truss.members):
        f = result.forces[m.name]
        nat = result.nature(m.name)
        rows.append(
            [
                m.name,
                f"{m.start}–{m.end}",
                _disp(truss.lengths_m[k] * ureg.m),
                _disp(f),
                {"T": "T", "C": "C", "0": "0"}[nat],
            ]
        )
    steps.append(
        Table(
            ["Member", "Joints", "Length", "Force", "T/C"],
            rows,
            caption=f"Member forces, {result.label} (tension positive)",
        )
    )
    if figures:
        from calcpack.analysis.truss_figures import forces_figure

        steps.append(forces_figure(result))
    zero = result.zero_force_members
    rules = zero_force_by_inspection(truss, result=result)
    if zero:
        why = "; ".join(f"{m} ({rules[m]})" if m in rules else m for m in zero)
        steps.append(Text(f"Zero-force members under this loading: {why}."))
    else:
        steps.append(Text("No member is a zero-force member under this loading."))
    if result.stiffness_check is not None:
        steps.append(
            Text(
                "Cross-check by the direct stiffness method: largest difference in member force "
                f"{result.stiffness_check:.1e} of the largest force."
            )
        )
    if result.method == "stiffness":
        steps.append(
            Text(
                "Forces found by the direct stiffness method (the truss is statically "
                "indeterminate, or the method was asked for), from each member's EA / L."
            )
        )
    if result.displacements is not None:
        steps.append(
            Table(
                ["Joint", "$u_x$", "$u_y$"],
                [[n, _disp_mm(u[0]), _disp_mm(u[1])] for n, u in result.displacements.items()],
                caption="Joint displacements (positive along +x, +y)",
            )
        )
    del tol
    return Block(steps=steps, title=f"{truss.name}: {result.label}")


def _disp_mm(q: Qty) -> Qty:
    unit = "mm" if get_display().system == "SI" else "inch"
    return q.to(unit)


def _latex_name(name: str) -> str:
    from calcpack.working import symbol_latex

    return str(symbol_latex(_symbol_ok(name)))


def _symbol_ok(name: str) -> str:
    head, _, tail = name.partition("_")
    return f"{_clean(head)}_{_clean(tail)}" if tail else _clean(head)


# -- reactions -----------------------------------------------------------------------------


def _truss_free_body(result: TrussResult) -> FreeBody:
    truss = result.truss
    loads = []
    for n in truss.nodes:
        fx, fy = result.applied[n.name]
        if fx.magnitude != 0 or fy.magnitude != 0:
            loads.append(PointForce(n.x, n.y, fx, fy, f"P_{_clean(n.name)}"))
    supports = [
        BodySupport(s.node, truss.node(s.node).x, truss.node(s.node).y, s.kind, s.surface)
        for s in truss.supports
    ]
    points = tuple((n.name, n.x, n.y) for n in truss.nodes)
    return FreeBody(f"{truss.name} (whole truss)", tuple(loads), tuple(supports), points)


def _reactions_from_free_body(result: TrussResult) -> bool:
    return len(result.truss.reactions) <= 3


def reactions_working(result: TrussResult) -> Block:
    """The reactions from the equilibrium of the whole truss (three reactions), or a table of
    the reactions found with the member forces (more than three)."""
    from calcpack.analysis.freebody import solve_free_body

    if _reactions_from_free_body(result):
        fb = solve_free_body(_truss_free_body(result))
        block: Block = free_body_working(fb)
        block.title = f"Reactions of {result.truss.name}, {result.label}"
        return block
    n = len(result.truss.reactions)
    return Block(
        steps=[
            Text(
                f"The supports give {n} reaction components, more than the three equations of "
                "equilibrium of the whole truss can find: the reactions come out of the joint "
                f"equations solved together ({result.method} method)."
            ),
            Table(
                ["Reaction", "Value"],
                [[f"${_latex_name(r.name)}$", _disp(r.value)] for r in result.reactions.values()],
            ),
        ],
        title=f"Reactions of {result.truss.name}, {result.label}",
    )


# -- method of joints -------------------------------------------------------------------------


def _order_with_history(result: TrussResult) -> tuple[list[str], dict[str, str]]:
    """The joint order and, for each member, the joint at which it is found."""
    truss = result.truss
    known_reactions = _reactions_from_free_body(result)
    found: dict[str, str] = {}
    reactions_found: set[str] = set()
    remaining = [n.name for n in truss.nodes]
    order: list[str] = []

    def unknowns(node: str) -> int:
        count = sum(1 for m in truss.members_at(node) if m.name not in found)
        if not known_reactions and node not in reactions_found:
            count += sum(1 for _, i, _ in truss.reactions if truss.nodes[i].name == node)
        return count

    while remaining:
        counts = {n: unknowns(n) for n in remaining}
        pick = next((n for n in remaining if 1 <= counts[n] <= 2), None)
        if pick is None:
            pick = next((n for n in remaining if counts[n] == 0), None)
        if pick is None:
            pick = min(remaining, key=lambda n: counts[n])
        order.append(pick)
        remaining.remove(pick)
        reactions_found.add(pick)
        for m in truss.members_at(pick):
            found.setdefault(m.name, pick)
    return order, found


def joint_order(result: TrussResult) -> list[str]:
    """A sensible order of joints: each with at most two unknowns when taken (reactions found
    first from the whole truss when it has three), checks (no unknowns) last."""
    return _order_with_history(result)[0]


def joint_working(result: TrussResult, node: str) -> Block:
    """ΣFx = 0 and ΣFy = 0 at ``node`` with direction cosines; members found at earlier joints
    in :func:`joint_order` substituted; the rest solved (tension positive)."""
    truss = result.truss
    truss.node(node)
    order, found_at = _order_with_history(result)
    position = order.index(node)
    earlier = set(order[:position])
    known_reactions = _reactions_from_free_body(result)
    tol = result._zero_tol_N
    i = truss.node_index[node]
    xy = truss.xy_m

    # Forces at the joint: (symbol term, unit direction away from the joint, unknown?)
    entries: list[tuple[str, Term, tuple[float, float], bool]] = []
    rows = []
    notes: list[str] = []
    for m in truss.members_at(node):
        k = truss.member_index[m.name]
        far = m.end if m.start == node else m.start
        d = xy[truss.node_index[far]] - xy[i]
        L = float(np.hypot(*d))
        c = (float(d[0] / L), float(d[1] / L))
        rows.append(
            [
                m.name,
                far,
                _disp(d[0] * ureg.m),
                _disp(d[1] * ureg.m),
                _disp(L * ureg.m),
                round(c[0], 4),
                round(c[1], 4),
            ]
        )
        sym = member_symbol(m.name)
        first = found_at[m.name]
        if first != node and first in earlier:
            v = Given(
                sym,
                _disp(result.forces[m.name]),
                f"force in {m.name}, from joint {first}",
                result=True,
            )
            entries.append((m.name, v, c, False))
            notes.append(f"{v.text_symbol} = {v.result_text()} (joint {first})")
        else:
            entries.append((m.name, Unknown(sym, unit="kN"), c, True))
        del k
    for r in result.reactions.values():
        if r.node != node:
            continue
        name = _symbol_ok(r.name)
        if known_reactions or node in earlier:
            v = Given(name, _disp(r.value), f"reaction {r.name}", result=True)
            entries.append((r.name, v, r.direction, False))
            notes.append(f"{v.text_symbol} = {v.result_text()} (reactions)")
        else:
            entries.append((r.name, Unknown(name, unit="kN"), r.direction, True))
    fx, fy = result.applied[node]
    loads: list[tuple[Term, tuple[float, float]]] = []
    if fx.magnitude != 0:
        loads.append((Given(f"P_{_clean(node)}x", _disp(fx), f"load at {node}, x"), (1.0, 0.0)))
    if fy.magnitude != 0:
        loads.append((Given(f"P_{_clean(node)}y", _disp(fy), f"load at {node}, y"), (0.0, 1.0)))

    unknown = [e for e in entries if e[3]]
    if len(unknown) > 2:
        # The method of joints stalls here (a complex truss): all but two come from the
        # matrix solution, said so plainly.
        for e in unknown[2:]:
            v = Given(
                _symbol_ok(member_symbol(e[0]) if e[0] in truss.member_index else e[0]),
                _disp(
                    result.forces[e[0]]
                    if e[0] in truss.member_index
                    else result.reactions[e[0]].value
                ),
                f"{e[0]} from the joint equations solved together",
                result=True,
            )
            entries[entries.index(e)] = (e[0], v, e[2], False)
            notes.append(
                f"{v.text_symbol} = {v.result_text()} (joint equations solved "
                "together: no joint is left with two unknowns)"
            )
        unknown = unknown[:2]

    steps: list[Any] = []
    intro = (
        f"Joint {node}: every member force is drawn pulling away from the joint (tension "
        "positive); direction cosines from the joint toward the far end."
    )
    if notes:
        intro += " Known: " + "; ".join(notes) + "."
    steps.append(Text(intro))
    steps.append(Table(["Member", "To joint", "Δx", "Δy", "L", "cos θx", "cos θy"], rows))

    def equation_terms(direction: tuple[float, float]) -> tuple[list[Term], dict[str, float]]:
        known: list[Term] = []
        coefs: dict[str, float] = {}
        for name, term, c, is_unknown in entries:
            coef = c[0] * direction[0] + c[1] * direction[1]
            if abs(coef) <= _TINY:
                continue
            if is_unknown:
                coefs[name] = coef
            else:
                known.append(_times(term, coef))
        for term, c in loads:
            coef = c[0] * direction[0] + c[1] * direction[1]
            if abs(coef) > _TINY:
                known.append(_times(term, coef))
        return known, coefs

    def lhs(direction: tuple[float, float]) -> Term | None:
        parts: list[Term] = []
        for _name, term, c, _ in entries:
            coef = c[0] * direction[0] + c[1] * direction[1]
            if abs(coef) > _TINY:
                parts.append(_times(term, coef))
        for term, c in loads:
            coef = c[0] * direction[0] + c[1] * direction[1]
            if abs(coef) > _TINY:
                parts.append(_times(term, coef))
        return _sum(parts)

    solved: dict[str, Derived] = {}

    def solve_from(direction: tuple[float, float], label: str, target: str) -> None:
        known, coefs = equation_terms(direction)
        for name, value in solved.items():
            if name in coefs:
                known.append(_times(value, coefs.pop(name)))
        rest = _sum(known)
        sym = next(t for n, t, _, _ in entries if n == target)
        assert isinstance(sym, Unknown)
        what = f"force in member {target}" if target in truss.member_index else f"reaction {target}"
        force = (
            result.forces[target]
            if target in truss.member_index
            else result.reactions[target].value
        )
        c = coefs[target]
        if rest is None:
            formula: Any = 0.0 * force
        else:
            formula = -rest if c == 1.0 else rest if c == -1.0 else -rest / c
        d = Derived(sym.name, formula, f"{what}: {_tc(force, tol)}", note=label)
        steps.append(d)
        solved[target] = d

    eq_x, eq_y = lhs((1.0, 0.0)), lhs((0.0, 1.0))
    for eq, lab in ((eq_x, r"\Sigma F_x = 0"), (eq_y, r"\Sigma F_y = 0")):
        if eq is not None:
            steps.append(Equation(eq, 0, label=lab))
    names = [e[0] for e in unknown]
    if len(names) == 1:
        _, cx = equation_terms((1.0, 0.0))
        _, cy = equation_terms((0.0, 1.0))
        axis = (
            (1.0, 0.0) if abs(cx.get(names[0], 0.0)) >= abs(cy.get(names[0], 0.0)) else (0.0, 1.0)
        )
        solve_from(axis, "from ΣFx = 0" if axis[0] else "from ΣFy = 0", names[0])
    elif len(names) == 2:
        _, cx = equation_terms((1.0, 0.0))
        _, cy = equation_terms((0.0, 1.0))
        a, b = names
        if len(cx) == 1 or len(cy) == 1:
            first_axis = (1.0, 0.0) if len(cx) == 1 else (0.0, 1.0)
            first = next(iter(cx if len(cx) == 1 else cy))
            second = b if first == a else a
            solve_from(first_axis, "from ΣFx = 0" if first_axis[0] else "from ΣFy = 0", first)
            other = (0.0, 1.0) if first_axis[0] else (1.0, 0.0)
            solve_from(other, "from ΣFy = 0" if first_axis[0] else "from ΣFx = 0", second)
        else:
            # Resolve perpendicular to b's line: only a is left in that equation.
            cb = next(c for n, _, c, _ in entries if n == b)
            perp = (-cb[1], cb[0])
            eq_p = lhs(perp)
            lab = rf"\Sigma F_{{\perp {b}}} = 0"
            assert eq_p is not None
            steps.append(
                Equation(eq_p, 0, label=lab, description=f"resolving perpendicular to {b}")
            )
            solve_from(perp, f"resolving perpendicular to {b}", a)
            axis = (1.0, 0.0) if abs(cx[b]) >= abs(cy[b]) else (0.0, 1.0)
            solve_from(axis, "from ΣFx = 0" if axis[0] else "from ΣFy = 0", b)
    if len(names) < 2:
        steps.append(
            Text(
                "The remaining equation holds no unknown: it checks the forces found so far "
                "(its substituted sides agree to rounding)."
            )
        )
    return Block(steps=steps, title=f"Method of joints: joint {node} ({result.label})")


# -- method of sections ---------------------------------------------------------------------


def _parts_after_cut(result: TrussResult, cut: list[str]) -> list[set[str]]:
    truss = result.truss
    adjacency: dict[str, set[str]] = {n.name: set() for n in truss.nodes}
    for m in truss.members:
        if m.name in cut:
            continue
        adjacency[m.start].add(m.end)
        adjacency[m.end].add(m.start)
    parts: list[set[str]] = []
    seen: set[str] = set()
    for n in truss.nodes:
        if n.name in seen:
            continue
        part = {n.name}
        stack = [n.name]
        while stack:
            for j in adjacency[stack.pop()]:
                if j not in part:
                    part.add(j)
                    stack.append(j)
        seen |= part
        parts.append(part)
    return parts


def section_working(result: TrussResult, cut: list[str], *, keep: str | None = None) -> Block:
    """The method of sections through the members ``cut``.

    Args:
        result: the analysed truss.
        cut: the members cut (one to three; each unknown on the free body).
        keep: a node on the side whose free body is drawn; default the side with fewer loaded
            or supported joints.

    Raises:
        InputError: more than three members, an unknown member, a cut that does not separate
            the truss into two parts, ``keep`` not a node.
    """
    truss = result.truss
    cut = list(cut)
    if not 1 <= len(cut) <= 3:
        raise InputError(
            f"A section may cut one to three members, each an unknown (got {len(cut)}: "
            f"{', '.join(cut)}); choose a cut through at most three members",
            name="cut",
            value=cut,
            expected="1 to 3 member names",
        )
    for name in cut:
        truss.member(name)
    parts = _parts_after_cut(result, cut)
    if len(parts) != 2:
        raise InputError(
            f"Cutting members {', '.join(cut)} leaves the truss in {len(parts)} part(s), not "
            "two; a section must cut the truss into two free bodies",
            name="cut",
            value=cut,
            expected="members whose removal splits the truss in two",
        )
    if keep is not None:
        truss.node(keep)
        side = parts[0] if keep in parts[0] else parts[1]
    else:

        def busy(part: set[str]) -> int:
            loaded = sum(1 for n in part if any(c.magnitude for c in result.applied[n]))
            return loaded + sum(1 for s in truss.supports if s.node in part)

        side = min(parts, key=lambda p: (busy(p), len(p)))
    for name in cut:
        m = truss.member(name)
        if (m.start in side) == (m.end in side):
            raise InputError(
                f"Member {name} does not cross the cut: both its ends are on the same side",
                name="cut",
                value=name,
                expected="members joining the two parts",
            )
    loads: list[PointForce] = []
    for n in truss.nodes:
        if n.name not in side:
            continue
        fx, fy = result.applied[n.name]
        if fx.magnitude != 0 or fy.magnitude != 0:
            loads.append(PointForce(n.x, n.y, fx, fy, f"P_{_clean(n.name)}"))
    for r in result.reactions.values():
        if r.node in side and r.value.magnitude != 0:
            rx, ry = r.components
            nd = truss.node(r.node)
            loads.append(PointForce(nd.x, nd.y, rx, ry, _symbol_ok(r.name)))
    links = []
    for name in cut:
        m = truss.member(name)
        near, far = (m.start, m.end) if m.start in side else (m.end, m.start)
        a, b = truss.node(near), truss.node(far)
        angle = np.degrees(
            np.arctan2(float((b.y - a.y).to("m").magnitude), float((b.x - a.x).to("m").magnitude))
        )
        links.append(BodySupport(_clean(name), a.x, a.y, "link", float(angle) * ureg.degree))
    points = tuple((n.name, n.x, n.y) for n in truss.nodes)
    side_names = ", ".join(n.name for n in truss.nodes if n.name in side)
    fb = FreeBody(
        f"section through {', '.join(cut)} (joints {side_names})",
        tuple(loads),
        tuple(links),
        points,
    )
    fbr = solve_section(fb)
    block: Block = free_body_working(
        fbr, member_names={f"F_{_clean(n)}": n for n in cut}, tension_tol_N=result._zero_tol_N
    )
    block.steps.insert(
        0,
        Text(
            f"Cut through members {', '.join(cut)}; free body of the part holding joints "
            f"{side_names}. Each cut member's force acts on it along the member, away from the "
            "part (tension positive). Reactions on this part are as found for the whole truss."
        ),
    )
    block.title = f"Method of sections: {', '.join(cut)} ({result.label})"
    return block
