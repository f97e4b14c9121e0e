"""Members sized from an inputs-file table: the table's section checked with the search's own
trial, the search's answer against closed forms worked here, and the pick's file edits.

References outside calcpack:
* AISC Design Examples v15.1, Example F.1-1A (published-values reference): W18x50, ASTM A992,
  35 ft simple span, continuously braced, w_D = 0.45 kip/ft, w_L = 0.75 kip/ft:
  M_u = 266 kip·ft, φ_b·M_n = 379 kip·ft.
* NDS Supplement 2018 Table 4A, Douglas Fir-Larch No.2 (published-values reference): F_b = 900,
  F_v = 180 psi, E = 1,600,000 psi; Table 4A size factors for F_b (from memory): 2" and 3"
  thick, widths 4, 6, 8, 10, 12 in: 1.5, 1.3, 1.2, 1.1, 1.0; 4" thick: 1.5, 1.3, 1.3, 1.2, 1.1.
  NDS 2018 Eq. (3.3-2) f_b = M/S, Eq. (3.4-2) f_v = 3V/(2bd); Table 2.3.2 C_D = 1.0 (ten years).
* Simple span under uniform load: M = wL²/8, V = wL/2, Δ = 5wL⁴/(384EI) (AISC Manual Table 3-23
  case 1).
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks.nds.members import TimberForces
from calcpack.combinations import analyse_combinations, asce7_allowable_stress, asce7_strength
from calcpack.errors import InputError
from calcpack.inputs.beam_member import (
    BeamDemand,
    beam_member_inputs,
    beam_pick_changes,
    evaluate_beam_member,
    lightest_beam_member,
)
from calcpack.inputs.timber_post import (
    PostLoad,
    evaluate_timber_post,
    lightest_timber_post,
    post_pick_changes,
    timber_post_inputs,
)
from calcpack.sizing import DeflectionLimit
from calcpack.units import Q_


def _analysis(span_ft: float, wd: str, wl: str, EI):  # type: ignore[no-untyped-def]
    L = Q_(span_ft, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[UniformLoad_(wd, "D"), UniformLoad_(wl, "L")],
        EI=EI,
        name="B1",
    )
    return L, solve_cases(beam)


def UniformLoad_(w: str, case: str):  # type: ignore[no-untyped-def]
    from calcpack.loads.types import UniformLoad

    return UniformLoad(w=Q_(w), case=case)


def test_steel_member_matches_design_example_f1_1a_and_its_search_is_lightest_first() -> None:
    _, cases = _analysis(35.0, "0.45 kip/ft", "0.75 kip/ft", Q_(29000, "ksi") * Q_(800, "in**4"))
    demand = BeamDemand(analyse_combinations(cases, asce7_strength()), continuous_bracing=True)
    data = {"beam": {"material": "steel", "section": "W18X50", "Fy": Q_(50, "ksi")}}
    case = beam_member_inputs(data, demand, table="beam")
    out = evaluate_beam_member(case)
    flexure = next(
        r
        for mc in out.checks
        for r in mc.results
        if "§F2" in r.clause
        and r.utilisation is not None
        and r.combination
        and "1.6L" in r.combination
    )
    # Example F.1-1A: M_u / φ_b M_n = 266 / 379 (published values to 3 figures: 0.5 %)
    assert flexure.utilisation == pytest.approx(266 / 379, rel=5e-3)
    found = lightest_beam_member(case, count=3)
    best = found.best
    # the best passes every check when put back in the table and checked as the sheet does
    picked = {"beam": {**data["beam"], "section": best.name}}
    assert evaluate_beam_member(beam_member_inputs(picked, demand, table="beam")).passed
    assert found.next_lighter is not None
    assert found.next_lighter.verdict == "fails"
    weights = [t.weight.to("lbf/ft").magnitude for t in found.tried]
    assert weights == sorted(weights)  # tried lightest first
    assert best.weight.to("lbf/ft").magnitude <= 50.0


def _sawn_brute_force(span_ft: float, wd: float, wl: float) -> str:
    """Lightest single DF-L No.2 joist (braced, not repetitive) by the closed forms."""
    cf = {
        (False, 4): 1.5,
        (False, 6): 1.3,
        (False, 8): 1.2,
        (False, 10): 1.1,
        (False, 12): 1.0,
        (True, 4): 1.5,
        (True, 6): 1.3,
        (True, 8): 1.3,
        (True, 10): 1.2,
        (True, 12): 1.1,
    }
    w = (wd + wl) / 12  # lbf/in, D + L governs with C_D = 1.0
    Lin = span_ft * 12
    best: tuple[float, float, str] | None = None
    for t in (2, 3, 4):
        for n in (4, 6, 8, 10, 12):
            b, d = t - 0.5, n - (0.5 if n <= 6 else 0.75)
            ok_b = w * Lin**2 / 8 / (b * d * d / 6) <= 900 * cf[(t == 4, n)]
            ok_v = 1.5 * (w * Lin / 2) / (b * d) <= 180  # full end shear: conservative
            defl = 5 * (wl / 12) * Lin**4 / (384 * 1.6e6 * b * d**3 / 12)
            if ok_b and ok_v and defl <= Lin / 360 and (best is None or (b * d, d) < best[:2]):
                best = (b * d, d, f"{t}x{n}")
    assert best is not None
    return best[2]


@pytest.mark.parametrize(("span_ft", "wd", "wl"), [(14.0, 40.0, 120.0), (10.0, 30.0, 90.0)])
def test_sawn_member_search_matches_the_closed_forms(span_ft: float, wd: float, wl: float) -> None:
    L, cases = _analysis(
        span_ft, f"{wd} lbf/ft", f"{wl} lbf/ft", Q_(1.6e6, "psi") * Q_(100, "in**4")
    )
    demand = BeamDemand(
        analyse_combinations(cases, asce7_allowable_stress()),
        deflections=[DeflectionLimit(cases["L"], L, 360)],
    )
    data = {
        "joist": {
            "material": "sawn",
            "species": "Douglas Fir-Larch",
            "grade": "No.2",
            "size": "2x6",
        }
    }
    case = beam_member_inputs(data, demand, table="joist")
    found = lightest_beam_member(case)
    assert found.best.name == _sawn_brute_force(span_ft, wd, wl)
    assert beam_pick_changes(case, found.best.name) == {"joist.size": found.best.name}
    picked = {"joist": {**data["joist"], "size": found.best.name}}
    assert evaluate_beam_member(beam_member_inputs(picked, demand, table="joist")).passed
    nxt = found.next_lighter
    assert nxt is not None
    lighter = {"joist": {**data["joist"], "size": nxt.name}}
    assert not evaluate_beam_member(beam_member_inputs(lighter, demand, table="joist")).passed


def test_glulam_member_pick_writes_width_and_depth_and_depth_ranking() -> None:
    L, cases = _analysis(20.0, "150 lbf/ft", "400 lbf/ft", Q_(1.8e6, "psi") * Q_(1000, "in**4"))
    demand = BeamDemand(
        analyse_combinations(cases, asce7_allowable_stress()),
        deflections=[DeflectionLimit(cases["L"], L, 360)],
    )
    data = {
        "GB1": {
            "material": "glulam",
            "stress_class": "24F-1.8E",
            "width": Q_(3.125, "inch"),
            "depth": Q_(9, "inch"),
        }
    }
    case = beam_member_inputs(data, demand, table="GB1")
    assert not evaluate_beam_member(case).passed  # 3-1/8 x 9 is far too small for 20 ft
    found = lightest_beam_member(case, order="depth")
    depths = [t.depth.to("inch").magnitude for t in found.passing]
    assert depths == sorted(depths)
    changes = beam_pick_changes(case, found.passing[0].name)
    assert set(changes) == {"GB1.width", "GB1.depth"}
    picked = {"GB1": {**data["GB1"], **{k.split(".")[1]: v for k, v in changes.items()}}}
    out = evaluate_beam_member(beam_member_inputs(picked, demand, table="GB1"))
    assert out.passed
    assert out.section == found.passing[0].name
    with pytest.raises(InputError, match="max_depth"):
        lightest_beam_member(case, max_depth=Q_(4, "inch"))  # no glulam that shallow


def test_steel_table_properties_must_be_the_sections_and_a_pick_rewrites_them() -> None:
    _, cases = _analysis(16.0, "0.3 kip/ft", "0.5 kip/ft", Q_(29000, "ksi") * Q_(61.9, "in**4"))
    demand = BeamDemand(analyse_combinations(cases, asce7_strength()), continuous_bracing=True)
    # AISC Shapes Database v15.0 W8x18 (published-values reference): t_f = 0.330 in, I_x = 61.9
    table = {
        "material": "steel",
        "section": "W8X18",
        "Fy": Q_(50, "ksi"),
        "tf": Q_(0.330, "inch"),
        "Ix": Q_(61.9, "inch**4"),
        "source": "Manual",
    }
    case = beam_member_inputs({"beam": table}, demand, table="beam")
    changes = beam_pick_changes(case, "W10X12")
    assert changes["beam.section"] == "W10X12"
    assert set(changes) == {"beam.section", "beam.tf", "beam.Ix", "beam.source"}
    stale = {"beam": {**table, "section": "W10X12"}}  # designation changed by hand only
    with pytest.raises(InputError, match=r"beam\.tf") as err:
        beam_member_inputs(stale, demand, table="beam")
    assert err.value.name == "beam.tf"
    with pytest.raises(InputError, match=r"beam\.section"):
        beam_member_inputs({"beam": {**table, "section": "HSS4X4X1/4"}}, demand, table="beam")
    with pytest.raises(InputError, match=r"beam\.material"):
        beam_member_inputs({"beam": {**table, "material": "iron"}}, demand, table="beam")


def _post_table(**extra: object) -> dict[str, object]:
    return {
        "post": {
            "size": "6x6",
            "species": "Douglas Fir-Larch",
            "grade": "P&T No.1",
            "le": Q_(12, "ft"),
            **extra,
        }
    }


def test_post_from_a_table_is_checked_as_the_search_checks_it() -> None:
    loads = [
        PostLoad("P1", TimberForces(P=Q_(9, "kip"), combination="D + L"), "ten years"),
        PostLoad("P2", TimberForces(P=Q_(7, "kip"), combination="D + S"), "two months"),
    ]
    case = timber_post_inputs(_post_table(b=Q_(5.5, "inch"), d=Q_(5.5, "inch")), loads=loads)
    assert case.table == "4D"  # 6 in thick: a timber
    out = evaluate_timber_post(case)
    assert [mc.member for mc in out.checks] == ["P1", "P2"]
    found = lightest_timber_post(case)
    best = next(t for t in found.tried if t.name == out.section)
    assert best.utilisation == pytest.approx(out.governing[0])
    changes = post_pick_changes(case, "8x8")
    assert changes == {"post.size": "8x8", "post.b": Q_(7.5, "inch"), "post.d": Q_(7.5, "inch")}
    with pytest.raises(InputError, match=r"post\.b") as err:
        timber_post_inputs(_post_table(b=Q_(5.0, "inch")), loads=loads)
    assert err.value.name == "post.b"


def test_post_forces_from_the_file_and_bad_entries_name_their_key() -> None:
    rows = [{"combination": "D + L", "P": Q_(4, "kip"), "duration": "ten years"}]
    data = {
        "post": {"size": "4x4", "species": "Douglas Fir-Larch", "grade": "No.2", "le": Q_(8, "ft")},
        "forces": rows,
    }
    case = timber_post_inputs(data)
    assert case.table == "4A"
    assert lightest_timber_post(case).best.name in ("4x4", "4x6", "4x8")
    bad = {**data, "forces": [{**rows[0], "duration": "forever"}]}
    with pytest.raises(InputError, match=r"forces\[1\]\.duration"):
        timber_post_inputs(bad)
    with pytest.raises(InputError, match=r"post\.grade"):
        timber_post_inputs({**data, "post": {**data["post"], "grade": "No.9"}})
    with pytest.raises(InputError, match=r"post\.size"):
        timber_post_inputs({**data, "post": {**data["post"], "size": "four by four"}})


def test_timber_member_tables_name_the_bad_key() -> None:
    _, cases = _analysis(12.0, "40 lbf/ft", "100 lbf/ft", Q_(1.6e6, "psi") * Q_(100, "in**4"))
    demand = BeamDemand(analyse_combinations(cases, asce7_allowable_stress()))
    sawn = {"material": "sawn", "species": "Douglas Fir-Larch", "grade": "No.2", "size": "2x8"}
    for bad, key in (
        ({"grade": "No.7"}, "j.grade"),
        ({"size": "2x7"}, "j.size"),
        ({"plies": 1.5}, "j.plies"),
        ({"colour": "red"}, "colour"),
    ):
        with pytest.raises(InputError, match=key.replace(".", r"\.")):
            beam_member_inputs({"j": {**sawn, **bad}}, demand, table="j")
    glulam = {
        "material": "glulam",
        "stress_class": "99F-9E",
        "width": Q_(5.125, "inch"),
        "depth": Q_(12, "inch"),
    }
    with pytest.raises(InputError, match=r"g\.stress_class"):
        beam_member_inputs({"g": glulam}, demand, table="g")
    with pytest.raises(InputError, match=r"g\.depth"):
        beam_member_inputs(
            {"g": {**glulam, "stress_class": "24F-1.8E", "depth": Q_(-1, "inch")}},
            demand,
            table="g",
        )
