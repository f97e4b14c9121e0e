"""The lightest section that passes: try candidates in order of weight, check each in full.

The search is a loop over candidates around a *trial*: a function that checks one candidate
with calcpack's member checks and returns their results. Nothing here knows a design standard;
the checks do. A candidate passes when every check of every result passes (utilisation ≤ 1 by
the rule of :func:`calcpack.units.utilisation` and verdict "OK"); a check reported NOT COVERED
or a refusal (:class:`calcpack.errors.OutOfScopeError`) means the candidate is not offered,
with the reason kept.

Candidates are tried from the lightest up, so the first ones that pass are the lightest that
pass, and the heaviest candidate lighter than the lightest passing one is reported with the
check it fails (the evidence that nothing lighter works). With ``order="depth"`` the shallowest
come first (ties by weight), for a depth-limited job.

A *screen* may reject a candidate before the full checks by a necessary condition (for
example the plastic moment bound φ·F_y·Z_x ≥ M_u for a steel beam). A screened candidate is
reported as failing with the screen's reason; a screen must never reject a candidate that the
full checks would pass.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass
from typing import Any, Generic, Literal, TypeVar

from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Quantity, require
from calcpack.validate import one_of

__all__ = ["Candidate", "SearchSpace", "SizingResult", "Trial", "lightest_sections"]

C = TypeVar("C")

Order = Literal["weight", "depth"]
TrialVerdict = Literal["passes", "fails", "out of scope", "not covered"]


@dataclass(frozen=True)
class Candidate(Generic[C]):
    """One section offered to the search: its name, weight per length [force/length], depth
    [length] (optional), and the object the trial checks (a shape, a sawn size, a layup...).
    ``preference`` orders candidates of equal weight and depth (lower first; e.g. the commoner
    grade of a size searched in several grades)."""

    name: str
    weight: Quantity
    item: C
    depth: Quantity | None = None
    preference: int = 0

    def __post_init__(self) -> None:
        require(self.weight, "[force] / [length]", f"weight of {self.name}", positive=True)
        if self.depth is not None:
            require(self.depth, "[length]", f"depth of {self.name}", positive=True)


@dataclass(frozen=True)
class Trial:
    """The outcome of checking one candidate.

    Attributes:
        name, weight, depth: the candidate's.
        verdict: "passes" (every check OK), "fails" (a check over 1.0 or the screen rejected
            it), "out of scope" (a check refused the section), "not covered" (a check could not
            be made).
        utilisation: the governing (largest) utilisation, None if nothing was computed.
        governing: the governing check with its clause and combination, or the screen's or
            refusal's reason.
    """

    name: str
    weight: Quantity
    depth: Quantity | None
    verdict: TrialVerdict
    utilisation: float | None
    governing: str


@dataclass(frozen=True)
class SizingResult:
    """The ranked outcome of a search.

    Attributes:
        passing: the candidates that pass every check, in the search order (lightest first),
            at most ``count`` of them.
        next_lighter: the candidate tried just before the first passing one (in the search
            order), with the check it fails -- None when the first candidate passes.
        closest: when nothing passes, the candidate with the lowest governing utilisation
            (None if something passes or nothing could be checked).
        tried: every candidate tried, in order (including refusals).
        order: "weight" or "depth".
    """

    passing: tuple[Trial, ...]
    next_lighter: Trial | None
    closest: Trial | None
    tried: tuple[Trial, ...]
    order: Order

    @property
    def best(self) -> Trial:
        """The first passing candidate.

        Raises:
            OutOfScopeError: nothing passed (names the closest candidate and its governing
                check).
        """
        if not self.passing:
            near = self.closest
            hint = (
                f"; the closest is {near.name} ({near.governing}, utilisation "
                f"{near.utilisation:.3g})"
                if near is not None and near.utilisation is not None
                else ""
            )
            raise OutOfScopeError(
                f"No candidate passes every check ({len(self.tried)} tried){hint}"
            )
        return self.passing[0]


def _outcome(results: Any) -> tuple[TrialVerdict, float | None, str]:
    """Verdict, governing utilisation and governing check of one candidate's results.

    A failing check governs; among the rest, a demand/capacity check of a load combination
    governs over a classification limit (compactness) that has no combination.
    """
    items: Sequence[Any] = results if isinstance(results, list | tuple) else (results,)
    best: tuple[tuple[bool, bool, float], str] | None = None
    uncovered = ""
    failing = False
    for member_checks in items:
        for r in member_checks.results:
            where = f"{r.name}, {r.clause}" + (f", {r.combination}" if r.combination else "")
            if r.verdict == "NOT COVERED" or r.utilisation is None:
                uncovered = uncovered or f"{where}: not covered"
                continue
            bad = r.verdict != "OK"
            failing = failing or bad
            rank = (bad, r.combination is not None, float(r.utilisation))
            if best is None or rank > best[0]:
                best = (rank, where)
    if best is None:
        return "not covered", None, uncovered or "no check was made"
    u, where = best[0][2], best[1]
    if failing:
        return "fails", u, where
    if uncovered:
        return "not covered", u, uncovered
    return "passes", u, where


def lightest_sections(
    candidates: Iterable[Candidate[C]],
    trial: Callable[[C], Any],
    *,
    count: int = 5,
    order: Order = "weight",
    max_depth: Quantity | None = None,
    screen: Callable[[C], str | None] | None = None,
) -> SizingResult:
    """Find the lightest candidates that pass every check of ``trial``.

    Args:
        candidates: the sections to try (any order; they are sorted here).
        trial: checks one candidate's ``item``; returns a :class:`calcpack.checks.MemberChecks`
            or a list of them (every check of every combination the member must satisfy).
        count: how many passing candidates to return (≥ 1); the search stops there.
        order: "weight" (lightest first, ties by depth, then by preference) or "depth"
            (shallowest first, ties by weight, then by preference).
        max_depth: candidates deeper than this are left out.
        screen: optional necessary condition: returns a reason to reject the candidate
            without the full checks, or None to go on.

    Returns:
        SizingResult.

    Raises:
        InputError: count not a positive integer, an unknown order, max_depth not a length,
            no candidates left after the depth limit (naming the limit and the shallowest).
    """
    if isinstance(count, bool) or not isinstance(count, int) or count < 1:
        raise InputError(
            f"Input count must be an integer >= 1 (got count = {count!r})",
            name="count",
            value=count,
            expected="an integer >= 1",
        )
    one_of("order", order, ("weight", "depth"))
    pool = list(candidates)
    if not pool:
        raise InputError(
            "No candidates to try (got an empty list)",
            name="candidates",
            value=pool,
            expected="at least one candidate",
        )
    if max_depth is not None:
        require(max_depth, "[length]", "max_depth", positive=True)
        within = [c for c in pool if c.depth is None or c.depth <= max_depth]
        if not within:
            shallowest = min(pool, key=lambda c: c.depth.to("m").magnitude)  # type: ignore[union-attr]
            raise InputError(
                f"No candidate is {max_depth:~P} deep or less (got max_depth = {max_depth:~P}; "
                f"the shallowest is {shallowest.name}, {shallowest.depth:~P})",
                name="max_depth",
                value=max_depth,
                expected=f"at least {shallowest.depth:~P}",
            )
        pool = within

    in_si = _Converter()

    def key(c: Candidate[C]) -> tuple[float, float, int, str]:
        w = in_si(c.weight, "N/m")
        d = in_si(c.depth, "m") if c.depth is not None else 0.0
        return (w, d, c.preference, c.name) if order == "weight" else (d, w, c.preference, c.name)

    pool.sort(key=key)
    tried: list[Trial] = []
    passing: list[Trial] = []
    next_lighter: Trial | None = None
    for cand in pool:
        reason = screen(cand.item) if screen is not None else None
        if reason is not None:
            t = Trial(cand.name, cand.weight, cand.depth, "fails", None, reason)
        else:
            try:
                verdict, u, gov = _outcome(trial(cand.item))
            except OutOfScopeError as exc:
                verdict, u, gov = "out of scope", None, str(exc)
            t = Trial(cand.name, cand.weight, cand.depth, verdict, u, gov)
        tried.append(t)
        if t.verdict == "passes":
            passing.append(t)
            if len(passing) >= count:
                break
        elif not passing:
            next_lighter = t
    closest: Trial | None = None
    if not passing:
        scored = [t for t in tried if t.utilisation is not None]
        if not scored and screen is not None:
            # every candidate was screened out: check the last (heaviest, or deepest) in full
            last = pool[-1]
            try:
                verdict, u, gov = _outcome(trial(last.item))
                scored = [Trial(last.name, last.weight, last.depth, verdict, u, gov)]
            except OutOfScopeError:
                scored = []
        closest = min(scored, key=lambda t: t.utilisation or 0.0) if scored else None
        next_lighter = None
    return SizingResult(tuple(passing), next_lighter, closest, tuple(tried), order)


class _Converter:
    """Magnitudes of weights and depths in one unit, converting each unit found once (a
    catalogue tabulates every row in the same unit, and sorting hundreds of rows by pint
    conversions is most of a search's overhead). Weight and depth units are multiplicative,
    so one factor per unit converts exactly as pint does."""

    def __init__(self) -> None:
        self._factors: dict[tuple[Any, str], float] = {}

    def __call__(self, q: Quantity, unit: str) -> float:
        k = (q.units, unit)
        f = self._factors.get(k)
        if f is None:
            f = self._factors[k] = float((1.0 * q.units).to(unit).magnitude)
        return float(q.magnitude) * f


@dataclass(frozen=True)
class SearchSpace(Generic[C]):
    """What a member search tries: the candidates, the trial that checks one, and an optional
    screen. The member panels check the section on screen with the same ``trial`` the search
    uses, so a pick shows exactly the utilisations the ranking gave it.

    Attributes:
        candidates: the sections offered (any order). trial: checks one candidate's ``item``
            (as for :func:`lightest_sections`). screen: optional necessary condition.
    """

    candidates: tuple[Candidate[C], ...]
    trial: Callable[[C], Any]
    screen: Callable[[C], str | None] | None = None

    def check(self, item: C) -> list[Any]:
        """Every check of one section (a list of :class:`calcpack.checks.MemberChecks`)."""
        out = self.trial(item)
        return list(out) if isinstance(out, list | tuple) else [out]

    def search(
        self, *, count: int = 5, order: Order = "weight", max_depth: Quantity | None = None
    ) -> SizingResult:
        """:func:`lightest_sections` over this space."""
        return lightest_sections(
            self.candidates,
            self.trial,
            count=count,
            order=order,
            max_depth=max_depth,
            screen=self.screen,
        )
