"""ACI CODE-318-19 Chapter 17: cast-in anchors in tension and shear (strength design).

:func:`check_aci_anchors` runs, for a single anchor or a rectangular group
(:class:`~calcpack.checks.aci318.anchor_data.AnchorGroup`) under factored loads
(:class:`~calcpack.checks.aci318.anchor_data.AnchorLoads`):

* tension: steel strength N_sa = A_se,N f_uta (§17.6.1, f_uta ≤ 1.9 f_ya and 125 ksi);
  concrete breakout N_cb(g) = (A_Nc/A_Nco) ψ_ec,N ψ_ed,N ψ_c,N ψ_cp,N N_b (§17.6.2) with
  N_b = k_c λ_a √f'c h_ef^1.5, k_c = 24 (and at most 16 λ_a √f'c h_ef^5/3 for 11 in. ≤ h_ef
  ≤ 25 in.), h_ef reduced where three or more edges are within 1.5 h_ef (§17.6.2.1.2);
  pullout N_pn = ψ_c,P N_p with N_p = 8 A_brg f'c or 0.9 f'c e_h d_a (§17.6.3); side-face
  blowout of headed anchors with h_ef > 2.5 c_a1 (§17.6.4);
* shear: steel strength V_sa = A_se,V f_uta (studs) or 0.6 A_se,V f_uta (bolts), × 0.80 through
  a grout pad (§17.7.1); concrete breakout towards the edge the shear acts towards,
  V_cb(g) = (A_Vc/A_Vco) ψ_ec,V ψ_ed,V ψ_c,V ψ_h,V V_b with c_a1 limited in narrow thin members
  (§17.7.2.1.2), the whole shear taken by the row nearest the edge; breakout at the edges
  parallel to the shear, twice the perpendicular value with ψ_ed,V = 1.0 (§17.7.2.1(c));
  pryout V_cp(g) = k_cp N_cp(g) (§17.7.3);
* interaction (§17.8): full strengths when either ratio is at most 0.2, else
  N_ua/φN_n + V_ua/φV_n ≤ 1.2.

Units: the in.-lb forms of the equations with √f'c in psi (the constants carry the units that
make each equation dimensionally consistent, so SI inputs give the same strengths). φ factors
are ``ANCHOR_FACTORS`` (Table 17.5.3). Forces in lbf (US inputs) or kN (SI).

Edition implemented: ACI CODE-318-19 (clause numbers of that edition, recalled: from memory).
Its provisions must be confirmed against the edition adopted locally before issue.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aci318.anchor_data import (
    ANCHOR_FACTORS,
    AnchorGroup,
    AnchorLoads,
    Side,
)
from calcpack.checks.aci318.footing import ACI318
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.loads.derive import is_us_customary
from calcpack.units import Q_, Quantity
from calcpack.validate import instance

__all__ = ["check_aci_anchors"]

PSI = Q_(1.0, "psi")
_K_C = Q_(24.0, "inch**0.5")  # Eq. (17.6.2.2.1), cast-in anchors
_K_DEEP = Q_(16.0, "inch**(1/3)")  # Eq. (17.6.2.2.3)
_K_VB = Q_(9.0, "inch**0.5")  # Eq. (17.7.2.2.1b)
_OPPOSITE: dict[str, Side] = {"-x": "+x", "+x": "-x", "-y": "+y", "+y": "-y"}
_SIDES_OF: dict[str, tuple[Side, Side]] = {"x": ("-y", "+y"), "y": ("-x", "+x")}


def _axis(side: str) -> str:
    return side[1]


def _tag(side: str) -> str:
    """A symbol suffix for a side ("-x" -> "x1", "+x" -> "x2"): names are letters and digits."""
    return side[1] + ("1" if side[0] == "-" else "2")


def check_aci_anchors(group: AnchorGroup, loads: AnchorLoads, *, mark: str = "A1") -> MemberChecks:
    """Cast-in anchors to ACI 318-19 Chapter 17 under ``loads`` (strength design).

    Args:
        group: the anchors, their concrete and edges. loads: factored tension and shear.
        mark: the mark of the anchors in the summary of checks.

    Returns:
        MemberChecks: each failure mode as a check ("Steel strength in tension", "Concrete
        breakout in tension", "Pullout", "Side-face blowout, edge +x", "Steel strength in
        shear", "Concrete breakout in shear, edge +x", "Concrete breakout in shear parallel to
        edge -y", "Pryout", "Tension and shear interaction").

    Raises:
        InputError: inputs outside their limits (at construction of ``group`` and ``loads``).
    """
    instance("group", group, AnchorGroup, expected="an AnchorGroup")
    instance("loads", loads, AnchorLoads, expected="an AnchorLoads")
    g, ld = group, loads
    us = is_us_customary(g.h_ef)
    F = "lbf" if us else "kN"
    L = "inch" if us else "mm"
    A = "inch**2" if us else "mm**2"
    S = "psi" if us else "MPa"
    steel = g.steel()
    area, area_src = g.effective_area()
    n = g.n
    group_of = "g" if n > 1 else ""
    tension = ld.N.magnitude > 0
    shear = ld.V.magnitude > 0
    cond = g.condition

    def phi(c: Recorder, key: str, name: str) -> Any:
        f = ANCHOR_FACTORS[key]
        return c.given(name, f.phi, f"strength reduction factor, {key}", source=f.clause)

    def demand(
        c: Recorder, sym: str, total: Quantity, most: Quantity | None, what: str
    ) -> tuple[Any, Any]:
        """The factored force on the group and on its most loaded anchor (N/n when shared)."""
        on_group = c.given(f"{sym}_ua", total, f"factored {what} on the anchors",
                           source=ld.combination or "given", unit=F, result=True)  # fmt: skip
        if n == 1:
            return on_group, on_group
        on_one = c.given(f"{sym}_ua_i", most if most is not None else total / n,
                         f"{what.split(',')[0]} on the most loaded anchor",
                         source="given" if most is not None else f"{sym}_ua / n", unit=F,
                         result=True)  # fmt: skip
        return on_group, on_one

    def logic(c: Recorder) -> None:
        c.assume(
            "Cast-in anchors; the concrete is "
            + (
                "cracked at service loads (no analysis shows otherwise)."
                if g.cracking == "cracked"
                else "shown by analysis to be uncracked at service loads."
            )
        )
        c.heading("Anchors and concrete", 3)
        d_a = c.given("d_a", g.d_a, f"anchor diameter, {g.kind}", source="given", unit=L)
        h_ef_in = c.given("h_ef", g.h_ef, "effective embedment depth", source="given", unit=L)
        h_a = c.given("h_a", g.h_a, "member thickness", source="given", unit=L)
        fc = c.given("f_c_prime", g.f_c, "specified concrete strength", source="given", unit=S)
        sfc = c.derive("sqrt_fc", c.min(c.sqrt(fc * PSI), 100 * PSI),
                       "√f'c in psi, at most 100 psi", unit="psi",
                       ref="ACI 318-19 §17.3.1")  # fmt: skip
        lam = c.given("lambda_a", float(g.lam), "modification factor, cast-in anchors (λ_a = λ)",
                      source="ACI 318-19 §17.2.4")  # fmt: skip
        if n > 1:
            c.text(f"A group of {g.nx} × {g.ny} anchors (x by y).")
        A_se = c.given("A_se", area, "effective cross-sectional area of one anchor",
                       source=area_src, unit=A)  # fmt: skip
        f_ya = c.given("f_ya", steel.f_ya, f"specified yield strength, {steel.grade}",
                       source=steel.source, unit=S)  # fmt: skip
        f_uta0 = c.given("f_uta_spec", steel.f_uta, f"specified tensile strength, {steel.grade}",
                         source=steel.source, unit=S)  # fmt: skip
        f_uta = c.derive("f_uta", c.min(f_uta0, 1.9 * f_ya, Q_(125, "ksi")),
                         "tensile strength used, at most 1.9 f_ya and 125 ksi", unit=S,
                         ref="ACI 318-19 §17.6.1.2")  # fmt: skip
        ductile = "ductile" if steel.ductile else "brittle"
        H = {"d_a": d_a, "h_ef": h_ef_in, "h_a": h_a, "sqrt_fc": sfc, "lambda_a": lam}
        ratios_N: list[Any] = []
        ratios_V: list[Any] = []

        # -- concrete breakout geometry in tension (also used for pryout) ------------------
        near = {s: cq for s, cq in g.edges.items() if cq < 1.5 * g.h_ef}
        h_ef = h_ef_in
        if len(near) >= 3:
            s_max = max(g.spacing("x"), g.spacing("y"))
            c_max = max(near.values())
            c.text("Three or more edges are nearer than 1.5 h_ef: h_ef is reduced (§17.6.2.1.2).")
            cam = c.given("c_a_max", c_max, "largest influencing edge distance", unit=L)
            sm = c.given("s_max", s_max, "largest spacing in the group", unit=L)
            h_ef = c.derive("h_ef_red", c.min(h_ef_in, c.max(cam / 1.5, sm / 3)),
                            "embedment depth used for breakout", unit=L,
                            ref="ACI 318-19 §17.6.2.1.2")  # fmt: skip
        h_q = c.q(h_ef)

        cached: list[Any] = []

        def breakout_tension(title: str) -> Any:
            """(A_Nc/A_Nco) ψ_ed,N ψ_c,N ψ_cp,N N_b: the breakout strength without ψ_ec,N."""
            if cached:
                return cached[0]
            c.heading(title, 3)
            A_Nco = c.derive("A_Nco", 9 * h_ef**2, "projected area of one anchor", unit=A,
                             ref="ACI 318-19 Eq. (17.6.2.1.4)")  # fmt: skip
            ext = []
            for axis, count in (("x", g.nx), ("y", g.ny)):
                lo_s, hi_s = f"-{axis}", f"+{axis}"
                terms: list[Any] = []
                for side in (lo_s, hi_s):
                    if side in g.edges:
                        ce = c.given(f"c_a_{_tag(side)}", g.edges[side],
                                     f"edge distance, side {side}", source="given",
                                     unit=L)  # fmt: skip
                        terms.append(c.min(ce, 1.5 * h_ef))
                    else:
                        terms.append(1.5 * h_ef)
                parts = terms[0] + terms[1]
                if count > 1:
                    sp = c.given(f"s_{axis}", g.spacing(axis), f"spacing along {axis}",  # type: ignore[arg-type]
                                 source="given", unit=L)  # fmt: skip
                    nn = c.given(f"n_{axis}", float(count), f"anchors along {axis}",
                                 source="given")  # fmt: skip
                    parts = parts + (nn - 1) * c.min(sp, 3 * h_ef)
                ext.append(c.derive(f"B_N{axis}", parts, f"width of the projected area along "
                                    f"{axis}", unit=L, ref="ACI 318-19 R17.6.2.1"))  # fmt: skip
            A_Nc = c.derive("A_Nc", ext[0] * ext[1], "projected area of the failure surface",
                            unit=A, ref="ACI 318-19 §17.6.2.1.1")  # fmt: skip
            if g.edges:
                c_min = min(g.edges.values())
                ca = c.given("c_a_min", c_min, "least edge distance", unit=L)
                if c_min >= 1.5 * h_q:
                    ped = c.derive("psi_ed_N", 1.0, "c_a,min ≥ 1.5 h_ef",
                                   ref="ACI 318-19 Eq. (17.6.2.4.1a)")  # fmt: skip
                else:
                    ped = c.derive("psi_ed_N", 0.7 + 0.3 * ca / (1.5 * h_ef),
                                   "edge effect factor, c_a,min < 1.5 h_ef", unit="",
                                   ref="ACI 318-19 Eq. (17.6.2.4.1b)")  # fmt: skip
            else:
                ped = c.given("psi_ed_N", 1.0, "no edge within 1.5 h_ef",
                              source="ACI 318-19 Eq. (17.6.2.4.1a)")  # fmt: skip
            pc = c.given("psi_c_N", 1.0 if g.cracking == "cracked" else 1.25,
                         f"cast-in anchors, {g.cracking} concrete",
                         source="ACI 318-19 §17.6.2.5.1")  # fmt: skip
            pcp = c.given("psi_cp_N", 1.0, "cast-in anchors", source="ACI 318-19 §17.6.2.6.1")
            kc = c.given("k_c", _K_C, "cast-in anchors (in.-lb form, √f'c in psi)",
                         source="ACI 318-19 §17.6.2.2.1")  # fmt: skip
            Nb_f: Any = kc * lam * sfc * h_ef**1.5
            if g.kind != "hooked bolt" and Q_(11, "inch") <= h_q <= Q_(25, "inch"):
                kd = c.given("k_deep", _K_DEEP, "headed anchors, 11 in. ≤ h_ef ≤ 25 in.",
                             source="ACI 318-19 §17.6.2.2.3")  # fmt: skip
                Nb_f = c.min(Nb_f, kd * lam * sfc * h_ef ** (5 / 3))
            Nb = c.derive("N_b", Nb_f, "basic breakout strength of one anchor in cracked "
                          "concrete", unit=F, ref="ACI 318-19 Eq. (17.6.2.2.1)")  # fmt: skip
            cached.append(A_Nc / A_Nco * ped * pc * pcp * Nb)
            return cached[0]

        # -- tension ---------------------------------------------------------------------
        if tension:
            c.heading("Tension: steel strength, §17.6.1", 3)
            N_ua, N_i = demand(c, "N", ld.N, ld.N_max, "tension")
            Nsa = c.derive("N_sa", A_se * f_uta, "steel strength of one anchor", unit=F,
                           ref="ACI 318-19 Eq. (17.6.1.2)")  # fmt: skip
            p = phi(c, f"steel tension, {ductile}", "phi_st")
            cap = c.derive("phi_N_sa", p * Nsa, "design steel strength", unit=F)
            c.check("Steel strength in tension", N_i, cap, ref="ACI 318-19 §17.6.1",
                    combination=ld.combination)  # fmt: skip
            ratios_N.append(N_i / cap)
            core = breakout_tension("Concrete breakout in tension, §17.6.2")
            if ld.e_N.magnitude > 0:
                eN = c.given("e_N_prime", ld.e_N, "eccentricity of the tension", unit=L)
                pec = c.derive("psi_ec_N", 1 / (1 + eN / (1.5 * h_ef)), "eccentricity factor",
                               unit="", ref="ACI 318-19 Eq. (17.6.2.3.1)")  # fmt: skip
            else:
                pec = c.given("psi_ec_N", 1.0, "concentric tension",
                              source="ACI 318-19 §17.6.2.3.1")  # fmt: skip
            Ncb = c.derive(f"N_cb{group_of}", pec * core, "concrete breakout strength", unit=F,
                           ref="ACI 318-19 Eq. (17.6.2.1" + ("b)" if n > 1 else "a)"))  # fmt: skip
            p = phi(c, f"concrete tension, {cond}", "phi_cb")
            cap = c.derive(f"phi_N_cb{group_of}", p * Ncb, "design breakout strength", unit=F)
            c.check("Concrete breakout in tension", N_ua, cap, ref="ACI 318-19 §17.6.2",
                    combination=ld.combination)  # fmt: skip
            ratios_N.append(N_ua / cap)

            c.heading("Pullout, §17.6.3", 3)
            if g.kind == "hooked bolt":
                assert g.e_h is not None
                eh = c.given("e_h", g.e_h, "inside length of the hook", source="given", unit=L)
                eh_used = c.min(eh, 4.5 * d_a)
                Np = c.derive("N_p", 0.9 * fc * eh_used * d_a, "pullout strength, hooked bolt",
                              unit=F,
                              ref="ACI 318-19 Eq. (17.6.3.2.2b), e_h ≤ 4.5 d_a")  # fmt: skip
            else:
                assert g.A_brg is not None
                Abrg = c.given("A_brg", g.A_brg, "net bearing area of the head", source="given",
                               unit=A)  # fmt: skip
                Np = c.derive("N_p", 8 * Abrg * fc, "pullout strength, headed anchor", unit=F,
                              ref="ACI 318-19 Eq. (17.6.3.2.2a)")  # fmt: skip
            pcP = c.given("psi_c_P", 1.0 if g.cracking == "cracked" else 1.4,
                          f"{g.cracking} concrete", source="ACI 318-19 §17.6.3.3.1")  # fmt: skip
            Npn = c.derive("N_pn", pcP * Np, "pullout strength of one anchor", unit=F,
                           ref="ACI 318-19 Eq. (17.6.3.1)")  # fmt: skip
            p = phi(c, "pullout", "phi_p")
            cap = c.derive("phi_N_pn", p * Npn, "design pullout strength", unit=F)
            c.check("Pullout", N_i, cap, ref="ACI 318-19 §17.6.3", combination=ld.combination)
            ratios_N.append(N_i / cap)

            if g.kind != "hooked bolt":
                for side, ce in g.edges.items():
                    if g.h_ef > 2.5 * ce:
                        ratios_N.append(blowout(c, H, side, ce, N_i))

        # -- shear -------------------------------------------------------------------------
        if shear:
            assert ld.toward is not None
            c.heading("Shear: steel strength, §17.7.1", 3)
            V_ua, V_i = demand(c, "V", ld.V, ld.V_max, f"shear, towards {ld.toward}")
            if g.kind == "headed stud":
                Vsa_f: Any = A_se * f_uta
                eq = "ACI 318-19 Eq. (17.7.1.2a)"
            else:
                Vsa_f = 0.6 * A_se * f_uta
                eq = "ACI 318-19 Eq. (17.7.1.2b)"
            if g.grout_pad:
                Vsa_f = 0.80 * Vsa_f
                eq += " × 0.80 for the grout pad, §17.7.1.2.1"
            Vsa = c.derive("V_sa", Vsa_f, "steel strength of one anchor in shear", unit=F, ref=eq)
            p = phi(c, f"steel shear, {ductile}", "phi_sv")
            cap = c.derive("phi_V_sa", p * Vsa, "design steel strength in shear", unit=F)
            c.check("Steel strength in shear", V_i, cap, ref="ACI 318-19 §17.7.1",
                    combination=ld.combination)  # fmt: skip
            ratios_V.append(V_i / cap)
            if ld.toward in g.edges:
                ratios_V.append(shear_breakout(c, H, ld.toward, V_ua, parallel=False))
            else:
                c.text(f"No edge near on side {ld.toward}: no breakout towards an edge "
                       "(§17.7.2).")  # fmt: skip
            for side in _SIDES_OF[_axis(ld.toward)]:
                if side in g.edges:
                    ratios_V.append(shear_breakout(c, H, side, V_ua, parallel=True))

            core = breakout_tension("Concrete breakout in tension for pryout, §17.6.2")
            c.heading("Pryout, §17.7.3", 3)
            Ncp = c.derive(f"N_cp{group_of}", core, "breakout strength in tension, concentric",
                           unit=F, ref="ACI 318-19 §17.7.3.1(a)")  # fmt: skip
            deep = g.h_ef >= Q_(2.5, "inch")
            kcp = c.given("k_cp", 2.0 if deep else 1.0,
                          "h_ef ≥ 2.5 in." if deep else "h_ef < 2.5 in.",
                          source="ACI 318-19 §17.7.3.1")  # fmt: skip
            Vcp = c.derive(f"V_cp{group_of}", kcp * Ncp, "pryout strength", unit=F,
                           ref="ACI 318-19 Eq. (17.7.3.1" + ("b)" if n > 1 else "a)"))  # fmt: skip
            p = phi(c, "pryout", "phi_cp")
            cap = c.derive(f"phi_V_cp{group_of}", p * Vcp, "design pryout strength", unit=F)
            c.check("Pryout", V_ua, cap, ref="ACI 318-19 §17.7.3", combination=ld.combination)
            ratios_V.append(V_ua / cap)

        if tension and shear:
            c.heading("Tension and shear interaction, §17.8", 3)
            zN = c.derive("zeta_N", c.max(*ratios_N) if len(ratios_N) > 1 else ratios_N[0],
                          "N_ua/φN_n, the largest tension ratio", unit="")  # fmt: skip
            zV = c.derive("zeta_V", c.max(*ratios_V) if len(ratios_V) > 1 else ratios_V[0],
                          "V_ua/φV_n, the largest shear ratio", unit="")  # fmt: skip
            if c.f(zV) <= 0.2:
                c.text("V_ua ≤ 0.2 φV_n: the full strength in tension is permitted (§17.8.1).")
            elif c.f(zN) <= 0.2:
                c.text("N_ua ≤ 0.2 φN_n: the full strength in shear is permitted (§17.8.2).")
            else:
                lim = c.given("zeta_lim", 1.2, "limit of the interaction",
                              source="ACI 318-19 Eq. (17.8.3)")  # fmt: skip
                z = c.derive("zeta", zN + zV, "sum of the ratios", unit="",
                             ref="ACI 318-19 Eq. (17.8.3)")  # fmt: skip
                c.check("Tension and shear interaction", z, lim,
                        ref="ACI 318-19 §17.8.3", combination=ld.combination)  # fmt: skip

    def blowout(c: Recorder, H: dict[str, Any], side: str, ce: Quantity, N_i: Any) -> Any:
        """Side-face blowout at edge ``side`` of headed anchors (§17.6.4)."""
        c.heading(f"Side-face blowout at edge {side}, §17.6.4", 3)
        across = _OPPOSITE[side]
        axis_along = "y" if _axis(side) == "x" else "x"
        along = g.ny if _axis(side) == "x" else g.nx
        ca1 = c.given(
            f"c_a1_{_tag(side)}", ce, f"distance to edge {side} (h_ef > 2.5 c_a1)", unit=L
        )
        assert g.A_brg is not None
        Abrg = c.given("A_brg", g.A_brg, "net bearing area of the head", source="given", unit=A)
        Nsb_f: Any = 160 * ca1 * c.sqrt(Abrg) * H["lambda_a"] * H["sqrt_fc"]
        sides = [s for s in _SIDES_OF[_axis(across)] if s in g.edges]  # edges across ca1
        c2 = min((g.edges[s] for s in sides), default=None)
        if c2 is not None and c2 < 3 * ce:
            ca2 = c.given(f"c_a2_{_tag(side)}", c2, "distance to the nearer edge across", unit=L)
            Nsb_f = Nsb_f * (1 + c.max(c.min(ca2 / ca1, 3.0), 1.0)) / 4
        Nsb = c.derive(f"N_sb_{_tag(side)}", Nsb_f, "side-face blowout strength of one anchor",
                       unit=F, ref="ACI 318-19 Eq. (17.6.4.1)")  # fmt: skip
        N_d: Any = N_i
        if along > 1:
            s_al = g.spacing(axis_along)  # type: ignore[arg-type]
            s_out = c.given(f"s_{_tag(side)}", (along - 1) * s_al, "spacing of the outer anchors "
                            "along the edge", unit=L)  # fmt: skip
            fac = (1 + s_out / (6 * ca1)) if (along - 1) * s_al < 6 * ce else along
            Nsb = c.derive(f"N_sbg_{_tag(side)}", fac * Nsb, "side-face blowout strength of the "
                           "anchors along the edge", unit=F,
                           ref="ACI 318-19 Eq. (17.6.4.2)")  # fmt: skip
            N_d = c.derive(f"N_ua_{_tag(side)}", along * N_i,
                           "tension on the anchors along the edge", unit=F)  # fmt: skip
        p = phi(c, f"concrete tension, {cond}", f"phi_sb_{_tag(side)}")
        cap = c.derive(
            f"phi_N_sb_{_tag(side)}", p * Nsb, "design side-face blowout strength", unit=F
        )
        c.check(f"Side-face blowout, edge {side}", N_d, cap, ref="ACI 318-19 §17.6.4",
                combination=ld.combination)  # fmt: skip
        return N_d / cap

    def shear_breakout(
        c: Recorder, H: dict[str, Any], side: str, V_ua: Any, *, parallel: bool
    ) -> Any:
        """Breakout at edge ``side``: shear towards it, or parallel to it (§17.7.2)."""
        tag = f"parallel to edge {side}" if parallel else f"towards edge {side}"
        c.heading(f"Concrete breakout in shear {tag}, §17.7.2", 3)
        ax = _axis(side)
        along_axis = "y" if ax == "x" else "x"
        along = g.ny if ax == "x" else g.nx
        s_al = g.spacing(along_axis)  # type: ignore[arg-type]
        side_edges = [s for s in _SIDES_OF[ax] if s in g.edges]
        ca1_q = g.edges[side]
        k = f"_{_tag(side)}"
        ca1 = c.given(f"c_a1{k}", ca1_q, f"distance to edge {side}", source="given", unit=L)
        c2s = {s: g.edges[s] for s in side_edges}
        narrow = (
            len(c2s) == 2 and all(v < 1.5 * ca1_q for v in c2s.values()) and (g.h_a < 1.5 * ca1_q)
        )
        if narrow:
            c.text("Both edges across and the thickness are nearer than 1.5 c_a1: c_a1 is "
                   "limited (§17.7.2.1.2).")  # fmt: skip
            c2m = c.given(f"c_a2_max{k}", max(c2s.values()), "larger edge distance across",
                          unit=L)  # fmt: skip
            sm = c.given(f"s_along{k}", s_al, "largest spacing along the edge", unit=L)
            ca1 = c.derive(f"c_a1_used{k}", c.max(c2m / 1.5, H["h_a"] / 1.5, sm / 3),
                           "edge distance used", unit=L,
                           ref="ACI 318-19 §17.7.2.1.2")  # fmt: skip
        c2_handles = []
        widths: list[Any] = []
        for s2 in _SIDES_OF[ax]:
            if s2 in c2s:
                h2 = c.given(f"c_a_{_tag(s2)}", c2s[s2], f"edge distance across, side {s2}",
                             unit=L)  # fmt: skip
                c2_handles.append((c2s[s2], h2))
                widths.append(c.min(h2, 1.5 * ca1))
            else:
                widths.append(1.5 * ca1)
        width: Any = widths[0] + widths[1]
        if along > 1:
            sp = c.given(f"s{k}", s_al, "spacing along the edge", unit=L)
            width = width + (along - 1) * c.min(sp, 3 * ca1)
        h_a = H["h_a"]
        A_Vc = c.derive(f"A_Vc{k}", width * c.min(1.5 * ca1, h_a), "projected area on the side "
                        "face", unit=A, ref="ACI 318-19 §17.7.2.1.1")  # fmt: skip
        A_Vco = c.derive(f"A_Vco{k}", 4.5 * ca1**2, "projected area of one anchor far from "
                         "edges and thick", unit=A, ref="ACI 318-19 Eq. (17.7.2.1.3)")  # fmt: skip
        ca1_v = c.q(ca1)
        if parallel:
            ped = c.given(f"psi_ed_V{k}", 1.0, "shear parallel to the edge",
                          source="ACI 318-19 §17.7.2.1(c)")  # fmt: skip
        elif c2_handles and min(v for v, _ in c2_handles) < 1.5 * ca1_v:
            h2 = min(c2_handles, key=lambda t: t[0])[1]
            ped = c.derive(f"psi_ed_V{k}", 0.7 + 0.3 * h2 / (1.5 * ca1), "edge effect factor",
                           unit="", ref="ACI 318-19 Eq. (17.7.2.4.1b)")  # fmt: skip
        else:
            ped = c.given(f"psi_ed_V{k}", 1.0, "c_a2 ≥ 1.5 c_a1",
                          source="ACI 318-19 Eq. (17.7.2.4.1a)")  # fmt: skip
        if g.cracking == "uncracked":
            pcv, why = 1.4, "uncracked concrete"
        else:
            pcv, why = {"none": (1.0, "cracked, no edge reinforcement"),
                        "edge bar": (1.2, "cracked, edge bar No. 4 or larger"),
                        "edge bar and stirrups": (1.4, "cracked, edge bar and stirrups at "
                                                  "≤ 4 in.")}[g.edge_bars]  # fmt: skip
        pc = c.given(f"psi_c_V{k}", pcv, why, source="ACI 318-19 §17.7.2.5.1")
        if g.h_a < 1.5 * ca1_v:
            ph = c.derive(f"psi_h_V{k}", c.sqrt(1.5 * ca1 / h_a), "thickness factor", unit="",
                          ref="ACI 318-19 Eq. (17.7.2.6.1)")  # fmt: skip
        else:
            ph = c.given(f"psi_h_V{k}", 1.0, "h_a ≥ 1.5 c_a1", source="ACI 318-19 §17.7.2.6.1")
        if ld.e_V.magnitude > 0 and not parallel:
            eV = c.given(f"e_V_prime{k}", ld.e_V, "eccentricity of the shear", unit=L)
            pec = c.derive(f"psi_ec_V{k}", 1 / (1 + eV / (1.5 * ca1)), "eccentricity factor",
                           unit="", ref="ACI 318-19 Eq. (17.7.2.3.1)")  # fmt: skip
        else:
            pec = c.given(f"psi_ec_V{k}", 1.0, "concentric shear", source="ACI 318-19 §17.7.2.3")
        d_a = H["d_a"]
        le = c.derive(f"l_e{k}", c.min(H["h_ef"], 8 * d_a),
                      "load-bearing length, h_ef ≤ 8 d_a", unit=L,
                      ref="ACI 318-19 §17.7.2.2.1")  # fmt: skip
        sfc, lam = H["sqrt_fc"], H["lambda_a"]
        kvb = c.given("k_Vb", _K_VB, "in.-lb form, √f'c in psi", source="ACI 318-19 Eq. "
                      "(17.7.2.2.1b)")  # fmt: skip
        Vb = c.derive(f"V_b{k}", c.min(7 * (le / d_a) ** 0.2 * c.sqrt(d_a) * lam * sfc *
                                       ca1**1.5, kvb * lam * sfc * ca1**1.5),
                      "basic breakout strength of one anchor in cracked concrete", unit=F,
                      ref="ACI 318-19 Eq. (17.7.2.2.1a), (17.7.2.2.1b)")  # fmt: skip
        f = 2 if parallel else 1
        Vcb = c.derive(f"V_cb{group_of}{k}", f * A_Vc / A_Vco * pec * ped * pc * ph * Vb,
                       "concrete breakout strength in shear" + (", twice for shear parallel "
                       "to the edge" if parallel else ""), unit=F,
                       ref="ACI 318-19 Eq. (17.7.2.1" + ("b)" if n > 1 else "a)") +
                       (", §17.7.2.1(c)" if parallel else ""))  # fmt: skip
        p = phi(c, f"concrete shear, {cond}", f"phi_cbv{k}")
        cap = c.derive(f"phi_V_cb{group_of}{k}", p * Vcb, "design breakout strength in shear",
                       unit=F)  # fmt: skip
        name = ("Concrete breakout in shear parallel to edge " if parallel else
                "Concrete breakout in shear, edge ") + side  # fmt: skip
        c.check(name, V_ua, cap, ref="ACI 318-19 §17.7.2", combination=ld.combination)
        return V_ua / cap

    what = "Anchor" if n == 1 else f"Group of {n} anchors"
    return run_checks(mark, f"{what}: {g.kind}, ACI 318-19 Chapter 17", ACI318, logic)
