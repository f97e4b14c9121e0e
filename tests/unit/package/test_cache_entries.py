"""Sealed cache entries: any edit, truncation or swap is detected; a sheet's key holds only what
can change its results."""

from __future__ import annotations

import warnings
from dataclasses import replace
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.package.cache import CacheWarning, read_entry, seal, unseal, write_entry
from calcpack.package.project import Person, load_project
from calcpack.package.sheetkey import sheet_basis, sheet_cache_key
from tests.build.projectkit import make_project

KEY = "0123abcd" * 8


def test_a_sealed_entry_reads_back() -> None:
    content, why = unseal(KEY, seal(KEY, b'{"cells": []}'))
    assert content == b'{"cells": []}'
    assert why == ""


@given(st.binary(max_size=300), st.data())
def test_any_single_byte_change_is_detected(content: bytes, data: st.DataObject) -> None:
    sealed = seal(KEY, content)
    at = data.draw(st.integers(0, len(sealed) - 1))
    new = data.draw(st.integers(0, 255).filter(lambda b: b != sealed[at]))
    damaged = sealed[:at] + bytes([new]) + sealed[at + 1 :]
    assert unseal(KEY, damaged)[0] is None


@given(st.binary(min_size=1, max_size=300), st.data())
def test_any_truncation_is_detected(content: bytes, data: st.DataObject) -> None:
    sealed = seal(KEY, content)
    cut = data.draw(st.integers(0, len(sealed) - 1))
    assert unseal(KEY, sealed[:cut])[0] is None


def test_an_entry_copied_over_another_key_is_refused() -> None:
    content, why = unseal("other-key", seal(KEY, b"chunk"))
    assert content is None
    assert "another key" in why


def test_a_failing_entry_is_deleted_with_a_warning_naming_it(tmp_path: Path) -> None:
    path = tmp_path / "sheet-1.executed"
    write_entry(path, KEY, b'{"value": 2.5}')
    path.write_bytes(path.read_bytes().replace(b"2.5", b"9.5"))
    with pytest.warns(CacheWarning, match=r"executed notebook sheet-1.executed discarded.*hash"):
        assert read_entry(path, KEY, what="executed notebook") is None
    assert not path.exists()
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert read_entry(path, KEY, what="executed notebook") is None  # a miss: no warning


def test_a_bare_file_of_an_older_format_is_discarded(tmp_path: Path) -> None:
    path = tmp_path / "math.entry"
    path.write_text('{"format": "old"}', "utf-8")
    with pytest.warns(CacheWarning, match="no entry header"):
        assert read_entry(path, KEY, what="formula images") is None


@pytest.fixture
def project(tmp_path: Path):
    root = make_project(tmp_path / "job", {"Loads": ["x = 1"], "Beam": ["y = 2"]})
    return load_project(root)


def test_metadata_is_not_in_a_sheets_key(project) -> None:
    sheet = project.sheets[0]
    key = sheet_cache_key(project, sheet)
    edited = replace(
        project,
        job_title="Another title",
        client="Another client",
        site="Elsewhere",
        firm="Another firm",
        paper="Letter",
        preparer=Person("Someone Else"),
        sheets=(replace(sheet, title="Renamed"), *project.sheets[1:]),
    )
    assert sheet_cache_key(edited, edited.sheets[0]) == key


def test_what_a_sheet_reads_is_in_its_key(project) -> None:
    sheet = project.sheets[0]
    key = sheet_cache_key(project, sheet)
    units = replace(project, units="US")
    assert sheet_cache_key(units, sheet) != key
    standards = replace(project, design=replace(project.design, standards=("Another",)))
    assert sheet_cache_key(standards, sheet) != key
    renumbered = replace(project, sheets=(replace(sheet, number="7"), *project.sheets[1:]))
    assert sheet_cache_key(renumbered, renumbered.sheets[0]) != key
    nb = project.sheet_path(sheet)
    nb.write_text(nb.read_text("utf-8").replace("x = 1", "x = 2"), "utf-8")
    assert sheet_cache_key(project, sheet) != key


def test_sheet_basis_is_canonical(project) -> None:
    assert sheet_basis(project) == sheet_basis(load_project(project.root))
