"""The three example jobs built, signed and read once per test session (the ``packages``
fixture of the build conftest): shared by the checks of their numbers and of their text."""

from __future__ import annotations

import shutil
from dataclasses import dataclass
from pathlib import Path
from typing import Any

ROOT = Path(__file__).resolve().parents[2] / "example_projects"
PROJECTS = ("alteration_ashgrove_lane", "deck_larkspur_court", "workshop_truss_fernhill")


@dataclass(frozen=True)
class Built:
    name: str
    project: Path
    pdf: Path
    root: Path
    manifest: dict[str, Any]
    pages: list[str]


def _build(name: str, base: Path) -> Built:
    from calcpack.package.pipeline import build
    from calcpack.signing.demo import sign_demo_package
    from calcpack.signing.manifest import load_manifest

    folder = base / name
    project = folder / "project"
    shutil.copytree(ROOT / name, project, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
    result = build(project, out_dir=folder, workers=2, timeout=300.0, use_cache=True)
    signoff = sign_demo_package(result.pdf_path, folder, project=project)
    from pypdf import PdfReader

    pages = [p.extract_text() or "" for p in PdfReader(str(signoff.pdf)).pages]
    return Built(name, project, Path(signoff.pdf), signoff.root, load_manifest(signoff.pdf), pages)


class _OnFirstUse(dict[str, Built]):
    """Each job is built the first time a test asks for it, so ``-k`` on one job builds only
    that job."""

    def __init__(self, base: Path) -> None:
        super().__init__()
        self.base = base

    def __missing__(self, name: str) -> Built:
        if name not in PROJECTS:
            raise KeyError(name)
        self[name] = _build(name, self.base)
        return self[name]


def build_examples(base: Path) -> dict[str, Built]:
    """The example jobs under ``base``, each built, signed and read on first use."""
    return _OnFirstUse(base)
