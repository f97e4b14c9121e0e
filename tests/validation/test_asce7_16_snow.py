"""ASCE/SEI 7-16, Minimum Design Loads and Associated Criteria for Buildings and Other
Structures (ASCE, 2017), Chapter 7 Snow Loads; and O'Rourke, Snow Loads: Guide to the Snow Load
Provisions of ASCE 7-16 (ASCE Press, 2017).

The printed guide was not at hand: its worked examples are followed as far as they are
remembered, and each reference value below is the standard's printed equation evaluated by hand
on the example's inputs, with the equation's constants recalled ("from memory"). Tables 7.3-1,
7.3-2 and 1.5-2 and Figure 7.4-1 are likewise recalled (from memory).
"""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.loads.snow_asce7 import (
    SnowRoofASCE7,
    SnowSiteASCE7,
    drift_height_asce7,
    roof_snow_asce7,
    snow_density_asce7,
)
from calcpack.loads.snow_asce7_drift import (
    SlidingSnowASCE7,
    SnowDriftASCE7,
    drift_asce7,
    sliding_snow_asce7,
)
from calcpack.units import Q_


def _site(pg: float = 30.0, **kw: str) -> SnowSiteASCE7:
    return SnowSiteASCE7(pg=Q_(pg, "psf"), pg_source="ASCE 7-16 Figure 7.2-1", **kw)  # type: ignore[arg-type]


def test_flat_roof_eq_7_3_1_heated_partially_exposed() -> None:
    """Guide, balanced-load example pattern (from memory): pg = 30 psf, terrain C, partially
    exposed, heated, risk category II: pf = 0.7(1.0)(1.0)(1.0)(30) = 21 psf (Eq. 7.3-1)."""
    r = roof_snow_asce7(_site(), SnowRoofASCE7("gable", Q_(4.76, "deg"), Q_(40, "ft")))
    assert r.pf.to("psf").magnitude == pytest.approx(21.0, rel=1e-9)  # exact arithmetic
    # slope < 15°, pg > 20 psf: pm = 20 Is = 20 psf (§7.3.4, from memory)
    assert r.pm is not None
    assert r.pm.to("psf").magnitude == pytest.approx(20.0)
    assert r.balanced.to("psf").magnitude == pytest.approx(21.0)


def test_table_7_3_1_and_1_5_2_factors() -> None:
    """Terrain B sheltered Ce = 1.2, unheated Ct = 1.2, risk IV Is = 1.2 (Tables 7.3-1, 7.3-2,
    1.5-2, from memory): pf = 0.7 × 1.2 × 1.2 × 1.2 × 25 = 30.24 psf (hand arithmetic)."""
    site = _site(25.0, terrain="B", exposure="sheltered", thermal="unheated", risk_category="IV")
    r = roof_snow_asce7(site, SnowRoofASCE7("flat", Q_(0, "deg"), Q_(30, "ft")))
    assert r.pf.to("psf").magnitude == pytest.approx(30.24, rel=1e-9)


def test_cs_warm_nonslippery_figure_7_4_1a() -> None:
    """Warm roof, non-slippery, θ = 45°: Cs = 1 − (45 − 30)/40 = 0.625 (Figure 7.4-1a solid
    line: 1.0 to 30°, zero at 70°, from memory)."""
    r = roof_snow_asce7(_site(), SnowRoofASCE7("gable", Q_(45, "deg"), Q_(20, "ft")))
    assert r.Cs == pytest.approx(0.625, rel=1e-9)
    assert r.ps.to("psf").magnitude == pytest.approx(0.625 * 21.0)


def test_cs_cold_slippery_figure_7_4_1b() -> None:
    """Ct = 1.1, slippery, θ = 30°: Cs = 1 − (30 − 10)/60 = 0.667 (Figure 7.4-1b dashed line,
    from memory)."""
    site = _site(thermal="cold ventilated")
    r = roof_snow_asce7(site, SnowRoofASCE7("gable", Q_(30, "deg"), Q_(20, "ft"), "slippery"))
    assert r.Cs == pytest.approx(2 / 3, rel=1e-9)


def test_unbalanced_gable_w_over_20_ft() -> None:
    """§7.6.1, pg = 30 psf, 6 on 12 gable (θ = 26.57°), W = 30 ft (from memory, hand working):
    windward 0.3 × 21 = 6.3 psf; γ = 0.13 × 30 + 14 = 17.9 pcf;
    h_d = 0.43 × 30^(1/3) × 40^(1/4) − 1.5 = 1.860 ft; S = 2;
    surcharge = 1.860 × 17.9 / √2 = 23.5 psf over 8 √2 × 1.860 / 3 = 7.01 ft from the ridge."""
    roof = SnowRoofASCE7("gable", Q_(26.565, "deg"), Q_(30, "ft"))
    r = roof_snow_asce7(_site(), roof)
    assert r.unbalanced_windward is not None
    assert r.surcharge is not None
    assert r.surcharge_width is not None
    assert r.unbalanced_windward.to("psf").magnitude == pytest.approx(6.3, rel=1e-6)
    assert r.surcharge.to("psf").magnitude == pytest.approx(23.5, rel=5e-3)  # 3 s.f. by hand
    assert r.surcharge_width.to("ft").magnitude == pytest.approx(7.01, rel=5e-3)


def test_unbalanced_small_gable_prismatic_rafters() -> None:
    """§7.6.1, W <= 20 ft with prismatic rafters ridge to eave: leeward Is pg = 30 psf,
    windward zero (from memory)."""
    roof = SnowRoofASCE7("gable", Q_(18.43, "deg"), Q_(12, "ft"), prismatic_ridge_to_eave=True)
    r = roof_snow_asce7(_site(), roof)
    assert r.unbalanced_leeward is not None
    assert r.unbalanced_windward is not None
    assert r.unbalanced_leeward.to("psf").magnitude == pytest.approx(30.0)
    assert r.unbalanced_windward.magnitude == 0.0


def test_unbalanced_not_required_steep_roof() -> None:
    """Slope over 7 on 12 (30.2°): no unbalanced load (§7.6.1, from memory)."""
    r = roof_snow_asce7(_site(), SnowRoofASCE7("gable", Q_(35, "deg"), Q_(20, "ft")))
    assert r.unbalanced_windward is None
    assert any("7.6.1" in n for n in r.notes)


def test_rain_on_snow_low_slope() -> None:
    """§7.10: pg = 15 psf, 1/4 on 12 (1.19°) with W = 100 ft: 1.19° < 100/50 = 2°, so a 5 psf
    surcharge on the balanced load: 0.7 × 1.0 × 15 + 5 = 15.5 psf (from memory); pm = Is pg =
    15 psf governs less."""
    r = roof_snow_asce7(_site(15.0), SnowRoofASCE7("gable", Q_(1.19, "deg"), Q_(100, "ft")))
    assert r.rain_on_snow.to("psf").magnitude == pytest.approx(5.0)
    assert r.balanced.to("psf").magnitude == pytest.approx(15.5)


def test_density_and_drift_height_figure_7_7_1() -> None:
    """Eq. 7.7-1 and Figure 7.7-1 (from memory): pg = 30 psf, lu = 100 ft:
    γ = 17.9 pcf; h_d = 0.43 × 4.642 × 2.515 − 1.5 = 3.52 ft (hand arithmetic)."""
    assert snow_density_asce7(Q_(30, "psf")).to("pcf").magnitude == pytest.approx(17.9)
    assert snow_density_asce7(Q_(200, "psf")).to("pcf").magnitude == pytest.approx(30.0)
    hd = drift_height_asce7(Q_(100, "ft"), Q_(30, "psf"))
    assert hd.to("ft").magnitude == pytest.approx(3.52, abs=0.005)  # 3 s.f. by hand


def test_leeward_drift_not_truncated() -> None:
    """Roof step 8 ft, upper roof 100 ft, pg = 30 psf, ps = 21 psf (from memory, by hand):
    hb = 21/17.9 = 1.173 ft; hc = 6.83 ft; leeward hd = 3.52 ft < hc, w = 4 hd = 14.1 ft,
    pd = 3.52 × 17.9 = 63.0 psf."""
    d = drift_asce7(
        SnowDriftASCE7(
            "roof step",
            h=Q_(8, "ft"),
            lu_lower=Q_(40, "ft"),
            lu_upper=Q_(100, "ft"),
            pg=Q_(30, "psf"),
            ps=Q_(21, "psf"),
        )
    )
    assert d.required
    assert d.hb.to("ft").magnitude == pytest.approx(1.173, abs=1e-3)
    assert d.w.to("ft").magnitude == pytest.approx(14.1, abs=0.05)
    assert d.pd.to("psf").magnitude == pytest.approx(63.0, abs=0.2)


def test_drift_truncated_by_step() -> None:
    """Step 3 ft: hc = 1.827 ft < hd = 3.52 ft, so w = 4 hd²/hc = 27.1 ft but <= 8 hc = 14.6 ft,
    and pd = hc γ = 32.7 psf (§7.7.1, by hand)."""
    d = drift_asce7(
        SnowDriftASCE7(
            "roof step",
            h=Q_(3, "ft"),
            lu_lower=Q_(40, "ft"),
            lu_upper=Q_(100, "ft"),
            pg=Q_(30, "psf"),
            ps=Q_(21, "psf"),
        )
    )
    assert d.w.to("ft").magnitude == pytest.approx(8 * 1.8268, rel=1e-3)
    assert d.pd.to("psf").magnitude == pytest.approx(32.7, abs=0.05)


def test_parapet_windward_drift() -> None:
    """Parapet 4 ft, 80 ft of roof upwind, pg = 40 psf, ps = 28 psf (§7.8, by hand):
    γ = 19.2 pcf, hb = 1.458 ft, hc = 2.542 ft; hd = 0.75 (0.43 × 80^(1/3) × 50^(1/4) − 1.5)
    = 0.75 × 3.426 = 2.57 ft > hc, so pd = hc γ = 48.8 psf."""
    d = drift_asce7(
        SnowDriftASCE7(
            "parapet", h=Q_(4, "ft"), lu_lower=Q_(80, "ft"), pg=Q_(40, "psf"), ps=Q_(28, "psf")
        )
    )
    assert d.hd_leeward is None
    assert d.hd_windward is not None
    assert d.hd_windward.to("ft").magnitude == pytest.approx(2.57, abs=0.01)
    assert d.pd.to("psf").magnitude == pytest.approx(48.8, abs=0.1)


def test_no_drift_when_step_is_buried() -> None:
    """hc / hb < 0.2: drift loads not required (§7.7.1, from memory)."""
    d = drift_asce7(
        SnowDriftASCE7(
            "roof step",
            h=Q_(1.3, "ft"),
            lu_lower=Q_(40, "ft"),
            lu_upper=Q_(100, "ft"),
            pg=Q_(30, "psf"),
            ps=Q_(21, "psf"),
        )
    )
    assert not d.required
    assert d.pd.magnitude == 0.0


def test_sliding_snow_section_7_9() -> None:
    """§7.9 (from memory): pf = 21 psf, W = 20 ft, non-slippery 20° upper roof: 0.4 × 21 × 20
    = 168 plf over 15 ft = 11.2 psf; lower roof 10 ft wide carries 168 × 10/15 = 112 plf."""
    s = sliding_snow_asce7(
        SlidingSnowASCE7(Q_(21, "psf"), Q_(20, "ft"), Q_(20, "deg"), "non-slippery", Q_(10, "ft"))
    )
    assert s.required
    assert s.intensity.to("psf").magnitude == pytest.approx(11.2)
    assert s.line_total.to("plf").magnitude == pytest.approx(112.0)


def test_si_inputs_match_us_inputs() -> None:
    """The SI forms of Eq. 7.7-1 and Figure 7.7-1 agree with the US forms to their rounding
    (common practice: the printed SI constants are rounded conversions)."""
    us = drift_height_asce7(Q_(100, "ft"), Q_(30, "psf")).to("m").magnitude
    si = drift_height_asce7(Q_(100, "ft").to("m"), Q_(30, "psf").to("kN/m^2")).magnitude
    assert si == pytest.approx(us, rel=0.02)


def test_refusals_name_the_input() -> None:
    with pytest.raises(InputError, match="pg"):
        SnowSiteASCE7(pg=Q_(-5, "psf"), pg_source="map")
    with pytest.raises(InputError, match="pg"):
        SnowSiteASCE7(pg=Q_(30, "ft"), pg_source="map")
    with pytest.raises(InputError, match="terrain"):
        SnowSiteASCE7(pg=Q_(30, "psf"), pg_source="map", terrain="E")  # type: ignore[arg-type]
    with pytest.raises(InputError, match="pg_source"):
        SnowSiteASCE7(pg=Q_(30, "psf"), pg_source="")
    with pytest.raises(InputError, match="slope"):
        SnowRoofASCE7("gable", Q_(95, "deg"), Q_(20, "ft"))
    with pytest.raises(InputError, match="lu_upper"):
        SnowDriftASCE7(
            "roof step", h=Q_(3, "ft"), lu_lower=Q_(40, "ft"), pg=Q_(30, "psf"), ps=Q_(21, "psf")
        )


def test_working_shows_the_clauses() -> None:
    r = roof_snow_asce7(_site(), SnowRoofASCE7("gable", Q_(26.565, "deg"), Q_(30, "ft")))
    from calcpack.working import Block

    text = Block(r.working()).text()
    assert "Eq. 7.3-1" in text
    assert "§7.6.1" in text
    assert "reviewed and sealed" in text
