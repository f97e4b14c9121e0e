"""Sizing by search: the lightest section that passes every check of a member.

:func:`lightest_sections` is the general search (any candidates, any trial built from calcpack's
checks); :func:`lightest_aisc_beam` searches the AISC Shapes Database for a steel beam and
:func:`lightest_nds_beam` the sawn sizes of an NDS species and grade (or several grades) for
a timber beam;
:func:`lightest_glulam_beam` the glulam sizes of a stress class and :func:`lightest_nds_post`
the sawn posts and timbers of a species and grade. Each has a ``*_space`` twin giving the
candidates and the trial, so one section is checked exactly as the search checks it.
"""

from calcpack.sizing.search import Candidate, SearchSpace, SizingResult, Trial, lightest_sections
from calcpack.sizing.steel import (
    DeflectionLimit,
    aisc_beam_space,
    aisc_candidates,
    lightest_aisc_beam,
)
from calcpack.sizing.timber import (
    GradedSize,
    lightest_nds_beam,
    nds_beam_space,
    nds_graded_beam_space,
    sawn_candidates,
)
from calcpack.sizing.timber_members import (
    glulam_beam_space,
    lightest_glulam_beam,
    lightest_nds_post,
    nds_post_member,
    nds_post_space,
)

__all__ = [
    "Candidate",
    "DeflectionLimit",
    "GradedSize",
    "SearchSpace",
    "SizingResult",
    "Trial",
    "aisc_beam_space",
    "aisc_candidates",
    "glulam_beam_space",
    "lightest_aisc_beam",
    "lightest_glulam_beam",
    "lightest_nds_beam",
    "lightest_nds_post",
    "lightest_sections",
    "nds_beam_space",
    "nds_graded_beam_space",
    "nds_post_member",
    "nds_post_space",
    "sawn_candidates",
]
