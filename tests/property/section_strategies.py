"""Hypothesis strategies for sections, shared by the section property tests."""

from __future__ import annotations

from hypothesis import strategies as st

from calcpack.sections import Angle, Channel, ISection, Rectangle, Tee
from calcpack.units import ureg

mm = ureg.mm

lengths = st.floats(min_value=5.0, max_value=800.0, allow_nan=False, allow_infinity=False)
offsets = st.floats(min_value=-5000.0, max_value=5000.0, allow_nan=False, allow_infinity=False)
fractions = st.floats(min_value=0.05, max_value=0.95)


@st.composite
def rectangles(draw: st.DrawFn) -> Rectangle:
    return Rectangle(b=draw(lengths) * mm, d=draw(lengths) * mm)


@st.composite
def i_sections(draw: st.DrawFn) -> ISection:
    d = draw(st.floats(100, 1000))
    bf = draw(st.floats(50, 500))
    # thin enough plates (b/t >= 4) for the thin-walled J to apply
    tf = draw(st.floats(0.02, 0.2)) * min(d / 2, bf)
    tw = draw(st.floats(0.02, 0.5)) * min(bf / 2, d / 4)
    r_max = min((bf - tw) / 2, (d - 2 * tf) / 2) * 0.9
    r = draw(st.floats(0, 1)) * min(r_max, 3 * tw)
    return ISection(d=d * mm, bf=bf * mm, tf=tf * mm, tw=tw * mm, r=r * mm)


@st.composite
def open_shapes(draw: st.DrawFn) -> Rectangle | ISection | Tee | Channel | Angle:
    kind = draw(st.sampled_from(["rect", "i", "tee", "channel", "angle"]))
    if kind == "rect":
        return draw(rectangles())
    if kind == "i":
        return draw(i_sections())
    d = draw(st.floats(50, 600))
    b = draw(st.floats(30, 400))
    t = draw(st.floats(0.03, 0.3)) * min(b, d)
    if kind == "tee":
        return Tee(d=d * mm, bf=b * mm, tf=t * mm, tw=t * mm * 0.8)
    if kind == "channel":
        return Channel(d=d * mm, bf=b * mm, tf=min(t, d * 0.3) * mm, tw=t * mm * 0.8)
    return Angle(d=d * mm, b=b * mm, t=t * mm, r=t * 0.5 * mm)
