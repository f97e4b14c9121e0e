"""Verdicts written as words beside the utilisation (the calc pad's output margin and the
summary of checks): the words follow the one pass rule, never a second comparison, and cite
the clause only (the way a reference to a provision is written is common practice: standard,
then clause, table or equation number; notes on a source are not part of it)."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from calcpack.contract.verdict import (
    Verdict,
    clause_cited,
    passes,
    ratio_text,
    verdict_statement,
    verdict_words,
)


def test_statement_reads_as_the_checker_writes_it() -> None:
    assert verdict_statement(0.64, Verdict.OK, "§F2") == "0.640 ≤ 1.00, satisfies §F2"
    assert verdict_statement(0.64, Verdict.OK, "§F2", sig=2) == "0.64 ≤ 1.0, satisfies §F2"
    assert verdict_statement(1.12, Verdict.NOT_OK, "§F2") == "1.12 > 1.00, DOES NOT SATISFY §F2"
    assert verdict_statement(None, Verdict.NOT_COVERED, "§J10") == "NOT COVERED"


def test_words_without_a_clause() -> None:
    assert verdict_words("OK") == "satisfied"
    assert verdict_words("NOT OK", "  ") == "NOT SATISFIED"
    assert verdict_words("NOT COVERED", "§F2") == "NOT COVERED"
    assert verdict_words("maybe") == "NOT COVERED"  # an unknown word never reads as a pass


def test_ratio_needs_a_number() -> None:
    assert ratio_text(None) == ""
    assert ratio_text(math.nan) == ""
    assert ratio_text(1.0 + 1e-13) == "1.00 ≤ 1.00"  # within the pass tolerance


@given(st.floats(min_value=0.0, max_value=50.0, allow_nan=False))
def test_relation_and_words_follow_the_pass_rule(u: float) -> None:
    verdict = Verdict.of(u)
    statement = verdict_statement(u, verdict, "§G2.1")
    assert ("≤" in statement) == passes(u)
    assert statement.endswith("satisfies §G2.1") == passes(u)
    assert statement.endswith("DOES NOT SATISFY §G2.1") == (not passes(u))


def test_the_smallest_numbers_are_written_not_divided_by_zero() -> None:
    """A subnormal float (a utilisation of a vanishing demand) is written in engineering
    notation like any other; the exponent's power of ten is not formed (it underflows)."""
    from calcpack.contract.numbers import format_number

    assert format_number(5e-324, 3) == "4.94×10⁻³²⁴"
    assert ratio_text(5e-324) == "4.94×10⁻³²⁴ ≤ 1.00"


def test_a_verdict_cites_the_clause_not_the_notes_of_its_reference() -> None:
    """The reference margin keeps the whole reference; the verdict beside the utilisation
    cites the clause only (references as the example sheets and the checks write them)."""
    words = verdict_words("OK", "UK NA to BS EN 1993-1-1 NA.2.23 (span/360, from memory)")
    assert words == "satisfies UK NA to BS EN 1993-1-1 NA.2.23"
    assert verdict_words("NOT OK", "UK NA to BS EN 1995-1-1 Table NA.5 (from memory)") == (
        "DOES NOT SATISFY UK NA to BS EN 1995-1-1 Table NA.5"
    )
    assert (
        verdict_words("OK", "ASCE/SEI 7-16 §2.4.1, from memory") == "satisfies ASCE/SEI 7-16 §2.4.1"
    )
    statement = verdict_statement(
        0.5, "OK", "NDS 2018 Table 12.3.3 footnote (hot-rolled steel, from memory)"
    )
    assert statement == "0.500 ≤ 1.00, satisfies NDS 2018 Table 12.3.3 footnote"
    # a limit's words or ratio are not a clause: the verdict stands alone
    assert verdict_words("OK", "span/limit (usual building-code limit, e.g. IBC Table 1604.3)") == (
        "satisfied"
    )
    assert verdict_words("OK", "span/360") == "satisfied"
    assert verdict_words("NOT OK", "supplier data") == "NOT SATISFIED"


def test_the_numbers_of_a_clause_are_kept() -> None:
    for clause in (
        "§F2",
        "cl. 5.1",
        "EN 1995-1-1 Eq. (6.33)",
        "EN 1990 Eq. (6.10a)",
        "AISC 360-16 §J3.6(b)",
        "EN 1995-1-1 §7.2, UK NA Table NA.5",
    ):
        assert clause_cited(clause) == clause
        assert verdict_words("OK", clause) == f"satisfies {clause}"
    assert clause_cited("NDS 2018 §3.3 (C_L = 1.0, braced)") == "NDS 2018 §3.3"
    assert clause_cited("listed load (ESR-0000, (a) note)") == ""  # nested notes go whole
    assert clause_cited(None) == clause_cited("  ") == ""


_REF_PART = st.sampled_from(
    ["EN 1995-1-1", " §6.1.2", " Eq. (6.33)", "(a)", " (from memory)", ", from memory",
     " (span/360, common practice)", "; common practice", " Table NA.5", "span/360", " ", ",",
     "(", ")", "supplier data", "L/240"]
)  # fmt: skip


@given(st.lists(_REF_PART, max_size=8).map("".join))
def test_the_clause_of_a_clause_is_itself_and_carries_no_note(ref: str) -> None:
    clause = clause_cited(ref)
    assert clause_cited(clause) == clause
    assert "memory" not in clause
    assert "common practice" not in clause
    assert clause == "" or any(ch.isdigit() for ch in clause)
