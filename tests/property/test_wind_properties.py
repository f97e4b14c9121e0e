"""Invariants of the ASCE 7-16 wind formulas: q_z scales with V² (Eq. 26.10-1); C&C
coefficients are monotonic in effective area between the figures' limits and constant outside
them (Figures 30.3-1, 30.3-2A to 30.3-2I, 30.3-5A/B); q_z never falls with height and the
windward wall's profile reaches q_h at h (Table 26.10-1, Eq. 27.3-1); the flexible building's
G_f exceeds the rigid G and falls with damping (§26.11)."""

from __future__ import annotations

import itertools
import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.loads.wind_asce7 import WindSiteASCE7, velocity_pressure_asce7, velocity_pressure_at
from calcpack.loads.wind_asce7_cc import cc_coefficient_asce7, cc_roof_curves, cc_roof_zones
from calcpack.loads.wind_asce7_directional import DirectionalBuildingASCE7, directional_wind_asce7
from calcpack.loads.wind_asce7_gust import BuildingVibration, gust_effect_factor_asce7
from calcpack.units import Q_


@settings(deadline=None)  # timing on a shared machine is not a property
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


@settings(deadline=None)  # timing on a shared machine is not a property
@given(zones, st.floats(1.0, 5000.0), st.floats(1.0, 5000.0), st.floats(0.0, 7.0))
def test_cc_coefficients_fall_with_area(
    zone: tuple[str, str], a: float, b: float, th: float
) -> None:
    lo, hi = sorted((a, b))
    p_lo, n_lo = cc_coefficient_asce7(zone[0], zone[1], Q_(lo, "ft^2"), Q_(th, "deg"))
    p_hi, n_hi = cc_coefficient_asce7(zone[0], zone[1], Q_(hi, "ft^2"), Q_(th, "deg"))
    assert p_hi <= p_lo + 1e-12
    assert abs(n_hi) <= abs(n_lo) + 1e-12


# one representative angle inside each slope band of each roof form's figures
_BANDS = [
    ("gable", 5.0), ("gable", 15.0), ("gable", 24.0), ("gable", 40.0),
    ("hip", 15.0), ("hip", 24.0), ("hip", 40.0),
    ("monoslope", 8.0), ("monoslope", 20.0),
]  # fmt: skip
_ROOF_ZONES = [(r, t, z) for r, t in _BANDS for z in cc_roof_zones(r, Q_(t, "deg"))]


@settings(deadline=None)  # timing on a shared machine is not a property
@given(
    st.sampled_from(_ROOF_ZONES),
    st.floats(0.5, 5000.0),
    st.floats(0.5, 5000.0),
    st.floats(0.2, 1.2),
)
def test_sloped_roof_coefficients_fall_with_area(
    rz: tuple[str, float, str], a: float, b: float, h_over_B: float
) -> None:
    roof, th, zone = rz
    lo, hi = sorted((a, b))
    kw = {"roof": roof, "h_over_B": h_over_B}
    p_lo, n_lo = cc_coefficient_asce7("roof", zone, Q_(lo, "ft^2"), Q_(th, "deg"), **kw)  # type: ignore[arg-type]
    p_hi, n_hi = cc_coefficient_asce7("roof", zone, Q_(hi, "ft^2"), Q_(th, "deg"), **kw)  # type: ignore[arg-type]
    assert 0.0 < p_hi <= p_lo + 1e-12
    assert 0.0 < abs(n_hi) <= abs(n_lo) + 1e-12


@settings(deadline=None)  # timing on a shared machine is not a property
@given(st.sampled_from(_ROOF_ZONES), st.floats(0.01, 1.0), st.floats(1.0, 100.0))
def test_sloped_roof_coefficients_constant_outside_the_figure(
    rz: tuple[str, float, str], below: float, beyond: float
) -> None:
    roof, th, zone = rz
    theta = Q_(th, "deg")
    pos, neg = cc_roof_curves(roof, zone, theta, 0.3)
    for curve, k in ((pos[0], 0), (neg[0], 1)):
        first, last = curve.points[0], curve.points[-1]
        small = cc_coefficient_asce7(
            "roof", zone, Q_(first[0] * below, "ft^2"), theta, roof=roof, h_over_B=0.3
        )
        large = cc_coefficient_asce7(
            "roof", zone, Q_(last[0] * beyond, "ft^2"), theta, roof=roof, h_over_B=0.3
        )
        assert small[k] == first[1]
        assert large[k] == last[1]


@settings(deadline=None)  # timing on a shared machine is not a property
@given(
    st.floats(1.0, 500.0),
    st.floats(1.0, 500.0),
    st.sampled_from(["B", "C", "D"]),
)
def test_velocity_pressure_never_falls_with_height(z1: float, z2: float, exp: str) -> None:
    """K_z = 2.01 (z/z_g)^(2/α), z at least 15 ft (Table 26.10-1): q_z is non-decreasing in z."""
    site = WindSiteASCE7(Q_(120.0, "mph"), "map", exp)  # type: ignore[arg-type]
    lo, hi = sorted((z1, z2))
    q_lo = velocity_pressure_at(site, Q_(lo, "ft"))[2]
    q_hi = velocity_pressure_at(site, Q_(hi, "ft"))[2]
    assert q_lo.to("psf").magnitude <= q_hi.to("psf").magnitude * (1 + 1e-12)


@settings(max_examples=15, deadline=None)
@given(st.floats(16.0, 200.0), st.floats(90.0, 180.0), st.sampled_from(["B", "C", "D"]))
def test_windward_profile_rises_to_q_h_at_h(h: float, V: float, exp: str) -> None:
    """The windward wall's bands rise with height and the top band is q_h (Eq. 27.3-1)."""
    site = WindSiteASCE7(Q_(V, "mph"), "map", exp)  # type: ignore[arg-type]
    b = DirectionalBuildingASCE7(h=Q_(h, "ft"), B=Q_(80, "ft"), L=Q_(50, "ft"),
                                 roof_slope=Q_(0, "deg"), roof="flat")  # fmt: skip
    r = directional_wind_asce7(site, b)
    qs = [x.qz.to("psf").magnitude for x in r.windward_profile]
    assert all(a <= b_ * (1 + 1e-12) for a, b_ in itertools.pairwise(qs))
    assert qs[-1] == pytest.approx(r.qh.to("psf").magnitude, rel=1e-12)
    assert r.windward_profile[-1].top.to("ft").magnitude == pytest.approx(h)


@settings(max_examples=25, deadline=None)
@given(
    st.floats(80.0, 600.0),
    st.floats(40.0, 300.0),
    st.floats(40.0, 300.0),
    st.floats(0.1, 0.95),
    st.floats(0.005, 0.05),
    st.floats(1.2, 3.0),
)
def test_gust_factor_exceeds_rigid_and_falls_with_damping(
    h: float, B: float, L: float, n1: float, beta: float, k: float
) -> None:
    """Eq. 26.11-10 adds the resonant term to Eq. 26.11-6's background term, so G_f > G;
    R falls as 1/√β, so more damping gives a smaller G_f."""
    site = WindSiteASCE7(Q_(130.0, "mph"), "map", "C")
    dims = {"h": Q_(h, "ft"), "B": Q_(B, "ft"), "L": Q_(L, "ft")}
    g1 = gust_effect_factor_asce7(
        site, **dims, vibration=BuildingVibration(Q_(n1, "Hz"), "given", beta)
    )
    g2 = gust_effect_factor_asce7(
        site, **dims, vibration=BuildingVibration(Q_(n1, "Hz"), "given", min(k * beta, 0.19))
    )
    assert g1.G_rigid < g1.G
    assert g2.G < g1.G


@settings(max_examples=20, deadline=None)
@given(st.floats(16.0, 90.0), st.floats(0.0, 1.0), st.floats(0.05, 1.0), st.floats(0.5, 3.0))
def test_wall_line_loads_carry_the_profile_over_the_member(
    h: float, f0: float, f1: float, s_ft: float
) -> None:
    """Stepped line loads on a stud from z0 to z1 sum to the profile's integral over [z0, z1]
    times the spacing (the pieces neither overlap nor leave gaps)."""
    from calcpack.loads.wall_cases import wall_line_loads, wall_profiles_asce7_directional

    site = WindSiteASCE7(Q_(115.0, "mph"), "map", "C")
    b = DirectionalBuildingASCE7(h=Q_(h, "ft"), B=Q_(80, "ft"), L=Q_(50, "ft"),
                                 roof_slope=Q_(0, "deg"), roof="flat")  # fmt: skip
    case = wall_profiles_asce7_directional(directional_wind_asce7(site, b))[0]
    z0 = f0 * h * 0.9
    z1 = z0 + f1 * (h - z0)
    loads = wall_line_loads(case, Q_(s_ft, "ft"), bottom=Q_(z0, "ft"), top=Q_(z1, "ft"))
    total = sum((x.w * (x.end - x.start)).to("lbf").magnitude for x in loads)
    want = 0.0
    for a, e, v in zip(case.breaks[:-1], case.breaks[1:], case.values, strict=True):
        lo, hi = max(a.to("ft").magnitude, z0), min(e.to("ft").magnitude, z1)
        if hi > lo:
            want += v.to("psf").magnitude * (hi - lo) * s_ft
    assert total == pytest.approx(want, rel=1e-9)
    assert loads[0].start.to("ft").magnitude == pytest.approx(0.0)
    assert loads[-1].end.to("ft").magnitude == pytest.approx(z1 - z0)
