"""The behaviour every section shares, single shape or composite: properties, Q, width, sketch."""

from __future__ import annotations

import math
from functools import cached_property
from typing import TYPE_CHECKING, Any

from calcpack import views
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import positive

if TYPE_CHECKING:
    from calcpack.sections.properties import PartRow, SectionProperties, WeightedRegion
    from calcpack.working import Block

__all__ = ["Section", "validate_length"]


def validate_length(value: object, name: str, what: str) -> float:
    """Check a dimension (a positive length) and return it in metres.

    Raises:
        DimensionError: not a length.
        InputError: zero, negative or not finite; the message names ``what`` and ``name``.
    """
    q = require(value, "[length]", name)
    return si(positive(name, q, note=what))


def fmt_len(value_m: float) -> str:
    """A length in metres written in mm for messages."""
    return f"{value_m * 1000:.6g} mm"


class Section:
    """Base of single shapes and composite sections.

    Subclasses provide the regions (SI floats, weighted +n solid / -n hole) and the torsion and
    warping constants where a formula applies.
    """

    name: str

    # -- supplied by subclasses -------------------------------------------------------------
    def weighted_regions(self) -> list[WeightedRegion]:
        """The placed regions of this section with their weights, in metres."""
        raise NotImplementedError

    def part_rows(self) -> list[PartRow]:
        """One line per part for the parts table."""
        raise NotImplementedError

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        """(J in m⁴, or None with the reason it is not available)."""
        return None, "no torsion formula is coded for this kind of section"

    def warping_constant_m6(self) -> tuple[float | None, str]:
        """(Cw in m⁶, or None with the reason it is not available)."""
        return None, "no warping formula is coded for this kind of section"

    # -- shared behaviour -------------------------------------------------------------------
    @cached_property
    def _props(self) -> SectionProperties:
        from calcpack.sections.properties import compute_properties

        J, J_reason = self.torsion_constant_m4()
        Cw, Cw_reason = self.warping_constant_m6()
        return compute_properties(
            self,
            self.weighted_regions(),
            self.part_rows(),
            J=J,
            J_reason=J_reason,
            Cw=Cw,
            Cw_reason=Cw_reason,
        )

    def properties(self) -> SectionProperties:
        """All section properties about the centroidal axes (see :class:`SectionProperties`)."""
        return self._props

    def _level(self, y: object) -> float:
        q = require(y, "[length]", "y")
        level = si(q)
        regions = self.weighted_regions()
        lo = min(r.region.bbox()[1] for r in regions)
        hi = max(r.region.bbox()[3] for r in regions)
        if not lo - 1e-12 <= level <= hi + 1e-12:
            raise InputError(
                f"Level y must lie within the depth of section {self.name!r}, from "
                f"{fmt_len(lo)} to {fmt_len(hi)} (got y = {q:~P})",
                name="y",
                value=q,
                expected=f"{fmt_len(lo)} <= y <= {fmt_len(hi)}",
            )
        return level

    def Q(self, *, y: Any) -> Quantity:
        """First moment of the area above level ``y`` about the centroidal x axis (mm³).

        Args:
            y: a length, measured in the section's coordinates (like ``y_bar``).

        Returns:
            Q = ∫_{y'>y} (y' - ȳ) dA of the transformed section; at the centroid it is the
            largest, and Q = 0 at either extreme fibre.

        Raises:
            InputError: ``y`` outside the depth of the section.
        """
        from calcpack.sections.properties import first_moment_below

        level = self._level(y)
        yb = si(self.properties().y_bar)
        a_below, m_about_level = first_moment_below(self.weighted_regions(), level, "x")
        q = -(m_about_level + a_below * (level - yb))
        return Q_(q, "m**3").to("mm**3")

    def width_at(self, *, y: Any) -> Quantity:
        """Width b of the transformed section along level ``y`` (holes deducted), in mm."""
        level = self._level(y)
        b = sum(r.weight * r.region.width(level, "x") for r in self.weighted_regions())
        return Q_(max(b, 0.0), "m").to("mm")

    def figure(self, **options: Any) -> Any:
        """A matplotlib figure sketching the section with its centroid and axes dimensioned.

        Imports matplotlib lazily. See :func:`calcpack.plots.section.section_figure`.
        """
        return views.render("figure", self, **options)

    def svg(self, **options: Any) -> str:
        """The sketch as an SVG string."""
        svg: str = views.render("svg", self, **options)
        return svg

    def working(self, **options: Any) -> Block:
        """The working (parts table, centroid, parallel-axis theorem) as calcpack.working steps."""
        return self.properties().working(**options)

    def extent_m(self) -> tuple[float, float, float, float]:
        """Bounding box of the solid parts, metres (x_min, y_min, x_max, y_max)."""
        regions = [r for r in self.weighted_regions() if r.weight > 0]
        return (
            min(r.region.bbox()[0] for r in regions),
            min(r.region.bbox()[1] for r in regions),
            max(r.region.bbox()[2] for r in regions),
            max(r.region.bbox()[3] for r in regions),
        )


def saint_venant_rectangle(b_m: float, t_m: float) -> float:
    """Saint-Venant torsion constant of a solid rectangle, m⁴ (series solution,
    Timoshenko & Goodier, Theory of Elasticity, §109): J = β b t³ with t the shorter side,
    β = 1/3 [1 - 192/π⁵ (t/b) Σ_{n odd} tanh(nπb / 2t) / n⁵]."""
    b, t = max(b_m, t_m), min(b_m, t_m)
    total = 0.0
    for n in range(1, 60, 2):
        total += math.tanh(n * math.pi * b / (2 * t)) / n**5
    return (1 - 192 / math.pi**5 * (t / b) * total) * b * t**3 / 3
