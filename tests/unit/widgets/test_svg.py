"""The panels' SVG drawings: well-formed, and the labelled extremes are the solver's."""

from __future__ import annotations

import xml.dom.minidom
from pathlib import Path

import numpy as np
import pytest

from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs, section_from_inputs
from calcpack.widgets.svg import beam_diagram_parts, beam_diagrams_svg, section_sketch_svg, thin

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


def test_beam_diagrams_are_one_svg_with_the_extremes() -> None:
    out = evaluate_beam(beam_inputs(load_inputs(TEMPLATES / "beam.inputs.toml")))
    svg = beam_diagrams_svg(out)
    doc = xml.dom.minidom.parseString(svg)
    inner = [e for e in doc.getElementsByTagName("svg") if e.getAttribute("class") == "cp-diagram"]
    assert inner[0].getAttribute("data-diagram") == "loading"
    assert len(inner) == 4
    moment = next(e for e in inner if e.getAttribute("data-diagram").startswith("Moment"))
    labelled = [
        float(t.getAttribute("data-value"))
        for t in moment.getElementsByTagName("text")
        if t.getAttribute("class") == "cp-diagram-extreme"
    ]
    ext = out.strength.extremes
    # Sampled at load points and supports (both sides), where the extremes of M lie here.
    assert max(labelled) == pytest.approx(ext.M_max.value.to("kN*m").magnitude, rel=1e-3)
    assert min(labelled) == pytest.approx(ext.M_min.value.to("kN*m").magnitude, rel=1e-9)


def test_section_sketch_is_well_formed_for_every_shape() -> None:
    from calcpack.inputs import SHAPES, parse_quantity

    for key, form in SHAPES.items():
        table = {"shape": key, **{d: parse_quantity(v, d) for d, v in form.defaults.items()}}
        shape = section_from_inputs(table)
        svg = section_sketch_svg(shape, shape.properties())
        xml.dom.minidom.parseString(svg)
        assert 'data-diagram="section"' in svg


def _distance_to_polyline(px: float, py: float, xs: np.ndarray, ys: np.ndarray) -> float:
    best = np.inf
    for x0, y0, x1, y1 in zip(xs[:-1], ys[:-1], xs[1:], ys[1:], strict=True):
        dx, dy = x1 - x0, y1 - y0
        t = 0.0 if dx == dy == 0 else ((px - x0) * dx + (py - y0) * dy) / (dx * dx + dy * dy)
        t = min(1.0, max(0.0, t))
        best = min(best, float(np.hypot(px - (x0 + t * dx), py - (y0 + t * dy))))
    return best


def test_thin_keeps_every_sample_within_the_tolerance() -> None:
    rng = np.random.default_rng(7)
    x = np.linspace(70.0, 610.0, 481)
    # A moment-like curve with a kink and a vertical step (repeated x), plus small noise.
    y = 60 - 0.0004 * (x - 300) ** 2 + np.where(x > 400, 25.0, 0.0) + rng.normal(0, 0.05, x.size)
    x = np.insert(x, 300, x[300])
    y = np.insert(y, 300, y[300] - 30.0)
    keep = thin(x, y, 0.25)
    assert keep[0] == 0
    assert keep[-1] == len(x) - 1
    assert len(keep) < len(x) / 3  # the point of thinning
    xs, ys = x[keep], y[keep]
    worst = max(_distance_to_polyline(a, b, xs, ys) for a, b in zip(x, y, strict=True))
    assert worst <= 0.25 + 1e-9


def test_thin_reduces_a_straight_run_to_its_ends() -> None:
    x = np.linspace(0.0, 500.0, 200)
    assert list(thin(x, 3.0 * x + 2.0)) == [0, 199]


def test_panel_drawings_are_compact() -> None:
    out = evaluate_beam(beam_inputs(load_inputs(TEMPLATES / "beam.inputs.toml")))
    parts = beam_diagram_parts(out)
    assert [p.split('data-diagram="', 1)[1].split('"')[0].split()[0] for p in parts] == [
        "loading",
        "Shear",
        "Moment",
        "Deflection",
    ]
    # About 240 samples per diagram were drawn as two 480-point lines (32 kB for the set);
    # thinned, each line keeps the points it needs.
    assert sum(len(p) for p in parts) < 9000
