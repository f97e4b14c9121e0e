"""EN 1991-1-3:2003 Eurocode 1, Actions on structures, Part 1-3: Snow loads (CEN, 2003), with
the UK National Annex to BS EN 1991-1-3:2003 (BSI); and Concise Eurocodes: Loadings on
Structures (BSI, 2010), whose snow examples follow the same pattern.

The printed documents were not at hand: the equations and limits are recalled ("from memory")
and each reference value is the printed equation evaluated by hand on the inputs stated.
"""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.loads.snow_en1991 import (
    SnowDriftEN,
    SnowRoofEN,
    SnowSiteEN,
    mu1_en,
    mu2_en,
    roof_snow_en,
    snow_drift_en,
)
from calcpack.units import Q_

KN = "kN/m^2"


def test_uk_altitude_rule_eq_na_1() -> None:
    """UK NA Eq. NA.1 (from memory): zone 3, A = 200 m:
    s_k = 0.15 + (0.1 × 3 + 0.05) + (200 − 100)/525 = 0.6905 kN/m² (hand arithmetic)."""
    r = roof_snow_en(
        SnowSiteEN(altitude=Q_(200, "m"), zone=3), SnowRoofEN("monopitch", Q_(10, "deg"))
    )
    assert r.sk.to(KN).magnitude == pytest.approx(0.5 + 100 / 525, rel=1e-12)  # exact arithmetic
    # monopitch at 10°: μ1 = 0.8 (Table 5.2), Ce = Ct = 1.0 (UK NA): s = 0.8 s_k
    assert r.cases["(i)"][0].to(KN).magnitude == pytest.approx(0.8 * (0.5 + 100 / 525))


def test_table_5_2_mu1_mu2() -> None:
    """Table 5.2 (from memory): μ1 = 0.8 to 30°, 0.8(60 − α)/30 to 60°, 0 beyond;
    μ2 = 0.8 + 0.8α/30 to 30°, 1.6 to 60°."""
    assert mu1_en(Q_(30, "deg")) == pytest.approx(0.8)
    assert mu1_en(Q_(45, "deg")) == pytest.approx(0.4)
    assert mu1_en(Q_(60, "deg")) == 0.0
    assert mu1_en(Q_(45, "deg"), sliding_prevented=True) == pytest.approx(0.8)  # §5.3.2(2)
    assert mu2_en(Q_(15, "deg")) == pytest.approx(1.2)
    assert mu2_en(Q_(45, "deg")) == pytest.approx(1.6)


def test_duopitch_drifted_cases_figure_5_3() -> None:
    """Figure 5.3 (from memory): recommended values, s_k = 0.5 kN/m² given, windswept Ce = 0.8
    (Table 5.1), pitches 20° and 40°: μ1 = 0.8 and 0.5333; case (i) 0.32 / 0.2133 kN/m²,
    case (ii) 0.16 / 0.2133, case (iii) 0.32 / 0.1067 (hand arithmetic)."""
    site = SnowSiteEN(
        annex="recommended", sk=Q_(0.5, KN), sk_source="national map", topography="windswept"
    )
    r = roof_snow_en(site, SnowRoofEN("duopitch", Q_(20, "deg"), Q_(40, "deg")))
    got = {k: [v.to(KN).magnitude for v in vals] for k, vals in r.cases.items()}
    assert got["(i)"] == pytest.approx([0.32, 0.8 * 0.8 * 20 / 30 * 0.5])
    assert got["(ii)"] == pytest.approx([0.16, 0.8 * 0.8 * 20 / 30 * 0.5])
    assert got["(iii)"] == pytest.approx([0.32, 0.4 * 0.8 * 20 / 30 * 0.5])


def test_roof_step_figure_5_7() -> None:
    """§5.3.6 (from memory): s_k = 0.6 kN/m², h = 2 m, b1 = 10 m, b2 = 6 m, upper roof 10°:
    μ_w = (10 + 6)/(2 × 2) = 4.0 ≤ γh/s_k = 6.67 and ≤ 4; μ_s = 0; μ2 = 4.0;
    l_s = 2h = 4 m → 5 m (lower limit); peak 4.0 × 0.6 = 2.4 kN/m², undrifted 0.48."""
    site = SnowSiteEN(annex="recommended", sk=Q_(0.6, KN), sk_source="map")
    d = snow_drift_en(
        site,
        SnowDriftEN(
            "roof step", Q_(2, "m"), b1=Q_(10, "m"), b2=Q_(6, "m"), alpha_upper=Q_(10, "deg")
        ),
    )
    assert d.mu2 == pytest.approx(4.0)
    assert d.ls.to("m").magnitude == pytest.approx(5.0)
    assert d.s_peak.to(KN).magnitude == pytest.approx(2.4)
    assert d.s_undrifted.to(KN).magnitude == pytest.approx(0.48)
    assert d.load_at(Q_(2.5, "m")).to(KN).magnitude == pytest.approx((2.4 + 0.48) / 2)


def test_roof_step_capped_by_snow_depth_and_sliding() -> None:
    """§5.3.6 (from memory): s_k = 1.0, h = 1 m: γh/s_k = 2.0 caps μ_w (b1 + b2 = 20 m would give
    10); upper roof 30°: μ_s = μ1 b1/l_s with half the upper slope's load 0.5 × 0.8 × 12 = 4.8
    spread as a triangle over l_s = 5 m: μ_s = 2 × 4.8/5 = 1.92; μ2 = 3.92 (hand arithmetic)."""
    site = SnowSiteEN(annex="recommended", sk=Q_(1.0, KN), sk_source="map")
    inp = SnowDriftEN(
        "roof step", Q_(1, "m"), b1=Q_(12, "m"), b2=Q_(8, "m"), alpha_upper=Q_(30, "deg")
    )
    d = snow_drift_en(site, inp)
    assert d.derivation["mu_w"].magnitude == pytest.approx(2.0)
    assert d.derivation["mu_s"].magnitude == pytest.approx(1.92)
    assert d.mu2 == pytest.approx(3.92)


def test_obstruction_eq_6_1() -> None:
    """§6.2 (from memory): parapet h = 0.6 m, s_k = 0.5: μ2 = 2 × 0.6/0.5 = 2.4 → 2.0 (upper
    limit); l_s = 1.2 → 5 m; lower roof only 3 m long: cut off at 2.0 − (2.0 − 0.8) × 3/5 = 1.28
    times s_k = 0.64 kN/m² at the edge."""
    site = SnowSiteEN(annex="recommended", sk=Q_(0.5, KN), sk_source="map")
    d = snow_drift_en(site, SnowDriftEN("obstruction", Q_(0.6, "m"), lower_width=Q_(3, "m")))
    assert d.mu2 == pytest.approx(2.0)
    assert d.s_edge.to(KN).magnitude == pytest.approx(0.64)
    assert d.load_at(Q_(3.5, "m")).magnitude == 0.0


@pytest.mark.parametrize(
    ("kwargs", "name"),
    [
        ({"altitude": Q_(600, "m"), "zone": 2}, "altitude"),
        ({"altitude": Q_(100, "m"), "zone": 7}, "zone"),
        ({"zone": 2}, "altitude"),
        ({"annex": "recommended"}, "sk"),
        ({"sk": Q_(-0.2, KN), "sk_source": "map"}, "sk"),
        ({"sk": Q_(0.5, "kN/m"), "sk_source": "map"}, "sk"),
        ({"sk": Q_(0.5, KN)}, "sk_source"),
        ({"altitude": Q_(100, "m"), "zone": 2, "topography": "exposed"}, "topography"),
    ],
)
def test_bad_site_input_names_the_input(kwargs: dict, name: str) -> None:
    with pytest.raises(InputError) as e:
        SnowSiteEN(**kwargs)
    assert e.value.name == name
    assert name in str(e.value)


def test_bad_roof_and_drift_input() -> None:
    with pytest.raises(InputError, match="alpha1"):
        SnowRoofEN("monopitch", Q_(95, "deg"))
    with pytest.raises(InputError, match="shape"):
        SnowRoofEN("cylindrical", Q_(10, "deg"))  # type: ignore[arg-type]
    with pytest.raises(InputError, match="b1"):
        SnowDriftEN("roof step", Q_(1, "m"))
    with pytest.raises(InputError, match="h"):
        SnowDriftEN("obstruction", Q_(0, "m"))
    with pytest.raises(InputError, match="alpha"):
        mu2_en(Q_(65, "deg"))
