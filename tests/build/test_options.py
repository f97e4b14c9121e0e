"""Reviewer copy, review log, the single-notebook exporters and the build command line."""

from __future__ import annotations

import io
from importlib.metadata import entry_points
from pathlib import Path
from typing import Any

import nbformat
import pytest
from pypdf import PdfReader

from calcpack.cli import main
from calcpack.package.execute import execute_notebook
from calcpack.package.pipeline import build

pytestmark = pytest.mark.build

CELLS = [
    'L = s.given("L", 4.0 * ureg.m, "span", source="drawing S-01")\n'
    'w = s.given("w", 2.0 * ureg.kN / ureg.m, "line load")\n'
    'M = s.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")\n'
    's.check("Bending", 7.0 * ureg.MPa, 10.0 * ureg.MPa, member="J1")'
]


def _text(pdf: Path) -> str:
    reader = PdfReader(io.BytesIO(pdf.read_bytes()))
    return " ".join(" ".join(p.extract_text().split()) for p in reader.pages)


def test_reviewer_copy_appends_source_and_review_log_is_printed(
    new_project: Any, tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    project = new_project(tmp_path / "job", {"Joist J1": CELLS})
    (project / "review.toml").write_text(
        '[[comments]]\nid = "R1"\nsheet = "1"\nquantity = "M_max"\nstatus = "open"\n'
        'by = "C. Hecker"\ndate = "2026-01-16"\ntext = "Confirm the joist spacing."\n',
        "utf-8",
    )
    code = main(["build", str(project), "--reviewer-copy", "--quiet", "--workers", "1"])
    assert code == 0
    assert "Wrote" in capsys.readouterr().out
    (pdf,) = (project / "build").glob("*.pdf")
    text = _text(pdf)
    assert "Appendix: sheet source" in text
    assert 'M = s.derive("M_max", w * L**2 / 8' in text  # the code, verbatim
    assert "Confirm the joist spacing." in text
    assert "C. Hecker" in text
    result = build(project, reviewer_copy=True)
    assert result.up_to_date
    roles = {f["path"]: f["role"] for f in result.manifest["files"]}
    assert roles["review.toml"] == "review"


def test_without_review_file_the_log_says_so(new_project: Any, tmp_path: Path) -> None:
    project = new_project(tmp_path / "job", {"Joist J1": CELLS})
    result = build(project, workers=1)
    text = _text(result.pdf_path)
    assert "No review record is held with this project." in text
    assert "Appendix: sheet source" not in text  # code is hidden by default
    assert "w * L**2 / 8" not in text


def test_bad_project_is_one_line_error(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["build", str(tmp_path), "--quiet"]) == 1
    err = capsys.readouterr().err
    assert err.startswith("calcpack: error: Project file")
    assert "calcpack.toml" in err


def test_exporters_convert_one_notebook(new_project: Any, tmp_path: Path) -> None:
    names = {e.name for e in entry_points(group="nbconvert.exporters")}
    if "calcpack-pdf" not in names:
        pytest.skip("calcpack is not installed (its nbconvert exporters are registered on install)")
    from nbconvert.exporters import get_exporter

    project = new_project(tmp_path / "one", {"Joist J1": CELLS})
    nb = execute_notebook(project / "sheets" / "01.ipynb", sheet="01.ipynb")
    html, _ = get_exporter("calcpack-html")().from_notebook_node(nb)
    assert "cp-step" in html
    assert "s.given(" not in html  # input hidden
    pdf, resources = get_exporter("calcpack-pdf")().from_notebook_node(
        nb, resources={"metadata": {"name": "joist"}}
    )
    assert resources["output_extension"] == ".pdf"
    reader = PdfReader(io.BytesIO(pdf))
    text = " ".join(p.extract_text() for p in reader.pages)
    assert "Joist J1" in text
    assert "\\frac" not in text


def test_execute_notebook_returns_outputs(new_project: Any, tmp_path: Path) -> None:
    project = new_project(tmp_path / "x", {"Joist J1": CELLS})
    nb = execute_notebook(project / "sheets" / "01.ipynb", sheet="sheets/01.ipynb")
    assert isinstance(nb, nbformat.NotebookNode)
    outputs = [o for c in nb.cells if c.cell_type == "code" for o in c.outputs]
    assert any("application/vnd.calcpack.records+json" in o.get("data", {}) for o in outputs)
