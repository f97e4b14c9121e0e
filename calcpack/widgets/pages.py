"""See a sheet as it will print, without leaving JupyterLab.

``preview()`` in a sheet's cell renders the saved notebook as the package build does (executed
in a fresh kernel, converted and laid out with the package's page layout; see
:mod:`calcpack.package.sheetview`, which takes each stage from the build's caches when it can)
and shows the pages at the notebook's width, drawn at 100 dots per inch so that the text is
readable; a button under each page shows it larger. While it works, a line says what it is
doing. During a build it shows nothing (the build's kernels set CALCPACK_BUILDING=1), so a
preview cell left in a sheet never reaches the PDF and never recurses.
"""

from __future__ import annotations

import base64
import html
import os
import time
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import InputError
from calcpack.package.sheetview import (
    Progress,
    SheetPages,
    page_images,
    render_sheet,
    sheet_page_images,
)

__all__ = [
    "PAGE_DPI",
    "ZOOM_DPI",
    "PreviewPanel",
    "SheetPreview",
    "current_notebook",
    "preview",
    "render_preview",
]

PAGE_DPI = 100
"""Resolution of the page images shown at the notebook's width: an A4 page is 827 pixels
wide, about the width of a notebook's output area, so the image is not enlarged."""

ZOOM_DPI = 200
"""Resolution of a page's larger view (drawn when asked for)."""


@dataclass(frozen=True)
class SheetPreview:
    """A rendered sheet: its layout (:class:`SheetPages`) and one PNG per page.

    Displayed outside JupyterLab's widgets as the page images one under the other, each
    captioned with its number.
    """

    sheet: SheetPages
    pages: tuple[bytes, ...]
    resolution: int
    seconds: tuple[tuple[str, float], ...] = ()
    """Wall time of each stage done (not taken from the cache), in order."""

    @property
    def notebook(self) -> Path:
        return self.sheet.notebook

    @property
    def pdf(self) -> bytes:
        return self.sheet.pdf

    @property
    def width_px(self) -> int:
        """Width at which a page is shown: its image at one image pixel per screen pixel."""
        import io

        from pypdf import PdfReader

        points = float(PdfReader(io.BytesIO(self.sheet.pdf)).pages[0].mediabox.width)
        return round(points / 72 * self.resolution)

    def caption(self) -> str:
        n = len(self.pages)
        how = ", ".join(f"{name} {seconds:.1f} s" for name, seconds in self.seconds)
        return (
            f"Preview of {self.notebook.name} as saved, laid out as in the package "
            f"({n} page{'s' if n != 1 else ''}; {how or 'everything from the cache'})"
        )

    def _repr_html_(self) -> str:
        imgs = "".join(
            '<figure style="margin:4px 0;text-align:center">'
            f'<img class="cp-preview-page" alt="page {i}" '
            f'src="data:image/png;base64,{base64.b64encode(png).decode()}" '
            f'style="border:1px solid #bbb;width:100%;max-width:{self.width_px}px">'
            f'<figcaption style="font-size:11px;color:#555">page {i} of {len(self.pages)}'
            "</figcaption></figure>"
            for i, png in enumerate(self.pages, start=1)
        )
        return (
            f'<div class="cp-preview"><div style="font-size:12px;color:#555">'
            f"{self.caption()}</div>{imgs}</div>"
        )

    def save_pdf(self, path: str | Path) -> Path:
        """Write the previewed PDF (a single-sheet layout, not an issued package)."""
        out = Path(path)
        out.write_bytes(self.pdf)
        return out


def current_notebook() -> Path | None:
    """The notebook this kernel serves, as the notebook server names it, or None."""
    name = os.environ.get("JPY_SESSION_NAME")
    try:
        from IPython import get_ipython

        shell = get_ipython()
        if shell is not None:
            name = shell.user_ns.get("__session__") or name
    except ImportError:  # pragma: no cover - IPython ships with ipykernel
        pass
    if not name:
        return None
    p = Path(name)
    for candidate in (p, Path.cwd() / p.name):
        if candidate.suffix == ".ipynb" and candidate.is_file():
            return candidate.resolve()
    return None


def render_preview(
    notebook: str | Path,
    *,
    resolution: int = PAGE_DPI,
    progress: Progress | None = None,
    use_cache: bool = True,
) -> SheetPreview:
    """Render the saved ``notebook`` as the package lays it out, with its page images.

    Args:
        notebook: the sheet notebook (its saved state is what is rendered).
        resolution: page image resolution in dots per inch.
        progress: told each stage as it starts.
        use_cache: take and keep each stage in the cache folder.

    Raises:
        InputError: the notebook does not exist.
        NotebookExecutionError: a cell failed (names the cell).
        BuildError: the layout or the page images could not be made.
    """
    sheet = render_sheet(notebook, use_cache=use_cache, progress=progress)
    start = time.perf_counter()
    drawn: list[str] = []

    def told(what: str) -> None:
        drawn.append(what)
        if progress is not None:
            progress(what)

    images = sheet_page_images(sheet, resolution=resolution, progress=told)
    seconds = sheet.seconds
    if drawn:  # the images were drawn, not taken from the cache
        seconds += (("drawing the pages", time.perf_counter() - start),)
    return SheetPreview(sheet, images, resolution, seconds)


class PreviewPanel:
    """The preview in JupyterLab: a line saying what is being done, then the pages at the
    notebook's width, each with a button that shows it larger (and back)."""

    def __init__(self, notebook: Path | None = None, *, on_request: bool = False) -> None:
        import ipywidgets as w

        self.notebook = notebook
        self.status = w.HTML("Preparing the preview…")
        self.box = w.VBox([self.status])
        self.box.add_class("cp-preview")
        self.shown: SheetPreview | None = None
        self.request: Any = None
        if on_request:
            name = notebook.name if notebook else "this sheet"
            self.status.value = f"Save {name}, then press the button to see it as it will print."
            self.request = w.Button(
                description="Show the pages as they will print", layout=w.Layout(width="auto")
            )
            self.request.add_class("cp-preview-request")
            self.request.on_click(self._requested)
            self.box.children = (self.request, self.status)

    def render(self) -> None:
        """Render the saved notebook and show its pages (a failure is written in the panel
        and raised)."""
        if self.notebook is None:
            raise InputError(name="notebook", value=None, rule="is not known to this panel")
        try:
            self.show(render_preview(self.notebook, progress=self.say))
        except Exception as exc:
            self.status.value = f"Preview failed: {html.escape(str(exc))}"
            raise

    def _requested(self, _: Any) -> None:
        self.request.disabled = True
        try:
            self.render()
        except Exception:  # written in the panel: a button has nowhere else to say it
            return
        finally:
            self.request.disabled = False

    def say(self, what: str) -> None:
        self.status.value = f"Preview: {what}…"

    def show(self, shown: SheetPreview) -> None:
        self.shown = shown
        self.status.value = shown.caption()
        self.box.children = (
            *((self.request,) if self.request is not None else ()),
            self.status,
            *(self._page(n, png) for n, png in enumerate(shown.pages, start=1)),
        )

    def _page(self, n: int, png: bytes) -> Any:
        import ipywidgets as w

        assert self.shown is not None
        shown = self.shown
        width = f"{shown.width_px}px"
        image = w.Image(value=png, format="png", layout=w.Layout(width="100%", max_width=width))
        image.add_class("cp-preview-page")
        label = f"Page {n} of {len(shown.pages)}: larger view"
        button = w.Button(description=label, layout=w.Layout(width="auto"))
        larger: list[bytes] = []

        def toggle(_: Any) -> None:
            if button.description.startswith("Back"):
                image.value, image.layout.max_width, image.layout.width = png, width, "100%"
                button.description = label
                return
            if not larger:
                button.description = f"Drawing page {n} at {ZOOM_DPI} dpi…"
                larger.extend(page_images(shown.pdf, resolution=ZOOM_DPI, pages=(n, n)))
            zoom = round(shown.width_px * ZOOM_DPI / shown.resolution)
            image.value, image.layout.max_width, image.layout.width = larger[0], None, f"{zoom}px"
            button.description = f"Back to page {n} at the notebook's width"

        button.on_click(toggle)
        frame = w.VBox([image, button], layout=w.Layout(overflow="auto", margin="6px 0"))
        return frame

    def _ipython_display_(self) -> None:
        from IPython.display import display

        display(self.box)


class _Shown:
    """What ``preview()`` returns once its panel is on screen: displays nothing more."""

    def __init__(self, panel: PreviewPanel) -> None:
        self.panel = panel

    @property
    def preview(self) -> SheetPreview | None:
        return self.panel.shown

    def save_pdf(self, path: str | Path) -> Path:
        """Write the previewed PDF (a single-sheet layout, not an issued package)."""
        if self.panel.shown is None:
            raise InputError(
                name="preview", value=None, expected="a finished preview", rule="has no pages yet"
            )
        return self.panel.shown.save_pdf(path)

    def _ipython_display_(self) -> None:
        return None

    def __repr__(self) -> str:
        return "preview shown above" if self.panel.shown else "preview not finished"


class _Nothing:
    """Displayed by ``preview()`` during a build: no output at all."""

    def _ipython_display_(self) -> None:
        return None

    def __repr__(self) -> str:
        return "preview skipped (not an interactive session)"


def preview(notebook: str | Path | None = None, *, on_request: bool = False) -> Any:
    """Show this sheet's pages as the package will print them (from the saved notebook).

    Save the notebook first: the saved file is what is executed, as in a build. Stages an
    earlier preview or build did for the same saved sheet are taken from the cache.

    Args:
        notebook: the sheet; default the notebook this kernel serves.
        on_request: show a button that renders the pages when pressed (and again each time),
            instead of rendering at once: for the last cell of a sheet, so that running every
            cell does not execute the sheet a second time.

    Returns:
        An object holding the preview (``.preview``, ``.save_pdf(path)``) whose panel is
        already shown; during a build, an object that displays nothing.

    Raises:
        InputError: the notebook could not be found.
        NotebookExecutionError: a cell of the saved notebook failed (with ``on_request``, the
            failure is written in the panel instead).
    """
    from IPython.display import display

    from calcpack.widgets.fields import interactive_session

    if not interactive_session():
        return _Nothing()
    path = Path(notebook) if notebook is not None else current_notebook()
    if path is None:
        raise InputError(
            name="notebook",
            value=None,
            rule="could not be told from this kernel",
            note='give the sheet\'s path to the preview, e.g. preview("02_beam.ipynb")',
        )
    panel = PreviewPanel(path, on_request=on_request)
    display(panel.box)
    if not on_request:
        panel.render()
    return _Shown(panel)
