"""Lintel loads under masonry. The rules (45° triangle when arching can develop, full height
otherwise, point loads spread at 60° from the horizontal) are common practice, stated in
calcpack.loads.lintel_masonry; the expected values here are those rules evaluated by hand."""

from __future__ import annotations

import math

import pytest

from calcpack.errors import DimensionError, InputError
from calcpack.loads.lintel_masonry import WallPointLoad, lintel_masonry_loads
from calcpack.units import Q_

ARCH = {"running_bond": True, "thrust_resisted": True, "no_openings_or_joints": True}


def test_arching_triangle_peak_and_total():
    r = lintel_masonry_loads(
        span=Q_(6, "ft"), wall_height=Q_(8, "ft"), wall_weight=Q_(40, "psf"), **ARCH
    )
    assert r.arching
    # common practice: peak w·L/2 = 40 psf × 3 ft = 120 lbf/ft; total w·L²/4 = 360 lbf
    assert r.triangle_peak.to("lbf/ft").magnitude == pytest.approx(120)
    total = sum(
        0.5
        * (ld.w_start + ld.w_end).to("lbf/ft").magnitude
        * (ld.end - ld.start).to("ft").magnitude
        for ld in r.beam_loads()
    )
    assert total == pytest.approx(360)


@pytest.mark.parametrize("broken", ["running_bond", "thrust_resisted", "no_openings_or_joints"])
def test_any_failed_condition_gives_the_full_height(broken):
    cond = dict(ARCH, **{broken: False})
    r = lintel_masonry_loads(
        span=Q_(6, "ft"), wall_height=Q_(8, "ft"), wall_weight=Q_(40, "psf"), **cond
    )
    assert not r.arching
    # full height: 40 psf × 8 ft
    assert r.uniform.to("lbf/ft").magnitude == pytest.approx(320)


def test_short_wall_above_gives_the_full_height():
    # L/2 + 8 in. = 44 in. > 36 in.
    r = lintel_masonry_loads(
        span=Q_(6, "ft"), wall_height=Q_(3, "ft"), wall_weight=Q_(40, "psf"), **ARCH
    )
    assert not r.arching
    assert "L/2 + 8 in" in r.reason


def test_point_load_inside_the_triangle_spreads_at_60_degrees():
    p = WallPointLoad(P=Q_(2000, "lbf"), x=Q_(3, "ft"), height=Q_(2, "ft"), bearing=Q_(4, "inch"))
    r = lintel_masonry_loads(
        span=Q_(6, "ft"),
        wall_height=Q_(8, "ft"),
        wall_weight=Q_(40, "psf"),
        point_loads=(p,),
        **ARCH,
    )
    a, b, w, _case, _src = r.patches[0]
    spread = 4 / 12 + 2 * 2 / math.tan(math.radians(60))
    assert (b - a).to("ft").magnitude == pytest.approx(spread)
    assert w.to("lbf/ft").magnitude == pytest.approx(2000 / spread)


def test_point_load_above_the_triangle_is_carried_by_the_arch():
    p = WallPointLoad(P=Q_(2000, "lbf"), x=Q_(1, "ft"), height=Q_(5, "ft"))
    r = lintel_masonry_loads(
        span=Q_(6, "ft"),
        wall_height=Q_(8, "ft"),
        wall_weight=Q_(40, "psf"),
        point_loads=(p,),
        **ARCH,
    )
    assert r.patches == ()
    assert r.ignored == (p,)


def test_bad_input_names_the_input():
    p = WallPointLoad(P=Q_(1, "lbf"), x=Q_(7, "ft"), height=Q_(1, "ft"))
    with pytest.raises(InputError) as e:
        lintel_masonry_loads(
            span=Q_(6, "ft"),
            wall_height=Q_(8, "ft"),
            wall_weight=Q_(40, "psf"),
            point_loads=(p,),
            **ARCH,
        )
    assert e.value.name == "point_loads[0].x"
    with pytest.raises(DimensionError) as e:
        lintel_masonry_loads(
            span=Q_(6, "ft"), wall_height=Q_(8, "ft"), wall_weight=Q_(40, "lbf/ft"), **ARCH
        )
    assert e.value.name == "wall_weight"


def test_sketch_is_svg():
    from calcpack.plots.lintel import lintel_svg

    r = lintel_masonry_loads(
        span=Q_(6, "ft"), wall_height=Q_(8, "ft"), wall_weight=Q_(40, "psf"), **ARCH
    )
    assert lintel_svg(r).lstrip().startswith("<?xml")


def test_sketch_is_a_figure_drawing_in_the_sheet_units():
    from calcpack.plots.lintel import lintel_figure
    from calcpack.units import DisplaySettings
    from calcpack.working import Figure
    from calcpack.working.figure import draw_figure

    r = lintel_masonry_loads(
        span=Q_(1.65, "m"), wall_height=Q_(2.1, "m"), wall_weight=Q_(2.2, "kN/m**2"), **ARCH
    )
    fig = Figure("lintel", r, caption="lintel", alt="the lintel and the load triangle")
    for system in ("SI", "US"):
        svg = draw_figure(fig.drawing, r, DisplaySettings(system=system))
        assert svg.lstrip().startswith("<?xml")
    assert lintel_figure(r, "m").axes[0].get_xlabel() == "m"
    # the opening is drawn to scale in the unit chosen: 1.65 m wide
    assert lintel_figure(r, "m").axes[0].patches[1].get_width() == pytest.approx(1.65)
