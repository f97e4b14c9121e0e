"""Two independent chains of sheets (a → b, c → d) built with two workers in real kernels: the
build's timeline shows the chains side by side and each importer starting after its exporter
finished, and the values cross. Sheets a and c each wait until the other has started (a marker
file each), so a build that ran them one after the other would fail here rather than pass by
luck of timing."""

from __future__ import annotations

from pathlib import Path

import pytest
from linkkit import exported, write_linked_project

from calcpack.package import execute
from calcpack.package.project import load_project

pytestmark = pytest.mark.build


def _meets(me: str, other: str, folder: Path, kN: float) -> str:
    return (
        "import pathlib, time\n"
        f"here = pathlib.Path({str(folder)!r})\n"
        f"(here / {me!r}).touch()\n"
        "t0 = time.time()\n"
        f"while not (here / {other!r}).exists():\n"
        "    if time.time() - t0 > 240:\n"
        f"        raise RuntimeError('sheet {other} did not start while sheet {me} ran')\n"
        "    time.sleep(0.05)\n"
        f's.export(s.given("P", {kN!r} * ureg.kN, "load"))\n'
    )


def _takes(sheet: str, kN: float) -> str:
    return (
        f'P_in = s.import_value("{sheet}", "P", dimension="[force]")\n'
        f's.export(s.derive("N", P_in + {kN!r} * ureg.kN, unit="kN"))\n'
    )


def test_two_chains_run_side_by_side_and_each_importer_after_its_exporter(
    tmp_path: Path,
) -> None:
    marks = tmp_path / "marks"
    marks.mkdir()
    root = write_linked_project(
        tmp_path / "project",
        {
            "a": _meets("a", "c", marks, 1.5),
            "b": _takes("a", 0.25),
            "c": _meets("c", "a", marks, 4.0),
            "d": _takes("c", 0.5),
        },
        ["a", "b", "c", "d"],
    )
    done = execute.execute_sheets(load_project(root), workers=2, use_cache=False, timeout=300)
    when = {i.entry.path.split("/")[-1][0]: (i.started_at, i.finished_at) for i in done}
    assert all(not i.from_cache for i in done)
    # each importer started after its exporter finished
    assert when["b"][0] >= when["a"][1]
    assert when["d"][0] >= when["c"][1]
    # the chains' first sheets ran at the same time
    assert max(when["a"][0], when["c"][0]) < min(when["a"][1], when["c"][1])
    values = {i.entry.path: exported(i.notebook_json) for i in done}
    # 1.5 + 0.25 and 4.0 + 0.5 (arithmetic)
    assert values["sheets/b.ipynb"]["N"] == 1.75
    assert values["sheets/d.ipynb"]["N"] == 4.5
