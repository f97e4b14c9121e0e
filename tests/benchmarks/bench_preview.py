"""Benchmark: ``preview()`` of one sheet, against a bare WeasyPrint render of the same sheet.

Run: ``PYTHONPATH=. python tests/benchmarks/bench_preview.py [--sheet PATH] [--rounds R]``.
Target: a warm preview (the saved sheet unchanged since its last preview or build, so its
execution, formulas, layout and page images are in the cache) well under a bare render of the
sheet's HTML -- under 3 s on the example deck's joist sheet (nine pages).

The sheet (default: the joist sheet of ``example_projects/deck_larkspur_court``) is copied with
its project into a temporary folder. What is timed, each as the median of the rounds:

* reference, measured in the same run: the sheet's HTML (as the preview lays it out) rendered
  and written to PDF by WeasyPrint with nothing else -- ``HTML(string=...).write_pdf()``;
* warm: :func:`calcpack.widgets.pages.render_preview` with nothing changed;
* edited: the same after one value of the sheet's inputs file changed (the sheet executed
  again, its new formulas typeset, laid out once at its last page count, pages drawn);
* uncached: ``render_preview(..., use_cache=False)`` (executed, every formula typeset, laid out
  from a guess of one page, as the preview did before it used the caches).

Printed: each time and its ratio to the reference. The exit status is 1 if a warm preview
executed the sheet or laid it out again, or if the pages drawn are not 100 dpi.
"""

from __future__ import annotations

import argparse
import re
import shutil
import statistics
import sys
import tempfile
import time
from pathlib import Path

from calcpack.package.sheetview import render_sheet, sheet_html
from calcpack.widgets.pages import PAGE_DPI, SheetPreview, render_preview

ROOT = Path(__file__).resolve().parents[2]
DEFAULT_SHEET = ROOT / "example_projects" / "deck_larkspur_court" / "sheets" / "01_joists.ipynb"
VALUE_RE = re.compile(r'^(\w+ = ")(\d+(?:\.\d+)?)( [^"]+")', re.MULTILINE)


def _reference(html: str) -> float:
    from weasyprint import HTML

    start = time.perf_counter()
    HTML(string=html).write_pdf()
    return time.perf_counter() - start


def _timed(notebook: Path, *, use_cache: bool = True) -> tuple[float, SheetPreview]:
    start = time.perf_counter()
    shown = render_preview(notebook, use_cache=use_cache)
    return time.perf_counter() - start, shown


def _edit_inputs(project: Path, round_no: int) -> bool:
    """Change the first numeric value of the project's first inputs file; False if none."""
    for file in sorted(project.rglob("*.toml")):
        if file.name == "calcpack.toml":
            continue
        text = file.read_text()
        m = VALUE_RE.search(text)
        if m:
            value = float(m.group(2)) * (1 + 0.01 * (round_no + 1))
            file.write_text(text[: m.start(2)] + f"{value:.4g}" + text[m.end(2) :])
            return True
    return False


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--sheet", type=Path, default=DEFAULT_SHEET)
    parser.add_argument("--rounds", type=int, default=3)
    args = parser.parse_args()
    sheet = args.sheet.resolve()
    from calcpack.package.project import find_project_above

    project_file = find_project_above(sheet)
    source = project_file.parent if project_file else sheet.parent
    failures: list[str] = []
    with tempfile.TemporaryDirectory(prefix="bench-preview-") as tmp:
        copy = Path(tmp) / source.name
        shutil.copytree(source, copy, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
        notebook = copy / sheet.relative_to(source)
        print(f"sheet: {sheet.relative_to(ROOT) if sheet.is_relative_to(ROOT) else sheet}")
        first, shown = _timed(notebook)
        print(f"first preview (cold caches): {first:.2f} s, {len(shown.pages)} pages")
        if shown.resolution != PAGE_DPI:
            failures.append(f"pages drawn at {shown.resolution} dpi, not {PAGE_DPI}")
        html = sheet_html(notebook)
        times: dict[str, list[float]] = {"reference": [], "warm": [], "edited": [], "uncached": []}
        for n in range(args.rounds):
            times["reference"].append(_reference(html))
            seconds, warm = _timed(notebook)
            times["warm"].append(seconds)
            if any(name != "converting" for name, _ in warm.seconds):
                failures.append(f"a warm preview did more than convert: {warm.seconds}")
            if _edit_inputs(copy, n):
                times["edited"].append(_timed(notebook)[0])
            times["uncached"].append(_timed(notebook, use_cache=False)[0])
        reference = statistics.median(times["reference"])
        print(f"reference, bare WeasyPrint render of the sheet's HTML: {reference:.2f} s")
        for name in ("warm", "edited", "uncached"):
            if times[name]:
                t = statistics.median(times[name])
                print(f"{name:>9}: {t:6.2f} s  = {t / reference:5.2f} x reference")
        check = render_sheet(notebook)
        print(f"pages: {check.page_count}, stages of the last preview: {check.seconds or 'cached'}")
    for failure in failures:
        print("FAILED:", failure)
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
