"""Revision comparison: exactly the changed inputs, results and verdicts, with old and new."""

from __future__ import annotations

import copy
import json
from pathlib import Path
from typing import Any

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from signing_helpers import attach_manifest, cover_pdf, make_manifest

from calcpack.errors import VerificationError
from calcpack.signing.diff import Change, diff_manifests, diff_packages
from calcpack.signing.manifest import load_manifest


def _lintel_revision(w_kN_per_m: float, revision: str) -> dict[str, Any]:
    """The test manifest with the lintel's line load changed and its results recomputed.

    M = w L^2 / 8 and V = w L / 2 for a simply supported span under uniform load (common
    practice; any beam table, e.g. the first case of a standard beam-formula table).
    """
    manifest = make_manifest()
    manifest["project"]["revision"] = revision
    sheet = manifest["sheets"][0]
    L = 3.2
    M = w_kN_per_m * L**2 / 8
    V = w_kN_per_m * L / 2
    values = {v["name"]: v for v in sheet["values"]}
    values["w"]["value"] = w_kN_per_m
    values["M_max"]["value"] = M
    values["V_max"]["value"] = V
    check = sheet["checks"][0]
    check["demand"] = M
    check["utilisation"] = M / check["capacity"]
    check["verdict"] = "OK" if check["capacity"] >= M else "NOT OK"
    return manifest


def test_one_changed_input_lists_exactly_its_consequences() -> None:
    old = _lintel_revision(8.5, "A")
    new = _lintel_revision(12.0, "B")
    diff = diff_manifests(old, new)
    assert diff.changes == (
        Change("1 Lintel L1", "input", "w", "8.5 kN/m", "12 kN/m"),
        Change("1 Lintel L1", "result", "M_max", "10.88 kN*m", "15.36 kN*m"),
        Change("1 Lintel L1", "result", "V_max", "13.6 kN", "19.2 kN"),
        Change(
            "1 Lintel L1",
            "check",
            "Bending (L1)",
            "u = 0.766, 10.88 / 14.2 kN*m OK",
            "u = 1.08, 15.36 / 14.2 kN*m NOT OK",
            verdict_changed=True,
        ),
    )
    assert diff.changed_sheets() == ("1 Lintel L1",)
    assert diff.changed_paths() == ("sheets/01-lintel.ipynb",)
    table = diff.table()
    assert table.splitlines()[0] == "Revision A -> B"
    assert "check (verdict)" in table
    assert "Post P1" not in table  # the unchanged sheet is not listed


def test_no_change_and_smaller_load_keeping_the_verdict() -> None:
    base = _lintel_revision(8.5, "A")
    assert diff_manifests(base, copy.deepcopy(base)).empty
    assert "no changes" in diff_manifests(base, base).table()
    lighter = diff_manifests(base, _lintel_revision(8.0, "B"))
    assert [c.name for c in lighter.changes] == ["w", "M_max", "V_max", "Bending (L1)"]
    assert not lighter.changes[-1].verdict_changed


def test_sheets_and_quantities_added_and_removed() -> None:
    old = make_manifest()
    new = make_manifest()
    removed = new["sheets"].pop(1)
    new["sheets"][0]["values"].append(
        {"name": "b", "value": 0.1, "unit": "m", "kind": "given", "description": "bearing"}
    )
    new["sheets"].append({**removed, "path": "sheets/03-post.ipynb", "number": 3})
    diff = diff_manifests(old, new)
    assert Change("1 Lintel L1", "input", "b", None, "0.1 m") in diff.changes
    assert Change("3 Post P1", "sheet", "sheet added", None, "sheets/03-post.ipynb") in (
        diff.changes
    )
    assert Change("2 Post P1", "sheet", "sheet removed", "sheets/02-post.ipynb", None) in (
        diff.changes
    )


@settings(max_examples=30, deadline=None)
@given(
    picks=st.sets(st.sampled_from([(0, 0), (0, 1), (0, 2), (0, 3), (1, 0)]), max_size=5),
    factor=st.floats(min_value=1.01, max_value=50.0),
)
def test_property_diff_names_exactly_the_perturbed_values(
    picks: set[tuple[int, int]], factor: float
) -> None:
    old = make_manifest()
    new = copy.deepcopy(old)
    for s, v in picks:
        new["sheets"][s]["values"][v]["value"] *= factor
    diff = diff_manifests(old, new)
    expected = {new["sheets"][s]["values"][v]["name"] for s, v in picks}
    assert {c.name for c in diff.changes} == expected
    assert diff_manifests(new, old).changed_sheets() == diff.changed_sheets()


def test_float_noise_is_not_a_change() -> None:
    old = make_manifest()
    new = copy.deepcopy(old)
    new["sheets"][0]["values"][2]["value"] *= 1 + 1e-13  # platform rounding, not a change
    assert diff_manifests(old, new).empty


def test_diff_reads_packages_manifest_files_and_project_directories(tmp_path: Path) -> None:
    old_pdf = tmp_path / "rev-a.pdf"
    new_pdf = tmp_path / "rev-b.pdf"
    pdf = cover_pdf()
    old_pdf.write_bytes(attach_manifest(pdf, _lintel_revision(8.5, "A")))
    new_pdf.write_bytes(attach_manifest(pdf, _lintel_revision(12.0, "B")))
    from_pdfs = diff_packages(old_pdf, new_pdf)
    assert len(from_pdfs.changes) == 4

    old_json = tmp_path / "a" / "build" / "job.manifest.json"
    old_json.parent.mkdir(parents=True)
    old_json.write_text(json.dumps(_lintel_revision(8.5, "A")))
    new_json = tmp_path / "b.json"
    new_json.write_text(json.dumps(_lintel_revision(12.0, "B")))
    assert diff_packages(old_json, new_json).changes == from_pdfs.changes
    assert diff_packages(tmp_path / "a", new_pdf).changes == from_pdfs.changes


def test_bad_sources_are_named(tmp_path: Path) -> None:
    with pytest.raises(VerificationError, match=r"'.*gone\.pdf' does not exist"):
        load_manifest(tmp_path / "gone.pdf")
    other = tmp_path / "other.json"
    other.write_text('{"format": "something-else"}')
    with pytest.raises(VerificationError, match="format = 'something-else'"):
        load_manifest(other)
    empty = tmp_path / "empty-dir"
    empty.mkdir()
    with pytest.raises(VerificationError, match="holds no calcpack manifest"):
        load_manifest(empty)
    plain = tmp_path / "plain.pdf"
    plain.write_bytes(attach_manifest(cover_pdf(), None))
    with pytest.raises(VerificationError, match="has no embedded calcpack-manifest"):
        diff_packages(plain, plain)
