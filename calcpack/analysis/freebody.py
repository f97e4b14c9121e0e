"""Rigid-body equilibrium of a free body in the plane: up to three unknown reactions.

A free body carries point forces, couples and distributed loads (through their resultants) and
is held by supports: a pin (two force components), a roller (one force normal to its surface,
which may be inclined), a fixed support (two force components and a moment), or a link (one
force along a given line, e.g. a cable or a two-force member). :func:`solve_free_body` finds the
unknowns from ΣFx = 0, ΣFy = 0 and ΣM = 0, choosing the equations as an engineer would: moments
about the point where two unknown lines of action meet, so one equation gives one unknown.

Sign conventions: x to the right, y up; forces positive along +x and +y; moments and couples
counter-clockwise positive. A pin's reactions ``R_<name>x``, ``R_<name>y`` are positive along
+x, +y; a roller's ``R_<name>`` along the surface normal ``(-sin θ, cos θ)`` (up for a level
surface); a fixed support's moment ``M_<name>`` counter-clockwise; a link's ``F_<name>`` along
its given direction.

Refusals: more than three unknowns (statically indeterminate: :class:`OutOfScopeError`); unknowns
that cannot hold the body (all parallel, all concurrent, or fewer than three:
:class:`UnstableStructureError` saying which).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Literal

import numpy as np

from calcpack import views
from calcpack.analysis.truss_model import FloatArray, Qty

if TYPE_CHECKING:
    from calcpack.analysis.freebody_plan import EquilibriumEquation
from calcpack.errors import InputError, OutOfScopeError, UnstableStructureError
from calcpack.units import require, si, ureg
from calcpack.validate import distinct, each_instance, find

__all__ = [
    "BodySupport",
    "Couple",
    "DistributedLoad",
    "FreeBody",
    "FreeBodyResult",
    "PointForce",
    "UnknownAction",
    "line_intersection",
    "solve_free_body",
]

BodySupportKind = Literal["pin", "roller", "fixed", "link"]
# Lengths, angles and forces below these fractions of the body's scale count as zero.
_GEOM_REL = 1e-9
_RANK_REL = 1e-10


def _point(x: object, y: object, what: str) -> tuple[float, float]:
    return si(require(x, "[length]", f"x of {what}")), si(require(y, "[length]", f"y of {what}"))


@dataclass(frozen=True)
class PointForce:
    """A known force at a point.

    Args:
        x, y: the point of application, [length].
        Fx, Fy: the components, [force], positive along +x and +y.
        label: the name shown in the working (``"P1"``, ``"W"``).
    """

    x: Qty
    y: Qty
    Fx: Qty = field(default_factory=lambda: 0.0 * ureg.kN)
    Fy: Qty = field(default_factory=lambda: 0.0 * ureg.kN)
    label: str = "P"

    def __post_init__(self) -> None:
        _point(self.x, self.y, f"force {self.label}")
        require(self.Fx, "[force]", f"Fx of {self.label}")
        require(self.Fy, "[force]", f"Fy of {self.label}")

    @classmethod
    def polar(cls, x: Qty, y: Qty, P: Qty, angle: Qty, label: str = "P") -> PointForce:
        """A force of magnitude ``P`` at ``angle`` counter-clockwise from +x (-90° is down)."""
        require(P, "[force]", f"P of {label}")
        theta = float(require(angle, "[]", f"angle of {label}").to("radian").magnitude)
        return cls(x, y, P * math.cos(theta), P * math.sin(theta), label)


@dataclass(frozen=True)
class Couple:
    """A known couple, [force × length], counter-clockwise positive."""

    M: Qty
    label: str = "C"

    def __post_init__(self) -> None:
        require(self.M, "[force] * [length]", f"couple {self.label}")


@dataclass(frozen=True)
class DistributedLoad:
    """A load spread along a straight segment, uniform or varying linearly, replaced by its
    resultant (area of the load diagram, through its centroid).

    Args:
        x1, y1, x2, y2: the segment's ends, [length].
        w1, w2: intensity at each end, [force]/[length] per unit length of the segment, both of
            one sign (w2 defaults to w1: uniform).
        angle: direction the load acts in, counter-clockwise from +x (default -90°: down).
        label: the name shown in the working.
    """

    x1: Qty
    y1: Qty
    x2: Qty
    y2: Qty
    w1: Qty
    w2: Qty | None = None
    angle: Qty = field(default_factory=lambda: -90.0 * ureg.degree)
    label: str = "w"

    def __post_init__(self) -> None:
        a = _point(self.x1, self.y1, f"start of {self.label}")
        b = _point(self.x2, self.y2, f"end of {self.label}")
        w1 = si(require(self.w1, "[force] / [length]", f"w1 of {self.label}"))
        w2 = (
            w1
            if self.w2 is None
            else si(require(self.w2, "[force] / [length]", f"w2 of {self.label}"))
        )
        require(self.angle, "[]", f"angle of {self.label}")
        if math.hypot(b[0] - a[0], b[1] - a[1]) == 0:
            raise InputError(
                f"Distributed load {self.label} has zero length (its two ends coincide)",
                name=self.label,
                value=(self.x1, self.y1),
                expected="two different end points",
            )
        if w1 * w2 < 0:
            raise InputError(
                f"Distributed load {self.label} changes sign along its length (got w1 = "
                f"{self.w1:~P}, w2 = {self.w2:~P}); split it into two loads of one sign each",
                name=self.label,
                value=(self.w1, self.w2),
                expected="w1 and w2 of one sign",
            )

    def resultant(self) -> PointForce:
        """The equivalent point force: magnitude (w1 + w2) L / 2 at the centroid of the
        trapezoid, L (w1 + 2 w2) / (3 (w1 + w2)) from the first end."""
        x1, y1 = si(self.x1), si(self.y1)
        x2, y2 = si(self.x2), si(self.y2)
        w1 = si(self.w1)
        w2 = w1 if self.w2 is None else si(self.w2)
        L = math.hypot(x2 - x1, y2 - y1)
        W = 0.5 * (w1 + w2) * L
        t = 0.5 if w1 + w2 == 0 else (w1 + 2 * w2) / (3 * (w1 + w2))
        theta = float(self.angle.to("radian").magnitude)
        m, N = ureg.m, ureg.N
        # cos(-90°) is 6e-17, not 0: drop such round-off so no spurious component appears.
        cx, cy = (0.0 if abs(c) < 1e-12 else c for c in (math.cos(theta), math.sin(theta)))
        return PointForce(
            (x1 + t * (x2 - x1)) * m,
            (y1 + t * (y2 - y1)) * m,
            W * cx * N,
            W * cy * N,
            f"W_{self.label}",
        )


@dataclass(frozen=True)
class BodySupport:
    """A support (or link) holding the free body at a named point.

    Args:
        name: the point's name (``"A"``), used in the reaction names.
        x, y: the point, [length].
        kind: ``"pin"``, ``"roller"``, ``"fixed"`` or ``"link"``.
        angle: roller: inclination of the rolling surface (reaction normal to it); link: the
            direction of the link force, counter-clockwise from +x. Ignored otherwise.
    """

    name: str
    x: Qty
    y: Qty
    kind: BodySupportKind = "pin"
    angle: Qty = field(default_factory=lambda: 0.0 * ureg.degree)

    def __post_init__(self) -> None:
        _point(self.x, self.y, f"support {self.name}")
        if self.kind not in ("pin", "roller", "fixed", "link"):
            raise InputError(
                f"Support {self.name} must be 'pin', 'roller', 'fixed' or 'link' (got "
                f"{self.kind!r})",
                name=f"support {self.name}",
                value=self.kind,
                expected="a support kind",
            )
        require(self.angle, "[]", f"angle of support {self.name}")

    def unknowns(self) -> list[UnknownAction]:
        """The unknown reactions this support provides."""
        x, y = si(self.x), si(self.y)
        theta = float(self.angle.to("radian").magnitude)
        n = self.name
        if self.kind == "roller":
            return [UnknownAction(f"R_{n}", n, (x, y), (-math.sin(theta), math.cos(theta)))]
        if self.kind == "link":
            return [UnknownAction(f"F_{n}", n, (x, y), (math.cos(theta), math.sin(theta)))]
        out = [
            UnknownAction(f"R_{n}x", n, (x, y), (1.0, 0.0)),
            UnknownAction(f"R_{n}y", n, (x, y), (0.0, 1.0)),
        ]
        if self.kind == "fixed":
            out.append(UnknownAction(f"M_{n}", n, (x, y), None))
        return out


@dataclass(frozen=True)
class UnknownAction:
    """One unknown: a force of unknown size along a known line, or an unknown moment.

    Attributes:
        name: e.g. ``"R_Ax"``.
        support: the support it belongs to.
        point: a point on its line of action, (x, y) in metres.
        direction: its positive unit direction, or None for a moment (counter-clockwise).
    """

    name: str
    support: str
    point: tuple[float, float]
    direction: tuple[float, float] | None

    def row(self, about: tuple[float, float] = (0.0, 0.0)) -> tuple[float, float, float]:
        """Coefficients in ΣFx, ΣFy and ΣM about ``about`` of one unit of this unknown."""
        if self.direction is None:
            return 0.0, 0.0, 1.0
        dx, dy = self.direction
        rx, ry = self.point[0] - about[0], self.point[1] - about[1]
        return dx, dy, rx * dy - ry * dx


Load = PointForce | Couple | DistributedLoad


@dataclass(frozen=True, eq=False)
class FreeBody:
    """A rigid body in the plane with its known loads and its supports.

    Args:
        name: the body's label.
        loads: point forces, couples and distributed loads.
        supports: the supports and links holding it.
        points: optional named points (name -> (x, y)) the working may take moments about.
    """

    name: str
    loads: tuple[Load, ...]
    supports: tuple[BodySupport, ...]
    points: tuple[tuple[str, Qty, Qty], ...] = ()

    def __post_init__(self) -> None:
        object.__setattr__(self, "loads", tuple(self.loads))
        object.__setattr__(self, "supports", tuple(self.supports))
        object.__setattr__(self, "points", tuple(self.points))
        distinct("supports", [s.name for s in self.supports], what=f"support name on {self.name}")
        each_instance(
            "loads",
            self.loads,
            (PointForce, Couple, DistributedLoad),
            expected="a PointForce, Couple or DistributedLoad",
        )

    def unknowns(self) -> list[UnknownAction]:
        """Every unknown reaction, support by support."""
        return [u for s in self.supports for u in s.unknowns()]

    def point_loads(self) -> list[PointForce]:
        """The point forces, with each distributed load replaced by its resultant."""
        return [
            ld.resultant() if isinstance(ld, DistributedLoad) else ld
            for ld in self.loads
            if not isinstance(ld, Couple)
        ]

    def couples(self) -> list[Couple]:
        """The couples."""
        return [ld for ld in self.loads if isinstance(ld, Couple)]

    def named_points(self) -> list[tuple[str, tuple[float, float]]]:
        """The extra named points, then the support points, as (name, (x, y) in metres)."""
        out = [(n, (si(x), si(y))) for n, x, y in self.points]
        out += [(s.name, (si(s.x), si(s.y))) for s in self.supports]
        return out

    def scale_m(self) -> float:
        """The body's size in metres (for tolerances), at least 1 m."""
        pts = [p for _, p in self.named_points()] + [(si(f.x), si(f.y)) for f in self.point_loads()]
        if not pts:
            return 1.0
        arr = np.array(pts)
        return max(float(np.hypot(*(arr.max(axis=0) - arr.min(axis=0)))), 1.0)

    def known_totals(self, about: tuple[float, float] = (0.0, 0.0)) -> tuple[float, float, float]:
        """ΣFx, ΣFy (N) and ΣM about ``about`` (N·m) of the known loads."""
        fx = fy = m = 0.0
        for f in self.point_loads():
            px, py, Fx, Fy = si(f.x), si(f.y), si(f.Fx), si(f.Fy)
            fx, fy = fx + Fx, fy + Fy
            m += (px - about[0]) * Fy - (py - about[1]) * Fx
        for c in self.couples():
            m += si(c.M)
        return fx, fy, m


def line_intersection(
    p1: tuple[float, float],
    d1: tuple[float, float],
    p2: tuple[float, float],
    d2: tuple[float, float],
) -> tuple[float, float] | None:
    """Where the lines ``p1 + t d1`` and ``p2 + s d2`` meet, or None if they are parallel."""
    det = d1[0] * (-d2[1]) - d1[1] * (-d2[0])
    if abs(det) < 1e-12 * math.hypot(*d1) * math.hypot(*d2):
        return None
    bx, by = p2[0] - p1[0], p2[1] - p1[1]
    t = (bx * (-d2[1]) - by * (-d2[0])) / det
    return p1[0] + t * d1[0], p1[1] + t * d1[1]


@dataclass(frozen=True, eq=False)
class FreeBodyResult:
    """The reactions of a free body and the equations that found them.

    Attributes:
        body: the free body.
        reactions: unknown name -> value ([force], or [force × length] for a moment).
        unknowns: the unknowns, in support order.
        equations: the equations in the order taken.
    """

    body: FreeBody
    reactions: dict[str, Qty]
    unknowns: tuple[UnknownAction, ...]
    equations: tuple[EquilibriumEquation, ...]

    def reaction(self, name: str) -> Qty:
        """The reaction called ``name``."""
        return find("reaction", name, self.reactions, what="reaction", where=f"on {self.body.name}")

    def working(self) -> Any:
        """The free-body working (a :class:`calcpack.working.Block`): loads and resultants,
        each equation written, substituted and solved."""
        from calcpack.analysis.freebody_working import free_body_working

        return free_body_working(self)

    def sketch(self, **options: Any) -> Any:
        """A sketch of the free body with its loads and reactions (a
        :class:`calcpack.plots.freebody.FreeBodySketch`, shown inline as SVG)."""
        return views.render("sketch", self, **options)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> Any:
        return self.working()._repr_mimebundle_(include, exclude)

    def text(self) -> str:
        """Plain-text working."""
        return str(self.working().text())


def _dir(u: UnknownAction) -> tuple[float, float]:
    assert u.direction is not None
    return u.direction


def _diagnose(body: FreeBody, unknowns: Sequence[UnknownAction], rank: int) -> str:
    forces = [u for u in unknowns if u.direction is not None]
    names = ", ".join(u.name for u in unknowns)
    tol = _GEOM_REL
    if len(unknowns) < 3:
        return (
            f"{body.name} has only {len(unknowns)} unknown reaction(s) ({names or 'none'}); "
            "three are needed to hold a body in the plane"
        )
    d = _dir(forces[0]) if forces else (1.0, 0.0)
    parallel = all(abs(_dir(f)[0] * d[1] - _dir(f)[1] * d[0]) < tol for f in forces)
    if forces and parallel and len(forces) == len(unknowns):
        return (
            f"The reactions {names} of {body.name} are all parallel (direction "
            f"{math.degrees(math.atan2(d[1], d[0])):.0f}°), so nothing resists a force "
            "across them; add a support that acts in another direction"
        )
    if len(forces) == len(unknowns) and len(forces) >= 2:
        p = None
        for a in range(len(forces)):
            for b in range(a + 1, len(forces)):
                fa, fb = forces[a], forces[b]
                p = p or line_intersection(fa.point, _dir(fa), fb.point, _dir(fb))
        if p is not None:
            s = body.scale_m()
            px, py = (0.0 if abs(c) < 1e-9 * s else c for c in p)
            return (
                f"The lines of action of the reactions {names} of {body.name} all meet at "
                f"one point ({px:.3g} m, {py:.3g} m), so nothing resists a moment about it; "
                "move a support so its line of action misses that point"
            )
    return (
        f"The reactions {names} of {body.name} cannot hold it (rank {rank} of 3 "
        "equilibrium equations); rearrange the supports"
    )


def _rows(unknowns: Sequence[UnknownAction]) -> FloatArray:
    return np.array([u.row() for u in unknowns], dtype=float).reshape(-1, 3).T


def solve_free_body(body: FreeBody) -> FreeBodyResult:
    """Find the reactions of a free body from ΣFx = 0, ΣFy = 0, ΣM = 0.

    The equations are taken one unknown at a time where possible: moments about the point where
    two unknown lines of action meet (a pin, or the crossing of two reactions' lines), then
    force sums along directions that contain one unknown.

    Raises:
        OutOfScopeError: more than three unknowns (statically indeterminate).
        UnstableStructureError: the unknowns cannot hold the body (parallel, concurrent, too
            few), naming them.
    """
    return _solve(body, partial=False)


def solve_section(body: FreeBody) -> FreeBodyResult:
    """Like :func:`solve_free_body`, for a part of a structure known to be in equilibrium
    (a truss section): one to three unknowns, independent of each other.

    Raises:
        OutOfScopeError: more than three unknowns.
        UnstableStructureError: the unknowns' lines of action make them dependent (e.g. three
            cut members meeting at one point), naming them.
    """
    return _solve(body, partial=True)


def _solve(body: FreeBody, *, partial: bool) -> FreeBodyResult:
    unknowns = body.unknowns()
    if len(unknowns) > 3:
        raise OutOfScopeError(
            f"{body.name} has {len(unknowns)} unknown reactions ("
            f"{', '.join(u.name for u in unknowns)}), more than the three equations of plane "
            "equilibrium can find: it is statically indeterminate; analyse it with a method "
            "that uses stiffness, or release a support"
        )
    C = _rows(unknowns)
    sv = np.linalg.svd(C, compute_uv=False) if unknowns else np.zeros(0)
    scaled = np.abs(sv) / (float(sv[0]) if sv.size and sv[0] > 0 else 1.0)
    rank = int(np.sum(scaled > _RANK_REL))
    part = ", ".join(u.name for u in unknowns) or body.name
    if partial and (rank < len(unknowns) or not unknowns):
        raise UnstableStructureError(
            f"The unknowns {part} on {body.name} are not independent (rank {rank} of "
            f"{len(unknowns)}: their lines of action are parallel or meet at one point), so "
            "equilibrium of this free body cannot separate them; choose another cut",
            part=part,
        )
    if not partial and rank < 3:
        raise UnstableStructureError(_diagnose(body, unknowns, rank), part=part)
    b = np.array(body.known_totals())
    x = np.linalg.lstsq(C, -b, rcond=None)[0]
    values = {u.name: float(v) for u, v in zip(unknowns, x, strict=True)}
    from calcpack.analysis.freebody_plan import plan_equations

    equations = plan_equations(body, unknowns, values, moments_first=partial)
    reactions: dict[str, Qty] = {}
    for u in unknowns:
        q = values[u.name] * (ureg.N if u.direction is not None else ureg.N * ureg.m)
        reactions[u.name] = q.to("kN" if u.direction is not None else "kN*m")
    return FreeBodyResult(body, reactions, tuple(unknowns), tuple(equations))
