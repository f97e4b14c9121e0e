"""Zero-force members found by inspection (the two rules of the method of joints)."""

from __future__ import annotations

from typing import TYPE_CHECKING

from calcpack.analysis.truss_model import FloatArray, Member, Truss

if TYPE_CHECKING:
    from calcpack.analysis.truss_solve import TrussResult

__all__ = ["zero_force_by_inspection"]


def zero_force_by_inspection(
    truss: Truss, case: str | None = None, *, result: TrussResult | None = None
) -> dict[str, str]:
    """Zero-force members found by the two rules of inspection, applied repeatedly.

    1. At an unloaded, unsupported joint with two non-collinear members, both carry no force.
    2. At an unloaded, unsupported joint with three members, two of them collinear, the third
       carries no force.

    Members found zero are then ignored at their other joints, and the rules applied again.

    Args:
        truss: the truss.
        case: the load case whose loaded joints count (None: every load).
        result: alternatively, a result (e.g. a combination) whose applied loads count.

    Returns:
        member name -> the reason, e.g. ``"joint F: two non-collinear members, no load"``.
    """
    p = result.loads_N() if result is not None else truss.load_vector(case)
    loaded = {
        n.name for i, n in enumerate(truss.nodes) if abs(p[2 * i]) > 0 or abs(p[2 * i + 1]) > 0
    }
    supported = {s.node for s in truss.supports}
    found: dict[str, str] = {}
    changed = True
    while changed:
        changed = False
        for n in truss.nodes:
            if n.name in loaded or n.name in supported:
                continue
            live = [m for m in truss.members_at(n.name) if m.name not in found]
            dirs = [_away(truss, m, n.name) for m in live]
            if len(live) == 2 and abs(_cross(dirs[0], dirs[1])) > 1e-9:
                for m in live:
                    found[m.name] = f"joint {n.name}: two non-collinear members, no load"
                changed = True
            elif len(live) == 3:
                for a, b, c in ((0, 1, 2), (0, 2, 1), (1, 2, 0)):
                    collinear = abs(_cross(dirs[a], dirs[b])) <= 1e-9
                    if collinear and abs(_cross(dirs[a], dirs[c])) > 1e-9:
                        found[live[c].name] = (
                            f"joint {n.name}: {live[a].name} and {live[b].name} collinear, no load"
                        )
                        changed = True
                        break
    return found


def _away(truss: Truss, member: Member, node: str) -> FloatArray:
    c: FloatArray = truss.unit_vectors[truss.member_index[member.name]]
    return c if member.start == node else -c


def _cross(a: FloatArray, b: FloatArray) -> float:
    return float(a[0] * b[1] - a[1] * b[0])
