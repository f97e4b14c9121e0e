"""ASCE/SEI 7-16, Minimum Design Loads and Associated Criteria for Buildings and Other
Structures (ASCE, 2017), Chapter 30 Part 1: components and cladding on sloped roofs, Figures
30.3-2B to 30.3-2I (gable and hip roofs, 7° < θ <= 45°) and 30.3-5A/B (monoslope roofs); and
Coulbourne and Stafford, Wind Loads: Guide to the Wind Load Provisions of ASCE 7-16 (ASCE Press,
2020), whose residential C&C examples are followed in pattern only.

Neither the printed figures nor the guide were at hand: every GCp below is the figure's value as
recalled ("from memory"); the interpolation (straight on log10 A between the figure's points,
constant outside them) and Eq. 30.3-1 are evaluated by hand. Tolerance 1e-9 where the same
arithmetic is repeated.
"""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.wind_asce7 import WindSiteASCE7
from calcpack.loads.wind_asce7_cc import cc_coefficient_asce7, cc_roof_zones
from calcpack.loads.wind_asce7_lowrise import (
    LowRiseBuildingASCE7,
    components_wind_asce7,
    effective_wind_area,
)
from calcpack.units import Q_

SITE = WindSiteASCE7(Q_(115, "mph"), "ASCE 7-16 Figure 26.5-1B", "C")


def _log(a: float, a1: float, g1: float, a2: float, g2: float) -> float:
    return g1 + (g2 - g1) * math.log10(a / a1) / math.log10(a2 / a1)


def _qh(h_ft: float, V: float = 115.0) -> float:
    # Eq. 26.10-1 with K_z of Table 26.10-1 note 1, exposure C (α = 9.5, z_g = 900 ft, from memory)
    return 0.00256 * 2.01 * (max(h_ft, 15.0) / 900.0) ** (2 / 9.5) * 0.85 * V**2


@pytest.mark.parametrize(
    ("roof", "theta", "zones"),
    [
        ("gable", 4.0, ("1'", "1", "2", "3")),  # Figure 30.3-2A (from memory)
        ("gable", 18.4, ("1", "2e", "2n", "2r", "3e", "3r")),  # Figure 30.3-2B (from memory)
        ("gable", 26.6, ("1", "2e", "2n", "2r", "3e", "3r")),  # Figure 30.3-2C (from memory)
        ("gable", 33.7, ("1", "2e", "2n", "2r", "3e", "3r")),  # Figure 30.3-2D (from memory)
        ("hip", 18.4, ("1", "2r", "2e", "3")),  # Figures 30.3-2E/F (from memory)
        ("hip", 45.0, ("1", "2r", "2e", "3")),  # Figure 30.3-2I (from memory)
        ("hip", 5.0, ("1'", "1", "2", "3")),  # hip roofs θ <= 7° read Figure 30.3-2A
        ("monoslope", 2.0, ("1'", "1", "2", "3")),  # θ <= 3°: Figure 30.3-2A
        ("monoslope", 8.0, ("1", "2", "2'", "3", "3'")),  # Figure 30.3-5A (from memory)
        ("monoslope", 15.0, ("1", "2", "3")),  # Figure 30.3-5B (from memory)
    ],
)
def test_zones_by_roof_form_and_slope(roof: str, theta: float, zones: tuple[str, ...]) -> None:
    assert cc_roof_zones(roof, Q_(theta, "deg")) == zones


def test_gable_7_to_20_degrees_zone_3r_figure_30_3_2b() -> None:
    """Figure 30.3-2B zone 3r (from memory): −3.6 at 10 ft² to −2.4 at 100 ft²; positive
    +0.7 to +0.3. At 50 ft² (rafter 12 ft × max(2 ft, 4 ft) = 48 ft², taken 50)."""
    p, n = cc_coefficient_asce7("roof", "3r", Q_(50, "ft^2"), Q_(18.4, "deg"))
    assert n == pytest.approx(_log(50, 10, -3.6, 100, -2.4), rel=1e-9)
    assert p == pytest.approx(_log(50, 10, 0.7, 100, 0.3), rel=1e-9)
    # constant below the first and beyond the last point of the figure
    assert cc_coefficient_asce7("roof", "3r", Q_(2, "ft^2"), Q_(18.4, "deg"))[1] == -3.6
    assert cc_coefficient_asce7("roof", "3r", Q_(900, "ft^2"), Q_(18.4, "deg"))[1] == -2.4


def test_slope_bands_are_closed_above() -> None:
    """θ = 20° belongs to Figure 30.3-2B (7° < θ <= 20°), 20.1° to 30.3-2C (from memory:
    zone 1 at 10 ft², −2.0 and −1.5); 27° to 30.3-2C, 27.1° to 30.3-2D (zone 1 −1.8)."""
    at = Q_(10, "ft^2")
    assert cc_coefficient_asce7("roof", "1", at, Q_(20, "deg"))[1] == -2.0
    assert cc_coefficient_asce7("roof", "1", at, Q_(20.1, "deg"))[1] == -1.5
    assert cc_coefficient_asce7("roof", "1", at, Q_(27, "deg"))[1] == -1.5
    assert cc_coefficient_asce7("roof", "1", at, Q_(27.1, "deg"))[1] == -1.8
    assert cc_coefficient_asce7("roof", "1", at, Q_(7.0, "deg"))[1] == -1.7  # Figure 30.3-2A


def test_hip_roof_h_over_b_bands() -> None:
    """Hip roofs 7° < θ <= 20° (from memory): zone 3 −2.6 (h/B <= 0.5, Figure 30.3-2E) and
    −3.0 (h/B >= 0.8, Figure 30.3-2F) at 10 ft²; between, the more severe (conservative)."""
    at, th = Q_(10, "ft^2"), Q_(15, "deg")
    assert cc_coefficient_asce7("roof", "3", at, th, roof="hip", h_over_B=0.3)[1] == -2.6
    assert cc_coefficient_asce7("roof", "3", at, th, roof="hip", h_over_B=0.9)[1] == -3.0
    assert cc_coefficient_asce7("roof", "3", at, th, roof="hip", h_over_B=0.65)[1] == -3.0
    with pytest.raises(InputError, match="h_over_B"):
        cc_coefficient_asce7("roof", "3", at, th, roof="hip")


def test_monoslope_figure_30_3_5b() -> None:
    """Figure 30.3-5B zone 3 (from memory): −2.9 at 10 ft² to −2.0 at 100 ft², +0.4 to +0.3."""
    p, n = cc_coefficient_asce7("roof", "3", Q_(30, "ft^2"), Q_(14, "deg"), roof="monoslope")
    assert n == pytest.approx(_log(30, 10, -2.9, 100, -2.0), rel=1e-9)
    assert p == pytest.approx(_log(30, 10, 0.4, 100, 0.3), rel=1e-9)


def test_rafter_uplift_on_a_gable_roof_eq_30_3_1() -> None:
    """A rafter 14 ft long at 2 ft centres on a 6:12 gable roof (θ = 26.57°, Figure 30.3-2C),
    h = 18 ft, 28 ft × 50 ft plan, exposure C, V = 115 mph, enclosed:
    A = 14 × max(2, 14/3) = 65.3 ft² (§26.2); zone 2r (from memory −2.5 at 10 ft² to −1.5 at
    100 ft²); p = q_h (GCp − 0.18) by Eq. 30.3-1; a = max(min(2.8, 7.2), 1.12, 3) = 3 ft."""
    b = LowRiseBuildingASCE7(
        Q_(18, "ft"), Q_(28, "ft"), Q_(50, "ft"), Q_(math.degrees(math.atan(0.5)), "deg")
    )
    A = effective_wind_area(Q_(14, "ft"), Q_(2, "ft"))
    c = components_wind_asce7(SITE, b, surface="roof", zone="2r", area=A)
    g = _log(14 * 14 / 3, 10, -2.5, 100, -1.5)
    assert c.GCp_neg == pytest.approx(g, rel=1e-9)
    assert c.p_neg.to("psf").magnitude == pytest.approx(_qh(18) * (g - 0.18), rel=1e-9)
    assert c.a is not None
    assert c.a.to("ft").magnitude == pytest.approx(3.0)
    assert "30.3-2C" in c.figure
    texts = " ".join(str(s) for s in c.working())
    assert "30.3-2C" in texts


def test_refusals_name_the_limit() -> None:
    at = Q_(10, "ft^2")
    with pytest.raises(OutOfScopeError, match="45°"):
        cc_coefficient_asce7("roof", "1", at, Q_(50, "deg"))
    with pytest.raises(OutOfScopeError, match="30°"):
        cc_coefficient_asce7("roof", "1", at, Q_(35, "deg"), roof="monoslope")
    with pytest.raises(OutOfScopeError, match="mansard"):
        cc_coefficient_asce7("roof", "1", at, Q_(35, "deg"), roof="mansard")
    with pytest.raises(OutOfScopeError, match="flat"):
        cc_coefficient_asce7("roof", "1", at, Q_(10, "deg"), roof="flat")
    with pytest.raises(InputError, match="zone"):
        cc_coefficient_asce7("roof", "1'", at, Q_(15, "deg"))  # 1' is a zone of 30.3-2A only
    with pytest.raises(InputError, match="60 ft"):
        LowRiseBuildingASCE7(Q_(65, "ft"), Q_(100, "ft"), Q_(100, "ft"), Q_(20, "deg"))


@pytest.mark.parametrize(
    ("roof", "theta", "figure"),
    [("gable", 26.6, "30.3-2C"), ("hip", 33.7, "30.3-2I"), ("monoslope", 8.0, "30.3-5A")],
)
def test_zone_plan_covers_the_roof_and_names_each_zone(
    roof: str, theta: float, figure: str
) -> None:
    """Every zone of the figure appears on the plan with the pressure of Eq. 30.3-1 at A;
    the regions of a gable or monoslope roof tile the plan B × L exactly (areas add up)."""
    from calcpack.loads.wind_asce7_cc_plan import cc_roof_plan_asce7

    b = LowRiseBuildingASCE7(
        Q_(18, "ft"),
        Q_(30, "ft"),
        Q_(60, "ft"),
        Q_(theta, "deg"),
        roof=roof,  # type: ignore[arg-type]
    )
    plan = cc_roof_plan_asce7(SITE, b, area=Q_(20, "ft^2"))
    assert {z for z, _ in plan.regions} == set(cc_roof_zones(roof, Q_(theta, "deg")))
    assert plan.a.to("ft").magnitude == pytest.approx(3.0)  # max(min(3, 7.2), 1.2, 3) ft
    for z, c in plan.zones.items():
        g = cc_coefficient_asce7(
            "roof", z, Q_(20, "ft^2"), Q_(theta, "deg"), roof=roof, h_over_B=0.6
        )[1]
        assert c.p_neg.to("psf").magnitude == pytest.approx(min(_qh(18) * (g - 0.18), -16.0))
        assert figure in c.figure
    if roof != "hip":

        def area(poly):
            pts = [(x.to("ft").magnitude, y.to("ft").magnitude) for x, y in poly]
            return (
                abs(
                    sum(
                        x0 * y1 - x1 * y0
                        for (x0, y0), (x1, y1) in zip(pts, pts[1:] + pts[:1], strict=True)
                    )
                )
                / 2
            )

        assert sum(area(p) for _, p in plan.regions) == pytest.approx(30 * 60)
    steps = plan.working()
    assert steps[-1].drawing == "wind-cc-plan"
    assert "<svg" in steps[-1].svg()


def test_zone_plan_refuses_low_slopes() -> None:
    from calcpack.loads.wind_asce7_cc_plan import cc_roof_plan_asce7

    b = LowRiseBuildingASCE7(Q_(18, "ft"), Q_(30, "ft"), Q_(60, "ft"), Q_(5, "deg"))
    with pytest.raises(OutOfScopeError, match="7°"):
        cc_roof_plan_asce7(SITE, b, area=Q_(20, "ft^2"))
