"""Plain (unreinforced) concrete footings and piers to ACI 318-19 Chapter 14.

* thickness used for strength h − 2 in. for concrete cast against soil (§14.5.1.7); a plain
  footing at least 8 in. thick (§14.3.2.1);
* flexure at the section for moment (§13.2.7.1): φMn = φ·5·λ·√f'c·Sm, Sm = b·h²/6
  (§14.5.2.1, Eq. 14.5.2.1a), φ = 0.60 (Table 21.2.1(g));
* one-way shear at h from the section for moment: φVn = φ·(4/3)·λ·√f'c·b·h (§14.5.5.1(a));
* two-way shear on the perimeter at h/2: φVn = φ·min(4/3 + 8/(3β), 2.66)·λ·√f'c·b0·h
  (§14.5.5.1(b));
* bearing (§14.5.6.1): φ·0.85·f'c·A1·√(A2/A1), √(A2/A1) ≤ 2, φ = 0.60.

A round pier embedded in soil carries axial load only here: bearing at its top and the soil
checks at its base; a moment or shear on a pier is NOT COVERED (its lateral design depends on
the soil's passive resistance). Clause numbers from memory; confirm against the edition adopted
locally.
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from calcpack.checks.aci318.bearing import bearing_on_footing
from calcpack.checks.aci318.footing_data import (
    ACI318_EDITION,
    ACIFootingDesign,
    FootingActions,
    column_aspect,
    factored_actions,
    punching_shear,
    two_way_perimeter,
    uplift_not_covered,
)
from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.model import CombinationSet
from calcpack.foundations.geometry import GEOTECHNICAL_CAUTION, Footing, FootingLoad
from calcpack.units import Q_

__all__ = ["check_plain_footing"]

PHI_PLAIN = 0.60  # Table 21.2.1(g)
PSI = Q_(1.0, "psi")
_STD = Standard(
    ACI318_EDITION,
    "Building Code Requirements for Structural Concrete, Chapter 14 plain concrete",
    "LRFD",
)


def check_plain_footing(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    combinations: CombinationSet,
    design: ACIFootingDesign,
) -> MemberChecks:
    """Check a plain concrete footing or pier to ACI 318-19 Chapter 14 (see the module notes)."""
    h_eff = footing.h - Q_(2, "inch")
    if h_eff.magnitude <= 0:
        h_eff = footing.h * 0.0 + Q_(1e-6, "inch")
    acts = factored_actions(footing, loads, combinations, design, depth_x=h_eff, depth_y=h_eff)
    loaded = any(
        ld.Mx.magnitude or ld.My.magnitude or ld.Vx.magnitude or ld.Vy.magnitude
        for ld in loads.values()
    )
    title = f"{footing.kind}, plain concrete to {ACI318_EDITION} Chapter 14"
    return run_checks(footing.mark, title, _STD, _PlainLogic(footing, acts, design, loaded))


class _PlainLogic:
    def __init__(self, f: Footing, a: FootingActions, dz: ACIFootingDesign, lateral: bool) -> None:
        self.f, self.a, self.dz, self.lateral = f, a, dz, lateral

    def __call__(self, c: Recorder) -> None:
        f, a, dz = self.f, self.a, self.dz
        c.caution(GEOTECHNICAL_CAUTION)
        c.heading("Materials and thickness", 3)
        fc = c.given("f_c_prime", dz.f_c, "specified concrete strength", unit="psi")
        lam = c.given(
            "lambda", dz.lam, "lightweight modification factor", source="ACI 318-19 Table 19.2.4.2"
        )
        sq = c.derive(
            "sqrt_fc",
            c.min(c.sqrt(fc * PSI), 100 * PSI),
            "√f'c in psi",
            unit="psi",
            ref="ACI 318-19 §22.5.3.1 (at most 100 psi)",
        )
        h = c.given("h", f.h, "thickness (length of a pier)", unit="inch")
        uplift_not_covered(
            c,
            a,
            "Uplift on plain concrete",
            "tension in plain concrete from uplift is not checked",
            "ACI 318-19 §14.1.3",
        )
        if f.kind == "pier":
            c.assume(
                "The pier is embedded in and laterally supported by the soil over its "
                "length (ACI 318-19 §14.1.3(a)); it carries axial load by bearing."
            )
            if self.lateral:
                c.not_covered(
                    "Pier under lateral load",
                    "moment or shear on a pier: its "
                    "embedment against the soil's lateral resistance is not covered",
                    ref="ACI 318-19 §14.1.3",
                )
            self._bearing(c, fc)
            return
        hmin = c.given(
            "h_min", Q_(8, "inch"), "minimum plain footing thickness", source="ACI 318-19 §14.3.2.1"
        )
        c.check("Minimum thickness", hmin, h, ref="ACI 318-19 §14.3.2.1")
        he = c.derive(
            "h_s",
            h - Q_(2, "inch"),
            "thickness for strength (cast against soil)",
            unit="inch",
            ref="ACI 318-19 §14.5.1.7",
        )
        if a.Pu.magnitude <= 0:
            return
        for dirn in (a.x, a.y):
            ax = dirn.axis
            c.heading(f"Flexure and one-way shear, sections across {ax}", 3)
            b = c.given(f"b_{ax}", dirn.width, "width of the section", unit="inch")
            Mu = c.given(
                f"M_u_{ax}",
                dirn.Mu,
                f"factored moment at the section for moment (§13.2.7.1), {dirn.Mu_combination}",
                source="net factored pressure beyond the section",
                unit="kip*ft",
            )
            Sm = c.derive(f"S_m_{ax}", b * he**2 / 6, "elastic section modulus", unit="inch**3")
            pMn = c.derive(
                f"phi_M_n_{ax}",
                PHI_PLAIN * 5 * lam * sq * Sm,
                "design flexural strength, φ = 0.60",
                unit="kip*ft",
                ref="ACI 318-19 Eq. 14.5.2.1a",
            )
            c.check(
                f"Flexure {ax}",
                Mu,
                pMn,
                ref="ACI 318-19 §14.5.2.1",
                combination=dirn.Mu_combination,
            )
            if dirn.Vu.magnitude <= 0:
                c.text("The shear section lies beyond the footing edge: no one-way shear.")
                continue
            Vu = c.given(
                f"V_u_{ax}",
                dirn.Vu,
                f"factored shear at h_s from the section, {dirn.Vu_combination}",
                source="net factored pressure beyond the section",
                unit="kip",
            )
            pVn = c.derive(
                f"phi_V_n_{ax}",
                PHI_PLAIN * 4 / 3 * lam * sq * b * he,
                "design one-way shear strength",
                unit="kip",
                ref="ACI 318-19 §14.5.5.1(a)",
            )
            c.check(
                f"One-way shear {ax}",
                Vu,
                pVn,
                ref="ACI 318-19 §14.5.5.1",
                combination=dirn.Vu_combination,
            )
        c.heading("Two-way shear, perimeter at h_s/2", 3)
        perimeter = two_way_perimeter(c, a, "h_s/2")
        if perimeter is not None:
            b0 = perimeter[2]
            Vu = punching_shear(c, a)
            beta = column_aspect(c, f.column)
            pVn = c.derive(
                "phi_V_n2",
                PHI_PLAIN * c.min(4 / 3 + 8 / (3 * beta), 2.66) * lam * sq * b0 * he,
                "design two-way shear strength",
                unit="kip",
                ref="ACI 318-19 §14.5.5.1(b)",
            )
            c.check(
                "Two-way shear", Vu, pVn, ref="ACI 318-19 §14.5.5.1", combination=a.Vu2_combination
            )
        self._bearing(c, fc)

    def _bearing(self, c: Recorder, fc: Any) -> None:
        a = self.a
        if a.Pu.magnitude <= 0:
            return
        c.heading("Bearing of the column or post", 3)
        bearing_on_footing(
            c,
            a,
            fc,
            phi=PHI_PLAIN,
            rule="ACI 318-19 §14.5.6.1, §22.8.3.2",
            strength_ref="ACI 318-19 §14.5.6.1",
            check_ref="ACI 318-19 §14.5.6",
        )
