"""ANSI/AISC 360-16 §J7 (bearing strength) and Appendix 6.3.2 (torsional bracing of beams).

No published worked example of these clauses is in the project's published-values reference,
so the reference is the Specification's equations evaluated by hand here, with the equations
themselves recalled from AISC 360-16 ("from memory"):

* Eq. (J7-1) R_n = 1.8 F_y A_pb; (J7-2) R_n = 1.2 (F_y − 13) l_b d/20, d ≤ 25 in.;
  (J7-3) R_n = 6.0 (F_y − 13) l_b √d/20, d > 25 in. (ksi, in.); φ = 0.75, Ω = 2.00;
* Eq. (A-6-9) M_br = 0.02 M_r; (A-6-11) β_T = 3.6 L M_r²/(φ n E I_y C_b²) [Ω = 3.00 for ASD];
  (A-6-12) β_sec = (3.3E/h_o)(1.5 h_o t_w³/12 + t_s b_s³/12); (A-6-10) β_Tbr = β_T/(1 − β_T/β_sec);
  (A-6-14) β_sec = 3.3 E t_w³/(12 h_o) for continuous bracing.

W18X50 properties from the AISC Shapes Database v16.0 (I_y = 40.1 in⁴, t_w = 0.355 in.,
h_o = 17.4 in.). Tolerance: 1e-9 relative (the same arithmetic, exact).
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aisc360.bearing_j7 import BearingSurface, check_aisc_bearing
from calcpack.checks.aisc360.bracing_torsional import (
    TorsionalBraceCase,
    check_aisc_torsional_bracing,
)
from calcpack.sections.aisc_database import aisc_shape
from calcpack.units import Q_


@pytest.mark.parametrize(("method", "factor"), [("LRFD", 0.75), ("ASD", 1 / 2.00)])
def test_j7_1_pin_in_a_reamed_hole(method, factor):
    # 1 in. pin through a 1/2 in. A36 plate: A_pb = 0.5 in², R_n = 1.8(36)(0.5) = 32.4 kips
    s = BearingSurface("pin", Fy=Q_(36, "ksi"), R=Q_(10, "kip"), Apb=Q_(0.5, "inch**2"))
    got = check_aisc_bearing(s, method=method)["Bearing"].capacity.to("kip").magnitude
    assert got == pytest.approx(factor * 32.4, rel=1e-9)


@pytest.mark.parametrize(
    ("d", "expected"),
    [
        (6.0, 1.2 * (36 - 13) * 8 * 6 / 20),  # Eq. (J7-2), d ≤ 25 in.
        (25.0, 1.2 * (36 - 13) * 8 * 25 / 20),  # Eq. (J7-2) at the limit
        (30.0, 6.0 * (36 - 13) * 8 * math.sqrt(30) / 20),  # Eq. (J7-3), d > 25 in.
    ],
)
def test_j7_2_and_j7_3_expansion_rollers(d, expected):
    s = BearingSurface(
        "roller", Fy=Q_(36, "ksi"), R=Q_(10, "kip"), d=Q_(d, "inch"), lb=Q_(8, "inch")
    )
    got = check_aisc_bearing(s)["Bearing"].capacity.to("kip").magnitude
    assert got == pytest.approx(0.75 * expected, rel=1e-9)


def test_j7_rollers_in_si_units_agree_with_us_units():
    us = BearingSurface(
        "rocker", Fy=Q_(50, "ksi"), R=Q_(10, "kip"), d=Q_(30, "inch"), lb=Q_(10, "inch")
    )
    si = BearingSurface(
        "rocker", Fy=Q_(50, "ksi").to("MPa"), R=Q_(44.48, "kN"), d=Q_(762, "mm"), lb=Q_(254, "mm")
    )
    a = check_aisc_bearing(us)["Bearing"].capacity.to("kN").magnitude
    b = check_aisc_bearing(si)["Bearing"].capacity.to("kN").magnitude
    assert a == pytest.approx(b, rel=1e-9)


def _w18x50_point(method, **kw):
    case = TorsionalBraceCase(
        aisc_shape("W18X50"),
        "point",
        Mr=Q_(250, "kip*ft"),
        Cb=1.1,
        L=Q_(30, "ft"),
        n=2,
        **kw,
    )
    return check_aisc_torsional_bracing(case, method=method)


@pytest.mark.parametrize(("method", "k"), [("LRFD", 1 / 0.75), ("ASD", 3.00)])
def test_a6_point_torsional_bracing_with_a_stiffener(method, k):
    E, Iy, tw, ho = 29000.0, 40.1, 0.355, 17.4
    L, n, Mr, Cb, ts, bs = 360.0, 2, 3000.0, 1.1, 0.375, 6.0
    beta_T = k * 3.6 * L * Mr**2 / (n * E * Iy * Cb**2)  # kip·in/rad, Eq. (A-6-11)
    beta_sec = 3.3 * E / ho * (1.5 * ho * tw**3 / 12 + ts * bs**3 / 12)  # Eq. (A-6-12)
    beta_br = beta_T / (1 - beta_T / beta_sec)  # Eq. (A-6-10)
    r = _w18x50_point(
        method,
        ts=Q_(ts, "inch"),
        bs=Q_(bs, "inch"),
        brace_strength=Q_(100, "kip*inch"),
        brace_stiffness=Q_(1e5, "kip*inch"),
    )
    assert r["Brace stiffness"].demand.to("kip*inch").magnitude == pytest.approx(beta_br)
    assert r["Web distortional stiffness"].capacity.to("kip*inch").magnitude == pytest.approx(
        beta_sec
    )
    # Eq. (A-6-9): 0.02 M_r = 60 kip·in
    assert r["Brace strength"].demand.to("kip*inch").magnitude == pytest.approx(60.0)


def test_a6_unstiffened_web_too_flexible_is_not_ok_and_says_stiffen():
    r = _w18x50_point("LRFD")
    web = r["Web distortional stiffness"]
    assert web.verdict == "NOT OK"
    # β_sec = 3.3E(1.5 t_w³/12) with no stiffener, Eq. (A-6-12)
    assert web.capacity.to("kip*inch").magnitude == pytest.approx(3.3 * 29000 * 1.5 * 0.355**3 / 12)
    assert "stiffeners" in r["Brace stiffness"].description


def test_a6_continuous_torsional_bracing_per_unit_length():
    case = TorsionalBraceCase(aisc_shape("W18X50"), "continuous", Mr=Q_(100, "kip*ft"), Cb=1.0)
    r = check_aisc_torsional_bracing(case)
    # Eq. (A-6-14): β_sec = 3.3E t_w³/(12 h_o), kip·in/rad per in.
    sec = 3.3 * 29000 * 0.355**3 / (12 * 17.4)
    assert r["Web distortional stiffness"].capacity.to("kip").magnitude == pytest.approx(sec)
    beta_T = 3.6 * 1200.0**2 / (0.75 * 29000 * 40.1)  # Eq. (A-6-11) with L/n = 1.0
    assert r["Web distortional stiffness"].demand.to("kip").magnitude == pytest.approx(beta_T)
    assert r["Brace strength"].verdict == "NOT COVERED"
