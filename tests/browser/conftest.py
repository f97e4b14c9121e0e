"""Fixtures for the browser tests: a JupyterLab server and a headless Chromium page.

Browser tests skip when Debian's chromium or Playwright is missing, except when the environment
sets CALCPACK_REQUIRE_BROWSER=1 (CI does): then a missing browser is a failure, never a skip.
"""

from __future__ import annotations

import os
from collections.abc import Iterator
from typing import Any

import pytest
from lab_harness import CHROMIUM, LabServer, chromium_page, lab_server


def _require_browser() -> None:
    required = os.environ.get("CALCPACK_REQUIRE_BROWSER") == "1"
    problems = []
    if not CHROMIUM.exists():
        problems.append(f"{CHROMIUM} is missing (Debian package chromium)")
    try:
        import playwright.sync_api  # noqa: F401
    except ImportError:
        problems.append("the playwright Python package is not installed")
    if problems:
        message = "; ".join(problems)
        if required:
            pytest.fail(f"CALCPACK_REQUIRE_BROWSER=1 but {message}", pytrace=False)
        pytest.skip(message)


@pytest.fixture(scope="module")
def lab(tmp_path_factory: pytest.TempPathFactory) -> Iterator[LabServer]:
    _require_browser()
    home = tmp_path_factory.mktemp("home")
    root = tmp_path_factory.mktemp("notebooks")
    with lab_server(root, home) as server:
        yield server


@pytest.fixture(scope="module")
def page(lab: LabServer, tmp_path_factory: pytest.TempPathFactory) -> Iterator[Any]:
    profile = tmp_path_factory.mktemp("chromium-profile")
    with chromium_page(profile) as p:
        yield p
