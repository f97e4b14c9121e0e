"""Invariants of the EN 1991-1-3 snow formulas: μ1 never rises with pitch (Table 5.2); drifts
at steps and obstructions grow with the step height and never fall below the undrifted load;
the drifted duopitch cases (Figure 5.3) never carry more than the undrifted case; s_k of the
UK annex rises with altitude and zone (Eq. NA.1)."""

from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from calcpack.loads.snow_en1991 import (
    SnowDriftEN,
    SnowRoofEN,
    SnowSiteEN,
    mu1_en,
    roof_snow_en,
    snow_drift_en,
)
from calcpack.units import Q_

pitch = st.floats(0.0, 90.0)
heights = st.floats(0.1, 12.0)
sk = st.floats(0.1, 3.0)


@given(pitch, pitch)
def test_mu1_never_rises_with_pitch(a: float, b: float) -> None:
    lo, hi = sorted((a, b))
    assert mu1_en(Q_(hi, "deg")) <= mu1_en(Q_(lo, "deg"))


@given(heights, heights, sk, st.sampled_from(["roof step", "obstruction"]))
def test_drift_peak_grows_with_height_and_is_at_least_undrifted(
    h1: float, h2: float, s: float, kind: str
) -> None:
    lo, hi = sorted((h1, h2))
    site = SnowSiteEN(annex="recommended", sk=Q_(s, "kN/m^2"), sk_source="map")
    extra = {"b1": Q_(10, "m"), "b2": Q_(6, "m")} if kind == "roof step" else {}
    a = snow_drift_en(site, SnowDriftEN(kind, Q_(lo, "m"), **extra))  # type: ignore[arg-type]
    b = snow_drift_en(site, SnowDriftEN(kind, Q_(hi, "m"), **extra))  # type: ignore[arg-type]
    # μ_w = (b1+b2)/2h falls with h but its cap γh/s_k rises; the obstruction μ2 = γh/s_k rises.
    if kind == "obstruction":
        assert b.s_peak >= a.s_peak * (1 - 1e-12)
    assert b.ls >= a.ls
    for d in (a, b):
        assert d.s_peak >= d.s_undrifted * (1 - 1e-12)


@given(pitch, pitch, sk)
def test_drifted_duopitch_cases_never_exceed_undrifted(a1: float, a2: float, s: float) -> None:
    site = SnowSiteEN(annex="recommended", sk=Q_(s, "kN/m^2"), sk_source="map")
    r = roof_snow_en(site, SnowRoofEN("duopitch", Q_(a1, "deg"), Q_(a2, "deg")))
    full = r.cases["(i)"]
    for case in ("(ii)", "(iii)"):
        assert all(x <= y for x, y in zip(r.cases[case], full, strict=True))


@given(st.floats(0.0, 500.0), st.floats(0.0, 500.0), st.floats(1.0, 5.0))
def test_uk_ground_snow_rises_with_altitude(a1: float, a2: float, z: float) -> None:
    lo, hi = sorted((a1, a2))
    roof = SnowRoofEN("monopitch", Q_(5, "deg"))
    s_lo = roof_snow_en(SnowSiteEN(altitude=Q_(lo, "m"), zone=z), roof).sk
    s_hi = roof_snow_en(SnowSiteEN(altitude=Q_(hi, "m"), zone=z), roof).sk
    assert s_hi >= s_lo
