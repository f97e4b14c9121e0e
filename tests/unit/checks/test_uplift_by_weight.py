"""Net uplift held down by dead weight (calcpack.checks.uplift), worked by hand below.

References: the combinations as printed in ASCE/SEI 7-16 (§2.4.1 combination 7 is 0.6D + 0.6W,
§2.3.1 combination 5 is 0.9D + 1.0W; from memory); the check itself -- the factored weight of
the body against the net uplift on it -- is common practice; normal-weight concrete at 150 pcf
is common practice. The loads are invented inputs.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.uplift import ResistingWeight, UpliftByWeight, check_uplift_by_weight
from calcpack.combinations import asce7_allowable_stress, asce7_strength, combination_set
from calcpack.errors import DimensionError, InputError
from calcpack.units import Q_

# a 30 in. round pier 24 in. deep: V = π/4 · 2.5² · 2 = 9.8175 ft³, W = 150 · V = 1472.6 lb
V_PIER = Q_(math.pi / 4 * 2.5**2 * 2.0, "ft**3")
CONCRETE = ResistingWeight("c", "concrete of the pier", Q_(150, "pcf"), V_PIER, "common practice")


def test_pier_under_06d_06w_by_hand():
    # 0.6·600 − 0.6·1000 = −240 lb on the top (uplift), against 0.6 · 1472.6 = 883.6 lb
    body = UpliftByWeight({"D": Q_(600, "lbf"), "L": Q_(2400, "lbf"), "W": Q_(-1000, "lbf")},
                          (CONCRETE,), not_counted="skin friction on the sides")  # fmt: skip
    r = check_uplift_by_weight(body, asce7_allowable_stress(), mark="PR-B")["Uplift"]
    W = 150 * math.pi / 4 * 2.5**2 * 2.0
    assert r.demand.to("lbf").magnitude == pytest.approx(240.0, rel=1e-12)
    assert r.capacity.to("lbf").magnitude == pytest.approx(0.6 * W, rel=1e-12)
    assert r.combination.startswith("7")
    assert r.verdict == "OK"
    assert "§2.4.1 (7)" in r.clause


def test_strength_set_uses_09d_10w():
    # 0.9·600 − 1.0·1000 = −460 lb, against 0.9 · 1472.6 lb
    body = UpliftByWeight({"D": Q_(600, "lbf"), "W": Q_(-1000, "lbf")}, (CONCRETE,))
    r = check_uplift_by_weight(body, asce7_strength(), mark="PR-B")["Uplift"]
    assert r.demand.to("lbf").magnitude == pytest.approx(460.0, rel=1e-12)
    assert r.capacity.to("lbf").magnitude == pytest.approx(0.9 * 150 * V_PIER.magnitude, rel=1e-12)


def test_soil_engaged_adds_and_the_factor_of_safety_multiplies_the_uplift():
    # W = 150·V + 110·2 ft³ ; FS = 1.5 on U = 0.6·(1000 − 600) = 240 lb
    soil = ResistingWeight("s", "soil over the bell", Q_(110, "pcf"), Q_(2, "ft**3"), "report")
    body = UpliftByWeight({"D": Q_(600, "lbf"), "W": Q_(-1000, "lbf")}, (CONCRETE, soil),
                          safety=1.5, safety_source="the firm's practice")  # fmt: skip
    r = check_uplift_by_weight(body, asce7_allowable_stress(), mark="F1")["Uplift"]
    assert r.demand.to("lbf").magnitude == pytest.approx(1.5 * 240.0, rel=1e-12)
    assert r.capacity.to("lbf").magnitude == pytest.approx(
        0.6 * (150 * V_PIER.magnitude + 220.0), rel=1e-12
    )


def test_too_much_uplift_is_not_ok_and_no_uplift_is_zero_demand():
    big = UpliftByWeight({"D": Q_(100, "lbf"), "W": Q_(-3000, "lbf")}, (CONCRETE,))
    r = check_uplift_by_weight(big, asce7_allowable_stress(), mark="PR-A")["Uplift"]
    assert r.verdict == "NOT OK"
    assert r.utilisation == pytest.approx(
        0.6 * (3000 - 100) / (0.6 * 150 * V_PIER.magnitude), rel=1e-12
    )
    none = UpliftByWeight({"D": Q_(900, "lbf"), "W": Q_(-100, "lbf")}, (CONCRETE,))
    r = check_uplift_by_weight(none, asce7_allowable_stress(), mark="PR-A")["Uplift"]
    assert r.demand.magnitude == 0.0
    assert r.combination is None
    # the weakest resistance: the least dead-load factor of the set, 0.6
    assert r.capacity.to("lbf").magnitude == pytest.approx(0.6 * 150 * V_PIER.magnitude)


def test_working_shows_the_terms_of_the_governing_combination():
    body = UpliftByWeight({"D": Q_(600, "lbf"), "L": Q_(2400, "lbf"), "W": Q_(-1000, "lbf")},
                          (CONCRETE,), not_counted="skin friction on the sides")  # fmt: skip
    text = "\n".join(
        s.text() for s in check_uplift_by_weight(body, asce7_allowable_stress(), mark="PR-B")
        .working()
    )  # fmt: skip
    assert "U = −(γ_D·P_D + γ_W·P_W)" in text
    assert "P_L" not in text  # live load is not in 0.6D + 0.6W
    assert "W_c = γ_c·V_c" in text
    assert "R_up = γ_D·W_c" in text
    assert "Not counted in the resistance: skin friction on the sides" in text
    assert "FS_up" not in text  # no further factor by default: the check is U against γ_D·W_c
    stated = check_uplift_by_weight(
        UpliftByWeight(body.loads, body.weights, safety=1.5, safety_source="the firm's practice"),
        asce7_allowable_stress(),
        mark="PR-B",
    )
    text = "\n".join(s.text() for s in stated.working())
    assert "U_FS = FS_up·U" in text
    assert "the firm's practice" in text


def test_nonsense_inputs_are_refused_naming_the_input():
    with pytest.raises(InputError) as e:
        ResistingWeight("c", "concrete", Q_(-150, "pcf"), V_PIER, "common practice")
    assert e.value.name == "unit_weight"
    assert "-150" in str(e.value) or "−150" in str(e.value)
    with pytest.raises(InputError) as e:
        ResistingWeight("c", "concrete", Q_(150, "pcf"), Q_(0, "ft**3"), "common practice")
    assert e.value.name == "volume"
    with pytest.raises(DimensionError) as e:
        ResistingWeight("c", "concrete", Q_(150, "psf"), V_PIER, "common practice")
    assert e.value.name == "unit_weight"
    with pytest.raises(InputError) as e:
        ResistingWeight("c", "concrete", Q_(150, "pcf"), V_PIER, " ")
    assert e.value.name == "source"
    with pytest.raises(InputError) as e:
        UpliftByWeight({}, (CONCRETE,))
    assert e.value.name == "loads"
    with pytest.raises(DimensionError) as e:
        UpliftByWeight({"W": Q_(-1, "psf")}, (CONCRETE,))
    assert e.value.name == "loads['W']"
    with pytest.raises(InputError) as e:
        UpliftByWeight({"W": Q_(-1, "lbf")}, ())
    assert e.value.name == "weights"
    with pytest.raises(InputError) as e:
        UpliftByWeight({"W": Q_(-1, "lbf")}, (CONCRETE, CONCRETE))
    assert e.value.name == "weights"
    with pytest.raises(InputError) as e:
        UpliftByWeight({"W": Q_(-1, "lbf")}, (CONCRETE,), safety=0.5)
    assert e.value.name == "safety"


def test_a_combination_that_lifts_without_dead_load_is_refused():
    own = combination_set("engineer's", {"1": {"D": 1.0}, "2": {"W": 1.0}})
    body = UpliftByWeight({"D": Q_(600, "lbf"), "W": Q_(-1000, "lbf")}, (CONCRETE,))
    with pytest.raises(InputError) as e:
        check_uplift_by_weight(body, own, mark="PR-B")
    assert e.value.name == "dead_case"
    assert "'2: W'" in str(e.value)


@settings(max_examples=60, deadline=None)
@given(
    D=st.floats(0.0, 5000.0),
    W=st.floats(-8000.0, 0.0),
    scale=st.floats(0.1, 10.0),
)
def test_demand_is_the_largest_net_uplift_and_scaling_leaves_the_utilisation(
    D: float, W: float, scale: float
) -> None:
    # the ASD set with D and W: the net loads are D, D + 0.6W and 0.6D + 0.6W, and the
    # resistance 1.0·W_c or 0.6·W_c; the largest ratio of uplift to resistance governs
    def run(k: float) -> tuple[float, float]:
        w = ResistingWeight("c", "concrete", Q_(150, "pcf"), V_PIER * k, "common practice")
        body = UpliftByWeight({"D": Q_(D * k, "lbf"), "W": Q_(W * k, "lbf")}, (w,))
        r = check_uplift_by_weight(body, asce7_allowable_stress(), mark="x")["Uplift"]
        return r.demand.to("lbf").magnitude, float(r.utilisation)

    Wc = 150 * V_PIER.magnitude
    ratios = [max(0.0, -(D + 0.6 * W)) / Wc, max(0.0, -(0.6 * D + 0.6 * W)) / (0.6 * Wc)]
    demand, u = run(1.0)
    assert u == pytest.approx(max(ratios), rel=1e-9, abs=1e-12)
    assert demand >= 0.0
    _, u_scaled = run(scale)
    assert u_scaled == pytest.approx(u, rel=1e-9, abs=1e-12)


def test_si_and_us_inputs_agree():
    us = UpliftByWeight({"D": Q_(600, "lbf"), "W": Q_(-1000, "lbf")}, (CONCRETE,))
    si_w = ResistingWeight("c", "concrete", Q_(150, "pcf").to("kN/m**3"),
                           V_PIER.to("m**3"), "common practice")  # fmt: skip
    si = UpliftByWeight({"D": Q_(600, "lbf").to("kN"), "W": Q_(-1000, "lbf").to("kN")}, (si_w,))
    a = check_uplift_by_weight(us, asce7_allowable_stress(), mark="x")["Uplift"]
    b = check_uplift_by_weight(si, asce7_allowable_stress(), mark="x")["Uplift"]
    assert a.utilisation == pytest.approx(b.utilisation, rel=1e-9)
