"""The section sketch: an SVG with the parts, centroid, axes and dimensions."""

from __future__ import annotations

from calcpack.sections import Angle, Circle, Rectangle, composite
from calcpack.units import ureg

mm = ureg.mm


def test_sketch_of_a_built_up_section_is_svg_with_labels():
    sec = composite(
        Rectangle(b=200 * mm, d=20 * mm).at(x=0 * mm, y=0 * mm, name="bottom plate"),
        Rectangle(b=20 * mm, d=200 * mm).at(x=90 * mm, y=20 * mm, name="web plate"),
        Circle(d=12 * mm).hole_at(x=30 * mm, y=10 * mm, name="hole"),
    )
    svg = sec.svg()
    assert svg.lstrip().startswith("<?xml")
    assert "<svg" in svg
    # part names, the centroid mark and the dimensions are drawn as text
    for word in ("bottom plate", "web plate", "hole", "C", "ȳ", "dimensions in mm"):
        assert word in svg, word


def test_sketch_in_us_units_and_principal_axes():
    fig = Angle(d=4 * ureg.inch, b=3 * ureg.inch, t=0.25 * ureg.inch).figure(system="US")
    texts = [t.get_text() for t in fig.axes[0].texts]
    assert any("in)" in fig.axes[0].get_title() for _ in [0])
    assert " 1" in texts
    assert " 2" in texts


def test_figure_uses_no_pyplot_state():
    # in a fresh interpreter: other tests (and libraries) may have imported pyplot already
    import subprocess
    import sys

    code = (
        "import sys\n"
        "from calcpack.sections import Rectangle\n"
        "from calcpack.units import ureg\n"
        "Rectangle(b=10 * ureg.mm, d=20 * ureg.mm).svg()\n"
        "print('matplotlib.pyplot' in sys.modules)\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"
