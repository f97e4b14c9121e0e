"""Verdicts written as words beside the utilisation (the calc pad's output margin and the
summary of checks): the words follow the one pass rule, never a second comparison."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from calcpack.contract.verdict import (
    Verdict,
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
