"""Timber members to BS EN 1995-1-1 (Eurocode 5) with the UK National Annex.

:func:`check_en1995_member` (bending, lateral torsional stability, shear, compression with
buckling, combined, bearing), :func:`check_en1995_deflection` (final deflection with creep),
:func:`check_en1995_floor_vibration` (§7.3 residential floors); material values in
:mod:`calcpack.checks.en1995.values`. Provisions must be confirmed against the edition and
National Annex adopted locally.
"""

from calcpack.checks.en1995.members import (
    EN1995,
    TimberForcesEC,
    TimberMemberEC,
    check_en1995_member,
)
from calcpack.checks.en1995.serviceability import (
    check_en1995_deflection,
    check_en1995_floor_vibration,
)
from calcpack.checks.en1995.values import (
    DURATIONS,
    StrengthClass,
    combination_duration,
    gamma_M,
    k_def,
    k_mod,
    shortest_duration,
    strength_class,
)

__all__ = [
    "DURATIONS",
    "EN1995",
    "StrengthClass",
    "TimberForcesEC",
    "TimberMemberEC",
    "check_en1995_deflection",
    "check_en1995_floor_vibration",
    "check_en1995_member",
    "combination_duration",
    "gamma_M",
    "k_def",
    "k_mod",
    "shortest_duration",
    "strength_class",
]
