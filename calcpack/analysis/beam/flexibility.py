"""The flexibility method as data: which reactions are redundant, the released beam, and the
compatibility equations' coefficients and solution.

Redundant reactions X are removed to leave a stable, statically determinate released beam; its
movements at the redundants under the loads (Δ_i0) and under unit redundants (f_ij) give one
compatibility condition per redundant, Δ_i0 + Σ f_ij X_j (+ X_i/k_i on a spring) = 0. Pure
numbers (SI: m, rad, kN, kN·m), no working: :mod:`calcpack.analysis.beam.working` writes the
plan out step by step.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, replace

import numpy as np

from calcpack.analysis.beam.model import Beam, Fixed, Pin, Spring, Support
from calcpack.analysis.beam.result import BeamResult, combine
from calcpack.analysis.beam.solve import solve_beam
from calcpack.loads.types import PointLoad, PointMoment
from calcpack.units import Q_

__all__ = ["FlexibilityPlan", "flexibility_plan", "reaction_keys", "reaction_symbol"]

#: A reaction: (support label, "Fy" for the vertical force or "C" for the moment).
Key = tuple[str, str]


def reaction_keys(beam: Beam) -> list[Key]:
    """Every reaction component of the beam's supports, in support order."""
    keys = []
    for s in beam.supports:
        if s.restrains_v:
            keys.append((s.label, "Fy"))
        if s.restrains_rotation:
            keys.append((s.label, "C"))
    return keys


def reaction_symbol(key: Key) -> str:
    """The symbol of a reaction: R_A (vertical force), M_A (moment)."""
    name, comp = key
    return {"Fy": "R", "C": "M", "Fx": "H"}[comp] + "_" + name


@dataclass(frozen=True)
class FlexibilityPlan:
    """The flexibility method for one result.

    Attributes:
        redundants: the reactions taken as redundants, in order.
        released: the stable, determinate beam left when they are removed.
        D0: movement at each redundant under the loads (m upward, or rad clockwise).
        F: f_ij, movement at i under a unit redundant j (m or rad per kN or kN·m).
        spring_flexibility: 1/k_i for a redundant on a spring (m/kN or rad/(kN·m)), else 0.
        X: the redundants solved from the compatibility equations (kN or kN·m).
    """

    redundants: tuple[Key, ...]
    released: Beam
    D0: tuple[float, ...]
    F: tuple[tuple[float, ...], ...]
    spring_flexibility: tuple[float, ...]
    X: tuple[float, ...]

    @property
    def names(self) -> tuple[str, ...]:
        return tuple(reaction_symbol(k) for k in self.redundants)


def _released(beam: Beam, release: tuple[Key, ...]) -> Beam | None:
    supports: list[Support] = []
    for s in beam.supports:
        drop_v = (s.label, "Fy") in release
        drop_r = (s.label, "C") in release
        if not (drop_v or drop_r):
            supports.append(s)
        elif isinstance(s, Fixed):
            if drop_v:
                return None  # a fixed support without its vertical restraint: not modelled
            supports.append(Pin(s.x, name=s.name))
        elif isinstance(s, Spring):
            k = None if drop_v else s.k
            kt = None if drop_r else s.k_theta
            if k is not None or kt is not None:
                supports.append(Spring(s.x, k=k, k_theta=kt, name=s.name))
        # pins, rollers: removed
    loads = [replace(ld, H=Q_(0.0, "kN")) if isinstance(ld, PointLoad) else ld for ld in beam.loads]
    try:
        out = Beam(
            length=beam.length,
            supports=supports,
            loads=loads,
            EI=beam.EI,
            hinges=beam.hinges,
            name=beam.name,
        )
    except Exception:
        return None
    c = out.classify()
    if c.kind == "unstable" or c.degree_bending != 0:
        return None
    return out


def _choose_redundants(beam: Beam, n: int) -> tuple[tuple[Key, ...], Beam] | None:
    L = beam.L_m

    def preference(key: Key) -> tuple[int, float]:
        s = beam.support(key[0])
        interior = 0 if 1e-9 * L < s.x_m < L * (1 - 1e-9) else 1
        if key[1] == "C":
            return (1, 0.0)
        return (0 if interior == 0 else 2, abs(s.x_m - L / 2))

    for combo in itertools.combinations(sorted(reaction_keys(beam), key=preference), n):
        rel = _released(beam, combo)
        if rel is not None:
            return combo, rel
    return None


def flexibility_plan(result: BeamResult) -> FlexibilityPlan | None:
    """The flexibility method for an indeterminate result, or None when no set of redundants
    leaves a stable determinate beam (the working then tabulates the solver's reactions)."""
    beam = result.beam
    n = result.classification.degree_bending
    chosen = _choose_redundants(beam, n)
    if chosen is None:
        return None
    redundants, released = chosen
    factors = {c: f for c, f in result.cases if c in released.cases}
    base = combine({c: solve_beam(released, c) for c in factors}, factors) if factors else None

    def measure(r: BeamResult, key: Key) -> float:
        s = beam.support(key[0])
        if key[1] == "Fy":
            return -float(r.deflection(s.x).to("m").magnitude)  # upward movement, m
        return -float(r.slope(s.x).to("rad").magnitude)  # clockwise rotation, rad

    unit_results = []
    for key in redundants:
        s = beam.support(key[0])
        unit_load = (
            PointLoad(x=s.x, P=Q_(-1.0, "kN"), case="unit")
            if key[1] == "Fy"
            else PointMoment(x=s.x, C=Q_(1.0, "kN*m"), case="unit")
        )
        unit_results.append(solve_beam(replace(released, loads=[unit_load])))
    F = np.array([[measure(unit_results[j], ki) for j in range(n)] for ki in redundants])
    D0 = np.array([measure(base, k) if base is not None else 0.0 for k in redundants])
    flex = []
    for key in redundants:
        s = beam.support(key[0])
        if isinstance(s, Spring):
            k = s.k if key[1] == "Fy" else s.k_theta
            assert k is not None
            flex.append(1.0 / float(k.to("kN/m" if key[1] == "Fy" else "kN*m").magnitude))
        else:
            flex.append(0.0)
    X = np.linalg.solve(F + np.diag(flex), -D0)
    return FlexibilityPlan(
        redundants=tuple(redundants),
        released=released,
        D0=tuple(float(v) for v in D0),
        F=tuple(tuple(float(v) for v in row) for row in F),
        spring_flexibility=tuple(flex),
        X=tuple(float(v) for v in X),
    )
