"""NDS 2018 adjustment factors for sawn lumber (Tables 2.3.2, 2.3.3, 3.3.3, 4.3.1, 4.3.8 and
the Supplement's Table 4A rules), reference design values, member sizes and service
conditions."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Literal

from calcpack.checks.scope import material_in_scope
from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import non_empty, one_of, required, whole

__all__ = [
    "DEFAULT_DURATIONS",
    "DURATION_FACTORS",
    "NDS_EDITION",
    "ReferenceDesignValues",
    "SawnMember",
    "ServiceConditions",
    "beam_stability_factor",
    "duration_of",
    "effective_length",
    "flat_use_factor",
    "size_factor",
    "temperature_factor",
    "wet_service_factor",
    "wet_service_source",
    "wet_table",
]

NDS_EDITION = "ANSI/AWC NDS-2018"
_TITLE = "National Design Specification for Wood Construction"

# NDS 2018 Table 2.3.2 (frequently used load duration factors)
DURATION_FACTORS: dict[str, float] = {
    "permanent": 0.9,
    "ten years": 1.0,
    "two months": 1.15,
    "seven days": 1.25,
    "ten minutes": 1.6,
    "impact": 2.0,
}
# Typical design loads of Table 2.3.2 for the ASCE/SEI 7 load symbols (roof live load as a
# construction load, seven days: common practice).
DEFAULT_DURATIONS: dict[str, str] = {
    "D": "permanent",
    "L": "ten years",
    "Lr": "seven days",
    "S": "two months",
    "R": "seven days",
    "W": "ten minutes",
    "Eh": "ten minutes",
    "Ev": "ten minutes",
}

_MAIN_GRADES = ("Select Structural", "No.1 & Btr", "No.1", "No.2", "No.3")
# NDS Supplement Table 4A size factors C_F for F_b: nominal width -> (thickness 2"&3", 4")
_CF_FB = {2: (1.5, 1.5), 3: (1.5, 1.5), 4: (1.5, 1.5), 5: (1.4, 1.4), 6: (1.3, 1.3),
          8: (1.2, 1.3), 10: (1.1, 1.2), 12: (1.0, 1.1)}  # fmt: skip
_CF_FB_WIDE = (0.9, 1.0)  # 14" and wider
# NDS Supplement Table 4A flat use factors C_fu: nominal width -> (thickness 2"&3", 4"); the
# 2"&3" column is in the project's published-values reference (confirmed), the 4" column is
# from memory
_CFU = {2: (1.0, 1.0), 3: (1.0, 1.0), 4: (1.1, 1.0), 5: (1.1, 1.05), 6: (1.15, 1.05),
        8: (1.15, 1.05)}  # fmt: skip
_CFU_WIDE = (1.2, 1.1)  # 10" and wider


def _nominal(value: object, name: str) -> int:
    return whole(name, value, 2, 24)  # nominal inches


def size_factor(grade: str, nominal_thickness: int, nominal_width: int) -> float:
    """C_F for F_b of visually graded dimension lumber (NDS Supplement Table 4A).

    Raises:
        OutOfScopeError: a grade or thickness the table rule here does not cover (give CF).
    """
    t = _nominal(nominal_thickness, "nominal_thickness")
    w = _nominal(nominal_width, "nominal_width")
    if grade not in _MAIN_GRADES:
        raise OutOfScopeError(
            f"Size factor C_F: grade {grade!r} is not one of {list(_MAIN_GRADES)}; give CF= "
            "with its source (NDS Supplement Table 4A footnotes)"
        )
    if t > 4:
        raise OutOfScopeError(
            f'Size factor C_F: nominal thickness {t} in is not dimension lumber (2" to 4"); '
            "timbers use NDS Supplement Table 4D -- give CF= with its source"
        )
    col = 0 if t <= 3 else 1
    if w in _CF_FB:
        return _CF_FB[w][col]
    if w >= 14:
        return _CF_FB_WIDE[col]
    raise OutOfScopeError(
        f"Size factor C_F: nominal width {w} in is not a width of Table 4A (2-6, 8, 10, 12, 14 "
        "and wider); give CF= with its source"
    )


def flat_use_factor(nominal_thickness: int, nominal_width: int) -> float:
    """C_fu for F_b of dimension lumber loaded on the wide face (NDS Supplement Table 4A)."""
    t = _nominal(nominal_thickness, "nominal_thickness")
    w = _nominal(nominal_width, "nominal_width")
    if t > 4:
        raise OutOfScopeError(
            f'Flat use factor C_fu: nominal thickness {t} in is not dimension lumber (2" to 4")'
        )
    col = 0 if t <= 3 else 1
    if w in _CFU:
        return _CFU[w][col]
    if w >= 10:
        return _CFU_WIDE[col]
    raise OutOfScopeError(
        f"Flat use factor C_fu: nominal width {w} in is not a width of Table 4A (2-6, 8, 10 and "
        "wider)"
    )


WetTable = Literal["4A", "4D"]
_WET_TABLES: dict[str, WetTable] = {"sawn": "4A", "timber": "4D"}


def wet_table(product: str) -> WetTable:
    """The NDS Supplement table whose wet service factors apply to ``product``: "4A" for
    dimension lumber ("sawn"), "4D" for timbers 5 in. x 5 in. and larger ("timber").

    Raises:
        OutOfScopeError: glulam or SCL (their wet service factors are not shipped here).
    """
    if product not in _WET_TABLES:
        raise OutOfScopeError(
            f"Wet service of {product} is not covered: only the wet service factors of NDS "
            "Supplement 2018 Table 4A (dimension lumber) and Table 4D (timbers) are shipped"
        )
    return _WET_TABLES[product]


def wet_service_source(table: WetTable = "4A") -> str:
    """The citation of the wet service factors of ``table``, with the row's basis."""
    row = read_table("nds_2018_wet_service.csv", key="key").row(f"{table}|E")
    return f"NDS Supplement 2018 Table {table}, wet service factors ({row['basis']})"


def wet_service_factor(
    prop: str,
    *,
    wet: bool,
    Fb_CF: Quantity | None = None,
    Fc_CF: Quantity | None = None,
    table: WetTable = "4A",
) -> float:
    """C_M of NDS Supplement 2018 Table 4A (dimension lumber) or 4D (timbers) for ``prop``
    ("Fb", "Ft", "Fv", "Fc_perp", "Fc", "E" or "Emin"): 1.0 dry (MC <= 19 %). Wet, Table 4A:
    F_b 0.85 (1.0 where F_b·C_F <= 1150 psi, so ``Fb_CF`` is required), F_c 0.8 (1.0 where
    F_c·C_F <= 750 psi, ``Fc_CF`` required), F_v 0.97, F_c⊥ 0.67, E and E_min 0.9; Table 4D:
    F_c 0.91, F_c⊥ 0.67, the others 1.0 (``refdata/nds_2018_wet_service.csv``).

    Raises:
        InputError: an unknown table or property, or the F·C_F a threshold needs not given.
    """
    one_of("table", table, ("4A", "4D"))
    one_of("prop", prop, ("Fb", "Ft", "Fv", "Fc_perp", "Fc", "E", "Emin"))
    if not wet:
        return 1.0
    row = read_table("nds_2018_wet_service.csv", key="key").row(
        f"{table}|{'E' if prop == 'Emin' else prop}"
    )
    limit = row["limit_psi"]
    if limit is not None:
        given = Fb_CF if prop == "Fb" else Fc_CF
        name = "Fb_CF" if prop == "Fb" else "Fc_CF"
        given = required(name, given, expected="a stress", when=f"for C_M of {prop}")
        if float(given.to("psi").magnitude) <= float(limit):
            return 1.0
    return float(row["factor"])


def temperature_factor(prop: str, temperature: Quantity | None, *, wet: bool) -> float:
    """C_t (NDS 2018 Table 2.3.3) for sustained temperature T: 1.0 for T <= 100 °F; for
    100 < T <= 125 °F and 125 < T <= 150 °F: E, E_min 0.9, 0.9; F_b, F_v dry 0.8, 0.7 and wet
    0.7, 0.5.

    Raises:
        OutOfScopeError: T > 150 °F (§2.3.3: not covered).
    """
    if temperature is None:
        return 1.0
    T = float(temperature.to("degF").magnitude)
    if T <= 100.0:
        return 1.0
    if T > 150.0:
        raise OutOfScopeError(
            f"Temperature factor C_t: sustained temperature {T:.4g} °F exceeds 150 °F, beyond "
            "NDS 2018 Table 2.3.3"
        )
    band = 0 if T <= 125.0 else 1
    if prop in ("E", "Emin"):
        return 0.9
    return ((0.7, 0.5) if wet else (0.8, 0.7))[band]


def beam_stability_factor(Fb_star: Quantity, Emin_prime: Quantity, RB: float) -> float:
    """C_L by NDS 2018 Eq. (3.3-6) with F_bE = 1.20·E'_min/R_B² (§3.3.3.8)."""
    FbE = 1.20 * si(Emin_prime) / RB**2
    a = FbE / si(Fb_star)
    return float((1 + a) / 1.9 - (((1 + a) / 1.9) ** 2 - a / 0.95) ** 0.5)


def effective_length(lu: Quantity, d: Quantity, loading: str) -> tuple[Quantity, str]:
    """ℓ_e from ℓ_u (NDS 2018 Table 3.3.3) for ``loading`` "uniform", "center point",
    "cantilever uniform" or "any"; returns (ℓ_e, the rule used)."""
    one_of("loading", loading, ("uniform", "center point", "cantilever uniform", "any"))
    r = si(lu) / si(d)
    if loading == "uniform":
        return (2.06 * lu, "2.06ℓu (ℓu/d < 7)") if r < 7 else (1.63 * lu + 3 * d, "1.63ℓu + 3d")
    if loading == "center point":
        return (1.80 * lu, "1.80ℓu (ℓu/d < 7)") if r < 7 else (1.37 * lu + 3 * d, "1.37ℓu + 3d")
    if loading == "cantilever uniform":
        return (1.33 * lu, "1.33ℓu (ℓu/d < 7)") if r < 7 else (0.90 * lu + 3 * d, "0.90ℓu + 3d")
    if loading == "any":
        if r < 7:
            return 2.06 * lu, "2.06ℓu (ℓu/d < 7)"
        if r <= 14.3:
            return 1.63 * lu + 3 * d, "1.63ℓu + 3d (7 ≤ ℓu/d ≤ 14.3)"
    return 1.84 * lu, "1.84ℓu (ℓu/d > 14.3)"


@dataclass(frozen=True)
class ReferenceDesignValues:
    """Reference design values of a species and grade, with their source (never assumed).

    Args:
        species_grade: e.g. ``"Douglas Fir-Larch No.2"``. grade: the grade for the Table 4A
            size factor (``"No.2"``...). source: where the values are from (required).
        Fb: bending. Fv: shear parallel to grain. E: modulus of elasticity. Emin: for beam
            and column stability.
        size_rule: how C_F is found when not given: "Table 4A" (size factors by grade and
            size) or "Table 4B" (Southern Pine: the size effect is in the tabulated values,
            :func:`calcpack.checks.nds.values.southern_pine_size_factor`).
    """

    species_grade: str
    grade: str
    source: str
    Fb: Quantity
    Fv: Quantity
    E: Quantity
    Emin: Quantity
    size_rule: Literal["Table 4A", "Table 4B"] = "Table 4A"

    def __post_init__(self) -> None:
        non_empty(
            "source",
            self.source,
            expected=f"the source of the values for {self.species_grade}, e.g. 'NDS Supplement "
            "2018 Table 4A'",
        )
        for nm in ("Fb", "Fv", "E", "Emin"):
            v = required(
                nm,
                getattr(self, nm),
                expected=f"a stress from {self.source}",
                when=f"for {self.species_grade}",
            )
            require(v, "[pressure]", nm, positive=True)
        material_in_scope("NDS 2018|wood|E", "E", self.E)
        material_in_scope("NDS 2018|wood|Emin", "Emin", self.Emin)
        one_of("size_rule", self.size_rule, ("Table 4A", "Table 4B"))


@dataclass(frozen=True)
class SawnMember:
    """A sawn-lumber member: nominal sizes (inches, as named) and actual dressed sizes.

    Args:
        nominal_thickness, nominal_width: e.g. 2 and 10 for a 2x10.
        b, d: actual breadth and depth in the plane of bending (for edgewise bending b is
            the thickness; with flat use d is the thickness).
        size_source: where the actual sizes are from.
    """

    nominal_thickness: int
    nominal_width: int
    b: Quantity
    d: Quantity
    size_source: str = "NDS Supplement Table 1B, dressed (dry) size"

    def __post_init__(self) -> None:
        _nominal(self.nominal_thickness, "nominal_thickness")
        _nominal(self.nominal_width, "nominal_width")
        require(self.b, "[length]", "b", positive=True)
        require(self.d, "[length]", "d", positive=True)

    @classmethod
    def dimension(cls, nominal: str, *, flat: bool = False) -> SawnMember:
        """Dimension lumber by its name, e.g. ``"2x10"``, with the standard dressed dry sizes
        (thickness 2, 3, 4 in -> 1.5, 2.5, 3.5 in; width −0.5 in up to 6 in, −0.75 in from 8 in;
        NDS Supplement Table 1B, from memory)."""
        try:
            t_s, w_s = nominal.lower().replace("×", "x").split("x")
            t, w = int(t_s), int(w_s)
        except ValueError as exc:
            raise InputError(
                f"Nominal size must read like '2x10' (got {nominal!r})",
                name="nominal",
                value=nominal,
                expected="'<thickness>x<width>' in inches",
            ) from exc
        tt = Q_(t - 0.5, "inch")
        ww = Q_(w - (0.5 if w <= 6 else 0.75), "inch")
        b, d = (ww, tt) if flat else (tt, ww)
        return cls(t, w, b, d)

    @property
    def name(self) -> str:
        return f"{self.nominal_thickness}x{self.nominal_width}"


@dataclass(frozen=True)
class ServiceConditions:
    """Conditions that set the adjustment factors.

    Args:
        wet: in-service moisture content above 19 % (C_M of Table 4A).
        temperature: sustained temperature (None: up to 100 °F, C_t = 1.0).
        incised: incised for preservative treatment (C_i, §4.3.8).
        repetitive: repetitive members (C_r = 1.15, §4.3.9): ≥ 3 members at ≤ 24 in centres
            joined by load-distributing elements.
        flat_use: loaded on the wide face (C_fu).
        compression_edge_braced: compression edge held throughout its length and ends held
            against rotation: C_L = 1.0 (§3.3.3.3). Otherwise give ``lu``.
        lu: laterally unsupported length of the compression edge. loading: for Table 3.3.3.
        ends_held: the ends are held in position (full-depth blocking, bridging, hangers, post
            caps, nailing or bolting to other members): with d/b ≤ 4 no other lateral support
            is needed, C_L = 1.0 by the depth-to-breadth rule of §4.4.1.2(b), wherever the
            compression edge is (e.g. the bottom edge over an interior support).
        CF, CF_source: a size factor from another table, with its source.
    """

    wet: bool = False
    temperature: Quantity | None = None
    incised: bool = False
    repetitive: bool = False
    flat_use: bool = False
    compression_edge_braced: bool = True
    lu: Quantity | None = None
    loading: str = "any"
    CF: float | None = None
    CF_source: str | None = None
    ends_held: bool = False

    def __post_init__(self) -> None:
        if self.temperature is not None:
            require(self.temperature, "[temperature]", "temperature")
        if self.lu is not None:
            require(self.lu, "[length]", "lu", positive=True)
        if not self.compression_edge_braced and not self.ends_held:
            required(
                "lu",
                self.lu,
                expected="the unsupported length of the compression edge (or ends_held = True "
                "for the depth-to-breadth rule of NDS 2018 §4.4.1.2)",
                when="for C_L when the compression edge is not braced",
            )
        if self.CF is not None:
            non_empty(
                "CF_source",
                self.CF_source,
                expected=f"the source of CF = {self.CF}, e.g. 'NDS Supplement Table 4D'",
            )


def duration_of(case: str, durations: Mapping[str, str]) -> str:
    """The load duration of load case ``case`` (NDS 2018 Table 2.3.2): its own entry in
    ``durations`` or that of the case it repeats (``"W#2"`` takes ``"W"``'s)."""
    base = case.split("#")[0]
    for key in (case, base):
        if key in durations:
            return one_of(f"durations[{key!r}]", durations[key], DURATION_FACTORS)
    raise InputError(
        f"Load case {case!r} has no load duration: give durations={{{base!r}: 'ten years'}} "
        f"or another of {list(DURATION_FACTORS)} (NDS 2018 Table 2.3.2)",
        name="durations",
        value=case,
        expected=f"a duration for {base!r}",
    )
