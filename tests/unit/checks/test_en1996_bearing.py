"""EN 1996-1-1 §6.1.3 refusals, bounds of β and the sketch."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.en1996 import MasonryWall, Padstone, check_en1996_bearing
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_


def _wall(**kw):
    base = {"t": Q_(102.5, "mm"), "f_k": Q_(4, "MPa"), "h_c": Q_(2.4, "m")}
    return MasonryWall(**{**base, **kw})


def test_eccentric_load_beyond_t_over_4_is_refused():
    with pytest.raises(OutOfScopeError, match=r"t/4.*6.1.3"):
        check_en1996_bearing(
            _wall(),
            N_Ed=Q_(10, "kN"),
            bearing_length=Q_(100, "mm"),
            bearing_width=Q_(50, "mm"),
            eccentricity=Q_(30, "mm"),
        )


def test_bearing_wider_than_the_padstone_is_refused():
    with pytest.raises(InputError, match=r"bearing_width|wider"):
        check_en1996_bearing(
            _wall(),
            N_Ed=Q_(10, "kN"),
            bearing_length=Q_(100, "mm"),
            bearing_width=Q_(150, "mm"),
            padstone=Padstone(Q_(300, "mm"), Q_(100, "mm"), Q_(100, "mm")),
        )


def test_unknown_execution_class_names_the_input():
    with pytest.raises(InputError, match="execution"):
        _wall(execution=3)


@settings(deadline=None, max_examples=30)  # each example runs the whole check
@given(st.floats(0, 3000), st.floats(50, 600), st.floats(0.5, 4.0))
def test_beta_within_its_bounds(a1, lb, hc):
    r = check_en1996_bearing(
        _wall(a_1=Q_(a1, "mm"), h_c=Q_(hc, "m")),
        N_Ed=Q_(10, "kN"),
        bearing_length=Q_(lb, "mm"),
        bearing_width=Q_(100, "mm"),
    )
    cap = min(1.25 + a1 / (2 * hc * 1e3), 1.5)
    assert 1.0 <= r.beta <= cap + 1e-12


def test_sketch_shows_the_spread_length():
    r = check_en1996_bearing(
        _wall(a_1=Q_(150, "mm")),
        N_Ed=Q_(10, "kN"),
        bearing_length=Q_(100, "mm"),
        bearing_width=Q_(100, "mm"),
        padstone=Padstone(Q_(440, "mm"), Q_(100, "mm"), Q_(150, "mm")),
    )
    svg = r.svg()
    assert svg.startswith("<?xml")
    assert "mid-height" in svg
    assert len(r.working()) > 10
