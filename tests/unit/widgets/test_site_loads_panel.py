"""The site-loads panel on the shared panel machinery.

Reference outside calcpack: ASCE/SEI 7-16 Eq. (7.3-1) p_f = 0.7·C_e·C_t·I_s·p_g and §7.4
p_s = C_s·p_f; for the template's roof (terrain C partially exposed C_e = 1.0, Table 7.3-1;
heated C_t = 1.0, Table 7.3-2; risk category II I_s = 1.0, Table 1.5-2; a 26.57° warm,
non-slippery roof C_s = 1.0, Figure 7.4-1a) the balanced load is 0.7·p_g."""

from __future__ import annotations

import html
import shutil
from pathlib import Path

import pytest

from calcpack.inputs import load_inputs
from calcpack.units import Q_
from calcpack.widgets import SiteLoadsPanel, site_loads_panel

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


@pytest.fixture
def site_file(tmp_path: Path) -> Path:
    p = tmp_path / "site.inputs.toml"
    shutil.copy(TEMPLATES / "site_loads.inputs.toml", p)
    return p


def _balanced(panel: SiteLoadsPanel) -> float:
    html = panel.outputs["results"].value
    marker = 'data-out="S balanced" data-value="'
    start = html.index(marker) + len(marker)
    return float(html[start : html.index('"', start)])


@pytest.mark.parametrize("pg", [20.0, 30.0, 42.0])
def test_site_loads_panel_redraws_the_snow_cases(site_file: Path, pg: float) -> None:
    panel = site_loads_panel(site_file)
    assert _balanced(panel) == pytest.approx(0.7 * 25.0)
    panel.set("snow.pg", Q_(pg, "psf"))
    assert load_inputs(site_file)["snow"]["pg"] == Q_(pg, "psf")
    assert _balanced(panel) == pytest.approx(0.7 * pg)
    assert "<svg" in panel.outputs["sketch"].value


def test_site_loads_panel_refuses_at_the_field(site_file: Path) -> None:
    panel = SiteLoadsPanel(site_file)
    before = site_file.read_text(encoding="utf-8")
    panel.fields["snow.terrain"].box.value = "Z"
    assert "terrain" in panel.fields["snow.terrain"].error
    assert "'Z'" in panel.fields["snow.terrain"].error
    panel.fields["wind.V"].box.value = -90.0
    assert "-90" in panel.fields["wind.V"].error  # shown at the speed's own field
    assert [k for k, f in panel.fields.items() if f.error] == ["snow.terrain", "wind.V"]
    assert site_file.read_text(encoding="utf-8") == before


def test_site_loads_errors_name_the_file_key(site_file: Path) -> None:
    """A value the derivation refuses is reported as the inputs file's key, with the file."""
    from calcpack.inputs.file import InputsFileError
    from calcpack.inputs.site_loads import site_loads_inputs

    data = load_inputs(site_file)
    data["snow"]["terrain"] = "Z"
    with pytest.raises(InputsFileError) as info:
        site_loads_inputs(data, path=site_file)
    assert info.value.name == "snow.terrain"
    assert str(site_file) in str(info.value)
    assert "[snow] terrain = 'Z'" in str(info.value)
    # opening a file edited by hand into that state: the panel shows the key, keeps the file
    text = site_file.read_text(encoding="utf-8").replace('terrain = "C"', 'terrain = "Z"')
    assert 'terrain = "Z"' in text
    site_file.write_text(text, encoding="utf-8")
    panel = SiteLoadsPanel(site_file)
    assert "[snow] terrain = 'Z'" in html.unescape(panel.status.value)
    assert "[snow] terrain = 'Z'" in panel.fields["snow.terrain"].error
    assert site_file.read_text(encoding="utf-8") == text
