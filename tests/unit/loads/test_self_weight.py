"""Self-weight and tributary line loads."""

from __future__ import annotations

import pytest

from calcpack.errors import DimensionError, InputError
from calcpack.loads.self_weight import self_weight, tributary_line_load
from calcpack.units import ureg


def test_w_shape_self_weight_matches_its_nominal_weight():
    # A W18x50 weighs 50 lb/ft: A = 14.7 in² (AISC Shapes Database v15.0), steel
    # 490 lb/ft³ (common practice); tolerance 0.1 % for the rounded area
    w = self_weight(area=14.7 * ureg.inch**2, density=490 * ureg.pcf).w.to("plf")
    assert w.magnitude == pytest.approx(50.0, rel=1e-3)


def test_mass_density_uses_standard_gravity():
    w = self_weight(area=0.2 * ureg.m**2, density=2500 * ureg.kg / ureg.m**3)
    assert w.w.to("kN/m").magnitude == pytest.approx(0.2 * 2500 * 9.80665 / 1000, rel=1e-12)
    assert w.case == "D"


def test_section_properties_object_is_accepted():
    class Props:
        A = 0.01 * ureg.m**2

    w = self_weight(area=Props(), density=78.5 * ureg.kN / ureg.m**3)
    assert w.w.to("kN/m").magnitude == pytest.approx(0.785)


def test_bad_density_and_area_name_the_input():
    with pytest.raises(DimensionError, match="density"):
        self_weight(area=0.1 * ureg.m**2, density=3 * ureg.MPa)
    with pytest.raises(InputError, match="area"):
        self_weight(area=-0.1 * ureg.m**2, density=25 * ureg.kN / ureg.m**3)


def test_tributary_line_load():
    ld = tributary_line_load(q=40 * ureg.psf, width=16 * ureg.inch, case="L")
    assert ld.w.to("plf").magnitude == pytest.approx(40 * 16 / 12)
