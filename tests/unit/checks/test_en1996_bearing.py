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


@pytest.mark.parametrize(
    ("length", "width", "start", "pattern"),
    [
        # wider than the padstone it sits on
        (100, 150, None, r"bearing_width|wider"),
        # longer than the padstone (centred)
        (500, 100, None, r"bearing_length.*440 mm.*500 mm"),
        # off the padstone's far end: at most 440 - 100 = 340 mm from its end
        (100, 100, 350, r"end_to_bearing.*at most 340 mm.*got .* = 350 mm"),
    ],
)
def test_bearing_that_does_not_fit_on_the_padstone_is_refused(length, width, start, pattern):
    pad = Padstone(
        Q_(440, "mm"),
        Q_(100, "mm"),
        Q_(150, "mm"),
        end_to_bearing=None if start is None else Q_(start, "mm"),
    )
    with pytest.raises(InputError, match=pattern):
        check_en1996_bearing(
            _wall(),
            N_Ed=Q_(10, "kN"),
            bearing_length=Q_(length, "mm"),
            bearing_width=Q_(width, "mm"),
            padstone=pad,
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


def test_negative_end_to_bearing_is_refused():
    with pytest.raises(InputError, match="end_to_bearing"):
        Padstone(Q_(440, "mm"), Q_(100, "mm"), Q_(150, "mm"), end_to_bearing=Q_(-5, "mm"))


def _capacity(wall, pad, bl, bw):
    r = check_en1996_bearing(
        wall, N_Ed=Q_(10, "kN"), bearing_length=bl, bearing_width=bw, padstone=pad
    )
    return (
        r.checks["Masonry bearing (6.1.3)"].capacity.to("kN").magnitude,
        r.checks["Padstone bearing (EN 1992-1-1 6.7)"].capacity.to("kN").magnitude,
    )


@settings(deadline=None, max_examples=25)  # each example runs the check three times
@given(
    st.floats(200, 900),  # padstone length, mm
    st.floats(0.05, 0.9),  # bearing length as a share of it
    st.floats(50, 300),  # padstone depth, mm
    st.floats(0, 1),  # two positions between the padstone's end (0) and centred (1)
    st.floats(0, 1),
    st.one_of(st.none(), st.floats(0, 1500)),  # padstone to the wall end, mm
    st.booleans(),  # far from a wall end: move towards the right end instead
)
def test_moving_the_bearing_towards_an_end_never_raises_capacity(pl, share, d, u, v, ap, right):
    # Moving the bearing from centred towards the wall end (or towards either end when no wall
    # end is near) shortens the padstone around the load and brings the loaded area nearer the
    # wall end: neither the masonry's (EN 1996-1-1 §6.1.3) nor the padstone's (EN 1992-1-1 §6.7)
    # resistance may rise.
    near, far = sorted((u, v))
    bl = share * pl
    free = pl - bl
    wall = _wall(t=Q_(215, "mm"), a_1=None if ap is None else Q_(ap, "mm"))
    flip = right and ap is None

    def at(f):
        s = f * free / 2
        s = free - s if flip else s
        pad = Padstone(Q_(pl, "mm"), Q_(215, "mm"), Q_(d, "mm"), end_to_bearing=Q_(s, "mm"))
        return _capacity(wall, pad, Q_(bl, "mm"), Q_(100, "mm"))

    m_near, p_near = at(near)
    m_far, p_far = at(far)
    centred = _capacity(
        wall, Padstone(Q_(pl, "mm"), Q_(215, "mm"), Q_(d, "mm")), Q_(bl, "mm"), Q_(100, "mm")
    )
    assert m_near <= m_far * (1 + 1e-9)
    assert p_near <= p_far * (1 + 1e-9)
    assert m_far <= centred[0] * (1 + 1e-9)
    assert p_far <= centred[1] * (1 + 1e-9)


def test_sketch_draws_the_beam_at_the_padstone_end():
    pad = Padstone(Q_(440, "mm"), Q_(100, "mm"), Q_(150, "mm"), end_to_bearing=Q_(0, "mm"))
    r = check_en1996_bearing(
        _wall(a_1=Q_(0, "mm")),
        N_Ed=Q_(10, "kN"),
        bearing_length=Q_(100, "mm"),
        bearing_width=Q_(100, "mm"),
        padstone=pad,
    )
    # the padstone, the bearing and the loaded area all start at the wall end
    assert r.padstone_start.to("mm").magnitude == pytest.approx(0.0, abs=1e-9)
    assert r.bearing_start.to("mm").magnitude == pytest.approx(0.0, abs=1e-9)
    assert r.a_1.to("mm").magnitude == pytest.approx(0.0, abs=1e-9)
    assert r.loaded_length.to("mm").magnitude == pytest.approx(100.0, rel=1e-12)
    assert "wall end" in r.svg()
