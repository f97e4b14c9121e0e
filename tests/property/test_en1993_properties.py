"""Properties of the EN 1993-1-1 reduction factors and interactions.

χ_LT (§6.3.2.2 and §6.3.2.3 with the UK NA values) and χ (§6.3.1.2) lie in (0, 1] and never
increase with slenderness; f ≤ 1 so χ_LT,mod ≥ χ_LT; the §6.2.9 check reaches utilisation 1
exactly on its curve M_Ed = M_N,y,Rd.
"""

from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.en1993 import DesignForces, SteelMemberEC, check_en1993_member
from calcpack.checks.en1993.data import ALPHA
from calcpack.checks.en1993.ltb import chi_flexural, chi_lt, f_modification
from calcpack.sections.eurocode_tables import euro_section
from calcpack.units import Q_

curves = st.sampled_from(sorted(ALPHA))
lams = st.floats(0.0, 4.0, allow_nan=False)


@given(curves, lams, lams, st.sampled_from(["6.3.2.2", "6.3.2.3"]))
def test_chi_lt_at_most_one_and_monotonic(curve, l1, l2, method):
    lo, hi = sorted((l1, l2))
    a = chi_lt(ALPHA[curve], lo, method)
    b = chi_lt(ALPHA[curve], hi, method)
    assert 0 < b <= a <= 1.0


@given(curves, lams, lams)
def test_chi_flexural_at_most_one_and_monotonic(curve, l1, l2):
    lo, hi = sorted((l1, l2))
    assert 0 < chi_flexural(ALPHA[curve], hi) <= chi_flexural(ALPHA[curve], lo) <= 1.0


@given(st.floats(1 / 3.0**0.5, 1.0), lams)
def test_f_at_most_one(kc, lam):
    assert f_modification(kc, lam) <= 1.0


@settings(deadline=None, max_examples=30)  # each example runs the whole check
@given(st.floats(0.26, 0.9))
def test_axial_and_bending_is_one_on_its_curve(n):
    # 254x254x73 UC S355 (class 1 at these n): M_Ed = M_N,y,Rd  ->  utilisation 1
    s = euro_section("254x254x73 UC")
    m = SteelMemberEC(s, "S355")
    Npl = (s.A * Q_(345, "MPa")).to("kN")
    probe = check_en1993_member(m, DesignForces(N_Ed=n * Npl, My_Ed=Q_(1, "kN*m")))
    MN = probe.values["M_N_y_Rd"]
    r = check_en1993_member(m, DesignForces(N_Ed=n * Npl, My_Ed=MN))
    assert abs(r["Axial and bending (6.2.9)"].utilisation - 1.0) < 1e-9
