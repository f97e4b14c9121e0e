"""Truss working: the joint and section working reproduce the solver's forces, T/C marking,
the order of joints, refusals of bad cuts, rendering, the diagram, light imports."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import TrussResult, solve_truss
from calcpack.errors import InputError, UnstableStructureError
from calcpack.units import ureg
from calcpack.working import Block, Derived

m, kN, deg = ureg.m, ureg.kN, ureg.degree


def roof() -> Truss:
    return Truss.build(
        nodes={
            "A": (0 * m, 0 * m),
            "C": (4 * m, 0 * m),
            "E": (8 * m, 0 * m),
            "B": (2 * m, 1.5 * m),
            "D": (6 * m, 1.5 * m),
            "F": (4 * m, 3 * m),
        },
        members=[
            ("A", "C"),
            ("C", "E"),
            ("A", "B"),
            ("B", "F"),
            ("F", "D"),
            ("D", "E"),
            ("B", "C"),
            ("C", "F"),
            ("C", "D"),
        ],
        supports={"A": "pin", "E": ("roller", 20 * deg)},
        loads=[
            JointLoad("F", Fy=-20 * kN),
            JointLoad("B", Fx=3 * kN, Fy=-10 * kN),
            JointLoad("D", Fy=-10 * kN, case="L"),
        ],
        name="Roof",
    )


def panel_truss(panels: int = 4) -> Truss:
    nodes = {f"L{i}": (3.0 * i * m, 0 * m) for i in range(panels + 1)}
    nodes |= {f"U{i}": (3.0 * i * m, 3 * m) for i in range(1, panels)}
    mem = [(f"L{i}", f"L{i + 1}") for i in range(panels)]
    mem += [(f"U{i}", f"U{i + 1}") for i in range(1, panels - 1)]
    mem += [("L0", "U1"), (f"U{panels - 1}", f"L{panels}")]
    mem += [(f"L{i}", f"U{i}") for i in range(1, panels)]
    mem += [(f"U{i}", f"L{i + 1}") for i in range(1, panels // 2)]
    mem += [(f"L{i - 1}", f"U{i}") for i in range(panels // 2 + 1, panels)]
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"L0": "pin", f"L{panels}": "roller"},
        loads=[JointLoad(f"L{i}", Fy=-10 * kN) for i in range(1, panels)],
        name="Panel",
    )


def derived(block: Block) -> dict[str, Derived]:
    return {s.name: s for s in block.steps if isinstance(s, Derived)}


def assert_member_values(result: TrussResult, block: Block) -> int:
    """Every member force derived in the working equals the solver's, to round-off."""
    count = 0
    scale = max(abs(f.to("kN").magnitude) for f in result.forces.values())
    for name, d in derived(block).items():
        member = next((mb for mb in result.truss.members if f"F_{mb.name}" == name), None)
        if member is None:
            continue
        expected = result.force(member.name).to("kN").magnitude
        assert d.quantity.to("kN").magnitude == pytest.approx(expected, abs=1e-9 * scale), name
        nature = {"T": "tension (T)", "C": "compression (C)", "0": "zero-force"}[
            result.nature(member.name)
        ]
        assert nature in d.description
        count += 1
    return count


@pytest.mark.parametrize("make", [roof, panel_truss])
def test_joint_working_reproduces_every_member(make: object) -> None:
    r = solve_truss(make())  # type: ignore[operator]
    order = r.joint_order()
    assert sorted(order) == sorted(n.name for n in r.truss.nodes)
    found = 0
    for node in order:
        block = r.joint_working(node)
        found += assert_member_values(r, block)
        assert block.text()
        assert "\\Sigma F_x = 0" in block.latex() or "\\Sigma F_y = 0" in block.latex()
    assert found == len(r.truss.members)  # each member found exactly once, in order


def test_reactions_working_matches_solver() -> None:
    r = solve_truss(roof())
    d = derived(r.reactions_working())
    assert set(d) == {"R_Ax", "R_Ay", "R_E"}
    for name, step in d.items():
        assert step.quantity.to("kN").magnitude == pytest.approx(
            r.reaction(name).to("kN").magnitude, rel=1e-12
        )


def test_reactions_first_moment_about_the_pin() -> None:
    r = solve_truss(panel_truss())
    text = r.reactions_working().text()
    assert text.index("ΣM_L0 = 0") < text.index("ΣF_x = 0")


@pytest.mark.parametrize(
    ("cut", "keep"),
    [
        (["U1U2", "U1L2", "L1L2"], None),
        (["U2U3", "L2U3", "L2L3"], "L4"),
        (["BF", "BC", "AC"], None),
        (["FD", "CD", "CE"], "E"),
    ],
)
def test_section_working_reproduces_cut_members(cut: list[str], keep: str | None) -> None:
    t = roof() if "BF" in cut or "FD" in cut else panel_truss()
    r = solve_truss(t)
    block = r.section_working(cut, keep=keep)
    assert assert_member_values(r, block) == 3
    assert "ΣM_" in block.text()  # moments about where two cut members meet


def test_section_with_parallel_chords_uses_force_sum() -> None:
    r = solve_truss(panel_truss())
    text = r.section_working(["U1U2", "U1L2", "L1L2"]).text()
    # The chords are parallel: the diagonal comes from ΣFy alone.
    assert "ΣF_y = 0" in text


def test_bad_cuts_are_refused() -> None:
    r = solve_truss(panel_truss())
    with pytest.raises(InputError, match="one to three members"):
        r.section_working(["U1U2", "U1L2", "L1L2", "L1U1"])
    with pytest.raises(InputError, match="leaves the truss in 1 part"):
        r.section_working(["U1U2", "L1L2"])
    with pytest.raises(InputError, match="no member 'ZZ'"):
        r.section_working(["ZZ"])


def test_cut_members_meeting_at_one_point_are_refused() -> None:
    # Cutting the three members at joint L1 frees that joint: their lines meet at L1 and a
    # section (with L1 kept) cannot separate them.
    r = solve_truss(panel_truss())
    with pytest.raises(UnstableStructureError, match="not independent"):
        r.section_working(["L0L1", "L1L2", "L1U1"], keep="L1")


def test_summary_and_display() -> None:
    r = solve_truss(roof(), case="D")
    text = r.text()
    assert "statically determinate and stable" in text
    assert "T/C" in text
    bundle = r._repr_mimebundle_()
    assert "text/html" in bundle


def test_diagram_svg_labels_members() -> None:
    r = solve_truss(roof())
    svg = r.diagram().svg()
    assert svg.lstrip().startswith("<?xml")
    assert "tension" in svg
    assert "compression" in svg


def test_computation_imports_stay_light() -> None:
    code = (
        "import json, sys\n"
        "from calcpack.units import ureg\n"
        "from calcpack.analysis.truss_model import Truss, JointLoad\n"
        "from calcpack.analysis.truss_solve import solve_truss\n"
        "import calcpack.analysis.freebody\n"
        "m, kN = ureg.m, ureg.kN\n"
        "t = Truss.build(nodes={'A': (0*m, 0*m), 'B': (4*m, 0*m), 'C': (2*m, 2*m)},\n"
        "    members=[('A','B'), ('B','C'), ('C','A')], supports={'A': 'pin', 'B': 'roller'},\n"
        "    loads=[JointLoad('C', Fy=-1*kN)])\n"
        "solve_truss(t)\n"
        "heavy = ['matplotlib', 'calcpack.plots', 'calcpack.analysis.truss_working', 'IPython']\n"
        "before = [h for h in heavy if h in sys.modules]\n"
        "solve_truss(t).working()\n"
        "after = [h for h in ['matplotlib', 'calcpack.plots'] if h in sys.modules]\n"
        "print(json.dumps([before, after]))\n"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout
    assert json.loads(out.strip().splitlines()[-1]) == [[], []]
