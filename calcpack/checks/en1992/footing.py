"""Reinforced concrete pad footings to EN 1992-1-1:2004 (Eurocode 2), ultimate limit state.

For a footing under one column, designed for the net design soil pressure (the weights of the
footing and the soil over it are carried by the soil beneath; common practice):

* flexure at the column face (common practice) with the rectangular stress block §3.1.7(3)
  (λ = 0.8, η = 1, f_cd = α_cc·f_ck/γ_c), lever arm z ≤ 0.95·d (common practice), x/d ≤ 0.45
  (§5.6.3, from memory); minimum steel §9.2.1.1(1): max(0.26·f_ctm/f_yk, 0.0013)·b·d with
  f_ctm = 0.30·f_ck^(2/3) (Table 3.1); spacing at most min(3h, 400 mm) (§9.3.1.1(3)), clear
  spacing at least max(φ, d_g + 5 mm, 20 mm) (§8.2(2));
* shear at d from the column face §6.2.2(1): V_Rd,c = max(C_Rd,c·k·(100·ρ_l·f_ck)^(1/3),
  v_min)·b·d, C_Rd,c = 0.18/γ_c, k = 1 + √(200/d) ≤ 2, v_min = 0.035·k^(3/2)·f_ck^(1/2);
* punching §6.4.4(2): on control perimeters at a ≤ 2d from the loaded area, V_Ed,red = V_Ed
  less the net pressure inside the perimeter, v_Ed = V_Ed,red/(u·d)·(1 + k·M_Ed·u/(V_Ed,red·W))
  (Eq. 6.51, W at distance a, k from Table 6.1, both axes added), against
  v_Rd = C_Rd,c·k·(100·ρ·f_ck)^(1/3)·2d/a ≥ v_min·2d/a (Eq. 6.50); the governing perimeter is
  searched; at the column face v_Ed ≤ v_Rd,max = 0.5·ν·f_cd, ν = 0.6·(1 − f_ck/250)
  (§6.4.5(3), Eq. 6.53 and 6.6N).

Partial factors γ_c = 1.5, γ_s = 1.15 (Table 2.1N); α_cc = 1.0 recommended, 0.85 in the UK
National Annex (from memory). These provisions and the National Annex values must be confirmed
against the edition adopted locally.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from typing import Any, Literal

from calcpack.checks.aci318.footing_data import (
    Direction,
    bar_count,
    factored_actions,
    show_actions,
    uplift_not_covered,
)
from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.en1990 import Psi, en1990_combinations
from calcpack.foundations.demands import force_within, net_combinations, rounded_rectangle
from calcpack.foundations.geometry import GEOTECHNICAL_CAUTION, Footing, FootingLoad
from calcpack.sections.rebar import Rebar, rebar
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, within

__all__ = ["EN1992", "ECFootingDesign", "check_en1992_footing"]

EN1992 = Standard("EN 1992-1-1:2004", "Eurocode 2: Design of concrete structures, Part 1-1")
GAMMA_C = 1.5  # Table 2.1N
GAMMA_S = 1.15  # Table 2.1N
ALPHA_CC = {"recommended": 1.0, "UK": 0.85}  # §3.1.6(1)P; UK NA value from memory


@dataclass(frozen=True)
class ECFootingDesign:
    """Materials and detailing of a footing to EN 1992-1-1.

    Args:
        f_ck: characteristic cylinder strength [pressure] (12 to 50 MPa here). f_yk: bar yield
            strength (default 500 MPa). bar, bar_y: BS 4449 bar sizes (``"H12"``).
        cover: nominal cover to the bottom bars (default 75 mm for concrete cast against
            soil, §4.4.1.3(4), from memory). aggregate: d_g (default 20 mm).
        annex: ``"recommended"`` or ``"UK"`` (α_cc = 0.85).
    """

    f_ck: Quantity
    f_yk: Quantity = field(default_factory=lambda: Q_(500, "MPa"))
    bar: str = "H12"
    bar_y: str | None = None
    cover: Quantity = field(default_factory=lambda: Q_(75, "mm"))
    aggregate: Quantity = field(default_factory=lambda: Q_(20, "mm"))
    annex: Literal["recommended", "UK"] = "recommended"

    def __post_init__(self) -> None:
        within(
            "f_ck",
            dimension("f_ck", self.f_ck, "[pressure]"),
            Q_(12, "MPa"),
            Q_(50, "MPa"),
            rule="EN 1992-1-1 Table 3.1; the stress block used here holds to C50/60",
        )
        within(
            "f_yk",
            dimension("f_yk", self.f_yk, "[pressure]"),
            Q_(400, "MPa"),
            Q_(600, "MPa"),
            rule="EN 1992-1-1 Annex C (400 to 600 MPa)",
        )
        positive("cover", dimension("cover", self.cover, "[length]"))
        positive("aggregate", dimension("aggregate", self.aggregate, "[length]"))
        one_of("annex", self.annex, ("recommended", "UK"))
        self.bar_x_data()
        self.bar_y_data()

    def bar_x_data(self) -> Rebar:
        return rebar(self.bar, "BS 4449")

    def bar_y_data(self) -> Rebar:
        return rebar(self.bar_y or self.bar, "BS 4449")


def _k_table_6_1(ratio: float) -> float:
    """k of EN 1992-1-1 Table 6.1 for c1/c2 (linear between the printed points)."""
    pts = [(0.5, 0.45), (1.0, 0.60), (2.0, 0.70), (3.0, 0.80)]
    if ratio <= 0.5:
        return 0.45
    if ratio >= 3.0:
        return 0.80
    for (r0, k0), (r1, k1) in itertools.pairwise(pts):
        if r0 <= ratio <= r1:
            return k0 + (k1 - k0) * (ratio - r0) / (r1 - r0)
    return 0.80  # pragma: no cover


def check_en1992_footing(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    variable: Mapping[str, str | Psi],
    design: ECFootingDesign,
    *,
    permanent: Sequence[str] = ("G",),
) -> MemberChecks:
    """Flexure, shear and punching of a pad footing to EN 1992-1-1 (see the module notes),
    under the EN 1990 Eq. (6.10) STR combinations (A1 factors) of the loads by case."""
    combos = en1990_combinations(variable=variable, permanent=permanent)
    acts = factored_actions(footing, loads, combos, design)
    f = acts.footing
    punch = _punching(f, loads, combos, (acts.x.d + acts.y.d) / 2)
    return run_checks(
        footing.mark,
        f"{footing.kind} footing, reinforced concrete to EN 1992-1-1",
        EN1992,
        _ECLogic(acts, design, punch),
    )


@dataclass(frozen=True)
class _Punch:
    combination: str
    a: Quantity
    V_red: Quantity
    M_B: Quantity
    M_L: Quantity
    V_col: Quantity
    util_rel: float


def _punching(
    f: Footing, loads: Mapping[str, FootingLoad], combos: Any, d: Quantity
) -> _Punch | None:
    """The governing control perimeter (a ≤ 2d) and combination, by v_Ed·a (v_Rd ∝ 1/a)."""
    c1 = f.column.loaded1.to("m").magnitude / 2
    c2 = f.column.loaded2.to("m").magnitude / 2
    d_m = d.to("m").magnitude
    best: _Punch | None = None
    for k in net_combinations(f, loads, combos):
        p = k.pressure
        if p is None:
            continue
        for i in range(1, 21):
            a = 2 * d_m * i / 20
            u = 4 * (c1 + c2) + 2 * math.pi * a
            V = (k.N - force_within(p, rounded_rectangle(c1, c2, a))).to("kN").magnitude
            rel = V / u * a  # v_Ed ∝ V/u; v_Rd ∝ 1/a
            if best is None or rel > best.util_rel:
                best = _Punch(
                    k.name, Q_(a, "m"), Q_(V, "kN"), abs(k.load.My), abs(k.load.Mx), k.N, rel
                )
    return best


class _ECLogic:
    def __init__(self, acts: Any, dz: ECFootingDesign, punch: _Punch | None) -> None:
        self.a, self.dz, self.punch = acts, dz, punch
        self.As: dict[str, Quantity] = {}

    def __call__(self, c: Recorder) -> None:
        a, dz = self.a, self.dz
        c.caution(GEOTECHNICAL_CAUTION)
        if a.equivalent_square:
            c.assume("The round footing is designed as the square of equal area (common practice).")
        c.assume(
            "Design for the net design soil pressure from the column loads (common "
            "practice); flexure at the column face."
        )
        c.heading("Materials", 3)
        fck = c.given("f_ck", dz.f_ck, "characteristic concrete strength", unit="MPa")
        fyk = c.given("f_yk", dz.f_yk, "characteristic bar yield strength", unit="MPa")
        acc = c.given(
            "alpha_cc",
            ALPHA_CC[dz.annex],
            f"long-term factor ({dz.annex} value)",
            source="EN 1992-1-1 §3.1.6(1)P" + (", UK NA" if dz.annex == "UK" else ""),
        )
        fcd = c.derive(
            "f_cd",
            acc * fck / GAMMA_C,
            "design concrete strength, γ_c = 1.5",
            unit="MPa",
            ref="EN 1992-1-1 §3.1.6, Table 2.1N",
        )
        fyd = c.derive(
            "f_yd",
            fyk / GAMMA_S,
            "design yield strength, γ_s = 1.15",
            unit="MPa",
            ref="EN 1992-1-1 §3.2.7, Table 2.1N",
        )
        h = c.given("h", a.footing.h, "footing thickness", unit="mm")
        show_actions(
            c,
            a,
            columns=["Combination", "N_Ed", "M_Ed,x", "M_Ed,y", "V_Ed,x", "V_Ed,y", "V_Ed,2"],
            caption="Design actions from the net soil pressure by combination",
        )
        uplift_not_covered(
            c, a, "Top face under uplift", "the top face is not checked", "EN 1992-1-1 §9.8.2"
        )
        if a.Pu.magnitude <= 0:
            return
        for dirn in (a.x, a.y):
            self._flexure(c, dirn, fck, fyk, fcd, fyd, h)
        for dirn in (a.x, a.y):
            self._shear(c, dirn, fck)
        self._punching(c, fck, fcd)

    def _flexure(
        self, c: Recorder, dirn: Direction, fck: Any, fyk: Any, fcd: Any, fyd: Any, h: Any
    ) -> None:
        ax = dirn.axis
        c.heading(f"Flexure at the column face, bars along {ax} ({dirn.bar.designation})", 3)
        b = c.given(f"b_{ax}", dirn.width, "width of the section", unit="mm")
        d = c.given(
            f"d_{ax}",
            dirn.d,
            "effective depth" + (" (bottom layer)" if dirn.bottom else " (second layer)"),
            unit="mm",
        )
        phi = c.given(f"phi_{ax}", dirn.bar.db, "bar diameter", source=dirn.bar.source, unit="mm")
        Ab = c.given(f"A_b_{ax}", dirn.bar.Ab, "bar area", source=dirn.bar.source, unit="mm**2")
        M = c.given(
            f"M_Ed_{ax}",
            dirn.Mu,
            f"design moment at the face, {dirn.Mu_combination}",
            source="net design pressure beyond the face",
            unit="kN*m",
        )
        Mq, bq, dq, fq = c.q(M), c.q(b), c.q(d), c.q(fcd)
        disc = float((dq**2 - 2 * Mq / (fq * bq)).to("mm**2").magnitude)
        if disc < 0:
            Mmax = c.derive(
                f"M_Rd_max_{ax}", fcd * b * d**2 / 2, "largest moment of the section", unit="kN*m"
            )
            c.check(f"Flexure {ax}", M, Mmax, ref="EN 1992-1-1 §6.1", description="too thin")
            return
        s = c.derive(
            f"s_{ax}",
            d - c.sqrt(d**2 - 2 * M / (fcd * b)),
            "depth of the stress block λx",
            unit="mm",
            ref="EN 1992-1-1 §3.1.7(3)",
        )
        z = c.derive(f"z_{ax}", c.min(d - s / 2, 0.95 * d), "lever arm (at most 0.95d)", unit="mm")
        As_req = c.derive(f"A_s_req_{ax}", M / (fyd * z), "steel required", unit="mm**2")
        fctm = c.derive(
            "f_ctm",
            0.30 * (fck / Q_(1, "MPa")) ** (2 / 3) * Q_(1, "MPa"),
            "mean tensile strength",
            unit="MPa",
            ref="EN 1992-1-1 Table 3.1",
        )
        As_min = c.derive(
            f"A_s_min_{ax}",
            c.max(0.26 * fctm / fyk, 0.0013) * b * d,
            "minimum steel",
            unit="mm**2",
            ref="EN 1992-1-1 §9.2.1.1(1)",
        )
        smax = c.derive(
            f"s_max_{ax}",
            c.min(3 * h, Q_(400, "mm")),
            "maximum spacing",
            unit="mm",
            ref="EN 1992-1-1 §9.3.1.1(3)",
        )
        cov = self.dz.cover
        need = max(c.q(As_req), c.q(As_min))
        n_val = bar_count(need, c.q(Ab), c.q(b) - 2 * cov - c.q(phi), c.q(smax))
        n = c.given(f"n_{ax}", n_val, "number of bars")
        As = c.derive(f"A_s_{ax}", n * Ab, "steel provided", unit="mm**2")
        self.As[ax] = c.q(As)
        cv = c.given(
            f"c_nom_{ax}",
            cov,
            "nominal cover",
            unit="mm",
            source="EN 1992-1-1 §4.4.1.3(4) (75 mm cast against soil)",
        )
        sp = c.derive(f"s_b_{ax}", (b - 2 * cv - phi) / (n - 1), "bar spacing", unit="mm")
        x = c.derive(
            f"x_{ax}",
            As * fyd / (0.8 * fcd * b),
            "neutral axis depth",
            unit="mm",
            ref="EN 1992-1-1 §3.1.7(3)",
        )
        zp = c.derive(f"z_p_{ax}", c.min(d - 0.4 * x, 0.95 * d), "lever arm", unit="mm")
        MRd = c.derive(f"M_Rd_{ax}", As * fyd * zp, "design moment resistance", unit="kN*m")
        c.check(f"Flexure {ax}", M, MRd, ref="EN 1992-1-1 §6.1", combination=dirn.Mu_combination)
        xd = c.derive(f"x_d_{ax}", x / d, "neutral axis ratio")
        c.check(f"Ductility {ax}", xd, Q_(0.45, ""), ref="EN 1992-1-1 §5.6.3 (x/d ≤ 0.45)")
        c.check(f"Minimum steel {ax}", As_min, As, ref="EN 1992-1-1 §9.2.1.1(1)")
        c.check(f"Bar spacing {ax}", sp, smax, ref="EN 1992-1-1 §9.3.1.1(3)")
        smin = c.derive(
            f"s_min_{ax}",
            c.max(phi, self.dz.aggregate + Q_(5, "mm"), Q_(20, "mm")),
            "minimum clear spacing",
            unit="mm",
            ref="EN 1992-1-1 §8.2(2)",
        )
        sc = c.derive(f"s_c_{ax}", sp - phi, "clear spacing", unit="mm")
        c.check(f"Clear spacing {ax}", smin, sc, ref="EN 1992-1-1 §8.2(2)")

    @staticmethod
    def _d0(c: Recorder) -> Any:
        return c.given(
            "d_0",
            Q_(200, "mm"),
            "reference depth of the size factor",
            source="EN 1992-1-1 §6.2.2(1)",
            unit="mm",
        )

    def _shear(self, c: Recorder, dirn: Direction, fck: Any) -> None:
        ax = dirn.axis
        c.heading(f"Shear at d from the column face, along {ax}", 3)
        if dirn.Vu.magnitude <= 0:
            c.text("The section at d from the face lies beyond the footing: no shear check.")
            return
        V = c.given(
            f"V_Ed_{ax}",
            dirn.Vu,
            f"design shear, {dirn.Vu_combination}",
            source="net design pressure beyond the section",
            unit="kN",
        )
        b = c.given(f"b_w_{ax}", dirn.width, "width", unit="mm")
        d = c.given(f"d_v_{ax}", dirn.d, "effective depth", unit="mm")
        As = c.given(f"A_sl_{ax}", self.As.get(ax, Q_(0, "mm**2")), "tension steel", unit="mm**2")
        k = c.derive(
            f"k_{ax}",
            c.min(1 + c.sqrt(self._d0(c) / d), 2.0),
            "size factor",
            ref="EN 1992-1-1 §6.2.2(1)",
        )
        rho = c.derive(f"rho_l_{ax}", c.min(As / (b * d), 0.02), "steel ratio (≤ 0.02)")
        fk = fck / Q_(1, "MPa")
        vrd = c.derive(
            f"v_Rd_c_{ax}",
            c.max(0.18 / GAMMA_C * k * (100 * rho * fk) ** (1 / 3), 0.035 * k**1.5 * fk**0.5)
            * Q_(1, "MPa"),
            "shear resistance stress (C_Rd,c = 0.18/γ_c, v_min)",
            unit="MPa",
            ref="EN 1992-1-1 Eq. (6.2a), (6.2b), (6.3N)",
        )
        VR = c.derive(f"V_Rd_c_{ax}", vrd * b * d, "design shear resistance", unit="kN")
        c.check(f"Shear {ax}", V, VR, ref="EN 1992-1-1 §6.2.2", combination=dirn.Vu_combination)

    def _punching(self, c: Recorder, fck: Any, fcd: Any) -> None:
        p, f = self.punch, self.a.footing
        c.heading("Punching (§6.4.4(2)): governing control perimeter within 2d", 3)
        if p is None:
            return
        col = f.column
        d = c.given("d_eff", (self.a.x.d + self.a.y.d) / 2, "average effective depth", unit="mm")
        c1 = c.given("c_1", col.loaded1, "loaded area along x", unit="mm")
        c2 = c.given("c_2", col.loaded2, "loaded area along y", unit="mm")
        a = c.given(
            "a_p",
            p.a,
            f"distance of the governing perimeter (searched over a ≤ 2d), {p.combination}",
            unit="mm",
        )
        u = c.derive(
            "u",
            2 * (c1 + c2) + 2 * c.pi * a,
            "control perimeter",
            unit="mm",
            ref="EN 1992-1-1 §6.4.2",
        )
        V = c.given(
            "V_Ed_red",
            p.V_red,
            "column load less the net pressure inside the perimeter",
            source="EN 1992-1-1 Eq. (6.48)",
            unit="kN",
        )
        v = c.derive("v_Ed_0", V / (u * d), "shear stress without moment", unit="MPa")
        for M, ca, cb, tag in ((p.M_B, c1, c2, "B"), (p.M_L, c2, c1, "L")):
            if M.magnitude == 0:
                continue
            Mq = c.given(f"M_Ed_{tag}", M, f"column moment ({tag} direction)", unit="kN*m")
            kk = c.given(
                f"k_{tag}",
                _k_table_6_1(float(c.q(ca) / c.q(cb))),
                "moment share",
                source="EN 1992-1-1 Table 6.1",
            )
            W = c.derive(
                f"W_{tag}",
                ca**2 / 2 + ca * cb + 2 * cb * a + 4 * a**2 + c.pi * a * ca,
                "perimeter modulus at distance a",
                unit="mm**2",
                ref="EN 1992-1-1 Eq. (6.41) at a",
            )
            v = c.derive(
                f"v_Ed_{tag}",
                v + kk * Mq / (W * d),
                "shear stress with the moment",
                unit="MPa",
                ref="EN 1992-1-1 Eq. (6.51)",
            )
        rx = float(self.As.get("x", Q_(0, "mm**2")) / (self.a.x.width * self.a.x.d))
        ry = float(self.As.get("y", Q_(0, "mm**2")) / (self.a.y.width * self.a.y.d))
        rho = c.given(
            "rho_p",
            min(math.sqrt(rx * ry), 0.02),
            f"√(ρ_x·ρ_y) = √({rx:.5f}·{ry:.5f}), at most 0.02",
            source="EN 1992-1-1 §6.4.4(1)",
        )
        k = c.derive("k_p", c.min(1 + c.sqrt(self._d0(c) / d), 2.0), "size factor")
        fk = fck / Q_(1, "MPa")
        vR = c.derive(
            "v_Rd",
            c.max(0.18 / GAMMA_C * k * (100 * rho * fk) ** (1 / 3), 0.035 * k**1.5 * fk**0.5)
            * 2
            * d
            / a
            * Q_(1, "MPa"),
            "punching resistance at distance a",
            unit="MPa",
            ref="EN 1992-1-1 Eq. (6.50)",
        )
        c.check("Punching", v, vR, ref="EN 1992-1-1 §6.4.4(2)", combination=p.combination)
        V0 = c.given("V_Ed_col", p.V_col, "column load", unit="kN")
        u0 = c.derive("u_0", 2 * (c1 + c2), "column perimeter", unit="mm")
        nu = c.derive("nu", 0.6 * (1 - fk / 250), "strength reduction", ref="EN 1992-1-1 (6.6N)")
        vmax = c.derive(
            "v_Rd_max",
            0.5 * nu * fcd,
            "maximum at the column face",
            unit="MPa",
            ref="EN 1992-1-1 §6.4.5(3)",
        )
        v0 = c.derive("v_Ed_face", V0 / (u0 * d), "stress at the column face", unit="MPa")
        c.check(
            "Punching at the face", v0, vmax, ref="EN 1992-1-1 §6.4.5(3)", combination=p.combination
        )
