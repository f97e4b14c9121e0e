"""Reinforced concrete pad footings to ACI 318-19 (strength design), every clause shown.

Implements, for a footing under one column (net factored soil pressure, see
:mod:`calcpack.checks.aci318.footing_data`):

* flexure at the critical section §13.2.7.1: required steel from φMn = φ·As·fy·(d − a/2)
  (§22.2, rectangular stress block §22.2.2.4), φ by strain Table 21.2.2, minimum steel
  0.0018·Ag (§13.3.3.1 → §8.6.1.1; 0.0020·Ag below Grade 60), bar count, spacing at most
  min(2h, 18 in.) (§8.7.2.2) and clear spacing at least max(1 in., d_b, 4/3·d_agg) (§25.2.1);
  the band of the short-direction steel in a rectangular footing (§13.3.3.3);
* one-way shear at d from the section for moment (§13.2.7.2, §22.5): without shear
  reinforcement Vc = 8·λs·λ·ρw^(1/3)·√f'c·bw·d ≤ 5·λ·√f'c·bw·d (Table 22.5.5.1(c),
  §22.5.5.1.1), λs = √(2/(1 + d/10 in.)) ≤ 1 (§22.5.5.1.3), φ = 0.75;
* two-way shear on the perimeter at d/2 (§22.6.4.1): vc the least of 4, 2 + 4/β and
  2 + αs·d/b0 times λs·λ·√f'c (Table 22.6.5.2, αs = 40 interior), with the shear from moment
  transfer γv·Msc·c/Jc (§8.4.4.2, R8.4.4.2.3) from the column moments;
* development of the straight bottom bars §25.4.2.4 (ψs, ψg, (cb + Ktr)/db ≤ 2.5, at least
  12 in.) against the length from the section for moment to the bar end;
* bearing on the footing §22.8.3.2: φ·0.85·f'c·A1·√(A2/A1), √(A2/A1) ≤ 2, φ = 0.65.

√f'c is at most 100 psi (§22.5.3.1, §22.6.3.1, §25.4.1.4). Clause numbers are those of
ACI CODE-318-19 as the author recalls them (from memory where the commentary says so); confirm
them, and the edition adopted locally, before issue.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from calcpack.checks.aci318.bearing import bearing_on_footing
from calcpack.checks.aci318.footing_data import (
    ACI318_EDITION,
    ACIFootingDesign,
    Direction,
    FootingActions,
    bar_count,
    column_aspect,
    factored_actions,
    punching_shear,
    show_actions,
    two_way_perimeter,
    uplift_not_covered,
)
from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.model import CombinationSet
from calcpack.foundations.geometry import GEOTECHNICAL_CAUTION, Footing, FootingLoad
from calcpack.units import Q_

__all__ = ["ACI318", "beta1", "check_aci_footing", "size_effect"]

ACI318 = Standard(ACI318_EDITION, "Building Code Requirements for Structural Concrete", "LRFD")

PHI_FLEXURE = 0.90  # Table 21.2.1(a), tension-controlled
PHI_SHEAR = 0.75  # Table 21.2.1(b)
PHI_BEARING = 0.65  # Table 21.2.1(d)
PSI = Q_(1.0, "psi")


def beta1(f_c: Q_) -> float:
    """β1 of the rectangular stress block, ACI 318-19 Table 22.2.2.4.3."""
    fc = f_c.to("psi").magnitude
    return float(min(0.85, max(0.65, 0.85 - 0.05 * (fc - 4000) / 1000)))


def size_effect(d: Q_) -> float:
    """λs = √(2 / (1 + d/10 in.)) ≤ 1, ACI 318-19 §22.5.5.1.3."""
    return min(1.0, math.sqrt(2 / (1 + d.to("inch").magnitude / 10)))


def check_aci_footing(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    combinations: CombinationSet,
    design: ACIFootingDesign,
) -> MemberChecks:
    """Check a pad footing (or the plain pier or footing with ``design.reinforced=False``) to
    ACI 318-19 under the strength combinations given (e.g. ``asce7_strength()``).

    Args:
        footing: the :class:`~calcpack.foundations.Footing`. loads: load case ->
            :class:`~calcpack.foundations.FootingLoad` at the top of the footing.
        combinations: strength combinations. design: :class:`ACIFootingDesign`.

    Returns:
        MemberChecks; a combination with net uplift is listed and the top face under uplift is
        reported NOT COVERED. Soil bearing is checked separately under service loads
        (:func:`calcpack.foundations.check_footing_soil`).
    """
    if not design.reinforced:
        from calcpack.checks.aci318.plain import check_plain_footing

        return check_plain_footing(footing, loads, combinations, design)
    acts = factored_actions(footing, loads, combinations, design)
    title = f"{footing.kind} footing, reinforced concrete to {ACI318_EDITION}"
    return run_checks(footing.mark, title, ACI318, _ACILogic(acts, design))


class _ACILogic:
    def __init__(self, acts: FootingActions, design: ACIFootingDesign) -> None:
        self.a, self.d = acts, design
        self.As: dict[str, Q_] = {}

    def __call__(self, c: Recorder) -> None:
        a, dz = self.a, self.d
        c.caution(GEOTECHNICAL_CAUTION)
        if a.equivalent_square:
            c.assume(
                "The round footing is designed as the square of equal area (common "
                "practice); a round column as the square of equal area (§13.2.7.3)."
            )
        c.assume(
            "Design for the net factored soil pressure from the column loads: the weight "
            "of the footing and of the soil over it is carried directly by the soil "
            "beneath (common practice)."
        )
        c.heading("Materials and geometry", 3)
        fc = c.given("f_c_prime", dz.f_c, "specified concrete strength", unit="psi")
        fy = c.given("f_y", dz.f_y, "bar yield strength", unit="psi")
        lam = c.given(
            "lambda", dz.lam, "lightweight modification factor", source="ACI 318-19 Table 19.2.4.2"
        )
        h = c.given("h", a.footing.h, "footing thickness", unit="inch")
        cov = c.given(
            "c_c",
            dz.cover,
            "clear cover to the bottom bars",
            source="ACI 318-19 §20.5.1.3.1 (cast against earth: 3 in.)",
            unit="inch",
        )
        sq = c.derive(
            "sqrt_fc",
            c.min(c.sqrt(fc * PSI), 100 * PSI),
            "√f'c in psi, at most 100 psi",
            unit="psi",
            ref="ACI 318-19 §22.5.3.1",
        )
        show_actions(
            c,
            a,
            columns=["Combination", "P_u", "M_u,x", "M_u,y", "V_u,x", "V_u,y", "V_u,2"],
            caption="Factored actions from the net soil pressure by combination",
        )
        uplift_not_covered(
            c,
            a,
            "Top face under uplift",
            "the top reinforcement for the soil weight is not checked",
            "ACI 318-19 §13.2.6.1",
        )
        if a.Pu.magnitude <= 0:
            return
        for dirn in (a.x, a.y):
            self._flexure(c, dirn, fc, fy, h, cov, lam, sq)
        self._band(c)
        for dirn in (a.x, a.y):
            self._one_way(c, dirn, fc, lam, sq)
        self._two_way(c, fc, lam, sq)
        for dirn in (a.x, a.y):
            self._development(c, dirn, fy, lam, sq, cov)
        self._bearing(c, fc)

    def _lambda_s(self, c: Recorder, d: Any, name: str) -> Any:
        if not self.d.size_effect:
            return c.given(
                name,
                1.0,
                "size effect factor neglected, as permitted for isolated footings",
                source="ACI 318-19 §13.2.6.2",
            )
        return c.derive(
            name,
            c.min(c.sqrt(2 / (1 + d / Q_(10, "inch"))), 1.0),
            "size effect factor",
            ref="ACI 318-19 §22.5.5.1.3",
        )

    def _action(self, c: Recorder, dirn: Direction, what: str) -> Any:
        a = self.a
        ax = dirn.axis
        simple = dirn.concentric and (dirn.Mu_combination == a.Pu_combination)
        if simple:
            qu = c.given(
                "q_u", dirn.qu, f"net factored pressure P_u/A, {a.Pu_combination}", unit="psf"
            )
            b = c.given(f"b_{ax}", dirn.width, "width of the section", unit="inch")
            am = c.given(
                f"a_m_{ax}",
                dirn.a_m,
                "centre to the section for moment (ACI 318-19 §13.2.7.1)",
                unit="inch",
            )
            half = c.given(f"l_{ax}", dirn.size / 2, "half the footing size", unit="inch")
            if what == "M":
                return c.derive(
                    f"M_u_{ax}",
                    qu * b * (half - am) ** 2 / 2,
                    "factored moment at the section",
                    unit="kip*ft",
                    ref="q_u·b·(l − a_m)²/2",
                )
            d = c.q(dirn.d)
            dd = c.given(f"d_v_{ax}", d, "effective depth", unit="inch")
            return c.derive(
                f"V_u_{ax}",
                qu * b * (half - am - dd),
                "factored shear at d from the section",
                unit="kip",
                ref="ACI 318-19 §13.2.7.2",
            )
        src = "net factored pressure integrated beyond the section (no-tension plane)"
        if what == "M":
            return c.given(
                f"M_u_{ax}",
                dirn.Mu,
                f"factored moment, {dirn.Mu_combination}",
                source=src,
                unit="kip*ft",
            )
        return c.given(
            f"V_u_{ax}",
            dirn.Vu,
            f"factored shear at d, {dirn.Vu_combination}",
            source=src,
            unit="kip",
        )

    def _flexure(self, c: Recorder, dirn: Direction, fc, fy, h, cov, lam, sq) -> None:  # type: ignore[no-untyped-def]
        ax = dirn.axis
        layer = "bottom layer" if dirn.bottom else "second layer"
        c.heading(f"Flexure, bars along {ax} ({dirn.bar.designation}, {layer})", 3)
        db = c.given(f"d_b_{ax}", dirn.bar.db, "bar diameter", source=dirn.bar.source, unit="inch")
        Ab = c.given(f"A_b_{ax}", dirn.bar.Ab, "bar area", source=dirn.bar.source, unit="inch**2")
        b = c.given(f"b_{ax}", dirn.width, "width of the section", unit="inch")
        d = c.given(
            f"d_{ax}",
            dirn.d,
            f"effective depth ({layer})",
            unit="inch",
            source="h − c_c − d_b/2" + ("" if dirn.bottom else " − d_b of the layer below"),
        )
        Mu = self._action(c, dirn, "M")
        phi = PHI_FLEXURE
        Mu_q, b_q, d_q = c.q(Mu), c.q(b), c.q(d)
        fc_q, fy_q = c.q(fc), c.q(fy)
        disc = (d_q**2 - 2 * Mu_q / (phi * 0.85 * fc_q * b_q)).to("inch**2").magnitude
        if disc < 0:
            Mmax = c.derive(
                f"phi_M_n_max_{ax}",
                phi * 0.85 * fc * b * d**2 / 2,
                "the largest moment a singly reinforced section reaches",
                unit="kip*ft",
            )
            c.check(
                f"Flexure {ax}",
                Mu,
                Mmax,
                ref="ACI 318-19 §22.2",
                combination=dirn.Mu_combination,
                description="footing too thin for the moment",
            )
            return
        As_req = c.derive(
            f"A_s_req_{ax}",
            0.85 * fc * b / fy * (d - c.sqrt(d**2 - 2 * Mu / (phi * 0.85 * fc * b))),
            "steel required, φ = 0.90",
            unit="inch**2",
            ref="ACI 318-19 §22.2.2",
        )
        rho = 0.0018 if fy_q >= Q_(60, "ksi") else 0.0020
        As_min = c.derive(
            f"A_s_min_{ax}",
            rho * b * h,
            "minimum steel",
            unit="inch**2",
            ref="ACI 318-19 §13.3.3.1, §8.6.1.1",
        )
        smax = c.derive(
            f"s_max_{ax}",
            c.min(2 * h, Q_(18, "inch")),
            "maximum bar spacing",
            unit="inch",
            ref="ACI 318-19 §8.7.2.2",
        )
        need = max(c.q(As_req), c.q(As_min))
        n_val = bar_count(need, c.q(Ab), c.q(b) - 2 * c.q(cov) - c.q(db), c.q(smax))
        n = c.given(f"n_{ax}", n_val, "number of bars (enough steel, spacing within s_max)")
        As = c.derive(f"A_s_{ax}", n * Ab, "steel provided", unit="inch**2")
        self.As[ax] = c.q(As)
        s = c.derive(f"s_{ax}", (b - 2 * cov - db) / (n - 1), "bar spacing", unit="inch")
        aa = c.derive(
            f"a_{ax}",
            As * fy / (0.85 * fc * b),
            "depth of the stress block",
            unit="inch",
            ref="ACI 318-19 §22.2.2.4.1",
        )
        b1 = c.given(
            "beta_1", beta1(fc_q), "stress block factor", source="ACI 318-19 Table 22.2.2.4.3"
        )
        cn = c.derive(f"c_{ax}", aa / b1, "neutral axis depth", unit="inch")
        et = c.derive(
            f"epsilon_t_{ax}",
            0.003 * (d - cn) / cn,
            "net tensile strain",
            ref="ACI 318-19 §22.2.2.1",
        )
        ety = float(fy_q / Q_(29000, "ksi"))
        if c.f(et) >= 0.005:
            phf = c.given(
                f"phi_f_{ax}",
                0.90,
                "tension-controlled (ε_t ≥ 0.005)",
                source="ACI 318-19 Table 21.2.2",
            )
        else:
            phf = c.given(
                f"phi_f_{ax}",
                max(0.65, 0.65 + 0.25 * (c.f(et) - ety) / (0.005 - ety)),
                "transition (ε_t < 0.005)",
                source="ACI 318-19 Table 21.2.2",
            )
        pMn = c.derive(
            f"phi_M_n_{ax}",
            phf * As * fy * (d - aa / 2),
            "design flexural strength",
            unit="kip*ft",
            ref="ACI 318-19 §22.2",
        )
        c.check(
            f"Flexure {ax}",
            Mu,
            pMn,
            ref="ACI 318-19 §13.2.7.1, §22.2",
            combination=dirn.Mu_combination,
        )
        c.check(f"Minimum steel {ax}", As_min, As, ref="ACI 318-19 §8.6.1.1")
        c.check(f"Bar spacing {ax}", s, smax, ref="ACI 318-19 §8.7.2.2")
        smin = c.derive(
            f"s_clear_min_{ax}",
            c.max(Q_(1, "inch"), db, 4 * self.d.aggregate / 3),
            "minimum clear spacing",
            unit="inch",
            ref="ACI 318-19 §25.2.1",
        )
        sclr = c.derive(f"s_clear_{ax}", s - db, "clear spacing provided", unit="inch")
        c.check(
            f"Clear spacing {ax}",
            smin,
            sclr,
            ref="ACI 318-19 §25.2.1",
            description="bars not too close",
        )
        del lam, sq, ety

    def _band(self, c: Recorder) -> None:
        f = self.a.footing
        if f.shape != "rectangular" or f.length == f.B:
            return
        short = "x" if f.length > f.B else "y"
        if short not in self.As:
            return
        c.heading("Short-direction steel in the central band", 3)
        beta = c.given(
            "beta_f", float(max(f.B, f.length) / min(f.B, f.length)), "long side / short side"
        )
        As = c.given("A_s_short", self.As[short], "short-direction steel provided", unit="inch**2")
        c.derive(
            "A_s_band",
            2 / (beta + 1) * As,
            "steel within the central band of width equal to the short side",
            unit="inch**2",
            ref="ACI 318-19 §13.3.3.3(b)",
        )
        c.text("Place this share within the central band; the rest uniformly outside it.")

    def _one_way(self, c: Recorder, dirn: Direction, fc, lam, sq) -> None:  # type: ignore[no-untyped-def]
        ax = dirn.axis
        c.heading(f"One-way shear, section at d along {ax}", 3)
        if dirn.Vu.magnitude <= 0:
            c.text(
                "The section at d from the face lies beyond the footing edge: no one-way "
                "shear arises (ACI 318-19 §13.2.7.2)."
            )
            return
        Vu = self._action(c, dirn, "V")
        b = c.given(f"b_v_{ax}", dirn.width, "width of the section", unit="inch")
        d = c.given(f"d_s_{ax}", dirn.d, "effective depth", unit="inch")
        As = c.given(
            f"A_s_v_{ax}",
            self.As.get(ax, Q_(0, "inch**2")),
            "flexural steel provided",
            unit="inch**2",
        )
        ls = self._lambda_s(c, d, f"lambda_s_{ax}")
        rw = c.derive(f"rho_w_{ax}", As / (b * d), "flexural steel ratio")
        Vc = c.derive(
            f"V_c_{ax}",
            c.min(8 * ls * lam * rw ** (1 / 3) * sq * b * d, 5 * lam * sq * b * d),
            "concrete shear strength (no shear reinforcement)",
            unit="kip",
            ref="ACI 318-19 Table 22.5.5.1(c), §22.5.5.1.1",
        )
        pVc = c.derive(
            f"phi_V_c_{ax}",
            PHI_SHEAR * Vc,
            "design shear strength, φ = 0.75",
            unit="kip",
            ref="ACI 318-19 Table 21.2.1(b)",
        )
        c.check(
            f"One-way shear {ax}", Vu, pVc, ref="ACI 318-19 §22.5", combination=dirn.Vu_combination
        )
        del fc

    def _two_way(self, c: Recorder, fc, lam, sq) -> None:  # type: ignore[no-untyped-def]
        a = self.a
        f = a.footing
        c.heading("Two-way (punching) shear, perimeter at d/2", 3)
        perimeter = two_way_perimeter(c, a, "d/2")
        if perimeter is None:
            return
        b1, b2, b0 = perimeter
        d = c.given("d_avg", (a.x.d + a.y.d) / 2, "average effective depth", unit="inch")
        if a.punch_concentric and a.Vu2_combination == a.Pu_combination:
            Pu = c.given("P_u", a.Pu, f"factored column load, {a.Pu_combination}", unit="kip")
            A = c.given("A_f", f.area, "footing area", unit="ft**2")
            Vu = c.derive(
                "V_u2",
                Pu * (1 - b1 * b2 / A),
                "punching shear: load less the net pressure inside the perimeter",
                unit="kip",
            )
        else:
            Vu = punching_shear(c, a)
        beta = column_aspect(c, f.column)
        ls = self._lambda_s(c, d, "lambda_s")
        als = c.given("alpha_s", 40, "interior column", source="ACI 318-19 §22.6.5.3")
        vc = c.derive(
            "v_c",
            c.min(
                4 * ls * lam * sq,
                (2 + 4 / beta) * ls * lam * sq,
                (2 + als * d / b0) * ls * lam * sq,
            ),
            "two-way shear stress strength",
            unit="psi",
            ref="ACI 318-19 Table 22.6.5.2",
        )
        vu = c.derive("v_u_V", Vu / (b0 * d), "shear stress from the shear", unit="psi")
        for M, bx, by, tag in ((a.Msc_y, b1, b2, "y"), (a.Msc_x, b2, b1, "x")):
            if M.magnitude == 0:
                continue
            Ms = c.given(
                f"M_sc_{tag}",
                M,
                f"column moment about {tag} transferred",
                source="largest factored column moment (soil inside the perimeter "
                "neglected, conservative)",
                unit="kip*ft",
            )
            gv = c.derive(
                f"gamma_v_{tag}",
                1 - 1 / (1 + 2 / 3 * c.sqrt(bx / by)),
                "share transferred by eccentric shear",
                ref="ACI 318-19 §8.4.2.2.2, §8.4.4.2.2",
            )
            Jc = c.derive(
                f"J_c_{tag}",
                d * bx**3 / 6 + bx * d**3 / 6 + d * by * bx**2 / 2,
                "polar property of the perimeter",
                unit="inch**4",
                ref="ACI 318-19 R8.4.4.2.3",
            )
            vu = c.derive(
                f"v_u_{tag}",
                vu + gv * Ms * (bx / 2) / Jc,
                "shear stress with the moment transfer",
                unit="psi",
                ref="ACI 318-19 §8.4.4.2.3",
            )
        pvc = c.derive("phi_v_c", PHI_SHEAR * vc, "design stress, φ = 0.75", unit="psi")
        c.check("Two-way shear", vu, pvc, ref="ACI 318-19 §22.6", combination=a.Vu2_combination)
        del fc

    def _development(self, c: Recorder, dirn: Direction, fy, lam, sq, cov) -> None:  # type: ignore[no-untyped-def]
        ax = dirn.axis
        c.heading(f"Development of the bars along {ax}", 3)
        db = c.given(f"d_b_l_{ax}", dirn.bar.db, "bar diameter", unit="inch")
        small = dirn.bar.db <= Q_(0.75, "inch") * 1.001
        ps = c.given(
            f"psi_s_{ax}",
            0.8 if small else 1.0,
            "bar size factor",
            source="ACI 318-19 Table 25.4.2.5",
        )
        fyk = c.q(fy).to("ksi").magnitude
        pg = c.given(
            f"psi_g_{ax}",
            1.0 if fyk <= 60 else 1.15,
            "reinforcement grade factor",
            source="ACI 318-19 Table 25.4.2.5",
        )
        pt = c.given("psi_t", 1.0, "bottom bars", source="ACI 318-19 Table 25.4.2.5")
        pe = c.given("psi_e", 1.0, "uncoated bars", source="ACI 318-19 Table 25.4.2.5")
        n = max(2, round(float(c.q(self.As.get(ax, dirn.bar.Ab)) / dirn.bar.Ab)))
        s = (dirn.width - 2 * self.d.cover - dirn.bar.db) / (n - 1)
        cb = c.given(
            f"c_b_{ax}",
            min(self.d.cover + dirn.bar.db / 2, s / 2),
            "smaller of cover to bar centre and half the spacing",
            unit="inch",
        )
        conf = c.derive(
            f"k_cb_{ax}",
            c.min(cb / db, 2.5),
            "(c_b + K_tr)/d_b with K_tr = 0, at most 2.5",
            ref="ACI 318-19 §25.4.2.4",
        )
        ld = c.derive(
            f"l_d_{ax}",
            c.max(3 / 40 * fy / (lam * sq) * pt * pe * ps * pg / conf * db, Q_(12, "inch")),
            "development length",
            unit="inch",
            ref="ACI 318-19 §25.4.2.4, §25.4.2.1",
        )
        half = c.given(f"l_half_{ax}", dirn.size / 2, "half the footing size", unit="inch")
        am = c.given(f"a_md_{ax}", dirn.a_m, "centre to the section for moment", unit="inch")
        avail = c.derive(
            f"l_avail_{ax}", half - am - cov, "length available beyond the section", unit="inch"
        )
        c.check(
            f"Development {ax}",
            ld,
            avail,
            ref="ACI 318-19 §25.4.2, §13.2.8.3",
            description="straight bars; hooks are not covered",
        )

    def _bearing(self, c: Recorder, fc) -> None:  # type: ignore[no-untyped-def]
        a = self.a
        c.heading("Bearing of the column on the footing", 3)
        bearing_on_footing(
            c,
            a,
            fc,
            phi=PHI_BEARING,
            rule="ACI 318-19 §22.8.3.2",
            strength_ref="ACI 318-19 §22.8.3.2, Table 21.2.1(d)",
            check_ref="ACI 318-19 §22.8",
        )
