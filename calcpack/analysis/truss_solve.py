"""Solve a plane pin-jointed truss: determinacy, stability, member forces, reactions.

A statically determinate truss is solved from joint equilibrium (the method of joints written
for every joint at once: the equilibrium matrix). A statically indeterminate truss is solved by
the direct stiffness method when every member has an axial rigidity EA; the stiffness method
also cross-checks a determinate truss whose EA is given, and gives node displacements.

Sign conventions: member forces are tension positive (``T``), compression negative (``C``);
reactions are positive along the directions given in :mod:`calcpack.analysis.truss_model`;
displacements are positive along +x and +y.

Superposition by load case: :func:`solve_truss` analyses one load case (``case="W"``) or
every load as given; :func:`solve_truss_cases` returns one result per case. Results of the same
truss are linear: ``1.2 * dead + 1.6 * live`` or :func:`combine_results` with a mapping of
factors gives the result of the factored combination (forces, reactions, displacements and the
applied loads used for the working all scale and add).
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any, Literal

import numpy as np

from calcpack import views
from calcpack.analysis.superposition import superpose
from calcpack.analysis.truss_model import FloatArray, Member, Qty, Truss
from calcpack.analysis.truss_stiffness import stiffness_solve
from calcpack.analysis.truss_zero import zero_force_by_inspection
from calcpack.errors import InputError, UnstableStructureError
from calcpack.units import ureg
from calcpack.validate import find, finite, one_of

__all__ = [
    "Determinacy",
    "Reaction",
    "TrussResult",
    "combine_results",
    "determinacy",
    "equilibrium_matrix",
    "solve_truss",
    "solve_truss_cases",
    "zero_force_by_inspection",
]

Method = Literal["auto", "equilibrium", "stiffness"]

# Singular values below this fraction of the largest count as zero (rank, mechanisms).
_RANK_REL = 1e-10
# A member force below this fraction of the largest force or load counts as zero.
_ZERO_REL = 1e-9


def equilibrium_matrix(truss: Truss) -> FloatArray:
    """The joint equilibrium matrix A, (2 × nodes) rows by (members + reactions) columns.

    Row ``2i`` is ΣFx and row ``2i + 1`` is ΣFy at node ``i``; column ``k < members`` holds member
    ``k``'s direction cosines at its two ends (a tension pulls each end toward the other), then
    one column per reaction component. Equilibrium is ``A @ forces + loads = 0``.
    """
    nj, nm = len(truss.nodes), len(truss.members)
    A = np.zeros((2 * nj, nm + len(truss.reactions)))
    for k, (s, e) in enumerate(truss.member_ends):
        c = truss.unit_vectors[k]
        A[2 * s : 2 * s + 2, k] += c
        A[2 * e : 2 * e + 2, k] -= c
    for r, (_, i, d) in enumerate(truss.reactions):
        A[2 * i : 2 * i + 2, nm + r] += d
    return A


@dataclass(frozen=True)
class Determinacy:
    """Counting and rank test of a truss.

    Attributes:
        members: m, the number of members.
        reactions: r, the number of reaction components.
        joints: j, the number of joints.
        degree: m + r - 2j (0 determinate, > 0 indeterminate to that degree, < 0 too few).
        rank: rank of the equilibrium matrix; the truss is stable when it equals 2j.
        stable: True when no mechanism exists (rank = 2j).
    """

    members: int
    reactions: int
    joints: int
    degree: int
    rank: int
    stable: bool

    @property
    def kind(self) -> str:
        """``"determinate"``, ``"indeterminate"`` or ``"unstable"``."""
        if not self.stable:
            return "unstable"
        return "determinate" if self.degree == 0 else "indeterminate"

    def describe(self) -> str:
        """One sentence, e.g. "m + r = 9 + 3 = 12 = 2j: statically determinate and stable"."""
        m, r, j = self.members, self.reactions, self.joints
        rel = "=" if self.degree == 0 else (">" if self.degree > 0 else "<")
        head = f"m + r = {m} + {r} = {m + r} {rel} 2j = {2 * j}"
        if not self.stable:
            return f"{head}; rank of the equilibrium matrix {self.rank} < {2 * j}: unstable"
        if self.degree == 0:
            return f"{head}: statically determinate and stable"
        return f"{head}: statically indeterminate to degree {self.degree}, stable"


def _svd(A: FloatArray) -> tuple[FloatArray, FloatArray]:
    U, S, _ = np.linalg.svd(A)
    return U, S


def determinacy(truss: Truss) -> Determinacy:
    """Count m + r against 2j and find the rank of the equilibrium matrix."""
    A = equilibrium_matrix(truss)
    sv = np.linalg.svd(A, compute_uv=False)
    tol = _RANK_REL * (float(sv[0]) if sv.size else 1.0)
    rank = int(np.sum(sv > tol))
    m, r, j = len(truss.members), len(truss.reactions), len(truss.nodes)
    return Determinacy(m, r, j, m + r - 2 * j, rank, rank == 2 * j)


def _mechanism_error(truss: Truss, det: Determinacy) -> UnstableStructureError:
    """Describe the first mechanism mode: rigid-body motion of the whole truss (supports at
    fault) or a joint that moves without stretching any member."""
    A = equilibrium_matrix(truss)
    U, S = _svd(A)
    S_full = np.zeros(A.shape[0])
    S_full[: S.size] = S
    tol = _RANK_REL * (float(S[0]) if S.size else 1.0)
    mode = U[:, int(np.argmin(S_full))] if np.any(S_full <= tol) else U[:, -1]
    xy = truss.xy_m
    u = mode.reshape(-1, 2)
    # Rigid-body displacement fields: translation x, translation y, rotation about the origin.
    R = np.zeros((2 * len(xy), 3))
    R[0::2, 0] = 1.0
    R[1::2, 1] = 1.0
    R[0::2, 2] = -xy[:, 1]
    R[1::2, 2] = xy[:, 0]
    coef, *_ = np.linalg.lstsq(R, mode, rcond=None)
    residual = float(np.linalg.norm(R @ coef - mode))
    count = det.describe()
    if residual < 1e-6:
        tx, ty, w = (float(c) for c in coef)
        if abs(w) * truss.size_m < 1e-6 * max(abs(tx), abs(ty)):
            direction = "horizontally" if abs(tx) >= abs(ty) else "vertically"
            if min(abs(tx), abs(ty)) > 1e-3 * max(abs(tx), abs(ty)):
                angle = np.degrees(np.arctan2(ty, tx))
                direction = f"along a line at {angle:.0f}° to the horizontal"
            motion = f"slide {direction} (the reactions are parallel)"
        else:
            tiny = 1e-9 * truss.size_m
            cx, cy = (0.0 if abs(c) < tiny else c for c in (-ty / w, tx / w))
            motion = (
                f"rotate about the point ({cx:.3g} m, {cy:.3g} m) (the reactions' lines of "
                "action meet there, or are too few)"
            )
        names = ", ".join(f"{s.kind} at {s.node}" for s in truss.supports) or "none"
        return UnstableStructureError(
            f"Truss {truss.name} is unstable: its supports ({names}) let the whole truss {motion}"
            f" ({count}). Add or rearrange supports so the reactions are neither parallel nor "
            "concurrent",
            part="supports",
        )
    moving = int(np.argmax(np.hypot(u[:, 0], u[:, 1])))
    node = truss.nodes[moving].name
    return UnstableStructureError(
        f"Truss {truss.name} is a mechanism at joint {node}: joint {node} can move without "
        f"stretching any member ({count}). Brace it with another member or a support",
        part=f"joint {node}",
    )


@dataclass(frozen=True)
class Reaction:
    """One reaction component.

    Attributes:
        name: e.g. ``"R_Ax"``, ``"R_Ay"`` (pin) or ``"R_B"`` (roller).
        node: the supported node.
        direction: the unit vector (x, y) along which the reaction is positive.
        value: the reaction, [force], positive along ``direction``.
    """

    name: str
    node: str
    direction: tuple[float, float]
    value: Qty

    @property
    def components(self) -> tuple[Qty, Qty]:
        """The reaction's global x and y components."""
        return self.value * self.direction[0], self.value * self.direction[1]


@dataclass(frozen=True, eq=False)
class TrussResult:
    """Member forces, reactions and (stiffness method) displacements of one truss under one
    load case or combination.

    Attributes:
        truss: the truss analysed.
        label: the load case (``"D"``), ``"all loads"``, or a combination such as
            ``"1.2 D + 1.6 L"``.
        determinacy: the counting and rank test.
        method: ``"equilibrium"`` (joint equations solved together) or ``"stiffness"``.
        forces: member name -> axial force, [force], tension positive.
        reactions: reaction name -> :class:`Reaction`.
        applied: node name -> (Fx, Fy), the net applied load used (factored for combinations).
        displacements: node name -> (ux, uy), [length], when EA was given; else None.
        stiffness_check: for a determinate truss with EA given, the largest difference between
            the equilibrium and stiffness member forces as a fraction of the largest force;
            else None.

    Results of the same truss scale and add (``1.2 * r_D + 1.6 * r_L``).
    """

    truss: Truss
    label: str
    determinacy: Determinacy
    method: str
    forces: Mapping[str, Qty]
    reactions: Mapping[str, Reaction]
    applied: Mapping[str, tuple[Qty, Qty]]
    displacements: Mapping[str, tuple[Qty, Qty]] | None = None
    stiffness_check: float | None = None

    # -- lookups ---------------------------------------------------------------------------

    def force(self, member: str) -> Qty:
        """The axial force in ``member``, tension positive."""
        self.truss.member(member)
        return self.forces[member]

    def nature(self, member: str) -> str:
        """``"T"`` (tension), ``"C"`` (compression) or ``"0"`` (zero-force) for ``member``."""
        f = self.force(member).to("N").magnitude
        if abs(f) <= self._zero_tol_N:
            return "0"
        return "T" if f > 0 else "C"

    def reaction(self, name: str) -> Qty:
        """The reaction called ``name`` (``"R_Ay"``), positive along its direction."""
        return find("reaction", name, self.reactions, what="reaction").value

    def reaction_at(self, node: str) -> tuple[Qty, Qty]:
        """The total reaction at ``node`` as global (x, y) components (zero if unsupported)."""
        self.truss.node(node)
        rx = ry = 0.0
        for rec in self.reactions.values():
            if rec.node == node:
                rx += rec.value.to("N").magnitude * rec.direction[0]
                ry += rec.value.to("N").magnitude * rec.direction[1]
        return rx * ureg.N, ry * ureg.N

    @property
    def _zero_tol_N(self) -> float:
        scale = max(
            [abs(f.to("N").magnitude) for f in self.forces.values()]
            + [abs(c.to("N").magnitude) for xy in self.applied.values() for c in xy]
            + [0.0]
        )
        return _ZERO_REL * scale if scale > 0 else 0.0

    @property
    def zero_force_members(self) -> tuple[str, ...]:
        """Members whose force is zero under this loading (to 1e-9 of the largest force)."""
        return tuple(m for m in self.forces if self.nature(m) == "0")

    def forces_N(self) -> FloatArray:
        """Member forces in newtons, in member order (numeric use)."""
        return np.array([self.forces[m.name].to("N").magnitude for m in self.truss.members])

    def reactions_N(self) -> FloatArray:
        """Reaction components in newtons, in reaction order (numeric use)."""
        return np.array([rec.value.to("N").magnitude for rec in self.reactions.values()])

    def loads_N(self) -> FloatArray:
        """Net applied loads in newtons, ``[Fx0, Fy0, ...]`` in node order (numeric use)."""
        out = np.zeros(2 * len(self.truss.nodes))
        for i, n in enumerate(self.truss.nodes):
            fx, fy = self.applied[n.name]
            out[2 * i], out[2 * i + 1] = fx.to("N").magnitude, fy.to("N").magnitude
        return out

    # -- superposition ---------------------------------------------------------------------

    def scaled(self, factor: float, label: str | None = None) -> TrussResult:
        """This result with every load, force, reaction and displacement times ``factor``.

        Raises:
            InputError: ``factor`` is not a finite number.
        """
        f = float(finite("factor", factor))
        disp = None
        if self.displacements is not None:
            disp = {n: (u[0] * f, u[1] * f) for n, u in self.displacements.items()}
        return TrussResult(
            self.truss,
            label if label is not None else f"{f:g} {self.label}",
            self.determinacy,
            self.method,
            {m: v * f for m, v in self.forces.items()},
            {
                k: Reaction(r.name, r.node, r.direction, r.value * f)
                for k, r in self.reactions.items()
            },
            {n: (xy[0] * f, xy[1] * f) for n, xy in self.applied.items()},
            disp,
            self.stiffness_check,
        )

    def __mul__(self, factor: float) -> TrussResult:
        return self.scaled(factor)

    __rmul__ = __mul__

    def __add__(self, other: TrussResult) -> TrussResult:
        if not isinstance(other, TrussResult):
            return NotImplemented
        if other.truss is not self.truss:
            raise InputError(
                f"Only results of the same truss can be added (got {self.truss.name!r} and "
                f"{other.truss.name!r}); solve each case on one Truss object",
                name="other",
                value=other.label,
                expected="a result of the same truss",
            )
        disp = None
        if self.displacements is not None and other.displacements is not None:
            disp = {
                n: (u[0] + other.displacements[n][0], u[1] + other.displacements[n][1])
                for n, u in self.displacements.items()
            }
        checks = [c for c in (self.stiffness_check, other.stiffness_check) if c is not None]
        return TrussResult(
            self.truss,
            f"{self.label} + {other.label}",
            self.determinacy,
            self.method,
            {m: v + other.forces[m] for m, v in self.forces.items()},
            {
                k: Reaction(r.name, r.node, r.direction, r.value + other.reactions[k].value)
                for k, r in self.reactions.items()
            },
            {
                n: (xy[0] + other.applied[n][0], xy[1] + other.applied[n][1])
                for n, xy in self.applied.items()
            },
            disp,
            max(checks) if checks else None,
        )

    # -- display and working (built lazily) -----------------------------------------------

    def working(self, *, figures: bool = True) -> Any:
        """Summary working (a :class:`calcpack.working.Block`): determinacy, reactions, the
        member force table with T/C and (unless ``figures=False``) their diagram, zero-force
        members, the stiffness cross-check."""
        from calcpack.analysis.truss_working import summary_working

        return summary_working(self, figures=figures)

    def joint_working(self, node: str) -> Any:
        """The method of joints at ``node`` (a Block): ΣFx = 0 and ΣFy = 0 with direction
        cosines, members found at earlier joints (in :meth:`joint_order`) substituted, solved
        for the rest."""
        from calcpack.analysis.truss_working import joint_working

        return joint_working(self, node)

    def joint_order(self) -> list[str]:
        """A sensible order to take the joints in (at most two unknowns at each, reactions
        found first from the whole truss)."""
        from calcpack.analysis.truss_working import joint_order

        return joint_order(self)

    def section_working(self, cut: list[str], *, keep: str | None = None) -> Any:
        """The method of sections through the members ``cut`` (one to three), with the free
        body on the side holding node ``keep`` (default: the side with fewer loads and
        supports): moments about where two cut members meet, ΣF for parallel ones."""
        from calcpack.analysis.truss_working import section_working

        return section_working(self, cut, keep=keep)

    def reactions_working(self) -> Any:
        """The whole truss as a free body (a Block): reactions from ΣM, ΣFx and ΣFy."""
        from calcpack.analysis.truss_working import reactions_working

        return reactions_working(self)

    def diagram(self, **options: Any) -> Any:
        """The truss drawn to scale with supports, loads, reactions and member forces (a
        :class:`calcpack.plots.truss.TrussDiagram`, shown inline as SVG)."""
        return views.render("diagram", self, **options)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> Any:
        return self.working()._repr_mimebundle_(include, exclude)

    def text(self) -> str:
        """A plain-text summary of the working."""
        return str(self.working().text())


def _missing_ea(truss: Truss) -> list[Member]:
    return [m for m in truss.members if m.EA is None]


def solve_truss(
    truss: Truss,
    *,
    case: str | None = None,
    method: Method = "auto",
) -> TrussResult:
    """Analyse a plane truss for one load case (or all its loads).

    Args:
        truss: the truss.
        case: the load case to apply (``"D"``, ``"W"``...); None applies every load as given.
        method: ``"auto"`` (equilibrium for a determinate truss, stiffness for an
            indeterminate one), ``"equilibrium"`` or ``"stiffness"`` (needs EA on every member).

    Returns:
        A :class:`TrussResult`, member forces tension positive.

    Raises:
        UnstableStructureError: a mechanism, naming the joint or the supports at fault.
        InputError: an unknown load case; an indeterminate truss (or ``method="stiffness"``)
            without EA on every member; ``method="equilibrium"`` on an indeterminate truss.
    """
    if case is not None and case not in truss.load_cases:
        raise InputError(
            f"Load case {case!r} has no loads on truss {truss.name} (cases: "
            f"{', '.join(truss.load_cases) or 'none'})",
            name="case",
            value=case,
            expected="a load case present in the truss's loads",
        )
    one_of("method", method, ("auto", "equilibrium", "stiffness"))
    det = determinacy(truss)
    if not det.stable:
        raise _mechanism_error(truss, det)
    p = truss.load_vector(case)
    missing = _missing_ea(truss)
    if det.degree > 0 and method == "equilibrium":
        raise InputError(
            f"Truss {truss.name} is statically indeterminate ({det.describe()}); equilibrium "
            "alone cannot find its forces: use method='stiffness' with EA for every member",
            name="method",
            value=method,
            expected="'stiffness' or 'auto'",
        )
    if (det.degree > 0 or method == "stiffness") and missing:
        names = ", ".join(m.name for m in missing)
        why = (
            f"it is statically indeterminate ({det.describe()})"
            if det.degree > 0
            else "the stiffness method was asked for"
        )
        raise InputError(
            f"Truss {truss.name} needs the axial rigidity EA of every member because {why}; "
            f"EA is missing for members {names}",
            name=f"EA of member {missing[0].name}",
            value=None,
            expected="EA as a force quantity",
        )
    u: FloatArray | None = None
    check: float | None = None
    if det.degree == 0 and method != "stiffness":
        A = equilibrium_matrix(truss)
        x: FloatArray = np.asarray(np.linalg.solve(A, -p), dtype=np.float64)
        nm = len(truss.members)
        N, R = x[:nm], x[nm:]
        used = "equilibrium"
        if not missing:
            u, N_k, _ = stiffness_solve(truss, p)
            scale = max(float(np.max(np.abs(N), initial=0.0)), 1e-300)
            check = float(np.max(np.abs(N - N_k), initial=0.0)) / scale
    else:
        u, N, R = stiffness_solve(truss, p)
        used = "stiffness"
    return _result(truss, "all loads" if case is None else case, det, used, N, R, p, u, check)


def _result(
    truss: Truss,
    label: str,
    det: Determinacy,
    method: str,
    N: FloatArray,
    R: FloatArray,
    p: FloatArray,
    u: FloatArray | None,
    check: float | None,
) -> TrussResult:
    # Round-off zeros (1e-15 of the loads) are stored as exact zeros so they show as 0.
    scale = max(float(np.max(np.abs(p), initial=0.0)), float(np.max(np.abs(N), initial=0.0)))
    N = np.where(np.abs(N) <= 1e-11 * scale, 0.0, N)
    R = np.where(np.abs(R) <= 1e-11 * scale, 0.0, R)
    kN = ureg.kN
    forces = {m.name: (float(N[k]) / 1e3) * kN for k, m in enumerate(truss.members)}
    reactions = {
        name: Reaction(name, truss.nodes[i].name, d, (float(R[r]) / 1e3) * kN)
        for r, (name, i, d) in enumerate(truss.reactions)
    }
    applied = {
        n.name: ((float(p[2 * i]) / 1e3) * kN, (float(p[2 * i + 1]) / 1e3) * kN)
        for i, n in enumerate(truss.nodes)
    }
    disp = None
    if u is not None:
        mm = ureg.mm
        disp = {
            n.name: (float(u[2 * i]) * 1e3 * mm, float(u[2 * i + 1]) * 1e3 * mm)
            for i, n in enumerate(truss.nodes)
        }
    return TrussResult(truss, label, det, method, forces, reactions, applied, disp, check)


def solve_truss_cases(truss: Truss, *, method: Method = "auto") -> dict[str, TrussResult]:
    """One :class:`TrussResult` per load case of ``truss``, keyed by case name."""
    return {case: solve_truss(truss, case=case, method=method) for case in truss.load_cases}


def combine_results(
    results: Mapping[str, TrussResult], factors: Mapping[str, float], label: str | None = None
) -> TrussResult:
    """Superpose per-case results: Σ factor × result
    (:func:`calcpack.analysis.superposition.superpose`), named for the combination.

    Args:
        results: load-case name -> result (as from :func:`solve_truss_cases`).
        factors: load-case name -> load factor, e.g. ``{"D": 1.2, "L": 1.6}``.
        label: the combination's name; default e.g. ``"1.2 D + 1.6 L"``.

    Raises:
        InputError: a factor names a case with no result, or no factors are given.
    """
    total: TrussResult = superpose(results, factors)
    name = label or " + ".join(f"{f:g} {c}" for c, f in factors.items())
    return TrussResult(
        total.truss,
        name,
        total.determinacy,
        total.method,
        total.forces,
        total.reactions,
        total.applied,
        total.displacements,
        total.stiffness_check,
    )
