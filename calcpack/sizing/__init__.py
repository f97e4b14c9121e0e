"""Sizing by search: the lightest section that passes every check of a member.

:func:`lightest_sections` is the general search (any candidates, any trial built from calcpack's
checks); :func:`lightest_aisc_beam` searches the AISC Shapes Database for a steel beam and
:func:`lightest_nds_beam` the sawn sizes of an NDS species and grade for a timber beam.
"""

from calcpack.sizing.search import Candidate, SizingResult, Trial, lightest_sections
from calcpack.sizing.steel import DeflectionLimit, aisc_candidates, lightest_aisc_beam
from calcpack.sizing.timber import lightest_nds_beam, sawn_candidates

__all__ = [
    "Candidate",
    "DeflectionLimit",
    "SizingResult",
    "Trial",
    "aisc_candidates",
    "lightest_aisc_beam",
    "lightest_nds_beam",
    "lightest_sections",
    "sawn_candidates",
]
