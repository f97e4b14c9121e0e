"""A figure of stacked panels is cut into one image per panel, so a page can break between
panels; the bands laid end to end are the figure, and nothing is cut where a panel's ticks or
words would be split."""

from __future__ import annotations

import io
import re

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.working.figure_bands import panel_bands

matplotlib = pytest.importorskip("matplotlib")
from matplotlib.figure import Figure  # noqa: E402


def _svg(fig: Figure) -> str:
    buf = io.StringIO()
    fig.savefig(buf, format="svg")
    return buf.getvalue()


def _stacked(heights: list[float], *, sharex: bool = True, titles: bool = False) -> str:
    fig = Figure(figsize=(6, sum(heights)), layout="constrained")
    axes = fig.subplots(len(heights), 1, sharex=sharex, height_ratios=heights, squeeze=False)
    for i, ax in enumerate(axes[:, 0]):
        ax.plot([0, 1, 2], [0, i + 1, 0])
        if titles:
            ax.set_title(f"panel {i + 1}")
    return _svg(fig)


def _view(svg: str) -> tuple[float, float]:
    m = re.search(r'viewBox="0 ([\d.]+) [\d.]+ ([\d.]+)"', svg)
    assert m is not None
    return float(m.group(1)), float(m.group(2))


def _beam_result() -> object:
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam
    from calcpack.loads import UniformLoad
    from calcpack.units import ureg

    beam = Beam(
        4 * ureg.m,
        [Pin(0 * ureg.m, name="A"), Roller(4 * ureg.m, name="B")],
        [UniformLoad(5 * ureg.kN / ureg.m)],
        EI=2000 * ureg.kN * ureg.m**2,
    )
    return solve_beam(beam)


def test_the_beam_figure_is_cut_between_its_four_panels() -> None:
    """The loading, shear, moment and deflection panels of calcpack's beam figure."""
    from calcpack.working.figure import draw_figure

    svg = draw_figure("beam", _beam_result(), None)
    bands = panel_bands(svg)
    assert len(bands) == 4
    assert sum(b.share for b in bands) == pytest.approx(1.0)
    for band in bands:
        assert len(re.findall(r'<g id="axes_\d+">', band.svg)) == 1
        # every glyph a band uses is defined in it
        used = set(re.findall(r'xlink:href="#([^"]+)"', band.svg))
        defined = set(re.findall(r'id="([^"]+)"', band.svg))
        assert used <= defined


def test_a_figure_step_shows_one_image_per_panel_with_its_words() -> None:
    from calcpack.working.figure import Figure as FigureStep

    step = FigureStep("beam", _beam_result(), caption="Beam B1", alt="Diagrams of beam B1.")
    html = step._repr_html_()
    alts = re.findall(r'<img class="cp-figure-img cp-band" alt="([^"]*)"', html)
    assert alts == [
        "Diagrams of beam B1: panel 1 of 4",
        *[f"Diagrams of beam B1, continued: panel {k} of 4" for k in (2, 3, 4)],
    ]
    assert 'class="cp-step cp-figure cp-split"' in html
    assert html.index("<figcaption>") > html.rindex("cp-band")  # the caption after the last


def test_panels_side_by_side_or_one_panel_stay_one_image() -> None:
    fig = Figure(figsize=(6, 3))
    for ax in fig.subplots(1, 2):
        ax.plot([0, 1], [0, 1])
    assert panel_bands(_svg(fig)) == []
    assert panel_bands(_stacked([2.0])) == []


def test_words_in_a_gap_are_never_cut() -> None:
    """Titles sit in the gap above each panel: the cut falls between the tick labels of one
    panel and the title of the next, or there is no cut."""
    svg = _stacked([1.5, 1.5, 1.5], sharex=False, titles=True)
    bands = panel_bands(svg)
    assert len(bands) == 3
    tops = [_view(b.svg)[0] for b in bands]
    titles = [float(y) for y in re.findall(r"translate\([\d.]+ ([\d.]+)\) scale", svg)]
    for top in tops[1:]:
        assert all(abs(top - y) > 2 for y in titles)


@settings(max_examples=15, deadline=None)
@given(st.lists(st.floats(min_value=0.8, max_value=3.0), min_size=2, max_size=4))
def test_bands_laid_end_to_end_are_the_figure(heights: list[float]) -> None:
    svg = _stacked(heights)
    total = float(re.search(r'height="([\d.]+)pt"', svg).group(1))  # type: ignore[union-attr]
    bands = panel_bands(svg)
    assert len(bands) == len(heights)
    top = 0.0
    for band in bands:
        start, height = _view(band.svg)
        assert start == pytest.approx(top, abs=2e-3)
        assert band.share == pytest.approx(height / total, abs=1e-4)
        top = start + height
    assert top == pytest.approx(total, abs=2e-3)
