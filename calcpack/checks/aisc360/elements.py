"""ANSI/AISC 360-16 §J4 connecting elements and §J6-J9 anchor rods, LRFD or ASD.

* :func:`check_aisc_plate`: a bolted or welded connecting plate in tension (§J4.1: yielding
  F_y A_g, rupture F_u A_e with A_e = A_n ≤ 0.85 A_g for bolted splice plates) and in shear
  (§J4.2: yielding 0.60 F_y A_gv, rupture 0.60 F_u A_nv). Net areas take each hole 1/16 in.
  larger than its nominal size (§B4.3b).
* :func:`check_aisc_block_shear`: block shear rupture along a bolt pattern (§J4.3, Eq. J4-5):
  R_n = 0.60 F_u A_nv + U_bs F_u A_nt ≤ 0.60 F_y A_gv + U_bs F_u A_nt.
* :func:`check_aisc_anchor_rods`: anchor rods of a base plate in tension and shear as threaded
  parts (Table J3.2, §J3.6-§J3.7). The concrete side (breakout, pullout, side-face blowout,
  pryout, §J9 "Anchor rods and embedments") is governed by ACI 318-19 Chapter 17 and is
  reported NOT COVERED, never assumed.
"""

from __future__ import annotations

from dataclasses import dataclass

from calcpack.checks.aisc360.bolts import BoltGroup, bolt_logic, factored
from calcpack.checks.aisc360.member_data import check_method, member_standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of, positive_fields, required

__all__ = [
    "BlockShear",
    "ConnectingPlate",
    "check_aisc_anchor_rods",
    "check_aisc_block_shear",
    "check_aisc_plate",
]

_EXTRA = Q_(1 / 16, "inch")  # §B4.3b: hole width for net area


@dataclass(frozen=True)
class ConnectingPlate:
    """A plate connecting members.

    Args:
        name: mark. t: thickness. width: gross width across the force (tension) or gross
            length along the shear plane (shear). Fy, Fu: strengths. holes: bolt holes across
            the net section. d_hole: nominal hole diameter. splice: a bolted splice plate
            (A_e ≤ 0.85 A_g, §J4.1(b)).
    """

    name: str
    t: Quantity
    width: Quantity
    Fy: Quantity
    Fu: Quantity
    holes: int = 0
    d_hole: Quantity | None = None
    splice: bool = True

    def __post_init__(self) -> None:
        positive_fields(self, "[length]", ("t", "width"))
        require(self.Fy, "[pressure]", "Fy", positive=True)
        require(self.Fu, "[pressure]", "Fu", positive=True)
        if self.holes:
            required(
                "d_hole",
                self.d_hole,
                expected="the nominal hole diameter",
                when=f"for plate {self.name} with {self.holes} holes",
            )
        if self.d_hole is not None:
            require(self.d_hole, "[length]", "d_hole", positive=True)
            net = self.width - self.holes * (self.d_hole + _EXTRA)
            if net.magnitude <= 0:
                raise InputError(
                    f"Plate {self.name}: the holes take the whole width (got width = "
                    f"{self.width:~P}, {self.holes} holes of {self.d_hole:~P})",
                    name="holes",
                    value=self.holes,
                    expected="fewer or smaller holes",
                )


def check_aisc_plate(
    plate: ConnectingPlate,
    *,
    P: Quantity | None = None,
    V: Quantity | None = None,
    method: str = "LRFD",
    mark: str = "PL1",
    combination: str | None = None,
) -> MemberChecks:
    """A connecting plate in tension P (§J4.1) and/or shear V (§J4.2)."""
    method = check_method(method)
    if P is None and V is None:
        raise InputError(
            "Give the tension P or the shear V on the plate (got neither)",
            name="P",
            value=None,
            expected="a force",
        )
    pl = plate
    sym = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        t = c.given("t", pl.t, f"thickness, {pl.name}", source="given", unit="inch")
        b = c.given("b", pl.width, "gross width (length of the section)", unit="inch")
        Fy = c.given("F_y", pl.Fy, "yield stress", source="given")
        Fu = c.given("F_u", pl.Fu, "tensile strength", source="given")
        Ag = c.derive("A_g", b * t, "gross area", unit="inch**2")
        if pl.holes:
            assert pl.d_hole is not None
            nh = c.given("n_h", float(pl.holes), "holes across the section", source="given")
            dh = c.given("d_h", pl.d_hole + _EXTRA, "hole width for net area (+1/16 in.)",
                         source="AISC 360-16 §B4.3b", unit="inch")  # fmt: skip
            An = c.derive("A_n", (b - nh * dh) * t, "net area", unit="inch**2",
                          ref="AISC 360-16 §B4.3b")  # fmt: skip
        else:
            An = c.derive("A_n", 1.0 * Ag, "net area (no holes)", unit="inch**2")
        if P is not None:
            c.heading("Tension, §J4.1", 3)
            Pr = c.given(f"P_{sym}", P, "required tension", source=combination or "given",
                         unit="kip")  # fmt: skip
            Rny = c.derive("R_n_ty", Fy * Ag, "tensile yielding", unit="kip",
                           ref="AISC 360-16 Eq. (J4-1)")  # fmt: skip
            cy = factored(c, "tension yielding", Rny, method, name="R_c_ty", unit="kip")
            c.check("Tensile yielding", Pr, cy, ref="AISC 360-16 §J4.1(a)",
                    combination=combination)  # fmt: skip
            if pl.splice:
                Ae = c.derive("A_e", c.min(An, 0.85 * Ag), "effective net area, splice plate",
                              unit="inch**2", ref="AISC 360-16 §J4.1(b)")  # fmt: skip
            else:
                Ae = c.derive("A_e", 1.0 * An, "effective net area", unit="inch**2")
            Rnr = c.derive("R_n_tr", Fu * Ae, "tensile rupture", unit="kip",
                           ref="AISC 360-16 Eq. (J4-2)")  # fmt: skip
            cr = factored(c, "tension rupture", Rnr, method, name="R_c_tr", unit="kip")
            c.check("Tensile rupture", Pr, cr, ref="AISC 360-16 §J4.1(b)",
                    combination=combination)  # fmt: skip
        if V is not None:
            c.heading("Shear, §J4.2", 3)
            Vr = c.given(f"V_{sym}", V, "required shear", source=combination or "given",
                         unit="kip")  # fmt: skip
            Rny = c.derive("R_n_vy", 0.60 * Fy * Ag, "shear yielding", unit="kip",
                           ref="AISC 360-16 Eq. (J4-3)")  # fmt: skip
            cy = factored(c, "shear yielding", Rny, method, name="R_c_vy", unit="kip")
            c.check("Shear yielding", Vr, cy, ref="AISC 360-16 §J4.2(a)",
                    combination=combination)  # fmt: skip
            Rnr = c.derive("R_n_vr", 0.60 * Fu * An, "shear rupture", unit="kip",
                           ref="AISC 360-16 Eq. (J4-4)")  # fmt: skip
            cr = factored(c, "shear rupture", Rnr, method, name="R_c_vr", unit="kip")
            c.check("Shear rupture", Vr, cr, ref="AISC 360-16 §J4.2(b)",
                    combination=combination)  # fmt: skip

    return run_checks(mark, f"Connecting plate {pl.name}", member_standard(method), logic)


@dataclass(frozen=True)
class BlockShear:
    """A block shear path through a bolt pattern in a plate or web.

    Args:
        t: thickness. Fy, Fu: strengths. d_hole: nominal hole diameter.
        along: bolts in each line parallel to the force; s: their spacing; le: end distance
            (last bolt to the loaded end). lines: lines of bolts; gauge: between lines;
            le_t: from the outer line to the edge across the force (the tension plane).
        planes: shear planes of the block (1: an L-shaped block at an edge, 2: a U-shaped
            block in the middle of a plate, its tension plane between the outer lines).
        Ubs: 1.0 for uniform tension stress, 0.5 for non-uniform (§J4.3).
    """

    t: Quantity
    Fy: Quantity
    Fu: Quantity
    d_hole: Quantity
    along: int
    le: Quantity
    s: Quantity | None = None
    lines: int = 1
    gauge: Quantity | None = None
    le_t: Quantity | None = None
    planes: int = 1
    Ubs: float = 1.0

    def __post_init__(self) -> None:
        positive_fields(self, "[length]", ("t", "d_hole", "le"))
        require(self.Fy, "[pressure]", "Fy", positive=True)
        require(self.Fu, "[pressure]", "Fu", positive=True)
        one_of("planes", self.planes, (1, 2))
        one_of("Ubs", float(self.Ubs), (1.0, 0.5))
        if self.along > 1:
            required("s", self.s, expected="a spacing", when="for block shear with more than "
                     "one bolt in a line")  # fmt: skip
        if self.lines > 1:
            required("gauge", self.gauge, expected="a gauge", when="for block shear with more "
                     "than one line")  # fmt: skip
        if self.planes == 1:
            required("le_t", self.le_t, expected="the edge distance", when="for block shear at "
                     "an edge (planes=1)")  # fmt: skip
        if self.planes == 2 and self.lines < 2:
            raise OutOfScopeError(
                "A U-shaped block (planes=2) needs two or more lines of bolts (got lines = "
                f"{self.lines})"
            )


def check_aisc_block_shear(
    block: BlockShear,
    *,
    R: Quantity,
    method: str = "LRFD",
    mark: str = "BS1",
    combination: str | None = None,
) -> MemberChecks:
    """Block shear rupture of ``block`` against R (AISC 360-16 §J4.3, Eq. J4-5)."""
    method = check_method(method)
    require(R, "[force]", "R", nonnegative=True)
    k = block
    sym = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        t = c.given("t", k.t, "thickness", source="given", unit="inch")
        Fy = c.given("F_y", k.Fy, "yield stress", source="given")
        Fu = c.given("F_u", k.Fu, "tensile strength", source="given")
        dh = c.given("d_h", k.d_hole + _EXTRA, "hole width for net area (+1/16 in.)",
                     source="AISC 360-16 §B4.3b", unit="inch")  # fmt: skip
        le = c.given("l_e", k.le, "end distance", source="given", unit="inch")
        n_al = c.given("n_along", float(k.along), "bolts along the force", source="given")
        npl = c.given("n_planes", float(k.planes), "shear planes", source="given")
        length = le + (n_al - 1) * c.given("s", k.s if k.s is not None else Q_(0, "inch"),
                                           "spacing", source="given", unit="inch")  # fmt: skip
        Agv = c.derive("A_gv", npl * length * t, "gross shear area", unit="inch**2",
                       ref="AISC 360-16 §J4.3")  # fmt: skip
        Anv = c.derive("A_nv", npl * (length - (n_al - 0.5) * dh) * t, "net shear area",
                       unit="inch**2", ref="AISC 360-16 §J4.3")  # fmt: skip
        nl = c.given("n_lines", float(k.lines), "lines of bolts", source="given")
        g = c.given("g", k.gauge if k.gauge is not None else Q_(0, "inch"), "gauge",
                    source="given", unit="inch")  # fmt: skip
        if k.planes == 1:
            assert k.le_t is not None
            let = c.given("l_et", k.le_t, "edge distance across the force", unit="inch")
            Ant = c.derive("A_nt", ((nl - 1) * g + let - (nl - 0.5) * dh) * t,
                           "net tension area", unit="inch**2",
                           ref="AISC 360-16 §J4.3")  # fmt: skip
        else:
            Ant = c.derive("A_nt", (nl - 1) * (g - dh) * t, "net tension area between the "
                           "outer lines", unit="inch**2", ref="AISC 360-16 §J4.3")  # fmt: skip
        U = c.given("U_bs", float(k.Ubs), "tension stress uniform" if k.Ubs == 1.0
                    else "tension stress not uniform", source="AISC 360-16 §J4.3")  # fmt: skip
        Rn = c.derive("R_n_bs", c.min(0.60 * Fu * Anv + U * Fu * Ant,
                                      0.60 * Fy * Agv + U * Fu * Ant),
                      "nominal block shear strength", unit="kip",
                      ref="AISC 360-16 Eq. (J4-5)")  # fmt: skip
        cap = factored(c, "block shear", Rn, method, name="R_c_bs", unit="kip")
        Rr = c.given(f"R_{sym}", R, "required strength", source=combination or "given",
                     unit="kip")  # fmt: skip
        c.check("Block shear", Rr, cap, ref="AISC 360-16 §J4.3", combination=combination)

    return run_checks(mark, "Block shear rupture", member_standard(method), logic)


# the threaded parts of Table J3.2 used as anchor rods
ANCHOR_GRADES = ("F1554 Gr. 36", "F1554 Gr. 55", "F1554 Gr. 105", "A307")


def check_aisc_anchor_rods(
    rods: BoltGroup,
    *,
    T: Quantity | None = None,
    V: Quantity | None = None,
    method: str = "LRFD",
    mark: str = "AR1",
    combination: str | None = None,
) -> MemberChecks:
    """Anchor rods of a base plate: the steel rod in tension and shear (Table J3.2 threaded
    parts, §J3.6-§J3.7); the concrete anchorage reported NOT COVERED (ACI 318-19 Chapter 17).

    Raises:
        InputError: a grade that is not an anchor rod or threaded part (A307 or F1554).
    """
    method = check_method(method)
    one_of("grade", rods.grade, ANCHOR_GRADES)
    Vq = V if V is not None else Q_(0.0, "kip")
    require(Vq, "[force]", "V", nonnegative=True)

    def logic(c: Recorder) -> None:
        c.assume(
            "Shear shared equally by the rods (plate washers welded to the base plate); rod "
            "bending across a grout pad is not considered."
        )
        bolt_logic(c, rods, Vq, T, method, combination)
        c.not_covered(
            "Concrete anchorage",
            "Concrete breakout, pullout, side-face blowout and pryout of the anchors are "
            "governed by ACI 318-19 Chapter 17 (AISC 360-16 §J9), not implemented here: "
            "design the embedment to ACI 318-19 Chapter 17 and attach that calculation.",
            ref="ACI 318-19 Chapter 17",
        )

    return run_checks(mark, f"Anchor rods {rods.label}", member_standard(method), logic)
