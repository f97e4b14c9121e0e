"""A rebuild lays out only the chunks of the package whose HTML changed; the rest come from the
chunks kept by the earlier build, and the PDF is the same as a build from nothing."""

from __future__ import annotations

import shutil
from pathlib import Path
from typing import Any

import nbformat
import pytest
from projectkit import make_project

import calcpack.package.paginate as paginate_module
from calcpack.package.execute import CACHE_DIR_NAME
from calcpack.package.pipeline import build

pytestmark = pytest.mark.build


def _cells(load: float) -> list[str]:
    return [
        f'w = s.given("w", {load} * ureg.kN / ureg.m, "line load")\n'
        'L = s.given("L", 3.0 * ureg.m, "span")\n'
        'M = s.derive("M", w * L**2 / 8, "moment", unit="kN*m")'
    ]


@pytest.fixture
def one_chunk_per_sheet(monkeypatch: pytest.MonkeyPatch) -> list[list[str]]:
    """Every sheet in a chunk of its own; records the sections of each chunk laid out."""
    monkeypatch.setattr(paginate_module, "CHUNK_HTML_CHARS", 1)
    laid_out: list[list[str]] = []
    original = paginate_module._lay_out_chunk

    def recording(html: str, ids: Any, *rest: Any) -> Any:
        laid_out.append(list(ids))
        return original(html, ids, *rest)

    monkeypatch.setattr(paginate_module, "_lay_out_chunk", recording)
    return laid_out


def _edit_load(project: Path, sheet: str, load: float) -> None:
    path = project / sheet
    nb = nbformat.read(path, as_version=4)
    code = [c for c in nb.cells if c.cell_type == "code"]
    code[-1].source = _cells(load)[0]
    nbformat.write(nb, path)


def test_rebuild_lays_out_only_the_changed_sheet(
    tmp_path: Path, one_chunk_per_sheet: list[list[str]]
) -> None:
    sheets = {f"Beam {i}": _cells(2.0 + i) for i in range(1, 5)}
    project = make_project(tmp_path / "p", sheets)
    first = build(project, workers=1).pdf_path.read_bytes()
    assert ["sheet-2"] in one_chunk_per_sheet  # each sheet was a chunk of its own
    kept = sorted(p.name for p in (project / CACHE_DIR_NAME / "layout").iterdir())
    assert len(kept) == 2 * (len(one_chunk_per_sheet))  # a PDF and its description each

    _edit_load(project, "sheets/02.ipynb", 9.5)
    one_chunk_per_sheet.clear()
    second = build(project, workers=1)
    assert second.executed == ("sheets/02.ipynb",)
    laid = [ids for ids in one_chunk_per_sheet if any(i.startswith("sheet-") for i in ids)]
    assert laid == [["sheet-2"]]  # the other sheets came from the kept chunks

    # The same bytes as a build from nothing of the same notebooks (a copy without caches).
    fresh = tmp_path / "fresh"
    shutil.copytree(project, fresh, ignore=shutil.ignore_patterns(CACHE_DIR_NAME, "build"))
    again = build(fresh, workers=1, use_cache=False)
    assert second.pdf_path.read_bytes() == again.pdf_path.read_bytes()
    assert first != second.pdf_path.read_bytes()

    # Chunks the last build did not use are dropped.
    now = {p.stem for p in (project / CACHE_DIR_NAME / "layout").iterdir()}
    assert len(now) == len(kept) // 2


def test_forced_rebuild_with_workers_takes_every_chunk_kept(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    monkeypatch.setattr(paginate_module, "CHUNK_HTML_CHARS", 1)  # a chunk per sheet
    project = make_project(tmp_path / "p", {f"Beam {i}": _cells(1.0 + i) for i in range(3)})
    first = build(project, workers=2)
    folder = project / CACHE_DIR_NAME / "layout"
    before = {p.name: p.stat().st_mtime_ns for p in folder.iterdir()}
    assert before
    again = build(project, workers=2, force=True)
    assert again.pdf_path.read_bytes() == first.pdf_path.read_bytes()
    assert {p.name: p.stat().st_mtime_ns for p in folder.iterdir()} == before  # none rewritten


def test_a_damaged_kept_chunk_is_laid_out_again(
    tmp_path: Path, one_chunk_per_sheet: list[list[str]]
) -> None:
    project = make_project(tmp_path / "p", {"Beam": _cells(3.0)})
    first = build(project, workers=1)
    for meta in (project / CACHE_DIR_NAME / "layout").glob("*.json"):
        meta.write_text("{not json", "utf-8")
    one_chunk_per_sheet.clear()
    again = build(project, workers=1, force=True)
    assert ["sheet-1"] in one_chunk_per_sheet
    assert again.pdf_path.read_bytes() == first.pdf_path.read_bytes()
