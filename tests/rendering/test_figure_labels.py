"""Numbers on figures are written by the one number formatter of the tables, prose and working
(significant figures of the display setting, a true minus sign, the working's unit text): the
label text found in the SVG equals the formatter's output for the value drawn.

The values drawn are computed here from the inputs by pint (the reference library) and the
contact pressure N/A·(1 ± 6e/B) of a rigid base (common practice)."""

from __future__ import annotations

import pytest

from calcpack.foundations import Column, Footing, soil_pressure
from calcpack.plots.footing import FootingSketchData, footing_figure_matplotlib
from calcpack.plots.labels import number_label, quantity_label, svg_text
from calcpack.units import Q_, get_display, set_display
from calcpack.working.format import format_number, format_quantity_text
from tests.rendering.svgtext import text_boxes


@pytest.fixture
def four_figures():  # type: ignore[no-untyped-def]
    before = get_display().sig_figs
    set_display(sig_figs=4)
    yield
    set_display(sig_figs=before)


def _texts(fig: object) -> list[str]:
    return [box.text for box in text_boxes(svg_text(fig))]


def test_label_helpers_are_the_working_formatter() -> None:
    for value in (0.0, 1234.5, -0.0123456, 2.5e7, 71.8):
        assert number_label(value, 3) == format_number(value, 3)
        q = Q_(value, "kip*ft")
        assert quantity_label(value, q.units, 3) == format_quantity_text(q, 3)
    assert number_label(0.25, 3, signed=True) == "+0.250"
    assert number_label(-0.25, 3, signed=True) == "−0.250"  # a true minus, never "-"
    assert quantity_label(1.5, "kN/m^2", 3) == "1.50 kN/m²"


def _footing() -> tuple[Footing, object]:
    """Invented pad: 6 ft square, 18 in thick, 70 kip at 0.3 ft eccentricity."""
    f = Footing("square", Q_(6, "ft"), Q_(18, "inch"), Column(Q_(12, "inch")), mark="F-1")
    p = soil_pressure(
        f.polygon_m(), Q_(70, "kip"), Q_(0.3, "ft"), Q_(0, "ft"), shape=f.shape, B=f.B, L=f.length
    )
    return f, p


def _edge_pressures(sig: int) -> list[str]:
    """N/A·(1 ± 6e/B) at the two edges, in psf, as the formatter writes them."""
    N, e, B = Q_(70, "kip"), Q_(0.3, "ft"), Q_(6, "ft")
    mean = N / B**2
    return [format_quantity_text((mean * (1 + k * 6 * e / B)).to("psf"), sig) for k in (-1.0, 1.0)]


def test_footing_labels_are_the_formatters_output() -> None:
    f, p = _footing()
    texts = _texts(footing_figure_matplotlib(FootingSketchData(f, None, p)))
    sig = get_display().sig_figs
    assert f"h = {format_quantity_text(Q_(18, 'inch'), sig)}" in texts
    assert f"B = {format_quantity_text(Q_(6, 'ft'), sig)}" in texts
    for label in _edge_pressures(sig):
        assert label in texts


def test_figure_labels_follow_the_significant_figures_setting(four_figures: None) -> None:
    f, p = _footing()
    texts = _texts(footing_figure_matplotlib(FootingSketchData(f, None, p)))
    assert "h = 18.00 in" in texts  # 4 significant figures, as the sheet's working
    for label in _edge_pressures(4):
        assert label in texts
    assert not any("e+" in t or "e-" in t for t in texts)  # no Python exponent notation
