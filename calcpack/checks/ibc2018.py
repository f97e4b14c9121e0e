"""IBC 2018 §1807.3: embedment of posts, poles and round footings resisting lateral load.

* :func:`check_embedment`: the depth of embedment a post, pole or pier needs to resist a
  lateral force ``P`` applied at height ``h`` above the ground, against the depth provided:
  - non-constrained (no lateral restraint at the ground surface: no rigid floor or pavement),
    §1807.3.2.1, Eq. (18-1): d = 0.5 A {1 + [1 + 4.36 h/A]^½}, A = 2.34 P/(S1 b), with S1 the
    allowable lateral soil-bearing pressure at one-third of the depth of embedment;
  - constrained (a rigid floor or pavement holds it at the surface), §1807.3.2.2,
    Eq. (18-2): d² = 4.25 P h/(S3 b), with S3 at the full depth of embedment.

The lateral bearing pressure is the tabulated value per foot of depth below natural grade
(IBC 2018 Table 1806.2, by soil class, or a geotechnical report), taken at that depth
(§1806.3.3), with d not over 12 ft for computing it (the definition of d under Eq. (18-1)); the
15-times cap of §1806.3.3 therefore never governs here. Isolated poles that a ½ in. movement
at the ground surface does not harm may use twice the tabulated value (§1806.3.4): the input
says so explicitly. The pressure is found at the depth provided, so the equation's depth is the
depth required with the soil resistance that depth mobilises: the check passes when it is not
more than the depth provided.

Refused: posts used to give lateral support to plaster, masonry or concrete without bracing
(§1807.3.1 item 2); a vertical load on the pole's own friction or bearing is not checked here
(the pier's bearing is :func:`calcpack.foundations.check_footing_soil`).

Equation constants and clause numbers are from memory of the printed code; confirm against the
edition adopted locally.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import non_empty, one_of

__all__ = ["IBC_2018", "EmbeddedPost", "check_embedment"]

IBC_2018 = Standard("IBC 2018", "International Building Code, §1806 and §1807.3", "ASD")
Restraint = Literal["non-constrained", "constrained"]
# Eq. (18-1) and (18-2) constants, declared once (IBC 2018 §1807.3.2, from memory)
EQ18_1_A = 2.34
EQ18_1_H = 4.36
EQ18_2 = 4.25
DEPTH_CAP = Q_(12.0, "ft")  # d not over 12 ft for computing the lateral pressure
POLE_INCREASE = 2.0  # §1806.3.4, isolated poles not harmed by ½ in. motion at the surface


@dataclass(frozen=True)
class EmbeddedPost:
    """A post, pole or round pier set in the ground, pushed sideways.

    Args:
        P: lateral force (ASD), applied at height ``h`` above the ground surface.
        h: height of P above the ground surface (0 at the surface).
        b: diameter of a round post or footing, or the diagonal of a square one.
        d: depth of embedment provided, below the ground surface.
        lateral_bearing: allowable lateral soil-bearing pressure per foot of depth below
            natural grade (e.g. 100 psf/ft), with ``lateral_source`` (IBC 2018 Table 1806.2
            and the soil class, or the geotechnical report).
        restraint: "non-constrained" (Eq. 18-1) or "constrained" at the surface (Eq. 18-2).
        isolated_pole: True where the structure is not harmed by ½ in. motion at the ground
            surface under short-term lateral load, so §1806.3.4 doubles the pressure.
        supports_finishes: True if the post gives lateral support to plaster, masonry or
            concrete (refused: §1807.3.1 item 2 asks for bracing).
        combination: the load combination P comes from.
    """

    P: Quantity
    h: Quantity
    b: Quantity
    d: Quantity
    lateral_bearing: Quantity
    lateral_source: str
    restraint: Restraint = "non-constrained"
    isolated_pole: bool = False
    supports_finishes: bool = False
    combination: str | None = None

    def __post_init__(self) -> None:
        require(self.P, "[force]", "P", positive=True)
        require(self.h, "[length]", "h", nonnegative=True)
        require(self.b, "[length]", "b", positive=True)
        require(self.d, "[length]", "d", positive=True)
        require(self.lateral_bearing, "[pressure]/[length]", "lateral_bearing", positive=True)
        non_empty(
            "lateral_source",
            self.lateral_source,
            expected="where the lateral bearing pressure comes from, e.g. 'IBC 2018 Table "
            "1806.2, class 5' or the geotechnical report",
        )
        one_of("restraint", self.restraint, ("non-constrained", "constrained"))
        if self.supports_finishes:
            raise OutOfScopeError(
                "Input supports_finishes = True: IBC 2018 §1807.3.1 item 2 does not allow posts "
                "embedded in earth to give lateral support to plaster, masonry or concrete "
                "unless bracing limits the deflection; design the bracing instead"
            )
        if self.restraint == "constrained" and self.h.magnitude == 0:
            raise OutOfScopeError(
                "Input h = 0 with restraint = 'constrained': a force at the restraint gives no "
                "moment for Eq. (18-2); give the height of P above the ground surface"
            )


def check_embedment(post: EmbeddedPost, *, mark: str = "post") -> MemberChecks:
    """Depth of embedment required against the depth provided, IBC 2018 §1807.3.2.

    Returns the check "Embedment depth" (demand: the depth Eq. (18-1) or (18-2) requires with
    the soil pressure at the depth provided; capacity: the depth provided), with the working.

    Raises:
        InputError: bad units or values. OutOfScopeError: see :class:`EmbeddedPost`.
    """
    g = post
    combo = g.combination
    eq = "Eq. (18-1)" if g.restraint == "non-constrained" else "Eq. (18-2)"
    clause = "§1807.3.2.1" if g.restraint == "non-constrained" else "§1807.3.2.2"

    def logic(c: Recorder) -> None:
        c.assume(
            f"{g.restraint.capitalize()} at the ground surface (IBC 2018 {clause}); the "
            "lateral soil pressure grows with depth as Table 1806.2 allows (§1806.3.3)."
        )
        P = c.given("P", g.P, "lateral force (ASD)", source=combo or "given", unit="lbf",
                    result=combo is not None)  # fmt: skip
        h = c.given("h", g.h, "height of P above the ground surface", source="given", unit="ft")
        b = c.given("b", g.b, "diameter (or diagonal) of the post or pier", source="given",
                    unit="ft")  # fmt: skip
        d = c.given("d", g.d, "depth of embedment provided", source="given", unit="ft")
        s = c.given("s_lat", g.lateral_bearing, "allowable lateral bearing per foot of depth",
                    source=g.lateral_source, unit="psf/ft")  # fmt: skip
        if g.d > DEPTH_CAP:
            d_p = c.given("d_p", DEPTH_CAP, "depth for the pressure (d not over 12 ft)",
                          source=f"IBC 2018 {clause}", unit="ft")  # fmt: skip
        else:
            d_p = d
        k = c.given(
            "k_pole",
            POLE_INCREASE if g.isolated_pole else 1.0,
            "isolated pole, ½ in. motion acceptable" if g.isolated_pole else "no increase",
            source="IBC 2018 §1806.3.4",
        )
        if g.restraint == "non-constrained":
            S1 = c.derive("S_1", k * s * d_p / 3, "lateral bearing at one-third of the depth",
                          unit="psf", ref="IBC 2018 §1807.3.2.1, §1806.3.3")  # fmt: skip
            A = c.derive("A", EQ18_1_A * P / (S1 * b), "length parameter of the equation",
                         unit="ft", ref="IBC 2018 Eq. (18-1)")  # fmt: skip
            d_req = c.derive(
                "d_req",
                0.5 * A * (1 + c.sqrt(1 + EQ18_1_H * h / A)),
                "depth of embedment required",
                unit="ft",
                ref="IBC 2018 Eq. (18-1)",
            )
        else:
            S3 = c.derive("S_3", k * s * d_p, "lateral bearing at the depth of embedment",
                          unit="psf", ref="IBC 2018 §1807.3.2.2, §1806.3.3")  # fmt: skip
            d_req = c.derive(
                "d_req",
                c.sqrt(EQ18_2 * P * h / (S3 * b)),
                "depth of embedment required",
                unit="ft",
                ref="IBC 2018 Eq. (18-2)",
            )
        c.check("Embedment depth", d_req, d, ref=f"IBC 2018 {clause}, {eq}", combination=combo)

    return run_checks(mark, f"Embedment of {mark} against lateral load", IBC_2018, logic)
