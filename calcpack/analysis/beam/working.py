"""The beam's working for a sheet, built from calcpack.working steps only when displayed.

Reactions of a determinate beam are found as the engineer writes them: ΣFx = 0, then
equations each giving one unknown -- ΣM about a support (so the reaction there drops out), ΣFy,
and ΣM about a hinge for the part on one side of it -- with each distributed load entering
through its resultant W = ∫w dx at x̄ = ∫x·w dx / W. Moments in these equations are taken
counter-clockwise positive; applied couples and moment reactions are clockwise positive (as
everywhere in calcpack), so they enter with a minus sign.

An indeterminate beam is solved by the flexibility method: redundant reactions X are removed
to leave a stable determinate released beam; its deflections under the loads (Δ_i0) and under
unit redundants (f_ij) give the compatibility conditions Δ_i0 + Σ f_ij X_j = 0 (with + X_i/k
on a spring), which fix the redundants; the other reactions then follow from equilibrium.

Every value shown is recomputed from its formula by the working module, and agrees with the
numeric solution to round-off (the tests check this).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from calcpack.analysis.beam.core import shift_polynomial
from calcpack.analysis.beam.flexibility import flexibility_plan, reaction_keys, reaction_symbol
from calcpack.analysis.beam.model import Beam
from calcpack.loads.resultants import resultant_si
from calcpack.loads.types import (
    AreaLoad,
    DistributedLoad,
    LinearLoad,
    PointLoad,
    PointMoment,
    SIPiece,
    UniformLoad,
)
from calcpack.units import Q_, DisplaySettings, get_display, ureg
from calcpack.working import (
    Block,
    Derived,
    Equation,
    Given,
    Heading,
    Table,
    Term,
    Text,
    Unknown,
)
from calcpack.working.expr import as_term

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["beam_working", "cut_working"]

_M = ureg.Unit("m")
_KN = ureg.Unit("kN")
_KNM = ureg.Unit("kN*m")

SIGN_CONVENTION = (
    "Sign convention: x from the left end; loads positive downward; reactions positive upward "
    "(forces) and clockwise (moments, as applied couples); in equilibrium equations moments "
    "are taken counter-clockwise positive. Shear V is positive when the left face of an "
    "element is pushed up (dV/dx = −w); bending moment M is positive sagging (dM/dx = V); "
    "deflection δ is positive downward."
)


_UNITS = {
    "SI": {
        "force": "kN",
        "moment": "kN*m",
        "line": "kN/m",
        "area": "kPa",
        "length": "m",
        "deflection": "mm",
    },
    "US": {
        "force": "kip",
        "moment": "kip*ft",
        "line": "klf",
        "area": "psf",
        "length": "ft",
        "deflection": "inch",
    },
}


@dataclass(frozen=True)
class Writer:
    """Makes the working's steps with the display settings of the sheet they are for (passed
    in, never held globally): its units for each kind of quantity and its significant figures."""

    settings: DisplaySettings

    def u(self, kind: str) -> str:
        return _UNITS.get(self.settings.system, _UNITS["SI"])[kind]

    def given(self, *args: Any, **kw: Any) -> Given:
        return Given(*args, settings=self.settings, **kw)

    def derived(self, *args: Any, **kw: Any) -> Derived:
        return Derived(*args, settings=self.settings, **kw)

    def equation(self, *args: Any, **kw: Any) -> Equation:
        return Equation(*args, settings=self.settings, **kw)

    def table(self, *args: Any, **kw: Any) -> Table:
        return Table(*args, settings=self.settings, **kw)

    def lit(self, x_m: float) -> Term:
        """A length literal as a term (shown as its value, e.g. (2.00 m))."""
        return as_term(Q_(round(x_m, 12), _M).to(self.u("length")))


def _acc(expr: Any, sign: float, term: Any) -> Any:
    """expr ± term, starting from None (so no leading "0 +" is printed)."""
    if expr is None:
        return term if sign > 0 else -term
    return expr + term if sign > 0 else expr - term


# -- the loads as working terms ---------------------------------------------------------------
@dataclass
class _Force:
    """A known transverse force (down +) with its position, as terms."""

    term: Term  # magnitude (a Given or Derived), down +
    x_m: float
    x_term: Term | None  # symbol for the position (x̄) when it is a derived resultant


@dataclass
class _Couple:
    term: Term  # clockwise +
    x_m: float


def _clip(pieces: tuple[SIPiece, ...], lo: float, hi: float) -> tuple[SIPiece, ...]:
    out = []
    for p in pieces:
        a, b = max(p.a_m, lo), min(p.b_m, hi)
        if b - a <= 1e-12 * max(abs(hi), 1.0):
            continue
        out.append(SIPiece(a, b, shift_polynomial(p.coeffs, a - p.a_m)))
    return tuple(out)


class _Loads:
    """The active (factored) loads of a result as Given / Derived steps."""

    def __init__(
        self, w: Writer, result: BeamResult, steps: list[Any], upto: float | None = None
    ) -> None:
        self.w = w
        self.factors = dict(result.cases)
        self.beam = result.beam
        self.steps = steps
        self.points: list[tuple[PointLoad, float, Term]] = []  # load, factor, P term
        self.couples: list[tuple[PointMoment, float, Term]] = []
        self.dist: list[tuple[DistributedLoad, float, int]] = []
        self.axial: list[tuple[PointLoad, Term]] = []
        self._cache: dict[tuple[int, float, float], tuple[Term, Term | None, float, float]] = {}
        n_p = n_c = n_w = 0
        for load in self.beam.loads:
            if load.case not in self.factors:
                continue
            f = self.factors[load.case]
            how = self._how(load.case, f)
            if (
                upto is not None
                and isinstance(load, PointLoad | PointMoment)
                and (load.x.to("m").magnitude > upto)
            ):
                continue
            if isinstance(load, PointLoad):
                n_p += 1
                if load.P.magnitude != 0:
                    P = w.given(
                        f"P_{n_p}",
                        f * load.P,
                        f"point load at x = {load.x:~.4g}{how}",
                        unit=w.u("force"),
                    )
                    steps.append(P)
                    self.points.append((load, f, P))
                if load.H.magnitude != 0:
                    H = w.given(
                        f"H_{n_p}",
                        f * load.H,
                        f"axial component at x = {load.x:~.4g} (+ toward +x){how}",
                        unit=w.u("force"),
                    )
                    steps.append(H)
                    self.axial.append((load, H))
            elif isinstance(load, PointMoment):
                n_c += 1
                C = w.given(
                    f"C_{n_c}",
                    f * load.C,
                    f"couple at x = {load.x:~.4g}, clockwise +{how}",
                    unit=w.u("moment"),
                )
                steps.append(C)
                self.couples.append((load, f, C))
            elif isinstance(load, DistributedLoad):
                n_w += 1
                self.dist.append((load, f, n_w))

    @staticmethod
    def _how(case: str, f: float) -> str:
        return f" ({case})" if f == 1.0 else f" ({f:.4g} × {case})"

    def resultant(
        self, load: DistributedLoad, f: float, k: int, lo: float, hi: float, part: str = ""
    ) -> tuple[Term, Term | None, float, float] | None:
        """(W term, x̄ term, W N, x̄ m) of the part of ``load`` on [lo, hi], making the steps."""
        w = self.w
        key = (k, lo, hi)
        if key in self._cache:
            return self._cache[key]
        pieces = _clip(load.si_pieces(), lo, hi)
        if not pieces:
            return None
        whole = lo <= load.a_m + 1e-12 and hi >= load.b_m - 1e-12
        W_N, first = resultant_si(pieces)
        W_N *= f
        first *= f
        a, b = pieces[0].a_m, pieces[-1].b_m
        how = self._how(load.case, f)
        suffix = f"{k}" if whole else f"{k}{part}"
        name_W, name_x = f"W_{suffix}", f"xbar_{suffix}"
        latex_x = rf"\bar{{x}}_{{{suffix}}}"
        where = f"x = {a:.4g} m to {b:.4g} m"
        formula_W = formula_x = None
        if whole and isinstance(load, UniformLoad | AreaLoad):
            line: Any
            if isinstance(load, AreaLoad):
                q = w.given(f"q_{k}", load.q, f"area load{how}", unit=w.u("area"))
                bt = w.given(f"b_{k}", load.width, "tributary width", unit=w.u("length"))
                line = w.derived(
                    f"w_{k}",
                    f * q * bt if f != 1.0 else q * bt,
                    "line load = area load × tributary width",
                    unit=w.u("line"),
                )
                self.steps += [q, bt, line]
            else:
                line = w.given(
                    f"w_{k}", f * load.w, f"uniform line load, {where}{how}", unit=w.u("line")
                )
                self.steps.append(line)
            formula_W = line * w.lit(b - a)
            formula_x = w.lit((a + b) / 2)
        elif whole and isinstance(load, LinearLoad):
            w1 = w.given(
                f"w_{k}a", f * load.w_start, f"line load at x = {a:.4g} m{how}", unit=w.u("line")
            )
            w2 = w.given(
                f"w_{k}b", f * load.w_end, f"line load at x = {b:.4g} m{how}", unit=w.u("line")
            )
            self.steps += [w1, w2]
            formula_W = (w1 + w2) / 2 * w.lit(b - a)
            if abs(W_N) > 1e-12 * (
                abs(w1.quantity.to("N/m").magnitude) + abs(w2.quantity.to("N/m").magnitude)
            ) * (b - a):
                formula_x = w.lit(a) + w.lit(b - a) * (w1 + 2 * w2) / (3 * (w1 + w2))
        W = w.derived(
            name_W,
            formula_W if formula_W is not None else Q_(W_N, "N"),
            f"resultant W = ∫w dx of {load.describe() if whole else 'the part ' + where}",
            unit=w.u("force"),
            note=None
            if formula_W is not None
            else "∫w dx integrated exactly (polynomial) or to the load's stated accuracy",
        )
        self.steps.append(W)
        xbar: Term | None = None
        x_m = float("nan")
        if abs(W_N) > 1e-12 * max(abs(first), 1.0):
            x_m = first / W_N
            xbar = w.derived(
                name_x,
                formula_x if formula_x is not None else Q_(x_m, "m"),
                "its position x̄ = ∫x·w dx / W from the left end",
                unit=w.u("length"),
                latex=latex_x,
            )
            self.steps.append(xbar)
        out = (W, xbar, W_N, x_m)
        self._cache[key] = out
        return out


# -- equilibrium of a region about a point ----------------------------------------------------
@dataclass
class _Eq:
    label: str
    terms: list[tuple[float, Term]]  # (sign, positive-sense term) of the known parts
    unknowns: list[tuple[float, Any, str]]  # (numeric coefficient, coefficient term or 1, key)
    description: str


def _equation(
    loads: _Loads,
    beam: Beam,
    lo: float,
    hi: float,
    about: float | None,
    label: str,
    description: str,
    part: str = "",
    cut_side: str = "",
) -> _Eq:
    """ΣFy (about None) or ΣM about ``about`` (ccw +) of the part of the beam on [lo, hi].

    With ``cut_side`` "left" (or "right") the part is cut just left (right) of ``hi``: point
    actions at ``hi`` are left out (included).
    """
    w = loads.w
    tol = 1e-9 * beam.L_m

    def inside(x: float) -> bool:
        if cut_side == "left":
            return lo - tol <= x < hi - tol
        return lo - tol <= x <= hi + tol

    terms: list[tuple[float, Term]] = []
    unknowns: list[tuple[float, Any, str]] = []

    for s in beam.supports:
        if not inside(s.x_m):
            continue
        if s.restrains_v:
            if about is None:
                unknowns.append((1.0, 1, reaction_symbol((s.label, "Fy"))))
            elif abs(s.x_m - about) > tol:
                arm = s.x_m - about
                unknowns.append((arm, w.lit(arm), reaction_symbol((s.label, "Fy"))))
        if s.restrains_rotation and about is not None:
            unknowns.append((-1.0, -1, reaction_symbol((s.label, "C"))))
    for load, _f, P in loads.points:
        x = load.x.to("m").magnitude
        if not inside(x):
            continue
        if about is None:
            terms.append((-1.0, P))
        elif abs(x - about) > tol:
            terms.append((-1.0, P * w.lit(x - about)))
    if about is not None:
        for cl, _f, C in loads.couples:
            if inside(cl.x.to("m").magnitude):
                terms.append((-1.0, C))
    for dl, f, k in loads.dist:
        got = loads.resultant(dl, f, k, max(lo, dl.a_m), min(hi, dl.b_m), part)
        if got is None:
            continue
        W, xbar, _W_N, _x_m = got
        if about is None:
            terms.append((-1.0, W))
        elif xbar is None:  # zero net force: the load is a pure couple about any point
            first = resultant_si(_clip(dl.si_pieces(), lo, hi))[1] * f
            terms.append((-1.0, Q_(first, "N*m").to(_KNM)))
        else:
            arm_term = xbar if abs(about) < tol else (xbar - w.lit(about))
            terms.append((-1.0, W * arm_term))
    return _Eq(label, terms, unknowns, description)


def _statics(result: BeamResult, loads: _Loads, solved: dict[str, Any], steps: list[Any]) -> bool:
    """Equations each giving one unknown reaction, as the engineer orders them. Returns False
    if the unknowns stay coupled (then the caller tabulates the solver's values)."""
    beam = result.beam
    L = beam.L_m
    wanted = [reaction_symbol(k) for k in reaction_keys(beam)]
    cands: list[_Eq] = []
    for h in beam.hinges:
        hx = h.x_m
        cands.append(
            _equation(
                loads,
                beam,
                0.0,
                hx,
                hx,
                rf"\Sigma M_{{{h.name}}} = 0",
                f"part left of hinge {h.name} (M = 0 at the hinge)",
                "L",
            )
        )
        cands.append(
            _equation(
                loads,
                beam,
                hx,
                L,
                hx,
                rf"\Sigma M_{{{h.name}}} = 0",
                f"part right of hinge {h.name} (M = 0 at the hinge)",
                "R",
            )
        )
    cands.append(_equation(loads, beam, 0.0, L, None, r"\Sigma F_y = 0", "whole beam, up +"))
    for s in beam.supports:
        cands.append(
            _equation(
                loads,
                beam,
                0.0,
                L,
                s.x_m,
                rf"\Sigma M_{{{s.label}}} = 0",
                f"whole beam, moments about support {s.label}",
            )
        )
    used: set[int] = set()
    progress = True
    while progress and any(w not in solved for w in wanted):
        progress = False
        for i, eq in enumerate(cands):
            if i in used:
                continue
            open_ = [u for u in eq.unknowns if u[2] not in solved and abs(u[0]) > 1e-12 * L]
            if len(open_) != 1:
                continue
            used.add(i)
            progress = True
            _emit(loads.w, eq, open_[0], solved, steps)
            break
    return all(w in solved for w in wanted)


def _emit(
    w: Writer, eq: _Eq, target: tuple[float, Any, str], solved: dict[str, Any], steps: list[Any]
) -> None:
    unit = w.u("moment") if target[2].startswith("M_") else w.u("force")
    U = Unknown(target[2], unit=unit)
    lhs: Any = None
    rest: Any = None
    for coef, cterm, name in eq.unknowns:  # reactions first, as written by hand
        if name == target[2]:
            lhs = _acc(lhs, -1.0 if cterm == -1 else 1.0, U if cterm in (1, -1) else U * cterm)
            continue
        known = solved.get(name)
        if known is None or abs(coef) <= 0:
            continue
        sign = -1.0 if cterm == -1 else 1.0
        piece = known if cterm in (1, -1) else known * cterm
        lhs = _acc(lhs, sign, piece)
        rest = _acc(rest, -sign, piece)
    for sign, t in eq.terms:
        lhs = _acc(lhs, sign, t)
        rest = _acc(rest, -sign, t)
    if rest is None:
        rest = Q_(0.0, unit)
    steps.append(w.equation(lhs, 0, label=eq.label, description=eq.description))
    cterm = target[1]
    formula = rest if cterm == 1 else (-rest if cterm == -1 else rest / cterm)
    name, comp = target[2].split("_", 1)
    what = {"R": "vertical reaction at", "M": "moment reaction (clockwise +) at"}[name]
    value = w.derived(target[2], formula, f"{what} support {comp}", unit=unit)
    steps.append(value)
    solved[target[2]] = value


# -- flexibility method -------------------------------------------------------------------------
def _flexibility(w: Writer, result: BeamResult, solved: dict[str, Any], steps: list[Any]) -> bool:
    plan = flexibility_plan(result)
    if plan is None:
        return False
    beam = result.beam
    n = len(plan.redundants)
    redundants, names = plan.redundants, plan.names
    F, D0, flex, X = plan.F, plan.D0, plan.spring_flexibility, plan.X
    steps.append(Heading("Flexibility method", level=3))
    what = ", ".join(names)
    steps.append(
        Text(
            f"The beam is statically indeterminate to degree {n} in bending. Redundants: {what}. "
            "Removing them leaves a stable, statically determinate released beam. Its "
            "deflections (exact, by integrating M/EI over the piecewise-polynomial moment) under "
            "the loads, Δ_i0, and under a unit value of each redundant, f_ij, give one "
            "compatibility condition per redundant: Δ_i0 + Σ f_ij·X_j = 0 (the support does "
            "not move; on a spring the support moves by −X_i/k_i, so X_i/k_i is added)."
        )
    )

    # (internal unit of the movement, its display unit, internal unit of the redundant,
    # its display unit); unit redundants were applied as 1 kN and 1 kN·m.
    du = {
        "Fy": ("m", w.u("deflection"), "kN", w.u("force")),
        "C": ("rad", "rad", "kN*m", w.u("moment")),
    }
    d_terms = []
    f_terms: list[list[Any]] = []
    for i, ki in enumerate(redundants):
        base_u, show_u, _, _ = du[ki[1]]
        move = "upward movement" if ki[1] == "Fy" else "clockwise rotation"
        d = w.derived(
            f"Delta_{ki[0]}0",
            Q_(D0[i], base_u).to(show_u),
            f"{move} of the released beam at {ki[0]} under the loads",
            unit=show_u,
        )
        steps.append(d)
        d_terms.append(d)
        row = []
        for j, kj in enumerate(redundants):
            unit_of_x = du[kj[1]][2]
            show = f"{show_u}/({du[kj[1]][3]})"
            val = (Q_(F[i][j], base_u) / Q_(1.0, unit_of_x)).to(show)
            fij = w.derived(
                f"f_{ki[0]}{kj[0]}",
                val,
                f"{move} at {ki[0]} due to a unit {names[j]} on the released beam",
                unit=show,
            )
            steps.append(fij)
            row.append(fij)
        f_terms.append(row)
    unknowns = [Unknown(nm, unit=du[k[1]][3]) for nm, k in zip(names, redundants, strict=True)]
    for i, ki in enumerate(redundants):
        lhs: Any = d_terms[i]
        for j in range(n):
            lhs = lhs + f_terms[i][j] * unknowns[j]
        if flex[i]:
            s = beam.support(ki[0])
            k = s.k if ki[1] == "Fy" else s.k_theta  # type: ignore[attr-defined]
            kk = w.given(f"k_{ki[0]}", k, f"spring stiffness at {ki[0]}")
            steps.append(kk)
            lhs = lhs + unknowns[i] / kk
        steps.append(
            w.equation(
                lhs,
                0,
                label=rf"\Delta_{{{ki[0]}}} = 0",
                description=f"compatibility at support {ki[0]}",
            )
        )
    for i, ki in enumerate(redundants):
        unit = du[ki[1]][3]
        if n == 1 and not flex[0]:
            value = w.derived(
                names[0], -d_terms[0] / f_terms[0][0], "redundant from compatibility", unit=unit
            )
        else:
            value = w.derived(
                names[i],
                Q_(X[i], du[ki[1]][2]),
                f"redundant, from the compatibility equations solved together ({n} equations)",
                unit=unit,
            )
        steps.append(value)
        solved[names[i]] = value
    return True


# -- public --------------------------------------------------------------------------------------
def beam_working(
    result: BeamResult, *, title: str | None = None, sheet: Any = None, system: str | None = None
) -> Any:
    """The working of ``result`` as a titled Block of steps (add it to a Sheet with ``add``).

    Args:
        title: the block's title. sheet: the Sheet it is for (its unit system and significant
            figures are used). system: "SI" or "US" when no sheet is given.
    """
    return _beam_working(Writer(_pick_settings(sheet, system)), result, title)


def _pick_settings(sheet: Any, system: str | None) -> DisplaySettings:
    if sheet is not None and getattr(sheet, "settings", None) is not None:
        out: DisplaySettings = sheet.settings
        return out
    base = get_display()
    if system is None:
        return base
    from calcpack.units import validate_display

    validate_display(system, None)
    return DisplaySettings(system=system, sig_figs=base.sig_figs)


def _beam_working(w: Writer, result: BeamResult, title: str | None) -> Any:
    beam = result.beam
    steps: list[Any] = [
        Heading(title or f"Beam {beam.name}: reactions ({result.label})", 2),
        Text(SIGN_CONVENTION),
    ]
    steps.append(
        w.table(
            columns=["support", "type", "x"],
            rows=[[s.label, s.kind, s.x] for s in beam.supports]
            + [[h.name or "", "internal hinge", h.x] for h in beam.hinges],
            caption=f"Beam {beam.name}: span L = {beam.length:~.4g}, supports and hinges",
        )
    )
    steps.append(Text(f"Classification: {result.classification.describe()}."))
    steps.append(Heading("Loads and resultants", 3))
    from calcpack.analysis.beam.load_table import load_table

    acting = {case for case, _ in result.cases}
    steps.append(
        load_table(
            [ld for ld in beam.loads if ld.case in acting],
            member=beam.name,
            length=beam.length,
            settings=w.settings,
        )
    )
    steps.append(
        Text(
            "Each distributed load acts in the equilibrium equations through its "
            "resultant W = ∫w dx, placed at x̄ = ∫x·w dx / W."
        )
    )
    loads = _Loads(w, result, steps)
    for dl, f, k in loads.dist:
        loads.resultant(dl, f, k, dl.a_m, dl.b_m)
    solved: dict[str, Any] = {}
    steps.append(Heading("Equilibrium", 3))
    hx = [s for s in beam.supports if s.restrains_h]
    if loads.axial:
        if len(hx) == 1:
            H = Unknown(f"H_{hx[0].label}", unit=w.u("force"))
            total: Any = H
            for _, h in loads.axial:
                total = total + h
            steps.append(w.equation(total, 0, label=r"\Sigma F_x = 0", description="+ toward +x"))
            rest: Any = 0
            for _, h in loads.axial:
                rest = rest - h
            steps.append(
                w.derived(
                    f"H_{hx[0].label}",
                    rest,
                    f"horizontal reaction at {hx[0].label}",
                    unit=w.u("force"),
                )
            )
        else:
            steps.append(
                Text(
                    f"ΣFx = 0 with {len(hx)} horizontal restraints: the axial load is shared so "
                    "the beam's length between restraints is unchanged (uniform axial stiffness "
                    "assumed): "
                    + ", ".join(
                        f"H_{r.support} = {r.Fx:~.3g}" for r in result.reactions if r.Fx.magnitude
                    )
                )
            )
    elif hx:
        steps.append(
            Text(
                "No load acts along the beam: ΣFx = 0 gives "
                + ", ".join(f"H_{s.label} = 0" for s in hx)
                + "."
            )
        )
    ok = True
    if result.classification.degree_bending > 0:
        ok = _flexibility(w, result, solved, steps)
        if ok:
            steps.append(Heading("Remaining reactions by equilibrium", 3))
    if ok:
        ok = _statics(result, loads, solved, steps)
    if not ok:
        steps.append(
            Text(
                "The reactions are coupled; they are solved together with the "
                "compatibility conditions by the exact solver (see the table)."
            )
        )
    steps.append(_reaction_table(w, result))
    steps += extremes_steps(w, result)
    return Block(steps=steps[1:], title=title or f"Beam {beam.name}: reactions ({result.label})")


def _reaction_table(w: Writer, result: BeamResult) -> Any:
    rows = []
    for r in result.reactions:
        rows.append(
            [
                r.support,
                r.kind,
                r.x.to(w.u("length")),
                r.Fy.to(w.u("force")),
                r.Fx.to(w.u("force")),
                r.C.to(w.u("moment")),
            ]
        )
    return w.table(
        columns=["support", "type", "x", "R (up +)", "H (+x)", "M (clockwise +)"],
        rows=rows,
        caption=f"Reactions, {result.label}",
    )


def extremes_steps(w: Writer, result: BeamResult) -> list[Any]:
    """Heading, a table of the extremes and the key values as Derived records."""
    e = result.extremes
    steps: list[Any] = [Heading("Shear, moment and deflection", 3)]
    F, Mu, D, Lu = w.u("force"), w.u("moment"), w.u("deflection"), w.u("length")
    rows: list[list[Any]] = [
        ["V max", e.V_max.value.to(F), e.V_max.x.to(Lu), e.V_max.side],
        ["V min", e.V_min.value.to(F), e.V_min.x.to(Lu), e.V_min.side],
        ["M max (sagging)", e.M_max.value.to(Mu), e.M_max.x.to(Lu), e.M_max.side],
        ["M min (hogging if < 0)", e.M_min.value.to(Mu), e.M_min.x.to(Lu), e.M_min.side],
    ]
    if e.has_deflection and e.deflection_down is not None:
        rows.append(["δ max, down", e.deflection_down.value.to(D), e.deflection_down.x.to(Lu), ""])
    if e.has_deflection and e.deflection_up is not None:
        rows.append(
            ["upward movement max", e.deflection_up.value.to(D), e.deflection_up.x.to(Lu), ""]
        )
    if e.has_deflection:
        rows.append(["slope at x = 0 (ccw +)", e.slope_left, Q_(0.0, Lu), ""])
        rows.append(["slope at x = L (ccw +)", e.slope_right, result.beam.length.to(Lu), ""])
    steps.append(
        w.table(
            columns=["quantity", "value", "at x", "side"],
            rows=rows,
            caption=f"Extremes, {result.label} (exact)",
        )
    )
    zs = ", ".join(f"{x.to(Lu):~.3g}" for x in e.zero_shear) or "none inside the beam"
    cf = ", ".join(f"{x.to(Lu):~.3g}" for x in e.contraflexure) or "none"
    steps.append(Text(f"Zero shear at x = {zs}. Points of contraflexure at x = {cf}."))
    steps.append(
        w.derived(
            "M_max",
            e.M_max.value,
            f"largest sagging moment, {result.beam.name}",
            unit=w.u("moment"),
        )
    )
    steps.append(
        w.derived(
            "M_min", e.M_min.value, f"most hogging moment, {result.beam.name}", unit=w.u("moment")
        )
    )
    vabs = e.V_max if abs(e.V_max.value_si) >= abs(e.V_min.value_si) else e.V_min
    steps.append(
        w.derived(
            "V_max",
            Q_(abs(vabs.value_si), "N"),
            f"largest shear magnitude, {result.beam.name}",
            unit=w.u("force"),
        )
    )
    if e.has_deflection and e.deflection_down is not None:
        steps.append(
            w.derived(
                "delta_max",
                e.deflection_down.value,
                f"largest downward deflection, {result.beam.name}",
                unit=w.u("deflection"),
            )
        )
    return steps


def cut_working(
    result: BeamResult, x: Any, *, side: str = "left", sheet: Any = None, system: str | None = None
) -> Any:
    """Cut-section working at ``x``: the free body of the part of the beam left of the cut,
    ΣFy = 0 and ΣM about the cut = 0 giving V and M from first principles.

    ``side="left"`` cuts just left of x (actions at x excluded), ``"right"`` just right of it.
    """
    return _cut_working(Writer(_pick_settings(sheet, system)), result, x, side)


def _cut_working(w: Writer, result: BeamResult, x: Any, side: str) -> Any:
    from calcpack.loads._si import check

    beam = result.beam
    xq = check(x, "[length]", "x")
    x_m = float(xq.to("m").magnitude)
    L = beam.L_m
    eps = 1e-9 * L
    hi = x_m - eps if side == "left" else x_m + eps  # for the point actions only
    steps: list[Any] = [Heading(f"Cut at x = {xq:~.4g} ({side} of the point), beam {beam.name}", 3)]
    steps.append(
        Text(
            "Free body of the beam left of the cut. On its cut face the shear V acts "
            "downward and the moment M counter-clockwise when both are positive "
            "(sagging M, left face of the next element pushed up)."
        )
    )
    loads = _Loads(w, result, steps, upto=hi)
    if side not in ("left", "right"):
        from calcpack.errors import InputError

        raise InputError(
            f"side must be 'left' or 'right' (got side = {side!r})",
            name="side",
            value=side,
            expected="'left' or 'right'",
        )
    react = {r.support: r for r in result.reactions}
    rterms = []
    for s in beam.supports:
        if s.x_m > hi:
            continue
        r = react[s.label]
        if s.restrains_v:
            R = w.given(
                f"R_{s.label}",
                r.Fy,
                f"reaction at {s.label} (from the analysis)",
                unit=w.u("force"),
                result=True,
            )
            steps.append(R)
            rterms.append(("F", s.x_m, R))
        if s.restrains_rotation:
            Mr = w.given(
                f"M_{s.label}",
                r.C,
                f"moment reaction at {s.label}, clockwise +",
                unit=w.u("moment"),
                result=True,
            )
            steps.append(Mr)
            rterms.append(("C", s.x_m, Mr))
    eqV = _equation(
        loads, beam, 0.0, x_m, None, r"\Sigma F_y = 0", "left part, up +", "c", cut_side=side
    )
    eqM = _equation(
        loads,
        beam,
        0.0,
        x_m,
        x_m,
        r"\Sigma M_{c} = 0",
        "left part, moments about the cut c, ccw +",
        "c",
        cut_side=side,
    )
    V = Unknown("V", unit=w.u("force"))
    M = Unknown("M", unit=w.u("moment"))
    lhsV: Any = None
    restV: Any = None
    for kind, _xs, t in rterms:
        if kind == "F":
            lhsV = _acc(lhsV, 1.0, t)
            restV = _acc(restV, 1.0, t)
    for sign, term in eqV.terms:
        lhsV = _acc(lhsV, sign, term)
        restV = _acc(restV, sign, term)
    lhsV = _acc(lhsV, -1.0, V)
    steps.append(w.equation(lhsV, 0, label=eqV.label, description=eqV.description))
    steps.append(
        w.derived(
            "V",
            restV if restV is not None else Q_(0.0, "kN"),
            f"shear at x = {xq:~.4g} ({side})",
            unit=w.u("force"),
        )
    )
    lhsM: Any = None
    restM: Any = None
    for kind, xs, t in rterms:
        if kind == "F" and abs(x_m - xs) > eps:
            lhsM = _acc(lhsM, -1.0, t * w.lit(x_m - xs))
            restM = _acc(restM, 1.0, t * w.lit(x_m - xs))
        elif kind == "C":
            lhsM = _acc(lhsM, -1.0, t)
            restM = _acc(restM, 1.0, t)
    for sign, term in eqM.terms:
        lhsM = _acc(lhsM, sign, term)
        restM = _acc(restM, -sign, term)
    lhsM = _acc(lhsM, 1.0, M)
    steps.append(w.equation(lhsM, 0, label=eqM.label, description=eqM.description))
    steps.append(
        w.derived(
            "M",
            restM if restM is not None else Q_(0.0, "kN*m"),
            f"bending moment at x = {xq:~.4g} ({side}), sagging +",
            unit=w.u("moment"),
        )
    )
    return Block(steps=steps[1:], title=f"Cut at x = {xq:~.4g} ({side}), beam {beam.name}")
