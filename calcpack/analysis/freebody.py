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
from typing import Any, Literal

import numpy as np

from calcpack.analysis.truss_model import FloatArray, Qty
from calcpack.errors import InputError, OutOfScopeError, UnstableStructureError
from calcpack.units import require, si, ureg

__all__ = [
    "BodySupport",
    "Couple",
    "DistributedLoad",
    "EquationTerm",
    "EquilibriumEquation",
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
        names = [s.name for s in self.supports]
        for s in self.supports:
            if names.count(s.name) > 1:
                raise InputError(
                    f"Support name {s.name!r} is used twice on {self.name}",
                    name=f"support {s.name}",
                    value=s.name,
                    expected="unique support names",
                )
        for ld in self.loads:
            if not isinstance(ld, PointForce | Couple | DistributedLoad):
                raise InputError(
                    f"Loads on {self.name} must be PointForce, Couple or DistributedLoad "
                    f"(got {ld!r})",
                    name="loads",
                    value=ld,
                    expected="a load object",
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
        if name not in self.reactions:
            raise InputError(
                f"There is no reaction {name!r} on {self.body.name} (reactions: "
                f"{', '.join(self.reactions)})",
                name="reaction",
                value=name,
                expected="one of the reaction names",
            )
        return self.reactions[name]

    def working(self) -> Any:
        """The free-body working (a :class:`calcpack.working.Block`): loads and resultants,
        each equation written, substituted and solved."""
        return free_body_working(self)

    def sketch(self, **options: Any) -> Any:
        """A sketch of the free body with its loads and reactions (a
        :class:`calcpack.plots.truss.FreeBodySketch`, shown inline as SVG)."""
        from calcpack.plots.truss import FreeBodySketch

        return FreeBodySketch(self, **options)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> Any:
        return self.working()._repr_mimebundle_(include, exclude)

    def text(self) -> str:
        """Plain-text working."""
        return str(self.working().text())


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
    equations = _plan(body, unknowns, values, moments_first=partial)
    reactions: dict[str, Qty] = {}
    for u in unknowns:
        q = values[u.name] * (ureg.N if u.direction is not None else ureg.N * ureg.m)
        reactions[u.name] = q.to("kN" if u.direction is not None else "kN*m")
    return FreeBodyResult(body, reactions, tuple(unknowns), tuple(equations))


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


def _dir(u: UnknownAction) -> tuple[float, float]:
    assert u.direction is not None
    return u.direction


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


def _plan(
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


# -- working (built only when displayed) ------------------------------------------------------


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
