"""NDS 2018 (ASD) withdrawal (§12.2), combined lateral and withdrawal loads (§12.4) and the
row and group tear-out of bolted and lag-screwed connections (Appendix E).

* :func:`check_nds_withdrawal`: reference withdrawal value per inch of thread penetration,
  W = 1 800 G^1.5 D^0.75 (lag screws, Eq. 12.2-1), 2 850 G² D (wood screws, Eq. 12.2-2),
  1 380 G^2.5 D (smooth-shank nails, Eq. 12.2-3), in lb/in. with D in inches, adjusted by C_D,
  C_M, C_t, C_eg (0.75, lag screws in end grain) and C_tn (0.67, toe-nails). Bolts have no
  withdrawal value; wood screws and nails are not permitted in withdrawal from end grain.
* :func:`check_nds_combined`: the lateral and withdrawal values combined at the angle α
  between the wood surface and the load, Z'_α = W'p Z' / (W'p cos²α + Z' sin²α) for lag and
  wood screws (Eq. 12.4-1) and W'p Z' / (W'p cos α + Z' sin α) for nails (Eq. 12.4-2).
* :func:`check_nds_tearout`: Z'_RTi = n_i F'_v t s_crit for each row and the group tear-out
  Z'_GT = Z'_RT1/2 + Z'_RTn/2 + F'_t A_group-net (Appendix E, Eqs. E.4-1 to E.4-3).

The equations of §12.2 are written for inches and pounds; the coefficients carry the units
that make them so. α and θ are angles (0° to 90°).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.connection import ConnectionService, FastenerLayout, connection_factor
from calcpack.checks.nds.dowel import Fastener, WoodMember
from calcpack.checks.nds.factors import _TITLE, DURATION_FACTORS, NDS_EDITION
from calcpack.checks.nds.values import TimberValues
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import positive, required, within

__all__ = ["check_nds_combined", "check_nds_tearout", "check_nds_withdrawal", "withdrawal_value"]

_STD = Standard(NDS_EDITION, _TITLE, "ASD")
# §12.2 coefficients (lb/in. with D in inches), from memory: confirm against the edition adopted
_W = {
    "lag screw": (1800.0, 1.5, 0.75, "lbf*inch**-1.75", "NDS 2018 Eq. (12.2-1)"),
    "wood screw": (2850.0, 2.0, 1.0, "lbf*inch**-2", "NDS 2018 Eq. (12.2-2)"),
    "nail": (1380.0, 2.5, 1.0, "lbf*inch**-2", "NDS 2018 Eq. (12.2-3)"),
}


def _refuse_kind(f: Fastener, member: WoodMember) -> None:
    if f.kind not in _W:
        raise OutOfScopeError(
            f"A {f.kind} has no withdrawal design value in NDS 2018 §12.2: carry tension by the "
            "bolt in tension and the washer bearing on the wood (§3.10), not by withdrawal"
        )
    if member.end_grain and f.kind != "lag screw":
        raise OutOfScopeError(
            f"{f.kind.capitalize()}s loaded in withdrawal from end grain are not permitted "
            "(NDS 2018 §12.2.2 and §12.2.3): turn the fastener into side grain"
        )


def _w_logic(c: Recorder, f: Fastener, member: WoodMember) -> Any:
    k, gexp, dexp, unit, ref = _W[f.kind]
    G_val, G_src = member.gravity
    G = c.given("G", G_val, f"specific gravity, {member.label}", source=G_src)
    D = c.given("D", f.D, "fastener diameter", source=f.source, unit="inch")
    return c.derive(
        "W", G**gexp * Q_(k, unit) * D**dexp, f"reference withdrawal value, {f.kind}",
        unit="lbf/inch", ref=ref,
    )  # fmt: skip


def withdrawal_value(fastener: Fastener, member: WoodMember) -> Quantity:
    """The reference withdrawal value W per unit thread penetration (NDS 2018 §12.2.1-§12.2.3).

    Raises:
        OutOfScopeError: a bolt, or a wood screw or nail in end grain.
    """
    _refuse_kind(fastener, member)
    rec = Recorder("W")
    _w_logic(rec, fastener, member)
    return rec.values["W"]


@dataclass(frozen=True)
class _Wd:
    value: Any
    per_fastener: Any


def _withdrawal_adjusted(
    c: Recorder, f: Fastener, member: WoodMember, p: Quantity, sv: ConnectionService
) -> _Wd:
    W = _w_logic(c, f, member)
    CD = c.given("C_D", DURATION_FACTORS[sv.duration], sv.duration, source="NDS 2018 Table 2.3.2")
    fab = "any" if sv.service == "wet" else sv.fabrication
    cm, _, src = connection_factor(f"CM|withdrawal|{f.kind}|{fab}|{sv.service}")
    CM = c.given("C_M", cm, f"{sv.fabrication} fabrication, {sv.service} service",
                 source=f"Table 11.3.3, {src}")  # fmt: skip
    ct, _, src = connection_factor(sv.temperature_key())
    Ct = c.given("C_t", ct, f"T = {sv.temperature:~P}", source=f"Table 11.3.4, {src}")
    Ceg = c.given("C_eg", 0.75 if member.end_grain else 1.0, "end grain (lag screws)",
                  source="NDS 2018 §12.2.1.4")  # fmt: skip
    Ctn = c.given("C_tn", 0.67 if sv.toenail else 1.0, "toe-nail", source="NDS 2018 §12.5.4")
    Wp = c.derive("W_adj", W * CD * CM * Ct * Ceg * Ctn, "adjusted W'", unit="lbf/inch",
                  ref="NDS 2018 Table 11.3.1")  # fmt: skip
    pt = c.given("p_t", p, "thread penetration in the member holding the point", unit="inch")
    return _Wd(Wp, c.derive("W_adj_p", Wp * pt, "W'p per fastener", unit="lbf",
                            ref="NDS 2018 §12.2"))  # fmt: skip


def check_nds_withdrawal(
    fastener: Fastener,
    member: WoodMember,
    *,
    P: Quantity,
    penetration: Quantity,
    n: int = 1,
    service: ConnectionService | None = None,
    mark: str = "W1",
    combination: str | None = None,
) -> MemberChecks:
    """Withdrawal capacity of n fasteners against the tension P (NDS 2018 §12.2).

    Args:
        penetration: length of thread in the member holding the point (lag screws: threaded
            length less the tapered tip). P: tension on the group (ASD).

    Raises:
        OutOfScopeError: bolts; wood screws or nails in end grain.
    """
    require(P, "[force]", "P", positive=True)
    require(penetration, "[length]", "penetration", positive=True)
    positive("n", n)
    _refuse_kind(fastener, member)
    sv = service or ConnectionService()
    if sv.toenail and fastener.kind != "nail":
        raise InputError(
            f"C_tn applies to nails (got a {fastener.kind} with toenail=True)",
            name="service.toenail",
            value=True,
            expected="False",
        )

    def logic(c: Recorder) -> None:
        c.heading("Withdrawal (NDS 2018 §12.2)", 3)
        w = _withdrawal_adjusted(c, fastener, member, penetration, sv)
        nn = c.given("n", float(n), "number of fasteners", source="given")
        cap = c.derive("W_group", nn * w.per_fastener, "group withdrawal capacity", unit="lbf",
                       ref="NDS 2018 §12.2")  # fmt: skip
        Pd = c.given("P", P, "withdrawal load", source=combination or "given", unit="lbf")
        c.check("Withdrawal", Pd, cap, ref="NDS 2018 §12.2", combination=combination)

    return run_checks(mark, f"{n} × {fastener.designation} in withdrawal", _STD, logic)


def check_nds_combined(
    fastener: Fastener,
    member: WoodMember,
    *,
    Z_adj: Quantity,
    penetration: Quantity,
    P: Quantity,
    alpha: Quantity,
    n: int = 1,
    service: ConnectionService | None = None,
    mark: str = "CW1",
    combination: str | None = None,
) -> MemberChecks:
    """A load P at angle α to the wood surface on n screws or nails (NDS 2018 §12.4).

    Args:
        Z_adj: the adjusted lateral value Z' of one fastener (from
            :func:`~calcpack.checks.nds.connection.check_nds_connection`, ``values["Z_adj"]``).
        alpha: angle between the wood surface and the load (0°: lateral, 90°: withdrawal).
    """
    require(Z_adj, "[force]", "Z_adj", positive=True)
    require(P, "[force]", "P", positive=True)
    require(alpha, "[]", "alpha")
    within("alpha", alpha.to("degree"), Q_(0, "degree"), Q_(90, "degree"),
           rule="α is measured from the wood surface, 0° to 90°")  # fmt: skip
    positive("n", n)
    _refuse_kind(fastener, member)
    sv = service or ConnectionService()
    a = float(alpha.to("radian").magnitude)
    nail = fastener.kind == "nail"

    def logic(c: Recorder) -> None:
        c.heading("Combined lateral and withdrawal load (NDS 2018 §12.4)", 3)
        w = _withdrawal_adjusted(c, fastener, member, penetration, sv)
        Zp = c.given("Z_adj", Z_adj, "adjusted lateral value Z' per fastener", unit="lbf")
        if nail:
            ca = c.given("cos_a", round(math.cos(a), 12), f"cos α, α = {alpha:~P}", source="given")
            sa = c.given("sin_a", round(math.sin(a), 12), "sin α", source="given")
            ref = "NDS 2018 Eq. (12.4-2)"
        else:
            ca = c.given(
                "cos_a", round(math.cos(a), 12) ** 2, f"cos²α, α = {alpha:~P}", source="given"
            )
            sa = c.given("sin_a", round(math.sin(a), 12) ** 2, "sin²α", source="given")
            ref = "NDS 2018 Eq. (12.4-1)"
        Za = c.derive("Z_alpha", w.per_fastener * Zp / (w.per_fastener * ca + Zp * sa),
                      "capacity at α per fastener", unit="lbf", ref=ref)  # fmt: skip
        nn = c.given("n", float(n), "number of fasteners", source="given")
        cap = c.derive("Z_alpha_group", nn * Za, "group capacity", unit="lbf", ref=ref)
        Pd = c.given("P", P, f"load at α = {alpha:~P}", source=combination or "given", unit="lbf")
        c.check("Combined lateral and withdrawal", Pd, cap, ref=ref, combination=combination)

    return run_checks(mark, f"{n} × {fastener.designation}, load at an angle", _STD, logic)


def check_nds_tearout(
    values: TimberValues,
    *,
    t: Quantity,
    D: Quantity,
    layout: FastenerLayout,
    P: Quantity,
    service: ConnectionService | None = None,
    CF_t: float = 1.0,
    hole: Quantity | None = None,
    mark: str = "TO1",
    combination: str | None = None,
) -> MemberChecks:
    """Row and group tear-out of a wood member loaded parallel to grain toward its end
    (NDS 2018 Appendix E).

    Args:
        values: reference design values of the member (F_v, F_t). t: member thickness.
        D: fastener diameter. layout: rows, fasteners per row, spacing, end distance.
        CF_t: size factor for F_t. hole: hole diameter (None: D + 1/16 in., §12.1.3.2).
    """
    for nm, q in (("t", t), ("D", D)):
        require(q, "[length]", nm, positive=True)
    require(P, "[force]", "P", positive=True)
    end = required(
        "layout.end", layout.end, expected="the end distance of the fasteners", when="for tear-out"
    )
    sv = service or ConnectionService()
    dh = hole if hole is not None else D + Q_(1 / 16, "inch")
    require(dh, "[length]", "hole", positive=True)
    s_crit_q = end if layout.per_row == 1 else min(end, layout.spacing or end)

    def logic(c: Recorder) -> None:
        c.heading("Row and group tear-out (NDS 2018 Appendix E)", 3)
        c.assume("Load parallel to grain toward the member end; the rows share it equally.")
        CD = c.given("C_D", DURATION_FACTORS[sv.duration], sv.duration,
                     source="NDS 2018 Table 2.3.2")  # fmt: skip
        ct, _, src = connection_factor(sv.temperature_key())
        Ct = c.given("C_t", ct, f"T = {sv.temperature:~P}", source=f"Table 11.3.4, {src}")
        wet = sv.service == "wet"
        Fv = c.given("F_v", values.Fv, "reference shear", source=values.source)
        CMv = c.given("C_M_v", 0.97 if wet else 1.0, "wet service, F_v",
                      source="NDS Supplement Table 4A")  # fmt: skip
        Fvp = c.derive("F_v_adj", Fv * CD * CMv * Ct, "F'_v", unit="psi",
                       ref="NDS 2018 Table 4.3.1")  # fmt: skip
        tt = c.given("t", t, "member thickness", source="given", unit="inch")
        sc = c.given("s_crit", s_crit_q, "least of end distance and spacing in the row",
                     source="given", unit="inch")  # fmt: skip
        ni = c.given("n_i", float(layout.per_row), "fasteners in a row", source="given")
        Zrt = c.derive("Z_RTi", ni * Fvp * tt * sc, "row tear-out, one row", unit="lbf",
                       ref="NDS 2018 Eq. (E.4-1)")  # fmt: skip
        nr = c.given("n_row", float(layout.rows), "number of rows", source="given")
        Zrow = c.derive("Z_RT", nr * Zrt, "row tear-out, all rows", unit="lbf",
                        ref="NDS 2018 Eq. (E.4-2)")  # fmt: skip
        Pd = c.given("P", P, "load on the group", source=combination or "given", unit="lbf")
        c.check("Row tear-out", Pd, Zrow, ref="NDS 2018 Appendix E", combination=combination)
        if layout.rows < 2:
            return
        assert layout.row_spacing is not None
        Ft = c.given("F_t", values.Ft, "reference tension", source=values.source)
        CF = c.given("C_F_t", float(CF_t), "size factor, F_t", source="given")
        Ftp = c.derive("F_t_adj", Ft * CD * Ct * CF, "F'_t (C_M = 1.0 for F_t)", unit="psi",
                       ref="NDS 2018 Table 4.3.1")  # fmt: skip
        sr = c.given("s_row", layout.row_spacing, "spacing between rows", unit="inch")
        dh_ = c.given("D_h", dh, "hole diameter", source="NDS 2018 §12.1.3.2", unit="inch")
        An = c.derive("A_group_net", (nr - 1) * (sr - dh_) * tt, "net area between outer rows",
                      unit="inch**2", ref="NDS 2018 Appendix E")  # fmt: skip
        Zgt = c.derive("Z_GT", Zrt / 2 + Zrt / 2 + Ftp * An, "group tear-out", unit="lbf",
                       ref="NDS 2018 Eq. (E.4-3)")  # fmt: skip
        c.check("Group tear-out", Pd, Zgt, ref="NDS 2018 Appendix E", combination=combination)

    return run_checks(mark, f"Tear-out, {values.name}", _STD, logic)
