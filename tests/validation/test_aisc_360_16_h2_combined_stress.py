"""ANSI/AISC 360-16 §H2, Eq. (H2-1): |f_ra/F_ca + f_rbw/F_cbw + f_rbz/F_cbz| ≤ 1.0 at each point
of the cross section, with f_rb = M_r c/I and F_cb = M_c/S (S = I/c at the point), compression
positive (the equation as recalled from the Specification, "from memory"; evaluated by hand
here). Tolerance 1e-9 relative: the same arithmetic.

Property (hypothesis): the interaction equals 1.0 on its curve.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.aisc360.combined_h2 import H2Case, H2Point, check_aisc_h2
from calcpack.errors import DimensionError, InputError
from calcpack.units import Q_

IN, KIP, KIN = "inch", "kip", "kip*inch"
POINTS = (
    H2Point("heel", Q_(-1.0, IN), Q_(0.5, IN)),
    H2Point("toe d", Q_(2.5, IN), Q_(-0.3, IN)),
    H2Point("toe b", Q_(-0.8, IN), Q_(-2.0, IN)),
)


def _case(Pr=20.0, Mrw=15.0, Mrz=-5.0, points=POINTS):
    return H2Case(
        Ag=Q_(2.5, "inch**2"), Iw=Q_(6.0, "inch**4"), Iz=Q_(1.2, "inch**4"),
        Pr=Q_(Pr, KIP), Mrw=Q_(Mrw, KIN), Mrz=Q_(Mrz, KIN),
        Pc=Q_(40, KIP), Mcw=Q_(60, KIN), Mcz=Q_(30, KIN), points=points,
    )  # fmt: skip


def test_h2_1_at_the_heel_and_toes_by_hand():
    r = check_aisc_h2(_case())
    # heel: z > 0, w < 0: 20/40 + 15/60 − (−5)/30 = 0.5 + 0.25 + 0.1667
    assert r["Combined stress at heel"].utilisation == pytest.approx(0.5 + 0.25 + 5 / 30)
    # toe d: z < 0, w > 0: 0.5 − 0.25 − 5/30
    assert r["Combined stress at toe d"].utilisation == pytest.approx(0.5 - 0.25 - 5 / 30)
    # toe b: z < 0, w < 0: 0.5 − 0.25 + 5/30
    assert r["Combined stress at toe b"].utilisation == pytest.approx(0.5 - 0.25 + 5 / 30)


def test_h2_tension_reverses_the_axial_term():
    r = check_aisc_h2(_case(Pr=-20.0))
    # toe d: −0.5 − 0.25 − 0.1667, absolute value
    assert r["Combined stress at toe d"].utilisation == pytest.approx(0.5 + 0.25 + 5 / 30)


@settings(max_examples=25, deadline=None)
@given(st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_h2_interaction_is_one_on_its_curve(a, b):
    # at the heel every term adds: P/Pc = a, M_w/M_cw = (1 − a)b, M_z/M_cz = (1 − a)(1 − b)
    p = a
    mw = (1 - a) * b
    mz = (1 - a) * (1 - b)
    r = check_aisc_h2(_case(Pr=40 * p, Mrw=60 * mw, Mrz=-30 * mz, points=POINTS[:1]))
    assert r["Combined stress at heel"].utilisation == pytest.approx(1.0, rel=1e-9)


def test_h2_bad_input_names_the_input():
    with pytest.raises(InputError, match="points"):
        _case(points=())
    with pytest.raises(DimensionError, match=r"heel\.w"):
        H2Point("heel", Q_(1, "kip"), Q_(1, IN))
    with pytest.raises(InputError, match="Pc"):
        H2Case(
            Ag=Q_(2.5, "inch**2"), Iw=Q_(6.0, "inch**4"), Iz=Q_(1.2, "inch**4"),
            Pr=Q_(1, KIP), Mrw=Q_(1, KIN), Mrz=Q_(1, KIN), Pc=Q_(0, KIP),
            Mcw=Q_(60, KIN), Mcz=Q_(30, KIN), points=POINTS,
        )  # fmt: skip
    with pytest.raises(InputError, match="method"):
        check_aisc_h2(_case(), method="WSD")


def test_angle_points_on_the_principal_axes_agree_with_the_section_geometry():
    """Consistency of the AISC Shapes Database v16.0 angle data (tan α, x̄, ȳ, I_z) with
    calcpack's section code for the same legs without fillets: the principal angle within 0.1°
    and I_w within 1 % (the database includes the fillets)."""
    import math

    from calcpack.checks.aisc360.combined_h2 import angle_h2_case
    from calcpack.sections import Angle
    from calcpack.sections.aisc_database import aisc_shape

    s = aisc_shape("L5X3-1/2X5/16")
    props = Angle(d=s["d"], b=s["b"], t=s["t"]).properties()
    alpha = math.degrees(math.atan(s["tan_a"].magnitude))
    assert props.theta_p.to("deg").magnitude == pytest.approx(alpha, abs=0.1)
    case = angle_h2_case(
        s, Pr=Q_(5, KIP), Mrw=Q_(10, KIN), Mrz=Q_(2, KIN), Pc=Q_(30, KIP),
        Mcw=Q_(80, KIN), Mcz=Q_(20, KIN),
    )  # fmt: skip
    assert case.Iw.to("inch**4").magnitude == pytest.approx(
        props.I1.to("inch**4").magnitude, rel=0.01
    )
    pts = {p.name: p for p in case.points}
    # the minor axis runs from the toe of the long leg to the toe of the short one; the heel
    # lies off the minor axis, toward −w
    assert pts["heel"].w.magnitude < 0
    assert pts["toe of leg d"].z.magnitude > 0 > pts["toe of leg b"].z.magnitude
    for p in case.points:  # a rotation keeps each point's distance from the centroid
        x0 = {"heel": -s["x"], "toe of leg d": -s["x"], "toe of leg b": s["b"] - s["x"]}[p.name]
        y0 = {"heel": -s["y"], "toe of leg d": s["d"] - s["y"], "toe of leg b": -s["y"]}[p.name]
        r2 = (x0**2 + y0**2).to("inch**2").magnitude
        assert (p.w**2 + p.z**2).to("inch**2").magnitude == pytest.approx(r2)
    r = check_aisc_h2(case, method="ASD")
    assert len(r.results) == 3
