"""Preview a sheet as the issued package lays it out, without leaving JupyterLab.

``preview()`` in a sheet's cell executes the saved notebook in a fresh kernel, exactly as the
build does, lays it out with the package's page layout and shows the pages as images inline.
During a build it shows nothing (the build's kernels set CALCPACK_BUILDING=1), so a preview
cell left in a sheet never reaches the PDF and never recurses.

Page images come from poppler's ``pdftoppm`` (Debian package poppler-utils).
"""

from __future__ import annotations

import base64
import os
import shutil
import subprocess
import tempfile
from collections.abc import Iterator
from contextlib import contextmanager
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import BuildError, InputError

__all__ = ["SheetPreview", "current_notebook", "preview", "render_preview"]


@dataclass(frozen=True)
class SheetPreview:
    """A rendered sheet: the PDF bytes and one PNG per page.

    Displayed in a notebook as the page images side by side, each captioned with its number.
    """

    notebook: Path
    pdf: bytes
    pages: tuple[bytes, ...]

    def _repr_html_(self) -> str:
        imgs = "".join(
            '<figure style="margin:4px;display:inline-block;text-align:center">'
            f'<img class="cp-preview-page" alt="page {i}" '
            f'src="data:image/png;base64,{base64.b64encode(png).decode()}" '
            'style="border:1px solid #bbb;box-shadow:1px 1px 4px #ccc;max-width:360px">'
            f'<figcaption style="font-size:11px;color:#555">page {i} of {len(self.pages)}'
            "</figcaption></figure>"
            for i, png in enumerate(self.pages, start=1)
        )
        return (
            f'<div class="cp-preview"><div style="font-size:12px;color:#555">Preview of '
            f"{self.notebook.name} as saved, laid out as in the package ({len(self.pages)} "
            f"page{'s' if len(self.pages) != 1 else ''})</div>{imgs}</div>"
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


@contextmanager
def _building() -> Iterator[None]:
    old = os.environ.get("CALCPACK_BUILDING")
    os.environ["CALCPACK_BUILDING"] = "1"
    try:
        yield
    finally:
        if old is None:
            os.environ.pop("CALCPACK_BUILDING", None)
        else:
            os.environ["CALCPACK_BUILDING"] = old


def _job_metadata(notebook: Path) -> dict[str, Any]:
    """The job fields of the project the notebook belongs to (for the title block), if any."""
    from calcpack.errors import CalcpackError
    from calcpack.package.project import load_project

    for folder in notebook.resolve().parents:
        if (folder / "calcpack.toml").is_file():
            try:
                project = load_project(folder)
            except CalcpackError:
                return {}
            meta: dict[str, Any] = {
                "job_number": project.job_number,
                "job_title": project.job_title,
                "client": project.client,
                "site": project.site,
                "units": project.units,
                "paper": project.paper,
                "firm": project.firm,
                "preparer": project.preparer.name,
                "checker": project.checker.name,
                "approver": project.approver.name,
                "revision": project.revisions[-1].rev if project.revisions else "—",
            }
            rel = notebook.resolve().relative_to(folder).as_posix()
            for entry in project.sheets:
                if entry.path == rel:
                    meta["sheet_number"] = entry.number
            return meta
    return {}


def pdf_page_images(pdf: bytes, *, resolution: int = 60) -> tuple[bytes, ...]:
    """PNG images of every page of ``pdf`` at ``resolution`` dots per inch (pdftoppm).

    Raises:
        BuildError: pdftoppm is not installed or failed.
    """
    exe = shutil.which("pdftoppm")
    if exe is None:
        raise BuildError(
            "The preview needs pdftoppm to draw the pages (Debian package poppler-utils); "
            "install it, or build the package with `calcpack build`"
        )
    with tempfile.TemporaryDirectory(prefix="calcpack-preview-") as tmp:
        src = Path(tmp) / "sheet.pdf"
        src.write_bytes(pdf)
        done = subprocess.run(
            [exe, "-png", "-r", str(resolution), str(src), str(Path(tmp) / "page")],
            capture_output=True,
            check=False,
            timeout=120,
        )
        if done.returncode != 0:
            raise BuildError(f"pdftoppm failed: {done.stderr.decode(errors='replace')[-500:]}")
        return tuple(p.read_bytes() for p in sorted(Path(tmp).glob("page-*.png")))


def render_preview(notebook: str | Path, *, resolution: int = 60) -> SheetPreview:
    """Execute the saved ``notebook`` in a fresh kernel and lay it out as the package does.

    Args:
        notebook: the sheet notebook (its saved state is what is rendered).
        resolution: page image resolution in dots per inch.

    Raises:
        InputError: the notebook does not exist.
        NotebookExecutionError: a cell failed (names the cell).
        BuildError: the layout or the page images could not be made.
    """
    import nbformat

    from calcpack.package.execute import execute_notebook
    from calcpack.package.sheetdoc import single_sheet_pdf

    path = Path(notebook)
    if not path.is_file():
        raise InputError(
            f"Notebook {str(path)!r} does not exist; give the sheet's path, e.g. "
            'preview("02_beam.ipynb")',
            name="notebook",
            value=str(path),
            expected="an existing .ipynb file",
        )
    with _building():
        nb = execute_notebook(path, sheet=path.name)
    meta = _job_metadata(path)
    if meta:
        nb.metadata["calcpack"] = {**meta, **dict(nb.metadata.get("calcpack", {}) or {})}
    nbformat.validate(nb)
    pdf = single_sheet_pdf(nb, name=path.stem)
    return SheetPreview(path.resolve(), pdf, pdf_page_images(pdf, resolution=resolution))


class _Nothing:
    """Displayed by ``preview()`` during a build: no output at all."""

    def _ipython_display_(self) -> None:
        return None

    def __repr__(self) -> str:
        return "preview skipped (not an interactive session)"


def preview(notebook: str | Path | None = None, *, resolution: int = 60) -> Any:
    """Show this sheet's pages as the package will print them (from the saved notebook).

    Save the notebook first: the saved file is what is executed, as in a build.

    Args:
        notebook: the sheet; default the notebook this kernel serves.
        resolution: page image resolution in dots per inch.

    Returns:
        A :class:`SheetPreview` (displayed as page images), or, during a build, an object that
        displays nothing.

    Raises:
        InputError: the notebook could not be found.
    """
    from calcpack.widgets.fields import interactive_session

    if not interactive_session():
        return _Nothing()
    path = Path(notebook) if notebook is not None else current_notebook()
    if path is None:
        raise InputError(
            "preview() could not tell which notebook this kernel serves; give its path, e.g. "
            'preview("02_beam.ipynb")',
            name="notebook",
            value=None,
            expected="a notebook path",
        )
    return render_preview(path, resolution=resolution)
