"""Reinforcing bar sizes: nominal diameter and area by the trade's designation.

* ``"ASTM"``: inch-pound designations ``#3`` to ``#18`` (ASTM A615/A615M Table 1); the soft
  metric designations ``#10`` to ``#57`` with ``system="ASTM metric"``.
* ``"BS 4449"``: metric bars 8 to 40 mm (BS 4449 Table 6, the sizes of EN 10080); a UK bar
  mark such as ``"H16"`` or ``"B16"`` is read as 16 mm.

The tables are data files in :mod:`calcpack.refdata` with their source in the header.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import lookup, one_of

__all__ = ["Rebar", "rebar"]

BarSystem = Literal["ASTM", "ASTM metric", "BS 4449"]


@dataclass(frozen=True)
class Rebar:
    """One bar size: designation, nominal diameter d_b and area A_b, with the table cited."""

    designation: str
    db: Quantity
    Ab: Quantity
    source: str


def rebar(designation: str, system: BarSystem = "ASTM") -> Rebar:
    """The nominal diameter and area of a bar.

    Args:
        designation: ``"#5"`` (ASTM), ``"#16"`` (ASTM metric), ``"16"`` or ``"H16"`` (BS 4449).
        system: which table.

    Raises:
        InputError: an unknown system or bar size (with "did you mean ...").
    """
    one_of("system", system, ("ASTM", "ASTM metric", "BS 4449"))
    if system == "BS 4449":
        t = read_table("rebar_bs4449.csv", key="designation")
        key = designation.strip().upper().removesuffix("MM").strip().lstrip("HBT").strip()
        row = lookup("bar", key, t.rows, what="BS 4449 bar size")
        return Rebar(
            f"H{row['designation']}", Q_(row["db_mm"], "mm"), Q_(row["Ab_mm2"], "mm**2"), t.citation
        )
    t = read_table("rebar_astm_a615.csv", key="designation")
    key = designation.strip().replace("No.", "#").replace(" ", "")
    if not key.startswith("#"):
        key = "#" + key
    if system == "ASTM metric":
        by_metric = {str(r["metric"]): r for r in t.rows.values()}
        row = lookup("bar", key, by_metric, what="ASTM soft-metric bar size")
        return Rebar(
            str(row["metric"]), Q_(row["db_mm"], "mm"), Q_(row["Ab_mm2"], "mm**2"), t.citation
        )
    row = lookup("bar", key, t.rows, what="ASTM bar size")
    return Rebar(
        str(row["designation"]), Q_(row["db_in"], "inch"), Q_(row["Ab_in2"], "inch**2"), t.citation
    )
