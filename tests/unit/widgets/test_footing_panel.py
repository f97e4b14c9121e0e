"""The footing panel on the shared panel machinery."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from calcpack.inputs import load_inputs
from calcpack.inputs.footing import evaluate_footing, footing_inputs
from calcpack.units import Q_
from calcpack.widgets import FootingPanel, footing_panel

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


@pytest.fixture
def footing_file(tmp_path: Path) -> Path:
    p = tmp_path / "f.inputs.toml"
    shutil.copy(TEMPLATES / "footing.inputs.toml", p)
    return p


def test_footing_panel_edits_show_what_the_sheet_computes(footing_file: Path) -> None:
    panel = footing_panel(footing_file)
    assert isinstance(panel, FootingPanel)
    panel.set("footing.B", Q_(2.5, "ft"))
    assert load_inputs(footing_file)["footing"]["B"] == Q_(2.5, "ft")
    again = evaluate_footing(footing_inputs(load_inputs(footing_file)))
    html = panel.outputs["results"].value
    (bearing,) = [r for r in again.soil.results if r.name == "Bearing pressure"]
    assert f'data-value="{bearing.utilisation!r}"' in html
    assert 'class="cp-bar"' in panel.outputs["bars"].value


def test_footing_panel_refuses_a_post_larger_than_the_footing_at_the_field(
    footing_file: Path,
) -> None:
    panel = FootingPanel(footing_file)
    before = footing_file.read_text(encoding="utf-8")
    panel.fields["footing.B"].box.value = 0.25  # ft: smaller than the 8 in base plate
    assert panel.fields["footing.B"].error
    assert footing_file.read_text(encoding="utf-8") == before
    panel.fields["footing.B"].box.value = 3.5
    assert panel.fields["footing.B"].error == ""
    assert load_inputs(footing_file)["footing"]["B"] == Q_(3.5, "ft")
