"""Simple trusses against their hand-statics answers (common practice: the method of joints
and overall equilibrium worked by hand, as any statics text does for these shapes).

Every expected value is written in closed form from the geometry, not copied from a run.
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import solve_truss, zero_force_by_inspection
from calcpack.units import ureg

m, kN = ureg.m, ureg.kN
# Closed forms evaluated in floating point: agreement to 1e-12 relative is round-off only.
REL = 1e-12


def king_post(L: float, h: float, at: str, P: float) -> Truss:
    """Symmetric king-post truss: span L, rise h, king post CD, load P (kN) down at ``at``."""
    return Truss.build(
        nodes={
            "A": (0 * m, 0 * m),
            "D": (L / 2 * m, 0 * m),
            "B": (L * m, 0 * m),
            "C": (L / 2 * m, h * m),
        },
        members=[("A", "D"), ("D", "B"), ("A", "C"), ("C", "B"), ("C", "D")],
        supports={"A": "pin", "B": "roller"},
        loads=[JointLoad(at, Fy=-P * kN)],
    )


@pytest.mark.parametrize(("L", "h", "P"), [(8.0, 2.0, 12.0), (6.0, 3.0, 10.0), (12.0, 2.5, 7.5)])
def test_king_post_apex_load(L: float, h: float, P: float) -> None:
    r = solve_truss(king_post(L, h, "C", P))
    theta = math.atan2(h, L / 2)  # rafter slope
    # Joint A: R_A = P/2 up; rafter AC carries P / (2 sin θ) in compression, the tie
    # P / (2 tan θ) in tension; the king post is a zero-force member (joint D unloaded).
    assert r.reaction("R_Ay").to("kN").magnitude == pytest.approx(P / 2, rel=REL)
    assert r.reaction("R_B").to("kN").magnitude == pytest.approx(P / 2, rel=REL)
    assert r.force("AC").to("kN").magnitude == pytest.approx(-P / (2 * math.sin(theta)), rel=REL)
    assert r.force("CB").to("kN").magnitude == pytest.approx(-P / (2 * math.sin(theta)), rel=REL)
    assert r.force("AD").to("kN").magnitude == pytest.approx(P / (2 * math.tan(theta)), rel=REL)
    assert r.nature("AC") == "C"
    assert r.nature("AD") == "T"
    assert r.zero_force_members == ("CD",)
    assert zero_force_by_inspection(r.truss) == {"CD": "joint D: AD and DB collinear, no load"}


def test_king_post_tie_load() -> None:
    L, h, P = 8.0, 2.0, 12.0
    r = solve_truss(king_post(L, h, "D", P))
    theta = math.atan2(h, L / 2)
    # Joint D: the king post hangs the load, tension P; joint C then as for an apex load.
    assert r.force("CD").to("kN").magnitude == pytest.approx(P, rel=REL)
    assert r.force("AC").to("kN").magnitude == pytest.approx(-P / (2 * math.sin(theta)), rel=REL)
    assert r.force("DB").to("kN").magnitude == pytest.approx(P / (2 * math.tan(theta)), rel=REL)


@pytest.mark.parametrize(
    ("a", "b", "h", "Px", "Py"), [(3.0, 5.0, 2.0, 0.0, -9.0), (2.0, 2.0, 4.0, 6.0, -10.0)]
)
def test_simple_triangle(a: float, b: float, h: float, Px: float, Py: float) -> None:
    # A(0,0) pin, B(a+b, 0) roller, apex C(a, h) with load (Px, Py) kN.
    L = a + b
    t = Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (L * m, 0 * m), "C": (a * m, h * m)},
        members=[("A", "B"), ("A", "C"), ("B", "C")],
        supports={"A": "pin", "B": "roller"},
        loads=[JointLoad("C", Fx=Px * kN, Fy=Py * kN)],
    )
    r = solve_truss(t)
    # Overall: ΣM_A: R_B L + Py a - Px h = 0; ΣFx: R_Ax = -Px; ΣFy: R_Ay = -Py - R_B.
    R_B = (Px * h - Py * a) / L
    assert r.reaction("R_B").to("kN").magnitude == pytest.approx(R_B, rel=REL)
    assert r.reaction("R_Ax").to("kN").magnitude == pytest.approx(-Px, rel=REL, abs=1e-12)
    assert r.reaction("R_Ay").to("kN").magnitude == pytest.approx(-Py - R_B, rel=REL)
    # Joint B (no horizontal reaction): tension in BC pulls B along (-b, h)/|BC|, tension in AB
    # along (-1, 0). ΣFy: R_B + F_BC h/|BC| = 0; ΣFx: -F_BC b/|BC| - F_AB = 0.
    lbc = math.hypot(b, h)
    F_BC = -R_B * lbc / h
    F_AB = -F_BC * b / lbc
    assert r.force("BC").to("kN").magnitude == pytest.approx(F_BC, rel=REL)
    assert r.force("AB").to("kN").magnitude == pytest.approx(F_AB, rel=REL)
