"""A changed upstream value is shown once, with the downstream values it changed; the archive
check compares the links between sheets as well as the values.

Sheets run in this process (``linkkit.run_in_process`` in place of a kernel); the manifests are
the archive check's fresh ones (``reproduce_manifest``), so the links are the build's own.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from linkkit import run_in_process, write_linked_project

from calcpack.contract.compare import diff_manifests
from calcpack.package import execute, reproduce_manifest

LOADS = 's.export(s.given("P", {P!r} * ureg.kN, "load"))\ns.given("gamma", 1.5, "factor")\n'
BEAM = (
    'P = s.import_value("loads", "P", dimension="[force]")\n'
    's.export(s.derive("R", P / 2 + 1 * ureg.kN, "reaction", unit="kN"))\n'
)
POST = (
    'R = s.import_value("beam", "R", dimension="[force]")\n'
    's.check("Compression", R, 10 * ureg.kN, member="P1")\n'
)
OTHER = 's.given("Q", 7 * ureg.kN, "unrelated load")\n'


@pytest.fixture
def in_process(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(execute, "_execute", run_in_process)


def _project(root: Path, P: float) -> Path:
    sheets = {"loads": LOADS.format(P=P), "beam": BEAM, "post": POST, "other": OTHER}
    return write_linked_project(root, sheets, list(sheets))


def test_the_archive_check_records_every_link_with_its_value(
    tmp_path: Path, in_process: None
) -> None:
    fresh = reproduce_manifest(_project(tmp_path, 4.0), workers=1)
    links = {(x["from_sheet"], x["from_name"], x["to_sheet"]): x["value"] for x in fresh["links"]}
    assert links == {
        ("sheets/loads.ipynb", "P", "sheets/beam.ipynb"): 4.0,
        ("sheets/beam.ipynb", "R", "sheets/post.ipynb"): 3.0,  # 4/2 + 1 (arithmetic)
    }
    assert diff_manifests(fresh, reproduce_manifest(tmp_path, workers=1)).empty


def test_a_link_carrying_another_value_is_reported_by_the_archive_check(
    tmp_path: Path, in_process: None
) -> None:
    recorded = reproduce_manifest(_project(tmp_path, 4.0), workers=1)
    tampered = dict(recorded, links=[dict(x) for x in recorded["links"]])
    tampered["links"][1]["value"] = 3.1
    changes = diff_manifests(tampered, reproduce_manifest(tmp_path, workers=1)).changes
    (link,) = changes
    assert link.kind == "link"
    assert link.name == "R from sheet 2 R"
    assert (link.old, link.new) == ("3.1 kN", "3 kN")


def test_a_changed_upstream_value_is_shown_once_with_what_it_changed_downstream(
    tmp_path: Path, in_process: None
) -> None:
    before = reproduce_manifest(_project(tmp_path, 4.0), workers=1)
    after = reproduce_manifest(_project(tmp_path, 6.0), workers=1)
    diff = diff_manifests(before, after)
    shown = [c for c in diff.changes if c.shown]
    by_name = {(c.path, c.name): c for c in shown}
    origin = by_name[("sheets/loads.ipynb", "P")]
    assert origin.carried_to == ("sheet 2 as P",)
    beam_r = by_name[("sheets/beam.ipynb", "R")]
    assert (beam_r.old, beam_r.new) == ("3.00 kN", "4.00 kN")  # the sheet's three figures
    assert beam_r.due_to == ("sheet 1 P",)
    assert beam_r.carried_to == ("sheet 3 as R",)
    check = by_name[("sheets/post.ipynb", "Compression (P1)")]
    assert set(check.due_to) == {"sheet 1 P", "sheet 2 R"}
    # the imported copies (P on sheet 2, R on sheet 3) and the links are not shown again
    hidden = {(c.path, c.name) for c in diff.changes if not c.shown}
    assert ("sheets/beam.ipynb", "P") in hidden
    assert ("sheets/post.ipynb", "R") in hidden
    assert not any(c.path == "sheets/other.ipynb" for c in diff.changes)
    table = diff.table()
    assert table.count("4.00 kN") == 1 + 1  # P's old value once; R's new value once
    assert "carried to sheet 2 as P" in table
    assert "follows from sheet 1 P" in table
