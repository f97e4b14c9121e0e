"""Invariants of the ASCE 7-16 wind formulas: q_z scales with V² (Eq. 26.10-1); C&C
coefficients are monotonic in effective area between the figures' limits (Figures 30.3-1,
30.3-2A)."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from calcpack.loads.wind_asce7 import WindSiteASCE7, velocity_pressure_asce7
from calcpack.loads.wind_asce7_lowrise import cc_coefficient_asce7
from calcpack.units import Q_


@given(
    st.floats(85.0, 200.0),
    st.floats(1.1, 1.4),
    st.floats(5.0, 60.0),
    st.sampled_from(["B", "C", "D"]),
)
def test_velocity_pressure_scales_with_v_squared(V: float, k: float, z: float, exp: str) -> None:
    q1 = velocity_pressure_asce7(WindSiteASCE7(Q_(V, "mph"), "map", exp), Q_(z, "ft")).qz  # type: ignore[arg-type]
    q2 = velocity_pressure_asce7(WindSiteASCE7(Q_(k * V, "mph"), "map", exp), Q_(z, "ft")).qz  # type: ignore[arg-type]
    assert math.isclose((q2 / q1).to("").magnitude, k * k, rel_tol=1e-9)


zones = st.sampled_from(
    [("wall", "4"), ("wall", "5"), ("roof", "1'"), ("roof", "1"), ("roof", "2"), ("roof", "3")]
)


@given(zones, st.floats(1.0, 5000.0), st.floats(1.0, 5000.0), st.floats(0.0, 7.0))
def test_cc_coefficients_fall_with_area(
    zone: tuple[str, str], a: float, b: float, th: float
) -> None:
    lo, hi = sorted((a, b))
    p_lo, n_lo = cc_coefficient_asce7(zone[0], zone[1], Q_(lo, "ft^2"), Q_(th, "deg"))
    p_hi, n_hi = cc_coefficient_asce7(zone[0], zone[1], Q_(hi, "ft^2"), Q_(th, "deg"))
    assert p_hi <= p_lo + 1e-12
    assert abs(n_hi) <= abs(n_lo) + 1e-12
