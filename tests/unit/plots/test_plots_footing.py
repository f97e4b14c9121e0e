"""The footing sketch reads the footing, its concrete checks and a contact pressure, draws the
critical sections where the clauses put them, and is a registered figure drawing."""

from __future__ import annotations

import pytest

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.checks.en1992 import ECFootingDesign, check_en1992_footing
from calcpack.combinations.asce7 import asce7_strength
from calcpack.foundations import Column, Footing, FootingLoad, soil_pressure
from calcpack.plots.footing import FootingSketch, FootingSketchData, footing_figure, footing_svg
from calcpack.units import Q_
from calcpack.working import Figure


def _aci():
    f = Footing("square", Q_(6, "ft"), Q_(18, "inch"), Column(Q_(12, "inch")), mark="F-P1")
    loads = {"D": FootingLoad(P=Q_(40, "kip")), "L": FootingLoad(P=Q_(30, "kip"))}
    checks = check_aci_footing(f, loads, asce7_strength(), ACIFootingDesign(f_c=Q_(3000, "psi")))
    return f, checks


def test_aci_sketch_has_bars_sections_and_pressure() -> None:
    f, checks = _aci()
    p = soil_pressure(
        f.polygon_m(), Q_(70, "kip"), Q_(0.3, "ft"), Q_(0, "ft"), shape=f.shape, B=f.B, L=f.length
    )
    svg = footing_svg(FootingSketchData(f, checks, p))
    assert svg.startswith("<?xml")
    assert "b0 at d/2" in svg  # ACI 318-19 §22.6.4.1 perimeter
    assert "Soil pressure" in svg
    assert "F-P1" in svg
    n_bars = round(checks.values["n_x"].magnitude) + round(checks.values["n_y"].magnitude)
    assert n_bars >= 4


def test_en_sketch_uses_the_control_perimeter_at_2d() -> None:
    f = Footing("square", Q_(1.8, "m"), Q_(0.5, "m"), Column(Q_(0.3, "m")), mark="F2")
    loads = {"G": FootingLoad(P=Q_(400, "kN")), "Q": FootingLoad(P=Q_(200, "kN"))}
    checks = check_en1992_footing(f, loads, {"Q": "A"}, ECFootingDesign(f_ck=Q_(30, "MPa")))
    svg = FootingSketch(f, checks=checks).svg()
    assert "u1 at 2d" in svg  # EN 1992-1-1 §6.4.2


def test_round_pier_without_checks_and_as_a_figure_step() -> None:
    f = Footing("round", Q_(0.6, "m"), Q_(1.2, "m"), Column(Q_(0.15, "m")), kind="pier", mark="P1")
    assert "<svg" in FootingSketch(f)._repr_svg_()
    fig = footing_figure(f)
    assert isinstance(fig, Figure)
    assert fig.drawing == "footing"
    assert "<svg" in fig.svg()
    assert "P1" in fig.alt
    # sizes in the alternative text are written by the one formatter, as on the sheet
    assert "round 0.600 m wide and 1.20 m thick, column 0.150 m;" in fig.alt


@pytest.mark.parametrize("support", ["masonry", "base plate"])
def test_other_supports_draw(support: str) -> None:
    kw = {"plate1": Q_(14, "inch")} if support == "base plate" else {}
    col = Column(Q_(8, "inch"), support=support, **kw)  # type: ignore[arg-type]
    f = Footing("rectangular", Q_(5, "ft"), Q_(16, "inch"), col, L=Q_(7, "ft"))
    assert "<svg" in FootingSketch(f).svg()
