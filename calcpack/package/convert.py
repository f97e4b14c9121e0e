"""Notebook to HTML with calcpack's nbconvert templates, and the nbconvert exporters.

The templates live in ``templates/calcpack/`` of the source tree and are installed into
``share/jupyter/nbconvert/templates/calcpack`` (where nbconvert looks); the exporters are
registered under the ``nbconvert.exporters`` entry point group, so::

    jupyter nbconvert --to calcpack-html sheet.ipynb     # one sheet as a web page
    jupyter nbconvert --to calcpack-pdf sheet.ipynb      # one sheet as a paginated PDF

work on a single notebook as well as inside ``calcpack build``. Code input is hidden: the working
is the rendered output.
"""

from __future__ import annotations

import base64
import html
import os
import re
from functools import cache
from importlib import resources
from pathlib import Path
from typing import Any

from nbconvert.exporters import Exporter, HTMLExporter
from traitlets import Bool, Unicode

from calcpack.package.locations import template_dirs
from calcpack.package.mathsvg import markdown_math_to_spans

__all__ = [
    "CalcpackHTMLExporter",
    "CalcpackPDFExporter",
    "package_css",
    "sheet_fragment",
    "template_dirs",
]


@cache
def package_css() -> str:
    """The package stylesheet (shipped inside calcpack)."""
    return (resources.files("calcpack.package") / "assets" / "calcpack.css").read_text("utf-8")


_ANCHOR_RE = re.compile(r'<a class="anchor-link" href="[^"]*">[^<]*</a>')
_HEADING_ID_RE = re.compile(r'(<h[1-6])\s+id="[^"]*"')


def _cp_markdown(source: str) -> str:
    """Markdown to HTML, math as calcpack spans; no anchor links or heading ids (sheets share a
    document, so ids would clash)."""
    from nbconvert.filters import markdown2html

    from calcpack.working.render import symbols_in_html

    markup = _HEADING_ID_RE.sub(r"\1", _ANCHOR_RE.sub("", markdown2html(source)))
    return symbols_in_html(markdown_math_to_spans(markup))


def _cp_svg_uri(svg: str | list[str]) -> str:
    text = "".join(svg) if isinstance(svg, list) else svg
    return "data:image/svg+xml;base64," + base64.b64encode(text.encode()).decode()


_CREATOR_RE = re.compile(r"<dc:creator>.*?</dc:creator>", re.DOTALL)
_SVG_TITLE_RE = re.compile(r"<(?:dc:)?title>(.*?)</(?:dc:)?title>", re.DOTALL)


def _cp_svg_alt(svg: str | list[str]) -> str:
    """Alternative text of an SVG shown as a bare image: its title (a ``<title>`` element or
    the ``dc:title`` of its metadata, not its creator's), else "figure"."""
    text = _CREATOR_RE.sub("", "".join(svg) if isinstance(svg, list) else svg)
    m = _SVG_TITLE_RE.search(text[:20000])
    title = html.unescape(m.group(1)).strip() if m else ""
    return title or "figure"


class CalcpackHTMLExporter(HTMLExporter):  # type: ignore[misc]
    """One sheet notebook as HTML with calcpack's layout; code input hidden by default."""

    export_from_notebook = "calcpack sheet (HTML)"

    show_source = Bool(False, help="Show the code input of every cell (reviewer copy).").tag(
        config=True
    )

    # Trait defaults are redefined rather than set with traitlets' (untyped) decorators.
    template_name = Unicode("calcpack", help="nbconvert template folder name").tag(config=True)
    exclude_input = Bool(True, help="Hide code input (the working is the output)").tag(config=True)
    exclude_input_prompt = Bool(True).tag(config=True)
    exclude_output_prompt = Bool(True).tag(config=True)

    def __init__(self, **kwargs: Any) -> None:
        # The template folder must be on the search path before nbconvert reads its conf.json
        # (inside the base initialiser).
        kwargs.setdefault("extra_template_basedirs", [os.getcwd(), *template_dirs()])
        super().__init__(**kwargs)

    def default_filters(self) -> Any:
        yield from super().default_filters()
        yield ("cp_markdown", _cp_markdown)
        yield ("cp_svg_uri", _cp_svg_uri)
        yield ("cp_svg_alt", _cp_svg_alt)

    def from_notebook_node(
        self, nb: Any, resources: dict[str, Any] | None = None, **kw: Any
    ) -> tuple[str, dict[str, Any]]:
        resources = dict(resources or {})
        resources.setdefault("calcpack_css", package_css())
        if self.show_source:
            self.exclude_input = False
        return super().from_notebook_node(nb, resources=resources, **kw)  # type: ignore[no-any-return]


def sheet_fragment(nb: Any, *, show_source: bool = False) -> str:
    """The HTML body of one executed sheet (math still as TeX spans)."""
    exporter = CalcpackHTMLExporter(show_source=show_source)
    exporter.template_file = "sheet.html.j2"
    body, _ = exporter.from_notebook_node(nb)
    return body


def not_executed(nb: Any) -> bool:
    """True when a notebook has code but no cell has run (no outputs, no execution count):
    its PDF would be an empty sheet."""
    code = [c for c in nb.cells if c.get("cell_type") == "code" and c.get("source", "").strip()]
    return bool(code) and not any(
        c.get("outputs") or c.get("execution_count") is not None for c in code
    )


class CalcpackPDFExporter(Exporter):  # type: ignore[misc]
    """One sheet notebook as a paginated PDF in calcpack's layout (title block on every page).

    The job fields come from the notebook's ``metadata.calcpack`` (``job_number``, ``job_title``,
    ...) when present; ``calcpack build`` is the way to issue a whole package.
    """

    export_from_notebook = "calcpack sheet (PDF)"
    output_mimetype = "application/pdf"

    file_extension = Unicode(".pdf").tag(config=True)

    def from_notebook_node(
        self, nb: Any, resources: dict[str, Any] | None = None, **kw: Any
    ) -> tuple[bytes, dict[str, Any]]:
        nb_copy, resources = super().from_notebook_node(nb, resources, **kw)
        from calcpack.package.project import find_project_above, load_project
        from calcpack.package.sheetdoc import single_sheet_pdf

        meta = (resources or {}).get("metadata", {})
        name = str(meta.get("name", "sheet"))
        folder = Path(meta.get("path") or ".").resolve()
        if not_executed(nb_copy):
            nb_copy = self._execute(folder / f"{name}.ipynb")
        project_file = find_project_above(folder)
        if project_file is None:
            pdf = single_sheet_pdf(nb_copy, name=name)
        else:
            project = load_project(project_file)
            notebook = (folder / f"{name}.ipynb").resolve()
            try:
                path = notebook.relative_to(project.root).as_posix()
            except ValueError:
                path = notebook.name
            self.log.info("calcpack: job fields from %s", project_file)
            pdf = single_sheet_pdf(nb_copy, name=name, project=project, path=path)
        resources = dict(resources or {})
        resources["output_extension"] = ".pdf"
        return pdf, resources

    def _execute(self, notebook: Path) -> Any:
        """Run a notebook that was saved without outputs, saying so; refuse when its file
        cannot be found (a sheet without its working is never written as an empty PDF)."""
        from calcpack.errors import BuildError
        from calcpack.package.execute import execute_notebook

        if not notebook.is_file():
            raise BuildError(
                f"{notebook.name} has no outputs and its file was not found to run it: run the "
                "notebook (or `jupyter nbconvert --execute --to calcpack-pdf`) first"
            )
        self.log.warning("calcpack: %s has no outputs; running it first", notebook.name)
        return execute_notebook(notebook, sheet=notebook.name)
