"""Flattening the structure tree (calcpack.package.pdf_tree) keeps what the tags mean.

The document is a small HTML page laid out by WeasyPrint as a tagged PDF over four pages:
paragraphs with spans, nested divisions, a table with header cells, a figure with
alternative text, a link, and a title block repeated in each page's top margin (a running
element, as the package's title block). The marked content of each page is read from its
content stream (the ``/MCID`` of each ``BDC`` operator, ISO 32000-1 §14.6) and followed back
through the parent tree (§14.7.4.4) to its structure element; the element must hold that id in
its ``/K`` (as an integer on its ``/Pg`` page, or as a marked-content reference), be the only
element that does, and reach the tree root by its ``/P`` chain. poppler's ``pdfinfo -struct-text``
reads the flattened file as an independent reader.
"""

from __future__ import annotations

import io
import shutil
import subprocess
from collections import Counter
from pathlib import Path
from typing import Any

import pytest
from pypdf import PdfReader, PdfWriter
from pypdf.generic import ArrayObject, ContentStream, DictionaryObject

from calcpack.package.pdf_tree import FLATTENED_TYPES, drop_unreachable, flatten_structure
from calcpack.package.pdfjoin import join_chunks

_ROWS = "".join(
    f"<tr><td><span>row {i}</span></td><td><div><span>{i * 1.5:.1f}</span> kN</div></td></tr>"
    for i in range(8)
)
_SVG = (
    "data:image/svg+xml;utf8,<svg xmlns='http://www.w3.org/2000/svg' width='40' height='20'>"
    "<rect width='40' height='20'/></svg>"
)
_PAGE = (
    "@page { size: A7; margin-top: 15mm; @top-center { content: element(block) } }"
    " .block { position: running(block) }"
)
HTML = f"""<html lang="en"><head><style>{_PAGE}</style></head><body>
<div class="block"><table><tr><td><span>Job</span> 2417</td><td>Fernbrook</td></tr></table></div>
<h1>Lintel <span>L1</span></h1>
<div><div><p>The lintel carries <span>the wall</span> over a <span><span>1.2 m</span></span>
opening; see <a href="#loads">the loads</a>.</p>
<p>A phrase <span>en français</span> in another language.</p></div></div>
<table><thead><tr><th>load</th><th>value</th></tr></thead><tbody>{_ROWS}</tbody></table>
<div><img alt="Elevation of lintel L1" src="{_SVG}"></div>
<h2 id="loads">Loads</h2><div><p>Dead <span>2.5 kN/m</span>, imposed <span>1.5 kN/m</span>.</p>
</div></body></html>"""


@pytest.fixture(scope="module")
def tagged() -> bytes:
    import weasyprint

    pdf: bytes = weasyprint.HTML(string=HTML).write_pdf(pdf_variant="pdf/a-3b", pdf_tags=True)
    return pdf


@pytest.fixture(scope="module")
def flat(tagged: bytes) -> bytes:
    return join_chunks(tagged, [], [])


def page_ids(reader: PdfReader) -> list[tuple[int, int]]:
    """(page index, MCID) of every marked-content sequence in the page streams, in order."""
    out = []
    for index, page in enumerate(reader.pages):
        content = ContentStream(page.get_contents(), reader)
        for operands, operator in content.operations:
            properties = operands[1] if operator == b"BDC" else None
            if isinstance(properties, DictionaryObject) and "/MCID" in properties:
                out.append((index, int(operands[1]["/MCID"])))
    return out


def owned_ids(reader: PdfReader) -> tuple[list[tuple[int, int]], dict[tuple[int, int], list[int]]]:
    """A depth-first walk of the structure tree: the (page index, MCID) of every marked-content
    kid in reading order, and for each, the object numbers of the elements holding it."""
    pages = {p.indirect_reference.idnum: i for i, p in enumerate(reader.pages)}
    order: list[tuple[int, int]] = []
    owners: dict[tuple[int, int], list[int]] = {}

    def walk(ref: Any, page: Any) -> None:
        element = ref.get_object()
        page = element.get("/Pg", page)
        kids = element.get("/K")
        kids = list(kids.get_object()) if isinstance(kids.get_object(), ArrayObject) else [kids]
        for kid in kids:
            obj = kid.get_object()
            if isinstance(obj, int):
                key = (pages[page.idnum], int(obj))
            elif isinstance(obj, DictionaryObject) and obj.get("/Type") == "/MCR":
                key = (pages[obj.get("/Pg", page).idnum], int(obj["/MCID"]))
            elif isinstance(obj, DictionaryObject) and "/S" in obj:
                walk(kid, page)
                continue
            else:
                continue
            order.append(key)
            owners.setdefault(key, []).append(ref.idnum)

    root = reader.root_object["/StructTreeRoot"]
    for kid in root["/K"] if isinstance(root["/K"], list) else [root.raw_get("/K")]:
        walk(kid, None)
    return order, owners


def element_counts(reader: PdfReader) -> Counter[str]:
    counts: Counter[str] = Counter()
    stack = [reader.root_object["/StructTreeRoot"].raw_get("/K")]
    while stack:
        obj = stack.pop().get_object()
        if isinstance(obj, ArrayObject):
            stack.extend(obj)
        elif isinstance(obj, DictionaryObject) and "/S" in obj and "/K" in obj:
            counts[str(obj["/S"])] += 1
            stack.append(obj.raw_get("/K"))
    return counts


def test_flattening_drops_bare_grouping_elements(tagged: bytes, flat: bytes) -> None:
    before = element_counts(PdfReader(io.BytesIO(tagged)))
    after = element_counts(PdfReader(io.BytesIO(flat)))
    assert sum(after.values()) < sum(before.values()) / 2
    # what WeasyPrint wrote
    assert before["/Span"] > 40
    assert before["/Div"] > 10
    assert after["/Span"] == after["/Div"] == after["/NonStruct"] == 0
    for kind in set(before) - FLATTENED_TYPES:
        assert after[kind] == before[kind], kind


def test_the_dropped_objects_are_not_written(tagged: bytes, flat: bytes) -> None:
    def live(pdf: bytes) -> int:
        reader = PdfReader(io.BytesIO(pdf))
        numbers = {n for table in reader.xref.values() for n in table}
        numbers |= set(reader.xref_objStm)  # objects kept in object streams
        return sum(1 for n in numbers - {0} if reader.get_object(n) is not None)

    before = element_counts(PdfReader(io.BytesIO(tagged)))
    after = element_counts(PdfReader(io.BytesIO(flat)))
    dropped = sum(before.values()) - sum(after.values())
    assert live(flat) <= live(tagged) - dropped


def test_every_marked_content_id_has_one_owner_that_reaches_the_root(flat: bytes) -> None:
    reader = PdfReader(io.BytesIO(flat))
    root = reader.root_object["/StructTreeRoot"]
    nums = root["/ParentTree"]["/Nums"]
    parents = dict(zip(nums[0::2], nums[1::2], strict=True))
    _, owners = owned_ids(reader)
    ids = page_ids(reader)
    assert len(ids) > 50
    assert {page for page, _ in ids} == set(range(len(reader.pages)))
    for page, mcid in ids:
        owner = parents[reader.pages[page]["/StructParents"]].get_object()[mcid]
        assert owners[(page, mcid)] == [owner.idnum], (page, mcid)
        element = owner.get_object()
        for _ in range(100):
            if element.get("/Type") == "/StructTreeRoot":
                break
            element = element["/P"]
        assert element.get("/Type") == "/StructTreeRoot"
    assert set(owners) == set(ids)  # nothing in the tree that is not on a page


def test_the_repeated_title_block_becomes_a_pagination_artifact(tagged: bytes, flat: bytes) -> None:
    """WeasyPrint tags each page's copy of the title block with elements the tree does not hold
    (their parent does not list them): no reader of the tree meets that content. Flattened, it
    is marked as a pagination artifact and leaves the parent tree; its text stays text."""
    before = PdfReader(io.BytesIO(tagged))
    _, owners = owned_ids(before)
    outside = [key for key in page_ids(before) if key not in owners]
    assert len(outside) >= len(before.pages)  # some in every page's margin
    reader = PdfReader(io.BytesIO(flat))
    artifacts = [page.get_contents().get_data().count(b"/Artifact BMC") for page in reader.pages]
    originally = [page.get_contents().get_data().count(b"/Artifact BMC") for page in before.pages]
    assert sum(artifacts) - sum(originally) == len(outside)
    assert all(page.extract_text().count("Fernbrook") == 1 for page in reader.pages)


def test_reading_order_is_unchanged(tagged: bytes, flat: bytes) -> None:
    before, _ = owned_ids(PdfReader(io.BytesIO(tagged)))
    after, _ = owned_ids(PdfReader(io.BytesIO(flat)))
    assert after == before
    assert len(after) > 50


def test_content_moved_across_a_page_becomes_a_marked_content_reference(flat: bytes) -> None:
    """WeasyPrint gives each element the page its content is on, so the case is made here: a
    table cell of the second page (flattened already: the cell holds its text) is given a bare
    ``Div`` holding its content, and is itself
    placed on the first page (it then holds no content of its own, so its ``/Pg`` says nothing).
    Flattened, the cell holds its content again, as references naming the second page, and the
    parent tree names the cell."""
    from pypdf.generic import NameObject

    writer = PdfWriter(clone_from=PdfReader(io.BytesIO(flat)))
    first, second = (p.indirect_reference for p in writer.pages[:2])
    cell = None
    stack = [writer.root_object["/StructTreeRoot"].raw_get("/K")]
    while stack and cell is None:
        node = stack.pop()
        obj = node.get_object()
        if isinstance(obj, ArrayObject):
            stack.extend(obj)
        elif isinstance(obj, DictionaryObject) and "/K" in obj:
            on_second = obj.get("/Pg") == second
            if obj.get("/S") == "/TD" and on_second and any(isinstance(k, int) for k in obj["/K"]):
                cell = node
            stack.append(obj.raw_get("/K"))
    assert cell is not None
    element = cell.get_object()
    division = DictionaryObject(
        {
            NameObject("/Type"): NameObject("/StructElem"),
            NameObject("/S"): NameObject("/Div"),
            NameObject("/P"): cell,
            NameObject("/Pg"): second,
            NameObject("/K"): element["/K"],
        }
    )
    wrapper = writer._add_object(division)
    element[NameObject("/K")] = ArrayObject([wrapper])
    element[NameObject("/Pg")] = first
    ids = [int(k) for k in division["/K"] if isinstance(k, int)]
    root = writer.root_object["/StructTreeRoot"]
    nums = root["/ParentTree"]["/Nums"]
    row = dict(zip(nums[0::2], nums[1::2], strict=True))[writer.pages[1]["/StructParents"]]
    for mcid in ids:
        row.get_object()[mcid] = wrapper
    before = io.BytesIO()
    writer.write(before)

    flatten_structure(writer)
    after = io.BytesIO()
    writer.write(after)
    reader = PdfReader(after)
    element = reader.get_object(cell.idnum)
    kids = [k.get_object() for k in element["/K"]]
    assert [int(k["/MCID"]) for k in kids] == ids
    assert all(k["/Type"] == "/MCR" for k in kids)
    assert all(k.raw_get("/Pg").idnum == second.idnum for k in kids)
    parents = reader.root_object["/StructTreeRoot"]["/ParentTree"]["/Nums"]
    row = dict(zip(parents[0::2], parents[1::2], strict=True))[reader.pages[1]["/StructParents"]]
    assert {row.get_object()[mcid].idnum for mcid in ids} == {cell.idnum}
    assert owned_ids(reader)[0] == owned_ids(PdfReader(before))[0]


@pytest.mark.skipif(shutil.which("pdfinfo") is None, reason="needs poppler's pdfinfo")
def test_poppler_reads_the_flattened_tree(tagged: bytes, flat: bytes, tmp_path: Path) -> None:
    def struct_text(pdf: bytes) -> list[str]:
        path = tmp_path / "f.pdf"
        path.write_bytes(pdf)
        run = subprocess.run(
            ["pdfinfo", "-struct-text", str(path)], capture_output=True, text=True, check=True
        )
        assert run.stderr == ""
        return [line.strip() for line in run.stdout.splitlines() if line.strip().startswith('"')]

    def words(lines: list[str]) -> str:
        return " ".join(" ".join(line.strip('"').split()) for line in lines)

    assert words(struct_text(flat)) == words(struct_text(tagged))
    assert "en français" in words(struct_text(flat))


def test_a_grouping_element_with_an_attribute_is_kept(tagged: bytes) -> None:
    """WeasyPrint writes no attribute on a span; given a language and a replacement text (as
    another writer might), the spans are kept with what they hold."""
    from pypdf.generic import NameObject, TextStringObject

    writer = PdfWriter(clone_from=PdfReader(io.BytesIO(tagged)))
    spans = []
    stack = [writer.root_object["/StructTreeRoot"].raw_get("/K")]
    while stack:
        obj = stack.pop().get_object()
        if isinstance(obj, ArrayObject):
            stack.extend(reversed(obj))
        elif isinstance(obj, DictionaryObject) and "/K" in obj:
            if obj.get("/S") == "/Span":
                spans.append(obj)
            stack.append(obj.raw_get("/K"))
    spans[3][NameObject("/Lang")] = TextStringObject("fr")
    spans[7][NameObject("/ActualText")] = TextStringObject("one point two metres")
    result = flatten_structure(writer)
    out = io.BytesIO()
    writer.write(out)
    reader = PdfReader(out)
    assert element_counts(reader)["/Span"] == 2
    assert result.elements_after == sum(element_counts(reader).values())
    assert result.elements_after < result.elements_before
    assert result.moved_ids > 0
    assert owned_ids(reader)[0] == owned_ids(PdfReader(io.BytesIO(tagged)))[0]


def test_a_document_without_tags_is_left_alone(tagged: bytes) -> None:
    writer = PdfWriter(clone_from=PdfReader(io.BytesIO(tagged)))
    del writer.root_object["/StructTreeRoot"]
    drop_unreachable(writer)
    result = flatten_structure(writer)
    assert (result.elements_before, result.elements_after) == (0, 0)
