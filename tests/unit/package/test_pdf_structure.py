"""The package PDF is tagged, and its structure survives the join of the layout chunks and the
signatures added as incremental updates.

The document is the stand-in package of test_paginate, with a table and a figure in a sheet
laid out in a later chunk. The structure tree is read back with pypdf (our reading) and with
poppler's ``pdfinfo -struct-text`` (an independent reader, which follows each structure
element to its marked content on its page and prints the text found there). PDF/A-3b is
checked by its identification (ISO 19005-3 §6.6.4: the XMP ``pdfaid`` part and conformance),
its output intent (§6.2.3), the embedded fonts (§6.2.11.4) and the file identifier (§6.1.3),
read with pypdf and pdfinfo: no PDF/A validator installs from the package registries.
"""

from __future__ import annotations

import datetime as _dt
import io
import json
import re
import shutil
import subprocess
from collections.abc import Iterator
from pathlib import Path
from typing import Any

import pytest
from pypdf import PdfReader

from calcpack.package import paginate as pg
from calcpack.package.paginate import PdfAttachment, paginate, write_pdf
from calcpack.package.pdfjoin import structure_summary
from tests.unit.package.test_paginate import SECTION_IDS, SHEET_IDS, stand_in

pytestmark = pytest.mark.skipif(
    shutil.which("pdfinfo") is None, reason="needs poppler's pdfinfo (poppler-utils)"
)

TABLE = (
    "<table><caption>Loads on the lintel</caption><thead><tr><th>load</th><th>value</th></tr>"
    "</thead><tbody><tr><td>dead</td><td>2.5 kN/m</td></tr><tr><td>imposed</td>"
    "<td>1.5 kN/m</td></tr></tbody></table>"
)
SVG = (
    "data:image/svg+xml;utf8,<svg xmlns='http://www.w3.org/2000/svg' width='40' height='20'>"
    "<rect width='40' height='20' fill='black'/></svg>"
)
FIGURE = f'<img src="{SVG}" alt="Elevation of lintel L1 with the 2.5 kN/m load.">'


CHECKER_BOX = (
    '<div id="cp-sign-preparer"></div>'
    '<div id="cp-sign-checker" style="height: 20mm; border: 1px solid black"></div>'
)


def tagged_stand_in(counts: dict[str, int]) -> str:
    """The stand-in package with a language, a heading "Results" in every sheet and, in sheet 3,
    a heading "Loads" over a table and a figure."""
    html = stand_in(counts).replace("<html>", '<html lang="en">', 1)
    html = html.replace("<h1>Sheet 3</h1>", f"<h1>Sheet 3</h1><h2>Loads</h2>{TABLE}{FIGURE}", 1)
    html = html.replace('<div id="cp-sign-preparer"></div>', CHECKER_BOX, 1)
    return html.replace("<p>page 1</p>", "<p>page 1</p><h2>Results</h2>")


def joined(manifest: dict[str, Any] | None = None) -> bytes:
    """The stand-in laid out one sheet per chunk and joined (with a manifest if given)."""
    layout = paginate(
        tagged_stand_in,
        sheet_ids=SHEET_IDS,
        section_ids=SECTION_IDS,
        roles=("preparer", "checker"),
    )
    attachments = []
    if manifest is not None:
        manifest = {**manifest, "signature_fields": list(layout.signature_fields)}
        data = json.dumps(manifest).encode()
        attachments.append(PdfAttachment("calcpack-manifest.json", data, "manifest"))
    created = _dt.datetime(2026, 1, 15, tzinfo=_dt.UTC)
    return write_pdf(layout, created=created, attachments=attachments, identifier_seed=b"t")


@pytest.fixture(scope="module")
def package() -> Iterator[bytes]:
    """The stand-in, one sheet per chunk, with a manifest to sign (laid out once)."""
    from tests.unit.signing.signing_helpers import make_manifest

    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(pg, "CHUNK_HTML_CHARS", 1)
        yield joined(make_manifest(roles=("preparer", "checker")))


def poppler_structure(pdf: bytes, tmp_path: Path) -> list[str]:
    """``pdfinfo -struct-text`` lines, stripped; fails on any error poppler reports."""
    path = tmp_path / "package.pdf"
    path.write_bytes(pdf)
    run = subprocess.run(
        ["pdfinfo", "-struct-text", str(path)], capture_output=True, text=True, check=True
    )
    assert run.stderr == ""
    return [line.strip() for line in run.stdout.splitlines()]


def headings(lines: list[str]) -> list[str]:
    """The text of each H1, in reading order, from poppler's structure listing."""
    out = []
    for i, line in enumerate(lines):
        if line.startswith("H1"):
            out.append(next(t.strip('"') for t in lines[i + 1 :] if t.startswith('"')))
    return out


def test_joined_chunks_have_one_structure_tree(package: bytes, tmp_path: Path) -> None:
    summary = structure_summary(package)
    types = summary["types"]
    assert types["/Document"] == 1
    assert types["/H1"] == len(SECTION_IDS)
    assert summary["pages_mapped"]
    lines = poppler_structure(package, tmp_path)
    assert headings(lines) == ["Cover", "Contents", *[f"Sheet {i}" for i in range(1, 5)], "Summary"]


def test_tables_and_figures_of_a_later_chunk_keep_their_tags(
    package: bytes, tmp_path: Path
) -> None:
    summary = structure_summary(package)
    for kind in ("/Table", "/TR", "/TH", "/TD", "/Caption"):
        assert summary["types"].get(kind), kind
    assert summary["types"]["/TH"] == 2
    assert summary["types"]["/TD"] == 4
    assert summary["figures"] == ["Elevation of lintel L1 with the 2.5 kN/m load."]
    text = " ".join(poppler_structure(package, tmp_path))
    # poppler finds each cell's text on the page through the joined parent tree
    assert re.search(r'TD\b.*"dead".*TD\b.*"2\.5 kN/m"', text)


def test_header_cells_are_cited_by_unique_ids(package: bytes) -> None:
    reader = PdfReader(io.BytesIO(package))
    ids: list[str] = []
    cited: list[str] = []
    seen: set[int] = set()

    def walk(node: Any) -> None:
        if hasattr(node, "idnum"):
            if node.idnum in seen:
                return
            seen.add(node.idnum)
        obj = node.get_object()
        if isinstance(obj, list):
            for kid in obj:
                walk(kid)
        elif isinstance(obj, dict) and "/S" in obj:
            if "/ID" in obj:
                ids.append(str(obj["/ID"]))
            attributes = obj.get("/A")
            if isinstance(attributes, dict):
                cited.extend(str(h) for h in attributes.get("/Headers", ()))
            if "/K" in obj:
                walk(obj["/K"])

    walk(reader.root_object["/StructTreeRoot"]["/K"])
    assert len(ids) == len(set(ids)) == 2
    assert cited
    assert set(cited) <= set(ids)


def test_pages_and_links_point_into_the_parent_tree(package: bytes) -> None:
    reader = PdfReader(io.BytesIO(package))
    root = reader.root_object["/StructTreeRoot"]
    nums = list(root["/ParentTree"]["/Nums"])
    keys = [int(k) for k in nums[0::2]]
    assert keys == sorted(set(keys))  # a number tree's keys ascend, once each
    assert int(root["/ParentTreeNextKey"]) == keys[-1] + 1
    values = dict(zip(keys, nums[1::2], strict=True))
    pages = [int(p["/StructParents"]) for p in reader.pages]
    assert pages == sorted(set(pages))  # one key per page, in page order
    assert all(isinstance(values[k].get_object(), list) for k in pages)  # its elements by MCID
    tagged_links = [
        a.get_object()
        for p in reader.pages
        for a in p.get("/Annots", ())
        if "/StructParent" in a.get_object()
    ]
    assert tagged_links
    links = [int(a["/StructParent"]) for a in tagged_links]
    assert len(set(links)) == len(links)
    assert not set(links) & set(pages)
    assert all(values[k].get_object()["/S"] == "/Link" for k in links)


def archival_problems(pdf: bytes, tmp_path: Path) -> list[str]:
    """What would stop the file being identified as PDF/A-3b (see the module docstring)."""
    reader = PdfReader(io.BytesIO(pdf))
    problems = []
    xmp = reader.root_object["/Metadata"].get_object().get_data().decode()
    if 'pdfaid:part="3"' not in xmp or 'pdfaid:conformance="B"' not in xmp:
        problems.append("XMP does not identify PDF/A-3b")
    intents = reader.root_object.get("/OutputIntents") or []
    if not any(
        i.get_object().get("/S") == "/GTS_PDFA1" and "/DestOutputProfile" in i.get_object()
        for i in intents
    ):
        problems.append("no PDF/A output intent with a profile")
    if "/ID" not in reader.trailer:
        problems.append("no file identifier")
    # document information and XMP agree (ISO 19005-3 §6.6.2.3.1), the producer for one
    producer = re.search(r'pdf:Producer="([^"]*)"|<pdf:Producer>([^<]*)<', xmp)
    info = reader.metadata or {}
    if producer is None or (producer[1] or producer[2]) != info.get("/Producer"):
        problems.append(f"producer differs: {info.get('/Producer')!r} against the XMP's")
    path = tmp_path / "archive.pdf"
    path.write_bytes(pdf)
    fonts = subprocess.run(["pdffonts", str(path)], capture_output=True, text=True, check=True)
    for line in fonts.stdout.splitlines()[2:]:
        # columns: name type encoding emb sub uni object ID
        flags = line.split()[-5:-2]
        if flags[0] != "yes":
            problems.append(f"font not embedded: {line.split()[0]}")
    info = subprocess.run(["pdfinfo", str(path)], capture_output=True, text=True, check=True)
    if not re.search(r"^Tagged:\s+yes", info.stdout, re.MULTILINE):
        problems.append("not tagged")
    return problems


def test_joined_package_is_identified_as_pdf_a_3b(package: bytes, tmp_path: Path) -> None:
    assert archival_problems(package, tmp_path) == []


def test_signing_keeps_tags_and_archival_identification(package: bytes, tmp_path: Path) -> None:
    from calcpack.signing.keys import make_demo_credentials
    from calcpack.signing.sign import sign_package
    from calcpack.signing.verify import verify_package

    unsigned = package
    (tmp_path / "signed").mkdir()
    path = tmp_path / "signed" / "package.pdf"
    path.write_bytes(unsigned)
    demo = make_demo_credentials(tmp_path / "keys")
    sign_package(path, "preparer", demo.keys["preparer"], demo.password)
    assert archival_problems(path.read_bytes(), tmp_path) == []
    # the second signature reads the package before pyHanko writes its metadata
    sign_package(path, "checker", demo.keys["checker"], demo.password)
    signed = path.read_bytes()
    assert signed.startswith(unsigned)  # an incremental update: nothing rewritten
    assert headings(poppler_structure(signed, tmp_path)) == headings(
        poppler_structure(unsigned, tmp_path)
    )
    assert structure_summary(signed)["types"] == structure_summary(unsigned)["types"]
    assert archival_problems(signed, tmp_path) == []
    # the carried metadata is an allowed change: both signatures still verify
    report = verify_package(path, [demo.root])
    assert report.ok, report


def test_bookmarks_nest_sections_under_their_sheet_across_chunks(package: bytes) -> None:
    reader = PdfReader(io.BytesIO(package))
    outline = reader.outline
    tops = [item.title for item in outline if not isinstance(item, list)]
    assert tops == ["Cover", "Contents", *[f"Sheet {i}" for i in range(1, 5)], "Summary"]
    nested = {
        outline[i - 1].title: [item.title for item in outline[i]]
        for i in range(1, len(outline))
        if isinstance(outline[i], list)
    }
    assert nested == {
        "Sheet 1": ["Results"],
        "Sheet 2": ["Results"],
        "Sheet 3": ["Loads", "Results"],
        "Sheet 4": ["Results"],
    }
    for i in range(1, len(outline)):
        if isinstance(outline[i], list):
            sheet = reader.get_destination_page_number(outline[i - 1])
            pages = [reader.get_destination_page_number(item) for item in outline[i]]
            assert all(sheet <= p < sheet + 3 for p in pages)  # within its sheet


def test_every_link_is_a_link_element_holding_its_words(package: bytes) -> None:
    """Links between chunks (the contents to each section) are added after the join: each
    annotation gets its place in the tree, in the ``Link`` element that holds the link's words
    (ISO 32000-1 §14.8.4.4.2: a Link element's kids are its content and an object reference)."""
    reader = PdfReader(io.BytesIO(package))
    root = reader.root_object["/StructTreeRoot"]
    values = dict(
        zip(
            [int(k) for k in root["/ParentTree"]["/Nums"][0::2]],
            root["/ParentTree"]["/Nums"][1::2],
            strict=True,
        )
    )
    annotations = [
        a
        for p in reader.pages
        for a in p.get("/Annots", ())
        if a.get_object()["/Subtype"] == "/Link"
    ]
    assert len(annotations) >= len(SECTION_IDS) - 1  # the contents links at least
    for annotation in annotations:
        element = values[int(annotation.get_object()["/StructParent"])].get_object()
        assert element["/S"] == "/Link"
        kids = list(element["/K"])
        refs = [k.get_object() for k in kids if not isinstance(k.get_object(), int)]
        assert any(r.get("/Obj") == annotation for r in refs if r.get("/Type") == "/OBJR")
        assert any(isinstance(k.get_object(), int) for k in kids)  # its words' marked content
