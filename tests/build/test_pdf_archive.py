"""The issued example packages are tagged, searchable and archival, after the join of their
layout chunks and after their signatures (the ``packages`` fixture builds and signs them).

Read back with poppler (``pdftotext``, ``pdfinfo -struct``, ``pdffonts``) and pypdf:

- tags: one structure tree with the package's headings, the tables' header and data cells and
  every figure and formula with its alternative text;
- search: each derived value whose symbol is a letter with a subscript of words is found
  as typeset text copies it (``M_{\\mathrm{max}}`` as "Mmax", ``f_{c,\\mathrm{TC}}`` as
  "fc,TC"), followed by " = " on a line that carries the value (its leading significant
  digits), so a reader can search the working for a symbol and find its value;
- bookmarks: the package's parts and sheets, each sheet's sections nested under it and on the
  sheet's pages;
- PDF/A-3b by identification (ISO 19005-3 §6.6.4), output intent (§6.2.3), embedded fonts
  (§6.2.11.4) and file identifier (§6.1.3): no PDF/A validator installs from the package
  registries.
"""

from __future__ import annotations

import io
import math
import re
import shutil
import subprocess
from pathlib import Path
from typing import Any

import pytest
from examplekit import PROJECTS, Built
from pypdf import PdfReader

from calcpack.package.pdfjoin import structure_summary

pytestmark = [
    pytest.mark.build,
    pytest.mark.skipif(shutil.which("pdfinfo") is None, reason="needs poppler-utils"),
]


def _digits(value: float, sig: int) -> str:
    """The leading significant digits of a value as printed to ``sig`` figures ("439")."""
    if value == 0 or not math.isfinite(value):
        return "0"
    exponent = math.floor(math.log10(abs(value)))
    return str(round(abs(value) / 10 ** (exponent - sig + 1)))[:sig].rstrip("0") or "0"


@pytest.mark.parametrize("name", PROJECTS)
def test_tagged_structure(packages: dict[str, Built], name: str) -> None:
    built = packages[name]
    summary = structure_summary(built.pdf.read_bytes())
    types = summary["types"]
    assert types["/Document"] == 1
    assert summary["pages_mapped"]
    # every sheet's title and each part's heading is an H1
    assert types["/H1"] >= len(built.manifest["sheets"]) + 4
    for kind in ("/Table", "/TR", "/TH", "/TD", "/Figure", "/Link"):
        assert types.get(kind), (name, kind)
    # every figure and formula has alternative text, none a placeholder
    alts = summary["figures"]
    assert all(alt and alt.strip() and alt.strip().lower() != "figure" for alt in alts), [
        a for a in alts if not a or a.strip().lower() == "figure"
    ]
    run = subprocess.run(
        ["pdfinfo", "-struct", str(built.pdf)], capture_output=True, text=True, check=True
    )
    assert run.stderr == ""  # poppler reads the joined and signed tree without complaint
    assert run.stdout.startswith("Document")


_WORD = r"(?:\\mathrm\{[A-Za-z0-9]+\}|[A-Za-z0-9]+)"
_PLAIN_SYMBOL = re.compile(rf"([A-Za-z])_\{{({_WORD}(?:,{_WORD})*)\}}")
"""A Latin letter with a subscript of words (``M_{\\mathrm{max}}``, ``f_{c,\\mathrm{TC}}``)."""


@pytest.mark.parametrize("name", PROJECTS)
def test_symbols_and_values_are_searchable(packages: dict[str, Built], name: str) -> None:
    built = packages[name]
    text = subprocess.run(
        ["pdftotext", "-layout", str(built.pdf), "-"], capture_output=True, text=True, check=True
    ).stdout
    lines = text.splitlines()
    missing = []
    tried = 0
    for sheet in built.manifest["sheets"]:
        for value in sheet["values"]:
            m = _PLAIN_SYMBOL.fullmatch(value["symbol"])
            if value["kind"] != "derived" or m is None:
                continue
            parts = [p.removeprefix("\\mathrm{").rstrip("}") for p in m[2].split(",")]
            if any(p in ("star", "prime") or p.endswith("perp") for p in parts):
                continue  # marks, written as marks
            symbol = m[1] + ",".join(parts)  # a subscript runs on, as typeset text copies
            tried += 1
            digits = _digits(float(value["value"]), int(value.get("sig", 3)))
            pattern = re.compile(rf"(?<![\w,]){re.escape(symbol)} = ")
            if not any(
                pattern.search(line) and digits in re.sub(r"\D", "", line) for line in lines
            ):
                missing.append(f"{sheet['path']}: {symbol} = …{digits}…")
    assert tried >= 5, name
    assert missing == [], name


@pytest.mark.parametrize("name", PROJECTS)
def test_bookmarks_nest_sections_under_their_sheet(packages: dict[str, Built], name: str) -> None:
    built = packages[name]
    reader = PdfReader(io.BytesIO(built.pdf.read_bytes()))
    outline: list[Any] = reader.outline
    sheets = {s["title"]: s["pages"] for s in built.manifest["sheets"]}
    nested = 0
    for i, item in enumerate(outline):
        if isinstance(item, list):
            continue
        title = str(item.title)
        assert title.split(" — ", 1)[-1] in sheets or not title.startswith("Sheet "), title
        if not title.startswith("Sheet ") or i + 1 >= len(outline):
            continue
        children = outline[i + 1]
        assert isinstance(children, list), f"{title} has no sections"
        first, last = sheets[title.split(" — ", 1)[1]]
        for child in children:
            if not isinstance(child, list):
                assert first <= reader.get_destination_page_number(child) + 1 <= last, child.title
                nested += 1
    assert nested >= len(sheets)


def archival_problems(pdf: Path) -> list[str]:
    """What would stop the file being identified as PDF/A-3b (see the module docstring)."""
    reader = PdfReader(io.BytesIO(pdf.read_bytes()))
    problems = []
    xmp = reader.root_object["/Metadata"].get_object().get_data().decode()
    if 'pdfaid:part="3"' not in xmp or 'pdfaid:conformance="B"' not in xmp:
        problems.append("XMP does not identify PDF/A-3b")
    intents = reader.root_object.get("/OutputIntents") or []
    if not any(i.get_object().get("/S") == "/GTS_PDFA1" for i in intents):
        problems.append("no PDF/A output intent")
    if "/ID" not in reader.trailer:
        problems.append("no file identifier")
    fonts = subprocess.run(["pdffonts", str(pdf)], capture_output=True, text=True, check=True)
    for line in fonts.stdout.splitlines()[2:]:
        if line.split()[-5] != "yes":  # columns: name type encoding emb sub uni object ID
            problems.append(f"font not embedded: {line.split()[0]}")
    return problems


@pytest.mark.parametrize("name", PROJECTS)
def test_signed_package_is_identified_as_pdf_a_3b(packages: dict[str, Built], name: str) -> None:
    assert archival_problems(packages[name].pdf) == []
