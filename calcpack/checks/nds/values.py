"""Reference design values for NDS 2018 member checks, from cited tables or given by the user.

* :func:`nds_sawn_values`: NDS Supplement 2018 Table 4A (dimension lumber) and Table 4D
  (timbers) for the species and grades shipped in ``nds_2018_sawn_values.csv``, and Table 4B
  (visually graded Southern Pine dimension lumber, values by nominal width, size effect
  included) from ``nds_2018_southern_pine_4b.csv``;
* :func:`southern_pine_size_factor`: the C_F that still applies to Table 4B values;
* :func:`nds_glulam_values`: Table 5A stress classes (``nds_2018_glulam_5a.csv``), bending about
  x-x or y-y;
* :class:`TimberValues` built directly for structural composite lumber (SCL) or anything else,
  with the manufacturer's evaluation report as the source (required).

Each row of the shipped tables says whether it was confirmed against the published table or
recalled ("from memory"); the source string carries that basis onto the sheet.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Literal

from calcpack.checks.scope import material_in_scope
from calcpack.errors import InputError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import lookup, non_empty, one_of, positive_fields

__all__ = [
    "SOUTHERN_PINE",
    "TimberValues",
    "nds_glulam_values",
    "nds_sawn_grades",
    "nds_sawn_values",
    "southern_pine_size_factor",
]

SOUTHERN_PINE = "Southern Pine"
_SP_WIDTHS = {2: "2-4", 3: "2-4", 4: "2-4", 5: "5-6", 6: "5-6", 8: "8", 10: "10", 12: "12"}

Product = Literal["sawn", "timber", "glulam", "scl"]


@dataclass(frozen=True)
class TimberValues:
    """Reference design values (unadjusted) of a wood product, with their source.

    Args:
        name: e.g. ``"Douglas Fir-Larch No.2"``. product: "sawn" (dimension lumber),
            "timber" (5 in. and thicker), "glulam" or "scl". source: the table or report.
        Fb, Ft, Fv, Fc_perp, Fc: stresses. E, Emin: moduli.
    """

    name: str
    product: Product
    source: str
    Fb: Quantity
    Ft: Quantity
    Fv: Quantity
    Fc_perp: Quantity
    Fc: Quantity
    E: Quantity
    Emin: Quantity

    def __post_init__(self) -> None:
        one_of("product", self.product, ("sawn", "timber", "glulam", "scl"))
        non_empty(
            "source",
            self.source,
            expected=f"the source of timber values {self.name} (for SCL, the manufacturer's "
            "evaluation report), e.g. 'ICC-ES ESR-xxxx, Table 2'",
        )
        positive_fields(self, "[pressure]", ("Fb", "Ft", "Fv", "Fc_perp", "Fc", "E", "Emin"))
        material_in_scope("NDS 2018|wood|E", "E", self.E)
        material_in_scope("NDS 2018|wood|Emin", "Emin", self.Emin)


def _psi(x: object) -> Quantity:
    return Q_(float(x), "psi")  # type: ignore[arg-type]


def nds_sawn_values(
    species: str,
    grade: str,
    *,
    table: Literal["4A", "4B", "4D"] = "4A",
    width: int | None = None,
) -> TimberValues:
    """Reference design values of ``species`` and ``grade`` from NDS Supplement 2018 Table 4A
    (or 4D for timbers: grades "B&S No.1", "P&T No.1"...; or 4B for Southern Pine dimension
    lumber, whose values depend on the nominal ``width`` in inches: 2 to 6, 8, 10 or 12).

    Table 4B values include the size effect: use C_F = 1.0 on them except where
    :func:`southern_pine_size_factor` says otherwise (F_b of 4 in. thick lumber 8 in. and wider).

    Raises:
        InputError: unknown table, species, grade or width ("did you mean" the closest).
    """
    one_of("table", table, ("4A", "4B", "4D"))
    if table == "4B":
        return _southern_pine(species, grade, width)
    if width is not None:
        raise InputError(
            name="width",
            value=width,
            rule=f"is used with Table 4B only (Table {table} values do not depend on it)",
            expected="None",
        )
    t = read_table("nds_2018_sawn_values.csv", key="key")
    row = t.row(f"{table}|{species}|{grade}", what=f"species|grade of Table {table}")
    basis = str(row["basis"])
    return _from_row(
        row,
        f"{row['species']} {row['grade']}",
        "sawn" if table == "4A" else "timber",
        f"NDS Supplement 2018 Table {table} ({basis})",
    )


def nds_sawn_grades(species: str, *, table: Literal["4A", "4D"] = "4A") -> tuple[str, ...]:
    """The grades of ``species`` in NDS Supplement 2018 Table 4A (or 4D) that calcpack ships,
    in the table's order (best grade first), e.g. for a search across grades.

    Raises:
        InputError: unknown table, or a species with no grade in it ("did you mean").
    """
    one_of("table", table, ("4A", "4D"))
    t = read_table("nds_2018_sawn_values.csv", key="key")
    rows = [r for r in t.rows.values() if r["table"] == table]
    species_names = {str(r["species"]): str(r["species"]) for r in rows}
    name = lookup("species", species, species_names, what=f"species of Table {table}")
    return tuple(str(r["grade"]) for r in rows if r["species"] == name)


def _southern_pine(species: str, grade: str, width: int | None) -> TimberValues:
    one_of("species", species, (SOUTHERN_PINE,))
    if width is None or isinstance(width, bool) or not isinstance(width, int):
        one_of("width", width, tuple(_SP_WIDTHS))
    w = int(width)  # type: ignore[arg-type]
    cls = one_of("width", w, tuple(_SP_WIDTHS))
    t = read_table("nds_2018_southern_pine_4b.csv", key="key")
    row = t.row(f"{grade}|{_SP_WIDTHS[cls]}", what="grade|width class of Table 4B")
    return _from_row(
        row,
        f"{SOUTHERN_PINE} {row['grade']} ({w} in. nominal width)",
        "sawn",
        f"NDS Supplement 2018 Table 4B, {_SP_WIDTHS[cls]} in. wide ({row['basis']}; size "
        "effect included)",
    )


def _from_row(row: Mapping[str, object], name: str, product: Product, source: str) -> TimberValues:
    """The reference design values of a table row (psi), with what they are and their source."""
    return TimberValues(
        name,
        product,
        source,
        Fb=_psi(row["Fb"]),
        Ft=_psi(row["Ft"]),
        Fv=_psi(row["Fv"]),
        Fc_perp=_psi(row["Fc_perp"]),
        Fc=_psi(row["Fc"]),
        E=_psi(row["E"]),
        Emin=_psi(row["Emin"]),
    )


def southern_pine_size_factor(nominal_thickness: int, nominal_width: int) -> float:
    """C_F for F_b on NDS Supplement 2018 Table 4B values (Southern Pine dimension lumber).

    The tabulated values include the size effect (C_F = 1.0) for 2 in. and 3 in. thick lumber;
    for 4 in. thick lumber 8 in. and wider F_b is multiplied by 1.1 (Table 4B size factor
    footnote, from memory). Widths over 12 in. are not tabulated here.

    Raises:
        InputError: a thickness other than 2, 3 or 4 in., or a width not in Table 4B.
    """
    one_of("nominal_thickness", nominal_thickness, (2, 3, 4))
    one_of("nominal_width", nominal_width, tuple(_SP_WIDTHS))
    return 1.1 if nominal_thickness == 4 and nominal_width >= 8 else 1.0


def nds_glulam_values(stress_class: str, *, axis: Literal["x", "y"] = "x") -> TimberValues:
    """Table 5A values of a glulam stress class for bending about ``axis`` (F_bx+ for x).

    Axial values (F_t, F_c, E_axial, E_axial,min are not used for bending-axis stiffness: E and
    E_min here are those of the bending axis; the column check uses :attr:`Fc` with E_min of the
    buckling axis, which the engineer selects by the axis argument).
    """
    one_of("axis", axis, ("x", "y"))
    t = read_table("nds_2018_glulam_5a.csv", key="stress_class")
    row = t.row(stress_class, what="glulam stress class of Table 5A")
    a = axis
    return TimberValues(
        f"glulam {row['stress_class']} ({a}-x bending)"
        if a == "x"
        else f"glulam {row['stress_class']} (y-y bending)",
        "glulam",
        f"NDS Supplement 2018 Table 5A ({row['basis']})",
        Fb=_psi(row["Fbx_pos"] if a == "x" else row["Fby"]),
        Ft=_psi(row["Ft"]),
        Fv=_psi(row[f"Fv{a}"]),
        Fc_perp=_psi(row[f"Fc_perp_{a}"]),
        Fc=_psi(row["Fc"]),
        E=_psi(row[f"E{a}"]),
        Emin=_psi(row[f"E{a}_min"]),
    )
