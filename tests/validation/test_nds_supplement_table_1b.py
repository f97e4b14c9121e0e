"""Sawn lumber dressed sizes and section properties.

Source: American Wood Council, *National Design Specification (NDS) Supplement: Design Values
for Wood Construction*, 2018 ed., Table 1B "Section Properties of Standard Dressed (S4S) Sawn
Lumber" (dressed sizes per US DOC PS 20), values from memory, as printed, in inches.
Tolerance 0.05 %: the table prints four significant figures.
"""

from __future__ import annotations

import pytest

from calcpack.sections import sawn_timber
from calcpack.units import ureg

inch = ureg.inch

# nominal: (b, d, A, Sxx, Ixx) as printed (in, in, in², in³, in⁴)
TABLE_1B = {
    "2x4": (1.5, 3.5, 5.250, 3.063, 5.359),
    "2x10": (1.5, 9.25, 13.88, 21.39, 98.93),
    "4x4": (3.5, 3.5, 12.25, 7.146, 12.51),
    "6x6": (5.5, 5.5, 30.25, 27.73, 76.26),
}


@pytest.mark.parametrize("nominal", sorted(TABLE_1B))
def test_dressed_size_and_properties_match_table_1b(nominal):
    b, d, A, S, I = TABLE_1B[nominal]
    shape = sawn_timber(nominal)
    assert shape.b.to(inch).magnitude == b
    assert shape.d.to(inch).magnitude == d
    p = shape.properties()
    # 0.05 %: four printed figures
    assert p.A.to(inch**2).magnitude == pytest.approx(A, rel=5e-4)
    assert p.Sx.to(inch**3).magnitude == pytest.approx(S, rel=5e-4)
    assert p.Ix.to(inch**4).magnitude == pytest.approx(I, rel=5e-4)
