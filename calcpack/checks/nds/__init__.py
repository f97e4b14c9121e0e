"""NDS 2018 (National Design Specification for Wood Construction, AWC) allowable stress design
of sawn-lumber bending members: bending (§3.3) and shear parallel to grain (§3.4) with the
adjustment factors of Table 4.3.1 applied and shown:

    F'_b = F_b · C_D · C_M · C_t · C_L · C_F · C_fu · C_i · C_r
    F'_v = F_v · C_D · C_M · C_t · C_i
    E'   = E · C_M · C_t · C_i,   E'_min = E_min · C_M · C_t · C_i

Reference design values are inputs with their source (e.g. NDS Supplement Table 4A for the
species and grade); nothing is assumed. C_D follows the shortest-duration load of each
combination (§2.3.2, Table 2.3.2), so every ASD combination is checked and the governing one
shown in full. C_F and C_fu follow the Table 4A rules for visually graded dimension lumber 2"
to 4" thick (give ``CF=`` with its source for other tables). Provisions should be confirmed
against the edition adopted locally.

Units: stresses as pint quantities (psi or MPa); nominal sizes in inches as numbers (the trade
names a 2x10 by its nominal inches); actual sizes as lengths.
"""

from calcpack.checks.nds.beam import check_nds_beam
from calcpack.checks.nds.factors import (
    DEFAULT_DURATIONS,
    DURATION_FACTORS,
    NDS_EDITION,
    ReferenceDesignValues,
    SawnMember,
    ServiceConditions,
    beam_stability_factor,
    effective_length,
    flat_use_factor,
    size_factor,
    temperature_factor,
    wet_service_factor,
)

__all__ = [
    "DEFAULT_DURATIONS",
    "DURATION_FACTORS",
    "NDS_EDITION",
    "ReferenceDesignValues",
    "SawnMember",
    "ServiceConditions",
    "beam_stability_factor",
    "check_nds_beam",
    "effective_length",
    "flat_use_factor",
    "size_factor",
    "temperature_factor",
    "wet_service_factor",
]
