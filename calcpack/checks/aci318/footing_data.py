"""Inputs and factored actions of an ACI 318-19 footing design (no working here).

The footing is designed for the net factored soil pressure (see
:mod:`calcpack.foundations.demands`). Critical sections follow ACI 318-19 §13.2.7.1 (moment: the
face of a concrete column or pedestal; halfway between the middle and the edge of a masonry
wall; halfway between the column face and the edge of a steel base plate) and §13.2.7.2 (shear,
measured from the section for moment). A round column is taken as the square of equal area
(§13.2.7.3); a round footing as the square of equal area (common practice, stated in the
working).
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field, replace
from typing import Any, Literal, Protocol

from calcpack.checks.base import Recorder
from calcpack.combinations.model import CombinationSet
from calcpack.foundations.demands import cantilever_actions, force_within, net_combinations
from calcpack.foundations.geometry import Column, Footing, FootingLoad
from calcpack.sections.rebar import Rebar, rebar
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = [
    "ACI318_EDITION",
    "ACIFootingDesign",
    "BarLayout",
    "Direction",
    "FootingActions",
    "factored_actions",
]

ACI318_EDITION = "ACI CODE-318-19"


@dataclass(frozen=True)
class ACIFootingDesign:
    """Materials and detailing of a footing designed to ACI 318-19.

    Args:
        f_c: specified concrete strength f'c [pressure] (§19.2.1.1: at least 2500 psi).
        f_y: bar yield strength [pressure] (default 60 ksi, Grade 60; at most 80 ksi here).
        bar: bar size in both directions (``"#5"``; metric ``"#16"`` with bar_system
            ``"ASTM metric"``). bar_y: another size for the bars along y.
        bar_system: ``"ASTM"`` or ``"ASTM metric"``.
        cover: clear cover to the bottom bars [length] (§20.5.1.3.1: 3 in. cast against and
            permanently exposed to earth).
        aggregate: nominal maximum aggregate size [length] (for clear spacing, §25.2.1).
        lam: lightweight concrete modification factor λ (1.0 normal weight, Table 19.2.4.2).
        reinforced: False designs a plain concrete footing or pier to Chapter 14.
        size_effect: apply the size effect factor λs to one-way and two-way shear (True); by
            default it is neglected as ACI 318-19 §13.2.6.2 permits for isolated footings
            (from memory).
    """

    f_c: Quantity
    f_y: Quantity = field(default_factory=lambda: Q_(60, "ksi"))
    bar: str = "#5"
    bar_y: str | None = None
    bar_system: Literal["ASTM", "ASTM metric"] = "ASTM"
    cover: Quantity = field(default_factory=lambda: Q_(3, "inch"))
    aggregate: Quantity = field(default_factory=lambda: Q_(0.75, "inch"))
    lam: float = 1.0
    reinforced: bool = True
    size_effect: bool = False

    def __post_init__(self) -> None:
        fc = dimension("f_c", self.f_c, "[pressure]")
        within(
            "f_c",
            fc,
            Q_(2500, "psi"),
            Q_(10000, "psi"),
            rule="ACI 318-19 §19.2.1.1 (minimum 2500 psi); this module covers up to 10000 psi",
        )
        within(
            "f_y",
            dimension("f_y", self.f_y, "[pressure]"),
            Q_(40, "ksi"),
            Q_(80, "ksi"),
            rule="ACI 318-19 Table 20.2.2.4(a): Grades 40 to 80 for flexure here",
        )
        one_of("bar_system", self.bar_system, ("ASTM", "ASTM metric"))
        positive("cover", dimension("cover", self.cover, "[length]"))
        positive("aggregate", dimension("aggregate", self.aggregate, "[length]"))
        within("lam", self.lam, 0.75, 1.0, rule="ACI 318-19 Table 19.2.4.2")
        self.bar_x_data()
        self.bar_y_data()

    def bar_x_data(self) -> Rebar:
        return rebar(self.bar, self.bar_system)

    def bar_y_data(self) -> Rebar:
        return rebar(self.bar_y or self.bar, self.bar_system)


@dataclass(frozen=True)
class Direction:
    """One direction of bars: ``axis`` "x" (bars along x, bending over a section x = a_m)."""

    axis: str
    bar: Rebar
    d: Quantity
    width: Quantity
    size: Quantity
    a_m: Quantity
    bottom: bool
    Mu: Quantity
    Mu_combination: str
    Vu: Quantity
    Vu_combination: str
    concentric: bool
    qu: Quantity


@dataclass(frozen=True)
class FootingActions:
    """Factored actions of every direction, punching and bearing, with governing combinations."""

    footing: Footing
    equivalent_square: bool
    x: Direction
    y: Direction
    Pu: Quantity
    Pu_combination: str
    Vu2: Quantity
    Vu2_combination: str
    Msc_x: Quantity
    Msc_y: Quantity
    punch_concentric: bool
    qu_punch: Quantity
    b1: Quantity
    b2: Quantity
    uplift_combinations: tuple[str, ...]
    table: tuple[tuple[object, ...], ...]


def show_actions(c: Recorder, a: FootingActions, *, columns: Sequence[str], caption: str) -> None:
    """The table of actions by combination (when there is more than one to show)."""
    if a.table:
        c.table(list(columns), [list(r) for r in a.table], caption=caption)


def uplift_not_covered(c: Recorder, a: FootingActions, name: str, unchecked: str, ref: str) -> None:
    """When a combination lifts the footing off the soil: a NOT COVERED check ``name`` listing
    those combinations and saying what is not checked, with its clause. Shared by the ACI 318
    and EN 1992 footings."""
    if a.uplift_combinations:
        listed = ", ".join(a.uplift_combinations)
        c.not_covered(name, f"combinations with net uplift ({listed}): {unchecked}", ref=ref)


def two_way_perimeter(c: Recorder, a: FootingActions, at: str) -> tuple[Any, Any, Any] | None:
    """b_1, b_2 and b_0 = 2(b_1 + b_2) of the critical perimeter for two-way shear at ``at``
    from the loaded area (``"d/2"``; ``"h_s/2"`` for plain concrete), ACI 318-19 §22.6.4.1,
    in inches; None, said on the sheet, when it falls outside the footing."""
    f = a.footing
    if a.b1 >= f.B or a.b2 >= f.length:
        c.text(
            f"The critical perimeter at {at} falls outside the footing: two-way shear does not "
            "arise; one-way shear governs."
        )
        return None
    b1 = c.given("b_1", a.b1, "perimeter side along x", unit="inch")
    b2 = c.given("b_2", a.b2, "perimeter side along y", unit="inch")
    b0 = c.derive(
        "b_0", 2 * (b1 + b2), "critical perimeter", unit="inch", ref="ACI 318-19 §22.6.4.1"
    )
    return b1, b2, b0


def column_aspect(c: Recorder, column: Column) -> Any:
    """β_c, the loaded area's long side over its short side (ACI 318-19 Table 22.6.5.2)."""
    l1, l2 = column.loaded1, column.loaded2
    return c.given("beta_c", float(max(l1, l2) / min(l1, l2)), "column long side / short side")


def bar_count(need: Quantity, bar_area: Quantity, span: Quantity, s_max: Quantity) -> int:
    """The fewest bars, at least two, that give the area ``need`` with a spacing no more than
    ``s_max`` over ``span`` (between the outer bars' centres). Shared by the ACI 318 and
    EN 1992 footings."""
    by_area = math.ceil(float((need / bar_area).to("").magnitude))
    # the round-off allowance keeps a span of exactly k·s_max at k spaces
    by_spacing = math.ceil(float((span / s_max).to("").magnitude) - 1e-9) + 1
    return max(2, by_area, by_spacing)


def punching_shear(c: Recorder, a: FootingActions) -> Any:
    """V_u2 of the governing combination, as the actions give it (kip)."""
    return c.given(
        "V_u2",
        a.Vu2,
        f"punching shear, {a.Vu2_combination}",
        source="column load less the net pressure inside the perimeter",
        unit="kip",
    )


def moment_section(column: Column) -> tuple[Quantity, Quantity]:
    """Distances from the centre to the critical sections for moment along x and y (§13.2.7.1)."""
    c1 = column.c1
    c2 = column.c2 if column.c2 is not None else column.c1
    if column.shape == "round":
        c1 = c2 = column.c1 * math.sqrt(math.pi) / 2
    if column.support == "masonry":
        return c1 / 4, c2 / 4
    if column.support == "base plate":
        return (c1 / 2 + column.loaded1 / 2) / 2, (c2 / 2 + column.loaded2 / 2) / 2
    return c1 / 2, c2 / 2


def _square_equivalent(f: Footing) -> Footing:
    side = (f.area**0.5).to(f.B.units)
    return replace(f, shape="square", B=side, L=None, kind="pad")


class BarLayout(Protocol):
    """What the actions need from a design: the bars each way and the cover."""

    @property
    def cover(self) -> Quantity: ...

    def bar_x_data(self) -> Rebar: ...

    def bar_y_data(self) -> Rebar: ...


def factored_actions(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    combinations: CombinationSet,
    design: BarLayout,
    *,
    depth_x: Quantity | None = None,
    depth_y: Quantity | None = None,
) -> FootingActions:
    """Governing factored shear and moment per direction, punching shear and column load.

    Args:
        depth_x, depth_y: effective depths for the one-way shear sections (default from the
            bars and cover; a plain footing passes h - 2 in.).
    """
    eq = footing.shape == "round"
    f = _square_equivalent(footing) if eq else footing
    bx, by = design.bar_x_data(), design.bar_y_data()
    x_bottom = f.length <= f.B  # bars along the longer side go below (common practice)
    h, cov = f.h, design.cover
    if x_bottom:
        dx, dy = h - cov - 0.5 * bx.db, h - cov - bx.db - 0.5 * by.db
    else:
        dx, dy = h - cov - by.db - 0.5 * bx.db, h - cov - 0.5 * by.db
    dx = depth_x if depth_x is not None else dx
    dy = depth_y if depth_y is not None else dy
    am_x, am_y = moment_section(f.column)
    combos = net_combinations(f, loads, combinations)
    live = [k for k in combos if k.pressure is not None]
    uplift = tuple(k.name for k in combos if k.pressure is None)
    rows: list[tuple[object, ...]] = []
    best: dict[str, tuple[Quantity, str, bool]] = {}
    d_avg = (dx + dy) / 2
    b1, b2 = 2 * am_x + d_avg, 2 * am_y + d_avg
    punch = (Q_(-1.0, "kN"), "", True, Q_(0, "kN*m"), Q_(0, "kN*m"))
    Pu = (Q_(0.0, "kN"), "")
    for k in live:
        p = k.pressure
        assert p is not None
        concentric = p.ex.magnitude == 0 and p.ey.magnitude == 0
        Mx_ = cantilever_actions(p, "x", am_x)
        My_ = cantilever_actions(p, "y", am_y)
        Vx_ = cantilever_actions(p, "x", am_x + dx)
        Vy_ = cantilever_actions(p, "y", am_y + dy)
        half1, half2 = (b1 / 2).to("m").magnitude, (b2 / 2).to("m").magnitude
        inside = force_within(
            p, [(-half1, -half2), (half1, -half2), (half1, half2), (-half1, half2)]
        )
        V2 = (k.N - inside).to("kN")
        for key, val in (("Mx", Mx_.M), ("My", My_.M), ("Vx", Vx_.V), ("Vy", Vy_.V)):
            if key not in best or val > best[key][0]:
                best[key] = (val, k.name, concentric)
        if punch[0] < V2:
            punch = (V2, k.name, concentric, abs(k.load.Mx), abs(k.load.My))
        if Pu[0] < k.N:
            Pu = (k.N, k.name)
        rows.append((k.name, k.N, Mx_.M, My_.M, Vx_.V, Vy_.V, V2))
    if not live:
        zero = (Q_(0.0, "kN*m"), "", True)
        best = {
            "Mx": zero,
            "My": zero,
            "Vx": (Q_(0.0, "kN"), "", True),
            "Vy": (Q_(0.0, "kN"), "", True),
        }
        punch = (Q_(0.0, "kN"), "", True, Q_(0, "kN*m"), Q_(0, "kN*m"))
    qu = (Pu[0] / f.area).to("kPa") if Pu[0].magnitude > 0 else Q_(0.0, "kPa")

    def direction(axis: str) -> Direction:
        # bars along x: the section across them is L wide and the footing B long their way
        x = axis == "x"
        M, V = best[f"M{axis}"], best[f"V{axis}"]
        return Direction(
            axis=axis,
            bar=bx if x else by,
            d=(dx if x else dy).to("inch"),
            width=f.length if x else f.B,
            size=f.B if x else f.length,
            a_m=am_x if x else am_y,
            bottom=x_bottom if x else not x_bottom,
            Mu=M[0],
            Mu_combination=M[1],
            Vu=V[0],
            Vu_combination=V[1],
            concentric=M[2] and V[2],
            qu=qu,
        )

    return FootingActions(
        f,
        eq,
        direction("x"),
        direction("y"),
        Pu[0],
        Pu[1],
        punch[0],
        punch[1],
        punch[3],
        punch[4],
        punch[2],
        qu,
        b1.to("inch"),
        b2.to("inch"),
        uplift,
        tuple(rows),
    )
