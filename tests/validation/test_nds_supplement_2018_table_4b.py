"""AWC, NDS Supplement: Design Values for Wood Construction, 2018 edition, Table 4B (visually
graded Southern Pine dimension lumber, 2 in. to 4 in. thick).

The values below are recalled, not read ("from memory"), as are the shipped rows (marked so in
``calcpack/refdata/nds_2018_southern_pine_4b.csv``); they are to be confirmed against the
Supplement. Values are copied as printed, in psi; exact comparison.
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import SawnMember, ServiceConditions, check_nds_beam
from calcpack.checks.nds.factors import ReferenceDesignValues
from calcpack.checks.nds.values import nds_sawn_values, southern_pine_size_factor
from calcpack.combinations import analyse_combinations, asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.loads import UniformLoad
from calcpack.refdata import read_table
from calcpack.units import Q_


@pytest.mark.parametrize(
    ("grade", "width", "Fb", "Ft", "Fc", "E"),
    [
        # No.2, by nominal width (from memory)
        ("No.2", 4, 1100, 675, 1450, 1_400_000),
        ("No.2", 6, 1000, 600, 1400, 1_400_000),
        ("No.2", 8, 925, 550, 1350, 1_400_000),
        ("No.2", 10, 800, 475, 1300, 1_400_000),
        ("No.2", 12, 750, 450, 1250, 1_400_000),
        # No.1 and Select Structural, 2x4 and 2x10 (from memory)
        ("No.1", 4, 1500, 1000, 1850, 1_600_000),
        ("No.1", 10, 1050, 700, 1650, 1_600_000),
        ("Select Structural", 4, 2850, 1600, 2100, 1_800_000),
        ("Select Structural", 10, 2050, 1100, 1850, 1_800_000),
    ],
)
def test_table_4b_southern_pine_values(grade, width, Fb, Ft, Fc, E):
    v = nds_sawn_values("Southern Pine", grade, table="4B", width=width)
    got = [v.Fb, v.Ft, v.Fc, v.E]
    assert [q.to("psi").magnitude for q in got] == [Fb, Ft, Fc, E]
    # F_v 175 psi and F_c⊥ 565 psi for the non-dense grades (from memory)
    assert (v.Fv.to("psi").magnitude, v.Fc_perp.to("psi").magnitude) == (175, 565)
    assert "Table 4B" in v.source
    assert "from memory" in v.source


def test_table_4b_values_never_grow_with_width():
    # the published table's size effect: F_b, F_t and F_c fall (or stay) as the width grows
    t = read_table("nds_2018_southern_pine_4b.csv", key="key")
    order = ["2-4", "5-6", "8", "10", "12"]
    for grade in {r["grade"] for r in t.rows.values()}:
        for prop in ("Fb", "Ft", "Fc"):
            vals = [t.row(f"{grade}|{w}")[prop] for w in order]
            assert vals == sorted(vals, reverse=True), (grade, prop)


def test_table_4b_size_factor_rule():
    # Table 4B footnote (from memory): C_F = 1.0 for 2"-3" thick; F_b × 1.1 for 4" thick, 8"+
    assert southern_pine_size_factor(2, 10) == 1.0
    assert southern_pine_size_factor(4, 6) == 1.0
    assert southern_pine_size_factor(4, 8) == 1.1
    with pytest.raises(InputError, match="nominal_width"):
        southern_pine_size_factor(2, 14)


def test_beam_check_with_table_4b_values_takes_no_further_size_factor():
    v = nds_sawn_values("Southern Pine", "No.2", table="4B", width=10)
    ref = ReferenceDesignValues(
        v.name, "No.2", v.source, Fb=v.Fb, Fv=v.Fv, E=v.E, Emin=v.Emin, size_rule="Table 4B"
    )
    ft = Q_(1, "ft")
    beam = Beam(
        length=12 * ft,
        supports=[Pin(0 * ft), Roller(12 * ft)],
        loads=[UniformLoad(Q_(60, "lbf/ft"), case="D"), UniformLoad(Q_(160, "lbf/ft"), case="L")],
    )
    cr = analyse_combinations(solve_cases(beam), asce7_allowable_stress())
    r = check_nds_beam(SawnMember.dimension("2x10"), ref, demand=cr, conditions=ServiceConditions())
    assert r.values["C_F"].magnitude == 1.0
    assert r.values["F_b"].to("psi").magnitude == 800


def test_table_4b_bad_input_names_the_input():
    with pytest.raises(InputError, match="width"):
        nds_sawn_values("Southern Pine", "No.2", table="4B")
    with pytest.raises(InputError, match="width"):
        nds_sawn_values("Douglas Fir-Larch", "No.2", width=10)
    with pytest.raises(InputError, match="species"):
        nds_sawn_values("Hem-Fir", "No.2", table="4B", width=10)
    with pytest.raises(InputError, match="did you mean"):
        nds_sawn_values("Southern Pine", "No 1", table="4B", width=10)
