"""The workshop roof truss example notebook: stored clean, and its code runs to the end with
the working agreeing with the solver."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import nbformat
import pytest

NOTEBOOK = (
    Path(__file__).resolve().parents[3]
    / "example_projects"
    / "truss_examples"
    / "workshop_roof_truss.ipynb"
)


def test_stored_without_outputs_with_python3_kernel() -> None:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    assert nb.metadata["kernelspec"]["name"] == "python3"
    for cell in nb.cells:
        if cell.cell_type == "code":
            assert cell.outputs == []
            assert cell.execution_count is None


def test_code_runs_and_section_agrees_with_joints() -> None:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    ns: dict[str, Any] = {}
    for cell in nb.cells:
        if cell.cell_type == "code":
            exec(compile(cell.source, str(NOTEBOOK), "exec"), ns)  # the notebook's own code
    gravity = ns["gravity"]
    # Hand check of the combination (common practice): each reaction is half the total
    # vertical load of 1.2 D + 1.6 Lr on a symmetric truss.
    total = sum(-fy.to("kN").magnitude for _, fy in gravity.applied.values())
    assert gravity.reaction("R_L6").to("kN").magnitude == pytest.approx(total / 2, rel=1e-12)
    block = gravity.section_working(["U2U3", "U2L3", "L2L3"], keep="L0")
    values = {s.name: s.quantity for s in block.steps if hasattr(s, "quantity")}
    for member in ("U2U3", "U2L3", "L2L3"):
        assert values[f"F_{member}"].to("kN").magnitude == pytest.approx(
            gravity.force(member).to("kN").magnitude, rel=1e-9
        )
    assert ns["s"].values()  # the sheet recorded its values
