"""A steel post or column described in an inputs file, checked to AISC 360-16 for each set of
required strengths, and searched for the lightest shape of its family that passes.

Layout (see ``templates/sheets/steel_column.inputs.toml``)::

    [member]
    mark = "P1"
    shape = "HSS4X4X1/4"        # AISC Shapes Database v16.0 designation
    grade = "ASTM A500 Gr. C"
    Fy = "50 ksi"
    method = "LRFD"             # LRFD or ASD (the forces below are of that method)
    Lcx = "9 ft"                # effective length K·L about x (§E2)
    Lcy = "9 ft"                # ... about y
    Lb = "9 ft"                 # unbraced length of the compression flange (§F)
    Cb = 1.0                    # lateral-torsional buckling modification factor (§F1)

    [[forces]]                  # one table per combination; P positive in compression
    combination = "1.2D + 1.6L"
    P = "24 kip"
    Mx = "0 kip*ft"
    My = "0 kip*ft"

:func:`member_inputs` validates the tables (every error names its key); :func:`evaluate_member`
runs :func:`calcpack.check_aisc_member` for each combination; :func:`lightest_member` ranks the
shapes of the same family. The member panel and the sheet's calc cells call the same functions.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any

from calcpack.checks.aisc360.member import check_aisc_member
from calcpack.checks.aisc360.member_data import MemberForces, SteelMember
from calcpack.checks.base import MemberChecks
from calcpack.errors import CalcpackError, InputError
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, Tables, refuse_unknown_keys
from calcpack.inputs.sized import force_tables, governing_check
from calcpack.sections.aisc_database import SteelShape, aisc_shape
from calcpack.sizing import SizingResult, aisc_candidates, lightest_sections
from calcpack.sizing.search import Order
from calcpack.units import Q_, Quantity

__all__ = ["MemberCase", "MemberOutcome", "evaluate_member", "lightest_member", "member_inputs"]

METHODS = ("LRFD", "ASD")

LAYOUT = Table(
    {
        "member": Table(
            dict.fromkeys(("mark", "shape", "grade", "Fy", "method", "Lcx", "Lcy", "Lb", "Cb"))
        ),
        "forces": Tables(Table(dict.fromkeys(("combination", "P", "Mx", "My", "Vx", "Vy")))),
    }
)
"""The keys a steel member inputs file may hold (see the module notes)."""


@dataclass(frozen=True)
class MemberCase:
    """A validated steel member with its required strengths by combination."""

    mark: str
    member: SteelMember
    forces: tuple[MemberForces, ...]
    method: str


@dataclass(frozen=True)
class MemberOutcome:
    """The checks of each combination, and the governing one.

    Attributes:
        case: the inputs. checks: one :class:`MemberChecks` per combination, in file order.
        governing: (utilisation, check name, clause, combination) of the largest utilisation.
    """

    case: MemberCase
    checks: tuple[MemberChecks, ...]

    @property
    def governing(self) -> tuple[float, str, str, str]:
        return governing_check(self.checks)

    @property
    def passed(self) -> bool:
        return all(mc.passed for mc in self.checks)


def _shape(value: Any, key: str, path: Path | str | None) -> SteelShape:
    text = require_input(value, "text", key, path=path)
    try:
        return aisc_shape(text)
    except InputError as exc:
        raise InputsFileError(
            f"{path or 'inputs'}: value {key}: {exc}", name=key, value=text, expected=exc.expected
        ) from None


def member_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> MemberCase:
    """Validate the ``[member]`` and ``[[forces]]`` tables.

    Raises:
        InputsFileError / DimensionError / InputError: naming the key (``member.Fy``,
            ``forces[2].P``) and the file.
    """
    refuse_unknown_keys(data, LAYOUT, path=path)
    m = data.get("member")
    if not isinstance(m, Mapping):
        raise InputsFileError(
            f"{path or 'inputs'}: no [member] table", name="member", value=m, expected="a table"
        )
    shape = _shape(m.get("shape"), "member.shape", path)
    method = require_input(m.get("method", "LRFD"), Spec("text", choices=METHODS), "member.method")
    length = Spec("[length]", positive=True)
    lengths = {
        k: require_input(m[k], length, f"member.{k}", path=path)
        for k in ("Lcx", "Lcy", "Lb")
        if k in m
    }
    cb = require_input(m.get("Cb", 1.0), Spec("number", positive=True), "member.Cb", path=path)
    Fy = require_input(m.get("Fy"), Spec("[pressure]", positive=True), "member.Fy", path=path)
    try:
        member = SteelMember(shape, Fy, grade=str(m.get("grade", "")), Cb=float(cb), **lengths)
    except InputError as exc:
        raise InputsFileError(
            f"{path or 'inputs'}: value member.{exc.name}: {exc}",
            name=f"member.{exc.name}",
            value=exc.value,
            expected=exc.expected,
        ) from None
    tables = force_tables(
        data.get("forces"),
        path=path,
        missing=" (one per combination)",
        expected="at least one [[forces]] table",
    )
    forces = []
    for i, (key, row) in enumerate(tables, start=1):
        vals = {}
        for k, dim in (("P", "[force]"), ("Mx", "[force]*[length]"), ("My", "[force]*[length]"),
                       ("Vx", "[force]"), ("Vy", "[force]")):  # fmt: skip
            vals[k] = require_input(row.get(k, Q_(0.0, "kip" if dim == "[force]" else "kip*ft")),
                                    dim, f"{key}.{k}", path=path)  # fmt: skip
        combo = require_input(row.get("combination", f"{i}"), "text", f"{key}.combination")
        forces.append(MemberForces(combination=combo, **vals))
    return MemberCase(str(m.get("mark", "P1")), member, tuple(forces), method)


def evaluate_member(case: MemberCase) -> MemberOutcome:
    """Check the member for every combination (AISC 360-16, see check_aisc_member)."""
    checks = tuple(
        check_aisc_member(case.member, f, method=case.method, mark=case.mark) for f in case.forces
    )
    return MemberOutcome(case, checks)


def lightest_member(
    case: MemberCase,
    *,
    count: int = 5,
    family: str | None = None,
    order: Order = "weight",
    max_depth: Quantity | None = None,
) -> SizingResult:
    """The lightest shapes of the member's family (or ``family``) passing every check of every
    combination, with the same grade, lengths and forces (see
    :func:`calcpack.sizing.lightest_sections`)."""
    fam = family or case.member.shape.type

    def trial(shape: SteelShape) -> list[MemberChecks]:
        try:
            trial_member = replace(case.member, shape=shape)
        except CalcpackError as exc:  # e.g. a grade outside what the shape type covers
            from calcpack.errors import OutOfScopeError

            raise OutOfScopeError(str(exc)) from None
        return [
            check_aisc_member(trial_member, f, method=case.method, mark=case.mark)
            for f in case.forces
        ]

    return lightest_sections(
        aisc_candidates(fam), trial, count=count, order=order, max_depth=max_depth
    )
