"""The beam working: every reaction written in the equations, evaluated by the working module
from its own formula, equals the exact solver's value (common practice: the symbolic formula
evaluated equals the numeric result); the cut-section working gives V and M at the cut."""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Fixed, Hinge, Pin, Roller, Spring, solve_beam
from calcpack.loads import AreaLoad, LinearLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_, ureg
from calcpack.working import Derived, Equation, Sheet

m, kN = ureg.m, ureg.kN
EI = Q_(25e3, "kN*m**2")

BEAMS = {
    "overhang, mixed": Beam(
        length=10 * m,
        supports=[Pin(0 * m), Roller(7.5 * m)],
        EI=EI,
        loads=[
            UniformLoad(w=6 * kN / m, case="D"),
            AreaLoad(q=Q_(2, "kPa"), width=2.5 * m, start=0 * m, end=7.5 * m, case="L"),
            PointLoad(x=10 * m, P=12 * kN, case="D"),
            LinearLoad(w_start=0 * kN / m, w_end=8 * kN / m, start=2 * m, end=6 * m, case="L"),
            PointMoment(x=4 * m, C=10 * kN * m, case="L"),
        ],
    ),
    "cantilever": Beam(
        length=4 * m,
        supports=[Fixed(0 * m)],
        loads=[PointLoad(x=4 * m, P=5 * kN), PointMoment(x=2 * m, C=3 * kN * m)],
    ),
    "propped cantilever": Beam(
        length=8 * m,
        supports=[Fixed(0 * m), Roller(8 * m)],
        EI=EI,
        loads=[UniformLoad(w=10 * kN / m)],
    ),
    "three spans": Beam(
        length=18 * m,
        supports=[Pin(0 * m), Roller(6 * m), Roller(12 * m), Roller(18 * m)],
        EI=EI,
        loads=[UniformLoad(w=10 * kN / m), PointLoad(x=9 * m, P=20 * kN)],
    ),
    "fixed-fixed": Beam(
        length=6 * m,
        supports=[Fixed(0 * m), Fixed(6 * m)],
        EI=EI,
        loads=[UniformLoad(w=12 * kN / m, start=1 * m, end=4 * m)],
    ),
    "hinged, inclined load": Beam(
        length=12 * m,
        supports=[Fixed(0 * m), Roller(12 * m)],
        hinges=[Hinge(4 * m)],
        EI=EI,
        loads=[UniformLoad(w=6 * kN / m), PointLoad.inclined(8 * m, 10 * kN, 60 * ureg.deg)],
    ),
    "spring prop": Beam(
        length=10 * m,
        supports=[Pin(0 * m), Spring(5 * m, k=Q_(2e3, "kN/m")), Roller(10 * m)],
        EI=EI,
        loads=[UniformLoad(w=8 * kN / m)],
    ),
}


def _derived(block):
    out = {}
    for step in block.steps:
        if isinstance(step, Derived):
            out[step.name] = step.quantity
    return out


@pytest.mark.parametrize("name", list(BEAMS))
def test_reactions_in_the_working_equal_the_solver(name):
    r = solve_beam(BEAMS[name])
    block = r.working()
    values = _derived(block)
    for reaction in r.reactions:
        s = r.beam.support(reaction.support)
        if s.restrains_v:
            got = values[f"R_{reaction.support}"].to("kN").magnitude
            assert got == pytest.approx(reaction.Fy.to("kN").magnitude, rel=1e-9, abs=1e-9)
        if s.restrains_rotation:
            got = values[f"M_{reaction.support}"].to("kN*m").magnitude
            assert got == pytest.approx(reaction.C.to("kN*m").magnitude, rel=1e-9, abs=1e-9)
    assert any(isinstance(st, Equation) for st in block.steps)


def test_determinate_working_takes_moments_about_a_support_then_sums_forces():
    text = solve_beam(BEAMS["overhang, mixed"]).working().text()
    assert "ΣM_A = 0" in text
    assert "ΣF_y = 0" in text
    assert text.index("ΣM_A = 0") < text.index("ΣF_y = 0")
    assert "w_2 = q_2·b_2" in text  # the area load × tributary width conversion
    assert "W_3 = (w_3a + w_3b)·(4.00 m)/2" in text  # a resultant, P = ∫w dx in closed form


def test_indeterminate_working_shows_the_compatibility_conditions():
    text = solve_beam(BEAMS["three spans"]).working().text()
    assert "Flexibility method" in text
    assert "Δ_B0 + f_BB·R_B + f_BC·R_C = 0" in text
    assert "statically indeterminate to degree 2" in text


def test_hinge_gives_a_moment_equation_of_one_part():
    text = solve_beam(BEAMS["hinged, inclined load"]).working().text()
    assert "ΣM_H1 = 0" in text
    assert "ΣF_x = 0: H_A + H_2 = 0" in text or "ΣF_x = 0" in text


@pytest.mark.parametrize(
    ("name", "x", "side"),
    [
        ("overhang, mixed", 3.0, "left"),
        ("overhang, mixed", 7.5, "left"),
        ("overhang, mixed", 7.5, "right"),
        ("cantilever", 1.0, "left"),
        ("propped cantilever", 5.0, "left"),
        ("hinged, inclined load", 8.0, "right"),
    ],
)
def test_cut_section_gives_V_and_M(name, x, side):
    r = solve_beam(BEAMS[name])
    values = _derived(r.cut(x * m, side=side))
    assert values["V"].to("kN").magnitude == pytest.approx(
        r.shear(x * m, side=side).to("kN").magnitude, rel=1e-9, abs=1e-9
    )
    assert values["M"].to("kN*m").magnitude == pytest.approx(
        r.moment(x * m, side=side).to("kN*m").magnitude, rel=1e-9, abs=1e-9
    )


def test_working_renders_and_adds_to_a_sheet():
    r = solve_beam(BEAMS["propped cantilever"])
    s = Sheet("Beam", auto_display=False)
    block = s.add(r.working())
    assert "cp-math" in block._repr_html_()
    assert r"\Sigma" in block._repr_latex_()
    names = [rec["name"] for rec in block.records()["values"]]
    assert "M_max" in names
    assert "delta_max" in names


def test_combination_working_shows_factored_loads():
    beam = BEAMS["overhang, mixed"]
    from calcpack.analysis.beam import solve_cases

    by_case = solve_cases(beam)
    combo = 1.2 * by_case["D"] + 1.6 * by_case["L"]
    block = combo.working()
    text = block.text()
    assert "(1.2 × D)" in text
    assert "(1.6 × L)" in text
    values = _derived(block)
    assert values["R_B"].to("kN").magnitude == pytest.approx(
        combo.reaction("B").Fy.to("kN").magnitude, rel=1e-9
    )
