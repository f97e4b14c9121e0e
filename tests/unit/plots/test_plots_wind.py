"""The envelope zone plan reads the result and labels each zone with its pressure."""

from __future__ import annotations

from calcpack.loads.wind_asce7 import WindSiteASCE7
from calcpack.loads.wind_asce7_lowrise import LowRiseBuildingASCE7, envelope_wind_asce7
from calcpack.plots.labels import number_label
from calcpack.plots.wind import WindZonePlan
from calcpack.units import Q_


def test_zone_plan_labels_the_end_zone_pressure() -> None:
    site = WindSiteASCE7(Q_(115, "mph"), "map", "C")
    b = LowRiseBuildingASCE7(Q_(20, "ft"), Q_(40, "ft"), Q_(80, "ft"), Q_(18.4, "deg"))
    e = envelope_wind_asce7(site, b)
    for case in ("A", "B"):
        plan = WindZonePlan(e, b.B, b.L, case=case)
        p = e.pressures[(case, "2E", "+GCpi")].magnitude
        # the one number formatter of the working (a true minus sign, the sheet's figures)
        assert plan._label("2E") == f"2E\n{number_label(p, signed=True)}"
        assert "<svg" in plan.svg()


def _title(fig: object) -> str:
    return str(fig.axes[0].get_title())  # type: ignore[attr-defined]


def test_wind_figure_titles_write_units_by_the_one_formatter() -> None:
    """The unit in each wind figure's title is the working's unit text (the tables, prose and
    working write the same), never pint's own formatting."""
    from calcpack.loads.wind_asce7_cc_plan import cc_roof_plan_asce7
    from calcpack.loads.wind_asce7_directional import (
        DirectionalBuildingASCE7,
        directional_wind_asce7,
    )
    from calcpack.plots.labels import unit_label
    from calcpack.plots.wind_cc_plan import cc_plan_figure
    from calcpack.plots.wind_elevation import elevation_figure
    from calcpack.working.format import format_unit_text

    site = WindSiteASCE7(Q_(115, "mph"), "map", "C")
    low = LowRiseBuildingASCE7(Q_(18, "ft"), Q_(30, "ft"), Q_(60, "ft"), Q_(20, "deg"))
    envelope = envelope_wind_asce7(site, low)
    pressure = format_unit_text(envelope.qh.units)
    assert unit_label(envelope.qh.units) == unit_label(str(envelope.qh.units)) == pressure
    plan = WindZonePlan(envelope, low.B, low.L, case="A").figure()
    assert _title(plan).endswith(f"(pressures with +GCpi, {pressure})")
    cc = cc_roof_plan_asce7(site, low, area=Q_(20, "ft^2"))
    cc_pressure = format_unit_text(next(iter(cc.zones.values())).p_neg.units)
    assert _title(cc_plan_figure(cc)).endswith(f"A = 20.0 {format_unit_text(cc.area.units)} "
                                               f"({cc_pressure})")  # fmt: skip
    directional = directional_wind_asce7(
        site, DirectionalBuildingASCE7(Q_(20, "ft"), Q_(60, "ft"), Q_(40, "ft"), Q_(20, "deg"))
    )
    elevation = _title(elevation_figure(directional))
    assert elevation.startswith(
        f"Windward wall q_z profile and leeward wall ({format_unit_text(directional.qh.units)},"
    )
    for title in (_title(plan), _title(cc_plan_figure(cc)), elevation):
        assert "**" not in title
        assert "~" not in title
