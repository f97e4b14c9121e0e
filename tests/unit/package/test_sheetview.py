"""One sheet laid out for the preview: each stage is taken from the cache when it can be (the
build's executed notebooks and formulas, the preview's own layouts and page images), a changed
sheet is laid out once at its last page count, and the pages are drawn at the resolution asked.
"""

from __future__ import annotations

import io
import shutil
import struct
from pathlib import Path

import pytest

from calcpack.errors import InputError
from calcpack.package import paginate as pg
from calcpack.package.sheetview import page_images, render_sheet, sheet_page_images

pytestmark = pytest.mark.skipif(
    shutil.which("pdftoppm") is None, reason="needs poppler's pdftoppm (poppler-utils)"
)


def _pdf(pages: int) -> bytes:
    from weasyprint import HTML

    body = "".join(
        f"<p style='break-after: page'>Page {n}</p>" if n < pages else f"<p>Page {n}</p>"
        for n in range(1, pages + 1)
    )
    pdf: bytes = HTML(string=f"<style>@page {{ size: A4 }}</style>{body}").write_pdf()
    return pdf


def _png_size(png: bytes) -> tuple[int, int]:
    assert png[:8] == b"\x89PNG\r\n\x1a\n"
    width, height = struct.unpack(">II", png[16:24])
    return width, height


def test_pages_are_drawn_at_the_resolution_asked() -> None:
    pdf = _pdf(3)
    told: list[str] = []
    images = page_images(pdf, resolution=100, progress=told.append)
    assert len(images) == 3
    # A4 is 210 mm x 297 mm: 826.8 x 1169.3 dots at 100 dpi (pdftoppm rounds up).
    assert all(_png_size(png) == (827, 1170) for png in images)
    assert told == ["drawing pages 1 to 3 of 3 at 100 dpi"]
    (second,) = page_images(pdf, resolution=200, pages=(2, 2))
    assert _png_size(second) == (1654, 2339)


@pytest.mark.parametrize(
    ("kwargs", "name"),
    [
        ({"resolution": 10}, "resolution"),
        ({"pages": (2, 5)}, "pages"),
        ({"pages": (0, 1)}, "pages"),
    ],
)
def test_a_resolution_or_page_outside_the_document_is_refused(
    kwargs: dict[str, object], name: str
) -> None:
    with pytest.raises(InputError, match=name) as caught:
        page_images(_pdf(2), **kwargs)  # type: ignore[arg-type]
    assert caught.value.name == name


def test_a_missing_notebook_is_refused_by_name(tmp_path: Path) -> None:
    with pytest.raises(InputError, match=r"gone\.ipynb") as caught:
        render_sheet(tmp_path / "gone.ipynb")
    assert caught.value.name == "notebook"


def _sheet(value: float) -> list[str]:
    return [
        f'L = s.given("L", {value} * ureg.m, "span")\n'
        'w = s.given("w", 2.5 * ureg.kN / ureg.m, "load")\n'
        's.derive("M", w * L**2 / 8, "midspan moment", ref="simply supported beam")\ns'
    ]


@pytest.mark.build
def test_each_stage_is_taken_from_the_cache_and_a_change_is_laid_out_once(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    from pypdf import PdfReader

    from calcpack.package.execute import _cached
    from calcpack.package.project import load_project
    from calcpack.package.sheetkey import sheet_cache_key
    from tests.build.projectkit import make_project, write_notebook

    root = make_project(tmp_path / "job", {"Beam B1": _sheet(3.6)})
    notebook = root / "sheets" / "01.ipynb"

    first = render_sheet(notebook)
    assert (first.executed, first.laid_out) == ("executed", "laid out")
    text = " ".join(p.extract_text() for p in PdfReader(io.BytesIO(first.pdf)).pages)
    assert "9001" in text  # the job fields come from the project file above the sheet
    assert "3.6" in text
    # A sheet of the project's list importing nothing shares the build's executed notebook.
    project = load_project(root)
    entry = project.sheets[0]
    assert _cached(root / ".calcpack-cache", entry, sheet_cache_key(project, entry)) is not None
    images = sheet_page_images(first)

    again = render_sheet(notebook)
    assert (again.executed, again.laid_out) == ("cached", "cached")
    assert again.pdf == first.pdf
    assert [name for name, _ in again.seconds] == ["converting"]
    assert sheet_page_images(again) == images  # kept beside the PDF

    passes: list[int] = []
    one_pass = pg._one_pass

    def counted(*args: object, **kwargs: object) -> object:
        passes.append(1)
        return one_pass(*args, **kwargs)  # type: ignore[arg-type]

    monkeypatch.setattr(pg, "_one_pass", counted)
    write_notebook(notebook, "Beam B1", _sheet(4.2))
    changed = render_sheet(notebook)
    assert (changed.executed, changed.laid_out) == ("executed", "laid out")
    assert len(passes) == 1  # laid out at the page count of its last layout
    text = " ".join(p.extract_text() for p in PdfReader(io.BytesIO(changed.pdf)).pages)
    assert "4.2" in text


@pytest.mark.build
def test_a_notebook_outside_any_project_keeps_its_cache_beside_it(tmp_path: Path) -> None:
    from tests.build.projectkit import write_notebook

    notebook = tmp_path / "loose" / "beam.ipynb"
    write_notebook(notebook, "Loose beam", _sheet(3.0))
    first = render_sheet(notebook)
    assert first.cache_dir == notebook.parent / ".calcpack-cache"
    assert render_sheet(notebook).executed == "cached"
    uncached = render_sheet(notebook, use_cache=False)
    assert (uncached.executed, uncached.laid_out, uncached.cache_dir) == (
        "executed",
        "laid out",
        None,
    )


def test_a_sheet_laid_out_alone_shows_links_to_other_sheets_as_text() -> None:
    """An imported value's source names the exporting sheet; on its own the sheet has no page to
    give for it, so the link becomes its words (never "(page )")."""
    from calcpack.package.sheetdoc import unlink_absent

    html = (
        '<section id="sheet-1"><a class="cp-link" href="#sheet-2">sheet 2, <i>R</i><sub>A</sub>'
        '</a> <a class="cp-link" href="#sheet-1">this sheet</a></section>'
    )
    assert unlink_absent(html) == (
        '<section id="sheet-1">sheet 2, <i>R</i><sub>A</sub> '
        '<a class="cp-link" href="#sheet-1">this sheet</a></section>'
    )
