"""Hypothesis strategies for plane trusses and free bodies (invented, randomly sized shapes)."""

from __future__ import annotations

from hypothesis import strategies as st

from calcpack.analysis.truss_model import JointLoad, Truss
from calcpack.units import ureg

m, kN, deg = ureg.m, ureg.kN, ureg.degree

forces_kN = st.floats(min_value=-50.0, max_value=50.0, allow_nan=False).map(
    lambda v: 0.0 if abs(v) < 1e-3 else v
)


@st.composite
def parallel_chord_truss(draw: st.DrawFn) -> Truss:
    """A Pratt or Warren-with-verticals truss of 2-6 panels, random size, random joint loads in
    two cases, a pin at the left and a roller (maybe inclined) at the right."""
    panels = draw(st.integers(min_value=2, max_value=6))
    a = draw(st.floats(min_value=0.5, max_value=8.0))
    h = draw(st.floats(min_value=0.5, max_value=5.0))
    style = draw(st.sampled_from(["pratt", "zigzag"]))
    nodes = {f"L{i}": (i * a * m, 0 * m) for i in range(panels + 1)}
    nodes |= {f"U{i}": (i * a * m, h * m) for i in range(panels + 1)}
    mem = [(f"L{i}", f"L{i + 1}") for i in range(panels)]
    mem += [(f"U{i}", f"U{i + 1}") for i in range(panels)]
    mem += [(f"L{i}", f"U{i}") for i in range(panels + 1)]
    for i in range(panels):
        if style == "zigzag" and i % 2:
            mem.append((f"U{i}", f"L{i + 1}"))
        elif style == "pratt" and i >= panels // 2:
            mem.append((f"L{i}", f"U{i + 1}"))
        else:
            mem.append((f"L{i}", f"U{i + 1}") if style == "zigzag" else (f"U{i}", f"L{i + 1}"))
    names = list(nodes)
    loads = []
    for _ in range(draw(st.integers(min_value=1, max_value=6))):
        node = draw(st.sampled_from(names))
        loads.append(
            JointLoad(
                node,
                draw(forces_kN) * kN,
                draw(forces_kN) * kN,
                case=draw(st.sampled_from(["D", "L"])),
            )
        )
    slope = draw(st.floats(min_value=-40.0, max_value=40.0))
    return Truss.build(
        nodes=nodes,
        members=mem,
        supports={"L0": "pin", f"L{panels}": ("roller", slope * deg)},
        loads=loads,
        EA=draw(st.floats(min_value=1e3, max_value=1e7)) * kN,
    )
