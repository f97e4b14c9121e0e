"""The record and manifest contract: one verdict rule, records and manifests round-trip."""

from __future__ import annotations

import json
import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcpack.contract import (
    MANIFEST_FORMAT,
    PASS_TOLERANCE,
    RECORDS_MIMETYPE,
    CheckRecord,
    Manifest,
    Record,
    Verdict,
    check_sort_key,
    collect_records,
    diff_manifests,
    passes,
)
from calcpack.errors import VerificationError


def test_verdict_words_are_the_strings_written_to_json() -> None:
    assert [str(v) for v in Verdict] == ["OK", "NOT OK", "NOT COVERED"]
    assert json.dumps([Verdict.NOT_OK]) == '["NOT OK"]'
    assert Verdict.parse("NOT OK") is Verdict.NOT_OK
    assert Verdict.parse("fine") is None


def test_one_pass_rule_with_its_tolerance() -> None:
    assert passes(1.0)
    assert passes(1.0 + PASS_TOLERANCE / 2)
    assert not passes(1.0 + 10 * PASS_TOLERANCE)
    assert Verdict.of(1.0) is Verdict.OK
    assert Verdict.of(1.001) is Verdict.NOT_OK
    assert Verdict.of(None) is Verdict.NOT_COVERED
    assert Verdict.of(math.nan) is Verdict.NOT_COVERED


@given(st.floats(min_value=0.0, max_value=10.0, allow_nan=False))
def test_verdict_of_agrees_with_passes(u: float) -> None:
    assert (Verdict.of(u) is Verdict.OK) == passes(u)


def test_the_same_rule_reads_a_check_without_a_verdict() -> None:
    # u = 1 + 1e-13 passes (rounding), as on the sheet; the reader once used u <= 1.0
    rec = CheckRecord.from_json({"name": "M", "demand": 1.0 + 1e-13, "capacity": 1.0})
    assert rec.verdict == Verdict.OK
    assert rec.utilisation == pytest.approx(1.0)
    over = CheckRecord.from_json({"name": "M", "demand": 2.0, "capacity": 1.0})
    assert over.verdict == Verdict.NOT_OK
    none = CheckRecord.from_json({"name": "M"})
    assert none.verdict == Verdict.NOT_COVERED


def test_records_round_trip_through_json() -> None:
    value = Record("M_u", "M_u", 12.5, "kN*m", "moment", "derived")
    assert Record.from_json(json.loads(json.dumps(value.to_json()))) == value
    check = CheckRecord("Bending", "B1", 10.0, 20.0, "kN*m", 0.5, Verdict.OK, "F2", "1.2D", "")
    assert CheckRecord.from_json(json.loads(json.dumps(check.to_json()))) == check


def test_collect_records_reads_the_mimetype_in_output_order() -> None:
    payload = {
        "values": [{"name": "L", "value": 3.0, "unit": "m", "kind": "given"}],
        "checks": [{"name": "Bending", "demand": 3.0, "capacity": 2.0, "unit": "kN*m"}],
        "assumptions": ["Simply supported", "  "],
    }
    nb = {
        "cells": [
            {"cell_type": "markdown"},
            {"cell_type": "code", "outputs": [{"data": {RECORDS_MIMETYPE: json.dumps(payload)}}]},
        ]
    }
    records = collect_records(nb)
    assert records.values[0]["symbol"] == "L"
    assert records.checks[0]["verdict"] == "NOT OK"
    assert records.checks[0]["utilisation"] == pytest.approx(1.5)
    assert records.assumptions == ("Simply supported",)


def test_check_sort_key_puts_the_worst_first() -> None:
    checks = [
        {"verdict": "OK", "utilisation": 0.9},
        {"verdict": "NOT COVERED", "utilisation": None},
        {"verdict": "NOT OK", "utilisation": 1.2},
        {"verdict": "NOT OK", "utilisation": 1.5},
    ]
    ordered = sorted(checks, key=check_sort_key)
    assert [c["utilisation"] for c in ordered] == [1.5, 1.2, None, 0.9]


def _manifest(m_value: float) -> Manifest:
    sheet = {
        "number": "1",
        "title": "Lintel",
        "path": "sheets/01.ipynb",
        "values": [{"name": "M", "value": m_value, "unit": "kN*m", "kind": "derived"}],
        "checks": [],
    }
    return Manifest(
        sheets=(sheet,),
        calcpack_version="0",
        project={"revision": "A"},
        extra={"later_field": [1, 2]},
    )


def test_manifest_round_trips_and_keeps_unknown_fields() -> None:
    m = _manifest(1.0)
    data = json.loads(m.to_bytes())
    assert data["format"] == MANIFEST_FORMAT
    assert list(data)[:2] == ["format", "calcpack_version"]
    assert "files" not in data  # fields left None are not written
    back = Manifest.from_json(data)
    assert back.to_json() == data
    assert back.version == 1
    assert back.extra == {"later_field": [1, 2]}


def test_manifest_refuses_what_is_not_one() -> None:
    with pytest.raises(VerificationError, match="format = 'other/1'"):
        Manifest.from_json({"format": "other/1"}, "x.json")
    with pytest.raises(VerificationError, match="not a JSON object"):
        Manifest.from_json([1], "x.json")
    with pytest.raises(VerificationError, match="unreadable"):
        Manifest.from_bytes(b"{nope", "x.json")


def test_comparison_accepts_manifests_and_their_json() -> None:
    diff = diff_manifests(_manifest(1.0), _manifest(2.0).to_json())
    assert [(c.kind, c.name, c.old, c.new) for c in diff.changes] == [
        ("result", "M", "1 kN*m", "2 kN*m")
    ]
    assert diff_manifests(_manifest(1.0), _manifest(1.0)).empty
