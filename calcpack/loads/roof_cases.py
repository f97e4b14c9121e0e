"""Derived roof pressures become load cases on members: line loads on rafters and joists, joint
loads on trusses, one case per snow arrangement and per wind direction and pressure case.

A :class:`RoofProfile` is one load case on one frame: a load piecewise constant along the plan
distance x from the left eave, either

* ``kind="plan"``: a vertical load per unit plan area (snow, downward +), or
* ``kind="normal"``: a pressure normal to the roof surface (wind, toward the surface +).

Profiles are built from the derivations (:func:`snow_profiles_en`, :func:`wind_profiles_en`,
:func:`snow_profiles_asce7`, :func:`wind_profiles_asce7`) and turned into loads:

* :func:`line_loads`: the area load times the tributary width (member spacing) gives uniform
  line loads on plan, downward + (a pressure normal to a slope gives the same vertical load per
  unit plan length, common practice: p·s·cos θ over a plan length s·cos θ);
* :func:`truss_joint_loads`: each top-chord panel carries its resultant to its two end joints
  by the lever rule (simply supported panels, common practice), vertical for snow, normal to
  the panel for wind;
* :func:`case_groups`: the ``groups=`` mapping of :meth:`CombinationSet.apply`, so the
  combinations already in calcpack repeat once per snow arrangement and per wind case.

Sign convention: plan loads and line loads downward +; wind pressure toward the surface +
(suction −); joint load components Fx to the right, Fy up.
"""

from __future__ import annotations

import itertools
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.analysis.truss_model import JointLoad
from calcpack.errors import InputError
from calcpack.loads.types import UniformLoad
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, within

__all__ = [
    "RoofProfile",
    "case_groups",
    "line_loads",
    "truss_joint_loads",
]

Kind = Literal["plan", "normal"]
_AREA = "[force] / [length] ** 2"


@dataclass(frozen=True)
class RoofProfile:
    """One load case on a roof frame: ``values[i]`` acts from ``breaks[i]`` to ``breaks[i+1]``.

    Attributes:
        case: the load-case name (``"S (ii)"``, ``"W 0° suction ... c_pi +0.2"``).
        symbol: the combination symbol it stands for (``"S"`` or ``"W"``).
        kind: ``"plan"`` (vertical, per plan area, down +) or ``"normal"`` (pressure normal to
            the surface, toward it +).
        breaks: plan distances from the left eave, increasing [length].
        values: the load on each piece [force/area]. note: where the pieces come from.
    """

    case: str
    symbol: str
    kind: Kind
    breaks: tuple[Quantity, ...]
    values: tuple[Quantity, ...]
    note: str = ""

    def __post_init__(self) -> None:
        one_of("kind", self.kind, ("plan", "normal"))
        non_empty("case", self.case, expected="the load case's name, e.g. 'S (i)'")
        if len(self.breaks) != len(self.values) + 1 or not self.values:
            raise InputError(
                f"Input breaks must have one more entry than values (got {len(self.breaks)} "
                f"breaks, {len(self.values)} values)",
                name="breaks",
                value=self.breaks,
                expected=f"{len(self.values) + 1} plan positions",
            )
        for i, b in enumerate(self.breaks):
            dimension(f"breaks[{i}]", b, "[length]")
            if i:
                within(
                    f"breaks[{i}]",
                    b,
                    lo=self.breaks[i - 1],
                    inclusive=False,
                    rule="plan positions increase",
                )
        for i, v in enumerate(self.values):
            dimension(f"values[{i}]", v, _AREA)

    @property
    def span(self) -> Quantity:
        return self.breaks[-1] - self.breaks[0]

    def integral(self, x0: Quantity, x1: Quantity) -> tuple[Quantity, Quantity]:
        """∫ p dx over [x0, x1] on plan and its centroid x̄ (force per unit width, length)."""
        total = Q_(0.0, "kN/m")
        moment = Q_(0.0, "kN")
        for a, b, v in zip(self.breaks[:-1], self.breaks[1:], self.values, strict=True):
            lo, hi = max(a, x0), min(b, x1)
            if hi > lo:
                f = (v * (hi - lo)).to("kN/m")
                total += f
                moment += (f * (lo + hi) / 2).to("kN")
        if total.magnitude == 0:
            return total, (x0 + x1) / 2
        return total, (moment / total).to(x0.units)


def line_loads(
    profile: RoofProfile, spacing: Quantity, *, origin: Quantity | None = None
) -> list[UniformLoad]:
    """Uniform line loads (downward +) on a member at ``spacing`` centres, on plan, by piece.

    Args:
        profile: the load case. spacing: tributary width [length].
        origin: the plan position of the member's x = 0 (default: the left eave).
    """
    dimension("spacing", spacing, "[length]")
    positive("spacing", spacing)
    x0 = profile.breaks[0] if origin is None else origin
    out = []
    for a, b, v in zip(profile.breaks[:-1], profile.breaks[1:], profile.values, strict=True):
        w = (v * spacing).to("kN/m") if v.magnitude == 0 else (v * spacing).to(_line_unit(v))
        out.append(
            UniformLoad(
                start=(a - x0).to(a.units), end=(b - x0).to(b.units), w=w, case=profile.case
            )
        )
    return out


def _line_unit(v: Quantity) -> str:
    us = any(u in str(v.units) for u in ("pound", "foot", "inch", "psf", "kip"))
    return "plf" if us else "kN/m"


def truss_joint_loads(
    profile: RoofProfile,
    chord: Sequence[tuple[str, tuple[Quantity, Quantity]]],
    spacing: Quantity,
    *,
    origin: Quantity | None = None,
) -> list[JointLoad]:
    """Joint loads on the top chord of a truss at ``spacing`` centres.

    Args:
        profile: the load case. chord: the top-chord joints from the left eave to the right,
            ``(name, (x, y))`` in the truss's coordinates. spacing: truss centres.
        origin: the truss x of the profile's plan x = 0 (default: the first chord joint's x).

    Each panel's resultant goes to its end joints by the lever rule; a ``"normal"`` pressure
    acts normal to the panel, pushing into the roof when positive.
    """
    dimension("spacing", spacing, "[length]")
    positive("spacing", spacing)
    if len(chord) < 2:
        raise InputError(
            f"Input chord needs at least two joints (got {len(chord)})",
            name="chord",
            value=chord,
            expected="the top-chord joints from eave to eave",
        )
    x_origin = chord[0][1][0] if origin is None else origin
    unit = _line_unit(profile.values[0])
    force = "lbf" if unit == "plf" else "kN"
    acc: dict[str, list[Quantity]] = {}
    for (n0, (x0, y0)), (n1, (x1, y1)) in itertools.pairwise(chord):
        dx, dy = x1 - x0, y1 - y0
        if not dx.magnitude > 0:
            raise InputError(
                f"Input chord must run left to right (got joint {n1} at x = {x1:~P} after "
                f"{n0} at x = {x0:~P})",
                name="chord",
                value=n1,
                expected="increasing x",
            )
        F, xbar = profile.integral(x0 - x_origin, x1 - x_origin)
        F = (F * spacing).to(force)
        t = float(((xbar + x_origin - x0) / dx).to("").magnitude)
        if profile.kind == "plan":
            fx, fy = Q_(0.0, force), -F
        else:
            s = float(((dx**2 + dy**2) ** 0.5 / dx).to("").magnitude)
            ls = (dx**2 + dy**2) ** 0.5
            # inward normal (into the roof) of a panel running left to right: (dy, −dx)/l
            fx = (F * s * dy / ls).to(force)
            fy = (-F * s * dx / ls).to(force)
        for name, share in ((n0, 1.0 - t), (n1, t)):
            cur = acc.setdefault(name, [Q_(0.0, force), Q_(0.0, force)])
            cur[0] = cur[0] + share * fx
            cur[1] = cur[1] + share * fy
    return [
        JointLoad(n, Fx=fx, Fy=fy, case=profile.case)
        for n, (fx, fy) in acc.items()
        if fx.magnitude != 0 or fy.magnitude != 0
    ]


def case_groups(profiles: Iterable[RoofProfile]) -> dict[str, tuple[str, ...]]:
    """``{symbol: (case, ...)}`` for :meth:`CombinationSet.apply` ``groups=``: each snow
    arrangement and each wind case is an alternative of its symbol."""
    out: dict[str, list[str]] = {}
    for p in profiles:
        names = out.setdefault(p.symbol, [])
        if p.case in names:
            raise InputError(
                f"Load case {p.case!r} appears twice among the profiles",
                name="profiles",
                value=p.case,
                expected="distinct case names",
            )
        names.append(p.case)
    return {k: tuple(v) for k, v in out.items()}


def profile_table(profiles: Iterable[RoofProfile]) -> tuple[list[str], list[list[Any]]]:
    """Columns and rows listing each case's pieces (for a Table in the working)."""
    rows: list[list[Any]] = []
    for p in profiles:
        for a, b, v in zip(p.breaks[:-1], p.breaks[1:], p.values, strict=True):
            rows.append([p.case, p.kind, a, b, v])
    return ["Case", "Acts", "from x", "to x", "load"], rows
