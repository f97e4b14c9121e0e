"""Every connection check shows its working (HTML) without error, with its clauses, and the
working's values equal the numbers (the formula shown is the formula computed)."""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.bolts import BoltGroup, Ply, SlipCritical, check_aisc_bolts
from calcpack.checks.aisc360.elements import (
    BlockShear,
    ConnectingPlate,
    check_aisc_anchor_rods,
    check_aisc_block_shear,
    check_aisc_plate,
)
from calcpack.checks.aisc360.welds import BaseMetal, FilletWeld, check_aisc_fillet_weld
from calcpack.checks.base import SheetRecorder
from calcpack.checks.nds.connection import FastenerLayout, check_nds_connection
from calcpack.checks.nds.dowel import DowelJoint, SteelPlate, WoodMember, nds_fastener
from calcpack.checks.nds.ledger import DeckLedger, PrescriptiveSpacing, check_deck_ledger
from calcpack.checks.nds.values import nds_sawn_values
from calcpack.checks.nds.withdrawal import (
    check_nds_combined,
    check_nds_tearout,
    check_nds_withdrawal,
)
from calcpack.units import Q_

IN, K = "inch", "kip"
DF = "Douglas Fir-Larch"


def _cases():
    b = BoltGroup("Group A", Q_(0.75, IN), 2)
    ply = Ply("cap plate", Q_(0.375, IN), Q_(58, "ksi"), along=2, s=Q_(3, IN), le=Q_(1.5, IN),
              edge=Q_(1.25, IN))  # fmt: skip
    lag = nds_fastener("1/2 in. lag screw")
    wood = WoodMember(Q_(3.5, IN), DF)
    yield "bolts", check_aisc_bolts(b, [ply], V=Q_(20, K), T=Q_(10, K), slip=SlipCritical())
    yield "bolts ASD", check_aisc_bolts(b, [ply], V=Q_(10, K), T=Q_(5, K), method="ASD")
    gusset = BaseMetal(Q_(0.5, IN), Q_(36, "ksi"), Q_(58, "ksi"), "gusset plate")
    weld = FilletWeld(Q_(0.25, IN), Q_(40, IN), n=2, end_loaded=True, t_thin=Q_(0.5, IN),
                      base=(gusset,))  # fmt: skip
    yield "weld", check_aisc_fillet_weld(weld, R=Q_(100, K))
    yield (
        "weld at 60°",
        check_aisc_fillet_weld(
            FilletWeld(Q_(0.25, IN), Q_(6, IN), theta=Q_(60, "degree")), R=Q_(5, K), method="ASD"
        ),
    )
    pl = ConnectingPlate("PL 1", Q_(0.5, IN), Q_(6, IN), Q_(36, "ksi"), Q_(58, "ksi"), holes=2,
                         d_hole=Q_(13 / 16, IN))  # fmt: skip
    yield "plate", check_aisc_plate(pl, P=Q_(40, K), V=Q_(20, K))
    blk = BlockShear(t=Q_(0.5, IN), Fy=Q_(36, "ksi"), Fu=Q_(58, "ksi"), d_hole=Q_(13 / 16, IN),
                     along=3, s=Q_(3, IN), le=Q_(1.5, IN), le_t=Q_(1.5, IN))  # fmt: skip
    yield "block shear", check_aisc_block_shear(blk, R=Q_(50, K))
    yield "anchor rods", check_aisc_anchor_rods(BoltGroup("F1554 Gr. 36", Q_(0.75, IN), 4),
                                                T=Q_(5, K), V=Q_(3, K))  # fmt: skip
    j = DowelJoint(nds_fastener("5/8 in. bolt"), SteelPlate(Q_(0.25, IN)),
                   WoodMember(Q_(5.5, IN), DF, angle=Q_(90, "degree")), shear="double")  # fmt: skip
    lay = FastenerLayout(rows=2, row_spacing=Q_(3, IN), end=Q_(3, IN), edge=Q_(2.75, IN))
    yield "nds bolts", check_nds_connection(j, P=Q_(500, "lbf"), layout=lay)
    yield "withdrawal", check_nds_withdrawal(lag, wood, P=Q_(300, "lbf"), penetration=Q_(3, IN))
    yield "combined", check_nds_combined(lag, wood, Z_adj=Q_(300, "lbf"),
                                         penetration=Q_(3, IN), P=Q_(200, "lbf"),
                                         alpha=Q_(30, "degree"))  # fmt: skip
    lay2 = FastenerLayout(rows=2, per_row=2, spacing=Q_(3, IN), row_spacing=Q_(2.5, IN),
                          end=Q_(3.5, IN), edge=Q_(1.5, IN))  # fmt: skip
    yield "tear-out", check_nds_tearout(nds_sawn_values(DF, "No.2"), t=Q_(3.5, IN),
                                        D=Q_(0.5, IN), layout=lay2, P=Q_(3000, "lbf"))  # fmt: skip
    led = DeckLedger(nds_fastener("1/2 in. bolt", length=Q_(4, IN)), WoodMember(Q_(1.5, IN), DF),
                     WoodMember(Q_(1.5, IN), DF), ledger_depth=Q_(9.25, IN),
                     support_depth=Q_(9.25, IN), spacing=Q_(4, IN), top=Q_(2, IN),
                     bottom=Q_(2, IN), end=Q_(3, IN))  # fmt: skip
    yield (
        "ledger",
        check_deck_ledger(
            led, w=Q_(300, "lbf/ft"), prescriptive=PrescriptiveSpacing("a cited table", Q_(16, IN))
        ),
    )


@pytest.mark.parametrize(("label", "checks"), list(_cases()), ids=[c[0] for c in _cases()])
def test_working_renders_and_agrees_with_the_numbers(label, checks):
    html = checks._repr_mimebundle_()["text/html"]
    assert checks.standard.code in html
    for r in checks.results:
        assert r.clause.split(" ")[0] in html
    rec = SheetRecorder(checks.member)
    checks.logic(rec)
    for name, q in checks.values.items():
        shown = rec.values[name]
        assert shown.to(q.units).magnitude == pytest.approx(q.magnitude, rel=1e-9), name
