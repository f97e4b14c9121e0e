"""EN 1990:2002+A1:2005 combinations for buildings: ultimate limit states STR/GEO (Set B, Table
A1.2(B)) by Eq. 6.10 or by the less favourable of Eq. 6.10a and 6.10b, and the serviceability
combinations Eq. 6.14b (characteristic), 6.15b (frequent) and 6.16b (quasi-permanent), with the
ψ factors of Annex A1 Table A1.1 and the recommended partial factors (γ_G,sup = 1.35,
γ_G,inf = 1.00, γ_Q = 1.5, ξ = 0.85).

Every variable action is taken as leading in turn. The National Annex may set other values:
they are arguments here. Provisions should be confirmed against the edition and National Annex
adopted locally.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass

from calcpack.combinations.model import CombinationSet, LoadCombination
from calcpack.errors import InputError
from calcpack.validate import one_of

__all__ = [
    "EN1990_EDITION",
    "PSI_BUILDINGS",
    "Psi",
    "en1990_combinations",
    "en1990_serviceability",
]

EN1990_EDITION = "EN 1990:2002+A1:2005"


@dataclass(frozen=True)
class Psi:
    """Combination (ψ0), frequent (ψ1) and quasi-permanent (ψ2) factors of one action."""

    psi0: float
    psi1: float
    psi2: float
    description: str


PSI_BUILDINGS: dict[str, Psi] = {
    # EN 1990 Annex A1, Table A1.1 (recommended values of ψ factors for buildings)
    "A": Psi(0.7, 0.5, 0.3, "Category A: domestic, residential areas"),
    "B": Psi(0.7, 0.5, 0.3, "Category B: office areas"),
    "C": Psi(0.7, 0.7, 0.6, "Category C: congregation areas"),
    "D": Psi(0.7, 0.7, 0.6, "Category D: shopping areas"),
    "E": Psi(1.0, 0.9, 0.8, "Category E: storage areas"),
    "F": Psi(0.7, 0.7, 0.6, "Category F: traffic area, vehicle weight ≤ 30 kN"),
    "G": Psi(0.7, 0.5, 0.3, "Category G: traffic area, 30 kN < vehicle weight ≤ 160 kN"),
    "H": Psi(0.0, 0.0, 0.0, "Category H: roofs"),
    "snow_nordic": Psi(0.70, 0.50, 0.20, "Snow: Finland, Iceland, Norway, Sweden"),
    "snow_above_1000m": Psi(0.70, 0.50, 0.20, "Snow: other CEN states, altitude H > 1000 m"),
    "snow_up_to_1000m": Psi(0.50, 0.20, 0.0, "Snow: other CEN states, altitude H ≤ 1000 m"),
    "wind": Psi(0.6, 0.2, 0.0, "Wind loads on buildings"),
    "temperature": Psi(0.6, 0.5, 0.0, "Temperature (non-fire) in buildings"),
}


def _psi(variable: Mapping[str, str | Psi]) -> dict[str, Psi]:
    out: dict[str, Psi] = {}
    if not variable:
        raise InputError(
            "EN 1990 combinations need the variable actions with their category (got "
            "variable = {}); e.g. variable={'Q': 'B', 'S': 'snow_up_to_1000m', 'W': 'wind'}",
            name="variable",
            value={},
            expected="case -> Table A1.1 category",
        )
    for case, cat in variable.items():
        if isinstance(cat, Psi):
            out[case] = cat
        elif cat in PSI_BUILDINGS:
            out[case] = PSI_BUILDINGS[cat]
        else:
            raise InputError(
                f"Variable action {case!r}: unknown Table A1.1 category {cat!r} (known: "
                f"{list(PSI_BUILDINGS)}, or give a Psi(...) with its source)",
                name=f"variable[{case!r}]",
                value=cat,
                expected=" / ".join(PSI_BUILDINGS),
            )
    return out


def _symbols(permanent: Sequence[str], psi: Mapping[str, Psi]) -> dict[str, str]:
    syms = dict.fromkeys(permanent, "permanent action")
    syms.update({q: f"variable action, {p.description}" for q, p in psi.items()})
    return syms


def en1990_combinations(
    *,
    variable: Mapping[str, str | Psi],
    permanent: Sequence[str] = ("G",),
    equation: str = "6.10",
    gamma_G_sup: float = 1.35,
    gamma_G_inf: float = 1.00,
    gamma_Q: float = 1.5,
    xi: float = 0.85,
    favourable_permanent: Sequence[str] | None = None,
) -> CombinationSet:
    """EN 1990 §6.4.3.2 STR/GEO combinations for persistent and transient situations (Set B).

    Args:
        variable: variable action case -> Table A1.1 category key (see :data:`PSI_BUILDINGS`) or
            a :class:`Psi` of the engineer's own (e.g. from the National Annex).
        permanent: the permanent action cases (one source: one factor for all, A1.3.1(4)).
        equation: ``"6.10"`` or ``"6.10a/b"`` (both equations, the less favourable governs).
        gamma_G_sup, gamma_G_inf, gamma_Q, xi: partial factors, Table A1.2(B) recommended.
        favourable_permanent: leading actions for which a combination with the permanent action
            favourable (γ_G,inf, other variable actions omitted) is added; default the actions
            of category ``"wind"`` (uplift).
    """
    one_of("equation", equation, ("6.10", "6.10a/b"))
    psi = _psi(variable)
    if favourable_permanent is None:
        favourable_permanent = [q for q, p in psi.items() if p is PSI_BUILDINGS["wind"]]
    for q in favourable_permanent:
        if q not in psi:
            raise InputError(
                f"favourable_permanent names {q!r}, which is not a variable action ({list(psi)})",
                name="favourable_permanent",
                value=q,
                expected=f"one of {list(psi)}",
            )
    ed = EN1990_EDITION
    combos: list[LoadCombination] = []

    def gfac(f: float) -> dict[str, float]:
        return dict.fromkeys(permanent, f)

    def leading(lead: str, gamma_G: float) -> dict[str, float]:
        """γ_G on the permanent actions, γ_Q on the leading action, γ_Q ψ0 on the others."""
        fac = gfac(gamma_G)
        fac[lead] = gamma_Q
        for q, p in psi.items():
            if q != lead and p.psi0 > 0:
                fac[q] = gamma_Q * p.psi0
        return fac

    if equation == "6.10":
        combos.append(LoadCombination("6.10 (G)", gfac(gamma_G_sup), f"{ed} Eq. (6.10)"))
        for lead in psi:
            combos.append(
                LoadCombination(
                    f"6.10 ({lead} leading)",
                    leading(lead, gamma_G_sup),
                    f"{ed} Eq. (6.10), Table A1.2(B)",
                    (lead,),
                    note="ψ0 from Table A1.1",
                )
            )
    else:
        fac = gfac(gamma_G_sup)
        for q, p in psi.items():
            if p.psi0 > 0:
                fac[q] = gamma_Q * p.psi0
        combos.append(
            LoadCombination("6.10a", fac, f"{ed} Eq. (6.10a), Table A1.2(B)", note="ψ0 on all")
        )
        for lead in psi:
            combos.append(
                LoadCombination(
                    f"6.10b ({lead} leading)",
                    leading(lead, xi * gamma_G_sup),
                    f"{ed} Eq. (6.10b), Table A1.2(B)",
                    (lead,),
                    note=f"ξ = {xi:g}",
                )
            )
    for lead in favourable_permanent:
        fac = gfac(gamma_G_inf)
        fac[lead] = gamma_Q
        combos.append(
            LoadCombination(
                f"{equation.split('/')[0] if equation == '6.10' else '6.10b'} "
                f"({lead} leading, G favourable)",
                fac,
                f"{ed} Table A1.2(B), γ_G,inf",
                (lead,),
            )
        )
    return CombinationSet(
        f"{ed} Eq. {equation} STR/GEO (Set B)",
        "strength",
        tuple(combos),
        standard=ed,
        symbols=_symbols(permanent, psi),
    )


def en1990_serviceability(
    *,
    variable: Mapping[str, str | Psi],
    permanent: Sequence[str] = ("G",),
    which: Sequence[str] = ("characteristic", "frequent", "quasi-permanent"),
) -> CombinationSet:
    """EN 1990 §6.5.3 serviceability combinations: characteristic Eq. (6.14b), frequent
    Eq. (6.15b), quasi-permanent Eq. (6.16b), ψ factors from Table A1.1."""
    psi = _psi(variable)
    ed = EN1990_EDITION
    known = ("characteristic", "frequent", "quasi-permanent")
    for w in which:
        one_of("which", w, known)
    combos: list[LoadCombination] = []
    g = dict.fromkeys(permanent, 1.0)
    if "characteristic" in which:
        for lead in psi:
            fac = dict(g)
            fac[lead] = 1.0
            fac.update({q: p.psi0 for q, p in psi.items() if q != lead and p.psi0 > 0})
            combos.append(
                LoadCombination(f"6.14b ({lead} leading)", fac, f"{ed} Eq. (6.14b)", (lead,))
            )
    if "frequent" in which:
        for lead, pl in psi.items():
            if pl.psi1 == 0:
                continue
            fac = dict(g)
            fac[lead] = pl.psi1
            fac.update({q: p.psi2 for q, p in psi.items() if q != lead and p.psi2 > 0})
            combos.append(
                LoadCombination(f"6.15b ({lead} leading)", fac, f"{ed} Eq. (6.15b)", (lead,))
            )
    if "quasi-permanent" in which:
        fac = dict(g)
        fac.update({q: p.psi2 for q, p in psi.items() if p.psi2 > 0})
        combos.append(LoadCombination("6.16b", fac, f"{ed} Eq. (6.16b)"))
    if not combos:
        raise InputError(
            "No serviceability combination was asked for (got which = ())",
            name="which",
            value=tuple(which),
            expected="characteristic, frequent and/or quasi-permanent",
        )
    return CombinationSet(
        f"{ed} §6.5.3 serviceability",
        "serviceability",
        tuple(combos),
        standard=ed,
        symbols=_symbols(permanent, psi),
    )
