"""A boxed block (a table of the working, the cautions box) runs over a page instead of leaving
a blank before it, and the page it breaks on says so at its foot. Laid out with WeasyPrint and
the package stylesheet; pages read back with pypdf."""

from __future__ import annotations

import io

from pypdf import PdfReader

from calcpack.units import ureg
from calcpack.working import Sheet

PAGE = """<html><head><style>{css} @page {{ size: A5; }}</style></head>
<body><div class="cp-sheet-body">{filler}{table}<p>After the table.</p></div></body></html>"""


def _pages(rows: int) -> list[str]:
    from weasyprint import HTML

    from calcpack.package.convert import package_css

    s = Sheet("boxes", auto_display=False)
    table = s.table(
        ["Load", "w"],
        [[i, 1.5 * i * ureg.kN / ureg.m] for i in range(1, rows + 1)],
        caption="Loads",
    )
    filler = "".join(f"<p>Line {i} of the working before the table.</p>" for i in range(8))
    html = PAGE.format(css=package_css(), filler=filler, table=table.html())
    pdf = HTML(string=html).write_pdf()
    return [" ".join(p.extract_text().split()) for p in PdfReader(io.BytesIO(pdf)).pages]


def test_a_long_table_runs_over_the_page_with_a_continued_mark() -> None:
    pages = _pages(60)
    assert len(pages) >= 2
    # the table starts on the first page, right after the working (no blank before it)
    assert "Line 7 of the working" in pages[0]
    assert "Loads" in pages[0]
    assert "continued on the next page" in pages[0]
    # its head repeats, and the page where it ends has no mark
    assert "Load w" in pages[1]
    end = next(i for i, text in enumerate(pages) if "After the table." in text)
    assert "continued on the next page" not in pages[end]


def test_a_short_table_has_no_mark() -> None:
    pages = _pages(3)
    assert len(pages) == 1
    assert "continued on the next page" not in pages[0]
