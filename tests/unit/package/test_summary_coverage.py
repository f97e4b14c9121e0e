"""The summary of checks lists checklist items no check meets as NOT COVERED, and the cover
counts them (the sheets run in this process, as the build's kernels would)."""

from __future__ import annotations

import datetime as dt
import re
from pathlib import Path

import nbformat

from calcpack.package.document import DocumentOptions, SheetDoc, document_html
from calcpack.package.mathcache import MathCache
from calcpack.package.project import load_project
from calcpack.package.records import collect_records
from calcpack.package.summary import check_counts, counts_line
from tests.linkkit import run_in_process, write_linked_project

BEAM = """
s.check("Flexure", 10 * ureg.kN * ureg.m, 20 * ureg.kN * ureg.m, member="B1")
s.check("Shear", 5 * ureg.kN, 20 * ureg.kN, member="B1")
s.checklist("steel beam", member="B1",
            not_applicable={"brace strength": "no braces: top flange held by the deck",
                            "brace stiffness": "no braces: top flange held by the deck"},
            met_by={"the supports' own design": "P1"})
"""
POST = """
s.check("Column compression", 20 * ureg.kN, 40 * ureg.kN, member="P1")
"""


def _docs(root: Path) -> tuple[object, list[SheetDoc]]:
    project = load_project(root)
    docs = []
    for entry in project.sheets:
        text = run_in_process(str(project.sheet_path(entry)), entry.path, 60)
        records = collect_records(nbformat.reads(text, as_version=4))
        docs.append(SheetDoc(entry, entry.title or entry.path, "<p>body</p>", records))
    return project, docs


def test_checklist_items_not_met_are_not_covered_in_the_summary_and_counted_on_the_cover(
    tmp_path: Path,
) -> None:
    root = write_linked_project(tmp_path, {"beam": BEAM, "post": POST}, ["beam", "post"])
    project, docs = _docs(root)
    counts = check_counts(docs)
    # 3 checks, all OK; steel beam items: 11 - flexure - shear - 2 declared n/a - supports (P1)
    assert counts == {"OK": 3, "NOT OK": 0, "NOT COVERED": 6, "checks": 9, "checklist": 6}
    html = document_html(
        project,
        docs,  # type: ignore[arg-type]
        DocumentOptions(),
        created=dt.datetime(2026, 1, 15),
        math=MathCache(),
    )
    cover = html[: html.index('id="contents"')]
    assert counts_line(counts) in cover
    assert "6 checklist items not met" in cover
    summary = html[html.index('id="summary"') : html.index('id="revisions"')]
    for item in (
        "deflection",
        "end connections",
        "bearing on the supports",
        "torsional restraint at the supports",
    ):
        assert re.search(rf"<td>{re.escape(item)}</td>.*?NOT COVERED", summary), item
    assert "no braces: top flange held by the deck" in summary
    assert "sheet 2: Column compression" in summary


def test_a_check_added_later_meets_its_item_and_the_count_falls(tmp_path: Path) -> None:
    more = BEAM + 's.check("Deflection, live", 5 * ureg.mm, 20 * ureg.mm, member="B1")\n'
    root = write_linked_project(tmp_path, {"beam": more, "post": POST}, ["beam", "post"])
    _, docs = _docs(root)
    assert check_counts(docs)["checklist"] == 5


def test_checklist_items_that_name_a_symbol_are_set_as_symbols() -> None:
    """The timber beam's item "bending, with lateral stability (C_L)" reads as C with a
    subscript L in the summary, never as a raw identifier."""
    from calcpack.checks.checklists import ItemStatus
    from calcpack.package.summary import _checklists_html

    html = _checklists_html(
        [
            ItemStatus(
                "2",
                "BR1",
                "timber beam",
                "bending, with lateral stability (C_L)",
                "met",
                "sheet 2: Bending",
            )
        ]
    )
    assert "(<i>C</i><sub><i>L</i></sub>)" in html
    assert "C_L" not in html
