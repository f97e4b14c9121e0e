"""Closed-form beam-table results.

Sources (values recalled from memory, not read from the page; they are the standard cases
every edition carries):
* AISC Steel Construction Manual, 15th ed. (2017), Part 3, Table 3-23 "Shears, Moments and
  Deflections" (the beam diagrams and formulas), cases named by their titles: simple beam --
  uniformly distributed load; simple beam -- concentrated load at center; cantilever beam --
  uniformly distributed load; cantilever beam -- concentrated load at free end; beam fixed at
  one end, supported at other -- uniformly distributed load; beam fixed at both ends --
  uniformly distributed load; continuous beam -- two equal spans -- uniform load on both spans.
* W. C. Young, R. G. Budynas, A. M. Sadegh, Roark's Formulas for Stress and Strain, 8th ed.
  (2012), Table 8.1, case 2 (uniformly distributed load) with the end conditions of each test
  -- the same closed forms, a second source for the propped and fixed-fixed cases.
Case numbers are not quoted because they were not checked against the printed page.

The closed forms are exact; calcpack agrees to round-off, so 1e-9 relative is asked.
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Fixed, Pin, Roller, solve_beam
from calcpack.loads import PointLoad, UniformLoad
from calcpack.units import Q_, ureg

RTOL = 1e-9  # exact closed forms vs float arithmetic
m = ureg.m
L = Q_(7.5, "m")
w = Q_(14.0, "kN/m")
P = Q_(36.0, "kN")
EI = Q_(200e3, "MPa") * Q_(250e6, "mm**4")


def approx(q, unit):
    return pytest.approx(q.to(unit).magnitude, rel=RTOL)


def test_simple_span_uniform_load():  # AISC Table 3-23, simple beam, uniform load
    r = solve_beam(
        Beam(length=L, supports=[Pin(0 * m), Roller(L)], loads=[UniformLoad(w=w)], EI=EI)
    )
    assert r.reaction("A").Fy.to("kN").magnitude == approx(w * L / 2, "kN")  # R = wL/2
    assert r.extremes.M_max.value.to("kN*m").magnitude == approx(w * L**2 / 8, "kN*m")
    assert r.extremes.M_max.x.to("m").magnitude == pytest.approx(3.75, rel=RTOL)
    d = r.extremes.deflection_down.value
    assert d.to("mm").magnitude == approx(5 * w * L**4 / (384 * EI), "mm")  # 5wL⁴/384EI


def test_simple_span_central_point_load():  # AISC Table 3-23, simple beam, central point load
    beam = Beam(length=L, supports=[Pin(0 * m), Roller(L)], loads=[PointLoad(x=L / 2, P=P)], EI=EI)
    r = solve_beam(beam)
    assert r.extremes.M_max.value.to("kN*m").magnitude == approx(P * L / 4, "kN*m")  # PL/4
    d = r.extremes.deflection_down.value
    assert d.to("mm").magnitude == approx(P * L**3 / (48 * EI), "mm")  # PL³/48EI
    assert r.shear(L / 2, side="left").to("kN").magnitude == approx(P / 2, "kN")
    assert r.shear(L / 2, side="right").to("kN").magnitude == approx(-P / 2, "kN")


def test_cantilever_uniform_load():  # AISC Table 3-23, cantilever, uniform load
    r = solve_beam(Beam(length=L, supports=[Fixed(0 * m)], loads=[UniformLoad(w=w)], EI=EI))
    assert r.reaction("A").Fy.to("kN").magnitude == approx(w * L, "kN")
    # fixed-end moment wL²/2, hogging
    assert r.extremes.M_min.value.to("kN*m").magnitude == approx(-w * L**2 / 2, "kN*m")
    d = r.deflection(L)
    assert d.to("mm").magnitude == approx(w * L**4 / (8 * EI), "mm")  # wL⁴/8EI at the free end


def test_cantilever_tip_point_load():  # AISC Table 3-23, cantilever, point load at free end
    r = solve_beam(Beam(length=L, supports=[Fixed(0 * m)], loads=[PointLoad(x=L, P=P)], EI=EI))
    assert r.moment(0 * m).to("kN*m").magnitude == approx(-P * L, "kN*m")  # PL hogging
    assert r.deflection(L).to("mm").magnitude == approx(P * L**3 / (3 * EI), "mm")  # PL³/3EI
    assert r.slope(L).to("rad").magnitude == approx(-P * L**2 / (2 * EI), "")  # PL²/2EI, cw


def test_propped_cantilever_uniform_load():  # AISC 3-23 fixed/supported; Roark 8.1 case 2
    beam = Beam(length=L, supports=[Fixed(0 * m), Roller(L)], loads=[UniformLoad(w=w)], EI=EI)
    r = solve_beam(beam)
    assert r.reaction("B").Fy.to("kN").magnitude == approx(3 * w * L / 8, "kN")  # 3wL/8
    assert r.reaction("A").Fy.to("kN").magnitude == approx(5 * w * L / 8, "kN")  # 5wL/8
    assert r.moment(0 * m).to("kN*m").magnitude == approx(-w * L**2 / 8, "kN*m")  # wL²/8
    assert r.extremes.M_max.value.to("kN*m").magnitude == approx(9 * w * L**2 / 128, "kN*m")
    assert r.extremes.M_max.x.to("m").magnitude == pytest.approx(5 / 8 * 7.5, rel=RTOL)  # 5L/8
    # max deflection wL⁴/185EI at 0.4215L (AISC, rounded in the table; exact: 1/184.6)
    assert r.extremes.deflection_down.value.to("mm").magnitude == pytest.approx(
        (w * L**4 / (185 * EI)).to("mm").magnitude, rel=3e-3
    )  # tolerance: the table's 185 is a rounded coefficient


def test_two_equal_spans_uniform_load():  # AISC Table 3-23, two equal spans, uniform load
    beam = Beam(
        length=2 * L,
        supports=[Pin(0 * m), Roller(L), Roller(2 * L)],
        loads=[UniformLoad(w=w)],
        EI=EI,
    )
    r = solve_beam(beam)
    assert r.reaction("B").Fy.to("kN").magnitude == approx(1.25 * w * L, "kN")  # 1.25wL
    assert r.reaction("A").Fy.to("kN").magnitude == approx(3 * w * L / 8, "kN")  # 3wL/8
    assert r.moment(L).to("kN*m").magnitude == approx(-w * L**2 / 8, "kN*m")  # wL²/8 support


def test_fixed_fixed_uniform_load():  # AISC 3-23 fixed both ends; Roark 8.1 case 2
    beam = Beam(length=L, supports=[Fixed(0 * m), Fixed(L)], loads=[UniformLoad(w=w)], EI=EI)
    r = solve_beam(beam)
    assert r.moment(0 * m).to("kN*m").magnitude == approx(-w * L**2 / 12, "kN*m")  # wL²/12
    assert r.moment(L).to("kN*m").magnitude == approx(-w * L**2 / 12, "kN*m")
    assert r.moment(L / 2).to("kN*m").magnitude == approx(w * L**2 / 24, "kN*m")  # wL²/24
    d = r.extremes.deflection_down.value
    assert d.to("mm").magnitude == approx(w * L**4 / (384 * EI), "mm")  # wL⁴/384EI
