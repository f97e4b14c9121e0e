"""Beam results: reactions and exact piecewise-polynomial V, M, slope and deflection.

Sign convention (stated on every sheet that shows these results):

* x from the left end; loads positive downward; reactions positive upward (forces), toward +x
  (horizontal) and clockwise (moments);
* shear V is positive when the left face of an element is pushed upward (the element is
  rotated clockwise): V(x) = Σ upward forces to the left of x, so dV/dx = −w;
* bending moment M is positive sagging (tension at the bottom), dM/dx = V;
* slope θ is positive counter-clockwise (θ = dv/dx with v upward);
* **deflection δ is positive downward** (δ = −v): a beam sagging under gravity has δ > 0.
* axial force N is positive in tension.

Results are linear in the loads: ``a * r1 + b * r2`` (same beam structure) is the result of the
loads of ``r1`` scaled by a plus those of ``r2`` scaled by b. :func:`combine` does this for a
mapping of load-case results and factors.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from functools import cached_property
from typing import TYPE_CHECKING, Any

import numpy as np

from calcpack import views
from calcpack.analysis.beam.core import SIResult, evaluate, refine
from calcpack.analysis.beam.extremes import (
    BeamExtremes,
    RangeExtremes,
    RangeWhat,
    find_extremes,
    range_extremes,
)
from calcpack.analysis.beam.quantities import out_q
from calcpack.analysis.superposition import superpose
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Quantity, require
from calcpack.validate import find, finite

if TYPE_CHECKING:
    from calcpack.analysis.beam.model import Beam, BeamClassification

__all__ = ["BeamResult", "Reaction", "combine"]


@dataclass(frozen=True)
class Reaction:
    """The reaction at one support.

    Attributes:
        support: the support's name. kind: pin, roller, fixed or spring. x: its position.
        Fy: vertical force, upward + [force]. Fx: horizontal force, +x [force] (zero where not
        restrained). C: moment, clockwise + [force·length] (zero where rotation is free).
    """

    support: str
    kind: str
    x: Quantity
    Fy: Quantity
    Fx: Quantity
    C: Quantity


def _as_m(x: Any, name: str = "x") -> np.ndarray:
    q = require(x, "[length]", name)
    return np.asarray(q.to("m").magnitude, dtype=float)


def _label(cases: tuple[tuple[str, float], ...]) -> str:
    if len(cases) == 1 and cases[0][1] == 1.0:
        return cases[0][0]
    parts = []
    for i, (name, f) in enumerate(cases):
        sign = "-" if f < 0 else ("+" if i else "")
        mag = abs(f)
        coeff = "" if mag == 1.0 else f"{mag:.4g}"
        parts.append(f"{sign} {coeff}{name}".strip() if i else f"{sign}{coeff}{name}")
    return " ".join(parts)


@dataclass(frozen=True, eq=False)
class BeamResult:
    """The solved beam for one load case or a combination of cases.

    Attributes:
        beam: the beam model (all its loads; see ``cases`` for which ones act, with factors).
        cases: (case name, factor) pairs whose loads this result carries.
        classification: determinate / indeterminate (degree) of the beam.
        core: the SI piecewise polynomials (see :class:`calcpack.analysis.beam.core.SIResult`).

    Values at a point accept a length quantity (scalar or array) and ``side`` = "right"
    (default) or "left" for the value just right or left of a discontinuity; at the beam ends
    both sides give the value inside the beam.
    """

    beam: Beam
    cases: tuple[tuple[str, float], ...]
    classification: BeamClassification
    core: SIResult = field(repr=False)

    # -- identity ----------------------------------------------------------------------------
    @property
    def label(self) -> str:
        """The load case or combination, e.g. ``"D"`` or ``"1.2D + 1.6L"``."""
        return _label(self.cases)

    @property
    def has_deflection(self) -> bool:
        """True if slope and deflection are available (EI was given)."""
        return self.core.v is not None

    # -- reactions ---------------------------------------------------------------------------
    @property
    def reactions(self) -> tuple[Reaction, ...]:
        """The reaction at each support, left to right."""
        out = []
        for s in self.beam.supports:
            name = s.label
            r = self.core.reactions
            out.append(
                Reaction(
                    support=name,
                    kind=s.kind,
                    x=s.x,
                    Fy=out_q(r.get((name, "Fy"), 0.0) + 0.0, "force"),
                    Fx=out_q(r.get((name, "Fx"), 0.0) + 0.0, "force"),
                    C=out_q(r.get((name, "C"), 0.0) + 0.0, "moment"),
                )
            )
        return tuple(out)

    def reaction(self, support: str) -> Reaction:
        """The reaction at the support named ``support`` (e.g. ``"A"``)."""
        by_support = {r.support: r for r in self.reactions}
        return find(
            "support", support, by_support, what="support", where=f"on beam {self.beam.name}"
        )

    # -- values at points ----------------------------------------------------------------------
    def _at(self, g: np.ndarray | None, x: Any, side: str, what: str) -> np.ndarray:
        if g is None:
            raise OutOfScopeError(
                f"{what} of beam {self.beam.name} needs its stiffness: give EI when building "
                "the Beam"
            )
        xm = _as_m(x)
        L = self.beam.L_m
        if np.any(xm < -1e-9 * L) or np.any(xm > L * (1 + 1e-9)):
            raise InputError(
                f"Position x must lie on the beam, 0 to L = {self.beam.length:~P} (got x = {x:~P})",
                name="x",
                value=x,
                expected=f"0 to {self.beam.length:~P}",
            )
        return evaluate(self.core.X, g, xm, side)

    def load_intensity(self, x: Any, side: str = "right") -> Quantity:
        """Line load w at x, downward + [kN/m]."""
        return out_q(self._at(self.core.w, x, side, "Load"), "line")

    def shear(self, x: Any, side: str = "right") -> Quantity:
        """Shear force V at x [kN] (left face upward +, dV/dx = −w)."""
        return out_q(self._at(self.core.V, x, side, "Shear"), "force")

    def moment(self, x: Any, side: str = "right") -> Quantity:
        """Bending moment M at x [kN·m], sagging + (dM/dx = V)."""
        return out_q(self._at(self.core.M, x, side, "Moment"), "moment")

    def slope(self, x: Any, side: str = "right") -> Quantity:
        """Slope θ at x [rad], counter-clockwise + (θ = dv/dx, v upward). Jumps at hinges."""
        return out_q(self._at(self.core.T, x, side, "Slope"), "angle")

    def deflection(self, x: Any) -> Quantity:
        """Deflection δ at x [mm], **positive downward** (δ = −v)."""
        return out_q(-self._at(self.core.v, x, "right", "Deflection"), "deflection")

    def axial(self, x: Any, side: str = "right") -> Quantity:
        """Axial force N at x [kN], tension +."""
        N = self.core.N[:, None]
        return out_q(self._at(N, x, side, "Axial force"), "force")

    # -- extremes ----------------------------------------------------------------------------
    @cached_property
    def extremes(self) -> BeamExtremes:
        """Max and min V and M with locations, zero-shear points, contraflexure points, maximum
        deflection (down and up) with location, end slopes -- all exact to round-off."""
        return find_extremes(self)

    def range_extremes(self, what: RangeWhat, a: Any = None, b: Any = None) -> RangeExtremes:
        """Exact largest and smallest V, M or δ on a <= x <= b (the whole beam by default).

        Args:
            what: "shear" (left face up +), "moment" (sagging +) or "deflection" (down +).
            a, b: the range's ends [length]; None for the beam's ends.

        Returns:
            The extremes with their positions (``.magnitude`` is the one of larger |value|).

        Raises:
            InputError: a or b off the beam or b < a (names the input); ``what`` unknown.
            OutOfScopeError: a deflection asked of a beam without EI.
        """
        a_m = 0.0 if a is None else float(_as_m(a, "a"))
        b_m = self.beam.L_m if b is None else float(_as_m(b, "b"))
        return range_extremes(self.core, what, a_m, b_m)

    # -- superposition -----------------------------------------------------------------------
    def scaled(self, factor: float) -> BeamResult:
        """This result with every load multiplied by ``factor`` (linear elastic).

        Raises:
            InputError: ``factor`` is not a finite number, or the scaled result overflows.
        """
        f = float(finite("factor", factor))
        c = self.core
        with np.errstate(over="ignore", invalid="ignore"):  # refused just below
            core = SIResult(
                c.X,
                f * c.w,
                f * c.V,
                f * c.M,
                None if c.T is None else f * c.T,
                None if c.v is None else f * c.v,
                f * c.N,
                {k: f * val for k, val in c.reactions.items()},
                {k: f * val for k, val in c.hinge_rotation.items()},
            )
        if not (np.isfinite(core.M).all() and np.isfinite(core.V).all()):
            raise InputError(
                f"Result {self.label} times factor = {f:g} overflows (a non-finite moment or "
                "shear)",
                name="factor",
                value=f,
                expected="a factor that keeps the results finite",
            )
        return BeamResult(
            self.beam, tuple((n, f * g) for n, g in self.cases), self.classification, core
        )

    def __mul__(self, factor: float) -> BeamResult:
        if not isinstance(factor, int | float):
            return NotImplemented
        return self.scaled(factor)

    __rmul__ = __mul__

    def __neg__(self) -> BeamResult:
        return self.scaled(-1.0)

    def __add__(self, other: BeamResult) -> BeamResult:
        if not isinstance(other, BeamResult):
            return NotImplemented
        if not self.beam.same_structure(other.beam):
            raise InputError(
                f"Results can be added only for the same beam structure (got {self.beam.name} "
                f"and {other.beam.name} with different length, supports, hinges or EI)",
                name="other",
                value=other.beam.name,
                expected="a result of the same beam",
            )
        a, b = self.core, other.core
        X = np.unique(np.concatenate([a.X, b.X]))
        keep = np.concatenate([[True], np.diff(X) > 1e-9 * self.beam.L_m])
        X = X[keep]

        def add(ga: np.ndarray | None, gb: np.ndarray | None) -> np.ndarray | None:
            if ga is None or gb is None:
                return None
            K = max(ga.shape[1], gb.shape[1])
            return np.asarray(refine(a.X, ga, X, K) + refine(b.X, gb, X, K), dtype=float)

        def add1(na: np.ndarray, nb: np.ndarray) -> np.ndarray:
            out = refine(a.X, na[:, None], X, 1)[:, 0] + refine(b.X, nb[:, None], X, 1)[:, 0]
            return np.asarray(out, dtype=float)

        keys = set(a.reactions) | set(b.reactions)
        hk = set(a.hinge_rotation) | set(b.hinge_rotation)
        w = add(a.w, b.w)
        V = add(a.V, b.V)
        M = add(a.M, b.M)
        assert w is not None
        assert V is not None
        assert M is not None
        core = SIResult(
            X,
            w,
            V,
            M,
            add(a.T, b.T),
            add(a.v, b.v),
            add1(a.N, b.N),
            {k: a.reactions.get(k, 0.0) + b.reactions.get(k, 0.0) for k in keys},
            {k: a.hinge_rotation.get(k, 0.0) + b.hinge_rotation.get(k, 0.0) for k in hk},
        )
        merged: dict[str, float] = {}
        for name, f in (*self.cases, *other.cases):
            merged[name] = merged.get(name, 0.0) + f
        return BeamResult(self.beam, tuple(merged.items()), self.classification, core)

    def __sub__(self, other: BeamResult) -> BeamResult:
        return self + (-1.0) * other

    # -- display (built lazily, never on the numeric path) -------------------------------------
    def working(self, **options: Any) -> Any:
        """The working for a sheet: model, classification, load resultants, equilibrium (or
        the compatibility method), reactions and extremes, as a calcpack.working Block (add it
        to a Sheet with ``sheet.add``). Options: ``sheet=`` (use its units and digits),
        ``system="SI"``/``"US"``, ``title=``."""
        from calcpack.analysis.beam.working import beam_working

        return beam_working(self, **options)

    def cut(self, x: Quantity, side: str = "left", **options: Any) -> Any:
        """The cut-section working at ``x``: the free body of the part left of the cut, its
        ΣFy = 0 and ΣM = 0 equations giving V and M from first principles. ``side`` "left"
        cuts just left of x, "right" just right of it; options: ``sheet=`` or ``system=``."""
        from calcpack.analysis.beam.working import cut_working

        return cut_working(self, x, side=side, **options)

    def figure(self, **options: Any) -> Any:
        """The stacked loading / shear / moment / deflection figure (SVG, see calcpack.plots)."""
        return views.render("figure", self, **options)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        """In Jupyter a result shows its diagrams (SVG) and a one-line text summary."""
        return views.mimebundle(self, include, exclude)


def combine(results: Mapping[str, BeamResult], factors: Mapping[str, float]) -> BeamResult:
    """Σ factor × result over load cases: the result of a load combination by superposition
    (:func:`calcpack.analysis.superposition.superpose`).

    Args:
        results: load-case name -> result of that case alone (e.g. from
            :func:`calcpack.analysis.beam.solve_cases`).
        factors: load-case name -> load factor, e.g. ``{"D": 1.2, "L": 1.6}``. A case in
            ``factors`` with no result is an error; cases without a factor are left out.

    Raises:
        InputError: a factor names a case that has no result, or no factors are given.
    """
    total: BeamResult = superpose(results, factors)
    return total
