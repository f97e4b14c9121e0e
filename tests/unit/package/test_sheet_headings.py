"""A sheet's headings nest under the sheet's own H1 without a skipped level, whatever levels
its markdown cells, heading steps and blocks were written with (PDF/UA-1 and WCAG 2.x
technique H42 ask for headings that follow the outline; the bookmarks read the same levels)."""

from __future__ import annotations

import re

from hypothesis import given
from hypothesis import strategies as st

from calcpack.package.sheetdoc import nest_headings


def levels(body: str) -> list[int]:
    return [int(n) for n in re.findall(r"<h([1-6])\b", body)]


def test_a_sheet_written_with_any_levels_reads_as_one_outline() -> None:
    body = (
        "<h1>Lintel</h1><p>x</p>"  # a markdown title the sheet head already shows
        '<div class="cp-step cp-heading"><h2>Inputs</h2></div>'
        '<div class="cp-step cp-block"><div class="cp-step cp-heading"><h4>Reactions</h4></div>'
        "</div><h3>Checks</h3><h6>Bending</h6><h2>Notes</h2>"
    )
    out = nest_headings(body)
    assert levels(out) == [2, 2, 3, 3, 4, 2]
    assert "<h3>Reactions</h3>" in out  # closed as opened
    assert "<h4>Bending</h4>" in out
    assert re.sub(r"</?h\d", "", out) == re.sub(r"</?h\d", "", body)  # nothing else changed


def test_attributes_stay_with_their_heading() -> None:
    out = nest_headings('<h4 class="cp-bm" style="x">Loads</h4>')
    assert out == '<h2 class="cp-bm" style="x">Loads</h2>'


def test_other_tags_starting_with_h_are_left_alone() -> None:
    body = "<h2>A</h2><hr><header>b</header><h5>C</h5>"
    assert nest_headings(body) == "<h2>A</h2><hr><header>b</header><h3>C</h3>"


@given(st.lists(st.integers(min_value=1, max_value=6), max_size=30))
def test_no_level_is_skipped(written: list[int]) -> None:
    body = "".join(f"<h{n}>t{i}</h{n}><p>p</p>" for i, n in enumerate(written))
    got = levels(nest_headings(body))
    assert len(got) == len(written)
    previous = 1  # the sheet's H1
    for level in got:
        assert 2 <= level <= previous + 1
        previous = level
    # a heading never rises above where it was written: the outline only closes gaps
    assert all(g <= max(w, 2) for g, w in zip(got, written, strict=True))
