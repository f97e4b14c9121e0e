"""Solid steel bars (rectangular and round) as shapes for the AISC 360-16 member checks.

Bars are not in the AISC Shapes Database; their properties follow from their dimensions by the
closed forms of a solid rectangle and a solid circle (any mechanics text: A = dt, I = td³/12,
S = td²/6, Z = td²/4; A = πD²/4, I = πD⁴/64, S = πD³/32, Z = D³/6, J = πD⁴/32). The torsional
constant of a rectangle is J ≈ (d t³/3)(1 − 0.63 t/d) (common practice; within 1 % of the exact
series for d ≥ t). Each property is a quantity in inches; the source says "computed from the
dimensions".

Axes: x is the major axis of a rectangular bar (bending in the plane of its depth d, t the
width parallel to the axis), as in AISC 360-16 §F11.
"""

from __future__ import annotations

import math
from types import MappingProxyType

from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive, within

__all__ = ["rectangular_bar", "round_bar"]

_SOURCE = "computed from the bar's dimensions (solid section closed forms)"


def _inch(name: str, q: Quantity) -> float:
    positive(name, dimension(name, q, "[length]"))
    return float(q.to("inch").magnitude)


def rectangular_bar(*, d: Quantity, t: Quantity) -> SteelShape:
    """A rectangular (or square) bar of depth ``d`` and width ``t`` (t ≤ d), bent about x.

    Raises:
        InputError: a dimension not a positive length, or t > d (name the bar by its depth
            in the plane of bending: d ≥ t).
    """
    dd, tt = _inch("d", d), _inch("t", t)
    within("t", t, hi=d, rule="t is the width parallel to the axis of bending, d ≥ t (§F11)")

    def q(v: float, u: str) -> Quantity:
        return Q_(v, u)

    props = {
        "A": q(dd * tt, "inch**2"),
        "d": q(dd, "inch"),
        "t": q(tt, "inch"),
        "Ix": q(tt * dd**3 / 12, "inch**4"),
        "Sx": q(tt * dd**2 / 6, "inch**3"),
        "Zx": q(tt * dd**2 / 4, "inch**3"),
        "rx": q(dd / math.sqrt(12), "inch"),
        "Iy": q(dd * tt**3 / 12, "inch**4"),
        "Sy": q(dd * tt**2 / 6, "inch**3"),
        "Zy": q(dd * tt**2 / 4, "inch**3"),
        "ry": q(tt / math.sqrt(12), "inch"),
        "J": q(dd * tt**3 / 3 * (1 - 0.63 * tt / dd), "inch**4"),
        # warping of a solid rectangle is negligible; C_w = 0 understates torsional buckling
        # strength (conservative)
        "Cw": q(0.0, "inch**6"),
    }
    name = f"Bar {d:~P} x {t:~P}"
    return SteelShape(name, "BAR", _SOURCE, MappingProxyType(props))


def round_bar(*, D: Quantity) -> SteelShape:
    """A solid round bar of diameter ``D``.

    Raises:
        InputError: D not a positive length.
    """
    dd = _inch("D", D)
    i = math.pi * dd**4 / 64
    props = {
        "A": Q_(math.pi * dd**2 / 4, "inch**2"),
        "OD": Q_(dd, "inch"),
        "d": Q_(dd, "inch"),
        **{f"I{a}": Q_(i, "inch**4") for a in "xy"},
        **{f"S{a}": Q_(math.pi * dd**3 / 32, "inch**3") for a in "xy"},
        **{f"Z{a}": Q_(dd**3 / 6, "inch**3") for a in "xy"},
        **{f"r{a}": Q_(dd / 4, "inch") for a in "xy"},
        "J": Q_(2 * i, "inch**4"),
    }
    return SteelShape(f"Round bar {D:~P}", "ROUND BAR", _SOURCE, MappingProxyType(props))
