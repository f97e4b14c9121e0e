"""The build marks the sheets changed since the last issued revision (title block, contents)
and the revision history lists what changed; read back from the PDF's text layer."""

from __future__ import annotations

import io
import json
import shutil
from pathlib import Path

import nbformat
import pytest
from projectkit import make_project
from pypdf import PdfReader

from calcpack.cli import main

pytestmark = pytest.mark.build

BEAM = [
    "w = s.given('w', 3.0 * ureg.kN / ureg.m, 'line load on the beam')\n"
    "L = s.given('L', 4.0 * ureg.m, 'span')\n"
    "M = s.derive('M_max', w * L**2 / 8, 'midspan moment', unit='kN*m')",
]
POST = [
    "N = s.given('N', 12.0 * ureg.kN, 'axial load')\n"
    "A = s.given('A', 2500 * ureg.mm**2, 'area')\n"
    "f = s.derive('f', N / A, 'axial stress', unit='MPa')",
]
ISSUED_A = 'description = "Test issue"\nissued = true\n'
REV_B = '\n[[revisions]]\nrev = "B"\ndate = 2026-02-10\ndescription = "Beam load revised"\n'


def _texts(pdf: Path) -> list[str]:
    reader = PdfReader(io.BytesIO(pdf.read_bytes()))
    return [" ".join(page.extract_text().split()) for page in reader.pages]


def _build(root: Path) -> tuple[Path, dict[str, object]]:
    assert main(["build", str(root), "--quiet"]) == 0
    manifests = sorted((root / "build").glob("*.manifest.json"), key=lambda p: p.stat().st_mtime)
    manifest = manifests[-1]
    pdf = manifest.with_name(manifest.name.replace(".manifest.json", ".pdf"))
    return pdf, json.loads(manifest.read_text("utf-8"))


def _pages(manifest: dict[str, object], section: str) -> range:
    first, last = manifest["sections"][section]  # type: ignore[index]
    return range(first - 1, last)


@pytest.fixture(scope="module")
def issued_a(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """A two-sheet job built at revision A, marked issued."""
    root = make_project(tmp_path_factory.mktemp("rev") / "job", {"Beam": BEAM, "Post": POST})
    toml = root / "calcpack.toml"
    toml.write_text(toml.read_text("utf-8").replace('description = "Test issue"\n', ISSUED_A))
    pdf, _ = _build(root)
    assert (root / "issued" / "A.manifest.json").read_bytes() == next(
        (root / "build").glob("*revA.manifest.json")
    ).read_bytes()
    assert not any("changed at" in t for t in _texts(pdf))  # nothing issued before A
    return root


def _next_revision(issued: Path, dest: Path, *, change_input: bool) -> Path:
    root = dest / "job"
    shutil.copytree(issued, root, ignore=shutil.ignore_patterns("build"))
    toml = root / "calcpack.toml"
    toml.write_text(toml.read_text("utf-8").replace(ISSUED_A, ISSUED_A + REV_B), "utf-8")
    if change_input:
        path = root / "sheets" / "01.ipynb"
        nb = nbformat.read(path, as_version=4)
        nb.cells[2].source = nb.cells[2].source.replace("3.0 * ureg.kN", "3.6 * ureg.kN")
        nbformat.write(nb, path)
    return root


def test_changed_sheet_is_marked_in_title_block_contents_and_history(
    issued_a: Path, tmp_path: Path
) -> None:
    root = _next_revision(issued_a, tmp_path, change_input=True)
    pdf, manifest = _build(root)
    texts = _texts(pdf)
    beam = [texts[i] for i in _pages(manifest, "sheet-1")]
    post = [texts[i] for i in _pages(manifest, "sheet-2")]
    assert all("changed at B" in t for t in beam)  # every page of the changed sheet
    assert not any("changed at" in t for t in post)
    (contents,) = [texts[i] for i in _pages(manifest, "contents")]
    assert contents.count("changed at B") == 1
    assert "Beam changed at B" in contents  # the mark follows the changed sheet's line
    history = " ".join(texts[i] for i in _pages(manifest, "revisions"))
    assert "Sheets changed since revision A" in history
    assert "Sheet 1 Beam" in history
    assert "Sheet 2 Post" not in history
    # at the sheet's significant figures (three)
    assert "input w: 3.00 kN/m → 3.60 kN/m" in history
    assert "result M_max: 6.00 kN·m → 7.20 kN·m" in history
    # Only issued revisions are kept: B is not marked issued.
    assert sorted(p.name for p in (root / "issued").iterdir()) == ["A.manifest.json"]


def test_unchanged_rebuild_marks_nothing(issued_a: Path, tmp_path: Path) -> None:
    root = _next_revision(issued_a, tmp_path, change_input=False)
    pdf, manifest = _build(root)
    texts = _texts(pdf)
    assert not any("changed at" in t for t in texts)
    history = " ".join(texts[i] for i in _pages(manifest, "revisions"))
    assert "No input, result or check changed since revision A." in history
