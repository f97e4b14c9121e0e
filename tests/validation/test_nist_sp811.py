"""Unit conversions against NIST Special Publication 811 (2008 edition), *Guide for the Use of the
International System of Units (SI)*, Appendix B.8/B.9, "Factors for units listed alphabetically /
by kind of quantity". Values are copied as printed there (to the digits quoted); the tolerance is
half a unit in the last printed digit, because the printed factors are rounded.
"""

from __future__ import annotations

import pytest

from calcpack.units import Q_


@pytest.mark.parametrize(
    ("quantity", "target", "printed", "rel"),
    [
        # "foot (ft) to meter (m): 3.048 E-01" -- exact by definition
        (Q_(1, "ft"), "m", 0.3048, 1e-15),
        # "inch (in) to meter (m): 2.54 E-02" -- exact by definition
        (Q_(1, "inch"), "m", 0.0254, 1e-15),
        # "pound-force (lbf) to newton (N): 4.448 222 E+00"
        (Q_(1, "lbf"), "N", 4.448222, 0.5e-6 / 4.448222),
        # "kip (1 kip = 1000 lbf) to newton (N): 4.448 222 E+03"
        (Q_(1, "kip"), "N", 4448.222, 0.5e-3 / 4448.222),
        # "pound-force per square inch (psi) to kilopascal (kPa): 6.894 757 E+00"
        (Q_(1, "psi"), "kPa", 6.894757, 0.5e-6 / 6.894757),
        # "kip per square inch (ksi) to megapascal (MPa): 6.894 757 E+00"
        (Q_(1, "ksi"), "MPa", 6.894757, 0.5e-6 / 6.894757),
        # "pound-force per square foot (lbf/ft2) to pascal (Pa): 4.788 026 E+01"
        (Q_(1, "psf"), "Pa", 47.88026, 0.5e-5 / 47.88026),
        # "pound-force foot (lbf·ft) to newton meter (N·m): 1.355 818 E+00"; kip·ft is 1000 ×
        (Q_(1, "kip*ft"), "kN*m", 1.355818, 0.5e-6 / 1.355818),
        # "pound-force inch (lbf·in) to newton meter (N·m): 1.129 848 E-01"; kip·in is 1000 ×
        (Q_(1, "kip*inch"), "kN*m", 0.1129848, 0.5e-7 / 0.1129848),
        # "pound-force per foot (lbf/ft) to newton per meter (N/m): 1.459 390 E+01"
        (Q_(1, "plf"), "N/m", 14.59390, 0.5e-5 / 14.59390),
        # klf = 1000 lbf/ft
        (Q_(1, "klf"), "kN/m", 14.59390, 0.5e-5 / 14.59390),
        # "inch to the fourth power (in4) to meter to the fourth power (m4): 4.162 314 E-07"
        (Q_(1, "inch**4"), "mm**4", 416231.4, 0.5e-1 / 416231.4),
        # "cubic inch (in3) to cubic meter (m3): 1.638 706 E-05"
        (Q_(1, "inch**3"), "mm**3", 16387.06, 0.5e-2 / 16387.06),
        # "pound-force per cubic foot (lbf/ft3) to newton per cubic meter": 1.570 875 E+02
        (Q_(1, "pcf"), "N/m**3", 157.0875, 0.5e-4 / 157.0875),
    ],
)
def test_appendix_b_factor(quantity, target, printed, rel):
    assert quantity.to(target).magnitude == pytest.approx(printed, rel=rel)


def test_trade_units_exist_in_the_shared_registry():
    # The units the trade writes, SI and US customary (common practice): all must parse.
    for unit in [
        "N", "kN", "MN", "kip", "lbf", "kN/m", "N/mm", "plf", "klf", "kPa", "MPa", "psf", "psi",
        "ksi", "kN*m", "kip*ft", "kip*inch", "mm**4", "inch**4", "mm**3", "inch**3", "GPa",
        "kN/m**3", "pcf",
    ]:  # fmt: skip
        assert Q_(1, unit).magnitude == 1
