"""A pad footing under a post or column described in an inputs file: soil pressure under the
ASCE/SEI 7-16 allowable-stress combinations and the concrete to ACI 318-19 under the strength
combinations.

Layout (see ``templates/sheets/footing.inputs.toml``)::

    [footing]
    mark = "F1"
    shape = "square"            # square, rectangular or round
    B = "3 ft"                  # width (diameter for round)
    h = "12 in"                 # thickness
    soil_cover = "12 in"        # soil over the footing
    gamma_soil = "110 lbf/ft**3"

    [column]
    c1 = "5.5 in"               # post or column size (c2 for a rectangular one)
    support = "base plate"      # concrete, masonry or base plate
    plate1 = "8 in"
    plate2 = "8 in"

    [soil]
    q_allow = "2000 psf"
    source = "IBC 2018 Table 1806.2, class 5 (presumptive)"   # or the geotechnical report

    [concrete]
    f_c = "3000 psi"
    bar = "#4"
    reinforced = true

    [[loads]]                   # by load case, unfactored
    case = "D"
    P = "6 kip"

:func:`footing_inputs` validates (errors name the key); :func:`evaluate_footing` runs
:func:`calcpack.check_footing_soil` and :func:`calcpack.check_aci_footing`.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.checks.aci318 import ACIFootingDesign, check_aci_footing
from calcpack.checks.base import MemberChecks
from calcpack.combinations import asce7_allowable_stress, asce7_strength
from calcpack.errors import InputError
from calcpack.foundations import AllowableBearing, Column, Footing, FootingLoad, check_footing_soil
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, Tables, refuse_unknown_keys

__all__ = ["FootingCase", "FootingOutcome", "evaluate_footing", "footing_inputs"]

SHAPES = ("square", "rectangular", "round")
SUPPORTS = ("concrete", "masonry", "base plate")
_LENGTH = Spec("[length]", positive=True)
_LOAD_DIMS = (
    ("P", "[force]"),
    ("Vx", "[force]"),
    ("Vy", "[force]"),
    ("Mx", "[force]*[length]"),
    ("My", "[force]*[length]"),
)

LAYOUT = Table(
    {
        "footing": Table(
            dict.fromkeys(("mark", "shape", "B", "L", "h", "soil_cover", "gamma_soil"))
        ),
        "column": Table(dict.fromkeys(("c1", "c2", "support", "plate1", "plate2"))),
        "soil": Table(dict.fromkeys(("q_allow", "source"))),
        "concrete": Table(dict.fromkeys(("f_c", "bar", "reinforced"))),
        "loads": Tables(Table(dict.fromkeys(("case", *(n for n, _ in _LOAD_DIMS))))),
    }
)
"""The keys a footing inputs file may hold (see the module notes)."""


@dataclass(frozen=True)
class FootingCase:
    """A validated footing, its loads by case, the soil and the concrete."""

    footing: Footing
    loads: Mapping[str, FootingLoad]
    bearing: AllowableBearing
    design: ACIFootingDesign


@dataclass(frozen=True)
class FootingOutcome:
    """Soil checks (service) and concrete checks (strength)."""

    case: FootingCase
    soil: MemberChecks
    concrete: MemberChecks

    @property
    def checks(self) -> tuple[MemberChecks, ...]:
        return (self.soil, self.concrete)


def _table(data: Mapping[str, Any], name: str, path: Path | str | None) -> Mapping[str, Any]:
    t = data.get(name)
    if not isinstance(t, Mapping):
        raise InputsFileError(
            f"{path or 'inputs'}: no [{name}] table", name=name, value=t, expected="a table"
        )
    return t


def _rename(exc: InputError, table: str, path: Path | str | None) -> InputsFileError:
    key = f"{table}.{exc.name}" if exc.name else table
    return InputsFileError(
        f"{path or 'inputs'}: value {key}: {exc}", name=key, value=exc.value, expected=exc.expected
    )


def footing_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> FootingCase:
    """Validate the tables of a footing inputs file (every error names its key)."""
    refuse_unknown_keys(data, LAYOUT, path=path)
    f = _table(data, "footing", path)
    c = _table(data, "column", path)
    s = _table(data, "soil", path)
    k = _table(data, "concrete", path)
    shape = require_input(f.get("shape"), Spec("text", choices=SHAPES), "footing.shape", path=path)
    support = require_input(
        c.get("support", "concrete"), Spec("text", choices=SUPPORTS), "column.support", path=path
    )
    col_kw = {
        n: require_input(c[n], _LENGTH, f"column.{n}", path=path)
        for n in ("c1", "c2", "plate1", "plate2")
        if n in c
    }
    try:
        column = Column(support=support, **col_kw)
    except InputError as exc:
        raise _rename(exc, "column", path) from None
    fkw = {
        n: require_input(f[n], _LENGTH, f"footing.{n}", path=path)
        for n in ("B", "L", "h")
        if n in f
    }
    if "soil_cover" in f:
        fkw["soil_cover"] = require_input(
            f["soil_cover"], Spec("[length]", nonnegative=True), "footing.soil_cover", path=path
        )
    if "gamma_soil" in f:
        fkw["gamma_soil"] = require_input(
            f["gamma_soil"], Spec("[force]/[length]**3", positive=True), "footing.gamma_soil"
        )
    try:
        footing = Footing(shape, column=column, mark=str(f.get("mark", "F1")), **fkw)
    except InputError as exc:
        raise _rename(exc, "footing", path) from None
    q = require_input(
        s.get("q_allow"), Spec("[pressure]", positive=True), "soil.q_allow", path=path
    )
    source = require_input(s.get("source"), "text", "soil.source", path=path)
    try:
        bearing = AllowableBearing(q, source)
    except InputError as exc:
        raise _rename(exc, "soil", path) from None
    fc = require_input(k.get("f_c"), Spec("[pressure]", positive=True), "concrete.f_c", path=path)
    try:
        design = ACIFootingDesign(
            f_c=fc,
            bar=str(k.get("bar", "#5")),
            reinforced=bool(k.get("reinforced", True)),
        )
    except InputError as exc:
        raise _rename(exc, "concrete", path) from None
    rows = data.get("loads")
    if not isinstance(rows, list) or not rows:
        raise InputsFileError(
            f"{path or 'inputs'}: no [[loads]] tables (one per load case)",
            name="loads",
            value=rows,
            expected="at least one [[loads]] table",
        )
    loads: dict[str, FootingLoad] = {}
    for i, row in enumerate(rows, start=1):
        case = require_input(row.get("case"), "text", f"loads[{i}].case", path=path)
        vals = {
            n: require_input(row[n], dim, f"loads[{i}].{n}", path=path)
            for n, dim in _LOAD_DIMS
            if n in row
        }
        if case in loads:
            raise InputsFileError(
                f"{path or 'inputs'}: load case {case!r} is given twice (loads[{i}].case)",
                name=f"loads[{i}].case",
                value=case,
                expected="one [[loads]] table per case",
            )
        try:
            loads[case] = FootingLoad(**vals)
        except InputError as exc:
            raise _rename(exc, f"loads[{i}]", path) from None
    return FootingCase(footing, loads, bearing, design)


def evaluate_footing(case: FootingCase) -> FootingOutcome:
    """Soil pressure under the ASCE/SEI 7-16 allowable-stress combinations (§2.4) and the
    concrete to ACI 318-19 under the strength combinations (§2.3)."""
    soil = check_footing_soil(case.footing, case.loads, asce7_allowable_stress(), case.bearing)
    concrete = check_aci_footing(case.footing, case.loads, asce7_strength(), case.design)
    return FootingOutcome(case, soil, concrete)
