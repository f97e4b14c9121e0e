"""The demo job's member panels: a section picked by "Lightest that passes" in the beam panel
(sheet 2) and in the post panel (sheet 3) is written to the inputs file, and the sheet executed
afresh by the build's executor records the utilisations the panel showed.

The sheets are first run in this process as JupyterLab runs them (their exports written to the
project's cache, the panel built from the cells' own values); the pick is made on that panel;
then each sheet runs in a fresh kernel as a build runs it, reading the inputs file only.
"""

from __future__ import annotations

import json
import shutil
import warnings
from pathlib import Path
from typing import Any

import pytest

from calcpack.contract.records import collect_records
from calcpack.inputs import load_inputs
from calcpack.package.execute import execute_notebook
from calcpack.working.links import SHEET_ENV

pytestmark = pytest.mark.build

DEMO = Path(__file__).resolve().parents[2] / "example_projects" / "alteration_ashgrove_lane"


def _run_here(project: Path, sheet: str, monkeypatch: pytest.MonkeyPatch) -> dict[str, Any]:
    """Run a sheet's code cells in this process as a JupyterLab kernel would; its namespace."""
    monkeypatch.chdir(project / "sheets")
    monkeypatch.setenv(SHEET_ENV, f"sheets/{sheet}.ipynb")
    monkeypatch.delenv("CALCPACK_BUILDING", raising=False)
    nb = json.loads((project / "sheets" / f"{sheet}.ipynb").read_text(encoding="utf-8"))
    ns: dict[str, Any] = {"__name__": "__main__"}
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")  # "may be out of date" notices of a lab session
        for cell in nb["cells"]:
            if cell["cell_type"] == "code":
                exec(compile("".join(cell["source"]), sheet, "exec"), ns)
    return ns


def _shown(panel: Any) -> dict[tuple[str, str, str], float]:
    return {
        (mc.member, r.name, r.combination or ""): float(r.utilisation)
        for mc in panel.outcome.checks
        for r in mc.results
        if r.utilisation is not None
    }


def _built(project: Path, sheet: str) -> dict[tuple[str, str, str], float]:
    nb = execute_notebook(project / "sheets" / f"{sheet}.ipynb", sheet=f"sheets/{sheet}.ipynb")
    return {
        (c["member"] or "", c["name"], c["combination"] or ""): float(c["utilisation"])
        for c in collect_records(nb).checks
        if c.get("utilisation") is not None
    }


def _assert_reproduced(shown: dict[tuple[str, str, str], float], built: dict) -> None:  # type: ignore[type-arg]
    assert shown
    for key, u in shown.items():
        assert key in built, f"{key} shown by the panel is not among the sheet's checks"
        # deflections: the panel scales the analysed ones by E·I, the sheet re-analyses with
        # the picked section's I_x -- equal but for round-off
        assert built[key] == pytest.approx(u, rel=1e-9), key


def test_demo_beam_and_post_picks_are_what_the_sheets_then_record(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    from calcpack.widgets import beam_member_panel, timber_post_panel

    project = tmp_path / "ashgrove"
    shutil.copytree(DEMO, project, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
    design = project / "inputs" / "design.toml"
    _run_here(project, "01_loads", monkeypatch)
    ns = _run_here(project, "02_beam_B1", monkeypatch)
    beam = beam_member_panel(ns["INPUTS"], ns["demand"], table="beam")
    found = beam.search(count=3)
    assert found is not None
    assert found.passing
    pick = found.passing[0].name
    assert beam.use(pick)
    table = load_inputs(design, tables=("beam",))["beam"]
    assert table["section"] == pick
    assert table["source"] == f"AISC Shapes Database v16.0 ({pick})"
    _assert_reproduced(_shown(beam), _built(project, "02_beam_B1"))

    ns = _run_here(project, "03_posts_bearing", monkeypatch)
    post = timber_post_panel(ns["INPUTS"], **ns["POST_TABLE"])
    found = post.search(count=3)
    assert found is not None
    assert found.passing
    size = found.passing[0].name
    assert post.use(size)
    assert load_inputs(design, tables=("post",))["post"]["size"] == size
    _assert_reproduced(_shown(post), _built(project, "03_posts_bearing"))
