"""Steel members to BS EN 1993-1-1 with the UK National Annex (and EN 1993-1-5 §6 web bearing).

:func:`check_en1993_member` (one or more sets of design forces), :func:`check_en1993_beam`
(from combined beam results, with the restraint positions: M_cr from each segment's moment
diagram), :func:`check_en1993_web_bearing` (EN 1993-1-5 §6 at supports). Provisions must be
confirmed against the edition and National Annex adopted locally.
"""

from calcpack.checks.en1993.beam import check_en1993_beam, segment_mcr
from calcpack.checks.en1993.data import EN1993, steel_grade_ec
from calcpack.checks.en1993.ltb import critical_moment
from calcpack.checks.en1993.member import (
    DesignForces,
    SteelMemberEC,
    check_en1993_member,
    cm_linear,
)
from calcpack.checks.en1993.web import check_en1993_web_bearing

__all__ = [
    "EN1993",
    "DesignForces",
    "SteelMemberEC",
    "check_en1993_beam",
    "check_en1993_member",
    "check_en1993_web_bearing",
    "cm_linear",
    "critical_moment",
    "segment_mcr",
    "steel_grade_ec",
]
