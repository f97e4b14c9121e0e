"""Formula terms: Python operators on quantity handles build sympy expressions.

A :class:`Term` wraps an unevaluated sympy expression (``evaluate=False``, so the formula keeps the
order in which the engineer wrote it) and remembers which calcpack value each symbol stands for.
Values, unknowns and literal quantities are bound to unique sympy ``Dummy`` symbols, so two sheets
may both have an ``L`` without clashing.

:func:`evaluate` computes a term with pint, so a unit error is caught and named;
:func:`to_latex` and :func:`to_text` print the formula symbolically or with the values substituted,
the way an engineer writes a substitution: ``(8.50 kN/m)(3.20 m)²/8``.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Mapping
from typing import Any, Union

import pint
import sympy

from calcpack.errors import DimensionError, InputError, UndefinedSymbolError, ZeroDivisorError
from calcpack.units import ureg
from calcpack.working.bindings import Literal
from calcpack.working.expr_print import symbol_latex, symbol_text, to_latex, to_text

__all__ = [
    "Abs",
    "Max",
    "Min",
    "Operand",
    "Term",
    "atan",
    "cos",
    "evaluate",
    "sin",
    "sqrt",
    "symbol_latex",
    "symbol_text",
    "tan",
    "to_latex",
    "to_text",
]


Operand = Union["Term", int, float, pint.Quantity]


class Term:
    """A formula over calcpack values; combine with ``+ - * / **`` and the functions below.

    Attributes:
        expr: the unevaluated sympy expression.
        bindings: sympy symbol to the value, unknown or literal it stands for.
    """

    __slots__ = ("bindings", "expr")
    __array_priority__ = 1000  # win over numpy scalars in mixed arithmetic

    def __init__(self, expr: sympy.Expr, bindings: Mapping[sympy.Symbol, Any]) -> None:
        self.expr = expr
        self.bindings: dict[sympy.Symbol, Any] = dict(bindings)

    # -- arithmetic -------------------------------------------------------------------------
    def __add__(self, other: Operand) -> Term:
        o = as_term(other)
        return Term(sympy.Add(self.expr, o.expr, evaluate=False), {**self.bindings, **o.bindings})

    def __radd__(self, other: Operand) -> Term:
        return as_term(other).__add__(self)

    def __neg__(self) -> Term:
        return Term(sympy.Mul(sympy.S.NegativeOne, self.expr, evaluate=False), self.bindings)

    def __pos__(self) -> Term:
        return self

    def __sub__(self, other: Operand) -> Term:
        return self.__add__(-as_term(other))

    def __rsub__(self, other: Operand) -> Term:
        return as_term(other).__sub__(self)

    def __mul__(self, other: Operand) -> Term:
        o = as_term(other)
        return Term(sympy.Mul(self.expr, o.expr, evaluate=False), {**self.bindings, **o.bindings})

    def __rmul__(self, other: Operand) -> Term:
        return as_term(other).__mul__(self)

    def __truediv__(self, other: Operand) -> Term:
        o = as_term(other)
        inv = sympy.Pow(o.expr, sympy.S.NegativeOne, evaluate=False)
        return Term(sympy.Mul(self.expr, inv, evaluate=False), {**self.bindings, **o.bindings})

    def __rtruediv__(self, other: Operand) -> Term:
        return as_term(other).__truediv__(self)

    def __pow__(self, power: int | float | Term) -> Term:
        if isinstance(power, Term):
            p = power
        elif isinstance(power, float) and math.isfinite(power):
            frac = sympy.Rational(power).limit_denominator(12)
            p = Term(frac if abs(float(frac) - power) < 1e-12 else _number(power), {})
        else:
            p = Term(_number(power), {})
        return Term(sympy.Pow(self.expr, p.expr, evaluate=False), {**self.bindings, **p.bindings})

    def __rpow__(self, base: Operand) -> Term:
        return as_term(base).__pow__(self)

    # -- display ---------------------------------------------------------------------------
    def __repr__(self) -> str:
        return f"Term({to_text(self)})"

    def _repr_latex_(self) -> str:
        return f"$\\displaystyle {to_latex(self)}$"

    def sympy(self) -> sympy.Expr:
        """The formula as an ordinary (evaluated) sympy expression over plain named symbols."""
        mapping = {}
        for sym, bound in self.bindings.items():
            if isinstance(bound, Literal):
                mapping[sym] = sympy.Float(bound.quantity.to_base_units().magnitude)
            else:
                mapping[sym] = sympy.Symbol(getattr(bound, "name", str(sym)))
        return sympy.sympify(self.expr.xreplace(mapping).doit())


def _number(value: int | float) -> sympy.Expr:
    if isinstance(value, bool) or not isinstance(value, int | float):
        raise InputError(
            f"A formula operand must be a number, a quantity or a calcpack value (got {value!r})",
            name="operand",
            value=value,
            expected="int, float, pint Quantity or Term",
        )
    if not math.isfinite(value):
        raise InputError(
            f"A number in a formula must be finite (got {value!r})",
            name="operand",
            value=value,
            expected="a finite number",
        )
    if isinstance(value, int) or (float(value).is_integer() and abs(value) < 1e15):
        return sympy.Integer(int(value))
    return sympy.Float(value)


def as_term(value: Operand) -> Term:
    """Wrap a number, a pint quantity or a term as a :class:`Term`."""
    if isinstance(value, Term):
        return value
    if isinstance(value, sympy.Basic):
        free = sorted(str(f) for f in value.free_symbols)
        raise UndefinedSymbolError(
            f"Symbol {', '.join(free) or value} in a formula is not defined on the sheet; "
            "use values made by Sheet.given() or Sheet.derive() instead of sympy symbols",
            name=", ".join(free) or str(value),
            value=value,
            expected="a calcpack value",
        )
    if isinstance(value, pint.Quantity):
        if not all(math.isfinite(float(m)) for m in [value.magnitude]):
            raise InputError(
                f"A quantity in a formula must be finite (got {value:~P})",
                name="operand",
                value=value,
                expected="a finite quantity",
            )
        sym = sympy.Dummy("q")
        return Term(sym, {sym: Literal(value)})
    return Term(_number(value), {})


def _function(name: str, fn: Callable[..., sympy.Expr]) -> Callable[..., Term]:
    def apply(*args: Operand) -> Term:
        terms = [as_term(a) for a in args]
        bindings: dict[sympy.Symbol, Any] = {}
        for t in terms:
            bindings.update(t.bindings)
        return Term(fn(*[t.expr for t in terms], evaluate=False), bindings)

    apply.__name__ = name
    apply.__doc__ = f"``{name}`` of a formula term (arguments of trigonometric functions in rad)."
    return apply


def sqrt(x: Operand) -> Term:
    """Square root of a formula term."""
    t = as_term(x)
    return Term(sympy.Pow(t.expr, sympy.Rational(1, 2), evaluate=False), t.bindings)


pi = Term(sympy.pi, {})
"""π in a formula: printed as π (π² in the working, never 9.8696), evaluated as ``math.pi``."""

sin = _function("sin", sympy.sin)
cos = _function("cos", sympy.cos)
tan = _function("tan", sympy.tan)
atan = _function("atan", sympy.atan)
Abs = _function("Abs", sympy.Abs)
Max = _function("Max", sympy.Max)
Min = _function("Min", sympy.Min)


# -- evaluation with pint -------------------------------------------------------------------


def _describe(formula: Term | None) -> str:
    return to_text(formula) if formula is not None else "the formula"


def evaluate(term: Term, *, name: str = "result") -> pint.Quantity:
    """Evaluate ``term`` with pint, checking units as it goes.

    Raises:
        DimensionError: terms of different dimensions added, or a function of a dimensional
            argument; the message names the formula and both units.
        UndefinedSymbolError: a sympy symbol in the formula has no value bound to it.
    """

    def ev(e: sympy.Basic) -> Any:
        if e in term.bindings:
            bound = term.bindings[e]
            if isinstance(bound, Literal):
                return bound.quantity
            q = getattr(bound, "quantity", None)
            if q is None:
                raise UndefinedSymbolError(
                    f"Symbol {bound.text_symbol} in {name} = {_describe(term)} has no value "
                    "(it is an unknown); solve for it first or give it a value",
                    name=bound.text_symbol,
                    value=None,
                    expected="a given or derived value",
                )
            return q
        if isinstance(e, sympy.Symbol):
            raise UndefinedSymbolError(
                f"Symbol {e} in {name} = {_describe(term)} is not defined on the sheet; "
                "use a value made by Sheet.given() or Sheet.derive()",
                name=str(e),
                value=None,
                expected="a calcpack value",
            )
        if e.is_Number:
            return float(e) if not e.is_Integer else int(e)
        if e is sympy.pi:
            return math.pi
        args = [ev(a) for a in e.args]
        try:
            if isinstance(e, sympy.Add):
                total = args[0]
                for a in args[1:]:
                    total = total + a
                return total
            if isinstance(e, sympy.Mul):
                prod = args[0]
                for a in args[1:]:
                    prod = prod * a
                return prod
            if isinstance(e, sympy.Pow):
                base, exp = args
                if isinstance(exp, pint.Quantity):
                    exp = float(exp.to("dimensionless").magnitude)
                bmag = base.magnitude if isinstance(base, pint.Quantity) else base
                if float(bmag) == 0 and float(exp) < 0:
                    raise ZeroDivisorError(
                        name, _describe(term), _describe(Term(e.args[0], term.bindings))
                    )
                if float(bmag) < 0 and not float(exp).is_integer():
                    raise InputError(
                        f"{name} = {_describe(term)} takes a fractional power of a negative "
                        f"value ({_describe(Term(e.args[0], term.bindings))} < 0)",
                        name=name,
                        value=_describe(term),
                        expected="a non-negative base under a root or fractional power",
                    )
                return base**exp
            func = _NUMERIC_FUNCS.get(type(e).__name__)
            if func is not None:
                return func(*args)
        except pint.DimensionalityError as exc:
            raise DimensionError(
                f"Units do not agree in {name} = {_describe(term)}: cannot combine "
                f"{_units_text(exc.units1, exc.dim1)} with {_units_text(exc.units2, exc.dim2)}",
                name=name,
                value=_describe(term),
                expected="terms of one dimension in sums, dimensionless function arguments",
            ) from exc
        raise InputError(
            f"{name} = {_describe(term)} uses {type(e).__name__}, which calcpack cannot evaluate",
            name=name,
            value=str(e),
            expected="+, -, *, /, **, sqrt, sin, cos, tan, atan, Abs, Max, Min",
        )

    result = ev(term.expr)
    if not isinstance(result, pint.Quantity):
        result = ureg.Quantity(result, "dimensionless")
    if not math.isfinite(float(result.magnitude)):
        raise InputError(
            f"{name} = {_describe(term)} is not a finite number (got {result.magnitude}); "
            "check the values it is made of",
            name=name,
            value=result,
            expected="a finite value",
        )
    return result


def _units_text(units: Any, dim: Any) -> str:
    try:
        u = f"{ureg.Unit(units):~P}" if units not in (None, "") else "dimensionless"
    except Exception:
        u = str(units)
    return f"{u} ({dim})" if dim else u


def _dimensionless(x: Any, fname: str) -> float:
    if isinstance(x, pint.Quantity):
        if x.dimensionality and x.dimensionality != ureg.rad.dimensionality:
            raise pint.DimensionalityError(x.units, "dimensionless", x.dimensionality, "")
        return float(x.to("radian").magnitude) if x.unitless is False else float(x.magnitude)
    return float(x)


def _angle(x: Any) -> float:
    if isinstance(x, pint.Quantity):
        return float(x.to("radian").magnitude)
    return float(x)


def _max(*xs: Any) -> Any:
    return max(xs)


def _min(*xs: Any) -> Any:
    return min(xs)


_NUMERIC_FUNCS: dict[str, Callable[..., Any]] = {
    "sin": lambda x: math.sin(_angle(x)),
    "cos": lambda x: math.cos(_angle(x)),
    "tan": lambda x: math.tan(_angle(x)),
    "atan": lambda x: ureg.Quantity(math.atan(_dimensionless(x, "atan")), "radian"),
    "Abs": abs,
    "Max": _max,
    "Min": _min,
}
