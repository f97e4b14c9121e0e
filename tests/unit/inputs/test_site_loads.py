"""The site loads sheet: its template runs as made, the inputs route to ASCE 7-16 or to
EN 1991 with the UK annex, and bad inputs name their key."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from calcpack.errors import InputError
from calcpack.inputs import load_inputs
from calcpack.inputs.site_loads import site_loads_inputs
from calcpack.package.scaffold import new_project
from calcpack.package.sheet_templates import add_sheet
from calcpack.plots.roof_loads import roof_loads_svg, wind_envelope
from calcpack.units import Q_
from calcpack.working import Figure

EN = {
    "site": {"standard": "EN 1991 UK", "mark": "Roof R2"},
    "roof": {
        "shape": "duopitch",
        "slope": Q_(30, "deg"),
        "width": Q_(8, "m"),
        "length": Q_(15, "m"),
        "height": Q_(5.5, "m"),
        "spacing": Q_(0.6, "m"),
    },
    "snow": {"altitude": Q_(150, "m"), "zone": 2},
    "wind": {
        "vb_map": Q_(22, "m/s"),
        "vb_source": "UK NA Figure NA.1",
        "altitude": Q_(150, "m"),
        "c_e": 2.2,
        "c_e_source": "UK NA Figure NA.7",
    },
}


def test_template_runs_as_made(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    folder = tmp_path / "job"
    new_project(folder, number="2441", title="Loads job")
    added = add_sheet(folder, "site_loads", title="Roof loads")
    nb = json.loads((folder / added.notebook).read_text(encoding="utf-8"))
    monkeypatch.chdir((folder / added.notebook).parent)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    scope: dict[str, object] = {}
    for cell in nb["cells"]:
        if cell["cell_type"] == "code":
            exec("".join(cell["source"]), scope)
    loads = scope["loads"]
    assert set(loads.groups) == {"S", "W"}  # type: ignore[attr-defined]
    figs = [st for st in scope["s"].steps if isinstance(st, Figure)]  # type: ignore[attr-defined]
    assert any(f.drawing == "roof-loads" for f in figs)
    assert "<svg" in figs[-1].svg()
    data = load_inputs(added.inputs.name if added.inputs else "")
    assert data["site"]["standard"] == "ASCE 7-16"


def test_en_route_gives_snow_arrangements_and_wind_cases() -> None:
    loads = site_loads_inputs(EN)
    assert loads.groups["S"] == ("S (i)", "S (ii)", "S (iii)")
    assert len(loads.groups["W"]) > 8  # both directions, each case with both c_pi
    rows = loads.line_load_rows()
    first = rows[0]
    assert first[4].to("kN/m").magnitude == pytest.approx(first[3].to("kN/m^2").magnitude * 0.6)
    svg = roof_loads_svg(loads.profiles)
    assert "envelope" in svg


def test_wind_envelope_is_the_max_and_min_over_the_cases() -> None:
    loads = site_loads_inputs(EN)
    wind = [p for p in loads.profiles if p.kind == "normal"]
    xs, hi, lo = wind_envelope(wind, "kN/m^2", "m")
    every = [v.to("kN/m^2").magnitude for p in wind for v in p.values]
    assert max(hi) == pytest.approx(max(every))
    assert min(lo) == pytest.approx(min(every))
    assert xs[0] == 0.0


@pytest.mark.parametrize(
    ("change", "key"),
    [
        ({"site": {"standard": "NBC 2020"}}, "site.standard"),
        ({"roof": {**EN["roof"], "spacing": Q_(-1, "m")}}, "roof.spacing"),
        ({"snow": {"zone": 2}}, "snow.altitude"),
        ({"wind": {**EN["wind"], "vb_map": Q_(22, "m")}}, "wind.vb_map"),
    ],
)
def test_bad_inputs_name_their_key(change: dict, key: str) -> None:
    data = {**EN, **change}
    with pytest.raises(InputError) as e:
        site_loads_inputs(data, path="site.inputs.toml")
    assert key in str(e.value) or e.value.name == key


def test_neither_snow_nor_wind_is_refused() -> None:
    data = {k: v for k, v in EN.items() if k not in ("snow", "wind")}
    with pytest.raises(InputError, match="snow"):
        site_loads_inputs(data)
