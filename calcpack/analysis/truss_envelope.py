"""Each truss member's governing tension and compression over a set of combinations.

A member whose force changes sign between combinations (a web or chord that reverses under
wind uplift) has to be designed for both: the largest tension and the largest compression,
each with the combination that gives it. Where the design resistance depends on the
combination (the load duration factor C_D of NDS 2018 §2.3.2, k_mod of EN 1995-1-1 §3.1.3),
"largest" means the largest force divided by that factor, so each sign's governing combination
is the one the member check would find worst. Sign convention: tension positive, as
:class:`calcpack.analysis.truss_solve.TrussResult` gives it.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from dataclasses import dataclass
from typing import Any

from calcpack.units import Quantity, si
from calcpack.validate import at_least, find, positive, required

__all__ = ["MemberEnvelope", "SignedForce", "member_envelopes"]


@dataclass(frozen=True)
class SignedForce:
    """One member force and where it comes from.

    Attributes:
        force: the axial force [force], tension positive (so negative for compression).
        combination: the combination's name. factor: the resistance factor it was weighed by.
    """

    force: Quantity
    combination: str
    factor: float


@dataclass(frozen=True)
class MemberEnvelope:
    """A member's governing tension and compression (None when that sign never occurs).

    Attributes:
        member: the member's name. tension, compression: the governing force of each sign.
    """

    member: str
    tension: SignedForce | None
    compression: SignedForce | None

    @property
    def reverses(self) -> bool:
        """True when some combination puts the member in tension and another in compression."""
        return self.tension is not None and self.compression is not None


def member_envelopes(
    results: Mapping[str, Any],
    *,
    factors: Mapping[str, float] | None = None,
    members: Iterable[str] | None = None,
) -> dict[str, MemberEnvelope]:
    """The governing tension and compression of each member over the combinations.

    Args:
        results: combination name -> :class:`TrussResult` (factored or ASD combinations).
        factors: combination name -> the resistance factor that varies with the combination
            (e.g. C_D); the governing force of each sign is the largest |force| / factor.
            Default 1.0 for every combination.
        members: the members wanted (default: every member of the truss).

    A force smaller than 1e-9 of the largest force of its combination counts as zero (a
    member that carries nothing in that combination is neither in tension nor compression).

    Raises:
        InputError: no results; a factor missing, zero or negative; an unknown member.
    """
    at_least("results", results, what="combination's result")
    weights = dict.fromkeys(results, 1.0) if factors is None else dict(factors)
    for name in results:
        factor = f"factors[{name!r}]"
        what = "the resistance factor of the combination, e.g. the load duration factor C_D"
        positive(factor, required(factor, weights.get(name), expected=what), note=what)
    first = next(iter(results.values()))
    names = list(first.forces) if members is None else list(members)
    for m in names:
        find("members", m, first.forces, what="member", where="in the truss")
    out: dict[str, MemberEnvelope] = {}
    for m in names:
        best: dict[int, tuple[float, SignedForce]] = {}
        for name, r in results.items():
            largest = max((abs(si(f)) for f in r.forces.values()), default=0.0)
            F = r.forces[m]
            value = si(F)
            if abs(value) <= 1e-9 * largest or value == 0.0:
                continue
            sign = 1 if value > 0 else -1
            score = abs(value) / weights[name]
            if sign not in best or score > best[sign][0]:
                best[sign] = (score, SignedForce(F, name, weights[name]))
        out[m] = MemberEnvelope(
            m,
            best[1][1] if 1 in best else None,
            best[-1][1] if -1 in best else None,
        )
    return out
