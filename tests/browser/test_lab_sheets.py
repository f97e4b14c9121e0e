"""Sheets in a real JupyterLab: run all cells in headless Chromium and look at what rendered."""

from __future__ import annotations

from pathlib import Path
from typing import Any

import pytest
from lab_harness import (
    LabServer,
    cell_errors,
    copy_into,
    open_notebook,
    panel_edit_timing,
    run_all_cells,
    save_screenshot,
    wait_idle,
    watch_panel,
)

pytestmark = pytest.mark.browser

REPO = Path(__file__).resolve().parents[2]
LINTEL = REPO / "example_projects" / "working_examples" / "lintel_check.ipynb"


def test_lintel_sheet_renders_math(lab: LabServer, page: Any) -> None:
    copy_into(lab.root, LINTEL)
    open_notebook(page, lab, LINTEL.name)
    run_all_cells(page)
    assert cell_errors(page) == []
    # JupyterLab typesets the \[..\] and \(..\) TeX of each step with MathJax: a typeset
    # formula is an mjx-container element inside the step's cp-math span.
    page.wait_for_selector(".cp-math mjx-container", timeout=60_000)
    typeset = page.locator(".cp-step .cp-math mjx-container").count()
    raw_tex = page.locator(".cp-math:not(:has(mjx-container))").count()
    assert typeset >= 10
    assert raw_tex == 0
    verdicts = page.locator(".cp-verdict").all_inner_texts()
    # verdicts are words in the output margin: "0.462 ≤ 1.00, satisfies §..." (or "satisfied"
    # where the limit has no clause to cite)
    assert any("≤ 1.00, satisf" in v for v in verdicts), verdicts
    save_screenshot(page, "lintel_check.png")


GARDEN = REPO / "example_projects" / "beam_examples"
BEAM_SHEET = GARDEN / "ridge_beam_panel.ipynb"
BEAM_INPUTS = GARDEN / "ridge_beam_panel.inputs.toml"


def _out(page: Any, name: str) -> float:
    return float(
        page.locator(f".cp-beam-panel [data-out='{name}']").first.get_attribute("data-value")
    )


def _wait_saved(page: Any, panel: str) -> None:
    """Wait for the panel's "Saved to" status: a panel sends its display first and writes the
    inputs file right after, so a new display may arrive a moment before the file holds it."""
    page.wait_for_function(
        "([sel]) => /Saved to/.test(document.querySelector(sel)?.textContent || '')",
        arg=[f"{panel} .cp-panel-status"],
        timeout=30_000,
    )


def test_beam_panel_edits_inputs_and_updates_display(lab: LabServer, page: Any) -> None:
    from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs

    copy_into(lab.root, BEAM_SHEET, BEAM_INPUTS)
    inputs_file = lab.root / BEAM_INPUTS.name
    open_notebook(page, lab, BEAM_SHEET.name)
    run_all_cells(page)
    assert cell_errors(page) == []
    # Math typeset by JupyterLab's MathJax in the working.
    page.wait_for_selector(".cp-math mjx-container", timeout=60_000)
    assert page.locator(".cp-step .cp-math mjx-container").count() >= 20
    # The panel rendered (ipywidgets front end) with its live diagrams ...
    panel = page.locator(".cp-beam-panel")
    panel.wait_for(timeout=60_000)
    # (one output per drawing, so an edit re-sends only the drawings it changed)
    drawings = panel.locator(".cp-panel-diagrams svg.cp-diagram")
    assert drawings.count() == 4
    assert drawings.first.get_attribute("data-diagram") == "loading"
    # ... and the sheet's own diagram output (an SVG image) appeared below the working.
    figures = page.locator(".jp-OutputArea-output[data-mime-type='image/svg+xml'] img")
    assert figures.count() == 1
    assert figures.first.evaluate("img => img.naturalWidth") > 0

    before_u = _out(page, "bending_utilisation")
    before_text = inputs_file.read_text(encoding="utf-8")
    expected_before = evaluate_beam(beam_inputs(load_inputs(inputs_file)))
    assert before_u == pytest.approx(expected_before.bending_utilisation, rel=1e-12)

    box = panel.locator(".cp-key-beam-spans-2 input")
    watch_panel(page, ".cp-beam-panel", (".cp-panel-diagrams", ".cp-panel-results-box"))
    box.fill("5.5")
    box.press("Enter")
    timing = panel_edit_timing(page)
    page.wait_for_function(
        """([sel, old]) => {
            const e = document.querySelector(sel);
            return e && parseFloat(e.getAttribute('data-value')) !== old;
        }""",
        arg=[".cp-beam-panel [data-out='bending_utilisation']", before_u],
        timeout=30_000,
    )
    after_u = _out(page, "bending_utilisation")
    _wait_saved(page, ".cp-beam-panel")
    after_text = inputs_file.read_text(encoding="utf-8")
    assert after_text != before_text
    assert 'spans = ["3.2 m", "5.5 m", "3.2 m"]' in after_text
    assert "# Ridge beam RB1 — inputs." in after_text  # the file's comments are kept
    # The panel shows what the sheet's calc cells compute from the file it wrote.
    expected = evaluate_beam(beam_inputs(load_inputs(inputs_file)))
    assert after_u == pytest.approx(expected.bending_utilisation, rel=1e-12)
    assert after_u > before_u  # a longer middle span carries more moment
    assert _out(page, "M_design") == pytest.approx(
        expected.M_design.to("kN*m").magnitude, rel=1e-12
    )
    panel.scroll_into_view_if_needed()
    shot = save_screenshot(page, "beam_panel.png")
    # Informational, not a timed test (tests/benchmarks/bench_widgets.py measures it): Enter to
    # the last change of the drawings and results, stamped in the page, for one cold edit.
    shot.with_name("beam_panel_latency.txt").write_text(
        f"Enter pressed -> panel display updated: "
        f"{timing['last_change'] - timing['key']:.0f} ms (first edit, in-page stamps)\n",
        encoding="utf-8",
    )


def test_section_panel_edits_inputs(lab: LabServer, page: Any, tmp_path: Path) -> None:
    from calcpack.package.scaffold import new_project
    from calcpack.package.sheet_templates import add_sheet

    job = lab.root / "section_job"
    new_project(job, number="2450", title="Section panel job")
    added = add_sheet(job, "section", title="Purlin section")
    inputs_file = job / added.inputs if added.inputs else job
    open_notebook(page, lab, f"section_job/{added.notebook.as_posix()}")
    run_all_cells(page)
    assert cell_errors(page) == []
    # The section's own working (parts table, parallel-axis steps) typeset by MathJax.
    page.wait_for_selector(".cp-math mjx-container", timeout=60_000)
    assert page.locator(".cp-math:not(:has(mjx-container))").count() == 0
    panel = page.locator(".cp-section-panel")
    panel.wait_for(timeout=60_000)
    assert panel.locator("svg[data-diagram='section']").count() == 1
    figures = page.locator(".jp-OutputArea-output[data-mime-type='image/svg+xml'] img")
    assert figures.count() == 1  # the sheet's own sketch
    before = float(panel.locator("[data-out='Ix']").get_attribute("data-value"))
    box = panel.locator(".cp-key-section-d input")
    box.fill("360")
    box.press("Enter")
    page.wait_for_function(
        """([sel, old]) => {
            const e = document.querySelector(sel);
            return e && parseFloat(e.getAttribute('data-value')) !== old;
        }""",
        arg=[".cp-section-panel [data-out='Ix']", before],
        timeout=30_000,
    )
    after = float(panel.locator("[data-out='Ix']").get_attribute("data-value"))
    assert after > before
    assert 'd = "360 mm"' in inputs_file.read_text(encoding="utf-8")
    from calcpack.inputs import load_inputs, section_from_inputs

    expected = section_from_inputs(load_inputs(inputs_file)["section"]).properties()
    assert after == pytest.approx(expected.Ix.to("mm**4").magnitude, rel=1e-12)
    panel.scroll_into_view_if_needed()
    save_screenshot(page, "section_panel.png")


def test_preview_shows_pages_inline(lab: LabServer, page: Any) -> None:
    """One call in a cell renders the saved sheet as the package lays it out."""
    import nbformat

    nb = nbformat.read(LINTEL, as_version=4)
    nb.cells.append(nbformat.v4.new_code_cell("from calcpack.widgets import preview\n\npreview()"))
    nbformat.write(nb, lab.root / "lintel_preview.ipynb")
    open_notebook(page, lab, "lintel_preview.ipynb")
    run_all_cells(page)
    assert cell_errors(page) == []
    pages = page.locator(".cp-preview img.cp-preview-page")
    pages.first.wait_for(timeout=120_000)
    assert pages.count() >= 1
    assert pages.first.evaluate("img => img.naturalWidth") > 100
    pages.first.scroll_into_view_if_needed()
    save_screenshot(page, "preview.png")


_OVERFLOW = """
() => {
  const out = [];
  for (const svg of document.querySelectorAll('.cp-beam-panel .cp-panel-diagrams svg.cp-diagram')) {
    const area = svg.closest('.jp-OutputArea-output') || svg.closest('.jp-Notebook');
    const s = svg.getBoundingClientRect(), a = area.getBoundingClientRect();
    out.push({right: s.right - a.right, width: s.width});
  }
  return out;
}
"""


def test_beam_panel_errors_at_the_field_fits_two_widths_and_reruns_the_working(
    lab: LabServer, page: Any
) -> None:
    copy_into(lab.root, BEAM_SHEET, BEAM_INPUTS)
    inputs_file = lab.root / BEAM_INPUTS.name
    page.set_viewport_size({"width": 1400, "height": 1000})
    open_notebook(page, lab, BEAM_SHEET.name)
    run_all_cells(page)
    assert cell_errors(page) == []
    panel = page.locator(".cp-beam-panel")
    panel.wait_for(timeout=60_000)
    working_L2 = page.locator(".cp-step[data-name='L_2']").first
    assert "3.8" in working_L2.inner_text()

    # 1. A bad entry is marked at its own field, with the input and value named; not written.
    before = inputs_file.read_text(encoding="utf-8")
    box = panel.locator(".cp-key-beam-spans-2 input")
    box.fill("-2")
    box.press("Enter")
    message = panel.locator(".cp-field-message .cp-error").first
    message.wait_for(timeout=30_000)
    assert "beam.spans[2]" in message.inner_text()
    assert "-2" in message.inner_text()
    assert panel.locator(".cp-key-beam-spans-2.cp-invalid").count() == 1
    assert inputs_file.read_text(encoding="utf-8") == before

    # 2. The drawings fit the notebook area, wide and narrow (no clipping on the right).
    for width in (1400, 760):
        page.set_viewport_size({"width": width, "height": 1000})
        page.wait_for_timeout(800)
        boxes = page.evaluate(_OVERFLOW)
        assert len(boxes) == 4
        assert all(b["right"] <= 1.0 for b in boxes), (width, boxes)
        assert all(b["width"] > 150 for b in boxes), (width, boxes)
        save_screenshot(page, f"beam_panel_{width}px.png")
    page.set_viewport_size({"width": 1400, "height": 1000})

    # 3. A valid entry clears the mark; the notice names what is stale; one click re-runs the
    #    cells below and the working shows the new value.
    box.fill("5.5")
    box.press("Enter")
    stale = panel.locator(".cp-stale")
    page.wait_for_function(
        "() => /beam\\.spans\\[2\\] = 5\\.5 m/.test("
        "document.querySelector('.cp-beam-panel .cp-stale')?.textContent || '')",
        timeout=30_000,
    )
    assert panel.locator(".cp-key-beam-spans-2.cp-invalid").count() == 0
    assert "stale" in stale.inner_text()
    assert "3.8" in working_L2.inner_text()  # not re-run yet
    page.locator(".cp-beam-panel .cp-rerun").click()
    page.wait_for_function(
        "() => /5\\.5/.test(document.querySelector(\".cp-step[data-name='L_2']\")?.textContent"
        " || '')",
        timeout=90_000,
    )
    wait_idle(page)
    assert cell_errors(page) == []
    assert 'spans = ["3.2 m", "5.5 m", "3.2 m"]' in inputs_file.read_text(encoding="utf-8")


def test_member_panel_checks_live_and_the_search_picks_a_shape(lab: LabServer, page: Any) -> None:
    """A catalogue panel in JupyterLab: an edit moves the governing utilisation as the sheet
    computes it, and the search's chosen shape goes into the inputs file."""
    from calcpack.inputs import load_inputs
    from calcpack.inputs.member import evaluate_member, member_inputs

    templates = REPO / "templates" / "sheets"
    text = (templates / "steel_column.ipynb").read_text(encoding="utf-8")
    text = text.replace("__TITLE__", "Post P1").replace("__INPUTS__", "post.inputs.toml")
    (lab.root / "post.ipynb").write_text(text, encoding="utf-8")
    inputs_file = lab.root / "post.inputs.toml"
    inputs_file.write_text(
        (templates / "steel_column.inputs.toml").read_text(encoding="utf-8"), encoding="utf-8"
    )
    page.set_viewport_size({"width": 1400, "height": 1000})
    open_notebook(page, lab, "post.ipynb")
    run_all_cells(page)
    assert cell_errors(page) == []
    panel = page.locator(".cp-member-panel")
    panel.wait_for(timeout=60_000)
    governing = panel.locator(".cp-governing")
    before = float(governing.get_attribute("data-value"))
    box = panel.locator(".cp-key-forces-1-P input")
    box.fill("40")
    box.press("Enter")
    page.wait_for_function(
        """([old]) => {
            const e = document.querySelector('.cp-member-panel .cp-governing');
            return e && parseFloat(e.getAttribute('data-value')) !== old;
        }""",
        arg=[before],
        timeout=30_000,
    )
    _wait_saved(page, ".cp-member-panel")
    expected = evaluate_member(member_inputs(load_inputs(inputs_file))).governing[0]
    assert float(governing.get_attribute("data-value")) == pytest.approx(expected, rel=1e-12)
    assert panel.locator(".cp-bars .cp-bar").count() >= 3
    # the search ranks the family; "Use this shape" writes the choice
    panel.locator(".cp-search").click()
    panel.locator(".cp-search-results .cp-candidate").first.wait_for(timeout=120_000)
    first = panel.locator(".cp-search-results .cp-candidate").first.get_attribute("data-name")
    panel.locator(".cp-search-use").click()
    page.wait_for_function(
        "([name]) => document.querySelector('.cp-member-panel .cp-key-member-shape input')"
        "?.value === name",
        arg=[first],
        timeout=30_000,
    )
    page.wait_for_timeout(500)
    assert load_inputs(inputs_file)["member"]["shape"] == first
    panel.scroll_into_view_if_needed()
    save_screenshot(page, "member_panel.png")


def test_timber_post_panel_search_picks_a_size_into_the_file(lab: LabServer, page: Any) -> None:
    """The timber post panel in JupyterLab: "Lightest that passes" ranks the sizes with their
    governing check, "Use this size" writes the lightest into the inputs file, and the panel
    then shows what the sheet's cells compute from the file."""
    from calcpack.inputs import load_inputs
    from calcpack.inputs.timber_post import evaluate_timber_post, timber_post_inputs

    templates = REPO / "templates" / "sheets"
    text = (templates / "timber_post.ipynb").read_text(encoding="utf-8")
    text = text.replace("__TITLE__", "Post P1").replace("__INPUTS__", "post.inputs.toml")
    (lab.root / "post.ipynb").write_text(text, encoding="utf-8")
    inputs_file = lab.root / "post.inputs.toml"
    inputs = (templates / "timber_post.inputs.toml").read_text(encoding="utf-8")
    inputs_file.write_text(inputs.replace('P = "4.5 kip"', 'P = "9 kip"'), encoding="utf-8")
    page.set_viewport_size({"width": 1400, "height": 1000})
    open_notebook(page, lab, "post.ipynb")
    run_all_cells(page)
    assert cell_errors(page) == []
    panel = page.locator(".cp-timber-post-panel")
    panel.wait_for(timeout=60_000)
    assert float(panel.locator(".cp-governing").get_attribute("data-value")) > 1.0  # 4x4 fails
    panel.locator(".cp-search").click()
    panel.locator(".cp-search-results .cp-candidate").first.wait_for(timeout=120_000)
    first = panel.locator(".cp-search-results .cp-candidate").first.get_attribute("data-name")
    assert first != "4x4"
    assert panel.locator(".cp-search-results .cp-next-lighter").count() == 1
    panel.locator(".cp-search-use").click()
    page.wait_for_function(
        "([name]) => document.querySelector('.cp-timber-post-panel .cp-key-post-size input')"
        "?.value === name",
        arg=[first],
        timeout=30_000,
    )
    _wait_saved(page, ".cp-timber-post-panel")
    saved = load_inputs(inputs_file)
    assert saved["post"]["size"] == first
    expected = evaluate_timber_post(timber_post_inputs(saved)).governing[0]
    shown = float(panel.locator(".cp-governing").get_attribute("data-value"))
    assert shown == pytest.approx(expected, rel=1e-12)
    assert shown <= 1.0
    panel.scroll_into_view_if_needed()
    save_screenshot(page, "timber_post_panel.png")
