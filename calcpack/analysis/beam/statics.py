"""Which equilibrium equations give a beam's reactions, in which order, as data.

The engineer's order: ΣM about a hinge for the part on one side of it (M = 0 at the hinge),
ΣFy of the whole beam, ΣM of the whole beam about each support -- each taken as soon as it
holds exactly one reaction not yet known, so every equation gives one unknown. Reactions
already known (the redundants of the flexibility method) enter with their values.

Sign conventions: forces up +; moments in these equations counter-clockwise +; loads down +;
applied couples and moment reactions clockwise + (so they enter with a minus sign). Pure
numbers in SI (m, N, N·m), no working: :mod:`calcpack.analysis.beam.working` writes the plan
out step by step.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Literal

from calcpack.analysis.beam.core import shift_polynomial
from calcpack.analysis.beam.flexibility import Key, reaction_keys, reaction_symbol
from calcpack.analysis.beam.model import Beam
from calcpack.loads.resultants import resultant_si
from calcpack.loads.types import DistributedLoad, PointLoad, PointMoment, SIPiece
from calcpack.units import si

__all__ = [
    "ReactionTerm",
    "Region",
    "StaticsEquation",
    "StaticsPlan",
    "clip_pieces",
    "load_sum_si",
    "region_reactions",
    "statics_plan",
]

#: Where a part of the beam is cut: "" (the part includes actions at its right end), "left"
#: (cut just left of the end: actions there are left out).
CutSide = Literal["", "left"]


@dataclass(frozen=True)
class Region:
    """A part of the beam, lo <= x <= hi (m), and the point moments are taken about.

    Attributes:
        lo_m, hi_m: the part's ends (m from the left end).
        about_m: the moment point (m), or None for ΣFy.
        part: the suffix naming a partial load resultant on this part ("L", "R", "c").
        cut_side: "left" leaves out point actions at hi (a cut just left of it).
    """

    lo_m: float
    hi_m: float
    about_m: float | None
    part: str = ""
    cut_side: CutSide = ""

    def contains(self, x_m: float, tol: float) -> bool:
        if self.cut_side == "left":
            return self.lo_m - tol <= x_m < self.hi_m - tol
        return self.lo_m - tol <= x_m <= self.hi_m + tol


@dataclass(frozen=True)
class ReactionTerm:
    """A reaction in an equilibrium equation: ``coefficient × reaction``.

    Attributes:
        key: (support label, "Fy" or "C").
        arm_m: the lever arm x_support − x_about (m) of a vertical reaction in a moment
            equation; None in ΣFy and for a moment reaction.
        coefficient: the arm (m), 1 (a force in ΣFy) or −1 (a moment reaction, clockwise +, in
            a counter-clockwise sum).
    """

    key: Key
    arm_m: float | None
    coefficient: float

    @property
    def symbol(self) -> str:
        return reaction_symbol(self.key)


@dataclass(frozen=True)
class StaticsEquation:
    """One equilibrium equation, the reaction it gives and that reaction's value.

    Attributes:
        label: the equation as written (``\\Sigma M_{A} = 0``, TeX).
        description: the part of the beam and the sense taken.
        region: the part and the moment point.
        reactions: the reactions acting on the part (the one solved and those known).
        loads_si: the sum of the known loads' terms (N or N·m, in the equation's sense).
        solves: the reaction this equation gives.
        value_si: its value (N up +, or N·m clockwise +).
    """

    label: str
    description: str
    region: Region
    reactions: tuple[ReactionTerm, ...]
    loads_si: float
    solves: Key
    value_si: float


@dataclass(frozen=True)
class StaticsPlan:
    """The equations in the order taken; ``complete`` is False when some reactions stay
    coupled (no equation left holds exactly one unknown)."""

    equations: tuple[StaticsEquation, ...]
    complete: bool


def clip_pieces(pieces: tuple[SIPiece, ...], lo: float, hi: float) -> tuple[SIPiece, ...]:
    """The parts of SI load pieces on lo <= x <= hi (m), each re-expressed from its new start."""
    out = []
    for p in pieces:
        a, b = max(p.a_m, lo), min(p.b_m, hi)
        if b - a <= 1e-12 * max(abs(hi), 1.0):
            continue
        out.append(SIPiece(a, b, shift_polynomial(p.coeffs, a - p.a_m)))
    return tuple(out)


def region_reactions(beam: Beam, region: Region) -> tuple[ReactionTerm, ...]:
    """The reactions acting on ``region`` with their coefficients in its equation."""
    tol = 1e-9 * beam.L_m
    about = region.about_m
    out: list[ReactionTerm] = []
    for s in beam.supports:
        if not region.contains(s.x_m, tol):
            continue
        if s.restrains_v:
            if about is None:
                out.append(ReactionTerm((s.label, "Fy"), None, 1.0))
            elif abs(s.x_m - about) > tol:
                out.append(ReactionTerm((s.label, "Fy"), s.x_m - about, s.x_m - about))
        if s.restrains_rotation and about is not None:
            out.append(ReactionTerm((s.label, "C"), None, -1.0))
    return tuple(out)


def load_sum_si(beam: Beam, factors: Mapping[str, float], region: Region) -> float:
    """Σ of the factored loads' terms in the equation of ``region`` (N, or N·m ccw +)."""
    tol = 1e-9 * beam.L_m
    about = region.about_m
    total = 0.0
    for load in beam.loads:
        f = factors.get(load.case)
        if f is None:
            continue
        if isinstance(load, PointLoad):
            x = si(load.x)
            if region.contains(x, tol):
                P = f * si(load.P)
                total -= P if about is None else P * (x - about)
        elif isinstance(load, PointMoment):
            if about is not None and region.contains(si(load.x), tol):
                total -= f * si(load.C)
        elif isinstance(load, DistributedLoad):
            lo, hi = max(region.lo_m, load.a_m), min(region.hi_m, load.b_m)
            W, first = resultant_si(clip_pieces(load.si_pieces(), lo, hi))
            total -= f * (W if about is None else first - about * W)
    return total


def _candidates(beam: Beam) -> list[tuple[str, str, Region]]:
    L = beam.L_m
    out: list[tuple[str, str, Region]] = []
    for h in beam.hinges:
        label = rf"\Sigma M_{{{h.name}}} = 0"
        out.append(
            (
                label,
                f"part left of hinge {h.name} (M = 0 at the hinge)",
                Region(0.0, h.x_m, h.x_m, "L"),
            )
        )
        out.append(
            (
                label,
                f"part right of hinge {h.name} (M = 0 at the hinge)",
                Region(h.x_m, L, h.x_m, "R"),
            )
        )
    out.append((r"\Sigma F_y = 0", "whole beam, up +", Region(0.0, L, None)))
    for s in beam.supports:
        out.append(
            (
                rf"\Sigma M_{{{s.label}}} = 0",
                f"whole beam, moments about support {s.label}",
                Region(0.0, L, s.x_m),
            )
        )
    return out


def statics_plan(
    beam: Beam, factors: Mapping[str, float], known: Mapping[Key, float] | None = None
) -> StaticsPlan:
    """The equilibrium equations giving the beam's reactions one at a time.

    Args:
        beam: the beam (its supports, hinges and loads).
        factors: load case -> factor of the loads acting (a combination, or {case: 1}).
        known: reactions already found (N, or N·m clockwise +), e.g. the redundants.

    Returns:
        The plan; each equation's ``value_si`` solves it with the reactions found before it.
    """
    L = beam.L_m
    solved: dict[Key, float] = dict(known or {})
    wanted = reaction_keys(beam)
    cands = [(lab, desc, reg, region_reactions(beam, reg)) for lab, desc, reg in _candidates(beam)]
    used: set[int] = set()
    taken: list[StaticsEquation] = []
    progress = True
    while progress and any(k not in solved for k in wanted):
        progress = False
        for i, (label, desc, region, reactions) in enumerate(cands):
            if i in used:
                continue
            open_ = [r for r in reactions if r.key not in solved and abs(r.coefficient) > 1e-12 * L]
            if len(open_) != 1:
                continue
            used.add(i)
            progress = True
            target = open_[0]
            loads = load_sum_si(beam, factors, region)
            rest = loads + sum(
                r.coefficient * solved[r.key] for r in reactions if r.key != target.key
            )
            value = -rest / target.coefficient
            solved[target.key] = value
            taken.append(StaticsEquation(label, desc, region, reactions, loads, target.key, value))
            break
    return StaticsPlan(tuple(taken), all(k in solved for k in wanted))
