"""The checker's independent checks: compared with the preparer's record in the build, a
disagreement opened as a review comment that blocks the checker's signature, shown in the
package, re-run by the archive check and flagged for a re-check after a change upstream.

Sheets run in this process (``linkkit.run_in_process`` in place of a kernel). The reference
values are closed forms: M = w L^2 / 8 for a simple span under a uniform load (AISC Steel
Construction Manual, Table 3-23, case 1 "simple beam -- uniformly distributed load").
"""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import nbformat
import pytest
from linkkit import run_in_process, write_linked_project

from calcpack.contract.compare import diff_manifests
from calcpack.errors import BuildError, InputError, NotebookExecutionError, SigningError
from calcpack.package import execute, reproduce_manifest
from calcpack.package.document import DocumentOptions, SheetDoc, document_html
from calcpack.package.mathcache import MathCache
from calcpack.package.project import load_project
from calcpack.package.records import collect_records
from calcpack.package.verification import (
    COMMENT_MARK,
    compare_verifications,
    open_disagreements,
)
from calcpack.signing.review import close_comment, load_review, require_closed

BEAM = """
w = s.given("w", {w!r} * ureg.kN / ureg.m, "line load")
L = s.given("L", 6 * ureg.m, "span")
M = s.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")
s.check("Flexure", M, 60 * ureg.kN * ureg.m, member="B1")
s.export(M)
"""
# the checker's own value, in other units: w L^2 / 8 with w = 10 kN/m, L = 6 m is 45 kN·m
CHECK = """
M_c = s.derive("M_c", {M_kNm!r} * ureg.kN * ureg.m, "beam table, simple span", unit="kip*ft")
s.verify("beam", "M_max", M_c, tolerance={tol!r}, method="AISC Manual Table 3-23, case 1")
s.verify("beam", "Flexure", 0.75, member="B1", tolerance=0.01, method="45 / 60 by hand")
"""


@pytest.fixture
def in_process(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(execute, "_execute", run_in_process)


def _project(root: Path, *, w: float = 10.0, M_kNm: float = 45.0, tol: float = 0.005) -> Path:
    sheets = {"beam": BEAM.format(w=w), "check": CHECK.format(M_kNm=M_kNm, tol=tol)}
    return write_linked_project(root, sheets, list(sheets))


def _docs(root: Path) -> tuple[object, list[SheetDoc]]:
    project = load_project(root)
    docs = []
    for entry in project.sheets:
        text = run_in_process(str(project.sheet_path(entry)), entry.path, 60)
        records = collect_records(nbformat.reads(text, as_version=4))
        docs.append(SheetDoc(entry, entry.title or entry.path, "<p>body</p>", records))
    return project, docs


def test_an_independent_value_within_tolerance_agrees(tmp_path: Path) -> None:
    project, docs = _docs(_project(tmp_path))
    moment, utilisation = compare_verifications(project, docs)  # type: ignore[arg-type]
    assert moment.agreed
    assert moment.preparer_value == pytest.approx(45.0, rel=1e-12)  # w L^2 / 8, kN·m
    assert moment.unit == "kN·m"
    assert moment.checker_value == pytest.approx(45.0, rel=1e-9)  # kip·ft converted back
    assert moment.method == "AISC Manual Table 3-23, case 1"
    assert utilisation.agreed
    assert utilisation.preparer_value == pytest.approx(0.75, rel=1e-12)  # 45 / 60
    assert open_disagreements(project, (moment, utilisation)) == ()  # type: ignore[arg-type]


def test_a_disagreement_opens_one_review_comment_that_blocks_the_checkers_signature(
    tmp_path: Path,
) -> None:
    # 47 against 45 kN·m: 4.4 % apart, more than the 0.5 % the checker allows
    project, docs = _docs(_project(tmp_path, M_kNm=47.0))
    compared = compare_verifications(project, docs)  # type: ignore[arg-type]
    moment = compared[0]
    assert not moment.agreed
    assert moment.difference == pytest.approx(2 / 45, rel=1e-9)
    (opened,) = open_disagreements(project, compared)  # type: ignore[arg-type]
    assert open_disagreements(project, compared) == ()  # type: ignore[arg-type]  # once only
    comment = load_review(tmp_path).get(opened)
    assert comment.status == "open"
    assert comment.sheet == "sheets/beam.ipynb"
    assert comment.quantity == "M_max"
    assert comment.text.startswith(COMMENT_MARK)
    assert "45 kN·m" in comment.text
    assert "47 kN·m" in comment.text
    with pytest.raises(SigningError, match=opened):
        require_closed(tmp_path, None)
    assert require_closed(tmp_path, "agreed by phone, see note") == (opened,)
    close_comment(tmp_path, opened, who="C. Hecker", text="Preparer's value confirmed")
    assert require_closed(tmp_path, None) == ()


def test_the_package_shows_the_verification_section_and_the_count_on_the_cover(
    tmp_path: Path,
) -> None:
    project, docs = _docs(_project(tmp_path, M_kNm=47.0))
    compared = compare_verifications(project, docs)  # type: ignore[arg-type]
    options = DocumentOptions(verifications=compared)
    html = document_html(project, docs, options, created=dt.datetime(2026, 1, 15), math=MathCache())  # type: ignore[arg-type]
    cover = html[: html.index('id="contents"')]
    # key results of the beam sheet: its export M_max and its governing check Flexure (B1)
    assert "2 of 2 key results independently verified by the checker; 1 disagree" in cover
    section = html[html.index('id="verification"') : html.index('id="revisions"')]
    assert "Verification by the checker" in section
    assert "AISC Manual Table 3-23, case 1" in section
    assert "DISAGREES" in section
    assert "4.44 %" in section


def test_a_check_of_a_result_the_preparer_does_not_record_is_refused_naming_both(
    tmp_path: Path,
) -> None:
    sheets = {
        "beam": BEAM.format(w=10.0),
        "check": 's.verify("beam", "M_u", 45 * ureg.kN * ureg.m, tolerance=0.05, method="x")\n',
    }
    project, docs = _docs(write_linked_project(tmp_path, sheets, list(sheets)))
    with pytest.raises(BuildError, match=r"sheets/check.ipynb.*'M_u'.*sheets/beam.ipynb"):
        compare_verifications(project, docs)  # type: ignore[arg-type]


def test_a_checker_sheet_may_not_read_the_value_it_checks(tmp_path: Path, in_process: None) -> None:
    sheets = {
        "beam": BEAM.format(w=10.0),
        "check": 'M = s.import_value("beam", "M_max")\n'
        's.verify("beam", "M_max", 1.0 * M.quantity, tolerance=0.05, method="copied")\n',
    }
    root = write_linked_project(tmp_path, sheets, list(sheets))
    with pytest.raises(NotebookExecutionError, match="may not read the value it checks"):
        execute.execute_sheets(load_project(root), workers=1, use_cache=False)


@pytest.mark.parametrize("tolerance", [-0.01, float("nan"), "5 %", None])
def test_a_tolerance_that_is_negative_or_not_a_number_is_refused(tolerance: object) -> None:
    from calcpack.units import ureg
    from calcpack.working.links import SheetRef
    from calcpack.working.verification import verification_entry

    ref = SheetRef(root=Path("."), path="sheets/beam.ipynb", number="1", position=1)
    with pytest.raises(InputError, match="tolerance"):
        verification_entry(ref, "M", 1 * ureg.kN, tolerance=tolerance, method="x")


def test_a_check_sheet_in_the_preparers_own_name_needs_a_recorded_reason(
    tmp_path: Path,
) -> None:
    root = _project(tmp_path)
    toml = root / "calcpack.toml"
    text = toml.read_text("utf-8").replace('checker = "C. Hecker"', 'checker = "P. Reparer"')
    toml.write_text(text, "utf-8")
    project, docs = _docs(root)
    with pytest.raises(BuildError, match=r"checker is its preparer \(P. Reparer\)"):
        compare_verifications(project, docs)  # type: ignore[arg-type]
    toml.write_text(text + '\n[verification]\nsame_person = "sole practitioner"\n', "utf-8")
    project, docs = _docs(root)
    compared = compare_verifications(project, docs)  # type: ignore[arg-type]
    assert compared[0].same_person == "sole practitioner"


def test_the_archive_check_reruns_the_checks_and_a_change_upstream_asks_for_a_recheck(
    tmp_path: Path, in_process: None
) -> None:
    before = reproduce_manifest(_project(tmp_path, tol=0.05), workers=1)
    assert [v["agreed"] for v in before["verifications"]] == [True, True]
    assert diff_manifests(before, reproduce_manifest(tmp_path, workers=1)).empty
    # the load rises to 10.5 kN/m: M = 47.25 kN·m; the checker's 45 is still within 5 %
    after = reproduce_manifest(_project(tmp_path, w=10.5, tol=0.05), workers=1)
    rechecks = diff_manifests(before, after).of_kind("verification")
    moment = next(c for c in rechecks if c.name.startswith("M_max"))
    assert moment.new is not None
    assert moment.new.startswith("re-check needed")
    assert "agreed" in moment.new
    assert moment.sheet == "sheet 1"


def test_a_sheet_may_declare_its_key_results_and_the_package_shows_which_were_checked(
    tmp_path: Path,
) -> None:
    from calcpack.package.verification_html import coverage

    sheets = {
        "beam": BEAM.format(w=10.0) + 's.key_results("M_max", "w")\n',
        "check": CHECK.format(M_kNm=45.0, tol=0.005),
    }
    project, docs = _docs(write_linked_project(tmp_path, sheets, list(sheets)))
    compared = compare_verifications(project, docs)  # type: ignore[arg-type]
    rows = {(doc.entry.path, name): bool(found) for doc, name, _, found in coverage(docs, compared)}
    assert rows == {("sheets/beam.ipynb", "M_max"): True, ("sheets/beam.ipynb", "w"): False}
