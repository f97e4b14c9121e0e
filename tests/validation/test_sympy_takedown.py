"""Load takedown against sympy's continuum mechanics beam.

Reference: ``sympy.physics.continuum_mechanics.beam.Beam`` (a general-purpose library) solves
each load case of the supported beam on its own; the load carried onto the supporting post must
equal sympy's support reaction for that case, and a supporting beam loaded with the carried
point loads must have sympy's reactions for that beam. Tolerance 1e-9 relative: both are exact
linear solutions, the difference is floating-point rounding.
"""

from __future__ import annotations

import json

import pytest
import sympy
from sympy.physics.continuum_mechanics.beam import Beam as SymBeam

from calcpack import ureg
from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam, solve_cases
from calcpack.errors import OutOfScopeError
from calcpack.loads import PointLoad, UniformLoad
from calcpack.working import Sheet
from calcpack.working.links import SHEET_ENV

_NB = {"cells": [], "metadata": {}, "nbformat": 4, "nbformat_minor": 5}


def _sympy_reactions(span: int, loads: list[tuple[str, float, float]]) -> dict[int, float]:
    """Reactions (upward +, N) of a simple span under point loads ("P", x, N) and full
    uniform loads ("w", 0, N/m), solved by sympy."""
    b = SymBeam(span, 1, 1)
    r0 = b.apply_support(0, type="pin")
    r1 = b.apply_support(span, type="roller")
    for kind, x, value in loads:
        if kind == "P":
            b.apply_load(-sympy.nsimplify(value), sympy.nsimplify(x), -1)
        else:
            b.apply_load(-sympy.nsimplify(value), 0, 0, end=span)
    b.solve_for_reaction_loads(r0, r1)
    return {0: float(b.reaction_loads[r0]), span: float(b.reaction_loads[r1])}


@pytest.fixture
def project(tmp_path, monkeypatch):
    (tmp_path / "sheets").mkdir()
    text = ""
    for name in ("01_joist", "02_post"):
        (tmp_path / "sheets" / f"{name}.ipynb").write_text(json.dumps(_NB))
        text += f'[[sheets]]\npath = "sheets/{name}.ipynb"\n'
    (tmp_path / "calcpack.toml").write_text(text)
    monkeypatch.chdir(tmp_path / "sheets")
    monkeypatch.delenv("CALCPACK_BUILDING", raising=False)
    monkeypatch.delenv("CALCPACK_EXPORTS_DIR", raising=False)
    return tmp_path


def test_reactions_by_case_become_post_loads_equal_to_sympy(project, monkeypatch):
    joist = Beam(
        length=6 * ureg.m,
        supports=[Pin(0 * ureg.m, name="A"), Roller(6 * ureg.m, name="B")],
        loads=[
            UniformLoad(w=2.5 * ureg.kN / ureg.m, case="D"),
            PointLoad(x=2 * ureg.m, P=12 * ureg.kN, case="L"),
        ],
    )
    monkeypatch.setenv(SHEET_ENV, "sheets/01_joist.ipynb")
    s1 = Sheet("Joist J1", auto_display=False)
    s1.export_reactions(solve_cases(joist), "B", name="R_B", member="J1")
    monkeypatch.delenv(SHEET_ENV)

    s2 = Sheet("Post P1", auto_display=False)
    R = s2.import_cases("01_joist", "R_B", dimension="[force]")
    td = s2.takedown(R, onto="post P1")
    axial = {c: q.to("N").magnitude for c, q in td.axial().items()}
    ref_D = _sympy_reactions(6, [("w", 0, 2500.0)])[6]
    ref_L = _sympy_reactions(6, [("P", 2, 12000.0)])[6]
    assert axial["D"] == pytest.approx(ref_D, rel=1e-9)  # sympy continuum mechanics
    assert axial["L"] == pytest.approx(ref_L, rel=1e-9)  # sympy continuum mechanics
    assert R["D"].source == "sheet 1, R_B, case D"
    table = s2.steps[-1].text()
    assert "sheet 1, R_B, case L" in table
    assert "Load takedown onto post P1" in table
    # the reactions go out in the exporting sheet's units: a US sheet exports pounds
    monkeypatch.setenv(SHEET_ENV, "sheets/01_joist.ipynb")
    us = Sheet("Joist J1", auto_display=False, system="US")
    (entry, *_) = us.export_reactions(solve_cases(joist), "B", name="R_B", member="J1").entries
    monkeypatch.delenv(SHEET_ENV)
    assert entry["unit"] in ("lbf", "kip")
    assert ureg.Quantity(entry["value"], entry["pint_unit"]).to("N").magnitude == pytest.approx(
        ref_D, rel=1e-12
    )


def test_carried_point_loads_on_a_supporting_beam_match_sympy():
    joist_B = {"D": 7.5 * ureg.kN, "L": 4.0 * ureg.kN}
    joist_C = {"D": 3.0 * ureg.kN}
    from calcpack.loads.takedown import takedown

    td = takedown(joist_B, joist_C, onto="beam B2 at 1.5 m")
    loads = td.point_loads(1.5 * ureg.m)
    beam = Beam(
        length=4 * ureg.m,
        supports=[Pin(0 * ureg.m, name="A"), Roller(4 * ureg.m, name="B")],
        loads=list(loads),
    )
    got = solve_cases(beam)
    ref_D = _sympy_reactions(4, [("P", 1.5, 10500.0)])  # 7.5 + 3.0 kN summed for case D
    ref_L = _sympy_reactions(4, [("P", 1.5, 4000.0)])
    for case, ref in (("D", ref_D), ("L", ref_L)):
        for support, x in (("A", 0), ("B", 4)):
            Fy = got[case].reaction(support).Fy.to("N").magnitude
            assert Fy == pytest.approx(ref[x], rel=1e-9)  # sympy continuum mechanics


def test_a_combination_is_refused_for_takedown():
    from calcpack.loads.takedown import reactions_by_case

    joist = Beam(
        length=4 * ureg.m,
        supports=[Pin(0 * ureg.m, name="A"), Roller(4 * ureg.m, name="B")],
        loads=[UniformLoad(w=2 * ureg.kN / ureg.m, case="D")],
    )
    factored = solve_beam(joist, case="D") * 1.4
    with pytest.raises(OutOfScopeError, match="unfactored"):
        reactions_by_case({"D": factored}, "A")
