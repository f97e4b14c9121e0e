"""External pressure coefficients GCp for components and cladding, ASCE/SEI 7-16 Chapter 30
Part 1 (h <= 60 ft), as functions of the effective wind area.

Walls: Figure 30.3-1 (zones 4 and 5; reduced 10 % when the roof angle θ <= 10°, note 5).
Roofs (``asce7_16_wind_cc_roofs.csv``):

* gable roofs: θ <= 7° Figure 30.3-2A (zones 1', 1, 2, 3); 7° < θ <= 20° Figure 30.3-2B,
  20° < θ <= 27° Figure 30.3-2C, 27° < θ <= 45° Figure 30.3-2D (zones 1, 2e, 2n, 2r, 3e, 3r);
* hip roofs: θ <= 7° as gable roofs (Figure 30.3-2A); 7° < θ <= 20° Figures 30.3-2E
  (h/B <= 0.5) and 30.3-2F (h/B >= 0.8); 20° < θ <= 27° Figures 30.3-2G and 30.3-2H;
  27° < θ <= 45° Figure 30.3-2I (zones 1, 2r, 2e, 3). Between h/B = 0.5 and 0.8 the more
  severe of the two figures is taken at each area (not interpolated: conservative);
* monoslope roofs: θ <= 3° as gable roofs of Figure 30.3-2A; 3° < θ <= 10° Figure 30.3-5A
  (zones 1, 2, 2', 3, 3'); 10° < θ <= 30° Figure 30.3-5B (zones 1, 2, 3).

Each line of a figure is a polyline on log10 A: GCp constant up to its first point, straight on
log10 A between points and constant beyond its last point. Anything else (θ > 45°, monoslope
θ > 30°, mansard, flat roofs steeper than 7°) is refused naming the limit.

Sign convention: GCp positive toward the surface, negative away from it (suction).
"""

from __future__ import annotations

import itertools
import math
from dataclasses import dataclass
from typing import Literal

from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Quantity
from calcpack.validate import dimension, one_of, positive

__all__ = [
    "CCCurve",
    "cc_coefficient_asce7",
    "cc_roof_curves",
    "cc_roof_zones",
    "gcp_on_curve",
]

CCRoof = Literal["gable", "hip", "flat", "monoslope"]
CC_ROOFS: tuple[str, ...] = ("gable", "hip", "flat", "monoslope")
_ROOF_TABLE = "asce7_16_wind_cc_roofs.csv"
_WALL_TABLE = "asce7_16_wind_cc.csv"
_HIP_LOW, _HIP_HIGH = 0.5, 0.8  # h/B bands of the hip roof figures


@dataclass(frozen=True)
class CCCurve:
    """One line of a C&C figure: ``points`` as (A in ft², GCp), A increasing."""

    figure: str
    zone: str
    sign: str
    points: tuple[tuple[float, float], ...]


def gcp_on_curve(points: tuple[tuple[float, float], ...], area_ft2: float) -> float:
    """GCp at ``area_ft2`` on a figure line: constant outside its points, log-linear between."""
    if area_ft2 <= points[0][0]:
        return points[0][1]
    for (a0, g0), (a1, g1) in itertools.pairwise(points):
        if area_ft2 <= a1:
            return g0 + (g1 - g0) * math.log10(area_ft2 / a0) / math.log10(a1 / a0)
    return points[-1][1]


def _points(text: str) -> tuple[tuple[float, float], ...]:
    pts = []
    for pair in str(text).split():
        a, g = pair.split(":")
        pts.append((float(a), float(g)))
    return tuple(pts)


def _figure_roof(roof: str, theta: float) -> str:
    """The roof family whose figures apply (monoslope and hip at low slopes read Figure 30.3-2A)."""
    if roof == "mansard":
        raise OutOfScopeError(
            "Input roof = 'mansard': components and cladding on mansard roofs are not covered "
            "(ASCE 7-16 Chapter 30 Part 1 is applied here to gable, hip and monoslope roofs)"
        )
    one_of("roof", roof, CC_ROOFS)
    if not 0.0 <= theta <= 45.0:
        raise OutOfScopeError(
            f"Input roof_slope = {theta:.3g}°: ASCE 7-16 Figures 30.3-2A to 30.3-2I cover roof "
            "angles from 0° to 45°; the limit is 45°"
        )
    if roof == "flat":
        if theta > 7.0:
            raise OutOfScopeError(
                f"Input roof_slope = {theta:.3g}° with roof = 'flat': a flat roof is taken as "
                "θ <= 7° (Figure 30.3-2A); give roof = 'gable', 'hip' or 'monoslope'"
            )
        return "gable"
    if roof == "monoslope":
        if theta > 30.0:
            raise OutOfScopeError(
                f"Input roof_slope = {theta:.3g}°: monoslope roofs are covered up to 30° "
                "(ASCE 7-16 Figure 30.3-5B); the limit is 30°"
            )
        return "gable" if theta <= 3.0 else "monoslope"
    if roof == "hip" and theta <= 7.0:
        return "gable"
    return roof


def _rows_for(roof: str, theta: float) -> list[dict[str, object]]:
    fam = _figure_roof(roof, theta)
    table = read_table(_ROOF_TABLE, key="key")
    out = []
    for row in table.rows.values():
        lo, hi = float(row["theta_lo"]), float(row["theta_hi"])
        inside = (lo <= theta <= hi) if lo == 0.0 else (lo < theta <= hi)
        if row["roof"] == fam and inside:
            # zone names like "1" would read as numbers: take them from the key ("2B 1 +")
            out.append(dict(row) | {"zone": str(row["key"]).split(" ")[1]})
    return out


def cc_roof_zones(roof: str, theta: Quantity) -> tuple[str, ...]:
    """The C&C roof zones of the figure for this roof form and angle, in the figure's order."""
    rows = _rows_for(roof, float(theta.to("deg").magnitude))
    return tuple(dict.fromkeys(str(r["zone"]) for r in rows))


def cc_roof_curves(
    roof: str, zone: str, theta: Quantity, h_over_B: float | None = None
) -> tuple[tuple[CCCurve, ...], tuple[CCCurve, ...]]:
    """The positive and the negative figure lines for a roof zone.

    More than one line of a sign means the more severe governs at each area (hip roofs with
    0.5 < h/B < 0.8).

    Raises:
        InputError: a zone the figure does not have; ``h_over_B`` missing where the hip figures
            need it. OutOfScopeError: roof form or angle outside the figures.
    """
    th = float(theta.to("deg").magnitude)
    rows = _rows_for(roof, th)
    one_of("zone", zone, tuple(dict.fromkeys(str(r["zone"]) for r in rows)))
    rows = [r for r in rows if r["zone"] == zone]
    if any(r["h_ratio"] != "any" for r in rows):
        if h_over_B is None:
            raise InputError(
                name="h_over_B",
                value=None,
                rule=f"is needed for hip roofs with 7° < θ <= 27° (got θ = {th:.3g}°)",
                expected="h / least horizontal dimension (Figures 30.3-2E to 30.3-2H)",
            )
        positive("h_over_B", h_over_B)
        keep = {"<=0.5"} if h_over_B <= _HIP_LOW else set()
        keep |= {">=0.8"} if h_over_B >= _HIP_HIGH else set()
        keep = keep or {"<=0.5", ">=0.8"}
        rows = [r for r in rows if r["h_ratio"] in keep]
    out: dict[str, list[CCCurve]] = {"+": [], "-": []}
    for r in rows:
        out[str(r["sign"])].append(
            CCCurve(str(r["figure"]), zone, str(r["sign"]), _points(str(r["points"])))
        )
    return tuple(out["+"]), tuple(out["-"])


def cc_coefficient_asce7(
    surface: str,
    zone: str,
    area: Quantity,
    theta: Quantity,
    *,
    roof: str = "gable",
    h_over_B: float | None = None,
) -> tuple[float, float]:
    """(positive, negative) GCp for components and cladding (ASCE 7-16 Chapter 30 Part 1).

    Args:
        surface: ``"wall"`` or ``"roof"``. zone: ``"4"``/``"5"`` (walls) or a zone of the roof's
            figure (:func:`cc_roof_zones`). area: effective wind area [area]. theta: roof angle.
        roof: ``"gable"``, ``"hip"``, ``"flat"`` or ``"monoslope"``. h_over_B: mean roof height
            over least horizontal dimension (hip roofs, 7° < θ <= 27°).

    Raises:
        OutOfScopeError: roof form or angle outside the figures (limit named).
    """
    one_of("surface", surface, ("wall", "roof"))
    dimension("area", area, "[area]")
    positive("area", area)
    dimension("theta", theta, "[]")
    th = float(theta.to("deg").magnitude)
    A = float(area.to("ft^2").magnitude)
    if surface == "roof":
        pos, neg = cc_roof_curves(roof, zone, theta, h_over_B)
        gp = max(gcp_on_curve(c.points, A) for c in pos)
        gn = min(gcp_on_curve(c.points, A) for c in neg)
        return gp, gn
    one_of("zone", zone, ("4", "5"))
    table = read_table(_WALL_TABLE, key="key")
    out = []
    for sign in ("+", "-"):
        row = table.row(f"wall {zone} {sign}")
        pts = (
            (float(row["A1_ft2"]), float(row["GCp1"])),
            (float(row["A2_ft2"]), float(row["GCp2"])),
        )
        g = gcp_on_curve(pts, A)
        if th <= 10.0:
            g *= 0.9  # Figure 30.3-1 note 5: walls of buildings with θ <= 10°
        out.append(g)
    return out[0], out[1]


def cc_figures(surface: str, roof: str, theta: Quantity, zone: str, h_over_B: float | None) -> str:
    """The figure(s) a C&C coefficient comes from, for the working."""
    if surface == "wall":
        return "ASCE 7-16 Figure 30.3-1"
    pos, neg = cc_roof_curves(roof, zone, theta, h_over_B)
    figs = sorted({c.figure for c in pos + neg})
    return "ASCE 7-16 Figure " + " and ".join(figs)
