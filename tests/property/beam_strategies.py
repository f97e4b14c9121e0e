"""Hypothesis strategies for random beams (shared by the beam property tests)."""

from __future__ import annotations

from hypothesis import strategies as st

from calcpack.analysis.beam import Beam, Fixed, Hinge, Pin, Roller
from calcpack.loads import LinearLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_

LAYOUTS = {
    # fractions of L: (kind, position); hinges as fractions of L
    "simple": ([("pin", 0.0), ("roller", 1.0)], []),
    "overhangs": ([("pin", 0.15), ("roller", 0.8)], []),
    "cantilever": ([("fixed", 0.0)], []),
    "cantilever right": ([("fixed", 1.0)], []),
    "propped": ([("fixed", 0.0), ("roller", 1.0)], []),
    "fixed-fixed": ([("fixed", 0.0), ("fixed", 1.0)], []),
    "two spans": ([("pin", 0.0), ("roller", 0.45), ("roller", 1.0)], []),
    "three spans overhang": ([("pin", 0.0), ("roller", 0.3), ("roller", 0.6), ("roller", 0.9)], []),
    "hinged cantilever": ([("fixed", 0.0), ("roller", 1.0)], [0.35]),
    "Gerber": ([("pin", 0.0), ("roller", 0.4), ("roller", 1.0)], [0.55]),
    "hinged indeterminate": ([("fixed", 0.0), ("roller", 0.5), ("fixed", 1.0)], [0.25]),
}
KINDS = {"pin": Pin, "roller": Roller, "fixed": Fixed}

frac = st.floats(min_value=0.0, max_value=1.0, allow_nan=False)
mag = st.floats(min_value=-50.0, max_value=50.0, allow_nan=False).filter(lambda v: abs(v) > 0.5)
cases = st.sampled_from(["D", "L", "S"])


@st.composite
def loads(draw, L: float):
    kind = draw(st.sampled_from(["P", "C", "w", "lin"]))
    case = draw(cases)
    if kind == "P":
        return PointLoad(x=Q_(draw(frac) * L, "m"), P=Q_(draw(mag), "kN"), case=case)
    if kind == "C":
        return PointMoment(x=Q_(draw(frac) * L, "m"), C=Q_(draw(mag), "kN*m"), case=case)
    a, b = sorted((draw(frac), draw(frac)))
    if b - a < 0.02:
        b = min(a + 0.1, 1.0)
        a = b - 0.1
    if kind == "w":
        return UniformLoad(
            w=Q_(draw(mag), "kN/m"), start=Q_(a * L, "m"), end=Q_(b * L, "m"), case=case
        )
    return LinearLoad(
        w_start=Q_(draw(mag), "kN/m"),
        w_end=Q_(draw(mag), "kN/m"),
        start=Q_(a * L, "m"),
        end=Q_(b * L, "m"),
        case=case,
    )


@st.composite
def beams(draw, layouts: list[str] | None = None):
    """A stable random beam with 1 to 5 loads (couples kept off hinges)."""
    name = draw(st.sampled_from(layouts or sorted(LAYOUTS)))
    sup, hin = LAYOUTS[name]
    L = draw(st.floats(min_value=2.0, max_value=20.0))
    items = draw(st.lists(loads(L), min_size=1, max_size=5))
    hinge_x = [h * L for h in hin]
    items = [
        ld
        for ld in items
        if not (
            isinstance(ld, PointMoment) and any(abs(ld.x.magnitude - h) < 1e-6 * L for h in hinge_x)
        )
    ] or [UniformLoad(w=Q_(10.0, "kN/m"))]
    EI = Q_(draw(st.floats(min_value=1e3, max_value=1e5)), "kN*m**2")
    return Beam(
        length=Q_(L, "m"),
        supports=[KINDS[k](Q_(f * L, "m")) for k, f in sup],
        hinges=[Hinge(Q_(x, "m")) for x in hinge_x],
        loads=items,
        EI=EI,
        name=name,
    )
