"""The AISC beam check's inputs as data: a BeamCase with a direct or combined demand gives the
same result as the keyword form; the factors are those declared once in FACTORS; C_b is one
formula."""

from __future__ import annotations

import dataclasses

import pytest

from calcpack.checks.aisc360 import (
    BeamCase,
    DirectDemand,
    check_aisc_beam,
    check_beam_case,
    member_data,
)
from calcpack.checks.aisc360.beam_clauses import cb_formula
from calcpack.errors import InputError
from calcpack.units import ureg
from tests.validation.aisc_shapes_v15 import W18X50

ft, ksi, kip = ureg.ft, ureg.ksi, ureg.kip


def test_a_case_and_the_keywords_agree() -> None:
    case = BeamCase(
        W18X50, 50 * ksi, DirectDemand(Mu=200 * kip * ft, Vu=50 * kip, Lb=10 * ft, Cb=1.1)
    )
    a = check_beam_case(case)
    b = check_aisc_beam(W18X50, Fy=50 * ksi, Mu=200 * kip * ft, Vu=50 * kip, Lb=10 * ft, Cb=1.1)
    assert [(r.name, r.utilisation) for r in a.results] == [
        (r.name, r.utilisation) for r in b.results
    ]


@pytest.mark.parametrize("method", ["LRFD", "ASD"])
def test_the_declared_factors_are_the_ones_used(
    method: str, monkeypatch: pytest.MonkeyPatch
) -> None:
    case = BeamCase(
        W18X50, 50 * ksi, DirectDemand(Mu=200 * kip * ft, Vu=50 * kip, Lb=10 * ft, Cb=1.0),
        method=method,
    )  # fmt: skip
    before = check_beam_case(case)
    changed = dict(member_data.FACTORS)
    changed["flexure"] = dataclasses.replace(changed["flexure"], phi=0.45, omega=3.34)
    changed["shear rolled I"] = dataclasses.replace(changed["shear rolled I"], phi=0.5, omega=3.0)
    monkeypatch.setattr("calcpack.checks.aisc360.beam_clauses.FACTORS", changed)
    after = check_beam_case(case)
    for name in ("Flexure", "Shear"):
        # halving φ (doubling Ω) halves the strength, on the sheet and in the numbers alike
        assert after[name].capacity.magnitude == pytest.approx(before[name].capacity.magnitude / 2)


def test_cb_is_one_formula_for_numbers_and_the_sheet() -> None:
    # uniform load on a simple span, whole span unbraced: M_A = M_C = 0.75 M_max, M_B = M_max
    # 12.5/11 = 1.136, printed 1.14 in AISC Manual Table 3-1 (from memory)
    assert cb_formula(1.0, 0.75, 1.0, 0.75) == pytest.approx(12.5 / 11.0)


@pytest.mark.parametrize("Cb", [0.9, 3.5, "1.2"])
def test_cb_outside_its_range_is_refused_naming_it(Cb: object) -> None:
    with pytest.raises(InputError) as info:
        check_aisc_beam(W18X50, Fy=50 * ksi, Mu=100 * kip * ft, Lb=10 * ft, Cb=Cb)  # type: ignore[arg-type]
    assert info.value.name == "Cb"


def _two_span_strength():  # type: ignore[no-untyped-def]
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.combinations import analyse_combinations, asce7_strength
    from calcpack.loads.types import UniformLoad

    beam = Beam(
        length=40 * ft,
        supports=[Pin(0 * ft, name="A"), Roller(20 * ft, name="B"), Roller(40 * ft, name="C")],
        loads=[UniformLoad(w=0.6 * kip / ft, case="D"), UniformLoad(w=0.9 * kip / ft, case="L")],
        EI=29000 * ksi * 800 * ureg.inch**4,
        name="B4",
    )
    return analyse_combinations(solve_cases(beam), asce7_strength())


@pytest.mark.parametrize("continuous", [False, True])
def test_a_prepared_demand_checks_as_the_results_it_was_read_from(continuous: bool) -> None:
    from calcpack.checks.aisc360 import CombinedDemand, prepare_demand

    demand = CombinedDemand(_two_span_strength(), (7 * ft, 14 * ft, 27 * ft))
    prepared = prepare_demand(demand, continuous_bracing=continuous)
    direct = check_beam_case(BeamCase(W18X50, 50 * ksi, demand, continuous_bracing=continuous))
    via = check_beam_case(BeamCase(W18X50, 50 * ksi, prepared, continuous_bracing=continuous))
    assert [(r.name, r.combination, r.utilisation, r.verdict) for r in via.results] == [
        (r.name, r.combination, r.utilisation, r.verdict) for r in direct.results
    ]
    # the working shows the same lines (the demands are results of the analysis in both)
    assert [s.text() for s in via.working()] == [s.text() for s in direct.working()]


def test_a_prepared_demand_read_for_another_method_or_bracing_is_refused() -> None:
    from calcpack.checks.aisc360 import CombinedDemand, prepare_demand

    prepared = prepare_demand(CombinedDemand(_two_span_strength(), (10 * ft,)))
    with pytest.raises(InputError, match=r"method = 'LRFD'.*method = 'ASD'"):
        check_beam_case(BeamCase(W18X50, 50 * ksi, prepared, method="ASD"))
    with pytest.raises(InputError, match="continuous_bracing"):
        check_beam_case(BeamCase(W18X50, 50 * ksi, prepared, continuous_bracing=True))
    with pytest.raises(InputError, match=r"braces\[0\]"):
        prepare_demand(CombinedDemand(_two_span_strength(), (50 * ft,)))
