"""Deck ledger to NDS 2018: spacing from the joist reactions, edge layout, the prescriptive
cross-check, the checklist item and the refusals."""

from __future__ import annotations

import pytest

from calcpack.checks.nds.connection import ConnectionService
from calcpack.checks.nds.dowel import Embedment, WoodMember, nds_fastener, yield_limits
from calcpack.checks.nds.ledger import DeckLedger, PrescriptiveSpacing, check_deck_ledger
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

IN = "inch"


def _ledger(**kw):
    base = {
        "fastener": nds_fastener("1/2 in. bolt", length=Q_(4, IN)),
        "ledger": WoodMember(Q_(1.5, IN), "Southern Pine"),
        "support": WoodMember(Q_(1.5, IN), "Douglas Fir-Larch"),
        "ledger_depth": Q_(9.25, IN),
        "support_depth": Q_(9.25, IN),
        "spacing": Q_(16, IN),
        "top": Q_(2, IN),
        "bottom": Q_(2, IN),
        "end": Q_(2, IN),
    }
    base.update(kw)
    return DeckLedger(**base)


def test_spacing_is_z_prime_over_w_and_the_reaction_route_agrees():
    lg = _ledger()
    wet = ConnectionService(service="wet")
    a = check_deck_ledger(lg, R=Q_(400, "lbf"), joist_spacing=Q_(16, IN), service=wet)
    b = check_deck_ledger(lg, w=Q_(300, "lbf/ft"), service=wet)
    z = yield_limits(lg.joint()).Z.m_as("lbf")
    # Z' = Z × C_M (0.7, wet service) × C_Δ (end 2 in. = 4D: 1.0); s_max = Z'/w
    assert a.values["Z_adj"].m_as("lbf") == pytest.approx(0.7 * z)
    assert a.values["s_max"].m_as(IN) == pytest.approx(0.7 * z / 300 * 12)
    assert b.values["s_max"].m_as(IN) == pytest.approx(a.values["s_max"].m_as(IN))
    # both members loaded perpendicular to grain
    assert a.values["theta"].m_as("degree") == pytest.approx(90)


def test_edge_layout_failures_are_reported():
    lg = _ledger(top=Q_(1.5, IN), bottom=Q_(0.5, IN), end=Q_(0.75, IN), drop=Q_(0.0, IN))
    r = check_deck_ledger(lg, w=Q_(100, "lbf/ft"))
    assert r["Ledger loaded edge (top)"].verdict == "NOT OK"  # < 4D = 2 in.
    assert r["Ledger unloaded edge (bottom)"].verdict == "NOT OK"  # < 1.5D = 0.75 in.
    assert r["End distance"].verdict == "NOT OK"  # < 2D = 1 in.


def test_prescriptive_cross_check_and_checklist():
    lg = _ledger(spacing=Q_(24, IN))
    cited = PrescriptiveSpacing("IRC 2018 Table R507.9.1.3(1) (as cited by the engineer)",
                                Q_(16, IN))  # fmt: skip
    r = check_deck_ledger(lg, w=Q_(100, "lbf/ft"), prescriptive=cited)
    x = r["Spacing against IRC 2018 Table R507.9.1.3(1) (as cited by the engineer)"]
    assert x.verdict == "NOT OK"
    html = r._repr_mimebundle_()["text/html"]
    assert "lateral load connection" in html
    with pytest.raises(InputError, match="cited"):
        PrescriptiveSpacing("", Q_(16, IN))


def test_refusals():
    with pytest.raises(OutOfScopeError, match="Technical Report 12"):
        _ledger(gap=Q_(0.5, IN))
    with pytest.raises(InputError, match=r"fastener\.kind"):
        _ledger(fastener=nds_fastener("16d common nail"))
    with pytest.raises(InputError, match="support_depth"):
        _ledger(support_depth=None)
    with pytest.raises(InputError, match="w"):
        check_deck_ledger(_ledger())
    with pytest.raises(InputError, match="penetration"):
        _ledger(fastener=nds_fastener("1/2 in. lag screw", length=Q_(3.5, IN)))


def test_ledger_to_a_wall_reports_the_anchorage_not_covered():
    lg = _ledger(support=Embedment(Q_(6, IN)), support_depth=None,
                 fastener=nds_fastener("1/2 in. bolt", length=Q_(8, IN)))  # fmt: skip
    r = check_deck_ledger(lg, w=Q_(150, "lbf/ft"))
    assert r["Anchorage in the wall"].verdict == "NOT COVERED"
    assert r.values["F_em"].m_as("psi") == pytest.approx(7500)
