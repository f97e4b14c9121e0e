"""Roof load profiles of a frame (rafter pair or truss) from the snow and wind derivations.

Each function returns :class:`~calcpack.loads.roof_cases.RoofProfile` load cases along the
plan distance x from the left eave (see that module for the sign conventions):

* :func:`snow_profiles_en`: EN 1991-1-3 Figure 5.2 / 5.3 arrangements, cases ``S (i)``...;
* :func:`snow_profiles_asce7`: ASCE 7-16 balanced and, where §7.6.1 asks, unbalanced loads
  with the leeward surcharge beside the ridge, wind from the left and from the right;
* :func:`wind_profiles_en`: EN 1991-1-4 roof zones across the frame for direction θ, each
  pressure case with each c_pi (zones F/G within e/10 of the windward edge, H to the ridge,
  J within e/10 beyond the ridge, I beyond; Figures 7.7 and 7.8);
* :func:`wind_profiles_asce7`: ASCE 7-16 envelope load case A (zones 2, 3, or 2E, 3E in the end
  zone), each sign of GCpi, with the Figure 28.3-1 note on negative zone 2 pressures.
  Load case B (wind along the ridge) is not mapped onto frames here.
"""

from __future__ import annotations

from typing import Any

from calcpack.errors import InputError
from calcpack.loads.roof_cases import RoofProfile
from calcpack.loads.snow_asce7 import RoofSnowASCE7, SnowRoofASCE7
from calcpack.loads.snow_en1991 import RoofSnowEN
from calcpack.loads.wind_asce7_directional import DirectionalWindASCE7
from calcpack.loads.wind_asce7_lowrise import EnvelopeWindASCE7, LowRiseBuildingASCE7
from calcpack.loads.wind_en1991_cpe import BuildingEN, WindPressuresEN
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive, within

__all__ = [
    "snow_profiles_asce7",
    "snow_profiles_en",
    "wind_profiles_asce7",
    "wind_profiles_asce7_directional",
    "wind_profiles_en",
]


def _pieces(
    width: Quantity, parts: list[tuple[Quantity, Quantity]]
) -> tuple[tuple[Any, ...], tuple[Any, ...]]:
    """Breaks and values from (end x, value) pairs, merging zero-length pieces."""
    breaks = [Q_(0.0, width.units)]
    values = []
    for end, v in parts:
        end = min(end.to(width.units), width)
        if end > breaks[-1]:
            breaks.append(end)
            values.append(v)
    return tuple(breaks), tuple(values)


def _mirror(
    breaks: tuple[Any, ...], values: tuple[Any, ...]
) -> tuple[tuple[Any, ...], tuple[Any, ...]]:
    total = breaks[-1]
    return tuple(total - b for b in reversed(breaks)), tuple(reversed(values))


def snow_profiles_en(
    snow: RoofSnowEN, width: Quantity, *, ridge: Quantity | None = None
) -> list[RoofProfile]:
    """Snow cases on a frame of plan ``width`` (monopitch: one case; duopitch: (i), (ii), (iii)
    with the ridge at ``ridge``, default mid-width)."""
    dimension("width", width, "[length]")
    positive("width", width)
    out = []
    for name, loads in snow.cases.items():
        if len(loads) == 1:
            b, v = _pieces(width, [(width, loads[0])])
        else:
            rx = width / 2 if ridge is None else ridge
            b, v = _pieces(width, [(rx, loads[0]), (width, loads[1])])
        out.append(RoofProfile(f"S {name}", "S", "plan", b, v, "EN 1991-1-3 Figure 5.2/5.3"))
    return out


def snow_profiles_asce7(snow: RoofSnowASCE7, roof: SnowRoofASCE7) -> list[RoofProfile]:
    """Balanced and unbalanced (§7.6.1) snow on a gable or hip frame, or a monoslope, on plan.

    The frame's plan width is 2·W for gable and hip roofs and W for a monoslope.
    """
    width = roof.W * (1 if roof.shape in ("monoslope", "flat") else 2)
    b, v = _pieces(width, [(width, snow.balanced)])
    out = [RoofProfile("S balanced", "S", "plan", b, v, "ASCE 7-16 §7.3, §7.4")]
    if snow.unbalanced_windward is None or snow.unbalanced_leeward is None:
        return out
    ridge = roof.W
    parts = [(ridge, snow.unbalanced_windward)]
    if snow.surcharge is not None and snow.surcharge_width is not None:
        parts.append((ridge + snow.surcharge_width, snow.unbalanced_leeward + snow.surcharge))
    parts.append((width, snow.unbalanced_leeward))
    b, v = _pieces(width, parts)
    out.append(RoofProfile("S unbalanced from L", "S", "plan", b, v, "ASCE 7-16 §7.6.1"))
    b2, v2 = _mirror(b, v)
    out.append(RoofProfile("S unbalanced from R", "S", "plan", b2, v2, "ASCE 7-16 §7.6.1"))
    return out


def _en_zones(
    w: WindPressuresEN, building: BuildingEN, frame: Quantity | None
) -> list[tuple[Quantity, str]]:
    """(end x, zone) across the frame, wind from the left (θ = 0) or along the ridge (θ = 90)."""
    width, e = building.width, w.e.to(building.width.units)
    far = frame is None or frame >= e / 2
    roof, th = building.roof, w.theta
    if th in (0, 180):
        edge = "F" if frame is not None and frame < e / 4 else "G"
        if roof == "duopitch":
            return [(e / 10, edge), (width / 2, "H"), (width / 2 + e / 10, "J"), (width, "I")]
        if roof == "monopitch":
            return [(e / 10, edge), (width, "H")]
        return [(e / 10, edge), (e / 2, "H"), (width, "I")]
    # θ = 90: the frame lies across the wind; its zone is set by its distance from the gable
    if far:
        return [(width, "I")]
    assert frame is not None
    if frame >= e / 10:
        return [(width, "H")]
    if roof == "monopitch":
        return [(e / 4, "Flow"), (width - e / 4, "G"), (width, "Fup")]
    return [(e / 4, "F"), (width - e / 4, "G"), (width, "F")]


def wind_profiles_en(
    w: WindPressuresEN,
    building: BuildingEN,
    *,
    frame: Quantity | None = None,
    both_sides: bool = True,
) -> list[RoofProfile]:
    """Wind cases on a frame across the building: every pressure case with every c_pi.

    Args:
        w: :func:`~calcpack.loads.wind_en1991_cpe.wind_pressures_en` for one direction.
        building: the building. frame: distance of the frame from the nearest gable (for
            θ = 0 a frame within e/4 takes zone F; for θ = 90, the zone row); None: an interior
            frame. both_sides: θ = 0 also mirrored (wind from the right) for a duopitch or flat
            roof; a monopitch takes θ = 180 as its own direction.
    """
    zones = _en_zones(w, building, frame)
    width = building.width
    out = []
    for case, cpe in w.roof_cases.items():
        for cpi in w.cpi:
            parts = [(end, (w.qp * (cpe[z] - cpi)).to("kN/m^2")) for end, z in zones]
            b, v = _pieces(width, parts)
            zs = "/".join(z for _, z in zones)
            name = f"W{w.theta} {case} c_pi{cpi:+.2f}"
            if building.roof == "monopitch" and w.theta == 180:
                b, v = _mirror(b, v)
            sides = both_sides and w.theta == 0 and building.roof != "monopitch"
            out.append(
                RoofProfile(name + (" from L" if sides else ""), "W", "normal", b, v, f"zones {zs}")
            )
            if sides:
                b2, v2 = _mirror(b, v)
                out.append(RoofProfile(name + " from R", "W", "normal", b2, v2, f"zones {zs}"))
    return out


def wind_profiles_asce7(
    env: EnvelopeWindASCE7, building: LowRiseBuildingASCE7, *, end_zone: bool = False
) -> list[RoofProfile]:
    """Envelope load case A on a gable or hip frame spanning B (wind from the left and right),
    each sign of GCpi. Zone 2 (2E) on the windward slope, 3 (3E) on the leeward one; where zone
    2 is negative it runs from the windward edge for the lesser of B/2 and 2.5h, and zone 3
    takes the rest to the ridge (Figure 28.3-1 note)."""
    if building.roof not in ("gable", "hip"):
        raise InputError(
            f"Input building.roof must be 'gable' or 'hip' for frame wind cases (got "
            f"{building.roof!r})",
            name="roof",
            value=building.roof,
            expected="'gable' or 'hip'",
        )
    width = building.B
    z2, z3 = ("2E", "3E") if end_zone else ("2", "3")
    out = []
    for internal in ("+GCpi", "-GCpi"):
        p2, p3 = env.pressure("A", z2, internal), env.pressure("A", z3, internal)
        edge = min(width / 2, 2.5 * building.h.to(width.units)) if p2.magnitude < 0 else width / 2
        b, v = _pieces(width, [(edge, p2), (width / 2, p3), (width, p3)])
        name = f"W case A {z2}/{z3} {internal}"
        out.append(RoofProfile(name + " from L", "W", "normal", b, v, "ASCE 7-16 Figure 28.3-1"))
        b2, v2 = _mirror(b, v)
        out.append(RoofProfile(name + " from R", "W", "normal", b2, v2, "ASCE 7-16 Figure 28.3-1"))
    return out


def wind_profiles_asce7_directional(
    wind: DirectionalWindASCE7, *, frame_at: Quantity | None = None
) -> list[RoofProfile]:
    """Roof load cases on a frame from the directional procedure (ASCE 7-16 Chapter 27).

    Wind normal to the ridge: the frame spans the building's L (parallel to the wind), wind
    from the left and from the right (a monoslope roof with θ >= 10°: one case per value, the
    wind meeting the eave given by ``windward_eave``), for each roof C_p value the figure gives
    and each sign of GC_pi (windward and leeward slopes, or the roof zones by distance from the
    windward edge for θ < 10°). Wind parallel to the ridge: the frame at ``frame_at``
    (distance from the windward end) takes the pressure of the zone it stands in, uniform
    across its span L.

    Raises:
        InputError: ``frame_at`` missing (wind parallel to the ridge) or off the building.
    """
    b = wind.building
    width = b.L
    roof = [s for s in wind.surfaces if "roof" in s.surface]
    note = "ASCE 7-16 Figure 27.3-1, Eq. 27.3-1"
    out = []
    labels = ("+GCpi", "-GCpi")
    if b.direction == "parallel to ridge":
        if frame_at is None:
            raise InputError(
                name="frame_at",
                value=None,
                rule="must be given for wind parallel to the ridge (the frame's distance from "
                "the windward end)",
                expected="a length",
            )
        dimension("frame_at", frame_at, "[length]")
        within("frame_at", frame_at, Q_(0.0, "m"), b.L, rule="a frame along the building")
        zone = next(
            (s for s in roof if s.start is not None and s.end is not None and frame_at <= s.end),
            roof[-1],
        )
        for k in range(len(zone.p)):
            cp = "Cp1" if k < 2 else "Cp2"
            name = f"W parallel {zone.surface} {cp} {labels[k % 2]}"
            span = b.B
            out.append(
                RoofProfile(name, "W", "normal", (Q_(0.0, span.units), span), (zone.p[k],), note)
            )
        return out
    whole = len(roof) == 1 and roof[0].start is None  # a monoslope roof, wholly one surface
    for k in range(max(len(s.p) for s in roof)):
        parts = []
        for s in roof:
            v = s.p[k] if len(s.p) > k else s.p[k % 2]
            if s.end is not None:
                end = s.end.to(width.units)
            else:
                end = width / 2 if s.surface == "windward roof" and not whole else width
            parts.append((end, v))
        cp = "Cp1" if k < 2 else "Cp2"
        br, vals = _pieces(width, parts)
        name = f"W normal {cp} {labels[k % 2]}"
        if whole:  # the wind meets the eave the building was given (low or high)
            out.append(RoofProfile(f"{name} {b.windward_eave} eave", "W", "normal", br, vals, note))
            continue
        out.append(RoofProfile(name + " from L", "W", "normal", br, vals, note))
        b2, v2 = _mirror(br, vals)
        out.append(RoofProfile(name + " from R", "W", "normal", b2, v2, note))
    return out
