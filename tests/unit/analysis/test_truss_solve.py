"""Truss solver: determinacy, mechanisms, indeterminate trusses, load cases, superposition."""

from __future__ import annotations

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import (
    combine_results,
    determinacy,
    solve_truss,
    solve_truss_cases,
)
from calcpack.errors import InputError, UnstableStructureError
from calcpack.units import ureg

m, kN, deg = ureg.m, ureg.kN, ureg.degree


def square(diagonal: bool = True, supports: dict[str, object] | None = None) -> Truss:
    members = [("A", "B"), ("B", "C"), ("C", "D"), ("D", "A")]
    if diagonal:
        members.append(("A", "C"))
    return Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (3 * m, 0 * m), "C": (3 * m, 3 * m), "D": (0 * m, 3 * m)},
        members=members,
        supports=supports or {"A": "pin", "B": "roller"},  # type: ignore[arg-type]
        loads=[
            JointLoad("D", Fx=6 * kN, case="W"),
            JointLoad("C", Fy=-10 * kN, case="D"),
            JointLoad("D", Fy=-10 * kN, case="D"),
        ],
        EA=2.0e5 * kN,
    )


def test_determinacy_of_braced_square() -> None:
    det = determinacy(square())
    assert (det.members, det.reactions, det.joints, det.degree) == (5, 3, 4, 0)
    assert det.stable
    assert det.kind == "determinate"
    assert det.describe() == "m + r = 5 + 3 = 8 = 2j = 8: statically determinate and stable"


def test_mechanism_names_the_joint() -> None:
    with pytest.raises(UnstableStructureError, match="mechanism at joint") as e:
        solve_truss(square(diagonal=False))
    assert e.value.part in ("joint C", "joint D")
    assert "m + r = 4 + 3 = 7 < 2j = 8" in str(e.value)


def test_counting_alone_is_not_enough() -> None:
    # m + r = 2j, but both rollers and the pin line up: the reactions meet at one point.
    t = square(supports={"A": ("roller", 90 * deg), "B": "roller", "C": "roller"})
    det = determinacy(t)
    assert det.degree == 0
    assert not det.stable
    with pytest.raises(UnstableStructureError, match="rotate about the point") as e:
        solve_truss(t)
    assert e.value.part == "supports"


def test_parallel_reactions_let_the_truss_slide() -> None:
    t = square(supports={"A": "roller", "B": "roller"})
    with pytest.raises(UnstableStructureError, match="slide horizontally"):
        solve_truss(t)


def test_indeterminate_without_EA_is_refused() -> None:
    t = Truss.build(
        nodes={"A": (0 * m, 0 * m), "B": (3 * m, 0 * m), "C": (3 * m, 3 * m), "D": (0 * m, 3 * m)},
        members=[("A", "B"), ("B", "C"), ("C", "D"), ("D", "A"), ("A", "C"), ("B", "D")],
        supports={"A": "pin", "B": "roller"},
        loads=[JointLoad("D", Fx=6 * kN)],
    )
    with pytest.raises(InputError, match="EA is missing for members AB, BC") as e:
        solve_truss(t)
    assert "indeterminate to degree 1" in str(e.value)
    with pytest.raises(InputError, match="equilibrium alone cannot find"):
        solve_truss(t, method="equilibrium")


def test_stiffness_cross_checks_a_determinate_truss() -> None:
    t = square()
    r = solve_truss(t)
    assert r.method == "equilibrium"
    assert r.stiffness_check is not None
    assert r.stiffness_check < 1e-9  # two independent solves agree to round-off
    k = solve_truss(t, method="stiffness")
    assert k.method == "stiffness"
    for name in r.forces:
        assert k.force(name).to("kN").magnitude == pytest.approx(
            r.force(name).to("kN").magnitude, abs=1e-9
        )
    assert k.displacements is not None
    # Support A is pinned: it does not move.
    assert abs(k.displacements["A"][0].to("mm").magnitude) < 1e-12


def test_load_cases_superpose() -> None:
    t = square()
    cases = solve_truss_cases(t)
    assert list(cases) == ["W", "D"]
    everything = solve_truss(t)
    total = cases["D"] + cases["W"]
    combo = combine_results(cases, {"D": 1.2, "W": 1.6})
    assert combo.label == "1.2 D + 1.6 W"
    for name in everything.forces:
        assert total.force(name).to("kN").magnitude == pytest.approx(
            everything.force(name).to("kN").magnitude, abs=1e-12
        )
        assert combo.force(name).to("kN").magnitude == pytest.approx(
            1.2 * cases["D"].force(name).to("kN").magnitude
            + 1.6 * cases["W"].force(name).to("kN").magnitude,
            abs=1e-12,
        )
    assert (2 * cases["D"]).applied["C"][1].to("kN").magnitude == pytest.approx(-20.0)


def test_unknown_case_and_bad_factor() -> None:
    t = square()
    with pytest.raises(InputError, match="Load case 'S' has no loads"):
        solve_truss(t, case="S")
    with pytest.raises(InputError, match="names load case 'L'"):
        combine_results(solve_truss_cases(t), {"D": 1.2, "L": 1.6})


def test_results_of_different_trusses_do_not_add() -> None:
    a, b = solve_truss(square()), solve_truss(square())
    with pytest.raises(InputError, match="same truss"):
        a + b


def test_nature_and_lookup_errors() -> None:
    r = solve_truss(square(), case="D")
    assert r.nature("AB") in "TC0"
    with pytest.raises(InputError, match="no member 'XY'"):
        r.force("XY")
    with pytest.raises(InputError, match="no reaction 'R_Q'"):
        r.reaction("R_Q")
    _rx, ry = r.reaction_at("A")
    assert ry.to("kN").magnitude + r.reaction("R_B").to("kN").magnitude == pytest.approx(20.0)
