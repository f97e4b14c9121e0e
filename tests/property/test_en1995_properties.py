"""Properties of the EN 1995-1-1 factors: k_mod never falls as the load gets shorter (Table
3.1), k_c and k_crit lie in (0, 1] and never rise with slenderness, and the combined
compression and bending check (6.19) is exactly 1 on its curve."""

from __future__ import annotations

import itertools

from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.checks.en1995 import DURATIONS, TimberForcesEC, TimberMemberEC, check_en1995_member
from calcpack.checks.en1995.values import k_mod
from calcpack.units import Q_


def test_k_mod_ordering_by_duration():
    for product, sc in itertools.product(("solid", "glulam"), (1, 2, 3)):
        values = [k_mod(product, sc, d) for d in DURATIONS]
        assert values == sorted(values), (product, sc)
    for d in DURATIONS:  # and never rises from a drier to a wetter service class
        assert k_mod("solid", 1, d) >= k_mod("solid", 3, d)


lengths = st.floats(0.3, 6.0)


@settings(deadline=None, max_examples=30)  # each example runs the whole check
@given(lengths, lengths)
def test_k_c_at_most_one_and_monotonic(l1, l2):
    lo, hi = sorted((l1, l2))

    def kc(L):
        m = TimberMemberEC("C24", Q_(75, "mm"), Q_(150, "mm"), 1, L_ef_z=Q_(L, "m"))
        r = check_en1995_member(m, TimberForcesEC(N_Ed=Q_(10, "kN")))
        return r.values["k_c_z"].magnitude

    assert 0 < kc(hi) <= kc(lo) <= 1.0


@settings(deadline=None, max_examples=30)  # each example runs the whole check
@given(lengths, lengths)
def test_k_crit_at_most_one_and_monotonic(l1, l2):
    lo, hi = sorted((l1, l2))

    def kcrit(L):
        m = TimberMemberEC("C24", Q_(47, "mm"), Q_(250, "mm"), 1, L_ef_LT=Q_(L, "m"))
        return check_en1995_member(m, TimberForcesEC(M_Ed=Q_(1, "kN*m"))).values["k_crit"].magnitude

    assert 0 < kcrit(hi) <= kcrit(lo) <= 1.0


@settings(deadline=None, max_examples=30)  # each example runs the whole check
@given(st.floats(0.05, 0.95))
def test_compression_and_bending_is_one_on_its_curve(t):
    # (σ_c/f_c)² + σ_m/f_m = 1 with σ_c = √t f_c and σ_m = (1 − t) f_m (short member, λ_rel ≤ 0.3)
    m = TimberMemberEC("C24", Q_(100, "mm"), Q_(200, "mm"), 1)
    probe = check_en1995_member(m, TimberForcesEC(N_Ed=Q_(1, "kN"), M_Ed=Q_(1, "kN*m")))
    fc, fm = probe.values["f_c_0_d"], probe.values["f_m_d"]
    A, W = Q_(100 * 200, "mm**2"), Q_(100 * 200**2 / 6, "mm**3")
    f = TimberForcesEC(N_Ed=(t**0.5 * fc * A).to("kN"), M_Ed=((1 - t) * fm * W).to("kN*m"))
    u = check_en1995_member(m, f)["Compression and bending (6.19)"].utilisation
    assert abs(u - 1.0) < 1e-9
