"""Invariants of the EN 1991-1-4 wind formulas: q_b and q_p scale with v_b² (Eq. 4.8, 4.10);
q_p never falls with height (Eq. 4.4 to 4.8); c_pe by the log rule of Figure 7.2 lies between
c_pe,1 and c_pe,10 and is monotonic in the loaded area; suction in every roof zone is never
weaker on a smaller area (the tables' c_pe,1 is at least as onerous as c_pe,10)."""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.loads.wind_en1991 import WindSiteEN, peak_pressure_en
from calcpack.loads.wind_en1991_cpe import ROOF_ZONES, cpe_at_area, roof_cpe_en
from calcpack.units import Q_

speeds = st.floats(15.0, 40.0)
terrains = st.sampled_from(["0", "I", "II", "III", "IV"])


@given(speeds, st.floats(1.1, 1.5), terrains, st.floats(1.0, 15.0))
def test_peak_pressure_scales_with_v_squared(v: float, k: float, t: str, z: float) -> None:
    a = peak_pressure_en(
        WindSiteEN(Q_(v, "m/s"), "map", annex="recommended", terrain=t), Q_(z, "m")
    )  # type: ignore[arg-type]
    b = peak_pressure_en(
        WindSiteEN(Q_(k * v, "m/s"), "map", annex="recommended", terrain=t), Q_(z, "m")
    )  # type: ignore[arg-type]
    assert float((b.qp / a.qp).to("")) == pytest.approx(k * k, rel=1e-9)


@given(speeds, terrains, st.floats(0.5, 15.0), st.floats(0.5, 15.0))
def test_peak_pressure_never_falls_with_height(v: float, t: str, z1: float, z2: float) -> None:
    lo, hi = sorted((z1, z2))
    site = WindSiteEN(Q_(v, "m/s"), "map", annex="recommended", terrain=t)  # type: ignore[arg-type]
    assert peak_pressure_en(site, Q_(hi, "m")).qp >= peak_pressure_en(site, Q_(lo, "m")).qp


@given(st.floats(-3.0, 1.0), st.floats(-3.0, 1.0), st.floats(0.1, 20.0), st.floats(0.1, 20.0))
def test_log_rule_bounded_and_monotonic_in_area(
    c1: float, c10: float, a1: float, a2: float
) -> None:
    lo, hi = sorted((a1, a2))
    v_lo = cpe_at_area(c1, c10, Q_(lo, "m^2"))
    v_hi = cpe_at_area(c1, c10, Q_(hi, "m^2"))
    for v in (v_lo, v_hi):
        assert min(c1, c10) - 1e-12 <= v <= max(c1, c10) + 1e-12
    # moving from c_pe,1 toward c_pe,10 as the area grows
    assert (v_hi - v_lo) * (c10 - c1) >= -1e-12


@given(
    st.sampled_from(sorted(ROOF_ZONES)),
    st.floats(5.0, 75.0),
    st.floats(0.5, 20.0),
    st.floats(0.5, 20.0),
)
def test_roof_suction_never_weaker_on_a_smaller_area(key, pitch, a1, a2) -> None:
    roof, theta = key
    lo, hi = sorted((a1, a2))
    p = Q_(0.0 if roof == "flat" else pitch, "deg")
    for face in ROOF_ZONES[key]:
        for zone in face:
            small = roof_cpe_en(roof, theta, p, zone, Q_(lo, "m^2"))
            large = roof_cpe_en(roof, theta, p, zone, Q_(hi, "m^2"))
            if "neg" in small:
                assert small["neg"] <= large["neg"] + 1e-12
