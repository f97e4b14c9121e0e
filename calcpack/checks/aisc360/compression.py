"""ANSI/AISC 360-16 Chapter E: compression strength of members.

* §E3 flexural buckling about both axes (W, M, S, HP, C, MC, WT, MT, ST, rectangular and round
  HSS, Pipe, solid bars), effective lengths L_cx, L_cy given;
* §E4 torsional buckling of doubly symmetric I-shapes (Eq. E4-2) and flexural-torsional
  buckling of singly symmetric tees and channels (Eq. E4-3, with H and r̄_o tabulated), with
  L_cz (default L_cy); closed sections (HSS, Pipe) are not subject to torsional buckling;
* §E7 slender elements (Table B4.1a): P_n = F_cr A_e with the effective widths of §E7.1 and
  round HSS by §E7.2(b) (``compression_slender.py``);
* single angles (§E5, depends on the end connection) are checked by
  ``check_aisc_angle_strut`` (``compression_angle.py``) and refused here.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aisc360.compression_slender import critical_stress, effective_area
from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError

__all__ = ["compression_elements", "compression_strength"]

_I = ("W", "M", "S", "HP")
_CHANNEL = ("C", "MC")
_TEE = ("WT", "MT", "ST")
_ROUND = ("HSS round", "PIPE")


def compression_elements(m: SteelMember) -> list[tuple[str, float, float, str]]:
    """Width-to-thickness ratios of the shape's elements in compression with their λ_r limit
    (Table B4.1a): (element, ratio, limit, case)."""
    import math

    s = m.shape
    root = math.sqrt(float((m.E / m.Fy).to("").magnitude))
    e_fy = float((m.E / m.Fy).to("").magnitude)
    if s.type in _I + _CHANNEL:
        bf, tf = s["bf"], s["tf"]
        flange = float((bf / (2 * tf) if s.type in _I else bf / tf).to("").magnitude)
        web = float(((s["d"] - 2 * s["kdes"]) / s["tw"]).to("").magnitude)
        return [
            ("flange b/t", flange, 0.56 * root, "Table B4.1a case 1"),
            ("web h/t_w", web, 1.49 * root, "Table B4.1a case 5"),
        ]
    if s.type in _TEE:
        flange = float((s["bf"] / (2 * s["tf"])).to("").magnitude)
        stem = float((s["d"] / s["tw"]).to("").magnitude)
        return [
            ("flange b/t", flange, 0.56 * root, "Table B4.1a case 1"),
            ("stem d/t_w", stem, 0.75 * root, "Table B4.1a case 4"),
        ]
    if s.type == "HSS":
        b = float((s["b"] / s["tdes"]).to("").magnitude)
        h = float((s["h"] / s["tdes"]).to("").magnitude)
        return [
            ("wall b/t", b, 1.40 * root, "Table B4.1a case 6"),
            ("wall h/t", h, 1.40 * root, "Table B4.1a case 6"),
        ]
    if s.type in _ROUND:
        dt = float((s["OD"] / s["tdes"]).to("").magnitude)
        return [("wall D/t", dt, 0.11 * e_fy, "Table B4.1a case 9")]
    if s.type in ("BAR", "ROUND BAR"):
        return []  # a solid bar has no plate elements (Table B4.1a)
    if s.type == "2L":
        raise OutOfScopeError(
            f"Double angle {s.designation} in compression: flexural-torsional buckling of double "
            "angles (AISC 360-16 §E4) with the built-up member rules of §E6 is not implemented"
        )
    raise OutOfScopeError(
        f"Shape {s.designation} ({s.type}) in compression: a single angle's strength depends on "
        "its end connection (AISC 360-16 §E5); check it with check_aisc_angle_strut"
    )


def compression_strength(c: Recorder, m: SteelMember) -> Any:
    """The nominal compressive strength P_n (§E3, §E4) as a handle; refuses outside scope.

    Raises:
        OutOfScopeError: a single angle (§E5), round HSS with D/t ≥ 0.45E/F_y, no effective
            length.
    """
    s = m.shape
    elements = compression_elements(m)
    slender = [e for e in elements if e[1] > e[2]]
    if m.Lcx is None or m.Lcy is None:
        missing = "Lcx" if m.Lcx is None else "Lcy"
        raise OutOfScopeError(
            f"Compression needs the effective lengths Lcx and Lcy (got {missing} = None): give "
            "K·L about each axis (AISC 360-16 §E2)"
        )
    c.heading("Compression, AISC 360-16 Chapter E", 3)
    if elements:
        c.table(
            ["element", "ratio", "λ_r", "source"],
            [[n, f"{r:.3g}", f"{lim:.3g}", case] for n, r, lim, case in elements],
            caption="Width-to-thickness ratios in compression: "
            + ("slender elements, §E7 applies" if slender else "no slender element")
            + " (§B4.1a)",
        )
    else:
        c.text("Solid bar: no plate elements, so no local buckling in compression (§B4.1a).")
    Fy = c.given("F_y", m.Fy, f"yield stress {m.grade}".strip(), source=m.grade or "given")
    E = c.given("E", m.E, "modulus of elasticity", source="AISC 360-16 §B (29 000 ksi)")
    Ag = c.given("A_g", s["A"], "gross area", source=s.source)
    Lcx = c.given("L_cx", m.Lcx, "effective length, x axis", source="given", unit="ft")
    Lcy = c.given("L_cy", m.Lcy, "effective length, y axis", source="given", unit="ft")
    rx = c.given("r_x", s["rx"], "radius of gyration", source=s.source)
    ry = c.given("r_y", s["ry"], "radius of gyration", source=s.source)
    slx = c.derive("lambda_x", Lcx / rx, "slenderness L_cx/r_x", ref="AISC 360-16 §E2")
    sly = c.derive("lambda_y", Lcy / ry, "slenderness L_cy/r_y", ref="AISC 360-16 §E2")
    if max(c.f(slx), c.f(sly)) > 200:
        c.caution(
            "L_c/r exceeds 200, the limit the AISC 360-16 §E2 user note recommends for members "
            "in compression."
        )
    gov = slx if c.f(slx) >= c.f(sly) else sly
    Fe = c.derive(
        "F_e",
        c.pi**2 * E / gov**2,
        "elastic buckling stress, flexural, larger L_c/r",
        unit="ksi",
        ref="AISC 360-16 Eq. (E3-4)",
    )
    Fe = _torsional(c, m, E, Fe, Ag)
    Fcr = critical_stress(c, Fy, Fe)
    if slender:
        Ae = effective_area(c, m, Fy, E, Fcr, Ag)
        return c.derive(
            "P_n",
            Fcr * Ae,
            "nominal compressive strength, slender elements",
            unit="kip",
            ref="AISC 360-16 Eq. (E7-1)",
        )
    return c.derive(
        "P_n", Fcr * Ag, "nominal compressive strength", unit="kip", ref="AISC 360-16 Eq. (E3-1)"
    )


def _torsional(c: Recorder, m: SteelMember, E: Any, Fe_flex: Any, Ag: Any) -> Any:
    """F_e of §E4 where it applies; returns the governing (smaller) elastic buckling stress."""
    s = m.shape
    if s.type == "HSS" or s.type in _ROUND:
        c.text("Closed section: torsional buckling (§E4) does not apply; F_e is flexural.")
        return Fe_flex
    if s.type == "ROUND BAR":
        c.text("Solid round bar: torsional buckling (§E4) does not govern; F_e is flexural.")
        return Fe_flex
    Lcz = c.given(
        "L_cz",
        m.Lcz if m.Lcz is not None else m.Lcy,
        "effective length, torsional buckling",
        source="given" if m.Lcz is not None else "taken as L_cy",
        unit="ft",
    )
    G = c.given("G", m.G, "shear modulus", source="AISC 360-16 §B (11 200 ksi)")
    J = c.given("J", s["J"], "torsional constant", source=s.source)
    Cw = c.given("C_w", s["Cw"], "warping constant", source=s.source)
    if s.type in _I or s.type == "BAR":
        Ix = c.given("I_x", s["Ix"], "moment of inertia", source=s.source)
        Iy = c.given("I_y", s["Iy"], "moment of inertia", source=s.source)
        Fez = c.derive(
            "F_e_z",
            (c.pi**2 * E * Cw / Lcz**2 + G * J) / (Ix + Iy),
            "elastic torsional buckling stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (E4-2)",
        )
    else:
        # tees: y is the axis of symmetry; channels: x is (flexural-torsional about it)
        sym = "y" if s.type in _TEE else "x"
        r = c.given(f"r_{sym}", s[f"r{sym}"], "radius of gyration", source=s.source)
        Lc = c.q(m.Lcy if sym == "y" else m.Lcx)
        Lsym = c.given(f"L_c{sym}", Lc, "effective length about the axis of symmetry", unit="ft")
        Fes = c.derive(
            f"F_e{sym}",
            c.pi**2 * E / (Lsym / r) ** 2,
            "flexural buckling about the axis of symmetry",
            unit="ksi",
            ref="AISC 360-16 Eq. (E4-7)" if sym == "y" else "AISC 360-16 Eq. (E4-6)",
        )
        ro = c.given(
            "r_o", s["ro"], "polar radius of gyration about the shear centre", source=s.source
        )
        H = c.given("H", s["H"], "flexural constant", source=s.source)
        Fz = c.derive(
            "F_ez",
            (c.pi**2 * E * Cw / Lcz**2 + G * J) / (Ag * ro**2),
            "torsional buckling stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (E4-8)",
        )
        Fez = c.derive(
            "F_e_z",
            (Fes + Fz) / (2 * H) * (1 - c.sqrt(1 - 4 * Fes * Fz * H / (Fes + Fz) ** 2)),
            "elastic flexural-torsional buckling stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (E4-3)",
        )
    if c.q(Fez) < c.q(Fe_flex):
        c.text("Torsional (or flexural-torsional) buckling governs.")
        return Fez
    c.text("Flexural buckling governs over torsional buckling.")
    return Fe_flex
