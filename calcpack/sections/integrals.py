"""A region bounded by functions, integrated exactly with sympy.

The region lies between y = lower(x) and y = upper(x) for x from a to b. Its properties follow
from the integral definitions (common practice), evaluated exactly:

    A = ∫ (u - l) dx,   x̄ = ∫ x (u - l) dx / A,   ȳ = ∫ (u² - l²)/2 dx / A,
    I_x,origin = ∫ y² dA = ∫ (u³ - l³)/3 dx,   I_y,origin = ∫ x² (u - l) dx,
    I_xy,origin = ∫ x (u² - l²)/2 dx,

and the centroidal values by the parallel-axis theorem (Ix = I_x,origin - A ȳ²...).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require

if TYPE_CHECKING:
    from calcpack.working import Block

__all__ = ["BoundedRegion", "RegionIntegrals", "second_moment_from_radius"]


@dataclass(frozen=True)
class RegionIntegrals:
    """Exact properties of a :class:`BoundedRegion`.

    Attributes:
        A, x_bar, y_bar: area and centroid (coordinates as given).
        Ix_origin, Iy_origin: ∫y² dA and ∫x² dA about the coordinate axes.
        Ix, Iy, Ixy: about axes through the centroid.
        exact: the exact sympy values, in the region's unit (keys "A", "Sx", "Sy", "x_bar",
            "y_bar", "Ix_origin", "Iy_origin", "Ixy_origin", "Ix", "Iy", "Ixy").
        region: the region.
    """

    A: Quantity
    x_bar: Quantity
    y_bar: Quantity
    Ix_origin: Quantity
    Iy_origin: Quantity
    Ix: Quantity
    Iy: Quantity
    Ixy: Quantity
    exact: dict[str, Any]
    region: BoundedRegion

    def working(self, **options: Any) -> Block:
        """The integral forms with their exact values, as calcpack.working steps."""
        from calcpack.sections.working import region_working

        return region_working(self, **options)


@dataclass(frozen=True, kw_only=True, eq=False)
class BoundedRegion:
    """The region between y = ``lower`` and y = ``upper`` for ``x_from`` <= x <= ``x_to``.

    Args:
        upper, lower: sympy expressions (or strings) in the symbol ``x``, giving y in ``unit``
            for x in ``unit``; lower defaults to 0 (the x axis).
        x_from, x_to: the limits, lengths.
        unit: the length unit the expressions are written in ("mm" by default).
        name: for display.

    Raises:
        InputError: an expression in other symbols, x_to <= x_from, or upper below lower.
    """

    upper: Any
    lower: Any = 0
    x_from: Quantity
    x_to: Quantity
    unit: str = "mm"
    name: str = "region"

    def __post_init__(self) -> None:
        import sympy

        x = sympy.Symbol("x", real=True)
        exprs = {}
        for label in ("upper", "lower"):
            raw = getattr(self, label)
            try:
                e = sympy.sympify(raw, locals={"x": x})
            except (sympy.SympifyError, TypeError) as exc:
                raise InputError(
                    f"Boundary {label} must be an expression in x (got {raw!r}: {exc})",
                    name=label,
                    value=raw,
                    expected="an expression in x",
                ) from None
            e = e.subs(sympy.Symbol("x"), x)
            extra = e.free_symbols - {x}
            if extra:
                raise InputError(
                    f"Boundary {label} must depend on x only (got {e}, which has "
                    f"{', '.join(sorted(str(s) for s in extra))})",
                    name=label,
                    value=raw,
                    expected="an expression in x only",
                )
            exprs[label] = e
        a = require(self.x_from, "[length]", "x_from").to(self.unit).magnitude
        b = require(self.x_to, "[length]", "x_to").to(self.unit).magnitude
        if not b > a:
            raise InputError(
                f"Limit x_to must be greater than x_from (got x_from = {self.x_from:~P}, "
                f"x_to = {self.x_to:~P})",
                name="x_to",
                value=self.x_to,
                expected="x_to > x_from",
            )
        gap = sympy.lambdify(x, exprs["upper"] - exprs["lower"], "math")
        for k in range(201):
            xs = a + (b - a) * k / 200
            value = float(gap(xs))
            if value < -1e-12 * max(1.0, abs(b - a)):
                raise InputError(
                    f"Boundary upper must not lie below lower; at x = {xs:.6g} {self.unit}, "
                    f"upper - lower = {value:.6g} {self.unit}",
                    name="upper",
                    value=self.upper,
                    expected="upper(x) >= lower(x) on the interval",
                )
        object.__setattr__(self, "_x", x)
        object.__setattr__(self, "_exprs", exprs)
        object.__setattr__(self, "_limits", (sympy.nsimplify(a), sympy.nsimplify(b)))

    @property
    def symbol(self) -> Any:
        """The sympy symbol x used in the expressions."""
        return self.__dict__["_x"]

    @property
    def expressions(self) -> tuple[Any, Any]:
        """(upper, lower) as sympy expressions."""
        e = self.__dict__["_exprs"]
        return e["upper"], e["lower"]

    @property
    def limits(self) -> tuple[Any, Any]:
        """(a, b) as exact sympy numbers in ``unit``."""
        lim: tuple[Any, Any] = self.__dict__["_limits"]
        return lim

    def integrands(self) -> dict[str, Any]:
        """The integrands in x for A, Sy = ∫x dA, Sx = ∫y dA, ∫y², ∫x², ∫xy."""
        u, l = self.expressions
        x = self.symbol
        return {
            "A": u - l,
            "Sy": x * (u - l),
            "Sx": (u**2 - l**2) / 2,
            "Ix_origin": (u**3 - l**3) / 3,
            "Iy_origin": x**2 * (u - l),
            "Ixy_origin": x * (u**2 - l**2) / 2,
        }

    def properties(self) -> RegionIntegrals:
        """Integrate exactly and return the properties (see the module docstring)."""
        import sympy

        x = self.symbol
        a, b = self.limits
        exact: dict[str, Any] = {}
        for key, f in self.integrands().items():
            exact[key] = sympy.simplify(sympy.integrate(sympy.expand(f), (x, a, b)))
        A = exact["A"]
        if not A.is_positive:
            raise InputError(
                f"Region {self.name!r} must have a positive area (got A = {A})",
                name="A",
                value=A,
                expected="A > 0",
            )
        exact["x_bar"] = sympy.simplify(exact["Sy"] / A)
        exact["y_bar"] = sympy.simplify(exact["Sx"] / A)
        exact["Ix"] = sympy.simplify(exact["Ix_origin"] - A * exact["y_bar"] ** 2)
        exact["Iy"] = sympy.simplify(exact["Iy_origin"] - A * exact["x_bar"] ** 2)
        exact["Ixy"] = sympy.simplify(exact["Ixy_origin"] - A * exact["x_bar"] * exact["y_bar"])
        u = self.unit

        def q(key: str, power: int) -> Quantity:
            return Q_(float(exact[key]), f"{u}**{power}" if power > 1 else u)

        return RegionIntegrals(
            A=q("A", 2),
            x_bar=q("x_bar", 1),
            y_bar=q("y_bar", 1),
            Ix_origin=q("Ix_origin", 4),
            Iy_origin=q("Iy_origin", 4),
            Ix=q("Ix", 4),
            Iy=q("Iy", 4),
            Ixy=q("Ixy", 4),
            exact=exact,
            region=self,
        )


@dataclass(frozen=True)
class RadiusOfGyration:
    """I = k² A from a given radius of gyration k and area A."""

    k: Quantity
    A: Quantity
    I: Quantity

    def working(self, **options: Any) -> Block:
        """The I = k²A step with substitution, as calcpack.working steps."""
        from calcpack.sections.working import radius_working

        return radius_working(self, **options)


def second_moment_from_radius(*, k: Any, A: Any) -> RadiusOfGyration:
    """Second moment of area from a radius of gyration: I = k² A (definition of k).

    Args:
        k: radius of gyration, a length. A: area.

    Raises:
        InputError / DimensionError: k not a positive length or A not a positive area.
    """
    kq = require(k, "[length]", "k", positive=True)
    aq = require(A, "[length]**2", "A", positive=True)
    return RadiusOfGyration(k=kq, A=aq, I=(kq**2 * aq).to("mm**4"))
