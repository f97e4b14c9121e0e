"""Bar sizes by designation from the cited tables (values from memory in the data files)."""

from __future__ import annotations

import pytest

from calcpack.errors import InputError
from calcpack.sections.rebar import rebar
from calcpack.units import Q_


def test_astm_inch_pound_and_soft_metric():
    b = rebar("#5")
    assert b.db == Q_(0.625, "inch")  # ASTM A615 Table 1 (from memory)
    assert b.Ab == Q_(0.31, "inch**2")
    assert rebar("No. 5").designation == "#5"
    m = rebar("#16", "ASTM metric")
    assert m.Ab == Q_(199, "mm**2")  # soft metric of #5 (from memory)
    assert "ASTM A615" in b.source


def test_bs4449_bar_marks():
    assert rebar("H16", "BS 4449").Ab == Q_(201, "mm**2")  # BS 4449 Table 6 (from memory)
    assert rebar("12", "BS 4449").db == Q_(12, "mm")
    assert rebar("B20", "BS 4449").designation == "H20"


def test_unknown_bar_suggests_and_names_the_input():
    with pytest.raises(InputError, match="input bar") as e:
        rebar("#12")
    assert e.value.name == "bar"
    with pytest.raises(InputError, match="did you mean"):
        rebar("H14", "BS 4449")
    with pytest.raises(InputError, match="Input system"):
        rebar("#5", "JIS")  # type: ignore[arg-type]
