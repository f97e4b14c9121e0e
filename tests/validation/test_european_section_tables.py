"""European I and H sections against a producer's published section tables.

Source: ArcelorMittal Europe - Long Products, *Sales programme: Sections and merchant bars*
(section tables for IPE and HE sections, dimensions to EN 10365:2017), values from memory, as
printed, in cm units. IPE 300: h = 300, b = 150, tw = 7.1, tf = 10.7, r = 15 mm;
HE 300 B: h = 300, b = 300, tw = 11, tf = 19, r = 27 mm.

Tolerance 0.5 % (three or four printed figures). With the root radius these sections match to
0.2 %; plates only they fall 3.5-4.5 % low because the root radii are large -- recorded below.
"""

from __future__ import annotations

import pytest

from calcpack.sections import ISection
from calcpack.units import ureg

mm, cm = ureg.mm, ureg.cm

SHAPES = {
    "IPE 300": (
        (300, 150, 10.7, 7.1, 15),
        {"A": 53.8, "Ix": 8356, "Sx": 557, "Zx": 628, "rx": 12.46, "Iy": 604, "Sy": 80.5,
         "Zy": 125, "ry": 3.35, "Cw": 125.9e3},
    ),
    "HE 300 B": (
        (300, 300, 19, 11, 27),
        {"A": 149.1, "Ix": 25170, "Sx": 1678, "Zx": 1869, "rx": 12.99, "Iy": 8563,
         "Sy": 570.9, "Zy": 870.1, "ry": 7.58, "Cw": 1688e3},
    ),
}  # fmt: skip

POWER = {"A": 2, "Ix": 4, "Iy": 4, "Sx": 3, "Sy": 3, "Zx": 3, "Zy": 3, "rx": 1, "ry": 1, "Cw": 6}


def _shape(dims: tuple[float, ...], fillets: bool) -> ISection:
    h, b, tf, tw, r = dims
    return ISection(d=h * mm, bf=b * mm, tf=tf * mm, tw=tw * mm, r=(r if fillets else 0) * mm)


@pytest.mark.parametrize("name", sorted(SHAPES))
def test_section_with_root_radius_matches_the_table(name):
    dims, table = SHAPES[name]
    p = _shape(dims, fillets=True).properties()
    for key, printed in table.items():
        got = getattr(p, key).to(cm ** POWER[key]).magnitude
        # 0.5 %: printed figures (module docstring); Cw = Iy h0²/4 as the tables compute it
        assert got == pytest.approx(printed, rel=0.005), f"{name} {key}"


@pytest.mark.parametrize("name", sorted(SHAPES))
def test_plates_only_fall_low_by_the_root_radii(name):
    dims, table = SHAPES[name]
    p = _shape(dims, fillets=False).properties()
    for key in ("A", "Ix", "Sx", "Zx"):
        ratio = getattr(p, key).to(cm ** POWER[key]).magnitude / table[key]
        # plates only: 3.5-4.5 % low for these sections with their large root radii
        assert 0.95 < ratio < 0.97, f"{name} {key}: {ratio:.4f}"


def test_torsion_constant_errs_low_without_the_root_radii():
    # Tabulated It (from memory): IPE 300 20.12 cm⁴, HE 300 B 185 cm⁴. Σ b t³/3 omits the
    # junction and fillet terms of the tables' formula, so it is 19-22 % low: on the safe side
    # for lateral-torsional buckling, and documented in ISection.
    for name, printed in (("IPE 300", 20.12), ("HE 300 B", 185.0)):
        J = _shape(SHAPES[name][0], fillets=True).properties().J.to(cm**4).magnitude
        assert 0.75 * printed < J < printed, name
