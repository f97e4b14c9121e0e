"""ANSI/AISC 360-16 §F9 for double angles (2L, legs back to back) bent about x (the axis normal to
their plane of symmetry): yielding (F9.1), lateral-torsional buckling (F9.2), local buckling of
the flange legs (F9.3(b)) or the web legs (F9.4(b)) by §F10.3.

``SteelMember.tee_stem`` says whether the web legs' toes are in tension (the flange legs in
compression) or in compression anywhere along L_b. ``Lb = None``: continuous lateral-torsional
restraint.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aisc360.flexure_tee_bar import tee_ltb
from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder

__all__ = ["double_angle_f9"]


def _leg_local(
    c: Recorder, Fy: Any, E: Any, Sc: Any, leg: Any, t: Any, root: float, what: str
) -> Any:
    """§F10.3 leg local buckling with the section modulus Sc to the compressed toe or face."""
    lam = c.derive(
        f"lambda_{what}", leg / t, f"{what} leg slenderness b/t", ref="AISC 360-16 §F10.3"
    )
    x = c.f(lam)
    if x <= 0.54 * root:
        c.text(f"Compact {what} legs (b/t ≤ 0.54√(E/F_y)): leg local buckling does not apply.")
        return None
    if x <= 0.91 * root:
        return c.derive(
            "M_n_LLB",
            Fy * Sc * (2.43 - 1.72 * lam * c.sqrt(Fy / E)),
            f"local buckling of the {what} legs, noncompact",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F10-6)",
        )
    Fcr = c.derive(
        "F_cr", 0.71 * E / lam**2, "critical stress", unit="ksi", ref="AISC 360-16 Eq. (F10-8)"
    )
    return c.derive(
        "M_n_LLB",
        Fcr * Sc,
        f"local buckling of the {what} legs, slender",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F10-7)",
    )


def double_angle_f9(c: Recorder, m: SteelMember, Fy: Any, E: Any, root: float) -> Any:
    """M_n of a double angle about x by §F9 (a handle)."""
    s = m.shape
    web_c = m.tee_stem == "compression"
    c.assume(
        "Double angle acting as one member, bent in its plane of symmetry with the toes of the "
        "web legs in " + ("compression (somewhere along L_b)." if web_c else "tension.")
    )
    Sx = c.given("S_x", s["Sx"], "elastic section modulus to the web legs' toes", source=s.source)
    My = c.derive("M_y", Fy * Sx, "yield moment", unit="kip*ft", ref="AISC 360-16 Eq. (F9-3)")
    t = c.given("t", s["t"], "leg thickness", source=s.source)
    if web_c:
        Mp = c.derive(
            "M_p",
            1.5 * My,
            "yielding, web legs in compression",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F9-5)",
        )
    else:
        Zx = c.given("Z_x", s["Zx"], "plastic section modulus", source=s.source)
        Mp = c.derive(
            "M_p",
            c.min(Fy * Zx, 1.6 * My),
            "yielding, web legs in tension",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F9-2)",
        )
    limits = [Mp]
    if m.Lb is None:
        c.text("Continuous lateral-torsional restraint: lateral-torsional buckling does not apply.")
    elif not web_c:
        limits.append(tee_ltb(c, m, Fy, E, Mp, My, Sx, False))
    else:
        Lb = c.given("L_b", m.Lb, "unbraced length", source="given", unit="ft")
        d = c.given("d", s["d"], "width of the web legs", source=s.source)
        Iy = c.given("I_y", s["Iy"], "moment of inertia about y", source=s.source)
        J = c.given("J", s["J"], "torsional constant", source=s.source)
        B = c.derive(
            "B",
            -2.3 * (d / Lb) * c.sqrt(Iy / J),
            "web legs in compression",
            ref="AISC 360-16 §F9.2(c)",
        )
        Mcr = c.derive(
            "M_cr",
            1.95 * E / Lb * c.sqrt(Iy * J) * (B + c.sqrt(1 + B**2)),
            "elastic lateral-torsional buckling moment",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F9-10)",
        )
        if c.q(My) <= c.q(Mcr):
            limits.append(
                c.derive(
                    "M_n_LTB",
                    c.min((1.92 - 1.17 * c.sqrt(My / Mcr)) * My, 1.5 * My),
                    "lateral-torsional buckling, web legs in compression",
                    unit="kip*ft",
                    ref="AISC 360-16 §F9.2(c), Eq. (F10-2)",
                )
            )
        else:
            limits.append(
                c.derive(
                    "M_n_LTB",
                    (0.92 - 0.17 * Mcr / My) * Mcr,
                    "lateral-torsional buckling, web legs in compression",
                    unit="kip*ft",
                    ref="AISC 360-16 §F9.2(c), Eq. (F10-3)",
                )
            )
    if web_c:
        d = c.given("d_w", s["d"], "width of the web legs", source=s.source)
        local = _leg_local(c, Fy, E, Sx, d, t, root, "web")
    else:
        Ix = c.given("I_x", s["Ix"], "moment of inertia about x", source=s.source)
        y = c.given("y", s["y"], "flange legs' back face to the centroid", source=s.source)
        Sc = c.derive(
            "S_c",
            Ix / y,
            "elastic section modulus to the compression flange",
            unit="inch**3",
            ref="AISC 360-16 §F9.3(b)",
        )
        b = c.given("b_f", s["b"], "width of the flange legs", source=s.source)
        local = _leg_local(c, Fy, E, Sc, b, t, root, "flange")
    if local is not None:
        limits.append(local)
    return c.derive(
        "M_n",
        c.min(*limits) if len(limits) > 1 else Mp,
        "nominal flexural strength, least",
        unit="kip*ft",
        ref="AISC 360-16 §F9",
    )
