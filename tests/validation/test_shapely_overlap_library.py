"""Overlap areas (used to refuse overlapping parts and to check hole cover) against shapely.

Source: the *shapely* library (BSD licence, PyPI, 2.x; the GEOS geometry engine), installed with
the test extra as a dependency of sectionproperties, used as an independent reference for the
area of intersection of two simple polygons.
"""

from __future__ import annotations

import math

import pytest
import shapely
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from calcpack.sections.geometry import PolygonRegion, overlap_area


@st.composite
def star_polygons(draw: st.DrawFn) -> list[tuple[float, float]]:
    n = draw(st.integers(3, 9))
    cx = draw(st.floats(-1, 1))
    cy = draw(st.floats(-1, 1))
    radii = draw(st.lists(st.floats(0.2, 1.0), min_size=n, max_size=n))
    jitter = draw(st.lists(st.floats(0, 0.8), min_size=n, max_size=n))
    return [
        (cx + r * math.cos(2 * math.pi * (k + j) / n), cy + r * math.sin(2 * math.pi * (k + j) / n))
        for k, (r, j) in enumerate(zip(radii, jitter, strict=True))
    ]


@settings(max_examples=60, deadline=None)
@given(star_polygons(), star_polygons())
def test_overlap_area_of_two_polygons_matches_shapely(a, b):
    pa, pb = shapely.Polygon(a), shapely.Polygon(b)
    assume(pa.is_valid and pb.is_valid)
    want = pa.intersection(pb).area
    ra, rb = PolygonRegion(a), PolygonRegion(b)
    # Both are exact up to rounding, except that calcpack takes boundaries closer than 1e-9 of
    # the larger extent as shared (so parts drawn edge to edge touch rather than overlap by a
    # sliver): the areas may then differ by up to that band times the perimeters, plus rounding.
    band = 1e-9 * max(ra.extent(), rb.extent()) * (pa.length + pb.length)
    assert overlap_area(ra, rb) == pytest.approx(want, abs=band + 1e-12)


def test_shared_edges_count_once_and_touching_edges_not_at_all():
    square = [(0.0, 0.0), (1.0, 0.0), (1.0, 1.0), (0.0, 1.0)]
    beside = [(1.0, 0.0), (2.0, 0.0), (2.0, 1.0), (1.0, 1.0)]
    inner = [(0.0, 0.0), (0.5, 0.0), (0.5, 1.0), (0.0, 1.0)]
    for other in (square, beside, inner):
        want = shapely.Polygon(square).intersection(shapely.Polygon(other)).area
        got = overlap_area(PolygonRegion(square), PolygonRegion(other))
        assert got == pytest.approx(want, abs=1e-15)
