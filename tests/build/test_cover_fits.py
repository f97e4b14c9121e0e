"""The cover of every example package is one page: the sign-off boxes and the seal's box are
never pushed onto a second page (signatures are placed on the cover's boxes)."""

from __future__ import annotations

import datetime as dt
import io
from pathlib import Path

import pytest
from pypdf import PdfReader

from calcpack.package.document import DocumentOptions, document_html
from calcpack.package.mathcache import MathCache
from calcpack.package.project import load_project

pytestmark = pytest.mark.build

ROOT = Path(__file__).resolve().parents[2] / "example_projects"
PROJECTS = sorted(p.parent.name for p in ROOT.glob("*/calcpack.toml"))


@pytest.mark.parametrize("name", PROJECTS)
def test_cover_is_one_page(name: str) -> None:
    from weasyprint import HTML

    project = load_project(ROOT / name)
    html = document_html(
        project,
        [],
        DocumentOptions(paper=project.paper),
        created=dt.datetime(2026, 1, 1),
        math=MathCache(),
    )
    pages = [p.extract_text() for p in PdfReader(io.BytesIO(HTML(string=html).write_pdf())).pages]
    cover = pages[0]
    for words in ("Prepared by", "Approved by", "Engineer of record", "The package is issued"):
        assert words in cover, words
    assert "The package is issued" not in "".join(pages[1:])
