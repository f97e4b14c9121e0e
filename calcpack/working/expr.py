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
from dataclasses import dataclass
from typing import Any, Protocol, Union

import pint
import sympy

from calcpack.errors import DimensionError, InputError, UndefinedSymbolError, ZeroDivisorError
from calcpack.units import ureg
from calcpack.working.format import (
    format_number,
    format_quantity_latex,
    format_quantity_text,
)

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


class Bound(Protocol):
    """What a symbol in a formula may stand for: a named value, an unknown, or a literal."""

    @property
    def latex_symbol(self) -> str: ...

    @property
    def text_symbol(self) -> str: ...


@dataclass(frozen=True)
class Literal:
    """A pint quantity written straight into a formula (shown with its unit in every line)."""

    quantity: pint.Quantity

    @property
    def latex_symbol(self) -> str:
        return format_quantity_latex(self.quantity, 6)

    @property
    def text_symbol(self) -> str:
        return format_quantity_text(self.quantity, 6)


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

# -- printing --------------------------------------------------------------------------------

_GREEK = {
    "alpha", "beta", "gamma", "delta", "epsilon", "zeta", "eta", "theta", "iota", "kappa",
    "lambda", "mu", "nu", "xi", "pi", "rho", "sigma", "tau", "upsilon", "phi", "chi", "psi",
    "omega", "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma", "Upsilon", "Phi", "Psi",
    "Omega", "varepsilon", "varphi",
}  # fmt: skip
_GREEK_TEXT = dict(
    zip(
        [
            "alpha", "beta", "gamma", "delta", "epsilon", "zeta", "eta", "theta", "iota",
            "kappa", "lambda", "mu", "nu", "xi", "pi", "rho", "sigma", "tau", "upsilon", "phi",
            "chi", "psi", "omega", "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma",
            "Upsilon", "Phi", "Psi", "Omega", "varepsilon", "varphi",
        ],
        "αβγδεζηθικλμνξπρστυφχψωΓΔΘΛΞΠΣΥΦΨΩεφ",
        strict=True,
    )
)  # fmt: skip


def _symbol_part_latex(part: str, *, base: bool) -> str:
    if part in _GREEK:
        return "\\" + part
    if base or len(part) == 1:
        return part
    return rf"\mathrm{{{part}}}"


def symbol_latex(name: str) -> str:
    r"""LaTeX for a symbol name: ``M_max`` → ``M_{\mathrm{max}}``, ``sigma_b`` → ``\sigma_{b}``,
    ``f_y_red`` → ``f_{y,\mathrm{red}}``; a trailing ``_prime`` becomes a prime."""
    primes = 0
    while name.endswith("_prime"):
        name = name[: -len("_prime")]
        primes += 1
    base, *subs = name.split("_")
    out = _symbol_part_latex(base, base=True)
    if len(base) > 1 and base not in _GREEK:
        out = rf"\mathit{{{base}}}"
    if subs:
        out += "_{" + ",".join(_symbol_part_latex(s, base=False) for s in subs if s) + "}"
    return out + "'" * primes


def symbol_text(name: str) -> str:
    """Plain-text form of a symbol name: ``sigma_b`` → ``σ_b``."""
    base, *subs = name.split("_")
    out = _GREEK_TEXT.get(base, base)
    if subs:
        out += "_" + ",".join(_GREEK_TEXT.get(s, s) for s in subs)
    return out


# Precedence levels of printed pieces.
_ADD, _NEG, _MUL, _POW, _ATOM = 10, 15, 20, 30, 40


@dataclass(frozen=True)
class _Style:
    latex: bool
    substitute: bool
    sig: int


class _Printer:
    """Prints an unevaluated expression tree as LaTeX or text, symbolic or substituted."""

    def __init__(self, term: Term, style: _Style) -> None:
        self.term = term
        self.s = style

    def paren(self, text: str) -> str:
        return rf"\left({text}\right)" if self.s.latex else f"({text})"

    # Returns (text, precedence of the printed piece)
    def pr(self, e: sympy.Basic) -> tuple[str, int]:
        if e in self.term.bindings:
            return self.bound(self.term.bindings[e])
        if isinstance(e, sympy.Symbol):
            return (symbol_latex(e.name) if self.s.latex else symbol_text(e.name)), _ATOM
        if e.is_Number:
            return self.number(e)
        if e is sympy.pi:
            return (r"\pi" if self.s.latex else "π"), _ATOM
        if isinstance(e, sympy.Add):
            return self.add(e)
        if isinstance(e, sympy.Mul):
            return self.mul(e)
        if isinstance(e, sympy.Pow):
            return self.pow(e)
        return self.func(e)

    def bound(self, bound: Any) -> tuple[str, int]:
        if isinstance(bound, Literal):
            q = bound.quantity
            text = (
                format_quantity_latex(q, self.s.sig)
                if self.s.latex
                else format_quantity_text(q, self.s.sig)
            )
            has_unit = not q.dimensionless
            if float(q.magnitude) < 0:
                return text, _NEG
            return text, (_NEG if has_unit else _ATOM)
        q = getattr(bound, "display_quantity", None)
        if self.s.substitute and q is not None:
            text = (
                format_quantity_latex(q, self.s.sig)
                if self.s.latex
                else format_quantity_text(q, self.s.sig)
            )
            if float(q.magnitude) < 0:
                return text, _NEG
            return text, (_NEG if not q.dimensionless else _ATOM)
        return (bound.latex_symbol if self.s.latex else bound.text_symbol), _ATOM

    def number(self, e: sympy.Basic) -> tuple[str, int]:
        if e.is_Rational and not e.is_Integer:
            p, q = int(e.p), int(e.q)
            sign = "-" if p < 0 else ""
            if self.s.latex:
                return rf"{sign}\frac{{{abs(p)}}}{{{q}}}", (_NEG if p < 0 else _MUL)
            return f"{sign}{abs(p)}/{q}", _NEG if p < 0 else _MUL
        if e.is_Integer:
            v = int(e)
            return (str(v) if v >= 0 or self.s.latex else f"−{-v}"), (_NEG if v < 0 else _ATOM)
        fv = float(e)
        text = format_number(fv, max(self.s.sig, 6), latex=self.s.latex)
        text = _trim_float(text)
        return text, (_NEG if fv < 0 else _ATOM)

    def add(self, e: sympy.Add) -> tuple[str, int]:
        out = ""
        for i, arg in enumerate(_flatten_add(e)):
            negated = _negated(arg)
            if negated is not None and i > 0:
                text, prec = self.pr(negated)
                if prec <= _ADD or text.startswith(("-", "−")):
                    text = self.paren(text)
                out += (" - " if self.s.latex else " − ") + text
                continue
            text, prec = self.pr(arg)
            if i > 0 and (prec <= _ADD or text.startswith(("-", "−"))):
                text = self.paren(text)
                out += " + " + text
            elif i > 0:
                out += " + " + text
            else:
                out = text if prec > _ADD else self.paren(text)
        return out, _ADD

    def mul(self, e: sympy.Mul) -> tuple[str, int]:
        factors = _flatten_mul(e)
        sign = ""
        if factors and factors[0] == sympy.S.NegativeOne:
            sign = "-" if self.s.latex else "−"
            factors = factors[1:]
        num: list[sympy.Basic] = []
        den: list[sympy.Basic] = []
        for f in factors:
            if isinstance(f, sympy.Pow) and f.args[1].is_Number and f.args[1] < 0:
                exp = -f.args[1]
                den.append(f.args[0] if exp == 1 else sympy.Pow(f.args[0], exp, evaluate=False))
            elif f.is_Rational and not f.is_Integer and f.p == 1:
                den.append(sympy.Integer(f.q))
            else:
                num.append(f)
        if not factors:
            return (sign + "1"), _NEG
        top = self.product(num) if num else ("1", _ATOM)
        if den:
            bottom = self.product(den)
            if self.s.latex:
                return sign + rf"\frac{{{top[0]}}}{{{bottom[0]}}}", (_NEG if sign else _MUL)
            t = top[0]
            if top[1] <= _ADD or t.startswith("−"):
                t = self.paren(t)
            b = bottom[0] if (bottom[1] >= _POW and len(den) == 1) else self.paren(bottom[0])
            return sign + f"{t}/{b}", (_NEG if sign else _MUL)
        if sign:
            inner = top[0]
            if top[1] <= _ADD or inner.startswith(("-", "−")):
                inner = self.paren(inner)
            return sign + inner, _NEG
        return top

    def product(self, factors: list[sympy.Basic]) -> tuple[str, int]:
        printed = [self.pr(f) for f in factors]
        if len(printed) == 1:
            return printed[0]
        pieces: list[str] = []
        prev_numeric = False
        for (text, prec), f in zip(printed, factors, strict=True):
            needs_paren = prec < _MUL
            piece = self.paren(text) if needs_paren else text
            numeric = bool(f.is_Number) or (
                self.s.substitute and f in self.term.bindings and not needs_paren
            )
            if pieces:
                if self.s.latex:
                    sep = r" \cdot " if (numeric or prev_numeric) and not needs_paren else r" "
                    if needs_paren and pieces[-1].endswith(r"\right)"):
                        sep = r" "
                else:
                    sep = "·"
                pieces.append(sep)
            pieces.append(piece)
            prev_numeric = numeric and not needs_paren
        return "".join(pieces), _MUL

    def pow(self, e: sympy.Pow) -> tuple[str, int]:
        base, exp = e.args
        if exp == sympy.Rational(1, 2):
            text, _ = self.pr(base)
            return (rf"\sqrt{{{text}}}" if self.s.latex else f"√({text})"), _ATOM
        btext, bprec = self.pr(base)
        if bprec < _ATOM or (self.s.latex and r"\frac" in btext):
            btext = self.paren(btext)
        etext, _ = self.pr(exp)
        if self.s.latex:
            return f"{btext}^{{{etext}}}", _POW
        if exp.is_Integer and int(exp) >= 0:
            return btext + str(int(exp)).translate(_SUP), _POW
        return f"{btext}^{etext}" if len(etext) == 1 else f"{btext}^({etext})", _POW

    def func(self, e: sympy.Basic) -> tuple[str, int]:
        name = type(e).__name__
        args = [self.pr(a)[0] for a in e.args]
        if name == "Abs":
            return (rf"\left|{args[0]}\right|" if self.s.latex else f"|{args[0]}|"), _ATOM
        if self.s.latex:
            lname = {"atan": r"\arctan", "Max": r"\max", "Min": r"\min"}.get(name, "\\" + name)
            return lname + self.paren(", ".join(args)), _ATOM
        tname = {"Max": "max", "Min": "min"}.get(name, name)
        return tname + "(" + ", ".join(args) + ")", _ATOM


_SUP = str.maketrans("0123456789", "⁰¹²³⁴⁵⁶⁷⁸⁹")


def _trim_float(text: str) -> str:
    if "times" in text or "×" in text or "." not in text:
        return text
    return text.rstrip("0").rstrip(".")


def _negated(arg: sympy.Basic) -> sympy.Basic | None:
    """If ``arg`` is written as a negation (-1 · x), return x."""
    if isinstance(arg, sympy.Mul) and arg.args and arg.args[0] == sympy.S.NegativeOne:
        rest = arg.args[1:]
        return rest[0] if len(rest) == 1 else sympy.Mul(*rest, evaluate=False)
    return None


def _flatten_add(e: sympy.Basic) -> list[sympy.Basic]:
    out: list[sympy.Basic] = []
    for a in e.args:
        out.extend(_flatten_add(a) if isinstance(a, sympy.Add) else [a])
    return out


def _flatten_mul(e: sympy.Basic) -> list[sympy.Basic]:
    out: list[sympy.Basic] = []
    for a in e.args:
        if isinstance(a, sympy.Mul):
            sub = _flatten_mul(a)
            if sub and sub[0] == sympy.S.NegativeOne and out:
                # keep a nested negation visible as a leading sign of the whole product
                out.insert(0, sub[0])
                sub = sub[1:]
            out.extend(sub)
        else:
            out.append(a)
    # collect several leading minus signs into one
    negs = sum(1 for a in out if a == sympy.S.NegativeOne)
    rest = [a for a in out if a != sympy.S.NegativeOne]
    return ([sympy.S.NegativeOne] if negs % 2 else []) + rest


def to_latex(term: Term, *, substitute: bool = False, sig: int = 3) -> str:
    """The formula as LaTeX; with ``substitute`` the values (with units) replace the symbols."""
    return _Printer(term, _Style(latex=True, substitute=substitute, sig=sig)).pr(term.expr)[0]


def to_text(term: Term, *, substitute: bool = False, sig: int = 3) -> str:
    """The formula as plain text; with ``substitute`` the values (with units) replace symbols."""
    return _Printer(term, _Style(latex=False, substitute=substitute, sig=sig)).pr(term.expr)[0]
