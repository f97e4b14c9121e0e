"""The inputs file: unit strings become quantities, bad values are refused naming the key, and
writing keeps the file's comments."""

from __future__ import annotations

from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcpack.errors import DimensionError
from calcpack.inputs import (
    InputsFileError,
    Spec,
    format_quantity,
    get_path,
    load_inputs,
    parse_quantity,
    read_inputs_text,
    require_input,
    update_inputs,
    write_inputs,
)
from calcpack.units import Q_, ureg

SAMPLE = """\
# Lintel inputs (hand-written comment that must survive an edit)
title = "Lintel L2"
[beam]
span = "3.2 m"          # clear opening plus bearings
spans = ["2.4 m", "3000 mm"]
w = "8.5 kN/m"
factor = 1.35
kind = "pin"
"""


def _write(tmp_path: Path, text: str = SAMPLE) -> Path:
    p = tmp_path / "sheet.inputs.toml"
    p.write_text(text, encoding="utf-8")
    return p


def test_unit_strings_become_quantities(tmp_path: Path) -> None:
    data = load_inputs(_write(tmp_path))
    assert data["beam"]["span"] == Q_(3.2, "m")
    assert data["beam"]["spans"][1].to("m").magnitude == pytest.approx(3.0)
    assert data["beam"]["w"].to("N/m").magnitude == pytest.approx(8500.0)
    assert data["beam"]["factor"] == 1.35  # bare numbers stay dimensionless numbers
    assert data["beam"]["kind"] == "pin"  # text that is not a number stays text
    assert data["title"] == "Lintel L2"


def test_number_without_unit_is_refused_naming_the_key(tmp_path: Path) -> None:
    p = _write(tmp_path, '[beam]\nspans = ["2.4 m", "3.0"]\n')
    with pytest.raises(InputsFileError, match=r"beam\.spans\[2\].*has no unit") as info:
        load_inputs(p)
    assert info.value.name == "beam.spans[2]"
    assert "sheet.inputs.toml" in str(info.value)


def test_unknown_unit_is_refused_naming_the_key() -> None:
    with pytest.raises(InputsFileError, match=r"material\.E = '11 GPaa'") as info:
        read_inputs_text('[material]\nE = "11 GPaa"\n')
    assert info.value.name == "material.E"


def test_missing_file_says_where_it_looked(tmp_path: Path) -> None:
    with pytest.raises(InputsFileError, match="does not exist") as info:
        load_inputs(tmp_path / "nope.inputs.toml")
    assert "nope.inputs.toml" in str(info.value)


def test_bad_toml_names_the_file(tmp_path: Path) -> None:
    p = _write(tmp_path, "[beam\nspan = 3\n")
    with pytest.raises(InputsFileError, match=r"sheet\.inputs\.toml: not valid TOML"):
        load_inputs(p)


def test_require_input_dimension_and_sign() -> None:
    assert require_input(Q_(3, "m"), "[length]", "beam.span") == Q_(3, "m")
    with pytest.raises(DimensionError, match=r"beam\.span must have units of \[length\]"):
        require_input(Q_(3, "kN"), "[length]", "beam.span")
    with pytest.raises(DimensionError, match=r"beam\.span.*write the value with its unit"):
        require_input(3.0, "[length]", "beam.span")
    with pytest.raises(InputsFileError, match=r"beam\.span must be positive") as info:
        require_input(Q_(-1, "m"), Spec("[length]", positive=True), "beam.span")
    assert info.value.name == "beam.span"
    with pytest.raises(InputsFileError, match=r"beam\.kind must be one of pin, roller"):
        require_input("hinge", Spec("text", choices=("pin", "roller")), "beam.kind")
    with pytest.raises(InputsFileError, match=r"limits\.ratio must be a bare number"):
        require_input("300", "number", "limits.ratio")


def test_get_path_uses_one_based_indices() -> None:
    data = {"beam": {"spans": [Q_(1, "m"), Q_(2, "m")]}}
    assert get_path(data, "beam.spans[2]") == Q_(2, "m")
    with pytest.raises(InputsFileError, match=r"no value beam\.spans\[3\]"):
        get_path(data, "beam.spans[3]")


def test_update_keeps_comments_and_layout(tmp_path: Path) -> None:
    p = _write(tmp_path)
    after = update_inputs(p, {"beam.span": 4.1 * ureg.m, "beam.spans[2]": Q_(3500, "mm")})
    text = p.read_text(encoding="utf-8")
    assert "# Lintel inputs (hand-written comment that must survive an edit)" in text
    assert 'span = "4.1 m"          # clear opening plus bearings' in text
    assert 'spans = ["2.4 m", "3500 mm"]' in text
    assert after["beam"]["span"] == Q_(4.1, "m")
    assert load_inputs(p) == after


def test_update_refuses_a_key_whose_parent_is_missing(tmp_path: Path) -> None:
    p = _write(tmp_path)
    before = p.read_text(encoding="utf-8")
    with pytest.raises(InputsFileError, match=r"Cannot set section\.b") as info:
        update_inputs(p, {"section.b": Q_(90, "mm")})
    assert info.value.name == "section.b"
    assert p.read_text(encoding="utf-8") == before  # nothing written


def test_update_refuses_to_write_an_unreadable_value(tmp_path: Path) -> None:
    p = _write(tmp_path)
    before = p.read_text(encoding="utf-8")
    with pytest.raises(InputsFileError, match=r"beam\.w"):
        update_inputs(p, {"beam.w": "8.5"})
    assert p.read_text(encoding="utf-8") == before


def test_write_then_load_round_trip(tmp_path: Path) -> None:
    p = tmp_path / "new.inputs.toml"
    data = {"beam": {"spans": [Q_(3.6, "m"), Q_(4.2, "m")], "name": "B2"}, "k": 1.5}
    write_inputs(p, data, header="Made by a test")
    assert p.read_text(encoding="utf-8").startswith("# Made by a test\n")
    assert load_inputs(p) == data


# Quantities are stored at full precision: writing then reading gives the same float exactly
# (repr of a float round-trips, Python language reference).
@settings(max_examples=60, deadline=None)
@given(
    mag=st.floats(min_value=-1e9, max_value=1e9, allow_nan=False, allow_infinity=False),
    unit=st.sampled_from(["m", "mm", "kN", "kN/m", "MPa", "kN*m", "mm**4", "GPa"]),
)
def test_format_parse_round_trip(mag: float, unit: str) -> None:
    q = Q_(mag, unit)
    back = parse_quantity(format_quantity(q), "x")
    assert back.magnitude == mag
    assert back.units == q.units


def test_update_removes_with_none_and_appends_past_the_end(tmp_path: Path) -> None:
    p = _write(tmp_path)
    after = update_inputs(p, {"beam.factor": None, "beam.spans[3]": Q_(1.5, "m")})
    assert "factor" not in after["beam"]
    assert after["beam"]["spans"][2] == Q_(1.5, "m")
    after = update_inputs(p, {"beam.spans[1]": None})
    assert after["beam"]["spans"] == [Q_(3000, "mm"), Q_(1.5, "m")]
    assert "# clear opening plus bearings" in p.read_text(encoding="utf-8")


SHARED = """\
# a file several sheets share: one table a panel edits, others it must not read
[post]
size = "6x6"        # nominal
b = "5.5 in"
[brace]
bolt = "1/2 in. bolt"   # text starting with a number: not an inputs-file value
"""


def test_tables_reads_and_edits_only_the_tables_named(tmp_path: Path) -> None:
    p = tmp_path / "design.toml"
    p.write_text(SHARED, encoding="utf-8")
    with pytest.raises(InputsFileError, match=r"brace\.bolt"):
        load_inputs(p)  # the whole file does not read as inputs
    assert load_inputs(p, tables=("post",)) == {"post": {"size": "6x6", "b": Q_(5.5, "inch")}}
    after = update_inputs(p, {"post.size": "4x6", "post.b": Q_(3.5, "inch")}, tables=("post",))
    assert after["post"] == {"size": "4x6", "b": Q_(3.5, "inch")}
    text = p.read_text(encoding="utf-8")
    assert "# nominal" in text
    assert 'bolt = "1/2 in. bolt"' in text
    with pytest.raises(InputsFileError, match=r"brace\.bolt.*only the tables \['post'\]"):
        update_inputs(p, {"brace.bolt": "x"}, tables=("post",))
    with pytest.raises(InputsFileError, match=r"table \[beam\] is missing"):
        load_inputs(p, tables=("beam",))


@pytest.mark.parametrize("text", ["2x10", "6x6", "4 x 12", "24F-1.8E", "20F-1.5E", "24F-V4"])
def test_the_trades_designations_starting_with_a_number_stay_text(text: str) -> None:
    assert read_inputs_text(f'size = "{text}"') == {"size": text}


@pytest.mark.parametrize("text", ["3.2", "2x", "24F-", "6x6 in"])
def test_other_numbers_without_a_known_unit_are_still_refused(text: str) -> None:
    with pytest.raises(InputsFileError, match="size"):
        read_inputs_text(f'size = "{text}"')
