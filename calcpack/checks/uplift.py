"""Net uplift held down by dead weight: a pier, footing or block that resists the upward pull
of the member it carries by its own weight and the soil it lifts with it.

:func:`check_uplift_by_weight` takes the loads on the top of the body by load case,
unfactored and downward positive (the axial loads of a load takedown), and forms every
combination of the set given. Under a combination with factors γ_i the net load on the top is
N = Σ γ_i·P_i; where it is upward (N < 0) the uplift U = −N must be held by the weight counted,
factored as dead load in that combination:

    FS·U ≤ γ_D·W,   W = Σ γ_k·V_k

over the parts counted (the concrete of the pier; soil over a footing or a bell that the body
must lift). The governing combination is the one with the largest FS·U / (γ_D·W); when no
combination lifts the body the demand is 0 under the combination with the least dead-load
factor. What resists but is not counted (skin friction on the pier's sides, an anchor) is
stated in words beside the check.

With the ASCE/SEI 7-16 combinations the reduced dead-load factor of the combinations written
for uplift and overturning (0.6D + 0.6W, §2.4.1 combination 7, ASD; 0.9D + 1.0W, §2.3.1
combination 5, strength) is the margin, so the extra factor of safety FS is 1.0 by default
(common practice); a firm that wants more states it with its source.

Sign convention: a load on the top of the body is positive downward (gravity); uplift is
negative. Computation only: no rendering, no Jupyter.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.model import AppliedCombination, CombinationSet
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import at_least, each_instance, non_empty, within

__all__ = ["UPLIFT_STANDARD", "ResistingWeight", "UpliftByWeight", "check_uplift_by_weight"]

UPLIFT_STANDARD = Standard(
    "uplift resisted by dead weight (common practice)",
    "net uplift under the load combinations against the factored weight of the body",
    caution_text=(
        "The uplift resistance counts only the weights stated, factored as dead load in the "
        "governing combination; confirm the unit weights, the dimensions as built and the "
        "combinations against the edition adopted locally."
    ),
)

FS_DEFAULT = 1.0
"""Extra factor of safety on the uplift: none beyond the combination's reduced dead-load
factor (0.6D in ASCE/SEI 7-16 §2.4.1 (7), 0.9D in §2.3.1 (6); common practice)."""
FS_DEFAULT_SOURCE = (
    "no further factor of safety: the reduced dead-load factor is the margin (common practice)"
)


@dataclass(frozen=True)
class ResistingWeight:
    """One part of the body whose weight holds it down.

    Args:
        key: the subscript of its symbols in the working: ``"c"`` shows W_c = γ_c·V_c.
        description: what it is, in words (``"concrete of the pier, 30 in. dia. × 24 in."``).
        unit_weight: γ, weight per volume [force/length³], positive (150 pcf for normal-weight
            concrete, common practice).
        volume: V, the volume counted [length³], positive.
        source: where γ comes from (``"common practice"``, the geotechnical report).
        volume_source: where V comes from (the drawing, or the sheet's own working).
    """

    key: str
    description: str
    unit_weight: Quantity
    volume: Quantity
    source: str
    volume_source: str = "given"

    def __post_init__(self) -> None:
        non_empty("key", self.key, expected='the subscript of the weight\'s symbols, e.g. "c"')
        non_empty(
            "description",
            self.description,
            expected="what the weight is, e.g. 'concrete of the pier'",
        )
        require(self.unit_weight, "[force]/[length]**3", "unit_weight", positive=True)
        require(self.volume, "[length]**3", "volume", positive=True)
        non_empty(
            "source",
            self.source,
            expected="where the unit weight comes from, e.g. 'common practice'",
        )

    @property
    def weight(self) -> Quantity:
        """γ·V, the weight of this part [force]."""
        return (self.unit_weight * self.volume).to("lbf")


@dataclass(frozen=True)
class UpliftByWeight:
    """A body (pier, footing, block) held down by its weight against net uplift.

    Args:
        loads: load case -> unfactored load on the top of the body [force], positive
            downward (gravity), e.g. ``{"D": 600 lbf, "W": -1000 lbf}``.
        weights: the parts whose weight is counted (:class:`ResistingWeight`), at least one.
        not_counted: what also resists but is not counted, in words (e.g. "skin friction on
            the pier's sides"); shown beside the check.
        dead_case: the load case whose factor applies to the weights (``"D"``).
        safety: extra factor of safety on the uplift, 1.0 to 5.0 (default 1.0, see the module
            notes), with ``safety_source``.
        loads_source: where the loads come from (shown with them).
    """

    loads: Mapping[str, Quantity]
    weights: tuple[ResistingWeight, ...]
    not_counted: str = ""
    dead_case: str = "D"
    safety: float = FS_DEFAULT
    safety_source: str = FS_DEFAULT_SOURCE
    loads_source: str = "the load takedown"

    def __post_init__(self) -> None:
        at_least("loads", self.loads, what="load on the top of the body by load case")
        for case, P in self.loads.items():
            non_empty("loads", case, expected='a load case name, e.g. "D"')
            require(P, "[force]", f"loads[{case!r}]")
        weights = tuple(self.weights)
        at_least("weights", weights, what="ResistingWeight")
        each_instance("weights", weights, ResistingWeight, expected="a ResistingWeight")
        keys = [w.key for w in weights]
        if len(set(keys)) != len(keys):
            raise InputError(
                f"Input weights: each part needs its own key (got {keys})",
                name="weights",
                value=keys,
                expected='distinct keys, e.g. "c" and "s"',
            )
        object.__setattr__(self, "weights", weights)
        non_empty("dead_case", self.dead_case, expected='the dead-load case, e.g. "D"')
        within("safety", self.safety, 1.0, 5.0, rule="a factor of safety on uplift")
        non_empty("safety_source", self.safety_source, expected="where the factor comes from")


def _net(body: UpliftByWeight, ac: AppliedCombination) -> Quantity:
    """Σ γ_i·P_i on the top of the body (downward positive), lbf."""
    total = Q_(0.0, "lbf")
    for case, f in ac.factors.items():
        if case in body.loads:
            total = total + f * body.loads[case].to("lbf")
    return total


def _dead_factor(body: UpliftByWeight, ac: AppliedCombination) -> float:
    """The combination's factor on the dead-load case (applied to the weights)."""
    f = ac.factors.get(body.dead_case, ac.source.factors.get(body.dead_case, 0.0))
    return float(f)


def check_uplift_by_weight(
    body: UpliftByWeight, combinations: CombinationSet, *, mark: str
) -> MemberChecks:
    """Net uplift on a body against its factored weight, under every combination of a set.

    Args:
        body: the loads by case and the weights counted (:class:`UpliftByWeight`).
        combinations: the combination set of the sheet's method (``asce7_allowable_stress()``
            or ``asce7_strength()``); its dead-load factor multiplies the weights.
        mark: the body's mark, as its other checks name it (``"PR-B"``).

    Returns:
        MemberChecks with the check "Uplift" (demand FS·U, capacity γ_D·W, in lbf), worked
        under the governing combination; demand 0 when no combination lifts the body.

    Raises:
        InputError: no load case used by the set, or no combination of the set factors the
            dead-load case (nothing would hold the body down).
    """
    non_empty("mark", mark, expected='the body\'s mark, e.g. "PR-B"')
    applied = combinations.apply(body.loads)
    if not applied:
        raise InputError(
            f"Input loads: no combination of {combinations.name!r} uses the load cases "
            f"{list(body.loads)}",
            name="loads",
            value=list(body.loads),
            expected=f"load cases used by {combinations.name}",
        )
    W_total = sum((w.weight for w in body.weights), Q_(0.0, "lbf"))
    lifting = [ac for ac in applied if _net(body, ac).magnitude < 0]
    for ac in lifting:
        if _dead_factor(body, ac) <= 0:
            raise InputError(
                f"Input dead_case = {body.dead_case!r}: combination {ac.name!r} lifts the body "
                f"but does not factor {body.dead_case!r}, so nothing would hold it down",
                name="dead_case",
                value=body.dead_case,
                expected="the set's dead-load case, factored in every combination, e.g. 'D'",
            )
    if lifting:
        gov = max(
            lifting,
            key=lambda ac: -_net(body, ac).magnitude / (_dead_factor(body, ac) * W_total.magnitude),
        )
    else:  # nothing lifts: the least dead-load factor is the weakest resistance
        gov = min(applied, key=lambda ac: _dead_factor(body, ac))
    f_D = _dead_factor(body, gov)
    if f_D <= 0:
        raise InputError(
            f"Input dead_case = {body.dead_case!r}: combination {gov.name!r} of "
            f"{combinations.name!r} does not factor it, so nothing would hold the body down",
            name="dead_case",
            value=body.dead_case,
            expected="the set's dead-load case, factored in every combination, e.g. 'D'",
        )
    lifted = bool(lifting)

    def logic(c: Recorder) -> None:
        if body.not_counted:
            c.assume(f"Not counted in the resistance: {body.not_counted}.")
        c.heading("Net load on the top", 3)
        g_D = None
        if lifted:
            expr: Any = None
            for case, P in body.loads.items():
                f = gov.factors.get(case, 0.0)
                if f == 0.0:
                    continue
                Pc = c.given(f"P_{case}", P, f"load on the top, {case} (unfactored, + down)",
                             source=body.loads_source, unit="lbf")  # fmt: skip
                gc = c.given(f"gamma_{case}", f, f"load factor on {case}", source=gov.name)
                if case == body.dead_case:
                    g_D = gc
                expr = gc * Pc if expr is None else expr + gc * Pc
            U = c.derive("U", -expr, f"net uplift on the top, {gov.name}", unit="lbf",
                         ref=gov.clause)  # fmt: skip
        else:
            c.text("No combination gives a net upward load on the top: the uplift is 0.")
            U = c.given("U", Q_(0.0, "lbf"), "net uplift on the top", source="no net uplift",
                        unit="lbf")  # fmt: skip
        c.heading("Weight holding it down", 3)
        parts = []
        for w in body.weights:
            g = c.given(f"gamma_{w.key}", w.unit_weight, f"unit weight, {w.description}",
                        source=w.source, unit="lbf/ft**3")  # fmt: skip
            V = c.given(f"V_{w.key}", w.volume, f"volume, {w.description}",
                        source=w.volume_source, unit="ft**3")  # fmt: skip
            parts.append(c.derive(f"W_{w.key}", g * V, f"weight, {w.description}", unit="lbf"))
        W = parts[0]
        if len(parts) > 1:
            total = parts[0]
            for p in parts[1:]:
                total = total + p
            W = c.derive("W", total, "weight counted", unit="lbf")
        if g_D is None:
            g_D = c.given(f"gamma_{body.dead_case}", f_D,
                          f"load factor on {body.dead_case}, applied to the weight",
                          source=gov.name)  # fmt: skip
        R = c.derive("R_up", g_D * W, "uplift resistance: the weight as dead load", unit="lbf",
                     ref=gov.clause)  # fmt: skip
        rule = f"{gov.clause}: FS·U ≤ γD·W"
        if body.safety != 1.0:
            FS = c.given("FS_up", body.safety, "factor of safety on the uplift",
                         source=body.safety_source)  # fmt: skip
            U = c.derive("U_FS", FS * U, "uplift times the factor of safety", unit="lbf")
        else:
            rule = f"{gov.clause}: U ≤ γD·W"
        c.check(
            "Uplift",
            U,
            R,
            ref=rule,
            combination=gov.name if lifted else None,
            description="net uplift held down by the weight counted"
            + ("" if body.safety != 1.0 else f" ({body.safety_source})"),
        )

    return run_checks(
        mark, f"Net uplift on {mark}, held down by its weight", UPLIFT_STANDARD, logic
    )
