"""The demo job names beam B1's section only where it reads it from the inputs file, so a pick
in the beam member panel (which rewrites the [beam] table) leaves no heading, title or label
naming the old section. Checked on the notebooks' text, without running them."""

from __future__ import annotations

import json
import tomllib
from pathlib import Path

DEMO = Path(__file__).resolve().parents[2] / "example_projects" / "alteration_ashgrove_lane"


def _cells(sheet: Path) -> list[tuple[str, str]]:
    nb = json.loads(sheet.read_text(encoding="utf-8"))
    return [(c["cell_type"], "".join(c["source"])) for c in nb["cells"]]


def test_no_sheet_or_title_names_the_section_the_inputs_file_holds() -> None:
    design = tomllib.loads((DEMO / "inputs" / "design.toml").read_text(encoding="utf-8"))
    section = design["beam"]["section"].upper()
    project = tomllib.loads((DEMO / "calcpack.toml").read_text(encoding="utf-8"))
    texts = [e.get("title", "") for e in project["sheets"]] + list(project["design"]["materials"])
    for sheet in sorted((DEMO / "sheets").glob("*.ipynb")):
        texts += [src for _, src in _cells(sheet)]
    assert [t for t in texts if section in t.upper()] == []


def test_the_beam_sheet_heads_its_working_with_the_member_read_from_the_file() -> None:
    code = [src for kind, src in _cells(DEMO / "sheets" / "02_beam_B1.ipynb") if kind == "code"]
    reads = next(i for i, src in enumerate(code) if 'data["beam"]' in src)
    heading = next(
        i for i, src in enumerate(code) if "s.heading(" in src and "sec['section']" in src
    )
    assert reads <= heading  # the heading is written from the [beam] table just read
