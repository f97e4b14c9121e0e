"""Load types for beams: point forces, couples and distributed loads, each in a named load case.

Sign convention (all load types):

* ``x`` is measured from the left end of the beam.
* Transverse forces and distributed loads are positive **downward** (gravity).
* The axial component of a point force ``H`` is positive in the **+x** direction (to the right).
* Couples (point moments) are positive **clockwise**, seen with x to the right and y up; a
  clockwise couple makes the sagging-positive bending moment jump up by its value.

Every load carries a ``case`` name (``"D"`` dead, ``"L"`` live, ``"Lr"`` roof live, ``"S"`` snow,
``"W"`` wind, or any name of your own) so that each case can be analysed alone and the results
combined by superposition.

Internally each load reduces to SI pieces (:class:`SIPiece`, :class:`SIPoint`) that the numeric
core reads; the quantities given are kept for display.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field, replace
from typing import Any, NamedTuple

import numpy as np

from calcpack.errors import InputError
from calcpack.loads._si import check as require
from calcpack.loads._si import fast_si as si
from calcpack.units import Q_, Quantity
from calcpack.validate import at_least, instance, non_empty, within

__all__ = [
    "AreaLoad",
    "DistributedLoad",
    "FunctionLoad",
    "LinearLoad",
    "Load",
    "PointLoad",
    "PointMoment",
    "PolynomialLoad",
    "SIPiece",
    "SIPoint",
    "UniformLoad",
    "si_parts",
]

_ZERO_KN = Q_(0.0, "kN")  # shared defaults: quantities are not mutated
_ZERO_M = Q_(0.0, "m")
_FORCE = "[force]"
_LINE = "[force] / [length]"
_LENGTH = "[length]"
_MOMENT = "[force] * [length]"


class SIPiece(NamedTuple):
    """A polynomial line load in SI: w(x) = Σ c_k (x - a)^k N/m on a <= x <= b (downward +).

    (A named tuple: the numeric core makes these for every load on every solve.)"""

    a_m: float
    b_m: float
    coeffs: tuple[float, ...]


class SIPoint(NamedTuple):
    """A point action in SI at x: force P (N, down +), axial H (N, +x), couple C (N·m, cw +)."""

    x_m: float
    P_N: float = 0.0
    H_N: float = 0.0
    C_Nm: float = 0.0


def _case(case: object) -> str:
    return non_empty("case", case, expected="the load case's name, such as 'D' or 'L'")


@dataclass(frozen=True)
class Load:
    """Base of all loads. ``case`` names the load case; ``label`` is an optional description."""

    case: str = field(default="D", kw_only=True)
    label: str | None = field(default=None, kw_only=True)

    def __post_init__(self) -> None:
        object.__setattr__(self, "case", _case(self.case))

    # -- interface read by the beam model and the numeric core --------------------------------
    def resolved(self, length: Quantity) -> Load:
        """This load with open ends (``end=None``) set to the beam length, checked to lie on it."""
        return self

    def si_pieces(self) -> tuple[SIPiece, ...]:
        """Distributed parts as SI polynomial pieces (empty for point actions)."""
        return ()

    def si_points(self) -> tuple[SIPoint, ...]:
        """Point parts in SI (empty for distributed loads)."""
        return ()

    def positions(self) -> tuple[Quantity, ...]:
        """The positions that bound this load (for range checks and diagrams)."""
        raise NotImplementedError

    def describe(self) -> str:
        """A short text description with values, e.g. ``"P = 12 kN at x = 2 m (D)"``."""
        raise NotImplementedError


@dataclass(frozen=True)
class PointLoad(Load):
    """A point force at ``x``.

    Args:
        x: position from the left end [length].
        P: transverse component, positive downward [force].
        H: axial component along the beam, positive toward +x (default 0) [force].
        case: load case name. label: description.

    Use :meth:`inclined` for a force given by magnitude and angle.
    """

    x: Quantity
    P: Quantity
    H: Quantity = field(default_factory=lambda: _ZERO_KN)

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.x, _LENGTH, "x")
        require(self.P, _FORCE, "P")
        require(self.H, _FORCE, "H")

    @classmethod
    def inclined(
        cls,
        x: Quantity,
        F: Quantity,
        angle: Quantity,
        *,
        case: str = "D",
        label: str | None = None,
    ) -> PointLoad:
        """A force of magnitude ``F`` at ``angle`` below the +x axis (90° = straight down).

        The transverse component is P = F·sin(angle) (down +), the axial H = F·cos(angle) (+x).
        """
        require(F, _FORCE, "F")
        require(angle, "[]", "angle")
        a = float(angle.to("rad").magnitude)
        return cls(x=x, P=F * math.sin(a), H=F * math.cos(a), case=case, label=label)

    def positions(self) -> tuple[Quantity, ...]:
        return (self.x,)

    def si_points(self) -> tuple[SIPoint, ...]:
        return (SIPoint(si(self.x), P_N=si(self.P), H_N=si(self.H)),)

    def describe(self) -> str:
        h = f", H = {self.H:~.4g}" if si(self.H) != 0 else ""
        return f"P = {self.P:~.4g}{h} at x = {self.x:~.4g} ({self.case})"


@dataclass(frozen=True)
class PointMoment(Load):
    """A couple ``C`` applied at ``x``, positive clockwise [force·length]."""

    x: Quantity
    C: Quantity

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.x, _LENGTH, "x")
        require(self.C, _MOMENT, "C")

    def positions(self) -> tuple[Quantity, ...]:
        return (self.x,)

    def si_points(self) -> tuple[SIPoint, ...]:
        return (SIPoint(si(self.x), C_Nm=si(self.C)),)

    def describe(self) -> str:
        return f"C = {self.C:~.4g} (clockwise +) at x = {self.x:~.4g} ({self.case})"


@dataclass(frozen=True)
class DistributedLoad(Load):
    """Base of loads spread over ``start`` <= x <= ``end``; ``end=None`` runs to the beam end."""

    start: Quantity = field(default_factory=lambda: _ZERO_M, kw_only=True)
    end: Quantity | None = field(default=None, kw_only=True)

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.start, _LENGTH, "start")
        if self.end is not None:
            require(self.end, _LENGTH, "end")
            if not si(self.end) > si(self.start):
                raise InputError(
                    f"Distributed load end must be greater than its start (got start = "
                    f"{self.start:~P}, end = {self.end:~P})",
                    name="end",
                    value=self.end,
                    expected="end > start",
                )

    def resolved(self, length: Quantity) -> Load:
        if self.end is None:
            if not si(length) > si(self.start):
                raise InputError(
                    f"Distributed load start must lie before the beam end (got start = "
                    f"{self.start:~P}, beam length L = {length:~P})",
                    name="start",
                    value=self.start,
                    expected="start < L",
                )
            return replace(self, end=length.to(self.start.units))
        return self

    @property
    def a_m(self) -> float:
        return si(self.start)

    @property
    def b_m(self) -> float:
        if self.end is None:
            raise InputError(
                "Distributed load has no end yet: add it to a beam first, or give end=",
                name="end",
                value=None,
                expected="a length",
            )
        return si(self.end)

    def positions(self) -> tuple[Quantity, ...]:
        return (self.start,) if self.end is None else (self.start, self.end)

    def intensity_si(self, x_m: np.ndarray) -> np.ndarray:
        """w at positions x (m), N/m, downward +; zero outside the load."""
        out = np.zeros_like(np.asarray(x_m, dtype=float))
        for p in self.si_pieces():
            xi = np.asarray(x_m, dtype=float) - p.a_m
            inside = (x_m >= p.a_m) & (x_m <= p.b_m)
            val = np.polynomial.polynomial.polyval(xi, np.asarray(p.coeffs))
            out = np.where(inside, out + val, out)
        return out

    def _range_text(self) -> str:
        end = "end" if self.end is None else f"{self.end:~.4g}"
        return f"x = {self.start:~.4g} to {end}"


@dataclass(frozen=True)
class UniformLoad(DistributedLoad):
    """A uniform line load ``w`` (downward +) [force/length] from ``start`` to ``end``."""

    w: Quantity

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.w, _LINE, "w")

    def si_pieces(self) -> tuple[SIPiece, ...]:
        return (SIPiece(self.a_m, self.b_m, (si(self.w),)),)

    def describe(self) -> str:
        return f"w = {self.w:~.4g} uniform, {self._range_text()} ({self.case})"


@dataclass(frozen=True)
class LinearLoad(DistributedLoad):
    """A linearly varying line load: ``w_start`` at ``start`` to ``w_end`` at ``end`` (down +).

    A triangle when one end value is zero, a trapezoid otherwise [force/length].
    """

    w_start: Quantity
    w_end: Quantity

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.w_start, _LINE, "w_start")
        require(self.w_end, _LINE, "w_end")

    def si_pieces(self) -> tuple[SIPiece, ...]:
        w1, w2 = si(self.w_start), si(self.w_end)
        return (SIPiece(self.a_m, self.b_m, (w1, (w2 - w1) / (self.b_m - self.a_m))),)

    @property
    def shape(self) -> str:
        """'triangular', 'trapezoidal' or 'uniform'."""
        w1, w2 = si(self.w_start), si(self.w_end)
        if w1 == w2:
            return "uniform"
        return "triangular" if (w1 == 0 or w2 == 0) else "trapezoidal"

    def describe(self) -> str:
        return (
            f"w = {self.w_start:~.4g} to {self.w_end:~.4g} {self.shape}, {self._range_text()} "
            f"({self.case})"
        )


@dataclass(frozen=True)
class PolynomialLoad(DistributedLoad):
    """A polynomial line load w(x) = Σ c_k (x − start)^k, downward +.

    Args:
        coefficients: c_0, c_1, ... with units force/length^(k+1) (c_0 in kN/m, c_1 in
            kN/m², ...). The polynomial is in the distance from ``start``.
    """

    coefficients: tuple[Quantity, ...]

    def __post_init__(self) -> None:
        super().__post_init__()
        coeffs = tuple(self.coefficients)
        at_least("coefficients", coeffs, what="coefficient")
        for k, c in enumerate(coeffs):
            require(c, f"[force] / [length] ** {k + 1}", f"coefficients[{k}]")
        object.__setattr__(self, "coefficients", coeffs)

    def si_pieces(self) -> tuple[SIPiece, ...]:
        return (SIPiece(self.a_m, self.b_m, tuple(si(c) for c in self.coefficients)),)

    def describe(self) -> str:
        terms = " + ".join(
            f"{c:~.4g}" + (f"·ξ^{k}" if k > 1 else ("·ξ" if k == 1 else ""))
            for k, c in enumerate(self.coefficients)
        )
        return f"w = {terms} (ξ from start), {self._range_text()} ({self.case})"


@dataclass(frozen=True)
class AreaLoad(DistributedLoad):
    """An area load ``q`` [force/area] on a tributary ``width`` [length]: a line load w = q·width.

    The conversion is kept (``q``, ``width``, :attr:`w`) so the working can show it.
    """

    q: Quantity
    width: Quantity

    def __post_init__(self) -> None:
        super().__post_init__()
        require(self.q, "[force] / [length] ** 2", "q")
        require(self.width, _LENGTH, "width", positive=True)

    @property
    def w(self) -> Quantity:
        """The equivalent line load q·width, in kN/m (downward +)."""
        return (self.q * self.width).to("kN/m")

    def si_pieces(self) -> tuple[SIPiece, ...]:
        return (SIPiece(self.a_m, self.b_m, (si(self.q) * si(self.width),)),)

    def describe(self) -> str:
        return (
            f"q = {self.q:~.4g} × tributary width {self.width:~.4g} = w = {self.w:~.4g}, "
            f"{self._range_text()} ({self.case})"
        )


@dataclass(frozen=True)
class FunctionLoad(DistributedLoad):
    """A line load given by any function w(x), downward +, integrated to a stated accuracy.

    Args:
        func: called with an array quantity of positions x (from the beam's left end) and
            returning the line load there as a quantity of force/length (it may also be called
            with one position at a time if it does not accept arrays).
        rtol: the accuracy asked for: the load is replaced by a piecewise polynomial whose
            deviation from w, estimated at check points between the fit nodes, is at most
            ``rtol × max|w|``. Shear is then within rtol·max|w|·(end − start) of exact, and the
            moment within that times the span. Default 1e-9.
        description: text for display, e.g. ``"w = 4 sin(πx/L) kN/m"``.

    Raises:
        OutOfScopeError: (on use) the accuracy cannot be met, e.g. a step or a singularity in w.
    """

    func: Callable[[Quantity], Quantity]
    rtol: float = 1e-9
    description: str = "w(x)"

    def __post_init__(self) -> None:
        super().__post_init__()
        if not callable(self.func):
            raise InputError(
                f"Function load needs a callable func (got func = {self.func!r})",
                name="func",
                value=self.func,
                expected="a callable w(x)",
            )
        instance("rtol", self.rtol, (float, int), expected="a relative accuracy")
        within("rtol", self.rtol, 1e-13, 1e-2, rule="the function load's relative accuracy")

    def evaluate_si(self, x_m: np.ndarray) -> np.ndarray:
        """Call the user's function at positions x (m); returns N/m as floats."""
        xq = Q_(np.asarray(x_m, dtype=float), "m")
        try:
            out: Any = self.func(xq)
            vals = np.asarray(require(out, _LINE, "func(x)").to("N/m").magnitude, dtype=float)
            if vals.shape != np.shape(x_m):
                vals = np.broadcast_to(vals, np.shape(x_m)).astype(float)
        except InputError:
            raise
        except Exception:
            vals = np.array(
                [si(require(self.func(Q_(float(x), "m")), _LINE, "func(x)")) for x in x_m]
            )
        if not np.all(np.isfinite(vals)):
            bad = float(np.asarray(x_m)[~np.isfinite(vals)][0])
            raise InputError(
                f"Function load {self.description} must be finite on its range (got a "
                f"non-finite value at x = {bad:.6g} m)",
                name="func",
                value=bad,
                expected="finite w(x)",
            )
        return vals

    def si_pieces(self) -> tuple[SIPiece, ...]:
        cached: tuple[SIPiece, ...] | None = self.__dict__.get("_pieces")
        if cached is None:
            from calcpack.loads.fit import fit_function_load

            cached = fit_function_load(self, self.a_m, self.b_m)
            object.__setattr__(self, "_pieces", cached)  # a cache, not state: frozen is kept
        return cached

    def describe(self) -> str:
        return f"{self.description}, {self._range_text()} ({self.case})"


def si_parts(load: Load) -> tuple[tuple[SIPiece, ...], tuple[SIPoint, ...]]:
    """``(load.si_pieces(), load.si_points())``, made once per load and kept on it (a load is
    immutable; the beam solver reads these several times on every solve)."""
    parts: tuple[tuple[SIPiece, ...], tuple[SIPoint, ...]] | None = load.__dict__.get("_si_parts")
    if parts is None:
        parts = (load.si_pieces(), load.si_points())
        object.__setattr__(load, "_si_parts", parts)  # a cache, not state: frozen is kept
    return parts


def as_loads(loads: Sequence[Load] | Load) -> tuple[Load, ...]:
    """A tuple of loads from one load or a sequence, each checked to be a :class:`Load`."""
    items = (loads,) if isinstance(loads, Load) else tuple(loads)
    for i, item in enumerate(items):
        instance(f"loads[{i}]", item, Load, expected="a calcpack load such as UniformLoad")
    return items
