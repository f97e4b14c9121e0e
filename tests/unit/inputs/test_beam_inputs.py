"""Beam inputs tables: validation naming the key, and the evaluation the panel and sheet share.

Three equal spans under a uniform load on all spans: R_end = 0.400 wL, R_interior = 1.100 wL,
M_support = -0.100 wL², M_end span = +0.080 wL², δ_max = 0.0069 wL⁴/EI (end spans).
Source: continuous-beam coefficient tables, "three equal spans, all spans loaded", as printed in
the AISC Steel Construction Manual, Table 3-23 case 36 (from memory).
"""

from __future__ import annotations

import copy
from pathlib import Path
from typing import Any

import pytest

from calcpack.errors import DimensionError, UnstableStructureError
from calcpack.inputs import InputsFileError, beam_inputs, evaluate_beam, load_inputs
from calcpack.units import Q_

TEMPLATE = Path(__file__).resolve().parents[3] / "templates" / "sheets" / "beam.inputs.toml"


def _three_equal_spans() -> dict[str, Any]:
    return {
        "beam": {
            "name": "B9",
            "spans": [Q_(4, "m")] * 3,
            "supports": ["pin", "roller", "roller", "roller"],
        },
        "section": {"shape": "rectangle", "b": Q_(100, "mm"), "d": Q_(300, "mm")},
        "material": {"E": Q_(10, "GPa"), "f_b": Q_(20, "MPa")},
        "loads": [{"case": "D", "type": "uniform", "w": Q_(5, "kN/m")}],
        "combinations": {"strength": {"D": 1.0}, "service": {"D": 1.0}},
        "limits": {"deflection_ratio": 300},
    }


def test_three_equal_spans_against_beam_table() -> None:
    out = evaluate_beam(beam_inputs(_three_equal_spans()))
    w, L = 5.0, 4.0  # kN/m, m
    reactions = [r.Fy.to("kN").magnitude for r in out.strength.reactions]
    # Tolerance 1e-9 relative: the solver is exact, the table coefficients are exact fractions.
    expected = [0.4 * w * L, 1.1 * w * L, 1.1 * w * L, 0.4 * w * L]
    assert reactions == pytest.approx(expected, rel=1e-9)
    assert out.M_design.to("kN*m").magnitude == pytest.approx(0.1 * w * L**2, rel=1e-9)
    assert out.x_M.to("m").magnitude == pytest.approx(4.0, abs=1e-9)
    S = 0.1 * 0.3**2 / 6  # m³, rectangle b d²/6 (common practice)
    assert out.sigma.to("Pa").magnitude == pytest.approx(0.1 * w * 1e3 * L**2 / S, rel=1e-9)
    assert out.bending_utilisation == pytest.approx(0.1 * w * 1e3 * L**2 / S / 20e6, rel=1e-9)
    EI = 10e9 * 0.1 * 0.3**3 / 12
    # The table prints 0.0069 (2 significant figures): 1 % tolerance.
    d_end = out.deflections[0].delta.to("m").magnitude
    assert d_end == pytest.approx(0.0069 * w * 1e3 * L**4 / EI, rel=0.01)
    assert out.deflections[2].delta.to("m").magnitude == pytest.approx(d_end, rel=1e-6)
    assert out.deflections[0].limit == Q_(4000 / 300, "mm")


def test_template_inputs_evaluate() -> None:
    data = load_inputs(TEMPLATE)
    out = evaluate_beam(beam_inputs(data, path=TEMPLATE))
    # Equilibrium of the strength combination: ΣR = Σ factored loads (common practice).
    total = 1.2 * 1.2 * 11.4 + 1.6 * (2.0 * 4.2 + 3.0)
    assert sum(r.Fy.to("kN").magnitude for r in out.strength.reactions) == pytest.approx(
        total, rel=1e-9
    )
    assert 0 < out.bending_utilisation < 1
    assert len(out.deflections) == 3


@pytest.mark.parametrize(
    ("mutate", "key", "exc"),
    [
        (
            lambda d: d["beam"]["spans"].__setitem__(1, Q_(-4, "m")),
            "beam.spans[2]",
            InputsFileError,
        ),
        (lambda d: d["beam"]["spans"].__setitem__(1, Q_(4, "kN")), "beam.spans[2]", DimensionError),
        (
            lambda d: d["beam"]["supports"].__setitem__(3, "hinge"),
            "beam.supports[4]",
            InputsFileError,
        ),
        (lambda d: d["beam"]["supports"].pop(), "beam.supports", InputsFileError),
        (lambda d: d["section"].pop("d"), "section.d", InputsFileError),
        (lambda d: d["section"].__setitem__("shape", "oval"), "section.shape", InputsFileError),
        (lambda d: d["material"].__setitem__("E", Q_(10, "kN")), "material.E", DimensionError),
        (lambda d: d["loads"][0].__setitem__("w", Q_(5, "kN")), "loads[1].w", DimensionError),
        (lambda d: d["loads"][0].__setitem__("type", "snow"), "loads[1].type", InputsFileError),
        (lambda d: d["loads"][0].__setitem__("span", 4), "loads[1].span", InputsFileError),
        (
            lambda d: d["loads"].append(
                {"case": "L", "type": "point", "P": Q_(1, "kN"), "x": Q_(13, "m")}
            ),
            "loads[2].x",
            InputsFileError,
        ),
        (
            lambda d: d["combinations"]["strength"].__setitem__("W", 1.0),
            "combinations.strength.W",
            InputsFileError,
        ),
        (lambda d: d["combinations"].pop("service"), "combinations.service", InputsFileError),
        (lambda d: d.pop("material"), "material", InputsFileError),
    ],
)
def test_bad_inputs_name_the_key(mutate: Any, key: str, exc: type[Exception]) -> None:
    data = copy.deepcopy(_three_equal_spans())
    mutate(data)
    with pytest.raises(exc) as info:
        beam_inputs(data, path="b.inputs.toml")
    assert getattr(info.value, "name", None) == key
    assert key.split("[")[0].split(".")[0] in str(info.value)
    assert "b.inputs.toml" in str(info.value)


def test_unstable_supports_are_refused() -> None:
    data = _three_equal_spans()
    data["beam"]["supports"] = ["free", "roller", "free", "free"]
    with pytest.raises(UnstableStructureError):
        evaluate_beam(beam_inputs(data))


def test_no_loads_is_refused() -> None:
    data = _three_equal_spans()
    data["loads"] = []
    data["combinations"] = {"strength": {}, "service": {}}
    with pytest.raises(InputsFileError, match=r"combinations\.strength"):
        beam_inputs(data)


def test_a_case_missing_from_a_combination_is_refused() -> None:
    data = _three_equal_spans()
    data["loads"].append({"case": "L", "type": "uniform", "w": Q_(2, "kN/m")})
    data["combinations"]["strength"]["L"] = 1.6  # service has no factor for L
    with pytest.raises(InputsFileError, match=r"combinations\.service has no factor for") as info:
        beam_inputs(data)
    assert info.value.name == "combinations.service.L"


def _section_block(section: dict[str, Any]) -> tuple[Any, Any, Any]:
    from calcpack.working import Block, Sheet

    data = _three_equal_spans()
    data["section"] = section
    out = evaluate_beam(beam_inputs(data))
    sheet = Sheet("B9", auto_display=False)
    out.working(sheet)
    blocks = [s for s in sheet.steps if isinstance(s, Block) and "Section properties" in s.title]
    assert len(blocks) == 1
    return out, sheet, blocks[0]


def test_rectangle_beam_shows_its_properties_in_proportion() -> None:
    from calcpack.working import Derived, Table

    out, sheet, block = _section_block(
        {"shape": "rectangle", "b": Q_(90, "mm"), "d": Q_(360, "mm")}
    )
    assert not any(isinstance(s, Table) for s in block.steps)  # no parts table of one part
    shown = [s.name for s in block.steps if isinstance(s, Derived)]
    assert shown == ["A", "I_x", "S_x"]  # what the checks read, one line each
    # the bending check reads the section's own S_x: σ = M / S with S = b d²/6 (common practice)
    sigma = next(s for s in sheet.steps if getattr(s, "name", "") == "sigma_b")
    S = 0.09 * 0.36**2 / 6
    assert sigma.quantity.to("Pa").magnitude == pytest.approx(
        out.M_design.to("N*m").magnitude / S, rel=1e-9
    )
    assert not [s for s in sheet.steps if getattr(s, "name", "") in ("I_x", "S_x")]


def test_built_up_beam_section_takes_the_smaller_modulus() -> None:
    from calcpack.working import Derived

    tee = {"shape": "tee", "d": Q_(300, "mm"), "bf": Q_(150, "mm"), "tf": Q_(12, "mm"),
           "tw": Q_(8, "mm")}  # fmt: skip
    out, sheet, _ = _section_block(tee)
    S = next(s for s in sheet.steps if isinstance(s, Derived) and s.name == "S_x")
    assert S.quantity.to("mm**3").magnitude == pytest.approx(
        out.properties.Sx.to("mm**3").magnitude, rel=1e-9
    )
