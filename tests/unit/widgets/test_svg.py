"""The panels' SVG drawings: well-formed, and the labelled extremes are the solver's."""

from __future__ import annotations

import xml.dom.minidom
from pathlib import Path

import pytest

from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs, section_from_inputs
from calcpack.widgets.svg import beam_diagrams_svg, section_sketch_svg

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
