"""Material values for EN 1995-1-1 (Eurocode 5) checks with the UK National Annex.

* :func:`strength_class`: EN 338:2016 (C and D classes) and EN 14080:2013 (GLh, GLc) from
  ``calcpack/refdata/en338_en14080_strength_classes.csv``;
* :func:`k_mod`, :func:`k_def`, :func:`gamma_M`: EN 1995-1-1 Tables 3.1 and 3.2 and UK NA
  Table NA.3, from ``en1995_factors.csv``; a product and service class the tables do not cover
  (e.g. OSB/3 in service class 3) is refused, naming the table.

Load-duration classes (§2.3.1.2, Table 2.1), shortest last: ``"permanent"``, ``"long"``,
``"medium"``, ``"short"``, ``"instantaneous"``. In a combination the action of shortest
duration sets k_mod (§3.1.3(2)). UK NA Table NA.1 assigns (from memory): self-weight
permanent; domestic floor imposed load medium; roof imposed (maintenance) load and snow short;
wind instantaneous.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from dataclasses import dataclass
from typing import Literal

from calcpack.errors import InputError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import at_least, lookup, one_of, required

__all__ = [
    "DURATIONS",
    "Duration",
    "StrengthClass",
    "combination_duration",
    "gamma_M",
    "k_def",
    "k_mod",
    "shortest_duration",
    "strength_class",
]

Duration = Literal["permanent", "long", "medium", "short", "instantaneous"]
DURATIONS: tuple[Duration, ...] = ("permanent", "long", "medium", "short", "instantaneous")
ServiceClass = Literal[1, 2, 3]
_CLASSES = "en338_en14080_strength_classes.csv"
_FACTORS = "en1995_factors.csv"


@dataclass(frozen=True)
class StrengthClass:
    """Characteristic values of a strength class (EN 338 / EN 14080), as quantities.

    Attributes:
        name: ``"C24"``, ``"GL28h"``. product: ``"solid"`` or ``"glulam"``. fm_k, ft0_k,
        ft90_k, fc0_k, fc90_k, fv_k: strengths. E0_mean, E0_05, E90_mean, G_mean: moduli.
        rho_k, rho_mean: densities. source: table and basis.
    """

    name: str
    product: str
    fm_k: Quantity
    ft0_k: Quantity
    ft90_k: Quantity
    fc0_k: Quantity
    fc90_k: Quantity
    fv_k: Quantity
    E0_mean: Quantity
    E0_05: Quantity
    E90_mean: Quantity
    G_mean: Quantity
    rho_k: Quantity
    rho_mean: Quantity
    source: str


def strength_class(name: str) -> StrengthClass:
    """The strength class ``name`` (``"C16"``, ``"C24"``, ``"D30"``, ``"GL28h"``...).

    Raises:
        InputError: unknown class (with "did you mean").
    """
    table = read_table(_CLASSES, key="class")
    row = table.row(name, what="strength class (EN 338 / EN 14080)")
    std = "BS EN 338:2016 Table 1/2" if row["product"] == "solid" else "BS EN 14080:2013"
    mpa = {
        k: Q_(float(row[k]), "MPa") for k in ("fm_k", "ft0_k", "ft90_k", "fc0_k", "fc90_k", "fv_k")
    }
    gpa = {
        k: Q_(float(row[k]), "kN/mm**2").to("MPa")
        for k in ("E0_mean", "E0_05", "E90_mean", "G_mean")
    }
    return StrengthClass(
        name=str(row["class"]),
        product=str(row["product"]),
        rho_k=Q_(float(row["rho_k"]), "kg/m**3"),
        rho_mean=Q_(float(row["rho_mean"]), "kg/m**3"),
        source=f"{std}, {row['class']} (from memory; confirm against the standard)",
        **mpa,
        **gpa,
    )


def _service_class(sc: object) -> int:
    one_of("service_class", sc, (1, 2, 3))
    return int(str(sc))


def _row(factor: str, product: str, sc: str, table_name: str) -> dict[str, object]:
    table = read_table(_FACTORS, key="key")
    key = f"{factor}|{product}|{sc}"
    if key not in table.rows:
        products = sorted({str(r["product"]) for r in table.rows.values() if r["factor"] == factor})
        one_of("product", product, products)
        raise InputError(
            f"{table_name} gives no value for {product} in service class {sc}: the product is "
            f"not covered in that service class (EN 1995-1-1 §2.3.1.3); choose another product "
            "or keep it in a drier service class",
            name="service_class",
            value=int(sc),
            expected="a service class the table covers for this product",
        )
    return dict(table.rows[key])


def k_mod(product: str, service_class: int, duration: str) -> float:
    """k_mod of EN 1995-1-1 Table 3.1.

    Raises:
        InputError: unknown product or duration; a service class the table does not cover.
    """
    sc = _service_class(service_class)
    lookup("duration", duration, {d: d for d in DURATIONS}, what="load-duration class")
    return float(_row("kmod", product, str(sc), "EN 1995-1-1 Table 3.1 (k_mod)")[duration])  # type: ignore[arg-type]


def k_def(product: str, service_class: int) -> float:
    """k_def of EN 1995-1-1 Table 3.2."""
    sc = _service_class(service_class)
    return float(_row("kdef", product, str(sc), "EN 1995-1-1 Table 3.2 (k_def)")["value"])  # type: ignore[arg-type]


def gamma_M(product: str) -> float:
    """γ_M of the UK NA Table NA.3 (solid timber 1.3, glulam 1.25)."""
    return float(_row("gammaM", product, "*", "UK NA Table NA.3 (γ_M)")["value"])  # type: ignore[arg-type]


def shortest_duration(durations: Iterable[str]) -> Duration:
    """The shortest of ``durations`` (it sets k_mod in a combination, §3.1.3(2))."""
    ds = list(durations)
    at_least("durations", ds, what="load duration")
    for d in ds:
        lookup("duration", d, {x: x for x in DURATIONS}, what="load-duration class")
    order: list[str] = list(DURATIONS)
    return DURATIONS[max(order.index(d) for d in ds)]


def combination_duration(factors: Mapping[str, float], durations: Mapping[str, str]) -> Duration:
    """The load-duration class of a combination: the shortest of the actions it includes
    (non-zero factor), EN 1995-1-1 §3.1.3(2).

    Args:
        factors: case -> load factor (e.g. ``LoadCombination.factors``).
        durations: case -> duration class (e.g. ``{"G": "permanent", "Q": "medium"}``, UK NA
            Table NA.1 for domestic imposed floor loads).

    Raises:
        InputError: a case of the combination without a duration.
    """
    acting = [case for case, f in factors.items() if f != 0]
    for case in acting:
        required(
            f"durations[{case!r}]",
            durations.get(case),
            expected="its load-duration class, one of " + " / ".join(DURATIONS),
            when=f"for load case {case!r} of the combination",
        )
    return shortest_duration(durations[c] for c in acting)
