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
