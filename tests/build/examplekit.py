"""The example jobs built and signed once per test run, and read once per worker (the
``packages`` fixture of the build conftest): shared by the checks of their numbers, of their text
and of their pages."""

from __future__ import annotations

import functools
import shutil
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from sharedbuild import build_if_free, built_once, is_busy

ROOT = Path(__file__).resolve().parents[2] / "example_projects"
#: the US jobs (ASCE/SEI 7, AISC 360, NDS), checked alike by the tests parametrised over them
PROJECTS = ("alteration_ashgrove_lane", "deck_larkspur_court", "workshop_truss_fernhill")
#: the SI jobs (the Eurocodes with the UK annexes), each with its own test module
SI_PROJECTS = ("garden_studio", "wall_removal_hollins_road")
#: every job the ``packages`` fixture builds on first use
ALL_PROJECTS = PROJECTS + SI_PROJECTS


@dataclass(frozen=True)
class Built:
    name: str
    project: Path
    pdf: Path
    root: Path
    manifest: dict[str, Any]
    pages: list[str]


def _make(name: str, folder: Path) -> None:
    """Copy, build and sign the example job ``name`` into ``folder``."""
    from calcpack.package.pipeline import build
    from calcpack.signing.demo import sign_demo_package

    project = folder / "project"
    shutil.copytree(ROOT / name, project, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
    result = build(project, out_dir=folder, workers=2, timeout=300.0, use_cache=True)
    signoff = sign_demo_package(result.pdf_path, folder, project=project)
    assert Path(signoff.pdf).parent == folder
    assert signoff.root == folder / "keys" / "demo-root.crt"


def _build(name: str, base: Path) -> Built:
    from pypdf import PdfReader

    from calcpack.signing.manifest import load_manifest

    folder = built_once(base / name, functools.partial(_make, name))
    (pdf,) = folder.glob("*.pdf")
    pages = [p.extract_text() or "" for p in PdfReader(str(pdf)).pages]
    root = folder / "keys" / "demo-root.crt"
    return Built(name, folder / "project", pdf, root, load_manifest(pdf), pages)


class _OnFirstUse(dict[str, Built]):
    """Each job is built the first time a test asks for it, so ``-k`` on one job builds only
    that job."""

    def __init__(self, base: Path) -> None:
        super().__init__()
        self.base = base

    def __missing__(self, name: str) -> Built:
        if name not in ALL_PROJECTS:
            raise KeyError(name)
        if is_busy(self.base / name):
            # Another worker is building it: build the jobs nobody has started meanwhile.
            for other in ALL_PROJECTS:
                if other != name:
                    build_if_free(self.base / other, functools.partial(_make, other))
        self[name] = _build(name, self.base)
        return self[name]


def build_examples(base: Path) -> dict[str, Built]:
    """The example jobs under ``base``, each built, signed and read on first use."""
    return _OnFirstUse(base)
