"""A failing sheet stops the build and leaves the earlier package untouched; the cache works."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import nbformat
import pytest

from calcpack.errors import NotebookExecutionError
from calcpack.package.pipeline import build

pytestmark = pytest.mark.build

LOADS = [
    'w = s.given("w", 4.0 * ureg.kN / ureg.m, "line load")\n'
    'L = s.given("L", 3.0 * ureg.m, "span")\n'
    'M = s.derive("M", w * L**2 / 8, "moment", unit="kN*m")'
]
CHECK = [
    'sigma = s.given("sigma", 6.0 * ureg.MPa, "stress")\n'
    's.check("Bending", sigma, 10.0 * ureg.MPa, member="B1")'
]


@pytest.fixture
def project(new_project: Any, tmp_path: Path) -> Path:
    return new_project(tmp_path / "job", {"Loads": LOADS, "Check": CHECK})


def test_cache_reexecutes_only_the_changed_sheet(project: Path) -> None:
    first = build(project)
    assert first.executed == ("sheets/01.ipynb", "sheets/02.ipynb")
    assert first.cached == ()

    again = build(project, force=True)
    assert again.executed == ()
    assert again.cached == ("sheets/01.ipynb", "sheets/02.ipynb")

    path = project / "sheets" / "02.ipynb"
    nb = nbformat.read(path, as_version=4)
    nb.cells.append(nbformat.v4.new_markdown_cell("A note added by the checker."))
    nbformat.write(nb, path)
    third = build(project)
    assert third.executed == ("sheets/02.ipynb",)
    assert third.cached == ("sheets/01.ipynb",)
    assert third.manifest["sheets"][1]["checks"][0]["utilisation"] == pytest.approx(0.6)


def test_failing_cell_names_sheet_and_cell_and_keeps_old_package(project: Path) -> None:
    good = build(project)
    pdf_before = good.pdf_path.read_bytes()
    manifest_before = good.manifest_path.read_bytes()

    path = project / "sheets" / "02.ipynb"
    nb = nbformat.read(path, as_version=4)
    nb.cells.append(nbformat.v4.new_code_cell("ratio = 1 / 0  # a slip\nprint(ratio)"))
    nbformat.write(nb, path)
    with pytest.raises(NotebookExecutionError) as info:
        build(project)
    error = info.value
    assert error.sheet == "sheets/02.ipynb"
    assert error.cell_index == len(nb.cells)  # 1-based position in the notebook
    assert error.source_excerpt == "ratio = 1 / 0  # a slip"
    assert "ZeroDivisionError" in error.error
    message = str(error)
    assert "sheets/02.ipynb" in message
    assert f"cell {len(nb.cells)}" in message
    assert "ratio = 1 / 0" in message
    assert good.pdf_path.read_bytes() == pdf_before
    assert good.manifest_path.read_bytes() == manifest_before
    assert sorted(p.name for p in good.pdf_path.parent.iterdir()) == sorted(
        [good.pdf_path.name, good.manifest_path.name]
    )  # no temporary files left behind


def test_cell_timeout_is_reported(new_project: Any, tmp_path: Path) -> None:
    project = new_project(tmp_path / "slow", {"Slow": ["import time\ntime.sleep(300)"]})
    # the limit leaves the sheet's first cells (importing calcpack) time on a loaded machine
    with pytest.raises(NotebookExecutionError) as info:
        build(project, timeout=20, workers=1)
    assert info.value.cell_index == 3
    assert info.value.source_excerpt == "import time"
    assert "timed out" in info.value.error


def test_failure_in_parallel_names_the_first_failing_sheet(
    new_project: Any, tmp_path: Path
) -> None:
    project = new_project(
        tmp_path / "two",
        {"Good": LOADS, "Bad": ['raise ValueError("span L must be positive")'], "Ok": CHECK},
    )
    with pytest.raises(NotebookExecutionError, match=r"sheets/02\.ipynb") as info:
        build(project, workers=2)
    assert "span L must be positive" in info.value.error
    assert not (project / "build").exists()


def test_failure_cancels_the_sheets_still_queued(new_project: Any, tmp_path: Path) -> None:
    # The failing sheet comes first; most of the others are still queued when it fails, are
    # cancelled, and the failure is what the build reports.
    sheets: dict[str, list[str]] = {"Bad": ['raise ValueError("load w must be positive")']}
    sheets.update({f"Good {i}": LOADS for i in range(6)})
    project = new_project(tmp_path / "seven", sheets)
    with pytest.raises(NotebookExecutionError, match=r"sheets/01\.ipynb") as info:
        build(project, workers=2)
    assert "load w must be positive" in info.value.error
    assert not (project / "build").exists()
