"""Beam analysis: exact reactions, shear, moment, slope and deflection of straight beams.

Model (:class:`Beam` with :class:`Pin`, :class:`Roller`, :class:`Fixed`, :class:`Spring`
supports, :class:`Hinge` and :class:`EISegment`), solvers (:func:`solve_beam`,
:func:`solve_cases`) and results (:class:`BeamResult`, :func:`combine`).

Sign convention: x from the left end; loads positive downward; reactions positive upward and
clockwise; V positive when the left face is pushed up (dV/dx = −w); M sagging positive
(dM/dx = V); slope counter-clockwise positive; deflection δ positive downward.
"""

from calcpack.analysis.beam.extremes import BeamExtremes, Extreme
from calcpack.analysis.beam.model import (
    Beam,
    BeamClassification,
    EISegment,
    Fixed,
    Hinge,
    Pin,
    Roller,
    Spring,
    Support,
    classify,
)
from calcpack.analysis.beam.result import BeamResult, Reaction, combine
from calcpack.analysis.beam.solve import solve_beam, solve_cases

__all__ = [
    "Beam",
    "BeamClassification",
    "BeamExtremes",
    "BeamResult",
    "EISegment",
    "Extreme",
    "Fixed",
    "Hinge",
    "Pin",
    "Reaction",
    "Roller",
    "Spring",
    "Support",
    "classify",
    "combine",
    "solve_beam",
    "solve_cases",
]
