"""The build's timeline printed at the end of `calcpack build` (calcpack.cli.build)."""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

import pytest

from calcpack.cli import build as cli_build
from calcpack.cli.build import timeline_lines
from calcpack.package.pipeline import BuildResult, SheetTime

T0 = 1_800_000_000.0  # seconds since the epoch: any moment will do


def test_sheets_side_by_side_overlap_and_a_cached_sheet_says_so():
    lines = timeline_lines(
        [
            SheetTime("sheets/02_beam.ipynb", T0 + 2.0, T0 + 10.0, False),
            SheetTime("sheets/01_loads.ipynb", T0, T0 + 4.0, False),
            SheetTime("sheets/03_post.ipynb", T0 + 3.0, T0 + 3.0, True),
        ]
    )
    assert lines[0].startswith("Sheet times")
    loads, beam, post = lines[1:]
    # in the order they started, the cached sheet last
    assert loads.lstrip().startswith("sheets/01_loads.ipynb")
    assert beam.lstrip().startswith("sheets/02_beam.ipynb")
    assert post.rstrip().endswith("from cache")
    assert "0.0 to    4.0  (4.0 s)" in loads
    assert "2.0 to   10.0  (8.0 s)" in beam
    # bars over a 10 s span, 24 characters: 0-4 s and 2-10 s overlap (run side by side)
    at = 2 + len("sheets/01_loads.ipynb") + 2  # indent, the longest path, two spaces
    bar_loads, bar_beam = loads[at : at + 24], beam[at : at + 24]
    assert bar_loads.startswith("#")
    assert bar_loads.rstrip().endswith("#")
    assert bar_beam.startswith(" ")
    assert bar_beam.endswith("#")
    first = {i for i, ch in enumerate(bar_loads) if ch == "#"}
    second = {i for i, ch in enumerate(bar_beam) if ch == "#"}
    assert first & second
    assert max(first) < 24 * 4 / 10 + 1
    assert min(second) == int(24 * 2 / 10)


def test_nothing_ran_gives_no_timeline_and_only_cached_sheets_are_listed_as_such():
    assert timeline_lines([]) == []
    lines = timeline_lines([SheetTime("sheets/01.ipynb", T0, T0, True)])
    assert len(lines) == 2
    assert lines[1].rstrip().endswith("from cache")


def _result(tmp_path: Path) -> BuildResult:
    return BuildResult(
        tmp_path / "p.pdf",
        tmp_path / "p.manifest.json",
        {},
        3,
        ("sheets/01_loads.ipynb",),
        (),
        False,
        4.2,
        timeline=(SheetTime("sheets/01_loads.ipynb", T0, T0 + 4.0, False),),
    )


@pytest.mark.parametrize("quiet", [False, True])
def test_build_prints_the_timeline_unless_quiet(
    quiet: bool, tmp_path: Path, monkeypatch: pytest.MonkeyPatch, capsys: Any
) -> None:
    import calcpack.package.pipeline as pipeline

    monkeypatch.setattr(pipeline, "build", lambda *a, **k: _result(tmp_path))
    args = argparse.Namespace(
        project=str(tmp_path), out=None, workers=1, timeout=10.0, no_cache=False, paper=None,
        reviewer_copy=False, force=False, supersede_signed=False, quiet=quiet,
    )  # fmt: skip
    assert cli_build.handler(args) == 0
    out = capsys.readouterr().out
    assert ("Sheet times" in out) is not quiet
    assert ("sheets/01_loads.ipynb" in out) is not quiet
    assert "Wrote" in out
