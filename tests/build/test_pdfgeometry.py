"""The layout tests' ink measure reads what a PDF viewer shows: clipped fills count for what
shows through their clip (PDF 32000-1:2008 §8.5.4, clipping path operators W and W*)."""

from __future__ import annotations

import io

from pdfgeometry import painted_boxes
from pypdf import PdfReader, PdfWriter
from pypdf.generic import ContentStream, DecodedStreamObject, NameObject


def _page(content: bytes) -> PdfReader:
    writer = PdfWriter()
    page = writer.add_blank_page(612, 792)
    stream = DecodedStreamObject()
    stream.set_data(content)
    page[NameObject("/Contents")] = writer._add_object(stream)
    out = io.BytesIO()
    writer.write(out)
    reader = PdfReader(io.BytesIO(out.getvalue()))
    ContentStream(reader.pages[0].get_contents(), reader)  # it parses
    return reader


def _boxes(content: bytes) -> list[tuple[float, float, float, float]]:
    return [(b.x0, b.y0, b.x1, b.y1) for b in painted_boxes(_page(content), 0)]


def test_a_fill_counts_for_its_own_box() -> None:
    assert _boxes(b"10 20 30 40 re f") == [(10, 20, 40, 60)]


def test_a_whole_page_fill_clipped_to_a_column_counts_for_the_column() -> None:
    content = b"q 54 40 504 700 re W n 0 0 612 792 re f Q 500 500 20 20 re f"
    assert _boxes(content) == [(54, 40, 558, 740), (500, 500, 520, 520)]


def test_the_clip_ends_with_its_graphics_state() -> None:
    assert _boxes(b"q 0 0 10 10 re W n Q 0 0 612 792 re f") == [(0, 0, 612, 792)]


def test_nested_clips_narrow_and_a_fill_outside_them_shows_nothing() -> None:
    content = b"q 0 0 100 100 re W n 50 50 100 100 re W n 0 0 612 792 re f 200 200 5 5 re f Q"
    assert _boxes(content) == [(50, 50, 100, 100)]


def test_a_clipping_path_alone_is_not_ink() -> None:
    assert _boxes(b"0 0 612 792 re W n") == []
