"""Values carried between sheets: export, import, the exports file and its errors."""

from __future__ import annotations

import json
import warnings
from pathlib import Path

import pytest

from calcpack import ureg
from calcpack.errors import DimensionError, InputError
from calcpack.working import Sheet
from calcpack.working.links import (
    EXPORTS_DIR_ENV,
    SHEET_ENV,
    exports_path,
    read_exports,
    resolve_sheet,
)
from tests.linkkit import PLACEHOLDER_SHEET, sheets_folder_project


@pytest.fixture
def project(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    """A project of three sheets; the working folder is its sheets folder, as in a kernel."""
    names = ("01_loads", "02_beam", "03_post")
    inputs = {"02_beam": 'L = "3 m"\n'}
    return sheets_folder_project(tmp_path, names, monkeypatch, inputs=inputs)


def _loads_sheet(monkeypatch: pytest.MonkeyPatch, w_kN_per_m: float = 5.4) -> Sheet:
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    s = Sheet("Loads", auto_display=False)
    g = s.given("g", 0.75 * ureg.kN / ureg.m**2, "floor dead load")
    b = s.given("b_t", 1.8 * ureg.m, "tributary width")
    w = s.derive("w", g * b + (w_kN_per_m - 1.35) * ureg.kN / ureg.m, "line load", unit="kN/m")
    s.export(w)
    monkeypatch.delenv(SHEET_ENV)
    return s


def test_import_reads_the_exported_value_at_full_precision(project, monkeypatch):
    loads = _loads_sheet(monkeypatch, w_kN_per_m=5.4 + 1e-12)
    s = Sheet("Beam", auto_display=False)
    w = s.import_value("01_loads", "w", dimension="[force]/[length]")
    exported = loads["w"].record().value
    # full precision: the very float the exporting sheet recorded (not a rounded 5.40)
    assert w.record().value == exported
    assert w.source == "sheet 1, w"
    assert w.link == "#sheet-1"
    link = w.records()["imports"][0]
    assert link == {
        "from_sheet": "sheets/01_loads.ipynb",
        "from_name": "w",
        "case": None,
        "to_name": "w",
        "value": exported,
        "unit": "kN/m",
    }
    assert '<a class="cp-link" href="#sheet-1">sheet 1, w</a>' in w.html()


def test_imported_value_works_in_formulas_and_keeps_units(project, monkeypatch):
    _loads_sheet(monkeypatch)
    s = Sheet("Beam", auto_display=False)
    w = s.import_value("sheets/01_loads.ipynb", "w", as_name="w_d", unit="N/m")
    L = s.given("L", 3 * ureg.m)
    M = s.derive("M", w * L**2 / 8, unit="kN*m")
    # w L^2 / 8 with w = 5.4 kN/m, L = 3 m: 6.075 kN m (arithmetic)
    assert M.quantity.to("kN*m").magnitude == pytest.approx(6.075, rel=1e-12)
    assert w.name == "w_d"
    assert w.display_unit == ureg.Unit("N/m")


def test_imported_value_cannot_be_edited(project, monkeypatch):
    _loads_sheet(monkeypatch)
    s = Sheet("Beam", auto_display=False)
    w = s.import_value("01_loads", "w")
    with pytest.raises(InputError, match="w is imported from sheet 1, w") as info:
        s.given("w", 6 * ureg.kN / ureg.m)
    assert info.value.name == "w"
    with pytest.raises(InputError, match="change it on that sheet"):
        w.quantity = 6 * ureg.kN / ureg.m


def test_unknown_sheet_names_the_sheet_and_lists_the_project(project, monkeypatch):
    _loads_sheet(monkeypatch)
    s = Sheet("Beam", auto_display=False)
    with pytest.raises(InputError) as info:
        s.import_value("01_load", "w")
    message = str(info.value)
    assert "'01_load' is not in the project" in message
    assert "did you mean '01_loads'" in message
    assert info.value.name == "sheet"


def test_unknown_name_names_both_sheet_and_name(project, monkeypatch):
    _loads_sheet(monkeypatch)
    s = Sheet("Beam", auto_display=False)
    with pytest.raises(InputError) as info:
        s.import_value("01_loads", "W")
    message = str(info.value)
    assert "Sheet '01_loads' exports no value 'W'" in message
    assert "did you mean 'w'" in message
    assert info.value.name == "W"


def test_wrong_dimension_at_import_is_refused(project, monkeypatch):
    _loads_sheet(monkeypatch)
    s = Sheet("Beam", auto_display=False)
    with pytest.raises(DimensionError) as info:
        s.import_value("01_loads", "w", dimension="[force]", as_name="R")
    assert "Import of w from sheet '01_loads'" in str(info.value)
    assert info.value.name == "R"


def test_a_sheet_that_has_not_run_has_no_exports(project):
    s = Sheet("Beam", auto_display=False)
    with pytest.raises(InputError, match="Sheet '03_post' has no recorded exports yet"):
        s.import_value("03_post", "P")


def test_outside_a_project_import_is_refused(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    with pytest.raises(InputError, match=r"no calcpack\.toml"):
        Sheet("x", auto_display=False).import_value("01_loads", "w")


def test_stale_exports_are_flagged_when_the_notebook_changed(project, monkeypatch):
    _loads_sheet(monkeypatch)
    nb = dict(PLACEHOLDER_SHEET, cells=[dict(PLACEHOLDER_SHEET["cells"][0], source="x = 2")])
    (project / "sheets" / "01_loads.ipynb").write_text(json.dumps(nb))
    s = Sheet("Beam", auto_display=False)
    with pytest.warns(UserWarning, match="may be out of date: the notebook sheets/01_loads"):
        s.import_value("01_loads", "w")
    assert "Run 01_loads first" in s.steps[0].text()


def test_stale_exports_are_flagged_when_the_inputs_file_changed(project, monkeypatch):
    monkeypatch.setenv(SHEET_ENV, "sheets/02_beam.ipynb")
    s = Sheet("Beam", auto_display=False)
    s.export(s.given("L", 3 * ureg.m))
    monkeypatch.delenv(SHEET_ENV)
    post = Sheet("Post", auto_display=False)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        post.import_value("02_beam", "L")  # current: no warning
    (project / "sheets" / "02_beam.inputs.toml").write_text('L = "3.5 m"\n')
    with pytest.warns(UserWarning, match="inputs file sheets/02_beam.inputs.toml has changed"):
        post.import_value("02_beam", "L", as_name="L_2")


def test_in_a_build_imports_read_the_builds_folder_and_kernels_write_nothing(
    project, monkeypatch, tmp_path_factory
):
    folder = tmp_path_factory.mktemp("build-exports")
    monkeypatch.setenv(EXPORTS_DIR_ENV, str(folder))
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    s = Sheet("Loads", auto_display=False)
    s.export(s.given("w", 5.4 * ureg.kN / ureg.m))
    assert not list(folder.iterdir())  # the build writes exports from the records
    ref = resolve_sheet("01_loads")
    assert exports_path(ref).parent == folder


def test_exports_records_and_check_export(project, monkeypatch):
    monkeypatch.setenv(SHEET_ENV, "sheets/02_beam.ipynb")
    s = Sheet("Beam", auto_display=False)
    M = s.given("M", 4 * ureg.kN * ureg.m)
    c = s.check("Bending", M, 5 * ureg.kN * ureg.m)
    step = s.export(c, name="u_b")
    (entry,) = step.records()["exports"]
    # utilisation |demand| / capacity = 4 / 5 (arithmetic)
    assert entry["value"] == pytest.approx(0.8)
    assert entry["kind"] == "check"
    assert read_exports(resolve_sheet("02_beam")).values["u_b"]["value"] == entry["value"]
    with pytest.raises(InputError, match="needs a name"):
        s.export(c)
    with pytest.raises(InputError, match="a name only with one"):
        s.export(M, M, name="x")


def test_many_values_by_case_cross_in_one_table_each_a_link(project, monkeypatch):
    """A truss sheet exports every member force case by case; the next sheet takes them all in
    one call, each at full precision and recorded as its own link, shown as one table."""
    from calcpack.analysis.truss_model import JointLoad, Truss
    from calcpack.analysis.truss_solve import solve_truss_cases

    m, kN = ureg.m, ureg.kN
    truss = Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (2 * m, 1.5 * m), "C": (4 * m, 0 * m)},
        members=[("A", "B"), ("B", "C"), ("A", "C")],
        supports={"A": "pin", "C": "roller"},
        loads=[JointLoad("B", Fy=-10 * kN, case="D"), JointLoad("B", Fx=3 * kN, case="W up")],
    )
    cases = solve_truss_cases(truss)
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    up = Sheet("Truss", auto_display=False)
    shown = up.export_by_case({c: r.forces for c, r in cases.items()}, name="N")
    monkeypatch.delenv(SHEET_ENV)
    assert "W up" in shown.text()
    assert "AB" in shown.text()
    s = Sheet("Members", auto_display=False)
    forces = s.import_by_case("01_loads", "N", dimension="[force]")
    assert list(forces) == ["D", "W up"]
    for case, r in cases.items():
        for member, f in r.forces.items():
            assert forces[case][member].to("N").magnitude == f.to("N").magnitude
    links = s.records()["imports"]
    assert len(links) == 6
    assert {(x["from_name"], x["case"]) for x in links} == {
        (f"N_{mb}", c) for c in ("D", "W up") for mb in ("AB", "BC", "AC")
    }
    assert {x["to_name"] for x in links} == {
        f"N_{mb}_{c}" for c in ("D", "W_up") for mb in ("AB", "BC", "AC")
    }
    with pytest.raises(InputError, match="exports nothing by load case under 'M'"):
        s.import_by_case("01_loads", "M")
    with pytest.raises(DimensionError, match="N_AB"):
        s.import_by_case("01_loads", "N", dimension="[length]")


def test_cases_named_in_words_import_as_symbols(project, monkeypatch):
    """Snow and wind cases carry names in words ("S unbalanced from L"); their imports take
    symbol names made of the same words."""
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    up = Sheet("Truss", auto_display=False)
    for case, kN in (("D", 2.0), ("S unbalanced from L", 1.5), ("W +GCpi", 0.5), ("W -GCpi", -1)):
        up.export(kN * ureg.kN, name="R_heel", case=case)
    monkeypatch.delenv(SHEET_ENV)
    s = Sheet("Heel", auto_display=False)
    got = s.import_cases("01_loads", "R_heel", dimension="[force]")
    assert got["S unbalanced from L"].name == "R_heel_S_unbalanced_from_L"
    assert got["S unbalanced from L"].quantity.to("kN").magnitude == 1.5
    assert got["D"].name == "R_heel_D"
    # internal pressure of either sign: two cases, two symbols
    assert got["W +GCpi"].name == "R_heel_W_plus_GCpi"
    assert got["W -GCpi"].name == "R_heel_W_minus_GCpi"


def test_imports_show_in_the_importing_sheets_units(project, monkeypatch):
    """Reactions an analysis computed in kN, imported on a US sheet, read in kip (the sheet's
    preset), and the sheet's force unit stays kip for the checks that follow."""
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    up = Sheet("Beam", auto_display=False)
    up.export_by_case({"D": {"A": 11.5 * ureg.kN}, "L": {"A": 17.8 * ureg.kN}}, name="R")
    monkeypatch.delenv(SHEET_ENV)
    s = Sheet("Post", system="US", auto_display=False)
    got = s.import_by_case("01_loads", "R", dimension="[force]")
    assert got["D"]["A"].to("kN").magnitude == pytest.approx(11.5, rel=1e-12)
    table = s.steps[-1]
    assert all(str(st.display_unit) == "kip" for st in table.steps)
    assert "2.59 kip" in table.text()  # 11.5 kN = 2.585 kip (1 kip = 4.448222 kN, NIST SP 811)
    assert "kN" not in table.text()
    later = s.given("P", 40.0 * ureg.kN, "a force given in kN")
    assert str(s.settings.kind_unit(later.quantity)) == "kip"
