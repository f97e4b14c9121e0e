"""NDS 2018 (ASD) bending and shear of a structural glued laminated timber beam from combined
beam results: every allowable-stress combination screened, the governing ones worked in full.

* bending §3.3 and §5.3: F'_b = F_bx+ C_D C_M C_t (C_L or C_V, the lesser: §5.3.6), with the
  volume factor C_V = (21/L)^(1/10) (12/d)^(1/10) (5.125/b)^(1/10) ≤ 1 (Eq. 5.3-1, x = 10 for
  species other than Southern Pine) through :func:`calcpack.checks.nds.members` bending;
* shear §3.4: f_v = 3V/(2bd) ≤ F'_v = F_vx C_D C_M C_t C_vr with C_vr = 1.0 (prismatic member
  without notches, connections near the ends or cyclic loading, §5.3.10 — stated on the sheet).

C_D is that of the shortest-duration load in each combination (NDS 2018 §2.3.2, Table 2.3.2).
Assumed and stated: dry service (C_M = 1.0), sustained temperature ≤ 100 °F (C_t = 1.0), bending
about the x-x axis (loads perpendicular to the wide faces of the laminations), tension
laminations on the tension side (F_bx+). Negative bending over a support is refused: it needs
F_bx− of Table 5A, which the shipped table does not carry.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import replace
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.beam import demand_items
from calcpack.checks.nds.factors import _TITLE, DEFAULT_DURATIONS, NDS_EDITION
from calcpack.checks.nds.members import TimberMember, _bending
from calcpack.errors import OutOfScopeError
from calcpack.units import Q_

__all__ = ["check_nds_glulam_beam"]


def _items(member: TimberMember, demand: Any, durations: Mapping[str, str]) -> list[dict[str, Any]]:
    items = demand_items(demand, durations)
    for it in items:
        M, xM = it["M"], it["xM"]
        if float(it["result"].moment(xM).to("lbf*ft").magnitude) < -1e-9 * max(
            1.0, float(M.magnitude)
        ):
            raise OutOfScopeError(
                f"Glulam beam {member.values.name}: the largest moment of combination "
                f"{it['combination']!r} is negative (hogging, {M:~.4g} at x = "
                f"{xM.to('ft'):~.4g}); it needs F_bx- of NDS Supplement 2018 Table 5A, which is "
                "not covered"
            )
    return items


def check_nds_glulam_beam(
    member: TimberMember,
    *,
    demand: Any,
    durations: Mapping[str, str] | None = None,
    mark: str = "GL1",
) -> MemberChecks:
    """Check a glulam beam in bending and shear to NDS 2018 (ASD) for every combination.

    Args:
        member: a :class:`TimberMember` with glulam values (:func:`nds_glulam_values`, x-x
            bending), breadth ``b`` and depth ``d``; ``lu`` and ``loading`` for C_L (None:
            compression edge braced); ``L_beam`` the length between points of zero moment for
            C_V (None: the beam's whole length, which gives the smaller C_V — conservative).
        demand: ASD combined results (``analyse_combinations``), a mapping of combination ->
            beam result, or one result; each result's load-case factors (``cases``) set C_D;
            or a :class:`calcpack.checks.nds.beam.PreparedTimberDemand` read from them.
        durations: load case -> Table 2.3.2 duration (defaults for D, L, Lr, S, R, W, Eh, Ev).

    Raises:
        OutOfScopeError: not glulam, wet service, hogging moment (F_bx−), R_B > 50.
        InputError: a load case without a duration; combinations of another kind.
    """
    v = member.values
    if v.product != "glulam":
        raise OutOfScopeError(
            f"check_nds_glulam_beam takes glulam values (nds_glulam_values), not {v.product} "
            f"({v.name}); use check_nds_beam for sawn lumber"
        )
    durs = {**DEFAULT_DURATIONS, **dict(durations or {})}
    items = _items(member, demand, durs)
    m = member if member.L_beam is not None else replace(member, L_beam=items[0]["L"])

    def logic(c: Recorder) -> None:
        c.assume(
            "Dry service (C_M = 1.0), sustained temperature ≤ 100 °F (C_t = 1.0); x-x bending "
            "with the tension laminations on the tension side (F_bx+)."
        )
        if member.L_beam is None:
            c.assume(
                "C_V uses the whole beam length for L (the distance between points of zero "
                "moment is not longer): conservative."
            )
        u_b: list[float] = []
        u_v: list[float] = []
        A = m.b * m.d
        for it in items:
            n = Recorder(c.member)
            r = _bending(n, m, it["M"], Q_(it["CD"], ""), m.b, m.d, "d", "glulam", None)
            ub = float((r["fb"] / r["Fbp"]).to("").magnitude)
            uv = float((1.5 * it["V"] / A / (v.Fv * it["CD"])).to("").magnitude)
            u_b.append(ub)
            u_v.append(uv)
        # the first of the largest governs
        i_b = max(range(len(u_b)), key=u_b.__getitem__)
        i_v = max(range(len(u_v)), key=u_v.__getitem__)
        if len(items) > 1:
            c.table(
                ["Combination", "C_D", "M", "V"],
                [
                    [
                        it["combination"],
                        f"{it['CD']:g} ({it['CD_name']}, {it['CD_case']})",
                        it["M"],
                        it["V"],
                    ]
                    for it in items
                ],
                caption="Every ASD combination (C_D from the shortest-duration load, NDS 2018 "
                "§2.3.2); the governing ones are worked below",
            )
        it = items[i_b]
        c.heading(f"Bending, NDS 2018 §3.3 and §5.3.6 (governing: {it['combination']})", 3)
        CD = c.given(
            "C_D",
            it["CD"],
            f"load duration factor ({it['CD_name']}, case {it['CD_case']})",
            source="NDS 2018 Table 2.3.2",
        )
        L = c.given("L", m.L_beam, "length between points of zero moment, for C_V", unit="ft")
        del L
        b = c.given("b", m.b, "breadth", source="given", unit="inch")
        d = c.given("d", m.d, "depth", source="given", unit="inch")
        _bending(c, m, it["M"], CD, b, d, "d", "glulam", it["combination"])

        it = items[i_v]
        c.heading(f"Shear, NDS 2018 §3.4 (governing: {it['combination']})", 3)
        CDv = c.given(
            "C_D_v",
            it["CD"],
            f"load duration factor ({it['CD_name']}, case {it['CD_case']})",
            source="NDS 2018 Table 2.3.2",
        )
        Fv = c.given("F_vx", v.Fv, "reference shear design value", source=v.source, unit="psi")
        Cvr = c.given(
            "C_vr", 1.0, "shear reduction factor (prismatic, unnotched)", source="NDS 2018 §5.3.10"
        )
        Fvp = c.derive(
            "F_v_adj", Fv * CDv * Cvr, "F'_v = F_vx C_D C_M C_t C_vr", unit="psi",
            ref="NDS 2018 Table 5.3.1",
        )  # fmt: skip
        V = c.given("V", it["V"], "largest |V| of the combination", source=it["combination"],
                    unit="lbf")  # fmt: skip
        fv = c.derive(
            "f_v", 3 * V / (2 * b * d), "shear stress, rectangular section", unit="psi",
            ref="NDS 2018 Eq. (3.4-2)",
        )  # fmt: skip
        c.assume(
            "Shear is taken at the support face without the reduction of NDS 2018 §3.4.3.1 "
            "for loads within a depth d of the support (conservative)."
        )
        c.check("Shear", fv, Fvp, ref="NDS 2018 §3.4", combination=it["combination"])

    title = f"{v.name} {member.b:~P} × {member.d:~P} to {NDS_EDITION} (ASD), bending and shear"
    return run_checks(mark, title, Standard(NDS_EDITION, _TITLE, "ASD"), logic)
