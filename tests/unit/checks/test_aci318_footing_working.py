"""The ACI 318-19 footing checks show their working on every path (eccentric load, uplift,
rectangular band, plain pier) and the numbers in the working are those of the checks."""

from __future__ import annotations

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.combinations.asce7 import asce7_strength
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_


def _text(checks):
    return "\n".join(str(s) for s in checks.working())


def test_eccentric_rectangular_footing_with_uplift_case():
    f = Footing(
        "rectangular",
        Q_(6, "ft"),
        Q_(18, "inch"),
        Column(Q_(12, "inch"), Q_(16, "inch")),
        L=Q_(9, "ft"),
    )
    loads = {
        "D": FootingLoad(P=Q_(60, "kip"), My=Q_(15, "kip*ft")),
        "L": FootingLoad(P=Q_(40, "kip")),
        "W": FootingLoad(P=Q_(-120, "kip"), Vx=Q_(8, "kip"), My=Q_(40, "kip*ft")),
    }
    r = check_aci_footing(f, loads, asce7_strength(), ACIFootingDesign(f_c=Q_(4000, "psi")))
    text = _text(r)
    assert "central band" in text  # §13.3.3.3
    assert "moment transfer" in text  # §8.4.4.2.3
    assert r["Top face under uplift"].verdict == "NOT COVERED"
    # the working's checks are the numeric checks
    for x in r.results:
        assert x.name in text


def test_round_reinforced_footing_is_an_equivalent_square():
    f = Footing("round", Q_(5, "ft"), Q_(14, "inch"), Column(Q_(12, "inch"), shape="round"))
    r = check_aci_footing(
        f,
        {"D": FootingLoad(P=Q_(50, "kip"))},
        asce7_strength(),
        ACIFootingDesign(f_c=Q_(3000, "psi"), bar="#4"),
    )
    assert "square of equal area" in _text(r)
    assert r["Flexure x"].verdict == "OK"


def test_metric_bars():
    f = Footing("square", Q_(2.0, "m"), Q_(0.45, "m"), Column(Q_(0.3, "m")))
    d = ACIFootingDesign(
        f_c=Q_(28, "MPa"),
        f_y=Q_(420, "MPa"),
        bar="#16",
        bar_system="ASTM metric",
        cover=Q_(75, "mm"),
    )
    r = check_aci_footing(f, {"D": FootingLoad(P=Q_(500, "kN"))}, asce7_strength(), d)
    assert r["Flexure x"].verdict == "OK"
    assert "#16" in _text(r)
