"""EN 1990 presets by National Annex: the ψ factors (Table A1.1) and the partial factor sets
EQU (Set A, Table A1.2(A)), STR/GEO (Set B, Table A1.2(B), with ξ) and GEO (Set C, Table
A1.2(C)), either as recommended by EN 1990:2002+A1:2005 or as set by the UK National Annex
(NA to BS EN 1990:2002+A1:2005: Table NA.A1.1, Tables NA.A1.2(A)-(C); ξ = 0.925, ψ0 = 0.5 for
wind, ψ0 = 0.7 for roofs).

The values live in ``calcpack/refdata/en1990_annex_factors.csv``, each row with its table and
its basis ("confirmed" against the project's published-values reference, or "from memory":
confirm against the printed annex before issue). The combination sets are those of
:mod:`calcpack.combinations.en1990` with the annex's values and the annex's tables cited.

Usage::

    uk = en1990_annex("UK")
    strength = annex_combinations(uk, variable={"Q": "A", "S": "snow_up_to_1000m"},
                                  equation="6.10a/b")
    service = annex_serviceability(uk, variable={"Q": "A"})
    stability = annex_equ_combinations(uk, variable={"Q": "A"}, destabilising=("G_dst",),
                                       stabilising=("G_stb",))
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, replace
from functools import cache
from types import MappingProxyType
from typing import Literal

from calcpack.combinations.en1990 import (
    EN1990_EDITION,
    Psi,
    en1990_combinations,
    en1990_serviceability,
)
from calcpack.combinations.model import CombinationSet, LoadCombination
from calcpack.errors import InputError
from calcpack.refdata import read_table
from calcpack.validate import lookup, one_of

__all__ = [
    "ANNEXES",
    "NationalAnnex",
    "PartialFactorSet",
    "annex_combinations",
    "annex_equ_combinations",
    "annex_serviceability",
    "en1990_annex",
]

AnnexName = Literal["recommended", "UK"]
ANNEXES: tuple[str, ...] = ("recommended", "UK")
_FILE = "en1990_annex_factors.csv"
_TITLES = {
    "recommended": f"{EN1990_EDITION}, recommended values",
    "UK": f"{EN1990_EDITION} with the UK National Annex (NA to BS EN 1990:2002+A1:2005)",
}


@dataclass(frozen=True)
class PartialFactorSet:
    """A set of partial factors on actions (EN 1990 Annex A1, Table A1.2 or its annex version).

    Attributes:
        name: ``"EQU"``, ``"STR/GEO"`` (Set B) or ``"GEO"`` (Set C). gamma_G_sup,
        gamma_G_inf: on unfavourable and favourable permanent actions. gamma_Q: on unfavourable
        variable actions (0 where favourable). xi: reduction factor of Eq. (6.10b) (Set B only,
        else None). table: the table cited. basis: "confirmed" or "from memory".
    """

    name: str
    gamma_G_sup: float
    gamma_G_inf: float
    gamma_Q: float
    xi: float | None
    table: str
    basis: str


@dataclass(frozen=True)
class NationalAnnex:
    """The EN 1990 values for buildings chosen by one National Annex (or the recommended ones).

    Attributes:
        name: ``"recommended"`` or ``"UK"``. title: the document cited. psi: Table A1.1
        category (``"A"``..``"H"``, ``"snow_up_to_1000m"``, ``"wind"``...) -> :class:`Psi`.
        sets: ``"EQU"``, ``"STR/GEO"``, ``"GEO"`` -> :class:`PartialFactorSet`. psi_table: the
        ψ table cited. psi_basis: category -> "confirmed" or "from memory".
    """

    name: str
    title: str
    psi: Mapping[str, Psi]
    sets: Mapping[str, PartialFactorSet]
    psi_table: str
    psi_basis: Mapping[str, str]

    @property
    def xi(self) -> float:
        """ξ of Eq. (6.10b)."""
        xi = self.sets["STR/GEO"].xi
        assert xi is not None  # the table gives ξ for Set B (checked on reading)
        return xi

    def source(self, category: str) -> str:
        """The citation of one ψ row, with its basis."""
        lookup("category", category, self.psi, what=f"ψ category of the {self.name} annex")
        return f"{self.title}, {self.psi_table} ({self.psi_basis[category]})"


@cache
def en1990_annex(name: AnnexName = "UK") -> NationalAnnex:
    """The EN 1990 preset ``"UK"`` (UK National Annex) or ``"recommended"``.

    Raises:
        InputError: another annex name (only these two are tabulated).
    """
    one_of("annex", name, ANNEXES)
    table = read_table(_FILE, key="key")
    psi: dict[str, Psi] = {}
    basis: dict[str, str] = {}
    sets: dict[str, PartialFactorSet] = {}
    psi_table = ""
    for row in table.rows.values():
        if row["annex"] != name:
            continue
        if row["kind"] == "psi":
            cat = str(row["item"])
            psi[cat] = Psi(row["value1"], row["value2"], row["value3"], str(row["description"]))
            basis[cat] = str(row["basis"])
            psi_table = str(row["table"])
        else:
            item = str(row["item"])
            xi = row["value4"]
            if item == "STR/GEO" and xi is None:  # pragma: no cover - data file guard
                raise InputError(
                    f"{_FILE}: Set B of the {name} annex has no ξ",
                    name="xi",
                    value=None,
                    expected="a number",
                )
            sets[item] = PartialFactorSet(
                item,
                row["value1"],
                row["value2"],
                row["value3"],
                xi,
                str(row["table"]),
                str(row["basis"]),
            )
    return NationalAnnex(
        name,
        _TITLES[name],
        MappingProxyType(psi),
        MappingProxyType(sets),
        psi_table,
        MappingProxyType(basis),
    )


def _resolve(annex: NationalAnnex, variable: Mapping[str, str | Psi]) -> dict[str, Psi]:
    if not variable:
        raise InputError(
            "EN 1990 combinations need the variable actions with their category (got "
            "variable = {}); e.g. variable={'Q': 'A', 'S': 'snow_up_to_1000m'}",
            name="variable",
            value={},
            expected="case -> ψ category",
        )
    out: dict[str, Psi] = {}
    for case, cat in variable.items():
        if isinstance(cat, Psi):
            out[case] = cat
        else:
            out[case] = lookup(
                f"variable[{case!r}]", cat, annex.psi, what=f"{annex.psi_table} category"
            )
    return out


def _cite(annex: NationalAnnex, text: str) -> str:
    if annex.name == "recommended":
        return text
    return (
        text.replace(EN1990_EDITION, "BS EN 1990 + UK NA")
        .replace("Table A1.2(B)", "Table NA.A1.2(B)")
        .replace("Table A1.1", "Table NA.A1.1")
    )


def _recite(annex: NationalAnnex, cset: CombinationSet, name: str) -> CombinationSet:
    combos = tuple(
        replace(c, clause=_cite(annex, c.clause), note=_cite(annex, c.note))
        for c in cset.combinations
    )
    return replace(cset, name=name, combinations=combos, standard=annex.title)


def annex_combinations(
    annex: NationalAnnex,
    *,
    variable: Mapping[str, str | Psi],
    permanent: Sequence[str] = ("G",),
    equation: Literal["6.10", "6.10a/b"] = "6.10a/b",
) -> CombinationSet:
    """STR/GEO (Set B) combinations, EN 1990 §6.4.3.2, with the annex's γ, ξ and ψ values.

    Each variable action leads in turn; where one is wind, a combination with the permanent
    actions favourable (γ_G,inf) is added for uplift.

    Args:
        annex: from :func:`en1990_annex`. variable: case -> ψ category of the annex (or a
            :class:`Psi` of the engineer's own). permanent: the permanent cases.
        equation: ``"6.10a/b"`` (the less favourable of Eq. 6.10a and 6.10b, as the UK annex
            allows) or ``"6.10"``.
    """
    psi = _resolve(annex, variable)
    s = annex.sets["STR/GEO"]
    wind = annex.psi.get("wind")
    cset = en1990_combinations(
        variable=psi,
        permanent=permanent,
        equation=equation,
        gamma_G_sup=s.gamma_G_sup,
        gamma_G_inf=s.gamma_G_inf,
        gamma_Q=s.gamma_Q,
        xi=annex.xi,
        favourable_permanent=[q for q, p in psi.items() if variable[q] == "wind" or p is wind],
    )
    return _recite(annex, cset, f"{annex.title}: Eq. {equation} STR/GEO (Set B, {s.table})")


def annex_serviceability(
    annex: NationalAnnex,
    *,
    variable: Mapping[str, str | Psi],
    permanent: Sequence[str] = ("G",),
    which: Sequence[str] = ("characteristic", "frequent", "quasi-permanent"),
) -> CombinationSet:
    """Serviceability combinations, EN 1990 §6.5.3 Eq. (6.14b)-(6.16b), with the annex's ψ."""
    psi = _resolve(annex, variable)
    cset = en1990_serviceability(variable=psi, permanent=permanent, which=which)
    return _recite(annex, cset, f"{annex.title}: §6.5.3 serviceability ({annex.psi_table})")


def annex_equ_combinations(
    annex: NationalAnnex,
    *,
    variable: Mapping[str, str | Psi],
    destabilising: Sequence[str],
    stabilising: Sequence[str],
) -> CombinationSet:
    """EQU (Set A) combinations, EN 1990 §6.4.3.1 and Table A1.2(A): static equilibrium.

    E_d,dst = Σ γ_G,sup G_k,dst + Σ γ_G,inf G_k,stb + γ_Q Q_k,1 + Σ γ_Q ψ0,i Q_k,i, each
    variable action leading in turn; variable actions that stabilise are left out (γ_Q = 0),
    so list in ``variable`` only those that destabilise.

    Args:
        annex: from :func:`en1990_annex`. variable: destabilising variable case -> ψ category.
        destabilising, stabilising: permanent cases on each side (a case in both is refused).
    """
    psi = _resolve(annex, variable)
    both = set(destabilising) & set(stabilising)
    if both or not (destabilising or stabilising):
        raise InputError(
            f"EQU needs the permanent cases split into destabilising and stabilising, each case "
            f"on one side (got destabilising = {list(destabilising)}, stabilising = "
            f"{list(stabilising)})",
            name="stabilising",
            value=list(stabilising),
            expected="cases not also destabilising",
        )
    s = annex.sets["EQU"]
    clause = f"{annex.title} §6.4.3.1, {s.table} (EQU, Set A)"
    base = {
        **dict.fromkeys(destabilising, s.gamma_G_sup),
        **dict.fromkeys(stabilising, s.gamma_G_inf),
    }
    combos = [LoadCombination("EQU (G)", dict(base), clause)]
    for lead in psi:
        fac = dict(base)
        fac[lead] = s.gamma_Q
        for q, p in psi.items():
            if q != lead and p.psi0 > 0:
                fac[q] = s.gamma_Q * p.psi0
        combos.append(
            LoadCombination(f"EQU ({lead} leading)", fac, clause, (lead,), note="ψ0 on others")
        )
    symbols = {
        **dict.fromkeys(destabilising, "permanent action, destabilising"),
        **dict.fromkeys(stabilising, "permanent action, stabilising"),
        **{q: f"variable action, {p.description}" for q, p in psi.items()},
    }
    return CombinationSet(
        f"{annex.title}: EQU (Set A, {s.table})",
        "stability",
        tuple(combos),
        standard=annex.title,
        symbols=symbols,
    )
