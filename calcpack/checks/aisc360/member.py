"""ANSI/AISC 360-16 member check of a tabulated shape: tension (§D2), compression (Chapter E),
flexure about x and y (Chapter F), shear (§G2, §G3, §G4, §G5, §G6) and combined axial force and
flexure (§H1.1), LRFD or ASD, for one set of required strengths.

Refusals: §H2 (single angles with axial force and flexure) and §H3 (torsion) are not covered;
slender elements and shapes outside the clause modules' scope are refused by those modules.
"""

from __future__ import annotations

import math
from typing import Any

from calcpack.checks.aisc360.compression import compression_strength
from calcpack.checks.aisc360.flexure_shapes import flexure_strength
from calcpack.checks.aisc360.member_data import (
    MemberForces,
    SteelMember,
    check_method,
    design_strength,
    member_standard,
)
from calcpack.checks.aisc360.shape import E_SOURCE
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_, Quantity, require

__all__ = ["check_aisc_member", "shear_strength"]

_I = ("W", "M", "S", "HP")


def _nonzero(q: Quantity) -> bool:
    return abs(float(q.magnitude)) > 0


def shear_strength(c: Recorder, m: SteelMember, direction: str, method: str) -> Any:
    """The available shear strength along ``direction`` ("y": in the web; "x": in the flanges)."""
    s, t = m.shape, m.shape.type
    Fy = c.given("F_y", m.Fy, "yield stress", source=m.grade or "given")
    E = c.given("E", m.E, "modulus of elasticity", source=E_SOURCE)
    root = math.sqrt(float((m.E / m.Fy).to("").magnitude))
    key = "shear"
    if t in ("BAR", "ROUND BAR", "2L"):
        raise OutOfScopeError(
            f"Shear of {s.designation}: no AISC 360-16 Chapter G clause for solid bars or double "
            "angles is implemented here; check shear separately"
        )
    if t in ("HSS round", "PIPE"):
        c.heading("Shear, §G5 (round HSS)", 3)
        Ag = c.given("A_g", s["A"], "gross area", source=s.source)
        Dt = c.derive("D_t", s["OD"] / s["tdes"], "wall slenderness", ref="AISC 360-16 §G5")
        c.text("F_cr by Eq. (G5-2b) only (L_v not used), which is the lower bound: conservative.")
        Fcr = c.derive(
            "F_cr",
            c.min(0.78 * E / Dt**1.5, 0.6 * Fy),
            "shear critical stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (G5-2b)",
        )
        Vn = c.derive(
            "V_n", Fcr * Ag / 2, "nominal shear strength", unit="kip", ref="AISC 360-16 Eq. (G5-1)"
        )
        return design_strength(c, key, Vn, method, name="V_c", unit="kip", what="shear strength")
    if t == "HSS":
        c.heading("Shear, §G4 (rectangular HSS)", 3)
        wall = "h" if direction == "y" else "b"
        h = c.given("h", s[wall], "flat width of the walls resisting shear", source=s.source)
        tw = c.given("t", s["tdes"], "design wall thickness", source=s.source)
        kv = c.given("k_v", 5.0, "shear buckling coefficient", source="AISC 360-16 §G4")
        Aw = c.derive("A_w", 2 * h * tw, "shear area", unit="inch**2", ref="AISC 360-16 §G4")
        Cv = _cv2(c, h / tw, kv, E, Fy)
    elif t == "L":
        c.heading("Shear, §G3 (single angle, vertical leg)", 3)
        b = c.given("b", s["d"], "width of the leg resisting shear", source=s.source)
        tw = c.given("t", s["t"], "leg thickness", source=s.source)
        kv = c.given("k_v", 1.2, "shear buckling coefficient", source="AISC 360-16 §G3")
        Aw = c.derive("A_w", b * tw, "shear area", unit="inch**2", ref="AISC 360-16 Eq. (G3-1)")
        Cv = _cv2(c, b / tw, kv, E, Fy)
    elif direction == "x":
        c.heading("Shear in the flanges, §G6 (weak axis)", 3)
        n = 2 if t in _I else 1
        bf = c.given("b_f", s["bf"], "flange width", source=s.source)
        tf = c.given("t_f", s["tf"], "flange thickness", source=s.source)
        kv = c.given("k_v", 1.2, "shear buckling coefficient", source="AISC 360-16 §G6")
        Aw = c.derive(
            "A_w",
            n * bf * tf,
            "shear area of the flanges",
            unit="inch**2",
            ref="AISC 360-16 Eq. (G6-1)",
        )
        Cv = _cv2(c, (bf / 2 if t in _I else bf) / tf, kv, E, Fy)
    else:
        c.heading("Shear in the web, §G2.1", 3)
        d = c.given("d", s["d"], "depth", source=s.source)
        tw = c.given("t_w", s["tw"], "web thickness", source=s.source)
        Aw = c.derive("A_w", d * tw, "web area", unit="inch**2", ref="AISC 360-16 §G2.1")
        h_tw = float(((s["d"] - 2 * s["kdes"]) / s["tw"]).to("").magnitude)
        tee = t in ("WT", "MT", "ST")
        if t in _I and h_tw <= 2.24 * root:
            c.text("Rolled I-shape with $h/t_w \\le 2.24\\sqrt{E/F_y}$: §G2.1(a), C_v1 = 1.0.")
            Cv = c.given(
                "C_v1", 1.0, "web shear strength coefficient", source="AISC 360-16 §G2.1(a)"
            )
            key = "shear rolled I"
        else:
            kv = c.given(
                "k_v",
                1.2 if tee else 5.34,
                "web shear buckling coefficient",
                source="AISC 360-16 §G2.1(b)(2)",
            )
            ratio = (
                c.derive("d_t_w", d / tw, "stem slenderness", ref="AISC 360-16 §G2.1(b)")
                if tee
                else c.given("h_t_w", h_tw, "web slenderness", source=s.source)
            )
            Cv = _cv1(c, ratio, kv, E, Fy)
    Vn = c.derive(
        "V_n", 0.6 * Fy * Aw * Cv, "nominal shear strength", unit="kip", ref="AISC 360-16 §G"
    )
    return design_strength(c, key, Vn, method, name="V_c", unit="kip", what="shear strength")


def _cv1(c: Recorder, ratio: Any, kv: Any, E: Any, Fy: Any) -> Any:
    lim = c.derive("lambda_v", 1.10 * c.sqrt(kv * E / Fy), "limit", ref="AISC 360-16 Eq. (G2-3)")
    if c.f(ratio) <= c.f(lim):
        return c.given("C_v1", 1.0, "web shear strength coefficient", source="AISC 360-16 (G2-3)")
    return c.derive(
        "C_v1", lim / ratio, "web shear strength coefficient", ref="AISC 360-16 Eq. (G2-4)"
    )


def _cv2(c: Recorder, ratio: Any, kv: Any, E: Any, Fy: Any) -> Any:
    ratio = c.derive(
        "b_t", ratio, "width-to-thickness ratio of the shear element", ref="AISC 360-16 §G2.2"
    )
    r = c.f(ratio)
    a = 1.10 * math.sqrt(float((c.q(kv) * c.q(E) / c.q(Fy)).to("").magnitude))
    if r <= a:
        return c.given("C_v2", 1.0, "shear buckling coefficient", source="AISC 360-16 Eq. (G2-9)")
    if r <= 1.37 * a / 1.10:
        return c.derive(
            "C_v2",
            1.10 * c.sqrt(kv * E / Fy) / ratio,
            "shear buckling coefficient",
            ref="AISC 360-16 Eq. (G2-10)",
        )
    return c.derive(
        "C_v2",
        1.51 * kv * E / (ratio**2 * Fy),
        "shear buckling coefficient",
        ref="AISC 360-16 Eq. (G2-11)",
    )


def check_aisc_member(
    member: SteelMember,
    forces: MemberForces,
    *,
    method: str = "LRFD",
    mark: str = "C1",
    Ae: Quantity | None = None,
) -> MemberChecks:
    """Check a steel member for one set of required strengths to AISC 360-16.

    Args:
        member: the :class:`SteelMember` (shape, F_y, effective and unbraced lengths, C_b).
        forces: required strengths (P positive in compression), with their combination.
        method: "LRFD" (forces are P_u, M_u, V_u) or "ASD" (P_a, M_a, V_a).
        mark: the member mark. Ae: effective net area for tension rupture (§D2(b), §D3);
            without it tension rupture is reported NOT COVERED.

    Returns:
        MemberChecks: axial, flexure about x and y, shear and the §H1.1 interaction, each with
        its clause and the combination.

    Raises:
        OutOfScopeError: slender HSS walls in flexure (§F7 effective sections), unsupported shapes
            or clauses, §H2 cases (single angles with axial force and flexure).
        InputError: bad method, wrong units.
    """
    method = check_method(method)
    if Ae is not None:
        require(Ae, "[area]", "Ae", positive=True)
    s = member.shape
    P, Mx, My = forces.P, forces.Mx, forces.My
    axial = _nonzero(P)
    bending = _nonzero(Mx) or _nonzero(My)
    if s.type == "L" and axial and bending:
        raise OutOfScopeError(
            f"Single angle {s.designation} with axial force and flexure: AISC 360-16 §H2 "
            "applies (stresses about the principal axes); check it with check_aisc_h2, giving "
            "the available strengths about the principal axes"
        )
    if not (axial or bending or _nonzero(forces.Vx) or _nonzero(forces.Vy)):
        from calcpack.errors import InputError

        raise InputError(
            "No required strength given: forces P, Mx, My, Vx and Vy are all zero",
            name="forces",
            value=forces,
            expected="at least one non-zero force",
        )
    combo = forces.combination
    sfx = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        c.assume("No torsion: AISC 360-16 §H3 is not covered by this check.")
        ratios: dict[str, Any] = {}
        if axial and float(P.magnitude) > 0:
            Pn = compression_strength(c, member)
            Pc = design_strength(
                c, "compression", Pn, method, name="P_c", unit="kip", what="compressive strength"
            )
            Pr = c.given(
                f"P_{sfx}", P, "required axial strength", source=combo or "given", unit="kip"
            )
            c.check("Compression", Pr, Pc, ref="AISC 360-16 Chapter E", combination=combo)
            ratios["P"] = (Pr, Pc)
        elif axial:
            c.heading("Tension, AISC 360-16 §D2", 3)
            Fy = c.given("F_y", member.Fy, "yield stress", source=member.grade or "given")
            Ag = c.given("A_g", s["A"], "gross area", source=s.source)
            Pn = c.derive(
                "P_n", Fy * Ag, "tensile yielding", unit="kip", ref="AISC 360-16 Eq. (D2-1)"
            )
            Pc = design_strength(
                c, "tension yielding", Pn, method, name="P_c", unit="kip", what="tensile strength"
            )
            Pr = c.given(
                f"P_{sfx}", -P, "required tensile strength", source=combo or "given", unit="kip"
            )
            c.check("Tension yielding", Pr, Pc, ref="AISC 360-16 §D2(a)", combination=combo)
            if Ae is None or member.Fu is None:
                c.not_covered(
                    "Tension rupture",
                    "effective net area Ae and F_u not given",
                    ref="AISC 360-16 §D2(b)",
                )
            else:
                Fu = c.given("F_u", member.Fu, "tensile stress", source=member.grade or "given")
                A_e = c.given("A_e", Ae, "effective net area", source="given (§D3)")
                Pnr = c.derive(
                    "P_n_r", Fu * A_e, "tensile rupture", unit="kip", ref="AISC 360-16 Eq. (D2-2)"
                )
                Pcr = design_strength(
                    c,
                    "tension rupture",
                    Pnr,
                    method,
                    name="P_c_r",
                    unit="kip",
                    what="rupture strength",
                )
                c.check("Tension rupture", Pr, Pcr, ref="AISC 360-16 §D2(b)", combination=combo)
            ratios["P"] = (Pr, Pc)
        for ax, M in (("x", Mx), ("y", My)):
            if not _nonzero(M):
                continue
            Mn = flexure_strength(c, member, ax)  # type: ignore[arg-type]
            Mc = design_strength(
                c, "flexure", Mn, method, name=f"M_c{ax}", unit="kip*ft", what="flexural strength"
            )
            Mr = c.given(
                f"M_{sfx}{ax}",
                abs(M),
                f"required flexural strength about {ax}",
                source=combo or "given",
                unit="kip*ft",
            )
            c.check(f"Flexure {ax}", Mr, Mc, ref="AISC 360-16 Chapter F", combination=combo)
            ratios[ax] = (Mr, Mc)
        for d, V in (("y", forces.Vy), ("x", forces.Vx)):
            if not _nonzero(V):
                continue
            Vc = shear_strength(c, member, d, method)
            Vr = c.given(
                f"V_{sfx}{d}",
                abs(V),
                "required shear strength",
                source=combo or "given",
                unit="kip",
            )
            c.check(f"Shear {d}", Vr, Vc, ref="AISC 360-16 Chapter G", combination=combo)
        if "P" in ratios and ("x" in ratios or "y" in ratios):
            _interaction(c, ratios, combo)

    title = f"{s.designation} member, AISC 360-16 {method}"
    return run_checks(mark, title, member_standard(method), logic)


def _interaction(c: Recorder, ratios: dict[str, Any], combo: str | None) -> None:
    c.heading("Combined axial force and flexure, §H1.1", 3)
    Pr, Pc = ratios["P"]
    rp = c.derive("r_P", Pr / Pc, "axial ratio P_r/P_c", ref="AISC 360-16 §H1.1")
    terms = []
    for ax in ("x", "y"):
        if ax in ratios:
            Mr, Mc = ratios[ax]
            terms.append(
                c.derive(f"r_M{ax}", Mr / Mc, f"flexural ratio about {ax}", ref="AISC 360-16 §H1.1")
            )
    rm = terms[0] if len(terms) == 1 else terms[0] + terms[1]
    if c.f(rp) >= 0.2:
        total = c.derive(
            "U_H1", rp + 8 / 9 * rm, "interaction, P_r/P_c ≥ 0.2", ref="AISC 360-16 Eq. (H1-1a)"
        )
        ref = "AISC 360-16 Eq. (H1-1a)"
    else:
        total = c.derive(
            "U_H1", rp / 2 + rm, "interaction, P_r/P_c < 0.2", ref="AISC 360-16 Eq. (H1-1b)"
        )
        ref = "AISC 360-16 Eq. (H1-1b)"
    c.check("Axial and flexure", total, Q_(1.0, ""), ref=ref, combination=combo)
