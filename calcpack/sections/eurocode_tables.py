"""UK and European rolled and hot-finished steel sections, looked up by their designation.

Families: UB, UC and PFC (BS 4-1), SHS, RHS and CHS hot finished (BS EN 10210-2), IPE, HE A and
HE B (EN 10365). The table ``calcpack/refdata/uk_eu_steel_sections.csv`` holds the
*dimensions* (h, b, t_w, t_f, r; t and D of hollow sections) with their source; the properties
are computed from them by calcpack's section code, in Eurocode axes (y-y major, z-z minor):

* I and H sections and channels: :class:`~calcpack.sections.ISection` /
  :class:`~calcpack.sections.Channel` with the root radius; the torsion constant I_t of an I
  or H section by El Darwish and Johnston's formula with the fillets (ASCE J. Struct. Div.,
  1965; the formula the European producers' tables use, from memory), the warping constant
  I_w = I_z h_0²/4 (doubly symmetric I);
* RHS and SHS: the outline with outside corner radius 1.5t less the void with inside radius
  1.0t (BS EN 10210-2, radii for calculating properties, from memory); CHS:
  :class:`~calcpack.sections.HollowCircle`.

Designations: ``"305x165x40 UB"``, ``"254x254x73 UC"``, ``"200x90x30 PFC"``,
``"SHS 100x100x5.0"``, ``"RHS 200x100x8.0"``, ``"CHS 168.3x6.3"``, ``"IPE 300"``, ``"HE 300 B"``
(case, ``×`` for ``x`` and spaces do not matter; a typo gets a "did you mean").
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from dataclasses import dataclass
from functools import cache
from typing import Any

from calcpack.errors import InputError
from calcpack.refdata import read_table
from calcpack.sections.geometry import Region
from calcpack.sections.shapes import RectangularHollow, _rounded_rect
from calcpack.units import Q_, Quantity, si
from calcpack.validate import instance, one_of, suggest

__all__ = ["EURO_FAMILIES", "EuroSection", "euro_section", "euro_section_names"]

_FILE = "uk_eu_steel_sections.csv"
EURO_FAMILIES = ("UB", "UC", "PFC", "SHS", "RHS", "CHS", "IPE", "HEA", "HEB")
_CITATION = {
    **dict.fromkeys(("UB", "UC", "PFC"), "BS 4-1:2005 dimensions as in SCI/BCSA P363"),
    **dict.fromkeys(("SHS", "RHS", "CHS"), "BS EN 10210-2:2006 dimensions as in SCI/BCSA P363"),
    **dict.fromkeys(("IPE", "HEA", "HEB"), "EN 10365:2017 dimensions"),
}
RHO_STEEL = Q_(7850.0, "kg/m**3")  # EN 1991-1-1 Table A.4 / EN 1993-1-1 §3.2.6 (common practice)


@dataclass(frozen=True, kw_only=True, eq=False)
class _HotFinishedRHS(RectangularHollow):
    """RHS with the corner radii of BS EN 10210-2 for properties: outside 1.5t, inside 1.0t."""

    def local_regions(self) -> list[tuple[Region, float]]:
        b, d, t = si(self.b), si(self.d), si(self.t)
        outer = _rounded_rect(b, d, 1.5 * t, 0.0, 0.0, "outer outline")
        inner = _rounded_rect(b - 2 * t, d - 2 * t, 1.0 * t, t, t, "void")
        return [(outer, 1.0), (inner, -1.0)]


@dataclass(frozen=True)
class EuroSection:
    """A tabulated section with properties computed from its dimensions (Eurocode axes).

    Attributes:
        designation: as printed (``"305x165x40 UB"``). family: UB, UC, PFC, SHS, RHS, CHS, IPE,
        HEA, HEB. source: table and basis. h, b: depth and width (CHS: both D). tw, tf, r: web,
        flange, root radius (open sections); t: wall (hollow). A: area. Iy, Iz: second moments
        (y-y major). Wel_y, Wel_z, Wpl_y, Wpl_z: elastic and plastic moduli. iy, iz: radii of
        gyration. It: torsion constant. Iw: warping constant (0 for hollow sections, not
        computed for PFC). mass: per metre at 7850 kg/m³. shape: the calcpack shape used.
    """

    designation: str
    family: str
    source: str
    h: Quantity
    b: Quantity
    tw: Quantity | None
    tf: Quantity | None
    r: Quantity | None
    t: Quantity | None
    A: Quantity
    Iy: Quantity
    Iz: Quantity
    Wel_y: Quantity
    Wel_z: Quantity
    Wpl_y: Quantity
    Wpl_z: Quantity
    iy: Quantity
    iz: Quantity
    It: Quantity
    Iw: Quantity | None
    mass: Quantity

    @property
    def is_i_section(self) -> bool:
        """True for doubly symmetric rolled I and H sections (UB, UC, IPE, HEA, HEB)."""
        return self.family in ("UB", "UC", "IPE", "HEA", "HEB")

    @property
    def is_hollow(self) -> bool:
        return self.family in ("SHS", "RHS", "CHS")

    @property
    def hw(self) -> Quantity:
        """Web depth between the flanges, h − 2t_f (I sections, PFC) or h − 2t (RHS)."""
        if self.tf is not None:
            return (self.h - 2 * self.tf).to("mm")
        assert self.t is not None
        return (self.h - 2 * self.t).to("mm")


def torsion_constant_rolled_i(h: float, b: float, tw: float, tf: float, r: float) -> float:
    """I_t of a rolled I or H section with root fillets (El Darwish and Johnston, 1965), in the
    units of the inputs to the fourth power: 2 J_1 + J_2 + 2αD⁴ with
    J_1 = b t_f³ [1/3 − 0.21 (t_f/b)(1 − t_f⁴/(12 b⁴))], J_2 = (h − 2t_f) t_w³/3,
    α = −0.042 + 0.2204 t_w/t_f + 0.1355 r/t_f − 0.0865 r t_w/t_f² − 0.0725 t_w²/t_f²,
    D = ((t_f + r)² + t_w (r + t_w/4))/(2r + t_f)."""
    j1 = b * tf**3 * (1 / 3 - 0.21 * (tf / b) * (1 - tf**4 / (12 * b**4)))
    j2 = (h - 2 * tf) * tw**3 / 3
    alpha = (
        -0.042
        + 0.2204 * tw / tf
        + 0.1355 * r / tf
        - 0.0865 * r * tw / tf**2
        - 0.0725 * tw**2 / tf**2
    )
    D = ((tf + r) ** 2 + tw * (r + tw / 4)) / (2 * r + tf)
    return 2 * j1 + j2 + 2 * alpha * D**4


def _norm(text: str) -> str:
    return re.sub(r"\s+", "", text.upper().replace("×", "X"))


@cache
def _index() -> dict[str, str]:
    return {_norm(k): k for k in read_table(_FILE, key="designation").rows}


def euro_section_names(family: str | None = None) -> list[str]:
    """Every designation in the table, or those of one family (``"UB"``, ``"SHS"``...)."""
    table = read_table(_FILE, key="designation")
    if family is None:
        return table.keys()
    one_of("family", family, EURO_FAMILIES)
    return [k for k, row in table.rows.items() if row["family"] == family]


@cache
def euro_section(designation: str) -> EuroSection:
    """The section ``designation`` with its properties (see the module notes).

    Raises:
        InputError: unknown designation (with the closest of the same family suggested).
    """
    instance("designation", designation, str, expected="a designation such as '305x165x40 UB'")
    table = read_table(_FILE, key="designation")
    key = _index().get(_norm(designation))
    if key is None:
        close = suggest(designation, table.keys())
        hint = f"; did you mean {', '.join(repr(c) for c in close)}?" if close else ""
        raise InputError(
            f"Unknown UK/European steel section {designation!r} for input designation "
            f"({len(table.rows)} known){hint}",
            name="designation",
            value=designation,
            expected="a designation of " + _FILE,
        )
    row = table.rows[key]
    fam = str(row["family"])
    source = f"{_CITATION[fam]}, {key} (dimensions from memory; properties computed by calcpack)"
    return _build(key, fam, source, row)


def _mm(v: Any) -> Quantity:
    return Q_(float(v), "mm")


def _build(key: str, fam: str, source: str, row: Mapping[str, Any]) -> EuroSection:
    from calcpack.sections.rolled import Channel, ISection
    from calcpack.sections.shapes import HollowCircle, Shape

    g = row.__getitem__
    tw = tf = r = t = None
    shape: Shape
    Iw: Quantity | None = None
    if fam == "CHS":
        D, t = _mm(g("D")), _mm(g("t"))
        shape = HollowCircle(D=D, t=t, name=key)
        h = b = D
    elif fam in ("SHS", "RHS"):
        h, b, t = _mm(g("h")), _mm(g("b")), _mm(g("t"))
        shape = _HotFinishedRHS(b=b, d=h, t=t, r=1.5 * t, name=key)
    else:
        h, b, tw, tf, r = (_mm(g(c)) for c in ("h", "b", "tw", "tf", "r"))
        if fam == "PFC":
            shape = Channel(d=h, bf=b, tf=tf, tw=tw, r=r, name=key)
        else:
            shape = ISection(d=h, bf=b, tf=tf, tw=tw, r=r, name=key)
    p = shape.properties()
    A = p.A.to("cm**2")
    Iy, Iz = p.Ix.to("cm**4"), p.Iy.to("cm**4")
    if fam in ("UB", "UC", "IPE", "HEA", "HEB"):
        mm = [float(q.to("mm").magnitude) for q in (h, b, tw, tf, r) if q is not None]
        It = Q_(torsion_constant_rolled_i(*mm), "mm**4").to("cm**4")
        Iw = (Iz * (h - tf) ** 2 / 4).to("dm**6")
    else:
        It = p.J.to("cm**4")
        Iw = None if fam == "PFC" else Q_(0.0, "dm**6")
    return EuroSection(
        designation=key,
        family=fam,
        source=source,
        h=h.to("mm"),
        b=b.to("mm"),
        tw=tw,
        tf=tf,
        r=r,
        t=t,
        A=A,
        Iy=Iy,
        Iz=Iz,
        Wel_y=p.Sx.to("cm**3"),
        Wel_z=p.Sy.to("cm**3"),
        Wpl_y=p.Zx.to("cm**3"),
        Wpl_z=p.Zy.to("cm**3"),
        iy=Q_(math.sqrt(float(Iy.to("mm**4").magnitude / A.to("mm**2").magnitude)), "mm"),
        iz=Q_(math.sqrt(float(Iz.to("mm**4").magnitude / A.to("mm**2").magnitude)), "mm"),
        It=It,
        Iw=Iw,
        mass=(A * RHO_STEEL).to("kg/m"),
    )
