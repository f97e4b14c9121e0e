"""The deck-ledger connection panel on the shared panel machinery.

Reference (closed form of the check's own clause, NDS 2018 §12.3 with C_M): each fastener
carries the ledger load on its spacing, so the lateral utilisation is proportional to the
spacing and to the joist reaction: doubling either doubles it."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from calcpack.inputs import load_inputs, read_inputs_text
from calcpack.inputs.ledger import evaluate_ledger, ledger_inputs
from calcpack.units import Q_
from calcpack.widgets import LedgerPanel, ledger_panel

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


@pytest.fixture
def ledger_file(tmp_path: Path) -> Path:
    p = tmp_path / "lg.inputs.toml"
    shutil.copy(TEMPLATES / "deck_ledger.inputs.toml", p)
    return p


def _lateral(panel: LedgerPanel) -> float:
    html = panel.outputs["results"].value
    marker = 'data-out="Fastener lateral capacity|D + L" data-value="'
    start = html.index(marker) + len(marker)
    return float(html[start : html.index('"', start)])


def test_ledger_panel_utilisation_scales_with_spacing_and_reaction(ledger_file: Path) -> None:
    panel = ledger_panel(ledger_file)
    u0 = _lateral(panel)
    assert 0 < u0 < 1
    panel.set("ledger.spacing", Q_(16, "inch"))
    assert _lateral(panel) == pytest.approx(2 * u0)
    panel.set("load.R", Q_(600, "lbf"))
    assert _lateral(panel) == pytest.approx(4 * u0)
    data = load_inputs(ledger_file)
    assert data["ledger"]["spacing"] == Q_(16, "inch")
    again = evaluate_ledger(ledger_inputs(data))
    assert again["Fastener lateral capacity"].utilisation == pytest.approx(_lateral(panel))


def test_ledger_panel_refuses_at_the_field(ledger_file: Path) -> None:
    panel = LedgerPanel(ledger_file)
    before = ledger_file.read_text(encoding="utf-8")
    panel.fields["ledger.diameter"].box.value = 0.55
    assert "ledger.diameter" in panel.fields["ledger.diameter"].error
    panel.fields["ledger.length"].box.value = 2.0  # shorter than ledger + rim board
    assert panel.fields["ledger.length"].error
    assert ledger_file.read_text(encoding="utf-8") == before


def test_ledger_inputs_refuse_a_species_not_in_the_table() -> None:
    text = (TEMPLATES / "deck_ledger.inputs.toml").read_text(encoding="utf-8")
    text = text.replace('rim_species = "Douglas Fir-Larch"', 'rim_species = "Douglas Fur"')
    with pytest.raises(Exception, match=r"ledger\.rim_species"):
        ledger_inputs(read_inputs_text(text), path="lg.inputs.toml")
