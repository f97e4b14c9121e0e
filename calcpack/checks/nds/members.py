"""NDS 2018 (ASD) checks of wood members under axial force and bending: posts, studs, columns,
hangers and beam-columns of sawn lumber, timbers, glulam and structural composite lumber.

* tension parallel to grain §3.8 (F'_t = F_t C_D C_M C_t C_F C_i);
* compression parallel to grain §3.6-§3.7 with the column stability factor C_P (Eq. 3.7-1,
  c = 0.8 sawn lumber, 0.9 glulam and SCL; ℓ_e/d ≤ 50, §3.7.1.4), built-up columns §15.3
  (K_f = 0.6 nailed, 0.75 bolted, on buckling about the weak axis of the laminations);
* bending §3.3 about the strong axis with C_L (§3.3.3) or, for glulam, the lesser of C_L and
  the volume factor C_V (§5.3.6, x = 10), and about the weak axis;
* bending and axial tension §3.9.1 (Eq. 3.9-1, 3.9-2); bending and axial compression §3.9.2
  (Eq. 3.9-3, biaxial) with an eccentric load on the strong axis by Eq. (15.4-1) (e₂ = 0).

Assumed and stated on the sheet: sustained temperature ≤ 100 °F (C_t = 1.0), not incised
(C_i = 1.0). Wet service factors are those of Table 4A for dimension lumber and Table 4D for
timbers (``refdata/nds_2018_wet_service.csv``); glulam and SCL in wet service are refused.
Provisions should be confirmed against the edition adopted locally.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.factors import (
    _TITLE,
    DURATION_FACTORS,
    NDS_EDITION,
    beam_stability_factor,
    effective_length,
    wet_service_factor,
    wet_service_source,
    wet_table,
)
from calcpack.checks.nds.values import TimberValues
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of, positive_fields, within

__all__ = ["TimberForces", "TimberMember", "check_nds_member", "column_stability_factor"]

BuiltUp = Literal["nailed", "bolted"]


def column_stability_factor(FcE_over_Fc_star: float, c: float) -> float:
    """C_P by NDS 2018 Eq. (3.7-1) for α = F_cE/F*_c and the column parameter c."""
    a = FcE_over_Fc_star
    h = (1 + a) / (2 * c)
    return float(h - (h**2 - a / c) ** 0.5)


@dataclass(frozen=True)
class TimberMember:
    """A rectangular wood member.

    Args:
        values: reference design values (:func:`nds_sawn_values`, :func:`nds_glulam_values`,
            or :class:`TimberValues` for SCL with its source).
        b, d: actual cross-section sizes; d is the depth for strong-axis bending (d ≥ b).
        le_d, le_b: effective column lengths for buckling across d and across b (K_e ℓ, §3.7.1).
        lu: unsupported length of the compression edge for C_L (None: braced, C_L = 1.0).
        loading: the load case of Table 3.3.3 for ℓ_e of the beam ("uniform", "center point",
            "cantilever uniform", "any").
        duration: load duration of Table 2.3.2 ("permanent", "ten years", "two months",
            "seven days", "ten minutes", "impact").
        wet: moisture content in service above 19 % (dimension lumber, Table 4A, or timbers,
            Table 4D; glulam and SCL refused).
        CF_b, CF_t, CF_c: size factors for F_b, F_t, F_c (1.0 default) and CF_source.
        built_up: "nailed" or "bolted" for a column of laminations (§15.3); None: solid.
        L_beam: glulam only, length between points of zero moment for C_V.
    """

    values: TimberValues
    b: Quantity
    d: Quantity
    le_d: Quantity | None = None
    le_b: Quantity | None = None
    lu: Quantity | None = None
    loading: str = "any"
    duration: str = "ten years"
    wet: bool = False
    CF_b: float = 1.0
    CF_t: float = 1.0
    CF_c: float = 1.0
    CF_source: str = "no size adjustment given (C_F = 1.0)"
    built_up: BuiltUp | None = None
    L_beam: Quantity | None = None

    def __post_init__(self) -> None:
        require(self.b, "[length]", "b", positive=True)
        require(self.d, "[length]", "d", positive=True)
        within("b", self.b, hi=self.d, rule="b is the smaller side; d the depth (d ≥ b)")
        positive_fields(self, "[length]", ("le_d", "le_b", "lu", "L_beam"), optional=True)
        one_of("duration", self.duration, list(DURATION_FACTORS))
        one_of("loading", self.loading, ("uniform", "center point", "cantilever uniform", "any"))
        if self.built_up is not None:
            one_of("built_up", self.built_up, ("nailed", "bolted"))
        for nm in ("CF_b", "CF_t", "CF_c"):
            within(nm, float(getattr(self, nm)), 0.5, 1.6, rule="NDS Supplement size factors")
        if self.wet:
            wet_table(self.values.product)  # refuses glulam and SCL


@dataclass(frozen=True)
class TimberForces:
    """Axial force and moments of one ASD load combination.

    Sign convention: P positive in compression, negative in tension. M_d bends about the
    strong axis (stress across d), M_b about the weak axis. e_d: eccentricity of P along d
    (Eq. 15.4-1).
    """

    P: Quantity = Q_(0.0, "lbf")  # noqa: RUF009 - immutable pint quantity
    M_d: Quantity = Q_(0.0, "lbf*ft")  # noqa: RUF009 - immutable pint quantity
    M_b: Quantity = Q_(0.0, "lbf*ft")  # noqa: RUF009 - immutable pint quantity
    e_d: Quantity = Q_(0.0, "inch")  # noqa: RUF009 - immutable pint quantity
    combination: str | None = None

    def __post_init__(self) -> None:
        require(self.P, "[force]", "P")
        require(self.M_d, "[force]*[length]", "M_d")
        require(self.M_b, "[force]*[length]", "M_b")
        require(self.e_d, "[length]", "e_d", nonnegative=True)


def _wet(prop: str, product: str, wet: bool, ref_cf: float) -> float:
    # NDS Supplement 2018 Table 4A (dimension lumber) or 4D (timbers), wet service factors
    if not wet:
        return 1.0
    F_CF = Q_(ref_cf, "psi")
    return wet_service_factor(prop, wet=True, Fb_CF=F_CF, Fc_CF=F_CF, table=wet_table(product))


def _wet_source(member: TimberMember) -> str:
    if not member.wet:
        return "dry service, MC ≤ 19 % (C_M = 1.0)"
    return wet_service_source(wet_table(member.values.product))


def check_nds_member(
    member: TimberMember, forces: TimberForces, *, mark: str = "P1"
) -> MemberChecks:
    """Check a wood member for axial force and bending to NDS 2018 (ASD).

    Raises:
        OutOfScopeError: ℓ_e/d > 50 (§3.7.1.4), e_d with weak-axis moment; at construction,
            wet SCL or glulam.
        InputError: bad units or values; no force.
    """
    m, f = member, forces
    v = m.values
    P = float(f.P.to("lbf").magnitude)
    if P == 0 and f.M_d.magnitude == 0 and f.M_b.magnitude == 0:
        raise InputError(
            "No force given: P, M_d and M_b are all zero",
            name="forces",
            value=forces,
            expected="a non-zero P, M_d or M_b",
        )
    if P > 0 and (m.le_d is None or m.le_b is None):
        raise OutOfScopeError(
            "Compression needs the effective lengths le_d and le_b (NDS 2018 §3.7.1): give "
            "K_e·ℓ for buckling across each side"
        )
    if P > 0:
        assert m.le_d is not None
        assert m.le_b is not None
        for le, side, nm in ((m.le_d, m.d, "le_d"), (m.le_b, m.b, "le_b")):
            r = float((le / side).to("").magnitude)
            if r > 50:
                raise OutOfScopeError(
                    f"Column slenderness {nm}/side = {r:.3g} exceeds 50 (NDS 2018 §3.7.1.4)"
                )
    combo = f.combination
    kind = "glulam" if v.product == "glulam" else ("SCL" if v.product == "scl" else "sawn")

    def logic(c: Recorder) -> None:
        c.assume("Sustained temperature ≤ 100 °F (C_t = 1.0); not incised (C_i = 1.0).")
        CD = c.given(
            "C_D",
            DURATION_FACTORS[m.duration],
            f"load duration: {m.duration}",
            source="NDS 2018 Table 2.3.2",
        )
        b = c.given("b", m.b, "breadth", source="given", unit="inch")
        d = c.given("d", m.d, "depth", source="given", unit="inch")
        A = c.derive("A", b * d, "area", unit="inch**2")
        out: dict[str, Any] = {}
        if P > 0:
            out["c"] = _compression(c, m, f, CD, A, b, d, kind)
        elif P < 0:
            c.heading("Tension parallel to grain, §3.8", 3)
            Ft = c.given("F_t", v.Ft, "reference tension", source=v.source)
            CF = c.given("C_F_t", float(m.CF_t), "size factor", source=m.CF_source)
            Ftp = c.derive(
                "F_t_adj",
                Ft * CD * CF,
                "F'_t = F_t C_D C_M C_t C_F C_i",
                unit="psi",
                ref="NDS 2018 Table 4.3.1",
            )
            ft = c.derive(
                "f_t",
                c.given("T", Q_(-P, "lbf"), "axial tension", source=combo or "given", unit="lbf")
                / A,
                "tension stress",
                unit="psi",
                ref="§3.8.1",
            )
            c.check("Tension", ft, Ftp, ref="NDS 2018 §3.8", combination=combo)
            out["t"] = (ft, Ftp)
        if f.M_d.magnitude != 0:
            out["b1"] = _bending(c, m, f.M_d, CD, b, d, "d", kind, combo)
        if f.M_b.magnitude != 0:
            out["b2"] = _bending(c, m, f.M_b, CD, d, b, "b", kind, combo)
        if ("c" in out or "t" in out) and ("b1" in out or "b2" in out or f.e_d.magnitude):
            _combined(c, m, f, out, d, combo)

    title = f"{v.name} {m.b:~P} × {m.d:~P}, NDS 2018 ASD"
    return run_checks(mark, title, Standard(NDS_EDITION, _TITLE, "ASD"), logic)


def _compression(
    c: Recorder, m: TimberMember, f: TimberForces, CD: Any, A: Any, b: Any, d: Any, kind: str
) -> dict[str, Any]:
    v = m.values
    c.heading("Compression parallel to grain, §3.6-§3.7", 3)
    Fc = c.given("F_c", v.Fc, "reference compression", source=v.source)
    CM = c.given(
        "C_M_c",
        _wet("Fc", v.product, m.wet, float((v.Fc * m.CF_c).to("psi").magnitude)),
        "wet service factor",
        source=_wet_source(m),
    )
    CF = c.given("C_F_c", float(m.CF_c), "size factor", source=m.CF_source)
    Fcs = c.derive(
        "F_c_star",
        Fc * CD * CM * CF,
        "F*_c: F_c with all factors but C_P",
        unit="psi",
        ref="NDS 2018 §3.7.1.5",
    )
    Emin = c.given("E_min", v.Emin, "reference E_min", source=v.source)
    CMe = c.given(
        "C_M_E",
        _wet("Emin", v.product, m.wet, 0.0),
        "wet service factor",
        source=_wet_source(m),
    )
    Eminp = c.derive("E_min_adj", Emin * CMe, "E'_min", unit="psi", ref="NDS 2018 Table 4.3.1")
    led = c.given("l_e_d", m.le_d, "effective length, buckling across d", unit="ft")
    leb = c.given("l_e_b", m.le_b, "effective length, buckling across b", unit="ft")
    sd = c.derive("s_d", led / d, "ℓ_e/d across d", ref="NDS 2018 §3.7.1.3")
    sb = c.derive("s_b", leb / b, "ℓ_e/d across b", ref="NDS 2018 §3.7.1.3")
    cc = c.given(
        "c", 0.8 if kind == "sawn" else 0.9, f"column parameter, {kind}", source="NDS 2018 §3.7.1.5"
    )
    FcE1, FcE2 = (
        c.derive(
            f"F_cE{i}",
            0.822 * Eminp / ratio**2,
            f"critical buckling, across {across}",
            unit="psi",
            ref="NDS 2018 §3.9.2",
        )
        for i, ratio, across in ((1, sd, "d"), (2, sb, "b"))
    )
    weak_b = c.f(sb) >= c.f(sd)
    FcE = FcE2 if weak_b else FcE1
    a = c.derive("alpha_c", FcE / Fcs, "F_cE/F*_c, larger slenderness", ref="NDS 2018 §3.7.1.5")
    h = (1 + a) / (2 * cc)
    if m.built_up is not None and weak_b:
        Kf = c.given(
            "K_f",
            0.6 if m.built_up == "nailed" else 0.75,
            f"built-up column, {m.built_up}",
            source="NDS 2018 §15.3.2",
        )
        CP = c.derive(
            "C_P",
            Kf * (h - c.sqrt(h**2 - a / cc)),
            "column stability factor",
            ref="NDS 2018 Eq. (15.3-1)",
        )
    else:
        if m.built_up is not None:
            c.text("Buckling across d governs: the built-up column is a solid column (§15.3.2).")
        CP = c.derive(
            "C_P", h - c.sqrt(h**2 - a / cc), "column stability factor", ref="NDS 2018 Eq. (3.7-1)"
        )
    Fcp = c.derive("F_c_adj", Fcs * CP, "F'_c = F*_c C_P", unit="psi", ref="NDS 2018 Table 4.3.1")
    fc = c.derive(
        "f_c",
        c.given("P", f.P, "axial compression", source=f.combination or "given", unit="lbf") / A,
        "compression stress",
        unit="psi",
        ref="NDS 2018 §3.6.3",
    )
    c.check("Compression", fc, Fcp, ref="NDS 2018 §3.7", combination=f.combination)
    return {"fc": fc, "Fcp": Fcp, "FcE1": FcE1, "FcE2": FcE2, "Eminp": Eminp}


def _bending(
    c: Recorder,
    m: TimberMember,
    M: Quantity,
    CD: Any,
    b: Any,
    d: Any,
    axis: str,
    kind: str,
    combo: str | None,
) -> dict[str, Any]:
    v = m.values
    k = "1" if axis == "d" else "2"
    c.heading(f"Bending {'about the strong axis' if k == '1' else 'about the weak axis'}, §3.3", 3)
    Fb = c.given("F_b", v.Fb, "reference bending", source=v.source)
    CM = c.given(
        f"C_M_b{k}",
        _wet("Fb", v.product, m.wet, float((v.Fb * m.CF_b).to("psi").magnitude)),
        "wet service factor",
        source=_wet_source(m),
    )
    CF = c.given(f"C_F_b{k}", float(m.CF_b), "size factor", source=m.CF_source)
    Fbs = c.derive(
        f"F_b{k}_star",
        Fb * CD * CM * CF,
        "F*_b: all factors but C_L (and C_V)",
        unit="psi",
        ref="NDS 2018 §3.3.3.8",
    )
    Emin = c.given("E_min", v.Emin, "reference E_min", source=v.source)
    Eminp = c.derive(
        "E_min_adj",
        Emin * _wet("Emin", v.product, m.wet, 0.0),
        "E'_min",
        unit="psi",
        ref="NDS 2018 Table 4.3.1",
    )
    S = c.derive(f"S_{k}", b * d**2 / 6, "section modulus", unit="inch**3")
    if k == "2" or m.lu is None:
        c.text("Compression edge braced (or weak-axis bending): C_L = 1.0 (§3.3.3).")
        CL: Any = c.given(f"C_L{k}", 1.0, "beam stability factor", source="NDS 2018 §3.3.3")
        FbE = None
    else:
        le, rule = effective_length(m.lu, m.d, m.loading)
        lef = c.given("l_e", le, f"effective length, Table 3.3.3: {rule}", unit="ft")
        RB = c.derive(
            "R_B", c.sqrt(lef * d / b**2), "slenderness ratio", ref="NDS 2018 Eq. (3.3-5)"
        )
        if c.f(RB) > 50:
            raise OutOfScopeError(
                f"Beam slenderness R_B = {c.f(RB):.3g} exceeds 50 (NDS 2018 §3.3.3.7)"
            )
        FbE = c.derive(
            "F_bE",
            1.20 * Eminp / RB**2,
            "critical buckling, bending",
            unit="psi",
            ref="NDS 2018 §3.3.3.8",
        )
        CL = c.given(
            "C_L1",
            beam_stability_factor(c.q(Fbs), c.q(Eminp), c.f(RB)),
            "beam stability factor",
            source="NDS 2018 Eq. (3.3-6)",
        )
    factor = CL
    if kind == "glulam" and k == "1":
        if m.L_beam is None:
            raise OutOfScopeError(
                "Glulam bending needs L_beam (length between zero moments) for C_V "
                "(NDS 2018 §5.3.6)"
            )
        L_ft = float(m.L_beam.to("ft").magnitude)
        cv = min(
            1.0,
            (
                (21 / L_ft)
                * (12 / float(m.d.to("inch").magnitude))
                * (5.125 / float(m.b.to("inch").magnitude))
            )
            ** 0.1,
        )
        CV = c.given(
            "C_V",
            cv,
            "volume factor (21/L)^(1/10)(12/d)^(1/10)(5.125/b)^(1/10) ≤ 1",
            source="NDS 2018 Eq. (5.3-1)",
        )
        c.text("Glulam: the lesser of C_L and C_V applies, not both (§5.3.6).")
        factor = c.min(CL, CV)
    Fbp = c.derive(f"F_b{k}_adj", Fbs * factor, "F'_b", unit="psi", ref="NDS 2018 Table 4.3.1")
    fb = c.derive(
        f"f_b{k}",
        c.given(f"M_{k}", abs(M), "bending moment", source=combo or "given", unit="lbf*ft") / S,
        "bending stress",
        unit="psi",
        ref="NDS 2018 §3.3.2",
    )
    c.check(f"Bending {k}", fb, Fbp, ref="NDS 2018 §3.3", combination=combo)
    return {"fb": fb, "Fbp": Fbp, "Fbs": Fbs, "FbE": FbE, "Eminp": Eminp}


def _combined(
    c: Recorder, m: TimberMember, f: TimberForces, out: dict[str, Any], d: Any, combo: str | None
) -> None:
    one = Q_(1.0, "")
    if "t" in out:
        c.heading("Bending and axial tension, §3.9.1", 3)
        ft, Ftp = out["t"]
        if "b2" in out:
            raise OutOfScopeError(
                "Axial tension with biaxial bending is not covered (NDS 2018 §3.9.1 is uniaxial)"
            )
        b1 = out["b1"]
        Ft_star = c.derive(
            "U_391", ft / Ftp + b1["fb"] / b1["Fbs"], "tension face", ref="NDS 2018 Eq. (3.9-1)"
        )
        c.check("Tension and bending", Ft_star, one, ref="NDS 2018 Eq. (3.9-1)", combination=combo)
        return
    c.heading("Bending and axial compression, §3.9.2", 3)
    cc = out["c"]
    fc, Fcp, FcE1, FcE2 = cc["fc"], cc["Fcp"], cc["FcE1"], cc["FcE2"]
    if c.q(fc) >= c.q(FcE1) or ("b2" in out and c.q(fc) >= c.q(FcE2)):
        raise OutOfScopeError(
            "f_c reaches F_cE: the member buckles (NDS 2018 §3.9.2 requires f_c < F_cE)"
        )
    term = (fc / Fcp) ** 2
    b1 = out.get("b1")
    if b1 is not None or f.e_d.magnitude:
        e = c.given("e_1", f.e_d, "eccentricity of P along d", source="given", unit="inch")
        fb1 = (
            b1["fb"] if b1 is not None else c.given("f_b1", Q_(0.0, "psi"), "no moment", unit="psi")
        )
        Fb1 = b1["Fbp"] if b1 is not None else _fb_for_ecc(c, m)
        term = term + (fb1 + fc * (6 * e / d) * (1 + 0.234 * fc / FcE1)) / (Fb1 * (1 - fc / FcE1))
    if "b2" in out:
        b2 = out["b2"]
        fb1v = b1["fb"] if b1 is not None else Q_(0.0, "psi")
        FbE = b1["FbE"] if b1 is not None and b1["FbE"] is not None else None
        if FbE is None:
            term = term + b2["fb"] / (b2["Fbp"] * (1 - fc / FcE2))
        else:
            term = term + b2["fb"] / (b2["Fbp"] * (1 - fc / FcE2 - (fb1v / FbE) ** 2))
    U = c.derive(
        "U_392",
        term,
        "interaction of bending and compression",
        ref="NDS 2018 Eq. (3.9-3)" if not f.e_d.magnitude else "NDS 2018 Eq. (15.4-1)",
    )
    c.check("Compression and bending", U, one, ref="NDS 2018 §3.9.2", combination=combo)


def _fb_for_ecc(c: Recorder, m: TimberMember) -> Any:
    v = m.values
    Fb = c.given("F_b", v.Fb, "reference bending", source=v.source)
    CD = DURATION_FACTORS[m.duration]
    return c.derive(
        "F_b1_adj",
        Fb * CD * float(m.CF_b),
        "F'_b (C_L = 1.0, braced)",
        unit="psi",
        ref="NDS 2018 Table 4.3.1",
    )
