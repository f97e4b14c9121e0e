"""The lintel demo job's package (example_projects/lintel_demo), opened with pypdf and checked.

Engineering values in the manifest are compared with the closed forms of a simply supported
beam under uniform load (M = wL²/8, V = wL/2, δ = 5wL⁴/384EI: common practice, any beam table).
"""

from __future__ import annotations

import hashlib
import io
import itertools
import json
import re
from pathlib import Path
from typing import Any

import pytest
from pypdf import PdfReader

from calcpack.package.document import STANDARD_CAUTIONS
from calcpack.package.manifest import MANIFEST_FORMAT, read_manifest
from calcpack.package.pipeline import build

pytestmark = pytest.mark.build


def test_page_count_agrees(demo_reader: PdfReader, demo_manifest: dict[str, Any]) -> None:
    assert len(demo_reader.pages) == demo_manifest["build"]["pages"]
    last = max(page for sheet in demo_manifest["sheets"] for page in sheet["pages"])
    assert last < len(demo_reader.pages)  # back matter follows the sheets
    assert demo_manifest["sections"]["cover"] == [1, 1]


def test_title_block_on_every_sheet_page(
    demo_texts: list[str], demo_manifest: dict[str, Any]
) -> None:
    total = len(demo_texts)
    for sheet in demo_manifest["sheets"]:
        first, last = sheet["pages"]
        count = last - first + 1
        for k, page in enumerate(range(first, last + 1), start=1):
            text = demo_texts[page - 1]
            assert "JOB NO. 2417" in text
            assert "14 Quarry Row" in text
            assert f"SHEET NO. {sheet['number']}" in text
            assert sheet["title"] in text
            assert "A. Okafor" in text
            assert "J. Lindqvist" in text
            assert f"sheet {k} of {count}" in text, (page, text[-400:])
            assert f"package {page} of {total}" in text, (page, text[-400:])


def test_every_page_after_cover_has_title_block(demo_texts: list[str]) -> None:
    assert "JOB NO." not in demo_texts[0]  # the cover has its own layout
    for number, text in enumerate(demo_texts[1:], start=2):
        assert "JOB NO. 2417" in text, number
        assert f"package {number} of {len(demo_texts)}" in text, number


def test_contents_page_numbers_match_real_pages(
    demo_texts: list[str], demo_manifest: dict[str, Any]
) -> None:
    contents = demo_texts[demo_manifest["sections"]["contents"][0] - 1]
    for sheet in demo_manifest["sheets"]:
        m = re.search(re.escape(sheet["title"]) + r" \.+ (\d+)", contents)
        assert m, sheet["title"]
        listed = int(m.group(1))
        assert listed == sheet["pages"][0]
        # ... and the sheet head really is on that page.
        assert f"Sheet {sheet['number']} {sheet['title']}" in demo_texts[listed - 1]
    for title, key in (("Summary of checks", "summary"), ("Revision history", "revisions")):
        m = re.search(re.escape(title) + r" \.+ (\d+)", contents)
        assert m
        assert int(m.group(1)) == demo_manifest["sections"][key][0]


def test_bookmarks_point_at_the_sections(
    demo_reader: PdfReader, demo_manifest: dict[str, Any]
) -> None:
    # the outline nests each sheet's sections under the sheet: a list after its parent
    outline = demo_reader.outline
    top = [o for o in outline if not isinstance(o, list)]
    marks = {o.title: demo_reader.get_destination_page_number(o) + 1 for o in top}
    assert marks["Contents"] == demo_manifest["sections"]["contents"][0]
    for sheet in demo_manifest["sheets"]:
        assert marks[f"Sheet {sheet['number']} — {sheet['title']}"] == sheet["pages"][0]
    assert marks["Summary of checks"] == demo_manifest["sections"]["summary"][0]
    pages = {f"Sheet {s['number']} — {s['title']}": s["pages"] for s in demo_manifest["sheets"]}
    nested = 0
    for parent, child in itertools.pairwise(outline):
        if isinstance(child, list) and not isinstance(parent, list) and parent.title in pages:
            first, last = pages[parent.title][0], pages[parent.title][-1]
            for o in child:
                if not isinstance(o, list):
                    nested += 1
                    assert first <= demo_reader.get_destination_page_number(o) + 1 <= last
    assert nested > 0  # each sheet's sections are bookmarked under it


def test_caution_block_holds_standard_project_and_sheet_cautions(
    demo_texts: list[str], demo_manifest: dict[str, Any]
) -> None:
    first, last = demo_manifest["sections"]["assumptions"]
    text = " ".join(demo_texts[first - 1 : last])
    assert "CAUTIONS" in text
    for caution in STANDARD_CAUTIONS:
        assert caution[:60] in text
    assert "The grade values are for demonstration only" in text  # project file
    assert "Confirm the lintel grade on delivery" in text  # sheet 2 declares it
    assert "fully bedded; a padstone is not needed" in text  # a sheet's assumption


def test_no_tex_or_raster_math_in_the_pdf(demo_reader: PdfReader, demo_texts: list[str]) -> None:
    whole = " ".join(demo_texts)
    for leftover in ("\\frac", "\\(", "\\[", "$", "\\mathrm"):
        assert leftover not in whole
    for page in demo_reader.pages:
        assert list(page.images) == []  # math and rules are vector; no raster anywhere


def test_fonts_are_embedded(demo_reader: PdfReader) -> None:
    seen = 0
    for page in demo_reader.pages:
        fonts = page.get("/Resources", {}).get("/Font", {})
        for ref in fonts.values():
            font = ref.get_object()
            descriptor = font.get("/FontDescriptor")
            if descriptor is None:  # composite font: descriptor on the descendant
                descriptor = font["/DescendantFonts"][0].get_object()["/FontDescriptor"]
            descriptor = descriptor.get_object()
            assert any(k in descriptor for k in ("/FontFile", "/FontFile2", "/FontFile3"))
            seen += 1
    assert seen > 0


def test_manifest_attached_equals_the_one_beside(demo_pdf: Path, demo_dir: Path) -> None:
    (beside,) = demo_dir.glob("*.manifest.json")
    attached = PdfReader(io.BytesIO(demo_pdf.read_bytes())).attachments["calcpack-manifest.json"]
    assert attached[0] == beside.read_bytes()
    assert read_manifest(demo_pdf) == json.loads(beside.read_text("utf-8"))


def test_manifest_hashes_and_versions(demo_manifest: dict[str, Any], demo_dir: Path) -> None:
    assert demo_manifest["format"] == MANIFEST_FORMAT
    assert demo_manifest["calcpack_version"]
    for name in ("python", "nbclient", "weasyprint", "ziamath", "sympy", "pint"):
        assert demo_manifest["dependencies"][name]
    project = demo_dir / "project"
    roles = {}
    for entry in demo_manifest["files"]:
        data = (project / entry["path"]).read_bytes()
        assert hashlib.sha256(data).hexdigest() == entry["sha256"], entry["path"]
        roles[entry["path"]] = entry["role"]
    assert roles["calcpack.toml"] == "project"
    assert roles["sheets/02_lintel.ipynb"] == "sheet"
    assert demo_manifest["project"]["job_number"] == "2417"
    assert demo_manifest["project"]["revision"] == "A"


def test_manifest_records_values_and_checks(demo_manifest: dict[str, Any]) -> None:
    sheet = next(s for s in demo_manifest["sheets"] if s["path"] == "sheets/02_lintel.ipynb")
    values = {v["name"]: v for v in sheet["values"]}
    w, L = values["w"]["value"], values["L"]["value"]  # kN/m, m
    assert values["L"]["unit"] == "m"
    # M = wL²/8 and V = wL/2 (common practice); exact to float rounding.
    assert values["M_max"]["value"] == pytest.approx(w * L**2 / 8, rel=1e-9)
    assert values["V_max"]["value"] == pytest.approx(w * L / 2, rel=1e-9)
    checks = {c["name"]: c for c in sheet["checks"]}
    assert set(checks) == {"Bending", "Shear", "Deflection"}
    bending = checks["Bending"]
    assert bending["verdict"] == "OK"
    assert bending["utilisation"] == pytest.approx(bending["demand"] / bending["capacity"])


def test_signature_fields_are_the_cover_boxes(demo_manifest: dict[str, Any]) -> None:
    fields = demo_manifest["signature_fields"]
    assert [f["role"] for f in fields] == ["preparer", "checker", "approver"]
    width, height = 595.28, 841.89  # A4 in points
    previous_right = 0.0
    for f in fields:
        x1, y1, x2, y2 = f["box"]
        assert f["page"] == 0
        assert 0 < x1 < x2 < width
        assert 0 < y1 < y2 < height
        assert x2 - x1 > 100
        assert y2 - y1 > 60
        assert x1 > previous_right  # side by side, not overlapping
        previous_right = x2


def test_summary_lists_checks_worst_first(
    demo_texts: list[str], demo_manifest: dict[str, Any]
) -> None:
    text = demo_texts[demo_manifest["sections"]["summary"][0] - 1]
    # each check's utilisation against 1.00 and its verdict in words
    found = [
        float(u) for u in re.findall(r"(\d\.\d+) [≤>] 1\.00 (?:satisfied|NOT SATISFIED)\b", text)
    ]
    checks = [c for s in demo_manifest["sheets"] for c in s["checks"]]
    assert len(found) == len(checks)
    assert found == sorted(found, reverse=True)


def test_rebuild_without_change_is_skipped(demo_dir: Path, demo_pdf: Path) -> None:
    before = demo_pdf.read_bytes()
    result = build(demo_dir / "project", out_dir=demo_dir)
    assert result.up_to_date
    assert result.seconds < 2.0
    assert demo_pdf.read_bytes() == before


def test_same_inputs_give_the_same_bytes(demo_dir: Path, tmp_path: Path) -> None:
    # The demo folder's own PDF is signed by then; build twice afresh and compare.
    first = build(demo_dir / "project", out_dir=tmp_path / "a", force=True)
    second = build(demo_dir / "project", out_dir=tmp_path / "b", force=True)
    assert first.executed == ()  # everything from the cache
    assert first.pdf_path.read_bytes() == second.pdf_path.read_bytes()
    assert first.manifest_path.read_bytes() == second.manifest_path.read_bytes()


def test_letter_paper(demo_dir: Path, tmp_path: Path) -> None:
    result = build(demo_dir / "project", out_dir=tmp_path, paper="Letter")
    reader = PdfReader(str(result.pdf_path))
    box = reader.pages[0].mediabox
    assert (round(float(box.width)), round(float(box.height))) == (612, 792)
    assert result.pdf_path.name.endswith("-letter.pdf")
    for f in result.manifest["signature_fields"]:
        assert f["box"][2] < 612


def test_summary_page_numbers_are_the_checks_own_pages(
    demo_pdf: Path, demo_reader: PdfReader, demo_manifest: dict[str, Any]
) -> None:
    """Each check's page number in the summary is a link to the check itself, and the number
    printed is the page the link lands on (read with poppler's pdftotext -bbox)."""
    from pdfgeometry import page_words

    first, last = demo_manifest["sections"]["summary"]
    named = demo_reader.named_destinations
    seen: set[str] = set()
    for number in range(first, last + 1):
        page = demo_reader.pages[number - 1]
        height = float(page.mediabox.height)
        words = page_words(demo_pdf, number)
        for annot in page.get("/Annots") or []:
            link = annot.get_object()
            target = str(link.get("/Dest", ""))
            if not target.startswith("chk-"):
                continue
            lands = demo_reader.get_destination_page_number(named[target]) + 1
            x1, y1, x2, y2 = (float(v) for v in link["/Rect"])
            printed = [
                w.text
                for w in words
                if x1 - 1 <= (w.x0 + w.x1) / 2 <= x2 + 1
                and y1 - 1 <= height - (w.y0 + w.y1) / 2 <= y2 + 1
            ]
            assert printed == [str(lands)], (target, printed, lands)
            # the check is on a page of a sheet
            assert any(s["pages"][0] <= lands <= s["pages"][1] for s in demo_manifest["sheets"])
            seen.add(target)
    checks = sum(len(s["checks"]) for s in demo_manifest["sheets"])
    assert len(seen) == checks  # every check of every sheet has its link


def test_tag_tree_outline_and_links(demo_pdf: Path, demo_manifest: dict[str, Any]) -> None:
    """The structure tree reads as one outline -- an H1 per part and per sheet, its sections
    H2, their sub-steps H3, never a level skipped -- and every link (contents, summary to a
    check's page, an imported value to its sheet) is a Link element of the tree, including
    those added when the chunks were joined (read with pypdf: pdfjoin.structure_summary)."""
    from calcpack.package.pdfjoin import structure_summary

    summary = structure_summary(demo_pdf.read_bytes())
    levels = summary["headings"]
    assert levels.count(1) >= len(demo_manifest["sheets"]) + 4  # sheets, front and back parts
    assert {2, 3} <= set(levels)
    assert levels[0] == 1
    assert all(b <= a + 1 for a, b in itertools.pairwise(levels)), levels
    assert summary["types"]["/Link"] >= sum(len(s["checks"]) for s in demo_manifest["sheets"])
    assert summary["untagged_links"] == 0


def test_pagination_rules(demo_pdf: Path, demo_dir: Path, demo_manifest: dict[str, Any]) -> None:
    """No heading ends a page, no page leaves more than a third of its body blank except the
    last page of a section, names wrap at word boundaries, the outline skips no level
    (measured on the PDF: tests/build/pagerules.py)."""
    from pagerules import package_problems, titleblock_names

    names = titleblock_names(demo_dir / "project")
    assert package_problems(demo_pdf, demo_manifest, names) == []


def test_pagination_rules_catch_a_heading_at_the_foot(tmp_path: Path) -> None:
    """The measurement itself: a heading pushed to the foot of a page, and a half-empty page,
    are found."""
    from pagerules import violations
    from weasyprint import HTML

    filler = "".join(f"<p>line {i}</p>" for i in range(36))
    html = (
        "<html><head><style>@page { size: A4; margin: 41mm 14mm 17mm 19mm; } "
        "p, h2 { font: 9.5pt 'Liberation Sans', 'DejaVu Sans'; margin: 0 0 2.9mm 0; } "
        "h2 { font-weight: bold; } .next { break-before: page; }</style></head><body>"
        f"<p>cover</p><p class='next'>first</p>{filler}<h2>Heading at the foot</h2>"
        "<p class='next'>half a page</p><p class='next'>last</p></body></html>"
    )
    pdf = tmp_path / "rules.pdf"
    HTML(string=html).write_pdf(pdf)
    found = violations(PdfReader(pdf), {"cover": [1, 1], "all": [2, 4]})
    assert any("Heading at the foot" in v for v in found), found
    assert any(v.startswith("page 3:") and "blank" in v for v in found), found
