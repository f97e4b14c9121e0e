"""The checker's independent check in JupyterLab: compared with the preparer's latest record
(value, checker's value, difference, tolerance, agreed or not, method), with a clear word when
that record is older than the preparer's notebook or inputs file, or missing; nothing of it in
a build, and still no reading of the value checked.

The preparer's sheet records its results the way a JupyterLab kernel does at the end of a cell
run (``recorded._record_latest``); the checker's sheet runs in a temporary project folder.
Reference values are closed forms: M = w L^2 / 8 for a simple span under a uniform load (AISC
Steel Construction Manual, Table 3-23, case 1 "simple beam -- uniformly distributed load");
with w = 10 kN/m and L = 6 m, M = 45 kN·m. 1 kip·ft = 1.3558179483314004 kN·m (the exact
definitions of the pound-force and the foot, NIST SP 811 appendix B).
"""

from __future__ import annotations

import json
import warnings
import weakref
from pathlib import Path

import pytest

from calcpack import ureg
from calcpack.errors import DimensionError, InputError
from calcpack.working import Sheet, recorded
from calcpack.working.agreement import agreement
from calcpack.working.links import SHEET_ENV, resolve_sheet
from calcpack.working.recorded import read_results, results_path
from tests.linkkit import PLACEHOLDER_SHEET, sheets_folder_project


@pytest.fixture
def project(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    """A preparer's beam sheet (with an inputs file) and a checker's sheet; the working folder
    is the sheets folder, as in a kernel."""
    inputs = {"01_beam": 'w = "10 kN/m"\n'}
    return sheets_folder_project(tmp_path, ("01_beam", "02_check"), monkeypatch, inputs=inputs)


def _run_beam(monkeypatch: pytest.MonkeyPatch, w_kN_per_m: float = 10.0) -> Sheet:
    """The preparer's sheet, recorded as the kernel records it at the end of a cell run."""
    monkeypatch.setenv(SHEET_ENV, "sheets/01_beam.ipynb")
    s = Sheet("Beam", auto_display=False)
    w = s.given("w", w_kN_per_m * ureg.kN / ureg.m, "line load")
    L = s.given("L", 6 * ureg.m, "span")
    M = s.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")
    s.check("Flexure", M, 60 * ureg.kN * ureg.m, member="B1")
    s.export(s.derive("R_A", w * L / 2, "reaction", unit="kN"), case="D")
    monkeypatch.setattr(recorded, "_latest", weakref.ref(s))
    recorded._record_latest()
    monkeypatch.delenv(SHEET_ENV)
    return s


def _check(value: object, *, tolerance: float = 0.01, **kw: object) -> object:
    s = Sheet("Check", auto_display=False)
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        shown = s.verify(
            "01_beam",
            kw.pop("name", "M_max"),
            value,
            tolerance=tolerance,
            method="beam table",
            **kw,
        )
    shown.caught = [str(w.message) for w in caught]
    return shown


def test_the_kernel_records_the_preparers_values_checks_and_exports(project, monkeypatch):
    _run_beam(monkeypatch)
    results = read_results(resolve_sheet("01_beam"))
    assert results is not None
    assert {v["name"] for v in results.values} >= {"w", "L", "M_max", "R_A"}
    assert [c["member"] for c in results.checks] == ["B1"]
    assert results.exports[0]["case"] == "D"
    assert results_path(resolve_sheet("01_beam")).parent.name == "results"


def test_agreement_shows_both_values_the_difference_tolerance_and_method(project, monkeypatch):
    _run_beam(monkeypatch)
    # the checker's 33.2 kip·ft is 45.01 kN·m (1 kip·ft = 1.3558179 kN·m, NIST SP 811)
    shown = _check(33.2 * ureg.kip * ureg.ft, tolerance=0.005)
    found = shown.comparison.agreement
    assert found.unit == "kN·m"
    assert found.preparer_value == pytest.approx(45.0, rel=1e-12)  # w L²/8, Table 3-23 case 1
    assert found.checker_value == pytest.approx(33.2 * 1.3558179483314004, rel=1e-12)
    assert found.difference == pytest.approx(abs(33.2 * 1.3558179483314004 - 45) / 45, rel=1e-9)
    assert found.agreed
    assert shown.comparison.note is None
    assert not shown.caught
    assert shown.columns == [
        "Result checked",
        "Preparer's value",
        "Checker's value",
        "Difference",
        "Tolerance",
        "Agreement",
        "Method",
    ]
    html = shown.html()
    assert "agreed" in html
    assert "0.5 %" in html
    assert "beam table" in html
    assert "preparer&#x27;s latest record" in html or "preparer's latest record" in html


def test_a_disagreement_is_shown_as_such(project, monkeypatch):
    _run_beam(monkeypatch)
    # 40 kN·m against 45 kN·m: 11.1 % apart, outside 5 %
    shown = _check(40 * ureg.kN * ureg.m, tolerance=0.05)
    found = shown.comparison.agreement
    assert not found.agreed
    assert found.difference == pytest.approx(5 / 45, rel=1e-12)
    assert "DISAGREES" in shown.html()
    assert "11.11 %" in shown.text()


def test_a_checks_utilisation_and_a_value_per_case_are_compared(project, monkeypatch):
    _run_beam(monkeypatch)
    util = _check(0.75, name="Flexure", member="B1")  # 45 / 60
    assert util.comparison.agreement.agreed
    assert util.comparison.agreement.preparer_value == pytest.approx(0.75, rel=1e-12)
    # R = w L / 2 = 30 kN (Table 3-23, case 1)
    reaction = _check(29 * ureg.kN, name="R_A", case="D", tolerance=0.02)
    assert reaction.comparison.agreement.difference == pytest.approx(1 / 30, rel=1e-12)
    assert not reaction.comparison.agreement.agreed


def test_a_record_older_than_the_preparers_notebook_says_run_it_first(project, monkeypatch):
    _run_beam(monkeypatch)
    nb = dict(
        PLACEHOLDER_SHEET,
        cells=[{"cell_type": "code", "source": "x = 2", "metadata": {}, "outputs": []}],
    )
    (project / "sheets" / "01_beam.ipynb").write_text(json.dumps(nb))
    shown = _check(45 * ureg.kN * ureg.m)
    assert shown.comparison.agreement.agreed  # still compared, with the caution beside it
    assert "01_beam.ipynb has changed" in shown.comparison.stale
    assert "run 01_beam (sheet 1) first" in shown.caption
    assert any("may be out of date" in m for m in shown.caught)


def test_a_record_older_than_the_preparers_inputs_file_says_so(project, monkeypatch):
    _run_beam(monkeypatch)
    (project / "sheets" / "01_beam.inputs.toml").write_text('w = "12 kN/m"\n')
    shown = _check(45 * ureg.kN * ureg.m)
    assert "inputs file sheets/01_beam.inputs.toml has changed" in shown.comparison.stale


def test_a_missing_record_is_said_and_nothing_is_compared(project, monkeypatch):
    shown = _check(45 * ureg.kN * ureg.m)
    assert shown.comparison.agreement is None
    assert "has no recorded results yet" in shown.comparison.missing
    assert "Not compared" in shown.caption
    assert "Preparer's value" not in shown.columns
    assert any("Not compared" in m for m in shown.caught)


def test_a_result_the_record_does_not_hold_is_named(project, monkeypatch):
    _run_beam(monkeypatch)
    shown = _check(45 * ureg.kN * ureg.m, name="M_mid")
    assert shown.comparison.agreement is None
    assert "no value M_mid" in shown.comparison.missing
    assert "the build will refuse" in shown.comparison.missing


def test_a_unit_that_does_not_convert_is_refused_naming_both(project, monkeypatch):
    _run_beam(monkeypatch)
    with pytest.raises(DimensionError, match=r"'kN'.*'kN·m'"):
        _check(45 * ureg.kN)


def test_in_a_build_nothing_is_read_and_the_record_is_unchanged(project, monkeypatch):
    _run_beam(monkeypatch)
    lab = _check(45 * ureg.kN * ureg.m)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    built = _check(45 * ureg.kN * ureg.m)
    assert built.comparison is None
    assert built.columns == ["Result checked", "Checker's value", "Tolerance", "Method"]
    assert built.records() == lab.records()  # the build's record never holds the comparison


def test_a_checker_sheet_still_may_not_read_the_value_it_checks(project, monkeypatch):
    _run_beam(monkeypatch)
    s = Sheet("Check", auto_display=False)
    with pytest.raises(InputError, match="may not read the value it checks"):
        s.verify(
            "01_beam",
            "R_A",
            s.import_value("01_beam", "R_A", case="D"),
            case="D",
            tolerance=0.01,
            method="copied",
        )


def test_the_comparison_rule_is_relative_and_absolute_at_zero():
    # |checker - preparer| / |preparer|; at a zero preparer's value the absolute difference
    assert agreement(45.0, "kN·m", 45.45, "kN·m", 0.01).agreed
    assert not agreement(45.0, "kN·m", 45.46, "kN·m", 0.01).agreed
    assert agreement(0.0, "", 0.004, "", 0.005).difference == pytest.approx(0.004)


def test_a_build_leaves_its_record_for_the_checker_in_jupyterlab(project, monkeypatch):
    from types import SimpleNamespace

    from calcpack.contract.records import SheetRecords
    from calcpack.package.verification import publish_results

    monkeypatch.setenv(SHEET_ENV, "sheets/01_beam.ipynb")
    beam = Sheet("Beam", auto_display=False)
    beam.given("M_max", 45 * ureg.kN * ureg.m, "maximum moment, w L²/8")
    records = SheetRecords(values=tuple(beam.records()["values"]))
    monkeypatch.delenv(SHEET_ENV)
    doc = SimpleNamespace(entry=SimpleNamespace(path="sheets/01_beam.ipynb"), records=records)
    publish_results(SimpleNamespace(root=project), [doc])
    shown = _check(46 * ureg.kN * ureg.m, tolerance=0.05)
    assert shown.comparison.agreement.difference == pytest.approx(1 / 45, rel=1e-12)
    assert shown.comparison.stale is None


class _Events:
    def __init__(self) -> None:
        self.hooks: list[tuple[str, object]] = []

    def register(self, event: str, hook: object) -> None:
        self.hooks.append((event, hook))


def _fake_kernel(monkeypatch: pytest.MonkeyPatch) -> _Events:
    """A stand-in for IPython's shell in a kernel: what Sheet and recorded look up."""
    import sys
    from types import SimpleNamespace

    events = _Events()
    shell = SimpleNamespace(kernel=object(), events=events)
    monkeypatch.setitem(sys.modules, "IPython", SimpleNamespace(get_ipython=lambda: shell))
    monkeypatch.setattr(recorded, "_hooked", [])
    monkeypatch.setattr(recorded, "_latest", None)
    return events


def test_a_kernel_records_the_latest_sheet_after_each_cell_run_that_changed_it(
    project, monkeypatch
):
    events = _fake_kernel(monkeypatch)
    monkeypatch.setenv(SHEET_ENV, "sheets/01_beam.ipynb")
    old = Sheet("Beam, first run", auto_display=False)
    old.given("M_max", 40 * ureg.kN * ureg.m, "maximum moment")
    s = Sheet("Beam", auto_display=False)
    s.given("M_max", 45 * ureg.kN * ureg.m, "maximum moment")
    assert [e for e, _ in events.hooks] == ["post_run_cell"]  # once per kernel
    hook = events.hooks[0][1]
    hook()  # the end of the cell run
    target = results_path(resolve_sheet("01_beam"))
    assert [v["value"] for v in read_results(resolve_sheet("01_beam")).values] == [45.0]
    target.unlink()
    hook()  # a cell run that added nothing writes nothing
    assert not target.exists()


def test_a_kernel_of_a_build_records_nothing(project, monkeypatch):
    events = _fake_kernel(monkeypatch)
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    monkeypatch.setenv(SHEET_ENV, "sheets/01_beam.ipynb")
    Sheet("Beam", auto_display=False).given("M_max", 45 * ureg.kN * ureg.m, "maximum moment")
    assert events.hooks == []


def test_a_project_file_broken_while_the_kernel_runs_is_a_warning_not_an_error(
    project, monkeypatch
):
    events = _fake_kernel(monkeypatch)
    monkeypatch.setenv(SHEET_ENV, "sheets/01_beam.ipynb")
    s = Sheet("Beam", auto_display=False)  # kept, as a notebook keeps its sheet
    s.given("M_max", 45 * ureg.kN * ureg.m, "maximum moment")
    (project / "calcpack.toml").write_text("[[sheets]\n", encoding="utf-8")
    with pytest.warns(UserWarning, match="could not record this sheet's results"):
        events.hooks[0][1]()
