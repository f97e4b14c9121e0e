"""Engineering number formatting: significant figures, grouping, engineering notation."""

from __future__ import annotations

import pytest

from calcpack.units import Q_
from calcpack.working import format_number, format_quantity_latex, format_quantity_text


@pytest.mark.parametrize(
    ("value", "text", "latex"),
    [
        (10.875, "10.9", "10.9"),
        (12345, "12\u2009300", r"12\,300"),
        (0.004251, "0.00425", "0.00425"),
        (2.35e8, "235×10⁶", r"235 \times 10^{6}"),
        (-3.0, "−3.00", "-3.00"),
        (1e-5, "10.0×10⁻⁶", r"10.0 \times 10^{-6}"),
        (0.0, "0", "0"),
        (0.1, "0.100", "0.100"),
    ],
)
def test_three_significant_figures(value, text, latex):
    assert format_number(value) == text
    assert format_number(value, latex=True) == latex


def test_no_exponent_noise():
    for v in [1234.5, 99999.0, 123456.0, 0.00123]:
        assert "e" not in format_number(v)


def test_configurable_figures():
    assert format_number(3.14159, 5) == "3.1416"
    assert format_number(3.14159, 2) == "3.1"


def test_quantities():
    assert format_quantity_text(Q_(10.88, "kN*m")) == "10.9 kN·m"
    assert format_quantity_text(Q_(120, "N/mm**2")) == "120 N/mm²"
    assert format_quantity_latex(Q_(2, "inch**4")) == r"2.00\ \mathrm{in^{4}}"
    assert format_quantity_text(Q_(30, "deg")) == "30.0°"
