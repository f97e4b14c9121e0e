"""Bad beam inputs are refused with a message naming the input (issue: classification and
errors)."""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, EISegment, Fixed, Hinge, Pin, Roller, Spring, solve_beam
from calcpack.errors import DimensionError, InputError, UnstableStructureError
from calcpack.loads import FunctionLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN
EI = Q_(20e3, "kN*m**2")


def test_two_rollers_and_a_horizontal_load_are_unstable():
    beam = Beam(
        length=6 * m,
        supports=[Roller(0 * m), Roller(6 * m)],
        loads=[PointLoad.inclined(2 * m, 10 * kN, 60 * ureg.deg)],
    )
    assert beam.classify().kind == "unstable"
    with pytest.raises(UnstableStructureError, match="horizontal") as err:
        solve_beam(beam)
    assert "make one support a pin or fixed" in str(err.value)


def test_hinge_mechanism_is_refused_naming_the_hinge():
    beam = Beam(
        length=10 * m,
        supports=[Pin(0 * m), Roller(10 * m)],
        hinges=[Hinge(4 * m)],
        loads=[UniformLoad(w=5 * kN / m)],
    )
    with pytest.raises(UnstableStructureError, match="hinge H1 at x = 4 m") as err:
        solve_beam(beam)
    assert err.value.part == "H1"
    assert "add a support" in str(err.value)


def test_no_support_is_refused():
    beam = Beam(length=4 * m, supports=[], loads=[UniformLoad(w=1 * kN / m)])
    with pytest.raises(UnstableStructureError, match="no supports"):
        solve_beam(beam)


def test_single_pin_is_refused():
    beam = Beam(length=4 * m, supports=[Pin(1 * m)], loads=[UniformLoad(w=1 * kN / m)])
    with pytest.raises(UnstableStructureError, match="rotate about x = 1 m"):
        solve_beam(beam)


def test_load_off_the_beam_names_the_load():
    with pytest.raises(InputError, match=r"loads\[1\].*off the beam.*7 m") as err:
        Beam(
            length=6 * m,
            supports=[Pin(0 * m), Roller(6 * m)],
            loads=[UniformLoad(w=1 * kN / m), PointLoad(x=7 * m, P=3 * kN)],
        )
    assert err.value.name == "loads[1]"


def test_distributed_load_beyond_the_end():
    with pytest.raises(InputError, match="off the beam"):
        Beam(
            length=6 * m,
            supports=[Pin(0 * m), Roller(6 * m)],
            loads=[UniformLoad(w=1 * kN / m, start=2 * m, end=8 * m)],
        )


def test_zero_and_negative_span():
    for bad in (0 * m, -3 * m):
        with pytest.raises(InputError, match="length must be positive") as err:
            Beam(length=bad, supports=[Pin(0 * m)])
        assert err.value.name == "length"


def test_span_without_units():
    with pytest.raises(DimensionError, match="length"):
        Beam(length=6.0, supports=[Pin(0 * m)])


def test_overlapping_supports():
    with pytest.raises(InputError, match="Supports A and B overlap") as err:
        Beam(length=6 * m, supports=[Pin(2 * m), Roller(2 * m)])
    assert "2 m" in str(err.value)


def test_support_off_the_beam():
    with pytest.raises(InputError, match=r"supports\[1\]") as err:
        Beam(length=6 * m, supports=[Pin(0 * m), Roller(6.5 * m)])
    assert "6.5 m" in str(err.value)


def test_missing_EI_for_an_indeterminate_beam():
    beam = Beam(
        length=6 * m, supports=[Fixed(0 * m), Roller(6 * m)], loads=[UniformLoad(w=1 * kN / m)]
    )
    with pytest.raises(InputError, match="give EI") as err:
        solve_beam(beam)
    assert err.value.name == "EI"
    assert "indeterminate (degree 1" in str(err.value)


def test_missing_EI_for_deflection_of_a_determinate_beam():
    r = solve_beam(
        Beam(length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], loads=[UniformLoad(w=1 * kN / m)])
    )
    assert r.moment(3 * m).to("kN*m").magnitude == pytest.approx(4.5, rel=1e-12)  # wL²/8
    with pytest.raises(Exception, match="Deflection of beam Beam needs its stiffness: give EI"):
        r.deflection(3 * m)


def test_EI_segments_with_a_gap():
    with pytest.raises(InputError, match="without gaps") as err:
        Beam(
            length=6 * m,
            supports=[Pin(0 * m), Roller(6 * m)],
            EI=[EISegment(0 * m, 2 * m, EI), EISegment(2.5 * m, 6 * m, EI)],
        )
    assert err.value.name == "EI"


def test_hinge_at_the_end_and_couple_at_a_hinge():
    with pytest.raises(InputError, match="strictly inside") as err:
        Beam(length=6 * m, supports=[Fixed(0 * m)], hinges=[Hinge(6 * m)])
    assert err.value.name == "hinges[0].x"
    with pytest.raises(InputError, match="couple at a hinge is ambiguous"):
        Beam(
            length=6 * m,
            supports=[Fixed(0 * m), Roller(6 * m)],
            hinges=[Hinge(3 * m)],
            loads=[PointMoment(x=3 * m, C=2 * kN * m)],
        )


def test_hinge_at_a_fixed_support():
    with pytest.raises(InputError, match="rotation-restraining support B"):
        Beam(length=6 * m, supports=[Pin(0 * m), Fixed(3 * m)], hinges=[Hinge(3 * m)])


def test_distributed_load_end_before_start():
    with pytest.raises(InputError, match="end must be greater than its start") as err:
        UniformLoad(w=1 * kN / m, start=3 * m, end=2 * m)
    assert err.value.name == "end"


def test_wrong_dimension_of_a_load():
    with pytest.raises(DimensionError, match="Input w must have units"):
        UniformLoad(w=3 * kN)


def test_empty_case_name():
    with pytest.raises(InputError, match="case"):
        PointLoad(x=1 * m, P=1 * kN, case="")


def test_unknown_case():
    beam = Beam(
        length=6 * m,
        supports=[Pin(0 * m), Roller(6 * m)],
        loads=[UniformLoad(w=1 * kN / m, case="D")],
    )
    with pytest.raises(InputError, match="'L' has no loads") as err:
        solve_beam(beam, "L")
    assert err.value.name == "case"


def test_spring_needs_a_stiffness():
    with pytest.raises(InputError, match="needs k"):
        Spring(2 * m)


def test_function_load_that_cannot_meet_its_accuracy():
    def step(x):
        return Q_((x.to("m").magnitude > 2.1234) * 5.0, "kN/m")

    with pytest.raises(Exception, match="cannot be integrated to the accuracy") as err:
        Beam(
            length=6 * m,
            supports=[Pin(0 * m), Roller(6 * m)],
            loads=[FunctionLoad(func=step, description="step", start=0 * m, end=6 * m)],
        )
    assert "split the load" in str(err.value)


def test_position_off_the_beam_when_evaluating():
    r = solve_beam(
        Beam(length=6 * m, supports=[Pin(0 * m), Roller(6 * m)], loads=[UniformLoad(w=1 * kN / m)])
    )
    with pytest.raises(InputError, match="Position x must lie on the beam") as err:
        r.moment(7 * m)
    assert err.value.name == "x"


def test_wrong_types_for_hinges_and_EI():
    with pytest.raises(InputError, match=r"hinges\[0\] must be a Hinge"):
        Beam(length=6 * m, supports=[Fixed(0 * m)], hinges=[3 * m])
    with pytest.raises(InputError, match="EI must be a quantity") as err:
        Beam(length=6 * m, supports=[Fixed(0 * m)], EI=20000.0)
    assert err.value.name == "EI"
