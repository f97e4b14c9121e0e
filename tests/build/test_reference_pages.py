"""Rendered pages keep the layout of the reference images (structure, not pixels).

One reference page per layout (cover, contents, sheet, summary of checks) lives in
``tests/build/reference/``. Each page is rendered with poppler's pdftoppm and reduced to a coarse
grid of "ink"/"paper" cells; the grid must agree with the reference's on most cells, so a moved
title block, a lost sign-off box or a blank page fails while font hinting and anti-aliasing do
not. Set CALCPACK_UPDATE_REFERENCE=1 to rewrite the references after a deliberate layout change
(and look at them).
"""

from __future__ import annotations

import os
import shutil
import subprocess
from pathlib import Path
from typing import Any

import pytest

pytestmark = pytest.mark.build

Image = pytest.importorskip("PIL.Image")

REFERENCE = Path(__file__).parent / "reference"
GRID = (24, 34)  # columns, rows: about 9 mm cells on A4
AGREEMENT = 0.88


def _render(pdf: Path, page: int, out: Path) -> Any:
    if shutil.which("pdftoppm") is None:
        pytest.skip("pdftoppm (poppler-utils) is not installed")
    stem = out / f"p{page}"
    subprocess.run(
        [
            "pdftoppm",
            "-r",
            "50",
            "-gray",
            "-png",
            "-singlefile",
            "-f",
            str(page),
            "-l",
            str(page),
            str(pdf),
            str(stem),
        ],
        check=True,
    )
    return Image.open(f"{stem}.png").convert("L")


def _grid(image: Any) -> list[bool]:
    small = image.resize(GRID, Image.Resampling.BOX)
    return [value < 247 for value in small.tobytes()]  # any ink in the cell (8-bit grey)


def _pages(manifest: dict[str, Any]) -> dict[str, int]:
    sections = manifest["sections"]
    return {
        "cover": sections["cover"][0],
        "contents": sections["contents"][0],
        "sheet": sections["sheet-2"][0],
        "summary": sections["summary"][0],
    }


@pytest.mark.parametrize("layout", ["cover", "contents", "sheet", "summary"])
def test_page_structure_matches_reference(
    layout: str, demo_pdf: Path, demo_manifest: dict[str, Any], tmp_path: Path
) -> None:
    page = _pages(demo_manifest)[layout]
    image = _render(demo_pdf, page, tmp_path)
    reference = REFERENCE / f"{layout}.png"
    if os.environ.get("CALCPACK_UPDATE_REFERENCE") == "1":
        REFERENCE.mkdir(exist_ok=True)
        image.save(reference, optimize=True)
        pytest.skip(f"reference {reference.name} rewritten")
    expected = _grid(Image.open(reference).convert("L"))
    got = _grid(image)
    assert image.size == Image.open(reference).size  # same paper
    agree = sum(a == b for a, b in zip(expected, got, strict=True)) / len(got)
    assert agree >= AGREEMENT, f"{layout}: only {agree:.0%} of the layout grid agrees"
    assert sum(got) > len(got) * 0.05  # not a blank page


SPECIMEN = [
    r"\frac{w L^{2}}{8}",
    r"\sqrt{\frac{E I}{m}}",
    r"\frac{1}{\sqrt{2 g h}}",
    r"\frac{a + b}{2 \sqrt{c^{2} + d^{2}}}",
    r"\bar{x}^{2} + \bar{y}_{c}^{2}",
    r"\left(\frac{M}{M_{p}}\right)^{2} + \frac{N}{N_{p}} \leq 1",
    r"\begin{aligned} M_{max} &= \frac{w L^{2}}{8} \\ &= \frac{(5.37\ \mathrm{kN/m})"
    r"(2.55\ \mathrm{m})^{2}}{8} \\ &= 4.36\ \mathrm{kN} \cdot \mathrm{m}\end{aligned}",
    r"\sum_{i=1}^{n} F_{i} = 0",
    r"\int\limits_{0}^{L} w(x)\, dx",
    r"\Sigma M_{A} = 0 \quad \alpha\ \beta\ \gamma\ \Delta\ \phi\ \varphi\ \sigma\ \tau",
]


def test_math_specimen_page(tmp_path: Path) -> None:
    """The formula forms the sheets use, typeset and laid out like a sheet (see DEVELOPERS.md)."""
    from pypdf import PdfReader
    from weasyprint import HTML

    from calcpack.package.convert import package_css
    from calcpack.package.mathcache import MathCache
    from calcpack.package.mathsvg import math_spans_to_images

    rows = "".join(
        f'<div class="cp-step cp-derived cp-row"><div class="cp-ref">display</div>'
        f'<div class="cp-desc">{i}</div><div class="cp-body">'
        f'<span class="cp-math cp-math-display">\\[{tex}\\]</span></div>'
        '<div class="cp-out"></div></div>'
        f'<p>Inline: the value <span class="cp-math cp-math-inline">\\({tex}\\)</span> '
        "sits on the text baseline.</p>"
        for i, tex in enumerate(SPECIMEN, start=1)
    )
    html = (
        f"<html><head><style>{package_css()} @page {{ size: A4; margin: 15mm }}</style>"
        f'</head><body><div class="cp-sheet-body">{math_spans_to_images(rows, MathCache())}</div>'
        "</body></html>"
    )
    pdf = tmp_path / "math.pdf"
    HTML(string=html).write_pdf(pdf)
    reader = PdfReader(str(pdf))
    assert all(list(page.images) == [] for page in reader.pages)  # vector only
    text = " ".join(page.extract_text() for page in reader.pages)
    assert "\\frac" not in text
    image = _render(pdf, 1, tmp_path)
    reference = REFERENCE / "math.png"
    if os.environ.get("CALCPACK_UPDATE_REFERENCE") == "1":
        REFERENCE.mkdir(exist_ok=True)
        image.save(reference, optimize=True)
        pytest.skip("reference math.png rewritten")
    expected = _grid(Image.open(reference).convert("L"))
    got = _grid(image)
    agree = sum(a == b for a, b in zip(expected, got, strict=True)) / len(got)
    assert agree >= AGREEMENT, f"math specimen: only {agree:.0%} of the layout grid agrees"
