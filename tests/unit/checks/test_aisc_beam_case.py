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
