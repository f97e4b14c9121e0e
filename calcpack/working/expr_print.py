"""Printing formula terms: symbols as LaTeX and text, and the one printer that writes a formula
symbolically or with its values substituted, the way an engineer writes a substitution:
``(8.50 kN/m)(3.20 m)²/8``."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import sympy

from calcpack.working.bindings import Literal
from calcpack.working.format import (
    format_number,
    format_quantity_latex,
    format_quantity_text,
)

if TYPE_CHECKING:
    from calcpack.working.expr import Term

__all__ = ["symbol_latex", "symbol_text", "to_latex", "to_text"]

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
