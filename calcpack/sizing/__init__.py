"""Sizing by search: the lightest section that passes every check of a member.

:func:`lightest_sections` is the general search (any candidates, any trial built from calcpack's
checks); :func:`lightest_aisc_beam` searches the AISC Shapes Database for a steel beam and
:func:`lightest_nds_beam` the sawn sizes of an NDS species and grade for a timber beam;
:func:`lightest_glulam_beam` the glulam sizes of a stress class and :func:`lightest_nds_post`
the sawn posts and timbers of a species and grade.
"""

from calcpack.sizing.search import Candidate, SizingResult, Trial, lightest_sections
from calcpack.sizing.steel import DeflectionLimit, aisc_candidates, lightest_aisc_beam
from calcpack.sizing.timber import lightest_nds_beam, sawn_candidates
from calcpack.sizing.timber_members import lightest_glulam_beam, lightest_nds_post

__all__ = [
    "Candidate",
    "DeflectionLimit",
    "SizingResult",
    "Trial",
    "aisc_candidates",
    "lightest_aisc_beam",
    "lightest_glulam_beam",
    "lightest_nds_beam",
    "lightest_nds_post",
    "lightest_sections",
    "sawn_candidates",
]
