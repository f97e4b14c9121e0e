"""Two independent chains of linked sheets run side by side in real kernels, each in its own
dependency order.

Each first sheet waits (up to a minute) until the other chain's first sheet has started, so the
test fails -- rather than passing slowly -- if the build ran them one after the other; each
second sheet asserts its upstream sheet had finished before it started. No timing is measured.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from linkkit import exported, write_linked_project

from calcpack.package import execute
from calcpack.package.project import load_project

pytestmark = pytest.mark.build

FIRST = """
import time
from pathlib import Path
marks = Path({marks!r})
(marks / "{me}.started").touch()
deadline = time.monotonic() + 60
while not (marks / "{other}.started").exists():
    assert time.monotonic() < deadline, "{other} did not run beside {me}"
    time.sleep(0.05)
s.export(s.given("P", {value!r} * ureg.kN, "load"))
(marks / "{me}.done").touch()
"""
SECOND = """
from pathlib import Path
assert (Path({marks!r}) / "{upstream}.done").exists(), "{upstream} had not finished"
P = s.import_value("{upstream}", "P", dimension="[force]")
s.export(s.derive("R", 2 * P, "reaction", unit="kN"))
"""


def test_two_independent_chains_run_side_by_side(tmp_path: Path) -> None:
    marks = tmp_path / "marks"
    marks.mkdir()
    sheets = {
        "a1": FIRST.format(marks=str(marks), me="a1", other="b1", value=1.5),
        "a2": SECOND.format(marks=str(marks), upstream="a1"),
        "b1": FIRST.format(marks=str(marks), me="b1", other="a1", value=4.0),
        "b2": SECOND.format(marks=str(marks), upstream="b1"),
    }
    root = write_linked_project(tmp_path / "project", sheets, ["a2", "b2", "a1", "b1"])
    done = execute.execute_sheets(load_project(root), workers=2, use_cache=False, timeout=120)
    values = {item.entry.path: exported(item.notebook_json) for item in done}
    assert values["sheets/a2.ipynb"]["R"] == 3.0  # 2 x 1.5 (arithmetic)
    assert values["sheets/b2.ipynb"]["R"] == 8.0  # 2 x 4.0
