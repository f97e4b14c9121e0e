"""Serviceability of timber members to BS EN 1995-1-1:2004+A2:2014 with the UK National Annex.

* :func:`check_en1995_deflection`: final deflection with creep (§2.2.3, §2.3.2.2, UK NA):
  w_fin = w_inst,G (1 + k_def) + w_inst,Q1 (1 + ψ2,1 k_def) + Σ w_inst,Qi (ψ0,i + ψ2,i k_def),
  against span/limit (UK NA Table NA.5, from memory: ℓ/250 for floor and roof members with a
  plastered or plasterboard ceiling; ℓ/150 without);
* :func:`check_en1995_floor_vibration`: residential floors, §7.3 with the UK NA (NA.2.6,
  from memory): f_1 = π/(2ℓ²) √((EI)_ℓ/m) (7.5) must exceed 8 Hz (below it the floor needs a
  special investigation, §7.3.1(2), and the check refuses); the deflection under a 1 kN point
  load, w = 1000 k_dist ℓ_eq³ k_amp/(48 (EI)_joist) mm/kN with k_dist = max(k_strut [0.38 −
  0.08 ln(14 (EI)_b/s⁴)], 0.30), limited to a = 1.8 mm/kN (ℓ ≤ 4000 mm) or 16500/ℓ^1.1; the unit
  impulse velocity v = 4 (0.4 + 0.6 n_40)/(m B ℓ + 200) (7.6), n_40 from (7.7), limited to
  b^(f_1 ζ − 1) with b = 180 − 60a (a ≤ 1) or 160 − 40a (a > 1), ζ = 0.02.
"""

from __future__ import annotations

import math
from collections.abc import Mapping

from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.en1995.members import EN1995, TimberMemberEC
from calcpack.checks.en1995.values import k_def
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import at_least, one_of, positive, within

__all__ = ["check_en1995_deflection", "check_en1995_floor_vibration"]


def check_en1995_deflection(
    member: TimberMemberEC,
    *,
    span: Quantity,
    w_G: Quantity,
    w_Q: Mapping[str, tuple[Quantity, float, float]],
    leading: str | None = None,
    limit: float = 250.0,
    mark: str = "member",
) -> MemberChecks:
    """Final deflection with creep against span/limit.

    Args:
        span: the span [length]. w_G: instantaneous deflection under the permanent actions.
        w_Q: variable case -> (instantaneous deflection, ψ0, ψ2) (e.g. EN 1990 UK NA Table
            NA.A1.1 for category A: ψ0 = 0.7, ψ2 = 0.3). leading: the leading variable case
            (default: the one with the largest deflection).
        limit: span/limit (250 by the UK NA for members with a plasterboard ceiling).
    """
    require(span, "[length]", "span", positive=True)
    require(w_G, "[length]", "w_G", nonnegative=True)
    positive("limit", limit)
    at_least("w_Q", w_Q, what="variable action (case -> (w_inst, psi0, psi2))")
    for k, (w, p0, p2) in w_Q.items():
        require(w, "[length]", f"w_Q[{k!r}]", nonnegative=True)
        within(f"psi0 of {k!r}", p0, 0.0, 1.0)
        within(f"psi2 of {k!r}", p2, 0.0, 1.0)
    lead = leading or max(w_Q, key=lambda k: si(w_Q[k][0]))
    one_of("leading", lead, list(w_Q))
    kd = k_def(member.grade.product, member.service_class)

    def logic(c: Recorder) -> None:
        c.heading("Final deflection with creep", 3)
        kdef = c.given(
            "k_def",
            kd,
            f"{member.grade.product} timber, service class {member.service_class}",
            source="EN 1995-1-1 Table 3.2",
        )
        wG = c.given(
            "w_inst_G",
            w_G.to("mm"),
            "instantaneous deflection, permanent actions",
            source="beam analysis, E_0,mean",
        )
        total = wG * (1 + kdef)
        for k, (w, p0, p2) in w_Q.items():
            wq = c.given(
                f"w_inst_{k}",
                w.to("mm"),
                f"instantaneous deflection, {k}",
                source="beam analysis, E_0,mean",
            )
            psi2 = c.given(
                f"psi_2_{k}",
                p2,
                f"quasi-permanent factor, {k}",
                source="EN 1990 UK NA Table NA.A1.1",
            )
            if k == lead:
                total = total + wq * (1 + psi2 * kdef)
            else:
                psi0 = c.given(
                    f"psi_0_{k}",
                    p0,
                    f"combination factor, {k}",
                    source="EN 1990 UK NA Table NA.A1.1",
                )
                total = total + wq * (psi0 + psi2 * kdef)
        wfin = c.derive(
            "w_fin",
            total,
            f"final deflection ({lead} leading)",
            unit="mm",
            ref="EN 1995-1-1 Eq. (2.2)-(2.5), §2.3.2.2",
        )
        L = c.given("L", span.to("mm"), "span", source="drawing")
        wlim = c.derive(
            "w_lim",
            L / limit,
            f"limit ℓ/{limit:g}",
            unit="mm",
            ref="UK NA to BS EN 1995-1-1 Table NA.5 (from memory)",
        )
        c.check("Final deflection (2.2.3)", wfin, wlim, ref="EN 1995-1-1 §7.2, UK NA Table NA.5")

    return run_checks(mark, "final deflection", EN1995, logic)


def check_en1995_floor_vibration(
    joist: TimberMemberEC,
    *,
    span: Quantity,
    spacing: Quantity,
    floor_width: Quantity,
    mass: Quantity,
    deck_EI: Quantity,
    strutting: bool = False,
    mark: str = "floor",
) -> MemberChecks:
    """Vibration of a residential timber floor on simply supported joists (§7.3, UK NA).

    Args:
        joist: the joist (E_0,mean, b × h). span: ℓ. spacing: s (joist centres).
        floor_width: B, the floor's width across the joists. mass: permanent mass per unit
            area [kg/m²]. deck_EI: flexural rigidity of the floor across the joists (EI)_b per
            metre width [N·m²/m], e.g. E t³/12 of the deck. strutting: the joists are strutted.

    Raises:
        OutOfScopeError: f_1 ≤ 8 Hz (§7.3.1(2): special investigation).
    """
    for n, v, d in (
        ("span", span, "[length]"),
        ("spacing", spacing, "[length]"),
        ("floor_width", floor_width, "[length]"),
        ("mass", mass, "[mass]/[length]**2"),
        ("deck_EI", deck_EI, "[force]*[length]"),
    ):
        require(v, d, n, positive=True)
    g = joist.grade
    EI_joist = si(g.E0_mean) * si(joist.b) * si(joist.h) ** 3 / 12  # N m²
    EI_l = EI_joist / si(spacing)  # N m²/m
    f1 = math.pi / (2 * si(span) ** 2) * math.sqrt(EI_l / si(mass))
    if f1 <= 8.0:
        raise OutOfScopeError(
            f"Floor fundamental frequency f_1 = {f1:.2f} Hz ≤ 8 Hz (span {span:~P}, joists "
            f"{joist.material} {joist.b:~P} × {joist.h:~P} at {spacing:~P}, m = {mass:~P}): "
            "EN 1995-1-1 §7.3.1(2) requires a special investigation, not covered here"
        )

    def logic(c: Recorder) -> None:
        c.heading("Floor vibration, EN 1995-1-1 §7.3 and UK NA NA.2.6", 3)
        L = c.given("l", span.to("m"), "joist span", source="drawing")
        s = c.given("s", spacing.to("m"), "joist spacing", source="drawing")
        B = c.given("B", floor_width.to("m"), "floor width", source="drawing")
        m = c.given(
            "m",
            mass.to("kg/m**2"),
            "floor mass per unit area (permanent actions)",
            source="EN 1991-1-1 weights",
        )
        E = c.given("E_0_mean", g.E0_mean, "mean modulus", source=g.source)
        b, h = (
            c.given("b", joist.b.to("mm"), "joist breadth"),
            c.given("h", joist.h.to("mm"), "joist depth"),
        )
        EIj = c.derive("EI_joist", E * b * h**3 / 12, "joist flexural rigidity", unit="N*m**2")
        EIl = c.derive(
            "EI_l", EIj / s, "floor rigidity along the joists per metre", unit="N*m**2/m"
        )
        c.given(
            "EI_b",
            deck_EI.to("N*m**2/m"),
            "floor rigidity across the joists per metre",
            source="deck E t³/12",
        )
        f1q = c.derive(
            "f_1",
            c.pi / (2 * L**2) * c.sqrt(EIl / m),
            "fundamental frequency",
            unit="Hz",
            ref="EN 1995-1-1 Eq. (7.5)",
        )
        c.text("f_1 > 8 Hz: the checks of §7.3.3 apply.")
        kstrut = 0.97 if strutting else 1.0
        s_m, eib = si(spacing), si(deck_EI)
        kd = max(kstrut * (0.38 - 0.08 * math.log(14 * eib / s_m**4)), 0.30)
        kdist = c.given(
            "k_dist",
            kd,
            f"k_strut = {kstrut:g}: max(k_strut [0.38 − 0.08 ln(14 (EI)_b/s⁴)], 0.30)",
            source="UK NA to BS EN 1995-1-1 NA.2.6.2 (from memory)",
        )
        kamp = c.given(
            "k_amp",
            1.05,
            "simply supported solid timber joists",
            source="UK NA to BS EN 1995-1-1 Table NA.6 (from memory)",
        )
        F = c.given("F", Q_(1.0, "kN"), "unit point load", source="EN 1995-1-1 §7.3.3(2)")
        w = c.derive(
            "w_1kN",
            F * kdist * L**3 * kamp / (48 * EIj),
            "deflection under a 1 kN point load",
            unit="mm",
            ref="UK NA to BS EN 1995-1-1 NA.2.6.2",
        )
        l_mm = si(span) * 1e3
        a_lim = 1.8 if l_mm <= 4000 else 16500 / l_mm**1.1
        alim = c.given(
            "a",
            Q_(a_lim, "mm"),
            "limit per kN (ℓ ≤ 4000 mm: 1.8 mm; else 16500/ℓ^1.1)",
            source="UK NA to BS EN 1995-1-1 Table NA.5 (from memory)",
        )
        c.check("Floor deflection under 1 kN (7.3)", w, alim, ref="EN 1995-1-1 Eq. (7.3), UK NA")
        n40v = ((40 / f1) ** 2 - 1) * (si(floor_width) / si(span)) ** 4 * EI_l / eib
        n40 = c.given(
            "n_40", n40v**0.25, "first-order modes up to 40 Hz", source="EN 1995-1-1 Eq. (7.7)"
        )
        v = c.derive(
            "v",
            4 * (0.4 + 0.6 * n40) / (m * B * L + Q_(200, "kg")),
            "unit impulse velocity response",
            unit="m/(N*s**2)",
            ref="EN 1995-1-1 Eq. (7.6)",
        )
        bpar = 180 - 60 * a_lim if a_lim <= 1 else 160 - 40 * a_lim
        bq = c.given(
            "b_v", bpar, "b = 180 − 60a (a ≤ 1) or 160 − 40a", source="UK NA NA.2.6.2 (from memory)"
        )
        zeta = c.given("zeta", 0.02, "modal damping ratio", source="UK NA to BS EN 1995-1-1")
        vlim = c.derive(
            "v_lim",
            bq ** (f1q * Q_(1, "s") * zeta - 1) * Q_(1.0, "m/(N*s**2)"),
            "limit",
            unit="m/(N*s**2)",
            ref="EN 1995-1-1 Eq. (7.4)",
        )
        c.check("Unit impulse velocity (7.4)", v, vlim, ref="EN 1995-1-1 Eq. (7.4), UK NA")

    return run_checks(mark, "residential floor vibration", EN1995, logic)
