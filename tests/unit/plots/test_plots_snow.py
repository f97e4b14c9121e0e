"""Snow sketches read the results and draw the distributions."""

from __future__ import annotations

import pytest

from calcpack.loads.snow_asce7 import SnowRoofASCE7, SnowSiteASCE7, roof_snow_asce7
from calcpack.loads.snow_asce7_drift import SnowDriftASCE7, drift_asce7
from calcpack.plots.snow import SnowSketch, drift_profile, unbalanced_profile
from calcpack.units import Q_


def test_unbalanced_profile_has_the_surcharge_at_the_ridge() -> None:
    site = SnowSiteASCE7(pg=Q_(30, "psf"), pg_source="map")
    r = roof_snow_asce7(site, SnowRoofASCE7("gable", Q_(26.565, "deg"), Q_(30, "ft")))
    pts = unbalanced_profile(r)
    assert pts is not None
    assert pts[0][1] == pytest.approx(r.unbalanced_windward.to("psf").magnitude)  # type: ignore[union-attr]
    assert max(p for _, p in pts) == pytest.approx(
        (r.ps + r.surcharge).to("psf").magnitude  # type: ignore[operator]
    )
    assert "<svg" in SnowSketch(r).svg()


def test_drift_profile_is_cut_at_the_roof_edge() -> None:
    d = drift_asce7(
        SnowDriftASCE7(
            "roof step",
            h=Q_(3, "ft"),
            lu_lower=Q_(40, "ft"),
            lu_upper=Q_(100, "ft"),
            pg=Q_(30, "psf"),
            ps=Q_(21, "psf"),
            lower_width=Q_(12, "ft"),
        )
    )
    pts = drift_profile(d)
    assert pts[0][1] == pytest.approx((d.ps + d.pd).to("psf").magnitude)
    assert pts[1][1] == pytest.approx((d.ps + d.p_edge).to("psf").magnitude)
    assert "<svg" in SnowSketch(d).svg()


def test_en_drift_profile_falls_from_the_step_and_is_cut_at_the_edge() -> None:
    """EN 1991-1-3 §6.2: μ2 at the obstruction to μ1 at l_s, cut off at a short lower roof."""
    from calcpack.loads.snow_en1991 import SnowDriftEN, SnowSiteEN, snow_drift_en
    from calcpack.plots.snow import drift_profile_en

    site = SnowSiteEN(annex="recommended", sk=Q_(0.5, "kN/m^2"), sk_source="map")
    d = snow_drift_en(site, SnowDriftEN("obstruction", Q_(0.6, "m"), lower_width=Q_(3, "m")))
    pts = drift_profile_en(d)
    assert pts[0][1] == pytest.approx(d.s_peak.to("kN/m^2").magnitude)
    assert pts[1] == (pytest.approx(3.0), pytest.approx(d.s_edge.to("kN/m^2").magnitude))
    assert pts[-1][1] == 0.0
    assert "<svg" in SnowSketch(d).svg()
    full = snow_drift_en(site, SnowDriftEN("obstruction", Q_(0.6, "m")))
    assert drift_profile_en(full)[1][1] == pytest.approx(full.s_undrifted.to("kN/m^2").magnitude)
