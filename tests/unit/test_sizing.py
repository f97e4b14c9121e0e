"""The lightest section that passes: the search's contract.

References outside calcpack:
* AISC 360-16 §F2.1: for a compact W-shape with its compression flange braced continuously,
  M_n = M_p = F_y·Z_x and φ_b = 0.90; §G2.1(a): φ_v = 1.00 and V_n = 0.6·F_y·A_w·C_v1 with
  C_v1 = 1.0 and A_w = d·t_w for rolled I-shapes with h/t_w ≤ 2.24·√(E/F_y).
* Simple-span beam under uniform load w: M = w·L²/8, V = w·L/2 (any beam table, e.g. AISC
  Manual Table 3-23 case 1), and the mid-span deflection 5·w·L⁴/(384·E·I) (same table).
* Shape dimensions and Z_x from the AISC Shapes Database v16.0 (the data calcpack ships).
The brute-force answers below are computed from those formulas directly, not through calcpack's
checks.
"""

from __future__ import annotations

import math

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, Spring, solve_cases
from calcpack.checks import check_aisc_beam, check_deflection
from calcpack.combinations import analyse_combinations, asce7_strength
from calcpack.errors import InputError, OutOfScopeError
from calcpack.loads.types import UniformLoad
from calcpack.sections.aisc_database import aisc_shape, aisc_shape_names
from calcpack.sizing import (
    Candidate,
    DeflectionLimit,
    aisc_candidates,
    lightest_aisc_beam,
    lightest_sections,
)
from calcpack.units import Q_

FY = Q_(50, "ksi")
E = Q_(29000, "ksi")


def _simple(span_ft: float, wd: float, wl: float, I_in4: float = 300.0):  # type: ignore[no-untyped-def]
    L = Q_(span_ft, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[
            UniformLoad(w=Q_(wd, "kip/ft"), case="D"),
            UniformLoad(w=Q_(wl, "kip/ft"), case="L"),
        ],
        EI=E * Q_(I_in4, "in**4"),
        name="B1",
    )
    cases = solve_cases(beam)
    return L, cases, analyse_combinations(cases, asce7_strength())


def _brute_force(span_ft: float, wd: float, wl: float, live_limit: float | None) -> str:
    """Lightest compact W-shape by the closed forms (continuously braced, LRFD)."""
    wu = max(1.4 * wd, 1.2 * wd + 1.6 * wl)  # kip/ft, ASCE 7-16 §2.3.1 combinations 1 and 2
    Mu = wu * span_ft**2 / 8  # kip·ft
    Vu = wu * span_ft / 2  # kip
    lam_pf = 0.38 * math.sqrt(29000 / 50)  # Table B4.1b case 10
    lam_pw = 3.76 * math.sqrt(29000 / 50)  # Table B4.1b case 15
    rows = []
    for name in aisc_shape_names("W"):
        s = aisc_shape(name)
        bf, tf = s["bf"].to("in").magnitude, s["tf"].to("in").magnitude
        d, tw = s["d"].to("in").magnitude, s["tw"].to("in").magnitude
        kdes = s["kdes"].to("in").magnitude
        h_tw = (d - 2 * kdes) / tw
        if bf / (2 * tf) > lam_pf or h_tw > lam_pw or h_tw > 2.24 * math.sqrt(29000 / 50):
            continue  # noncompact or outside §G2.1(a): the search reports these as out of scope
        phiMp = 0.9 * 50 * s["Zx"].to("in**3").magnitude / 12
        phiVn = 1.0 * 0.6 * 50 * d * tw
        ok = phiMp >= Mu and phiVn >= Vu
        if live_limit is not None:
            L_in = span_ft * 12
            delta = 5 * (wl / 12) * L_in**4 / (384 * 29000 * s["Ix"].to("in**4").magnitude)
            ok = ok and delta <= L_in / live_limit
        if ok:
            rows.append((s["W"].to("lbf/ft").magnitude, d, name))
    return min(rows)[2]


@pytest.mark.parametrize(
    ("span", "wd", "wl", "limit"),
    [(20.0, 0.6, 1.0, None), (16.0, 1.2, 2.0, 360.0), (30.0, 0.4, 0.8, 360.0)],
)
def test_lightest_w_beam_equals_brute_force_by_closed_forms(span, wd, wl, limit) -> None:  # type: ignore[no-untyped-def]
    L, cases, strength = _simple(span, wd, wl)
    defl = [DeflectionLimit(cases["L"], L, limit)] if limit else []
    found = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, deflections=defl)
    assert found.best.name == _brute_force(span, wd, wl, limit)


def test_best_passes_every_check_and_next_lighter_fails_one() -> None:
    L, cases, strength = _simple(24.0, 0.8, 1.2)
    braces = [Q_(8, "ft"), Q_(16, "ft")]
    found = lightest_aisc_beam(
        strength, Fy=FY, braces=braces, deflections=[DeflectionLimit(cases["L"], L, 360)]
    )
    best = aisc_shape(found.best.name)
    full = check_aisc_beam(best.ishape(), Fy=FY, demand=strength, braces=braces)
    assert full.passed
    assert found.next_lighter is not None
    lighter = aisc_shape(found.next_lighter.name)
    assert lighter["W"] <= best["W"]
    # the screened or failing lighter shape fails when checked in full, flexure or deflection
    strength_ok = check_aisc_beam(lighter.ishape(), Fy=FY, demand=strength, braces=braces).passed
    factor = float((cases["L"].beam.EI / (E * lighter["Ix"])).to("").magnitude)
    defl_ok = check_deflection(
        member="B1", demand=cases["L"].scaled(factor), span=L, limit=360
    ).passed
    assert not (strength_ok and defl_ok)


def test_passing_candidates_are_ranked_by_weight_then_by_depth() -> None:
    _, _, strength = _simple(20.0, 0.5, 0.8)
    found = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, count=6)
    weights = [t.weight.to("lbf/ft").magnitude for t in found.passing]
    assert len(found.passing) == 6
    assert weights == sorted(weights)
    by_depth = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, order="depth", count=4)
    depths = [t.depth.to("in").magnitude for t in by_depth.passing]  # type: ignore[union-attr]
    assert depths == sorted(depths)


def test_depth_limit_and_nominal_depth_filter() -> None:
    _, _, strength = _simple(20.0, 0.5, 0.8)
    found = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, max_depth=Q_(10.5, "in"))
    assert all(t.depth <= Q_(10.5, "in") for t in found.tried)  # type: ignore[operator]
    twelves = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, nominal_depth=12)
    assert twelves.best.name.startswith("W12X")
    with pytest.raises(InputError, match="max_depth"):
        lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, max_depth=Q_(3, "in"))
    with pytest.raises(InputError, match="nominal depth 13"):
        aisc_candidates("W", nominal_depth=13)


def test_nothing_passes_names_the_closest() -> None:
    _, _, strength = _simple(40.0, 6.0, 8.0)
    found = lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True, nominal_depth=8)
    assert found.passing == ()
    assert found.closest is not None
    with pytest.raises(OutOfScopeError, match=r"No candidate passes.*closest is W8X"):
        _ = found.best


def test_spring_supported_beam_is_refused() -> None:
    L = Q_(20, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Spring(L, k=Q_(50, "kip/in"), name="B")],
        loads=[UniformLoad(w=Q_(1, "kip/ft"), case="D")],
        EI=E * Q_(300, "in**4"),
        name="B9",
    )
    strength = analyse_combinations(solve_cases(beam), asce7_strength())
    with pytest.raises(OutOfScopeError, match="spring"):
        lightest_aisc_beam(strength, Fy=FY, continuous_bracing=True)


def test_general_search_with_a_trial_of_ones_own_and_refusals_kept() -> None:
    """A timber-like search: the trial refuses one candidate; the refusal is kept, not offered."""
    from calcpack.checks.base import Recorder, Standard, run_checks

    std = Standard("test", "demand over capacity", "")

    def trial(cap: float):  # type: ignore[no-untyped-def]
        if cap == 3.0:
            raise OutOfScopeError("candidate three is outside the method")

        def logic(c: Recorder) -> None:
            d = c.given("D", Q_(2.5, "kN"), "demand", source="given")
            k = c.given("K", Q_(cap, "kN"), "capacity", source="given")
            c.check("Strength", d, k, ref="test", combination="1")

        return run_checks("M1", "trial", std, logic)

    cands = [Candidate(f"c{i}", Q_(float(i), "kN/m"), float(i)) for i in (5, 1, 3, 2, 4)]
    found = lightest_sections(cands, trial, count=2)
    assert [t.name for t in found.passing] == ["c4", "c5"]
    verdicts = [t.verdict for t in found.tried]
    assert verdicts == ["fails", "fails", "out of scope", "passes", "passes"]
    assert found.next_lighter is not None
    assert found.next_lighter.name == "c3"
    assert found.passing[0].utilisation == pytest.approx(2.5 / 4)
    with pytest.raises(InputError, match="count"):
        lightest_sections(cands, trial, count=0)
    with pytest.raises(InputError, match="order"):
        lightest_sections(cands, trial, order="price")  # type: ignore[arg-type]
    with pytest.raises(InputError, match="weight of bad"):
        Candidate("bad", Q_(-1.0, "kN/m"), 0.0)


def _joist_asd(span_ft: float):  # type: ignore[no-untyped-def]
    """Floor joists at 16 in centres: 10 psf dead, 40 psf live (the span tables' loading)."""
    from calcpack.combinations import asce7_allowable_stress

    L = Q_(span_ft, "ft")
    s = Q_(16, "inch")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[
            UniformLoad(w=(Q_(10, "psf") * s).to("lbf/ft"), case="D"),
            UniformLoad(w=(Q_(40, "psf") * s).to("lbf/ft"), case="L"),
        ],
        EI=Q_(1.6e6, "psi") * Q_(100, "in**4"),
        name="J1",
    )
    cases = solve_cases(beam)
    return L, cases, analyse_combinations(cases, asce7_allowable_stress())


@pytest.mark.parametrize(("span_ft", "expected"), [(9.5, "2x6"), (12.0, "2x8"), (15.5, "2x10")])
def test_lightest_joist_agrees_with_the_span_tables(span_ft: float, expected: str) -> None:
    """AWC "Span Tables for Joists and Rafters" (2018), floor joists, 40 psf live, 10 psf dead,
    L/360, Douglas Fir-Larch No.2 at 16 in: 2x6 9 ft 11 in, 2x8 13 ft 1 in, 2x10 16 ft 9 in
    (from memory). Spans are chosen with a margin from those limits."""
    from calcpack.checks import ServiceConditions
    from calcpack.sizing import lightest_nds_beam

    L, cases, asd = _joist_asd(span_ft)
    found = lightest_nds_beam(
        asd,
        species="Douglas Fir-Larch",
        grade="No.2",
        sizes=("2x4", "2x6", "2x8", "2x10", "2x12"),
        conditions=ServiceConditions(repetitive=True),
        deflections=[DeflectionLimit(cases["L"], L, 360)],
    )
    assert found.best.name == expected


def test_timber_search_refuses_bad_plies_and_hot_service() -> None:
    from calcpack.checks import ServiceConditions
    from calcpack.sizing import lightest_nds_beam

    _, _, asd = _joist_asd(10.0)
    with pytest.raises(InputError, match="plies"):
        lightest_nds_beam(asd, species="Douglas Fir-Larch", grade="No.2", plies=0)
    with pytest.raises(OutOfScopeError, match="100 °F"):
        lightest_nds_beam(
            asd,
            species="Douglas Fir-Larch",
            grade="No.2",
            conditions=ServiceConditions(temperature=Q_(130, "degF")),
        )
