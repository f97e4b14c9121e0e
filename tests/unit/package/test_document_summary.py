"""The package's summary of checks and its caution block, read from the sheets' records."""

from __future__ import annotations

import dataclasses
import re
from pathlib import Path
from typing import Any

from calcpack.contract import SheetRecords
from calcpack.package.document import SheetDoc, _assumptions, _summary
from calcpack.package.mathcache import MathCache
from calcpack.package.project import SheetEntry, load_project

LINTEL_DEMO = Path(__file__).resolve().parents[3] / "example_projects" / "lintel_demo"


def _check(name: str, u: float | None, verdict: str, **kw: Any) -> dict[str, Any]:
    return {
        "name": name,
        "member": kw.get("member", "J1"),
        "demand": None if u is None else u * 100.0,
        "capacity": None if u is None else 100.0,
        "unit": kw.get("unit", "psi"),
        "utilisation": u,
        "verdict": verdict,
        "ref": kw.get("ref", "NDS 2018 §3.3"),
        "combination": "D + L",
        "description": kw.get("description", ""),
    }


def _project(tmp_path: Path) -> Any:
    """An invented project (the lintel demo's file) with one caution of its own."""
    project = load_project(LINTEL_DEMO)
    design = dataclasses.replace(project.design, cautions=("Site caution of the project.",))
    return dataclasses.replace(project, design=design)


def _doc(number: str, path: str, records: SheetRecords) -> SheetDoc:
    return SheetDoc(SheetEntry(number, path, None), f"Sheet {number}", "", records)


def _text(html: str) -> str:
    return " ".join(re.sub(r"<[^>]+>", " ", html).split())


def test_summary_lists_classification_apart_with_pages_and_what_is_missing(tmp_path: Path) -> None:
    project = _project(tmp_path)
    one = SheetRecords(
        checks=(
            _check("Bending", 0.64, "OK"),
            _check("Slenderness", 0.9, "OK", unit=""),
            _check("Flange compactness", 0.2, "OK", unit=""),
        )
    )
    two = SheetRecords(
        checks=(
            _check("Shear", 1.2, "NOT OK"),
            _check("Notch", None, "NOT COVERED", description="notched ends not designed here"),
        )
    )
    html = _summary(project, [_doc("1", "one.ipynb", one), _doc("2", "two.ipynb", two)])
    strength, limits = html.split("Classification and limits")
    # demand/capacity checks: worst first, the ratio in words, each with its sheet's page link
    assert strength.index("Shear") < strength.index("Notch") < strength.index("Bending")
    assert "1.20 &gt; 1.00" in strength
    assert "0.640 ≤ 1.00" in strength
    assert "Slenderness" not in strength
    assert "compactness" not in strength
    assert 'href="#sheet-2"' in strength
    assert 'class="cp-pageref"' in strength
    # NOT COVERED says what is missing instead of empty numbers
    assert "notched ends not designed here" in strength
    # classification checks are listed apart, as ratios
    assert "Slenderness" in limits
    assert "Flange compactness" in limits
    assert "≤ 1.00" not in limits
    assert _text(html).count("Summary of checks") == 2  # title block and heading, no more


def test_a_caution_is_said_once_with_the_sheets_it_applies_to(tmp_path: Path) -> None:
    project = _project(tmp_path)
    same = "These checks implement NDS 2018 (ASD). Confirm them."
    one = SheetRecords(cautions=(same, "Only on sheet one."), assumptions=("Dry service.",))
    two = SheetRecords(
        cautions=(same, "Site caution of the project."), assumptions=("Dry service.",)
    )
    sheets = [_doc("1", "a", one), _doc("2", "b", two)]
    text = _text(_assumptions(project, sheets, MathCache()))
    assert text.count("These checks implement NDS 2018") == 1
    assert "Confirm them. (sheets 1, 2)" in text
    assert "Only on sheet one. (sheet 1)" in text
    # a caution of the project itself is not repeated for a sheet that also says it
    assert text.count("Site caution of the project.") == 1
    assert "Site caution of the project. (sheet" not in text
    assert text.count("Dry service.") == 1
    assert "Dry service. (sheets 1, 2)" in text


def test_summary_links_each_check_to_its_own_place() -> None:
    from calcpack.package.sheetdoc import anchor_checks

    body = (
        '<div class="cp-step cp-given">b</div>'
        '<div class="cp-step cp-check" data-name="Bending">ok</div>'
        '<div class="cp-step cp-check">not covered</div>'
    )
    anchored, anchors = anchor_checks(body, "sheets/02.ipynb", 2)
    assert len(anchors) == 2
    for anchor in anchors:
        assert anchor.startswith("chk-")
        assert anchored.count(f'id="{anchor}"') == 1
    # anchors differ between sheets, and the body's checks must match the records one to one
    assert set(anchor_checks(body, "sheets/03.ipynb", 2)[1]).isdisjoint(anchors)
    assert anchor_checks(body, "sheets/02.ipynb", 3) == (body, ())

    records = SheetRecords(checks=(_check("Bending", 0.5, "OK"), _check("Shear", 0.2, "OK")))
    doc = dataclasses.replace(_doc("1", "sheets/02.ipynb", records), check_anchors=anchors)
    project = load_project(LINTEL_DEMO)
    html = _summary(project, [doc])
    row = next(r for r in html.split("<tr>") if "Shear" in r)
    assert f'data-cp-in="sheet-1" href="#{anchors[1]}"' in row
    unanchored = _summary(project, [_doc("1", "sheets/02.ipynb", records)])
    assert 'href="#sheet-1"' in unanchored
