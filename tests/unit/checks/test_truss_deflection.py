"""Truss deflection: the largest vertical joint displacement (stiffness method) against
span/limit, through the same check as a beam's.

References: the two-bar truss under a load at its apex, δ = P·L / (2·EA·sin²θ) (method of
joints and compatibility of the two bar extensions; common practice, any statics text); and the
unit-load (virtual work) method δ_j = Σ N·n·L / EA for a determinate truss (common practice),
written out here from member forces.
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import combine_results, solve_truss, solve_truss_cases
from calcpack.checks import check_deflection
from calcpack.errors import InputError
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN


def _two_bar(a: float, h: float, EA: float | None) -> Truss:
    return Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (a * m, h * m), "C": (2 * a * m, 0 * m)},
        members=[("A", "B"), ("B", "C")],
        supports={"A": "pin", "C": "pin"},
        loads=[JointLoad("B", Fy=-10 * kN, case="D")],
        EA=None if EA is None else EA * kN,
    )


@pytest.mark.parametrize(("a", "h"), [(2.0, 1.5), (3.0, 0.8), (1.0, 2.0)])
def test_two_bar_apex_deflection_matches_the_closed_form(a: float, h: float) -> None:
    EA = 50_000.0  # kN
    result = solve_truss(_two_bar(a, h, EA), method="stiffness")
    L = math.hypot(a, h)
    delta = 10.0 * L / (2 * EA * (h / L) ** 2)  # m
    checks = check_deflection(member="T1", demand=result, span=Q_(2 * a, "m"), limit=250)
    (c,) = checks.results
    assert c.demand.to("m").magnitude == pytest.approx(delta, rel=1e-9)
    assert c.capacity.to("m").magnitude == pytest.approx(2 * a / 250, rel=1e-12)
    assert "joint B" in c.combination


def test_king_post_truss_deflection_by_virtual_work_and_the_worst_combination() -> None:
    """A king post truss (span 8 m, rise 2 m); the check takes the largest of the
    combinations and names it; δ at L1 equals Σ N·n·L/EA with n for a unit load at L1."""
    nodes = {"L0": (0 * m, 0 * m), "L1": (4 * m, 0 * m), "L2": (8 * m, 0 * m),
             "U1": (4 * m, 2 * m)}  # fmt: skip
    members = [("L0", "L1"), ("L1", "L2"), ("L0", "U1"), ("U1", "L2"), ("L1", "U1")]
    EA = {"L0L1": 80_000 * kN, "L1L2": 80_000 * kN, "L0U1": 60_000 * kN,
          "U1L2": 60_000 * kN, "L1U1": 30_000 * kN}  # fmt: skip
    loads = [JointLoad("U1", Fy=-6 * kN, case="D"), JointLoad("L1", Fy=-2 * kN, case="D"),
             JointLoad("U1", Fy=-9 * kN, case="S")]  # fmt: skip
    truss = Truss.build(nodes=nodes, members=members, supports={"L0": "pin", "L2": "roller"},
                        loads=loads, EA=EA)  # fmt: skip
    cases = solve_truss_cases(truss, method="stiffness")
    unit = Truss.build(nodes=nodes, members=members, supports={"L0": "pin", "L2": "roller"},
                       loads=[JointLoad("L1", Fy=-1 * kN, case="u")], EA=EA)  # fmt: skip
    n = solve_truss(unit, method="equilibrium").forces
    lengths = {"L0L1": 4.0, "L1L2": 4.0, "L0U1": math.hypot(4, 2), "U1L2": math.hypot(4, 2),
               "L1U1": 2.0}  # fmt: skip
    combos = {"D": combine_results(cases, {"D": 1.0}), "D + S": combine_results(cases,
              {"D": 1.0, "S": 1.0})}  # fmt: skip
    worst = combos["D + S"]
    virtual = sum(
        worst.forces[k].to("kN").magnitude * n[k].to("kN").magnitude * lengths[k]
        / EA[k].to("kN").magnitude
        for k in lengths
    )  # fmt: skip
    (c,) = check_deflection(member="RT1", demand=combos, span=8 * m, limit=300).results
    # U1 and L1 move together (the king post's shortening is the difference): take the larger
    u = {j: abs(worst.displacements[j][1].to("m").magnitude) for j in ("L1", "U1")}
    assert max(u.values()) == pytest.approx(c.demand.to("m").magnitude, rel=1e-12)
    assert u["L1"] == pytest.approx(virtual, rel=1e-9)
    assert c.combination.startswith("D + S")


def test_a_truss_without_axial_stiffness_is_refused_naming_EA() -> None:
    result = solve_truss(_two_bar(2.0, 1.5, None))
    with pytest.raises(InputError, match="EA"):
        check_deflection(member="T1", demand=result, span=4 * m)
