"""Pad footings to EN 1997-1:2004 (Eurocode 7), Design Approach 1: bearing and sliding (GEO).

Design Approach 1 checks two combinations of partial factor sets (§2.4.7.3.4.2, Annex A):

* Combination 1: A1 "+" M1 "+" R1 -- actions γ_G = 1.35 (1.0 favourable), γ_Q = 1.5; soil
  strengths unfactored;
* Combination 2: A2 "+" M2 "+" R1 -- actions γ_G = 1.0, γ_Q = 1.3; γ_φ' = 1.25 on tan φ',
  γ_c' = 1.25, γ_cu = 1.4;

with R1: γ_R;v = γ_R;h = 1.0 for spread foundations (Tables A.3, A.4, A.5). The UK National
Annex to BS EN 1997-1 adopts DA1 with these values (from memory; confirm against the annex).
Loads by case are combined by EN 1990 Eq. (6.10) with these γ values
(:func:`da1_combinations`); the footing and soil weight are permanent, with the factor of G.

Bearing resistance by Annex D on the effective area A' = B'·L' (B' = B − 2e_B, L' = L − 2e_L,
§6.5.4, D.1): drained (D.4) R/A' = c'·Nc·bc·sc·ic + q'·Nq·bq·sq·iq + ½·γ'·B'·Nγ·bγ·sγ·iγ, with
Nq = e^(π tan φ')·tan²(45° + φ'/2), Nc = (Nq − 1)·cot φ', Nγ = 2·(Nq − 1)·tan φ' (rough base),
sq = 1 + (B'/L')·sin φ', sγ = 1 − 0.3·B'/L', sc = (sq·Nq − 1)/(Nq − 1), iq = (1 − H/(V + A'c'
cot φ'))^m, iγ = (...)^(m+1), ic = iq − (1 − iq)/(Nc tan φ'), m = (2 + B'/L')/(1 + B'/L')
(H along B; m_L along L); undrained (D.3) R/A' = (π + 2)·cu·bc·sc·ic + q, sc = 1 + 0.2·B'/L',
ic = ½·(1 + √(1 − H/(A'·cu))). Base inclination factors are 1 (level base; sloping ground is
refused by :class:`~calcpack.foundations.SiteConditions`). A round footing is taken as the
square of equal area (common practice). Or a presumed bearing value (§2.5, e.g. BS 8004) is
compared with the characteristic pressure V/A'.

Sliding (§6.5.3): drained R_d = V'_d·tan δ_d with δ_d = φ'_d (cast in situ, §6.5.3(10), the
soil's φ' taken as φ'_cv); undrained R_d = A'·cu;d. Permanent actions favourable (γ_G = 1.0).

These checks implement EN 1997-1:2004 with the recommended values; their provisions must be
confirmed against the edition and National Annex adopted locally.
"""

from __future__ import annotations

import functools
import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, replace
from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.en1990 import Psi, en1990_combinations
from calcpack.combinations.model import CombinationSet
from calcpack.foundations.geometry import GEOTECHNICAL_CAUTION, Footing, FootingLoad
from calcpack.foundations.stability import FootingCombination, footing_combinations
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, required, within

__all__ = [
    "DA1_FACTORS",
    "EN1997",
    "PresumedBearing",
    "SoilStrength",
    "check_en1997_pad",
    "da1_combinations",
]

EN1997 = Standard("EN 1997-1:2004", "Eurocode 7: Geotechnical design, Part 1, Design Approach 1")


@dataclass(frozen=True)
class _Set:
    name: str
    gamma_G: float
    gamma_G_inf: float
    gamma_Q: float
    gamma_phi: float
    gamma_c: float
    gamma_cu: float
    gamma_Rv: float
    gamma_Rh: float


DA1_FACTORS: dict[str, _Set] = {
    # EN 1997-1 Tables A.3 (A1, A2), A.4 (M1, M2), A.5 (R1): recommended values
    "DA1-1": _Set("DA1 Combination 1 (A1 + M1 + R1)", 1.35, 1.0, 1.5, 1.0, 1.0, 1.0, 1.0, 1.0),
    "DA1-2": _Set("DA1 Combination 2 (A2 + M2 + R1)", 1.0, 1.0, 1.3, 1.25, 1.25, 1.4, 1.0, 1.0),
}


def da1_combinations(
    variable: Mapping[str, str | Psi], permanent: Sequence[str] = ("G",)
) -> dict[str, CombinationSet]:
    """The EN 1990 Eq. (6.10) combinations with the A1 and A2 factors of DA1.

    Args:
        variable: variable case -> EN 1990 Table A1.1 category (``{"Q": "A", "S": "snow"}``).
        permanent: the permanent cases.
    """
    out = {}
    for key, s in DA1_FACTORS.items():
        out[key] = en1990_combinations(
            variable=variable,
            permanent=permanent,
            gamma_G_sup=s.gamma_G,
            gamma_G_inf=s.gamma_G_inf,
            gamma_Q=s.gamma_Q,
        )
    return out


@dataclass(frozen=True)
class SoilStrength:
    """Characteristic soil strength below the footing, from the geotechnical report.

    Args:
        condition: ``"drained"`` (φ'_k, c'_k) or ``"undrained"`` (c_u,k).
        gamma: unit weight of the soil below the base [force/volume] (effective if the water
            table is within about B of the base). gamma_over: unit weight of the soil above the
            base level (default gamma), for the overburden q = γ·D.
        phi_k: φ'_k [angle] (drained). c_k: c'_k [pressure] (drained, default 0). cu_k: c_u,k
            [pressure] (undrained). source: where the values come from.
    """

    condition: Literal["drained", "undrained"]
    gamma: Quantity
    source: str
    phi_k: Quantity | None = None
    c_k: Quantity | None = None
    cu_k: Quantity | None = None
    gamma_over: Quantity | None = None

    def __post_init__(self) -> None:
        one_of("condition", self.condition, ("drained", "undrained"))
        positive("gamma", dimension("gamma", self.gamma, "[force]/[length]**3"))
        if self.gamma_over is not None:
            positive("gamma_over", dimension("gamma_over", self.gamma_over, "[force]/[length]**3"))
        if self.condition == "drained":
            required(
                "phi_k", self.phi_k, expected="an angle such as 30 degree", when="when drained"
            )
            within(
                "phi_k",
                dimension("phi_k", self.phi_k, "degree"),
                Q_(15, "degree"),
                Q_(45, "degree"),
                rule="Annex D factors are used for 15° to 45° here",
            )
            if self.c_k is not None:
                positive("c_k", dimension("c_k", self.c_k, "[pressure]"), allow_zero=True)
        else:
            required("cu_k", self.cu_k, expected="a pressure such as 60 kPa", when="when undrained")
            positive("cu_k", dimension("cu_k", self.cu_k, "[pressure]"))


@dataclass(frozen=True)
class PresumedBearing:
    """A presumed bearing value with its source (compared with characteristic pressure)."""

    q: Quantity
    source: str

    def __post_init__(self) -> None:
        positive("q", dimension("q", self.q, "[pressure]"))


def _sq(footing: Footing) -> Footing:
    if footing.shape != "round":
        return footing
    return replace(
        footing, shape="square", B=(footing.area**0.5).to(footing.B.units), L=None, kind="pad"
    )


def check_en1997_pad(
    footing: Footing,
    loads: Mapping[str, FootingLoad],
    variable: Mapping[str, str | Psi],
    soil: SoilStrength | PresumedBearing,
    *,
    permanent: Sequence[str] = ("G",),
) -> MemberChecks:
    """Bearing and sliding resistance of a pad footing to EN 1997-1 DA1 (both combinations),
    or the characteristic pressure against a presumed bearing value.

    Args:
        footing: the footing. loads: case -> load at the top of the footing ("G", "Q"...).
        variable: variable case -> EN 1990 Table A1.1 category. soil: :class:`SoilStrength`
            or :class:`PresumedBearing`. permanent: the permanent cases (weights join them).
    """
    f = _sq(footing)
    sets = {
        k: (DA1_FACTORS[k], footing_combinations(f, loads, cs, self_weight_case=permanent[0]))
        for k, cs in da1_combinations(variable, permanent).items()
    }
    char = footing_combinations(
        f,
        loads,
        CombinationSet("characteristic", "user", (_char_combo(list(loads)),), strict=False),
        self_weight_case=permanent[0],
    )
    logic = _EC7Logic(footing, f, sets, char, soil, loads, permanent)
    return run_checks(
        footing.mark, "pad footing, geotechnical resistance to EN 1997-1 (DA1)", EN1997, logic
    )


def _char_combo(cases: list[str]) -> Any:
    from calcpack.combinations.model import LoadCombination

    return LoadCombination("characteristic", dict.fromkeys(cases, 1.0), "EN 1990 Eq. (6.14b)")


class _EC7Logic:
    def __init__(
        self,
        orig: Footing,
        f: Footing,
        sets: dict[str, tuple[_Set, list[FootingCombination]]],
        char: list[FootingCombination],
        soil: SoilStrength | PresumedBearing,
        loads: Mapping[str, FootingLoad],
        permanent: Sequence[str],
    ) -> None:
        self.orig, self.f, self.sets, self.char, self.soil = orig, f, sets, char, soil
        self.loads, self.permanent = loads, permanent

    def __call__(self, c: Recorder) -> None:
        c.caution(GEOTECHNICAL_CAUTION)
        if self.orig.shape == "round":
            c.assume("The round footing is taken as the square of equal area (common practice).")
        if isinstance(self.soil, PresumedBearing):
            self._presumed(c, self.soil)
            return
        soil = self.soil
        for key, (s, combos) in self.sets.items():
            live = [k for k in combos if k.N.magnitude > 0 and not k.overturns]
            c.heading(f"{s.name}: bearing resistance (Annex D, {soil.condition})", 3)
            if not live:
                c.not_covered(f"Bearing {key}", "no combination presses the footing on the soil")
                continue
            worst = max(live, key=lambda k: self._ratio(k, s))
            self._bearing(c, key, s, worst)
        self._sliding(c)

    # -- numbers ----------------------------------------------------------------------------
    def _effective(self, k: FootingCombination) -> tuple[Quantity, Quantity, Quantity, Quantity]:
        f = self.f
        eB = abs(k.My_base / k.N).to("m")
        eL = abs(k.Mx_base / k.N).to("m")
        Bp = (f.B - 2 * eB).to("m")
        Lp = (f.length - 2 * eL).to("m")
        return eB, eL, Bp, Lp

    def _ratio(self, k: FootingCombination, s: _Set) -> float:
        rec = Recorder(self.f.mark)
        R = self._resistance(rec, s, k)
        if R is None:
            return math.inf
        return float(k.N / rec.q(R))

    def _resistance(self, c: Recorder, s: _Set, k: FootingCombination) -> Any:
        """Works the Annex D resistance on ``c``; None when the effective area vanishes."""
        soil = self.soil
        assert isinstance(soil, SoilStrength)
        f = self.f
        eB, eL, Bp_, Lp_ = self._effective(k)
        if Bp_.magnitude <= 0 or Lp_.magnitude <= 0:
            return None
        swap = Lp_ < Bp_
        B = c.given("B_f", f.B, "footing width", unit="m")
        L = c.given("L_f", f.length, "footing length", unit="m")
        V = c.given("V_d", k.N, f"design vertical load, {k.name}", unit="kN")
        MB = c.given("M_B", abs(k.My_base), "design moment at the base (across B)", unit="kN*m")
        ML = c.given("M_L", abs(k.Mx_base), "design moment at the base (across L)", unit="kN*m")
        eBd = c.derive("e_B", MB / V, "eccentricity along B", unit="m")
        eLd = c.derive("e_L", ML / V, "eccentricity along L", unit="m")
        B1 = c.derive("B_1", B - 2 * eBd, "effective size along B", unit="m", ref="EN 1997-1 D.1")
        L1 = c.derive("L_1", L - 2 * eLd, "effective size along L", unit="m", ref="EN 1997-1 D.1")
        Bp, Lp = (L1, B1) if swap else (B1, L1)
        Ap = c.derive("A_prime", B1 * L1, "effective area", unit="m**2", ref="EN 1997-1 D.1")
        Hx, Hy = k.load.Vx, k.load.Vy
        H = c.given("H_d", ((Hx**2 + Hy**2) ** 0.5).to("kN"), "design horizontal load", unit="kN")
        D = c.given("D", f.depth, "depth of the base below the surface", unit="m")
        g_over = soil.gamma_over if soil.gamma_over is not None else soil.gamma
        go = c.given(
            "gamma_o", g_over, "unit weight above the base", source=soil.source, unit="kN/m**3"
        )
        q = c.derive("q_o", go * D, "overburden pressure at the base level", unit="kPa")
        if soil.condition == "undrained":
            assert soil.cu_k is not None
            cuk = c.given(
                "c_u_k",
                soil.cu_k,
                "characteristic undrained strength",
                source=soil.source,
                unit="kPa",
            )
            gcu = c.given(
                "gamma_cu", s.gamma_cu, "partial factor on c_u", source="EN 1997-1 Table A.4"
            )
            cu = c.derive("c_u_d", cuk / gcu, "design undrained strength", unit="kPa")
            sc = c.derive("s_c", 1 + 0.2 * Bp / Lp, "shape factor", ref="EN 1997-1 D.3")
            ratio = float(c.q(H) / (c.q(Ap) * c.q(cu)))
            if ratio >= 1:
                return None
            ic = c.derive(
                "i_c",
                0.5 * (1 + c.sqrt(1 - H / (Ap * cu))),
                "inclination factor",
                ref="EN 1997-1 D.3",
            )
            Rk = c.derive(
                "R_A",
                (c.pi + 2) * cu * sc * ic + q,
                "resistance per unit effective area",
                unit="kPa",
                ref="EN 1997-1 Eq. (D.1)",
            )
        else:
            assert soil.phi_k is not None
            phik = c.given(
                "phi_k",
                soil.phi_k,
                "characteristic angle of shearing resistance",
                source=soil.source,
                unit="degree",
            )
            c.given(
                "gamma_phi", s.gamma_phi, "partial factor on tan φ'", source="EN 1997-1 Table A.4"
            )
            phi_d = math.atan(math.tan(c.q(phik).to("radian").magnitude) / s.gamma_phi)
            phi = c.given(
                "phi_d",
                Q_(math.degrees(phi_d), "degree"),
                "design angle atan(tan φ'_k / γ_φ')",
                unit="degree",
            )
            ck = c.given(
                "c_k",
                soil.c_k if soil.c_k is not None else Q_(0, "kPa"),
                "characteristic effective cohesion",
                source=soil.source,
                unit="kPa",
            )
            gc = c.given(
                "gamma_c_s", s.gamma_c, "partial factor on c'", source="EN 1997-1 Table A.4"
            )
            cd = c.derive("c_d", ck / gc, "design effective cohesion", unit="kPa")
            t, sn = math.tan(phi_d), math.sin(phi_d)
            Nq = c.given(
                "N_q",
                math.exp(math.pi * t) * math.tan(math.pi / 4 + phi_d / 2) ** 2,
                "e^(π tan φ')·tan²(45° + φ'/2)",
                source="EN 1997-1 D.4",
            )
            Nc = c.derive("N_c", (Nq - 1) / t, "(N_q − 1)·cot φ'", ref="EN 1997-1 D.4")
            Ng = c.derive(
                "N_gamma", 2 * (Nq - 1) * t, "2·(N_q − 1)·tan φ' (rough base)", ref="EN 1997-1 D.4"
            )
            sq = c.derive("s_q", 1 + Bp / Lp * sn, "shape factor", ref="EN 1997-1 D.4")
            sg = c.derive("s_gamma", 1 - 0.3 * Bp / Lp, "shape factor", ref="EN 1997-1 D.4")
            sc = c.derive("s_c", (sq * Nq - 1) / (Nq - 1), "shape factor", ref="EN 1997-1 D.4")
            # H along B' or L': m by the angle of H (D.4)
            theta = math.atan2(abs(float(Hx.to("kN").magnitude)), abs(float(Hy.to("kN").magnitude)))
            if swap:
                theta = math.pi / 2 - theta
            r = float(c.q(Bp) / c.q(Lp))
            mB, mL = (2 + r) / (1 + r), (2 + 1 / r) / (1 + 1 / r)
            m = c.given(
                "m",
                mL * math.cos(theta) ** 2 + mB * math.sin(theta) ** 2,
                "inclination exponent for the direction of H",
                source="EN 1997-1 D.4",
            )
            base = c.derive("k_H", 1 - H / (V + Ap * cd / t), "1 − H/(V + A'·c'·cot φ')")
            if c.f(base) <= 0:
                return None
            iq = c.derive("i_q", base**m, "inclination factor", ref="EN 1997-1 D.4")
            ig = c.derive("i_gamma", base ** (m + 1), "inclination factor", ref="EN 1997-1 D.4")
            ic = c.derive(
                "i_c", iq - (1 - iq) / (Nc * t), "inclination factor", ref="EN 1997-1 D.4"
            )
            gb = c.given(
                "gamma_b",
                soil.gamma,
                "unit weight below the base",
                source=soil.source,
                unit="kN/m**3",
            )
            Rk = c.derive(
                "R_A",
                cd * Nc * sc * ic + q * Nq * sq * iq + 0.5 * gb * Bp * Ng * sg * ig,
                "resistance per unit effective area",
                unit="kPa",
                ref="EN 1997-1 Eq. (D.2)",
            )
            del phi, eB, eL
        gR = c.given(
            "gamma_R_v", s.gamma_Rv, "partial resistance factor", source="EN 1997-1 Table A.5 (R1)"
        )
        return c.derive("R_d", Rk * Ap / gR, "design bearing resistance", unit="kN")

    # -- working ----------------------------------------------------------------------------
    def _bearing(self, c: Recorder, key: str, s: _Set, k: FootingCombination) -> None:
        R = self._resistance(c, s, k)
        if R is None:
            c.check(
                f"Bearing {key}",
                k.N,
                Q_(1e-9, "kN"),
                ref="EN 1997-1 §6.5.2",
                combination=k.name,
                description="the effective area or inclination leaves no resistance",
            )
            return
        c.check(
            f"Bearing {key}",
            c.q(k.N).to("kN"),
            R,
            ref="EN 1997-1 §6.5.2, Eq. (6.1)",
            combination=k.name,
        )

    def _sliding(self, c: Recorder) -> None:
        soil = self.soil
        assert isinstance(soil, SoilStrength)
        if all(
            k.load.Vx.magnitude == 0 and k.load.Vy.magnitude == 0
            for _, combos in self.sets.values()
            for k in combos
        ):
            return
        for key, (s, combos) in self.sets.items():
            c.heading(f"{s.name}: sliding", 3)

            k = max(combos, key=functools.partial(self._slide_ratio, s))
            Hd = c.given(
                f"H_d_{key.replace('-', '_')}",
                self._H(k),
                f"design horizontal load, {k.name}",
                unit="kN",
            )
            V = c.given(
                f"V_fav_{key.replace('-', '_')}",
                max(self._fav_V(s, k), Q_(0, "kN")),
                "vertical load, permanent actions favourable (γ_G = 1.0)",
                unit="kN",
            )
            if soil.condition == "drained":
                assert soil.phi_k is not None
                dd = math.atan(math.tan(soil.phi_k.to("radian").magnitude) / s.gamma_phi)
                td = c.given(
                    "tan_delta_d",
                    math.tan(dd),
                    "tan δ_d, δ_d = φ'_d (cast in situ)",
                    source="EN 1997-1 §6.5.3(10)",
                )
                R = c.derive(
                    f"R_h_{key.replace('-', '_')}",
                    V * td / s.gamma_Rh,
                    "design sliding resistance",
                    unit="kN",
                    ref="EN 1997-1 Eq. (6.3a)",
                )
            else:
                assert soil.cu_k is not None
                _, _, Bp, Lp = self._effective(k)
                Ap = (Bp * Lp).to("m**2")
                cu = soil.cu_k / s.gamma_cu
                R = c.given(
                    f"R_h_{key.replace('-', '_')}",
                    (Ap * cu).to("kN"),
                    "A'·c_u;d on the effective area",
                    source="EN 1997-1 Eq. (6.4a)",
                    unit="kN",
                )
            if c.q(R).magnitude <= 0:
                R = c.given("R_h_min", Q_(1e-9, "kN"), "no sliding resistance", unit="kN")
            c.check(f"Sliding {key}", Hd, R, ref="EN 1997-1 §6.5.3, Eq. (6.2)", combination=k.name)

    def _fav_V(self, s: _Set, k: FootingCombination) -> Quantity:
        """Vertical load with the permanent actions favourable (γ_G,inf); downward variable
        loads ignored, upward ones kept."""
        V = s.gamma_G_inf * (self.f.concrete_weight + self.f.soil_weight)
        for case, fac in k.combination.factors.items():
            P = self.loads[case].P
            if case in self.permanent:
                V = V + s.gamma_G_inf * P
            elif P.magnitude < 0:
                V = V + fac * P
        return V.to("kN")

    @staticmethod
    def _H(k: FootingCombination) -> Quantity:
        return ((k.load.Vx**2 + k.load.Vy**2) ** 0.5).to("kN")

    def _slide_ratio(self, s: _Set, k: FootingCombination) -> float:
        V = self._fav_V(s, k)
        return math.inf if V.magnitude <= 0 else float(self._H(k) / V)

    def _presumed(self, c: Recorder, p: PresumedBearing) -> None:
        c.heading("Presumed bearing value (characteristic loads)", 3)
        live = [k for k in self.char if k.N.magnitude > 0 and not k.overturns]
        if not live:
            c.not_covered("Presumed bearing", "no characteristic combination presses the soil")
            return
        k = live[0]
        eB, eL, Bp, Lp = self._effective(k)
        qa = c.given("q_p", p.q, "presumed bearing value", source=p.source, unit="kPa")
        V = c.given("V_k", k.N, "characteristic vertical load (all cases, self weight)", unit="kN")
        B1 = c.given("B_1", Bp, "effective width B − 2e_B", unit="m")
        L1 = c.given("L_1", Lp, "effective length L − 2e_L", unit="m")
        q = c.derive(
            "q_k",
            V / (B1 * L1),
            "average pressure on the effective area",
            unit="kPa",
            ref="EN 1997-1 §6.5.2.2, D.1",
        )
        c.check("Presumed bearing", q, qa, ref=f"EN 1997-1 §2.5; {p.source}", combination=k.name)
        del eB, eL
