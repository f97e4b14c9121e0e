"""Interaction of axial force and bending for the EN 1993-1-1 member checks: the cross-section
(§6.2.9: Eq. (6.31) with (6.36)-(6.40), biaxial (6.41), class 3 (6.42)) and the member (§6.3.3,
Eq. (6.61), (6.62) with the interaction factors of Annex B, Tables B.1, B.2 and C_m of B.3).
Written once as functions of a Recorder, called by :mod:`calcpack.checks.en1993.member`.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.checks.base import Recorder
from calcpack.checks.en1993.classify import Classification
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_
from calcpack.validate import required

if TYPE_CHECKING:
    from calcpack.checks.en1993.inputs import DesignForces, SteelMemberEC

if TYPE_CHECKING:
    from calcpack.checks.en1993.member import DesignForces

__all__ = ["annex_b", "axial_and_bending"]


def axial_and_bending(
    s: EuroSection,
    c: Recorder,
    cl: Classification,
    A: Any,
    fy: Any,
    gM0: Any,
    NEd: Any,
    N_Rd: Any,
    My: Any,
    McV_y: Any,
    Mz: Any,
    comb: str | None,
) -> None:
    ref = "EN 1993-1-1 §6.2.9"
    if cl.cls == 3:
        terms = NEd / N_Rd + My / (fy * s.Wel_y / gM0)
        if Mz is not None:
            terms = terms + Mz / (fy * s.Wel_z / gM0)
        u = c.derive("U_N_M", terms, "Eq. (6.42) with σ_x,Ed/(f_y/γ_M0), class 3", ref=ref)
        c.check(
            "Axial and bending (6.2.9)",
            u,
            Q_(1.0, ""),
            ref="EN 1993-1-1 Eq. (6.42)",
            combination=comb,
        )
        return
    n = c.derive("n", NEd / N_Rd, "N_Ed / N_pl,Rd", ref=ref)
    nf = c.f(n)
    if s.is_i_section:
        a = c.derive(
            "a", c.min((A - s.b * s.tf * 2) / A, 0.5), "web ratio", ref="EN 1993-1-1 §6.2.9.1(5)"
        )
        MNy = _reduced(c, "M_N_y_Rd", McV_y, n, a, "y-y", "EN 1993-1-1 Eq. (6.36)")
        af = c.f(a)
        if Mz is not None:
            Mpz = _plastic_z(c, fy, s, gM0)
            MNz = c.derive(
                "M_N_z_Rd",
                Mpz * (1 - ((n - a) / (1 - a)) ** 2) if nf > af else Mpz,
                "reduced plastic moment, z-z",
                unit="kN*m",
                ref="EN 1993-1-1 Eq. (6.37), (6.38)",
            )
        alpha, beta = 2.0, max(5 * nf, 1.0)
    elif s.family in ("SHS", "RHS"):
        t = s.t
        aw = c.derive(
            "a_w", c.min((A - s.b * t * 2) / A, 0.5), "web ratio", ref="EN 1993-1-1 §6.2.9.1(6)"
        )
        MNy = _reduced(c, "M_N_y_Rd", McV_y, n, aw, "y-y", "EN 1993-1-1 Eq. (6.39)")
        if Mz is not None:
            af = c.derive("a_f", c.min((A - s.h * t * 2) / A, 0.5), "flange ratio")
            Mpz = _plastic_z(c, fy, s, gM0)
            MNz = _reduced(c, "M_N_z_Rd", Mpz, n, af, "z-z", "EN 1993-1-1 Eq. (6.40)")
        alpha = beta = min(1.66 / (1 - 1.13 * nf**2), 6.0)
    else:  # CHS (and PFC: the same reduction is not given by §6.2.9 -- linear, safe side)
        k = 1.7 if s.family == "CHS" else 1.0
        MNy = c.derive(
            "M_N_y_Rd",
            McV_y * (1 - n**k),
            "reduced plastic moment",
            unit="kN*m",
            ref="EN 1993-1-1 §6.2.9.1 (CHS: M_pl(1 − n^1.7))",
        )
        if Mz is not None:
            MNz = c.derive(
                "M_N_z_Rd",
                fy * s.Wpl_z / gM0 * (1 - n**k),
                "reduced plastic moment, z-z",
                unit="kN*m",
            )
        alpha = beta = 2.0 if s.family == "CHS" else 1.0
    if Mz is None:
        c.check(
            "Axial and bending (6.2.9)", My, MNy, ref="EN 1993-1-1 Eq. (6.31)", combination=comb
        )
        return
    ry = c.given("r_N_y", c.f(c.q(My) / c.q(MNy)), "M_y,Ed / M_N,y,Rd")
    rz = c.given("r_N_z", c.f(c.q(Mz) / c.q(MNz)), "M_z,Ed / M_N,z,Rd")
    u = c.derive(
        "U_N_M",
        ry**alpha + rz**beta,
        f"biaxial bending, α = {alpha:.3g}, β = {beta:.3g}",
        ref="EN 1993-1-1 Eq. (6.41)",
    )
    c.check(
        "Axial and bending (6.2.9)",
        u,
        Q_(1.0, ""),
        ref="EN 1993-1-1 Eq. (6.41)",
        combination=comb,
    )


def annex_b(
    m: SteelMemberEC,
    c: Recorder,
    f: DesignForces,
    cl: Classification,
    A: Any,
    fy: Any,
    gM1: Any,
    Wy: Any,
    Wz: Any,
    chi: dict[str, Any],
    chiLT: Any,
    comb: str | None,
) -> None:
    s = m.section
    ref = "EN 1993-1-1 §6.3.3, Annex B"
    c.text(
        "Members in bending and axial compression: interaction factors by Annex B "
        "(the method the UK National Annex allows for either annex; Annex B chosen)."
    )
    NEd = c.given("N_Ed_b", c.q(f.N_Ed).to("kN"), "axial compression")
    My = c.given("M_y_Ed_b", c.q(f.My_Ed).to("kN*m"), "moment y-y")
    Mz = c.given("M_z_Ed_b", c.q(f.Mz_Ed).to("kN*m"), "moment z-z")
    (chy, lay), (chz, laz) = (
        required(
            f"Lcr_{ax}",
            chi[ax],
            expected="a length",
            when="for the Annex B interaction (both buckling lengths of the member)",
        )
        for ax in ("y", "z")
    )
    if chiLT is None:
        chiLT = c.given(
            "chi_LT",
            1.0,
            "the compression flange is restrained: no lateral-torsional buckling",
            source="EN 1993-1-1 §6.3.2",
        )
    Cmy = c.given("C_my", m.Cmy, "equivalent uniform moment factor", source="Annex B Table B.3")
    Cmz = c.given("C_mz", m.Cmz, "equivalent uniform moment factor", source="Annex B Table B.3")
    NRk = A * fy
    ny = c.derive("n_y", NEd / (chy * NRk / gM1), "N_Ed/(χ_y N_Rk/γ_M1)", ref=ref)
    nz = c.derive("n_z", NEd / (chz * NRk / gM1), "N_Ed/(χ_z N_Rk/γ_M1)", ref=ref)
    class3 = cl.cls == 3
    if class3:
        kyy = _k_b1(c, "k_yy", Cmy, 0.6 * lay * ny, 0.6 * ny)
        kzz = _k_b1(c, "k_zz", Cmz, 0.6 * laz * nz, 0.6 * nz)
        kyz = c.derive("k_yz", kzz, "", ref="Annex B Table B.1")
    else:
        kyy = _k_b1(c, "k_yy", Cmy, (lay - 0.2) * ny, 0.8 * ny)
        if s.is_i_section:
            kzz = _k_b1(c, "k_zz", Cmz, (2 * laz - 0.6) * nz, 1.4 * nz)
        else:
            kzz = _k_b1(c, "k_zz", Cmz, (laz - 0.2) * nz, 0.8 * nz)
        kyz = c.derive("k_yz", 0.6 * kzz, "", ref="Annex B Table B.1")
    torsional = s.is_i_section and f.L_LT is not None
    if torsional:
        CmLT = c.given(
            "C_mLT", m.CmLT, "equivalent uniform moment factor", source="Annex B Table B.3"
        )
        k = 0.05 if class3 else 0.1
        if not class3 and c.f(laz) < 0.4:
            kzy = c.derive(
                "k_zy",
                c.min(0.6 + laz, 1 - k * laz * nz / (CmLT - 0.25)),
                "",
                ref="Annex B Table B.2",
            )
        else:
            kzy = c.derive(
                "k_zy",
                c.max(1 - k * laz * nz / (CmLT - 0.25), 1 - k * nz / (CmLT - 0.25)),
                "",
                ref="Annex B Table B.2",
            )
    else:
        kzy = c.derive("k_zy", (0.8 if class3 else 0.6) * kyy, "", ref="Annex B Table B.1")
    MyRk, MzRk = Wy * fy, Wz * fy
    u1 = c.derive(
        "U_661",
        NEd / (chy * NRk / gM1) + kyy * My / (chiLT * MyRk / gM1) + kyz * Mz / (MzRk / gM1),
        "interaction about y-y",
        ref="EN 1993-1-1 Eq. (6.61)",
    )
    u2 = c.derive(
        "U_662",
        NEd / (chz * NRk / gM1) + kzy * My / (chiLT * MyRk / gM1) + kzz * Mz / (MzRk / gM1),
        "interaction about z-z",
        ref="EN 1993-1-1 Eq. (6.62)",
    )
    c.check("Bending and compression (6.61)", u1, Q_(1.0, ""), ref=ref, combination=comb)
    c.check("Bending and compression (6.62)", u2, Q_(1.0, ""), ref=ref, combination=comb)


def _plastic_z(c: Recorder, fy: Any, s: Any, gM0: Any) -> Any:
    """M_pl,z,Rd = W_pl,z f_y / γ_M0 (kN·m), EN 1993-1-1 Eq. (6.13)."""
    return c.derive(
        "M_pl_z_Rd",
        fy * s.Wpl_z / gM0,
        "plastic moment, z-z",
        unit="kN*m",
        ref="EN 1993-1-1 Eq. (6.13)",
    )


def _reduced(c: Recorder, name: str, Mpl: Any, n: Any, a: Any, axis: str, ref: str) -> Any:
    """M_N,Rd = M_pl,Rd (1 − n)/(1 − 0.5a) ≤ M_pl,Rd (kN·m), EN 1993-1-1 Eqs. (6.36), (6.39),
    (6.40): ``a`` the web (or flange) ratio."""
    return c.derive(
        name,
        c.min(Mpl * (1 - n) / (1 - 0.5 * a), Mpl),
        f"reduced plastic moment, {axis}",
        unit="kN*m",
        ref=ref,
    )


def _k_b1(c: Recorder, name: str, Cm: Any, first: Any, cap: Any) -> Any:
    """An interaction factor of Annex B Table B.1: C_m(1 + first) ≤ C_m(1 + cap)."""
    return c.derive(name, c.min(Cm * (1 + first), Cm * (1 + cap)), "", ref="Annex B Table B.1")
