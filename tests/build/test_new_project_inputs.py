"""`calcpack new`: the first sheet reads its values from its inputs file, and a build follows it.

The expected moments are the simple-span formula M = w L² / 8 for a uniform load (common
practice; any first course in statics), computed here from the values written to the file.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from calcpack.cli import main
from calcpack.inputs import update_inputs
from calcpack.package.pipeline import build
from calcpack.units import Q_

pytestmark = pytest.mark.build


def _values(result: object) -> dict[str, dict[str, object]]:
    sheets = result.manifest["sheets"]  # type: ignore[attr-defined]
    return {v["name"]: v for v in sheets[0]["values"]}


def test_new_project_builds_from_its_inputs_file(tmp_path: Path) -> None:
    folder = tmp_path / "job"
    assert main(["new", str(folder), "--job-number", "2460", "--title", "Carport"]) == 0
    inputs = folder / "sheets" / "01_first_sheet.inputs.toml"
    assert inputs.is_file()

    first = build(folder, workers=1)
    assert first.executed == ("sheets/01_first_sheet.ipynb",)
    v = _values(first)
    assert (v["L"]["value"], v["L"]["unit"]) == (3.0, "m")
    assert (v["w"]["value"], v["w"]["unit"]) == (5.0, "kN/m")
    # 1e-12: one multiplication and a division by 8, in floating point.
    assert v["M_max"]["value"] == pytest.approx(5.0 * 3.0**2 / 8, rel=1e-12)
    hashes = {f["path"]: f["sha256"] for f in first.manifest["files"]}
    assert "sheets/01_first_sheet.inputs.toml" in hashes

    # Change the span in the file only: the rebuild re-runs the sheet and records the new value.
    update_inputs(inputs, {"member.L": Q_(4.5, "m")})
    second = build(folder, workers=1)
    assert second.executed == ("sheets/01_first_sheet.ipynb",)  # not the cached run
    v = _values(second)
    assert v["L"]["value"] == 4.5
    assert v["M_max"]["value"] == pytest.approx(5.0 * 4.5**2 / 8, rel=1e-12)
    rehashed = {f["path"]: f["sha256"] for f in second.manifest["files"]}
    assert (
        rehashed["sheets/01_first_sheet.inputs.toml"] != hashes["sheets/01_first_sheet.inputs.toml"]
    )
