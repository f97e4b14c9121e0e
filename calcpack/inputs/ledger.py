"""A deck ledger connection described in an inputs file: its fastener spacing from the joist
reactions to NDS 2018 (see :func:`calcpack.checks.nds.ledger.check_deck_ledger`).

Layout (see ``templates/sheets/deck_ledger.inputs.toml``)::

    [ledger]
    mark = "LG1"
    fastener = "bolt"             # bolt or lag screw
    diameter = "0.5 in"           # a diameter of NDS 2018 Appendix L (1/4 to 1 in.)
    length = "4 in"               # under the head
    ledger_species = "Southern Pine"
    ledger_thickness = "1.5 in"
    ledger_depth = "9.25 in"
    rim_species = "Douglas Fir-Larch"
    rim_thickness = "1.5 in"
    rim_depth = "9.25 in"
    spacing = "16 in"             # on centre along the ledger
    rows = 2                      # 1, or 2 staggered
    top = "2 in"                  # top of ledger to the upper line
    bottom = "2 in"               # bottom of ledger to the lower line
    end = "2 in"                  # end of ledger to the first fastener

    [load]
    R = "400 lbf"                 # joist reaction on the ledger (ASD)
    joist_spacing = "16 in"
    combination = "D + L"
    service = "wet"               # moisture in service: dry or wet
    duration = "ten years"        # load duration (NDS 2018 Table 2.3.2)

:func:`ledger_inputs` validates (errors name the key), :func:`evaluate_ledger` runs the check.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from fractions import Fraction
from pathlib import Path
from typing import Any

from calcpack.checks.base import MemberChecks
from calcpack.checks.nds.connection import ConnectionService
from calcpack.checks.nds.dowel import WoodMember, nds_fastener
from calcpack.checks.nds.ledger import DeckLedger, check_deck_ledger
from calcpack.errors import InputError
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, refuse_unknown_keys
from calcpack.units import Quantity

__all__ = ["LedgerCase", "evaluate_ledger", "ledger_inputs"]

_LENGTH = Spec("[length]", positive=True)
_LENGTHS = ("ledger_depth", "spacing", "top", "bottom", "end")

LAYOUT = Table(
    {
        "ledger": Table(
            dict.fromkeys(
                (
                    "mark",
                    "fastener",
                    "diameter",
                    "length",
                    "ledger_species",
                    "ledger_thickness",
                    "rim_species",
                    "rim_thickness",
                    "rim_depth",
                    "rows",
                    *_LENGTHS,
                )
            )
        ),
        "load": Table(dict.fromkeys(("R", "joist_spacing", "combination", "service", "duration"))),
    }
)
"""The keys a deck ledger inputs file may hold (see the module notes)."""


@dataclass(frozen=True)
class LedgerCase:
    """A validated ledger and its load."""

    mark: str
    ledger: DeckLedger
    R: Quantity
    joist_spacing: Quantity
    service: ConnectionService
    combination: str


def _where(path: Path | str | None) -> str:
    return f"{path}: " if path else ""


def _named(exc: InputError, table: str, path: Path | str | None) -> InputsFileError:
    key = f"{table}.{exc.name}" if exc.name else table
    return InputsFileError(
        f"{_where(path)}value {key}: {exc}", name=key, value=exc.value, expected=exc.expected
    )


def ledger_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> LedgerCase:
    """Validate the ``[ledger]`` and ``[load]`` tables (every error names its key)."""
    refuse_unknown_keys(data, LAYOUT, path=path)
    t = data.get("ledger")
    ld = data.get("load")
    for name, table in (("ledger", t), ("load", ld)):
        if not isinstance(table, Mapping):
            raise InputsFileError(
                f"{_where(path)}no [{name}] table", name=name, value=table, expected="a table"
            )
    assert isinstance(t, Mapping)
    assert isinstance(ld, Mapping)

    def get(table: Mapping[str, Any], section: str, key: str, spec: Spec | str) -> Any:
        return require_input(table.get(key), spec, f"{section}.{key}", path=path)

    kind = get(t, "ledger", "fastener", Spec("text", choices=("bolt", "lag screw")))
    diameter = get(t, "ledger", "diameter", _LENGTH)
    inches = Fraction(float(diameter.to("inch").magnitude)).limit_denominator(16)
    try:
        fastener = nds_fastener(f"{inches} in. {kind}", length=get(t, "ledger", "length", _LENGTH))
    except InputError as exc:
        if isinstance(exc, InputsFileError):
            raise
        raise InputsFileError(
            f"{_where(path)}value ledger.diameter: no {kind} of {diameter:~P} in NDS 2018 "
            f"Appendix L ({exc})",
            name="ledger.diameter",
            value=diameter,
            expected="1/4 to 1 in. in steps of 1/16 or 1/8 in.",
        ) from None
    members = {}
    for part, table_key in (("ledger", "ledger"), ("rim", "support")):
        try:
            members[table_key] = WoodMember(
                get(t, "ledger", f"{part}_thickness", _LENGTH),
                get(t, "ledger", f"{part}_species", "text"),
            )
        except InputError as exc:
            if isinstance(exc, InputsFileError):
                raise
            raise InputsFileError(
                f"{_where(path)}value ledger.{part}_species: {exc}",
                name=f"ledger.{part}_species",
                value=t.get(f"{part}_species"),
                expected=exc.expected,
            ) from None
    lengths = {k: get(t, "ledger", k, _LENGTH) for k in _LENGTHS}
    rows = int(get(t, "ledger", "rows", Spec("number", positive=True)))
    try:
        ledger = DeckLedger(
            fastener,
            members["ledger"],
            members["support"],
            support_depth=get(t, "ledger", "rim_depth", _LENGTH),
            rows=rows,
            **lengths,
        )
    except InputError as exc:
        raise _named(exc, "ledger", path) from None
    service = ConnectionService(
        duration=get(ld, "load", "duration", "text"),
        service=get(ld, "load", "service", Spec("text", choices=("dry", "wet"))),
    )
    return LedgerCase(
        str(t.get("mark", "LG1")),
        ledger,
        get(ld, "load", "R", Spec("[force]", positive=True)),
        get(ld, "load", "joist_spacing", _LENGTH),
        service,
        str(ld.get("combination", "given")),
    )


def evaluate_ledger(case: LedgerCase) -> MemberChecks:
    """The deck ledger check (NDS 2018 ASD) for the case's joist reaction."""
    return check_deck_ledger(
        case.ledger,
        R=case.R,
        joist_spacing=case.joist_spacing,
        service=case.service,
        mark=case.mark,
        combination=case.combination,
    )
