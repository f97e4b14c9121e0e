"""ACI 318-19 Chapter 17 anchors: refusals name the input and the limit; the working shows the
numbers the check computes; NOT OK is a result, not an error."""

from __future__ import annotations

from typing import Any

import pytest

from calcpack.checks.aci318 import AnchorGroup, AnchorLoads, anchor_steel, check_aci_anchors
from calcpack.checks.base import NOT_OK
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_

IN = "inch"


def group(**kw: Any) -> AnchorGroup:
    args: dict[str, Any] = {
        "kind": "headed bolt", "d_a": Q_(0.75, IN), "h_ef": Q_(8, IN),
        "grade": "F1554 Gr. 36", "f_c": Q_(4000, "psi"), "h_a": Q_(12, IN),
        "A_brg": Q_(0.654, "inch**2"),
    }  # fmt: skip
    args.update(kw)
    return AnchorGroup(**args)


@pytest.mark.parametrize(
    ("kw", "name", "words"),
    [
        ({"h_ef": Q_(26, IN), "h_a": Q_(30, IN)}, "h_ef", "25 in"),
        ({"h_ef": Q_(12, IN)}, "h_ef", "inside the member"),
        ({"d_a": Q_(4.5, IN)}, "d_a", "4 in"),
        ({"f_c": Q_(2000, "psi")}, "f_c", "2500 psi"),
        ({"edges": {"+x": Q_(3, IN)}, "torqued": True}, "edges[+x]", "6 d_a"),
        ({"edges": {"+x": Q_(1.5, IN)}, "cover": Q_(2, IN)}, "edges[+x]", "cover"),
        ({"nx": 2, "s_x": Q_(2, IN)}, "s_x", "§17.9.2"),
        ({"nx": 2}, "s_x", "required"),
        ({"A_brg": None}, "A_brg", "headed bolt"),
        ({"kind": "hooked bolt", "e_h": Q_(1.5, IN)}, "e_h", "3 d_a"),
        ({"kind": "hooked bolt"}, "e_h", "hooked"),
        ({"edges": {"+z": Q_(6, IN)}}, "edges", "'+x'"),
        ({"grade": "F1554 Gr 36x"}, "grade", "did you mean"),
        ({"kind": "adhesive"}, "kind", "headed stud"),
        ({"A_se": Q_(1.0, "inch**2")}, "A_se", "shank"),
        ({"d_a": Q_(0.7, IN)}, "d_a", "UNC"),
    ],
)
def test_group_refuses_outside_the_chapter_naming_the_input(
    kw: dict[str, Any], name: str, words: str
) -> None:
    with pytest.raises(InputError) as err:
        group(**kw)
    assert err.value.name == name
    assert words in str(err.value)


def test_seismic_anchors_are_refused_naming_the_clause() -> None:
    with pytest.raises(OutOfScopeError, match=r"§17\.10"):
        group(seismic=True)


@pytest.mark.parametrize(
    ("kw", "name"),
    [
        ({"N": Q_(0, "lbf"), "V": Q_(0, "lbf")}, "N"),
        ({"V": Q_(1, "kip")}, "toward"),
        ({"V": Q_(1, "kip"), "toward": "north"}, "toward"),
        ({"N": Q_(1, "kip"), "e_N": Q_(2, IN)}, "N_max"),
        ({"V": Q_(1, "kip"), "toward": "+x", "e_V": Q_(2, IN)}, "V_max"),
        ({"N": Q_(1, "kip"), "N_max": Q_(2, "kip")}, "N_max"),
        ({"N": Q_(-1, "kip")}, "N"),
        ({"N": Q_(1, "m")}, "N"),
    ],
)
def test_loads_refuse_what_is_missing_or_wrong(kw: dict[str, Any], name: str) -> None:
    with pytest.raises(InputError) as err:
        AnchorLoads(**kw)
    assert err.value.name == name


def test_anchor_steel_table_rows_carry_their_source() -> None:
    st = anchor_steel("F1554 Gr. 55")
    assert st.f_ya == Q_(55, "ksi")
    assert st.f_uta == Q_(75, "ksi")
    assert st.ductile
    assert "F1554" in st.source
    assert "from memory" in st.source


def test_a_failing_anchor_is_a_result_not_an_error() -> None:
    r = check_aci_anchors(group(), AnchorLoads(N=Q_(60, "kip")))
    assert r["Steel strength in tension"].verdict == NOT_OK
    assert not r.passed


def test_working_shows_the_numbers_the_check_computes() -> None:
    """Every check in the working equals the numeric run (one logic, two recorders)."""
    g = group(nx=2, ny=2, s_x=Q_(6, IN), s_y=Q_(4, IN),
              edges={"+x": Q_(5, IN), "-y": Q_(4, IN), "+y": Q_(30, IN)})  # fmt: skip
    r = check_aci_anchors(g, AnchorLoads(N=Q_(8, "kip"), V=Q_(4, "kip"), toward="+x"))
    steps = r.working()
    shown = {s.name: s for s in steps if type(s).__name__ == "Check"}
    assert set(shown) == {res.name for res in r.results}
    for res in r.results:
        step = shown[res.name]
        assert step.record().utilisation == pytest.approx(res.utilisation, rel=1e-9)
    text = "\n".join(s.text() for s in steps)
    assert "ACI 318-19 Eq. (17.6.2.1b)" in text
    assert "Side-face blowout" not in text  # h_ef = 8 in. ≤ 2.5 c_a1 everywhere


def test_shear_away_from_every_edge_has_no_breakout_towards_an_edge() -> None:
    r = check_aci_anchors(group(edges={"-x": Q_(6, IN)}), AnchorLoads(V=Q_(2, "kip"),
                          toward="+x"))  # fmt: skip
    names = [res.name for res in r.results]
    assert names == ["Steel strength in shear", "Pryout"]
