"""AISC 360-16 §F2.2: the lateral-torsional buckling strength of a doubly symmetric I-shape or
channel in its three zones of unbraced length, written once for the beam and member checks.

Provisions must be confirmed against the edition adopted locally.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.aisc360.flexure_clauses import transition
from calcpack.checks.base import Recorder

__all__ = ["limiting_lengths_f2", "ltb_strength_f2"]


def limiting_lengths_f2(
    c: Recorder, *, ry: Any, rts: Any, E: Any, Fy: Any, jc: Any
) -> tuple[Any, Any]:
    """L_p by Eq. (F2-5) and L_r by Eq. (F2-6) (ft).

    Args:
        ry: the radius of gyration about y. rts: the effective radius of gyration. E, Fy: the
            steel. jc: J·c/(S_x·h_o).
    """
    Lp = c.derive(
        "L_p",
        1.76 * ry * c.sqrt(E / Fy),
        "limiting unbraced length, yielding",
        unit="ft",
        ref="AISC 360-16 Eq. (F2-5)",
    )
    Lr = c.derive(
        "L_r",
        1.95 * rts * E / (0.7 * Fy) * c.sqrt(jc + c.sqrt(jc**2 + 6.76 * (0.7 * Fy / E) ** 2)),
        "limiting unbraced length, inelastic LTB",
        unit="ft",
        ref="AISC 360-16 Eq. (F2-6)",
    )
    return Lp, Lr


def ltb_strength_f2(
    c: Recorder,
    *,
    Lb: Any,
    Lp: Any,
    Lr: Any,
    Cb: Any,
    Mp: Any,
    Fy: Any,
    E: Any,
    Sx: Any,
    rts: Any,
    jc: Any,
) -> Any | None:
    """M_n by lateral-torsional buckling (kip·ft), or None when L_b <= L_p (§F2.2(a): it
    does not apply; the sheet says so).

    Args:
        Lb, Lp, Lr: unbraced and limiting lengths. Cb: the modification factor. Mp: the
            plastic moment. Fy, E: the steel. Sx: the elastic modulus. rts: the effective
            radius of gyration. jc: J·c/(S_x·h_o) of Eq. (F2-4).
    """
    if c.q(Lb) <= c.q(Lp):
        c.text("$L_b \\le L_p$: lateral-torsional buckling does not apply (§F2.2(a)).")
        return None
    if c.q(Lb) <= c.q(Lr):
        return c.derive(
            "M_n_LTB",
            Cb * transition(Mp, 0.7 * Fy * Sx, Lb, Lp, Lr),
            "inelastic lateral-torsional buckling",
            unit="kip*ft",
            ref="AISC 360-16 Eq. (F2-2)",
        )
    Fcr = c.derive(
        "F_cr",
        Cb * c.pi**2 * E / (Lb / rts) ** 2 * c.sqrt(1 + 0.078 * jc * (Lb / rts) ** 2),
        "critical stress, elastic LTB",
        unit="ksi",
        ref="AISC 360-16 Eq. (F2-4)",
    )
    return c.derive(
        "M_n_LTB",
        Fcr * Sx,
        "elastic lateral-torsional buckling",
        unit="kip*ft",
        ref="AISC 360-16 Eq. (F2-3)",
    )
