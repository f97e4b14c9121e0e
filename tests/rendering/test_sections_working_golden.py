"""Golden renderings of the section working: the parts table and the parallel-axis steps.

The expected strings are the working a checker writes by hand for a composite section (common
practice): one line per part with Aᵢ, ȳᵢ, Aᵢȳᵢ, Īᵢ, dᵢ and Aᵢdᵢ², the sums, then ȳ = ΣAᵢȳᵢ/ΣAᵢ
and I = ΣĪᵢ + ΣAᵢdᵢ² with the sums substituted, three significant figures.
"""

from __future__ import annotations

import pytest

from calcpack.sections import Rectangle, composite
from calcpack.units import ureg
from calcpack.working import Derived, Table

mm = ureg.mm


@pytest.fixture
def block():
    tee = composite(
        Rectangle(b=8 * mm, d=188 * mm).at(x=71 * mm, y=0 * mm, name="stem"),
        Rectangle(b=150 * mm, d=12 * mm).at(x=0 * mm, y=188 * mm, name="flange"),
    )
    return tee.working(axes="x", system="SI")


def _derived(block, name):
    return next(s for s in block.steps if isinstance(s, Derived) and s.name == name)


def test_parts_table_text(block):
    table = next(s for s in block.steps if isinstance(s, Table))
    lines = table.text().splitlines()
    assert lines[0] == "Parts of built-up section, about the x axis"
    cells = [[c.strip() for c in line.split("|")] for line in lines[1:2] + lines[3:]]
    assert cells == [
        ["Part", "$A_i$ (mm²)", r"$\bar{y}_i$ (mm)", r"$A_i \bar{y}_i$ (mm³)",
         r"$\bar{I}_{x,i}$ (mm⁴)", r"$d_i = \bar{y}_i - \bar{y}$ (mm)", "$A_i d_i^2$ (mm⁴)"],
        ["stem", "1500", "94.0", "141\u2009000", "4.43×10⁶", "−54.5", "4.46×10⁶"],
        ["flange", "1800", "194", "349\u2009000", "21\u2009600", "45.5", "3.73×10⁶"],
        ["**Σ**", "3300", "", "491\u2009000", "4.45×10⁶", "", "8.19×10⁶"],
    ]  # fmt: skip


def test_centroid_with_substitution(block):
    assert _derived(block, "y_bar").latex() == (
        r"$$\bar{y} = \frac{\Sigma A_i \bar{y}_i}{A} = "
        r"\frac{491\,000\ \mathrm{mm^{3}}}{3300\ \mathrm{mm^{2}}} = 148\ \mathrm{mm}$$"
    )


def test_parallel_axis_theorem_with_substitution(block):
    assert _derived(block, "I_x").latex() == (
        r"$$I_{x} = \Sigma \bar{I}_{x,i} + \Sigma A_i d_{i}^2 = "
        r"4.45 \times 10^{6}\ \mathrm{mm^{4}} + 8.19 \times 10^{6}\ \mathrm{mm^{4}}"
        r" = 12.6 \times 10^{6}\ \mathrm{mm^{4}}$$"
    )
    assert _derived(block, "I_x").text() == (
        "I_x = Σ_Ix + Σ_Ady2 = 4.45×10⁶ mm⁴ + 8.19×10⁶ mm⁴ = 12.6×10⁶ mm⁴  "
        "(second moment about the centroidal x axis)  [parallel-axis theorem]"
    )
