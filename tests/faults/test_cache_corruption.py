"""A cache that cannot lie: each corruption of the build cache gives the package a clean build
gives (the same bytes), with a warning naming the discarded entry -- never a wrong package with
exit 0. "Up to date" is said only of a PDF that carries the manifest beside it; a build stopped
between writing the two files is repaired by the next build. Metadata edits lay the package out
again without executing any sheet.
"""

from __future__ import annotations

import json
import os
import shutil
import warnings
from collections.abc import Callable
from pathlib import Path

import pytest

import calcpack.package.paginate as paginate_module
import calcpack.package.pipeline as pipeline_module
from calcpack.package.cache import CacheWarning, seal, unseal
from calcpack.package.execute import CACHE_DIR_NAME
from calcpack.package.manifest import embedded_manifest_bytes
from calcpack.package.pipeline import build
from tests.build.projectkit import make_project

pytestmark = pytest.mark.build

SHEETS = {
    "Joist J1": [
        'L = s.given("L", 3.2 * ureg.m, "span")\n'
        'w = s.given("w", 2.5 * ureg.kN / ureg.m, "line load")\n'
        's.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m")'
    ],
    "Beam B1": [
        'P = s.given("P", 7.25 * ureg.kN, "point load")\n'
        'a = s.given("a", 1.5 * ureg.m, "lever arm")\n'
        's.derive("M_B", P * a, "moment at the support", unit="kN*m")'
    ],
}


@pytest.fixture(scope="module")
def clean(tmp_path_factory: pytest.TempPathFactory) -> tuple[Path, bytes, bytes]:
    """(a pristine copy of the project with its cache and build, clean PDF bytes, manifest
    bytes); every chunk of the layout is a sheet of its own, so that there are chunks to swap.

    The project itself is at ``project`` beside the copy: kept chunks are found by where the
    project is (its base URL), so each test restores the project in the same place.
    """
    folder = tmp_path_factory.mktemp("cache")
    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(paginate_module, "CHUNK_HTML_CHARS", 1)
        root = make_project(folder / "project", SHEETS)
        result = build(root, workers=1)
    shutil.copytree(root, folder / "pristine")
    return folder / "pristine", result.pdf_path.read_bytes(), result.manifest_path.read_bytes()


@pytest.fixture
def project(clean: tuple[Path, bytes, bytes], monkeypatch: pytest.MonkeyPatch) -> Path:
    monkeypatch.setattr(paginate_module, "CHUNK_HTML_CHARS", 1)
    root = clean[0].parent / "project"
    shutil.rmtree(root, ignore_errors=True)
    shutil.copytree(clean[0], root)
    return root


def _cache(project: Path) -> Path:
    return project / CACHE_DIR_NAME


def _rebuild(project: Path, **kwargs) -> tuple[object, list[str]]:
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        result = build(project, workers=1, **kwargs)
    return result, [str(w.message) for w in caught if issubclass(w.category, CacheWarning)]


def _rewrite_content(path: Path, change: Callable[[bytes], bytes]) -> None:
    """Change an entry's content, keeping its old header (what an edit by hand does)."""
    data = path.read_bytes()
    header, _, content = data.partition(b"\n")
    path.write_bytes(header + b"\n" + change(content))


def test_an_edited_value_in_a_cached_notebook_is_discarded(clean, project: Path) -> None:
    (entry,) = _cache(project).glob("sheets_01_ipynb-*.executed")
    _rewrite_content(entry, lambda b: b.replace(b"2.5", b"9.5"))
    result, warned = _rebuild(project, force=True)
    assert result.executed == ("sheets/01.ipynb",)  # executed again, not read back
    assert any("executed notebook" in w and "hash" in w for w in warned)
    assert result.pdf_path.read_bytes() == clean[1]


def test_a_truncated_cached_notebook_is_rebuilt_once_and_for_all(clean, project: Path) -> None:
    (entry,) = _cache(project).glob("sheets_02_ipynb-*.executed")
    entry.write_bytes(entry.read_bytes()[:-200])
    result, warned = _rebuild(project, force=True)
    assert any("truncated" in w for w in warned)
    assert result.executed == ("sheets/02.ipynb",)
    assert result.pdf_path.read_bytes() == clean[1]
    again, warned = _rebuild(project, force=True)  # the cache is whole again
    assert warned == []
    assert again.executed == ()


def test_a_layout_chunk_copied_over_another_is_discarded(clean, project: Path) -> None:
    folder = _cache(project) / "layout"
    chunks = sorted({p.stem for p in folder.iterdir()})
    assert len(chunks) >= 2
    one, other = chunks[:2]
    for suffix in (".pdf", ".json"):
        shutil.copyfile(folder / f"{one}{suffix}", folder / f"{other}{suffix}")
    result, warned = _rebuild(project, force=True)
    assert any("layout chunk" in w and "another key" in w for w in warned)
    assert result.pdf_path.read_bytes() == clean[1]
    assert result.page_count == json.loads(clean[2])["build"]["pages"]


def test_a_chunk_whose_page_count_was_edited_is_discarded(clean, project: Path) -> None:
    folder = _cache(project) / "layout"
    meta = sorted(folder.glob("*.json"))[0]

    def more_pages(content: bytes) -> bytes:
        data = json.loads(content)
        data["page_count"] += 10
        return json.dumps(data).encode()

    _rewrite_content(meta, more_pages)
    result, warned = _rebuild(project, force=True)
    assert any("layout chunk" in w for w in warned)
    assert result.pdf_path.read_bytes() == clean[1]


def test_swapped_formula_images_are_discarded(clean, project: Path) -> None:
    path = _cache(project) / "formulas.entry"

    def swap(content: bytes) -> bytes:
        data = json.loads(content)
        formulas = data["formulas"]
        assert len(formulas) >= 2
        formulas[0][3], formulas[1][3] = formulas[1][3], formulas[0][3]  # the two SVGs
        return json.dumps(data).encode()

    _rewrite_content(path, swap)
    result, warned = _rebuild(project, force=True)
    assert any("formula images" in w for w in warned)
    assert result.pdf_path.read_bytes() == clean[1]


def test_a_crash_between_the_two_output_files_is_repaired(
    clean, project: Path, monkeypatch
) -> None:
    nb = project / "sheets" / "02.ipynb"
    nb.write_text(nb.read_text("utf-8").replace("7.25", "8.5"), "utf-8")
    real_replace = os.replace
    out = project / "build"

    def crash_at_the_pdf(src, dst):  # the manifest is moved into place, then the power fails
        if Path(dst).parent == out and str(dst).endswith(".pdf"):
            raise KeyboardInterrupt
        return real_replace(src, dst)

    monkeypatch.setattr(pipeline_module.os, "replace", crash_at_the_pdf)
    with pytest.raises(KeyboardInterrupt):
        build(project, workers=1)
    monkeypatch.setattr(pipeline_module.os, "replace", real_replace)
    (pdf,) = out.glob("*.pdf")
    (manifest,) = out.glob("*.manifest.json")
    assert pdf.read_bytes() == clean[1]  # the stale package...
    assert manifest.read_bytes() != clean[2]  # ...beside the new manifest

    result, warned = _rebuild(project)
    assert result.up_to_date is False  # never "Up to date" with the stale PDF
    assert any("does not carry the manifest beside it" in w for w in warned)
    assert embedded_manifest_bytes(result.pdf_path) == result.manifest_path.read_bytes()
    assert "8.5" in result.manifest_path.read_text("utf-8")
    final, warned = _rebuild(project)
    assert final.up_to_date is True
    assert warned == []


def test_a_replaced_pdf_is_not_up_to_date(clean, project: Path) -> None:
    (pdf,) = (project / "build").glob("*.pdf")
    pdf.write_bytes(b"%PDF-1.7\n% not the package\n")
    result, warned = _rebuild(project)
    assert result.up_to_date is False
    assert warned
    assert result.pdf_path.read_bytes() == clean[1]


@pytest.mark.parametrize(
    ("old", "new"),
    [
        ('client = "Invented Client"', 'client = "Another Invented Client"'),
        ('preparer = "P. Reparer"', 'preparer = "Q. Other"'),
        ('title = "Test job"', 'title = "Test job, revised title"'),
        ('title = "Beam B1"', 'title = "Beam B1 over the kitchen"'),
    ],
)
def test_metadata_edits_lay_out_again_without_executing(project: Path, old: str, new: str) -> None:
    toml = project / "calcpack.toml"
    text = toml.read_text("utf-8")
    assert old in text
    toml.write_text(text.replace(old, new), "utf-8")
    result, warned = _rebuild(project)
    assert result.up_to_date is False
    assert result.executed == ()
    assert result.cached == ("sheets/01.ipynb", "sheets/02.ipynb")
    assert warned == []
    # the same bytes as a build from nothing of the edited project
    fresh = project.parent / "fresh"
    shutil.rmtree(fresh, ignore_errors=True)
    shutil.copytree(project, fresh, ignore=shutil.ignore_patterns(CACHE_DIR_NAME, "build"))
    assert build(fresh, workers=1).pdf_path.read_bytes() == result.pdf_path.read_bytes()


def test_a_unit_system_change_executes_again(project: Path) -> None:
    toml = project / "calcpack.toml"
    toml.write_text(toml.read_text("utf-8").replace('units = "SI"', 'units = "US"'), "utf-8")
    result, _ = _rebuild(project)
    assert result.executed == ("sheets/01.ipynb", "sheets/02.ipynb")


def test_seal_round_trip_in_the_build_cache(project: Path) -> None:
    (entry,) = _cache(project).glob("sheets_01_ipynb-*.executed")
    header = entry.read_bytes().split(b"\n", 1)[0].decode()
    key = header.split(" ")[1].removeprefix("key=")
    content, why = unseal(key, entry.read_bytes())
    assert why == ""
    assert seal(key, content) == entry.read_bytes()
