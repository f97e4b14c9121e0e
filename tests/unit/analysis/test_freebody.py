"""Free-body equilibrium: the choice of equations, refusals, working values, resultants."""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.freebody import (
    BodySupport,
    Couple,
    DistributedLoad,
    FreeBody,
    PointForce,
    solve_free_body,
)
from calcpack.errors import InputError, OutOfScopeError, UnstableStructureError
from calcpack.units import ureg
from calcpack.working import Derived

m, kN, deg = ureg.m, ureg.kN, ureg.degree

LOADS = [
    PointForce(2 * m, 0 * m, Fy=-10 * kN, label="P"),
    DistributedLoad(0 * m, 0 * m, 6 * m, 0 * m, 2 * kN / m),
    Couple(5 * kN * m, "C_0"),
]


def beam(*supports: BodySupport) -> FreeBody:
    return FreeBody("beam", LOADS, supports)


def test_pin_and_inclined_roller_by_hand() -> None:
    # Hand statics (common practice): ΣM_A: R_B cos30°·6 - 10·2 - 12·3 + 5 = 0.
    r = solve_free_body(
        beam(
            BodySupport("A", 0 * m, 0 * m, "pin"),
            BodySupport("B", 6 * m, 0 * m, "roller", 30 * deg),
        )
    )
    R_B = 51 / (6 * math.cos(math.radians(30)))
    assert r.reaction("R_B").to("kN").magnitude == pytest.approx(R_B, rel=1e-12)
    assert r.reaction("R_Ax").to("kN").magnitude == pytest.approx(R_B * 0.5, rel=1e-12)
    assert r.reaction("R_Ay").to("kN").magnitude == pytest.approx(
        22 - R_B * math.cos(math.radians(30)), rel=1e-12
    )
    first = r.equations[0]
    assert (first.kind, first.point_name, first.solves) == ("M", "A", ("R_B",))


def test_moment_point_where_two_unknown_lines_meet() -> None:
    # A link at A along 45° and a roller at B: the pin-free body needs the crossing point.
    fb = beam(
        BodySupport("A", 0 * m, 0 * m, "link", 45 * deg),
        BodySupport("B", 6 * m, 0 * m, "roller"),
        BodySupport("C", 3 * m, 2 * m, "link", 0 * deg),
    )
    r = solve_free_body(fb)
    assert r.equations[0].kind == "M"
    assert r.equations[0].point_name.startswith("O (where the lines of")
    for name, step in ((s.name, s) for s in r.working().steps if isinstance(s, Derived)):
        if name in r.reactions:
            assert step.quantity.to("kN").magnitude == pytest.approx(
                r.reactions[name].to("kN").magnitude, rel=1e-9, abs=1e-12
            )


def test_fixed_support() -> None:
    fb = FreeBody(
        "cantilever",
        [PointForce(3 * m, 0 * m, 2 * kN, -10 * kN, "P")],
        [BodySupport("A", 0 * m, 0 * m, "fixed")],
    )
    r = solve_free_body(fb)
    assert r.reaction("M_A").to("kN*m").magnitude == pytest.approx(30.0)  # P·L, common practice
    assert r.reaction("R_Ax").to("kN").magnitude == pytest.approx(-2.0)
    assert "M_A" in r.text()


def test_working_values_equal_reactions() -> None:
    r = solve_free_body(
        beam(
            BodySupport("A", 0 * m, 0 * m, "pin"),
            BodySupport("B", 6 * m, 0 * m, "roller", 30 * deg),
        )
    )
    steps = {s.name: s for s in r.working().steps if isinstance(s, Derived)}
    assert steps["W_w"].quantity.to("kN").magnitude == pytest.approx(12.0)
    for name in ("R_Ax", "R_Ay", "R_B"):
        assert steps[name].quantity.to("kN").magnitude == pytest.approx(
            r.reaction(name).to("kN").magnitude, rel=1e-12
        )


def test_trapezoidal_resultant() -> None:
    # Trapezoid 2 -> 6 kN/m over 4 m: W = 16 kN at 4(2 + 12)/(3·8) = 7/3 m (common practice).
    W = DistributedLoad(0 * m, 0 * m, 4 * m, 0 * m, 2 * kN / m, 6 * kN / m).resultant()
    assert W.Fy.to("kN").magnitude == pytest.approx(-16.0)
    assert W.x.to("m").magnitude == pytest.approx(7 / 3)


def test_more_than_three_unknowns() -> None:
    with pytest.raises(OutOfScopeError, match=r"4 unknown reactions .*statically indeterminate"):
        solve_free_body(
            beam(BodySupport("A", 0 * m, 0 * m, "pin"), BodySupport("B", 6 * m, 0 * m, "pin"))
        )


def test_parallel_reactions() -> None:
    with pytest.raises(UnstableStructureError, match="all parallel") as e:
        solve_free_body(
            beam(
                BodySupport("A", 0 * m, 0 * m, "roller"),
                BodySupport("B", 6 * m, 0 * m, "roller"),
                BodySupport("C", 3 * m, 0 * m, "roller"),
            )
        )
    assert e.value.part == "R_A, R_B, R_C"


def test_concurrent_reactions() -> None:
    with pytest.raises(UnstableStructureError, match=r"meet at one point \(0 m, 0 m\)"):
        solve_free_body(
            beam(
                BodySupport("A", 0 * m, 0 * m, "pin"),
                BodySupport("B", 6 * m, 0 * m, "link", 180 * deg),
            )
        )


def test_too_few_reactions() -> None:
    with pytest.raises(UnstableStructureError, match="only 2 unknown"):
        solve_free_body(beam(BodySupport("A", 0 * m, 0 * m, "pin")))


def test_bad_inputs_name_themselves() -> None:
    with pytest.raises(InputError, match="changes sign"):
        DistributedLoad(0 * m, 0 * m, 1 * m, 0 * m, 2 * kN / m, -1 * kN / m)
    with pytest.raises(InputError, match="Support A must be"):
        BodySupport("A", 0 * m, 0 * m, "hinge")  # type: ignore[arg-type]
    with pytest.raises(InputError, match="w1 of w"):
        DistributedLoad(0 * m, 0 * m, 1 * m, 0 * m, 2 * kN)
    with pytest.raises(InputError, match="used twice"):
        beam(BodySupport("A", 0 * m, 0 * m), BodySupport("A", 1 * m, 0 * m))


def test_sketch_is_svg_with_reaction_labels() -> None:
    r = solve_free_body(
        beam(
            BodySupport("A", 0 * m, 0 * m, "pin"),
            BodySupport("B", 6 * m, 0 * m, "roller", 30 * deg),
        )
    )
    svg = r.sketch().svg()
    assert svg.lstrip().startswith("<?xml")
    # matplotlib writes each text's string as an SVG comment beside its glyphs.
    assert "<!-- R_B = 9.81 kN -->" in svg
    assert "<!-- R_Ay = 13.5 kN -->" in svg
