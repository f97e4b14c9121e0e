"""Fault injection: the values sheets export to each other (``.calcpack-cache/exports``) are
sealed like every other cache entry, so an edited, truncated or swapped exports file is
discarded with a warning and never imported (issue 15, point 4).

The rule is the cache's own (calcpack.fileio: key, length and SHA-256 checked on every read);
the safe outcome, common practice for a value another sheet builds on, is "run that sheet
again", never a value nobody computed.
"""

from __future__ import annotations

import json
from collections.abc import Callable
from pathlib import Path

import pytest

from calcpack import ureg
from calcpack.errors import InputError
from calcpack.fileio import CacheWarning, unseal
from calcpack.working import Sheet
from calcpack.working.links import (
    SHEET_ENV,
    exports_key,
    exports_path,
    read_exports,
    resolve_sheet,
)
from tests.linkkit import sheets_folder_project


@pytest.fixture
def project(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    """Two sheets that each export a value, run as in JupyterLab (exports in the cache)."""
    sheets_folder_project(tmp_path, ("01_loads", "02_beam"), monkeypatch)
    for sheet, value in (("01_loads", 5.4), ("02_beam", 12.5)):
        monkeypatch.setenv(SHEET_ENV, f"sheets/{sheet}.ipynb")
        s = Sheet(sheet, auto_display=False)
        s.export(s.given("w", value * ureg.kN / ureg.m, "line load"))
    monkeypatch.delenv(SHEET_ENV)
    return tmp_path


def _file(sheet: str) -> Path:
    return exports_path(resolve_sheet(sheet))


def _import(sheet: str = "01_loads") -> float:
    s = Sheet("Post", auto_display=False)
    return float(s.import_value(sheet, "w", dimension="[force]/[length]").record().value)


def test_an_untouched_exports_file_is_a_sealed_entry_and_imports(project: Path) -> None:
    path = _file("01_loads")
    content, why = unseal(exports_key("sheets/01_loads.ipynb"), path.read_bytes())
    assert why == ""
    assert content is not None
    assert json.loads(content)["sheet"] == "sheets/01_loads.ipynb"
    assert _import() == pytest.approx(5.4)


def _edit_value(data: bytes) -> bytes:
    assert b"5.4" in data
    return data.replace(b"5.4", b"9.4")


@pytest.mark.parametrize(
    ("fault", "why"),
    [
        (_edit_value, "does not match its hash"),
        (lambda data: data[: len(data) // 2], "truncated or edited"),
        (lambda data: b"", "no entry header"),
        (lambda data: json.dumps({"format": "calcpack-exports/1"}).encode(), "no entry header"),
    ],
    ids=["edited value", "truncated", "emptied", "unsealed JSON"],
)
def test_a_damaged_exports_file_is_discarded_with_a_warning_and_never_imported(
    project: Path, fault: Callable[[bytes], bytes], why: str
) -> None:
    path = _file("01_loads")
    path.write_bytes(fault(path.read_bytes()))
    with (
        pytest.warns(CacheWarning, match=f"exports of sheet sheets/01_loads.ipynb.*{why}"),
        pytest.raises(InputError, match="has no recorded exports yet: run it"),
    ):
        _import()
    assert not path.exists()  # discarded, so the next run writes it afresh


def test_an_exports_file_copied_over_another_sheets_is_refused(project: Path) -> None:
    _file("01_loads").write_bytes(_file("02_beam").read_bytes())  # 12.5 where 5.4 belongs
    with (
        pytest.warns(CacheWarning, match="stored for another key"),
        pytest.raises(InputError, match="no recorded exports yet"),
    ):
        _import()


def test_running_the_sheet_again_rebuilds_the_discarded_entry(
    project: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    path = _file("01_loads")
    path.write_bytes(_edit_value(path.read_bytes()))
    with pytest.warns(CacheWarning), pytest.raises(InputError):
        read_exports(resolve_sheet("01_loads"))
    monkeypatch.setenv(SHEET_ENV, "sheets/01_loads.ipynb")
    s = Sheet("01_loads", auto_display=False)
    s.export(s.given("w", 5.4 * ureg.kN / ureg.m, "line load"))
    monkeypatch.delenv(SHEET_ENV)
    assert _import() == pytest.approx(5.4)


def test_a_build_publishes_sealed_exports_that_jupyterlab_reads(
    project: Path, tmp_path_factory: pytest.TempPathFactory
) -> None:
    from types import SimpleNamespace

    from calcpack.package.links import publish_exports, write_exports_file

    # the two attributes the writer reads of the project and of its sheet entry
    loaded = SimpleNamespace(root=project)
    entry = SimpleNamespace(path="sheets/01_loads.ipynb")
    build_folder = tmp_path_factory.mktemp("build-exports")
    record = {"name": "w", "case": None, "value": 6.1, "unit": "kN/m", "pint_unit": "kN/m",
              "kind": "value", "description": "line load", "symbol": "w"}  # fmt: skip
    write_exports_file(build_folder, loaded, entry, [record])  # type: ignore[arg-type]
    cache = _file("01_loads").parent
    _file("01_loads").write_bytes(b"damaged")
    publish_exports(build_folder, cache)
    assert _import() == pytest.approx(6.1)
