"""Reference design values for NDS 2018 member checks, from cited tables or given by the user.

* :func:`nds_sawn_values`: NDS Supplement 2018 Table 4A (dimension lumber) and Table 4D
  (timbers) for the species and grades shipped in ``nds_2018_sawn_values.csv``;
* :func:`nds_glulam_values`: Table 5A stress classes (``nds_2018_glulam_5a.csv``), bending about
  x-x or y-y;
* :class:`TimberValues` built directly for structural composite lumber (SCL) or anything else,
  with the manufacturer's evaluation report as the source (required).

Each row of the shipped tables says whether it was confirmed against the published table or
recalled ("from memory"); the source string carries that basis onto the sheet.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.checks.scope import material_in_scope
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require
from calcpack.validate import non_empty, one_of

__all__ = ["TimberValues", "nds_glulam_values", "nds_sawn_values"]

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
        for nm in ("Fb", "Ft", "Fv", "Fc_perp", "Fc", "E", "Emin"):
            require(getattr(self, nm), "[pressure]", nm, positive=True)
        material_in_scope("NDS 2018|wood|E", "E", self.E)
        material_in_scope("NDS 2018|wood|Emin", "Emin", self.Emin)


def _psi(x: object) -> Quantity:
    return Q_(float(x), "psi")  # type: ignore[arg-type]


def nds_sawn_values(species: str, grade: str, *, table: Literal["4A", "4D"] = "4A") -> TimberValues:
    """Reference design values of ``species`` and ``grade`` from NDS Supplement 2018 Table 4A
    (or 4D for timbers: grades "B&S No.1", "P&T No.1"...).

    Raises:
        InputError: unknown table, species or grade ("did you mean" the closest).
    """
    one_of("table", table, ("4A", "4D"))
    t = read_table("nds_2018_sawn_values.csv", key="key")
    row = t.row(f"{table}|{species}|{grade}", what=f"species|grade of Table {table}")
    basis = str(row["basis"])
    return TimberValues(
        f"{row['species']} {row['grade']}",
        "sawn" if table == "4A" else "timber",
        f"NDS Supplement 2018 Table {table} ({basis})",
        Fb=_psi(row["Fb"]),
        Ft=_psi(row["Ft"]),
        Fv=_psi(row["Fv"]),
        Fc_perp=_psi(row["Fc_perp"]),
        Fc=_psi(row["Fc"]),
        E=_psi(row["E"]),
        Emin=_psi(row["Emin"]),
    )


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
