"""Pattern loading of continuous beams: a variable load case split span by span.

:func:`pattern_cases` returns the beam with the chosen case's loads split at the supports into
one case per span (``"L#1"``, ``"L#2"``, ...) and the alternatives for
:meth:`CombinationSet.apply` (``groups=``): every non-empty set of loaded spans (exact for the
span-by-span envelope of a linear analysis) or, for many spans, the usual patterns (all spans,
alternate spans, each pair of adjacent spans). Each combination that contains the case is then
repeated once per pattern, the same factor on every loaded span. A span is the length between
adjacent supports that restrain deflection; overhangs beyond the end supports are spans too.
"""

from __future__ import annotations

from dataclasses import replace
from itertools import combinations, pairwise
from typing import Any

from calcpack.analysis.beam.core import shift_polynomial
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.types import (
    AreaLoad,
    DistributedLoad,
    FunctionLoad,
    LinearLoad,
    Load,
    PointLoad,
    PointMoment,
    PolynomialLoad,
    UniformLoad,
)
from calcpack.units import Q_, si, ureg
from calcpack.validate import one_of

__all__ = ["pattern_cases", "span_limits"]

_ALL_SUBSETS_MAX_SPANS = 6


def span_limits(beam: Any) -> list[tuple[float, float]]:
    """(start m, end m) of each span of ``beam``, left to right."""
    xs = sorted({s.x_m for s in beam.supports if s.restrains_v})
    cuts = [0.0, *[x for x in xs if 0.0 < x < beam.L_m], beam.L_m]
    return [(a, b) for a, b in pairwise(cuts) if b > a]


def _clip(load: Load, a: float, b: float, case: str, L_m: float) -> Load | None:
    """The part of ``load`` on a <= x <= b (m) as a load of ``case``, or None."""
    unit = "m"
    if isinstance(load, PointLoad | PointMoment):
        x = si(load.x)
        last = abs(b - L_m) < 1e-12 * L_m
        inside = a <= x < b or (last and a <= x <= b)
        return replace(load, case=case) if inside else None
    if not isinstance(load, DistributedLoad):
        raise OutOfScopeError(
            f"Pattern loading cannot split a load of type {type(load).__name__} ({load!r})"
        )
    load = load.resolved(Q_(L_m, "m"))
    assert isinstance(load, DistributedLoad)
    s, e = load.a_m, load.b_m
    lo, hi = max(s, a), min(e, b)
    if hi <= lo:
        return None
    start, end = Q_(lo, unit), Q_(hi, unit)
    if isinstance(load, UniformLoad | AreaLoad | FunctionLoad):
        return replace(load, start=start, end=end, case=case)
    if isinstance(load, LinearLoad):
        w1, w2 = load.w_start, load.w_end
        slope = (w2 - w1) / (load.end - load.start)
        return replace(
            load,
            start=start,
            end=end,
            w_start=w1 + slope * (start - load.start),
            w_end=w1 + slope * (end - load.start),
            case=case,
        )
    if isinstance(load, PolynomialLoad):
        # Taylor shift of Σ c_k ξ^k from ξ = x − s to ξ' = x − lo (in SI, then back).
        d_m = float((start - load.start).to("m").magnitude)
        cs = load.coefficients
        si_units = [ureg.Unit("N/m") / ureg.Unit("m") ** k for k in range(len(cs))]
        shifted = shift_polynomial(
            [float(c.to(u).magnitude) for c, u in zip(cs, si_units, strict=True)], d_m
        )
        new = [Q_(v, u).to(c.units) for v, u, c in zip(shifted, si_units, cs, strict=True)]
        return replace(load, start=start, end=end, coefficients=tuple(new), case=case)
    raise OutOfScopeError(  # pragma: no cover - every distributed type is handled above
        f"Pattern loading cannot split a load of type {type(load).__name__}"
    )


def pattern_cases(
    beam: Any, case: str = "L", *, patterns: str = "auto"
) -> tuple[Any, dict[str, list[tuple[str, ...]]]]:
    """Split load case ``case`` of ``beam`` span by span for pattern loading.

    Args:
        beam: a :class:`calcpack.analysis.beam.Beam` with loads of ``case``.
        case: the variable load case to pattern (e.g. ``"L"`` or ``"Q"``).
        patterns: ``"all"`` (every non-empty set of spans), ``"usual"`` (all spans, alternate
            spans, adjacent pairs) or ``"auto"`` (all for up to 6 spans, else usual).

    Returns:
        (the beam with ``case`` replaced by ``case#1``, ``case#2``... one per span that carries
        load, ``{case: [alternatives]}`` to pass as ``groups=`` -- keyed by the case name, which
        must also be the symbol the combination set uses; rename the key if it differs).

    Raises:
        InputError: the beam has no loads of ``case``; unknown ``patterns``.
    """
    if case not in beam.cases:
        raise InputError(
            f"Pattern loading: beam {beam.name} has no loads of case {case!r} (its cases are "
            f"{list(beam.cases)})",
            name="case",
            value=case,
            expected=" / ".join(beam.cases),
        )
    one_of("patterns", patterns, ("auto", "all", "usual"))
    spans = span_limits(beam)
    kept: list[Load] = [ld for ld in beam.loads if ld.case != case]
    loaded: list[str] = []
    for i, (a, b) in enumerate(spans, start=1):
        name = f"{case}#{i}"
        parts = [
            p
            for ld in beam.loads
            if ld.case == case
            for p in [_clip(ld, a, b, name, beam.L_m)]
            if p is not None
        ]
        if parts:
            kept.extend(parts)
            loaded.append(name)
    n = len(loaded)
    mode = patterns if patterns != "auto" else ("all" if n <= _ALL_SUBSETS_MAX_SPANS else "usual")
    alts: list[tuple[str, ...]] = []
    if mode == "all":
        for k in range(n, 0, -1):
            alts.extend(combinations(loaded, k))
    else:
        alts.append(tuple(loaded))
        alts.append(tuple(loaded[0::2]))
        if n > 1:
            alts.append(tuple(loaded[1::2]))
        alts.extend((loaded[i], loaded[i + 1]) for i in range(n - 1))
        alts = list(dict.fromkeys(alts))
    return replace(beam, loads=tuple(kept)), {case: alts}
