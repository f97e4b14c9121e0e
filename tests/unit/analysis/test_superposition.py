"""Superposition is written once: the beam's ``combine``, the truss's ``combine_results`` and
the combination sets' ``superpose`` all sum Σ factor × case result by the same function.

The expected sums are plain floating-point arithmetic on the inputs (the principle of
superposition for a linear analysis, common practice)."""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.analysis.beam import Beam, Pin, Roller, combine, solve_cases
from calcpack.analysis.superposition import superpose
from calcpack.combinations import superpose as combinations_superpose
from calcpack.errors import InputError
from calcpack.loads import UniformLoad
from calcpack.units import Q_


def test_one_home_for_the_factored_sum() -> None:
    assert combinations_superpose is superpose
    beam = Beam(
        length=Q_(6, "m"),
        supports=[Pin(Q_(0, "m")), Roller(Q_(6, "m"))],
        EI=Q_(20_000, "kN*m**2"),
        loads=[UniformLoad(w=Q_(4, "kN/m"), case="D"), UniformLoad(w=Q_(3, "kN/m"), case="L")],
    )
    cases = solve_cases(beam)
    a = combine(cases, {"D": 1.2, "L": 1.6})
    b = superpose(cases, {"D": 1.2, "L": 1.6})
    # wL/2 at each support of a simple span
    expected = (1.2 * 4 + 1.6 * 3) * 6 / 2
    for r in (a, b):
        assert r.reaction("A").Fy.to("kN").magnitude == pytest.approx(expected, rel=1e-12)


def test_mappings_combine_key_by_key_and_a_missing_case_is_named() -> None:
    results = {
        "D": {"N_AB": Q_(-10.0, "kN")},
        "W": {"N_AB": Q_(4.0, "kN"), "N_BC": Q_(2.0, "kN")},
    }
    total = superpose(results, {"D": 0.9, "W": 1.5})
    assert total["N_AB"].to("kN").magnitude == pytest.approx(0.9 * -10.0 + 1.5 * 4.0)
    assert total["N_BC"].to("kN").magnitude == pytest.approx(1.5 * 2.0)  # absent from D: zero
    with pytest.raises(InputError, match="'S' in the factors has no result") as err:
        superpose(results, {"D": 1.0, "S": 1.5})
    assert err.value.name == "factors['S']"
    with pytest.raises(InputError, match="factors"):
        superpose(results, {})


_FACTOR = st.floats(min_value=-3.0, max_value=3.0, allow_nan=False)
_VALUE = st.floats(min_value=-1e3, max_value=1e3, allow_nan=False)


@given(st.lists(st.tuples(_FACTOR, _VALUE), min_size=1, max_size=6))
def test_the_sum_is_linear_in_the_factors(terms: list[tuple[float, float]]) -> None:
    results = {f"C{i}": Q_(v, "kN") for i, (_, v) in enumerate(terms)}
    factors = {f"C{i}": f for i, (f, _) in enumerate(terms)}
    total = superpose(results, factors).to("kN").magnitude
    assert total == pytest.approx(sum(f * v for f, v in terms), abs=1e-9)
    doubled = superpose(results, {k: 2 * f for k, f in factors.items()}).to("kN").magnitude
    assert doubled == pytest.approx(2 * total, abs=1e-9)
