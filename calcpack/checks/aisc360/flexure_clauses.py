"""AISC 360-16 Chapter F: the clauses that several shapes share, written once.

* the linear transition between the plastic and the limiting moment (Eqs. F2-2, F3-1, F6-2,
  F7-10, F9-6, F9-14 are all this one line);
* the flange slenderness limits λ_pf, λ_rf of Table B4.1b (cases 10 and 13);
* the elastic lateral-torsional buckling moment of tees and double angles, Eq. (F9-10) with
  B of Eq. (F9-11) or §F9.2(b)/(c);
* the strength of single and double angles from M_cr, Eqs. (F10-2) and (F10-3), and leg local
  buckling, §F10.3;
* the nominal strength as the least of the limit states.

Each is a function of a :class:`~calcpack.checks.base.Recorder` and handles (quantities on
numbers, steps on a sheet). Units: kip·ft for moments, ksi for stresses. Provisions must be
confirmed against the edition adopted locally.
"""

from __future__ import annotations

from typing import Any, NamedTuple

from calcpack.checks.aisc360.member_data import SteelMember
from calcpack.checks.base import Recorder

__all__ = [
    "F9Buckling",
    "angle_ltb_f10",
    "f9_mcr",
    "flange_limits",
    "flange_slenderness",
    "least_of",
    "leg_local_f10",
    "transition",
]


def transition(Mp: Any, Mr: Any, x: Any, xp: Any, xr: Any) -> Any:
    """Mp − (Mp − Mr)(x − x_p)/(x_r − x_p): the straight line from the plastic moment at
    x = x_p to the limiting moment Mr at x = x_r (x a slenderness or an unbraced length)."""
    return Mp - (Mp - Mr) * (x - xp) / (xr - xp)


def flange_limits(c: Recorder, E: Any, Fy: Any) -> tuple[Any, Any]:
    """λ_pf = 0.38√(E/F_y) and λ_rf = 1.0√(E/F_y), Table B4.1b (flanges of I-shapes,
    channels and tees in flexure)."""
    lpf = c.derive("lambda_pf", 0.38 * c.sqrt(E / Fy), "compact limit", ref="Table B4.1b")
    lrf = c.derive("lambda_rf", 1.0 * c.sqrt(E / Fy), "noncompact limit", ref="Table B4.1b")
    return lpf, lrf


def flange_slenderness(c: Recorder, s: Any, E: Any, Fy: Any) -> tuple[Any, Any, Any]:
    """λ = b_f/2t_f of an I-shape's or tee's flange (Table B4.1b case 10) with its limits
    λ_pf, λ_rf (:func:`flange_limits`); ``s`` the shape's tabulated properties."""
    lam = c.derive(
        "lambda_f",
        s["bf"] / (2 * s["tf"]),
        "flange slenderness b_f/2t_f",
        ref="AISC 360-16 Table B4.1b case 10",
    )
    lpf, lrf = flange_limits(c, E, Fy)
    return lam, lpf, lrf


def least_of(c: Recorder, limits: list[Any], ref: str) -> Any:
    """M_n, the least of the limit states' strengths (kip·ft), with the chapter's clause."""
    return c.derive(
        "M_n",
        c.min(*limits) if len(limits) > 1 else limits[0],
        "nominal flexural strength, least",
        unit="kip*ft",
        ref=ref,
    )


class F9Buckling(NamedTuple):
    """The handles of Eq. (F9-10): what it was given and M_cr."""

    Lb: Any
    d: Any
    Iy: Any
    J: Any
    Mcr: Any


def f9_mcr(c: Recorder, m: SteelMember, E: Any, *, compressed: bool, part: str) -> F9Buckling:
    """L_b and M_cr of a tee or double angle by Eq. (F9-10), with B of Eq. (F9-11) when the
    stem (web legs) is in tension and −2.3(d/L_b)√(I_y/J) of §F9.2(b)/(c) when in compression.

    Args:
        compressed: the stem's tip (the web legs' toes) is in compression somewhere along L_b.
        part: ``"stem"`` (a tee) or ``"web legs"`` (a double angle).
    """
    s = m.shape
    tee = part == "stem"
    Lb = c.given("L_b", m.Lb, "unbraced length", source="given", unit="ft")
    depth = "depth of the tee" if tee else "width of the web legs"
    d = c.given("d", s["d"], depth, source=s.source)
    Iy = c.given("I_y", s["Iy"], "moment of inertia about y", source=s.source)
    J = c.given("J", s["J"], "torsional constant", source=s.source)
    if compressed:
        B = c.derive(
            "B",
            -2.3 * (d / Lb) * c.sqrt(Iy / J),
            f"{part} in compression",
            ref="AISC 360-16 §F9.2(b)" if tee else "AISC 360-16 §F9.2(c)",
        )
    else:
        B = c.derive(
            "B",
            2.3 * (d / Lb) * c.sqrt(Iy / J),
            f"{part} in tension",
            ref="AISC 360-16 Eq. (F9-11)",
        )
    Mcr = c.derive(
        "M_cr",
        1.95 * E / Lb * c.sqrt(Iy * J) * (B + c.sqrt(1 + B**2)),
        "elastic lateral-torsional buckling moment",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F9-10)",
    )
    return F9Buckling(Lb, d, Iy, J, Mcr)


def angle_ltb_f10(c: Recorder, My: Any, Mcr: Any, what: str, ref: str) -> Any:
    """M_n by lateral-torsional buckling of an angle from M_y and M_cr: Eq. (F10-2) when
    M_y/M_cr ≤ 1, else Eq. (F10-3); ``ref`` leads the clause (``"AISC 360-16"``)."""
    if c.q(My) <= c.q(Mcr):
        return c.derive(
            "M_n_LTB",
            c.min((1.92 - 1.17 * c.sqrt(My / Mcr)) * My, 1.5 * My),
            what,
            unit="kip*ft",
            ref=f"{ref} Eq. (F10-2)",
        )
    return c.derive(
        "M_n_LTB",
        (0.92 - 0.17 * Mcr / My) * Mcr,
        what,
        unit="kip*ft",
        ref=f"{ref} Eq. (F10-3)",
    )


def leg_local_f10(
    c: Recorder,
    Fy: Any,
    E: Any,
    Sc: Any,
    b: Any,
    t: Any,
    root: float,
    *,
    name: str,
    what: str,
) -> Any:
    """§F10.3 leg local buckling (kip·ft) of the leg of width ``b`` and thickness ``t`` with
    ``Sc`` the elastic section modulus to its compressed toe, or None for a compact leg.

    Args:
        root: √(E/F_y). name: the slenderness's symbol. what: the leg, in words
            (``"leg"``, ``"flange legs"``).
    """
    lam = c.derive(name, b / t, f"{what} slenderness b/t", ref="AISC 360-16 §F10.3")
    x = c.f(lam)
    if x <= 0.54 * root:
        c.text(f"Compact {what} (b/t ≤ 0.54√(E/F_y)): leg local buckling does not apply (§F10.3).")
        return None
    if x <= 0.91 * root:
        return c.derive(
            "M_n_LLB",
            Fy * Sc * (2.43 - 1.72 * lam * c.sqrt(Fy / E)),
            f"local buckling of the {what}, noncompact",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F10-6)",
        )
    Fcr = c.derive(
        "F_cr", 0.71 * E / lam**2, "critical stress", unit="ksi", ref="AISC 360-16 Eq. (F10-8)"
    )
    return c.derive(
        "M_n_LLB",
        Fcr * Sc,
        f"local buckling of the {what}, slender",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F10-7)",
    )
