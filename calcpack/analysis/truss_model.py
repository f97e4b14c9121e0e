"""Plane pin-jointed truss model: nodes, members, supports and joint loads (data only).

Coordinates are in the plane with x to the right and y up. Every input is a pint quantity;
the model is validated when it is built (duplicate or coincident nodes, members joining a node
to itself or to a missing node, zero-length members, supports or loads on missing nodes,
disconnected parts), so a solver never meets a malformed truss.

Sign conventions:
    * Joint loads ``Fx``, ``Fy`` are positive along +x (right) and +y (up).
    * A pin support reacts with two components ``R_<node>x`` and ``R_<node>y``, positive along
      +x and +y.
    * A roller reacts with one force normal to its rolling surface. The surface is inclined at
      ``surface`` (counter-clockwise from +x); the reaction ``R_<node>`` is positive along the
      normal ``(-sin θ, cos θ)``, i.e. upward for a level surface. A roller is taken to be held
      against lifting off (it resists either sense), as usual in truss analysis.

Load cases: every joint load carries a load-case name (``"D"``, ``"L"``, ``"Lr"``, ``"W"``...);
the solver analyses one case, or all loads together, and results can be factored and added
(see :mod:`calcpack.analysis.truss_solve`).
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Mapping, Sequence
from dataclasses import dataclass, field
from functools import cached_property
from typing import Any, Literal, TypeAlias

import numpy as np
import numpy.typing as npt

from calcpack import views
from calcpack.errors import InputError
from calcpack.units import Quantity, is_quantity, require, si, ureg
from calcpack.validate import at_least, each_instance, find, non_empty

__all__ = ["JointLoad", "Member", "Node", "Support", "Truss"]

Qty: TypeAlias = "Quantity[Any]"
"""A pint quantity of any magnitude type (annotations only)."""

FloatArray = npt.NDArray[np.float64]
SupportKind = Literal["pin", "roller"]

# Two nodes closer than this fraction of the truss's overall size are the same point.
_COINCIDENT_REL = 1e-9


def _check_name(name: object, what: str) -> str:
    non_empty(f"{what.lower()} name", name, expected="a name such as 'A'")
    assert isinstance(name, str)
    return name


@dataclass(frozen=True)
class Node:
    """A joint of the truss.

    Args:
        name: the joint's label (``"A"``, ``"L3"``...).
        x: horizontal coordinate, [length], positive to the right.
        y: vertical coordinate, [length], positive up.
    """

    name: str
    x: Qty
    y: Qty

    def __post_init__(self) -> None:
        _check_name(self.name, "Node")
        require(self.x, "[length]", f"x of node {self.name}")
        require(self.y, "[length]", f"y of node {self.name}")


@dataclass(frozen=True)
class Member:
    """A pin-ended two-force member between two nodes.

    Args:
        name: the member's label (``"AB"``, ``"U1"``...).
        start: name of the node at one end.
        end: name of the node at the other end.
        EA: axial rigidity, [force] (modulus times area), needed only by the stiffness method
            (statically indeterminate trusses, node displacements).
    """

    name: str
    start: str
    end: str
    EA: Qty | None = None

    def __post_init__(self) -> None:
        _check_name(self.name, "Member")
        if self.start == self.end:
            raise InputError(
                f"Member {self.name} joins node {self.start} to itself; a member must join two "
                f"different nodes (got start = end = {self.start!r})",
                name=f"member {self.name}",
                value=(self.start, self.end),
                expected="two different node names",
            )
        if self.EA is not None:
            require(self.EA, "[force]", f"EA of member {self.name}", positive=True)


@dataclass(frozen=True)
class Support:
    """A support at a node.

    Args:
        node: the supported node's name.
        kind: ``"pin"`` (two reaction components) or ``"roller"`` (one, normal to its surface).
        surface: roller only: the rolling surface's inclination, counter-clockwise from +x
            ([angle]; default level). The reaction is positive along ``(-sin θ, cos θ)``.
    """

    node: str
    kind: SupportKind = "pin"
    surface: Qty = field(default_factory=lambda: 0.0 * ureg.degree)

    def __post_init__(self) -> None:
        if self.kind not in ("pin", "roller"):
            raise InputError(
                f"Support kind at node {self.node} must be 'pin' or 'roller' (got {self.kind!r}); "
                "a truss joint cannot carry a fixed support's moment",
                name=f"support {self.node}",
                value=self.kind,
                expected="'pin' or 'roller'",
            )
        require(self.surface, "[]", f"surface angle of the support at {self.node}")

    def reaction_directions(self) -> list[tuple[str, tuple[float, float]]]:
        """Each reaction's name and its positive unit direction (global x, y)."""
        if self.kind == "pin":
            return [(f"R_{self.node}x", (1.0, 0.0)), (f"R_{self.node}y", (0.0, 1.0))]
        theta = float(self.surface.to("radian").magnitude)
        return [(f"R_{self.node}", (-math.sin(theta), math.cos(theta)))]


@dataclass(frozen=True)
class JointLoad:
    """A point load applied at a node, belonging to one load case.

    Args:
        node: the loaded node's name.
        Fx: horizontal component, [force], positive to the right.
        Fy: vertical component, [force], positive up (gravity loads are negative).
        case: load-case name (``"D"``, ``"L"``, ``"Lr"``, ``"S"``, ``"W"``...); default ``"D"``.
    """

    node: str
    Fx: Qty = field(default_factory=lambda: 0.0 * ureg.kN)
    Fy: Qty = field(default_factory=lambda: 0.0 * ureg.kN)
    case: str = "D"

    def __post_init__(self) -> None:
        require(self.Fx, "[force]", f"Fx of the load at {self.node}")
        require(self.Fy, "[force]", f"Fy of the load at {self.node}")
        _check_name(self.case, "Load case")

    @classmethod
    def polar(cls, node: str, P: Qty, angle: Qty, case: str = "D") -> JointLoad:
        """A load of magnitude ``P`` ([force]) acting at ``angle`` counter-clockwise from +x
        (so -90° is straight down)."""
        require(P, "[force]", f"P of the load at {node}")
        require(angle, "[]", f"angle of the load at {node}")
        theta = float(angle.to("radian").magnitude)
        return cls(node, P * math.cos(theta), P * math.sin(theta), case)


@dataclass(frozen=True, eq=False)
class Truss:
    """A plane pin-jointed truss, validated on construction.

    Args:
        nodes: the joints, as :class:`Node` objects.
        members: the members, as :class:`Member` objects.
        supports: the supports, at most one per node.
        loads: the joint loads (each with its load case).
        name: a label for sheets and figures.

    Raises:
        InputError: duplicate names, coincident nodes, zero-length members, members, supports
            or loads on missing nodes, parts not connected to the rest.

    :meth:`build` is a shorter way to write a truss from mappings.
    """

    nodes: tuple[Node, ...]
    members: tuple[Member, ...]
    supports: tuple[Support, ...]
    loads: tuple[JointLoad, ...] = ()
    name: str = "Truss"

    def __post_init__(self) -> None:
        for attr in ("nodes", "members", "supports", "loads"):
            object.__setattr__(self, attr, tuple(getattr(self, attr)))
        self._validate()

    # -- construction helpers -------------------------------------------------------------

    @classmethod
    def build(
        cls,
        *,
        nodes: Mapping[str, tuple[Qty, Qty]],
        members: Mapping[str, tuple[str, str]] | Iterable[tuple[str, str]],
        supports: Mapping[str, str | tuple[str, Qty]],
        loads: Iterable[JointLoad] = (),
        EA: Qty | Mapping[str, Qty] | None = None,
        name: str = "Truss",
    ) -> Truss:
        """Build a truss from mappings.

        Args:
            nodes: node name -> ``(x, y)``, [length].
            members: member name -> ``(start, end)``, or just ``(start, end)`` pairs, which are
                named by joining the node names (``("A", "B")`` -> ``"AB"``).
            supports: node name -> ``"pin"``, ``"roller"`` or ``("roller", surface angle)``.
            loads: joint loads.
            EA: one axial rigidity for every member, or member name -> EA ([force]).
            name: the truss's label.
        """
        node_objs = [Node(n, xy[0], xy[1]) for n, xy in nodes.items()]
        pairs: list[tuple[str, str, str]]
        if isinstance(members, Mapping):
            pairs = [(m, ends[0], ends[1]) for m, ends in members.items()]
        else:
            pairs = [(f"{a}{b}", a, b) for a, b in members]

        def ea_for(member: str) -> Qty | None:
            if EA is None or is_quantity(EA):
                return EA
            assert isinstance(EA, Mapping)
            return EA.get(member)

        member_objs = [Member(m, a, b, ea_for(m)) for m, a, b in pairs]
        support_objs = []
        for node, spec in supports.items():
            if isinstance(spec, str):
                support_objs.append(Support(node, spec))  # type: ignore[arg-type]
            else:
                support_objs.append(Support(node, spec[0], spec[1]))  # type: ignore[arg-type]
        return cls(node_objs, member_objs, support_objs, tuple(loads), name)  # type: ignore[arg-type]

    def with_loads(self, loads: Iterable[JointLoad]) -> Truss:
        """The same truss carrying ``loads`` instead of its own."""
        return Truss(self.nodes, self.members, self.supports, tuple(loads), self.name)

    def figures(self, *, dimensions: bool = True) -> Any:
        """Figures for a sheet (a :class:`calcpack.working.Block`): the geometry with joint and
        member names (and dimensions unless ``dimensions=False``), then the loads of each load
        case, one figure per case, unfactored."""
        from calcpack.analysis.truss_figures import truss_figures

        return truss_figures(self, dimensions=dimensions)

    def diagram(self, **options: Any) -> Any:
        """The truss drawn to scale with its supports and loads (a
        :class:`calcpack.plots.truss.TrussDiagram`, shown inline as SVG)."""
        return views.render("diagram", self, **options)

    # -- lookups --------------------------------------------------------------------------

    @cached_property
    def node_index(self) -> dict[str, int]:
        """Node name -> position in :attr:`nodes`."""
        return {n.name: i for i, n in enumerate(self.nodes)}

    @cached_property
    def member_index(self) -> dict[str, int]:
        """Member name -> position in :attr:`members`."""
        return {m.name: i for i, m in enumerate(self.members)}

    def node(self, name: str) -> Node:
        """The node called ``name``."""
        return self.nodes[find("node", name, self.node_index, what="node", where=self._where)]

    def member(self, name: str) -> Member:
        """The member called ``name``."""
        index = find("member", name, self.member_index, what="member", where=self._where)
        return self.members[index]

    @property
    def _where(self) -> str:
        return f"in truss {self.name}"

    def support_at(self, node: str) -> Support | None:
        """The support at ``node``, or None."""
        for s in self.supports:
            if s.node == node:
                return s
        return None

    def members_at(self, node: str) -> list[Member]:
        """The members meeting at ``node``, in input order."""
        return [m for m in self.members if node in (m.start, m.end)]

    @property
    def load_cases(self) -> tuple[str, ...]:
        """The load-case names present, in order of first appearance."""
        return tuple(dict.fromkeys(ld.case for ld in self.loads))

    # -- numeric geometry (SI floats) -----------------------------------------------------

    @cached_property
    def xy_m(self) -> FloatArray:
        """Node coordinates, an (nodes, 2) array in metres."""
        return np.array([[si(n.x), si(n.y)] for n in self.nodes], dtype=float).reshape(-1, 2)

    @cached_property
    def member_ends(self) -> list[tuple[int, int]]:
        """Each member's (start, end) node indices."""
        idx = self.node_index
        return [(idx[m.start], idx[m.end]) for m in self.members]

    @cached_property
    def lengths_m(self) -> FloatArray:
        """Member lengths in metres."""
        xy = self.xy_m
        return np.array([float(np.hypot(*(xy[e] - xy[s]))) for s, e in self.member_ends])

    @cached_property
    def unit_vectors(self) -> FloatArray:
        """Each member's unit vector from its start node to its end node, (members, 2)."""
        xy = self.xy_m
        out = np.zeros((len(self.members), 2))
        for k, (s, e) in enumerate(self.member_ends):
            out[k] = (xy[e] - xy[s]) / self.lengths_m[k]
        return out

    @cached_property
    def reactions(self) -> list[tuple[str, int, tuple[float, float]]]:
        """Each reaction component: name, node index and positive unit direction."""
        out = []
        for s in self.supports:
            for name, d in s.reaction_directions():
                out.append((name, self.node_index[s.node], d))
        return out

    @property
    def size_m(self) -> float:
        """The truss's overall size (bounding-box diagonal) in metres, at least 1e-300."""
        xy = self.xy_m
        span = xy.max(axis=0) - xy.min(axis=0) if len(xy) else np.zeros(2)
        return max(float(np.hypot(*span)), 1e-300)

    def load_vector(
        self, case: str | None = None, factors: Mapping[str, float] | None = None
    ) -> FloatArray:
        """Net applied load at each node in newtons, ``[Fx0, Fy0, Fx1, ...]``.

        Args:
            case: only this load case; None for every load as given.
            factors: alternatively, load-case name -> factor (cases not named are left out).
        """
        p = np.zeros(2 * len(self.nodes))
        for ld in self.loads:
            if factors is not None:
                f = factors.get(ld.case, 0.0)
            else:
                f = 1.0 if case is None or ld.case == case else 0.0
            i = self.node_index[ld.node]
            p[2 * i] += f * si(ld.Fx)
            p[2 * i + 1] += f * si(ld.Fy)
        return p

    # -- validation ------------------------------------------------------------------------

    def _validate(self) -> None:
        _check_name(self.name, "Truss")
        at_least("nodes", self.nodes, what="node")
        _require_unique_names(self.nodes, Node, "node", "Node(name, x, y)")
        xy = self.xy_m
        tol = _COINCIDENT_REL * self.size_m
        for i in range(len(self.nodes)):
            d = np.hypot(*(xy[i + 1 :] - xy[i]).T) if i + 1 < len(xy) else np.array([])
            close = np.nonzero(d <= tol)[0]
            if close.size:
                a, b = self.nodes[i], self.nodes[i + 1 + int(close[0])]
                raise InputError(
                    f"Nodes {a.name} and {b.name} are at the same point ({a.x:~P}, {a.y:~P}); "
                    "merge them into one node",
                    name=f"node {b.name}",
                    value=(b.x, b.y),
                    expected="distinct coordinates",
                )
        self._validate_members()
        self._validate_supports_and_loads()
        self._validate_connected()

    def _validate_members(self) -> None:
        _require_unique_names(self.members, Member, "member", "Member(name, start, end)")
        pairs: dict[frozenset[str], str] = {}
        for m in self.members:
            for end in (m.start, m.end):
                self._require_node(end, f"member {m.name}", f"Member {m.name} refers to node")
            key = frozenset((m.start, m.end))
            if key in pairs:
                raise InputError(
                    f"Members {pairs[key]} and {m.name} both join nodes {m.start} and {m.end}; "
                    "give one member (with the combined EA if they act together)",
                    name=f"member {m.name}",
                    value=(m.start, m.end),
                    expected="one member per pair of nodes",
                )
            pairs[key] = m.name
        tol = _COINCIDENT_REL * self.size_m
        for m, length in zip(self.members, self.lengths_m, strict=True):
            if not length > tol:
                raise InputError(
                    f"Member {m.name} has zero length (nodes {m.start} and {m.end} coincide)",
                    name=f"member {m.name}",
                    value=(m.start, m.end),
                    expected="a member of non-zero length",
                )

    def _validate_supports_and_loads(self) -> None:
        supported: set[str] = set()
        each_instance("supports", self.supports, Support, expected="a Support(node, kind)")
        for s in self.supports:
            self._require_node(s.node, f"support {s.node}", "A support is placed on node")
            if s.node in supported:
                raise InputError(
                    f"Node {s.node} has two supports; give one (a pin restrains both directions)",
                    name=f"support {s.node}",
                    value=s.node,
                    expected="one support per node",
                )
            supported.add(s.node)
        each_instance("loads", self.loads, JointLoad, expected="a JointLoad(node, Fx, Fy)")
        for ld in self.loads:
            said = f"A load (case {ld.case}) is applied at node"
            self._require_node(ld.node, f"load at {ld.node}", said)

    def _require_node(self, node: str, name: str, said: str) -> None:
        """Refuse a reference to a node the truss does not have, in the words of the input that
        refers to it (``said``: "Member M1 refers to node")."""
        if node not in self.node_index:
            raise InputError(
                f"{said} {node!r}, which is not in the truss (nodes: {', '.join(self.node_index)})",
                name=name,
                value=node,
                expected="an existing node name",
            )

    def _validate_connected(self) -> None:
        adjacency: dict[int, set[int]] = {i: set() for i in range(len(self.nodes))}
        for s, e in self.member_ends:
            adjacency[s].add(e)
            adjacency[e].add(s)
        seen = {0}
        stack = [0]
        while stack:
            for j in adjacency[stack.pop()]:
                if j not in seen:
                    seen.add(j)
                    stack.append(j)
        if len(seen) == len(self.nodes):
            return
        apart = [n.name for i, n in enumerate(self.nodes) if i not in seen]
        lonely = [name for name in apart if not adjacency[self.node_index[name]]]
        if lonely:
            raise InputError(
                f"Node {lonely[0]} is not connected to any member; connect it or remove it",
                name=f"node {lonely[0]}",
                value=lonely[0],
                expected="a node with members",
            )
        raise InputError(
            f"The truss is in disconnected parts: nodes {', '.join(apart)} are not joined by "
            f"members to node {self.nodes[0].name}; analyse each part as its own truss",
            name="members",
            value=apart,
            expected="one connected truss",
        )


def _require_unique_names(
    items: Sequence[Node] | Sequence[Member], kind: type, what: str, form: str
) -> None:
    """Refuse an item of the wrong type or a name used twice (``what``: "node" or "member")."""
    each_instance(f"{what}s", items, kind, expected=f"a {form}")
    seen: set[str] = set()
    for item in items:
        name: str = item.name
        if name in seen:
            raise InputError(
                f"{what.capitalize()} name {name!r} is used twice; each {what} needs its own name",
                name=f"{what} {name}",
                value=name,
                expected=f"unique {what} names",
            )
        seen.add(name)
