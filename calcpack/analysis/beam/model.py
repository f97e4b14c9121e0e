"""The beam model: a straight member on the x axis, its supports, hinges, stiffness and loads.

Model objects hold data and are checked when built; solving is done by
:func:`calcpack.analysis.beam.solve_beam`.

Sign convention: x from the left end (x = 0) to the right end (x = L). Loads are positive
downward; reactions positive upward (forces) and clockwise (moments, the same sense as applied
couples, so a fixed support's moment reaction at the left end equals the bending moment just
inside it).
"""

from __future__ import annotations

import itertools
import string
from collections.abc import Sequence
from dataclasses import dataclass, field
from functools import cached_property
from typing import TypeVar

from calcpack.analysis.beam.classify import BeamClassification, classify
from calcpack.errors import InputError, UnstableStructureError
from calcpack.loads._si import check as require
from calcpack.loads._si import fast_si as si
from calcpack.loads.types import FunctionLoad, Load, PointMoment, as_loads
from calcpack.units import Quantity
from calcpack.validate import distinct, each_instance, find

__all__ = [
    "Beam",
    "BeamClassification",
    "EISegment",
    "Fixed",
    "Hinge",
    "Pin",
    "Roller",
    "Spring",
    "Support",
    "classify",
]

_LENGTH = "[length]"


@dataclass(frozen=True)
class Support:
    """Base of supports at position ``x`` [length]. ``name`` defaults to A, B, C... by position.

    Attributes (class level): ``restrains_v``, ``restrains_h``, ``restrains_rotation``.
    """

    x: Quantity
    name: str | None = field(default=None, kw_only=True)

    kind = "support"
    restrains_v = True
    restrains_h = False
    restrains_rotation = False

    def __post_init__(self) -> None:
        require(self.x, _LENGTH, "x")

    @cached_property  # read many times on every solve; the position never changes
    def x_m(self) -> float:
        return si(self.x)

    @property
    def label(self) -> str:
        return self.name or "?"


@dataclass(frozen=True)
class Pin(Support):
    """A pin: restrains both translations (vertical and horizontal), free to rotate."""

    kind = "pin"
    restrains_h = True


@dataclass(frozen=True)
class Roller(Support):
    """A roller: restrains translation perpendicular to the beam only."""

    kind = "roller"


@dataclass(frozen=True)
class Fixed(Support):
    """A fixed support: restrains both translations and the rotation."""

    kind = "fixed"
    restrains_h = True
    restrains_rotation = True


@dataclass(frozen=True)
class Spring(Support):
    """An elastic support: a vertical spring ``k`` [force/length] and/or a rotational spring
    ``k_theta`` [force·length/angle]. Give at least one. It gives no horizontal restraint.

    The spring force is R = −k·v (v upward), the spring moment C = k_theta·θ (clockwise +, θ
    counter-clockwise +), both resisting the movement.
    """

    k: Quantity | None = None
    k_theta: Quantity | None = None

    kind = "spring"

    def __post_init__(self) -> None:
        super().__post_init__()
        if self.k is None and self.k_theta is None:
            raise InputError(
                f"Spring support at x = {self.x:~P} needs k (vertical) or k_theta (rotational) "
                "(got neither)",
                name="k",
                value=None,
                expected="a stiffness",
            )
        if self.k is not None:
            require(self.k, "[force] / [length]", "k", positive=True)
        if self.k_theta is not None:
            require(self.k_theta, "[force] * [length]", "k_theta", positive=True)

    @property
    def restrains_v(self) -> bool:  # type: ignore[override]
        return self.k is not None

    @property
    def restrains_rotation(self) -> bool:  # type: ignore[override]
        return self.k_theta is not None


@dataclass(frozen=True)
class Hinge:
    """An internal hinge at ``x`` [length]: the bending moment there is zero and the slope may
    jump. It passes shear and axial force."""

    x: Quantity
    name: str | None = field(default=None, kw_only=True)

    def __post_init__(self) -> None:
        require(self.x, _LENGTH, "x")

    @cached_property  # read many times on every solve; the position never changes
    def x_m(self) -> float:
        return si(self.x)


@dataclass(frozen=True)
class EISegment:
    """Flexural stiffness ``EI`` [force·length²] on ``start`` <= x <= ``end``."""

    start: Quantity
    end: Quantity
    EI: Quantity

    def __post_init__(self) -> None:
        require(self.start, _LENGTH, "start")
        require(self.end, _LENGTH, "end")
        require(self.EI, "[force] * [length] ** 2", "EI", positive=True)
        if not si(self.end) > si(self.start):
            raise InputError(
                f"EI segment end must be greater than its start (got start = {self.start:~P}, "
                f"end = {self.end:~P})",
                name="end",
                value=self.end,
                expected="end > start",
            )


_Named = TypeVar("_Named", Support, Hinge)


def _renamed(item: _Named, name: str) -> _Named:
    """A copy of a support or hinge called ``name``. Its inputs were checked when it was made,
    so the copy is not checked again (``dataclasses.replace`` would, for every support of every
    live rebuild)."""
    out = object.__new__(type(item))
    out.__dict__.update(item.__dict__)
    object.__setattr__(out, "name", name)
    return out


def _fmt(x_m: float) -> str:
    return f"{x_m:.4g} m"


@dataclass(frozen=True)
class Beam:
    """A straight beam on the x axis, from x = 0 (left end) to x = ``length``.

    Args:
        length: span L [length], > 0.
        supports: :class:`Pin`, :class:`Roller`, :class:`Fixed` or :class:`Spring` supports,
            at distinct positions on the beam. Names default to A, B, C... from the left.
        loads: the loads, each with its load case name (see :mod:`calcpack.loads`).
        EI: flexural stiffness [force·length²]: one quantity for the whole beam, a sequence of
            :class:`EISegment` covering 0..L without gaps, or None. EI is needed for deflections
            and for indeterminate or spring-supported beams.
        hinges: internal :class:`Hinge` positions, strictly inside the beam.
        EA: axial stiffness [force]; only its distribution matters, so None means "uniform",
            which is used to share an axial load between several horizontal restraints.
        name: the member mark, e.g. ``"B1"``.

    Raises:
        InputError: non-positive length, a support, hinge or load off the beam, two supports
            (or two hinges) at one position, a couple or a fixed support at a hinge, EI
            segments that do not cover the beam.
    """

    length: Quantity
    supports: Sequence[Support]
    loads: Sequence[Load] = ()
    EI: Quantity | Sequence[EISegment] | None = None
    hinges: Sequence[Hinge] = ()
    EA: Quantity | None = None
    name: str = "Beam"

    def __post_init__(self) -> None:
        L = require(self.length, _LENGTH, "length", positive=True)
        L_m = si(L)
        tol = 1e-9 * L_m
        supports = tuple(self.supports)
        each_instance("supports", supports, Support, expected="a Pin, Roller, Fixed or Spring")
        for i, s in enumerate(supports):
            if not -tol <= s.x_m <= L_m + tol:
                raise InputError(
                    f"Support supports[{i}] ({s.kind}) must lie on the beam, 0 <= x <= L (got x = "
                    f"{s.x:~P}, L = {L:~P})",
                    name=f"supports[{i}].x",
                    value=s.x,
                    expected=f"0 to {L:~P}",
                )
        supports = tuple(sorted(supports, key=lambda s: s.x_m))
        letters = iter(string.ascii_uppercase)
        named = []
        used = {s.name for s in supports if s.name}
        for s in supports:
            if s.name is None:
                label = next(letters)
                while label in used:
                    label = next(letters)
                used.add(label)
                s = _renamed(s, label)
            named.append(s)
        for s0, s1 in itertools.pairwise(named):
            if s1.x_m - s0.x_m <= tol:
                raise InputError(
                    f"Supports {s0.name} and {s1.name} overlap: two supports at one position "
                    f"(got x = {s0.x:~P} and {s1.x:~P}); use one support of the right kind",
                    name=f"supports[{s1.name}].x",
                    value=s1.x,
                    expected="distinct support positions",
                )
        distinct("supports.name", [s.name for s in named], what="support name")
        object.__setattr__(self, "supports", tuple(named))

        each_instance("hinges", self.hinges, Hinge, expected="a Hinge")
        hinges = tuple(sorted(self.hinges, key=lambda h: h.x_m))
        hinges = tuple(
            _renamed(h, f"H{i + 1}") if h.name is None else h for i, h in enumerate(hinges)
        )
        for i, h in enumerate(hinges):
            if not tol < h.x_m < L_m - tol:
                raise InputError(
                    f"Hinge must lie strictly inside the beam, 0 < x < L (got x = {h.x:~P}, "
                    f"L = {L:~P}); an end is already free to rotate",
                    name=f"hinges[{i}].x",
                    value=h.x,
                    expected=f"between 0 and {L:~P}",
                )
            for s in named:
                if s.restrains_rotation and abs(s.x_m - h.x_m) <= tol:
                    raise InputError(
                        f"A hinge cannot sit at the rotation-restraining support {s.name} (got "
                        f"hinge at x = {h.x:~P}); move the hinge or use a pin",
                        name=f"hinges[{i}].x",
                        value=h.x,
                        expected="a position away from fixed supports",
                    )
        for h0, h1 in itertools.pairwise(hinges):
            if h1.x_m - h0.x_m <= tol:
                raise InputError(
                    f"Two hinges at one position (got x = {h0.x:~P} and {h1.x:~P})",
                    name="hinges.x",
                    value=h1.x,
                    expected="distinct hinge positions",
                )
        object.__setattr__(self, "hinges", hinges)

        loads = tuple(load.resolved(L) for load in as_loads(self.loads))
        for i, load in enumerate(loads):
            for pos in load.positions():
                if not -tol <= si(pos) <= L_m + tol:
                    raise InputError(
                        f"Load loads[{i}] ({load.describe()}) lies off the beam: positions "
                        f"must be within 0 to L = {L:~P} (got {pos:~P})",
                        name=f"loads[{i}]",
                        value=pos,
                        expected=f"0 to {L:~P}",
                    )
            if isinstance(load, PointMoment):
                for h in hinges:
                    if abs(si(load.x) - h.x_m) <= tol:
                        raise InputError(
                            f"A couple at a hinge is ambiguous: which side carries it? (got "
                            f"loads[{i}] at x = {load.x:~P}, hinge {h.name}); apply it just "
                            "to one side of the hinge",
                            name=f"loads[{i}].x",
                            value=load.x,
                            expected="a position away from hinges",
                        )
            if isinstance(load, FunctionLoad):
                load.si_pieces()  # a function load that cannot be fitted is refused now
        object.__setattr__(self, "loads", loads)

        ei = self.EI
        if ei is not None and not isinstance(ei, Quantity):
            if isinstance(ei, int | float | str):
                raise InputError(
                    f"EI must be a quantity of force × length² or a list of EISegment (got "
                    f"EI = {ei!r}); write e.g. EI = 200 * ureg.GPa * 40e6 * ureg.mm**4",
                    name="EI",
                    value=ei,
                    expected="a quantity of [force]·[length]²",
                )
            each_instance("EI", ei, EISegment, expected="an EISegment(start, end, EI)")
            segs = tuple(sorted(ei, key=lambda s: si(s.start)))
            edges = [0.0] + [v for s in segs for v in (si(s.start), si(s.end))] + [L_m]
            for j in range(0, len(edges), 2):
                if abs(edges[j + 1] - edges[j]) > tol:
                    raise InputError(
                        f"EI segments must cover the beam from 0 to L = {L:~P} without gaps "
                        f"or overlaps (got a mismatch at x = {edges[j]:.6g} m / "
                        f"{edges[j + 1]:.6g} m)",
                        name="EI",
                        value=[(s.start, s.end) for s in segs],
                        expected="contiguous segments from 0 to L",
                    )
            object.__setattr__(self, "EI", segs)
        elif ei is not None:
            require(ei, "[force] * [length] ** 2", "EI", positive=True)
        if self.EA is not None:
            require(self.EA, "[force]", "EA", positive=True)

    # -- derived data ------------------------------------------------------------------------
    @cached_property  # read many times on every solve; the length never changes
    def L_m(self) -> float:
        return si(self.length)

    @property
    def cases(self) -> tuple[str, ...]:
        """The load case names in order of first appearance."""
        seen: dict[str, None] = {}
        for load in self.loads:
            seen.setdefault(load.case, None)
        return tuple(seen)

    def support(self, name: str) -> Support:
        """The support called ``name``."""
        by_name = {s.name: s for s in self.supports}
        return find("name", name, by_name, what="support", where=f"on beam {self.name}")

    def EI_segments_si(self) -> tuple[tuple[float, float, float], ...] | None:
        """(start m, end m, EI N·m²) for each stiffness segment, or None if EI is not given."""
        if self.EI is None:
            return None
        if isinstance(self.EI, Quantity):
            return ((0.0, self.L_m, si(self.EI)),)
        segs: Sequence[EISegment] = self.EI
        return tuple((si(s.start), si(s.end), si(s.EI)) for s in segs)

    def same_structure(self, other: Beam) -> bool:
        """True if ``other`` has the same length, supports, hinges and stiffness (loads aside)."""
        return (
            abs(self.L_m - other.L_m) <= 1e-12 * self.L_m
            and [(s.kind, s.name, s.x_m) for s in self.supports]
            == [(s.kind, s.name, s.x_m) for s in other.supports]
            and [h.x_m for h in self.hinges] == [h.x_m for h in other.hinges]
            and self.EI_segments_si() == other.EI_segments_si()
        )

    def classify(self) -> BeamClassification:
        """Determinate, indeterminate (degree n) or unstable (see :func:`classify`)."""
        return classify(self)

    def check_stable(self) -> BeamClassification:
        """The classification, or raise :class:`UnstableStructureError` saying why and the fix."""
        c = classify(self)
        if c.kind == "unstable":
            raise UnstableStructureError(f"Beam {self.name} is unstable: {c.reason}", part=c.part)
        return c
