"""EN 1991-1-4:2005+A1:2010 Eurocode 1, Actions on structures, Part 1-4: Wind actions (CEN,
2005), with the UK National Annex to BS EN 1991-1-4 (BSI); and Concise Eurocodes: Loadings on
Structures (BSI, 2010), whose wind examples follow the same steps.

The printed documents were not at hand: equations, Table 4.1, Table 7.1 and Tables 7.2 to 7.4
are recalled ("from memory"); each reference value is the printed equation evaluated by hand.
"""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError
from calcpack.loads.wind_en1991 import WindSiteEN, internal_pressure_en, peak_pressure_en
from calcpack.loads.wind_en1991_cpe import (
    BuildingEN,
    cpe_at_area,
    roof_cpe_en,
    wall_cpe_en,
    wind_pressures_en,
)
from calcpack.units import Q_

KN = "kN/m^2"


def _rec(vb0: float = 26.0, terrain: str = "II") -> WindSiteEN:
    return WindSiteEN(Q_(vb0, "m/s"), "national wind map", annex="recommended", terrain=terrain)  # type: ignore[arg-type]


def test_peak_pressure_eq_4_8_terrain_ii() -> None:
    """Eq. 4.3 to 4.10 (from memory), v_b,0 = 26 m/s, terrain II, z = 6 m:
    k_r = 0.19, c_r = 0.19 ln(120) = 0.9096, v_m = 23.65 m/s, I_v = 1/ln(120) = 0.2089,
    q_p = (1 + 7 × 0.2089) × ½ × 1.25 × 23.65² = 0.861 kN/m² (c_e ≈ 2.04, in line with the
    exposure factor curve of Figure 4.2 at 6 m, terrain II, from memory)."""
    p = peak_pressure_en(_rec(), Q_(6, "m"))
    lnz = math.log(6 / 0.05)
    vm = 0.19 * lnz * 26
    expect = (1 + 7 / lnz) * 0.5 * 1.25 * vm**2 / 1000
    assert p.qp.to(KN).magnitude == pytest.approx(expect, rel=1e-9)
    assert p.qp.to(KN).magnitude == pytest.approx(0.861, abs=0.001)  # 3 s.f. by hand
    assert (p.qp / p.qb).to("").magnitude == pytest.approx(2.04, abs=0.01)


def test_z_below_zmin_uses_zmin_terrain_iv() -> None:
    """Eq. 4.4: below z_min the value at z_min (terrain IV: z_0 = 1 m, z_min = 10 m, from
    memory): the same q_p at 3 m and at 10 m."""
    a = peak_pressure_en(_rec(terrain="IV"), Q_(3, "m"))
    b = peak_pressure_en(_rec(terrain="IV"), Q_(10, "m"))
    assert a.qp.to(KN).magnitude == pytest.approx(b.qp.to(KN).magnitude, rel=1e-12)


def test_uk_route_altitude_factor_and_exposure_factor() -> None:
    """UK NA (from memory): v_b,map = 22 m/s, A = 120 m, z = 7 m ≤ 10 m: c_alt = 1.12,
    v_b = 24.64 m/s, q_b = ½ × 1.226 × 24.64² = 0.3722 kN/m²; c_e = 2.3 read from Figure NA.7:
    q_p = 0.856 kN/m²; with c_o = 1.1 the factor ((1.1 + 0.6)/1.6)² = 1.1289."""
    kw = {"altitude": Q_(120, "m"), "c_e": 2.3, "c_e_source": "UK NA Figure NA.7"}
    p = peak_pressure_en(WindSiteEN(Q_(22, "m/s"), "UK NA Figure NA.1", **kw), Q_(7, "m"))
    qb = 0.5 * 1.226 * (22 * 1.12) ** 2 / 1000
    assert p.qb.to(KN).magnitude == pytest.approx(qb, rel=1e-9)
    assert p.qp.to(KN).magnitude == pytest.approx(2.3 * qb, rel=1e-9)
    site = WindSiteEN(Q_(22, "m/s"), "UK NA Figure NA.1", c_o=1.1, c_o_source="Annex A.3", **kw)
    p2 = peak_pressure_en(site, Q_(7, "m"))
    assert p2.qp.to(KN).magnitude == pytest.approx(2.3 * qb * (1.7 / 1.6) ** 2, rel=1e-9)


def test_uk_altitude_factor_above_10_m() -> None:
    """UK NA Eq. NA.2b (from memory): z = 12 m, A = 200 m: c_alt = 1 + 0.2 (10/12)^0.2."""
    kw = {"altitude": Q_(200, "m"), "c_e": 2.5, "c_e_source": "UK NA Figure NA.7"}
    p = peak_pressure_en(WindSiteEN(Q_(21, "m/s"), "UK NA Figure NA.1", **kw), Q_(12, "m"))
    calt = 1 + 0.2 * (10 / 12) ** 0.2
    assert p.vb.to("m/s").magnitude == pytest.approx(21 * calt, rel=1e-9)


def test_figure_7_2_log_rule() -> None:
    """Figure 7.2 (from memory): c_pe = c_pe,1 − (c_pe,1 − c_pe,10) log10 A for 1 < A < 10 m²."""
    assert cpe_at_area(-2.0, -1.2, Q_(0.5, "m^2")) == -2.0
    assert cpe_at_area(-2.0, -1.2, Q_(10, "m^2")) == -1.2
    assert cpe_at_area(-2.0, -1.2, Q_(5, "m^2")) == pytest.approx(-2.0 + 0.8 * math.log10(5))


def test_table_7_1_walls_interpolated_in_h_over_d() -> None:
    """Table 7.1 (from memory): D = +0.8 at h/d = 1, +0.7 at h/d ≤ 0.25; E = −0.5 and −0.3:
    at h/d = 0.625, D = +0.75, E = −0.4 (c_pe,10)."""
    assert wall_cpe_en(0.625, "D", Q_(10, "m^2")) == pytest.approx(0.75)
    assert wall_cpe_en(0.625, "E", Q_(10, "m^2")) == pytest.approx(-0.4)
    assert wall_cpe_en(0.1, "A", Q_(1, "m^2")) == pytest.approx(-1.4)


def test_table_7_4a_duopitch_interpolated_in_pitch() -> None:
    """Table 7.4a, θ = 0°, zone H (from memory): −0.3/+0.2 at 15°, −0.2/+0.4 at 30°;
    at 20°: −0.2667 and +0.2667 (linear between values of the same sign)."""
    v = roof_cpe_en("duopitch", 0, Q_(20, "deg"), "H", Q_(10, "m^2"))
    assert v["neg"] == pytest.approx(-0.3 + 0.1 / 3)
    assert v["pos"] == pytest.approx(0.2 + 0.2 / 3)
    # Table 7.4b, θ = 90°, zone I at 45°: −0.5 only
    assert roof_cpe_en("duopitch", 90, Q_(45, "deg"), "I", Q_(10, "m^2")) == {"neg": -0.5}


def test_duopitch_cases_do_not_mix_signs_on_a_face() -> None:
    """Table 7.4a note (from memory): for pitches to 45°, four cases combine the largest or
    smallest values of F, G, H with those of I, J; no mixing of signs on one face."""
    b = BuildingEN("duopitch", Q_(22, "deg"), Q_(5, "m"), Q_(15, "m"), Q_(8, "m"))
    w = wind_pressures_en(_rec(), b, theta=0)
    assert len(w.roof_cases) == 4
    for case in w.roof_cases.values():
        assert len({math.copysign(1, case[z]) for z in "FGH" if case[z] != 0}) <= 1
    assert w.e.to("m").magnitude == pytest.approx(10.0)  # e = min(b = 15, 2h = 10)
    # net pressure q_p (c_pe − c_pi) with c_pi = +0.2 and −0.3 (§7.2.9(6) note 2)
    assert w.cpi == (0.2, -0.3)
    case = next(iter(w.roof_cases))
    assert w.net("H", 0.2, case) == w.qp * (w.roof_cases[case]["H"] - 0.2)


def test_internal_pressure_dominant_face() -> None:
    """§7.2.9(5) (from memory): c_pi = 0.75 c_pe at a ratio of 2, 0.90 c_pe at 3 or more."""
    assert internal_pressure_en(2.0, 0.8) == pytest.approx((0.6,))
    assert internal_pressure_en(4.0, 0.8) == pytest.approx((0.72,))


@pytest.mark.parametrize(
    ("kwargs", "name"),
    [
        ({"vb_map": Q_(-5, "m/s")}, "vb_map"),
        ({"vb_map": Q_(25, "m")}, "vb_map"),
        ({"vb_source": " "}, "vb_source"),
        ({"altitude": None}, "altitude"),
        ({"c_e": None}, "c_e"),
        ({"annex": "French"}, "annex"),
        ({"annex": "recommended", "terrain": "V"}, "terrain"),
        ({"c_dir": 1.2}, "c_dir"),
    ],
)
def test_bad_site_input_names_the_input(kwargs: dict, name: str) -> None:
    base = {
        "vb_map": Q_(22, "m/s"),
        "vb_source": "UK NA Figure NA.1",
        "altitude": Q_(50, "m"),
        "c_e": 2.0,
        "c_e_source": "UK NA Figure NA.7",
    }
    base.update(kwargs)
    with pytest.raises(InputError) as e:
        WindSiteEN(**base)
    assert e.value.name == name
    assert name in str(e.value)


def test_out_of_scope_refused_naming_the_limit() -> None:
    with pytest.raises(InputError, match="15 m"):
        BuildingEN("duopitch", Q_(20, "deg"), Q_(18, "m"), Q_(30, "m"), Q_(20, "m"))
    with pytest.raises(InputError, match="pitch"):
        BuildingEN("duopitch", Q_(2, "deg"), Q_(5, "m"), Q_(30, "m"), Q_(20, "m"))
    tall = BuildingEN("monopitch", Q_(10, "deg"), Q_(9, "m"), Q_(8, "m"), Q_(20, "m"))
    with pytest.raises(InputError, match=r"Figure 7\.4"):
        wind_pressures_en(_rec(), tall, theta=0)
    b = BuildingEN("duopitch", Q_(20, "deg"), Q_(5, "m"), Q_(20, "m"), Q_(10, "m"))
    with pytest.raises(InputError, match="theta"):
        wind_pressures_en(_rec(), b, theta=180)
    with pytest.raises(InputError, match="z"):
        peak_pressure_en(_rec(), Q_(20, "m"))
