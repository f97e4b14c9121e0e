"""AISC, Companion to the AISC Steel Construction Manual, Volume 1: Design Examples, version
16.0 (American Institute of Steel Construction, 2023), Examples F.1-3B and G.1B, solved by the
Specification (the "B" solutions). Section properties: AISC Shapes Database v15.0
(``aisc_shapes_v15.py``; the v16 database lists the same values for these shapes).

* F.1-3B: W18x50, ASTM A992, simple span 35 ft, w_D = 0.45 kip/ft, w_L = 0.75 kip/ft, braced
  at midspan, L_b = 17.5 ft: C_b = 1.30; L_p = 5.83 ft, L_r = 16.9 ft; F_cr = 43.2 ksi;
  M_n = 3,840 kip-in = 320 kip-ft; φ_b M_n = 288 kip-ft, M_n/Ω_b = 192 kip-ft.
* G.1B (pp. G-3, G-4): W24x62, ASTM A992, strong-axis shear: A_w = d t_w = 10.2 in.²,
  C_v1 = 1.0, V_n = 306 kips, φ_v V_n = 306 kips, V_n/Ω_v = 204 kips.

The examples print three significant figures, so the tolerance is 0.5 % unless stated.
"""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks import check_aisc_beam
from calcpack.combinations import analyse_combinations, asce7_allowable_stress, asce7_strength
from calcpack.loads import UniformLoad
from calcpack.units import ureg
from tests.validation.aisc_shapes_v15 import W18X50, W24X62

ft, ksi, kip = ureg.ft, ureg.ksi, ureg.kip
PRINTED = 5e-3  # three significant figures


@pytest.fixture(scope="module")
def cases():
    beam = Beam(
        length=35 * ft,
        supports=[Pin(0 * ft), Roller(35 * ft)],
        loads=[
            UniformLoad(w=0.45 * ureg.klf, case="D"),
            UniformLoad(w=0.75 * ureg.klf, case="L"),
        ],
        name="F.1",
    )
    return solve_cases(beam)


@pytest.mark.parametrize(("method", "printed"), [("LRFD", 288), ("ASD", 192)])
def test_F_1_3B_midspan_bracing(cases, method, printed):
    cset = asce7_strength() if method == "LRFD" else asce7_allowable_stress()
    mc = check_aisc_beam(
        W18X50, Fy=50 * ksi, method=method, demand=analyse_combinations(cases, cset),
        braces=[17.5 * ft], material="ASTM A992",
    )  # fmt: skip
    v = mc.values
    assert v["C_b"].magnitude == pytest.approx(1.30, abs=0.005)  # printed to 0.01
    assert v["L_p"].to("ft").magnitude == pytest.approx(5.83, rel=PRINTED)
    assert v["L_r"].to("ft").magnitude == pytest.approx(16.9, rel=PRINTED)
    assert v["L_b"].to("ft").magnitude > v["L_r"].to("ft").magnitude  # elastic LTB, F2-3
    assert v["F_cr"].to("ksi").magnitude == pytest.approx(43.2, rel=PRINTED)
    assert v["M_n"].to("kip*inch").magnitude == pytest.approx(3840, rel=PRINTED)
    assert mc["Flexure"].capacity.to("kip*ft").magnitude == pytest.approx(printed, rel=PRINTED)


@pytest.mark.parametrize(("method", "printed"), [("LRFD", 306), ("ASD", 204)])
def test_G_1B_W24x62_strong_axis_shear(method, printed):
    mc = check_aisc_beam(W24X62, Fy=50 * ksi, method=method, Vu=100 * kip)
    assert mc["Shear"].capacity.to("kip").magnitude == pytest.approx(printed, rel=PRINTED)
    assert mc.values["C_v1"].magnitude == 1.0  # §G2.1(a): h/t_w = 50.1 <= 2.24√(E/F_y) = 53.9
    assert mc.values["A_w"].to("inch**2").magnitude == pytest.approx(10.2, rel=PRINTED)
    assert mc.values["V_n"].to("kip").magnitude == pytest.approx(306, rel=PRINTED)
