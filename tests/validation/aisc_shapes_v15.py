"""W-shapes used by the AISC Design Examples tests, with properties as printed in the AISC
Shapes Database v15.0 (American Institute of Steel Construction, 2017): the properties the
Companion's examples read from Manual Table 1-1, read against the database."""

from __future__ import annotations

from calcpack.checks import IShape
from calcpack.units import ureg

inch = ureg.inch

W18X50 = IShape(
    "W18x50", "AISC Shapes Database v15.0",
    d=18.0 * inch, bf=7.50 * inch, tf=0.570 * inch, tw=0.355 * inch, h_tw=45.2,
    Ix=800 * inch**4, Sx=88.9 * inch**3, Zx=101 * inch**3, Iy=40.1 * inch**4, ry=1.65 * inch,
    J=1.24 * inch**4, Cw=3040 * inch**6, h0=17.4 * inch,
)  # fmt: skip
W24X62 = IShape(
    "W24x62", "AISC Shapes Database v15.0",
    d=23.7 * inch, bf=7.04 * inch, tf=0.590 * inch, tw=0.430 * inch, h_tw=50.1,
    Ix=1550 * inch**4, Sx=131 * inch**3, Zx=153 * inch**3, Iy=34.5 * inch**4, ry=1.38 * inch,
    J=1.71 * inch**4, Cw=4620 * inch**6, h0=23.1 * inch,
)  # fmt: skip
