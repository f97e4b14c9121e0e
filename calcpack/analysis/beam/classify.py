"""Classifying a beam: statically determinate, indeterminate to degree n, or unstable (a
mechanism, named by the part that moves)."""

from __future__ import annotations

import itertools
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from calcpack.loads.types import si_parts

if TYPE_CHECKING:
    from calcpack.analysis.beam.model import Beam

__all__ = ["BeamClassification", "classify"]


def _fmt(x_m: float) -> str:
    return f"{x_m:.4g} m"


@dataclass(frozen=True)
class BeamClassification:
    """The beam's static classification.

    Attributes:
        kind: ``"determinate"``, ``"indeterminate"`` or ``"unstable"``.
        degree: total degree of static indeterminacy (bending + axial); 0 if determinate.
        degree_bending: redundant transverse reactions (vertical forces and moments).
        degree_axial: redundant horizontal reactions.
        axially_restrained: at least one support restrains horizontal movement. If False the
            beam is stable for transverse loads only, and an axial load is refused.
        reason: why the beam is unstable, and what would fix it ("" otherwise).
        part: the support, hinge or part at fault when unstable.
    """

    kind: str
    degree: int
    degree_bending: int
    degree_axial: int
    axially_restrained: bool
    reason: str = ""
    part: str | None = None

    def describe(self) -> str:
        """One line for a sheet, e.g. ``"statically indeterminate to degree 1"``."""
        if self.kind == "unstable":
            return f"unstable: {self.reason}"
        if self.kind == "determinate":
            text = "stable and statically determinate"
        else:
            text = f"statically indeterminate to degree {self.degree}"
            if self.degree_axial:
                text += (
                    f" ({self.degree_bending} in bending, {self.degree_axial} in the axial "
                    "direction)"
                )
        if not self.axially_restrained:
            text += "; no horizontal restraint, so for loads perpendicular to the beam only"
        return text


def _parts(beam: Beam) -> list[tuple[float, float]]:
    edges = [0.0, *(h.x_m for h in beam.hinges), beam.L_m]
    return list(itertools.pairwise(edges))


def classify(beam: Beam) -> BeamClassification:
    """Classify ``beam`` by its supports and hinges (loads aside, except axial components).

    Stability is decided kinematically: each rigid part between hinges has two freedoms
    (translation and rotation), tied at the hinges and restrained by the supports; the beam is
    stable if no movement is left (the rank of the constraint matrix equals the freedoms).
    Degree of indeterminacy = reactions − 2 − hinges (bending) plus horizontal restraints − 1.
    """
    parts = _parts(beam)
    n = len(parts)
    scale = beam.L_m
    tol = 1e-9 * scale

    def part_of(x: float) -> int:
        for p, (a, b) in enumerate(parts):
            if a - tol <= x <= b + tol:
                return p
        return n - 1

    # constraint rows (plain lists; numpy only for the rank): hinge continuity of displacement,
    # then each support's restraints
    rows: list[list[float]] = []
    for i in range(n - 1):
        row = [0.0] * (2 * n)
        a0, b0 = parts[i]
        row[2 * i] = 1.0
        row[2 * i + 1] = (b0 - a0) / scale
        row[2 * (i + 1)] = -1.0
        rows.append(row)
    n_v = 0
    n_rot = 0
    n_h = 0
    for s in beam.supports:
        p = part_of(s.x_m)
        a = parts[p][0]
        if s.restrains_v:
            n_v += 1
            row = [0.0] * (2 * n)
            row[2 * p] = 1.0
            row[2 * p + 1] = (s.x_m - a) / scale
            rows.append(row)
        if s.restrains_rotation:
            n_rot += 1
            row = [0.0] * (2 * n)
            row[2 * p + 1] = 1.0
            rows.append(row)
        if s.restrains_h:
            n_h += 1
    axial_load = any(p.H_N != 0.0 for load in beam.loads for p in si_parts(load)[1])
    degree_bending = n_v + n_rot - 2 - len(beam.hinges)
    degree_axial = max(n_h - 1, 0)
    B = np.array(rows) if rows else np.zeros((0, 2 * n))
    if n == 1:
        # one rigid part (no hinge): two vertical restraints (at distinct positions, checked
        # when the beam was made) or one vertical and one rotational restraint fix it
        rank = min(n_v, 2) if n_rot == 0 else min(n_v, 1) + 1
    else:
        rank = int(np.linalg.matrix_rank(B)) if rows else 0
    if not beam.supports:
        return BeamClassification(
            "unstable",
            0,
            degree_bending,
            0,
            False,
            reason="it has no supports; add a fixed support, or a pin and a roller",
            part=None,
        )
    if rank < 2 * n:
        reason, part = _describe_mechanism(beam, B, parts)
        return BeamClassification(
            "unstable", 0, degree_bending, degree_axial, n_h > 0, reason=reason, part=part
        )
    if axial_load and n_h == 0:
        return BeamClassification(
            "unstable",
            0,
            degree_bending,
            0,
            False,
            reason=(
                "a load has a component along the beam but no support restrains horizontal "
                "movement (rollers and springs only); make one support a pin or fixed"
            ),
            part=None,
        )
    degree = degree_bending + degree_axial
    kind = "determinate" if degree == 0 else "indeterminate"
    return BeamClassification(kind, degree, degree_bending, degree_axial, n_h > 0)


def _describe_mechanism(
    beam: Beam, B: np.ndarray, parts: list[tuple[float, float]]
) -> tuple[str, str | None]:
    _, sv, vt = np.linalg.svd(B) if B.size else (None, np.zeros(0), np.eye(B.shape[1]))
    rank = int(np.sum(sv > 1e-9 * (sv[0] if sv.size else 1.0)))
    mode = vt[rank]
    scale = beam.L_m
    moving = []
    for p, (a, b) in enumerate(parts):
        v0, th = mode[2 * p], mode[2 * p + 1] / scale
        if abs(v0) < 1e-9 and abs(th * scale) < 1e-9:
            continue
        if abs(th * scale) < 1e-9:
            motion = "can move up and down as a rigid body"
        else:
            pivot = a - v0 / th
            motion = f"can rotate about x = {_fmt(pivot)}"
        moving.append((a, b, motion))
    a, b, motion = moving[0]
    hinge_names = {round(h.x_m, 9): h.name for h in beam.hinges}
    ends = []
    for x in (a, b):
        if round(x, 9) in hinge_names:
            ends.append(f"hinge {hinge_names[round(x, 9)]} at x = {_fmt(x)}")
        else:
            ends.append(f"x = {_fmt(x)}")
    where = f"the part from {ends[0]} to {ends[1]}"
    part = next((hinge_names[round(x, 9)] for x in (a, b) if round(x, 9) in hinge_names), None)
    if not beam.hinges:
        where = "the beam"
        if len(beam.supports) == 1:
            s = beam.supports[0]
            return (
                f"the beam {motion} (only {s.kind} support {s.name}); add a second support or "
                "make it fixed",
                s.name,
            )
    return (
        f"{where} {motion}: the supports and hinges form a mechanism; add a support to that "
        "part, or remove a hinge",
        part,
    )
