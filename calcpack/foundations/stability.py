"""Service checks of a footing on soil: bearing pressure, overturning, sliding, uplift, depth.

Each combination of the service (allowable stress) set is applied to the loads by case; the
footing's own weight and the soil over it are dead load, factored with the dead-load case's
factor of each combination (``self_weight_case``, "D" by default; "G" for EN 1990 sets). The
net load on the soil is N = P + f_D·(W_c + W_s); the moments at the base are M + V·h.

* Bearing: q_max from :func:`~calcpack.foundations.pressure.soil_pressure` (full or partial
  contact, kern stated) against the allowable bearing pressure given with its source (gross, or
  net of the overburden γ_soil·(h + soil cover)).
* Overturning about each edge: FS_ot·M_ot ≤ M_r = N·B/2 (and L/2); sliding:
  FS_s·H ≤ μ·N + P_p; uplift: FS_up·(−P) ≤ f_D·(W_c + W_s) + anchor. The factors of safety are
  inputs (default 1.5 each, common practice where the code leaves them to the engineer, e.g.
  IBC 2018 §1807.2.3 uses 1.5 for retaining walls -- from memory).
* Founding depth: the base is at least the stated frost or active-zone depth.

Sign conventions are those of :mod:`calcpack.foundations.geometry`.
"""

from __future__ import annotations

import functools
import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.model import AppliedCombination, CombinationSet
from calcpack.errors import OutOfScopeError
from calcpack.foundations.geometry import (
    GEOTECHNICAL_CAUTION,
    Footing,
    FootingLoad,
    SiteConditions,
    combine_footing_loads,
)
from calcpack.foundations.pressure import SoilPressure, soil_pressure
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, within

__all__ = [
    "SOIL_STANDARD",
    "AllowableBearing",
    "FootingCombination",
    "SafetyFactors",
    "check_footing_soil",
    "footing_combinations",
]

SOIL_STANDARD = Standard(
    "rigid-footing soil checks (common practice)",
    "contact pressure on a no-tension base with an allowable bearing pressure and stated "
    "factors of safety",
    "ASD",
)


@dataclass(frozen=True)
class AllowableBearing:
    """The allowable bearing pressure and sliding resistance, with their source.

    Args:
        q_allow: allowable bearing pressure [pressure].
        source: where it comes from (geotechnical report and section, or the code's
            presumptive table and class, cited).
        basis: ``"gross"`` (compared with the total pressure) or ``"net"`` (the overburden
            γ_soil·(h + soil cover) is subtracted first).
        friction: coefficient of friction μ at the base (None: sliding not checked when there
            is shear). passive: passive resistance on the footing's side [force] (default 0).
    """

    q_allow: Quantity
    source: str
    basis: Literal["gross", "net"] = "gross"
    friction: float | None = None
    passive: Quantity | None = None

    def __post_init__(self) -> None:
        positive("q_allow", dimension("q_allow", self.q_allow, "[pressure]"))
        one_of("basis", self.basis, ("gross", "net"))
        non_empty(
            "source",
            self.source,
            expected="where q_allow comes from, e.g. 'Geotechnical report GR-12, §5.1'",
        )
        if self.friction is not None:
            within(
                "friction",
                self.friction,
                0.0,
                1.5,
                inclusive=False,
                rule="a base friction coefficient",
            )
        if self.passive is not None:
            positive("passive", dimension("passive", self.passive, "[force]"), allow_zero=True)


@dataclass(frozen=True)
class SafetyFactors:
    """Factors of safety against overturning, sliding and uplift, with their source.

    Args:
        overturning, sliding, uplift: factors (≥ 1). source: where they come from.
        anchor: uplift resistance of an anchor into rock or a helical anchor [force] (0: none).
    """

    overturning: float = 1.5
    sliding: float = 1.5
    uplift: float = 1.5
    source: str = "common practice (the factor of safety is left to the engineer)"
    anchor: Quantity | None = None

    def __post_init__(self) -> None:
        for n in ("overturning", "sliding", "uplift"):
            within(n, getattr(self, n), 1.0, 5.0)
        if self.anchor is not None:
            positive("anchor", dimension("anchor", self.anchor, "[force]"), allow_zero=True)


@dataclass(frozen=True)
class FootingCombination:
    """One combination acting on a footing: the loads, the self-weight factor, the net load,
    base moments and (when the resultant is on the base) the contact pressure."""

    name: str
    combination: AppliedCombination
    load: FootingLoad
    f_sw: float
    N: Quantity
    Mx_base: Quantity
    My_base: Quantity
    pressure: SoilPressure | None
    overturns: bool


def footing_combinations(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    combinations: CombinationSet,
    *,
    self_weight_case: str = "D",
    include_self_weight: bool = True,
) -> list[FootingCombination]:
    """Each combination's loads on the soil (see the module notes).

    Args:
        include_self_weight: add the footing and soil weight (True for soil checks; False for
            the net pressure that bends the footing, which the weights do not).
    """
    out = []
    W = footing.concrete_weight + footing.soil_weight
    for name, (combo, ld) in combine_footing_loads(loads, combinations).items():
        f = combo.factors.get(self_weight_case, combo.source.factors.get(self_weight_case, 1.0))
        f = float(f) if include_self_weight else 0.0
        N = (ld.P + f * W).to("kN")
        My = (ld.My + ld.Vx * footing.h).to("kN*m")
        Mx = (ld.Mx + ld.Vy * footing.h).to("kN*m")
        pressure = None
        overturns = False
        if N.magnitude > 0:
            try:
                pressure = soil_pressure(
                    footing.polygon_m(),
                    N,
                    (My / N).to("m"),
                    (Mx / N).to("m"),
                    shape=footing.shape,
                    B=footing.B,
                    L=footing.length,
                )
            except OutOfScopeError:
                overturns = True
        out.append(FootingCombination(name, combo, ld, f, N, Mx, My, pressure, overturns))
    return out


def check_footing_soil(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    combinations: CombinationSet,
    bearing: AllowableBearing,
    *,
    site: SiteConditions | None = None,
    safety: SafetyFactors | None = None,
    self_weight_case: str = "D",
) -> MemberChecks:
    """Bearing, overturning, sliding, uplift and founding depth under service loads.

    Args:
        footing: the :class:`Footing`. loads: load case -> :class:`FootingLoad`.
        combinations: a service (allowable stress) combination set, e.g.
            ``asce7_allowable_stress()``. bearing: :class:`AllowableBearing` with its source.
        site: :class:`SiteConditions` (level ground, SDC A if not given). safety:
            :class:`SafetyFactors`. self_weight_case: the dead-load case whose factor applies
            to the footing and soil weight.

    Returns:
        MemberChecks; a failed check is NOT OK (uplift beyond the resisting weight without an
        anchor, a resultant off the base), never an exception.
    """
    site = site or SiteConditions()
    safety = safety or SafetyFactors()
    combos = footing_combinations(footing, loads, combinations, self_weight_case=self_weight_case)
    logic = _SoilLogic(footing, combos, bearing, site, safety)
    return run_checks(
        footing.mark,
        f"{footing.kind} footing on soil: bearing and stability",
        SOIL_STANDARD,
        logic,
    )


class _SoilLogic:
    def __init__(
        self,
        f: Footing,
        combos: list[FootingCombination],
        bearing: AllowableBearing,
        site: SiteConditions,
        safety: SafetyFactors,
    ) -> None:
        self.f, self.combos, self.bearing, self.site, self.safety = f, combos, bearing, site, safety

    def _overburden(self) -> Quantity:
        g = self.f.gamma_soil if self.f.gamma_soil is not None else self.f.gamma_concrete
        return (g * self.f.depth).to("kPa")

    def __call__(self, c: Recorder) -> None:
        f, b, s = self.f, self.bearing, self.safety
        c.caution(GEOTECHNICAL_CAUTION)
        c.heading("Footing and weights", 3)
        B = c.given("B", f.B, "footing width (diameter when round)", unit="m")
        h = c.given("h", f.h, "footing thickness", unit="m")
        if f.shape == "round":
            A = c.derive("A", c.pi * B**2 / 4, "base area", unit="m**2")
        else:
            L = c.given("L", f.length, "footing length", unit="m")
            A = c.derive("A", B * L, "base area", unit="m**2")
        gc = c.given("gamma_c", f.gamma_concrete, "concrete unit weight", unit="kN/m**3")
        Wc = c.derive("W_c", gc * A * h, "footing weight", unit="kN")
        if f.soil_weight.magnitude > 0:
            gs = c.given(
                "gamma_s",
                f.gamma_soil,
                "soil unit weight over the footing",
                source="geotechnical report",
                unit="kN/m**3",
            )
            ds = c.given("d_s", f.soil_cover, "soil cover over the footing", unit="m")
            Ac = c.given("A_col", f.column_area, "column footprint", unit="m**2")
            Ws = c.derive("W_s", gs * (A - Ac) * ds, "soil weight over the footing", unit="kN")
            W = c.derive("W", Wc + Ws, "resisting weight (dead load)", unit="kN")
        else:
            W = Wc
        self._table(c)
        self._bearing(c, A, B)
        self._overturning(c)
        self._sliding(c)
        self._uplift(c, W)
        md = self.site.minimum_depth
        if md is not None:
            c.heading("Founding depth", 3)
            dmin = c.given(
                "D_min",
                md,
                "required depth (frost or active zone)",
                source="stated site conditions",
                unit="m",
            )
            Df = c.given("D_f", f.depth, "depth of the base below the soil surface", unit="m")
            c.check(
                "Founding depth",
                dmin,
                Df,
                ref="site conditions (local code frost depth)",
                description="base at or below the required depth",
            )
        del b, s

    def _table(self, c: Recorder) -> None:
        rows = []
        for k in self.combos:
            p = k.pressure
            q: Any = "off the base" if k.overturns else ("uplift" if p is None else p.q_max)
            contact = "" if p is None else ("full" if p.full_contact else "partial")
            rows.append([k.name, k.N, k.My_base, k.Mx_base, q, contact])
        c.table(
            ["Combination", "N", "M_y,base", "M_x,base", "q_max", "contact"],
            rows,
            caption="Loads on the soil by combination (self weight included)",
        )

    def _bearing(self, c: Recorder, A: Any, B: Any) -> None:
        b = self.bearing
        c.heading("Bearing pressure", 3)
        live = [k for k in self.combos if k.pressure is not None]
        if not live:
            c.not_covered("Bearing pressure", "no combination has a downward resultant on the base")
            return
        gov = max(live, key=lambda k: k.pressure.q_max.magnitude if k.pressure else 0.0)
        p = gov.pressure
        assert p is not None
        qa = c.given(
            "q_a", b.q_allow, f"allowable bearing pressure ({b.basis})", source=b.source, unit="kPa"
        )
        N = c.given("N", gov.N, f"net load on the soil, {gov.name}", unit="kN")
        ex = c.given("e_x", abs(p.ex), "eccentricity along x, |M_y,base|/N", unit="m")
        ey = c.given("e_y", abs(p.ey), "eccentricity along y, |M_x,base|/N", unit="m")
        c.text(f"Kern: {p.kern}; {p.method}.")
        if p.full_contact and self.f.shape != "round":
            L = c.given("L_q", self.f.length, "footing length", unit="m")
            q = c.derive(
                "q_max",
                N / A * (1 + 6 * ex / B + 6 * ey / L),
                "maximum pressure",
                unit="kPa",
                ref="N/A·(1 + 6e_x/B + 6e_y/L) (common practice)",
            )
        elif p.full_contact:
            e = c.derive("e", c.sqrt(ex**2 + ey**2), "eccentricity", unit="m")
            q = c.derive(
                "q_max",
                N / A * (1 + 8 * e / B),
                "maximum pressure",
                unit="kPa",
                ref="N/A·(1 + 8e/D) (common practice)",
            )
        elif self.f.shape != "round" and min(abs(p.ex.magnitude), abs(p.ey.magnitude)) == 0.0:
            along_x = abs(p.ex.magnitude) > 0
            e = ex if along_x else ey
            Bd = B if along_x else c.given("L_q", self.f.length, "footing length", unit="m")
            W_ = c.given("L_w", self.f.length if along_x else self.f.B, "width across", unit="m")
            q = c.derive(
                "q_max",
                2 * N / (3 * W_ * (Bd / 2 - e)),
                "maximum pressure (triangle)",
                unit="kPa",
                ref="2N/(3 L (B/2 − e)) (common practice)",
            )
        else:
            q = c.given(
                "q_max",
                p.q_max,
                "maximum pressure, partial contact (no-tension plane solved on the base)",
                source="calcpack.foundations.pressure",
                unit="kPa",
            )
        if b.basis == "net":
            qo = c.given("q_o", self._overburden(), "overburden pressure γ·(h + cover)", unit="kPa")
            q = c.derive("q_net", q - qo, "net bearing pressure", unit="kPa")
        c.check(
            "Bearing pressure",
            q,
            qa,
            ref=b.source,
            combination=gov.name,
            description="maximum soil pressure within the allowable",
        )

    def _overturning(self, c: Recorder) -> None:
        f, s = self.f, self.safety
        axes: list[tuple[str, str, Quantity]] = [("y", "B", f.B), ("x", "L", f.length)]
        if f.shape == "round":
            axes = [("r", "D", f.B)]

        def mom(ax: str, k: FootingCombination) -> Quantity:
            if ax == "y":
                return abs(k.My_base)
            if ax == "x":
                return abs(k.Mx_base)
            return ((k.My_base**2 + k.Mx_base**2) ** 0.5).to("kN*m")

        def util(ax: str, size: Quantity, k: FootingCombination) -> float:
            Mr = k.N * size / 2
            if Mr.magnitude <= 0:
                return math.inf
            return float(s.overturning * mom(ax, k) / Mr)

        for ax, dim, size in axes:
            if all(mom(ax, k).magnitude == 0 for k in self.combos):
                continue
            gov = max(self.combos, key=functools.partial(util, ax, size))
            c.heading(
                f"Overturning (moment about the {ax} axis)" if ax != "r" else "Overturning", 3
            )
            FS = c.given(
                "FS_ot", s.overturning, "factor of safety against overturning", source=s.source
            )
            Mo = c.given(
                f"M_ot_{ax}",
                mom(ax, gov),
                f"overturning moment at the base, {gov.name}",
                unit="kN*m",
            )
            N = c.given(
                "N_r", gov.N, "resisting net vertical load (self weight factored)", unit="kN"
            )
            lever = c.given(f"{dim}_ot", size, "footing size across the axis", unit="m")
            Md = c.derive(
                f"M_ot_FS_{ax}",
                FS * Mo,
                "overturning moment times the factor of safety",
                unit="kN*m",
            )
            if gov.N.magnitude <= 0:
                c.check(
                    f"Overturning {ax}",
                    Md,
                    Q_(1e-9, "kN*m"),
                    ref=s.source,
                    combination=gov.name,
                    description="net uplift: nothing resists overturning",
                )
                continue
            Mr = c.derive(
                f"M_r_{ax}", N * lever / 2, "resisting moment about the edge", unit="kN*m"
            )
            c.check(
                f"Overturning {ax}",
                Md,
                Mr,
                ref=s.source,
                combination=gov.name,
                description="FS·M_ot ≤ M_r",
            )

    def _sliding(self, c: Recorder) -> None:
        b, s = self.bearing, self.safety

        def H(k: FootingCombination) -> Quantity:
            return ((k.load.Vx**2 + k.load.Vy**2) ** 0.5).to("kN")

        if all(H(k).magnitude == 0 for k in self.combos):
            return
        c.heading("Sliding", 3)
        if b.friction is None:
            c.not_covered(
                "Sliding",
                "horizontal load present but no base friction coefficient "
                "given (AllowableBearing.friction)",
            )
            return
        Pp = b.passive if b.passive is not None else Q_(0.0, "kN")

        def util(k: FootingCombination) -> float:
            R = (b.friction or 0.0) * max(k.N, Q_(0, "kN")) + Pp
            return math.inf if R.magnitude <= 0 else float(s.sliding * H(k) / R)

        gov = max(self.combos, key=util)
        FS = c.given("FS_s", s.sliding, "factor of safety against sliding", source=s.source)
        Hg = c.given("H", H(gov), f"horizontal shear at the base, {gov.name}", unit="kN")
        mu = c.given("mu", b.friction, "base friction coefficient", source=b.source)
        N = c.given("N_s", max(gov.N, Q_(0, "kN")), "net vertical load", unit="kN")
        P = c.given("P_p", Pp, "passive resistance", source=b.source, unit="kN")
        R = c.derive("R_s", mu * N + P, "sliding resistance", unit="kN")
        if c.q(R).magnitude <= 0:
            R = c.given("R_s_min", Q_(1e-9, "kN"), "no sliding resistance", unit="kN")
        Hd = c.derive("H_FS", FS * Hg, "shear times the factor of safety", unit="kN")
        c.check(
            "Sliding", Hd, R, ref=s.source, combination=gov.name, description="FS·H ≤ μ·N + P_p"
        )

    def _uplift(self, c: Recorder, W: Any) -> None:
        s = self.safety
        up = [k for k in self.combos if k.load.P.magnitude < 0]
        if not up:
            return
        anchor = s.anchor if s.anchor is not None else Q_(0.0, "kN")

        def util(k: FootingCombination) -> float:
            R = k.f_sw * c.q(W) + anchor
            return math.inf if R.magnitude <= 0 else float(s.uplift * -k.load.P / R)

        gov = max(up, key=util)
        c.heading("Uplift", 3)
        FS = c.given("FS_up", s.uplift, "factor of safety against uplift", source=s.source)
        U = c.given("U", -gov.load.P, f"uplift at the top of the footing, {gov.name}", unit="kN")
        fD = c.given("f_D", gov.f_sw, "load factor on the self weight in this combination")
        Ta = c.given(
            "T_a", anchor, "anchor uplift resistance" + ("" if s.anchor else " (none)"), unit="kN"
        )
        R = c.derive("R_up", fD * W + Ta, "uplift resistance", unit="kN")
        Ud = c.derive("U_FS", FS * U, "uplift times the factor of safety", unit="kN")
        c.check(
            "Uplift",
            Ud,
            R,
            ref=s.source,
            combination=gov.name,
            description="FS·U ≤ f_D·W + T_a" + ("" if s.anchor else "; no anchor"),
        )
