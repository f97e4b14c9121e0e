"""A wood post under every allowable stress combination of its loads by case (NDS 2018, ASD).

:func:`check_nds_post` takes the post's axial loads by load case (unfactored, as a takedown
gives them: positive in compression) and, optionally, its moments by case, forms every
combination of an allowable stress set, runs :func:`check_nds_member` for each with C_D of the
shortest-duration load in it (NDS 2018 §2.3.2, Table 2.3.2) and returns each check (compression,
bending, their interaction) under the combination that governs it, with a table of every
combination in its working and the governing combinations worked out. The checks themselves
are those of :mod:`calcpack.checks.nds.members`.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import replace
from typing import Any, cast

from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.nds.factors import DEFAULT_DURATIONS, DURATION_FACTORS, duration_of
from calcpack.checks.nds.members import TimberForces, TimberMember, check_nds_member
from calcpack.combinations.model import CombinationSet
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import at_least

__all__ = ["check_nds_post"]


def check_nds_post(
    member: TimberMember,
    axial: Mapping[str, Quantity],
    combinations: CombinationSet,
    *,
    moments: Mapping[str, Quantity] | None = None,
    durations: Mapping[str, str] | None = None,
    mark: str = "P1",
) -> MemberChecks:
    """Check a post for every combination of its loads; each check under its governing one.

    Args:
        member: the post (its ``duration`` is replaced per combination).
        axial: load case -> unfactored axial load (force; + compression).
        combinations: the allowable stress combinations (e.g. ``asce7_allowable_stress()``).
        moments: load case -> unfactored moment about the post's strong axis (M_d), if any.
        durations: load case -> Table 2.3.2 duration (default: ``DEFAULT_DURATIONS``).
        mark: the post's mark.

    Raises:
        InputError: no axial loads, values of the wrong dimension, a case without a duration,
            a case no combination uses, or every combination with no force.
        OutOfScopeError: as :func:`check_nds_member`.
    """
    at_least("axial", axial, what="axial load by load case")
    for case, P in axial.items():
        require(P, "[force]", f"axial[{case!r}]")
    moments = dict(moments or {})
    for case, M in moments.items():
        require(M, "[force]*[length]", f"moments[{case!r}]")
    durs = dict(durations or DEFAULT_DURATIONS)
    runs: list[tuple[float, str, MemberChecks]] = []
    rows: list[list[Any]] = []
    for ac in combinations.apply(dict.fromkeys([*axial, *moments])):
        used = [c for c, f in ac.factors.items() if f != 0.0]
        if not used:
            continue
        dur = max((duration_of(c, durs) for c in used), key=lambda d: DURATION_FACTORS[d])
        P = sum((f * axial[c] for c, f in ac.factors.items() if c in axial), Q_(0.0, "lbf"))
        M = sum((f * moments[c] for c, f in ac.factors.items() if c in moments),
                Q_(0.0, "lbf*ft"))  # fmt: skip
        if P.magnitude == 0 and M.magnitude == 0:
            continue
        forces = TimberForces(P=P.to("lbf"), M_d=M.to("lbf*ft"), combination=ac.name)
        checks = check_nds_member(replace(member, duration=dur), forces, mark=mark)
        u = max((r.utilisation or 0.0) for r in checks.results)
        runs.append((u, ac.name, checks))
        rows.append([ac.name, P.to("lbf"), M.to("lbf*ft"), dur, f"{u:.3f}"])
    if not runs:
        raise InputError(
            name="axial",
            value=dict(axial),
            expected="a load that some combination does not cancel",
        )
    # the worst combination of each check (compression, bending, their interaction...)
    worst: dict[str, tuple[float, str]] = {}
    for _, cname, checks in runs:
        for r in checks.results:
            u = r.utilisation or 0.0
            if r.name not in worst or u > worst[r.name][0]:
                worst[r.name] = (u, cname)
    shown = [t for t in runs if any(w[1] == t[1] for w in worst.values())]
    shown.sort(key=lambda t: -t[0])
    first = shown[0][2]

    def logic(c: Any) -> None:
        c.text(
            f"Every {combinations.name} combination is checked with C_D of its shortest-"
            "duration load (NDS 2018 §2.3.2); the combination that governs each check is "
            "worked below."
        )
        c.table(
            ["Combination", "P (+ compression)", "M", "Load duration", "Largest utilisation"],
            rows,
            caption=f"Post {mark}: every combination",
        )
        for _, cname, checks in shown:
            if len(shown) > 1:
                c.heading(f"Combination {cname}", 4)
            checks.logic(cast(Recorder, _Governed(c, cname, worst)))

    return run_checks(mark, first.title, first.standard, logic)


class _Governed:
    """A recorder that records only the checks ``combination`` governs; the others are
    mentioned in words (their governing combination is worked elsewhere)."""

    def __init__(self, inner: Any, combination: str, worst: dict[str, tuple[float, str]]):
        self._inner = inner
        self._combination = combination
        self._worst = worst

    def __getattr__(self, name: str) -> Any:
        return getattr(self._inner, name)

    def check(self, name: str, demand: Any, capacity: Any, **kw: Any) -> Any:
        if self._worst[name][1] == self._combination:
            return self._inner.check(name, demand, capacity, **kw)
        self._inner.text(f"{name}: governed by combination {self._worst[name][1]}.")
        return None
