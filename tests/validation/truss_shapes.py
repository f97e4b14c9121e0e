"""Truss shapes shared by the truss validation and property tests (geometry only, invented)."""

from __future__ import annotations

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.units import ureg

m, kN, deg = ureg.m, ureg.kN, ureg.degree


def pratt(panels: int = 6, a: float = 3.0, h: float = 3.0, P: float = 10.0) -> Truss:
    """Pratt truss: verticals, diagonals sloping down toward mid-span; bottom-chord loads."""
    nodes = {f"L{i}": (i * a * m, 0 * m) for i in range(panels + 1)}
    nodes |= {f"U{i}": (i * a * m, h * m) for i in range(1, panels)}
    mem = [(f"L{i}", f"L{i + 1}") for i in range(panels)]
    mem += [(f"U{i}", f"U{i + 1}") for i in range(1, panels - 1)]
    mem += [("L0", "U1"), (f"U{panels - 1}", f"L{panels}")]
    mem += [(f"L{i}", f"U{i}") for i in range(1, panels)]
    half = panels // 2
    mem += [(f"U{i}", f"L{i + 1}") for i in range(1, half)]
    mem += [(f"L{i - 1}", f"U{i}") for i in range(half + 1, panels)]
    loads = [JointLoad(f"L{i}", Fy=-P * kN) for i in range(1, panels)]
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"L0": "pin", f"L{panels}": "roller"},
        loads=loads,
        name="Pratt",
    )


def howe(panels: int = 4, a: float = 2.5, h: float = 2.5, P: float = 12.0) -> Truss:
    """Howe truss: verticals, diagonals sloping up toward mid-span; top-chord loads."""
    nodes = {f"L{i}": (i * a * m, 0 * m) for i in range(panels + 1)}
    nodes |= {f"U{i}": (i * a * m, h * m) for i in range(1, panels)}
    mem = [(f"L{i}", f"L{i + 1}") for i in range(panels)]
    mem += [(f"U{i}", f"U{i + 1}") for i in range(1, panels - 1)]
    mem += [("L0", "U1"), (f"U{panels - 1}", f"L{panels}")]
    mem += [(f"L{i}", f"U{i}") for i in range(1, panels)]
    half = panels // 2
    mem += [(f"L{i}", f"U{i + 1}") for i in range(1, half)]
    mem += [(f"U{i - 1}", f"L{i}") for i in range(half + 1, panels)]
    loads = [JointLoad(f"U{i}", Fy=-P * kN, case="D") for i in range(1, panels)]
    loads.append(JointLoad("U1", Fx=4 * kN, case="W"))
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"L0": "pin", f"L{panels}": "roller"},
        loads=loads,
        name="Howe",
    )


def warren(panels: int = 4, a: float = 4.0, h: float = 3.0) -> Truss:
    """Warren truss without verticals: bottom nodes L0..Ln, top nodes T1..Tn at mid-panel."""
    nodes = {f"L{i}": (i * a * m, 0 * m) for i in range(panels + 1)}
    nodes |= {f"T{i}": ((i - 0.5) * a * m, h * m) for i in range(1, panels + 1)}
    mem = [(f"L{i}", f"L{i + 1}") for i in range(panels)]
    mem += [(f"T{i}", f"T{i + 1}") for i in range(1, panels)]
    mem += [(f"L{i - 1}", f"T{i}") for i in range(1, panels + 1)]
    mem += [(f"T{i}", f"L{i}") for i in range(1, panels + 1)]
    loads = [JointLoad(f"T{i}", Fy=-(8.0 + i) * kN) for i in range(1, panels + 1)]
    loads.append(JointLoad("L2", Fx=3 * kN, Fy=-5 * kN))
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"L0": "pin", f"L{panels}": "roller"},
        loads=loads,
        name="Warren",
    )


def cantilever(panels: int = 3, a: float = 2.0, h: float = 2.0, P: float = 15.0) -> Truss:
    """Cantilever truss off a wall: both wall joints pinned, no member between them; a
    tapering top chord, tip load."""
    nodes = {"A": (0 * m, h * m), "B": (0 * m, 0 * m)}
    for i in range(1, panels + 1):
        nodes[f"B{i}"] = (i * a * m, 0 * m)
        if i < panels:
            nodes[f"T{i}"] = (i * a * m, h * (panels - i) / panels * m)
    mem = [("B", "B1")] + [(f"B{i}", f"B{i + 1}") for i in range(1, panels)]
    mem += [("A", "T1")] + [(f"T{i}", f"T{i + 1}") for i in range(1, panels - 1)]
    mem += [(f"T{panels - 1}", f"B{panels}")]
    mem += [(f"B{i}", f"T{i}") for i in range(1, panels)]
    mem += [("A", "B1")] + [(f"T{i}", f"B{i + 1}") for i in range(1, panels - 1)]
    loads = [JointLoad(f"B{panels}", Fy=-P * kN), JointLoad("T1", Fy=-5 * kN)]
    return Truss.build(
        nodes=nodes, members=mem, supports={"A": "pin", "B": "pin"}, loads=loads, name="Cantilever"
    )


def inclined_roller_roof(slope_deg: float = 30.0) -> Truss:
    """A symmetric roof truss (fink-like) on a pin at A and a roller at E on a surface
    inclined at ``slope_deg``; wind-like inclined load on one rafter."""
    nodes = {
        "A": (0 * m, 0 * m),
        "C": (4 * m, 0 * m),
        "E": (8 * m, 0 * m),
        "B": (2 * m, 1.5 * m),
        "D": (6 * m, 1.5 * m),
        "F": (4 * m, 3 * m),
    }
    mem = [
        ("A", "C"),
        ("C", "E"),
        ("A", "B"),
        ("B", "F"),
        ("F", "D"),
        ("D", "E"),
        ("B", "C"),
        ("C", "F"),
        ("C", "D"),
    ]
    loads = [
        JointLoad("F", Fy=-20 * kN),
        JointLoad("B", Fy=-10 * kN),
        JointLoad("D", Fy=-10 * kN),
        JointLoad.polar("B", 6 * kN, -53.13 * deg),
    ]
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"A": "pin", "E": ("roller", slope_deg * deg)},
        loads=loads,
        name="Roof on inclined roller",
    )
