"""Nothing is drawn past the text column; long names fit the title block; headings keep with
what follows. Read back from the PDF (pypdf geometry and poppler's word boxes)."""

from __future__ import annotations

import io
import json
import re
from pathlib import Path
from typing import Any

import pytest
from pdfgeometry import page_words, painted_extent
from projectkit import make_project
from pypdf import PdfReader

from calcpack.cli import main

pytestmark = pytest.mark.build

MM = 72 / 25.4
A4_WIDTH = 595.28
LEFT, RIGHT = 19 * MM, 14 * MM  # the package's page margins (assets/calcpack.css)
LONG_PREPARER = "Wilhelmina Castellanos-Ridgeway"  # invented, longer than the cell at 8 pt
LONG_CHECKER = "Bartholomew Okonkwo-Lindenstrauss"  # invented

WIDE_CELLS = [
    "import functools, operator",
    # Twelve loads and their lever arms: the moment line runs to about three column widths.
    "P = [s.given(f'P_{i}', (0.25 + 0.05 * i) * ureg.kN, 'point load') for i in range(1, 13)]\n"
    "a = [s.given(f'a_{i}', 0.4 * i * ureg.m, 'lever arm') for i in range(1, 13)]\n"
    "L = s.given('L', 5.2 * ureg.m, 'span')",
    "M = functools.reduce(operator.add, [p * x for p, x in zip(P, a)])\n"
    "M_A = s.derive('M_A', M, 'moment of the loads about A', unit='kN*m')\n"
    "R_B = s.derive('R_B', M / L, 'reaction at B (long numerator)', unit='kN')\n"
    "R_A = s.derive('R_A', -(functools.reduce(operator.add, P) - M / L), "
    "'reaction at A (long bracket)', unit='kN')",
]


@pytest.fixture(scope="module")
def wide_package(tmp_path_factory: pytest.TempPathFactory) -> Path:
    root = make_project(tmp_path_factory.mktemp("wide") / "job", {"Wide working": WIDE_CELLS})
    toml = root / "calcpack.toml"
    text = toml.read_text("utf-8").replace("P. Reparer", LONG_PREPARER)
    toml.write_text(text.replace("C. Hecker", LONG_CHECKER), "utf-8")
    assert main(["build", str(root), "--quiet"]) == 0
    (pdf,) = (root / "build").glob("*.pdf")
    return pdf


def _sheet_pages(pdf: Path) -> list[int]:
    manifest = json.loads(next(pdf.parent.glob("*.manifest.json")).read_text("utf-8"))
    first, last = manifest["sheets"][0]["pages"]
    return list(range(first, last + 1))


def test_wide_formulas_stay_inside_the_text_column(wide_package: Path) -> None:
    """Every painted path and image on the sheet pages lies between the page margins."""
    reader = PdfReader(io.BytesIO(wide_package.read_bytes()))
    assert abs(float(reader.pages[0].mediabox.width) - A4_WIDTH) < 1
    for page in _sheet_pages(wide_package):
        extent = painted_extent(reader, page - 1)
        # 1 pt: half the title block's outer border straddles the column edge.
        assert extent.x1 <= A4_WIDTH - RIGHT + 1, f"page {page}: ink to x = {extent.x1:.1f} pt"
        assert extent.x0 >= LEFT - 1, f"page {page}: ink from x = {extent.x0:.1f} pt"
    text = " ".join(
        " ".join(reader.pages[p - 1].extract_text().split()) for p in _sheet_pages(wide_package)
    )
    assert "moment of the loads about A" in text  # the steps were laid out at all


def test_wide_formulas_are_broken_not_squeezed(wide_package: Path) -> None:
    """The long lines were broken at operators: their alternative text is the whole formula,
    and the image is set at (nearly) full size, several lines tall."""
    from calcpack.package.mathcache import MathCache
    from calcpack.package.mathsvg import MATH_MAX_WIDTH_PX, fitted_image, tex_to_svg

    tex = r"M_{A} = " + " + ".join(f"P_{{{i}}} a_{{{i}}}" for i in range(1, 30))
    math = MathCache()
    whole = tex_to_svg(tex, display=True, cache=math)
    assert whole.width_px > 2 * MATH_MAX_WIDTH_PX
    fitted = fitted_image(tex, True, cache=math)
    assert fitted.width_px <= MATH_MAX_WIDTH_PX
    assert fitted.width_px > 0.6 * MATH_MAX_WIDTH_PX  # lines are filled, not one term each
    assert fitted.height_px > 2.5 * whole.height_px  # three or more lines


def _cell_edges(words: list[Any], label: str) -> float:
    return min(w.x0 for w in words if w.text == label)


def test_long_names_fit_the_title_block(wide_package: Path) -> None:
    """The whole of each long name is printed inside its BY / CHECKED cell on every page."""
    for page in _sheet_pages(wide_package):
        words = page_words(wide_package, page)
        checked_x = _cell_edges(words, "CHECKED")
        page_x = _cell_edges(words, "PAGE")
        for name, right in ((LONG_PREPARER, checked_x), (LONG_CHECKER, page_x)):
            # The name's words in reading order from its first word (wrapped lines included).
            start = next(i for i, w in enumerate(words) if w.text == name.split()[0])
            parts, printed = [], ""
            for w in words[start:]:
                if len(printed) >= len(name.replace(" ", "")):
                    break
                parts.append(w)
                printed += w.text
            assert printed == name.replace(" ", ""), printed
            # wrapped at word boundaries (a space or after a hyphen), never inside a word
            pieces = {p for word in name.split() for p in re.split(r"(?<=-)", word) if p}
            assert {w.text for w in parts} <= pieces | set(name.split()), parts
            # Padding of the cell is 1.6 mm; every word ends before the next cell starts.
            assert all(w.x1 <= right - 1.6 * MM + 0.5 for w in parts), (name, parts)


HEADING_PAGE = """<html><head><style>{css} @page {{ size: A4; margin: 20mm }}</style></head>
<body><div class="cp-sheet-body">{filler}
<div class="cp-cell cp-markdown"><h2>Heading under test</h2></div>
<div class="cp-cell cp-outputs"><div class="cp-output"><div class="cp-step cp-block">
{steps}</div></div></div></div></body></html>"""


@pytest.mark.parametrize("markdown", [True, False], ids=["markdown-heading", "step-heading"])
def test_a_heading_is_never_alone_at_a_page_foot(markdown: bool) -> None:
    """Wherever the filler leaves the heading, it is on the page of the first step after it."""
    from weasyprint import HTML

    from calcpack.package.convert import package_css

    steps = "".join(
        f'<div class="cp-step cp-given cp-row"><div class="cp-ref">ref</div>'
        f'<div class="cp-desc">step {i:02d}</div><div class="cp-body">value {i}</div>'
        '<div class="cp-out"></div></div>'
        for i in range(1, 41)
    )
    css = package_css()
    checked = 0
    for lines in range(40, 62):
        filler = "".join(f"<p>Filler line {i}.</p>" for i in range(lines))
        html = HEADING_PAGE.format(css=css, filler=filler, steps=steps)
        if not markdown:
            html = html.replace(
                '<div class="cp-cell cp-markdown"><h2>Heading under test</h2></div>',
                '<div class="cp-step cp-heading"><h2>Heading under test</h2></div>',
            )
        reader = PdfReader(io.BytesIO(HTML(string=html).write_pdf()))
        texts = [page.extract_text() for page in reader.pages]
        heading = next(i for i, t in enumerate(texts) if "Heading under test" in t)
        first = next(i for i, t in enumerate(texts) if "step 01" in t)
        assert heading == first, f"{lines} filler lines: heading on page {heading + 1}"
        checked += heading == 1  # the heading was pushed over with its step
    assert checked >= 1  # some filler lengths did bring the heading to a page foot
