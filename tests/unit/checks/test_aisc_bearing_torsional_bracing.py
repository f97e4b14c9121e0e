"""Bad input and working of the §J7 bearing and Appendix 6.3.2 torsional bracing checks."""

from __future__ import annotations

import pytest

from calcpack.checks.aisc360.bearing_j7 import BearingSurface, check_aisc_bearing
from calcpack.checks.aisc360.bracing_torsional import (
    TorsionalBraceCase,
    check_aisc_torsional_bracing,
)
from calcpack.errors import DimensionError, InputError, OutOfScopeError
from calcpack.sections.aisc_database import aisc_shape
from calcpack.units import Q_


def test_bearing_bad_inputs_name_the_input():
    with pytest.raises(InputError, match="kind"):
        BearingSurface("milled", Fy=Q_(36, "ksi"), R=Q_(1, "kip"), Apb=Q_(1, "inch**2"))
    with pytest.raises(DimensionError, match="Apb"):
        BearingSurface("pin", Fy=Q_(36, "ksi"), R=Q_(1, "kip"), Apb=Q_(1, "inch"))
    with pytest.raises(InputError, match="Apb"):
        BearingSurface("pin", Fy=Q_(36, "ksi"), R=Q_(1, "kip"))
    with pytest.raises(InputError, match="lb"):
        BearingSurface("roller", Fy=Q_(36, "ksi"), R=Q_(1, "kip"), d=Q_(6, "inch"))
    with pytest.raises(InputError, match="R"):
        BearingSurface("pin", Fy=Q_(36, "ksi"), R=Q_(-1, "kip"), Apb=Q_(1, "inch**2"))
    with pytest.raises(InputError, match="Fy"):
        BearingSurface("pin", Fy=Q_(1600, "psi"), R=Q_(1, "kip"), Apb=Q_(1, "inch**2"))
    s = BearingSurface("pin", Fy=Q_(36, "ksi"), R=Q_(1, "kip"), Apb=Q_(1, "inch**2"))
    with pytest.raises(InputError, match="method"):
        check_aisc_bearing(s, method="LSD")


def test_bearing_working_shows_the_equation_and_verdict():
    s = BearingSurface(
        "roller", Fy=Q_(36, "ksi"), R=Q_(100, "kip"), d=Q_(30, "inch"), lb=Q_(2, "inch")
    )
    r = check_aisc_bearing(s, method="ASD")
    refs = [getattr(step, "ref", None) for step in r.working()]
    assert "AISC 360-16 Eq. (J7-3)" in refs
    assert r["Bearing"].verdict == "NOT OK"  # 6(23)(2)√30/20/2 = 37.8 kips < 100 kips


def test_torsional_bracing_bad_inputs_name_the_input():
    w = aisc_shape("W18X50")
    with pytest.raises(OutOfScopeError, match="I-shapes"):
        TorsionalBraceCase(aisc_shape("WT9X25"), "point", Mr=Q_(1, "kip*ft"), L=Q_(1, "ft"), n=1)
    with pytest.raises(InputError, match="kind"):
        TorsionalBraceCase(w, "nodal", Mr=Q_(1, "kip*ft"))
    with pytest.raises(InputError, match="n"):
        TorsionalBraceCase(w, "point", Mr=Q_(1, "kip*ft"), L=Q_(20, "ft"), n=1.5)
    with pytest.raises(InputError, match="n"):
        TorsionalBraceCase(w, "point", Mr=Q_(1, "kip*ft"), L=Q_(20, "ft"), n=0)
    with pytest.raises(InputError, match="L"):
        TorsionalBraceCase(w, "point", Mr=Q_(1, "kip*ft"), n=1)
    with pytest.raises(InputError, match="bs"):
        TorsionalBraceCase(w, "point", Mr=Q_(1, "kip*ft"), L=Q_(9, "ft"), n=1, ts=Q_(1, "inch"))
    with pytest.raises(InputError, match="Cb"):
        TorsionalBraceCase(w, "continuous", Mr=Q_(1, "kip*ft"), Cb=3.5)
    with pytest.raises(DimensionError, match="brace_stiffness"):
        TorsionalBraceCase(
            w,
            "continuous",
            Mr=Q_(1, "kip*ft"),
            brace_strength=Q_(1, "kip"),
            brace_stiffness=Q_(1, "kip*ft"),
        )


def test_torsional_bracing_without_brace_values_states_the_requirement():
    case = TorsionalBraceCase(
        aisc_shape("W18X50"),
        "point",
        Mr=Q_(100, "kip*ft"),
        L=Q_(20, "ft"),
        n=1,
        ts=Q_(0.375, "inch"),
        bs=Q_(6, "inch"),
    )
    r = check_aisc_torsional_bracing(case, method="ASD")
    assert r["Brace"].verdict == "NOT COVERED"
    assert r.values["beta_Tbr"].magnitude > 0
