"""The pieces the beam working is written with: a Writer holding the sheet's display settings,
the active loads as Given/Derived terms (distributed loads through their resultants), and the
equilibrium of a part of the beam about a point as known terms and unknown reactions."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from calcpack.analysis.beam.model import Beam
from calcpack.analysis.beam.statics import Region, clip_pieces
from calcpack.loads.resultants import resultant_si
from calcpack.loads.types import (
    AreaLoad,
    DistributedLoad,
    LinearLoad,
    PointLoad,
    PointMoment,
    UniformLoad,
)
from calcpack.units import Q_, DisplaySettings, get_display, ureg
from calcpack.working import Derived, Equation, Given, Table, Term
from calcpack.working.expr import as_term

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = [
    "UNITS",
    "LoadTerms",
    "Writer",
    "accumulate",
    "load_terms",
    "pick_settings",
]

_M = ureg.Unit("m")
_KN = ureg.Unit("kN")
_KNM = ureg.Unit("kN*m")

UNITS = {
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
        return UNITS.get(self.settings.system, UNITS["SI"])[kind]

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


def accumulate(expr: Any, sign: float, term: Any) -> Any:
    """expr ± term, starting from None (so no leading "0 +" is printed)."""
    if expr is None:
        return term if sign > 0 else -term
    return expr + term if sign > 0 else expr - term


# -- the loads as working terms ---------------------------------------------------------------
class LoadTerms:
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
        pieces = clip_pieces(load.si_pieces(), lo, hi)
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


# -- the known terms of an equilibrium equation ------------------------------------------------
def load_terms(loads: LoadTerms, beam: Beam, region: Region) -> list[tuple[float, Term]]:
    """The loads on ``region`` as (sign, positive-sense term) in its equation: ΣFy (up +) when
    ``region.about_m`` is None, else ΣM about it (ccw +). The numbers are those of
    :func:`calcpack.analysis.beam.statics.load_sum_si`; this writes them as terms."""
    w = loads.w
    tol = 1e-9 * beam.L_m
    about = region.about_m
    lo, hi = region.lo_m, region.hi_m
    terms: list[tuple[float, Term]] = []
    for load, _f, P in loads.points:
        x = load.x.to("m").magnitude
        if not region.contains(x, tol):
            continue
        if about is None:
            terms.append((-1.0, P))
        elif abs(x - about) > tol:
            terms.append((-1.0, P * w.lit(x - about)))
    if about is not None:
        for cl, _f, C in loads.couples:
            if region.contains(cl.x.to("m").magnitude, tol):
                terms.append((-1.0, C))
    for dl, f, k in loads.dist:
        got = loads.resultant(dl, f, k, max(lo, dl.a_m), min(hi, dl.b_m), region.part)
        if got is None:
            continue
        W, xbar, _W_N, _x_m = got
        if about is None:
            terms.append((-1.0, W))
        elif xbar is None:  # zero net force: the load is a pure couple about any point
            first = resultant_si(clip_pieces(dl.si_pieces(), lo, hi))[1] * f
            terms.append((-1.0, Q_(first, "N*m").to(_KNM)))
        else:
            arm_term = xbar if abs(about) < tol else (xbar - w.lit(about))
            terms.append((-1.0, W * arm_term))
    return terms


def pick_settings(sheet: Any, system: str | None) -> DisplaySettings:
    if sheet is not None and getattr(sheet, "settings", None) is not None:
        out: DisplaySettings = sheet.settings
        return out
    base = get_display()
    if system is None:
        return base
    from calcpack.units import validate_display

    validate_display(system, None)
    return DisplaySettings(system=system, sig_figs=base.sig_figs)
