"""The eurocode-uk preset travels: the project file declares it, the package gets its
standards and cautions, a sheet reads it from the project and gets SI display and the UK
annex's combinations."""

from __future__ import annotations

from pathlib import Path

import pytest

from calcpack.errors import InputError
from calcpack.package.project import ProjectFileError, load_project
from calcpack.presets import preset, project_preset

PROJECT = """
[job]
number = "UK-1"
title = "Wall removal"
client = "Invented Client Ltd"
site = "1 Nowhere Lane"
units = "{units}"

[people]
preparer = "A. Okafor"
checker = "J. Lindqvist"
approver = "R. Mbeki"

[[revisions]]
rev = "A"
date = 2026-11-20
description = "First issue"

[[sheets]]
path = "sheets/one.ipynb"

[design]
preset = "eurocode-uk"
cautions = ["Own caution"]
"""


def _write(tmp_path: Path, units: str = "SI") -> Path:
    (tmp_path / "sheets").mkdir(exist_ok=True)
    (tmp_path / "sheets" / "one.ipynb").write_text("{}", encoding="utf-8")
    (tmp_path / "calcpack.toml").write_text(PROJECT.format(units=units), encoding="utf-8")
    return tmp_path


def test_project_with_the_preset_gets_its_standards_and_cautions(tmp_path: Path) -> None:
    p = load_project(_write(tmp_path))
    assert p.design.preset == "eurocode-uk"
    assert any("BS EN 1993-1-1" in s for s in p.design.standards)
    assert p.design.cautions[-1] == "Own caution"
    assert any("UK National Annexes" in c for c in p.design.cautions)


def test_preset_refuses_us_units(tmp_path: Path) -> None:
    with pytest.raises(ProjectFileError, match=r"job\.units"):
        load_project(_write(tmp_path, units="US"))


def test_unknown_preset_names_the_field(tmp_path: Path) -> None:
    root = _write(tmp_path)
    f = root / "calcpack.toml"
    f.write_text(f.read_text().replace("eurocode-uk", "eurocode-ie"), encoding="utf-8")
    with pytest.raises(ProjectFileError, match=r"design\.preset"):
        load_project(root)


def test_sheet_reads_the_preset_from_its_project(tmp_path: Path) -> None:
    from calcpack.units import get_display, set_display

    root = _write(tmp_path)
    p = project_preset(root / "sheets")
    before = get_display().system
    try:
        set_display(system="US")
        p.apply()
        assert get_display().system == "SI"
    finally:
        set_display(system=before)
    uls = p.combinations(variable={"Q": "A"})
    # UK NA: ξ = 0.925 on 1.35 (Table NA.A1.2(B))
    assert uls["6.10b (Q leading)"].factors["G"] == pytest.approx(0.925 * 1.35, abs=1e-12)


def test_no_project_is_an_input_error(tmp_path: Path) -> None:
    with pytest.raises(InputError, match=r"calcpack\.toml"):
        project_preset(tmp_path)


def test_unknown_preset_suggests():
    with pytest.raises(InputError, match="eurocode-uk"):
        preset("eurocode-ie")
