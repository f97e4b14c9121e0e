"""Inputs, refusals and working of the NDS 2018 dowel-type fastener yield model."""

from __future__ import annotations

import pytest

from calcpack.checks.base import SheetRecorder
from calcpack.checks.nds.dowel import (
    DowelJoint,
    Fastener,
    SteelPlate,
    WoodMember,
    nds_fastener,
    nds_specific_gravity,
    yield_limits,
    yield_logic,
)
from calcpack.errors import DimensionError, InputError, OutOfScopeError
from calcpack.units import Q_


def test_unknown_species_names_the_input_and_suggests():
    with pytest.raises(InputError, match="Douglas Fir-Larch") as e:
        WoodMember(Q_(1.5, "inch"), "Douglas Fir Larc")
    assert e.value.name == "species"
    with pytest.raises(InputError, match=r"Table 12\.3\.3A"):
        nds_specific_gravity("Balsa")


def test_unknown_fastener_suggests_close_names():
    with pytest.raises(InputError, match="16d common nail"):
        nds_fastener("16d comon nail")


def test_fastener_shorter_than_side_member_plus_penetration_is_refused():
    nail = nds_fastener("8d common nail")  # 2-1/2 in. long
    with pytest.raises(InputError, match="penetration") as e:
        DowelJoint(
            nail, WoodMember(Q_(2.0, "inch"), "Hem-Fir"), WoodMember(Q_(3.5, "inch"), "Hem-Fir")
        )
    assert e.value.name == "penetration"
    assert "0.5 in" in str(e.value)


def test_bolt_shorter_than_the_members_is_refused():
    bolt = nds_fastener("1/2 in. bolt", length=Q_(2.5, "inch"))
    with pytest.raises(InputError, match="reach through"):
        DowelJoint(
            bolt, WoodMember(Q_(1.5, "inch"), "Hem-Fir"), WoodMember(Q_(1.5, "inch"), "Hem-Fir")
        )


def test_diameter_over_one_inch_is_refused():
    with pytest.raises(OutOfScopeError, match="1 in"):
        Fastener("1-1/4 in. bolt", "bolt", Q_(1.25, "inch"), Q_(45, "ksi"), "given")


def test_angle_outside_0_to_90_and_bare_numbers_are_refused():
    with pytest.raises(InputError, match="angle"):
        WoodMember(Q_(1.5, "inch"), "Hem-Fir", angle=Q_(120, "degree"))
    with pytest.raises(DimensionError, match="thickness"):
        WoodMember(1.5, "Hem-Fir")  # type: ignore[arg-type]


def test_lag_screw_in_double_shear_is_out_of_scope():
    lag = nds_fastener("1/2 in. lag screw", length=Q_(6, "inch"))
    with pytest.raises(OutOfScopeError, match="double shear"):
        DowelJoint(
            lag,
            WoodMember(Q_(1.5, "inch"), "Hem-Fir"),
            WoodMember(Q_(3.5, "inch"), "Hem-Fir"),
            shear="double",
        )


def test_lag_screw_penetration_excludes_the_tip():
    lag = nds_fastener("1/2 in. lag screw", length=Q_(5, "inch"))
    j = DowelJoint(
        lag, WoodMember(Q_(1.5, "inch"), "Hem-Fir"), WoodMember(Q_(9.25, "inch"), "Hem-Fir")
    )
    assert j.main_bearing_length.m_as("inch") == pytest.approx(5 - 1.5 - 0.3125)


def test_steel_side_plate_bearing_is_one_and_a_half_fu():
    j = DowelJoint(
        nds_fastener("1/2 in. bolt"),
        SteelPlate(Q_(0.25, "inch")),
        WoodMember(Q_(3.5, "inch"), "Douglas Fir-Larch"),
    )
    y = yield_limits(j)
    assert y.values["F_es"].m_as("psi") == pytest.approx(87000)
    assert y.Z.m_as("lbf") == min(v.m_as("lbf") for v in y.modes.values())


def test_working_shows_every_mode_with_its_clause():
    from calcpack.working import Block

    j = DowelJoint(
        nds_fastener("1/2 in. bolt"),
        WoodMember(Q_(1.5, "inch"), "Southern Pine", angle=Q_(30, "degree")),
        WoodMember(Q_(3.5, "inch"), "Southern Pine"),
    )
    rec = SheetRecorder("J1")
    z = yield_logic(rec, j)
    assert rec.q(z).m_as("lbf") == pytest.approx(yield_limits(j).Z.m_as("lbf"))
    html = Block(rec.steps, title="J1")._repr_mimebundle_()["text/html"]
    assert "Table 12.3.1A" in html
    assert "Hankinson" in html
    assert "mode II" in html
