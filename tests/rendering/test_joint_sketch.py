"""Joint sketches: the data builders place what the checks read, and the SVG drawing shows the
members, fasteners, dimensions and load (a Figure step on a sheet draws it by name)."""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.bolts import BoltGroup, Ply
from calcpack.checks.aisc360.welds import FilletWeld
from calcpack.checks.joint_sketch import (
    bolt_pattern_sketch,
    dowel_layout_sketch,
    ledger_sketch,
    weld_sketch,
)
from calcpack.checks.nds.connection import FastenerLayout
from calcpack.checks.nds.dowel import DowelJoint, WoodMember, nds_fastener
from calcpack.checks.nds.ledger import DeckLedger
from calcpack.units import Q_
from calcpack.working import Figure

IN = "inch"


def _ledger():
    return DeckLedger(
        nds_fastener("1/2 in. bolt", length=Q_(4, IN)),
        WoodMember(Q_(1.5, IN), "Southern Pine"),
        WoodMember(Q_(1.5, IN), "Douglas Fir-Larch"),
        ledger_depth=Q_(9.25, IN),
        support_depth=Q_(11.25, IN),
        drop=Q_(1, IN),
        spacing=Q_(16, IN),
        top=Q_(2, IN),
        bottom=Q_(2, IN),
        end=Q_(2, IN),
    )


def test_ledger_sketch_places_staggered_fasteners_at_the_spacing():
    sk = ledger_sketch(_ledger(), shown=4)
    upper = sorted(f.x for f in sk.fasteners if f.y > 5)
    lower = sorted(f.x for f in sk.fasteners if f.y < 5)
    # consecutive fasteners 16 in. apart, alternating between the two lines
    assert upper == pytest.approx([2, 34])
    assert lower == pytest.approx([18, 50])
    # upper line 2 in. below the ledger top, which is 1 in. below the rim top (11.25 in.)
    assert all(f.y == pytest.approx(11.25 - 1 - 2) for f in sk.fasteners if f.y > 5)
    assert sk.load is not None
    assert sk.load.dy < 0  # joist reactions act downward
    assert any("16 in." in d.label for d in sk.dimensions)


def test_bolt_pattern_and_dowel_layout_counts():
    b = BoltGroup("Group A", Q_(0.75, IN), 6)
    p = Ply("gusset", Q_(0.375, IN), Q_(58, "ksi"), along=3, lines=2, s=Q_(3, IN),
            le=Q_(1.5, IN), edge=Q_(1.5, IN), gauge=Q_(3, IN))  # fmt: skip
    sk = bolt_pattern_sketch(b, p)
    assert len(sk.fasteners) == 6
    assert any(d.label == "l_e = 1-1/2 in." for d in sk.dimensions)
    j = DowelJoint(nds_fastener("1/2 in. bolt"), WoodMember(Q_(1.5, IN), "Hem-Fir"),
                   WoodMember(Q_(3.5, IN), "Hem-Fir"))  # fmt: skip
    lay = FastenerLayout(rows=2, per_row=3, spacing=Q_(2, IN), row_spacing=Q_(2.5, IN),
                         end=Q_(3.5, IN), edge=Q_(1.5, IN))  # fmt: skip
    dk = dowel_layout_sketch(j, lay, depth=Q_(5.5, IN))
    assert len(dk.fasteners) == 6
    assert min(f.x for f in dk.fasteners) == pytest.approx(3.5)


def test_joint_svg_draws_through_a_figure_step():
    sk = weld_sketch(FilletWeld(Q_(3 / 16, IN), Q_(6, IN), n=2), plate_width=Q_(4, IN))
    fig = Figure("joint", sk, caption="Lap joint", alt="Plate lapped and welded both sides")
    svg = fig.svg()
    assert svg.lstrip().startswith("<?xml")
    assert "3/16 in. fillet" in svg
    led = Figure("joint", ledger_sketch(_ledger()), caption="Ledger", alt="Ledger elevation")
    assert "joist reactions" in led.svg()
