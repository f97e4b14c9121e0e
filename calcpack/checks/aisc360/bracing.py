"""ANSI/AISC 360-16 Appendix 6: required strength and stiffness of stability bracing.

* columns (§6.2): panel bracing V_br = 0.005 P_r, β_br = (1/φ)(2P_r/L_br) [Ω(2P_r/L_br)];
  point bracing P_br = 0.01 P_r, β_br = (1/φ)(8P_r/L_br) [Ω(8P_r/L_br)];
* beams, lateral bracing (§6.3.1): panel V_br = 0.01 M_r C_d/h_o, β_br = (1/φ)(4M_r C_d/(L_br
  h_o)); point P_br = 0.02 M_r C_d/h_o, β_br = (1/φ)(10 M_r C_d/(L_br h_o)); C_d = 1.0, or 2.0
  for the brace closest to the inflection point of a beam in double curvature;

with φ = 0.75 (LRFD) and Ω = 2.00 (ASD). The brace provided (strength and stiffness, when given)
is checked against them. Torsional bracing of beams (§6.3.2) is not implemented.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.aisc360.member_data import FACTORS, Factor, check_method, member_standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.units import Quantity, require
from calcpack.validate import one_of

__all__ = ["BraceCase", "check_aisc_bracing", "required_stiffness"]

Braced = Literal["column", "beam"]
Kind = Literal["point", "panel"]


@dataclass(frozen=True)
class BraceCase:
    """What a brace holds and how.

    Args:
        member: "column" or "beam". kind: "point" (nodal) or "panel" (relative).
        Lbr: unbraced length next to the brace (point) or between the panel's ends.
        Pr: required axial strength of the column (member = "column").
        Mr: required flexural strength of the beam and ho: distance between its flange
            centroids (member = "beam"). double_curvature_near_inflection: C_d = 2.0.
        brace_strength, brace_stiffness: what the brace provides (optional, checked if given).
        combination: the load combination of P_r or M_r.
    """

    member: Braced
    kind: Kind
    Lbr: Quantity
    Pr: Quantity | None = None
    Mr: Quantity | None = None
    ho: Quantity | None = None
    double_curvature_near_inflection: bool = False
    brace_strength: Quantity | None = None
    brace_stiffness: Quantity | None = None
    combination: str | None = None

    def __post_init__(self) -> None:
        one_of("member", self.member, ("column", "beam"))
        one_of("kind", self.kind, ("point", "panel"))
        require(self.Lbr, "[length]", "Lbr", positive=True)
        if self.member == "column":
            require(self.Pr, "[force]", "Pr", positive=True)
        else:
            require(self.Mr, "[force]*[length]", "Mr", positive=True)
            require(self.ho, "[length]", "ho", positive=True)
        if self.brace_strength is not None:
            require(self.brace_strength, "[force]", "brace_strength", positive=True)
        if self.brace_stiffness is not None:
            require(self.brace_stiffness, "[force]/[length]", "brace_stiffness", positive=True)


# (member, kind) -> the required strength's symbol, its coefficient, words and equation; the
# coefficient of the required stiffness and its equation (AISC 360-16 Appendix 6.2, 6.3.1)
_RULES: dict[tuple[str, str], tuple[str, float, str, str, int, str]] = {
    ("column", "panel"): (
        "V_br",
        0.005,
        "required shear strength of the bracing",
        "A-6-1",
        2,
        "A-6-2",
    ),
    ("column", "point"): ("P_br", 0.01, "required brace strength", "A-6-3", 8, "A-6-4"),
    ("beam", "panel"): ("V_br", 0.01, "required shear strength", "A-6-5", 4, "A-6-6"),
    ("beam", "point"): ("P_br", 0.02, "required brace strength", "A-6-7", 10, "A-6-8"),
}


def required_stiffness(
    c: Recorder,
    f: Factor,
    method: str,
    base: Any,
    *,
    name: str,
    what: str,
    unit: str,
    ref: str,
    factor_for: str,
) -> Any:
    """An Appendix 6 required stiffness: ``base``/φ (LRFD) or Ω·``base`` (ASD), with the
    factor of ``f`` declared on the sheet."""
    if method == "LRFD":
        phi = c.given("phi", f.phi, f"resistance factor, {factor_for}", source=f.clause)
        return c.derive(name, base / phi, what, unit=unit, ref=ref)
    om = c.given("Omega", f.omega, f"safety factor, {factor_for}", source=f.clause)
    return c.derive(name, om * base, what, unit=unit, ref=ref)


def check_aisc_bracing(case: BraceCase, *, method: str = "LRFD", mark: str = "BR1") -> MemberChecks:
    """Required brace strength and stiffness to AISC 360-16 Appendix 6 (and the check of the
    brace provided, when its strength and stiffness are given)."""
    method = check_method(method)
    f = FACTORS["bracing"]
    b = case

    def logic(c: Recorder) -> None:
        c.heading(f"Stability bracing of a {b.member}, {b.kind} brace (Appendix 6)", 3)
        Lbr = c.given("L_br", b.Lbr, "unbraced length at the brace", source="given", unit="ft")
        name, k_strength, what, eq_strength, k_stiffness, eq_stiffness = _RULES[b.member, b.kind]
        if b.member == "column":
            Pr = c.given(
                "P_r",
                b.Pr,
                "required axial strength of the column",
                source=b.combination or "given",
                unit="kip",
            )
            strength = k_strength * Pr
            base = k_stiffness * Pr / Lbr
        else:
            Mr = c.given(
                "M_r",
                b.Mr,
                "required flexural strength of the beam",
                source=b.combination or "given",
                unit="kip*ft",
            )
            ho = c.given(
                "h_o", b.ho, "distance between flange centroids", source="given", unit="inch"
            )
            Cd = c.given(
                "C_d",
                2.0 if b.double_curvature_near_inflection else 1.0,
                "double curvature factor",
                source="AISC 360-16 Appendix 6.3.1",
            )
            strength = k_strength * Mr * Cd / ho
            base = k_stiffness * Mr * Cd / (Lbr * ho)
        req = c.derive(name, strength, what, unit="kip", ref=f"AISC 360-16 Eq. ({eq_strength})")
        ref = f"AISC 360-16 Eq. ({eq_stiffness})"
        beta = required_stiffness(
            c,
            f,
            method,
            base,
            name="beta_br",
            what="required brace stiffness",
            unit="kip/inch",
            ref=ref,
            factor_for="bracing",
        )
        if b.brace_strength is None or b.brace_stiffness is None:
            c.not_covered(
                "Brace",
                "brace strength and stiffness not given: the brace must provide at least the "
                "required strength and stiffness above",
                ref="AISC 360-16 Appendix 6",
            )
            return
        got = c.given(
            "R_brace",
            b.brace_strength,
            "available strength of the brace",
            source="given",
            unit="kip",
        )
        k = c.given(
            "k_brace", b.brace_stiffness, "stiffness of the brace", source="given", unit="kip/inch"
        )
        c.check("Brace strength", req, got, ref="AISC 360-16 Appendix 6", combination=b.combination)
        c.check("Brace stiffness", beta, k, ref=ref, combination=b.combination)

    return run_checks(
        mark, f"{b.kind.capitalize()} bracing of a {b.member}", member_standard(method), logic
    )
