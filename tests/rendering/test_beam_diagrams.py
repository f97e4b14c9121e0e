"""The beam diagrams a sheet gets with its load combinations: present by default, off only on
request, ticks at round values of the display unit, value labels clear of every other text
(measured in the SVG), and the labelled peaks equal to the beam-table values."""

from __future__ import annotations

import itertools
import math
import re

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.combinations import (
    analyse_combinations,
    asce7_allowable_stress,
    asce7_strength,
    pattern_cases,
)
from calcpack.errors import InputError
from calcpack.loads.self_weight import tributary_line_load
from calcpack.loads.types import PointLoad, UniformLoad
from calcpack.plots.beam_combinations import combinations_svg
from calcpack.plots.labels import round_ticks
from calcpack.units import Q_, ureg
from calcpack.working import Sheet
from calcpack.working.figure import Figure
from tests.rendering.svgtext import text_boxes

ft, m = ureg.ft, ureg.m


def _us_beam() -> Beam:
    """Invented demo beam: 16 ft simple span, line loads and a post load at 5 ft."""
    return Beam(
        length=16 * ft,
        supports=[Pin(0 * ft, name="A"), Roller(16 * ft, name="B")],
        loads=[
            tributary_line_load(q=Q_("12 psf"), width=5 * ft, case="D", label="floor dead"),
            tributary_line_load(q=Q_("60 psf"), width=5 * ft, case="L", label="floor live"),
            PointLoad(x=5 * ft, P=Q_("2 kip"), case="D", label="post dead"),
            PointLoad(x=5 * ft, P=Q_("1.5 kip"), case="Lr", label="post roof live"),
        ],
        EI=Q_("29000 ksi") * Q_("61.9 inch**4"),
        name="B1",
    )


def _two_span() -> Beam:
    """Invented demo bearer: two 8 ft spans, dead and patterned live line loads."""
    return Beam(
        length=16 * ft,
        supports=[Pin(0 * ft, name="A"), Roller(8 * ft, name="B"), Roller(16 * ft, name="C")],
        loads=[
            tributary_line_load(q=Q_("12 psf"), width=5 * ft, case="D", label="deck dead"),
            tributary_line_load(q=Q_("60 psf"), width=5 * ft, case="L", label="deck live"),
        ],
        EI=Q_("1.6e6 psi") * Q_("231 inch**4"),
        name="BR1",
    )


def _is_round(value: float, step: float) -> bool:
    return abs(value / step - round(value / step)) < 1e-6


def _round_step(values: list[float]) -> float:
    """The tick step, checked to be 1, 2, 2.5 or 5 times a power of ten (common practice for
    the graduation of a chart axis)."""
    steps = {round(b - a, 9) for a, b in itertools.pairwise(values)}
    assert len(steps) == 1, values
    step = steps.pop()
    mantissa = step / 10 ** math.floor(math.log10(step))
    assert any(math.isclose(mantissa, k) for k in (1, 2, 2.5, 5)), step
    return step


def _ticks(svg: str, axis: str) -> list[float]:
    values = []
    for box in text_boxes(svg):
        if any(a.startswith(f"{axis}tick_") for a in box.ancestors):
            values.append(float(box.text.replace("−", "-")))
    return values


@pytest.fixture(scope="module")
def strength_svg() -> str:
    cr = analyse_combinations(solve_cases(_us_beam()), asce7_strength())
    return combinations_svg(cr, Sheet("t", system="US").settings)


@pytest.fixture(scope="module")
def pattern_svg() -> str:
    beam, groups = pattern_cases(_two_span(), "L")
    cr = analyse_combinations(solve_cases(beam), asce7_allowable_stress(), groups=groups)
    return combinations_svg(cr, Sheet("t", system="US").settings)


@pytest.mark.parametrize("name", ["strength_svg", "pattern_svg"])
def test_x_ticks_are_round_feet(name: str, request: pytest.FixtureRequest) -> None:
    svg = request.getfixturevalue(name)
    xs = sorted(set(_ticks(svg, "x")))
    assert xs[0] == 0
    assert xs[-1] == 16  # the 16 ft span ends on a tick, not at 16.4 (5 m)
    step = _round_step(xs)
    assert all(_is_round(v, step) for v in xs)


@pytest.mark.parametrize("name", ["strength_svg", "pattern_svg"])
def test_y_ticks_are_round_in_each_panel(name: str, request: pytest.FixtureRequest) -> None:
    svg = request.getfixturevalue(name)
    groups: dict[str, list[float]] = {}
    for box in text_boxes(svg):
        axis = next((a for a in box.ancestors if a.startswith("matplotlib.axis_")), None)
        if axis and any(a.startswith("ytick_") for a in box.ancestors):
            groups.setdefault(axis, []).append(float(box.text.replace("−", "-")))
    assert len(groups) >= 2
    for values in groups.values():
        _round_step(sorted(values))


@pytest.mark.parametrize("name", ["strength_svg", "pattern_svg"])
def test_value_labels_overlap_no_other_text(name: str, request: pytest.FixtureRequest) -> None:
    boxes = text_boxes(request.getfixturevalue(name))
    labels = [b for b in boxes if any(a.startswith("cp-label-") for a in b.ancestors)]
    assert len(labels) >= 3
    for lab in labels:
        for other in boxes:
            if other is not lab:
                assert not lab.overlaps(other), (lab.text, other.text)


def test_point_loads_at_one_point_share_one_label_without_overlap(strength_svg: str) -> None:
    boxes = [b for b in text_boxes(strength_svg) if re.match(r"(D|Lr): \d", b.text)]
    texts = {b.text for b in boxes}
    assert {"D: 2.00 kip", "Lr: 1.50 kip"} <= texts
    for i, a in enumerate(boxes):
        for b in boxes[i + 1 :]:
            assert not a.overlaps(b), (a.text, b.text)


def test_peak_labels_equal_the_beam_table() -> None:
    """Simple span, uniform load: M = w L²/8 at midspan, V = w L/2 at the supports (AISC
    Steel Construction Manual Table 3-23, case 1; from memory)."""
    beam = Beam(
        length=6 * m,
        supports=[Pin(0 * m, name="A"), Roller(6 * m, name="B")],
        loads=[UniformLoad(w=Q_("10 kN/m"), case="D")],
        EI=Q_("2000 kN*m**2"),
        name="L1",
    )
    cr = analyse_combinations(solve_cases(beam), asce7_allowable_stress())
    texts = [b.text for b in text_boxes(combinations_svg(cr, Sheet("t", system="SI").settings))]
    assert any(t.startswith("M = 45.0 kN·m, x = 3.00 m") for t in texts), texts  # 10·6²/8
    assert any(t.startswith("V = 30.0 kN, x = 0 m") for t in texts), texts  # 10·6/2
    # δ = 5 w L⁴ / (384 EI) = 5·10·6⁴/(384·2000) m = 84.4 mm (same table, case 1)
    assert any(t.startswith("δ = 84.4 mm down, x = 3.00 m") for t in texts), texts


def test_sheet_gets_the_diagrams_by_default_and_drops_them_only_on_request() -> None:
    cases = solve_cases(_us_beam())
    s = Sheet("t", system="US", auto_display=False)
    analyse_combinations(cases, asce7_strength()).add_to(s)
    figs = [x for x in s.steps if isinstance(x, Figure)]
    assert len(figs) == 1
    assert "shear and bending moment" in figs[0].caption  # no displacement under factored loads
    assert "M_max = 26.7 kip·ft" in figs[0].alt
    quiet = Sheet("t", system="US", auto_display=False)
    analyse_combinations(cases, asce7_strength()).add_to(quiet, figures=False)
    assert not any(isinstance(x, Figure) for x in quiet.steps)


def test_figure_html_is_an_svg_image_with_alternative_text() -> None:
    s = Sheet("t", system="US", auto_display=False)
    analyse_combinations(solve_cases(_two_span()), asce7_allowable_stress()).add_to(s)
    fig = next(x for x in s.steps if isinstance(x, Figure))
    html = fig.html()
    assert 'src="data:image/svg+xml;base64,' in html
    assert 'alt="Diagrams of beam BR1' in html
    assert "displacement" in fig.caption  # allowable-stress loads are service-level loads


def test_strength_tables_are_titled_factored_and_asd_tables_are_not() -> None:
    cases = solve_cases(_us_beam())
    for combos, word in ((asce7_strength(), "factored"), (asce7_allowable_stress(), "ASD")):
        s = Sheet("t", system="US", auto_display=False)
        analyse_combinations(cases, combos).add_to(s, figures=False)
        captions = [getattr(x, "caption", "") or "" for x in s.steps]
        titled = [c for c in captions if c.startswith(("Results", "Envelope"))]
        assert titled
        assert all(word in c for c in titled), titled
        if word == "ASD":
            assert not any("Factored" in c for c in captions), captions
        else:  # no deflection from factored loads in the envelope
            env = next(x for x in s.steps if (getattr(x, "caption", "") or "").startswith("Env"))
            assert not any(str(r[0]).startswith("δ") for r in env.rows)


def test_unknown_drawing_is_refused_naming_it() -> None:
    with pytest.raises(InputError, match="drawing"):
        Figure("nonsense", None, caption="c", alt="a")


@given(
    lo=st.floats(-1e4, 1e4, allow_nan=False),
    width=st.floats(1e-3, 1e5, allow_nan=False),
    n=st.integers(3, 12),
)
def test_round_ticks_lie_in_range_on_a_round_step(lo: float, width: float, n: int) -> None:
    hi = lo + width
    ticks = list(round_ticks(lo, hi, n=n))
    assert len(ticks) >= 2
    assert all(lo - 1e-9 * width <= t <= hi + 1e-9 * width for t in ticks)
    step = ticks[1] - ticks[0]
    power = 10 ** math.floor(math.log10(step))
    k = next(k for k in (1, 2, 2.5, 5, 10) if math.isclose(step / power, k, rel_tol=1e-6))
    nominal = k * power  # the step as a round number, free of the subtraction's rounding
    assert all(abs(t / nominal - round(t / nominal)) < 1e-6 for t in ticks)
