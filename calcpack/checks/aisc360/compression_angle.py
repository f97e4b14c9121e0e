"""ANSI/AISC 360-16 §E5: single-angle compression members, LRFD or ASD.

The eccentricity of an angle loaded through one leg is accounted for by the effective
slenderness of §E5 and the member is checked as axially loaded (§E3, with §E7 when a leg is
slender), provided the conditions of §E5 hold, which the check states and the engineer confirms:
loaded at the ends in compression through the same one leg; attached by welding or by at least
two bolts; no intermediate transverse loads.

* §E5(a), individual members or web members of planar trusses with adjacent web members on the
  same side of the gusset or chord: L_c/r = 72 + 0.75 L/r_a for L/r_a ≤ 80 (Eq. E5-1), else
  32 + 1.25 L/r_a (E5-2);
* §E5(b), web members of box or space trusses: L_c/r = 60 + 0.8 L/r_a for L/r_a ≤ 75 (E5-3),
  else 45 + L/r_a (E5-4);
* unequal legs connected through the shorter leg: + 4[(b_l/b_s)² − 1], and not less than
  0.95 L/r_z (a) or 0.82 L/r_z (b).

Refused (OutOfScopeError naming the limit): unequal legs with b_l/b_s ≥ 1.7; L_c/r > 200;
b/t > 0.71√(E/F_y), where flexural-torsional buckling (§E4) must be considered.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal

from calcpack.checks.aisc360.compression_slender import critical_stress, effective_area
from calcpack.checks.aisc360.member_data import (
    Method,
    SteelMember,
    check_method,
    design_strength,
    member_standard,
)
from calcpack.checks.aisc360.shape import E_STEEL
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.scope import material_in_scope
from calcpack.errors import OutOfScopeError
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Quantity
from calcpack.validate import dimension, one_of, positive

__all__ = ["AngleStrut", "check_aisc_angle_strut"]

ConnectedLeg = Literal["long", "short"]
Arrangement = Literal["planar", "box"]


@dataclass(frozen=True)
class AngleStrut:
    """A single angle in compression, loaded through one leg at its ends.

    Args:
        shape: a single angle (``aisc_shape("L4X4X1/4")``). Fy: yield stress. grade: e.g.
            "ASTM A36".
        L: length of the member between work points.
        connected_leg: "long" or "short" (either for equal legs).
        arrangement: "planar" (an individual member, or a web member of a planar truss,
            §E5(a)) or "box" (a web member of a box or space truss, §E5(b)).
        P: required axial strength (P_u LRFD, P_a ASD), compression positive.
        combination: the load combination of P.
    """

    shape: SteelShape
    Fy: Quantity
    L: Quantity
    P: Quantity
    connected_leg: ConnectedLeg = "long"
    arrangement: Arrangement = "planar"
    grade: str = ""
    combination: str | None = None

    def __post_init__(self) -> None:
        if not isinstance(self.shape, SteelShape) or self.shape.type != "L":
            raise OutOfScopeError(
                f"Shape {getattr(self.shape, 'designation', self.shape)!r}: AISC 360-16 §E5 is "
                "for single angles (aisc_shape('L4X4X1/4'))"
            )
        material_in_scope("AISC 360-16|steel|Fy", "Fy", self.Fy)
        positive("L", dimension("L", self.L, "[length]"))
        positive("P", dimension("P", self.P, "[force]"))
        one_of("connected_leg", self.connected_leg, ("long", "short"))
        one_of("arrangement", self.arrangement, ("planar", "box"))


def check_aisc_angle_strut(
    strut: AngleStrut, *, method: Method = "LRFD", mark: str = "S1"
) -> MemberChecks:
    """Compressive strength of a single angle by AISC 360-16 §E5 (with §E3 and §E7).

    Returns:
        MemberChecks with the check "Compression" (clause §E5).

    Raises:
        OutOfScopeError: the §E5 limits above. InputError: bad method, units or values.
    """
    method = check_method(method)  # type: ignore[assignment]
    a = strut
    s = a.shape
    long_leg, short_leg = (s["d"], s["b"]) if s["d"] >= s["b"] else (s["b"], s["d"])
    ratio_legs = float((long_leg / short_leg).to("").magnitude)
    if ratio_legs >= 1.7:
        raise OutOfScopeError(
            f"Angle {s.designation}: leg ratio b_l/b_s = {ratio_legs:.3g} ≥ 1.7; AISC 360-16 §E5 "
            "then requires the angle to be checked for axial force and flexure by Chapter H, "
            "which is not implemented for single angles"
        )
    root = math.sqrt(float((E_STEEL / a.Fy).to("").magnitude))
    bt = float((long_leg / s["t"]).to("").magnitude)
    if bt > 0.71 * root:
        raise OutOfScopeError(
            f"Angle {s.designation}: b/t = {bt:.3g} > 0.71√(E/F_y) = {0.71 * root:.3g}: "
            "flexural-torsional buckling of single angles (AISC 360-16 §E4, §E5) must be "
            "considered and is not implemented"
        )
    equal = abs(ratio_legs - 1) < 1e-9
    short = a.connected_leg == "short" and not equal
    # r_a: about the geometric axis parallel to the connected leg. The database's d leg lies
    # along y (r_y is about the axis parallel to it), the b leg along x.
    d_is_long = s["d"] >= s["b"]
    conn_is_d = (a.connected_leg == "long") == d_is_long
    ra_q, ra_axis = (s["ry"], "y") if conn_is_d else (s["rx"], "x")
    planar = a.arrangement == "planar"
    member = SteelMember(s, Fy=a.Fy, grade=a.grade)
    sfx = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        c.heading("Single-angle compression member, §E5", 3)
        c.assume(
            "The angle is loaded at its ends in compression through the same one leg "
            f"(the {a.connected_leg} leg), attached by welding or by at least two bolts, with "
            "no intermediate transverse loads (AISC 360-16 §E5 (1)-(3))."
        )
        Fy = c.given("F_y", a.Fy, f"yield stress {a.grade}".strip(), source=a.grade or "given")
        E = c.given("E", member.E, "modulus of elasticity", source="AISC 360-16 §B (29 000 ksi)")
        Ag = c.given("A_g", s["A"], "gross area", source=s.source)
        L = c.given("L", a.L, "length between work points", source="given", unit="ft")
        ra = c.given(
            "r_a",
            ra_q,
            f"radius of gyration about the axis parallel to the connected leg ({ra_axis})",
            source=s.source,
        )
        slr = c.derive("lambda_a", L / ra, "slenderness L/r_a", ref="AISC 360-16 §E5")
        x = c.f(slr)
        if planar and x <= 80:
            Lc_r = c.derive(
                "L_c_r", 72 + 0.75 * slr, "effective slenderness", ref="AISC 360-16 Eq. (E5-1)"
            )
        elif planar:
            Lc_r = c.derive(
                "L_c_r", 32 + 1.25 * slr, "effective slenderness", ref="AISC 360-16 Eq. (E5-2)"
            )
        elif x <= 75:
            Lc_r = c.derive(
                "L_c_r", 60 + 0.8 * slr, "effective slenderness", ref="AISC 360-16 Eq. (E5-3)"
            )
        else:
            Lc_r = c.derive(
                "L_c_r", 45 + slr, "effective slenderness", ref="AISC 360-16 Eq. (E5-4)"
            )
        if short:
            bl = c.given("b_l", long_leg, "long leg", source=s.source)
            bs = c.given("b_s", short_leg, "short leg", source=s.source)
            rz = c.given(
                "r_z", s["rz"], "radius of gyration, minor principal axis", source=s.source
            )
            floor = 0.95 if planar else 0.82
            Lc_r = c.derive(
                "L_c_r_s",
                c.max(Lc_r + 4 * ((bl / bs) ** 2 - 1), floor * L / rz),
                f"connected through the short leg, not less than {floor} L/r_z",
                ref="AISC 360-16 §E5(a)" if planar else "AISC 360-16 §E5(b)",
            )
        if c.f(Lc_r) > 200:
            raise OutOfScopeError(
                f"Angle {s.designation}: effective slenderness L_c/r = {c.f(Lc_r):.4g} > 200, the "
                "limit of AISC 360-16 §E5 (4); the member must be checked by Chapter H"
            )
        Fe = c.derive(
            "F_e",
            c.pi**2 * E / Lc_r**2,
            "elastic buckling stress",
            unit="ksi",
            ref="AISC 360-16 Eq. (E3-4)",
        )
        Fcr = critical_stress(c, Fy, Fe)
        leg_limit = 0.45 * root
        if bt > leg_limit:
            c.text(f"Leg b/t = {bt:.3g} > λ_r = 0.45√(E/F_y) = {leg_limit:.3g}: slender (§E7).")
            Ae = effective_area(c, member, Fy, E, Fcr, Ag)
            Pn = c.derive(
                "P_n",
                Fcr * Ae,
                "nominal compressive strength",
                unit="kip",
                ref="AISC 360-16 Eq. (E7-1)",
            )
        else:
            Pn = c.derive(
                "P_n",
                Fcr * Ag,
                "nominal compressive strength",
                unit="kip",
                ref="AISC 360-16 Eq. (E3-1)",
            )
        Pc = design_strength(
            c, "compression", Pn, method, name="P_c", unit="kip", what="compressive strength"
        )
        Pr = c.given(
            f"P_{sfx}",
            a.P,
            "required axial strength",
            source=a.combination or "given",
            unit="kip",
            result=True,
        )
        c.check("Compression", Pr, Pc, ref="AISC 360-16 §E5", combination=a.combination)

    return run_checks(
        mark,
        f"{s.designation} single-angle strut, AISC 360-16 {method}",
        member_standard(method),
        logic,
    )
