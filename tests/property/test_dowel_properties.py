"""Invariants of the NDS 2018 yield limit equations (Table 12.3.1A): the governing value is the
least mode; double shear modes I_s, III_s and IV are twice the single-shear ones with the same
members, and mode I_m the same (the standard's own relations); swapping identical members
swaps modes I_m/I_s and III_m/III_s."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.nds.dowel import DowelJoint, Fastener, WoodMember, yield_limits
from calcpack.units import Q_

species = st.sampled_from(["Douglas Fir-Larch", "Southern Pine", "Hem-Fir", "Spruce-Pine-Fir"])
thick = st.floats(0.75, 5.5)
angle = st.floats(0.0, 90.0)
diam = st.sampled_from([0.25, 0.375, 0.5, 0.625, 0.75, 1.0])


def _joint(sp_s, sp_m, ts, tm, a_s, a_m, d, shear="single"):
    f = Fastener("bolt", "bolt", Q_(d, "inch"), Q_(45000.0, "psi"), "test dowel")
    return DowelJoint(
        f,
        WoodMember(Q_(ts, "inch"), sp_s, angle=Q_(a_s, "degree")),
        WoodMember(Q_(tm, "inch"), sp_m, angle=Q_(a_m, "degree")),
        shear=shear,
    )


@settings(max_examples=60, deadline=None)
@given(species, species, thick, thick, angle, angle, diam)
def test_governing_is_the_least_mode(sp_s, sp_m, ts, tm, a_s, a_m, d):
    y = yield_limits(_joint(sp_s, sp_m, ts, tm, a_s, a_m, d))
    least = min(v.to("lbf").magnitude for v in y.modes.values())
    assert y.Z.to("lbf").magnitude == least
    assert y.modes[y.governing].to("lbf").magnitude == least
    assert set(y.modes) == {"I_m", "I_s", "II", "III_m", "III_s", "IV"}


@settings(max_examples=60, deadline=None)
@given(species, species, thick, thick, angle, angle, diam)
def test_double_shear_is_twice_single_shear_side_modes(sp_s, sp_m, ts, tm, a_s, a_m, d):
    one = yield_limits(_joint(sp_s, sp_m, ts, tm, a_s, a_m, d))
    two = yield_limits(_joint(sp_s, sp_m, ts, tm, a_s, a_m, d, "double"))
    assert set(two.modes) == {"I_m", "I_s", "III_s", "IV"}
    assert two.modes["I_m"].m_as("lbf") == pytest.approx(one.modes["I_m"].m_as("lbf"))
    for k in ("I_s", "III_s", "IV"):
        assert two.modes[k].m_as("lbf") == pytest.approx(2 * one.modes[k].m_as("lbf"), rel=1e-12)


@settings(max_examples=40, deadline=None)
@given(species, thick, angle, diam)
def test_identical_members_swap_symmetrically(sp, t, a, d):
    y = yield_limits(_joint(sp, sp, t, t, a, a, d))
    assert y.modes["I_m"].m_as("lbf") == pytest.approx(y.modes["I_s"].m_as("lbf"))
    assert y.modes["III_m"].m_as("lbf") == pytest.approx(y.modes["III_s"].m_as("lbf"))
