"""The check example notebook is stored without outputs, with the python3 kernelspec, and
uses the library's own objects for every check."""

from __future__ import annotations

from pathlib import Path

import nbformat

NB = Path(__file__).parents[2] / "example_projects/check_examples/steel_beam_and_joist.ipynb"


def test_stored_without_outputs_with_python3_kernel():
    nb = nbformat.read(NB, as_version=4)
    assert nb.metadata["kernelspec"]["name"] == "python3"
    for cell in nb.cells:
        if cell.cell_type == "code":
            assert cell.outputs == []
            assert cell.execution_count is None


def test_checks_steel_and_timber_with_a_summary():
    src = "\n".join(c.source for c in nbformat.read(NB, as_version=4).cells)
    for name in ("check_aisc_beam", "check_nds_beam", "check_deflection", "summary_table",
                 "asce7_strength", "asce7_allowable_stress", "pattern_cases"):  # fmt: skip
        assert name in src
