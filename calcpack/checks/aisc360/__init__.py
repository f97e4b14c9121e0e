"""ANSI/AISC 360-16 checks of doubly symmetric rolled or built-up I-shapes in major-axis bending
(§F2: yielding and lateral-torsional buckling with L_p, L_r and C_b from the moment diagram)
and shear (§G2.1), in LRFD (§B3.1) or ASD (§B3.2), with the compactness limits of Table B4.1b.

Scope and refusals (never a silent number):

* flanges must be compact, b_f/2t_f <= λ_p = 0.38√(E/F_y) (Table B4.1b case 10), and the web
  compact, h/t_w <= λ_p = 3.76√(E/F_y) (case 15); otherwise §F3-F5 apply, which are not
  implemented: :class:`~calcpack.errors.OutOfScopeError` naming the limit (or a NOT COVERED
  result with ``on_out_of_scope="not covered"``);
* webs without transverse stiffeners only (k_v = 5.34), h/t_w <= 260;
* an unbraced length longer than the member is an input error.

Units: section properties as pint quantities (in, in², in³, in⁴, in⁶ or SI); F_y and E as
stresses. Moments are magnitudes (sagging or hogging: a doubly symmetric section is the same
either way). Provisions should be confirmed against the edition adopted locally.
"""

from calcpack.checks.aisc360.beam import (
    BeamCase,
    CombinedDemand,
    DirectDemand,
    PreparedDemand,
    check_aisc_beam,
    check_beam_case,
    prepare_demand,
)
from calcpack.checks.aisc360.shape import AISC360_EDITION, E_STEEL, IShape

__all__ = [
    "AISC360_EDITION",
    "E_STEEL",
    "BeamCase",
    "CombinedDemand",
    "DirectDemand",
    "IShape",
    "PreparedDemand",
    "check_aisc_beam",
    "check_beam_case",
    "prepare_demand",
]
