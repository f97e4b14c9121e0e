"""ASCE/SEI 7-16 Chapter 27 Part 1 beyond gable roofs of rigid buildings: monoslope and hip
roofs (Figure 27.3-1 and its note on monoslope roofs), the windward wall's q_z with height
(Eq. 26.10-1, K_z of Table 26.10-1 note 1) and flexible buildings (gust-effect factor G_f,
§26.11.5, Eqs. 26.11-6 to 26.11-16); Coulbourne and Stafford, Wind Loads: Guide to the Wind
Load Provisions of ASCE 7-16 (ASCE Press, 2020), followed in pattern only.

Neither the standard nor the guide was at hand: C_p values and the terrain constants of Table
26.11-1 (exposure C: α = 9.5, z_g = 900 ft, b̄ = 0.65, ᾱ = 1/6.5, c = 0.20, ℓ = 500 ft,
ε̄ = 1/5, z_min = 15 ft; g_Q = g_v = 3.4) are as recalled ("from memory"); every formula is
evaluated here by hand, independently of calcpack's code. Tolerance 1e-9 relative for the
same arithmetic, unless noted.
"""

from __future__ import annotations

import math

import pytest

from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.wall_cases import wall_line_loads, wall_profiles_asce7_directional
from calcpack.loads.wind_asce7 import WindSiteASCE7
from calcpack.loads.wind_asce7_directional import (
    DirectionalBuildingASCE7,
    directional_wind_asce7,
)
from calcpack.loads.wind_asce7_gust import BuildingVibration, gust_effect_factor_asce7
from calcpack.units import Q_

SITE = WindSiteASCE7(V=Q_(115, "mph"), V_source="Figure 26.5-1B", exposure="C")


def _kz(z_ft: float) -> float:
    return 2.01 * (max(z_ft, 15.0) / 900.0) ** (2 / 9.5)


def _q(z_ft: float, V: float = 115.0) -> float:
    return 0.00256 * _kz(z_ft) * 1.0 * 0.85 * 1.0 * V**2


def _b(**kw):
    args = {"h": Q_(20, "ft"), "B": Q_(60, "ft"), "L": Q_(40, "ft"), "roof_slope": Q_(20, "deg")}
    return DirectionalBuildingASCE7(**(args | kw))


def test_monoslope_roof_is_wholly_windward_or_leeward():
    """Figure 27.3-1 note (from memory): a monoslope roof is entirely windward or leeward.
    h/L = 0.5, θ = 20°: windward −0.4 and 0.0; leeward −0.6."""
    low = directional_wind_asce7(SITE, _b(roof="monoslope", windward_eave="low"))
    high = directional_wind_asce7(SITE, _b(roof="monoslope", windward_eave="high"))
    assert [s.surface for s in low.surfaces[3:]] == ["windward roof"]
    assert (low.surfaces[3].Cp, low.surfaces[3].Cp2) == pytest.approx((-0.4, 0.0))
    assert [s.surface for s in high.surfaces[3:]] == ["leeward roof"]
    assert high.surfaces[3].Cp == pytest.approx(-0.6)
    qh = _q(20.0)
    assert high.surfaces[3].p[0].to("psf").magnitude == pytest.approx(qh * (0.85 * -0.6 - 0.18))


def test_monoslope_below_10_degrees_takes_zones_by_distance():
    """θ < 10°: Figure 27.3-1 by distance from the windward edge (h/L = 0.5: −0.9 to h)."""
    r = directional_wind_asce7(SITE, _b(roof="monoslope", roof_slope=Q_(5, "deg")))
    assert r.surfaces[3].surface == "roof 0h to 0.5h"
    assert (r.surfaces[3].Cp, r.surfaces[3].Cp2) == pytest.approx((-0.9, -0.18))


def test_hip_roof_slopes_by_their_orientation():
    """Hip roof, wind normal to the ridge: main slopes as a gable roof's (θ = 20°, h/L = 0.5:
    −0.4/0.0 and −0.6); hip ends parallel to the wind by distance (−0.9 to h, from memory).
    Wind parallel to the ridge, hip slope 30°: the windward hip end −0.2/0.2 (θ = 30°,
    h/L = 20/60 between 0.25 (−0.2, 0.3) and 0.5 (−0.2, 0.2): 0.2667, from memory)."""
    r = directional_wind_asce7(SITE, _b(roof="hip"))
    names = [s.surface for s in r.surfaces]
    assert names[3:5] == ["windward roof", "leeward roof"]
    assert r.surface("hip ends 0h to 0.5h").Cp == pytest.approx(-0.9)
    p = directional_wind_asce7(
        SITE,
        _b(roof="hip", L=Q_(60, "ft"), direction="parallel to ridge", hip_slope=Q_(30, "deg")),
    )
    w = p.surface("windward hip end")
    assert w.Cp == pytest.approx(-0.2)
    assert w.Cp2 == pytest.approx(0.3 + (0.2 - 0.3) * (20 / 60 - 0.25) / 0.25)
    assert p.surface("leeward hip end").Cp < 0
    flat = directional_wind_asce7(SITE, _b(roof="hip", roof_slope=Q_(6, "deg")))
    assert all(s.surface.startswith("roof") for s in flat.surfaces[3:])  # θ < 10°: by distance


def test_windward_wall_takes_q_z_at_each_height():
    """h = 45 ft: bands 0–15, 15–20, 20–25, 25–30, 30–40, 40–45 ft (Table 26.10-1 heights),
    each at q_z of its top; p = q_z G C_p − q_h GC_pi (Eq. 27.3-1), G = 0.85, C_p = 0.8."""
    r = directional_wind_asce7(SITE, _b(h=Q_(45, "ft")))
    tops = [b.top.to("ft").magnitude for b in r.windward_profile]
    assert tops == pytest.approx([15, 20, 25, 30, 40, 45])
    qh = _q(45.0)
    for band in r.windward_profile:
        z = band.top.to("ft").magnitude
        assert band.Kz == pytest.approx(_kz(z), rel=1e-9)
        assert band.qz.to("psf").magnitude == pytest.approx(_q(z), rel=1e-9)
        want = _q(z) * 0.85 * 0.8 - qh * 0.18
        assert band.p_pos_gcpi.to("psf").magnitude == pytest.approx(want, rel=1e-9)
    # at h the profile equals the windward wall's value at q_h
    top, at_h = r.windward_profile[-1].p_pos_gcpi, r.surface("windward wall").p[0]
    assert top.to("psf").magnitude == pytest.approx(at_h.to("psf").magnitude, rel=1e-12)
    assert r.windward_profile[0].qz.to("psf").magnitude == pytest.approx(24.4, abs=0.05)


def test_windward_wall_as_stepped_line_loads_on_a_stud():
    """A stud from 12 ft to 24 ft at 16 in. centres: bands 12–15, 15–20, 20–24 ft; w = p × s."""
    r = directional_wind_asce7(SITE, _b(h=Q_(45, "ft"), wall_levels=(Q_(15, "ft"), Q_(20, "ft"))))
    cases = wall_profiles_asce7_directional(r)
    assert [c.case for c in cases][:2] == [
        "W normal to ridge windward wall +GCpi",
        "W normal to ridge leeward wall +GCpi",
    ]
    loads = wall_line_loads(cases[0], Q_(16, "inch"), bottom=Q_(12, "ft"), top=Q_(24, "ft"))
    assert [(x.start.to("ft").magnitude, x.end.to("ft").magnitude) for x in loads] == [
        (0, 3),
        (3, 8),
        (8, 12),
    ]
    qh = _q(45.0)
    for load, z in zip(loads, (15.0, 20.0, 45.0), strict=True):
        want = (_q(z) * 0.85 * 0.8 - qh * 0.18) * 16 / 12
        assert load.w.to("plf").magnitude == pytest.approx(want, rel=1e-9)
    with pytest.raises(InputError, match="top"):
        wall_line_loads(cases[0], Q_(16, "inch"), bottom=Q_(12, "ft"), top=Q_(10, "ft"))
    with pytest.raises(InputError, match="levels"):
        _b(h=Q_(45, "ft"), wall_levels=(Q_(50, "ft"),))


def _gust_by_hand(h, B, L, n1, beta, V=115.0):
    zbar = max(0.6 * h, 15.0)
    Iz = 0.20 * (33.0 / zbar) ** (1 / 6)
    Lz = 500.0 * (zbar / 33.0) ** (1 / 5)
    Q = math.sqrt(1 / (1 + 0.63 * ((B + h) / Lz) ** 0.63))
    G = 0.925 * (1 + 1.7 * 3.4 * Iz * Q) / (1 + 1.7 * 3.4 * Iz)
    Vz = 0.65 * (zbar / 33.0) ** (1 / 6.5) * V * 88 / 60
    N1 = n1 * Lz / Vz
    Rn = 7.47 * N1 / (1 + 10.3 * N1) ** (5 / 3)

    def rl(eta):
        return 1 / eta - (1 - math.exp(-2 * eta)) / (2 * eta**2)

    Rh, RB, RL = rl(4.6 * n1 * h / Vz), rl(4.6 * n1 * B / Vz), rl(15.4 * n1 * L / Vz)
    R = math.sqrt(1 / beta * Rn * Rh * RB * (0.53 + 0.47 * RL))
    gR = math.sqrt(2 * math.log(3600 * n1)) + 0.577 / math.sqrt(2 * math.log(3600 * n1))
    Gf = 0.925 * (1 + 1.7 * Iz * math.sqrt(3.4**2 * Q**2 + gR**2 * R**2)) / (1 + 1.7 * 3.4 * Iz)
    return G, Gf


def test_gust_effect_factor_rigid_and_flexible():
    """§26.11.4 and §26.11.5 by hand: h = 200 ft, B = L = 100 ft, n1 = 0.4 Hz, β = 0.01,
    exposure C, V = 115 mph (mean hourly speed from V in ft/s, 88/60 ft/s per mph)."""
    G, Gf = _gust_by_hand(200.0, 100.0, 100.0, 0.4, 0.01)
    vib = BuildingVibration(Q_(0.4, "Hz"), "modal analysis", damping=0.01)
    g = gust_effect_factor_asce7(
        SITE, h=Q_(200, "ft"), B=Q_(100, "ft"), L=Q_(100, "ft"), vibration=vib
    )
    assert g.flexible
    assert g.G_rigid == pytest.approx(G, rel=1e-9)
    assert pytest.approx(Gf, rel=1e-9) == g.G
    rigid = gust_effect_factor_asce7(SITE, h=Q_(200, "ft"), B=Q_(100, "ft"), L=Q_(100, "ft"))
    assert not rigid.flexible
    assert pytest.approx(G, rel=1e-9) == rigid.G


def test_flexible_building_uses_g_f_in_eq_27_3_1():
    vib = BuildingVibration(Q_(0.5, "Hz"), "modal analysis", damping=0.015)
    b = _b(h=Q_(180, "ft"), B=Q_(90, "ft"), L=Q_(120, "ft"), roof_slope=Q_(0, "deg"),
           roof="flat", rigid=False, vibration=vib)  # fmt: skip
    r = directional_wind_asce7(SITE, b)
    _, Gf = _gust_by_hand(180.0, 90.0, 120.0, 0.5, 0.015)
    assert pytest.approx(Gf, rel=1e-9) == r.G
    side = r.surface("side walls")
    assert side.p[0].to("psf").magnitude == pytest.approx(_q(180.0) * (Gf * -0.7 - 0.18))
    assert any("G_f" in str(s._repr_mimebundle_()["text/plain"]) for s in r.working())


def test_flexible_building_refusals():
    with pytest.raises(InputError, match="damping"):
        directional_wind_asce7(
            SITE, _b(rigid=False, vibration=BuildingVibration(Q_(0.5, "Hz"), "analysis"))
        )
    with pytest.raises(OutOfScopeError, match="1 Hz"):
        _b(rigid=False, vibration=BuildingVibration(Q_(2.0, "Hz"), "analysis", 0.02))
    with pytest.raises(InputError, match="n1"):
        BuildingVibration(Q_(0.4, "s"), "analysis", 0.01)
    with pytest.raises(InputError, match="damping"):
        BuildingVibration(Q_(0.4, "Hz"), "analysis", 0.5)


def test_working_ends_with_the_elevation_sketch():
    r = directional_wind_asce7(SITE, _b(h=Q_(45, "ft")))
    steps = r.working()
    assert steps[-1].drawing == "wind-elevation"
    svg = steps[-1].svg()
    assert "<svg" in svg
    assert f"{r.windward_profile[0].p_pos_gcpi.magnitude:+.3g}" in svg
    bundle = r._repr_mimebundle_()
    assert "Windward wall: q_z with height" in bundle["text/plain"]
    assert "<svg" in bundle["text/html"] or "<img" in bundle["text/html"]


def test_monoslope_and_hip_frames_take_their_roof_pressures():
    """Frame cases: a monoslope roof wholly windward carries one value across its span; a hip
    roof's frames carry the main slopes (the hip ends are not on the frame)."""
    from calcpack.loads.roof_profiles import wind_profiles_asce7_directional

    mono = directional_wind_asce7(SITE, _b(roof="monoslope", windward_eave="low"))
    cases = wind_profiles_asce7_directional(mono)
    roof = mono.surface("windward roof")
    assert [c.values for c in cases] == [(p,) for p in roof.p]
    assert all(c.breaks[-1] == mono.building.L for c in cases)
    assert cases[0].case.endswith("low eave")
    hip = directional_wind_asce7(SITE, _b(roof="hip"))
    hcases = wind_profiles_asce7_directional(hip)
    ww, lw = hip.surface("windward roof"), hip.surface("leeward roof")
    assert hcases[0].values == (ww.p[0], lw.p[0])


def test_si_building_steps_at_metric_heights_and_agrees_with_us():
    """An SI building (h = 13.5 m) steps at 5, 6, 7.5, 9, 12 m and 13.5 m; each band's q_z is
    Eq. 26.10-1 at its top, the same as the US form at the same height (0.613 vs 0.00256,
    to 3 figures)."""
    site = WindSiteASCE7(V=Q_(115, "mph").to("m/s"), V_source="Figure 26.5-1B", exposure="C")
    b = DirectionalBuildingASCE7(h=Q_(13.5, "m"), B=Q_(18, "m"), L=Q_(12, "m"),
                                 roof_slope=Q_(20, "deg"))  # fmt: skip
    r = directional_wind_asce7(site, b)
    assert [x.top.to("m").magnitude for x in r.windward_profile] == pytest.approx(
        [5, 6, 7.5, 9, 12, 13.5]
    )
    for band in r.windward_profile:
        z_ft = band.top.to("ft").magnitude
        assert band.qz.to("psf").magnitude == pytest.approx(_q(z_ft), rel=2e-3)


def test_mansard_top_and_leeward_slope_are_leeward_surfaces():
    """Figure 27.3-1 note on mansard roofs (from memory): the top and the leeward inclined
    surface take the table's leeward value. θ = 70°, h = 20 ft, L = 40 ft (h/L = 0.5), top
    16 ft: windward 0.01θ = 0.7 (θ >= 60°), leeward −0.6 (h/L = 0.5, θ >= 20°); the
    inclined surfaces 12 ft each on plan."""
    from calcpack.loads.roof_profiles import wind_profiles_asce7_directional

    r = directional_wind_asce7(
        SITE, _b(roof="mansard", roof_slope=Q_(70, "deg"), mansard_top=Q_(16, "ft"))
    )
    assert [s.surface for s in r.surfaces[3:]] == ["windward roof", "roof top", "leeward roof"]
    assert r.surface("windward roof").Cp == pytest.approx(0.7)
    assert r.surface("roof top").Cp == pytest.approx(-0.6)
    assert r.surface("leeward roof").Cp == pytest.approx(-0.6)
    assert r.surface("roof top").start.to("ft").magnitude == pytest.approx(12.0)
    assert r.surface("roof top").end.to("ft").magnitude == pytest.approx(28.0)
    frame = wind_profiles_asce7_directional(r)[0]
    assert [x.to("ft").magnitude for x in frame.breaks] == pytest.approx([0, 12, 28, 40])
    with pytest.raises(InputError, match="mansard_top"):
        _b(roof="mansard", roof_slope=Q_(70, "deg"), mansard_top=Q_(50, "ft"))


def test_approximate_natural_frequency_section_26_11_3():
    """§26.11.3 (from memory): n_a = 22.2/h^0.8 (steel moment frame), 43.5/h^0.9 (concrete
    moment frame), 75/h (other); h = 150 ft: 0.4185, 0.4722 (by hand), 0.5 Hz: all flexible."""
    from calcpack.loads.wind_asce7_gust import approximate_vibration_asce7

    h = Q_(150, "ft")
    steel = approximate_vibration_asce7(h, "steel moment frame", damping=0.01)
    assert steel.n1.to("Hz").magnitude == pytest.approx(22.2 / 150**0.8, rel=1e-12)
    assert steel.flexible
    assert "Eq. 26.11-2" in steel.n1_source
    conc = approximate_vibration_asce7(h, "concrete moment frame")
    assert conc.n1.to("Hz").magnitude == pytest.approx(43.5 / 150**0.9, rel=1e-12)
    other = approximate_vibration_asce7(Q_(45.72, "m"), "other steel or concrete")
    assert other.n1.to("Hz").magnitude == pytest.approx(0.5, rel=1e-9)
    with pytest.raises(OutOfScopeError, match="300 ft"):
        approximate_vibration_asce7(Q_(320, "ft"), "steel moment frame")
    with pytest.raises(OutOfScopeError, match="C_w"):
        approximate_vibration_asce7(h, "shear wall")
    with pytest.raises(InputError, match="system"):
        approximate_vibration_asce7(h, "braced frame")  # type: ignore[arg-type]
