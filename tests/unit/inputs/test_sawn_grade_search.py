"""A sawn beam searched across grades: every size in each grade, ranked by weight (the grade
listed first at equal size), the pick writing size and grade.

References outside calcpack:
* NDS Supplement 2018 Table 4A, Douglas Fir-Larch (published-values reference): No.2 F_b = 900,
  E = 1,600,000 psi; No.1 F_b = 1000, E = 1,700,000 psi; F_v = 180 psi for both (from memory
  for No.1's F_v, the same column as No.2's). Table 4A size factors for F_b (from memory): 2"
  and 3" thick, widths 4, 6, 8, 10, 12 in: 1.5, 1.3, 1.2, 1.1, 1.0; 4" thick: 1.5, 1.3, 1.3,
  1.2, 1.1.
* NDS 2018 Eq. (3.3-2) f_b = M/S, Eq. (3.4-2) f_v = 3V/(2bd); Table 2.3.2 C_D = 1.0 (D + L).
* Simple span under uniform load: M = wL²/8, V = wL/2, Δ = 5wL⁴/(384EI) (AISC Manual Table 3-23
  case 1).
The brute force below works those formulas directly, not through calcpack's checks.
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks.nds.values import nds_sawn_grades
from calcpack.combinations import analyse_combinations, asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.inputs.beam_member import (
    BeamDemand,
    beam_member_inputs,
    beam_pick_changes,
    evaluate_beam_member,
    lightest_beam_member,
)
from calcpack.loads.types import UniformLoad
from calcpack.sizing import DeflectionLimit, lightest_nds_beam
from calcpack.units import Q_

GRADES = {"No.2": (900.0, 1.6e6), "No.1": (1000.0, 1.7e6)}  # F_b, E [psi], Table 4A DF-L
CF = {(False, 4): 1.5, (False, 6): 1.3, (False, 8): 1.2, (False, 10): 1.1, (False, 12): 1.0,
      (True, 4): 1.5, (True, 6): 1.3, (True, 8): 1.3, (True, 10): 1.2, (True, 12): 1.1}  # fmt: skip
TABLE = {"material": "sawn", "species": "Douglas Fir-Larch", "grade": "No.2", "size": "2x6"}


def _demand(span_ft: float, wd: float, wl: float) -> BeamDemand:
    L = Q_(span_ft, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[
            UniformLoad(w=Q_(wd, "lbf/ft"), case="D"),
            UniformLoad(w=Q_(wl, "lbf/ft"), case="L"),
        ],
        EI=Q_(1.6e6, "psi") * Q_(100, "in**4"),
        name="J1",
    )
    cases = solve_cases(beam)
    return BeamDemand(
        analyse_combinations(cases, asce7_allowable_stress()),
        deflections=[DeflectionLimit(cases["L"], L, 360)],
    )


def _brute_force(span_ft: float, wd: float, wl: float, grades: list[str]) -> str:
    """Lightest (size, grade) by the closed forms; at equal area, the shallower, then the grade
    listed first."""
    w = (wd + wl) / 12  # lbf/in, D + L governs with C_D = 1.0
    Lin = span_ft * 12
    best: tuple[float, float, int, str] | None = None
    for i, g in enumerate(grades):
        Fb, E = GRADES[g]
        for t in (2, 3, 4):
            for n in (4, 6, 8, 10, 12):
                b, d = t - 0.5, n - (0.5 if n <= 6 else 0.75)
                ok_b = w * Lin**2 / 8 / (b * d * d / 6) <= Fb * CF[(t == 4, n)]
                ok_v = 1.5 * (w * Lin / 2) / (b * d) <= 180  # full end shear: conservative
                defl = 5 * (wl / 12) * Lin**4 / (384 * E * b * d**3 / 12)
                row = (b * d, d, i, f"{t}x{n} {g}")
                if ok_b and ok_v and defl <= Lin / 360 and (best is None or row < best):
                    best = row
    assert best is not None
    return best[3]


@pytest.mark.parametrize(
    ("span_ft", "wd", "wl", "grades"),
    [
        (13.0, 40.0, 110.0, ["No.2", "No.1"]),
        (13.0, 40.0, 110.0, ["No.1", "No.2"]),
        (10.0, 30.0, 90.0, ["No.2", "No.1"]),
    ],
)
def test_search_across_grades_matches_the_closed_forms(
    span_ft: float, wd: float, wl: float, grades: list[str]
) -> None:
    demand = _demand(span_ft, wd, wl)
    case = beam_member_inputs({"joist": dict(TABLE)}, demand, table="joist")
    found = lightest_beam_member(case, grades=grades, count=4)
    assert found.best.name == _brute_force(span_ft, wd, wl, grades)
    # every candidate tried before the best fails when put in the table and checked in full
    for t in found.tried:
        if t.name == found.best.name:
            break
        size, grade = t.name.split(" ", 1)
        table = {"joist": {**TABLE, "size": size, "grade": grade}}
        assert not evaluate_beam_member(beam_member_inputs(table, demand, table="joist")).passed
    # the pick writes size and grade; the table so written passes
    changes = beam_pick_changes(case, found.best.name)
    size, grade = found.best.name.split(" ", 1)
    assert changes == {"joist.size": size, "joist.grade": grade}
    picked = {"joist": {**TABLE, "size": size, "grade": grade}}
    assert evaluate_beam_member(beam_member_inputs(picked, demand, table="joist")).passed
    weights = [t.weight.to("lbf/ft").magnitude for t in found.tried]
    assert weights == sorted(weights)


def test_equal_sizes_rank_in_the_order_the_grades_are_listed() -> None:
    demand = _demand(10.0, 30.0, 90.0)
    for grades in (["No.2", "No.1"], ["No.1", "No.2"]):
        found = lightest_nds_beam(
            demand.strength, species="Douglas Fir-Larch", grade=grades,
            deflections=demand.deflections, count=6,
        )  # fmt: skip
        sizes = [t.name.split(" ")[0] for t in found.passing]
        for i in range(len(sizes) - 1):
            if sizes[i] == sizes[i + 1]:  # the same size in both grades: the listed order
                assert found.passing[i].name.endswith(grades[0])


def test_grades_of_a_species_come_from_the_table_and_bad_lists_name_the_input() -> None:
    grades = nds_sawn_grades("Douglas Fir-Larch")
    assert {"No.1", "No.2", "Select Structural"} <= set(grades)
    assert "P&T No.1" in nds_sawn_grades("Douglas Fir-Larch", table="4D")
    with pytest.raises(InputError, match="species"):
        nds_sawn_grades("Douglas Fur-Larch")
    demand = _demand(10.0, 30.0, 90.0)
    case = beam_member_inputs({"joist": dict(TABLE)}, demand, table="joist")
    with pytest.raises(InputError, match="grades"):
        lightest_beam_member(case, grades=[])
    with pytest.raises(InputError, match=r"'No\.2' twice"):
        lightest_beam_member(case, grades=["No.2", "No.2"])
    with pytest.raises(InputError, match=r"joist\.grade"):
        lightest_beam_member(case, grades=["No.2", "No.7"])
    steel = beam_member_inputs(
        {"beam": {"material": "steel", "section": "W8X18", "Fy": Q_(50, "ksi")}},
        BeamDemand(demand.strength, method="ASD", continuous_bracing=True),
        table="beam",
    )
    with pytest.raises(InputError, match="grades"):
        lightest_beam_member(steel, grades=["No.2"])


def test_member_stiffness_is_e_times_i_of_the_table_section() -> None:
    from calcpack.inputs.beam_member import member_stiffness

    # AISC Shapes Database v15.0 (published-values reference): W8x18 I_x = 61.9 in⁴
    steel = {"m": {"material": "steel", "section": "W8X18", "Fy": Q_(50, "ksi")}}
    assert member_stiffness(steel, table="m").to("kip*inch**2").magnitude == pytest.approx(
        29000 * 61.9, rel=1e-3
    )
    # DF-L No.2, E = 1,600,000 psi (Table 4A); a 2x10 dressed 1.5 x 9.25 in; two plies
    sawn = {"m": {**TABLE, "size": "2x10", "plies": 2}}
    ei = member_stiffness(sawn, table="m").to("lbf*inch**2").magnitude
    assert ei == pytest.approx(1.6e6 * 1.5 * 9.25**3 / 12 * 2, rel=1e-9)
    # 24F-1.8E: E_x = 1,800,000 psi (the class name gives it; NDS Supplement Table 5A)
    glulam = {"m": {"material": "glulam", "stress_class": "24F-1.8E",
                    "width": Q_(5.125, "inch"), "depth": Q_(12, "inch")}}  # fmt: skip
    ei = member_stiffness(glulam, table="m").to("lbf*inch**2").magnitude
    assert ei == pytest.approx(1.8e6 * 5.125 * 12**3 / 12, rel=1e-9)
    with pytest.raises(InputError, match=r"m\.size"):
        member_stiffness({"m": {**TABLE, "size": "large"}}, table="m")
    with pytest.raises(InputError, match="no \\[beam\\] table"):
        member_stiffness({}, table="beam")
