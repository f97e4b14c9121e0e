"""`calcpack new`: the first sheet has an inputs file, listed with it, that its cells read."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from calcpack.cli import main
from calcpack.errors import DimensionError
from calcpack.inputs import Spec, get_path, load_inputs, require_input
from calcpack.package.project import load_project
from calcpack.units import Q_


@pytest.mark.parametrize(
    ("units", "span", "load"), [("SI", "3 m", "5 kN/m"), ("US", "10 ft", "0.3 klf")]
)
def test_first_sheet_reads_its_inputs_file(
    tmp_path: Path, units: str, span: str, load: str
) -> None:
    folder = tmp_path / "job"
    assert main(["new", str(folder), "--units", units]) == 0
    project = load_project(folder)
    entry = project.sheets[0]
    assert entry.inputs == ("sheets/01_first_sheet.inputs.toml",)
    data = load_inputs(folder / entry.inputs[0])
    L = require_input(get_path(data, "member.L"), Spec("[length]", positive=True), "member.L")
    w = get_path(data, "member.w")
    assert (L, w) == (Q_(span), Q_(load))
    assert w.check("[force] / [length]")
    nb = json.loads((folder / entry.path).read_text(encoding="utf-8"))
    assert nb["metadata"]["kernelspec"]["name"] == "python3"
    source = "\n".join("".join(c["source"]) for c in nb["cells"] if c["cell_type"] == "code")
    assert 'INPUTS = "01_first_sheet.inputs.toml"' in source
    assert 'read("member.L", "[length]")' in source
    assert "ureg." not in source  # no value typed into the sheet itself


def test_first_sheet_runs_and_refuses_a_value_without_its_dimension(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    folder = tmp_path / "job"
    assert main(["new", str(folder)]) == 0
    sheets = folder / "sheets"
    nb = json.loads((sheets / "01_first_sheet.ipynb").read_text(encoding="utf-8"))
    code = ["".join(c["source"]) for c in nb["cells"] if c["cell_type"] == "code"]
    monkeypatch.chdir(sheets)  # a sheet's kernel runs in its notebook's folder
    scope: dict[str, object] = {}
    for cell in code:
        exec(cell, scope)  # the scaffolded sheet's own cells, in order
    M = scope["M"]
    assert M.value.to("kN*m").magnitude == pytest.approx(5.0 * 3.0**2 / 8, rel=1e-12)  # type: ignore[attr-defined]
    text = (sheets / "01_first_sheet.inputs.toml").read_text(encoding="utf-8")
    (sheets / "01_first_sheet.inputs.toml").write_text(
        text.replace('w = "5 kN/m"', 'w = "5 kN"'), encoding="utf-8"
    )
    scope = {}
    exec(code[0], scope)
    with pytest.raises(DimensionError, match=r"member\.w"):
        exec(code[1], scope)
