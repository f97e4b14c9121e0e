"""NDS 2018 (ASD) bearing, notched-beam shear and long-term deflection.

* :func:`check_nds_bearing`: bearing perpendicular to grain (§3.10.2, F'_c⊥ = F_c⊥ C_M C_t
  C_i C_b with the bearing area factor C_b = (ℓ_b + 0.375)/ℓ_b of §3.10.4 for ℓ_b < 6 in. and
  at least 3 in. from the end), parallel to grain on end grain (§3.10.1, F*_c: C_P not applied),
  or at an angle θ to grain by Hankinson's formula (§3.10.3);
* :func:`check_nds_notched_shear`: reduced shear at a notch on the tension face at a support
  (§3.4.3.2(a), V'_r = (2/3) F'_v b d_n (d_n/d)²), notch depth at most d/4 (§4.4.3 for sawn
  lumber ends);
* :func:`long_term_deflection`: Δ_T = K_cr Δ_LT + Δ_ST (§3.5.2), K_cr = 1.5 for seasoned lumber,
  glulam and SCL used dry, 2.0 for lumber or glulam in wet service.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.factors import (
    _TITLE,
    DURATION_FACTORS,
    NDS_EDITION,
    wet_service_factor,
    wet_service_source,
    wet_table,
)
from calcpack.checks.nds.values import TimberValues
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of, within

__all__ = [
    "TimberBearing",
    "check_nds_bearing",
    "check_nds_notched_shear",
    "long_term_deflection",
]

Direction = Literal["perpendicular", "parallel", "angle"]


def _wet(g: TimberBearing, prop: str) -> float:
    # C_M of Table 4A (dimension lumber) or 4D (timbers); F_c's threshold reads F_c·C_F
    if not g.wet:
        return 1.0
    Fc_CF = g.values.Fc * g.CF_c
    return wet_service_factor(prop, wet=True, Fc_CF=Fc_CF, table=wet_table(g.values.product))


def _wet_source(g: TimberBearing) -> str:
    if not g.wet:
        return "dry service, MC ≤ 19 % (C_M = 1.0)"
    return wet_service_source(wet_table(g.values.product))


@dataclass(frozen=True)
class TimberBearing:
    """A bearing on a wood member.

    Args:
        values: reference design values of the member. R: bearing force (ASD).
        b: width of the bearing (member breadth). lb: bearing length along the grain (for
            perpendicular bearing) or the second side of the end-grain area (parallel).
        direction: "perpendicular", "parallel" (end grain) or "angle" with ``angle`` θ to
            the grain. from_end: distance of the bearing from the member end (for C_b).
        wet: moisture content above 19 % in service (C_M of NDS Supplement Table 4A for
            dimension lumber, 4D for timbers; glulam and SCL refused).
        CF_c: size factor for F_c (end grain). duration: load duration (parallel to grain).
    """

    values: TimberValues
    R: Quantity
    b: Quantity
    lb: Quantity
    direction: Direction = "perpendicular"
    angle: Quantity | None = None
    from_end: Quantity | None = None
    wet: bool = False
    CF_c: float = 1.0
    duration: str = "ten years"
    combination: str | None = None

    def __post_init__(self) -> None:
        require(self.R, "[force]", "R", positive=True)
        require(self.b, "[length]", "b", positive=True)
        require(self.lb, "[length]", "lb", positive=True)
        one_of("direction", self.direction, ("perpendicular", "parallel", "angle"))
        one_of("duration", self.duration, list(DURATION_FACTORS))
        if self.direction == "angle":
            require(self.angle, "[]", "angle")
            assert self.angle is not None
            within(
                "angle",
                self.angle.to("degree"),
                Q_(0.0, "degree"),
                Q_(90.0, "degree"),
                rule="θ is measured from the grain, 0° to 90°",
            )
        if self.from_end is not None:
            require(self.from_end, "[length]", "from_end", nonnegative=True)
        if self.wet:
            wet_table(self.values.product)  # refuses glulam and SCL in wet service


def check_nds_bearing(bearing: TimberBearing, *, mark: str = "BRG1") -> MemberChecks:
    """Bearing stress against F'_c⊥, F*_c or F'_θ (NDS 2018 §3.10)."""
    g = bearing
    v = g.values
    combo = g.combination

    def logic(c: Recorder) -> None:
        c.assume("Sustained temperature ≤ 100 °F (C_t = 1.0); not incised (C_i = 1.0).")
        R = c.given("R", g.R, "bearing force", source=combo or "given", unit="lbf")
        b = c.given("b", g.b, "bearing width", source="given", unit="inch")
        lb = c.given("l_b", g.lb, "bearing length", source="given", unit="inch")
        A = c.derive("A_b", b * lb, "bearing area", unit="inch**2")
        fb = c.derive("f_brg", R / A, "bearing stress", unit="psi", ref="NDS 2018 §3.10")
        Fcp = None
        if g.direction in ("perpendicular", "angle"):
            c.heading("Bearing perpendicular to grain, §3.10.2", 3)
            F = c.given("F_c_perp", v.Fc_perp, "reference F_c⊥", source=v.source)
            CM = c.given(
                "C_M_perp",
                _wet(g, "Fc_perp"),
                "wet service factor",
                source=_wet_source(g),
            )
            lb_in = float(g.lb.to("inch").magnitude)
            far = g.from_end is not None and float(g.from_end.to("inch").magnitude) >= 3.0
            if lb_in < 6.0 and far:
                Cb = c.derive(
                    "C_b",
                    (lb + Q_(0.375, "inch")) / lb,
                    "bearing area factor",
                    ref="NDS 2018 Eq. (3.10-2)",
                )
            else:
                Cb = c.given(
                    "C_b",
                    1.0,
                    "bearing area factor (ℓ_b ≥ 6 in. or within 3 in. of "
                    "the end, or distance not given)",
                    source="NDS 2018 §3.10.4",
                )
            Fcp = c.derive(
                "F_c_perp_adj", F * CM * Cb, "F'_c⊥", unit="psi", ref="NDS 2018 Table 4.3.1"
            )
            if g.direction == "perpendicular":
                c.check(
                    "Bearing perpendicular to grain",
                    fb,
                    Fcp,
                    ref="NDS 2018 §3.10.2",
                    combination=combo,
                )
                return
        c.heading("Bearing parallel to grain, §3.10.1", 3)
        Fc = c.given("F_c", v.Fc, "reference F_c", source=v.source)
        CD = c.given("C_D", DURATION_FACTORS[g.duration], g.duration, source="NDS 2018 Table 2.3.2")
        CM = c.given("C_M_c", _wet(g, "Fc"), "wet service factor", source=_wet_source(g))
        CF = c.given("C_F_c", float(g.CF_c), "size factor", source="given")
        Fcs = c.derive(
            "F_c_star",
            Fc * CD * CM * CF,
            "F*_c (C_P not applied)",
            unit="psi",
            ref="NDS 2018 §3.10.1",
        )
        if g.direction == "parallel":
            if c.q(fb) > 0.75 * c.q(Fcs):
                c.caution(
                    "f_c > 0.75 F*_c: bearing on end grain needs a metal plate or "
                    "equivalent (NDS 2018 §3.10.1.3)."
                )
            c.check("Bearing on end grain", fb, Fcs, ref="NDS 2018 §3.10.1", combination=combo)
            return
        assert g.angle is not None
        assert Fcp is not None
        th = float(g.angle.to("radian").magnitude)
        s2 = c.given(
            "sin2", math.sin(th) ** 2, f"sin²θ, θ = {g.angle.to('degree'):~.3g}", source="given"
        )
        c2 = c.given("cos2", math.cos(th) ** 2, "cos²θ", source="given")
        Ft = c.derive(
            "F_theta",
            Fcs * Fcp / (Fcs * s2 + Fcp * c2),
            "bearing at an angle to grain",
            unit="psi",
            ref="NDS 2018 Eq. (3.10-1)",
        )
        c.check("Bearing at an angle to grain", fb, Ft, ref="NDS 2018 §3.10.3", combination=combo)

    return run_checks(mark, f"Bearing on {v.name}", Standard(NDS_EDITION, _TITLE, "ASD"), logic)


def check_nds_notched_shear(
    values: TimberValues,
    *,
    b: Quantity,
    d: Quantity,
    dn: Quantity,
    V: Quantity,
    duration: str = "ten years",
    wet: bool = False,
    mark: str = "N1",
    combination: str | None = None,
) -> MemberChecks:
    """Shear at a notch on the tension face at a support (NDS 2018 §3.4.3.2(a)).

    Raises:
        OutOfScopeError: notch deeper than d/4 (NDS 2018 §4.4.3.2 for sawn lumber ends).
    """
    for nm, q in (("b", b), ("d", d), ("dn", dn)):
        require(q, "[length]", nm, positive=True)
    require(V, "[force]", "V", positive=True)
    one_of("duration", duration, list(DURATION_FACTORS))
    within("dn", dn, hi=d, inclusive=False, rule="the net depth is less than the depth d")
    if float((dn / d).to("").magnitude) < 0.75:
        raise OutOfScopeError(
            f"Notch depth d − d_n = {(d - dn).to('inch'):~.3g} exceeds d/4 = "
            f"{(d / 4).to('inch'):~.3g}: NDS 2018 §4.4.3.2 limits end notches of sawn lumber "
            "to one quarter of the depth"
        )

    def logic(c: Recorder) -> None:
        Fv = c.given("F_v", values.Fv, "reference shear", source=values.source)
        CD = c.given("C_D", DURATION_FACTORS[duration], duration, source="NDS 2018 Table 2.3.2")
        CM = c.given(
            "C_M_v", 0.97 if wet else 1.0, "wet service factor", source="NDS Supplement Table 4A"
        )
        Fvp = c.derive("F_v_adj", Fv * CD * CM, "F'_v", unit="psi", ref="NDS 2018 Table 4.3.1")
        bb = c.given("b", b, "breadth", source="given", unit="inch")
        dd = c.given("d", d, "depth", source="given", unit="inch")
        dnn = c.given("d_n", dn, "depth remaining at the notch", source="given", unit="inch")
        Vr = c.derive(
            "V_r_adj",
            2 / 3 * Fvp * bb * dnn * (dnn / dd) ** 2,
            "reduced shear at a tension-face notch",
            unit="lbf",
            ref="NDS 2018 Eq. (3.4-3)",
        )
        Vd = c.given("V", V, "shear at the support", source=combination or "given", unit="lbf")
        c.check("Shear at notch", Vd, Vr, ref="NDS 2018 §3.4.3.2", combination=combination)

    return run_checks(
        mark, f"Notched end of {values.name}", Standard(NDS_EDITION, _TITLE, "ASD"), logic
    )


def long_term_deflection(
    delta_long_term: Quantity,
    delta_short_term: Quantity,
    *,
    product: Literal["sawn", "timber", "glulam", "scl"] = "sawn",
    wet: bool = False,
) -> tuple[Quantity, float]:
    """Total deflection Δ_T = K_cr Δ_LT + Δ_ST (NDS 2018 Eq. 3.5-1); returns (Δ_T, K_cr).

    Args:
        delta_long_term: immediate deflection under the long-term (sustained) load.
        delta_short_term: deflection under the short-term part of the load.
        product, wet: K_cr = 1.5 for seasoned lumber, glulam and SCL dry; 2.0 for wet service
            (NDS 2018 §3.5.2).

    Raises:
        OutOfScopeError: wet SCL (K_cr from the manufacturer).
    """
    require(delta_long_term, "[length]", "delta_long_term", nonnegative=True)
    require(delta_short_term, "[length]", "delta_short_term", nonnegative=True)
    one_of("product", product, ("sawn", "timber", "glulam", "scl"))
    if wet and product == "scl":
        raise OutOfScopeError("K_cr of SCL in wet service is not given by NDS 2018 §3.5.2")
    Kcr = 2.0 if wet else 1.5
    return Kcr * delta_long_term + delta_short_term, Kcr
