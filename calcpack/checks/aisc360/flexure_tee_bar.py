"""ANSI/AISC 360-16 §F9 (tees in the plane of symmetry) and §F11 (rectangular bars and rounds):
nominal flexural strength.

* §F9, tees (WT, MT, ST) bent about x: yielding (F9.1), lateral-torsional buckling (F9.2),
  flange local buckling when the flange is in compression (F9.3) and stem local buckling when
  the stem is in compression (F9.4). ``SteelMember.tee_stem`` says whether the stem tip is in
  tension (the flange in compression: a tee standing on its stem under sagging moment) or in
  compression anywhere along L_b. Double angles: ``flexure_double_angle.py``.
* §F11, rectangular bars about either axis and round bars: yielding (F11.1) and, for a
  rectangular bar bent about its major axis, lateral-torsional buckling (F11.2).

``Lb = None`` on the member means continuous lateral-torsional restraint. Units: quantities.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aisc360.flexure_clauses import (
    f9_mcr,
    flange_slenderness,
    least_of,
    transition,
)
from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder

__all__ = ["BARS", "TEES", "bar_f11", "f9_yield_tension", "tee_f9", "tee_ltb"]

TEES = ("WT", "MT", "ST")
BARS = ("BAR", "ROUND BAR")


def _ratio(q: Any) -> float:
    return float(q.to("").magnitude)


def tee_f9(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float) -> Any:
    """M_n of a tee about x by §F9 (a handle)."""
    s = m.shape
    stem_c = m.tee_stem == "compression"
    c.assume(
        "Tee bent in its plane of symmetry with the stem tip in "
        + ("compression (somewhere along L_b)." if stem_c else "tension (flange in compression).")
    )
    Sx = c.given("S_x", s["Sx"], "elastic section modulus to the stem tip", source=s.source)
    My = c.derive("M_y", Fy * Sx, "yield moment", unit="kip*ft", ref="AISC 360-16 Eq. (F9-3)")
    if stem_c:
        Mp = c.derive(
            "M_p", My, "yielding, stem in compression", unit="kip*ft", ref="AISC 360-16 Eq. (F9-4)"
        )
    else:
        Mp = f9_yield_tension(c, m, Fy, My, "stem")
    limits = [Mp]
    if m.Lb is None:
        c.text("Continuous lateral-torsional restraint: lateral-torsional buckling does not apply.")
    else:
        limits.append(tee_ltb(c, m, Fy, E, Mp, My, Sx, stem_c))
    if stem_c:
        limits.append(_stem_local(c, m, Fy, E, Sx, root))
    else:
        flb = _flange_local(c, m, Fy, E, Mp, My, root)
        if flb is not None:
            limits.append(flb)
    return least_of(c, limits, "AISC 360-16 §F9")


def f9_yield_tension(c: Recorder, m: SteelMember, Fy: Any, My: Any, part: str) -> Any:
    """M_p = min(F_y Z_x, 1.6 M_y) of a tee or double angle with its ``part`` (``"stem"``,
    ``"web legs"``) in tension, Eq. (F9-2)."""
    s = m.shape
    Zx = c.given("Z_x", s["Zx"], "plastic section modulus", source=s.source)
    return c.derive(
        "M_p",
        c.min(Fy * Zx, 1.6 * My),
        f"yielding, {part} in tension",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F9-2)",
    )


def tee_ltb(
    c: Recorder,
    m: SteelMember,
    Fy: Any,
    E: Any,
    Mp: Any,
    My: Any,
    Sx: Any,
    stem_c: bool,
    *,
    part: str = "stem",
) -> Any:
    """M_n by lateral-torsional buckling of a tee (or a double angle with its web legs in
    tension, ``part="web legs"``) by §F9.2."""
    s = m.shape
    Lb, d, Iy, J, Mcr = f9_mcr(c, m, E, compressed=stem_c, part=part)
    if stem_c:
        return c.derive(
            "M_n_LTB",
            c.min(Mcr, My),
            "lateral-torsional buckling, stem in compression",
            unit="kip*ft",
            ref="AISC 360-16 §F9.2(b)",
        )
    ry = c.given("r_y", s["ry"], "radius of gyration about y", source=s.source)
    Lp = c.derive(
        "L_p",
        1.76 * ry * c.sqrt(E / Fy),
        "limiting length",
        unit="ft",
        ref="AISC 360-16 Eq. (F9-8)",
    )
    Lr = c.derive(
        "L_r",
        1.95 * (E / Fy) * c.sqrt(Iy * J) / Sx * c.sqrt(2.36 * (Fy / E) * d * Sx / J + 1),
        "limiting length",
        unit="ft",
        ref="AISC 360-16 Eq. (F9-9)",
    )
    if c.q(Lb) <= c.q(Lp):
        c.text("$L_b \\le L_p$: lateral-torsional buckling does not apply (§F9.2(a)(1)).")
        return Mp
    if c.q(Lb) <= c.q(Lr):
        return c.derive(
            "M_n_LTB",
            transition(Mp, My, Lb, Lp, Lr),
            "inelastic lateral-torsional buckling",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F9-6)",
        )
    return c.derive(
        "M_n_LTB",
        Mcr,
        "elastic lateral-torsional buckling",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F9-7)",
    )


def _flange_local(
    c: Recorder, m: SteelMember, Fy: Any, E: Any, Mp: Any, My: Any, root: float
) -> Any:
    s = m.shape
    lam_f = _ratio(s["bf"] / (2 * s["tf"]))
    if lam_f <= 0.38 * root:
        c.text("Compact flange (Table B4.1b case 10): flange local buckling does not apply.")
        return None
    Ix = c.given("I_x", s["Ix"], "moment of inertia about x", source=s.source)
    y = c.given("y", s["y"], "flange face to the centroid", source=s.source)
    Sxc = c.derive(
        "S_xc",
        Ix / y,
        "elastic section modulus to the compression flange",
        unit="inch**3",
        ref="AISC 360-16 §F9.3",
    )
    lam, lpf, lrf = flange_slenderness(c, s, E, Fy)
    if c.f(lam) <= c.f(lrf):
        return c.derive(
            "M_n_FLB",
            c.min(transition(Mp, 0.7 * Fy * Sxc, lam, lpf, lrf), 1.6 * My),
            "flange local buckling, noncompact flange",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F9-14)",
        )
    return c.derive(
        "M_n_FLB",
        0.7 * E * Sxc / lam**2,
        "flange local buckling, slender flange",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F9-15)",
    )


def _stem_local(c: Recorder, m: SteelMember, Fy: Any, E: Any, Sx: Any, root: float) -> Any:
    s = m.shape
    d = c.given("d", s["d"], "depth of the tee", source=s.source)
    tw = c.given("t_w", s["tw"], "stem thickness", source=s.source)
    lam = c.derive("lambda_s", d / tw, "stem slenderness d/t_w", ref="AISC 360-16 §F9.4")
    ratio = c.f(lam)
    if ratio <= 0.84 * root:
        Fcr = c.derive(
            "F_cr", Fy, "stem d/t_w ≤ 0.84√(E/F_y)", unit="ksi", ref="AISC 360-16 Eq. (F9-17)"
        )
    elif ratio <= 1.52 * root:
        Fcr = c.derive(
            "F_cr",
            (1.43 - 0.515 * lam * c.sqrt(Fy / E)) * Fy,
            "0.84√(E/F_y) < d/t_w ≤ 1.52√(E/F_y)",
            unit="ksi",
            ref="AISC 360-16 Eq. (F9-18)",
        )
    else:
        Fcr = c.derive(
            "F_cr",
            1.52 * E / lam**2,
            "d/t_w > 1.52√(E/F_y)",
            unit="ksi",
            ref="AISC 360-16 Eq. (F9-19)",
        )
    return c.derive(
        "M_n_SLB",
        Fcr * Sx,
        "local buckling of the stem in compression",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F9-16)",
    )


def bar_f11(c: Recorder, m: SteelMember, Fy: Any, E: Any, axis: str) -> Any:
    """M_n of a rectangular bar (about x or y) or a round bar by §F11 (a handle)."""
    s = m.shape
    a = axis
    Z = c.given(f"Z_{a}", s[f"Z{a}"], "plastic section modulus", source=s.source)
    S = c.given(f"S_{a}", s[f"S{a}"], "elastic section modulus", source=s.source)
    My = c.derive("M_y", Fy * S, "yield moment", unit="kip*ft", ref="AISC 360-16 §F11.1")
    Mp = c.derive(
        "M_p", c.min(Fy * Z, 1.6 * My), "yielding", unit="kip*ft", ref="AISC 360-16 Eq. (F11-1)"
    )
    rect_major = s.type == "BAR" and a == "x" and _ratio(s["d"] / s["t"]) > 1 + 1e-9
    if not rect_major:
        c.text(
            "Round bar, square bar or rectangular bar bent about its minor axis: "
            "lateral-torsional buckling does not apply (§F11.2)."
        )
        return c.derive(
            "M_n", Mp, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F11"
        )
    if m.Lb is None:
        c.text("Continuous lateral-torsional restraint: lateral-torsional buckling does not apply.")
        return c.derive(
            "M_n", Mp, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F11"
        )
    Lb = c.given("L_b", m.Lb, "unbraced length", source="given", unit="ft")
    Cb = c.given("C_b", float(m.Cb), "LTB modification factor", source="given (§F1)")
    d = c.given("d", s["d"], "depth of the bar", source=s.source)
    t = c.given("t", s["t"], "width of the bar parallel to the axis of bending", source=s.source)
    lam = c.derive("lambda_b", Lb * d / t**2, "L_b d/t²", ref="AISC 360-16 §F11.2")
    e_fy = _ratio(m.E / m.Fy)
    if c.f(lam) <= 0.08 * e_fy:
        c.text("$L_b d/t^2 \\le 0.08E/F_y$: lateral-torsional buckling does not apply (§F11.2(a)).")
        return c.derive(
            "M_n", Mp, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F11"
        )
    if c.f(lam) <= 1.9 * e_fy:
        Mltb = c.derive(
            "M_n_LTB",
            c.min(Cb * (1.52 - 0.274 * lam * Fy / E) * My, Mp),
            "lateral-torsional buckling, inelastic",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F11-2)",
        )
    else:
        Fcr = c.derive(
            "F_cr", 1.9 * E * Cb / lam, "critical stress", unit="ksi", ref="AISC 360-16 Eq. (F11-4)"
        )
        Mltb = c.derive(
            "M_n_LTB",
            c.min(Fcr * S, Mp),
            "lateral-torsional buckling, elastic",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F11-3)",
        )
    return c.derive("M_n", Mltb, "nominal flexural strength", unit="kip*ft", ref="AISC 360-16 §F11")
