"""Invariants of the ACI 318-19 Chapter 17 anchor checks.

* The projected areas A_Nc and A_Vc are the areas of the union of each anchor's idealised
  failure surface -- a square of side 3 h_ef about each anchor in plan, a rectangle 3 c_a1 wide
  and 1.5 c_a1 deep on the side face -- cut off by the member's edges and thickness (ACI 318-19
  §17.6.2.1.1, §17.7.2.1.1 and Commentary Figures R17.6.2.1 and R17.7.2.1b, from memory). The
  union and the cut are computed with *shapely* (BSD licence, PyPI 2.x; the GEOS engine), an
  independent general-purpose geometry library.
* Unit invariance: the same anchors in millimetres and megapascals give the same strengths.
* Moving every edge further away never lowers the breakout strength in tension.
"""

from __future__ import annotations

from typing import Any

import pytest
import shapely
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.aci318 import AnchorGroup, AnchorLoads, check_aci_anchors
from calcpack.units import Q_

IN = "inch"
FAR = 1e4  # in., an edge not given


@st.composite
def layouts(draw: st.DrawFn) -> dict[str, Any]:
    h_ef = draw(st.floats(3, 14))
    nx = draw(st.integers(1, 3))
    ny = draw(st.integers(1, 3))
    edges = {}
    for side in ("-x", "+x", "-y", "+y"):
        if draw(st.booleans()):
            edges[side] = draw(st.floats(2, 30))
    return {
        "h_ef": h_ef,
        "nx": nx,
        "ny": ny,
        "s_x": draw(st.floats(3, 30)),
        "s_y": draw(st.floats(3, 30)),
        "edges": edges,
        "h_a": h_ef + draw(st.floats(1, 20)),
    }


def make(p: dict[str, Any], scale: str = IN, k: float = 1.0) -> AnchorGroup:
    q = lambda v: Q_(v * k, scale)  # noqa: E731 - a local unit converter
    return AnchorGroup(
        "headed bolt", q(0.5), q(p["h_ef"]), "F1554 Gr. 36",
        Q_(4000, "psi") if scale == IN else Q_(4000, "psi").to("MPa"), q(p["h_a"]),
        edges={s: q(v) for s, v in p["edges"].items()}, nx=p["nx"], ny=p["ny"],
        s_x=q(p["s_x"]) if p["nx"] > 1 else None, s_y=q(p["s_y"]) if p["ny"] > 1 else None,
        A_brg=Q_(0.4 * k * k, f"{scale}**2"), A_se=Q_(0.142 * k * k, f"{scale}**2"),
    )  # fmt: skip


def plan_member(p: dict[str, Any]) -> Any:
    """The member in plan, anchors from (0, 0) to ((nx-1)s_x, (ny-1)s_y)."""
    e = {s: p["edges"].get(s, FAR) for s in ("-x", "+x", "-y", "+y")}
    wx = (p["nx"] - 1) * p["s_x"]
    wy = (p["ny"] - 1) * p["s_y"]
    return shapely.box(-e["-x"], -e["-y"], wx + e["+x"], wy + e["+y"])


@settings(max_examples=60, deadline=None)
@given(layouts())
def test_tension_projected_area_is_the_union_of_squares_cut_by_the_edges(
    p: dict[str, Any],
) -> None:
    r = check_aci_anchors(make(p), AnchorLoads(N=Q_(1, "kip")))
    h = r.values.get("h_ef_red", r.values["h_ef"]).to(IN).magnitude
    squares = [
        shapely.box(i * p["s_x"] - 1.5 * h, j * p["s_y"] - 1.5 * h,
                    i * p["s_x"] + 1.5 * h, j * p["s_y"] + 1.5 * h)
        for i in range(p["nx"]) for j in range(p["ny"])
    ]  # fmt: skip
    area = shapely.union_all(squares).intersection(plan_member(p)).area
    assert r.values["A_Nc"].to("inch**2").magnitude == pytest.approx(area, rel=1e-9)


@settings(max_examples=60, deadline=None)
@given(layouts())
def test_shear_projected_area_is_the_union_of_side_face_rectangles(p: dict[str, Any]) -> None:
    p = {**p, "edges": {**p["edges"], "+x": p["edges"].get("+x", 8.0)}}
    r = check_aci_anchors(make(p), AnchorLoads(V=Q_(1, "kip"), toward="+x"))
    ca1 = r.values.get("c_a1_used_x2", r.values["c_a1_x2"]).to(IN).magnitude
    # the side face at edge +x: y along the edge, z down from the top surface
    rects = [
        shapely.box(j * p["s_y"] - 1.5 * ca1, 0.0, j * p["s_y"] + 1.5 * ca1, 1.5 * ca1)
        for j in range(p["ny"])
    ]
    wy = (p["ny"] - 1) * p["s_y"]
    face = shapely.box(-p["edges"].get("-y", FAR), 0.0, wy + p["edges"].get("+y", FAR), p["h_a"])
    area = shapely.union_all(rects).intersection(face).area
    assert r.values["A_Vc_x2"].to("inch**2").magnitude == pytest.approx(area, rel=1e-9)


@settings(max_examples=40, deadline=None)
@given(layouts())
def test_strengths_do_not_depend_on_the_units(p: dict[str, Any]) -> None:
    p = {**p, "edges": {**p["edges"], "+x": p["edges"].get("+x", 8.0)}}
    loads = AnchorLoads(N=Q_(1, "kip"), V=Q_(1, "kip"), toward="+x")
    us = check_aci_anchors(make(p), loads)
    si = check_aci_anchors(make(p, "mm", 25.4), loads)
    for a, b in zip(us.results, si.results, strict=True):
        assert a.name == b.name
        assert b.capacity.to(a.capacity.units).magnitude == pytest.approx(
            a.capacity.magnitude, rel=1e-9
        )


@settings(max_examples=40, deadline=None)
@given(layouts(), st.floats(0, 20))
def test_edges_further_away_never_lower_the_breakout_in_tension(
    p: dict[str, Any], more: float
) -> None:
    q = {**p, "edges": {s: v + more for s, v in p["edges"].items()}}
    near = check_aci_anchors(make(p), AnchorLoads(N=Q_(1, "kip")))
    far = check_aci_anchors(make(q), AnchorLoads(N=Q_(1, "kip")))
    name = "N_cbg" if p["nx"] * p["ny"] > 1 else "N_cb"
    assert far.values[name] >= near.values[name] * (1 - 1e-12)
