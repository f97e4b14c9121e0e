"""ASCE/SEI 7-16 §4.7.2 (Eq. 4.7-1) and §4.8.2 (Eq. 4.8-1 to 4.8-3): live load reduction.

Source: ASCE/SEI 7-16, Minimum Design Loads and Associated Criteria for Buildings and Other
Structures, Chapter 4 (from memory: the equations, their limits and Table 4.7-1 as recalled;
confirm against the printed standard). Each expected value below is hand arithmetic on the
printed equation, written out beside the assertion, never calcpack's output.
"""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.live_asce7 import floor_live_reduction_asce7, roof_live_reduction_asce7
from calcpack.units import Q_


def test_interior_beam_at_the_threshold_is_permitted_with_factor_one() -> None:
    # K_LL = 2 (interior beam, Table 4.7-1), A_T = 200 ft²: K_LL A_T = 400 ft², reduction
    # permitted; 0.25 + 15/√400 = 1.00
    r = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=2, member="interior beam",
                                   A_T=Q_(200, "ft**2"))  # fmt: skip
    assert r.permitted
    assert r.factor == pytest.approx(1.0, rel=1e-12)
    assert r.reduced.to("psf").magnitude == pytest.approx(40.0, rel=1e-12)


def test_below_the_influence_area_no_reduction() -> None:
    r = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=2, member="interior beam",
                                   A_T=Q_(150, "ft**2"))  # fmt: skip
    assert not r.permitted
    assert r.reduced.to("psf").magnitude == pytest.approx(40.0, rel=1e-12)


def test_interior_column_eq_4_7_1() -> None:
    # K_LL = 4, A_T = 900 ft²: 0.25 + 15/√3600 = 0.50 (the one-floor limit, exactly)
    r = floor_live_reduction_asce7(Q_(50, "psf"), K_LL=4, member="interior column",
                                   A_T=Q_(900, "ft**2"))  # fmt: skip
    assert r.reduced.to("psf").magnitude == pytest.approx(25.0, rel=1e-12)
    # K_LL = 4, A_T = 400 ft²: 0.25 + 15/40 = 0.625
    r = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=4, member="interior column",
                                   A_T=Q_(400, "ft**2"))  # fmt: skip
    assert r.factor == pytest.approx(0.625, rel=1e-12)


def test_lower_limits_one_floor_and_two_floors() -> None:
    # K_LL A_T = 10 000 ft²: 0.25 + 0.15 = 0.40 -> 0.50 for one floor, 0.40 for two or more
    one = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=4, member="interior column",
                                     A_T=Q_(2500, "ft**2"))  # fmt: skip
    two = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=4, member="interior column",
                                     A_T=Q_(2500, "ft**2"), floors_supported=2)  # fmt: skip
    assert one.factor == pytest.approx(0.50, rel=1e-12)
    assert two.factor == pytest.approx(0.40, rel=1e-12)


def test_si_form_agrees_with_us_form() -> None:
    # 4.57/√(K_LL A_T) with A_T in m² is the SI form of 15/√(K_LL A_T) in ft² (rounded
    # coefficient: 15 ft x 0.3048 = 4.572 m, so they agree to 0.05 %)
    us = floor_live_reduction_asce7(Q_(40, "psf"), K_LL=4, member="interior column",
                                    A_T=Q_(600, "ft**2"))  # fmt: skip
    si = floor_live_reduction_asce7(Q_(40, "psf").to("kN/m**2"), K_LL=4,
                                    member="interior column",
                                    A_T=Q_(600, "ft**2").to("m**2"))  # fmt: skip
    assert si.factor == pytest.approx(us.factor, rel=5e-4)
    assert us.factor == pytest.approx(0.25 + 15 / math.sqrt(2400), rel=1e-12)


def test_heavy_live_load_refused_and_bad_factor_named() -> None:
    with pytest.raises(OutOfScopeError, match=r"4\.7\.3"):
        floor_live_reduction_asce7(Q_(125, "psf"), K_LL=4, member="interior column",
                                   A_T=Q_(900, "ft**2"))  # fmt: skip
    with pytest.raises(InputError, match="K_LL"):
        floor_live_reduction_asce7(Q_(40, "psf"), K_LL=5, member="beam", A_T=Q_(900, "ft**2"))


@pytest.mark.parametrize(
    ("area", "rise", "expected"),
    [
        (90, 6, 20 * 1.0 * (1.2 - 0.05 * 6)),  # R1 = 1 (A_T ≤ 200), R2 = 1.2 - 0.05 F = 0.9
        (400, 3, 20 * (1.2 - 0.001 * 400) * 1.0),  # R1 = 0.8, R2 = 1 (F ≤ 4): 16 psf
        (800, 12, 12.0),  # 20 x 0.6 x 0.6 = 7.2 -> the 12 psf floor
        (150, 0, 20.0),  # flat, small area: unreduced
    ],
)
def test_roof_live_load_eq_4_8_1(area: float, rise: float, expected: float) -> None:
    r = roof_live_reduction_asce7(Q_(20, "psf"), A_T=Q_(area, "ft**2"), rise_per_foot=rise)
    assert r.reduced.to("psf").magnitude == pytest.approx(expected, rel=1e-12)


def test_working_names_the_equations() -> None:
    from calcpack.working import Sheet

    s = Sheet("t")
    floor_live_reduction_asce7(Q_(40, "psf"), K_LL=2, member="interior beam",
                               A_T=Q_(200, "ft**2")).add_to(s)  # fmt: skip
    roof_live_reduction_asce7(Q_(20, "psf"), A_T=Q_(400, "ft**2"), rise_per_foot=6).add_to(s)
    text = s.text_report()
    assert "4.7-1" in text
    assert "4.8-2" in text
