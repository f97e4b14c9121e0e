"""Resistance of an unstiffened web to a transverse force through the flange, BS EN 1993-1-5
§6 (with the UK National Annex: γ_M1 = 1.0), for the rolled I and H sections and channels of
:mod:`calcpack.sections.eurocode_tables`: type (a) (force resisted by shear in the web on both
sides, e.g. an interior support or a load) and type (c) (near an unstiffened end, e.g. the end
bearing of a beam on a padstone), Figure 6.1.

F_Rd = f_yw L_eff t_w/γ_M1 (6.1); L_eff = χ_F ℓ_y, χ_F = 0.5/λ̄_F ≤ 1 (6.3), λ̄_F = √(ℓ_y t_w
f_yw/F_cr) (6.4), F_cr = 0.9 k_F E t_w³/h_w (6.5); type (a) k_F = 6 (no transverse stiffeners),
type (c) k_F = 2 + 6 (s_s + c)/h_w ≤ 6; m_1 = f_yf b_f/(f_yw t_w) (6.8), m_2 = 0.02 (h_w/t_f)² if
λ̄_F > 0.5 else 0 (6.9); ℓ_y type (a) = s_s + 2t_f (1 + √(m_1 + m_2)) (6.10); type (c) the smaller
of (6.11) ℓ_e + t_f √(m_1/2 + (ℓ_e/t_f)² + m_2) and (6.12) ℓ_e + t_f √(m_1 + m_2), with
ℓ_e = k_F E t_w²/(2 f_yw h_w) ≤ s_s + c (6.13). s_s is the stiff bearing length (at most h_w).
The interaction with bending (§7.2) is not made: at a simple end support M = 0.
"""

from __future__ import annotations

from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.en1993.data import E_STEEL, EN1993, GAMMA_M, steel_grade_ec
from calcpack.errors import InputError
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of

__all__ = ["check_en1993_web_bearing"]

BearingType = Literal["a", "c"]


def check_en1993_web_bearing(
    section: EuroSection,
    grade: str,
    *,
    F_Ed: Quantity,
    ss: Quantity,
    c: Quantity | None = None,
    load_type: BearingType = "c",
    mark: str = "beam",
    combination: str | None = None,
) -> MemberChecks:
    """The web under a support reaction or load F_Ed through one flange (EN 1993-1-5 §6).

    Args:
        F_Ed: the design force [force]. ss: stiff bearing length (e.g. padstone length along
            the beam) [length]. c: distance from the end of the stiff bearing to the end of the
            beam (type c, default 0) [length]. load_type: ``"c"`` near an end, ``"a"`` elsewhere.

    Raises:
        InputError: a section that is not an I, H or channel; bad lengths.
    """
    require(F_Ed, "[force]", "F_Ed")
    require(ss, "[length]", "ss", positive=True)
    c = Q_(0.0, "mm") if c is None else c
    require(c, "[length]", "c", nonnegative=True)
    one_of("load_type", load_type, ("a", "c"))
    if section.tw is None or section.tf is None:
        raise InputError(
            f"Web bearing to EN 1993-1-5 §6 is for I, H and channel sections (got "
            f"{section.designation}, a {section.family})",
            name="section",
            value=section.designation,
            expected="a UB, UC, IPE, HE or PFC section",
        )
    g = steel_grade_ec(grade, max(section.tf, section.tw))

    def logic(r: Recorder) -> None:
        s = section
        r.heading("Web under a transverse force, EN 1993-1-5 §6", 3)
        FEd = r.given("F_Ed", F_Ed.to("kN"), "design force through the flange")
        fy = r.given("f_yw", g.fy, f"yield strength of web and flange, {g.grade}", source=g.source)
        E = r.given("E", E_STEEL, "modulus of elasticity", source="EN 1993-1-1 §3.2.6")
        gM1 = r.given(
            "gamma_M1", GAMMA_M["M1"].value, "partial factor", source=GAMMA_M["M1"].clause
        )
        tw = r.given("t_w", s.tw, "web thickness", source=s.source)
        tf = r.given("t_f", s.tf, "flange thickness", source=s.source)
        bf = r.given("b_f", s.b, "flange width", source=s.source)
        hw = r.given("h_w", s.hw, "clear web depth between flanges", source=s.source)
        s_s = r.given("s_s", min(ss, s.hw), "stiff bearing length (≤ h_w)", source="detail")
        if load_type == "c":
            cc = r.given("c", c, "end of stiff bearing to end of beam", source="detail")
            kF = r.derive(
                "k_F",
                r.min(2 + 6 * (s_s + cc) / hw, 6.0),
                "buckling coefficient, type (c)",
                ref="EN 1993-1-5 Figure 6.1",
            )
        else:
            kF = r.given(
                "k_F",
                6.0,
                "buckling coefficient, type (a), no transverse stiffeners",
                source="EN 1993-1-5 Figure 6.1",
            )
        Fcr = r.derive(
            "F_cr",
            0.9 * kF * E * tw**3 / hw,
            "critical force",
            unit="kN",
            ref="EN 1993-1-5 Eq. (6.5)",
        )
        m1 = r.derive("m_1", fy * bf / (fy * tw), "", ref="EN 1993-1-5 Eq. (6.8)")
        ly: Any = None
        lam: Any = None
        for with_m2 in (True, False):
            m2 = r.derive(
                "m_2",
                0.02 * (hw / tf) ** 2 if with_m2 else Q_(0.0, ""),
                "λ̄_F > 0.5" if with_m2 else "λ̄_F ≤ 0.5: m_2 = 0",
                ref="EN 1993-1-5 Eq. (6.9)",
            )
            if load_type == "c":
                le = r.derive(
                    "l_e",
                    r.min(kF * E * tw**2 / (2 * fy * hw), s_s + cc),
                    "",
                    unit="mm",
                    ref="EN 1993-1-5 Eq. (6.13)",
                )
                ly = r.derive(
                    "l_y",
                    r.min(
                        le + tf * r.sqrt(m1 / 2 + (le / tf) ** 2 + m2), le + tf * r.sqrt(m1 + m2)
                    ),
                    "effective loaded length",
                    unit="mm",
                    ref="EN 1993-1-5 Eq. (6.11), (6.12)",
                )
            else:
                ly = r.derive(
                    "l_y",
                    s_s + 2 * tf * (1 + r.sqrt(m1 + m2)),
                    "effective loaded length",
                    unit="mm",
                    ref="EN 1993-1-5 Eq. (6.10)",
                )
            lam = r.derive(
                "lambda_F", r.sqrt(ly * tw * fy / Fcr), "slenderness", ref="EN 1993-1-5 Eq. (6.4)"
            )
            if not with_m2 or r.f(lam) > 0.5:
                break
        chi = r.derive(
            "chi_F", r.min(0.5 / lam, 1.0), "reduction factor", ref="EN 1993-1-5 Eq. (6.3)"
        )
        Leff = r.derive(
            "L_eff",
            chi * ly,
            "effective length for resistance",
            unit="mm",
            ref="EN 1993-1-5 Eq. (6.2)",
        )
        FRd = r.derive(
            "F_Rd",
            fy * Leff * tw / gM1,
            "design resistance",
            unit="kN",
            ref="EN 1993-1-5 Eq. (6.1)",
        )
        r.check(
            "Web bearing (EN 1993-1-5 §6)",
            FEd,
            FRd,
            ref="EN 1993-1-5 §6.6",
            combination=combination,
        )

    title = f"{section.designation} {grade} web at a transverse force (type {load_type})"
    return run_checks(mark, title, EN1993, logic)
