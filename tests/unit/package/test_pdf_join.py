"""Joining layout chunks: the first chunk's document is cloned without pypdf's warning about
the trailer size, and each stream of it is copied once."""

from __future__ import annotations

import io
import logging
import re
import shutil
import subprocess
from pathlib import Path

import pytest
from pypdf import PdfReader

from calcpack.package.pdfjoin import join_chunks

# Two figures drawn with transparency: WeasyPrint gives each its own transparency group
# whose colour space cites the one sRGB profile of the document.
_FIGURE = (
    "<img alt='{alt}' src=\"data:image/svg+xml;utf8,<svg xmlns='http://www.w3.org/2000/svg' "
    "width='40' height='20'><rect width='40' height='20' fill='black' opacity='0.{n}'/></svg>\">"
)


def _chunk(title: str, figures: int) -> bytes:
    from weasyprint import HTML

    images = "".join(_FIGURE.format(alt=f"figure {n}", n=n + 1) for n in range(figures))
    html = f"<html lang='en'><body><h1>{title}</h1><p>Text of {title}.</p>{images}</body></html>"
    pdf: bytes = HTML(string=html).write_pdf(pdf_variant="pdf/a-3b", pdf_tags=True)
    return pdf


def _profiles(pdf: bytes) -> int:
    reader = PdfReader(io.BytesIO(pdf))
    count = 0
    for table in reader.xref.values():
        for number in table:
            obj = reader.get_object(number)
            if hasattr(obj, "get_data") and obj.get("/N") == 3 and "/Subtype" not in obj:
                count += 1
    return count


def test_joining_emits_no_pypdf_warning_and_copies_the_colour_profile_once(
    caplog: pytest.LogCaptureFixture,
) -> None:
    first, second = _chunk("Cover", 9), _chunk("Sheet 1", 3)
    assert _profiles(first) == 1
    with caplog.at_level(logging.WARNING, logger="pypdf"):
        joined = join_chunks(first, [second], [])
    assert [r.getMessage() for r in caplog.records if r.name.startswith("pypdf")] == []
    reader = PdfReader(io.BytesIO(joined))
    assert len(reader.pages) == 2
    # One profile from each chunk, however many groups cite it (pypdf made one per group).
    assert _profiles(joined) == 2


def _names(data: bytes) -> set[str]:
    return {"/" + m.decode("latin-1") for m in re.findall(rb"/([^\s/<>\[\]()%{}]+)", data)}


def test_each_page_keeps_only_the_resources_it_names(tmp_path: Path) -> None:
    """WeasyPrint shares one resource dictionary among a chunk's pages; the join gives each page
    (and each pattern or form drawn) the entries its content names, and the pages look the
    same (rendered by poppler, pixel for pixel)."""
    from weasyprint import HTML

    from calcpack.package import pdfjoin

    figures = [_FIGURE.format(alt=f"figure {n}", n=n + 1) for n in range(4)]
    html = (
        "<html lang='en'><body><h1>Sheet 1</h1>"
        + "<p style='break-after: page'>Text.</p>".join(figures)
        + "</body></html>"
    )
    first = HTML(string=html).write_pdf(pdf_variant="pdf/a-3b", pdf_tags=True)
    second = _chunk("Sheet 2", 3)
    pruned = join_chunks(first, [second], [])
    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(pdfjoin, "prune_resources", lambda writer: 0)
        shared = join_chunks(first, [second], [])
    before = PdfReader(io.BytesIO(shared)).pages[0]
    assert not set(before["/Resources"]["/XObject"]) <= _names(before.get_contents().get_data())
    reader = PdfReader(io.BytesIO(pruned))
    for page in reader.pages:
        names = _names(page.get_contents().get_data())
        resources = page["/Resources"]
        for category in ("/Font", "/XObject", "/Pattern", "/ExtGState", "/Shading"):
            assert set(resources.get(category, {})) <= names, category
        assert resources.get("/XObject")  # the figures are still drawn
    if shutil.which("pdftoppm") is None:
        pytest.skip("needs poppler's pdftoppm")
    for name, pdf in (("pruned", pruned), ("shared", shared)):
        (tmp_path / f"{name}.pdf").write_bytes(pdf)
        subprocess.run(
            ["pdftoppm", "-r", "60", "-png", str(tmp_path / f"{name}.pdf"), str(tmp_path / name)],
            check=True,
        )
    images = sorted(tmp_path.glob("pruned-*.png"))
    assert len(images) == 5
    for image in images:
        other = tmp_path / image.name.replace("pruned", "shared")
        assert image.read_bytes() == other.read_bytes(), image.name
