"""ANSI/AISC 360-16 §F9 for double angles (2L, legs back to back) bent about x (the axis normal to
their plane of symmetry): yielding (F9.1), lateral-torsional buckling (F9.2), local buckling of
the flange legs (F9.3(b)) or the web legs (F9.4(b)) by §F10.3.

``SteelMember.tee_stem`` says whether the web legs' toes are in tension (the flange legs in
compression) or in compression anywhere along L_b. ``Lb = None``: continuous lateral-torsional
restraint.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aisc360.flexure_clauses import (
    angle_ltb_f10,
    f9_mcr,
    least_of,
    leg_local_f10,
)
from calcpack.checks.aisc360.flexure_tee_bar import f9_yield_tension, tee_ltb
from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder

__all__ = ["double_angle_f9"]


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
        Mp = f9_yield_tension(c, m, Fy, My, "web legs")
    limits = [Mp]
    if m.Lb is None:
        c.text("Continuous lateral-torsional restraint: lateral-torsional buckling does not apply.")
    elif not web_c:
        limits.append(tee_ltb(c, m, Fy, E, Mp, My, Sx, False, part="web legs"))
    else:
        Mcr = f9_mcr(c, m, E, compressed=True, part="web legs").Mcr
        what = "lateral-torsional buckling, web legs in compression"
        limits.append(angle_ltb_f10(c, My, Mcr, what, "AISC 360-16 §F9.2(c),"))
    if web_c:
        d = c.given("d_w", s["d"], "width of the web legs", source=s.source)
        local = leg_local_f10(c, Fy, E, Sx, d, t, root, name="lambda_web", what="web legs")
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
        local = leg_local_f10(c, Fy, E, Sc, b, t, root, name="lambda_flange", what="flange legs")
    if local is not None:
        limits.append(local)
    return least_of(c, limits, "AISC 360-16 §F9")
