"""A beam's member -- a steel shape, a sawn size or a glulam section -- in a table of an inputs
file, checked for the analysis the sheet gives it, and searched for the lightest that passes.

The sheet analyses the beam (its loads may come from other sheets) and hands the results to
the member as a :class:`BeamDemand`; the member table says what the beam is made of::

    [beam]                         # steel: AISC 360-16 §F2, §G2 (check_aisc_beam)
    material = "steel"
    section = "W8X18"              # AISC Shapes Database v16.0 designation
    Fy = "50 ksi"
    E = "29000 ksi"                # optional (default 29 000 ksi)
    # optional tabulated properties other sheets read (A, d, bf, tf, tw, k_des, h_tw, Ix, Sx,
    # Zx, Iy, ry, J, Cw, h0, source): they must be the database's for the section, and a pick
    # rewrites them

    [joist]                        # sawn: NDS 2018 bending and shear (check_nds_beam)
    material = "sawn"
    species = "Douglas Fir-Larch"
    grade = "No.2"                 # NDS Supplement 2018 Table 4A
    size = "2x10"
    plies = 1                      # optional, members side by side
    repetitive = false             # optional, C_r (§4.3.9)

    [girder]                       # glulam: check_nds_glulam_beam (C_L or C_V)
    material = "glulam"
    stress_class = "24F-1.8E"      # NDS Supplement 2018 Table 5A
    width = "5.125 in"
    depth = "12 in"

Deflections are the analysis's scaled by E·I of the section (a prismatic beam on rigid
supports; the search refuses others), exactly as the search does: the panel, the search and the
sheet's cell all call :meth:`BeamMemberCase.space`.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Literal

from calcpack.checks.aisc360.shape import E_STEEL
from calcpack.checks.nds.factors import SawnMember, ServiceConditions, size_factor
from calcpack.checks.nds.values import nds_glulam_values, nds_sawn_values
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, refuse_unknown_keys
from calcpack.inputs.sized import SizedOutcome, as_inputs_error
from calcpack.sections.aisc_database import SteelShape, aisc_shape
from calcpack.sizing import (
    DeflectionLimit,
    SearchSpace,
    SizingResult,
    aisc_beam_space,
    glulam_beam_space,
    nds_beam_space,
    nds_graded_beam_space,
)
from calcpack.sizing.search import Order
from calcpack.sizing.steel import flag_heavier
from calcpack.sizing.timber import DIMENSION_SIZES, split_graded_name
from calcpack.sizing.timber_members import GLULAM_DEPTHS, GLULAM_WIDTHS
from calcpack.units import Q_, Quantity

__all__ = [
    "MATERIALS",
    "BeamDemand",
    "BeamMemberCase",
    "beam_member_inputs",
    "beam_pick_changes",
    "evaluate_beam_member",
    "lightest_beam_member",
    "member_stiffness",
]

Material = Literal["steel", "sawn", "glulam"]
MATERIALS: tuple[Material, ...] = ("steel", "sawn", "glulam")

#: table key -> AISC Shapes Database v16.0 column, for the tabulated properties a table may hold
STEEL_PROPERTIES: Mapping[str, str] = {
    "W": "W", "A": "A", "d": "d", "bf": "bf", "tf": "tf", "tw": "tw", "k_des": "kdes",
    "Ix": "Ix", "Sx": "Sx", "Zx": "Zx", "Iy": "Iy", "ry": "ry", "J": "J", "Cw": "Cw", "h0": "ho",
}  # fmt: skip
#: tabulated values are printed to three or four figures: a table's value within 0.6 % of the
#: database's is the same value rounded (common practice)
PRINTED_TOLERANCE = 0.006

KEYS: Mapping[str, tuple[str, ...]] = {
    "steel": ("material", "mark", "section", "grade", "Fy", "E", "source", "h_tw",
              *STEEL_PROPERTIES),
    "sawn": ("material", "mark", "species", "grade", "size", "plies", "repetitive", "wet"),
    "glulam": ("material", "mark", "stress_class", "width", "depth"),
}  # fmt: skip


@dataclass(frozen=True)
class BeamDemand:
    """The analysis a beam member is checked for, from the sheet.

    Attributes:
        strength: combined results of a prismatic beam on rigid supports: LRFD or ASD for
            steel (``method``), ASD for timber.
        deflections: the deflection limits with their service results.
        braces, continuous_bracing, method: steel compression-flange bracing (as for
            check_aisc_beam) and the design method.
        durations: timber, load case -> Table 2.3.2 duration (defaults for D, L, Lr, S...).
        lu, loading: glulam, unsupported length of the compression edge (None: braced) and the
            Table 3.3.3 case.
        self_weight: the member self-weight the analysis includes; heavier sections are
            flagged in the search (re-analyse with the section picked).
    """

    strength: Any
    deflections: Sequence[DeflectionLimit] = ()
    braces: Sequence[Quantity] | None = None
    continuous_bracing: bool = False
    method: Literal["LRFD", "ASD"] = "LRFD"
    durations: Mapping[str, str] | None = None
    lu: Quantity | None = None
    loading: Literal["uniform", "center point", "cantilever uniform", "any"] = "uniform"
    self_weight: Quantity | None = None


@dataclass(frozen=True)
class BeamMemberCase:
    """A validated member table with the demand it is checked for.

    Attributes:
        material: "steel", "sawn" or "glulam". mark: the member's mark. section: the section
        on the table (designation, nominal size, or "b x d in class"). values: the validated
        values by key. demand: the analysis. table_name: the file's table. keys: the keys the
        table holds.
    """

    material: Material
    mark: str
    section: str
    values: Mapping[str, Any]
    demand: BeamDemand
    table_name: str
    keys: tuple[str, ...] = field(default=())

    def space(
        self, *, single: bool = False, grades: Sequence[str] | None = None
    ) -> SearchSpace[Any]:
        """The search space: the family's sections (or, with ``single``, the table's own) and
        the trial the panel, the search and the sheet share. ``grades`` (sawn only): search
        every size in each of these grades of the table's species (candidates "2x10 No.1").

        Raises:
            InputsFileError: grades given for a steel or glulam member.
        """
        v, dm, key = self.values, self.demand, f"{self.table_name}.section"
        if grades is not None and self.material != "sawn":
            raise InputsFileError(
                f"A search across grades is for sawn members; {self.table_name} is "
                f"{self.material} (got grades = {list(grades)!r})",
                name="grades",
                value=list(grades),
                expected="None for a steel or glulam member",
            )
        if self.material == "steel":
            shape: SteelShape = v["shape"]
            with as_inputs_error(key):
                return aisc_beam_space(
                    dm.strength, Fy=v["Fy"], method=dm.method, braces=dm.braces,
                    continuous_bracing=dm.continuous_bracing, deflections=dm.deflections,
                    family=shape.type, E=v["E"], member=self.mark,  # type: ignore[arg-type]
                    material=v["grade"], shapes=[shape.designation] if single else None,
                )  # fmt: skip
        if self.material == "sawn":
            size = self.section
            sizes = [size] if single else [*DIMENSION_SIZES, *([] if size in DIMENSION_SIZES
                                                              else [size])]  # fmt: skip
            if grades is not None:
                with as_inputs_error(f"{self.table_name}.grade"):
                    return nds_graded_beam_space(
                        dm.strength, species=v["species"], grades=grades, sizes=sizes,
                        conditions=ServiceConditions(repetitive=v["repetitive"], wet=v["wet"]),
                        durations=dm.durations, deflections=dm.deflections, plies=v["plies"],
                        member=self.mark,
                    )  # fmt: skip
            with as_inputs_error(f"{self.table_name}.size"):
                return nds_beam_space(
                    dm.strength, species=v["species"], grade=v["grade"], sizes=sizes,
                    conditions=ServiceConditions(repetitive=v["repetitive"], wet=v["wet"]),
                    durations=dm.durations, deflections=dm.deflections, plies=v["plies"],
                    member=self.mark,
                )  # fmt: skip
        b_in = float(v["width"].to("inch").magnitude)
        d_in = float(v["depth"].to("inch").magnitude)
        with as_inputs_error(f"{self.table_name}.depth"):
            return glulam_beam_space(
                dm.strength, stress_class=v["stress_class"],
                widths=[b_in] if single else sorted({*GLULAM_WIDTHS, b_in}),
                depths=[d_in] if single else sorted({*GLULAM_DEPTHS, d_in}),
                lu=dm.lu, loading=dm.loading, durations=dm.durations,
                deflections=dm.deflections, member=self.mark,
            )  # fmt: skip


def _steel(t: Mapping[str, Any], name: str, path: Path | str | None) -> dict[str, Any]:
    designation = require_input(t.get("section"), "text", f"{name}.section", path=path)
    with as_inputs_error(f"{name}.section"):
        shape = aisc_shape(designation)
    if shape.type not in ("W", "M", "S", "HP"):
        raise InputsFileError(
            f"{path or 'inputs'}: value {name}.section = {designation!r} is a {shape.type} "
            "shape; a beam member is a W, M, S or HP shape",
            name=f"{name}.section",
            value=designation,
            expected="a W, M, S or HP designation",
        )
    pos = Spec("[pressure]", positive=True)
    Fy = require_input(t.get("Fy"), pos, f"{name}.Fy", path=path)
    E = require_input(t.get("E", E_STEEL), pos, f"{name}.E", path=path)
    for k, col in STEEL_PROPERTIES.items():
        if k not in t:
            continue
        want = shape[col]
        got = require_input(t[k], str(want.units), f"{name}.{k}", path=path)
        if abs((got - want).to(want.units).magnitude) > PRINTED_TOLERANCE * want.magnitude:
            raise InputsFileError(
                f"{path or 'inputs'}: value {name}.{k} = {got:~P} is not {shape.designation}'s "
                f"({want:~P}, {shape.source}); pick the section in the panel, which writes "
                "its properties, or correct the value",
                name=f"{name}.{k}",
                value=got,
                expected=f"{want:~P}",
            )
    grade = require_input(t.get("grade", ""), "text", f"{name}.grade", path=path)
    return {"shape": shape, "Fy": Fy, "E": E, "section": shape.designation, "grade": grade}


def beam_member_inputs(
    data: Mapping[str, Any],
    demand: BeamDemand,
    *,
    table: str = "member",
    path: Path | str | None = None,
) -> BeamMemberCase:
    """Validate the member table ``table`` (see the module notes).

    Raises:
        InputsFileError / DimensionError: naming the key (``beam.section``, ``joist.size``).
    """
    t = data.get(table)
    if not isinstance(t, Mapping):
        raise InputsFileError(
            f"{path or 'inputs'}: no [{table}] table", name=table, value=t, expected="a table"
        )
    material: Material = require_input(
        t.get("material"), Spec("text", choices=MATERIALS), f"{table}.material", path=path
    )
    refuse_unknown_keys({table: t}, Table({table: Table(dict.fromkeys(KEYS[material]))}),
                        path=path)  # fmt: skip
    mark = require_input(t.get("mark", "B1"), "text", f"{table}.mark", path=path)
    values: dict[str, Any]
    if material == "steel":
        values = _steel(t, table, path)
        section = values["section"]
    elif material == "sawn":
        section = require_input(t.get("size"), "text", f"{table}.size", path=path)
        grade = require_input(t.get("grade"), "text", f"{table}.grade", path=path)
        species = require_input(t.get("species"), "text", f"{table}.species", path=path)
        with as_inputs_error(f"{table}.grade", grade):
            nds_sawn_values(species, grade)
        with as_inputs_error(f"{table}.size", section):
            m = SawnMember.dimension(section)
            size_factor(grade, m.nominal_thickness, m.nominal_width)  # a size Table 4A rates
        plies = require_input(t.get("plies", 1), Spec("number", positive=True),
                              f"{table}.plies", path=path)  # fmt: skip
        if int(plies) != plies:
            raise InputsFileError(
                f"{path or 'inputs'}: value {table}.plies must be a whole number (got {plies})",
                name=f"{table}.plies",
                value=plies,
                expected="1, 2, 3...",
            )
        values = {
            "species": species,
            "grade": grade,
            "plies": int(plies),
            "repetitive": bool(t.get("repetitive", False)),
            "wet": bool(t.get("wet", False)),
        }
    else:
        length = Spec("[length]", positive=True)
        values = {
            "stress_class": require_input(t.get("stress_class"), "text",
                                          f"{table}.stress_class", path=path),
            "width": require_input(t.get("width"), length, f"{table}.width", path=path),
            "depth": require_input(t.get("depth"), length, f"{table}.depth", path=path),
        }  # fmt: skip
        with as_inputs_error(f"{table}.stress_class", values["stress_class"]):
            nds_glulam_values(values["stress_class"])
        b_in, d_in = (float(values[k].to("inch").magnitude) for k in ("width", "depth"))
        section = f"{b_in:g} x {d_in:g} in {values['stress_class']}"
    return BeamMemberCase(material, mark, section, values, demand, table, tuple(t))


def member_stiffness(
    data: Mapping[str, Any], *, table: str = "member", path: Path | str | None = None
) -> Quantity:
    """E·I of the table's section about its strong axis, to analyse the beam with the member
    the table holds: steel E·I_x (I_x from the AISC Shapes Database); sawn E·b·d³/12 times the
    plies, E the reference value of NDS Supplement 2018 Table 4A and b, d the dressed size;
    glulam E_x·b·d³/12 (Table 5A). The member checks scale the analysis's deflections to each
    section's own E'·I (a prismatic beam on rigid supports), so this E·I sets only what the
    analysis itself shows.

    Raises:
        InputsFileError / DimensionError: naming the bad key, as :func:`beam_member_inputs`.
    """
    t = data.get(table)
    if not isinstance(t, Mapping):
        raise InputsFileError(
            f"{path or 'inputs'}: no [{table}] table", name=table, value=t, expected="a table"
        )
    material = require_input(
        t.get("material"), Spec("text", choices=MATERIALS), f"{table}.material", path=path
    )
    if material == "steel":
        v = _steel(t, table, path)
        EI: Quantity = v["E"] * v["shape"]["Ix"]
        return EI.to("kip*inch**2")
    if material == "sawn":
        size = require_input(t.get("size"), "text", f"{table}.size", path=path)
        species = require_input(t.get("species"), "text", f"{table}.species", path=path)
        grade = require_input(t.get("grade"), "text", f"{table}.grade", path=path)
        with as_inputs_error(f"{table}.grade", grade):
            E = nds_sawn_values(species, grade).E
        with as_inputs_error(f"{table}.size", size):
            m = SawnMember.dimension(size)
        plies = require_input(t.get("plies", 1), Spec("number", positive=True),
                              f"{table}.plies", path=path)  # fmt: skip
        return (E * m.b * m.d**3 / 12 * plies).to("kip*inch**2")
    length = Spec("[length]", positive=True)
    cls = require_input(t.get("stress_class"), "text", f"{table}.stress_class", path=path)
    b = require_input(t.get("width"), length, f"{table}.width", path=path)
    d = require_input(t.get("depth"), length, f"{table}.depth", path=path)
    with as_inputs_error(f"{table}.stress_class", cls):
        E = nds_glulam_values(cls).E
    return (E * b * d**3 / 12).to("kip*inch**2")


def evaluate_beam_member(case: BeamMemberCase) -> SizedOutcome:
    """Check the table's section with the search's own trial (every check of every
    combination, and the deflection limits)."""
    space = case.space(single=True)
    if case.material == "steel":
        shape = case.values["shape"]
        return SizedOutcome(case.section, tuple(space.check(shape)), shape["W"])
    return SizedOutcome.of(space)


def lightest_beam_member(
    case: BeamMemberCase,
    *,
    count: int = 5,
    order: Order = "weight",
    max_depth: Quantity | None = None,
    grades: Sequence[str] | None = None,
) -> SizingResult:
    """The lightest (or shallowest) sections of the member's family passing every check, the
    heavier than the analysed self-weight flagged. ``grades`` (sawn only): rank (size, grade)
    pairs over these grades of the table's species (see :meth:`BeamMemberCase.space`)."""
    found = case.space(grades=grades).search(count=count, order=order, max_depth=max_depth)
    sw = case.demand.self_weight
    return found if sw is None else flag_heavier(found, sw)


def beam_pick_changes(case: BeamMemberCase, name: str) -> dict[str, Any]:
    """The inputs-file edits that make ``name`` (a candidate of the search) the member: the
    designation and the tabulated properties the table holds (steel), the size (sawn; and the
    grade, from a search across grades), or the width and depth (glulam)."""
    t = case.table_name
    if case.material == "steel":
        shape = aisc_shape(name)
        changes: dict[str, Any] = {f"{t}.section": shape.designation}
        for k, col in STEEL_PROPERTIES.items():
            if k in case.keys:
                changes[f"{t}.{k}"] = shape[col]
        if "h_tw" in case.keys:
            changes[f"{t}.h_tw"] = round(shape.ishape().h_tw, 1)
        if "source" in case.keys:
            changes[f"{t}.source"] = shape.source
        return changes
    if case.material == "sawn":
        size, grade = split_graded_name(name)  # "2x10 No.1" from a search across grades
        return {f"{t}.size": size} | ({} if grade is None else {f"{t}.grade": grade})
    by_name = {c.name: c.item for c in case.space().candidates}
    m = by_name[name]
    return {f"{t}.width": Q_(m.b.to("inch").magnitude, "inch"), f"{t}.depth": m.d.to("inch")}
