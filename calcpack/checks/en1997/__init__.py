"""EN 1997-1:2004 (Eurocode 7) geotechnical checks: pad footings, Design Approach 1.

Recommended partial factors (Annex A) and the Annex D bearing resistance; the provisions and the
National Annex values must be confirmed against those adopted locally before issue.
"""

from calcpack.checks.en1997.pad import (
    DA1_FACTORS,
    EN1997,
    PresumedBearing,
    SoilStrength,
    check_en1997_pad,
    da1_combinations,
)

__all__ = [
    "DA1_FACTORS",
    "EN1997",
    "PresumedBearing",
    "SoilStrength",
    "check_en1997_pad",
    "da1_combinations",
]
