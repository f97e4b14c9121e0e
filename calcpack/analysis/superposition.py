"""Superposition: the result of a load combination as Σ factor × the result of each load case.

A linear analysis (small displacements, linear-elastic members, supports that do not lift)
solves each load case once; any combination of the cases is then the factored sum of their
results (the principle of superposition, common practice). This is the one place that sum is
written: beam results, truss results, quantities and mappings of named quantities all combine
here (``calcpack.analysis.beam.combine``, ``calcpack.analysis.truss_solve.combine_results`` and
``calcpack.combinations.superpose`` call it).

A result is combined through its own arithmetic: ``result.scaled(f)`` where it has one (beam and
truss results, which refuse a sum of results of different structures), else ``f * result``; a
mapping is combined key by key (a key missing from one term counts as zero there).
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from calcpack.errors import InputError
from calcpack.validate import at_least, finite

__all__ = ["superpose"]


def _scale(result: Any, factor: float) -> Any:
    if hasattr(result, "scaled"):
        return result.scaled(factor)
    if isinstance(result, Mapping):
        return {k: _scale(v, factor) for k, v in result.items()}
    return result * factor


def _add(a: Any, b: Any) -> Any:
    if isinstance(a, Mapping) and isinstance(b, Mapping):
        keys = list(dict.fromkeys([*a, *b]))
        return {k: a[k] if k not in b else b[k] if k not in a else _add(a[k], b[k]) for k in keys}
    return a + b


def superpose(results: Mapping[str, Any], factors: Mapping[str, float]) -> Any:
    """Σ factor × result over the load cases named in ``factors`` (in their order).

    Args:
        results: load-case name -> the result of that case alone (a beam or truss result, a
            quantity, or a mapping of named quantities).
        factors: load-case name -> load factor (dimensionless), e.g. ``{"D": 1.2, "L": 1.6}``.
            Cases with a result but no factor are left out.

    Raises:
        InputError: no factors; a factor that is not finite (named ``factors['L']``); a factor
            naming a case with no result.
    """
    at_least("factors", dict(factors), what="load factor")
    total: Any = None
    for case, f in factors.items():
        if case not in results:
            raise InputError(
                f"Load case {case!r} has no result, but a factor names load case {case!r} "
                f"({case!r} in the factors has no result; the cases solved: "
                f"{', '.join(map(repr, results)) or 'none'})",
                name=f"factors[{case!r}]",
                value=f,
                expected=f"a case that was solved: one of {sorted(results)}",
            )
        term = _scale(results[case], float(finite(f"factors[{case!r}]", f)))
        total = term if total is None else _add(total, term)
    return total
