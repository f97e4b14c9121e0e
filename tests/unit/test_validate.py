"""The shared validators and the reference-table reader: messages name the input and the rule."""

from __future__ import annotations

import math

import pytest

from calcpack.errors import DimensionError, InputError
from calcpack.refdata import read_table
from calcpack.units import ureg
from calcpack.validate import dimension, finite, lookup, one_of, positive, positive_fields, within


def test_positive_names_input_and_value() -> None:
    assert positive("L", 3 * ureg.m) == 3 * ureg.m
    with pytest.raises(InputError, match=r"Input L must be positive \(got L = -2 m\)"):
        positive("L", -2 * ureg.m)
    assert positive("e", 0.0, allow_zero=True) == 0.0
    with pytest.raises(InputError, match="must not be negative"):
        positive("e", -1.0, allow_zero=True)


@pytest.mark.parametrize("bad", [math.nan, math.inf, -math.inf])
def test_finite_refuses_nan_and_inf(bad: float) -> None:
    with pytest.raises(InputError, match="k must be a finite number") as err:
        finite("k", bad)
    assert err.value.name == "k"


def test_within_states_range_and_rule() -> None:
    assert within("Fy", 50 * ureg.ksi, 30 * ureg.ksi, 70 * ureg.ksi) == 50 * ureg.ksi
    with pytest.raises(InputError, match=r"Fy must be from 30 ksi to 70 ksi.*got Fy = 5 ksi.*E3"):
        within("Fy", 5 * ureg.ksi, 30 * ureg.ksi, 70 * ureg.ksi, rule="§E3")
    with pytest.raises(InputError, match="at most 1"):
        within("ratio", 2.0, hi=1.0)


def test_one_of_suggests() -> None:
    assert one_of("method", "LRFD", ("LRFD", "ASD")) == "LRFD"
    with pytest.raises(InputError, match="did you mean 'LRFD'"):
        one_of("method", "LFRD", ("LRFD", "ASD"))


def test_dimension_delegates_to_require() -> None:
    with pytest.raises(DimensionError, match="Input w"):
        dimension("w", 3 * ureg.m, "[force] / [length]")


def test_lookup_is_forgiving_then_suggests() -> None:
    table = {"W18X50": 1, "W18X55": 2, "W8X18": 3}
    assert lookup("designation", "w18x50", table) == 1
    with pytest.raises(InputError, match=r"did you mean .*'W18X50'") as err:
        lookup("designation", "W18X05", table, what="AISC W-shape")
    assert "AISC W-shape" in str(err.value)


def test_read_table_parses_header_and_rows(tmp_path, monkeypatch) -> None:  # type: ignore[no-untyped-def]
    pkg = tmp_path / "demo_tables"
    pkg.mkdir()
    (pkg / "__init__.py").write_text("")
    (pkg / "t.csv").write_text(
        "# source: Invented table for a test, 1st ed.\n# units: A in^2\n"
        "name,A,note\nX1,2.5,\nX2,3,ok\n"
    )
    monkeypatch.syspath_prepend(str(tmp_path))
    t = read_table("t.csv", key="name", package="demo_tables")
    assert t.citation == "Invented table for a test, 1st ed."
    assert t.row("X1")["A"] == 2.5
    assert t.row("X1")["note"] is None
    assert t.row("x2")["note"] == "ok"
    with pytest.raises(InputError, match="did you mean"):
        t.row("X3")


def test_required_says_what_needs_it_and_what_to_give() -> None:
    from calcpack.validate import required

    assert required("Lb", 3 * ureg.ft, expected="a length") == 3 * ureg.ft
    with pytest.raises(
        InputError, match=r"Input Lb is required with Mu \(got Lb = None\); give a length"
    ) as err:
        required("Lb", None, expected="a length", when="with Mu")
    assert err.value.name == "Lb"


@pytest.mark.parametrize("bad", ["", "   ", None, 3])
def test_non_empty_refuses_a_blank_source(bad: object) -> None:
    from calcpack.validate import non_empty

    assert non_empty("source", " Table 4A ", expected="e.g. 'Table 4A'") == "Table 4A"
    with pytest.raises(InputError, match=r"Input source must be stated.*e\.g\. 'Table 4A'") as e:
        non_empty("source", bad, expected="e.g. 'Table 4A'")
    assert e.value.value == bad


def test_instance_and_whole_name_the_input() -> None:
    from calcpack.validate import instance, whole

    assert instance("n", 2.5, float, expected="a number") == 2.5
    with pytest.raises(InputError, match=r"Input loads\[0\] must be a Load.*got a str"):
        instance("loads[0]", "D", (int, float), expected="a Load")
    assert whole("n", 3, lo=1) == 3
    for bad in (2.0, True, "2"):
        with pytest.raises(InputError, match="n must be a whole number of at least 1"):
            whole("n", bad, lo=1)
    with pytest.raises(InputError, match=r"Input n must be at least 1 \(got n = 0\)"):
        whole("n", 0, lo=1)


def test_positive_fields_names_the_field_and_skips_optional_none() -> None:
    from dataclasses import dataclass

    @dataclass
    class Plate:
        t: object
        gap: object = None

    ok = Plate(ureg.Quantity(10, "mm"))
    positive_fields(ok, "[length]", ("t", "gap"), optional=True)  # None skipped
    with pytest.raises(InputError, match="gap"):
        positive_fields(ok, "[length]", ("t", "gap"))  # None refused when required
    with pytest.raises(InputError, match=r"\bt\b.*-2"):
        positive_fields(Plate(ureg.Quantity(-2, "mm")), "[length]", ("t",))
    with pytest.raises(DimensionError, match=r"\bt\b"):
        positive_fields(Plate(ureg.Quantity(2, "kN")), "[length]", ("t",))


def test_find_matches_exactly_and_lists_the_names_there_are() -> None:
    from calcpack.validate import find

    table = {"AB": 1, "BC": 2}
    assert find("member", "BC", table, what="member", where="in truss T1") == 2
    with pytest.raises(InputError) as err:
        find("member", "ab", table, what="member", where="in truss T1")
    text = str(err.value)
    assert "there is no member 'ab' in truss T1" in text  # exact: "ab" is not "AB"
    assert "(members: AB, BC)" in text
    assert "did you mean 'AB'?" in text
    assert (err.value.name, err.value.value) == ("member", "ab")
    with pytest.raises(InputError, match=r"\(supports: none\)"):
        find("support", "A", {}, what="support")


def test_at_least_names_the_collection_and_what_it_lacks() -> None:
    from calcpack.validate import at_least

    assert at_least("factors", {"D": 1.2}, what="load factor") == {"D": 1.2}
    with pytest.raises(InputError, match=r"Input factors needs at least one load factor"):
        at_least("factors", {}, what="load factor")
    with pytest.raises(
        InputError, match=r"Input nodes needs at least 2 nodes \(got nodes = \[1\]\)"
    ):
        at_least("nodes", [1], 2, what="node")


def test_each_instance_names_the_item_by_its_index() -> None:
    from calcpack.validate import each_instance

    each_instance("hinges", [1, 2], int, expected="a whole number")
    with pytest.raises(InputError, match=r"Input hinges\[1\] must be a whole number") as err:
        each_instance("hinges", [1, "2"], int, expected="a whole number")
    assert err.value.name == "hinges[1]"


def test_distinct_names_the_repeated_value() -> None:
    from calcpack.validate import distinct

    distinct("supports", ["A", "B"], what="support name")
    with pytest.raises(InputError, match="support name 'A' is used twice") as err:
        distinct("supports", ["A", "B", "A"], what="support name")
    assert err.value.value == "A"
