"""The floor beam example notebook: stored clean, and its code runs to the end with the
working agreeing with the solver."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import nbformat
import pytest

NOTEBOOK = (
    Path(__file__).resolve().parents[3] / "example_projects" / "beam_examples" / "floor_beam.ipynb"
)


def test_stored_without_outputs_with_python3_kernel() -> None:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    assert nb.metadata["kernelspec"]["name"] == "python3"
    for cell in nb.cells:
        if cell.cell_type == "code":
            assert cell.outputs == []
            assert cell.execution_count is None


def test_code_runs_and_reactions_balance_the_loads() -> None:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    ns: dict[str, Any] = {}
    for cell in nb.cells:
        if cell.cell_type == "code":
            exec(compile(cell.source, str(NOTEBOOK), "exec"), ns)  # the notebook's own code
    r1, r2 = ns["r1"], ns["r2"]
    # Hand check of B1 (statics): total factored load = Σ reactions.
    w = 1.2 * (3.1 * 2.4 + 0.45) + 1.6 * 3.0 * 2.4  # kN/m over 7.2 m
    total = w * 7.2 + 1.2 * 6.0 + 1.6 * 4.5
    assert sum(x.Fy.to("kN").magnitude for x in r1.reactions) == pytest.approx(total, rel=1e-12)
    assert r2.classification.degree == 1
    sheet = ns["s"]
    (check,) = sheet.checks()
    assert check.member == "B1"
    assert check.utilisation == pytest.approx(check.demand / check.capacity, rel=1e-12)
    assert r1.figure().svg.startswith("<?xml")
