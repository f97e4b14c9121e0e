"""Solve a beam for one load case, for all loads together, or for every case separately."""

from __future__ import annotations

from calcpack.analysis.beam.core import SIBeam, solve_si
from calcpack.analysis.beam.model import Beam, Spring
from calcpack.analysis.beam.result import BeamResult
from calcpack.errors import InputError
from calcpack.loads.types import Load, si_parts

__all__ = ["solve_beam", "solve_cases"]


def _si_beam(beam: Beam, loads: tuple[Load, ...]) -> SIBeam:
    supports = []
    for s in beam.supports:
        fv = fr = 0.0
        if isinstance(s, Spring):
            if s.k is not None:
                fv = 1.0 / float(s.k.to("N/m").magnitude)
            if s.k_theta is not None:
                fr = 1.0 / float(s.k_theta.to("N*m").magnitude)
        supports.append(
            (
                s.label,
                s.x_m,
                bool(s.restrains_v),
                bool(s.restrains_rotation),
                fv,
                fr,
                bool(s.restrains_h),
            )
        )
    parts = [si_parts(load) for load in loads]
    pieces = tuple((p.a_m, p.b_m, p.coeffs) for pcs, _ in parts for p in pcs)
    points = tuple((p.x_m, p.P_N, p.H_N, p.C_Nm) for _, pts in parts for p in pts)
    return SIBeam(
        L_m=beam.L_m,
        supports=tuple(supports),
        hinges=tuple((h.name or "", h.x_m) for h in beam.hinges),
        pieces=pieces,
        points=points,
        EI=beam.EI_segments_si(),
    )


def solve_beam(beam: Beam, case: str | None = None) -> BeamResult:
    """Solve ``beam`` exactly for the loads of one ``case``, or all its loads if None.

    Args:
        beam: the model. case: a load-case name among ``beam.cases``, or None for all loads
            acting together (each case with factor 1).

    Returns:
        A :class:`BeamResult` (reactions, V, M, slope, deflection, extremes), linear in the
        loads so results of different cases can be scaled and added.

    Raises:
        UnstableStructureError: the supports and hinges cannot carry the loads (says why and
            what would fix it).
        InputError: ``case`` is not a load case of the beam; EI is missing where it is needed
            (indeterminate beams and spring supports).
    """
    classification = beam.check_stable()
    if case is None:
        loads = tuple(beam.loads)
        cases = tuple((c, 1.0) for c in beam.cases) or (("no load", 1.0),)
    else:
        if case not in beam.cases:
            raise InputError(
                f"Load case {case!r} has no loads on beam {beam.name} (its cases are "
                f"{list(beam.cases)})",
                name="case",
                value=case,
                expected=" or ".join(repr(c) for c in beam.cases) or "a case with loads",
            )
        loads = tuple(load for load in beam.loads if load.case == case)
        cases = ((case, 1.0),)
    needs_ei = classification.degree_bending > 0 or any(
        isinstance(s, Spring) for s in beam.supports
    )
    if needs_ei and beam.EI is None:
        why = (
            f"statically indeterminate (degree {classification.degree_bending} in bending)"
            if classification.degree_bending > 0
            else "on spring supports"
        )
        raise InputError(
            f"Beam {beam.name} is {why}, so its reactions depend on its stiffness: give EI "
            "(got EI = None)",
            name="EI",
            value=None,
            expected="a flexural stiffness, e.g. EI = 200 GPa × 40e6 mm⁴",
        )
    core = solve_si(_si_beam(beam, loads))
    return BeamResult(beam=beam, cases=cases, classification=classification, core=core)


def solve_cases(beam: Beam) -> dict[str, BeamResult]:
    """Solve every load case of ``beam`` alone: case name -> result, for superposition with
    :func:`calcpack.analysis.beam.combine` or ``1.2 * r["D"] + 1.6 * r["L"]``."""
    return {case: solve_beam(beam, case) for case in beam.cases}
