"""The load on a lintel under masonry: arching (45° triangle) or the full wall height.

When masonry above an opening can arch, a lintel carries only the wall inside a triangle with
45° sides on its clear span (apex L/2 above the lintel) -- a triangular line load of peak
w_wall·L/2 at midspan -- and loads applied to the wall above the triangle go around the
opening. Arching is taken to act only when all of these hold (common practice; TMS 402-16
§5.2.1.1 allows arching where it can develop, from memory):

* the masonry is laid in running bond;
* the wall above the lintel is at least L/2 + 8 in. high (the triangle plus one course over
  its apex);
* there is enough wall beside the opening to resist the arch thrust;
* no opening, movement joint or control joint in or near the triangle.

Otherwise the lintel carries the full wall height above it. A point load on the wall (a beam
or girder bearing) within the triangle, or at any height when arching does not act, spreads
down through the masonry at 60° from the horizontal (common practice) and reaches the lintel
as a uniform load over its bearing length plus 2·h·cot 60° (h: height of the load above the
lintel), cut at the clear span. A point load above the triangle is carried by the arch.

Sign: loads downward positive; x from the left end of the clear span.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import within

__all__ = ["LintelLoads", "WallPointLoad", "lintel_masonry_loads"]

_COURSE = Q_(8.0, "inch")  # one course over the apex (common practice)
_COT60 = 1.0 / math.tan(math.radians(60.0))


@dataclass(frozen=True)
class WallPointLoad:
    """A concentrated load applied to the wall above the lintel.

    Args:
        P: the load (downward). x: its position from the left end of the clear span.
        height: its height above the lintel. bearing: its bearing length on the wall.
        case: load case ("D", "L"...).
    """

    P: Quantity
    x: Quantity
    height: Quantity
    bearing: Quantity = field(default_factory=lambda: Q_(0.0, "inch"))
    case: str = "D"

    def __post_init__(self) -> None:
        require(self.P, "[force]", "P", positive=True)
        require(self.x, "[length]", "x")
        require(self.height, "[length]", "height", positive=True)
        require(self.bearing, "[length]", "bearing", nonnegative=True)


@dataclass(frozen=True)
class LintelLoads:
    """The loads a lintel carries, as data (rendering and plotting read it).

    Attributes:
        span: clear span L. arching: True if the 45° triangle is used. reason: why (or why
        not). wall_weight: weight of the wall per unit face area. wall_height: wall above.
        triangle_peak: peak of the triangular load at midspan (arching) or None.
        uniform: the full-height uniform load (no arching) or None.
        patches: (start, end, w, case, source) of spread point loads on the lintel.
        ignored: point loads above the triangle, carried by the arch.
    """

    span: Quantity
    arching: bool
    reason: str
    wall_weight: Quantity
    wall_height: Quantity
    triangle_peak: Quantity | None
    uniform: Quantity | None
    patches: tuple[tuple[Quantity, Quantity, Quantity, str, WallPointLoad], ...]
    ignored: tuple[WallPointLoad, ...]

    def beam_loads(self, case: str = "D") -> list[object]:
        """The loads as :mod:`calcpack.loads` objects on a beam whose x = 0 is the left end
        of the clear span (wall weight in ``case``)."""
        from calcpack.loads import LinearLoad, UniformLoad

        out: list[object] = []
        half = self.span / 2
        if self.triangle_peak is not None:
            zero = Q_(0.0, "lbf/ft")
            out.append(
                LinearLoad(
                    w_start=zero,
                    w_end=self.triangle_peak,
                    start=0 * half,
                    end=half,
                    case=case,
                    label="masonry triangle",
                )
            )
            out.append(
                LinearLoad(
                    w_start=self.triangle_peak,
                    w_end=zero,
                    start=half,
                    end=self.span,
                    case=case,
                    label="masonry triangle",
                )
            )
        if self.uniform is not None:
            out.append(UniformLoad(w=self.uniform, case=case, label="masonry, full height"))
        for a, b, w, cs, _src in self.patches:
            out.append(UniformLoad(w=w, start=a, end=b, case=cs, label="point load spread at 60°"))
        return out


def lintel_masonry_loads(
    *,
    span: Quantity,
    wall_height: Quantity,
    wall_weight: Quantity,
    running_bond: bool,
    thrust_resisted: bool,
    no_openings_or_joints: bool,
    point_loads: tuple[WallPointLoad, ...] = (),
) -> LintelLoads:
    """The load on a lintel under masonry (see the module notes for the rules).

    Args:
        span: clear span L of the opening. wall_height: height of masonry above the lintel.
        wall_weight: weight of the wall per unit face area (e.g. 40 psf for 4 in. brick).
        running_bond, thrust_resisted, no_openings_or_joints: the arching conditions the
            engineer confirms.
        point_loads: loads on the wall above.

    Raises:
        InputError: a point load off the span, above the wall, wrong units.
    """
    require(span, "[length]", "span", positive=True)
    require(wall_height, "[length]", "wall_height", positive=True)
    require(wall_weight, "[force]/[area]", "wall_weight", positive=True)
    for i, p in enumerate(point_loads):
        within(
            f"point_loads[{i}].x",
            p.x,
            Q_(0.0, "m"),
            span,
            rule="the load must be over the clear span",
        )
        within(
            f"point_loads[{i}].height",
            p.height,
            hi=wall_height,
            rule="the load must be on the wall above the lintel",
        )
    half = span / 2
    tall = wall_height >= half + _COURSE
    failed = [
        txt
        for ok, txt in (
            (running_bond, "masonry not in running bond"),
            (
                tall,
                f"wall above lintel {wall_height.to('inch'):~.3g} < L/2 + 8 in. = "
                f"{(half + _COURSE).to('inch'):~.3g}",
            ),
            (thrust_resisted, "arch thrust not resisted beside the opening"),
            (no_openings_or_joints, "opening or joint in or near the triangle"),
        )
        if not ok
    ]
    arching = not failed
    reason = (
        "arching conditions hold: 45° triangle"
        if arching
        else "no arching (" + "; ".join(failed) + "): full wall height"
    )
    patches = []
    ignored = []
    for p in point_loads:
        apex_here = half - abs(p.x - half)  # the triangle's height above x
        if arching and p.height > apex_here:
            ignored.append(p)
            continue
        spread = p.bearing + 2 * p.height * _COT60
        a = max(p.x - spread / 2, Q_(0.0, "m") * 1)
        b = min(p.x + spread / 2, span)
        if not b > a:
            raise InputError(
                f"Point load at x = {p.x:~P} spreads to nothing on the span",
                name="x",
                value=p.x,
                expected="a position on the span",
            )
        w = (p.P / (b - a)).to("lbf/ft")
        patches.append((a.to("ft"), b.to("ft"), w, p.case, p))
    return LintelLoads(
        span=span,
        arching=arching,
        reason=reason,
        wall_weight=wall_weight,
        wall_height=wall_height,
        triangle_peak=(wall_weight * half).to("lbf/ft") if arching else None,
        uniform=None if arching else (wall_weight * wall_height).to("lbf/ft"),
        patches=tuple(patches),
        ignored=tuple(ignored),
    )
