"""A sawn timber post described in a table of an inputs file, checked to NDS 2018 (ASD) for its
force sets, and searched for the lightest size of its species and grade that passes.

Layout (see ``templates/sheets/timber_post.inputs.toml``)::

    [post]
    mark = "P1"
    size = "6x6"                  # nominal size
    species = "Douglas Fir-Larch"
    grade = "P&T No.1"            # NDS Supplement 2018 Table 4D (timbers) or 4A (4x posts)
    table = "4D"                  # optional: "4D" for 5 in and thicker, else "4A"
    le = "8 ft"                   # K_e·ℓ across both sides (or given by the sheet)
    b = "5.5 in"                  # optional dressed sizes: must be those of the size
    d = "5.5 in"

    [[forces]]                    # optional when the sheet gives the forces
    combination = "D + L"
    P = "6 kip"                   # compression positive
    duration = "ten years"        # NDS 2018 Table 2.3.2, of the shortest load in the set

:func:`timber_post_inputs` validates the table (errors name the key, e.g. ``post.size``);
:func:`evaluate_timber_post` checks the size with the same trial as the search
(:func:`calcpack.sizing.nds_post_space`); :func:`lightest_timber_post` ranks the sizes;
:func:`post_pick_changes` gives the inputs-file edits that put a size in the table.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Literal

from calcpack.checks.nds.members import TimberForces
from calcpack.checks.nds.values import nds_sawn_values
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, Tables, refuse_unknown_keys
from calcpack.inputs.sized import SizedOutcome, as_inputs_error, force_tables
from calcpack.sizing import SearchSpace, SizingResult, nds_post_member, nds_post_space
from calcpack.sizing.search import Order
from calcpack.sizing.timber_members import POST_SIZES_4A, POST_SIZES_4D, nominal_size
from calcpack.units import Q_, Quantity

__all__ = [
    "PostLoad",
    "TimberPostCase",
    "evaluate_timber_post",
    "lightest_timber_post",
    "post_pick_changes",
    "timber_post_inputs",
]

POST_KEYS = ("mark", "size", "species", "grade", "table", "le", "le_b", "b", "d")
FORCE_KEYS = ("combination", "P", "M_d", "duration", "mark")
DURATIONS = ("permanent", "ten years", "two months", "seven days", "ten minutes", "impact")


@dataclass(frozen=True)
class PostLoad:
    """One ASD force set on a post: the post's mark, the forces and the load duration of the
    shortest load in the set (NDS 2018 Table 2.3.2)."""

    mark: str
    forces: TimberForces
    duration: str


@dataclass(frozen=True)
class TimberPostCase:
    """A validated post table with its force sets.

    Attributes:
        mark, size, species, grade, table: as in the file. le, le_b: buckling lengths.
        loads: the force sets. table_name: the file's table ("post"). keys: the keys the
        table holds (a pick writes ``b`` and ``d`` only where the table has them).
    """

    mark: str
    size: str
    species: str
    grade: str
    table: Literal["4A", "4D"]
    le: Quantity
    le_b: Quantity | None
    loads: tuple[PostLoad, ...]
    table_name: str = "post"
    keys: tuple[str, ...] = ()

    def space(self, sizes: Sequence[str] | None = None) -> SearchSpace[Any]:
        """The search space (the trial the panel and the search share)."""
        if sizes is None:
            default = POST_SIZES_4A if self.table == "4A" else POST_SIZES_4D
            sizes = default if self.size in default else (*default, self.size)
        with as_inputs_error(f"{self.table_name}.size"):
            return nds_post_space(
                [ld.forces for ld in self.loads],
                species=self.species,
                grade=self.grade,
                le=self.le,
                le_b=self.le_b,
                table=self.table,
                sizes=sizes,
                durations={
                    (ld.forces.combination or f"forces[{i}]"): ld.duration
                    for i, ld in enumerate(self.loads)
                },
                member=self.mark,
                marks=[ld.mark for ld in self.loads],
            )


def _loads(rows: Any, table: str, path: Path | str | None, mark: str) -> tuple[PostLoad, ...]:
    tables = force_tables(
        rows,
        path=path,
        missing=" and no forces given by the sheet",
        expected="one [[forces]] table per ASD combination",
    )
    out = []
    for i, (key, row) in enumerate(tables, start=1):
        P = require_input(row.get("P"), "[force]", f"{key}.P", path=path)
        M = require_input(row.get("M_d", Q_(0.0, "lbf*ft")), "[force]*[length]", f"{key}.M_d",
                          path=path)  # fmt: skip
        combo = require_input(row.get("combination", f"{i}"), "text", f"{key}.combination")
        dur = require_input(
            row.get("duration"), Spec("text", choices=DURATIONS), f"{key}.duration", path=path
        )
        on = require_input(row.get("mark", mark), "text", f"{key}.mark", path=path)
        out.append(PostLoad(on, TimberForces(P=P, M_d=M, combination=combo), dur))
    return tuple(out)


def timber_post_inputs(
    data: Mapping[str, Any],
    *,
    table: str = "post",
    loads: Sequence[PostLoad] | None = None,
    le: Quantity | None = None,
    path: Path | str | None = None,
    extra_keys: Sequence[str] = (),
) -> TimberPostCase:
    """Validate the post table (and its ``[[forces]]`` unless ``loads`` are given).

    Args:
        table: the table's name in the file. loads: the force sets from the sheet (else the
            file's ``[[forces]]``). le: the buckling length from the sheet (else ``le``).
        extra_keys: other keys the table may hold for other cells (e.g. a bearing length).

    Raises:
        InputsFileError / DimensionError: naming the key (``post.size``, ``forces[2].P``).
    """
    layout: dict[str, Any] = {table: Table(dict.fromkeys((*POST_KEYS, *extra_keys)))}
    if loads is None:
        layout["forces"] = Tables(Table(dict.fromkeys(FORCE_KEYS)))
    refuse_unknown_keys(data, Table(layout), path=path)
    t = data.get(table)
    if not isinstance(t, Mapping):
        raise InputsFileError(
            f"{path or 'inputs'}: no [{table}] table", name=table, value=t, expected="a table"
        )
    mark = require_input(t.get("mark", "P1"), "text", f"{table}.mark", path=path)
    size = require_input(t.get("size"), "text", f"{table}.size", path=path)
    species = require_input(t.get("species"), "text", f"{table}.species", path=path)
    grade = require_input(t.get("grade"), "text", f"{table}.grade", path=path)
    with as_inputs_error(f"{table}.size"):
        thick, _w = nominal_size(size)
    tab = require_input(t.get("table", "4D" if thick >= 5 else "4A"), Spec("text",
                        choices=("4A", "4D")), f"{table}.table", path=path)  # fmt: skip
    length = Spec("[length]", positive=True)
    if le is None:
        le = require_input(t.get("le"), length, f"{table}.le", path=path)
    le_b = require_input(t["le_b"], length, f"{table}.le_b", path=path) if "le_b" in t else None
    with as_inputs_error(f"{table}.grade"):
        values = nds_sawn_values(species, grade, table=tab)
    with as_inputs_error(f"{table}.size"):
        member = nds_post_member(values, size, grade=grade, table=tab, le=le, le_b=le_b)
    for k, dressed in (("b", member.b), ("d", member.d)):
        if k in t:
            given = require_input(t[k], length, f"{table}.{k}", path=path)
            if abs((given - dressed).to("inch").magnitude) > 1e-6:
                raise InputsFileError(
                    f"{path or 'inputs'}: value {table}.{k} = {given:~P} is not the dressed "
                    f"size of a {size} ({dressed:~P}); change {table}.size or {table}.{k}",
                    name=f"{table}.{k}",
                    value=given,
                    expected=f"{dressed:~P}",
                )
    found = tuple(loads) if loads is not None else _loads(data.get("forces"), table, path, mark)
    return TimberPostCase(mark, size, species, grade, tab, le, le_b, found, table, tuple(t))


def evaluate_timber_post(case: TimberPostCase) -> SizedOutcome:
    """Check the post's size for every force set (NDS 2018 §3.6-§3.9 through
    :func:`calcpack.check_nds_member`), with the search's own trial."""
    return SizedOutcome.of(case.space(sizes=[case.size]))


def lightest_timber_post(
    case: TimberPostCase,
    *,
    count: int = 5,
    order: Order = "weight",
    max_depth: Quantity | None = None,
    sizes: Sequence[str] | None = None,
) -> SizingResult:
    """The lightest sizes of the post's species and grade (Table 4A 4x posts or Table 4D
    timbers) passing every force set."""
    return case.space(sizes).search(count=count, order=order, max_depth=max_depth)


def post_pick_changes(case: TimberPostCase, name: str) -> dict[str, Any]:
    """The inputs-file edits that make the size ``name`` the post's size (and its dressed b, d
    where the table states them)."""
    t = case.table_name
    changes: dict[str, Any] = {f"{t}.size": name}
    if "b" in case.keys or "d" in case.keys:
        m = case.space(sizes=[name]).candidates[0].item
        for k in ("b", "d"):
            if k in case.keys:
                changes[f"{t}.{k}"] = getattr(m, k).to("inch")
    return changes
