"""EN 1995-1-1 inputs, refusals and working."""

from __future__ import annotations

import pytest

from calcpack.checks.en1995 import (
    TimberForcesEC,
    TimberMemberEC,
    check_en1995_floor_vibration,
    check_en1995_member,
    k_mod,
    shortest_duration,
    strength_class,
)
from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_


def test_unknown_strength_class_is_refused_with_suggestions():
    with pytest.raises(InputError, match=r"'C25'.*did you mean"):
        TimberMemberEC("C25", Q_(47, "mm"), Q_(200, "mm"))


def test_service_class_3_not_covered_for_osb_is_refused():
    with pytest.raises(InputError, match=r"OSB/3 in service class 3.*not covered"):
        k_mod("OSB/3", 3, "short")


def test_service_class_3_solid_timber_is_covered():
    # EN 1995-1-1 Table 3.1: solid timber SC3 short-term 0.70 (from memory)
    assert k_mod("solid", 3, "short") == 0.70


def test_shortest_duration_governs():
    assert shortest_duration(["permanent", "medium", "short"]) == "short"
    with pytest.raises(InputError, match="'weekly'"):
        shortest_duration(["weekly"])


def test_glulam_values():
    g = strength_class("GL28h")
    assert g.product == "glulam"
    assert g.fm_k.to("MPa").magnitude == 28


def test_tension_is_refused_naming_n_ed():
    with pytest.raises(InputError, match="N_Ed"):
        TimberForcesEC(N_Ed=Q_(-5, "kN"))


def test_bearing_needs_its_length():
    with pytest.raises(InputError, match="bearing_length"):
        TimberForcesEC(F_c90_Ed=Q_(5, "kN"))


def test_low_frequency_floor_is_refused():
    j = TimberMemberEC("C16", Q_(47, "mm"), Q_(150, "mm"))
    with pytest.raises(OutOfScopeError, match="8 Hz"):
        check_en1995_floor_vibration(j, span=Q_(5, "m"), spacing=Q_(600, "mm"),
                                     floor_width=Q_(4, "m"), mass=Q_(60, "kg/m**2"),
                                     deck_EI=Q_(1500, "N*m**2/m"))  # fmt: skip


def test_floor_vibration_passes_a_stiff_floor_and_shows_working():
    j = TimberMemberEC("C24", Q_(47, "mm"), Q_(220, "mm"), 1, load_sharing=True)
    r = check_en1995_floor_vibration(j, span=Q_(3.6, "m"), spacing=Q_(400, "mm"),
                                     floor_width=Q_(4, "m"), mass=Q_(40, "kg/m**2"),
                                     deck_EI=Q_(1500, "N*m**2/m"))  # fmt: skip
    assert r.values["f_1"].to("Hz").magnitude > 8
    assert r.passed
    assert len(r.working()) > 10


def test_beam_column_working_builds():
    m = TimberMemberEC("GL28h", Q_(90, "mm"), Q_(315, "mm"), 2, L_ef_LT=Q_(4, "m"),
                       L_ef_y=Q_(4, "m"), L_ef_z=Q_(2, "m"))  # fmt: skip
    r = check_en1995_member(m, TimberForcesEC("ULS", "short", M_Ed=Q_(20, "kN*m"),
                                            V_Ed=Q_(10, "kN"), N_Ed=Q_(50, "kN")))  # fmt: skip
    names = [x.name for x in r.results]
    assert "Lateral torsional stability with compression (6.35)" in names
    assert len(r.working()) > 20


def test_combination_duration_is_the_shortest_acting():
    from calcpack.checks.en1995 import combination_duration
    from calcpack.combinations import annex_combinations, en1990_annex

    uls = annex_combinations(en1990_annex("UK"), variable={"Q": "A", "S": "snow_up_to_1000m"})
    durations = {"G": "permanent", "Q": "medium", "S": "short"}
    # 6.10a carries ψ0 S: snow (short-term) is the shortest action in it
    assert combination_duration(uls["6.10a"].factors, durations) == "short"
    assert combination_duration({"G": 1.35, "Q": 0.0}, durations) == "permanent"
    with pytest.raises(InputError, match=r"'S'"):
        combination_duration(uls["6.10a"].factors, {"G": "permanent", "Q": "medium"})
