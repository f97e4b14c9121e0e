"""Combinations: applying sets to a job's cases, superposition, envelopes, pattern loading,
working, and the bad inputs (unknown set or case, a case used in no combination)."""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.combinations import (
    LoadCombination,
    analyse_combinations,
    asce7_strength,
    combination_set,
    en1990_combinations,
    format_factors,
    get_combination_set,
    pattern_cases,
    span_limits,
    superpose,
)
from calcpack.errors import InputError
from calcpack.loads import LinearLoad, PointLoad, PolynomialLoad, UniformLoad
from calcpack.units import Q_, ureg

m = ureg.m
kN = ureg.kN


def _beam(cases=("D", "L"), spans=1):
    sup = [Pin(0 * m)] + [Roller(4 * (i + 1) * m) for i in range(spans)]
    loads = [UniformLoad(w=(2 + i) * kN / m, case=c) for i, c in enumerate(cases)]
    return Beam(length=4 * spans * m, supports=sup, loads=loads, EI=1e4 * kN * m**2)


def test_format_factors():
    assert format_factors([("D", 1.2), ("L", 1.6), ("Lr", 0.5)]) == "1.2D + 1.6L + 0.5Lr"
    assert format_factors([("D", 0.9), ("Ev", -1.0), ("Eh", 1.0)]) == "0.9D - Ev + Eh"


def test_apply_drops_absent_leading_and_duplicates():
    applied = asce7_strength().apply(["D", "L"])
    names = [a.name for a in applied]
    # 2a, 2b, 2c all reduce to 1.2D + 1.6L: kept once under the first name
    assert names == ["1: 1.4D", "2a: 1.2D + 1.6L"]


def test_unknown_set_names_it():
    with pytest.raises(InputError, match="'ASCE 7-05'") as e:
        get_combination_set("ASCE 7-05")
    assert e.value.name == "combination set"


def test_builtin_sets_are_registered():
    assert get_combination_set("ASCE7-16 strength").kind == "strength"
    assert get_combination_set("AS/NZS1170 serviceability").kind == "serviceability"


def test_case_used_in_no_combination_is_an_error_naming_it():
    r = solve_cases(_beam(("D", "Dead2")))
    with pytest.raises(InputError, match="'Dead2' is used in no combination"):
        analyse_combinations(r, asce7_strength())


def test_groups_map_a_symbol_to_job_cases():
    r = solve_cases(_beam(("D", "W_down", "W_up")))
    cr = analyse_combinations(r, asce7_strength(), groups={"W": ("W_down", "W_up")})
    assert "5: 0.9D + W_up [W: W_up]" in cr.results
    with pytest.raises(InputError, match="'Q'"):
        asce7_strength().apply(["D"], groups={"Q": ("x",)})


def test_user_defined_set_is_strict():
    s = combination_set("Client", {"C1": {"D": 1.25, "L": 1.5}, "C2": {"D": 0.9, "W": 1.4}})
    r = solve_cases(_beam())
    with pytest.raises(InputError, match="'W'"):
        analyse_combinations(r, s)
    ok = combination_set("Client", {"C1": {"D": 1.25, "L": 1.5}})
    cr = analyse_combinations(r, ok)
    assert list(cr.results) == ["C1: 1.25D + 1.5L"]


def test_bad_factors_and_combinations():
    with pytest.raises(InputError, match="'L'"):
        LoadCombination("x", {"D": 1.2, "L": float("nan")}, "c")
    with pytest.raises(InputError, match="at least one"):
        LoadCombination("x", {}, "c")
    with pytest.raises(InputError, match="leading action 'W'"):
        LoadCombination("x", {"D": 1.0}, "c", leading=("W",))
    with pytest.raises(InputError, match="kind"):
        combination_set("x", {"a": {"D": 1.0}}, kind="ultimate")


def test_superpose_unknown_case_names_it():
    r = solve_cases(_beam())
    with pytest.raises(InputError, match="'S' has no result"):
        superpose(r, {"D": 1.2, "S": 1.6})


def test_superpose_beam_equals_factored_sum():
    r = solve_cases(_beam())
    c = superpose(r, {"D": 1.2, "L": 1.6})
    # w = 1.2·2 + 1.6·3 = 7.2 kN/m on 4 m: M = wL²/8 = 14.4 kN·m (simple beam, common practice)
    assert c.extremes.M_max.value.to("kN*m").magnitude == pytest.approx(14.4, rel=1e-12)


def test_envelope_of_named_scalars():
    # truss-like results: member forces per case
    r = {"D": {"N1": Q_(-10.0, "kN"), "N2": Q_(4.0, "kN")}, "W": {"N1": Q_(8.0, "kN")}}
    cr = analyse_combinations(r, asce7_strength())
    env = cr.envelope()
    assert env["N1,min"].value.to("kN").magnitude == pytest.approx(-14.0)  # 1.4D
    assert env["N1,max"].value.to("kN").magnitude == pytest.approx(-9.0 + 8.0)  # 0.9D + W
    assert env["N1,max"].combination.startswith("5")
    with pytest.raises(InputError, match="'N3'"):
        env["N3"]


def test_en1990_needs_categories():
    with pytest.raises(InputError, match="'Z'"):
        en1990_combinations(variable={"Q": "Z"})
    with pytest.raises(InputError, match="equation"):
        en1990_combinations(variable={"Q": "B"}, equation="6.11")


def test_pattern_cases_split_loads_by_span_and_keep_resultant():
    beam = Beam(
        length=12 * m,
        supports=[Pin(0 * m), Roller(4 * m), Roller(8 * m), Roller(12 * m)],
        loads=[
            UniformLoad(w=2 * kN / m, case="D"),
            UniformLoad(w=5 * kN / m, case="L"),
            LinearLoad(w_start=0 * kN / m, w_end=6 * kN / m, start=2 * m, end=10 * m, case="L"),
            PolynomialLoad(
                coefficients=(1 * kN / m, 0.5 * kN / m**2), start=3 * m, end=9 * m, case="L"
            ),
            PointLoad(x=8 * m, P=10 * kN, case="L"),
        ],
        EI=1e4 * kN * m**2,
    )
    assert len(span_limits(beam)) == 3
    pbeam, groups = pattern_cases(beam, "L")
    assert set(pbeam.cases) == {"D", "L#1", "L#2", "L#3"}
    assert len(groups["L"]) == 7  # every non-empty set of 3 spans
    whole = solve_cases(beam)["L"]
    parts = solve_cases(pbeam)
    total = parts["L#1"] + parts["L#2"] + parts["L#3"]
    for x in (1.0, 3.5, 6.0, 9.5):
        assert total.moment(x * m).magnitude == pytest.approx(
            whole.moment(x * m).to(total.moment(x * m).units).magnitude, rel=1e-9, abs=1e-9
        )
    with pytest.raises(InputError, match="'S'"):
        pattern_cases(beam, "S")


def test_working_shows_each_combination_with_clause_and_caution():
    from calcpack.working import Caution, Table

    cr = analyse_combinations(solve_cases(_beam()), asce7_strength())
    steps = cr.working()
    tables = [s for s in steps if isinstance(s, Table)]
    assert tables[0].rows[1][2] == "ASCE/SEI 7-16 §2.3.1 (2)"
    assert any("M_max" in t.columns for t in tables)
    assert any(isinstance(s, Caution) and "ASCE/SEI 7-16" in s.body for s in steps)
    env = tables[-1]
    assert env.columns[-1] == "Governing combination"


def test_factored_line_loads_are_shown():
    from calcpack.working import Table

    cr = analyse_combinations(solve_cases(_beam()), asce7_strength())
    t = next(s for s in cr.working() if isinstance(s, Table) and "Factored line load" in s.columns)
    # 1.2 × 2 + 1.6 × 3 = 7.2 kN/m
    assert t.rows[1][1] == "1.2(2.00 kN/m) + 1.6(3.00 kN/m) = 7.20 kN/m"


def test_en1990_and_asnzs_sets_on_a_beam():
    from calcpack.combinations import asnzs1170_strength

    r = solve_cases(_beam(("G", "Q", "W")))
    cr = analyse_combinations(r, en1990_combinations(variable={"Q": "B", "W": "wind"}))
    env = cr.envelope()
    # w = 2, 3, 4 kN/m for G, Q, W: 6.10 with Q leading 1.35·2 + 1.5·3 + 0.9·4 = 10.8 kN/m;
    # W leading 1.35·2 + 1.5·4 + 1.05·3 = 11.85 kN/m governs; M = wL²/8 on 4 m
    assert env["M_max"].combination == "6.10 (W leading): 1.35G + 1.5W + 1.05Q"
    assert env["M_max"].value.to("kN*m").magnitude == pytest.approx(11.85 * 2, rel=1e-9)
    rz = solve_cases(_beam(("G", "Q", "Wu")))
    cz = analyse_combinations(rz, asnzs1170_strength("office"))
    assert cz.envelope()["M_max"].combination.startswith(
        "d"
    )  # 1.2G + Wu + 0.4Q = 7.6 kN/m > 1.2G + 1.5Q = 6.9 kN/m


def test_envelope_of_truss_member_forces():
    from calcpack.analysis.truss_model import JointLoad, Truss
    from calcpack.analysis.truss_solve import solve_truss_cases

    truss = Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (4 * m, 0 * m), "C": (2 * m, 2 * m)},
        members=[("A", "B"), ("A", "C"), ("B", "C")],
        supports={"A": "pin", "B": "roller"},
        loads=[JointLoad("C", Fy=-10 * kN, case="D"), JointLoad("C", Fy=8 * kN, case="W")],
    )
    r = solve_truss_cases(truss)
    env = analyse_combinations(r, asce7_strength()).envelope()
    # symmetric 45° truss: N_AC = -P/√2 per unit downward P at C (method of joints)
    down = r["D"].force("AC").to("kN").magnitude  # compression under D
    assert env["N_AC,min"].value.to("kN").magnitude == pytest.approx(1.4 * down, rel=1e-9)
    assert env["N_AC,min"].combination.startswith("1")
    up = 0.9 * down + r["W"].force("AC").to("kN").magnitude
    assert env["N_AC,max"].value.to("kN").magnitude == pytest.approx(up, rel=1e-9)
    assert env["N_AC,max"].combination.startswith("5")


def test_pattern_combinations_are_named_by_the_spans_they_load():
    """A pattern of span loads reads "L on spans 1, 3" in the combination's name, so a checker
    sees which spans carry the live load without decoding case names."""
    pbeam, groups = pattern_cases(_beam(spans=3), "L")
    names = list(analyse_combinations(solve_cases(pbeam), asce7_strength(), groups=groups).results)
    assert "2a: 1.2D + 1.6L#1 + 1.6L#3 [L on spans 1, 3]" in names
    assert "2a: 1.2D + 1.6L#2 [L on span 2]" in names
    assert not any("L: L#" in n for n in names)
