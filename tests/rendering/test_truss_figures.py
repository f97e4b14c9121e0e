"""Truss figures on a sheet: the geometry with dimensions and names, one figure of loads per
load case, the member forces with T/C; labels clear of each other (measured in the SVG)."""

from __future__ import annotations

import pytest

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.analysis.truss_solve import combine_results, solve_truss_cases
from calcpack.errors import InputError
from calcpack.plots.truss import truss_svg
from calcpack.units import Q_, ureg
from calcpack.working import Figure, Sheet
from tests.rendering.svgtext import text_boxes

ft = ureg.ft


def _truss() -> Truss:
    """Invented demo: a 24 ft Pratt-like roof truss in six 4 ft panels, rise 6 ft."""
    panel, rise = 4 * ft, 6 * ft
    nodes = {f"L{i}": (i * panel, 0 * ft) for i in range(7)}
    nodes |= {f"U{i}": (i * panel, rise * min(i, 6 - i) / 3) for i in range(1, 6)}
    members = (
        [(f"L{i}", f"L{i + 1}") for i in range(6)]
        + [("L0", "U1"), ("U1", "U2"), ("U2", "U3"), ("U3", "U4"), ("U4", "U5"), ("U5", "L6")]
        + [(f"L{i}", f"U{i}") for i in range(1, 6)]
        + [("U1", "L2"), ("U2", "L3"), ("L3", "U4"), ("L4", "U5")]
    )
    P = Q_("300 lbf")
    loads = [JointLoad(f"U{i}", Fy=-P, case="D") for i in range(1, 6)]
    loads += [JointLoad(f"L{i}", Fy=-P / 2, case="D") for i in range(1, 6)]
    loads += [JointLoad(f"U{i}", Fy=-P, case="Lr") for i in range(1, 6)]
    return Truss.build(
        nodes=nodes,
        members=members,
        supports={"L0": "pin", "L6": "roller"},
        loads=loads,
        name="RT1",
    )


def _us() -> Sheet:
    return Sheet("t", system="US", auto_display=False)


def test_geometry_figure_carries_dimensions_in_feet_and_every_name() -> None:
    texts = [
        b.text
        for b in text_boxes(truss_svg(_truss(), _us().settings, loads=False, dimensions=True))
    ]
    assert texts.count("4.00 ft") == 6  # six panels of 4 ft (the invented geometry)
    assert "24.0 ft" in texts  # overall span
    assert texts.count("2.00 ft") == 3  # the rise of 6 ft in three 2 ft steps
    assert {f"L{i}" for i in range(7)} | {f"U{i}" for i in range(1, 6)} <= set(texts)
    assert not any(t.endswith("kip") for t in texts)  # the bare geometry shows no loads


def test_one_load_figure_per_case_with_only_that_case() -> None:
    block = _us().add(_truss().figures())
    figs = [s for s in block.steps if isinstance(s, Figure)]
    assert [f.options.get("case") for f in figs] == [None, "D", "Lr"]
    lr = [b.text for b in text_boxes(figs[2].svg())]
    assert lr.count("0.300 kip") == 5  # the five roof-live joint loads of 300 lbf
    assert "0.150 kip" not in lr  # the ceiling loads belong to case D only


def test_joint_names_do_not_overlap_other_text() -> None:
    result = combine_results(solve_truss_cases(_truss()), {"D": 1.0, "Lr": 1.0}, label="D + Lr")
    boxes = text_boxes(truss_svg(result, _us().settings))
    names = [b for b in boxes if any(a.startswith("cp-joint-") for a in b.ancestors)]
    assert len(names) == 12
    for n in names:
        for other in boxes:
            if other is not n:
                assert not n.overlaps(other), (n.text, other.text)


def test_result_working_shows_member_forces_with_tension_and_compression() -> None:
    result = combine_results(solve_truss_cases(_truss()), {"D": 1.0, "Lr": 1.0}, label="D + Lr")
    block = _us().add(result.working())
    fig = next(s for s in block.steps if isinstance(s, Figure))
    texts = [b.text for b in text_boxes(fig.svg())]
    assert "tension" in texts
    assert "compression" in texts
    assert "T tension, C compression" in fig.caption
    # by symmetry each support carries half of the total load: 5(300 + 150 + 300) lbf / 2
    assert "reaction at L0: 1.88 kip" in texts
    assert not any(isinstance(s, Figure) for s in result.working(figures=False).steps)


def test_unknown_case_is_refused_naming_it() -> None:
    with pytest.raises(InputError, match="case 'S'"):
        truss_svg(_truss(), None, case="S")
