"""The clauses of the AISC 360-16 beam check, written once: §B4 compactness, §F2 flexure of
compact doubly symmetric I-shapes (yielding and lateral-torsional buckling) and §G2.1 shear of
webs without transverse stiffeners. Run with a Recorder (numbers) and a SheetRecorder
(working); the resistance and safety factors are those declared in
:data:`calcpack.checks.aisc360.member_data.FACTORS`.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from calcpack.checks.aisc360.ltb_f2 import limiting_lengths_f2, ltb_strength_f2
from calcpack.checks.aisc360.member_data import FACTORS, Factor
from calcpack.checks.aisc360.shape import E_SOURCE, IShape
from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.units import Quantity

if TYPE_CHECKING:
    from calcpack.checks.demand import SegmentMoments

__all__ = ["BeamClauses", "FlexureItem", "cb_formula"]


def cb_formula(M_max: Any, M_A: Any, M_B: Any, M_C: Any) -> Any:
    """C_b = 12.5 M_max / (2.5 M_max + 3 M_A + 4 M_B + 3 M_C), AISC 360-16 Eq. (F1-1).

    Written once: evaluated on quantities for every segment and on sheet values for the
    governing one, so the number checked is the number shown.
    """
    return 12.5 * M_max / (2.5 * M_max + 3 * M_A + 4 * M_B + 3 * M_C)


@dataclass(frozen=True)
class FlexureItem:
    """One flexure demand: a combination on an unbraced segment (or the given M_u)."""

    combination: str | None
    where: str
    Mu: Quantity
    Lb: Quantity
    Cb: float
    Cb_from: SegmentMoments | None = None


def _factor(c: Recorder, f: Factor, lrfd: bool, part: str, what: str) -> Any:
    """The factor of ``f`` for the method, declared on the sheet (φ for LRFD, Ω for ASD)."""
    if lrfd:
        return c.given(f"phi_{part}", f.phi, f"resistance factor, {what}", source=f.clause)
    return c.given(f"Omega_{part}", f.omega, f"safety factor, {what}", source=f.clause)


def _strength(f: Factor, lrfd: bool, nominal: Any) -> Any:
    """φR_n (LRFD) or R_n/Ω (ASD) as a number, with the factor declared in FACTORS."""
    return nominal * f.phi if lrfd else nominal / f.omega


class BeamClauses:
    """The clauses, written once; called with a Recorder (numbers) or a SheetRecorder."""

    def __init__(
        self,
        sec: IShape,
        Fy: Quantity,
        E: Quantity,
        method: str,
        material: str,
        flexure: list[FlexureItem],
        shear: tuple[Quantity, str | None] | None,
        *,
        given_cb: bool,
        on_out_of_scope: str,
        from_analysis: bool = False,
    ) -> None:
        """``from_analysis``: the demands are results of load combinations (recorded as results
        in the manifest), not values given directly (recorded as inputs)."""
        self.from_analysis = from_analysis
        self.sec, self.Fy, self.E, self.method, self.material = sec, Fy, E, method, material
        self.flexure, self.shear = flexure, shear
        self.given_cb = given_cb
        self.on_out = on_out_of_scope

    def __call__(self, c: Recorder) -> None:
        s = self.sec
        lrfd = self.method == "LRFD"
        c.heading("Section and material", 3)
        src = s.source
        d = c.given("d", s.d, "depth", source=src, unit="inch")
        bf = c.given("b_f", s.bf, "flange width", source=src, unit="inch")
        tf = c.given("t_f", s.tf, "flange thickness", source=src, unit="inch")
        tw = c.given("t_w", s.tw, "web thickness", source=src, unit="inch")
        h_tw = c.given("h_tw", s.h_tw, "web slenderness h/t_w", source=src)
        Sx = c.given("S_x", s.Sx, "elastic section modulus", source=src, unit="inch**3")
        Zx = c.given("Z_x", s.Zx, "plastic section modulus", source=src, unit="inch**3")
        Iy = c.given("I_y", s.Iy, "minor-axis second moment", source=src, unit="inch**4")
        ry = c.given("r_y", s.ry, "minor-axis radius of gyration", source=src, unit="inch")
        J = c.given("J", s.J, "torsion constant", source=src, unit="inch**4")
        Cw = c.given("C_w", s.Cw, "warping constant", source=src, unit="inch**6")
        if s.h0 is not None:
            h0 = c.given("h_0", s.h0, "distance between flange centroids", source=src, unit="inch")
        else:
            h0 = c.derive(
                "h_0", d - tf, "distance between flange centroids", unit="inch", ref="d − t_f"
            )
        mat = f" ({self.material})" if self.material else ""
        Fy = c.given(
            "F_y",
            self.Fy,
            f"specified minimum yield stress{mat}",
            source=self.material or "input (steel grade not named)",
            unit="ksi",
        )
        E = c.given(
            "E",
            self.E,
            "modulus of elasticity",
            source=E_SOURCE,
            unit="ksi",
        )
        if self._compact(c, s, bf, tf, h_tw, E, Fy):
            self._flexure(c, Fy, E, Sx, Zx, Iy, ry, J, Cw, h0, lrfd)
        self._shear(c, Fy, E, d, tw, h_tw, lrfd)

    # -- Table B4.1b --------------------------------------------------------------------
    def _compact(
        self, c: Recorder, s: IShape, bf: Any, tf: Any, h_tw: Any, E: Any, Fy: Any
    ) -> bool:
        c.heading("Compactness (Table B4.1b)", 3)
        lam_f = c.derive(
            "lambda_f", bf / (2 * tf), "flange slenderness b_f/2t_f", ref="Table B4.1b case 10"
        )
        lam_pf = c.derive(
            "lambda_pf",
            0.38 * c.sqrt(E / Fy),
            "compact limit, flange",
            ref="AISC 360-16 Table B4.1b case 10",
        )
        flange_ok = c.f(lam_f) <= c.f(lam_pf)
        c.check("Flange compactness", lam_f, lam_pf, ref="AISC 360-16 Table B4.1b case 10")
        lam_pw = c.derive(
            "lambda_pw",
            3.76 * c.sqrt(E / Fy),
            "compact limit, web",
            ref="AISC 360-16 Table B4.1b case 15",
        )
        web_ok = c.f(h_tw) <= c.f(lam_pw)
        c.check("Web compactness", h_tw, lam_pw, ref="AISC 360-16 Table B4.1b case 15")
        if flange_ok and web_ok:
            return True
        part, lam, lim, case = (
            ("flange", lam_f, lam_pf, "10 (λ_p = 0.38√(E/F_y))")
            if not flange_ok
            else ("web", h_tw, lam_pw, "15 (λ_p = 3.76√(E/F_y))")
        )
        msg = (
            f"Section {s.name} has a noncompact or slender {part}: slenderness "
            f"{c.f(lam):.3g} > λ_p = {c.f(lim):.3g} (AISC 360-16 Table B4.1b case {case}); "
            f"§F2 covers compact sections only and §F3-§F5 are not implemented"
        )
        if self.on_out == "refuse":
            raise OutOfScopeError(msg)
        c.not_covered("Flexure", msg, ref="AISC 360-16 §F2")
        return False

    # -- §F2 ----------------------------------------------------------------------------
    def _flexure(
        self,
        c: Recorder,
        Fy: Any,
        E: Any,
        Sx: Any,
        Zx: Any,
        Iy: Any,
        ry: Any,
        J: Any,
        Cw: Any,
        h0: Any,
        lrfd: bool,
    ) -> None:
        items = self.flexure
        if not items:
            return
        c.heading("Flexure, §F2 (doubly symmetric compact I-shape, major axis)", 3)
        Mp = c.derive("M_p", Fy * Zx, "plastic moment", unit="kip*ft", ref="AISC 360-16 Eq. (F2-1)")
        rts = c.derive(
            "r_ts",
            c.sqrt(c.sqrt(Iy * Cw) / Sx),
            "effective radius of gyration",
            unit="inch",
            ref="AISC 360-16 Eq. (F2-7)",
        )
        cc = c.given("c", 1.0, "c for a doubly symmetric I-shape", source="AISC 360-16 Eq. (F2-8a)")
        jt = c.derive(
            "j_t", J * cc / (Sx * h0), "torsion term J·c/(S_x·h_0)", ref="AISC 360-16 Eq. (F2-6)"
        )
        Lp, Lr = limiting_lengths_f2(c, ry=ry, rts=rts, E=E, Fy=Fy, jc=jt)
        f = FACTORS["flexure"]
        factor = _factor(c, f, lrfd, "b", "flexure")

        # every (combination, segment): the numbers, then the governing one shown in full
        rows: list[list[Any]] = []
        best: tuple[float, int] | None = None
        q = c.q
        for i, it in enumerate(items):
            Mn = self._Mn(
                Recorder(c.member), q(Mp), q(Lp), q(Lr), q(rts), q(jt), q(Fy), q(E), q(Sx), it
            )
            cap = _strength(f, lrfd, Mn)
            u = float((it.Mu / cap).to("").magnitude)
            rows.append([it.combination, it.where, it.Mu, it.Cb, cap, round(u, 3)])
            if best is None or u > best[0]:
                best = (u, i)
        assert best is not None
        it = items[best[1]]
        if len(items) > 1:
            cap_name = "φ_b·M_n" if lrfd else "M_n/Ω_b"
            c.table(
                [
                    "Combination",
                    "Segment",
                    "M_u" if lrfd else "M_a",
                    "C_b",
                    cap_name,
                    "Utilisation",
                ],
                rows,
                caption="Flexure for every combination and unbraced "
                "segment (the governing one is worked below)",
            )
        Mn = self._Mn(c, Mp, Lp, Lr, rts, jt, Fy, E, Sx, it)
        if lrfd:
            cap = c.derive(
                "M_c",
                factor * Mn,
                "design flexural strength φ_b·M_n",
                unit="kip*ft",
                ref="AISC 360-16 §F1(1), §B3.1",
            )
        else:
            cap = c.derive(
                "M_c",
                Mn / factor,
                "allowable flexural strength M_n/Ω_b",
                unit="kip*ft",
                ref="AISC 360-16 §F1(1), §B3.2",
            )
        Mu = c.given(
            "M_u" if lrfd else "M_a",
            it.Mu,
            "required flexural strength" + (f", {it.where}" if it.where else ""),
            source=it.combination or "given",
            unit="kip*ft",
            result=self.from_analysis,
        )
        c.check("Flexure", Mu, cap, ref="AISC 360-16 §F2", combination=it.combination)

    def _Mn(
        self,
        c: Recorder,
        Mp: Any,
        Lp: Any,
        Lr: Any,
        rts: Any,
        jt: Any,
        Fy: Any,
        E: Any,
        Sx: Any,
        it: FlexureItem,
    ) -> Any:
        """M_n by §F2.1-F2.2 for one item; returns the handle (quantity or step)."""
        Lb = c.given(
            "L_b",
            it.Lb,
            "unbraced length" + (f", {it.where}" if it.where else ""),
            source="bracing layout",
            unit="ft",
        )
        sm = it.Cb_from
        if sm is not None:
            src = it.combination
            kw: dict[str, Any] = {"source": src, "unit": "kip*ft", "result": True}
            Mmax = c.given("M_max", sm.M_max, "largest |M| on the segment", **kw)
            MA = c.given("M_A", sm.M_A, "|M| at the quarter point", **kw)
            MB = c.given("M_B", sm.M_B, "|M| at the centre", **kw)
            MC = c.given("M_C", sm.M_C, "|M| at the three-quarter point", **kw)
            Cb = c.derive(
                "C_b",
                cb_formula(Mmax, MA, MB, MC),
                "LTB modification factor",
                ref="AISC 360-16 Eq. (F1-1)",
            )
        else:
            Cb = c.given(
                "C_b",
                it.Cb,
                "LTB modification factor",
                source="given" if self.given_cb else "continuous bracing: LTB does not apply",
            )
        Mltb = ltb_strength_f2(
            c, Lb=Lb, Lp=Lp, Lr=Lr, Cb=Cb, Mp=Mp, Fy=Fy, E=E, Sx=Sx, rts=rts, jc=jt
        )
        if Mltb is None:
            return c.derive(
                "M_n",
                Mp,
                "nominal flexural strength (yielding)",
                unit="kip*ft",
                ref="AISC 360-16 Eq. (F2-1)",
            )
        return c.derive(
            "M_n",
            c.min(Mltb, Mp),
            "nominal flexural strength, ≤ M_p",
            unit="kip*ft",
            ref="AISC 360-16 §F2.2",
        )

    # -- §G2.1 --------------------------------------------------------------------------
    def _shear(self, c: Recorder, Fy: Any, E: Any, d: Any, tw: Any, h_tw: Any, lrfd: bool) -> None:
        if self.shear is None:
            return
        c.heading("Shear, §G2.1 (web without transverse stiffeners)", 3)
        if c.f(h_tw) > 260:
            msg = (
                f"Web slenderness h/t_w = {c.f(h_tw):.3g} > 260: webs without transverse "
                "stiffeners are limited to h/t_w ≤ 260 (AISC 360-16 §F13.2 / §G2.1)"
            )
            if self.on_out == "refuse":
                raise OutOfScopeError(msg)
            c.not_covered("Shear", msg, ref="AISC 360-16 §G2.1")
            return
        Aw = c.derive("A_w", d * tw, "web area", unit="inch**2", ref="AISC 360-16 §G2.1")
        lim_a = c.derive(
            "lambda_va", 2.24 * c.sqrt(E / Fy), "limit of §G2.1(a)", ref="AISC 360-16 §G2.1(a)"
        )
        if self.sec.rolled and c.f(h_tw) <= c.f(lim_a):
            c.text("Rolled I-shape with $h/t_w \\le 2.24\\sqrt{E/F_y}$: §G2.1(a) applies.")
            Cv1 = c.given(
                "C_v1", 1.0, "web shear strength coefficient", source="AISC 360-16 Eq. (G2-2)"
            )
            factor = _factor(c, FACTORS["shear rolled I"], lrfd, "v", "shear")
        else:
            kv = c.given(
                "k_v",
                5.34,
                "web plate shear buckling coefficient",
                source="AISC 360-16 §G2.1(b)(2)(i), no transverse stiffeners",
            )
            lim_b = c.derive(
                "lambda_vb",
                1.10 * c.sqrt(kv * E / Fy),
                "limit of Eq. (G2-3)",
                ref="AISC 360-16 Eq. (G2-3)",
            )
            if c.f(h_tw) <= c.f(lim_b):
                Cv1 = c.given(
                    "C_v1", 1.0, "web shear strength coefficient", source="AISC 360-16 Eq. (G2-3)"
                )
            else:
                Cv1 = c.derive(
                    "C_v1",
                    lim_b / h_tw,
                    "web shear strength coefficient",
                    ref="AISC 360-16 Eq. (G2-4)",
                )
            factor = _factor(c, FACTORS["shear"], lrfd, "v", "shear")
        Vn = c.derive(
            "V_n",
            0.6 * Fy * Aw * Cv1,
            "nominal shear strength",
            unit="kip",
            ref="AISC 360-16 Eq. (G2-1)",
        )
        if lrfd:
            cap = c.derive(
                "V_c",
                factor * Vn,
                "design shear strength φ_v·V_n",
                unit="kip",
                ref="AISC 360-16 §G1",
            )
        else:
            cap = c.derive(
                "V_c",
                Vn / factor,
                "allowable shear strength V_n/Ω_v",
                unit="kip",
                ref="AISC 360-16 §G1",
            )
        V, combo = self.shear
        Vd = c.given(
            "V_u" if lrfd else "V_a",
            V,
            "required shear strength (largest |V|)",
            source=combo or "given",
            unit="kip",
            result=self.from_analysis,
        )
        c.check("Shear", Vd, cap, ref="AISC 360-16 §G2.1", combination=combo)
