"""Invariants of the ASCE 7-16 snow formulas (Eq. 7.7-1, Figure 7.7-1, §7.6.1, §7.7.1)."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from calcpack.loads.snow_asce7 import (
    SnowRoofASCE7,
    SnowSiteASCE7,
    drift_height_asce7,
    roof_snow_asce7,
)
from calcpack.loads.snow_asce7_drift import SnowDriftASCE7, drift_asce7
from calcpack.units import Q_

pg_psf = st.floats(5.0, 150.0)
lu_ft = st.floats(20.0, 800.0)


@given(lu_ft, lu_ft, pg_psf)
def test_drift_height_grows_with_fetch(a: float, b: float, pg: float) -> None:
    lo, hi = sorted((a, b))
    h_lo = drift_height_asce7(Q_(lo, "ft"), Q_(pg, "psf"))
    h_hi = drift_height_asce7(Q_(hi, "ft"), Q_(pg, "psf"))
    assert h_hi >= h_lo


@given(lu_ft, pg_psf, pg_psf)
def test_drift_height_grows_with_ground_snow(lu: float, a: float, b: float) -> None:
    lo, hi = sorted((a, b))
    assert drift_height_asce7(Q_(lu, "ft"), Q_(hi, "psf")) >= drift_height_asce7(
        Q_(lu, "ft"), Q_(lo, "psf")
    )


@given(st.floats(2.5, 30.0), st.floats(21.0, 200.0), pg_psf)
def test_unbalanced_surcharge_total_is_independent_of_slope(
    theta: float, W: float, pg: float
) -> None:
    """The §7.6.1 rectangle h_d γ/√S by 8√S h_d/3 carries 8 γ h_d²/3 whatever the slope."""
    site = SnowSiteASCE7(pg=Q_(pg, "psf"), pg_source="map")
    r = roof_snow_asce7(site, SnowRoofASCE7("gable", Q_(theta, "deg"), Q_(W, "ft")))
    assert r.surcharge is not None
    assert r.surcharge_width is not None
    hd = drift_height_asce7(Q_(W, "ft"), Q_(pg, "psf")).to("ft").magnitude
    gamma = min(0.13 * pg + 14.0, 30.0)
    total = (r.surcharge * r.surcharge_width).to("plf").magnitude
    assert math.isclose(total, 8 * gamma * hd**2 / 3, rel_tol=1e-9)


@given(st.floats(0.5, 20.0), lu_ft, lu_ft, pg_psf)
def test_drift_width_and_height_limits(h: float, lu: float, ll: float, pg: float) -> None:
    """§7.7.1: w <= 8 h_c, the drift height never exceeds h_c, p_d = h_d γ."""
    ps = 0.7 * pg
    d = drift_asce7(
        SnowDriftASCE7(
            "roof step",
            h=Q_(h, "ft"),
            lu_lower=Q_(ll, "ft"),
            lu_upper=Q_(lu, "ft"),
            pg=Q_(pg, "psf"),
            ps=Q_(ps, "psf"),
        )
    )
    if d.required:
        assert d.w <= 8 * d.hc * (1 + 1e-12)
        assert d.hd <= d.hc * (1 + 1e-12)
        assert math.isclose(
            d.pd.to("psf").magnitude, (d.hd * d.gamma).to("psf").magnitude, rel_tol=1e-9
        )
