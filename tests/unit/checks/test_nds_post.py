"""A post under every ASD combination of its loads by case: the governing combination, C_D
of its shortest-duration load (NDS 2018 §2.3.2, Table 2.3.2: permanent 0.9, ten years 1.0,
ten minutes 1.6), the combinations of ASCE/SEI 7-16 §2.4.1 as printed; compression capacity by
NDS 2018 Eq. (3.7-1) worked by hand. Table 4D values and wet service factors from memory."""

from __future__ import annotations

import math
from dataclasses import replace

import pytest

from calcpack.checks.nds.members import TimberForces, TimberMember, check_nds_member
from calcpack.checks.nds.posts import check_nds_post
from calcpack.checks.nds.values import nds_sawn_values
from calcpack.combinations import asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.units import Q_

P_T1 = nds_sawn_values("Douglas Fir-Larch", "P&T No.1", table="4D")


def _post():
    return TimberMember(P_T1, b=Q_(5.5, "inch"), d=Q_(5.5, "inch"), le_d=Q_(8, "ft"),
                        le_b=Q_(8, "ft"), wet=True)  # fmt: skip


def _cp(FcE, Fcs, c=0.8):
    a = FcE / Fcs
    h = (1 + a) / (2 * c)
    return h - math.sqrt(h * h - a / c)


def test_gravity_post_governed_by_d_plus_l_by_hand():
    r = check_nds_post(_post(), {"D": Q_(1000, "lbf"), "L": Q_(3000, "lbf")},
                       asce7_allowable_stress(), mark="post B")  # fmt: skip
    c = r["Compression"]
    assert c.combination.startswith("2")
    # D + L: C_D = 1.0 (ten years), C_M = 0.91 (Table 4D wet): F*_c = 910 psi
    FcE = 0.822 * 580_000 / (96 / 5.5) ** 2
    assert c.capacity.to("psi").magnitude == pytest.approx(910 * _cp(FcE, 910), rel=1e-9)
    assert c.demand.to("psi").magnitude == pytest.approx(4000 / 5.5**2, rel=1e-9)
    assert r.values["C_D"] == pytest.approx(1.0)


def test_wind_moment_governs_with_cd_16():
    r = check_nds_post(_post(), {"D": Q_(100, "lbf")}, asce7_allowable_stress(),
                       moments={"W": Q_(2000, "lbf*ft")}, mark="post A")  # fmt: skip
    gov = max(r.results, key=lambda x: x.utilisation or 0.0)
    assert "W" in gov.combination
    # D + 0.6W (combination 5) puts P = 100 lbf and M = 0.6·2000 lbf·ft on the post, with
    # C_D = 1.6 (ten minutes): the same member checked alone for those forces agrees
    alone = check_nds_member(
        replace(_post(), duration="ten minutes"),
        TimberForces(P=Q_(100, "lbf"), M_d=Q_(1200, "lbf*ft")),
    )
    assert r["Compression and bending"].combination.startswith("5")
    assert r["Compression and bending"].utilisation == pytest.approx(
        alone["Compression and bending"].utilisation, rel=1e-12
    )


def test_working_lists_every_combination():
    r = check_nds_post(_post(), {"D": Q_(1000, "lbf"), "L": Q_(3000, "lbf")},
                       asce7_allowable_stress(), mark="post B")  # fmt: skip
    tables = [s for s in r.working() if type(s).__name__ == "Table"]
    assert tables
    names = [row[0] for row in tables[0].rows]
    assert any(n.startswith("1") for n in names)
    assert any(n.startswith("2") for n in names)


def test_bad_inputs_name_themselves():
    with pytest.raises(InputError) as e:
        check_nds_post(_post(), {}, asce7_allowable_stress())
    assert e.value.name == "axial"
    with pytest.raises(InputError) as e:
        check_nds_post(_post(), {"D": Q_(1, "psi")}, asce7_allowable_stress())
    assert "axial" in e.value.name
    with pytest.raises(InputError) as e:
        check_nds_post(_post(), {"D": Q_(1, "lbf")}, asce7_allowable_stress(),
                       durations={"L": "ten years"})  # fmt: skip
    assert e.value.name == "durations"


def test_each_check_is_reported_once_under_its_own_governing_combination():
    # gravity governs compression; only the wind combinations bend the post
    r = check_nds_post(_post(), {"D": Q_(1000, "lbf"), "L": Q_(3000, "lbf")},
                       asce7_allowable_stress(), moments={"W": Q_(50, "lbf*ft")},
                       mark="post B")  # fmt: skip
    names = [x.name for x in r.results]
    assert len(names) == len(set(names))
    assert r["Compression"].combination.startswith("2")
    assert "W" in r["Compression and bending"].combination
    steps = r.working()
    checks = [s for s in steps if type(s).__name__ == "Check"]
    assert len(checks) == len(r.results)
