"""What a checker reads off a beam: no round-off 'hogging' on a simple span, and diagrams in
the sheet's unit system."""

from __future__ import annotations

from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam
from calcpack.loads import PointLoad, UniformLoad
from calcpack.units import Q_, get_display, set_display, ureg


def _simple_span():
    L = Q_(16, "ft")
    return solve_beam(
        Beam(
            length=L,
            supports=[Pin(0 * ureg.ft), Roller(L)],
            loads=[UniformLoad(w=Q_(0.3, "klf")), PointLoad(x=Q_(5, "ft"), P=Q_(1.4, "kip"))],
            EI=Q_(29000, "ksi") * Q_(800, "inch**4"),
        )
    )


def test_simple_span_has_no_hogging_moment_from_round_off():
    # A simply supported span under downward load never hogs (common practice): the most
    # negative moment is exactly zero at the supports, not a 1e-15 residue.
    r = _simple_span()
    assert r.extremes.M_min.value_si == 0.0
    assert r.extremes.M_max.value_si > 0


def test_figure_follows_unit_system():
    r = _simple_span()
    us = r.figure(system="US").svg
    si = r.figure(system="SI").svg
    assert "kip·ft" in us
    assert "kN·m" not in us
    assert "kN·m" in si
    assert "kip·ft" not in si


def test_figure_defaults_to_global_display_system():
    before = get_display().system
    try:
        set_display(system="US")
        assert "x from left end (ft)" in _simple_span().figure().svg
    finally:
        set_display(system=before)


def test_result_displays_its_diagrams_in_jupyter():
    bundle = _simple_span()._repr_mimebundle_()
    assert bundle["image/svg+xml"].lstrip().startswith("<?xml")
    assert "M_max" in bundle["text/plain"]


def test_section_figure_displays_as_svg():
    from calcpack.sections import Rectangle

    fig = Rectangle(b=Q_(90, "mm"), d=Q_(240, "mm")).figure()
    assert "<svg" in fig._repr_svg_()
