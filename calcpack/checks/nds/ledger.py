"""A deck ledger fastened to a rim board (lag screws or through-bolts) or to a concrete or
grouted masonry wall (embedded bolts), NDS 2018 (ASD).

The joist reactions load the ledger along its length: w = R / s_joist (or w given). Each
fastener carries the load on its share of the ledger, w · s, against its adjusted lateral value
Z' (Chapter 12 yield limit equations with the ledger as side member, loaded perpendicular to
its grain, and the rim board loaded perpendicular to its grain). The largest spacing is then

    s_max = Z' / w

and the spacing provided is checked against it. The fastener lines are checked against the
edge distances of Table 12.5.1C (loaded edge 4D: the top of the ledger, the bottom of the rim
board; unloaded edge 1.5D), the spacing along the ledger against Table 12.5.1D (rows, loading
perpendicular to grain) and the end distance against Table 12.5.1A (C_Δ applied to every
fastener, conservatively). Where the engineer cites a prescriptive table (a building code's
deck ledger table) its spacing is compared as a cross-check. The lateral load connection of
the deck is listed as a checklist item, not designed here.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.nds.connection import ConnectionService, _cm_key, connection_factor
from calcpack.checks.nds.connection import FastenerLayout as _Layout
from calcpack.checks.nds.dowel import DowelJoint, Embedment, Fastener, WoodMember, yield_logic
from calcpack.checks.nds.factors import _TITLE, DURATION_FACTORS, NDS_EDITION
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import non_empty, one_of, positive_fields, required

__all__ = ["DeckLedger", "PrescriptiveSpacing", "check_deck_ledger"]


@dataclass(frozen=True)
class PrescriptiveSpacing:
    """A prescriptive spacing the engineer cites for comparison.

    Args:
        table: the table and edition, e.g. "IRC 2018 Table R507.9.1.3(1), joist span 12 ft".
        spacing: the on-centre spacing it gives for this case.
    """

    table: str
    spacing: Quantity

    def __post_init__(self) -> None:
        non_empty(
            "table",
            self.table,
            expected="the prescriptive table cited, e.g. 'IRC 2018 Table R507.9.1.3(1)'",
        )
        require(self.spacing, "[length]", "spacing", positive=True)


@dataclass(frozen=True)
class DeckLedger:
    """The ledger, what it is fastened to and the fastener pattern.

    Args:
        fastener: a lag screw or bolt (:func:`~calcpack.checks.nds.dowel.nds_fastener`).
        ledger: the ledger as a wood member (its thickness; species or G). The load angle is
            set to 90° (perpendicular to grain) here.
        support: the rim board (a WoodMember, thickness; 90° too) or an
            :class:`~calcpack.checks.nds.dowel.Embedment` for a concrete or masonry wall.
        ledger_depth: depth of the ledger. support_depth: depth of the rim board (None for a
            wall). drop: distance from the top of the rim board down to the top of the ledger.
        spacing: on-centre spacing of consecutive fasteners along the ledger (each carries
            w · s); with two lines they alternate, so each line has them at 2s.
        rows: 1, or 2 for a staggered pattern. top: from the top of the ledger to the upper
            line. bottom: from the bottom of the ledger to the lower line (the same line when
            rows = 1). end: from the end of the ledger to the first fastener.
        penetration: lag screws, thread length in the rim beyond the ledger (less the tip).
        gap: sheathing or spacers between ledger and rim (must be zero: Table 12.3.1A assumes
            the members in contact).
    """

    fastener: Fastener
    ledger: WoodMember
    support: WoodMember | Embedment
    ledger_depth: Quantity
    spacing: Quantity
    top: Quantity
    bottom: Quantity
    end: Quantity
    support_depth: Quantity | None = None
    drop: Quantity = field(default_factory=lambda: Q_(0.0, "inch"))
    rows: int = 2
    penetration: Quantity | None = None
    gap: Quantity = field(default_factory=lambda: Q_(0.0, "inch"))

    def __post_init__(self) -> None:
        one_of("fastener.kind", self.fastener.kind, ("lag screw", "bolt"))
        one_of("rows", self.rows, (1, 2))
        positive_fields(self, "[length]", ("ledger_depth", "spacing", "top", "bottom", "end"))
        require(self.drop, "[length]", "drop", nonnegative=True)
        require(self.gap, "[length]", "gap", nonnegative=True)
        if self.gap.magnitude > 0:
            raise OutOfScopeError(
                f"A gap of {self.gap:~P} between ledger and rim board (sheathing, spacers): the "
                "yield limit equations of NDS 2018 Table 12.3.1A assume members in contact; "
                "a gap needs the method of AWC Technical Report 12, not implemented"
            )
        if isinstance(self.support, WoodMember):
            required(
                "support_depth",
                self.support_depth,
                expected="the rim board depth, e.g. 9.25 in.",
                when="for the edge distances in a wood support",
            )
            require(self.support_depth, "[length]", "support_depth", positive=True)
        if self.top + self.bottom >= self.ledger_depth and self.rows == 2:
            raise InputError(
                f"Inputs top and bottom leave no room for two lines in a {self.ledger_depth:~P} "
                f"ledger (got top = {self.top:~P}, bottom = {self.bottom:~P})",
                name="bottom",
                value=self.bottom,
                expected=f"top + bottom < {self.ledger_depth:~P}",
            )
        self.joint()  # penetration and length checks at construction

    def joint(self) -> DowelJoint:
        """The single-shear joint of one fastener (both members loaded at 90° to grain)."""
        led = _perp(self.ledger)
        sup = _perp(self.support) if isinstance(self.support, WoodMember) else self.support
        return DowelJoint(self.fastener, led, sup, penetration=self.penetration)

    def lines(self) -> tuple[Quantity, Quantity]:
        """Depths of the upper and lower fastener lines below the top of the ledger."""
        y1 = self.top
        y2 = self.ledger_depth - self.bottom if self.rows == 2 else self.top
        return y1, y2


def _perp(m: WoodMember) -> WoodMember:
    return WoodMember(m.thickness, m.species, m.G, Q_(90.0, "degree"), m.end_grain, m.source)


def check_deck_ledger(
    ledger: DeckLedger,
    *,
    w: Quantity | None = None,
    R: Quantity | None = None,
    joist_spacing: Quantity | None = None,
    service: ConnectionService | None = None,
    prescriptive: PrescriptiveSpacing | None = None,
    mark: str = "LG1",
    combination: str | None = None,
) -> MemberChecks:
    """Fastener spacing of a deck ledger from the joist reactions (NDS 2018 ASD).

    Args:
        w: load on the ledger per unit length (ASD); or R, the joist reaction on the ledger
            (ASD), with joist_spacing. service: duration, moisture (an exposed deck ledger is
            usually "wet" in service), temperature. prescriptive: a cited table to compare.
    """
    if (w is None) == (R is None):
        raise InputError(
            "Give either w (load per length on the ledger) or R with joist_spacing (got "
            f"w = {w}, R = {R})",
            name="w",
            value=w,
            expected="one of w, or R and joist_spacing",
        )
    if R is not None:
        require(R, "[force]", "R", positive=True)
        required("joist_spacing", joist_spacing, expected="e.g. 16 in.", when="with R")
        require(joist_spacing, "[length]", "joist_spacing", positive=True)
    else:
        require(w, "[force]/[length]", "w", positive=True)
    sv = service or ConnectionService()
    lg = ledger
    j = lg.joint()
    f = lg.fastener
    D = f.D
    y1, y2 = lg.lines()

    def logic(c: Recorder) -> None:
        c.assume(
            "Ledger bears flat against the rim board (no sheathing gap); joist hangers carry "
            "the joists to the ledger; the load is uniform along the ledger; fasteners "
            "alike, each carrying the load on its spacing."
        )
        c.heading("Load on the ledger", 3)
        if R is not None:
            assert joist_spacing is not None
            Rj = c.given("R_j", R, "joist reaction on the ledger", source=combination or "given",
                         unit="lbf")  # fmt: skip
            sj = c.given("s_j", joist_spacing, "joist spacing", source="given", unit="inch")
            wl = c.derive("w", Rj / sj, "load per length of ledger", unit="lbf/ft")
        else:
            wl = c.given("w", w, "load per length of ledger", source=combination or "given",
                         unit="lbf/ft")  # fmt: skip
        Z = yield_logic(c, j)
        c.heading("Adjusted lateral value (NDS 2018 Table 11.3.1)", 3)
        CD = c.given("C_D", DURATION_FACTORS[sv.duration], sv.duration,
                     source="NDS 2018 Table 2.3.2")  # fmt: skip
        cm, _, src = connection_factor(_cm_key(j, _Layout(), sv))
        CM = c.given("C_M", cm, f"{sv.fabrication} fabrication, {sv.service} service",
                     source=f"Table 11.3.3, {src}")  # fmt: skip
        ct, _, src = connection_factor(sv.temperature_key())
        Ct = c.given("C_t", ct, f"T = {sv.temperature:~P}", source=f"Table 11.3.4, {src}")
        emin, efull, _ = connection_factor("end|perpendicular|any")
        assert efull is not None
        cdel = min(1.0, float((lg.end / (efull * D)).to("").magnitude))
        CDel = c.given("C_Delta", cdel, f"end distance {lg.end:~P} / {efull:g}D, every fastener",
                       source="NDS 2018 Table 12.5.1A")  # fmt: skip
        Zp = c.derive("Z_adj", Z * CD * CM * Ct * CDel, "Z' per fastener", unit="lbf",
                      ref="NDS 2018 Table 11.3.1")  # fmt: skip
        c.heading("Fastener spacing", 3)
        smax = c.derive("s_max", Zp / wl, "largest spacing, Z'/w", unit="inch",
                        ref="NDS 2018 §12.3")  # fmt: skip
        s = c.given("s", lg.spacing, "spacing provided along the ledger", source="given",
                    unit="inch")  # fmt: skip
        load = c.derive("P_f", wl * s, "load on one fastener", unit="lbf")
        c.check("Fastener lateral capacity", load, Zp, ref="NDS 2018 §12.3",
                combination=combination,
                description=f"spacing {lg.spacing:~P} against s_max")  # fmt: skip
        c.heading("Edge, end and spacing distances (NDS 2018 §12.5.1)", 3)
        _distances(c, lg, j, y1, y2, emin)
        if prescriptive is not None:
            c.heading("Prescriptive cross-check", 3)
            c.text(
                f"Cited: {prescriptive.table}: {prescriptive.spacing:~P} on centre. The "
                f"calculated largest spacing is shown beside it; the spacing provided must "
                "not exceed either."
            )
            c.check(f"Spacing against {prescriptive.table}", lg.spacing.to("inch"),
                    prescriptive.spacing.to("inch"), ref=prescriptive.table,
                    description="cross-check with the cited prescriptive table")  # fmt: skip
            ratio = float((c.q(smax) / prescriptive.spacing).to("").magnitude)
            if ratio < 0.9:
                c.caution(
                    f"The calculated s_max is {ratio:.0%} of the cited table's spacing: the "
                    "table's assumptions (species, sheathing, load) may differ from this case; "
                    "reconcile before relying on either."
                )
        c.caution(
            "Checklist: the lateral load connection of the deck to the structure (e.g. "
            "hold-down tension devices at the ledger, or a designed diaphragm load path) is "
            "not designed on this sheet and must be detailed and checked separately."
        )
        if isinstance(lg.support, Embedment):
            c.not_covered(
                "Anchorage in the wall",
                "Breakout and pullout of bolts embedded in concrete (ACI 318-19 Chapter 17) or "
                "masonry (TMS 402 anchor bolt provisions) are not implemented.",
                ref="ACI 318-19 Chapter 17 / TMS 402",
            )

    title = f"Deck ledger, {f.designation} at {lg.spacing:~P} to {lg.support.label}"
    return run_checks(mark, title, Standard(NDS_EDITION, _TITLE, "ASD"), logic)


def _distances(
    c: Recorder, lg: DeckLedger, j: DowelJoint, y1: Quantity, y2: Quantity, emin: float
) -> None:
    D = lg.fastener.D
    loaded, _, _ = connection_factor("edge|perpendicular|loaded")
    unloaded, _, _ = connection_factor("edge|perpendicular|unloaded")
    ref_c = "NDS 2018 Table 12.5.1C"

    def chk(name: str, req: Quantity, got: Quantity, ref: str) -> Any:
        return c.check(name, req.to("inch"), got.to("inch"), ref=ref)

    chk("Ledger loaded edge (top)", loaded * D, lg.top, ref_c)
    chk("Ledger unloaded edge (bottom)", unloaded * D, lg.bottom, ref_c)
    if isinstance(lg.support, WoodMember):
        assert lg.support_depth is not None
        chk("Rim unloaded edge (top)", unloaded * D, lg.drop + y1, ref_c)
        chk("Rim loaded edge (bottom)", loaded * D, lg.support_depth - lg.drop - y2, ref_c)
    chk("End distance", emin * D, lg.end, "NDS 2018 Table 12.5.1A")
    lm = float(j.main_bearing_length.to("inch").magnitude)
    ls = float(j.side.thickness.to("inch").magnitude)
    d_in = float(D.to("inch").magnitude)
    r = min(lm, ls) / d_in
    if r <= 2.0:
        need = connection_factor("rows|perpendicular|short")[0]
    elif r >= 6.0:
        need = connection_factor("rows|perpendicular|long")[0]
    else:
        need = (5.0 * r + 10.0) / 8.0
    chk("Spacing along the ledger", need * D, lg.spacing, "NDS 2018 Table 12.5.1D")
    if lg.rows == 2:
        full = connection_factor("spacing|perpendicular|any")[1]
        assert full is not None
        chk("Spacing between the lines", full * D, y2 - y1, "NDS 2018 Table 12.5.1B")
