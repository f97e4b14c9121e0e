"""The pagination rules, measured on a laid-out PDF (for the build tests).

A page's body is the area between the running title block and the footer (the package's page
margins: 41 mm at the top, 17 mm at the bottom). On it we read the text lines (pypdf's text
visitor: position, font, size) and the ink (``pdfgeometry.painted_boxes``: paths and drawn
XObjects, so math and figures count). Two rules are measured:

- no heading is the last thing on a page: a line set in bold at 9.4 pt or more (the sizes of
  the sheet's headings; descriptions and table heads are smaller) with nothing but its own rule
  below it;
- no blank more than a third of the body at the foot of a page, except on the last page of a
  section (a new sheet starts on a new page).

:func:`package_problems` adds the names in the title block wrapped at word boundaries and the
tag tree's outline (no skipped heading level, every link a Link element); every example
package's build test asks it.
"""

from __future__ import annotations

import io
import itertools
import re
import tomllib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from pdfgeometry import painted_boxes
from pypdf import PdfReader

MM = 72 / 25.4
TOP_MARGIN = 41 * MM
BOTTOM_MARGIN = 17 * MM
HEADING_SIZE = 9.4
"""Bold text this size (pt) or larger is a heading."""


@dataclass(frozen=True)
class Line:
    """A line of text: baseline height (pt from the page foot), size (pt), whether bold."""

    y: float
    size: float
    bold: bool
    text: str


@dataclass(frozen=True)
class PageBody:
    """What the body of one page holds."""

    number: int
    """1-based page number."""
    top: float
    bottom: float
    lines: tuple[Line, ...]
    lowest_ink: float
    """Lowest point of any ink or text in the body (pt from the page foot)."""

    @property
    def blank_at_foot(self) -> float:
        """Height (pt) left empty between the last content and the foot of the body."""
        return max(0.0, self.lowest_ink - self.bottom)

    @property
    def height(self) -> float:
        return self.top - self.bottom

    def heading_last(self) -> Line | None:
        """The heading that ends the page, if one does."""
        if not self.lines:
            return None
        last_y = min(line.y for line in self.lines)
        last = [line for line in self.lines if abs(line.y - last_y) < 1.5]
        if not all(line.bold and line.size >= HEADING_SIZE for line in last):
            return None
        # Ink well below the heading's own rule (a figure, a formula) means it is not last.
        if self.lowest_ink < last_y - 0.45 * last[0].size - 4:
            return None
        return last[0]


def page_body(reader: PdfReader, number: int) -> PageBody:
    """Read the body of page ``number`` (1-based)."""
    page = reader.pages[number - 1]
    height = float(page.mediabox.height)
    top, bottom = height - TOP_MARGIN, BOTTOM_MARGIN
    runs: list[Line] = []

    def visit(text: str, cm: Any, tm: Any, font: Any, size: float) -> None:
        if not text.strip():
            return
        _, b, _, d, _, f = (float(v) for v in cm)
        y = float(tm[4]) * b + float(tm[5]) * d + f
        scale = abs(float(tm[3]) * d) or 1.0
        name = str((font or {}).get("/BaseFont", ""))
        if bottom <= y <= top:
            runs.append(Line(y, float(size) * scale, "Bold" in name, text.strip()))

    page.extract_text(visitor_text=visit)
    lowest = min((line.y - 0.25 * line.size for line in runs), default=top)
    for box in painted_boxes(reader, number - 1):
        if box.y0 >= bottom - 0.5 and box.y1 <= top + 0.5:
            lowest = min(lowest, box.y0)
    return PageBody(number, top, bottom, tuple(runs), lowest)


def violations(reader: PdfReader, section_pages: dict[str, list[int]]) -> list[str]:
    """Every breach of the two rules in a package, as readable lines (empty: none)."""
    last_pages = {pages[1] for pages in section_pages.values()}
    found = []
    for number in range(1, len(reader.pages) + 1):
        if number == 1:
            continue  # the cover
        body = page_body(reader, number)
        heading = body.heading_last()
        if heading is not None:
            found.append(f"page {number}: heading {heading.text!r} last on the page")
        if number not in last_pages and body.blank_at_foot > body.height / 3:
            share = body.blank_at_foot / body.height
            found.append(f"page {number}: {share:.0%} of the body blank at its foot")
    return found


def names_split(reader: PdfReader, names: list[str], first: int = 2) -> list[str]:
    """Names in the running title block wrap at word boundaries (spaces, hyphens): every word
    of each name is found whole in the text of every page from ``first`` on (1-based)."""
    words = {w for name in names for w in re.split(r"[\s-]+", name) if len(w) > 1}
    found = []
    for number in range(first, len(reader.pages) + 1):
        text = reader.pages[number - 1].extract_text() or ""
        text = re.sub(r"-\s*\n\s*", "-", text)  # a wrap after a hyphen keeps both halves
        whole = set(re.findall(r"[^\s-]+", text))
        found += [f"page {number}: name word {w!r} split" for w in sorted(words - whole)]
    return found


def outline_problems(pdf: bytes) -> list[str]:
    """The tag tree's headings skip no level, and every link is held by a Link element."""
    from calcpack.package.pdfjoin import structure_summary

    summary = structure_summary(pdf)
    levels = summary["headings"]
    found = [
        f"heading {i + 1}: H{b} after H{a}"
        for i, (a, b) in enumerate(itertools.pairwise(levels), start=1)
        if b > a + 1
    ]
    if not levels or levels[0] != 1:
        found.append(f"the first heading is not an H1 ({levels[:1]})")
    if summary["untagged_links"]:
        found.append(f"{summary['untagged_links']} link(s) with no Link structure element")
    return found


def package_problems(pdf: Path, manifest: dict[str, Any], names: list[str]) -> list[str]:
    """Every pagination and outline rule on a built package: no heading last on a page, no
    blank over a third of a page but before a new section, names wrapped at word boundaries,
    headings nested without a skipped level and every link tagged."""
    data = pdf.read_bytes()
    reader = PdfReader(io.BytesIO(data))
    return (
        violations(reader, manifest["sections"])
        + names_split(reader, names)
        + outline_problems(data)
    )


def titleblock_names(project: Path) -> list[str]:
    """The names the running title block prints on every page: the project's preparer (BY)
    and checker (CHECKED), from its calcpack.toml."""
    data = tomllib.loads((project / "calcpack.toml").read_text("utf-8"))
    return [data["people"][role]["name"] for role in ("preparer", "checker")]
