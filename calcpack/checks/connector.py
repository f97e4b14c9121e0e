"""Proprietary connectors (hangers, ties, post caps and bases) against their listed loads.

A proprietary connector's capacity is the manufacturer's, published as allowable loads in its
evaluation report; calcpack does not compute it. :func:`check_connector` finds the demand on
the connector from the reactions of the member it holds, by load case and unfactored, under
every combination of an allowable stress set (ASCE/SEI 7-16 §2.4.1 by default), and compares:

* uplift: the largest net upward pull, e.g. under 0.6D + 0.6W (combination 7), against the
  listed allowable uplift;
* download: the largest net push, against the listed allowable download (when listed);
* moment: for a base listed as moment-resisting, the largest net moment |Σ γ M| against the
  listed allowable moment (when the moments by case are given).

Sign convention: a reaction is positive when the support pushes the member up (gravity), so a
negative net reaction is uplift. The listed values must be for the load duration of the
combination that governs (wood connectors are commonly listed for C_D = 1.6, wind; common
practice): the listing states it and the working repeats it. Listed values are for the
species, fasteners and installation the report states; the caution on the sheet says so.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.combinations.model import CombinationSet
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import at_least, non_empty

__all__ = ["ConnectorListing", "check_connector"]

_STANDARD = Standard(
    "manufacturer's evaluation report",
    "listed allowable loads of a proprietary connector",
    "ASD",
    caution_text=(
        "Connector capacities are the manufacturer's listed allowable loads, valid only for "
        "the species, fasteners, installation and load duration its evaluation report states; "
        "confirm the current report and install every listed fastener."
    ),
)


@dataclass(frozen=True)
class ConnectorListing:
    """A connector model and its listed allowable loads (ASD).

    Args:
        name: the connector as specified on the drawings (a generic model name).
        uplift: listed allowable uplift (tension), for the load duration ``duration``.
        source: the evaluation report and table the values come from.
        download: listed allowable download (None: not listed, not checked).
        moment: listed allowable moment of a moment-resisting base (None: not listed).
        duration: the load duration the listed values are for (e.g. "C_D = 1.6, wind").
    """

    name: str
    uplift: Quantity
    source: str
    download: Quantity | None = None
    moment: Quantity | None = None
    duration: str = "C_D = 1.6 (wind or earthquake)"

    def __post_init__(self) -> None:
        non_empty("name", self.name, expected="the connector model as on the drawings")
        require(self.uplift, "[force]", "uplift", positive=True)
        non_empty(
            "source",
            self.source,
            expected="the evaluation report and table of the listed loads, e.g. "
            "'evaluation report ER-0000, Table 3'",
        )
        if self.download is not None:
            require(self.download, "[force]", "download", positive=True)
        if self.moment is not None:
            require(self.moment, "[force]*[length]", "moment", positive=True)
        non_empty("duration", self.duration, expected="the load duration of the listed values")


def check_connector(
    listing: ConnectorListing,
    reactions: Mapping[str, Quantity],
    combinations: CombinationSet,
    *,
    mark: str,
    moments: Mapping[str, Quantity] | None = None,
) -> MemberChecks:
    """Check one connector for the net uplift (and download) of its member's reactions.

    Args:
        listing: the connector and its listed loads.
        reactions: load case -> unfactored reaction on the connector (force; + pushes the
            member up, i.e. gravity), e.g. ``{"D": ..., "L": ..., "W": ...}``.
        combinations: the allowable stress combinations (e.g. ``asce7_allowable_stress()``).
        mark: the connection's mark (e.g. "J1 to BR1").
        moments: load case -> unfactored moment on a moment-resisting base (any sign); needs
            the listed ``moment``.

    Returns the checks "Uplift" (demand 0 when no combination lifts the member) and, when the
    download is listed, "Download", and when moments are given, "Moment", each with its
    governing combination.

    Raises:
        InputError: no reactions, a reaction that is not a force, a moment that is not a
            moment, moments without a listed moment, or a case no combination uses (named by
            the combination set).
    """
    at_least("reactions", reactions, what="reaction by load case")
    for case, R in reactions.items():
        require(R, "[force]", f"reactions[{case!r}]")
    moments = dict(moments or {})
    for case, M in moments.items():
        require(M, "[force]*[length]", f"moments[{case!r}]")
    if moments and listing.moment is None:
        raise InputError(
            name="moments",
            value=moments,
            expected=f"no moments: {listing.name} has no listed allowable moment",
        )
    applied = combinations.apply(dict.fromkeys([*reactions, *moments]))
    if not applied:
        raise InputError(
            name="reactions",
            value=list(reactions),
            expected=f"load cases used by {combinations.name}",
        )
    unit = next(iter(reactions.values())).units
    net = {
        ac.name: sum(
            (f * reactions[c] for c, f in ac.factors.items() if c in reactions), Q_(0.0, unit)
        )
        for ac in applied
    }
    m_unit = next(iter(moments.values())).units if moments else None
    net_m = {
        ac.name: abs(
            sum((f * moments[c] for c, f in ac.factors.items() if c in moments), Q_(0.0, m_unit))
        )
        for ac in applied
    }
    low = min(net, key=lambda n: net[n].to(unit).magnitude)
    high = max(net, key=lambda n: net[n].to(unit).magnitude)

    def logic(c: Recorder) -> None:
        c.assume(
            f"{listing.name}: listed allowable loads for {listing.duration}, from "
            f"{listing.source}; installed with every fastener the listing requires."
        )
        for case, R in reactions.items():
            c.given(f"R_{case}", R, f"reaction, {case} (unfactored, + bearing)",
                    source="the member's analysis", unit=str(unit))  # fmt: skip
        lifted = net[low].magnitude < 0
        c.text(
            f"Net reaction under each combination: least {net[low]:~.4g} ({low}), largest "
            f"{net[high]:~.4g} ({high})."
            + ("" if lifted else " No combination lifts the member: the uplift demand is 0.")
        )
        T = c.given(
            "T_up",
            -net[low] if lifted else Q_(0.0, unit),
            "net uplift on the connector",
            source=low if lifted else "no net uplift",
            unit=str(unit),
            result=True,
        )
        T_a = c.given("T_allow", listing.uplift, f"listed allowable uplift, {listing.name}",
                      source=listing.source, unit=str(unit))  # fmt: skip
        c.check("Uplift", T, T_a, ref=listing.source, combination=low if lifted else None)
        if listing.download is not None:
            C = c.given("C_down", net[high], "net download on the connector", source=high,
                        unit=str(unit), result=True)  # fmt: skip
            C_a = c.given("C_allow", listing.download,
                          f"listed allowable download, {listing.name}", source=listing.source,
                          unit=str(unit))  # fmt: skip
            c.check("Download", C, C_a, ref=listing.source, combination=high)
        if moments:
            assert listing.moment is not None
            big = max(net_m, key=lambda n: net_m[n].magnitude)
            for case, M in moments.items():
                c.given(f"M_{case}", M, f"moment, {case} (unfactored)",
                        source="the member's analysis", unit=str(m_unit))  # fmt: skip
            M_d = c.given("M_base", net_m[big], "net moment on the base", source=big,
                          unit=str(m_unit), result=True)  # fmt: skip
            M_a = c.given("M_allow", listing.moment, f"listed allowable moment, {listing.name}",
                          source=listing.source, unit=str(m_unit))  # fmt: skip
            c.check("Moment", M_d, M_a, ref=listing.source, combination=big)

    return run_checks(mark, f"Connector {listing.name} at {mark}", _STANDARD, logic)
