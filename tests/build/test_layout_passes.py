"""A first build lays the package out once: each new sheet is counted on its own as it is
converted, and the front and back matter are counted without the sheets, before the layout."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import pytest
from projectkit import make_project
from pypdf import PdfReader

import calcpack.package.paginate as paginate_module
from calcpack.package.pipeline import build

pytestmark = pytest.mark.build

SHORT = ['w = s.given("w", 4.0 * ureg.kN / ureg.m, "line load")']
LONG = [
    # Forty steps of working: several pages.
    "for i in range(40):\n"
    '    s.derive(f"M_{i}", (i + 1) * ureg.kN * 3.0 * ureg.m / 8, f"moment case {i}",'
    ' unit="kN*m")'
]


def _passes(monkeypatch: pytest.MonkeyPatch) -> list[bool]:
    """Record every full layout pass (True when its assumed page counts held)."""
    seen: list[bool] = []
    original = paginate_module._one_pass

    def recording(*args: Any, **kwargs: Any) -> Any:
        result = original(*args, **kwargs)
        seen.append(result[0] is not None)
        return result

    monkeypatch.setattr(paginate_module, "_one_pass", recording)
    return seen


def test_first_build_lays_out_once_with_multi_page_sheets(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    project = make_project(tmp_path / "p", {"Short": SHORT, "Long": LONG, "Also short": SHORT})
    passes = _passes(monkeypatch)
    result = build(project, workers=1)  # in this process, where the pass can be watched
    assert passes == [True]  # one pass, and its counts held
    pages = {s["path"]: s["pages"] for s in result.manifest["sheets"]}
    long_first, long_last = pages["sheets/02.ipynb"]
    assert long_last > long_first  # the long sheet really takes several pages
    # The counts written in the title blocks are the real ones: "sheet n of N" on the long
    # sheet's last page, and the package's page count on every page.
    reader = PdfReader(str(result.pdf_path))
    assert len(reader.pages) == result.page_count
    n = long_last - long_first + 1
    last_text = reader.pages[long_last - 1].extract_text()
    assert f"{n} of {n}" in last_text.replace("\n", " ")
    assert f"of {result.page_count}" in reader.pages[long_first - 1].extract_text()


def test_rebuild_takes_the_counts_from_the_previous_build(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    project = make_project(tmp_path / "p", {"Short": SHORT, "Long": LONG})
    build(project, workers=1)
    counted: list[str] = []
    import calcpack.package.sheetdoc as sheetdoc_module

    original = sheetdoc_module.count_sheet_pages

    def recording(doc: Any, *rest: Any) -> int:
        counted.append(doc.entry.path)
        return int(original(doc, *rest))

    monkeypatch.setattr(sheetdoc_module, "count_sheet_pages", recording)
    passes = _passes(monkeypatch)
    build(project, workers=1, force=True)
    assert counted == []  # every sheet's count came from the previous manifest
    assert passes == [True]


def test_first_build_with_workers_gives_the_same_pages(tmp_path: Path) -> None:
    one = build(make_project(tmp_path / "one", {"Short": SHORT, "Long": LONG}), workers=1)
    two = build(make_project(tmp_path / "two", {"Short": SHORT, "Long": LONG}), workers=2)
    assert two.manifest["sections"] == one.manifest["sections"]
    assert two.page_count == one.page_count
