"""ANSI/AISC 360-16 §F2 flexure and §G2.1 shear of I-shape beams, LRFD and ASD (see the package
docstring for scope and refusals)."""

from __future__ import annotations

import itertools
from collections.abc import Sequence
from typing import Any

from calcpack.checks.aisc360.shape import _TITLE, AISC360_EDITION, E_STEEL, IShape
from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.demand import as_combinations, max_abs, segment_moments
from calcpack.checks.scope import material_in_scope
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require, si

__all__ = ["check_aisc_beam"]


def _standard(method: str) -> Standard:
    return Standard(AISC360_EDITION, _TITLE, method)


def _check_method(method: str) -> str:
    if method not in ("LRFD", "ASD"):
        raise InputError(
            f"Design method must be 'LRFD' or 'ASD' (got method = {method!r})",
            name="method",
            value=method,
            expected="'LRFD' or 'ASD'",
        )
    return method


def _segments(
    L_m: float, braces: Sequence[Quantity] | None, continuous: bool
) -> list[tuple[float, float]]:
    if continuous:
        return [(0.0, L_m)]
    pts = [0.0, L_m]
    for i, b in enumerate(braces or ()):
        x = si(require(b, "[length]", f"braces[{i}]"))
        if not 0.0 <= x <= L_m * (1 + 1e-12):
            raise InputError(
                f"Brace point braces[{i}] must lie on the member, 0 to {L_m:.6g} m (got {b:~P})",
                name=f"braces[{i}]",
                value=b,
                expected=f"0 <= x <= {L_m:.6g} m",
            )
        pts.append(x)
    pts = sorted(set(pts))
    return [(a, c) for a, c in itertools.pairwise(pts) if c - a > 1e-9 * L_m]


def check_aisc_beam(
    section: IShape,
    *,
    Fy: Quantity,
    E: Quantity = E_STEEL,
    method: str = "LRFD",
    member: str = "B1",
    demand: Any = None,
    braces: Sequence[Quantity] | None = None,
    continuous_bracing: bool = False,
    Mu: Quantity | None = None,
    Vu: Quantity | None = None,
    Lb: Quantity | None = None,
    Cb: float | None = None,
    length: Quantity | None = None,
    combination: str | None = None,
    material: str = "",
    on_out_of_scope: str = "refuse",
) -> MemberChecks:
    """Check an I-shape beam to AISC 360-16 §F2 (flexure) and §G2.1 (shear).

    Demands come either from combined beam results (``demand=``: the result of
    :func:`calcpack.combinations.analyse_combinations`, a mapping of combination -> beam result,
    or one result), checked for every combination and unbraced segment, or are given directly
    (``Mu``, ``Vu`` with ``Lb`` and ``Cb``).

    Args:
        section: the :class:`IShape`. Fy: specified minimum yield stress. E: modulus of
            elasticity (default 29 000 ksi, §B2 / common value). method: "LRFD" or "ASD".
        member: member mark. material: e.g. "ASTM A992" (shown with F_y).
        demand: combined results (required LRFD/ASD strength or ASD combinations to match
            ``method``; the engineer chooses the set).
        braces: positions of lateral bracing of the compression flange between the ends (the
            ends are taken as braced); ``continuous_bracing=True`` for a fully braced flange.
        Mu, Vu: required flexural and shear strength (direct use); Lb: unbraced length; Cb:
            lateral-torsional buckling modification factor; length: the member length (checks
            Lb); combination: label of the combination giving Mu, Vu.
        on_out_of_scope: "refuse" (raise) or "not covered" (a NOT COVERED result).

    Raises:
        OutOfScopeError: a noncompact or slender flange or web (names the limit), h/t_w > 260.
        InputError: bad method, unbraced length longer than the member, missing demand.
    """
    method = _check_method(method)
    material_in_scope("AISC 360-16|steel|Fy", "Fy", Fy)
    material_in_scope("AISC 360-16|steel|E", "E", E)
    if on_out_of_scope not in ("refuse", "not covered"):
        raise InputError(
            f"on_out_of_scope must be 'refuse' or 'not covered' (got {on_out_of_scope!r})",
            name="on_out_of_scope",
            value=on_out_of_scope,
            expected="'refuse' or 'not covered'",
        )
    cases: list[tuple[str, Any, float, float]] = []  # (combination, result, a_m, b_m)
    direct: dict[str, Any] | None = None
    if demand is not None:
        kinds = ("strength", "user") if method == "LRFD" else ("allowable stress", "user")
        combos = as_combinations(demand, kinds=kinds, method=f"{AISC360_EDITION} {method}")
        first = next(iter(combos.values()))
        L_m = si(first.beam.length)
        if Lb is not None:
            raise InputError(
                "Give either braces= (with combined results) or Lb= (with Mu, Vu), not Lb with "
                "results: the unbraced segments come from the brace positions",
                name="Lb",
                value=Lb,
                expected="braces=[...] positions",
            )
        for name, r in combos.items():
            for a, b in _segments(L_m, braces, continuous_bracing):
                cases.append((name, r, a, b))
    else:
        if Mu is None and Vu is None:
            raise InputError(
                "No demand given: pass demand= (combined results) or Mu= and/or Vu=",
                name="demand",
                value=None,
                expected="combined results or Mu/Vu quantities",
            )
        if Mu is not None:
            require(Mu, "[force]*[length]", "Mu")
            if Lb is None and not continuous_bracing:
                raise InputError(
                    "Unbraced length Lb is needed with Mu (or continuous_bracing=True)",
                    name="Lb",
                    value=None,
                    expected="a length",
                )
            if Lb is not None:
                require(Lb, "[length]", "Lb", nonnegative=True)
                if length is not None:
                    require(length, "[length]", "length", positive=True)
                    if si(Lb) > si(length) * (1 + 1e-12):
                        raise InputError(
                            f"Unbraced length Lb must not exceed the member length (got Lb = "
                            f"{Lb:~P}, length = {length:~P})",
                            name="Lb",
                            value=Lb,
                            expected=f"Lb <= {length:~P}",
                        )
            if Cb is None and not continuous_bracing:
                raise InputError(
                    "Cb must be given with Mu (use demand= to compute it from the moment "
                    "diagram, or Cb = 1.0 conservatively)",
                    name="Cb",
                    value=None,
                    expected="a number >= 1.0",
                )
            if Cb is not None and (not isinstance(Cb, int | float) or Cb < 1.0 or Cb > 3.0):
                raise InputError(
                    f"Cb must be a number from 1.0 to 3.0 (got Cb = {Cb!r})",
                    name="Cb",
                    value=Cb,
                    expected="1.0 <= Cb <= 3.0",
                )
        if Vu is not None:
            require(Vu, "[force]", "Vu")
        direct = {"Mu": Mu, "Vu": Vu, "Lb": Lb, "Cb": Cb, "combination": combination}
    std = _standard(method)
    logic = _Logic(
        section, Fy, E, method, material, cases, direct, continuous_bracing, on_out_of_scope
    )
    title = f"{section.name} beam to {AISC360_EDITION} §F2 and §G2 ({method})"
    return run_checks(member, title, std, logic)


class _Logic:
    """The clauses, written once; called with a Recorder (numbers) or a SheetRecorder."""

    def __init__(
        self,
        sec: IShape,
        Fy: Quantity,
        E: Quantity,
        method: str,
        material: str,
        cases: list[tuple[str, Any, float, float]],
        direct: dict[str, Any] | None,
        continuous: bool,
        on_out_of_scope: str,
    ) -> None:
        self.sec, self.Fy, self.E, self.method, self.material = sec, Fy, E, method, material
        self.cases, self.direct, self.continuous = cases, direct, continuous
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
            source="AISC 360-16 §B4 / Table B4.1b (E = 29 000 ksi)",
            unit="ksi",
        )

        # -- compactness, Table B4.1b ---------------------------------------------------
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
        in_scope = True
        if not flange_ok or not web_ok:
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
            in_scope = False

        phi_b_text = "AISC 360-16 §F1(1)"
        if in_scope:
            self._flexure(c, Fy, E, Sx, Zx, Iy, ry, J, Cw, h0, lrfd, phi_b_text)
        self._shear(c, Fy, E, d, tw, h_tw, lrfd)

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
        phi_ref: str,
    ) -> None:
        items = self._flexure_items(c)
        if not items:
            return
        c.heading("Flexure, §F2 (doubly symmetric compact I-shape, major axis)", 3)
        Mp = c.derive("M_p", Fy * Zx, "plastic moment", unit="kip*ft", ref="AISC 360-16 Eq. (F2-1)")
        Lp = c.derive(
            "L_p",
            1.76 * ry * c.sqrt(E / Fy),
            "limiting unbraced length, yielding",
            unit="ft",
            ref="AISC 360-16 Eq. (F2-5)",
        )
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
        Lr = c.derive(
            "L_r",
            1.95 * rts * E / (0.7 * Fy) * c.sqrt(jt + c.sqrt(jt**2 + 6.76 * (0.7 * Fy / E) ** 2)),
            "limiting unbraced length, inelastic LTB",
            unit="ft",
            ref="AISC 360-16 Eq. (F2-6)",
        )
        if lrfd:
            factor = c.given("phi_b", 0.90, "resistance factor, flexure", source=phi_ref)
        else:
            factor = c.given("Omega_b", 1.67, "safety factor, flexure", source=phi_ref)

        # every (combination, segment): the numbers, then the governing one shown in full
        rows: list[list[Any]] = []
        best: tuple[float, int] | None = None
        for i, it in enumerate(items):
            Mn = self._Mn(
                Recorder(c.member),
                c.q(Mp),
                c.q(Lp),
                c.q(Lr),
                c.q(rts),
                c.q(jt),
                c.q(Fy),
                c.q(E),
                c.q(Sx),
                it,
            )
            cap = Mn * 0.90 if lrfd else Mn / 1.67
            u = float((it["Mu"] / cap).to("").magnitude)
            rows.append([it["combination"], it["where"], it["Mu"], it["Cb"], cap, round(u, 3)])
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
            it["Mu"],
            "required flexural strength" + (f", {it['where']}" if it["where"] else ""),
            source=it["combination"] or "given",
            unit="kip*ft",
            result=self.direct is None,
        )
        c.check("Flexure", Mu, cap, ref="AISC 360-16 §F2", combination=it["combination"])

    def _flexure_items(self, c: Recorder) -> list[dict[str, Any]]:
        items: list[dict[str, Any]] = []
        if self.direct is not None:
            if self.direct["Mu"] is None:
                return []
            items.append(
                {
                    "combination": self.direct["combination"],
                    "where": "",
                    "Mu": self.direct["Mu"].to("kip*ft"),
                    "Lb": self.direct["Lb"] if not self.continuous else Q_(0.0, "ft"),
                    "Cb": self.direct["Cb"] if self.direct["Cb"] is not None else 1.0,
                    "Cb_from": None,
                }
            )
            return items
        for name, r, a, b in self.cases:
            if self.continuous:
                Mmax, _ = max_abs(r, "moment")
                items.append(
                    {
                        "combination": name,
                        "where": "continuously braced",
                        "Mu": Mmax.to("kip*ft"),
                        "Lb": Q_(0.0, "ft"),
                        "Cb": 1.0,
                        "Cb_from": None,
                    }
                )
                continue
            sm = segment_moments(r, a, b)
            den = 2.5 * sm.M_max + 3 * sm.M_A + 4 * sm.M_B + 3 * sm.M_C
            Cb = 1.0 if den.magnitude == 0 else float((12.5 * sm.M_max / den).to("").magnitude)
            items.append(
                {
                    "combination": name,
                    "where": f"segment x = {sm.start.to('ft'):~.4g} to {sm.end.to('ft'):~.4g}",
                    "Mu": sm.M_max.to("kip*ft"),
                    "Lb": (sm.end - sm.start).to("ft"),
                    "Cb": Cb,
                    "Cb_from": sm,
                }
            )
        return items

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
        it: dict[str, Any],
    ) -> Any:
        """M_n by §F2.1-F2.2 for one item; returns the handle (quantity or step)."""
        Lb = c.given(
            "L_b",
            it["Lb"],
            "unbraced length" + (f", {it['where']}" if it["where"] else ""),
            source="bracing layout",
            unit="ft",
        )
        sm = it["Cb_from"]
        if sm is not None:
            Mmax = c.given(
                "M_max",
                sm.M_max,
                "largest |M| on the segment",
                source=it["combination"],
                unit="kip*ft",
                result=True,
            )
            MA = c.given(
                "M_A",
                sm.M_A,
                "|M| at the quarter point",
                source=it["combination"],
                unit="kip*ft",
                result=True,
            )
            MB = c.given(
                "M_B",
                sm.M_B,
                "|M| at the centre",
                source=it["combination"],
                unit="kip*ft",
                result=True,
            )
            MC = c.given(
                "M_C",
                sm.M_C,
                "|M| at the three-quarter point",
                source=it["combination"],
                unit="kip*ft",
                result=True,
            )
            Cb = c.derive(
                "C_b",
                12.5 * Mmax / (2.5 * Mmax + 3 * MA + 4 * MB + 3 * MC),
                "LTB modification factor",
                ref="AISC 360-16 Eq. (F1-1)",
            )
        else:
            Cb = c.given(
                "C_b",
                it["Cb"],
                "LTB modification factor",
                source="given"
                if self.direct is not None and not self.continuous
                else "continuous bracing: LTB does not apply",
            )
        if c.q(Lb) <= c.q(Lp):
            c.text("$L_b \\le L_p$: lateral-torsional buckling does not apply (§F2.2(a)).")
            return c.derive(
                "M_n",
                Mp,
                "nominal flexural strength (yielding)",
                unit="kip*ft",
                ref="AISC 360-16 Eq. (F2-1)",
            )
        if c.q(Lb) <= c.q(Lr):
            Mltb = c.derive(
                "M_n_LTB",
                Cb * (Mp - (Mp - 0.7 * Fy * Sx) * ((Lb - Lp) / (Lr - Lp))),
                "inelastic lateral-torsional buckling",
                unit="kip*ft",
                ref="AISC 360-16 Eq. (F2-2)",
            )
        else:
            Fcr = c.derive(
                "F_cr",
                Cb * c.pi**2 * E / (Lb / rts) ** 2 * c.sqrt(1 + 0.078 * jt * (Lb / rts) ** 2),
                "critical stress, elastic LTB",
                unit="ksi",
                ref="AISC 360-16 Eq. (F2-4)",
            )
            Mltb = c.derive(
                "M_n_LTB",
                Fcr * Sx,
                "elastic lateral-torsional buckling",
                unit="kip*ft",
                ref="AISC 360-16 Eq. (F2-3)",
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
        if self.direct is not None and self.direct["Vu"] is None:
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
            factor = (
                c.given("phi_v", 1.00, "resistance factor, shear", source="AISC 360-16 §G2.1(a)")
                if lrfd
                else c.given("Omega_v", 1.50, "safety factor, shear", source="AISC 360-16 §G2.1(a)")
            )
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
            factor = (
                c.given("phi_v", 0.90, "resistance factor, shear", source="AISC 360-16 §G1")
                if lrfd
                else c.given("Omega_v", 1.67, "safety factor, shear", source="AISC 360-16 §G1")
            )
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
        if self.direct is not None:
            V, combo = self.direct["Vu"], self.direct["combination"]
        else:
            best = None
            for name, r, _a, _b in self.cases:
                v, _ = max_abs(r, "shear")
                if best is None or v > best[0]:
                    best = (v, name)
            assert best is not None
            V, combo = best
        Vd = c.given(
            "V_u" if lrfd else "V_a",
            V,
            "required shear strength (largest |V|)",
            source=combo or "given",
            unit="kip",
            result=self.direct is None,
        )
        c.check("Shear", Vd, cap, ref="AISC 360-16 §G2.1", combination=combo)
