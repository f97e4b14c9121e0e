"""Sheets in a real JupyterLab: run all cells in headless Chromium and look at what rendered."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import pytest
from lab_harness import (
    LabServer,
    cell_errors,
    copy_into,
    open_notebook,
    run_all_cells,
    save_screenshot,
)

pytestmark = pytest.mark.browser

REPO = Path(__file__).resolve().parents[2]
LINTEL = REPO / "example_projects" / "working_examples" / "lintel_check.ipynb"


def test_lintel_sheet_renders_math(lab: LabServer, page: Any) -> None:
    copy_into(lab.root, LINTEL)
    open_notebook(page, lab, LINTEL.name)
    run_all_cells(page)
    assert cell_errors(page) == []
    # JupyterLab typesets the \[..\] and \(..\) TeX of each step with MathJax: a typeset
    # formula is an mjx-container element inside the step's cp-math span.
    page.wait_for_selector(".cp-math mjx-container", timeout=60_000)
    typeset = page.locator(".cp-step .cp-math mjx-container").count()
    raw_tex = page.locator(".cp-math:not(:has(mjx-container))").count()
    assert typeset >= 10
    assert raw_tex == 0
    verdicts = page.locator(".cp-verdict").all_inner_texts()
    assert any("OK" in v for v in verdicts)
    save_screenshot(page, "lintel_check.png")
