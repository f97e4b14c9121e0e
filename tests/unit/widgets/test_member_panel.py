"""The member panel on the shared panel machinery: edits written only when valid, errors at the
field, live utilisations, and the search putting the chosen shape into the file."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from calcpack.inputs import load_inputs
from calcpack.inputs.member import evaluate_member, member_inputs
from calcpack.units import Q_
from calcpack.widgets import MemberPanel, member_panel
from calcpack.widgets.member import utilisation_bars_svg

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


@pytest.fixture
def column_file(tmp_path: Path) -> Path:
    p = tmp_path / "c.inputs.toml"
    shutil.copy(TEMPLATES / "steel_column.inputs.toml", p)
    return p


def _governing(panel: MemberPanel) -> float:
    html = panel.outputs["results"].value
    marker = 'class="cp-governing" data-value="'
    start = html.index(marker) + len(marker)
    return float(html[start : html.index('"', start)])


def test_member_panel_shows_what_the_sheet_computes_and_writes_valid_edits(
    column_file: Path,
) -> None:
    panel = member_panel(column_file)
    before = _governing(panel)
    panel.set("forces[1].P", Q_(40.0, "kip"))
    assert load_inputs(column_file)["forces"][0]["P"] == Q_(40.0, "kip")
    again = evaluate_member(member_inputs(load_inputs(column_file)))
    assert _governing(panel) == pytest.approx(again.governing[0])
    assert _governing(panel) > before
    assert 'class="cp-bar"' in panel.outputs["bars"].value
    assert "Saved to c.inputs.toml" in panel.status.value
    assert "forces[1].P = 40 kip" in panel.rerun.notice.value


def test_member_panel_refuses_at_the_field_without_writing(column_file: Path) -> None:
    panel = MemberPanel(column_file)
    before = column_file.read_text(encoding="utf-8")
    shown = panel.outputs["results"].value
    panel.fields["member.shape"].box.value = "HSS4X4X1/5"
    assert "member.shape" in panel.fields["member.shape"].error
    assert "did you mean" in panel.fields["member.shape"].error.lower()
    assert column_file.read_text(encoding="utf-8") == before
    assert panel.outputs["results"].value == shown
    panel.fields["member.Lcx"].box.value = -3.0
    assert "member.Lcx" in panel.fields["member.Lcx"].error
    assert column_file.read_text(encoding="utf-8") == before
    panel.fields["member.Lcx"].box.value = 10.0
    assert panel.fields["member.Lcx"].error == ""


def test_member_panel_search_ranks_and_uses_the_chosen_shape(column_file: Path) -> None:
    panel = MemberPanel(column_file)
    found = panel.search(count=3)
    assert found is not None
    assert list(panel.pick.options) == [t.name for t in found.passing]
    assert panel.pick.value == found.passing[0].name  # the lightest is preselected
    assert 'class="cp-candidate"' in panel.ranking.value
    panel.use(found.passing[1].name)
    assert load_inputs(column_file)["member"]["shape"] == found.passing[1].name
    assert panel.fields["member.shape"].box.value == found.passing[1].name


def test_member_panel_does_not_overwrite_a_file_broken_by_hand(column_file: Path) -> None:
    panel = MemberPanel(column_file)
    column_file.write_text("this is [not toml", encoding="utf-8")
    panel.set("forces[1].P", Q_(30.0, "kip"))
    assert column_file.read_text(encoding="utf-8") == "this is [not toml"
    assert "Not saved" in panel.status.value


def test_utilisation_bars_write_the_verdict_and_cap_long_bars() -> None:
    svg = utilisation_bars_svg([("Compression", 0.5, "OK"), ("Flexure x", 2.0, "NOT OK")])
    assert "0.50 OK" in svg
    assert "2.00 NOT OK" in svg
    widths = [float(p.split('width="')[1].split('"')[0]) for p in svg.split("<rect")[1:]]
    assert widths[1] == pytest.approx(widths[0] * 3, abs=0.2)  # 1.5 cap vs 0.5, drawn to 0.1 px


def test_member_search_ranks_by_depth_under_a_limit_and_refuses_one_no_shape_meets(
    column_file: Path,
) -> None:
    panel = member_panel(column_file)
    ctl = panel.searcher
    ctl.order.value = "depth"
    ctl.max_depth.value = "6 in"
    found = panel.search(count=3)
    assert found is not None
    assert found.order == "depth"
    depths = [t.depth.to("inch").magnitude for t in found.passing]
    assert depths == sorted(depths)
    assert all(d <= 6.0 for d in depths)
    ctl.max_depth.value = "1 in"  # no HSS is that shallow
    assert panel.search() is None
    assert "max_depth" in ctl.ranking.value
    assert "the shallowest is" in ctl.ranking.value
    assert list(ctl.pick.options) == []
    assert ctl.use_button.disabled
    ctl.max_depth.value = "6 kip"  # not a length: refused naming the field
    assert panel.search() is None
    assert "deepest" in ctl.ranking.value
