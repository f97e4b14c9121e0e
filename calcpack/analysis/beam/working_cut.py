"""The cut-section working of a beam: the free body left of a cut at x, with ΣFy = 0 and ΣM
about the cut = 0 giving V and M from first principles."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.analysis.beam.statics import CutSide, Region
from calcpack.analysis.beam.working_terms import (
    LoadTerms,
    Writer,
    accumulate,
    load_terms,
    pick_settings,
)
from calcpack.loads._si import check
from calcpack.units import Q_
from calcpack.validate import one_of
from calcpack.working import Block, Heading, Text, Unknown

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["cut_working"]


def cut_working(
    result: BeamResult, x: Any, *, side: str = "left", sheet: Any = None, system: str | None = None
) -> Any:
    """Cut-section working at ``x``: the free body of the part of the beam left of the cut,
    ΣFy = 0 and ΣM about the cut = 0 giving V and M from first principles.

    ``side="left"`` cuts just left of x (actions at x excluded), ``"right"`` just right of it.
    """
    return _cut_working(Writer(pick_settings(sheet, system)), result, x, side)


def _cut_working(w: Writer, result: BeamResult, x: Any, side: str) -> Any:
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
    loads = LoadTerms(w, result, steps, upto=hi)
    one_of("side", side, ("left", "right"))
    react = {r.support: r for r in result.reactions}
    rterms = []
    for s in beam.supports:
        if s.x_m > hi:
            continue
        r = react[s.label]
        acting = (
            (s.restrains_v, "F", "R", r.Fy, "reaction at {} (from the analysis)", "force"),
            (s.restrains_rotation, "C", "M", r.C, "moment reaction at {}, clockwise +", "moment"),
        )
        for restrained, kind, symbol, value, said, dimension in acting:
            if restrained:
                given = w.given(
                    f"{symbol}_{s.label}",
                    value,
                    said.format(s.label),
                    unit=w.u(dimension),
                    result=True,
                )
                steps.append(given)
                rterms.append((kind, s.x_m, given))
    cut: CutSide = "left" if side == "left" else ""
    termsV = load_terms(loads, beam, Region(0.0, x_m, None, "c", cut))
    termsM = load_terms(loads, beam, Region(0.0, x_m, x_m, "c", cut))
    labelV, descV = r"\Sigma F_y = 0", "left part, up +"
    labelM, descM = r"\Sigma M_{c} = 0", "left part, moments about the cut c, ccw +"
    V = Unknown("V", unit=w.u("force"))
    M = Unknown("M", unit=w.u("moment"))
    lhsV: Any = None
    restV: Any = None
    for kind, _xs, t in rterms:
        if kind == "F":
            lhsV = accumulate(lhsV, 1.0, t)
            restV = accumulate(restV, 1.0, t)
    for sign, term in termsV:
        lhsV = accumulate(lhsV, sign, term)
        restV = accumulate(restV, sign, term)
    lhsV = accumulate(lhsV, -1.0, V)
    steps.append(w.equation(lhsV, 0, label=labelV, description=descV))
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
            lhsM = accumulate(lhsM, -1.0, t * w.lit(x_m - xs))
            restM = accumulate(restM, 1.0, t * w.lit(x_m - xs))
        elif kind == "C":
            lhsM = accumulate(lhsM, -1.0, t)
            restM = accumulate(restM, 1.0, t)
    for sign, term in termsM:
        lhsM = accumulate(lhsM, sign, term)
        restM = accumulate(restM, -sign, term)
    lhsM = accumulate(lhsM, 1.0, M)
    steps.append(w.equation(lhsM, 0, label=labelM, description=descM))
    steps.append(
        w.derived(
            "M",
            restM if restM is not None else Q_(0.0, "kN*m"),
            f"bending moment at x = {xq:~.4g} ({side}), sagging +",
            unit=w.u("moment"),
        )
    )
    return Block(steps=steps[1:], title=f"Cut at x = {xq:~.4g} ({side}), beam {beam.name}")
