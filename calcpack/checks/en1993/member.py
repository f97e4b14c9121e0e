"""Steel members to BS EN 1993-1-1:2005+A1:2014 with the UK National Annex: cross-section
resistance (§6.2.4 compression, §6.2.5 bending, §6.2.6 shear, §6.2.8 bending and shear, §6.2.9
bending and axial force) and member buckling (§6.3.1 flexural, §6.3.2 lateral-torsional,
§6.3.3 bending and axial compression by Annex B), for the UB, UC, IPE, HE, RHS, SHS and CHS
sections of :mod:`calcpack.sections.eurocode_tables` (PFC: cross-section checks only).

Scope and refusals: class 4 sections (EN 1993-1-1 §6.2.2.5 with EN 1993-1-5 §4.4 effective
widths) and webs that buckle in shear (h_w/t_w > 72ε/η, EN 1993-1-5 §5) are refused; steel
thicker than the grade table (63 mm) is refused. η = 1.0 (UK NA to BS EN 1993-1-5, from
memory). No holes in the section (§6.2.3(2)b net sections are not covered). Lateral-torsional
buckling of channels (load not through the shear centre) is reported NOT COVERED.

Sign convention: N_Ed compression positive; moments and shears as magnitudes.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.en1993.classify import Classification, classify
from calcpack.checks.en1993.data import (
    ALPHA,
    E_STEEL,
    EN1993,
    G_STEEL,
    GAMMA_M,
    flexural_curves,
    ltb_curve,
    steel_grade_ec,
)
from calcpack.checks.en1993.inputs import DesignForces, SteelMemberEC, cm_linear
from calcpack.checks.en1993.interaction import annex_b, axial_and_bending
from calcpack.checks.en1993.ltb import chi_flexural, chi_lt, f_modification, mcr_uniform
from calcpack.errors import OutOfScopeError
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_, Quantity, si
from calcpack.validate import at_least, each_instance

__all__ = ["DesignForces", "SteelMemberEC", "check_en1993_member", "cm_linear"]


def _refuse_class_4(sec: EuroSection, cl: Classification, fy: Quantity) -> None:
    bad = [e for e in cl.elements if e.cls == 4]
    if bad:
        e = bad[0]
        raise OutOfScopeError(
            f"Section {sec.designation} ({fy:~P}) is class 4: {e.name} c/t = {e.ratio:.1f} > "
            f"{e.limits[2]:.1f} ({e.rule}, EN 1993-1-1 Table 5.2). Class 4 resistance needs the "
            "effective section of EN 1993-1-1 §6.2.2.5 with EN 1993-1-5 §4.4, not covered here"
        )


class _Logic:
    """The clauses, written once (numbers with Recorder, working with SheetRecorder)."""

    def __init__(self, m: SteelMemberEC, items: Sequence[DesignForces]) -> None:
        self.m, self.items = m, list(items)
        self.grade = steel_grade_ec(m.grade, m.thickness)
        self.cls = [
            classify(m.section, self.grade.fy, f.N_Ed, bending=si(f.My_Ed) != 0) for f in self.items
        ]
        for cl in self.cls:
            _refuse_class_4(m.section, cl, self.grade.fy)
        s = m.section
        if s.is_i_section or s.family == "PFC":
            assert s.tw is not None
            eps = math.sqrt(235 / float(self.grade.fy.to("MPa").magnitude))
            hw_tw = float((s.hw / s.tw).to("").magnitude)
            if hw_tw > 72 * eps / 1.0:
                raise OutOfScopeError(
                    f"Section {s.designation}: h_w/t_w = {hw_tw:.1f} > 72ε/η = {72 * eps:.1f}: "
                    "the web must be checked for shear buckling to EN 1993-1-5 §5, not covered"
                )

    def __call__(self, c: Recorder) -> None:
        s, g = self.m.section, self.grade
        c.heading("Section and material", 3)
        fy = c.given("f_y", g.fy, f"yield strength, {g.grade}", source=g.source)
        E = c.given("E", E_STEEL, "modulus of elasticity", source="EN 1993-1-1 §3.2.6")
        gM0 = c.given(
            "gamma_M0", GAMMA_M["M0"].value, "partial factor", source=GAMMA_M["M0"].clause
        )
        gM1 = c.given(
            "gamma_M1", GAMMA_M["M1"].value, "partial factor", source=GAMMA_M["M1"].clause
        )
        src = s.source
        A = c.given("A", s.A, f"area of {s.designation}", source=src)
        c.table(
            ["Property", "Value"],
            [
                ["W_pl,y", s.Wpl_y],
                ["W_el,y", s.Wel_y],
                ["W_pl,z", s.Wpl_z],
                ["W_el,z", s.Wel_z],
                ["I_y", s.Iy],
                ["I_z", s.Iz],
                ["I_t", s.It],
                ["I_w", s.Iw if s.Iw is not None else "—"],
            ],
            caption=f"{s.designation}: properties computed from the tabulated dimensions",
        )
        for i, f in enumerate(self.items):
            label = f.combination + (f", {f.where}" if f.where else "")
            c.heading(f"Design forces: {label}" if label else "Design forces", 3)
            self._one(c, f, self.cls[i], fy, E, gM0, gM1, A)

    # -- one set of forces ----------------------------------------------------------------
    def _one(
        self,
        c: Recorder,
        f: DesignForces,
        cl: Classification,
        fy: Any,
        E: Any,
        gM0: Any,
        gM1: Any,
        A: Any,
    ) -> None:
        s = self.m.section
        comb = f.combination or None
        rows = [
            [e.name, f"{e.ratio:.1f}", " / ".join(f"{x:.1f}" for x in e.limits), str(e.cls), e.rule]
            for e in cl.elements
        ]
        c.table(
            ["Element", "c/t", "Class 1 / 2 / 3 limits", "Class", "Table 5.2"],
            rows,
            caption=f"Classification, ε = {cl.epsilon:.3f}: class {cl.cls}",
        )
        plastic = cl.cls <= 2
        Wy = c.given(
            "W_y",
            s.Wpl_y if plastic else s.Wel_y,
            "W_pl,y (class 1, 2)" if plastic else "W_el,y (class 3)",
            source=s.source,
        )
        Wz = c.given(
            "W_z",
            s.Wpl_z if plastic else s.Wel_z,
            "W_pl,z (class 1, 2)" if plastic else "W_el,z (class 3)",
            source=s.source,
        )
        N = si(f.N_Ed)
        # -- §6.2.4 / §6.2.3 axial
        N_Rd = None
        if N != 0:
            NEd = c.given(
                "N_Ed",
                abs(f.N_Ed).to("kN"),
                "axial force, " + ("compression" if N > 0 else "tension"),
            )
            N_Rd = c.derive(
                "N_pl_Rd",
                A * fy / gM0,
                "axial resistance",
                unit="kN",
                ref="EN 1993-1-1 Eq. (6.10)" if N > 0 else "EN 1993-1-1 Eq. (6.6)",
            )
            c.check(
                "Axial (6.2.4)" if N > 0 else "Tension (6.2.3)",
                NEd,
                N_Rd,
                ref="EN 1993-1-1 §6.2.4" if N > 0 else "EN 1993-1-1 §6.2.3",
                combination=comb,
            )
        # -- §6.2.5 bending
        My = c.given("M_y_Ed", f.My_Ed.to("kN*m"), "bending moment about y-y")
        Mc_y = c.derive(
            "M_c_y_Rd",
            Wy * fy / gM0,
            "bending resistance, y-y",
            unit="kN*m",
            ref="EN 1993-1-1 Eq. (6.13), (6.14)",
        )
        Mz = None
        if si(f.Mz_Ed) != 0:
            Mz = c.given("M_z_Ed", f.Mz_Ed.to("kN*m"), "bending moment about z-z")
            Mc_z = c.derive(
                "M_c_z_Rd",
                Wz * fy / gM0,
                "bending resistance, z-z",
                unit="kN*m",
                ref="EN 1993-1-1 Eq. (6.13), (6.14)",
            )
        # -- §6.2.6 shear
        Av = c.derive(
            "A_v", self._shear_area(c, A), "shear area", unit="mm**2", ref="EN 1993-1-1 §6.2.6(3)"
        )
        V = c.given("V_Ed", f.V_Ed.to("kN"), "shear force")
        Vpl = c.derive(
            "V_pl_Rd",
            Av * (fy / c.sqrt(3)) / gM0,
            "plastic shear resistance",
            unit="kN",
            ref="EN 1993-1-1 Eq. (6.18)",
        )
        c.check("Shear (6.2.6)", V, Vpl, ref="EN 1993-1-1 §6.2.6", combination=comb)
        # -- §6.2.8 bending and shear
        McV_y = Mc_y
        if c.f(c.q(V) / c.q(Vpl)) > 0.5:
            rho = c.derive(
                "rho", (2 * V / Vpl - 1) ** 2, "shear reduction factor", ref="EN 1993-1-1 §6.2.8(3)"
            )
            if s.is_i_section:
                tw = c.given("t_w", s.tw, "web thickness", source=s.source)
                Aw = c.derive("A_w", tw * s.hw, "web area h_w t_w", unit="mm**2")
                McV_y = c.derive(
                    "M_y_V_Rd",
                    c.min((Wy - rho * Aw**2 / (4 * tw)) * fy / gM0, Mc_y),
                    "bending resistance reduced for shear",
                    unit="kN*m",
                    ref="EN 1993-1-1 Eq. (6.30)",
                )
            else:
                McV_y = c.derive(
                    "M_y_V_Rd",
                    (1 - rho) * Mc_y,
                    "bending resistance with f_y "
                    "reduced by (1 − ρ) over the whole section (on the safe side)",
                    unit="kN*m",
                    ref="EN 1993-1-1 §6.2.8(3)",
                )
        else:
            c.text(
                "V_Ed ≤ 0.5 V_pl,Rd: no reduction of the bending resistance for shear "
                "(EN 1993-1-1 §6.2.8(2))."
            )
        # -- §6.2.9 bending and axial force
        if N_Rd is not None and si(f.My_Ed) + si(f.Mz_Ed) > 0:
            axial_and_bending(self.m.section, c, cl, A, fy, gM0, NEd, N_Rd, My, McV_y, Mz, comb)
        else:
            c.check("Bending y-y (6.2.5)", My, McV_y, ref="EN 1993-1-1 §6.2.5", combination=comb)
            if Mz is not None:
                c.check("Bending z-z (6.2.5)", Mz, Mc_z, ref="EN 1993-1-1 §6.2.5", combination=comb)
        # -- §6.3 member buckling
        chi = {"y": None, "z": None}
        if N > 0:
            chi = self._flexural(c, f, A, fy, E, gM1, comb)
        chiLT = None
        if f.L_LT is not None and si(f.My_Ed) != 0:
            chiLT = self._ltb(c, f, Wy, fy, E, gM1, comb)
        if (
            N > 0
            and (chi["y"] is not None or chi["z"] is not None)
            and si(f.My_Ed) + si(f.Mz_Ed) > 0
        ):
            annex_b(self.m, c, f, cl, A, fy, gM1, Wy, Wz, chi, chiLT, comb)

    def _shear_area(self, c: Recorder, A: Any) -> Any:
        s = self.m.section
        if s.is_i_section or s.family == "PFC":
            b = c.given("b", s.b, "flange width", source=s.source)
            tf = c.given("t_f", s.tf, "flange thickness", source=s.source)
            tw = c.given("t_w", s.tw, "web thickness", source=s.source)
            r = c.given("r", s.r, "root radius", source=s.source)
            hw = c.given("h_w", s.hw, "web depth h − 2t_f", source=s.source)
            eta = c.given(
                "eta", 1.0, "shear area factor", source="UK NA to BS EN 1993-1-5 (from memory)"
            )
            k = 2 if s.family != "PFC" else 1
            return c.max(A - 2 * b * tf + (tw + k * r) * tf, eta * hw * tw)
        if s.family == "CHS":
            return 2 * A / c.pi
        h = c.given("h", s.h, "depth (load parallel to it)", source=s.source)
        b = c.given("b", s.b, "width", source=s.source)
        return A * h / (b + h)

    def _flexural(
        self, c: Recorder, f: DesignForces, A: Any, fy: Any, E: Any, gM1: Any, comb: str | None
    ) -> dict[str, Any]:
        m, s = self.m, self.m.section
        curves = flexural_curves(s)
        out: dict[str, Any] = {"y": None, "z": None}
        NEd = c.q(f.N_Ed).to("kN")
        for ax, L, I in (("y", m.Lcr_y, s.Iy), ("z", m.Lcr_z, s.Iz)):
            if L is None:
                continue
            Lc = c.given(f"L_cr_{ax}", L, f"buckling length about {ax}-{ax}", source="engineer")
            Ii = c.given(f"I_{ax}", I, f"second moment about {ax}-{ax}", source=s.source)
            Ncr = c.derive(
                f"N_cr_{ax}",
                c.pi**2 * E * Ii / Lc**2,
                "elastic critical force",
                unit="kN",
                ref="Euler",
            )
            lam = c.derive(
                f"lambda_{ax}",
                c.sqrt(A * fy / Ncr),
                "non-dimensional slenderness",
                ref="EN 1993-1-1 Eq. (6.49)",
            )
            al = ALPHA[curves[ax]]
            alpha = c.given(
                f"alpha_{ax}",
                al,
                f"imperfection factor, curve {curves[ax]}",
                source="EN 1993-1-1 Tables 6.1, 6.2",
            )
            lf = c.f(lam)
            if lf <= 0.2:
                chi = c.derive(f"chi_{ax}", Q_(1.0, ""), "λ̄ ≤ 0.2", ref="EN 1993-1-1 §6.3.1.2(4)")
            else:
                Phi = c.derive(
                    f"Phi_{ax}",
                    0.5 * (1 + alpha * (lam - 0.2) + lam**2),
                    "Φ",
                    ref="EN 1993-1-1 §6.3.1.2",
                )
                chi = c.derive(
                    f"chi_{ax}",
                    c.min(1 / (Phi + c.sqrt(Phi**2 - lam**2)), 1.0),
                    "reduction factor",
                    ref="EN 1993-1-1 Eq. (6.49)",
                )
            assert abs(c.f(chi) - chi_flexural(al, lf)) < 1e-9
            Nb = c.derive(
                f"N_b_{ax}_Rd",
                chi * A * fy / gM1,
                f"buckling resistance about {ax}-{ax}",
                unit="kN",
                ref="EN 1993-1-1 Eq. (6.47)",
            )
            c.check(
                f"Flexural buckling {ax}-{ax} (6.3.1)",
                NEd,
                Nb,
                ref="EN 1993-1-1 §6.3.1",
                combination=comb,
            )
            out[ax] = (chi, lam)
        return out

    def _ltb(
        self, c: Recorder, f: DesignForces, Wy: Any, fy: Any, E: Any, gM1: Any, comb: str | None
    ) -> Any:
        m, s = self.m, self.m.section
        if s.family == "PFC":
            c.not_covered(
                "Lateral-torsional buckling (6.3.2)",
                "channel sections are loaded "
                "off their shear centre; M_cr of a channel is not covered",
                ref="EN 1993-1-1 §6.3.2",
            )
            return None
        if s.family in ("SHS", "CHS"):
            c.text(
                "Square and circular hollow sections are not susceptible to lateral-torsional "
                "buckling (EN 1993-1-1 §6.3.2.1, I_z ≥ I_y): χ_LT = 1."
            )
            return None
        method = m.ltb_method if s.is_i_section else "6.3.2.2"
        if method != m.ltb_method:
            c.text(
                f"{s.designation}: §6.3.2.3 is for rolled I and H sections; the general case "
                "§6.3.2.2 is used (curve d, Table 6.4)."
            )
        L = c.given(
            "L_LT",
            f.L_LT,
            "length between lateral-torsional restraints (fork ends)",
            source="restraint positions",
        )
        G = c.given("G", G_STEEL, "shear modulus", source="EN 1993-1-1 §3.2.6")
        Iz = c.given("I_z", s.Iz, "second moment about z-z", source=s.source)
        It = c.given("I_t", s.It, "torsion constant", source=s.source)
        Iw = c.given("I_w", s.Iw, "warping constant", source=s.source)
        Mcr0 = c.derive(
            "M_cr_0",
            c.pi**2 * E * Iz / L**2 * c.sqrt(Iw / Iz + L**2 * G * It / (c.pi**2 * E * Iz)),
            "elastic critical moment, uniform moment (C_1 = 1), k = k_w = 1",
            unit="kN*m",
            ref="elastic critical moment of a fork-supported segment",
        )
        assert f.L_LT is not None
        num = mcr_uniform(
            si(E_STEEL), si(G_STEEL), si(s.Iz), si(s.It), si(s.Iw or Q_(0, "m**6")), si(f.L_LT)
        )
        assert abs(si(c.q(Mcr0)) / num - 1) < 1e-6
        if f.Mcr is not None:
            Mcr = c.given(
                "M_cr",
                f.Mcr.to("kN*m"),
                f"elastic critical moment from the moment diagram, loads at the {f.load_level}",
                source="Rayleigh-Ritz solution (calcpack.checks.en1993.ltb.critical_moment)",
            )
            C1 = c.derive("C_1", Mcr / Mcr0, "equivalent moment factor M_cr/M_cr,0")
        else:
            C1 = c.given(
                "C_1",
                f.C1,
                "moment diagram factor (loads at the shear centre)",
                source="engineer (1.0: uniform moment)",
            )
            Mcr = c.derive("M_cr", C1 * Mcr0, "elastic critical moment", unit="kN*m")
        lam = c.derive(
            "lambda_LT",
            c.sqrt(Wy * fy / Mcr),
            "non-dimensional slenderness",
            ref="EN 1993-1-1 §6.3.2.2(1)",
        )
        curve, src = ltb_curve(s, method)
        alpha = c.given("alpha_LT", ALPHA[curve], f"imperfection factor, curve {curve}", source=src)
        MEd = c.given("M_LT_Ed", (f.M_LT_Ed or f.My_Ed).to("kN*m"), "largest moment on the segment")
        lam0, beta = (0.2, 1.0) if method == "6.3.2.2" else (0.4, 0.75)
        ref = f"EN 1993-1-1 §{method}" + (", UK NA NA.2.17" if method == "6.3.2.3" else "")
        lf = c.f(lam)
        if lf <= lam0 or c.f(c.q(MEd) / c.q(Mcr)) <= lam0**2:
            c.text(
                f"λ̄_LT ≤ {lam0} or M_Ed/M_cr ≤ {lam0**2:g}: lateral-torsional buckling effects "
                "may be ignored (EN 1993-1-1 §6.3.2.2(4), §6.3.2.3(1))."
            )
            chi = c.derive("chi_LT", Q_(1.0, ""), "no reduction", ref=ref)
        else:
            Phi = c.derive(
                "Phi_LT",
                0.5 * (1 + alpha * (lam - lam0) + beta * lam**2),
                "Φ_LT",
                ref=ref + (f" (λ̄_LT,0 = {lam0}, β = {beta})"),
            )
            if method == "6.3.2.2":
                chi = c.derive(
                    "chi_LT",
                    c.min(1 / (Phi + c.sqrt(Phi**2 - lam**2)), 1.0),
                    "reduction factor",
                    ref="EN 1993-1-1 Eq. (6.56)",
                )
            else:
                chi0 = c.derive(
                    "chi_LT_0",
                    c.min(1 / (Phi + c.sqrt(Phi**2 - beta * lam**2)), 1.0, 1 / lam**2),
                    "reduction factor",
                    ref="EN 1993-1-1 Eq. (6.57)",
                )
                kc = c.derive(
                    "k_c",
                    1 / c.sqrt(C1),
                    "correction factor 1/√C_1",
                    ref="UK NA to BS EN 1993-1-1 NA.2.18",
                )
                fmod = c.derive(
                    "f",
                    c.min(1 - 0.5 * (1 - kc) * (1 - 2 * (lam - 0.8) ** 2), 1.0),
                    "modification factor",
                    ref="EN 1993-1-1 Eq. (6.58)",
                )
                chi = c.derive(
                    "chi_LT",
                    c.min(chi0 / fmod, 1.0, 1 / lam**2),
                    "modified reduction factor χ_LT,mod",
                    ref="EN 1993-1-1 Eq. (6.58)",
                )
                ref_chi = min(
                    chi_lt(alpha=ALPHA[curve], lam=lf, method=method) / f_modification(c.f(kc), lf),
                    1.0,
                    1 / lf**2,
                )
                assert abs(c.f(chi) - ref_chi) < 1e-9
        Mb = c.derive(
            "M_b_Rd",
            chi * Wy * fy / gM1,
            "buckling resistance moment",
            unit="kN*m",
            ref="EN 1993-1-1 Eq. (6.55)",
        )
        c.check(
            "Lateral-torsional buckling (6.3.2)",
            MEd,
            Mb,
            ref=ref,
            combination=comb,
            description=f.where,
        )
        return chi


def check_en1993_member(
    member: SteelMemberEC,
    forces: DesignForces | Sequence[DesignForces],
    *,
    mark: str = "member",
) -> MemberChecks:
    """Check ``member`` under ``forces`` (one set or several, e.g. one per combination).

    Raises:
        OutOfScopeError: class 4 section, web shear buckling, steel thicker than tabulated.
        InputError: inputs (each message names the input).
    """
    items = [forces] if isinstance(forces, DesignForces) else list(forces)
    at_least("forces", items, what="DesignForces")
    each_instance("forces", items, DesignForces, expected="DesignForces")
    logic = _Logic(member, items)
    s = member.section
    title = f"{s.designation} {member.grade} to {EN1993.code}"
    return run_checks(mark, title, EN1993, logic)
