"""The beam figure renders as SVG with its panels, units and annotated values, and the
computation modules never import matplotlib."""

from __future__ import annotations

import json
import subprocess
import sys

from calcpack.analysis.beam import Beam, Fixed, Hinge, Pin, Roller, solve_beam
from calcpack.loads import LinearLoad, PointLoad, PointMoment, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN


def _result(with_EI: bool = True):
    beam = Beam(
        length=10 * m,
        supports=[Pin(0 * m), Roller(7.5 * m)],
        EI=Q_(25e3, "kN*m**2") if with_EI else None,
        name="B1",
        loads=[
            UniformLoad(w=6 * kN / m, case="D"),
            LinearLoad(w_start=0 * kN / m, w_end=8 * kN / m, start=2 * m, end=6 * m, case="L"),
            PointLoad(x=10 * m, P=12 * kN, case="D"),
            PointMoment(x=4 * m, C=10 * kN * m, case="L"),
        ],
    )
    return solve_beam(beam)


def test_figure_is_svg_with_four_panels_and_units():
    fig = _result().figure()
    svg = fig.svg
    assert svg.lstrip().startswith("<?xml")
    assert "<svg" in svg
    assert len(fig.figure.axes) == 4
    labels = [ax.get_ylabel() for ax in fig.figure.axes[1:]]
    assert labels[0].startswith("V (kN)")
    assert labels[1].startswith("M (kN·m)")
    assert labels[2].startswith("displacement (mm)")
    assert fig.figure.axes[-1].get_xlabel() == "x from left end (m)"
    texts = [t.get_text() for ax in fig.figure.axes for t in ax.texts]
    assert "12.0 kN" in texts  # the point load's value, three significant figures
    assert any("mm down" in t for t in texts)  # the maximum deflection is annotated
    assert fig._repr_mimebundle_()["image/svg+xml"] == svg


def test_figure_without_stiffness_has_three_panels():
    assert len(_result(with_EI=False).figure().figure.axes) == 3


def test_figure_for_fixed_support_and_hinge():
    beam = Beam(
        length=12 * m,
        supports=[Fixed(0 * m), Roller(12 * m)],
        hinges=[Hinge(4 * m)],
        loads=[UniformLoad(w=6 * kN / m)],
        EI=Q_(25e3, "kN*m**2"),
    )
    texts = [t.get_text() for ax in solve_beam(beam).figure().figure.axes for t in ax.texts]
    assert any(t.startswith("M = 0 at 4.00 m") for t in texts)  # the hinge, a contraflexure point


def test_beam_and_loads_import_without_plotting():
    code = (
        "import json, sys\n"
        "import calcpack.analysis.beam, calcpack.loads\n"
        "from calcpack.analysis.beam import Beam, Pin, Roller, solve_beam\n"
        "from calcpack.loads import UniformLoad\nfrom calcpack.units import ureg\n"
        "r = solve_beam(Beam(length=4 * ureg.m, supports=[Pin(0 * ureg.m), Roller(4 * ureg.m)],"
        " loads=[UniformLoad(w=1 * ureg.kN / ureg.m)]))\n"
        "r.extremes.M_max\n"
        "heavy = ('matplotlib', 'calcpack.plots', 'calcpack.analysis.beam.working', 'IPython')\n"
        "print(json.dumps([h for h in heavy if h in sys.modules]))\n"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout
    assert json.loads(out.strip().splitlines()[-1]) == []
