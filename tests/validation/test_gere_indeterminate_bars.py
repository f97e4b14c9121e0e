"""Statically indeterminate bar systems against their textbook closed forms.

Sources (from memory):
- J. M. Gere and B. J. Goodno, *Mechanics of Materials*, chapter 2, "Statically indeterminate
  structures": a prismatic bar fixed at both ends with an axial load P at distance a from end A
  and b from end B; R_A = P b / L and R_B = P a / L for equal EA, and in general the load
  divides in proportion to the two segments' axial stiffnesses EA / L.
- S. Timoshenko, *Strength of Materials, Part I*, the symmetric three-bar system: a load P
  hangs from a joint held by a vertical bar and two bars at angle α either side, all of the
  same EA; the vertical bar carries P / (1 + 2 cos³ α) and each inclined bar
  P cos² α / (1 + 2 cos³ α).

Both are solved here by calcpack's direct stiffness method.
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import solve_truss
from calcpack.units import ureg

m, kN = ureg.m, ureg.kN
# Closed form against a dense solve of a handful of equations: 1e-10 relative is round-off.
REL = 1e-10


@pytest.mark.parametrize(("a", "b", "EA1", "EA2"), [(1.0, 2.0, 1e5, 1e5), (2.5, 1.5, 2e5, 5e4)])
def test_two_bar_fixed_ends(a: float, b: float, EA1: float, EA2: float) -> None:
    # A(0,0) pin, C(a,0) held laterally by a roller, B(a+b, 0) pin; P to the right at C.
    P = 30.0
    t = Truss.build(
        nodes={"A": (0 * m, 0 * m), "C": (a * m, 0 * m), "B": ((a + b) * m, 0 * m)},
        members={"AC": ("A", "C"), "CB": ("C", "B")},
        supports={"A": "pin", "C": "roller", "B": "pin"},
        loads=[JointLoad("C", Fx=P * kN)],
        EA={"AC": EA1 * kN, "CB": EA2 * kN},
    )
    r = solve_truss(t)
    assert r.determinacy.degree == 1
    assert r.method == "stiffness"
    k1, k2 = EA1 / a, EA2 / b
    # Segment AC stretches and CB shortens by the same δ = P / (k1 + k2).
    assert r.force("AC").to("kN").magnitude == pytest.approx(P * k1 / (k1 + k2), rel=REL)
    assert r.force("CB").to("kN").magnitude == pytest.approx(-P * k2 / (k1 + k2), rel=REL)
    assert r.reaction("R_Ax").to("kN").magnitude == pytest.approx(-P * k1 / (k1 + k2), rel=REL)
    ux = r.displacements["C"][0].to("m").magnitude  # type: ignore[index]
    assert ux == pytest.approx(P / (k1 + k2), rel=REL)  # kN / (kN/m) = m
    if EA1 == EA2:
        assert r.reaction("R_Bx").to("kN").magnitude == pytest.approx(-P * a / (a + b), rel=REL)


@pytest.mark.parametrize("alpha_deg", [30.0, 45.0, 60.0])
def test_three_bar_symmetric(alpha_deg: float) -> None:
    h, P = 2.0, 100.0
    al = math.radians(alpha_deg)
    w = h * math.tan(al)
    t = Truss.build(
        nodes={"D": (0 * m, 0 * m), "A": (-w * m, h * m), "B": (0 * m, h * m), "C": (w * m, h * m)},
        members=[("A", "D"), ("B", "D"), ("C", "D")],
        supports={"A": "pin", "B": "pin", "C": "pin"},
        loads=[JointLoad("D", Fy=-P * kN)],
        EA=1.0e5 * kN,
    )
    r = solve_truss(t)
    c3 = 1 + 2 * math.cos(al) ** 3
    assert r.force("BD").to("kN").magnitude == pytest.approx(P / c3, rel=REL)
    assert r.force("AD").to("kN").magnitude == pytest.approx(P * math.cos(al) ** 2 / c3, rel=REL)
    assert r.force("CD").to("kN").magnitude == pytest.approx(P * math.cos(al) ** 2 / c3, rel=REL)
