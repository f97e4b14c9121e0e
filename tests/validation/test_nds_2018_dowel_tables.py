"""NDS 2018 Chapter 12 tabulated reference lateral design values Z, recomputed by the yield
limit equations of Table 12.3.1A.

Source: AWC, National Design Specification for Wood Construction, 2018 edition, Tables 12A
(bolts, single shear, sawn lumber both members) and 12N (common nails, single shear, sawn lumber
side member). Every value below is FROM MEMORY (recalled, not read from the printed table);
the NDS tables round Z to the nearest 10 lb (bolts) or 1 lb (nails), hence the tolerances.
Also Table 12.3.3 (dowel bearing strengths): F_e⊥ of a 1/2 in. dowel at G = 0.50 is printed as
3 150 psi (from memory).
"""

from __future__ import annotations

import pytest

from calcpack.checks.nds.dowel import DowelJoint, WoodMember, nds_fastener, yield_limits
from calcpack.units import Q_


def _bolt(species: str, side_deg: float, main_deg: float, ts: float = 1.5, tm: float = 1.5):
    j = DowelJoint(
        nds_fastener("1/2 in. bolt"),
        WoodMember(Q_(ts, "inch"), species, angle=Q_(side_deg, "degree")),
        WoodMember(Q_(tm, "inch"), species, angle=Q_(main_deg, "degree")),
    )
    return yield_limits(j)


@pytest.mark.parametrize(
    ("species", "side", "main", "printed"),
    [
        # NDS 2018 Table 12A, D = 1/2 in., t_s = t_m = 1-1/2 in. (from memory): Z∥, Z_s⊥, Z_m⊥, Z⊥
        ("Southern Pine", 0, 0, 530),
        ("Southern Pine", 90, 0, 330),
        ("Southern Pine", 0, 90, 330),
        ("Southern Pine", 90, 90, 250),
        ("Douglas Fir-Larch", 0, 0, 480),
        ("Douglas Fir-Larch", 90, 0, 300),
        ("Douglas Fir-Larch", 0, 90, 300),
        ("Douglas Fir-Larch", 90, 90, 220),
    ],
)
def test_table_12a_half_inch_bolt_two_by_to_two_by(species, side, main, printed):
    z = _bolt(species, side, main).Z.to("lbf").magnitude
    # the table rounds to the nearest 10 lb
    assert z == pytest.approx(printed, abs=5.0)


@pytest.mark.parametrize(
    ("species", "printed"),
    [
        # NDS 2018 Table 12N, 16d common nail (D = 0.162 in., L = 3-1/2 in.), side member
        # 1-1/2 in. (from memory)
        ("Southern Pine", 154),
        ("Douglas Fir-Larch", 141),
        ("Hem-Fir", 122),
        ("Spruce-Pine-Fir", 120),
    ],
)
def test_table_12n_16d_common_nail(species, printed):
    j = DowelJoint(
        nds_fastener("16d common nail"),
        WoodMember(Q_(1.5, "inch"), species),
        WoodMember(Q_(3.5, "inch"), species),
    )
    y = yield_limits(j)
    assert y.Z.to("lbf").magnitude == pytest.approx(printed, abs=0.5)  # rounded to 1 lb
    assert y.governing == "IV"


def test_table_12_3_3_perpendicular_bearing_half_inch_dowel():
    y = _bolt("Douglas Fir-Larch", 90, 90)
    # NDS 2018 Table 12.3.3, G = 0.50, D = 1/2 in.: F_e⊥ = 3 150 psi (from memory; rounded to 50)
    assert y.values["F_es"].to("psi").magnitude == pytest.approx(3150, abs=25)
    assert y.values["F_em_par"].to("psi").magnitude == pytest.approx(5600, abs=0.5)
