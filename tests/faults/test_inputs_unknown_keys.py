"""Every kind of inputs file refuses a key it does not know, naming the file, the key path,
the keys valid there and the closest one.

A misspelt key would otherwise be ignored and its default used without a word (the rule is
common practice for a tool whose output is signed: refuse rather than guess). Each case starts
from the shipped template, which must itself read cleanly, and changes one key.
"""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path
from typing import Any

import pytest

from calcpack.inputs import beam_inputs, read_inputs_text, section_inputs
from calcpack.inputs.file import InputsFileError
from calcpack.inputs.footing import footing_inputs
from calcpack.inputs.layout import Table, Tables, refuse_unknown_keys
from calcpack.inputs.ledger import ledger_inputs
from calcpack.inputs.member import member_inputs
from calcpack.inputs.site_loads import site_loads_inputs
from calcpack.inputs.timber_post import timber_post_inputs

TEMPLATES = Path(__file__).resolve().parents[2] / "templates" / "sheets"

READERS: dict[str, Callable[..., Any]] = {
    "beam": beam_inputs,
    "section": section_inputs,
    "footing": footing_inputs,
    "steel_column": member_inputs,
    "deck_ledger": ledger_inputs,
    "site_loads": site_loads_inputs,
    "timber_post": timber_post_inputs,
}

EN_SITE = """
[site]
standard = "EN 1991 UK"
[roof]
shape = "duopitch"
slope = "30 deg"
width = "8 m"
length = "12 m"
height = "6 m"
spacing = "0.6 m"
[snow]
altitude = "120 m"
zone = 2
[wind]
vb_map = "22 m/s"
vb_source = "UK NA to BS EN 1991-1-4 Figure NA.1"
altitude = "120 m"
c_e = 2.2
c_e_source = "UK NA Figure NA.7"
"""


def _read(kind: str, text: str) -> Any:
    name = f"{kind}.inputs.toml"
    return READERS[kind](read_inputs_text(text, path=name), path=name)


def _template(kind: str) -> str:
    return (TEMPLATES / f"{kind}.inputs.toml").read_text("utf-8")


@pytest.mark.parametrize("kind", sorted(READERS))
def test_every_template_reads_without_a_refusal(kind: str) -> None:
    assert _read(kind, _template(kind)) is not None


def test_the_uk_site_loads_layout_reads_without_a_refusal() -> None:
    loads = _read("site_loads", EN_SITE)
    assert loads.standard == "EN 1991 UK"


@pytest.mark.parametrize(
    ("kind", "old", "new", "key", "close"),
    [
        ("section", "tw =", "t_w =", "section.t_w", "tw"),
        ("section", "[section]", "[sectoin]", "sectoin", "section"),
        ("beam", 'b = "90 mm"', 'bb = "90 mm"', "section.bb", "b"),
        ("footing", "soil_cover =", "soil_covr =", "footing.soil_covr", "soil_cover"),
        ("footing", "plate1 =", "plate_1 =", "column.plate_1", "plate1"),
        ("footing", "q_allow =", "qallow =", "soil.qallow", "q_allow"),
        ("footing", "reinforced =", "reinforcd =", "concrete.reinforcd", "reinforced"),
        ("footing", 'P = "8 kip"', 'PP = "8 kip"', "loads[2].PP", "P"),
        ("steel_column", "Lcx =", "Lc_x =", "member.Lc_x", "Lcx"),
        ("steel_column", 'Mx = "2 kip*ft"', 'Mxx = "2 kip*ft"', "forces[2].Mxx", "Mx"),
        ("steel_column", "[[forces]]", "[[force]]", "force", "forces"),
        ("deck_ledger", "rim_depth =", "rim_dept =", "ledger.rim_dept", "rim_depth"),
        ("deck_ledger", "joist_spacing =", "joist_spcing =", "load.joist_spcing", "joist_spacing"),
        ("site_loads", "terrain =", "terrian =", "snow.terrian", "terrain"),
        ("site_loads", "enclosure =", "enclosur =", "wind.enclosur", "enclosure"),
        ("site_loads", "spacing =", "spaceing =", "roof.spaceing", "spacing"),
        ("site_loads", "[wind]", "[wnd]", "wnd", "wind"),
    ],
)
def test_a_misspelt_key_is_refused_naming_file_key_valid_keys_and_the_closest(
    kind: str, old: str, new: str, key: str, close: str
) -> None:
    text = _template(kind)
    assert old in text
    with pytest.raises(InputsFileError) as info:
        _read(kind, text.replace(old, new, 1))
    message = str(info.value)
    assert info.value.name == key
    assert message.startswith(f"{kind}.inputs.toml: {key} is not a known key")
    assert f"did you mean {close!r}?" in message
    assert close in str(info.value.expected)


def test_a_key_of_the_other_standard_is_refused_saying_which_standard() -> None:
    text = _template("site_loads").replace("[snow]", "[snow]\nzone = 2", 1)
    with pytest.raises(InputsFileError) as info:
        _read("site_loads", text)
    assert info.value.name == "snow.zone"
    assert "for standard 'ASCE 7-16'" in str(info.value)
    with pytest.raises(InputsFileError) as info:
        _read("site_loads", EN_SITE.replace("zone = 2", 'zone = 2\npg = "25 psf"'))
    assert info.value.name == "snow.pg"
    assert "for standard 'EN 1991 UK'" in str(info.value)


def test_a_dimension_of_another_shape_is_refused_naming_the_shape() -> None:
    text = _template("section").replace("[section]", '[section]\nb = "90 mm"', 1)
    with pytest.raises(InputsFileError) as info:
        _read("section", text)
    assert info.value.name == "section.b"
    assert "for shape 'i-section'" in str(info.value)
    for dim in ("d", "bf", "tf", "tw", "r"):
        assert dim in str(info.value.expected)


def test_nested_tables_and_arrays_are_walked_and_free_tables_left_alone() -> None:
    layout = Table(
        {
            "a": Table({"b": Table({"c": None})}),
            "rows": Tables(Table({"x": None})),
            "factors": Table(free=True),
        }
    )
    good = {"a": {"b": {"c": 1}}, "rows": [{"x": 1}, {"x": 2}], "factors": {"D": 1.2, "Q": 3}}
    refuse_unknown_keys(good, layout, path="f.toml")
    with pytest.raises(InputsFileError) as info:
        refuse_unknown_keys({"a": {"b": {"cc": 1}}}, layout, path="f.toml")
    assert info.value.name == "a.b.cc"
    assert "in [a.b]" in str(info.value)
    with pytest.raises(InputsFileError) as info:
        refuse_unknown_keys({"rows": [{"x": 1}, {"y": 2}]}, layout)
    assert info.value.name == "rows[2].y"
    assert str(info.value).startswith("rows[2].y is not a known key")
    with pytest.raises(InputsFileError) as info:
        refuse_unknown_keys({"zzz": 1}, layout)
    assert "at the top of the file" in str(info.value)
    assert "did you mean" not in str(info.value)  # nothing close: no guess offered
