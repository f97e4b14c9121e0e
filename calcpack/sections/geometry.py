"""Numeric core for section geometry: polygons and circles in SI floats (metres).

Coordinates: x to the right, y up, in metres. Polygons are stored counter-clockwise. Every
region reports its area properties in *centroidal* form (area, centroid, second moments about
axes through its own centroid) so that combining parts uses the parallel-axis theorem directly
and large offsets do not cost precision.

Polygon area, first and second moments follow from Green's theorem applied edge by edge (the
usual closed-form sums over the vertices, common practice). Circles use their closed forms.
A region cut by a straight line (for the plastic neutral axis and for Q) is found by clipping:
a polygon against one half-plane (Sutherland-Hodgman, exact for a single half-plane even for a
non-convex polygon because the degenerate edges it may create enclose no area), a circle by the
circular-segment formulas.

Nothing here knows about units; :mod:`calcpack.sections.shapes` converts at the boundary.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Sequence
from dataclasses import dataclass

__all__ = [
    "CircleRegion",
    "Cut",
    "Moments",
    "PolygonRegion",
    "Region",
    "arc_points",
    "overlap_area",
    "self_intersection",
]

Point = tuple[float, float]


@dataclass(frozen=True)
class Moments:
    """Area properties of one region in centroidal form (SI: m², m, m⁴).

    Attributes:
        A: area.
        cx, cy: centroid.
        Ix, Iy: second moments about horizontal and vertical axes through the centroid.
        Ixy: product of area about those axes (∫(x - cx)(y - cy) dA).
    """

    A: float
    cx: float
    cy: float
    Ix: float
    Iy: float
    Ixy: float


@dataclass(frozen=True)
class Cut:
    """The part of a region on the low side of a line: its area and the centroid coordinate
    measured across the line (y for a horizontal cut, x for a vertical one)."""

    A: float
    c: float


def _polygon_raw(pts: Sequence[Point]) -> tuple[float, float, float, float, float, float]:
    """Signed A, ∫x, ∫y, ∫x², ∫y², ∫xy of a closed polygon about the origin (Green's theorem)."""
    a = sx = sy = ixx = iyy = ixy = 0.0
    n = len(pts)
    for i in range(n):
        x0, y0 = pts[i]
        x1, y1 = pts[(i + 1) % n]
        c = x0 * y1 - x1 * y0
        a += c
        sx += (x0 + x1) * c
        sy += (y0 + y1) * c
        ixx += (x0 * x0 + x0 * x1 + x1 * x1) * c
        iyy += (y0 * y0 + y0 * y1 + y1 * y1) * c
        ixy += (x0 * y1 + 2 * x0 * y0 + 2 * x1 * y1 + x1 * y0) * c
    return a / 2, sx / 6, sy / 6, ixx / 12, iyy / 12, ixy / 24


def _polygon_moments(pts: Sequence[Point]) -> Moments:
    # Work about a reference point inside the bounding box so that offsets far from the origin
    # do not cancel digits in I = I_origin - A c².
    rx = sum(p[0] for p in pts) / len(pts)
    ry = sum(p[1] for p in pts) / len(pts)
    local = [(x - rx, y - ry) for x, y in pts]
    a, s_x, s_y, i_xx, i_yy, i_xy = _polygon_raw(local)
    if a == 0:
        return Moments(0.0, rx, ry, 0.0, 0.0, 0.0)
    cx = s_x / a
    cy = s_y / a
    return Moments(
        A=a,
        cx=cx + rx,
        cy=cy + ry,
        Ix=i_yy - a * cy * cy,
        Iy=i_xx - a * cx * cx,
        Ixy=i_xy - a * cx * cy,
    )


def _segments_cross(p1: Point, p2: Point, p3: Point, p4: Point, tol: float) -> bool:
    """True if closed segments p1p2 and p3p4 share a point (touching counts)."""

    def orient(a: Point, b: Point, c: Point) -> float:
        return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])

    def on_seg(a: Point, b: Point, c: Point) -> bool:
        return (
            min(a[0], b[0]) - tol <= c[0] <= max(a[0], b[0]) + tol
            and min(a[1], b[1]) - tol <= c[1] <= max(a[1], b[1]) + tol
        )

    d1 = orient(p3, p4, p1)
    d2 = orient(p3, p4, p2)
    d3 = orient(p1, p2, p3)
    d4 = orient(p1, p2, p4)
    scale = tol * (
        math.dist(p1, p2) + math.dist(p3, p4) + 1e-300
    )  # orientation is an area: compare with length x tolerance
    if ((d1 > scale and d2 < -scale) or (d1 < -scale and d2 > scale)) and (
        (d3 > scale and d4 < -scale) or (d3 < -scale and d4 > scale)
    ):
        return True
    return (
        (abs(d1) <= scale and on_seg(p3, p4, p1))
        or (abs(d2) <= scale and on_seg(p3, p4, p2))
        or (abs(d3) <= scale and on_seg(p1, p2, p3))
        or (abs(d4) <= scale and on_seg(p1, p2, p4))
    )


def self_intersection(pts: Sequence[Point]) -> tuple[int, int] | None:
    """The first pair of edge indices (i, j) of a closed polygon that touch or cross, where edge
    i runs from vertex i to vertex i+1; None if the outline is simple. Adjacent edges may share
    their common vertex only."""
    n = len(pts)
    span = max(
        max(p[0] for p in pts) - min(p[0] for p in pts),
        max(p[1] for p in pts) - min(p[1] for p in pts),
    )
    tol = 1e-12 * span
    for i in range(n):
        a1, a2 = pts[i], pts[(i + 1) % n]
        for j in range(i + 1, n):
            if j == i + 1 or (i == 0 and j == n - 1):
                # adjacent: only a fold back onto the neighbour is an intersection
                b1, b2 = pts[j], pts[(j + 1) % n]
                shared = a2 if j == i + 1 else a1
                other_a = a1 if j == i + 1 else a2
                other_b = b2 if j == i + 1 else b1
                ux, uy = other_a[0] - shared[0], other_a[1] - shared[1]
                vx, vy = other_b[0] - shared[0], other_b[1] - shared[1]
                cross = ux * vy - uy * vx
                dot = ux * vx + uy * vy
                if abs(cross) <= tol * (math.hypot(ux, uy) + math.hypot(vx, vy)) and dot > 0:
                    return (i, j)
                continue
            if _segments_cross(a1, a2, pts[j], pts[(j + 1) % n], tol):
                return (i, j)
    return None


def _clip_low(pts: Sequence[Point], level: float, axis: int) -> list[Point]:
    """Sutherland-Hodgman clip of a polygon to the half-plane coordinate[axis] <= level."""
    out: list[Point] = []
    n = len(pts)
    for i in range(n):
        p = pts[i]
        q = pts[(i + 1) % n]
        p_in = p[axis] <= level
        q_in = q[axis] <= level
        if p_in:
            out.append(p)
        if p_in != q_in:
            t = (level - p[axis]) / (q[axis] - p[axis])
            out.append((p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])))
    return out


def _point_in_polygon(pt: Point, pts: Sequence[Point], tol: float) -> bool:
    """Inside or on the boundary (within tol)."""
    x, y = pt
    n = len(pts)
    for i in range(n):
        if _dist_to_segment(pt, pts[i], pts[(i + 1) % n]) <= tol:
            return True
    inside = False
    for i in range(n):
        x0, y0 = pts[i]
        x1, y1 = pts[(i + 1) % n]
        if (y0 > y) != (y1 > y):
            xc = x0 + (y - y0) * (x1 - x0) / (y1 - y0)
            if xc > x:
                inside = not inside
    return inside


def _dist_to_segment(p: Point, a: Point, b: Point) -> float:
    ax, ay = a
    bx, by = b
    dx, dy = bx - ax, by - ay
    length2 = dx * dx + dy * dy
    if length2 == 0:
        return math.dist(p, a)
    t = max(0.0, min(1.0, ((p[0] - ax) * dx + (p[1] - ay) * dy) / length2))
    return math.dist(p, (ax + t * dx, ay + t * dy))


def arc_points(
    cx: float, cy: float, r: float, start: float, end: float, segments: int
) -> list[Point]:
    """Points on a circular arc from angle ``start`` to ``end`` (radians), both ends included.

    Used for root fillets and rounded corners. With 24 segments per quarter circle the chord
    approximation loses about 0.06 % of the area between chord and arc, which on a fillet
    (itself a few per cent of a rolled section) is far below the 3 figures tabulated.
    """
    return [
        (
            cx + r * math.cos(start + (end - start) * k / segments),
            cy + r * math.sin(start + (end - start) * k / segments),
        )
        for k in range(segments + 1)
    ]


class Region:
    """A primitive region in SI floats (see :class:`PolygonRegion`, :class:`CircleRegion`)."""

    label: str

    def moments(self) -> Moments:
        raise NotImplementedError

    def bbox(self) -> tuple[float, float, float, float]:
        """(x_min, y_min, x_max, y_max) in metres."""
        raise NotImplementedError

    def cut(self, level: float, axis: str) -> Cut:
        """The part with y <= level (axis "x": bending about a horizontal axis) or x <= level
        (axis "y")."""
        raise NotImplementedError

    def width(self, level: float, axis: str) -> float:
        """Length of the chord through the region along y = level (axis "x") or x = level."""
        raise NotImplementedError

    def transformed(self, *, mirror: bool, angle: float, dx: float, dy: float) -> Region:
        """Mirror in the y axis (x -> -x) if asked, rotate by ``angle`` (radians, CCW) about the
        origin, then translate by (dx, dy)."""
        raise NotImplementedError

    def contains(self, other: Region) -> bool:
        """True if ``other`` lies wholly inside this region (boundaries may touch)."""
        raise NotImplementedError

    def contains_point(self, x: float, y: float) -> bool:
        """True if (x, y) lies inside this region or on its boundary."""
        raise NotImplementedError

    def extent(self) -> float:
        x0, y0, x1, y1 = self.bbox()
        return max(x1 - x0, y1 - y0)


def _xf(p: Point, mirror: bool, c: float, s: float, dx: float, dy: float) -> Point:
    x, y = p
    if mirror:
        x = -x
    return (c * x - s * y + dx, s * x + c * y + dy)


class PolygonRegion(Region):
    """A simple polygon (vertices in metres, stored counter-clockwise)."""

    def __init__(self, points: Sequence[Point], label: str = "") -> None:
        pts = [(float(x), float(y)) for x, y in points]
        a = _polygon_raw(pts)[0]
        if a < 0:
            pts.reverse()
        self.points: tuple[Point, ...] = tuple(pts)
        self.label = label
        self._m = _polygon_moments(self.points)

    def moments(self) -> Moments:
        return self._m

    def bbox(self) -> tuple[float, float, float, float]:
        xs = [p[0] for p in self.points]
        ys = [p[1] for p in self.points]
        return (min(xs), min(ys), max(xs), max(ys))

    def cut(self, level: float, axis: str) -> Cut:
        k = 1 if axis == "x" else 0
        clipped = _clip_low(self.points, level, k)
        if len(clipped) < 3:
            return Cut(0.0, level)
        m = _polygon_moments(clipped)
        if m.A <= 0:
            return Cut(0.0, level)
        return Cut(m.A, m.cy if axis == "x" else m.cx)

    def width(self, level: float, axis: str) -> float:
        k = 1 if axis == "x" else 0
        o = 1 - k
        crossings: list[float] = []
        n = len(self.points)
        for i in range(n):
            p = self.points[i]
            q = self.points[(i + 1) % n]
            # half-open rule so a vertex on the line is counted once
            if (p[k] > level) != (q[k] > level):
                t = (level - p[k]) / (q[k] - p[k])
                crossings.append(p[o] + t * (q[o] - p[o]))
        crossings.sort()
        return sum(crossings[i + 1] - crossings[i] for i in range(0, len(crossings) - 1, 2))

    def transformed(self, *, mirror: bool, angle: float, dx: float, dy: float) -> PolygonRegion:
        c, s = math.cos(angle), math.sin(angle)
        return PolygonRegion([_xf(p, mirror, c, s, dx, dy) for p in self.points], self.label)

    def contains_point(self, x: float, y: float) -> bool:
        return _point_in_polygon((x, y), self.points, 1e-12 * self.extent())

    def contains(self, other: Region) -> bool:
        tol = 1e-9 * self.extent()
        if isinstance(other, PolygonRegion):
            pts = list(other.points)
            n = len(pts)
            mids = [
                ((pts[i][0] + pts[(i + 1) % n][0]) / 2, (pts[i][1] + pts[(i + 1) % n][1]) / 2)
                for i in range(n)
            ]
            return all(_point_in_polygon(p, self.points, tol) for p in pts + mids)
        if isinstance(other, CircleRegion):
            centre = (other.cx, other.cy)
            if not _point_in_polygon(centre, self.points, tol):
                return False
            n = len(self.points)
            nearest = min(
                _dist_to_segment(centre, self.points[i], self.points[(i + 1) % n]) for i in range(n)
            )
            return nearest >= other.r - tol
        return False


class CircleRegion(Region):
    """A full circle of radius ``r`` centred on (cx, cy), metres."""

    def __init__(self, cx: float, cy: float, r: float, label: str = "") -> None:
        self.cx = float(cx)
        self.cy = float(cy)
        self.r = float(r)
        self.label = label

    def moments(self) -> Moments:
        i = math.pi * self.r**4 / 4
        return Moments(math.pi * self.r**2, self.cx, self.cy, i, i, 0.0)

    def bbox(self) -> tuple[float, float, float, float]:
        return (self.cx - self.r, self.cy - self.r, self.cx + self.r, self.cy + self.r)

    def cut(self, level: float, axis: str) -> Cut:
        centre = self.cy if axis == "x" else self.cx
        r = self.r
        h = max(-r, min(r, level - centre))
        # A(h) = ∫_{-r}^{h} 2√(r²-t²) dt and its first moment about the centre
        root = math.sqrt(max(r * r - h * h, 0.0))
        area = h * root + r * r * math.asin(h / r) + math.pi * r * r / 2
        if area <= 0:
            return Cut(0.0, level)
        first = -2.0 / 3.0 * root**3
        return Cut(area, centre + first / area)

    def width(self, level: float, axis: str) -> float:
        centre = self.cy if axis == "x" else self.cx
        h = level - centre
        return 2 * math.sqrt(self.r**2 - h * h) if abs(h) < self.r else 0.0

    def transformed(self, *, mirror: bool, angle: float, dx: float, dy: float) -> CircleRegion:
        x, y = _xf((self.cx, self.cy), mirror, math.cos(angle), math.sin(angle), dx, dy)
        return CircleRegion(x, y, self.r, self.label)

    def contains_point(self, x: float, y: float) -> bool:
        return math.hypot(x - self.cx, y - self.cy) <= self.r * (1 + 1e-12)

    def contains(self, other: Region) -> bool:
        tol = 1e-9 * self.r
        if isinstance(other, CircleRegion):
            return math.hypot(other.cx - self.cx, other.cy - self.cy) + other.r <= self.r + tol
        if isinstance(other, PolygonRegion):
            return all(
                math.hypot(x - self.cx, y - self.cy) <= self.r + tol for x, y in other.points
            )
        return False


_OVERLAP_SIDES = 256
"""Sides of the inscribed polygon standing in for a circle when testing overlaps only."""


def _as_polygon(region: Region) -> tuple[Point, ...]:
    if isinstance(region, PolygonRegion):
        return region.points
    if isinstance(region, CircleRegion):
        pts = arc_points(region.cx, region.cy, region.r, 0.0, 2 * math.pi, _OVERLAP_SIDES)
        return tuple(pts[:-1])
    raise TypeError(f"no polygon for {type(region).__name__}")


def _boundary_inside_sum(
    a: Sequence[Point], b: Sequence[Point], tol: float, *, keep_shared_same: bool
) -> float:
    """Σ ½(x dy - y dx) over the pieces of polygon a's boundary that lie inside polygon b.

    Pieces lying on b's boundary count only if ``keep_shared_same`` and both boundaries run the
    same way there (so a shared edge is counted once, and an edge where the two only touch,
    running opposite ways, not at all)."""
    total = 0.0
    na, nb = len(a), len(b)
    for i in range(na):
        p, q = a[i], a[(i + 1) % na]
        dx, dy = q[0] - p[0], q[1] - p[1]
        length2 = dx * dx + dy * dy
        ts = [0.0, 1.0]
        for j in range(nb):
            r, s = b[j], b[(j + 1) % nb]
            ex, ey = s[0] - r[0], s[1] - r[1]
            denom = dx * ey - dy * ex
            if abs(denom) > 1e-14 * math.sqrt(length2 * (ex * ex + ey * ey)):
                t = ((r[0] - p[0]) * ey - (r[1] - p[1]) * ex) / denom
                u = ((r[0] - p[0]) * dy - (r[1] - p[1]) * dx) / denom
                if -1e-12 <= t <= 1 + 1e-12 and -1e-12 <= u <= 1 + 1e-12:
                    ts.append(min(1.0, max(0.0, t)))
            else:
                # parallel: split where the other edge's ends fall on this one
                for v in (r, s):
                    if _dist_to_segment(v, p, q) <= tol:
                        t = ((v[0] - p[0]) * dx + (v[1] - p[1]) * dy) / length2
                        if 0.0 < t < 1.0:
                            ts.append(t)
        ts.sort()
        for t0, t1 in itertools.pairwise(ts):
            if t1 - t0 <= 1e-12:
                continue
            x0, y0 = p[0] + t0 * dx, p[1] + t0 * dy
            x1, y1 = p[0] + t1 * dx, p[1] + t1 * dy
            mid = ((x0 + x1) / 2, (y0 + y1) / 2)
            on_edge = None
            for j in range(nb):
                r, s = b[j], b[(j + 1) % nb]
                if _dist_to_segment(mid, r, s) <= tol:
                    on_edge = (s[0] - r[0], s[1] - r[1])
                    break
            if on_edge is not None:
                same = on_edge[0] * dx + on_edge[1] * dy > 0
                inside = keep_shared_same and same
            else:
                inside = _point_in_polygon(mid, b, 0.0)
            if inside:
                total += 0.5 * (x0 * y1 - x1 * y0)
    return total


def overlap_area(first: Region, second: Region) -> float:
    """Area common to two regions, m² (circles as inscribed 256-gons; for tests of overlap and
    cover, not for properties). Exact for polygons: Green's theorem over the parts of each
    boundary that lie inside the other."""
    fx0, fy0, fx1, fy1 = first.bbox()
    sx0, sy0, sx1, sy1 = second.bbox()
    tol = 1e-9 * max(first.extent(), second.extent())
    if min(fx1, sx1) - max(fx0, sx0) <= tol or min(fy1, sy1) - max(fy0, sy0) <= tol:
        return 0.0
    a = _as_polygon(first)
    b = _as_polygon(second)
    area = _boundary_inside_sum(a, b, tol, keep_shared_same=True) + _boundary_inside_sum(
        b, a, tol, keep_shared_same=False
    )
    return max(area, 0.0)
