"""Pad footings and piers: geometry, loads by case, contact pressure and stability.

Computation only (no drawing or Jupyter imports). The concrete design checks live in
:mod:`calcpack.checks.aci318` and :mod:`calcpack.checks.en1992`, the Eurocode 7 bearing
resistance in :mod:`calcpack.checks.en1997`, the sketch in :mod:`calcpack.plots.footing`.
"""

from calcpack.foundations.geometry import (
    GEOTECHNICAL_CAUTION,
    Column,
    Footing,
    FootingLoad,
    SiteConditions,
    combine_footing_loads,
)
from calcpack.foundations.pressure import SoilPressure, soil_pressure
from calcpack.foundations.stability import (
    AllowableBearing,
    SafetyFactors,
    check_footing_soil,
    footing_combinations,
)

__all__ = [
    "GEOTECHNICAL_CAUTION",
    "AllowableBearing",
    "Column",
    "Footing",
    "FootingLoad",
    "SafetyFactors",
    "SiteConditions",
    "SoilPressure",
    "check_footing_soil",
    "combine_footing_loads",
    "footing_combinations",
    "soil_pressure",
]
