"""Exact extremes of V, M and δ on a range of the beam, against beam-table closed forms.

References (common practice: the standard beam-table cases of any structural handbook):
simple span under uniform w, M = wx(L − x)/2 with M_max = wL²/8 at L/2 and
δ_max = 5wL⁴/(384EI) at L/2; propped cantilever under uniform w, M_max = 9wL²/128 at 3L/8 from
the prop and M = −wL²/8 at the fixed end; simple span under a central point load P, V = ±P/2.
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Fixed, Pin, Roller, solve_beam
from calcpack.checks.demand import max_abs, segment_moments
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads import PointLoad, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN
w, L = 12.0, 7.0  # kN/m, m
EI = Q_(30e3, "kN*m**2")
SIMPLE = solve_beam(
    Beam(length=L * m, supports=[Pin(0 * m), Roller(L * m)], EI=EI, loads=[UniformLoad(w * kN / m)])
)
PROPPED = solve_beam(
    Beam(
        length=L * m, supports=[Fixed(0 * m), Roller(L * m)], EI=EI, loads=[UniformLoad(w * kN / m)]
    )
)
REL = 1e-12  # exact to round-off


def test_simple_span_moment_and_deflection() -> None:
    M = SIMPLE.range_extremes("moment")
    assert M.largest.value.to("kN*m").magnitude == pytest.approx(w * L**2 / 8, rel=REL)
    assert M.largest.x.to("m").magnitude == pytest.approx(L / 2, rel=1e-9)
    d = SIMPLE.range_extremes("deflection").magnitude
    EI_kNm2 = EI.to("kN*m**2").magnitude
    assert d.value.to("m").magnitude == pytest.approx(5 * w * L**4 / (384 * EI_kNm2), rel=1e-10)
    assert d.x.to("m").magnitude == pytest.approx(L / 2, rel=1e-7)


def test_propped_cantilever_sagging_peak_at_three_eighths_from_the_prop() -> None:
    M = PROPPED.range_extremes("moment")
    assert M.largest.value.to("kN*m").magnitude == pytest.approx(9 * w * L**2 / 128, rel=REL)
    assert M.largest.x.to("m").magnitude == pytest.approx(L - 3 * L / 8, rel=1e-9)
    assert M.smallest.value.to("kN*m").magnitude == pytest.approx(-w * L**2 / 8, rel=REL)
    assert M.magnitude is M.smallest  # the hogging moment at the wall governs


def test_a_sub_range_takes_its_ends_and_its_own_turning_points() -> None:
    # 0 .. L/4 of the simple span: M rises to M(L/4) = w(L/4)(3L/4)/2 = 3wL²/32 at the end
    M = SIMPLE.range_extremes("moment", 0 * m, L / 4 * m)
    assert M.largest.value.to("kN*m").magnitude == pytest.approx(3 * w * L**2 / 32, rel=REL)
    assert M.largest.x.to("m").magnitude == pytest.approx(L / 4, rel=REL)
    assert M.largest.side == ""
    # L/4 .. 3L/4 holds the turning point: wL²/8 at L/2, smallest at both ends 3wL²/32
    M = SIMPLE.range_extremes("moment", L / 4 * m, 3 * L / 4 * m)
    assert M.largest.value.to("kN*m").magnitude == pytest.approx(w * L**2 / 8, rel=REL)
    assert M.smallest.value.to("kN*m").magnitude == pytest.approx(3 * w * L**2 / 32, rel=REL)
    # the propped cantilever's segment 0 .. L/2 includes the wall: |M| = wL²/8 there
    M_abs, x = max_abs(PROPPED, "moment", 0.0, L / 2)
    assert M_abs.to("kN*m").magnitude == pytest.approx(w * L**2 / 8, rel=REL)
    assert x.to("m").magnitude == pytest.approx(0.0, abs=1e-12)


def test_shear_on_both_sides_of_a_point_load_inside_the_range() -> None:
    r = solve_beam(
        Beam(length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], loads=[PointLoad(3 * m, 10 * kN)])
    )
    V = r.range_extremes("shear", 2 * m, 4 * m)
    assert V.largest.value.to("kN").magnitude == pytest.approx(5.0, rel=REL)  # P/2
    assert V.smallest.value.to("kN").magnitude == pytest.approx(-5.0, rel=REL)
    assert {V.largest.side, V.smallest.side} <= {"", "left", "right"}
    # a range starting at the load takes the value just right of it
    V = r.range_extremes("shear", 3 * m, 6 * m)
    assert V.largest.value.to("kN").magnitude == pytest.approx(-5.0, rel=REL)


def test_segment_moments_for_cb_are_exact() -> None:
    sm = segment_moments(SIMPLE, 0.0, L)
    assert sm.M_max.to("kN*m").magnitude == pytest.approx(w * L**2 / 8, rel=REL)
    # quarter point of a uniformly loaded simple span: 3wL²/32 (M = wx(L − x)/2)
    assert sm.M_A.to("kN*m").magnitude == pytest.approx(3 * w * L**2 / 32, rel=REL)


@pytest.mark.parametrize(
    ("a", "b", "name"),
    [(-1.0, 2.0, "a"), (3.0, 2.0, "b"), (0.0, L + 1.0, "b")],
)
def test_a_range_off_the_beam_is_refused_naming_the_end(a: float, b: float, name: str) -> None:
    with pytest.raises(InputError) as err:
        SIMPLE.range_extremes("moment", a * m, b * m)
    assert err.value.name == name
    assert f"{name} " in str(err.value)


def test_unknown_quantity_and_missing_stiffness_are_refused() -> None:
    with pytest.raises(InputError, match="what"):
        SIMPLE.range_extremes("torsion")  # type: ignore[arg-type]
    no_ei = solve_beam(
        Beam(length=4 * m, supports=[Pin(0 * m), Roller(4 * m)], loads=[UniformLoad(2 * kN / m)])
    )
    with pytest.raises(OutOfScopeError, match="EI"):
        no_ei.range_extremes("deflection")
