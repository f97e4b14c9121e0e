"""ANSI/AISC 360-16 Chapter F: nominal flexural strength of tabulated shapes.

* I-shapes (W, M, S, HP) about x: §F2 (compact flanges) or §F3 (noncompact or slender
  flanges), the web compact (h/t_w ≤ 3.76√(E/F_y)) -- otherwise §F4/§F5 apply and are refused;
* channels about x: §F2 with c = (h_o/2)√(I_y/C_w), compact flanges only;
* I-shapes and channels about y: §F6;
* rectangular and square HSS about either axis: §F7 (yielding, flange and web local buckling,
  lateral-torsional buckling); slender flanges or webs (effective section) are refused;
* round HSS and Pipe: §F8 (D/t ≤ 0.45E/F_y);
* single angles about the geometric axis parallel to the horizontal leg, sagging (the vertical
  leg's toe in compression): §F10 yielding, leg local buckling, and lateral-torsional buckling of
  equal-leg angles; an unequal-leg angle without continuous lateral-torsional restraint needs
  principal-axis bending and is refused;
* tees (WT, MT, ST) about x: §F9; rectangular and round bars: §F11
  (``flexure_tee_bar.py``); double angles about x: §F9 (``flexure_double_angle.py``); tees
  and double angles about y are refused.

``Lb = None`` on the member means continuous lateral-torsional restraint.
"""

from __future__ import annotations

import math
from typing import Any, Literal

from calcpack.checks.aisc360.flexure_clauses import (
    angle_ltb_f10,
    flange_limits,
    flange_slenderness,
    least_of,
    leg_local_f10,
    transition,
)
from calcpack.checks.aisc360.flexure_double_angle import double_angle_f9
from calcpack.checks.aisc360.flexure_tee_bar import BARS, TEES, bar_f11, tee_f9
from calcpack.checks.aisc360.ltb_f2 import limiting_lengths_f2, ltb_strength_f2
from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError

__all__ = ["Axis", "flexure_strength"]

Axis = Literal["x", "y"]
_I = ("W", "M", "S", "HP")
_CHANNEL = ("C", "MC")


def _ratio(q: Any) -> float:
    return float(q.to("").magnitude)


def flexure_strength(c: Recorder, m: SteelMember, axis: Axis) -> Any:
    """M_n about ``axis`` (a handle); refuses shapes and cases outside this module's scope."""
    t = m.shape.type
    c.heading(f"Flexure about {axis}, AISC 360-16 Chapter F", 3)
    Fy = c.given("F_y", m.Fy, f"yield stress {m.grade}".strip(), source=m.grade or "given")
    E = c.given("E", m.E, "modulus of elasticity", source="AISC 360-16 §B (29 000 ksi)")
    root = math.sqrt(_ratio(m.E / m.Fy))
    if t in _I + _CHANNEL and axis == "x":
        return _i_major(c, m, Fy, E, root)
    if t in _I + _CHANNEL:
        return _minor_f6(c, m, Fy, E, root)
    if t == "HSS":
        return _hss_f7(c, m, Fy, E, root, axis)
    if t in ("HSS round", "PIPE"):
        return _round_f8(c, m, Fy, E)
    if t == "L" and axis == "x":
        return _angle_f10(c, m, Fy, E, root)
    if t in TEES and axis == "x":
        return tee_f9(c, m, Fy, E, root)
    if t == "2L" and axis == "x":
        return double_angle_f9(c, m, Fy, E, root)
    if t in BARS:
        return bar_f11(c, m, Fy, E, axis)
    raise OutOfScopeError(
        f"Flexure of {m.shape.designation} ({t}) about {axis} is not covered: AISC 360-16 "
        "§F10 bending of angles about other axes and bending of tees and double angles about "
        "their axis of symmetry (y) are not implemented"
    )


def _i_major(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float) -> Any:
    s = m.shape
    channel = s.type in _CHANNEL
    lam_f = _ratio(s["bf"] / (1 if channel else 2) / s["tf"])
    lam_w = _ratio((s["d"] - 2 * s["kdes"]) / s["tw"])
    if lam_w > 3.76 * root:
        raise OutOfScopeError(
            f"Shape {s.designation}: web h/t_w = {lam_w:.3g} > λ_p = {3.76 * root:.3g} (Table "
            "B4.1b case 15): a noncompact or slender web needs AISC 360-16 §F4/§F5, which are "
            "not implemented"
        )
    if channel and lam_f > 0.38 * root:
        raise OutOfScopeError(
            f"Channel {s.designation}: flange b/t = {lam_f:.3g} > λ_p = {0.38 * root:.3g}: "
            "AISC 360-16 §F2 covers channels with compact flanges only"
        )
    Zx = c.given("Z_x", s["Zx"], "plastic section modulus", source=s.source)
    Sx = c.given("S_x", s["Sx"], "elastic section modulus", source=s.source)
    Mp = c.derive("M_p", Fy * Zx, "plastic moment", unit="kip*ft", ref="AISC 360-16 Eq. (F2-1)")
    if m.Lb is None:
        c.text("Compression flange continuously braced: lateral-torsional buckling does not apply.")
        Mltb = Mp
    else:
        Mltb = _ltb_f2(c, m, Fy, E, Mp, Sx, channel)
    if channel or lam_f <= 0.38 * root:
        c.text("Compact flanges (Table B4.1b case 10): flange local buckling does not apply.")
        return c.derive(
            "M_n",
            c.min(Mltb, Mp),
            "nominal flexural strength",
            unit="kip*ft",
            ref="AISC 360-16 §F2",
        )
    lam, lpf, lrf = flange_slenderness(c, s, E, Fy)
    if c.f(lam) <= c.f(lrf):
        Mflb = c.derive(
            "M_n_FLB",
            transition(Mp, 0.7 * Fy * Sx, lam, lpf, lrf),
            "flange local buckling, noncompact flange",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F3-1)",
        )
    else:
        kc_raw = 4 / math.sqrt(_ratio((s["d"] - 2 * s["kdes"]) / s["tw"]))
        kc = c.given(
            "k_c",
            min(max(kc_raw, 0.35), 0.76),
            "4/√(h/t_w), 0.35 ≤ k_c ≤ 0.76",
            source="AISC 360-16 §F3.2",
        )
        Mflb = c.derive(
            "M_n_FLB",
            0.9 * E * kc * Sx / lam**2,
            "flange local buckling, slender flange",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F3-2)",
        )
    return c.derive(
        "M_n",
        c.min(Mltb, Mflb),
        "nominal flexural strength, lesser",
        unit="kip*ft",
        ref="AISC 360-16 §F3",
    )


def _ltb_f2(c: Recorder, m: SteelMember, Fy: Any, E: Any, Mp: Any, Sx: Any, channel: bool) -> Any:
    s = m.shape
    Lb = c.given("L_b", m.Lb, "unbraced length of the compression flange", unit="ft")
    Cb = c.given("C_b", float(m.Cb), "LTB modification factor", source="given (AISC 360-16 §F1)")
    ry = c.given("r_y", s["ry"], "radius of gyration", source=s.source)
    rts = c.given("r_ts", s["rts"], "effective radius of gyration", source=s.source)
    J = c.given("J", s["J"], "torsional constant", source=s.source)
    ho = c.given("h_o", s["ho"], "distance between flange centroids", source=s.source)
    if channel:
        Iy = c.given("I_y", s["Iy"], "moment of inertia", source=s.source)
        Cw = c.given("C_w", s["Cw"], "warping constant", source=s.source)
        cc = c.derive("c", ho / 2 * c.sqrt(Iy / Cw), "for channels", ref="AISC 360-16 Eq. (F2-8b)")
    else:
        cc = c.given("c", 1.0, "doubly symmetric I-shape", source="AISC 360-16 Eq. (F2-8a)")
    jc = J * cc / (Sx * ho)
    Lp, Lr = limiting_lengths_f2(c, ry=ry, rts=rts, E=E, Fy=Fy, jc=jc)
    Mltb = ltb_strength_f2(c, Lb=Lb, Lp=Lp, Lr=Lr, Cb=Cb, Mp=Mp, Fy=Fy, E=E, Sx=Sx, rts=rts, jc=jc)
    return Mp if Mltb is None else Mltb


def _minor_f6(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float) -> Any:
    s = m.shape
    Zy = c.given("Z_y", s["Zy"], "plastic section modulus", source=s.source)
    Sy = c.given("S_y", s["Sy"], "elastic section modulus", source=s.source)
    Mp = c.derive(
        "M_p",
        c.min(Fy * Zy, 1.6 * Fy * Sy),
        "plastic moment, minor axis",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F6-1)",
    )
    div = 1 if s.type in _CHANNEL else 2
    lam = c.derive(
        "lambda_f", s["bf"] / (div * s["tf"]), "flange slenderness", ref="AISC 360-16 §F6.2"
    )
    if c.f(lam) <= 0.38 * root:
        c.text("Compact flanges: flange local buckling does not apply (§F6.2(a)).")
        return c.derive(
            "M_n", Mp, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F6"
        )
    lpf, lrf = flange_limits(c, E, Fy)
    if c.f(lam) <= c.f(lrf):
        return c.derive(
            "M_n",
            transition(Mp, 0.7 * Fy * Sy, lam, lpf, lrf),
            "flange local buckling, noncompact",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F6-2)",
        )
    Fcr = c.derive(
        "F_cr", 0.69 * E / lam**2, "critical stress", unit="ksi", ref="AISC 360-16 Eq. (F6-4)"
    )
    return c.derive(
        "M_n",
        Fcr * Sy,
        "flange local buckling, slender",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F6-3)",
    )


def _hss_f7(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float, axis: Axis) -> Any:
    s = m.shape
    other = "y" if axis == "x" else "x"
    # bending about x: the flanges are the B sides (flat width b), the webs the Ht sides (h)
    fl, wb = ("b", "h") if axis == "x" else ("h", "b")
    lam_f = _ratio(s[fl] / s["tdes"])
    lam_w = _ratio(s[wb] / s["tdes"])
    if lam_f > 1.40 * root or lam_w > 5.70 * root:
        raise OutOfScopeError(
            f"Shape {s.designation}: a slender flange (b/t = {lam_f:.3g} > {1.40 * root:.3g}) or "
            f"web (h/t = {lam_w:.3g} > {5.70 * root:.3g}) needs the effective section of AISC "
            "360-16 §F7.2(c)/§F7.3(c), which is not implemented"
        )
    Z = c.given(f"Z_{axis}", s[f"Z{axis}"], "plastic section modulus", source=s.source)
    S = c.given(f"S_{axis}", s[f"S{axis}"], "elastic section modulus", source=s.source)
    Mp = c.derive("M_p", Fy * Z, "plastic moment", unit="kip*ft", ref="AISC 360-16 Eq. (F7-1)")
    limits = [Mp]
    t = c.given("t", s["tdes"], "design wall thickness", source=s.source)
    for part, sym, lam_x, width, case, (lim, k1, k0, eq) in (
        ("flange", "f", lam_f, fl, 17, (1.12, 3.57, 4.0, "F7-2")),
        ("web", "w", lam_w, wb, 19, (2.42, 0.305, 0.738, "F7-6")),
    ):
        if lam_x <= lim * root:
            c.text(
                f"Compact {part}s (Table B4.1b case {case}): {part} local buckling does not apply."
            )
            continue
        w_sym = "b" if part == "flange" else "h"
        lam = c.derive(
            f"lambda_{sym}",
            s[width] / t,
            f"{part} slenderness {w_sym}/t",
            ref="AISC 360-16 §B4.1b",
        )
        limits.append(
            c.derive(
                f"M_n_{sym.upper()}LB",
                c.min(Mp - (Mp - Fy * S) * (k1 * lam * c.sqrt(Fy / E) - k0), Mp),
                f"{part} local buckling, noncompact",
                unit="kip*ft",
                ref=f"AISC 360-16 Eq. ({eq})",
            )
        )
    if m.Lb is not None:
        Lb = c.given("L_b", m.Lb, "unbraced length", unit="ft")
        Cb = c.given("C_b", float(m.Cb), "LTB modification factor", source="given")
        r = c.given(f"r_{other}", s[f"r{other}"], "radius of gyration", source=s.source)
        J = c.given("J", s["J"], "torsional constant", source=s.source)
        Ag = c.given("A_g", s["A"], "gross area", source=s.source)
        Lp = c.derive(
            "L_p",
            0.13 * E * r * c.sqrt(J * Ag) / Mp,
            "limiting length",
            unit="ft",
            ref="AISC 360-16 Eq. (F7-12)",
        )
        Lr = c.derive(
            "L_r",
            2 * E * r * c.sqrt(J * Ag) / (0.7 * Fy * S),
            "limiting length",
            unit="ft",
            ref="AISC 360-16 Eq. (F7-13)",
        )
        if c.q(Lb) > c.q(Lr):
            limits.append(
                c.derive(
                    "M_n_LTB",
                    2 * E * Cb * c.sqrt(J * Ag) / (Lb / r),
                    "elastic LTB",
                    unit="kip*ft",
                    ref="AISC 360-16 Eq. (F7-11)",
                )
            )
        elif c.q(Lb) > c.q(Lp):
            limits.append(
                c.derive(
                    "M_n_LTB",
                    Cb * transition(Mp, 0.7 * Fy * S, Lb, Lp, Lr),
                    "inelastic LTB",
                    unit="kip*ft",
                    ref="AISC 360-16 Eq. (F7-10)",
                )
            )
        else:
            c.text("$L_b \\le L_p$: lateral-torsional buckling does not apply (§F7.4).")
    return least_of(c, limits, "AISC 360-16 §F7")


def _round_f8(c: Recorder, m: SteelMember, Fy: Any, E: Any) -> Any:
    s = m.shape
    e_fy = _ratio(m.E / m.Fy)
    dt = _ratio(s["OD"] / s["tdes"])
    if dt >= 0.45 * e_fy:
        raise OutOfScopeError(
            f"Shape {s.designation}: D/t = {dt:.3g} ≥ 0.45E/F_y = {0.45 * e_fy:.3g}: AISC 360-16 "
            "§F8 applies to round HSS with D/t < 0.45E/F_y only"
        )
    Z = c.given("Z", s["Zx"], "plastic section modulus", source=s.source)
    S = c.given("S", s["Sx"], "elastic section modulus", source=s.source)
    Mp = c.derive("M_p", Fy * Z, "plastic moment", unit="kip*ft", ref="AISC 360-16 Eq. (F8-1)")
    if dt <= 0.07 * e_fy:
        c.text("Compact wall, D/t ≤ 0.07E/F_y: local buckling does not apply (§F8.2(a)).")
        return c.derive(
            "M_n", Mp, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F8"
        )
    lam = c.derive("D_t", s["OD"] / s["tdes"], "wall slenderness D/t", ref="AISC 360-16 §F8.2")
    if dt <= 0.31 * e_fy:
        Mlb = c.derive(
            "M_n_LB",
            (0.021 * E / lam + Fy) * S,
            "local buckling, noncompact wall",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F8-2)",
        )
    else:
        Fcr = c.derive(
            "F_cr", 0.33 * E / lam, "critical stress", unit="ksi", ref="AISC 360-16 Eq. (F8-4)"
        )
        Mlb = c.derive(
            "M_n_LB",
            Fcr * S,
            "local buckling, slender wall",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F8-3)",
        )
    return c.derive(
        "M_n", c.min(Mlb, Mp), "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F8"
    )


def _angle_f10(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float) -> Any:
    s = m.shape
    equal = abs(_ratio(s["d"] / s["b"]) - 1) < 1e-9
    restrained = m.Lb is None
    if not restrained and not equal:
        raise OutOfScopeError(
            f"Angle {s.designation} has unequal legs and no continuous lateral-torsional "
            "restraint: AISC 360-16 §F10 then requires bending about the principal axes, which "
            "is not implemented (give Lb = None only where the angle is continuously restrained)"
        )
    c.assume(
        "Bending about the geometric axis parallel to the horizontal leg, sagging: the toe of "
        "the vertical leg (d) is in compression."
    )
    Sx = c.given(
        "S_c", s["Sx"], "elastic section modulus to the vertical leg's toe", source=s.source
    )
    if restrained:
        c.text("Continuous lateral-torsional restraint: M_y about the geometric axis (§F10.2).")
        My = c.derive(
            "M_y", Fy * Sx, "yield moment, geometric axis", unit="kip*ft", ref="AISC 360-16 §F10.1"
        )
    else:
        My = c.derive(
            "M_y",
            0.80 * Fy * Sx,
            "0.80 × yield moment, geometric axis, no restraint",
            unit="kip*ft",
            ref="AISC 360-16 §F10.2(b)(1)",
        )
    limits = [c.derive("M_n_Y", 1.5 * My, "yielding", unit="kip*ft", ref="AISC 360-16 Eq. (F10-1)")]
    t = c.given("t", s["t"], "leg thickness", source=s.source)
    d = c.given("b_c", s["d"], "width of the leg in compression", source=s.source)
    if not restrained:
        Lb = c.given("L_b", m.Lb, "unbraced length", unit="ft")
        Cb = c.given("C_b", float(m.Cb), "LTB modification factor", source="given")
        Mcr = c.derive(
            "M_cr",
            0.58 * E * d**4 * t * Cb / Lb**2 * (c.sqrt(1 + 0.88 * (Lb * t / d**2) ** 2) - 1),
            "elastic LTB moment, toe in compression",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F10-5a)",
        )
        limits.append(angle_ltb_f10(c, My, Mcr, "lateral-torsional buckling", "AISC 360-16"))
    local = leg_local_f10(c, Fy, E, Sx, d, t, root, name="lambda", what="leg")
    if local is not None:
        limits.append(local)
    return least_of(c, limits, "AISC 360-16 §F10")
