"""A pad footing in an inputs file: validation naming the key and the checks evaluated.

Reference outside calcpack (common practice, closed form): a concentrically loaded square pad
has a uniform soil pressure q = (P + W_footing + W_soil) / B², with the self weights from the
unit weights given (concrete 150 lbf/ft³ here, calcpack's default, and the soil's)."""

from __future__ import annotations

from pathlib import Path

import pytest

from calcpack.errors import CalcpackError
from calcpack.inputs import load_inputs, read_inputs_text
from calcpack.inputs.footing import evaluate_footing, footing_inputs

TEMPLATE = Path(__file__).resolve().parents[3] / "templates" / "sheets" / "footing.inputs.toml"


def test_template_footing_pressure_equals_the_closed_form() -> None:
    outcome = evaluate_footing(footing_inputs(load_inputs(TEMPLATE)))
    (bearing,) = [r for r in outcome.soil.results if r.name == "Bearing pressure"]
    B, h, cover = 3.0, 1.0, 1.0  # ft
    weights = B * B * (h * 150.0 + cover * 110.0)  # lbf: footing and soil over it
    q = (6000.0 + 8000.0 + weights) / (B * B)  # psf, D + L
    assert bearing.demand.to("psf").magnitude == pytest.approx(q, rel=2e-3)
    assert bearing.capacity.to("psf").magnitude == pytest.approx(2000.0)
    names = {r.name for r in outcome.concrete.results}
    assert {"Two-way shear", "One-way shear x", "Flexure x"} <= names


@pytest.mark.parametrize(
    ("old", "new", "key"),
    [
        ('shape = "square"', 'shape = "oval"', "footing.shape"),
        ('B = "3 ft"', 'B = "-3 ft"', "footing.B"),
        ('q_allow = "2000 psf"', 'q_allow = "2000 lbf"', "soil.q_allow"),
        ('bar = "#4"', 'bar = "#13"', "concrete.bar"),
        ('plate1 = "8 in"\nplate2 = "8 in"', 'plate1 = "5 ft"\nplate2 = "5 ft"', "footing."),
        ('c1 = "5.5 in"', 'c1 = "9 in"', "column.plate1"),
    ],
)
def test_bad_inputs_name_their_key(old: str, new: str, key: str) -> None:
    text = TEMPLATE.read_text(encoding="utf-8")
    assert old in text
    with pytest.raises(CalcpackError) as info:
        _evaluate(text.replace(old, new))
    assert key in str(info.value)


def _evaluate(text: str) -> object:
    return evaluate_footing(footing_inputs(read_inputs_text(text), path="f.inputs.toml"))
