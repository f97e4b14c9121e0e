"""AISC 360-16 §J8 with the base plate, §J10 and Appendix 6.

* J.6 (AISC Design Examples v16.0, published-values reference): W12x96 column, 22 x 22 in.
  base plate on a 24 x 24 in. pedestal, f'c = 3 ksi: φ_c P_p = 875 kips, P_p/Ω_c = 583 kips;
  minimum plate thickness 1.54 in. The example's loads (P_D = 115 kips, P_L = 345 kips, so
  P_u = 690 kips and P_a = 460 kips) and plate grade (F_y = 50 ksi) are from memory.
* §J10.2, §J10.3 and Appendix 6: the Specification's equations evaluated by hand here for
  W8X18 (AISC Shapes Database v16.0 dimensions), the reference being the printed equation.
"""

from __future__ import annotations

import math

import pytest

from calcpack.checks.aisc360.bearing import (
    BasePlate,
    ConcentratedForce,
    check_aisc_base_plate,
    check_aisc_web_bearing,
)
from calcpack.checks.aisc360.bracing import BraceCase, check_aisc_bracing
from calcpack.errors import InputError, OutOfScopeError
from calcpack.sections.aisc_database import aisc_shape
from calcpack.units import Q_

PLATE = BasePlate(
    B=Q_(22, "inch"), N=Q_(22, "inch"), Fy=Q_(50, "ksi"), fc=Q_(3, "ksi"), A2=Q_(576, "inch**2")
)


@pytest.mark.parametrize(("method", "P", "printed"), [("LRFD", 690, 875), ("ASD", 460, 583)])
def test_j6_concrete_bearing_and_plate_thickness(method, P, printed):
    r = check_aisc_base_plate(aisc_shape("W12X96"), PLATE, P=Q_(P, "kip"), method=method)
    # J.6 (v16.0): 875 / 583 kips, three figures
    assert r["Concrete bearing"].capacity.to("kip").magnitude == pytest.approx(printed, rel=5e-3)
    # J.6 (v16.0): minimum plate thickness 1.54 in., printed to 0.01 in.
    assert r.values["t_min"].to("inch").magnitude == pytest.approx(1.54, abs=0.006)


def test_w8x18_web_yielding_and_crippling_at_an_end_bearing():
    # hand evaluation of AISC 360-16 Eq. (J10-3) and (J10-5a); W8X18: d 8.14, tw 0.23,
    # tf 0.33, k_des 0.63 in (AISC Shapes Database v16.0); lb = 1.5 in, at the end
    d, tw, tf, k, lb, Fy, E = 8.14, 0.23, 0.33, 0.63, 1.5, 50.0, 29000.0
    wly = Fy * tw * (2.5 * k + lb)
    wcr = 0.40 * tw**2 * (1 + 3 * (lb / d) * (tw / tf) ** 1.5) * math.sqrt(E * Fy * tf / tw)
    f = ConcentratedForce(R=Q_(10, "kip"), lb=Q_(lb, "inch"), at=Q_(0, "inch"))
    r = check_aisc_web_bearing(aisc_shape("W8X18"), Fy=Q_(50, "ksi"), force=f)
    assert r["Web local yielding"].capacity.to("kip").magnitude == pytest.approx(1.0 * wly)
    assert r["Web local crippling"].capacity.to("kip").magnitude == pytest.approx(0.75 * wcr)


def test_column_point_brace_requirements():
    # AISC 360-16 Eq. (A-6-3), (A-6-4) by hand: P_r = 100 kips, L_br = 10 ft
    b = BraceCase(
        "column",
        "point",
        Lbr=Q_(10, "ft"),
        Pr=Q_(100, "kip"),
        brace_strength=Q_(5, "kip"),
        brace_stiffness=Q_(20, "kip/inch"),
    )
    lrfd = check_aisc_bracing(b)
    assert lrfd["Brace strength"].demand.to("kip").magnitude == pytest.approx(1.0)
    assert lrfd["Brace stiffness"].demand.to("kip/inch").magnitude == pytest.approx(
        8 * 100 / 120 / 0.75
    )
    asd = check_aisc_bracing(b, method="ASD")
    assert asd["Brace stiffness"].demand.to("kip/inch").magnitude == pytest.approx(
        2.0 * 8 * 100 / 120
    )


def test_beam_point_brace_near_inflection_doubles():
    # AISC 360-16 Eq. (A-6-7): P_br = 0.02 M_r C_d / h_o, C_d = 2
    b = BraceCase(
        "beam",
        "point",
        Lbr=Q_(8, "ft"),
        Mr=Q_(120, "kip*ft"),
        ho=Q_(12, "inch"),
        double_curvature_near_inflection=True,
    )
    r = check_aisc_bracing(b)
    assert r["Brace"].verdict == "NOT COVERED"
    assert r.values["P_br"].to("kip").magnitude == pytest.approx(0.02 * 120 * 12 * 2 / 12)


def test_refusals_and_bad_input_name_the_input():
    with pytest.raises(OutOfScopeError, match="HSS"):
        check_aisc_web_bearing(
            aisc_shape("HSS6X6X1/4"),
            Fy=Q_(50, "ksi"),
            force=ConcentratedForce(R=Q_(1, "kip"), lb=Q_(1, "inch"), at=Q_(0, "inch")),
        )
    small = BasePlate(B=Q_(10, "inch"), N=Q_(10, "inch"), Fy=Q_(36, "ksi"), fc=Q_(3, "ksi"))
    with pytest.raises(OutOfScopeError, match="project"):
        check_aisc_base_plate(aisc_shape("W12X96"), small, P=Q_(100, "kip"))
    with pytest.raises(InputError) as e:
        BasePlate(
            B=Q_(22, "inch"),
            N=Q_(22, "inch"),
            Fy=Q_(50, "ksi"),
            fc=Q_(3, "ksi"),
            A2=Q_(100, "inch**2"),
        )
    assert e.value.name == "A2"
    with pytest.raises(InputError) as e:
        BraceCase("column", "nodal", Lbr=Q_(10, "ft"), Pr=Q_(1, "kip"))
    assert e.value.name == "kind"
    with pytest.raises(InputError) as e:
        ConcentratedForce(R=Q_(1, "kip*ft"), lb=Q_(1, "inch"), at=Q_(0, "inch"))
    assert e.value.name == "R"
