"""Composite and built-up sections: parts placed at offsets, holes, and transformed sections.

A part of another material enters with its modular ratio n = E_part / E_reference: its area
(and so its second moments) count n times, which is the transformed-section method (common
practice), e.g. a steel flitch plate bolted between timbers with n = E_steel / E_timber.
Holes are cut from the solid part (or touching parts of one material) that wholly cover them
and take that material's modular ratio. Solid parts may touch but must not overlap: an
overlap is refused, since its area would count twice.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import cached_property
from typing import Any

from calcpack.errors import InputError
from calcpack.sections.base import Section, fmt_len
from calcpack.sections.geometry import Region, overlap_area
from calcpack.sections.properties import PartRow, WeightedRegion, part_rows
from calcpack.sections.shapes import Shape
from calcpack.units import require, si
from calcpack.validate import at_least, instance, one_of

__all__ = ["CompositeSection", "Part", "composite"]

_ANCHORS = ("corner", "centroid")


@dataclass(frozen=True, kw_only=True, eq=False)
class Part:
    """A shape placed in a composite section (make one with ``shape.at(...)``).

    Attributes:
        shape: the shape.
        x, y: where the anchor lands (lengths).
        name: the part's name in the parts table.
        anchor: ``"corner"`` (lower left of the bounding box) or ``"centroid"``.
        rotation: counter-clockwise angle applied after the optional mirror.
        mirrored: mirror the shape in a vertical line first.
        n: modular ratio E_part / E_reference (dimensionless, > 0).
        hole: True if the part is cut away from the solid part that contains it.
    """

    shape: Shape
    x: Any
    y: Any
    name: str
    anchor: str
    rotation: Any
    mirrored: bool
    n: Any
    hole: bool

    def __post_init__(self) -> None:
        label = self.name or "part"
        require(self.x, "[length]", f"x of part {label!r}")
        require(self.y, "[length]", f"y of part {label!r}")
        require(self.rotation, "radian", f"rotation of part {label!r}")
        one_of("anchor", self.anchor, _ANCHORS)
        n = self.modular_ratio
        if not (math.isfinite(n) and n > 0):
            raise InputError(
                f"Modular ratio n of part {label!r} must be a positive number (got n = {n})",
                name="n",
                value=self.n,
                expected="n > 0",
            )

    @property
    def modular_ratio(self) -> float:
        """n as a float."""
        n = self.n
        if hasattr(n, "to"):
            return float(require(n, "[]", "n").to("dimensionless").magnitude)
        try:
            return float(n)
        except (TypeError, ValueError):
            raise InputError(
                f"Modular ratio n of part {self.name!r} must be a number (got {n!r})",
                name="n",
                value=n,
                expected="a positive number",
            ) from None

    @cached_property
    def regions(self) -> list[tuple[Region, float]]:
        """The shape's regions, mirrored, rotated and moved into place (metres, weight ±1)."""
        angle = si(self.rotation)
        turned = [
            (r.transformed(mirror=self.mirrored, angle=angle, dx=0.0, dy=0.0), w)
            for r, w in self.shape.local_regions()
        ]
        if self.anchor == "corner":
            solids = [r for r, w in turned if w > 0]
            ax = min(r.bbox()[0] for r in solids)
            ay = min(r.bbox()[1] for r in solids)
        else:
            ms = [(r.moments(), w) for r, w in turned]
            area = sum(w * m.A for m, w in ms)
            ax = sum(w * m.A * m.cx for m, w in ms) / area
            ay = sum(w * m.A * m.cy for m, w in ms) / area
        dx = si(self.x) - ax
        dy = si(self.y) - ay
        return [(r.transformed(mirror=False, angle=0.0, dx=dx, dy=dy), w) for r, w in turned]


@dataclass(frozen=True, kw_only=True, eq=False)
class CompositeSection(Section):
    """A section built from placed parts (see :func:`composite`).

    Coordinates are those the parts were placed in; properties are of the transformed
    section in the reference material (n = 1).
    """

    parts: tuple[Part, ...]
    name: str = "built-up section"

    def __post_init__(self) -> None:
        at_least("parts", self.parts, what="solid part")
        for i, part in enumerate(self.parts):
            instance(
                f"parts[{i}]",
                part,
                Part,
                expected="a placed shape, made with shape.at(x=..., y=...)",
            )
        if all(p.hole for p in self.parts):
            raise InputError(
                "Composite section parts must include at least one solid part (got only holes)",
                name="parts",
                value=self.parts,
                expected="a solid part",
            )
        names = [p.name for p in self.parts]
        if len(set(names)) < len(names):
            # the parts table needs one line per part: number repeated names in order
            renamed = tuple(
                _renamed(p, f"{p.name} ({names[:k].count(p.name) + 1})")
                if names.count(p.name) > 1
                else p
                for k, p in enumerate(self.parts)
            )
            object.__setattr__(self, "parts", renamed)
        _ = self._weighted  # validates the holes now, at construction

    @cached_property
    def _weighted(self) -> list[WeightedRegion]:
        solids: list[WeightedRegion] = []
        voids: list[WeightedRegion] = []
        by_part: list[tuple[Part, list[tuple[Region, float]]]] = []
        for part in self.parts:
            if part.hole:
                continue
            n = part.modular_ratio
            by_part.append((part, part.regions))
            for region, w in part.regions:
                target = solids if w > 0 else voids
                target.append(WeightedRegion(region, w * n, part.name))
        self._check_overlaps(by_part)
        holes: list[WeightedRegion] = []
        for part in self.parts:
            if not part.hole:
                continue
            for region, w in part.regions:
                if w < 0:
                    continue  # a void inside a hole part (e.g. a tube used as a hole): no effect
                holes.append(self._place_hole(part, region, solids, voids))
        return solids + voids + holes

    def _check_overlaps(self, by_part: list[tuple[Part, list[tuple[Region, float]]]]) -> None:
        """Refuse solid parts that overlap: their common area would count twice."""
        for i, (p, p_regions) in enumerate(by_part):
            for q, q_regions in by_part[i + 1 :]:
                common = sum(
                    wa * wb * overlap_area(ra, rb) for ra, wa in p_regions for rb, wb in q_regions
                )
                smaller = min(
                    sum(w * r.moments().A for r, w in p_regions),
                    sum(w * r.moments().A for r, w in q_regions),
                )
                if common > 1e-9 * smaller:
                    raise InputError(
                        f"Parts {p.name!r} and {q.name!r} of section {self.name!r} overlap "
                        f"(common area {common * 1e6:.4g} mm²): solid parts must not overlap, "
                        "or that area counts twice; move or trim one of them",
                        name=q.name,
                        value=q,
                        expected="parts that touch but do not overlap",
                    )

    def _place_hole(
        self,
        part: Part,
        region: Region,
        solids: list[WeightedRegion],
        voids: list[WeightedRegion],
    ) -> WeightedRegion:
        """The hole's weighted region: cut from the solid part(s) that wholly cover it."""
        c = region.moments()
        in_void = any(v.region.contains_point(c.cx, c.cy) for v in voids)
        parent = next((s for s in solids if s.region.contains(region)), None)
        if parent is not None and not in_void:
            return WeightedRegion(region, -parent.weight, part.name)
        # a hole through several touching parts (a bolt through a plate and a flange):
        # the parts must cover it wholly, and be of one material
        cover = {s.weight: 0.0 for s in solids}
        for s in solids:
            cover[s.weight] += overlap_area(region, s.region)
        for v in voids:
            cover[-v.weight] -= overlap_area(region, v.region)
        covering = {w: a for w, a in cover.items() if a > 1e-9 * c.A}
        total = sum(covering.values())
        if total < c.A * (1 - 1e-9):
            x0, y0, x1, y1 = region.bbox()
            raise InputError(
                f"Hole {part.name!r} must lie wholly inside the solid parts of section "
                f"{self.name!r}; it lies outside or is larger than its parent (hole spans "
                f"x = {fmt_len(x0)} to {fmt_len(x1)}, y = {fmt_len(y0)} to {fmt_len(y1)}; "
                f"{100 * (1 - total / c.A):.3g} % of it is outside)",
                name=part.name,
                value=part,
                expected="a hole inside the solid parts",
            )
        if len(covering) > 1:
            raise InputError(
                f"Hole {part.name!r} of section {self.name!r} crosses parts of different "
                "modular ratios; split it into one hole per part",
                name=part.name,
                value=part,
                expected="a hole within parts of one material",
            )
        return WeightedRegion(region, -next(iter(covering)), part.name)

    def weighted_regions(self) -> list[WeightedRegion]:
        return self._weighted

    def part_rows(self) -> list[PartRow]:
        groups: dict[str, tuple[float, list[tuple[Region, float]]]] = {}
        for wr in self._weighted:
            sign = 1.0 if wr.weight > 0 else -1.0
            n, regs = groups.setdefault(wr.part, (abs(wr.weight), []))
            regs.append((wr.region, sign))
        rows: list[PartRow] = []
        for name, (n, regs) in groups.items():
            solid = [r for r, s in regs if s > 0]
            void = [r for r, s in regs if s < 0]
            if solid and not void:
                rows += part_rows([(name, n, solid)])
            elif void and not solid:
                rows += part_rows([(name, -n, void)])
            else:
                # a shape with internal voids (tube, RHS): combine into one net row
                pos = part_rows([(name, n, solid)])[0]
                neg = part_rows([(name, -n, void)])[0]
                a = pos.A + neg.A
                cx = (pos.A * pos.x + neg.A * neg.x) / a
                cy = (pos.A * pos.y + neg.A * neg.y) / a
                ix = pos.Ix + pos.A * (pos.y - cy) ** 2 + neg.Ix + neg.A * (neg.y - cy) ** 2
                iy = pos.Iy + pos.A * (pos.x - cx) ** 2 + neg.Iy + neg.A * (neg.x - cx) ** 2
                ixy = (
                    pos.Ixy
                    + pos.A * (pos.x - cx) * (pos.y - cy)
                    + neg.Ixy
                    + neg.A * (neg.x - cx) * (neg.y - cy)
                )
                rows.append(PartRow(name, n, a, cx, cy, ix, iy, ixy, 0.0, 0.0))
        return rows

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        """Σ of the parts' own J for an open section built from plates and open shapes (the
        thin-walled approximation, common practice); not for holes or closed cells."""
        if any(p.hole for p in self.parts):
            return None, "it has holes, which the open thin-walled formula cannot account for"
        total = 0.0
        for p in self.parts:
            if not p.shape.is_open_thin_walled():
                return None, f"part {p.name!r} is not an open thin-walled shape"
            j, reason = p.shape.torsion_constant_m4()
            if j is None:
                return None, f"part {p.name!r}: {reason}"
            total += j * p.modular_ratio
        return total, ""

    def warping_constant_m6(self) -> tuple[float | None, str]:
        return None, (
            "no general warping formula is coded for built-up sections; model a doubly "
            "symmetric plate girder as an ISection (r = 0) to get Cw"
        )


def _renamed(part: Part, name: str) -> Part:
    return Part(
        shape=part.shape,
        x=part.x,
        y=part.y,
        name=name,
        anchor=part.anchor,
        rotation=part.rotation,
        mirrored=part.mirrored,
        n=part.n,
        hole=part.hole,
    )


def composite(*parts: Part, name: str = "built-up section") -> CompositeSection:
    """A composite (built-up or transformed) section from placed parts.

    Example::

        tee = Tee(d=200 * mm, bf=150 * mm, tf=12 * mm, tw=8 * mm)
        plate = Rectangle(b=180 * mm, d=10 * mm)
        sec = composite(tee.at(x=15 * mm, y=0 * mm, name="tee"),
                        plate.at(x=0 * mm, y=200 * mm, name="cover plate"))

    Raises:
        InputError: no solid part, a hole outside its parent, or zero net area.
    """
    return CompositeSection(parts=tuple(parts), name=name)
