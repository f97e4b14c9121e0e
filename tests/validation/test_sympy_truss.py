"""Plane trusses checked against sympy's truss solver.

Reference: SymPy 1.14, ``sympy.physics.continuum_mechanics.truss.Truss`` (a general-purpose
open-source library, independent of calcpack's solver: it assembles its own joint equations and
inverts them symbolically). Its ``solve`` docstring says a positive internal force is
compressive, but in 1.14 the equations make a positive value *tensile*;
:func:`test_sympy_sign_convention_is_tension_positive` pins that down on a truss whose answer is
known by hand, so the comparisons below can take sympy's values as tension positive.

sympy's rollers react vertically only; the truss on an inclined roller is compared by rotating
the whole truss (nodes and loads) so that the roller's surface is level in sympy's frame:
member forces do not change under a rigid rotation, and the reactions rotate back.
"""

from __future__ import annotations

import math

import pytest
from sympy.physics.continuum_mechanics.truss import Truss as SympyTruss
from truss_shapes import cantilever, howe, inclined_roller_roof, pratt, warren

from calcpack.analysis.truss_model import Truss
from calcpack.analysis.truss_solve import solve_truss
from calcpack.units import si

# sympy works in floats here; both solvers invert well-conditioned matrices of order < 30, so
# agreement to 1e-9 relative to the largest force is round-off only.
REL = 1e-9


def to_sympy(truss: Truss, case: str | None = None, rotate_deg: float = 0.0) -> SympyTruss:
    """The same truss in sympy's model, optionally rotated counter-clockwise by rotate_deg."""
    c, s = math.cos(math.radians(rotate_deg)), math.sin(math.radians(rotate_deg))
    t = SympyTruss()
    for n in truss.nodes:
        x, y = si(n.x), si(n.y)
        t.add_node((n.name, c * x - s * y, s * x + c * y))
    for m in truss.members:
        t.add_member((m.name, m.start, m.end))
    for ld in truss.loads:
        if case is not None and ld.case != case:
            continue
        fx, fy = si(ld.Fx) / 1e3, si(ld.Fy) / 1e3  # kN
        gx, gy = c * fx - s * fy, s * fx + c * fy
        mag = math.hypot(gx, gy)
        if mag > 0:
            t.apply_load((ld.node, mag, math.degrees(math.atan2(gy, gx)) % 360.0))
    for sup in truss.supports:
        t.apply_support((sup.node, "pinned" if sup.kind == "pin" else "roller"))
    return t


def compare(truss: Truss, case: str | None = None, rotate_deg: float = 0.0) -> float:
    """Solve with both and return the largest force, asserting member-by-member agreement."""
    ours = solve_truss(truss, case=case)
    ref = to_sympy(truss, case, rotate_deg)
    ref.solve()
    scale = max(abs(float(v)) for v in ref.internal_forces.values())
    for name, value in ref.internal_forces.items():
        assert ours.force(name).to("kN").magnitude == pytest.approx(
            float(value), abs=REL * scale
        ), name
    return scale


def test_sympy_sign_convention_is_tension_positive() -> None:
    # A triangle A(0,0)-B(4,0)-C(2,2) on a pin and a roller, 10 kN down at C: by hand statics
    # the tie AB is in tension, +5 kN (common practice), the rafters in compression.
    t = SympyTruss()
    t.add_node(("A", 0, 0), ("B", 4, 0), ("C", 2, 2))
    t.add_member(("AB", "A", "B"), ("AC", "A", "C"), ("BC", "B", "C"))
    t.apply_load(("C", 10, 270))
    t.apply_support(("A", "pinned"), ("B", "roller"))
    t.solve()
    assert float(t.internal_forces["AB"]) == pytest.approx(5.0, rel=1e-12)  # exact arithmetic
    assert float(t.internal_forces["AC"]) == pytest.approx(-5 * math.sqrt(2), rel=1e-12)


def test_pratt_truss_six_panels() -> None:
    truss = pratt()
    assert compare(truss) > 0


def test_howe_truss_each_load_case() -> None:
    truss = howe()
    for case in ("D", "W"):
        assert compare(truss, case) > 0


def test_warren_truss_with_horizontal_load() -> None:
    assert compare(warren()) > 0


def test_cantilever_truss_pinned_at_wall() -> None:
    truss = cantilever()
    compare(truss)
    ours = solve_truss(truss)
    ref = to_sympy(truss)
    ref.solve()
    for name, value in ref.reaction_loads.items():
        ours_name = name[:-2] + name[-1]  # sympy's R_A_x is R_Ax here (pins only)
        assert ours.reaction(ours_name).to("kN").magnitude == pytest.approx(
            float(value), abs=REL * 20
        ), name  # 20 kN total load sets the scale of round-off


@pytest.mark.parametrize("slope", [30.0, 15.0, -20.0])
def test_roof_truss_on_inclined_roller(slope: float) -> None:
    truss = inclined_roller_roof(slope)
    compare(truss, rotate_deg=-slope)
    # The roller reaction is sympy's vertical reaction at E in the rotated frame.
    ref = to_sympy(truss, rotate_deg=-slope)
    ref.solve()
    ours = solve_truss(truss)
    assert ours.reaction("R_E").to("kN").magnitude == pytest.approx(
        float(ref.reaction_loads["R_E_y"]), rel=REL
    )
