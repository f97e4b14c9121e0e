"""Revisions that tell the truth: every load (magnitude and position, by case) and every given
value is recorded as an input, values carried from an analysis as results; the comparison is
made at full precision and shows values at the sheet's significant figures.

The manifests here are made the way the build makes them (each sheet's records, see
calcpack.working.Sheet.records) and compared with calcpack.contract.diff_manifests.
"""

from __future__ import annotations

from typing import Any

import pytest

from calcpack import Beam, Sheet, analyse_combinations
from calcpack.analysis.beam import solve_beam, solve_cases
from calcpack.analysis.beam.model import Pin, Roller
from calcpack.checks.elastic import check_deflection
from calcpack.combinations import asce7_strength
from calcpack.contract import diff_manifests
from calcpack.loads import PointLoad, UniformLoad
from calcpack.units import Q_, ureg

m, kN = ureg.m, ureg.kN


def _beam(w_live: float = 3.0, x_point: float = 2.0, P: float = 5.0) -> Beam:
    return Beam(
        length=6 * m,
        supports=[Pin(0 * m), Roller(6 * m)],
        EI=Q_(2e4, "kN*m**2"),
        name="B1",
        loads=[
            UniformLoad(w=4 * kN / m, case="D"),
            UniformLoad(w=w_live * kN / m, case="L"),
            PointLoad(x=x_point * m, P=P * kN, case="L"),
        ],
    )


def _manifest(sheet: Sheet, rev: str) -> dict[str, Any]:
    records = sheet.records()
    return {
        "project": {"revision": rev},
        "sheets": [
            {
                "path": "sheets/01.ipynb",
                "title": "Beam B1",
                "values": records.get("values", []),
                "checks": records.get("checks", []),
            }
        ],
    }


def _sheet(beam: Beam, sig: int = 3) -> Sheet:
    s = Sheet("Beam B1", system="SI", sig_figs=sig)
    analyse_combinations(solve_cases(beam), asce7_strength()).add_to(s, figures=False)
    return s


def test_a_changed_line_load_is_an_input_change() -> None:
    diff = diff_manifests(_manifest(_sheet(_beam()), "A"), _manifest(_sheet(_beam(3.5)), "B"))
    inputs = {c.name: c for c in diff.of_kind("input")}
    assert set(inputs) == {"B1 load 2 (L): w"}
    assert inputs["B1 load 2 (L): w"].old == "3.00 kN/m"
    assert inputs["B1 load 2 (L): w"].new == "3.50 kN/m"


def test_a_moved_point_load_is_an_input_change() -> None:
    diff = diff_manifests(
        _manifest(_sheet(_beam()), "A"), _manifest(_sheet(_beam(x_point=2.5)), "B")
    )
    assert [c.name for c in diff.of_kind("input")] == ["B1 load 3 (L): x"]


def test_each_load_is_recorded_by_case_with_magnitude_and_position() -> None:
    values = _sheet(_beam()).records()["values"]
    loads = {v["name"]: v for v in values if v["name"].startswith("B1 load")}
    assert loads["B1 load 1 (D): w"]["value"] == pytest.approx(4.0)
    assert loads["B1 load 1 (D): end"]["value"] == pytest.approx(6.0)
    assert loads["B1 load 3 (L): x"]["value"] == pytest.approx(2.0)
    assert loads["B1 load 3 (L): P"]["unit"] == "kN"
    assert {v["kind"] for v in loads.values()} == {"given"}


def test_the_beam_working_records_its_loads_too() -> None:
    s = Sheet("Beam B1", system="SI")
    s.add(solve_beam(_beam()).working())
    names = {v["name"] for v in s.records()["values"] if v["kind"] == "given"}
    assert {"B1 load 2 (L): w", "B1 load 3 (L): P"} <= names


def test_analysis_results_carried_into_a_check_are_results_not_inputs() -> None:
    s = Sheet("Beam B1", system="SI")
    check_deflection(member="B1", demand=solve_cases(_beam())["L"], span=6 * m).add_to(s)
    kinds = {v["name"]: v["kind"] for v in s.records()["values"]}
    assert kinds["delta"] == "derived"
    assert kinds["n_lim"] == "given"


def test_a_cut_working_records_reactions_as_results() -> None:
    s = Sheet("Beam B1", system="SI")
    s.add(solve_beam(_beam()).cut(Q_(3, "m")))
    reactions = [v for v in s.records()["values"] if v["name"].startswith("R_")]
    assert reactions
    assert {v["kind"] for v in reactions} == {"derived"}


def test_changes_below_display_precision_are_found() -> None:
    # 3.0001 kN/m shows as 3.00 at three figures but is a change all the same
    diff = diff_manifests(_manifest(_sheet(_beam()), "A"), _manifest(_sheet(_beam(3.0001)), "B"))
    (change,) = diff.of_kind("input")
    assert change.old == change.new == "3.00 kN/m"


def test_values_are_shown_at_the_sheets_significant_figures() -> None:
    def sheet(w: float) -> Sheet:
        s = Sheet("Beam B1", system="SI", sig_figs=4)
        s.add(solve_beam(_beam(w)).working(sheet=s))
        return s

    diff = diff_manifests(_manifest(sheet(3.0), "A"), _manifest(sheet(3.25), "B"))
    change = {c.name: c for c in diff.of_kind("input")}["B1 load 2 (L): w"]
    assert (change.old, change.new) == ("3.000 kN/m", "3.250 kN/m")
    results = diff.of_kind("result")
    assert results
    for c in results:
        number = c.new.split(" ")[0].replace("\u2009", "").lstrip("−")
        assert len(number.replace(".", "").lstrip("0")) == 4, c.new


def test_legacy_records_without_sig_still_compare() -> None:
    old = _manifest(_sheet(_beam()), "A")
    new = _manifest(_sheet(_beam(3.5)), "B")
    for manifest in (old, new):
        for v in manifest["sheets"][0]["values"]:
            v.pop("sig", None)
    (change,) = diff_manifests(old, new).of_kind("input")
    assert change.new == "3.5 kN/m"  # up to six figures: the sheet's were not recorded
