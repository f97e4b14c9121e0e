"""Chunked pagination: a document laid out in pieces reads as if laid out whole.

The document here is a small stand-in for the package (same mechanisms: a running title block
with "package n of N" and "sheet n of N", a contents list numbered by ``target-counter``, named
pages per sheet, running footer strings, bookmarks, a sign-off box). Pages are counted and read
back with pypdf; the expected numbers follow from the page breaks written into the document.
"""

from __future__ import annotations

import datetime as _dt
import io
import re
from collections.abc import Callable

import pytest
from pypdf import PdfReader

from calcpack.errors import BuildError
from calcpack.package import paginate as pg
from calcpack.package.paginate import PdfAttachment, paginate, split_sections, write_pdf

CSS = """
@page { size: A6; margin: 22mm 8mm 14mm 8mm; counter-increment: sheetpage 1;
  @top-center { content: element(tb); width: 100%; }
  @bottom-center { content: string(foot); font-size: 6pt; } }
@page cover { @top-center { content: none; } }
body { font: 8pt sans-serif; }
.tb { position: running(tb); font-size: 7pt; }
.pkg::after { content: counter(page) " of " counter(pages); }
.sp::after { content: counter(sheetpage) " of " attr(data-pages); }
.cp-section, .cp-sheet { break-before: page; }
.cp-cover { page: cover; }
.cp-strings { string-set: foot attr(data-foot); height: 0; }
h1 { bookmark-level: 1; font-size: 9pt; }
ol.toc a::after { content: leader(".") target-counter(attr(href), page); }
.more { break-before: page; }
#cp-sign-preparer { height: 20mm; border: 1px solid black; margin-top: 10mm; }
"""

SHEET_PAGES = {"s1.ipynb": 1, "s2.ipynb": 3, "s3.ipynb": 2, "s4.ipynb": 1}
"""Pages each stand-in sheet takes (forced breaks)."""
SHEET_IDS = {path: f"sheet-{i}" for i, path in enumerate(SHEET_PAGES, start=1)}
SECTION_IDS = ["cover", "contents", *SHEET_IDS.values(), "summary"]


def stand_in(counts: dict[str, int]) -> str:
    """The stand-in package with the given per-sheet page counts written into title blocks."""
    rules = "".join(
        f"@page :nth(1 of sheet{i}) {{ counter-reset: sheetpage 0; }}"
        for i in range(1, len(SHEET_PAGES) + 1)
    )
    strings = '<div class="cp-strings" data-foot="Invented Firm · Job 0001"></div>'

    def titleblock(pages: int | None) -> str:
        sheet = f'<span class="sp" data-pages="{pages}"></span>' if pages else "-"
        return f'<div class="tb">package <span class="pkg"></span> · sheet {sheet}</div>'

    toc = "".join(
        f'<li><a href="#{ident}">{ident}</a></li>' for ident in SECTION_IDS if ident != "cover"
    )
    parts = [
        f"<!DOCTYPE html><html><head><style>{CSS}{rules}</style></head><body>",
        f'<section class="cp-cover" id="cover">{strings}<h1>Cover</h1>'
        '<div id="cp-sign-preparer"></div></section>',
        f'<section class="cp-section" id="contents">{titleblock(None)}<h1>Contents</h1>'
        f'<ol class="toc">{toc}</ol></section>',
    ]
    for i, (path, pages) in enumerate(SHEET_PAGES.items(), start=1):
        more = "".join(f'<p class="more">page {k}</p>' for k in range(2, pages + 1))
        parts.append(
            f'<section class="cp-sheet" id="sheet-{i}" style="page: sheet{i}">'
            f"{titleblock(counts.get(path, 0))}<h1>Sheet {i}</h1><p>page 1</p>{more}</section>"
        )
    parts.append(
        f'<section class="cp-section" id="summary">{titleblock(None)}<h1>Summary</h1></section>'
    )
    parts.append("</body></html>")
    return "\n".join(parts)


def build(make_html: Callable[[dict[str, int]], str] = stand_in, **kw: object) -> bytes:
    layout = paginate(
        make_html,
        sheet_ids=SHEET_IDS,
        section_ids=SECTION_IDS,
        roles=("preparer",),
        **kw,  # type: ignore[arg-type]
    )
    created = _dt.datetime(2026, 1, 15, tzinfo=_dt.UTC)
    return write_pdf(
        layout,
        created=created,
        attachments=[PdfAttachment("note.json", b'{"a": 1}', "a note")],
        identifier_seed=b"test",
    )


@pytest.fixture
def one_sheet_per_chunk(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(pg, "CHUNK_HTML_CHARS", 1)


def expected_pages() -> dict[str, tuple[int, int]]:
    """Section -> (first, last) page, from the forced breaks (cover and contents: 1 page)."""
    pages, page = {}, 1
    for ident in SECTION_IDS:
        count = 1
        for path, sid in SHEET_IDS.items():
            if sid == ident:
                count = SHEET_PAGES[path]
        pages[ident] = (page, page + count - 1)
        page += count
    return pages


def test_split_sections_cuts_at_the_top_level_sections() -> None:
    html = stand_in({})
    head, sections, tail = split_sections(html, SECTION_IDS)
    assert head.endswith("<body>")
    assert [ident for ident, _ in sections] == SECTION_IDS
    rejoined = head + "".join(text for _, text in sections) + tail
    assert "".join(rejoined.split()) == "".join(html.split())  # only line breaks dropped
    with pytest.raises(BuildError, match="'appendix'"):
        split_sections(html, [*SECTION_IDS, "appendix"])


@pytest.mark.usefixtures("one_sheet_per_chunk")
def test_chunked_layout_numbers_pages_as_one_document() -> None:
    reader = PdfReader(io.BytesIO(build()))
    pages = expected_pages()
    total = pages["summary"][1]
    assert len(reader.pages) == total
    texts = [" ".join(page.extract_text().split()) for page in reader.pages]
    for number, text in enumerate(texts[1:], start=2):  # the cover has no title block
        assert f"package {number} of {total}" in text, (number, text)
        assert "Invented Firm · Job 0001" in text, number  # the running footer in every chunk
    for path, ident in SHEET_IDS.items():
        first, last = pages[ident]
        for k, page in enumerate(range(first, last + 1), start=1):
            assert f"sheet {k} of {SHEET_PAGES[path]}" in texts[page - 1], (ident, page)
    contents = texts[pages["contents"][0] - 1]
    for ident in SECTION_IDS[1:]:
        m = re.search(re.escape(ident) + r" \.+ ?(\d+)", contents)
        assert m, (ident, contents)
        assert int(m.group(1)) == pages[ident][0]


@pytest.mark.usefixtures("one_sheet_per_chunk")
def test_chunked_layout_keeps_bookmarks_links_and_attachment() -> None:
    reader = PdfReader(io.BytesIO(build()))
    pages = expected_pages()
    marks = {o.title: reader.get_destination_page_number(o) + 1 for o in reader.outline}
    assert marks == {
        "Cover": 1,
        "Contents": pages["contents"][0],
        **{f"Sheet {i}": pages[f"sheet-{i}"][0] for i in range(1, 5)},
        "Summary": pages["summary"][0],
    }
    # Every contents entry links to its section, across chunks too.
    named = reader.named_destinations
    contents = reader.pages[pages["contents"][0] - 1]
    targets = {str(a.get_object()["/Dest"]) for a in contents["/Annots"]}
    assert targets == set(SECTION_IDS[1:])
    for ident in targets:
        assert reader.get_destination_page_number(named[ident]) + 1 == pages[ident][0]
    assert reader.attachments["note.json"] == [b'{"a": 1}']


@pytest.mark.usefixtures("one_sheet_per_chunk")
def test_sign_off_box_is_measured_on_the_cover() -> None:
    layout = paginate(stand_in, sheet_ids=SHEET_IDS, section_ids=SECTION_IDS, roles=("preparer",))
    (field,) = layout.signature_fields
    x1, y1, x2, y2 = field["box"]
    assert field["page"] == 0
    width, height = 297.64, 419.53  # A6 in points
    assert 0 < x1 < x2 < width
    assert 0 < y1 < y2 < height
    assert y2 - y1 == pytest.approx(20 / 25.4 * 72 + 1.5, abs=0.1)  # 20 mm plus the border


def test_same_bytes_whatever_the_chunks_or_the_guess(monkeypatch: pytest.MonkeyPatch) -> None:
    whole_sheets = build()  # the sheets fit one chunk
    monkeypatch.setattr(pg, "CHUNK_HTML_CHARS", 1)
    wrong = dict.fromkeys(SECTION_IDS, 5)
    right = {ident: b - a + 1 for ident, (a, b) in expected_pages().items()}
    assert build(guess=wrong) == build(guess=right)
    # Chunking changes how the PDF is assembled, not what it shows.
    split = PdfReader(io.BytesIO(build(guess=right)))
    whole = PdfReader(io.BytesIO(whole_sheets))
    assert [p.extract_text() for p in split.pages] == [p.extract_text() for p in whole.pages]


@pytest.mark.usefixtures("one_sheet_per_chunk")
def test_worker_processes_give_the_same_pdf() -> None:
    from calcpack.package.execute import worker_pool

    with worker_pool(2) as pool:
        assert build(pool=pool) == build()


def test_counts_that_never_settle_are_refused(one_sheet_per_chunk: None) -> None:
    flip = iter(range(100))

    def unstable(counts: dict[str, int]) -> str:
        # A document whose sheet 1 grows every time it is laid out.
        extra = '<p class="more">again</p>' * next(flip)
        return stand_in(counts).replace("<h1>Sheet 1</h1>", "<h1>Sheet 1</h1>" + extra)

    with pytest.raises(BuildError, match="did not settle"):
        build(unstable)


@pytest.mark.usefixtures("one_sheet_per_chunk")
def test_bodies_filled_in_per_chunk_give_the_same_pdf() -> None:
    filled: list[int] = []

    def stubbed(counts: dict[str, int]) -> str:
        html = stand_in(counts)
        for i in range(1, len(SHEET_PAGES) + 1):
            html = html.replace(f"<h1>Sheet {i}</h1>", f"<!--body-{i}-->")
        return html

    def fill(html: str) -> str:
        def body(m: re.Match[str]) -> str:
            filled.append(int(m.group(1)))
            return f"<h1>Sheet {m.group(1)}</h1>"

        return re.sub(r"<!--body-(\d+)-->", body, html)

    assert build(stubbed, fill=fill) == build()
    assert set(filled) == {1, 2, 3, 4}


def _with_check_link(counts: dict[str, int]) -> str:
    """The stand-in with a check on the last page of sheet 2 and the summary linking to it
    (the summary of checks' page column: the check's own page, not its sheet's first)."""
    html = stand_in(counts)
    html = html.replace("<p class=\"more\">page 3</p>", '<p class="more">page 3</p>'
                        '<div id="chk-s2-1">Check: bending</div>')  # fmt: skip
    css = 'a.ref::after { content: "on page " target-counter(attr(href), page); }'
    html = html.replace("</style>", css + "</style>", 1)
    return html.replace(
        "<h1>Summary</h1>",
        '<h1>Summary</h1><p>Bending <a class="ref" data-cp-in="sheet-2" href="#chk-s2-1"></a></p>',
    )


@pytest.mark.parametrize("chunked", [False, True], ids=["one chunk", "chunk per sheet"])
def test_a_link_to_a_check_shows_the_check_s_own_page(
    chunked: bool, monkeypatch: pytest.MonkeyPatch
) -> None:
    if chunked:
        monkeypatch.setattr(pg, "CHUNK_HTML_CHARS", 1)
    passes: list[bool] = []
    original = pg._one_pass

    def recording(*args: object, **kwargs: object) -> object:
        result = original(*args, **kwargs)  # type: ignore[arg-type]
        passes.append(result[0] is not None)
        return result

    monkeypatch.setattr(pg, "_one_pass", recording)
    right = {ident: b - a + 1 for ident, (a, b) in expected_pages().items()}
    reader = PdfReader(io.BytesIO(build(_with_check_link, guess=right)))
    pages = expected_pages()
    check_page = pages["sheet-2"][0] + 2  # the third page of sheet 2
    texts = [" ".join(page.extract_text().split()) for page in reader.pages]
    assert "Check: bending" in texts[check_page - 1]
    assert f"Bending on page {check_page}" in texts[pages["summary"][0] - 1]
    # The counts were right, so a second pass only moved the link's number.
    assert passes == [True, True]


def test_a_link_to_an_anchor_not_laid_out_shows_its_section() -> None:
    from calcpack.package.html_chunks import number_links

    html = '<a class="cp-pageref" data-cp-in="sheet-2" href="#chk-x-1"></a>'
    assert 'data-cp-page="5"' in number_links(html, {"sheet-2": 5})
    assert 'data-cp-page="7"' in number_links(html, {"sheet-2": 5, "chk-x-1": 7})
    assert "data-cp-page" not in number_links(html, {})
