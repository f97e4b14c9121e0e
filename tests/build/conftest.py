"""Shared fixtures for the build tests: the lintel demo job built once, small projects."""

from __future__ import annotations

import io
import json
import shutil
from pathlib import Path
from typing import Any

import pytest
from examplekit import Built, build_examples
from projectkit import make_project
from pypdf import PdfReader
from sharedbuild import built_once, shared_base

from calcpack.cli import main


@pytest.fixture
def new_project() -> Any:
    """``make_project`` as a fixture: ``new_project(root, {title: [code cells]})``."""
    return make_project


LINTEL_DEMO = Path(__file__).resolve().parents[2] / "example_projects" / "lintel_demo"


@pytest.fixture(scope="session")
def demo_dir(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """The lintel demo job (example_projects/lintel_demo) built once per run with `calcpack build`.

    Returns the output folder; the copied project is its ``project`` subfolder.
    """

    def make(folder: Path) -> None:
        shutil.copytree(
            LINTEL_DEMO,
            folder / "project",
            ignore=shutil.ignore_patterns(".calcpack-cache", "build"),
        )
        assert main(["build", str(folder / "project"), "--out", str(folder), "--quiet"]) == 0

    return built_once(shared_base(tmp_path_factory) / "lintel", make)


@pytest.fixture(scope="session")
def demo_pdf(demo_dir: Path) -> Path:
    (pdf,) = demo_dir.glob("*.pdf")
    return pdf


@pytest.fixture(scope="session")
def demo_manifest(demo_dir: Path) -> dict[str, Any]:
    (path,) = demo_dir.glob("*.manifest.json")
    result: dict[str, Any] = json.loads(path.read_text("utf-8"))
    return result


@pytest.fixture(scope="session")
def demo_reader(demo_pdf: Path) -> PdfReader:
    return PdfReader(io.BytesIO(demo_pdf.read_bytes()))


@pytest.fixture(scope="session")
def demo_texts(demo_reader: PdfReader) -> list[str]:
    """The text layer of every page, whitespace collapsed."""
    return [" ".join(page.extract_text().split()) for page in demo_reader.pages]


@pytest.fixture(scope="session")
def packages(tmp_path_factory: pytest.TempPathFactory) -> dict[str, Built]:
    """The example jobs (examplekit.ALL_PROJECTS), built and signed once per run on first use."""
    return build_examples(shared_base(tmp_path_factory))
