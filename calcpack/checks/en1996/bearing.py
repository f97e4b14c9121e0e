"""Concentrated loads on unreinforced masonry walls, BS EN 1996-1-1:2005+A1:2012 §6.1.3 with
the UK National Annex, under a beam end bearing directly or through a concrete padstone.

N_Edc ≤ N_Rdc = β A_b f_d (6.9), with the enhancement factor for Group 1 units
β = (1 + 0.3 a_1/h_c)(1.5 − 1.1 A_b/A_ef) (6.10), 1.0 ≤ β ≤ min(1.25 + a_1/(2h_c), 1.5), and
A_b/A_ef ≤ 0.45; A_ef = l_efm t, l_efm the length of the loaded area spread at 60° to the
horizontal down to mid-height of the wall (Figure 6.2), stopped by the end of the wall. Other
unit groups take β = 1 (§6.1.3(2)). The load's eccentricity from the wall's centre line must
not exceed t/4 (§6.1.3(4)), else the check refuses.

A padstone spreads the beam reaction at 45° through its depth (common practice) onto the
loaded area A_b, at most its own plan. The bearing may sit anywhere on the padstone (default:
centred): the loaded area is kept concentric with the load, so that a uniform stress under it
has its resultant on the load's line (common practice, as for the effective area of an
eccentrically loaded base), and each side of it is limited by the nearer padstone end, l_c =
2 min(x_c, l_p − x_c) with x_c the bearing's centre from the padstone's end. A bearing at a
padstone's end therefore spreads nothing along the wall. The masonry's a_1 is measured to the
loaded area's real edge (§6.1.3(3), Figure 6.2). The concrete under the beam is checked for a
partially loaded area, EN 1992-1-1 §6.7 Eq. (6.63), with α_cc = 0.85 and γ_c = 1.5 (UK NA to BS
EN 1992-1-1), A_c1 similar in shape to A_c0 and concentric with it (§6.7(3)), within the
padstone's plan on each side of the bearing (the same l_c) and the conditions of Figure 6.29 on
its depth (:mod:`calcpack.checks.bearing_area`). f_d = f_k/γ_M
with γ_M of the UK NA Table NA.1 (from memory: category I units 2.3 and 2.7, category II 2.6
and 3.0, for execution classes 1 and 2); f_k = K f_b^0.7 f_m^0.3 (Eq. 3.1, general purpose
mortar, K from UK NA Table NA.4: Group 1 0.50, Group 2 0.40, from memory) unless the engineer
gives f_k. The wall at mid-height under the spread load (§6.1.2)
is checked separately.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack import views
from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.bearing_area import similar_area_ratio
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import one_of, positive_fields

__all__ = [
    "EN1996",
    "GAMMA_M_MASONRY",
    "MasonryBearing",
    "MasonryWall",
    "Padstone",
    "check_en1996_bearing",
    "masonry_fk",
]

EN1996 = Standard(
    "BS EN 1996-1-1:2005+A1:2012 with the UK National Annex",
    "Eurocode 6: Design of masonry structures, Part 1-1",
)
# UK NA to BS EN 1996-1-1 Table NA.1 (compressive strength), from memory
GAMMA_M_MASONRY = {("I", 1): 2.3, ("I", 2): 2.7, ("II", 1): 2.6, ("II", 2): 3.0}
_K = {1: 0.50, 2: 0.40}  # UK NA Table NA.4, general purpose mortar (from memory)
_FCK_DEFAULT = Q_(30.0, "MPa")  # C30/37 padstones (common practice)


def masonry_fk(group: int, fb: Quantity, fm: Quantity) -> Quantity:
    """f_k = K f_b^0.7 f_m^0.3 (EN 1996-1-1 Eq. (3.1), general purpose mortar, f_m ≤ 20 MPa and
    ≤ 2 f_b), K from the UK NA Table NA.4 (Group 1 0.50, Group 2 0.40; from memory)."""
    one_of("group", group, (1, 2))
    b = float(require(fb, "[pressure]", "fb", positive=True).to("MPa").magnitude)
    m = float(require(fm, "[pressure]", "fm", positive=True).to("MPa").magnitude)
    m = min(m, 20.0, 2 * b)
    return Q_(_K[group] * b**0.7 * m**0.3, "MPa")


@dataclass(frozen=True)
class MasonryWall:
    """The wall under the load.

    Args:
        t: thickness (the leaf carrying the load). f_k: characteristic compressive strength
            (e.g. from :func:`masonry_fk`) with its source. group: unit group (1 for solid).
        h_c: height of the wall to the level of the load (under the padstone). a_1: distance
            from the end of the wall to the nearer edge of what sits on the wall: the padstone
            when there is one (the check adds the distance from the padstone's end to the
            loaded area), else the beam's bearing (None: far from an end). category: unit
            category ``"I"`` or ``"II"``; execution: class 1 or 2 (γ_M).
    """

    t: Quantity
    f_k: Quantity
    h_c: Quantity
    fk_source: str = "engineer"
    group: int = 1
    a_1: Quantity | None = None
    category: Literal["I", "II"] = "I"
    execution: int = 2

    def __post_init__(self) -> None:
        require(self.t, "[length]", "t", positive=True)
        require(self.f_k, "[pressure]", "f_k", positive=True)
        require(self.h_c, "[length]", "h_c", positive=True)
        if self.a_1 is not None:
            require(self.a_1, "[length]", "a_1", nonnegative=True)
        one_of("group", self.group, (1, 2, 3, 4))
        one_of("category", self.category, ("I", "II"))
        one_of("execution", self.execution, (1, 2))

    @property
    def gamma_M(self) -> float:
        return GAMMA_M_MASONRY[(self.category, self.execution)]


@dataclass(frozen=True)
class Padstone:
    """A concrete padstone and where the beam bears on it.

    Args:
        length: along the wall; width: across it; depth: its height (lengths). f_ck: concrete
            characteristic cylinder strength [pressure].
        end_to_bearing: distance along the wall from the padstone's end nearer the wall end
            (the left end as drawn when no wall end is near) to the near edge of the beam's
            bearing, a length ≥ 0; ``0 mm`` puts the beam end at the padstone's end. None: the
            bearing is centred on the padstone.
    """

    length: Quantity
    width: Quantity
    depth: Quantity
    f_ck: Quantity = _FCK_DEFAULT
    end_to_bearing: Quantity | None = None

    def __post_init__(self) -> None:
        positive_fields(self, "[length]", ("length", "width", "depth"))
        require(self.f_ck, "[pressure]", "f_ck", positive=True)
        if self.end_to_bearing is not None:
            require(self.end_to_bearing, "[length]", "end_to_bearing", nonnegative=True)

    def bearing_start(self, bearing_length: Quantity) -> Quantity:
        """The bearing's near edge from the padstone's end [mm]; refuses a bearing that does not
        fit on the padstone."""
        pl, bl = self.length.to("mm"), bearing_length.to("mm")
        if self.end_to_bearing is None:
            if si(bl) > si(pl) * (1 + 1e-12):
                raise InputError(
                    name="bearing_length",
                    value=bl,
                    rule=f"must fit on the padstone (at most its length {pl:~P})",
                    expected=f"at most the padstone length {pl:~P}",
                )
            return (pl - bl) / 2
        start = self.end_to_bearing.to("mm")
        if si(start + bl) > si(pl) * (1 + 1e-12):
            raise InputError(
                name="end_to_bearing",
                value=start,
                rule=f"must be at most {max(pl - bl, 0 * pl):~P} (padstone length {pl:~P} − "
                f"bearing length {bl:~P}) for the bearing to fit on the padstone",
                expected=f"at most {max(pl - bl, 0 * pl):~P}",
            )
        return start


@dataclass(frozen=True)
class MasonryBearing:
    """The checks with the geometry a sketch needs (lengths along the wall from the loaded
    area's left edge, the side of the wall end; the wall end, when near, at −a_1).

    Attributes:
        a_1: the wall end to the loaded area's near edge (None: far from an end).
        bearing_start: the beam bearing's near edge (None: at 0); padstone_start: the
            padstone's near end (≤ 0; None without a padstone).
    """

    checks: MemberChecks
    wall: MasonryWall
    padstone: Padstone | None
    bearing_length: Quantity
    loaded_length: Quantity
    l_efm: Quantity
    left_spread: Quantity
    beta: float
    a_1: Quantity | None = None
    bearing_start: Quantity | None = None
    padstone_start: Quantity | None = None

    def working(self, **kw: Any) -> list[Any]:
        return self.checks.working(**kw)

    def add_to(self, sheet: Any) -> MasonryBearing:
        self.checks.add_to(sheet)
        return self

    def figure(self, caption: str = "") -> Any:
        """The sketch as a :class:`calcpack.working.Figure` step for a sheet."""
        from calcpack.working import Figure

        lb = self.loaded_length.to("mm").magnitude
        return Figure(
            "masonry-bearing",
            self,
            caption=caption
            or f"Concentrated load on masonry: loaded length {lb:.0f} mm spread at 60° to "
            f"mid-height, l_efm = {self.l_efm.to('mm').magnitude:.0f} mm, β = {self.beta:.2f}",
            alt="Elevation of the wall with the padstone and the beam bearing, the load spread "
            "at 60° to mid-height of the wall, and the effective length l_efm.",
        )

    def svg(self) -> str:
        """The elevation sketch (drawn by :mod:`calcpack.plots.masonry`, via the registry)."""
        svg: str = views.render("svg", self)
        return svg


def check_en1996_bearing(
    wall: MasonryWall,
    *,
    N_Ed: Quantity,
    bearing_length: Quantity,
    bearing_width: Quantity,
    padstone: Padstone | None = None,
    eccentricity: Quantity | None = None,
    mark: str = "bearing",
    combination: str | None = None,
) -> MasonryBearing:
    """Masonry under a concentrated load (§6.1.3), through a padstone when given.

    Args:
        N_Ed: design load [force]. bearing_length, bearing_width: the beam's bearing (along
            and across the wall). eccentricity: of the load from the wall's centre line.

    Raises:
        OutOfScopeError: eccentricity above t/4 (§6.1.3(4)).
        InputError: a bearing wider than the wall or padstone, or a bad input.
    """
    require(N_Ed, "[force]", "N_Ed", positive=True)
    require(bearing_length, "[length]", "bearing_length", positive=True)
    require(bearing_width, "[length]", "bearing_width", positive=True)
    e = Q_(0.0, "mm") if eccentricity is None else require(eccentricity, "[length]", "eccentricity")
    if abs(si(e)) > si(wall.t) / 4 * (1 + 1e-12):
        raise OutOfScopeError(
            f"Load eccentricity {e:~P} exceeds t/4 = {(wall.t / 4).to('mm'):~P}: EN 1996-1-1 "
            "§6.1.3(4) limits a concentrated load to the middle half of the wall's thickness"
        )
    top = padstone.width if padstone is not None else wall.t
    if si(bearing_width) > si(top) * (1 + 1e-12):
        raise InputError(
            f"Bearing width {bearing_width:~P} is wider than what it sits on ({top:~P})",
            name="bearing_width",
            value=bearing_width,
            expected=f"<= {top:~P}",
        )
    bl = bearing_length.to("mm")
    if padstone is not None:
        x_b = padstone.bearing_start(bl)
        x_c = x_b + bl / 2
        l_c = 2 * min(x_c, padstone.length.to("mm") - x_c)
        lb = min(l_c, bl + 2 * padstone.depth).to("mm")
        to_loaded = (x_c - lb / 2).to("mm")
        wb = min(padstone.width, bearing_width + 2 * padstone.depth, wall.t).to("mm")
    else:
        lb, wb = bl, bearing_width.to("mm")
        to_loaded = Q_(0.0, "mm")
    a_1 = None if wall.a_1 is None else (wall.a_1 + to_loaded).to("mm")
    spread = (wall.h_c / 2 * math.tan(math.radians(30))).to("mm")
    left = spread if a_1 is None else min(spread, a_1)
    l_efm = (lb + left + spread).to("mm")

    def logic(c: Recorder) -> None:
        N = c.given("N_Edc", N_Ed.to("kN"), "design concentrated load")
        h: dict[str, Any] = {}
        if padstone is not None:
            h = _padstone(c, padstone, N, bl, bearing_width, combination)
        c.heading("Masonry under the loaded area, EN 1996-1-1 §6.1.3", 3)
        fk = c.given(
            "f_k", wall.f_k.to("MPa"), "characteristic compressive strength", source=wall.fk_source
        )
        gM = c.given(
            "gamma_M",
            wall.gamma_M,
            f"category {wall.category} units, execution class {wall.execution}",
            source="UK NA to BS EN 1996-1-1 Table NA.1",
        )
        fd = c.derive(
            "f_d", fk / gM, "design compressive strength", unit="MPa", ref="EN 1996-1-1 §2.4.1"
        )
        if padstone is not None:
            Lb = c.derive(
                "l_b",
                c.min(h["l_c"], h["b_1"] + 2 * h["h_p"]),
                "length of the loaded area: spread at 45° through the padstone, concentric "
                "with the bearing and within the padstone's ends (common practice)",
                unit="mm",
            )
        else:
            Lb = c.given("l_b", lb, "length of the loaded area (bearing)", source="detail")
        Wb = c.given("w_b", wb, "width of the loaded area", source="detail")
        Ab = c.derive("A_b", Lb * Wb, "loaded area", unit="mm**2")
        t = c.given("t", wall.t.to("mm"), "wall thickness", source="drawing")
        hc = c.given(
            "h_c",
            wall.h_c.to("mm"),
            "height of the wall to the level of the load",
            source="drawing",
        )
        if wall.group != 1:
            beta = c.given(
                "beta",
                1.0,
                f"Group {wall.group} units: no enhancement",
                source="EN 1996-1-1 §6.1.3(2)",
            )
        else:
            if a_1 is None:
                a1 = c.given(
                    "a_1",
                    (2 * wall.h_c).to("mm"),
                    "far from an end (taken as 2h_c: β reaches its cap)",
                    source="drawing",
                )
            elif padstone is not None and wall.a_1 is not None:
                a1 = c.derive(
                    "a_1",
                    c.given(
                        "a_p", wall.a_1.to("mm"), "end of wall to the padstone", source="drawing"
                    )
                    + h["x_b"]
                    + h["b_1"] / 2
                    - Lb / 2,
                    "end of wall to the loaded area",
                    unit="mm",
                    ref="EN 1996-1-1 Figure 6.2",
                )
            else:
                a1 = c.given("a_1", a_1, "end of wall to the loaded area", source="drawing")
            lef = c.given(
                "l_efm",
                l_efm,
                "loaded length spread at 60° to mid-height (Figure 6.2), stopped by the wall end",
                source="EN 1996-1-1 Figure 6.2",
            )
            Aef = c.derive(
                "A_ef",
                lef * t,
                "effective area of bearing",
                unit="mm**2",
                ref="EN 1996-1-1 §6.1.3(3)",
            )
            ratio = c.derive(
                "r_A", c.min(Ab / Aef, 0.45), "A_b/A_ef, at most 0.45", ref="EN 1996-1-1 §6.1.3(3)"
            )
            b0 = c.derive(
                "beta_0",
                (1 + 0.3 * a1 / hc) * (1.5 - 1.1 * ratio),
                "",
                ref="EN 1996-1-1 Eq. (6.10)",
            )
            cap = c.derive(
                "beta_max",
                c.min(1.25 + a1 / (2 * hc), 1.5),
                "upper limit",
                ref="EN 1996-1-1 §6.1.3(3)",
            )
            beta = c.derive(
                "beta",
                c.max(c.min(b0, cap), 1.0),
                "enhancement factor",
                ref="EN 1996-1-1 §6.1.3(3)",
            )
        NR = c.derive(
            "N_Rdc",
            beta * Ab * fd,
            "resistance to the concentrated load",
            unit="kN",
            ref="EN 1996-1-1 Eq. (6.9)",
        )
        c.check("Masonry bearing (6.1.3)", N, NR, ref="EN 1996-1-1 §6.1.3", combination=combination)
        c.caution(
            "The wall under the spread load at mid-height must also satisfy §6.1.2 "
            "(vertical load resistance with slenderness and eccentricity)."
        )

    checks = run_checks(mark, "concentrated load on masonry", EN1996, logic)
    return MasonryBearing(
        checks,
        wall,
        padstone,
        bearing_length.to("mm"),
        lb,
        l_efm,
        left,
        float(checks.values["beta"].magnitude),
        a_1,
        (x_b - to_loaded).to("mm") if padstone is not None else Q_(0.0, "mm"),
        (-to_loaded).to("mm") if padstone is not None else None,
    )


def _padstone(
    c: Recorder, p: Padstone, N: Any, lb: Quantity, wb: Quantity, combination: str | None
) -> dict[str, Any]:
    """The padstone's own bearing (EN 1992-1-1 §6.7); returns the handles the masonry part
    reuses (b_1, x_b, h_p, l_c)."""
    c.heading("Concrete padstone under the beam, EN 1992-1-1 §6.7", 3)
    fck = c.given("f_ck", p.f_ck.to("MPa"), "padstone concrete", source="specification")
    acc = c.given("alpha_cc", 0.85, "", source="UK NA to BS EN 1992-1-1")
    gc = c.given("gamma_c", 1.5, "", source="UK NA to BS EN 1992-1-1")
    fcd = c.derive(
        "f_cd",
        acc * fck / gc,
        "design compressive strength",
        unit="MPa",
        ref="EN 1992-1-1 Eq. (3.15)",
    )
    b1 = c.given("b_1", lb.to("mm"), "beam bearing length")
    a0 = c.derive(
        "A_c0",
        b1 * c.given("d_1", wb.to("mm"), "beam bearing width"),
        "loaded area",
        unit="mm**2",
    )
    lp = c.given("l_p", p.length.to("mm"), "padstone length along the wall", source="drawing")
    hp = c.given("h_p", p.depth.to("mm"), "padstone depth", source="drawing")
    x_b = p.bearing_start(lb)
    xb = c.given(
        "x_b",
        x_b,
        "padstone end to the bearing's near edge"
        + (" (bearing centred)" if p.end_to_bearing is None else ""),
        source="drawing",
    )
    lc = c.derive(
        "l_c",
        2 * c.min(xb + b1 / 2, lp - xb - b1 / 2),
        "length of padstone centred on the bearing, each side up to the nearer padstone end",
        unit="mm",
    )
    k = similar_area_ratio((lb, wb), (c.q(lc), p.width), p.depth, "EN 1992-1-1")
    a1 = c.given(
        "A_c1",
        (k**2 * lb * wb).to("mm**2"),
        "largest distribution area similar to and concentric with A_c0, within l_c × the "
        "padstone width and its depth (each side ≤ 3 × and grown by ≤ the depth)",
        source="EN 1992-1-1 §6.7(2), (3), Figure 6.29",
    )
    F = c.derive(
        "F_Rdu",
        a0 * fcd * c.min(c.sqrt(a1 / a0), 3.0),
        "resistance of the partially loaded area",
        unit="kN",
        ref="EN 1992-1-1 Eq. (6.63)",
    )
    c.check(
        "Padstone bearing (EN 1992-1-1 6.7)", N, F, ref="EN 1992-1-1 §6.7", combination=combination
    )
    return {"b_1": b1, "x_b": xb, "h_p": hp, "l_c": lc}
