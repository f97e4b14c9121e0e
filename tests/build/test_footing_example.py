"""The SI footing example (example_projects/footing_examples): stored clean, runs to the end,
every check OK with its clause, the sketch drawn, and the flexure at the section for moment
equal to the closed form for a concentric load (common practice: M = q·B·l²/2 with
q = N_Ed/A, l from the section to the edge; the section halfway between the column face and
the plate edge, ACI 318-19 §13.2.7.1 as used by calcpack for both routes)."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import nbformat
import pytest

from calcpack.units import Q_

pytestmark = pytest.mark.build

NOTEBOOK = (
    Path(__file__).resolve().parents[2]
    / "example_projects"
    / "footing_examples"
    / "pad_footing_si.ipynb"
)


def _run() -> dict[str, Any]:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    ns: dict[str, Any] = {}
    for cell in nb.cells:
        if cell.cell_type == "code":
            exec(compile(cell.source, str(NOTEBOOK), "exec"), ns)  # the notebook's own code
    return ns


def test_stored_without_outputs_with_python3_kernel() -> None:
    nb = nbformat.read(NOTEBOOK, as_version=4)
    assert nb.metadata["kernelspec"]["name"] == "python3"
    for cell in nb.cells:
        if cell.cell_type == "code":
            assert cell.outputs == []
            assert cell.execution_count is None


def test_runs_with_every_check_ok_and_a_sketch() -> None:
    from calcpack.working import Figure

    ns = _run()
    sheet = ns["s"]
    checks = sheet.checks()
    names = {(c.member, c.name) for c in checks}
    for key in [
        ("F3 undrained", "Bearing DA1-2"),
        ("F3 drained", "Bearing DA1-1"),
        ("F3", "Punching"),
    ]:
        assert key in names
    assert all(c.verdict == "OK" for c in checks)
    assert all(c.ref for c in checks)
    figs = [st for st in sheet.steps if isinstance(st, Figure) and st.drawing == "footing"]
    assert len(figs) == 1
    assert "u1 at 2d" in figs[0].svg()


def test_flexure_equals_the_closed_form_for_the_concentric_combination() -> None:
    from calcpack.checks.en1992 import check_en1992_footing

    ns = _run()
    F3, design = ns["F3"], ns["design"]
    loads = {k: v for k, v in ns["loads"].items() if k != "W"}
    r = check_en1992_footing(F3, loads, {"Q": "B"}, design)
    N_Ed = 1.35 * 280 + 1.5 * 120  # kN, EN 1990 Eq. (6.10), recommended A1 factors
    a_m = (0.25 / 2 + 0.35 / 2) / 2  # m, halfway between column face and plate edge
    l = 0.8 - a_m
    M = N_Ed / 1.6**2 * 1.6 * l**2 / 2  # kN·m
    assert r["Flexure x"].demand.to("kN*m").magnitude == pytest.approx(M, rel=1e-9)
    # the example's own combination with the wind moment can only be larger
    assert ns["conc"]["Flexure x"].demand >= Q_(M, "kN*m") * (1 - 1e-9)
