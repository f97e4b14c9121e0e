"""ASCE/SEI 7-16 Chapter 27 Part 1 (directional procedure, rigid enclosed buildings): Eq. 27.3-1
p = q G C_p − q_i (GC_pi), with C_p of Figure 27.3-1 as recalled ("from memory"): walls
(windward 0.8; leeward −0.5, −0.3, −0.2 at L/B = 1, 2, ≥ 4; side −0.7); roofs normal to the
ridge with θ ≥ 10° (e.g. h/L ≤ 0.25 at 20°: −0.3 and 0.2; h/L = 0.5 at 25°: −0.3 and 0.2;
leeward −0.6 from 20°) and parallel to the ridge (h/L ≤ 0.5: −0.9 and −0.18 to h, −0.5 to 2h,
−0.3 beyond; h/L ≥ 1.0: −1.3 to h/2, −0.7 beyond); interpolation linear between values of the
same sign. q_h by Eq. 26.10-1 evaluated by hand (K_z of Table 26.10-1 note 1, exposure C:
α = 9.5, z_g = 900 ft, from memory). Tolerance 1e-9 relative (the same arithmetic), unless noted.
"""

from __future__ import annotations

import itertools

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.wind_asce7 import WindSiteASCE7
from calcpack.loads.wind_asce7_directional import (
    DirectionalBuildingASCE7,
    directional_wind_asce7,
)
from calcpack.refdata import read_table
from calcpack.units import Q_

SITE = WindSiteASCE7(V=Q_(115, "mph"), V_source="Figure 26.5-1B", exposure="C")


def _qh(h_ft, V=115.0):
    Kz = 2.01 * (max(h_ft, 15.0) / 900.0) ** (2 / 9.5)
    return 0.00256 * Kz * 1.0 * 0.85 * 1.0 * V**2


def _b(**kw):
    args = {"h": Q_(20, "ft"), "B": Q_(60, "ft"), "L": Q_(40, "ft"), "roof_slope": Q_(20, "deg")}
    return DirectionalBuildingASCE7(**(args | kw))


def test_walls_and_roof_normal_to_the_ridge_at_20_degrees():
    # h/L = 0.5, θ = 20°: windward roof −0.4 and 0.0, leeward roof −0.6;
    # L/B = 2/3: leeward wall −0.5
    r = directional_wind_asce7(SITE, _b())
    qh = _qh(20.0)
    assert r.qh.to("psf").magnitude == pytest.approx(qh, rel=1e-9)
    expected = {
        "windward wall": (0.8, 0.8),
        "leeward wall": (-0.5, -0.5),
        "side walls": (-0.7, -0.7),
        "windward roof": (-0.4, 0.0),
        "leeward roof": (-0.6, -0.6),
    }
    for name, (c1, c2) in expected.items():
        s = r.surface(name)
        assert (s.Cp, s.Cp2) == pytest.approx((c1, c2))
        # Eq. 27.3-1 with G = 0.85 and GCpi = ±0.18 (enclosed, Table 26.13-1)
        assert s.p[0].to("psf").magnitude == pytest.approx(qh * 0.85 * c1 - qh * 0.18)
        assert s.p[1].to("psf").magnitude == pytest.approx(qh * 0.85 * c1 + qh * 0.18)


def test_roof_interpolates_in_angle_and_h_over_L():
    # h/L = 0.375 (between 0.25 and 0.5), θ = 22.5° (between 20° and 25°)
    r = directional_wind_asce7(SITE, _b(h=Q_(15, "ft"), roof_slope=Q_(22.5, "deg")))
    at_025 = (-0.3 + -0.2) / 2, (0.2 + 0.3) / 2
    at_05 = (-0.4 + -0.3) / 2, (0.0 + 0.2) / 2
    want = ((at_025[0] + at_05[0]) / 2, (at_025[1] + at_05[1]) / 2)
    s = r.surface("windward roof")
    assert (s.Cp, s.Cp2) == pytest.approx(want)


def test_wind_parallel_to_the_ridge_zones():
    r = directional_wind_asce7(SITE, _b(L=Q_(60, "ft"), direction="parallel to ridge"))
    # h/L = 1/3 ≤ 0.5: −0.9 to h/2 and to h, −0.5 to 2h, −0.3 beyond (to the leeward edge)
    got = [(s.Cp, s.Cp2) for s in r.surfaces[3:]]
    assert got == [(-0.9, -0.18), (-0.9, -0.18), (-0.5, -0.18), (-0.3, -0.18)]
    assert r.surfaces[-1].end.to("ft").magnitude == pytest.approx(60.0)


def test_figure_columns_never_change_sign_between_neighbours():
    # the figure's rule "interpolate only between values of the same sign" holds by construction
    t = read_table("asce7_16_wind_cp_ch27.csv", key="key")
    groups: dict[tuple[str, float], list[tuple[float, float, float]]] = {}
    for row in t.rows.values():
        if row["surface"] in ("windward roof", "leeward roof"):
            groups.setdefault((row["surface"], row["ratio"]), []).append(
                (row["at"], row["cp1"], row["cp2"])
            )
    for pts in groups.values():
        pts.sort()
        for (_, a1, a2), (_, b1, b2) in itertools.pairwise(pts):
            assert a1 * b1 >= 0
            assert a2 * b2 >= 0


@settings(max_examples=20, deadline=None)
@given(st.floats(90.0, 200.0))
def test_pressures_scale_with_the_square_of_the_wind_speed(V):
    # Eq. 26.10-1 and 27.3-1: every pressure is proportional to V²
    base = directional_wind_asce7(SITE, _b())
    site = WindSiteASCE7(V=Q_(V, "mph"), V_source="given", exposure="C")
    other = directional_wind_asce7(site, _b())
    k = (V / 115.0) ** 2
    for s0, s1 in zip(base.surfaces, other.surfaces, strict=True):
        for p0, p1 in zip(s0.p, s1.p, strict=True):
            assert p1.to("psf").magnitude == pytest.approx(k * p0.to("psf").magnitude, abs=1e-9)


def test_refusals_name_the_limit():
    with pytest.raises(OutOfScopeError, match="1 Hz"):
        _b(rigid=False)
    with pytest.raises(OutOfScopeError, match="enclosure"):
        _b(enclosure="open")
    with pytest.raises(InputError, match="mansard_top"):
        _b(roof="mansard")
    with pytest.raises(InputError, match="roof"):
        _b(roof="dome")
    with pytest.raises(InputError, match="roof_slope"):
        _b(roof="flat")
    with pytest.raises(InputError, match="direction"):
        _b(direction="diagonal")
    with pytest.raises(InputError, match="h"):
        _b(h=Q_(-3, "ft"))


def test_directional_pressures_become_frame_load_cases():
    from calcpack.loads.roof_profiles import wind_profiles_asce7_directional

    r = directional_wind_asce7(SITE, _b(roof_slope=Q_(26.6, "deg")))
    profiles = wind_profiles_asce7_directional(r)
    # two windward C_p values × two GC_pi signs × wind from either side
    assert len(profiles) == 8
    ww, lw = r.surface("windward roof"), r.surface("leeward roof")
    first = profiles[0]
    assert first.values == (ww.p[0], lw.p[0])
    assert first.breaks[1].to("ft").magnitude == pytest.approx(20.0)  # the ridge, L/2
    assert profiles[1].values == (lw.p[0], ww.p[0])  # wind from the right
    par = directional_wind_asce7(SITE, _b(L=Q_(60, "ft"), direction="parallel to ridge"))
    frame = wind_profiles_asce7_directional(par, frame_at=Q_(30, "ft"))
    zone = next(s for s in par.surfaces if s.surface.startswith("roof 1h"))
    assert [p.values[0] for p in frame] == list(zone.p)  # 20 ft < 30 ft ≤ 40 ft: h to 2h
    with pytest.raises(InputError, match="frame_at"):
        wind_profiles_asce7_directional(par)
