"""Masonry to BS EN 1996-1-1 with the UK National Annex: concentrated loads (§6.1.3) under beam
ends and padstones (:func:`check_en1996_bearing`, sketch :meth:`MasonryBearing.svg`).
Provisions must be confirmed against the edition and National Annex adopted locally."""

from calcpack.checks.en1996.bearing import (
    EN1996,
    GAMMA_M_MASONRY,
    MasonryBearing,
    MasonryWall,
    Padstone,
    check_en1996_bearing,
    masonry_fk,
)

__all__ = [
    "EN1996",
    "GAMMA_M_MASONRY",
    "MasonryBearing",
    "MasonryWall",
    "Padstone",
    "check_en1996_bearing",
    "masonry_fk",
]
