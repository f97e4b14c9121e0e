"""IBC 2018 §1807.3.2 embedment of posts and poles against lateral load.

Source: International Code Council, International Building Code 2018, §1807.3.2.1 Eq. (18-1)
(non-constrained: d = 0.5 A {1 + [1 + 4.36 h/A]^½}, A = 2.34 P/(S1 b), S1 at d/3) and
§1807.3.2.2 Eq. (18-2) (constrained: d² = 4.25 P h/(S3 b), S3 at d), lateral bearing per foot
of depth from Table 1806.2 (class 5 soils: 100 psf/ft), §1806.3.3 (increase with depth) and
§1806.3.4 (isolated poles: twice the tabular value) -- all from memory of the printed code.
No published worked example is recalled with its numbers, so each case is worked by hand
below from the equations (plain arithmetic in lb and ft); tolerance 1e-9 relative (float
round-off only). The property tests state what the equation must satisfy whatever the input.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.ibc2018 import EmbeddedPost, check_embedment
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

CLASS5 = Q_(100, "psf/ft")  # IBC 2018 Table 1806.2, class 5 soils (from memory)


def _post(**kw):
    args = {
        "P": Q_(300, "lbf"),
        "h": Q_(3, "ft"),
        "b": Q_(2, "ft"),
        "d": Q_(4, "ft"),
        "lateral_bearing": CLASS5,
        "lateral_source": "IBC 2018 Table 1806.2, class 5",
    }
    args.update(kw)
    return EmbeddedPost(**args)  # fmt: skip


def test_non_constrained_eq_18_1_by_hand():
    # P = 300 lb at h = 3 ft, b = 2 ft, d = 4 ft: S1 = 100·4/3 = 133.33 psf;
    # A = 2.34·300/(133.33·2) = 2.6325 ft; d = 0.5·2.6325·(1 + √(1 + 4.36·3/2.6325)) ft
    S1 = 100 * 4 / 3
    A = 2.34 * 300 / (S1 * 2)
    d = 0.5 * A * (1 + math.sqrt(1 + 4.36 * 3 / A))
    r = check_embedment(_post(), mark="PR-A")
    assert r.values["S_1"].to("psf").magnitude == pytest.approx(S1, rel=1e-9)
    assert r.values["A"].to("ft").magnitude == pytest.approx(A, rel=1e-9)
    c = r["Embedment depth"]
    assert c.demand.to("ft").magnitude == pytest.approx(d, rel=1e-9)
    assert c.capacity.to("ft").magnitude == pytest.approx(4.0, rel=1e-12)
    assert c.verdict == ("OK" if d <= 4 else "NOT OK")
    assert "Eq. (18-1)" in c.clause


def test_isolated_pole_doubles_the_pressure_and_depth_is_capped_at_12_ft():
    # §1806.3.4: 2 × 100 psf/ft; d = 15 ft provided, pressure computed at 12 ft: S1 = 2·100·4
    r = check_embedment(_post(d=Q_(15, "ft"), isolated_pole=True))
    assert r.values["S_1"].to("psf").magnitude == pytest.approx(800.0, rel=1e-9)


def test_constrained_eq_18_2_by_hand():
    # S3 = 100·4 = 400 psf; d = √(4.25·300·3/(400·2)) ft
    r = check_embedment(_post(restraint="constrained"))
    d = math.sqrt(4.25 * 300 * 3 / (400 * 2))
    assert r["Embedment depth"].demand.to("ft").magnitude == pytest.approx(d, rel=1e-9)
    assert "Eq. (18-2)" in r["Embedment depth"].clause


def test_si_inputs_give_the_same_depth():
    si = _post(P=Q_(300, "lbf").to("N"), h=Q_(3, "ft").to("m"), b=Q_(2, "ft").to("m"),
               d=Q_(4, "ft").to("m"), lateral_bearing=CLASS5.to("kPa/m"))  # fmt: skip
    a = check_embedment(_post())["Embedment depth"].demand.to("ft").magnitude
    b = check_embedment(si)["Embedment depth"].demand.to("ft").magnitude
    assert b == pytest.approx(a, rel=1e-9)


def test_refusals_name_the_input():
    with pytest.raises(OutOfScopeError, match=r"§1807\.3\.1"):
        _post(supports_finishes=True)
    with pytest.raises(OutOfScopeError, match="h = 0"):
        _post(restraint="constrained", h=Q_(0, "ft"))
    with pytest.raises(InputError) as e:
        _post(lateral_bearing=Q_(100, "psf"))
    assert e.value.name == "lateral_bearing"
    with pytest.raises(InputError) as e:
        _post(P=Q_(-5, "lbf"))
    assert e.value.name == "P"
    with pytest.raises(InputError) as e:
        _post(lateral_source=" ")
    assert e.value.name == "lateral_source"


forces = st.floats(min_value=10.0, max_value=20_000.0)
heights = st.floats(min_value=0.0, max_value=20.0)
widths = st.floats(min_value=0.5, max_value=6.0)
depths = st.floats(min_value=1.0, max_value=20.0)


@settings(max_examples=60, deadline=None)
@given(forces, heights, widths, depths)
def test_eq_18_1_depth_is_the_root_of_its_quadratic(P, h, b, d):
    # Eq. (18-1) solves d² − A d − 1.09 A h = 0 (squaring 2d/A − 1 = √(1 + 4.36 h/A))
    r = check_embedment(_post(P=Q_(P, "lbf"), h=Q_(h, "ft"), b=Q_(b, "ft"), d=Q_(d, "ft")))
    A = r.values["A"].to("ft").magnitude
    x = r["Embedment depth"].demand.to("ft").magnitude
    assert x * x - A * x - 1.09 * A * h == pytest.approx(0.0, abs=1e-9 * max(x * x, 1.0))
    assert x >= A * (1 - 1e-12)


@settings(max_examples=60, deadline=None)
@given(forces, heights, widths, depths, st.floats(min_value=1.01, max_value=3.0))
def test_more_force_needs_more_depth_and_a_wider_pier_less(P, h, b, d, k):
    def need(**kw):
        args = {"P": Q_(P, "lbf"), "h": Q_(h, "ft"), "b": Q_(b, "ft"), "d": Q_(d, "ft")}
        args.update(kw)
        return check_embedment(_post(**args))["Embedment depth"].demand.to("ft").magnitude

    base = need()
    assert need(P=Q_(P * k, "lbf")) > base
    assert need(b=Q_(b * k, "ft")) < base
