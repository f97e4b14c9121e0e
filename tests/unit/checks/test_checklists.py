"""Member checklists: the shipped table, declarations on a sheet, and resolution against checks.

The items are common practice (what a checker expects for each member type); the steel beam's
list follows the items a checker asks for in the project's issue on checklists.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from calcpack.checks.checklists import (
    CHECKLIST_FILE,
    load_checklists,
    member_checklist,
    member_matches,
    resolve_checklists,
)
from calcpack.errors import InputError
from calcpack.units import ureg
from calcpack.working import Sheet


def _check(name: str, member: str, verdict: str = "OK", ref: str = "") -> dict[str, object]:
    return {"name": name, "member": member, "verdict": verdict, "ref": ref, "description": ""}


def test_every_member_type_the_trade_expects_has_a_checklist_of_common_practice() -> None:
    lists = load_checklists()
    expected = {"steel beam", "timber beam", "post", "truss", "bearing", "footing", "connection"}
    assert expected <= set(lists.types)
    assert lists.source == "common practice"
    steel = [i.item for i in lists.types["steel beam"]]
    for words in (
        "flexure",
        "shear",
        "deflection",
        "web local yielding",
        "crippling",
        "brace strength",
        "brace stiffness",
        "torsional restraint",
        "end connections",
        "bearing on the supports",
        "supports' own design",
    ):
        assert any(words in item for item in steel), words


def test_trade_words_for_a_type_find_its_checklist() -> None:
    assert member_checklist("joist", member="J1").member_type == "timber beam"
    assert member_checklist("Column", member="C1").member_type == "post"


def test_member_marks_match_as_whole_words() -> None:
    assert member_matches("P1", "P1, P2")
    assert member_matches("B1", "B1 at posts")
    assert not member_matches("B1", "B12")
    assert not member_matches("P1", None)


def test_an_item_no_check_meets_is_not_covered_and_the_others_are_met_or_declared() -> None:
    declared = member_checklist(
        "steel beam",
        member="B1",
        not_applicable={"brace strength": "top flange held by the deck throughout"},
        met_by={"the supports' own design": "P1"},
    ).to_json()
    checks = [
        ("2", _check("Flexure", "B1", ref="AISC 360-16 §F2")),
        ("2", _check("Shear", "B1")),
        ("3", _check("Column compression", "P1, P2")),
        ("2", _check("Deflection", "B1", verdict="NOT COVERED")),
    ]
    status = {s.item: s for s in resolve_checklists([("2", declared)], checks)}
    assert status["flexure, with the actual bracing"].status == "met"
    assert status["flexure, with the actual bracing"].detail == "sheet 2: Flexure"
    assert status["shear"].status == "met"
    assert status["brace strength"].status == "not applicable"
    assert "deck" in status["brace strength"].detail
    assert status["the supports' own design"].status == "met"
    assert "sheet 3" in status["the supports' own design"].detail
    # a NOT COVERED check meets nothing
    assert status["deflection"].status == "NOT COVERED"
    assert status["end connections"].status == "NOT COVERED"
    assert all(s.sheet == "2" and s.member == "B1" for s in status.values())


def test_a_declared_met_by_that_the_package_does_not_hold_stays_not_covered() -> None:
    declared = member_checklist("post", member="P1", met_by={"the footing below": "F1"}).to_json()
    (found,) = [
        s for s in resolve_checklists([("3", declared)], []) if s.item == "the footing below"
    ]
    assert found.status == "NOT COVERED"
    assert "F1" in found.detail


def test_a_project_checklist_file_replaces_the_shipped_one(tmp_path: Path) -> None:
    (tmp_path / CHECKLIST_FILE).write_text(
        "# source: Invented Firm QA procedure 4.2 (demo)\n"
        "key,member_type,item,matches\n"
        "lintel/bearing,lintel,end bearing on the masonry,bearing\n",
        "utf-8",
    )
    lists = load_checklists(tmp_path)
    assert set(lists.types) == {"lintel"}
    assert lists.source == "Invented Firm QA procedure 4.2 (demo)"
    with pytest.raises(InputError, match="steel beam"):
        member_checklist("steel beam", member="B1", project_root=tmp_path)


def test_a_bad_project_checklist_names_the_file_and_row(tmp_path: Path) -> None:
    (tmp_path / CHECKLIST_FILE).write_text(
        "# source: demo\nkey,member_type,item,matches\nbeam/x,beam,bending,(unclosed\n", "utf-8"
    )
    with pytest.raises(InputError, match=r"beam/x.*regular expression"):
        load_checklists(tmp_path)


@pytest.mark.parametrize(
    ("kwargs", "words"),
    [
        ({"member_type": "steel bean"}, r"steel bean.*did you mean 'steel beam'"),
        ({"not_applicable": {"flexure": "x"}}, r"'flexure' is not an item"),
        ({"not_applicable": {"shear": " "}}, r"'shear' needs a reason"),
        ({"not_applicable": {"shear": "x"}, "met_by": {"shear": "B2"}}, "both"),
        ({"met_by": {"shear": "B2"}, "not_covered": {"shear": "by others"}}, "both"),
        ({"not_covered": {"shear": ""}}, r"'shear' needs a reason"),
        ({"member": ""}, "member's mark"),
    ],
)
def test_bad_declarations_are_refused_naming_the_input(
    kwargs: dict[str, object], words: str
) -> None:
    args: dict[str, object] = {"member_type": "steel beam", "member": "B1", **kwargs}
    with pytest.raises(InputError, match=words):
        member_checklist(**args)  # type: ignore[arg-type]


def test_a_sheet_shows_its_checklist_and_records_it() -> None:
    s = Sheet("Beam", auto_display=False)
    s.check("Flexure", 10 * ureg.kN * ureg.m, 20 * ureg.kN * ureg.m, member="B1")
    s.checklist("steel beam", member="B1", not_applicable={"brace stiffness": "no braces"})
    text = s.text_report()
    assert "met by Flexure" in text
    assert "not applicable: no braces" in text
    assert "else NOT COVERED" in text
    (record,) = s.records()["checklists"]
    assert record["member"] == "B1"
    assert record["member_type"] == "steel beam"
    assert len(record["items"]) == len(load_checklists().types["steel beam"])


def test_an_item_left_unchecked_on_purpose_stays_not_covered_with_its_reason() -> None:
    """Declaring why an item is not checked explains it; it is still NOT COVERED (counted on
    the cover), even where a check on the member would match it."""
    declared = member_checklist(
        "timber beam",
        member="RB1",
        not_covered={"connections (hangers, fasteners)": "proprietary post caps, by the supplier"},
    ).to_json()
    checks = [("2", _check("Bearing with nails", "RB1"))]
    status = {s.item: s for s in resolve_checklists([("2", declared)], checks)}
    left = status["connections (hangers, fasteners)"]
    assert left.status == "NOT COVERED"
    assert left.detail == "proprietary post caps, by the supplier"
    assert status["bearing perpendicular to grain at the supports"].status == "met"
    s = Sheet("Beam", auto_display=False)
    s.checklist("timber beam", member="RB1", not_covered={"shear": "shown on sheet 9 by hand"})
    assert "NOT COVERED: shown on sheet 9 by hand" in s.text_report()
