"""ANSI/AISC 360-16 §H2: unsymmetric and other members under axial force and flexure, by the
stresses at points of the cross section, LRFD or ASD.

    |f_ra/F_ca + f_rbw/F_cbw + f_rbz/F_cbz| ≤ 1.0        (Eq. H2-1)

at each point considered, about the principal axes w (major) and z (minor), with the sense of
each flexural stress at that point. The required stresses come from the required strengths:
f_ra = P_r/A_g, f_rbw = M_rw z/I_w, f_rbz = M_rz w/I_z; the available stresses from the available
strengths the engineer has found by Chapters D/E and F for the member (φP_n or P_n/Ω and the
flexural strengths about each principal axis): F_ca = P_c/A_g, F_cbw = M_cw/S_w with
S_w = I_w/|z| at the point, and likewise about z.

Sign convention: compression positive. P_r > 0 is compression; a positive M_rw compresses the
points with z > 0, a positive M_rz the points with w > 0. The required strengths are taken to
include second-order effects (Chapter C), as §H2 requires for compression.

For a single angle, :func:`angle_h2_case` takes A_g, I_w = I_x + I_y − I_z, I_z and the principal
axes (tan α) from the AISC Shapes Database, and the three points commonly checked: the heel and
the outer corners of the two toes (common practice). This module does not find the available
flexural strengths about the principal axes of single angles (§F10 for principal-axis bending
is not implemented): they are inputs, with their source.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal

from calcpack.checks.aisc360.member_data import check_method, member_standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive

__all__ = ["H2Case", "H2Point", "angle_h2_case", "check_aisc_h2"]


@dataclass(frozen=True)
class H2Point:
    """A point of the cross section, by its coordinates on the principal axes (from the
    centroid): ``w`` along the major principal axis, ``z`` along the minor one."""

    name: str
    w: Quantity
    z: Quantity

    def __post_init__(self) -> None:
        dimension(f"{self.name}.w", self.w, "[length]")
        dimension(f"{self.name}.z", self.z, "[length]")


@dataclass(frozen=True)
class H2Case:
    """Required and available strengths of one member for one load combination (§H2).

    Args:
        Ag: gross area. Iw, Iz: moments of inertia about the major (w) and minor (z)
            principal axes.
        Pr: required axial strength, compression positive. Mrw, Mrz: required flexural
            strengths about w and z, signed (see the module notes).
        Pc: available axial strength in the sense of P_r (compression: Chapter E; tension:
            Chapter D). Mcw, Mcz: available flexural strengths about w and z (Chapter F).
        points: the points where Eq. H2-1 is evaluated (for an angle: the heel and the two
            toes).
        source: where P_c, M_cw and M_cz come from. combination: the load combination.
    """

    Ag: Quantity
    Iw: Quantity
    Iz: Quantity
    Pr: Quantity
    Mrw: Quantity
    Mrz: Quantity
    Pc: Quantity
    Mcw: Quantity
    Mcz: Quantity
    points: tuple[H2Point, ...]
    source: str = "given"
    combination: str | None = None

    def __post_init__(self) -> None:
        positive("Ag", dimension("Ag", self.Ag, "[area]"))
        for nm in ("Iw", "Iz"):
            positive(nm, dimension(nm, getattr(self, nm), "[length]**4"))
        dimension("Pr", self.Pr, "[force]")
        positive("Pc", dimension("Pc", self.Pc, "[force]"))
        for nm in ("Mrw", "Mrz"):
            dimension(nm, getattr(self, nm), "[force]*[length]")
        for nm in ("Mcw", "Mcz"):
            positive(nm, dimension(nm, getattr(self, nm), "[force]*[length]"))
        if not self.points or not all(isinstance(p, H2Point) for p in self.points):
            raise InputError(
                name="points",
                value=self.points,
                rule="must list at least one H2Point of the cross section",
                expected="e.g. (H2Point('heel', w=..., z=...),)",
            )


Sense = Literal[-1, 0, 1]


def _sense(x: Quantity) -> Sense:
    v = float(x.magnitude)
    return 1 if v > 0 else (-1 if v < 0 else 0)


def check_aisc_h2(case: H2Case, *, method: str = "LRFD", mark: str = "M1") -> MemberChecks:
    """Combined axial force and flexure by AISC 360-16 Eq. (H2-1) at each point of ``case``.

    Returns:
        MemberChecks with one check per point ("Combined stress at <point>"), clause §H2.

    Raises:
        InputError: bad units, values or method (naming the input).
    """
    method = check_method(method)
    k = case
    sfx = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        c.heading("Combined axial force and flexure by stresses, §H2", 3)
        c.assume(
            "The required strengths include second-order effects (AISC 360-16 Chapter C); "
            "compression positive; principal axes w (major) and z (minor)."
        )
        A = c.given("A_g", k.Ag, "gross area", source="given")
        Iw = c.given("I_w", k.Iw, "moment of inertia, major principal axis", source="given")
        Iz = c.given("I_z", k.Iz, "moment of inertia, minor principal axis", source="given")
        src = k.combination or "given"
        Pr = c.given(f"P_r{sfx}", k.Pr, "required axial strength", source=src, result=True)
        Mw = c.given(
            f"M_r{sfx}w", k.Mrw, "required flexural strength about w", source=src, result=True
        )
        Mz = c.given(
            f"M_r{sfx}z", k.Mrz, "required flexural strength about z", source=src, result=True
        )
        Pc = c.given("P_c", k.Pc, "available axial strength", source=k.source)
        Mcw = c.given("M_cw", k.Mcw, "available flexural strength about w", source=k.source)
        Mcz = c.given("M_cz", k.Mcz, "available flexural strength about z", source=k.source)
        fa = c.derive("f_ra", Pr / A, "required axial stress", unit="ksi", ref="AISC 360-16 §H2")
        Fa = c.derive("F_ca", Pc / A, "available axial stress", unit="ksi", ref="AISC 360-16 §H2")
        for p in k.points:
            tag = p.name.replace(" ", "_")
            c.heading(f"Point: {p.name}", 4)
            w = c.given(f"w_{tag}", p.w, "coordinate along w", source="given")
            z = c.given(f"z_{tag}", p.z, "coordinate along z", source="given")
            ratio = fa / Fa
            sz, sw = _sense(p.z), _sense(p.w)
            # about w the stress goes with z (its distance from the w axis), about z with w
            for ax, sense, M, Mc, I, coord, dist in (
                ("w", sz, Mw, Mcw, Iw, z, p.z),
                ("z", sw, Mz, Mcz, Iz, w, p.w),
            ):
                if sense == 0:
                    continue
                cc = c.given(
                    f"c_{ax}_{tag}", abs(dist), f"distance from the {ax} axis", source="given"
                )
                S = c.derive(
                    f"S_{ax}_{tag}",
                    I / cc,
                    "section modulus at the point",
                    unit="inch**3",
                    ref="AISC 360-16 §H2",
                )
                fb = c.derive(
                    f"f_rb{ax}_{tag}",
                    M * coord / I,
                    f"required flexural stress, {ax} axis",
                    unit="ksi",
                    ref="AISC 360-16 §H2",
                )
                Fb = c.derive(
                    f"F_cb{ax}_{tag}",
                    Mc / S,
                    f"available flexural stress, {ax} axis",
                    unit="ksi",
                    ref="AISC 360-16 §H2",
                )
                ratio = ratio + fb / Fb
            total = c.derive(
                f"U_H2_{tag}",
                ratio,
                "interaction at the point (signed)",
                ref="AISC 360-16 Eq. (H2-1)",
            )
            c.check(
                f"Combined stress at {p.name}",
                abs(c.f(total)) * Q_(1.0, ""),
                Q_(1.0, ""),
                ref="AISC 360-16 Eq. (H2-1)",
                combination=k.combination,
            )

    return run_checks(
        mark,
        f"Axial force and flexure by stresses, AISC 360-16 §H2 {method}",
        member_standard(method),
        logic,
    )


def angle_h2_case(
    shape: SteelShape,
    *,
    Pr: Quantity,
    Mrw: Quantity,
    Mrz: Quantity,
    Pc: Quantity,
    Mcw: Quantity,
    Mcz: Quantity,
    source: str = "given",
    combination: str | None = None,
) -> H2Case:
    """The §H2 case of a single angle, its section and points from the AISC Shapes Database.

    Axes: the database's x to the right along the horizontal leg b, y up along the vertical leg
    d, heel at the lower left; the major principal axis w at α above x (tan α tabulated), the
    minor axis z at α from y toward −x. Points: heel (−x̄, −ȳ), toe of the vertical leg
    (−x̄, d − ȳ), toe of the horizontal leg (b − x̄, −ȳ), outer corners.

    Raises:
        OutOfScopeError: not a single angle. InputError: bad forces (as :class:`H2Case`).
    """
    if not isinstance(shape, SteelShape) or shape.type != "L":
        raise OutOfScopeError(
            f"Shape {getattr(shape, 'designation', shape)!r}: angle_h2_case is for single angles"
        )
    a = math.atan(float(shape["tan_a"].to("").magnitude))
    ca, sa = math.cos(a), math.sin(a)
    xb, yb = shape["x"], shape["y"]
    corners = {
        "heel": (-xb, -yb),
        "toe of leg d": (-xb, shape["d"] - yb),
        "toe of leg b": (shape["b"] - xb, -yb),
    }
    points = tuple(
        H2Point(name, w=(x * ca + y * sa).to("inch"), z=(-x * sa + y * ca).to("inch"))
        for name, (x, y) in corners.items()
    )
    return H2Case(
        Ag=shape["A"],
        Iw=shape["Ix"] + shape["Iy"] - shape["Iz"],
        Iz=shape["Iz"],
        Pr=Pr,
        Mrw=Mrw,
        Mrz=Mrz,
        Pc=Pc,
        Mcw=Mcw,
        Mcz=Mcz,
        points=points,
        source=f"{source}; section: {shape.source}",
        combination=combination,
    )
