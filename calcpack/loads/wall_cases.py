"""Wind on wall members by case: the windward wall's pressure stepping with height (ASCE 7-16
Chapter 27, q_z at each height) and the uniform pressures of the other walls, as line loads on
a stud, post or wind column.

A wall case is a :class:`~calcpack.loads.roof_cases.RoofProfile` of ``kind="normal"`` whose
breaks are heights above ground (not plan distances): ``values[i]`` acts from ``breaks[i]`` to
``breaks[i+1]``. :func:`wall_line_loads` cuts it to a member's extent and multiplies by the
member spacing.

Sign convention: pressure toward the wall +; on the member, line loads + toward the wall
(inward), x measured up from the member's bottom.
"""

from __future__ import annotations

from calcpack.errors import InputError
from calcpack.loads.roof_cases import RoofProfile
from calcpack.loads.types import UniformLoad
from calcpack.loads.wind_asce7_directional import DirectionalWindASCE7
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, positive, within

__all__ = ["wall_line_loads", "wall_profiles_asce7_directional"]

_NOTE = "ASCE 7-16 Eqs. 26.10-1 and 27.3-1, heights above ground"


def wall_profiles_asce7_directional(wind: DirectionalWindASCE7) -> list[RoofProfile]:
    """Wall cases from the directional procedure: the windward wall by bands of height, and the
    leeward wall, each with +GC_pi and with −GC_pi (breaks: heights from the ground to h).
    """
    bands = wind.windward_profile
    if not bands:
        raise InputError(
            name="wind",
            value=wind.derivation.title,
            rule="must carry the windward wall profile (a result of directional_wind_asce7)",
            expected="a DirectionalWindASCE7 with windward_profile",
        )
    breaks = (bands[0].bottom, *(b.top for b in bands))
    d = wind.building.direction
    lee = wind.surface("leeward wall")
    out = []
    for k, label in enumerate(("+GCpi", "-GCpi")):
        vals = tuple(b.p_pos_gcpi if k == 0 else b.p_neg_gcpi for b in bands)
        out.append(RoofProfile(f"W {d} windward wall {label}", "W", "normal", breaks, vals, _NOTE))
        out.append(
            RoofProfile(
                f"W {d} leeward wall {label}",
                "W",
                "normal",
                (breaks[0], breaks[-1]),
                (lee.p[k],),
                _NOTE,
            )
        )
    return out


def wall_line_loads(
    profile: RoofProfile,
    spacing: Quantity,
    *,
    bottom: Quantity | None = None,
    top: Quantity | None = None,
) -> list[UniformLoad]:
    """Uniform line loads (toward the wall +) on a wall member at ``spacing`` centres.

    Args:
        profile: a wall case (breaks are heights above ground). spacing: tributary width.
        bottom, top: the member's ends as heights above ground (default: the whole profile);
            x = 0 at ``bottom``. The top of the profile is the mean roof height: a member
            reaching above it takes the top band's pressure to its top.

    Raises:
        InputError: spacing not a positive length; top not above bottom.
    """
    dimension("spacing", spacing, "[length]")
    positive("spacing", spacing)
    lo = profile.breaks[0] if bottom is None else dimension("bottom", bottom, "[length]")
    hi = profile.breaks[-1] if top is None else dimension("top", top, "[length]")
    within("bottom", lo, lo=Q_(0.0, "m"), rule="a height above ground")
    within("top", hi, lo=lo, inclusive=False, rule="the member's top is above its bottom")
    unit = "plf" if f"{profile.values[0].units:~}" in ("psf", "lbf / ft ** 2") else "kN/m"
    out = []
    n = len(profile.values)
    for i, (a, b, v) in enumerate(
        zip(profile.breaks[:-1], profile.breaks[1:], profile.values, strict=True)
    ):
        end = max(b, hi) if i == n - 1 else b  # the top band runs on above h
        s, e = max(a, lo), min(end, hi)
        if e > s:
            out.append(
                UniformLoad(
                    start=(s - lo).to(lo.units),
                    end=(e - lo).to(lo.units),
                    w=(v * spacing).to(unit),
                    case=profile.case,
                )
            )
    return out
