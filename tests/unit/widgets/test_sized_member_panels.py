"""The timber post and beam member panels: search, pick into the file, errors at the field,
and what the panel shows equal to what the file gives the sheet's cells.

The numbers themselves are checked against closed forms in
``tests/unit/inputs/test_sized_member_inputs.py``; here the panel is checked to show and write
what those functions give.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.combinations import analyse_combinations, asce7_allowable_stress
from calcpack.inputs import load_inputs
from calcpack.inputs.beam_member import BeamDemand, beam_member_inputs, evaluate_beam_member
from calcpack.inputs.timber_post import evaluate_timber_post, timber_post_inputs
from calcpack.loads.types import UniformLoad
from calcpack.sizing import DeflectionLimit
from calcpack.units import Q_
from calcpack.widgets import beam_member_panel, timber_post_panel

POST = """\
# posts of a deck (invented)
[post]
mark = "P1"
size = "4x4"        # nominal
species = "Douglas Fir-Larch"
grade = "No.2"
le = "8 ft"

[[forces]]
combination = "D + L"
P = "{P}"
duration = "ten years"
"""

JOIST = """\
[joist]
material = "sawn"
mark = "J1"
species = "Douglas Fir-Larch"
grade = "No.2"
size = "2x6"        # nominal

[other]
note = "1/2 in. bolt"   # another sheet's table: not read by the panel
"""


def _governing(html: str) -> float:
    marker = 'class="cp-governing" data-value="'
    start = html.index(marker) + len(marker)
    return float(html[start : html.index('"', start)])


@pytest.fixture
def post_file(tmp_path: Path) -> Path:
    p = tmp_path / "posts.inputs.toml"
    p.write_text(POST.format(P="9 kip"), encoding="utf-8")
    return p


def test_post_panel_pick_writes_the_lightest_passing_size(post_file: Path) -> None:
    panel = timber_post_panel(post_file)
    assert _governing(panel.outputs["results"].value) > 1.0  # a 4x4 does not carry 9 kip
    found = panel.search()
    assert found is not None
    assert found.passing
    assert found.next_lighter is not None
    assert found.next_lighter.verdict == "fails"
    assert panel.searcher.pick.value == found.passing[0].name
    assert 'class="cp-next-lighter"' in panel.searcher.ranking.value
    assert panel.use(panel.searcher.pick.value)
    saved = load_inputs(post_file)
    assert saved["post"]["size"] == found.passing[0].name
    assert "# nominal" in post_file.read_text(encoding="utf-8")
    # the file, read as the sheet reads it, gives what the panel shows
    sheet = evaluate_timber_post(timber_post_inputs(saved, path=post_file))
    assert _governing(panel.outputs["results"].value) == pytest.approx(sheet.governing[0])
    assert sheet.governing[0] == pytest.approx(found.passing[0].utilisation)


def test_post_panel_says_when_no_size_passes_and_shows_the_closest(tmp_path: Path) -> None:
    p = tmp_path / "posts.inputs.toml"
    p.write_text(POST.format(P="60 kip"), encoding="utf-8")
    panel = timber_post_panel(p)
    found = panel.search()
    assert found is not None
    assert not found.passing
    html = panel.searcher.ranking.value
    assert "No size of the 3 tried passes every check" in html
    assert found.closest is not None
    assert f'class="cp-closest" data-name="{found.closest.name}"' in html
    assert panel.searcher.use_button.disabled


def _demand() -> BeamDemand:
    L = Q_(14, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[
            UniformLoad(w=Q_(40, "lbf/ft"), case="D"),
            UniformLoad(w=Q_(120, "lbf/ft"), case="L"),
        ],
        EI=Q_(1.6e6, "psi") * Q_(100, "in**4"),
        name="J1",
    )
    cases = solve_cases(beam)
    return BeamDemand(
        analyse_combinations(cases, asce7_allowable_stress()),
        deflections=[DeflectionLimit(cases["L"], L, 360)],
    )


def test_beam_member_panel_refuses_a_bad_size_at_its_field_and_picks(tmp_path: Path) -> None:
    p = tmp_path / "joist.inputs.toml"
    p.write_text(JOIST, encoding="utf-8")
    demand = _demand()
    panel = beam_member_panel(p, demand, table="joist")
    before = panel.outputs["results"].value
    panel.set("joist.size", "2x7")
    field = panel.fields["joist.size"]
    assert "joist.size" in field.error
    assert load_inputs(p, tables=("joist",))["joist"]["size"] == "2x6"  # not written
    assert panel.outputs["results"].value == before  # the last valid display stays
    found = panel.search()
    assert found is not None
    assert panel.use(found.passing[0].name)
    saved = load_inputs(p, tables=("joist",))
    assert saved["joist"]["size"] == found.passing[0].name
    assert 'note = "1/2 in. bolt"' in p.read_text(encoding="utf-8")
    sheet = evaluate_beam_member(beam_member_inputs(saved, demand, table="joist", path=p))
    assert sheet.passed
    assert _governing(panel.outputs["results"].value) == pytest.approx(sheet.governing[0])


def test_beam_member_panel_searches_the_grades_picked_and_writes_size_and_grade(
    tmp_path: Path,
) -> None:
    p = tmp_path / "joist.inputs.toml"
    p.write_text(JOIST, encoding="utf-8")
    demand = _demand()
    panel = beam_member_panel(p, demand, table="joist")
    assert panel.grades_box.layout.display != "none"  # a sawn member: the grades are offered
    assert {"No.1", "No.2", "Select Structural"} <= set(panel.grades.options)
    assert panel.grades.value == ("No.2",)  # the table's grade alone by default
    assert panel.searched_grades() is None
    alone = panel.search()
    assert alone is not None
    assert " " not in alone.best.name  # one grade: the sizes by name, as before
    panel.grades.value = ("No.2", "Select Structural")
    found = panel.search()
    assert found is not None
    assert {t.name.split(" ", 1)[1] for t in found.tried} == {"No.2", "Select Structural"}
    assert found.best.weight <= alone.best.weight  # a better grade can only help
    assert panel.use(found.best.name)
    saved = load_inputs(p, tables=("joist",))["joist"]
    size, grade = found.best.name.split(" ", 1)
    assert (saved["size"], saved["grade"]) == (size, grade)
    sheet = evaluate_beam_member(beam_member_inputs({"joist": saved}, demand, table="joist"))
    assert sheet.passed
    # after the pick the grade field shows the grade written, and the picker keeps the choice
    assert panel.fields["joist.grade"].box.value == grade
    assert set(panel.grades.value) == {"No.2", "Select Structural"}
