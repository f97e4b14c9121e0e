"""ANSI/AISC 360-16 §E5: single-angle compression members (check_aisc_angle_strut).

No published worked example of §E5 is in the project's published-values reference; the
reference is the Specification's equations, recalled ("from memory") and evaluated by hand here
on the tabulated properties of the AISC Shapes Database v16.0 (A, r_x, r_y, r_z and the legs,
read from the shipped table):

* (E5-1) L_c/r = 72 + 0.75 L/r_a (L/r_a ≤ 80); (E5-2) 32 + 1.25 L/r_a;
  (E5-3) 60 + 0.8 L/r_a (L/r_a ≤ 75); (E5-4) 45 + L/r_a;
* unequal legs connected through the short leg: + 4[(b_l/b_s)² − 1], not less than 0.95 L/r_z
  (planar) or 0.82 L/r_z (box);
* then (E3-4), (E3-2)/(E3-3) and (E3-1) with φ_c = 0.90, Ω_c = 1.67.

Tolerance 1e-6 relative: the same equations on the same tabulated values.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aisc360.compression_angle import AngleStrut, check_aisc_angle_strut
from calcpack.sections.aisc_database import aisc_shape
from calcpack.units import Q_

E, FY = 29000.0, 36.0


def _pn_hand(shape, L_in, leg, arrangement):
    s = aisc_shape(shape)
    A = s["A"].to("inch**2").magnitude
    rx, ry, rz = (s[k].to("inch").magnitude for k in ("rx", "ry", "rz"))
    d, b = s["d"].to("inch").magnitude, s["b"].to("inch").magnitude
    ra = ry if leg == "long" else rx  # the long leg d lies along y in the table's axes
    x = L_in / ra
    if arrangement == "planar":
        lc = 72 + 0.75 * x if x <= 80 else 32 + 1.25 * x
    else:
        lc = 60 + 0.8 * x if x <= 75 else 45 + x
    if leg == "short" and d != b:
        floor = 0.95 if arrangement == "planar" else 0.82
        lc = max(lc + 4 * ((d / b) ** 2 - 1), floor * L_in / rz)
    fe = math.pi**2 * E / lc**2
    fcr = 0.658 ** (FY / fe) * FY if FY / fe <= 2.25 else 0.877 * fe
    return fcr * A


@pytest.mark.parametrize(
    ("shape", "L_ft", "leg", "arrangement"),
    [
        ("L4X3X3/8", 3, "long", "planar"),  # L/r_a ≤ 80: Eq. (E5-1)
        ("L4X3X3/8", 8, "long", "planar"),  # L/r_a > 80: Eq. (E5-2)
        ("L4X3X3/8", 6, "short", "planar"),  # short leg: + 4[(b_l/b_s)² − 1]
        ("L4X3X3/8", 6, "short", "box"),  # Eq. (E5-3) with the 0.82 L/r_z floor
        ("L3X3X3/8", 9, "long", "box"),  # L/r_a > 75: Eq. (E5-4)
    ],
)
def test_e5_effective_slenderness_and_strength(shape, L_ft, leg, arrangement):
    strut = AngleStrut(
        aisc_shape(shape),
        Fy=Q_(FY, "ksi"),
        L=Q_(L_ft, "ft"),
        P=Q_(1, "kip"),
        connected_leg=leg,
        arrangement=arrangement,
    )
    for method, k in (("LRFD", 0.90), ("ASD", 1 / 1.67)):
        got = check_aisc_angle_strut(strut, method=method)["Compression"].capacity
        expected = k * _pn_hand(shape, L_ft * 12.0, leg, arrangement)
        assert got.to("kip").magnitude == pytest.approx(expected, rel=1e-6)
