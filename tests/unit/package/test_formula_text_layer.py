"""A formula in the PDF is drawn as vector outlines and carries its words as invisible text:
poppler's pdftotext finds them over the image, and the page looks exactly as without them.

Checked on a page laid out with the package stylesheet, read back with poppler
(``pdftotext -bbox`` for the words and their boxes, ``pdftoppm`` for the pixels).
"""

from __future__ import annotations

import re
import shutil
import subprocess
from pathlib import Path

import pytest

from calcpack.package.convert import package_css
from calcpack.package.mathcache import MathCache
from calcpack.package.mathsvg import math_spans_to_images

pytestmark = pytest.mark.skipif(
    shutil.which("pdftotext") is None or shutil.which("pdftoppm") is None,
    reason="needs poppler-utils (pdftotext, pdftoppm)",
)

TEX = (
    r"M_{\mathrm{max}} = \frac{w L^{2}}{8} = \frac{\left(5.40\ \mathrm{kN/m}\right) "
    r"\left(2.55\ \mathrm{m}\right)^{2}}{8} = 4.39\ \mathrm{kN{\cdot}m}"
)
WORDS = "Mmax = wL²/8 = ((5.40 kN/m)(2.55 m)²)/8 = 4.39 kN·m"


def page(body: str) -> str:
    return (
        f'<!DOCTYPE html><html lang="en"><head><style>{package_css()}</style></head><body>'
        f'<div class="cp-sheet-body"><p>The moment at midspan, '
        f'<span class="cp-math cp-math-inline">\\(\\sigma_{{b}} \\le f_{{b}}\\)</span>, '
        f"is found from the beam table:</p>"
        f'<span class="cp-math cp-math-display">\\[{TEX}\\]</span>{body}</div></body></html>'
    )


def render(html: str, path: Path) -> tuple[float, float]:
    """Write the PDF; return the display formula image's left and right edges in points."""
    from weasyprint import HTML

    document = HTML(string=html).render()
    document.copy(document.pages[:1]).write_pdf(path, pdf_tags=True)

    def walk(box: object) -> list[object]:
        kids = getattr(box, "children", ()) or ()
        return [box, *[b for k in kids for b in walk(k)]]

    images = [
        b
        for b in walk(document.pages[0]._page_box)
        if getattr(b, "element_tag", None) == "img"
        and "cp-math-display" in (b.element.get("class") or "")  # type: ignore[attr-defined]
    ]
    (image,) = images
    x = image.content_box_x() * 0.75  # type: ignore[attr-defined]
    return x, x + image.width * 0.75  # type: ignore[attr-defined]


def words_with_boxes(path: Path) -> list[tuple[str, float, float]]:
    out = subprocess.run(
        ["pdftotext", "-bbox", str(path), "-"], capture_output=True, text=True, check=True
    ).stdout
    return [
        (m[3], float(m[1]), float(m[2]))
        for m in re.finditer(
            r'<word xMin="([\d.]+)" yMin="[\d.]+" xMax="([\d.]+)"[^>]*>([^<]*)<', out
        )
    ]


def test_formula_words_are_found_over_the_image(tmp_path: Path) -> None:
    import html as _html

    path = tmp_path / "formula.pdf"
    left, right = render(math_spans_to_images(page("<p>After.</p>"), MathCache()), path)
    text = subprocess.run(
        ["pdftotext", str(path), "-"], capture_output=True, text=True, check=True
    ).stdout
    assert WORDS in " ".join(text.split())
    assert "The moment at midspan, σb ≤ fb, is found" in " ".join(text.split())
    words = [w for w in words_with_boxes(path) if _html.unescape(w[0]) in WORDS.split()]
    first = next(i for i, w in enumerate(words) if w[0] == "Mmax")
    formula = words[first : first + len(WORDS.split())]
    assert " ".join(_html.unescape(w) for w, _, _ in formula) == WORDS
    # the words span the image, from its left edge to its right (a selection over it copies them)
    assert formula[0][1] == pytest.approx(left, abs=1.0)
    assert formula[-1][2] == pytest.approx(right, abs=1.5)


def test_the_words_are_never_seen(tmp_path: Path) -> None:
    with_words = tmp_path / "with.pdf"
    render(math_spans_to_images(page(""), MathCache()), with_words)
    html = re.sub(
        r'<span class="cp-math-text"[^>]*>[^<]*</span>',
        "",
        math_spans_to_images(page(""), MathCache()),
    )
    without = tmp_path / "without.pdf"
    render(html, without)
    images = []
    for pdf in (with_words, without):
        subprocess.run(
            ["pdftoppm", "-r", "100", "-png", str(pdf), str(pdf.with_suffix(""))], check=True
        )
        images.append(next(tmp_path.glob(f"{pdf.stem}*.png")).read_bytes())
    assert images[0] == images[1]
