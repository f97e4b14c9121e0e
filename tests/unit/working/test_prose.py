"""Prose that cites recorded values, symbols set in prose, and one unit per kind on a sheet."""

from __future__ import annotations

import re

import pytest

from calcpack.errors import InputError
from calcpack.units import ureg
from calcpack.working import Sheet
from calcpack.working.render import symbols_html


def _sheet(**kw: object) -> Sheet:
    return Sheet("prose", auto_display=False, **kw)  # type: ignore[arg-type]


def _visible(html: str) -> str:
    """The text a reader sees (tags dropped), as a PDF's text layer would carry it."""
    body = html.split("</style>")[-1]
    return re.sub(r"<[^>]+>", "", body).replace("\u00a0", " ")


def test_recorded_value_is_cited_with_symbol_and_sheet_precision() -> None:
    s = _sheet(system="US", sig_figs=3)
    s.given("R_A", 2606.4 * ureg.lbf, "reaction at A")
    t = s.text("The post carries {R_A} from the beam.")
    assert t.body == "The post carries R_A = 2610 lbf from the beam."
    seen = _visible(t.html())
    assert "R_A" not in seen
    assert "RA = 2610 lbf" in seen
    assert "<i>R</i><sub><i>A</i></sub>" in t.html()


def test_value_and_symbol_forms() -> None:
    s = _sheet(system="SI")
    s.given("M_max", 12.345 * ureg.kN * ureg.m)
    t = s.text("Moment {M_max:value}; symbol {M_max:symbol}; braces {{kept}}.")
    assert t.body == "Moment 12.3 kN·m; symbol M_max; braces {kept}."
    assert (
        t.tex_body
        == r"Moment $12.3\ \mathrm{kN{\cdot}m}$; symbol $M_{\mathrm{max}}$; braces {kept}."
    )


def test_keyword_quantity_is_shown_in_the_sheet_unit_for_its_kind() -> None:
    s = _sheet(system="US")
    s.given("P", 3200 * ureg.lbf)  # the sheet's forces are in lbf from here on
    t = s.text("The analysis gives {R_B}.", R_B=1.5 * ureg.kip)
    assert t.body == "The analysis gives R_B = 1500 lbf."
    # a kind the sheet has not settled is shown in the preset's unit
    t2 = s.text("and {M_B}", M_B=4000 * ureg.lbf * ureg.ft)
    assert t2.body == "and M_B = 4.00 kip·ft"


def test_math_in_prose_is_left_alone() -> None:
    s = _sheet()
    t = s.text(r"Uses $E' = C_M E$ with {n} plies.", n=3)
    assert t.body == "Uses $E' = C_M E$ with n = 3.00 plies."
    assert r"\(E' = C_M E\)" in t.html()


def test_unknown_placeholder_names_the_name_and_what_is_recorded() -> None:
    s = _sheet()
    s.given("L", 3 * ureg.m)
    with pytest.raises(InputError, match=r"\{R_A\}.*recorded values: L") as err:
        s.text("The reaction {R_A}.")
    assert err.value.name == "R_A"


def test_unused_keyword_and_bad_form_are_refused() -> None:
    s = _sheet()
    with pytest.raises(InputError, match=r"cites no \{R_A\}"):
        s.text("no placeholder", R_A=1 * ureg.kN)
    with pytest.raises(InputError, match="unknown form 'bold'"):
        s.text("{R_A:bold}", R_A=1 * ureg.kN)
    with pytest.raises(InputError, match="must be a calcpack value, a quantity or a number"):
        s.text("{R_A}", R_A="2 kN")


def test_cautions_and_assumptions_record_the_typeset_form() -> None:
    s = _sheet(system="SI")
    s.given("w", 5 * ureg.kN / ureg.m)
    c = s.caution("Keep {w} as the upper bound.")
    assert c.records() == {"cautions": [r"Keep $w = 5.00\ \mathrm{kN/m}$ as the upper bound."]}
    a = s.assume("Load {w:value} from the floor.")
    assert a.records() == {"assumptions": [r"Load $5.00\ \mathrm{kN/m}$ from the floor."]}


@pytest.mark.parametrize(
    ("prose", "html"),
    [
        ("F_c* = F_c C_D", "<i>F</i><sub><i>c</i></sub>* = <i>F</i><sub><i>c</i></sub> "
         "<i>C</i><sub><i>D</i></sub>"),
        ("R_A,max", "<i>R</i><sub><i>A</i>,max</sub>"),
        ("h/t_w", "h/<i>t</i><sub><i>w</i></sub>"),
        ("sigma_b", "σ<sub><i>b</i></sub>"),
        ("F_cperp", "<i>F</i><sub><i>c</i>⊥</sub>"),
        ("F_c,star", "<i>F</i><sub><i>c</i></sub>*"),
        ("E_min (wet)", "<i>E</i><sub>min</sub> (wet)"),
        # paths and dotted names are not symbols
        ("sheets/01_loads.ipynb", "sheets/01_loads.ipynb"),
        ("see notes_v2.txt", "see notes_v2.txt"),
    ],
)  # fmt: skip
def test_symbol_names_in_prose_are_set_as_symbols(prose: str, html: str) -> None:
    assert symbols_html(prose) == html


def test_descriptions_and_table_headings_carry_no_raw_names() -> None:
    s = _sheet(system="US")
    g = s.given("F_b", 900 * ureg.psi, "reference F_b, Table 4A")
    t = s.table(["Case", "R_A,max"], [["D", 1.2 * ureg.kip]])
    for step in (g, t):
        assert not re.search(r"[A-Za-z]_[A-Za-z]", _visible(step.html()))


def test_one_unit_per_kind_on_a_sheet() -> None:
    s = _sheet(system="US")
    s.given("P_D", 2.5 * ureg.kip)
    later = s.given("P_L", 800 * ureg.lbf)  # entered in lbf, shown in the sheet's kip
    assert later.display_unit == ureg.kip
    assert later.result_text() == "0.800 kip"
    asked = s.given("P_S", 800 * ureg.lbf, unit="lbf")  # a step may ask otherwise
    assert asked.display_unit == ureg.lbf
    d = s.derive("R", later + s["P_D"])
    assert d.display_unit == ureg.kip
    table = s.table(["load"], [[1500 * ureg.lbf]])
    assert "1.50 kip" in table.text()


def test_sheet_units_declared_up_front() -> None:
    s = _sheet(system="US", units=["lbf", "lbf*ft", "plf"])
    assert s.given("P", 2.5 * ureg.kip).result_text() == "2500 lbf"
    assert s.given("w", 0.2 * ureg.klf).result_text() == "200 plf"
    with pytest.raises(InputError, match="numbers and temperatures keep their own"):
        _sheet(units=["degF"])


def test_analysis_blocks_follow_the_sheet_unit() -> None:
    from calcpack.working import Block, Derived

    s = _sheet(system="US")
    s.given("P", 500 * ureg.lbf)
    block = Block([Derived("R_A", 1.25 * ureg.kip, "reaction")], title="reactions")
    s.add(block)
    (inner,) = block.steps
    assert isinstance(inner, Derived)
    assert inner.display_unit == ureg.lbf
    assert inner.result_text() == "1250 lbf"


def test_markdown_cells_set_symbols_but_not_code_or_math() -> None:
    from calcpack.package.convert import _cp_markdown

    html = _cp_markdown("The C_b values, $M_{max}$, `F_y` and b_f/2t_f.")
    assert "<i>C</i><sub><i>b</i></sub>" in html
    assert "<code>F_y</code>" in html  # code is left as written
    assert r"\(M_{max}\)" in html  # math is typeset later, from its TeX
    assert "<i>b</i><sub><i>f</i></sub>/2<i>t</i><sub><i>f</i></sub>" in html
