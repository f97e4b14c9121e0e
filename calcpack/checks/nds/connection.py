"""NDS 2018 (ASD) lateral design of a dowel-type fastener connection: the yield limit value Z
(:mod:`calcpack.checks.nds.dowel`) adjusted by Table 11.3.1 and checked against the load, with
the fastener layout checked against Tables 12.5.1A-D.

    Z' = Z · C_D · C_M · C_t · C_g · C_Δ · C_eg · C_di · C_tn      (one fastener)
    Z'_group = n · Z'

* C_D: load duration (Table 2.3.2; the impact factor does not apply to connections, §11.3.2);
* C_M, C_t: wet service and temperature for connections (Tables 11.3.3, 11.3.4);
* C_g: group action of a row of bolts or lag screws, D ≥ 1/4 in. (§11.3.6, Eq. 11.3-1), with
  the load-slip modulus γ = 180 000 D^1.5 (wood to wood) or 270 000 D^1.5 (wood to steel);
* C_Δ: geometry (§12.5.1): the least ratio of the end distance and spacing provided to those
  for C_Δ = 1.0, when at least the minimum; below the minimum the layout check fails;
* C_eg = 0.67 into end grain (§12.5.2), C_di = 1.1 for nailed diaphragms (§12.5.3),
  C_tn = 0.83 for toe-nails (§12.5.4).

For D < 1/4 in. the NDS sets no spacing table (§12.5.1 applies to D ≥ 1/4 in.): distances must
prevent splitting, which the sheet states as an assumption. Units: pint quantities; the load
angle to grain is set on each wood member (0° parallel, 90° perpendicular).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.dowel import _SMALL, DowelJoint, SteelPlate, WoodMember, yield_logic
from calcpack.checks.nds.factors import _TITLE, DURATION_FACTORS, NDS_EDITION
from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of, positive, positive_fields, required, whole

__all__ = [
    "ConnectionService",
    "FastenerLayout",
    "GroupStiffness",
    "check_nds_connection",
    "connection_factor",
    "group_action_factor",
]

Moisture = Literal["dry", "wet"]
EndLoading = Literal["tension", "compression"]
_FACTORS = "nds_2018_connection_factors.csv"


def connection_factor(key: str) -> tuple[float, float | None, str]:
    """(value, full value or None, source) of a row of ``nds_2018_connection_factors.csv``."""
    t = read_table(_FACTORS, key="key")
    row = t.row(key, what="NDS 2018 connection factor")
    full = row["full"]
    return (
        float(row["value"]),
        (None if full is None else float(full)),
        f"NDS 2018 ({row['basis']})",
    )


@dataclass(frozen=True)
class ConnectionService:
    """Service conditions of a connection.

    Args:
        duration: load duration of Table 2.3.2 ("permanent", "ten years", "two months",
            "seven days", "ten minutes"; "impact" is refused, §11.3.2).
        service: moisture content in service, "dry" (≤ 19 %) or "wet".
        fabrication: moisture content when the connection is made, "dry" or "wet".
        temperature: sustained service temperature (≤ 150 °F).
        diaphragm: nails in a diaphragm (C_di = 1.1). toenail: toe-nailed (C_tn = 0.83).
    """

    duration: str = "ten years"
    service: Moisture = "dry"
    fabrication: Moisture = "dry"
    temperature: Quantity = field(default_factory=lambda: Q_(70.0, "degF"))
    diaphragm: bool = False
    toenail: bool = False

    def __post_init__(self) -> None:
        one_of("duration", self.duration, [k for k in DURATION_FACTORS if k != "impact"])
        one_of("service", self.service, ("dry", "wet"))
        one_of("fabrication", self.fabrication, ("dry", "wet"))
        require(self.temperature, "[temperature]", "temperature")
        if self.temperature.to("degF").magnitude > 150.0:
            raise OutOfScopeError(
                f"Service temperature {self.temperature.to('degF'):~P} is above 150 °F: NDS 2018 "
                "Table 11.3.4 gives no C_t for it (see NDS Appendix C)"
            )

    def temperature_key(self) -> str:
        t = float(self.temperature.to("degF").magnitude)
        band = "100" if t <= 100.0 else "125" if t <= 125.0 else "150"
        return f"Ct|{self.service}|{band}"


@dataclass(frozen=True)
class FastenerLayout:
    """Where the fasteners are: rows parallel to the load, the distances in one wood member.

    Args:
        rows: number of rows (a row is a line of fasteners parallel to the load).
        per_row: fasteners in each row.
        spacing: centre-to-centre spacing in a row (None with one per row).
        row_spacing: spacing between rows (None with one row).
        end: end distance (centre to the end of the member, along the grain).
        edge: the least edge distance. loaded_edge: distance to the edge toward which the
            load acts (perpendicular loading; None: the same as ``edge``).
        end_loading: the member is loaded toward its end ("tension") or away from it
            ("compression"), for loading parallel to grain.
        hardwood: the member is a hardwood species (end distances of Table 12.5.1A).
    """

    rows: int = 1
    per_row: int = 1
    spacing: Quantity | None = None
    row_spacing: Quantity | None = None
    end: Quantity | None = None
    edge: Quantity | None = None
    loaded_edge: Quantity | None = None
    end_loading: EndLoading = "tension"
    hardwood: bool = False

    def __post_init__(self) -> None:
        for nm in ("rows", "per_row"):
            whole(nm, getattr(self, nm), lo=1)
        positive_fields(
            self,
            "[length]",
            ("spacing", "row_spacing", "end", "edge", "loaded_edge"),
            optional=True,
        )
        if self.per_row > 1:
            required(
                "spacing",
                self.spacing,
                expected="the spacing in a row",
                when=f"with {self.per_row} fasteners in a row",
            )
        if self.rows > 1:
            required(
                "row_spacing",
                self.row_spacing,
                expected="the spacing between rows",
                when=f"with {self.rows} rows",
            )
        one_of("end_loading", self.end_loading, ("tension", "compression"))

    @property
    def count(self) -> int:
        return self.rows * self.per_row


@dataclass(frozen=True)
class GroupStiffness:
    """Gross areas and moduli of the main and side members for the group action factor.

    Args:
        Am, As: gross cross-section areas of the main member and of the side members (all
            side members together); for perpendicular loading, thickness times the overall
            width of the fastener group (§11.3.6). Em, Es: moduli of elasticity.
    """

    Am: Quantity
    As: Quantity
    Em: Quantity
    Es: Quantity

    def __post_init__(self) -> None:
        positive_fields(self, "[area]", ("Am", "As"))
        positive_fields(self, "[pressure]", ("Em", "Es"))


def group_action_factor(
    *, n: int, s: Quantity, D: Quantity, stiffness: GroupStiffness, steel_side: bool = False
) -> float:
    """C_g of one row of n bolts or lag screws (NDS 2018 Eq. 11.3-1), as a number.

    Args:
        n: fasteners in the row. s: spacing in the row. D: diameter. steel_side: wood-to-metal
            (γ = 270 000 D^1.5 lb/in.) rather than wood-to-wood (180 000 D^1.5 lb/in.).
    """
    positive("n", n)
    if n == 1:
        return 1.0
    d_in = float(D.to("inch").magnitude)
    gamma = (270000.0 if steel_side else 180000.0) * d_in**1.5  # lb/in., §11.3.6
    ea_m = float((stiffness.Em * stiffness.Am).to("lbf").magnitude)
    ea_s = float((stiffness.Es * stiffness.As).to("lbf").magnitude)
    s_in = float(s.to("inch").magnitude)
    u = 1.0 + gamma * s_in / 2.0 * (1.0 / ea_m + 1.0 / ea_s)
    m = u - (u * u - 1.0) ** 0.5
    rea = min(ea_s / ea_m, ea_m / ea_s)
    num = m * (1.0 - m ** (2 * n))
    den = n * ((1.0 + rea * m**n) * (1.0 + m) - 1.0 + m ** (2 * n))
    return float(num / den * (1.0 + rea) / (1.0 - m))


def _layout_checks(
    c: Recorder, j: DowelJoint, lay: FastenerLayout, member: WoodMember, which: str
) -> Any:
    """End, spacing, edge and row checks of Tables 12.5.1A-D in ``member``; returns C_Δ."""
    D = j.fastener.D
    d_in = float(D.to("inch").magnitude)
    th = float(member.angle.to("degree").magnitude)
    dirs = (
        ["parallel"]
        if th == 0.0
        else ["perpendicular"]
        if th == 90.0
        else [
            "parallel",
            "perpendicular",
        ]
    )
    if len(dirs) == 2:
        c.assume(
            f"Load at {th:g}° to grain: the distances of both the parallel and the perpendicular "
            "loading cases are required (the larger governs) -- common practice."
        )
    # ℓ/D of Tables 12.5.1C-D: the lesser of ℓ_m/D and ℓ_s/D, of the wood members (a steel
    # plate does not split; taking only wood members is the larger, conservative requirement)
    woods = [float(j.main_bearing_length.to("inch").magnitude)] if isinstance(
        j.main, WoodMember) else []  # fmt: skip
    if isinstance(j.side, WoodMember):
        woods.append(float(j.side.thickness.to("inch").magnitude))
    l_over_d = min(woods) / d_in
    ratios: list[float] = []
    where = f"({which})"

    def need(name: str, req: Quantity, got: Quantity | None, ref: str) -> None:
        if got is None:
            c.not_covered(name, f"{name} not given; required at least {req:~.3gP}", ref=ref)
            return
        c.check(name, req.to("inch"), got.to("inch"), ref=ref)

    # end distance (Table 12.5.1A)
    ends = []
    for dn in dirs:
        if dn == "perpendicular":
            key = "end|perpendicular|any"
        elif lay.end_loading == "compression":
            key = "end|parallel compression|any"
        else:
            key = f"end|parallel tension|{'hardwood' if lay.hardwood else 'softwood'}"
        ends.append(connection_factor(key)[:2])
    emin, efull = max(e[0] for e in ends), max(e[1] or 0.0 for e in ends)
    need(f"End distance {where}", emin * D, lay.end, "NDS 2018 Table 12.5.1A")
    if lay.end is not None and lay.end >= emin * D:
        ratios.append(min(1.0, float((lay.end / (efull * D)).to("").magnitude)))
    # spacing in a row (Table 12.5.1B)
    if lay.per_row > 1:
        smin, sfull = connection_factor(f"spacing|{dirs[-1]}|any")[:2]
        assert sfull is not None
        need(f"Spacing in a row {where}", smin * D, lay.spacing, "NDS 2018 Table 12.5.1B")
        if lay.spacing is not None and lay.spacing >= smin * D:
            ratios.append(min(1.0, float((lay.spacing / (sfull * D)).to("").magnitude)))
    # edge distance (Table 12.5.1C)
    edge_req = 0.0
    if "parallel" in dirs:
        e = connection_factor("edge|parallel|short")[0]
        if l_over_d > 6.0 and lay.rows > 1 and lay.row_spacing is not None:
            e = max(e, 0.5 * float((lay.row_spacing / D).to("").magnitude))
        edge_req = max(edge_req, e)
    if "perpendicular" in dirs:
        edge_req = max(edge_req, connection_factor("edge|perpendicular|unloaded")[0])
        loaded = lay.loaded_edge if lay.loaded_edge is not None else lay.edge
        need(
            f"Loaded edge distance {where}",
            connection_factor("edge|perpendicular|loaded")[0] * D,
            loaded,
            "NDS 2018 Table 12.5.1C",
        )
    need(f"Edge distance {where}", edge_req * D, lay.edge, "NDS 2018 Table 12.5.1C")
    # spacing between rows (Table 12.5.1D)
    if lay.rows > 1:
        r = 0.0
        if "parallel" in dirs:
            r = connection_factor("rows|parallel|any")[0]
        if "perpendicular" in dirs:
            if l_over_d <= 2.0:
                r = max(r, connection_factor("rows|perpendicular|short")[0])
            elif l_over_d >= 6.0:
                r = max(r, connection_factor("rows|perpendicular|long")[0])
            else:
                r = max(r, (5.0 * l_over_d + 10.0) / 8.0)
        need(f"Spacing between rows {where}", r * D, lay.row_spacing, "NDS 2018 Table 12.5.1D")
        if "parallel" in dirs and lay.row_spacing is not None and lay.row_spacing > Q_(5, "inch"):
            c.caution(
                "Rows more than 5 in. apart parallel to grain: NDS 2018 Table 12.5.1D asks for "
                "separate splice plates (or the shrinkage of the member considered)."
            )
    return min(ratios) if ratios else 1.0


def check_nds_connection(
    joint: DowelJoint,
    *,
    P: Quantity,
    layout: FastenerLayout | None = None,
    service: ConnectionService | None = None,
    stiffness: GroupStiffness | None = None,
    mark: str = "C1",
    combination: str | None = None,
) -> MemberChecks:
    """Lateral capacity of a group of identical fasteners against the load P (NDS 2018 ASD).

    Args:
        joint: one fastener and its members. P: the lateral load on the whole group (ASD).
        layout: rows, spacing and distances in the main member (None: one fastener, distances
            not checked: reported NOT COVERED for D ≥ 1/4 in.).
        service: duration, moisture, temperature, diaphragm, toe-nail.
        stiffness: member areas and moduli for C_g (needed for more than one bolt or lag screw
            in a row).

    Raises:
        InputError: C_g needed but ``stiffness`` missing; C_di or C_tn for a fastener other
            than a nail.
    """
    require(P, "[force]", "P", positive=True)
    lay = layout or FastenerLayout()
    sv = service or ConnectionService()
    f = joint.fastener
    large = f.D >= _SMALL
    if (sv.diaphragm or sv.toenail) and f.kind != "nail":
        raise InputError(
            f"C_di and C_tn apply to nails (got a {f.kind} with diaphragm={sv.diaphragm}, "
            f"toenail={sv.toenail})",
            name="service",
            value=sv,
            expected="diaphragm=False and toenail=False",
        )
    if large and lay.per_row > 1:
        required(
            "stiffness",
            stiffness,
            expected="GroupStiffness(Am=..., As=..., Em=..., Es=...), the members' areas and "
            "moduli",
            when=f"for the group action factor C_g of {lay.per_row} fasteners of D = {f.D:~P} "
            "in a row (NDS 2018 §11.3.6)",
        )
    wet_key = _cm_key(joint, lay, sv)
    steel_side = isinstance(joint.side, SteelPlate) or isinstance(joint.main, SteelPlate)

    def logic(c: Recorder) -> None:
        c.assume(
            "Fasteners of one kind and size, loaded alike; the load is shared equally; "
            "wood members free of knots and checks at the fasteners."
        )
        Z = yield_logic(c, joint)
        c.heading("Adjustment factors (NDS 2018 Table 11.3.1)", 3)
        CD = c.given(
            "C_D", DURATION_FACTORS[sv.duration], sv.duration, source="NDS 2018 Table 2.3.2"
        )
        cm, _, cm_src = connection_factor(wet_key)
        CM = c.given("C_M", cm, f"{sv.fabrication} fabrication, {sv.service} service",
                     source=f"Table 11.3.3, {cm_src}")  # fmt: skip
        ct, _, ct_src = connection_factor(sv.temperature_key())
        Ct = c.given("C_t", ct, f"T = {sv.temperature:~P}", source=f"Table 11.3.4, {ct_src}")
        if large and lay.per_row > 1:
            assert stiffness is not None
            assert lay.spacing is not None
            cg = group_action_factor(
                n=lay.per_row, s=lay.spacing, D=f.D, stiffness=stiffness, steel_side=steel_side
            )
            Cg = c.given(
                "C_g", cg, f"{lay.per_row} in a row, s = {lay.spacing:~P}",
                source="NDS 2018 Eq. (11.3-1)",
            )  # fmt: skip
        else:
            Cg = c.given("C_g", 1.0, "one fastener per row, or D < 1/4 in.",
                         source="NDS 2018 §11.3.6")  # fmt: skip
        if large:
            c.heading("Fastener layout (NDS 2018 §12.5.1)", 3)
            cdelta = 1.0
            woods = [(nm, m) for nm, m in (("main", joint.main), ("side", joint.side))
                     if isinstance(m, WoodMember)]  # fmt: skip
            if len(woods) == 2 and woods[0][1].angle == woods[1][1].angle:
                woods = [("main and side", woods[0][1])]
            for nm, m in woods:
                if layout is None:
                    c.not_covered(
                        f"Layout ({nm} member)",
                        "no layout given: end, edge and spacing distances not checked",
                        ref="NDS 2018 §12.5.1",
                    )
                else:
                    cdelta = min(
                        cdelta,
                        _layout_checks(
                            c, joint, lay, m, f"{nm} member" + ("s" if " and " in nm else "")
                        ),
                    )
            CDelta = c.given("C_Delta", cdelta, "least ratio provided / full",
                             source="NDS 2018 §12.5.1")  # fmt: skip
        else:
            c.assume(
                "D < 1/4 in.: end, edge and spacing distances are to prevent splitting "
                "(NDS 2018 §12.5.2); C_Δ = 1.0."
            )
            CDelta = c.given("C_Delta", 1.0, "D < 1/4 in.", source="NDS 2018 §12.5.1")
        eg = isinstance(joint.main, WoodMember) and joint.main.end_grain
        Ceg = c.given("C_eg", 0.67 if eg else 1.0, "end grain" if eg else "side grain",
                      source="NDS 2018 §12.5.2")  # fmt: skip
        Cdi = c.given("C_di", 1.1 if sv.diaphragm else 1.0, "diaphragm nailing",
                      source="NDS 2018 §12.5.3")  # fmt: skip
        Ctn = c.given("C_tn", 0.83 if sv.toenail else 1.0, "toe-nail",
                      source="NDS 2018 §12.5.4")  # fmt: skip
        Zp = c.derive(
            "Z_adj", Z * CD * CM * Ct * Cg * CDelta * Ceg * Cdi * Ctn, "adjusted Z' per fastener",
            unit="lbf", ref="NDS 2018 Table 11.3.1",
        )  # fmt: skip
        n = c.given("n", float(lay.count), "number of fasteners", source="given")
        Zg = c.derive("Z_group", n * Zp, "group capacity", unit="lbf", ref="NDS 2018 §11.2.2")
        Pd = c.given("P", P, "lateral load on the group", source=combination or "given",
                     unit="lbf")  # fmt: skip
        c.check(
            "Lateral capacity of the fasteners",
            Pd,
            Zg,
            ref="NDS 2018 §12.3",
            combination=combination,
        )

    title = f"{lay.count} × {f.designation}, {joint.side.label} to {joint.main.label}"
    return run_checks(mark, title, Standard(NDS_EDITION, _TITLE, "ASD"), logic)


def _cm_key(j: DowelJoint, lay: FastenerLayout, sv: ConnectionService) -> str:
    if sv.service == "wet":
        return "CM|lateral|dowel|any|wet"
    if sv.fabrication == "dry":
        return "CM|lateral|dowel|dry|dry"
    if j.fastener.D < _SMALL:
        return "CM|lateral|dowel small|wet|dry"
    return f"CM|lateral|dowel large {'one row' if lay.rows == 1 else 'rows'}|wet|dry"
