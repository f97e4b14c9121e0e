"""One unit per kind of quantity on a sheet, for every kind, and one formatter for what it shows.

Unit conversions are pint's (the reference library); the families of units (spans in m or ft,
dimensions and deflections in mm or in, area loads in kPa or psf, stresses in MPa, psi or ksi,
moduli in GPa) are common practice.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.units import quantity_kind, ureg
from calcpack.working import Derived, Sheet
from calcpack.working.format import format_cell


def _sheet(**kw: object) -> Sheet:
    return Sheet("units", auto_display=False, **kw)  # type: ignore[arg-type]


def test_stresses_follow_the_first_stress_and_moduli_keep_their_own() -> None:
    s = _sheet(system="US")
    F_b = s.given("F_b", 900 * ureg.psi, "reference bending value")
    E = s.given("E", 1.6e6 * ureg.psi, "modulus of elasticity")
    f_v = s.given("f_v", 0.12 * ureg.ksi, "shear stress")  # entered in ksi, shown in psi
    assert f_v.result_text() == "120 psi"
    f_b = s.derive("f_b", F_b * 0.5)  # names no unit: the sheet's stress unit
    assert f_b.display_unit == ureg.psi
    assert E.result_text() == "1.60×10⁶ psi"
    si = _sheet(system="SI")
    si.given("E", 11 * ureg.GPa)
    strength = si.given("f_m", 24 * ureg.MPa)  # a stress, not a modulus: stays in MPa
    assert strength.result_text() == "24.0 MPa"
    # a modulus entered in a stress unit is of the stress kind
    assert si.given("E_2", 11000 * ureg.MPa).result_text() == "11\u2009000 MPa"


def test_lengths_keep_spans_apart_from_dimensions_and_deflections() -> None:
    s = _sheet(system="SI")
    s.given("L", 3.2 * ureg.m, "span")
    s.given("d", 360 * ureg.mm, "depth")
    L_2 = s.given("L_2", 12 * ureg.ft, "second span, from an imperial drawing")
    assert L_2.result_text() == "3.66 m"
    delta = s.given("delta", 0.5 * ureg.inch, "measured sag")
    assert delta.result_text() == "12.7 mm"
    lim = s.derive("delta_lim", s["L"] / 360, unit="mm")
    assert lim.result_text() == "8.89 mm"


def test_area_loads_keep_apart_from_stresses() -> None:
    s = _sheet(system="US")
    s.given("q_D", 15 * ureg.psf)
    s.given("F_c", 1350 * ureg.psi)
    q_L = s.given("q_L", 0.04 * ureg.ksf)  # a bearing-pressure unit: an area load
    assert q_L.result_text() == "40.0 psf"
    assert s.given("q_S", 1.2 * ureg.kPa).result_text() == "25.1 psf"


@pytest.mark.parametrize(
    ("system", "q", "q_text", "F_b", "f_text"),
    [
        ("US", 12 * ureg.psf, "12.0 psf", 900 * ureg.psi, "900 psi"),
        ("SI", 0.6 * ureg.kPa, "0.600 kPa", 24 * ureg.MPa, "24.0 MPa"),
    ],
)
def test_a_sheet_with_a_stress_shows_its_area_loads_as_area_loads(
    system: str, q: object, q_text: str, F_b: object, f_text: str
) -> None:
    """The loads-by-case table of a beam on a sheet that also shows a stress: the load per area
    of a tributary load is in psf (kPa), never the sheet's stress unit (12 psf is 83.3×10⁻⁶
    ksi)."""
    from calcpack.analysis.beam.load_table import load_records
    from calcpack.loads.self_weight import tributary_line_load

    s = _sheet(system=system)
    assert s.given("F_b", F_b, "reference bending value").result_text() == f_text
    load = tributary_line_load(q=q, width=16 * ureg.inch, case="D", label="deck dead")
    rows, records = load_records([load], member="J1", length=10 * ureg.ft, settings=s.settings)
    assert rows[0][3].startswith(f"q = {q_text},")
    recorded = {r.symbol: r for r in records}
    assert (recorded["q"].value, recorded["q"].unit) == (
        float(q_text.split()[0]),
        q_text.split()[1],
    )
    # the stress kind is untouched: a stress that names no unit is still in the stress unit
    assert s.settings.unit_for(2 * ureg.N / ureg.mm**2) == F_b.units  # type: ignore[attr-defined]


def test_a_pressure_is_shown_in_its_own_family_or_the_one_declared() -> None:
    from calcpack.errors import InputError
    from calcpack.working.format import format_unit_text

    us = _sheet(system="US").settings
    si = _sheet(system="SI").settings

    def shown(settings: object, q: object, **kw: str) -> str:
        return format_unit_text(settings.unit_for(q, **kw))  # type: ignore[attr-defined]

    assert shown(us, 12 * ureg.psf) == "psf"
    assert shown(us, 2 * ureg.ksf) == "psf"  # a bearing pressure is an area load
    assert shown(us, 900 * ureg.psi) == "ksi"
    assert shown(si, 2.4 * ureg.kN / ureg.m**2) == "kPa"
    assert shown(si, 11 * ureg.GPa) == "GPa"
    # the coherent SI unit, as an analysis writes any pressure, names no family
    assert shown(si, 3e6 * ureg.Pa) == "MPa"
    assert shown(si, 3e3 * ureg.Pa, family="area load") == "kPa"
    assert shown(us, 3e3 * ureg.Pa, family="area load") == "psf"
    with pytest.raises(InputError, match=r"family.*'span', 'dimension'.*area load"):
        us.unit_for(3 * ureg.m, family="area load")


def test_areas_and_moduli_of_sections_in_one_unit() -> None:
    s = _sheet(system="US")
    s.given("A", 13.875 * ureg.inch**2)
    assert s.given("A_2", 0.1 * ureg.ft**2).result_text() == "0.100 ft²"  # a plan area
    s.given("S", 21.4 * ureg.inch**3)
    assert s.given("S_2", 350 * ureg.cm**3).result_text() == "21.4 in³"
    s.given("I", 98.9 * ureg.inch**4)
    assert s.given("I_2", 4.1e7 * ureg.mm**4).result_text() == "98.5 in⁴"


def test_sheet_units_declare_any_kind_up_front() -> None:
    s = _sheet(system="US", units=["psi", "inch", "ft"])
    assert s.given("F_y", 50 * ureg.ksi).result_text() == "50\u2009000 psi"
    assert s.given("b", 38 * ureg.mm).result_text() == "1.50 in"
    assert s.given("L", 3 * ureg.m).result_text() == "9.84 ft"
    assert s.derive("F_half", s["F_y"] / 2).display_unit == ureg.psi


def test_a_table_shows_its_quantities_and_counts_the_sheet_way() -> None:
    s = _sheet(system="SI")
    s.given("L", 3.2 * ureg.m)
    s.given("x_0", 1200 * ureg.mm)
    table = s.table(
        ["Load", "x", "a", "w"], [[1, 3.6 * ureg.m, 0.36 * ureg.m, 1.5 * ureg.kN / ureg.m]]
    )
    cells = [c.strip() for c in table.text().splitlines()[-1].split("|")]
    # a load's number is a whole number; a position in m is a span's kind (m), 0.36 m too
    assert cells == ["1", "3.60 m", "0.360 m", "1.50 kN/m"]
    mm_table = s.table(["x"], [[360 * ureg.mm]])
    assert mm_table.text().splitlines()[-1].strip() == "360 mm"


def test_formatter_is_one_for_every_kind_of_cell() -> None:
    assert format_cell(3) == "3"
    assert format_cell(-2) == "−2"
    assert format_cell(7.800000000000001) == "7.80"
    assert format_cell(None) == ""
    assert format_cell(7.800000000000001 * ureg.m, 3) == "7.80 m"
    s = _sheet(system="US")
    s.given("P", 3.2 * ureg.kip)
    assert format_cell(480 * ureg.lbf, 3, s.settings) == "0.480 kip"


def test_numbers_and_temperatures_have_no_kind() -> None:
    assert quantity_kind(ureg.Unit("degree")) == ""
    assert quantity_kind(ureg.Unit("degF")) == ""
    assert quantity_kind(ureg.Unit("kip")) == quantity_kind(ureg.Unit("kN"))
    assert quantity_kind(ureg.Unit("psi")) != quantity_kind(ureg.Unit("psf"))
    assert quantity_kind(ureg.Unit("GPa")) != quantity_kind(ureg.Unit("MPa"))


_UNITS = ["m", "ft", "mm", "inch", "psf", "kPa", "psi", "MPa", "ksi", "kN", "kip", "lbf",
          "kN*m", "kip*ft", "plf", "kN/m", "mm**4", "inch**4"]  # fmt: skip


@given(
    first=st.sampled_from(_UNITS),
    later=st.sampled_from(_UNITS),
    value=st.floats(min_value=1e-3, max_value=1e6),
)
def test_a_value_shown_in_the_sheet_unit_is_the_value_entered(
    first: str, later: str, value: float
) -> None:
    # Property: settling a unit changes only how a value is shown, never the value itself;
    # a value of the first value's kind is shown in that value's unit when that unit is of the
    # sheet's system (a US unit on an SI sheet settles nothing), and never in a US unit.
    from calcpack.units import unit_system

    s = _sheet(system="SI")
    s.given("a", 1.0 * ureg(first))
    entered = value * ureg(later)
    shown = s.given("b", entered)
    assert shown.display_quantity.to(entered.units).magnitude == pytest.approx(value, rel=1e-12)
    same_kind = quantity_kind(ureg.Unit(first)) == quantity_kind(ureg.Unit(later))
    if same_kind and unit_system(ureg.Unit(first)) != "US":
        assert shown.display_unit == ureg.Unit(first)
    assert unit_system(shown.display_unit) != "US"
    assert isinstance(s.derive("c", shown * 2), Derived)


def test_a_zero_or_a_number_does_not_settle_a_kind() -> None:
    """A moment of 0 kN·m an analysis wrote in its own units does not make kN·m the US
    sheet's moment unit; the next moment is shown in the preset's kip·ft (pint converts)."""
    s = _sheet(system="US")
    s.given("M_0", 0 * ureg.kN * ureg.m, "moment at the base of a pin-based post")
    s.given("n", 3 * ureg.dimensionless, "bolts")
    assert not s.settings.kinds
    M = s.given("M_u", 12 * ureg.kip * ureg.ft)
    assert M.result_text() == "12.0 kip·ft"
    assert s.given("M_1", 13.56 * ureg.kN * ureg.m).result_text() == "10.0 kip·ft"


def test_a_value_in_the_other_systems_units_is_shown_in_the_sheets_and_settles_nothing() -> None:
    """What an analysis computed in SI reads in US units on a US sheet (and the other way
    round), whether or not its step named the unit; values the engineer wrote in the sheet's
    own system then settle their kinds as before. Conversions are pint's."""
    us = _sheet(system="US")
    B = us.given("B", 0.762 * ureg.m, "width", unit="m")  # a step naming an SI unit
    assert B.result_text() == "2.50 ft"
    assert us.given("gamma", 23.6 * ureg.kN / ureg.m**3).result_text() == "150 pcf"
    assert us.given("q", 71.8 * ureg.kPa).result_text() == "1500 psf"
    assert us.given("t", 152.4 * ureg.mm).result_text() == "6.00 in"
    assert not us.settings.kinds  # none of them spoke for its kind
    assert us.given("P", 850 * ureg.lbf).result_text() == "850 lbf"
    assert us.given("P_2", 1.2 * ureg.kip).result_text() == "1200 lbf"  # lbf settled
    si = _sheet(system="SI")
    assert si.given("w", 1 * ureg.klf).result_text() == "14.6 kN/m"
    assert si.given("d", 12 * ureg.inch).result_text() == "305 mm"
    assert si.derive("d_2", si["d"] * 2, unit="inch").result_text() == "610 mm"


def test_table_cells_in_the_other_systems_units_read_in_the_sheets() -> None:
    s = _sheet(system="US")
    assert format_cell(0 * ureg.kN * ureg.m, 3, s.settings) == "0 kip·ft"
    assert format_cell(26.6 * ureg.kPa, 3, s.settings) == "556 psf"
    assert format_cell(2.5 * ureg.kip, 3, s.settings) == "2.50 kip"  # its own system: kept


@given(
    magnitude=st.floats(min_value=1e-3, max_value=1e6),
    unit=st.sampled_from(["kN", "kN*m", "kN/m", "kPa", "MPa", "m", "mm", "mm**2", "kN/m**3"]),
)
def test_an_si_value_on_a_us_sheet_is_the_same_quantity_in_us_units(
    magnitude: float, unit: str
) -> None:
    """Whatever SI value a US sheet is given, it shows it in a US unit of the same dimension
    and the quantity is unchanged (the display converts; the record keeps full precision)."""
    from calcpack.units import unit_system

    s = _sheet(system="US")
    q = magnitude * ureg.Unit(unit)
    step = s.given("x", q)
    assert unit_system(step.display_unit) == "US"
    assert step.display_unit.dimensionality == q.dimensionality
    assert step.quantity.to(step.display_unit).to(q.units).magnitude == pytest.approx(magnitude)
    assert not s.settings.kinds


def test_a_footing_checked_on_a_us_sheet_reads_in_us_units_throughout() -> None:
    """The soil checks work in SI inside; on a US sheet every value, table cell and check reads
    in US units (the deck's pier sheet printed "0 kN·m" in its loads table and B in m)."""
    import re

    from calcpack.combinations import asce7_allowable_stress
    from calcpack.foundations import (
        AllowableBearing,
        Column,
        Footing,
        FootingLoad,
        SiteConditions,
        check_footing_soil,
    )
    from calcpack.units import Q_

    # Invented pier: 30 in round, 24 in deep, 150 pcf concrete, on 1500 psf soil.
    pier = Footing(
        "round",
        Q_(30, "inch"),
        Q_(24, "inch"),
        Column(Q_(5.5, "inch"), support="base plate", plate1=Q_(6, "inch")),
        kind="pier",
        gamma_concrete=Q_(150, "pcf"),
        gamma_soil=Q_(110, "pcf"),
        mark="PR-1",
    )
    loads = {"D": FootingLoad(P=Q_(0.18, "kip")), "L": FootingLoad(P=Q_(1.05, "kip"))}
    soil = check_footing_soil(
        pier,
        loads,
        asce7_allowable_stress(),
        AllowableBearing(Q_(1500, "psf"), "invented presumptive value"),
        site=SiteConditions(frost_depth=Q_(18, "inch")),
    )
    s = _sheet(system="US")
    soil.add_to(s)
    text = "\n".join(str(step) for step in s.steps)  # each step's plain-text working
    assert re.findall(r"\d (?:kN|kPa|MPa|m\b|mm\b|kN·m|kN/m)", text) == []
    assert "0 kip·ft" in text
    assert "B = 2.50 ft" in text
