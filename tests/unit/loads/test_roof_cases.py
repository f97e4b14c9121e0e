"""Derived snow and wind cases reach members by case, and the combinations in calcpack apply to
them through ``groups=`` (one combination per snow arrangement and per wind case)."""

from __future__ import annotations

import pytest

from calcpack.analysis.truss_model import Truss
from calcpack.analysis.truss_solve import solve_truss_cases
from calcpack.combinations.asce7 import asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.loads.roof_cases import RoofProfile, case_groups, line_loads, truss_joint_loads
from calcpack.loads.roof_profiles import (
    snow_profiles_asce7,
    snow_profiles_en,
    wind_profiles_asce7,
    wind_profiles_en,
)
from calcpack.loads.snow_asce7 import SnowRoofASCE7, SnowSiteASCE7, roof_snow_asce7
from calcpack.loads.snow_en1991 import SnowRoofEN, SnowSiteEN, roof_snow_en
from calcpack.loads.wind_asce7 import WindSiteASCE7
from calcpack.loads.wind_asce7_lowrise import LowRiseBuildingASCE7, envelope_wind_asce7
from calcpack.loads.wind_en1991 import WindSiteEN
from calcpack.loads.wind_en1991_cpe import BuildingEN, wind_pressures_en
from calcpack.units import Q_

FT = "ft"


def _truss_nodes():
    nodes = {f"L{i}": (Q_(4 * i, FT), Q_(0, FT)) for i in range(7)}
    nodes |= {f"U{i}": (Q_(4 * i, FT), Q_(2 * min(i, 6 - i), FT)) for i in range(1, 6)}
    members = (
        [(f"L{i}", f"L{i + 1}") for i in range(6)]
        + [("L0", "U1"), ("U1", "U2"), ("U2", "U3"), ("U3", "U4"), ("U4", "U5"), ("U5", "L6")]
        + [(f"L{i}", f"U{i}") for i in range(1, 6)]
        + [("U1", "L2"), ("U2", "L3"), ("L3", "U4"), ("L4", "U5")]
    )
    chord = [("L0", nodes["L0"])] + [(f"U{i}", nodes[f"U{i}"]) for i in range(1, 6)]
    chord += [("L6", nodes["L6"])]
    return nodes, members, chord


def test_asce7_snow_and_wind_cases_on_a_truss_with_combinations():
    """A 24 ft 6:12 gable truss: balanced and unbalanced snow, envelope case A wind from both
    sides with ±GCpi; ASCE 7-16 §2.4.1 combinations repeat per alternative via groups=."""
    site = SnowSiteASCE7(pg=Q_(30, "psf"), pg_source="ASCE 7-16 Figure 7.2-1")
    roof = SnowRoofASCE7("gable", Q_(26.57, "deg"), Q_(12, FT))
    snow = snow_profiles_asce7(roof_snow_asce7(site, roof), roof)
    assert [p.case for p in snow] == ["S balanced", "S unbalanced from L", "S unbalanced from R"]
    bld = LowRiseBuildingASCE7(Q_(12, FT), Q_(24, FT), Q_(40, FT), Q_(26.57, "deg"))
    env = envelope_wind_asce7(WindSiteASCE7(Q_(115, "mph"), "ASCE 7-16 Figure 26.5-1B"), bld)
    wind = wind_profiles_asce7(env, bld)
    assert len(wind) == 4
    nodes, members, chord = _truss_nodes()
    loads = [jl for p in snow + wind for jl in truss_joint_loads(p, chord, Q_(4, FT))]
    loads += [jl for i in range(1, 6) for jl in [*_dead(f"U{i}")]]
    truss = Truss.build(
        nodes=nodes, members=members, supports={"L0": "pin", "L6": "roller"}, loads=loads, name="T1"
    )
    cases = solve_truss_cases(truss)
    groups = case_groups(snow + wind)
    applied = asce7_allowable_stress().apply(cases.keys(), groups=groups)
    names = [a.expression for a in applied]
    assert any("S unbalanced from L" in n for n in names)
    assert any("W case A 2/3 +GCpi from R" in n for n in names)


def _dead(node):
    from calcpack.analysis.truss_model import JointLoad

    return [JointLoad(node, Fy=Q_(-400, "lbf"), case="D")]


def test_en_snow_and_wind_profiles():
    snow = roof_snow_en(
        SnowSiteEN(altitude=Q_(150, "m"), zone=2), SnowRoofEN("duopitch", Q_(30, "deg"))
    )
    ps = snow_profiles_en(snow, Q_(8, "m"))
    assert [p.case for p in ps] == ["S (i)", "S (ii)", "S (iii)"]
    v = [x.to("kN/m^2").magnitude for x in ps[1].values]
    assert v[0] == pytest.approx(0.5 * v[1])
    site = WindSiteEN(Q_(24, "m/s"), "map", annex="recommended", terrain="III")
    b = BuildingEN("duopitch", Q_(30, "deg"), Q_(5, "m"), Q_(20, "m"), Q_(8, "m"))
    w0 = wind_pressures_en(site, b, theta=0, area=Q_(5, "m^2"))
    prof = wind_profiles_en(w0, b)
    assert len(prof) == len(w0.roof_cases) * 2 * 2  # cases × c_pi × wind from L and R
    first = prof[0]
    # G within e/10 of the windward eave, H to the ridge, J within e/10 beyond, I beyond
    assert first.note == "zones G/H/J/I"
    assert first.breaks[1].to("m").magnitude == pytest.approx(w0.e.to("m").magnitude / 10)
    w90 = wind_pressures_en(site, b, theta=90, area=Q_(5, "m^2"))
    interior = wind_profiles_en(w90, b)
    assert all(p.note == "zones I" for p in interior)
    near = wind_profiles_en(w90, b, frame=Q_(0.5, "m"))
    assert near[0].note == "zones F/G/F"


def test_line_loads_keep_case_and_tributary_width():
    p = RoofProfile("S (i)", "S", "plan", (Q_(0, "m"), Q_(3, "m")), (Q_(0.6, "kN/m^2"),))
    (u,) = line_loads(p, Q_(0.6, "m"))
    assert u.case == "S (i)"
    assert u.w.to("kN/m").magnitude == pytest.approx(0.36)


def test_bad_profiles_and_chords_are_refused():
    with pytest.raises(InputError, match="breaks"):
        RoofProfile("S", "S", "plan", (Q_(0, "m"),), (Q_(1, "kN/m^2"),))
    with pytest.raises(InputError, match="values"):
        RoofProfile("S", "S", "plan", (Q_(0, "m"), Q_(1, "m")), (Q_(1, "kN/m"),))
    with pytest.raises(InputError, match="kind"):
        RoofProfile("S", "S", "sideways", (Q_(0, "m"), Q_(1, "m")), (Q_(1, "kN/m^2"),))  # type: ignore[arg-type]
    p = RoofProfile("S", "S", "plan", (Q_(0, "m"), Q_(2, "m")), (Q_(1, "kN/m^2"),))
    back = [("A", (Q_(1, "m"), Q_(0, "m"))), ("B", (Q_(0, "m"), Q_(1, "m")))]
    with pytest.raises(InputError, match="left to right"):
        truss_joint_loads(p, back, Q_(1, "m"))
    with pytest.raises(InputError, match="spacing"):
        line_loads(p, Q_(-1, "m"))
    with pytest.raises(InputError, match="twice"):
        case_groups([p, p])
