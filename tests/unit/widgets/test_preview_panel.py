"""The preview panel: the pages at the notebook's width drawn at 100 dpi, a larger view of a
page on its button and back, the stages said as they run, and nothing at all in a build."""

from __future__ import annotations

import shutil
import struct
from pathlib import Path

import pytest

from calcpack.errors import InputError
from calcpack.package.sheetview import SheetPages, page_images
from calcpack.widgets import pages as pages_module
from calcpack.widgets.pages import PAGE_DPI, ZOOM_DPI, PreviewPanel, SheetPreview, preview

pytestmark = pytest.mark.skipif(
    shutil.which("pdftoppm") is None, reason="needs poppler's pdftoppm (poppler-utils)"
)


def _shown(tmp_path: Path, paper: str = "A4") -> SheetPreview:
    from weasyprint import HTML

    html = f"<style>@page {{ size: {paper} }}</style><p style='break-after: page'>One</p><p>Two</p>"
    pdf: bytes = HTML(string=html).write_pdf()
    sheet = SheetPages(
        tmp_path / "beam.ipynb", "beam.ipynb", pdf, 2, "cached", "laid out", (), None
    )
    return SheetPreview(sheet, page_images(pdf, resolution=PAGE_DPI), PAGE_DPI)


def _width(png: bytes) -> int:
    return int(struct.unpack(">I", png[16:20])[0])


@pytest.mark.parametrize(("paper", "width"), [("A4", 827), ("letter", 850)])
def test_pages_are_shown_at_one_image_pixel_per_screen_pixel(
    tmp_path: Path, paper: str, width: int
) -> None:
    """A4 is 210 mm wide and US letter 8.5 in: 827 and 850 dots at 100 dpi (ISO 216; ANSI)."""
    shown = _shown(tmp_path, paper)
    assert shown.width_px == width
    assert _width(shown.pages[0]) == width
    html = shown._repr_html_()
    assert html.count('class="cp-preview-page"') == 2
    assert f"max-width:{width}px" in html


def test_a_page_is_shown_larger_on_its_button_and_back(tmp_path: Path) -> None:
    shown = _shown(tmp_path)
    panel = PreviewPanel()
    panel.say("laying out")
    assert "laying out" in panel.status.value
    panel.show(shown)
    assert "beam.ipynb" in panel.status.value
    assert "2 pages" in panel.status.value
    frames = panel.box.children[1:]
    assert len(frames) == 2
    image, button = frames[1].children
    assert "cp-preview-page" in image._dom_classes
    assert image.layout.width == "100%"
    assert image.layout.max_width == "827px"
    small = image.value

    button.click()
    assert _width(image.value) == round(827 * ZOOM_DPI / PAGE_DPI)  # page 2 drawn larger
    assert image.layout.width == f"{round(827 * ZOOM_DPI / PAGE_DPI)}px"
    assert button.description.startswith("Back")

    button.click()
    assert image.value == small
    assert image.layout.width == "100%"
    assert button.description == "Page 2 of 2: larger view"


def test_in_a_build_the_preview_shows_nothing(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    monkeypatch.setenv("JPY_SESSION_NAME", "/nowhere/beam.ipynb")
    called: list[object] = []
    monkeypatch.setattr(pages_module, "render_preview", lambda *a, **k: called.append(a))
    result = preview()
    assert result._ipython_display_() is None
    assert "skipped" in repr(result)
    assert called == []


def test_without_a_notebook_to_show_the_preview_says_what_to_give(
    monkeypatch: pytest.MonkeyPatch,
) -> None:
    monkeypatch.delenv("CALCPACK_BUILDING", raising=False)
    monkeypatch.setenv("CALCPACK_PANELS", "1")
    monkeypatch.delenv("JPY_SESSION_NAME", raising=False)
    with pytest.raises(InputError, match=r'preview\("02_beam\.ipynb"\)') as caught:
        preview()
    assert caught.value.name == "notebook"


def test_on_request_the_pages_are_rendered_when_the_button_is_pressed(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    from calcpack.errors import BuildError

    shown = _shown(tmp_path)
    asked: list[Path] = []

    def render(notebook: Path, *, progress: object) -> SheetPreview:
        asked.append(notebook)
        return shown

    monkeypatch.setattr(pages_module, "render_preview", render)
    panel = PreviewPanel(tmp_path / "beam.ipynb", on_request=True)
    assert asked == []  # nothing is executed until asked
    assert "Save beam.ipynb" in panel.status.value
    panel.request.click()
    assert asked == [tmp_path / "beam.ipynb"]
    assert len(panel.box.children) == 2 + 2  # the button, the caption, two pages
    assert not panel.request.disabled

    def fail(notebook: Path, *, progress: object) -> SheetPreview:
        raise BuildError("A formula <x> could not be typeset")

    monkeypatch.setattr(pages_module, "render_preview", fail)
    panel.request.click()  # the failure is written in the panel, not lost in a log
    assert panel.status.value == "Preview failed: A formula &lt;x&gt; could not be typeset"
