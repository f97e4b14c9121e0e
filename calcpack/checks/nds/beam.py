"""NDS 2018 (ASD) bending and shear checks of sawn-lumber members, every factor shown."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from types import MappingProxyType
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.demand import as_combinations, max_abs
from calcpack.checks.nds.factors import (
    _TITLE,
    DEFAULT_DURATIONS,
    DURATION_FACTORS,
    NDS_EDITION,
    ReferenceDesignValues,
    SawnMember,
    ServiceConditions,
    duration_of,
    effective_length,
    flat_use_factor,
    size_factor,
    temperature_factor,
    wet_service_factor,
)
from calcpack.checks.nds.values import southern_pine_size_factor
from calcpack.errors import InputError, OutOfScopeError

__all__ = ["PreparedTimberDemand", "check_nds_beam", "prepare_timber_demand"]


def combination_demands(demand: Any, durations: Mapping[str, str]) -> list[dict[str, Any]]:
    """For each allowable-stress combination of ``demand``: its name, C_D of its shortest-
    duration load (NDS 2018 §2.3.2) with that case and duration name, the largest |M| [lbf·ft]
    and |V| [lbf] with their positions, and the beam length ``L``."""
    combos = as_combinations(
        demand, kinds=("allowable stress", "user"), method=f"{NDS_EDITION} (ASD)"
    )
    items: list[dict[str, Any]] = []
    for name, r in combos.items():
        cases = [c for c, f in getattr(r, "cases", ((name, 1.0),)) if f != 0.0]
        ds = [(DURATION_FACTORS[duration_of(c, durations)], c) for c in cases]
        CD, governing_case = max(ds)
        M, xM = max_abs(r, "moment")
        V, xV = max_abs(r, "shear")
        items.append({"combination": name, "CD": CD, "CD_case": governing_case,
                      "CD_name": duration_of(governing_case, durations), "M": M.to("lbf*ft"),
                      "V": V.to("lbf"), "xM": xM, "xV": xV, "result": r,
                      "L": r.beam.length})  # fmt: skip
    return items


@dataclass(frozen=True)
class PreparedTimberDemand:
    """The demands of allowable-stress results read once (:func:`combination_demands` for each
    combination: C_D, the largest |M| and |V|), kept to check many sections of one beam (a
    size search). Made by :func:`prepare_timber_demand`; :func:`check_nds_beam` and
    :func:`calcpack.checks.nds.glulam.check_nds_glulam_beam` take it as ``demand`` and give the
    same results as with the results it was read from.

    Attributes:
        items: one read-only mapping per combination. durations: the load-case durations the
            C_D were found with (a check given other durations refuses it).
    """

    items: tuple[Mapping[str, Any], ...]
    durations: Mapping[str, str]


def prepare_timber_demand(
    demand: Any, durations: Mapping[str, str] | None = None
) -> PreparedTimberDemand:
    """Read ``demand`` (as :func:`check_nds_beam` takes it) once, with ``durations`` (defaults
    for D, L, Lr, S, R, W, Eh, Ev as in the checks).

    Raises:
        InputError: combinations of another kind, a load case without a duration.
    """
    durs = {**DEFAULT_DURATIONS, **dict(durations or {})}
    items = tuple(MappingProxyType(it) for it in combination_demands(demand, durs))
    return PreparedTimberDemand(items, MappingProxyType(durs))


def demand_items(demand: Any, durations: Mapping[str, str]) -> list[dict[str, Any]]:
    """The per-combination demands of ``demand``: read now, or taken from a
    :class:`PreparedTimberDemand` read with the same durations.

    Raises:
        InputError: a prepared demand read with other durations.
    """
    if not isinstance(demand, PreparedTimberDemand):
        return combination_demands(demand, durations)
    if dict(demand.durations) != dict(durations):
        raise InputError(
            "The prepared demand was read with other load durations than the check's "
            f"(got durations = {dict(durations)!r}); prepare it with the check's durations",
            name="durations",
            value=dict(durations),
            expected=repr(dict(demand.durations)),
        )
    return [dict(it) for it in demand.items]


def check_nds_beam(
    member_size: SawnMember,
    reference: ReferenceDesignValues,
    *,
    demand: Any,
    conditions: ServiceConditions | None = None,
    durations: Mapping[str, str] | None = None,
    member: str = "J1",
) -> MemberChecks:
    """Check a sawn-lumber bending member to NDS 2018 (ASD) in bending and shear.

    Args:
        member_size: the :class:`SawnMember`. reference: the :class:`ReferenceDesignValues`
            with their source. conditions: :class:`ServiceConditions` (default: dry, normal
            temperature, not incised, not repetitive, edgewise, compression edge braced).
        demand: ASD combined results (e.g. ASCE/SEI 7 §2.4 through analyse_combinations), a
            mapping of combination -> beam result, or one result. Each result must carry its
            load-case factors (``cases``) so C_D can be found; a plain result is taken as one
            case named by its label. Or a :class:`PreparedTimberDemand` read from them.
        durations: load case -> duration name of Table 2.3.2 (defaults for D, L, Lr, S, R, W,
            Eh, Ev; pattern cases "L#2" use their base case).

    Raises:
        InputError: a load case without a duration, bad inputs. OutOfScopeError: R_B > 50,
            T > 150 °F, a grade or size outside the C_F rule without CF given.
    """
    cond = conditions or ServiceConditions()
    durs = {**DEFAULT_DURATIONS, **dict(durations or {})}
    items = demand_items(demand, durs)
    if cond.CF is None:
        _size_factor(reference, member_size)
    logic = _NDSLogic(member_size, reference, cond, items)
    title = (f"{member_size.name} {reference.species_grade} to {NDS_EDITION} (ASD), "
             "bending and shear")  # fmt: skip
    return run_checks(member, title, Standard(NDS_EDITION, _TITLE, "ASD"), logic)


def _size_factor(ref: ReferenceDesignValues, m: SawnMember) -> float:
    """C_F for F_b by the reference values' size rule (Table 4A or Table 4B)."""
    if ref.size_rule == "Table 4B":
        return southern_pine_size_factor(m.nominal_thickness, m.nominal_width)
    return size_factor(ref.grade, m.nominal_thickness, m.nominal_width)


class _NDSLogic:
    def __init__(
        self,
        m: SawnMember,
        ref: ReferenceDesignValues,
        cond: ServiceConditions,
        items: list[dict[str, Any]],
    ) -> None:
        self.m, self.ref, self.cond, self.items = m, ref, cond, items

    def __call__(self, c: Recorder) -> None:
        m, ref, cond = self.m, self.ref, self.cond
        c.heading("Section and reference design values", 3)
        b = c.given("b", m.b, "breadth", source=m.size_source, unit="inch")
        d = c.given("d", m.d, "depth (in the plane of bending)", source=m.size_source, unit="inch")
        S = c.derive("S", b * d**2 / 6, "section modulus", unit="inch**3", ref="b·d²/6")
        A = c.derive("A", b * d, "area", unit="inch**2", ref="b·d")
        src = f"{ref.source} ({ref.species_grade})"
        Fb = c.given("F_b", ref.Fb, "reference bending design value", source=src, unit="psi")
        Fv = c.given("F_v", ref.Fv, "reference shear design value", source=src, unit="psi")
        E = c.given("E", ref.E, "reference modulus of elasticity", source=src, unit="psi")
        Emin = c.given("E_min", ref.Emin, "reference E for stability", source=src, unit="psi")

        c.heading("Adjustment factors (NDS 2018 Table 4.3.1)", 3)
        if cond.CF is not None:
            CF = c.given("C_F", cond.CF, "size factor", source=cond.CF_source)
        else:
            CF = c.given(
                "C_F",
                _size_factor(ref, m),
                f"size factor, {ref.grade}, {m.name}",
                source=(
                    "NDS Supplement Table 4A size factors (§4.3.6)"
                    if ref.size_rule == "Table 4A"
                    else "NDS Supplement Table 4B: size effect in the tabulated values (§4.3.6)"
                ),
            )
        state = "wet service, MC > 19 %" if cond.wet else "dry service, MC ≤ 19 %"
        fb_cf = float((c.q(Fb) * c.f(CF)).to("psi").magnitude)
        why = state
        if cond.wet:
            # Table 4A footnote: C_M = 0.85 on F_b, but 1.0 where F_b·C_F ≤ 1150 psi
            why = f"{state}; F_b·C_F = {fb_cf:.0f} psi " + (
                "≤ 1150 psi, so C_M = 1.0" if fb_cf <= 1150.0 else "> 1150 psi, so C_M = 0.85"
            )
        CMb = c.given(
            "C_Mb",
            wet_service_factor("Fb", wet=cond.wet, Fb_CF=c.q(Fb) * c.f(CF)),
            f"wet service factor on F_b ({why})",
            source="NDS Supplement Table 4A (§4.3.3)",
        )
        CMv = c.given(
            "C_Mv",
            wet_service_factor("Fv", wet=cond.wet),
            f"wet service factor on F_v ({state})",
            source="NDS Supplement Table 4A",
        )
        CME = c.given(
            "C_ME",
            wet_service_factor("E", wet=cond.wet),
            f"wet service factor on E, E_min ({state})",
            source="NDS Supplement Table 4A",
        )
        t_txt = "T ≤ 100 °F" if cond.temperature is None else f"T = {cond.temperature:~P}"
        Ctb = c.given(
            "C_tb",
            temperature_factor("Fb", cond.temperature, wet=cond.wet),
            f"temperature factor on F_b, F_v ({t_txt})",
            source="NDS 2018 Table 2.3.3",
        )
        CtE = c.given(
            "C_tE",
            temperature_factor("E", cond.temperature, wet=cond.wet),
            f"temperature factor on E, E_min ({t_txt})",
            source="NDS 2018 Table 2.3.3",
        )
        Cfu = c.given(
            "C_fu",
            flat_use_factor(m.nominal_thickness, m.nominal_width) if cond.flat_use else 1.0,
            "flat use factor" + ("" if cond.flat_use else " (edgewise bending)"),
            source="NDS Supplement Table 4A (§4.3.7)",
        )
        Cib = c.given(
            "C_ib",
            0.80 if cond.incised else 1.0,
            "incising factor on F_b, F_v" + ("" if cond.incised else " (not incised)"),
            source="NDS 2018 Table 4.3.8",
        )
        CiE = c.given(
            "C_iE",
            0.95 if cond.incised else 1.0,
            "incising factor on E, E_min",
            source="NDS 2018 Table 4.3.8",
        )
        Cr = c.given(
            "C_r",
            1.15 if cond.repetitive else 1.0,
            "repetitive member factor" + ("" if cond.repetitive else " (not repetitive)"),
            source="NDS 2018 §4.3.9",
        )
        Ep = c.derive(
            "E_prime",
            E * CME * CtE * CiE,
            "adjusted modulus of elasticity E'",
            unit="psi",
            ref="NDS 2018 Table 4.3.1",
            latex="E'",
        )
        Eminp = c.derive(
            "E_min_prime",
            Emin * CME * CtE * CiE,
            "adjusted E'_min",
            unit="psi",
            ref="NDS 2018 Table 4.3.1",
            latex="E'_{min}",
        )
        del Ep

        # screen every combination with numbers, then work the governing one in full
        u_b: list[float] = []
        u_v: list[float] = []
        rows = []
        for it in self.items:
            n = Recorder(c.member)
            Fbp = self._Fbp(
                n,
                c.q(Fb),
                c.q(CMb),
                c.q(Ctb),
                c.q(CF),
                c.q(Cfu),
                c.q(Cib),
                c.q(Cr),
                c.q(Eminp),
                c.q(b),
                c.q(d),
                it,
            )
            Fvp = c.q(Fv) * it["CD"] * c.f(CMv) * c.f(Ctb) * c.f(Cib)
            ub = float((it["M"] / c.q(S) / n.q(Fbp)).to("").magnitude)
            uv = float((1.5 * it["V"] / c.q(A) / Fvp).to("").magnitude)
            rows.append(
                [
                    it["combination"],
                    f"{it['CD']:g} ({it['CD_name']}, {it['CD_case']})",
                    it["M"],
                    round(ub, 3),
                    it["V"],
                    round(uv, 3),
                ]
            )
            u_b.append(ub)
            u_v.append(uv)
        # the first of the largest governs
        i_b = max(range(len(u_b)), key=u_b.__getitem__)
        i_v = max(range(len(u_v)), key=u_v.__getitem__)
        if len(self.items) > 1:
            c.table(
                ["Combination", "C_D", "M", "Bending utilisation", "V", "Shear utilisation"],
                rows,
                caption="Every ASD combination (C_D from the "
                "shortest-duration load, NDS 2018 §2.3.2); the governing ones are worked "
                "below",
            )

        it = self.items[i_b]
        c.heading(f"Bending, NDS 2018 §3.3 (governing: {it['combination']})", 3)
        Fbp = self._Fbp(c, Fb, CMb, Ctb, CF, Cfu, Cib, Cr, Eminp, b, d, it)
        M = c.given(
            "M", it["M"], "largest |M| of the combination", source=it["combination"], unit="lbf*ft"
        )
        fb = c.derive("f_b", M / S, "bending stress", unit="psi", ref="NDS 2018 §3.3.2, M/S")
        c.check("Bending", fb, Fbp, ref="NDS 2018 §3.3", combination=it["combination"])

        it = self.items[i_v]
        c.heading(f"Shear, NDS 2018 §3.4 (governing: {it['combination']})", 3)
        CD = c.given(
            "C_D",
            it["CD"],
            f"load duration factor ({it['CD_name']}, case {it['CD_case']})",
            source="NDS 2018 Table 2.3.2",
        )
        Fvp = c.derive(
            "F_v_prime",
            Fv * CD * CMv * Ctb * Cib,
            "adjusted shear design value F'_v",
            unit="psi",
            ref="NDS 2018 Table 4.3.1",
            latex="F'_v",
        )
        V = c.given(
            "V", it["V"], "largest |V| of the combination", source=it["combination"], unit="lbf"
        )
        fv = c.derive(
            "f_v",
            3 * V / (2 * A),
            "shear stress, rectangular section",
            unit="psi",
            ref="NDS 2018 Eq. (3.4-2)",
        )
        c.assume(
            "Shear is taken at the support face without the reduction of NDS 2018 §3.4.3.1 "
            "for loads within a depth d of the support (conservative)."
        )
        c.check("Shear", fv, Fvp, ref="NDS 2018 §3.4", combination=it["combination"])

    def _Fbp(
        self,
        c: Recorder,
        Fb: Any,
        CMb: Any,
        Ctb: Any,
        CF: Any,
        Cfu: Any,
        Cib: Any,
        Cr: Any,
        Eminp: Any,
        b: Any,
        d: Any,
        it: dict[str, Any],
    ) -> Any:
        cond = self.cond
        CD = c.given(
            "C_D",
            it["CD"],
            f"load duration factor ({it['CD_name']}, case {it['CD_case']})",
            source="NDS 2018 Table 2.3.2",
        )
        Fbs = c.derive(
            "F_b_star",
            Fb * CD * CMb * Ctb * CF * Cib * Cr,
            "F_b with all factors except C_L, C_fu",
            unit="psi",
            ref="NDS 2018 §3.3.3.8",
            latex="F_b^{*}",
        )
        ratio = c.f(c.q(d) / c.q(b))
        if cond.compression_edge_braced:
            CL = c.given(
                "C_L",
                1.0,
                "beam stability factor: compression edge braced",
                source="NDS 2018 §3.3.3.3",
            )
        elif ratio <= 2.0:
            CL = c.given(
                "C_L", 1.0, "beam stability factor: d/b ≤ 2", source="NDS 2018 §4.4.1.2(a)"
            )
        elif ratio <= 4.0 and cond.ends_held:
            CL = c.given(
                "C_L",
                1.0,
                f"beam stability factor: d/b = {ratio:.3g} ≤ 4 with the ends held in position",
                source="NDS 2018 §4.4.1.2(b)",
            )
        else:
            if cond.lu is None:
                raise OutOfScopeError(
                    f"C_L: d/b = {ratio:.3g} exceeds 4, so holding the ends in position is not "
                    "enough lateral support (NDS 2018 §4.4.1.2): give the unsupported length lu"
                )
            lu = c.given(
                "l_u", cond.lu, "laterally unsupported length", source="bracing layout", unit="ft"
            )
            le_q, rule = effective_length(c.q(lu), c.q(d), cond.loading)
            le = c.derive(
                "l_e",
                le_q,
                f"effective length, {rule} ({cond.loading} load)",
                unit="ft",
                ref="NDS 2018 Table 3.3.3",
            )
            RB = c.derive(
                "R_B", c.sqrt(le * d / b**2), "slenderness ratio", ref="NDS 2018 Eq. (3.3-5)"
            )
            if c.f(RB) > 50:
                raise OutOfScopeError(
                    f"Beam slenderness R_B = {c.f(RB):.3g} exceeds 50 (NDS 2018 §3.3.3.7): "
                    "brace the compression edge or choose a wider member"
                )
            FbE = c.derive(
                "F_bE",
                1.20 * Eminp / RB**2,
                "critical buckling design value",
                unit="psi",
                ref="NDS 2018 §3.3.3.8",
            )
            a = FbE / Fbs
            CL = c.derive(
                "C_L",
                (1 + a) / 1.9 - c.sqrt(((1 + a) / 1.9) ** 2 - a / 0.95),
                "beam stability factor",
                ref="NDS 2018 Eq. (3.3-6)",
            )
        return c.derive(
            "F_b_prime",
            Fbs * CL * Cfu,
            "adjusted bending design value F'_b",
            unit="psi",
            ref="NDS 2018 Table 4.3.1",
            latex="F'_b",
        )
