"""Records from sheet outputs, number formatting and the worst-first order of checks."""

from __future__ import annotations

import json

import nbformat
import pytest

from calcpack.package.document import format_sig
from calcpack.package.records import RECORDS_MIMETYPE, check_sort_key, collect_records


def _notebook(*payloads: object) -> nbformat.NotebookNode:
    nb = nbformat.v4.new_notebook()
    cell = nbformat.v4.new_code_cell("x")
    cell.outputs = [
        nbformat.v4.new_output("display_data", data={RECORDS_MIMETYPE: p, "text/plain": "x"})
        for p in payloads
    ]
    nb.cells = [nbformat.v4.new_markdown_cell("# T"), cell]
    return nb


def test_records_are_collected_in_order_without_duplicates() -> None:
    nb = _notebook(
        {
            "values": [{"name": "L", "value": 3.2, "unit": "m", "kind": "given"}],
            "assumptions": ["Bearing 100 mm"],
        },
        json.dumps(
            {
                "checks": [
                    {
                        "name": "Bending",
                        "demand": 5.0,
                        "capacity": 10.0,
                        "unit": "MPa",
                        "verdict": "OK",
                    }
                ],
                "assumptions": ["Bearing 100 mm"],
                "cautions": ["Confirm grade"],
            }
        ),
    )
    records = collect_records(nb)
    assert [v["name"] for v in records.values] == ["L"]
    assert records.values[0]["value"] == 3.2
    assert records.assumptions == ("Bearing 100 mm",)
    assert records.cautions == ("Confirm grade",)
    check = records.checks[0]
    assert check["utilisation"] == pytest.approx(0.5)  # demand / capacity when not given
    assert check["verdict"] == "OK"


def test_missing_verdict_is_derived_and_nan_dropped() -> None:
    nb = _notebook(
        {
            "checks": [
                {"name": "A", "demand": 12.0, "capacity": 10.0},
                {"name": "B", "demand": float("nan"), "capacity": 10.0},
            ]
        }
    )
    a, b = collect_records(nb).checks
    assert a["verdict"] == "NOT OK"
    assert a["utilisation"] == pytest.approx(1.2)
    assert b["demand"] is None
    assert b["verdict"] == "NOT COVERED"


def test_worst_check_first() -> None:
    checks = [
        {"verdict": "OK", "utilisation": 0.5},
        {"verdict": "NOT OK", "utilisation": 1.1},
        {"verdict": "NOT COVERED", "utilisation": None},
        {"verdict": "OK", "utilisation": 0.9},
        {"verdict": "NOT OK", "utilisation": 1.4},
    ]
    ordered = sorted(checks, key=check_sort_key)
    assert [(c["verdict"], c["utilisation"]) for c in ordered] == [
        ("NOT OK", 1.4),
        ("NOT OK", 1.1),
        ("NOT COVERED", None),
        ("OK", 0.9),
        ("OK", 0.5),
    ]


@pytest.mark.parametrize(
    ("value", "text"),
    [
        (4.3647, "4.36"),
        (864000.0, "864\u2009000"),
        (0.0012345, "0.00123"),
        (11.0, "11.0"),
        (-2.5, "\u22122.50"),
        (0.0, "0"),
        (None, "—"),
        (1.5e9, "1.50×10⁹"),
    ],
)
def test_three_significant_figures(value: float | None, text: str) -> None:
    """The summary writes numbers with the working's one formatter (grouped digits, true
    minus, powers of ten in engineering steps)."""
    assert format_sig(value) == text
