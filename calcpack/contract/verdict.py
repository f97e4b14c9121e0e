"""The verdict of a design check and the one rule that decides it.

A check passes when its utilisation (|demand| / capacity) is not over 1 beyond floating-point
rounding (:data:`PASS_TOLERANCE`). Every part of calcpack that says OK or NOT OK -- the sheet's
check steps, the design-check results, the panels, the manifest reader and the summary of checks
-- asks :func:`passes` or :meth:`Verdict.of`; nothing else compares a utilisation with 1.
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from enum import StrEnum
from typing import Any

from calcpack.contract.numbers import format_number

__all__ = [
    "PASS_TOLERANCE",
    "Verdict",
    "check_sort_key",
    "clause_cited",
    "is_classification",
    "passes",
    "ratio_text",
    "verdict_statement",
    "verdict_words",
]

#: Utilisations up to ``1 + PASS_TOLERANCE`` pass: a capacity computed to equal the demand
#: (u = 1 in exact arithmetic) must not fail on the last bit of a float (common practice).
PASS_TOLERANCE = 1e-12


def passes(utilisation: float) -> bool:
    """True when a utilisation passes: not over 1 beyond floating-point rounding."""
    return utilisation <= 1.0 + PASS_TOLERANCE


class Verdict(StrEnum):
    """The verdict words of a check (a ``str``: ``Verdict.OK == "OK"``, JSON writes the word)."""

    OK = "OK"
    NOT_OK = "NOT OK"
    NOT_COVERED = "NOT COVERED"

    @classmethod
    def of(cls, utilisation: float | None) -> Verdict:
        """The verdict for a utilisation; ``None`` (no number could be given) is NOT COVERED."""
        if utilisation is None or not math.isfinite(utilisation):
            return cls.NOT_COVERED
        return cls.OK if passes(utilisation) else cls.NOT_OK

    @classmethod
    def parse(cls, word: Any) -> Verdict | None:
        """The verdict a recorded word names, or ``None`` if it names none."""
        try:
            return cls(word)
        except ValueError:
            return None


def ratio_text(utilisation: float | None, sig: int = 3) -> str:
    """The utilisation against the limit in words a checker reads: ``"0.64 ≤ 1.00"``,
    ``"1.12 > 1.00"`` (the relation by :func:`passes`); ``""`` when there is no number."""
    if utilisation is None or not math.isfinite(utilisation):
        return ""
    relation = "≤" if passes(utilisation) else ">"
    return f"{format_number(utilisation, sig)} {relation} {format_number(1.0, sig)}"


_MARKS = re.compile(r"[,;]?\s*(from memory|common practice)", re.IGNORECASE)
"""The marks of a source's standing (recalled, or a fact of the trade) written outside
parentheses."""
_RATIO = re.compile(r"^[A-Za-z_]\w*\s*/\s*[\w.]+$")
"""A limit written as a ratio ("span/360", "L/240"): the limit, not the clause that sets it."""


def _without_notes(text: str) -> str:
    """``text`` without its notes in parentheses: groups (nested ones included) holding words,
    a space or a comma, unlike the parentheses of a clause's own number, "Eq. (6.33)",
    "§J3.6(b)"."""
    out: list[str] = []
    depth, group = 0, ""
    for ch in text:
        if depth:
            group += ch
            depth += {"(": 1, ")": -1}.get(ch, 0)
            if depth == 0 and not any(c in group for c in " ,;"):
                out.append(group)  # a clause's own number: kept
            continue
        if ch == "(":
            depth, group = 1, ch
        else:
            out.append(ch)
    if depth:  # unbalanced: keep what was read
        out.append(group)
    return re.sub(r"\s+", " ", "".join(out)).strip()


def clause_cited(ref: str | None) -> str:
    """The clause a verdict cites, from a check's reference: the reference without its notes in
    parentheses ("(from memory)", "(span/360, common practice)") or after a comma ("…, from
    memory"), or ``""`` when what is left names no numbered provision (no digit, or only a limit
    ratio such as "span/360"). The reference margin keeps the whole reference; the verdict cites
    the clause only.

    ``"UK NA to BS EN 1993-1-1 NA.2.23 (span/360, from memory)"`` gives ``"UK NA to BS EN
    1993-1-1 NA.2.23"``; ``"EN 1995-1-1 Eq. (6.33)"`` is kept whole."""
    text, before = (ref or "").strip(), None
    while text != before:  # until no note is left (removing one may close up another)
        before = text
        text = _MARKS.sub("", _without_notes(text)).strip(" ,;:")
    if not any(ch.isdigit() for ch in text) or _RATIO.match(text):
        return ""
    return text


def verdict_words(verdict: Any, ref: str | None = None) -> str:
    """A verdict written as words with the clause it answers to: ``"satisfies §F2"``, ``"DOES
    NOT SATISFY §F2"``, ``"NOT COVERED"``; without a clause ``"satisfied"`` / ``"NOT
    SATISFIED"``. A failure is written in capitals, so it reads without colour. Only the
    clause of ``ref`` is cited (:func:`clause_cited`), never its notes."""
    clause = clause_cited(ref)
    word = Verdict.parse(verdict)
    if word == Verdict.OK:
        return f"satisfies {clause}" if clause else "satisfied"
    if word == Verdict.NOT_OK:
        return f"DOES NOT SATISFY {clause}" if clause else "NOT SATISFIED"
    return "NOT COVERED"


def verdict_statement(
    utilisation: float | None, verdict: Any, ref: str | None = None, sig: int = 3
) -> str:
    """The verdict as one line: ``"0.64 ≤ 1.00, satisfies §F2"``, ``"1.12 > 1.00, DOES NOT
    SATISFY §F2"``; a check with no number says ``"NOT COVERED"`` only."""
    ratio = ratio_text(utilisation, sig) if Verdict.parse(verdict) != Verdict.NOT_COVERED else ""
    words = verdict_words(verdict, ref)
    return f"{ratio}, {words}" if ratio else words


def check_sort_key(check: Mapping[str, Any]) -> tuple[int, float]:
    """Sort key putting the worst check first: NOT OK by utilisation, NOT COVERED, then OK.

    ``check`` is a recorded check (:meth:`calcpack.contract.CheckRecord.to_json` shape).
    """
    u = check.get("utilisation")
    verdict = check.get("verdict")
    if verdict == Verdict.NOT_OK:
        return (0, -(u if u is not None else math.inf))
    if verdict == Verdict.NOT_COVERED:
        return (1, 0.0)
    return (2, -(u if u is not None else 0.0))


CLASSIFICATION_WORDS = ("compactness", "slenderness", "classification", "class ")
"""Words that mark a check as a classification or limit (a section's compactness, a member's
slenderness limit): its ratio sorts the section or bounds a method, it is not a share of a
strength used, so the summary lists it apart from the demand/capacity checks."""


def is_classification(check: Mapping[str, Any]) -> bool:
    """True for a classification or limit check (compactness, slenderness limit), from its
    recorded name; ``check`` is a recorded check."""
    name = f"{check.get('name') or ''} ".lower()
    return any(word in name for word in CLASSIFICATION_WORDS)
