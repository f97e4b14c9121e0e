"""Inputs shared by the ANSI/AISC 360-16 member checks: the member, the required strengths,
the resistance and safety factors (declared once here) and the width-to-thickness ratios.

Units: stresses and lengths as pint quantities; F_y is the specified minimum yield stress. The
factors are those of AISC 360-16 (§B3.1 LRFD: R_u ≤ φR_n; §B3.2 ASD: R_a ≤ R_n/Ω).
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Any, Literal

from calcpack.checks.aisc360.shape import _TITLE, AISC360_EDITION, E_STEEL
from calcpack.checks.base import Recorder, Standard
from calcpack.checks.scope import material_in_scope
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Q_, Quantity, require
from calcpack.validate import instance, one_of, within

__all__ = [
    "FACTORS",
    "G_STEEL",
    "Factor",
    "MemberForces",
    "Method",
    "SteelMember",
    "design_strength",
    "member_standard",
]

Method = Literal["LRFD", "ASD"]
TeeStem = Literal["tension", "compression"]
G_STEEL = Q_(11200.0, "ksi")  # shear modulus of steel, AISC 360-16 (G = 11 200 ksi)


@dataclass(frozen=True)
class Factor:
    """A resistance factor φ (LRFD) and safety factor Ω (ASD) with the clause that sets them."""

    phi: float
    omega: float
    clause: str


FACTORS: Mapping[str, Factor] = MappingProxyType(
    {
        "tension yielding": Factor(0.90, 1.67, "AISC 360-16 §D2(a)"),
        "tension rupture": Factor(0.75, 2.00, "AISC 360-16 §D2(b)"),
        "compression": Factor(0.90, 1.67, "AISC 360-16 §E1"),
        "flexure": Factor(0.90, 1.67, "AISC 360-16 §F1"),
        "shear": Factor(0.90, 1.67, "AISC 360-16 §G1"),
        "shear rolled I": Factor(1.00, 1.50, "AISC 360-16 §G2.1(a)"),
        "web local yielding": Factor(1.00, 1.50, "AISC 360-16 §J10.2"),
        "web local crippling": Factor(0.75, 2.00, "AISC 360-16 §J10.3"),
        "web sidesway buckling": Factor(0.85, 1.76, "AISC 360-16 §J10.4"),
        "bearing": Factor(0.75, 2.00, "AISC 360-16 §J7"),
        "concrete bearing": Factor(0.65, 2.31, "AISC 360-16 §J8"),
        "plate flexure": Factor(0.90, 1.67, "AISC 360-16 §F1"),
        "bracing": Factor(0.75, 2.00, "AISC 360-16 Appendix 6.1"),
        "torsional bracing": Factor(0.75, 3.00, "AISC 360-16 Appendix 6.3.2"),
    }
)


def member_standard(method: str) -> Standard:
    """The standard of every AISC 360-16 member check, with its method."""
    return Standard(AISC360_EDITION, _TITLE, method)


def design_strength(
    c: Recorder, key: str, nominal: Any, method: str, *, name: str, unit: str, what: str
) -> Any:
    """φR_n (LRFD) or R_n/Ω (ASD) of ``nominal`` with the factor ``FACTORS[key]`` shown."""
    f = FACTORS[key]
    if method == "LRFD":
        phi = c.given(f"phi_{name}", f.phi, f"resistance factor, {key}", source=f.clause)
        return c.derive(name, phi * nominal, f"design {what} φR_n", unit=unit, ref=f.clause)
    omega = c.given(f"Omega_{name}", f.omega, f"safety factor, {key}", source=f.clause)
    return c.derive(name, nominal / omega, f"allowable {what} R_n/Ω", unit=unit, ref=f.clause)


def _opt_length(value: Quantity | None, name: str) -> None:
    if value is not None:
        require(value, "[length]", name, positive=True)


@dataclass(frozen=True)
class SteelMember:
    """A steel member: its shape, grade and the lengths that set its buckling strength.

    Args:
        shape: a tabulated shape (:func:`calcpack.sections.aisc_database.aisc_shape`).
        Fy: specified minimum yield stress (AISC 360-16 covers F_y ≤ 70 ksi for these checks,
            §E/§F user notes). Fu: specified minimum tensile stress (tension rupture).
        grade: the material, e.g. ``"ASTM A992"`` (shown with F_y).
        Lcx, Lcy: effective lengths for flexural buckling about x and y (K·L, §E2);
            Lcz: for torsional buckling (§E4; default L_cy).
        Lb: unbraced length of the compression flange for lateral-torsional buckling (None:
            continuously braced, or not bent about x). Cb: LTB modification factor (§F1,
            1.0 conservative; 1.0 ≤ C_b ≤ 3.0).
        E: modulus of elasticity (29 000 ksi). G: shear modulus (11 200 ksi).
        tee_stem: for tees in flexure (§F9), "tension" when the stem tip is in tension all
            along L_b (the flange in compression), "compression" when the stem is in
            compression anywhere along L_b.
    """

    shape: SteelShape
    Fy: Quantity
    Fu: Quantity | None = None
    grade: str = ""
    Lcx: Quantity | None = None
    Lcy: Quantity | None = None
    Lcz: Quantity | None = None
    Lb: Quantity | None = None
    Cb: float = 1.0
    E: Quantity = E_STEEL
    G: Quantity = G_STEEL
    tee_stem: TeeStem = "tension"

    def __post_init__(self) -> None:
        instance("shape", self.shape, SteelShape, expected="a tabulated shape, aisc_shape('W8X18')")
        material_in_scope("AISC 360-16|steel|Fy", "Fy", self.Fy)
        if self.Fu is not None:
            require(self.Fu, "[pressure]", "Fu", positive=True)
            within("Fu", self.Fu, lo=self.Fy, rule="F_u is not less than F_y")
        material_in_scope("AISC 360-16|steel|E", "E", self.E)
        require(self.G, "[pressure]", "G", positive=True)
        for nm in ("Lcx", "Lcy", "Lcz", "Lb"):
            _opt_length(getattr(self, nm), nm)
        within("Cb", float(self.Cb), 1.0, 3.0, rule="AISC 360-16 §F1 (1.0 ≤ C_b ≤ 3.0)")
        one_of("tee_stem", self.tee_stem, ("tension", "compression"))

    @property
    def family(self) -> str:
        return self.shape.type

    def p(self, name: str) -> Quantity:
        """A tabulated property of the shape."""
        return self.shape[name]


@dataclass(frozen=True)
class MemberForces:
    """Required strengths of one load combination (LRFD: P_u, M_u, V_u; ASD: P_a, M_a, V_a).

    Sign convention: P positive in compression, negative in tension; moments and shears are
    magnitudes about the shape's geometric x (major) and y (minor) axes. For single angles
    M_x is the moment about the axis parallel to the horizontal leg, sagging (the vertical leg's
    toe in compression).

    Args:
        P: axial force. Mx, My: moments. Vx: shear along the x axis (parallel to the flanges,
            minor-axis bending); Vy: shear along y (in the web, major-axis bending).
        combination: the load combination they come from.
    """

    P: Quantity = field(default_factory=lambda: Q_(0.0, "kip"))
    Mx: Quantity = field(default_factory=lambda: Q_(0.0, "kip*ft"))
    My: Quantity = field(default_factory=lambda: Q_(0.0, "kip*ft"))
    Vx: Quantity = field(default_factory=lambda: Q_(0.0, "kip"))
    Vy: Quantity = field(default_factory=lambda: Q_(0.0, "kip"))
    combination: str | None = None

    def __post_init__(self) -> None:
        require(self.P, "[force]", "P")
        for nm in ("Mx", "My"):
            require(getattr(self, nm), "[force]*[length]", nm)
        for nm in ("Vx", "Vy"):
            require(getattr(self, nm), "[force]", nm)


def check_method(method: str) -> str:
    """``method`` if it is "LRFD" or "ASD" (an InputError naming it otherwise)."""
    return str(one_of("method", method, ("LRFD", "ASD")))
