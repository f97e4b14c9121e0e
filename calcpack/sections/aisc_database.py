"""US rolled steel shapes and steel grades from cited tables.

Shapes come from the AISC Shapes Database v16.0 (``calcpack/refdata/aisc_shapes_v16.csv``: W, M,
S, HP, C, MC, L, WT, MT, ST, rectangular and square HSS, round HSS and Pipe), looked up by the
designation printed in the Steel Construction Manual (``"W18X50"``, ``"L4X4X1/4"``,
``"HSS6X6X1/4"``, ``"HSS6.625X0.280"``, ``"Pipe4STD"``); case and spaces do not matter and a typo
gets a "did you mean". Every property is a pint quantity in the database's US units (in, in²,
in³, in⁴, in⁶, lb/ft).

Steel grades (``steel_grades.csv``) give F_y and F_u with the ASTM specification; the values are
marked in the file as recalled from the Manual's tables and must be confirmed against the ASTM
standard before issue.
"""

from __future__ import annotations

import re
from collections.abc import Mapping
from dataclasses import dataclass, field
from functools import cache
from types import MappingProxyType
from typing import Any

from calcpack.errors import InputError
from calcpack.refdata import Table, read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import instance, lookup, suggest

__all__ = [
    "SHAPE_TYPES",
    "SteelGrade",
    "SteelShape",
    "aisc_shape",
    "aisc_shape_names",
    "steel_grade",
]

_SHAPES_FILE = "aisc_shapes_v16.csv"
_GRADES_FILE = "steel_grades.csv"

SHAPE_TYPES = ("W", "M", "S", "HP", "C", "MC", "L", "WT", "MT", "ST", "HSS", "HSS round", "PIPE")

# the unit of each database column (AISC Shapes Database v16.0 "units" row)
_UNITS: Mapping[str, str] = MappingProxyType(
    {
        "W": "lbf/ft",
        "A": "inch**2",
        **dict.fromkeys(("d", "bf", "tw", "tf", "kdes", "k1", "x", "y", "eo", "xp", "yp"), "inch"),
        **dict.fromkeys(("b", "t", "Ht", "h", "B", "OD", "ID", "tnom", "tdes"), "inch"),
        **dict.fromkeys(("rx", "ry", "rz", "ro", "rts", "ho"), "inch"),
        **dict.fromkeys(("Ix", "Iy", "Iz", "J"), "inch**4"),
        **dict.fromkeys(("Zx", "Sx", "Zy", "Sy", "Sz", "C"), "inch**3"),
        "Cw": "inch**6",
        "H": "",
        "tan_a": "",
    }
)


def _shapes() -> Table:
    return read_table(_SHAPES_FILE, key="designation")


@dataclass(frozen=True)
class SteelShape:
    """A rolled or cold-formed shape as tabulated in the AISC Shapes Database v16.0.

    Attributes:
        designation: as printed in the Manual (``"W18X50"``). type: the family (``"W"``,
            ``"L"``, ``"HSS"`` for rectangular and square, ``"HSS round"``, ``"PIPE"``...).
        source: the table cited (database version and the row's name in its transcription).
        properties: every tabulated value as a quantity, by the database's column name (A, d,
            bf, tw, tf, kdes, Ix, Zx, Sx, rx, Iy, Zy, Sy, ry, J, Cw, rts, ho; angles: b, t, x, y,
            Iz, rz, tan_a; HSS: Ht, B, h, b, tnom, tdes, C; round: OD, tdes).
    """

    designation: str
    type: str
    source: str
    properties: Mapping[str, Quantity] = field(repr=False)

    def __getitem__(self, name: str) -> Quantity:
        """The tabulated value ``name`` (e.g. ``shape["Zx"]``), a quantity."""
        return lookup("property", name, self.properties, what=f"property of {self.designation}")

    def has(self, name: str) -> bool:
        """True if the database tabulates ``name`` for this shape."""
        return name in self.properties

    def ishape(self) -> Any:
        """This W, M, S or HP shape as a :class:`calcpack.checks.aisc360.IShape` (for §F2/§G2).

        h/t_w is (d − 2 k_des)/t_w, the clear web depth less the fillets (AISC 360-16 §B4.1b(b)),
        from the tabulated dimensions.

        Raises:
            InputError: the shape is not an I-shape.
        """
        from calcpack.checks.aisc360.shape import IShape

        if self.type not in ("W", "M", "S", "HP"):
            raise InputError(
                f"Shape {self.designation} is a {self.type} shape, not an I-shape (W, M, S, HP)",
                name="designation",
                value=self.designation,
                expected="a W, M, S or HP shape",
            )
        p = self.properties
        h_tw = float(((p["d"] - 2 * p["kdes"]) / p["tw"]).to("").magnitude)
        return IShape(
            self.designation,
            self.source,
            d=p["d"],
            bf=p["bf"],
            tf=p["tf"],
            tw=p["tw"],
            h_tw=h_tw,
            Ix=p["Ix"],
            Sx=p["Sx"],
            Zx=p["Zx"],
            Iy=p["Iy"],
            ry=p["ry"],
            J=p["J"],
            Cw=p["Cw"],
            h0=p.get("ho"),
            kdes=p["kdes"],
            rolled=True,
        )


def aisc_shape(designation: str) -> SteelShape:
    """The shape ``designation`` from the AISC Shapes Database v16.0.

    Args:
        designation: as printed in the Manual, e.g. ``"W18X50"``, ``"C12X20.7"``,
            ``"L4X4X1/4"``, ``"HSS6X6X1/4"``, ``"HSS6.625X0.280"``, ``"Pipe4STD"`` (any case).

    Raises:
        InputError: unknown designation (the message suggests the closest ones).
    """
    table = _shapes()
    instance("designation", designation, str, expected="a designation such as 'W18X50'")
    key = designation.replace("x", "X")
    if key.upper().replace(" ", "") not in _normalised_keys():
        _refuse_unknown(key, table)
    row = table.row(key, what="AISC shape")
    return _shape(str(row["designation"]))


@cache
def _shape(designation: str) -> SteelShape:
    """The shape of a designation as tabulated, built once (a shape is frozen data; a section
    search reads every shape of a family, and a panel reads them again on each search)."""
    row = _shapes().row(designation, what="AISC shape")
    props = {
        k: Q_(float(v), _UNITS[k])
        for k, v in row.items()
        if k in _UNITS and v is not None and not isinstance(v, str)
    }
    return SteelShape(
        str(row["designation"]),
        str(row["type"]),
        f"AISC Shapes Database v16.0 ({row['designation']})",
        MappingProxyType(props),
    )


@cache
def _normalised_keys() -> frozenset[str]:
    return frozenset(k.upper().replace(" ", "") for k in _shapes().rows)


def _refuse_unknown(key: str, table: Table) -> None:
    """An InputError whose "did you mean" looks first within the same family (W, WT, HSS...)."""
    prefix = re.match(r"[A-Za-z]*", key)
    fam = prefix.group(0).upper() if prefix else ""
    same = [k for k in table.rows if re.match(r"[A-Za-z]*", k).group(0).upper() == fam]  # type: ignore[union-attr]
    close = suggest(key, same or list(table.rows))
    hint = f"; did you mean {', '.join(repr(c) for c in close)}?" if close else ""
    raise InputError(
        f"Unknown AISC shape {key!r} for input designation ({len(table.rows)} known){hint}",
        name="designation",
        value=key,
        expected="a designation of the AISC Shapes Database v16.0",
    )


def aisc_shape_names(shape_type: str | None = None) -> list[str]:
    """Every designation in the database, or those of one family (``"W"``, ``"L"``, ``"HSS"``)."""
    table = _shapes()
    if shape_type is None:
        return table.keys()
    lookup("shape_type", shape_type, {t: t for t in SHAPE_TYPES}, what="shape family")
    return [k for k, r in table.rows.items() if r["type"] == shape_type]


@dataclass(frozen=True)
class SteelGrade:
    """A structural steel grade: specified minimum yield and tensile stress, with its standard.

    Attributes:
        name: e.g. ``"A992"``. Fy, Fu: stresses. applies_to: shape families it is specified
        for. standard: the ASTM specification. source: the table cited and its basis.
    """

    name: str
    Fy: Quantity
    Fu: Quantity
    applies_to: tuple[str, ...]
    standard: str
    source: str


def steel_grade(name: str, *, shape_type: str | None = None) -> SteelGrade:
    """The steel grade ``name`` (``"A992"``, ``"A36"``, ``"A572 Gr. 50"``, ``"A500 Gr. C
    rectangular"``, ``"A500 Gr. C round"``, ``"A53 Gr. B"``).

    Args:
        shape_type: when given, the grade must be specified for that shape family (an A53 pipe
            grade for a W-shape is refused).

    Raises:
        InputError: unknown grade (with "did you mean"), or a grade not made in that family.
    """
    table = read_table(_GRADES_FILE, key="grade")
    row = table.row(name, what="steel grade")
    applies = tuple(str(row["applies_to"]).replace("HSS round", "HSS_round").split())
    applies = tuple(a.replace("HSS_round", "HSS round") for a in applies)
    if shape_type is not None and shape_type not in applies:
        raise InputError(
            f"Steel grade {row['grade']} is not specified for {shape_type} shapes (input "
            f"grade = {name!r}; it applies to {', '.join(applies)})",
            name="grade",
            value=name,
            expected=f"a grade for {shape_type} shapes",
        )
    cite = next((s for s in table.source if s.startswith("source:")), "")[7:].strip()
    return SteelGrade(
        str(row["grade"]),
        Q_(float(row["Fy"]), "ksi"),
        Q_(float(row["Fu"]), "ksi"),
        applies,
        str(row["standard"]),
        f"{cite} ({row['standard']}; values from memory, confirm against the standard)",
    )
