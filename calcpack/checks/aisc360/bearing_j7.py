"""ANSI/AISC 360-16 §J7: bearing strength of steel surfaces in contact, LRFD or ASD.

* finished (milled) surfaces, pins in reamed, drilled or bored holes and the ends of fitted
  bearing stiffeners: R_n = 1.8 F_y A_pb (Eq. J7-1);
* expansion rollers and rockers: R_n = 1.2 (F_y − 13) l_b d / 20 for d ≤ 25 in. (Eq. J7-2) and
  R_n = 6.0 (F_y − 13) l_b √d / 20 for d > 25 in. (Eq. J7-3), the Specification's equations in
  ksi and inches (written here with their units so any consistent units may be given);

with φ = 0.75 (LRFD), Ω = 2.00 (ASD) from ``FACTORS["bearing"]``. F_y is the lower yield stress
of the parts in contact (common practice). Bearing on concrete is §J8 (``bearing.py``); the web
under a concentrated force is §J10 (``bearing.py``).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.checks.aisc360.member_data import Method, check_method, design_strength
from calcpack.checks.aisc360.member_data import member_standard as _standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.scope import material_in_scope
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive

__all__ = ["BearingSurface", "SurfaceKind", "check_aisc_bearing"]

SurfaceKind = Literal["finished surface", "pin", "fitted stiffener", "roller", "rocker"]
_FLAT = ("finished surface", "pin", "fitted stiffener")
_ROLLING = ("roller", "rocker")
_KINDS = _FLAT + _ROLLING

# the constants of Eq. (J7-2) and (J7-3), which the Specification writes in ksi and inches
_F13 = Q_(13.0, "ksi")
_D_LIMIT = Q_(25.0, "inch")
_INCH = Q_(1.0, "inch")


@dataclass(frozen=True)
class BearingSurface:
    """Two steel parts bearing on each other, and the force between them.

    Args:
        kind: "finished surface" (milled), "pin" (in a reamed, drilled or bored hole),
            "fitted stiffener" (end of a fitted bearing stiffener), "roller" or "rocker"
            (expansion bearings).
        Fy: specified minimum yield stress, the lower of the parts in contact.
        R: required bearing strength (R_u LRFD, R_a ASD), compression, a force.
        Apb: projected bearing area (finished surfaces, pins: pin diameter × plate
            thickness; stiffeners: the fitted end area clear of the flange-to-web fillets).
        d: roller or rocker diameter. lb: length of bearing of the roller or rocker.
        combination: the load combination of R.
    """

    kind: SurfaceKind
    Fy: Quantity
    R: Quantity
    Apb: Quantity | None = None
    d: Quantity | None = None
    lb: Quantity | None = None
    combination: str | None = None

    def __post_init__(self) -> None:
        one_of("kind", self.kind, _KINDS)
        material_in_scope("AISC 360-16|steel|Fy", "Fy", self.Fy)
        positive("R", dimension("R", self.R, "[force]"))
        if self.kind in _FLAT:
            positive("Apb", dimension("Apb", self.Apb, "[area]"))
        else:
            positive("d", dimension("d", self.d, "[length]"))
            positive("lb", dimension("lb", self.lb, "[length]"))


def check_aisc_bearing(
    surface: BearingSurface, *, method: Method = "LRFD", mark: str = "BRG1"
) -> MemberChecks:
    """Bearing strength of steel surfaces in contact, AISC 360-16 §J7.

    Args:
        surface: the parts in contact and the required strength (:class:`BearingSurface`).
        method: "LRFD" (R is R_u, strength φR_n) or "ASD" (R is R_a, strength R_n/Ω).
        mark: the member or detail mark.

    Returns:
        MemberChecks with the check "Bearing" (clause §J7, Eq. J7-1, J7-2 or J7-3).

    Raises:
        InputError: a bad kind, method, unit or value (naming the input).
    """
    method = check_method(method)  # type: ignore[assignment]
    b = surface
    sfx = "u" if method == "LRFD" else "a"

    def logic(c: Recorder) -> None:
        c.heading(f"Bearing strength, {b.kind} (§J7)", 3)
        Fy = c.given("F_y", b.Fy, "yield stress, lower of the parts in contact", unit="ksi")
        if b.kind in _FLAT:
            Apb = c.given("A_pb", b.Apb, "projected bearing area", source="given", unit="inch**2")
            Rn = c.derive(
                "R_n",
                1.8 * Fy * Apb,
                "nominal bearing strength",
                unit="kip",
                ref="AISC 360-16 Eq. (J7-1)",
            )
        else:
            F13 = c.given("F_13", _F13, "constant of Eq. (J7-2)/(J7-3)", source="AISC 360-16 §J7")
            d = c.given("d", b.d, f"{b.kind} diameter", source="given", unit="inch")
            lb = c.given("l_b", b.lb, "length of bearing", source="given", unit="inch")
            if c.q(d) <= _D_LIMIT:
                Rn = c.derive(
                    "R_n",
                    1.2 * (Fy - F13) * lb * d / 20,
                    "nominal bearing strength, d ≤ 25 in.",
                    unit="kip",
                    ref="AISC 360-16 Eq. (J7-2)",
                )
            else:
                one = c.given(
                    "i_1", _INCH, "one inch (Eq. J7-3 takes d in inches)", source="AISC 360-16 §J7"
                )
                Rn = c.derive(
                    "R_n",
                    6.0 * (Fy - F13) * lb * c.sqrt(d * one) / 20,
                    "nominal bearing strength, d > 25 in. (√d with d in inches)",
                    unit="kip",
                    ref="AISC 360-16 Eq. (J7-3)",
                )
        Rc = design_strength(c, "bearing", Rn, method, name="R_c", unit="kip", what="bearing")
        R = c.given(
            f"R_{sfx}",
            b.R,
            "required bearing strength",
            source=b.combination or "given",
            unit="kip",
            result=True,
        )
        c.check("Bearing", R, Rc, ref="AISC 360-16 §J7", combination=b.combination)

    return run_checks(mark, f"Bearing of steel surfaces ({b.kind})", _standard(method), logic)
