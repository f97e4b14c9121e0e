"""US wide-flange shapes against their tabulated properties.

Source: American Institute of Steel Construction, *Steel Construction Manual*, 15th ed., 2017,
Table 1-1 "W-Shapes, Dimensions and Properties" (as printed, in inches; the values are those
of the AISC Shapes Database v15.0, read against it; Table 1-1 prints d = 9.98 in. for W10x49).
The shapes are built from the printed dimensions d, bf, tf, tw with the root fillet radius
taken as r = k_des - tf. Tolerance 0.5 %: the printed dimensions and properties are rounded to
three significant figures and the table's fillet geometry is a detailing idealisation.
Plates only (r = 0), the same shapes fall 1-1.6 % low, which the test also records.
"""

from __future__ import annotations

import pytest

from calcpack.sections import ISection
from calcpack.units import ureg

inch = ureg.inch

# name: (d, bf, tf, tw, k_des), {property: tabulated value in inch units}
SHAPES = {
    "W18x50": (
        (18.0, 7.50, 0.570, 0.355, 0.972),
        {"A": 14.7, "Ix": 800, "Sx": 88.9, "Zx": 101, "rx": 7.38, "Iy": 40.1, "Sy": 10.7,
         "Zy": 16.6, "ry": 1.65},
    ),
    "W10x49": (
        (9.98, 10.0, 0.560, 0.340, 1.06),
        {"A": 14.4, "Ix": 272, "Sx": 54.6, "Zx": 60.4, "rx": 4.35, "Iy": 93.4, "Sy": 18.7,
         "Zy": 28.3, "ry": 2.54},
    ),
}  # fmt: skip

POWER = {"A": 2, "Ix": 4, "Iy": 4, "Sx": 3, "Sy": 3, "Zx": 3, "Zy": 3, "rx": 1, "ry": 1}


def _shape(dims: tuple[float, ...], fillets: bool) -> ISection:
    d, bf, tf, tw, k_des = dims
    r = (k_des - tf) if fillets else 0.0
    return ISection(d=d * inch, bf=bf * inch, tf=tf * inch, tw=tw * inch, r=r * inch)


@pytest.mark.parametrize("name", sorted(SHAPES))
def test_w_shape_with_root_fillets_matches_table_1_1(name):
    dims, table = SHAPES[name]
    p = _shape(dims, fillets=True).properties()
    for key, printed in table.items():
        got = getattr(p, key).to(inch ** POWER[key]).magnitude
        # 0.5 %: three printed figures and idealised fillets (see module docstring)
        assert got == pytest.approx(printed, rel=0.005), f"{name} {key}"


@pytest.mark.parametrize("name", sorted(SHAPES))
def test_w_shape_plates_only_falls_low_by_the_fillet_area(name):
    dims, table = SHAPES[name]
    p = _shape(dims, fillets=False).properties()
    for key in ("A", "Ix", "Zx"):
        ratio = getattr(p, key).to(inch ** POWER[key]).magnitude / table[key]
        # plates only: 0.8-1.8 % low for these shapes (the four fillets are missing)
        assert 0.98 < ratio < 0.995, f"{name} {key}: {ratio:.4f}"


def test_w18x50_torsion_and_warping_constants():
    dims, _ = SHAPES["W18x50"]
    p = _shape(dims, fillets=True).properties()
    # Table 1-1 (AISC Shapes Database v15.0): J = 1.24 in⁴, Cw = 3040 in⁶
    J = p.J.to(inch**4).magnitude
    # Σ b t³/3 leaves out the fillets' contribution to J, so it errs low by a few per cent
    # (4.4 % here): the safe side for lateral-torsional buckling
    assert 0.93 * 1.24 < J < 1.24
    # Cw = Iy h0² / 4: 0.5 % for the rounding of the printed values
    assert p.Cw.to(inch**6).magnitude == pytest.approx(3040, rel=0.005)
