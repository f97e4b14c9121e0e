"""Cross-section classification to EN 1993-1-1 §5.5, Table 5.2, for the tabulated sections.

Widths c (as the UK section tables take them): rolled I and H web c = h − 2t_f − 2r, flange
outstand c = (b − t_w − 2r)/2; PFC web c = h − 2t_f − 2r, flange outstand c = b − t_w − r;
RHS/SHS walls c = h − 3t and b − 3t; CHS d/t. ε = √(235/f_y).

A web in bending and compression: class 1/2 limits with α = ½(1 + N_Ed/(f_y t_w c)) (plastic
neutral axis, capped at 1); class 3 with ψ = 2N_Ed/(A f_y) − 1 (stress at the compression edge
at yield, the tables' convention). Bending about the minor axis uses the flange limits in
compression (α = 1, on the safe side). Class 4 is refused by the member checks: its effective
section (EN 1993-1-1 §6.2.2.5, EN 1993-1-5 §4.4) is not covered here.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Quantity

__all__ = ["Classification", "Element", "classify"]


@dataclass(frozen=True)
class Element:
    """One element's classification: its c/t ratio, the class limits and the class."""

    name: str
    ratio: float
    limits: tuple[float, float, float]
    cls: int
    rule: str


@dataclass(frozen=True)
class Classification:
    """The section class (the worst element) with each element's working."""

    epsilon: float
    elements: tuple[Element, ...]

    @property
    def cls(self) -> int:
        return max(e.cls for e in self.elements)


def _cls(ratio: float, limits: tuple[float, float, float]) -> int:
    for i, lim in enumerate(limits):
        if ratio <= lim + 1e-12:
            return i + 1
    return 4


def _web(c_t: float, eps: float, alpha: float, psi: float, what: str) -> Element:
    if alpha >= 1.0 - 1e-12:
        lim = (33 * eps, 38 * eps, 42 * eps)
        rule = f"{what} in compression: 33ε, 38ε, 42ε"
    elif alpha <= 0.5 + 1e-12 and psi <= -1 + 1e-12:
        lim = (72 * eps, 83 * eps, 124 * eps)
        rule = f"{what} in bending: 72ε, 83ε, 124ε"
    else:
        if alpha > 0.5:
            l1, l2 = 396 * eps / (13 * alpha - 1), 456 * eps / (13 * alpha - 1)
        else:
            l1, l2 = 36 * eps / alpha, 41.5 * eps / alpha
        l3 = 42 * eps / (0.67 + 0.33 * psi) if psi > -1 else 62 * eps * (1 - psi) * math.sqrt(-psi)
        lim = (l1, l2, l3)
        rule = f"{what} in bending and compression: α = {alpha:.3f}, ψ = {psi:.3f}"
    return Element(what, c_t, lim, _cls(c_t, lim), rule)


def classify(
    sec: EuroSection, fy: Quantity, N_Ed: Quantity, *, bending: bool = True
) -> Classification:
    """Classify ``sec`` of yield strength ``fy`` under axial force ``N_Ed`` (compression +) with
    (``bending=True``) or without major-axis bending."""
    fy_mpa = float(fy.to("MPa").magnitude)
    eps = math.sqrt(235 / fy_mpa)
    N = max(float(N_Ed.to("N").magnitude), 0.0)
    A = float(sec.A.to("mm**2").magnitude)
    n_ratio = min(N / (A * fy_mpa), 1.0)
    h, b = (float(q.to("mm").magnitude) for q in (sec.h, sec.b))
    out: list[Element] = []
    if sec.family == "CHS":
        assert sec.t is not None
        t = float(sec.t.to("mm").magnitude)
        lim = (50 * eps**2, 70 * eps**2, 90 * eps**2)
        out.append(Element("tube", h / t, lim, _cls(h / t, lim), "d/t: 50ε², 70ε², 90ε²"))
        return Classification(eps, tuple(out))
    if sec.family in ("SHS", "RHS"):
        assert sec.t is not None
        t = float(sec.t.to("mm").magnitude)
        c_web, c_fl = (h - 3 * t), (b - 3 * t)
        tw_mm = 2 * t
        tf_mm = t
    else:
        assert sec.tw is not None
        assert sec.tf is not None
        assert sec.r is not None
        tw_mm, tf_mm, r = (float(q.to("mm").magnitude) for q in (sec.tw, sec.tf, sec.r))
        c_web = h - 2 * tf_mm - 2 * r
        c_fl = (b - tw_mm - 2 * r) / 2 if sec.family != "PFC" else b - tw_mm - r
    if bending:
        alpha = min(1.0, 0.5 * (1 + N / (fy_mpa * tw_mm * c_web)))
        psi = 2 * n_ratio - 1
    else:
        alpha, psi = 1.0, 1.0
    wt = tw_mm / 2 if sec.family in ("SHS", "RHS") else tw_mm
    out.append(_web(c_web / wt, eps, alpha, psi, "web"))
    # a hollow section's flange is internal (Table 5.2 sheet 1), an I-section's an outstand
    internal = sec.family in ("SHS", "RHS")
    k = (33, 38, 42) if internal else (9, 10, 14)
    lim = (k[0] * eps, k[1] * eps, k[2] * eps)
    kind = "internal" if internal else "outstand"
    out.append(
        Element(
            "flange",
            c_fl / tf_mm,
            lim,
            _cls(c_fl / tf_mm, lim),
            f"{kind} flange in compression: {k[0]}ε, {k[1]}ε, {k[2]}ε",
        )
    )
    return Classification(eps, tuple(out))
