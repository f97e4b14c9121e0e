"""A plain concrete footing and pier against ACI CODE-318-19 Chapter 14, evaluated by hand here.

Source: ACI CODE-318-19 §14.5.1.7 (h − 2 in. for concrete cast against soil), Eq. 14.5.2.1a
(Mn = 5·λ·√f'c·Sm), §14.5.5.1 (shear), §14.5.6.1 (bearing), Table 21.2.1(g) (φ = 0.60);
clause numbers from memory, to be confirmed against the printed standard.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.combinations.asce7 import asce7_strength
from calcpack.foundations import Column, Footing, FootingLoad
from calcpack.units import Q_

PLAIN = ACIFootingDesign(f_c=Q_(3000, "psi"), reinforced=False)
SQ = math.sqrt(3000)


def test_plain_pad_flexure_and_one_way_shear():
    f = Footing("square", Q_(3, "ft"), Q_(12, "inch"), Column(Q_(5.5, "inch")))
    loads = {"D": FootingLoad(P=Q_(4, "kip")), "L": FootingLoad(P=Q_(6, "kip"))}
    r = check_aci_footing(f, loads, asce7_strength(), PLAIN)
    hs = 10.0  # §14.5.1.7
    Sm = 36 * hs**2 / 6
    assert r["Flexure x"].capacity.to("kip*ft").magnitude == pytest.approx(
        0.6 * 5 * SQ * Sm / 12000, rel=1e-9
    )
    Pu = 1.2 * 4 + 1.6 * 6
    Mu = Pu / 9 * 3 * (1.5 - 5.5 / 24) ** 2 / 2  # §13.2.7.1 at the post face
    assert r["Flexure x"].demand.to("kip*ft").magnitude == pytest.approx(Mu, rel=1e-9)
    assert r["One-way shear x"].capacity.to("kip").magnitude == pytest.approx(
        0.6 * 4 / 3 * SQ * 36 * hs / 1000, rel=1e-9
    )
    assert r["Minimum thickness"].verdict == "OK"
    assert r.passed


def test_plain_footing_thinner_than_8_in_is_not_ok():
    f = Footing("square", Q_(2, "ft"), Q_(6, "inch"), Column(Q_(5.5, "inch")))
    r = check_aci_footing(f, {"D": FootingLoad(P=Q_(2, "kip"))}, asce7_strength(), PLAIN)
    assert r["Minimum thickness"].verdict == "NOT OK"  # §14.3.2.1


def test_pier_bearing_and_lateral_load_not_covered():
    pier = Footing(
        "round",
        Q_(12, "inch"),
        Q_(48, "inch"),
        Column(Q_(3.5, "inch"), support="base plate", plate1=Q_(6, "inch")),
        kind="pier",
    )
    loads = {
        "D": FootingLoad(P=Q_(1.5, "kip")),
        "L": FootingLoad(P=Q_(3, "kip"), Vx=Q_(0.2, "kip")),
    }
    r = check_aci_footing(pier, loads, asce7_strength(), PLAIN)
    # §14.5.6.1: φ·0.85·f'c·A1·√(A2/A1), A1 = 36 in². A2 is geometrically similar to and
    # concentric with the 6 in. square plate (§22.8.3.2 and its Commentary, from memory) and
    # lies on the 12 in. round pier: the largest such square has its corners on the circle,
    # side 12/√2 in., so √(A2/A1) = (12/√2)/6 = √2 (below the cap of 2; the 1V:2H frustum
    # through the 48 in. pier does not govern)
    ratio = (12 / math.sqrt(2)) / 6
    assert r["Bearing"].capacity.to("kip").magnitude == pytest.approx(
        0.6 * 0.85 * 3 * 36 * ratio, rel=1e-9
    )
    assert r["Pier under lateral load"].verdict == "NOT COVERED"
